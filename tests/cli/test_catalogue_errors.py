"""Bad catalogue input: one located line (`file:line:col` YAML, `file:row:column` CSV/XLSX), exit 65."""

from __future__ import annotations

import csv
import io
import subprocess
import sys
from pathlib import Path

import pytest

from coldroom.inputs.catalogue import catalogue_rows, parse_catalogue
from coldroom.errors import ProjectFileError

REPO = Path(__file__).resolve().parents[2]
DEMO = REPO / "project_files" / "catalogue" / "demo_catalogue.yaml"
PROJECT = REPO / "project_files" / "produce_cooler.yaml"

GOOD_UNIT = """\
  - model: U1
    refrigerant: R-448A
    price: 1000
    rated_point: {capacity: 2 kW, evaporating_temperature: -10, condensing_temperature: 45, power: 1 kW}
"""
GOOD_COOLER = """\
  - model: C1
    capacity: 2 kW
    air_on: 0
    evaporating_temperature: -8
    air_flow: 1500 m³/h
    throw: 8 m
    fan_power: 90 W
    defrost: off_cycle
    fin_spacing: 4 mm
    price: 500
"""


def yaml_error(text: str) -> ProjectFileError:
    with pytest.raises(ProjectFileError) as info:
        parse_catalogue(text.encode(), "cat.yaml")
    return info.value


def test_yaml_unknown_refrigerant_is_located_at_the_key() -> None:
    e = yaml_error("currency: EUR\ncondensing_units:\n" + GOOD_UNIT.replace("R-448A", "R-448X"))
    assert (e.line, e.column) == (4, 5)
    assert e.key == "condensing_units[0].refrigerant"
    assert "unknown refrigerant 'R-448X'" in e.message and "R-448A" in e.message


def test_yaml_unit_cooler_listed_as_condensing_unit() -> None:
    e = yaml_error("currency: EUR\ncondensing_units:\n" + GOOD_COOLER)
    assert e.format().startswith("cat.yaml:3:5: condensing_units[0]: ")
    assert "wrong kind of unit" in e.message and "unit_coolers" in e.message


def test_yaml_condensing_unit_listed_as_unit_cooler() -> None:
    e = yaml_error("currency: EUR\nunit_coolers:\n" + GOOD_UNIT)
    assert e.line == 3 and "wrong kind of unit" in e.message and "condensing_units" in e.message


def test_yaml_duplicate_model() -> None:
    e = yaml_error("currency: EUR\ncondensing_units:\n" + GOOD_UNIT + GOOD_UNIT.replace("U1", "u1"))
    assert (e.line, e.column) == (7, 5) and e.key == "condensing_units[1].model"
    assert "listed twice (first at 3:5)" in e.message


def test_yaml_polynomial_without_envelope() -> None:
    unit = """\
  - model: P1
    refrigerant: R-448A
    price: 1000
    polynomial:
      capacity: [3000, 100, -20, 0, 0, 0, 0, 0, 0, 0]
      power: [500, 0, 20, 0, 0, 0, 0, 0, 0, 0]
      superheat: 10 K
      suction_min: -25
"""
    e = yaml_error("currency: EUR\ncondensing_units:\n" + unit)
    assert e.line == 3 and "without its envelope" in e.message
    assert "suction_max, discharge_min, discharge_max missing" in e.message


def test_yaml_missing_key() -> None:
    e = yaml_error("currency: EUR\nunit_coolers:\n" + GOOD_COOLER.replace("    throw: 8 m\n", ""))
    assert e.key == "unit_coolers[0].throw" and "required key is missing" in e.message and e.line == 3


def table(text: str) -> list[list[str]]:
    return list(csv.reader(io.StringIO(text)))


def demo_rows() -> list[list]:
    from coldroom.inputs.safeyaml import load_yaml

    return catalogue_rows(load_yaml(DEMO.read_bytes()).data)


