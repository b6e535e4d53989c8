"""Validation of coldroom.equipment against hand calculations and CoolProp as a reference library.

Sources named beside each check:
- AHRI Standard 540 / EN 12900: the ten-coefficient polynomial form and its
  coefficient order [pub] [ref:ahri-540] [ref:en-12900];
  EN 12900 rating conditions 10 K superheat, 0 K subcooling (from memory).
- Stoecker & Jones, *Refrigeration and Air Conditioning*, 2nd ed., chapter
  "Compressors": clearance volumetric efficiency η = 1 + C − C·v_suc/v_dis
  (from memory; verify) [ref:stoecker-jones].
- Rice & Dabiri suction-density correction ṁ = ṁ_map·[1 + F(ρ/ρ_map − 1)]
  [pub; F = 0.75 from memory] [ref:dabiri-rice-1981].
- CoolProp 8 ``PropsSI`` as the reference property library (the model uses
  coldroom.physics.refrigerant; the tests compute the same states independently) [ref:coolprop].
- Hand-worked balance-point examples: every input stated, arithmetic written out.
"""

from __future__ import annotations

import math

import pytest

from coldroom import equipment as E
from coldroom.errors import CalculationError

CP = pytest.importorskip("CoolProp.CoolProp")

BTU_PER_HOUR = 1055.05585262 / 3600.0  # W, International Table Btu (NIST SP 811)


# --------------------------------------------------------------------------- polynomial


def test_polynomial_hand_calculation_si() -> None:
    """AHRI 540 / EN 12900 form [pub], coefficients invented, S = −10 °C, D = 40 °C.

    C = [1000, 50, −10, 0.5, −0.2, 0.01, 0.001, 0.002, −0.0005, 0.0001]
    C1            = 1000
    C2·S          = 50·(−10)               = −500
    C3·D          = −10·40                 = −400
    C4·S²         = 0.5·100                = 50
    C5·S·D        = −0.2·(−10)·40          = 80
    C6·D²         = 0.01·1600              = 16
    C7·S³         = 0.001·(−1000)          = −1
    C8·D·S²       = 0.002·40·100           = 8
    C9·S·D²       = −0.0005·(−10)·1600     = 8
    C10·D³        = 0.0001·64000           = 6.4
    sum           = 267.4
    """
    c = [1000.0, 50.0, -10.0, 0.5, -0.2, 0.01, 0.001, 0.002, -0.0005, 0.0001]
    assert E.ahri540_polynomial(c, -10.0, 40.0) == pytest.approx(267.4, abs=1e-9)


def test_polynomial_term_order_is_the_published_one() -> None:
    """Each coefficient multiplies the published term (AHRI 540 order [pub]): S = 2, D = 3."""
    terms = [1, 2, 3, 4, 6, 9, 8, 3 * 4, 2 * 9, 27]  # 1, S, D, S², SD, D², S³, D·S², S·D², D³
    for i, expected in enumerate(terms):
        c = [0.0] * 10
        c[i] = 1.0
        assert E.ahri540_polynomial(c, 2.0, 3.0) == expected, f"C{i + 1}"


def test_polynomial_needs_ten_coefficients() -> None:
    with pytest.raises(CalculationError, match="10 coefficients"):
        E.ahri540_polynomial([1.0] * 9, 0.0, 40.0)


