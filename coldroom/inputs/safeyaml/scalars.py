"""The scalar rules of the safe loader: YAML 1.2 core-schema plain scalars, minus the YAML 1.1 traps.

A plain scalar becomes text, an int, a float, true/false or null; a value that
YAML 1.1 tools would read differently (``no``, ``010``, ``1:30``, ``1_000``,
``.nan``) or an explicit tag other than the core ones is refused with a message
that says how to write it.
"""

from __future__ import annotations

import math
import re
from typing import Any

from yaml.nodes import ScalarNode

_TAG = "tag:yaml.org,2002:"
_STR, _INT, _FLOAT, _BOOL, _NULL = (_TAG + t for t in ("str", "int", "float", "bool", "null"))
_MAP, _SEQ = _TAG + "map", _TAG + "seq"
_SCALAR_TAGS = frozenset({_STR, _INT, _FLOAT, _BOOL, _NULL})

# --- plain-scalar rules (YAML 1.2 core schema, minus the 1.1 traps) -------------
_NULLS = frozenset({"", "~", "null", "Null", "NULL"})
_TRUE = frozenset({"true", "True", "TRUE"})
_FALSE = frozenset({"false", "False", "FALSE"})
_YAML11_BOOLS = frozenset({"yes", "no", "on", "off", "y", "n"})  # compared lower-cased
_NONFINITE = re.compile(r"[-+]?\.(?:inf|Inf|INF)|\.(?:nan|NaN|NAN)")
_SEXAGESIMAL = re.compile(r"[-+]?[0-9][0-9_]*(?::[0-5]?[0-9])+(?:\.[0-9_]*)?")
_DECIMAL_INT = re.compile(r"[-+]?(?:0|[1-9][0-9]*)")
_OTHER_INT = re.compile(
    r"[-+]?0[0-9_]+"  # leading zero: octal in YAML 1.1
    r"|[-+]?0[oO][0-7_]*"  # YAML 1.2 octal
    r"|[-+]?0[xX][0-9a-fA-F_]*"  # hexadecimal
    r"|[-+]?0[bB][01_]*"  # binary (YAML 1.1)
)
_FLOAT_RE = re.compile(r"[-+]?(?:\.[0-9]+|[0-9]+(?:\.[0-9]*)?)(?:[eE][-+]?[0-9]+)?")
_UNDERSCORE_NUMBER = re.compile(r"[-+]?[0-9._]*_[0-9._]*(?:[eE][-+]?[0-9_]+)?")
_MAX_NUMBER_CHARS = 100  # a number longer than this is a typo (and int() of 4300+ digits raises)


class _Reject(Exception):
    """Internal: a scalar breaks a rule; carries the user message."""


def _show(value: str) -> str:
    """Quote *value* for a message, shortened when long."""
    return repr(value if len(value) <= 40 else value[:30] + "...")


def _tagname(tag: str) -> str:
    return tag.replace(_TAG, "!!")


def _scalar(node: ScalarNode) -> Any:
    """Turn a scalar node into str/int/float/bool/None, or raise _Reject."""
    value: str = node.value
    tag: str = node.tag
    if getattr(node, "explicit_tag", False):
        if tag not in _SCALAR_TAGS:
            raise _Reject(
                f"tag {_tagname(tag)!r} is not allowed; only plain values"
                " (text, numbers, true/false, null), lists and mappings"
            )
        if tag == _STR:
            return value
        result = _plain(value.strip(), None)
        wanted = {_INT: (int,), _FLOAT: (int, float), _BOOL: (bool,), _NULL: (type(None),)}[tag]
        if isinstance(result, bool) and tag != _BOOL or not isinstance(result, wanted):
            raise _Reject(f"{_show(value)} is not a valid {_tagname(tag)} value")
        return float(result) if tag == _FLOAT else result
    if not getattr(node, "plain", False):
        return value  # quoted or block scalar: always text
    return _plain(value, tag)


def _plain(value: str, resolved: str | None) -> Any:
    """Apply the plain-scalar rules to *value*.

    *resolved* is the tag PyYAML's YAML 1.1 resolver gave it (None when the
    tag was explicit); a value it reads as a non-string that the rules here
    read as text is ambiguous between YAML versions, hence an error.
    """
    if value in _NULLS:
        return None
    if value in _TRUE or value in _FALSE:
        return value in _TRUE
    if value.lower() in _YAML11_BOOLS:
        raise _Reject(
            f"{_show(value)} is read as a yes/no boolean by YAML 1.1 tools; write false (or true),"
            f" or quote it ({_show(value)}) if you mean the text"
        )
    if _NONFINITE.fullmatch(value):
        raise _Reject(f"{_show(value)} is not a finite number")
    if _SEXAGESIMAL.fullmatch(value):
        raise _Reject(
            f"{_show(value)} is read as a base-60 number by YAML 1.1 tools (1:30 becomes 90);"
            f" quote it ({_show(value)}) if you mean a time or ratio"
        )
    if len(value) <= _MAX_NUMBER_CHARS and _DECIMAL_INT.fullmatch(value):
        return int(value)
    if _OTHER_INT.fullmatch(value):
        if value.lstrip("+-")[1:2].isdigit():
            raise _Reject(
                f"{_show(value)} has a leading zero, so YAML 1.1 tools read it as an octal number;"
                " drop the leading zero, or quote it if you mean the text (a code or number plate)"
            )
        raise _Reject(
            f"{_show(value)} is a hexadecimal, octal or binary number to YAML tools;"
            " write a plain decimal number, or quote it if you mean the text"
        )
    if "_" in value and _UNDERSCORE_NUMBER.fullmatch(value) and any(c.isdigit() for c in value):
        raise _Reject(
            f"{_show(value)}: write numbers without underscores (YAML tools disagree on them),"
            " or quote it if you mean the text"
        )
    if len(value) <= _MAX_NUMBER_CHARS and _FLOAT_RE.fullmatch(value):
        number = float(value)
        if not math.isfinite(number):
            raise _Reject(f"{_show(value)} is not a finite number")
        return number
    if len(value) > _MAX_NUMBER_CHARS and (_DECIMAL_INT.fullmatch(value) or _FLOAT_RE.fullmatch(value)):
        raise _Reject(f"{_show(value)} is too long for a number; shorten it or quote it if you mean the text")
    if resolved in (_INT, _FLOAT, _BOOL, _NULL):
        raise _Reject(
            f"{_show(value)} is read as {resolved.replace(_TAG, '')} by YAML 1.1 tools but as text by"
            " others; write a plain decimal number, true/false or null, or quote the text"
        )
    if resolved == _TAG + "merge":
        raise _Reject("'<<' (a merge key) cannot be a value; quote it if you mean the text")
    # text, including timestamps (2024-05-01 stays the string '2024-05-01') and '='
    return value
