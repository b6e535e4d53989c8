"""Refrigerant properties: the only module that imports CoolProp.

:func:`get_fluid` returns a cached :class:`Fluid` per catalogue entry; a Fluid
gives saturation at dew and bubble points, single-phase and two-phase states
as :class:`StatePoint` (SI; temperature in °C), and data for p–h diagrams.
Enthalpy and entropy are in CoolProp's default reference state [ref:coolprop] (IIR for the
halocarbons: h = 200 kJ/kg, s = 1 kJ/kg·K for saturated liquid at 0 °C).

Speed. Pure and pseudo-pure fluids use CoolProp's own flashes through
``AbstractState`` (microseconds). Predefined mixtures (``R448A.mix`` …) are
slow in CoolProp: a P–Q saturation flash costs 1.5–4 ms, a P–H or P–S flash
0.3–0.5 s. For them:

* saturation comes from a table built once per process and refrigerant
  (:class:`_MixtureTable`): dew and bubble temperature and the incipient
  phase's composition against ln p, as Chebyshev series on segments 0.25 wide
  in ln p, each segment fitted to eight of CoolProp's own P–Q solutions the
  first time a pressure in it is asked for. The series reproduce CoolProp's
  saturation temperatures to about 1e-9 K. The saturated state itself is then
  the equation of state evaluated at the table's (p, T) with the phase
  imposed (its density solve started from the table's density), so h, s and
  ρ are the EOS's; pressures outside the table (or a
  segment CoolProp cannot fit) fall back to CoolProp's flash;
* superheated vapour / subcooled liquid: Newton iteration on temperature with
  a P–T update whose phase is *imposed* (``specify_phase``; ~0.07 ms instead of
  ~12 ms, because CoolProp then skips its stability analysis), using
  (∂h/∂T)_p = c_p and (∂s/∂T)_p = c_p/T, safeguarded by a bracket; the imposed
  phase is valid because the bracket lies on the right side of the dew/bubble
  point found first;
* two-phase: an isobaric flash by successive substitution on the
  equilibrium ratios K = φ_L/φ_V (fugacity coefficients of the two phases
  from the EOS at imposed phase) with the Rachford–Rice equation for the
  vapour fraction, and a Newton/secant step on temperature for a given h or s
  (Michelsen & Mollerup, *Thermodynamic Models: Fundamentals and
  Computational Aspects*, 2nd ed., ch. 10 (successive substitution) [mem]).
  Its start comes from the table's end compositions.

The result is the same equation-of-state state CoolProp's flash finds (the
tests compare both over the working envelope to 1e-6 K).
``method="flash"`` forces CoolProp's own flash (the reference).

Guards: every entry point checks its inputs against the triple (or minimum)
temperature and pressure and the critical point before calling CoolProp, and
checks the result after (CoolProp can return e.g. a CO₂ dew temperature below
the triple point without complaint); failures raise
:class:`coldroom.errors.PropertyRangeError` with the quantity, value and range.

A Fluid is not thread-safe (it owns one mutable CoolProp AbstractState).

Examples
--------
>>> fluid = get_fluid("R134a")
>>> round(fluid.dew_pressure(0.0) / 1e3, 1)          # kPa at 0 °C
292.8
>>> round(fluid.bubble_temperature(1e6), 2)           # °C at 1 MPa
39.39
"""

from __future__ import annotations

import math
from dataclasses import dataclass
from functools import lru_cache
from typing import NamedTuple

import CoolProp  # the only CoolProp import in coldroom
import CoolProp.CoolProp as CP
from CoolProp.CoolProp import AbstractState, PyGuessesStructure

from coldroom.data.refrigerants import RefrigerantInfo, lookup
from coldroom.errors import PropertyRangeError

KELVIN = 273.15  # K at 0 °C (exact, SI definition)

#: Critical points of the predefined mixtures [K, Pa], computed once with
#: CoolProp 8.0.0 ``AbstractState("HEOS", name).all_critical_points()`` (the
#: physical root with the highest temperature and positive pressure). Computing
#: them at run time costs up to 7 s per mixture, so they are stored here.
#: Source: CoolProp 8.0.0 [pub, computed]; a test re-checks one of them.
MIXTURE_CRITICAL_POINTS: dict[str, tuple[float, float]] = {
    "R407A.mix": (355.3968669716282, 4513894.305323166),
    "R407F.mix": (355.7537022332468, 4749227.883990307),
    "R448A.mix": (355.94090315929117, 4605180.921074508),
    "R449A.mix": (355.63530092292876, 4516517.7319519725),
    "R452A.mix": (348.248967281918, 3983776.6491352622),
    "R513A.mix": (368.5606761258613, 3655093.999046059),
    "R454C.mix": (360.7933602886933, 4370459.600637634),
    "R455A.mix": (358.7847327606565, 4601904.683892602),
}

# Numerical margin below the critical point for saturation requests: the
# ancillaries and mixture saturation solvers become unreliable right at the
# critical point (common practice, no source).
_CRITICAL_MARGIN_PURE = 0.05  # K
_CRITICAL_MARGIN_MIXTURE = 2.0  # K


def coolprop_version() -> str:
    """The CoolProp version in use, e.g. ``"8.0.0"``.

    Examples
    --------
    >>> coolprop_version().split(".")[0] >= "8"
    True
    """
    return str(CoolProp.__version__)


@dataclass(frozen=True)
class StatePoint:
    """One thermodynamic state of a refrigerant.

    Attributes
    ----------
    p : float
        Pressure, absolute [Pa].
    t : float
        Temperature [°C].
    h : float
        Specific enthalpy [J/kg] (CoolProp default reference state).
    s : float
        Specific entropy [J/(kg·K)] (CoolProp default reference state).
    quality : float or None
        Vapour mass fraction [1] in the two-phase region, 0 for saturated
        liquid, 1 for saturated vapour, ``None`` outside the two-phase region.
    density : float
        Density [kg/m³].
    """

    p: float
    t: float
    h: float
    s: float
    quality: float | None
    density: float

    def to_json(self) -> dict:
        """The state as a JSON-ready dict with unit-named keys."""
        return {
            "p_pa": self.p,
            "t_c": self.t,
            "h_j_kg": self.h,
            "s_j_kg_k": self.s,
            "quality": self.quality,
            "density_kg_m3": self.density,
        }


def _finite(*values: float) -> bool:
    return all(math.isfinite(v) for v in values)


