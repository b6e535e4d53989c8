"""The JSON contract (DEVELOPERS.md "JSON output"): one envelope, one naming rule, one schema per command.

Every command's ``--json`` on every demo (``project_files/*.yaml``; ``select`` with the demo
catalogue; ``cycle`` on a few refrigerants, R-744 transcritical among them; ``quote`` on the demo with a
``quote:`` block and the quote catalogue) is made once, in
process (typer's CliRunner: the command from its arguments to the file it writes), and

- carries the envelope: ``schema_version``, ``command``, ``versions``, ``project`` (``null`` for
  ``cycle``), the project's ``file`` as given and the SHA-256 of its bytes (hashlib, read here);
- validates against ``coldroom schema --result COMMAND`` (jsonschema, draft 2020-12), and a
  planted wrong type or unknown key does not;
- names every key by the rule: no spaces, no bare unit, numbers with a unit suffix (or
  dimensionless by name, or counts), temperatures ``<what>_temperature_c``, durations ``<what>_h``
  with no "hours" spelled out, money ``…price``/``…cost`` with a ``currency`` in the document.
  The rule is also walked over every property of the schema, so keys no demo shows are held too.

The rule is the project's own (common practice, no source); the hash is checked against hashlib.
"""

from __future__ import annotations

import copy
import hashlib
import json
import re
import subprocess
import sys
from pathlib import Path
from typing import Any, Iterator

import pytest

jsonschema = pytest.importorskip("jsonschema")

REPO = Path(__file__).resolve().parents[2]
DEMOS = sorted((REPO / "project_files").glob("*.yaml"))
CATALOGUE = REPO / "project_files" / "catalogue" / "demo_catalogue.yaml"
QUOTE_CATALOGUE = REPO / "project_files" / "catalogue" / "quote_catalogue.yaml"
CYCLES = {
    "R-134a": ["-r", "R134a", "--evaporating", "-10", "--condensing", "40", "--capacity", "5 kW"],
    "R-290-low": ["-r", "R290", "--evaporating", "-30", "--condensing", "45", "--capacity", "3 kW"],
    "R-448A": ["-r", "R448A", "--evaporating", "-8", "--condensing", "40", "--capacity", "8 kW"],
    "R-744-transcritical": ["-r", "R744", "--evaporating", "-10", "--gas-cooler-outlet", "35", "--capacity", "5 kW"],
}

# --- the naming rule -----------------------------------------------------------------------------

#: unit suffixes, SI (temperatures in °C as the trade writes them, durations in h, energy in kWh)
UNIT_SUFFIXES = (
    "_w", "_kwh", "_c", "_k", "_pa", "_kg", "_m", "_m2", "_m3", "_h", "_s", "_kg_s", "_m3_h", "_m_s",
    "_j_kg", "_j_kg_k", "_kg_m3", "_kg_co2e", "_kg_co2e_per_kwh", "_percent", "_years", "_a",
    "_mm",  # tube diameters: the pipework contract spells them in mm, as the tube tables do
)
#: dimensionless numbers, named as such
DIMENSIONLESS_SUFFIXES = ("_ratio", "_factor", "_fraction", "_efficiency", "_exponent", "_cop")
DIMENSIONLESS_KEYS = {"cop", "quality", "clearance", "diversity", "gwp", "gwp_ar4",
                      "value_si",  # a Term's number, in the SI unit of its `kind`
                      "quantity"}  # a quote line's, in the `unit` beside it (the quote contract's keys)
#: integers that count or index: no unit
COUNT_KEYS = {"count", "candidates", "peak_hour"}
#: objects of counts by reason
COUNT_OBJECTS = {"rejected"}
#: a key never is a unit alone
BARE_UNITS = {"w", "kw", "kwh", "c", "f", "k", "pa", "kpa", "bar", "kg", "g", "m", "mm", "m2", "m3", "h", "s",
              "percent", "btu", "tr", "years"}
#: subtrees in another format: the chosen unit as a project file's `existing_unit` block
PROJECT_FILE_BLOCKS = {("selection", "condensing_unit", "existing_unit")}
#: keys an issue spelled out (contracts, kept exactly as written there)
ISSUE_KEYS = {"hours_above_setpoint_plus_2k"}  # issue 24: hours the room air is > set point + 2 K
MONEY = re.compile(r"(^|_)(price|cost)(_per_[a-z0-9]+)?$")


