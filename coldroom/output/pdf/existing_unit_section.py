"""The sheet's "existing unit" section and its capacity/load-vs-ambient chart.

Presents a :class:`coldroom.equipment.CheckResult` (``RoomResult.check``); it
computes nothing new — the chart plots the arrays the check already holds
(:meth:`CheckResult.chart`), converting units for display only.

Hooked into the sheet through :data:`coldroom.output.pdf.sheet.ROOM_SECTIONS`;
built from the blocks of :mod:`coldroom.output.pdf.layout` like every section.
"""

from __future__ import annotations

from typing import Any, Optional, Sequence

from reportlab.lib import colors
from reportlab.pdfbase.pdfmetrics import stringWidth
from reportlab.platypus import Flowable

from coldroom import units as _units
from coldroom.rules import AMBIENT_SWEEP
from coldroom.output.pdf.charts import INK, MUTED, PALETTE, RULE
from coldroom.output.pdf.layout import TINY, figure_boxes, grid, heading, note, warning_box
from coldroom.output.pdf.text import capacity, clean, temperature
from coldroom.units import format_terms

CAPACITY_COLOUR = PALETTE[0]  # slate: what the unit can do
LOAD_COLOUR = PALETTE[3]  # dusty rose: what the room needs
MARK_COLOUR = colors.HexColor("#8C8FA8")


def _display_temperature(value_c: float, system: str) -> float:
    return value_c * 1.8 + 32.0 if system == "IP" else value_c


def _display_power(watts: float, system: str) -> tuple[float, str]:
    """Capacity on the chart axis: kW (SI) or thousands of Btu/h (IP)."""
    if system == "IP":
        return watts / _units.BTU_PER_HOUR / 1000.0, "1000 Btu/h"
    return watts / 1000.0, "kW"


def _nice_step(span: float, target: int = 5) -> float:
    raw = max(span, 1e-9) / target
    magnitude = 10 ** int(f"{raw:e}".split("e")[1])
    for factor in (1, 2, 2.5, 5, 10):
        if factor * magnitude >= raw:
            return factor * magnitude
    return 10 * magnitude  # pragma: no cover


