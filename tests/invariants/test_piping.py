"""Invariants of line sizing and the charge estimate.

A longer line or a smaller tube never gives a smaller drop; the chosen size is
the smallest that meets the limit; the charge grows with line length.
"""

from __future__ import annotations

import dataclasses

import pytest

from hypothesis import given
from hypothesis import strategies as st

from coldroom.physics.charge import estimate_charge
from coldroom.physics.cycle import solve_cycle
from coldroom.data import tubes
from coldroom.physics.line_sizing import FITTINGS, LineSpec, line_drop, size_line, size_lines

CYCLE = solve_cycle("R-404A", -10.0, 40.0, 4000.0)
SUCTION_DENSITY = CYCLE.evaporator_outlet.density


def _sat(drop):  # any non-decreasing conversion will do for the invariants
    return drop / 8000.0


lengths = st.floats(min_value=1.0, max_value=80.0)
flows = st.floats(min_value=0.002, max_value=0.5)
fittings = st.lists(st.tuples(st.sampled_from(sorted(FITTINGS)), st.integers(0, 6)), max_size=4)


@given(lengths, st.floats(min_value=0.1, max_value=40.0), flows, fittings, st.sampled_from(tubes.names()))
def test_longer_line_never_smaller_drop(length, extra, mass_flow, fitting_list, series):
    for tube in tubes.series(series)[::3]:
        short = line_drop(tube, LineSpec("suction", length, 0.0, tuple(fitting_list)), mass_flow, 20.0, 1.1e-5, _sat)
        long = line_drop(tube, LineSpec("suction", length + extra, 0.0, tuple(fitting_list)), mass_flow, 20.0, 1.1e-5, _sat)
        assert long.pressure_drop >= short.pressure_drop


@given(lengths, flows, fittings, st.sampled_from(tubes.names()), st.sampled_from([(1000.0, 2e-4), (20.0, 1.1e-5)]))
def test_smaller_tube_never_smaller_drop(length, mass_flow, fitting_list, series, fluid):
    density, viscosity = fluid
    spec = LineSpec("liquid", length, 0.0, tuple(fitting_list))
    drops = [line_drop(t, spec, mass_flow, density, viscosity, _sat).pressure_drop for t in tubes.series(series)]
    assert all(a >= b for a, b in zip(drops, drops[1:]))


@given(lengths, flows, st.floats(min_value=0.1, max_value=2.0), st.sampled_from(tubes.names()))
def test_chosen_size_is_the_smallest_within_the_limit(length, mass_flow, limit, series):
    spec = LineSpec("suction", length, 0.0, (("elbow_90", 4),), limit=limit)
    result = size_line(spec, series, mass_flow, SUCTION_DENSITY, 1.1e-5, _sat)
    sizes = tubes.series(series)
    index = sizes.index(result.chosen.tube)
    if result.within_limit:
        assert result.chosen.saturation_temperature_drop <= limit
        for smaller in sizes[:index]:
            assert line_drop(smaller, spec, mass_flow, SUCTION_DENSITY, 1.1e-5, _sat).saturation_temperature_drop > limit
        if index:
            assert result.next_smaller.tube == sizes[index - 1]
        else:
            assert result.next_smaller is None
    else:
        assert result.chosen.tube == sizes[-1]


@given(lengths, st.floats(min_value=0.5, max_value=50.0))
def test_charge_grows_with_line_length(length, extra):
    def total(run):
        specs = tuple(LineSpec(line, run) for line in ("suction", "liquid", "discharge"))
        piping = size_lines("R-404A", CYCLE.mass_flow, CYCLE.evaporator_outlet, CYCLE.states[2], CYCLE.states[1],
                            specs, "EN 12735-1")
        return estimate_charge(CYCLE, piping).total, piping

    short, short_piping = total(length)
    long, long_piping = total(length + extra)
    # same sizes or larger tubes for the longer run: both add refrigerant
    assert long > short
    for a, b in zip(short_piping.lines, long_piping.lines):
        assert b.chosen.tube.outside_diameter >= a.chosen.tube.outside_diameter


def test_default_limits_and_override():
    spec = LineSpec("liquid", 10.0)
    assert spec.limit_k == 0.5
    assert dataclasses.replace(spec, limit=0.2).limit_k == 0.2



class _Run:
    def __init__(self, length, rise=0.0):
        self.length, self.rise, self.fittings, self.equivalent_length, self.limit = length, rise, {}, None, None


class _Piping:
    tube_series = "EN 12735-1"
    minimum_load = 1.0

    def __init__(self, liquid_rise):
        self.suction = _Run(20.0, 4.0)
        self.liquid = _Run(20.0, liquid_rise)
        self.discharge = _Run(3.0)


@given(st.floats(min_value=-15.0, max_value=15.0), st.floats(min_value=0.0, max_value=5.0))
def test_liquid_rise_eats_subcooling_and_a_drop_restores_it(rise, more):
    from coldroom.design.pipework import size_system_lines, valve_subcooling

    low = valve_subcooling(CYCLE, size_system_lines(CYCLE, _Piping(rise)))
    high = valve_subcooling(CYCLE, size_system_lines(CYCLE, _Piping(min(rise + more, 20.0))))
    assert high <= low + 1e-9
    if rise <= 0.0:  # friction only ever takes away; a falling line gives back static head
        flat = valve_subcooling(CYCLE, size_system_lines(CYCLE, _Piping(0.0)))
        assert low >= flat - 1e-9


def test_flash_gas_is_warned_when_the_liquid_line_climbs_too_far():
    from coldroom.design.pipework import cycle_drops, pipework, size_system_lines, valve_subcooling
    from coldroom.inputs.projectfile import ChargeSettings

    piping = size_system_lines(CYCLE, _Piping(15.0))
    sub = valve_subcooling(CYCLE, piping)
    assert sub < 0.0  # 2 K of subcooling cannot lift R-404A liquid 15 m
    suction, discharge = cycle_drops(CYCLE, piping)
    assert 0.0 < suction and 0.0 <= discharge
    result = pipework(CYCLE, piping, ChargeSettings(), "room", 30.0, suction, discharge, sub)
    assert any("flash gas" in w for w in result.warnings)
    assert result.defaults_used == ("occupancy category", "location class")
    assert result.to_json()["charge"]["total_kg"] == pytest.approx(result.charge.total)


@given(st.floats(min_value=0.0, max_value=5.0))
def test_discharge_drop_raises_discharge_pressure_and_keeps_energy_balance(drop):
    base = solve_cycle("R-134a", -10.0, 40.0, 5000.0, suction_line_superheat=0.0)
    r = solve_cycle("R-134a", -10.0, 40.0, 5000.0, discharge_pressure_drop=drop, suction_line_superheat=0.0)
    assert r.discharge_pressure >= base.discharge_pressure
    assert r.compressor_power >= base.compressor_power - 1e-9
    assert r.states[2] == base.states[2]  # the condenser outlet does not move
    assert r.capacity + r.compressor_power == pytest.approx(r.condenser_duty, rel=1e-9)
