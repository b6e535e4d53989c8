"""Invariants of the food property models, the product load and the product table.

Physics and bookkeeping (monotone enthalpy, ice fraction bounds, energy split, monotone
loads), plus the checks every table row must pass. Hypothesis runs derandomized
(tests/conftest.py).
"""

from __future__ import annotations

import math

import pytest
from hypothesis import given, settings
from hypothesis import strategies as st

from coldroom.physics.products import (
    CATEGORIES,
    get_product,
    load_products,
    mix_warnings,
    search_products,
    storage_warnings,
)
from coldroom.errors import CalculationError, LookupNameError
from coldroom.registry import normalise
from coldroom.physics.food import Composition, CompositionModel, siebel
from coldroom.loads.product import (
    explicit_properties,
    packaging_energy,
    product_load,
    product_pulldown,
)

PRODUCTS = list(load_products().values())
KEYS = [p.key for p in PRODUCTS]


@st.composite
def compositions(draw):
    water = draw(st.floats(0.3, 0.97))
    rest = 1.0 - water
    shares = [draw(st.floats(0.0, 1.0)) for _ in range(4)]
    total = sum(shares) or 1.0
    protein, fat, carb, ash = (rest * s / total for s in shares)
    if sum(shares) == 0:
        carb = rest
    fibre = carb * draw(st.floats(0.0, 0.5))
    t_f = draw(st.floats(-15.0, -0.1))
    return CompositionModel(
        Composition(water=water, protein=protein, fat=fat, carbohydrate=carb, fibre=fibre, ash=ash), t_f
    )


temperatures = st.floats(-40.0, 40.0)


# --- property models -----------------------------------------------------------------------


@given(compositions(), temperatures, temperatures)
def test_enthalpy_monotone_increasing(model, a, b):
    lo, hi = sorted((a, b))
    assert model.enthalpy(lo) <= model.enthalpy(hi) + 1e-9


@given(compositions(), temperatures, temperatures)
def test_ice_fraction_bounded_and_decreasing(model, a, b):
    lo, hi = sorted((a, b))
    x_lo, x_hi = model.ice_fraction(lo), model.ice_fraction(hi)
    assert 0.0 <= x_hi <= x_lo <= model.composition.water <= 1.0


@given(compositions(), st.floats(0.0, 40.0))
def test_no_ice_at_or_above_freezing_point(model, above):
    assert model.ice_fraction(model.freezing_point + above) == 0.0


@given(compositions())
def test_enthalpy_continuous_at_freezing_point(model):
    t_f = model.freezing_point
    assert model.enthalpy(t_f - 1e-7) == pytest.approx(model.enthalpy(t_f), abs=1.0)


@given(compositions(), st.floats(-39.0, 39.0))
def test_apparent_specific_heat_is_derivative_of_enthalpy(model, t):
    if abs(t - model.freezing_point) < 0.05:
        return
    dt = 1e-3
    numeric = (model.enthalpy(t + dt) - model.enthalpy(t - dt)) / (2 * dt)
    assert model.specific_heat(t) == pytest.approx(numeric, rel=1e-3)


@pytest.mark.parametrize("key", KEYS)
def test_table_product_enthalpy_monotone_and_positive_cp(key):
    model = get_product(key).properties()
    temps = [-40.0 + 0.5 * i for i in range(161)]
    h = [model.enthalpy(t) for t in temps]
    assert h[0] == pytest.approx(0.0, abs=1e-6)
    assert all(b > a for a, b in zip(h, h[1:]))
    assert all(model.specific_heat(t) > 0 for t in temps)


@pytest.mark.parametrize(
    "key", [p.key for p in PRODUCTS if p.composition.water >= 0.80 and p.composition.fat <= 0.02]
)
def test_siebel_agrees_with_composition_above_freezing(key):
    # High-water, low-fat products: Siebel's solids cp 0.837 kJ/(kg·K) is close enough (~5 %).
    product = get_product(key)
    for t in (0.0, 5.0, 15.0):
        comp = product.properties("composition").specific_heat(t)
        sieb = product.properties("siebel").specific_heat(t)
        assert sieb == pytest.approx(comp, rel=0.055)


# --- product load ----------------------------------------------------------------------------


@given(compositions(), st.floats(0.0, 5000.0), st.floats(0.0, 5000.0), st.floats(-30.0, 30.0),
       st.floats(0.0, 30.0), st.floats(0.0, 30.0))
def test_product_load_monotone_in_mass_and_temperature_difference(model, m1, m2, t3, dt1, dt2):
    lo_m, hi_m = sorted((m1, m2))
    lo_d, hi_d = sorted((dt1, dt2))
    e = lambda m, d: product_pulldown(m, t3 + d, t3, 3600.0, model).daily_energy  # noqa: E731
    assert e(lo_m, hi_d) <= e(hi_m, hi_d) + 1e-6
    assert e(hi_m, lo_d) <= e(hi_m, hi_d) + 1e-6
    # lowering the final temperature also adds load
    assert product_pulldown(hi_m, t3 + hi_d, t3, 3600.0, model).daily_energy <= (
        product_pulldown(hi_m, t3 + hi_d, t3 - 5.0, 3600.0, model).daily_energy + 1e-6
    )


