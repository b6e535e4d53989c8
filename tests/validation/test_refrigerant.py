"""Refrigerant catalogue and property layer against outside references.

References:
- NIST Chemistry WebBook / the reference equations of state (via published
  saturation tables) for a few saturation points, recalled values marked
  "from memory".
- CoolProp 8.0 itself as the reference library for the fast mixture states:
  the fast path (saturation table, imposed-phase P–T Newton, two-phase flash)
  must agree with CoolProp's own P–Q, Q–T, P–H and P–S flashes to 1e-6 K over
  the working envelope (evaporating −45…+10 °C, condensing 20…60 °C).
  CoolProp's P–H and P–S flashes of mixtures cost 0.3–5 s each, so only a
  handful of points go through them (the slowest tests of this file, for
  that reason); the saturation table and the two-phase flash are checked at
  many more points against CoolProp's P–Q flash (a few ms each).
"""

from __future__ import annotations

import math

import pytest

from coldroom.data.refrigerants import CATALOGUE, lookup, names
from coldroom.errors import LookupNameError, PropertyRangeError
from coldroom.data.refrigerants import MIXTURE_CRITICAL_POINTS
from coldroom.physics.refrigerant import coolprop_version, get_fluid

# ----------------------------------------------------------------- catalogue

REQUIRED = [
    "R-134a", "R-404A", "R-507A", "R-407A", "R-407C", "R-407F", "R-448A", "R-449A", "R-452A",
    "R-513A", "R-454C", "R-455A", "R-290", "R-600a", "R-717", "R-744", "R-1234yf", "R-1234ze(E)",
]


def test_catalogue_holds_the_required_refrigerants():
    assert set(REQUIRED) <= set(names())


@pytest.mark.parametrize(
    "spelling, expected",
    [
        ("R448A", "R-448A"), ("R-448A", "R-448A"), ("r448a", "R-448A"),
        ("R-1234ze(E)", "R-1234ze(E)"), ("R1234ZE", "R-1234ze(E)"), ("R1234zeE", "R-1234ze(E)"),
        ("r 134a", "R-134a"), ("NH3", "R-717"), ("co2", "R-744"), ("propane", "R-290"),
    ],
)
def test_lookup_spellings(spelling, expected):
    assert lookup(spelling).name == expected


@pytest.mark.parametrize("bad", ["R999", "R-448", "R1234ZF", "", "water"])
def test_lookup_unknown_raises_with_closest_names(bad):
    with pytest.raises(LookupNameError, match="unknown refrigerant"):
        lookup(bad)


def test_unknown_lists_close_names():
    with pytest.raises(LookupNameError) as info:
        lookup("R448")
    assert "R-448A" in str(info.value)


# ISO 817 / ASHRAE 34 safety groups, from memory [ref:iso-817] [ref:ashrae-34].
SAFETY = {
    "R-134a": "A1", "R-404A": "A1", "R-507A": "A1", "R-407A": "A1", "R-407C": "A1", "R-407F": "A1",
    "R-448A": "A1", "R-449A": "A1", "R-452A": "A1", "R-513A": "A1", "R-744": "A1",
    "R-454C": "A2L", "R-455A": "A2L", "R-1234yf": "A2L", "R-1234ze(E)": "A2L",
    "R-290": "A3", "R-600a": "A3", "R-717": "B2L",
}


@pytest.mark.parametrize("name, cls", sorted(SAFETY.items()))
def test_safety_classes(name, cls):
    info = lookup(name)
    assert info.safety_class == cls
    # a flammable class carries an LFL, a class-1 fluid none
    assert (info.lfl_kg_m3 is not None) == info.flammable


def test_every_value_has_a_source_key():
    for info in CATALOGUE:
        for attr in ("coolprop_name", "safety_class", "gwp_ar4", "gwp_ar5", "lfl_kg_m3", "is_blend"):
            assert info.sources.get(attr), (info.name, attr)
        assert "[mem]" in info.sources["gwp_ar4"] and "AR4" in info.sources["gwp_ar4"]
        assert "AR5" in info.sources["gwp_ar5"]


def test_gwp_values_from_memory():
    # IPCC AR4 100-year GWP, from memory: R-134a 1430, R-404A 3922, R-744 1 (by definition).
    assert lookup("R-134a").gwp_ar4 == 1430
    assert lookup("R-404A").gwp_ar4 == 3922
    assert lookup("R-744").gwp_ar4 == 1 and lookup("R-744").gwp_ar5 == 1
    # IPCC AR5, from memory: R-134a 1300.
    assert lookup("R-134a").gwp_ar5 == 1300


