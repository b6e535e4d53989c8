"""Invariants of the cycle and of the property layer.

Energy balance (first law over the whole cycle), Carnot bound (second law),
monotonicity, proportionality and round trips. Hypothesis runs derandomized
(tests/conftest.py).
"""

from __future__ import annotations

import pytest
from hypothesis import given, settings
from hypothesis import strategies as st

from coldroom.physics.cycle import solve_cycle
from coldroom.data.refrigerants import names
from coldroom.physics.refrigerant import get_fluid

# (evaporating, condensing) per refrigerant: inside each fluid's range
# (R-744 subcritical below its 31 °C critical point).
CONDITIONS = {"R-744": (-40.0, -5.0)}


@pytest.mark.parametrize("name", names())
def test_energy_balance_every_refrigerant(name):
    # First law: Q_evap + P = heat of rejection (no suction-line gain) to 1e-9.
    te, tc = CONDITIONS.get(name, (-10.0, 40.0))
    r = solve_cycle(name, te, tc, 5000.0, suction_line_superheat=0.0)
    assert r.suction_line_heat_gain == 0.0
    assert r.capacity + r.compressor_power == pytest.approx(r.condenser_duty, rel=1e-9)
    # second law: below Carnot
    assert 0.0 < r.cop < r.carnot_cop
    # h4 = h3 exactly; 4 lies in the two-phase region
    assert r.states[3].h == r.states[2].h
    assert 0.0 < r.states[3].quality < 1.0


@pytest.mark.parametrize("name", ["R-134a", "R-448A", "R-744"])
def test_energy_balance_with_suction_line_gain_and_drop(name):
    te, tc = CONDITIONS.get(name, (-10.0, 40.0))
    r = solve_cycle(name, te, tc, 5000.0, suction_line_superheat=10.0, suction_pressure_drop=1.5)
    assert r.suction_line_heat_gain > 0.0
    assert r.capacity + r.suction_line_heat_gain + r.compressor_power == pytest.approx(r.condenser_duty, rel=1e-9)
    assert r.suction_pressure < r.evaporating_pressure
    assert r.states[0].t == pytest.approx(te + 5.0 + 10.0, abs=1e-9)


def test_transcritical_energy_balance():
    r = solve_cycle("R-744", -10.0, None, 5000.0, gas_cooler_outlet_temperature=38.0, suction_line_superheat=0.0)
    assert r.capacity + r.compressor_power == pytest.approx(r.condenser_duty, rel=1e-9)
    assert r.discharge_pressure > get_fluid("R-744").critical_pressure


@settings(max_examples=25)
@given(
    te=st.floats(-45.0, 5.0),
    lift=st.floats(15.0, 55.0),
    eta=st.floats(0.5, 1.0),
    superheat=st.floats(0.0, 15.0),
    subcooling=st.floats(0.0, 10.0),
)
def test_r134a_cycle_invariants(te, lift, eta, superheat, subcooling):
    tc = min(te + lift, 65.0)
    r = solve_cycle("R-134a", te, tc, 4000.0, superheat=superheat, subcooling=subcooling, isentropic_efficiency=eta,
                    suction_line_superheat=0.0)
    assert r.capacity + r.compressor_power == pytest.approx(r.condenser_duty, rel=1e-9)
    assert r.cop < r.carnot_cop
    # discharge above the isentropic discharge (irreversibility raises entropy)
    assert r.states[1].s >= r.states[0].s - 1e-6
    assert r.discharge_temperature >= r.isentropic_discharge.t - 1e-6
    assert 0.0 < r.volumetric_efficiency <= 1.0 + r.clearance
    assert r.displacement >= r.suction_volume_flow * (1 - 1e-12) or r.volumetric_efficiency > 1


def test_cop_falls_as_condensing_rises():
    cops = [solve_cycle("R-448A", -10.0, tc, 5000.0).cop for tc in (25.0, 35.0, 45.0, 55.0)]
    assert all(a > b for a, b in zip(cops, cops[1:]))


def test_volumetric_efficiency_falls_with_pressure_ratio():
    etas = [solve_cycle("R-404A", te, 40.0, 5000.0).volumetric_efficiency for te in (0.0, -15.0, -30.0)]
    assert all(a > b for a, b in zip(etas, etas[1:]))


def test_mass_flow_proportional_to_capacity():
    a = solve_cycle("R-449A", -20.0, 40.0, 3000.0)
    b = solve_cycle("R-449A", -20.0, 40.0, 9000.0)
    assert b.mass_flow == pytest.approx(3.0 * a.mass_flow, rel=1e-12)
    assert b.displacement == pytest.approx(3.0 * a.displacement, rel=1e-12)
    assert b.cop == pytest.approx(a.cop, rel=1e-12)


