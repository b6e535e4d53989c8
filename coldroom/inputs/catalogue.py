"""The contractor's equipment catalogue: condensing units and unit coolers with prices.

A catalogue is a file of our own format, read from YAML (:func:`load_catalogue`
on a ``.yaml``/``.yml`` file) or from a table of one row per model (``.csv``, or
``.xlsx`` through openpyxl, imported only when such a file is read). Every
quantity accepts a bare SI number or a string with its unit (``"4.5 kW"``,
``"-10 °C"``); prices are plain numbers in the catalogue's ``currency``.

YAML layout::

    currency: EUR
    condensing_units:
      - model: CU-M 45            # unique within the catalogue
        refrigerant: R-448A
        price: 3150
        rated_point: {...}        # or polynomial: {...} -- exactly as in an
                                  # existing_unit block (envelope required)
        condenser: {heat_rejection: 7.5 kW, temperature_difference: 15 K}
        fan_power: 150 W          # condenser fans, optional
    unit_coolers:
      - model: UC 40
        capacity: 4.0 kW          # at the rating condition below
        air_on: 0 °C              # EN 328 style: DT1 = air_on − evaporating
        evaporating_temperature: -8 °C
        air_flow: 2400 m³/h
        throw: 10 m
        fan_power: 120 W
        defrost: electric         # off_cycle, electric or hot_gas
        defrost_heater_power: 1.8 kW
        fin_spacing: 6 mm
        price: 1100

A condensing unit may instead carry the whole unit's ``rating_table`` (capacity
and power over SST × ambient, no ``condenser``) and its electrical data
(``supply``, ``running_current``, ``locked_rotor_current``, ``power_factor``; coils
too). The items a quote prices (``panels``, ``doors``, ``expansion_valves``,
``accessories``, ``tubes``, ``insulation``, ``refrigerants``, ``labour``) are
listed in :mod:`coldroom.inputs.catalogue_items`.

Table layout (CSV/XLSX, first row = column names): a ``kind`` column
(``condensing_unit``, ``unit_cooler`` or an item kind), a ``currency`` column (the same in
every row), and one column per key, nested keys dotted
(``rated_point.capacity``, ``polynomial.suction_min``, ``condenser.heat_rejection``).
Polynomial coefficients go in one cell, ten numbers separated by blanks or
semicolons; a rating table's lists likewise (``;`` when values carry units),
its ``capacity`` and ``power`` rows separated by ``|``. An empty cell is a key not given.

Errors are :class:`coldroom.errors.ProjectFileError` located at
``file:line:col`` (YAML) or ``file:row:column`` (CSV: column number; XLSX:
column letter), exit code 65.
"""

from __future__ import annotations

import csv
import io
import os
import re
from dataclasses import dataclass, field, replace
from pathlib import Path
from typing import Annotated, Any, Literal, Optional, Sequence

from pydantic import BeforeValidator, Field, ValidationError, model_validator

from coldroom.errors import ProjectFileError
from coldroom.inputs.catalogue_items import (
    ITEM_KINDS,
    AccessoryEntry,
    DoorEntry,
    Electrical,
    ExpansionValveEntry,
    InsulationEntry,
    LabourEntry,
    PanelEntry,
    RefrigerantEntry,
    TubeEntry,
)
from coldroom.inputs.projectfile import (
    Name,
    Q,
    Rating,
    CompressorPolynomial,
    CondenserRating,
    ExistingUnit,
    RatedPoint,
    RatingTable,
    Strict,
    UnitCoolerRating,
)
from coldroom.inputs.projectfile.parsing import _message, _refined_location


def _model_text(value: Any) -> Any:
    """A model named by a number (4050) is the text "4050": models are names, never quantities."""
    if isinstance(value, int) and not isinstance(value, bool):
        return str(value)
    if isinstance(value, float) and value.is_integer() and abs(value) < 1e15:
        return str(int(value))
    return value


#: A model name: text (a number is taken as its digits), no control characters (it is printed).
ModelName = Annotated[Name, BeforeValidator(_model_text)]

