"""Compressor models of an existing unit: one rated point, or the AHRI 540 / EN 12900 polynomials.

Each model answers ``performance(S, D)`` at a suction and discharge dew point
[°C] with a :class:`CompressorPoint` (useful capacity, power, heat rejection,
mass flow [W, W, W, kg/s]) and ``flags(point)`` with its own warnings. Only
this module of the package touches refrigerant properties (CoolProp, lazily
through :mod:`coldroom.physics.refrigerant`). Conventions: see :mod:`coldroom.equipment`.
"""

from __future__ import annotations

from dataclasses import dataclass
from typing import Any, Optional, Sequence

from coldroom.errors import CalculationError
from coldroom.rules import (
    APPLICATION_CLASSES,
    CYCLE_DEFAULTS,
    application_class_of_rating,
    application_mismatch,
    suction_class,
)
from coldroom.results import Note, Phrase
from coldroom.results import inline_term as _n

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

    def phrase(self) -> Phrase:
        """The envelope as a phrase, shown in the report's unit system."""
        return (
            "S ", _n(self.suction_min, "temperature"), " … ", _n(self.suction_max, "temperature"),
            ", D ", _n(self.discharge_min, "temperature"), " … ", _n(self.discharge_max, "temperature"),
        )


@dataclass(frozen=True)
class OperatingConditions:
    """How the unit runs in this project (the refrigeration block of the room).

    The defaults are :data:`coldroom.rules.CYCLE_DEFAULTS`, as for the project's block.

    Attributes
    ----------
    superheat : float
        Useful superheat at the evaporator outlet [K].
    suction_line_superheat : float
        Further (useless) superheat in the suction line [K].
    subcooling : float
        Liquid subcooling below the bubble point [K].
    """

    superheat: float = CYCLE_DEFAULTS.superheat
    suction_line_superheat: float = CYCLE_DEFAULTS.suction_line_superheat
    subcooling: float = CYCLE_DEFAULTS.subcooling

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
    from coldroom.physics.refrigerant import get_fluid  # lazy: CoolProp import

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
    application: Optional[str] = None

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
        clearance: float = CYCLE_DEFAULTS.clearance,
        isentropic_efficiency: float = CYCLE_DEFAULTS.isentropic_efficiency,
        operating: OperatingConditions = OperatingConditions(),
        application: Optional[str] = None,
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
            Clearance ratio used when the swept volume is not given [-]
            (default :data:`coldroom.rules.CYCLE_DEFAULTS`).
        isentropic_efficiency : float
            Used when the power is not given [-] (default as *clearance*).
        operating : OperatingConditions
            The project's superheats and subcooling.
        application : str, optional
            ``"LT"``, ``"MT"`` or ``"HT"`` (:data:`coldroom.rules.APPLICATION_CLASSES`); by default
            the class of the rating suction (:func:`coldroom.rules.application_class_of_rating`).

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
            application=application or application_class_of_rating(evaporating_temperature),
        )

    def application_mismatch(self, suction_dew: float, design: bool = False) -> Optional[str]:
        """Why the unit is not suitable at this suction [°C] (outside its application class), or ``None``.

        *design*: the suction is the system's design SST rather than a balance point (the same test here).
        """
        return None if self.application is None else application_mismatch(self.application, suction_dew)

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
                Note(
                    "no flow at S ", _n(suction_dew, "temperature"), " / D ", _n(discharge_dew, "temperature"),
                    f": the clearance gas re-expands over the whole stroke (pressure ratio {p_c / p_e:.1f})",
                )
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
                Note(
                    "S ", _n(suction_dew, "temperature"), " / D ", _n(discharge_dew, "temperature"),
                    " lies outside the compressor envelope ", *self.envelope.phrase(),
                    ": the polynomial is not extrapolated",
                )
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

    @property
    def application(self) -> str:
        """The class its envelope makes it [trade]: LT when the envelope stops at −5 °C suction or colder,
        HT when it starts at −10 °C or warmer, else MT."""
        if self.envelope.suction_max <= -5.0:
            return "LT"
        return "HT" if self.envelope.suction_min >= -10.0 else "MT"

    def application_mismatch(self, suction_dew: float, design: bool = False) -> Optional[str]:
        """Why the unit is not suitable for a system whose design SST is *suction_dew* [°C], or ``None``.

        A polynomial's envelope is its application range: at a balance point (``design`` false) the
        check's envelope test decides (no capacity outside it), so this says nothing; a design suction
        outside the envelope's suction range (no tolerance) makes the unit the wrong class for the job,
        wherever its balance would drift to.
        """
        if not design or self.envelope.suction_min <= suction_dew <= self.envelope.suction_max:
            return None
        words = APPLICATION_CLASSES[self.application][2]
        needed = APPLICATION_CLASSES[suction_class(suction_dew)][2]
        if needed == words:
            return f"{words} unit at a design suction outside its envelope"
        return f"{words} unit at {needed} suction"

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


Compressor = Any  # RatedPointCompressor | PolynomialCompressor (duck-typed: performance(), flags(), model)
