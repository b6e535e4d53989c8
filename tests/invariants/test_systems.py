"""Rooms on one compressor: the system adds up its members, by routes independent of each other.

- the system's design capacity is the sum of its rooms' design capacities × diversity, for the
  combo demo and for random valid combos (hypothesis, fixed seed); the coils' mass flows add up
  to the compressor's; Q + suction-line gain + compressor input = heat of rejection;
- one coil through the system route is exactly the single-room cycle; two coils at the same
  temperature and superheat are one coil of their summed duty (the mixing changes nothing);
- a warmer coil's vapour leaves the mixture between the two coil outlets (adiabatic mixing);
- every project gets top-level systems: a room in no system is a system of its own.
"""

from __future__ import annotations

import copy
from pathlib import Path

import pytest
from hypothesis import given, settings
from hypothesis import strategies as st

from coldroom.physics.cycle import solve_cycle
from coldroom.physics.system_cycle import solve_system_cycle
from coldroom.inputs.opening import open_project, open_project_data
from coldroom.design.sizing import size_project, size_system

REPO = Path(__file__).resolve().parents[2]
COMBO = REPO / "project_files" / "combo_cooler_freezer.yaml"
PRODUCE = REPO / "project_files" / "produce_cooler.yaml"


def _room(name: str, temperature: float, length: float, fans: float, defrost: str) -> dict:
    return {
        "name": name,
        "temperature": temperature,
        "rh": 0.85,
        "dimensions": {"length": length, "width": 3.0, "height": 2.6},
        "envelope": {
            "walls": {"construction": "panel", "facing": "space", "temperature": 25},
            "ceiling": {"construction": "panel", "facing": "space", "temperature": 28},
            "floor": {"construction": "panel", "facing": "heated_slab", "temperature": 10},
        },
        "doors": [{"name": "door", "wall": "south", "width": 0.9, "height": 2.0, "passages_per_day": 30}],
        "fans": {"count": 1, "power": fans},
        "appliances": [{"name": "door frame heater", "kind": "heater", "power": 50}],
        "defrost": {"type": defrost, "heater_power": 1500 if defrost == "electric" else 0},
    }


def _combo(temperatures: list[float], lengths: list[float], diversity: float, refrigerant: str) -> dict:
    names = [f"Room {i + 1}" for i in range(len(temperatures))]
    return {
        "project": {"name": "Random combo", "units": "SI"},
        "design": {"outdoor_temperature": 32, "outdoor_rh": 0.5},
        "constructions": {"panel": {"layers": [{"material": "pir_panel", "thickness": "120 mm"}]}},
        "rooms": [
            _room(n, t, x, 60.0 + 10 * i, "electric" if t < -5 else "off_cycle")
            for i, (n, t, x) in enumerate(zip(names, temperatures, lengths))
        ],
        "systems": [{"name": "S1", "rooms": names, "refrigerant": refrigerant, "diversity": diversity,
                     "suction_line_drop": "1 K"}],
    }


def _assert_adds_up(system, rooms) -> None:
    members = {r.name: r for r in rooms}
    total = sum(members[m.room].loads.design_capacity for m in system.members)
    assert system.design_capacity == pytest.approx(total * system.diversity, rel=1e-12)
    assert [m.duty for m in system.members] == [members[m.room].loads.design_capacity for m in system.members]
    cyc = system.cycle
    assert cyc.capacity == pytest.approx(system.design_capacity, rel=1e-12)
    assert sum(m.mass_flow for m in system.members) == pytest.approx(cyc.mass_flow, rel=1e-12)
    assert cyc.capacity + cyc.suction_line_heat_gain + cyc.compressor_power == pytest.approx(
        cyc.condenser_duty, rel=1e-9
    )
    coldest = min(m.evaporating_temperature for m in system.members)
    assert system.suction_temperature == pytest.approx(coldest - system.suction_line_drop, abs=1e-12)
    e = system.electrical
    assert e.connected_load >= e.refrigerating_load and e.connected_load >= e.defrost_load
    assert e.refrigerating_load >= e.compressor_input_power + e.evaporator_fan_power
    assert e.daily_energy == pytest.approx(sum(energy for _what, energy in e.daily_energy_parts), rel=1e-12)
    assert 0.0 < e.compressor_run_time <= 86400.0


def test_combo_demo_system_is_the_sum_of_its_rooms() -> None:
    model = open_project(COMBO).model
    result = size_project(model, str(COMBO), COMBO.read_bytes())
    assert [s.name for s in result.systems] == ["CU-1"]
    system = result.systems[0]
    assert system.rooms == ("Cooler", "Freezer")
    _assert_adds_up(system, result.rooms)
    # the cooler's coil is behind an EPR; the freezer sets the suction (less the 1 K line drop)
    cooler, freezer = system.members
    assert cooler.regulated and not freezer.regulated
    assert system.suction_temperature == pytest.approx(freezer.evaporating_temperature - 1.0)
    assert all(r.system == "CU-1" and r.cycle is None for r in result.rooms)


