"""The quote (``coldroom quote``): the bill of quantities of a job, priced from the catalogue.

:func:`build_quote` takes the sized project, the equipment chosen by ``select``
and the catalogue, and lists every line with the rule or the room it came from
(``basis``):

* **panels** — m² per thickness (:func:`panel_surfaces`): the outside faces of
  the insulated box (the areas the load uses, :meth:`Room.transmission_area`),
  walls and ceilings, floors only where their construction is a panel; a
  partition between two rooms of the project counted once (with the room that
  lists it first); door openings deducted from their wall. A construction is a
  panel when its layers are sandwich-panel cores (``*_panel``, steel skins
  allowed) or, given by a U-value, its description says "panel"; it takes the
  catalogue panel of the same thickness (±1 mm);
* **doors** — one per project door, the smallest catalogue door (by area) that
  covers the opening;
* **equipment** — coils and condensing units of the selection;
* **expansion valves** — one per coil, rated at the coil's conditions
  (:mod:`coldroom.design.valves`);
* **accessories** — filter drier, sight glass and liquid solenoid per system,
  by the liquid line's tube outside diameter (or by capacity when the
  catalogue gives capacities or the project no liquid line); an evaporator
  pressure regulator for every room held above the system's suction
  temperature, by the suction line's diameter (or capacity); an isolator per
  condensing unit and per coil, by its electrical input (AC-23A rating);
* **tube** — metres per size from the ``piping:`` lengths plus the
  ``quote.tube_allowance``; suction-line insulation the same metres;
* **refrigerant** — kg of the system's charge (a stated ``charge:`` wins);
* **labour** — the catalogue's hours per task × the quantity it is per × ``quote.labour_rate``.

A line without a catalogue price has ``price_needed: true``, no price and makes
the quote incomplete (``complete: false``); it is never counted as zero.
Money: line total = quantity × unit price; margin = subtotal × margin;
tax = (subtotal + margin) × tax rate; total = subtotal + margin + tax.
"""

from __future__ import annotations

from dataclasses import dataclass, field
from typing import TYPE_CHECKING, Any, Optional, Sequence

if TYPE_CHECKING:  # pragma: no cover
    from coldroom.design.selection import SystemSelection
    from coldroom.inputs.catalogue import Catalogue
    from coldroom.inputs.projectfile import ProjectModel, QuoteSettings
    from coldroom.results import ProjectResult

SECTIONS = ("panels", "doors", "equipment", "valves", "accessories", "pipework", "refrigerant", "electrical",
            "labour")
#: Catalogue panel thickness matching a construction within this [m] (common practice, no source).
THICKNESS_MATCH = 0.001
#: Tube outside diameter matching an accessory's connection within this [m].
CONNECTION_MATCH = 0.0005


@dataclass(frozen=True)
class QuoteLine:
    """One line of the bill of quantities (prices in the catalogue's currency)."""

    section: str
    item: str
    model: Optional[str]
    quantity: float
    unit: str
    unit_price: Optional[float]
    basis: str

    @property
    def price_needed(self) -> bool:
        return self.unit_price is None

    @property
    def total_price(self) -> Optional[float]:
        return None if self.unit_price is None else self.quantity * self.unit_price

    def to_json(self) -> dict[str, Any]:
        return {
            "section": self.section, "item": self.item, "model": self.model, "quantity": self.quantity,
            "unit": self.unit, "unit_price": self.unit_price, "total_price": self.total_price,
            "price_needed": self.price_needed, "basis": self.basis,
        }


@dataclass(frozen=True)
class PanelSurface:
    """One wall, ceiling or floor face of a room as the panel count sees it (SI)."""

    room: str
    side: str
    construction: str
    thickness: Optional[float]
    gross_area: float
    door_area: float
    counted: bool
    note: str = ""

    @property
    def net_area(self) -> float:
        return max(self.gross_area - self.door_area, 0.0) if self.counted else 0.0


