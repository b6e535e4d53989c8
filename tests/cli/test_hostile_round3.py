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
    assert sum(b["hours_h"] for b in other["ambient_bins"]) == 8760
    assert "ambient of option elsewhere: w2.epw (Otherton" in done.stderr  # the terminal text (stdout is JSON)


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
