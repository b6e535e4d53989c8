"""The pull-down model (coldroom.loads.pulldown) against analytic solutions of the lumped capacitance method.

Source of the method: Incropera & DeWitt, *Fundamentals of Heat and Mass Transfer*, 6th ed., §5.1
"The lumped capacitance method" [ref:incropera-dewitt] (from memory; verify): a body of uniform temperature exchanging
heat with its surroundings obeys C·dT/dt = Σ heat flows; with constant flows the temperature is
linear in time, with a flow proportional to a temperature difference it is exponential.

1. Linear. One mass m·c tied tightly to the room air (C_air), constant capacity Q, constant
   steady load L, thermostat out of the way:
       (m·c + C_air)·dT/dt = L − Q   ⇒   T(t) = T₀ − (Q − L)·t / (m·c + C_air).
2. Exponential. Massless room air, a product of m·c with conductance UA to the air, a unit whose
   capacity is K·(T_a − T_e) (a coil of K W/K at a fixed evaporating temperature), load L:
       air:      L + UA·(T − T_a) − K·(T_a − T_e) = 0
       product:  m·c·dT/dt = UA·(T_a − T) = −(T − T∞)·UA·K/(UA + K),   T∞ = T_e + L/K
   ⇒ T(t) = T∞ + (T₀ − T∞)·exp(−t/τ),  τ = m·c·(UA + K)/(UA·K).
"""

from __future__ import annotations

import math

import pytest

from coldroom.loads.pulldown import FINAL_TOLERANCE, ThermalMass, simulate


def test_constant_capacity_pulls_down_linearly() -> None:
    m, c, t0 = 2000.0, 3500.0, 15.0
    c_air = 1.27 * 1006.0 * 60.0
    q, load = 9000.0, 1500.0
    final = 1.0
    block = ThermalMass("block", m, 1e7, t0, specific_heat=c, final_temperature=final)
    r = simulate(c_air, [block], lambda _t: q, lambda _t: load, set_point=-40.0,
                 initial_air_temperature=t0, duration=4 * 3600.0)
    rate = (q - load) / (m * c + c_air)  # K/s
    for t, temp in zip(r.time, r.products[0].temperature):
        assert temp == pytest.approx(t0 - rate * t, abs=0.02)
    expected = (t0 - (final + FINAL_TOLERANCE)) / rate / 3600.0
    assert r.hours_to_final == pytest.approx(expected, rel=0.005)


def test_capacity_proportional_to_the_air_gives_an_exponential() -> None:
    m, c, t0 = 1500.0, 3600.0, 20.0
    ua, k, t_e, load = 400.0, 800.0, -8.0, 1200.0
    product = ThermalMass("product", m, ua, t0, specific_heat=c, final_temperature=0.0)
    r = simulate(0.0, [product], lambda ta: k * (ta - t_e), lambda _t: load, set_point=-40.0,
                 initial_air_temperature=t0, duration=30 * 3600.0)
    t_inf = t_e + load / k
    tau = m * c * (ua + k) / (ua * k)
    for t, temp in zip(r.time, r.products[0].temperature):
        assert temp == pytest.approx(t_inf + (t0 - t_inf) * math.exp(-t / tau), abs=0.01)
    expected = -tau * math.log((0.0 + FINAL_TOLERANCE - t_inf) / (t0 - t_inf)) / 3600.0
    assert r.hours_to_final == pytest.approx(expected, rel=0.005)
    # the air follows its algebraic balance
    t_end = r.products[0].temperature[-1]
    assert r.air_temperature[-1] == pytest.approx((load + ua * t_end + k * t_e) / (ua + k), abs=0.01)
