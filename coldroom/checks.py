"""Physical sanity of a validated project: impossible input is an error, implausible input a warning.

The pydantic models check each field on its own (type, unit, range); this
module checks what needs several fields at once. Errors are raised through a
callback so the caller can attach the file position of the offending key.

Thresholds for warnings are common practice, no source, unless noted.
"""

from __future__ import annotations

from typing import TYPE_CHECKING, Callable

from coldroom.errors import ColdroomError

if TYPE_CHECKING:  # pragma: no cover
    from coldroom.projectfile import ProjectModel, Room

Path_ = tuple
ErrorFactory = Callable[[str, Path_], Exception]

# Warning thresholds (common practice, no source).
WALL_U_WARNING = 1.0  # W/(m²·K): a cold-room wall or ceiling worse than this is barely insulated
PASSAGES_PER_HOUR_WARNING = 120.0  # more than two a minute, every hour of the day
SAFETY_FACTOR_WARNING = 0.5
DOOR_EDGE_ALLOWANCE = 0.0  # m; a door may fill its wall but not exceed it


def check_project(model: "ProjectModel", error: ErrorFactory) -> None:
    """Raise (via *error*) the first impossible combination in *model*."""
    from coldroom.data import refrigerants

    design = model.design
    for i, room in enumerate(model.rooms):
        at = ("rooms", i)
        for side in ("north", "east", "south", "west", "ceiling", "floor"):
            surface = room.envelope.side(side)
            own = getattr(room.envelope, side) is not None
            where = at + ("envelope", side if own else "walls")
            if isinstance(surface.construction, str) and surface.construction not in model.constructions:
                names = ", ".join(sorted(model.constructions)) or "none defined"
                raise error(
                    f"construction {surface.construction!r} is not defined under `constructions` (defined: {names})",
                    where + ("construction",),
                )
        if room.temperature >= design.outdoor_temperature:
            raise error(
                f"inside temperature {room.temperature:g} °C is not below the outdoor design temperature "
                f"{design.outdoor_temperature:g} °C; a cold room must be colder than outdoors",
                at + ("temperature",),
            )
        if room.refrigeration.condenser_air_temperature is not None and (
            room.refrigeration.condenser_air_temperature <= room.temperature
        ):
            raise error(
                "condenser air temperature must be above the room temperature",
                at + ("refrigeration", "condenser_air_temperature"),
            )
        try:
            refrigerants.lookup(room.refrigeration.refrigerant)
        except ColdroomError as exc:
            raise error(str(exc), at + ("refrigeration", "refrigerant")) from None
        _check_doors(room, at, error)
        for j, product in enumerate(room.products):
            p_at = at + ("products", j)
            if product.daily_intake > 0 and product.final_temperature is not None:
                assert product.entering_temperature is not None
                if product.final_temperature > product.entering_temperature:
                    raise error(
                        f"final temperature {product.final_temperature:g} °C is above the entering temperature "
                        f"{product.entering_temperature:g} °C; the room cools product, it does not warm it",
                        p_at + ("final_temperature",),
                    )
                if product.final_temperature < room.temperature - 0.5:
                    raise error(
                        f"final temperature {product.final_temperature:g} °C is below the room temperature "
                        f"{room.temperature:g} °C; product cannot be cooled below the room air",
                        p_at + ("final_temperature",),
                    )


def _check_doors(room: "Room", at: tuple, error: ErrorFactory) -> None:
    height = room.dimensions.height if room.dimensions is not None else None
    for j, door in enumerate(room.doors):
        d_at = at + ("doors", j)
        if height is not None and door.height > height + DOOR_EDGE_ALLOWANCE:
            raise error(
                f"door height {door.height:g} m is more than the room height {height:g} m",
                d_at + ("height",),
            )
        if door.wall is not None:
            wall_area = room.surface_area(door.wall)
            if room.dimensions is not None:
                wall_width = room.dimensions.length if door.wall in ("north", "south") else room.dimensions.width
                if door.width > wall_width + DOOR_EDGE_ALLOWANCE:
                    raise error(
                        f"door width {door.width:g} m is more than the {door.wall} wall's {wall_width:g} m",
                        d_at + ("width",),
                    )
            if door.width * door.height > wall_area:
                raise error(
                    f"door area {door.width * door.height:.3g} m² is larger than the {door.wall} wall ({wall_area:.3g} m²)",
                    d_at + ("width",),
                )
        open_per_day = door.passages_per_day * door.passage_time + door.open_time
        if open_per_day > 86400.0:
            raise error(
                f"the door would stand open {open_per_day / 3600:.3g} h a day, more than 24 h "
                "(passages × passage time + open time)",
                d_at + ("passages_per_day",),
            )


def project_warnings(model: "ProjectModel") -> list[tuple[str, str]]:
    """Legal but implausible input, as (dotted key, message) pairs for the sheet and terminal."""
    from coldroom.loads import construction_u

    out: list[tuple[str, str]] = []
    for i, room in enumerate(model.rooms):
        key = f"rooms[{i}]"
        for side in ("north", "east", "south", "west", "ceiling"):
            surface = room.envelope.side(side)
            u = construction_u(model.construction(surface.construction), surface.facing)
            if u > WALL_U_WARNING:
                out.append(
                    (
                        f"{key}.envelope.{side}",
                        f"{room.name}: {side} U = {u:.2f} W/(m²·K) is high for a cold room (usually below 0.3)",
                    )
                )
        for j, door in enumerate(room.doors):
            if door.passages_per_day / 24.0 > PASSAGES_PER_HOUR_WARNING:
                out.append(
                    (
                        f"{key}.doors[{j}].passages_per_day",
                        f"{room.name}: {door.passages_per_day:g} passages a day is more than "
                        f"{PASSAGES_PER_HOUR_WARNING:g} an hour around the clock; check the traffic",
                    )
                )
        if room.safety_factor > SAFETY_FACTOR_WARNING:
            out.append(
                (
                    f"{key}.safety_factor",
                    f"{room.name}: safety factor {room.safety_factor:.0%} is above 50 %; "
                    "an oversized unit short-cycles and dehumidifies poorly",
                )
            )
        if room.temperature < 0 and room.envelope.floor.facing == "ground":
            out.append(
                (
                    f"{key}.envelope.floor",
                    f"{room.name}: a room below 0 °C on an unheated slab risks frost heave; "
                    "design a heated slab (facing: heated_slab)",
                )
            )
    return out
