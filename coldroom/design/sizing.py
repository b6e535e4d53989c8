"""From a validated project to equipment duties: design temperatures and one cycle per room.

For every room:

1. the 24-hour load (:func:`coldroom.loads.room_loads`) gives the design
   capacity (the larger of the 24-hour required capacity and the peak-hour
   capacity, :attr:`coldroom.results.RoomLoads.design_capacity`);
2. the saturated evaporating (dew) temperature is the room temperature minus
   an evaporator TD chosen from the room's relative humidity
   (:data:`coldroom.rules.EVAPORATOR_TD_BY_RH`, common practice [trade]) unless the project
   gives ``refrigeration.evaporator_td``;
3. the saturated condensing (dew) temperature is the condenser air temperature
   (``refrigeration.condenser_air_temperature``, else the outdoor design dry
   bulb) plus a condenser TD (:data:`coldroom.rules.DEFAULT_CONDENSER_TD`, [trade] 8–15 K for
   air-cooled condensers) unless the project gives
   ``refrigeration.condenser_td``;
4. one compressor per system (:func:`size_system`; a room in no ``systems``
   entry is a system of its own): :func:`coldroom.physics.system_cycle.solve_system_cycle`
   at the coldest member's evaporating temperature less the suction-line drop,
   the system's condensing temperature and the system design capacity (Σ
   member design capacities × diversity, :mod:`coldroom.design.systems`), the warmer
   members' vapour mixed into the suction behind EPRs; superheat from each
   room's ``refrigeration`` block, subcooling, isentropic efficiency and
   clearance from the system's (defaults: :data:`coldroom.rules.CYCLE_DEFAULTS`,
   the same table ``coldroom cycle`` uses);
5. the system's electrical figures (:func:`coldroom.design.systems.electrical_figures`).

This module is the orchestrator: it imports the parts (loads, design rules,
systems, cycle, pipework, existing-unit check, pull-down); nothing below it
imports it.

Temperatures are in °C here (the trade states TDs against °C room
temperatures); capacities in W.

``RoomResult.sizing_basis`` holds ``(what, phrase)`` pairs for the sheet: the
phrase keeps its numbers in SI (:class:`coldroom.results.Term`) and the sheet
shows it in the project's units. *what* is ``"Group: label"``; the sheet
groups rows by the text before the first ``": "``.
"""

from __future__ import annotations

import datetime as _dt
import hashlib
import os
from dataclasses import dataclass
from typing import TYPE_CHECKING, Any, Optional

from coldroom.constants import SECONDS_PER_DAY_S
from coldroom.rules import DesignTemperatures, condenser_air_basis, room_design_temperatures
from coldroom.errors import CalculationError

if TYPE_CHECKING:  # pragma: no cover
    from coldroom.inputs.projectfile import ProjectModel, Room
    from coldroom.results import ProjectResult, RoomLoads, RoomResult, SystemResult
    from coldroom.design.systems import MemberDraw

# the transcritical boundary is coldroom.physics.cycle.r744_transcritical; the gas-cooler
# approach (outlet minus entering air) is the project's ``gas_cooler_approach`` (default 3 K,
# common practice 2–5 K, from memory; verify).


def sheet_date(project_date: Optional[str], environ: Optional[dict] = None) -> str:
    """The date printed on the sheet: the project's, else SOURCE_DATE_EPOCH (UTC), else today.

    Examples
    --------
    >>> sheet_date("2026-11-16")
    '2026-11-16'
    >>> sheet_date(None, {"SOURCE_DATE_EPOCH": "0"})
    '1970-01-01'
    """
    if project_date:
        return project_date
    env = os.environ if environ is None else environ
    epoch = env.get("SOURCE_DATE_EPOCH")
    if epoch:
        try:
            return _dt.datetime.fromtimestamp(int(epoch), tz=_dt.timezone.utc).date().isoformat()
        except (ValueError, OverflowError, OSError):
            pass
    return _dt.date.today().isoformat()


