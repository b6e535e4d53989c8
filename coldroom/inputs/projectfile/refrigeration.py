"""The refrigeration side: pipework, charge, the condensing settings of a room or a system, and an existing unit to check."""

from __future__ import annotations

from typing import Annotated, Any, Literal, Optional

from pydantic import Field, ValidationInfo, field_validator, model_validator

from coldroom.inputs.projectfile.quantities import Name, OutdoorTemperature, Q, Rating, Strict
from coldroom.rules import CYCLE_DEFAULTS as _CYCLE


# --- pipework and charge (sized by coldroom.physics.line_sizing and coldroom.physics.charge) ---------------------------

FittingKind = Literal[
    "elbow_90", "long_elbow_90", "elbow_45", "return_bend", "tee_run", "tee_branch",
    "ball_valve", "globe_valve", "angle_valve", "check_valve",
]


class PipeRun(Strict):
    """One refrigerant line: run length, vertical rise in the flow direction, fittings.

    Give ``fittings`` (kind → count) or ``equivalent_length`` (the whole line's
    equivalent length, fittings included), not both. ``limit`` overrides the
    line's default limit on the drop in saturation temperature.
    """

    length: Q("length", gt=0.0, le=500.0)  # type: ignore[valid-type]
    rise: Q("length", ge=-200.0, le=200.0) = 0.0  # type: ignore[valid-type]
    fittings: dict[FittingKind, Annotated[int, Field(ge=0, le=200)]] = Field(default_factory=dict, max_length=20)
    equivalent_length: Optional[Q("length", gt=0.0, le=2000.0)] = None  # type: ignore[valid-type]
    limit: Optional[Q("temperature_difference", gt=0.0, le=5.0)] = None  # type: ignore[valid-type]

    @field_validator("rise")
    @classmethod
    def _rise_within_run(cls, rise: float, info: ValidationInfo) -> float:
        length = info.data.get("length")
        if length is not None and abs(rise) > length:
            raise ValueError("rise is longer than the run length (a line cannot climb more than its length)")
        return rise

    @field_validator("equivalent_length")
    @classmethod
    def _equivalent_covers_run(cls, value: Optional[float], info: ValidationInfo) -> Optional[float]:
        length = info.data.get("length")
        if value is not None and length is not None and value < length:
            raise ValueError("equivalent_length is shorter than length (it includes the run and its fittings)")
        if value is not None and info.data.get("fittings"):
            raise ValueError("give fittings or equivalent_length, not both")
        return value


class Piping(Strict):
    """The lines of a system. ``tube_series``: ``EN 12735-1`` (metric) or ``ASTM B280`` (inch ACR)."""

    tube_series: Literal["EN 12735-1", "ASTM B280"] = "EN 12735-1"
    suction: Optional[PipeRun] = None
    liquid: Optional[PipeRun] = None
    discharge: Optional[PipeRun] = None
    minimum_load: Q("fraction", gt=0.0, le=1.0) = Field(  # type: ignore[valid-type]
        default=1.0,
        description="Share of the design mass flow at the system's minimum load (oil return in risers); "
        "1 for a single on/off compressor.",
    )