@given(compositions(), st.floats(1.0, 5000.0), st.floats(-35.0, 30.0), st.floats(-35.0, 30.0))
def test_split_adds_up_to_enthalpy_difference(model, mass, a, b):
    t3, t1 = sorted((a, b))
    r = product_pulldown(mass, t1, t3, 7200.0, model)
    assert r.sensible_above >= 0 and r.latent >= 0 and r.sensible_below >= -1e-6
    assert r.daily_energy == pytest.approx(mass * (model.enthalpy(t1) - model.enthalpy(t3)), rel=1e-9, abs=1e-6)
    assert r.pulldown_rate == pytest.approx(r.daily_energy / 7200.0)
    if t3 >= model.freezing_point:
        assert r.latent == 0.0 and r.sensible_below == 0.0
    if model.ice_fraction(t3) > model.ice_fraction(t1):
        assert r.latent > 0.0  # ice forms, so latent heat is released


@settings(max_examples=30)  # each example integrates numerically
@given(compositions(), st.floats(-35.0, 20.0), st.floats(0.5, 30.0))
def test_latent_and_sensible_below_match_an_independent_integration(model, t1, drop):
    """Energy balance by a second route: integrate the sensible specific heat Σ x_i c_i and the
    heat of the forming ice L(t)·(−dx_ice/dt) numerically (scipy quad) and compare with the closed
    forms behind the lines; also bound the latent line by Δx_ice × L at the two ends."""
    from scipy.integrate import quad

    from coldroom.physics.food import water_latent_heat

    t3 = t1 - drop
    r = product_pulldown(1.0, t1, t3, 86400.0, model)
    hi = min(t1, model.freezing_point)
    if t3 >= hi:
        assert r.latent == 0.0 and r.sensible_below == 0.0
        return
    sensible = quad(model.sensible_specific_heat, t3, hi, limit=200)[0]
    ice = lambda t: -model._ice_fraction_slope(t) * water_latent_heat(t)  # noqa: E731
    latent = quad(ice, t3, hi, limit=200)[0]
    assert r.latent == pytest.approx(latent, rel=1e-6, abs=1e-3)
    assert r.sensible_below == pytest.approx(sensible, rel=1e-6, abs=1e-3)
    formed = model.ice_fraction(t3) - model.ice_fraction(t1)
    assert formed * water_latent_heat(t3) - 1e-6 <= r.latent <= formed * water_latent_heat(hi) + 1e-6


@given(st.floats(0.5, 0.95), st.floats(-5.0, -0.2), st.floats(1.0, 30.0), st.floats(-30.0, -6.0))
def test_siebel_pulldown_equals_the_classic_three_term_formula(water, t_f, t1, t3):
    # Q = m[c1(t1 − tf) + hif + c2(tf − t3)] (ASHRAE "Refrigerated-Facility Loads") [pub]
    model = siebel(water, t_f)
    r = product_pulldown(1.0, t1, t3, 86400.0, model)
    classic = model.specific_heat_above * (t1 - t_f) + model.latent_heat + model.specific_heat_below * (t_f - t3)
    assert r.daily_energy == pytest.approx(classic, rel=1e-12)
    assert r.latent == pytest.approx(model.latent_heat)


def test_final_above_entering_raises():
    with pytest.raises(CalculationError, match="above the entering temperature"):
        product_pulldown(100.0, 2.0, 5.0, 3600.0, siebel(0.8, -1.0))
    with pytest.raises(CalculationError):
        packaging_energy(10.0, 2.0, 5.0)


def test_bad_numbers_raise():
    with pytest.raises(CalculationError):
        product_pulldown(-1.0, 5.0, 2.0, 3600.0, siebel(0.8, -1.0))
    with pytest.raises(CalculationError):
        product_pulldown(1.0, 5.0, 2.0, 0.0, siebel(0.8, -1.0))
    with pytest.raises(CalculationError):
        product_pulldown(1.0, math.nan, 2.0, 10.0, siebel(0.8, -1.0))
    with pytest.raises(CalculationError):
        explicit_properties(-1.0, specific_heat_above=3600.0)
    with pytest.raises(LookupNameError):
        packaging_energy(1.0, 5.0, 2.0, material="glass")


@given(st.floats(0.0, 500.0), st.floats(0.0, 500.0), st.floats(0.1, 40.0))
def test_packaging_energy_monotone_and_wood_over_board(m1, m2, dt):
    lo, hi = sorted((m1, m2))
    assert packaging_energy(lo, dt, 0.0) <= packaging_energy(hi, dt, 0.0)
    assert packaging_energy(hi, dt, 0.0, material="corrugated_board") <= packaging_energy(hi, dt, 0.0, material="wood")