@dataclass(frozen=True)
class Quote:
    """The priced bill of quantities and what goes with it."""

    lines: tuple[QuoteLine, ...]
    margin: float
    tax_rate: float
    currency: str
    valves: tuple = ()
    electrical: tuple = ()
    panels: tuple[PanelSurface, ...] = ()
    warnings: tuple[str, ...] = ()
    settings: Any = None
    selections: tuple = ()

    @property
    def subtotal_price(self) -> float:
        return sum(line.total_price for line in self.lines if line.total_price is not None)

    @property
    def margin_price(self) -> float:
        return self.subtotal_price * self.margin

    @property
    def tax_price(self) -> float:
        return (self.subtotal_price + self.margin_price) * self.tax_rate

    @property
    def total_price(self) -> float:
        return self.subtotal_price + self.margin_price + self.tax_price

    @property
    def missing_prices(self) -> list[str]:
        return [f"{line.section}: {line.item}" + (f" ({line.model})" if line.model else "")
                for line in self.lines if line.price_needed]

    @property
    def complete(self) -> bool:
        return not self.missing_prices

    def to_json(self) -> dict[str, Any]:
        return {
            "lines": [line.to_json() for line in self.lines],
            "subtotal_price": self.subtotal_price,
            "margin_percent": self.margin * 100.0,
            "margin_price": self.margin_price,
            "tax_percent": self.tax_rate * 100.0,
            "tax_price": self.tax_price,
            "total_price": self.total_price,
            "currency": self.currency,
            "complete": self.complete,
            "missing_prices": self.missing_prices,
            "valves": [v.to_json() for v in self.valves],
            "electrical": [e.to_json() for e in self.electrical],
            "warnings": [str(w) for w in self.warnings],
        }


# --------------------------------------------------------------------------- panels


def panel_thickness(construction: Any) -> Optional[float]:
    """The thickness [m] of a construction that is an insulated panel, else None (module notes)."""
    if construction.layers is not None:
        names = [layer.material or "" for layer in construction.layers]
        if any(n.endswith("_panel") for n in names) and all(n.endswith("_panel") or n == "steel" for n in names):
            return construction.overall_thickness
        return None
    if "panel" in construction.description.lower() and construction.thickness:
        return construction.thickness
    return None


def panel_surfaces(model: "ProjectModel") -> tuple[PanelSurface, ...]:
    """Every wall, ceiling and floor face of every room, with what the panel count takes of it."""
    from coldroom.inputs.projectfile import SIDES, WALLS

    surfaces: dict[tuple[str, str], PanelSurface] = {}
    owner: dict[tuple[str, str], tuple[str, str]] = {}  # a shared partition's second face -> the first
    for room in model.rooms:
        for side in SIDES:
            surface = room.envelope.side(side)
            ref = surface.construction
            name = ref if isinstance(ref, str) else "(inline)"
            construction = model.construction(ref)
            thickness = panel_thickness(construction)
            area, _basis = room.transmission_area(side)
            counted, note = thickness is not None, "" if thickness is not None else "not a panel construction"
            if surface.facing == "room" and surface.room is not None:
                other = model.room_named(surface.room)
                mirror = next((s for s in SIDES if other.envelope.side(s).facing == "room"
                               and other.envelope.side(s).room == room.name), None)
                if mirror is not None and (other.name, mirror) in surfaces:
                    counted, note = False, f"partition shared with {other.name}: counted there"
                    owner[(room.name, side)] = (other.name, mirror)
            surfaces[(room.name, side)] = PanelSurface(room.name, side, name, thickness, area, 0.0, counted, note)
    for room in model.rooms:
        for door in room.doors:
            sides = [door.wall] if door.wall is not None else [s for s in WALLS if surfaces[(room.name, s)].counted]
            if not sides:
                continue
            key = owner.get((room.name, sides[0]), (room.name, sides[0]))
            s = surfaces[key]
            surfaces[key] = PanelSurface(s.room, s.side, s.construction, s.thickness, s.gross_area,
                                         s.door_area + door.width * door.height, s.counted, s.note)
    return tuple(surfaces.values())


def _pick(entries: Sequence[Any], key: Any, fits: Any) -> Optional[Any]:
    """The entry with the smallest *key* among those that *fit*, else None."""
    candidates = [e for e in entries if fits(e)]
    return min(candidates, key=key) if candidates else None


def _panel_lines(model: "ProjectModel", catalogue: "Catalogue") -> tuple[list[QuoteLine], tuple[PanelSurface, ...]]:
    from coldroom.units import display

    system = model.project.units
    surfaces = panel_surfaces(model)
    by_thickness: dict[float, list[PanelSurface]] = {}
    for s in surfaces:
        if s.counted and s.thickness is not None:
            by_thickness.setdefault(round(s.thickness, 4), []).append(s)
    lines = []
    for thickness, group in sorted(by_thickness.items()):
        area = round(sum(s.net_area for s in group), 2)
        panel = _pick(catalogue.panels, lambda p: p.price, lambda p: abs(p.thickness - thickness) <= THICKNESS_MATCH)
        parts = ", ".join(f"{s.room} {s.side} {s.net_area:.2f}" + (f" (door {s.door_area:.2f} off)" if s.door_area else "")
                          for s in group)
        lines.append(QuoteLine(
            "panels", f"insulated panel {display(thickness, 'thickness', system)}", panel.model if panel else None, area, "m²",
            panel.price if panel else None,
            f"outside faces, m²: {parts}" + ("" if panel else f"; no {thickness * 1e3:.0f} mm panel in the catalogue"),
        ))
    return lines, surfaces


