"""Every third-party module the package imports is a declared dependency.

The developers' machines have more installed than a fresh machine gets from
``pip install .``; this catches an import that works here and fails there.
"""

from __future__ import annotations

import ast
import re
import sys
from importlib.metadata import packages_distributions
from pathlib import Path

import pytest

tomllib = pytest.importorskip("tomllib")  # Python 3.11+

REPO = Path(__file__).resolve().parents[2]
#: Distributions that come with a declared one, pinned by it (pydantic pins its core).
COMES_WITH = {"pydantic-core": "pydantic"}


def _imported_top_levels() -> set[str]:
    names: set[str] = set()
    for path in (REPO / "coldroom").rglob("*.py"):
        for node in ast.walk(ast.parse(path.read_text(encoding="utf-8"))):
            if isinstance(node, ast.Import):
                names.update(alias.name.split(".")[0] for alias in node.names)
            elif isinstance(node, ast.ImportFrom) and node.level == 0 and node.module:
                names.add(node.module.split(".")[0])
    return {n for n in names if n != "coldroom" and n not in sys.stdlib_module_names}


def _declared(extra: str | None = None) -> set[str]:
    project = tomllib.loads((REPO / "pyproject.toml").read_text(encoding="utf-8"))["project"]
    specs = project["dependencies"] + (project["optional-dependencies"][extra] if extra else [])
    return {re.split(r"[<>=!~\[; ]", spec, maxsplit=1)[0].lower().replace("_", "-") for spec in specs}


def test_the_serve_extra_is_imported_only_by_the_serve_package() -> None:
    """starlette and uvicorn (``pip install ".[serve]"``) are imported under ``coldroom/serve`` only."""
    extra = _declared("serve") - _declared()
    for path in (REPO / "coldroom").rglob("*.py"):
        if "serve" in path.relative_to(REPO / "coldroom").parts[:1]:
            continue
        for node in ast.walk(ast.parse(path.read_text(encoding="utf-8"))):
            names = [a.name for a in node.names] if isinstance(node, ast.Import) else (
                [node.module] if isinstance(node, ast.ImportFrom) and node.module else [])
            assert not {n.split(".")[0] for n in names} & extra, path


def test_every_imported_distribution_is_declared() -> None:
    owners = packages_distributions()
    declared = _declared("serve")  # the serve extra's modules are checked above to stay in coldroom/serve
    missing = {}
    for module in sorted(_imported_top_levels()):
        dists = {d.lower().replace("_", "-") for d in owners.get(module, [module])}
        dists |= {COMES_WITH[d] for d in dists if d in COMES_WITH}
        if not dists & declared:
            missing[module] = sorted(dists)
    assert not missing, f"imported but not in [project].dependencies: {missing}"
