"""Annual energy: a single 8760-hour bin at the design dry bulb equals 365 × the design day.

The independent route is :func:`coldroom.design.sizing.size_project`'s per-system electricity per day
(the day's heat gain removed at the design capacity and COP, fans, heaters, defrost; the issue's
"365 × the design day's refrigeration energy ÷ COP plus the other uses") plus the lights.
"""

from __future__ import annotations

from pathlib import Path

import pytest

from coldroom.design.annual import _Context, _lighting_energy_per_day, compare, option_year
from coldroom.inputs.opening import open_project
from coldroom.design.sizing import size_project
from coldroom.inputs.weather import AmbientBin

REPO = Path(__file__).resolve().parents[2]
FARM = REPO / "project_files" / "farm_shop_options.yaml"
COMBO = REPO / "project_files" / "combo_cooler_freezer.yaml"


@pytest.mark.parametrize("path", [FARM, COMBO], ids=lambda p: p.stem)
def test_single_design_bin_is_365_design_days(path: Path) -> None:
    model = open_project(path).model
    bins = (AmbientBin(model.design.outdoor_temperature, 8760.0),)
    year = option_year(model, "base", "", _Context(), bins)
    sized = size_project(model, str(path), path.read_bytes())
    per_day = sum(sum(v for _k, v in s.electrical.daily_energy_parts) for s in sized.systems)
    per_day += sum(_lighting_energy_per_day(room) for room in model.rooms)
    assert year.annual_energy == pytest.approx(365 * per_day / 3.6e6, rel=0.01)
    compressor_day = sum(dict(s.electrical.daily_energy_parts)["compressor"] for s in sized.systems)
    assert year.annual_energy_by_use["compressor"] == pytest.approx(365 * compressor_day / 3.6e6, rel=0.01)
    # the base's design capacity is the sum of the rooms' design capacities `coldroom size` gives
    assert year.design_capacity == pytest.approx(sum(r.loads.design_capacity for r in sized.rooms), rel=1e-12)


def test_warmer_year_costs_more_and_options_are_all_there() -> None:
    model = open_project(FARM).model
    result = compare(model)
    assert [o.name for o in result.options] == ["base", "R-290", "R-744", "150 mm cooler panels", "R-290 + 150 mm"]
    base = result.options[0]
    warmer = option_year(model, "warmer", "", _Context(), tuple(AmbientBin(b.temperature + 5.0, b.hours)
                                                                for b in result.bins))
    assert warmer.annual_energy > base.annual_energy
    # thicker panels never cost more energy; the direct TEWI of R-744 (GWP 1) is tiny
    by_name = {o.name: o for o in result.options}
    assert by_name["150 mm cooler panels"].annual_energy < base.annual_energy
    r744 = by_name["R-744"].tewi
    assert r744 is not None and r744.direct_leakage + r744.direct_end_of_life < 0.01 * r744.indirect


def test_given_charge_wins_and_sets_the_direct_part(tmp_path: Path) -> None:
    from coldroom.design.annual import _Context, option_year
    from coldroom.inputs.opening import open_project_text

    text = FARM.read_text(encoding="utf-8") + (
        "  - name: weighed in\n    changes:\n      systems.CU-1.charge: 3 kg\n"
        "  - name: weighed in twice\n    changes:\n      systems.CU-1.charge: {total: 6 kg}\n"
    )
    model = open_project_text(text, filename=str(tmp_path / "p.yaml"))
    named = {name: m for name, _note, m in model._option_models}
    bins = (AmbientBin(20.0, 8760.0),)
    one = option_year(named["weighed in"], "one", "", _Context(), bins)
    two = option_year(named["weighed in twice"], "two", "", _Context(), bins)
    assert one.charge == 3.0 and one.systems[0].charge_basis == "given in the project file"
    assert two.tewi.direct_leakage == pytest.approx(2 * one.tewi.direct_leakage)
    assert two.tewi.indirect == pytest.approx(one.tewi.indirect)
