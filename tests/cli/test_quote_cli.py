"""`coldroom quote` on the demo: the JSON contract, its arithmetic, panel areas and tube metres
checked against independent calculations from the project file, a missing price."""

from __future__ import annotations

import json
import subprocess
from pathlib import Path

import pytest
import yaml

REPO = Path(__file__).resolve().parents[2]
DEMO = REPO / "project_files" / "combo_quote.yaml"
CATALOGUE = REPO / "project_files" / "catalogue" / "quote_catalogue.yaml"
LINE_KEYS = {"section", "item", "model", "quantity", "unit", "unit_price", "total_price", "price_needed", "basis"}


def invoke(*args: str) -> subprocess.CompletedProcess[str]:
    from typer.testing import CliRunner

    from coldroom.cli import app

    r = CliRunner().invoke(app, list(args))
    return subprocess.CompletedProcess(list(args), r.exit_code, r.stdout, r.stderr)


@pytest.fixture(scope="module")
def demo() -> dict:
    done = invoke("quote", str(DEMO), "--catalogue", str(CATALOGUE), "--json", "-")
    assert done.returncode == 0, done.stderr
    return json.loads(done.stdout)["quote"]


def test_contract_keys(demo: dict) -> None:
    assert set(demo) >= {"lines", "subtotal_price", "margin_percent", "margin_price", "tax_percent", "tax_price",
                         "total_price", "currency", "complete", "missing_prices", "valves", "electrical"}
    for line in demo["lines"]:
        assert set(line) >= LINE_KEYS and line["basis"]
    for valve in demo["valves"]:
        assert set(valve) >= {"room", "model", "duty_w", "capacity_at_conditions_w", "pressure_drop_pa", "subcooling_k"}
        assert valve["capacity_at_conditions_w"] >= valve["duty_w"]
    for system in demo["electrical"]:
        assert "total_running_current_a" in system
        for item in system["items"]:
            assert {"supply", "running_current_a", "locked_rotor_current_a"} <= set(item)
    assert demo["complete"] and demo["missing_prices"] == [] and demo["currency"] == "EUR"


def test_arithmetic(demo: dict) -> None:
    """Σ lines, margin on the subtotal, tax on subtotal + margin (the quote: block's 22 % and 20 %)."""
    for line in demo["lines"]:
        assert line["total_price"] == pytest.approx(line["quantity"] * line["unit_price"], rel=1e-12)
    subtotal = sum(line["total_price"] for line in demo["lines"])
    assert demo["subtotal_price"] == pytest.approx(subtotal, rel=1e-12)
    assert demo["margin_percent"] == pytest.approx(22.0) and demo["tax_percent"] == pytest.approx(20.0)
    assert demo["margin_price"] == pytest.approx(subtotal * 0.22, rel=1e-12)
    assert demo["tax_price"] == pytest.approx((subtotal * 1.22) * 0.20, rel=1e-12)
    assert demo["total_price"] == pytest.approx(subtotal * 1.22 * 1.20, rel=1e-12)


def test_panel_areas_from_the_room_geometry(demo: dict) -> None:
    """Independent count from the combo demo's dimensions (inside, measured), worked by hand:
    outside box = inside + the panel thickness on each side (the ceiling on top, floors not panel).
    Cooler 4.0 × 3.0 × 2.6 with 100 mm walls and ceiling, 150 mm east partition:
    outside 4.25 × 3.2 × 2.7. Freezer 2.5 × 3.0 × 2.6 all 150 mm: outside 2.8 × 3.3 × 2.75.
    The shared partition counted once, with the cooler (first listed), less the freezer door
    0.8 × 2.0; the cooler's shop door 0.9 × 2.0 off its south wall."""
    project = yaml.safe_load(DEMO.read_text(encoding="utf-8"))
    cooler, freezer = project["rooms"]
    assert cooler["dimensions"]["length"] == "4.0 m" and freezer["dimensions"]["length"] == "2.5 m"
    c_l, c_w, c_h = 4.0 + 0.10 + 0.15, 3.0 + 0.10 + 0.10, 2.6 + 0.10
    f_l, f_w, f_h = 2.5 + 0.15 + 0.15, 3.0 + 0.15 + 0.15, 2.6 + 0.15
    at_100 = 2 * c_l * c_h - 0.9 * 2.0 + c_w * c_h + c_l * c_w  # north, south less door, west, ceiling
    at_150 = (c_w * c_h - 0.8 * 2.0) + 2 * f_l * f_h + f_w * f_h + f_l * f_w  # partition, N, S, E, ceiling
    panels = {line["item"]: line["quantity"] for line in demo["lines"] if line["section"] == "panels"}
    assert panels["insulated panel 100 mm"] == pytest.approx(at_100, abs=0.006)
    assert panels["insulated panel 150 mm"] == pytest.approx(at_150, abs=0.006)