#: Keys only a unit cooler has / only a condensing unit has (to name the wrong kind).
COOLER_KEYS = ("capacity", "air_on", "evaporating_temperature", "air_flow", "throw", "defrost",
               "defrost_heater_power", "fin_spacing")
UNIT_KEYS = ("rated_point", "polynomial", "rating_table", "condenser")
ENVELOPE_KEYS = ("suction_min", "suction_max", "discharge_min", "discharge_max")
KINDS = {"condensing_unit": "condensing_units", "unit_cooler": "unit_coolers",
         **{kind: group for kind, (group, _model, _key) in ITEM_KINDS.items()}}


def _wrong_kind(data: Any, foreign: Sequence[str], other: str) -> None:
    if isinstance(data, dict):
        found = [key for key in foreign if key in data]
        if found:
            raise ValueError(
                f"has {', '.join(found)}, keys of a {other}: wrong kind of unit? (list it under "
                f"{KINDS[other.replace(' ', '_')]})"
            )


class CondensingUnitEntry(Electrical):
    """A condensing unit of the catalogue: compressor rating as in an ``existing_unit`` block (or the
    whole unit's ``rating_table``), price, optional electrical data."""

    model: ModelName = Field(min_length=1, max_length=100)
    refrigerant: str
    price: float = Field(ge=0.0, le=1e8)
    rated_point: Optional[RatedPoint] = None
    polynomial: Optional[CompressorPolynomial] = None
    rating_table: Optional[RatingTable] = None
    condenser: Optional[CondenserRating] = None
    fan_power: Optional[Q("power", ge=0.0, le=1e5)] = None  # type: ignore[valid-type]

    @model_validator(mode="before")
    @classmethod
    def _kind(cls, data: Any) -> Any:
        _wrong_kind(data, COOLER_KEYS[1:], "unit cooler")  # a stray `capacity` is more likely a typo
        poly = data.get("polynomial") if isinstance(data, dict) else None
        if isinstance(poly, dict):
            missing = [key for key in ENVELOPE_KEYS if poly.get(key) is None]
            if missing:
                raise ValueError(
                    f"a polynomial without its envelope ({', '.join(missing)} missing): the fit is valid only "
                    "inside the published envelope; give suction_min, suction_max, discharge_min, discharge_max"
                )
        return data

    @model_validator(mode="after")
    def _check(self) -> "CondensingUnitEntry":
        from coldroom.data import refrigerants

        refrigerants.lookup(self.refrigerant)  # LookupNameError listing the closest names, at the key
        self.existing_unit()  # exactly one rating; the refrigerant is known (LookupNameError)
        return self

    def existing_unit(self, unit_cooler: Optional[UnitCoolerRating] = None) -> ExistingUnit:
        """This unit as an :class:`~coldroom.inputs.projectfile.ExistingUnit` (validated, SI)."""
        try:
            return ExistingUnit(
                name=self.model,
                refrigerant=self.refrigerant,
                rated_point=self.rated_point,
                polynomial=self.polynomial,
                rating_table=self.rating_table,
                unit_cooler=unit_cooler,
                condenser=self.condenser,
            )
        except ValidationError as exc:
            raise ValueError(_message(exc.errors(include_url=False)[0])) from None


