"""Hostile and mistaken project files: one clear line, exit 65, fast, nothing written.

The corpus is tests/data/hostile/*.yaml (made by _generate.py there); the error
each file must produce is in tests/data/hostile/expected.yaml. The contract
checked is the project's own (DEVELOPERS.md "Contracts": exit 65 for an invalid
project file, one line on stderr ``file:line:col: dotted.key: message``, or
``file: message`` for a whole-file problem). The time bounds are ours: a
project file is parsed in well under a second (in-process), and a run of the
command, including the interpreter start, ends within a few seconds.
"""

from __future__ import annotations

import re
import shutil
import subprocess
import sys
import time
from pathlib import Path

import pytest
import yaml

from coldroom.errors import ProjectFileError
from coldroom.inputs.opening import open_project

CORPUS = Path(__file__).resolve().parents[1] / "data" / "hostile"
EXPECTED: dict[str, dict] = yaml.safe_load((CORPUS / "expected.yaml").read_text(encoding="utf-8"))
FILES = sorted(p.name for p in CORPUS.glob("*.yaml") if p.name != "expected.yaml")

#: ``file:line:col: rest`` or ``file: rest``; rest is ``key: message`` when a key is known.
LINE = re.compile(r"^(?P<file>.+?)(?::(?P<line>\d+):(?P<col>\d+))?: (?P<rest>.+)$")

IN_PROCESS_LIMIT = 1.0  # s, parse and validate one file in-process
SUBPROCESS_LIMIT = 8.0  # s, one `python -m coldroom validate` run, interpreter start included (shared CI box)


def run(*args: str, cwd: Path) -> tuple[subprocess.CompletedProcess[str], float]:
    start = time.perf_counter()
    result = subprocess.run(
        [sys.executable, "-m", "coldroom", *args], capture_output=True, text=True, cwd=cwd, timeout=60
    )
    return result, time.perf_counter() - start


def check_line(stderr: str, path: str, expected: dict) -> None:
    lines = stderr.strip().splitlines()
    assert len(lines) == 1, stderr
    assert "Traceback" not in stderr
    match = LINE.match(lines[0])
    assert match, lines[0]
    assert match["file"] == path
    if expected["line"] is None:
        assert match["line"] is None, lines[0]
    else:
        assert (int(match["line"]), int(match["col"])) == (expected["line"], expected["column"]), lines[0]
    if expected["key"] is not None:
        assert match["rest"].startswith(expected["key"] + ": "), lines[0]
    assert expected["message"] in match["rest"], lines[0]


def test_corpus_is_complete() -> None:
    assert len(FILES) >= 40
    assert set(FILES) == set(EXPECTED), set(FILES) ^ set(EXPECTED)


@pytest.mark.parametrize("name", FILES)
def test_validate_reports_one_line_and_exit_65(name: str, tmp_path: Path, monkeypatch: pytest.MonkeyPatch) -> None:
    """Every file through the real command, in-process (typer's CliRunner: the same code from
    argument parsing to exit code and streams, without one interpreter start per file; the
    process itself is checked on the sample below)."""
    from typer.testing import CliRunner

    from coldroom.cli import app

    monkeypatch.chdir(tmp_path)
    path = str(CORPUS / name)
    result = CliRunner().invoke(app, ["validate", path])
    assert result.exit_code == 65, result.output
    check_line(result.stderr, path, EXPECTED[name])
    assert result.stdout == ""
    assert list(tmp_path.iterdir()) == []  # no tag ran code, nothing was written


#: one file per kind of failure, run as a real process (interpreter start, streams, exit status):
#: YAML syntax and limits, a tag that would run code, a schema error, a unit error, a physics check,
#: an undecodable file
PROCESS_SAMPLE = [
    "billion_laughs.yaml",
    "deep_nesting.yaml",
    "python_tag_apply.yaml",
    "duplicate_key.yaml",
    "unknown_key_in_room.yaml",
    "wrong_unit_kind_length.yaml",
    "door_wider_than_wall.yaml",
    "non_utf8_latin1.yaml",
]


