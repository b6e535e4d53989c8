"""The single-stage vapour-compression cycle and its performance figures.

States (the numbering every refrigeration text uses):

1. compressor suction — temperature = evaporating dew temperature + superheat
   + suction-line superheat, at the suction pressure (evaporating dew pressure
   less the suction-line drop);
2. compressor discharge — h₂ = h₁ + (h₂ₛ − h₁)/η_is, at the condensing dew
   pressure (or the gas-cooler pressure for transcritical R-744);
3. condenser outlet — bubble temperature − subcooling at the condensing
   pressure (transcritical: the gas-cooler outlet temperature);
4. evaporator inlet — h₄ = h₃ (isenthalpic expansion) at the evaporating
   pressure.

ṁ = Q/(h_evap,out − h₄); V̇ = ṁ/ρ₁; displacement = V̇/η_v with the clearance
model η_v = 1 + C − C·(p₂/p₁)^(1/n); P = ṁ(h₂ − h₁); condenser duty (heat of
rejection) = ṁ(h₂ − h₃); COP = Q/P. Sources: Stoecker & Jones, *Refrigeration and Air Conditioning*,
2nd ed., ch. 10 (standard vapour-compression cycle) and ch. 11 (clearance
volumetric efficiency) [mem] [ref:stoecker-jones]; property values from
CoolProp [ref:coolprop].

The evaporating and condensing temperatures are *dew-point* temperatures
(°C); for blends the pressures come from the dew points, superheat is counted
from the dew point and subcooling from the bubble point.

Energy balance: refrigerating capacity + suction-line heat gain + compressor
power = condenser duty, exactly (h₄ = h₃ by construction). With no suction-line
superheat the suction-line gain is zero and Q + P = heat of rejection.

Several evaporators on one compressor: :mod:`coldroom.physics.system_cycle` (it calls
:func:`solve_cycle` with the warmer coils, whose mixing is done here).

Compressor power basis: ``isentropic_efficiency`` is the *overall* isentropic
efficiency on the electrical input (motor included), so ``compressor_power``
ṁ(h₂ − h₁) is the compressor's electrical input; for a suction-gas-cooled
hermetic or semi-hermetic compressor the motor losses go into the refrigerant
and the energy balance above still holds [trade].

Examples
--------
>>> r = solve_cycle("R134a", -10.0, 40.0, 5000.0)
>>> round(r.cop, 2), round(r.discharge_temperature, 1)
(2.62, 74.0)
"""

from __future__ import annotations

import math
from functools import lru_cache
from dataclasses import dataclass, replace

from coldroom.rules import (
    CYCLE_DEFAULTS,
    pressure_ratio_advisory,
)
from coldroom.physics.limits import discharge_temperature_warning
from coldroom.constants import STANDARD_ATMOSPHERE_PA, ZERO_CELSIUS_K
from coldroom.errors import CalculationError
from coldroom.results import Note, Term
from coldroom.physics.refrigerant import Fluid, StatePoint, coolprop_version, get_fluid
from coldroom.physics.transcritical import golden_max, liao_optimum_pressure

#: Defaults of the cycle (superheat, suction-line superheat, subcooling,
#: isentropic efficiency, clearance): :data:`coldroom.rules.CYCLE_DEFAULTS`,
#: the one table that ``coldroom cycle`` and a project's refrigeration block use.
_D = CYCLE_DEFAULTS
#: What ``compressor_power`` is, said in the JSON beside it: the compressor's electrical
#: input (the isentropic efficiency is the overall one, motor included; module note).
COMPRESSOR_POWER_BASIS = "electrical"

#: GWP (AR4) from which EU Regulation 517/2014 annex III restricts new
#: stationary refrigeration equipment (from 2020) [mem; verify].
GWP_RESTRICTION = 2500.0

#: R-744 condensing temperatures at or above critical − this margin need the
#: transcritical (gas cooler) description [K] (common practice, no source). Half a kelvin:
#: the subcooled liquid below it still solves (up to about critical − 0.2 K with this
#: property model), and a measured discharge pressure of 72.5 bar (dew 30.2 °C) is read as
#: condensing, as a technician reading a subcritical gauge expects.
R744_SUBCRITICAL_MARGIN = 0.5


