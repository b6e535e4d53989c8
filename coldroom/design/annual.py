"""Annual electricity, running cost and TEWI of the project and of each option (``coldroom compare``).

For every system and every ambient bin (:mod:`coldroom.inputs.weather`; an EPW file or
``design.ambient_bins``):

1. the rooms' heat gain at that ambient: the 24-hour loads
   (:func:`coldroom.loads.room_loads`) with the outdoor dry bulb set to the bin's
   temperature and the outdoor RH kept at the design RH (our simplification:
   the bins carry temperature only). Only walls and doors that see the outdoor
   air change. The loads are computed on a 5 K grid of ambients that includes
   the design dry bulb and interpolated linearly in between [trade]; a room
   that loses heat to a cold outside counts zero (no heating);
2. the heat rejection: the condenser air follows the weather, keeping its design-day offset
   above the outdoor design temperature (``condenser_air_temperature`` is the design day's);
   with ``condenser_location: indoors`` (a plant room) it stays fixed and so does the design
   condensing temperature. Outdoors the
   condensing temperature floats with the air, + condenser TD, down to
   ``minimum_condensing_temperature`` (default 25 °C [trade]); R-744 past the
   transcritical boundary rejects heat in a gas cooler (outlet = ambient +
   approach; :func:`coldroom.design.sizing.heat_rejection_temperatures`);
3. the compressor chosen at design keeps its displacement: capacity at the
   bin = design capacity × design displacement ÷ the displacement the cycle
   needs there for the design capacity; input scales the same way [trade].
   Cycles are solved on a 2 K grid of condensing (gas-cooler outlet)
   temperatures plus the design point, and interpolated in between, so all
   bins and options on one refrigerant reuse a few cycle solutions;
4. run fraction = heat gain ÷ capacity, capped at 1 (the hours where the unit
   cannot keep up are counted and flagged); compressor and condenser fans run
   for that fraction; evaporator fans, heaters, electric defrost and lights
   for their hours per day.

With a single 8760-hour bin at the design dry bulb this is 365 × the day's
heat gain ÷ the design COP plus the other uses, the figure
:func:`coldroom.design.systems.electrical_figures` gives per day (tests/invariants).

Charge per system: ``charge: 2.5 kg`` (or ``charge: {total: …}``) in the room's
``refrigeration:`` or the system wins; else the estimate of
:func:`coldroom.physics.charge.estimate_charge` from the design cycle, the ``charge:``
volumes and the lines of a ``piping:`` block (without one the lines are left
out and the estimate is low);
TEWI by :func:`coldroom.design.tewi.tewi` with the catalogue's AR4 GWP.
"""

from __future__ import annotations

import bisect
import math
import os
from dataclasses import dataclass, field, replace
from pathlib import Path
from typing import TYPE_CHECKING, Any, Optional, Sequence

from coldroom.constants import SECONDS_PER_DAY_S
from coldroom.errors import CalculationError
from coldroom.inputs.weather import AmbientBin

if TYPE_CHECKING:  # pragma: no cover
    from coldroom.inputs.projectfile import ProjectModel
    from coldroom.design.tewi import Tewi

J_PER_KWH = 3.6e6
#: Spacing of the ambients at which room loads are computed [K] [trade].
LOAD_GRID_STEP = 5.0
#: Spacing of the condensing temperatures at which cycles are solved [K] [trade].
CYCLE_GRID_STEP = 2.0
#: GWP edition used for TEWI (the catalogue's AR4 values, as on the sizing sheet) [ref:ipcc-ar4].
GWP_BASIS = "AR4"
USES = ("compressor", "fans", "defrost", "other")


