"""Bad piping input in a system: one located line on stderr, exit 65."""

from __future__ import annotations

import subprocess
import sys
from pathlib import Path

import pytest

REPO = Path(__file__).resolve().parents[2]
DEMO = REPO / "project_files" / "propane_cooler.yaml"

CASES = [
    # (replace, with, dotted key, fragment of the message, fragment of the offending line)
    ("        length: 16 m\n        rise: 5 m", "        length: -16 m\n        rise: 5 m",
     "systems[0].piping.suction.length", "outside the valid range", "length: -16 m"),
    ("        rise: 5 m", "        rise: 25 m", "systems[0].piping.suction.rise", "rise is longer than the run", "rise: 25 m"),
    ("        fittings: {elbow_90: 2}", "        fittings: {elbow_90: 2, swan_neck: 1}",
     "systems[0].piping.discharge.fittings.swan_neck", "not one of the valid choices", "swan_neck"),
    ("      tube_series: EN 12735-1", "      tube_series: DIN 1786", "systems[0].piping.tube_series",
     "not one of the valid choices", "tube_series: DIN"),
    ("      receiver_level: 20 %", "      receiver_level: 20 %\n      occupancy: d", "systems[0].charge.occupancy",
     "not one of the valid choices", "occupancy: d"),
]


@pytest.mark.parametrize("old, new, key, message, at", CASES, ids=[c[2] for c in CASES])
def test_bad_piping_input_is_located(tmp_path: Path, old: str, new: str, key: str, message: str, at: str) -> None:
    text = DEMO.read_text(encoding="utf-8")
    assert old in text, old
    path = tmp_path / "bad.yaml"
    path.write_text(text.replace(old, new, 1), encoding="utf-8")
    result = subprocess.run(
        [sys.executable, "-m", "coldroom", "validate", str(path)], capture_output=True, text=True, timeout=60
    )
    assert result.returncode == 65, result.stderr
    lines = result.stderr.strip().splitlines()
    assert len(lines) == 1, result.stderr
    expected_line = next(n for n, line in enumerate(path.read_text(encoding="utf-8").splitlines(), 1) if at in line)
    assert lines[0].startswith(f"{path}:{expected_line}:"), (lines[0], expected_line)
    assert f": {key}: " in lines[0], lines[0]
    assert message in lines[0], lines[0]
