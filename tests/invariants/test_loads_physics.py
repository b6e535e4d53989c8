"""Monotonicity and limit invariants of the load physics (hypothesis, derandomized profile)."""

from __future__ import annotations

import pytest
from hypothesis import assume, given
from hypothesis import strategies as st

from coldroom.physics import psychrometrics as psy
from coldroom.errors import CalculationError
from coldroom import rules
from coldroom.loads import infiltration, internal, transmission

thickness = st.floats(0.02, 0.30)
conductivity = st.floats(0.018, 0.06)
film = st.floats(5.0, 40.0)
room_t = st.floats(-35.0, 10.0)
rh = st.floats(0.3, 0.95)
hours = st.floats(0.0, 24.0)


@given(thickness, st.floats(0.001, 0.2), conductivity, film, film)
def test_thicker_insulation_lowers_u_and_transmission(x, extra, k, h_in, h_out):
    u_thin = transmission.u_value([(x, k)], h_in, h_out)
    u_thick = transmission.u_value([(x + extra, k)], h_in, h_out)
    assert u_thick < u_thin
    assert transmission.surface_heat_gain(10.0, u_thick, 30.0, -20.0) < transmission.surface_heat_gain(
        10.0, u_thin, 30.0, -20.0
    )


@given(st.floats(0.05, 1.0), room_t, st.floats(11.0, 40.0), st.floats(0.1, 10.0), st.floats(0.0, 12.0))
def test_higher_ambient_more_transmission(u, t_room, t_out, rise, sun):
    assume(t_out > t_room)
    assert transmission.surface_heat_gain(5.0, u, t_out + rise, t_room, sun) > transmission.surface_heat_gain(
        5.0, u, t_out, t_room, sun
    )


@given(thickness, conductivity)
def test_u_value_series_resistances_add(x, k):
    # Splitting a layer in two identical halves leaves U unchanged (series resistances).
    whole = transmission.u_value([(x, k)], 9.37, 34.1)
    halves = transmission.u_value([(x / 2, k), (x / 2, k)], 9.37, 34.1)
    assert halves == pytest.approx(whole, rel=1e-12)


def _door(**overrides):
    args = dict(
        door_width=1.2, door_height=2.4, room_temperature=-20.0, room_relative_humidity=0.85,
        outside_temperature=25.0, outside_relative_humidity=0.6, passages_per_day=100,
        passage_time=15.0, standing_open_time=0.0, protection="none",
    )  # fmt: skip
    args.update(overrides)
    return infiltration.door_infiltration(**args)


@given(room_t, rh, st.floats(12.0, 38.0), st.floats(0.5, 8.0), rh)
def test_higher_ambient_more_door_infiltration(t_room, rh_room, t_out, rise, rh_out):
    # Keep D_f fixed (ΔT > 11 K on both sides) so only the physics changes.
    assume(t_out - t_room > 11.0)
    low = _door(room_temperature=t_room, room_relative_humidity=rh_room, outside_temperature=t_out,
                outside_relative_humidity=rh_out)  # fmt: skip
    high = _door(room_temperature=t_room, room_relative_humidity=rh_room, outside_temperature=t_out + rise,
                 outside_relative_humidity=rh_out)  # fmt: skip
    assert high.full_open_power > low.full_open_power > 0
    assert high.average_power > low.average_power


@given(room_t, rh, st.floats(15.0, 38.0), rh, st.floats(5.7, 2800.0))
def test_higher_ambient_more_air_change_infiltration(t_room, rh_room, t_out, rh_out, volume):
    a = infiltration.air_change_infiltration(
        room_volume=volume, room_temperature=t_room, room_relative_humidity=rh_room,
        outside_temperature=t_out, outside_relative_humidity=rh_out,
    )  # fmt: skip
    b = infiltration.air_change_infiltration(
        room_volume=volume, room_temperature=t_room, room_relative_humidity=rh_room,
        outside_temperature=t_out + 3.0, outside_relative_humidity=rh_out,
    )  # fmt: skip
    assert b.average_power > a.average_power > 0


@given(st.integers(0, 2000), st.integers(1, 500), st.floats(5.0, 30.0))
def test_more_passages_more_infiltration(passages, more, passage_time):
    a = _door(passages_per_day=passages, passage_time=passage_time)
    b = _door(passages_per_day=passages + more, passage_time=passage_time)
    assert b.average_power > a.average_power >= 0.0
    # Average power is linear in open time: full-open rate × open fraction × D_f × (1 − E).
    assert b.average_power == pytest.approx(b.full_open_power * b.open_time_factor * b.flow_factor)