@pytest.mark.parametrize("name", PROCESS_SAMPLE)
def test_validate_process_reports_one_line_and_exit_65(name: str, tmp_path: Path) -> None:
    path = str(CORPUS / name)
    result, elapsed = run("validate", path, cwd=tmp_path)
    assert result.returncode == 65, result.stderr
    check_line(result.stderr, path, EXPECTED[name])
    assert result.stdout == ""
    assert elapsed < SUBPROCESS_LIMIT
    assert list(tmp_path.iterdir()) == []  # no tag ran code, nothing was written


@pytest.mark.parametrize("name", FILES)
def test_in_process_parse_is_fast_and_raises_project_file_error(name: str) -> None:
    start = time.perf_counter()
    with pytest.raises(ProjectFileError) as info:
        open_project(CORPUS / name)
    elapsed = time.perf_counter() - start
    assert elapsed < IN_PROCESS_LIMIT, f"{name}: {elapsed:.3f} s"
    assert EXPECTED[name]["message"] in str(info.value)
    assert info.value.exit_code == 65


@pytest.mark.parametrize("name", FILES)
def test_load_writes_no_output(name: str, tmp_path: Path) -> None:
    """`coldroom load FILE --json out.json` on a bad file: exit 65, only the input in its folder.

    Run in-process (typer's CliRunner) to keep 80 interpreter starts out of the suite;
    the process path is covered by the validate sample above and the `size` test below.
    """
    from typer.testing import CliRunner

    from coldroom.cli import app

    copy = tmp_path / name
    shutil.copyfile(CORPUS / name, copy)
    before = copy.read_bytes()
    out = tmp_path / "out.json"
    result = CliRunner().invoke(app, ["load", str(copy), "--json", str(out)])
    assert result.exit_code == 65, result.output
    assert sorted(p.name for p in tmp_path.iterdir()) == [name]
    assert copy.read_bytes() == before


