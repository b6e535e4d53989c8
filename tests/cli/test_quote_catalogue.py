"""The quote catalogue's kinds (panel … labour), electrical fields and a unit's rating table:
read from YAML and CSV alike, in the catalogue schema, and a rating-table unit checked by `coldroom check`."""

from __future__ import annotations

import json
import subprocess
from pathlib import Path

import yaml

from coldroom.inputs.catalogue import load_catalogue, parse_catalogue

REPO = Path(__file__).resolve().parents[2]
QUOTE_CATALOGUE = REPO / "project_files" / "catalogue" / "quote_catalogue.yaml"
KINDS = ("panels", "doors", "expansion_valves", "accessories", "tubes", "insulation", "refrigerants", "labour")


def invoke(*args: str) -> subprocess.CompletedProcess[str]:
    from typer.testing import CliRunner

    from coldroom.cli import app

    r = CliRunner().invoke(app, list(args))
    return subprocess.CompletedProcess(list(args), r.exit_code, r.stdout, r.stderr)


def test_every_kind_read_the_same_from_yaml_and_csv() -> None:
    from_yaml = load_catalogue(QUOTE_CATALOGUE)
    assert load_catalogue(QUOTE_CATALOGUE.with_suffix(".csv")) == from_yaml
    for group in KINDS:
        assert getattr(from_yaml, group), group
    table = [u for u in from_yaml.condensing_units if u.rating_table is not None]
    assert table and table[0].condenser is None
    assert {u.supply for u in from_yaml.condensing_units if u.supply} == {"230 V 1~ 50 Hz", "400 V 3~ 50 Hz"}


def test_schema_covers_the_new_kinds() -> None:
    done = invoke("schema", "--catalogue")
    assert done.returncode == 0
    schema = json.loads(done.stdout)
    assert set(KINDS) <= set(schema["properties"])
    assert "rating_table" in schema["$defs"]["CondensingUnitEntry"]["properties"]


def _error(text: str) -> str:
    try:
        parse_catalogue(text.encode(), "cat.yaml")
    except Exception as exc:  # ProjectFileError
        return str(exc)
    raise AssertionError("accepted")


def test_bad_items_located() -> None:
    assert "cat.yaml:3:" in _error("currency: EUR\npanels:\n  - {model: P, price: 3}\n")
    message = _error("currency: EUR\ntubes:\n  - {series: EN 12735-1, size: 13 x 1.0 mm, price: 3}\n")
    assert "not a EN 12735-1 size" in message and "12 x 1.0 mm" in message
    message = _error("currency: EUR\nlabour:\n  - {task: panels, hours: 1, per: m2}\n  - {task: panels, hours: 2, per: m2}\n")
    assert "listed twice" in message and "cat.yaml:4:" in message
    message = _error("currency: EUR\nunit_coolers: []\ncondensing_units:\n  - model: X\n    refrigerant: R-448A\n"
                     "    price: 1\n    supply: 400 V 50 Hz\n    rated_point: {capacity: 2 kW, evaporating_temperature: -10,"
                     " condensing_temperature: 45}\n")
    assert "supply" in message and "400 V 3~ 50 Hz" in message


def test_rating_table_with_a_condenser_refused() -> None:
    data = yaml.safe_load(QUOTE_CATALOGUE.read_text(encoding="utf-8"))
    unit = next(u for u in data["condensing_units"] if "rating_table" in u)
    unit["condenser"] = {"heat_rejection": "3 kW", "temperature_difference": "15 K"}
    message = _error(yaml.safe_dump({"currency": "EUR", "condensing_units": [unit]}, allow_unicode=True))
    assert "rating_table rates the whole unit" in message


def test_check_runs_a_rating_table_unit(tmp_path: Path) -> None:
    """The rating-table unit as an existing_unit of the produce cooler: `check` solves its balance."""
    from coldroom.design.selection import CoolerChoice, existing_unit_block

    entry = next(u for u in load_catalogue(QUOTE_CATALOGUE).condensing_units if u.rating_table is not None)
    coil = CoolerChoice("Produce cooler", "UC", 1, 0.0, 0.0, 8.0, 0.0, 0.0, 5000.0, 8.0, 0.0, 0.0, -6.0, 2.0, "")
    project = yaml.safe_load((REPO / "project_files" / "produce_cooler.yaml").read_text(encoding="utf-8"))
    project["rooms"][0]["existing_unit"] = existing_unit_block(entry, coil)
    path = tmp_path / "p.yaml"
    path.write_text(yaml.safe_dump(project, allow_unicode=True), encoding="utf-8")
    done = invoke("check", str(path), "--json", "-")
    assert done.returncode == 0, done.stderr
    data = json.loads(done.stdout)
    text = json.dumps(data)
    assert "rating table" in text


def test_every_kind_read_the_same_from_xlsx(tmp_path: Path) -> None:
    """The table form (catalogue_rows) written to a spreadsheet reads back as the YAML catalogue."""
    import openpyxl

    from coldroom.inputs.catalogue import catalogue_rows

    data = yaml.safe_load(QUOTE_CATALOGUE.read_text(encoding="utf-8"))
    book = openpyxl.Workbook()
    for row in catalogue_rows(data):
        book.active.append(row)
    path = tmp_path / "quote.xlsx"
    book.save(path)
    assert load_catalogue(path) == load_catalogue(QUOTE_CATALOGUE)