#: Gas constant [J/(mol·K)] (CODATA 2018, exact since the 2019 SI).
GAS_CONSTANT = 8.314462618

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
    """One fitted piece of a :class:`_MixtureTable` line: ln p from *a* to *b* and the
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


class _MixtureTable:
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

    def __init__(self, fluid: "Fluid") -> None:
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

        Newton on the table; the first guess is a Clausius–Clapeyron line
        (ln p linear in 1/T) through a segment already fitted for this line,
        else through the minimum and critical points.
        """
        guess = None
        for (k, q), segment in self.segments.items():
            if q != quality or segment is None:
                continue
            a, b, series = segment.a, segment.b, segment.temperature
            t_a, t_b = _chebyshev(series, -1.0), _chebyshev(series, 1.0)
            if guess is None or min(abs(temperature - t_a), abs(temperature - t_b)) < guess[0]:
                slope = (b - a) / (1.0 / t_a - 1.0 / t_b)
                guess = (min(abs(temperature - t_a), abs(temperature - t_b)), a + slope * (1.0 / t_a - 1.0 / temperature))
        if guess is None:
            t_low = self.fluid.minimum_temperature + KELVIN + 1.0
            t_crit = self.fluid.critical_temperature + KELVIN
            slope = (math.log(self.fluid.critical_pressure) - self.u_low) / (1.0 / t_low - 1.0 / t_crit)
            u = self.u_low + slope * (1.0 / t_low - 1.0 / temperature)
        else:
            u = guess[1]
        for _ in range(40):
            u = min(max(u, self.u_low), self.u_high)
            segment = self._locate(u, quality)
            if segment is None:
                return None
            a, b, series = segment.a, segment.b, segment.temperature
            x = segment.x(u)
            t = _chebyshev(series, x)
            dx = 1e-6
            slope = (_chebyshev(series, x + dx) - _chebyshev(series, x - dx)) / (2.0 * dx) * 2.0 / (b - a)
            step = (temperature - t) / slope
            if abs(temperature - t) <= 1e-11 * temperature:
                return u
            if (u == self.u_low and step < 0) or (u == self.u_high and step > 0):
                return None
            u += step
        return None  # pragma: no cover - Newton on a monotone smooth series

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
        t_bub, t_dew = bub.t + KELVIN, dew.t + KELVIN
        ln_k_bub = [math.log(y_bub[i] / z[i]) for i in range(n)]
        ln_k_dew = [math.log(z[i] / x_dew[i]) for i in range(n)]
        if spec == "t":
            t = target + KELVIN
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
        return StatePoint(pressure, t - KELVIN, h, s, beta, density)


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


