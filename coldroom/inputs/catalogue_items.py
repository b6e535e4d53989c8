"""The catalogue's priced items besides units and coils: what a quote's bill of quantities draws on.

Kinds (``kind`` column of a table catalogue; the YAML list name in brackets):

================  =====================  ==================================================
kind              YAML list              fields
================  =====================  ==================================================
panel             ``panels``             model, thickness, price (per m²)
door              ``doors``              model, width, height, price (each)
expansion_valve   ``expansion_valves``   model, refrigerant, rated_capacity,
                                         rated_evaporating_temperature,
                                         rated_condensing_temperature, rated_subcooling, price
accessory         ``accessories``        model, role, connection (tube OD) or capacity, price
tube              ``tubes``              series, size (``12 x 1.0 mm``), price (per m)
insulation        ``insulation``         tube_size, thickness, price (per m)
refrigerant       ``refrigerants``       refrigerant, price (per kg)
labour            ``labour``             task, hours, per (m2, item, m, system)
================  =====================  ==================================================

Condensing units and unit coolers may also carry their electrical data
(:class:`Electrical`): ``supply`` (``400 V 3~ 50 Hz``), ``running_current``,
``locked_rotor_current`` [A] and ``power_factor``.
"""

from __future__ import annotations

import re
from typing import Annotated, Any, Literal, Optional

from pydantic import BeforeValidator, Field, model_validator

from coldroom.inputs.projectfile import Q, Strict

_SUPPLY = re.compile(
    r"^\s*(?P<voltage>\d{2,4}(?:\.\d+)?)\s*V\s*(?P<phases>[13])\s*(?:~|ph|phase)\s*"
    r"(?P<frequency>50|60)\s*Hz\s*$", re.IGNORECASE,
)
_AMPERES = re.compile(r"^\s*([-+]?(?:\d+\.?\d*|\.\d+)(?:[eE][-+]?\d+)?)\s*A?\s*$")


def parse_supply(text: str) -> tuple[float, int, float]:
    """Voltage [V], phases and frequency [Hz] of a supply written ``400 V 3~ 50 Hz``.

    Examples
    --------
    >>> parse_supply("400 V 3~ 50 Hz"), parse_supply("230V 1~ 50Hz")
    ((400.0, 3, 50.0), (230.0, 1, 50.0))
    """
    match = _SUPPLY.match(text)
    if match is None:
        raise ValueError(f"supply {text!r} is not read: write it as '400 V 3~ 50 Hz' or '230 V 1~ 50 Hz'")
    return float(match["voltage"]), int(match["phases"]), float(match["frequency"])


def _supply(value: Any) -> Any:
    if isinstance(value, str):
        parse_supply(value)
    return value


def _amperes(value: Any) -> Any:
    if isinstance(value, str):
        match = _AMPERES.match(value)
        if match is None:
            raise ValueError(f"{value!r} is not a current: write amperes, e.g. 8.5 A")
        return float(match.group(1))
    return value


Supply = Annotated[str, BeforeValidator(_supply), Field(max_length=40)]
Current = Annotated[float, BeforeValidator(_amperes), Field(gt=0.0, le=5000.0, description="[A]")]
Price = Annotated[float, Field(ge=0.0, le=1e8)]
Model = Annotated[str, Field(min_length=1, max_length=100)]


class Electrical(Strict):
    """Optional electrical data of a condensing unit or a unit cooler (per unit)."""

    supply: Optional[Supply] = None
    running_current: Optional[Current] = None
    locked_rotor_current: Optional[Current] = None
    power_factor: Optional[float] = Field(default=None, gt=0.0, le=1.0)


class PanelEntry(Strict):
    """Insulated sandwich panel of one thickness; price per m² of panel."""

    model: Model
    thickness: Q("length", si="mm", ip="in", gt=0.0, le=0.5)  # type: ignore[valid-type]
    price: Price


class DoorEntry(Strict):
    """A cold-room door (clear opening width × height), price each."""

    model: Model
    width: Q("length", ge=0.3, le=10.0)  # type: ignore[valid-type]
    height: Q("length", ge=0.5, le=10.0)  # type: ignore[valid-type]
    price: Price


