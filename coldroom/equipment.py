"""Existing units: will the installed unit still hold the room at its new conditions?

A condensing unit's capacity is not its nameplate: it depends on the suction
and condensing dew points it actually runs at, and it falls steeply as the
suction temperature falls (the suction gas gets thinner, the pressure ratio
rises and the volumetric efficiency drops). This module

1. models the compressor at any suction dew point S and discharge dew point D,
   either from **one rated point** (:class:`RatedPointCompressor`) or from the
   **AHRI 540 / EN 12900 ten-coefficient polynomials** [ref:ahri-540] [ref:en-12900]
   (:class:`PolynomialCompressor`);
2. finds the **balance point** of compressor, evaporator and condenser
   (:func:`balance_point`): S and D such that compressor capacity = unit-cooler
   capacity K_e·(t_room − S) and compressor heat rejection = condenser capacity
   K_c·(D − t_ambient);
3. gives the **verdict** (:func:`check_unit` → :class:`CheckResult`): capacity
   at balance vs the room's required capacity, run hours per day needed,
   margin, the highest ambient at which the unit still holds, and warnings.

Conventions and choices (documented here once):

* Temperatures in °C (saturated **dew** points for S and D, as in EN 12900 and
  AHRI 540 [pub]); capacities and powers in W; mass flow in kg/s.
* "Capacity" of the unit at a point is the **useful** refrigerating effect
  in the project's terms: ṁ·(h at evaporator outlet (dew + superheat) − h of
  the liquid (bubble − subcooling)); suction-line superheat heats the gas the
  compressor draws but does no useful cooling (common practice, no source).
* Heat rejection THR = ṁ·(h_suction gas − h_liquid) + P: all electrical power
  ends up in the refrigerant (hermetic / semi-hermetic compressor, shell
  losses ignored) [trade]. The discharge temperature follows from
  h₂ = h_suction + P/ṁ and is therefore an upper estimate.
* **Envelope (decision).** A polynomial is a curve fit, valid only inside the
  published envelope [pub]. :meth:`PolynomialCompressor.performance` *refuses*
  (raises :class:`OutsideEnvelopeError`) a point more than
  :data:`ENVELOPE_TOLERANCE` outside it. The balance search evaluates the
  polynomial freely while iterating (the solver needs a continuous function),
  but when the balance point lies outside the envelope the check reports
  **no capacity** (``capacity_at_balance_w = null``), ``holds = false`` and
  ``within_envelope = false`` with a warning naming the point and the envelope
  — the extrapolated number is never shown as a capacity.
  A rated-point model has no envelope (it is physics, not a fit), but when
  asked to run more than :data:`RATING_SUCTION_GAP` below its rating suction it
  is flagged as a medium-temperature unit at low-temperature suction [trade].
* Without unit-cooler (or condenser) data the evaporating (condensing)
  temperature is fixed by the sizing TD (:func:`coldroom.sizing.design_temperatures`):
  S = t_room − TD_evap, D = t_ambient + TD_cond. The evaporator is then
  assumed able to take whatever the compressor pumps at that TD — an
  optimistic assumption stated in the result's ``evaporator_basis``.
* **Verdict.** ``holds`` when the capacity at balance covers the room's
  required capacity (1 + SF)·E/run time (ASHRAE Handbook—Refrigeration,
  "Refrigerated-Facility Loads" [pub]); equivalently when the run hours
  needed, (1 + SF)·E/capacity, fit in the room's run time. A capacity below
  the peak-hour load is a warning, not a failure.
* **Ambient.** "Ambient" is the air on the condenser. For the chart and the
  highest-ambient search the outdoor design air moves with it (same shift,
  outdoor RH held; surfaces facing other spaces keep their temperatures) and
  the room load is recomputed at each ambient (:func:`check_room`).

Examples
--------
The ten-coefficient form evaluated by hand (only C1, C2, C3 non-zero):

>>> ahri540_polynomial([1000.0, 50.0, -10.0] + [0.0] * 7, -10.0, 40.0)
100.0
>>> evaporator = HeatExchanger.from_rating(4500.0, 9.0, "unit cooler")
>>> round(evaporator.conductance, 1)
500.0
"""

from __future__ import annotations

import math
from dataclasses import dataclass, replace
from typing import TYPE_CHECKING, Any, Callable, Optional, Sequence

from coldroom.errors import CalculationError, PropertyRangeError
from coldroom.results import Note, Term
from coldroom.units import format_terms

#: Text mixed with SI numbers (:class:`coldroom.results.Term`); reports show it
#: in their own unit system with :func:`coldroom.units.format_terms`.
Phrase = tuple  # tuple[str | Term, ...]


def _n(value: float, kind: str) -> Term:
    """One number inside a phrase (no separator of its own)."""
    return Term(value, kind, sep="")

if TYPE_CHECKING:  # pragma: no cover
    from coldroom.projectfile import ExistingUnit, ProjectModel, Refrigeration, Room
    from coldroom.results import RoomLoads

#: How far [K] a point may lie outside a polynomial's published envelope before
#: it is refused (rounding of catalogue envelopes; common practice, no source).
ENVELOPE_TOLERANCE = 1.0

#: EN 12900 rating superheat when a rated point gives neither superheat nor
#: suction-gas temperature [K] (EN 12900: 10 K superheat or 20 °C suction gas
#: [mem]).
DEFAULT_RATING_SUPERHEAT = 10.0

#: Rice & Dabiri suction-density correction factor F (ṁ = ṁ_map·[1 + F·(ρ/ρ_map − 1)])
#: [pub; the value 0.75 from memory, verify] [ref:dabiri-rice-1981].
RICE_DABIRI_F = 0.75

#: A rated-point unit asked to run this far [K] below its rating suction dew point
#: is flagged as run outside its application class (medium-temperature unit at
#: low-temperature suction) [trade].
RATING_SUCTION_GAP = 10.0

#: Discharge-temperature and pressure-ratio flags [trade].
DISCHARGE_WARNING = 110.0  # °C, discharge line ≲ 110–120 °C [trade]
DISCHARGE_LIMIT = 135.0  # °C, ~135 °C hard limit [trade]
PRESSURE_RATIO_WARNING = 10.0  # single stage sensible to ≈ 8–10 [trade]

#: Ambient temperatures of the capacity/load chart [°C].
CHART_AMBIENTS: tuple[float, ...] = tuple(20.0 + 5.0 * i for i in range(6))  # smooth curves: 5 K steps suffice

#: Range searched for the highest ambient at which the unit holds [°C].
MAX_AMBIENT_RANGE = (10.0, 55.0)

_POUND = 0.45359237  # kg, exact (1959 agreement)
_BTU_PER_HOUR = 1055.05585262 / 3600.0  # W per Btu/h, International Table Btu (NIST SP 811)


class OutsideEnvelopeError(CalculationError):
    """A compressor polynomial asked for a point outside its published envelope."""


# --------------------------------------------------------------------------- polynomial


def ahri540_polynomial(coefficients: Sequence[float], suction: float, discharge: float) -> float:
    """The AHRI 540 / EN 12900 ten-coefficient polynomial [pub].

    X = C1 + C2·S + C3·D + C4·S² + C5·S·D + C6·D² + C7·S³ + C8·D·S² + C9·S·D² + C10·D³
    (AHRI Standard 540 / EN 12900, coefficient order as published [pub]).

    Parameters
    ----------
    coefficients : sequence of 10 float
        C1 … C10, in the units the polynomial was fitted in.
    suction, discharge : float
        Suction and discharge dew points S and D, in the polynomial's
        temperature unit (°C or °F).

    Returns
    -------
    float
        X in the polynomial's unit (W, Btu/h, kg/h, lb/h, A …).

    Examples
    --------
    >>> ahri540_polynomial([1.0] + [0.0] * 9, 5.0, 40.0)
    1.0
    >>> ahri540_polynomial([0, 0, 0, 0, 0, 0, 1, 0, 0, 0], -2.0, 40.0)   # C7·S³
    -8.0
    """
    if len(coefficients) != 10:
        raise CalculationError(f"an AHRI 540 polynomial has 10 coefficients, got {len(coefficients)}")
    c = coefficients
    s, d = suction, discharge
    return (
        c[0]
        + c[1] * s
        + c[2] * d
        + c[3] * s * s
        + c[4] * s * d
        + c[5] * d * d
        + c[6] * s * s * s
        + c[7] * d * s * s
        + c[8] * s * d * d
        + c[9] * d * d * d
    )