class ChargeSettings(Strict):
    """Inputs of the charge estimate and the charge-limit rules of a system.

    ``charge: 2.5 kg`` (a bare mass) is short for ``charge: {total: 2.5 kg}``.
    """

    total: Optional[Q("mass", gt=0.0, le=1e4)] = Field(  # type: ignore[valid-type]
        default=None,
        description="The charge as known (nameplate, weighed in) [kg]; wins over the estimate everywhere "
        "(charge limits, TEWI).",
    )
    parts: Optional[dict[Name, Q("mass", gt=0.0, le=1e4)]] = Field(  # type: ignore[valid-type]
        default=None,
        description="The charge as known, by part (e.g. condensing unit: 0.8 kg, lines: 0.3 kg) [kg]; their sum "
        "wins over the estimate; with total given as well they must agree within 1 %.",
    )

    measures: list[Name] = Field(
        default_factory=list,
        max_length=20,
        description="Measures taken for a charge over the room limit (EN 378-3: gas detection and alarm, "
        "mechanical ventilation, ...); with them a charge 'over - measures needed' does not block an option in "
        "compare.",
    )

    @model_validator(mode="after")
    def _parts_agree(self) -> "ChargeSettings":
        if self.parts and self.total is not None:
            summed = sum(self.parts.values())
            if abs(summed - self.total) > 0.01 * self.total:
                raise ValueError(
                    f"the parts add up to {summed:.3g} kg but total is {self.total:.3g} kg; give one, or make "
                    "them agree within 1 %"
                )
        return self

    @model_validator(mode="before")
    @classmethod
    def _mass_shorthand(cls, value: Any) -> Any:
        if isinstance(value, (int, float, str)) and not isinstance(value, bool):
            return {"total": value}
        return value

    evaporator_volume: Optional[Q("volume", si="L", ip="ft³", gt=0.0, le=10.0)] = None  # type: ignore[valid-type]
    condenser_volume: Optional[Q("volume", si="L", ip="ft³", gt=0.0, le=10.0)] = None  # type: ignore[valid-type]
    receiver_volume: Optional[Q("volume", si="L", ip="ft³", gt=0.0, le=10.0)] = None  # type: ignore[valid-type]
    receiver_level: Q("fraction", gt=0.0, le=1.0) = 0.2  # type: ignore[valid-type]
    occupancy: Literal["a", "b", "c"] = Field(
        default="a", description="EN 378-1 access category of the cold room (default a, the most restrictive)."
    )
    location_class: Literal["I", "II", "III", "IV"] = Field(
        default="I",
        description="EN 378-1 location class of the system (default I, the most restrictive); III and IV only "
        "for a self-contained unit outside the room, since a split system's evaporator is in the cold room.",
    )
    self_contained: bool = Field(
        default=False, description="A self-contained (plug-in / monoblock) appliance: IEC 60335-2-89 applies."
    )


# --- refrigeration (sizing) -------------------------------------------------------------------


class CondensingSettings(Strict):
    """Settings of a compressor / condensing unit: shared by a room's ``refrigeration`` and a ``systems`` entry."""

    refrigerant: str = "R448A"
    condenser_td: Optional[Q("temperature_difference", gt=0.0, le=30.0)] = None  # type: ignore[valid-type]
    condenser_air_temperature: Optional[OutdoorTemperature] = Field(
        default=None,
        description="Air on the condenser on the design day (default: the outdoor design temperature). Over a "
        "year a condenser outdoors keeps this offset above the outdoor air; indoors it stays fixed.",
    )
    condenser_location: Literal["outdoors", "indoors"] = Field(
        default="outdoors",
        description="outdoors: the condenser air follows the weather over a year (compare); indoors: it stays at "
        "condenser_air_temperature all year.",
    )
    suction_line_superheat: Q("temperature_difference", ge=0.0, le=40.0) = _CYCLE.suction_line_superheat  # type: ignore[valid-type]
    suction_line_drop: Q("temperature_difference", ge=0.0, le=10.0) = Field(  # type: ignore[valid-type]
        default=0.0,
        description="Suction-line pressure drop as a loss of saturation temperature [K] (trade: lines sized "
        "for about 1 K); the compressor works at the coldest member's evaporating temperature less this.",
    )
    subcooling: Q("temperature_difference", ge=0.0, le=30.0) = _CYCLE.subcooling  # type: ignore[valid-type]
    isentropic_efficiency: float = Field(
        default=_CYCLE.isentropic_efficiency,
        gt=0.2,
        le=1.0,
        description="Overall isentropic efficiency on the electrical input (motor included).",
    )
    clearance: float = Field(default=_CYCLE.clearance, ge=0.0, le=0.2)
    condenser_fan_power: Optional[Q("power", ge=0.0, le=1e5)] = Field(  # type: ignore[valid-type]
        default=None,
        description="Electrical input of the condenser fans; default estimated from the heat of rejection.",
    )
    minimum_condensing_temperature: Q("temperature", ge=0.0, le=50.0) = Field(  # type: ignore[valid-type]
        default=25.0,
        description="Floating head pressure: the condensing temperature follows the ambient down to this "
        "[°C] (25 °C, common practice for expansion valves without a low-head rating [trade]).",
    )
    gas_cooler_approach: Q("temperature_difference", gt=0.0, le=15.0) = Field(  # type: ignore[valid-type]
        default=3.0,
        description="R-744 transcritical: gas-cooler outlet minus the air entering it [K] (3 K; common "
        "practice 2–5 K, from memory; verify).",
    )
    piping: Optional[Piping] = Field(
        default=None, description="The suction, liquid and discharge lines (sized by coldroom.physics.line_sizing)."
    )
    charge: ChargeSettings = Field(
        default_factory=ChargeSettings,
        description="Charge-estimate inputs and the EN 378-1 occupancy category and location class.",
    )