class Fluid:
    """Properties of one catalogue refrigerant (use :func:`get_fluid`).

    Parameters
    ----------
    info : RefrigerantInfo
        The catalogue entry.

    Attributes
    ----------
    info : RefrigerantInfo
    critical_temperature : float
        Critical temperature [°C] (mixtures: the mixture critical point).
    critical_pressure : float
        Critical pressure [Pa].
    triple_temperature : float
        Triple-point temperature [°C] (mixtures: CoolProp's minimum
        temperature of the model, the highest component triple point).
    minimum_temperature : float
        Lowest temperature accepted [°C] (= triple_temperature).
    minimum_pressure : float
        Lowest saturation pressure accepted [Pa]: the triple-point pressure for
        pure fluids, the dew pressure at the minimum temperature otherwise.
    """

    def __init__(self, info: RefrigerantInfo) -> None:
        self.info = info
        self._mixture = info.model == "mixture"
        try:
            self._state = AbstractState("HEOS", info.coolprop_name)
        except ValueError as error:  # pragma: no cover - catalogue checked by tests
            raise PropertyRangeError(f"{info.name}: CoolProp cannot load {info.coolprop_name!r}: {error}") from None
        st = self._state
        if self._mixture:
            tc, pc = MIXTURE_CRITICAL_POINTS[info.coolprop_name]
            t_min = st.Tmin()
        else:
            tc, pc = st.T_critical(), st.p_critical()
            t_min = max(st.Tmin(), st.Ttriple())
        self.critical_temperature = tc - KELVIN
        self.critical_pressure = pc
        self.triple_temperature = t_min - KELVIN
        self.minimum_temperature = self.triple_temperature
        self._margin = _CRITICAL_MARGIN_MIXTURE if self._mixture else _CRITICAL_MARGIN_PURE
        # highest temperature of a state [°C]: 1.5 × the EOS's stated maximum,
        # where CoolProp's own single-phase flashes stop (CoolProp 8.0
        # FlashRoutines) — one limit for the flash and for the blend path
        self.maximum_temperature = 1.5 * st.Tmax() - KELVIN
        self._sat_cache: dict[tuple[str, float, float], StatePoint] = {}
        # failed saturation look-ups, remembered so a failure costs once
        self._sat_failures: dict[tuple[str, float, float], str] = {}
        self._table: _MixtureTable | None = None
        if self._mixture:
            # dew pressure at the minimum temperature (a little above, where the
            # mixture saturation solver is reliable)
            self.minimum_pressure = self._saturation_raw("T", t_min + 1.0, 1.0).p
        else:
            try:
                self.minimum_pressure = st.trivial_keyed_output(CP.iP_triple)
            except ValueError:  # pragma: no cover
                self.minimum_pressure = self._saturation_raw("T", t_min, 1.0).p
        if self._mixture:
            self._table = _MixtureTable(self)

    def __repr__(self) -> str:
        return f"Fluid({self.info.name!r}, {self.info.coolprop_name!r}, {self.info.model})"

    # ------------------------------------------------------------------ helpers
    def _read(self, quality: float | None) -> StatePoint:
        st = self._state
        return StatePoint(st.p(), st.T() - KELVIN, st.hmass(), st.smass(), quality, st.rhomass())

    def _fail(self, what: str) -> PropertyRangeError:
        return PropertyRangeError(f"{self.info.name}: {what}")

    def clear_cache(self) -> None:
        """Forget memoised saturation states and failures (used by benchmarks).

        The mixture saturation table is kept: it is built once per process.
        """
        self._sat_cache.clear()
        self._sat_failures.clear()

    def _check_temperature(self, temperature: float, what: str = "temperature") -> None:
        if not _finite(temperature):
            raise self._fail(f"{what} {temperature!r} °C is not a finite number")
        if temperature < self.minimum_temperature:
            raise self._fail(
                f"{what} {temperature:.2f} °C is below the triple/minimum temperature "
                f"{self.minimum_temperature:.2f} °C of the property model"
            )
        if temperature > self.maximum_temperature:
            raise self._fail(
                f"{what} {temperature:.2f} °C is above the maximum temperature "
                f"{self.maximum_temperature:.0f} °C of the property model"
            )

    # --------------------------------------------------------------- saturation
    def _guesses(self) -> PyGuessesStructure:
        """Guesses for a nearby mixture saturation solve, from the current state."""
        st = self._state
        g = PyGuessesStructure()
        g.T = st.T()
        g.p = st.p()
        g.rhomolar_liq = st.saturated_liquid_keyed_output(CP.iDmolar)
        g.rhomolar_vap = st.saturated_vapor_keyed_output(CP.iDmolar)
        g.x = list(st.mole_fractions_liquid())
        g.y = list(st.mole_fractions_vapor())
        return g

    def _mixture_saturation_continuation(self, given: str, value_si: float, quality: float) -> None:
        """Fallback when CoolProp's mixture saturation solver fails from its own
        start (it does at scattered points, e.g. R407F.mix bubble at 50–58 °C):
        find a nearby temperature it can solve, then walk to the target in
        steps of at most 2 K, each solve started from the previous solution
        (``update_with_guesses``). For a pressure target, the walk is a secant
        on ln p against 1/T (Clausius–Clapeyron form, common practice), solved to
        round-off with Q–T solves. Leaves the state in ``self._state``.
        """
        st = self._state
        t_top = self.critical_temperature + KELVIN - self._margin
        t_start = min(value_si, t_top) if given == "T" else t_top - 3.0
        anchor = None
        for k in range(1, 60):
            t = t_start - 1.5 * k
            if t < self.minimum_temperature + KELVIN + 1.0:
                break
            try:
                st.update(CP.QT_INPUTS, quality, t)
            except ValueError:
                continue
            if given == "P" and st.p() >= value_si:
                continue  # anchor on the low-pressure side, away from the critical point
            anchor = (t, st.p(), self._guesses())
            break
        if anchor is None:
            raise ValueError("no nearby saturation state converges")
        t_now, p_now, guess = anchor
        if given == "T":
            while abs(value_si - t_now) > 1e-12:
                t_next = t_now + max(-2.0, min(2.0, value_si - t_now))
                st.update_with_guesses(CP.QT_INPUTS, quality, t_next, guess)
                t_now, guess = t_next, self._guesses()
            return
        # pressure target: secant on ln p vs 1/T, solved to round-off; the final
        # state is the Q–T state at the temperature found
        t_prev, p_prev = t_now, p_now
        t_now = t_now + 0.5
        st.update_with_guesses(CP.QT_INPUTS, quality, t_now, guess)
        p_now, guess = st.p(), self._guesses()
        for _ in range(60):
            if abs(math.log(p_now / value_si)) < 1e-13 or t_now == t_prev:
                return
            slope = (math.log(p_now) - math.log(p_prev)) / (1.0 / t_now - 1.0 / t_prev)
            t_target = 1.0 / (1.0 / t_now + (math.log(value_si) - math.log(p_now)) / slope)
            t_next = t_now + max(-2.0, min(2.0, t_target - t_now))
            st.update_with_guesses(CP.QT_INPUTS, quality, t_next, guess)
            t_prev, p_prev = t_now, p_now
            t_now, p_now, guess = t_next, st.p(), self._guesses()
        raise ValueError("saturation temperature iteration did not converge")

    def _saturation_raw(self, given: str, value_si: float, quality: float) -> StatePoint:
        st = self._state
        try:
            try:
                if given == "T":
                    st.update(CP.QT_INPUTS, quality, value_si)
                else:
                    st.update(CP.PQ_INPUTS, value_si, quality)
            except ValueError:
                if not self._mixture:
                    raise
                self._mixture_saturation_continuation(given, value_si, quality)
            state = self._read(quality)
        except ValueError as error:
            unit = "K" if given == "T" else "Pa"
            raise self._fail(
                f"no saturation state at {given} = {value_si:.6g} {unit}, quality {quality}: CoolProp: {error}"
            ) from None
        if not _finite(state.p, state.t, state.h, state.s, state.density):
            raise self._fail(f"saturation at {given} = {value_si:.6g} gave a non-finite result")
        return state

    def _saturation(self, key: tuple[str, float, float], given: str, value_si: float, quality: float) -> StatePoint:
        """Saturation state from the mixture table, else CoolProp; a failure is
        remembered under *key* and raised again without a second attempt."""
        failure = self._sat_failures.get(key)
        if failure is not None:
            raise self._fail(failure)
        try:
            state = None
            if self._table is not None and quality in (0.0, 1.0):
                state = self._table_saturation(given, value_si, quality)
            if state is None:
                state = self._saturation_raw(given, value_si, quality)
            # check after: CoolProp may return states outside the model's range
            if state.t < self.minimum_temperature - 1e-6 or state.t > self.critical_temperature + 5.0:
                raise self._fail(
                    f"saturation result {state.t:.2f} °C lies outside the model range "
                    f"{self.minimum_temperature:.2f}…{self.critical_temperature:.2f} °C"
                )
        except PropertyRangeError as error:
            if len(self._sat_failures) > 4096:
                self._sat_failures.clear()
            self._sat_failures[key] = str(error).removeprefix(f"{self.info.name}: ")
            raise
        return state

    def _table_saturation(self, given: str, value_si: float, quality: float) -> StatePoint | None:
        """Dew (quality 1) or bubble (0) state of a mixture from the table: the
        table gives the saturation temperature (or pressure), the EOS the state
        at that (p, T) with the bulk phase imposed. None outside the table."""
        table = self._table
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
            self._update_pt(pressure, t_k, CP.iphase_gas if quality == 1.0 else CP.iphase_liquid,
                            table.density(u, quality))
            state = self._read(quality)
        except ValueError:
            return None
        if not _finite(state.p, state.t, state.h, state.s, state.density):
            return None
        return state

    def saturated_state(
        self, quality: float, temperature: float | None = None, pressure: float | None = None
    ) -> StatePoint:
        """Saturated (or two-phase) state from temperature or pressure and quality.

        For blends, quality 1 at a temperature is the dew point at that
        temperature, quality 0 the bubble point.

        Parameters
        ----------
        quality : float
            Vapour mass fraction [1], 0…1.
        temperature : float, optional
            Saturation temperature [°C] (give this or *pressure*).
        pressure : float, optional
            Saturation pressure, absolute [Pa].

        Returns
        -------
        StatePoint

        Raises
        ------
        PropertyRangeError
            Below the triple point, at or above the critical point, or a
            CoolProp failure.

        Examples
        --------
        >>> round(get_fluid("R-744").saturated_state(1.0, temperature=-10.0).p / 1e5, 2)
        26.49
        """
        if (temperature is None) == (pressure is None):
            raise ValueError("give exactly one of temperature or pressure")
        if not 0.0 <= quality <= 1.0:
            raise self._fail(f"quality {quality} outside 0…1")
        if temperature is not None:
            key = ("T", float(temperature), float(quality))
            hit = self._sat_cache.get(key)
            if hit is not None:
                return hit
            self._check_temperature(temperature, "saturation temperature")
            limit = self.critical_temperature - self._margin
            if temperature > limit:
                raise self._fail(
                    f"saturation temperature {temperature:.2f} °C is above {limit:.2f} °C "
                    f"(critical temperature {self.critical_temperature:.2f} °C): no liquid/vapour saturation"
                )
            state = self._saturation(key, "T", temperature + KELVIN, quality)
        else:
            key = ("P", float(pressure), float(quality))
            hit = self._sat_cache.get(key)
            if hit is not None:
                return hit
            if not _finite(pressure) or pressure <= 0:
                raise self._fail(f"pressure {pressure!r} Pa must be a positive finite number")
            if pressure < self.minimum_pressure:
                raise self._fail(
                    f"saturation pressure {pressure:.6g} Pa is below the triple-point/minimum pressure "
                    f"{self.minimum_pressure:.6g} Pa"
                )
            limit = 0.995 * self.critical_pressure if not self._mixture else 0.95 * self.critical_pressure
            if pressure > limit:
                raise self._fail(
                    f"saturation pressure {pressure:.6g} Pa is above {limit:.6g} Pa "
                    f"(critical pressure {self.critical_pressure:.6g} Pa): no liquid/vapour saturation"
                )
            state = self._saturation(key, "P", pressure, quality)
        if len(self._sat_cache) > 4096:
            self._sat_cache.clear()
        self._sat_cache[key] = state
        # the same state answers the pressure-keyed question (the cycle asks both)
        self._sat_cache[("P", state.p, float(quality))] = state
        return state

    def saturated_vapour(self, temperature: float | None = None, pressure: float | None = None) -> StatePoint:
        """Saturated vapour (dew point) from temperature [°C] or pressure [Pa]."""
        return self.saturated_state(1.0, temperature=temperature, pressure=pressure)

    def saturated_liquid(self, temperature: float | None = None, pressure: float | None = None) -> StatePoint:
        """Saturated liquid (bubble point) from temperature [°C] or pressure [Pa]."""
        return self.saturated_state(0.0, temperature=temperature, pressure=pressure)

    def dew_pressure(self, temperature: float) -> float:
        """Dew-point pressure [Pa] at *temperature* [°C]."""
        return self.saturated_state(1.0, temperature=temperature).p

    def bubble_pressure(self, temperature: float) -> float:
        """Bubble-point pressure [Pa] at *temperature* [°C]."""
        return self.saturated_state(0.0, temperature=temperature).p

    def dew_temperature(self, pressure: float) -> float:
        """Dew-point temperature [°C] at *pressure* [Pa]."""
        return self.saturated_state(1.0, pressure=pressure).t

    def bubble_temperature(self, pressure: float) -> float:
        """Bubble-point temperature [°C] at *pressure* [Pa]."""
        return self.saturated_state(0.0, pressure=pressure).t

    def glide(self, pressure: float) -> float:
        """Temperature glide, dew minus bubble temperature [K], at *pressure* [Pa]."""
        return self.dew_temperature(pressure) - self.bubble_temperature(pressure)

    # ------------------------------------------------------------ single phase
    def _check_pressure(self, pressure: float) -> None:
        if not _finite(pressure) or pressure <= 0:
            raise self._fail(f"pressure {pressure!r} Pa must be a positive finite number")
        if pressure < self.minimum_pressure:
            raise self._fail(
                f"pressure {pressure:.6g} Pa is below the triple-point/minimum pressure {self.minimum_pressure:.6g} Pa"
            )
        if self._mixture and pressure > 0.95 * self.critical_pressure:
            raise self._fail(
                f"pressure {pressure:.6g} Pa is too close to or above the mixture critical pressure "
                f"{self.critical_pressure:.6g} Pa for the mixture model"
            )

    def _subcritical(self, pressure: float) -> bool:
        limit = 0.995 * self.critical_pressure if not self._mixture else 0.95 * self.critical_pressure
        return pressure <= limit

    def _update_pt(self, pressure: float, t_kelvin: float, phase: int | None, near_density: float = 0.0) -> None:
        """P–T update, the bulk phase imposed when given; *near_density* [kg/m³] (a nearby
        state's density, e.g. the saturation state on the same side) seeds the density solve."""
        st = self._state
        if phase is None:
            st.update(CP.PT_INPUTS, pressure, t_kelvin)
            return
        st.specify_phase(phase)
        try:
            if near_density > 0.0 and math.isfinite(near_density):
                guess = PyGuessesStructure()
                guess.rhomolar = near_density / st.molar_mass()
                st.update_with_guesses(CP.PT_INPUTS, pressure, t_kelvin, guess)
            else:
                st.update(CP.PT_INPUTS, pressure, t_kelvin)
        finally:
            st.unspecify_phase()

    def state_pt(self, pressure: float, temperature: float, phase: str | None = None) -> StatePoint:
        """State from pressure [Pa] and temperature [°C].

        Inside the two-phase region of a pure fluid the pair does not define a
        state (PropertyRangeError); inside the glide of a blend the state is
        found by iterating on quality.

        *phase* (``"gas"`` or ``"liquid"``) states which side of the saturation
        line is meant; it lets a state a hair off saturation (e.g. 1e-9 K of
        subcooling) be computed as that phase. A temperature on the wrong side
        by more than 1e-6 K is refused.

        Examples
        --------
        >>> s = get_fluid("R134a").state_pt(1e5, 20.0)
        >>> s.quality is None and 4.0 < s.density < 4.5
        True
        """
        self._check_pressure(pressure)
        self._check_temperature(temperature)
        t_k = temperature + KELVIN
        if phase not in (None, "gas", "liquid"):
            raise ValueError(f"phase must be None, 'gas' or 'liquid', not {phase!r}")
        hint = phase
        phase: int | None = None
        near = 0.0  # the saturation state's density on the state's side: seeds the density solve
        if self._subcritical(pressure):
            dew = self.saturated_state(1.0, pressure=pressure)
            if (hint is None and temperature > dew.t) or (hint == "gas" and temperature >= dew.t - 1e-6):
                phase = CP.iphase_gas  # vapour: no bubble point needed
                near = dew.density
            else:
                bub = dew if not self.info.zeotropic else self.saturated_state(0.0, pressure=pressure)
                near = bub.density
                if hint == "liquid" and temperature <= bub.t + 1e-6:
                    phase = CP.iphase_liquid
                elif hint is not None:
                    raise self._fail(
                        f"{temperature:.4f} °C at {pressure:.6g} Pa is not {hint}: "
                        f"dew {dew.t:.4f} °C, bubble {bub.t:.4f} °C"
                    )
                elif temperature < bub.t:
                    phase = CP.iphase_liquid
                elif temperature == dew.t and self.info.zeotropic:
                    return dew  # a zeotrope's dew point is a unique state
                elif temperature == bub.t and self.info.zeotropic:
                    return bub
                elif not self.info.zeotropic or self.info.model != "mixture":
                    raise self._fail(
                        f"{temperature:.4f} °C at {pressure:.6g} Pa is saturated (two-phase): "
                        "pressure and temperature do not fix the state; give quality or enthalpy"
                    )
                else:
                    return self._two_phase(pressure, temperature, "t", bub, dew)
        elif self._mixture:  # pragma: no cover - excluded by _check_pressure
            raise self._fail("supercritical states of mixtures are not supported")
        try:
            self._update_pt(pressure, t_k, phase, near if self._mixture else 0.0)
            state = self._read(None)
        except ValueError as error:
            raise self._fail(f"no state at {pressure:.6g} Pa, {temperature:.3f} °C: CoolProp: {error}") from None
        return state

    def _two_phase(self, pressure: float, target: float, attr: str, bub: StatePoint, dew: StatePoint) -> StatePoint:
        """Two-phase state of a mixture with t [°C], h or s given: the table's
        flash, else the quality iteration on CoolProp's P–Q flash."""
        if self._table is not None:
            state = self._table.flash(pressure, attr, target, bub, dew)
            if state is not None:
                return state
        return self._secant_quality(pressure, target, attr, bub, dew)

    def _secant_quality(self, pressure: float, target: float, attr: str, bub: StatePoint, dew: StatePoint) -> StatePoint:
        """Find the quality at which attribute *attr* (t, h or s) of the P–Q
        state equals *target*: Illinois-modified regula falsi on q in [0, 1]
        (the attribute rises monotonically with q at fixed pressure)."""
        q_a, f_a = 0.0, getattr(bub, attr) - target
        q_b, f_b = 1.0, getattr(dew, attr) - target
        tol = 1e-9 if attr == "t" else 1e-9 * max(abs(target), 1.0)
        side = 0
        for _ in range(60):
            q = q_a - f_a * (q_b - q_a) / (f_b - f_a)
            state = self.saturated_state(q, pressure=pressure)
            f = getattr(state, attr) - target
            if abs(f) <= tol or q_b - q_a < 1e-14:
                return state
            if f < 0:
                q_a, f_a = q, f
                if side == -1:
                    f_b *= 0.5
                side = -1
            else:
                q_b, f_b = q, f
                if side == 1:
                    f_a *= 0.5
                side = 1
        raise self._fail(f"two-phase iteration at {pressure:.6g} Pa did not converge ({attr} = {target})")

    def _solve_single_phase(self, pressure: float, target: float, prop: str, side: str, sat: StatePoint) -> StatePoint:
        """Newton on T with the phase imposed: h(T) or s(T) at fixed p.

        Safeguarded by the bracket between the saturation temperature and an
        upper (gas) or lower (liquid) bound that is widened as needed.
        """
        st = self._state
        phase = CP.iphase_gas if side == "gas" else CP.iphase_liquid
        t_sat = sat.t + KELVIN
        getter = st.hmass if prop == "h" else st.smass
        sat_value = sat.h if prop == "h" else sat.s
        t_top = self.maximum_temperature + KELVIN
        if side == "gas":
            lo, hi = t_sat, None
        else:
            lo, hi = self.minimum_temperature + KELVIN, t_sat
        try:
            # first guess from the saturation state's heat capacity (its density seeds the solve)
            self._update_pt(pressure, t_sat, phase, sat.density)
            st.specify_phase(phase)
            guess = PyGuessesStructure()
            cp = st.cpmass()
            if prop == "h":
                t = t_sat + (target - sat_value) / cp
            else:
                t = t_sat * math.exp((target - sat_value) / cp)
            tol_value = 1e-9 * max(abs(target), 1.0) + (1e-7 if prop == "h" else 1e-10)
            for _ in range(60):
                if hi is None and t > t_top:
                    self._guard_maximum(pressure, target, prop)  # raises when the root lies above
                    st.specify_phase(phase)
                    hi = t_top
                if hi is not None and not lo < t < hi:
                    t = 0.5 * (lo + hi)
                elif hi is None and t <= lo:
                    t = lo + 0.5 * max(t_sat - lo, 1.0)
                if side == "liquid" and t < lo:
                    t = lo
                guess.rhomolar = st.rhomolar()  # the last iterate's density: a quicker density solve
                st.update_with_guesses(CP.PT_INPUTS, pressure, t, guess)
                f = getter() - target
                if abs(f) <= tol_value:
                    break
                if f < 0:
                    lo = t
                else:
                    hi = t
                cp = st.cpmass()
                slope = cp if prop == "h" else cp / t
                step = -f / slope
                t_new = t + step
                if abs(step) < 1e-9:
                    t = t_new
                    st.update(CP.PT_INPUTS, pressure, t)
                    break
                t = t_new
            else:
                raise self._fail(f"single-phase iteration at {pressure:.6g} Pa for {prop} = {target:.6g} did not converge")
            return self._read(None)
        except PropertyRangeError:
            raise
        except ValueError as error:
            raise self._fail(f"no {side} state at {pressure:.6g} Pa with {prop} = {target:.6g}: CoolProp: {error}") from None
        finally:
            st.unspecify_phase()

    def _state_p_prop(self, pressure: float, target: float, prop: str, method: str) -> StatePoint:
        self._check_pressure(pressure)
        if not _finite(target):
            raise self._fail(f"{prop} {target!r} is not a finite number")
        if method not in ("auto", "flash"):
            raise ValueError(f"method must be 'auto' or 'flash', not {method!r}")
        if method == "flash" or not self._mixture:
            return self._flash(pressure, target, prop)
        dew = self.saturated_state(1.0, pressure=pressure)
        v_dew = dew.h if prop == "h" else dew.s
        if target > v_dew:  # vapour: no bubble point needed
            state = self._solve_single_phase(pressure, target, prop, "gas", dew)
            self._check_result(state)
            return state
        bub = self.saturated_state(0.0, pressure=pressure)
        v_bub = bub.h if prop == "h" else bub.s
        if target < v_bub:
            state = self._solve_single_phase(pressure, target, prop, "liquid", bub)
        elif target == v_dew:
            return dew
        elif target == v_bub:
            return bub
        else:
            return self._two_phase(pressure, target, prop, bub, dew)
        self._check_result(state)
        return state

    def _flash(self, pressure: float, target: float, prop: str) -> StatePoint:
        st = self._state
        try:
            if prop == "h":
                st.update(CP.HmassP_INPUTS, target, pressure)
            else:
                st.update(CP.PSmass_INPUTS, pressure, target)
            q = st.Q()
            two_phase = st.phase() == CP.iphase_twophase and 0.0 <= q <= 1.0
            state = self._read(q if two_phase else None)
        except ValueError as error:
            self._guard_maximum(pressure, target, prop)
            raise self._fail(f"no state at {pressure:.6g} Pa with {prop} = {target:.6g}: CoolProp: {error}") from None
        self._check_result(state)
        return state

    def _guard_maximum(self, pressure: float, target: float, prop: str) -> None:
        """Refuse an enthalpy or entropy that puts the state above the maximum
        temperature of the property model — the one range guard of the flash
        and of the blend path. Leaves the phase unspecified."""
        st = self._state
        try:
            self._update_pt(pressure, self.maximum_temperature + KELVIN, CP.iphase_gas)
            top = st.hmass() if prop == "h" else st.smass()
        except ValueError:
            top = math.inf
        if target > top:
            raise self._fail(
                f"no state at {pressure:.6g} Pa with {prop} = {target:.6g}: it lies above the maximum temperature "
                f"{self.maximum_temperature:.0f} °C of the property model"
            )

    def _check_result(self, state: StatePoint) -> None:
        if not _finite(state.p, state.t, state.h, state.s, state.density) or state.density <= 0:
            raise self._fail(f"CoolProp returned a non-physical state {state}")
        if state.t > self.maximum_temperature + 1e-6:
            raise self._fail(
                f"state at {state.p:.6g} Pa lies at {state.t:.2f} °C, above the maximum temperature "
                f"{self.maximum_temperature:.0f} °C of the property model"
            )
        if state.t < self.minimum_temperature - 1e-6:
            raise self._fail(
                f"state at {state.p:.6g} Pa lies at {state.t:.2f} °C, below the minimum temperature "
                f"{self.minimum_temperature:.2f} °C of the property model"
            )

    def state_ph(self, pressure: float, enthalpy: float, method: str = "auto") -> StatePoint:
        """State from pressure [Pa] and specific enthalpy [J/kg].

        Parameters
        ----------
        pressure : float
            Absolute pressure [Pa].
        enthalpy : float
            Specific enthalpy [J/kg].
        method : {"auto", "flash"}
            ``"auto"``: fast path for mixtures (see module docstring);
            ``"flash"``: CoolProp's own P–H flash (reference; slow for mixtures).

        Examples
        --------
        >>> f = get_fluid("R134a")
        >>> s = f.state_ph(f.dew_pressure(-10.0), 300e3)
        >>> round(s.t, 3), round(s.quality, 3)
        (-10.0, 0.55)
        """
        return self._state_p_prop(pressure, enthalpy, "h", method)

    def state_ps(self, pressure: float, entropy: float, method: str = "auto") -> StatePoint:
        """State from pressure [Pa] and specific entropy [J/(kg·K)].

        See :meth:`state_ph` for *method*.

        Examples
        --------
        >>> f = get_fluid("R134a")
        >>> s1 = f.saturated_vapour(temperature=-10.0)
        >>> s2 = f.state_ps(f.dew_pressure(40.0), s1.s)
        >>> round(s2.t, 1)
        46.3
        """
        return self._state_p_prop(pressure, entropy, "s", method)

    # ---------------------------------------------------------- p–h diagrams
    def saturation_dome(self, n: int = 40, minimum_temperature: float | None = None) -> tuple[list[float], list[float], list[float]]:
        """Points of the saturation dome for a p–h diagram.

        Pressures are spaced geometrically from the saturation pressure at
        *minimum_temperature* (default: the higher of −60 °C and 1 K above the
        triple point) to just below the critical pressure.

        Parameters
        ----------
        n : int
            Number of pressure levels.
        minimum_temperature : float, optional
            Lowest dew temperature on the dome [°C].

        Returns
        -------
        (pressures, bubble_enthalpies, dew_enthalpies) : tuple of lists
            [Pa], [J/kg], [J/kg], same length (≤ n: levels where the
            saturation solver fails near the critical point are dropped).

        Examples
        --------
        >>> p, hl, hv = get_fluid("R134a").saturation_dome(10)
        >>> len(p) == 10 and all(a < b for a, b in zip(hl, hv))
        True
        """
        if n < 2:
            raise ValueError("n must be at least 2")
        t_low = minimum_temperature if minimum_temperature is not None else max(-60.0, self.minimum_temperature + 1.0)
        p_low = self.dew_pressure(t_low)
        p_high = (0.99 if not self._mixture else 0.94) * self.critical_pressure
        pressures, liquid, vapour = [], [], []
        ratio = (p_high / p_low) ** (1.0 / (n - 1))
        for i in range(n):
            p = p_low * ratio**i
            try:
                hl = self.saturated_state(0.0, pressure=p).h
                hv = self.saturated_state(1.0, pressure=p).h
            except PropertyRangeError:
                continue
            pressures.append(p)
            liquid.append(hl)
            vapour.append(hv)
        return pressures, liquid, vapour

    def isotherm(self, temperature: float, pressures: list[float]) -> list[StatePoint]:
        """States along one isotherm [°C] at the given pressures [Pa].

        Pressures where the pair does not fix a state (pure fluid exactly
        saturated) or outside the model range are skipped. For a pure fluid
        crossing its saturation pressure, add the saturated states yourself
        (the isotherm is horizontal across the dome).

        Examples
        --------
        >>> pts = get_fluid("R134a").isotherm(40.0, [2e5, 5e5, 2e6])
        >>> [p.quality for p in pts]
        [None, None, None]
        """
        out = []
        for p in pressures:
            try:
                out.append(self.state_pt(p, temperature))
            except PropertyRangeError:
                continue
        return out

    def isentrope(self, entropy: float, pressures: list[float]) -> list[StatePoint]:
        """States along one isentrope [J/(kg·K)] at the given pressures [Pa].

        Examples
        --------
        >>> f = get_fluid("R134a")
        >>> s = f.saturated_vapour(temperature=0.0).s
        >>> [round(x.t) for x in f.isentrope(s, [5e5, 1e6])]
        [18, 44]
        """
        out = []
        for p in pressures:
            try:
                out.append(self.state_ps(p, entropy))
            except PropertyRangeError:
                continue
        return out

    # --------------------------------------------------------------- transport
    def viscosity(self, state: StatePoint, phase: str) -> tuple[float, str]:
        """Dynamic viscosity of a liquid or vapour state, and the basis used.

        Pure and pseudo-pure fluids: CoolProp's own transport model at the
        state (saturated states by quality, others by pressure and temperature
        with the phase imposed). Predefined mixtures (``.mix``): CoolProp 8.0
        returns liquid viscosities that are far off for them (R-454C liquid at
        −10 °C: 14 mPa·s, about 60 times a plausible value), so a documented
        approximation from the components is used instead (see
        :func:`mixture_viscosity`) and the basis says so.

        Parameters
        ----------
        state : StatePoint
            A single-phase state or a saturated one (quality 0 or 1).
        phase : str
            ``"liquid"`` or ``"vapour"``.

        Returns
        -------
        viscosity : float
            Dynamic viscosity [Pa·s].
        basis : str
            ``"CoolProp"`` or the approximation's description.

        Examples
        --------
        >>> fluid = get_fluid("R134a")
        >>> mu, basis = fluid.viscosity(fluid.saturated_liquid(temperature=40.0), "liquid")
        >>> round(mu * 1e6), basis                         # µPa·s
        (161, 'CoolProp')
        """
        if phase not in ("liquid", "vapour"):
            raise ValueError(f"phase must be 'liquid' or 'vapour', not {phase!r}")
        if self._mixture:
            components = tuple(zip(self._state.fluid_names(), self._state.get_mole_fractions()))
            try:
                return blend_viscosity(components, state.p, state.t, phase), MIXTURE_VISCOSITY_BASIS
            except ValueError as error:
                raise self._fail(str(error)) from None
        st = self._state
        try:
            if state.quality is not None:
                st.update(CP.PQ_INPUTS, state.p, state.quality)
            else:
                imposed = CP.iphase_liquid if phase == "liquid" else CP.iphase_gas
                if state.p >= self.critical_pressure or state.t >= self.critical_temperature:
                    imposed = CP.iphase_supercritical
                self._update_pt(state.p, state.t + KELVIN, imposed)
            value = st.viscosity()
        except ValueError as error:
            raise self._fail(f"no viscosity at {state.p:.6g} Pa, {state.t:.3f} °C: CoolProp: {error}") from None
        if not (_finite(value) and value > 0.0):
            raise self._fail(f"viscosity at {state.p:.6g} Pa, {state.t:.3f} °C is not a positive number")
        return value, "CoolProp"


