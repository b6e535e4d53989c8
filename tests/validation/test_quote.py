"""Quote figures against outside references: valve capacity by the orifice relation with CoolProp
properties, and the NEC Article 440 circuit figures worked by hand on an invented unit."""

from __future__ import annotations

import math

import CoolProp.CoolProp as CP
import pytest

from coldroom.design.electrical_schedule import condensing_unit_item, nec_circuit, Load
from coldroom.design.valves import ValveConditions, choose_valve
from coldroom.inputs.catalogue_items import ExpansionValveEntry


def _props(fluid: str, evaporating: float, condensing: float, subcooling: float) -> tuple[float, float, float]:
    """Δh [J/kg], liquid density [kg/m³], Δp [Pa] by hand from CoolProp PropsSI (pure fluid: dew = bubble)."""
    p_c = CP.PropsSI("P", "T", condensing + 273.15, "Q", 1, fluid)
    p_e = CP.PropsSI("P", "T", evaporating + 273.15, "Q", 1, fluid)
    t_liquid = condensing + 273.15 - subcooling
    h_liquid = CP.PropsSI("H", "T", t_liquid, "P", p_c, fluid) if subcooling > 0 else CP.PropsSI("H", "P", p_c, "Q", 0, fluid)
    rho = CP.PropsSI("D", "T", t_liquid, "P", p_c, fluid) if subcooling > 0 else CP.PropsSI("D", "P", p_c, "Q", 0, fluid)
    h_vapour = CP.PropsSI("H", "T", evaporating + 273.15, "Q", 1, fluid)
    return h_vapour - h_liquid, rho, p_c - p_e


@pytest.mark.parametrize("fluid, name", [("R134a", "R-134a"), ("Propane", "R-290")])
def test_valve_capacity_against_the_orifice_relation(fluid: str, name: str) -> None:
    """Q = Q_rated·(Δh/Δh_r)·√(ρ·Δp/(ρ_r·Δp_r)) (ASHRAE Handbook—Refrigeration, refrigerant-control
    devices, from memory), Δp the condensing − evaporating pressure less 0.4 bar of liquid line and
    1 bar of distributor; invented valves rated at −10/38 °C, 1 K subcooling."""
    valves = [
        ExpansionValveEntry(model=f"V{k}", refrigerant=name, rated_capacity=q, rated_evaporating_temperature=-10.0,
                            rated_condensing_temperature=38.0, rated_subcooling=1.0, price=100.0 + k)
        for k, q in enumerate((1000.0, 2500.0, 5000.0))
    ]
    conditions = ValveConditions(name, -25.0, 45.0, 3.0, 0.4e5, 1.0e5)
    dh_r, rho_r, dp_r = _props(fluid, -10.0, 38.0, 1.0)
    dh, rho, dp = _props(fluid, -25.0, 45.0, 3.0)
    dp -= 1.4e5
    factor = (dh / dh_r) * math.sqrt(rho * dp / (rho_r * dp_r))
    choice = choose_valve(valves, "Room", 1500.0, conditions)
    assert choice.pressure_drop == pytest.approx(dp, rel=1e-4)
    expected = next(q * factor for q in (1000.0, 2500.0, 5000.0) if q * factor >= 1500.0)
    assert choice.capacity == pytest.approx(expected, rel=5e-4)
    assert choice.model == "V1" and choice.capacity >= 1500.0


def test_nec_article_440_by_hand() -> None:
    """An invented 400 V 3~ condensing unit: compressor RLA 16.0 A, condenser fans 1.2 A.
    NEC 440.33 (from memory): MCA = 1.25 × 16.0 + 1.2 = 21.2 A.
    NEC 440.22(A): MOP = 2.25 × 16.0 + 1.2 = 37.2 A, rounded down to the standard 35 A of 240.6(A)."""
    mca, mop, _how = nec_circuit((Load("compressor", 16.0, True), Load("fans", 1.2, True)))
    assert mca == pytest.approx(21.2)
    assert mop == 35


def test_nec_figures_of_a_catalogue_unit() -> None:
    """The same unit as a catalogue entry with its running current 17.2 A (fans 60 W × 2 at cos φ 0.85
    on 400 V 3~: 0.2038 A by I = P/(√3·V·cos φ)); the compressor's RLA is the rest, 16.9962 A."""
    from coldroom.inputs.catalogue import CondensingUnitEntry

    entry = CondensingUnitEntry(
        model="X", refrigerant="R-448A", price=1.0, fan_power=120.0, supply="400 V 3~ 50 Hz",
        running_current=17.2, locked_rotor_current=80.0, power_factor=0.85,
        rated_point={"capacity": 3000.0, "evaporating_temperature": -10.0, "condensing_temperature": 45.0,
                     "power": 1500.0},
    )
    item = condensing_unit_item(entry, 1500.0, "NEC")
    fans = 120.0 / (math.sqrt(3) * 400.0 * 0.85)
    rla = 17.2 - fans
    assert item.minimum_circuit_ampacity == pytest.approx(1.25 * rla + fans)
    assert item.maximum_overcurrent_protection == 35  # 2.25 × 17.0 + 0.2 = 38.4 -> 35 A
    assert item.running_current == 17.2 and item.locked_rotor_current == 80.0 and not item.estimated


def test_nec_system_on_one_circuit_by_hand() -> None:
    """Two invented units on one circuit: compressor RLA 12.0 A with fans 0.8 A, and a coil with a
    fan of 0.5 A and a 6.0 A heater. NEC 440.33 / 440.22(A) (from memory): MCA = 1.25 × 12.0 + 0.8 +
    0.5 + 6.0 = 22.3 A; MOP = 2.25 × 12.0 + 7.3 = 34.3 A -> 30 A, not below the MCA."""
    from coldroom.design.electrical_schedule import ElectricalItem, SystemSchedule

    unit = ElectricalItem("condensing unit", "A", "400 V 3~ 50 Hz", 12.8, 60.0, False, "",
                          (Load("compressor", 12.0, True), Load("fans", 0.8, True)))
    coil = ElectricalItem("unit coolers", "B", "230 V 1~ 50 Hz", 6.5, None, False, "",
                          (Load("fan", 0.5, True), Load("heater", 6.0, False)))
    data = SystemSchedule("S", (unit, coil), "NEC").to_json()
    assert data["minimum_circuit_ampacity_a"] == pytest.approx(22.3)
    assert data["maximum_overcurrent_protection_a"] == 30
    assert data["total_running_current_a"] == pytest.approx(19.3)