def test_product_load_totals_and_lines_agree():
    p = get_product("strawberries")
    load = product_load("strawberries", p.properties(), mass=800.0, entering_temperature=18.0,
                        final_temperature=1.0, pulldown_time=10 * 3600.0, packaging_mass=60.0,
                        packaging_material="plastic", stored_mass=3000.0, room_temperature=1.0,
                        respiration=p.respiration)
    assert sum(v for _, v in load.lines()) == pytest.approx(load.daily_energy)
    assert load.average_power == pytest.approx(load.daily_energy / 86400.0)
    assert load.pulldown_rate > load.average_power  # a 10 h pull-down peaks above the day average
    assert load.respiration.power == pytest.approx(3000.0 * p.respiration_heat(1.0))


def test_respiration_increases_with_temperature_for_every_product():
    for p in PRODUCTS:
        if p.respiration is not None:
            rates = [p.respiration_heat(t) for t in (0.0, 5.0, 10.0, 15.0)]
            assert all(b > a > 0 for a, b in zip(rates, rates[1:])), p.key


# --- the product table -------------------------------------------------------------------------


def test_table_has_at_least_40_products_in_all_groups():
    assert len(PRODUCTS) >= 40
    cats = {p.category for p in PRODUCTS}
    for needed in ("fruit", "vegetable", "meat", "poultry", "fish", "dairy", "eggs", "bakery",
                   "beverage", "frozen_dessert", "cut_flowers"):
        assert needed in cats


@pytest.mark.parametrize("key", KEYS)
def test_every_product_validates(key):
    p = get_product(key)
    c = p.composition
    assert p.key == normalise(p.key) and p.name
    assert p.category in CATEGORIES
    assert c.total == pytest.approx(1.0, abs=0.015)
    assert 0.0 <= c.fibre <= c.carbohydrate
    assert -20.0 < p.freezing_point < 0.0
    lo, hi = p.storage_temperature
    assert -35.0 <= lo <= hi <= 20.0
    if p.is_fresh:
        # chilled goods may be listed slightly below t_f (superchilled meat, eggs), not more
        assert lo >= p.freezing_point - 1.0
    else:
        assert hi < p.freezing_point - 5.0  # frozen storage well below t_f
    if p.storage_humidity is not None:
        assert 0.0 < p.storage_humidity[0] <= p.storage_humidity[1] <= 100.0
    assert p.ethylene in (None, "producer", "sensitive")
    if p.respiration is not None:
        assert p.is_fresh and p.category in ("fruit", "vegetable", "cut_flowers")
    for group in ("composition", "freezing_point", "storage"):
        assert group in p.sources
    if p.respiration is not None:
        assert "respiration" in p.sources
    for text in p.sources.values():
        assert any(tag in text for tag in ("[mem]", "[pub", "[trade]")), text


def test_lookup_is_exact_after_normalising_and_names_are_unique():
    assert get_product("Beef Quarters").key == "beef_quarters"
    assert get_product(" ice-cream ").key == "ice_cream"
    for p in PRODUCTS:
        for alias in p.aliases:
            assert get_product(alias).key == p.key
    with pytest.raises(LookupNameError, match="unknown product 'strawberies'.*strawberries"):
        get_product("strawberies")
    with pytest.raises(LookupNameError):
        get_product("beef quarter")  # no silent guess


def test_search_finds_by_category_and_alias():
    assert {p.key for p in search_products("cut flowers")} == {"roses", "carnations", "chrysanthemums"}
    assert "shrimp" in {p.key for p in search_products("prawn")}
    assert search_products("") == PRODUCTS


# --- storage advice ----------------------------------------------------------------------------


@pytest.mark.parametrize("key", KEYS)
def test_no_warning_in_the_middle_of_the_recommended_range(key):
    p = get_product(key)
    mid_t = sum(p.storage_temperature) / 2
    mid_rh = None if p.storage_humidity is None else sum(p.storage_humidity) / 2
    assert storage_warnings(p, mid_t, mid_rh) == []


def test_storage_warnings_name_the_damage():
    assert "freezing damage" in storage_warnings(get_product("lettuce"), -2.0)[0]
    assert "chilling injury" in storage_warnings(get_product("cucumbers"), 4.0)[0]
    assert "not stay frozen" in storage_warnings(get_product("ice_cream"), -2.0)[0]
    assert "weight loss" in storage_warnings(get_product("carrots"), 0.5, 80.0)[0]
    assert storage_warnings(get_product("beef_quarters"), 8.0)


def test_mix_warnings():
    assert mix_warnings([get_product("apples"), get_product("pears")]) == []
    temps = mix_warnings([get_product("bananas"), get_product("strawberries")])
    assert any("temperature ranges do not overlap" in w for w in temps)
    eth = mix_warnings([get_product("carnations"), get_product("apples"), get_product("tomatoes")])
    assert any("ethylene" in w and "Apples" in w and "Tomatoes" in w for w in eth)