#: Basis of the mixture viscosity approximation, as reports show it.
MIXTURE_VISCOSITY_BASIS = (
    "approximation: component viscosities (CoolProp) mixed by the Grunberg-Nissan rule without "
    "interaction term (liquid) and Wilke's rule (vapour), Poling, Prausnitz & O'Connell, "
    "The Properties of Gases and Liquids, 5th ed., eqs. 9-13.1 and 9-5.13 [mem]"
)


@lru_cache(maxsize=None)
def _component(name: str) -> tuple[AbstractState, float, float]:
    """A pure component's AbstractState, molar mass [kg/mol] and critical temperature [K]."""
    component = AbstractState("HEOS", name)
    return component, component.molar_mass(), component.T_critical()


def blend_viscosity(
    components: tuple[tuple[str, float], ...], pressure: float, temperature: float, phase: str
) -> float:
    """Approximate viscosity of a blend from its components.

    Liquid: ln μ = Σ xᵢ ln μᵢ (Grunberg–Nissan with G₁₂ = 0; Poling, Prausnitz
    & O'Connell, *The Properties of Gases and Liquids*, 5th ed. (2001),
    eq. 9-13.1 [mem] [ref:poling-2001]) with each μᵢ the component's saturated-liquid viscosity
    at the temperature (at 1 K below its critical temperature when the blend
    is hotter: e.g. the CO₂ in R-455A). Vapour: Wilke's rule (ibid.,
    eqs. 9-5.13/9-5.14 [mem]) with each component a gas at the temperature
    and its partial pressure. Mole fractions are the circulating (bulk)
    composition. Friction factors vary as Re^-0.2 or less, so a 20 % error in
    viscosity moves a turbulent pressure drop by about 4 % (common practice,
    no source). A test compares this with CoolProp's R-407C model.

    Parameters
    ----------
    components : tuple of (str, float)
        CoolProp component names and mole fractions [1].
    pressure : float
        Pressure, absolute [Pa].
    temperature : float
        Temperature [°C].
    phase : str
        ``"liquid"`` or ``"vapour"``.

    Returns
    -------
    float
        Dynamic viscosity [Pa·s].

    Raises
    ------
    ValueError
        CoolProp cannot evaluate a component there.

    Examples
    --------
    >>> mu = blend_viscosity((("R32", 0.5), ("R125", 0.5)), 1e6, 20.0, "liquid")
    >>> 1e-4 < mu < 2e-4
    True
    """
    t_k = temperature + KELVIN
    try:
        if phase == "liquid":
            log_mu = 0.0
            for name, x in components:
                component, _, t_crit = _component(name)
                component.update(CP.QT_INPUTS, 0.0, min(t_k, t_crit - 1.0))
                log_mu += x * math.log(component.viscosity())
            return math.exp(log_mu)
        mus, molar_masses = [], []
        for name, x in components:
            component, molar_mass, t_crit = _component(name)
            partial = max(x * pressure, 1000.0)
            flag = CP.iphase_supercritical_gas
            if t_k < t_crit:
                component.update(CP.QT_INPUTS, 1.0, t_k)
                partial = min(partial, 0.999 * component.p())
                flag = CP.iphase_gas
            component.specify_phase(flag)
            try:
                component.update(CP.PT_INPUTS, partial, t_k)
                mus.append(component.viscosity())
            finally:
                component.unspecify_phase()
            molar_masses.append(molar_mass)
    except ValueError as error:
        raise ValueError(f"no component viscosity at {pressure:.6g} Pa, {temperature:.3f} °C: CoolProp: {error}") from None
    fractions = [x for _, x in components]
    value = 0.0
    for i, (xi, mi) in enumerate(zip(fractions, molar_masses)):
        denominator = 0.0
        for j, (xj, mj) in enumerate(zip(fractions, molar_masses)):
            phi = (1.0 + math.sqrt(mus[i] / mus[j]) * (mj / mi) ** 0.25) ** 2 / math.sqrt(8.0 * (1.0 + mi / mj))
            denominator += xj * phi
        value += xi * mus[i] / denominator
    return value