@lru_cache(maxsize=1)
def r744_boundary() -> tuple[float, float]:
    """The R-744 transcritical boundary: (dew temperature [°C], pressure [Pa]).

    Critical temperature less :data:`R744_SUBCRITICAL_MARGIN`, and the dew
    pressure there.
    """
    fluid = get_fluid("R-744")
    temperature = fluid.critical_temperature - R744_SUBCRITICAL_MARGIN
    return temperature, fluid.dew_pressure(temperature)


def r744_transcritical(condensing_temperature: float | None = None, *, pressure: float | None = None) -> bool:
    """Whether an R-744 cycle condensing at this dew temperature [°C] (or with this high-side
    pressure [Pa]) must be sized transcritical.

    The one place that draws the boundary (:func:`r744_boundary`), for the sizing, the
    cycle and the command line's measured discharge pressure alike: at or above it the heat
    is rejected in a gas cooler (:func:`solve_cycle` refuses a condensing temperature there).

    Examples
    --------
    >>> r744_transcritical(25.0), r744_transcritical(30.0), r744_transcritical(30.5)
    (False, False, True)
    >>> r744_transcritical(pressure=72.5e5), r744_transcritical(pressure=74e5)
    (False, True)
    """
    temperature, boundary_pressure = r744_boundary()
    if pressure is not None:
        return pressure >= boundary_pressure
    if condensing_temperature is None:
        raise ValueError("give a condensing temperature or a pressure")
    return condensing_temperature >= temperature