def _has_unit(key: str) -> bool:
    return key.endswith(UNIT_SUFFIXES) or MONEY.search(key) is not None


def _dimensionless(key: str) -> bool:
    return key in DIMENSIONLESS_KEYS or key.endswith(DIMENSIONLESS_SUFFIXES)


def key_problems(key: str) -> list[str]:
    """What is wrong with *key* by itself (any value)."""
    problems = []
    if not re.fullmatch(r"[a-z][a-z0-9_]*", key):
        problems.append("not lower_snake_case (spaces, capitals or signs)")
    if key in BARE_UNITS:
        problems.append("a bare unit as a key")
    if key.endswith("_c") and not (key.endswith("temperature_c") or key == "t_c"):
        problems.append("a temperature is <what>_temperature_c")
    if "hours" in key.split("_") and key not in ISSUE_KEYS:
        problems.append("a duration is <what>_h (time, duration), not 'hours'")
    return problems


def number_problems(key: str, value: Any, unit_from_parent: bool, counts: bool) -> list[str]:
    """What is wrong with *key* holding the number *value*."""
    if re.search(r"(price|cost)", key) and not MONEY.search(key):
        return ["money is ..._price or ..._cost (optionally _per_<unit>)"]
    if unit_from_parent or _has_unit(key) or _dimensionless(key) or key in ISSUE_KEYS:
        return []
    if isinstance(value, int) and (counts or key in COUNT_KEYS):
        return []
    return ["a number without its unit in the key"]


def walk(node: Any, path: tuple[str, ...] = (), unit: bool = False, counts: bool = False) -> Iterator[tuple[str, str]]:
    """(dotted path, problem) for every key of a document."""
    if isinstance(node, dict):
        for key, value in node.items():
            where = path + (key,)
            if tuple(p for p in where if p) in PROJECT_FILE_BLOCKS:
                continue
            for problem in key_problems(key) if not (unit or counts) else ([] if " " not in key else ["a space"]):
                yield ".".join(where), problem
            yield from walk(value, where, unit=_has_unit(key) and isinstance(value, (dict, list)),
                            counts=key in COUNT_OBJECTS)
            if isinstance(value, (int, float)) and not isinstance(value, bool):
                for problem in number_problems(key, value, unit, counts):
                    yield ".".join(where), problem
    elif isinstance(node, list):
        for item in node:
            if isinstance(item, (int, float)) and not isinstance(item, bool):
                key = path[-1] if path else ""
                if not (unit or _has_unit(key) or _dimensionless(key)):
                    yield ".".join(path) + "[]", "a list of numbers without their unit in the key"
            else:
                yield from walk(item, path, unit=unit, counts=counts)


# --- the documents, made once ----------------------------------------------------------------------


def _invoke(args: list[str], out: Path, nothing_fits: bool = False) -> dict | None:
    """The command's JSON document; None when *nothing_fits* may happen and did (exit 1)."""
    from typer.testing import CliRunner

    from coldroom.cli import app

    result = CliRunner().invoke(app, args)
    if nothing_fits and result.exit_code == 1 and "holds" in result.stderr:
        return None
    assert result.exit_code == 0, (args, result.stderr)
    text = result.stdout if args[0] == "cycle" else out.read_text(encoding="utf-8")
    return json.loads(text)


@pytest.fixture(scope="module")
def documents(tmp_path_factory) -> dict[tuple[str, str], dict]:
    """Every command's JSON on every demo: {(command, case): document}."""
    tmp = tmp_path_factory.mktemp("contract")
    docs: dict[tuple[str, str], dict] = {}
    with pytest.MonkeyPatch.context() as patch:
        # the sheet `size` must write is not part of the JSON (tests/regression/test_sheet.py reads it)
        patch.setattr("coldroom.output.pdf.sheet.render_sheet", lambda *args, **kwargs: b"%PDF-1.4 not drawn here")
        _make(docs, tmp)
    return docs


