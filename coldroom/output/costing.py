"""The contractor's costing workbook (``coldroom quote --costing FILE.xlsx``).

One sheet, ``Costing``: the bill of quantities with its unit prices and each
line total as a formula (``=IF(F="","",D*F)``: a line without a price stays
empty and is highlighted, never counted as zero), then the subtotal, margin,
tax and total as formulas over those cells, the margin and tax rates in their
own cells so the contractor can change them. A second sheet, ``Electrical``,
lists the schedule. openpyxl is imported inside :func:`costing_workbook` only.
"""

from __future__ import annotations

import io
from typing import TYPE_CHECKING

if TYPE_CHECKING:  # pragma: no cover
    from coldroom.design.quote import Quote
    from coldroom.inputs.projectfile import ProjectModel

HEADER = ("Section", "Item", "Model", "Quantity", "Unit", "Unit price", "Line total", "Basis")
#: First row of the bill of quantities (rows above: title, project, currency, blank, header).
FIRST_ROW = 6
MISSING_FILL = "FFF2B0"  # pale yellow: a price is needed


def costing_workbook(quote: "Quote", model: "ProjectModel") -> bytes:
    """The workbook's bytes (module notes)."""
    import openpyxl  # only when a workbook is written
    from openpyxl.styles import Font, PatternFill

    book = openpyxl.Workbook()
    sheet = book.active
    sheet.title = "Costing"
    bold = Font(bold=True)
    missing = PatternFill("solid", fgColor=MISSING_FILL)
    sheet["A1"] = "Costing (internal: not for the customer)"
    sheet["A1"].font = Font(bold=True, size=13)
    sheet["A2"] = f"Project: {model.project.name}" + (f" — {model.project.client}" if model.project.client else "")
    sheet["A3"] = f"Currency: {quote.currency}"
    for column, title in enumerate(HEADER, start=1):
        cell = sheet.cell(row=FIRST_ROW - 1, column=column, value=title)
        cell.font = bold
    row = FIRST_ROW
    for line in quote.lines:
        values = (line.section, line.item, line.model, line.quantity, line.unit, line.unit_price)
        for column, value in enumerate(values, start=1):
            sheet.cell(row=row, column=column, value=value)
        sheet.cell(row=row, column=7, value=f'=IF(F{row}="","",D{row}*F{row})')
        sheet.cell(row=row, column=8, value=line.basis)
        sheet.cell(row=row, column=6).number_format = "#,##0.00"
        sheet.cell(row=row, column=7).number_format = "#,##0.00"
        if line.price_needed:
            for column in range(1, 9):
                sheet.cell(row=row, column=column).fill = missing
            sheet.cell(row=row, column=8, value=f"PRICE NEEDED — {line.basis}")
        row += 1
    last = row - 1
    row += 1
    totals = [
        ("Subtotal", None, f"=SUM(G{FIRST_ROW}:G{last})"),
        ("Margin", quote.margin, f"=G{row}*F{row + 1}"),
        ("Tax", quote.tax_rate, f"=(G{row}+G{row + 1})*F{row + 2}"),
        ("Total", None, f"=G{row}+G{row + 1}+G{row + 2}"),
    ]
    for k, (label, rate, formula) in enumerate(totals):
        r = row + k
        sheet.cell(row=r, column=5, value=label).font = bold
        if rate is not None:
            sheet.cell(row=r, column=6, value=rate).number_format = "0.0%"
        sheet.cell(row=r, column=7, value=formula).number_format = "#,##0.00"
        sheet.cell(row=r, column=7).font = bold
    r = row + len(totals) + 1
    sheet.cell(row=r, column=5, value="Lines without a price").font = bold
    sheet.cell(row=r, column=7, value=f'=COUNTBLANK(F{FIRST_ROW}:F{last})')
    if not quote.complete:
        sheet.cell(row=r + 1, column=5, value="INCOMPLETE: the highlighted lines need a price").fill = missing
    for column, width in zip("ABCDEFGH", (12, 44, 22, 10, 6, 12, 14, 90)):
        sheet.column_dimensions[column].width = width
    sheet.freeze_panes = f"A{FIRST_ROW}"
    _electrical_sheet(book.create_sheet("Electrical"), quote, bold)
    buffer = io.BytesIO()
    book.save(buffer)
    return _reproducible(buffer.getvalue(), model)


def _reproducible(workbook: bytes, model: "ProjectModel") -> bytes:
    """The workbook with the sheet's date in place of the clock (document properties and zip entries), so the
    same project gives the same bytes (the download of ``coldroom serve`` equals the command's file)."""
    import re
    import zipfile

    from coldroom.design.sizing import sheet_date

    day = sheet_date(model.project.date)
    stamp = f"{day}T00:00:00Z".encode()
    source = zipfile.ZipFile(io.BytesIO(workbook))
    out = io.BytesIO()
    with zipfile.ZipFile(out, "w", zipfile.ZIP_DEFLATED) as target:
        for info in source.infolist():
            data = source.read(info.filename)
            if info.filename == "docProps/core.xml":
                data = re.sub(rb"(<dcterms:(?:created|modified)[^>]*>)[^<]*(<)", rb"\g<1>" + stamp + rb"\g<2>", data)
            entry = zipfile.ZipInfo(info.filename, date_time=(int(day[:4]), int(day[5:7]), int(day[8:10]), 0, 0, 0))
            entry.compress_type = zipfile.ZIP_DEFLATED
            entry.external_attr = info.external_attr
            target.writestr(entry, data)
    return out.getvalue()


def _electrical_sheet(sheet, quote: "Quote", bold) -> None:  # type: ignore[no-untyped-def]
    header = ("System", "Item", "Model", "Supply", "Running A", "Locked-rotor A", "Estimated", "MCA A", "MOP A",
              "Basis")
    for column, title in enumerate(header, start=1):
        sheet.cell(row=1, column=column, value=title).font = bold
    row = 2
    for schedule in quote.electrical:
        for item in schedule.items:
            values = (schedule.system, item.item, item.model, item.supply, item.running_current,
                      item.locked_rotor_current, "yes" if item.estimated else "no", item.minimum_circuit_ampacity,
                      item.maximum_overcurrent_protection, item.basis)
            for column, value in enumerate(values, start=1):
                sheet.cell(row=row, column=column, value=value)
            row += 1
        sheet.cell(row=row, column=2, value=f"total running current, {schedule.system}").font = bold
        sheet.cell(row=row, column=5, value=schedule.total_running_current)
        sheet.cell(row=row, column=10, value=" ".join(schedule.notes))
        row += 2
    for column, width in zip("ABCDEFGHIJ", (10, 28, 14, 16, 11, 14, 10, 8, 8, 80)):
        sheet.column_dimensions[column].width = width
