"""Data of a pressure–enthalpy chart, in SI: the lines a practitioner reads a cycle against.

:func:`chart_data` returns, for one refrigerant and pressure window, the
saturation dome (bubble and dew lines up to the critical point), isotherms
across subcooled liquid, two-phase and superheated vapour (sloped across the
dome for a zeotrope), isentropes in the vapour region and lines of constant
quality 0.1 … 0.9 inside the dome. Every point is a state of the equation of
state, computed through :mod:`coldroom.physics.refrigerant` (the tests put each point
back into CoolProp). The drawing, in the project's units, is
:mod:`coldroom.output.pdf.phchart`'s job.

Results are cached per process and on disk (:mod:`coldroom.physics.disk_cache`):
the key is the refrigerant, the rounded pressure window and the rounded line
values (with the coldroom and CoolProp versions on disk), so rooms with similar
cycles share one computation (issue 15) and later runs read it back (issue 27).

Examples
--------
>>> d = chart_data("R-134a", 50e3, 5e6, (0.0, 40.0), (1750.0,))
>>> d.bubble[-1][1] > 0.995 * d.critical_pressure
True
>>> [line.value for line in d.isotherms]
[0.0, 40.0]
"""

from __future__ import annotations

import math
from dataclasses import dataclass
from functools import lru_cache
from typing import Sequence

from coldroom.constants import ZERO_CELSIUS_K
from coldroom.errors import PropertyRangeError

#: Lines of constant quality drawn inside the dome [1].
QUALITIES = (0.1, 0.2, 0.3, 0.4, 0.5, 0.6, 0.7, 0.8, 0.9)

Point = tuple[float, float]  # (h [J/kg], p [Pa])


@dataclass(frozen=True)
class ChartLine:
    """One line of constant temperature, entropy or quality.

    Attributes
    ----------
    kind : str
        ``"isotherm"`` (value in °C), ``"isentrope"`` (J/(kg·K)) or
        ``"quality"`` (1).
    value : float
        The constant.
    segments : tuple of tuple of (h, p)
        Pieces of the line, each smooth inside (an isotherm breaks at the
        bubble and dew lines): enthalpy [J/kg], pressure [Pa].
    phases : tuple of str
        For each segment: ``"liquid"``, ``"two-phase"``, ``"vapour"`` or
        ``"supercritical"``.
    """

    kind: str
    value: float
    segments: tuple[tuple[Point, ...], ...]
    phases: tuple[str, ...]


@dataclass(frozen=True)
class ChartData:
    """A p–h chart's lines for one refrigerant and pressure window (SI).

    Attributes
    ----------
    refrigerant : str
    pressure_low, pressure_high : float
        The window [Pa].
    bubble, dew : tuple of (h, p)
        Saturated liquid and vapour lines in rising pressure, each ending at
        the highest saturation state computed (within 0.5 % of the critical
        pressure).
    critical_pressure : float
        [Pa] (stored critical point of the catalogue's model).
    critical_enthalpy : float
        [J/kg]
    critical_temperature : float
        [°C]
    isotherms, isentropes, qualities : tuple of ChartLine
    """

    refrigerant: str
    pressure_low: float
    pressure_high: float
    bubble: tuple[Point, ...]
    dew: tuple[Point, ...]
    critical_pressure: float
    critical_enthalpy: float
    critical_temperature: float
    isotherms: tuple[ChartLine, ...]
    isentropes: tuple[ChartLine, ...]
    qualities: tuple[ChartLine, ...]


def _geometric(start: float, end: float, count: int, bunch: float = 1.0) -> list[float]:
    """*count* pressures from *start* to *end*, geometric; *bunch* > 1 crowds them near *start*."""
    return [start * (end / start) ** ((i / (count - 1)) ** bunch) for i in range(count)]


#: Qualities sampled at each pressure level of a mixture's two-phase grid [1].
GRID_QUALITIES = (0.0, 0.25, 0.5, 0.75, 1.0)