class UnitCoolerEntry(Electrical):
    """A unit cooler: capacity at an EN 328 style rating condition, air, fans, defrost, fins, price.

    DT1 = air on − evaporating (dew) temperature at rating; the capacity at
    another temperature difference is taken proportional to it (capacity/DT1
    constant, the linear model the existing-unit check uses) [mem] [ref:en-328].
    """

    model: ModelName = Field(min_length=1, max_length=100)
    refrigerant: Optional[str] = Field(
        default=None, description="The refrigerant the rating is for; when given, only systems on it use the coil."
    )
    capacity: Rating  # at least 10 W: a vanishing rating only divides by almost zero downstream
    air_on: Q("temperature", ge=-40.0, le=30.0)  # type: ignore[valid-type]
    evaporating_temperature: Q("temperature", ge=-60.0, le=20.0)  # type: ignore[valid-type]
    air_flow: Q("volume_flow", gt=0.0, le=100.0)  # type: ignore[valid-type]
    throw: Q("length", gt=0.0, le=100.0)  # type: ignore[valid-type]
    fan_power: Q("power", ge=0.0, le=1e5)  # type: ignore[valid-type]
    defrost: Literal["off_cycle", "electric", "hot_gas"]
    defrost_heater_power: Q("power", ge=0.0, le=1e5) = 0.0  # type: ignore[valid-type]
    fin_spacing: Q("length", si="mm", ip="in", gt=0.0, le=0.05)  # type: ignore[valid-type]
    price: float = Field(ge=0.0, le=1e8)

    @model_validator(mode="before")
    @classmethod
    def _kind(cls, data: Any) -> Any:
        _wrong_kind(data, UNIT_KEYS, "condensing unit")
        return data

    @model_validator(mode="after")
    def _check(self) -> "UnitCoolerEntry":
        if self.refrigerant is not None:
            from coldroom.data import refrigerants

            refrigerants.lookup(self.refrigerant)  # LookupNameError listing the closest names, at the key
        if self.evaporating_temperature >= self.air_on:
            raise ValueError("the rating evaporating temperature must lie below the air-on temperature (DT1 > 0)")
        if self.defrost == "electric" and self.defrost_heater_power <= 0.0:
            raise ValueError("an electric-defrost unit cooler needs its defrost_heater_power")
        return self

    @property
    def dt1(self) -> float:
        """Rating DT1 = air on − evaporating dew temperature [K] (EN 328 [mem])."""
        return self.air_on - self.evaporating_temperature

    @property
    def conductance(self) -> float:
        """Capacity per kelvin of DT1 [W/K]."""
        return self.capacity / self.dt1


class Catalogue(Strict):
    """The whole catalogue file."""

    currency: str = Field(min_length=1, max_length=10)
    condensing_units: list[CondensingUnitEntry] = Field(default_factory=list, max_length=5000)
    unit_coolers: list[UnitCoolerEntry] = Field(default_factory=list, max_length=5000)
    panels: list[PanelEntry] = Field(default_factory=list, max_length=5000)
    doors: list[DoorEntry] = Field(default_factory=list, max_length=5000)
    expansion_valves: list[ExpansionValveEntry] = Field(default_factory=list, max_length=5000)
    accessories: list[AccessoryEntry] = Field(default_factory=list, max_length=5000)
    tubes: list[TubeEntry] = Field(default_factory=list, max_length=5000)
    insulation: list[InsulationEntry] = Field(default_factory=list, max_length=5000)
    refrigerants: list[RefrigerantEntry] = Field(default_factory=list, max_length=5000)
    labour: list[LabourEntry] = Field(default_factory=list, max_length=5000)


@dataclass(frozen=True)
class _Table:
    """Where each key of table-built catalogue data stands: (row, column label, header)."""

    filename: str
    marks: dict = field(default_factory=dict)  # path -> (row, column label, header name)
    rows: dict = field(default_factory=dict)  # (list name, index) -> (row, {header: column label})
    files: dict = field(default_factory=dict)  # (list name, index) -> the sheet's label, when not filename

    def error(self, message: str, path: Sequence[object] = ()) -> ProjectFileError:
        path = tuple(path)
        if len(path) >= 2 and (path[0], path[1]) in self.rows:
            row, columns = self.rows[(path[0], path[1])]
            if (path[0], path[1]) in self.files:
                return replace(self, filename=self.files[(path[0], path[1])], files={}).error(message, path)
            for end in range(len(path), 1, -1):
                header = ".".join(str(p) for p in path[2:end])
                if header in columns:
                    return ProjectFileError(message, file=self.filename, line=row, column=columns[header], key=header)
            prefix = ".".join(str(p) for p in path[2:3])
            for header, column in columns.items():
                if prefix and header.startswith(prefix + "."):
                    return ProjectFileError(message, file=self.filename, line=row, column=column,
                                            key=".".join(str(p) for p in path[2:]))
            return ProjectFileError(message, file=self.filename, line=row, column=columns.get("model", 1),
                                    key=".".join(str(p) for p in path[2:]) or None)
        if path and path[0] in self.marks:
            row, column = self.marks[path[0]]
            return ProjectFileError(message, file=self.files.get(path[0], self.filename), line=row, column=column, key=str(path[0]))
        return ProjectFileError(message, file=self.filename, line=1, column=1, key=None)


