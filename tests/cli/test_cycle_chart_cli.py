"""`coldroom cycle --out FILE.pdf|.svg` and measured pressures in place of saturation temperatures.

Contracts (issue "p–h diagram"): one page written atomically through
coldroom.output.files (refuses to overwrite without --force, leaves no temporary
file), byte-identical run to run for the same arguments and SOURCE_DATE_EPOCH;
--suction-pressure / --discharge-pressure read gauge or absolute from the unit.
"""

from __future__ import annotations

import io
import json

import pytest



def run(*args: str):
    """In-process run (CoolProp and reportlab are imported once for the module)."""
    from types import SimpleNamespace

    from typer.testing import CliRunner

    from coldroom.cli import app

    r = CliRunner().invoke(app, list(args))
    return SimpleNamespace(returncode=r.exit_code, stdout=r.stdout, stderr=r.stderr)

ARGS = ["cycle", "-r", "R-448A", "--evaporating", "-8", "--condensing", "40", "--capacity", "4 kW",
        "--suction-line-superheat", "5"]


@pytest.fixture(autouse=True)
def _fixed_date(monkeypatch):
    monkeypatch.setenv("SOURCE_DATE_EPOCH", "1790000000")


@pytest.mark.parametrize("suffix", ["pdf", "svg"])
def test_out_writes_one_page_atomically_and_identically(tmp_path, suffix):
    target = tmp_path / f"cycle.{suffix}"
    first = run(*ARGS, "--out", str(target))
    assert first.returncode == 0, first.stderr
    data = target.read_bytes()
    assert sorted(p.name for p in tmp_path.iterdir()) == [target.name]  # no temporary file left
    # an existing file is not overwritten without --force (exit 73), and stays as it was
    again = run(*ARGS, "--out", str(target))
    assert again.returncode == 73 and "--force" in again.stderr
    assert target.read_bytes() == data
    forced = run(*ARGS, "--out", str(target), "--force")
    assert forced.returncode == 0
    assert target.read_bytes() == data  # byte-identical run to run
    if suffix == "pdf":
        import pypdf

        reader = pypdf.PdfReader(io.BytesIO(data))
        assert len(reader.pages) == 1
        text = " ".join(reader.pages[0].extract_text().split())
        for expected in ("Refrigerant cycle, R-448A", "Page 1 of 1", "1e evaporator outlet", "SST", "SCT",
                         "refrigerating effect", "compression work", "heat of rejection", "critical point"):
            assert expected in text, expected
    else:
        text = data.decode("utf-8")
        assert text.startswith("<?xml") and "<svg" in text and "Page 1 of 1" in text


def test_out_in_ip_units_speaks_psia(tmp_path):
    target = tmp_path / "cycle.pdf"
    assert run(*ARGS, "--units", "IP", "--out", str(target)).returncode == 0
    import pypdf

    text = " ".join(pypdf.PdfReader(io.BytesIO(target.read_bytes())).pages[0].extract_text().split())
    assert "psia" in text and "Btu/lb" in text and "°F" in text and "kPa" not in text


def test_out_into_a_missing_folder_fails_cleanly(tmp_path):
    result = run(*ARGS, "--out", str(tmp_path / "no" / "such" / "cycle.pdf"))
    assert result.returncode == 73 and len(result.stderr.strip().splitlines()) == 1


def test_out_needs_pdf_or_svg(tmp_path):
    result = run(*ARGS, "--out", str(tmp_path / "cycle.png"))
    assert result.returncode == 2 and ".pdf or .svg" in result.stderr


def test_transcritical_r744_page(tmp_path):
    target = tmp_path / "co2.pdf"
    result = run("cycle", "-r", "R744", "--evaporating", "-10", "--gas-cooler-outlet", "35", "--capacity", "5 kW",
                 "--out", str(target))
    assert result.returncode == 0, result.stderr
    import pypdf

    text = " ".join(pypdf.PdfReader(io.BytesIO(target.read_bytes())).pages[0].extract_text().split())
    assert "gas cooler" in text and "gas-cooler outlet" in text and "R-744" in text


def _evaporating(*pressure_args: str) -> float:
    result = run("cycle", "-r", "R134a", *pressure_args, "--condensing", "40", "--capacity", "5 kW", "--json")
    assert result.returncode == 0, result.stderr
    return json.loads(result.stdout)["evaporating_temperature_c"]


@pytest.mark.parametrize(
    "reading",
    # R-134a dew pressure at 0 °C: 292.8 kPa absolute ([ref:ashrae-fund-refrigerants] R-134a table [mem];
    # also coldroom.physics.refrigerant's doctest): 191.5 kPa(g), 1.915 bar(g), 27.77 psig against 101.325 kPa
    ["292.8 kPa", "2.928 bar", "191.5 kPa(g)", "1.915 bar(g)", "27.77 psig", "42.47 psia"],
)
def test_suction_pressure_gauge_or_absolute(reading):
    assert _evaporating("--suction-pressure", reading) == pytest.approx(0.0, abs=0.03)


def test_discharge_pressure_gives_the_condensing_dew_temperature():
    # R-134a at 40 °C dew: 1016.6 kPa absolute ([ref:ashrae-fund-refrigerants] R-134a table [mem])
    result = run("cycle", "-r", "R134a", "--evaporating", "-10", "--discharge-pressure", "9.153 bar(g)",
                 "--capacity", "5 kW", "--json")
    assert result.returncode == 0, result.stderr
    assert json.loads(result.stdout)["condensing_temperature_c"] == pytest.approx(40.0, abs=0.05)


def test_r744_discharge_above_critical_is_the_gas_cooler_pressure():
    result = run("cycle", "-r", "R744", "--evaporating", "-10", "--discharge-pressure", "90 bar", "--gas-cooler-outlet",
                 "35", "--capacity", "5 kW", "--json")
    assert result.returncode == 0, result.stderr
    assert json.loads(result.stdout)["discharge_pressure_pa"] == pytest.approx(9e6)


@pytest.mark.parametrize(
    "args, text",
    [
        (["--capacity", "5 kW", "--condensing", "40"], "--evaporating or --suction-pressure"),
        (["--capacity", "5 kW", "--evaporating", "-10", "--suction-pressure", "2 bar", "--condensing", "40"],
         "--evaporating or --suction-pressure"),
        (["--capacity", "5 kW", "--evaporating", "-10", "--condensing", "40", "--discharge-pressure", "9 bar(g)"],
         "not both"),
        (["--capacity", "5 kW", "--suction-pressure", "-1.2 bar(g)", "--condensing", "40"], "not above zero"),
        (["--capacity", "5 kW", "--suction-pressure", "2 furlongs", "--condensing", "40"], "unit"),
    ],
    ids=["none", "both-low", "both-high", "below-vacuum", "bad-unit"],
)
def test_pressure_usage_errors(args, text):
    result = run("cycle", "-r", "R134a", *args)
    assert result.returncode == 2 and text in result.stderr


def test_impossible_pressures_name_the_reading():
    result = run("cycle", "-r", "R134a", "--suction-pressure", "2 bar(g)", "--discharge-pressure", "1 bar(g)",
                 "--capacity", "5 kW")
    assert result.returncode == 1 and len(result.stderr.strip().splitlines()) == 1
    assert "--suction-pressure 301.3 kPa absolute" in result.stderr and "--discharge-pressure" in result.stderr
    above = run("cycle", "-r", "R134a", "--suction-pressure", "60 bar", "--condensing", "40", "--capacity", "5 kW")
    assert above.returncode == 1 and "--suction-pressure 6000.0 kPa absolute" in above.stderr
