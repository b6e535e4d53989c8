"""Writing output files atomically and without clobbering.

A sizing sheet or JSON result is written to a temporary file in the target
directory, flushed to disk and then moved over the target in one step, so a
crash or Ctrl-C never leaves a half-written file. The helper refuses to write
over an input (``coldroom size room.yaml --out room.yaml``) and over an
existing file unless the user passed ``--force``.

``-`` (standard output) is not handled here: the CLI writes stdout itself.

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
import os
import stat
import tempfile
from pathlib import Path
from typing import Sequence, Union

from coldroom.errors import OutputError

__all__ = ["write_atomic"]

PathLike = Union[str, "os.PathLike[str]"]


def _same_file(target: Path, candidate: Path) -> bool:
    """True when *target* and *candidate* name the same file (path or inode)."""
    try:
        if target.resolve() == candidate.resolve():
            return True
    except (OSError, RuntimeError):  # RuntimeError: symlink loop on older Pythons
        pass
    try:
        return os.path.samefile(target, candidate)
    except OSError:  # one of them does not exist
        return False


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


def write_atomic(
    path: PathLike,
    data: bytes | str,
    *,
    force: bool,
    inputs: Sequence[PathLike] = (),
) -> None:
    """Write *data* to *path* atomically, refusing inputs and existing files.

    Parameters
    ----------
    path : str or os.PathLike
        The output file. ``"-"`` is refused: the caller writes stdout itself.
    data : bytes or str
        The content; text is written as UTF-8.
    force : bool
        Overwrite an existing file (never an input file).
    inputs : sequence of paths
        Files read to make this output; writing over any of them is refused,
        also through another name (symlink or hard link).

    Raises
    ------
    OutputError
        *path* is an input, exists and *force* is false, is a directory, its
        directory is missing or not writable, or writing fails. On any error
        (also KeyboardInterrupt) the temporary file is removed and an existing
        target is left untouched.

    Notes
    -----
    The content goes to a temporary file in the same directory, is flushed
    and fsync'ed, then moved into place with :func:`os.replace` (with
    ``force``) or hard-linked into place (without ``force``, so a file that
    appears meanwhile is not clobbered). A new file gets the usual mode
    (0666 minus the umask); an overwritten file keeps its mode. A symlink
    given as *path* is replaced by a regular file.
    """
    if str(os.fspath(path)) == "-":
        raise OutputError("'-' (standard output) must be written by the caller, not write_atomic")
    target = Path(os.fspath(path))
    payload = data.encode("utf-8") if isinstance(data, str) else bytes(data)

    for candidate in inputs:
        if _same_file(target, Path(os.fspath(candidate))):
            raise OutputError(f"{target}: refusing to write over the input file {os.fspath(candidate)}")

    if target.is_dir():
        raise OutputError(f"{target} is a directory; give a file name")
    exists = target.exists() or target.is_symlink()
    if exists and not force:
        raise OutputError(f"{target} already exists; pass --force to overwrite it")

    folder = target.parent if str(target.parent) else Path(".")
    if not folder.is_dir():
        raise OutputError(f"{target}: directory {folder} does not exist")
    if not os.access(folder, os.W_OK | os.X_OK):
        raise OutputError(f"{target}: directory {folder} is not writable")

    try:
        mode = stat.S_IMODE(target.stat().st_mode) if exists else 0o666 & ~_current_umask()
    except OSError:
        mode = 0o666 & ~_current_umask()

    temporary: str | None = None
    try:
        try:
            handle = tempfile.NamedTemporaryFile(
                mode="wb", delete=False, dir=folder, prefix=f".{target.name}.", suffix=".tmp"
            )
        except OSError as exc:
            raise OutputError(f"{target}: cannot create a file in {folder}: {exc.strerror or exc}") from None
        temporary = handle.name
        with handle:
            handle.write(payload)
            handle.flush()
            os.fsync(handle.fileno())
        os.chmod(temporary, mode)
        if force:
            os.replace(temporary, target)
        else:
            try:
                os.link(temporary, target)  # fails if the target appeared meanwhile
            except FileExistsError:
                raise OutputError(f"{target} already exists; pass --force to overwrite it") from None
            except OSError as exc:
                if exc.errno not in (errno.EPERM, errno.ENOTSUP, errno.EOPNOTSUPP, errno.EXDEV, errno.EMLINK):
                    raise
                if target.exists():  # file system without hard links: check, then rename
                    raise OutputError(f"{target} already exists; pass --force to overwrite it") from None
                os.replace(temporary, target)
            else:
                linked, temporary = temporary, None
                try:
                    os.unlink(linked)  # the target keeps the data through its own link
                except OSError:
                    pass
        temporary = None
        _fsync_directory(folder)
    except OSError as exc:
        raise OutputError(f"{target}: cannot write: {exc.strerror or exc}") from None
    finally:
        if temporary is not None:
            try:
                os.unlink(temporary)
            except OSError:
                pass
