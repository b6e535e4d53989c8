"""Moist-air properties for infiltration loads (ideal-gas psychrometrics).

All formulas follow ASHRAE Handbook—Fundamentals, chapter "Psychrometrics"
(SI edition, 2009 and later; equation numbers as in that chapter) [pub]
[ref:ashrae-fund-psychro]. The
perfect-gas relations are used (no enhancement factor); the chapter states
their error is below about 0.7 % in the range of air-conditioning and
refrigeration work. CoolProp's ``HAPropsSI`` (a real-gas humid-air model)
serves as the reference in the tests.

Conventions
-----------
* Temperatures in °C (the psychrometric formulas are written in °C), pressures
  in Pa, humidity ratio in kg water per kg dry air, relative humidity as a
  fraction 0..1, enthalpy in J per kg **dry air**.
* Relative humidity is taken with respect to saturation over liquid water at
  and above 0 °C and over ice below 0 °C (the ASHRAE table convention, and the
  one CoolProp uses).
* Two densities are offered and named: :func:`moist_air_density` is kg of moist
  air (dry air + vapour) per m³; :func:`dry_air_density` is kg of dry air per
  m³ of moist air (= 1 / specific volume). Enthalpies are per kg dry air, so a
  volume flow times :func:`dry_air_density` times an enthalpy difference is a
  heat flow.

No I/O, no CoolProp import: plain floats in, floats or a frozen dataclass out.
"""

from __future__ import annotations

import math
from dataclasses import dataclass

from coldroom.constants import STANDARD_ATMOSPHERE_PA, ZERO_CELSIUS_K
from coldroom.errors import CalculationError

__all__ = [
    "MoistAirState",
    "saturation_pressure_water",
    "saturation_pressure_ice",
    "saturation_pressure",
    "humidity_ratio",
    "humidity_ratio_from_vapour_pressure",
    "saturation_humidity_ratio",
    "relative_humidity",
    "humidity_ratio_from_wet_bulb",
    "relative_humidity_from_wet_bulb",
    "enthalpy",
    "specific_volume",
    "dry_air_density",
    "moist_air_density",
    "standard_pressure",
    "moist_air_state",
]

# Ratio of molar masses water/dry air, 18.015268/28.966 (Fundamentals, Psychrometrics eq. 22) [pub].
_MOLAR_MASS_RATIO = 0.621945
# Gas constant of dry air used in eq. 26, kJ/(kg·K) (Fundamentals, Psychrometrics eq. 26) [pub].
_DRY_AIR_GAS_CONSTANT = 287.042  # J/(kg·K)

# Hyland–Wexler saturation pressure over ice, -100..0 °C, ln(p/Pa) with T in K
# (ASHRAE Fundamentals, Psychrometrics eq. 5) [pub; coefficients from memory, verified in
# tests/validation against the Fundamentals Table 3 values and CoolProp].
_ICE = (
    -5.6745359e03,  # C1 / T
    6.3925247e00,  # C2
    -9.6778430e-03,  # C3 T
    6.2215701e-07,  # C4 T^2
    2.0747825e-09,  # C5 T^3
    -9.4840240e-13,  # C6 T^4
    4.1635019e00,  # C7 ln T
)
# Hyland–Wexler saturation pressure over liquid water, 0..200 °C
# (ASHRAE Fundamentals, Psychrometrics eq. 6) [pub; coefficients from memory, verified as above].
_WATER = (
    -5.8002206e03,  # C8 / T
    1.3914993e00,  # C9
    -4.8640239e-02,  # C10 T
    4.1764768e-05,  # C11 T^2
    -1.4452093e-08,  # C12 T^3
    6.5459673e00,  # C13 ln T
)


def _check_finite(name: str, value: float) -> None:
    if not math.isfinite(value):
        raise CalculationError(f"{name} must be a finite number, got {value!r}")


def _check_range(name: str, value: float, low: float, high: float, unit: str) -> None:
    _check_finite(name, value)
    if not (low <= value <= high):
        raise CalculationError(f"{name} {value:g} {unit} is outside the valid range {low:g} to {high:g} {unit}")


