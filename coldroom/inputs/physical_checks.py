"""Physical sanity of a validated project: impossible input is an error, implausible input a warning.

The pydantic models check each field on its own (type, unit, range); this
module checks what needs several fields at once. Errors are raised through a
callback so the caller can attach the file position of the offending key.

Errors (exit 65), each naming the key, the value and why:

- a construction name not defined; a ground-facing surface given its own
  temperature (it would be ignored: the ground takes
  ``design.ground_temperature``);
- outdoor wet bulb above the dry bulb, or below the dry-air wet bulb;
- a room not colder than outdoors; an inside volume under
  :data:`MIN_ROOM_VOLUME`;
- condenser air not warmer than the room; an unknown refrigerant; the
  evaporating temperature (room − evaporator TD) below the refrigerant's
  triple point or model limit, or the condensing temperature (condenser air
  + condenser TD) at or above its critical temperature (R-744 excepted: it is
  sized transcritical, :func:`coldroom.physics.cycle.r744_transcritical`) — limits in
  :data:`coldroom.data.refrigerants.LIMITS`;
- ``charge.location_class: III`` on a split system (``self_contained: false``):
  its evaporator is in the cold room;
- a door taller than the room, wider than or larger than its wall, doors
  together larger than their wall, a door standing open more than 24 h;
- defrosts taking more than 24 h a day;
- product leaving warmer than it entered, or colder than the room;
- a surface (``facing: room``), a door (``to_room``) or a system naming a room
  that does not exist (closest names listed), a room facing itself, the two
  sides of a shared partition disagreeing by more than
  :data:`PARTITION_AREA_TOLERANCE`;
- a room in two systems, two systems of one name, a member room's
  ``refrigeration`` giving system-level keys, or a refrigerant other than its
  system's (one system, one refrigerant);
- a design-day schedule that disagrees with the room: door shares not adding
  up to 100 %, windows that overlap, people or lighting windows whose hours
  differ from ``hours``, deliveries whose masses differ from the daily
  intake, defrost start times not one per defrost or overlapping.

Warnings (:func:`project_warnings`, exit 0) for legal but implausible input.
Thresholds for warnings are common practice, no source, unless noted.

Examples
--------
>>> from coldroom.inputs.opening import open_project_text
>>> from importlib.resources import files
>>> text = files("coldroom.data").joinpath("starter.yaml").read_text(encoding="utf-8")
>>> model = open_project_text(text)
>>> evaporating, condensing = design_saturation_temperatures(model, model.rooms[0])
>>> evaporating < model.rooms[0].temperature < model.design.outdoor_temperature < condensing
True
"""

from __future__ import annotations

from typing import TYPE_CHECKING, Callable, Iterable, Iterator, get_args

from coldroom.constants import SECONDS_PER_DAY_S
from coldroom.data import refrigerants as _refrigerants
from coldroom.rules import room_design_temperatures
from coldroom.errors import ColdroomError
from coldroom.results import Note

if TYPE_CHECKING:  # pragma: no cover
    from coldroom.inputs.projectfile import ProjectModel, Room

Path_ = tuple
ErrorFactory = Callable[[str, Path_], Exception]

# Warning thresholds (common practice, no source).
WALL_U_WARNING = 1.0  # W/(m²·K): a cold-room wall or ceiling worse than this is barely insulated
PASSAGES_PER_HOUR_WARNING = 120.0  # more than two a minute, every hour of the day
SAFETY_FACTOR_WARNING = 0.5
DOOR_EDGE_ALLOWANCE = 0.0  # m; a door may fill its wall but not exceed it
CRITICAL_MARGIN_WARNING = 5.0  # K: condensing this close below the critical point is poor practice
MIN_ROOM_VOLUME = 1.0  # m³: below this it is a cabinet, not a walk-in room (common practice, no source)
#: Two rooms describing their shared partition must agree on its area within
#: this share of the larger figure (our choice: measuring tolerance) [-].
PARTITION_AREA_TOLERANCE = 0.05
PULLDOWN_WARNING = 4 * 3600.0  # s: walk-in rooms pull product down in 8–24 h; under 4 h the peak hour governs
POWER_WARNING = 100e3  # W: no single heat source or rating of a walk-in room is this large (MW written for kW?)
DESIGN_RATIO_NOTE = 3.0  # design capacity above this multiple of the 24-hour figure is explained

