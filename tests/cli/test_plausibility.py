"""Implausible values that drive the design: warned about, and explained on the sheet.

The thresholds are common practice, no source (coldroom.inputs.physical_checks): walk-in rooms pull product
down in 8–24 h, and no single heat source or rating of a walk-in room is over 100 kW. A
design capacity more than three times the 24-hour figure is explained where it is shown.
"""

from __future__ import annotations

from pathlib import Path

from typer.testing import CliRunner

from coldroom.cli import app

REPO = Path(__file__).resolve().parents[2]
DEMO = REPO / "project_files" / "produce_cooler.yaml"


def variant(tmp_path: Path, old: str, new: str) -> Path:
    text = DEMO.read_text(encoding="utf-8")
    assert old in text
    path = tmp_path / "variant.yaml"
    path.write_text(text.replace(old, new), encoding="utf-8")
    return path


def run(*args: str):  # type: ignore[no-untyped-def]
    return CliRunner().invoke(app, list(args), catch_exceptions=False)


def test_short_pulldown_is_warned_and_the_large_design_capacity_explained(tmp_path: Path) -> None:
    path = variant(tmp_path, "pulldown_time: 12 h", "pulldown_time: 1.5 h")
    checked = run("validate", str(path))
    assert checked.exit_code == 0
    assert "pulldown_time: Produce cooler: a pull-down time of 1.5 h is short" in checked.output
    loads = run("load", str(path), "--json", "-")
    assert loads.exit_code == 0
    assert "times the 24-hour figure" in loads.output and "pulled down in 1.5 h" in loads.output


def test_no_note_for_an_ordinary_room() -> None:
    result = run("load", str(DEMO))
    assert result.exit_code == 0
    assert "times the 24-hour figure" not in result.output and "is short" not in result.output


def test_megawatts_where_kilowatts_were_meant_are_warned(tmp_path: Path) -> None:
    path = variant(tmp_path, "fans: {count: 2, power: 90 W,", "fans: {count: 2, power: 0.5 MW,")
    result = run("validate", str(path))
    assert result.exit_code == 0
    assert "implausibly large for a walk-in room" in result.output and "kW, not MW?" in result.output
