"""The balance-point search decides for any ratings validation accepts (fuzzed), and agrees with physics.

Invariants, not published values: at a balance both equations hold (compressor capacity =
unit-cooler capacity K_e·(t_room − S), heat rejection = condenser capacity K_c·(D − t_amb));
a larger unit cooler can only raise the capacity at balance (the suction rises); the search
is bracketed by the coil and condenser limits, so it ends within a bounded number of
compressor evaluations or says which component leaves no balance; the verdict of a check
agrees with its own highest-ambient statement. Hypothesis with the derandomized profile
(tests/conftest.py).

Most examples use a cheap analytic compressor (capacity rising with suction, falling with
condensing, and a range where it cannot run), so the fuzz covers many ratings quickly; a
few use the R-448A rated-point model of the demo's unit.
"""

from __future__ import annotations

import math

import pytest
from hypothesis import given, settings
from hypothesis import strategies as st

from coldroom import equipment as E
from coldroom.errors import CalculationError, PropertyRangeError

ROOM, AMBIENT = -18.0, 32.0
EVALUATION_LIMIT = 400  # compressor evaluations for one balance, however absurd the ratings

RATING = st.floats(10.0, 1e6)  # W, the range validation accepts for both ratings
COIL_TD = st.floats(1e-9, 30.0)  # K, validation: > 0 … 30 K
CONDENSER_TD = st.floats(1e-9, 40.0)  # K, validation: > 0 … 40 K


def analytic(s: float, d: float) -> tuple[float, float]:
    """An invented compressor: 4.5 kW at −10/45 °C, about 3.5 %/K on suction and −1 %/K on
    condensing; cannot run below −60 °C suction or above 75 °C condensing."""
    if s < -60.0 or d > 75.0:
        raise PropertyRangeError(f"outside the model at S {s} / D {d}")
    q = 4500.0 * math.exp(0.035 * (s + 10.0)) * (1.0 - 0.01 * (d - 45.0))
    p = 2200.0 * (1.0 + 0.02 * (d - s - 55.0))
    return q, q + p


@pytest.fixture(scope="module")
def r448a():  # type: ignore[no-untyped-def]
    pytest.importorskip("CoolProp")
    operating = E.OperatingConditions(superheat=5.0, suction_line_superheat=5.0, subcooling=2.0)
    unit = E.RatedPointCompressor.from_rating(
        "R-448A", 4500.0, -10.0, 45.0, superheat=10.0, subcooling=0.0, power=2200.0, operating=operating
    )

    def function(s: float, d: float) -> tuple[float, float]:
        p = unit.performance(s, d, check_envelope=False, discharge=False)
        return p.capacity, p.heat_rejection

    return unit, function


def _balance(function, coil: E.HeatExchanger, condenser: E.HeatExchanger):  # type: ignore[no-untyped-def]
    """(balance point or None, compressor evaluations used)."""
    calls = [0]

    def counted(s: float, d: float) -> tuple[float, float]:
        calls[0] += 1
        return function(s, d)

    try:
        return E.balance_point(counted, coil, condenser, ROOM, AMBIENT), calls[0]
    except CalculationError as error:
        assert "no balance point" in str(error)
        return None, calls[0]


def _assert_balanced(bp: E.BalancePoint) -> None:
    assert ROOM - 50.0 <= bp.suction_dew < ROOM and AMBIENT < bp.discharge_dew <= AMBIENT + 50.0
    # both equations to 10 tolerances (the acceptance), and an unlimited coil or condenser
    # reports its capacity equal to the compressor's
    assert bp.compressor_capacity == pytest.approx(bp.evaporator_capacity, rel=1e-5, abs=1e-3)
    assert bp.compressor_heat_rejection == pytest.approx(bp.condenser_heat_rejection, rel=1e-5, abs=1e-3)


def _pair(coil: float, coil_td: float, condenser: float, condenser_td: float) -> tuple[E.HeatExchanger, E.HeatExchanger]:
    return (E.HeatExchanger.from_rating(coil, coil_td, "unit cooler"),
            E.HeatExchanger.from_rating(condenser, condenser_td, "condenser"))


@settings(max_examples=150)
@given(coil=RATING, coil_td=COIL_TD, condenser=RATING, condenser_td=CONDENSER_TD)
def test_analytic_balance_is_found_or_refused_within_a_bounded_search(coil, coil_td, condenser, condenser_td) -> None:  # type: ignore[no-untyped-def]
    bp, calls = _balance(analytic, *_pair(coil, coil_td, condenser, condenser_td))
    assert calls <= EVALUATION_LIMIT
    if bp is not None:
        _assert_balanced(bp)


