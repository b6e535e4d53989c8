"""The package's imports follow the contributor guide: no circles, nothing the "may import" table forbids.

Every ``import`` and ``from … import`` in ``coldroom/`` is read with :mod:`ast`,
at module level and inside functions alike (a lazy import is still a
dependency); only ``if TYPE_CHECKING:`` blocks are skipped (they never run).
The rule is the stage order (:data:`STAGES`): foundation, data, physics, loads,
equipment, inputs, design, output, the CLI; nothing imports a stage above its own.
"""

from __future__ import annotations

import ast
import re
from pathlib import Path

REPO = Path(__file__).resolve().parents[2]
PACKAGE = REPO / "coldroom"


def _modules() -> dict[str, Path]:
    out = {}
    for path in PACKAGE.rglob("*.py"):
        parts = path.relative_to(REPO).with_suffix("").parts
        name = ".".join(parts[:-1] if parts[-1] == "__init__" else parts)
        out[name] = path
    return out


def _is_type_checking(node: ast.If) -> bool:
    test = node.test
    return (isinstance(test, ast.Name) and test.id == "TYPE_CHECKING") or (
        isinstance(test, ast.Attribute) and test.attr == "TYPE_CHECKING"
    )


def _import_nodes(tree: ast.AST):
    """Import statements, skipping the bodies of ``if TYPE_CHECKING:``."""
    stack = [tree]
    while stack:
        node = stack.pop()
        if isinstance(node, ast.If) and _is_type_checking(node):
            stack.extend(node.orelse)
            continue
        if isinstance(node, (ast.Import, ast.ImportFrom)):
            yield node
        stack.extend(ast.iter_child_nodes(node))


def _targets(name: str, path: Path, node: ast.AST, modules: dict[str, Path]) -> set[str]:
    """The coldroom modules one import statement loads (the deepest module each name resolves to)."""
    package = name if path.name == "__init__.py" else name.rpartition(".")[0]
    found = set()
    if isinstance(node, ast.Import):
        candidates = [alias.name for alias in node.names]
    else:
        if node.level:
            base = package.split(".")[: len(package.split(".")) - (node.level - 1)]
            module = ".".join(base + ([node.module] if node.module else []))
        else:
            module = node.module or ""
        candidates = [f"{module}.{alias.name}" if f"{module}.{alias.name}" in modules else module for alias in node.names]
    for candidate in candidates:
        if candidate.split(".")[0] != "coldroom":
            continue
        while candidate not in modules and "." in candidate:
            candidate = candidate.rpartition(".")[0]
        found.add(candidate)
    return found


def import_graph() -> dict[str, set[str]]:
    modules = _modules()
    graph = {}
    for name, path in modules.items():
        tree = ast.parse(path.read_text(encoding="utf-8"), str(path))
        deps: set[str] = set()
        for node in _import_nodes(tree):
            deps |= _targets(name, path, node, modules)
        deps.discard(name)
        graph[name] = deps
    return graph


def _cycles(graph: dict[str, set[str]]) -> list[list[str]]:
    """Strongly connected components with more than one module (Tarjan)."""
    index: dict[str, int] = {}
    low: dict[str, int] = {}
    stack: list[str] = []
    on_stack: set[str] = set()
    out: list[list[str]] = []
    counter = [0]

    def visit(v: str) -> None:
        index[v] = low[v] = counter[0]
        counter[0] += 1
        stack.append(v)
        on_stack.add(v)
        for w in sorted(graph.get(v, ())):
            if w not in index:
                visit(w)
                low[v] = min(low[v], low[w])
            elif w in on_stack:
                low[v] = min(low[v], index[w])
        if low[v] == index[v]:
            component = []
            while True:
                w = stack.pop()
                on_stack.discard(w)
                component.append(w)
                if w == v:
                    break
            if len(component) > 1:
                out.append(sorted(component))

    for v in sorted(graph):
        if v not in index:
            visit(v)
    return out


def test_the_walker_sees_function_level_imports() -> None:
    graph = import_graph()
    # sizing imports the cycle inside its functions only (CoolProp stays lazy): still an edge
    assert "coldroom.physics.cycle" in graph["coldroom.design.sizing"]
    assert "coldroom.physics.refrigerant" in graph["coldroom.physics.cycle"]


def test_cycle_finder_finds_a_planted_circle() -> None:
    assert _cycles({"a": {"b"}, "b": {"c"}, "c": {"a"}, "d": {"a"}}) == [["a", "b", "c"]]
    assert _cycles({"a": {"b"}, "b": set()}) == []


#: Circles that exist on purpose for now, each with what removes it. The test fails on any other
#: circle, and on a listed one that has gone (so the list only shrinks).
KNOWN_CIRCLES: dict[frozenset[str], str] = {}


