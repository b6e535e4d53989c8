"""Hostile input and faults, round three: catalogues, options, weather, gauges, the files a run reads.

Each test makes its own input and states what must happen: the exit code of the project's
contract (DEVELOPERS.md "Contracts": 0 ok, 1 calculation impossible, 2 usage, 65 invalid input
file, 73 cannot write output), one line and no traceback on stderr, the input unchanged, no
partial file left. Hangs and blow-ups run in a child process under a time limit and an
address-space limit. Numbered as the cases of the hostile-input round they come from.
"""

from __future__ import annotations

import json
import math
import os
import subprocess
import sys
from pathlib import Path

import pytest

REPO = Path(__file__).resolve().parents[2]
COOLER = REPO / "project_files" / "produce_cooler.yaml"
OPTIONS = REPO / "project_files" / "farm_shop_options.yaml"
CATALOGUE = REPO / "project_files" / "catalogue" / "demo_catalogue.yaml"

#: Seconds a refused input may take in a child process, interpreter and CoolProp start included
#: (a shared 2-core box; a hang is cut off at HANG_LIMIT).
HANG_LIMIT = 60.0
#: Address space of a child process that reads a hostile file [byte]: a blow-up fails inside it.
MEMORY_LIMIT = 1 << 30


def invoke(*args: str) -> subprocess.CompletedProcess[str]:
    """The command in-process (typer's CliRunner), in the shape of a finished process."""
    from typer.testing import CliRunner

    from coldroom.cli import app

    r = CliRunner().invoke(app, [str(a) for a in args])
    assert r.exception is None or isinstance(r.exception, SystemExit), repr(r.exception)
    return subprocess.CompletedProcess(list(args), r.exit_code, r.stdout, r.stderr)


def _limits() -> None:  # pragma: no cover - runs in the child
    import resource

    resource.setrlimit(resource.RLIMIT_AS, (MEMORY_LIMIT, MEMORY_LIMIT))


def run(*args: str, cwd: Path | None = None) -> subprocess.CompletedProcess[str]:
    """The command in a child process under a time and an address-space limit."""
    return subprocess.run(
        [sys.executable, "-m", "coldroom", *[str(a) for a in args]], capture_output=True, text=True,
        timeout=HANG_LIMIT, cwd=cwd, preexec_fn=_limits if sys.platform != "win32" else None,
    )


def one_line(stderr: str) -> str:
    lines = stderr.strip().splitlines()
    assert len(lines) == 1, stderr
    assert "Traceback" not in stderr and "internal error" not in stderr, stderr
    return lines[0]


def epw_text(rows: int = 8760, comment: str = "", dated: bool = True) -> str:
    """An EPW file of an invented site: the eight header records, then *rows* hourly records."""
    header = ["LOCATION,Testville,TS,Nowhere,Invented,000000,51.5,-0.1,0.0,20.0", "DESIGN CONDITIONS,0",
              "TYPICAL/EXTREME PERIODS,0", "GROUND TEMPERATURES,0", "HOLIDAYS/DAYLIGHT SAVINGS,No,0,0,0",
              f"COMMENTS 1,{comment}", "COMMENTS 2,", "DATA PERIODS,1,1,Data,Sunday, 1/ 1,12/31"]
    body = []
    for h in range(rows):
        when = f"1999,{1 + min(h // 730, 11)},{1 + (h // 24) % 28},{h % 24 + 1},60" if dated else ",,,,"
        body.append(f"{when},flags,{10 + 12 * math.sin(h / 1400):.1f},5,70,101325")
    return "\n".join(header + body) + "\n"


def snapshot(folder: Path) -> dict[str, bytes]:
    return {str(p.relative_to(folder)): p.read_bytes() for p in sorted(folder.rglob("*")) if p.is_file() and not p.is_symlink()}


# --- 1. every file a run reads is an input ------------------------------------------------------


@pytest.fixture()
def weather_job(tmp_path: Path) -> Path:
    """A project reading site/w.epw, with an option reading site/w2.epw."""
    (tmp_path / "site").mkdir()
    (tmp_path / "site" / "w.epw").write_text(epw_text(), encoding="utf-8")
    (tmp_path / "site" / "w2.epw").write_text(epw_text().replace("Testville", "Otherton"), encoding="utf-8")
    text = COOLER.read_text(encoding="utf-8").replace("design:\n", "design:\n  weather: site/w.epw\n", 1)
    text += "\noptions:\n  - name: elsewhere\n    changes:\n      design.weather: site/w2.epw\n"
    project = tmp_path / "p.yaml"
    project.write_text(text, encoding="utf-8")
    return project


