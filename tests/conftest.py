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
