"""The design day and the pull-down through the command line: schedule keys, JSON contracts, errors.

The README's schedule example is added to the produce-cooler demo (its people, lighting and
intake made to agree), sized, and the JSON keys the issue names are checked; a schedule that
disagrees with the room is refused with exit 65 at its key.
"""

from __future__ import annotations

import json
import re
from pathlib import Path

import pytest
from typer.testing import CliRunner

from coldroom.cli import app

REPO = Path(__file__).resolve().parents[2]
DEMO = REPO / "project_files" / "produce_cooler.yaml"

SCHEDULE = """
    schedule:
      doors: [{start: "08:00", end: "18:00", share: 90 %}, {start: 18, end: 20, share: 10 %}]
      people: [{start: 8, end: 10}]
      lighting: [{start: 7, end: 13}]
      deliveries: [{time: "06:30", mass: 500 kg}, {time: 14, mass: 250 kg}]
    pulldown: {panel_skin: true}
"""

runner = CliRunner()


def _project(tmp_path: Path, schedule: str = SCHEDULE, daily_range: str = "11 K") -> Path:
    text = DEMO.read_text(encoding="utf-8")
    text = text.replace("  hemisphere: north\n", f"  hemisphere: north\n  daily_range: {daily_range}\n")
    text = text.replace("    safety_factor: 10 %\n", "    safety_factor: 10 %\n" + schedule.lstrip("\n"))
    path = tmp_path / "scheduled.yaml"
    path.write_text(text, encoding="utf-8")
    return path


def test_size_reports_the_hourly_loads_and_the_pulldown(tmp_path: Path) -> None:
    project = _project(tmp_path)
    out = tmp_path / "r.json"
    result = runner.invoke(app, ["size", str(project), "--out", str(tmp_path / "r.pdf"), "--json", str(out)])
    assert result.exit_code == 0, result.output
    room = json.loads(out.read_text(encoding="utf-8"))["rooms"][0]
    hourly = room["hourly_load_w"]
    assert len(hourly) == 24 and all(isinstance(q, float) for q in hourly)
    assert 0 <= room["peak_hour"] <= 23
    assert room["peak_load_w"] == pytest.approx(hourly[room["peak_hour"]])  # no defrost heat in this room
    assert room["peak_load_basis"] == "design day schedule"
    pull = room["pulldown"]
    assert set(pull) >= {"time_to_final_temperature_h", "lowest_room_air_temperature_c", "time_h",
                         "product_temperature_c", "basis"}
    assert len(pull["time_h"]) == len(pull["product_temperature_c"])
    assert pull["time_to_final_temperature_h"] is None or pull["time_to_final_temperature_h"] > 0
    assert "panel inner skin" in pull["basis"]


@pytest.mark.parametrize(
    "schedule, key, words",
    [
        ("    schedule:\n      doors: [{start: 8, end: 18, share: 80 %}]\n", "rooms[0].schedule.doors", "100 %"),
        ("    schedule:\n      people: [{start: 8, end: 12}]\n", "rooms[0].schedule.people", "people.hours"),
        ("    schedule:\n      deliveries: [{time: 7, mass: 100 kg}]\n", "rooms[0].schedule.deliveries", "daily_intake"),
        ("    schedule:\n      lighting: [{start: 7, end: 11}, {start: 10, end: 12}]\n", "rooms[0].schedule.lighting", "overlap"),
        ("    schedule:\n      defrost: [\"25:00\"]\n", "rooms[0].schedule.defrost[0]", "time of day"),
    ],
)
def test_a_schedule_that_disagrees_is_refused_at_its_key(tmp_path: Path, schedule: str, key: str, words: str) -> None:
    project = _project(tmp_path, schedule)
    result = runner.invoke(app, ["validate", str(project)])
    assert result.exit_code == 65, result.output
    line = result.output.strip().splitlines()[-1]
    assert re.match(rf".*scheduled\.yaml:\d+:\d+: {re.escape(key)}: ", line), line
    assert words in line
