"""Invariants of the TEWI equation and of binning hours."""

from __future__ import annotations

import pytest
from hypothesis import given
from hypothesis import strategies as st

from coldroom.errors import CalculationError
from coldroom.design.tewi import tewi
from coldroom.inputs.weather import bins_from_hours

positive = st.floats(min_value=0.0, max_value=1e4, allow_nan=False)
share = st.floats(min_value=0.0, max_value=1.0)


@given(gwp=positive, charge=positive, rate=share, life=st.floats(0.5, 40.0), recovery=share, energy=positive,
       beta=st.floats(0.0, 1.5))
def test_doubling_the_charge_doubles_the_direct_part(gwp, charge, rate, life, recovery, energy, beta) -> None:
    one = tewi(gwp, charge, rate, life, recovery, energy, beta)
    two = tewi(gwp, 2 * charge, rate, life, recovery, energy, beta)
    assert two.direct_leakage == pytest.approx(2 * one.direct_leakage)
    assert two.direct_end_of_life == pytest.approx(2 * one.direct_end_of_life)
    assert two.indirect == one.indirect
    assert one.total >= one.indirect >= 0.0


def test_full_recovery_leaves_no_end_of_life_part() -> None:
    assert tewi(2000.0, 3.0, 0.1, 10.0, 1.0, 0.0, 0.5).direct_end_of_life == 0.0


def test_bad_inputs_are_refused() -> None:
    with pytest.raises(CalculationError):
        tewi(2000.0, -1.0, 0.1, 10.0, 0.7, 0.0, 0.5)
    with pytest.raises(CalculationError):
        tewi(2000.0, 1.0, 0.1, 10.0, 1.7, 0.0, 0.5)


@given(st.lists(st.floats(min_value=-40.0, max_value=50.0, allow_nan=False), min_size=1, max_size=400))
def test_bins_keep_hours_and_mean(values) -> None:
    bins = bins_from_hours(values)
    assert sum(b.hours for b in bins) == len(values)
    assert sum(b.temperature * b.hours for b in bins) == pytest.approx(sum(values), abs=1e-3 * len(values))
    assert [b.temperature for b in bins] == sorted(b.temperature for b in bins)
    assert all(abs(b.temperature - round(b.temperature)) <= 0.5 + 1e-6 for b in bins)
