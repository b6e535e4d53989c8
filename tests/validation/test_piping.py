"""Line pressure drop and the tube tables against named published sources.

Pipe flow: Çengel & Cimbala, *Fluid Mechanics: Fundamentals and Applications*,
1st ed. (2006), Example 8-3 "Determining the head loss in a water pipe"
(from memory): water at 15 °C (ρ = 999.1 kg/m³, μ = 1.138e-3 kg/(m·s)),
6 L/s through 60 m of 5 cm horizontal stainless-steel pipe (ε = 0.002 mm):
[ref:cengel-cimbala] V = 3.06 m/s, Re = 134 300, f = 0.0172, Δp = 96.3 kPa, head loss 9.82 m,
pumping power 0.578 kW.

Tube tables: ASTM B280-20 Table 1 [ref:astm-b280] (straight lengths, drawn) outside diameter
and wall, and the inside diameters of ACR tube as tabulated from it (OD − 2
walls: 7/8 in → 0.785 in, 1-1/8 in → 1.025 in); EN 12735-1 metric sizes [ref:en-12735-1]
(from memory; verify against the current edition).
"""

from __future__ import annotations

import math

import pytest

from coldroom.data import tubes
from coldroom.physics.line_sizing import LineSpec, friction_factor, line_drop


def test_cengel_example_8_3_water_pipe():
    tube = tubes.Tube("5 cm", 0.05, 0.0, "Çengel & Cimbala Example 8-3")
    spec = LineSpec("liquid", 60.0)
    density, viscosity = 999.1, 1.138e-3
    mass_flow = 0.006 * density
    drop = line_drop(tube, spec, mass_flow, density, viscosity, lambda dp: 0.0, roughness=0.002e-3)
    assert drop.velocity == pytest.approx(3.06, abs=0.01)
    assert drop.reynolds == pytest.approx(134_300, rel=0.005)
    assert drop.friction_factor == pytest.approx(0.0172, abs=0.0002)
    assert drop.pressure_drop == pytest.approx(96.3e3, rel=0.01)
    head_loss = drop.pressure_drop / (density * 9.81)
    assert head_loss == pytest.approx(9.82, rel=0.01)
    assert 0.006 * drop.pressure_drop == pytest.approx(578.0, rel=0.01)
    assert drop.static_pressure_change == 0.0


def test_laminar_and_smooth_friction_factors():
    # Hagen-Poiseuille f = 64/Re [pub, any text]; smooth pipe at Re = 1e5:
    # Colebrook/Moody f = 0.0180 (Moody chart, smooth curve) [pub].
    assert friction_factor(1000.0, 0.0) == 0.064
    assert friction_factor(1e5, 0.0) == pytest.approx(0.0180, abs=0.0001)


@pytest.mark.parametrize(
    "label, od_in, wall_in",
    [
        ("1/4 in", 0.250, 0.025),
        ("3/8 in", 0.375, 0.030),
        ("1/2 in", 0.500, 0.035),
        ("5/8 in", 0.625, 0.040),
        ("3/4 in", 0.750, 0.042),
        ("7/8 in", 0.875, 0.045),
        ("1-1/8 in", 1.125, 0.050),
        ("1-3/8 in", 1.375, 0.055),
        ("1-5/8 in", 1.625, 0.060),
        ("2-1/8 in", 2.125, 0.070),
    ],
)
def test_astm_b280_table_1(label, od_in, wall_in):
    tube = {t.label: t for t in tubes.series("ASTM B280")}[label]
    assert tube.outside_diameter == pytest.approx(od_in * 0.0254, abs=1e-9)
    assert tube.wall == pytest.approx(wall_in * 0.0254, abs=1e-9)


def test_acr_inside_diameters_as_tabulated():
    by_label = {t.label: t for t in tubes.series("ASTM B280")}
    assert by_label["7/8 in"].inside_diameter / 0.0254 == pytest.approx(0.785, abs=5e-4)
    assert by_label["1-1/8 in"].inside_diameter / 0.0254 == pytest.approx(1.025, abs=5e-4)
    assert by_label["1-3/8 in"].inside_diameter / 0.0254 == pytest.approx(1.265, abs=5e-4)


def test_en_12735_1_sizes_from_memory():
    # EN 12735-1 metric refrigeration tube, outside diameter x wall in mm
    # (from memory; verify against the current edition).
    by_label = {t.label: t for t in tubes.series("EN 12735-1")}
    for label, od, wall in [("6 x 1.0 mm", 6, 1.0), ("12 x 1.0 mm", 12, 1.0), ("22 x 1.0 mm", 22, 1.0),
                            ("35 x 1.5 mm", 35, 1.5), ("54 x 2.0 mm", 54, 2.0)]:
        assert by_label[label].outside_diameter == pytest.approx(od / 1e3)
        assert by_label[label].wall == pytest.approx(wall / 1e3)


@pytest.mark.parametrize("name", tubes.names())
def test_series_ascending_with_sources(name):
    sizes = tubes.series(name)
    inside = [t.inside_diameter for t in sizes]
    assert inside == sorted(inside) and len(set(inside)) == len(inside)
    assert all(t.source and ("[pub]" in t.source or "[mem]" in t.source) for t in sizes)
    assert all(0 < t.wall < t.outside_diameter / 4 for t in sizes)


def test_unknown_series_lists_names():
    from coldroom.errors import LookupNameError

    with pytest.raises(LookupNameError, match="EN 12735-1"):
        tubes.series("DIN 1786")
    assert tubes.series("astm-b280") is tubes.series("ASTM B280")


def test_flow_area():
    t = tubes.series("EN 12735-1")[0]
    assert t.flow_area == pytest.approx(math.pi / 4 * 0.004**2)