@dataclass(frozen=True)
class Envelope:
    """A compressor's application envelope: a rectangle in dew points [°C]."""

    suction_min: float
    suction_max: float
    discharge_min: float
    discharge_max: float

    def contains(self, suction: float, discharge: float, tolerance: float = ENVELOPE_TOLERANCE) -> bool:
        """True if (S, D) lies inside the envelope widened by *tolerance* [K].

        Examples
        --------
        >>> e = Envelope(-20.0, 10.0, 25.0, 60.0)
        >>> e.contains(-20.5, 40.0), e.contains(-25.0, 40.0)
        (True, False)
        """
        return (
            self.suction_min - tolerance <= suction <= self.suction_max + tolerance
            and self.discharge_min - tolerance <= discharge <= self.discharge_max + tolerance
        )

    def describe(self) -> str:
        """The envelope as text, e.g. ``"S −20…10 °C, D 25…60 °C"``."""
        return (
            f"S {self.suction_min:g}…{self.suction_max:g} °C, D {self.discharge_min:g}…{self.discharge_max:g} °C"
        )

    def phrase(self) -> Phrase:
        """The envelope as a phrase, shown in the report's unit system."""
        return (
            "S ", _n(self.suction_min, "temperature"), " … ", _n(self.suction_max, "temperature"),
            ", D ", _n(self.discharge_min, "temperature"), " … ", _n(self.discharge_max, "temperature"),
        )


@dataclass(frozen=True)
class OperatingConditions:
    """How the unit runs in this project (the refrigeration block of the room).

    Attributes
    ----------
    superheat : float
        Useful superheat at the evaporator outlet [K].
    suction_line_superheat : float
        Further (useless) superheat in the suction line [K].
    subcooling : float
        Liquid subcooling below the bubble point [K].
    """

    superheat: float = 5.0
    suction_line_superheat: float = 5.0
    subcooling: float = 2.0

    @property
    def total_superheat(self) -> float:
        """Superheat of the gas at the compressor inlet [K]."""
        return self.superheat + self.suction_line_superheat


@dataclass(frozen=True)
class CompressorPoint:
    """The compressor at one pair of dew points.

    Attributes
    ----------
    suction_dew, discharge_dew : float
        Saturated suction and discharge dew points [°C].
    capacity : float
        Useful refrigerating capacity [W] (see module notes).
    power : float
        Electrical input [W].
    mass_flow : float
        Refrigerant mass flow [kg/s].
    heat_rejection : float
        Total heat of rejection [W].
    discharge_temperature : float or None
        Discharge gas temperature [°C] (None when not computed).
    pressure_ratio : float
        Discharge over suction pressure [-].
    within_envelope : bool
        False when a polynomial was evaluated outside its envelope.
    """

    suction_dew: float
    discharge_dew: float
    capacity: float
    power: float
    mass_flow: float
    heat_rejection: float
    discharge_temperature: Optional[float]
    pressure_ratio: float
    within_envelope: bool = True

    @property
    def cop(self) -> float:
        """Coefficient of performance, capacity / power [-]."""
        return self.capacity / self.power if self.power > 0 else float("nan")


def _fluid(refrigerant: str) -> Any:
    from coldroom.refrigerant import get_fluid  # lazy: CoolProp import

    return get_fluid(refrigerant)


def _suction_state(fluid: Any, suction_pressure: float, dew: float, superheat: float) -> Any:
    if superheat <= 0.0:
        return fluid.saturated_vapour(temperature=dew)
    return fluid.state_pt(suction_pressure, dew + superheat)


def _liquid_state(fluid: Any, discharge_pressure: float, subcooling: float) -> Any:
    bubble = fluid.saturated_liquid(pressure=discharge_pressure)
    if subcooling <= 0.0:
        return bubble
    return fluid.state_pt(discharge_pressure, bubble.t - subcooling)


def clearance_volumetric_efficiency(clearance: float, suction_density: float, discharge_density: float) -> float:
    """Clearance volumetric efficiency with isentropic re-expansion [-].

    η_v = 1 + C − C·v_suction/v_discharge = 1 + C − C·ρ_discharge,s/ρ_suction
    (Stoecker & Jones, *Refrigeration and Air Conditioning*, 2nd ed., ch.
    "Compressors", clearance volumetric efficiency [mem]); the same as
    1 + C − C·(p_c/p_e)^(1/n) with n the isentropic exponent of the real gas.

    Parameters
    ----------
    clearance : float
        Clearance volume over swept volume C [-].
    suction_density : float
        Gas density at the compressor inlet [kg/m³].
    discharge_density : float
        Density after isentropic compression to discharge pressure [kg/m³].

    Examples
    --------
    >>> round(clearance_volumetric_efficiency(0.04, 10.0, 50.0), 3)
    0.84
    """
    return 1.0 + clearance - clearance * discharge_density / suction_density


# --------------------------------------------------------------------------- compressor models


