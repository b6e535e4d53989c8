"""The sheet's look: colours, paragraph styles and building blocks (headings, grids, boxes).

Every section of the sheet (:mod:`coldroom.output.pdf.sheet`,
:mod:`coldroom.output.pdf.existing_unit_section`, and any new one) builds its flowables
from these, so all sections look alike and no section module imports another.
A block that needs the page takes ``ctx`` (a
:class:`coldroom.output.pdf.context.SheetContext`: ``ctx.width`` [pt], ``ctx.system``).
"""

from __future__ import annotations

from typing import Any, Sequence

from reportlab.lib import colors
from reportlab.lib.enums import TA_LEFT
from reportlab.lib.styles import ParagraphStyle
from reportlab.pdfbase.pdfmetrics import stringWidth
from reportlab.platypus import BaseDocTemplate, Frame, PageTemplate, Table, TableStyle
from reportlab.platypus import Paragraph as _Paragraph

from coldroom.output.pdf.charts import INK, MUTED, RULE
from coldroom.output.pdf.text import clean, esc
from coldroom.units import format_terms

ACCENT = colors.HexColor("#4F6D8A")
BAND = colors.HexColor("#EEF2F5")
SOFT = colors.HexColor("#F7F8FA")
WARN = colors.HexColor("#9A5B2E")
WARN_BG = colors.HexColor("#FBF4EC")


class Paragraph(_Paragraph):
    """reportlab's Paragraph that keeps its line breaking for the width it was last set to.

    Layout asks a paragraph for its size several times at one width (a table sizing
    its rows, then drawing them; a KeepTogether measuring its group, then the frame
    placing each piece); breaking the lines again gives the same lines, so the last
    result is returned instead. The height never depends on the height offered, and a
    split that discards the lines (``del self.blPara``) forces a fresh break. The PDF is
    byte-identical to the plain Paragraph's (tested).
    """

    def wrap(self, availWidth: float, availHeight: float) -> tuple[float, float]:
        last = self.__dict__.get("_last_wrap")
        if last is not None and last[0] == availWidth and "blPara" in self.__dict__:
            return last[1]
        size = super().wrap(availWidth, availHeight)
        self._last_wrap = (availWidth, size)
        return size


# --- styles ---------------------------------------------------------------------------------

BODY = ParagraphStyle("body", fontName="Helvetica", fontSize=8.5, leading=11, textColor=INK, alignment=TA_LEFT)
SMALL = ParagraphStyle("small", parent=BODY, fontSize=7.5, leading=9.5)
TINY = ParagraphStyle("tiny", parent=BODY, fontSize=6.8, leading=8.4, textColor=MUTED)
CELL = ParagraphStyle("cell", parent=BODY, fontSize=8, leading=10)
CELL_SMALL = ParagraphStyle("cellsmall", parent=BODY, fontSize=7.2, leading=9)
H1 = ParagraphStyle("h1", parent=BODY, fontName="Helvetica-Bold", fontSize=16, leading=20, textColor=INK)
H2 = ParagraphStyle("h2", parent=BODY, fontName="Helvetica-Bold", fontSize=12.5, leading=16, textColor=ACCENT,
                    spaceBefore=2, spaceAfter=4, keepWithNext=1)
H3 = ParagraphStyle("h3", parent=BODY, fontName="Helvetica-Bold", fontSize=9.5, leading=12, textColor=INK,
                    spaceBefore=8, spaceAfter=3, keepWithNext=1)
FIGURE = ParagraphStyle("figure", parent=BODY, fontName="Helvetica-Bold", fontSize=12, leading=14, textColor=INK)
LABEL = ParagraphStyle("label", parent=BODY, fontSize=7, leading=8.5, textColor=MUTED)


# --- building blocks -----------------------------------------------------------------------


def heading(text: str, style: ParagraphStyle = H3) -> Paragraph:
    """A section heading."""
    return Paragraph(esc(text), style)


def note(text: str, style: ParagraphStyle = SMALL) -> Paragraph:
    """A paragraph of plain text (escaped)."""
    return Paragraph(esc(text), style)