@pytest.mark.parametrize("over", ["site/w.epw", "site/w2.epw"], ids=["base-weather", "option-weather"])
@pytest.mark.parametrize("option", ["--json", "--out"])
def test_01_weather_files_are_never_written_over(weather_job: Path, over: str, option: str) -> None:
    folder = weather_job.parent
    before = snapshot(folder)
    done = invoke("compare", weather_job, option, folder / over, "--force")
    assert done.returncode == 73, done.stderr
    assert "refusing to write over the input file" in one_line(done.stderr) and over.split("/")[1] in done.stderr
    assert snapshot(folder) == before


def test_01_weather_file_through_a_symlink_is_never_written_over(weather_job: Path) -> None:
    folder = weather_job.parent
    (folder / "link.epw").symlink_to(folder / "site" / "w.epw")
    before = snapshot(folder)
    for command in ("compare", "load", "size", "check"):
        done = invoke(command, weather_job, "--json", folder / "link.epw", "--force")
        assert done.returncode == 73, (command, done.stderr)
        one_line(done.stderr)
    assert snapshot(folder) == before and (folder / "link.epw").is_symlink()


def test_01_catalogue_is_never_written_over(tmp_path: Path) -> None:
    catalogue = tmp_path / "cat.yaml"
    catalogue.write_bytes(CATALOGUE.read_bytes())
    before = snapshot(tmp_path)
    done = invoke("select", COOLER, "--catalogue", catalogue, "--json", catalogue, "--force")
    assert done.returncode == 73 and "refusing to write over the input file" in one_line(done.stderr)
    assert snapshot(tmp_path) == before


# --- 2. a CSV row longer than its header ------------------------------------------------------------


CSV_HEADER = ("kind,model,currency,capacity,air_on,evaporating_temperature,air_flow,throw,fan_power,"
              "defrost,fin_spacing,price\n")


def test_02_csv_row_longer_than_its_header_is_refused_at_the_extra_cell() -> None:
    from coldroom.errors import ProjectFileError
    from coldroom.inputs.catalogue import parse_catalogue

    # an unquoted thousands comma in the last column: "1,490" becomes 1 and a stray 490
    text = CSV_HEADER + "unit_cooler,C1,EUR,2 kW,0,-8,1500 m³/h,8 m,90 W,off_cycle,4 mm,1,490\n"
    with pytest.raises(ProjectFileError) as info:
        parse_catalogue(text.encode(), "cat.csv")
    assert (info.value.line, info.value.column) == (2, 13)
    assert "'490'" in info.value.message and "thousands comma" in info.value.message


def test_02_xlsx_cell_under_a_nameless_column_is_refused() -> None:
    from coldroom.errors import ProjectFileError
    from coldroom.inputs.catalogue import catalogue_from_rows

    rows = [["kind", "model", "currency", "price", None], ["unit_cooler", "C1", "EUR", 1, 490]]
    with pytest.raises(ProjectFileError) as info:
        catalogue_from_rows(rows, "cat.xlsx", letters=True)
    assert (info.value.line, info.value.column) == (2, "E")


# --- 3. true/false where a number goes ---------------------------------------------------------------


@pytest.mark.parametrize(
    "old, new, key",
    [
        ("isentropic_efficiency", None, "isentropic_efficiency"),
        ("electricity_price: 0.28", "electricity_price: true", "economics.electricity_price"),
        ("emission_factor: 0.35", "emission_factor: TRUE", "economics.emission_factor"),
        ("{temperature: -6 °C, hours: 90}", "{temperature: -6 °C, hours: true}", "design.ambient_bins[0].hours"),
        ("{temperature: -3 °C, hours: 260}", "{temperature: false, hours: 260}", "design.ambient_bins[1].temperature"),
        ("condenser_td: 10 K", "condenser_td: true", "systems[0].condenser_td"),
    ],
)
def test_03_yes_no_is_refused_where_a_number_goes(tmp_path: Path, old: str, new: str | None, key: str) -> None:
    text = OPTIONS.read_text(encoding="utf-8")
    if new is None:  # a key the demo leaves at its default
        text = text.replace("    condenser_fan_power: 150 W\n", "    condenser_fan_power: 150 W\n    isentropic_efficiency: true\n")
        key = "systems[0].isentropic_efficiency"
    else:
        assert old in text
        text = text.replace(old, new, 1)
    project = tmp_path / "p.yaml"
    project.write_text(text, encoding="utf-8")
    done = invoke("validate", project)
    assert done.returncode == 65, done.stderr
    line = one_line(done.stderr)
    assert f": {key}: " in line, line
    assert "yes/no value where a number is expected" in line or "got True" in line, line


