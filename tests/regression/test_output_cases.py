"""write_atomic: refuses inputs and existing files, never leaves partial or temp files.

The expected behaviour is the contract in DEVELOPERS.md "Contracts" (exit code 73 "cannot write output") and
POSIX rename(2) semantics for os.replace (the target is either the old or the new file).
"""

from __future__ import annotations

import os
import sys
from pathlib import Path

import pytest

import coldroom.output.files as output
from coldroom.errors import OutputError, UsageError
from coldroom.output.files import write_atomic


def listing(folder: Path) -> list[str]:
    return sorted(p.name for p in folder.iterdir())


def test_writes_bytes_and_text(tmp_path):
    write_atomic(tmp_path / "a.json", b'{"x": 1}', force=False)
    write_atomic(tmp_path / "b.txt", "Kühlraum\n", force=False)
    assert (tmp_path / "a.json").read_bytes() == b'{"x": 1}'
    assert (tmp_path / "b.txt").read_bytes() == "Kühlraum\n".encode("utf-8")
    assert listing(tmp_path) == ["a.json", "b.txt"]


def test_new_file_mode_follows_umask(tmp_path):
    old = os.umask(0o027)
    try:
        write_atomic(tmp_path / "a.pdf", b"%PDF", force=False)
    finally:
        os.umask(old)
    assert (tmp_path / "a.pdf").stat().st_mode & 0o777 == 0o640


def test_refuses_existing_without_force(tmp_path):
    target = tmp_path / "room.pdf"
    target.write_bytes(b"old")
    with pytest.raises(OutputError, match="--force") as info:
        write_atomic(target, b"new", force=False)
    assert info.value.exit_code == 73
    assert target.read_bytes() == b"old"
    assert listing(tmp_path) == ["room.pdf"]


def test_force_overwrites_and_keeps_mode(tmp_path):
    target = tmp_path / "room.pdf"
    target.write_bytes(b"old")
    target.chmod(0o600)
    write_atomic(target, b"new", force=True)
    assert target.read_bytes() == b"new"
    assert target.stat().st_mode & 0o777 == 0o600
    assert listing(tmp_path) == ["room.pdf"]


@pytest.mark.parametrize("force", [False, True])
def test_refuses_the_input_file(tmp_path, force):
    project = tmp_path / "room.yaml"
    project.write_text("rooms: []\n")
    for same in (project, tmp_path / "." / "room.yaml", str(project)):
        with pytest.raises(OutputError, match="input file") as info:
            write_atomic(same, b"pdf", force=force, inputs=[project])
        assert info.value.exit_code == 73
    assert project.read_text() == "rooms: []\n"


def test_refuses_the_input_through_a_symlink_and_a_hard_link(tmp_path):
    project = tmp_path / "room.yaml"
    project.write_text("rooms: []\n")
    (tmp_path / "alias.yaml").symlink_to(project)
    os.link(project, tmp_path / "hard.yaml")
    for other in ("alias.yaml", "hard.yaml"):
        with pytest.raises(OutputError, match="input file"):
            write_atomic(tmp_path / other, b"x", force=True, inputs=[project])
    assert project.read_text() == "rooms: []\n"


def test_relative_input_versus_absolute_output(tmp_path, monkeypatch):
    monkeypatch.chdir(tmp_path)
    Path("room.yaml").write_text("a: 1\n")
    with pytest.raises(OutputError, match="input file"):
        write_atomic(tmp_path / "room.yaml", b"x", force=True, inputs=["room.yaml"])


@pytest.mark.parametrize("failure", [RuntimeError("disk on fire"), KeyboardInterrupt()])
def test_failure_mid_write_leaves_no_file_and_no_temp(tmp_path, monkeypatch, failure):
    def broken_fsync(fd):
        raise failure

    monkeypatch.setattr(output.os, "fsync", broken_fsync)
    with pytest.raises(type(failure)):
        write_atomic(tmp_path / "room.pdf", b"x" * 100_000, force=False)
    assert listing(tmp_path) == []


def test_failure_mid_overwrite_keeps_the_old_file(tmp_path, monkeypatch):
    target = tmp_path / "room.pdf"
    target.write_bytes(b"old")

    def broken_replace(src, dst):
        raise OSError(28, "No space left on device")

    monkeypatch.setattr(output.os, "replace", broken_replace)
    with pytest.raises(OutputError, match="No space left"):
        write_atomic(target, b"new", force=True)
    assert target.read_bytes() == b"old"
    assert listing(tmp_path) == ["room.pdf"]


def test_missing_directory(tmp_path):
    with pytest.raises(OutputError, match="does not exist"):
        write_atomic(tmp_path / "nowhere" / "room.pdf", b"x", force=True)


@pytest.mark.skipif(sys.platform == "win32" or os.geteuid() == 0, reason="root ignores permissions")
def test_directory_not_writable(tmp_path):
    folder = tmp_path / "ro"
    folder.mkdir()
    folder.chmod(0o500)
    try:
        with pytest.raises(OutputError, match="not writable"):
            write_atomic(folder / "room.pdf", b"x", force=True)
    finally:
        folder.chmod(0o700)
    assert listing(folder) == []


def test_target_is_a_directory(tmp_path):
    for name in (tmp_path, f"{tmp_path}/new/", ""):
        with pytest.raises(UsageError) as info:
            write_atomic(name, b"x", force=True)
        assert info.value.exit_code == 2
    assert listing(tmp_path) == []


@pytest.mark.parametrize("name", ["-", "/dev/stdout"])
def test_dash_and_dev_stdout_are_standard_output(name, capsysbinary):
    write_atomic(name, b"x", force=True)
    assert capsysbinary.readouterr().out == b"x"


def test_no_clobber_when_the_file_appears_meanwhile(tmp_path, monkeypatch):
    # Without --force the final step is a hard link, which fails if a file appeared after the
    # existence check; simulate that race by creating the file just before the link.
    target = tmp_path / "room.pdf"
    real_link = os.link

    def racing_link(src, dst, **kwargs):
        (tmp_path / Path(dst).name).write_bytes(b"theirs")
        return real_link(src, dst, **kwargs)

    monkeypatch.setattr(output.os, "link", racing_link)
    with pytest.raises(OutputError, match="--force"):
        write_atomic(target, b"ours", force=False)
    assert target.read_bytes() == b"theirs"
    assert listing(tmp_path) == ["room.pdf"]


def test_directory_not_writable_reported_by_access(tmp_path, monkeypatch):
    # the same check as above, for runs as root (where chmod does not stop writing)
    monkeypatch.setattr(output.os, "access", lambda path, mode: False)
    with pytest.raises(OutputError, match="not writable"):
        write_atomic(tmp_path / "room.pdf", b"x", force=True)
    assert listing(tmp_path) == []


def test_cannot_create_temporary_file(tmp_path, monkeypatch):
    def refuse(*args, **kwargs):
        raise PermissionError(13, "Permission denied")

    monkeypatch.setattr(output, "_open_temporary", refuse)
    with pytest.raises(OutputError, match="Permission denied"):
        write_atomic(tmp_path / "room.pdf", b"x", force=True)
    assert listing(tmp_path) == []
