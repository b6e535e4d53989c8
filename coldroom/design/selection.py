"""Equipment selection from the contractor's catalogue (``coldroom select``).

For each system of the project (:meth:`coldroom.inputs.projectfile.ProjectModel.system_groups`):

1. **Unit coolers, per room** (:func:`choose_coolers`). A model qualifies when

   * a room held below :data:`LOW_TEMPERATURE_ROOM` (air below freezing: the
     off-cycle air cannot melt the frost) has a coil with **electric or hot-gas
     defrost** and fins at least :data:`FROST_FIN_SPACING` apart, so frost does
     not bridge them between defrosts [trade];
   * its **air throw** reaches the room's length (the longer inside side); a
     shorter throw that still reaches half of it takes **two coils**, one at
     each end [trade];
   * the count n (at least the throw rule's) makes n × capacity at the room's
     evaporator TD ≥ the room's design capacity, with at most
     :data:`MAX_COILS` coils. The capacity at the room's TD is the rated
     capacity × TD / DT1 (capacity proportional to DT1 [mem] [ref:en-328]).

   The cheapest qualifying model × count is chosen (ties: the larger capacity).

2. **Condensing unit, per system** (:func:`choose_condensing_unit`): candidates
   of the system's refrigerant are sorted by price; the first whose balance
   point with the chosen coils at the design condenser air (the existing-unit
   check, :func:`coldroom.equipment.check_unit`, no second solver) lies inside
   its envelope and holds the design capacity within the run time is chosen;
   the next two that hold are the alternatives.

   A quick screen rejects a unit before any balance is solved when it cannot
   hold: holding needs Q_bal ≥ Q_req, so S_bal ≤ S* = t_room − Q_req/K_e and
   D_bal ≥ D* = t_amb + Q_req/K_c (THR ≥ Q); capacity rises with S and falls
   with D, so Q(S*, D*) < Q_req proves the unit too small, and S* below the
   envelope (D* above it) proves it outside its envelope (our derivation).

A system of several rooms is balanced as one coil: the coldest room's coils at
the compressor's suction (its evaporating temperature less the suction-line
drop) plus the warmer rooms' coils, held by their pressure regulators at their
design evaporating temperatures, delivering their capacity at their TD — a
linear evaporator K_c·(t_c − drop + W/K_c − S) that the existing balance code
solves unchanged. A one-room system is the same without warmer coils:
K·(t_room − drop − S), the coil evaporating the suction-line drop above the
compressor's SST. Either way the unit aims at the system's design capacity as
``size`` prints it (the larger of the 24-hour and the peak-hour figure, times
the diversity) and the drop is the one ``size`` uses (given, or from the sized
suction line): :func:`coldroom.design.sizing.design_system` builds the job once
for both.
"""

from __future__ import annotations

import math
from dataclasses import dataclass, field
from typing import TYPE_CHECKING, Any, Optional, Sequence

from coldroom.errors import CalculationError
from coldroom.rules import required_capacity, with_safety_factor

if TYPE_CHECKING:  # pragma: no cover
    from coldroom.inputs.catalogue import Catalogue, CondensingUnitEntry, UnitCoolerEntry
    from coldroom.equipment import CheckResult, HeatExchanger
    from coldroom.inputs.projectfile import ProjectModel, Room
    from coldroom.results import RoomLoads

#: Rooms held below this air temperature [°C] need electric or hot-gas defrost [trade].
LOW_TEMPERATURE_ROOM = 0.0
#: Fin spacing a coil in such a room needs at least [m] (6 mm; freezer coils 6–12 mm [trade]).
FROST_FIN_SPACING = 0.006
#: Most unit coolers per room the selection considers [-] [trade].
MAX_COILS = 4
#: How many alternatives are reported after the choice.
ALTERNATIVES = 2

REASONS_UNIT = {
    "wrong_refrigerant": "wrong refrigerant",
    "out_of_envelope": "outside its envelope or application class",
    "too_small": "too small",
    "no_balance": "no balance point",
    "dearer_than_alternatives": "dearer than the alternatives (not checked further)",
}
REASONS_COOLER = {
    "wrong_refrigerant": "rated for another refrigerant",
    "no_defrost": "no electric or hot-gas defrost for a room below 0 °C",
    "fins_too_close": "fins too close for frost",
    "throw_too_short": "air throw shorter than half the room",
    "too_small": f"more than {MAX_COILS} coils needed",
}


