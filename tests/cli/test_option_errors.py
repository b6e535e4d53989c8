"""Options in the project file: each validated as a whole project; errors located at the change."""

from __future__ import annotations

import subprocess
import sys
from pathlib import Path

import pytest

REPO = Path(__file__).resolve().parents[2]
DEMO = REPO / "project_files" / "produce_cooler.yaml"


def run(*args: str) -> subprocess.CompletedProcess[str]:
    return subprocess.run([sys.executable, "-m", "coldroom", *args], capture_output=True, text=True, timeout=60)


def with_options(tmp_path: Path, block: str) -> Path:
    path = tmp_path / "p.yaml"
    path.write_text(DEMO.read_text(encoding="utf-8") + "\n" + block, encoding="utf-8")
    return path


def line_of(path: Path, fragment: str) -> int:
    for number, line in enumerate(path.read_text(encoding="utf-8").splitlines(), 1):
        if fragment in line:
            return number
    raise AssertionError(fragment)


CASES = [
    # (change line, fragment of the message)
    ("rooms.Nowhere.rh: 80 %", "no item named 'Nowhere'"),
    ("rooms.0.humidty: 80 %", "unknown key"),
    ("rooms.0.rh: 180 %", "outside the valid range"),
    ("rooms.0.refrigeration.refrigerant: R-9999", "R-9999"),
    ("project.name.first: x", "single value"),
]


@pytest.mark.parametrize("change, message", CASES, ids=[c[0] for c in CASES])
def test_bad_change_is_one_located_line(tmp_path: Path, change: str, message: str) -> None:
    path = with_options(tmp_path, f"options:\n  - name: Alt\n    changes:\n      {change}\n")
    done = run("validate", str(path))
    assert done.returncode == 65, done.stderr
    lines = done.stderr.strip().splitlines()
    assert len(lines) == 1, done.stderr
    key = change.split(":")[0]
    assert lines[0].startswith(f"{path}:{line_of(path, key)}:"), lines[0]
    assert "option 'Alt'" in lines[0] and message in lines[0], lines[0]


def test_good_options_validate(tmp_path: Path) -> None:
    path = with_options(
        tmp_path,
        "options:\n  - name: Drier\n    note: lower RH\n    changes:\n      rooms.0.rh: 80 %\n"
        "  - name: Warmer site\n    changes:\n      design.outdoor_temperature: 35 °C\n",
    )
    done = run("validate", str(path))
    assert done.returncode == 0, done.stderr


def test_option_called_base_is_refused(tmp_path: Path) -> None:
    path = with_options(tmp_path, "options:\n  - name: base\n    changes:\n      rooms.0.rh: 80 %\n")
    done = run("validate", str(path))
    assert done.returncode == 65 and "'base'" in done.stderr
