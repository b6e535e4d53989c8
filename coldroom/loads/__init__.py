"""Heat-load components of a refrigerated room, and the room's 24-hour total.

The sub-modules are pure physics on plain floats (SI):
:mod:`~coldroom.loads.transmission`, :mod:`~coldroom.loads.infiltration`,
:mod:`~coldroom.loads.product`, :mod:`~coldroom.loads.internal`,
:mod:`~coldroom.loads.totals`. This module maps one validated room of a
project (:class:`coldroom.inputs.projectfile.Room`) onto them and collects the lines
into a :class:`coldroom.results.RoomLoads`.

The components follow ASHRAE Handbook—Refrigeration, chapter
"Refrigerated-Facility Loads" [ref:ashrae-refrig-loads]: transmission, product, infiltration, internal
(people, lighting, forklifts and other equipment in the room) and equipment
(evaporator fans, heaters, defrost). The design day hour by hour is
:mod:`~coldroom.loads.hourly`; the pull-down after a delivery :mod:`~coldroom.loads.pulldown`.

Stage 3 of the layout. May import: the foundation, ``data`` and ``physics``.
"""

from __future__ import annotations

from dataclasses import replace
from typing import TYPE_CHECKING

from coldroom.constants import SECONDS_PER_DAY_S
from coldroom.results import LoadLine, RoomLoads, Term
from coldroom.results import Term as T

if TYPE_CHECKING:  # pragma: no cover
    from coldroom.inputs.projectfile import Construction, DesignConditions, Product, ProjectModel, Room

SIDES = ("north", "east", "south", "west", "ceiling", "floor")

#: Film coefficients used for constructions built from layers [W/(m²·K)]:
#: still air inside and against another space, 24 km/h wind outdoors, none
#: against ground or a heated plane (ASHRAE-derived SI tables [pub]).
INSIDE_FILM = "still_air"
OUTSIDE_FILMS = {"outdoors": "wind_24kmh", "space": "still_air", "roof_void": "still_air", "room": "still_air"}


def construction_u(construction: "Construction", facing: str) -> float:
    """U-value of a construction as built against *facing* [W/(m²·K)].

    An explicit ``u_value`` is taken as given (films included); layers get the
    inside still-air film and the outside film for what they face.
    """
    from coldroom.data import materials
    from coldroom.loads.transmission import u_value

    if construction.u_value is not None:
        return construction.u_value
    layers = [
        (
            layer.thickness,
            layer.conductivity if layer.conductivity is not None else materials.material(layer.material).conductivity,  # type: ignore[arg-type]
        )
        for layer in construction.layers or []
    ]
    outside = OUTSIDE_FILMS.get(facing)
    return u_value(
        layers,
        materials.film_coefficient(INSIDE_FILM),
        materials.film_coefficient(outside) if outside else None,
    )


def outdoor_relative_humidity(design: "DesignConditions") -> float:
    """Outdoor design relative humidity [-] (from the wet bulb when given that way)."""
    from coldroom.physics import psychrometrics

    if design.outdoor_rh is not None:
        return design.outdoor_rh
    assert design.outdoor_wet_bulb is not None
    return psychrometrics.relative_humidity_from_wet_bulb(
        design.outdoor_temperature, design.outdoor_wet_bulb, site_pressure(design)
    )


def site_pressure(design: "DesignConditions") -> float:
    """Barometric pressure at the site [Pa]: given, or the standard atmosphere at the altitude."""
    from coldroom.physics import psychrometrics

    if design.barometric_pressure is not None:
        return design.barometric_pressure
    return psychrometrics.standard_pressure(design.altitude or 0.0)


