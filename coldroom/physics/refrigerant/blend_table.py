"""Saturation and two-phase states of CoolProp's predefined mixtures (``R448A.mix`` …), fast.

CoolProp is slow for them: a P–Q saturation flash costs 1.5–4 ms, a P–H or P–S
flash 0.3–0.5 s. So:

* saturation comes from a table built once per process and refrigerant
  (:class:`MixtureTable`): dew and bubble temperature and the incipient
  phase's composition against ln p, as Chebyshev series on segments 0.25 wide
  in ln p, each segment fitted to eight of CoolProp's own P–Q solutions the
  first time a pressure in it is asked for (a fit depends on its own nodes
  only, so the order of fitting changes nothing; the fitted segments are kept
  on disk between runs, :mod:`coldroom.physics.disk_cache`, and read back bit
  for bit). The series reproduce CoolProp's saturation temperatures to about 1e-9 K. The saturated state itself is then
  the equation of state evaluated at the table's (p, T) with the phase
  imposed (its density solve started from the table's density), so h, s and
  ρ are the EOS's; pressures outside the table (or a
  segment CoolProp cannot fit) fall back to CoolProp's flash;
* two-phase: an isobaric flash by successive substitution on the
  equilibrium ratios K = φ_L/φ_V (fugacity coefficients of the two phases
  from the EOS at imposed phase) with the Rachford–Rice equation for the
  vapour fraction, and a Newton/secant step on temperature for a given h or s
  (Michelsen & Mollerup, *Thermodynamic Models: Fundamentals and
  Computational Aspects*, 2nd ed., ch. 10 (successive substitution) [mem]).
  Its start comes from the table's end compositions;
* where CoolProp's own mixture saturation solver fails from its own start,
  :func:`saturation_continuation` walks to the point from a nearby one.

Superheated and subcooled states are :class:`~coldroom.physics.refrigerant.fluid.Fluid`'s
(a Newton iteration on temperature with the phase imposed).
"""

from __future__ import annotations

import atexit
import math
import weakref
from typing import TYPE_CHECKING, NamedTuple

import CoolProp
import CoolProp.CoolProp as CP
from CoolProp.CoolProp import AbstractState, PyGuessesStructure

from coldroom.constants import ZERO_CELSIUS_K
from coldroom.errors import PropertyRangeError
from coldroom.physics.refrigerant.state import StatePoint, _finite

if TYPE_CHECKING:
    from coldroom.physics.refrigerant.fluid import Fluid


# Saturation table of a mixture: width of one segment in ln(p/Pa) and the
# number of Chebyshev nodes in it. Eight nodes on 0.25 reproduce CoolProp's
# dew and bubble temperatures to ~1e-9 K over the working range (checked by
# tests/validation/test_refrigerant.py) (common practice, no source).
_SEGMENT_WIDTH = 0.25
_SEGMENT_NODES = 8


def _chebyshev_fit(values: list[float]) -> list[float]:
    """Coefficients of the Chebyshev series through *values* at the Gauss
    nodes cos(π(k + ½)/N) (discrete cosine transform; any numerical-methods
    text, e.g. Press et al., *Numerical Recipes*, 3rd ed., §5.8 [mem])."""
    n = len(values)
    return [
        (2.0 if j else 1.0) / n * sum(v * math.cos(math.pi * j * (k + 0.5) / n) for k, v in enumerate(values))
        for j in range(n)
    ]


def _chebyshev(coefficients: list[float], x: float) -> float:
    """Clenshaw's recurrence for Σ c_j T_j(x), x in [−1, 1] (same source)."""
    b1 = b2 = 0.0
    two_x = 2.0 * x
    for c in coefficients[:0:-1]:
        b1, b2 = two_x * b1 - b2 + c, b1
    return x * b1 - b2 + coefficients[0]


class _Segment(NamedTuple):
    """One fitted piece of a :class:`MixtureTable` line: ln p from *a* to *b* and the
    Chebyshev series of the saturation temperature [K], of each incipient-phase mole
    fraction and of the saturated density [kg/m³] on it."""

    a: float
    b: float
    temperature: list[float]
    composition: list[list[float]]
    density: list[float]

    def x(self, u: float) -> float:
        """ln p = *u* mapped onto the series' interval [−1, 1]."""
        return (2.0 * u - self.a - self.b) / (self.b - self.a)