def test_blend_flags_follow_ashrae34_numbering():
    # 400-series zeotropic, 500-series azeotropic (ASHRAE 34 numbering rules).
    assert lookup("R-448A").zeotropic and lookup("R-448A").is_blend
    assert lookup("R-513A").is_blend and not lookup("R-513A").zeotropic
    assert not lookup("R-290").is_blend and not lookup("R-1234ze(E)").is_blend


def test_every_catalogue_entry_loads_in_coolprop():
    assert coolprop_version().startswith("8.")
    for info in CATALOGUE:
        fluid = get_fluid(info.name)
        assert fluid.info is info
        assert fluid.critical_temperature > 25.0  # all have T_c above room temperature


# ------------------------------------------------------ saturation references


def test_r134a_saturation_pressure_at_0c():
    # R-134a at 0 °C: 292.8 kPa (ASHRAE Handbook—Fundamentals refrigerant tables /
    # NIST REFPROP, from memory) [ref:ashrae-fund-refrigerants]. Tolerance 0.2 %.
    assert get_fluid("R-134a").dew_pressure(0.0) == pytest.approx(292.8e3, rel=2e-3)


def test_r134a_saturation_temperature_at_1mpa():
    # Çengel & Boles, Thermodynamics, 7th ed., table A-12: T_sat(1 MPa) = 39.37 °C
    # (from memory) [ref:cengel-boles]. Tolerance 0.05 K (table edition differences).
    assert get_fluid("R-134a").bubble_temperature(1.0e6) == pytest.approx(39.37, abs=0.05)


def test_ammonia_normal_boiling_point():
    # NH3 normal boiling point −33.33 °C at 101.325 kPa (NIST WebBook, from memory).
    assert get_fluid("R-717").dew_temperature(101325.0) == pytest.approx(-33.33, abs=0.05)


def test_co2_triple_and_critical_point():
    # CO2: triple point −56.56 °C / 517.95 kPa, critical point 30.98 °C / 7.3773 MPa
    # (Span & Wagner 1996 EOS, as tabulated in the NIST WebBook; from memory).
    fluid = get_fluid("R-744")
    assert fluid.triple_temperature == pytest.approx(-56.56, abs=0.01)
    assert fluid.minimum_pressure == pytest.approx(517.95e3, rel=1e-3)
    assert fluid.critical_temperature == pytest.approx(30.98, abs=0.01)
    assert fluid.critical_pressure == pytest.approx(7.3773e6, rel=1e-4)


def test_pseudo_pure_models_agree_with_full_mixture_model():
    # The catalogue prefers CoolProp's pseudo-pure R-404A/R-407C/R-507A; check them
    # against CoolProp's own multi-fluid mixture model (the reference library):
    # dew pressure at −10 °C within 0.05 %, bubble temperature at the 40 °C dew
    # pressure within 0.05 K, and the latent part of the refrigerating effect within 0.2 %.
    from CoolProp.CoolProp import AbstractState
    import CoolProp.CoolProp as CP

    for pseudo, mix in [("R-404A", "R404A.mix"), ("R-407C", "R407C.mix"), ("R-507A", "R507A.mix")]:
        fluid = get_fluid(pseudo)
        ref = AbstractState("HEOS", mix)
        ref.update(CP.QT_INPUTS, 1.0, 263.15)
        assert fluid.dew_pressure(-10.0) == pytest.approx(ref.p(), rel=5e-4)
        h_dew = ref.hmass()
        ref.update(CP.QT_INPUTS, 1.0, 313.15)
        pc = ref.p()
        ref.update(CP.PQ_INPUTS, pc, 0.0)
        assert fluid.bubble_temperature(fluid.dew_pressure(40.0)) == pytest.approx(ref.T() - 273.15, abs=0.05)
        effect_ref = h_dew - ref.hmass()
        effect = fluid.saturated_vapour(temperature=-10.0).h - fluid.saturated_liquid(pressure=fluid.dew_pressure(40.0)).h
        assert effect == pytest.approx(effect_ref, rel=2e-3)


def test_stored_mixture_critical_point_matches_coolprop():
    # The stored table must be what CoolProp 8.0 computes (R452A.mix is the
    # quickest to recompute, ~0.5 s; the others take up to 7 s each).
    from CoolProp.CoolProp import AbstractState

    points = [(c.T, c.p) for c in AbstractState("HEOS", "R452A.mix").all_critical_points() if c.p > 0]
    t, p = max(points)
    assert MIXTURE_CRITICAL_POINTS["R452A.mix"] == pytest.approx((t, p), rel=1e-9)


