"""Name look-ups: one normalisation and one exact look-up for every named table.

Materials, surface films, products, refrigerants, packaging, load methods and the
other named choices of a project file are all found the same way:

1. the name is normalised by :func:`normalise` (Unicode compatibility form, case
   folded, surrounding blanks removed, parentheses dropped, runs of blanks,
   hyphens, underscores and slashes turned into one ``_``);
2. the normalised name must equal the normalised form of a table key or of one
   of its declared aliases — nothing is guessed;
3. an unknown name raises :class:`coldroom.errors.LookupNameError` naming the
   closest valid names (:func:`coldroom.errors.unknown_name`).

A table whose names are designations rather than words (refrigerants:
``R448A`` = ``R-448A``) is built with ``compact=True``: separators are then
ignored altogether. Two names of one table that normalise alike are a
programming error (:class:`DuplicateNameError` at import time).

This module imports nothing of ours but :mod:`coldroom.errors`.
"""

from __future__ import annotations

import re
import unicodedata
from functools import lru_cache
from typing import Generic, Iterator, Mapping, TypeVar

from coldroom.errors import unknown_name

__all__ = ["normalise", "Registry", "DuplicateNameError"]

T = TypeVar("T")

_SEPARATORS = re.compile(r"[\s\-_/]+")


def normalise(name: object) -> str:
    """The look-up form of a name.

    Parameters
    ----------
    name : str
        A name as a person wrote it.

    Returns
    -------
    str
        Case-folded, trimmed, parentheses dropped, runs of blanks, hyphens,
        underscores and slashes turned into one ``_`` (none at either end).

    Examples
    --------
    >>> normalise("  Glass-Fibre ")
    'glass_fibre'
    >>> normalise("PUR/PIR panel")
    'pur_pir_panel'
    >>> normalise("R-1234ze(E)")
    'r_1234zee'
    >>> normalise("hot--gas")
    'hot_gas'
    """
    return _normalised(str(name))


@lru_cache(maxsize=4096)
def _normalised(text: str) -> str:
    """:func:`normalise` of a string, remembered: a job looks the same few names up
    thousands of times (every construction of every room at every hour of the design day)."""
    text = unicodedata.normalize("NFKC", text).casefold()
    text = text.replace("(", "").replace(")", "")
    return _SEPARATORS.sub("_", text).strip("_")


class DuplicateNameError(ValueError):
    """Two names of one table normalise to the same look-up form (a table error)."""


class Registry(Generic[T]):
    """A named table with exact look-up after :func:`normalise`.

    Parameters
    ----------
    kind : str
        What the names are, in words (``"insulation material"``); used in the
        error message.
    entries : Mapping[str, T]
        Canonical key → value, in listing order.
    aliases : Mapping[str, str], optional
        Extra spelling → canonical key (never a fuzzy guess).
    compact : bool
        Ignore separators altogether (designations such as ``R-448A``).

    Raises
    ------
    DuplicateNameError
        Two names normalise alike, or an alias names no key.

    Examples
    --------
    >>> r = Registry("defrost type", {"off_cycle": 16.0, "hot_gas": 20.0}, {"off": "off_cycle"})
    >>> r["Hot-Gas"], r.key("OFF"), "hot gas" in r
    (20.0, 'off_cycle', True)
    >>> r["steam"]
    Traceback (most recent call last):
    ...
    coldroom.errors.LookupNameError: unknown defrost type 'steam'; closest: hot_gas; valid: off_cycle, hot_gas, off
    """

    def __init__(
        self,
        kind: str,
        entries: Mapping[str, T],
        aliases: Mapping[str, str] | None = None,
        *,
        compact: bool = False,
    ) -> None:
        self.kind = kind
        self.compact = compact
        self._entries: dict[str, T] = dict(entries)
        self._aliases: dict[str, str] = dict(aliases or {})
        self._index: dict[str, str] = {}
        for name in self._entries:
            self._add(name, name)
        for alias, target in self._aliases.items():
            if target not in self._entries:
                raise DuplicateNameError(f"{kind} alias {alias!r} names no entry ({target!r})")
            self._add(alias, target)

    def _form(self, name: object) -> str:
        form = normalise(name)
        return form.replace("_", "") if self.compact else form

    def _add(self, name: str, target: str) -> None:
        form = self._form(name)
        if form in self._index and self._index[form] != target:
            raise DuplicateNameError(
                f"{self.kind} name {name!r} is also a spelling of {self._index[form]!r}"
            )
        self._index[form] = target

    def key(self, name: object) -> str:
        """The canonical key of *name*.

        Raises
        ------
        coldroom.errors.LookupNameError
            Unknown name; the message lists the closest valid names.
        """
        key = self._index.get(self._form(name))
        if key is None:
            raise unknown_name(self.kind, str(name), self.names(aliases=True))
        return key

    def lookup(self, name: object) -> T:
        """The entry for *name* (exact after normalisation).

        Raises
        ------
        coldroom.errors.LookupNameError
            Unknown name; the message lists the closest valid names.
        """
        return self._entries[self.key(name)]

    __getitem__ = lookup

    def get(self, name: object, default: T | None = None) -> T | None:
        """The entry for *name*, or *default* when the name is unknown."""
        key = self._index.get(self._form(name))
        return default if key is None else self._entries[key]

    def __contains__(self, name: object) -> bool:
        return self._form(name) in self._index

    def __iter__(self) -> Iterator[str]:
        return iter(self._entries)

    def __len__(self) -> int:
        return len(self._entries)

    def names(self, *, aliases: bool = False) -> tuple[str, ...]:
        """Canonical keys in listing order (and the aliases after them if asked)."""
        keys = tuple(self._entries)
        return keys + tuple(self._aliases) if aliases else keys

    def items(self) -> Iterator[tuple[str, T]]:
        """(canonical key, entry) pairs in listing order."""
        return iter(self._entries.items())
