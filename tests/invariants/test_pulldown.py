"""Invariants of the pull-down simulation (coldroom.loads.pulldown).

- more capacity never lengthens the pull-down (nor raises the product temperature at any time);
- the heat the unit removes equals the enthalpy the masses and the air lose plus the steady load
  (energy balance, freezing included).

Each example integrates the model twice (≈0.1 s each): 15 examples keep a test near 3 s.
"""

from __future__ import annotations

import numpy as np
import pytest
from hypothesis import given, settings
from hypothesis import strategies as st

from coldroom.physics.products import get_product
from coldroom.loads.pulldown import ThermalMass, half_cooling_conductance, simulate, thermostat

BEEF = get_product("beef_frozen").properties()


def _masses(entering: float, mass: float) -> list[ThermalMass]:
    c = BEEF.enthalpy(entering) - BEEF.enthalpy(entering - 1.0)
    return [
        ThermalMass("beef", mass, half_cooling_conductance(mass, c, 3 * 3600.0), entering,
                    enthalpy=BEEF.enthalpy, final_temperature=-18.0, asked_time=24 * 3600.0),
        ThermalMass("cartons", mass * 0.05, half_cooling_conductance(mass * 0.05, 1400.0, 3600.0), entering,
                    specific_heat=1400.0),
    ]


def _capacity(scale: float):
    # falls 3 % per kelvin as the room air falls, like a compressor at lower suction
    return lambda air: scale * 4000.0 * max(0.2, 1.0 + 0.03 * (air + 20.0))


@settings(max_examples=15)
@given(
    entering=st.floats(min_value=-10.0, max_value=5.0),  # from partly frozen to above freezing
    mass=st.floats(min_value=100.0, max_value=3000.0),
    scale=st.floats(min_value=0.6, max_value=2.0),
    more=st.floats(min_value=1.01, max_value=2.0),
)
def test_more_capacity_never_lengthens_the_pulldown(entering, mass, scale, more) -> None:
    runs = [
        simulate(1.27 * 1006.0 * 80.0, _masses(entering, mass), _capacity(s), lambda t: 900.0 + 15.0 * (-20.0 - t),
                 set_point=-20.0, initial_air_temperature=-20.0, duration=36 * 3600.0)
        for s in (scale, scale * more)
    ]
    small, large = runs
    for a, b in zip(small.products[0].temperature, large.products[0].temperature):
        assert b <= a + 1e-3
    if small.hours_to_final is not None:
        assert large.hours_to_final is not None
        assert large.hours_to_final <= small.hours_to_final + 1e-3
    assert large.lowest_air_temperature <= small.lowest_air_temperature + 1e-3


def test_energy_balance_with_freezing() -> None:
    """Heat removed by the unit less the steady load = enthalpy lost by the product and the air (1 %)."""
    c_air = 1.27 * 1006.0 * 80.0
    masses = _masses(4.0, 1500.0)[:1]  # the product alone, entering above its freezing point
    capacity = _capacity(1.0)
    load = lambda t: 900.0 + 15.0 * (-20.0 - t)  # noqa: E731
    r = simulate(c_air, masses, capacity, load, set_point=-20.0, initial_air_temperature=-20.0,
                 duration=24 * 3600.0)
    t = np.asarray(r.time)
    air = np.asarray(r.air_temperature)
    removed = np.trapezoid([thermostat(a, -20.0) * capacity(a) - load(a) for a in air], t)
    lost_product = masses[0].mass * (BEEF.enthalpy(4.0) - BEEF.enthalpy(r.products[0].temperature[-1]))
    lost_air = c_air * (air[0] - air[-1])
    assert BEEF.freezing_point > r.products[0].temperature[-1]  # it froze on the way
    assert removed == pytest.approx(lost_product + lost_air, rel=0.01)


# --- the vectorised h → T inversion is np.interp, bit for bit ------------------------------------


@settings(max_examples=60)
@given(
    steps=st.lists(st.lists(st.floats(min_value=1e-3, max_value=5e4), min_size=6, max_size=6), min_size=1, max_size=5),
    picks=st.lists(st.floats(min_value=-0.2, max_value=1.2), min_size=5, max_size=5),
    on_grid=st.integers(min_value=0, max_value=5),
)
def test_inverse_is_np_interp_row_by_row(steps, picks, on_grid):
    """The pull-down's one-step inversion of all masses' tables equals np.interp per mass
    exactly (==), below, inside, on a grid point and above each table (the reference is
    numpy's own np.interp)."""
    from coldroom.loads.pulldown import _Inverse

    temps = [-40.0 + 10.0 * k for k in range(7)]
    tables = []
    for row in steps:
        h = [-1e5]
        for d in row:
            h.append(h[-1] + d)
        tables.append((h, temps))
    for pick in picks:
        x = []
        for h, _ in tables:
            lo, hi = h[0], h[-1]
            x.append(h[on_grid] if pick < 0.0 and on_grid < len(h) else lo + pick * (hi - lo))
        got = _Inverse(tables)(np.array(x))
        want = [np.interp(x[i], tables[i][0], temps) for i in range(len(tables))]
        assert list(got) == want


@settings(max_examples=80)
@given(
    steps=st.lists(st.floats(min_value=1e-3, max_value=30.0), min_size=0, max_size=6),
    capacities=st.lists(st.floats(min_value=0.0, max_value=5e4), min_size=7, max_size=7),
    picks=st.lists(st.floats(min_value=-0.3, max_value=1.3), min_size=4, max_size=4),
    on_point=st.integers(min_value=0, max_value=6),
)
def test_capacity_curve_is_np_interp(steps, capacities, picks, on_point):
    """The pull-down's capacity curve answers exactly (==) what numpy's own np.interp
    gives through the same points: below, between, on a point and above them."""
    from coldroom.loads.pulldown import capacity_curve

    air = [-5.0]
    for d in steps:
        air.append(air[-1] + d)
    ys = capacities[: len(air)]
    at = capacity_curve(air, ys)
    xs = [air[0] + p * (air[-1] - air[0] + 1.0) for p in picks] + [air[min(on_point, len(air) - 1)]]
    for x in xs:
        assert at(x) == float(np.interp(x, air, ys))
        assert at(np.float64(x)) == float(np.interp(x, air, ys))