def _lagrange(nodes: Sequence[float], values: Sequence[float], x: float) -> float:
    """The interpolating polynomial through (*nodes*, *values*) at *x* (Lagrange form)."""
    total = 0.0
    for i, (xi, yi) in enumerate(zip(nodes, values)):
        term = yi
        for j, xj in enumerate(nodes):
            if j != i:
                term *= (x - xj) / (xi - xj)
        total += term
    return total


@dataclass(frozen=True)
class _Level:
    """A mixture's two-phase states at one pressure [Pa]: temperature [°C] and
    enthalpy [J/kg] at the qualities :data:`GRID_QUALITIES`."""

    pressure: float
    temperatures: tuple[float, ...]
    enthalpies: tuple[float, ...]

    def enthalpy(self, quality: float) -> float:
        return _lagrange(GRID_QUALITIES, self.enthalpies, quality)

    def temperature(self, quality: float) -> float:
        return _lagrange(GRID_QUALITIES, self.temperatures, quality)

    def quality_at(self, temperature: float) -> float:
        """Quality at which the temperature equals *temperature* (bisection; T rises with quality)."""
        low, high = 0.0, 1.0
        for _ in range(50):
            mid = 0.5 * (low + high)
            if self.temperature(mid) < temperature:
                low = mid
            else:
                high = mid
        return 0.5 * (low + high)


def _mixture_grid(fluid, p_low: float) -> list[_Level]:
    """Two-phase states of a mixture on 18 pressure levels up to 0.94 × critical pressure.

    A zeotrope's enthalpy and temperature are not linear in quality at fixed
    pressure (the phase compositions shift); five samples per level and the
    interpolating quartic reproduce them to about 0.001 in quality and 0.01 K
    (checked point by point by the tests against the property library).
    """
    levels = []
    for p in _geometric(max(p_low, fluid.minimum_pressure * 1.001), 0.94 * fluid.critical_pressure, 18):
        try:
            states = [fluid.saturated_state(q, pressure=p) for q in GRID_QUALITIES]
        except PropertyRangeError:
            continue
        levels.append(_Level(p, tuple(x.t for x in states), tuple(x.h for x in states)))
    return levels


def _dome(fluid, p_low: float, grid: Sequence[_Level]) -> tuple[list[Point], list[Point]]:
    """Bubble and dew lines from *p_low* to the critical point, rising pressure."""
    from coldroom.physics.refrigerant import chart_saturated, phase_envelope

    pc = fluid.critical_pressure
    if fluid.info.model == "mixture":
        bubble_env, dew_env = phase_envelope(fluid)
        start = max(p_low, fluid.minimum_pressure)
        bubble = [pt for pt in bubble_env if pt[1] >= start]
        dew = [pt for pt in dew_env if pt[1] >= start]
        bubble += [(level.enthalpies[0], level.pressure) for level in grid]
        dew += [(level.enthalpies[-1], level.pressure) for level in grid]
        return sorted(bubble, key=lambda x: x[1]), sorted(dew, key=lambda x: x[1])
    # pure and pseudo-pure: levels crowded towards the critical pressure
    start = max(p_low, fluid.minimum_pressure * 1.001)
    top = 0.98 * pc
    levels = [start * (top / start) ** (i / 39) for i in range(40)]
    levels += [pc * (1.0 - f) for f in (0.01, 0.005, 0.002, 0.001, 0.0005) if pc * (1.0 - f) > start]
    bubble, dew = [], []
    for p in sorted(set(levels)):
        try:
            hl = chart_saturated(fluid, p, 0.0).h
            hv = chart_saturated(fluid, p, 1.0).h
        except PropertyRangeError:
            continue
        bubble.append((hl, p))
        dew.append((hv, p))
    return bubble, dew


#: A mixture's isotherms from this far below its critical temperature up to
#: :data:`BAND_ABOVE` above it are drawn by :func:`_near_critical_isotherm` where
#: the saturation look-ups of :func:`_isotherm` fail [K].
BAND_BELOW, BAND_ABOVE = 10.0, 3.0
#: Single-phase states of a near-critical isotherm keep this relative distance in
#: pressure from the traced phase envelope (its crossings are interpolated).
ENVELOPE_MARGIN = 0.01


