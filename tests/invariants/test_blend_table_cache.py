"""A blend's saturation table gives the same digits however it was filled: segments fitted in any
order, or read back from the disk cache (coldroom.physics.disk_cache), give bit-identical
saturation temperatures, pressures and states (issue #27). Invariants, no outside source: the
reference is a fresh table of the same code, fitted on demand."""

from __future__ import annotations

import random

import pytest

from coldroom.data.refrigerants import lookup
from coldroom.physics.refrigerant.fluid import Fluid

BLENDS = ("R-448A", "R-407F")
#: Dew and bubble temperatures across the working range [K].
TEMPERATURES = [233.15 + 2.9 * i for i in range(22)]


def _fresh(name: str, monkeypatch, folder) -> Fluid:
    monkeypatch.setenv("COLDROOM_CACHE_DIR", str(folder))
    return Fluid(lookup(name))


@pytest.mark.parametrize("name", BLENDS)
def test_segment_fits_do_not_depend_on_the_order(name, monkeypatch, tmp_path) -> None:
    ascending = _fresh(name, monkeypatch, tmp_path / "a")._table
    shuffled = _fresh(name, monkeypatch, tmp_path / "b")._table
    keys = [(k, q) for k in range(0, ascending.last + 1, 4) for q in (0.0, 1.0)]
    for k, q in keys:
        ascending._segment(k, q)
    order = keys[:]
    random.Random(27).shuffle(order)
    for k, q in order:
        shuffled._segment(k, q)
    assert all(ascending.segments[key] == shuffled.segments[key] for key in keys)


@pytest.mark.parametrize("name", BLENDS)
def test_saturation_pressure_does_not_depend_on_the_segments_already_fitted(name, monkeypatch, tmp_path) -> None:
    """The first guess of the T → p search starts from whatever segment is fitted; the answer
    comes from the one segment that holds the temperature, so it is the same."""
    fresh = _fresh(name, monkeypatch, tmp_path / "a")._table
    primed = _fresh(name, monkeypatch, tmp_path / "b")._table
    for k in range(0, primed.last + 1, 3):
        primed._segment(k, 1.0)
        primed._segment(k, 0.0)
    for quality in (1.0, 0.0):
        for temperature in TEMPERATURES:
            assert fresh.log_pressure(temperature, quality) == primed.log_pressure(temperature, quality), temperature


@pytest.mark.parametrize("name", BLENDS)
def test_a_table_read_back_from_disk_gives_the_same_states(name, monkeypatch, tmp_path) -> None:
    first = _fresh(name, monkeypatch, tmp_path / "cache")
    states = [first.saturated_state(q, temperature=t - 273.15) for q in (0.0, 1.0) for t in TEMPERATURES[::3]]
    first._table.keep()
    again = _fresh(name, monkeypatch, tmp_path / "cache")
    assert again._table.segments == first._table.segments

    def no_fit(*args):
        raise AssertionError("a segment was fitted again instead of read back")

    monkeypatch.setattr(again, "_saturation_raw", no_fit)
    assert [again.saturated_state(q, temperature=t - 273.15) for q in (0.0, 1.0) for t in TEMPERATURES[::3]] == states