def versions() -> dict[str, str]:
    """Versions of coldroom, CoolProp and Python (metadata, no import): every page's footer and every JSON."""
    import platform
    from importlib import metadata

    from coldroom import __version__

    try:
        coolprop = metadata.version("CoolProp")
    except metadata.PackageNotFoundError:  # pragma: no cover
        coolprop = "unknown"
    return {"coldroom": __version__, "coolprop": coolprop, "python": platform.python_version()}


def _basis(model: "ProjectModel", room: "Room", loads: "RoomLoads", temps: DesignTemperatures) -> tuple:
    """The (what, phrase) pairs printed under "Basis of design"; each phrase keeps its numbers in SI.

    A phrase is a tuple of text and :class:`coldroom.results.Term` (see
    :data:`coldroom.results.Phrase`); the sheet shows it in the project's
    units with :func:`coldroom.units.format_terms`, the JSON in SI.
    """
    from coldroom.data import refrigerants
    from coldroom.loads import construction_u, outdoor_relative_humidity, site_pressure
    from coldroom.results import inline_term as n

    d = model.design
    rows: list[tuple[str, tuple]] = []

    def add(what: str, *phrase: object) -> None:
        rows.append((what, tuple(phrase)))

    rh_out = outdoor_relative_humidity(d)
    add("Site: outdoor design dry bulb", n(d.outdoor_temperature, "temperature"))
    if d.outdoor_wet_bulb is not None:
        add("Site: outdoor wet bulb", n(d.outdoor_wet_bulb, "temperature"), f" (RH {rh_out:.0%})")
    else:
        add("Site: outdoor relative humidity", f"{rh_out:.0%}")
    add("Site: ground temperature", n(d.ground_temperature, "temperature"))
    add("Site: barometric pressure", n(site_pressure(d), "pressure"))
    add("Room: temperature and RH", n(room.temperature, "temperature"), f", {room.rh:.0%} RH")
    for where in ("inside", "outside"):
        box = room.box_dimensions(where)
        if box is None:
            break
        given = " (as given)" if room.dimensions is not None and room.dimensions.measured == where else ""
        length, width, height = box
        add(
            f"Room: {where} dimensions (L × W × H){given}",
            n(length, "length:bare"), " × ", n(width, "length:bare"), " × ", n(height, "length"),
        )
    add("Room: inside volume and floor area", n(loads.volume, "volume"), ", ", n(loads.floor_area, "area"))
    add("Room: transmission areas", {
        "outside": "outside surface of each section (outside dimensions: "
                   + ("as given)" if room.dimensions is not None and room.dimensions.measured == "outside"
                      else "inside + construction thickness)"),
        "given": "areas as given in the project file",
    }.get(loads.transmission_area_basis, "outside surface of each section; given areas where stated"))
    # constructions: one row per construction used, with the sides it covers
    used: dict[str, list[str]] = {}
    u_of: dict[str, float] = {}
    desc: dict[str, str] = {}
    for side in ("north", "east", "south", "west", "ceiling", "floor"):
        surface = room.envelope.side(side)
        name = surface.construction if isinstance(surface.construction, str) else f"{side} (inline)"
        construction = model.construction(surface.construction)
        key = f"{name} @ {surface.facing}"
        used.setdefault(key, []).append(side)
        u_of[key] = construction_u(construction, surface.facing)
        desc[key] = construction.description or name
    for key, sides in used.items():
        add(f"Construction: {desc[key]}", "U ", n(u_of[key], "u_value"), f" ({', '.join(sides)})")
    neighbours = []
    for side in ("north", "east", "south", "west", "ceiling", "floor"):
        surface = room.envelope.side(side)
        if surface.facing in ("space", "roof_void", "room"):
            beyond = model.room_named(surface.room).temperature if surface.facing == "room" else surface.temperature
            if beyond is not None and beyond < room.temperature:
                neighbours.append(f"{side} {'credited (credit: true)' if surface.credit else 'not credited'}")
    if any(room.envelope.side(x).facing in ("space", "roof_void", "room") for x in ("north", "east", "south", "west",
                                                                                 "ceiling", "floor")):
        add(
            "Construction: heat lost to a colder neighbour",
            "not credited unless the surface says credit: true (the neighbour may be off, defrosting or "
            "emptied); the colder room always counts what it gains"
            + (f" — here: {', '.join(neighbours)}" if neighbours else ""),
        )
    for door in room.doors:
        add(
            f"Door: {door.name}",
            n(door.width, "length"), " × ", n(door.height, "length"),
            f", {door.passages_per_day:g} passages/day, open {door.open_time / 60:g} min/day, "
            f"{door.protection.replace('_', ' ')}"
            + (f"; into room {door.to_room} (its design temperature and RH)" if door.to_room else ""),
        )
    if room.infiltration.method == "air_changes":
        add("Door: infiltration method", f"air changes ({room.infiltration.usage.replace('_', ' ')} use)")
    for product in room.products:
        label = product.product.replace("_", " ") if product.product else "product (given properties)"
        phrase: tuple = ()
        if product.daily_intake > 0:
            assert product.entering_temperature is not None and product.final_temperature is not None
            phrase = (
                n(product.daily_intake, "mass"), "/day, ", n(product.entering_temperature, "temperature"), " to ",
                n(product.final_temperature, "temperature"), f" in {product.pulldown_time / 3600:g} h",
            )
        else:
            phrase = ("stored only",)
        if product.stored_mass > 0:
            phrase += ("; ", n(product.stored_mass, "mass"), " stored")
        add(f"Product: {label}", *phrase)
    add("Operation: compressor run time", f"{loads.run_time / 3600:g} h/day ({loads.run_time_basis})")
    add("Operation: safety factor", f"{loads.safety_factor:.0%}")
    add("Operation: defrost", room.defrost.type.replace("_", "-"))
    add("Operation: design capacity set by", loads.governed_by)
    r = model.refrigeration_for(room)
    info = refrigerants.lookup(r.refrigerant)
    add("Refrigeration: refrigerant", f"{info.name} (safety class {info.safety_class}, GWP {info.gwp_ar4:g} AR4)")
    add("Refrigeration: evaporator TD", n(temps.evaporator_td, "temperature_difference"), f" ({temps.evaporator_td_source})")
    add("Refrigeration: condenser air", n(temps.condenser_air_temperature, "temperature"), f" ({temps.condenser_air_source})")
    add("Refrigeration: condenser TD", n(temps.condenser_td, "temperature_difference"), f" ({temps.condenser_td_source})")
    add(
        "Refrigeration: superheat / suction line / subcooling",
        n(r.superheat, "temperature_difference"), " / ", n(r.suction_line_superheat, "temperature_difference"),
        " / ", n(r.subcooling, "temperature_difference"),
    )
    add("Refrigeration: compressor", f"isentropic efficiency {r.isentropic_efficiency:.2f}, clearance {r.clearance:.2f}")
    return tuple(rows)


