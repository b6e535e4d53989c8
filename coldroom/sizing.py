"""From a validated project to equipment duties: design temperatures and one cycle per room.

For every room:

1. the 24-hour load (:func:`coldroom.loads.room_loads`) gives the design
   capacity (the larger of the 24-hour required capacity and the peak-hour
   capacity, :attr:`coldroom.results.RoomLoads.design_capacity`);
2. the saturated evaporating (dew) temperature is the room temperature minus
   an evaporator TD chosen from the room's relative humidity
   (:data:`EVAPORATOR_TD_BY_RH`, common practice [trade]) unless the project
   gives ``refrigeration.evaporator_td``;
3. the saturated condensing (dew) temperature is the condenser air temperature
   (``refrigeration.condenser_air_temperature``, else the outdoor design dry
   bulb) plus a condenser TD (:data:`DEFAULT_CONDENSER_TD`, [trade] 8–15 K for
   air-cooled condensers) unless the project gives
   ``refrigeration.condenser_td``;
4. one compressor per system (:func:`size_system`; a room in no ``systems``
   entry is a system of its own): :func:`coldroom.cycle.solve_system_cycle`
   at the coldest member's evaporating temperature less the suction-line drop,
   the system's condensing temperature and the system design capacity (Σ
   member design capacities × diversity, :mod:`coldroom.systems`), the warmer
   members' vapour mixed into the suction behind EPRs; superheat from each
   room's ``refrigeration`` block, subcooling, isentropic efficiency and
   clearance from the system's (defaults documented in
   :class:`coldroom.projectfile.Refrigeration`: superheat 5 K, suction-line
   superheat 5 K, subcooling 2 K, overall isentropic efficiency 0.65,
   clearance 0.04 — common practice, no source);
5. the system's electrical figures (:func:`coldroom.systems.electrical_figures`).

Temperatures are in °C here (the trade states TDs against °C room
temperatures); capacities in W.

``RoomResult.sizing_basis`` holds ``(what, value)`` text pairs for the sheet,
already in the project's unit system. *what* is ``"Group: label"``; the sheet
groups rows by the text before the first ``": "``.

Examples
--------
>>> evaporator_td_for(room_temperature=2.0, relative_humidity=0.90)[0]
4.5
>>> evaporator_td_for(room_temperature=2.0, relative_humidity=0.70)[0]
7.5
>>> evaporator_td_for(room_temperature=-20.0, relative_humidity=0.80)[0]
5.5
"""

from __future__ import annotations

import datetime as _dt
import hashlib
import os
from dataclasses import dataclass
from typing import TYPE_CHECKING, Any, Optional

from coldroom import units as _units
from coldroom.errors import CalculationError

if TYPE_CHECKING:  # pragma: no cover
    from coldroom.projectfile import ProjectModel, Room
    from coldroom.results import ProjectResult, RoomLoads, RoomResult, SystemResult
    from coldroom.systems import MemberDraw

TD_SOURCE = "trade practice, evaporator TD vs room RH [trade]"

#: Evaporator TD (room air − saturated evaporating dew temperature) by room
#: relative humidity, for rooms above :data:`FREEZER_BELOW` [trade, common
#: practice, no source]: 4–5 K ≈ 90 % RH; 5.5–6.5 K ≈ 80–85 %;
#: 6.5–9 K ≈ 65–80 %; 9–12 K ≈ 50–65 %. Each row: (lowest RH of the band
#: [-], TD [K], source). The TD is the middle of the trade band, rounded to
#: 0.5 K; below 50 % RH the top of the last band is used.
EVAPORATOR_TD_BY_RH: tuple[tuple[float, float, str], ...] = (
    (0.875, 4.5, f"4–5 K for about 90 % RH, {TD_SOURCE}"),
    (0.80, 6.0, f"5.5–6.5 K for 80–85 % RH, {TD_SOURCE}"),
    (0.65, 7.5, f"6.5–9 K for 65–80 % RH, {TD_SOURCE}"),
    (0.50, 10.0, f"9–12 K for 50–65 % RH, {TD_SOURCE}"),
    (0.0, 12.0, f"12 K (top of the 9–12 K band) below 50 % RH, {TD_SOURCE}"),
)

