"""The project file: safe YAML → pydantic models → a typed project in SI.

This is the only module that reads YAML (through :mod:`coldroom.inputs.safeyaml`).
Every quantity in the file accepts a bare number in the project's unit system
(``project.units: SI`` or ``IP``) or a string with a unit (``"100 mm"``,
``"35 °F"``, ``"2.5 kW"``); after validation every field holds a plain float in
SI (temperatures in °C, durations in s unless the field says otherwise).

Errors are raised as :class:`coldroom.errors.ProjectFileError` carrying the
file, line, column and dotted key, printed by the CLI as
``file:line:col: dotted.key: message``.

Layout of a project file (all keys are ours; see ``coldroom new``)::

    project:      name, client, site, prepared_by, date, units
    design:       outdoor_temperature, outdoor_rh | outdoor_wet_bulb,
                  ground_temperature, altitude | barometric_pressure, hemisphere
    constructions: {name: {layers: [...]} | {u_value: ...}}
    rooms:        [room, ...]
    systems:      [{name, rooms: [room names], refrigerant, condenser settings, diversity}, ...]
    economics:    electricity_price, currency, emission_factor, service_life, leakage_rate, recovery_factor
    options:      [{name, note, changes: {dotted.path: value}}, ...]  (see coldroom.inputs.options)

Examples
--------
>>> p = parse_project_text('''
... project: {name: Demo, units: SI}
... design: {outdoor_temperature: 30, outdoor_rh: 50 %, ground_temperature: 12}
... constructions:
...   panel: {layers: [{material: pur_panel, thickness: 100 mm}]}
... rooms:
...   - name: Cooler
...     temperature: 2
...     rh: 85 %
...     dimensions: {length: 4, width: 3, height: 2.6}
...     envelope:
...       walls: {construction: panel, facing: space, temperature: 20}
...       ceiling: {construction: panel, facing: space, temperature: 25}
...       floor: {construction: panel, facing: ground}
... ''')
>>> p.rooms[0].envelope.floor.facing
'ground'
>>> round(p.rooms[0].surface_area("north"), 2)
10.4
"""

from __future__ import annotations

import datetime as _dt
import os
import re
from contextvars import ContextVar
from functools import partial
from typing import Annotated, Any, Literal, Optional, Union

from pydantic import (
    AfterValidator,
    BaseModel,
    BeforeValidator,
    ConfigDict,
    Field,
    PrivateAttr,
    ValidationError,
    ValidationInfo,
    field_validator,
    model_validator,
)
from pydantic_core import PydanticCustomError

from coldroom import units as _units
from coldroom.rules import CYCLE_DEFAULTS as _CYCLE
from coldroom.errors import ColdroomError, ProjectFileError, UnitError

# The unit system used for bare numbers while a file is being validated.
_SYSTEM: ContextVar[str] = ContextVar("coldroom_unit_system", default="SI")

SIDES = ("north", "east", "south", "west", "ceiling", "floor")
WALLS = ("north", "east", "south", "west")


# --- quantity fields ---------------------------------------------------------


def _parse(
    value: Any,
    info: ValidationInfo | None = None,
    *,
    kind: str,
    si_unit: str | None,
    ip_unit: str | None,
    ge: float | None,
    le: float | None,
    gt: float | None,
) -> float:
    system = _SYSTEM.get()
    if info is not None and info.context and "system" in info.context:
        system = info.context["system"]
    default = si_unit if system == "SI" else ip_unit
    try:
        number = _units.parse_quantity(value, kind, default_unit=default, system=system)
    except UnitError as exc:
        raise PydanticCustomError("coldroom_unit", str(exc)) from None
    low_ok = (ge is None or number >= ge) and (gt is None or number > gt)
    high_ok = le is None or number <= le
    if not (low_ok and high_ok):
        raise PydanticCustomError(
            "coldroom_range",
            "{value} is outside the valid range {range}",
            {"value": _shown(value, kind, default, system), "range": _range_text(kind, ge, gt, le, default, system)},
        )
    return number


def _shown(value: Any, kind: str, default: str | None, system: str) -> str:
    if isinstance(value, str):
        return repr(value)
    unit = default or _units.DEFAULT_UNITS[system][kind]
    return f"{value} {unit}" if kind != "fraction" else f"{value}"


def _range_text(
    kind: str, ge: float | None, gt: float | None, le: float | None, default: str | None, system: str
) -> str:
    unit = default or _units.DEFAULT_UNITS[system][kind]
    if kind == "fraction":
        unit = "%"

    def fmt(x: float) -> str:
        v = _units.to_unit(x, kind, unit)
        return f"{v:.6g}"

    low = ge if ge is not None else gt
    if low is not None and le is not None:
        op = "…" if ge is not None else " (exclusive) … "
        return f"{fmt(low)}{op}{fmt(le)} {unit}"
    if low is not None:
        return f"{'≥' if ge is not None else '>'} {fmt(low)} {unit}"
    return f"≤ {fmt(le)} {unit}"  # type: ignore[arg-type]


