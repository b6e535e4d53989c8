"""`coldroom compare`: terminal table, JSON contract, PDF of one or two pages, located errors.

The demo runs are shared by the tests of this module (one `compare` and one `size` process of
the demo, ~10 s together on a loaded machine: the slowness is CoolProp's start-up per process).
"""

from __future__ import annotations

import json
import math
import subprocess
import sys
from pathlib import Path

import pytest

REPO = Path(__file__).resolve().parents[2]
DEMO = REPO / "project_files" / "farm_shop_options.yaml"
COOLER = REPO / "project_files" / "produce_cooler.yaml"


def run(*args: str) -> subprocess.CompletedProcess[str]:
    return subprocess.run([sys.executable, "-m", "coldroom", *args], capture_output=True, text=True, timeout=180)


def invoke(*args: str) -> subprocess.CompletedProcess[str]:
    """The command in-process (typer's CliRunner), in the shape of :func:`run`."""
    from typer.testing import CliRunner

    from coldroom.cli import app

    r = CliRunner().invoke(app, list(args))
    return subprocess.CompletedProcess(list(args), r.exit_code, r.stdout, r.stderr)


@pytest.fixture(scope="module")
def demo(tmp_path_factory: pytest.TempPathFactory) -> dict:
    # the process-level run of `compare` (every option over a year of hourly bins: the command's one
    # smoke test) and `size` in process, shared by the tests below, once per module
    folder = tmp_path_factory.mktemp("compare")
    pdf = folder / "compare.pdf"
    done = run("compare", str(DEMO), "--json", "-", "--out", str(pdf))
    assert done.returncode == 0, done.stderr
    sized = invoke("size", str(DEMO), "--out", str(folder / "sheet.pdf"), "--json", "-")
    assert sized.returncode == 0, sized.stderr
    return {"json": json.loads(done.stdout), "terminal": done.stderr, "pdf": pdf, "size": json.loads(sized.stdout)}


def test_json_contract(demo: dict) -> None:
    options = demo["json"]["options"]
    assert [o["name"] for o in options] == ["base", "R-290", "R-744", "150 mm cooler panels", "R-290 + 150 mm"]
    keys = {"name", "design_capacity_w", "compressor_input_power_w", "annual_energy_kwh", "annual_energy_by_use_kwh",
            "annual_compressor_energy_kwh", "annual_electricity_cost", "currency", "refrigerants", "gwp", "gwp_basis",
            "charge_kg", "tewi_kg_co2e"}
    for o in options:
        assert keys <= set(o), keys - set(o)
        assert o["currency"] == "EUR" and o["gwp_basis"] == "AR4"
        assert set(o["annual_energy_by_use_kwh"]) == {"compressor", "fans", "defrost", "other"}
        assert math.isclose(sum(o["annual_energy_by_use_kwh"].values()), o["annual_energy_kwh"], rel_tol=1e-12)
        assert o["annual_compressor_energy_kwh"] == o["annual_energy_by_use_kwh"]["compressor"]
        assert math.isclose(o["annual_electricity_cost"], 0.28 * o["annual_energy_kwh"], rel_tol=1e-12)
        t = o["tewi_kg_co2e"]
        assert set(t) == {"direct_leakage", "direct_end_of_life", "indirect", "total"}
        assert math.isclose(t["indirect"], o["annual_energy_kwh"] * 0.35 * 15, rel_tol=1e-12)
    assert options[1]["refrigerants"] == ["R-290"] and options[2]["refrigerants"] == ["R-744"]
    assert "recovery_factor" in options[0]["economics"]["defaulted"]


def test_base_design_capacity_is_the_sum_of_size(demo: dict) -> None:
    rooms = demo["size"]["rooms"]
    assert math.isclose(demo["json"]["options"][0]["design_capacity_w"],
                        sum(r["design_capacity_w"] for r in rooms), rel_tol=1e-9)
    systems = demo["size"]["systems"]
    assert math.isclose(demo["json"]["options"][0]["compressor_input_power_w"],
                        sum(s["compressor_input_power_w"] for s in systems), rel_tol=1e-9)


def test_terminal_and_pdf(demo: dict) -> None:
    from pypdf import PdfReader

    assert "R-744 (A1)" in demo["terminal"] and "(default)" in demo["terminal"]
    reader = PdfReader(str(demo["pdf"]))
    assert 1 <= len(reader.pages) <= 2
    text = " ".join(page.extract_text() for page in reader.pages)
    assert "Options compared over a year" in text and "TEWI over 15 years" in text and "EN 378" in text


def test_no_ambient_is_a_located_error(tmp_path: Path) -> None:
    done = invoke("compare", str(COOLER))
    assert done.returncode == 65
    assert done.stderr.startswith(f"{COOLER}:") and "design.weather" in done.stderr
    assert len(done.stderr.strip().splitlines()) == 1


def test_weather_file_relative_to_the_project(tmp_path: Path) -> None:
    header = ["LOCATION,Testville,TS,Nowhere,Invented,000000,51.5,-0.1,0.0,20.0", "DESIGN CONDITIONS,0",
              "TYPICAL/EXTREME PERIODS,0", "GROUND TEMPERATURES,0", "HOLIDAYS/DAYLIGHT SAVINGS,No,0,0,0",
              "COMMENTS 1,", "COMMENTS 2,", "DATA PERIODS,1,1,Data,Sunday, 1/ 1,12/31"]
    rows = [f"1999,1,1,{h % 24 + 1},60,flags,{10 + 12 * math.sin(h / 1400):.1f},5,70,101325" for h in range(8760)]
    (tmp_path / "site").mkdir()
    (tmp_path / "site" / "w.epw").write_text("\n".join(header + rows) + "\n", encoding="utf-8")
    text = COOLER.read_text(encoding="utf-8").replace("design:\n", "design:\n  weather: site/w.epw\n", 1)
    project = tmp_path / "p.yaml"
    project.write_text(text, encoding="utf-8")
    done = invoke("compare", str(project), "--json", "-")
    assert done.returncode == 0, done.stderr
    result = json.loads(done.stdout)
    assert sum(b["duration_h"] for b in result["ambient_bins"]) == 8760
    assert "w.epw" in result["ambient_source"]
    # a missing weather file is a located error too
    project.write_text(text.replace("site/w.epw", "site/none.epw"), encoding="utf-8")
    done = invoke("compare", str(project))
    assert done.returncode == 65 and "not found" in done.stderr


def test_r744_project_is_sized_transcritical(tmp_path: Path) -> None:
    text = COOLER.read_text(encoding="utf-8").replace("refrigerant: R-448A", "refrigerant: R-744", 1)
    assert "R-744" in text
    project = tmp_path / "co2.yaml"
    project.write_text(text, encoding="utf-8")
    done = invoke("size", str(project), "--out", str(tmp_path / "co2.pdf"), "--json", "-")
    assert done.returncode == 0, done.stderr
    cycle = json.loads(done.stdout)["rooms"][0]["cycle"]
    assert cycle["transcritical"] is True
    # gas-cooler outlet = condenser air (the 32 °C design dry bulb) + the 3 K approach
    assert cycle["gas_cooler_outlet_temperature_c"] == pytest.approx(35.0)
