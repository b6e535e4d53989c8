"""Units at the edge: parse "100 mm", "35 °F", "2.5 kW", "3 TR" into SI; format SI for people.

A small explicit table instead of a general units library: the trade's spellings
("TR", "Btu/h", "35 F", "cfm") are read the way a contractor means them, and the
import costs nothing.

SI units used inside coldroom, per kind:

==========================  ==========  ==========================================
kind                        SI unit     notes
==========================  ==========  ==========================================
length                      m
area                        m²
volume                      m³
temperature                 °C          an absolute temperature, stored in °C
temperature_difference      K           a 9 °F difference is 5 K
power                       W
energy                      J
mass                        kg
time                        s
pressure                    Pa          absolute
conductivity                W/(m·K)
u_value                     W/(m²·K)
specific_heat               J/(kg·K)
specific_energy             J/kg        latent heat, enthalpy
power_per_area              W/m²
density                     kg/m³
volume_flow                 m³/s
velocity                    m/s
internal_volume             m³          shown in L (lines, coils, receivers)
fraction                    1           "85 %" → 0.85
==========================  ==========  ==========================================

Conversion factors are exact by definition where a definition exists (inch,
foot, pound, international-table Btu, ton of refrigeration = 12 000 Btu/h);
sources are named beside each.

Examples
--------
>>> parse_quantity("100 mm", "length")
0.1
>>> parse_quantity("35 °F", "temperature")
1.6666666666666667
>>> parse_quantity("9 °F", "temperature_difference")
5.0
>>> round(parse_quantity("3 TR", "power"), 3)
10550.559
>>> parse_quantity(4, "length", default_unit="in")
0.1016
"""

from __future__ import annotations

import math
import re
from dataclasses import dataclass
from typing import Sequence

from coldroom.constants import SECONDS_PER_DAY_S, STANDARD_ATMOSPHERE_PA, ZERO_CELSIUS_K
from coldroom.errors import UnitError

# --- exact or defined factors -----------------------------------------------
INCH = 0.0254  # m, exact (international yard and pound agreement, 1959)
FOOT = 0.3048  # m, exact (same)
POUND = 0.45359237  # kg, exact (same)
BTU = 1055.05585262  # J, International Table Btu (NIST SP 811) [ref:nist-sp811]
BTU_PER_HOUR = BTU / 3600.0  # W, = 0.29307107... W
TON_REFRIGERATION = 12000.0 * BTU_PER_HOUR  # W, 12 000 Btu/h by definition (NIST SP 811)
HORSEPOWER = 745.69987158227022  # W, mechanical hp (NIST SP 811)
PSI = 6894.757293168361  # Pa, lbf/in² (NIST SP 811)
INCH_HG = 3386.389  # Pa, conventional inch of mercury at 0 °C (NIST SP 811)


@dataclass(frozen=True)
class Unit:
    """One spelling of a unit: SI value = (value + zero_shift) × factor + offset."""

    symbol: str
    factor: float
    offset: float = 0.0
    zero_shift: float = 0.0

    def to_si(self, value: float) -> float:
        return (value + self.zero_shift) * self.factor + self.offset

    def from_si(self, value_si: float) -> float:
        return (value_si - self.offset) / self.factor - self.zero_shift


def _u(symbol: str, factor: float, offset: float = 0.0, zero_shift: float = 0.0) -> Unit:
    return Unit(symbol, factor, offset, zero_shift)

# kind -> {normalised spelling: Unit}. The first spelling listed for each unit
# is the one shown in error messages.
_TABLE: dict[str, dict[str, Unit]] = {}
_SHOWN: dict[str, list[str]] = {}


_PREFIX_WORDS = {"m": "milli-", "M": "mega- (millions)"}


def _add(kind: str, spellings: tuple[str, ...], unit: Unit) -> None:
    table = _TABLE.setdefault(kind, {})
    shown = _SHOWN.setdefault(kind, [])
    shown.append(spellings[0])
    for spelling in spellings:
        table[_normalise(spelling)] = unit


def _normalise(text: str) -> str:
    """Canonical form of a unit spelling: lower case, no blanks or separators."""
    t = text.strip()
    t = t.replace("º", "°").replace("˚", "°")
    t = t.replace("²", "2").replace("³", "3").replace("µ", "u")
    t = t.lower()
    t = re.sub(r"\bdeg(rees?)?\s*", "°", t)
    t = t.replace("per", "/") if re.fullmatch(r"[a-z0-9°\s]+per[a-z0-9°\s]+", t) else t
    t = re.sub(r"[\s·*.\-_()^]", "", t)
    return t


