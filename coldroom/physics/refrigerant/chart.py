"""States a p–h chart needs beyond what a cycle does.

The critical point's enthalpy, saturation right up to the critical point, a
mixture's whole phase envelope, and single-phase states of a known phase anywhere
in the chart's window (without the saturation look-up Fluid.state_pt makes to
decide the phase). Kept apart from the Fluid internals: these functions own their
AbstractStates (one per fluid for states, another for the envelope: once CoolProp
has traced an envelope its imposed-phase updates near the critical pressure become
a thousand times slower). Used by :mod:`coldroom.physics.chart_data`.
"""

from __future__ import annotations

import CoolProp.CoolProp as CP
from CoolProp.CoolProp import AbstractState

from coldroom.constants import ZERO_CELSIUS_K
from coldroom.errors import PropertyRangeError
from coldroom.physics.refrigerant.fluid import Fluid
from coldroom.physics.refrigerant.state import StatePoint, _finite


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
        points.append((t - ZERO_CELSIUS_K, p, h))
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
        state = StatePoint(st.p(), st.T() - ZERO_CELSIUS_K, st.hmass(), st.smass(), quality, st.rhomass())
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
        st.update(CP.PT_INPUTS, pressure, temperature + ZERO_CELSIUS_K)
        state = StatePoint(st.p(), st.T() - ZERO_CELSIUS_K, st.hmass(), st.smass(), None, st.rhomass())
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
    low, high = floor + ZERO_CELSIUS_K, floor + ZERO_CELSIUS_K + 400.0
    t = min(max(low + 0.5, guess + ZERO_CELSIUS_K), high - 1.0) if guess is not None else low + 20.0
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
        state = StatePoint(st.p(), st.T() - ZERO_CELSIUS_K, st.hmass(), st.smass(), None, st.rhomass())
    except ValueError as error:
        raise fluid._fail(f"no state at {pressure:.6g} Pa with s = {entropy:.6g}: CoolProp: {error}") from None
    finally:
        st.unspecify_phase()
    return state