def test_oversize_file_is_refused_fast(tmp_path: Path) -> None:
    """A file over the 1 MiB limit (coldroom.inputs.safeyaml.MAX_BYTES) is refused before it is parsed."""
    from coldroom.inputs.safeyaml import MAX_BYTES

    big = tmp_path / "big.yaml"
    line = "# padding padding padding padding padding padding padding padding\n"
    big.write_text("project: {name: big}\n" + line * (MAX_BYTES // len(line) + 10), encoding="utf-8")
    assert big.stat().st_size > MAX_BYTES
    start = time.perf_counter()
    with pytest.raises(ProjectFileError, match="larger than the limit"):
        open_project(big)
    assert time.perf_counter() - start < IN_PROCESS_LIMIT
    result, elapsed = run("validate", str(big), cwd=tmp_path)
    assert result.returncode == 65
    check_line(result.stderr, str(big), {"line": None, "key": None, "message": "larger than the limit"})
    assert elapsed < SUBPROCESS_LIMIT


@pytest.mark.skipif(sys.platform == "win32", reason="POSIX devices and sparse files")
@pytest.mark.parametrize("source", ["/dev/zero", "/dev/urandom", "sparse"])
def test_endless_or_huge_input_is_read_only_to_the_limit(source: str, tmp_path: Path) -> None:
    """Only MAX_BYTES + 1 bytes are read: a device that never ends or a 3 GiB sparse file is refused
    at once (exit 65), without filling the memory."""
    from coldroom.inputs.safeyaml import MAX_BYTES, read_source

    path = source
    if source == "sparse":
        sparse = tmp_path / "huge.yaml"
        with open(sparse, "wb") as handle:
            handle.truncate(3 << 30)
        path = str(sparse)
    elif not Path(source).exists():
        pytest.skip(f"no {source}")
    with pytest.raises(ProjectFileError, match="larger than the limit") as info:
        read_source(path)
    assert str(MAX_BYTES) in info.value.message
    result, elapsed = run("validate", path, cwd=tmp_path)
    assert result.returncode == 65, result.stderr
    check_line(result.stderr, path, {"line": None, "key": None, "message": "larger than the limit"})
    assert elapsed < SUBPROCESS_LIMIT


def test_a_directory_and_a_missing_file_are_whole_file_errors(tmp_path: Path) -> None:
    result, _ = run("validate", str(tmp_path), cwd=tmp_path)
    assert result.returncode == 65
    check_line(result.stderr, str(tmp_path), {"line": None, "key": None, "message": "is a directory"})
    missing = str(tmp_path / "nope.yaml")
    result, _ = run("validate", missing, cwd=tmp_path)
    assert result.returncode == 65
    check_line(result.stderr, missing, {"line": None, "key": None, "message": "no such file"})


SIZE_SAMPLE = [
    "billion_laughs.yaml",
    "python_tag_apply.yaml",
    "r404a_above_critical.yaml",
    "unknown_refrigerant.yaml",
    "door_wider_than_wall.yaml",
]


@pytest.mark.parametrize("name", SIZE_SAMPLE)
def test_size_writes_no_output(name: str, tmp_path: Path) -> None:
    """`coldroom size FILE` (PDF beside the input) and `--json`: exit 65, nothing written."""
    copy = tmp_path / name
    shutil.copyfile(CORPUS / name, copy)
    result, elapsed = run("size", str(copy), "--json", str(tmp_path / "out.json"), cwd=tmp_path)
    assert result.returncode == 65, result.stderr
    check_line(result.stderr, str(copy), EXPECTED[name])
    assert sorted(p.name for p in tmp_path.iterdir()) == [name]
    assert elapsed < SUBPROCESS_LIMIT


# --- legal but implausible: warnings, exit 0 ------------------------------------------------------

IMPLAUSIBLE = {
    # (text in the base file, replacement, dotted key of the warning, fragment)
    "u_value": (
        "    layers:\n      - material: pur_panel\n        thickness: 100 mm\n",
        "    u_value: 1.5 W/m²K\n",
        "rooms[0].envelope.north",
        "U = 1.500 W/(m²·K) is high for a cold room",
    ),
    "door_traffic": (
        "        passages_per_day: 40\n",
        "        passages_per_day: 4000\n",
        "rooms[0].doors[0].passages_per_day",
        "4000 passages a day is more than 120 an hour",
    ),
    "safety_factor": (
        "    refrigeration:\n",
        "    safety_factor: 60 %\n    refrigeration:\n",
        "rooms[0].safety_factor",
        "safety factor 60% is above 50 %",
    ),
    "near_critical": (
        "      refrigerant: R-448A\n",
        "      refrigerant: R-404A\n      condenser_air_temperature: 45 °C\n      condenser_td: 23 K\n",
        "rooms[0].refrigeration",
        "within 5.0 K of the critical temperature of R-404A",
    ),
}


@pytest.mark.parametrize("case", sorted(IMPLAUSIBLE))
def test_implausible_values_are_warnings_with_exit_0(case: str, tmp_path: Path) -> None:
    """Thresholds are coldroom.inputs.physical_checks' (common practice, no source): warn, do not refuse."""
    import importlib.util

    spec = importlib.util.spec_from_file_location("hostile_generate", CORPUS / "_generate.py")
    assert spec and spec.loader
    generate = importlib.util.module_from_spec(spec)
    spec.loader.exec_module(generate)
    old, new, key, fragment = IMPLAUSIBLE[case]
    path = tmp_path / f"{case}.yaml"
    path.write_text(generate.variant((old, new)), encoding="utf-8")
    result, _ = run("validate", str(path), cwd=tmp_path)
    assert result.returncode == 0, result.stderr
    assert "valid" in result.stdout
    warnings = [line for line in result.stderr.splitlines() if line.startswith(f"{path}: warning: {key}: ")]
    assert any(fragment in line for line in warnings), result.stderr
    assert all(": warning: " in line for line in result.stderr.splitlines()), result.stderr