#: Rooms colder than this are freezers: RH is not controlled, TD 5–6 K [trade]
#: (the threshold is common practice, no source) [°C].
FREEZER_BELOW = -5.0
FREEZER_TD = (5.5, f"5–6 K for freezers, {TD_SOURCE}")

#: Air-cooled condenser TD above the entering air [K]: 10 K, inside the trade
#: range 8–15 K [trade].
DEFAULT_CONDENSER_TD = 10.0
CONDENSER_TD_SOURCE = "air-cooled condenser, trade range 8–15 K [trade]"

# the transcritical boundary is coldroom.cycle.r744_transcritical; the gas-cooler
# approach (outlet minus entering air) is the project's ``gas_cooler_approach`` (default 3 K,
# common practice 2–5 K, from memory; verify).


def evaporator_td_for(room_temperature: float, relative_humidity: float) -> tuple[float, str]:
    """Evaporator TD for a room, from the trade table.

    Parameters
    ----------
    room_temperature : float
        Room air temperature [°C].
    relative_humidity : float
        Target room relative humidity [-].

    Returns
    -------
    (float, str)
        TD [K] and its source text.

    Examples
    --------
    >>> evaporator_td_for(0.0, 0.55)
    (10.0, '9–12 K for 50–65 % RH, trade practice, evaporator TD vs room RH [trade]')
    """
    if room_temperature < FREEZER_BELOW:
        return FREEZER_TD
    for lowest, td, source in EVAPORATOR_TD_BY_RH:
        if relative_humidity >= lowest:
            return td, source
    return EVAPORATOR_TD_BY_RH[-1][1], EVAPORATOR_TD_BY_RH[-1][2]  # pragma: no cover


@dataclass(frozen=True)
class DesignTemperatures:
    """Design temperatures of one room's refrigeration system.

    Attributes
    ----------
    evaporating_temperature : float
        Saturated evaporating (dew) temperature [°C].
    condensing_temperature : float
        Saturated condensing (dew) temperature [°C].
    condenser_air_temperature : float
        Air entering the condenser [°C].
    evaporator_td, condenser_td : float
        The TDs used [K].
    evaporator_td_source, condenser_td_source, condenser_air_source : str
        Where each came from.
    """

    evaporating_temperature: float
    condensing_temperature: float
    condenser_air_temperature: float
    evaporator_td: float
    condenser_td: float
    evaporator_td_source: str
    condenser_td_source: str
    condenser_air_source: str


def design_temperatures(
    room_temperature: float,
    relative_humidity: float,
    outdoor_temperature: float,
    evaporator_td: Optional[float] = None,
    condenser_td: Optional[float] = None,
    condenser_air_temperature: Optional[float] = None,
) -> DesignTemperatures:
    """Evaporating and condensing dew temperatures for one room.

    Parameters
    ----------
    room_temperature : float
        Room air [°C].
    relative_humidity : float
        Target room RH [-].
    outdoor_temperature : float
        Outdoor design dry bulb [°C], the condenser air unless given.
    evaporator_td, condenser_td : float, optional
        Overrides [K].
    condenser_air_temperature : float, optional
        Air entering the condenser [°C].

    Examples
    --------
    >>> t = design_temperatures(2.0, 0.90, 32.0)
    >>> (t.evaporating_temperature, t.condensing_temperature)
    (-2.5, 42.0)
    """
    if evaporator_td is None:
        td_e, td_e_source = evaporator_td_for(room_temperature, relative_humidity)
    else:
        td_e, td_e_source = evaporator_td, "given in the project file"
    if condenser_td is None:
        td_c, td_c_source = DEFAULT_CONDENSER_TD, CONDENSER_TD_SOURCE
    else:
        td_c, td_c_source = condenser_td, "given in the project file"
    if condenser_air_temperature is None:
        air, air_source = outdoor_temperature, "outdoor design dry bulb"
    else:
        air, air_source = condenser_air_temperature, "given in the project file"
    return DesignTemperatures(
        evaporating_temperature=room_temperature - td_e,
        condensing_temperature=air + td_c,
        condenser_air_temperature=air,
        evaporator_td=td_e,
        condenser_td=td_c,
        evaporator_td_source=td_e_source,
        condenser_td_source=td_c_source,
        condenser_air_source=air_source,
    )