#: Keys of a room's ``refrigeration`` block that belong to the room's own
#: evaporator; a room in a ``systems`` entry may give only these (the rest is
#: the system's).
ROOM_LEVEL_KEYS: tuple[str, ...] = ("evaporator_td", "superheat")


class Refrigeration(CondensingSettings):
    """Choices for the refrigerant side. TDs default to the trade tables of :mod:`coldroom.rules`;
    the cycle figures to :data:`coldroom.rules.CYCLE_DEFAULTS` (the same as ``coldroom cycle``).

    For a room in no ``systems`` entry this block also sets its own condensing
    unit; for a room in a system only :data:`ROOM_LEVEL_KEYS` may be given here.
    """

    evaporator_td: Optional[Q("temperature_difference", gt=0.0, le=25.0)] = None  # type: ignore[valid-type]
    superheat: Q("temperature_difference", ge=0.0, le=30.0) = _CYCLE.superheat  # type: ignore[valid-type]


class System(CondensingSettings):
    """One compressor (or condensing unit) serving one or more rooms at one suction pressure.

    Rooms warmer than the coldest member keep their own evaporating temperature
    behind an evaporator pressure regulator; the compressor runs at the coldest
    member's evaporating temperature less ``suction_line_drop``. The design
    capacity is the sum of the members' design capacities × ``diversity``.
    """

    name: str = Field(min_length=1, max_length=100)
    rooms: list[Annotated[str, Field(min_length=1, max_length=100)]] = Field(min_length=1, max_length=50)
    diversity: Q("fraction", gt=0.0, le=1.0) = Field(  # type: ignore[valid-type]
        default=1.0, description="Share of the members' summed design capacity the system is sized for."
    )


# --- existing unit (checked by coldroom.equipment) -------------------------------------------
# BEGIN existing-unit block. Models for an installed condensing unit whose capacity is checked at
# the room's new conditions (``coldroom check``). Rating temperatures are saturated DEW points.


class RatedPoint(Strict):
    """A unit known by one rated point (nameplate or catalogue line).

    The rated capacity is taken as the compressor's refrigerating capacity at
    the rating superheat and subcooling, ṁ·(h_suction gas − h_liquid) (EN 12900
    convention [mem]). Give the rating suction state as ``superheat`` or
    ``suction_gas_temperature`` (not both; default 10 K superheat, EN 12900 [mem]).
    """

    capacity: Rating  # type: ignore[valid-type]
    evaporating_temperature: Q("temperature", ge=-60.0, le=20.0)  # type: ignore[valid-type]
    condensing_temperature: Q("temperature", ge=10.0, le=70.0)  # type: ignore[valid-type]
    superheat: Optional[Q("temperature_difference", ge=0.0, le=40.0)] = None  # type: ignore[valid-type]
    suction_gas_temperature: Optional[Q("temperature", ge=-50.0, le=40.0)] = None  # type: ignore[valid-type]
    subcooling: Q("temperature_difference", ge=0.0, le=30.0) = 0.0  # type: ignore[valid-type]
    power: Optional[Rating] = None  # type: ignore[valid-type]
    swept_volume: Optional[Q("volume_flow", gt=0.0, le=1.0)] = None  # type: ignore[valid-type]
    application: Optional[Literal["LT", "MT", "HT"]] = Field(
        default=None,
        description="Application class (LT -45…-15 °C, MT -20…+10 °C, HT -5…+15 °C saturated suction); by default "
        "from the rating suction (-20 °C or colder LT, to 0 °C MT, else HT). Outside it the unit is not suitable.",
    )

    @model_validator(mode="after")
    def _check(self) -> "RatedPoint":
        if self.superheat is not None and self.suction_gas_temperature is not None:
            raise ValueError("give the rating superheat or the suction_gas_temperature, not both")
        if self.evaporating_temperature >= self.condensing_temperature:
            raise ValueError("the rating evaporating temperature must lie below the condensing temperature")
        if self.suction_gas_temperature is not None and self.suction_gas_temperature < self.evaporating_temperature:
            raise ValueError("the suction_gas_temperature lies below the rating evaporating temperature")
        return self

    @property
    def rating_superheat(self) -> float:
        """Superheat at the compressor inlet at rating [K] (10 K when neither is given, EN 12900 [mem])."""
        if self.suction_gas_temperature is not None:
            return self.suction_gas_temperature - self.evaporating_temperature
        return 10.0 if self.superheat is None else self.superheat


