"""Property tests for the project file: valid input always computes, hostile input only ever fails cleanly.

Invariants (no external source needed; the capacity formula is the ASHRAE
Handbook—Refrigeration "Refrigerated-Facility Loads" relation
[ref:ashrae-refrig-loads], required capacity = (1 + SF) · daily energy / run time):

- a random valid project (dimensions, temperatures below outdoors,
  constructions, doors, products from the product table, people, lights, fans,
  defrost) validates and its load computes: every line finite, every line
  ≥ 0 except transmission through a surface whose far side is colder than
  the room; the components sum to the total; the JSON's required capacity is
  (1 + SF) · E / run time with SF and run time as written in the file;
- random bytes, random text and random YAML documents (also a valid project
  with one value swapped for junk) never raise anything but
  :class:`ProjectFileError` from :func:`coldroom.inputs.opening.open_project_text`.

Hypothesis runs with the derandomized profile in tests/conftest.py.
"""

from __future__ import annotations

import copy
import math

import yaml
from hypothesis import assume, given, settings
from hypothesis import strategies as st

from coldroom.physics.products import get_product, product_keys
from coldroom.errors import ProjectFileError
from coldroom.loads import room_loads
from coldroom.inputs.opening import open_project_text
from coldroom.inputs.projectfile import ProjectModel, parse_project_data

PRODUCTS = product_keys()
INSULATION = ("pur_panel", "pir_panel", "extruded_polystyrene", "expanded_polystyrene", "polyurethane", "glass_fibre")


def _t(value: float) -> str:
    return f"{value:.3f} °C"


@st.composite
def valid_projects(draw: st.DrawFn) -> tuple[dict, dict]:
    """A valid project dict (SI, strings with units) and the facts the checks need."""
    outdoor = draw(st.floats(15.0, 45.0))
    room_t = draw(st.floats(-30.0, min(20.0, outdoor - 3.0)))
    length = draw(st.floats(2.0, 30.0))
    width = draw(st.floats(2.0, 20.0))
    height = draw(st.floats(2.2, 8.0))
    constructions = {
        "wall": {"layers": [{"material": draw(st.sampled_from(INSULATION)), "thickness": f"{draw(st.floats(50, 250)):.1f} mm"}]},
        "known": {"u_value": f"{draw(st.floats(0.1, 0.6)):.3f} W/m²K"},
    }
    neighbour = {}

    def surface(side: str) -> dict:
        facing = draw(st.sampled_from(["outdoors", "space", "roof_void"] if side != "floor" else ["ground", "heated_slab", "space"]))
        s: dict = {"construction": draw(st.sampled_from(["wall", "known"])), "facing": facing}
        if facing == "outdoors":
            s["colour"] = draw(st.sampled_from(["light", "medium", "dark"]))
            neighbour[side] = outdoor
        elif facing == "ground":
            neighbour[side] = 12.0  # design.ground_temperature, default
        else:
            t = draw(st.floats(-30.0, 45.0)) if facing != "heated_slab" else draw(st.floats(2.0, 13.0))
            s["temperature"] = _t(t)
            neighbour[side] = t
        return s

    envelope = {side: surface(side) for side in ("north", "east", "south", "west", "ceiling", "floor")}
    doors = []
    for j in range(draw(st.integers(0, 3))):
        wall = draw(st.sampled_from(["north", "east", "south", "west"]))
        wall_width = length if wall in ("north", "south") else width
        if len([d for d in doors if d["wall"] == wall]) >= 1:
            continue  # one door per wall keeps the door-area check out of the way
        doors.append(
            {
                "name": f"door {j}",
                "wall": wall,
                "width": f"{draw(st.floats(0.7, min(2.0, wall_width))):.3f} m",
                "height": f"{draw(st.floats(1.8, min(2.2, height))):.3f} m",
                "passages_per_day": draw(st.floats(0.0, 300.0)),
                "passage_time": f"{draw(st.floats(5.0, 30.0)):.1f} s",
                "open_time": f"{draw(st.floats(0.0, 60.0)):.1f} min",
                "protection": draw(st.sampled_from(["none", "strip_curtain", "air_curtain", "vestibule"])),
            }
        )
    products = []
    for _ in range(draw(st.integers(0, 3))):
        key = draw(st.sampled_from(PRODUCTS))
        entering = draw(st.floats(room_t + 0.5, 30.0))
        final = draw(st.floats(room_t, entering))
        products.append(
            {
                "product": key,
                "daily_intake": f"{draw(st.floats(0.0, 3000.0)):.2f} kg",
                "entering_temperature": _t(entering),
                "final_temperature": _t(final),
                "pulldown_time": f"{draw(st.floats(4.0, 48.0)):.2f} h",
                "stored_mass": f"{draw(st.floats(0.0, 10000.0)):.1f} kg",
            }
        )
    safety = draw(st.floats(0.0, 0.5))
    run_hours = draw(st.floats(12.0, 22.0))
    defrost_type = draw(st.sampled_from(["off_cycle", "electric", "hot_gas"]))
    room = {
        "name": "Room",
        "temperature": _t(room_t),
        "rh": f"{draw(st.floats(50.0, 95.0)):.1f} %",
        "dimensions": {"length": f"{length:.3f} m", "width": f"{width:.3f} m", "height": f"{height:.3f} m"},
        "envelope": envelope,
        "doors": doors,
        "products": products,
        "people": {"count": draw(st.integers(0, 4)), "hours": f"{draw(st.floats(0, 12)):.2f} h"},
        "lighting": {"power_density": f"{draw(st.floats(0, 15)):.2f} W/m²", "hours": f"{draw(st.floats(0, 24)):.2f} h"},
        "fans": {"count": draw(st.integers(0, 4)), "power": f"{draw(st.floats(0, 500)):.1f} W"},
        "defrost": {
            "type": defrost_type,
            "per_day": draw(st.integers(0, 6)),
            "duration": f"{draw(st.floats(0, 40)):.1f} min",
            "heater_power": f"{draw(st.floats(0, 5000)) if defrost_type == 'electric' else 0.0:.1f} W",
        },
        "safety_factor": f"{safety * 100:.4f} %",
        "run_hours": f"{run_hours:.4f} h",
        "refrigeration": {"refrigerant": draw(st.sampled_from(["R-448A", "R-449A", "R-134a", "R-290", "R-717"]))},
    }
    data = {
        "project": {"name": "Random", "units": "SI"},
        "design": {"outdoor_temperature": _t(outdoor), "outdoor_rh": f"{draw(st.floats(10, 90)):.1f} %"},
        "constructions": constructions,
        "rooms": [room],
    }
    facts = {"neighbour": neighbour, "room_t": room_t, "safety": safety, "run_hours": run_hours}
    return data, facts


