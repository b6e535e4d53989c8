"""The change-of-use demo's sheet: the existing unit's verdict on page 1, with the three figures
(coldest room held, largest daily intake, replacement duty) and the way forward, the
medium-temperature message before the margin; and the pull-down with the existing unit.

Read back from the rendered PDF with pypdf; the figures are compared with the JSON result.
"""

from __future__ import annotations

import io
import re
from pathlib import Path

import pytest

REPO = Path(__file__).resolve().parents[2]
DEMO = REPO / "project_files" / "cooler_to_freezer.yaml"


@pytest.fixture(scope="module")
def sheet():
    import pypdf

    from coldroom.inputs.opening import open_project
    from coldroom.output.pdf.sheet import render_sheet
    from coldroom.design.sizing import size_project

    model = open_project(DEMO).model
    result = size_project(model, str(DEMO), DEMO.read_bytes())
    pdf = render_sheet(result, model)
    pages = [re.sub(r"\s+", " ", p.extract_text() or "") for p in pypdf.PdfReader(io.BytesIO(pdf)).pages]
    return result, pages


def test_page_one_carries_the_verdict_and_the_way_forward(sheet) -> None:
    result, pages = sheet
    first = pages[0]
    unit = result.to_json()["rooms"][0]["existing_unit"]
    assert "Existing unit: verdict and the way forward" in first
    assert unit["verdict"] in first
    for label in ("Coldest room it holds", "Largest daily intake", "Replacement duty", "The way forward"):
        assert label in first, label
    assert f"{unit['coldest_held_room_temperature_c']:.1f} °C" in first
    assert f"{unit['max_daily_intake_kg']:,.0f} kg/day" in first
    assert f"{unit['replacement_duty']['capacity_w'] / 1000:.2f} kW" in first
    # the medium-temperature unit at low-temperature suction is said before the margin
    block = first.index("Existing unit: verdict and the way forward")  # the blocking box above names it too
    assert block < first.index("This is a medium-temperature unit") < first.index(unit["verdict"], block)


def test_the_existing_unit_pulldown_is_on_the_sheet(sheet) -> None:
    result, pages = sheet
    assert result.rooms[0].limits.pulldown is not None
    assert any("Pull-down after a delivery (existing unit)" in p for p in pages)