@settings(max_examples=20)
@given(
    temperatures=st.lists(st.floats(min_value=-30.0, max_value=10.0), min_size=2, max_size=3),
    lengths=st.lists(st.floats(min_value=2.0, max_value=8.0), min_size=3, max_size=3),
    diversity=st.floats(min_value=0.6, max_value=1.0),
    refrigerant=st.sampled_from(["R448A", "R134a", "R290"]),
)
def test_random_combos_add_up(temperatures, lengths, diversity, refrigerant) -> None:
    model = open_project_data(_combo(temperatures, lengths[: len(temperatures)], diversity, refrigerant))
    name, entry, indices = model.system_groups()[0]
    system, rooms = size_system(model, name, indices, entry.diversity)
    _assert_adds_up(system, rooms)


def test_one_coil_through_the_system_route_is_the_single_room_cycle() -> None:
    options = dict(subcooling=2.0, isentropic_efficiency=0.65, suction_line_superheat=5.0, suction_pressure_drop=1.0)
    single = solve_cycle("R448A", -25.0, 42.0, 3000.0, superheat=5.0, **options)
    system = solve_system_cycle("R448A", [(-25.0, 5.0, 3000.0)], 42.0, **options)
    assert system == single


def test_two_coils_at_one_temperature_are_one_coil_of_their_summed_duty() -> None:
    one = solve_system_cycle("R134a", [(-8.0, 6.0, 5000.0)], 40.0, suction_line_superheat=3.0)
    two = solve_system_cycle("R134a", [(-8.0, 6.0, 2000.0), (-8.0, 6.0, 3000.0)], 40.0, suction_line_superheat=3.0)
    assert two.mass_flow == pytest.approx(one.mass_flow, rel=1e-9)
    assert two.compressor_power == pytest.approx(one.compressor_power, rel=1e-9)
    assert two.states[0].h == pytest.approx(one.states[0].h, rel=1e-9)
    assert two.evaporator_flows[1] / two.evaporator_flows[0] == pytest.approx(1.5, rel=1e-9)


def test_the_mixture_lies_between_the_coil_outlets() -> None:
    cold = solve_cycle("R448A", -28.0, 40.0, 1000.0, superheat=5.0)
    warm = solve_cycle("R448A", -5.0, 40.0, 1000.0, superheat=5.0)
    mixed = solve_system_cycle("R448A", [(-5.0, 5.0, 1000.0), (-28.0, 5.0, 1000.0)], 40.0)
    assert cold.evaporator_outlet.h < mixed.evaporator_outlet.h < warm.evaporator_outlet.h
    assert mixed.evaporating_temperature == -28.0
    assert mixed.evaporating_pressure == pytest.approx(cold.evaporating_pressure, rel=1e-12)
    # the mixture is warmer than the cold coil's outlet: more work per kg than the cold room alone
    assert mixed.superheat > 5.0


def test_every_project_has_systems_and_each_room_names_its_own() -> None:
    model = open_project(PRODUCE).model
    data = size_project(model, str(PRODUCE), PRODUCE.read_bytes()).to_json()
    assert [s["name"] for s in data["systems"]] == [r["name"] for r in data["rooms"]]
    for system, room in zip(data["systems"], data["rooms"]):
        assert room["system"] == room["name"] == system["name"]
        assert system["rooms"] == [room["name"]]
        assert system["cycle"] == room["cycle"]  # a one-room system is the room's own cycle, unchanged
        assert system["design_capacity_w"] == room["design_capacity_w"]
        assert system["compressor_input_power_w"] == room["cycle"]["compressor_power_w"]


def test_diversity_scales_the_compressor_not_the_coils() -> None:
    data = _combo([2.0, -20.0], [4.0, 3.0], 1.0, "R448A")
    full = open_project_data(data)
    data = copy.deepcopy(data)
    data["systems"][0]["diversity"] = "80 %"
    part = open_project_data(data)
    a, _ = size_system(full, "S1", (0, 1), 1.0)
    b, _ = size_system(part, "S1", (0, 1), 0.8)
    assert b.design_capacity == pytest.approx(0.8 * a.design_capacity, rel=1e-12)
    assert [m.duty for m in b.members] == [m.duty for m in a.members]


def test_transcritical_r744_system_balances_and_its_flows_add_up() -> None:
    # the mixture depends on the gas-cooler outlet enthalpy, which depends on the optimum pressure
    r = solve_system_cycle("R744", [(-4.0, 5.0, 1000.0), (-28.0, 5.0, 2000.0)], None, gas_cooler_outlet_temperature=35.0)
    assert r.transcritical
    assert sum(r.evaporator_flows) == pytest.approx(r.mass_flow, rel=1e-12)
    assert r.capacity + r.suction_line_heat_gain + r.compressor_power == pytest.approx(r.condenser_duty, rel=1e-9)
    # each coil's flow carries its own duty from the common liquid state
    liquid = r.states[2].h
    cold = solve_cycle("R744", -28.0, None, 2000.0, gas_cooler_outlet_temperature=35.0,
                       high_side_pressure=r.discharge_pressure)
    assert r.evaporator_flows[1] == pytest.approx(2000.0 / (cold.evaporator_outlet.h - liquid), rel=1e-9)
