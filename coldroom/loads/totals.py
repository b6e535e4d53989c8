"""Compressor run time per day by defrost type [trade/mem].

The capacity that removes the daily heat gain in that run time, (1 + SF)·E/t_run, and the
safety factor's default are :func:`coldroom.rules.required_capacity` and
:data:`coldroom.rules.DEFAULT_SAFETY_FACTOR` (ASHRAE Handbook—Refrigeration, chapter
"Refrigerated-Facility Loads", safety factor and operating time) [mem] [ref:ashrae-refrig-loads].
"""

from __future__ import annotations

from types import MappingProxyType
from typing import Mapping

from coldroom.registry import Registry

__all__ = ["RUN_HOURS_BY_DEFROST", "run_hours_for_defrost"]

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
