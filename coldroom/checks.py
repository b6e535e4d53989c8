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
  + condenser TD) at or above its critical temperature (transcritical R-744
  is not modelled) — see :data:`REFRIGERANT_LIMITS`;
- a door taller than the room, wider than or larger than its wall, doors
  together larger than their wall, a door standing open more than 24 h;
- defrosts taking more than 24 h a day;
- product leaving warmer than it entered, or colder than the room.

Warnings (:func:`project_warnings`, exit 0) for legal but implausible input.
Thresholds for warnings are common practice, no source, unless noted.

Examples
--------
>>> from coldroom.projectfile import parse_project_text
>>> from importlib.resources import files
>>> text = files("coldroom.data").joinpath("starter.yaml").read_text(encoding="utf-8")
>>> model = parse_project_text(text)
>>> evaporating, condensing = design_saturation_temperatures(model, model.rooms[0])
>>> evaporating < model.rooms[0].temperature < model.design.outdoor_temperature < condensing
True
"""

from __future__ import annotations

from typing import TYPE_CHECKING, Callable

from coldroom.errors import ColdroomError
from coldroom.results import Note

if TYPE_CHECKING:  # pragma: no cover
    from coldroom.projectfile import ProjectModel, Room

Path_ = tuple
ErrorFactory = Callable[[str, Path_], Exception]

# Warning thresholds (common practice, no source).
WALL_U_WARNING = 1.0  # W/(m²·K): a cold-room wall or ceiling worse than this is barely insulated
PASSAGES_PER_HOUR_WARNING = 120.0  # more than two a minute, every hour of the day
SAFETY_FACTOR_WARNING = 0.5
DOOR_EDGE_ALLOWANCE = 0.0  # m; a door may fill its wall but not exceed it
CRITICAL_MARGIN_WARNING = 5.0  # K: condensing this close below the critical point is poor practice
MIN_ROOM_VOLUME = 1.0  # m³: below this it is a cabinet, not a walk-in room (common practice, no source)

#: Temperature limits of each refrigerant's property model [°C]: the lowest
#: saturated evaporating temperature (triple point of a pure fluid; the lower
#: limit of CoolProp's pseudo-pure or mixture model for a blend) and the
#: critical temperature (for a blend, the mixture critical point of the
#: nominal composition). Values read from CoolProp 8.0 here
#: (``PropsSI('Ttriple'|'Tcrit', fluid)``; for the ``.mix`` blends
#: ``AbstractState('HEOS', fluid).all_critical_points()``: the physical one near the top
#: of the two-phase region, the lowest where several lie within 2 K, R-452A)
#: [pub: CoolProp 8.0 / NIST REFPROP values]. Kept as plain numbers so that
#: ``coldroom validate`` never imports CoolProp.
REFRIGERANT_LIMITS_SOURCE = "CoolProp 8.0 Ttriple/Tmin and Tcrit (mixture critical point) [pub]"
REFRIGERANT_LIMITS: dict[str, tuple[float, float]] = {
    # name: (lowest evaporating temperature [°C], critical temperature [°C])
    "R-134a": (-103.30, 101.06),
    "R-404A": (-73.15, 72.12),  # pseudo-pure model's lower limit
    "R-507A": (-73.15, 70.62),  # pseudo-pure model's lower limit
    "R-407A": (-114.11, 82.25),
    "R-407C": (-73.15, 86.20),  # pseudo-pure model's lower limit
    "R-407F": (-118.61, 82.60),
    "R-448A": (-124.62, 82.79),
    "R-449A": (-125.81, 82.49),
    "R-452A": (-122.41, 74.22),  # CoolProp finds 75.10, 74.25 and 74.22: the lowest is kept
    "R-513A": (-128.99, 95.41),
    "R-454C": (-146.02, 87.64),
    "R-455A": (-140.56, 85.63),
    "R-290": (-187.62, 96.74),
    "R-600a": (-159.42, 134.66),
    "R-717": (-77.65, 132.41),
    "R-744": (-56.56, 30.98),
    "R-1234yf": (-151.55, 94.70),
    "R-1234ze(E)": (-104.53, 109.36),
    "R-22": (-157.42, 96.15),
}


def check_project(model: "ProjectModel", error: ErrorFactory) -> None:
    """Raise (via *error*) the first impossible combination in *model*.

    Parameters
    ----------
    model : ProjectModel
        A project whose fields have passed their own validation.
    error : callable
        ``error(message, key_path)`` returns the exception to raise; the
        project-file loader attaches file, line and column of *key_path*.
    """
    from coldroom.data import refrigerants

    design = model.design
    _check_design(model, error)
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
        if room.refrigeration.condenser_air_temperature is not None and (
            room.refrigeration.condenser_air_temperature <= room.temperature
        ):
            raise error(
                "condenser air temperature must be above the room temperature",
                at + ("refrigeration", "condenser_air_temperature"),
            )
        try:
            info = refrigerants.lookup(room.refrigeration.refrigerant)
        except ColdroomError as exc:
            raise error(str(exc), at + ("refrigeration", "refrigerant")) from None
        _check_refrigerant_range(model, room, info.name, at, error)
        _check_doors(room, at, error)
        _check_defrost(room, at, error)
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


def _check_design(model: "ProjectModel", error: ErrorFactory) -> None:
    """Outdoor humidity given as a wet bulb must be a possible reading."""
    from coldroom import psychrometrics
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
    try:  # ASHRAE Handbook—Fundamentals, "Psychrometrics" (via coldroom.psychrometrics) [pub]
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
    :mod:`coldroom.sizing` (trade tables there), the same function the sizing uses.
    """
    from coldroom.sizing import room_design_temperatures  # no CoolProp import at module level

    temps = room_design_temperatures(model, room)
    return temps.evaporating_temperature, temps.condensing_temperature


