"""Invariants of coldroom.equipment: round trips, monotonicity, balance equations, envelope refusal.

Property checks use hypothesis (derandomized profile in tests/conftest.py) with a
small number of examples: each evaluation calls the refrigerant model.
"""

from __future__ import annotations

import pytest

from coldroom.units import format_terms
from hypothesis import given, settings
from hypothesis import strategies as st

from coldroom import equipment as E

pytest.importorskip("CoolProp")

RATING = E.OperatingConditions(superheat=10.0, suction_line_superheat=0.0, subcooling=0.0)
PROJECT = E.OperatingConditions(superheat=5.0, suction_line_superheat=5.0, subcooling=2.0)

#: An invented R-448A medium-temperature compressor (not a real product): coefficients
#: fitted by us to the rated-point model of a 4.5 kW at −10/45 °C unit; SI units (°C, W,
#: kg/h), 10 K superheat, 0 K subcooling, envelope S −20…+10 °C, D 25…60 °C.
MT_CAPACITY = (11360.7, 417.315, -86.9708, 6.09574, -2.34162, -0.197866, 0.0323089, -0.0365542, -0.0103052, -0.000510628)
MT_POWER = (15.3758, -70.0328, 69.8006, -1.94523, 2.29248, -0.209775, -0.0142633, 0.0203157, -0.00244071, -0.00176111)
MT_MASS_FLOW = (186.925, 6.40637, -0.283865, 0.0854366, 0.000397358, -0.00120381, 0.000552383, 6.25048e-06, -2.22293e-05, -4.24289e-05)
MT_ENVELOPE = E.Envelope(-20.0, 10.0, 25.0, 60.0)


def mt_polynomial(operating: E.OperatingConditions = PROJECT, mass_flow: bool = True) -> E.PolynomialCompressor:
    return E.PolynomialCompressor(
        refrigerant="R-448A",
        capacity_coefficients=MT_CAPACITY,
        power_coefficients=MT_POWER,
        mass_flow_coefficients=MT_MASS_FLOW if mass_flow else None,
        envelope=MT_ENVELOPE,
        operating=operating,
        rating_superheat=10.0,
        rating_subcooling=0.0,
    )


@pytest.mark.parametrize("refrigerant", ["R-134a", "R-404A", "R-448A"])
@pytest.mark.parametrize("swept", [None, 14.0 / 3600.0])
def test_rated_point_returns_its_rating(refrigerant: str, swept: float | None) -> None:
    """Round trip: the rated-point model at its own rating point gives the rated capacity and power."""
    model = E.RatedPointCompressor.from_rating(
        refrigerant, 4500.0, -10.0, 45.0, superheat=10.0, subcooling=0.0, power=2200.0, swept_volume=swept, operating=RATING
    )
    point = model.performance(-10.0, 45.0)
    assert point.capacity == pytest.approx(4500.0, rel=1e-6)
    assert point.power == pytest.approx(2200.0, rel=1e-6)
    assert point.heat_rejection == pytest.approx(6700.0, rel=1e-6)


def test_polynomial_fit_agrees_with_the_physics_it_was_fitted_to() -> None:
    """Cross-check of two independent routes inside the envelope (fit accuracy 0.2 %)."""
    physics = E.RatedPointCompressor.from_rating("R-448A", 4500.0, -10.0, 45.0, power=2200.0, operating=PROJECT)
    poly = mt_polynomial()
    for s, d in [(-15.0, 40.0), (-5.0, 50.0), (0.0, 35.0)]:
        assert poly.performance(s, d).capacity == pytest.approx(physics.performance(s, d).capacity, rel=5e-3)


