"""Text for the sheet: only characters the built-in Helvetica shows.

Numbers are formatted by :mod:`coldroom.units` (``display`` and the ``format_*``
functions the terminal uses too); the helpers here pass them through :func:`clean`.

The sheet uses reportlab's built-in Helvetica (WinAnsi encoding) so that the
PDF needs no font files and is byte-identical on every machine. WinAnsi has
°, ², ³, ·, ×, –, —, µ, ±, ½ but not ≤, ≥, −, Δ, η, subscripts or arrows;
:func:`clean` replaces those with readable equivalents.

Examples
--------
>>> clean("1 − E ≤ 0.2 → ok, Δt")
'1 - E <= 0.2 -> ok, dt'
>>> clean("U 0.22 W/(m²·K) × 13.5 m²")
'U 0.22 W/(m²·K) × 13.5 m²'
"""

from __future__ import annotations

from coldroom import units as _units

_REPLACE = {
    "\u2212": "-",  # minus sign
    "\u2264": "<=",
    "\u2265": ">=",
    "\u2248": "~",
    "\u2192": "->",
    "\u2190": "<-",
    "\u0394": "d",  # Δ
    "\u03b7": "eta",
    "\u03c1": "rho",
    "\u03b8": "theta",
    "\u2082": "2",
    "\u2083": "3",
    "\u2081": "1",
    "\u2084": "4",
    "\u1e41": "m",  # ṁ
    "\u2009": " ",
    "\u202f": " ",
    "\u2011": "-",
    "\u2026": "...",
    "\u2032": "'",
}


_TABLE = str.maketrans(_REPLACE)


def clean(text: object) -> str:
    """*text* with every character outside WinAnsi replaced (``?`` if no equivalent).

    One translation and one encoding pass per string (the sheet cleans tens of
    thousands of strings).
    """
    text = str(text).translate(_TABLE)
    try:
        text.encode("cp1252")
        return text
    except UnicodeEncodeError:
        return text.encode("cp1252", "replace").decode("cp1252")


def esc(text: object) -> str:
    """:func:`clean` and escape for a reportlab Paragraph (``&``, ``<``, ``>``)."""
    return clean(text).replace("&", "&amp;").replace("<", "&lt;").replace(">", "&gt;")


def q(value_si: float | None, kind: str, system: str, digits: int | None = None) -> str:
    """A quantity with its unit in the project's system, or an en dash when missing.

    Examples
    --------
    >>> q(0.1, "thickness", "SI")
    '100 mm'
    >>> q(None, "power", "SI")
    '–'
    """
    if value_si is None:
        return "–"
    return clean(_units.display(value_si, kind, system, digits))


def capacity(watts: float, system: str) -> str:
    """A refrigeration capacity (:func:`coldroom.units.format_capacity`) in the sheet's characters.

    Examples
    --------
    >>> capacity(5234.0, "SI")
    '5.23 kW'
    >>> capacity(3516.85, "IP")
    '12,000 Btu/h (1.00 TR)'
    """
    return clean(_units.format_capacity(watts, system))


def temperature(value_c: float | None, system: str) -> str:
    """A temperature with one decimal (:func:`coldroom.units.format_temperature`) in the sheet's characters.

    Examples
    --------
    >>> temperature(-2.5, "SI")
    '-2.5 °C'
    >>> temperature(0.0, "IP")
    '32.0 °F'
    """
    return clean(_units.format_temperature(value_c, system))
