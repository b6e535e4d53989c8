"""Every JSON coldroom writes is strict RFC 8259 JSON: no NaN, no Infinity.

Python's json.dumps writes the bare words NaN and Infinity, which strict readers (browsers,
jq, most languages) refuse. All JSON leaves through coldroom.output.files.json_text; this file
checks that nothing else writes JSON, and parses what the quick commands write with a parser
that refuses those words (the size and check JSON are parsed the same way in their own tests).
"""

from __future__ import annotations

import json
import math
import re
from pathlib import Path

import pytest
from typer.testing import CliRunner

from coldroom.cli import app
from coldroom.output.files import json_text

REPO = Path(__file__).resolve().parents[2]
DEMOS = sorted((REPO / "project_files").glob("*.yaml"))


def strict_json(text: str):  # type: ignore[no-untyped-def]
    def refuse(constant: str):  # type: ignore[no-untyped-def]
        raise ValueError(f"{constant} is not JSON")

    return json.loads(text, parse_constant=refuse)


def test_json_text_writes_null_for_non_finite_numbers() -> None:
    data = {"a": math.inf, "b": [-math.inf, math.nan, 1.5], "c": {"d": (math.nan,)}, "e": "Infinity"}
    parsed = strict_json(json_text(data))
    assert parsed == {"a": None, "b": [None, None, 1.5], "c": {"d": [None]}, "e": "Infinity"}


def test_no_module_writes_json_by_itself() -> None:
    """json.dump(s) appears only in output.json_text, the one strict writer."""
    for module in (REPO / "coldroom").rglob("*.py"):
        if module.name == "files.py" and module.parent.name == "output":
            continue
        if module.name == "disk_cache.py" and module.parent.name == "physics":
            # the cache below the output stage writes its own entries, strict too
            assert "allow_nan=False" in module.read_text(encoding="utf-8")
            continue
        text = module.read_text(encoding="utf-8")
        assert not re.search(r"\bjson\.dumps?\(", text), f"{module} writes JSON itself; use output.json_text"


@pytest.mark.parametrize("demo", DEMOS, ids=[d.stem for d in DEMOS])
def test_load_json_is_strict(demo: Path) -> None:
    result = CliRunner().invoke(app, ["load", str(demo), "--json", "-"])
    assert result.exit_code == 0, result.output
    assert strict_json(result.stdout)["rooms"]


@pytest.mark.parametrize(
    "args",
    [["-r", "R134a", "--evaporating", "-25", "--condensing", "40"],
     ["-r", "R744", "--evaporating", "-10", "--gas-cooler-outlet", "35"]],
    ids=["subcritical", "r744-transcritical"],
)
def test_cycle_json_is_strict(args: list[str]) -> None:
    result = CliRunner().invoke(app, ["cycle", *args, "--capacity", "5 kW", "--json"])
    assert result.exit_code == 0, result.output
    assert strict_json(result.stdout)["refrigerant"]


def test_schema_is_strict() -> None:
    result = CliRunner().invoke(app, ["schema"])
    assert result.exit_code == 0
    assert strict_json(result.stdout)["title"] == "coldroom project file"