@dataclass(frozen=True)
class CycleResult:
    """A solved cycle. SI units; temperatures in °C.

    Attributes
    ----------
    refrigerant : str
        Catalogue name, e.g. ``"R-448A"``.
    property_model : str
        ``"CoolProp <version> HEOS <fluid>"``.
    evaporating_temperature : float
        Evaporating dew temperature [°C].
    condensing_temperature : float or None
        Condensing dew temperature [°C]; ``None`` for a transcritical cycle.
    gas_cooler_outlet_temperature : float or None
        Gas-cooler outlet temperature [°C] (transcritical R-744 only).
    transcritical : bool
        True when the high side is above the critical pressure.
    capacity : float
        Refrigerating capacity (evaporator duty) [W].
    superheat, subcooling, suction_line_superheat, suction_pressure_drop : float
        Inputs [K] (the pressure drop as a saturation-temperature loss).
    discharge_pressure_drop : float
        Discharge-line drop as a rise of the compressor's saturated discharge
        temperature above condensing [K].
    isentropic_efficiency, clearance : float
        Inputs [1].
    polytropic_exponent : float
        Exponent n used in the clearance model [1] (given, or the isentropic
        path exponent ln(p₂/p₁)/ln(ρ₂ₛ/ρ₁)).
    states : tuple of StatePoint
        States 1 (suction), 2 (discharge), 3 (condenser outlet), 4 (evaporator inlet).
    evaporator_outlet : StatePoint
        State leaving the evaporator (before suction-line gain and drop).
    isentropic_discharge : StatePoint
        State 2s (isentropic compression to the discharge pressure).
    evaporating_pressure, suction_pressure, discharge_pressure : float
        [Pa] absolute.
    refrigerating_effect : float
        h_evap,out − h₄ [J/kg].
    mass_flow : float
        Refrigerant mass flow [kg/s].
    suction_volume_flow : float
        Volume flow at compressor suction [m³/s].
    volumetric_efficiency : float
        Clearance-model volumetric efficiency [1].
    displacement : float
        Required swept volume rate [m³/s].
    compressor_power : float
        Compressor electrical input, ṁ(h₂ − h₁) with the overall isentropic
        efficiency (motor included; see the module note,
        :data:`COMPRESSOR_POWER_BASIS`) [W].
    condenser_duty : float
        Heat of rejection, ṁ(h₂ − h₃) [W].
    suction_line_heat_gain : float
        ṁ(h₁ − h_evap,out) [W] (zero without suction-line superheat).
    cop : float
        Capacity / compressor power [1].
    carnot_cop : float
        T_e/(T_c − T_e) with dew temperatures in K (transcritical: T_c = gas
        cooler outlet) [1].
    carnot_ratio : float
        cop / carnot_cop [1].
    discharge_temperature : float
        t₂ [°C].
    pressure_ratio : float
        Discharge / suction pressure [1].
    glide_evaporator : float
        Dew minus bubble temperature at the evaporating pressure [K].
    glide_condenser : float or None
        Dew minus bubble temperature at the condensing pressure [K];
        ``None`` when transcritical.
    optimum_pressure_correlation : float or None
        Liao et al. (2000) optimum high-side pressure [Pa] for comparison
        (transcritical only).
    warnings : tuple of str
        Plain-language advisories (discharge temperature, pressure ratio,
        sub-atmospheric suction, flammability/toxicity, GWP).
    evaporator_flows : tuple of float
        Mass flow through each evaporator [kg/s], in the order given to
        :func:`coldroom.physics.system_cycle.solve_system_cycle` (one entry, the total, for a single coil).
    coil_outlets : tuple of StatePoint
        Each evaporator's own outlet state, in the order given to
        :func:`coldroom.physics.system_cycle.solve_system_cycle`, at its evaporating (dew) pressure, before
        a warmer coil's EPR throttles it to the coldest coil's pressure; empty
        for a single coil.
    """

    refrigerant: str
    property_model: str
    evaporating_temperature: float
    condensing_temperature: float | None
    gas_cooler_outlet_temperature: float | None
    transcritical: bool
    capacity: float
    superheat: float
    subcooling: float
    isentropic_efficiency: float
    suction_line_superheat: float
    suction_pressure_drop: float
    discharge_pressure_drop: float
    clearance: float
    polytropic_exponent: float
    states: tuple[StatePoint, StatePoint, StatePoint, StatePoint]
    evaporator_outlet: StatePoint
    isentropic_discharge: StatePoint
    evaporating_pressure: float
    suction_pressure: float
    discharge_pressure: float
    refrigerating_effect: float
    mass_flow: float
    suction_volume_flow: float
    volumetric_efficiency: float
    displacement: float
    compressor_power: float
    condenser_duty: float
    suction_line_heat_gain: float
    cop: float
    carnot_cop: float
    carnot_ratio: float
    discharge_temperature: float
    pressure_ratio: float
    glide_evaporator: float
    glide_condenser: float | None
    optimum_pressure_correlation: float | None
    safety_class: str
    gwp_ar4: float
    warnings: tuple[str, ...]
    evaporator_flows: tuple[float, ...] = ()
    coil_outlets: tuple[StatePoint, ...] = ()

    def to_json(self) -> dict:
        """JSON-ready dict; every numeric key names its unit (DEVELOPERS.md "Contracts").

        Examples
        --------
        >>> d = solve_cycle("R134a", -10.0, 40.0, 5000.0).to_json()
        >>> [k for k in ("refrigerant", "mass_flow_kg_s", "states") if k in d]
        ['refrigerant', 'mass_flow_kg_s', 'states']
        >>> sorted(d["states"][0])
        ['h_j_kg', 'p_pa', 'quality', 's_j_kg_k', 't_c']
        """
        def state(s: StatePoint) -> dict:
            return {"p_pa": s.p, "t_c": s.t, "h_j_kg": s.h, "s_j_kg_k": s.s, "quality": s.quality}

        return {
            "refrigerant": self.refrigerant,
            "property_model": self.property_model,
            "evaporating_temperature_c": self.evaporating_temperature,
            "condensing_temperature_c": self.condensing_temperature,
            "gas_cooler_outlet_temperature_c": self.gas_cooler_outlet_temperature,
            "transcritical": self.transcritical,
            "capacity_w": self.capacity,
            "superheat_k": self.superheat,
            "subcooling_k": self.subcooling,
            "isentropic_efficiency": self.isentropic_efficiency,
            "suction_line_superheat_k": self.suction_line_superheat,
            "suction_pressure_drop_k": self.suction_pressure_drop,
            "discharge_pressure_drop_k": self.discharge_pressure_drop,
            "clearance": self.clearance,
            "polytropic_exponent": self.polytropic_exponent,
            "evaporating_pressure_pa": self.evaporating_pressure,
            "suction_pressure_pa": self.suction_pressure,
            "discharge_pressure_pa": self.discharge_pressure,
            "refrigerating_effect_j_kg": self.refrigerating_effect,
            "mass_flow_kg_s": self.mass_flow,
            "suction_volume_flow_m3_h": self.suction_volume_flow * 3600.0,
            "volumetric_efficiency": self.volumetric_efficiency,
            "displacement_m3_h": self.displacement * 3600.0,
            "compressor_power_w": self.compressor_power,
            "compressor_power_basis": COMPRESSOR_POWER_BASIS,
            "condenser_duty_w": self.condenser_duty,
            "suction_line_heat_gain_w": self.suction_line_heat_gain,
            "cop": self.cop,
            "carnot_cop": self.carnot_cop,
            "carnot_ratio": self.carnot_ratio,
            "discharge_temperature_c": self.discharge_temperature,
            "isentropic_discharge_temperature_c": self.isentropic_discharge.t,
            "pressure_ratio": self.pressure_ratio,
            "glide_evaporator_k": self.glide_evaporator,
            "glide_condenser_k": self.glide_condenser,
            "optimum_high_side_pressure_liao_pa": self.optimum_pressure_correlation,
            "safety_class": self.safety_class,
            "gwp_ar4": float(self.gwp_ar4),
            "warnings": list(self.warnings),
            "states": [state(s) for s in self.states],
        }


