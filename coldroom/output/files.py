"""Writing output files: checked before any work, atomic, never over the input.

Every command that writes a file checks all its targets with
:func:`check_targets` *before* it computes anything, and writes each one
with :func:`write_target` (or :func:`write_atomic`, which checks again, since
the disk may change while a sheet is computed). One function,
:func:`check_target`, owns every refusal.

What is written where (the guarantees the README repeats):

* ``-`` and ``/dev/stdout`` (also ``/dev/fd/1``, ``/proc/self/fd/1``) mean
  standard output.
* A regular file is written atomically: the content goes to an unnamed
  temporary file in the target's directory (``O_TMPFILE``; where the file
  system lacks it, a short hidden ``.coldroom-XXXXXXXX.tmp``), is flushed and
  fsync'ed and is then linked into place in one step. A crash, Ctrl-C,
  SIGTERM or SIGHUP never leaves a half-written file; with ``O_TMPFILE`` not
  even SIGKILL leaves a temporary file behind. An existing file is replaced
  only with ``--force`` and keeps its permissions.
* A symbolic link is followed: the file it points to is replaced, the link
  stays. A link to nothing is refused.
* A character device or a named pipe (``/dev/null``, a FIFO) is written
  through, not atomically, and is never replaced by a file; no ``--force``
  is needed since nothing is overwritten. Any other kind of file (block
  device, socket) is refused.
* An input of the run is never written over, also not through another name
  (symbolic or hard link); two outputs of one run must be different files.

Refusals are :class:`~coldroom.errors.OutputError` (exit 73), except a name
that cannot be a file name at all (empty, ending in ``/``, a directory),
which is a :class:`~coldroom.errors.UsageError` (exit 2).

Examples
--------
>>> import tempfile, pathlib
>>> folder = pathlib.Path(tempfile.mkdtemp())
>>> write_atomic(folder / "result.json", '{"ok": true}', force=False)
>>> (folder / "result.json").read_text()
'{"ok": true}'
>>> write_atomic(folder / "result.json", "again", force=False)
Traceback (most recent call last):
...
coldroom.errors.OutputError: ...result.json already exists; pass --force to overwrite it
"""

from __future__ import annotations

import errno
import math
import os
import secrets
import stat
import sys
from dataclasses import dataclass
from pathlib import Path
from typing import Any, Optional, Sequence, Union

from coldroom.errors import OutputError, UsageError

__all__ = ["Target", "check_target", "check_targets", "json_text", "write_atomic", "write_target"]

PathLike = Union[str, "os.PathLike[str]"]

STDOUT_NAMES = frozenset({"-", "/dev/stdout", "/dev/fd/1", "/proc/self/fd/1"})
"""Output names that mean standard output."""

_TEMPORARY_PREFIX = ".coldroom-"  # short: a legal long target name must not fail on its temporary


@dataclass(frozen=True)
class Target:
    """A checked output.

    Attributes
    ----------
    name : str
        The name as the user gave it (for messages).
    kind : {"stdout", "device", "file"}
        Standard output; a character device or pipe written through; a
        regular file written atomically.
    path : Path or None
        Where the bytes go (symbolic links followed); None for stdout.
    exists : bool
        A regular file is already there (replaced only with ``force``).
    """

    name: str
    kind: str
    path: Optional[Path]
    exists: bool = False


def _same_file(target: Path, candidate: Path) -> bool:
    """True when *target* and *candidate* name the same file (path or inode)."""
    try:
        if target.resolve() == candidate.resolve():
            return True
    except (OSError, RuntimeError):  # RuntimeError: symlink loop on older Pythons
        pass
    try:
        return os.path.samefile(target, candidate)
    except (OSError, ValueError):  # one of them does not exist
        return False


def _os_reason(exc: OSError) -> str:
    return exc.strerror or str(exc)


def _name_limit(folder: Path) -> int:
    """Longest file name [byte] the file system of *folder* allows (255 where it cannot say)."""
    try:
        return int(os.pathconf(folder, "PC_NAME_MAX"))
    except (OSError, ValueError, AttributeError):
        return 255


