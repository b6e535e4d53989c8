"""A unit outside its application class never holds and is never offered (issue 24, items 8 and 13).

Sources: EN 13215 (2016) rates condensing units at −35 °C (low temperature) and −10 °C (medium
temperature) saturated suction [mem]; the class boundaries (LT −45…−15 °C, MT −20…+10 °C) are the
manufacturers' LBP/MBP envelope convention [trade]. The product's highest recommended storage
temperature comes from the product table (ASHRAE Handbook—Refrigeration, commodity storage tables [mem]).
"""

from __future__ import annotations

from pathlib import Path

import pytest
import yaml

from coldroom import rules

REPO = Path(__file__).resolve().parents[2]


def test_en13215_rating_points_fall_in_their_classes():
    # EN 13215 [mem]: LT units rated at −35 °C SST, MT at −10 °C SST
    assert rules.application_class_of_rating(-35.0) == "LT"
    assert rules.application_class_of_rating(-10.0) == "MT"
    low, high, _ = rules.APPLICATION_CLASSES["LT"]
    assert low <= -35.0 <= high
    low, high, _ = rules.APPLICATION_CLASSES["MT"]
    assert low <= -10.0 <= high


def _freezer_project(tmp_path: Path, capacity: str) -> Path:
    data = yaml.safe_load((REPO / "project_files" / "cooler_to_freezer.yaml").read_text(encoding="utf-8"))
    rating = data["rooms"][0]["existing_unit"]["rated_point"]
    scale = float(capacity.split()[0]) / 4.5
    rating["capacity"] = capacity
    rating["power"] = f"{2.2 * scale:g} kW"  # the same efficiency, a bigger unit
    path = tmp_path / "freezer.yaml"
    path.write_text(yaml.safe_dump(data, allow_unicode=True, sort_keys=False), encoding="utf-8")
    return path


@pytest.mark.parametrize("capacity", ["4.5 kW", "9 kW"])
def test_medium_temperature_unit_on_a_freezer_is_not_suitable(tmp_path: Path, capacity: str):
    """The demo's MT unit (rated −10 °C SST) on a −18 °C freezer, at its own size and doubled."""
    from coldroom.design.existing import check_room
    from coldroom.design.unit_limits import unit_limits
    from coldroom.inputs.opening import open_project
    from coldroom.loads import room_loads

    model = open_project(str(_freezer_project(tmp_path, capacity))).model
    room = model.rooms[0]
    check = check_room(model, room, chart=False)
    assert check is not None
    assert check.holds is False and check.within_envelope is False
    assert check.verdict == "NOT SUITABLE: medium-temperature unit at low-temperature suction"
    data = check.to_json()
    assert data["holds"] is False and data["suitable"] is False
    # no remedy raises the room above the products' highest recommended storage temperature
    from coldroom.physics.products import get_product

    ceiling = min(get_product(p.product).storage_temperature[1] for p in room.products)
    limits = unit_limits(model, 0, room_loads(model, room), check.holds)
    for remedy in limits.remedies():
        assert not remedy.startswith("Raise the set point"), remedy
    if limits.coldest_room_temperature_held is not None:
        assert limits.coldest_room_temperature_held > ceiling


def test_low_temperature_rated_point_not_suitable_for_a_medium_temperature_system():
    from coldroom import equipment as E

    lt = E.RatedPointCompressor.from_rating("R-448A", 2000.0, -35.0, 40.0)
    assert lt.application == "LT"
    check = E.check_unit(
        lt, E.HeatExchanger.fixed(6.0, ("fixed",)), E.HeatExchanger.fixed(12.0, ("fixed",)),
        room_temperature=-3.6, ambient_temperature=45.6, daily_energy=1500.0 * 16 * 3600 / 1.1,
        safety_factor=0.1, run_time=16 * 3600.0, chart_ambients=(), search_max_ambient=False,
        design_suction=-9.6,
    )
    assert not check.holds
    assert check.verdict == "NOT SUITABLE: low-temperature unit at medium-temperature suction"


@pytest.mark.parametrize("demo", ["combo_cooler_freezer", "propane_cooler"])
def test_select_never_offers_a_unit_outside_its_class(demo: str):
    """The demo catalogue's LT units (R-448A and R-290) are never offered for a cooler, nor MT units for a freezer.

    Before: the R-290 LT unit DP-L25 was an alternative for the +3 °C propane cooler, and the MT unit
    DX-M50 for the combination's system (its coldest member a freezer).
    """
    from coldroom.design.selection import select_project
    from coldroom.inputs.catalogue import load_catalogue
    from coldroom.inputs.opening import open_project

    catalogue = load_catalogue(REPO / "project_files" / "catalogue" / "demo_catalogue.yaml")
    classes = {}
    for entry in catalogue.condensing_units:
        if entry.polynomial is not None:
            classes[entry.model] = "LT" if entry.polynomial.suction_max <= -5.0 else "MT"
        else:
            classes[entry.model] = rules.application_class_of_rating(entry.rated_point.evaporating_temperature)
    model = open_project(str(REPO / "project_files" / f"{demo}.yaml")).model
    temperature = {room.name: room.temperature for room in model.rooms}
    seen = 0
    for system in select_project(model, catalogue, max_ambient=False):
        needed = "LT" if min(temperature[c.room] for c in system.coolers) < -5.0 else "MT"
        for option in (system.choice, *system.alternatives):
            seen += 1
            assert classes[option.model] == needed, (system.system, option.model, needed)
    assert seen