# length
_add("length", ("m", "metre", "meter", "metres", "meters"), _u("m", 1.0))
_add("length", ("mm", "millimetre", "millimeter", "millimetres", "millimeters"), _u("mm", 1e-3))
_add("length", ("cm", "centimetre", "centimeter", "centimetres", "centimeters"), _u("cm", 1e-2))
_add("length", ("in", "inch", "inches", '"'), _u("in", INCH))
_add("length", ("ft", "foot", "feet", "'"), _u("ft", FOOT))
# area
_add("area", ("m²", "m2", "sqm", "sq m"), _u("m²", 1.0))
_add("area", ("ft²", "ft2", "sqft", "sq ft", "square feet"), _u("ft²", FOOT**2))
# volume
_add("volume", ("m³", "m3", "cubic metres", "cubic meters"), _u("m³", 1.0))
_add("volume", ("L", "l", "litre", "liter", "litres", "liters"), _u("L", 1e-3))
_add("volume", ("ft³", "ft3", "cuft", "cu ft", "cubic feet"), _u("ft³", FOOT**3))
# absolute temperature (stored in °C)
_add("temperature", ("°C", "C", "celsius"), _u("°C", 1.0))
_add("temperature", ("°F", "F", "fahrenheit"), _u("°F", 5.0 / 9.0, 0.0, -32.0))
_add("temperature", ("K", "kelvin"), _u("K", 1.0, -ZERO_CELSIUS_K))
# temperature difference (K)
_add("temperature_difference", ("K", "kelvin", "delta_K"), _u("K", 1.0))
_add("temperature_difference", ("°C", "C", "delta_C"), _u("°C", 1.0))
_add("temperature_difference", ("°F", "F", "R", "°R", "delta_F"), _u("°F", 5.0 / 9.0))
# power
_add("power", ("W", "watt", "watts"), _u("W", 1.0))
_add("power", ("kW", "kilowatt", "kilowatts"), _u("kW", 1e3))
_add("power", ("MW",), _u("MW", 1e6))
_add("power", ("Btu/h", "btu/hr", "btuh", "btu/hour"), _u("Btu/h", BTU_PER_HOUR))
_add("power", ("MBH", "kBtu/h", "mbtuh"), _u("MBH", 1000.0 * BTU_PER_HOUR))
_add("power", ("TR", "ton", "tons", "RT", "ton of refrigeration"), _u("TR", TON_REFRIGERATION))
_add("power", ("hp", "horsepower"), _u("hp", HORSEPOWER))
# energy
_add("energy", ("J", "joule", "joules"), _u("J", 1.0))
_add("energy", ("kJ",), _u("kJ", 1e3))
_add("energy", ("MJ",), _u("MJ", 1e6))
_add("energy", ("Wh",), _u("Wh", 3600.0))
_add("energy", ("kWh",), _u("kWh", 3.6e6))
_add("energy", ("Btu", "btus"), _u("Btu", BTU))
# mass
_add("mass", ("kg", "kilogram", "kilograms", "kgs"), _u("kg", 1.0))
_add("mass", ("g", "gram", "grams"), _u("g", 1e-3))
_add("mass", ("t", "tonne", "tonnes", "metric ton"), _u("t", 1e3))
_add("mass", ("lb", "lbs", "pound", "pounds", "lbm"), _u("lb", POUND))
# time
_add("time", ("s", "sec", "second", "seconds"), _u("s", 1.0))
_add("time", ("min", "mins", "minute", "minutes"), _u("min", 60.0))
_add("time", ("h", "hr", "hrs", "hour", "hours"), _u("h", 3600.0))
_add("time", ("d", "day", "days"), _u("d", SECONDS_PER_DAY_S))
# pressure (absolute)
_add("pressure", ("Pa", "pascal"), _u("Pa", 1.0))
_add("pressure", ("hPa", "mbar"), _u("hPa", 100.0))
_add("pressure", ("kPa",), _u("kPa", 1e3))
_add("pressure", ("MPa",), _u("MPa", 1e6))
_add("pressure", ("bar", "bara", "bar(a)"), _u("bar", 1e5))
_add("pressure", ("psi", "psia", "lbf/in2"), _u("psia", PSI))
_add("pressure", ("inHg", "in hg"), _u("inHg", INCH_HG))
_add("pressure", ("atm",), _u("atm", STANDARD_ATMOSPHERE_PA))
# pressure (gauge): a gauge reads above the surrounding air; taken here as the
# standard atmosphere (101.325 kPa, exact by definition [ref:nist-sp811]), so "0 bar(g)"
# is 101.325 kPa absolute. A site far above sea level reads a little higher
# on its gauges (about 1 kPa per 100 m) [trade].
_add("pressure", ("bar(g)", "barg"), _u("bar(g)", 1e5, offset=STANDARD_ATMOSPHERE_PA))
_add("pressure", ("kPa(g)", "kPag"), _u("kPa(g)", 1e3, offset=STANDARD_ATMOSPHERE_PA))
_add("pressure", ("MPa(g)", "MPag"), _u("MPa(g)", 1e6, offset=STANDARD_ATMOSPHERE_PA))
_add("pressure", ("psig", "psi(g)"), _u("psig", PSI, offset=STANDARD_ATMOSPHERE_PA))
# conductivity
_add("conductivity", ("W/(m·K)", "W/mK", "W/m/K", "W/(mK)"), _u("W/(m·K)", 1.0))
_add("conductivity", ("mW/(m·K)", "mW/mK"), _u("mW/(m·K)", 1e-3))
_add(
    "conductivity",
    ("Btu·in/(h·ft²·°F)", "Btu in/h ft2 F", "btuin/hft2f", "btuin/hft2°f", "Btu·in/h·ft²·°F"),
    _u("Btu·in/(h·ft²·°F)", BTU_PER_HOUR * INCH / (FOOT**2 * 5.0 / 9.0)),
)
_add(
    "conductivity",
    ("Btu/(h·ft·°F)", "btu/hft°f", "btu/hftf"),
    _u("Btu/(h·ft·°F)", BTU_PER_HOUR / (FOOT * 5.0 / 9.0)),
)
# U-value
_add("u_value", ("W/(m²·K)", "W/m2K", "W/m2/K", "W/(m2K)"), _u("W/(m²·K)", 1.0))
_add(
    "u_value",
    ("Btu/(h·ft²·°F)", "btu/hft2f", "btu/hft2°f", "Btu/h ft2 F"),
    _u("Btu/(h·ft²·°F)", BTU_PER_HOUR / (FOOT**2 * 5.0 / 9.0)),
)
# specific heat
_add("specific_heat", ("kJ/(kg·K)", "kJ/kgK", "kJ/kg/K", "kJ/kg°C", "kJ/(kgK)"), _u("kJ/(kg·K)", 1e3))
_add("specific_heat", ("J/(kg·K)", "J/kgK", "J/kg/K"), _u("J/(kg·K)", 1.0))
_add(
    "specific_heat",
    ("Btu/(lb·°F)", "btu/lb°f", "btu/lbf", "Btu/lb F"),
    _u("Btu/(lb·°F)", BTU / (POUND * 5.0 / 9.0)),
)
# specific energy (latent heat, enthalpy)
_add("specific_energy", ("kJ/kg",), _u("kJ/kg", 1e3))
_add("specific_energy", ("J/kg",), _u("J/kg", 1.0))
_add("specific_energy", ("Btu/lb", "btu/lbm"), _u("Btu/lb", BTU / POUND))
# power per area (lighting)
_add("power_per_area", ("W/m²", "W/m2"), _u("W/m²", 1.0))
_add("power_per_area", ("W/ft²", "W/ft2", "W/sqft"), _u("W/ft²", 1.0 / FOOT**2))
# density
_add("density", ("kg/m³", "kg/m3"), _u("kg/m³", 1.0))
_add("density", ("lb/ft³", "lb/ft3", "pcf"), _u("lb/ft³", POUND / FOOT**3))
# energy per volume (heat carried by a cubic metre of infiltrating air)
_add("energy_density", ("J/m³", "J/m3"), _u("J/m³", 1.0))
_add("energy_density", ("kJ/m³", "kJ/m3"), _u("kJ/m³", 1e3))
_add("energy_density", ("Btu/ft³", "Btu/ft3"), _u("Btu/ft³", BTU / FOOT**3))
# thermal conductance of a heat exchanger (capacity per kelvin of TD)
_add("conductance", ("W/K",), _u("W/K", 1.0))
_add("conductance", ("Btu/(h·°F)", "btu/hf", "btu/h°f", "Btu/h/F"), _u("Btu/(h·°F)", BTU_PER_HOUR / (5.0 / 9.0)))
# volume flow
_add("volume_flow", ("m³/s", "m3/s"), _u("m³/s", 1.0))
_add("volume_flow", ("m³/h", "m3/h", "cmh"), _u("m³/h", 1.0 / 3600.0))
_add("volume_flow", ("L/s", "l/s"), _u("L/s", 1e-3))
_add("volume_flow", ("cfm", "ft³/min", "ft3/min"), _u("cfm", FOOT**3 / 60.0))
# internal volume of lines, coils and receivers (shown in litres)
_add("internal_volume", ("L", "l", "litre", "liter"), _u("L", 1e-3))
_add("internal_volume", ("m³", "m3"), _u("m³", 1.0))
_add("internal_volume", ("ft³", "ft3", "cu ft"), _u("ft³", FOOT**3))
# velocity (refrigerant lines)
_add("velocity", ("m/s",), _u("m/s", 1.0))
_add("velocity", ("ft/min", "fpm"), _u("ft/min", FOOT / 60.0))
# fraction
_add("fraction", ("%", "percent", "pct"), _u("%", 0.01))
_add("fraction", ("-", "1", "fraction"), _u("-", 1.0))