def _states_along(fluid, temperature: float, pressures: Sequence[float], phases: Sequence[str]) -> tuple[Point, ...]:
    """(h, p) of the states at *temperature* [°C] at each of *pressures* [Pa], the first of
    *phases* ("liquid", "gas") that can be computed there; a pressure where none can is skipped."""
    from coldroom.physics.refrigerant import chart_state_pt

    out = []
    for p in pressures:
        for phase in phases:
            try:
                s = chart_state_pt(fluid, p, temperature, phase)
            except PropertyRangeError:
                continue
            out.append((s.h, s.p))
            break
    return tuple(out)


def _isotherm(fluid, temperature: float, p_low: float, p_high: float, grid: Sequence[_Level]) -> ChartLine | None:
    """One isotherm across the window: liquid, two-phase, vapour (or one supercritical piece)."""
    def run(pressures: Sequence[float], phase: str) -> tuple[Point, ...]:
        return _states_along(fluid, temperature, pressures, (phase,))

    mixture = fluid.info.model == "mixture"
    tc = fluid.critical_temperature
    segments: list[tuple[Point, ...]] = []
    phases: list[str] = []
    subcritical = temperature < tc - (2.0 if mixture else 0.05)
    if subcritical:
        try:
            bub = fluid.saturated_state(0.0, temperature=temperature)
            dew = fluid.saturated_state(1.0, temperature=temperature)
        except PropertyRangeError:
            return None
        if mixture and bub.p > 0.95 * fluid.critical_pressure:
            return None  # next to a mixture's critical point: not drawn
        # subcooled liquid: from the bubble point up to the top of the window
        if bub.p < p_high:
            liquid = ((bub.h, bub.p),) + run(_geometric(bub.p, p_high, 12, 1.6)[1:], "liquid")
            if bub.p < p_low:
                liquid = tuple(pt for pt in liquid if pt[1] >= p_low * 0.9)
            segments.append(liquid)
            phases.append("liquid")
        # two-phase: horizontal for a pure fluid, sloped (bubble → dew) for a zeotrope
        if dew.p < p_high and bub.p > p_low:
            if abs(bub.p - dew.p) <= 1e-9 * bub.p:
                wet = ((bub.h, bub.p), (dew.h, dew.p))
            elif mixture:
                inner = [
                    (level.enthalpy(level.quality_at(temperature)), level.pressure)
                    for level in reversed(grid)
                    if dew.p < level.pressure < bub.p
                ]
                wet = ((bub.h, bub.p), *inner, (dew.h, dew.p))
            else:
                inner = []
                for p in _geometric(bub.p, dew.p, 9)[1:-1]:
                    try:
                        inner.append((_pseudo_pure_two_phase(fluid, p, temperature), p))
                    except PropertyRangeError:
                        continue
                wet = ((bub.h, bub.p), *inner, (dew.h, dew.p))
            segments.append(wet)
            phases.append("two-phase")
        # superheated vapour: from the dew point down to the bottom of the window
        if dew.p > p_low:
            vapour = ((dew.h, dew.p),) + run(_geometric(dew.p, p_low, 14, 1.5)[1:], "gas")
            segments.append(vapour)
            phases.append("vapour")
    else:
        if mixture and temperature < tc + BAND_ABOVE:
            return None  # a mixture's retrograde band around its critical point (_near_critical_isotherm)
        line = run(_geometric(p_high, p_low, 30), "gas")
        if len(line) >= 2:
            segments.append(line)
            phases.append("supercritical")
    segments_kept = [(s, ph) for s, ph in zip(segments, phases) if len(s) >= 2]
    if not segments_kept:
        return None
    return ChartLine("isotherm", float(temperature), tuple(s for s, _ in segments_kept), tuple(ph for _, ph in segments_kept))