class ExpansionValveEntry(Strict):
    """A thermostatic or electronic expansion valve with its rated capacity at a rating condition."""

    model: Model
    refrigerant: str
    rated_capacity: Q("power", gt=0.0, le=1e6)  # type: ignore[valid-type]
    rated_evaporating_temperature: Q("temperature", ge=-60.0, le=20.0)  # type: ignore[valid-type]
    rated_condensing_temperature: Q("temperature", ge=10.0, le=70.0)  # type: ignore[valid-type]
    rated_subcooling: Q("temperature_difference", ge=0.0, le=30.0)  # type: ignore[valid-type]
    price: Price

    @model_validator(mode="after")
    def _check(self) -> "ExpansionValveEntry":
        from coldroom.data import refrigerants

        refrigerants.lookup(self.refrigerant)
        if self.rated_evaporating_temperature >= self.rated_condensing_temperature:
            raise ValueError("the rated evaporating temperature must lie below the rated condensing temperature")
        return self


AccessoryRole = Literal["filter_drier", "sight_glass", "solenoid_valve", "pressure_regulator", "isolator",
                        "controller"]


class AccessoryEntry(Strict):
    """A line component or an electrical item, chosen by its connection (tube OD) or its capacity."""

    model: Model
    role: AccessoryRole
    connection: Optional[Q("length", si="mm", ip="in", gt=0.0, le=0.2)] = None  # type: ignore[valid-type]
    capacity: Optional[Q("power", gt=0.0, le=1e6)] = None  # type: ignore[valid-type]
    price: Price

    @model_validator(mode="after")
    def _check(self) -> "AccessoryEntry":
        if self.connection is None and self.capacity is None and self.role not in ("isolator", "controller"):
            raise ValueError(f"a {self.role} needs its connection (tube outside diameter) or its capacity")
        return self


class TubeEntry(Strict):
    """Copper tube of a series and size, price per metre."""

    series: Literal["EN 12735-1", "ASTM B280"]
    size: Annotated[str, Field(min_length=1, max_length=40)]
    price: Price

    @model_validator(mode="after")
    def _check(self) -> "TubeEntry":
        from coldroom.data import tubes

        labels = [t.label for t in tubes.series(self.series)]
        if self.size not in labels:
            raise ValueError(f"size {self.size!r} is not a {self.series} size; valid: {', '.join(labels)}")
        return self


class InsulationEntry(Strict):
    """Tube insulation for one tube size, price per metre."""

    tube_size: Annotated[str, Field(min_length=1, max_length=40)]
    thickness: Q("length", si="mm", ip="in", gt=0.0, le=0.2)  # type: ignore[valid-type]
    price: Price


class RefrigerantEntry(Strict):
    """Refrigerant, price per kg."""

    refrigerant: str
    price: Price

    @model_validator(mode="after")
    def _check(self) -> "RefrigerantEntry":
        from coldroom.data import refrigerants

        refrigerants.lookup(self.refrigerant)
        return self


LabourTask = Literal["panels", "door", "condensing_unit", "unit_cooler", "pipework", "electrical", "commissioning"]


class LabourEntry(Strict):
    """Hours a task takes per m², item, metre or system (priced by the quote's labour_rate)."""

    task: LabourTask
    hours: float = Field(ge=0.0, le=1000.0)
    per: Literal["m2", "item", "m", "system"]


#: kind -> (YAML list name, model class, fields that make an entry unique)
ITEM_KINDS: dict[str, tuple[str, type, tuple[str, ...]]] = {
    "panel": ("panels", PanelEntry, ("model",)),
    "door": ("doors", DoorEntry, ("model",)),
    "expansion_valve": ("expansion_valves", ExpansionValveEntry, ("model",)),
    "accessory": ("accessories", AccessoryEntry, ("model",)),
    "tube": ("tubes", TubeEntry, ("series", "size")),
    "insulation": ("insulation", InsulationEntry, ("tube_size", "thickness")),
    "refrigerant": ("refrigerants", RefrigerantEntry, ("refrigerant",)),
    "labour": ("labour", LabourEntry, ("task",)),
}
