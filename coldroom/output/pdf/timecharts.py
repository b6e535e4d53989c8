"""The sheet's design-day and pull-down sections, and their two charts.

Presents ``RoomResult.loads.design_day`` (:class:`coldroom.loads.hourly.DesignDay`)
and ``RoomResult.pulldown`` (:class:`coldroom.loads.pulldown.PulldownResult`); it
computes nothing new beyond the run hours (hourly loads ÷ capacity, by
:func:`coldroom.loads.hourly.run_hours`) and display units.

Hooked into the sheet through :data:`coldroom.output.pdf.sheet.ROOM_SECTIONS`; the
sheet's building blocks are imported inside the section functions (no cycle).
"""

from __future__ import annotations

from typing import Optional, Sequence

from reportlab.platypus import Flowable

from coldroom.output.pdf.charts import INK, MUTED, PALETTE, RULE
from coldroom.output.pdf.existing_unit_section import _display_power, _display_temperature, _nice_step
from coldroom.output.pdf.text import capacity, clean, temperature

BAR_COLOUR = PALETTE[1]  # teal: the load
DEFROST_COLOUR = PALETTE[2]  # sand: defrost heat
LINE_COLOUR = PALETTE[0]  # slate: capacity, room air
PRODUCT_COLOURS = (PALETTE[3], PALETTE[2], PALETTE[4], PALETTE[1])


class _Plot(Flowable):
    """Axes, grid and labels shared by both charts (a frame of our own)."""

    left, right, bottom, top = 42.0, 118.0, 26.0, 18.0

    def __init__(self, width: float, height: float, title: str) -> None:
        super().__init__()
        self.width, self.height, self.title = width, height, clean(title)

    def wrap(self, available_width: float, available_height: float) -> tuple[float, float]:
        return self.width, self.height

    def frame(self, x0: float, x1: float, x_step: float, y0: float, y1: float, y_step: float,
              x_label: str, y_label: str) -> None:
        c = self.canv
        self.x0, self.x1, self.y0, self.y1 = x0, x1, y0, y1
        self.plot_w = self.width - self.left - self.right
        self.plot_h = self.height - self.bottom - self.top
        c.setFont("Helvetica-Bold", 8.5)
        c.setFillColor(INK)
        c.drawString(0, self.height - 10.0, self.title)
        c.setLineWidth(0.4)
        c.setStrokeColor(RULE)
        c.setFont("Helvetica", 7.0)
        c.setFillColor(MUTED)
        y = y0
        while y <= y1 + 1e-9:
            c.line(self.left, self.py(y), self.left + self.plot_w, self.py(y))
            c.drawRightString(self.left - 4.0, self.py(y) - 2.5, f"{y:g}")
            y += y_step
        x = x0
        while x <= x1 + 1e-9:
            c.line(self.px(x), self.bottom, self.px(x), self.bottom + self.plot_h)
            c.drawCentredString(self.px(x), self.bottom - 10.0, f"{x:g}")
            x += x_step
        c.drawCentredString(self.left + self.plot_w / 2, 2.0, clean(x_label))
        c.saveState()
        c.translate(9.0, self.bottom + self.plot_h / 2)
        c.rotate(90)
        c.drawCentredString(0, 0, clean(y_label))
        c.restoreState()

    def px(self, x: float) -> float:
        return self.left + (x - self.x0) / ((self.x1 - self.x0) or 1.0) * self.plot_w

    def py(self, y: float) -> float:
        return self.bottom + (y - self.y0) / ((self.y1 - self.y0) or 1.0) * self.plot_h

    def legend(self, items: Sequence[tuple[object, bool, str]]) -> None:
        c = self.canv
        lx = self.left + self.plot_w + 10.0
        ly = self.bottom + self.plot_h - 6.0
        c.setFont("Helvetica", 7.2)
        for colour, dashed, text in items:
            c.setStrokeColor(colour)
            c.setLineWidth(1.6)
            if dashed:
                c.setDash(4, 2)
            c.line(lx, ly + 2.5, lx + 14.0, ly + 2.5)
            c.setDash()
            c.setFillColor(INK)
            c.drawString(lx + 18.0, ly, clean(text)[:24])
            ly -= 11.0