@dataclass(frozen=True)
class RatedPointCompressor:
    """A compressor known by one rated point (use :meth:`from_rating`).

    The swept volume is inferred from the rated point through the clearance
    volumetric-efficiency model; at other dew points the mass flow is
    V_sw·η_v·ρ_suction and the power ṁ·Δh_s/η_is with the overall isentropic
    efficiency η_is of the rated point (when its power is given) or of the
    project (common practice, no source: η_is taken as constant).

    Attributes
    ----------
    refrigerant : str
    swept_volume : float
        Swept volume flow [m³/s].
    clearance : float
        Clearance ratio C [-] (fitted when the swept volume is given).
    isentropic_efficiency : float
        Overall isentropic efficiency [-].
    rating_suction, rating_discharge : float
        Rating dew points [°C].
    rated_capacity : float
        [W] at rating superheat and subcooling.
    operating : OperatingConditions
    notes : tuple of Phrase
        How the rated point was read (for the report).
    """

    refrigerant: str
    swept_volume: float
    clearance: float
    isentropic_efficiency: float
    rating_suction: float
    rating_discharge: float
    rated_capacity: float
    operating: OperatingConditions
    notes: tuple[Phrase, ...] = ()
    model: str = "rated point"
    envelope: Optional[Envelope] = None

    @classmethod
    def from_rating(
        cls,
        refrigerant: str,
        capacity: float,
        evaporating_temperature: float,
        condensing_temperature: float,
        *,
        superheat: float = DEFAULT_RATING_SUPERHEAT,
        subcooling: float = 0.0,
        power: Optional[float] = None,
        swept_volume: Optional[float] = None,
        clearance: float = 0.04,
        isentropic_efficiency: float = 0.65,
        operating: OperatingConditions = OperatingConditions(),
    ) -> "RatedPointCompressor":
        """Infer the compressor from one rated point.

        Parameters
        ----------
        refrigerant : str
            Catalogue name.
        capacity : float
            Rated capacity ṁ·(h_suction gas − h_liquid) [W].
        evaporating_temperature, condensing_temperature : float
            Rating dew points [°C].
        superheat : float
            Rating superheat at the compressor inlet [K].
        subcooling : float
            Rating subcooling [K].
        power : float, optional
            Rated electrical input [W]; gives the isentropic efficiency.
        swept_volume : float, optional
            Swept volume [m³/s]; gives the clearance ratio instead.
        clearance : float
            Clearance ratio used when the swept volume is not given [-].
        isentropic_efficiency : float
            Used when the power is not given [-].
        operating : OperatingConditions
            The project's superheats and subcooling.

        Raises
        ------
        CalculationError
            Inconsistent data (rated flow above the swept volume, …).
        """
        fluid = _fluid(refrigerant)
        p_e = fluid.dew_pressure(evaporating_temperature)
        p_c = fluid.dew_pressure(condensing_temperature)
        suction = _suction_state(fluid, p_e, evaporating_temperature, superheat)
        liquid = _liquid_state(fluid, p_c, subcooling)
        effect = suction.h - liquid.h
        if effect <= 0:
            raise CalculationError("rated point: no refrigerating effect at the rating conditions")
        mass_flow = capacity / effect
        volume_flow = mass_flow / suction.density
        isentropic = fluid.state_ps(p_c, suction.s)
        ratio = isentropic.density / suction.density
        notes: list[Phrase] = [
            (
                "rated ", _n(capacity, "power"), " at S ", _n(evaporating_temperature, "temperature"),
                " / D ", _n(condensing_temperature, "temperature"), ", superheat ",
                _n(superheat, "temperature_difference"), ", subcooling ", _n(subcooling, "temperature_difference"),
            ),
            (
                "rated mass flow ", _n(mass_flow, "mass_flow"), ", suction volume flow ",
                _n(volume_flow, "volume_flow"),
            ),
        ]
        if swept_volume is not None:
            efficiency = volume_flow / swept_volume
            if efficiency >= 1.0:
                raise CalculationError(
                    f"rated point needs {volume_flow * 3600:.2f} m³/h of suction gas but the swept volume is "
                    f"{swept_volume * 3600:.2f} m³/h (volumetric efficiency {efficiency:.2f} ≥ 1): check the rating data"
                )
            clearance = (1.0 - efficiency) / (ratio - 1.0)
            notes.append(
                (
                    "swept volume ", _n(swept_volume, "volume_flow"), " given: volumetric efficiency ",
                    _n(efficiency, "number"), " at rating, effective clearance ", _n(clearance, "number"),
                    (
                        " (above the 0.03–0.06 of reciprocating compressors [mem]: leakage or a worn compressor "
                        "lumped into it; check the swept volume)"
                        if clearance > 0.1
                        else ""
                    ),
                )
            )
        else:
            efficiency = clearance_volumetric_efficiency(clearance, suction.density, isentropic.density)
            if efficiency <= 0.05:
                raise CalculationError(
                    f"clearance {clearance:g} leaves no volumetric efficiency at the rating pressure ratio"
                )
            swept_volume = volume_flow / efficiency
            notes.append(
                (
                    "swept volume inferred ", _n(swept_volume, "volume_flow"), " (clearance ", _n(clearance, "number"),
                    ", volumetric efficiency ", _n(efficiency, "number"), " at rating)",
                )
            )
        if power is not None:
            isentropic_efficiency = mass_flow * (isentropic.h - suction.h) / power
            notes.append(
                ("rated power ", _n(power, "power"), ": overall isentropic efficiency ", _n(isentropic_efficiency, "number"))
            )
            if not 0.2 < isentropic_efficiency <= 1.0:
                raise CalculationError(
                    f"rated power {power:.0f} W gives an isentropic efficiency {isentropic_efficiency:.2f}, "
                    "outside 0.2…1: check the rating data"
                )
        else:
            notes.append(("no rated power: isentropic efficiency ", _n(isentropic_efficiency, "number"), " assumed"))
        return cls(
            refrigerant=refrigerant,
            swept_volume=swept_volume,
            clearance=clearance,
            isentropic_efficiency=isentropic_efficiency,
            rating_suction=evaporating_temperature,
            rating_discharge=condensing_temperature,
            rated_capacity=capacity,
            operating=operating,
            notes=tuple(notes),
        )

    def performance(
        self, suction_dew: float, discharge_dew: float, *, check_envelope: bool = True, discharge: bool = True
    ) -> CompressorPoint:
        """Capacity, power and heat rejection at dew points S, D [°C].

        Raises
        ------
        CalculationError
            No volumetric efficiency left, or states outside the property range.
        """
        fluid = _fluid(self.refrigerant)
        op = self.operating
        p_e = fluid.dew_pressure(suction_dew)
        p_c = fluid.dew_pressure(discharge_dew)
        suction = _suction_state(fluid, p_e, suction_dew, op.total_superheat)
        evaporator_outlet = (
            suction if op.suction_line_superheat == 0 else _suction_state(fluid, p_e, suction_dew, op.superheat)
        )
        liquid = _liquid_state(fluid, p_c, op.subcooling)
        isentropic = fluid.state_ps(p_c, suction.s)
        efficiency = clearance_volumetric_efficiency(self.clearance, suction.density, isentropic.density)
        if efficiency <= 0.0:
            raise CalculationError(
                f"no flow at S {suction_dew:.1f} °C / D {discharge_dew:.1f} °C: the clearance gas re-expands over "
                f"the whole stroke (pressure ratio {p_c / p_e:.1f})"
            )
        mass_flow = self.swept_volume * efficiency * suction.density
        power = mass_flow * (isentropic.h - suction.h) / self.isentropic_efficiency
        capacity = mass_flow * (evaporator_outlet.h - liquid.h)
        heat_rejection = mass_flow * (suction.h - liquid.h) + power
        t2 = fluid.state_ph(p_c, suction.h + power / mass_flow).t if discharge else None
        return CompressorPoint(
            suction_dew, discharge_dew, capacity, power, mass_flow, heat_rejection, t2, p_c / p_e, True
        )

    def flags(self, point: CompressorPoint) -> list[str]:
        """Warnings particular to this model at *point*."""
        out = []
        if point.suction_dew < self.rating_suction - RATING_SUCTION_GAP:
            out.append(
                Note.fill(
                    "the unit is rated at {r} suction but would run at {s} ({gap} lower): a unit outside its "
                    "application class (e.g. medium-temperature unit at low-temperature suction); the figures are "
                    "extrapolated from one rated point — confirm the compressor's envelope, motor cooling and oil "
                    "return with its maker",
                    r=(self.rating_suction, "temperature"),
                    s=(point.suction_dew, "temperature"),
                    gap=(self.rating_suction - point.suction_dew, "temperature_difference"),
                )
            )
        return out