def test_ip_polynomial_is_read_in_fahrenheit_and_btu_per_hour() -> None:
    """An IP (°F, Btu/h) capacity polynomial evaluated at S = 20 °F, D = 110 °F by hand.

    C = [20000, 300, −50] + zeros: X = 20000 + 300·20 − 50·110 = 20000 + 6000 − 5500
    = 20500 Btu/h = 20500 × 0.29307107 W = 6007.96 W (1 Btu/h = 0.29307107 W, NIST SP 811).
    """
    model = E.PolynomialCompressor(
        refrigerant="R-134a",
        capacity_coefficients=(20000.0, 300.0, -50.0) + (0.0,) * 7,
        power_coefficients=(1000.0,) + (0.0,) * 9,
        envelope=E.Envelope(-20.0, 10.0, 25.0, 60.0),
        operating=E.OperatingConditions(10.0, 0.0, 0.0),
        temperature_unit="F",
        capacity_factor=BTU_PER_HOUR,
    )
    s_c = (20.0 - 32.0) / 1.8
    d_c = (110.0 - 32.0) / 1.8
    capacity, power, mass_flow = model.map_values(s_c, d_c)
    assert capacity == pytest.approx(20500.0 * 0.29307107, rel=1e-7)
    assert power == pytest.approx(1000.0)
    assert mass_flow is None


def _r134a_polynomial(operating: E.OperatingConditions, factor: float = 0.75) -> E.PolynomialCompressor:
    # Invented coefficients (no real compressor): capacity W, power W at 10 K superheat, 0 K subcooling.
    return E.PolynomialCompressor(
        refrigerant="R-134a",
        capacity_coefficients=(6000.0, 200.0, -40.0, 2.0, -1.0, 0.0, 0.0, 0.0, 0.0, 0.0),
        power_coefficients=(400.0, -10.0, 40.0, 0.0, 0.0, 0.0, 0.0, 0.0, 0.0, 0.0),
        envelope=E.Envelope(-25.0, 10.0, 25.0, 60.0),
        operating=operating,
        rating_superheat=10.0,
        rating_subcooling=0.0,
        density_correction_factor=factor,
    )


def test_polynomial_at_en12900_rating_conditions_is_the_polynomial() -> None:
    """At the polynomial's own rating conditions (EN 12900: 10 K superheat, 0 K subcooling,
    from memory) no correction applies: capacity and power are the polynomial values.

    S = −10, D = 40: capacity = 6000 − 2000 − 1600 + 200 + 400 = 3000 W;
    power = 400 + 100 + 1600 = 2100 W.
    """
    model = _r134a_polynomial(E.OperatingConditions(superheat=10.0, suction_line_superheat=0.0, subcooling=0.0))
    point = model.performance(-10.0, 40.0)
    assert point.capacity == pytest.approx(3000.0, rel=1e-9)
    assert point.power == pytest.approx(2100.0, rel=1e-9)
    assert point.heat_rejection == pytest.approx(5100.0, rel=1e-9)


@pytest.mark.parametrize("factor", [1.0, 0.75])
def test_suction_density_correction_against_coolprop(factor: float) -> None:
    """Rice & Dabiri [pub] with F = 1 (ṁ ∝ ρ) and F = 0.75, densities from CoolProp PropsSI.

    Rating: R-134a, S −10 °C, D 40 °C, 10 K superheat, 0 K subcooling, capacity 3000 W.
    Project: 5 K + 15 K = 20 K at the compressor, 5 K useful, 0 K subcooling.
    """
    fluid = "R134a"
    p_e = CP.PropsSI("P", "T", 263.15, "Q", 1, fluid)
    p_c = CP.PropsSI("P", "T", 313.15, "Q", 1, fluid)
    h_liq = CP.PropsSI("H", "P", p_c, "Q", 0, fluid)
    h_map = CP.PropsSI("H", "P", p_e, "T", 273.15, fluid)
    rho_map = CP.PropsSI("D", "P", p_e, "T", 273.15, fluid)
    h_suc = CP.PropsSI("H", "P", p_e, "T", 283.15, fluid)
    rho_suc = CP.PropsSI("D", "P", p_e, "T", 283.15, fluid)
    h_evap = CP.PropsSI("H", "P", p_e, "T", 268.15, fluid)
    m_map = 3000.0 / (h_map - h_liq)
    m = m_map * (1.0 + factor * (rho_suc / rho_map - 1.0))
    expected_capacity = m * (h_evap - h_liq)
    model = _r134a_polynomial(E.OperatingConditions(superheat=5.0, suction_line_superheat=15.0, subcooling=0.0), factor)
    point = model.performance(-10.0, 40.0)
    assert point.mass_flow == pytest.approx(m, rel=2e-4)
    assert point.capacity == pytest.approx(expected_capacity, rel=2e-4)
    # power corrected by ṁ ratio × isentropic-work ratio (Dabiri & Rice, from memory)
    s_map = CP.PropsSI("S", "P", p_e, "T", 273.15, fluid)
    s_suc = CP.PropsSI("S", "P", p_e, "T", 283.15, fluid)
    dh_map = CP.PropsSI("H", "P", p_c, "S", s_map, fluid) - h_map
    dh = CP.PropsSI("H", "P", p_c, "S", s_suc, fluid) - h_suc
    assert point.power == pytest.approx(2100.0 * (m / m_map) * (dh / dh_map), rel=2e-4)