def Q(
    kind: str,
    *,
    si: str | None = None,
    ip: str | None = None,
    ge: float | None = None,
    le: float | None = None,
    gt: float | None = None,
) -> Any:
    """An annotated float field holding an SI value parsed from a quantity.

    Parameters
    ----------
    kind : str
        Quantity kind (see :mod:`coldroom.units`).
    si, ip : str, optional
        Unit of a bare number in SI and IP projects (default: the kind's).
    ge, le, gt : float, optional
        Bounds in SI (°C for temperatures).
    """
    validator = partial(_parse, kind=kind, si_unit=si, ip_unit=ip, ge=ge, le=le, gt=gt)

    def run(value: Any, info: ValidationInfo) -> float:
        return validator(value, info)

    run.quantity_kind = kind  # type: ignore[attr-defined]  # read by checks.quantities()
    return Annotated[float, BeforeValidator(run, json_schema_input_type=Union[float, str])]


_CONTROL_CHARACTER = re.compile("[\x00-\x1f\x7f-\x9f]")
_CONTROL_IN_NOTES = re.compile("[\x00-\x08\x0b-\x1f\x7f-\x9f]")  # notes may hold tabs and line breaks


def _no_control(pattern: "re.Pattern[str]") -> Any:
    def check(value: str) -> str:
        found = pattern.search(value)
        if found:
            raise PydanticCustomError(
                "coldroom_control",
                "control character U+{code} in the text; a name is printed on terminals and the sheet, "
                "so write it with letters, digits, spaces and punctuation only",
                {"code": f"{ord(found.group()):04X}"},
            )
        return value

    return AfterValidator(check)


#: Free text printed on the terminal and the sheet: no control characters (an escape sequence
#: in a room name could rewrite the terminal; a NUL cuts text short).
Name = Annotated[str, _no_control(_CONTROL_CHARACTER)]
Notes = Annotated[str, _no_control(_CONTROL_IN_NOTES)]

Temperature = Q("temperature", ge=-60.0, le=70.0)
RoomTemperature = Q("temperature", ge=-50.0, le=25.0)
OutdoorTemperature = Q("temperature", ge=-40.0, le=55.0)
Fraction = Q("fraction", ge=0.0, le=1.0)
RelativeHumidity = Q("fraction", ge=0.0, le=1.0)
HoursPerDay = Q("time", si="h", ip="h", ge=0.0, le=86400.0)
Length = Q("length", gt=0.0, le=100.0)
Thickness = Q("length", si="mm", ip="in", gt=0.0, le=1.0)
Power = Q("power", ge=0.0, le=1e7)
#: A rating of refrigeration equipment: at least 10 W (nothing smaller is a walk-in's unit, and
#: a vanishing rating only divides by almost zero downstream) [trade].
Rating = Q("power", ge=10.0, le=1e6)
Mass = Q("mass", ge=0.0, le=1e7)


class Strict(BaseModel):
    """Base for every model: unknown keys forbidden, no NaN/inf, frozen."""

    model_config = ConfigDict(extra="forbid", allow_inf_nan=False, frozen=True, str_strip_whitespace=True)


# --- project header and design conditions --------------------------------------


class ProjectInfo(Strict):
    """Who and where: printed in the sheet's header."""

    name: Name = Field(min_length=1, max_length=200)
    client: Name = Field(default="", max_length=200)
    site: Name = Field(default="", max_length=200)
    prepared_by: Name = Field(default="", max_length=200)
    date: Optional[str] = Field(
        default=None,
        description="ISO date YYYY-MM-DD printed on the sheet; when omitted, SOURCE_DATE_EPOCH or today.",
    )
    units: Literal["SI", "IP"] = "SI"
    notes: Notes = Field(default="", max_length=2000)

    @field_validator("date", mode="before")
    @classmethod
    def _date(cls, value: Any) -> Any:
        if value is None:
            return None
        if isinstance(value, (_dt.date, _dt.datetime)):
            return value.isoformat()[:10]
        try:
            return _dt.date.fromisoformat(str(value)).isoformat()
        except ValueError:
            raise PydanticCustomError(
                "coldroom_date", "{value} is not a date; write YYYY-MM-DD", {"value": repr(value)}
            ) from None


class AmbientBinEntry(Strict):
    """Hours per year at one ambient temperature (``design.ambient_bins``)."""

    temperature: Q("temperature", ge=-60.0, le=60.0)  # type: ignore[valid-type]
    hours: float = Field(ge=0.0, le=8784.0)


