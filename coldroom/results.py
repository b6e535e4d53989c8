"""Result objects: frozen dataclasses in SI, every field's unit in its name or docstring.

Reports (PDF, JSON, terminal) only read these; they compute nothing new.
"""

from __future__ import annotations

from dataclasses import dataclass, field, replace
from typing import Any, Optional

from coldroom.constants import SECONDS_PER_DAY_S
from coldroom.rules import required_capacity, with_safety_factor
from coldroom.units import format_terms

#: The load components, in the order of the ASHRAE Handbook—Refrigeration
#: chapter "Refrigerated-Facility Loads": transmission, product, infiltration,
#: internal, equipment.
COMPONENTS: tuple[str, ...] = ("transmission", "product", "infiltration", "internal", "equipment")


@dataclass(frozen=True)
class Term:
    """One number in the working of a load line, kept in SI so each report shows it in its own units.

    Attributes
    ----------
    value : float
        The number in SI (°C for temperatures, s for durations).
    kind : str
        A quantity kind of :mod:`coldroom.units` (``u_value``, ``area``,
        ``temperature_difference``, ``power``, ``mass``, ``volume``,
        ``energy_density`` …), or ``number``, ``percent``, ``hours``, ``minutes``.
    prefix, suffix : str
        Words around the number (``"Dt "``, ``"/day"``).
    sep : str
        What stands before the term when it is not the first (``" × "`` by default).
    """

    value: float
    kind: str
    prefix: str = ""
    suffix: str = ""
    sep: str = " × "

    def to_json(self) -> dict[str, Any]:
        return {"value_si": self.value, "kind": self.kind, "prefix": self.prefix, "suffix": self.suffix, "sep": self.sep}


def _with_sep(part: object) -> object:
    return replace(part, sep="") if isinstance(part, Term) and part.sep == " × " else part


#: Text mixed with SI numbers (:class:`Term`): ``("rated ", inline_term(4500.0, "power"), " at ΔT ", …)``;
#: reports show it in their own unit system with :func:`coldroom.units.format_terms`.
Phrase = tuple  # tuple[str | Term, ...]


def inline_term(value: float, kind: str) -> Term:
    """One number inside a phrase (no separator of its own)."""
    return Term(value, kind, sep="")


class Note(str):
    """A message whose numbers stay in SI so each report can show them in its own units.

    It *is* a string: its text is the SI wording, so it prints, compares and
    serialises like any message. :func:`coldroom.units.format_terms` rewrites it
    in another unit system from :attr:`phrase`.

    Examples
    --------
    >>> n = Note("room ", Term(2.0, "temperature"), " is too warm")
    >>> n
    'room 2.0 °C is too warm'
    >>> format_terms(n, "IP")
    'room 35.6 °F is too warm'
    """

    phrase: tuple[Any, ...]

    def __new__(cls, *parts: object) -> "Note":
        phrase = tuple(_with_sep(part) for part in parts)
        note = super().__new__(cls, format_terms(phrase, "SI"))
        note.phrase = phrase
        return note

    def prefixed(self, text: str) -> "Note":
        """The same note with *text* in front (e.g. the room's name)."""
        return Note(text, *self.phrase)

    @classmethod
    def fill(cls, template: str, **values: tuple[float, str]) -> "Note":
        """A note from a template whose ``{name}`` fields are ``(value_si, kind)`` pairs.

        Examples
        --------
        >>> Note.fill("door {h} is taller than the room", h=(2.5, "length"))
        'door 2.50 m is taller than the room'
        """
        import re

        parts: list[object] = []
        for i, piece in enumerate(re.split(r"\{(\w+)\}", template)):
            if i % 2:
                if piece not in values:  # braces in a name, not a field
                    parts.append("{" + piece + "}")
                    continue
                value, kind = values[piece]
                parts.append(Term(value, kind, sep=""))
            elif piece:
                parts.append(piece)
        return cls(*parts)