def test_03_yes_no_price_is_refused_in_yaml_and_xlsx_catalogues() -> None:
    from coldroom.errors import ProjectFileError
    from coldroom.inputs.catalogue import catalogue_from_rows, parse_catalogue

    text = CATALOGUE.read_text(encoding="utf-8")
    at = text.index("price: ") + len("price: ")
    end = text.index("\n", at)
    with pytest.raises(ProjectFileError) as info:
        parse_catalogue((text[:at] + "true" + text[end:]).encode(), "cat.yaml")
    assert info.value.key.endswith(".price") and "yes/no" in info.value.message
    rows = [["kind", "model", "currency", "price", "refrigerant", "rated_point.capacity",
             "rated_point.evaporating_temperature", "rated_point.condensing_temperature", "rated_point.power"],
            ["condensing_unit", "U1", "EUR", True, "R-448A", "2 kW", -10, 45, "1 kW"]]
    with pytest.raises(ProjectFileError) as info:
        catalogue_from_rows_and_validate(rows)
    assert (info.value.line, info.value.column) == (2, "D") and "yes/no" in info.value.message


def catalogue_from_rows_and_validate(rows: list) -> None:
    """A spreadsheet's rows through the reader's own path (openpyxl gives a boolean cell as bool)."""
    import openpyxl

    from coldroom.inputs.catalogue import parse_catalogue

    book = openpyxl.Workbook()
    for row in rows:
        book.active.append(row)
    import io

    buffer = io.BytesIO()
    book.save(buffer)
    parse_catalogue(buffer.getvalue(), "cat.xlsx")


# --- 4. no cycle at a bin: said, not skipped ---------------------------------------------------------


def test_04_bins_above_the_critical_point_are_named_not_extrapolated(tmp_path: Path) -> None:
    text = OPTIONS.read_text(encoding="utf-8")
    text = text.replace("    - {temperature: 33 °C, hours: 10}", "    - {temperature: 33 °C, hours: 5}\n"
                        "    - {temperature: 55 °C, hours: 5}")
    # R-404A's critical point is 72.1 °C (CoolProp): 55 °C + 20 K condenses above it
    text = text.replace("refrigerant: R-448A\n    condenser_td: 10 K", "refrigerant: R-404A\n    condenser_td: 20 K")
    project = tmp_path / "p.yaml"
    project.write_text(text, encoding="utf-8")
    done = invoke("compare", project, "--json", tmp_path / "out.json")
    assert done.returncode == 1, done.stderr
    line = one_line(done.stderr)
    assert "no cycle at the ambient bin 55 °C" in line and "CU-1" in line
    assert not (tmp_path / "out.json").exists()


# --- 5 and 6. an option cannot change the units or the currency ---------------------------------------


@pytest.mark.parametrize(
    "change, what",
    [("project.units: IP", "project.units"), ("project: {name: x, units: IP}", "project.units"),
     ("economics.currency: JPY", "the currency")],
)
def test_05_06_option_changing_units_or_currency_is_refused(tmp_path: Path, change: str, what: str) -> None:
    text = OPTIONS.read_text(encoding="utf-8") + f"  - name: elsewhere\n    changes:\n      {change}\n"
    project = tmp_path / "p.yaml"
    project.write_text(text, encoding="utf-8")
    done = invoke("compare", project, "--json", tmp_path / "out.json")
    assert done.returncode == 65, done.stderr
    line = one_line(done.stderr)
    assert f"option 'elsewhere': an option cannot change {what}" in line
    assert ".changes." in line.split(": ")[1]  # located at the change
    assert not (tmp_path / "out.json").exists()


# --- 7. an option with its own climate names it ------------------------------------------------------