def _near_critical_isotherm(fluid, temperature: float, p_low: float, p_high: float,
                            grid: Sequence[_Level]) -> ChartLine | None:
    """A mixture's isotherm next to its critical temperature, where no saturation
    state at *temperature* can be computed (CoolProp's T–Q flash fails there).

    The phase envelope of the bulk composition says where the isotherm enters
    and leaves the two-phase region (:func:`coldroom.physics.refrigerant.envelope_crossings`).
    Outside it, by more than :data:`ENVELOPE_MARGIN` in pressure, the states are
    P–T states of the one phase there (vapour below, liquid or dense gas above;
    with no crossing, one supercritical piece); inside, the two-phase grid's
    levels give the points the saturation functions reach (none, mostly, so
    close to the critical point). Where no state can be computed the line has
    a gap. The tests check every point against CoolProp's P–H flash.
    """
    from coldroom.physics.refrigerant import envelope_crossings

    try:
        crossings = envelope_crossings(fluid, temperature)
    except PropertyRangeError:
        return None

    def run(pressures: Sequence[float], order: Sequence[str]) -> tuple[Point, ...]:
        return _states_along(fluid, temperature, pressures, order)

    segments: list[tuple[Point, ...]] = []
    phases: list[str] = []
    if not crossings:
        if temperature <= fluid.critical_temperature:
            return None  # below the critical temperature the envelope must be crossed: trace incomplete
        # one phase at every pressure: above the envelope's highest temperature
        line = run(_geometric(p_high, p_low, 30) + _near_pressures(fluid.critical_pressure, p_low, p_high), ("gas", "liquid"))
        segments.append(tuple(sorted(set(line), key=lambda pt: -pt[1])))
        phases.append("supercritical")
    else:
        enter, leave = crossings[0], crossings[-1]
        top = leave * (1.0 + ENVELOPE_MARGIN)
        if top < p_high:
            segments.append(run(_geometric(top, p_high, 12, 1.6), ("liquid",)))
            phases.append("liquid")
        wet = [
            (level.enthalpy(level.quality_at(temperature)), level.pressure)
            for level in reversed(grid)
            if enter < level.pressure < leave and level.temperatures[0] < temperature < level.temperatures[-1]
        ]
        segments.append(tuple(wet))
        phases.append("two-phase")
        bottom = enter * (1.0 - ENVELOPE_MARGIN)
        if bottom > p_low:
            # CoolProp's gas-phase P–T solver sometimes fails right next to the dew
            # line: extra pressures there keep the gap short
            near = [bottom * f for f in (0.99, 0.98, 0.96) if bottom * f > p_low]
            pressures = sorted(set(_geometric(bottom, p_low, 14, 1.5) + near), reverse=True)
            segments.append(run(pressures, ("gas",)))
            phases.append("vapour")
    kept = [(s, ph) for s, ph in zip(segments, phases) if len(s) >= 2]
    if not kept:
        return None
    return ChartLine("isotherm", float(temperature), tuple(s for s, _ in kept), tuple(ph for _, ph in kept))


def _near_pressures(pressure: float, p_low: float, p_high: float) -> list[float]:
    """Extra pressures within ±15 % of *pressure* (an isotherm bends sharply there)."""
    return [pressure * f for f in (0.85, 0.9, 0.94, 0.97, 0.99, 1.01, 1.03, 1.06, 1.1, 1.15)
            if p_low < pressure * f < p_high]


def _any_isotherm(fluid, temperature: float, p_low: float, p_high: float, grid: Sequence[_Level]) -> ChartLine | None:
    """:func:`_isotherm`, and for a mixture next to its critical temperature,
    where that finds no line, :func:`_near_critical_isotherm`."""
    line = _isotherm(fluid, temperature, p_low, p_high, grid)
    tc = fluid.critical_temperature
    if line is None and fluid.info.model == "mixture" and tc - BAND_BELOW < temperature < tc + BAND_ABOVE:
        line = _near_critical_isotherm(fluid, temperature, p_low, p_high, grid)
    return line


def _pseudo_pure_two_phase(fluid, pressure: float, temperature: float) -> float:
    """Enthalpy [J/kg] of a pseudo-pure blend's two-phase state at *pressure* and *temperature*.

    The property library's pseudo-pure models interpolate temperature and
    enthalpy linearly in quality between their bubble and dew states, so the
    same interpolation finds the state it would.
    """
    bub = fluid.saturated_state(0.0, pressure=pressure)
    dew = fluid.saturated_state(1.0, pressure=pressure)
    q = (temperature - bub.t) / (dew.t - bub.t)
    if not 0.0 <= q <= 1.0:
        raise PropertyRangeError(f"{temperature} °C is outside the glide at {pressure} Pa")
    return bub.h + q * (dew.h - bub.h)


