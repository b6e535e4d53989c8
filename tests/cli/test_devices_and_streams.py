"""Outputs that are not plain new files: devices, pipes, links, standard output, odd names.

Process-level: each case runs `python -m coldroom` the way a user (or a CI container running
as root) would. The contract is the project's own (README "What coldroom writes"; exit 2 for
a bad command-line value, 73 for an output that cannot be written): a device or a pipe is
written through and never replaced by a file, a symbolic link stays a link, standard output
that cannot be written is one line and exit 73, and a reader that closes the pipe early ends
the run quietly.
"""

from __future__ import annotations

import errno
import io
import json
import os
import shutil
import stat
import subprocess
import sys
import threading
from pathlib import Path

import pytest

REPO = Path(__file__).resolve().parents[2]
DEMO = REPO / "project_files" / "produce_cooler.yaml"
POSIX = pytest.mark.skipif(sys.platform == "win32", reason="devices and FIFOs are POSIX")


def run(*args: str, cwd: Path, **kwargs) -> subprocess.CompletedProcess[str]:
    return subprocess.run(
        [sys.executable, "-m", "coldroom", *args], capture_output=True, text=True, cwd=cwd, timeout=120, **kwargs
    )


def one_line(stderr: str) -> str:
    lines = stderr.strip().splitlines()
    assert len(lines) == 1, stderr
    return lines[0]


@pytest.fixture()
def project(tmp_path: Path) -> Path:
    path = tmp_path / "room.yaml"
    shutil.copyfile(DEMO, path)
    return path


def strict_json(text: str):  # type: ignore[no-untyped-def]
    """json.loads that refuses NaN and Infinity, as every strict JSON reader does."""

    def refuse(constant: str):  # type: ignore[no-untyped-def]
        raise ValueError(f"{constant} is not JSON")

    return json.loads(text, parse_constant=refuse)


# --- devices, pipes and links ----------------------------------------------------------------------


@POSIX
@pytest.mark.parametrize("force", [[], ["--force"]], ids=["plain", "force"])
def test_dev_null_is_written_through_and_stays_a_device(project: Path, force: list[str]) -> None:
    before = os.stat("/dev/null")
    result = run("load", str(project), "--json", "/dev/null", *force, cwd=project.parent)
    assert result.returncode == 0, result.stderr
    after = os.stat("/dev/null")
    assert stat.S_ISCHR(after.st_mode) and after.st_rdev == before.st_rdev


@POSIX
@pytest.mark.skipif(not os.path.exists("/dev/full"), reason="no /dev/full")
def test_dev_full_is_one_line_exit_73_and_stays_a_device(project: Path) -> None:
    result = run("load", str(project), "--json", "/dev/full", "--force", cwd=project.parent)
    assert result.returncode == 73
    assert "/dev/full" in one_line(result.stderr) and "space" in result.stderr
    assert stat.S_ISCHR(os.stat("/dev/full").st_mode)


@POSIX
def test_fifo_is_written_through(project: Path) -> None:
    fifo = project.parent / "pipe.json"
    os.mkfifo(fifo)
    received: list[bytes] = []
    reader = threading.Thread(target=lambda: received.append(fifo.read_bytes()), daemon=True)
    reader.start()
    result = run("load", str(project), "--json", str(fifo), cwd=project.parent)
    reader.join(timeout=30)
    assert result.returncode == 0, result.stderr
    assert strict_json(received[0].decode("utf-8"))["rooms"][0]["required_capacity_w"] > 0
    assert stat.S_ISFIFO(os.lstat(fifo).st_mode)


@pytest.mark.parametrize("name", ["/dev/stdout", "-"])
def test_dev_stdout_is_standard_output(project: Path, name: str) -> None:
    result = run("load", str(project), "--json", name, "--force", cwd=project.parent)
    assert result.returncode == 0, result.stderr
    assert strict_json(result.stdout)["rooms"][0]["name"]  # stdout holds only the JSON
    assert "required capacity" in result.stderr  # the table went to stderr


def test_symlink_stays_a_link_and_its_file_is_replaced(project: Path) -> None:
    real = project.parent / "results" / "room.json"
    real.parent.mkdir()
    real.write_text("old\n")
    link = project.parent / "latest.json"
    link.symlink_to(real)
    refused = run("load", str(project), "--json", str(link), cwd=project.parent)
    assert refused.returncode == 73 and "--force" in one_line(refused.stderr)
    result = run("load", str(project), "--json", str(link), "--force", cwd=project.parent)
    assert result.returncode == 0, result.stderr
    assert link.is_symlink() and os.readlink(link) == str(real)
    assert strict_json(real.read_text())["rooms"]
    assert sorted(p.name for p in real.parent.iterdir()) == ["room.json"]


def test_dangling_symlink_is_refused(project: Path) -> None:
    link = project.parent / "gone.json"
    link.symlink_to(project.parent / "nowhere" / "x.json")
    result = run("load", str(project), "--json", str(link), "--force", cwd=project.parent)
    assert result.returncode == 73 and "symbolic link" in one_line(result.stderr)
    assert link.is_symlink()