def test_tube_metres_match_the_piping_lengths(demo: dict) -> None:
    """Every metre of the piping: block (14 + 14 + 1.5 m) plus the stated 10 % allowance, and the
    suction line's metres again as insulation."""
    piping = yaml.safe_load(DEMO.read_text(encoding="utf-8"))["systems"][0]["piping"]
    lengths = [float(piping[k]["length"].split()[0]) for k in ("suction", "liquid", "discharge")]
    tube = [line for line in demo["lines"] if line["section"] == "pipework" and line["item"].startswith("copper")]
    assert sum(line["quantity"] for line in tube) == pytest.approx(sum(lengths) * 1.10, abs=0.011)
    lag = [line for line in demo["lines"] if line["item"].startswith("suction insulation")]
    assert [line["quantity"] for line in lag] == [pytest.approx(lengths[0] * 1.10, abs=0.006)]


def test_a_missing_price_leaves_the_quote_incomplete(tmp_path: Path) -> None:
    data = yaml.safe_load(CATALOGUE.read_text(encoding="utf-8"))
    data["panels"] = [p for p in data["panels"] if p["thickness"] != "150 mm"]
    catalogue = tmp_path / "cat.yaml"
    catalogue.write_text(yaml.safe_dump(data, allow_unicode=True), encoding="utf-8")
    done = invoke("quote", str(DEMO), "--catalogue", str(catalogue), "--json", "-")
    assert done.returncode == 0, done.stderr
    quote = json.loads(done.stdout)["quote"]
    assert quote["complete"] is False
    (missing,) = [line for line in quote["lines"] if line["price_needed"]]
    assert missing["item"] == "insulated panel 150 mm" and missing["total_price"] is None
    assert quote["missing_prices"] == ["panels: insulated panel 150 mm"]
    assert quote["subtotal_price"] == pytest.approx(sum(x["total_price"] for x in quote["lines"] if x["total_price"]))


def _evaluate(sheet, formula: str) -> float:  # type: ignore[no-untyped-def]
    """The few formula shapes the costing workbook writes, evaluated from their input cells."""
    import re

    def value(ref: str) -> float:
        v = sheet[ref].value
        return _evaluate(sheet, v) if isinstance(v, str) and v.startswith("=") else v

    if m := re.fullmatch(r'=IF\((F\d+)="","",(D\d+)\*(F\d+)\)', formula):
        return 0.0 if sheet[m[1]].value is None else value(m[2]) * value(m[3])
    if m := re.fullmatch(r"=SUM\(G(\d+):G(\d+)\)", formula):
        return sum(value(f"G{r}") for r in range(int(m[1]), int(m[2]) + 1))
    if m := re.fullmatch(r"=(G\d+)\*(F\d+)", formula):
        return value(m[1]) * value(m[2])
    if m := re.fullmatch(r"=\((G\d+)\+(G\d+)\)\*(F\d+)", formula):
        return (value(m[1]) + value(m[2])) * value(m[3])
    if m := re.fullmatch(r"=(G\d+)\+(G\d+)\+(G\d+)", formula):
        return value(m[1]) + value(m[2]) + value(m[3])
    raise AssertionError(f"unexpected formula {formula}")