@dataclass(frozen=True)
class SystemYear:
    """One system over a year (SI; energy in kWh as the trade states it).

    Attributes
    ----------
    name, refrigerant, safety_class : str
    design_capacity : float
        Σ member design capacities × diversity [W].
    compressor_input_power : float
        Electrical input at design [W].
    energy_by_use : dict
        kWh per year under ``compressor``, ``fans``, ``defrost``, ``other``.
    charge : float or None
        Refrigerant charge [kg]; ``None`` when unknown.
    charge_basis : str
    gwp : float
        Catalogue GWP [kg CO2e/kg] (:data:`GWP_BASIS`).
    hours_short : float
        Hours in the year when the design unit cannot keep up [h].
    heating_hours : float
        Hours when a room loses more heat to the cold outside than it gains [h].
    condenser_air_basis : str
        ``"follows outdoor air"`` or ``"fixed (indoors)"`` (:func:`coldroom.rules.condenser_air_basis`).
    """

    name: str
    refrigerant: str
    safety_class: str
    design_capacity: float
    compressor_input_power: float
    energy_by_use: dict
    charge: Optional[float]
    charge_basis: str
    gwp: float
    hours_short: float
    heating_hours: float
    condenser_air_basis: str = "follows outdoor air"


@dataclass(frozen=True)
class OptionYear:
    """The project (``base``) or one option over a year.

    Attributes
    ----------
    name, note : str
    design_capacity : float
        Σ room design capacities [W] (as ``coldroom size`` gives them).
    compressor_input_power : float
        Σ system compressor inputs at design [W].
    systems : tuple of SystemYear
    annual_energy_by_use : dict
        kWh per year by use.
    annual_cost : float
        Currency units per year.
    currency : str
    charge : float or None
        Σ charges [kg]; ``None`` when any system's is unknown.
    gwp : float or None
        Charge-weighted GWP [kg CO2e/kg].
    tewi : Tewi or None
    economics : dict
        The inputs used, with ``defaulted`` naming those that took a default.
    warnings : tuple of str
    blocking : tuple of str
        Plain reasons the option cannot be built as written (empty: feasible).
    """

    name: str
    note: str
    design_capacity: float
    compressor_input_power: float
    systems: tuple
    annual_energy_by_use: dict
    annual_cost: float
    currency: str
    charge: Optional[float]
    gwp: Optional[float]
    tewi: Optional["Tewi"]
    economics: dict
    warnings: tuple = field(default=())
    #: Where this option's ambient came from when it differs from the base's (its own weather file or
    #: bins), else "" (the comparison's ambient_source).
    ambient_source: str = ""
    bins: tuple = ()
    blocking: tuple = field(default=())

    @property
    def feasible(self) -> bool:
        """Nothing blocks building the option as written (:func:`blocking_reasons`)."""
        return not self.blocking

    @property
    def annual_energy(self) -> float:
        """kWh per year."""
        return sum(self.annual_energy_by_use.values())

    @property
    def refrigerants(self) -> list[str]:
        seen: list[str] = []
        for s in self.systems:
            if s.refrigerant not in seen:
                seen.append(s.refrigerant)
        return seen

    def to_json(self, base: Optional["OptionYear"] = None) -> dict:
        """The option's object in ``compare`` JSON (contract keys; SI, units in the key names)."""
        t = self.tewi
        out = {
            "name": self.name,
            "note": self.note,
            "feasible": self.feasible,
            "blocking": list(self.blocking),
            "design_capacity_w": self.design_capacity,
            "compressor_input_power_w": self.compressor_input_power,
            "annual_energy_kwh": self.annual_energy,
            "annual_energy_by_use_kwh": dict(self.annual_energy_by_use),
            "annual_compressor_energy_kwh": self.annual_energy_by_use["compressor"],
            "annual_electricity_cost": self.annual_cost,
            "currency": self.currency,
            "refrigerants": self.refrigerants,
            "safety_classes": [s.safety_class for s in self.systems],
            "gwp": float(self.gwp),
            "gwp_basis": GWP_BASIS,
            "charge_kg": self.charge,
            "tewi_kg_co2e": t.to_json() if t is not None else None,
            "economics": economics_json(self.economics),
            "systems": [
                {
                    "name": s.name,
                    "refrigerant": s.refrigerant,
                    "safety_class": s.safety_class,
                    "design_capacity_w": s.design_capacity,
                    "compressor_input_power_w": s.compressor_input_power,
                    "annual_energy_by_use_kwh": dict(s.energy_by_use),
                    "charge_kg": s.charge,
                    "charge_basis": s.charge_basis,
                    "gwp": float(s.gwp),
                    "unit_short_time_h": s.hours_short,
                    "heat_loss_time_h": s.heating_hours,
                    "condenser_air_basis": s.condenser_air_basis,
                }
                for s in self.systems
            ],
            "warnings": list(self.warnings),
        }
        if self.ambient_source:  # an option with its own climate names it
            out["ambient_source"] = self.ambient_source
            out["ambient_bins"] = bins_json(self.bins)
        if base is not None and self is not base:
            bt = base.tewi
            out["difference_to_base"] = {
                "design_capacity_w": self.design_capacity - base.design_capacity,
                "compressor_input_power_w": self.compressor_input_power - base.compressor_input_power,
                "annual_energy_kwh": self.annual_energy - base.annual_energy,
                "annual_electricity_cost": self.annual_cost - base.annual_cost,
                "tewi_total_kg_co2e": (t.total - bt.total) if t is not None and bt is not None else None,
            }
        return out


