"""Command-line behaviour of ``coldroom size`` (DEVELOPERS.md "Contracts": outputs, JSON keys, exit codes).

In-process through typer's CliRunner (CoolProp is imported once), plus one
subprocess run for the lazy-import promise of ``coldroom size --help``.
"""

from __future__ import annotations

import json
import os
import shutil
import subprocess
import sys
from pathlib import Path

import pytest
from typer.testing import CliRunner

from coldroom.cli import app

REPO = Path(__file__).resolve().parents[2]
DEMO = REPO / "project_files" / "produce_cooler.yaml"

runner = CliRunner()



def _not_json(constant: str) -> None:
    raise ValueError(f"{constant} is not JSON (strict RFC 8259)")

def _run(*args: str):
    return runner.invoke(app, list(args), catch_exceptions=False)


@pytest.fixture()
def project(tmp_path: Path) -> Path:
    target = tmp_path / "produce_cooler.yaml"
    shutil.copy(DEMO, target)
    return target


def test_size_writes_pdf_beside_the_input_and_json(project: Path):
    out_json = project.with_name("result.json")
    result = _run("size", str(project), "--json", str(out_json))
    assert result.exit_code == 0, result.output
    pdf = project.with_suffix(".pdf")
    assert pdf.read_bytes().startswith(b"%PDF-")
    data = json.loads(out_json.read_text(encoding="utf-8"), parse_constant=_not_json)  # strict: no NaN/Infinity
    room = data["rooms"][0]
    # DEVELOPERS.md "Contracts": keys of `size`
    for key in ("name", "loads_w", "daily_energy_kwh", "required_capacity_w", "cycle"):
        assert key in room
    assert set(room["loads_w"]) >= {"transmission", "product", "infiltration", "internal"}
    cycle = room["cycle"]
    for key in ("refrigerant", "mass_flow_kg_s", "suction_volume_flow_m3_h", "displacement_m3_h",
                "compressor_power_w", "condenser_duty_w", "cop", "discharge_temperature_c", "pressure_ratio"):
        assert isinstance(cycle[key], (str, float, int)), key
    assert [sorted(s) for s in cycle["states"]] == [["h_j_kg", "p_pa", "quality", "s_j_kg_k", "t_c"]] * 4
    assert data["versions"]["coldroom"] and data["versions"]["coolprop"]
    assert len(data["project"]["sha256"]) == 64
    # the terminal summary names the figures with units
    assert "required capacity" in result.output and "kW" in result.output
    assert "mass flow" in result.output and "kg/s" in result.output
    assert f"wrote {pdf}" in result.output


def test_json_to_stdout_moves_the_summary_to_stderr(project: Path):
    r = CliRunner(mix_stderr=False) if "mix_stderr" in CliRunner.__init__.__code__.co_varnames else CliRunner()
    result = r.invoke(app, ["size", str(project), "--json", "-"], catch_exceptions=False)
    assert result.exit_code == 0
    data = json.loads(result.stdout)  # stdout is nothing but the JSON
    assert data["rooms"][0]["name"] == "Produce cooler"
    assert "required capacity" in result.stderr


def test_existing_output_needs_force(project: Path):
    pdf = project.with_suffix(".pdf")
    pdf.write_bytes(b"keep me")
    result = _run("size", str(project))
    assert result.exit_code == 73
    assert "already exists" in result.output and "--force" in result.output
    assert pdf.read_bytes() == b"keep me"
    forced = _run("size", str(project), "--force")
    assert forced.exit_code == 0
    assert pdf.read_bytes().startswith(b"%PDF-")


def test_never_writes_over_the_input(project: Path):
    before = project.read_bytes()
    for args in (["--out", str(project)], ["--out", str(project), "--force"], ["--json", str(project), "--force"]):
        result = _run("size", str(project), *args)
        assert result.exit_code == 73, args
        assert "input" in result.output
        assert project.read_bytes() == before


def test_out_and_json_must_differ(project: Path):
    target = project.with_name("both.out")
    result = _run("size", str(project), "--out", str(target), "--json", str(target))
    assert result.exit_code == 73
    assert not target.exists()


def test_invalid_project_exits_65(tmp_path: Path):
    bad = tmp_path / "bad.yaml"
    bad.write_text(DEMO.read_text(encoding="utf-8").replace("temperature: 2 °C", "temperature: 2 °Q"), encoding="utf-8")
    result = _run("size", str(bad))
    assert result.exit_code == 65
    assert "bad.yaml:" in result.output
    assert not bad.with_suffix(".pdf").exists()


def test_missing_file_exits_65(tmp_path: Path):
    result = _run("size", str(tmp_path / "nope.yaml"))
    assert result.exit_code == 65
    assert "no such file" in result.output


def test_impossible_cycle_exits_1_naming_the_room(project: Path, monkeypatch):
    """A CalculationError from the cycle becomes exit 1 with one line naming the room.

    Project validation already refuses the cycles we could build from a file
    (below the triple point, above the critical point), so the cycle's failure
    is simulated here.
    """
    import coldroom.physics.cycle
    import coldroom.physics.system_cycle
    from coldroom.errors import PropertyRangeError

    def impossible(*args, **kwargs):
        raise PropertyRangeError("suction state outside the property model's range")

    monkeypatch.setattr(coldroom.physics.cycle, "solve_cycle", impossible)
    monkeypatch.setattr(coldroom.physics.system_cycle, "solve_cycle", impossible)
    result = _run("size", str(project))
    assert result.exit_code == 1, result.output
    assert "Produce cooler" in result.output and "outside the property model's range" in result.output
    assert len(result.output.strip().splitlines()) == 1
    assert not project.with_suffix(".pdf").exists()


def test_size_help_imports_neither_coolprop_nor_reportlab():
    code = (
        "import sys\n"
        "from coldroom.cli import app\n"
        "try:\n"
        "    app(['size', '--help'])\n"
        "except SystemExit:\n"
        "    pass\n"
        "print('CoolProp' in sys.modules, 'reportlab' in sys.modules)\n"
    )
    out = subprocess.run([sys.executable, "-c", code], capture_output=True, text=True, check=True,
                         env={**os.environ, "COLUMNS": "100"})
    assert out.stdout.strip().splitlines()[-1] == "False False"


def test_same_input_same_bytes_with_source_date_epoch(tmp_path: Path, monkeypatch):
    monkeypatch.setenv("SOURCE_DATE_EPOCH", "1790000000")
    undated = "\n".join(line for line in DEMO.read_text(encoding="utf-8").splitlines() if not line.strip().startswith("date:"))
    path = tmp_path / "undated.yaml"
    path.write_text(undated + "\n", encoding="utf-8")
    a, b = tmp_path / "a.pdf", tmp_path / "b.pdf"
    assert _run("size", str(path), "--out", str(a)).exit_code == 0
    assert _run("size", str(path), "--out", str(b)).exit_code == 0
    assert a.read_bytes() == b.read_bytes()
    assert b"D:20260921000000" in a.read_bytes()