@settings(max_examples=15)
@given(
    s=st.floats(min_value=-30.0, max_value=0.0),
    d=st.floats(min_value=30.0, max_value=55.0),
    drop=st.floats(min_value=0.5, max_value=8.0),
)
def test_capacity_falls_with_suction_and_rises_as_condensing_falls(s: float, d: float, drop: float) -> None:
    model = E.RatedPointCompressor.from_rating("R-134a", 4500.0, -10.0, 45.0, power=2200.0, operating=PROJECT)
    base = model.performance(s, d, discharge=False).capacity
    assert model.performance(s - drop, d, discharge=False).capacity < base
    assert model.performance(s, d - drop, discharge=False).capacity > base


@settings(max_examples=10)
@given(s=st.floats(min_value=-19.0, max_value=5.0), d=st.floats(min_value=27.0, max_value=57.0))
def test_polynomial_capacity_monotone_inside_envelope(s: float, d: float) -> None:
    model = mt_polynomial()
    base = model.performance(s, d, discharge=False).capacity
    assert model.performance(s - 1.0, d, discharge=False).capacity < base
    assert model.performance(s, d - 1.0, discharge=False).capacity > base


@pytest.mark.parametrize(
    "compressor",
    [
        lambda: E.RatedPointCompressor.from_rating("R-448A", 4500.0, -10.0, 45.0, power=2200.0, operating=PROJECT),
        lambda: mt_polynomial(),
    ],
    ids=["rated-point", "polynomial"],
)
@pytest.mark.parametrize("room, ambient", [(2.0, 32.0), (-5.0, 25.0)])
def test_balance_point_satisfies_the_three_equations(compressor, room: float, ambient: float) -> None:  # type: ignore[no-untyped-def]
    """(1) Q_comp = K_e·(t_room − S); (2) THR_comp = K_c·(D − t_amb); (3) THR = ṁ(h_suc − h_liq) + P,
    i.e. THR − Q_useful − P = ṁ·(suction-line superheat enthalpy) ≥ 0. Tolerance 1e-5 relative."""
    comp = compressor()
    evaporator = E.HeatExchanger.from_rating(4000.0, 8.0)
    condenser = E.HeatExchanger.from_rating(7500.0, 15.0)
    bp, point = E.solve_balance(comp, evaporator, condenser, room, ambient)
    assert point.capacity == pytest.approx(evaporator.conductance * (room - bp.suction_dew), rel=1e-5)
    assert point.heat_rejection == pytest.approx(condenser.conductance * (bp.discharge_dew - ambient), rel=1e-5)
    extra = point.heat_rejection - point.capacity - point.power
    assert 0.0 < extra < 0.05 * point.capacity  # 5 K of suction-line superheat: a few % of the capacity
    assert bp.suction_dew < room and bp.discharge_dew > ambient


def test_polynomial_outside_envelope_is_refused() -> None:
    model = mt_polynomial()
    model.performance(-20.9, 40.0)  # inside the 1 K tolerance
    with pytest.raises(E.OutsideEnvelopeError, match="envelope"):
        model.performance(-25.0, 40.0)
    with pytest.raises(E.OutsideEnvelopeError, match="not extrapolated"):
        model.performance(-10.0, 65.0)


def test_medium_temperature_polynomial_at_freezer_suction_is_flagged_not_extrapolated() -> None:
    """A −18 °C room needs a suction near −25 °C: outside the MT envelope → no capacity, does not hold."""
    result = E.check_unit(
        mt_polynomial(),
        E.HeatExchanger.from_rating(4000.0, 8.0),
        E.HeatExchanger.from_rating(7500.0, 15.0),
        room_temperature=-22.0,
        ambient_temperature=32.0,
        daily_energy=100e6,
        safety_factor=0.1,
        run_time=18 * 3600.0,
        chart_ambients=(25.0, 35.0),
        search_max_ambient=False,
    )
    assert result.within_envelope is False
    assert result.capacity_at_balance is None
    assert result.holds is False
    assert result.run_hours_needed is None
    assert any("outside the compressor envelope" in w for w in result.warnings)
    assert result.chart_capacity == (None, None)
    assert "NOT RATED" in result.verdict