class DesignConditions(Strict):
    """Site design conditions.

    Give the outdoor humidity as ``outdoor_rh`` or ``outdoor_wet_bulb`` (not
    both), and the site's pressure as ``altitude`` or ``barometric_pressure``
    (default: sea level, 101.325 kPa).
    """

    outdoor_temperature: OutdoorTemperature
    outdoor_rh: Optional[RelativeHumidity] = None
    outdoor_wet_bulb: Optional[OutdoorTemperature] = None
    ground_temperature: Temperature = Field(
        default=12.0, description="Annual mean ground temperature under slabs [°C] (10–15 °C typical [trade])."
    )
    altitude: Optional[Q("length", ge=-500.0, le=5000.0)] = None  # type: ignore[valid-type]
    barometric_pressure: Optional[Q("pressure", ge=50e3, le=110e3)] = None  # type: ignore[valid-type]
    hemisphere: Literal["north", "south"] = "north"
    daily_range: Q("temperature_difference", ge=0.0, le=30.0) = Field(  # type: ignore[valid-type]
        default=0.0,
        description="Design-day dry-bulb daily range (mean daily range of the warmest month) [K]; "
        "0 keeps the outdoor air at the design dry bulb all day (see coldroom.loads.hourly).",
    )

    weather: Optional[str] = Field(
        default=None,
        min_length=1,
        max_length=500,
        description="EPW weather file for the annual energy (`coldroom compare`); relative to the project file.",
    )
    ambient_bins: Optional[list["AmbientBinEntry"]] = Field(
        default=None,
        min_length=1,
        max_length=200,
        description="Hours per year at each ambient temperature (instead of a weather file); 8760 h ± 1 %.",
    )

    @model_validator(mode="after")
    def _one_of(self) -> "DesignConditions":
        if self.weather is not None and self.ambient_bins is not None:
            raise ValueError("give weather (an EPW file) or ambient_bins, not both")
        if self.ambient_bins is not None:
            from coldroom.inputs.weather import AmbientBin, year_hours_error

            problem = year_hours_error([AmbientBin(b.temperature, b.hours) for b in self.ambient_bins])
            if problem is not None:
                raise ValueError(f"ambient_bins: {problem}")
        if self.outdoor_rh is not None and self.outdoor_wet_bulb is not None:
            raise ValueError("give outdoor_rh or outdoor_wet_bulb, not both")
        if self.outdoor_rh is None and self.outdoor_wet_bulb is None:
            raise ValueError("give the outdoor humidity as outdoor_rh or outdoor_wet_bulb")
        if self.altitude is not None and self.barometric_pressure is not None:
            raise ValueError("give altitude or barometric_pressure, not both")
        return self


# --- constructions --------------------------------------------------------------


class Layer(Strict):
    """One layer of a construction: a material from the table, or an explicit conductivity."""

    material: Optional[str] = None
    conductivity: Optional[Q("conductivity", gt=0.0, le=400.0)] = None  # type: ignore[valid-type]
    thickness: Thickness

    @model_validator(mode="after")
    def _one_of(self) -> "Layer":
        if (self.material is None) == (self.conductivity is None):
            raise ValueError("give a layer either a material name or a conductivity (exactly one)")
        if self.material is not None:
            from coldroom.data import materials

            materials.material(self.material)  # raises LookupNameError listing close names
        return self


class Construction(Strict):
    """Wall, ceiling or floor build-up: insulation layers, or a known U-value."""

    layers: Optional[list[Layer]] = Field(default=None, min_length=1, max_length=20)
    u_value: Optional[Q("u_value", gt=0.0, le=10.0)] = None  # type: ignore[valid-type]
    thickness: Optional[Thickness] = Field(
        default=None,
        description="Overall thickness of a construction given by its u_value (for outside areas); "
        "layers give their own sum.",
    )
    description: Name = ""

    @model_validator(mode="after")
    def _one_of(self) -> "Construction":
        if (self.layers is None) == (self.u_value is None):
            raise ValueError("give a construction either layers or a u_value (exactly one)")
        if self.layers is not None and self.thickness is not None:
            raise ValueError("thickness goes with a u_value; a layered construction is as thick as its layers")
        return self

    @property
    def overall_thickness(self) -> float:
        """Thickness of the construction [m]: the sum of its layers, or the given ``thickness`` (else 0)."""
        if self.layers is not None:
            return sum(layer.thickness for layer in self.layers)
        return self.thickness or 0.0


class Surface(Strict):
    """One side of the room and what lies beyond it.

    ``facing``: ``outdoors`` (sun allowance from ``colour`` and orientation),
    ``space`` or ``roof_void`` (another space at ``temperature``), ``room``
    (another room of the project, named by ``room``: its design temperature),
    ``ground`` (the design ground temperature) or ``heated_slab`` (a freezer
    floor over a heated plane held at ``temperature``; the heater's own power
    is not added).

    Heat leaving the room through a surface to a colder space or room is not
    credited unless ``credit: true`` (the neighbour can be off, defrosting or
    emptied; see :func:`coldroom.loads.transmission.credited_heat_gain`).
    """

    construction: Union[str, Construction]
    facing: Literal["outdoors", "space", "roof_void", "room", "ground", "heated_slab"]
    temperature: Optional[Temperature] = None
    room: Optional[str] = Field(default=None, min_length=1, max_length=100)
    credit: bool = Field(
        default=False, description="Count heat lost to a colder neighbour as a credit (default: not credited)."
    )
    colour: Optional[Literal["light", "medium", "dark"]] = None
    area: Optional[Q("area", gt=0.0, le=10000.0)] = None  # type: ignore[valid-type]

    @model_validator(mode="after")
    def _facing_needs(self) -> "Surface":
        if self.facing in ("space", "roof_void", "heated_slab") and self.temperature is None:
            raise ValueError(f"a surface facing {self.facing} needs the temperature on the other side")
        if self.facing == "outdoors" and self.temperature is not None:
            raise ValueError("a surface facing outdoors takes the design outdoor temperature; remove temperature")
        if self.facing == "room":
            if self.room is None:
                raise ValueError("a surface facing room needs `room:` naming the other room of the project")
            if self.temperature is not None:
                raise ValueError(
                    "a surface facing room takes that room's design temperature; remove temperature"
                )
        elif self.room is not None:
            raise ValueError("`room:` applies only to a surface with facing: room")
        if self.credit and self.facing not in ("space", "roof_void", "room"):
            raise ValueError("credit applies only to surfaces facing space, roof_void or room")
        if self.facing != "outdoors" and self.colour is not None:
            raise ValueError("colour (for the sun allowance) applies only to surfaces facing outdoors")
        return self