def test_07_option_with_its_own_weather_names_it(weather_job: Path) -> None:
    done = invoke("compare", weather_job, "--json", "-")
    assert done.returncode == 0, done.stderr
    result = json.loads(done.stdout)
    base, other = result["options"]
    assert "w.epw" in result["ambient_source"] and "ambient_source" not in base
    assert "w2.epw" in other["ambient_source"] and "Otherton" in other["ambient_source"]
    assert sum(b["duration_h"] for b in other["ambient_bins"]) == 8760
    assert "ambient of option elsewhere: w2.epw (Otherton" in done.stderr  # the terminal text (stdout is JSON)
    import jsonschema

    from coldroom.output.json_schema import result_schema

    jsonschema.Draft202012Validator(result_schema("compare")).validate(result)  # the contract lists the keys


# --- 8. a gauge reading without its unit --------------------------------------------------------------


@pytest.mark.parametrize("option", ["--suction-pressure", "--discharge-pressure"])
def test_08_bare_pressure_is_refused_asking_for_a_unit(option: str) -> None:
    other = {"--suction-pressure": ["--condensing", "40"], "--discharge-pressure": ["--evaporating", "-10"]}[option]
    done = invoke("cycle", "-r", "R404A", option, "45", *other, "--capacity", "5 kW")
    assert done.returncode == 2, done.stderr
    line = one_line(done.stderr)
    assert option in line and "no unit" in line and "psig" in line
    assert done.stdout == ""


# --- 15. R-744: one boundary for the command line and the cycle ------------------------------------


def test_15_r744_below_the_boundary_by_pressure_condenses() -> None:
    # 72.5 bar absolute: dew 30.2 °C (CoolProp), under the critical 73.77 bar / 30.98 °C
    done = invoke("cycle", "-r", "R744", "--evaporating", "-10", "--discharge-pressure", "72.5 bar",
                  "--capacity", "5 kW", "--json")
    assert done.returncode == 0, done.stderr
    result = json.loads(done.stdout)
    assert result["transcritical"] is False
    assert result["condensing_temperature_c"] == pytest.approx(30.22, abs=0.05)


def test_15_r744_above_critical_without_gas_cooler_outlet_names_the_option() -> None:
    done = invoke("cycle", "-r", "R744", "--evaporating", "-10", "--discharge-pressure", "74 bar",
                  "--capacity", "5 kW")
    assert done.returncode == 2, done.stderr
    line = one_line(done.stderr)
    assert "--gas-cooler-outlet" in line and "None" not in line and done.stdout == ""
    done = invoke("cycle", "-r", "R744", "--evaporating", "-10", "--discharge-pressure", "74 bar",
                  "--gas-cooler-outlet", "35", "--capacity", "5 kW", "--json")
    assert done.returncode == 0 and json.loads(done.stdout)["transcritical"] is True


def test_15_one_boundary_for_pressure_and_temperature() -> None:
    from coldroom.physics.cycle import r744_boundary, r744_transcritical
    from coldroom.physics.refrigerant import get_fluid

    temperature, pressure = r744_boundary()
    fluid = get_fluid("R-744")
    assert temperature < fluid.critical_temperature and pressure < fluid.critical_pressure
    for side in (-1, 1):  # the same side whichever way the boundary is approached
        t = temperature + side * 0.01
        assert r744_transcritical(t) is r744_transcritical(pressure=fluid.dew_pressure(t)) is (side > 0)


# --- 9. XLSX bounds ------------------------------------------------------------------------------


