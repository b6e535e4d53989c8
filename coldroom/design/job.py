"""The job as equipped for one command: designed (``size``), chosen (``select``) or installed (``check``).

Every command writes the same ``rooms[]`` and ``systems[]`` (:class:`coldroom.results.SystemResult`);
each system says which equipment its electrical figures come from in ``equipment_basis``
(:data:`EQUIPMENT_BASES`):

- ``"design"``: the design cycle's compressor input at the design point, the room's own fans,
  heaters and defrost heaters from the project file (:func:`coldroom.design.sizing.size_system`);
- ``"selected"``: the chosen condensing unit's electrical input at its balance point with the
  chosen coils, the coils' fans and electric defrost heaters from the catalogue, the unit's
  condenser fans from the catalogue when it gives them (:func:`selected_system`);
- ``"existing"``: the existing unit's input at its balance point (``coldroom check``).

The connected load and the electricity per day then follow from that equipment by the same
rules (:func:`coldroom.design.systems.electrical_figures`): the compressor runs for the time its
capacity at the balance point needs to remove the rooms' daily heat gain.
"""

from __future__ import annotations

from dataclasses import replace
from typing import TYPE_CHECKING, Any, Sequence

from coldroom.constants import SECONDS_PER_DAY_S

if TYPE_CHECKING:  # pragma: no cover
    from coldroom.design.selection import SystemSelection
    from coldroom.inputs.projectfile import ProjectModel
    from coldroom.results import ProjectResult, SystemResult

#: What a system's electrical figures are computed from.
EQUIPMENT_BASES = ("design", "selected", "existing")



def selected_system(
    model: "ProjectModel", system: "SystemResult", selection: "SystemSelection", loads: Sequence[Any]
) -> "SystemResult":
    """*system* (as ``size`` designed it) with the electrical figures of the equipment *selection* chose.

    The compressor's input and capacity are the chosen unit's at its balance point; each room's
    evaporator fans are its coils' (count × fan power, for the room's fan hours, else all day);
    its electric defrost heaters are the coils' when the coil defrosts electrically and the
    room's defrost is electric (defrosts × duration from the project file); door-frame and
    other heaters stay the project's. Condenser fans: the catalogue unit's ``fan_power``, else
    as designed. *loads* are the members' :class:`coldroom.results.RoomLoads`, in order.
    """
    from coldroom.design import systems
    from coldroom.design.sizing import member_draw

    check = selection.choice.check
    if check.power_at_balance is None or not check.capacity_at_balance:  # pragma: no cover - a choice holds
        return replace(system, equipment_basis="selected")
    by_name = {room.name: room for room in model.rooms}
    coolers = {c.room: c for c in selection.coolers}
    draws = []
    for member, x in zip(system.members, loads):
        room = by_name[member.room]
        coil = coolers[member.room]
        d = room.defrost
        electric = coil.defrost == "electric" and d.type == "electric" and d.per_day > 0
        fans = room.fans
        draws.append(
            replace(
                member_draw(room, x),
                evaporator_fan_power=coil.count * coil.fan_power,
                evaporator_fan_time=fans.hours if fans is not None else SECONDS_PER_DAY_S,
                defrost_heater_power=coil.count * coil.defrost_heater_power if electric else 0.0,
                defrost_time=d.per_day * d.duration if electric else 0.0,
            )
        )
    fan_power = selection.choice.entry.fan_power
    condenser_fans = (
        (fan_power, "the chosen unit's, from the catalogue")
        if fan_power is not None
        else (system.electrical.condenser_fan_power, system.electrical.condenser_fan_basis)
    )
    electrical = systems.electrical_figures(check.power_at_balance, check.capacity_at_balance, condenser_fans, draws)
    return replace(system, electrical=electrical, equipment_basis="selected")


def selected_result(
    model: "ProjectModel", result: "ProjectResult", selections: Sequence["SystemSelection"]
) -> "ProjectResult":
    """The sized job (*result*) with every system as ``select`` chose it (:func:`selected_system`).

    The rooms stay as sized: their loads and design figures are the job's, whatever equipment
    serves them.
    """
    loads = {room.loads.name: room.loads for room in result.rooms}
    chosen = {s.system: s for s in selections}
    systems = tuple(
        selected_system(model, system, chosen[system.name], [loads[name] for name in system.rooms])
        if system.name in chosen
        else system
        for system in result.systems
    )
    return replace(result, systems=systems)


def existing_system(model: "ProjectModel", system: "SystemResult", room: Any) -> "SystemResult":
    """A one-room *system* with the electrical figures of the room's existing unit (``coldroom check``).

    The compressor's input and capacity are the existing unit's at its balance point
    (*room* is the sized :class:`coldroom.results.RoomResult`, its ``check`` the unit's check);
    fans, heaters and defrost heaters are the project's, the condenser fans as designed. A room
    whose unit has no balance point (or a system of several rooms, whose existing units are
    checked room by room) keeps the design figures.
    """
    from coldroom.design import systems
    from coldroom.design.sizing import member_draw

    check = room.check
    if len(system.members) != 1 or check is None or check.power_at_balance is None or not check.capacity_at_balance:
        return system
    source = next(r for r in model.rooms if r.name == room.loads.name)
    fans = (system.electrical.condenser_fan_power, system.electrical.condenser_fan_basis)
    electrical = systems.electrical_figures(
        check.power_at_balance, check.capacity_at_balance, fans, [member_draw(source, room.loads)]
    )
    return replace(system, electrical=electrical, equipment_basis="existing")


def existing_result(model: "ProjectModel", result: "ProjectResult") -> "ProjectResult":
    """The sized job (*result*) with every one-room system whose room has an existing unit as that
    unit stands (:func:`existing_system`); the other systems keep ``equipment_basis: "design"``."""
    rooms = {room.loads.name: room for room in result.rooms}
    systems = tuple(existing_system(model, system, rooms[system.rooms[0]]) for system in result.systems)
    return replace(result, systems=systems)
