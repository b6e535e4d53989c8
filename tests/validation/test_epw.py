"""The EPW reader against a small file written here in the format's documented layout.

Layout from the EnergyPlus *Auxiliary Programs* documentation, "EnergyPlus Weather File (EPW)
Data Dictionary" (eight header records, then one record per hour; dry bulb in field 7, 99.9 =
missing) [ref:epw-format].
"""

from __future__ import annotations

import math
from pathlib import Path

import pytest

from coldroom.errors import ProjectFileError
from coldroom.inputs.weather import bins_from_hours, read_epw, year_hours_error

HEADER = [
    "LOCATION,Testville,TS,Nowhere,Invented,000000,51.50,-0.10,0.0,20.0",
    "DESIGN CONDITIONS,0",
    "TYPICAL/EXTREME PERIODS,0",
    "GROUND TEMPERATURES,0",
    "HOLIDAYS/DAYLIGHT SAVINGS,No,0,0,0",
    "COMMENTS 1,written for a test",
    "COMMENTS 2,",
    "DATA PERIODS,1,1,Data,Sunday, 1/ 1,12/31",
]
DAYS = (31, 28, 31, 30, 31, 30, 31, 31, 30, 31, 30, 31)


def temperature(hour_of_year: int) -> float:
    """An invented year: 10 °C mean, ±8 K seasonal, ±4 K daily, one decimal like the format."""
    day, hour = divmod(hour_of_year, 24)
    t = 10.0 + 8.0 * math.sin(2 * math.pi * (day - 110) / 365) + 4.0 * math.sin(2 * math.pi * (hour - 9) / 24)
    return round(t, 1)


def write_epw(path: Path, hours: int = 8760, missing_at: int | None = None) -> list[float]:
    lines, values = list(HEADER), []
    k = 0
    for month, days in enumerate(DAYS, 1):
        for day in range(1, days + 1):
            for hour in range(1, 25):
                if k >= hours:
                    break
                t = 99.9 if k == missing_at else temperature(k)
                values.append(t)
                # year,month,day,hour,minute,flags,dry bulb,dew point,RH,pressure,... (more fields follow)
                lines.append(f"1999,{month},{day},{hour},60,?9?9?9?9E0?9?9?9?9,{t:.1f},{t - 5:.1f},70,101325,0,0,300")
                k += 1
    path.write_text("\n".join(lines) + "\n", encoding="utf-8")
    return values


def test_reads_every_hour_in_order(tmp_path: Path) -> None:
    values = write_epw(tmp_path / "w.epw")
    weather = read_epw(tmp_path / "w.epw")
    assert weather.location == "Testville, TS, Nowhere"
    assert len(weather.dry_bulb) == 8760
    assert weather.dry_bulb == tuple(values)


def test_bins_keep_the_hours_and_the_mean(tmp_path: Path) -> None:
    write_epw(tmp_path / "w.epw")
    hours = read_epw(tmp_path / "w.epw").dry_bulb
    bins = bins_from_hours(hours)
    assert sum(b.hours for b in bins) == 8760
    assert year_hours_error(bins) is None
    assert sum(b.temperature * b.hours for b in bins) / 8760 == pytest.approx(sum(hours) / 8760, abs=1e-4)
    assert len(bins) <= 26  # 10 ± 12 K in 1 K bins


def test_missing_value_is_refused_with_its_line(tmp_path: Path) -> None:
    write_epw(tmp_path / "w.epw", missing_at=100)
    with pytest.raises(ProjectFileError) as caught:
        read_epw(tmp_path / "w.epw")
    assert caught.value.line == 8 + 101
    assert "missing" in caught.value.message


def test_short_file_is_refused(tmp_path: Path) -> None:
    write_epw(tmp_path / "w.epw", hours=100)
    with pytest.raises(ProjectFileError, match="100 hourly records"):
        read_epw(tmp_path / "w.epw")


def test_not_epw(tmp_path: Path) -> None:
    (tmp_path / "w.epw").write_text("Date,Temp\n", encoding="utf-8")
    with pytest.raises(ProjectFileError, match="not an EPW"):
        read_epw(tmp_path / "w.epw")
