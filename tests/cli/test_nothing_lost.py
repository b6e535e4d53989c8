"""Nothing lost: no half-written output after an interruption, never over the input, --force to overwrite.

The contract is the project's own (DEVELOPERS.md "Contracts": exit 73 "cannot write output";
coldroom/output/files.py: atomic replace, inputs and existing files refused).
"""

from __future__ import annotations

import json
import os
import shutil
import signal
import subprocess
import sys
import time
from pathlib import Path

import pytest

import coldroom.output.files as output
from coldroom.errors import OutputError
from coldroom.output.files import write_atomic

REPO = Path(__file__).resolve().parents[2]
DEMO = REPO / "project_files" / "produce_cooler.yaml"


def run(*args: str, cwd: Path) -> subprocess.CompletedProcess[str]:
    return subprocess.run(
        [sys.executable, "-m", "coldroom", *args], capture_output=True, text=True, cwd=cwd, timeout=120
    )


@pytest.fixture()
def project(tmp_path: Path) -> Path:
    path = tmp_path / "room.yaml"
    shutil.copyfile(DEMO, path)
    return path


# --- interruption ------------------------------------------------------------------------------


def _half_then(signal_exception):
    """A stand-in for coldroom.output.files._write_payload: half the bytes, then the interruption."""
    real = output._write_payload

    def write(fd: int, payload: bytes) -> None:
        real(fd, payload[: len(payload) // 2])
        raise signal_exception

    return write


@pytest.fixture(params=["unnamed", "named"])
def temporary_kind(request, monkeypatch: pytest.MonkeyPatch) -> str:
    """Run once with O_TMPFILE (where the platform has it) and once with a named temporary file."""
    if request.param == "named":
        monkeypatch.delattr(os, "O_TMPFILE", raising=False)
    elif not hasattr(os, "O_TMPFILE"):
        pytest.skip("no O_TMPFILE on this platform")
    return request.param


@pytest.mark.parametrize("existing", [False, True], ids=["new-file", "over-existing-with-force"])
def test_interrupt_mid_write_leaves_no_partial_file(
    tmp_path: Path, monkeypatch: pytest.MonkeyPatch, existing: bool, temporary_kind: str
) -> None:
    target = tmp_path / "result.json"
    if existing:
        target.write_text("precious old result\n")
    monkeypatch.setattr(output, "_write_payload", _half_then(KeyboardInterrupt()))
    with pytest.raises(KeyboardInterrupt):
        write_atomic(target, "x" * 100_000, force=existing)
    left = sorted(p.name for p in tmp_path.iterdir())
    assert left == (["result.json"] if existing else [])
    if existing:
        assert target.read_text() == "precious old result\n"


CHILD = r"""
import os, sys, time
import coldroom.output.files as output

real = output._write_payload


def slow(fd, payload):
    real(fd, payload[: len(payload) // 2])
    print("HALF-WRITTEN", flush=True)
    time.sleep(60)
    real(fd, payload[len(payload) // 2 :])


output._write_payload = slow
if sys.argv[3] == "named":
    del os.O_TMPFILE
sys.argv = ["coldroom", "load", sys.argv[1], "--json", sys.argv[2]]
from coldroom.cli import main

main()
"""


@pytest.mark.skipif(sys.platform == "win32", reason="signals to a child process are POSIX")
@pytest.mark.parametrize(
    "signum, code, said",
    [(signal.SIGINT, 130, "interrupted;"), (signal.SIGTERM, 143, "stopped by SIGTERM;"),
     (getattr(signal, "SIGHUP", 1), 129, "stopped by SIGHUP;")],
    ids=["SIGINT", "SIGTERM", "SIGHUP"],
)
@pytest.mark.parametrize("kind", ["unnamed", "named"])
def test_signal_during_write_leaves_only_the_input(project: Path, signum: int, code: int, said: str, kind: str) -> None:
    """A real Ctrl-C, SIGTERM or SIGHUP to `coldroom load --json` while half the JSON is on disk."""
    if kind == "unnamed" and not hasattr(os, "O_TMPFILE"):
        pytest.skip("no O_TMPFILE on this platform")
    folder = project.parent
    child = subprocess.Popen(
        [sys.executable, "-c", CHILD, str(project), str(folder / "room.json"), kind],
        stdout=subprocess.PIPE,
        stderr=subprocess.PIPE,
        text=True,
        cwd=folder,
    )
    try:
        deadline = time.monotonic() + 60
        assert child.stdout is not None
        for line in child.stdout:
            if line.strip() == "HALF-WRITTEN":
                break
            assert time.monotonic() < deadline
        else:
            pytest.fail(f"child ended before writing: {child.stderr.read() if child.stderr else ''}")
        temporaries = [p.name for p in folder.iterdir() if p.name != "room.yaml"]
        if kind == "named":  # the half-written file exists now, under a short hidden name
            assert len(temporaries) == 1 and temporaries[0].startswith(".coldroom-") and temporaries[0].endswith(".tmp")
        else:  # unnamed: not even visible while it is being written
            assert temporaries == []
        child.send_signal(signum)
        _, stderr = child.communicate(timeout=30)
    finally:
        if child.poll() is None:
            child.kill()
            child.wait()
    assert child.returncode == code, stderr
    assert said in stderr and "no output was written" in stderr
    assert len(stderr.strip().splitlines()) == 1
    assert sorted(p.name for p in folder.iterdir()) == ["room.yaml"]
    assert project.read_bytes() == DEMO.read_bytes()


# --- never over the input ------------------------------------------------------------------------


def test_json_over_the_input_is_refused(project: Path) -> None:
    before = project.read_bytes()
    for extra in ([], ["--force"]):
        result = run("load", str(project), "--json", str(project), *extra, cwd=project.parent)
        assert result.returncode == 73, result.stderr
        assert "refusing to write over the input file" in result.stderr
        assert len(result.stderr.strip().splitlines()) == 1
        assert project.read_bytes() == before
    assert sorted(p.name for p in project.parent.iterdir()) == ["room.yaml"]


def test_json_over_the_input_through_another_name_is_refused(project: Path) -> None:
    before = project.read_bytes()
    (project.parent / "alias.json").symlink_to(project)
    os.link(project, project.parent / "hardlink.json")
    for name in ("alias.json", "hardlink.json"):
        result = run("load", str(project), "--json", name, "--force", cwd=project.parent)
        assert result.returncode == 73, result.stderr
        assert "refusing to write over the input file" in result.stderr
        assert project.read_bytes() == before
    relative = run("load", "room.yaml", "--json", "./room.yaml", "--force", cwd=project.parent)
    assert relative.returncode == 73
    assert project.read_bytes() == before


def test_size_out_over_the_input_is_refused(project: Path) -> None:
    probe = run("size", "--help", cwd=project.parent)
    if probe.returncode != 0:
        pytest.skip("`coldroom size` is not available")
    before = project.read_bytes()
    for args in (["--out", str(project)], ["--json", str(project)], ["--out", str(project), "--force"]):
        result = run("size", str(project), *args, cwd=project.parent)
        assert result.returncode == 73, result.stderr
        assert "refusing to write over the input file" in result.stderr
        assert project.read_bytes() == before
    assert sorted(p.name for p in project.parent.iterdir()) == ["room.yaml"]


# --- existing files need --force -------------------------------------------------------------------


def test_existing_output_needs_force(project: Path) -> None:
    out = project.parent / "room.json"
    out.write_text("precious\n")
    refused = run("load", str(project), "--json", str(out), cwd=project.parent)
    assert refused.returncode == 73, refused.stderr
    assert "already exists; pass --force to overwrite it" in refused.stderr
    assert out.read_text() == "precious\n"
    forced = run("load", str(project), "--json", str(out), "--force", cwd=project.parent)
    assert forced.returncode == 0, forced.stderr
    data = json.loads(out.read_text())
    assert data["rooms"][0]["required_capacity_w"] > 0
    assert sorted(p.name for p in project.parent.iterdir()) == ["room.json", "room.yaml"]


def test_write_atomic_refuses_existing_without_force(tmp_path: Path) -> None:
    target = tmp_path / "a.json"
    target.write_text("keep")
    with pytest.raises(OutputError, match="--force"):
        write_atomic(target, "new", force=False)
    assert target.read_text() == "keep"
    assert sorted(p.name for p in tmp_path.iterdir()) == ["a.json"]