@given(room_t, st.floats(12.0, 38.0), st.integers(1, 1000))
def test_effectiveness_one_gives_zero_infiltration(t_room, t_out, passages):
    r = _door(room_temperature=t_room, outside_temperature=t_out, passages_per_day=passages, effectiveness=1.0)
    assert r.average_power == 0.0 and r.daily_energy == 0.0
    assert r.full_open_dry_air_flow > 0.0  # the door itself still exchanges air when open
    # The exchange carries heat in when the outside air holds more enthalpy than the room air; with
    # a small temperature difference and dry outside air (e.g. 10 °C room, 12 °C outside) it need not.
    if r.outside.enthalpy > r.room.enthalpy:
        assert r.full_open_power > 0.0
    else:
        assert r.full_open_power <= 0.0


@given(st.floats(0.0, 1.0), st.floats(0.0, 1.0))
def test_higher_effectiveness_less_infiltration(e1, e2):
    assume(abs(e1 - e2) > 1e-6)
    lo, hi = sorted((e1, e2))
    assert _door(effectiveness=hi).average_power < _door(effectiveness=lo).average_power


@given(st.floats(-30.0, 30.0), st.floats(0.1, 20.0))
def test_colder_room_more_people_load(t, colder):
    assert internal.people_heat_rate(t - colder) > internal.people_heat_rate(t)


@given(st.floats(0.0, 5000.0), st.floats(-30.0, 10.0))
def test_energy_zero_when_hours_zero(power, t):
    assert internal.people_energy(3, 0.0, t) == 0.0
    assert internal.lighting_energy(power, 0.0) == 0.0
    assert internal.motor_energy(power, 0.0) == 0.0
    assert internal.forklift_energy(power, 0.0) == 0.0
    assert internal.equipment_energy(power, 0.0) == 0.0
    assert internal.heater_energy(power, 0.0) == 0.0
    assert internal.defrost_energy(power, 0, 1200.0) == 0.0
    assert _door(passages_per_day=0, standing_open_time=0.0).daily_energy == 0.0


@given(st.floats(0.0, 5000.0), hours)
def test_energy_linear_in_hours_and_round_trip(power, h):
    e = internal.equipment_energy(power, h)
    assert e == pytest.approx(power * h * 3600.0)
    assert internal.daily_energy(internal.average_power(e)) == pytest.approx(e)


@given(st.floats(0.0, 1e9), st.floats(1.0, 24.0), st.floats(0.0, 0.5))
def test_required_capacity_scales(energy, run_hours, sf):
    q = rules.required_capacity(energy, run_hours * 3600.0, sf)
    assert q * run_hours * 3600.0 == pytest.approx((1 + sf) * energy, rel=1e-12, abs=1e-6)
    assert rules.required_capacity(energy, min(run_hours + 1.0, 24.0) * 3600.0, sf) <= q


@given(st.floats(-40.0, 45.0), rh, st.floats(0.0, 3000.0))
def test_psychrometric_round_trips(t, phi, altitude):
    p = psy.standard_pressure(altitude)
    w = psy.humidity_ratio(t, phi, p)
    assert psy.relative_humidity(t, w, p) == pytest.approx(phi, rel=1e-9)
    # Enthalpy rises with temperature and humidity; denser air when colder.
    assert psy.enthalpy(t + 1.0, w) > psy.enthalpy(t, w)
    assert psy.moist_air_density(t - 1.0, w, p) > psy.moist_air_density(t, w, p)


@given(st.floats(-30.0, 40.0), st.floats(0.1, 10.0))
def test_wet_bulb_at_dry_bulb_is_saturation(t, depression):
    assert psy.relative_humidity_from_wet_bulb(t, t) == pytest.approx(1.0, rel=1e-9)
    try:
        rh_lower = psy.relative_humidity_from_wet_bulb(t, t - depression)
    except CalculationError:  # very dry: the pair is inconsistent and refused
        return
    assert rh_lower < 1.0


@given(st.floats(-5.0, 30.0), st.floats(0.0, 20.0), st.integers(1, 500))
def test_door_into_warmer_room_adds_nothing(t_out, warmer, passages):
    # Buoyant inflow exists only into the colder (denser) room; the warmer side gets zero.
    r = _door(room_temperature=t_out + warmer + 0.5, outside_temperature=t_out, outside_relative_humidity=0.5,
              room_relative_humidity=0.5, passages_per_day=passages)  # fmt: skip
    assert r.full_open_power == 0.0 and r.average_power == 0.0
