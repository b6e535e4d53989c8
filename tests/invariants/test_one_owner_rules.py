"""Rules with one owner give one answer wherever they are applied.

Each test takes two routes that used to hold their own copy of a rule
(validate and size and the cycle; ``coldroom cycle`` and a project's
refrigeration block; the cycle's and the existing unit's pressure-ratio flag)
and checks that they now agree. Two scans of the syntax tree keep the owners
single: (1 + SF)·E is written once (``coldroom.rules``), and the physical
constants (101 325 Pa, 273.15 K, g, 86 400 s) are numbers only in
``coldroom/constants.py`` (data tables and tests exempt); each scan has a test
that it catches a planted case.
"""

from __future__ import annotations

import ast
import json
import math
from importlib.resources import files
from pathlib import Path

import pytest

from coldroom import rules as design
from coldroom.data import refrigerants
from coldroom.errors import CalculationError

STARTER = files("coldroom.data").joinpath("starter.yaml").read_text(encoding="utf-8")


def _project(refrigerant: str, condenser_air: float, condenser_td: float = 10.0) -> str:
    return STARTER.replace(
        "      refrigerant: R-448A      # `coldroom refrigerants` lists the catalogue\n",
        f"      refrigerant: {refrigerant}\n"
        f"      condenser_air_temperature: {condenser_air!r} °C\n"
        f"      condenser_td: {condenser_td!r} K\n",
    )


# --- (a) the R-744 transcritical boundary ------------------------------------------------------


@pytest.mark.parametrize("side", [-1, 1], ids=["below", "above"])
def test_validate_size_and_cycle_agree_on_the_r744_boundary(side: int) -> None:
    """One rule (coldroom.physics.cycle.r744_transcritical): validate accepts, size sizes on the same side."""
    from coldroom.physics.cycle import R744_SUBCRITICAL_MARGIN, r744_transcritical, solve_cycle
    from coldroom.inputs.opening import open_project_text
    from coldroom.design.sizing import size_project

    critical = refrigerants.limits("R-744")[1]
    condensing = critical - R744_SUBCRITICAL_MARGIN + side * 0.05
    model = open_project_text(_project("R-744", condensing - 10.0), "co2.yaml")  # validate accepts both sides
    temps = design.room_design_temperatures(model, model.rooms[0])
    assert temps.condensing_temperature == pytest.approx(condensing)
    above = side > 0
    assert r744_transcritical(condensing) is above
    result = size_project(model, "co2.yaml", b"").rooms[0]
    assert result.cycle.transcritical is above
    if above:
        with pytest.raises(CalculationError, match="transcritical"):
            solve_cycle("R-744", temps.evaporating_temperature, condensing, 5000.0)


# --- (b) the pressure-ratio advisory ------------------------------------------------------------


def test_pressure_ratio_table_has_a_limit_and_a_trade_tag_for_every_application() -> None:
    for application in ("medium", "low"):
        limit, source = design.PRESSURE_RATIO_LIMITS[application]
        assert 5.0 < limit < 20.0 and "[trade]" in source
    # a low-temperature compressor is allowed more lift than a medium-temperature one
    assert design.pressure_ratio_limit(-30.0) > design.pressure_ratio_limit(-10.0)


def test_ordinary_low_temperature_r448a_unit_gets_no_two_stage_advisory() -> None:
    """A −20 °C freezer: evaporating −25.5 °C (TD 5.5 K), condensing 42 °C: ratio ≈ 9."""
    from coldroom.physics.cycle import solve_cycle

    r = solve_cycle("R-448A", -25.5, 42.0, 5000.0)
    assert 8.4 <= r.pressure_ratio <= 9.2
    assert not any("pressure ratio" in w for w in r.warnings)
    # the same rule flags the same ratio on a medium-temperature suction
    assert design.pressure_ratio_advisory(r.pressure_ratio, -10.0) is not None
    # and a low-temperature lift past the limit
    deep = solve_cycle("R-448A", -40.0, 45.0, 5000.0)
    assert deep.pressure_ratio > design.pressure_ratio_limit(-40.0)
    assert any("pressure ratio" in w and "two stages" in w for w in deep.warnings)
    assert not design.single_stage_application(deep.pressure_ratio, -40.0)