@dataclass(frozen=True)
class LoadLine:
    """One line of the load calculation.

    Attributes
    ----------
    component : str
        One of :data:`COMPONENTS`.
    item : str
        What the line is ("north wall", "door: shop door", "strawberries: latent").
    daily_energy : float
        Heat gained over 24 h [J].
    basis : tuple of Term
        How the figure was found (U × A × ΔT, …), in SI; reports format it
        with :func:`coldroom.units.format_terms` in their unit system.
    """

    component: str
    item: str
    daily_energy: float
    basis: tuple[Term, ...] = ()

    @property
    def average_power(self) -> float:
        """24-hour average heat gain [W]."""
        return self.daily_energy / SECONDS_PER_DAY_S


#: The one-daily-energy rule, as the JSON states it (``rooms[].daily_energy_basis``).
DAILY_ENERGY_RULE = (
    "one daily energy: the 24 hourly loads average to daily_energy_kwh / 24 (within 0.5 %); every line's energy "
    "is placed in the hours, none added or lost; "
)


@dataclass(frozen=True)
class RoomLoads:
    """The 24-hour heat load of one room.

    Attributes
    ----------
    name : str
        Room name.
    lines : tuple of LoadLine
        Every contribution.
    safety_factor : float
        Fraction added to the daily energy [-].
    run_time : float
        Compressor run time per day [s].
    run_time_basis : str
        Where the run time came from (given, or the default for the defrost type).
    peak_load : float
        Peak-hour load [W]: with a schedule, the design day's largest hourly load
        (defrost heat left out, :mod:`coldroom.loads.hourly`); without, product at its
        pull-down rate, all internal loads on, transmission and infiltration at
        their averages.
    volume : float
        Inside volume [m³].
    floor_area : float
        Inside floor area [m²].
    dimensions_measured : str or None
        ``"inside"`` or ``"outside"``: how the room's dimensions were given (``None``
        when the room is described by areas and a volume).
    transmission_area_basis : str
        The areas in U·A·ΔT: ``"outside"`` (outside surface of each section, the load
        method's basis), ``"given"`` (areas from the project file) or ``"outside, given"``.
    warnings : tuple of str
        Storage advice and doubts about the schedule.
    design_day : DesignDay or None
        The 24 hourly loads (:class:`coldroom.loads.hourly.DesignDay`).
    """

    name: str
    lines: tuple[LoadLine, ...]
    safety_factor: float
    run_time: float
    run_time_basis: str
    peak_load: float
    volume: float
    floor_area: float
    warnings: tuple[str, ...] = ()
    dimensions_measured: str | None = None
    transmission_area_basis: str = "outside"
    design_day: Any = None  # coldroom.loads.hourly.DesignDay

    def component_energy(self, component: str) -> float:
        """Daily energy of one component [J]."""
        return sum(line.daily_energy for line in self.lines if line.component == component)

    @property
    def components_w(self) -> dict[str, float]:
        """24-hour average of each component [W], in :data:`COMPONENTS` order."""
        return {c: self.component_energy(c) / SECONDS_PER_DAY_S for c in COMPONENTS}

    @property
    def daily_energy(self) -> float:
        """Total heat gain over 24 h, before the safety factor [J]."""
        return sum(line.daily_energy for line in self.lines)

    @property
    def required_capacity(self) -> float:
        """Required refrigeration capacity [W] = (1 + SF) × daily energy / run time
        (:func:`coldroom.rules.required_capacity`)."""
        return required_capacity(self.daily_energy, self.run_time, self.safety_factor)

    @property
    def peak_capacity(self) -> float:
        """Peak-hour load with the safety factor [W]."""
        return with_safety_factor(self.peak_load, self.safety_factor)

    @property
    def design_capacity(self) -> float:
        """Capacity the equipment is sized for [W]: the larger of the required and the peak capacity.

        The ASHRAE method sizes on the 24-hour figure; taking the peak hour too, so that a fast
        pull-down is not hidden by the average, is our choice (common practice, no source).
        """
        return max(self.required_capacity, self.peak_capacity)

    @property
    def governed_by(self) -> str:
        """``"daily energy"`` or ``"peak hour"``: which figure sets the design capacity."""
        return "peak hour" if self.peak_capacity > self.required_capacity else "daily energy"

    @property
    def daily_energy_basis(self) -> str:
        """How the daily energy and the hourly loads agree (:data:`DAILY_ENERGY_RULE`)."""
        temps = getattr(self.design_day, "outdoor_temperature", None) or (0.0,)
        if max(temps) == min(temps):
            return DAILY_ENERGY_RULE + "transmission and infiltration at the design dry bulb all day (no daily range)"
        return DAILY_ENERGY_RULE + (
            "transmission and infiltration at each hour's outdoor air (the design day follows the daily range), "
            "their daily energy the design day's mean"
        )

    def to_json(self) -> dict[str, Any]:
        """JSON object with SI numbers; every numeric key names its unit."""
        return {
            "name": self.name,
            "loads_w": self.components_w,
            "daily_energy_kwh": self.daily_energy / 3.6e6,
            "safety_factor": self.safety_factor,
            "daily_run_time_h": self.run_time / 3600.0,
            "daily_run_time_basis": self.run_time_basis,
            "required_capacity_w": self.required_capacity,
            "peak_load_w": self.peak_load,
            "peak_load_basis": (
                "design day schedule"
                if self.design_day is not None and self.design_day.scheduled
                else "product pull-down rate, internal loads all on, other loads at their averages"
            ),
            "hourly_load_w": list(self.design_day.hourly_load) if self.design_day is not None else None,
            "daily_energy_basis": self.daily_energy_basis,
            "peak_hour": self.design_day.peak_hour if self.design_day is not None else None,
            "hourly_outdoor_temperature_c": (
                list(self.design_day.outdoor_temperature) if self.design_day is not None else None
            ),
            "design_capacity_w": self.design_capacity,
            "design_capacity_governed_by": self.governed_by,
            "volume_m3": self.volume,
            "floor_area_m2": self.floor_area,
            "dimensions_measured": self.dimensions_measured,
            "transmission_area_basis": self.transmission_area_basis,
            "lines": [
                {
                    "component": line.component,
                    "item": line.item,
                    "daily_energy_kwh": line.daily_energy / 3.6e6,
                    "average_power_w": line.average_power,
                    "basis_si": format_terms(line.basis, "SI"),
                    "basis_terms": [term.to_json() for term in line.basis],
                }
                for line in self.lines
            ],
            "warnings": list(self.warnings),
        }


