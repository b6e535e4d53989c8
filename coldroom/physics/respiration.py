"""Heat of respiration of fresh produce: :class:`RespirationData` (coefficients or a table)
and :func:`respiration_heat` [W/kg] at a temperature."""

from __future__ import annotations

import math
from dataclasses import dataclass

from coldroom.errors import CalculationError

#: Heat released per mg of CO₂ produced by respiration [J/mg] (Becker, Misra
#: & Fricke [ref:becker-misra-fricke-1996], as tabulated in ASHRAE "Commodity Storage Requirements" /
#: "Thermal Properties of Foods" [mem]).
RESPIRATION_HEAT_PER_CO2 = 10.7


@dataclass(frozen=True)
class RespirationData:
    """Respiration of fresh produce.

    Either Becker, Misra & Fricke coefficients (CO₂ production
    f·(9t/5 + 32)^g [mg/(kg·h)], t in °C) or a table of heat of respiration
    (temperature [°C], heat [W/kg]) points, or both (the coefficients win).

    Parameters
    ----------
    f : float or None
        Coefficient f [mg/(kg·h)·°F^-g].
    g : float or None
        Exponent g [-].
    table : tuple of (float, float)
        (temperature [°C], heat of respiration [W/kg]) points, ascending.
    source : str
        Source text.
    """

    f: float | None = None
    g: float | None = None
    table: tuple[tuple[float, float], ...] = ()
    source: str = ""

    def __post_init__(self) -> None:
        if (self.f is None) != (self.g is None):
            raise CalculationError("respiration coefficients f and g must be given together")
        if self.f is None and not self.table:
            raise CalculationError("respiration needs coefficients f, g or a table")
        temps = [p[0] for p in self.table]
        if temps != sorted(temps) or len(set(temps)) != len(temps):
            raise CalculationError("respiration table temperatures must be strictly ascending")
        if any(p[1] <= 0 for p in self.table):
            raise CalculationError("respiration table heats must be positive")


def respiration_heat(respiration: RespirationData, temperature: float) -> float:
    """Heat of respiration of fresh produce per unit mass.

    With coefficients: q = 10.7 J/mg × f·(9t/5 + 32)^g mg/(kg·h) / 3600
    (Becker, Misra & Fricke 1996, as tabulated in ASHRAE "Thermal Properties
    of Foods" [mem]). With a table: log-linear interpolation between points,
    log-linear extrapolation from the end segment outside them (common
    practice, no source); a one-point table is constant.

    Parameters
    ----------
    respiration : RespirationData
        Coefficients or table.
    temperature : float
        Produce temperature [°C].

    Returns
    -------
    float
        Heat of respiration [W/kg].

    Examples
    --------
    >>> r = RespirationData(f=3.6683e-4, g=3.0330)   # strawberries [mem]
    >>> round(respiration_heat(r, 0.0) * 1000, 1)
    40.1
    """
    if respiration.f is not None and respiration.g is not None:
        fahrenheit = 9.0 * temperature / 5.0 + 32.0
        if fahrenheit <= 0.0:
            return 0.0
        co2 = respiration.f * fahrenheit**respiration.g  # mg/(kg·h)
        return co2 * RESPIRATION_HEAT_PER_CO2 / 3600.0
    table = respiration.table
    if len(table) == 1:
        return table[0][1]
    if temperature <= table[0][0]:
        (t0, q0), (t1, q1) = table[0], table[1]
    elif temperature >= table[-1][0]:
        (t0, q0), (t1, q1) = table[-2], table[-1]
    else:
        i = next(k for k in range(1, len(table)) if table[k][0] >= temperature)
        (t0, q0), (t1, q1) = table[i - 1], table[i]
    slope = (math.log(q1) - math.log(q0)) / (t1 - t0)
    return math.exp(math.log(q0) + slope * (temperature - t0))
