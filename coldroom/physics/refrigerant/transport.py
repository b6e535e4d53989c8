"""Viscosity of refrigerant states: CoolProp's transport models, and an approximation
from the components for CoolProp's predefined mixtures."""

from __future__ import annotations

import math
from functools import lru_cache
from typing import TYPE_CHECKING

import CoolProp.CoolProp as CP
from CoolProp.CoolProp import AbstractState

from coldroom.constants import ZERO_CELSIUS_K
from coldroom.physics.refrigerant.state import StatePoint, _finite

if TYPE_CHECKING:
    from coldroom.physics.refrigerant.fluid import Fluid


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
    t_k = temperature + ZERO_CELSIUS_K
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


def fluid_viscosity(fluid: Fluid, state: StatePoint, phase: str) -> tuple[float, str]:
    """Dynamic viscosity of a liquid or vapour state, and the basis used.

    Pure and pseudo-pure fluids: CoolProp's own transport model at the
    state (saturated states by quality, others by pressure and temperature
    with the phase imposed). Predefined mixtures (``.mix``): CoolProp 8.0
    returns liquid viscosities that are far off for them (R-454C liquid at
    −10 °C: 14 mPa·s, about 60 times a plausible value), so a documented
    approximation from the components is used instead (see
    :func:`blend_viscosity`) and the basis says so.

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
    >>> from coldroom.physics.refrigerant import get_fluid
    >>> fluid = get_fluid("R134a")
    >>> mu, basis = fluid_viscosity(fluid, fluid.saturated_liquid(temperature=40.0), "liquid")
    >>> round(mu * 1e6), basis                         # µPa·s
    (161, 'CoolProp')
    """
    if phase not in ("liquid", "vapour"):
        raise ValueError(f"phase must be 'liquid' or 'vapour', not {phase!r}")
    if fluid._mixture:
        components = tuple(zip(fluid._state.fluid_names(), fluid._state.get_mole_fractions()))
        try:
            return blend_viscosity(components, state.p, state.t, phase), MIXTURE_VISCOSITY_BASIS
        except ValueError as error:
            raise fluid._fail(str(error)) from None
    st = fluid._state
    try:
        if state.quality is not None:
            st.update(CP.PQ_INPUTS, state.p, state.quality)
        else:
            imposed = CP.iphase_liquid if phase == "liquid" else CP.iphase_gas
            if state.p >= fluid.critical_pressure or state.t >= fluid.critical_temperature:
                imposed = CP.iphase_supercritical
            fluid._update_pt(state.p, state.t + ZERO_CELSIUS_K, imposed)
        value = st.viscosity()
    except ValueError as error:
        raise fluid._fail(f"no viscosity at {state.p:.6g} Pa, {state.t:.3f} °C: CoolProp: {error}") from None
    if not (_finite(value) and value > 0.0):
        raise fluid._fail(f"viscosity at {state.p:.6g} Pa, {state.t:.3f} °C is not a positive number")
    return value, "CoolProp"