def member_draw(room: "Room", loads: "RoomLoads") -> "MemberDraw":
    """The electrical consumers of one room: evaporator fans, heaters, electric defrost."""
    from coldroom.design.systems import MemberDraw

    fans = room.fans
    fan_power = fans.power * fans.count if fans is not None and fans.hours > 0 else 0.0
    heaters = [a for a in room.appliances if a.kind == "heater" and a.hours > 0]
    d = room.defrost
    electric = d.type == "electric" and d.per_day > 0
    return MemberDraw(
        daily_heat_gain=loads.daily_energy,
        evaporator_fan_power=fan_power,
        evaporator_fan_time=fans.hours if fans is not None else 0.0,
        heater_power=sum(a.power * a.count for a in heaters),
        heater_energy=sum(a.power * a.count * a.hours for a in heaters),
        defrost_heater_power=d.heater_power if electric else 0.0,
        defrost_time=d.per_day * d.duration if electric else 0.0,
        room=room.name,
    )


#: Room air temperatures above and below the set point at which the design unit's capacity is
#: computed for the pull-down; between them it is interpolated linearly [K].
PULLDOWN_CAPACITY_OFFSETS = (-2.0, 0.0, 2.0, 5.0, 10.0, 20.0)


def design_unit_capacity(
    displacement_at: Any, design_capacity: float, room: "Room", temps: DesignTemperatures
) -> Any:
    """Capacity [W] of the room's design unit as a function of the room air [°C], for the pull-down.

    The compressor keeps the displacement it needs for *design_capacity* at the design
    evaporating temperature; the evaporating temperature follows the room air at the design
    evaporator TD; the condensing temperature stays at design. Capacity at another
    evaporating temperature = design capacity × design displacement ÷ the displacement the
    cycle needs there for the design capacity (the cycle's own volumetric efficiency and
    refrigerating effect, :func:`coldroom.physics.cycle.solve_cycle`). A room on a system of several
    rooms is taken with its share of the compressor. *displacement_at(evaporating, capacity)*
    gives that displacement [m³/s] (:func:`coldroom.physics.cycle.compressor_displacement`).
    """
    from coldroom.loads.pulldown import capacity_curve

    reference = displacement_at(temps.evaporating_temperature, design_capacity)
    air, capacity = [], []
    for offset in PULLDOWN_CAPACITY_OFFSETS:
        t = room.temperature + offset
        evaporating = t - temps.evaporator_td
        if evaporating == temps.evaporating_temperature:  # the design point itself: solved above
            displacement = reference
        else:
            try:
                displacement = displacement_at(evaporating, design_capacity)
            except CalculationError:
                continue
        air.append(t)
        capacity.append(design_capacity * reference / displacement)
    if not air:  # pragma: no cover - the design point itself solved
        air, capacity = [room.temperature], [design_capacity]
    return capacity_curve(air, capacity)