#: rating_table keys written in one cell: lists of numbers; capacity and power rows separated by "|".
_TABLE_LISTS = ("evaporating_temperatures", "ambient_temperatures", "capacity", "power")
_NUMBER = re.compile(r"[-+]?(?:\d+\.?\d*|\.\d+)(?:[eE][-+]?\d+)?")


#: Columns that hold names, never numbers (a model called 4050 stays "4050").
TEXT_COLUMNS = frozenset({"kind", "model", "currency", "refrigerant", "defrost"})


def _cell(header: str, value: Any) -> Any:
    if header in TEXT_COLUMNS:
        if isinstance(value, str):
            return value.strip() or None
        return _model_text(value)
    if isinstance(value, str):
        value = value.strip()
        if value == "":
            return None
        if header.startswith("polynomial.") and header.split(".")[1] in ("capacity", "power", "mass_flow") or (
            header.startswith("rating_table.") and header.split(".")[1] in _TABLE_LISTS
        ):
            def items(text: str) -> list[Any]:
                parts = [p.strip() for p in re.split(r";" if ";" in text else r"\s+", text) if p.strip()]
                return [float(p) if _NUMBER.fullmatch(p) else p for p in parts]

            if header.split(".")[1] in ("capacity", "power") and header.startswith("rating_table."):
                return [items(row) for row in value.split("|")]
            return items(value)
        if _NUMBER.fullmatch(value):
            return float(value)
    return value


def _column_label(index: int, letters: bool) -> Any:
    if not letters:
        return index + 1
    label = ""
    n = index + 1
    while n:
        n, rest = divmod(n - 1, 26)
        label = chr(65 + rest) + label
    return label


REQUIRED_COLUMNS = ("kind", "model", "currency", "price")


