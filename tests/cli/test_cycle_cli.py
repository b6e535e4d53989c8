"""`coldroom refrigerants` and `coldroom cycle` on the command line.

Contracts from DEVELOPERS.md "Contracts": options and units, --json keys, one-line errors,
exit codes (1 calculation impossible, 2 usage: any bad option value), and no CoolProp
import for --help / the refrigerant listing.
"""

from __future__ import annotations

import json
import subprocess
import sys

import pytest

COLDROOM = [sys.executable, "-m", "coldroom"]

PROBE = """
import sys
from coldroom.cli import app
try:
    app(sys.argv[1:], standalone_mode=False)
except SystemExit:
    pass
print('COOLPROP:' + str(any(m.split('.')[0] == 'CoolProp' for m in sys.modules)))
"""


class Result:
    def __init__(self, returncode: int, stdout: str, stderr: str) -> None:
        self.returncode, self.stdout, self.stderr = returncode, stdout, stderr


def run(*args: str) -> Result:
    """In-process run (CoolProp is imported once for the module, keeping this fast)."""
    from typer.testing import CliRunner

    from coldroom.cli import app

    r = CliRunner().invoke(app, list(args))
    return Result(r.exit_code, r.stdout, r.stderr)


def test_real_process_exit_codes_and_stdout():
    # one end-to-end run through `python -m coldroom` (a fresh process; two interpreter starts and
    # one CoolProp import: about 3 s, the price of checking the real exit codes and streams)
    ok = subprocess.run([*COLDROOM, "cycle", "-r", "R134a", "--evaporating", "-10", "--condensing", "40",
                         "--capacity", "5 kW", "--json"], capture_output=True, text=True, timeout=120)
    assert ok.returncode == 0 and json.loads(ok.stdout)["refrigerant"] == "R-134a"
    bad = subprocess.run([*COLDROOM, "cycle", "-r", "R999", "--evaporating", "-10", "--condensing", "40",
                          "--capacity", "5"], capture_output=True, text=True, timeout=120)
    assert bad.returncode == 2 and len(bad.stderr.strip().splitlines()) == 1 and bad.stdout == ""  # a usage error


@pytest.mark.parametrize("args", [["--help"], ["refrigerants"], ["cycle", "--help"]], ids=["help", "list", "cycle-help"])
def test_listing_and_help_do_not_import_coolprop(args):
    result = subprocess.run([sys.executable, "-c", PROBE, *args], capture_output=True, text=True, timeout=60)
    assert result.stdout.strip().splitlines()[-1] == "COOLPROP:False", result.stdout + result.stderr


def test_probe_detects_coolprop_when_cycle_runs():
    # the probe itself can fail: a real cycle does import CoolProp (a fresh process that imports
    # CoolProp: 2-3 s, needed to show the import probe above can see CoolProp at all)
    args = ["cycle", "--refrigerant", "R134a", "--evaporating", "-10", "--condensing", "40", "--capacity", "5 kW"]
    result = subprocess.run([sys.executable, "-c", PROBE, *args], capture_output=True, text=True, timeout=60)
    assert result.stdout.strip().splitlines()[-1] == "COOLPROP:True"


def test_refrigerants_lists_catalogue():
    result = run("refrigerants")
    assert result.returncode == 0
    for name in ("R-448A", "R-1234ze(E)", "R-717", "R-744"):
        assert name in result.stdout
    assert "B2L" in result.stdout


def test_cycle_json_contract():
    result = run("cycle", "--refrigerant", "R448A", "--evaporating", "-10", "--condensing", "40",
                 "--capacity", "5 kW", "--json")
    assert result.returncode == 0, result.stderr
    d = json.loads(result.stdout)
    for key in ("refrigerant", "mass_flow_kg_s", "suction_volume_flow_m3_h", "displacement_m3_h",
                "compressor_power_w", "condenser_duty_w", "cop", "discharge_temperature_c", "pressure_ratio"):
        assert key in d
    assert d["refrigerant"] == "R-448A"
    assert d["capacity_w"] == 5000.0
    assert [set(s) for s in d["states"]] == [{"p_pa", "t_c", "h_j_kg", "s_j_kg_k", "quality"}] * 4
    # energy balance survives the JSON round trip (the default suction line picks up heat too)
    assert d["suction_line_heat_gain_w"] > 0.0
    total_in = d["capacity_w"] + d["suction_line_heat_gain_w"] + d["compressor_power_w"]
    assert total_in == pytest.approx(d["condenser_duty_w"], rel=1e-9)


