"""The refrigerant temperature limits used by `coldroom validate` (coldroom.data.refrigerants.LIMITS).

the catalogue keeps plain numbers so that validation never imports CoolProp; here
they are compared with CoolProp 8.0 itself (the reference library, which
implements the NIST REFPROP-grade equations of state): the triple point /
model lower limit (``Ttriple``) and the critical temperature (``Tcrit``; for the
predefined ``.mix`` blends, the critical points found by
``AbstractState.all_critical_points``). Tolerance 0.01 K: the table holds
CoolProp's values rounded to 0.01 K. Textbook values for orientation (from
memory): CO₂ triple point −56.6 °C, critical 31.0 °C; ammonia triple point
−77.7 °C, critical 132.3–132.4 °C.
"""

from __future__ import annotations

import pytest

from coldroom.data.refrigerants import LIMITS as REFRIGERANT_LIMITS
from coldroom.data.refrigerants import CATALOGUE

CP = pytest.importorskip("CoolProp.CoolProp")
K = 273.15


def test_every_catalogue_refrigerant_has_limits() -> None:
    assert set(REFRIGERANT_LIMITS) == {info.name for info in CATALOGUE}


#: Blends whose critical points are recomputed here. CoolProp needs 5–30 s for
#: each of the others (R-448A, R-449A …); for those the check uses the critical
#: points stored in coldroom.data.refrigerants.MIXTURE_CRITICAL_POINTS, which are the same
#: CoolProp call's result (one of them recomputed by tests/validation/test_refrigerant.py).
QUICK_CRITICAL_POINTS = {"R452A.mix", "R407A.mix", "R455A.mix"}


@pytest.mark.parametrize("info", CATALOGUE, ids=lambda i: i.name)
def test_limits_match_coolprop(info) -> None:
    lowest, critical = REFRIGERANT_LIMITS[info.name]
    assert CP.PropsSI("Ttriple", info.coolprop_name) - K == pytest.approx(lowest, abs=0.01)
    if info.model == "mixture" and info.coolprop_name not in QUICK_CRITICAL_POINTS:
        from coldroom.data.refrigerants import MIXTURE_CRITICAL_POINTS

        assert critical == pytest.approx(MIXTURE_CRITICAL_POINTS[info.coolprop_name][0] - K, abs=0.01)
    elif info.model == "mixture":
        points = [p.T - K for p in CP.AbstractState("HEOS", info.coolprop_name).all_critical_points() if p.p > 0]
        # the physical root with the highest temperature and a positive pressure (R-452A: CoolProp
        # finds three within 1 K, 74.22, 74.25 and 75.10 °C; the property model uses 75.10)
        assert critical == pytest.approx(max(points), abs=0.01)
    else:
        assert CP.PropsSI("Tcrit", info.coolprop_name) - K == pytest.approx(critical, abs=0.01)


def test_textbook_values_from_memory() -> None:
    """CO₂ and ammonia limits agree with the textbook values (from memory) to 0.2 K."""
    assert REFRIGERANT_LIMITS["R-744"] == pytest.approx((-56.6, 31.0), abs=0.1)
    assert REFRIGERANT_LIMITS["R-717"][0] == pytest.approx(-77.7, abs=0.1)
    assert REFRIGERANT_LIMITS["R-717"][1] == pytest.approx(132.3, abs=0.2)