def test_no_two_stage_advice_for_an_ordinary_minus_22_walk_in() -> None:
    """Issue 24: a ratio of 10.2 on a −22 °C walk-in is an ordinary single-stage duty.

    Independent route: EN 13215 rates low-temperature condensing units at −35 °C suction (from memory),
    where R-448A's ratio at 40 °C condensing is already above 10 (CoolProp, dew pressures).
    """
    from coldroom.physics.cycle import solve_cycle
    from coldroom.physics.refrigerant import get_fluid

    fluid = get_fluid("R-448A")
    rating_ratio = fluid.dew_pressure(40.0) / fluid.dew_pressure(-35.0)
    assert rating_ratio > 10.2
    assert design.single_stage_application(rating_ratio, -35.0)
    r = solve_cycle("R-448A", -29.0, 45.0, 5000.0)
    assert 9.5 < r.pressure_ratio < 12.0
    assert design.pressure_ratio_advisory(r.pressure_ratio, -29.0) is None
    assert not any("two stages" in w for w in r.warnings)


def test_one_discharge_limit_per_family_in_cycle_and_check() -> None:
    """The design cycle and an existing unit's balance use the one limit of the refrigerant's family."""
    from coldroom.physics.cycle import solve_cycle

    assert design.discharge_temperature_limit("R-448A") == design.discharge_temperature_limit("R-404A")
    assert design.discharge_temperature_limit("R-744") == design.DISCHARGE_LIMITS["carbon dioxide"][0]
    for name in design.DISCHARGE_LIMITS:
        assert "[trade]" in design.DISCHARGE_LIMITS[name][1]
    hot = solve_cycle("R-448A", -40.0, 50.0, 5000.0, superheat=20.0)
    flagged = [w for w in hot.warnings if "discharge temperature" in w]
    if hot.discharge_temperature > design.discharge_temperature_limit("R-448A"):
        from coldroom.physics.limits import discharge_temperature_warning

        assert flagged == [discharge_temperature_warning(hot.discharge_temperature, "R-448A")]
    else:
        assert flagged == []


def test_existing_unit_check_flags_pressure_ratio_by_the_same_table() -> None:
    from coldroom import equipment as E

    compressor = E.RatedPointCompressor.from_rating("R-448A", 4000.0, -35.0, 40.0)
    common = dict(room_temperature=-20.0, daily_energy=4000.0 * 16 * 3600 / 1.1, safety_factor=0.1,
                  run_time=16 * 3600.0, chart_ambients=(), search_max_ambient=False)
    evaporator = E.HeatExchanger.fixed(5.5, ("fixed",))
    condenser = E.HeatExchanger.fixed(10.0, ("fixed",))
    result = E.check_unit(compressor, evaporator, condenser, ambient_temperature=32.0, **common)
    expected = design.pressure_ratio_advisory(result.pressure_ratio, result.balance_evaporating)
    flagged = [w for w in result.warnings if "pressure ratio" in w]
    assert flagged == ([] if expected is None else [expected])


# --- (c) the ambient sweep ----------------------------------------------------------------------


def test_chart_ambients_lie_inside_the_sweep() -> None:
    from coldroom.equipment import CHART_AMBIENTS

    low, high = design.AMBIENT_SWEEP
    assert low < min(CHART_AMBIENTS) and max(CHART_AMBIENTS) < high


# --- (d) one table of cycle defaults ------------------------------------------------------------


