"""Round trips of what an old unit can still do (coldroom.design.unit_limits), through the full check.

The change-of-use demo (project_files/cooler_to_freezer.yaml) as it is (the unit holds) and with
three times the intake (it does not):

- set the room to ``coldest_room_temperature_held_c`` (its products leaving no colder than the
  room) in the project data and run the check again: the margin is within ±2 %;
- scale the intake (and its packaging) to ``max_daily_intake_kg``: the margin is within ±2 %;
- a unit that does not hold is told to raise the set point, and the three remedies come after the
  medium-temperature message.

Each case runs ~15 balance-point checks (about 2 s); the two cases share one fixture.
"""

from __future__ import annotations

import copy

import pytest

from coldroom.design.existing import check_room
from coldroom.loads import room_loads
from coldroom.inputs.opening import open_project_data
from coldroom.inputs.safeyaml import load_yaml
from coldroom.design.unit_limits import unit_limits
from tests.conftest import PROJECT_FILES

DEMO = load_yaml((PROJECT_FILES / "cooler_to_freezer.yaml").read_bytes(), "demo").data
# The round trips need a unit that is suitable for the room (a medium-temperature unit on a freezer
# is "NOT SUITABLE" at any margin): the demo's rated point declared a low-temperature unit.
DEMO["rooms"][0]["existing_unit"]["rated_point"]["application"] = "LT"


def _model(data):
    return open_project_data(copy.deepcopy(data), "test")


def _check(data):
    model = _model(data)
    return check_room(model, model.rooms[0], chart=False)


@pytest.fixture(scope="module", params=[1.0, 3.0], ids=["holds", "three_times_the_intake"])
def case(request):
    data = copy.deepcopy(DEMO)
    for product in data["rooms"][0]["products"]:
        product["daily_intake"] = f"{float(str(product['daily_intake']).split()[0]) * request.param} kg"
    model = _model(data)
    loads = room_loads(model, model.rooms[0])
    check = check_room(model, model.rooms[0], loads, chart=False)
    return data, check, unit_limits(model, 0, loads, check.holds)


def test_setting_the_coldest_temperature_held_gives_zero_margin(case) -> None:
    data, check, limits = case
    t = limits.coldest_room_temperature_held
    assert limits.coldest_status == "found"
    assert (t <= check.room_temperature) == check.holds
    edited = copy.deepcopy(data)
    room = edited["rooms"][0]
    room["temperature"] = t
    for product in room["products"]:
        final = float(str(product["final_temperature"]).split()[0])
        if final < t:
            product["final_temperature"] = t
            entering = float(str(product["entering_temperature"]).split()[0])
            product["entering_temperature"] = max(entering, t)
    again = _check(edited)
    assert again.margin_percent == pytest.approx(0.0, abs=2.0)


def test_setting_the_largest_intake_gives_zero_margin(case) -> None:
    data, check, limits = case
    assert limits.max_daily_intake is not None and limits.max_daily_intake > 0
    assert (limits.max_daily_intake >= limits.daily_intake) == check.holds
    factor = limits.max_daily_intake / limits.daily_intake
    edited = copy.deepcopy(data)
    for product in edited["rooms"][0]["products"]:
        product["daily_intake"] = float(str(product["daily_intake"]).split()[0]) * factor
        pack = product["packaging"]
        pack["mass"] = float(str(pack["mass"]).split()[0]) * factor
    again = _check(edited)
    assert again.margin_percent == pytest.approx(0.0, abs=2.0)


def test_remedies_end_with_the_replacement(case) -> None:
    _data, check, limits = case
    remedies = limits.remedies()
    assert limits.medium_at_low is None  # declared low-temperature
    assert remedies[-1].startswith(("Or replace it with a unit of", "A replacement needs a unit of"))
    if not check.holds:
        # the set point may rise only to the products' highest recommended storage temperature
        assert any(r.startswith(("Raise the set point to", "Raising the set point is no remedy")) for r in remedies)
        assert any(r.startswith("Or cut the intake to") for r in remedies)
    assert limits.replacement_capacity > check.required_capacity * 0.99


def test_the_demo_as_written_puts_the_medium_temperature_message_first() -> None:
    data = load_yaml((PROJECT_FILES / "cooler_to_freezer.yaml").read_bytes(), "demo").data
    model = _model(data)
    loads = room_loads(model, model.rooms[0])
    check = check_room(model, model.rooms[0], loads, chart=False)
    assert check.verdict == "NOT SUITABLE: medium-temperature unit at low-temperature suction"
    remedies = unit_limits(model, 0, loads, check.holds).remedies()
    assert remedies[0].startswith("This is a medium-temperature unit")
    assert not any(r.startswith("Raise the set point to") for r in remedies)  # frozen food stays frozen