@dataclass(frozen=True)
class PolynomialCompressor:
    """A compressor known by its AHRI 540 / EN 12900 polynomials [pub].

    The polynomials give capacity, power (and optionally mass flow) at the
    rating superheat (or return-gas temperature) and subcooling. At the
    project's superheat the mass flow is corrected for suction density,
    ṁ = ṁ_map·[1 + F·(ρ/ρ_map − 1)] (F = 1: ṁ ∝ ρ_suction; F ≈ 0.75 Rice &
    Dabiri [pub; value from memory]), and the power by
    P = P_map·(ṁ/ṁ_map)·(Δh_s/Δh_s,map) (Dabiri & Rice power correction [mem]).

    Attributes
    ----------
    refrigerant : str
    capacity_coefficients, power_coefficients : tuple of 10 float
    mass_flow_coefficients : tuple of 10 float or None
    temperature_unit : {"C", "F"}
    capacity_factor, power_factor, mass_flow_factor : float
        SI value of one unit of the polynomial's output [W, W, kg/s].
    rating_superheat : float or None
        Rating superheat [K] (or None when a return-gas temperature is given).
    return_gas_temperature : float or None
        Rating suction gas temperature [°C].
    rating_subcooling : float
        [K].
    envelope : Envelope
    density_correction_factor : float
        F [-].
    operating : OperatingConditions
    """

    refrigerant: str
    capacity_coefficients: tuple[float, ...]
    power_coefficients: tuple[float, ...]
    envelope: Envelope
    operating: OperatingConditions
    mass_flow_coefficients: Optional[tuple[float, ...]] = None
    temperature_unit: str = "C"
    capacity_factor: float = 1.0
    power_factor: float = 1.0
    mass_flow_factor: float = 1.0 / 3600.0
    rating_superheat: Optional[float] = DEFAULT_RATING_SUPERHEAT
    return_gas_temperature: Optional[float] = None
    rating_subcooling: float = 0.0
    density_correction_factor: float = RICE_DABIRI_F
    model: str = "polynomial"

    @property
    def notes(self) -> tuple[Phrase, ...]:
        """How the polynomial is read (for the report)."""
        rating: Phrase = (
            ("rating superheat ", _n(self.rating_superheat, "temperature_difference"))  # type: ignore[arg-type]
            if self.return_gas_temperature is None
            else ("rating return gas ", _n(self.return_gas_temperature, "temperature"))
        )
        return (
            (f"AHRI 540 / EN 12900 polynomials in °{self.temperature_unit}; ",)
            + rating
            + (", subcooling ", _n(self.rating_subcooling, "temperature_difference")),
            ("envelope ",) + self.envelope.phrase()
            + (" (refused beyond ", _n(ENVELOPE_TOLERANCE, "temperature_difference"), ")"),
            ("suction-density correction F = ", _n(self.density_correction_factor, "number")),
        )

    def _map_temperature(self, celsius: float) -> float:
        return celsius * 1.8 + 32.0 if self.temperature_unit == "F" else celsius

    def map_values(self, suction_dew: float, discharge_dew: float) -> tuple[float, float, Optional[float]]:
        """Polynomial capacity [W], power [W] and mass flow [kg/s or None] at S, D [°C], unchecked."""
        s = self._map_temperature(suction_dew)
        d = self._map_temperature(discharge_dew)
        capacity = ahri540_polynomial(self.capacity_coefficients, s, d) * self.capacity_factor
        power = ahri540_polynomial(self.power_coefficients, s, d) * self.power_factor
        mass_flow = None
        if self.mass_flow_coefficients is not None:
            mass_flow = ahri540_polynomial(self.mass_flow_coefficients, s, d) * self.mass_flow_factor
        return capacity, power, mass_flow

    def performance(
        self, suction_dew: float, discharge_dew: float, *, check_envelope: bool = True, discharge: bool = True
    ) -> CompressorPoint:
        """Capacity, power and heat rejection at dew points S, D [°C].

        Raises
        ------
        OutsideEnvelopeError
            When *check_envelope* and (S, D) lies more than
            :data:`ENVELOPE_TOLERANCE` outside the envelope (never extrapolated silently).
        """
        inside = self.envelope.contains(suction_dew, discharge_dew)
        if check_envelope and not inside:
            raise OutsideEnvelopeError(
                f"S {suction_dew:.1f} °C / D {discharge_dew:.1f} °C lies outside the compressor envelope "
                f"{self.envelope.describe()}: the polynomial is not extrapolated"
            )
        fluid = _fluid(self.refrigerant)
        op = self.operating
        map_capacity, map_power, map_mass_flow = self.map_values(suction_dew, discharge_dew)
        p_e = fluid.dew_pressure(suction_dew)
        p_c = fluid.dew_pressure(discharge_dew)
        if self.return_gas_temperature is not None:
            map_superheat = max(self.return_gas_temperature - suction_dew, 0.0)
        else:
            map_superheat = float(self.rating_superheat or 0.0)
        map_suction = _suction_state(fluid, p_e, suction_dew, map_superheat)
        map_liquid = _liquid_state(fluid, p_c, self.rating_subcooling)
        if map_mass_flow is None:
            map_mass_flow = map_capacity / (map_suction.h - map_liquid.h)
        suction = _suction_state(fluid, p_e, suction_dew, op.total_superheat)
        evaporator_outlet = (
            suction if op.suction_line_superheat == 0 else _suction_state(fluid, p_e, suction_dew, op.superheat)
        )
        liquid = _liquid_state(fluid, p_c, op.subcooling)
        if abs(op.total_superheat - map_superheat) < 1e-9:
            mass_flow = map_mass_flow
            power = map_power
        else:
            # Rice & Dabiri suction-density correction [pub]; power by Δh_s ratio [mem]
            ratio = suction.density / map_suction.density
            mass_flow = map_mass_flow * (1.0 + self.density_correction_factor * (ratio - 1.0))
            dh_map = fluid.state_ps(p_c, map_suction.s).h - map_suction.h
            dh = fluid.state_ps(p_c, suction.s).h - suction.h
            power = map_power * (mass_flow / map_mass_flow) * (dh / dh_map) if map_mass_flow != 0 else map_power
        capacity = mass_flow * (evaporator_outlet.h - liquid.h)
        heat_rejection = mass_flow * (suction.h - liquid.h) + power
        t2 = None
        if discharge and mass_flow > 0 and power > 0:
            t2 = fluid.state_ph(p_c, suction.h + power / mass_flow).t
        return CompressorPoint(
            suction_dew, discharge_dew, capacity, power, mass_flow, heat_rejection, t2, p_c / p_e, inside
        )

    def flags(self, point: CompressorPoint) -> list[str]:
        """Warnings particular to this model at *point*."""
        if point.within_envelope:
            return []
        return [
            Note(
                "the balance point S ", _n(point.suction_dew, "temperature"), " / D ",
                _n(point.discharge_dew, "temperature"), " lies outside the compressor envelope ",
                *self.envelope.phrase(), " (tolerance ", _n(ENVELOPE_TOLERANCE, "temperature_difference"),
                "): the polynomial is not extrapolated and no capacity is given — the compressor is not rated "
                "for these conditions",
            )
        ]


# --------------------------------------------------------------------------- heat exchangers


@dataclass(frozen=True)
class HeatExchanger:
    """Unit cooler or air-cooled condenser, linear in its temperature difference.

    Either a conductance K (capacity = K·ΔT: unit cooler K·DT1, EN 328 [mem] [ref:en-328];
    condenser THR = K·(SCT − ambient) [trade]) or, without rating data, a fixed
    temperature difference (the sizing TD).

    Attributes
    ----------
    conductance : float or None
        K [W/K].
    temperature_difference : float or None
        Fixed ΔT [K] when no rating is known.
    basis : str
        Where the figure came from (for the report).
    """

    conductance: Optional[float] = None
    temperature_difference: Optional[float] = None
    basis: Phrase = ()

    @classmethod
    def from_rating(cls, capacity: float, temperature_difference: float, what: str = "heat exchanger") -> "HeatExchanger":
        """K = rated capacity / rated ΔT [W/K]."""
        if capacity <= 0 or temperature_difference <= 0:
            raise CalculationError(f"{what}: rated capacity and ΔT must be positive")
        k = capacity / temperature_difference
        return cls(
            conductance=k,
            basis=(
                f"{what} rated ", _n(capacity, "power"), " at ΔT ", _n(temperature_difference, "temperature_difference"),
                ": K = ", _n(k, "conductance"),
            ),
        )

    @classmethod
    def fixed(cls, temperature_difference: float, basis: Phrase) -> "HeatExchanger":
        """No rating: the saturation temperature sits a fixed TD [K] from the air."""
        return cls(temperature_difference=temperature_difference, basis=basis)

    @property
    def is_fixed(self) -> bool:
        return self.conductance is None


# --------------------------------------------------------------------------- balance point


@dataclass(frozen=True)
class BalancePoint:
    """Where compressor, evaporator and condenser agree.

    Attributes
    ----------
    suction_dew, discharge_dew : float
        Balance dew points SST, SCT [°C].
    compressor_capacity, evaporator_capacity : float
        [W]; equal at balance (unless the evaporator TD is fixed).
    compressor_heat_rejection, condenser_heat_rejection : float
        [W]; equal at balance (unless the condenser TD is fixed).
    evaluations : int
        Compressor evaluations used.
    """

    suction_dew: float
    discharge_dew: float
    compressor_capacity: float
    evaporator_capacity: float
    compressor_heat_rejection: float
    condenser_heat_rejection: float
    evaluations: int