#: The tables alive in this process, written to the disk cache at exit (:meth:`MixtureTable.keep`;
#: weak references: a table goes with its fluid).
_TABLES: "weakref.WeakSet[MixtureTable]" = weakref.WeakSet()


def keep_tables() -> None:
    """Write every table's new segments to the disk cache (run at exit)."""
    for table in list(_TABLES):
        try:
            table.keep()
        except Exception:  # noqa: BLE001 - a cache must never fail a run at exit
            pass


atexit.register(keep_tables)


class MixtureTable:
    """Saturation table and two-phase flash of one predefined mixture.

    Segment *k* covers ln p in [u₀ + k·w, u₀ + (k+1)·w] (w = 0.25, u₀ = ln of
    the minimum pressure, top at 0.95 × the critical pressure) and holds, for
    the dew line and for the bubble line separately, Chebyshev series of the
    saturation temperature [K], of the incipient phase's mole fractions
    (liquid at the dew point, vapour at the bubble point) and of the saturated
    density (the seed of the equation of state's density solve). A segment is fitted
    the first time it is needed, from CoolProp's P–Q solutions at its nodes; a
    segment CoolProp cannot fit is remembered as missing (the caller falls
    back to CoolProp's flash at the point asked).
    """

    def __init__(self, fluid: Fluid) -> None:
        self.fluid = fluid
        st = fluid._state
        self.z = list(st.get_mole_fractions())
        self.molar_mass = st.molar_mass()
        components = "&".join(st.fluid_names())
        self.liquid = AbstractState("HEOS", components)
        self.vapour = AbstractState("HEOS", components)
        for phase_state, phase in ((self.liquid, CP.iphase_liquid), (self.vapour, CP.iphase_gas)):
            phase_state.set_mole_fractions(self.z)
            phase_state.specify_phase(phase)
        self.u_low = math.log(fluid.minimum_pressure)
        self.u_high = math.log(0.95 * fluid.critical_pressure)
        self.last = max(0, math.ceil((self.u_high - self.u_low) / _SEGMENT_WIDTH) - 1)
        # (segment index, quality) -> the fitted segment, or None where CoolProp cannot fit one
        self.segments: dict[tuple[int, float], _Segment | None] = {}
        self._kept = 0  # segments that came from (or went to) the disk cache
        self._read_back()

    # ---------------------------------------------------------- the disk cache
    def _cache_key(self) -> dict:
        """What the fitted segments depend on: the mixture, the table's layout, the CoolProp version."""
        return {"CoolProp": str(CoolProp.__version__), "mixture": self.fluid.info.coolprop_name,
                "segment_width": _SEGMENT_WIDTH, "nodes": _SEGMENT_NODES, "u_low": self.u_low, "u_high": self.u_high}

    def _read_back(self) -> None:
        """The segments an earlier run fitted (:mod:`coldroom.physics.disk_cache`), bit for bit the
        same as fitting them again (a segment's fit depends on nothing but its own nodes, tested)."""
        from coldroom.physics import disk_cache

        _TABLES.add(self)
        kept = disk_cache.load("blend-table", self._cache_key())
        try:
            segments = {(int(k), float(q)): None if fit is None else _Segment(
                float(fit[0]), float(fit[1]), [float(v) for v in fit[2]], [[float(v) for v in c] for c in fit[3]],
                [float(v) for v in fit[4]]) for k, q, fit in (kept or [])}
        except (TypeError, ValueError, IndexError):
            return  # a damaged entry: fitted again and rewritten at exit
        self.segments.update(segments)
        self._kept = len(self.segments)

    def keep(self) -> None:
        """Write the segments fitted in this process to the disk cache (with those kept by others)."""
        from coldroom.physics import disk_cache

        if len(self.segments) <= self._kept:
            return
        key = self._cache_key()
        merged = {(int(k), float(q)): fit for k, q, fit in (disk_cache.load("blend-table", key) or [])}
        merged.update({key_: None if seg is None else [seg.a, seg.b, seg.temperature, seg.composition, seg.density]
                       for key_, seg in self.segments.items()})
        disk_cache.store("blend-table", key, [[k, q, fit] for (k, q), fit in sorted(merged.items())])
        self._kept = len(self.segments)

    # ------------------------------------------------------------- the table
    def _segment(self, k: int, quality: float) -> _Segment | None:
        key = (k, quality)
        if key in self.segments:
            return self.segments[key]
        a = self.u_low + k * _SEGMENT_WIDTH
        b = min(a + _SEGMENT_WIDTH, self.u_high)
        st = self.fluid._state
        temperatures, compositions, densities = [], [], []
        try:
            for j in range(_SEGMENT_NODES):
                u = 0.5 * (a + b) + 0.5 * (b - a) * math.cos(math.pi * (j + 0.5) / _SEGMENT_NODES)
                self.fluid._saturation_raw("P", math.exp(u), quality)
                temperatures.append(st.T())
                compositions.append(list(st.mole_fractions_liquid() if quality == 1.0 else st.mole_fractions_vapor()))
                densities.append(st.rhomass())
        except (PropertyRangeError, ValueError):
            segment = None
        else:
            series = [_chebyshev_fit([c[i] for c in compositions]) for i in range(len(self.z))]
            segment = _Segment(a, b, _chebyshev_fit(temperatures), series, _chebyshev_fit(densities))
        self.segments[key] = segment
        return segment

    def _locate(self, u: float, quality: float) -> _Segment | None:
        if not self.u_low <= u <= self.u_high:
            return None
        k = min(int((u - self.u_low) / _SEGMENT_WIDTH), self.last)
        return self._segment(k, quality)

    def temperature(self, u: float, quality: float) -> float | None:
        """Dew (quality 1) or bubble (0) temperature [K] at ln p = *u*, or None."""
        segment = self._locate(u, quality)
        if segment is None:
            return None
        return _chebyshev(segment.temperature, segment.x(u))

    def density(self, u: float, quality: float) -> float:
        """Dew-point vapour (quality 1) or bubble-point liquid (0) density [kg/m³] at
        ln p = *u*, near enough to seed the equation of state's density solve; 0 outside
        the table."""
        segment = self._locate(u, quality)
        if segment is None:
            return 0.0
        return _chebyshev(segment.density, segment.x(u))

    def incipient(self, u: float, quality: float) -> list[float] | None:
        """Mole fractions of the incipient phase at ln p = *u* (liquid at the
        dew point, vapour at the bubble point), or None."""
        segment = self._locate(u, quality)
        if segment is None:
            return None
        x = segment.x(u)
        values = [max(_chebyshev(c, x), 1e-300) for c in segment.composition]
        total = sum(values)
        return [v / total for v in values]

    def log_pressure(self, temperature: float, quality: float) -> float | None:
        """ln p at which the dew (bubble) temperature is *temperature* [K], or None.

        The answer depends on one segment only, the lowest whose top temperature is at or
        above *temperature* (so a table whose segments were fitted in another order, or read
        back from the disk cache, gives the same digits): a first guess (a Clausius–Clapeyron
        line, ln p linear in 1/T, through the nearest segment already fitted, else through the
        minimum and critical points) only picks where the search for that segment starts;
        Newton then runs on that segment's series alone, from the Clausius–Clapeyron line
        through its two ends.
        """
        k = self._start_segment(temperature, quality)
        visited: set[int] = set()
        for _ in range(2 * self.last + 4):  # each pass visits a new segment or steps to a visited neighbour
            segment = self._segment(k, quality)
            if segment is None:
                return None
            t_a, t_b = _chebyshev(segment.temperature, -1.0), _chebyshev(segment.temperature, 1.0)
            visited.add(k)
            if temperature > t_b:  # above this segment: up (jumping by its own slope)
                if k == self.last:
                    return None
                k = max(k + 1, min(self._segment_at(segment, t_a, t_b, temperature), self.last))
                continue
            if temperature <= t_a + 1e-4 and k > 0:  # at or below its foot: is the one below the lowest?
                below = self._segment(k - 1, quality)
                if below is None:
                    return None
                if temperature <= _chebyshev(below.temperature, 1.0):
                    if k - 1 in visited:
                        k -= 1
                        continue
                    k = min(k - 1, max(self._segment_at(segment, t_a, t_b, temperature), 0))
                    continue
            elif temperature < t_a:  # below the lowest segment
                return None
            break
        else:  # pragma: no cover - the search always settles on a monotone line
            return None
        a, b, series = segment.a, segment.b, segment.temperature
        u = a + (b - a) * (1.0 / t_a - 1.0 / temperature) / (1.0 / t_a - 1.0 / t_b)
        for _ in range(40):
            x = segment.x(u)
            t = _chebyshev(series, x)
            if abs(temperature - t) <= 1e-11 * temperature:
                return u
            dx = 1e-6
            slope = (_chebyshev(series, x + dx) - _chebyshev(series, x - dx)) / (2.0 * dx) * 2.0 / (b - a)
            u += (temperature - t) / slope
        return None  # pragma: no cover - Newton on a monotone smooth series

    def _segment_at(self, segment: _Segment, t_a: float, t_b: float, temperature: float) -> int:
        """The segment index where *segment*'s Clausius–Clapeyron line reaches *temperature*."""
        u = segment.a + (segment.b - segment.a) * (1.0 / t_a - 1.0 / temperature) / (1.0 / t_a - 1.0 / t_b)
        return int(math.floor((u - self.u_low) / _SEGMENT_WIDTH))

    def _start_segment(self, temperature: float, quality: float) -> int:
        """Where the search for *temperature*'s segment starts (a guess: it changes the work, never the answer)."""
        guess = None
        for (k, q), segment in self.segments.items():
            if q != quality or segment is None:
                continue
            t_a, t_b = _chebyshev(segment.temperature, -1.0), _chebyshev(segment.temperature, 1.0)
            distance = min(abs(temperature - t_a), abs(temperature - t_b))
            if guess is None or distance < guess[0]:
                guess = (distance, self._segment_at(segment, t_a, t_b, temperature))
        if guess is None:
            t_low = self.fluid.minimum_temperature + ZERO_CELSIUS_K + 1.0
            t_crit = self.fluid.critical_temperature + ZERO_CELSIUS_K
            slope = (math.log(self.fluid.critical_pressure) - self.u_low) / (1.0 / t_low - 1.0 / t_crit)
            k = int(math.floor(slope * (1.0 / t_low - 1.0 / temperature) / _SEGMENT_WIDTH))
        else:
            k = guess[1]
        return min(max(k, 0), self.last)

    # ------------------------------------------------ saturated states
    def saturation(self, given: str, value_si: float, quality: float) -> StatePoint | None:
        """Dew (quality 1) or bubble (0) state of a mixture from the table: the
        table gives the saturation temperature (or pressure), the EOS the state
        at that (p, T) with the bulk phase imposed. None outside the table."""
        table = self
        if given == "P":
            pressure = value_si
            u = math.log(pressure)
            t_k = table.temperature(u, quality)
        else:
            t_k = value_si
            u = table.log_pressure(t_k, quality)
            pressure = math.exp(u) if u is not None else None
        if t_k is None or pressure is None:
            return None
        try:
            # the table's saturated density seeds the density solve (a quarter of the cost)
            self.fluid._update_pt(pressure, t_k, CP.iphase_gas if quality == 1.0 else CP.iphase_liquid,
                                  table.density(u, quality))
            state = self.fluid._read(quality)
        except ValueError:
            return None
        if not _finite(state.p, state.t, state.h, state.s, state.density):
            return None
        return state

    # --------------------------------------------------------- two-phase flash
    def flash(self, pressure: float, spec: str, target: float, bub: StatePoint, dew: StatePoint) -> StatePoint | None:
        """Two-phase state at *pressure* [Pa] with temperature (*spec* "t",
        target in °C), enthalpy ("h", J/kg) or entropy ("s", J/(kg·K)).

        Successive substitution on ln K with the Rachford–Rice vapour fraction
        (see the module docstring); returns None when the table has no end
        compositions at this pressure or the iteration fails (the caller then
        uses CoolProp's flash).
        """
        u = math.log(pressure)
        y_bub = self.incipient(u, 0.0)
        x_dew = self.incipient(u, 1.0)
        if y_bub is None or x_dew is None:
            return None
        z, n, mm = self.z, len(self.z), self.molar_mass
        t_bub, t_dew = bub.t + ZERO_CELSIUS_K, dew.t + ZERO_CELSIUS_K
        ln_k_bub = [math.log(y_bub[i] / z[i]) for i in range(n)]
        ln_k_dew = [math.log(z[i] / x_dew[i]) for i in range(n)]
        if spec == "t":
            t = target + ZERO_CELSIUS_K
        else:
            v_bub, v_dew = (bub.h, dew.h) if spec == "h" else (bub.s, dew.s)
            t = t_bub + (target - v_bub) / (v_dew - v_bub) * (t_dew - t_bub)
            goal = target * mm  # molar
            slope = (v_dew - v_bub) * mm / (t_dew - t_bub)
        # d ln K_i/dT along the isobar, estimated across the glide: moves the
        # equilibrium ratios with each temperature step (a predictor), so the
        # secant on temperature sees h (or s) of nearly converged phases
        drift = [(ln_k_dew[i] - ln_k_bub[i]) / (t_dew - t_bub) for i in range(n)]
        ln_k = [ln_k_bub[i] + (t - t_bub) * drift[i] for i in range(n)]
        beta = min(max((t - t_bub) / (t_dew - t_bub), 0.0), 1.0)
        liquid, vapour = self.liquid, self.vapour
        # density guesses (the last iterate's) halve the cost of each P–T update
        guess_l, guess_v = PyGuessesStructure(), PyGuessesStructure()
        guess_l.rhomolar, guess_v.rhomolar = bub.density / mm, dew.density / mm
        try:
            for _ in range(80):
                k_values = [math.exp(v) for v in ln_k]
                beta = _rachford_rice(z, k_values, beta)
                x = [z[i] / (1.0 + beta * (k_values[i] - 1.0)) for i in range(n)]
                y = [k_values[i] * x[i] for i in range(n)]
                sx, sy = sum(x), sum(y)
                x = [v / sx for v in x]
                y = [v / sy for v in y]
                liquid.set_mole_fractions(x)
                liquid.update_with_guesses(CP.PT_INPUTS, pressure, t, guess_l)
                vapour.set_mole_fractions(y)
                vapour.update_with_guesses(CP.PT_INPUTS, pressure, t, guess_v)
                guess_l.rhomolar, guess_v.rhomolar = liquid.rhomolar(), vapour.rhomolar()
                new = [math.log(liquid.fugacity_coefficient(i) / vapour.fugacity_coefficient(i)) for i in range(n)]
                change = max(abs(new[i] - ln_k[i]) for i in range(n))
                ln_k = new
                if spec == "t":
                    if change < 1e-9:
                        break
                    continue
                if spec == "h":
                    value = (1.0 - beta) * liquid.hmolar() + beta * vapour.hmolar()
                else:
                    value = (1.0 - beta) * liquid.smolar() + beta * vapour.smolar()
                g = value - goal
                step = -g / slope
                if change < 1e-9 and abs(g) <= 1e-9 * max(abs(goal), 1.0):
                    break
                t_new = min(max(t + step, t_bub), t_dew)
                ln_k = [ln_k[i] + (t_new - t) * drift[i] for i in range(n)]
                t = t_new
            else:
                return None
        except ValueError:
            return None
        if not 0.0 <= beta <= 1.0:
            return None
        h = ((1.0 - beta) * liquid.hmolar() + beta * vapour.hmolar()) / mm
        s = ((1.0 - beta) * liquid.smolar() + beta * vapour.smolar()) / mm
        density = mm / (beta / vapour.rhomolar() + (1.0 - beta) / liquid.rhomolar())
        return StatePoint(pressure, t - ZERO_CELSIUS_K, h, s, beta, density)