@pytest.mark.parametrize("drop_150", [False, True])
def test_costing_workbook_totals_equal_the_json(tmp_path: Path, drop_150: bool) -> None:
    """The workbook's line totals, subtotal, margin, tax and total are formulas; evaluated from their
    input cells they equal the JSON; a line without a price is highlighted and adds nothing."""
    import openpyxl

    catalogue = CATALOGUE
    if drop_150:
        data = yaml.safe_load(CATALOGUE.read_text(encoding="utf-8"))
        data["panels"] = [p for p in data["panels"] if p["thickness"] != "150 mm"]
        catalogue = tmp_path / "cat.yaml"
        catalogue.write_text(yaml.safe_dump(data, allow_unicode=True), encoding="utf-8")
    xlsx = tmp_path / "costing.xlsx"
    done = invoke("quote", str(DEMO), "--catalogue", str(catalogue), "--json", "-", "--costing", str(xlsx))
    assert done.returncode == 0, done.stderr
    quote = json.loads(done.stdout)["quote"]
    sheet = openpyxl.load_workbook(xlsx)["Costing"]
    labels = {sheet.cell(row=r, column=5).value: r for r in range(1, sheet.max_row + 1)}
    for key, label in (("subtotal_price", "Subtotal"), ("margin_price", "Margin"), ("tax_price", "Tax"),
                       ("total_price", "Total")):
        formula = sheet.cell(row=labels[label], column=7).value
        assert formula.startswith("=")
        assert _evaluate(sheet, formula) == pytest.approx(quote[key], rel=1e-12), label
    rows = [r for r in range(6, labels["Subtotal"]) if sheet.cell(row=r, column=2).value]
    assert len(rows) == len(quote["lines"])
    for r, line in zip(rows, quote["lines"]):
        assert sheet.cell(row=r, column=2).value == line["item"]
        highlighted = sheet.cell(row=r, column=2).fill.fgColor.rgb.endswith("FFF2B0")
        assert highlighted == line["price_needed"]


def test_proposal_for_the_customer(tmp_path: Path) -> None:
    """The proposal names the scope, equipment, price, terms and codes; it shows no unit price, cost or
    margin; an incomplete quote prints as a draft that says so."""
    from pypdf import PdfReader

    pdf = tmp_path / "proposal.pdf"
    done = invoke("quote", str(DEMO), "--catalogue", str(CATALOGUE), "--json", "-", "--out", str(pdf))
    assert done.returncode == 0, done.stderr
    quote = json.loads(done.stdout)["quote"]
    text = "\n".join(page.extract_text() for page in PdfReader(pdf).pages)
    for words in ("Scope", "Equipment, duties and balance point", "What is included", "What is not included",
                  "Electrical supply", "Validity and terms", "Safety", "EN 378", "ISO 5149", "ASHRAE 15",
                  "IEC 60335-2-89", "valid for 30 days", "DX-L16"):
        assert words in text, words
    total = f"{quote['total_price']:,.2f}".replace(",", " ")
    assert total in text
    assert "margin" not in text.lower() and "subtotal" not in text.lower() and "DRAFT" not in text
    for line in quote["lines"]:
        assert f"{line['unit_price']:,.2f}".replace(",", " ") + " EUR" not in text, line["item"]
    data = yaml.safe_load(CATALOGUE.read_text(encoding="utf-8"))
    data["doors"] = []
    catalogue = tmp_path / "cat.yaml"
    catalogue.write_text(yaml.safe_dump(data, allow_unicode=True), encoding="utf-8")
    draft = tmp_path / "draft.pdf"
    done = invoke("quote", str(DEMO), "--catalogue", str(catalogue), "--out", str(draft))
    assert done.returncode == 0, done.stderr
    assert "DRAFT" in PdfReader(draft).pages[0].extract_text()


def test_nec_quote_matches_the_result_schema(tmp_path: Path) -> None:
    """With electrical_code: NEC the schedule adds MCA and MOP per unit and per system; the document
    still validates against `coldroom schema --result quote`."""
    import jsonschema

    project = tmp_path / "nec.yaml"
    project.write_text(DEMO.read_text(encoding="utf-8").replace("electrical_code: IEC", "electrical_code: NEC"),
                       encoding="utf-8")
    done = invoke("quote", str(project), "--catalogue", str(CATALOGUE), "--json", "-")
    assert done.returncode == 0, done.stderr
    document = json.loads(done.stdout)
    schema = json.loads(invoke("schema", "--result", "quote").stdout)
    jsonschema.validate(document, schema)
    (system,) = document["quote"]["electrical"]
    assert system["maximum_overcurrent_protection_a"] in (15, 20, 25, 30, 35, 40, 45, 50, 60)
    for item in system["items"]:
        assert item["maximum_overcurrent_protection_a"] >= 15
        assert item["minimum_circuit_ampacity_a"] >= item["running_current_a"]
