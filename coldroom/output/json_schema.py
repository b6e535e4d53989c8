"""Typed definitions of every ``--json`` document, and their JSON Schema (draft 2020-12).

One ``TypedDict`` per JSON object, one line per key: **a new key in a ``to_json`` is one new line
here**, in the class named after the object (the test of every demo's output against the schema
fails until it is added, since no object admits keys it does not list). ``NotRequired[...]``
marks a key that is sometimes absent; ``Optional[...]`` a value that may be ``null``. Keys follow
the naming rule of DEVELOPERS.md "JSON output" (tests/cli/test_json_contract.py walks them).

:func:`result_schema` turns the definitions into the schema with pydantic's ``TypeAdapter``;
pydantic is imported there only, so this module stays light.
"""

from typing import Any, Literal, Optional

from typing_extensions import NotRequired, TypedDict

# --- the envelope (coldroom.output.json_contract) -----------------------------------------------


class Versions(TypedDict):
    coldroom: str
    coolprop: str
    python: str


class Project(TypedDict):
    name: str
    client: str
    site: str
    prepared_by: str
    date: str
    units: Literal["SI", "IP"]
    file: str
    sha256: str


class Envelope(TypedDict):
    schema_version: str
    command: str
    versions: Versions
    project: Optional[Project]


# --- the cycle (coldroom.physics.cycle.CycleResult.to_json) -------------------------------------


class State(TypedDict):
    p_pa: float
    t_c: float
    h_j_kg: float
    s_j_kg_k: float
    quality: Optional[float]


class Cycle(TypedDict):
    refrigerant: str
    property_model: str
    evaporating_temperature_c: float
    condensing_temperature_c: Optional[float]
    gas_cooler_outlet_temperature_c: Optional[float]
    transcritical: bool
    capacity_w: float
    superheat_k: float
    subcooling_k: float
    isentropic_efficiency: float
    suction_line_superheat_k: float
    suction_pressure_drop_k: float
    discharge_pressure_drop_k: float
    clearance: float
    polytropic_exponent: float
    evaporating_pressure_pa: float
    suction_pressure_pa: float
    discharge_pressure_pa: float
    refrigerating_effect_j_kg: float
    mass_flow_kg_s: float
    suction_volume_flow_m3_h: float
    volumetric_efficiency: float
    displacement_m3_h: float
    compressor_power_w: float
    compressor_power_basis: str
    condenser_duty_w: float
    suction_line_heat_gain_w: float
    cop: float
    carnot_cop: Optional[float]
    carnot_ratio: Optional[float]
    discharge_temperature_c: float
    isentropic_discharge_temperature_c: float
    pressure_ratio: float
    glide_evaporator_k: float
    glide_condenser_k: Optional[float]
    optimum_high_side_pressure_liao_pa: Optional[float]
    safety_class: str
    gwp_ar4: float
    warnings: list[str]
    states: list[State]


# --- a room's loads (coldroom.results.RoomLoads.to_json) ----------------------------------------


class LoadsByComponent(TypedDict):
    transmission: float
    product: float
    infiltration: float
    internal: float
    equipment: float


class Term(TypedDict):
    value_si: float
    kind: str
    prefix: str
    suffix: str
    sep: str


class LoadLine(TypedDict):
    component: str
    item: str
    daily_energy_kwh: float
    average_power_w: float
    basis_si: str
    basis_terms: list[Term]


class RoomLoads(TypedDict):
    name: str
    loads_w: LoadsByComponent
    daily_energy_kwh: float
    safety_factor: float
    daily_run_time_h: float
    daily_run_time_basis: str
    required_capacity_w: float
    peak_load_w: float
    peak_load_basis: str
    hourly_load_w: Optional[list[float]]
    daily_energy_basis: str
    peak_hour: Optional[int]
    hourly_outdoor_temperature_c: Optional[list[float]]
    design_capacity_w: float
    design_capacity_governed_by: str
    volume_m3: float
    floor_area_m2: float
    dimensions_measured: Optional[str]
    transmission_area_basis: str
    lines: list[LoadLine]
    warnings: list[str]


# --- pull-down, existing unit (coldroom.loads.pulldown, coldroom.equipment.verdict, unit_limits) -


class PulldownProduct(TypedDict):
    name: str
    time_to_final_temperature_h: Optional[float]
    final_temperature_c: float
    asked_time_h: Optional[float]
    meets_asked_time: bool


class Pulldown(TypedDict):
    time_to_final_temperature_h: Optional[float]
    unit: Optional[Literal["design", "selected", "existing"]]
    lowest_room_air_temperature_c: float
    highest_room_air_temperature_c: float
    hours_above_setpoint_plus_2k: Optional[float]  # spelled by issue 24 (a contract key)
    time_h: list[float]
    product_temperature_c: list[float]
    room_air_temperature_c: list[float]
    product: Optional[str]
    asked_time_h: Optional[float]
    meets_asked_time: bool
    products: list[PulldownProduct]
    simulated_time_h: float
    basis: str