@dataclass(frozen=True)
class RoomResult:
    """Everything coldroom found for one room."""

    loads: RoomLoads
    evaporating_temperature: Optional[float] = None  # °C, saturated dew point
    condensing_temperature: Optional[float] = None  # °C, saturated dew point
    condenser_air_temperature: Optional[float] = None  # °C
    sizing_basis: tuple[tuple[str, Phrase], ...] = ()  # (what, phrase in SI terms) pairs for the sheet
    cycle: Any = None  # coldroom.physics.cycle.CycleResult; None for a member of a system of several rooms
    check: Any = None  # coldroom.equipment.CheckResult
    warnings: tuple[str, ...] = ()
    system: str = ""  # the name of the room's system
    pulldown: Any = None  # coldroom.loads.pulldown.PulldownResult (rooms that take product in)
    limits: Any = None  # coldroom.design.unit_limits.UnitLimits (rooms with an existing unit)

    @property
    def name(self) -> str:
        return self.loads.name

    def to_json(self) -> dict[str, Any]:
        out = self.loads.to_json()
        out["system"] = self.system or self.name
        out["evaporating_temperature_c"] = self.evaporating_temperature
        out["condensing_temperature_c"] = self.condensing_temperature
        out["condenser_air_temperature_c"] = self.condenser_air_temperature
        out["sizing_basis"] = [{"item": what, "value": format_terms(value, "SI")} for what, value in self.sizing_basis]
        out["cycle"] = self.cycle.to_json() if self.cycle is not None else None
        out["pulldown"] = self.pulldown.to_json() if self.pulldown is not None else None
        if self.check is not None:
            out["existing_unit"] = self.check.to_json()
            if self.limits is not None:
                out["existing_unit"].update(self.limits.to_json())

        out["warnings"] = list(self.loads.warnings) + list(self.warnings)
        return out