def test_rated_point_far_below_rating_is_flagged() -> None:
    # declared low-temperature (so the check rates it at −25 °C suction), yet rated at −10 °C: flagged
    comp = E.RatedPointCompressor.from_rating("R-448A", 4500.0, -10.0, 45.0, power=2200.0, operating=PROJECT,
                                              application="LT")
    result = E.check_unit(
        comp,
        E.HeatExchanger.from_rating(4000.0, 8.0),
        E.HeatExchanger.from_rating(7500.0, 15.0),
        room_temperature=-18.0,
        ambient_temperature=32.0,
        daily_energy=150e6,
        safety_factor=0.1,
        run_time=18 * 3600.0,
        chart_ambients=(),
        search_max_ambient=True,
    )
    assert any("application class" in w for w in result.warnings)
    # max ambient: holds 0.05 K below it, fails 0.2 K above (load constant here)
    assert result.max_ambient_status == "found"
    assert result.holds is False  # at 32 °C this room is too much for the unit

    def holds_at(ambient: float) -> bool:
        return E.check_unit(
            comp,
            E.HeatExchanger.from_rating(4000.0, 8.0),
            E.HeatExchanger.from_rating(7500.0, 15.0),
            room_temperature=-18.0,
            ambient_temperature=ambient,
            daily_energy=150e6,
            safety_factor=0.1,
            run_time=18 * 3600.0,
            chart_ambients=(),
            search_max_ambient=False,
        ).holds

    assert holds_at(result.max_ambient - 0.05)  # type: ignore[operator]
    assert not holds_at(result.max_ambient + 0.2)  # type: ignore[operator]


def test_check_result_json_keys_name_units() -> None:
    comp = E.RatedPointCompressor.from_rating("R-134a", 4500.0, -10.0, 45.0, operating=PROJECT)
    result = E.check_unit(
        comp,
        E.HeatExchanger.fixed(6.0, "sizing TD"),
        E.HeatExchanger.fixed(10.0, "sizing TD"),
        room_temperature=2.0,
        ambient_temperature=32.0,
        daily_energy=200e6,
        safety_factor=0.1,
        run_time=16 * 3600.0,
        chart_ambients=(20.0, 30.0, 40.0),
    )
    data = result.to_json()
    for key in (
        "capacity_at_balance_w",
        "required_capacity_w",
        "daily_run_time_needed_h",
        "margin_percent",
        "max_ambient_temperature_c",
        "balance_evaporating_temperature_c",
        "balance_condensing_temperature_c",
        "holds",
        "warnings",
    ):
        assert key in data
    assert data["balance_evaporating_temperature_c"] == pytest.approx(-4.0)
    assert data["balance_condensing_temperature_c"] == pytest.approx(42.0)
    chart = result.chart()
    assert chart["ambient_temperature_c"] == [20.0, 30.0, 40.0]
    caps = chart["unit_capacity_w"]
    assert caps[0] > caps[1] > caps[2]  # capacity falls as the ambient rises
    # run hours × capacity = (1 + SF)·E
    assert result.run_hours_needed * 3600.0 * result.capacity_at_balance == pytest.approx(1.1 * 200e6)  # type: ignore[operator]


MINI = """
project: {{name: Demo, units: {units}}}
design: {{outdoor_temperature: {outdoor}, outdoor_rh: 50 %, ground_temperature: {ground}}}
constructions:
  panel: {{layers: [{{material: pur_panel, thickness: 100 mm}}]}}
rooms:
  - name: Freezer
    temperature: {room}
    rh: 90 %
    dimensions: {{length: 4 m, width: 3 m, height: 2.6 m}}
    envelope:
      walls: {{construction: panel, facing: space, temperature: 20 °C}}
      ceiling: {{construction: panel, facing: space, temperature: 25 °C}}
      floor: {{construction: panel, facing: heated_slab, temperature: 10 °C}}
    existing_unit:
      refrigerant: R-448A
{unit}
"""

RATED_SI = """      rated_point: {capacity: 4500, evaporating_temperature: -10, condensing_temperature: 45, superheat: 10,
                    power: 2200}"""