def _make(docs: dict[tuple[str, str], dict], tmp: Path) -> None:
    for demo in DEMOS:
        name = demo.stem
        out = tmp / f"{name}.json"
        docs["load", name] = _invoke(["load", str(demo), "--json", str(out), "--force"], out)
        docs["size", name] = _invoke(["size", str(demo), "--out", str(tmp / f"{name}.pdf"), "--json", str(out),
                                      "--force"], out)
        docs["check", name] = _invoke(["check", str(demo), "--json", str(out), "--force"], out)
        # a demo the demo catalogue has no unit for (exit 1) is no contract case
        selected = _invoke(["select", str(demo), "--catalogue", str(CATALOGUE), "--json", str(out), "--force"], out,
                           nothing_fits=True)
        if selected is not None:
            docs["select", name] = selected
        if "\noptions:" in demo.read_text(encoding="utf-8"):
            docs["compare", name] = _invoke(["compare", str(demo), "--json", str(out), "--force"], out)
        if "\nquote:" in demo.read_text(encoding="utf-8"):
            docs["quote", name] = _invoke(["quote", str(demo), "--catalogue", str(QUOTE_CATALOGUE), "--json", str(out),
                                           "--force"], out)
    for name, args in CYCLES.items():
        docs["cycle", name] = _invoke(["cycle", *args, "--json"], tmp)


@pytest.fixture(scope="module")
def schemas() -> dict[str, dict]:
    from coldroom.output.json_contract import COMMANDS
    from coldroom.output.json_schema import result_schema

    return {command: result_schema(command) for command in COMMANDS}


def test_every_command_has_cases(documents) -> None:
    from coldroom.output.json_contract import COMMANDS

    assert {command for command, _ in documents} == set(COMMANDS)
    assert sum(1 for command, _ in documents if command == "select") >= 5


def test_the_envelope(documents) -> None:
    for (command, case), doc in documents.items():
        assert list(doc)[:4] == ["schema_version", "command", "versions", "project"], (command, case)
        assert doc["schema_version"] == "1" and doc["command"] == command
        assert set(doc["versions"]) == {"coldroom", "coolprop", "python"}
        assert doc["versions"]["python"] == ".".join(map(str, sys.version_info[:3]))
        if command == "cycle":
            assert doc["project"] is None
            continue
        project = doc["project"]
        assert set(project) == {"name", "client", "site", "prepared_by", "date", "units", "file", "sha256"}
        demo = REPO / "project_files" / f"{case}.yaml"
        assert project["file"] == str(demo)  # the path as given
        assert project["sha256"] == hashlib.sha256(demo.read_bytes()).hexdigest()
        assert project["units"] in ("SI", "IP")


def test_every_document_validates_against_its_schema(documents, schemas) -> None:
    for (command, case), doc in documents.items():
        errors = sorted(jsonschema.Draft202012Validator(schemas[command]).iter_errors(doc), key=str)
        assert not errors, (command, case, [f"{list(e.absolute_path)}: {e.message[:200]}" for e in errors[:5]])


def test_the_schemas_are_draft_2020_12(schemas) -> None:
    for command, schema in schemas.items():
        assert schema["$schema"] == "https://json-schema.org/draft/2020-12/schema"
        jsonschema.Draft202012Validator.check_schema(schema)
        assert schema["properties"]["command"]["const"] == command


def test_a_planted_wrong_type_or_unknown_key_fails(documents, schemas) -> None:
    size = copy.deepcopy(documents["size", "combo_cooler_freezer"])
    validator = jsonschema.Draft202012Validator(schemas["size"])
    assert validator.is_valid(size)
    wrong = copy.deepcopy(size)
    wrong["rooms"][0]["daily_energy_kwh"] = "12.5"
    assert not validator.is_valid(wrong)
    wrong = copy.deepcopy(size)
    wrong["systems"][0]["cycle"]["states"][0]["p_pa"] = None
    assert not validator.is_valid(wrong)
    unknown = copy.deepcopy(size)
    unknown["systems"][0]["charge"]["parts"][0]["kg"] = 1.0  # the old key
    assert not validator.is_valid(unknown)
    missing = copy.deepcopy(documents["cycle", "R-134a"])
    del missing["mass_flow_kg_s"]
    assert not jsonschema.Draft202012Validator(schemas["cycle"]).is_valid(missing)
    versioned = copy.deepcopy(missing)
    versioned["schema_version"] = 1  # a string, not a number
    assert not jsonschema.Draft202012Validator(schemas["cycle"]).is_valid(versioned)


def test_every_key_follows_the_naming_rule(documents) -> None:
    problems = sorted({(command, path, problem) for (command, _), doc in documents.items()
                       for path, problem in walk(doc)})
    assert not problems, problems[:20]


def test_money_comes_with_its_currency(documents) -> None:
    for (command, case), doc in documents.items():
        text = json.dumps(doc)
        if re.search(r'_(price|cost)(_per_[a-z0-9]+)?": ', text) or '"price": ' in text:
            assert '"currency": ' in text, (command, case)