def _dew_temperature_floor(fluid, grid: Sequence[_Level], pressure: float) -> float | None:
    """A mixture's dew temperature at *pressure* [°C] from the grid (1/T linear in ln p,
    the Clausius–Clapeyron form, common practice), the critical temperature
    above 1.05 × critical pressure, ``None`` in between or below the grid."""
    if pressure >= 1.05 * fluid.critical_pressure:
        return fluid.critical_temperature + 1.0
    for a, b in zip(grid, grid[1:]):
        if a.pressure <= pressure <= b.pressure:
            f = math.log(pressure / a.pressure) / math.log(b.pressure / a.pressure)
            ta, tb = a.temperatures[-1] + ZERO_CELSIUS_K, b.temperatures[-1] + ZERO_CELSIUS_K
            return 1.0 / (1.0 / ta + f * (1.0 / tb - 1.0 / ta)) - ZERO_CELSIUS_K + 0.05
    return None


def _isentrope(fluid, entropy: float, p_low: float, p_high: float, grid: Sequence[_Level]) -> ChartLine | None:
    """One isentrope in the vapour (and supercritical) region of the window."""
    from coldroom.physics.refrigerant import chart_state_ps

    mixture = fluid.info.model == "mixture"
    points: list[Point] = []
    guess = None
    for p in _geometric(p_low, p_high, 24):
        floor = _dew_temperature_floor(fluid, grid, p) if mixture else 0.0
        if floor is None:
            continue
        try:
            s = chart_state_ps(fluid, p, entropy, floor, guess)
        except PropertyRangeError:
            if not points or mixture:
                continue
            break
        guess = s.t
        if s.quality is not None and s.quality < 1.0:
            points = []  # inside the dome: the line starts above
            continue
        points.append((s.h, s.p))
    if len(points) < 2:
        return None
    return ChartLine("isentrope", float(entropy), (tuple(points),), ("vapour",))


def _quality_lines(fluid, bubble: Sequence[Point], dew: Sequence[Point], grid: Sequence[_Level]) -> tuple[ChartLine, ...]:
    """Lines of constant quality: at the dome's levels (pure: h linear in
    quality at fixed pressure), at the two-phase grid's levels (mixtures)."""
    lines = []
    for x in QUALITIES:
        if fluid.info.model == "mixture":
            points = [(level.enthalpy(x), level.pressure) for level in grid]
        else:
            points = [(hl + x * (hv - hl), p) for (hl, p), (hv, _) in zip(bubble, dew)]
        if len(points) >= 2:
            lines.append(ChartLine("quality", x, (tuple(points),), ("two-phase",)))
    return tuple(lines)


@lru_cache(maxsize=32)
def chart_data(
    refrigerant: str,
    pressure_low: float,
    pressure_high: float,
    isotherm_temperatures: tuple[float, ...],
    isentrope_entropies: tuple[float, ...],
) -> ChartData:
    """The chart's lines for *refrigerant* in the window [*pressure_low*, *pressure_high*] [Pa].

    Cached per process on all arguments, and on disk (:mod:`coldroom.physics.disk_cache`,
    the value read back is equal to the one computed): pass rounded values (see
    :func:`coldroom.output.pdf.phchart.chart_for_cycle`).

    Parameters
    ----------
    refrigerant : str
        Catalogue name.
    pressure_low, pressure_high : float
        Window [Pa], absolute.
    isotherm_temperatures : tuple of float
        [°C]
    isentrope_entropies : tuple of float
        [J/(kg·K)]

    Returns
    -------
    ChartData
    """
    from coldroom.physics import disk_cache
    from coldroom.physics.refrigerant import coolprop_version

    key = {
        "CoolProp": coolprop_version(),
        "refrigerant": refrigerant,
        "pressure_low": pressure_low,
        "pressure_high": pressure_high,
        "isotherms": list(isotherm_temperatures),
        "isentropes": list(isentrope_entropies),
    }
    kept = disk_cache.load("chart", key)
    if kept is not None:
        try:
            return _from_json(kept)
        except (KeyError, TypeError, ValueError):
            pass  # a damaged entry: computed again and rewritten
    data = _compute(refrigerant, pressure_low, pressure_high, isotherm_temperatures, isentrope_entropies)
    disk_cache.store("chart", key, _to_json(data))
    return data


