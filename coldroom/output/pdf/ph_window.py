"""What a p–h chart shows: the pressure and enthalpy window and the round values of its lines and ticks.

A drawing choice made in the project's units (round isotherms and isentropes in
the display unit), so that rooms with similar cycles share one cached
computation of the lines.
"""

from __future__ import annotations

import math
from dataclasses import dataclass
from typing import Any, Sequence

from coldroom import units as _units
from coldroom.output.pdf.ph_states import cycle_states


# --- ticks ------------------------------------------------------------------------------------


def log_ticks(low: float, high: float) -> tuple[list[float], list[float]]:
    """Labelled and minor ticks of a logarithmic axis from *low* to *high* (both > 0).

    Labels fall on 1–2–5 × 10ⁿ (on 1 and 3 × 10ⁿ, then on 10ⁿ alone, for wider
    ranges); minor ticks on every integer multiple of 10ⁿ.

    Examples
    --------
    >>> log_ticks(70, 5000)[0]
    [100, 200, 500, 1000, 2000, 5000]
    >>> log_ticks(8, 30)
    ([10, 20], [8, 9, 30])
    """
    decades = math.log10(high / low)
    steps = (1, 2, 5) if decades <= 2.3 else (1, 3) if decades <= 3.5 else (1,)
    major: list[float] = []
    minor: list[float] = []
    decade = 10.0 ** math.floor(math.log10(low))
    while decade <= high * 1.0000001:
        for m in range(1, 10):
            v = m * decade
            v = int(round(v)) if v >= 1 else round(v, 9)
            if low * 0.9999999 <= v <= high * 1.0000001:
                (major if m in steps else minor).append(v)
        decade *= 10.0
    return major, minor


def linear_ticks(low: float, high: float, count: int = 7) -> list[float]:
    """Round ticks (1, 2, 2.5, 5 × 10ⁿ steps) between *low* and *high*.

    Examples
    --------
    >>> linear_ticks(180, 470)
    [200, 250, 300, 350, 400, 450]
    """
    raw = (high - low) / max(count, 1)
    power = 10 ** math.floor(math.log10(raw))
    step = next(m * power for m in (1, 2, 2.5, 5, 10) if m * power >= raw)
    v = math.ceil(low / step) * step
    out = []
    while v <= high + 1e-9:
        out.append(int(round(v)) if float(step).is_integer() else round(v, 6))
        v += step
    return out


def _round_step(span: float, candidates: Sequence[float], most: int) -> float:
    return next((c for c in candidates if span / c <= most), candidates[-1])


def _nice_down(value: float) -> float:
    """The largest of 1, 1.5, 2, 3, 5, 7 × 10ⁿ not above *value*."""
    decade = 10 ** math.floor(math.log10(value))
    return max(m * decade for m in (1, 1.5, 2, 3, 5, 7) if m * decade <= value * (1 + 1e-12))


def _nice_up(value: float) -> float:
    """The smallest of 1, 1.5, 2, 3, 5, 7, 10 × 10ⁿ not below *value*."""
    decade = 10 ** math.floor(math.log10(value))
    return min(m * decade for m in (1, 1.5, 2, 3, 5, 7, 10) if m * decade >= value * (1 - 1e-12))


@dataclass(frozen=True)
class Window:
    """What a chart shows, SI: pressures [Pa], enthalpies [J/kg]; the lines' values."""

    pressure_low: float
    pressure_high: float
    enthalpy_low: float
    enthalpy_high: float
    isotherms: tuple[float, ...]  # °C
    isentropes: tuple[float, ...]  # J/(kg·K)


def choose_window(cycle: Any, system: str, valve_inlet: Any = None) -> Window:
    """Window and round line values for *cycle* in *system* units (a drawing choice).

    The pressure window runs from about half the evaporating pressure to above
    the critical pressure (and the discharge), on round values so that rooms
    with similar cycles share one cached computation.
    """
    from coldroom.physics.refrigerant import get_fluid

    fluid = get_fluid(cycle.refrigerant)
    states = [s for _, s in cycle_states(cycle, valve_inlet)]
    p_min = min(s.p for s in states)
    p_max = max(s.p for s in states)
    p_low = max(_nice_down(p_min / 2.2), fluid.minimum_pressure * 1.01)
    p_high = _nice_up(max(1.12 * fluid.critical_pressure, 1.3 * p_max))
    # isotherms: round values in the display unit, from below the evaporating
    # temperature to well above the discharge
    t_unit = _units.DISPLAY_UNITS[system]["temperature"]

    def disp(t: float) -> float:
        return _units.to_unit(t, "temperature", t_unit)

    def back(v: float) -> float:
        return round(_units.parse_quantity(f"{v!r} {t_unit}", "temperature"), 9)

    try:
        t_bottom = fluid.dew_temperature(min(max(p_low, fluid.minimum_pressure * 1.02), 0.9 * fluid.critical_pressure))
    except Exception:  # noqa: BLE001 - any failure: fall back on the cycle's own
        t_bottom = cycle.evaporating_temperature - 20.0
    t_top = max(cycle.states[1].t, fluid.critical_temperature) + 40.0
    lo, hi = disp(t_bottom), disp(t_top)
    step = _round_step(hi - lo, (10.0, 20.0, 25.0, 50.0) if system == "SI" else (20.0, 25.0, 50.0, 100.0), 11)
    v = math.ceil(lo / step) * step
    temps = []
    while v <= hi:
        temps.append(back(v))
        v += step
    # isentropes: round values around the compression (the display unit's steps)
    s_unit = _units.DISPLAY_UNITS[system]["specific_heat"]
    s1 = _units.to_unit(cycle.states[0].s, "specific_heat", s_unit)
    s2 = _units.to_unit(cycle.states[1].s, "specific_heat", s_unit)
    s_step = (0.05 if s2 - s1 < 0.2 else 0.1) if system == "SI" else (0.01 if s2 - s1 < 0.05 else 0.025)
    first = math.floor(s1 / s_step) * s_step
    entropies = []
    v = first - s_step
    while v <= s2 + 1.01 * s_step and len(entropies) < 6:
        entropies.append(round(_units.parse_quantity(f"{round(v, 6)!r} {s_unit}", "specific_heat"), 6))
        v += s_step
    # enthalpy window: the bubble line at the bottom of the window to right of the discharge
    h_states = [s.h for s in states]
    span = max(h_states) - min(h_states)
    try:
        h_liquid_low = fluid.saturated_liquid(pressure=max(p_low, fluid.minimum_pressure * 1.02)).h
    except Exception:  # noqa: BLE001
        h_liquid_low = min(h_states) - 0.3 * span
    h_low = min(h_liquid_low, min(h_states)) - 0.06 * span
    h_high = max(h_states) + 0.22 * span
    return Window(p_low, p_high, h_low, h_high, tuple(temps), tuple(entropies))