def _workbook_with(sheet_xml: str, shared_xml: str | None = None) -> bytes:
    """A minimal .xlsx made by hand (openpyxl never writes the hostile parts)."""
    import io
    import zipfile

    buffer = io.BytesIO()
    with zipfile.ZipFile(buffer, "w", zipfile.ZIP_DEFLATED) as z:
        z.writestr("[Content_Types].xml",
                   '<?xml version="1.0"?><Types xmlns="http://schemas.openxmlformats.org/package/2006/content-types">'
                   '<Default Extension="rels" ContentType="application/vnd.openxmlformats-package.relationships+xml"/>'
                   '<Default Extension="xml" ContentType="application/xml"/>'
                   '<Override PartName="/xl/workbook.xml" ContentType="application/vnd.openxmlformats-officedocument.spreadsheetml.sheet.main+xml"/>'
                   '<Override PartName="/xl/worksheets/sheet1.xml" ContentType="application/vnd.openxmlformats-officedocument.spreadsheetml.worksheet+xml"/>'
                   + ('<Override PartName="/xl/sharedStrings.xml" ContentType="application/vnd.openxmlformats-officedocument.spreadsheetml.sharedStrings+xml"/>' if shared_xml else "")
                   + "</Types>")
        z.writestr("_rels/.rels", '<?xml version="1.0"?><Relationships xmlns="http://schemas.openxmlformats.org/package/2006/relationships">'
                   '<Relationship Id="rId1" Type="http://schemas.openxmlformats.org/officeDocument/2006/relationships/officeDocument" Target="xl/workbook.xml"/></Relationships>')
        z.writestr("xl/workbook.xml", '<?xml version="1.0"?><workbook xmlns="http://schemas.openxmlformats.org/spreadsheetml/2006/main" '
                   'xmlns:r="http://schemas.openxmlformats.org/officeDocument/2006/relationships"><sheets>'
                   '<sheet name="Units" sheetId="1" r:id="rId1"/></sheets></workbook>')
        z.writestr("xl/_rels/workbook.xml.rels", '<?xml version="1.0"?><Relationships xmlns="http://schemas.openxmlformats.org/package/2006/relationships">'
                   '<Relationship Id="rId1" Type="http://schemas.openxmlformats.org/officeDocument/2006/relationships/worksheet" Target="worksheets/sheet1.xml"/>'
                   + ('<Relationship Id="rId2" Type="http://schemas.openxmlformats.org/officeDocument/2006/relationships/sharedStrings" Target="sharedStrings.xml"/>' if shared_xml else "")
                   + "</Relationships>")
        z.writestr("xl/worksheets/sheet1.xml", sheet_xml)
        if shared_xml:
            z.writestr("xl/sharedStrings.xml", shared_xml)
    return buffer.getvalue()


SHEET = '<?xml version="1.0"?><worksheet xmlns="http://schemas.openxmlformats.org/spreadsheetml/2006/main">{dim}<sheetData>{rows}</sheetData></worksheet>'


@pytest.mark.parametrize("case", ["declared-whole-sheet", "empty-rows", "shared-strings"])
def test_09_xlsx_is_bounded_in_rows_columns_and_size(tmp_path: Path, case: str) -> None:
    if case == "declared-whole-sheet":
        raw = _workbook_with(SHEET.format(dim='<dimension ref="A1:XFD1048576"/>',
                                          rows='<row r="1"><c r="A1" t="inlineStr"><is><t>kind</t></is></c></row>'))
    elif case == "empty-rows":
        rows = "".join(f'<row r="{r}"/>' for r in range(1, 40000)) + '<row r="1048576"><c r="A1048576"><v>1</v></c></row>'
        raw = _workbook_with(SHEET.format(dim="", rows=rows))
    else:
        shared = ('<?xml version="1.0"?><sst xmlns="http://schemas.openxmlformats.org/spreadsheetml/2006/main">'
                  + "<si><t>x</t></si>" * 400_000 + "</sst>")
        raw = _workbook_with(SHEET.format(dim="", rows='<row r="1"><c r="A1" t="s"><v>0</v></c></row>'), shared)
    assert len(raw) < 300_000  # small on disk
    book = tmp_path / "cat.xlsx"
    book.write_bytes(raw)
    done = run("select", COOLER, "--catalogue", book, cwd=tmp_path)
    assert done.returncode == 65, done.stderr
    assert one_line(done.stderr).startswith(str(book))
    assert book.read_bytes() == raw and sorted(p.name for p in tmp_path.iterdir()) == ["cat.xlsx"]


# --- 10 and 11. weather file and catalogue: regular files, bounded, located --------------------------


POSIX = pytest.mark.skipif(sys.platform == "win32", reason="FIFOs, devices and symlink loops are POSIX")


