"""The high side of a transcritical R-744 cycle: the optimum gas-cooler pressure.

:func:`liao_optimum_pressure` is the published correlation, reported beside the
cycle; :func:`golden_max` is the search :func:`coldroom.physics.cycle.solve_cycle`
uses to find the pressure of highest COP for the actual inputs.
"""

from __future__ import annotations

import math


def liao_optimum_pressure(evaporating_temperature: float, gas_cooler_outlet_temperature: float) -> float:
    """Optimum high-side pressure of a transcritical R-744 cycle [Pa].

    p_opt = (2.778 − 0.0157·t_e)·t_gc + (0.381·t_e − 9.34)  [bar, t in °C]
    Liao, Zhao & Jakobsen, Applied Thermal Engineering 20 (2000) 831–841 [ref:liao-2000]
    [mem; verify]. Fitted for t_gc ≈ 30–50 °C, t_e ≈ −10…+20 °C.

    Parameters
    ----------
    evaporating_temperature : float
        [°C]
    gas_cooler_outlet_temperature : float
        [°C]

    Examples
    --------
    >>> round(liao_optimum_pressure(-10.0, 35.0) / 1e5, 1)
    89.6
    """
    te, tgc = evaporating_temperature, gas_cooler_outlet_temperature
    return ((2.778 - 0.0157 * te) * tgc + (0.381 * te - 9.34)) * 1e5


def golden_max(func, low: float, high: float, tolerance: float = 500.0) -> float:
    """Maximise a unimodal *func* on [low, high] by golden-section search
    (Kiefer 1953; any numerical-methods text) to *tolerance* [Pa]."""
    ratio = (math.sqrt(5.0) - 1.0) / 2.0
    a, b = low, high
    c, d = b - ratio * (b - a), a + ratio * (b - a)
    fc, fd = func(c), func(d)
    while b - a > tolerance:
        if fc >= fd:
            b, d, fd = d, c, fc
            c = b - ratio * (b - a)
            fc = func(c)
        else:
            a, c, fc = c, d, fd
            d = a + ratio * (b - a)
            fd = func(d)
    return 0.5 * (a + b)