@dataclass(frozen=True)
class SystemMember:
    """One room on a system: its own evaporator.

    Attributes
    ----------
    room : str
        Room name.
    evaporating_temperature : float
        The coil's saturated evaporating (dew) temperature [°C].
    duty : float
        The coil's (evaporator's) duty: the room's design capacity [W]; the
        system's diversity applies to the compressor, not to the coils.
    superheat : float
        Superheat at the coil outlet [K].
    mass_flow : float
        Refrigerant through the coil at the system's design point (duty ×
        diversity) [kg/s].
    regulated : bool
        Behind an evaporator pressure regulator (warmer than the system's coldest coil).
    """

    room: str
    evaporating_temperature: float
    duty: float
    superheat: float
    mass_flow: float
    regulated: bool

    def to_json(self) -> dict[str, Any]:
        return {
            "room": self.room,
            "evaporating_temperature_c": self.evaporating_temperature,
            "duty_w": self.duty,
            "superheat_k": self.superheat,
            "mass_flow_kg_s": self.mass_flow,
            "evaporator_pressure_regulator": self.regulated,
        }


@dataclass(frozen=True)
class SystemElectrical:
    """What the electrician must supply for one system, SI.

    Attributes
    ----------
    compressor_input_power : float
        Compressor electrical input at the design point [W] (overall
        isentropic efficiency, motor included; :mod:`coldroom.physics.cycle`).
    evaporator_fan_power, condenser_fan_power : float
        Electrical input of the fans [W].
    condenser_fan_basis : str
        ``given`` or how the condenser fans were estimated.
    defrost_heater_power : float
        Electric defrost heaters of all members [W].
    other_heater_power : float
        Door-frame, drain-line and other heaters of the members [W].
    refrigerating_load, defrost_load : float
        Simultaneous draw while refrigerating and the largest while a coil
        defrosts [W] (:func:`coldroom.design.systems.defrost_draw`).
    compressor_run_time : float
        Compressor running time per day at the design point [s].
    daily_energy_parts : tuple of (str, float)
        Electricity per day by consumer [J].
    """

    compressor_input_power: float
    evaporator_fan_power: float
    condenser_fan_power: float
    condenser_fan_basis: str
    defrost_heater_power: float
    other_heater_power: float
    refrigerating_load: float
    defrost_load: float
    compressor_run_time: float
    daily_energy_parts: tuple[tuple[str, float], ...]
    defrost_case: str = "defrost"

    @property
    def connected_load(self) -> float:
        """The largest simultaneous draw [W]: refrigerating or defrosting."""
        return max(self.refrigerating_load, self.defrost_load)

    @property
    def connected_load_case(self) -> str:
        """Which case sets the connected load: ``"refrigerating"``, ``"defrost"`` (one room, compressor
        stopped) or ``"defrost of ROOM"`` (several rooms, the compressor running for the others)."""
        return self.defrost_case if self.defrost_load > self.refrigerating_load else "refrigerating"

    @property
    def daily_energy(self) -> float:
        """Electricity used per day [J]."""
        return sum(energy for _what, energy in self.daily_energy_parts)