KINDS: tuple[str, ...] = tuple(_TABLE)

# Bare numbers: the unit each kind means by default in each unit system, unless
# a field declares its own (insulation thickness in mm or in, say).
DEFAULT_UNITS: dict[str, dict[str, str]] = {
    "SI": {
        "length": "m",
        "area": "m²",
        "volume": "m³",
        "temperature": "°C",
        "temperature_difference": "K",
        "power": "W",
        "energy": "kWh",
        "mass": "kg",
        "time": "h",
        "pressure": "kPa",
        "conductivity": "W/(m·K)",
        "u_value": "W/(m²·K)",
        "specific_heat": "kJ/(kg·K)",
        "specific_energy": "kJ/kg",
        "power_per_area": "W/m²",
        "density": "kg/m³",
        "volume_flow": "m³/h",
        "energy_density": "kJ/m³",
        "conductance": "W/K",
        "velocity": "m/s",
        "internal_volume": "L",
        "fraction": "-",
    },
    "IP": {
        "length": "ft",
        "area": "ft²",
        "volume": "ft³",
        "temperature": "°F",
        "temperature_difference": "°F",
        "power": "Btu/h",
        "energy": "Btu",
        "mass": "lb",
        "time": "h",
        "pressure": "psia",
        "conductivity": "Btu·in/(h·ft²·°F)",
        "u_value": "Btu/(h·ft²·°F)",
        "specific_heat": "Btu/(lb·°F)",
        "specific_energy": "Btu/lb",
        "power_per_area": "W/ft²",
        "density": "lb/ft³",
        "volume_flow": "cfm",
        "energy_density": "Btu/ft³",
        "conductance": "Btu/(h·°F)",
        "velocity": "ft/min",
        "internal_volume": "ft³",
        "fraction": "-",
    },
}