CompressorFunction = Callable[[float, float], tuple[float, float]]

BALANCE_TOLERANCE = 1e-6  # relative residual of both balance equations [-]


def balance_point(
    compressor: CompressorFunction,
    evaporator: HeatExchanger,
    condenser: HeatExchanger,
    room_temperature: float,
    ambient_temperature: float,
    *,
    guess: Optional[tuple[float, float]] = None,
    tolerance: float = BALANCE_TOLERANCE,
    max_iterations: int = 60,
) -> BalancePoint:
    """Solve for the suction and discharge dew points where the components agree.

    Equations (the balance-point method: compressor capacity = evaporator
    capacity and heat rejection = condenser capacity; common practice [trade]):

    * Q_comp(S, D) = K_e·(t_room − S)   (or S = t_room − TD_e when fixed)
    * THR_comp(S, D) = K_c·(D − t_amb)  (or D = t_amb + TD_c when fixed)

    Solved by Newton's method with a finite-difference Jacobian (kept while
    each step at least halves the residual: chord method), steps limited
    to 8 K and kept inside S < t_room, D > t_amb, halved while the residual grows.

    Parameters
    ----------
    compressor : callable
        ``compressor(S, D) -> (capacity [W], heat_rejection [W])``.
    evaporator, condenser : HeatExchanger
    room_temperature, ambient_temperature : float
        Air on the evaporator and on the condenser [°C].
    guess : (float, float), optional
        Starting S, D [°C].
    tolerance : float
        Relative residual of each equation [-].

    Raises
    ------
    CalculationError
        No balance (the compressor cannot run at any point the heat exchangers allow).

    Examples
    --------
    Linear compressor Q = 3000 + 100·S, THR = 1.3·Q; K_e = 400 W/K at +2 °C room;
    K_c = 500 W/K at 30 °C: S = (400·2 − 3000)/(100 + 400) = −4.4 °C,
    Q = 2560 W, D = 30 + 1.3·2560/500 = 36.656 °C.

    >>> comp = lambda s, d: (3000 + 100 * s, 1.3 * (3000 + 100 * s))
    >>> b = balance_point(comp, HeatExchanger(400.0), HeatExchanger(500.0), 2.0, 30.0)
    >>> round(b.suction_dew, 6), round(b.discharge_dew, 6)
    (-4.4, 36.656)
    """
    counter = [0]

    def comp(s: float, d: float) -> tuple[float, float]:
        counter[0] += 1
        try:
            return compressor(s, d)
        except PropertyRangeError as exc:
            raise CalculationError(f"no balance point: the compressor cannot run at S {s:.1f} °C / D {d:.1f} °C ({exc})") from None

    s_fixed = room_temperature - evaporator.temperature_difference if evaporator.is_fixed else None  # type: ignore[operator]
    d_fixed = ambient_temperature + condenser.temperature_difference if condenser.is_fixed else None  # type: ignore[operator]
    s_low, s_high = room_temperature - 50.0, room_temperature - 0.05
    d_low, d_high = ambient_temperature + 0.05, ambient_temperature + 50.0

    def residuals(s: float, d: float) -> tuple[float, float, float, float]:
        q, thr = comp(s, d)
        r1 = 0.0 if s_fixed is not None else q - evaporator.conductance * (room_temperature - s)  # type: ignore[operator]
        r2 = 0.0 if d_fixed is not None else thr - condenser.conductance * (d - ambient_temperature)  # type: ignore[operator]
        return r1, r2, q, thr

    s = s_fixed if s_fixed is not None else (guess[0] if guess else room_temperature - 8.0)
    d = d_fixed if d_fixed is not None else (guess[1] if guess else ambient_temperature + 12.0)
    s = min(max(s, s_low), s_high) if s_fixed is None else s
    d = min(max(d, d_low), d_high) if d_fixed is None else d
    r1, r2, q, thr = residuals(s, d)

    def converged(r1: float, r2: float, q: float, thr: float) -> bool:
        scale = max(abs(q), abs(thr), 1.0)
        return abs(r1) <= tolerance * scale and abs(r2) <= tolerance * scale

    step_h = 0.01  # K, finite-difference step
    jacobian: Optional[tuple[float, float, float, float]] = None
    for _ in range(max_iterations):
        if converged(r1, r2, q, thr):
            break
        # Jacobian by forward differences in the free variables; kept (chord
        # method) while each step at least halves the residual, else renewed.
        if jacobian is None:
            j11 = j21 = j12 = j22 = 0.0
            if s_fixed is None:
                a1, a2, _, _ = residuals(s + step_h, d)
                j11, j21 = (a1 - r1) / step_h, (a2 - r2) / step_h
            if d_fixed is None:
                b1, b2, _, _ = residuals(s, d + step_h)
                j12, j22 = (b1 - r1) / step_h, (b2 - r2) / step_h
            jacobian = (j11, j12, j21, j22)
        j11, j12, j21, j22 = jacobian
        if s_fixed is None and d_fixed is None:
            det = j11 * j22 - j12 * j21
            if det == 0 or not math.isfinite(det):
                raise CalculationError("no balance point: singular balance equations")
            ds = (-r1 * j22 + r2 * j12) / det
            dd = (-r2 * j11 + r1 * j21) / det
        elif s_fixed is None:
            if j11 == 0:
                raise CalculationError("no balance point: capacity does not depend on suction temperature")
            ds, dd = -r1 / j11, 0.0
        else:
            if j22 == 0:
                raise CalculationError("no balance point: heat rejection balance does not depend on SCT")
            ds, dd = 0.0, -r2 / j22
        largest = max(abs(ds), abs(dd))
        if largest > 8.0:
            ds, dd = ds * 8.0 / largest, dd * 8.0 / largest
        norm = math.hypot(r1, r2)
        for _halving in range(12):
            s_new = min(max(s + ds, s_low), s_high)
            d_new = min(max(d + dd, d_low), d_high)
            try:
                n1, n2, nq, nthr = residuals(s_new, d_new)
            except CalculationError:
                ds, dd = ds / 2, dd / 2
                continue
            if math.hypot(n1, n2) < norm or _halving == 11:
                break
            ds, dd = ds / 2, dd / 2
        else:
            raise CalculationError("no balance point: the search left the range the refrigerant model covers")
        if math.hypot(n1, n2) > 0.5 * norm:
            jacobian = None
        s, d, r1, r2, q, thr = s_new, d_new, n1, n2, nq, nthr
    else:
        raise CalculationError(
            f"no balance point found in {max_iterations} iterations (last S {s:.2f} °C, D {d:.2f} °C)"
        )
    if not converged(r1, r2, q, thr):  # pragma: no cover - loop exits only when converged
        raise CalculationError("no balance point")
    if s >= s_high or d <= d_low:
        raise CalculationError(
            f"no balance point: the compressor has no capacity left at S {s:.1f} °C / D {d:.1f} °C"
        )
    evap = q if s_fixed is not None else evaporator.conductance * (room_temperature - s)  # type: ignore[operator]
    cond = thr if d_fixed is not None else condenser.conductance * (d - ambient_temperature)  # type: ignore[operator]
    return BalancePoint(s, d, q, evap, thr, cond, counter[0])


# --------------------------------------------------------------------------- verdict