@lru_cache(maxsize=None)
def _fluid_by_name(name: str) -> Fluid:
    return Fluid(lookup(name))


def get_fluid(name: str | RefrigerantInfo) -> Fluid:
    """The :class:`Fluid` for a catalogue refrigerant (cached per name).

    Parameters
    ----------
    name : str or RefrigerantInfo
        Any spelling :func:`coldroom.data.refrigerants.lookup` accepts.

    Raises
    ------
    coldroom.errors.LookupNameError
        Unknown refrigerant.

    Examples
    --------
    >>> get_fluid("r-134A") is get_fluid("R134a")
    True
    """
    info = lookup(name) if not isinstance(name, RefrigerantInfo) else name
    return _fluid_by_name(info.name)


# ------------------------------------------------------------------- chart support
# States a p–h chart needs beyond what a cycle does: the critical point's
# enthalpy, saturation right up to the critical point, a mixture's whole phase
# envelope, and single-phase states of a known phase anywhere in the chart's
# window (without the saturation look-up Fluid.state_pt makes to decide the
# phase). Kept apart from the Fluid internals: these functions own their
# AbstractStates (one per fluid for states, another for the envelope: once
# CoolProp has traced an envelope its imposed-phase updates near the critical
# pressure become a thousand times slower). Used by coldroom.physics.chart_data.

