"""Unit factors against their definitions.

Sources: NIST Special Publication 811 (2008 ed.) [ref:nist-sp811], Appendix B.8 "Factors for units
listed alphabetically" [pub]; the 1959 international yard and pound agreement
(inch = 25.4 mm, pound = 0.453 592 37 kg exactly) [pub]; ton of refrigeration =
12 000 Btu/h by definition (NIST SP 811, B.8) [pub]. pint (an independent units
library) cross-checks the factors where it reads the spelling the same way.
"""

from __future__ import annotations

import math

import pytest

from coldroom.errors import UnitError
from coldroom.units import parse_quantity, to_unit

# (text, kind, SI value) — values from NIST SP 811 Appendix B.8.
NIST_CASES = [
    ("1 in", "length", 0.0254),  # exact
    ("1 ft", "length", 0.3048),  # exact
    ("1 lb", "mass", 0.45359237),  # exact
    ("1 Btu", "energy", 1055.05585262),  # Btu_IT, exact
    ("1 Btu/h", "power", 0.2930710701722222),  # Btu_IT/h = 0.293 071 1 W
    ("1 TR", "power", 3516.852842066667),  # 12 000 Btu_IT/h = 3.516 853 kW
    ("1 hp", "power", 745.6998715822702),  # horsepower (550 ft·lbf/s) = 745.699 9 W
    ("1 psi", "pressure", 6894.757293168361),  # 6.894 757 kPa
    ("1 kWh", "energy", 3.6e6),  # exact
    ("1 cfm", "volume_flow", 4.719474432e-4),  # ft³/min = 4.719 474 E-04 m³/s
    ("1 ft²", "area", 0.09290304),  # exact
    ("1 ft³", "volume", 0.028316846592),  # exact
    ("1 Btu/(lb·°F)", "specific_heat", 4186.8),  # Btu_IT/(lb·°F) = 4 186.8 J/(kg·K) exactly
    ("1 Btu/lb", "specific_energy", 2326.0),  # Btu_IT/lb = 2 326 J/kg exactly
    ("1 Btu/(h·ft²·°F)", "u_value", 5.678263337),  # 5.678 263 W/(m²·K)
    ("1 Btu·in/(h·ft²·°F)", "conductivity", 0.1442279),  # 0.144 227 9 W/(m·K)
]


@pytest.mark.parametrize("text, kind, expected", NIST_CASES)
def test_factor_matches_nist_sp811(text: str, kind: str, expected: float) -> None:
    assert parse_quantity(text, kind) == pytest.approx(expected, rel=1e-6)


@pytest.mark.parametrize(
    "text, expected_c",
    [
        ("32 °F", 0.0),  # ice point, by definition of the Fahrenheit scale
        ("212 °F", 100.0),  # steam point (ITS-90 differs by < 0.03 K; the scale conversion is exact)
        ("-40 °F", -40.0),
        ("273.15 K", 0.0),  # exact
        ("35 F", 1.6666666666666667),
        ("35 degF", 1.6666666666666667),
        ("14 °F", -10.0),
    ],
)
def test_temperature_scales(text: str, expected_c: float) -> None:
    assert parse_quantity(text, "temperature") == pytest.approx(expected_c, abs=1e-12)


def test_temperature_difference_is_not_a_temperature() -> None:
    # A 9 °F difference is 5 K; a 9 °F temperature is -12.78 °C.
    assert parse_quantity("9 °F", "temperature_difference") == pytest.approx(5.0)
    assert parse_quantity("9 °F", "temperature") == pytest.approx(-12.777777777777779)


@pytest.mark.parametrize(
    "text, kind, pint_text",
    [
        ("4 in", "length", "4 inch"),
        ("12000 Btu/h", "power", "12000 Btu/hour"),
        ("500 cfm", "volume_flow", "500 ft**3/minute"),
        ("100 lb", "mass", "100 lb"),
        ("14.7 psi", "pressure", "14.7 psi"),
        ("0.16 Btu·in/(h·ft²·°F)", "conductivity", "0.16 Btu*inch/(hour*foot**2*delta_degF)"),
    ],
)
def test_cross_check_with_pint(text: str, kind: str, pint_text: str) -> None:
    pint = pytest.importorskip("pint")
    ureg = pint.UnitRegistry()
    si = ureg(pint_text).to_base_units().magnitude
    assert parse_quantity(text, kind) == pytest.approx(si, rel=1e-6)


@pytest.mark.parametrize(
    "text, kind, fragment",
    [
        ("100 mm", "temperature", "is a unit of length, not of temperature"),
        ("3 furlongs", "length", "unknown unit"),
        ("warm", "temperature", "cannot read"),
        ("-500 °C", "temperature", "below absolute zero"),
    ],
)
def test_bad_units_name_the_accepted_spellings(text: str, kind: str, fragment: str) -> None:
    with pytest.raises(UnitError) as info:
        parse_quantity(text, kind)
    assert fragment in str(info.value)
    if "unit" in fragment:
        assert "use one of" in str(info.value)


def test_bare_numbers_follow_the_unit_system() -> None:
    assert parse_quantity(50, "temperature", system="IP") == pytest.approx(10.0)
    assert parse_quantity(50, "temperature", system="SI") == 50.0
    assert parse_quantity(4, "length", default_unit="in") == pytest.approx(0.1016)
    assert math.isclose(to_unit(parse_quantity("3 TR", "power"), "power", "Btu/h"), 36000.0)


# SI Brochure (BIPM, 9th ed., 2019), 3.1: prefix symbols are case-sensitive — m (milli, 10⁻³)
# and M (mega, 10⁶) differ only by case, so a unit written with the wrong case is refused,
# never read as the other one.
@pytest.mark.parametrize(
    "text, kind, meant",
    [("5 mW", "power", "MW"), ("100 MM", "length", "mm"), ("2 mJ", "energy", "MJ"), ("1 mpa", "pressure", "MPa")],
)
def test_si_prefix_case_is_not_guessed(text, kind, meant):
    with pytest.raises(UnitError, match="case-sensitive") as info:
        parse_quantity(text, kind)
    assert repr(meant) in str(info.value)


@pytest.mark.parametrize(
    "text, kind, si",
    [("5 MW", "power", 5e6), ("100 mm", "length", 0.1), ("2 MJ", "energy", 2e6), ("1 MPa", "pressure", 1e6),
     ("1 Mpa", "pressure", 1e6), ("100 millimetres", "length", 0.1), ("5 KW", "power", 5e3)],
)
def test_prefixes_in_their_own_case_are_read(text, kind, si):
    assert parse_quantity(text, kind) == pytest.approx(si)


# A comma in a number is a thousands separator in English-speaking practice and a decimal
# sign in much of Europe (ISO 80000-1, 7.3.2 allows either decimal sign), so "1,000 kg" is
# 1000 kg to one reader and 1 kg to another: refused, with the way to write it.
@pytest.mark.parametrize("text, kind", [("1,000 kg", "mass"), ("12,000 Btu/h", "power"), ("2,5 kW", "power"),
                                        ("-1,5", "temperature"), (",5 m", "length")])
def test_comma_in_a_number_is_refused_with_the_way_to_write_it(text, kind):
    with pytest.raises(UnitError, match="thousands separators") as info:
        parse_quantity(text, kind)
    assert "decimal point" in str(info.value)