@settings(max_examples=80)
@given(valid_projects())
def test_random_valid_projects_compute_and_balance(case: tuple[dict, dict]) -> None:
    data, facts = case
    model = parse_project_data(data)  # valid by construction: must not raise
    room = model.rooms[0]
    loads = room_loads(model, room)
    colder_sides = {side for side, t in facts["neighbour"].items() if t < room.temperature}
    for line in loads.lines:
        assert math.isfinite(line.daily_energy), line
        if line.daily_energy < 0:
            assert line.component == "transmission", line
            assert any(side in line.item for side in colder_sides), (line, colder_sides)
    for component, watts in loads.components_w.items():
        assert math.isfinite(watts), component
        assert watts >= 0.0 or (component == "transmission" and colder_sides), (component, watts)
    total = loads.daily_energy
    assert math.isfinite(total)
    assert sum(loads.components_w.values()) * 86400.0 == _approx(total)
    # (1 + SF)·E / run time, SF and run time as written in the file (rounded as written)
    safety = round(facts["safety"] * 100, 4) / 100
    run_time = round(facts["run_hours"], 4) * 3600.0
    expected = (1.0 + safety) * sum(line.daily_energy for line in loads.lines) / run_time
    assert loads.to_json()["required_capacity_w"] == _approx(expected)
    assert loads.required_capacity >= 0.0 or total < 0.0


def _approx(value: float):
    import pytest

    return pytest.approx(value, rel=1e-9, abs=1e-6)


# --- hostile input: only ProjectFileError ---------------------------------------------------------


def _parse_only_fails_cleanly(source: str | bytes) -> None:
    try:
        result = open_project_text(source, "fuzz.yaml")
    except ProjectFileError as error:
        assert error.file == "fuzz.yaml"
        assert error.format().startswith("fuzz.yaml")
        assert error.message.strip()
        assert error.exit_code == 65
    else:
        assert isinstance(result, ProjectModel)


@settings(max_examples=300)
@given(st.binary(max_size=2000))
def test_random_bytes_raise_only_project_file_error(source: bytes) -> None:
    _parse_only_fails_cleanly(source)


@settings(max_examples=300)
@given(st.text(max_size=2000))
def test_random_text_raises_only_project_file_error(source: str) -> None:
    _parse_only_fails_cleanly(source)


SCALARS = st.one_of(
    st.none(),
    st.booleans(),
    st.integers(-10**6, 10**6),
    st.floats(allow_nan=True, allow_infinity=True),
    st.text(max_size=20),
    st.sampled_from(["no", "yes", "010", "1:30", ".nan", "-.inf", "1_000", "2 kg", "35 °F", "120 %", "R-448", "~"]),
)
KEYS = st.one_of(
    st.sampled_from(["project", "design", "rooms", "constructions", "name", "temperature", "dimensions", "doors"]),
    st.text(min_size=1, max_size=10),
)
DOCUMENTS = st.recursive(
    SCALARS,
    lambda children: st.one_of(st.lists(children, max_size=4), st.dictionaries(KEYS, children, max_size=4)),
    max_leaves=30,
)


@settings(max_examples=300)
@given(DOCUMENTS)
def test_random_yaml_documents_raise_only_project_file_error(document: object) -> None:
    _parse_only_fails_cleanly(yaml.safe_dump(document, allow_unicode=True))


def _leaf_paths(node: object, prefix: tuple = ()) -> list[tuple]:
    if isinstance(node, dict):
        return [p for k, v in node.items() for p in _leaf_paths(v, prefix + (k,))] or [prefix]
    if isinstance(node, list):
        return [p for i, v in enumerate(node) for p in _leaf_paths(v, prefix + (i,))] or [prefix]
    return [prefix]


@settings(max_examples=200)
@given(valid_projects(), st.data())
def test_valid_project_with_one_value_swapped_fails_cleanly(case: tuple[dict, dict], data: st.DataObject) -> None:
    document = copy.deepcopy(case[0])
    paths = [p for p in _leaf_paths(document) if p]
    path = data.draw(st.sampled_from(paths))
    junk = data.draw(DOCUMENTS)
    target = document
    for step in path[:-1]:
        target = target[step]
    assume(target[path[-1]] != junk)
    if data.draw(st.booleans()):
        target[path[-1]] = junk
    else:
        del target[path[-1]]
    _parse_only_fails_cleanly(yaml.safe_dump(document, allow_unicode=True))
