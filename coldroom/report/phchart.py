"""The pressure–enthalpy diagram of one room's cycle.

:func:`diagram_data` fetches drawing data from :mod:`coldroom.refrigerant`
(the saturation dome and a few isotherms in the vapour region); the cycle's
own four states come from the result. :class:`PHChart` draws them on the page
canvas: logarithmic pressure axis with 1–2–5 ticks, enthalpy axis with round
ticks, the dome, the isotherms (thin, labelled), and the cycle 1-2-3-4 with
numbered states, everything clipped to the plot area.

The segments 2→3 (condenser) and 4→1 (evaporator) are isobars and 3→4
(expansion) an isenthalp, so straight lines on p–h axes are exact for them;
the compression 1→2 is drawn as a straight line between its end states.
"""

from __future__ import annotations

import math
from dataclasses import dataclass
from typing import Sequence

from reportlab.lib import colors
from reportlab.platypus import Flowable

from coldroom import units as _units
from coldroom.report.charts import INK, MUTED, RULE
from coldroom.report.text import clean

DOME = colors.HexColor("#4F6D8A")
CYCLE = colors.HexColor("#B5523B")
ISO = colors.HexColor("#9FB3A8")
PLOT_BG = colors.HexColor("#F7F8FA")


@dataclass(frozen=True)
class DiagramData:
    """Drawing data in SI: pressures [Pa], enthalpies [J/kg], temperatures [°C].

    Attributes
    ----------
    dome_pressures, dome_liquid, dome_vapour : tuple of float
        Saturation dome: pressure levels and bubble/dew enthalpies.
    critical_pressure : float
        [Pa]
    isotherms : tuple of (temperature, tuple of (h, p))
        Vapour-region isotherms, each from its dew point to lower pressures.
    """

    dome_pressures: tuple[float, ...]
    dome_liquid: tuple[float, ...]
    dome_vapour: tuple[float, ...]
    critical_pressure: float
    isotherms: tuple[tuple[float, tuple[tuple[float, float], ...]], ...] = ()


def diagram_data(refrigerant: str, pressure_low: float, pressure_high: float, isotherm_temperatures: Sequence[float] = ()) -> DiagramData:
    """Dome and isotherms for the pressure window [*pressure_low*, *pressure_high*] [Pa].

    Parameters
    ----------
    refrigerant : str
        Catalogue name.
    pressure_low, pressure_high : float
        The window shown [Pa].
    isotherm_temperatures : sequence of float
        Temperatures of the isotherms to draw in the vapour region [°C].
    """
    from coldroom.errors import ColdroomError
    from coldroom.refrigerant import get_fluid

    fluid = get_fluid(refrigerant)
    # the dome only where the window needs it: 30 pressure levels, geometric
    top_fraction = 0.94 if fluid.info.model == "mixture" else 0.99  # as Fluid.saturation_dome
    p_a = max(pressure_low * 0.8, fluid.minimum_pressure * 1.01)
    p_b = min(pressure_high * 1.3, top_fraction * fluid.critical_pressure)
    pressures, liquid, vapour = [], [], []
    levels = 30
    for i in range(levels):
        p = p_a * (p_b / p_a) ** (i / (levels - 1))
        try:
            hl = fluid.saturated_state(0.0, pressure=p).h
            hv = fluid.saturated_state(1.0, pressure=p).h
        except ColdroomError:
            continue
        pressures.append(p)
        liquid.append(hl)
        vapour.append(hv)
    isotherms = []
    for temperature in isotherm_temperatures:
        try:
            p_dew = fluid.dew_pressure(temperature) if temperature < fluid.critical_temperature - 2.0 else pressure_high
        except ColdroomError:
            continue
        top = min(p_dew * 0.999, pressure_high * 1.2)
        steps = [top * (pressure_low * 0.8 / top) ** (i / 8.0) for i in range(9)]
        points = [(s.h, s.p) for s in fluid.isotherm(temperature, steps) if s.quality is None]
        if p_dew < pressure_high * 1.2:
            try:
                dew = fluid.saturated_state(1.0, temperature=temperature)
                points.insert(0, (dew.h, dew.p))
            except ColdroomError:
                pass
        if len(points) >= 2:
            isotherms.append((float(temperature), tuple(points)))
    return DiagramData(
        tuple(pressures), tuple(liquid), tuple(vapour), fluid.critical_pressure, tuple(isotherms)
    )


def log_ticks(low: float, high: float) -> list[float]:
    """1–2–5 ticks between *low* and *high* (both > 0); fewer steps on wide ranges.

    Examples
    --------
    >>> log_ticks(90, 2100)
    [100, 200, 500, 1000, 2000]
    >>> log_ticks(3, 400)[:3]
    [5, 10, 20]
    """
    ticks: list[float] = []
    decade = 10 ** math.floor(math.log10(low))
    steps = (1, 2, 5) if high / low < 300 else (1,)
    while decade <= high:
        for m in steps:
            v = m * decade
            if low <= v <= high:
                ticks.append(int(v) if v >= 1 else v)
        decade *= 10
    return ticks