@dataclass(frozen=True)
class CoolerChoice:
    """The unit coolers chosen for one room (SI).

    Attributes
    ----------
    room, model : str
    count : int
    unit_price : float
        Price of one coil [currency].
    duty : float
        The room's design capacity [W].
    temperature_difference : float
        The room's evaporator TD [K].
    capacity : float
        count × capacity at that TD [W].
    conductance : float
        count × capacity / DT1 [W/K].
    rating_capacity, dt1 : float
        One coil's rated capacity [W] and rating DT1 [K].
    fan_power, defrost_heater_power : float
        Per coil [W].
    evaporating_temperature, room_temperature : float
        Design evaporating and room air temperatures [°C].
    rule : str
        Why this count (duty, throw).
    rejected : dict
        Reason → number of models rejected.
    defrost : str
        The coil's defrost (``off_cycle``, ``electric``, ``hot_gas``).
    """

    room: str
    model: str
    count: int
    unit_price: float
    duty: float
    temperature_difference: float
    capacity: float
    conductance: float
    rating_capacity: float
    dt1: float
    fan_power: float
    defrost_heater_power: float
    evaporating_temperature: float
    room_temperature: float
    rule: str
    rejected: dict = field(default_factory=dict)
    defrost: str = "off_cycle"

    @property
    def price(self) -> float:
        """count × unit price."""
        return self.count * self.unit_price

    def to_json(self) -> dict[str, Any]:
        return {
            "room": self.room,
            "model": self.model,
            "count": self.count,
            "price": self.price,
            "unit_price": self.unit_price,
            "duty_w": self.duty,
            "evaporator_td_k": self.temperature_difference,
            "capacity_at_td_w": self.capacity,
            "rule": self.rule,
            "rejected": dict(self.rejected),
        }


@dataclass(frozen=True)
class UnitOption:
    """A condensing unit that holds, with its balance (``check``) and price."""

    model: str
    price: float
    check: "CheckResult"
    entry: "CondensingUnitEntry"

    def balance_json(self) -> dict[str, Any]:
        c = self.check
        return {
            "evaporating_temperature_c": c.balance_evaporating,
            "condensing_temperature_c": c.balance_condensing,
            "capacity_w": c.capacity_at_balance,
            "daily_run_time_needed_h": c.run_hours_needed,
            "margin_percent": c.margin_percent,
            "max_ambient_temperature_c": c.max_ambient,
            "max_ambient_temperature_status": c.max_ambient_status,
            "power_w": c.power_at_balance,
        }


@dataclass(frozen=True)
class SystemSelection:
    """The equipment chosen for one system (SI; prices in the catalogue's currency)."""

    system: str
    refrigerant: str
    required_capacity: float
    run_hours_available: float
    ambient_temperature: float
    coolers: tuple[CoolerChoice, ...]
    choice: UnitOption
    alternatives: tuple[UnitOption, ...]
    rejected: dict
    currency: str
    candidates: int
    existing_unit: Optional[dict]
    warnings: tuple[str, ...] = ()

    @property
    def coolers_price(self) -> float:
        return sum(c.price for c in self.coolers)

    def total_price_with(self, option: UnitOption) -> float:
        return option.price + self.coolers_price

    @property
    def total_price(self) -> float:
        return self.total_price_with(self.choice)

    def _option_json(self, option: UnitOption) -> dict[str, Any]:
        return {
            "condensing_unit": {"model": option.model, "price": option.price, "balance": option.balance_json()},
            "unit_coolers": [c.to_json() for c in self.coolers],
            "total_price": self.total_price_with(option),
        }

    def to_json(self) -> dict[str, Any]:
        chosen = self._option_json(self.choice)
        chosen["condensing_unit"]["existing_unit"] = self.existing_unit
        return {
            "system": self.system,
            "rooms": [c.room for c in self.coolers],
            "refrigerant": self.refrigerant,
            "required_capacity_w": self.required_capacity,
            "daily_run_time_available_h": self.run_hours_available,
            "condenser_air_temperature_c": self.ambient_temperature,
            **chosen,
            "currency": self.currency,
            "alternatives": [self._option_json(o) for o in self.alternatives],
            "rejected": dict(self.rejected),
            "candidates": self.candidates,
            "warnings": list(self.warnings),
        }


class NothingFitsError(CalculationError):
    """No catalogue unit (or coil) fits a system; the message counts the reasons and states the duty.

    The message is a :class:`coldroom.results.Note` (SI wording with its terms); the CLI shows it
    in the project's unit system.
    """