def _door_lines(model: "ProjectModel", catalogue: "Catalogue") -> list[QuoteLine]:
    from coldroom.units import display

    system = model.project.units
    lines = []
    for room in model.rooms:
        for door in room.doors:
            entry = _pick(catalogue.doors, lambda d: (d.width * d.height, d.price),
                          lambda d: d.width >= door.width - 1e-9 and d.height >= door.height - 1e-9)
            lines.append(QuoteLine(
                "doors", f"door {display(door.width, 'length', system, 2)} × {display(door.height, 'length', system, 2)}"
                f", {room.name}: {door.name}",
                entry.model if entry else None, 1, "item", entry.price if entry else None,
                f"{room.name}, door '{door.name}': smallest catalogue door covering the opening"
                if entry else f"{room.name}, door '{door.name}': no catalogue door covers the opening",
            ))
    return lines


# --------------------------------------------------------------------------- equipment, valves, accessories


def _coil_entry(catalogue: "Catalogue", model: str) -> Any:
    return next(c for c in catalogue.unit_coolers if c.model == model)


def _accessory(catalogue: "Catalogue", role: str, diameter: Optional[float], capacity: float) -> tuple[Any, str]:
    """The accessory of *role* for a tube of outside *diameter* [m] (or a *capacity* [W]) and how it was chosen."""
    of_role = [a for a in catalogue.accessories if a.role == role]
    if diameter is not None:
        entry = _pick(of_role, lambda a: a.price, lambda a: a.connection is not None
                      and abs(a.connection - diameter) <= CONNECTION_MATCH)
        if entry is not None:
            return entry, f"connection {diameter * 1e3:g} mm = the line's tube"
    entry = _pick(of_role, lambda a: (a.capacity, a.price), lambda a: a.capacity is not None and a.capacity >= capacity)
    if entry is not None:
        return entry, f"smallest capacity ≥ {capacity:.0f} W"
    wanted = f"{diameter * 1e3:g} mm connection" if diameter is not None else f"{capacity:.0f} W"
    return None, f"no {role.replace('_', ' ')} for {wanted} in the catalogue"