def _design_unit_pulldown(
    model: "ProjectModel",
    room: "Room",
    loads: "RoomLoads",
    temps: DesignTemperatures,
    settings: Any,
    refrigerant: str,
    condensing: Optional[float],
    gas_cooler: Optional[float],
) -> tuple[Any, tuple[str, ...]]:
    """The pull-down after a delivery with the design unit, and a warning when the asked time is not met."""
    if not any(p.daily_intake > 0 for p in room.products):
        return None, ()
    from coldroom.physics.cycle import compressor_displacement
    from coldroom.loads.pulldown import room_pulldown

    def displacement_at(evaporating: float, capacity: float) -> float:
        return compressor_displacement(
            refrigerant,
            evaporating,
            condensing,
            capacity,
            superheat=settings.superheat,
            subcooling=settings.subcooling,
            isentropic_efficiency=settings.isentropic_efficiency,
            suction_line_superheat=settings.suction_line_superheat,
            clearance=settings.clearance,
            gas_cooler_outlet_temperature=gas_cooler,
        )

    capacity = design_unit_capacity(displacement_at, loads.design_capacity, room, temps)
    pulldown = room_pulldown(
        model,
        room,
        capacity,
        f"design unit: {loads.design_capacity:.0f} W at evaporating {temps.evaporating_temperature:.1f} °C, "
        f"same compressor displacement as the room air moves (evaporator TD {temps.evaporator_td:g} K)",
        unit="design",
    )
    if pulldown is None or pulldown.met:
        return pulldown, ()
    return pulldown, tuple(
        f"{room.name}: pull-down: {p.name} to its final temperature "
        + ("is not reached" if p.time_to_final is None else f"takes {p.time_to_final / 3600:.1f} h")
        + f" with the design unit, more than the {(p.asked_time or 0.0) / 3600:g} h asked for it"
        for p in pulldown.missed()
    )


def heat_rejection_temperatures(
    refrigerant: str, condensing: float, air: float, approach: float
) -> tuple[Optional[float], Optional[float]]:
    """(condensing dew temperature, gas-cooler outlet) [°C]: one of them is ``None``.

    R-744 past the boundary of :func:`coldroom.physics.cycle.r744_transcritical` rejects its heat
    in a gas cooler whose outlet is the entering air plus *approach* [K]; every other case
    condenses at *condensing*.
    """
    if refrigerant == "R-744":
        from coldroom.physics.cycle import r744_transcritical

        if r744_transcritical(condensing):
            return None, air + approach
    return condensing, None