@settings(max_examples=100)
@given(coil=RATING, coil_td=COIL_TD, condenser=RATING, condenser_td=CONDENSER_TD, factor=st.floats(1.0, 1e5))
def test_a_larger_coil_never_lowers_the_balance_capacity(coil, coil_td, condenser, condenser_td, factor) -> None:  # type: ignore[no-untyped-def]
    small, cond = _pair(coil, coil_td, condenser, condenser_td)
    large = E.HeatExchanger.from_rating(min(coil * factor, 1e6), coil_td, "unit cooler")
    a, _ = _balance(analytic, small, cond)
    b, _ = _balance(analytic, large, cond)
    if a is not None:
        assert b is not None, "a larger coil lost the balance"
        assert b.compressor_capacity >= a.compressor_capacity * (1.0 - 1e-5)
        assert b.suction_dew >= a.suction_dew - 1e-4


@settings(max_examples=6)
@given(coil=RATING, coil_td=COIL_TD, condenser=RATING, condenser_td=CONDENSER_TD)
def test_r448a_balance_is_found_or_refused_within_a_bounded_search(r448a, coil, coil_td, condenser, condenser_td) -> None:  # type: ignore[no-untyped-def]
    _, function = r448a
    bp, calls = _balance(function, *_pair(coil, coil_td, condenser, condenser_td))
    assert calls <= EVALUATION_LIMIT
    if bp is not None:
        _assert_balanced(bp)


def test_r448a_a_larger_coil_or_condenser_never_lowers_the_capacity(r448a) -> None:  # type: ignore[no-untyped-def]
    """4 kW at 8 K up to a 1 MW unit cooler, 7.5 kW at 15 K down to 0.0001 K: capacity only rises."""
    _, function = r448a
    coil, cond = _pair(4000.0, 8.0, 7500.0, 15.0)
    coils = [_balance(function, E.HeatExchanger.from_rating(q, 8.0), cond)[0] for q in (4e3, 1e5, 1e6)]
    conds = [_balance(function, coil, E.HeatExchanger.from_rating(7500.0, td))[0] for td in (15.0, 0.1, 1e-4)]
    for series in (coils, conds):
        assert all(b is not None for b in series)
        capacities = [b.compressor_capacity for b in series]  # type: ignore[union-attr]
        assert all(y >= x * (1 - 1e-6) for x, y in zip(capacities, capacities[1:])), capacities
    assert coils[-1].suction_dew > ROOM - 0.1  # type: ignore[union-attr]  # a 1 MW coil: just below the room air
    assert conds[-1].discharge_dew < AMBIENT + 0.01  # type: ignore[union-attr]


@pytest.mark.parametrize(
    "function, expected",
    [
        (lambda s, d: (0.0, 0.0), 0.0),  # a zero polynomial: balance at the air temperatures, no capacity
        (lambda s, d: (math.inf, math.inf), None),  # an overflowing one: no balance
        (lambda s, d: (1e308, 1e308), None),  # far beyond any condenser: no balance
    ],
    ids=["zero", "infinite", "huge"],
)
def test_degenerate_compressors_are_decided_quickly(function, expected) -> None:  # type: ignore[no-untyped-def]
    bp, calls = _balance(function, *_pair(4000.0, 8.0, 7500.0, 15.0))
    assert calls <= EVALUATION_LIMIT
    if expected is None:
        assert bp is None
    else:
        assert bp is not None and bp.compressor_capacity == expected
        assert bp.evaporator_capacity == 0.0 and bp.condenser_heat_rejection == 0.0


@settings(max_examples=3)
@given(coil=RATING, coil_td=COIL_TD, condenser=RATING, condenser_td=CONDENSER_TD)
def test_the_verdict_agrees_with_itself(r448a, coil, coil_td, condenser, condenser_td) -> None:  # type: ignore[no-untyped-def]
    unit, _ = r448a
    result = E.check_unit(
        unit, *_pair(coil, coil_td, condenser, condenser_td),
        room_temperature=ROOM, ambient_temperature=AMBIENT, daily_energy=1.5e8, safety_factor=0.1,
        run_time=18 * 3600.0, chart_ambients=(20.0, 40.0),
    )
    if not result.holds:
        # a balance outside the unit's application class is NOT SUITABLE (issue 24), never a hold
        assert any(word in result.verdict for word in ("DOES NOT HOLD", "NOT RATED", "NOT SUITABLE"))
        assert result.max_ambient_status != "holds_above_range"
        assert result.max_ambient is None or result.max_ambient < AMBIENT
    else:
        assert result.verdict.startswith("HOLDS")
        assert result.max_ambient_status in ("found", "holds_above_range")
        assert result.max_ambient is None or result.max_ambient >= AMBIENT
    if result.capacity_at_balance is not None:
        assert result.holds == (result.capacity_at_balance >= result.required_capacity)