def _count(counts: dict, reason: str) -> None:
    counts[reason] = counts.get(reason, 0) + 1


def room_length(room: "Room") -> Optional[float]:
    """The longer inside side of the room [m] (None without dimensions)."""
    box = room.box_dimensions("inside")
    return None if box is None else max(box[0], box[1])


def choose_coolers(
    coolers: Sequence["UnitCoolerEntry"],
    *,
    room_name: str,
    room_temperature: float,
    duty: float,
    temperature_difference: float,
    length: Optional[float],
    refrigerant: Optional[str] = None,
) -> CoolerChoice:
    """The cheapest unit-cooler model and count for one room (rules in the module notes).

    Parameters
    ----------
    duty : float
        Design capacity the coils must give [W].
    temperature_difference : float
        Room air − design evaporating temperature [K].
    length : float or None
        Longest inside side [m] (None: throw not checked).
    refrigerant : str, optional
        The system's refrigerant (catalogue name); a coil rated for another is set aside.

    Raises
    ------
    NothingFitsError
        No model qualifies (the message counts the reasons).
    """
    rejected: dict[str, int] = {}
    best: Optional[tuple[float, float, Any, int, str]] = None
    frost = room_temperature < LOW_TEMPERATURE_ROOM
    from coldroom.data import refrigerants

    for entry in coolers:
        if refrigerant is not None and entry.refrigerant is not None and (
            refrigerants.lookup(entry.refrigerant).name != refrigerant
        ):
            _count(rejected, "wrong_refrigerant")
            continue
        if frost and entry.defrost not in ("electric", "hot_gas"):
            _count(rejected, "no_defrost")
            continue
        if frost and entry.fin_spacing < FROST_FIN_SPACING - 1e-9:
            _count(rejected, "fins_too_close")
            continue
        minimum, why = 1, "capacity"
        if length is not None and entry.throw < length:
            if 2.0 * entry.throw < length:
                _count(rejected, "throw_too_short")
                continue
            minimum, why = 2, "throw"
        each = entry.conductance * temperature_difference
        count = max(minimum, math.ceil(duty / each - 1e-9))
        if count > minimum:
            why = "capacity"
        if count > MAX_COILS:
            _count(rejected, "too_small")
            continue
        key = (count * entry.price, -count * each)
        if best is None or key < best[:2]:
            best = (key[0], key[1], entry, count, why)
    if best is None:
        from coldroom.results import Note

        raise NothingFitsError(Note.fill(
            f"room {room_name!r}: no unit cooler in the catalogue fits ({_reasons(rejected, REASONS_COOLER)}); "
            "a suitable coil gives at least {q} at a TD of {td}"
            + (" and throws at least {l}" if length is not None else "")
            + (" with electric or hot-gas defrost and fins ≥ 6 mm" if frost else ""),
            q=(duty, "power"), td=(temperature_difference, "temperature_difference"), l=(length or 0.0, "length"),
        ))
    _price, _cap, entry, count, why = best
    if count == 1:
        rule = "one coil: its capacity at the room's TD covers the duty and its throw reaches the room's length"
    elif why == "throw":
        rule = "two coils, one at each end: one coil's throw does not reach the room's length"
    else:
        rule = f"{count} coils: one coil's capacity at the room's TD is below the duty"
    return CoolerChoice(
        room=room_name,
        model=entry.model,
        count=count,
        unit_price=entry.price,
        duty=duty,
        temperature_difference=temperature_difference,
        capacity=count * entry.conductance * temperature_difference,
        conductance=count * entry.conductance,
        rating_capacity=entry.capacity,
        dt1=entry.dt1,
        fan_power=entry.fan_power,
        defrost_heater_power=entry.defrost_heater_power,
        evaporating_temperature=room_temperature - temperature_difference,
        room_temperature=room_temperature,
        rule=rule,
        rejected=rejected,
        defrost=entry.defrost,
    )


def _reasons(counts: dict, names: dict) -> str:
    if not counts:
        return "the catalogue has none"
    return ", ".join(f"{n} {names.get(reason, reason)}" for reason, n in sorted(counts.items(), key=lambda x: -x[1]))