def check_target(path: PathLike, *, force: bool, inputs: Sequence[PathLike] = (), option: str = "") -> Target:
    """Decide whether and how *path* can be written, before anything is computed.

    Parameters
    ----------
    path : str or os.PathLike
        The output name as given (``-`` for standard output).
    force : bool
        An existing regular file may be replaced.
    inputs : sequence of paths
        Files read by this run; none of them may be written over.
    option : str
        The command-line option that named *path* (for messages), e.g. ``"--json"``.

    Returns
    -------
    Target

    Raises
    ------
    UsageError
        An empty name, a name ending in ``/`` or naming a directory.
    OutputError
        An input, an existing file without *force*, a missing or read-only
        directory, a name longer than the file system allows, a link to
        nothing, a block device or socket.
    """
    name = os.fspath(path)
    label = f"{option} " if option else ""
    if name == "":
        raise UsageError(f"{label}'' is not a file name; give a file name (or '-' for standard output)")
    if name in STDOUT_NAMES:
        return Target(name, "stdout", None)
    if name.endswith(("/", os.sep)):
        raise UsageError(f"{label}{name!r} names a directory; give a file name, e.g. {name.rstrip('/' + os.sep) or '.'}/result")
    given = Path(name)
    limit = _name_limit(given.parent if str(given.parent) else Path("."))
    if len(os.fsencode(given.name)) > limit:
        raise OutputError(
            f"{name[:40]}…: the file name is {len(os.fsencode(given.name))} bytes long; "
            f"the file system allows {limit}"
        )
    for candidate in inputs:
        if _same_file(given, Path(os.fspath(candidate))):
            raise OutputError(f"{name}: refusing to write over the input file {os.fspath(candidate)}")
    try:
        link = os.lstat(name)
    except FileNotFoundError:
        link = None
    except NotADirectoryError:
        raise OutputError(f"{name}: a part of the path is not a directory") from None
    except OSError as exc:
        raise OutputError(f"{name}: cannot use this name: {_os_reason(exc)}") from None
    real = Path(os.path.realpath(name)) if link is not None and stat.S_ISLNK(link.st_mode) else given
    try:
        info = os.stat(real)
    except FileNotFoundError:
        if link is not None:  # a symbolic link to nothing
            raise OutputError(f"{name} is a symbolic link to a missing file ({real}); remove it or name another file") from None
        info = None
    except OSError as exc:
        raise OutputError(f"{name}: cannot use this name: {_os_reason(exc)}") from None
    if info is not None:
        mode = info.st_mode
        if stat.S_ISDIR(mode):
            raise UsageError(f"{label}{name} is a directory; give a file name")
        if stat.S_ISCHR(mode) or stat.S_ISFIFO(mode):
            return Target(name, "device", real)
        if not stat.S_ISREG(mode):
            kind = "block device" if stat.S_ISBLK(mode) else "socket" if stat.S_ISSOCK(mode) else "special file"
            raise OutputError(f"{name} is a {kind}; coldroom writes regular files, character devices and pipes only")
        if not force:
            raise OutputError(f"{name} already exists; pass --force to overwrite it")
    folder = real.parent if str(real.parent) else Path(".")
    if not folder.is_dir():
        raise OutputError(f"{name}: directory {folder} does not exist")
    if not os.access(folder, os.W_OK | os.X_OK):
        raise OutputError(f"{name}: directory {folder} is not writable")
    return Target(name, "file", real, exists=info is not None)


def check_targets(
    named: Sequence[tuple[str, Optional[PathLike]]], *, force: bool, inputs: Sequence[PathLike] = ()
) -> list[Optional[Target]]:
    """Check every output of one run before any is computed or written.

    Parameters
    ----------
    named : sequence of (option, path or None)
        Each output with the option that named it; None where not asked.
    force, inputs
        As for :func:`check_target`.

    Returns
    -------
    list of Target or None
        In the order given.

    Raises
    ------
    UsageError
        Two outputs go to standard output.
    OutputError
        Two outputs name the same file, or any single refusal.
    """
    checked = [None if path is None else check_target(path, force=force, inputs=inputs, option=option)
               for option, path in named]
    seen: list[tuple[str, Target]] = []
    for (option, _), target in zip(named, checked):
        if target is None:
            continue
        for other_option, other in seen:
            if target.kind == other.kind == "stdout":
                raise UsageError(f"{other_option} and {option} both go to standard output; send one to a file")
            if target.path is not None and other.path is not None and _same_file(target.path, other.path):
                raise OutputError(f"{target.name}: {other_option} and {option} name the same file")
        seen.append((option, target))
    return checked