def _schema_properties(schema: dict) -> Iterator[tuple[str, str, dict]]:
    """(object name, key, property schema) for every property of the schema and its $defs."""
    for name, node in [("document", schema), *schema.get("$defs", {}).items()]:
        for key, prop in node.get("properties", {}).items():
            yield name, key, prop


def _types(prop: dict, defs: dict) -> set[str]:
    out: set[str] = set()
    for option in prop.get("anyOf", [prop]):
        if "$ref" in option:
            out.add("ref:" + option["$ref"].rsplit("/", 1)[-1])
        elif option.get("type") == "array":
            out |= {"array:" + t for t in _types(option.get("items", {}), defs)}
        elif "type" in option:
            out.add(option["type"])
    return out


def test_every_schema_property_follows_the_naming_rule(schemas) -> None:
    """The rule on every key the schemas allow, including keys no demo shows."""
    problems = []
    for command, schema in schemas.items():
        defs = schema.get("$defs", {})
        # objects whose keys are names under a unit-suffixed (or counting) parent key
        inherited = {t[4:] for _, key, prop in _schema_properties(schema) if _has_unit(key) or key in COUNT_OBJECTS
                     for t in _types(prop, defs) if t.startswith("ref:")}
        for owner, key, prop in _schema_properties(schema):
            if owner in inherited:
                if " " in key:
                    problems.append((command, owner, key, "a space"))
                continue
            problems += [(command, owner, key, p) for p in key_problems(key)]
            types = _types(prop, defs)
            numeric = types & {"number", "array:number"}
            if numeric and re.search(r"(price|cost)", key) and not MONEY.search(key):
                problems.append((command, owner, key, "money is ..._price or ..._cost"))
            if numeric and not (_has_unit(key) or _dimensionless(key) or key in ISSUE_KEYS):
                problems.append((command, owner, key, "a number without its unit in the key"))
            if types & {"integer"} and not (key in COUNT_KEYS or _has_unit(key)):
                problems.append((command, owner, key, "an integer that is neither a count nor a quantity"))
    assert not problems, sorted(set(problems))[:20]


def test_the_naming_rule_catches_the_old_keys() -> None:
    """The walker itself: each break the contract fixed is caught."""
    old = {"run_hours": 16.0, "balance_evaporating_c": -8.0, "hours_h": 8760.0, "electricity_kwh_per_day_by_use":
           {"condenser fans": 1.0}, "charge": {"parts": [{"part": "liquid line", "kg": 0.1}]}, "service_life": 15.0,
           "total price": 3.0, "average": 3.0, "hourly": [1.0, 2.0]}
    found = {path for path, _ in walk(old)}
    assert found >= {"run_hours", "balance_evaporating_c", "hours_h", "electricity_kwh_per_day_by_use.condenser fans",
                     "charge.parts.kg", "service_life", "total price", "average", "hourly[]"}, found


# --- the schema command ----------------------------------------------------------------------------


def test_schema_command_prints_each_result_schema(schemas) -> None:
    from typer.testing import CliRunner

    from coldroom.cli import app

    runner = CliRunner()
    for command, schema in schemas.items():
        result = runner.invoke(app, ["schema", "--result", command])
        assert result.exit_code == 0 and json.loads(result.stdout) == schema, command
    project_schema = json.loads(runner.invoke(app, ["schema"]).stdout)
    assert "rooms" in project_schema.get("properties", {})  # the project file's, as before
    catalogue_schema = runner.invoke(app, ["schema", "--catalogue"])
    assert catalogue_schema.exit_code == 0 and json.loads(catalogue_schema.stdout) != project_schema
    bad = runner.invoke(app, ["schema", "--result", "quote-me"])
    assert bad.exit_code == 2 and "load, size, check, select, compare, cycle, quote" in bad.stderr


def test_schema_of_a_real_process_validates_the_json(documents) -> None:
    """The schema command's one subprocess smoke test (the cycle's own is in test_cycle_cli.py)."""
    schema = subprocess.run([sys.executable, "-m", "coldroom", "schema", "--result", "cycle"], capture_output=True,
                            text=True, timeout=120)
    assert schema.returncode == 0, schema.stderr
    jsonschema.Draft202012Validator(json.loads(schema.stdout)).validate(documents["cycle", "R-134a"])