# ------------------------------------------------- property round trips (fast path)


@pytest.mark.parametrize("name", ["R-448A", "R-407A", "R-452A", "R-513A", "R-454C", "R-455A"])
@pytest.mark.parametrize("te, tc", [(-45.0, 20.0), (-20.0, 45.0), (10.0, 60.0)])
def test_fast_mixture_round_trips(name, te, tc):
    """Fast P–S / P–H states reproduce the P–T state they came from (same EOS),
    over the envelope; superheated, subcooled and two-phase."""
    fluid = get_fluid(name)
    pe, pc = fluid.dew_pressure(te), fluid.dew_pressure(tc)
    for p, t in [(pe, te + 0.2), (pe, te + 25.0), (pc, tc + 40.0), (pc, fluid.bubble_temperature(pc) - 8.0)]:
        ref = fluid.state_pt(p, t)
        by_s = fluid.state_ps(p, ref.s)
        by_h = fluid.state_ph(p, ref.h)
        assert by_s.t == pytest.approx(ref.t, abs=1e-6)
        assert by_h.t == pytest.approx(ref.t, abs=1e-6)
        assert by_h.h == pytest.approx(ref.h, rel=1e-9)
    # two-phase: quality round trip at the evaporating pressure
    mid = fluid.saturated_state(0.3, pressure=pe)
    back = fluid.state_ph(pe, mid.h)
    assert back.quality == pytest.approx(0.3, abs=1e-7)
    assert fluid.bubble_temperature(pe) < back.t < fluid.dew_temperature(pe)


@pytest.mark.parametrize("name", ["R-134a", "R-448A", "R-744"])
def test_saturation_round_trip(name):
    fluid = get_fluid(name)
    for t in (-40.0, -10.0, 20.0):
        p = fluid.dew_pressure(t)
        assert fluid.dew_temperature(p) == pytest.approx(t, abs=1e-6)
        assert fluid.bubble_temperature(p) <= t + 1e-9


def test_saturation_dome_shape():
    for name in ("R-134a", "R-448A"):
        p, hl, hv = get_fluid(name).saturation_dome(12)
        assert len(p) >= 10
        assert all(a < b for a, b in zip(p, p[1:]))
        assert all(l < v for l, v in zip(hl, hv))
        # latent heat shrinks towards the critical point
        assert hv[-1] - hl[-1] < hv[0] - hl[0]


@pytest.mark.parametrize(
    "name, te, tc, options",
    [
        ("R-134a", -10.0, 40.0, {}),
        ("R-448A", -28.0, 45.0, {"suction_line_superheat": 8.0, "suction_pressure_drop": 1.0}),
        ("R-404A", -30.0, 40.0, {"isentropic_efficiency": 1.0, "discharge_pressure_drop": 0.8}),
        ("R-290", 2.0, 35.0, {"subcooling": 0.0, "superheat": 0.0, "clearance": 0.0}),
        ("R-744", -35.0, -5.0, {}),
        ("R-744", -10.0, None, {"gas_cooler_outlet_temperature": 35.0}),
    ],
)
def test_compressor_displacement_is_the_full_cycles(name, te, tc, options):
    # The shortcut for capacity curves skips the states that do not bear on the
    # displacement (expansion outlet, actual discharge): the number must be the
    # full cycle's to the last bit, whatever the options.
    from coldroom.physics.cycle import compressor_displacement

    full = solve_cycle(name, te, tc, 4000.0, **options)
    assert compressor_displacement(name, te, tc, 4000.0, **options) == full.displacement


@pytest.mark.parametrize(
    "name, coils, tc, options",
    [
        ("R-134a", [(-10.0, 5.0, 4000.0)], 40.0, {}),
        ("R-448A", [(-28.0, 6.0, 3000.0), (-8.0, 5.0, 2500.0)], 45.0,
         {"suction_line_superheat": 8.0, "suction_pressure_drop": 1.0, "discharge_pressure_drop": 0.8}),
        ("R-290", [(2.0, 0.0, 4000.0)], 35.0, {"subcooling": 0.0, "clearance": 0.0}),
        ("R-744", [(-10.0, 5.0, 4000.0)], None, {"gas_cooler_outlet_temperature": 35.0}),
    ],
)
def test_compressor_performance_is_the_full_cycles(name, coils, tc, options):
    # The annual grid's shortcut skips the expansion outlet, glide, warnings and record: its
    # displacement and power must be the full system cycle's to the last bit.
    from coldroom.physics.system_cycle import compressor_performance, solve_system_cycle

    full = solve_system_cycle(name, coils, tc, **options)
    assert compressor_performance(name, coils, tc, **options) == (full.displacement, full.compressor_power)
