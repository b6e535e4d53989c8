"""Command-line interface (typer).

Thin: parse arguments, call the library, print, map :class:`ColdroomError` to
exit codes. Heavy modules (CoolProp via ``coldroom.refrigerant``, reportlab via
``coldroom.report``) are imported inside the commands that need them, never at
module level, so ``coldroom --help`` and ``coldroom validate`` stay fast.

Exit codes: 0 ok; 1 calculation impossible; 2 usage; 65 invalid project file;
73 cannot write output.
"""

from __future__ import annotations

import sys
from typing import Callable, Optional

import typer

from coldroom import __version__
from coldroom.errors import ColdroomError

app = typer.Typer(
    name="coldroom",
    help="Heat loads and refrigeration-cycle sizing for walk-in coolers and freezers.",
    add_completion=False,
    no_args_is_help=True,
    pretty_exceptions_enable=False,
)


def fail(error: ColdroomError) -> "typer.Exit":
    """Print *error* as one line on stderr and return the Exit to raise."""
    text = error.format() if hasattr(error, "format") else str(error)
    text = " ".join(str(text).split())  # guarantee a single line
    print(f"coldroom: error: {text}" if ":" not in text.split(" ")[0] else text, file=sys.stderr)
    return typer.Exit(code=getattr(error, "exit_code", 1))


def guarded(func: Callable[[], None]) -> None:
    """Run *func*, turning any ColdroomError into a one-line message and exit code."""
    try:
        func()
    except ColdroomError as error:
        raise fail(error) from None


def version_callback(value: bool) -> None:
    if value:
        print(f"coldroom {__version__}")
        raise typer.Exit()


@app.callback()
def _root(
    version: Optional[bool] = typer.Option(
        None, "--version", callback=version_callback, is_eager=True, help="Print the version and exit."
    ),
) -> None:
    """Heat loads and refrigeration-cycle sizing for walk-in coolers and freezers."""


# --- commands -------------------------------------------------------------
# Each command lives in its own block below; keep imports of heavy modules
# inside the command body.


def main() -> None:
    """Console-script entry point."""
    app()


if __name__ == "__main__":  # pragma: no cover
    main()