def catalogue_from_rows(
    rows: Sequence[Sequence[Any]], filename: str, *, letters: bool = False, lines: Optional[Sequence[int]] = None
) -> tuple[dict, _Table]:
    """Catalogue data (as YAML would give it) and cell positions from a table's rows.

    Parameters
    ----------
    rows : sequence of sequences
        First row the column names; blank rows are skipped.
    filename : str
    letters : bool
        Name columns by letter (spreadsheets) instead of number (CSV).
    lines : sequence of int, optional
        The file line each row starts on (a quoted cell may span lines); default the row's number.
    """
    table = _Table(filename)
    if not rows:
        raise ProjectFileError("the table is empty: the first row must name the columns", file=filename, line=1)
    header = [str(h).strip() if h is not None else "" for h in rows[0]]
    for name in REQUIRED_COLUMNS:
        if name not in header:
            raise ProjectFileError(
                f"required column is missing (the first row must name the columns {', '.join(REQUIRED_COLUMNS)})",
                file=filename, line=1, column=_column_label(len(header), letters), key=name,
            )
    seen: dict[str, int] = {}
    for i, name in enumerate(header):
        if name in seen:
            raise ProjectFileError(f"column named twice (also column {_column_label(seen[name], letters)})",
                                   file=filename, line=1, column=_column_label(i, letters), key=name)
        if name:
            seen[name] = i
    for i, name in enumerate(header):
        outer = next((other for other in seen if name.startswith(other + ".")), None)
        if outer is not None:  # `model` beside `model.note`: one cell cannot be a value and hold keys
            raise ProjectFileError(
                f"column {name!r} puts a key under {outer!r}, which is a column of its own (column "
                f"{_column_label(seen[outer], letters)}): one of them is misnamed",
                file=filename, line=1, column=_column_label(i, letters), key=name,
            )
    data: dict[str, Any] = {group: [] for group in KINDS.values()}
    currency: Optional[tuple[str, int]] = None
    for index, values in enumerate(rows[1:], start=1):
        r = lines[index] if lines is not None else index + 1
        for i, value in enumerate(values):
            if (i >= len(header) or not header[i]) and _cell("", value) is not None:
                # an unquoted "1,490" splits into two cells: the extra one is never dropped in silence
                raise ProjectFileError(
                    f"{value!r} stands in a column with no name in the first row (the row has {len(values)} "
                    f"cells, the first row names {sum(1 for h in header if h)} columns): a number written with a "
                    "thousands comma (1,490)? write 1490, or quote the cell, or name the column",
                    file=filename, line=r, column=_column_label(i, letters),
                )
        cells = {h: _cell(h, v) for h, v in zip(header, values) if h}
        if all(v is None for v in cells.values()):
            continue
        columns = {h: _column_label(i, letters) for i, h in enumerate(header) if h}
        kind = cells.pop("kind", None)
        if kind not in KINDS:
            raise ProjectFileError(f"{kind!r} is not a kind of catalogue item: write one of {', '.join(KINDS)}",
                                   file=filename, line=r, column=columns["kind"], key="kind")
        cur = cells.pop("currency", None)
        if cur is None:
            raise ProjectFileError("required value is missing", file=filename, line=r, column=columns["currency"],
                                   key="currency")
        if currency is None:
            currency = (str(cur), r)
            data["currency"] = str(cur)
            table.marks["currency"] = (r, columns["currency"])
        elif str(cur) != currency[0]:
            raise ProjectFileError(f"currency {cur!r} differs from {currency[0]!r} in row {currency[1]}: one "
                                   "catalogue, one currency", file=filename, line=r, column=columns["currency"],
                                   key="currency")
        entry: dict[str, Any] = {}
        for h, v in cells.items():
            if v is None:
                continue
            target = entry
            parts = h.split(".")
            for part in parts[:-1]:
                target = target.setdefault(part, {})
            target[parts[-1]] = v
        group = KINDS[kind]
        table.rows[(group, len(data[group]))] = (r, columns)
        data[group].append(entry)
    if "currency" not in data:
        raise ProjectFileError("the table has no rows of equipment", file=filename, line=2)
    return data, table


#: Largest catalogue file [byte]: a few thousand models in any of the formats.
MAX_CATALOGUE_BYTES = 4 << 20
#: Bounds on a spreadsheet [-]: rows and columns read per sheet, sheets, the workbook's parts
#: unpacked [byte] (a small .xlsx can declare a million rows or unpack to gigabytes).
XLSX_MAX_ROWS = 2 * 5000 + 1
XLSX_MAX_COLUMNS = 200
XLSX_MAX_SHEETS = 20
XLSX_MAX_UNPACKED = 32 << 20
XLSX_MAX_SHARED_STRINGS = 1 << 20  # about 40,000 distinct texts; openpyxl reads 1 MiB in about a second


def _open_quote_cell(line: str) -> int:
    """1-based number of the cell of a CSV line in which a quote opens and never closes."""
    cell, quoted = 1, False
    for position, char in enumerate(line):
        if char == '"':
            quoted = not quoted
        elif char == "," and not quoted:
            cell += 1
    return cell


