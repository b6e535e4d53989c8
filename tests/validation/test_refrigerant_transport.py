"""Blend viscosity approximation against an independent route.

CoolProp's pseudo-pure R-407C model carries its own viscosity correlation
(the reference); the component mixing rules of coldroom.physics.refrigerant
(Grunberg-Nissan for the liquid, Wilke for the vapour) built from R-32, R-125
and R-134a at R-407C's mole fractions (0.381/0.180/0.439, from the 23/25/52
mass composition) must agree within 8 % on both saturation lines.
"""

from __future__ import annotations

import pytest

from coldroom.physics.refrigerant import MIXTURE_VISCOSITY_BASIS, blend_viscosity, get_fluid

R407C = (("R32", 0.381109), ("R125", 0.179559), ("R134a", 0.439332))


@pytest.mark.parametrize("temperature", [-30.0, -10.0, 40.0])
@pytest.mark.parametrize("phase, quality", [("liquid", 0.0), ("vapour", 1.0)])
def test_r407c_components_vs_pseudo_pure(temperature, phase, quality):
    fluid = get_fluid("R-407C")
    state = fluid.saturated_state(quality, temperature=temperature)
    reference, basis = fluid.viscosity(state, phase)
    assert basis == "CoolProp"
    assert blend_viscosity(R407C, state.p, state.t, phase) == pytest.approx(reference, rel=0.08)


def test_predefined_mixture_uses_the_stated_approximation():
    fluid = get_fluid("R-448A")
    mu, basis = fluid.viscosity(fluid.saturated_liquid(temperature=30.0), "liquid")
    assert basis == MIXTURE_VISCOSITY_BASIS
    assert 1e-4 < mu < 2e-4