class HourlyLoadChart(_Plot):
    """24 hourly loads as bars (defrost heat stacked on top) against the unit's capacity line.

    Parameters
    ----------
    hourly_load, defrost : sequence of 24 float
        [W]; *defrost* is the part of each hour's load that is defrost heat.
    unit_capacity : float
        [W].
    system : str
    width, height : float
        [pt].
    """

    def __init__(self, hourly_load: Sequence[float], defrost: Sequence[float], unit_capacity: float,
                 system: str, width: float, height: float = 150.0) -> None:
        super().__init__(width, height, "Design day: heat load hour by hour against the unit's capacity")
        self.hourly_load, self.defrost = list(hourly_load), list(defrost)
        self.unit_capacity, self.system = unit_capacity, system

    def draw(self) -> None:
        s = self.system
        loads = [_display_power(q, s)[0] for q in self.hourly_load]
        frost = [_display_power(q, s)[0] for q in self.defrost]
        cap = _display_power(self.unit_capacity, s)[0]
        unit = _display_power(1.0, s)[1]
        top = max(loads + [cap, 1e-9])
        step = _nice_step(top)
        self.frame(0.0, 24.0, 3.0, 0.0, step * (int(top / step) + 1), step, "hour of the day", f"load [{unit}]")
        c = self.canv
        width = self.plot_w / 24.0
        for h, (q, d) in enumerate(zip(loads, frost)):
            x = self.px(h) + 1.0
            c.setFillColor(BAR_COLOUR)
            c.rect(x, self.py(0.0), width - 2.0, self.py(q - d) - self.py(0.0), stroke=0, fill=1)
            if d > 0:
                c.setFillColor(DEFROST_COLOUR)
                c.rect(x, self.py(q - d), width - 2.0, self.py(q) - self.py(q - d), stroke=0, fill=1)
        c.setStrokeColor(LINE_COLOUR)
        c.setLineWidth(1.6)
        c.line(self.px(0.0), self.py(cap), self.px(24.0), self.py(cap))
        self.legend([(LINE_COLOUR, False, "unit capacity"), (BAR_COLOUR, False, "hourly load"),
                     (DEFROST_COLOUR, False, "defrost heat")])