def check_physics(model: "ProjectModel", error: ErrorFactory) -> None:
    """Raise (via *error*) the first impossible combination in *model*.

    Parameters
    ----------
    model : ProjectModel
        A project whose fields have passed their own validation.
    error : callable
        ``error(message, key_path)`` returns the exception to raise; the
        project-file loader attaches file, line and column of *key_path*.
    """
    design = model.design
    _check_design(model, error)
    _check_links(model, error)
    _check_systems(model, error)
    for i, room in enumerate(model.rooms):
        at = ("rooms", i)
        _check_geometry(room, at, error)
        for side in ("north", "east", "south", "west", "ceiling", "floor"):
            surface = room.envelope.side(side)
            own = getattr(room.envelope, side) is not None
            where = at + ("envelope", side if own else "walls")
            if surface.facing == "ground" and surface.temperature is not None:
                raise error(
                    "a surface facing ground takes design.ground_temperature; remove temperature here "
                    "(or use facing: heated_slab for a heated plane held at a temperature)",
                    where + ("temperature",),
                )
            if isinstance(surface.construction, str) and surface.construction not in model.constructions:
                names = ", ".join(sorted(model.constructions)) or "none defined"
                raise error(
                    f"construction {surface.construction!r} is not defined under `constructions` (defined: {names})",
                    where + ("construction",),
                )
        if room.temperature >= design.outdoor_temperature:
            raise error(
                Note.fill(
                    "inside temperature {t} is not below the outdoor design temperature {o}; "
                    "a cold room must be colder than outdoors",
                    t=(room.temperature, "temperature"),
                    o=(design.outdoor_temperature, "temperature"),
                ),
                at + ("temperature",),
            )
        refrigeration = model.refrigeration_for(room)
        if refrigeration.condenser_air_temperature is not None and (
            refrigeration.condenser_air_temperature <= room.temperature
        ):
            raise error(
                "condenser air temperature must be above the room temperature"
                + (f" ({room.name!r})" if model.system_of(room) is not None else ""),
                _setting_path(model, i, "condenser_air_temperature"),
            )
        try:
            info = _refrigerants.lookup(refrigeration.refrigerant)
        except ColdroomError as exc:
            raise error(str(exc), _setting_path(model, i, "refrigerant")) from None
        _check_refrigerant_range(model, room, info.name, at, error)
        charge = refrigeration.charge
        if charge.location_class == "III" and not charge.self_contained:
            # EN 378-1:2016 5.3 / ISO 5149-1:2014 5.3 [mem] [ref:en-378]: class III puts every refrigerant-
            # containing part in a machinery room or the open air; a split system's evaporator is in the room
            raise error(
                "location class III means every refrigerant-containing part is in a machinery room or the open "
                "air, but with self_contained: false the evaporator is in the cold room (EN 378-1 location "
                "classes); use I or II",
                _setting_path(model, i, "charge") + ("location_class",),
            )
        _check_existing_unit(room, at, error)
        _check_doors(room, at, error)
        _check_defrost(room, at, error)
        _check_schedule(room, at, error)
        for j, product in enumerate(room.products):
            p_at = at + ("products", j)
            if product.daily_intake > 0 and product.final_temperature is not None:
                assert product.entering_temperature is not None
                if product.final_temperature > product.entering_temperature:
                    raise error(
                        Note.fill(
                            "final temperature {f} is above the entering temperature {e}; "
                            "the room cools product, it does not warm it",
                            f=(product.final_temperature, "temperature"),
                            e=(product.entering_temperature, "temperature"),
                        ),
                        p_at + ("final_temperature",),
                    )
                if product.final_temperature < room.temperature - 0.5:
                    raise error(
                        Note.fill(
                            "final temperature {f} is below the room temperature {r}; "
                            "product cannot be cooled below the room air",
                            f=(product.final_temperature, "temperature"),
                            r=(room.temperature, "temperature"),
                        ),
                        p_at + ("final_temperature",),
                    )


