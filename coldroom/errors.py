"""One exception family for everything coldroom reports to a user.

The CLI catches :class:`ColdroomError` once and maps each subclass to an exit
code; library callers may catch the specific subclass.
"""

from __future__ import annotations

import re
from contextlib import contextmanager
from typing import Iterator


class ColdroomError(ValueError):
    """Base class of every error coldroom raises on purpose.

    Parameters
    ----------
    message : str
        One line, naming the quantity, the value and the valid range.
    """

    exit_code = 1


class ProjectFileError(ColdroomError):
    """The project file is unreadable, malformed or physically impossible.

    Carries the file name, line, column and dotted key so the CLI can print
    ``file:line:col: dotted.key: message``.
    """

    exit_code = 65

    def __init__(
        self,
        message: str,
        *,
        file: str | None = None,
        line: int | None = None,
        column: int | None = None,
        key: str | None = None,
    ) -> None:
        self.message = message
        self.file = file
        self.line = line
        self.column = column
        self.key = key
        super().__init__(self.format())

    def format(self) -> str:
        """Return the one-line ``file:line:col: key: message`` form."""
        where = self.file or "<input>"
        if self.line is not None:
            where += f":{self.line}"
            if self.column is not None:
                where += f":{self.column}"
        parts = [where]
        if self.key:
            parts.append(self.key)
        parts.append(self.message)
        return ": ".join(parts)


class UnitError(ColdroomError):
    """A quantity string has an unknown unit or one of the wrong kind."""

    exit_code = 65


class LookupNameError(ColdroomError):
    """An unknown name in a table (refrigerant, product, material, method).

    The message lists the closest valid names.
    """

    exit_code = 65


class CalculationError(ColdroomError):
    """The calculation is impossible at these conditions (explained)."""

    exit_code = 1


class PropertyRangeError(CalculationError):
    """A refrigerant state outside the range the property model supports."""


class OutputError(ColdroomError):
    """An output file cannot be written (exists without --force, is the input,
    or the directory is not writable)."""

    exit_code = 73


class UsageError(ColdroomError):
    """A value given on the command line is unusable (exit 2, like a typo in an option).

    Raised directly, or through :func:`command_line_values` for values whose
    parser raises another class.
    """

    exit_code = 2


@contextmanager
def command_line_values(option: str = "") -> Iterator[None]:
    """Re-raise any :class:`ColdroomError` inside the block as a :class:`UsageError`.

    A value read from the command line is a usage error whatever the parser
    that refuses it (an unknown unit, an unknown name, a value out of range),
    so a command parses and checks its option values inside this block.

    Examples
    --------
    >>> with command_line_values("--capacity"):
    ...     raise UnitError("unknown unit 'kQ'")
    Traceback (most recent call last):
    ...
    coldroom.errors.UsageError: --capacity: unknown unit 'kQ'
    """
    try:
        yield
    except UsageError:
        raise
    except ColdroomError as error:
        raise UsageError(f"{option}: {error}" if option else str(error)) from None


_CONTROL = re.compile("[\x00-\x08\x0b-\x1f\x7f-\x9f]")


def printable(text: str) -> str:
    r"""*text* with control characters shown as escapes, safe to print on a terminal.

    Tabs and newlines stay; every other C0/C1 control character and DEL
    becomes ``\xNN`` so a value from a file cannot move the cursor, change
    colours or retitle the terminal.

    Examples
    --------
    >>> printable("Cold\x1b[2Jroom\x00")
    'Cold\\x1b[2Jroom\\x00'
    """
    return _CONTROL.sub(lambda m: f"\\x{ord(m.group()):02x}", text)


def finite(name: str, value: float) -> float:
    """*value* as a float, or CalculationError when it is NaN or infinite.

    Examples
    --------
    >>> finite("area", 2)
    2.0
    """
    import math

    value = float(value)
    if not math.isfinite(value):
        raise CalculationError(f"{name} must be a finite number, got {value!r}")
    return value


def non_negative(name: str, value: float, unit: str) -> float:
    """*value* as a finite float ≥ 0, or CalculationError naming the quantity and its unit."""
    value = finite(name, value)
    if value < 0.0:
        raise CalculationError(f"{name} {value:g} {unit} must not be negative")
    return value


def closest_names(name: str, valid: list[str] | tuple[str, ...], n: int = 5) -> list[str]:
    """Return up to *n* valid names closest to *name* (case-insensitive).

    Examples
    --------
    >>> closest_names("R448", ["R-448A", "R-449A", "R-134a"])[:2]
    ['R-448A', 'R-449A']
    """
    import difflib

    lowered = {v.lower(): v for v in valid}
    hits = difflib.get_close_matches(name.lower(), list(lowered), n=n, cutoff=0.3)
    return [lowered[h] for h in hits]


#: Commands that list a whole table, by the kind of name looked up.
LISTING_COMMANDS = {"refrigerant": "coldroom refrigerants", "product": "coldroom products"}


def unknown_name(kind: str, name: str, valid: list[str] | tuple[str, ...]) -> LookupNameError:
    """Build the standard "unknown X" error with the closest valid names.

    Short tables are listed whole; long ones name the command that lists them.

    Examples
    --------
    >>> print(unknown_name("door protection", "curtain", ["none", "strip_curtain", "air_curtain"]))
    unknown door protection 'curtain'; closest: air_curtain, strip_curtain; valid: none, strip_curtain, air_curtain
    >>> print(unknown_name("refrigerant", "R448", ["R-448A", "R-449A"]))
    unknown refrigerant 'R448'; closest: R-448A, R-449A; `coldroom refrigerants` lists them all
    """
    near = closest_names(name, valid)
    text = f"unknown {kind} {name!r}"
    if near:
        text += f"; closest: {', '.join(near)}"
    if kind in LISTING_COMMANDS:
        text += f"; `{LISTING_COMMANDS[kind]}` lists them all"
    elif len(valid) <= 20:
        text += f"; valid: {', '.join(valid)}"
    return LookupNameError(text)