def _check_refrigerant_range(
    model: "ProjectModel", room: "Room", refrigerant: str, at: tuple, error: ErrorFactory
) -> None:
    evaporating, condensing = design_saturation_temperatures(model, room)
    r_at = at + ("refrigeration",)
    air = room.refrigeration.condenser_air_temperature
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
            r_at + ("condenser_td",),
        )
    limits = REFRIGERANT_LIMITS.get(refrigerant)
    if limits is None:
        return
    lowest, critical = limits
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
            r_at + ("evaporator_td" if room.refrigeration.evaporator_td is not None else "refrigerant",),
        )
    if condensing >= critical:
        hint = (
            "; transcritical R-744 (gas cooler) is not modelled: choose another refrigerant "
            "or a lower condenser air temperature"
            if refrigerant == "R-744"
            else "; choose a smaller condenser_td or another refrigerant"
        )
        raise error(
            Note.fill(
                "condensing temperature {c} (condenser air {a} + TD {td}) is at or above the critical temperature "
                f"of {refrigerant}, " + "{crit}" + hint,
                c=(condensing, "temperature"),
                a=(air, "temperature"),
                td=(condensing - air, "temperature_difference"),
                crit=(critical, "temperature"),
            ),
            r_at + ("refrigerant",),
        )


def _check_defrost(room: "Room", at: tuple, error: ErrorFactory) -> None:
    defrost = room.defrost
    total = defrost.per_day * defrost.duration
    if total > 86400.0:
        raise error(
            f"{defrost.per_day:g} defrosts a day of {defrost.duration / 60:g} min each take "
            f"{total / 3600:.3g} h, more than 24 h",
            at + ("defrost", "duration"),
        )


def _check_doors(room: "Room", at: tuple, error: ErrorFactory) -> None:
    height = room.dimensions.height if room.dimensions is not None else None
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
            if room.dimensions is not None:
                wall_width = room.dimensions.length if door.wall in ("north", "south") else room.dimensions.width
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
                        Note.fill(
                            f"{room.name}: {side} U = {{u}} is high for a cold room (usually below {{typ}})",
                            u=(u, "u_value"),
                            typ=(0.3, "u_value"),
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
        temperatures = design_saturation_temperatures(model, room)
        limits = _limits_of(room.refrigeration.refrigerant)
        if limits is not None:
            name, (_, critical) = limits
            condensing = temperatures[1]
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
    from coldroom.data import refrigerants

    try:
        name = refrigerants.lookup(refrigerant).name
    except ColdroomError:
        return None
    limits = REFRIGERANT_LIMITS.get(name)
    return None if limits is None else (name, limits)