def test_cycle_units_at_the_edge():
    # 14 °F = −10 °C, 104 °F = 40 °C; 17 060.7 Btu/h ≈ 5 kW (1 Btu/h = 0.29307 W, NIST SP 811)
    a = json.loads(run("cycle", "-r", "R134a", "--evaporating", "14 °F", "--condensing", "313.15 K",
                       "--capacity", "17060.7 Btu/h", "--json").stdout)
    b = json.loads(run("cycle", "-r", "R134a", "--evaporating", "-10", "--condensing", "40",
                       "--capacity", "5000", "--json").stdout)
    assert a["evaporating_temperature_c"] == pytest.approx(-10.0, abs=1e-9)
    assert a["condensing_temperature_c"] == pytest.approx(40.0, abs=1e-9)
    assert a["capacity_w"] == pytest.approx(5000.0, rel=1e-4)
    assert a["cop"] == pytest.approx(b["cop"], rel=1e-9)
    tr = json.loads(run("cycle", "-r", "R134a", "--evaporating", "-10", "--condensing", "40",
                        "--capacity", "1.5 TR", "--json").stdout)
    assert tr["capacity_w"] == pytest.approx(1.5 * 3516.85, rel=1e-5)  # 1 TR = 12 000 Btu/h


def test_ideal_cycle_flags():
    d = json.loads(run("cycle", "-r", "R134a", "--evaporating", "-10", "--condensing", "40", "--capacity", "5 kW",
                       "--superheat", "0", "--suction-line-superheat", "0", "--subcooling", "0", "--isentropic-efficiency", "1",
                       "--json").stdout)
    s1, s2, s3, s4 = d["states"]
    assert s1["quality"] == 1.0 and s3["quality"] == 0.0
    assert s2["s_j_kg_k"] == pytest.approx(s1["s_j_kg_k"], rel=1e-7)
    assert s4["h_j_kg"] == s3["h_j_kg"]


def test_table_output():
    result = run("cycle", "-r", "R-290", "--evaporating", "-10", "--condensing", "40", "--capacity", "5 kW")
    assert result.returncode == 0
    assert "compressor suction" in result.stdout and "COP" in result.stdout
    assert "A3" in result.stdout  # flammability warning shown


@pytest.mark.parametrize(
    "args, code, text",
    [
        (["-r", "R999", "--evaporating", "-10", "--condensing", "40", "--capacity", "5"], 2, "unknown refrigerant"),
        (["-r", "R134a", "--evaporating", "-10", "--condensing", "40", "--capacity", "1e-320"], 2, "capacity"),
        (["-r", "R134a", "--evaporating", "-10", "--condensing", "40", "--capacity", "5 kW",
          "--isentropic-efficiency", "0"], 2, "isentropic efficiency"),
        (["-r", "R134a", "--evaporating", "-10", "--condensing", "40", "--capacity", "5 furlongs"], 2, "unit"),
        (["-r", "R134a", "--evaporating", "50", "--condensing", "40", "--capacity", "5 kW"], 1, "condensing"),
        (["-r", "R744", "--evaporating", "-10", "--condensing", "40", "--capacity", "5 kW"], 2, "--gas-cooler-outlet"),
        (["-r", "R134a", "--evaporating", "-10", "--capacity", "5 kW"], 2, "condensing"),
        (["-r", "R134a", "--evaporating", "-10", "--condensing", "40"], 2, "capacity"),
    ],
    ids=["bad-name", "tiny-capacity", "zero-efficiency", "bad-unit", "evap-above-cond", "r744-transcritical", "no-condensing", "no-capacity"],
)
def test_errors_one_line_with_exit_code(args, code, text):
    result = run("cycle", *args)
    assert result.returncode == code, result.stderr
    assert text in result.stderr.lower() or text in result.stderr
    if result.stderr.startswith("coldroom:"):  # ours (typer's own usage errors print a box)
        assert len(result.stderr.strip().splitlines()) == 1
    assert result.stdout == ""


def test_r744_transcritical_cli():
    d = json.loads(run("cycle", "-r", "CO2", "--evaporating", "-10", "--gas-cooler-outlet", "35",
                       "--capacity", "5 kW", "--json").stdout)
    assert d["transcritical"] is True and d["condensing_temperature_c"] is None
    assert d["discharge_pressure_pa"] > 7.3773e6