PolynomialCoefficients = Annotated[list[float], Field(min_length=10, max_length=10)]


class CompressorPolynomial(Strict):
    """AHRI 540 / EN 12900 ten-coefficient polynomials of a compressor [pub].

    X = C1 + C2·S + C3·D + C4·S² + C5·S·D + C6·D² + C7·S³ + C8·D·S² + C9·S·D² + C10·D³,
    S and D the suction and discharge dew points. ``units`` names the units the
    coefficients were fitted in: ``SI`` = °C, capacity W, power W, mass flow kg/h;
    ``IP`` = °F, capacity Btu/h, power W, mass flow lb/h (AHRI 540 practice [mem]).
    The envelope (``suction_min`` … ``discharge_max``) is read like every
    temperature in the file (a bare number in the project's unit system).
    """

    units: Literal["SI", "IP"] = "SI"
    capacity: PolynomialCoefficients
    power: PolynomialCoefficients
    mass_flow: Optional[PolynomialCoefficients] = None
    superheat: Optional[Q("temperature_difference", ge=0.0, le=40.0)] = None  # type: ignore[valid-type]
    return_gas_temperature: Optional[Q("temperature", ge=-50.0, le=40.0)] = None  # type: ignore[valid-type]
    subcooling: Q("temperature_difference", ge=0.0, le=30.0) = 0.0  # type: ignore[valid-type]
    suction_min: Q("temperature", ge=-60.0, le=30.0)  # type: ignore[valid-type]
    suction_max: Q("temperature", ge=-60.0, le=30.0)  # type: ignore[valid-type]
    discharge_min: Q("temperature", ge=0.0, le=80.0)  # type: ignore[valid-type]
    discharge_max: Q("temperature", ge=0.0, le=80.0)  # type: ignore[valid-type]
    density_correction_factor: float = Field(
        default=0.75,
        ge=0.0,
        le=1.0,
        description="F in ṁ = ṁ_rated·[1 + F·(ρ/ρ_rated − 1)]; 1 is ṁ ∝ ρ_suction, 0.75 Rice & Dabiri [pub].",
    )

    @field_validator("capacity", "power", "mass_flow")
    @classmethod
    def _finite(cls, value: Optional[list[float]]) -> Optional[list[float]]:
        import math

        if value is not None and not all(math.isfinite(c) for c in value):
            raise ValueError("polynomial coefficients must be finite numbers")
        return value

    @model_validator(mode="after")
    def _check(self) -> "CompressorPolynomial":
        if self.superheat is not None and self.return_gas_temperature is not None:
            raise ValueError("give the rating superheat or the return_gas_temperature, not both")
        if self.superheat is None and self.return_gas_temperature is None:
            raise ValueError(
                "give the polynomials' rating superheat (EN 12900: 10 K) or return_gas_temperature "
                "(AHRI 540: 65 °F)"
            )
        if self.suction_min >= self.suction_max:
            raise ValueError("suction_min must lie below suction_max")
        if self.discharge_min >= self.discharge_max:
            raise ValueError("discharge_min must lie below discharge_max")
        if self.suction_max >= self.discharge_max:
            raise ValueError("the suction envelope must lie below the discharge envelope")
        return self


class UnitCoolerRating(Strict):
    """The evaporator (unit cooler): rated capacity at DT1 = air on − evaporating dew (EN 328 [mem])."""

    capacity: Rating  # type: ignore[valid-type]
    dt1: Q("temperature_difference", gt=0.0, le=30.0)  # type: ignore[valid-type]