def linear_ticks(low: float, high: float, count: int = 6) -> list[float]:
    """Round ticks (1, 2, 2.5, 5 × 10ⁿ steps) between *low* and *high*.

    Examples
    --------
    >>> linear_ticks(180, 470)
    [200, 250, 300, 350, 400, 450]
    """
    span = high - low
    raw = span / max(count, 1)
    power = 10 ** math.floor(math.log10(raw))
    step = next(m * power for m in (1, 2, 2.5, 5, 10) if m * power >= raw)
    first = math.ceil(low / step) * step
    out = []
    v = first
    while v <= high + 1e-9:
        out.append(int(round(v)) if float(step).is_integer() else round(v, 6))
        v += step
    return out


class PHChart(Flowable):
    """A p–h diagram flowable.

    Parameters
    ----------
    states : sequence of dict
        The cycle's four states as in ``CycleResult.to_json()["states"]``
        (``p_pa``, ``h_j_kg``).
    data : DiagramData
        Dome and isotherms.
    system : str
        ``"SI"`` (kJ/kg, kPa) or ``"IP"`` (Btu/lb, psia).
    width, height : float
        Size [pt].
    title : str
        Caption.
    """

    def __init__(self, states: Sequence[dict], data: DiagramData, system: str, width: float, height: float, title: str = ""):
        super().__init__()
        self.states = [(float(s["h_j_kg"]), float(s["p_pa"])) for s in states]
        self.data = data
        self.system = system
        self.width = width
        self.height = height
        self.title = clean(title)
        self.h_unit = _units.DISPLAY_UNITS[system]["specific_energy"]
        self.p_unit = _units.DISPLAY_UNITS[system]["pressure"]

    def wrap(self, available_width: float, available_height: float) -> tuple[float, float]:
        return self.width, self.height

    # display conversions
    def _h(self, h: float) -> float:
        return _units.to_unit(h, "specific_energy", self.h_unit)

    def _p(self, p: float) -> float:
        return _units.to_unit(p, "pressure", self.p_unit)

    def _window(self) -> tuple[float, float, float, float]:
        hs = [self._h(h) for h, _ in self.states]
        ps = [self._p(p) for _, p in self.states]
        p_low, p_high = min(ps) / 2.2, max(ps) * 2.0
        p_crit = self._p(self.data.critical_pressure)
        p_high = min(p_high, max(p_crit * 1.15, max(ps) * 1.15))
        h_span = max(hs) - min(hs)
        liquid_at_low = [
            self._h(hl) for pp, hl in zip(self.data.dome_pressures, self.data.dome_liquid) if self._p(pp) >= p_low
        ]
        h_low = min([min(hs) - 0.35 * h_span] + liquid_at_low[:1])
        h_high = max(hs) + 0.25 * h_span
        return h_low, h_high, p_low, p_high

    def draw(self) -> None:
        c = self.canv
        left, bottom, right, top = 46.0, 30.0, 10.0, 18.0 if self.title else 6.0
        x0, y0 = left, bottom
        pw, ph = self.width - left - right, self.height - bottom - top
        h_low, h_high, p_low, p_high = self._window()
        lp_low, lp_high = math.log10(p_low), math.log10(p_high)

        def X(h_display: float) -> float:
            return x0 + pw * (h_display - h_low) / (h_high - h_low)

        def Y(p_display: float) -> float:
            return y0 + ph * (math.log10(p_display) - lp_low) / (lp_high - lp_low)

        def pt(h: float, p: float) -> tuple[float, float]:
            return X(self._h(h)), Y(self._p(p))

        if self.title:
            c.setFont("Helvetica-Bold", 8.5)
            c.setFillColor(INK)
            c.drawString(0, self.height - 10.0, self.title)
        c.setFillColor(PLOT_BG)
        c.setStrokeColor(RULE)
        c.setLineWidth(0.6)
        c.rect(x0, y0, pw, ph, stroke=1, fill=1)
        # ticks and grid
        c.setFont("Helvetica", 7.0)
        for tick in log_ticks(p_low, p_high):
            y = Y(tick)
            c.setStrokeColor(RULE)
            c.setLineWidth(0.3)
            c.line(x0, y, x0 + pw, y)
            c.setFillColor(MUTED)
            c.drawRightString(x0 - 3.0, y - 2.5, f"{tick:,}")
        for tick in linear_ticks(h_low, h_high, 7):
            x = X(tick)
            c.setStrokeColor(RULE)
            c.setLineWidth(0.3)
            c.line(x, y0, x, y0 + ph)
            c.setFillColor(MUTED)
            c.drawCentredString(x, y0 - 10.0, f"{tick:,}")
        c.setFillColor(INK)
        c.setFont("Helvetica", 7.5)
        c.drawCentredString(x0 + pw / 2.0, y0 - 21.0, clean(f"specific enthalpy h [{self.h_unit}]"))
        c.saveState()
        c.translate(x0 - 34.0, y0 + ph / 2.0)
        c.rotate(90)
        c.drawCentredString(0, 0, clean(f"pressure p [{self.p_unit}, absolute; log scale]"))
        c.restoreState()

        # everything inside the plot area is clipped to it
        c.saveState()
        clip = c.beginPath()
        clip.rect(x0, y0, pw, ph)
        c.clipPath(clip, stroke=0, fill=0)
        # isotherms
        c.setStrokeColor(ISO)
        c.setLineWidth(0.6)
        c.setDash(2, 2)
        for temperature, points in self.data.isotherms:
            xy = [pt(h, p) for h, p in points]
            path = c.beginPath()
            path.moveTo(*xy[0])
            for x, y in xy[1:]:
                path.lineTo(x, y)
            c.drawPath(path, stroke=1, fill=0)
        c.setDash()
        # saturation dome
        d = self.data
        if d.dome_pressures:
            ring = [pt(h, p) for h, p in zip(d.dome_liquid, d.dome_pressures)]
            ring += [pt(h, p) for h, p in reversed(list(zip(d.dome_vapour, d.dome_pressures)))]
            path = c.beginPath()
            path.moveTo(*ring[0])
            for x, y in ring[1:]:
                path.lineTo(x, y)
            c.setStrokeColor(DOME)
            c.setLineWidth(1.1)
            c.drawPath(path, stroke=1, fill=0)
        # the cycle
        xy = [pt(h, p) for h, p in self.states]
        path = c.beginPath()
        path.moveTo(*xy[0])
        for x, y in xy[1:]:
            path.lineTo(x, y)
        path.close()
        c.setStrokeColor(CYCLE)
        c.setLineWidth(1.6)
        c.drawPath(path, stroke=1, fill=0)
        # isotherm labels (inside the clip, at the low-pressure end)
        c.setFont("Helvetica", 6.5)
        c.setFillColor(colors.HexColor("#5E7A6C"))
        placed: list[tuple[float, float, float, float]] = []
        for temperature, points in self.data.isotherms:
            # label at the highest point of the isotherm inside the plot, right of the line
            inside = [xy for xy in (pt(h, p) for h, p in points) if y0 <= xy[1] <= y0 + ph and x0 <= xy[0] <= x0 + pw]
            if not inside:
                continue
            x, y = max(inside, key=lambda xy: xy[1])
            label = clean(_units.display(temperature, "temperature", self.system, 0))
            width = c.stringWidth(label, "Helvetica", 6.5)
            x = min(x + 3.0, x0 + pw - width - 2.0)
            y = min(y - 9.0, y0 + ph - 9.0)
            box = (x - 1.0, y - 1.0, x + width + 1.0, y + 7.0)
            if any(not (box[2] < b[0] or b[2] < box[0] or box[3] < b[1] or b[3] < box[1]) for b in placed):
                continue  # would overlap another label: leave this isotherm unlabelled
            placed.append(box)
            c.drawString(x, y, label)
        c.restoreState()
        # numbered state markers (kept inside the plot area)
        offsets = ((6.0, -11.0), (5.0, 4.0), (-11.0, 4.0), (-11.0, -11.0))
        for i, ((x, y), (dx, dy)) in enumerate(zip(xy, offsets), start=1):
            c.setFillColor(CYCLE)
            c.circle(x, y, 2.2, stroke=0, fill=1)
            lx = min(max(x + dx, x0 + 2.0), x0 + pw - 8.0)
            ly = min(max(y + dy, y0 + 2.0), y0 + ph - 9.0)
            c.setFillColor(colors.white)
            c.circle(lx + 3.0, ly + 3.0, 5.0, stroke=0, fill=1)
            c.setFillColor(CYCLE)
            c.setFont("Helvetica-Bold", 8.0)
            c.drawCentredString(lx + 3.0, ly + 0.3, str(i))
        # legend
        c.setFont("Helvetica", 6.8)
        lx, ly = x0 + 6.0, y0 + ph - 10.0
        rows = 3 if self.data.isotherms else 2
        c.setFillColor(colors.white)
        c.setStrokeColor(RULE)
        c.setLineWidth(0.4)
        c.rect(lx - 3.0, ly - 10.0 * (rows - 1) - 3.5, 108.0, 10.0 * rows + 2.0, stroke=1, fill=1)
        c.setStrokeColor(DOME)
        c.setLineWidth(1.1)
        c.line(lx, ly + 2.5, lx + 14.0, ly + 2.5)
        c.setFillColor(INK)
        c.drawString(lx + 18.0, ly, "saturation (bubble / dew)")
        ly -= 10.0
        c.setStrokeColor(CYCLE)
        c.setLineWidth(1.6)
        c.line(lx, ly + 2.5, lx + 14.0, ly + 2.5)
        c.drawString(lx + 18.0, ly, "this cycle, states 1-4")
        if self.data.isotherms:
            ly -= 10.0
            c.setStrokeColor(ISO)
            c.setLineWidth(0.6)
            c.setDash(2, 2)
            c.line(lx, ly + 2.5, lx + 14.0, ly + 2.5)
            c.setDash()
            c.drawString(lx + 18.0, ly, "isotherms (vapour)")