def _system_lines(
    model: "ProjectModel", catalogue: "Catalogue", selection: "SystemSelection", system: Any,
    settings: "QuoteSettings", valves: list, schedules: list, warnings: list, counts: dict,
) -> list[QuoteLine]:
    """Equipment, valves, accessories, pipework, refrigerant and isolators of one system."""
    from coldroom.design.electrical_schedule import SystemSchedule, coil_item, condensing_unit_item
    from coldroom.design.valves import DISTRIBUTOR_ALLOWANCE, ValveConditions, choose_valve

    name = selection.system
    lines: list[QuoteLine] = []
    unit = selection.choice
    check = unit.check
    refrigeration = model.refrigeration_for(model.room_named(selection.coolers[0].room))
    for c in selection.coolers:
        lines.append(QuoteLine("equipment", f"unit coolers, {c.room}", c.model, c.count, "item", c.unit_price,
                               f"{c.room}: {c.rule} (select)"))
        counts["unit_cooler"] += c.count
    lines.append(QuoteLine("equipment", f"condensing unit, {name}", unit.model, 1, "item", unit.price,
                           f"system {name}: cheapest catalogue unit that holds (select)"))
    counts["condensing_unit"] += 1
    # valves at each coil's conditions
    pipework = system.pipework
    piping = pipework.piping if pipework is not None else None
    liquid = piping.line("liquid") if piping is not None else None
    suction = piping.line("suction") if piping is not None else None
    at_valve = pipework.valve_subcooling if pipework is not None else None
    if at_valve is not None and at_valve <= 0.0:
        warnings.append(f"system {name}: no subcooling left at the expansion valves (flash gas before the valves): "
                        "the valve capacities are optimistic; subcool more or enlarge the liquid line")
    condensing = check.balance_condensing if check.balance_condensing is not None else system.condensing_temperature
    distributor = settings.distributor_pressure_drop
    distributor = DISTRIBUTOR_ALLOWANCE if distributor is None else distributor
    for c in selection.coolers:
        conditions = ValveConditions(selection.refrigerant, c.evaporating_temperature, condensing,
                                     refrigeration.subcooling,
                                     liquid.total_pressure_change if liquid is not None else 0.0, distributor,
                                     at_valve)
        choice = choose_valve(catalogue.expansion_valves, c.room, c.duty / c.count, conditions)
        valves.append(choice)
        if choice.warning:
            warnings.append(choice.warning)
        lines.append(QuoteLine("valves", f"expansion valve, {c.room}", choice.model, c.count, "item", choice.price,
                               f"{c.room}: {choice.basis}"))
    # accessories per system by the liquid line, EPR per regulated room
    duty = selection.required_capacity
    liquid_od = liquid.chosen.tube.outside_diameter if liquid is not None else None
    for role, label in (("filter_drier", "filter drier"), ("sight_glass", "sight glass"),
                        ("solenoid_valve", "liquid solenoid valve")):
        entry, how = _accessory(catalogue, role, liquid_od, duty)
        lines.append(QuoteLine("accessories", f"{label}, {name}", entry.model if entry else None, 1, "item",
                               entry.price if entry else None, f"system {name}, liquid line: {how}"))
    regulated = {m.room for m in system.members if m.regulated}
    suction_od = suction.chosen.tube.outside_diameter if suction is not None else None
    for c in selection.coolers:
        if c.room in regulated:
            entry, how = _accessory(catalogue, "pressure_regulator", suction_od, c.duty)
            lines.append(QuoteLine(
                "accessories", f"evaporator pressure regulator, {c.room}", entry.model if entry else None, 1,
                "item", entry.price if entry else None,
                f"{c.room} held at {c.evaporating_temperature:.1f} °C above the system's suction "
                f"{system.suction_temperature:.1f} °C: {how}",
            ))
    # pipework: metres per size, suction insulation
    if piping is not None:
        sizes: dict[str, list] = {}
        for line in piping.lines:
            sizes.setdefault(line.chosen.tube.label, []).append(line)
        allowance = settings.tube_allowance
        for size, runs in sizes.items():
            length = sum(r.spec.length for r in runs)
            metres = round(length * (1.0 + allowance), 2)
            counts["pipework"] += metres
            tube = _pick(catalogue.tubes, lambda t: t.price, lambda t: t.series == piping.tube_series and t.size == size)
            runs_text = " + ".join(f"{r.line} {r.spec.length:g} m" for r in runs)
            lines.append(QuoteLine(
                "pipework", f"copper tube {size}, {name}", f"{piping.tube_series} {size}", metres, "m",
                tube.price if tube else None,
                f"system {name}: {runs_text}, + {allowance * 100:.0f} % allowance"
                + ("" if tube else "; size not in the catalogue"),
            ))
        for run in [r for r in piping.lines if r.line == "suction"]:
            size = run.chosen.tube.label
            metres = round(run.spec.length * (1.0 + allowance), 2)
            lag = _pick(catalogue.insulation, lambda i: i.price, lambda i: i.tube_size == size)
            lines.append(QuoteLine(
                "pipework", f"suction insulation on {size}, {name}",
                f"{lag.thickness * 1e3:.0f} mm" if lag else None, metres, "m", lag.price if lag else None,
                f"system {name}: suction {run.spec.length:g} m + {allowance * 100:.0f} % allowance"
                + ("" if lag else "; no insulation for this size in the catalogue"),
            ))
    else:
        warnings.append(f"system {name}: no piping: block, so no tube, insulation or pipework labour is quoted")
    # refrigerant
    if pipework is not None:
        charge = pipework.charge
        entry = _pick(catalogue.refrigerants, lambda r: r.price, lambda r: _same_refrigerant(r.refrigerant,
                                                                                        selection.refrigerant))
        lines.append(QuoteLine(
            "refrigerant", f"refrigerant {selection.refrigerant}", selection.refrigerant, round(charge.total, 2), "kg",
            entry.price if entry else None,
            f"system {name}: charge {'stated in the project' if charge.stated else 'estimated'}",
        ))
    # electrical: schedule and isolators
    code = settings.electrical_code
    unit_power = (check.power_at_balance or 0.0) + (unit.entry.fan_power or 0.0)
    items = [condensing_unit_item(unit.entry, check.power_at_balance or 0.0, code)]
    entry, how = _accessory(catalogue, "isolator", None, unit_power)
    lines.append(QuoteLine("electrical", f"isolator, condensing unit {name}", entry.model if entry else None, 1,
                           "item", entry.price if entry else None, f"beside the unit, {unit_power:.0f} W: {how}"))
    for c in selection.coolers:
        coil = _coil_entry(catalogue, c.model)
        items.append(coil_item(c, coil, code))
        load = coil.fan_power + coil.defrost_heater_power
        entry, how = _accessory(catalogue, "isolator", None, load)
        lines.append(QuoteLine("electrical", f"isolator, unit cooler {c.room}", entry.model if entry else None,
                               c.count, "item", entry.price if entry else None,
                               f"one per coil, {load:.0f} W each (fans + defrost): {how}"))
    from coldroom.design.electrical_schedule import IEC_NOTE, NEC_NOTE

    schedules.append(SystemSchedule(name, tuple(items), code, (NEC_NOTE if code == "NEC" else IEC_NOTE,)))
    counts["system"] += 1
    return lines


