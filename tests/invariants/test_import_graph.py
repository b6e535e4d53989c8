"""The package's imports follow the contributor guide: no circles, nothing the "may import" table forbids.

Every ``import`` and ``from … import`` in ``coldroom/`` is read with :mod:`ast`,
at module level and inside functions alike (a lazy import is still a
dependency); only ``if TYPE_CHECKING:`` blocks are skipped (they never run).
The allowed imports are read from the architecture table in DEVELOPERS.md, so
the guide and the code cannot drift apart: a new module needs a row there.
"""

from __future__ import annotations

import ast
import re
from pathlib import Path

REPO = Path(__file__).resolve().parents[2]
PACKAGE = REPO / "coldroom"
GUIDE = REPO / "DEVELOPERS.md"


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


def _unit(name: str, table: dict) -> str:
    """The table row a module falls under: its own row (``equipment/glue``) if it has one, else its
    package's (``loads``) or top-level module's (``sizing``); ``coldroom`` for the package itself."""
    parts = name.split(".")[1:]
    while parts:
        key = "/".join(parts)
        if key in table:
            return key
        parts = parts[:-1]
    return name.split(".")[1] if "." in name else "coldroom"


def may_import_table() -> dict[str, set[str] | None]:
    """{unit: allowed coldroom units (None = any)} from the guide's architecture table."""
    text = GUIDE.read_text(encoding="utf-8")
    table: dict[str, set[str] | None] = {}
    for line in text.splitlines():
        cells = [c.strip() for c in line.strip().strip("|").split("|")]
        if len(cells) != 4 or not cells[0].startswith("`"):
            continue
        unit = cells[0].strip("`").removesuffix(".py").removesuffix("/")
        allowed = cells[3]
        if allowed == "any":
            table[unit] = None
        else:
            table[unit] = set(re.findall(r"`([\w./]+)`", allowed))
    return table


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
    # sizing imports the cycle inside size_room only (CoolProp stays lazy): still an edge
    assert "coldroom.cycle" in graph["coldroom.sizing"]
    assert "coldroom.refrigerant" in graph["coldroom.cycle"]


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


def test_every_module_has_a_row_in_the_guide() -> None:
    table = may_import_table()
    missing = sorted({_unit(m, table) for m in import_graph()} - set(table) - {"coldroom"})
    assert not missing, f"add these to the DEVELOPERS.md architecture table: {missing}"


def _allowed(unit: str, target: str, allowed: set[str]) -> bool:
    """A module may import its own unit, its package's own modules (a package its submodules),
    ``coldroom`` itself, what its row lists, and the modules of a package its row lists."""
    if target in (unit, "coldroom") or target in allowed:
        return True
    if target.startswith(unit + "/"):
        return True
    return target.split("/")[0] in allowed


def test_imports_follow_the_may_import_table() -> None:
    table = may_import_table()
    bad = []
    for module, deps in sorted(import_graph().items()):
        unit = _unit(module, table)
        allowed = table.get(unit, set())
        if allowed is None:
            continue
        for dep in sorted(deps):
            target = _unit(dep, table)
            if not _allowed(unit, target, allowed):
                bad.append(f"{module} imports {dep} ({target!r} is not in {unit!r}'s may-import list)")
    assert not bad, "\n".join(bad)


def test_only_the_glue_reads_the_project_model() -> None:
    """Within the existing-unit package, the models and numerics never see the project file."""
    graph = import_graph()
    for module in ("compressors", "balance", "verdict"):
        deps = graph[f"coldroom.equipment.{module}"]
        assert not deps & {"coldroom.projectfile", "coldroom.loads", "coldroom.equipment.glue"}, (module, deps)


def test_the_orchestrator_is_imported_only_from_above() -> None:
    """Only the CLI, the option comparison and the equipment selection (which work on whole sizings) import sizing."""
    importers = sorted(m for m, deps in import_graph().items() if "coldroom.sizing" in deps)
    assert set(importers) <= {"coldroom.cli", "coldroom.annual", "coldroom.selection"}, importers
