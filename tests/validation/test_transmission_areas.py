"""Transmission areas are the outside surface of each section.

Source: ASHRAE Handbook—Refrigeration (SI), chapter "Refrigerated-Facility Loads",
transmission load: q = U·A·ΔT with A the outside area of the section [mem]
[ref:ashrae-refrig-loads]. The box convention (length and width over the walls,
height from the top of the floor over the ceiling; the floor's own area over the
outside length × width) is ours [trade]. The expected areas below are worked by hand.
"""

from __future__ import annotations

import copy

import pytest

from coldroom.loads import room_loads
from coldroom.inputs.projectfile import parse_project_data

PANEL = 0.100  # m, walls and ceiling
SLAB = 0.250  # m, floor build-up
INSIDE = (4.0, 3.0, 2.6)  # m, length × width × height


def _project(dimensions: dict, **room_extra) -> dict:
    return {
        "project": {"name": "areas", "units": "SI"},
        "design": {"outdoor_temperature": 30, "outdoor_rh": 0.5, "ground_temperature": 10},
        "constructions": {
            "panel": {"layers": [{"material": "pur_panel", "thickness": PANEL * 1000}]},
            "slab": {"layers": [{"material": "concrete", "thickness": 150},
                                {"material": "extruded_polystyrene", "thickness": 100}]},
        },
        "rooms": [
            {
                "name": "Box",
                "temperature": 2,
                "dimensions": dimensions,
                "envelope": {
                    "walls": {"construction": "panel", "facing": "space", "temperature": 25},
                    "ceiling": {"construction": "panel", "facing": "space", "temperature": 25},
                    "floor": {"construction": "slab", "facing": "ground"},
                },
                **room_extra,
            }
        ],
    }


def _room(data: dict):
    model = parse_project_data(data)
    return model, model.rooms[0]


def _inside() -> dict:
    length, width, height = INSIDE
    return {"length": length, "width": width, "height": height}


def test_outside_areas_worked_by_hand() -> None:
    _, room = _room(_project(_inside()))
    # outside length 4 + 2×0.1 = 4.2 m, width 3 + 2×0.1 = 3.2 m, wall height 2.6 + 0.1 = 2.7 m
    assert room.transmission_area("north") == (pytest.approx(4.2 * 2.7), "outside")
    assert room.transmission_area("east") == (pytest.approx(3.2 * 2.7), "outside")
    assert room.transmission_area("ceiling") == (pytest.approx(4.2 * 3.2), "outside")
    assert room.transmission_area("floor") == (pytest.approx(4.2 * 3.2), "outside")
    # the 100 mm demo case of the review: walls +9 %, ceiling +12 % over inside areas
    assert room.transmission_area("north")[0] / (4.0 * 2.6) == pytest.approx(1.090, abs=1e-3)
    assert room.transmission_area("ceiling")[0] / (4.0 * 3.0) == pytest.approx(1.120, abs=1e-3)
    # volume (air changes, checks) and floor area (lighting) stay inside
    assert room.inside_volume == pytest.approx(4.0 * 3.0 * 2.6)
    assert room.floor_area == pytest.approx(12.0)


def test_load_line_uses_outside_area_and_says_so() -> None:
    model, room = _room(_project(_inside()))
    loads = room_loads(model, room)
    north = next(line for line in loads.lines if line.item.startswith("north"))
    u, area, dt = north.basis[:3]
    assert area.value == pytest.approx(4.2 * 2.7) and area.suffix == " outside"
    assert north.average_power == pytest.approx(u.value * 4.2 * 2.7 * 23.0)
    assert loads.transmission_area_basis == "outside"
    assert loads.to_json()["dimensions_measured"] == "inside"
    assert loads.to_json()["transmission_area_basis"] == "outside"


def test_outside_dimensions_give_the_same_room() -> None:
    length, width, height = INSIDE
    outside = {"length": length + 2 * PANEL, "width": width + 2 * PANEL, "height": height + PANEL,
               "measured": "outside"}
    model_in, room_in = _room(_project(_inside()))
    model_out, room_out = _room(_project(outside))
    assert room_out.inside_volume == pytest.approx(room_in.inside_volume)
    for side in ("north", "east", "south", "west", "ceiling", "floor"):
        assert room_out.transmission_area(side)[0] == pytest.approx(room_in.transmission_area(side)[0])
    a, b = room_loads(model_in, room_in), room_loads(model_out, room_out)
    assert b.daily_energy == pytest.approx(a.daily_energy, rel=1e-12)
    assert b.to_json()["dimensions_measured"] == "outside"


def test_given_areas_are_taken_as_given() -> None:
    data = _project(_inside())
    data["rooms"][0]["envelope"]["ceiling"]["area"] = 10.0
    model, room = _room(data)
    assert room.transmission_area("ceiling") == (10.0, "given")
    assert room_loads(model, room).transmission_area_basis == "outside, given"


def test_u_value_construction_counts_its_given_thickness() -> None:
    data = _project(_inside())
    data["constructions"]["panel"] = {"u_value": 0.22, "thickness": 150}
    _, room = _room(data)
    assert room.transmission_area("north")[0] == pytest.approx(4.3 * 2.75)
    data["constructions"]["panel"] = {"u_value": 0.22}  # thickness unknown: inside face
    _, room = _room(data)
    assert room.transmission_area("north")[0] == pytest.approx(4.0 * 2.6)


def test_outside_dimensions_smaller_than_the_walls_are_refused() -> None:
    from coldroom.errors import ProjectFileError
    from coldroom.inputs.opening import open_project_data

    bad = copy.deepcopy(_project({"length": 0.15, "width": 3, "height": 2.6, "measured": "outside"}))
    with pytest.raises(ProjectFileError, match="dimensions: inside volume"):
        open_project_data(bad)