class Envelope(Strict):
    """The six sides of the room. ``walls`` sets all four walls; a named side overrides it."""

    walls: Optional[Surface] = None
    north: Optional[Surface] = None
    east: Optional[Surface] = None
    south: Optional[Surface] = None
    west: Optional[Surface] = None
    ceiling: Surface
    floor: Surface

    @model_validator(mode="after")
    def _complete(self) -> "Envelope":
        missing = [w for w in WALLS if getattr(self, w) is None and self.walls is None]
        if missing:
            raise ValueError(f"walls {', '.join(missing)} have no surface; give `walls` or each side")
        if self.floor.facing == "outdoors" and self.floor.colour is not None:
            raise ValueError("a floor gets no sun allowance; remove colour")
        return self

    def side(self, name: str) -> Surface:
        """The surface of side *name* (``north`` … ``floor``)."""
        own = getattr(self, name)
        return own if own is not None else self.walls  # type: ignore[return-value]


class Dimensions(Strict):
    """Room dimensions. North and south walls are length × height; east and west are width × height.

    ``measured: inside`` (default) gives the clear inside dimensions; ``measured: outside`` gives
    the outside dimensions of the insulated box: length and width over the walls, height from
    the top of the floor to the top of the ceiling.
    """

    length: Length
    width: Length
    height: Q("length", ge=1.5, le=30.0)  # type: ignore[valid-type]
    measured: Literal["inside", "outside"] = Field(
        default="inside", description="Whether length, width and height are inside or outside dimensions."
    )


# --- doors and infiltration -------------------------------------------------------------


class Door(Strict):
    """A door and its traffic (Gosney & Olama door method)."""

    name: Name = Field(default="door", max_length=100)
    wall: Optional[Literal["north", "east", "south", "west"]] = None
    width: Q("length", ge=0.3, le=10.0)  # type: ignore[valid-type]
    height: Q("length", ge=0.5, le=10.0)  # type: ignore[valid-type]
    passages_per_day: float = Field(default=0.0, ge=0.0, le=20000.0)
    passage_time: Q("time", si="s", ip="s", ge=0.0, le=600.0) = 15.0  # type: ignore[valid-type]
    open_time: Q("time", si="min", ip="min", ge=0.0, le=86400.0) = 0.0  # type: ignore[valid-type]
    protection: Literal["none", "strip_curtain", "air_curtain", "vestibule"] = "none"
    effectiveness: Optional[Fraction] = None
    other_side_temperature: Optional[OutdoorTemperature] = Field(
        default=None, description="Air temperature beyond the door (a corridor, an anteroom); default outdoors."
    )
    other_side_rh: Optional[RelativeHumidity] = Field(
        default=None, description="Relative humidity beyond the door; default the outdoor design RH."
    )
    to_room: Optional[str] = Field(
        default=None,
        min_length=1,
        max_length=100,
        description="The door opens into this room of the project: its design temperature and RH lie beyond.",
    )

    @model_validator(mode="after")
    def _other_side(self) -> "Door":
        if self.to_room is not None and (self.other_side_temperature is not None or self.other_side_rh is not None):
            given = [k for k in ("other_side_temperature", "other_side_rh") if getattr(self, k) is not None]
            raise ValueError(
                f"a door to_room takes that room's design temperature and RH; remove {' and '.join(given)}"
            )
        return self


class Infiltration(Strict):
    """How infiltration is counted: ``door`` (per door) or ``air_changes`` (by room volume)."""

    method: Literal["door", "air_changes"] = "door"
    usage: Literal["normal", "heavy", "long_storage"] = "normal"
    air_changes_per_day: Optional[float] = Field(default=None, gt=0.0, le=500.0)


# --- products -------------------------------------------------------------------------


class ProductProperties(Strict):
    """Explicit properties for a product not in the table.

    Give ``water_content`` (Siebel's formulas), or the specific heats and latent heat.
    """

    water_content: Optional[Fraction] = None
    specific_heat_above: Optional[Q("specific_heat", gt=0.0, le=10e3)] = None  # type: ignore[valid-type]
    specific_heat_below: Optional[Q("specific_heat", gt=0.0, le=10e3)] = None  # type: ignore[valid-type]
    latent_heat: Optional[Q("specific_energy", ge=0.0, le=400e3)] = None  # type: ignore[valid-type]
    freezing_point: Temperature = -1.0

    @model_validator(mode="after")
    def _enough(self) -> "ProductProperties":
        explicit = (self.specific_heat_above, self.specific_heat_below, self.latent_heat)
        if self.water_content is None and any(v is None for v in explicit):
            raise ValueError(
                "give water_content, or all of specific_heat_above, specific_heat_below and latent_heat"
            )
        return self


class Packaging(Strict):
    """Packaging brought in with the daily intake."""

    mass: Mass = 0.0
    material: Literal["corrugated_board", "wood", "plastic", "other"] = "corrugated_board"
    specific_heat: Optional[Q("specific_heat", gt=0.0, le=5e3)] = None  # type: ignore[valid-type]