_NUMBER = r"[-+]?(?:\d+(?:\.\d*)?|\.\d+)(?:[eE][-+]?\d+)?"
_COMMA_NUMBER = re.compile(r"^\s*[-+]?[\d.]*\d?,[\d.,]*")  # "1,000 kg", "2,5 kW", ",5"

#: Unit symbols whose SI prefix changes meaning with its case (m milli, M mega): the symbol
#: written with the other case of its prefix ("mW", "MM") is refused, never guessed (SI
#: Brochure, 9th ed., 3.1: prefix symbols are case-sensitive).
CASE_SENSITIVE = frozenset({"mm", "MW", "MJ", "MPa", "MPa(g)", "mW/(m·K)"})
_QUANTITY = re.compile(rf"^\s*(?P<number>{_NUMBER})\s*(?P<unit>.*?)\s*$")


def accepted_units(kind: str) -> list[str]:
    """The unit spellings shown to users for *kind*.

    Examples
    --------
    >>> accepted_units("temperature")
    ['°C', '°F', 'K']
    """
    _check_kind(kind)
    return list(_SHOWN[kind])


def _check_kind(kind: str) -> None:
    if kind not in _TABLE:
        raise ValueError(f"unknown quantity kind {kind!r}; kinds: {', '.join(KINDS)}")