@dataclass(frozen=True)
class SystemDesign:
    """One system at its design point: member loads and temperatures, settings, the cycle (SI, °C)."""

    name: str
    rooms: tuple
    loads: tuple
    temps: tuple
    settings: tuple
    info: Any
    diversity: float
    capacity: float
    suction: float
    condensing: Optional[float]
    air: float
    gas_cooler: Optional[float]
    coils: tuple
    cycle: Any
    suction_drop: float = 0.0
    discharge_drop: float = 0.0
    pipework: Any = None

    def cycle_at(
        self,
        condensing: Optional[float],
        gas_cooler: Optional[float],
        suction_drop: Optional[float] = None,
        discharge_drop: Optional[float] = None,
        performance_only: bool = False,
    ) -> Any:
        """The same coils and compressor settings at another condensing (or gas-cooler outlet) temperature.

        The line drops default to the design's (the suction-line drop given, or the sized lines' fed back).
        *performance_only*: only (displacement [m³/s], compressor power [W]), exactly the full
        cycle's (:func:`coldroom.physics.system_cycle.compressor_performance`).
        """
        from coldroom.physics.system_cycle import compressor_performance, solve_system_cycle

        r = self.settings[0]
        solve = compressor_performance if performance_only else solve_system_cycle
        return solve(
            self.info.name,
            list(self.coils),
            condensing,
            subcooling=r.subcooling,
            isentropic_efficiency=r.isentropic_efficiency,
            suction_line_superheat=r.suction_line_superheat,
            suction_pressure_drop=self.suction_drop if suction_drop is None else suction_drop,
            discharge_pressure_drop=self.discharge_drop if discharge_drop is None else discharge_drop,
            clearance=r.clearance,
            gas_cooler_outlet_temperature=gas_cooler,
        )


def design_system(model: "ProjectModel", name: str, indices: tuple[int, ...], diversity: float = 1.0) -> SystemDesign:
    """Loads, design temperatures and the design cycle of one system (no pull-down, no checks).

    Raises
    ------
    CalculationError
        The cycle cannot be solved; the message names the room (one member) or the system.
    """
    from coldroom.design import systems
    from coldroom.data import refrigerants
    from coldroom.loads import room_loads

    rooms = tuple(model.rooms[i] for i in indices)
    loads = tuple(room_loads(model, room) for room in rooms)
    temps = tuple(room_design_temperatures(model, room) for room in rooms)
    settings = tuple(model.refrigeration_for(room) for room in rooms)
    r = settings[0]  # the condensing settings are the system's, the same for every member
    info = refrigerants.lookup(r.refrigerant)
    capacity = systems.system_design_capacity([x.design_capacity for x in loads], diversity)
    suction = systems.suction_temperature([t.evaporating_temperature for t in temps], r.suction_line_drop)
    air = temps[0].condenser_air_temperature
    condensing, gas_cooler = heat_rejection_temperatures(
        info.name, temps[0].condensing_temperature, air, r.gas_cooler_approach
    )
    coils = tuple(
        (t.evaporating_temperature, s.superheat, x.design_capacity * diversity)
        for t, s, x in zip(temps, settings, loads)
    )
    design = SystemDesign(
        name, rooms, loads, temps, settings, info, diversity, capacity, suction, condensing, air, gas_cooler, coils,
        None, r.suction_line_drop, 0.0,
    )
    who = f"room {rooms[0].name!r}" if len(rooms) == 1 else f"system {name!r}"

    def solve(suction_drop: float, discharge_drop: float = 0.0) -> Any:
        try:
            return design.cycle_at(condensing, gas_cooler, suction_drop, discharge_drop)
        except CalculationError as exc:
            raise type(exc)(
                f"{who}: the {info.name} cycle at evaporating {min(c[0] for c in coils):.1f} °C / "
                f"condensing {temps[0].condensing_temperature:.1f} °C cannot be sized: {exc}"
            ) from None

    cyc = solve(r.suction_line_drop)
    # pipework: lines sized on this cycle; their drops fed back (coldroom.design.pipework)
    from coldroom.design import pipework as _pipework

    suction_drop, discharge_drop = r.suction_line_drop, 0.0
    try:
        lines = _pipework.size_system_lines(cyc, r.piping)
        if lines is not None:
            suction_drop, discharge_drop = _pipework.cycle_drops(cyc, lines)
            if lines.line("suction") is None:
                suction_drop = r.suction_line_drop
            cyc = solve(suction_drop, discharge_drop)
            suction = systems.suction_temperature([t.evaporating_temperature for t in temps], suction_drop)
        smallest = min(rooms, key=lambda room: room.inside_volume)
        works = _pipework.pipework(
            cyc, lines, r.charge, smallest.name, smallest.inside_volume, suction_drop, discharge_drop,
            _pipework.valve_subcooling(cyc, lines),
        )
    except CalculationError as exc:
        raise type(exc)(f"{who}: pipework and charge cannot be computed: {exc}") from None
    from dataclasses import replace

    return replace(design, cycle=cyc, suction=suction, suction_drop=suction_drop, discharge_drop=discharge_drop,
                   pipework=works)