class CheckChart(TypedDict):
    ambient_temperature_c: list[float]
    unit_capacity_w: list[Optional[float]]
    room_load_w: list[Optional[float]]


class ReplacementDuty(TypedDict):
    capacity_w: float
    evaporating_temperature_c: Optional[float]
    condensing_temperature_c: Optional[float]


class ExistingUnit(TypedDict):
    name: str
    refrigerant: str
    model: str
    verdict: str
    holds: bool
    within_envelope: bool
    suitable: bool
    not_suitable_reason: Optional[str]
    room_temperature_c: float
    ambient_temperature_c: float
    balance_evaporating_temperature_c: Optional[float]
    balance_condensing_temperature_c: Optional[float]
    capacity_at_balance_w: Optional[float]
    power_at_balance_w: Optional[float]
    heat_rejection_at_balance_w: Optional[float]
    mass_flow_kg_s: Optional[float]
    discharge_temperature_c: Optional[float]
    pressure_ratio: Optional[float]
    required_capacity_w: float
    peak_capacity_w: float
    daily_energy_kwh: float
    safety_factor: float
    daily_run_time_available_h: float
    daily_run_time_needed_h: Optional[float]
    margin_percent: Optional[float]
    max_ambient_temperature_c: Optional[float]
    max_ambient_temperature_status: str
    evaporator_basis: str
    condenser_basis: str
    compressor_basis: list[str]
    warnings: list[str]
    chart: CheckChart
    # what the unit can still do (coldroom.design.unit_limits.UnitLimits.to_json)
    coldest_held_room_temperature_c: NotRequired[Optional[float]]
    coldest_held_room_temperature_status: NotRequired[str]
    max_daily_intake_kg: NotRequired[Optional[float]]
    replacement_duty: NotRequired[ReplacementDuty]
    medium_temperature_unit_at_low_suction: NotRequired[Optional[str]]
    remedies: NotRequired[list[str]]
    pulldown: NotRequired[Optional[Pulldown]]


# --- size: rooms and systems (coldroom.results, coldroom.design.pipework) -----------------------


class SizingBasisItem(TypedDict):
    item: str
    value: str


class SizedRoom(RoomLoads):
    system: str
    evaporating_temperature_c: Optional[float]
    condensing_temperature_c: Optional[float]
    condenser_air_temperature_c: Optional[float]
    sizing_basis: list[SizingBasisItem]
    cycle: Optional[Cycle]
    pulldown: Optional[Pulldown]
    existing_unit: NotRequired[ExistingUnit]


class SystemMember(TypedDict):
    room: str
    evaporating_temperature_c: float
    duty_w: float
    superheat_k: float
    mass_flow_kg_s: float
    evaporator_pressure_regulator: bool


class DailyElectricityByUse(TypedDict):
    compressor: float
    condenser_fans: float
    evaporator_fans: float
    heaters: float
    defrost_heaters: float


class PipeLine(TypedDict):
    line: str
    tube: str
    outside_diameter_mm: float
    inside_diameter_mm: float
    length_m: float
    rise_m: float
    equivalent_length_m: float
    velocity_m_s: float
    pressure_drop_pa: float
    static_pressure_change_pa: float
    saturation_temperature_drop_k: float
    limit_k: float
    within_limit: bool
    oil_return_ok: Optional[bool]
    oil_minimum_velocity_m_s: Optional[float]
    next_smaller_outside_diameter_mm: Optional[float]
    next_smaller_saturation_temperature_drop_k: Optional[float]
    viscosity_basis: str
    warnings: list[str]


class Piping(TypedDict):
    tube_series: str
    minimum_load_fraction: float
    lines: list[PipeLine]
    notes: list[str]
    suction_drop_in_cycle_k: float
    discharge_drop_in_cycle_k: float
    liquid_subcooling_at_valve_k: Optional[float]


class ChargePart(TypedDict):
    part: str
    charge_kg: float
    basis: str


class Charge(TypedDict):
    total_kg: float
    basis: Literal["stated", "estimate"]
    parts: list[ChargePart]
    estimate_kg: NotRequired[float]  # the estimate, beside a stated charge


class ChargeLimit(TypedDict):
    rule: str
    charge_kg: float
    limit_kg: Optional[float]
    verdict: str
    working: str


class ChargeLimitBasis(TypedDict):
    room: str
    room_volume_m3: float
    occupancy_category: str
    location_class: str
    defaults_used: list[str]
    self_contained: bool


