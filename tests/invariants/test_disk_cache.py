"""The disk cache (coldroom.physics.disk_cache) changes nothing but the time: the sizing sheet is
byte-identical with the cache cold, warm (chart data and blend table read back) or off; a damaged entry is rebuilt; the chart data read
back equals the data computed; the folder follows COLDROOM_CACHE_DIR and the XDG Base Directory
rule (XDG Base Directory Specification 0.8, $XDG_CACHE_HOME: unset, empty or relative → ~/.cache)."""

from __future__ import annotations

import json
from pathlib import Path

import pytest
from typer.testing import CliRunner

from coldroom.physics import disk_cache
from tests.conftest import PROJECT_FILES

DEMO = PROJECT_FILES / "produce_cooler.yaml"  # R-448A: the costliest chart data (a blend)


def test_the_folder_follows_the_environment() -> None:
    home = Path("~").expanduser()
    assert disk_cache.folder({}) == home / ".cache" / "coldroom"
    assert disk_cache.folder({"COLDROOM_CACHE_DIR": ""}) == home / ".cache" / "coldroom"  # empty: as unset
    assert disk_cache.folder({"XDG_CACHE_HOME": "relative/path"}) == home / ".cache" / "coldroom"
    assert disk_cache.folder({"XDG_CACHE_HOME": "/x/cache"}) == Path("/x/cache/coldroom")
    assert disk_cache.folder({"XDG_CACHE_HOME": "/x/cache", "COLDROOM_CACHE_DIR": "/y"}) == Path("/y")
    assert disk_cache.folder({"COLDROOM_CACHE_DIR": "off"}) is None


def test_chart_data_read_back_equals_the_data_computed() -> None:
    """Above 3 s when first in its process: CoolProp's import and its R-134a model."""
    from coldroom.physics.chart_data import _compute, _from_json, _to_json

    data = _compute("R-134a", 50e3, 5e6, (0.0, 40.0), (1750.0,))
    assert _from_json(json.loads(json.dumps(_to_json(data)))) == data


def _forget_in_process() -> None:
    """Drop the per-process caches, so each run below starts like a new process."""
    from coldroom.output.pdf import phchart
    from coldroom.physics.chart_data import chart_data
    from coldroom.physics.refrigerant import blend_table, fluid

    blend_table.keep_tables()  # what a process does at exit
    chart_data.cache_clear()
    fluid._fluid_by_name.cache_clear()  # a new fluid reads its blend table back
    phchart._BACKGROUNDS.clear()


def _sheet(tmp_path: Path, name: str) -> bytes:
    from coldroom.cli import app

    _forget_in_process()
    out = tmp_path / f"{name}.pdf"
    result = CliRunner().invoke(app, ["size", str(DEMO), "--out", str(out)])
    assert result.exit_code == 0, result.output
    return out.read_bytes()


def test_the_sheet_is_byte_identical_cold_warm_off_and_rebuilt(tmp_path, monkeypatch) -> None:
    """Above 3 s: four whole `size` runs of a demo (cold, warm, damaged entry, off)."""
    import coldroom.physics.chart_data as chart_module

    monkeypatch.setenv("SOURCE_DATE_EPOCH", "1790000000")
    cache = tmp_path / "cache"
    monkeypatch.setenv("COLDROOM_CACHE_DIR", str(cache))
    cold = _sheet(tmp_path, "cold")
    entries = sorted(cache.glob("chart-*.json"))
    assert entries, "the cold run keeps the chart data"
    assert not list(cache.glob("*.tmp")), "no temporary file left behind"

    computed = []
    compute = chart_module._compute
    monkeypatch.setattr(chart_module, "_compute", lambda *a: computed.append(a) or compute(*a))
    warm = _sheet(tmp_path, "warm")
    assert computed == [], "the warm run reads the chart data back"
    assert list(cache.glob("blend-table-*.json")), "and the R-448A saturation table"
    assert warm == cold

    entries[0].write_bytes(b'{"key": {"kind": "chart"}, "value": [1, 2')  # a torn or damaged entry
    rebuilt = _sheet(tmp_path, "rebuilt")
    assert len(computed) == 1 and rebuilt == cold
    json.loads(entries[0].read_bytes())  # rewritten whole

    monkeypatch.setenv("COLDROOM_CACHE_DIR", "off")
    off_cache = tmp_path / "untouched"
    monkeypatch.setenv("XDG_CACHE_HOME", str(off_cache))
    assert _sheet(tmp_path, "off") == cold
    assert not off_cache.exists()


def test_an_unwritable_folder_is_no_error(tmp_path, monkeypatch) -> None:
    blocker = tmp_path / "a-file"
    blocker.write_text("not a folder")
    monkeypatch.setenv("COLDROOM_CACHE_DIR", str(blocker / "cache"))
    disk_cache.store("chart", {"CoolProp": "any", "x": 1}, [1.5])  # nothing raised
    assert disk_cache.load("chart", {"CoolProp": "any", "x": 1}) is None


def test_floats_come_back_bit_for_bit(tmp_path, monkeypatch) -> None:
    monkeypatch.setenv("COLDROOM_CACHE_DIR", str(tmp_path))
    values = [0.1, 1 / 3, 2.0**-1074, 1.7976931348623157e308, -0.0, 123456.789e-300]
    disk_cache.store("test", {"CoolProp": "any", "n": 1}, values)
    back = disk_cache.load("test", {"CoolProp": "any", "n": 1})
    assert [v.hex() for v in back] == [v.hex() for v in values]
    assert disk_cache.load("test", {"CoolProp": "any", "n": 2}) is None


def test_a_value_with_nan_is_not_kept(tmp_path, monkeypatch) -> None:
    """The entries are strict JSON (RFC 8259 has no NaN): such a value is simply not kept."""
    monkeypatch.setenv("COLDROOM_CACHE_DIR", str(tmp_path))
    disk_cache.store("test", {"CoolProp": "any", "n": 1}, [float("nan")])
    assert disk_cache.load("test", {"CoolProp": "any", "n": 1}) is None
    assert list(tmp_path.iterdir()) == []


def test_a_key_must_name_the_coolprop_version(tmp_path, monkeypatch) -> None:
    monkeypatch.setenv("COLDROOM_CACHE_DIR", str(tmp_path))
    with pytest.raises(ValueError):
        disk_cache.store("test", {"n": 1}, [1.0])