def room_design_temperatures(model: "ProjectModel", room: "Room") -> DesignTemperatures:
    """:func:`design_temperatures` for one room of a project, with its refrigeration overrides."""
    r = model.refrigeration_for(room)
    return design_temperatures(
        room.temperature,
        room.rh,
        model.design.outdoor_temperature,
        evaporator_td=r.evaporator_td,
        condenser_td=r.condenser_td,
        condenser_air_temperature=r.condenser_air_temperature,
    )

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
    """Versions printed on every page: coldroom and CoolProp (read from metadata, no import)."""
    from importlib import metadata

    from coldroom import __version__

    try:
        coolprop = metadata.version("CoolProp")
    except metadata.PackageNotFoundError:  # pragma: no cover
        coolprop = "unknown"
    return {"coldroom": __version__, "CoolProp": coolprop}


def _basis(model: "ProjectModel", room: "Room", loads: "RoomLoads", temps: DesignTemperatures) -> tuple:
    """The (what, value) pairs printed under "Basis of design", in the project's units."""
    from coldroom.data import refrigerants
    from coldroom.loads import construction_u, outdoor_relative_humidity, site_pressure

    system = model.project.units
    d = model.design
    show = _units.display
    rows: list[tuple[str, str]] = []
    add = rows.append
    rh_out = outdoor_relative_humidity(d)
    add(("Site: outdoor design dry bulb", show(d.outdoor_temperature, "temperature", system)))
    if d.outdoor_wet_bulb is not None:
        add(("Site: outdoor wet bulb", f"{show(d.outdoor_wet_bulb, 'temperature', system)} (RH {rh_out:.0%})"))
    else:
        add(("Site: outdoor relative humidity", f"{rh_out:.0%}"))
    add(("Site: ground temperature", show(d.ground_temperature, "temperature", system)))
    add(("Site: barometric pressure", show(site_pressure(d), "pressure", system)))
    add(("Room: temperature and RH", f"{show(room.temperature, 'temperature', system)}, {room.rh:.0%} RH"))
    length_unit = _units.DISPLAY_UNITS[system]["length"]
    for where in ("inside", "outside"):
        box = room.box_dimensions(where)
        if box is None:
            break
        given = " (as given)" if room.dimensions is not None and room.dimensions.measured == where else ""
        add(
            (
                f"Room: {where} dimensions (L × W × H){given}",
                " × ".join(_units.format_number(_units.to_unit(x, "length", length_unit)) for x in box)
                + f" {length_unit}",
            )
        )
    add(("Room: inside volume and floor area",
         f"{show(loads.volume, 'volume', system)}, {show(loads.floor_area, 'area', system)}"))
    add(("Room: transmission areas", {
        "outside": "outside surface of each section (outside dimensions: "
                   + ("as given)" if room.dimensions is not None and room.dimensions.measured == "outside"
                      else "inside + construction thickness)"),
        "given": "areas as given in the project file",
    }.get(loads.transmission_area_basis, "outside surface of each section; given areas where stated")))
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
        u_text = show(u_of[key], "u_value", system, 3 if system == "SI" else 4)
        add((f"Construction: {desc[key]}", f"U {u_text} ({', '.join(sides)})"))
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
            (
                "Construction: heat lost to a colder neighbour",
                "not credited unless the surface says credit: true (the neighbour may be off, defrosting or "
                "emptied); the colder room always counts what it gains"
                + (f" — here: {', '.join(neighbours)}" if neighbours else ""),
            )
        )
    for door in room.doors:
        w = show(door.width, "length", system)
        h = show(door.height, "length", system)
        add(
            (
                f"Door: {door.name}",
                f"{w} × {h}, {door.passages_per_day:g} passages/day, open {door.open_time / 60:g} min/day, "
                f"{door.protection.replace('_', ' ')}"
                + (f"; into room {door.to_room} (its design temperature and RH)" if door.to_room else ""),
            )
        )
    if room.infiltration.method == "air_changes":
        add(("Door: infiltration method", f"air changes ({room.infiltration.usage.replace('_', ' ')} use)"))
    for product in room.products:
        label = product.product.replace("_", " ") if product.product else "product (given properties)"
        if product.daily_intake > 0:
            assert product.entering_temperature is not None and product.final_temperature is not None
            text = (
                f"{show(product.daily_intake, 'mass', system)}/day, "
                f"{show(product.entering_temperature, 'temperature', system)} to "
                f"{show(product.final_temperature, 'temperature', system)} in {product.pulldown_time / 3600:g} h"
            )
        else:
            text = "stored only"
        if product.stored_mass > 0:
            text += f"; {show(product.stored_mass, 'mass', system)} stored"
        add((f"Product: {label}", text))
    add(("Operation: compressor run time", f"{loads.run_time / 3600:g} h/day ({loads.run_time_basis})"))
    add(("Operation: safety factor", f"{loads.safety_factor:.0%}"))
    add(("Operation: defrost", room.defrost.type.replace("_", "-")))
    add(("Operation: design capacity set by", loads.governed_by))
    r = model.refrigeration_for(room)
    info = refrigerants.lookup(r.refrigerant)
    add(("Refrigeration: refrigerant", f"{info.name} (safety class {info.safety_class}, GWP {info.gwp_ar4:g} AR4)"))
    add(
        (
            "Refrigeration: evaporator TD",
            f"{show(temps.evaporator_td, 'temperature_difference', system)} ({temps.evaporator_td_source})",
        )
    )
    add(
        (
            "Refrigeration: condenser air",
            f"{show(temps.condenser_air_temperature, 'temperature', system)} ({temps.condenser_air_source})",
        )
    )
    add(
        (
            "Refrigeration: condenser TD",
            f"{show(temps.condenser_td, 'temperature_difference', system)} ({temps.condenser_td_source})",
        )
    )
    add(
        (
            "Refrigeration: superheat / suction line / subcooling",
            " / ".join(show(x, "temperature_difference", system)
                       for x in (r.superheat, r.suction_line_superheat, r.subcooling)),
        )
    )
    add(("Refrigeration: compressor", f"isentropic efficiency {r.isentropic_efficiency:.2f}, clearance {r.clearance:.2f}"))
    return tuple(rows)