# --------------------------------------------------------------------------- rated point


def test_rated_point_swept_volume_against_coolprop_hand_calculation() -> None:
    """R-134a rated 5 kW at EN 12900 conditions −10/45 °C, 10 K superheat, 0 K subcooling
    (from memory), clearance C = 0.04. By hand with CoolProp PropsSI:

    ṁ = Q/(h1 − h3); V̇ = ṁ/ρ1; η_v = 1 + C − C·ρ2s/ρ1 (Stoecker & Jones, from memory);
    V_sw = V̇/η_v.
    """
    fluid = "R134a"
    p_e = CP.PropsSI("P", "T", 263.15, "Q", 1, fluid)
    p_c = CP.PropsSI("P", "T", 318.15, "Q", 1, fluid)
    h1 = CP.PropsSI("H", "P", p_e, "T", 273.15, fluid)
    rho1 = CP.PropsSI("D", "P", p_e, "T", 273.15, fluid)
    s1 = CP.PropsSI("S", "P", p_e, "T", 273.15, fluid)
    h3 = CP.PropsSI("H", "P", p_c, "Q", 0, fluid)
    rho2s = CP.PropsSI("D", "P", p_c, "S", s1, fluid)
    m = 5000.0 / (h1 - h3)
    eta_v = 1.04 - 0.04 * rho2s / rho1
    swept = m / rho1 / eta_v
    model = E.RatedPointCompressor.from_rating("R-134a", 5000.0, -10.0, 45.0, superheat=10.0, subcooling=0.0, clearance=0.04)
    assert model.swept_volume == pytest.approx(swept, rel=2e-4)
    # sanity of the hand numbers themselves: η_v of a 4 % clearance at pressure ratio ≈ 5.8
    assert 0.8 < eta_v < 0.9


def test_rated_point_power_gives_isentropic_efficiency() -> None:
    """η_is = ṁ·(h2s − h1)/P at the rating (definition of the overall isentropic efficiency)."""
    fluid = "R134a"
    p_e = CP.PropsSI("P", "T", 263.15, "Q", 1, fluid)
    p_c = CP.PropsSI("P", "T", 318.15, "Q", 1, fluid)
    h1 = CP.PropsSI("H", "P", p_e, "T", 273.15, fluid)
    s1 = CP.PropsSI("S", "P", p_e, "T", 273.15, fluid)
    h3 = CP.PropsSI("H", "P", p_c, "Q", 0, fluid)
    h2s = CP.PropsSI("H", "P", p_c, "S", s1, fluid)
    m = 5000.0 / (h1 - h3)
    model = E.RatedPointCompressor.from_rating("R-134a", 5000.0, -10.0, 45.0, superheat=10.0, power=2400.0)
    assert model.isentropic_efficiency == pytest.approx(m * (h2s - h1) / 2400.0, rel=2e-4)