def bins_json(bins: Sequence[AmbientBin]) -> list[dict]:
    """Ambient bins as the compare JSON gives them (the comparison's and an option's own)."""
    return [{"temperature_c": b.temperature, "duration_h": b.hours} for b in bins]


def ambient_bins(model: "ProjectModel", cache: Optional[dict] = None) -> tuple[tuple[AmbientBin, ...], str]:
    """The project's ambient bins and where they came from.

    Raises
    ------
    ProjectFileError
        No ``design.weather`` nor ``design.ambient_bins``; or the EPW file is bad (its line named).
    """
    from coldroom.errors import ProjectFileError
    from coldroom.inputs.weather import bins_from_hours, read_epw, weather_path

    d = model.design
    if d.ambient_bins is not None:
        return tuple(AmbientBin(b.temperature, b.hours) for b in d.ambient_bins), "ambient bins in the project file"
    if d.weather is None:
        raise ProjectFileError(
            "the annual energy needs design.weather (an EPW file) or design.ambient_bins", key="design"
        )
    path = weather_path(model)
    assert path is not None
    key = os.path.realpath(path)  # (a link loop is left to the reader, which names it)
    if cache is not None and key in cache:
        return cache[key]
    weather = read_epw(path)
    out = (bins_from_hours(weather.dry_bulb), f"{Path(d.weather).name} ({weather.location or 'EPW'})")
    if cache is not None:
        cache[key] = out
    return out


def _interp(xs: Sequence[float], ys: Sequence[float], x: float) -> float:
    if x <= xs[0]:
        if len(xs) == 1:
            return ys[0]
        return ys[0] + (ys[1] - ys[0]) * (x - xs[0]) / (xs[1] - xs[0])
    if x >= xs[-1]:
        if len(xs) == 1:
            return ys[-1]
        return ys[-1] + (ys[-1] - ys[-2]) * (x - xs[-1]) / (xs[-1] - xs[-2])
    i = bisect.bisect_right(xs, x)
    x0, x1 = xs[i - 1], xs[i]
    return ys[i - 1] + (ys[i] - ys[i - 1]) * (x - x0) / (x1 - x0)


def _grid(low: float, high: float, step: float, exact: float) -> list[float]:
    """Points every *step* covering [low, high], with *exact* among them."""
    points = {exact}
    k = math.floor((low - exact) / step)
    while exact + k * step < high + step:
        points.add(exact + k * step)
        k += 1
    return sorted(points)


class _Context:
    """Caches shared by the base and its options (loads by room content, cycles by settings)."""

    def __init__(self) -> None:
        self.loads: dict = {}
        self.cycles: dict = {}
        self.weather: dict = {}