class System(TypedDict):
    name: str
    rooms: list[str]
    equipment_basis: Literal["design", "selected", "existing"]
    refrigerant: str
    suction_temperature_c: float
    condensing_temperature_c: Optional[float]
    condenser_air_temperature_c: float
    condenser_air_basis: Literal["follows outdoor air", "fixed (indoors)"]
    suction_line_drop_k: float
    diversity: float
    design_capacity_w: float
    heat_of_rejection_w: float
    cycle: Cycle
    members: list[SystemMember]
    compressor_input_power_w: float
    compressor_input_power_basis: str
    evaporator_fan_power_w: float
    condenser_fan_power_w: float
    condenser_fan_power_basis: str
    defrost_heater_power_w: float
    other_heater_power_w: float
    refrigerating_load_w: float
    defrost_load_w: float
    connected_load_w: float
    connected_load_case: str
    compressor_daily_run_time_h: float
    daily_electricity_kwh: float
    daily_electricity_by_use_kwh: DailyElectricityByUse
    warnings: list[str]
    piping: Optional[Piping]
    charge: NotRequired[Charge]
    charge_limits: NotRequired[list[ChargeLimit]]
    charge_limit_basis: NotRequired[ChargeLimitBasis]


# --- check ---------------------------------------------------------------------------------------


class CheckedRoom(TypedDict):
    name: str
    required_capacity_w: float
    existing_unit: Optional[ExistingUnit]


# --- select (coldroom.design.selection) ---------------------------------------------------------


class UnitCooler(TypedDict):
    room: str
    model: str
    count: int
    price: float
    unit_price: float
    duty_w: float
    evaporator_td_k: float
    capacity_at_td_w: float
    rule: str
    rejected: dict[str, int]


class Balance(TypedDict):
    evaporating_temperature_c: Optional[float]
    condensing_temperature_c: Optional[float]
    capacity_w: Optional[float]
    daily_run_time_needed_h: Optional[float]
    margin_percent: Optional[float]
    max_ambient_temperature_c: Optional[float]
    max_ambient_temperature_status: str
    power_w: Optional[float]


class CondensingUnit(TypedDict):
    model: str
    price: float
    balance: Balance
    #: the chosen unit as a project file's ``existing_unit`` block (project-file keys and quantities)
    existing_unit: NotRequired[Optional[dict[str, Any]]]


class UnitOption(TypedDict):
    condensing_unit: CondensingUnit
    unit_coolers: list[UnitCooler]
    total_price: float


class SystemSelection(UnitOption):
    system: str
    rooms: list[str]
    refrigerant: str
    required_capacity_w: float
    daily_run_time_available_h: float
    condenser_air_temperature_c: float
    currency: str
    alternatives: list[UnitOption]
    rejected: dict[str, int]
    candidates: int
    warnings: list[str]


# --- compare (coldroom.design.annual, coldroom.design.tewi) -------------------------------------


class AmbientBin(TypedDict):
    temperature_c: float
    duration_h: float


class EnergyByUse(TypedDict):
    compressor: float
    fans: float
    defrost: float
    other: float


class Tewi(TypedDict):
    direct_leakage: float
    direct_end_of_life: float
    indirect: float
    total: float


class Economics(TypedDict):
    electricity_price_per_kwh: float
    currency: str
    emission_factor_kg_co2e_per_kwh: float
    service_life_years: float
    annual_leakage_fraction: float
    recovery_factor: float
    defaulted: list[str]


class OptionSystem(TypedDict):
    name: str
    refrigerant: str
    safety_class: str
    design_capacity_w: float
    compressor_input_power_w: float
    annual_energy_by_use_kwh: EnergyByUse
    charge_kg: Optional[float]
    charge_basis: str
    gwp: Optional[float]
    unit_short_time_h: float
    heat_loss_time_h: float
    condenser_air_basis: Literal["follows outdoor air", "fixed (indoors)"]


class DifferenceToBase(TypedDict):
    design_capacity_w: float
    compressor_input_power_w: float
    annual_energy_kwh: float
    annual_electricity_cost: float
    tewi_total_kg_co2e: Optional[float]


class Option(TypedDict):
    name: str
    note: str
    feasible: bool
    blocking: list[str]
    design_capacity_w: float
    compressor_input_power_w: float
    annual_energy_kwh: float
    annual_energy_by_use_kwh: EnergyByUse
    annual_compressor_energy_kwh: float
    annual_electricity_cost: float
    currency: str
    refrigerants: list[str]
    safety_classes: list[str]
    gwp: Optional[float]
    gwp_basis: str
    charge_kg: Optional[float]
    tewi_kg_co2e: Optional[Tewi]
    economics: Economics
    systems: list[OptionSystem]
    warnings: list[str]
    difference_to_base: NotRequired[DifferenceToBase]
    #: an option with its own climate (design.weather or ambient_bins changed) names it
    ambient_source: NotRequired[str]
    ambient_bins: NotRequired[list[AmbientBin]]


