"""One page for one cycle: the p–h chart and the state table (``coldroom cycle --out``).

The page is a single reportlab ``Drawing``, so the same page renders to PDF
(:mod:`reportlab.graphics.renderPDF` on an ``invariant`` canvas with a fixed
date) and to SVG (:mod:`reportlab.graphics.renderSVG`); both are identical
bytes for identical inputs. Header and footer follow the sizing sheet's: title
left and "Cycle chart · date" right above an accent rule; versions, the input
(the command's arguments and their hash) and "Page 1 of 1" below a light rule.
A4 for SI, US Letter for IP.
"""

from __future__ import annotations

import hashlib
import io
from typing import Any, Sequence

from reportlab.graphics.shapes import Drawing, Group, Line, Rect, String
from reportlab.lib.pagesizes import A4, LETTER
from reportlab.lib.units import mm

from coldroom.output.pdf.charts import INK, MUTED, RULE
from coldroom.output.pdf.page_frame import is_date
from coldroom.output.pdf.ph_states import state_rows
from coldroom.output.pdf.phchart import ph_chart
from coldroom.output.pdf.text import capacity, clean, temperature

ACCENT = "#4F6D8A"  # the sheet's accent (header rule, table header rule)
BAND = "#EEF2F5"


def _colour(hex_text: str) -> Any:
    from reportlab.lib import colors

    return colors.HexColor(hex_text)


def _table(rows: Sequence[Sequence[str]], x: float, y_top: float, widths: Sequence[float]) -> tuple[Group, float]:
    """The state table as shapes; returns the group and its height [pt]."""
    group = Group()
    row_h = 12.0
    total = sum(widths)
    for r, row in enumerate(rows):
        y = y_top - (r + 1) * row_h
        if r == 0:
            group.add(Rect(x, y, total, row_h, fillColor=_colour(BAND), strokeColor=None))
        cx = x
        for c, (cell, w) in enumerate(zip(row, widths)):
            font = "Helvetica-Bold" if r == 0 else "Helvetica"
            text = clean(cell)
            if c == 0:
                group.add(String(cx + 4, y + 3.6, text, fontName=font, fontSize=7.8, fillColor=INK))
            else:
                group.add(String(cx + w - 4, y + 3.6, text, fontName=font, fontSize=7.8, fillColor=INK, textAnchor="end"))
            cx += w
        colour = _colour(ACCENT) if r == 0 else RULE
        group.add(Line(x, y, x + total, y, strokeColor=colour, strokeWidth=0.8 if r == 0 else 0.35))
    return group, row_h * len(rows)