def _rachford_rice(z: list[float], k_values: list[float], beta: float) -> float:
    """Vapour mole fraction β in [0, 1] solving Σ zᵢ(Kᵢ − 1)/(1 + β(Kᵢ − 1)) = 0
    (Rachford & Rice 1952; Newton safeguarded by bisection) [mem]."""
    def f(b: float) -> tuple[float, float]:
        value = slope = 0.0
        for zi, ki in zip(z, k_values):
            d = ki - 1.0
            q = 1.0 + b * d
            value += zi * d / q
            slope -= zi * d * d / (q * q)
        return value, slope

    if f(0.0)[0] <= 0.0:
        return 0.0
    if f(1.0)[0] >= 0.0:
        return 1.0
    lo, hi = 0.0, 1.0
    b = min(max(beta, 0.0), 1.0)
    for _ in range(100):
        value, slope = f(b)
        if value > 0:
            lo = b
        else:
            hi = b
        step = -value / slope
        b_new = b + step
        if not lo < b_new < hi:
            b_new = 0.5 * (lo + hi)
        if abs(b_new - b) < 1e-15:
            return b_new
        b = b_new
    return b


def _guesses(st: AbstractState) -> PyGuessesStructure:
    """Guesses for a nearby mixture saturation solve, from the state *st* is in."""
    g = PyGuessesStructure()
    g.T = st.T()
    g.p = st.p()
    g.rhomolar_liq = st.saturated_liquid_keyed_output(CP.iDmolar)
    g.rhomolar_vap = st.saturated_vapor_keyed_output(CP.iDmolar)
    g.x = list(st.mole_fractions_liquid())
    g.y = list(st.mole_fractions_vapor())
    return g