_CHART_STATES: dict[tuple[str, str], AbstractState] = {}
_ENVELOPES: dict[str, tuple[tuple[tuple[float, float], ...], tuple[tuple[float, float], ...]]] = {}
_ENVELOPE_POINTS: dict[str, tuple[tuple[float, float, float], ...]] = {}


def _chart_state(fluid: Fluid, purpose: str = "states") -> AbstractState:
    key = (fluid.info.name, purpose)
    st = _CHART_STATES.get(key)
    if st is None:
        st = _CHART_STATES[key] = AbstractState("HEOS", fluid.info.coolprop_name)
    return st


def _envelope_points(fluid: Fluid) -> tuple[tuple[float, float, float], ...]:
    """A mixture's phase envelope as CoolProp traces it [ref:coolprop]: (T [°C], p [Pa],
    h [J/kg] of the bulk composition) from the dew branch's low end over the point
    of highest pressure to the bubble branch's low end, as traced (callers skip the
    non-finite points CoolProp may return). Computed once per mixture and process
    (about 0.2 s)."""
    name = fluid.info.name
    found = _ENVELOPE_POINTS.get(name)
    if found is not None:
        return found
    if fluid.info.model != "mixture":
        raise PropertyRangeError(f"{name}: a phase envelope is traced for mixtures only")
    st = _chart_state(fluid, "envelope")
    try:
        st.build_phase_envelope("")
        env = st.get_phase_envelope_data()
    except ValueError as error:
        raise PropertyRangeError(f"{name}: CoolProp cannot trace the phase envelope: {error}") from None
    molar_mass = st.molar_mass()
    points = []
    for t, p, h_molar in zip(env.T, env.p, env.hmolar_vap):
        # CoolProp keeps the bulk composition's phase in the "vap" arrays on both
        # branches (the incipient phase in "liq"); checked against P–Q states
        h = h_molar / molar_mass
        points.append((t - KELVIN, p, h))
    result = tuple(points)
    _ENVELOPE_POINTS[name] = result
    return result