def _setting_path(model: "ProjectModel", index: int, key: str) -> tuple:
    """Where a refrigeration setting of room *index* is written: the room's block, or its system's entry."""
    from coldroom.inputs.projectfile import ROOM_LEVEL_KEYS

    room = model.rooms[index]
    system = model.system_of(room)
    if system is None or key in ROOM_LEVEL_KEYS:
        return ("rooms", index, "refrigeration", key)
    return ("systems", model.systems.index(system), key)


def _surfaces(room: "Room", at: tuple):
    """Each side of *room* as (side, surface, key path of the surface as written)."""
    for side in ("north", "east", "south", "west", "ceiling", "floor"):
        own = getattr(room.envelope, side) is not None
        yield side, room.envelope.side(side), at + ("envelope", side if own else "walls")


def _check_links(model: "ProjectModel", error: ErrorFactory) -> None:
    """Surfaces facing a room and doors to a room name a room of the project, not their own."""
    from coldroom.errors import unknown_name

    names = [room.name for room in model.rooms]
    for i, room in enumerate(model.rooms):
        if room.name in names[:i]:
            raise error(f"two rooms are called {room.name!r}; room names must be unique", ("rooms", i, "name"))
    links: list[tuple[str, str, tuple]] = []
    for i, room in enumerate(model.rooms):
        at = ("rooms", i)
        for _side, surface, where in _surfaces(room, at):
            if surface.facing == "room":
                links.append((room.name, str(surface.room), where + ("room",)))
        for j, door in enumerate(room.doors):
            if door.to_room is not None:
                links.append((room.name, door.to_room, at + ("doors", j, "to_room")))
    for own, other, where in links:
        if other not in names:
            raise error(str(unknown_name("room", other, names)), where)
        if other == own:
            raise error(f"room {own!r} cannot face itself; name the room on the other side", where)
    _check_partitions(model, error)


def _check_partitions(model: "ProjectModel", error: ErrorFactory) -> None:
    """When both rooms describe their shared partition, the two areas must agree."""
    described: dict[tuple[str, str], tuple[float, tuple]] = {}
    for i, room in enumerate(model.rooms):
        for side, surface, where in _surfaces(room, ("rooms", i)):
            if surface.facing == "room":
                key = (room.name, str(surface.room))
                area, first = described.get(key, (0.0, where))
                described[key] = (area + room.surface_area(side), first)
    for (a, b), (area_a, _where_a) in described.items():
        if (b, a) not in described or a > b:
            continue
        area_b, where_b = described[(b, a)]
        if abs(area_a - area_b) > PARTITION_AREA_TOLERANCE * max(area_a, area_b):
            i_a, i_b = (next(i for i, r in enumerate(model.rooms) if r.name == n) for n in (a, b))
            (first, area_1), (second, area_2), where = (
                ((a, area_a), (b, area_b), where_b) if i_a < i_b else ((b, area_b), (a, area_a), _where_a)
            )
            raise error(
                Note.fill(
                    f"the partition between rooms {first!r} ({{x}}) and {second!r} ({{y}}) has two areas "
                    f"differing by more than {PARTITION_AREA_TOLERANCE * 100:g} %; make both rooms describe the same partition",
                    x=(area_1, "area"),
                    y=(area_2, "area"),
                ),
                where,
            )