def _same_refrigerant(a: str, b: str) -> bool:
    from coldroom.data import refrigerants

    return refrigerants.lookup(a).name == refrigerants.lookup(b).name


LABOUR_QUANTITY = {  # task -> (count key, what the quantity is)
    "panels": ("panel_area", "m² of panel"),
    "door": ("door", "doors"),
    "condensing_unit": ("condensing_unit", "condensing units"),
    "unit_cooler": ("unit_cooler", "unit coolers"),
    "pipework": ("pipework", "m of tube"),
    "electrical": ("system", "systems"),
    "commissioning": ("system", "systems"),
}


def _labour_lines(catalogue: "Catalogue", settings: "QuoteSettings", counts: dict) -> list[QuoteLine]:
    lines = []
    rate = settings.labour_rate if settings.labour_rate > 0 else None
    for task, (key, what) in LABOUR_QUANTITY.items():
        amount = counts.get(key, 0.0)
        if amount <= 0:
            continue
        entry = next((x for x in catalogue.labour if x.task == task), None)
        if entry is None:
            lines.append(QuoteLine("labour", task.replace("_", " "), None, 0.0, "h", None,
                                   f"{amount:g} {what}; no hours for '{task}' in the catalogue"))
            continue
        hours = round(entry.hours * amount, 2)
        lines.append(QuoteLine(
            "labour", task.replace("_", " "), None, hours, "h", rate,
            f"{entry.hours:g} h per {entry.per} × {amount:g} {what}"
            + ("" if rate is not None else "; quote.labour_rate not given"),
        ))
    return lines


def build_quote(
    model: "ProjectModel",
    catalogue: "Catalogue",
    result: "ProjectResult",
    selections: Sequence["SystemSelection"],
) -> Quote:
    """The whole quote (module notes)."""
    from coldroom.inputs.projectfile import QuoteSettings

    settings = model.quote if model.quote is not None else QuoteSettings()
    warnings: list[str] = []
    if model.quote is None:
        warnings.append("the project has no quote: block: no margin, no tax, no labour rate, 30 days' validity")
    panel_lines, surfaces = _panel_lines(model, catalogue)
    counts: dict[str, float] = {"panel_area": sum(line.quantity for line in panel_lines),
                                "door": sum(len(r.doors) for r in model.rooms),
                                "condensing_unit": 0, "unit_cooler": 0, "pipework": 0.0, "system": 0}
    lines = panel_lines + _door_lines(model, catalogue)
    systems = {s.name: s for s in result.systems}
    valves: list = []
    schedules: list = []
    body: list[QuoteLine] = []
    for selection in selections:
        body += _system_lines(model, catalogue, selection, systems[selection.system], settings, valves, schedules,
                              warnings, counts)
    order = {name: k for k, name in enumerate(SECTIONS)}
    lines += sorted(body, key=lambda line: order[line.section])
    lines += _labour_lines(catalogue, settings, counts)
    currency = catalogue.currency
    if model.economics.currency is not None and model.economics.currency != currency:
        warnings.append(f"the project's economics.currency {model.economics.currency} differs from the catalogue's "
                        f"{currency}: the quote is in {currency}")
    return Quote(tuple(lines), settings.margin, settings.tax_rate, currency, tuple(valves), tuple(schedules),
                 surfaces, tuple(warnings), settings, tuple(selections))