@dataclass(frozen=True)
class CheckResult:
    """The verdict on an existing unit for one room (SI; temperatures °C).

    Attributes
    ----------
    name, refrigerant, model : str
        Unit name, refrigerant and compressor model (``"rated point"`` or ``"polynomial"``).
    room_temperature, ambient_temperature : float
        Room air and condenser air at design [°C].
    balance_evaporating, balance_condensing : float or None
        Balance dew points SST, SCT [°C] (None when no balance exists).
    capacity_at_balance : float or None
        Useful capacity at balance [W]; None when no balance exists or the
        balance lies outside a polynomial's envelope (never extrapolated).
    power_at_balance, heat_rejection_at_balance, mass_flow : float or None
        [W], [W], [kg/s].
    discharge_temperature : float or None
        Upper estimate [°C].
    pressure_ratio : float or None
        [-].
    required_capacity : float
        (1 + SF)·daily energy / run time [W].
    peak_capacity : float
        Peak-hour load with safety factor [W].
    daily_energy : float
        24-hour heat gain before the safety factor [J].
    safety_factor : float
        [-].
    run_hours_available : float
        The room's compressor run time [h/day].
    run_hours_needed : float or None
        daily energy·(1 + SF) / capacity [h/day].
    margin_percent : float or None
        (capacity / required − 1)·100 [%].
    holds : bool
        True when the capacity at balance covers the required capacity.
    within_envelope : bool
        False when the balance lies outside a polynomial's envelope.
    max_ambient : float or None
        Highest condenser-air temperature at which the unit still holds [°C]
        (None when it holds over the whole search range, or nowhere in it —
        see *max_ambient_status*).
    max_ambient_status : str
        ``"found"``, ``"holds_above_range"``, ``"fails_below_range"`` or
        ``"not_searched"``.
    evaporator_basis, condenser_basis : Phrase
        How the evaporator and condenser were modelled.
    compressor_basis : tuple of Phrase
        How the compressor was modelled.
    warnings : tuple of str
    chart_ambient : tuple of float
        Condenser-air temperatures of the chart [°C].
    chart_capacity : tuple of (float or None)
        Unit capacity at balance at each chart ambient [W] (None: no balance or outside envelope).
    chart_load : tuple of float
        Required capacity of the room at each chart ambient [W].
    """

    name: str
    refrigerant: str
    model: str
    room_temperature: float
    ambient_temperature: float
    balance_evaporating: Optional[float]
    balance_condensing: Optional[float]
    capacity_at_balance: Optional[float]
    power_at_balance: Optional[float]
    heat_rejection_at_balance: Optional[float]
    mass_flow: Optional[float]
    discharge_temperature: Optional[float]
    pressure_ratio: Optional[float]
    required_capacity: float
    peak_capacity: float
    daily_energy: float
    safety_factor: float
    run_hours_available: float
    run_hours_needed: Optional[float]
    margin_percent: Optional[float]
    holds: bool
    within_envelope: bool
    max_ambient: Optional[float]
    max_ambient_status: str
    evaporator_basis: Phrase
    condenser_basis: Phrase
    compressor_basis: tuple[Phrase, ...] = ()
    warnings: tuple[str, ...] = ()
    chart_ambient: tuple[float, ...] = ()
    chart_capacity: tuple[Optional[float], ...] = ()
    chart_load: tuple[float, ...] = ()

    @property
    def verdict(self) -> str:
        """One line: holds / does not hold / cannot be rated, and why."""
        if self.capacity_at_balance is None:
            if not self.within_envelope:
                return "NOT RATED for these conditions (balance outside the compressor envelope)"
            return "DOES NOT HOLD (no balance point)"
        if self.holds:
            return f"HOLDS (margin {self.margin_percent:+.0f} %)"
        return f"DOES NOT HOLD (short by {-self.margin_percent:.0f} %)"  # type: ignore[operator]

    def chart(self) -> dict[str, list[Optional[float]]]:
        """Arrays for the capacity/load-vs-ambient chart (SI, keys name units)."""
        return {
            "ambient_c": list(self.chart_ambient),
            "unit_capacity_w": list(self.chart_capacity),
            "room_load_w": list(self.chart_load),
        }

    def to_json(self) -> dict[str, Any]:
        """JSON object, SI numbers, every numeric key names its unit."""
        return {
            "name": self.name,
            "refrigerant": self.refrigerant,
            "model": self.model,
            "verdict": self.verdict,
            "holds": self.holds,
            "within_envelope": self.within_envelope,
            "room_temperature_c": self.room_temperature,
            "ambient_temperature_c": self.ambient_temperature,
            "balance_evaporating_c": self.balance_evaporating,
            "balance_condensing_c": self.balance_condensing,
            "capacity_at_balance_w": self.capacity_at_balance,
            "power_at_balance_w": self.power_at_balance,
            "heat_rejection_at_balance_w": self.heat_rejection_at_balance,
            "mass_flow_kg_s": self.mass_flow,
            "discharge_temperature_c": self.discharge_temperature,
            "pressure_ratio": self.pressure_ratio,
            "required_capacity_w": self.required_capacity,
            "peak_capacity_w": self.peak_capacity,
            "daily_energy_kwh": self.daily_energy / 3.6e6,
            "safety_factor": self.safety_factor,
            "run_hours_available": self.run_hours_available,
            "run_hours_needed": self.run_hours_needed,
            "margin_percent": self.margin_percent,
            "max_ambient_c": self.max_ambient,
            "max_ambient_status": self.max_ambient_status,
            "evaporator_basis": format_terms(self.evaporator_basis, "SI"),
            "condenser_basis": format_terms(self.condenser_basis, "SI"),
            "compressor_basis": [format_terms(note, "SI") for note in self.compressor_basis],
            "warnings": list(self.warnings),
            "chart": self.chart(),
        }


Compressor = Any  # RatedPointCompressor | PolynomialCompressor (duck-typed: performance(), flags(), model)


def _solve(
    compressor: Compressor,
    evaporator: HeatExchanger,
    condenser: HeatExchanger,
    room_temperature: float,
    ambient_temperature: float,
    guess: Optional[tuple[float, float]] = None,
) -> tuple[BalancePoint, CompressorPoint]:
    def function(s: float, d: float) -> tuple[float, float]:
        p = compressor.performance(s, d, check_envelope=False, discharge=False)
        return p.capacity, p.heat_rejection

    bp = balance_point(function, evaporator, condenser, room_temperature, ambient_temperature, guess=guess)
    try:
        point = compressor.performance(bp.suction_dew, bp.discharge_dew, check_envelope=False, discharge=True)
    except PropertyRangeError as exc:
        raise CalculationError(f"no discharge state at the balance point ({exc})") from None
    return bp, point