def test_r448a_glide_about_six_kelvin():
    # R-448A glide at evaporating conditions ≈ 6 K (manufacturer literature, from
    # memory; commonly quoted 6.2 K at −10 °C dew). Tolerance 0.7 K.
    fluid = get_fluid("R-448A")
    assert fluid.glide(fluid.dew_pressure(-10.0)) == pytest.approx(6.2, abs=0.7)


# ------------------------------------------------------------------- guards


def test_co2_below_triple_pressure_is_refused():
    # PropsSI('T','P',2e5,'Q',1,'R744') returns ≈197 K (below the triple point) without
    # error in CoolProp 8.0: our layer must refuse instead.
    with pytest.raises(PropertyRangeError, match="below the triple"):
        get_fluid("R-744").dew_temperature(2e5)


def test_below_triple_temperature_is_refused():
    with pytest.raises(PropertyRangeError, match="below the triple"):
        get_fluid("R-744").dew_pressure(-60.0)


@pytest.mark.parametrize("name, t", [("R-744", 31.5), ("R-134a", 102.0), ("R-448A", 82.0)])
def test_saturation_above_critical_is_refused(name, t):
    with pytest.raises(PropertyRangeError, match="critical"):
        get_fluid(name).dew_pressure(t)


def test_saturation_pressure_above_critical_is_refused():
    with pytest.raises(PropertyRangeError, match="critical"):
        get_fluid("R-744").bubble_temperature(8e6)


def test_pure_fluid_pt_at_saturation_is_refused():
    # p and T of a pure fluid on its saturation line do not fix the state.
    fluid = get_fluid("R-134a")
    p = fluid.dew_pressure(0.0)
    with pytest.raises(PropertyRangeError, match="two-phase"):
        fluid.state_pt(p, fluid.dew_temperature(p))


def test_pseudo_pure_pt_inside_glide_is_refused():
    fluid = get_fluid("R-407C")
    p = fluid.dew_pressure(0.0)
    t_mid = 0.5 * (fluid.bubble_temperature(p) + fluid.dew_temperature(p))
    with pytest.raises(PropertyRangeError, match="two-phase"):
        fluid.state_pt(p, t_mid)


def test_non_finite_input_is_refused():
    with pytest.raises(PropertyRangeError):
        get_fluid("R-134a").dew_pressure(math.nan)
    with pytest.raises(PropertyRangeError):
        get_fluid("R-134a").state_ph(-5.0, 300e3)


# ------------------------------------------- fast mixture states vs CoolProp

# (refrigerant, evaporating dew °C, condensing dew °C, which state): a handful of
# points spread over the envelope; each needs one slow reference flash.
ENVELOPE = [
    ("R-448A", -45.0, 20.0, "2s"),
    ("R-454C", -45.0, 60.0, "2s"),
    ("R-454C", 5.0, 25.0, "4"),
    ("R-407F", -25.0, 50.0, "2"),
    ("R-455A", -35.0, 45.0, "4"),
    ("R-449A", 0.0, 55.0, "3"),
]


def _fast_and_reference(fluid, te, tc, which):
    """The state the cycle needs, by the fast path and by CoolProp's own flash."""
    pe, pc = fluid.dew_pressure(te), fluid.dew_pressure(tc)
    suction = fluid.state_pt(pe, te + 8.0)
    if which in ("2s", "2"):
        h2s = fluid.state_ps(pc, suction.s).h
        if which == "2s":
            return fluid.state_ps(pc, suction.s), fluid.state_ps(pc, suction.s, method="flash")
        h2 = suction.h + (h2s - suction.h) / 0.65
        return fluid.state_ph(pc, h2), fluid.state_ph(pc, h2, method="flash")
    liquid = fluid.state_pt(pc, fluid.bubble_temperature(pc) - 3.0)
    if which == "3":
        return fluid.state_ph(pc, liquid.h), fluid.state_ph(pc, liquid.h, method="flash")
    return fluid.state_ph(pe, liquid.h), fluid.state_ph(pe, liquid.h, method="flash")


# More points whose reference is CoolProp's full P–T flash (its own phase
# stability analysis, no imposed phase) at the temperature the fast path found:
# it must give back the enthalpy or entropy asked for (1e-9 relative, ~1e-7 K).
PT_ENVELOPE = [
    ("R-448A", -10.0, 40.0, "2"),
    ("R-448A", 10.0, 60.0, "4"),
    ("R-448A", -30.0, 60.0, "3"),
    ("R-448A", -45.0, 55.0, "2s"),
    ("R-449A", -35.0, 30.0, "4"),
    ("R-452A", -20.0, 45.0, "2"),
    ("R-407A", 0.0, 50.0, "3"),
]