def cycle_page(cycle: Any, system: str, date: str, arguments: Sequence[str], versions: dict[str, str]) -> Drawing:
    """The page as a Drawing.

    Parameters
    ----------
    cycle : CycleResult
    system : {"SI", "IP"}
    date : str
        ISO date printed in the header.
    arguments : sequence of str
        The command's arguments (shown in the footer by their hash).
    versions : dict
        ``{"coldroom": ..., "CoolProp": ...}``.
    """
    page_w, page_h = LETTER if system == "IP" else A4
    margin = 16 * mm
    d = Drawing(page_w, page_h)
    accent = _colour(ACCENT)
    # header (as the sheet's)
    title = clean(f"Refrigerant cycle, {cycle.refrigerant}")
    d.add(Line(margin, page_h - margin + 12, page_w - margin, page_h - margin + 12, strokeColor=accent, strokeWidth=1.2))
    d.add(String(margin, page_h - margin + 16, title, fontName="Helvetica-Bold", fontSize=7.5, fillColor=INK))
    d.add(String(page_w - margin, page_h - margin + 16, clean(f"Cycle chart  ·  {date}"), fontName="Helvetica",
                 fontSize=7.5, fillColor=INK, textAnchor="end"))
    # footer
    digest = hashlib.sha256("\0".join(arguments).encode("utf-8")).hexdigest()[:12]
    footer = clean(
        f"coldroom {versions.get('coldroom', '?')}  ·  CoolProp {versions.get('coolprop', '?')}  ·  "
        f"input: command line, sha256 {digest}"
    )
    d.add(Line(margin, margin - 14, page_w - margin, margin - 14, strokeColor=RULE, strokeWidth=0.5))
    d.add(String(margin, margin - 24, footer, fontName="Helvetica", fontSize=6.8, fillColor=MUTED))
    d.add(String(page_w - margin, margin - 24, "Page 1 of 1", fontName="Helvetica", fontSize=6.8, fillColor=MUTED,
                 textAnchor="end"))
    width = page_w - 2 * margin
    y = page_h - margin - 6
    # heading and the cycle's basis
    d.add(String(margin, y - 16, title, fontName="Helvetica-Bold", fontSize=15, fillColor=INK))
    y -= 30
    if cycle.transcritical:
        high = f"gas cooler outlet {temperature(cycle.gas_cooler_outlet_temperature, system)} (transcritical)"
    else:
        high = f"SCT {temperature(cycle.condensing_temperature, system)} (dew)"
    basis = [
        f"SST {temperature(cycle.evaporating_temperature, system)} (dew), {high}; capacity {capacity(cycle.capacity, system)}; "
        f"COP {cycle.cop:.2f}; pressure ratio {cycle.pressure_ratio:.2f}.",
        f"Superheat {_k(cycle.superheat, system)} in the evaporator"
        + (f", {_k(cycle.suction_line_superheat, system)} more in the suction line" if cycle.suction_line_superheat else "")
        + (f"; subcooling {_k(cycle.subcooling, system)}" if not cycle.transcritical else "")
        + f"; isentropic efficiency {cycle.isentropic_efficiency:.2f}.",
        f"Pressures absolute. Properties: {cycle.property_model}; enthalpy and entropy in its default reference state.",
    ]
    for line in basis:
        d.add(String(margin, y, clean(line), fontName="Helvetica", fontSize=7.8, fillColor=INK))
        y -= 11
    y -= 4
    rows = state_rows(cycle, system)
    group, table_h = _table(rows, margin, y, [0.25 * width, 0.15 * width, 0.14 * width, 0.16 * width, 0.18 * width, 0.12 * width])
    d.add(group)
    y -= table_h + 14
    notes = _cautions(cycle)
    chart_h = min(y - margin - 6 - 8.5 * len(notes), width * 1.2)
    chart = ph_chart(cycle, system, width, chart_h, title=f"Pressure–enthalpy chart, {cycle.refrigerant}")
    chart_group = Group(*chart.contents)
    chart_group.translate(margin, y - chart_h)
    d.add(chart_group)
    # the cautions that go with every printed cycle
    ny = margin + 2
    for text in reversed(notes):
        d.add(String(margin, ny, clean(text), fontName="Helvetica", fontSize=6.6, fillColor=MUTED))
        ny += 8.5
    return d


def _k(value: float, system: str) -> str:
    from coldroom import units as _units

    return clean(_units.display(value, "temperature_difference", system, 1))


def _cautions(cycle: Any) -> list[str]:
    out = []
    if cycle.refrigerant == "R-744":
        out.append("R-744 works at high pressures: components, relief and standstill pressure per EN 378 / ISO 5149.")
    if cycle.safety_class[1:] in ("2L", "2", "3") or cycle.safety_class.startswith("B"):
        out.append(f"{cycle.refrigerant} is safety class {cycle.safety_class}: charge limits and room rules of EN 378, "
                   "ISO 5149, ASHRAE 15 and IEC 60335-2-89 apply.")
    out.append("A drawing of the calculated cycle; design and installation follow EN 378, ISO 5149, ASHRAE 15, "
               "local codes and licensed practice.")
    return out


def render_cycle_page(cycle: Any, system: str, fmt: str, date: str, arguments: Sequence[str],
                      versions: dict[str, str]) -> bytes:
    """The page as PDF or SVG bytes (identical for identical inputs).

    Parameters
    ----------
    fmt : {"pdf", "svg"}
        Output format.
    """
    drawing = cycle_page(cycle, system, date, arguments, versions)
    if fmt == "svg":
        from reportlab.graphics import renderSVG

        text = renderSVG.drawToString(drawing)
        # the renderer names the PDF base fonts as families; say what a browser can match
        text = text.replace("font-family: Helvetica-Bold;", "font-family: Helvetica, Arial, sans-serif; font-weight: bold;")
        text = text.replace("font-family: Helvetica;", "font-family: Helvetica, Arial, sans-serif;")
        return text.encode("utf-8")
    from reportlab.graphics import renderPDF
    from reportlab.pdfgen.canvas import Canvas

    y, m, dd = (int(x) for x in date.split("-")[:3]) if is_date(date) else (2000, 1, 1)
    buffer = io.BytesIO()
    canvas = Canvas(buffer, pagesize=(drawing.width, drawing.height), invariant=1)
    canvas.setDateFormatter(lambda *_: f"D:{y:04d}{m:02d}{dd:02d}000000+00'00'")
    canvas.setTitle(clean(f"Refrigerant cycle, {cycle.refrigerant}"))
    canvas.setCreator(clean(f"coldroom {versions.get('coldroom', '')}"))
    canvas.setProducer("coldroom (reportlab)")
    renderPDF.draw(drawing, canvas, 0, 0)
    canvas.showPage()
    canvas.save()
    return buffer.getvalue()