def _check_systems(model: "ProjectModel", error: ErrorFactory) -> None:
    """Each room in at most one system; names unique; a member's own block holds only room-level keys."""
    from coldroom.data import refrigerants
    from coldroom.errors import unknown_name
    from coldroom.inputs.projectfile import ROOM_LEVEL_KEYS

    names = [room.name for room in model.rooms]
    member_of: dict[str, str] = {}
    system_names: dict[str, int] = {}
    for k, system in enumerate(model.systems):
        at = ("systems", k)
        if system.name in system_names:
            raise error(f"two systems are called {system.name!r}; system names must be unique", at + ("name",))
        system_names[system.name] = k
        try:
            info = refrigerants.lookup(system.refrigerant)
        except ColdroomError as exc:
            raise error(str(exc), at + ("refrigerant",)) from None
        for m, name in enumerate(system.rooms):
            where = at + ("rooms", m)
            if name not in names:
                raise error(str(unknown_name("room", name, names)), where)
            if name in member_of:
                other = member_of[name]
                raise error(
                    f"room {name!r} is already in system {other!r}"
                    + ("" if other != system.name else " (listed twice)")
                    + "; a room belongs to at most one system",
                    where,
                )
            member_of[name] = system.name
            i = names.index(name)
            own = model.rooms[i].refrigeration
            for key in sorted(own.model_fields_set - set(ROOM_LEVEL_KEYS)):
                key_at = ("rooms", i, "refrigeration", key)
                if key == "refrigerant":
                    try:
                        mine = refrigerants.lookup(own.refrigerant).name
                    except ColdroomError as exc:
                        raise error(str(exc), key_at) from None
                    if mine != info.name:
                        raise error(
                            f"mixed refrigerants: room {name!r} gives {mine} but its system {system.name!r} runs "
                            f"{info.name}; one system has one refrigerant",
                            key_at,
                        )
                    continue
                raise error(
                    f"room {name!r} is in system {system.name!r}: {key} is set on the system; a member's "
                    f"refrigeration block may give only {', '.join(ROOM_LEVEL_KEYS)}",
                    key_at,
                )
    for k, system in enumerate(model.systems):
        if system.name in names and system.name not in member_of:
            raise error(
                f"system {system.name!r} has the name of room {system.name!r}, which is in no system and so forms "
                "a system of that name; rename one",
                ("systems", k, "name"),
            )


def _check_design(model: "ProjectModel", error: ErrorFactory) -> None:
    """Outdoor humidity given as a wet bulb must be a possible reading."""
    from coldroom.physics import psychrometrics
    from coldroom.errors import CalculationError
    from coldroom.loads import site_pressure

    design = model.design
    if design.outdoor_wet_bulb is None:
        return
    where = ("design", "outdoor_wet_bulb")
    if design.outdoor_wet_bulb > design.outdoor_temperature:
        raise error(
            Note.fill(
                "wet-bulb temperature {w} is above the dry-bulb temperature {d}; "
                "a wet bulb is never warmer than the dry bulb",
                w=(design.outdoor_wet_bulb, "temperature"),
                d=(design.outdoor_temperature, "temperature"),
            ),
            where,
        )
    try:  # ASHRAE Handbook—Fundamentals, "Psychrometrics" (via coldroom.physics.psychrometrics) [pub]
        psychrometrics.relative_humidity_from_wet_bulb(
            design.outdoor_temperature, design.outdoor_wet_bulb, site_pressure(design)
        )
    except CalculationError as exc:
        raise error(
            Note.fill("wet-bulb temperature {w}: " + str(exc).replace("{", "(").replace("}", ")"), w=(design.outdoor_wet_bulb, "temperature")),
            where,
        ) from None


def _check_geometry(room: "Room", at: tuple, error: ErrorFactory) -> None:
    """A room must have a usable inside volume (the bounds only ask for > 0)."""
    volume = room.inside_volume
    if volume < MIN_ROOM_VOLUME:
        key = at + (("volume",) if room.volume is not None else ("dimensions",))
        raise error(
            Note.fill(
                "inside volume {v} is less than {m}; that is a cabinet, not a walk-in room "
                "(check the dimensions and their units)",
                v=(volume, "volume"),
                m=(MIN_ROOM_VOLUME, "volume"),
            ),
            key,
        )