def test_project_block_and_solve_cycle_defaults_are_the_table() -> None:
    import inspect

    from coldroom.physics.cycle import solve_cycle
    from coldroom.inputs.projectfile import Refrigeration

    block = Refrigeration()
    parameters = inspect.signature(solve_cycle).parameters
    for name in ("superheat", "suction_line_superheat", "subcooling", "isentropic_efficiency", "clearance"):
        assert getattr(block, name) == getattr(design.CYCLE_DEFAULTS, name), name
        assert parameters[name].default == getattr(design.CYCLE_DEFAULTS, name), name


def test_existing_unit_compressor_defaults_are_the_table() -> None:
    """The rated-point compressor and its operating conditions default to the same table."""
    import inspect

    from coldroom.equipment.compressors import OperatingConditions, RatedPointCompressor

    operating = OperatingConditions()
    for name in ("superheat", "suction_line_superheat", "subcooling"):
        assert getattr(operating, name) == getattr(design.CYCLE_DEFAULTS, name), name
    parameters = inspect.signature(RatedPointCompressor.from_rating).parameters
    for name in ("clearance", "isentropic_efficiency"):
        assert parameters[name].default == getattr(design.CYCLE_DEFAULTS, name), name


def test_cycle_command_with_defaults_matches_the_project_sizing_for_the_same_duty() -> None:
    """The route a contractor takes by hand (`coldroom cycle`) and the project's own sizing agree."""
    from typer.testing import CliRunner

    from coldroom.cli import app
    from coldroom.inputs.opening import open_project_text
    from coldroom.design.sizing import size_project

    model = open_project_text(STARTER, "starter.yaml")
    sized = size_project(model, "starter.yaml", STARTER.encode()).rooms[0]
    out = CliRunner().invoke(app, [
        "cycle", "-r", "R-448A",
        "--evaporating", repr(sized.evaporating_temperature),
        "--condensing", repr(sized.condensing_temperature),
        "--capacity", f"{sized.loads.design_capacity!r} W",
        "--json",
    ])
    assert out.exit_code == 0, out.output
    by_hand = json.loads(out.stdout)
    project = sized.cycle.to_json()
    for key in ("mass_flow_kg_s", "displacement_m3_h", "compressor_power_w", "condenser_duty_w", "cop",
                "discharge_temperature_c", "suction_line_superheat_k", "isentropic_efficiency"):
        assert by_hand[key] == pytest.approx(project[key], rel=1e-12), key


# --- (e) (1 + SF)·E / t_run computed in one place ------------------------------------------------

PACKAGE = Path(__file__).resolve().parents[2] / "coldroom"


def _safety_factor_products(source: str) -> list[int]:
    """Lines of every ``(1 + <something naming a safety factor>) * x`` (either order) in *source*."""
    found = []
    for node in ast.walk(ast.parse(source)):
        if not (isinstance(node, ast.BinOp) and isinstance(node.op, ast.Mult)):
            continue
        for side in (node.left, node.right):
            if (
                isinstance(side, ast.BinOp)
                and isinstance(side.op, ast.Add)
                and any(isinstance(x, ast.Constant) and x.value == 1 for x in (side.left, side.right))
                and "safety" in ast.unparse(side).lower()
            ):
                found.append(node.lineno)
    return sorted(found)


def test_the_safety_factor_scanner_finds_a_planted_formula() -> None:
    planted = "def f(e, sf, t):\n    return (1.0 + sf) * e / t\n\ndef g(load, safety_factor):\n    return load * (1 + safety_factor)\n"
    assert _safety_factor_products(planted) == [5]  # "sf" does not name the safety factor in words
    assert _safety_factor_products(planted.replace("sf", "safety")) == [2, 5]