@dataclass(frozen=True)
class Duty:
    """What a condensing unit must do for one system (SI; °C).

    Attributes
    ----------
    refrigerant : str
    evaporator : HeatExchanger
        The chosen coils as one linear coil.
    room_temperature : float
        Effective air on that coil [°C] (the room's, for one room).
    ambient_temperature : float
        Condenser air [°C].
    condenser_td : float
        Sizing condenser TD [K] (units without condenser data).
    daily_energy, safety_factor, run_time, peak_capacity : float
        As :func:`coldroom.equipment.check_unit` takes them [J, -, s, W].
    design_suction, design_condensing : float
        The system's design dew points [°C] (for the "what a unit must do" line).
    """

    refrigerant: str
    evaporator: "HeatExchanger"
    room_temperature: float
    ambient_temperature: float
    condenser_td: float
    daily_energy: float
    safety_factor: float
    run_time: float
    peak_capacity: float
    design_suction: float
    design_condensing: float
    load_at_ambient: Any = None

    @property
    def required(self) -> float:
        """(1 + SF)·E / run time [W] (:func:`coldroom.rules.required_capacity`)."""
        return required_capacity(self.daily_energy, self.run_time, self.safety_factor)


def _condenser(entry: "CondensingUnitEntry", duty: Duty) -> "HeatExchanger":
    from coldroom.equipment import HeatExchanger

    if entry.condenser is not None:
        return HeatExchanger.from_rating(
            entry.condenser.heat_rejection, entry.condenser.temperature_difference, "air-cooled condenser"
        )
    return HeatExchanger.fixed(duty.condenser_td, ("no condenser data: condensing temperature fixed at air + TD",))


def _screen(compressor: Any, condenser: "HeatExchanger", duty: Duty) -> Optional[str]:
    """A reason the unit cannot hold, proved without solving the balance (module notes), or None."""
    from coldroom.equipment import ENVELOPE_TOLERANCE, RATING_SUCTION_GAP

    q = duty.required
    s_star = duty.room_temperature - q / duty.evaporator.conductance
    d_star = (
        duty.ambient_temperature + condenser.temperature_difference
        if condenser.is_fixed
        else duty.ambient_temperature + q / condenser.conductance
    )
    envelope = getattr(compressor, "envelope", None)
    if envelope is not None and (
        s_star < envelope.suction_min - ENVELOPE_TOLERANCE or d_star > envelope.discharge_max + ENVELOPE_TOLERANCE
    ):
        return "out_of_envelope"
    if envelope is None and s_star < compressor.rating_suction - RATING_SUCTION_GAP:
        return "out_of_envelope"
    try:
        point = compressor.performance(s_star, d_star, check_envelope=False, discharge=False)
    except CalculationError:
        return None  # let the balance decide
    return "too_small" if point.capacity < q else None


def _rate(compressor: Any, condenser: "HeatExchanger", duty: Duty, name: str, max_ambient: bool) -> "CheckResult":
    from coldroom.equipment import check_unit

    return check_unit(
        compressor,
        duty.evaporator,
        condenser,
        room_temperature=duty.room_temperature,
        ambient_temperature=duty.ambient_temperature,
        daily_energy=duty.daily_energy,
        safety_factor=duty.safety_factor,
        run_time=duty.run_time,
        peak_capacity=duty.peak_capacity,
        load_at_ambient=duty.load_at_ambient if max_ambient else None,
        chart_ambients=(),
        search_max_ambient=max_ambient,
        name=name,
        design_suction=duty.design_suction,
    )


def _verdict(check: "CheckResult", compressor: Any) -> Optional[str]:
    from coldroom.equipment import RATING_SUCTION_GAP

    if check.capacity_at_balance is None:
        return "no_balance" if check.within_envelope else "out_of_envelope"
    if getattr(compressor, "envelope", None) is None and check.balance_evaporating is not None and (
        check.balance_evaporating < compressor.rating_suction - RATING_SUCTION_GAP
    ):
        return "out_of_envelope"
    return None if check.holds else "too_small"