def unit_for(kind: str, spelling: str) -> Unit:
    """Look up *spelling* among the units of *kind*; UnitError lists the valid ones."""
    _check_kind(kind)
    key = _normalise(spelling)
    unit = _TABLE[kind].get(key)
    if unit is not None:
        if unit.symbol in CASE_SENSITIVE and key == _normalise(unit.symbol) and spelling.strip()[:1] != unit.symbol[0]:
            raise UnitError(
                f"{spelling!r} is not a unit of {kind.replace('_', ' ')} here: unit prefixes are case-sensitive "
                f"(m is milli, M is mega); write {unit.symbol!r} if you mean {_PREFIX_WORDS[unit.symbol[0]]}"
                + (", or more likely 'kW'" if kind == "power" else "")
            )
        return unit
    other = [k for k, table in _TABLE.items() if key in table and k != kind]
    shown = ", ".join(_SHOWN[kind])
    label = kind.replace("_", " ")
    if other:
        raise UnitError(
            f"{spelling!r} is a unit of {other[0].replace('_', ' ')}, not of {label}; use one of: {shown}"
        )
    raise UnitError(f"unknown unit {spelling!r} for {label}; use one of: {shown}")


def parse_quantity(
    value: object,
    kind: str,
    default_unit: str | None = None,
    system: str = "SI",
) -> float:
    """Convert a bare number or a "number unit" string to SI.

    Parameters
    ----------
    value : float | int | str
        ``12.5``, ``"100 mm"``, ``"35 °F"``, ``"2.5 kW"``, ``"85 %"``.
    kind : str
        One of :data:`KINDS`.
    default_unit : str, optional
        Unit of a bare number; when omitted, the default of *kind* in *system*.
    system : {"SI", "IP"}
        Unit system of the project, used for bare numbers.

    Returns
    -------
    float
        The value in the SI unit of *kind* (°C for temperatures).

    Raises
    ------
    UnitError
        Unknown unit, a unit of another kind, not a number, or not finite.

    Examples
    --------
    >>> parse_quantity("12000 Btu/h", "power")  # doctest: +ELLIPSIS
    3516.85...
    >>> parse_quantity("85 %", "fraction")
    0.85
    >>> parse_quantity(50, "temperature", system="IP")
    10.0
    """
    _check_kind(kind)
    if isinstance(value, bool):
        raise UnitError(f"expected a number or a quantity such as '{_example(kind)}', got {value!r}")
    if isinstance(value, (int, float)):
        number = float(value)
        spelling = default_unit or DEFAULT_UNITS[system][kind]
    elif isinstance(value, str):
        if _COMMA_NUMBER.match(value):
            raise UnitError(
                f"{value!r}: a comma in a number is ambiguous; write it without thousands separators and "
                f"with a decimal point, e.g. '1000 kg', '2.5 kW'"
            )
        match = _QUANTITY.match(value)
        if not match:
            raise UnitError(
                f"cannot read {value!r} as a {kind.replace('_', ' ')}; write a number and a unit, e.g. '{_example(kind)}'"
            )
        number = float(match.group("number"))
        spelling = match.group("unit") or default_unit or DEFAULT_UNITS[system][kind]
    else:
        raise UnitError(f"expected a number or a quantity such as '{_example(kind)}', got {type(value).__name__}")
    if not math.isfinite(number):
        raise UnitError(f"{value!r} is not a finite number")
    unit = unit_for(kind, spelling)
    result = unit.to_si(number)
    if kind == "temperature" and result < -ZERO_CELSIUS_K:
        raise UnitError(f"{value!r} is below absolute zero")
    return result


def _example(kind: str) -> str:
    examples = {
        "length": "2.4 m",
        "area": "12 m²",
        "volume": "30 m³",
        "temperature": "2 °C",
        "temperature_difference": "6 K",
        "power": "2.5 kW",
        "energy": "12 kWh",
        "mass": "500 kg",
        "time": "8 h",
        "pressure": "101.3 kPa",
        "conductivity": "0.023 W/(m·K)",
        "u_value": "0.25 W/(m²·K)",
        "specific_heat": "3.6 kJ/(kg·K)",
        "specific_energy": "250 kJ/kg",
        "power_per_area": "6 W/m²",
        "density": "1.2 kg/m³",
        "volume_flow": "500 m³/h",
        "energy_density": "40 kJ/m³",
        "conductance": "500 W/K",
        "velocity": "5 m/s",
        "internal_volume": "2.5 L",
        "fraction": "85 %",
    }
    return examples.get(kind, "1")