def test_required_capacity_is_computed_in_one_place() -> None:
    """(1 + SF)·E is written once (rules.with_safety_factor) and E/t_run over it once
    (rules.required_capacity); the results, selection and the existing-unit verdict call them."""
    where = {}
    for path in sorted(PACKAGE.rglob("*.py")):
        lines = _safety_factor_products(path.read_text(encoding="utf-8"))
        if lines:
            where[str(path.relative_to(PACKAGE))] = lines
    assert list(where) == ["rules.py"] and len(where["rules.py"]) == 1, where
    for module in ("results.py", "design/selection.py", "equipment/verdict.py"):
        tree = ast.parse((PACKAGE / module).read_text(encoding="utf-8"))
        called = {n.func.id for n in ast.walk(tree) if isinstance(n, ast.Call) and isinstance(n.func, ast.Name)}
        assert "required_capacity" in called, module
    assert design.required_capacity(3.6e8, 18 * 3600.0, 0.10) == pytest.approx(1.1 * 3.6e8 / 64_800.0)


# --- (f) physical constants have one owner: coldroom/constants.py ------------------------------

#: The values only coldroom/constants.py writes as numbers, with the name to use instead. A
#: docstring or comment that quotes one is text (a str constant), not a number, so it passes.
CONSTANT_LITERALS: dict[float, str] = {
    101325.0: "constants.STANDARD_ATMOSPHERE_PA",
    101.325: "constants.STANDARD_ATMOSPHERE_PA (it is in Pa)",
    273.15: "constants.ZERO_CELSIUS_K",
    9.80665: "constants.STANDARD_GRAVITY_M_S2",
    86400.0: "constants.SECONDS_PER_DAY_S",
}

#: Exempt: the owner itself and the data tables (coldroom/data/).
_LITERAL_EXEMPT = ("constants.py", "data/")

#: Modules that may still write one of the literals, each with the reason; the test fails on
#: any other module and on a listed one that no longer needs it (the list only shrinks).
LITERAL_ALLOWED: dict[str, str] = {}


def _number(node: ast.AST) -> float | None:
    """The value of a number written out of literals only (``273.15``, ``24 * 3600``), else None."""
    if isinstance(node, ast.Constant) and type(node.value) in (int, float):
        return float(node.value)
    if isinstance(node, ast.UnaryOp) and isinstance(node.op, (ast.USub, ast.UAdd)):
        return _number(node.operand)  # the sign does not make it another constant
    if isinstance(node, ast.BinOp) and isinstance(node.op, ast.Mult):
        left, right = _number(node.left), _number(node.right)
        return None if left is None or right is None else left * right
    return None


def _constant_literals(source: str) -> list[tuple[int, float]]:
    """(line, value) of every physical-constant literal written as a number in *source*."""
    found = set()
    for node in ast.walk(ast.parse(source)):
        value = _number(node)
        if value is not None and any(math.isclose(value, c, rel_tol=1e-12) for c in CONSTANT_LITERALS):
            found.add((node.lineno, value))
    return sorted(found)


def test_the_constant_scanner_catches_a_planted_literal() -> None:
    planted = (
        '"""0 °C is 273.15 K; 101325 Pa."""\n'  # docstring: text, exempt
        "t_k = t + 273.15\n"
        "day = 24 * 3600\n"
        "p = 101_325\n"
        "g = -9.80665  # 9.80665 in a comment is not seen\n"
        "hour = 3600.0\n"
    )
    assert [line for line, _ in _constant_literals(planted)] == [2, 3, 4, 5]


def test_physical_constants_are_written_only_in_the_constants_module() -> None:
    found = {}
    for path in sorted(PACKAGE.rglob("*.py")):
        name = path.relative_to(PACKAGE).as_posix()
        if name == _LITERAL_EXEMPT[0] or name.startswith(_LITERAL_EXEMPT[1]):
            continue
        hits = _constant_literals(path.read_text(encoding="utf-8"))
        if hits:
            found[name] = hits
    unexpected = {
        name: [f"line {line}: {value:g} -> {CONSTANT_LITERALS[min(CONSTANT_LITERALS, key=lambda c: abs(c - value))]}" for line, value in hits]
        for name, hits in found.items()
        if name not in LITERAL_ALLOWED
    }
    assert not unexpected, unexpected
    gone = sorted(set(LITERAL_ALLOWED) - set(found))
    assert not gone, f"remove these from LITERAL_ALLOWED, they are clean: {gone}"
