"""`coldroom select` on the demo catalogue: the choice is the cheapest unit that holds (brute force)."""

from __future__ import annotations

from pathlib import Path

import pytest

from coldroom.inputs.catalogue import load_catalogue
from coldroom.data import refrigerants
from coldroom.design.existing import build_compressor
from coldroom.equipment import RATING_SUCTION_GAP
from coldroom.inputs.opening import open_project
from coldroom.design.selection import _condenser, _rate, select_project

REPO = Path(__file__).resolve().parents[2]
CATALOGUE = load_catalogue(REPO / "project_files" / "catalogue" / "demo_catalogue.yaml")


def holds_by_brute_force(entry, duty, refrigeration) -> bool:  # type: ignore[no-untyped-def]
    """Solve the balance of *entry* with no screening and no ordering: does it hold, inside its envelope?"""
    if refrigerants.lookup(entry.refrigerant).name != duty.refrigerant:
        return False
    compressor = build_compressor(entry.existing_unit(), refrigeration)
    check = _rate(compressor, _condenser(entry, duty), duty, entry.model, False)
    if check.capacity_at_balance is None or not check.holds:
        return False
    if entry.rated_point is not None and check.balance_evaporating < entry.rated_point.evaporating_temperature - RATING_SUCTION_GAP:
        return False
    return True


@pytest.mark.parametrize("name", ["produce_cooler", "combo_cooler_freezer", "propane_cooler"])
def test_choice_is_the_cheapest_that_holds(name: str, monkeypatch: pytest.MonkeyPatch) -> None:
    model = open_project(REPO / "project_files" / f"{name}.yaml").model
    import coldroom.design.selection as selection

    duties = []
    original = selection.choose_condensing_unit

    def spy(units, duty, refrigeration, **kw):  # type: ignore[no-untyped-def]
        duties.append((duty, refrigeration))
        return original(units, duty, refrigeration, **kw)

    monkeypatch.setattr(selection, "choose_condensing_unit", spy)
    chosen = select_project(model, CATALOGUE, max_ambient=False)
    for result, (duty, refrigeration) in zip(chosen, duties):
        holding = sorted(
            (e.price, e.model) for e in CATALOGUE.condensing_units if holds_by_brute_force(e, duty, refrigeration)
        )
        assert holding, name
        assert (result.choice.price, result.choice.model) == holding[0]
        assert [(a.price, a.model) for a in result.alternatives] == holding[1:3]
        # every candidate is accounted for: chosen, alternatives, or rejected for a reason
        assert 1 + len(result.alternatives) + sum(result.rejected.values()) == len(CATALOGUE.condensing_units)


def test_demo_choices_pinned() -> None:
    """The demo answers a contractor sees (change on purpose with the catalogue)."""
    got = {}
    for name in ("produce_cooler", "combo_cooler_freezer", "cooler_to_freezer"):
        for s in select_project(open_project(REPO / "project_files" / f"{name}.yaml").model, CATALOGUE, max_ambient=False):
            got[name] = (s.choice.model, tuple((c.model, c.count) for c in s.coolers), s.total_price)
    assert got == {
        "produce_cooler": ("DX-M18", (("UC-C50", 1),), 2680.0),
        "combo_cooler_freezer": ("DX-L16", (("UC-C16", 1), ("UC-F20", 1)), 3920.0),
        "cooler_to_freezer": ("DX-L16", (("UC-F20", 2),), 4340.0),
    }


def _cooler(**kw):  # type: ignore[no-untyped-def]
    from coldroom.inputs.catalogue import UnitCoolerEntry

    data = dict(model="C", capacity=2000, air_on=0, evaporating_temperature=-8, air_flow=0.5, throw=10,
                fan_power=100, defrost="off_cycle", fin_spacing="4 mm", price=500)
    data.update(kw)
    return UnitCoolerEntry.model_validate(data)


def test_coil_rules_stated_in_the_issue() -> None:
    from coldroom.design.selection import choose_coolers

    room = dict(room_name="R", temperature_difference=8.0)
    # a freezer takes only electric or hot-gas defrost, fins >= 6 mm
    coils = [_cooler(model="off"), _cooler(model="fins", defrost="electric", defrost_heater_power=1000),
             _cooler(model="ok", defrost="hot_gas", fin_spacing="7 mm", price=900)]
    pick = choose_coolers(coils, room_temperature=-20.0, duty=1500.0, length=5.0, **room)
    assert (pick.model, pick.count) == ("ok", 1)
    assert pick.rejected == {"no_defrost": 1, "fins_too_close": 1}
    # a throw short of the room's length takes two coils; short of half of it, none
    pick = choose_coolers([_cooler(throw=6)], room_temperature=2.0, duty=1500.0, length=10.0, **room)
    assert pick.count == 2 and "one at each end" in pick.rule
    with pytest.raises(Exception, match="1 air throw shorter than half the room"):
        choose_coolers([_cooler(throw=4)], room_temperature=2.0, duty=1500.0, length=10.0, **room)
    # capacity at the room's TD (8 K here, rating DT1 8 K): 2000 W each, so 4500 W takes 3 coils
    assert choose_coolers([_cooler()], room_temperature=2.0, duty=4500.0, length=5.0, **room).count == 3
    # a coil rated for another refrigerant is set aside
    pick = choose_coolers([_cooler(model="p", refrigerant="R-290"), _cooler(model="a", refrigerant="R-448A", price=600)],
                          room_temperature=2.0, duty=1500.0, length=5.0, refrigerant="R-448A", **room)
    assert pick.model == "a" and pick.rejected == {"wrong_refrigerant": 1}
