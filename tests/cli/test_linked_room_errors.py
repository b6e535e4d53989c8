"""Rooms facing rooms, doors between rooms and systems: each mistake is one located line, exit 65."""

from __future__ import annotations

import re
import subprocess
import sys
from pathlib import Path

import pytest

REPO = Path(__file__).resolve().parents[2]
DEMO = REPO / "project_files" / "combo_cooler_freezer.yaml"


def run(*args: str) -> subprocess.CompletedProcess[str]:
    return subprocess.run([sys.executable, "-m", "coldroom", *args], capture_output=True, text=True, timeout=60)


def variant(tmp_path: Path, *replacements: tuple[str, str]) -> Path:
    text = DEMO.read_text(encoding="utf-8")
    for old, new in replacements:
        assert old in text, old
        text = text.replace(old, new, 1)
    path = tmp_path / "bad.yaml"
    path.write_text(text, encoding="utf-8")
    return path


def line_of(path: Path, fragment: str, after: str = "") -> int:
    lines = path.read_text(encoding="utf-8").splitlines()
    start = next(i for i, line in enumerate(lines) if after in line) if after else 0
    for number, line in enumerate(lines[start:], start + 1):
        if fragment in line:
            return number
    raise AssertionError(fragment)


PARTITION = "      east:    {construction: panel_150, facing: room, room: Freezer}"
FREEZER_WALL = "      west:    {construction: panel_150, facing: room, room: Cooler}"
SYSTEM_ROOMS = "    rooms: [Cooler, Freezer]"

CASES = [
    # (id, replacements, dotted key, message fragments, (line fragment, after))
    (
        "unknown room on a surface",
        [(PARTITION, PARTITION.replace("room: Freezer", "room: Frezer"))],
        "rooms[0].envelope.east.room",
        ["unknown room 'Frezer'", "closest: Freezer"],
        ("room: Frezer", ""),
    ),
    (
        "unknown room on a door",
        [("        to_room: Cooler", "        to_room: Coolr")],
        "rooms[1].doors[0].to_room",
        ["unknown room 'Coolr'", "closest: Cooler"],
        ("to_room: Coolr", ""),
    ),
    (
        "unknown room in a system",
        [(SYSTEM_ROOMS, "    rooms: [Cooler, Freezers]")],
        "systems[0].rooms[1]",
        ["unknown room 'Freezers'", "closest: Freezer"],
        ("rooms: [Cooler, Freezers]", ""),
    ),
    (
        "room facing itself",
        [(PARTITION, PARTITION.replace("room: Freezer", "room: Cooler"))],
        "rooms[0].envelope.east.room",
        ["room 'Cooler' cannot face itself"],
        ("east:", ""),
    ),
    (
        "partition areas disagree",
        [("dimensions: {length: 2.5 m, width: 3.0 m", "dimensions: {length: 2.5 m, width: 3.5 m")],
        "rooms[1].envelope.west",
        ["'Cooler' (7.80 m²)", "'Freezer' (9.10 m²)", "more than 5 %"],
        ("west:", "name: Freezer"),
    ),
    (
        "room in two systems",
        [(SYSTEM_ROOMS + "\n", SYSTEM_ROOMS + "\n"), ("    condenser_fan_power: 150 W\n",
          "    condenser_fan_power: 150 W\n  - name: CU-2\n    rooms: [Freezer]\n")],
        "systems[1].rooms[0]",
        ["room 'Freezer' is already in system 'CU-1'", "at most one system"],
        ("rooms: [Freezer]", ""),
    ),
    (
        "mixed refrigerants",
        [("    safety_factor: 10 %\n\nsystems:", "    safety_factor: 10 %\n    refrigeration: {refrigerant: R-404A}\n\nsystems:")],
        "rooms[1].refrigeration.refrigerant",
        ["mixed refrigerants", "R-404A", "R-448A", "'CU-1'"],
        ("refrigeration: {refrigerant: R-404A}", ""),
    ),
    (
        "system-level key in a member's refrigeration block",
        [("      evaporator_td: 6 K\n", "      evaporator_td: 6 K\n      condenser_td: 12 K\n")],
        "rooms[0].refrigeration.condenser_td",
        ["condenser_td is set on the system", "only evaporator_td, superheat"],
        ("condenser_td: 12 K", ""),
    ),
    (
        "temperature beside facing: room",
        [(PARTITION, PARTITION.replace("room: Freezer}", "room: Freezer, temperature: -20 °C}"))],
        "rooms[0].envelope.east",
        ["takes that room's design temperature; remove temperature"],
        ("east:", ""),
    ),
    (
        "other_side beside to_room",
        [("        to_room: Cooler", "        to_room: Cooler\n        other_side_temperature: 2 °C")],
        "rooms[1].doors[0]",
        ["remove other_side_temperature"],
        ("- name: door into the cooler", ""),
    ),
]


@pytest.mark.parametrize("replacements, key, fragments, at", [c[1:] for c in CASES], ids=[c[0] for c in CASES])
def test_linked_room_mistakes_give_one_located_line_and_exit_65(
    tmp_path: Path, replacements: list, key: str, fragments: list, at: tuple
) -> None:
    path = variant(tmp_path, *replacements)
    result = run("validate", str(path))
    assert result.returncode == 65, result.stderr
    lines = result.stderr.strip().splitlines()
    assert len(lines) == 1 and "Traceback" not in result.stderr, result.stderr
    match = re.match(r"^(?P<file>.+?):(?P<line>\d+):(?P<col>\d+): (?P<key>[^:]+): (?P<msg>.+)$", lines[0])
    assert match, lines[0]
    assert match["key"] == key, lines[0]
    for fragment in fragments:
        assert fragment in match["msg"], lines[0]
    assert int(match["line"]) == line_of(path, *at), lines[0]


def test_the_combo_demo_is_valid() -> None:
    result = run("validate", str(DEMO))
    assert result.returncode == 0, result.stderr
