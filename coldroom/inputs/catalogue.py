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
import re
from dataclasses import dataclass, field
from pathlib import Path
from typing import Any, Literal, Optional, Sequence

from pydantic import Field, ValidationError, model_validator

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
    Q,
    CompressorPolynomial,
    CondenserRating,
    ExistingUnit,
    RatedPoint,
    RatingTable,
    Strict,
    UnitCoolerRating,
)
from coldroom.inputs.projectfile.parsing import _message, _refined_location

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

    model: str = Field(min_length=1, max_length=100)
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

    model: str = Field(min_length=1, max_length=100)
    refrigerant: Optional[str] = Field(
        default=None, description="The refrigerant the rating is for; when given, only systems on it use the coil."
    )
    capacity: Q("power", gt=0.0, le=1e6)  # type: ignore[valid-type]
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

    def error(self, message: str, path: Sequence[object] = ()) -> ProjectFileError:
        path = tuple(path)
        if len(path) >= 2 and (path[0], path[1]) in self.rows:
            row, columns = self.rows[(path[0], path[1])]
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
            return ProjectFileError(message, file=self.filename, line=row, column=column, key=str(path[0]))
        return ProjectFileError(message, file=self.filename, line=1, column=1, key=None)


#: rating_table keys written in one cell: lists of numbers; capacity and power rows separated by "|".
_TABLE_LISTS = ("evaporating_temperatures", "ambient_temperatures", "capacity", "power")
_NUMBER = re.compile(r"[-+]?(?:\d+\.?\d*|\.\d+)(?:[eE][-+]?\d+)?")


def _cell(header: str, value: Any) -> Any:
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


def catalogue_from_rows(rows: Sequence[Sequence[Any]], filename: str, *, letters: bool = False) -> tuple[dict, _Table]:
    """Catalogue data (as YAML would give it) and cell positions from a table's rows.

    Parameters
    ----------
    rows : sequence of sequences
        First row the column names; blank rows are skipped.
    filename : str
    letters : bool
        Name columns by letter (spreadsheets) instead of number (CSV).
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
    data: dict[str, Any] = {group: [] for group in KINDS.values()}
    currency: Optional[tuple[str, int]] = None
    for r, values in enumerate(rows[1:], start=2):
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


def _read_xlsx(raw: bytes, filename: str) -> list[list[Any]]:
    try:
        import openpyxl  # only when a spreadsheet is read
    except ImportError:  # pragma: no cover - openpyxl is a dependency
        raise ProjectFileError("reading .xlsx needs openpyxl (pip install openpyxl)", file=filename) from None
    try:
        book = openpyxl.load_workbook(io.BytesIO(raw), read_only=True, data_only=True)
    except Exception as exc:  # openpyxl raises many kinds on a damaged file
        raise ProjectFileError(f"not a readable .xlsx workbook ({type(exc).__name__})", file=filename) from None
    sheet = book.worksheets[0]
    rows = [list(row) for row in sheet.iter_rows(values_only=True)]
    book.close()
    return rows


def parse_catalogue(raw: bytes, filename: str) -> Catalogue:
    """Read a catalogue from the bytes of a ``.yaml``, ``.csv`` or ``.xlsx`` file (by the name's suffix).

    Raises
    ------
    ProjectFileError
        The first problem, located (exit code 65).
    """
    suffix = Path(filename).suffix.lower()
    if suffix in (".csv", ".xlsx"):
        if suffix == ".csv":
            try:
                text = raw.decode("utf-8-sig")
            except UnicodeDecodeError:
                raise ProjectFileError("not UTF-8 text (save the CSV as UTF-8)", file=filename) from None
            rows = list(csv.reader(io.StringIO(text)))
        else:
            rows = _read_xlsx(raw, filename)
        data, located = catalogue_from_rows(rows, filename, letters=suffix == ".xlsx")
    else:
        from coldroom.inputs.safeyaml import load_yaml

        loaded = load_yaml(raw, filename=filename)
        data, located = loaded.data, loaded
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

    name = str(Path(path))
    return parse_catalogue(read_source(name), name)


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
