"""Ambient temperatures over a year: an EPW weather file or the project's bins, grouped into bins.

Pure standard library (``csv``); no third-party reader.

EPW (EnergyPlus weather) layout [pub] [ref:epw-format]: eight header records
(``LOCATION``, ``DESIGN CONDITIONS``, ``TYPICAL/EXTREME PERIODS``, ``GROUND
TEMPERATURES``, ``HOLIDAYS/DAYLIGHT SAVINGS``, ``COMMENTS 1``, ``COMMENTS 2``,
``DATA PERIODS``), then one comma-separated record per hour: year, month, day,
hour (1–24), minute, data-source flags, dry-bulb temperature [°C] (field 7),
dew point [°C] (field 8), relative humidity [%] (field 9), … A dry bulb of
99.9 marks a missing value. A year is 8760 records (8784 in a leap year).

Hours are grouped into bins of :data:`BIN_WIDTH` (the AIRAH 2012 guideline's
bin method [mem] [ref:airah-tewi-2012]); each bin stands at the mean of the
hours it holds, so the hour-weighted mean temperature is kept exactly.

Examples
--------
>>> [(b.temperature, b.hours) for b in bins_from_hours([10.2, 10.4, 12.0])]
[(10.3, 2.0), (12.0, 1.0)]
"""

from __future__ import annotations

import csv
import math
from dataclasses import dataclass
from pathlib import Path
from typing import Any, Iterable, Optional, Sequence

from coldroom.errors import ProjectFileError

#: Hours in a (non-leap) year [h].
YEAR_HOURS = 8760.0
#: Allowed departure of the bins' hours from a year [-] (the issue's contract: 8760 ± 1 %).
YEAR_TOLERANCE = 0.01
#: Width of an ambient bin [K] [trade].
BIN_WIDTH = 1.0
#: EPW header records before the hourly data [pub] [ref:epw-format].
EPW_HEADER_RECORDS = 8
#: EPW "missing" value of the dry bulb [°C] [pub] [ref:epw-format].
EPW_MISSING_DRY_BULB = 99.9
#: Field of the dry bulb in an EPW data record (0-based) [pub] [ref:epw-format].
EPW_DRY_BULB_FIELD = 6
#: Largest EPW file read [byte]: a year of hourly records is about 1.5 MB; a device that never
#: ends, or a huge file, is refused at this size.
EPW_MAX_BYTES = 16 << 20
#: Month, day and hour fields (0-based) of an EPW data record, with their ranges [pub] [ref:epw-format].
EPW_DATE_FIELDS = ((1, "month", 1, 12), (2, "day", 1, 31), (3, "hour", 1, 24))


def _check_date(row: Sequence[str], filename: str, line: int) -> None:
    """An hourly record names its month, day and hour (1-24): rows with no date are not a year."""
    for index, name, low, high in EPW_DATE_FIELDS:
        text = row[index].strip()
        if not (text.isascii() and text.isdigit() and low <= int(text) <= high):
            raise ProjectFileError(
                f"EPW record's {name} (field {index + 1}) is {text[:20]!r}; an hourly record gives its month (1-12), "
                "day (1-31) and hour (1-24)", file=filename, line=line,
            )


@dataclass(frozen=True)
class AmbientBin:
    """Hours of the year at one ambient temperature.

    Attributes
    ----------
    temperature : float
        Ambient dry bulb [°C].
    hours : float
        Hours per year at it [h].
    """

    temperature: float
    hours: float


@dataclass(frozen=True)
class Weather:
    """An EPW file's hourly dry bulbs.

    Attributes
    ----------
    location : str
        City, region and country from the ``LOCATION`` record.
    dry_bulb : tuple of float
        One value per hour [°C].
    """

    location: str
    dry_bulb: tuple[float, ...]


def weather_path(model: Any) -> Optional[Path]:
    """The EPW file a project (or one option) reads, relative names resolved against its folder; None if none.

    Examples
    --------
    >>> from types import SimpleNamespace as NS
    >>> weather_path(NS(design=NS(weather="w.epw"), _folder="/jobs")).as_posix()
    '/jobs/w.epw'
    """
    name = getattr(model.design, "weather", None)
    if name is None:
        return None
    path = Path(name)
    return path if path.is_absolute() else Path(getattr(model, "_folder", "") or ".") / path


