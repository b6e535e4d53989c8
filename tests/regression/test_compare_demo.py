"""Regression pins: `coldroom compare` of the options demo (annual energy, cost, charge, TEWI).

Not validation: they catch unintended changes. Regenerate on purpose with

    python tests/regression/test_compare_demo.py --update

and say why in the commit message.
"""

from __future__ import annotations

import json
import sys
from pathlib import Path

import pytest

REPO = Path(__file__).resolve().parents[2]
PINS = Path(__file__).resolve().parent / "pins" / "compare_demo.json"
DEMO = REPO / "project_files" / "farm_shop_options.yaml"
KEYS = ("design_capacity_w", "compressor_input_power_w", "annual_energy_kwh", "annual_electricity_cost", "charge_kg", "gwp")


def compute() -> dict:
    from coldroom.design.annual import compare
    from coldroom.inputs.opening import open_project

    result = compare(open_project(DEMO).model).to_json()
    return {
        o["name"]: {**{k: o[k] for k in KEYS}, "by_use": o["annual_energy_by_use_kwh"], "tewi": o["tewi_kg_co2e"]}
        for o in result["options"]
    }


def test_compare_demo_is_pinned() -> None:
    pins = json.loads(PINS.read_text(encoding="utf-8"))
    actual = compute()
    assert list(actual) == list(pins)
    for name, want in pins.items():
        got = actual[name]
        for key in KEYS:
            assert got[key] == pytest.approx(want[key], rel=1e-6), (name, key)
        assert got["by_use"] == pytest.approx(want["by_use"], rel=1e-6), name
        assert got["tewi"] == pytest.approx(want["tewi"], rel=1e-6), name


if __name__ == "__main__":
    if "--update" in sys.argv:
        PINS.write_text(json.dumps(compute(), indent=2, sort_keys=False) + "\n", encoding="utf-8")
        print(f"wrote {PINS}")