def _member_draw(room: "Room", loads: "RoomLoads") -> "MemberDraw":
    """The electrical consumers of one room: evaporator fans, heaters, electric defrost."""
    from coldroom.systems import MemberDraw

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
    )


#: Room air temperatures above and below the set point at which the design unit's capacity is
#: computed for the pull-down; between them it is interpolated linearly [K].
PULLDOWN_CAPACITY_OFFSETS = (-2.0, 0.0, 2.0, 5.0, 10.0, 20.0)


def design_unit_capacity(cycle_at: Any, design_capacity: float, room: "Room", temps: DesignTemperatures) -> Any:
    """Capacity [W] of the room's design unit as a function of the room air [°C], for the pull-down.

    The compressor keeps the displacement it needs for *design_capacity* at the design
    evaporating temperature; the evaporating temperature follows the room air at the design
    evaporator TD; the condensing temperature stays at design. Capacity at another
    evaporating temperature = design capacity × design displacement ÷ the displacement the
    cycle needs there for the design capacity (the cycle's own volumetric efficiency and
    refrigerating effect, :func:`coldroom.cycle.solve_cycle`). A room on a system of several
    rooms is taken with its share of the compressor.
    """
    import numpy as np

    reference = cycle_at(temps.evaporating_temperature, design_capacity).displacement
    air, capacity = [], []
    for offset in PULLDOWN_CAPACITY_OFFSETS:
        t = room.temperature + offset
        try:
            other = cycle_at(t - temps.evaporator_td, design_capacity)
        except CalculationError:
            continue
        air.append(t)
        capacity.append(design_capacity * reference / other.displacement)
    if not air:  # pragma: no cover - the design point itself solved
        air, capacity = [room.temperature], [design_capacity]
    xs, ys = np.asarray(air), np.asarray(capacity)

    def at(air_temperature: float) -> float:
        return float(np.interp(air_temperature, xs, ys))

    return at


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
    from coldroom.cycle import solve_cycle
    from coldroom.pulldown import room_pulldown

    def cycle_at(evaporating: float, capacity: float) -> Any:
        return solve_cycle(
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

    capacity = design_unit_capacity(cycle_at, loads.design_capacity, room, temps)
    pulldown = room_pulldown(
        model,
        room,
        capacity,
        f"design unit: {loads.design_capacity:.0f} W at evaporating {temps.evaporating_temperature:.1f} °C, "
        f"same compressor displacement as the room air moves (evaporator TD {temps.evaporator_td:g} K)",
    )
    if pulldown is None or pulldown.met:
        return pulldown, ()
    g = pulldown.governing
    assert g is not None and g.asked_time is not None
    reached = "is not reached" if g.time_to_final is None else f"takes {g.time_to_final / 3600:.1f} h"
    return pulldown, (
        f"{room.name}: pull-down: {g.name} to its final temperature {reached} with the design unit, "
        f"more than the {g.asked_time / 3600:g} h asked",
    )


def heat_rejection_temperatures(
    refrigerant: str, condensing: float, air: float, approach: float
) -> tuple[Optional[float], Optional[float]]:
    """(condensing dew temperature, gas-cooler outlet) [°C]: one of them is ``None``.

    R-744 past the boundary of :func:`coldroom.cycle.r744_transcritical` rejects its heat
    in a gas cooler whose outlet is the entering air plus *approach* [K]; every other case
    condenses at *condensing*.
    """
    if refrigerant == "R-744":
        from coldroom.cycle import r744_transcritical

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
    ) -> Any:
        """The same coils and compressor settings at another condensing (or gas-cooler outlet) temperature.

        The line drops default to the design's (the suction-line drop given, or the sized lines' fed back).
        """
        from coldroom import cycle as _cycle

        r = self.settings[0]
        return _cycle.solve_system_cycle(
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
    from coldroom import systems
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
    # pipework: lines sized on this cycle; their drops fed back (coldroom.pipework)
    from coldroom import pipework as _pipework

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
    from coldroom import systems
    from coldroom.equipment import check_room
    from coldroom.results import Note, RoomResult, SystemMember, SystemResult
    from coldroom.unitlimits import unit_limits

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
        [_member_draw(room, x) for room, x in zip(rooms, loads)],
    )
    prefix = f"{rooms[0].name}: " if len(rooms) == 1 else f"system {name}: "
    warnings = tuple(
        w.prefixed(prefix) if isinstance(w, Note) else f"{prefix}{w}" for w in getattr(cyc, "warnings", ()) or ()
    )
    if electrical.compressor_run_time >= systems.DAY:
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
    )
    pulldowns = [
        _design_unit_pulldown(model, room, x, t, s, info.name, condensing, gas_cooler)
        for room, x, t, s in zip(rooms, loads, temps, settings)
    ]
    checks = [check_room(model, room, x) for room, x in zip(rooms, loads)]
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
    if len(system.members) == 1 and system.suction_line_drop == 0.0 and system.diversity == 1.0:
        return ()
    show = _units.display
    units = model.project.units
    piping = system.pipework.piping if system.pipework is not None else None
    sized_suction = piping is not None and piping.line("suction") is not None
    rows = [
        (
            "System: condensing unit",
            f"{system.name}, serving {', '.join(system.rooms)}",
        ),
        (
            "System: suction (dew)",
            f"{show(system.suction_temperature, 'temperature', units)} = coldest evaporating temperature less the "
            f"suction-line drop {show(system.suction_line_drop, 'temperature_difference', units)}"
            + (" (from the sized suction line)" if sized_suction else " (as given)"),
        ),
    ]
    if len(system.members) > 1:
        rows.append(("System: warmer rooms", "evaporator pressure regulator; vapour mixed into the suction"))
    if system.diversity != 1.0:
        rows.append(("System: diversity", f"{system.diversity:.0%} of the rooms' summed design capacity"))
    if piping is not None and system.pipework.discharge_drop > 0.0:
        rows.append(
            (
                "System: discharge line",
                f"compressor discharges {show(system.pipework.discharge_drop, 'temperature_difference', units)} "
                "(saturation) above condensing: the sized discharge line's drop",
            )
        )
    return tuple(rows)


def size_room(model: "ProjectModel", room: "Room") -> "RoomResult":
    """Loads, design temperatures and the cycle for one room (sized with the rest of its system).

    Raises
    ------
    CalculationError
        The cycle cannot be solved; the message names the room or its system.
    """
    for name, entry, indices in model.system_groups():
        if model.rooms.index(room) in indices:
            _system, rooms = size_system(model, name, indices, entry.diversity if entry is not None else 1.0)
            return rooms[indices.index(model.rooms.index(room))]
    raise CalculationError(f"room {room.name!r} is not in the project")  # pragma: no cover


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
    from coldroom.checks import project_warnings
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
