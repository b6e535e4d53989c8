"""Unit round trips: SI → display unit → SI is the identity (hypothesis, fixed seed)."""

from __future__ import annotations

import pytest
from hypothesis import given
from hypothesis import strategies as st

from coldroom.units import KINDS, accepted_units, parse_quantity, to_unit

finite = st.floats(min_value=-1e6, max_value=1e6, allow_nan=False, allow_infinity=False)


@pytest.mark.parametrize("kind", KINDS)
@given(value=finite)
def test_round_trip_every_unit(kind: str, value: float) -> None:
    if kind == "temperature":
        value = max(value, -273.15)
    for unit in accepted_units(kind):
        shown = to_unit(value, kind, unit)
        back = parse_quantity(f"{shown!r} {unit}", kind)
        assert back == pytest.approx(value, rel=1e-12, abs=1e-9)


@given(value=st.floats(min_value=-100, max_value=100, allow_nan=False))
def test_bare_number_equals_number_with_default_unit(value: float) -> None:
    assert parse_quantity(value, "temperature", system="IP") == parse_quantity(f"{value!r} °F", "temperature")
    assert parse_quantity(value, "power", system="IP") == parse_quantity(f"{value!r} Btu/h", "power")
