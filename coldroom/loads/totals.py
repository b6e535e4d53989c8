"""From daily heat gain to required refrigeration capacity.

Required capacity = (1 + safety factor) · daily energy / (run hours · 3600)
(ASHRAE Handbook—Refrigeration, chapter "Refrigerated-Facility Loads",
safety factor and operating time) [mem] [ref:ashrae-refrig-loads]. Safety factor default 10 % [mem,
ASHRAE]; compressor run time by defrost type [trade/mem].
"""

from __future__ import annotations

import math
from types import MappingProxyType
from typing import Mapping

from coldroom.registry import Registry
from coldroom.errors import CalculationError

__all__ = ["DEFAULT_SAFETY_FACTOR", "RUN_HOURS_BY_DEFROST", "run_hours_for_defrost", "required_capacity"]

DEFAULT_SAFETY_FACTOR = 0.10
"""Safety factor on the calculated load, 10 % [mem, ASHRAE Refrigeration]."""

RUN_HOURS_BY_DEFROST: Mapping[str, float] = MappingProxyType({"off_cycle": 16.0, "electric": 18.0, "hot_gas": 20.0})
"""Compressor run hours per day by defrost type [trade/mem]: off-cycle (coolers above about
+1 °C) 16 h; electric 18 h; hot gas 20 h (18–20 h is usual with electric or hot gas)."""
_DEFROST_NAMES = Registry("defrost type", RUN_HOURS_BY_DEFROST)


def run_hours_for_defrost(defrost_type: str) -> float:
    """Default compressor run hours per day for a defrost type [h].

    Parameters
    ----------
    defrost_type : str
        ``off_cycle``, ``electric`` or ``hot_gas`` (normalised: ``"hot-gas"`` works).

    Returns
    -------
    float
        Run hours per day [h].

    Examples
    --------
    >>> run_hours_for_defrost("Hot gas")
    20.0
    """
    return _DEFROST_NAMES.lookup(defrost_type)


def required_capacity(
    daily_energy: float, run_hours: float, safety_factor: float = DEFAULT_SAFETY_FACTOR
) -> float:
    """Refrigeration capacity needed to remove a daily heat gain in the run time.

    Q = (1 + SF) · E / (run_hours · 3600)  [W] [mem, ASHRAE; see module note].

    Parameters
    ----------
    daily_energy : float
        Total heat gain per day [J], >= 0.
    run_hours : float
        Compressor run hours per day [h], 0 < run_hours <= 24.
    safety_factor : float
        Fractional safety factor [-], 0..1 (0.10 = 10 %).

    Returns
    -------
    float
        Required capacity [W].

    Examples
    --------
    >>> round(required_capacity(86_400_000.0, 16.0), 6)   # 1 kW average, 16 h, +10 %
    1650.0
    """
    e = float(daily_energy)
    h = float(run_hours)
    sf = float(safety_factor)
    for name, value in (("daily energy", e), ("run hours", h), ("safety factor", sf)):
        if not math.isfinite(value):
            raise CalculationError(f"{name} must be a finite number, got {value!r}")
    if e < 0.0:
        raise CalculationError(f"daily energy {e:g} J must not be negative")
    if not (0.0 < h <= 24.0):
        raise CalculationError(f"run hours {h:g} h must lie in (0, 24]")
    if not (0.0 <= sf <= 1.0):
        raise CalculationError(f"safety factor {sf:g} must lie between 0 and 1")
    return (1.0 + sf) * e / (h * 3600.0)
