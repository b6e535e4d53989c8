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


def test_the_pulldown_integrates_without_scipy_or_numpy() -> None:
    """The pull-down's integrator and its h(T) tables are plain Python (issue #27: the
    ``scipy.integrate`` package import cost more than a room's whole pull-down, and numpy's
    import more than a room's tables)."""
    probe = (
        "import sys\n"
        "from coldroom.loads.pulldown import ThermalMass, simulate\n"
        "from coldroom.physics.products import get_product\n"
        "food = get_product('strawberries').properties()\n"
        "m = ThermalMass('block', 1000.0, 300.0, 10.0, enthalpy=food.enthalpy, final_temperature=2.5)\n"
        "simulate(5e4, [m], lambda t: 10e3, lambda t: 2e3, set_point=0.0, initial_air_temperature=10.0,"
        " duration=7200.0)\n"
        "print('HEAVY:' + ','.join(sorted(m for m in sys.modules if m.split('.')[0] in ('scipy', 'numpy'))))\n"
    )
    result = subprocess.run([sys.executable, "-c", probe], capture_output=True, text=True, timeout=60)
    assert result.stdout.strip().splitlines()[-1] == "HEAVY:", result.stdout + result.stderr
