"""One refrigerant's properties: :class:`Fluid` and the cached :func:`get_fluid`.

Saturation at dew and bubble points, single-phase and two-phase states, and the
range guards. Pure and pseudo-pure fluids use CoolProp's own flashes through
``AbstractState`` (microseconds). CoolProp's predefined mixtures go through
:mod:`coldroom.physics.refrigerant.blend_table` for saturation and the two-phase
region; their superheated vapour / subcooled liquid is a Newton iteration on
temperature with a P–T update whose phase is *imposed* (``specify_phase``; ~0.07 ms
instead of ~12 ms, because CoolProp then skips its stability analysis), using
(∂h/∂T)_p = c_p and (∂s/∂T)_p = c_p/T, safeguarded by a bracket; the imposed phase
is valid because the bracket lies on the right side of the dew/bubble point found
first.
"""

from __future__ import annotations

import math
from functools import lru_cache

import CoolProp
import CoolProp.CoolProp as CP
from CoolProp.CoolProp import AbstractState, PyGuessesStructure

from coldroom.constants import ZERO_CELSIUS_K
from coldroom.data.refrigerants import MIXTURE_CRITICAL_POINTS, RefrigerantInfo, lookup
from coldroom.errors import PropertyRangeError
from coldroom.physics.refrigerant.blend_table import MixtureTable, saturation_continuation
from coldroom.physics.refrigerant.state import StatePoint, _finite
from coldroom.physics.refrigerant.transport import fluid_viscosity

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
        self.critical_temperature = tc - ZERO_CELSIUS_K
        self.critical_pressure = pc
        self.triple_temperature = t_min - ZERO_CELSIUS_K
        self.minimum_temperature = self.triple_temperature
        self._margin = _CRITICAL_MARGIN_MIXTURE if self._mixture else _CRITICAL_MARGIN_PURE
        # highest temperature of a state [°C]: 1.5 × the EOS's stated maximum,
        # where CoolProp's own single-phase flashes stop (CoolProp 8.0
        # FlashRoutines) — one limit for the flash and for the blend path
        self.maximum_temperature = 1.5 * st.Tmax() - ZERO_CELSIUS_K
        self._sat_cache: dict[tuple[str, float, float], StatePoint] = {}
        # failed saturation look-ups, remembered so a failure costs once
        self._sat_failures: dict[tuple[str, float, float], str] = {}
        self._table: MixtureTable | None = None
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
            self._table = MixtureTable(self)

    def __repr__(self) -> str:
        return f"Fluid({self.info.name!r}, {self.info.coolprop_name!r}, {self.info.model})"

    # ------------------------------------------------------------------ helpers
    def _read(self, quality: float | None) -> StatePoint:
        st = self._state
        return StatePoint(st.p(), st.T() - ZERO_CELSIUS_K, st.hmass(), st.smass(), quality, st.rhomass())

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
                saturation_continuation(self, given, value_si, quality)
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
                state = self._table.saturation(given, value_si, quality)
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
            state = self._saturation(key, "T", temperature + ZERO_CELSIUS_K, quality)
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
        t_k = temperature + ZERO_CELSIUS_K
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
        t_sat = sat.t + ZERO_CELSIUS_K
        getter = st.hmass if prop == "h" else st.smass
        sat_value = sat.h if prop == "h" else sat.s
        t_top = self.maximum_temperature + ZERO_CELSIUS_K
        if side == "gas":
            lo, hi = t_sat, None
        else:
            lo, hi = self.minimum_temperature + ZERO_CELSIUS_K, t_sat
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
            self._update_pt(pressure, self.maximum_temperature + ZERO_CELSIUS_K, CP.iphase_gas)
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
            ``"auto"``: fast path for mixtures (see :mod:`coldroom.physics.refrigerant.blend_table`);
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
        """Dynamic viscosity [Pa·s] of a liquid or vapour state, and the basis used
        (:func:`coldroom.physics.refrigerant.transport.fluid_viscosity`)."""
        return fluid_viscosity(self, state, phase)


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
