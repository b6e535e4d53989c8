"""Charge-limit rules against their formulas, numbers written out.

EN 378-1:2016 Annex C / ISO 5149-1:2014 (from memory; verify against the
current edition): for a flammable refrigerant m1 = 4 m³ × LFL, m2 = 26 m³ × LFL,
m3 = 130 m³ × LFL (× 1.5 for class 2L); in the occupied space the limit is
0.2 × LFL × room volume, not below m1 and not above m2 in access category a.
R-290 LFL 0.038 kg/m³ (ISO 817, from memory).
"""

from __future__ import annotations

import pytest

from coldroom.physics import charge
from coldroom.data.refrigerants import lookup


def test_r290_in_a_28_m3_cold_room_written_out():
    # 0.2 × 0.038 kg/m³ × 28 m³ = 0.2128 kg; m1 = 4 × 0.038 = 0.152 kg;
    # m2 = 26 × 0.038 = 0.988 kg; limit = max(0.152, min(0.2128, 0.988)) = 0.2128 kg.
    rules = charge.charge_limits(lookup("R-290"), 0.20, 28.0, occupancy="a", location="I")
    room = rules[0]
    assert "flammability" in room.rule
    assert room.limit == pytest.approx(0.2128, abs=1e-9)
    assert room.verdict == charge.WITHIN
    # 0.5 kg: above 0.2128 kg, below m2 0.988 kg -> measures needed
    assert charge.charge_limits(lookup("R-290"), 0.5, 28.0)[0].verdict == charge.OVER
    # 1.2 kg: above m2 in category a -> not permitted
    assert charge.charge_limits(lookup("R-290"), 1.2, 28.0)[0].verdict == charge.NOT_PERMITTED
    # category c caps at m3 = 130 × 0.038 = 4.94 kg instead
    assert charge.charge_limits(lookup("R-290"), 1.2, 28.0, occupancy="c")[0].verdict == charge.OVER


def test_small_room_floor_is_m1():
    # 5 m³: 0.2 × 0.038 × 5 = 0.038 kg < m1 = 0.152 kg -> limit m1.
    room = charge.charge_limits(lookup("R-290"), 0.1, 5.0)[0]
    assert room.limit == pytest.approx(0.152)
    assert room.verdict == charge.WITHIN


def test_a2l_masses_take_the_factor_1_5():
    # R-1234yf LFL 0.289 kg/m³: m1 = 1.5 × 4 × 0.289 = 1.734 kg.
    m1, m2, m3 = charge.flammability_masses(lookup("R-1234yf"))
    assert (m1, m2, m3) == pytest.approx((1.734, 11.271, 56.355))


def test_iec_60335_2_89_r290_per_circuit():
    # 13 × 0.038 kg/m³ = 0.494 kg per circuit (IEC 60335-2-89:2019, from memory).
    rules = charge.charge_limits(lookup("R-290"), 0.45, 28.0, self_contained=True)
    iec = [r for r in rules if r.rule.startswith("IEC")][0]
    assert iec.limit == pytest.approx(0.494)
    assert iec.verdict == charge.WITHIN


def test_a1_toxicity_practical_limit():
    # R-134a practical limit 0.25 kg/m³ (EN 378-1 Annex E, from memory):
    # 0.25 × 28 m³ = 7.0 kg.
    rules = charge.charge_limits(lookup("R-134a"), 8.0, 28.0)
    assert len(rules) == 1
    assert rules[0].limit == pytest.approx(7.0)
    assert rules[0].verdict == charge.OVER


def test_ammonia_in_general_occupancy_not_permitted_above_practical_limit():
    # 0.00035 kg/m³ × 28 m³ = 0.0098 kg.
    tox = charge.charge_limits(lookup("R-717"), 1.0, 28.0)[0]
    assert tox.limit == pytest.approx(0.0098)
    assert tox.verdict == charge.NOT_PERMITTED


def test_every_rule_says_verify():
    for name in ("R-290", "R-134a", "R-454C", "R-717"):
        for rule in charge.charge_limits(lookup(name), 1.0, 30.0, self_contained=True):
            assert "verify against the current edition" in rule.working
            assert rule.verdict in (charge.WITHIN, charge.OVER, charge.NOT_PERMITTED)


def test_line_part_volume_times_density():
    # 10 m of 12 x 1.0 mm tube (10 mm bore): π/4 × 0.01² × 10 = 0.785 L;
    # × 1000 kg/m³ = 0.785 kg.
    part = charge.line_part("liquid line", 3.14159265e-4 / 4 * 1.0, 10.0, 1000.0, "liquid")
    assert part.mass == pytest.approx(0.785398, rel=1e-6)