def phase_envelope(fluid: Fluid) -> tuple[tuple[tuple[float, float], ...], tuple[tuple[float, float], ...]]:
    """Bubble and dew lines of a mixture up to its critical point, as (h [J/kg], p [Pa]).

    CoolProp traces the envelope of the bulk composition [ref:coolprop] (dew branch up to
    the critical point, then the bubble branch down); the point of highest pressure
    closes both. Each branch is returned in rising pressure and ends at that
    point. Computed once per mixture and process (about 0.2 s).

    Raises
    ------
    PropertyRangeError
        Not a mixture, or CoolProp cannot trace the envelope.
    """
    name = fluid.info.name
    if name in _ENVELOPES:
        return _ENVELOPES[name]
    points = _envelope_points(fluid)
    p_all = [p for _, p, _ in points]
    top = max(range(len(p_all)), key=p_all.__getitem__)
    dew, bubble = [], []
    for i, (_, p, h) in enumerate(points):
        if not _finite(p, h) or p <= 0:
            continue
        if i <= top:
            dew.append((h, p))
        if i >= top:
            bubble.append((h, p))
    bubble.reverse()
    result = (tuple(bubble), tuple(dew))
    _ENVELOPES[name] = result
    return result


def envelope_crossings(fluid: Fluid, temperature: float) -> list[float]:
    """Pressures [Pa], rising, at which a mixture's phase envelope has *temperature* [°C].

    Linear in temperature between the traced points of :func:`_envelope_points`
    (about 1 K apart next to the critical point, so a few kPa uncertain there:
    callers keep a margin). Below the critical temperature an isotherm meets
    the dew branch, then the bubble branch; between the critical temperature and
    the highest temperature of the envelope (the cricondentherm) the dew branch
    twice; above it no crossing (one phase at every pressure).
    """
    points = [(t, p) for t, p, h in _envelope_points(fluid) if _finite(t, p, h) and p > 0]
    out = []
    for (ta, pa), (tb, pb) in zip(points, points[1:]):
        if ta == temperature:
            out.append(pa)
        elif (ta - temperature) * (tb - temperature) < 0:
            out.append(pa + (temperature - ta) / (tb - ta) * (pb - pa))
    return sorted(out)