def check_unit(
    compressor: Compressor,
    evaporator: HeatExchanger,
    condenser: HeatExchanger,
    *,
    room_temperature: float,
    ambient_temperature: float,
    daily_energy: float,
    safety_factor: float,
    run_time: float,
    peak_capacity: float = 0.0,
    load_at_ambient: Optional[Callable[[float], float]] = None,
    chart_ambients: Sequence[float] = CHART_AMBIENTS,
    search_max_ambient: bool = True,
    name: str = "existing unit",
) -> CheckResult:
    """The verdict on one unit for one room.

    Parameters
    ----------
    compressor : RatedPointCompressor or PolynomialCompressor
    evaporator, condenser : HeatExchanger
    room_temperature : float
        Room air on the unit cooler [°C].
    ambient_temperature : float
        Air on the condenser at design [°C].
    daily_energy : float
        24-hour heat gain before the safety factor [J].
    safety_factor : float
        [-].
    run_time : float
        Compressor run time the room allows [s/day].
    peak_capacity : float
        Peak-hour load with safety factor [W] (only for a warning).
    load_at_ambient : callable, optional
        Required capacity [W] of the room at a condenser-air temperature [°C];
        default: the design required capacity at every ambient.
    chart_ambients : sequence of float
        Ambients of the chart [°C] (empty: no chart).
    search_max_ambient : bool
        Search the highest ambient at which the unit holds (1-D, to 0.1 K).

    Returns
    -------
    CheckResult
        Run hours needed = daily energy·(1 + SF)/capacity (ASHRAE
        Handbook—Refrigeration, "Refrigerated-Facility Loads": required
        capacity = (1 + SF)·E/run hours, solved for the hours [pub]).
    """
    required = (1.0 + safety_factor) * daily_energy / run_time
    load = load_at_ambient or (lambda _t: required)
    warnings: list[str] = []
    evap_basis = evaporator.basis
    cond_basis = condenser.basis

    def capacity_at(ambient: float, guess: Optional[tuple[float, float]]) -> tuple[Optional[float], Optional[tuple[float, float]]]:
        try:
            bp, point = _solve(compressor, evaporator, condenser, room_temperature, ambient, guess)
        except CalculationError:
            return None, guess
        if not point.within_envelope:
            return None, (bp.suction_dew, bp.discharge_dew)
        return point.capacity, (bp.suction_dew, bp.discharge_dew)

    # 1. design ambient
    bp: Optional[BalancePoint] = None
    point: Optional[CompressorPoint] = None
    try:
        bp, point = _solve(compressor, evaporator, condenser, room_temperature, ambient_temperature)
    except CalculationError as exc:
        warnings.append(str(exc))
    within = point.within_envelope if point is not None else True
    capacity = point.capacity if (point is not None and within and point.capacity > 0) else None
    if point is not None:
        warnings += compressor.flags(point)
        t2 = point.discharge_temperature
        if t2 is not None and t2 > DISCHARGE_LIMIT:
            warnings.append(
                Note.fill(
                    "discharge temperature about {t} exceeds the ~{lim} hard limit [trade]: "
                    "oil breakdown and valve damage; the unit must not run like this",
                    t=(t2, "temperature"),
                    lim=(DISCHARGE_LIMIT, "temperature"),
                )
            )
        elif t2 is not None and t2 > DISCHARGE_WARNING:
            warnings.append(
                Note.fill(
                    "discharge temperature about {t} is above {lim} [trade]: check discharge-line temperature, "
                    "consider liquid injection or a lower suction superheat",
                    t=(t2, "temperature"),
                    lim=(DISCHARGE_WARNING, "temperature"),
                )
            )
        if point.pressure_ratio > PRESSURE_RATIO_WARNING:
            warnings.append(
                f"pressure ratio {point.pressure_ratio:.1f} is above {PRESSURE_RATIO_WARNING:.0f}, beyond what a "
                "single stage does sensibly [trade]"
            )
    run_hours_needed = margin = None
    holds = False
    if capacity is not None:
        run_hours_needed = (1.0 + safety_factor) * daily_energy / capacity / 3600.0
        margin = (capacity / required - 1.0) * 100.0
        holds = capacity >= required
        if run_hours_needed > 24.0:
            warnings.append(
                f"the unit would need {run_hours_needed:.1f} h/day: it cannot hold the room even running continuously"
            )
        if holds and capacity < peak_capacity:
            warnings.append(
                Note.fill(
                    "capacity {c} covers the 24-hour requirement but not the peak-hour load {p}: "
                    "pull-down will be slower than planned",
                    c=(capacity, "power"),
                    p=(peak_capacity, "power"),
                )
            )
    # 2. chart over ambient, warm-started from the previous balance
    ambients = sorted(set(float(a) for a in chart_ambients))
    chart_capacity: list[Optional[float]] = []
    chart_load: list[float] = []
    design_guess = (bp.suction_dew, bp.discharge_dew) if bp is not None else None
    samples = [(ambient_temperature, capacity, design_guess)]
    guess = design_guess
    for ambient in ambients:
        value, guess = capacity_at(ambient, guess)
        chart_capacity.append(value)
        chart_load.append(load(ambient))
        samples.append((ambient, value, guess))
    # 3. highest ambient at which it holds (regula falsi on capacity − load, to 0.05 K)
    max_ambient: Optional[float] = None
    status = "not_searched"
    if search_max_ambient:
        max_ambient, status = _max_ambient(capacity_at, load, samples)
    return CheckResult(
        name=name,
        refrigerant=compressor.refrigerant,
        model=compressor.model,
        room_temperature=room_temperature,
        ambient_temperature=ambient_temperature,
        balance_evaporating=bp.suction_dew if bp is not None else None,
        balance_condensing=bp.discharge_dew if bp is not None else None,
        capacity_at_balance=capacity,
        power_at_balance=point.power if point is not None and within else None,
        heat_rejection_at_balance=point.heat_rejection if point is not None and within else None,
        mass_flow=point.mass_flow if point is not None and within else None,
        discharge_temperature=point.discharge_temperature if point is not None and within else None,
        pressure_ratio=point.pressure_ratio if point is not None else None,
        required_capacity=required,
        peak_capacity=peak_capacity,
        daily_energy=daily_energy,
        safety_factor=safety_factor,
        run_hours_available=run_time / 3600.0,
        run_hours_needed=run_hours_needed,
        margin_percent=margin,
        holds=holds,
        within_envelope=within,
        max_ambient=max_ambient,
        max_ambient_status=status,
        evaporator_basis=evap_basis,
        condenser_basis=cond_basis,
        compressor_basis=tuple(compressor.notes),
        warnings=tuple(warnings),
        chart_ambient=tuple(ambients),
        chart_capacity=tuple(chart_capacity),
        chart_load=tuple(chart_load),
    )


def _max_ambient(
    capacity_at: Callable[[float, Optional[tuple[float, float]]], tuple[Optional[float], Optional[tuple[float, float]]]],
    load: Callable[[float], float],
    samples: Sequence[tuple[float, Optional[float], Optional[tuple[float, float]]]],
    resolution: float = 0.05,
) -> tuple[Optional[float], str]:
    """The highest ambient [°C] at which capacity ≥ load, within :data:`MAX_AMBIENT_RANGE`.

    *samples* are already computed (ambient, capacity or None, balance guess).
    Assumes capacity falls and load rises with ambient (one crossing). The
    crossing is bracketed from the samples (extended to the range ends when
    needed) and refined by the Illinois variant of regula falsi on
    f = capacity − load, falling back to bisection where no capacity exists.
    """
    low_limit, high_limit = MAX_AMBIENT_RANGE
    known = {t: (c, g) for t, c, g in samples}

    def sample(t: float, guess: Optional[tuple[float, float]]) -> tuple[Optional[float], Optional[tuple[float, float]]]:
        if t not in known:
            known[t] = capacity_at(t, guess)
        return known[t]

    def f(t: float, capacity: Optional[float]) -> Optional[float]:
        return None if capacity is None else capacity - load(t)

    ordered = sorted(known)
    holding = [t for t in ordered if (f(t, known[t][0]) or -1.0) >= 0.0]
    if not holding:
        first = ordered[0] if ordered else high_limit
        c, g = sample(low_limit, known[first][1] if ordered else None)
        if f(low_limit, c) is None or f(low_limit, c) < 0:  # type: ignore[operator]
            return None, "fails_below_range"
        good = low_limit
        bad = min([t for t in ordered if t > low_limit] or [high_limit])
    else:
        good = max(holding)
        above = [t for t in sorted(known) if t > good]
        if not above:
            c, g = sample(high_limit, known[good][1])
            if f(high_limit, c) is not None and f(high_limit, c) >= 0:  # type: ignore[operator]
                return None, "holds_above_range"
            bad = high_limit
        else:
            bad = min(above)
    f_good = f(good, known[good][0])
    f_bad = f(bad, known[bad][0])
    side = 0
    for _ in range(60):
        if bad - good <= resolution:
            break
        if f_good is not None and f_bad is not None and f_good != f_bad:
            middle = good - f_good * (bad - good) / (f_bad - f_good)
            middle = min(max(middle, good + 0.1 * resolution), bad - 0.1 * resolution)
        else:
            middle = 0.5 * (good + bad)
        c, _g = sample(middle, known[good][1])
        value = f(middle, c)
        if value is not None and value >= 0.0:
            if abs(value) <= 1e-4 * max(load(middle), 1.0):
                return middle, "found"
            good, f_good = middle, value
            if side == -1 and f_bad is not None:
                f_bad /= 2.0  # Illinois: halve the stale end
            side = -1
        else:
            bad, f_bad = middle, value
            if side == 1 and f_good is not None:
                f_good /= 2.0
            side = 1
    return good, "found"