@pytest.mark.parametrize("name, te, tc, which", PT_ENVELOPE)
def test_fast_mixture_states_match_coolprop_pt_flash(name, te, tc, which):
    import CoolProp.CoolProp as CP

    fluid = get_fluid(name)
    pe, pc = fluid.dew_pressure(te), fluid.dew_pressure(tc)
    suction = fluid.state_pt(pe, te + 8.0)
    liquid = fluid.state_pt(pc, fluid.bubble_temperature(pc) - 3.0)
    h2s = fluid.state_ps(pc, suction.s).h
    p, prop, target = {
        "2s": (pc, "s", suction.s),
        "2": (pc, "h", suction.h + (h2s - suction.h) / 0.65),
        "3": (pc, "h", liquid.h),
        "4": (pe, "h", liquid.h),
    }[which]
    fast = fluid.state_ps(p, target) if prop == "s" else fluid.state_ph(p, target)
    ref = _coolprop_mixture(fluid)
    ref.update(CP.PT_INPUTS, p, fast.t + 273.15)
    assert (ref.smass() if prop == "s" else ref.hmass()) == pytest.approx(target, rel=1e-9)
    assert fast.density == pytest.approx(ref.rhomass(), rel=1e-7)
    assert (fast.quality is not None) == (which == "4")


@pytest.mark.parametrize("name, te, tc, which", ENVELOPE)
def test_fast_mixture_states_match_coolprop_flash(name, te, tc, which):
    fluid = get_fluid(name)
    assert fluid.info.model == "mixture"
    fast, ref = _fast_and_reference(fluid, te, tc, which)
    assert fast.t == pytest.approx(ref.t, abs=1e-6)
    assert fast.h == pytest.approx(ref.h, rel=1e-8)
    assert fast.s == pytest.approx(ref.s, rel=1e-8)
    assert fast.density == pytest.approx(ref.density, rel=1e-7)
    if which == "4":
        assert fast.quality == pytest.approx(ref.quality, abs=1e-7)
    else:
        assert fast.quality is None


# ------------------------------------- mixture saturation table and flash


def _coolprop_mixture(fluid):
    from CoolProp.CoolProp import AbstractState

    return AbstractState("HEOS", fluid.info.coolprop_name)


@pytest.mark.parametrize("name", ["R-448A", "R-454C", "R-407F"])
def test_saturation_table_matches_coolprop_pq_flash(name):
    # dew and bubble temperatures from the table against CoolProp's own P–Q
    # flash on a fresh state, at pressures between the table's nodes over the
    # working envelope (−45 °C dew to 60 °C dew): 1e-6 K
    import CoolProp.CoolProp as CP

    fluid = get_fluid(name)
    fluid.clear_cache()
    ref = _coolprop_mixture(fluid)
    p_low, p_high = fluid.dew_pressure(-45.0), fluid.dew_pressure(60.0)
    for i in range(9):
        p = p_low * (p_high / p_low) ** ((i + 0.37) / 9)
        for quality in (0.0, 1.0):
            ref.update(CP.PQ_INPUTS, p, quality)
            state = fluid.saturated_state(quality, pressure=p)
            assert state.t == pytest.approx(ref.T() - 273.15, abs=1e-6), (p, quality)
            assert state.h == pytest.approx(ref.hmass(), rel=1e-8)
            assert state.s == pytest.approx(ref.smass(), rel=1e-8)
            assert state.density == pytest.approx(ref.rhomass(), rel=1e-7)
            # the table's own density series (it seeds the EOS's density solve)
            assert fluid._table.density(math.log(p), quality) == pytest.approx(ref.rhomass(), rel=1e-6)


def test_saturation_table_by_temperature_matches_coolprop_qt_flash():
    import CoolProp.CoolProp as CP

    fluid = get_fluid("R-448A")
    fluid.clear_cache()
    ref = _coolprop_mixture(fluid)
    for t in (-43.21, -18.7, 3.3, 37.9, 58.1):
        for quality in (0.0, 1.0):
            ref.update(CP.QT_INPUTS, quality, t + 273.15)
            state = fluid.saturated_state(quality, temperature=t)
            assert state.p == pytest.approx(ref.p(), rel=1e-8), (t, quality)
            assert state.t == pytest.approx(t, abs=1e-12)
            assert state.h == pytest.approx(ref.hmass(), rel=1e-8)


