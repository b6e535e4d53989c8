"""JSON contract of pipework and charge: the keys issue "pipework and charge" names, in each system."""

from __future__ import annotations

import json
import subprocess
import sys
from pathlib import Path

REPO = Path(__file__).resolve().parents[2]
DEMO = REPO / "project_files" / "propane_cooler.yaml"

LINE_KEYS = {
    "line", "outside_diameter_mm", "inside_diameter_mm", "equivalent_length_m", "velocity_m_s",
    "pressure_drop_pa", "saturation_temperature_drop_k", "limit_k", "oil_return_ok",
    "next_smaller_outside_diameter_mm", "next_smaller_saturation_temperature_drop_k",
}


def test_size_json_has_the_pipework_contract(tmp_path: Path) -> None:
    out = tmp_path / "result.json"
    # in-process (typer's CliRunner): the same command from arguments to files, no interpreter start
    from typer.testing import CliRunner

    from coldroom.cli import app

    result = CliRunner().invoke(app, ["size", str(DEMO), "--out", str(tmp_path / "s.pdf"), "--json", str(out)])
    assert result.exit_code == 0, result.stderr
    system = json.loads(out.read_text(encoding="utf-8"))["systems"][0]
    piping = system["piping"]
    assert piping["tube_series"] == "EN 12735-1"
    assert [line["line"] for line in piping["lines"]] == ["suction", "liquid", "discharge"]
    for line in piping["lines"]:
        assert LINE_KEYS <= set(line), LINE_KEYS - set(line)
        assert line["saturation_temperature_drop_k"] <= line["limit_k"]
        if line["next_smaller_outside_diameter_mm"] is not None:  # None: the smallest size of the series
            assert line["next_smaller_saturation_temperature_drop_k"] > line["limit_k"]
    by_line = {line["line"]: line for line in piping["lines"]}
    assert by_line["suction"]["oil_return_ok"] in (True, False)  # a riser
    assert by_line["liquid"]["oil_return_ok"] is None and by_line["discharge"]["oil_return_ok"] is None
    charge = system["charge"]
    assert set(charge) >= {"total_kg", "parts"}
    assert all(set(p) >= {"part", "charge_kg", "basis"} for p in charge["parts"])
    assert abs(sum(p["charge_kg"] for p in charge["parts"]) - charge["total_kg"]) < 1e-9
    assert {p["part"] for p in charge["parts"]} >= {"suction line", "liquid line", "evaporator", "condenser"}
    limits = system["charge_limits"]
    assert limits and all(set(x) >= {"rule", "limit_kg", "verdict"} for x in limits)
    assert all(x["verdict"] in ("within", "over — measures needed", "not permitted") for x in limits)
    # the suction drop went into the cycle
    assert system["cycle"]["suction_pressure_drop_k"] == piping["suction_drop_in_cycle_k"] > 0
    assert system["cycle"]["discharge_pressure_drop_k"] == piping["discharge_drop_in_cycle_k"] > 0