def _room_daily_energy(model: "ProjectModel", room_index: int, temperatures: list[float], ctx: _Context) -> list[float]:
    """The room's 24-hour heat gain [J/day] at each outdoor dry bulb (cached by the project's content)."""
    from coldroom.loads import outdoor_relative_humidity, room_loads

    d = model.design
    rh = outdoor_relative_humidity(d)
    content = model.model_dump_json(exclude={"options", "economics", "systems", "design"})
    design_key = d.model_dump_json(exclude={"outdoor_temperature", "weather", "ambient_bins"})
    out = []
    for t in temperatures:
        key = (content, design_key, room_index, round(t, 6))
        if key not in ctx.loads:
            design = d.model_copy(update={"outdoor_temperature": t, "outdoor_rh": rh, "outdoor_wet_bulb": None})
            copy = model.model_copy(update={"design": design})
            ctx.loads[key] = room_loads(copy, copy.rooms[room_index]).daily_energy
        out.append(ctx.loads[key])
    return out


def _lighting_energy_per_day(room: Any) -> float:
    """Electricity of the room's lights per day [J]: power (or density × floor area) × hours."""
    light = room.lighting
    if light is None:
        return 0.0
    power = light.power if light.power is not None else (light.power_density or 0.0) * room.floor_area
    return power * light.hours