def choose_condensing_unit(
    units: Sequence["CondensingUnitEntry"],
    duty: Duty,
    refrigeration: Any,
    *,
    max_ambient: bool = True,
) -> tuple[list[UnitOption], dict[str, int]]:
    """The cheapest units that hold the duty (choice first, then up to :data:`ALTERNATIVES`).

    Returns
    -------
    (options, rejected)
        Options in price order (empty when nothing fits) and reason → count.
    """
    from coldroom.data import refrigerants
    from coldroom.design.existing import build_compressor

    rejected: dict[str, int] = {}
    survivors = []
    for entry in units:
        if refrigerants.lookup(entry.refrigerant).name != duty.refrigerant:
            _count(rejected, "wrong_refrigerant")
            continue
        try:
            compressor = build_compressor(entry.existing_unit(), refrigeration)
        except CalculationError:
            _count(rejected, "no_balance")
            continue
        condenser = _condenser(entry, duty)
        reason = _screen(compressor, condenser, duty)
        if reason is not None:
            _count(rejected, reason)
            continue
        survivors.append((entry.price, entry.model, entry, compressor, condenser))
    survivors.sort(key=lambda x: (x[0], x[1]))
    options: list[UnitOption] = []
    for k, (price, model, entry, compressor, condenser) in enumerate(survivors):
        if len(options) > ALTERNATIVES:
            rejected["dearer_than_alternatives"] = len(survivors) - k
            break
        check = _rate(compressor, condenser, duty, model, False)
        reason = _verdict(check, compressor)
        if reason is not None:
            _count(rejected, reason)
            continue
        if max_ambient:
            check = _rate(compressor, condenser, duty, model, True)
        options.append(UnitOption(model=model, price=price, check=check, entry=entry))
    return options, rejected


def _quantity(value: float, unit: str) -> str:
    return f"{value:.6g} {unit}"


def existing_unit_block(entry: "CondensingUnitEntry", coolers: CoolerChoice) -> dict[str, Any]:
    """The ``existing_unit`` block of *entry* with the chosen coils, values written with their units.

    Written with units so that it reads the same in an SI or an IP project.
    """
    block: dict[str, Any] = {"name": entry.model, "refrigerant": entry.refrigerant}
    if entry.rated_point is not None:
        r = entry.rated_point
        rated: dict[str, Any] = {
            "capacity": _quantity(r.capacity, "W"),
            "evaporating_temperature": _quantity(r.evaporating_temperature, "°C"),
            "condensing_temperature": _quantity(r.condensing_temperature, "°C"),
            "superheat": _quantity(r.rating_superheat, "K"),
            "subcooling": _quantity(r.subcooling, "K"),
        }
        if r.power is not None:
            rated["power"] = _quantity(r.power, "W")
        if r.swept_volume is not None:
            rated["swept_volume"] = _quantity(r.swept_volume * 3600.0, "m³/h")
        block["rated_point"] = rated
    elif entry.rating_table is not None:
        t = entry.rating_table
        table: dict[str, Any] = {}
        if t.return_gas_temperature is not None:
            table["return_gas_temperature"] = _quantity(t.return_gas_temperature, "°C")
        else:
            table["superheat"] = _quantity(t.superheat or 0.0, "K")
        table["subcooling"] = _quantity(t.subcooling, "K")
        table["evaporating_temperatures"] = [_quantity(x, "°C") for x in t.evaporating_temperatures]
        table["ambient_temperatures"] = [_quantity(x, "°C") for x in t.ambient_temperatures]
        table["capacity"] = [[_quantity(x, "W") for x in row] for row in t.capacity]
        table["power"] = [[_quantity(x, "W") for x in row] for row in t.power]
        block["rating_table"] = table
    else:
        p = entry.polynomial
        assert p is not None
        poly: dict[str, Any] = {"units": p.units, "capacity": list(p.capacity), "power": list(p.power)}
        if p.mass_flow is not None:
            poly["mass_flow"] = list(p.mass_flow)
        if p.return_gas_temperature is not None:
            poly["return_gas_temperature"] = _quantity(p.return_gas_temperature, "°C")
        else:
            poly["superheat"] = _quantity(p.superheat or 0.0, "K")
        poly["subcooling"] = _quantity(p.subcooling, "K")
        for key in ("suction_min", "suction_max", "discharge_min", "discharge_max"):
            poly[key] = _quantity(getattr(p, key), "°C")
        poly["density_correction_factor"] = p.density_correction_factor
        block["polynomial"] = poly
    block["unit_cooler"] = {
        "capacity": _quantity(coolers.count * coolers.rating_capacity, "W"),
        "dt1": _quantity(coolers.dt1, "K"),
    }
    if entry.condenser is not None:
        block["condenser"] = {
            "heat_rejection": _quantity(entry.condenser.heat_rejection, "W"),
            "temperature_difference": _quantity(entry.condenser.temperature_difference, "K"),
        }
    return block


