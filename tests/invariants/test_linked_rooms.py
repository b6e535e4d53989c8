"""Rooms that face each other: the same physics by another route, and the credit rule.

- a surface written ``facing: room`` gives the same line (energy and working)
  as the same surface written ``facing: space`` with the other room's
  temperature; a door ``to_room`` the same as ``other_side_*`` with that
  room's temperature and RH;
- heat lost to a colder neighbour is not credited by default (the line stays,
  with its working and "not credited"); ``credit: true`` credits it; the
  colder room always counts the heat it gains;
- the two rooms' partition lines balance: what the warm room loses is what the
  cold room gains (same U, area and opposite ΔT).
"""

from __future__ import annotations

import copy

import pytest
from hypothesis import given
from hypothesis import strategies as st

from coldroom.loads import room_loads
from coldroom.inputs.projectfile import parse_project_data

BASE = {
    "project": {"name": "Linked", "units": "SI"},
    "design": {"outdoor_temperature": 32, "outdoor_rh": 0.5, "ground_temperature": 12},
    "constructions": {"panel": {"layers": [{"material": "pir_panel", "thickness": "120 mm"}]}},
    "rooms": [
        {
            "name": "Cooler",
            "temperature": 2,
            "rh": 0.85,
            "dimensions": {"length": 4, "width": 3, "height": 2.6},
            "envelope": {
                "walls": {"construction": "panel", "facing": "space", "temperature": 24},
                "east": {"construction": "panel", "facing": "room", "room": "Freezer"},
                "ceiling": {"construction": "panel", "facing": "space", "temperature": 28},
                "floor": {"construction": "panel", "facing": "ground"},
            },
        },
        {
            "name": "Freezer",
            "temperature": -20,
            "rh": 0.9,
            "dimensions": {"length": 2.5, "width": 3, "height": 2.6},
            "envelope": {
                "walls": {"construction": "panel", "facing": "space", "temperature": 24},
                "west": {"construction": "panel", "facing": "room", "room": "Cooler"},
                "ceiling": {"construction": "panel", "facing": "space", "temperature": 28},
                "floor": {"construction": "panel", "facing": "heated_slab", "temperature": 10},
            },
            "doors": [
                {"name": "into the cooler", "wall": "west", "width": 0.8, "height": 2.0,
                 "passages_per_day": 40, "open_time": 5, "to_room": "Cooler"}
            ],
        },
    ],
}


def _line(data: dict, room: int, item_start: str):
    model = parse_project_data(data)
    loads = room_loads(model, model.rooms[room])
    return next(line for line in loads.lines if line.item.startswith(item_start))


def _with(changes: dict) -> dict:
    data = copy.deepcopy(BASE)
    for (room, path), value in changes.items():
        target = data["rooms"][room]
        *parents, last = path
        for key in parents:
            target = target[key]
        target[last] = value
    return data


def _as_space(data: dict, room: int, side: str, temperature: float, credit: bool = False) -> dict:
    out = copy.deepcopy(data)
    surface = {"construction": "panel", "facing": "space", "temperature": temperature}
    if credit:
        surface["credit"] = True
    out["rooms"][room]["envelope"][side] = surface
    return out


def test_partition_facing_room_equals_facing_space_at_that_temperature() -> None:
    # the freezer's west wall gains from the +2 °C cooler: written both ways
    by_room = _line(BASE, 1, "west")
    by_space = _line(_as_space(BASE, 1, "west", 2.0), 1, "west")
    assert by_room.item == "west (room: Cooler)"  # the line names the other room
    assert by_space.item == "west (adjacent space)"
    assert by_room.daily_energy > 0
    assert by_room.daily_energy == by_space.daily_energy
    assert by_room.basis == by_space.basis


def test_door_to_room_equals_other_side_at_that_rooms_conditions() -> None:
    by_room = _line(BASE, 1, "door")
    data = copy.deepcopy(BASE)
    door = data["rooms"][1]["doors"][0]
    del door["to_room"]
    door["other_side_temperature"] = 2.0
    door["other_side_rh"] = 0.85
    by_values = _line(data, 1, "door")
    assert by_room.daily_energy > 0
    assert by_room.daily_energy == by_values.daily_energy
    assert by_room.basis == by_values.basis


def test_loss_to_a_colder_room_is_not_credited_by_default() -> None:
    line = _line(BASE, 0, "east")
    assert line.daily_energy == 0.0
    text = " ".join(f"{t.prefix}{t.suffix}" for t in line.basis)
    assert "not credited" in text
    loss = [t for t in line.basis if t.kind == "power"]
    assert loss and loss[0].value < 0  # the working still shows the heat that leaves
    # the same rule for a colder space written as facing: space
    space = _line(_as_space(BASE, 0, "east", -20.0), 0, "east")
    assert space.daily_energy == 0.0


def test_credit_true_credits_the_loss_and_the_lines_balance() -> None:
    data = _with({(0, ("envelope", "east", "credit")): True})
    cooler = _line(data, 0, "east")
    freezer = _line(data, 1, "west")
    assert cooler.daily_energy < 0
    assert "not credited" not in " ".join(t.suffix for t in cooler.basis)
    assert cooler.daily_energy == pytest.approx(-freezer.daily_energy, rel=1e-12)
    # credit: true on the colder room changes nothing: it gains, never loses
    data = _with({(1, ("envelope", "west", "credit")): True})
    assert _line(data, 1, "west").daily_energy == _line(BASE, 1, "west").daily_energy


@given(
    warm=st.floats(min_value=-10.0, max_value=20.0),
    cold=st.floats(min_value=-40.0, max_value=20.0),
    credit=st.booleans(),
)
def test_facing_room_and_facing_space_agree_for_any_temperatures(warm: float, cold: float, credit: bool) -> None:
    data = _with({(0, ("temperature",)): warm, (1, ("temperature",)): cold})
    if credit:
        data["rooms"][0]["envelope"]["east"]["credit"] = True
    by_room = _line(data, 0, "east")
    by_space = _line(_as_space(data, 0, "east", cold, credit), 0, "east")
    assert by_room.daily_energy == by_space.daily_energy
    assert by_room.basis == by_space.basis
    if not credit:
        assert by_room.daily_energy >= 0.0
