"""Shared test settings.

Hypothesis runs derandomized (a fixed seed) so a failure is reproducible and CI
is deterministic.
"""

from __future__ import annotations

from pathlib import Path

from hypothesis import HealthCheck, settings

settings.register_profile(
    "coldroom",
    derandomize=True,
    deadline=None,
    max_examples=60,
    suppress_health_check=[HealthCheck.too_slow],
)
settings.load_profile("coldroom")

REPO = Path(__file__).resolve().parent.parent
PROJECT_FILES = REPO / "project_files"
TEST_DATA = Path(__file__).resolve().parent / "data"


def pytest_sessionfinish(session, exitstatus):  # noqa: ARG001 - pytest's hook signature
    """Let go of the CoolProp states the project caches (memoised functions, module-level tables)
    before the interpreter exits, so CoolProp's binding layer finds nothing alive at shutdown
    (under pytest-xdist each worker's exit otherwise prints "nanobind: leaked N instances")."""
    import gc
    import sys

    for name, module in list(sys.modules.items()):
        if not (name == "coldroom" or name.startswith("coldroom.")) or module is None:
            continue
        for value in list(vars(module).values()):
            if callable(getattr(value, "cache_clear", None)):
                value.cache_clear()
            elif isinstance(value, dict) and any(type(v).__module__.startswith("CoolProp") for v in list(value.values())[:1]):
                value.clear()
    gc.collect()


def drawing_strings(node):
    """Every reportlab ``String`` in a Drawing or Group, nested groups included (for chart tests)."""
    from reportlab.graphics.shapes import Group, String

    for item in getattr(node, "contents", []):
        if isinstance(item, String):
            yield item
        elif isinstance(item, Group):
            yield from drawing_strings(item)
