"""Regression pins: the existing-unit check of the demo project cooler_to_freezer.yaml.

Pins, not validation: they catch unintended changes in the compressor model, the
balance-point search or the room loads. The physics behind them is checked in
tests/validation/test_equipment.py and tests/invariants/test_equipment.py. When a
change is intended, update the numbers here and say why in the commit message.
"""

from __future__ import annotations

from pathlib import Path

import pytest

pytest.importorskip("CoolProp")

REPO = Path(__file__).resolve().parents[2]
DEMO = REPO / "project_files" / "cooler_to_freezer.yaml"

PINS = {
    "balance_evaporating_temperature_c": -23.00908,
    "balance_condensing_temperature_c": 40.20783,
    "capacity_at_balance_w": 2504.540,
    "power_at_balance_w": 1525.610,
    "heat_rejection_at_balance_w": 4103.915,
    "discharge_temperature_c": 100.651,
    "required_capacity_w": 2405.884,
    "daily_run_time_needed_h": 17.29097,
    "margin_percent": 4.10059,
}


@pytest.fixture(scope="module")
def check():  # type: ignore[no-untyped-def]
    from coldroom.design.existing import check_existing_units
    from coldroom.inputs.opening import open_project

    ((loads, result),) = check_existing_units(open_project(DEMO).model)
    return result


def test_demo_verdict_is_pinned(check) -> None:  # type: ignore[no-untyped-def]
    """The demo's MT unit on a freezer is NOT SUITABLE (issue 24): no capacity is credited; the balance and
    the compressor model at it stay pinned."""
    from coldroom.design.existing import build_compressor
    from coldroom.inputs.opening import open_project

    data = check.to_json()
    for key in ("balance_evaporating_temperature_c", "balance_condensing_temperature_c", "required_capacity_w"):
        assert data[key] == pytest.approx(PINS[key], rel=1e-4, abs=1e-4), key
    assert data["holds"] is False and data["suitable"] is False
    assert data["verdict"] == "NOT SUITABLE: medium-temperature unit at low-temperature suction"
    assert data["capacity_at_balance_w"] is None and data["margin_percent"] is None
    assert data["model"] == "rated point"
    assert data["max_ambient_temperature_status"] == "fails_below_range"
    model = open_project(DEMO).model
    room = model.rooms[0]
    compressor = build_compressor(room.existing_unit, model.refrigeration_for(room))
    point = compressor.performance(
        data["balance_evaporating_temperature_c"], data["balance_condensing_temperature_c"], check_envelope=False
    )
    assert point.capacity == pytest.approx(PINS["capacity_at_balance_w"], rel=1e-4)
    assert point.power == pytest.approx(PINS["power_at_balance_w"], rel=1e-4)
    assert point.heat_rejection == pytest.approx(PINS["heat_rejection_at_balance_w"], rel=1e-4)
    assert point.discharge_temperature == pytest.approx(PINS["discharge_temperature_c"], rel=1e-4)


def test_demo_chart_is_pinned(check) -> None:  # type: ignore[no-untyped-def]
    chart = check.chart()
    assert chart["ambient_temperature_c"] == [20.0 + 5.0 * i for i in range(6)]
    assert chart["unit_capacity_w"] == [None] * 6  # not suitable: no capacity credited at any ambient
    assert chart["room_load_w"][0] == pytest.approx(2193.74, rel=1e-4)
    assert chart["room_load_w"][-1] == pytest.approx(2746.14, rel=1e-4)


def test_size_carries_the_check_into_json_and_sheet() -> None:
    """`size` runs the same check (one call, coldroom.design.existing.check_room) and prints its section."""
    import io

    from coldroom.inputs.opening import open_project
    from coldroom.output.pdf.sheet import render_sheet
    from coldroom.design.sizing import size_project

    pypdf = pytest.importorskip("pypdf")
    model = open_project(DEMO).model
    result = size_project(model, str(DEMO), DEMO.read_bytes())
    unit = result.to_json()["rooms"][0]["existing_unit"]
    assert unit["holds"] is False and unit["verdict"].startswith("NOT SUITABLE")
    text = "".join(page.extract_text() for page in pypdf.PdfReader(io.BytesIO(render_sheet(result, model))).pages)
    assert "Existing unit check" in text
    assert "capacity at balance and room load vs condenser air" in text