def system_year(
    model: "ProjectModel", name: str, indices: tuple[int, ...], diversity: float, bins: Sequence[AmbientBin],
    ctx: _Context,
) -> tuple[SystemYear, "Any", tuple[str, ...]]:
    """One system over the year: (SystemYear, its SystemDesign, warnings)."""
    from coldroom.design import systems as _systems
    from coldroom.design.sizing import member_draw, design_system, heat_rejection_temperatures
    from coldroom.rules import condenser_air_at, condenser_air_basis

    d = design_system(model, name, indices, diversity)
    r = d.settings[0]
    cyc = d.cycle
    warnings: list[str] = []
    # 1. heat gain per bin
    temps = [b.temperature for b in bins]
    design_t = model.design.outdoor_temperature
    grid = _grid(min(temps), max(temps), LOAD_GRID_STEP, design_t)
    gains = [0.0] * len(bins)
    heat_loss_hours = 0.0
    for i in indices:
        per_grid = _room_daily_energy(model, i, grid, ctx)
        for k, b in enumerate(bins):
            e = _interp(grid, per_grid, b.temperature)
            if e < 0.0:
                heat_loss_hours += b.hours
                e = 0.0
            gains[k] += e / SECONDS_PER_DAY_S  # W
    # 2. heat rejection per bin
    indoor = r.condenser_location == "indoors"
    td = d.temps[0].condenser_td
    design_key = (d.info.name, d.coils, r.subcooling, r.isentropic_efficiency, r.suction_line_superheat,
                  r.suction_line_drop, r.clearance)

    def rejection(ambient: float) -> tuple[Optional[float], Optional[float]]:
        if indoor:
            return d.condensing, d.gas_cooler
        air = condenser_air_at(ambient, design_t, d.air, r.condenser_location)  # the design offset kept
        return heat_rejection_temperatures(
            d.info.name, max(air + td, r.minimum_condensing_temperature), air, r.gas_cooler_approach
        )

    def solved(level: float, transcritical: bool) -> tuple[float, float]:
        """(capacity ratio, input ratio) to design at a condensing (or gas-cooler outlet) temperature."""
        key = design_key + (transcritical, round(level, 6))
        if key not in ctx.cycles:
            # displacement and power only (the grid needs no other figure of the cycle)
            displacement, power = (d.cycle_at(None, level, performance_only=True) if transcritical
                                   else d.cycle_at(level, None, performance_only=True))
            ratio = cyc.displacement / displacement
            ctx.cycles[key] = (ratio, power * ratio / cyc.compressor_power)
        return ctx.cycles[key]

    levels = {False: [], True: []}  # type: dict
    points = [rejection(t) for t in temps]
    for cond, gc in points:
        levels[gc is not None].append(gc if gc is not None else cond)
    tables = {}
    for transcritical, values in levels.items():
        if not values:
            continue
        exact = d.gas_cooler if transcritical else d.condensing
        if exact is None:
            exact = values[0]
        xs = _grid(min(values), max(values), CYCLE_GRID_STEP, exact)
        xs = [x for x in xs if min(values) - CYCLE_GRID_STEP < x < max(values) + CYCLE_GRID_STEP] or [exact]
        pairs = []
        failed = []
        for x in xs:
            try:
                pairs.append((x, solved(x, transcritical)))
            except CalculationError:
                failed.append(x)
        if failed:
            # a grid point with no cycle: a bin beside it is solved at its own point, never
            # extrapolated across the gap; a bin with no cycle at all is named (exit 1)
            lost: dict[float, str] = {}
            for value in sorted(set(values)):
                if any(abs(value - x) < CYCLE_GRID_STEP for x in failed):
                    try:
                        pairs.append((value, solved(value, transcritical)))
                    except CalculationError as exc:
                        lost[value] = str(exc)
            if lost:
                ambients = sorted(t for t, point in zip(temps, points)
                                  if (point[1] if transcritical else point[0]) in lost)
                what = "gas-cooler outlet" if transcritical else "condensing"
                first = min(lost)
                raise CalculationError(
                    f"system {name!r}: no cycle at the ambient bin{'s' if len(ambients) > 1 else ''} "
                    f"{', '.join(f'{t:g}' for t in ambients)} °C ({what} {first:g} °C and above: {lost[first]}); "
                    "the year cannot be counted (lower the condenser temperature difference, or give bins the "
                    "unit can run at)"
                )
            pairs.sort(key=lambda pair: pair[0])
        if not pairs:
            raise CalculationError(f"system {name!r}: no cycle solves over the year's ambients")
        tables[transcritical] = ([p[0] for p in pairs], [p[1][0] for p in pairs], [p[1][1] for p in pairs])
    # 3. energy per bin
    fan_c = _systems.condenser_fan_power(cyc.condenser_duty, r.condenser_fan_power)[0]
    draws = [member_draw(model.rooms[i], x) for i, x in zip(indices, d.loads)]
    evap_fans = sum(m.evaporator_fan_power * m.evaporator_fan_time for m in draws) / SECONDS_PER_DAY_S  # W average
    heaters = sum(m.heater_energy for m in draws) / SECONDS_PER_DAY_S
    defrost = sum(m.defrost_heater_power * m.defrost_time for m in draws) / SECONDS_PER_DAY_S
    lights = sum(_lighting_energy_per_day(model.rooms[i]) for i in indices) / SECONDS_PER_DAY_S
    compressor = fans = other = defrost_e = 0.0
    short = 0.0
    for b, gain, (cond, gc) in zip(bins, gains, points):
        transcritical = gc is not None
        xs, caps, inputs = tables[transcritical]
        level = gc if transcritical else cond
        capacity = d.capacity * _interp(xs, caps, level)
        power = cyc.compressor_power * _interp(xs, inputs, level)
        run = gain / capacity if capacity > 0 else 1.0
        if run > 1.0:
            short += b.hours
            run = 1.0
        seconds = b.hours * 3600.0
        compressor += power * run * seconds
        fans += (fan_c * run + evap_fans) * seconds
        defrost_e += defrost * seconds
        other += (heaters + lights) * seconds
    if short > 0:
        warnings.append(f"system {name}: the design unit cannot keep up for {short:g} h of the year (run capped at 100 %)")
    if heat_loss_hours > 0:
        warnings.append(
            f"system {name}: for {heat_loss_hours:g} room-hours a room loses heat to the cold outside "
            "(counted as no load; no heating allowed for)"
        )
    charge, basis = _charge(r, d)
    info = d.info
    return (
        SystemYear(
            name=name,
            refrigerant=info.name,
            safety_class=info.safety_class,
            design_capacity=d.capacity,
            compressor_input_power=cyc.compressor_power,
            energy_by_use={
                "compressor": compressor / J_PER_KWH,
                "fans": fans / J_PER_KWH,
                "defrost": defrost_e / J_PER_KWH,
                "other": other / J_PER_KWH,
            },
            charge=charge,
            charge_basis=basis,
            gwp=info.gwp_ar4,
            hours_short=short,
            heating_hours=heat_loss_hours,
            condenser_air_basis=condenser_air_basis(r.condenser_location),
        ),
        d,
        tuple(warnings),
    )