# --- names ------------------------------------------------------------------------------------------


@pytest.mark.parametrize(
    "command, option, value",
    [("load", "--json", ""), ("size", "--out", ""), ("size", "--out", "newdir/"), ("size", "--json", "."),
     ("size", "--out", "-", )],
    ids=["json-empty", "out-empty", "out-dir-slash", "json-dot", "out-and-json-stdout"],
)
def test_unusable_output_names_are_usage_errors(project: Path, command: str, option: str, value: str) -> None:
    extra = ["--json", "-"] if value == "-" else []
    result = run(command, str(project), option, value, *extra, cwd=project.parent)
    assert result.returncode == 2, result.stderr
    one_line(result.stderr)
    assert result.stdout == ""
    assert sorted(p.name for p in project.parent.iterdir()) == ["room.yaml"]


def test_name_longer_than_the_file_system_allows_is_73(project: Path) -> None:
    result = run("load", str(project), "--json", "a" * 300 + ".json", cwd=project.parent)
    assert result.returncode == 73
    assert "file system allows" in one_line(result.stderr)


def test_long_legal_name_is_written(project: Path) -> None:
    """A 250-byte name (the file system allows 255) must not fail on its temporary name."""
    name = "b" * 245 + ".json"
    result = run("load", str(project), "--json", name, cwd=project.parent)
    assert result.returncode == 0, result.stderr
    assert sorted(p.name for p in project.parent.iterdir()) == sorted([name, "room.yaml"])


def test_every_target_is_checked_before_any_is_written(project: Path) -> None:
    """size --out new.pdf --json existing.json: the refusal comes first, and no PDF appears."""
    existing = project.parent / "existing.json"
    existing.write_text("keep\n")
    result = run("size", str(project), "--out", "new.pdf", "--json", str(existing), cwd=project.parent)
    assert result.returncode == 73 and "--force" in one_line(result.stderr)
    assert result.stdout == ""  # refused before the sizing ran
    assert not (project.parent / "new.pdf").exists() and existing.read_text() == "keep\n"


# --- standard output ------------------------------------------------------------------------------


@POSIX
@pytest.mark.skipif(not os.path.exists("/dev/full"), reason="no /dev/full")
@pytest.mark.parametrize(
    "args",
    [["validate", "{p}"], ["load", "{p}"], ["schema"], ["refrigerants"], ["products"]],
    ids=["validate", "load", "schema", "refrigerants", "products"],
)
def test_stdout_on_a_full_device_is_one_line_exit_73(project: Path, args: list[str]) -> None:
    with open("/dev/full", "w") as full:
        result = subprocess.run(
            [sys.executable, "-m", "coldroom", *(a.format(p=project) for a in args)],
            stdout=full, stderr=subprocess.PIPE, text=True, cwd=project.parent, timeout=120,
        )
    assert result.returncode == 73, result.stderr
    assert "standard output" in one_line(result.stderr)


class _FullTerminal(io.StringIO):
    """Standard output on a full disk: text is buffered, the flush fails (once)."""

    failed = False

    def flush(self) -> None:
        if not self.failed:
            self.failed = True
            raise OSError(errno.ENOSPC, "No space left on device")


def test_size_with_stdout_full_writes_no_pdf(project: Path, monkeypatch: pytest.MonkeyPatch, capsys) -> None:
    """In-process, with the sizing and the sheet stubbed: what matters is the order (terminal text first)."""
    import coldroom.output.pdf.sheet
    import coldroom.design.sizing
    import coldroom.output.terminal
    from coldroom.cli import app

    monkeypatch.setattr(coldroom.design.sizing, "size_project", lambda *a: None)
    monkeypatch.setattr(coldroom.output.pdf.sheet, "render_sheet", lambda *a: b"%PDF-stub")
    monkeypatch.setattr(coldroom.output.terminal, "size_summary", lambda *a: "the summary")
    monkeypatch.setattr(sys, "stdout", _FullTerminal())
    with pytest.raises(SystemExit) as stop:
        app(["size", str(project)])
    assert stop.value.code == 73
    assert "standard output" in one_line(capsys.readouterr().err)
    assert sorted(p.name for p in project.parent.iterdir()) == ["room.yaml"]


@POSIX
def test_closed_pipe_ends_quietly(project: Path) -> None:
    """`coldroom schema | head -c 1`: the reader has gone before the output is written."""
    child = subprocess.Popen(
        [sys.executable, "-m", "coldroom", "schema"], stdout=subprocess.PIPE, stderr=subprocess.PIPE, cwd=project.parent
    )
    assert child.stdout is not None and child.stderr is not None
    child.stdout.close()  # closed before the child has written anything
    stderr = child.stderr.read().decode()
    child.wait(timeout=60)
    assert stderr == ""
    assert child.returncode in (0, 141)  # 141: stopped by the closed pipe, as `yes | head` is