def design_saturation_temperatures(model: "ProjectModel", room: "Room") -> tuple[float, float]:
    """Evaporating and condensing dew temperatures the sizing will use [°C].

    Parameters
    ----------
    model : ProjectModel
        The project (design outdoor temperature [°C]).
    room : Room
        The room (temperature [°C], RH [-], refrigeration choices).

    Evaporating = room − evaporator TD; condensing = condenser air (default the
    outdoor dry bulb) + condenser TD; the default TDs come from
    :mod:`coldroom.rules` (trade tables there), the same function the sizing uses.
    """
    temps = room_design_temperatures(model, room)
    return temps.evaporating_temperature, temps.condensing_temperature


def _check_refrigerant_range(
    model: "ProjectModel", room: "Room", refrigerant: str, at: tuple, error: ErrorFactory
) -> None:
    evaporating, condensing = design_saturation_temperatures(model, room)
    r_at = at + ("refrigeration",)
    refrigeration = model.refrigeration_for(room)
    index = at[1]
    air = refrigeration.condenser_air_temperature
    if air is None:
        air = model.design.outdoor_temperature
    # The field bounds (TDs > 0) already make these impossible; kept as a guard.
    if evaporating >= room.temperature:
        raise error(
            Note.fill(
                "evaporating temperature {e} is not below the room temperature {r}",
                e=(evaporating, "temperature"),
                r=(room.temperature, "temperature"),
            ),
            r_at + ("evaporator_td",),
        )
    if condensing <= air:
        raise error(
            Note.fill(
                "condensing temperature {c} is not above the condenser air {a}",
                c=(condensing, "temperature"),
                a=(air, "temperature"),
            ),
            _setting_path(model, index, "condenser_td"),
        )
    lowest, critical = _refrigerants.limits(refrigerant)
    if evaporating < lowest:
        raise error(
            Note.fill(
                "evaporating temperature {e} (room {r} − TD {td}) is below {low}, the lowest temperature of "
                f"{refrigerant} ({'triple point' if refrigerant in ('R-744', 'R-717') else 'lower limit of its property model'}); "
                "choose another refrigerant or a smaller evaporator_td",
                e=(evaporating, "temperature"),
                r=(room.temperature, "temperature"),
                td=(room.temperature - evaporating, "temperature_difference"),
                low=(lowest, "temperature"),
            ),
            r_at + ("evaporator_td",)
            if refrigeration.evaporator_td is not None
            else _setting_path(model, index, "refrigerant"),
        )
    if condensing >= critical and refrigerant != "R-744":
        # R-744 above its critical point is sized transcritical (gas cooler; coldroom.physics.cycle owns the boundary)
        raise error(
            Note.fill(
                "condensing temperature {c} (condenser air {a} + TD {td}) is at or above the critical temperature "
                f"of {refrigerant}, " + "{crit}; choose a smaller condenser_td or another refrigerant",
                c=(condensing, "temperature"),
                a=(air, "temperature"),
                td=(condensing - air, "temperature_difference"),
                crit=(critical, "temperature"),
            ),
            _setting_path(model, index, "refrigerant"),
        )


