"""`coldroom check`: verdict per room, JSON output, exit codes, refusals."""

from __future__ import annotations

import json
import subprocess
import sys
from pathlib import Path

REPO = Path(__file__).resolve().parents[2]
DEMO = REPO / "project_files" / "cooler_to_freezer.yaml"
COOLER = REPO / "project_files" / "produce_cooler.yaml"



def _not_json(constant: str) -> None:
    raise ValueError(f"{constant} is not JSON (strict RFC 8259)")

def run(*args: str) -> subprocess.CompletedProcess[str]:
    return subprocess.run([sys.executable, "-m", "coldroom", *args], capture_output=True, text=True, timeout=120)


def invoke(*args: str) -> subprocess.CompletedProcess[str]:
    """The command in-process (typer's CliRunner), in the shape of :func:`run`: the one process-level
    run of this file is its smoke test; the rest need no interpreter and CoolProp start of their own."""
    from typer.testing import CliRunner

    from coldroom.cli import app

    r = CliRunner().invoke(app, list(args))
    return subprocess.CompletedProcess(list(args), r.exit_code, r.stdout, r.stderr)


def test_check_demo_prints_the_verdict() -> None:
    # the process-level run of `coldroom check` (interpreter start, CoolProp import ~2 s, the
    # balance-point and highest-ambient searches): about 3-5 s, the one slow test of this file
    result = run("check", str(DEMO))
    assert result.returncode == 0, result.stderr
    out = result.stdout
    assert "Room: Freezer (ex produce cooler)" in out
    # the demo's medium-temperature unit on a freezer: never "HOLDS" (issue 24)
    assert "verdict: NOT SUITABLE: medium-temperature unit at low-temperature suction" in out
    assert "capacity at balance" in out
    assert "WARNING:" in out and "NOT SUITABLE" in out
    assert "Raise the set point to" not in out


def test_check_json_to_stdout() -> None:
    # in-process (typer's CliRunner, separate stdout and stderr): the process path is the test above
    from typer.testing import CliRunner

    from coldroom.cli import app

    result = CliRunner().invoke(app, ["check", str(DEMO), "--json", "-"])
    assert result.exit_code == 0, result.stderr
    data = json.loads(result.stdout, parse_constant=_not_json)  # only strict JSON on stdout; the text goes to stderr
    assert "verdict" in result.stderr
    room = data["rooms"][0]
    unit = room["existing_unit"]
    assert unit["holds"] is False and unit["suitable"] is False and unit["within_envelope"] is False
    for key in ("capacity_at_balance_w", "required_capacity_w", "daily_run_time_needed_h", "margin_percent", "max_ambient_temperature_c",
                "balance_evaporating_temperature_c", "balance_condensing_temperature_c", "warnings"):
        assert key in unit
    assert len(unit["chart"]["ambient_temperature_c"]) == len(unit["chart"]["unit_capacity_w"]) == len(unit["chart"]["room_load_w"])


def test_room_without_unit_is_listed() -> None:
    result = invoke("check", str(COOLER))
    assert result.returncode == 0, result.stderr
    assert "no existing unit given" in result.stdout


def test_json_file_is_not_overwritten_without_force(tmp_path: Path) -> None:
    """Refused before any computation: the existing file is checked first (no balance search runs)."""
    target = tmp_path / "check.json"
    target.write_text("precious\n", encoding="utf-8")
    refused = invoke("check", str(DEMO), "--json", str(target))
    assert refused.returncode == 73
    assert "--force" in refused.stderr and len(refused.stderr.strip().splitlines()) == 1
    assert refused.stdout == ""  # nothing was computed or printed
    assert target.read_text(encoding="utf-8") == "precious\n"
    forced = invoke("check", str(COOLER), "--json", str(target), "--force")  # no existing unit: quick
    assert forced.returncode == 0, forced.stderr
    assert json.loads(target.read_text(encoding="utf-8"))["rooms"][0]["existing_unit"] is None


def test_json_over_the_input_is_refused(tmp_path: Path) -> None:
    copy = tmp_path / "p.yaml"
    copy.write_text(DEMO.read_text(encoding="utf-8"), encoding="utf-8")
    result = invoke("check", str(copy), "--json", str(copy), "--force")
    assert result.returncode == 73
    assert copy.read_text(encoding="utf-8") == DEMO.read_text(encoding="utf-8")


def test_unit_with_two_compressor_descriptions_is_invalid(tmp_path: Path) -> None:
    text = DEMO.read_text(encoding="utf-8")
    old = "      unit_cooler: {capacity: 4.0 kW, dt1: 8 K}\n"
    assert old in text
    bad = text.replace(
        old,
        "      polynomial: {capacity: [1,0,0,0,0,0,0,0,0,0], power: [1,0,0,0,0,0,0,0,0,0], superheat: 10 K,\n"
        "                   suction_min: -20, suction_max: 10, discharge_min: 25, discharge_max: 60}\n" + old,
    )
    path = tmp_path / "bad.yaml"
    path.write_text(bad, encoding="utf-8")
    result = invoke("check", str(path))
    assert result.returncode == 65
    line = result.stderr.strip()
    assert len(line.splitlines()) == 1
    assert "rooms[0].existing_unit" in line and "exactly one" in line


def test_unknown_unit_refrigerant_names_close_names(tmp_path: Path) -> None:
    text = DEMO.read_text(encoding="utf-8")
    old = "      refrigerant: R-448A\n      rated_point:"
    assert old in text
    path = tmp_path / "bad.yaml"
    path.write_text(text.replace(old, "      refrigerant: R-448\n      rated_point:"), encoding="utf-8")
    result = invoke("check", str(path))
    assert result.returncode == 65
    assert "R-448A" in result.stderr


def test_polynomial_with_wrong_number_of_coefficients_is_invalid(tmp_path: Path) -> None:
    text = DEMO.read_text(encoding="utf-8")
    start = text.index("      rated_point:")
    end = text.index("      unit_cooler:")
    poly = (
        "      polynomial: {capacity: [1,0,0], power: [1,0,0,0,0,0,0,0,0,0], superheat: 10 K,\n"
        "                   suction_min: -20, suction_max: 10, discharge_min: 25, discharge_max: 60}\n"
    )
    path = tmp_path / "bad.yaml"
    path.write_text(text[:start] + poly + text[end:], encoding="utf-8")
    result = invoke("check", str(path))
    assert result.returncode == 65
    assert "existing_unit.polynomial.capacity" in result.stderr


def test_check_help_and_rooms_without_unit_do_not_import_coolprop() -> None:
    """CoolProp is imported only when a room has an existing unit to evaluate."""
    probe = (
        "import sys\n"
        "from coldroom.cli import app\n"
        "try:\n"
        "    app(sys.argv[1:], standalone_mode=False)\n"
        "except SystemExit:\n"
        "    pass\n"
        "print('HEAVY:' + ','.join(sorted(m for m in sys.modules if m.split('.')[0] in ('CoolProp', 'reportlab'))))\n"
    )
    for args in (["check", "--help"], ["check", str(COOLER)]):
        result = subprocess.run([sys.executable, "-c", probe, *args], capture_output=True, text=True, timeout=120)
        assert result.stdout.strip().splitlines()[-1] == "HEAVY:", (args, result.stdout, result.stderr)