def test_clearance_model_equals_pressure_ratio_form_for_an_ideal_gas() -> None:
    """For an ideal gas on an isentrope ρ2/ρ1 = (p2/p1)^(1/κ), so the density form equals the
    textbook η_v = 1 + C − C·(p_c/p_e)^(1/n) with n = κ ([mem] [ref:stoecker-jones])."""
    kappa, ratio, c = 1.12, 6.0, 0.05
    assert E.clearance_volumetric_efficiency(c, 1.0, ratio ** (1.0 / kappa)) == pytest.approx(
        1.0 + c - c * ratio ** (1.0 / kappa), rel=1e-12
    )


def test_inconsistent_swept_volume_is_refused() -> None:
    with pytest.raises(CalculationError, match="swept volume"):
        E.RatedPointCompressor.from_rating("R-134a", 5000.0, -10.0, 45.0, swept_volume=1.0 / 3600.0)


# --------------------------------------------------------------------------- balance point


def test_balance_point_hand_worked_linear_example() -> None:
    """Hand-worked example (all inputs stated, invented):

    compressor Q = 3000 + 100·S W (independent of D), THR = 1.3·Q;
    unit cooler 4000 W at DT1 10 K → K_e = 400 W/K (EN 328 K·DT1, from memory [ref:en-328]), room +2 °C;
    condenser 7500 W at 15 K → K_c = 500 W/K, ambient 30 °C.
    3000 + 100·S = 400·(2 − S) → 500·S = 800 − 3000 → S = −4.4 °C; Q = 2560 W;
    THR = 3328 W = 500·(D − 30) → D = 36.656 °C.
    """
    evaporator = E.HeatExchanger.from_rating(4000.0, 10.0, "unit cooler")
    condenser = E.HeatExchanger.from_rating(7500.0, 15.0, "condenser")
    assert evaporator.conductance == pytest.approx(400.0)
    assert condenser.conductance == pytest.approx(500.0)
    bp = E.balance_point(lambda s, d: (3000 + 100 * s, 1.3 * (3000 + 100 * s)), evaporator, condenser, 2.0, 30.0)
    assert bp.suction_dew == pytest.approx(-4.4, abs=1e-6)
    assert bp.compressor_capacity == pytest.approx(2560.0, rel=1e-6)
    assert bp.discharge_dew == pytest.approx(36.656, abs=1e-6)


def test_balance_point_hand_worked_coupled_example() -> None:
    """Hand-worked example where capacity depends on D (invented, all inputs stated):

    Q = 4000 + 120·S − 30·D, THR = Q + 1500 (constant power 1500 W);
    K_e = 500 W/K at room −18 °C; K_c = 400 W/K at 32 °C.
    (1) 4000 + 120 S − 30 D = 500(−18 − S) → 620 S − 30 D = −13000
    (2) 5500 + 120 S − 30 D = 400(D − 32) → 120 S − 430 D = −18300
    From (1): D = (620 S + 13000)/30; into (2): 120 S − 430(620 S + 13000)/30 = −18300
    → 3600 S − 266600 S − 5590000 = −549000 → −263000 S = 5041000 → S = −19.1673 °C;
    D = (620·(−19.1673) + 13000)/30 = 36.2243 °C.
    """
    comp = lambda s, d: (4000 + 120 * s - 30 * d, 5500 + 120 * s - 30 * d)  # noqa: E731
    bp = E.balance_point(comp, E.HeatExchanger(500.0), E.HeatExchanger(400.0), -18.0, 32.0)
    s = -5041000.0 / 263000.0
    assert bp.suction_dew == pytest.approx(s, abs=1e-5)
    assert bp.discharge_dew == pytest.approx((620 * s + 13000) / 30, abs=1e-5)


def test_fixed_tds_give_the_sizing_temperatures() -> None:
    """Without unit-cooler and condenser data S = room − TD, D = ambient + TD (documented choice)."""
    bp = E.balance_point(
        lambda s, d: (1000.0, 1500.0),
        E.HeatExchanger.fixed(6.0, "sizing TD"),
        E.HeatExchanger.fixed(10.0, "sizing TD"),
        -18.0,
        32.0,
    )
    assert (bp.suction_dew, bp.discharge_dew) == (-24.0, 42.0)