def read_epw(path: str | Path) -> Weather:
    """Read the hourly dry bulbs of an EPW weather file.

    Parameters
    ----------
    path : str or Path
        The ``.epw`` file.

    Returns
    -------
    Weather

    Raises
    ------
    ProjectFileError
        Unreadable file, a header that is not EPW, a record without a dry bulb,
        a missing (99.9) or implausible value, or not a year of hours; the
        message names the line.
    """
    from coldroom.inputs.safeyaml import read_source

    p = Path(path)
    try:
        raw = read_source(p, max_bytes=EPW_MAX_BYTES, what="weather file",
                          typical="an EPW file of one year is about 1.5 MB")
    except ProjectFileError as exc:
        if exc.message == "no such file":
            raise ProjectFileError("weather file not found", file=str(p)) from None
        raise
    text = raw.decode("utf-8-sig", errors="replace")
    reader = csv.reader(text.splitlines())
    values: list[float] = []
    location = ""
    try:
        for line, row in enumerate(reader, start=1):
            if line == 1:
                if not row or row[0].strip().upper() != "LOCATION":
                    raise ProjectFileError("not an EPW weather file: the first record is not LOCATION", file=str(p),
                                           line=1)
                location = ", ".join(x.strip() for x in row[1:4] if x.strip())
            if line <= EPW_HEADER_RECORDS or not row or not "".join(row).strip():
                continue
            if len(row) <= EPW_DRY_BULB_FIELD:
                raise ProjectFileError(
                    f"EPW record has {len(row)} fields; the dry bulb is field {EPW_DRY_BULB_FIELD + 1}", file=str(p),
                    line=line,
                )
            _check_date(row, str(p), line)
            try:
                t = float(row[EPW_DRY_BULB_FIELD])
            except ValueError:
                raise ProjectFileError(
                    f"EPW dry bulb {row[EPW_DRY_BULB_FIELD][:40]!r} is not a number", file=str(p), line=line
                ) from None
            if not math.isfinite(t) or t >= EPW_MISSING_DRY_BULB or not -90.0 <= t <= 70.0:
                raise ProjectFileError(f"EPW dry bulb {t:g} °C is missing or implausible", file=str(p), line=line)
            values.append(t)
    except csv.Error as exc:
        raise ProjectFileError(f"not an EPW weather file: {exc}", file=str(p), line=reader.line_num) from None
    if not location and not values:
        raise ProjectFileError("not an EPW weather file: the first record is not LOCATION", file=str(p), line=1)
    if len(values) not in (8760, 8784):
        raise ProjectFileError(
            f"EPW file holds {len(values)} hourly records; a year is 8760 (8784 in a leap year)", file=str(p)
        )
    return Weather(location=location, dry_bulb=tuple(values))


def bins_from_hours(temperatures: Iterable[float], width: float = BIN_WIDTH) -> tuple[AmbientBin, ...]:
    """Group hourly temperatures into bins of *width*, each at the mean of its hours.

    Parameters
    ----------
    temperatures : iterable of float
        One dry bulb per hour [°C].
    width : float
        Bin width [K].

    Returns
    -------
    tuple of AmbientBin
        Ordered by temperature; hours sum to the number of values.
    """
    sums: dict[int, list[float]] = {}
    for t in temperatures:
        key = math.floor(t / width + 0.5)
        cell = sums.setdefault(key, [0.0, 0.0])
        cell[0] += t
        cell[1] += 1.0
    return tuple(AmbientBin(round(total / n, 6), n) for _key, (total, n) in sorted(sums.items()))


def year_hours_error(bins: Sequence[AmbientBin]) -> str | None:
    """Why *bins* do not make a year (hours summing to 8760 ± 1 %), or ``None``.

    Examples
    --------
    >>> year_hours_error([AmbientBin(10.0, 8760.0)]) is None
    True
    >>> year_hours_error([AmbientBin(10.0, 8000.0)])
    'the bins hold 8000 h; a year is 8760 h (± 1 %)'
    """
    total = sum(b.hours for b in bins)
    if abs(total - YEAR_HOURS) > YEAR_TOLERANCE * YEAR_HOURS:
        return f"the bins hold {total:g} h; a year is {YEAR_HOURS:g} h (± {YEAR_TOLERANCE * 100:g} %)"
    return None