@POSIX
@pytest.mark.parametrize("case", ["fifo", "dev-zero", "symlink-loop", "long-comment", "no-dates"])
def test_10_weather_file_guards(tmp_path: Path, case: str) -> None:
    site = tmp_path / "site"
    site.mkdir()
    weather = site / "w.epw"
    expected = {"fifo": "named pipe", "dev-zero": "larger than the limit", "symlink-loop": "cannot read",
                "long-comment": "longer than", "no-dates": "month"}[case]
    if case == "fifo":
        os.mkfifo(weather)
    elif case == "dev-zero":
        weather.symlink_to("/dev/zero")
    elif case == "symlink-loop":
        weather.symlink_to(site / "loop.epw")
        (site / "loop.epw").symlink_to(weather)
    elif case == "long-comment":
        weather.write_text(epw_text(comment="x" * 140_000), encoding="utf-8")
        expected = "weather"
    else:
        weather.write_text(epw_text(dated=False), encoding="utf-8")
    text = COOLER.read_text(encoding="utf-8").replace("design:\n", "design:\n  weather: site/w.epw\n", 1)
    project = tmp_path / "p.yaml"
    project.write_text(text, encoding="utf-8")
    done = run("compare", project, "--json", tmp_path / "out.json", cwd=tmp_path)
    assert done.returncode == 65, done.stderr
    line = one_line(done.stderr)
    assert "w.epw" in line and expected in line, line
    assert not (tmp_path / "out.json").exists()


@POSIX
@pytest.mark.parametrize("which", ["catalogue", "project"])
def test_11_fifo_as_catalogue_or_project_is_refused_at_once(tmp_path: Path, which: str) -> None:
    fifo = tmp_path / ("cat.yaml" if which == "catalogue" else "p.yaml")
    os.mkfifo(fifo)
    project = fifo if which == "project" else COOLER
    catalogue = fifo if which == "catalogue" else CATALOGUE
    done = run("select", project, "--catalogue", catalogue, cwd=tmp_path)
    assert done.returncode == 65, done.stderr
    assert "named pipe" in one_line(done.stderr)


# --- 12. catalogue columns ----------------------------------------------------------------------


@pytest.mark.parametrize("header", ["model.note", "condenser"])
def test_12_a_column_and_a_key_under_it_are_refused(header: str) -> None:
    from coldroom.errors import ProjectFileError
    from coldroom.inputs.catalogue import parse_catalogue

    text = f"kind,model,currency,price,condenser.heat_rejection,{header}\ncondensing_unit,U1,EUR,1,5 kW,x\n"
    with pytest.raises(ProjectFileError) as info:
        parse_catalogue(text.encode(), "cat.csv")
    assert info.value.line == 1 and "column of its own" in info.value.message


def test_12_a_huge_csv_cell_is_a_located_error() -> None:
    from coldroom.errors import ProjectFileError
    from coldroom.inputs.catalogue import parse_catalogue

    text = "kind,model,currency,price\nunit_cooler,C1,EUR,1\nunit_cooler," + "x" * 140_000 + ",EUR,1\n"
    with pytest.raises(ProjectFileError) as info:
        parse_catalogue(text.encode(), "cat.csv")
    assert info.value.line == 3 and "longer than" in info.value.message


# --- 13. a vanishing unit-cooler capacity --------------------------------------------------------------


@pytest.mark.parametrize("capacity", ["1e-320 W", "5e-324 W", "0.001 W"])
def test_13_vanishing_cooler_capacity_is_refused(capacity: str) -> None:
    from coldroom.errors import ProjectFileError
    from coldroom.inputs.catalogue import parse_catalogue

    text = CATALOGUE.read_text(encoding="utf-8")
    at = text.index("capacity: ", text.index("unit_coolers:")) + len("capacity: ")
    with pytest.raises(ProjectFileError) as info:
        parse_catalogue((text[:at] + capacity + text[text.index("\n", at):]).encode(), "cat.yaml")
    assert info.value.key.endswith("capacity") and "outside the valid range" in info.value.message


# --- 14. option path indices: ASCII digits only ----------------------------------------------------


@pytest.mark.parametrize("index", ["¹", "١", "０"])
def test_14_option_index_in_other_digits_is_refused(tmp_path: Path, index: str) -> None:
    text = COOLER.read_text(encoding="utf-8") + (
        f"\noptions:\n  - name: other\n    changes:\n      rooms.{index}.temperature: 3\n")
    project = tmp_path / "p.yaml"
    project.write_text(text, encoding="utf-8")
    done = invoke("validate", project)
    assert done.returncode == 65, done.stderr
    assert f"no item named {index!r}" in one_line(done.stderr)


# --- 16. catalogue line numbers ---------------------------------------------------------------------