def saturation_continuation(fluid: Fluid, given: str, value_si: float, quality: float) -> None:
    """Fallback when CoolProp's mixture saturation solver fails from its own
    start (it does at scattered points, e.g. R407F.mix bubble at 50–58 °C):
    find a nearby temperature it can solve, then walk to the target in
    steps of at most 2 K, each solve started from the previous solution
    (``update_with_guesses``). For a pressure target, the walk is a secant
    on ln p against 1/T (Clausius–Clapeyron form, common practice), solved to
    round-off with Q–T solves. Leaves the state in ``fluid._state``.
    """
    st = fluid._state
    t_top = fluid.critical_temperature + ZERO_CELSIUS_K - fluid._margin
    t_start = min(value_si, t_top) if given == "T" else t_top - 3.0
    anchor = None
    for k in range(1, 60):
        t = t_start - 1.5 * k
        if t < fluid.minimum_temperature + ZERO_CELSIUS_K + 1.0:
            break
        try:
            st.update(CP.QT_INPUTS, quality, t)
        except ValueError:
            continue
        if given == "P" and st.p() >= value_si:
            continue  # anchor on the low-pressure side, away from the critical point
        anchor = (t, st.p(), _guesses(st))
        break
    if anchor is None:
        raise ValueError("no nearby saturation state converges")
    t_now, p_now, guess = anchor
    if given == "T":
        while abs(value_si - t_now) > 1e-12:
            t_next = t_now + max(-2.0, min(2.0, value_si - t_now))
            st.update_with_guesses(CP.QT_INPUTS, quality, t_next, guess)
            t_now, guess = t_next, _guesses(st)
        return
    # pressure target: secant on ln p vs 1/T, solved to round-off; the final
    # state is the Q–T state at the temperature found
    t_prev, p_prev = t_now, p_now
    t_now = t_now + 0.5
    st.update_with_guesses(CP.QT_INPUTS, quality, t_now, guess)
    p_now, guess = st.p(), _guesses(st)
    for _ in range(60):
        if abs(math.log(p_now / value_si)) < 1e-13 or t_now == t_prev:
            return
        slope = (math.log(p_now) - math.log(p_prev)) / (1.0 / t_now - 1.0 / t_prev)
        t_target = 1.0 / (1.0 / t_now + (math.log(value_si) - math.log(p_now)) / slope)
        t_next = t_now + max(-2.0, min(2.0, t_target - t_now))
        st.update_with_guesses(CP.QT_INPUTS, quality, t_next, guess)
        t_prev, p_prev = t_now, p_now
        t_now, p_now, guess = t_next, st.p(), _guesses(st)
    raise ValueError("saturation temperature iteration did not converge")