def transmission_lines(model: "ProjectModel", room: "Room") -> list[LoadLine]:
    """One line per side of the room: q = U·A·(t_o + Δt_sun − t_r)."""
    from coldroom.loads import transmission

    design = model.design
    lines: list[LoadLine] = []
    for side in SIDES:
        surface = room.envelope.side(side)
        construction = model.construction(surface.construction)
        u = construction_u(construction, surface.facing)
        area, area_basis = room.transmission_area(side)
        sun = 0.0
        if surface.facing == "outdoors":
            outside = design.outdoor_temperature
            if surface.colour is not None and side != "floor":
                orientation = "roof" if side == "ceiling" else side
                sun = transmission.sun_allowance(orientation, surface.colour, design.hemisphere)
            q = transmission.surface_heat_gain(area, u, outside, room.temperature, sun)
            beyond = "outdoors"
        elif surface.facing == "ground":
            outside = design.ground_temperature
            q = transmission.floor_on_grade_heat_gain(area, u, outside, room.temperature)
            beyond = "ground"
        elif surface.facing == "heated_slab":
            assert surface.temperature is not None
            outside = surface.temperature
            q = transmission.heated_slab_floor_heat_gain(area, u, outside, room.temperature)
            beyond = "heated plane"
        elif surface.facing == "room":
            assert surface.room is not None
            outside = model.room_named(surface.room).temperature
            q = transmission.surface_heat_gain(area, u, outside, room.temperature)
            beyond = f"room: {surface.room}"
        else:
            assert surface.temperature is not None
            outside = surface.temperature
            q = transmission.surface_heat_gain(area, u, outside, room.temperature)
            beyond = "roof void" if surface.facing == "roof_void" else "adjacent space"
        dt = outside + sun - room.temperature
        area_words = " outside" if area_basis == "outside" else " as given"
        working = (T(u, "u_value", "U "), T(area, "area", suffix=area_words), T(dt, "temperature_difference"))
        if sun:
            working += (T(sun, "temperature_difference", "incl. sun ", sep=" "),)
        counted = transmission.credited_heat_gain(q, surface.credit)
        if counted != q:  # heat lost to a colder neighbour, not credited
            working += (T(q, "power", "= ", ", not credited", sep=" "),)
        lines.append(
            LoadLine(
                "transmission",
                f"{side} ({beyond})",
                counted * SECONDS_PER_DAY_S,
                working,
            )
        )
    return lines


def infiltration_lines(model: "ProjectModel", room: "Room") -> list[LoadLine]:
    """Infiltration by the room's method: per door (Gosney & Olama), or by air changes."""
    from coldroom.loads import infiltration

    design = model.design
    pressure = site_pressure(design)
    rh_out = outdoor_relative_humidity(design)
    if room.infiltration.method == "air_changes":
        result = infiltration.air_change_infiltration(
            room_volume=room.inside_volume,
            room_temperature=room.temperature,
            room_relative_humidity=room.rh,
            outside_temperature=design.outdoor_temperature,
            outside_relative_humidity=rh_out,
            usage=room.infiltration.usage,
            air_changes_per_day=room.infiltration.air_changes_per_day,
            pressure=pressure,
        )
        return [
            LoadLine(
                "infiltration",
                "air changes",
                result.daily_energy,
                (
                    T(result.air_changes_per_day, "number", suffix=" changes/day"),
                    T(room.inside_volume, "volume"),
                    T(result.heat_per_volume, "energy_density"),
                ),
            )
        ]
    lines = []
    for door in room.doors:
        if door.to_room is not None:
            beyond = model.room_named(door.to_room)
            other_temperature, other_rh = beyond.temperature, beyond.rh
        else:
            other_temperature = (
                door.other_side_temperature if door.other_side_temperature is not None else design.outdoor_temperature
            )
            other_rh = door.other_side_rh if door.other_side_rh is not None else rh_out
        result = infiltration.door_infiltration(
            door_width=door.width,
            door_height=door.height,
            room_temperature=room.temperature,
            room_relative_humidity=room.rh,
            outside_temperature=other_temperature,
            outside_relative_humidity=other_rh,
            passages_per_day=door.passages_per_day,
            passage_time=door.passage_time,
            standing_open_time=door.open_time,
            protection=door.protection,
            effectiveness=door.effectiveness,
            pressure=pressure,
        )
        lines.append(
            LoadLine(
                "infiltration",
                f"door: {door.name}",
                result.daily_energy,
                (
                    T(result.full_open_power, "power", suffix=" fully open"),
                    T(result.open_time_factor, "number", "Dt "),
                    T(result.flow_factor, "number", "Df "),
                    T(result.effectiveness, "number", "(1 − E ", ")"),
                ),
            )
        )
    return lines