def _check_existing_unit(room: "Room", at: tuple, error: ErrorFactory) -> None:
    """The existing unit's rating must lie where its refrigerant has a subcritical saturation curve.

    The same limits as the room's design (:data:`coldroom.data.refrigerants.LIMITS`): the
    existing-unit check needs the rated state points, so a rating that
    ``size``/``check`` cannot evaluate is refused here, at its key.
    """
    unit = room.existing_unit
    if unit is None:
        return
    limits = _limits_of(unit.refrigerant)
    if limits is None:
        return
    name, (lowest, critical) = limits
    u_at = at + ("existing_unit",)
    if unit.rated_point is not None:
        rated = unit.rated_point
        if rated.condensing_temperature >= critical:
            raise error(
                Note.fill(
                    "rated condensing temperature {c} is at or above the critical temperature of "
                    f"{name}, " + "{crit}; a rated point must be subcritical (a transcritical rating is not modelled)",
                    c=(rated.condensing_temperature, "temperature"),
                    crit=(critical, "temperature"),
                ),
                u_at + ("rated_point", "condensing_temperature"),
            )
        if rated.evaporating_temperature < lowest:
            raise error(
                Note.fill(
                    "rated evaporating temperature {e} is below {low}, the lowest temperature of " + name,
                    e=(rated.evaporating_temperature, "temperature"),
                    low=(lowest, "temperature"),
                ),
                u_at + ("rated_point", "evaporating_temperature"),
            )
    if unit.rating_table is not None and unit.rating_table.evaporating_temperatures[0] < lowest:
        raise error(
            Note.fill(
                "the rating table's lowest evaporating temperature {e} is below {low}, the lowest temperature of "
                + name,
                e=(unit.rating_table.evaporating_temperatures[0], "temperature"),
                low=(lowest, "temperature"),
            ),
            u_at + ("rating_table", "evaporating_temperatures"),
        )
    if unit.polynomial is not None and unit.polynomial.discharge_min >= critical:
        raise error(
            Note.fill(
                "the polynomial's discharge envelope starts at {d}, at or above the critical temperature of "
                f"{name}, " + "{crit}",
                d=(unit.polynomial.discharge_min, "temperature"),
                crit=(critical, "temperature"),
            ),
            u_at + ("polynomial", "discharge_min"),
        )


def _check_defrost(room: "Room", at: tuple, error: ErrorFactory) -> None:
    defrost = room.defrost
    total = defrost.per_day * defrost.duration
    if total > SECONDS_PER_DAY_S:
        raise error(
            f"{defrost.per_day:g} defrosts a day of {defrost.duration / 60:g} min each take "
            f"{total / 3600:.3g} h, more than 24 h",
            at + ("defrost", "duration"),
        )


SCHEDULE_HOURS_TOLERANCE = 0.05  # h: windows and ``hours`` agree within 3 min
SCHEDULE_SHARE_TOLERANCE = 0.005  # door shares sum to 100 % within 0.5 %
SCHEDULE_MASS_TOLERANCE = 0.01  # deliveries match the daily intake within 1 %