def json_text(data: Any) -> str:
    """*data* as strict JSON text (RFC 8259): a non-finite number becomes ``null``.

    Python's :func:`json.dumps` writes ``NaN`` and ``Infinity``, which no
    strict JSON reader accepts; every JSON coldroom writes goes through here.

    Examples
    --------
    >>> print(json_text({"a": float("inf"), "b": [1.5, float("nan")]}))
    {
      "a": null,
      "b": [
        1.5,
        null
      ]
    }
    """
    import json

    def strict(value: Any) -> Any:
        if isinstance(value, float):
            return value if math.isfinite(value) else None
        if isinstance(value, dict):
            return {key: strict(item) for key, item in value.items()}
        if isinstance(value, (list, tuple)):
            return [strict(item) for item in value]
        return value

    return json.dumps(strict(data), indent=2, ensure_ascii=False, allow_nan=False) + "\n"


def _current_umask() -> int:
    """The process umask (read by setting and restoring it)."""
    mask = os.umask(0o022)
    os.umask(mask)
    return mask


def _fsync_directory(folder: Path) -> None:
    """Best effort: make the rename itself durable (not possible on every OS)."""
    try:
        fd = os.open(folder, os.O_RDONLY)
    except OSError:
        return
    try:
        os.fsync(fd)
    except OSError:
        pass
    finally:
        os.close(fd)


def _write_payload(fd: int, payload: bytes) -> None:
    """Write all of *payload* to *fd* (os.write may write less than asked)."""
    view = memoryview(payload)
    while view:
        written = os.write(fd, view)
        view = view[written:]


def _temporary_name(folder: Path) -> Path:
    return folder / f"{_TEMPORARY_PREFIX}{secrets.token_hex(4)}.tmp"


def _open_temporary(folder: Path) -> tuple[int, Optional[Path]]:
    """Open a temporary file in *folder*: unnamed (``O_TMPFILE``) where possible, else a short hidden name."""
    flags = getattr(os, "O_TMPFILE", 0)
    if flags and os.path.isdir("/proc/self/fd"):  # the unnamed file is linked in through /proc
        try:
            return os.open(folder, flags | os.O_WRONLY | getattr(os, "O_CLOEXEC", 0), 0o600), None
        except OSError as exc:
            if exc.errno not in (errno.EOPNOTSUPP, errno.EISDIR, errno.EINVAL, errno.ENOENT, errno.ENOTSUP):
                raise
    for _ in range(100):
        name = _temporary_name(folder)
        try:
            return os.open(name, os.O_WRONLY | os.O_CREAT | os.O_EXCL | getattr(os, "O_CLOEXEC", 0), 0o600), name
        except FileExistsError:
            continue
    raise OutputError(f"cannot find a free temporary name in {folder}")


def _exists_error(target: Target) -> OutputError:
    return OutputError(f"{target.name} already exists; pass --force to overwrite it")


def _place(fd: int, temporary: Optional[Path], target: Target, *, replace: bool) -> Optional[Path]:
    """Move the written temporary into place; return a named temporary still to remove, if any."""
    assert target.path is not None
    destination = target.path
    folder = destination.parent if str(destination.parent) else Path(".")

    def link(to: Path) -> None:
        if temporary is not None:
            os.link(temporary, to)
            return
        # the open unnamed file itself: linkat(AT_SYMLINK_FOLLOW) on its /proc entry (a plain
        # link() would try to link the /proc symlink); dst_dir_fd makes Python call linkat
        folder_fd = os.open(folder, os.O_RDONLY | getattr(os, "O_DIRECTORY", 0) | getattr(os, "O_CLOEXEC", 0))
        try:
            os.link(f"/proc/self/fd/{fd}", to.name, dst_dir_fd=folder_fd, follow_symlinks=True)
        finally:
            os.close(folder_fd)

    if not replace:
        try:
            link(destination)  # fails if the target appeared meanwhile
            return temporary
        except FileExistsError:
            raise _exists_error(target) from None
        except OSError as exc:
            if temporary is None or exc.errno not in (errno.EPERM, errno.ENOTSUP, errno.EOPNOTSUPP, errno.EXDEV, errno.EMLINK):
                raise
            if destination.exists():  # file system without hard links: check, then rename
                raise _exists_error(target) from None
            os.replace(temporary, destination)
            return None
    if temporary is None:  # give the unnamed file a short name, then rename it over the target
        for _ in range(100):
            candidate = _temporary_name(folder)
            try:
                link(candidate)
                break
            except FileExistsError:
                continue
        else:
            raise OutputError(f"cannot find a free temporary name in {folder}")
        try:
            os.replace(candidate, destination)
        except BaseException:
            os.unlink(candidate)
            raise
        return None
    os.replace(temporary, destination)
    return None


