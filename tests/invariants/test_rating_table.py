"""A condensing unit's rating table (SST × ambient): grid points exact, monotone between them.

Invariants, not published values (hypothesis with the derandomized profile, tests/conftest.py):
bilinear interpolation returns each grid point's own value exactly, and between grid points it
lies within the values of the cell's corners and keeps the table's monotonic direction
(capacity rising with SST, falling with ambient). An invented table, no maker's data.
"""

from __future__ import annotations

import pytest
from hypothesis import given, settings
from hypothesis import strategies as st

from coldroom.equipment.compressors import OperatingConditions
from coldroom.equipment.rating_table import RatingTableUnit, bilinear

SST = (-35.0, -25.0, -15.0, -5.0, 5.0)
AMBIENT = (20.0, 27.0, 32.0, 38.0, 43.0)
# An invented unit: capacity rising about 4 %/K of SST, falling about 1.2 %/K of ambient.
CAPACITY = tuple(tuple(round(3000.0 * (1.04 ** s) * (1.0 - 0.012 * (a - 32.0)), 1) for s in SST) for a in AMBIENT)
POWER = tuple(tuple(round(1500.0 * (1.0 + 0.01 * s) * (1.0 + 0.02 * (a - 32.0)), 1) for s in SST) for a in AMBIENT)


def unit(**operating: float) -> RatingTableUnit:
    return RatingTableUnit(
        refrigerant="R448A",
        evaporating_temperatures=SST,
        ambient_temperatures=AMBIENT,
        capacity=CAPACITY,
        power=POWER,
        condenser_td=10.0,
        operating=OperatingConditions(**operating) if operating else OperatingConditions(10.0, 0.0, 0.0),
        rating_superheat=10.0,
        rating_subcooling=0.0,
    )


def test_grid_points_exact() -> None:
    table = unit()
    for j, a in enumerate(AMBIENT):
        for i, s in enumerate(SST):
            assert table.table_values(s, a) == (CAPACITY[j][i], POWER[j][i])


def test_grid_points_exact_through_performance_at_rating_conditions() -> None:
    """At the table's own superheat and subcooling the refrigerating-effect ratio is 1."""
    table = unit(superheat=10.0, suction_line_superheat=0.0, subcooling=0.0)
    point = table.performance(-15.0, 32.0 + 10.0)
    assert point.capacity == pytest.approx(CAPACITY[2][2], rel=1e-12)
    assert point.power == POWER[2][2]


@settings(max_examples=200)
@given(st.floats(SST[0], SST[-1]), st.floats(SST[0], SST[-1]), st.floats(AMBIENT[0], AMBIENT[-1]))
def test_monotone_in_sst(s1: float, s2: float, a: float) -> None:
    low, high = sorted((s1, s2))
    assert bilinear(SST, AMBIENT, CAPACITY, low, a) <= bilinear(SST, AMBIENT, CAPACITY, high, a) + 1e-9


@settings(max_examples=200)
@given(st.floats(SST[0], SST[-1]), st.floats(AMBIENT[0], AMBIENT[-1]), st.floats(AMBIENT[0], AMBIENT[-1]))
def test_monotone_in_ambient(s: float, a1: float, a2: float) -> None:
    low, high = sorted((a1, a2))
    assert bilinear(SST, AMBIENT, CAPACITY, s, low) >= bilinear(SST, AMBIENT, CAPACITY, s, high) - 1e-9
    assert bilinear(SST, AMBIENT, POWER, s, low) <= bilinear(SST, AMBIENT, POWER, s, high) + 1e-9


@settings(max_examples=200)
@given(st.floats(SST[0], SST[-1]), st.floats(AMBIENT[0], AMBIENT[-1]))
def test_between_the_cell_corners(s: float, a: float) -> None:
    i = max(k for k in range(len(SST) - 1) if SST[k] <= s)
    j = max(k for k in range(len(AMBIENT) - 1) if AMBIENT[k] <= a)
    corners = [CAPACITY[j][i], CAPACITY[j][i + 1], CAPACITY[j + 1][i], CAPACITY[j + 1][i + 1]]
    value = bilinear(SST, AMBIENT, CAPACITY, s, a)
    assert min(corners) - 1e-9 <= value <= max(corners) + 1e-9


def test_outside_the_grid_flagged() -> None:
    table = unit()
    inside = table.performance(-15.0, 42.0, check_envelope=False, discharge=False)
    assert table.flags(inside) == []
    outside = table.performance(-38.0, 42.0, check_envelope=False, discharge=False)
    assert not outside.within_envelope and table.flags(outside)
    edge = table.performance(-35.5, 42.0, check_envelope=False, discharge=False)  # within 1 K: extrapolated
    assert edge.within_envelope and "extrapolated" in str(table.flags(edge)[0])