class Product(Strict):
    """A product: named from the table or with explicit properties, and its daily movement."""

    product: Optional[str] = None
    properties: Optional[ProductProperties] = None
    daily_intake: Mass = 0.0
    entering_temperature: Optional[Temperature] = None
    final_temperature: Optional[Temperature] = None
    # ≥ 1 h: no walk-in room pulls product down faster (a blast chiller takes about 90 min) [trade]
    pulldown_time: Q("time", si="h", ip="h", ge=3600.0, le=7 * 86400.0) = 86400.0  # type: ignore[valid-type]
    packaging: Optional[Packaging] = None
    stored_mass: Mass = 0.0

    @model_validator(mode="after")
    def _check(self) -> "Product":
        if (self.product is None) == (self.properties is None):
            raise ValueError("give a product either a table name (product) or properties (exactly one)")
        if self.product is not None:
            from coldroom.physics import products

            products.get_product(self.product)
        if self.daily_intake > 0 and (self.entering_temperature is None or self.final_temperature is None):
            raise ValueError("a daily_intake needs entering_temperature and final_temperature")
        return self


# --- internal loads -------------------------------------------------------------------------


class People(Strict):
    count: float = Field(default=0.0, ge=0.0, le=200.0)
    hours: HoursPerDay = 0.0


class Lighting(Strict):
    """Lighting by power density (``power_density``) or total ``power``."""

    power_density: Optional[Q("power_per_area", ge=0.0, le=100.0)] = None  # type: ignore[valid-type]
    power: Optional[Power] = None
    hours: HoursPerDay = 0.0

    @model_validator(mode="after")
    def _one_of(self) -> "Lighting":
        if (self.power_density is None) == (self.power is None):
            raise ValueError("give lighting either power_density or power (exactly one)")
        return self


class Fans(Strict):
    """Evaporator fan motors. In the air stream the whole input counts."""

    count: float = Field(default=1.0, ge=0.0, le=100.0)
    power: Power = 0.0
    hours: HoursPerDay = 86400.0
    in_air_stream: bool = True
    motor_efficiency: Fraction = 0.6


class Appliance(Strict):
    """Forklift, pallet truck, heater (door frame, drain line) or other equipment."""

    name: Name = Field(min_length=1, max_length=100)
    kind: Literal["equipment", "forklift", "heater"] = "equipment"
    power: Power
    hours: HoursPerDay = 86400.0
    count: float = Field(default=1.0, ge=0.0, le=100.0)


class Defrost(Strict):
    """Defrost: type, frequency, duration, heater power and the share of it reaching the room."""

    type: Literal["off_cycle", "electric", "hot_gas"] = "off_cycle"
    per_day: float = Field(default=4.0, ge=0.0, le=24.0)
    duration: Q("time", si="min", ip="min", ge=0.0, le=7200.0) = 1800.0  # type: ignore[valid-type]
    heater_power: Power = 0.0
    share_to_room: Fraction = Field(default=0.5, description="Share of the heater energy reaching the room (trade 50–100 %).")


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
    condenser_air_temperature: Optional[OutdoorTemperature] = None
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


# --- design-day schedules (coldroom.loads.hourly) ----------------------------------------------------


def _hour_of_day(value: Any) -> Any:
    """A time of day as hours after midnight: a number 0–24 or text ``"HH:MM"``."""
    if isinstance(value, str) and ":" in value:
        hours, _, minutes = value.strip().partition(":")
        try:
            h, m = int(hours), int(minutes)
        except ValueError:
            raise PydanticCustomError(
                "coldroom_time", "{value} is not a time of day; write HH:MM or hours after midnight", {"value": repr(value)}
            ) from None
        if not (0 <= h <= 24 and 0 <= m < 60) or h * 60 + m > 24 * 60:
            raise PydanticCustomError("coldroom_time", "{value} is not a time of day (00:00 … 24:00)", {"value": repr(value)})
        return h + m / 60.0
    return value


HourOfDay = Annotated[float, BeforeValidator(_hour_of_day), Field(ge=0.0, le=24.0)]


class Window(Strict):
    """A stretch of the day from ``start`` to ``end`` (hours after midnight or ``"HH:MM"``).

    An ``end`` earlier than ``start`` runs past midnight (``{start: 22, end: 6}``).
    """

    start: HourOfDay
    end: HourOfDay

    @model_validator(mode="after")
    def _not_empty(self) -> "Window":
        if self.start % 24.0 == self.end % 24.0:
            raise ValueError("a window needs an end different from its start (for all day, leave the schedule out)")
        return self

    @property
    def hours(self) -> float:
        """Length of the window [h]."""
        return (self.end - self.start) % 24.0


class DoorWindow(Window):
    """Door traffic window and the share of the day's passages (and standing-open time) in it."""

    share: Fraction


class Delivery(Strict):
    """A product delivery: time of day and mass (the room's products share it in proportion to their intake)."""

    time: HourOfDay
    mass: Q("mass", gt=0.0, le=1e7)  # type: ignore[valid-type]


class Schedule(Strict):
    """The room's design day hour by hour (optional; see :mod:`coldroom.loads.hourly`).

    Each list is optional; what it leaves out keeps its default placing: door
    traffic spread evenly over the day, people, lighting and equipment from
    08:00 for their hours, the daily intake delivered at 08:00, defrosts
    evenly spaced from midnight [trade]. With a schedule the peak-hour design
    figure comes from the hour-by-hour profile.
    """

    doors: Optional[list[DoorWindow]] = Field(default=None, min_length=1, max_length=24)
    people: Optional[list[Window]] = Field(default=None, min_length=1, max_length=24)
    lighting: Optional[list[Window]] = Field(default=None, min_length=1, max_length=24)
    deliveries: Optional[list[Delivery]] = Field(default=None, min_length=1, max_length=48)
    defrost: Optional[list[HourOfDay]] = Field(
        default=None, min_length=1, max_length=24, description="Defrost start times (one per defrost a day)."
    )