def _read_csv(raw: bytes, filename: str) -> tuple[list[list[str]], list[int]]:
    """The rows of a CSV file and the file line each starts on."""
    try:
        text = raw.decode("utf-8-sig")
    except UnicodeDecodeError:
        raise ProjectFileError("not UTF-8 text (save the CSV as UTF-8)", file=filename) from None
    reader = csv.reader(io.StringIO(text, newline=""), strict=True)
    rows: list[list[str]] = []
    lines: list[int] = []
    start = 1
    try:
        for row in reader:
            rows.append(row)
            lines.append(start)
            start = reader.line_num + 1
    except csv.Error as exc:
        reason = str(exc)
        if "unexpected end of data" in reason:
            first = text.splitlines()[start - 1] if start <= len(text.splitlines()) else ""
            raise ProjectFileError("a quote opens in this cell and never closes (it runs to the end of the file)",
                                   file=filename, line=start, column=_open_quote_cell(first)) from None
        if "field larger than field limit" in reason:
            raise ProjectFileError(f"a cell is longer than {csv.field_size_limit()} characters; a catalogue cell "
                                   "holds a name, a number or a short list", file=filename, line=start) from None
        raise ProjectFileError(f"not a readable CSV row ({reason}); quote a cell that holds commas or quotes",
                               file=filename, line=start) from None
    return rows, lines


def _check_workbook(raw: bytes, filename: str) -> None:
    """Refuse a workbook whose parts would unpack to far more than a catalogue needs (before openpyxl reads it)."""
    import zipfile

    try:
        with zipfile.ZipFile(io.BytesIO(raw)) as archive:
            parts = archive.infolist()
    except (zipfile.BadZipFile, OSError, ValueError, EOFError):
        raise ProjectFileError("not a readable .xlsx workbook (not a zip archive)", file=filename) from None
    unpacked = sum(part.file_size for part in parts)
    shared = sum(part.file_size for part in parts if part.filename.lower().endswith("sharedstrings.xml"))
    if len(parts) > 1000 or unpacked > XLSX_MAX_UNPACKED or shared > XLSX_MAX_SHARED_STRINGS:
        raise ProjectFileError(
            f"the workbook unpacks to {unpacked} bytes in {len(parts)} parts ({shared} of text); a catalogue needs "
            f"far less (limits {XLSX_MAX_UNPACKED} bytes, {XLSX_MAX_SHARED_STRINGS} of text): save only the "
            "catalogue's sheets, or save it as CSV", file=filename,
        )


def _read_xlsx(raw: bytes, filename: str) -> list[tuple[str, list[list[Any]], list[int]]]:
    """Every sheet of a workbook that holds anything: (label for messages, rows, row numbers)."""
    _check_workbook(raw, filename)
    try:
        import openpyxl  # only when a spreadsheet is read
    except ImportError:  # pragma: no cover - openpyxl is a dependency
        raise ProjectFileError("reading .xlsx needs openpyxl (pip install openpyxl)", file=filename) from None
    try:
        values = openpyxl.load_workbook(io.BytesIO(raw), read_only=True, data_only=True)
        formulas = openpyxl.load_workbook(io.BytesIO(raw), read_only=True, data_only=False)
    except Exception as exc:  # openpyxl raises many kinds on a damaged file
        raise ProjectFileError(f"not a readable .xlsx workbook ({type(exc).__name__})", file=filename) from None
    sheets = []
    try:
        if len(values.worksheets) > XLSX_MAX_SHEETS:
            raise ProjectFileError(f"the workbook has {len(values.worksheets)} sheets; a catalogue has at most "
                                   f"{XLSX_MAX_SHEETS}", file=filename)
        for sheet, sheet_formulas in zip(values.worksheets, formulas.worksheets):
            label = filename if len(values.worksheets) == 1 else f"{filename}[{sheet.title}]"
            declared_rows, declared_columns = getattr(sheet, "max_row", None), getattr(sheet, "max_column", None)
            if (declared_rows or 0) > XLSX_MAX_ROWS or (declared_columns or 0) > XLSX_MAX_COLUMNS:
                raise ProjectFileError(
                    f"the sheet declares {declared_rows} rows and {declared_columns} columns; a catalogue has at most "
                    f"{XLSX_MAX_ROWS} rows and {XLSX_MAX_COLUMNS} columns: delete the empty rows and columns "
                    "below and right of the table, or save it as CSV", file=label,
                )
            bound = {"max_row": XLSX_MAX_ROWS + 1, "max_col": XLSX_MAX_COLUMNS + 1, "values_only": True}
            rows, numbers = [], []
            for number, (row, written) in enumerate(
                zip(sheet.iter_rows(**bound), sheet_formulas.iter_rows(**bound)), start=1
            ):
                if number > XLSX_MAX_ROWS or (len(row) > XLSX_MAX_COLUMNS and row[XLSX_MAX_COLUMNS] is not None):
                    raise ProjectFileError(f"more than {XLSX_MAX_ROWS} rows or {XLSX_MAX_COLUMNS} columns; a "
                                           "catalogue needs fewer", file=label, line=number)
                for column, (value, formula) in enumerate(zip(row, written)):
                    if value is None and isinstance(formula, str) and formula.startswith("="):
                        raise ProjectFileError(
                            f"the cell holds the formula {formula[:40]!r} with no saved value (the program that "
                            "wrote the file did not calculate it): open and save it in a spreadsheet program, "
                            "or type the value", file=label, line=number, column=_column_label(column, True),
                        )
                rows.append(list(row[:XLSX_MAX_COLUMNS]))
                numbers.append(number)
            while rows and all(v is None or (isinstance(v, str) and not v.strip()) for v in rows[-1]):
                rows.pop()
                numbers.pop()
            width = max((i + 1 for row in rows for i, v in enumerate(row) if v is not None), default=0)
            if rows:  # the columns the table uses (a missing column is then named right after them)
                sheets.append((label, [row[:width] for row in rows], numbers))
    finally:
        values.close()
        formulas.close()
    if not sheets:
        raise ProjectFileError("the workbook is empty: the first row of a sheet must name the columns",
                               file=filename, line=1)
    return sheets