def _line_to_json(line: ChartLine) -> list:
    return [line.kind, line.value, [[list(point) for point in segment] for segment in line.segments], list(line.phases)]


def _line_from_json(item: Sequence) -> ChartLine:
    kind, value, segments, phases = item
    return ChartLine(
        str(kind), float(value), tuple(tuple((float(h), float(p)) for h, p in segment) for segment in segments),
        tuple(str(phase) for phase in phases),
    )


def _to_json(data: ChartData) -> dict:
    """*data* as JSON-able lists and numbers (floats kept exactly: JSON carries their round-trip text)."""
    return {
        "refrigerant": data.refrigerant,
        "pressure_low": data.pressure_low,
        "pressure_high": data.pressure_high,
        "bubble": [list(point) for point in data.bubble],
        "dew": [list(point) for point in data.dew],
        "critical_pressure": data.critical_pressure,
        "critical_enthalpy": data.critical_enthalpy,
        "critical_temperature": data.critical_temperature,
        "isotherms": [_line_to_json(line) for line in data.isotherms],
        "isentropes": [_line_to_json(line) for line in data.isentropes],
        "qualities": [_line_to_json(line) for line in data.qualities],
    }


def _from_json(item: dict) -> ChartData:
    """The :class:`ChartData` that :func:`_to_json` wrote (equal to it, tested)."""
    return ChartData(
        refrigerant=str(item["refrigerant"]),
        pressure_low=float(item["pressure_low"]),
        pressure_high=float(item["pressure_high"]),
        bubble=tuple((float(h), float(p)) for h, p in item["bubble"]),
        dew=tuple((float(h), float(p)) for h, p in item["dew"]),
        critical_pressure=float(item["critical_pressure"]),
        critical_enthalpy=float(item["critical_enthalpy"]),
        critical_temperature=float(item["critical_temperature"]),
        isotherms=tuple(_line_from_json(line) for line in item["isotherms"]),
        isentropes=tuple(_line_from_json(line) for line in item["isentropes"]),
        qualities=tuple(_line_from_json(line) for line in item["qualities"]),
    )


def _compute(
    refrigerant: str,
    pressure_low: float,
    pressure_high: float,
    isotherm_temperatures: tuple[float, ...],
    isentrope_entropies: tuple[float, ...],
) -> ChartData:
    """:func:`chart_data` computed (no cache)."""
    from coldroom.physics.refrigerant import critical_enthalpy, get_fluid

    fluid = get_fluid(refrigerant)
    p_low = max(pressure_low, fluid.minimum_pressure * 1.001)
    grid = _mixture_grid(fluid, p_low) if fluid.info.model == "mixture" else []
    bubble, dew = _dome(fluid, p_low, grid)
    isotherms = tuple(
        line
        for line in (_any_isotherm(fluid, t, p_low, pressure_high, grid) for t in isotherm_temperatures)
        if line is not None
    )
    isentropes = tuple(
        line
        for line in (_isentrope(fluid, s, p_low, pressure_high, grid) for s in isentrope_entropies)
        if line is not None
    )
    return ChartData(
        refrigerant=fluid.info.name,
        pressure_low=p_low,
        pressure_high=pressure_high,
        bubble=tuple(bubble),
        dew=tuple(dew),
        critical_pressure=fluid.critical_pressure,
        critical_enthalpy=critical_enthalpy(fluid),
        critical_temperature=fluid.critical_temperature,
        isotherms=isotherms,
        isentropes=isentropes,
        qualities=_quality_lines(fluid, bubble, dew, grid),
    )
