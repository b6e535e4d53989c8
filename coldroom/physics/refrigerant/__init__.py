"""Refrigerant properties: the only package that imports CoolProp.

:func:`get_fluid` returns a cached :class:`Fluid` per catalogue entry; a Fluid
gives saturation at dew and bubble points, single-phase and two-phase states
as :class:`StatePoint` (SI; temperature in °C), and data for p–h diagrams.
Enthalpy and entropy are in CoolProp's default reference state [ref:coolprop] (IIR for the
halocarbons: h = 200 kJ/kg, s = 1 kJ/kg·K for saturated liquid at 0 °C).

Modules, one job each:

* :mod:`.state`: the :class:`StatePoint` record (no CoolProp);
* :mod:`.fluid`: :class:`Fluid` (saturation, single-phase states, range guards) and
  :func:`get_fluid`; pure and pseudo-pure fluids use CoolProp's own flashes
  through ``AbstractState`` (microseconds);
* :mod:`.blend_table`: the fast saturation table and two-phase flash of CoolProp's
  predefined mixtures (``R448A.mix`` …), whose own flashes take milliseconds to
  half a second; the results are the same equation-of-state states CoolProp's
  flash finds (the tests compare both over the working envelope to 1e-6 K);
  ``method="flash"`` forces CoolProp's own flash (the reference);
* :mod:`.transport`: viscosity (CoolProp's, or a documented approximation for the
  predefined mixtures);
* :mod:`.chart`: states a p–h chart needs beyond a cycle (critical enthalpy, a
  mixture's phase envelope, states of a known phase).

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

from coldroom.physics.refrigerant.chart import (
    chart_saturated,
    chart_state_ps,
    chart_state_pt,
    critical_enthalpy,
    envelope_crossings,
    phase_envelope,
)
from coldroom.physics.refrigerant.fluid import Fluid, coolprop_version, get_fluid
from coldroom.physics.refrigerant.state import StatePoint
from coldroom.physics.refrigerant.transport import MIXTURE_VISCOSITY_BASIS, blend_viscosity

__all__ = [
    "MIXTURE_VISCOSITY_BASIS",
    "Fluid",
    "StatePoint",
    "blend_viscosity",
    "chart_saturated",
    "chart_state_ps",
    "chart_state_pt",
    "coolprop_version",
    "critical_enthalpy",
    "envelope_crossings",
    "get_fluid",
    "phase_envelope",
]
