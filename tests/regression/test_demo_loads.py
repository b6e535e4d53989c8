"""Regression pins: the load breakdown of every demo project.

These pins are not validation: they catch unintended changes. When a change in
the physics is intended, regenerate them with

    python tests/regression/test_demo_loads.py --update

and explain the change in the commit message.
"""

from __future__ import annotations

import json
import sys
from pathlib import Path

import pytest

REPO = Path(__file__).resolve().parents[2]
PINS = Path(__file__).resolve().parent / "pins" / "demo_loads.json"
DEMOS = sorted((REPO / "project_files").glob("*.yaml"))


def compute(path: Path) -> list[dict[str, object]]:
    from coldroom.loads import project_loads
    from coldroom.inputs.opening import open_project

    model = open_project(path).model
    out = []
    for room in project_loads(model):
        out.append(
            {
                "name": room.name,
                "loads_w": room.components_w,
                "required_capacity_w": room.required_capacity,
                "peak_load_w": room.peak_load,
                "design_capacity_w": room.design_capacity,
                "lines": {line.item: line.daily_energy for line in room.lines},
            }
        )
    return out


@pytest.mark.parametrize("demo", DEMOS, ids=lambda p: p.name)
def test_demo_loads_are_pinned(demo: Path) -> None:
    pins = json.loads(PINS.read_text(encoding="utf-8"))
    assert demo.name in pins, f"no pin for {demo.name}; run this file with --update"
    expected = pins[demo.name]
    actual = compute(demo)
    assert [r["name"] for r in actual] == [r["name"] for r in expected]
    for got, want in zip(actual, expected):
        for key in ("required_capacity_w", "peak_load_w", "design_capacity_w"):
            assert got[key] == pytest.approx(want[key], rel=1e-6), key
        assert got["loads_w"] == pytest.approx(want["loads_w"], rel=1e-6)
        assert set(got["lines"]) == set(want["lines"])
        for item, energy in want["lines"].items():
            assert got["lines"][item] == pytest.approx(energy, rel=1e-6, abs=1e-3), item


if __name__ == "__main__":
    if "--update" in sys.argv:
        PINS.write_text(
            json.dumps({d.name: compute(d) for d in DEMOS}, indent=1, sort_keys=True) + "\n", encoding="utf-8"
        )
        print(f"wrote {PINS}")
