"""`coldroom select`: terminal table, JSON contract, nothing-fits exit 1, catalogue schema."""

from __future__ import annotations

import json
import subprocess
import sys
from pathlib import Path

REPO = Path(__file__).resolve().parents[2]
CATALOGUE = REPO / "project_files" / "catalogue" / "demo_catalogue.yaml"


def run(*args: str) -> subprocess.CompletedProcess[str]:
    return subprocess.run([sys.executable, "-m", "coldroom", *args], capture_output=True, text=True, timeout=180)


def invoke(*args: str) -> subprocess.CompletedProcess[str]:
    """The command in-process (typer's CliRunner), in the shape of :func:`run`: the one process-level
    run of this file is its smoke test; the rest need no interpreter and CoolProp start of their own."""
    from typer.testing import CliRunner

    from coldroom.cli import app

    r = CliRunner().invoke(app, list(args))
    return subprocess.CompletedProcess(list(args), r.exit_code, r.stdout, r.stderr)


def test_select_json_contract(tmp_path: Path) -> None:
    """End to end in a subprocess (CoolProp start, selection, `size` and the PDF): slower than 3 s on
    purpose -- one run checks the JSON contract, the terminal table and the sheet's page 1 together."""
    pdf = tmp_path / "quote.pdf"
    result = run("select", str(REPO / "project_files" / "combo_cooler_freezer.yaml"), "--catalogue",
                 str(REPO / "project_files" / "catalogue" / "demo_catalogue.csv"), "--json", "-", "--out", str(pdf))
    assert result.returncode == 0, result.stderr
    from pypdf import PdfReader

    pages = [page.extract_text() for page in PdfReader(pdf).pages]
    assert "Selected equipment (from the catalogue)" in pages[0] and "3 920 EUR" in pages[0]
    assert any("Balance point (dew)" in text and "Units set aside" in text for text in pages)
    assert "condensing unit" in result.stderr and "total" in result.stderr  # the table goes to stderr with --json -
    data = json.loads(result.stdout)
    (entry,) = data["selection"]
    for key in ("system", "condensing_unit", "unit_coolers", "total_price", "currency", "alternatives", "rejected"):
        assert key in entry
    unit = entry["condensing_unit"]
    assert set(unit) >= {"model", "price", "balance", "existing_unit"}
    assert set(unit["balance"]) >= {"evaporating_temperature_c", "condensing_temperature_c", "capacity_w", "daily_run_time_needed_h",
                                    "margin_percent", "max_ambient_temperature_c"}
    assert [c["room"] for c in entry["unit_coolers"]] == ["Cooler", "Freezer"]
    for cooler in entry["unit_coolers"]:
        assert set(cooler) >= {"room", "model", "count", "price"}
    assert entry["total_price"] == unit["price"] + sum(c["price"] for c in entry["unit_coolers"])
    assert entry["currency"] == "EUR"
    assert 1 <= len(entry["alternatives"]) <= 2
    for alternative in entry["alternatives"]:
        assert alternative["total_price"] >= entry["total_price"]
        assert set(alternative["condensing_unit"]["balance"]) == set(unit["balance"])
    assert entry["rejected"]["wrong_refrigerant"] == 4
    assert unit["balance"]["capacity_w"] >= entry["required_capacity_w"]
    # the job as chosen (issue 24): the same rooms[] and systems[] as size, equipped by the selection
    (system,) = data["systems"]
    assert [room["name"] for room in data["rooms"]] == ["Cooler", "Freezer"]
    assert system["equipment_basis"] == "selected"
    assert system["compressor_input_power_w"] == unit["balance"]["power_w"]
    assert system["design_capacity_w"] == entry["required_capacity_w"]
    watts = system["compressor_input_power_w"]
    assert f"{watts / 1000:.2f} kW" in pages[0]  # page 1 shows the chosen unit's input


def test_nothing_fits_exits_1_with_the_reasons_and_the_duty() -> None:
    # the heated-slab freezer runs on R-449A; the demo catalogue has R-448A and R-290 units only
    result = invoke("select", str(REPO / "project_files" / "freezer_heated_slab.yaml"), "--catalogue", str(CATALOGUE))
    assert result.returncode == 1
    assert result.stderr.count("\n") == 1
    assert "15 wrong refrigerant" in result.stderr
    assert "a suitable R-449A unit gives at least" in result.stderr and "SST -26.0 °C" in result.stderr


def test_catalogue_schema() -> None:
    result = invoke("schema", "--catalogue")
    assert result.returncode == 0
    schema = json.loads(result.stdout)
    assert schema["title"] == "coldroom equipment catalogue"
    assert {"currency", "condensing_units", "unit_coolers"} <= set(schema["properties"])


def test_select_refuses_to_write_over_the_catalogue(tmp_path: Path) -> None:
    result = invoke("select", str(REPO / "project_files" / "produce_cooler.yaml"), "--catalogue", str(CATALOGUE),
                 "--json", str(CATALOGUE))
    assert result.returncode == 73 and "refusing to write over the input" in result.stderr


def test_nothing_fits_speaks_the_projects_units(tmp_path: Path) -> None:
    catalogue = tmp_path / "propane_only.yaml"
    catalogue.write_text(
        "currency: USD\ncondensing_units:\n  - model: P1\n    refrigerant: R-290\n    price: 900\n"
        "    rated_point: {capacity: 2 kW, evaporating_temperature: -10, condensing_temperature: 45}\n"
        "unit_coolers:\n  - {model: C1, capacity: 3 kW, air_on: 0, evaporating_temperature: -8, air_flow: 2000 m³/h,"
        " throw: 20 m, fan_power: 90 W, defrost: off_cycle, fin_spacing: 4 mm, price: 400}\n",
        encoding="utf-8",
    )
    result = invoke("select", str(REPO / "project_files" / "meat_cooler_ip.yaml"), "--catalogue", str(catalogue))
    assert result.returncode == 1
    assert "1 wrong refrigerant" in result.stderr and "Btu/h" in result.stderr and "°F" in result.stderr