def _check_schedule(room: "Room", at: tuple, error: ErrorFactory) -> None:
    from coldroom.loads.hourly import window_coverage

    schedule = room.schedule
    if schedule is None:
        return
    s_at = at + ("schedule",)
    for key in ("doors", "people", "lighting"):
        windows = getattr(schedule, key)
        if windows is None:
            continue
        cover = window_coverage((w.start, w.end) for w in windows)
        if max(cover) > 1.0 + 1e-9:
            hour = max(range(24), key=lambda h: cover[h])
            raise error(f"the {key} windows overlap (hour {hour:02d}:00 is covered twice)", s_at + (key,))
    if schedule.doors is not None:
        if not room.doors and room.infiltration.method == "door":
            raise error("a door schedule needs doors in the room", s_at + ("doors",))
        total = sum(w.share for w in schedule.doors)
        if abs(total - 1.0) > SCHEDULE_SHARE_TOLERANCE:
            raise error(f"the door windows' shares add up to {total:.1%}; they must add up to 100 %", s_at + ("doors",))
    for key, hours in (
        ("people", room.people.hours if room.people.count > 0 else 0.0),
        ("lighting", room.lighting.hours if room.lighting is not None else 0.0),
    ):
        windows = getattr(schedule, key)
        if windows is None:
            continue
        covered = sum(w.hours for w in windows)
        if abs(covered - hours / 3600.0) > SCHEDULE_HOURS_TOLERANCE:
            there = f"{key}.hours is {hours / 3600.0:g} h" if hours > 0 else f"the room has no {key} hours"
            raise error(
                f"the {key} windows cover {covered:g} h but {there}; make them agree", s_at + (key,)
            )
    if schedule.deliveries is not None:
        intake = sum(p.daily_intake for p in room.products)
        delivered = sum(d.mass for d in schedule.deliveries)
        if intake <= 0.0 or abs(delivered - intake) > SCHEDULE_MASS_TOLERANCE * intake:
            raise error(
                Note.fill(
                    "the deliveries bring {d} a day but the products' daily_intake adds up to {i}; make them agree",
                    d=(delivered, "mass"),
                    i=(intake, "mass"),
                ),
                s_at + ("deliveries",),
            )
    if schedule.defrost is not None:
        d = room.defrost
        if len(schedule.defrost) != d.per_day:
            raise error(
                f"{len(schedule.defrost)} defrost start times but defrost.per_day is {d.per_day:g}; make them agree",
                s_at + ("defrost",),
            )
        cover = window_coverage((t, t + d.duration / 3600.0) for t in schedule.defrost)
        if d.duration > 0 and max(cover) > 1.0 + 1e-9:
            raise error(f"defrosts of {d.duration / 60:g} min starting at these times overlap", s_at + ("defrost",))


def _check_doors(room: "Room", at: tuple, error: ErrorFactory) -> None:
    inside = room.box_dimensions("inside")  # doors open in the inside faces
    height = inside[2] if inside is not None else None
    for j, door in enumerate(room.doors):
        d_at = at + ("doors", j)
        if height is not None and door.height > height + DOOR_EDGE_ALLOWANCE:
            raise error(
                Note.fill(
                    "door height {d} is more than the room height {r}", d=(door.height, "length"), r=(height, "length")
                ),
                d_at + ("height",),
            )
        if door.wall is not None:
            wall_area = room.surface_area(door.wall)
            if inside is not None:
                wall_width = inside[0] if door.wall in ("north", "south") else inside[1]
                if door.width > wall_width + DOOR_EDGE_ALLOWANCE:
                    raise error(
                        Note.fill(
                            f"door width {{d}} is more than the {door.wall} wall's {{w}}",
                            d=(door.width, "length"),
                            w=(wall_width, "length"),
                        ),
                        d_at + ("width",),
                    )
            if door.width * door.height > wall_area:
                raise error(
                    Note.fill(
                        f"door area {{d}} is larger than the {door.wall} wall ({{w}})",
                        d=(door.width * door.height, "area"),
                        w=(wall_area, "area"),
                    ),
                    d_at + ("width",),
                )
        if door.wall is not None:
            on_wall = [d for d in room.doors[: j + 1] if d.wall == door.wall]
            total = sum(d.width * d.height for d in on_wall)
            if len(on_wall) > 1 and total > room.surface_area(door.wall):
                raise error(
                    Note.fill(
                        f"the {len(on_wall)} doors in the {door.wall} wall have {{t}} together, more than the wall's {{w}}",
                        t=(total, "area"),
                        w=(room.surface_area(door.wall), "area"),
                    ),
                    d_at + ("width",),
                )
        open_per_day = door.passages_per_day * door.passage_time + door.open_time
        if open_per_day > SECONDS_PER_DAY_S:
            raise error(
                f"the door would stand open {open_per_day / 3600:.3g} h a day, more than 24 h "
                "(passages × passage time + open time)",
                d_at + ("passages_per_day",),
            )