def size_system(
    model: "ProjectModel", name: str, indices: tuple[int, ...], diversity: float = 1.0
) -> tuple["SystemResult", tuple["RoomResult", ...]]:
    """Loads of the member rooms, the system's cycle and electrical figures, and each room's result.

    Parameters
    ----------
    model : ProjectModel
    name : str
        The system's name.
    indices : tuple of int
        The member rooms' places in ``model.rooms``.
    diversity : float
        Share of the members' summed design capacity the system is sized for [-].

    Raises
    ------
    CalculationError
        The cycle cannot be solved; the message names the room (one member) or the system.
    """
    from coldroom.design import systems
    from coldroom.design.existing import check_room
    from coldroom.results import Note, RoomResult, SystemMember, SystemResult
    from coldroom.design.unit_limits import unit_limits

    d = design_system(model, name, indices, diversity)
    rooms, loads, temps, settings, r, info = d.rooms, d.loads, d.temps, d.settings, d.settings[0], d.info
    capacity, suction, condensing, air, gas_cooler, cyc = (
        d.capacity, d.suction, d.condensing, d.air, d.gas_cooler, d.cycle
    )
    suction_drop, works = d.suction_drop, d.pipework
    coldest = min(t.evaporating_temperature for t in temps)
    members = tuple(
        SystemMember(
            room=room.name,
            evaporating_temperature=t.evaporating_temperature,
            duty=x.design_capacity,
            superheat=s.superheat,
            mass_flow=flow,
            regulated=t.evaporating_temperature > coldest,
        )
        for room, t, s, x, flow in zip(rooms, temps, settings, loads, cyc.evaporator_flows)
    )
    electrical = systems.electrical_figures(
        cyc.compressor_power,
        capacity,
        systems.condenser_fan_power(cyc.condenser_duty, r.condenser_fan_power),
        [member_draw(room, x) for room, x in zip(rooms, loads)],
    )
    prefix = f"{rooms[0].name}: " if len(rooms) == 1 else f"system {name}: "
    warnings = tuple(
        w.prefixed(prefix) if isinstance(w, Note) else f"{prefix}{w}" for w in getattr(cyc, "warnings", ()) or ()
    )
    if electrical.compressor_run_time >= SECONDS_PER_DAY_S:
        warnings += (
            f"{prefix}at {diversity:.0%} diversity the design capacity cannot remove the rooms' daily heat in 24 h",
        )
    warnings += tuple(w.prefixed(prefix) for w in works.warnings)
    system = SystemResult(
        name=name,
        members=members,
        refrigerant=info.name,
        suction_temperature=suction,
        condensing_temperature=condensing,
        condenser_air_temperature=air,
        suction_line_drop=suction_drop,
        diversity=diversity,
        design_capacity=capacity,
        cycle=cyc,
        electrical=electrical,
        warnings=warnings,
        pipework=works,
        condenser_air_basis=condenser_air_basis(settings[0].condenser_location),
    )
    pulldowns = [
        _design_unit_pulldown(model, room, x, t, s, info.name, condensing, gas_cooler)
        for room, x, t, s in zip(rooms, loads, temps, settings)
    ]
    checks = [check_room(model, room, x, suction_drop=suction_drop) for room, x in zip(rooms, loads)]
    limits = [
        None if check is None else unit_limits(model, i, x, check.holds, pulldown=True)
        for i, x, check in zip(indices, loads, checks)
    ]
    results = tuple(
        RoomResult(
            loads=x,
            evaporating_temperature=t.evaporating_temperature,
            condensing_temperature=condensing,
            condenser_air_temperature=air,
            sizing_basis=_basis(model, room, x, t) + _system_basis(model, system),
            cycle=cyc if len(rooms) == 1 else None,
            check=check,
            warnings=(warnings if len(rooms) == 1 else ()) + pull_warnings,
            system=name,
            pulldown=pulldown,
            limits=limit,
        )
        for room, x, t, (pulldown, pull_warnings), check, limit in zip(rooms, loads, temps, pulldowns, checks, limits)
    )
    return system, results