class Pulldown(Strict):
    """Options of the pull-down simulation (see :mod:`coldroom.loads.pulldown`)."""

    panel_skin: bool = Field(
        default=False, description="Count the inner metal skin of the panels as thermal mass (0.5 mm steel [trade])."
    )
    hours: Optional[Q("time", si="h", ip="h", ge=3600.0, le=7 * 86400.0)] = Field(  # type: ignore[valid-type]
        default=None, description="Time simulated; default twice the longest pull-down time asked, at least 24 h."
    )


# --- room and project ---------------------------------------------------------------------------


class Room(Strict):
    """One walk-in room."""

    name: Name = Field(min_length=1, max_length=100)
    temperature: RoomTemperature
    rh: RelativeHumidity = 0.85
    dimensions: Optional[Dimensions] = None
    volume: Optional[Q("volume", gt=0.0, le=1e5)] = None  # type: ignore[valid-type]
    envelope: Envelope
    doors: list[Door] = Field(default_factory=list, max_length=20)
    infiltration: Infiltration = Infiltration()
    products: list[Product] = Field(default_factory=list, max_length=50)
    people: People = People()
    lighting: Optional[Lighting] = None
    fans: Optional[Fans] = None
    appliances: list[Appliance] = Field(default_factory=list, max_length=50)
    defrost: Defrost = Defrost()
    safety_factor: Q("fraction", ge=0.0, le=1.0) = 0.10  # type: ignore[valid-type]
    run_hours: Optional[Q("time", si="h", ip="h", ge=3600.0, le=86400.0)] = None  # type: ignore[valid-type]
    refrigeration: Refrigeration = Refrigeration()
    existing_unit: Optional[ExistingUnit] = Field(
        default=None, description="An installed unit to check (see coldroom.equipment)."
    )
    schedule: Optional[Schedule] = Field(
        default=None, description="The design day hour by hour (see coldroom.loads.hourly)."
    )
    pulldown: Pulldown = Pulldown()
    #: Construction thickness of each side [m], filled in by the project (which knows the named
    #: constructions); 0 for a room validated on its own.
    _thickness: dict[str, float] = PrivateAttr(default_factory=dict)

    @model_validator(mode="after")
    def _geometry(self) -> "Room":
        if self.dimensions is None:
            sides_without_area = [s for s in SIDES if self.envelope.side(s).area is None]
            if sides_without_area:
                raise ValueError(
                    f"give dimensions, or an area for every surface (missing: {', '.join(sides_without_area)})"
                )
            if self.volume is None:
                raise ValueError("without dimensions the room needs a volume")
        return self

    # derived geometry (SI)
    def box_dimensions(self, where: str) -> Optional[tuple[float, float, float]]:
        """(length, width, height) [m] of the ``inside`` or ``outside`` of the insulated box.

        Outside = inside + the construction thickness on each side: the length over the east
        and west walls, the width over the north and south walls, the height from the top of
        the floor over the ceiling. The floor build-up is not added to the wall height: below
        the floor's top surface the walls stand against the floor's own section, which counts
        its heat gain over the outside length × width [trade]. ``None`` without dimensions.
        """
        d = self.dimensions
        if d is None:
            return None
        t = self._thickness.get  # each side's construction thickness, 0 when not known (read once:
        # a private attribute costs a pydantic look-up, and this runs for every side at every hour)
        extra = (t("east", 0.0) + t("west", 0.0), t("north", 0.0) + t("south", 0.0), t("ceiling", 0.0))
        sign = {("inside", "inside"): 0.0, ("outside", "outside"): 0.0,
                ("inside", "outside"): 1.0, ("outside", "inside"): -1.0}[(d.measured, where)]
        return (d.length + sign * extra[0], d.width + sign * extra[1], d.height + sign * extra[2])

    @staticmethod
    def _face(box: tuple[float, float, float], side: str) -> float:
        length, width, height = box
        if side in ("north", "south"):
            return length * height
        if side in ("east", "west"):
            return width * height
        return length * width

    def surface_area(self, side: str) -> float:
        """Inside area of *side* [m²]: explicit, or from the inside dimensions."""
        surface = self.envelope.side(side)
        if surface.area is not None:
            return surface.area
        box = self.box_dimensions("inside")
        assert box is not None
        return max(self._face(box, side), 0.0)

    def transmission_area(self, side: str) -> tuple[float, str]:
        """Area of *side* for U·A·ΔT [m²] and its basis, ``"given"`` or ``"outside"``.

        The load method takes the outside surface area of each section (ASHRAE
        Handbook—Refrigeration, "Refrigerated-Facility Loads", transmission load [mem])
        [ref:ashrae-refrig-loads]: the faces of the insulated box over its outside
        dimensions, so edges and corners are counted once on the outside. An explicit
        ``area`` is taken as given.
        """
        surface = self.envelope.side(side)
        if surface.area is not None:
            return surface.area, "given"
        box = self.box_dimensions("outside")
        assert box is not None
        return self._face(box, side), "outside"

    @property
    def floor_area(self) -> float:
        """Floor area [m²]."""
        return self.surface_area("floor")

    @property
    def inside_volume(self) -> float:
        """Inside volume [m³]: given, or from the inside dimensions (0 if the walls leave no room)."""
        if self.volume is not None:
            return self.volume
        box = self.box_dimensions("inside")
        assert box is not None
        length, width, height = box
        return length * width * height if min(box) > 0.0 else 0.0