def test_16_csv_errors_name_the_file_line_after_a_quoted_newline() -> None:
    from coldroom.errors import ProjectFileError
    from coldroom.inputs.catalogue import parse_catalogue

    text = 'kind,model,currency,price\nunit_cooler,"two\nline name",EUR,1\nfridge,C2,EUR,1\n'
    with pytest.raises(ProjectFileError) as info:
        parse_catalogue(text.encode(), "cat.csv")
    assert (info.value.line, info.value.key) == (4, "kind")


def test_16_unclosed_quote_names_its_cell() -> None:
    from coldroom.errors import ProjectFileError
    from coldroom.inputs.catalogue import parse_catalogue

    text = 'kind,model,currency,price\nunit_cooler,C1,EUR,1\nunit_cooler,"C2,EUR,1\nunit_cooler,C3,EUR,1\n'
    with pytest.raises(ProjectFileError) as info:
        parse_catalogue(text.encode(), "cat.csv")
    assert (info.value.line, info.value.column) == (3, 2) and "never closes" in info.value.message


# --- 17. numeric model names ----------------------------------------------------------------------------


def test_17_a_model_named_by_a_number_is_text(tmp_path: Path) -> None:
    from coldroom.inputs.catalogue import load_catalogue, parse_catalogue

    text = CATALOGUE.read_text(encoding="utf-8")
    at = text.index("model: ") + len("model: ")
    yaml_catalogue = parse_catalogue((text[:at] + "4050" + text[text.index("\n", at):]).encode(), "cat.yaml")
    assert yaml_catalogue.condensing_units[0].model == "4050"
    import openpyxl

    book = openpyxl.Workbook()
    rows = [["kind", "model", "currency", "price", "refrigerant", "rated_point.capacity",
             "rated_point.evaporating_temperature", "rated_point.condensing_temperature", "rated_point.power"],
            ["condensing_unit", 4050, "EUR", 1000, "R-448A", "2 kW", -10, 45, "1 kW"]]
    for row in rows:
        book.active.append(row)
    book.save(tmp_path / "cat.xlsx")
    assert load_catalogue(tmp_path / "cat.xlsx").condensing_units[0].model == "4050"
    csv_text = "\n".join(",".join(str(c) for c in row) for row in rows).replace(",4050,", ',"4050",') + "\n"
    assert parse_catalogue(csv_text.encode(), "cat.csv").condensing_units[0].model == "4050"


# --- 18. XLSX: formulas with no saved value, several sheets ------------------------------------------


def _unit_rows(model: str) -> list:
    return [["kind", "model", "currency", "price", "refrigerant", "rated_point.capacity",
             "rated_point.evaporating_temperature", "rated_point.condensing_temperature", "rated_point.power"],
            ["condensing_unit", model, "EUR", 1000, "R-448A", "2 kW", -10, 45, "1 kW"]]


def test_18_formula_without_a_saved_value_is_named(tmp_path: Path) -> None:
    import openpyxl

    from coldroom.errors import ProjectFileError
    from coldroom.inputs.catalogue import load_catalogue

    book = openpyxl.Workbook()
    rows = _unit_rows("U1")
    rows[1][3] = "=900+100"  # openpyxl saves the formula, never its value
    for row in rows:
        book.active.append(row)
    book.save(tmp_path / "cat.xlsx")
    with pytest.raises(ProjectFileError) as info:
        load_catalogue(tmp_path / "cat.xlsx")
    assert (info.value.line, info.value.column) == (2, "D") and "formula" in info.value.message


def test_18_every_sheet_is_read(tmp_path: Path) -> None:
    import openpyxl

    from coldroom.inputs.catalogue import load_catalogue

    book = openpyxl.Workbook()
    for row in _unit_rows("U1"):
        book.active.append(row)
    coolers = book.create_sheet("Coolers")
    for row in [["kind", "model", "currency", "price", "capacity", "air_on", "evaporating_temperature", "air_flow",
                 "throw", "fan_power", "defrost", "fin_spacing"],
                ["unit_cooler", "C1", "EUR", 500, "2 kW", 0, -8, "1500 m³/h", "8 m", "90 W", "off_cycle", "4 mm"]]:
        coolers.append(row)
    book.save(tmp_path / "cat.xlsx")
    catalogue = load_catalogue(tmp_path / "cat.xlsx")
    assert [u.model for u in catalogue.condensing_units] == ["U1"] and [c.model for c in catalogue.unit_coolers] == ["C1"]