def to_unit(value_si: float, kind: str, unit: str) -> float:
    """Convert an SI value of *kind* into *unit*.

    Examples
    --------
    >>> round(to_unit(3516.8528, "power", "TR"), 6)
    1.0
    >>> to_unit(0.0, "temperature", "°F")
    32.0
    """
    return unit_for(kind, unit).from_si(value_si)


# Display units per system: (kind) -> unit symbol used on the sheet and terminal.
DISPLAY_UNITS: dict[str, dict[str, str]] = {
    system: {**DEFAULT_UNITS[system], **extra}
    for system, extra in (
        ("SI", {"thickness": "mm", "power_large": "kW", "mass_flow": "kg/s"}),
        ("IP", {"thickness": "in", "power_large": "TR", "mass_flow": "lb/h"}),
    )
}

_DISPLAY_KIND = {"thickness": "length", "power_large": "power", "mass_flow": "mass_flow"}


def display(value_si: float, kind: str, system: str = "SI", digits: int | None = None, *,
            signed_zero: bool = True) -> str:
    """Format an SI value for people in the project's unit system, unit included.

    *kind* may also be ``"thickness"`` (mm / in), ``"power_large"`` (kW / TR)
    or ``"mass_flow"`` (kg/s / lb/h).

    Examples
    --------
    >>> display(2.0, "temperature", "IP")
    '35.6 °F'
    >>> display(2.0, "temperature")
    '2.0 °C'
    >>> display(7033.7, "power_large", "IP")
    '2.00 TR'
    >>> display(0.1, "thickness")
    '100 mm'
    """
    unit = DISPLAY_UNITS[system][kind]
    base = _DISPLAY_KIND.get(kind, kind)
    if digits is None and base in ("temperature", "temperature_difference"):
        digits = 1
    if base == "mass_flow":
        value = value_si if unit == "kg/s" else value_si * 3600.0 / POUND
    else:
        value = to_unit(value_si, base, unit)
    return f"{format_number(value, digits, signed_zero=signed_zero)} {unit}"


def format_number(value: float, digits: int | None = None, *, signed_zero: bool = True) -> str:
    """Round for reading: about three significant figures (or *digits* decimals), thousands separated.

    ``signed_zero=False`` writes a value that rounds to zero at *digits* decimals as
    ``0.0``, never ``-0.0`` (the chart's axis and line labels).

    Examples
    --------
    >>> format_number(12345.6)
    '12,346'
    >>> format_number(0.01234)
    '0.0123'
    >>> format_number(3.14159, 2)
    '3.14'
    >>> format_number(-0.04, 1), format_number(-0.04, 1, signed_zero=False)
    ('-0.0', '0.0')
    """
    if digits is not None:
        if not signed_zero and abs(value) < 0.5 * 10.0**-digits:
            value = 0.0
        return f"{value:,.{digits}f}"
    magnitude = abs(value)
    if magnitude >= 100 or value == 0:
        return f"{value:,.0f}"
    if magnitude >= 10:
        return f"{value:,.1f}"
    if magnitude >= 1:
        return f"{value:,.2f}"
    return f"{value:.3g}"


def format_capacity(watts: float, system: str = "SI", *, fixed: bool = True) -> str:
    """A refrigeration capacity for people: kW (W below 1 kW) in SI; Btu/h with TR in IP.

    ``fixed=True`` (the sheet's tables): kW to two decimals, W and Btu/h whole, the TR
    added from 1 TR (0.5 % tolerance). ``fixed=False`` (the terminal): about three
    significant figures (:func:`format_number`), the TR always added in IP.

    Examples
    --------
    >>> format_capacity(5234.0), format_capacity(5234.0, fixed=False)
    ('5.23 kW', '5.23 kW')
    >>> format_capacity(12345.0), format_capacity(12345.0, fixed=False)
    ('12.35 kW', '12.3 kW')
    >>> format_capacity(3516.85, "IP")
    '12,000 Btu/h (1.00 TR)'
    >>> format_capacity(1500.0, "IP"), format_capacity(1500.0, "IP", fixed=False)
    ('5,118 Btu/h', '5,118 Btu/h (0.427 TR)')
    """
    if not fixed:
        if system == "IP":
            return f"{display(watts, 'power', 'IP')} ({display(watts, 'power_large', 'IP')})"
        return display(watts, "power_large", "SI") if abs(watts) >= 1000 else display(watts, "power", "SI")
    if system == "IP":
        text = display(watts, "power", "IP", 0)
        if abs(watts) >= TON_REFRIGERATION * 0.995:
            text += f" ({display(watts, 'power_large', 'IP', 2)})"
        return text
    if abs(watts) >= 1000:
        return display(watts, "power_large", "SI", 2)
    return display(watts, "power", "SI", 0)