def product_properties(item: "Product") -> tuple:
    """(property model, respiration data or None, label) of one product entry of a room."""
    from coldroom.physics.products import get_product
    from coldroom.loads.product import explicit_properties

    if item.product is not None:
        table = get_product(item.product)
        return table.properties(), table.respiration, table.name
    q = item.properties
    assert q is not None
    properties = explicit_properties(
        q.freezing_point, q.water_content, q.specific_heat_above, q.specific_heat_below, q.latent_heat
    )
    return properties, None, "product (given properties)"


def _product_loads(room: "Room") -> list:
    """One :class:`coldroom.loads.product.ProductLoad` per product entry of *room*."""
    from coldroom.loads.product import product_load

    out = []
    for item in room.products:
        properties, respiration, label = product_properties(item)
        pack = item.packaging
        material = pack.material if pack is not None and pack.material != "other" else "corrugated_board"
        out.append(
            product_load(
                label,
                properties,
                item.daily_intake,
                item.entering_temperature,
                item.final_temperature,
                item.pulldown_time,
                pack.mass if pack is not None else 0.0,
                material,
                pack.specific_heat if pack is not None else None,
                item.stored_mass,
                room.temperature,
                respiration,
            )
        )
    return out


def product_lines(model: "ProjectModel", room: "Room", loads: list | None = None) -> list[LoadLine]:
    """Product pull-down (sensible, latent, sensible below freezing), packaging and respiration.

    *loads* are the room's product loads when already computed (:func:`_product_loads`).
    """
    lines = []
    for item, load in zip(room.products, loads if loads is not None else _product_loads(room)):
        basis: tuple[Term, ...] = ()
        if item.daily_intake > 0:
            basis = (
                T(item.daily_intake, "mass", suffix="/day"),
                T(item.entering_temperature, "temperature", sep=", "),  # type: ignore[arg-type]
                T(item.final_temperature, "temperature", sep=" → "),  # type: ignore[arg-type]
                T(item.pulldown_time, "hours", "in ", sep=" "),
            )
        for what, energy in load.lines():
            extra = basis
            if what.endswith("packaging") and item.packaging is not None:
                extra = (T(item.packaging.mass, "mass", suffix="/day"),) + basis[1:]
            if what.endswith("respiration"):
                extra = (
                    T(item.stored_mass, "mass", suffix=" stored"),
                    T(room.temperature, "temperature", "at ", sep=" "),
                )
            lines.append(LoadLine("product", what, energy, extra))
    return lines


def storage_advice(room: "Room") -> list[str]:
    """Storage warnings for the named products: room outside their range, or an unsuitable mix."""
    from coldroom.physics.products import get_product, mix_warnings, storage_warnings

    named = [get_product(item.product) for item in room.products if item.product is not None]
    out: list[str] = []
    for product in dict.fromkeys(named):
        out += storage_warnings(product, room.temperature, room.rh * 100.0)
    if len(named) > 1:
        out += mix_warnings(named)
    return list(dict.fromkeys(out))


def product_peak(model: "ProjectModel", room: "Room", loads: list | None = None) -> float:
    """Product at its pull-down rate plus respiration [W] (the rate during the pull-down)."""
    return sum(load.pulldown_rate for load in (loads if loads is not None else _product_loads(room)))