def _check(name: str, value: float, low: float, high: float, unit: str, low_open: bool = False) -> None:
    ok = math.isfinite(value) and (value > low if low_open else value >= low) and value <= high
    if not ok:
        bracket = "(" if low_open else "["
        raise CalculationError(f"{name} {value!r} {unit} is outside the valid range {bracket}{low:g}, {high:g}]".replace("  ", " "))


def check_cycle_inputs(
    evaporating_temperature: float | None,
    capacity: float,
    superheat: float = _D.superheat,
    subcooling: float = _D.subcooling,
    isentropic_efficiency: float = _D.isentropic_efficiency,
    suction_line_superheat: float = _D.suction_line_superheat,
    suction_pressure_drop: float = 0.0,
    clearance: float = _D.clearance,
    polytropic_exponent: float | None = None,
) -> None:
    """Refuse cycle inputs outside the range :func:`solve_cycle` works in (no property look-up).

    Parameters are those of :func:`solve_cycle`, in the same units (an
    evaporating temperature of None is not checked). The
    capacity must be at least 1 W: below that no refrigeration system exists
    and the mass flow underflows (a usable-range guard, common practice, no
    source).

    Raises
    ------
    CalculationError
        A value outside its range, naming the quantity, the value and the range.

    Examples
    --------
    >>> check_cycle_inputs(-10.0, 1e-320)
    Traceback (most recent call last):
    ...
    coldroom.errors.CalculationError: capacity 1e-320 W is outside the valid range [1, 1e+09]
    """
    _check("capacity", capacity, 1.0, 1e9, "W")
    _check("superheat", superheat, 0.0, 60.0, "K")
    _check("subcooling", subcooling, 0.0, 40.0, "K")
    _check("isentropic efficiency", isentropic_efficiency, 0.0, 1.0, "", low_open=True)
    _check("suction-line superheat", suction_line_superheat, 0.0, 60.0, "K")
    _check("suction pressure drop", suction_pressure_drop, 0.0, 20.0, "K")
    _check("clearance", clearance, 0.0, 0.5, "")
    if polytropic_exponent is not None:
        _check("polytropic exponent", polytropic_exponent, 1.0, 2.0, "", low_open=True)
    if evaporating_temperature is not None:
        _check("evaporating temperature", evaporating_temperature, -100.0, 60.0, "°C")


def _high_side(
    fluid: Fluid,
    state1: StatePoint,
    p_high: float,
    isentropic_efficiency: float,
    liquid: StatePoint | None,
    gas_cooler_outlet_temperature: float | None,
    actual: bool = True,
) -> tuple[StatePoint, StatePoint | None, StatePoint]:
    """States 2s, 2, 3 at high-side pressure *p_high* (2 is None unless *actual*)."""
    s2s = fluid.state_ps(p_high, state1.s)
    if not actual:
        s2 = None
    elif isentropic_efficiency == 1.0:
        s2 = s2s
    else:
        h2 = state1.h + (s2s.h - state1.h) / isentropic_efficiency  # [mem, textbooks] [ref:stoecker-jones]
        s2 = replace(fluid.state_ph(p_high, h2), h=h2)
    if liquid is None:  # transcritical gas cooler outlet
        s3 = fluid.state_pt(p_high, gas_cooler_outlet_temperature)
    else:
        s3 = liquid
    return s2s, s2, s3