def saturation_pressure_ice(temperature: float) -> float:
    """Saturation vapour pressure over ice (Hyland–Wexler).

    ASHRAE Handbook—Fundamentals, chapter "Psychrometrics", eq. 5 [pub].

    Parameters
    ----------
    temperature : float
        Temperature [°C], -100 to 0.01.

    Returns
    -------
    float
        Saturation pressure over ice [Pa].

    Examples
    --------
    >>> round(saturation_pressure_ice(-20.0), 1)   # Fundamentals Table 3: 103.26 Pa
    103.3
    """
    _check_range("temperature", temperature, -100.0, 0.01, "°C")
    t = temperature + ZERO_CELSIUS_K
    c1, c2, c3, c4, c5, c6, c7 = _ICE
    return math.exp(c1 / t + c2 + c3 * t + c4 * t**2 + c5 * t**3 + c6 * t**4 + c7 * math.log(t))


def saturation_pressure_water(temperature: float) -> float:
    """Saturation vapour pressure over liquid water (Hyland–Wexler).

    ASHRAE Handbook—Fundamentals, chapter "Psychrometrics", eq. 6 [pub]. The
    equation is stated for 0 to 200 °C; it is accepted down to -50 °C here for
    supercooled water (an extrapolation, used only if a caller asks for it).

    Parameters
    ----------
    temperature : float
        Temperature [°C], -50 to 200.

    Returns
    -------
    float
        Saturation pressure over water [Pa].

    Examples
    --------
    >>> round(saturation_pressure_water(20.0))   # Fundamentals Table 3: 2339.3 Pa
    2339
    """
    _check_range("temperature", temperature, -50.0, 200.0, "°C")
    t = temperature + ZERO_CELSIUS_K
    c8, c9, c10, c11, c12, c13 = _WATER
    return math.exp(c8 / t + c9 + c10 * t + c11 * t**2 + c12 * t**3 + c13 * math.log(t))


def saturation_pressure(temperature: float) -> float:
    """Saturation vapour pressure: over ice below 0 °C, over water at and above.

    Parameters
    ----------
    temperature : float
        Temperature [°C], -100 to 200.

    Returns
    -------
    float
        Saturation pressure [Pa].

    Examples
    --------
    >>> saturation_pressure(-10.0) < saturation_pressure_water(-10.0)
    True
    """
    _check_range("temperature", temperature, -100.0, 200.0, "°C")
    if temperature < 0.0:
        return saturation_pressure_ice(temperature)
    return saturation_pressure_water(temperature)


def humidity_ratio_from_vapour_pressure(vapour_pressure: float, pressure: float = STANDARD_ATMOSPHERE_PA) -> float:
    """Humidity ratio from the partial pressure of water vapour.

    W = 0.621945 p_w / (p − p_w), ASHRAE Fundamentals, Psychrometrics eq. 22 [pub].

    Parameters
    ----------
    vapour_pressure : float
        Partial pressure of water vapour [Pa].
    pressure : float
        Total (barometric) pressure [Pa].

    Returns
    -------
    float
        Humidity ratio [kg water / kg dry air].
    """
    _check_finite("vapour pressure", vapour_pressure)
    _check_range("pressure", pressure, 10_000.0, 200_000.0, "Pa")
    if vapour_pressure < 0.0 or vapour_pressure >= pressure:
        raise CalculationError(
            f"vapour pressure {vapour_pressure:g} Pa must lie between 0 and the total pressure {pressure:g} Pa"
        )
    return _MOLAR_MASS_RATIO * vapour_pressure / (pressure - vapour_pressure)


def saturation_humidity_ratio(temperature: float, pressure: float = STANDARD_ATMOSPHERE_PA) -> float:
    """Humidity ratio at saturation (over ice below 0 °C).

    ASHRAE Fundamentals, Psychrometrics eq. 23 [pub].

    Parameters
    ----------
    temperature : float
        Temperature [°C].
    pressure : float
        Total pressure [Pa].

    Returns
    -------
    float
        Saturation humidity ratio [kg/kg dry air].

    Examples
    --------
    >>> round(saturation_humidity_ratio(20.0), 5)   # Table 2 (real gas, with enhancement factor): 0.014758
    0.0147
    """
    return humidity_ratio_from_vapour_pressure(saturation_pressure(temperature), pressure)