def internal_lines(model: "ProjectModel", room: "Room") -> list[LoadLine]:
    """People, lighting, forklifts and equipment (internal); fans, heaters and defrost (equipment)."""
    from coldroom.loads import internal

    lines: list[LoadLine] = []
    t = room.temperature
    if room.people.count > 0 and room.people.hours > 0:
        hours = room.people.hours / 3600.0
        rate = internal.people_heat_rate(t)
        lines.append(
            LoadLine(
                "internal",
                "people",
                internal.people_energy(room.people.count, hours, t),
                (T(room.people.count, "number"), T(rate, "power"), T(room.people.hours, "hours")),
            )
        )
    if room.lighting is not None and room.lighting.hours > 0:
        light = room.lighting
        power = light.power if light.power is not None else light.power_density * room.floor_area  # type: ignore[operator]
        hours = light.hours / 3600.0
        basis = (
            (T(light.power_density, "power_per_area"), T(room.floor_area, "area"), T(light.hours, "hours"))
            if light.power_density is not None
            else (T(power, "power"), T(light.hours, "hours"))
        )
        lines.append(LoadLine("internal", "lighting", internal.lighting_energy(power, hours), basis))
    for appliance in room.appliances:
        hours = appliance.hours / 3600.0
        power = appliance.power * appliance.count
        if appliance.kind == "heater":
            energy = internal.heater_energy(power, hours)
            component = "equipment"
        elif appliance.kind == "forklift":
            energy = internal.forklift_energy(power, hours)
            component = "internal"
        else:
            energy = internal.equipment_energy(power, hours)
            component = "internal"
        count = (T(appliance.count, "number"),) if appliance.count != 1 else ()
        lines.append(
            LoadLine(component, appliance.name, energy, count + (T(appliance.power, "power"), T(appliance.hours, "hours")))
        )
    if room.fans is not None and room.fans.power > 0 and room.fans.hours > 0:
        fans = room.fans
        hours = fans.hours / 3600.0
        location = "in_air_stream" if fans.in_air_stream else "load_inside_motor_outside"
        energy = internal.motor_energy(fans.power * fans.count, hours, location, fans.motor_efficiency)
        lines.append(
            LoadLine(
                "equipment",
                "evaporator fans",
                energy,
                (T(fans.count, "number"), T(fans.power, "power"), T(fans.hours, "hours"))
                + (() if fans.in_air_stream else (T(fans.motor_efficiency, "number", "η "),)),
            )
        )
    d = room.defrost
    if d.type != "off_cycle" and d.heater_power > 0 and d.per_day > 0:
        energy = internal.defrost_energy(d.heater_power, d.per_day, d.duration, d.share_to_room)
        lines.append(
            LoadLine(
                "equipment",
                f"defrost ({d.type.replace('_', ' ')})",
                energy,
                (
                    T(d.heater_power, "power"),
                    T(d.per_day, "number", suffix="/day"),
                    T(d.duration, "minutes"),
                    T(d.share_to_room, "percent", suffix=" to the room"),
                ),
            )
        )
    return lines


def internal_peak(model: "ProjectModel", room: "Room") -> float:
    """Internal and equipment loads all on at once, defrost excluded [W].

    Every item at its full power in the same hour is a deliberately pessimistic
    peak (common practice, no source). Defrost heat is left out: the compressor
    does not run while the coil defrosts.
    """
    from coldroom.loads import internal

    peak = 0.0
    if room.people.count > 0 and room.people.hours > 0:
        peak += room.people.count * internal.people_heat_rate(room.temperature)
    if room.lighting is not None and room.lighting.hours > 0:
        light = room.lighting
        peak += light.power if light.power is not None else light.power_density * room.floor_area  # type: ignore[operator]
    for appliance in room.appliances:
        if appliance.hours > 0:
            peak += appliance.power * appliance.count
    if room.fans is not None and room.fans.hours > 0:
        fan_power = room.fans.power * room.fans.count
        peak += fan_power if room.fans.in_air_stream else fan_power * room.fans.motor_efficiency
    return peak


def _run_time(room: "Room") -> tuple[float, str]:
    from coldroom.loads import totals

    if room.run_hours is not None:
        return room.run_hours, "given"
    hours = totals.run_hours_for_defrost(room.defrost.type)
    return hours * 3600.0, f"default for {room.defrost.type.replace('_', '-')} defrost"


def design_day(model: "ProjectModel", room: "Room") -> "DesignDay":
    """The room's design day (:func:`coldroom.loads.hourly.room_design_day`) from this module's lines."""
    from coldroom.loads.hourly import LineSources, room_design_day

    sources = LineSources(
        product_loads=_product_loads,
        transmission_lines=transmission_lines,
        infiltration_lines=infiltration_lines,
        internal_lines=internal_lines,
        outdoor_relative_humidity=outdoor_relative_humidity,
        site_pressure=site_pressure,
    )
    return room_design_day(model, room, sources)