def _write_file(target: Target, payload: bytes, *, force: bool) -> None:
    """Write a regular file atomically (see the module notes)."""
    assert target.path is not None
    folder = target.path.parent if str(target.path.parent) else Path(".")
    try:
        mode = stat.S_IMODE(os.stat(target.path).st_mode) if target.exists else 0o666 & ~_current_umask()
    except OSError:
        mode = 0o666 & ~_current_umask()
    fd: Optional[int] = None
    temporary: Optional[Path] = None
    try:
        try:
            fd, temporary = _open_temporary(folder)
        except OSError as exc:
            raise OutputError(f"{target.name}: cannot create a file in {folder}: {_os_reason(exc)}") from None
        _write_payload(fd, payload)
        os.fchmod(fd, mode)
        os.fsync(fd)
        temporary = _place(fd, temporary, target, replace=force)
        _fsync_directory(folder)
    except OSError as exc:
        raise OutputError(f"{target.name}: cannot write: {_os_reason(exc)}") from None
    finally:
        if fd is not None:
            os.close(fd)
        if temporary is not None:
            try:
                os.unlink(temporary)
            except OSError:
                pass


def _write_through(target: Target, payload: bytes) -> None:
    """Write to a character device or a pipe as it is (it cannot be replaced)."""
    assert target.path is not None
    try:
        fd = os.open(target.path, os.O_WRONLY | getattr(os, "O_NOCTTY", 0) | getattr(os, "O_CLOEXEC", 0))
    except OSError as exc:
        raise OutputError(f"{target.name}: cannot open: {_os_reason(exc)}") from None
    try:
        _write_payload(fd, payload)
    except OSError as exc:
        raise OutputError(f"{target.name}: cannot write: {_os_reason(exc)}") from None
    finally:
        os.close(fd)


def _write_stdout(payload: bytes) -> None:
    stream = sys.stdout
    try:
        stream.flush()
        buffer = getattr(stream, "buffer", None)
        if buffer is None:
            stream.write(payload.decode("utf-8"))
        else:
            buffer.write(payload)
            buffer.flush()
    except BrokenPipeError:
        raise
    except OSError as exc:
        raise OutputError(f"cannot write to standard output: {_os_reason(exc)}") from None


def write_target(target: Target, data: bytes | str, *, force: bool) -> None:
    """Write *data* to a checked *target* (standard output, a device or pipe, or a file atomically).

    Parameters
    ----------
    target : Target
        From :func:`check_target` (or :func:`check_targets`).
    data : bytes or str
        The content; text is written as UTF-8.
    force : bool
        Replace an existing regular file.

    Raises
    ------
    OutputError
        Writing fails; a regular file is then left as it was and no
        temporary file stays behind (also on KeyboardInterrupt).
    """
    payload = data.encode("utf-8") if isinstance(data, str) else bytes(data)
    if target.kind == "stdout":
        _write_stdout(payload)
    elif target.kind == "device":
        _write_through(target, payload)
    else:
        _write_file(target, payload, force=force)


def write_atomic(
    path: PathLike,
    data: bytes | str,
    *,
    force: bool,
    inputs: Sequence[PathLike] = (),
    option: str = "",
) -> None:
    """Check *path* (again) and write *data* to it; see :func:`check_target` and :func:`write_target`.

    Parameters
    ----------
    path : str or os.PathLike
        The output; ``-`` or ``/dev/stdout`` for standard output.
    data : bytes or str
        The content; text is written as UTF-8.
    force : bool
        Overwrite an existing file (never an input file).
    inputs : sequence of paths
        Files read to make this output; writing over any of them is refused,
        also through another name (symlink or hard link).
    option : str
        The option that named *path*, for messages.

    Raises
    ------
    OutputError, UsageError
        As :func:`check_target`; or writing fails (the target is then left
        untouched and no temporary file stays behind).
    """
    write_target(check_target(path, force=force, inputs=inputs, option=option), data, force=force)