# the same figures in IP: 4500 W = 15354.6 Btu/h; −10 °C = 14 °F; 45 °C = 113 °F; 10 K = 18 °F; W for power
RATED_IP = """      rated_point: {capacity: 15354.6, evaporating_temperature: 14, condensing_temperature: 113, superheat: 18,
                    power: 2200 W}"""
POLY = """      polynomial:
        units: SI
        capacity: [{cap}]
        power: [{pow}]
        superheat: 10 K
        suction_min: {smin}
        suction_max: {smax}
        discharge_min: {dmin}
        discharge_max: {dmax}"""


def _parse(units: str, unit: str):  # type: ignore[no-untyped-def]
    from coldroom.inputs.opening import open_project_text

    si = units == "SI"
    return open_project_text(
        MINI.format(
            units=units,
            outdoor="32" if si else "89.6",
            ground="12" if si else "53.6",
            room="-18" if si else "-0.4",
            unit=unit,
        )
    )


def test_existing_unit_reads_the_same_in_si_and_ip() -> None:
    """Unit round trip: a rated point in IP bare numbers (°F, Btu/h, °F difference) equals SI."""
    from coldroom.design.existing import build_compressor

    si = _parse("SI", RATED_SI).rooms[0]
    ip = _parse("IP", RATED_IP).rooms[0]
    a = build_compressor(si.existing_unit, si.refrigeration)
    b = build_compressor(ip.existing_unit, ip.refrigeration)
    assert b.rated_capacity == pytest.approx(a.rated_capacity, rel=1e-5)
    assert b.swept_volume == pytest.approx(a.swept_volume, rel=1e-4)
    assert b.isentropic_efficiency == pytest.approx(a.isentropic_efficiency, rel=1e-4)


def test_polynomial_envelope_in_an_ip_project_is_read_in_fahrenheit() -> None:
    from coldroom.design.existing import build_compressor

    text = POLY.format(
        cap=", ".join(map(str, MT_CAPACITY)), pow=", ".join(map(str, MT_POWER)), smin=-4, smax=50, dmin=77, dmax=140
    )
    room = _parse("IP", text).rooms[0]
    comp = build_compressor(room.existing_unit, room.refrigeration)
    assert comp.envelope.suction_min == pytest.approx(-20.0)
    assert comp.envelope.discharge_max == pytest.approx(60.0)
    assert comp.temperature_unit == "C"  # the coefficients keep their own units (SI here)


def test_project_freezer_with_mt_polynomial_is_not_rated() -> None:
    """End to end: a −18 °C room and a medium-temperature polynomial (S ≥ −20 °C) → refused, flagged."""
    from coldroom.design.existing import check_room

    text = POLY.format(
        cap=", ".join(map(str, MT_CAPACITY)), pow=", ".join(map(str, MT_POWER)), smin=-20, smax=10, dmin=25, dmax=60
    )
    model = _parse("SI", text)
    result = check_room(model, model.rooms[0], chart=False)
    assert result is not None
    assert format_terms(result.evaporator_basis, "SI").startswith("no unit-cooler data")
    assert result.balance_evaporating == pytest.approx(-18.0 - 5.5)  # freezer TD 5–6 K [trade] via sizing
    assert result.capacity_at_balance is None and not result.within_envelope and not result.holds


def test_unit_refrigerant_other_than_the_rooms_is_warned() -> None:
    from coldroom.design.existing import check_room
    from coldroom.inputs.opening import open_project_text

    text = MINI.format(units="SI", outdoor="32", ground="12", room="-18", unit=RATED_SI)
    model = open_project_text(text.replace("      refrigerant: R-448A\n", "      refrigerant: R-404A\n"))
    result = check_room(model, model.rooms[0], chart=False)
    assert result is not None and result.refrigerant == "R-404A"
    assert any("R-404A" in w and "R-448A" in w for w in result.warnings)
