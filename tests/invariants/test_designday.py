"""Invariants of the design day (coldroom.loads.hourly): energy placed, none lost; schedules only move it.

- with no daily range, the 24 hourly loads average to the 24-hour energy ÷ 86 400 s (0.5 %),
  whatever the schedule;
- a daily range only cools the outdoor air: the day's energy lies between the 24-hour energy at
  the design dry bulb and at the dry bulb less the range;
- a room without a schedule keeps today's peak-hour figure (product pull-down rate, internal
  loads all on, transmission and infiltration at their averages);
- a pull-down time of a whole day spreads the product evenly, whatever the delivery times.
"""

from __future__ import annotations

import copy

import pytest
from hypothesis import given
from hypothesis import strategies as st

from coldroom.loads import design_day as room_design_day, product_peak, room_loads, internal_peak
from coldroom.inputs.opening import open_project_data
from coldroom.inputs.safeyaml import load_yaml
from tests.conftest import PROJECT_FILES

FREEZER = load_yaml((PROJECT_FILES / "freezer_heated_slab.yaml").read_bytes(), "freezer").data
DEMOS = sorted(PROJECT_FILES.glob("*.yaml"))


def _model(data):
    return open_project_data(copy.deepcopy(data), "test")


hours = st.integers(min_value=0, max_value=23)


@st.composite
def schedules(draw):
    """A schedule that agrees with the freezer demo (2 h people, 4 h lights, 1000 kg, 4 defrosts)."""
    a = draw(hours)
    b = draw(st.integers(min_value=1, max_value=12))
    share = draw(st.floats(min_value=0.05, max_value=0.95))
    people = draw(hours)
    lights = draw(hours)
    first = draw(st.floats(min_value=0.0, max_value=23.9))
    split = draw(st.floats(min_value=0.1, max_value=0.9))
    defrost0 = draw(st.floats(min_value=0.0, max_value=5.5))
    return {
        "doors": [
            {"start": a, "end": (a + b) % 24, "share": share},
            {"start": (a + b) % 24, "end": (a + b + 6) % 24, "share": 1.0 - share},
        ],
        "people": [{"start": people, "end": (people + 2) % 24}],
        "lighting": [{"start": lights, "end": (lights + 4) % 24}],
        "deliveries": [
            {"time": round(first, 2), "mass": 1000.0 * split},
            {"time": round((first + 7.5) % 24, 2), "mass": 1000.0 * (1.0 - split)},
        ],
        "defrost": [defrost0 + 6 * i for i in range(4)],
    }


@given(schedules())
def test_hourly_loads_average_to_the_daily_energy(schedule) -> None:
    data = copy.deepcopy(FREEZER)
    data["rooms"][0]["schedule"] = schedule
    model = _model(data)
    loads = room_loads(model, model.rooms[0])
    day = loads.design_day
    assert len(day.hourly_load) == 24
    assert sum(day.hourly_load) / 24 == pytest.approx(loads.daily_energy / 86400.0, rel=0.005)
    assert all(q >= 0.0 for q in day.hourly_load)
    assert 0 <= day.peak_hour <= 23
    assert loads.peak_load == pytest.approx(day.peak_load)


@given(st.floats(min_value=0.5, max_value=25.0))
def test_a_daily_range_only_cools_the_day(daily_range) -> None:
    data = copy.deepcopy(FREEZER)
    design = data["design"]
    hot = _model(data)
    design["daily_range"] = daily_range
    ranged = _model(data)
    design.pop("daily_range")
    design["outdoor_temperature"] = hot.design.outdoor_temperature - daily_range
    cool = _model(data)
    energy = room_design_day(ranged, ranged.rooms[0]).daily_energy
    assert room_loads(cool, cool.rooms[0]).daily_energy <= energy * (1 + 1e-9)
    assert energy <= room_loads(hot, hot.rooms[0]).daily_energy * (1 + 1e-9)


@pytest.mark.parametrize("path", DEMOS, ids=lambda p: p.stem)
def test_a_room_without_schedule_keeps_todays_peak(path) -> None:
    model = _model(load_yaml(path.read_bytes(), path.name).data)
    for room in model.rooms:
        assert room.schedule is None
        loads = room_loads(model, room)
        steady = sum(line.daily_energy for line in loads.lines if line.component in ("transmission", "infiltration"))
        expected = steady / 86400.0 + product_peak(model, room) + internal_peak(model, room)
        assert loads.peak_load == pytest.approx(expected, rel=1e-12)
        assert sum(loads.design_day.hourly_load) / 24 == pytest.approx(loads.daily_energy / 86400.0, rel=1e-9)


@given(st.floats(min_value=0.0, max_value=23.99))
def test_a_whole_day_pulldown_spreads_the_product_evenly(time) -> None:
    data = copy.deepcopy(FREEZER)
    data["rooms"][0]["schedule"] = {"deliveries": [{"time": time, "mass": 1000.0}]}
    model = _model(data)
    product = room_design_day(model, model.rooms[0]).components["product"]
    assert max(product) == pytest.approx(min(product), rel=1e-9)


def test_a_zero_length_defrost_puts_no_heat_in() -> None:
    """A defrost of 0 min (hypothesis found it in a random valid project) gives a 0 J line, not an error."""
    data = copy.deepcopy(FREEZER)
    data["rooms"][0]["defrost"]["duration"] = 0
    model = _model(data)
    loads = room_loads(model, model.rooms[0])
    assert sum(loads.design_day.hourly_load) / 24 == pytest.approx(loads.daily_energy / 86400.0, rel=0.005)


@pytest.mark.parametrize("daily_range", [0.0, 8.0])
def test_outdoor_lines_are_computed_once_per_outdoor_temperature(daily_range) -> None:
    """The outdoor-driven lines depend on the hour only through its outdoor air: a flat day (the
    default) computes them once, a day with a range once per distinct hourly temperature; each hour
    still gets exactly the lines computed at its own outdoor air (an hour-by-hour recomputation)."""
    from coldroom import loads
    from coldroom.loads.hourly import HOURS, LineSources, _hour_model, _outdoor_rh, outdoor_temperatures
    from coldroom.loads.hourly import room_design_day as place
    from coldroom.physics import psychrometrics

    data = copy.deepcopy(FREEZER)
    data["design"]["daily_range"] = daily_range
    model = _model(data)
    room = model.rooms[0]
    calls = {"transmission": 0, "infiltration": 0}

    def counted(name, function):
        def wrapper(*args):
            calls[name] += 1
            return function(*args)

        return wrapper

    sources = LineSources(
        product_loads=loads._product_loads,
        transmission_lines=counted("transmission", loads.transmission_lines),
        infiltration_lines=counted("infiltration", loads.infiltration_lines),
        internal_lines=loads.internal_lines,
        outdoor_relative_humidity=loads.outdoor_relative_humidity,
        site_pressure=loads.site_pressure,
    )
    day = place(model, room, sources)
    temps = outdoor_temperatures(model.design.outdoor_temperature, daily_range)
    assert calls == {"transmission": len(set(temps)), "infiltration": len(set(temps))}
    assert (len(set(temps)) == 1) == (daily_range == 0.0)
    design = model.design
    pressure = loads.site_pressure(design)
    w_out = psychrometrics.humidity_ratio(design.outdoor_temperature, loads.outdoor_relative_humidity(design), pressure)
    for h in range(HOURS):
        hour_model = model if daily_range == 0.0 else _hour_model(model, temps[h], _outdoor_rh(temps[h], w_out, pressure))
        expected = 0.0
        for line in loads.transmission_lines(hour_model, room):
            expected += line.average_power
        assert day.components["transmission"][h] == expected