def format_electrical(watts: float) -> str:
    """An electrical figure: W below 1 kW, else kW, in either unit system (electricians work in kW).

    Examples
    --------
    >>> format_electrical(2310.0), format_electrical(150.0)
    ('2.31 kW', '150 W')
    """
    return display(watts, "power_large", "SI", 2) if abs(watts) >= 1000 else display(watts, "power", "SI", 0)


def format_temperature(value_c: "float | None", system: str = "SI", missing: str = "–") -> str:
    """A temperature with one decimal in *system*, or *missing* when there is none.

    Examples
    --------
    >>> format_temperature(-2.5), format_temperature(0.0, "IP"), format_temperature(None)
    ('-2.5 °C', '32.0 °F', '–')
    """
    if value_c is None:
        return missing
    return display(value_c, "temperature", system, 1)


def format_money(value: float, currency: str, decimals: int = 0) -> str:
    """A price: *decimals* places, thousands set apart by a space, the currency after.

    Examples
    --------
    >>> format_money(12345.6, "EUR"), format_money(12345.6, "EUR", 2)
    ('12 346 EUR', '12 345.60 EUR')
    """
    return f"{value:,.{decimals}f}".replace(",", " ") + f" {currency}"


def format_terms(terms: "Sequence[object]", system: str = "SI") -> str:
    """Write the working of a load line (:class:`coldroom.results.Term` s) in *system*.

    A plain string among the terms is a phrase's text and is copied as it is,
    so a note can mix words and numbers: ``("rated ", Term(4500, "power", sep=""))``.

    Examples
    --------
    >>> from coldroom.results import Term
    >>> working = (Term(0.2, "u_value", "U "), Term(13.5, "area"), Term(22.0, "temperature_difference"))
    >>> format_terms(working, "SI")
    'U 0.200 W/(m²·K) × 13.5 m² × 22.0 K'
    >>> format_terms(working, "IP")
    'U 0.0352 Btu/(h·ft²·°F) × 145 ft² × 39.6 °F'
    >>> format_terms(("K = ", Term(500.0, "conductance", sep="")), "IP")
    'K = 948 Btu/(h·°F)'
    >>> format_terms((Term(0.0, "temperature:bare", sep=""), " … ", Term(4.0, "temperature", sep="")), "IP")
    '32.0 … 39.2 °F'
    """
    if isinstance(terms, str):
        phrase = getattr(terms, "phrase", None)  # a coldroom.results.Note keeps its numbers in SI
        return terms if phrase is None or system == "SI" else format_terms(phrase, system)
    parts: list[str] = []
    for i, term in enumerate(terms):
        if isinstance(term, str):
            parts.append(term)
            continue
        value, kind = term.value, term.kind  # type: ignore[attr-defined]
        kind, _, flag = kind.partition(":")  # "temperature:bare" → the number alone (first end of a range)
        if kind == "number":
            text = f"{value:g}" if float(value).is_integer() else format_number(value)
        elif kind == "power" and system == "SI" and abs(value) >= 1000.0:
            text = display(value, "power_large", system)
        elif kind == "percent":
            text = f"{100.0 * value:.0f} %"
        elif kind == "hours":
            text = f"{value / 3600.0:g} h"
        elif kind == "minutes":
            text = f"{value / 60.0:g} min"
        elif kind == "u_value":
            unit = DISPLAY_UNITS[system][kind]
            text = f"{to_unit(value, kind, unit):.3g} {unit}" if system == "IP" else f"{value:.3f} {unit}"
        else:
            text = display(value, kind, system)
        if flag == "bare":
            text = text.rsplit(" ", 1)[0]
        sep = term.sep if i else ""  # type: ignore[attr-defined]
        parts.append(f"{sep}{term.prefix}{text}{term.suffix}")  # type: ignore[attr-defined]
    return "".join(parts)