def quantities(model: object, kind: str) -> Iterator[tuple[tuple, float]]:
    """Every quantity field of *kind* in a validated project, as (key path, SI value).

    Found through the ``quantity_kind`` that :func:`coldroom.inputs.projectfile.Q`
    leaves on its validator, so a new power field is covered without being listed.
    """

    def kind_of(annotation: object, metadata: Iterable[object]) -> str | None:
        for meta in metadata:
            found = getattr(getattr(meta, "func", None), "quantity_kind", None)
            if found:
                return str(found)
        for arg in get_args(annotation):
            found = kind_of(arg, getattr(arg, "__metadata__", ()))
            if found:
                return found
        return None

    def walk(obj: object, path: tuple) -> Iterator[tuple[tuple, float]]:
        fields = getattr(type(obj), "model_fields", None)
        if fields is not None:
            for name, info in fields.items():
                value = getattr(obj, name)
                if isinstance(value, float) and kind_of(info.annotation, info.metadata) == kind:
                    yield path + (name,), value
                else:
                    yield from walk(value, path + (name,))
        elif isinstance(obj, (list, tuple)):
            for index, item in enumerate(obj):
                yield from walk(item, path + (index,))
        elif isinstance(obj, dict):
            for key, item in obj.items():
                yield from walk(item, path + (key,))

    return walk(model, ())


def project_warnings(model: "ProjectModel") -> list[tuple[str, str]]:
    """Legal but implausible input, as (dotted key, message) pairs for the sheet and terminal."""
    from coldroom.loads import construction_u
    from coldroom.inputs.safeyaml import dotted

    out: list[tuple[str, str]] = []
    for path, power in quantities(model, "power"):
        if power > POWER_WARNING:
            out.append(
                (
                    dotted(path),
                    Note.fill(
                        "{p} is implausibly large for a walk-in room (over {lim}); check the unit: kW, not MW?",
                        p=(power, "power"),
                        lim=(POWER_WARNING, "power"),
                    ),
                )
            )
    for i, room in enumerate(model.rooms):
        key = f"rooms[{i}]"
        for side in ("north", "east", "south", "west", "ceiling"):
            surface = room.envelope.side(side)
            u = construction_u(model.construction(surface.construction), surface.facing)
            if u > WALL_U_WARNING:
                out.append(
                    (
                        f"{key}.envelope.{side}",
                        Note.fill(
                            f"{room.name}: {side} U = {{u}} is high for a cold room (usually below {{typ}})",
                            u=(u, "u_value"),
                            typ=(0.3, "u_value"),
                        ),
                    )
                )
        for j, product in enumerate(room.products):
            if product.daily_intake > 0 and product.pulldown_time < PULLDOWN_WARNING:
                out.append(
                    (
                        f"{key}.products[{j}].pulldown_time",
                        Note.fill(
                            f"{room.name}: a pull-down time of {{t}} is short (walk-in rooms take 8–24 h); "
                            "the product's peak then sets the design capacity",
                            t=(product.pulldown_time, "hours"),
                        ),
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
        limits = _limits_of(model.refrigeration_for(room).refrigerant)
        if limits is not None:
            name, (_, critical) = limits
            condensing = design_saturation_temperatures(model, room)[1]
            if critical - CRITICAL_MARGIN_WARNING <= condensing < critical:
                out.append(
                    (
                        f"{key}.refrigeration",
                        Note.fill(
                            f"{room.name}: condensing at {{c}} is within {{m}} of the critical temperature of {name} "
                            "({crit}); capacity and efficiency fall steeply",
                            c=(condensing, "temperature"),
                            m=(CRITICAL_MARGIN_WARNING, "temperature_difference"),
                            crit=(critical, "temperature"),
                        ),
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
                    Note.fill(
                        f"{room.name}: a room below {{z}} on an unheated slab risks frost heave; "
                        "design a heated slab (facing: heated_slab)",
                        z=(0.0, "temperature"),
                    ),
                )
            )
    return out


def _limits_of(refrigerant: str) -> tuple[str, tuple[float, float]] | None:
    try:
        name = _refrigerants.lookup(refrigerant).name
    except ColdroomError:
        return None
    return name, _refrigerants.limits(name)