# --- quote (coldroom.design.quote, valves, electrical_schedule) --------------------------------


class QuoteLine(TypedDict):
    section: str
    item: str
    model: Optional[str]
    quantity: float  # in `unit`
    unit: str
    unit_price: Optional[float]
    total_price: Optional[float]
    price_needed: bool
    basis: str


class Valve(TypedDict):
    room: str
    model: Optional[str]
    duty_w: float
    capacity_at_conditions_w: float
    pressure_drop_pa: float
    subcooling_k: float


class ElectricalItem(TypedDict):
    item: str
    model: str
    supply: str
    running_current_a: float
    locked_rotor_current_a: Optional[float]
    estimated: bool
    basis: str
    minimum_circuit_ampacity_a: NotRequired[float]
    maximum_overcurrent_protection_a: NotRequired[Optional[float]]
    overcurrent_basis: NotRequired[Optional[str]]


class ElectricalSchedule(TypedDict):
    system: str
    electrical_code: Literal["IEC", "NEC"]
    items: list[ElectricalItem]
    total_running_current_a: float
    notes: list[str]
    minimum_circuit_ampacity_a: NotRequired[float]
    maximum_overcurrent_protection_a: NotRequired[float]
    overcurrent_basis: NotRequired[str]


class Quote(TypedDict):
    lines: list[QuoteLine]
    subtotal_price: float
    margin_percent: float
    margin_price: float
    tax_percent: float
    tax_price: float
    total_price: float
    currency: str
    complete: bool
    missing_prices: list[str]
    valves: list[Valve]
    electrical: list[ElectricalSchedule]
    warnings: list[str]


# --- the documents: the envelope and each command's body ----------------------------------------


class LoadOutput(Envelope):
    rooms: list[RoomLoads]
    warnings: list[str]


class SizeOutput(Envelope):
    systems: list[System]
    rooms: list[SizedRoom]
    warnings: list[str]


class CheckOutput(Envelope):
    rooms: list[CheckedRoom]
    systems: NotRequired[list[System]]


class SelectOutput(Envelope):
    catalogue: str
    currency: str
    selection: list[SystemSelection]
    total_price: float
    rooms: NotRequired[list[SizedRoom]]
    systems: NotRequired[list[System]]


class CompareOutput(Envelope):
    ambient_source: str
    ambient_bins: list[AmbientBin]
    options: list[Option]


class CycleOutput(Envelope, Cycle):
    pass


class QuoteOutput(Envelope):
    catalogue: str
    quote: Quote


#: The document type of each command.
OUTPUTS: dict[str, type] = {
    "load": LoadOutput,
    "size": SizeOutput,
    "check": CheckOutput,
    "select": SelectOutput,
    "compare": CompareOutput,
    "cycle": CycleOutput,
    "quote": QuoteOutput,
}


def _closed(node: Any) -> None:
    """No object admits a key it does not list (``additionalProperties: false``), recursively;
    pydantic's generated titles ("Total Kg") are dropped: the key names say it."""
    if isinstance(node, dict):
        if node.get("type") == "object" and "properties" in node:
            node.setdefault("additionalProperties", False)
            for value in node["properties"].values():
                if isinstance(value, dict):
                    value.pop("title", None)
        for value in node.values():
            _closed(value)
    elif isinstance(node, list):
        for value in node:
            _closed(value)


def result_schema(command: str) -> dict[str, Any]:
    """The JSON Schema (draft 2020-12) of *command*'s ``--json`` document.

    Examples
    --------
    >>> s = result_schema("cycle")
    >>> s["$schema"], s["properties"]["command"]["const"], s["properties"]["project"]["type"]
    ('https://json-schema.org/draft/2020-12/schema', 'cycle', 'null')
    """
    from pydantic import TypeAdapter

    from coldroom.output.json_contract import SCHEMA_VERSION

    schema = TypeAdapter(OUTPUTS[command]).json_schema(ref_template="#/$defs/{model}")
    _closed(schema)
    properties = schema["properties"]
    properties["schema_version"] = {"const": SCHEMA_VERSION, "type": "string"}
    properties["command"] = {"const": command, "type": "string"}
    if command == "cycle":  # no project file
        properties["project"] = {"type": "null"}
    return {
        "$schema": "https://json-schema.org/draft/2020-12/schema",
        **{key: value for key, value in schema.items() if key != "title"},
        "title": f"coldroom {command} --json (schema_version {SCHEMA_VERSION})",
    }