class Economics(Strict):
    """Running cost and TEWI inputs (``coldroom compare``); defaults in :mod:`coldroom.design.tewi`, marked as such."""

    electricity_price: Optional[float] = Field(
        default=None, ge=0.0, le=100.0, description="Electricity price in currency units per kWh (bare number)."
    )
    currency: Optional[str] = Field(default=None, pattern=r"^[A-Za-z$€£¥]{1,8}$", description="e.g. EUR")
    emission_factor: Optional[float] = Field(
        default=None, ge=0.0, le=3.0, description="Grid emission factor in kg CO2e per kWh (bare number)."
    )
    service_life: Optional[float] = Field(default=None, gt=0.0, le=60.0, description="Years in service.")
    leakage_rate: Optional[Q("fraction", si="%", ip="%", ge=0.0, le=1.0)] = Field(  # type: ignore[valid-type]
        default=None, description="Percent of the charge lost per year."
    )
    recovery_factor: Optional[Q("fraction", si="%", ip="%", ge=0.0, le=1.0)] = Field(  # type: ignore[valid-type]
        default=None, description="Percent of the charge recovered at the end of life."
    )


class Option(Strict):
    """One alternative to the project as written: dotted paths to new values (see :mod:`coldroom.inputs.options`)."""

    name: str = Field(min_length=1, max_length=60)
    note: str = Field(default="", max_length=500)
    changes: dict[Annotated[str, Field(min_length=1, max_length=300)], Any] = Field(min_length=1, max_length=50)

    @field_validator("name")
    @classmethod
    def _not_base(cls, value: str) -> str:
        if value.strip().lower() == "base":
            raise ValueError("'base' names the project as written; choose another option name")
        return value


class ProjectModel(Strict):
    """The whole project file."""

    project: ProjectInfo
    design: DesignConditions
    constructions: dict[str, Construction] = Field(default_factory=dict, max_length=50)
    rooms: list[Room] = Field(min_length=1, max_length=50)
    systems: list[System] = Field(
        default_factory=list,
        max_length=50,
        description="Rooms sharing a compressor; a room in none forms a system of its own named after the room.",
    )
    economics: Economics = Economics()
    options: list[Option] = Field(default_factory=list, max_length=20)
    #: The validated projects of ``options`` (name, note, model), filled by :func:`parse_project_data`.
    _option_models: list[tuple[str, str, "ProjectModel"]] = PrivateAttr(default_factory=list)
    #: Folder of the project file (relative weather paths are resolved against it).
    _folder: str = PrivateAttr(default="")

    @model_validator(mode="after")
    def _unique_options(self) -> "ProjectModel":
        seen: set[str] = set()
        for option in self.options:
            if option.name in seen:
                raise ValueError(f"two options are called {option.name!r}")
            seen.add(option.name)
        return self

    @model_validator(mode="after")
    def _section_thickness(self) -> "ProjectModel":
        # Each room learns how thick its sides are (for outside dimensions and areas); an
        # unknown construction name counts 0 here and is refused by coldroom.inputs.physical_checks.
        for room in self.rooms:
            thickness = {}
            for side in SIDES:
                ref = room.envelope.side(side).construction
                construction = ref if isinstance(ref, Construction) else self.constructions.get(ref)
                thickness[side] = construction.overall_thickness if construction is not None else 0.0
            room._thickness = thickness
        return self

    def construction(self, ref: Union[str, Construction]) -> Construction:
        """Resolve a surface's construction (a name from ``constructions`` or inline)."""
        if isinstance(ref, Construction):
            return ref
        return self.constructions[ref]

    def room_named(self, name: str) -> Room:
        """The room called *name* (exact; the checks have rejected unknown names).

        Raises
        ------
        LookupNameError
            No room has that name (the message lists the closest names).
        """
        for room in self.rooms:
            if room.name == name:
                return room
        from coldroom.errors import unknown_name

        raise unknown_name("room", name, [room.name for room in self.rooms])

    def system_of(self, room: Room) -> Optional[System]:
        """The ``systems`` entry listing *room*, or ``None`` when the room forms a system of its own."""
        for system in self.systems:
            if room.name in system.rooms:
                return system
        return None

    def system_groups(self) -> list[tuple[str, Optional[System], tuple[int, ...]]]:
        """Every system of the project as ``(name, entry or None, member room indices)``.

        Ordered by the first member's place in ``rooms``; a room in no
        ``systems`` entry forms a system of its own named after the room.
        """
        out: list[tuple[str, Optional[System], tuple[int, ...]]] = []
        seen: set[str] = set()
        index = {room.name: i for i, room in reversed(list(enumerate(self.rooms)))}
        for i, room in enumerate(self.rooms):
            system = self.system_of(room)
            if system is None:
                out.append((room.name, None, (i,)))
            elif system.name not in seen:
                seen.add(system.name)
                out.append((system.name, system, tuple(index[name] for name in system.rooms if name in index)))
        return out

    def refrigeration_for(self, room: Room) -> Refrigeration:
        """The refrigeration settings that apply to *room*: its system's, with its own room-level keys.

        For a room in no ``systems`` entry this is the room's own block.
        """
        system = self.system_of(room)
        if system is None:
            return room.refrigeration
        shared = {name: getattr(system, name) for name in CondensingSettings.model_fields}
        own = {name: getattr(room.refrigeration, name) for name in ROOM_LEVEL_KEYS}
        return Refrigeration.model_construct(**shared, **own)