class CapacityAmbientChart(Flowable):
    """Unit capacity at balance and room load against condenser-air temperature.

    Parameters
    ----------
    ambient : sequence of float
        Condenser-air temperatures [°C].
    unit_capacity : sequence of (float or None)
        Capacity at balance [W]; None where the unit has no balance or is
        outside its envelope (a gap in the line).
    room_load : sequence of float
        Required capacity of the room [W].
    system : str
        ``"SI"`` or ``"IP"`` (axis units).
    width, height : float
        Size [pt].
    design_ambient, max_ambient : float, optional
        Marked with vertical lines [°C].
    """

    def __init__(
        self,
        ambient: Sequence[float],
        unit_capacity: Sequence[Optional[float]],
        room_load: Sequence[float],
        system: str,
        width: float,
        height: float = 150.0,
        design_ambient: Optional[float] = None,
        max_ambient: Optional[float] = None,
    ) -> None:
        super().__init__()
        self.ambient = list(ambient)
        self.unit_capacity = list(unit_capacity)
        self.room_load = list(room_load)
        self.system = system
        self.width = width
        self.height = height
        self.design_ambient = design_ambient
        self.max_ambient = max_ambient

    def wrap(self, available_width: float, available_height: float) -> tuple[float, float]:
        return self.width, self.height

    def draw(self) -> None:  # noqa: C901 - one drawing routine
        c = self.canv
        s = self.system
        xs = [_display_temperature(t, s) for t in self.ambient]
        caps = [None if v is None else _display_power(v, s)[0] for v in self.unit_capacity]
        loads = [_display_power(v, s)[0] for v in self.room_load]
        unit = _display_power(1.0, s)[1]
        t_unit = "°F" if s == "IP" else "°C"
        values = [v for v in caps if v is not None] + loads
        if not xs or not values:
            return
        left, right, bottom, top = 42.0, 110.0, 26.0, 16.0
        plot_w = self.width - left - right
        plot_h = self.height - bottom - top
        x0, x1 = min(xs), max(xs)
        y_step = _nice_step(max(values) - 0.0)
        y1 = y_step * (int(max(values) / y_step) + 1)
        y0 = 0.0

        def px(x: float) -> float:
            return left + (x - x0) / (x1 - x0 or 1.0) * plot_w

        def py(y: float) -> float:
            return bottom + (y - y0) / (y1 - y0 or 1.0) * plot_h

        c.setFont("Helvetica-Bold", 8.5)
        c.setFillColor(INK)
        c.drawString(0, self.height - 10.0, clean("Existing unit: capacity at balance and room load vs condenser air"))
        # grid and axes
        c.setLineWidth(0.4)
        c.setStrokeColor(RULE)
        c.setFont("Helvetica", 7.0)
        c.setFillColor(MUTED)
        y = y0
        while y <= y1 + 1e-9:
            c.line(left, py(y), left + plot_w, py(y))
            c.drawRightString(left - 4.0, py(y) - 2.5, f"{y:g}")
            y += y_step
        x_step = _nice_step(x1 - x0, 6)
        x = x_step * int(x0 / x_step)
        while x <= x1 + 1e-9:
            if x >= x0 - 1e-9:
                c.line(px(x), bottom, px(x), bottom + plot_h)
                c.drawCentredString(px(x), bottom - 10.0, f"{x:g}")
            x += x_step
        c.drawCentredString(left + plot_w / 2, 2.0, clean(f"condenser air temperature [{t_unit}]"))
        c.saveState()
        c.translate(9.0, bottom + plot_h / 2)
        c.rotate(90)
        c.drawCentredString(0, 0, clean(f"capacity [{unit}]"))
        c.restoreState()
        # markers: design ambient, highest ambient that holds
        for value, label in ((self.design_ambient, "design"), (self.max_ambient, "holds up to")):
            if value is None:
                continue
            xv = _display_temperature(value, s)
            if not x0 <= xv <= x1:
                continue
            c.setStrokeColor(MARK_COLOUR)
            c.setDash(1.5, 2)
            c.line(px(xv), bottom, px(xv), bottom + plot_h)
            c.setDash()
            c.setFillColor(MUTED)
            c.drawString(px(xv) + 2.0, bottom + plot_h - 8.0 - (10.0 if label == "design" else 0.0), clean(label))
        # lines
        c.setLineWidth(1.6)
        c.setStrokeColor(LOAD_COLOUR)
        c.setDash(4, 2)
        path = c.beginPath()
        for i, (xv, yv) in enumerate(zip(xs, loads)):
            (path.moveTo if i == 0 else path.lineTo)(px(xv), py(yv))
        c.drawPath(path, stroke=1, fill=0)
        c.setDash()
        c.setStrokeColor(CAPACITY_COLOUR)
        c.setFillColor(CAPACITY_COLOUR)
        started = False
        path = c.beginPath()
        for xv, yv in zip(xs, caps):
            if yv is None:
                started = False
                continue
            if started:
                path.lineTo(px(xv), py(yv))
            else:
                path.moveTo(px(xv), py(yv))
                started = True
            c.circle(px(xv), py(yv), 1.3, stroke=0, fill=1)
        c.drawPath(path, stroke=1, fill=0)
        # legend
        lx = left + plot_w + 10.0
        ly = bottom + plot_h - 6.0
        c.setFont("Helvetica", 7.5)
        for colour, dashed, text in (
            (CAPACITY_COLOUR, False, "unit capacity at balance"),
            (LOAD_COLOUR, True, "room required capacity"),
        ):
            c.setStrokeColor(colour)
            if dashed:
                c.setDash(4, 2)
            c.line(lx, ly + 2.5, lx + 16.0, ly + 2.5)
            c.setDash()
            c.setFillColor(INK)
            c.drawString(lx + 20.0, ly, clean(text))
            ly -= 12.0
        if any(v is None for v in caps):
            c.setFillColor(MUTED)
            text = clean("gaps: no balance or outside the compressor envelope")
            width = stringWidth(text, "Helvetica", 6.5)
            c.setFont("Helvetica", 6.5 if width < right - 12 else 5.5)
            c.drawString(lx, ly, text[:60])