class PulldownChart(_Plot):
    """Room air and product temperatures against time after the delivery.

    Parameters
    ----------
    time_h : sequence of float
        [h].
    air : sequence of float
        Room air [°C].
    products : sequence of (name, temperatures [°C], final [°C])
    asked_h : float, optional
        Pull-down time asked [h] (a dashed vertical line).
    system : str
    """

    def __init__(self, time_h: Sequence[float], air: Sequence[float],
                 products: Sequence[tuple[str, Sequence[float], float]], asked_h: Optional[float],
                 system: str, width: float, height: float = 160.0) -> None:
        super().__init__(width, height, "Pull-down after a delivery: temperatures against time")
        self.time_h, self.air, self.products = list(time_h), list(air), list(products)
        self.asked_h, self.system = asked_h, system

    def draw(self) -> None:
        s = self.system
        t_unit = "°F" if s == "IP" else "°C"
        air = [_display_temperature(t, s) for t in self.air]
        series = [(n, [_display_temperature(t, s) for t in ts], _display_temperature(f, s))
                  for n, ts, f in self.products]
        values = air + [v for _, ts, f in series for v in ts + [f]]
        lo, hi = min(values), max(values)
        pad = 0.05 * max(hi - lo, 1.0)
        lo, hi = lo - pad, hi + pad
        step = _nice_step(hi - lo, 5)
        y0 = step * (int(lo // step))
        y1 = step * (int(hi // step) + 1)
        x1 = self.time_h[-1]
        self.frame(0.0, x1, _nice_step(x1, 8), y0, y1, step, "hours after the delivery", f"temperature [{t_unit}]")
        c = self.canv

        def line(xs: Sequence[float], ys: Sequence[float], colour: object, dashed: bool = False) -> None:
            c.setStrokeColor(colour)
            c.setLineWidth(1.4)
            if dashed:
                c.setDash(4, 2)
            path = c.beginPath()
            for i, (x, y) in enumerate(zip(xs, ys)):
                (path.moveTo if i == 0 else path.lineTo)(self.px(x), self.py(y))
            c.drawPath(path, stroke=1, fill=0)
            c.setDash()

        legend = [(LINE_COLOUR, True, "room air")]
        line(self.time_h, air, LINE_COLOUR, dashed=True)
        for i, (name, ts, final) in enumerate(series):
            colour = PRODUCT_COLOURS[i % len(PRODUCT_COLOURS)]
            line(self.time_h, ts, colour)
            c.setStrokeColor(colour)
            c.setLineWidth(0.5)
            c.setDash(1, 2)
            c.line(self.px(0.0), self.py(final), self.px(x1), self.py(final))
            c.setDash()
            legend.append((colour, False, name))
        if self.asked_h is not None and self.asked_h <= x1:
            c.setStrokeColor(MUTED)
            c.setDash(1.5, 2)
            c.line(self.px(self.asked_h), self.bottom, self.px(self.asked_h), self.bottom + self.plot_h)
            c.setDash()
            c.setFillColor(MUTED)
            c.setFont("Helvetica", 7.0)
            c.drawString(self.px(self.asked_h) + 2.0, self.bottom + self.plot_h - 9.0, clean("time asked"))
        self.legend(legend)


def design_day_section(ctx: object, index: int) -> list:
    """The 24 hourly loads against the design capacity, and the run time that results."""
    from reportlab.platypus import KeepTogether, Spacer

    from coldroom.loads.hourly import run_hours
    from coldroom.output.pdf.layout import heading, note

    room = ctx.result.rooms[index]  # type: ignore[attr-defined]
    day = room.loads.design_day
    if day is None:
        return []
    s = ctx.system  # type: ignore[attr-defined]
    cap = room.loads.design_capacity
    hours = run_hours(day.hourly_load, cap)
    h = day.peak_hour
    over = [k for k in range(24) if day.hourly_load[k] - day.defrost[k] > cap]
    source = "the room's schedule" if day.scheduled else "no schedule given: default placing"
    text = (
        f"Peak hour {h:02d}:00–{h + 1:02d}:00: {capacity(day.peak_load, s)} (defrost heat left out). "
        f"At the design capacity of {capacity(cap, s)} the unit runs {hours:.1f} h of the design day "
        f"({24.0 - hours:.1f} h spare). Outdoor air {temperature(min(day.outdoor_temperature), s)} to "
        f"{temperature(max(day.outdoor_temperature), s)} ({source})."
    )
    if over:
        text += " In hours " + ", ".join(f"{k:02d}" for k in over) + " the load exceeds the capacity: the room warms until later hours catch up."
    if not day.scheduled:
        text += " The design capacity comes from the 24-hour method and today's peak-hour estimate."
    chart = HourlyLoadChart(day.hourly_load, day.defrost, cap, s, ctx.width)  # type: ignore[attr-defined]
    return [KeepTogether([heading("The design day hour by hour"), chart, Spacer(1, 3), note(text)])]


def pulldown_section(ctx: object, index: int) -> list:
    """The pull-down after a delivery: with the design unit and, when there is one, the existing unit."""
    room = ctx.result.rooms[index]  # type: ignore[attr-defined]
    out: list = []
    limits = getattr(room, "limits", None)
    for title, p in (
        ("Pull-down after a delivery (design unit)", room.pulldown),
        ("Pull-down after a delivery (existing unit)", getattr(limits, "pulldown", None)),
    ):
        if p is not None:
            unit = getattr(p, "unit", "")
            out += _pulldown_block(ctx, f"Pull-down after a delivery ({unit} unit)" if unit else title, p)
    return out


def _pulldown_block(ctx: object, title: str, p: object) -> list:
    from reportlab.platypus import KeepTogether, Spacer

    from coldroom.output.pdf.layout import heading, note

    from coldroom.loads.pulldown import FINAL_TOLERANCE
    from coldroom.units import display

    s = ctx.system  # type: ignore[attr-defined]
    tolerance = display(FINAL_TOLERANCE, "temperature_difference", s)
    g = p.governing  # type: ignore[attr-defined]
    time_h = [t / 3600.0 for t in p.time]  # type: ignore[attr-defined]
    chart = PulldownChart(
        time_h,
        p.air_temperature,  # type: ignore[attr-defined]
        [(t.name, t.temperature, t.final_temperature) for t in p.products],  # type: ignore[attr-defined]
        g.asked_time / 3600.0 if g is not None and g.asked_time is not None else None,
        s,
        ctx.width,  # type: ignore[attr-defined]
    )
    lines = []
    for t in p.products:  # type: ignore[attr-defined]
        reached = (
            f"reaches {temperature(t.final_temperature, s)} (within {tolerance}) in {t.time_to_final / 3600:.1f} h"
            if t.time_to_final is not None
            else f"does not reach {temperature(t.final_temperature, s)} within {p.duration / 3600:g} h"  # type: ignore[attr-defined]
        )
        asked = "" if t.asked_time is None else f" (asked: {t.asked_time / 3600:g} h{'' if t.met else ' - NOT MET'})"
        lines.append(f"{t.name} {reached}{asked}.")
    above = p.hours_above_setpoint_plus_2k  # type: ignore[attr-defined]
    lines.append(
        f"Highest room air after the delivery: {temperature(p.highest_air_temperature, s)}"  # type: ignore[attr-defined]
        + ("" if above is None else f"; {above:.1f} h more than 2 K above the set point")
        + f"; lowest {temperature(p.lowest_air_temperature, s)}."  # type: ignore[attr-defined]
    )
    out = [heading(title), chart, Spacer(1, 3), note(" ".join(lines)), note(f"Basis: {p.basis}.")]  # type: ignore[attr-defined]
    return [KeepTogether(out)]