def _system_basis(model: "ProjectModel", system: "SystemResult") -> tuple:
    """Sizing-basis rows about the room's system (only for a system of several rooms or with a drop)."""
    from coldroom.results import inline_term as n

    if len(system.members) == 1 and system.suction_line_drop == 0.0 and system.diversity == 1.0:
        return ()
    piping = system.pipework.piping if system.pipework is not None else None
    sized_suction = piping is not None and piping.line("suction") is not None
    rows: list[tuple[str, tuple]] = [
        ("System: condensing unit", (f"{system.name}, serving {', '.join(system.rooms)}",)),
        (
            "System: suction (dew)",
            (
                n(system.suction_temperature, "temperature"),
                " = coldest evaporating temperature less the suction-line drop ",
                n(system.suction_line_drop, "temperature_difference"),
                " (from the sized suction line)" if sized_suction else " (as given)",
            ),
        ),
    ]
    if len(system.members) > 1:
        rows.append(("System: warmer rooms", ("evaporator pressure regulator; vapour mixed into the suction",)))
    if system.diversity != 1.0:
        rows.append(("System: diversity", (f"{system.diversity:.0%} of the rooms' summed design capacity",)))
    if piping is not None and system.pipework.discharge_drop > 0.0:
        rows.append(
            (
                "System: discharge line",
                (
                    "compressor discharges ", n(system.pipework.discharge_drop, "temperature_difference"),
                    " (saturation) above condensing: the sized discharge line's drop",
                ),
            )
        )
    return tuple(rows)


def existing_unit_checks(model: "ProjectModel") -> tuple:
    """``coldroom check``: every room's existing unit checked with its system's designed suction-line drop.

    A system with an existing unit is designed first (:func:`design_system`), so the drop is
    the one ``size`` and ``select`` use (given, or from the sized suction line); then
    :func:`coldroom.design.existing.check_existing_units`.
    """
    from coldroom.design.existing import check_existing_units

    drops: dict[int, float] = {}
    for name, entry, indices in model.system_groups():
        if any(model.rooms[i].existing_unit is not None for i in indices):
            job = design_system(model, name, indices, entry.diversity if entry is not None else 1.0)
            drops.update((i, job.suction_drop) for i in indices)
    return check_existing_units(model, drops)


def size_project(model: "ProjectModel", input_path: str, input_bytes: bytes) -> "ProjectResult":
    """Size every room of *model*.

    Parameters
    ----------
    model : ProjectModel
        The validated project.
    input_path : str
        The project file's name, as printed on the sheet.
    input_bytes : bytes
        The project file's content (its SHA-256 goes on every page).

    Returns
    -------
    ProjectResult

    Raises
    ------
    CalculationError
        A room's cycle cannot be solved (the message names the room).
    """
    from coldroom.inputs.physical_checks import project_warnings
    from coldroom.results import ProjectResult

    by_index: dict[int, "RoomResult"] = {}
    systems = []
    for name, entry, indices in model.system_groups():
        system, members = size_system(model, name, indices, entry.diversity if entry is not None else 1.0)
        systems.append(system)
        by_index.update(zip(indices, members))
    rooms = tuple(by_index[i] for i in range(len(model.rooms)))
    info = model.project
    return ProjectResult(
        project_name=info.name,
        client=info.client,
        site=info.site,
        prepared_by=info.prepared_by,
        date=sheet_date(info.date),
        unit_system=info.units,
        input_file=os.path.basename(str(input_path)),
        input_sha256=hashlib.sha256(input_bytes).hexdigest(),
        rooms=rooms,
        warnings=tuple(message for _key, message in project_warnings(model)),
        versions=versions(),
        systems=tuple(systems),
    )