# --------------------------------------------------------------------------- project glue


def operating_conditions(refrigeration: "Refrigeration") -> OperatingConditions:
    """The project's superheats and subcooling for the existing unit."""
    return OperatingConditions(
        superheat=refrigeration.superheat,
        suction_line_superheat=refrigeration.suction_line_superheat,
        subcooling=refrigeration.subcooling,
    )


_CAPACITY_FACTORS = {"SI": 1.0, "IP": _BTU_PER_HOUR}  # W per unit of the capacity polynomial
_MASS_FLOW_FACTORS = {"SI": 1.0 / 3600.0, "IP": _POUND / 3600.0}  # kg/s per kg/h, per lb/h


def build_compressor(unit: "ExistingUnit", refrigeration: "Refrigeration") -> Compressor:
    """The compressor model of a project file's ``existing_unit``.

    Polynomial units: ``SI`` = °C, W, W, kg/h; ``IP`` = °F, Btu/h, W, lb/h
    (AHRI 540 gives power in W in both [mem]).
    """
    from coldroom.data import refrigerants

    name = refrigerants.lookup(unit.refrigerant).name
    operating = operating_conditions(refrigeration)
    if unit.rated_point is not None:
        r = unit.rated_point
        return RatedPointCompressor.from_rating(
            name,
            r.capacity,
            r.evaporating_temperature,
            r.condensing_temperature,
            superheat=r.rating_superheat,
            subcooling=r.subcooling,
            power=r.power,
            swept_volume=r.swept_volume,
            clearance=refrigeration.clearance,
            isentropic_efficiency=refrigeration.isentropic_efficiency,
            operating=operating,
        )
    p = unit.polynomial
    assert p is not None
    return PolynomialCompressor(
        refrigerant=name,
        capacity_coefficients=tuple(p.capacity),
        power_coefficients=tuple(p.power),
        mass_flow_coefficients=tuple(p.mass_flow) if p.mass_flow is not None else None,
        temperature_unit="C" if p.units == "SI" else "F",
        capacity_factor=_CAPACITY_FACTORS[p.units],
        power_factor=1.0,
        mass_flow_factor=_MASS_FLOW_FACTORS[p.units],
        rating_superheat=p.superheat,
        return_gas_temperature=p.return_gas_temperature,
        rating_subcooling=p.subcooling,
        envelope=Envelope(p.suction_min, p.suction_max, p.discharge_min, p.discharge_max),
        density_correction_factor=p.density_correction_factor,
        operating=operating,
    )


def _shifted_model(model: "ProjectModel", shift: float) -> "ProjectModel":
    """The project with the outdoor air *shift* K warmer (humidity as RH)."""
    from coldroom.loads import outdoor_relative_humidity

    design = model.design.model_copy(
        update={
            "outdoor_temperature": model.design.outdoor_temperature + shift,
            "outdoor_rh": outdoor_relative_humidity(model.design),
            "outdoor_wet_bulb": None,
        }
    )
    return model.model_copy(update={"design": design})


def room_load_at(
    model: "ProjectModel", room: "Room", loads: "RoomLoads", ambient: float
) -> Callable[[float], float]:
    """The room's required capacity [W] as a function of the condenser air [°C] (cached).

    At *ambient* (the design condenser air) it is ``loads.required_capacity``;
    elsewhere the outdoor air moves with the condenser air (:func:`_shifted_model`)
    and the room's loads are recomputed.
    """
    from coldroom.loads import room_loads

    cache: dict[float, float] = {}
    index = model.rooms.index(room)

    def load_at(t: float) -> float:
        key = round(t, 6)
        if key not in cache:
            if abs(t - ambient) < 1e-9:
                cache[key] = loads.required_capacity
            else:
                shifted = _shifted_model(model, t - ambient)
                cache[key] = room_loads(shifted, shifted.rooms[index]).required_capacity
        return cache[key]

    return load_at


def check_room(
    model: "ProjectModel",
    room: "Room",
    loads: "Optional[RoomLoads]" = None,
    *,
    chart: bool = True,
) -> Optional[CheckResult]:
    """Check the room's existing unit, if it has one (the single call sizing uses).

    The ambient is the condenser air (``refrigeration.condenser_air_temperature``,
    else the outdoor design dry bulb). For the chart and the maximum-ambient
    search the outdoor air moves with it (same shift; surfaces facing other
    spaces keep their temperatures; outdoor RH held) and the room load is
    recomputed at each ambient.

    Parameters
    ----------
    model : ProjectModel
    room : Room
    loads : RoomLoads, optional
        The room's loads at design (computed when not given).
    chart : bool
        Compute the chart arrays and the maximum ambient.

    Returns
    -------
    CheckResult or None
        None when the room has no ``existing_unit``.

    Raises
    ------
    CalculationError
        The unit's data are inconsistent (message names the room).
    """
    unit = room.existing_unit
    if unit is None:
        return None
    from coldroom.data import refrigerants
    from coldroom.loads import room_loads
    from coldroom.sizing import room_design_temperatures

    if loads is None:
        loads = room_loads(model, room)
    r = model.refrigeration_for(room)
    temps = room_design_temperatures(model, room)
    try:
        compressor = build_compressor(unit, r)
    except CalculationError as exc:
        raise type(exc)(f"room {room.name!r}: existing unit {unit.name!r}: {exc}") from None
    if unit.unit_cooler is not None:
        evaporator = HeatExchanger.from_rating(unit.unit_cooler.capacity, unit.unit_cooler.dt1, "unit cooler (EN 328 DT1)")
    else:
        evaporator = HeatExchanger.fixed(
            temps.evaporator_td,
            (
                "no unit-cooler data: evaporating temperature fixed at room − ",
                _n(temps.evaporator_td, "temperature_difference"),
                f" ({temps.evaporator_td_source}); assumes the coil takes whatever the compressor pumps",
            ),
        )
    if unit.condenser is not None:
        condenser = HeatExchanger.from_rating(
            unit.condenser.heat_rejection, unit.condenser.temperature_difference, "air-cooled condenser"
        )
    else:
        condenser = HeatExchanger.fixed(
            temps.condenser_td,
            (
                "no condenser data: condensing temperature fixed at air + ",
                _n(temps.condenser_td, "temperature_difference"),
                f" ({temps.condenser_td_source})",
            ),
        )
    ambient = temps.condenser_air_temperature
    load_at = room_load_at(model, room, loads, ambient)

    result = check_unit(
        compressor,
        evaporator,
        condenser,
        room_temperature=room.temperature,
        ambient_temperature=ambient,
        daily_energy=loads.daily_energy,
        safety_factor=loads.safety_factor,
        run_time=loads.run_time,
        peak_capacity=loads.peak_capacity,
        load_at_ambient=load_at,
        chart_ambients=CHART_AMBIENTS if chart else (),
        search_max_ambient=chart,
        name=unit.name,
    )
    if compressor.refrigerant != refrigerants.lookup(r.refrigerant).name:
        result = replace(
            result,
            warnings=result.warnings
            + (
                f"the existing unit is given with {compressor.refrigerant} but the room's refrigeration block names "
                f"{refrigerants.lookup(r.refrigerant).name}; the check uses {compressor.refrigerant} (a retrofit to "
                "another refrigerant changes capacity: give the unit's data for the refrigerant it will run on)",
            ),
        )
    return result


def check_project(model: "ProjectModel") -> tuple[tuple["RoomLoads", Optional[CheckResult]], ...]:
    """:func:`check_room` for every room, with its loads, in file order."""
    from coldroom.loads import room_loads

    out = []
    for room in model.rooms:
        loads = room_loads(model, room)
        out.append((loads, check_room(model, room, loads)))
    return tuple(out)