def solve_cycle(
    refrigerant: str,
    evaporating_temperature: float,
    condensing_temperature: float | None,
    capacity: float,
    superheat: float = _D.superheat,
    subcooling: float = _D.subcooling,
    isentropic_efficiency: float = _D.isentropic_efficiency,
    suction_line_superheat: float = _D.suction_line_superheat,
    suction_pressure_drop: float = 0.0,
    clearance: float = _D.clearance,
    polytropic_exponent: float | None = None,
    gas_cooler_outlet_temperature: float | None = None,
    high_side_pressure: float | None = None,
    discharge_pressure_drop: float = 0.0,
    _warmer: tuple[tuple[float, float, float], ...] = (),
    _displacement_only: bool = False,
    _performance_only: bool = False,
) -> CycleResult:
    """Solve a single-stage vapour-compression cycle for a refrigerating capacity.

    Parameters
    ----------
    refrigerant : str
        Catalogue name (any spelling :func:`coldroom.data.refrigerants.lookup` accepts).
    evaporating_temperature : float
        Evaporating dew temperature [°C].
    condensing_temperature : float or None
        Condensing dew temperature [°C]. For R-744 at or above the boundary of
        :func:`r744_transcritical` the cycle is transcritical: give
        *gas_cooler_outlet_temperature* instead (this may then be ``None``).
    capacity : float
        Refrigerating capacity [W], 1 W … 1 GW.
    superheat : float
        Useful superheat in the evaporator, from the dew point [K]. Default
        :data:`coldroom.rules.CYCLE_DEFAULTS` (all defaults below come from that table).
    subcooling : float
        Subcooling below the bubble point at the condenser outlet [K]. Not
        used for a transcritical gas cooler.
    isentropic_efficiency : float
        Compressor isentropic efficiency [1], 0 < η ≤ 1.
    suction_line_superheat : float
        Further (useless) superheat picked up in the suction line [K]; 0 for none.
    suction_pressure_drop : float
        Suction-line pressure drop expressed as a loss of saturation temperature [K]. Default 0.
    clearance : float
        Clearance volume ratio C [1].
    polytropic_exponent : float, optional
        Re-expansion exponent n [1]; default the isentropic path exponent
        ln(p₂/p₁)/ln(ρ₂ₛ/ρ₁) (common practice, no source).
    gas_cooler_outlet_temperature : float, optional
        R-744 transcritical: gas-cooler outlet temperature [°C].
    discharge_pressure_drop : float
        Discharge-line pressure drop as a rise of saturation temperature [K]:
        the compressor discharges at the dew pressure of the condensing
        temperature plus this; the condenser stays at the condensing pressure.
        Default 0. Ignored for a transcritical cycle.
    high_side_pressure : float, optional
        R-744 transcritical: gas-cooler pressure [Pa]; default the pressure
        that maximises COP (golden-section search between 1.02 × critical
        pressure and 14 MPa for these inputs; common practice, no source). The
        Liao et al. (2000) correlation is reported beside it for comparison.

    Returns
    -------
    CycleResult

    Raises
    ------
    CalculationError
        Inputs out of range or a cycle that cannot exist (e.g. evaporating not
        below condensing); :class:`PropertyRangeError` for states outside the
        property model.
    LookupNameError
        Unknown refrigerant.

    Examples
    --------
    Ideal cycle (saturated vapour in, isentropic, saturated liquid out):

    >>> r = solve_cycle("R-134a", -20.0, 40.0, 1000.0, superheat=0, suction_line_superheat=0, subcooling=0,
    ...                 isentropic_efficiency=1)
    >>> r.states[0].quality, r.states[2].quality
    (1.0, 0.0)
    """
    fluid = get_fluid(refrigerant)
    info = fluid.info
    check_cycle_inputs(
        evaporating_temperature, capacity, superheat, subcooling, isentropic_efficiency,
        suction_line_superheat, suction_pressure_drop, clearance, polytropic_exponent,
    )
    _check("discharge pressure drop", discharge_pressure_drop, 0.0, 20.0, "K")

    is_r744 = info.name == "R-744"
    transcritical = False
    if is_r744:
        limit = fluid.critical_temperature - R744_SUBCRITICAL_MARGIN
        if gas_cooler_outlet_temperature is not None:
            transcritical = True
        elif condensing_temperature is None:
            raise CalculationError(
                "R-744 without a condensing temperature is a transcritical cycle: give the gas-cooler outlet temperature"
            )
        elif r744_transcritical(condensing_temperature):
            raise CalculationError(
                f"R-744 condensing at {condensing_temperature:.2f} °C is at or above {limit:.1f} °C "
                f"(critical {fluid.critical_temperature:.1f} °C): the cycle is transcritical; "
                "give the gas-cooler outlet temperature"
            )
    elif gas_cooler_outlet_temperature is not None or high_side_pressure is not None:
        raise CalculationError(
            f"gas-cooler outlet temperature / high-side pressure apply to transcritical R-744 only, not {info.name}"
        )
    if not transcritical:
        if condensing_temperature is None:
            raise CalculationError("condensing temperature is required")
        _check("condensing temperature", condensing_temperature, -60.0, 150.0, "°C")
        if condensing_temperature - evaporating_temperature < 1.0:
            raise CalculationError(
                f"condensing temperature {condensing_temperature} °C must be at least 1 K above "
                f"the evaporating temperature {evaporating_temperature} °C"
            )
    else:
        _check("gas-cooler outlet temperature", gas_cooler_outlet_temperature, -20.0, 80.0, "°C")
        if gas_cooler_outlet_temperature - evaporating_temperature < 1.0:
            raise CalculationError(
                f"gas-cooler outlet temperature {gas_cooler_outlet_temperature} °C must be above the "
                f"evaporating temperature {evaporating_temperature} °C"
            )
        if high_side_pressure is not None:
            _check("high-side pressure", high_side_pressure, 1.0 * fluid.critical_pressure, 20e6, "Pa", low_open=True)

    # --- low side ---------------------------------------------------------
    te = evaporating_temperature
    evap_dew = fluid.saturated_vapour(temperature=te)
    p_evap = evap_dew.p
    p_suction = fluid.dew_pressure(te - suction_pressure_drop) if suction_pressure_drop > 0 else p_evap
    # evaporator outlet: dew + useful superheat (blends: superheat counted from dew [trade])
    evap_out = evap_dew if superheat == 0 else fluid.state_pt(p_evap, te + superheat, phase="gas")
    coil_out = evap_out  # the coldest coil's own outlet
    warm_outlets = tuple(
        fluid.saturated_vapour(temperature=t) if sh == 0 else fluid.state_pt(
            fluid.saturated_vapour(temperature=t).p, t + sh, phase="gas"
        )
        for t, sh, _q in _warmer
    )

    def suction_states(h_liquid: float) -> tuple[StatePoint, StatePoint, tuple[float, ...]]:
        """Evaporator outlet (mixed), state 1 and each coil's mass flow for a liquid enthalpy."""
        if not _warmer:
            out = evap_out
            flows: tuple[float, ...] = ()
        else:  # EPR throttles are isenthalpic; adiabatic mixing at the coldest coil's pressure [mem] [ref:stoecker-jones]
            duties = (capacity - sum(q for _t, _sh, q in _warmer),) + tuple(q for _t, _sh, q in _warmer)
            outlets = (coil_out,) + warm_outlets
            flows = tuple(q / (o.h - h_liquid) for q, o in zip(duties, outlets))
            h_mix = sum(m * o.h for m, o in zip(flows, outlets)) / sum(flows)
            out = replace(fluid.state_ph(p_evap, h_mix), h=h_mix)
        # compressor suction: outlet + suction-line superheat, at the suction pressure
        if suction_line_superheat == 0 and suction_pressure_drop == 0:
            first = out
        else:
            first = fluid.state_pt(p_suction, out.t + suction_line_superheat, phase="gas")
        return out, first, flows

    # --- high side --------------------------------------------------------
    liao = None
    if transcritical:
        tgc = gas_cooler_outlet_temperature
        liao = liao_optimum_pressure(te, tgc)
        h_liquid_guess = fluid.state_pt(1.02 * fluid.critical_pressure, tgc).h
        for _ in range(1 if not _warmer else 6):  # the mixture depends on h3, h3 on the optimum pressure
            evap_out, state1, flows = suction_states(h_liquid_guess)

            def cop_at(p: float) -> float:
                s2s, s2, s3 = _high_side(fluid, state1, p, isentropic_efficiency, None, tgc)
                return (evap_out.h - s3.h) / (s2.h - state1.h)

            p_high = high_side_pressure if high_side_pressure is not None else golden_max(
                cop_at, 1.02 * fluid.critical_pressure, 14e6
            )
            s2s, state2, state3 = _high_side(fluid, state1, p_high, isentropic_efficiency, None, tgc)
            converged = abs(state3.h - h_liquid_guess) < 1.0
            h_liquid_guess = state3.h
            if converged:
                break
        evap_out, state1, flows = suction_states(state3.h)
        s2s, state2, state3 = _high_side(fluid, state1, p_high, isentropic_efficiency, None, tgc)
        glide_cond = None
        t_reject = tgc
    else:
        tc = condensing_temperature
        p_high = fluid.dew_pressure(tc)
        bubble = fluid.saturated_liquid(pressure=p_high)
        liquid = bubble if subcooling == 0 else fluid.state_pt(p_high, bubble.t - subcooling, phase="liquid")
        evap_out, state1, flows = suction_states(liquid.h)
        if discharge_pressure_drop > 0:  # compressor works against condenser + discharge-line drop
            p_high = fluid.dew_pressure(tc + discharge_pressure_drop)
        s2s, state2, state3 = _high_side(fluid, state1, p_high, isentropic_efficiency, liquid, None,
                                         actual=not _displacement_only)
        glide_cond = tc - bubble.t if info.is_blend else 0.0
        t_reject = tc
    if p_high <= p_suction:
        raise CalculationError("high-side pressure must exceed the suction pressure")

    # --- mass flow and compressor displacement (h4 = h3) -----------------
    refrigerating_effect = evap_out.h - state3.h
    if refrigerating_effect <= 0:
        raise CalculationError(f"no refrigerating effect ({refrigerating_effect:.1f} J/kg) at these conditions")
    mass_flow = capacity / refrigerating_effect
    volume_flow = mass_flow / state1.density
    pressure_ratio = p_high / p_suction
    if polytropic_exponent is None:
        # isentropic path exponent from the end states of 1→2s (common practice, no source)
        n = math.log(pressure_ratio) / math.log(s2s.density / state1.density)
    else:
        n = polytropic_exponent
    eta_v = 1.0 + clearance - clearance * pressure_ratio ** (1.0 / n)  # clearance model [mem, textbooks]
    if eta_v <= 0.05:
        raise CalculationError(
            f"volumetric efficiency {eta_v:.3f} ≤ 0.05 at pressure ratio {pressure_ratio:.1f} with clearance "
            f"{clearance}: a single-stage compressor cannot pump at these conditions"
        )
    displacement = volume_flow / eta_v
    if _displacement_only:
        return displacement  # type: ignore[return-value]  # see compressor_displacement
    assert state2 is not None
    if _performance_only:  # see system_cycle.compressor_performance: the same arithmetic as `power` below
        return displacement, mass_flow * (state2.h - state1.h)  # type: ignore[return-value]

    # --- expansion outlet and performance -------------------------------
    state4 = replace(fluid.state_ph(p_evap, state3.h), h=state3.h)
    glide_evap = te - fluid.bubble_temperature(p_evap) if info.is_blend else 0.0
    work = state2.h - state1.h
    power = mass_flow * work
    condenser_duty = mass_flow * (state2.h - state3.h)
    suction_gain = mass_flow * (state1.h - evap_out.h)
    cop = capacity / power
    te_k, tr_k = te + ZERO_CELSIUS_K, t_reject + ZERO_CELSIUS_K
    carnot = te_k / (tr_k - te_k)  # Carnot refrigerator COP, any thermodynamics text

    warnings = _warnings(info, state2.t, pressure_ratio, p_suction, eta_v, evaporating_temperature)
    return CycleResult(
        refrigerant=info.name,
        property_model=f"CoolProp {coolprop_version()} HEOS {info.coolprop_name}",
        evaporating_temperature=te,
        condensing_temperature=None if transcritical else condensing_temperature,
        gas_cooler_outlet_temperature=gas_cooler_outlet_temperature if transcritical else None,
        transcritical=transcritical,
        capacity=capacity,
        superheat=superheat if not _warmer else evap_out.t - te,
        subcooling=0.0 if transcritical else subcooling,
        isentropic_efficiency=isentropic_efficiency,
        suction_line_superheat=suction_line_superheat,
        suction_pressure_drop=suction_pressure_drop,
        discharge_pressure_drop=0.0 if transcritical else discharge_pressure_drop,
        clearance=clearance,
        polytropic_exponent=n,
        states=(state1, state2, state3, state4),
        evaporator_outlet=evap_out,
        isentropic_discharge=s2s,
        evaporating_pressure=p_evap,
        suction_pressure=p_suction,
        discharge_pressure=p_high,
        refrigerating_effect=refrigerating_effect,
        mass_flow=mass_flow,
        suction_volume_flow=volume_flow,
        volumetric_efficiency=eta_v,
        displacement=displacement,
        compressor_power=power,
        condenser_duty=condenser_duty,
        suction_line_heat_gain=suction_gain,
        cop=cop,
        carnot_cop=carnot,
        carnot_ratio=cop / carnot,
        discharge_temperature=state2.t,
        pressure_ratio=pressure_ratio,
        glide_evaporator=glide_evap,
        glide_condenser=glide_cond,
        optimum_pressure_correlation=liao,
        safety_class=info.safety_class,
        gwp_ar4=info.gwp_ar4,
        warnings=warnings,
        evaporator_flows=flows if _warmer else (mass_flow,),
        coil_outlets=(coil_out,) + warm_outlets if _warmer else (),
    )


