"""`coldroom --help` and `coldroom validate` import neither CoolProp nor reportlab,
and help is formatted without rich (whose import costs more than typer's)."""

from __future__ import annotations

import subprocess
import sys
from pathlib import Path

import pytest

REPO = Path(__file__).resolve().parents[2]
PROBE = """
import sys
from coldroom.cli import app
try:
    app(sys.argv[1:], standalone_mode=False)
except SystemExit:
    pass
heavy = sorted(m for m in sys.modules if m.split('.')[0] in ('CoolProp', 'reportlab', 'rich'))
print('HEAVY:' + ','.join(heavy))
"""


@pytest.mark.parametrize(
    "args",
    [["--help"], ["validate", str(REPO / "project_files" / "produce_cooler.yaml")], ["load", "--help"]],
    ids=["help", "validate", "load-help"],
)
def test_no_heavy_imports(args: list[str]) -> None:
    result = subprocess.run([sys.executable, "-c", PROBE, *args], capture_output=True, text=True, timeout=60)
    assert "HEAVY:" in result.stdout, result.stderr
    assert result.stdout.strip().splitlines()[-1] == "HEAVY:", result.stdout