def grid(
    rows: Sequence[Sequence[Any]],
    widths: Sequence[float],
    header: bool = True,
    align_right: Sequence[int] = (),
    total_rows: Sequence[int] = (),
    style: ParagraphStyle = CELL,
) -> Table:
    """A table in the sheet's style: header band, light rules, right-aligned number columns.

    A string that fits its cell on one line is left a plain string (drawn
    exactly where its Paragraph would be, at a fraction of the cost); a longer
    one becomes a Paragraph so it breaks inside its cell.
    """
    right = ParagraphStyle("r", parent=style, alignment=2)
    bold = ParagraphStyle("b", parent=style, fontName="Helvetica-Bold")
    bold_right = ParagraphStyle("br", parent=right, fontName="Helvetica-Bold")
    data = []
    for r, row in enumerate(rows):
        cells = []
        strong = (header and r == 0) or r in total_rows
        for col, cell in enumerate(row):
            if isinstance(cell, str):
                if col in align_right:
                    st = bold_right if strong else right
                else:
                    st = bold if strong else style
                cells.append(cell_text(cell, st, widths[col]))
            else:
                cells.append(cell)
        data.append(cells)
    table = Table(data, colWidths=list(widths), repeatRows=1 if header else 0, hAlign="LEFT")
    commands = [
        ("VALIGN", (0, 0), (-1, -1), "TOP"),
        ("LEFTPADDING", (0, 0), (-1, -1), 4),
        ("RIGHTPADDING", (0, 0), (-1, -1), 4),
        ("TOPPADDING", (0, 0), (-1, -1), 2.2),
        ("BOTTOMPADDING", (0, 0), (-1, -1), 2.2),
        ("LINEBELOW", (0, 0), (-1, -1), 0.35, RULE),
    ]
    # the cells left as plain strings are drawn in the paragraph styles' fonts
    # (same baseline: a Paragraph's first line sits fontSize below the cell top too)
    commands += [
        ("FONT", (0, 0), (-1, -1), style.fontName, style.fontSize, style.leading),
        ("TEXTCOLOR", (0, 0), (-1, -1), style.textColor),
    ]
    commands += [("ALIGN", (col, 0), (col, -1), "RIGHT") for col in align_right]
    for r in ([0] if header else []) + list(total_rows):
        commands.append(("FONT", (0, r), (-1, r), bold.fontName, bold.fontSize, bold.leading))
    if header:
        commands += [("BACKGROUND", (0, 0), (-1, 0), BAND), ("LINEBELOW", (0, 0), (-1, 0), 0.8, ACCENT)]
    for r in total_rows:
        commands += [("BACKGROUND", (0, r), (-1, r), SOFT), ("LINEABOVE", (0, r), (-1, r), 0.8, MUTED)]
    table.setStyle(TableStyle(commands))
    return table


def cell_text(text: str, style: ParagraphStyle, width: float, padding: float = 8.0) -> Any:
    """A table cell of *text* in *style*: the cleaned plain string if it sets on
    one line in a column *width* wide (*padding* = left + right cell padding),
    else a Paragraph that breaks inside the cell.

    A plain string is drawn where its Paragraph would be (a Paragraph's first
    baseline sits fontSize below the cell's top, as a string's does) at a
    fraction of the cost, provided the table gives string cells the style's
    font, size, leading and colour (``FONT`` and ``TEXTCOLOR`` commands). Text a
    Paragraph would set differently (runs of spaces, line breaks) stays one.
    """
    plain = clean(text)
    if (
        plain
        and " ".join(plain.split()) == plain
        and stringWidth(plain, style.fontName, style.fontSize) <= width - padding - 0.01
    ):
        return plain
    return Paragraph(esc(text), style)


def figure_boxes(ctx: Any, items: Sequence[tuple[str, str, str]]) -> Table:
    """A band of key figures: (label, figure, subtext) per box."""
    cells = [
        [Paragraph(esc(label), LABEL), Paragraph(esc(figure), FIGURE), Paragraph(esc(sub), TINY)]
        for label, figure, sub in items
    ]
    n = len(items)
    table = Table([cells], colWidths=[ctx.width / n] * n, hAlign="LEFT")
    table.setStyle(
        TableStyle(
            [
                ("BACKGROUND", (0, 0), (-1, -1), BAND),
                ("LINEBEFORE", (1, 0), (-1, -1), 2.5, colors.white),
                ("VALIGN", (0, 0), (-1, -1), "TOP"),
                ("LEFTPADDING", (0, 0), (-1, -1), 7),
                ("TOPPADDING", (0, 0), (-1, -1), 5),
                ("BOTTOMPADDING", (0, 0), (-1, -1), 6),
            ]
        )
    )
    return table



def warning_box(ctx: Any, messages: Sequence[str]) -> list:
    """The warnings in a tinted box, one row each, shown in the sheet's unit system (``ctx.system``)."""
    style = ParagraphStyle("warn", parent=SMALL, textColor=WARN)
    data = [
        [
            Paragraph("!", ParagraphStyle("bang", parent=style, fontName="Helvetica-Bold")),
            Paragraph(esc(format_terms(m, ctx.system)), style),
        ]
        for m in messages
    ]
    table = Table(data, colWidths=[16, ctx.width - 16], hAlign="LEFT")
    table.setStyle(
        TableStyle(
            [
                ("BACKGROUND", (0, 0), (-1, -1), WARN_BG),
                ("LEFTPADDING", (0, 0), (0, -1), 6),
                ("RIGHTPADDING", (0, 0), (0, -1), 0),
                ("VALIGN", (0, 0), (-1, -1), "TOP"),
                ("TOPPADDING", (0, 0), (-1, -1), 2.5),
                ("BOTTOMPADDING", (0, 0), (-1, -1), 2.5),
            ]
        )
    )
    return [table]


def document(buffer: Any, pagesize: tuple[float, float], margin: float, *, title: str, author: str,
             subject: str, creator: str) -> BaseDocTemplate:
    """A one-frame document with the margins, metadata and ``invariant=1`` every coldroom PDF uses.

    ``invariant=1`` with a fixed date makes the PDF byte-identical run to run.
    """
    doc = BaseDocTemplate(
        buffer,
        pagesize=pagesize,
        leftMargin=margin,
        rightMargin=margin,
        topMargin=margin + 6,
        bottomMargin=margin + 2,
        title=clean(title),
        author=clean(author),
        subject=clean(subject),
        creator=clean(creator),
        producer="coldroom (reportlab)",
        invariant=1,
    )
    frame = Frame(doc.leftMargin, doc.bottomMargin, doc.width, doc.height, id="body", leftPadding=0,
                  rightPadding=0, topPadding=0, bottomPadding=0)
    doc.addPageTemplates([PageTemplate(id="page", frames=[frame])])
    return doc