def compressor_displacement(
    refrigerant: str,
    evaporating_temperature: float,
    condensing_temperature: float | None,
    capacity: float,
    **options: float | None,
) -> float:
    """Compressor displacement [m³/s] the cycle needs for *capacity*: exactly
    ``solve_cycle(...).displacement`` for the same arguments (the keywords are
    :func:`solve_cycle`'s), without the states that do not bear on it (the
    expansion-valve outlet and the actual discharge), so about half the work for
    a blend. For capacity curves such as the pull-down's.

    Examples
    --------
    >>> compressor_displacement("R134a", -10.0, 40.0, 5000.0) == solve_cycle("R134a", -10.0, 40.0, 5000.0).displacement
    True
    """
    return solve_cycle(  # type: ignore[return-value]
        refrigerant, evaporating_temperature, condensing_temperature, capacity,
        _displacement_only=True, **options,  # type: ignore[arg-type]
    )


def _warnings(
    info, discharge_temperature: float, pressure_ratio: float, suction_pressure: float, eta_v: float,
    evaporating_temperature: float,
) -> tuple[str, ...]:
    out = []
    too_hot = discharge_temperature_warning(discharge_temperature, info.name)
    if too_hot is not None:
        out.append(too_hot)
    advisory = pressure_ratio_advisory(pressure_ratio, evaporating_temperature)
    if advisory is not None:
        out.append(advisory)
    if suction_pressure < STANDARD_ATMOSPHERE_PA:
        out.append(
            Note(
                "suction pressure ", Term(suction_pressure, "pressure"),
                " is below atmospheric: a leak draws in air and moisture",
            )
        )
    if eta_v < 0.5:
        out.append(f"volumetric efficiency {eta_v:.2f} is low: the compressor is large for the duty")
    if info.flammable or info.higher_toxicity:
        kinds = []
        if info.higher_toxicity:
            kinds.append("higher toxicity")
        if info.flammable:
            kinds.append({"2L": "lower flammability", "2": "flammable", "3": "higher flammability"}[info.safety_class[1:]])
        out.append(
            f"{info.name} is safety class {info.safety_class} ({', '.join(kinds)}): charge limits and room rules of "
            "EN 378 / ISO 5149 / IEC 60335-2-89 apply; check local codes"
        )
    if info.gwp_ar4 >= GWP_RESTRICTION:
        out.append(
            f"{info.name} has GWP {info.gwp_ar4:.0f} (AR4) ≥ 2500: restricted for new stationary refrigeration "
            "in the EU (Regulation 517/2014) [mem]; check local rules"
        )
    return tuple(out)