def humidity_ratio(temperature: float, relative_humidity: float, pressure: float = STANDARD_ATMOSPHERE_PA) -> float:
    """Humidity ratio from dry-bulb temperature and relative humidity.

    p_w = φ·p_ws(t) (Fundamentals, Psychrometrics eq. 24), then eq. 22 [pub].

    Parameters
    ----------
    temperature : float
        Dry-bulb temperature [°C].
    relative_humidity : float
        Relative humidity [-], 0..1 (over ice below 0 °C).
    pressure : float
        Total pressure [Pa].

    Returns
    -------
    float
        Humidity ratio [kg water / kg dry air].

    Examples
    --------
    >>> round(humidity_ratio(25.0, 0.5), 5)
    0.00988
    """
    _check_range("relative humidity", relative_humidity, 0.0, 1.0, "(fraction)")
    return humidity_ratio_from_vapour_pressure(relative_humidity * saturation_pressure(temperature), pressure)


def relative_humidity(temperature: float, humidity_ratio_value: float, pressure: float = STANDARD_ATMOSPHERE_PA) -> float:
    """Relative humidity from dry-bulb temperature and humidity ratio.

    Inverse of eq. 22: p_w = p·W/(0.621945 + W), φ = p_w/p_ws (Fundamentals,
    Psychrometrics eqs. 22, 24) [pub].

    Parameters
    ----------
    temperature : float
        Dry-bulb temperature [°C].
    humidity_ratio_value : float
        Humidity ratio [kg/kg dry air], >= 0.
    pressure : float
        Total pressure [Pa].

    Returns
    -------
    float
        Relative humidity [-] (may exceed 1 for a supersaturated input; the
        caller decides).

    Examples
    --------
    >>> round(relative_humidity(25.0, humidity_ratio(25.0, 0.4)), 6)
    0.4
    """
    _check_finite("humidity ratio", humidity_ratio_value)
    if humidity_ratio_value < 0.0:
        raise CalculationError(f"humidity ratio {humidity_ratio_value:g} kg/kg must not be negative")
    _check_range("pressure", pressure, 10_000.0, 200_000.0, "Pa")
    vapour_pressure = pressure * humidity_ratio_value / (_MOLAR_MASS_RATIO + humidity_ratio_value)
    return vapour_pressure / saturation_pressure(temperature)


def humidity_ratio_from_wet_bulb(
    dry_bulb_temperature: float, wet_bulb_temperature: float, pressure: float = STANDARD_ATMOSPHERE_PA
) -> float:
    """Humidity ratio from dry-bulb and thermodynamic wet-bulb temperatures.

    Psychrometric equation, ASHRAE Fundamentals, Psychrometrics [pub]:

    * wet bulb at or above 0 °C (eq. 33):
      W = ((2501 − 2.326 t*)·W*s − 1.006 (t − t*)) / (2501 + 1.86 t − 4.186 t*)
    * wet bulb below 0 °C, ice bulb (eq. 35):
      W = ((2830 − 0.24 t*)·W*s − 1.006 (t − t*)) / (2830 + 1.86 t − 2.1 t*)

    with W*s the saturation humidity ratio at t* (over ice below 0 °C).

    Parameters
    ----------
    dry_bulb_temperature : float
        Dry-bulb temperature [°C].
    wet_bulb_temperature : float
        Thermodynamic wet-bulb temperature [°C], not above the dry bulb.
    pressure : float
        Total pressure [Pa].

    Returns
    -------
    float
        Humidity ratio [kg/kg dry air].

    Raises
    ------
    CalculationError
        If the wet bulb exceeds the dry bulb, or the pair gives W < 0 (air
        drier than dry air: inconsistent readings).

    Examples
    --------
    >>> round(humidity_ratio_from_wet_bulb(30.0, 30.0), 5) == round(saturation_humidity_ratio(30.0), 5)
    True
    """
    t = dry_bulb_temperature
    tw = wet_bulb_temperature
    _check_finite("dry-bulb temperature", t)
    _check_finite("wet-bulb temperature", tw)
    if tw > t + 1e-9:
        raise CalculationError(f"wet-bulb temperature {tw:g} °C must not exceed the dry-bulb temperature {t:g} °C")
    ws = saturation_humidity_ratio(tw, pressure)
    if tw >= 0.0:
        w = ((2501.0 - 2.326 * tw) * ws - 1.006 * (t - tw)) / (2501.0 + 1.86 * t - 4.186 * tw)
    else:
        w = ((2830.0 - 0.24 * tw) * ws - 1.006 * (t - tw)) / (2830.0 + 1.86 * t - 2.1 * tw)
    if w < 0.0:
        raise CalculationError(
            f"dry bulb {t:g} °C with wet bulb {tw:g} °C gives a negative humidity ratio; the readings are inconsistent"
        )
    return w