def test_run_hours_needed_follows_the_ashrae_required_capacity_relation() -> None:
    """Required capacity = (1 + SF)·E/run hours (ASHRAE Handbook—Refrigeration,
    "Refrigerated-Facility Loads" [pub]) solved for the hours. Linear compressor as above:
    capacity 2560 W; E = 150 MJ/day, SF 10 %: hours = 1.1·150e6/2560/3600 = 17.904 h."""
    class Linear:
        refrigerant = "none"
        model = "linear test"
        notes = ()

        def performance(self, s, d, *, check_envelope=True, discharge=True):  # type: ignore[no-untyped-def]
            q = 3000 + 100 * s
            return E.CompressorPoint(s, d, q, 0.3 * q, 0.01, 1.3 * q, 80.0, 4.0, True)

        def flags(self, point):  # type: ignore[no-untyped-def]
            return []

    result = E.check_unit(
        Linear(),
        E.HeatExchanger(400.0),
        E.HeatExchanger(500.0),
        room_temperature=2.0,
        ambient_temperature=30.0,
        daily_energy=150e6,
        safety_factor=0.10,
        run_time=16 * 3600.0,
        chart_ambients=(),
        search_max_ambient=False,
    )
    assert result.capacity_at_balance == pytest.approx(2560.0, rel=1e-6)
    assert result.run_hours_needed == pytest.approx(1.1 * 150e6 / 2560.0 / 3600.0, rel=1e-6)
    assert result.required_capacity == pytest.approx(1.1 * 150e6 / (16 * 3600.0))
    assert result.holds is (17.904 <= 16.0)
    assert result.margin_percent == pytest.approx((2560.0 / (1.1 * 150e6 / 57600.0) - 1) * 100, rel=1e-6)
    assert math.isclose(result.margin_percent, -10.6, abs_tol=0.1)


# --------------------------------------------------------------------------- rating table


def test_rating_table_subcooling_correction_against_coolprop() -> None:
    """A rating table (invented: R-134a, 3000 W at SST −10 °C / 32 °C ambient, 10 K superheat, 0 K
    subcooling) run at 5 K useful superheat + 5 K in the suction line and 4 K subcooling: the
    capacity is the table's times the refrigerating-effect ratio, ṁ = Q/(h1 − h3) held, by hand
    with CoolProp PropsSI (the nominal condensing temperature 32 + 10 = 42 °C dew)."""
    from coldroom.equipment.rating_table import RatingTableUnit

    table = RatingTableUnit(
        refrigerant="R134a", evaporating_temperatures=(-20.0, -10.0), ambient_temperatures=(25.0, 32.0),
        capacity=((2200.0, 3200.0), (2000.0, 3000.0)), power=((1300.0, 1500.0), (1400.0, 1600.0)),
        condenser_td=10.0, operating=E.OperatingConditions(superheat=5.0, suction_line_superheat=5.0, subcooling=4.0),
        rating_superheat=10.0, rating_subcooling=0.0,
    )
    fluid = "R134a"
    p_e = CP.PropsSI("P", "T", 263.15, "Q", 1, fluid)
    p_c = CP.PropsSI("P", "T", 315.15, "Q", 1, fluid)
    t_bubble = CP.PropsSI("T", "P", p_c, "Q", 0, fluid)
    h_liq_rated = CP.PropsSI("H", "P", p_c, "Q", 0, fluid)
    h_liq = CP.PropsSI("H", "P", p_c, "T", t_bubble - 4.0, fluid)
    h_rated = CP.PropsSI("H", "P", p_e, "T", 273.15, fluid)
    h_out = CP.PropsSI("H", "P", p_e, "T", 268.15, fluid)
    point = table.performance(-10.0, 42.0)
    assert point.capacity == pytest.approx(3000.0 * (h_out - h_liq) / (h_rated - h_liq_rated), rel=2e-4)
    assert point.power == 1600.0