def critical_enthalpy(fluid: Fluid) -> float:
    """Specific enthalpy at the critical point [J/kg].

    Pure and pseudo-pure fluids: the state at the critical density and
    temperature; mixtures: the top of :func:`phase_envelope`.
    """
    if fluid.info.model == "mixture":
        bubble, dew = phase_envelope(fluid)
        return 0.5 * (bubble[-1][0] + dew[-1][0])
    st = _chart_state(fluid)
    st.update(CP.DmolarT_INPUTS, st.rhomolar_critical(), st.T_critical())
    return st.hmass()


def chart_saturated(fluid: Fluid, pressure: float, quality: float) -> StatePoint:
    """Saturation state of a pure or pseudo-pure fluid up to the critical pressure.

    :meth:`Fluid.saturated_state` stops at 0.995 × critical pressure (a margin
    for cycle work); a chart's dome goes on to the critical point. Mixtures use
    :func:`phase_envelope`.
    """
    if fluid.info.model == "mixture":
        raise PropertyRangeError(f"{fluid.info.name}: use the phase envelope for a mixture's dome")
    if not fluid.minimum_pressure <= pressure < fluid.critical_pressure:
        raise fluid._fail(f"saturation pressure {pressure:.6g} Pa outside the chart's range")
    st = _chart_state(fluid)
    try:
        st.update(CP.PQ_INPUTS, pressure, quality)
        state = StatePoint(st.p(), st.T() - KELVIN, st.hmass(), st.smass(), quality, st.rhomass())
    except ValueError as error:
        raise fluid._fail(f"no saturation state at {pressure:.6g} Pa: CoolProp: {error}") from None
    fluid._check_result(state)
    return state


def chart_state_pt(fluid: Fluid, pressure: float, temperature: float, phase: str) -> StatePoint:
    """Single-phase state at *pressure* [Pa] and *temperature* [°C] of a known phase.

    Pure and pseudo-pure fluids: :meth:`Fluid.state_pt` with the phase hint.
    Mixtures: a P–T update with the phase (``"liquid"`` or ``"gas"``)
    imposed, which the caller guarantees (a liquid above its bubble pressure,
    a vapour below its dew pressure, a gas above the critical temperature);
    0.1 ms instead of the two saturation look-ups that decide the phase.
    """
    if fluid.info.model != "mixture":
        return fluid.state_pt(pressure, temperature, phase=phase)
    fluid._check_temperature(temperature)
    st = _chart_state(fluid)
    st.specify_phase(CP.iphase_liquid if phase == "liquid" else CP.iphase_gas)
    try:
        st.update(CP.PT_INPUTS, pressure, temperature + KELVIN)
        state = StatePoint(st.p(), st.T() - KELVIN, st.hmass(), st.smass(), None, st.rhomass())
    except ValueError as error:
        raise fluid._fail(f"no {phase} state at {pressure:.6g} Pa, {temperature:.3f} °C: CoolProp: {error}") from None
    finally:
        st.unspecify_phase()
    fluid._check_result(state)
    return state


def chart_state_ps(fluid: Fluid, pressure: float, entropy: float, floor: float, guess: float | None = None) -> StatePoint:
    """Vapour (or supercritical gas) state at *pressure* [Pa] and *entropy* [J/(kg·K)].

    Pure and pseudo-pure fluids: :meth:`Fluid.state_ps`. Mixtures: a
    safeguarded Newton iteration on temperature with P–T updates of the gas
    phase imposed, (∂s/∂T)_p = c_p/T, bracketed below by *floor* [°C] (the dew
    temperature at *pressure*, or the critical temperature above the critical
    pressure; the caller gives it) and started from *guess* [°C]. A state
    whose entropy lies below that of the floor (inside the dome) raises
    PropertyRangeError.
    """
    if fluid.info.model != "mixture":
        return fluid.state_ps(pressure, entropy)
    st = _chart_state(fluid)
    low, high = floor + KELVIN, floor + KELVIN + 400.0
    t = min(max(low + 0.5, guess + KELVIN), high - 1.0) if guess is not None else low + 20.0
    st.specify_phase(CP.iphase_gas)
    try:
        st.update(CP.PT_INPUTS, pressure, low)
        if st.smass() > entropy:
            raise fluid._fail(f"s = {entropy:.6g} J/(kg·K) at {pressure:.6g} Pa lies below the floor {floor:.2f} °C")
        for _ in range(40):
            st.update(CP.PT_INPUTS, pressure, t)
            f = st.smass() - entropy
            if abs(f) < 1e-7 * max(abs(entropy), 1.0):
                break
            if f < 0:
                low = t
            else:
                high = t
            t_next = t - f / (st.cpmass() / t)
            t = t_next if low < t_next < high else 0.5 * (low + high)
        else:
            raise fluid._fail(f"isentrope iteration at {pressure:.6g} Pa, s = {entropy:.6g} did not converge")
        state = StatePoint(st.p(), st.T() - KELVIN, st.hmass(), st.smass(), None, st.rhomass())
    except ValueError as error:
        raise fluid._fail(f"no state at {pressure:.6g} Pa with s = {entropy:.6g}: CoolProp: {error}") from None
    finally:
        st.unspecify_phase()
    return state
