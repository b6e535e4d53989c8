"""`compare` says which options can be built: `feasible` and `blocking` (issue 24, item 2).

The reasons are the project's own verdicts, each checked elsewhere against its source: the charge
limits (EN 378-1:2016 Annex C, tests/validation/test_stated_charge.py), the one discharge-temperature
limit per family and the single-stage pressure-ratio rule (rules.py, [trade]), the existing-unit check.
Here: an option over a limit is never feasible, a base within every limit is, and stating the
EN 378-3 measures lifts an "over — measures needed" verdict (not a "not permitted" one).
"""

from __future__ import annotations

from pathlib import Path

import pytest
import yaml

REPO = Path(__file__).resolve().parents[2]
FARM = REPO / "project_files" / "farm_shop_options.yaml"


@pytest.fixture(scope="module")
def farm():
    from coldroom.design.annual import compare
    from coldroom.inputs.opening import open_project

    return {o.name: o for o in compare(open_project(str(FARM)).model).options}


def test_base_within_every_limit_is_feasible(farm):
    assert farm["base"].feasible and farm["base"].blocking == ()
    assert farm["base"].to_json()["feasible"] is True


def test_r290_over_its_charge_limit_is_not_feasible(farm):
    option = farm["R-290"]
    assert not option.feasible
    assert any("charge" in reason and "no measures stated" in reason for reason in option.blocking)
    data = option.to_json(farm["base"])
    assert data["feasible"] is False and data["blocking"] == list(option.blocking)


def test_r744_over_its_discharge_limit_is_not_feasible(farm):
    from coldroom.rules import discharge_temperature_limit

    option = farm["R-744"]
    assert not option.feasible
    assert any(f"over the {discharge_temperature_limit('R-744'):.0f} °C limit" in r for r in option.blocking)


def test_no_line_calls_an_infeasible_option_better(farm):
    from types import SimpleNamespace

    from coldroom.output.terminal import compare_rows

    headers, rows = compare_rows(SimpleNamespace(options=tuple(farm.values())), "SI")
    column = headers.index("feasible")
    for row in rows:
        if row[0] != "base" and not farm[row[0]].feasible:
            assert row[column].startswith("NO")
            assert row[headers.index("vs base: cost/year")] == "n/a: not feasible"


def _single(tmp_path: Path, edit) -> object:
    from coldroom.design.annual import compare
    from coldroom.inputs.opening import open_project

    data = yaml.safe_load(FARM.read_text(encoding="utf-8"))
    data.pop("options")
    edit(data)
    path = tmp_path / "p.yaml"
    path.write_text(yaml.safe_dump(data, allow_unicode=True, sort_keys=False), encoding="utf-8")
    return compare(open_project(str(path)).model).options[0]


def test_stated_measures_lift_an_over_verdict(tmp_path: Path):
    def r290(data, measures=None):
        system = data["systems"][0]
        system["refrigerant"] = "R-290"
        system["charge"] = {"total": "0.6 kg"}  # between m1 and m2 = 26 m³ × 0.038 kg/m³ = 0.988 kg
        if measures:
            system["charge"]["measures"] = measures

    assert not _single(tmp_path, r290).feasible
    assert _single(tmp_path, lambda d: r290(d, ["gas detection and alarm", "mechanical ventilation"])).feasible


def test_an_existing_unit_that_does_not_hold_blocks(tmp_path: Path):
    from coldroom.design.annual import compare
    from coldroom.inputs.opening import open_project

    data = yaml.safe_load((REPO / "project_files" / "cooler_to_freezer.yaml").read_text(encoding="utf-8"))
    data["design"]["ambient_bins"] = [{"temperature": "20 °C", "hours": 8760}]
    data.pop("options", None)
    path = tmp_path / "c.yaml"
    path.write_text(yaml.safe_dump(data, allow_unicode=True, sort_keys=False), encoding="utf-8")
    base = compare(open_project(str(path)).model).options[0]
    assert not base.feasible
    assert any("existing unit" in r and "NOT SUITABLE" in r for r in base.blocking)