# --- 19. wrong formats, wrong sizes, an empty name ------------------------------------------------


@pytest.mark.parametrize("name, expected", [("cat.xls", "Excel 97-2003"), ("cat.ods", "OpenDocument"),
                                            ("cat.txt", "text file")])
def test_19_other_formats_are_named(tmp_path: Path, name: str, expected: str) -> None:
    path = tmp_path / name
    path.write_bytes(b"kind,model,currency,price\n" if name.endswith(".txt") else b"\xd0\xcf\x11\xe0garbage")
    done = invoke("select", COOLER, "--catalogue", path)
    assert done.returncode == 65, done.stderr
    line = one_line(done.stderr)
    assert expected in line and ".csv" in line and ".xlsx" in line


def test_19_large_catalogue_message_and_empty_name(tmp_path: Path) -> None:
    from coldroom.inputs.catalogue import MAX_CATALOGUE_BYTES

    big = tmp_path / "cat.yaml"
    big.write_bytes(b"# x\n" * (MAX_CATALOGUE_BYTES // 4 + 1))
    done = invoke("select", COOLER, "--catalogue", big)
    assert done.returncode == 65 and "project file" not in one_line(done.stderr) and "catalogue" in done.stderr
    for command in ("select", "quote"):
        done = invoke(command, COOLER, "--catalogue", "")
        assert done.returncode == 2 and "--catalogue" in one_line(done.stderr), (command, done.stderr)


# --- 20. control characters in any model name ----------------------------------------------------------


@pytest.mark.parametrize("group", ["condensing_units", "unit_coolers"])
def test_20_control_characters_in_models_are_refused(group: str) -> None:
    from coldroom.errors import ProjectFileError
    from coldroom.inputs.catalogue import parse_catalogue

    text = CATALOGUE.read_text(encoding="utf-8")
    at = text.index("model: ", text.index(group + ":")) + len("model: ")
    with pytest.raises(ProjectFileError) as info:
        parse_catalogue((text[:at] + '"UC\\e[2J"' + text[text.index("\n", at):]).encode(), "cat.yaml")
    assert "control character" in info.value.message and info.value.key.startswith(group)


# --- 21. an EPW without dates ---------------------------------------------------------------------------


def test_21_epw_rows_without_date_and_hour_are_not_a_year(tmp_path: Path) -> None:
    from coldroom.errors import ProjectFileError
    from coldroom.inputs.weather import read_epw

    (tmp_path / "w.epw").write_text(epw_text(dated=False), encoding="utf-8")
    with pytest.raises(ProjectFileError) as info:
        read_epw(tmp_path / "w.epw")
    assert info.value.line == 9 and "month" in info.value.message
    (tmp_path / "w.epw").write_text(epw_text(), encoding="utf-8")
    assert len(read_epw(tmp_path / "w.epw").dry_bulb) == 8760


# --- 22. cycle --out to standard output or a device -----------------------------------------------------


@pytest.mark.parametrize("name", ["-", "/dev/stdout", "/dev/null"])
def test_22_cycle_page_to_stdout_or_a_device(tmp_path: Path, name: str) -> None:
    done = subprocess.run(
        [sys.executable, "-m", "coldroom", "cycle", "-r", "R404A", "--evaporating", "-10", "--condensing", "40",
         "--capacity", "5 kW", "--out", name], capture_output=True, timeout=HANG_LIMIT, cwd=tmp_path,
    )
    assert done.returncode == 0, done.stderr
    if name != "/dev/null":
        assert done.stdout.startswith(b"%PDF") and b"Traceback" not in done.stderr
    assert list(tmp_path.iterdir()) == []


# --- 23. option names after Unicode normalisation ---------------------------------------------------


def test_23_option_names_are_compared_after_nfc(tmp_path: Path) -> None:
    composed, decomposed = "Caf\u00e9", "Cafe\u0301"
    text = COOLER.read_text(encoding="utf-8") + (
        f"\noptions:\n  - name: {composed}\n    changes:\n      rooms.0.temperature: 3\n"
        f"  - name: {decomposed}\n    changes:\n      rooms.0.temperature: 4\n")
    project = tmp_path / "p.yaml"
    project.write_text(text, encoding="utf-8")
    done = invoke("validate", project)
    assert done.returncode == 65, done.stderr
    assert "two options are called" in one_line(done.stderr)