def select_system(
    model: "ProjectModel",
    catalogue: "Catalogue",
    name: str,
    indices: tuple[int, ...],
    diversity: float = 1.0,
    loads: Optional[Sequence["RoomLoads"]] = None,
    *,
    max_ambient: bool = True,
) -> SystemSelection:
    """Coils per room and the condensing unit for one system.

    Raises
    ------
    NothingFitsError
        No coil fits a room, or no condensing unit holds (reasons counted, duty stated).
    """
    from coldroom.design.existing import drop_words, room_load_at
    from coldroom.design.sizing import design_system
    from coldroom.equipment import HeatExchanger

    job = design_system(model, name, indices, diversity)
    rooms, temps, settings, refrigerant = job.rooms, job.temps, job.settings[0], job.info.name
    if loads is None:
        loads = job.loads
    coolers = tuple(
        choose_coolers(
            catalogue.unit_coolers,
            room_name=room.name,
            room_temperature=room.temperature,
            duty=x.design_capacity,
            temperature_difference=t.evaporator_td,
            length=room_length(room),
            refrigerant=refrigerant,
        )
        for room, x, t in zip(rooms, loads, temps)
    )
    ambient, suction, drop = job.air, job.suction, job.suction_drop
    energy = sum(with_safety_factor(x.daily_energy, x.safety_factor) for x in loads)
    if len(rooms) == 1:
        room, x, c = rooms[0], loads[0], coolers[0]
        evaporator = HeatExchanger.from_rating(
            c.count * c.rating_capacity, c.dt1, "unit cooler (EN 328 DT1)" + drop_words(drop)
        )
        load_at = room_load_at(model, room, x, ambient, "design_capacity")
        # aimed at the design capacity: (1 + SF)·E over the hours in which the design capacity removes it
        duty = Duty(
            refrigerant, evaporator, room.temperature - drop, ambient, temps[0].condenser_td, energy, 0.0,
            energy / job.capacity, x.peak_capacity, suction, temps[0].condensing_temperature, load_at,
        )
    else:
        coldest = min(range(len(rooms)), key=lambda i: temps[i].evaporating_temperature)
        c = coolers[coldest]
        warm = sum(k.capacity for i, k in enumerate(coolers) if i != coldest)
        t_eff = rooms[coldest].temperature - drop + warm / c.conductance
        evaporator = HeatExchanger(
            conductance=c.conductance,
            basis=(f"coils of {rooms[coldest].name} at the suction plus the warmer rooms' coils behind their "
                   "pressure regulators",),
        )
        duty = Duty(
            refrigerant, evaporator, t_eff, ambient, temps[0].condenser_td, energy, 0.0, energy / job.capacity,
            sum(x.peak_capacity for x in loads), suction, temps[0].condensing_temperature,
        )
    options, rejected = choose_condensing_unit(catalogue.condensing_units, duty, settings, max_ambient=max_ambient)
    if not options:
        from coldroom.results import Note

        raise NothingFitsError(Note.fill(
            f"system {name!r}: no condensing unit in the catalogue holds ({_reasons(rejected, REASONS_UNIT)}); "
            f"a suitable {refrigerant} unit gives at least {{q}} at SST {{s}} / SCT {{d}} ({{a}} condenser air)",
            q=(duty.required, "power"), s=(duty.design_suction, "temperature"),
            d=(duty.design_condensing, "temperature"), a=(ambient, "temperature"),
        ))
    choice = options[0]
    warnings: list[str] = list(choice.check.warnings)
    block = existing_unit_block(choice.entry, coolers[0]) if len(rooms) == 1 else None
    if len(rooms) > 1:
        warnings.append(
            "a system of several rooms has no single existing_unit block: `coldroom check` rates one room's unit"
        )
    return SystemSelection(
        system=name,
        refrigerant=refrigerant,
        required_capacity=duty.required,
        run_hours_available=duty.run_time / 3600.0,
        ambient_temperature=ambient,
        coolers=coolers,
        choice=choice,
        alternatives=tuple(options[1:]),
        rejected=rejected,
        currency=catalogue.currency,
        candidates=len(catalogue.condensing_units),
        existing_unit=block,
        warnings=tuple(warnings),
    )


def select_project(model: "ProjectModel", catalogue: "Catalogue", *, max_ambient: bool = True) -> tuple[SystemSelection, ...]:
    """:func:`select_system` for every system of the project, in order.

    Raises
    ------
    NothingFitsError
        For the first system nothing fits (exit code 1).
    """
    return tuple(
        select_system(model, catalogue, name, indices, entry.diversity if entry is not None else 1.0,
                      max_ambient=max_ambient)
        for name, entry, indices in model.system_groups()
    )