def existing_unit_section(ctx: Any, index: int) -> list:
    """The existing-unit verdict for room *index*; nothing when the room has none."""
    check = ctx.result.rooms[index].check
    if check is None:
        return []
    from reportlab.platypus import KeepTogether, Spacer

    s = ctx.system
    w = ctx.width
    hours = "–" if check.run_hours_needed is None else f"{check.run_hours_needed:.1f} h/day"
    if check.max_ambient_status == "found":
        max_ambient = temperature(check.max_ambient, s)
    elif check.max_ambient_status == "holds_above_range":
        max_ambient = f"above {temperature(AMBIENT_SWEEP[1], s)}"
    elif check.max_ambient_status == "fails_below_range":
        max_ambient = f"none above {temperature(AMBIENT_SWEEP[0], s)}"
    else:
        max_ambient = "–"
    boxes = [
        ("Verdict", check.verdict_word, check.verdict_detail),
        ("Capacity at balance", "–" if check.capacity_at_balance is None else capacity(check.capacity_at_balance, s),
         f"required {capacity(check.required_capacity, s)}"),
        ("Run time needed", hours, f"of {check.run_hours_available:.1f} h/day allowed"),
        ("Holds up to", max_ambient, "condenser air"),
    ]
    rows = [
        ["Existing unit", "Value"],
        ["Unit", f"{check.name} ({check.refrigerant}, {check.model} model)"],
        ["Room air / condenser air", f"{temperature(check.room_temperature, s)} / {temperature(check.ambient_temperature, s)}"],
        ["Balance point SST / SCT (dew)",
         f"{temperature(check.balance_evaporating, s)} / {temperature(check.balance_condensing, s)}"],
        ["Capacity at balance", "–" if check.capacity_at_balance is None else capacity(check.capacity_at_balance, s)],
        ["Required capacity", f"{capacity(check.required_capacity, s)} ((1 + SF) × daily load / run hours)"],
        ["Margin", "–" if check.margin_percent is None else f"{check.margin_percent:+.0f} %"],
    ]
    if check.power_at_balance is not None:
        rows += [
            ["Power / heat of rejection", f"{capacity(check.power_at_balance, s)} / {capacity(check.heat_rejection_at_balance, s)}"],
            ["Discharge temperature (upper estimate)", temperature(check.discharge_temperature, s)],
        ]
    if check.pressure_ratio is not None:
        rows.append(["Pressure ratio", f"{check.pressure_ratio:.1f}"])
    rows += [
        ["Evaporator", format_terms(check.evaporator_basis, s)],
        ["Condenser", format_terms(check.condenser_basis, s)],
    ]
    rows += [["Compressor", format_terms(note, s)] for note in check.compressor_basis]
    out: list = [
        KeepTogether(
            [
                heading(f"Existing unit check: {check.name}"),
                note(
                    "Capacity of the installed unit at the balance of compressor, unit cooler and condenser "
                    "at this room's conditions (not its nameplate).",
                    TINY,
                ),
                Spacer(1, 2),
                figure_boxes(ctx, boxes),
                Spacer(1, 4),
                grid(rows, [0.36 * w, 0.64 * w]),
            ]
        ),
        Spacer(1, 6),
    ]
    chart = check.chart()
    if chart["ambient_temperature_c"]:
        out += [
            CapacityAmbientChart(
                chart["ambient_temperature_c"],
                chart["unit_capacity_w"],
                chart["room_load_w"],
                s,
                w,
                design_ambient=check.ambient_temperature,
                max_ambient=check.max_ambient,
            ),
            Spacer(1, 6),
        ]
    if check.warnings:
        out.append(KeepTogether([heading("Existing unit: warnings"), *warning_box(ctx, check.warnings)]))
    return out
