"""Quantity fields of the project file: ``Q(kind, si=, ip=, ge=, le=)``, the named field types and :class:`Strict`.

A quantity field accepts a bare number in the project's unit system (read from
the context of the validation, or the unit system being validated) or a string
with a unit, and holds a plain float in SI after validation; a value out of
range is refused naming the value and the range in the file's units.
"""

from __future__ import annotations

import re
import types as _types
from contextvars import ContextVar
from functools import partial
from typing import Annotated, Any, Union, get_args, get_origin

from pydantic import AfterValidator, BaseModel, BeforeValidator, ConfigDict, ValidationInfo, field_validator
from pydantic_core import PydanticCustomError

from coldroom import units as _units
from coldroom.constants import SECONDS_PER_DAY_S
from coldroom.errors import UnitError


# The unit system used for bare numbers while a file is being validated.
_SYSTEM: ContextVar[str] = ContextVar("coldroom_unit_system", default="SI")


def _parse(
    value: Any,
    info: ValidationInfo | None = None,
    *,
    kind: str,
    si_unit: str | None,
    ip_unit: str | None,
    ge: float | None,
    le: float | None,
    gt: float | None,
) -> float:
    system = _SYSTEM.get()
    if info is not None and info.context and "system" in info.context:
        system = info.context["system"]
    default = si_unit if system == "SI" else ip_unit
    try:
        number = _units.parse_quantity(value, kind, default_unit=default, system=system)
    except UnitError as exc:
        raise PydanticCustomError("coldroom_unit", str(exc)) from None
    low_ok = (ge is None or number >= ge) and (gt is None or number > gt)
    high_ok = le is None or number <= le
    if not (low_ok and high_ok):
        raise PydanticCustomError(
            "coldroom_range",
            "{value} is outside the valid range {range}",
            {"value": _shown(value, kind, default, system), "range": _range_text(kind, ge, gt, le, default, system)},
        )
    return number


def _shown(value: Any, kind: str, default: str | None, system: str) -> str:
    if isinstance(value, str):
        return repr(value)
    unit = default or _units.DEFAULT_UNITS[system][kind]
    return f"{value} {unit}" if kind != "fraction" else f"{value}"


def _range_text(
    kind: str, ge: float | None, gt: float | None, le: float | None, default: str | None, system: str
) -> str:
    unit = default or _units.DEFAULT_UNITS[system][kind]
    if kind == "fraction":
        unit = "%"

    def fmt(x: float) -> str:
        v = _units.to_unit(x, kind, unit)
        return f"{v:.6g}"

    low = ge if ge is not None else gt
    if low is not None and le is not None:
        op = "…" if ge is not None else " (exclusive) … "
        return f"{fmt(low)}{op}{fmt(le)} {unit}"
    if low is not None:
        return f"{'≥' if ge is not None else '>'} {fmt(low)} {unit}"
    return f"≤ {fmt(le)} {unit}"  # type: ignore[arg-type]


def Q(
    kind: str,
    *,
    si: str | None = None,
    ip: str | None = None,
    ge: float | None = None,
    le: float | None = None,
    gt: float | None = None,
) -> Any:
    """An annotated float field holding an SI value parsed from a quantity.

    Parameters
    ----------
    kind : str
        Quantity kind (see :mod:`coldroom.units`).
    si, ip : str, optional
        Unit of a bare number in SI and IP projects (default: the kind's).
    ge, le, gt : float, optional
        Bounds in SI (°C for temperatures).
    """
    validator = partial(_parse, kind=kind, si_unit=si, ip_unit=ip, ge=ge, le=le, gt=gt)

    def run(value: Any, info: ValidationInfo) -> float:
        return validator(value, info)

    run.quantity_kind = kind  # type: ignore[attr-defined]  # read by checks.quantities()
    return Annotated[float, BeforeValidator(run, json_schema_input_type=Union[float, str])]


_CONTROL_CHARACTER = re.compile("[\x00-\x1f\x7f-\x9f]")
_CONTROL_IN_NOTES = re.compile("[\x00-\x08\x0b-\x1f\x7f-\x9f]")  # notes may hold tabs and line breaks


def _no_control(pattern: "re.Pattern[str]") -> Any:
    def check(value: str) -> str:
        found = pattern.search(value)
        if found:
            raise PydanticCustomError(
                "coldroom_control",
                "control character U+{code} in the text; a name is printed on terminals and the sheet, "
                "so write it with letters, digits, spaces and punctuation only",
                {"code": f"{ord(found.group()):04X}"},
            )
        return value

    return AfterValidator(check)


#: Free text printed on the terminal and the sheet: no control characters (an escape sequence
#: in a room name could rewrite the terminal; a NUL cuts text short).
Name = Annotated[str, _no_control(_CONTROL_CHARACTER)]
Notes = Annotated[str, _no_control(_CONTROL_IN_NOTES)]

Temperature = Q("temperature", ge=-60.0, le=70.0)
RoomTemperature = Q("temperature", ge=-50.0, le=25.0)
OutdoorTemperature = Q("temperature", ge=-40.0, le=55.0)
Fraction = Q("fraction", ge=0.0, le=1.0)
RelativeHumidity = Q("fraction", ge=0.0, le=1.0)
HoursPerDay = Q("time", si="h", ip="h", ge=0.0, le=SECONDS_PER_DAY_S)
Length = Q("length", gt=0.0, le=100.0)
Thickness = Q("length", si="mm", ip="in", gt=0.0, le=1.0)
Power = Q("power", ge=0.0, le=1e7)
#: A rating of refrigeration equipment: at least 10 W (nothing smaller is a walk-in's unit, and
#: a vanishing rating only divides by almost zero downstream) [trade].
Rating = Q("power", ge=10.0, le=1e6)
Mass = Q("mass", ge=0.0, le=1e7)


def _takes_numbers(annotation: Any) -> bool:
    """Whether a field of this annotation holds a number (float or int, maybe optional), not a yes/no."""
    if annotation in (float, int):
        return True
    args = get_args(annotation)
    if get_origin(annotation) in (Union, _types.UnionType) and bool not in args:
        return any(arg in (float, int) for arg in args)
    return False


class Strict(BaseModel):
    """Base for every model: unknown keys forbidden, no NaN/inf, frozen; no true/false where a number goes."""

    model_config = ConfigDict(extra="forbid", allow_inf_nan=False, frozen=True, str_strip_whitespace=True)

    @field_validator("*", mode="before")
    @classmethod
    def _no_yes_no_numbers(cls, value: Any, info: ValidationInfo) -> Any:
        # pydantic reads true/false as 1/0 in a float field (an isentropic efficiency of
        # `true` becomes an ideal compressor): the one place every number field refuses them,
        # the quantity fields of Q() included
        if isinstance(value, bool) and info.field_name is not None:
            field = cls.model_fields.get(info.field_name)
            if field is not None and _takes_numbers(field.annotation):
                raise PydanticCustomError(
                    "coldroom_boolean",
                    "{value} is a yes/no value where a number is expected; write the number",
                    {"value": "true" if value else "false"},
                )
        return value