def _charge(settings: Any, design: Any) -> tuple[Optional[float], str]:
    """The system's charge [kg] and its basis: the sizing's (a stated ``charge:`` wins there), with its origin."""
    works = design.pipework
    if works is None:  # pragma: no cover - design_system always estimates
        return None, "unknown"
    if works.charge.stated:
        return works.charge.total, "given in the project file"
    if works.piping is None:
        return works.charge.total, "estimated: evaporator and condenser (no piping: block, lines left out)"
    return works.charge.total, "estimated: lines, evaporator and condenser"


def economics_of(model: "ProjectModel") -> dict:
    """The economics inputs with defaults filled in and named in ``defaulted``."""
    from coldroom.design import tewi as _tewi

    e = model.economics
    defaults = {
        "electricity_price": _tewi.DEFAULT_ELECTRICITY_PRICE,
        "currency": _tewi.DEFAULT_CURRENCY,
        "emission_factor": _tewi.DEFAULT_EMISSION_FACTOR,
        "service_life": _tewi.DEFAULT_SERVICE_LIFE,
        "leakage_rate": _tewi.DEFAULT_LEAKAGE_RATE,
        "recovery_factor": _tewi.DEFAULT_RECOVERY_FACTOR,
    }
    out: dict = {}
    defaulted = []
    for key, default in defaults.items():
        value = getattr(e, key)
        if value is None:
            value = default
            defaulted.append(key)
        out[key] = value
    out["defaulted"] = defaulted
    return out


#: economics keys of the project file -> their JSON keys (the unit in the name, DEVELOPERS.md "JSON output")
ECONOMICS_JSON_KEYS = {
    "electricity_price": "electricity_price_per_kwh",
    "currency": "currency",
    "emission_factor": "emission_factor_kg_co2e_per_kwh",
    "service_life": "service_life_years",
    "leakage_rate": "annual_leakage_fraction",
    "recovery_factor": "recovery_factor",
}


def economics_json(economics: dict) -> dict:
    """The ``economics`` object of an option in JSON: :func:`economics_of` with unit-named keys.

    ``defaulted`` keeps the project file's key names (what the user may set).
    """
    out: dict = {ECONOMICS_JSON_KEYS[key]: value for key, value in economics.items() if key in ECONOMICS_JSON_KEYS}
    out["defaulted"] = list(economics.get("defaulted", ()))
    return out


def option_year(
    model: "ProjectModel", name: str, note: str, ctx: _Context, bins: Optional[Sequence[AmbientBin]] = None
) -> OptionYear:
    """The project *model* (the base or one option) over a year."""
    from coldroom.design.tewi import tewi

    if bins is None:
        bins = ambient_bins(model, ctx.weather)[0]
    systems = []
    designs = []
    warnings: list[str] = []
    for sys_name, entry, indices in model.system_groups():
        year, design, w = system_year(
            model, sys_name, indices, entry.diversity if entry is not None else 1.0, bins, ctx
        )
        systems.append(year)
        designs.append(design)
        warnings.extend(w)
    by_use = {use: sum(s.energy_by_use[use] for s in systems) for use in USES}
    econ = economics_of(model)
    energy = sum(by_use.values())
    charges = [s.charge for s in systems]
    if any(c is None for c in charges):
        charge = gwp = None
        result_tewi = None
    else:
        charge = sum(charges)  # type: ignore[arg-type]
        gwp = sum(s.gwp * s.charge for s in systems) / charge if charge > 0 else 0.0  # type: ignore[operator]
        result_tewi = tewi(
            gwp, charge, econ["leakage_rate"], econ["service_life"], econ["recovery_factor"], energy,
            econ["emission_factor"],
        )
    return OptionYear(
        blocking=blocking_reasons(model, designs),
        name=name,
        note=note,
        design_capacity=sum(x.design_capacity for d in designs for x in d.loads),
        compressor_input_power=sum(s.compressor_input_power for s in systems),
        systems=tuple(systems),
        annual_energy_by_use=by_use,
        annual_cost=energy * econ["electricity_price"],
        currency=econ["currency"],
        charge=charge,
        gwp=gwp,
        tewi=result_tewi,
        economics=econ,
        warnings=tuple(warnings),
    )