class CondenserRating(Strict):
    """The air-cooled condenser: rated heat rejection at ΔT = SCT − entering air [trade]."""

    heat_rejection: Rating  # type: ignore[valid-type]
    temperature_difference: Q("temperature_difference", gt=0.0, le=40.0)  # type: ignore[valid-type]


GridTemperatures = Annotated[
    list[Q("temperature", ge=-60.0, le=70.0)], Field(min_length=2, max_length=30)  # type: ignore[valid-type]
]
GridRows = Annotated[
    list[Annotated[list[Rating], Field(min_length=2, max_length=30)]],  # type: ignore[valid-type]
    Field(min_length=2, max_length=30),
]


class RatingTable(Strict):
    """A condensing unit's capacity and power over a grid of SST × condenser air (EN 13215 convention [mem]).

    ``capacity`` and ``power`` are rows, one per ambient (``ambient_temperatures``),
    of columns, one per SST (``evaporating_temperatures``, dew at the unit's suction),
    at the rating ``superheat`` (or ``return_gas_temperature``) and ``subcooling``.
    The whole unit is rated (compressor and its condenser): give no ``condenser`` beside it.
    """

    superheat: Optional[Q("temperature_difference", ge=0.0, le=40.0)] = None  # type: ignore[valid-type]
    return_gas_temperature: Optional[Q("temperature", ge=-50.0, le=40.0)] = None  # type: ignore[valid-type]
    subcooling: Q("temperature_difference", ge=0.0, le=30.0) = 0.0  # type: ignore[valid-type]
    evaporating_temperatures: GridTemperatures
    ambient_temperatures: GridTemperatures
    capacity: GridRows
    power: GridRows

    @model_validator(mode="after")
    def _check(self) -> "RatingTable":
        if self.superheat is not None and self.return_gas_temperature is not None:
            raise ValueError("give the table's rating superheat or the return_gas_temperature, not both")
        if self.superheat is None and self.return_gas_temperature is None:
            raise ValueError("give the table's rating superheat (EN 13215: 10 K) or return_gas_temperature")
        for name in ("evaporating_temperatures", "ambient_temperatures"):
            values = getattr(self, name)
            if any(b <= a for a, b in zip(values, values[1:])):
                raise ValueError(f"{name} must rise from left to right, each value once")
        columns, rows = len(self.evaporating_temperatures), len(self.ambient_temperatures)
        for name in ("capacity", "power"):
            table = getattr(self, name)
            if len(table) != rows or any(len(row) != columns for row in table):
                raise ValueError(
                    f"{name} needs {rows} rows (one per ambient temperature) of {columns} values (one per "
                    f"evaporating temperature); got {len(table)} rows of {', '.join(str(len(r)) for r in table)}"
                )
        if max(self.evaporating_temperatures) >= min(self.ambient_temperatures):
            raise ValueError("the evaporating temperatures must lie below the ambient temperatures")
        return self


class ExistingUnit(Strict):
    """An installed unit to check at the room's new conditions (see :mod:`coldroom.equipment`).

    Give the compressor as ``rated_point``, ``polynomial`` or the whole unit's ``rating_table`` (exactly one);
    ``unit_cooler`` and ``condenser`` are optional — without them the sizing
    TDs fix the evaporating and condensing temperatures.
    """

    name: Name = Field(default="existing unit", max_length=100)
    refrigerant: str
    rated_point: Optional[RatedPoint] = None
    polynomial: Optional[CompressorPolynomial] = None
    rating_table: Optional[RatingTable] = None
    unit_cooler: Optional[UnitCoolerRating] = None
    condenser: Optional[CondenserRating] = None

    @model_validator(mode="after")
    def _check(self) -> "ExistingUnit":
        given = [x is not None for x in (self.rated_point, self.polynomial, self.rating_table)]
        if sum(given) != 1:
            raise ValueError(
                "describe the existing unit's compressor by rated_point, polynomial or rating_table (exactly one)"
            )
        if self.rating_table is not None and self.condenser is not None:
            raise ValueError("a rating_table rates the whole unit with its condenser: give no condenser beside it")
        from coldroom.data import refrigerants

        refrigerants.lookup(self.refrigerant)  # raises LookupNameError listing close names
        return self


# END existing-unit block