def relative_humidity_from_wet_bulb(
    dry_bulb_temperature: float, wet_bulb_temperature: float, pressure: float = STANDARD_ATMOSPHERE_PA
) -> float:
    """Relative humidity from dry-bulb and thermodynamic wet-bulb temperatures.

    :func:`humidity_ratio_from_wet_bulb` then :func:`relative_humidity` [pub].

    Parameters
    ----------
    dry_bulb_temperature : float
        Dry-bulb temperature [°C].
    wet_bulb_temperature : float
        Thermodynamic wet-bulb temperature [°C].
    pressure : float
        Total pressure [Pa].

    Returns
    -------
    float
        Relative humidity [-], 0..1.

    Examples
    --------
    >>> round(relative_humidity_from_wet_bulb(25.0, 25.0), 6)
    1.0
    """
    w = humidity_ratio_from_wet_bulb(dry_bulb_temperature, wet_bulb_temperature, pressure)
    return relative_humidity(dry_bulb_temperature, w, pressure)


def enthalpy(temperature: float, humidity_ratio_value: float) -> float:
    """Specific enthalpy of moist air per kg of dry air.

    h = 1.006 t + W (2501 + 1.86 t) kJ/kg, ASHRAE Fundamentals, Psychrometrics
    eq. 32 [pub]; zero for dry air at 0 °C and liquid water at 0 °C. Returned
    in J/kg.

    Parameters
    ----------
    temperature : float
        Dry-bulb temperature [°C].
    humidity_ratio_value : float
        Humidity ratio [kg/kg dry air].

    Returns
    -------
    float
        Enthalpy [J/kg dry air].

    Examples
    --------
    >>> round(enthalpy(25.0, humidity_ratio(25.0, 0.5)))   # CoolProp docs: 50 423 (real gas)
    50322
    """
    _check_finite("temperature", temperature)
    _check_finite("humidity ratio", humidity_ratio_value)
    return 1000.0 * (1.006 * temperature + humidity_ratio_value * (2501.0 + 1.86 * temperature))


def specific_volume(temperature: float, humidity_ratio_value: float, pressure: float = STANDARD_ATMOSPHERE_PA) -> float:
    """Specific volume of moist air per kg of dry air.

    v = 0.287042 (t + 273.15)(1 + 1.607858 W)/p  [m³/kg dry air; p in kPa],
    ASHRAE Fundamentals, Psychrometrics eq. 26 [pub].

    Parameters
    ----------
    temperature : float
        Dry-bulb temperature [°C].
    humidity_ratio_value : float
        Humidity ratio [kg/kg dry air].
    pressure : float
        Total pressure [Pa].

    Returns
    -------
    float
        Specific volume [m³ per kg dry air].

    Examples
    --------
    >>> round(specific_volume(20.0, 0.0), 3)
    0.83
    """
    _check_range("temperature", temperature, -100.0, 200.0, "°C")
    _check_range("pressure", pressure, 10_000.0, 200_000.0, "Pa")
    _check_finite("humidity ratio", humidity_ratio_value)
    return _DRY_AIR_GAS_CONSTANT * (temperature + ZERO_CELSIUS_K) * (1.0 + 1.607858 * humidity_ratio_value) / pressure