def test_no_import_circles() -> None:
    found = {frozenset(component) for component in _cycles(import_graph())}
    assert sorted(sorted(c) for c in found - set(KNOWN_CIRCLES)) == []
    gone = [sorted(c) for c in set(KNOWN_CIRCLES) - found]
    assert not gone, f"remove these from KNOWN_CIRCLES, they are fixed: {gone}"


#: The stages, lowest first. A module may import its own stage and the stages below it, never one
#: above. The foundation is the handful of top-level modules every stage shares (errors, the
#: constants, units, name look-ups, result records, the design rules of thumb); DEVELOPERS.md
#: ("Layout") and each package's ``__init__`` docstring say the same in words.
STAGES: tuple[tuple[str, ...], ...] = (
    ("errors", "constants", "units", "registry", "results", "rules"),
    ("data",),
    ("physics",),
    ("loads",),
    ("equipment",),
    ("inputs",),
    ("design",),
    ("output",),
    ("cli", "cli_runtime", "__main__", "serve"),
)


def stage_of(module: str) -> int:
    """The stage index of ``coldroom.x.y`` (its top-level module or package); -1 for ``coldroom``."""
    parts = module.split(".")
    if len(parts) == 1:
        return -1
    for index, names in enumerate(STAGES):
        if parts[1] in names:
            return index
    raise AssertionError(f"{module}: not in any stage; add it to STAGES and to DEVELOPERS.md")


def test_every_module_belongs_to_a_stage() -> None:
    for module in import_graph():
        stage_of(module)


def test_a_lower_stage_never_imports_a_higher_one() -> None:
    bad = []
    for module, deps in sorted(import_graph().items()):
        for dep in sorted(deps):
            if stage_of(dep) > stage_of(module):
                bad.append(f"{module} (stage {stage_of(module)}) imports {dep} (stage {stage_of(dep)})")
    assert not bad, "\n".join(bad)


def test_the_stage_rule_catches_an_upward_import() -> None:
    assert stage_of("coldroom.physics.cycle") < stage_of("coldroom.design.sizing")
    assert stage_of("coldroom.inputs.projectfile") > stage_of("coldroom.loads.hourly")
    assert stage_of("coldroom.errors") == 0


def test_each_package_says_what_it_owns_and_may_import() -> None:
    for names in STAGES:
        for name in names:
            init = PACKAGE / name / "__init__.py"
            if init.exists():
                doc = ast.get_docstring(ast.parse(init.read_text(encoding="utf-8"))) or ""
                assert "May import" in doc, f"{init}: the docstring says what the package may import"


def test_only_the_glue_reads_the_project_model() -> None:
    """Within the existing-unit package, the models and numerics never see the project file."""
    graph = import_graph()
    for module in ("compressors", "balance", "verdict"):
        deps = graph[f"coldroom.equipment.{module}"]
        model = {dep for dep in deps if dep.startswith("coldroom.inputs.projectfile")}
        assert not model | (deps & {"coldroom.loads", "coldroom.design.existing"}), (module, deps)


def test_the_orchestrator_is_imported_only_from_above() -> None:
    """Only the CLI, the commands' outputs (output.produce, shared with serve), the option comparison, the
    equipment selection and the job as equipped (which work on whole sizings) import sizing; and the JSON envelope
    and the costing workbook, for the sheet's date and the versions."""
    importers = sorted(m for m, deps in import_graph().items() if "coldroom.design.sizing" in deps)
    allowed = {"coldroom.cli", "coldroom.design.annual", "coldroom.design.selection", "coldroom.design.job",
               "coldroom.output.json_contract", "coldroom.output.produce", "coldroom.output.costing"}
    assert set(importers) <= allowed, importers


def _imports_coolprop(path: Path) -> bool:
    for node in ast.walk(ast.parse(path.read_text(encoding="utf-8"), str(path))):
        if isinstance(node, ast.Import) and any(a.name.split(".")[0] == "CoolProp" for a in node.names):
            return True
        if isinstance(node, ast.ImportFrom) and (node.module or "").split(".")[0] == "CoolProp":
            return True
    return False


def test_only_the_refrigerant_package_imports_coolprop() -> None:
    """CoolProp is behind one door: ``coldroom.physics.refrigerant`` (its range guards and
    the blend tables are there); everything else asks it for states."""
    importers = sorted(name for name, path in _modules().items() if _imports_coolprop(path))
    assert importers, "the walker found no CoolProp import at all"
    outside = [name for name in importers if not name.startswith("coldroom.physics.refrigerant")]
    assert not outside, f"only coldroom.physics.refrigerant may import CoolProp: {outside}"