def to_csv(rows: list[list]) -> bytes:
    buffer = io.StringIO()
    csv.writer(buffer, lineterminator="\n").writerows([["" if v is None else v for v in r] for r in rows])
    return buffer.getvalue().encode()


def to_xlsx(rows: list[list]) -> bytes:
    import openpyxl

    book = openpyxl.Workbook()
    for r in rows:
        book.active.append(r)
    buffer = io.BytesIO()
    book.save(buffer)
    return buffer.getvalue()


def table_error(rows: list[list], suffix: str) -> ProjectFileError:
    raw = to_csv(rows) if suffix == ".csv" else to_xlsx(rows)
    with pytest.raises(ProjectFileError) as info:
        parse_catalogue(raw, "cat" + suffix)
    return info.value


def col(suffix: str, header: list, name: str) -> object:
    i = header.index(name)
    return i + 1 if suffix == ".csv" else "ABCDEFGHIJKLMNOPQRSTUVWXYZ"[i] if i < 26 else "A" + "ABCDEFGHIJKLMNOPQRSTUVWXYZ"[i - 26]


@pytest.mark.parametrize("suffix", [".csv", ".xlsx"])
def test_table_missing_column(suffix: str) -> None:
    rows = demo_rows()
    i = rows[0].index("price")
    rows = [r[:i] + r[i + 1:] for r in rows]
    e = table_error(rows, suffix)
    assert e.line == 1 and e.key == "price" and "required column is missing" in e.message


@pytest.mark.parametrize("suffix", [".csv", ".xlsx"])
def test_table_unknown_refrigerant(suffix: str) -> None:
    rows = demo_rows()
    rows[3][rows[0].index("refrigerant")] = "R-999"
    e = table_error(rows, suffix)
    assert (e.line, e.column, e.key) == (4, col(suffix, rows[0], "refrigerant"), "refrigerant")
    assert "unknown refrigerant 'R-999'" in e.message


@pytest.mark.parametrize("suffix", [".csv", ".xlsx"])
def test_table_wrong_kind(suffix: str) -> None:
    rows = demo_rows()
    last = len(rows) - 1  # a unit cooler row marked as a condensing unit
    rows[last][0] = "condensing_unit"
    e = table_error(rows, suffix)
    assert e.line == last + 1 and "wrong kind of unit" in e.message


@pytest.mark.parametrize("suffix", [".csv", ".xlsx"])
def test_table_unknown_kind(suffix: str) -> None:
    rows = demo_rows()
    rows[5][0] = "compressor"
    e = table_error(rows, suffix)
    assert (e.line, e.column, e.key) == (6, col(suffix, rows[0], "kind"), "kind")


@pytest.mark.parametrize("suffix", [".csv", ".xlsx"])
def test_table_duplicate_model(suffix: str) -> None:
    rows = demo_rows()
    rows[4][1] = rows[2][1]
    e = table_error(rows, suffix)
    assert (e.line, e.column) == (5, col(suffix, rows[0], "model"))
    assert "listed twice (first at 3:" in e.message


@pytest.mark.parametrize("suffix", [".csv", ".xlsx"])
def test_table_polynomial_without_envelope(suffix: str) -> None:
    rows = demo_rows()
    rows[2][rows[0].index("polynomial.discharge_max")] = None
    e = table_error(rows, suffix)
    assert e.line == 3 and "without its envelope" in e.message and "discharge_max missing" in e.message


def test_cli_bad_catalogue_exits_65_with_one_line(tmp_path: Path) -> None:
    bad = tmp_path / "bad.yaml"
    bad.write_text("currency: EUR\ncondensing_units:\n" + GOOD_UNIT + GOOD_UNIT, encoding="utf-8")
    result = subprocess.run(
        [sys.executable, "-m", "coldroom", "select", str(PROJECT), "--catalogue", str(bad)],
        capture_output=True, text=True, timeout=120,
    )
    assert result.returncode == 65
    assert result.stderr.count("\n") == 1
    assert result.stderr.startswith(f"{bad}:7:5: condensing_units[1].model: model 'U1' is listed twice")
