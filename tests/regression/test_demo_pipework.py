"""Regression pins: line sizes, charge and charge-limit verdicts of the demos with a piping block.

Not validation: they catch unintended changes. Regenerate on purpose with

    python tests/regression/test_demo_pipework.py --update

and say why in the commit message.
"""

from __future__ import annotations

import json
import sys
from pathlib import Path

import pytest

REPO = Path(__file__).resolve().parents[2]
PINS = Path(__file__).resolve().parent / "pins" / "demo_pipework.json"
DEMOS = sorted(p for p in (REPO / "project_files").glob("*.yaml") if "piping:" in p.read_text(encoding="utf-8"))


def compute(path: Path) -> list[dict[str, object]]:
    from coldroom.inputs.opening import open_project
    from coldroom.design.sizing import size_project

    out = []
    for system in size_project(open_project(path).model, str(path), path.read_bytes()).systems:
        data = system.to_json()
        out.append(
            {
                "name": system.name,
                "suction_temperature_c": system.suction_temperature,
                "discharge_pressure_pa": system.cycle.discharge_pressure,
                "lines": [
                    {k: line[k] for k in ("line", "outside_diameter_mm", "saturation_temperature_drop_k",
                                          "velocity_m_s", "oil_return_ok")}
                    for line in (data["piping"] or {"lines": []})["lines"]
                ],
                "charge_kg": data["charge"]["total_kg"],
                "verdicts": [[x["rule"], x["limit_kg"], x["verdict"]] for x in data["charge_limits"]],
            }
        )
    return out


@pytest.mark.parametrize("demo", DEMOS, ids=lambda p: p.name)
def test_demo_pipework_is_pinned(demo: Path) -> None:
    pins = json.loads(PINS.read_text(encoding="utf-8"))
    assert demo.name in pins, f"no pin for {demo.name}; run this file with --update"
    actual, expected = compute(demo), pins[demo.name]
    assert [s["name"] for s in actual] == [s["name"] for s in expected]
    for got, want in zip(actual, expected):
        assert got["suction_temperature_c"] == pytest.approx(want["suction_temperature_c"], abs=1e-6)
        assert got["discharge_pressure_pa"] == pytest.approx(want["discharge_pressure_pa"], rel=1e-6)
        assert got["charge_kg"] == pytest.approx(want["charge_kg"], rel=1e-6)
        assert [v[2] for v in got["verdicts"]] == [v[2] for v in want["verdicts"]]
        assert [v[0] for v in got["verdicts"]] == [v[0] for v in want["verdicts"]]
        for g, w in zip(got["lines"], want["lines"]):
            assert (g["line"], g["outside_diameter_mm"], g["oil_return_ok"]) == (
                w["line"], w["outside_diameter_mm"], w["oil_return_ok"])
            assert g["saturation_temperature_drop_k"] == pytest.approx(w["saturation_temperature_drop_k"], rel=1e-6)
            assert g["velocity_m_s"] == pytest.approx(w["velocity_m_s"], rel=1e-6)


if __name__ == "__main__":
    if "--update" in sys.argv:
        PINS.write_text(json.dumps({d.name: compute(d) for d in DEMOS}, indent=1, sort_keys=True) + "\n",
                        encoding="utf-8")
        print(f"wrote {PINS}")