def dry_air_density(temperature: float, humidity_ratio_value: float, pressure: float = STANDARD_ATMOSPHERE_PA) -> float:
    """Mass of dry air per m³ of moist air, 1/v (Fundamentals, Psychrometrics eq. 26) [pub].

    Parameters
    ----------
    temperature : float
        Dry-bulb temperature [°C].
    humidity_ratio_value : float
        Humidity ratio [kg/kg dry air].
    pressure : float
        Total pressure [Pa].

    Returns
    -------
    float
        Dry-air density [kg dry air / m³ moist air].

    Examples
    --------
    >>> round(dry_air_density(0.0, 0.0), 4)
    1.2923
    """
    return 1.0 / specific_volume(temperature, humidity_ratio_value, pressure)


def moist_air_density(temperature: float, humidity_ratio_value: float, pressure: float = STANDARD_ATMOSPHERE_PA) -> float:
    """Mass of moist air (dry air + vapour) per m³, ρ = (1 + W)/v
    (Fundamentals, Psychrometrics eqs. 26 and 11) [pub].

    Parameters
    ----------
    temperature : float
        Dry-bulb temperature [°C].
    humidity_ratio_value : float
        Humidity ratio [kg/kg dry air].
    pressure : float
        Total pressure [Pa].

    Returns
    -------
    float
        Moist-air density [kg moist air / m³].

    Examples
    --------
    >>> moist_air_density(25.0, 0.01) < dry_air_density(25.0, 0.0)
    True
    """
    return (1.0 + humidity_ratio_value) / specific_volume(temperature, humidity_ratio_value, pressure)


def standard_pressure(altitude: float) -> float:
    """Barometric pressure of the standard atmosphere at an altitude.

    p = 101.325 (1 − 2.25577e−5 Z)^5.2559 kPa, ASHRAE Fundamentals,
    Psychrometrics eq. 3 [pub]. Valid in the troposphere (-500..11 000 m); the
    range accepted here is -500..6000 m.

    Parameters
    ----------
    altitude : float
        Altitude above sea level [m].

    Returns
    -------
    float
        Pressure [Pa].

    Examples
    --------
    >>> round(standard_pressure(1000.0))   # Fundamentals Table 1: 89.875 kPa
    89875
    """
    _check_range("altitude", altitude, -500.0, 6000.0, "m")
    return STANDARD_ATMOSPHERE_PA * (1.0 - 2.25577e-5 * altitude) ** 5.2559


@dataclass(frozen=True)
class MoistAirState:
    """A moist-air state (all at the same total pressure).

    Attributes
    ----------
    temperature : float
        Dry-bulb temperature [°C].
    relative_humidity : float
        Relative humidity [-] (over ice below 0 °C).
    pressure : float
        Total pressure [Pa].
    humidity_ratio : float
        [kg water / kg dry air].
    enthalpy : float
        [J / kg dry air].
    specific_volume : float
        [m³ / kg dry air].
    dry_air_density : float
        [kg dry air / m³], = 1/specific_volume.
    moist_air_density : float
        [kg moist air / m³], = (1 + W)/specific_volume.
    """

    temperature: float
    relative_humidity: float
    pressure: float
    humidity_ratio: float
    enthalpy: float
    specific_volume: float
    dry_air_density: float
    moist_air_density: float


def moist_air_state(temperature: float, relative_humidity: float, pressure: float = STANDARD_ATMOSPHERE_PA) -> MoistAirState:
    """All properties of moist air from dry bulb, relative humidity and pressure.

    Parameters
    ----------
    temperature : float
        Dry-bulb temperature [°C].
    relative_humidity : float
        Relative humidity [-], 0..1 (over ice below 0 °C).
    pressure : float
        Total pressure [Pa] (see :func:`standard_pressure` for a site altitude).

    Returns
    -------
    MoistAirState

    Examples
    --------
    >>> s = moist_air_state(-25.0, 0.9)
    >>> round(s.enthalpy / 1000, 1), round(s.moist_air_density, 3)
    (-24.3, 1.422)
    """
    w = humidity_ratio(temperature, relative_humidity, pressure)
    v = specific_volume(temperature, w, pressure)
    return MoistAirState(
        temperature=temperature,
        relative_humidity=relative_humidity,
        pressure=pressure,
        humidity_ratio=w,
        enthalpy=enthalpy(temperature, w),
        specific_volume=v,
        dry_air_density=1.0 / v,
        moist_air_density=(1.0 + w) / v,
    )