def room_loads(model: "ProjectModel", room: "Room") -> RoomLoads:
    """The 24-hour heat load of *room* in *model*.

    Returns
    -------
    RoomLoads
        Every line, the safety factor, run time and the peak-hour load [W].
    """
    products = _product_loads(room)
    day = design_day(model, room)
    transmission, infiltration = transmission_lines(model, room), infiltration_lines(model, room)
    means = day.outdoor_line_means
    if means[0] or means[1]:  # one daily energy: the outdoor-driven lines over the design day (loads.hourly)
        transmission, infiltration = (
            [_day_mean(line, mean) for line, mean in zip(group, group_means)]
            for group, group_means in ((transmission, means[0]), (infiltration, means[1]))
        )
    lines: list[LoadLine] = []
    lines += transmission
    lines += product_lines(model, room, products)
    lines += infiltration
    lines += internal_lines(model, room)
    run_time, basis = _run_time(room)
    steady = sum(
        line.daily_energy for line in lines if line.component in ("transmission", "infiltration")
    ) / SECONDS_PER_DAY_S
    peak = steady + product_peak(model, room, products) + internal_peak(model, room)
    warnings = storage_advice(room)
    if day.scheduled:  # the schedule replaces the all-at-once approximation
        peak = day.peak_load
    warnings += list(day.notes)
    loads = RoomLoads(
        name=room.name,
        lines=tuple(lines),
        safety_factor=room.safety_factor,
        run_time=run_time,
        run_time_basis=basis,
        peak_load=peak,
        volume=room.inside_volume,
        floor_area=room.floor_area,
        warnings=tuple(warnings),
        dimensions_measured=room.dimensions.measured if room.dimensions is not None else None,
        transmission_area_basis=", ".join(
            dict.fromkeys(basis for basis in ("outside", "given") for side in SIDES if room.transmission_area(side)[1] == basis)
        ),
        design_day=day,
    )
    note = design_capacity_note(room, loads)
    return loads if note is None else replace(loads, warnings=loads.warnings + (note,))


def _day_mean(line: LoadLine, mean_power: float) -> LoadLine:
    """*line* with its daily energy the design day's mean power × 24 h (its working says so)."""
    return replace(
        line,
        daily_energy=mean_power * SECONDS_PER_DAY_S,
        basis=line.basis + (T(mean_power, "power", "design-day mean ", sep="; "),),
    )


DESIGN_RATIO_NOTE = 3.0
"""A design capacity above this multiple of the 24-hour figure is explained (common practice, no source)."""


def design_capacity_note(room: "Room", loads: RoomLoads) -> "Note | None":
    """Why the design capacity is many times the 24-hour figure, when it is (else None).

    Only the peak hour can make it so; its largest part is then the product at
    its pull-down rate, so the note names the shortest pull-down time.
    """
    from coldroom.results import Note

    required = loads.required_capacity
    if required <= 0.0 or loads.design_capacity <= DESIGN_RATIO_NOTE * required:
        return None
    moving = [p.pulldown_time for p in room.products if p.daily_intake > 0]
    if getattr(loads.design_day, "scheduled", False):
        cause = "the busiest hour of the room's schedule sets it; check the schedule and the pull-down times"
    elif moving:
        cause = "the product pulled down in {t} (pulldown_time) sets it; check the pull-down times"
    else:
        cause = "the internal loads all on at once set it; check the appliance, lighting and fan powers"
    return Note.fill(
        f"{room.name}: the design capacity {{d}} is {loads.design_capacity / required:.0f} times the 24-hour figure "
        f"{{r}} because the peak hour governs: " + cause,
        d=(loads.design_capacity, "power"),
        r=(required, "power"),
        t=(min(moving) if moving else 0.0, "hours"),
    )


def project_loads(model: "ProjectModel") -> tuple[RoomLoads, ...]:
    """:func:`room_loads` for every room, in file order."""
    return tuple(room_loads(model, room) for room in model.rooms)
