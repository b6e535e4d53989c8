"""`coldroom size` on a project with a system of two rooms: JSON contract keys and the terminal table."""

from __future__ import annotations

import json
import subprocess
import sys
from pathlib import Path

import pytest

REPO = Path(__file__).resolve().parents[2]
COMBO = REPO / "project_files" / "combo_cooler_freezer.yaml"

#: The keys issue "systems" names as the JSON contract for each system.
SYSTEM_KEYS = {
    "name", "rooms", "refrigerant", "suction_temperature_c", "condensing_temperature_c", "design_capacity_w",
    "cycle", "compressor_input_power_w", "connected_load_w", "daily_electricity_kwh",
}


@pytest.fixture(scope="module")
def sized(tmp_path_factory):
    out = tmp_path_factory.mktemp("combo")
    # in-process (typer's CliRunner, separate stdout and stderr): no interpreter start per module
    from typer.testing import CliRunner

    from coldroom.cli import app

    result = CliRunner().invoke(app, ["size", str(COMBO), "--out", str(out / "combo.pdf"), "--json", "-"])
    assert result.exit_code == 0, result.stderr
    return json.loads(result.stdout), result.stderr


def test_json_has_the_systems_contract(sized) -> None:
    data, _terminal = sized
    assert len(data["systems"]) == 1
    system = data["systems"][0]
    assert SYSTEM_KEYS <= set(system)
    assert system["name"] == "CU-1" and system["rooms"] == ["Cooler", "Freezer"]
    assert system["refrigerant"] == "R-448A"
    from coldroom.physics.cycle import solve_cycle

    assert set(system["cycle"]) == set(solve_cycle("R448A", -10.0, 40.0, 1000.0).to_json())  # a room's cycle keys
    assert {"mass_flow_kg_s", "compressor_power_w", "condenser_duty_w", "states"} <= set(system["cycle"])
    rooms = {room["name"]: room for room in data["rooms"]}
    assert {room["system"] for room in rooms.values()} == {"CU-1"}
    assert system["design_capacity_w"] == pytest.approx(
        sum(room["design_capacity_w"] for room in rooms.values()), rel=1e-12
    )
    # the suction is the freezer's evaporating temperature less the 1 K line drop
    assert system["suction_temperature_c"] == pytest.approx(rooms["Freezer"]["evaporating_temperature_c"] - 1.0)
    # a partition line names the other room
    items = [line["item"] for line in rooms["Cooler"]["lines"]]
    assert "east (room: Freezer)" in items
    assert system["connected_load_w"] >= system["compressor_input_power_w"]


def test_terminal_shows_the_system_table(sized) -> None:
    _data, terminal = sized
    assert "Systems" in terminal
    row = next(line for line in terminal.splitlines() if line.startswith("CU-1 "))
    assert "Cooler, Freezer" in row and "R-448A" in row
    assert "behind an EPR" in terminal and "connected load" in terminal