def blocking_reasons(model: "ProjectModel", designs: Sequence[Any]) -> tuple[str, ...]:
    """Why an option cannot be built as written; empty when it can.

    Blocking: a charge over a charge limit with no measures stated (``charge.measures``), or one
    not permitted at all; a design discharge temperature over its family's limit
    (:func:`coldroom.rules.discharge_temperature_limit`); a pressure ratio with no standard
    single-stage application (:func:`coldroom.rules.single_stage_application`); an existing unit
    (``existing_unit``, fixed) that does not hold its room.
    """
    from coldroom.design.existing import check_room
    from coldroom.physics import charge as charge_rules
    from coldroom.rules import discharge_temperature_limit, single_stage_application

    reasons: list[str] = []
    for d in designs:
        works = d.pipework
        measures = d.settings[0].charge.measures
        if works is not None:
            for limit in works.limits:
                if limit.verdict == charge_rules.WITHIN or (limit.verdict == charge_rules.OVER and measures):
                    continue
                why = "not permitted" if limit.verdict == charge_rules.NOT_PERMITTED else "no measures stated"
                reasons.append(
                    f"system {d.name}: charge {limit.charge:.3g} kg over the limit {limit.limit or 0.0:.3g} kg "
                    f"({limit.rule}; {why})"
                )
        cyc = d.cycle
        ceiling = discharge_temperature_limit(d.info.name)
        if cyc.discharge_temperature > ceiling:
            reasons.append(
                f"system {d.name}: discharge temperature {cyc.discharge_temperature:.0f} °C over the {ceiling:.0f} °C "
                f"limit for {d.info.name}"
            )
        if not single_stage_application(cyc.pressure_ratio, d.suction):
            reasons.append(
                f"system {d.name}: pressure ratio {cyc.pressure_ratio:.1f} has no standard single-stage application "
                "(two stages or a compound system)"
            )
    for room in model.rooms:
        if room.existing_unit is None:
            continue
        try:
            check = check_room(model, room, chart=False)
        except CalculationError as exc:
            reasons.append(f"room {room.name}: existing unit {room.existing_unit.name}: {exc}")
            continue
        if check is not None and not check.holds:
            reasons.append(f"room {room.name}: existing unit {room.existing_unit.name}: {check.verdict}")
    return tuple(reasons)


@dataclass(frozen=True)
class Comparison:
    """The base and its options over a year, with where the ambient came from."""

    project_name: str
    ambient_source: str
    bins: tuple
    options: tuple

    def to_json(self) -> dict:
        base = self.options[0]
        return {
            "ambient_source": self.ambient_source,
            "ambient_bins": bins_json(self.bins),
            "options": [o.to_json(base) for o in self.options],
        }


def compare(model: "ProjectModel") -> Comparison:
    """The base (``name: "base"``) and every option of *model* over a year.

    Raises
    ------
    ProjectFileError
        No ambient given, or a bad weather file.
    CalculationError
        A cycle cannot be solved (the message names the option and the system).
    """
    ctx = _Context()
    bins, source = ambient_bins(model, ctx.weather)
    results = [option_year(model, "base", "the project as written", ctx, bins)]
    for name, note, option_model in model._option_models:
        own_bins, own_source = bins, ""
        if (option_model.design.weather, option_model.design.ambient_bins) != (
            model.design.weather, model.design.ambient_bins
        ):
            own_bins, own_source = ambient_bins(option_model, ctx.weather)
        try:
            year = option_year(option_model, name, note, ctx, own_bins)
        except CalculationError as exc:
            raise type(exc)(f"option {name!r}: {exc}") from None
        if own_source:
            year = replace(year, ambient_source=own_source, bins=tuple(own_bins))
        results.append(year)
    return Comparison(model.project.name, source, tuple(bins), tuple(results))
