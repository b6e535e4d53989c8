"""The command line's plumbing: errors to exit codes, signals, the files a run reads, outputs.

Every command of :mod:`coldroom.cli` runs its work through :func:`guarded` and writes through
:func:`write_output` / :func:`emit_json`; nothing here imports a heavy module at import time.
"""

from __future__ import annotations

import sys
from typing import Callable, Optional

import typer

from coldroom.errors import ColdroomError

def fail(error: ColdroomError) -> "typer.Exit":
    """Print *error* as one line on stderr and return the Exit to raise."""
    from coldroom.errors import ProjectFileError, printable

    text = error.format() if isinstance(error, ProjectFileError) else f"coldroom: {error}"
    print(printable(" ".join(text.split())), file=sys.stderr)  # always exactly one line
    return typer.Exit(code=getattr(error, "exit_code", 1))


class Stopped(KeyboardInterrupt):
    """SIGTERM or SIGHUP arrived: unwinds like Ctrl-C, so every temporary file is removed."""

    def __init__(self, signum: int) -> None:
        super().__init__(signum)
        self.signum = signum


def _stop(signum: int, frame: object) -> None:
    raise Stopped(signum)


def install_signal_handlers() -> None:
    """Treat SIGTERM and SIGHUP like SIGINT (clean up, one line, exit 128 + the signal number)."""
    import signal

    for name in ("SIGTERM", "SIGHUP"):
        number = getattr(signal, name, None)
        if number is not None:
            signal.signal(number, _stop)


_written: list[str] = []  # outputs finished in this run, for the interruption message
_read: list[str] = []  # files this run reads besides the project (catalogue, weather): never written over


def reading(*paths: object) -> None:
    """Note files this run reads (a catalogue, the weather files): no output may be written over them."""
    _read.extend(str(p) for p in paths if p is not None and str(p) not in _read)


def _inputs(project: Optional[str]) -> list[str]:
    return ([project] if project else []) + _read


def _silence_stdout(stream=None) -> None:  # type: ignore[no-untyped-def]
    """Point the file descriptor behind standard output at /dev/null, so the final flush cannot fail again."""
    import io
    import os

    try:
        fd = (stream if stream is not None else sys.stdout).fileno()
        null = os.open(os.devnull, os.O_WRONLY)
        os.dup2(null, fd)
        os.close(null)
    except (OSError, ValueError, AttributeError, io.UnsupportedOperation):
        pass  # not backed by a file descriptor (a test runner's buffer)


class _Stdout:
    """Standard output whose write errors are coldroom errors.

    A full device or an I/O error becomes an :class:`OutputError` (exit 73,
    one line); a closed pipe is left to :func:`guarded`, which ends quietly.
    """

    def __init__(self, stream) -> None:  # type: ignore[no-untyped-def]
        self._stream = stream

    def _guard(self, action):  # type: ignore[no-untyped-def]
        from coldroom.errors import OutputError

        try:
            return action()
        except BrokenPipeError:
            raise
        except OSError as exc:
            _silence_stdout(self._stream)
            raise OutputError(f"cannot write to standard output: {exc.strerror or exc}") from None

    def write(self, text: str) -> int:
        return self._guard(lambda: self._stream.write(text))  # type: ignore[no-any-return]

    def flush(self) -> None:
        self._guard(self._stream.flush)

    def __getattr__(self, name: str):  # type: ignore[no-untyped-def]
        return getattr(self._stream, name)


def guarded(func: Callable[[], None]) -> None:
    """Run *func*, turning any ColdroomError into a one-line message and exit code.

    Standard output is flushed inside, so a full disk behind it is reported
    (exit 73) instead of failing at exit; a reader that closed the pipe
    (``coldroom products | head -1``) ends the run quietly (exit 141, as a
    program stopped by SIGPIPE). Ctrl-C, SIGTERM and SIGHUP are reported
    here too, with exit 128 + the signal number:
    :func:`coldroom.output.files.write_atomic` has removed its temporary file by then.
    """
    del _written[:]
    del _read[:]
    try:
        func()
        sys.stdout.flush()
    except ColdroomError as error:
        raise fail(error) from None
    except BrokenPipeError:
        _silence_stdout()
        raise typer.Exit(code=141) from None
    except KeyboardInterrupt as stop:
        raise typer.Exit(code=interrupted(stop)) from None


def interrupted(stop: KeyboardInterrupt) -> int:
    """Report an interruption on one line; return its exit code (128 + signal number)."""
    import signal

    number = getattr(stop, "signum", signal.SIGINT)
    what = "interrupted" if number == signal.SIGINT else f"stopped by {signal.Signals(number).name}"
    done = f"only {', '.join(_written)} was written" if _written else "no output was written"
    print(f"coldroom: {what}; {done}, no partial file was left", file=sys.stderr)
    return 128 + int(number)


def check_outputs(*named: tuple[str, Optional[str]], force: bool, project: Optional[str] = None):  # type: ignore[no-untyped-def]
    """Check every output of a command before any work (see :func:`coldroom.output.files.check_targets`)."""
    from coldroom.output.files import check_targets

    return check_targets(named, force=force, inputs=_inputs(project))


def console_for(*targets) -> object:  # type: ignore[no-untyped-def]
    """Where the terminal text goes: stderr when an output is standard output, else stdout."""
    return sys.stderr if any(t is not None and t.kind == "stdout" for t in targets) else sys.stdout


def say(text: str, file=None) -> None:  # type: ignore[no-untyped-def]
    """Print *text* (which may hold names from the project file) with control characters escaped."""
    from coldroom.errors import printable

    print(printable(text), file=file if file is not None else sys.stdout)


def write_output(target, data, *, force: bool, project: Optional[str], console) -> None:  # type: ignore[no-untyped-def]
    """Write a checked output (checked again: the disk may have changed meanwhile); say where."""
    if target is None:
        return
    from coldroom.output.files import write_atomic

    if target.kind == "stdout":
        console.flush()
    write_atomic(target.name, data, force=force, inputs=_inputs(project))
    if target.kind != "stdout":
        _written.append(target.name)
        say(f"wrote {target.name}", file=console)


def emit_json(command: str, body, target, *, force: bool, project: str, model, content: bytes, console) -> None:  # type: ignore[no-untyped-def]
    """Write *command*'s JSON document (the envelope of :mod:`coldroom.output.json_contract` around
    *body*, a mapping or a function making it) as strict JSON to a checked *target*; nothing when not asked."""
    if target is None:
        return
    from coldroom.output.files import json_text
    from coldroom.output.produce import json_document

    write_output(target, json_text(json_document(command, body, model, project, content)), force=force,
                 project=project, console=console)
