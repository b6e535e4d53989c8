"""One thermodynamic state of a refrigerant (:class:`StatePoint`); no CoolProp here."""

from __future__ import annotations

import math
from dataclasses import dataclass


@dataclass(frozen=True)
class StatePoint:
    """One thermodynamic state of a refrigerant.

    Attributes
    ----------
    p : float
        Pressure, absolute [Pa].
    t : float
        Temperature [°C].
    h : float
        Specific enthalpy [J/kg] (CoolProp default reference state).
    s : float
        Specific entropy [J/(kg·K)] (CoolProp default reference state).
    quality : float or None
        Vapour mass fraction [1] in the two-phase region, 0 for saturated
        liquid, 1 for saturated vapour, ``None`` outside the two-phase region.
    density : float
        Density [kg/m³].
    """

    p: float
    t: float
    h: float
    s: float
    quality: float | None
    density: float

    def to_json(self) -> dict:
        """The state as a JSON-ready dict with unit-named keys."""
        return {
            "p_pa": self.p,
            "t_c": self.t,
            "h_j_kg": self.h,
            "s_j_kg_k": self.s,
            "quality": self.quality,
            "density_kg_m3": self.density,
        }


def _finite(*values: float) -> bool:
    return all(math.isfinite(v) for v in values)