@dataclass(frozen=True)
class SystemResult:
    """One compressor (condensing unit) and the rooms it serves, SI.

    Attributes
    ----------
    name : str
        System name (a room's name for a room in no ``systems`` entry).
    members : tuple of SystemMember
        The rooms, in the order the system lists them.
    refrigerant : str
        Catalogue name.
    suction_temperature : float
        Saturated (dew) temperature at the compressor suction [°C]: the
        coldest member's evaporating temperature less the suction-line drop.
    condensing_temperature : float or None
        Condensing dew temperature [°C]; ``None`` when transcritical.
    condenser_air_temperature : float
        Air entering the condenser [°C].
    suction_line_drop : float
        Suction-line loss as saturation temperature [K].
    diversity : float
        Share of the members' summed design capacity the system is sized for [-].
    design_capacity : float
        Σ member design capacities × diversity [W].
    cycle : CycleResult
        The cycle at the system's suction and condensing temperatures.
    electrical : SystemElectrical
    warnings : tuple of str
    pipework : coldroom.design.pipework.Pipework or None
        Lines, charge estimate and charge limits (``piping``, ``charge``,
        ``charge_limits`` in JSON).
    equipment_basis : str
        Which equipment the electrical figures come from: ``"design"`` (size),
        ``"selected"`` (select) or ``"existing"`` (check) (:mod:`coldroom.design.job`).
    """

    name: str
    members: tuple[SystemMember, ...]
    refrigerant: str
    suction_temperature: float
    condensing_temperature: Optional[float]
    condenser_air_temperature: float
    suction_line_drop: float
    diversity: float
    design_capacity: float
    cycle: Any
    electrical: SystemElectrical
    warnings: tuple[str, ...] = ()
    pipework: Any = None
    equipment_basis: str = "design"
    condenser_air_basis: str = "follows outdoor air"

    @property
    def rooms(self) -> tuple[str, ...]:
        return tuple(member.room for member in self.members)

    @property
    def heat_of_rejection(self) -> float:
        """Condenser duty [W]."""
        return self.cycle.condenser_duty

    def to_json(self) -> dict[str, Any]:
        """JSON object; the keys the systems contract names, plus the working behind them."""
        e = self.electrical
        return {
            "name": self.name,
            "rooms": list(self.rooms),
            "equipment_basis": self.equipment_basis,
            "refrigerant": self.refrigerant,
            "suction_temperature_c": self.suction_temperature,
            "condensing_temperature_c": self.condensing_temperature,
            "condenser_air_temperature_c": self.condenser_air_temperature,
            "condenser_air_basis": self.condenser_air_basis,
            "suction_line_drop_k": self.suction_line_drop,
            "diversity": self.diversity,
            "design_capacity_w": self.design_capacity,
            "heat_of_rejection_w": self.heat_of_rejection,
            "cycle": self.cycle.to_json(),
            "members": [member.to_json() for member in self.members],
            "compressor_input_power_w": e.compressor_input_power,
            "compressor_input_power_basis": (
                "overall isentropic efficiency on the electrical input (motor included)"
                if self.equipment_basis == "design"
                else f"the {'chosen' if self.equipment_basis == 'selected' else 'existing'} unit's electrical input "
                "at its balance point"
            ),
            "evaporator_fan_power_w": e.evaporator_fan_power,
            "condenser_fan_power_w": e.condenser_fan_power,
            "condenser_fan_power_basis": e.condenser_fan_basis,
            "defrost_heater_power_w": e.defrost_heater_power,
            "other_heater_power_w": e.other_heater_power,
            "refrigerating_load_w": e.refrigerating_load,
            "defrost_load_w": e.defrost_load,
            "connected_load_w": e.connected_load,
            "connected_load_case": e.connected_load_case,
            "compressor_daily_run_time_h": e.compressor_run_time / 3600.0,
            "daily_electricity_kwh": e.daily_energy / 3.6e6,
            "daily_electricity_by_use_kwh": {what.replace(" ", "_"): energy / 3.6e6 for what, energy in e.daily_energy_parts},
            "warnings": list(self.warnings),
            **(self.pipework.to_json() if self.pipework is not None else {"piping": None}),
        }


@dataclass(frozen=True)
class ProjectResult:
    """The result of one project file."""

    project_name: str
    client: str
    site: str
    prepared_by: str
    date: str
    unit_system: str
    input_file: str
    input_sha256: str
    rooms: tuple[RoomResult, ...]
    warnings: tuple[str, ...] = ()
    versions: dict[str, str] = field(default_factory=dict)
    systems: tuple[SystemResult, ...] = ()

    def to_json(self) -> dict[str, Any]:
        """The body of ``size --json``; the envelope (project, versions) is :mod:`coldroom.output.json_contract`'s."""
        return {
            "systems": [system.to_json() for system in self.systems],
            "rooms": [room.to_json() for room in self.rooms],
            "warnings": list(self.warnings),
        }
