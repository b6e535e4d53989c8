"""Bad project files: one line on stderr, `file:line:col: dotted.key: message`, exit 65."""

from __future__ import annotations

import re
import subprocess
import sys
from pathlib import Path

import pytest

REPO = Path(__file__).resolve().parents[2]
DEMO = REPO / "project_files" / "produce_cooler.yaml"


def run(*args: str, cwd: Path | None = None) -> subprocess.CompletedProcess[str]:
    return subprocess.run(
        [sys.executable, "-m", "coldroom", *args], capture_output=True, text=True, cwd=cwd, timeout=60
    )


def variant(tmp_path: Path, old: str, new: str) -> Path:
    text = DEMO.read_text(encoding="utf-8")
    assert old in text, old
    path = tmp_path / "bad.yaml"
    path.write_text(text.replace(old, new, 1), encoding="utf-8")
    return path


def line_of(path: Path, fragment: str) -> int:
    for number, line in enumerate(path.read_text(encoding="utf-8").splitlines(), 1):
        if fragment in line:
            return number
    raise AssertionError(fragment)


CASES = [
    # (replace, with, dotted key, fragment of the message, fragment of the offending line)
    ("    rh: 90 %\n", "    rh: 90 %\n    humidty: 80 %\n", "rooms[0].humidty", "unknown key", "humidty"),
    ("  outdoor_temperature: 32 °C\n", "", "design.outdoor_temperature", "required key is missing", "design:"),
    ("height: 2.7 m}", "height: 2.7 kg}", "rooms[0].dimensions.height", "unit of mass, not of length", "dimensions:"),
    ("length: 5.0 m,", "length: -5.0 m,", "rooms[0].dimensions.length", "outside the valid range", "dimensions:"),
    ("outdoor_temperature: 32 °C", "outdoor_temperature: 1 °C", "rooms[0].temperature", "not below the outdoor", "    temperature: 2 °C"),
    (
        "        final_temperature: 3 °C\n        pulldown_time: 12 h\n        packaging: {mass: 30 kg",
        "        final_temperature: 25 °C\n        pulldown_time: 12 h\n        packaging: {mass: 30 kg",
        "rooms[0].products[0].final_temperature",
        "above the entering temperature",
        "final_temperature: 25",
    ),
]


@pytest.mark.parametrize("old, new, key, message, at", CASES, ids=[c[2] for c in CASES])
def test_bad_input_gives_one_line_and_exit_65(tmp_path: Path, old: str, new: str, key: str, message: str, at: str) -> None:
    path = variant(tmp_path, old, new)
    result = run("validate", str(path))
    assert result.returncode == 65, result.stderr
    lines = result.stderr.strip().splitlines()
    assert len(lines) == 1, result.stderr
    assert "Traceback" not in result.stderr
    match = re.match(r"^(?P<file>.+?):(?P<line>\d+):(?P<col>\d+): (?P<key>[^:]+): (?P<msg>.+)$", lines[0])
    assert match, lines[0]
    assert match["file"] == str(path)
    assert match["key"] == key
    assert message in match["msg"]
    assert int(match["line"]) == line_of(path, at)


def test_unit_error_lists_the_accepted_spellings(tmp_path: Path) -> None:
    path = variant(tmp_path, "height: 2.7 m}", "height: 2.7 parsecs}")
    result = run("validate", str(path))
    assert result.returncode == 65
    assert "use one of: m, mm, cm, in, ft" in result.stderr


def test_unknown_product_lists_close_names(tmp_path: Path) -> None:
    path = variant(tmp_path, "product: strawberries", "product: strawbery")
    result = run("validate", str(path))
    assert result.returncode == 65
    assert "strawberries" in result.stderr
    assert len(result.stderr.strip().splitlines()) == 1


def test_missing_file_is_exit_65() -> None:
    result = run("validate", "no/such/file.yaml")
    assert result.returncode == 65
    assert result.stderr.startswith("no/such/file.yaml: no such file")


@pytest.mark.parametrize("demo", sorted((REPO / "project_files").glob("*.yaml")), ids=lambda p: p.name)
def test_demo_projects_validate(demo: Path) -> None:
    result = run("validate", str(demo))
    assert result.returncode == 0, result.stderr
    assert "valid" in result.stdout


def test_new_writes_a_starter_that_validates_and_refuses_to_overwrite(tmp_path: Path) -> None:
    target = tmp_path / "starter.yaml"
    assert run("new", str(target)).returncode == 0
    assert run("validate", str(target)).returncode == 0
    again = run("new", str(target))
    assert again.returncode == 73
    assert "--force" in again.stderr


def test_schema_is_json_schema_with_our_keys() -> None:
    import json

    result = run("schema")
    assert result.returncode == 0
    schema = json.loads(result.stdout)
    assert schema["title"] == "coldroom project file"
    assert set(schema["properties"]) == {"project", "design", "constructions", "rooms", "systems", "economics", "quote",
                                         "options"}
    assert schema["additionalProperties"] is False


def test_load_json_has_the_contract_keys(tmp_path: Path) -> None:
    import json

    result = run("load", str(DEMO), "--json", "-")
    assert result.returncode == 0, result.stderr
    data = json.loads(result.stdout)
    room = data["rooms"][0]
    assert room["name"] == "Produce cooler"
    assert set(room["loads_w"]) >= {"transmission", "product", "infiltration", "internal"}
    assert room["daily_energy_kwh"] > 0
    assert room["required_capacity_w"] > 0
    assert "required capacity" in result.stderr


def test_ip_project_messages_speak_ip(tmp_path: Path) -> None:
    """An IP project's errors and warnings quote its own units, not the SI the tool computes in."""
    ip = REPO / "project_files" / "meat_cooler_ip.yaml"
    text = ip.read_text(encoding="utf-8")
    bad = tmp_path / "ip_bad.yaml"
    bad.write_text(text.replace("    temperature: 33\n", "    temperature: 40\n", 1), encoding="utf-8")
    result = run("validate", str(bad))
    assert result.returncode == 65
    # final 35 °F is below the room's 40 °F (values as the user wrote them)
    assert "final temperature 35.0 °F is below the room temperature 40.0 °F" in result.stderr
    warm = tmp_path / "ip_warm.yaml"
    warm.write_text(
        text.replace("    temperature: 33\n", "    temperature: 36\n", 1).replace("final_temperature: 35", "final_temperature: 37"),
        encoding="utf-8",
    )
    loaded = run("load", str(warm))
    assert loaded.returncode == 0, loaded.stderr
    assert "room 36.0 °F is above the recommended" in loaded.stdout
    assert "°C" not in loaded.stdout