#: Endings of spreadsheet and text formats coldroom does not read, with what to do instead.
_OTHER_FORMATS = {
    ".xls": "an Excel 97-2003 workbook (.xls)",
    ".xlsm": "a macro-enabled workbook (.xlsm)",
    ".ods": "an OpenDocument spreadsheet (.ods)",
    ".numbers": "a Numbers spreadsheet",
    ".txt": "a text file (.txt)",
    ".tsv": "a tab-separated file (.tsv)",
    ".json": "a JSON file",
}
ACCEPTED = "a catalogue is read from .yaml/.yml, .csv (UTF-8, comma-separated) or .xlsx, by the name's ending"


def _merge_sheets(sheets: Sequence[tuple[str, list[list[Any]], list[int]]], filename: str) -> tuple[dict, _Table]:
    """One catalogue from the tables of several sheets (one currency for all)."""
    merged: dict[str, Any] = {group: [] for group in KINDS.values()}
    combined = _Table(filename)
    for label, rows, numbers in sheets:
        data, table = catalogue_from_rows(rows, label, letters=True, lines=numbers)
        if "currency" in merged and data["currency"] != merged["currency"]:
            where = table.marks["currency"]
            raise ProjectFileError(f"currency {data['currency']!r} differs from {merged['currency']!r} on another "
                                   "sheet: one catalogue, one currency", file=label, line=where[0], column=where[1],
                                   key="currency")
        if "currency" not in merged:
            merged["currency"] = data["currency"]
            combined.marks["currency"] = table.marks["currency"]
            combined.files["currency"] = label
        for group in KINDS.values():
            offset = len(merged[group])
            for index in range(len(data[group])):
                combined.rows[(group, offset + index)] = table.rows[(group, index)]
                combined.files[(group, offset + index)] = label
            merged[group].extend(data[group])
    if len(sheets) == 1:
        combined = replace(combined, filename=sheets[0][0], files={})
    return merged, combined


