"""The load-breakdown chart: one horizontal bar per load component.

Drawn straight onto the page canvas by a flowable (no reportlab.graphics
charts), in the sheet's calm palette. It presents numbers it is given; it
computes only the bar lengths.
"""

from __future__ import annotations

from typing import Sequence

from reportlab.lib import colors
from reportlab.pdfbase.pdfmetrics import stringWidth
from reportlab.platypus import Flowable

from coldroom.output.pdf.text import clean

#: The sheet's palette (ours): slate, teal, sand, dusty rose, grey-blue.
PALETTE = (
    colors.HexColor("#4F6D8A"),
    colors.HexColor("#6A9C89"),
    colors.HexColor("#C8A96A"),
    colors.HexColor("#B57F7F"),
    colors.HexColor("#8C8FA8"),
)
INK = colors.HexColor("#26323D")
MUTED = colors.HexColor("#6B7785")
RULE = colors.HexColor("#C9D1D9")


class BarChart(Flowable):
    """Horizontal bars with a label on the left and a value text on the right.

    Parameters
    ----------
    rows : sequence of (label, value, value_text)
        One bar per row; *value* in any consistent unit (only ratios matter).
    width : float
        Width of the flowable [pt].
    bar_height : float
        Height of each bar [pt].
    title : str
        A caption above the bars.
    """

    def __init__(self, rows: Sequence[tuple[str, float, str]], width: float, bar_height: float = 11.0, title: str = ""):
        super().__init__()
        self.rows = [(clean(a), float(b), clean(c)) for a, b, c in rows]
        self.width = width
        self.bar_height = bar_height
        self.gap = 5.0
        self.title = clean(title)
        self.title_height = 14.0 if title else 0.0
        self.height = self.title_height + len(self.rows) * (bar_height + self.gap) + 4.0

    def wrap(self, available_width: float, available_height: float) -> tuple[float, float]:
        return self.width, self.height

    def draw(self) -> None:
        c = self.canv
        font, size = "Helvetica", 8.0
        label_width = max([stringWidth(r[0], font, size) for r in self.rows] + [40.0]) + 8.0
        value_width = max([stringWidth(r[2], font, size) for r in self.rows] + [40.0]) + 8.0
        bar_space = max(self.width - label_width - value_width, 40.0)
        largest = max([abs(r[1]) for r in self.rows] + [1e-30])
        y = self.height - self.title_height
        if self.title:
            c.setFont("Helvetica-Bold", 8.5)
            c.setFillColor(INK)
            c.drawString(0, self.height - 10.0, self.title)
        # baseline rule where the bars start
        c.setStrokeColor(RULE)
        c.setLineWidth(0.6)
        c.line(label_width, 2.0, label_width, y)
        for i, (label, value, text) in enumerate(self.rows):
            y -= self.bar_height + self.gap
            c.setFillColor(INK)
            c.setFont(font, size)
            c.drawRightString(label_width - 6.0, y + 2.5, label)
            length = bar_space * max(value, 0.0) / largest
            c.setFillColor(PALETTE[i % len(PALETTE)])
            c.setStrokeColor(PALETTE[i % len(PALETTE)])
            if length > 0.5:
                c.roundRect(label_width, y, length, self.bar_height, 1.5, stroke=0, fill=1)
            c.setFillColor(MUTED)
            c.drawString(label_width + length + 4.0, y + 2.5, text)
