"""Invariants of the whole room load (project file → loads), no external source needed.

- the same room written in SI and in IP gives the same watts (1e-9 relative);
- thicker insulation → less transmission; higher ambient → more load;
- a room with no doors, people, products or lights has only transmission and equipment load.
"""

from __future__ import annotations

import copy

import pytest
from hypothesis import given, settings
from hypothesis import strategies as st

from coldroom.loads import room_loads
from coldroom.inputs.opening import open_project_text
from coldroom.inputs.projectfile import parse_project_data
from coldroom.inputs.safeyaml import load_yaml

from pathlib import Path

TWIN = Path(__file__).resolve().parents[1] / "data" / "si_ip"


def _loads(path):
    model = open_project_text(path.read_bytes(), str(path))
    return room_loads(model, model.rooms[0])


def test_same_room_in_si_and_ip_gives_the_same_watts() -> None:
    si = _loads(TWIN / "room_si.yaml")
    ip = _loads(TWIN / "room_ip.yaml")
    assert si.daily_energy > 0
    for component, watts in si.components_w.items():
        assert ip.components_w[component] == pytest.approx(watts, rel=1e-9, abs=1e-9), component
    for a, b in zip(si.lines, ip.lines):
        assert a.item == b.item
        assert b.daily_energy == pytest.approx(a.daily_energy, rel=1e-9, abs=1e-6)
    assert ip.required_capacity == pytest.approx(si.required_capacity, rel=1e-9)
    assert ip.peak_load == pytest.approx(si.peak_load, rel=1e-9)


def _base():
    return load_yaml((TWIN / "room_si.yaml").read_bytes(), "twin").data


def _with(data, edit):
    data = copy.deepcopy(data)
    edit(data)
    model = parse_project_data(data)
    return room_loads(model, model.rooms[0])


@given(thin=st.floats(20, 200), extra=st.floats(1, 100))
def test_thicker_insulation_less_transmission(thin: float, extra: float) -> None:
    def set_thickness(value):
        def edit(d):
            d["constructions"]["panel"]["layers"][0]["thickness"] = value

        return edit

    a = _with(_base(), set_thickness(thin)).component_energy("transmission")
    b = _with(_base(), set_thickness(thin + extra)).component_energy("transmission")
    assert b < a


@given(t_out=st.floats(10, 40), rise=st.floats(0.5, 10))
def test_higher_ambient_more_load(t_out: float, rise: float) -> None:
    def outdoor(value):
        def edit(d):
            d["design"]["outdoor_temperature"] = value

        return edit

    a = _with(_base(), outdoor(t_out))
    b = _with(_base(), outdoor(t_out + rise))
    assert b.component_energy("transmission") > a.component_energy("transmission")
    assert b.component_energy("infiltration") > a.component_energy("infiltration")
    assert b.daily_energy > a.daily_energy


def test_empty_room_has_only_transmission_and_equipment() -> None:
    def strip(d):
        room = d["rooms"][0]
        for key in ("doors", "products", "people", "lighting"):
            room.pop(key, None)

    loads = _with(_base(), strip)
    components = loads.components_w
    assert components["transmission"] > 0
    assert components["equipment"] > 0
    assert components["product"] == 0.0
    assert components["infiltration"] == 0.0
    assert components["internal"] == 0.0
    assert loads.daily_energy == pytest.approx(
        loads.component_energy("transmission") + loads.component_energy("equipment")
    )


def test_components_add_up_and_capacity_follows_the_method() -> None:
    loads = _loads(TWIN / "room_si.yaml")
    assert sum(loads.components_w.values()) * 86400.0 == pytest.approx(loads.daily_energy, rel=1e-12)
    # ASHRAE Refrigeration, "Refrigerated-Facility Loads": capacity = (1 + SF) × daily energy / run time.
    assert loads.required_capacity == pytest.approx(1.1 * loads.daily_energy / (18 * 3600.0), rel=1e-12)


@settings(max_examples=20)  # each example parses two projects
@given(panel=st.floats(40, 250), length=st.floats(2, 12), width=st.floats(2, 8), height=st.floats(2, 6))
def test_inside_and_outside_dimensions_describe_the_same_room(panel, length, width, height) -> None:
    """Inside dimensions + construction thickness = outside dimensions: same volume, same load;
    outside areas are never smaller than the inside faces."""
    t = panel / 1000.0

    def dims(measured):
        def edit(d):
            d["constructions"]["panel"]["layers"][0]["thickness"] = panel
            grow = measured == "outside"
            d["rooms"][0]["dimensions"] = {
                "length": length + 2 * t * grow, "width": width + 2 * t * grow,
                "height": height + t * grow, "measured": measured,
            }
            d["rooms"][0]["doors"] = []

        return edit

    inside = _with(_base(), dims("inside"))
    outside = _with(_base(), dims("outside"))
    assert outside.volume == pytest.approx(inside.volume, rel=1e-9)
    assert outside.daily_energy == pytest.approx(inside.daily_energy, rel=1e-9)
    for line in inside.lines:
        if line.component == "transmission":
            area = line.basis[1].value
            face = {"north": length * height, "south": length * height, "east": width * height,
                    "west": width * height, "ceiling": length * width, "floor": length * width}
            assert area >= face[line.item.split()[0]] * (1 - 1e-12)