def parse_catalogue(raw: bytes, filename: str) -> Catalogue:
    """Read a catalogue from the bytes of a ``.yaml``, ``.csv`` or ``.xlsx`` file (by the name's suffix).

    Raises
    ------
    ProjectFileError
        The first problem, located (exit code 65).
    """
    suffix = Path(filename).suffix.lower()
    if suffix == ".csv":
        rows, lines = _read_csv(raw, filename)
        data, located = catalogue_from_rows(rows, filename, lines=lines)
    elif suffix == ".xlsx":
        data, located = _merge_sheets(_read_xlsx(raw, filename), filename)
    elif suffix in (".yaml", ".yml"):
        from coldroom.inputs.safeyaml import load_yaml

        loaded = load_yaml(raw, filename=filename, max_bytes=MAX_CATALOGUE_BYTES)
        data, located = loaded.data, loaded
    else:
        what = _OTHER_FORMATS.get(suffix, f"a file ending in {suffix!r}" if suffix else "a file with no ending")
        raise ProjectFileError(f"{what} is not read: {ACCEPTED}; save or rename it as one of them", file=filename)
    try:
        catalogue = Catalogue.model_validate(data, context={"system": "SI"})
    except ValidationError as exc:
        errors = exc.errors(include_url=False)
        first = errors[0]
        message = _message(first)
        if len(errors) > 1:
            message += f" (and {len(errors) - 1} more error{'s' if len(errors) > 2 else ''})"
        raise located.error(message, _refined_location(first)) from None
    from coldroom.registry import normalise

    keys = {"condensing_units": ("model",), "unit_coolers": ("model",),
            **{group: key for group, _model, key in ITEM_KINDS.values()}}
    for group, fields in keys.items():
        first_seen: dict[tuple, int] = {}
        for i, entry in enumerate(getattr(catalogue, group)):
            key = tuple(normalise(str(getattr(entry, f))) for f in fields)
            if key in first_seen:
                where = located.error("", (group, first_seen[key], fields[0]))
                named = " ".join(f"{f} {getattr(entry, f)!r}" for f in fields)
                raise located.error(
                    f"{named} is listed twice (first at {where.line}:{where.column}): "
                    "each item once, with one price",
                    (group, i, fields[0]),
                )
            first_seen[key] = i
    return catalogue


def load_catalogue(path: str | Path) -> Catalogue:
    """Read and validate the catalogue file at *path* (``.yaml``/``.yml``, ``.csv`` or ``.xlsx``)."""
    from coldroom.inputs.safeyaml import read_source

    name = os.fspath(path)
    raw = read_source(name, max_bytes=MAX_CATALOGUE_BYTES, what="catalogue",
                      typical="a catalogue of a few thousand models is well under that")
    return parse_catalogue(raw, name)


def catalogue_rows(data: dict[str, Any]) -> list[list[Any]]:
    """The table (header first) of catalogue data in the YAML layout: the inverse of :func:`catalogue_from_rows`.

    Values are kept as given (numbers or strings with units); coefficient lists
    become one cell of numbers separated by blanks.
    """
    flat_rows: list[dict[str, Any]] = []
    for kind, group in KINDS.items():
        for entry in data.get(group, []):
            flat: dict[str, Any] = {"kind": kind, "currency": data["currency"]}

            def walk(prefix: str, value: Any) -> None:
                if isinstance(value, dict):
                    for k, v in value.items():
                        walk(f"{prefix}.{k}" if prefix else k, v)
                elif isinstance(value, list) and value and isinstance(value[0], list):
                    flat[prefix] = " | ".join("; ".join(str(x) for x in row) for row in value)
                elif isinstance(value, list) and any(isinstance(x, str) for x in value):
                    flat[prefix] = "; ".join(str(x) for x in value)
                elif isinstance(value, list):
                    flat[prefix] = " ".join(repr(float(x)) for x in value)
                else:
                    flat[prefix] = value

            walk("", entry)
            flat_rows.append(flat)
    header: list[str] = ["kind", "model", "currency", "price"]
    for flat in flat_rows:
        header += [h for h in flat if h not in header]
    return [header] + [[flat.get(h) for h in header] for flat in flat_rows]


def json_schema() -> dict[str, Any]:
    """JSON Schema of the catalogue file (YAML layout)."""
    schema = Catalogue.model_json_schema()
    schema["$schema"] = "https://json-schema.org/draft/2020-12/schema"
    schema["title"] = "coldroom equipment catalogue"
    return schema
