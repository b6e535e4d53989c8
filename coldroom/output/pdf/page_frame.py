"""The page frame of the sizing sheet and the comparison: header, footer with versions and input hash, "page x of y".

The canvas runs with ``invariant=1`` and a fixed creation date (the document's
date at 00:00 UTC), so the same input gives the same bytes.
"""

from __future__ import annotations

from typing import Any

from reportlab.pdfgen.canvas import Canvas

from coldroom.output.pdf.charts import INK, MUTED, RULE
from coldroom.output.pdf.layout import ACCENT
from coldroom.output.pdf.text import clean


def _footer_text(result: Any) -> str:
    v = result.versions or {}
    return clean(
        f"coldroom {v.get('coldroom', '?')}  ·  CoolProp {v.get('coolprop', '?')}  ·  "
        f"input {result.input_file}, sha256 {result.input_sha256[:12]}"
    )


def canvas_maker(result: Any, page_width: float, margin: float, kind: str = "Sizing sheet") -> type:
    footer = _footer_text(result)
    header_left = clean(f"{result.project_name}")
    header_right = clean(f"{kind}  ·  {result.date}")
    y, m, d = (int(x) for x in (result.date + "-01-01").split("-")[:3]) if is_date(result.date) else (2000, 1, 1)

    class NumberedCanvas(Canvas):
        """Defers each page until the end to print "page x of y" (and the header and footer)."""

        def __init__(self, *args: Any, **kwargs: Any) -> None:
            kwargs["invariant"] = 1
            super().__init__(*args, **kwargs)
            self.setDateFormatter(lambda *_: f"D:{y:04d}{m:02d}{d:02d}000000+00'00'")
            self._pages: list[dict] = []

        def showPage(self) -> None:  # noqa: N802 - reportlab API
            self._pages.append(dict(self.__dict__))
            self._startPage()

        def save(self) -> None:
            total = len(self._pages)
            for number, state in enumerate(self._pages, start=1):
                self.__dict__.update(state)
                self._frame(number, total)
                Canvas.showPage(self)
            Canvas.save(self)

        def _frame(self, number: int, total: int) -> None:
            w, h = self._pagesize
            self.saveState()
            self.setStrokeColor(ACCENT)
            self.setLineWidth(1.2)
            self.line(margin, h - margin + 12, w - margin, h - margin + 12)
            self.setFont("Helvetica-Bold", 7.5)
            self.setFillColor(INK)
            self.drawString(margin, h - margin + 16, header_left[:90])
            self.setFont("Helvetica", 7.5)
            self.drawRightString(w - margin, h - margin + 16, header_right)
            self.setStrokeColor(RULE)
            self.setLineWidth(0.5)
            self.line(margin, margin - 14, w - margin, margin - 14)
            self.setFont("Helvetica", 6.8)
            self.setFillColor(MUTED)
            self.drawString(margin, margin - 24, footer)
            self.drawRightString(w - margin, margin - 24, f"Page {number} of {total}")
            self.restoreState()

    return NumberedCanvas


def is_date(text: str) -> bool:
    import datetime as _dt

    try:
        _dt.date.fromisoformat(text)
        return True
    except (TypeError, ValueError):
        return False