# --- loading ------------------------------------------------------------------------------------------


def _system_of(data: Any) -> str:
    if isinstance(data, dict):
        project = data.get("project")
        if isinstance(project, dict) and project.get("units") in ("SI", "IP"):
            return str(project["units"])
    return "SI"


def _message(error: dict[str, Any]) -> str:
    kind = error.get("type", "")
    msg = str(error.get("msg", "invalid value"))
    if msg.startswith("Value error, "):
        msg = msg[len("Value error, ") :]
    if kind == "extra_forbidden":
        return "unknown key (check the spelling; `coldroom schema` lists the valid keys)"
    if kind == "missing":
        return "required key is missing"
    if kind == "literal_error":
        return f"{error.get('input')!r} is not one of the valid choices: {msg.split('Input should be ', 1)[-1]}"
    if kind in ("model_type", "dict_type", "model_attributes_type"):
        return f"expected a mapping (key: value pairs), got {_kind_of(error.get('input'))}"
    if kind == "list_type":
        return f"expected a list (lines starting with '- '), got {_kind_of(error.get('input'))}"
    if kind == "string_type":
        return f"expected text, got {_kind_of(error.get('input'))} {error.get('input')!r} (quote it)"
    if kind == "too_short":
        return f"needs at least {(error.get('ctx') or {}).get('min_length', 1)} item(s); found none"
    if kind in ("float_parsing", "float_type", "int_parsing"):
        return f"{error.get('input')!r} is not a number"
    if kind in ("greater_than_equal", "less_than_equal", "greater_than", "less_than"):
        ctx = error.get("ctx", {})
        return f"{error.get('input')!r} is outside the valid range ({msg.replace('Input should be ', '')}; {ctx})"
    return msg


def _kind_of(value: Any) -> str:
    if isinstance(value, dict):
        return "a mapping"
    if isinstance(value, (list, tuple)):
        return "a list"
    if value is None:
        return "nothing (null)"
    if isinstance(value, bool):
        return "true/false"
    if isinstance(value, (int, float)):
        return "a number"
    return "text"


def parse_project_data(data: Any, filename: str = "<input>", loaded: Any = None) -> ProjectModel:
    """Validate already-loaded YAML data into a :class:`ProjectModel`.

    Raises
    ------
    ProjectFileError
        On the first invalid key, with its position when *loaded* carries marks.
    """
    system = _system_of(data)
    token = _SYSTEM.set(system)
    try:
        model = ProjectModel.model_validate(data, context={"system": system})
    except ValidationError as exc:
        errors = exc.errors(include_url=False)
        first = errors[0]
        loc = _refined_location(first)
        message = _message(first)
        if len(errors) > 1:
            message += f" (and {len(errors) - 1} more error{'s' if len(errors) > 2 else ''})"
        raise error_at(loaded, filename, message, loc) from None
    except ColdroomError as exc:  # pragma: no cover - pydantic wraps ValueErrors; kept as a guard
        raise error_at(loaded, filename, str(exc), ()) from None
    finally:
        _SYSTEM.reset(token)
    model._folder = os.path.dirname(os.path.abspath(filename)) if filename != "<input>" else os.getcwd()
    return model


def _refined_location(error: dict[str, Any]) -> tuple:
    """The error's location, narrowed to the offending key where the model says only the object.

    A model validator that rejects a name (unknown product, material or
    refrigerant) is reported by pydantic at the object; point at the key whose
    text the message quotes instead, so the position is that key's line.
    """
    loc = tuple(part for part in error.get("loc", ()) if part != "[key]")  # a bad mapping key: at the key
    value = error.get("input")
    cause = (error.get("ctx") or {}).get("error")
    if isinstance(cause, ColdroomError) and isinstance(value, dict):
        text = str(cause)
        for key, item in value.items():
            if isinstance(key, str) and isinstance(item, str) and repr(item) in text:
                return loc + (key,)
    return loc


def error_at(loaded: Any, filename: str, message: str, path: tuple) -> ProjectFileError:
    """The :class:`ProjectFileError` for *message* at the key *path*, with its file position when known."""
    if loaded is not None:
        return loaded.error(message, path)
    from coldroom.inputs.safeyaml import dotted

    return ProjectFileError(message, file=filename, key=dotted(path) or None)


def parse_project_text(text: str | bytes, filename: str = "<input>") -> ProjectModel:
    """Load and validate a project from YAML text (each field; the physical checks are
    :func:`coldroom.inputs.physical_checks.check_physics`, run by :func:`coldroom.inputs.opening.open_project`)."""
    from coldroom.inputs.safeyaml import load_yaml

    loaded = load_yaml(text, filename=filename)
    return parse_project_data(loaded.data, filename=filename, loaded=loaded)


def json_schema() -> dict[str, Any]:
    """JSON Schema of the project file, for editors that complete and check YAML."""
    schema = ProjectModel.model_json_schema()
    schema["$schema"] = "https://json-schema.org/draft/2020-12/schema"
    schema["title"] = "coldroom project file"
    return schema