@pytest.mark.parametrize("name", ["R-448A", "R-455A"])
def test_two_phase_flash_matches_coolprop_pq_flash(name):
    # the isobaric flash at a given h, s or t returns a vapour fraction; CoolProp's
    # own P–Q flash at that fraction must give the same temperature and h
    import CoolProp.CoolProp as CP

    fluid = get_fluid(name)
    ref = _coolprop_mixture(fluid)
    for t_dew in (-40.0, -8.0, 35.0):
        p = fluid.dew_pressure(t_dew)
        bub, dew = fluid.saturated_liquid(pressure=p), fluid.saturated_vapour(pressure=p)
        for w in (0.03, 0.4, 0.93):
            for state in (
                fluid.state_ph(p, bub.h + w * (dew.h - bub.h)),
                fluid.state_ps(p, bub.s + w * (dew.s - bub.s)),
                fluid.state_pt(p, bub.t + w * (dew.t - bub.t)),
            ):
                assert 0.0 < state.quality < 1.0
                ref.update(CP.PQ_INPUTS, p, state.quality)
                assert state.t == pytest.approx(ref.T() - 273.15, abs=1e-6)
                assert state.h == pytest.approx(ref.hmass(), rel=1e-8)
                assert state.s == pytest.approx(ref.smass(), rel=1e-8)
                assert state.density == pytest.approx(ref.rhomass(), rel=1e-7)


def test_failed_saturation_is_remembered(monkeypatch):
    fluid = get_fluid("R-134a")
    fluid.clear_cache()
    calls = []

    def failing(given, value, quality):
        calls.append((given, value, quality))
        raise PropertyRangeError("R-134a: no saturation state (simulated)")

    monkeypatch.setattr(fluid, "_saturation_raw", failing)
    for _ in range(3):
        with pytest.raises(PropertyRangeError, match="simulated"):
            fluid.dew_pressure(-12.345)
    assert len(calls) == 1
    fluid.clear_cache()


@pytest.mark.parametrize("name", ["R-448A", "R-134a"])
def test_a_vapour_state_needs_no_bubble_point(name, monkeypatch):
    fluid = get_fluid(name)
    fluid.clear_cache()
    p = fluid.dew_pressure(5.0)
    asked = []
    original = fluid.saturated_state

    def spy(quality, temperature=None, pressure=None):
        asked.append(quality)
        return original(quality, temperature=temperature, pressure=pressure)

    monkeypatch.setattr(fluid, "saturated_state", spy)
    dew_h = original(1.0, pressure=p).h
    fluid.state_ph(p, dew_h + 40e3)
    fluid.state_pt(p, 30.0)
    assert 0.0 not in asked


# ------------------------------------------------------ one range guard

EXTREME = [dict(isentropic_efficiency=1e-4), dict(isentropic_efficiency=0.01, superheat=60.0)]


@pytest.mark.parametrize("name", ["R-134a", "R-404A", "R-448A", "R-454C", "R-290"])
@pytest.mark.parametrize("extreme", EXTREME, ids=["eta 1e-4", "eta 0.01 + 60 K superheat"])
def test_absurd_discharge_is_refused_alike_for_pure_fluids_and_blends(name, extreme):
    # The blend path once reported thousands of °C here while pure fluids were
    # refused; both now stop at the same limit (1.5 × the EOS maximum
    # temperature, where CoolProp's own flash stops) with the same message.
    from coldroom.physics.cycle import solve_cycle

    with pytest.raises(PropertyRangeError, match="above the maximum temperature"):
        solve_cycle(name, -10.0, 25.0, 5000.0, **extreme)


def test_range_guard_is_the_same_for_flash_and_fast_path():
    fluid = get_fluid("R-448A")
    p = fluid.dew_pressure(40.0)
    top = fluid.maximum_temperature
    assert top == pytest.approx(1.5 * (fluid._state.Tmax()) - 273.15)
    hot = fluid.state_pt(p, top - 1.0)
    # just below the limit both paths agree; past it both refuse
    assert fluid.state_ph(p, hot.h).t == pytest.approx(top - 1.0, abs=1e-6)
    with pytest.raises(PropertyRangeError, match="above the maximum temperature"):
        fluid.state_ph(p, hot.h + 50e3)
    with pytest.raises(PropertyRangeError, match="above the maximum temperature"):
        fluid.state_pt(p, top + 1.0)
    pure = get_fluid("R-134a")
    with pytest.raises(PropertyRangeError, match="above the maximum temperature"):
        pure.state_ph(p, pure.state_pt(p, pure.maximum_temperature - 1.0).h + 50e3)
