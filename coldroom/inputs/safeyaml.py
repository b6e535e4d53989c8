"""Hardened YAML loading for project files.

Project files are typed by hand, copied from old jobs, mailed around and opened
from strangers, so the loader trusts nothing:

* only :class:`yaml.SafeLoader` machinery (reader, scanner, parser, resolver) is
  used; the node graph is composed here and turned into plain Python objects
  here, never by a PyYAML constructor, so no tag can build an arbitrary object;
* limits are enforced on the raw bytes and on the node graph *before* any
  Python object is built: file size, nesting depth, number of aliases and the
  number of nodes the document would have with every alias expanded (an alias
  "bomb" of a few kB otherwise expands into millions of objects);
* duplicate keys are an error (PyYAML silently keeps the last one);
* YAML 1.1 surprises are errors where they would change what the writer meant:
  ``no``/``yes``/``on``/``off``/``y``/``n`` read as booleans, ``010`` read as
  octal, ``1:30`` read as 90, ``.nan``/``.inf``, ``1_000``; only ``true`` and
  ``false`` are booleans and numbers are plain decimal (YAML 1.2 core schema);
* keys must be text, the top level must be a mapping, merge keys (``<<``) are
  rejected (write the keys out instead: merging hides where a value came from);
* every problem is a :class:`coldroom.errors.ProjectFileError` carrying file,
  line, column and the dotted key; no ``yaml.YAMLError``, ``RecursionError`` or
  ``UnicodeDecodeError`` escapes.

The result keeps the 1-based line and column of every key (and of every
sequence item) so a later validation error can point at the right place.

Examples
--------
>>> loaded = load_yaml("rooms:\\n  - name: Dairy\\n    width: 3.5\\n", "demo.yaml")
>>> loaded.data
{'rooms': [{'name': 'Dairy', 'width': 3.5}]}
>>> loaded.marks[("rooms", 0, "width")]
(3, 5)
>>> loaded.position(("rooms", 0, "height"))  # missing key: its parent's mark
(2, 5)
>>> dotted(("rooms", 0, "width"))
'rooms[0].width'
>>> load_yaml("defrost: no\\n", "demo.yaml")
Traceback (most recent call last):
...
coldroom.errors.ProjectFileError: demo.yaml:1:10: defrost: 'no' is read as a yes/no boolean by YAML 1.1 tools; write false (or true), or quote it ('no') if you mean the text
"""

from __future__ import annotations

import copy
import math
import os
import re
from dataclasses import dataclass, field
from types import MappingProxyType
from typing import Any, Mapping, Sequence, Union

import yaml
from yaml.events import (
    AliasEvent,
    MappingEndEvent,
    MappingStartEvent,
    ScalarEvent,
    SequenceEndEvent,
    SequenceStartEvent,
    StreamEndEvent,
)
from yaml.nodes import MappingNode, Node, ScalarNode, SequenceNode

from coldroom.errors import ProjectFileError

__all__ = [
    "KeyPath",
    "LoadedYaml",
    "MAX_ALIASES",
    "MAX_BYTES",
    "MAX_DEPTH",
    "MAX_NODES",
    "Mark",
    "dotted",
    "load_yaml",
    "read_source",
]

KeyPath = tuple[Union[str, int], ...]
"""A path into the document: mapping keys (str) and sequence indices (int)."""

Mark = tuple[int, int]
"""A position in the file: (line, column), both 1-based, columns in characters."""

MAX_BYTES = 1 << 20
"""Largest accepted project file [byte] (1 MiB; real project files are a few kB)."""

MAX_DEPTH = 32
"""Deepest accepted nesting of collections (the top-level mapping is depth 1)."""

MAX_ALIASES = 100
"""Most alias uses (``*name``) accepted in one file."""

MAX_NODES = 100_000
"""Most nodes accepted, counted as if every alias were expanded."""

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


def dotted(path: Sequence[object]) -> str:
    """Return the dotted key for a key path, as printed in error messages.

    Parameters
    ----------
    path : sequence of str and int
        Mapping keys and sequence indices from the top of the document.

    Returns
    -------
    str
        Keys joined by dots, indices in brackets; ``""`` for the top level.

    Examples
    --------
    >>> dotted(("rooms", 0, "doors", 1, "width"))
    'rooms[0].doors[1].width'
    >>> dotted([0, "name"])
    '[0].name'
    >>> dotted(())
    ''
    """
    out = ""
    for part in path:
        if isinstance(part, int) and not isinstance(part, bool):
            out += f"[{part}]"
        else:
            out += ("." if out else "") + str(part)
    return out


@dataclass(frozen=True)
class LoadedYaml:
    """A loaded project file: plain data plus where each key stands in the file.

    Attributes
    ----------
    data : dict
        The top-level mapping, made only of dict, list, str, int, float, bool
        and None (aliases are expanded into independent copies).
    marks : Mapping[KeyPath, Mark]
        For every key path: the (line, column) of the key of a mapping entry,
        or of the item of a sequence; ``()`` maps to the top-level mapping.
    value_marks : Mapping[KeyPath, Mark]
        For every key path: the (line, column) of the value node itself.
    filename : str
        The name used in error messages.
    """

    data: dict[str, Any]
    marks: Mapping[KeyPath, Mark]
    value_marks: Mapping[KeyPath, Mark] = field(repr=False)
    filename: str = "<input>"

    def key_path(self, path: Sequence[object]) -> KeyPath:
        """Return the longest prefix of *path* that exists in the document.

        Examples
        --------
        >>> loaded = load_yaml("a:\\n  b: 1\\n")
        >>> loaded.key_path(("a", "missing", 3))
        ('a',)
        """
        parts = tuple(path)
        for end in range(len(parts), 0, -1):
            if parts[:end] in self.marks:
                return parts[:end]  # type: ignore[return-value]
        return ()

    def position(self, path: Sequence[object]) -> Mark:
        """Return the (line, column) of the longest existing prefix of *path*.

        Validation errors may name a key that is missing, or carry extra
        segments; the nearest existing parent is then the best place to point.

        Examples
        --------
        >>> loaded = load_yaml("a:\\n  b: 1\\n")
        >>> loaded.position(("a", "b")), loaded.position(("a", "c")), loaded.position(())
        ((2, 3), (1, 1), (1, 1))
        """
        return self.marks.get(self.key_path(path), (1, 1))

    def error(self, message: str, path: Sequence[object] = ()) -> ProjectFileError:
        """Build a :class:`ProjectFileError` located at *path*.

        The dotted key names the full *path* (also a missing key); the line and
        column are those of its longest existing prefix.

        Examples
        --------
        >>> loaded = load_yaml("a:\\n  b: 1\\n", "p.yaml")
        >>> loaded.error("field required", ("a", "c")).format()
        'p.yaml:1:1: a.c: field required'
        """
        line, column = self.position(path)
        key = dotted(tuple(path)) or None
        return ProjectFileError(message, file=self.filename, line=line, column=column, key=key)


def _line_col_of_offset(text: str, offset: int) -> Mark:
    """1-based (line, column) of character *offset* in *text*."""
    line = text.count("\n", 0, offset) + 1
    start = text.rfind("\n", 0, offset) + 1
    return line, offset - start + 1


def _decode(source: str | bytes, filename: str, max_bytes: int) -> str:
    """Check the size and the encoding; return the text without a BOM."""
    if isinstance(source, str):
        if len(source) > max_bytes or len(source.encode("utf-8", "surrogatepass")) > max_bytes:
            raise ProjectFileError(
                f"file is larger than {max_bytes} bytes; a project file is a few kB", file=filename
            )
        text = source
    elif isinstance(source, (bytes, bytearray, memoryview)):
        raw = bytes(source)
        if len(raw) > max_bytes:
            raise ProjectFileError(
                f"file is {len(raw)} bytes, larger than the limit of {max_bytes} bytes;"
                " a project file is a few kB",
                file=filename,
            )
        if raw[:2] in (b"\xff\xfe", b"\xfe\xff"):
            raise ProjectFileError(
                "file is UTF-16 encoded; save it as UTF-8", file=filename, line=1, column=1
            )
        try:
            text = raw.decode("utf-8")
        except UnicodeDecodeError as exc:
            line = raw.count(b"\n", 0, exc.start) + 1
            line_start = raw.rfind(b"\n", 0, exc.start) + 1
            column = len(raw[line_start : exc.start].decode("utf-8", "replace")) + 1
            raise ProjectFileError(
                f"not valid UTF-8: byte 0x{raw[exc.start]:02x} at byte offset {exc.start};"
                " save the file as UTF-8",
                file=filename,
                line=line,
                column=column,
            ) from None
    else:
        raise ProjectFileError(
            f"cannot read a project file from a {type(source).__name__}", file=filename
        )
    if text.startswith("\ufeff"):
        text = text[1:]
    return text


class _GuardedCompose:
    """The guarded composer: builds the node graph from parser events with the limits checked.

    Mixed into a loader class that brings the reader, scanner, parser and
    resolver (PyYAML's pure-Python ``SafeLoader`` or libyaml's ``CSafeLoader``).
    Only the composition of the node graph is replaced; construction is done
    by :func:`_build` from the checked graph, never by a PyYAML constructor.
    """

    def _start_guard(self, max_depth: int, max_aliases: int) -> None:
        self.max_depth = max_depth
        self.max_aliases = max_aliases
        self.alias_count = 0
        self.depth = 0
        self.node_anchors: dict[str, Node] = {}

    def compose_single(self) -> Node | None:
        self.get_event()  # STREAM-START
        node = None
        if not self.check_event(StreamEndEvent):
            self.get_event()  # DOCUMENT-START
            node = self.compose_node(None, None)
            self.get_event()  # DOCUMENT-END
        if not self.check_event(StreamEndEvent):
            event = self.get_event()
            raise _Located(
                "found a second document (after a '---' or '...' line); a project file holds one",
                event.start_mark,
            )
        return node

    def compose_node(self, parent: Node | None, index: object) -> Node:  # noqa: D102
        if self.check_event(AliasEvent):
            event = self.get_event()
            self.alias_count += 1
            if self.alias_count > self.max_aliases:
                raise _Located(
                    f"more than {self.max_aliases} aliases (*name); write the values out",
                    event.start_mark,
                )
            if event.anchor not in self.node_anchors:
                raise _Located(f"alias *{event.anchor} has no anchor &{event.anchor} before it", event.start_mark)
            # A shallow copy sharing the children: the alias keeps its own
            # position for messages; the size check still sees shared nodes.
            proxy = copy.copy(self.node_anchors[event.anchor])
            proxy.start_mark, proxy.end_mark = event.start_mark, event.end_mark
            return proxy
        event = self.peek_event()
        anchor = event.anchor
        if anchor is not None and anchor in self.node_anchors:
            first = self.node_anchors[anchor].start_mark
            raise _Located(
                f"anchor &{anchor} defined twice (first at line {first.line + 1})", event.start_mark
            )
        if self.check_event(ScalarEvent):
            event = self.get_event()
            tag = event.tag
            explicit = tag not in (None, "!")
            if not explicit:
                tag = self.resolve(ScalarNode, event.value, event.implicit)
            node: Node = ScalarNode(tag, event.value, event.start_mark, event.end_mark, style=event.style or None)
            node.explicit_tag = explicit  # type: ignore[attr-defined]
            node.plain = not event.style and event.implicit[0] and not explicit  # type: ignore[attr-defined]
            if anchor is not None:
                self.node_anchors[anchor] = node
            return node
        if self.check_event(SequenceStartEvent, MappingStartEvent):
            is_seq = self.check_event(SequenceStartEvent)
            start = self.get_event()
            self.depth += 1
            if self.depth > self.max_depth:
                raise _Located(f"nested deeper than {self.max_depth} levels", start.start_mark)
            tag = start.tag
            if tag in (None, "!"):
                tag = _SEQ if is_seq else _MAP
            node = (SequenceNode if is_seq else MappingNode)(tag, [], start.start_mark, None)
            if anchor is not None:
                self.node_anchors[anchor] = node
            if is_seq:
                i = 0
                while not self.check_event(SequenceEndEvent):
                    node.value.append(self.compose_node(node, i))
                    i += 1
            else:
                while not self.check_event(MappingEndEvent):
                    key = self.compose_node(node, None)
                    value = self.compose_node(node, key)
                    node.value.append((key, value))
            node.end_mark = self.get_event().end_mark
            self.depth -= 1
            return node
        event = self.get_event()  # pragma: no cover - the parser never yields anything else here
        raise _Located(f"unexpected {type(event).__name__}", event.start_mark)  # pragma: no cover


class _Composer(_GuardedCompose, yaml.SafeLoader):
    """PyYAML's pure-Python reader, scanner, parser and resolver under the guarded composer.

    Its error messages are the ones a user sees (every problem is reported from
    this loader, see :func:`load_yaml`).
    """

    def __init__(self, text: str, max_depth: int, max_aliases: int) -> None:
        self._start_guard(max_depth, max_aliases)
        super().__init__(text)

    def fetch_flow_collection_start(self, TokenClass: type) -> None:  # noqa: N803
        # Stop deep flow nesting ("[[[[...") in the scanner already: its
        # look-ahead for simple keys costs time per open flow level.
        if self.flow_level >= self.max_depth:
            raise _Located(f"nested deeper than {self.max_depth} levels", self.get_mark())
        super().fetch_flow_collection_start(TokenClass)


_CLoader = getattr(yaml, "CSafeLoader", None) if getattr(yaml, "__with_libyaml__", False) else None

if _CLoader is not None:

    class _FastComposer(_GuardedCompose, _CLoader):  # type: ignore[valid-type, misc]
        """libyaml's scanner and parser (C; about 10× faster on a large project) under the
        same guarded composer. It gives the same events (a plain scalar's style is ''
        where PyYAML has None; :meth:`_GuardedCompose.compose_node` reads both alike);
        a file it cannot load is loaded again by :class:`_Composer` for the message."""

        def __init__(self, text: str, max_depth: int, max_aliases: int) -> None:
            self._start_guard(max_depth, max_aliases)
            super().__init__(text)


class _Located(Exception):
    """Internal: a message with a PyYAML mark (0-based) and optional key path."""

    def __init__(self, message: str, mark: Any, path: KeyPath | None = None) -> None:
        super().__init__(message)
        self.message = message
        self.mark = mark
        self.path = path


def _mark(node_or_mark: Any) -> Mark:
    mark = getattr(node_or_mark, "start_mark", node_or_mark)
    return mark.line + 1, mark.column + 1


def _check_size(root: Node, max_nodes: int, max_depth: int) -> None:
    """Count nodes and depth as if every alias were expanded, without expanding.

    Each distinct node is measured once (memoised), so the check costs the size
    of the file, not the size of the expansion. A node that contains itself
    through an alias is an error.
    """
    sizes: dict[int, tuple[int, int]] = {}
    active: set[int] = set()

    def measure(node: Node, level: int) -> tuple[int, int]:
        # level: nesting of this node as reached now (the top mapping is 1);
        # returns (expanded node count, expanded height in collections).
        # an alias is a shallow copy sharing its anchor's children list: key on that list
        key = id(node) if isinstance(node, ScalarNode) else id(node.value)
        known = sizes.get(key)
        if known is None:
            if isinstance(node, ScalarNode):
                known = (1, 0)
                sizes[key] = known
            else:
                if level > max_depth:  # stop before recursing further
                    raise _Located(f"nested deeper than {max_depth} levels (through aliases)", node.start_mark)
                if key in active:
                    raise _Located(
                        "an alias refers to a collection that contains it (endless data)", node.start_mark
                    )
                active.add(key)
                count, height = 1, 0
                children = (
                    node.value
                    if isinstance(node, SequenceNode)
                    else [child for pair in node.value for child in pair]
                )
                for child in children:
                    child_count, child_height = measure(child, level + 1)
                    count += child_count
                    height = max(height, child_height)
                    if count > max_nodes:
                        raise _Located(
                            f"holds more than {max_nodes} values with its aliases (*name) expanded;"
                            " a project file needs far fewer (write it out without nested aliases)",
                            node.start_mark,
                        )
                active.discard(key)
                known = (count, height + 1)
                sizes[key] = known
        if level - 1 + known[1] > max_depth:
            raise _Located(f"nested deeper than {max_depth} levels (through aliases)", node.start_mark)
        return known

    measure(root, 1)


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


def _build(
    node: Node,
    path: KeyPath,
    marks: dict[KeyPath, Mark],
    value_marks: dict[KeyPath, Mark],
) -> Any:
    """Construct plain Python data from a checked node graph, keeping the marks."""
    value_marks[path] = _mark(node)
    if isinstance(node, ScalarNode):
        try:
            return _scalar(node)
        except _Reject as exc:
            raise _Located(str(exc), node.start_mark, path) from None
    if node.tag != (_SEQ if isinstance(node, SequenceNode) else _MAP):
        raise _Located(
            f"tag {_tagname(node.tag)!r} is not allowed here; only plain values,"
            " lists and mappings",
            node.start_mark,
            path,
        )
    if isinstance(node, SequenceNode):
        items = []
        for index, child in enumerate(node.value):
            child_path = path + (index,)
            marks[child_path] = _mark(child)
            items.append(_build(child, child_path, marks, value_marks))
        return items
    result: dict[str, Any] = {}
    first_line: dict[str, int] = {}
    for key_node, value_node in node.value:
        if not isinstance(key_node, ScalarNode):
            raise _Located("a key must be text, not a list or mapping", key_node.start_mark, path)
        if getattr(key_node, "plain", False) and key_node.value == "<<":
            raise _Located(
                "merge keys (<<) are not supported; write the keys out"
                " (an alias *name may stand for a whole value)",
                key_node.start_mark,
                path,
            )
        try:
            key = _scalar(key_node)
        except _Reject as exc:
            raise _Located(f"key {exc}", key_node.start_mark, path) from None
        if not isinstance(key, str):
            raise _Located(
                f"key {_show(key_node.value)} must be text (it reads as {type(key).__name__ if key is not None else 'null'});"
                " quote it or rename it",
                key_node.start_mark,
                path,
            )
        child_path = path + (key,)
        line = key_node.start_mark.line + 1
        if key in result:
            raise _Located(
                f"duplicate key {key!r} (first at line {first_line[key]}, again at line {line});"
                " remove one",
                key_node.start_mark,
                child_path,
            )
        first_line[key] = line
        marks[child_path] = _mark(key_node)
        result[key] = _build(value_node, child_path, marks, value_marks)
    return result


def read_source(path: "str | os.PathLike[str]", *, max_bytes: int = MAX_BYTES) -> bytes:
    """Read a project file, at most *max_bytes* + 1 bytes of it.

    A device that never ends (``/dev/zero``, ``/dev/urandom``) or a huge
    sparse file is refused after ``max_bytes + 1`` bytes instead of filling
    the memory.

    Parameters
    ----------
    path : str or os.PathLike
        The project file.
    max_bytes : int
        Size limit [byte].

    Raises
    ------
    ProjectFileError
        Missing, a directory, unreadable, or larger than *max_bytes* (exit 65).
    """
    name = os.fspath(path)
    try:
        with open(name, "rb") as handle:
            raw = handle.read(max_bytes + 1)
    except FileNotFoundError:
        raise ProjectFileError("no such file", file=name) from None
    except IsADirectoryError:
        raise ProjectFileError("is a directory, not a project file", file=name) from None
    except OSError as exc:
        raise ProjectFileError(f"cannot read: {exc.strerror or exc}", file=name) from None
    if len(raw) > max_bytes:
        raise ProjectFileError(
            f"file is larger than the limit of {max_bytes} bytes; a project file is a few kB", file=name
        )
    return raw


def _compose_fast(text: str, filename: str, max_depth: int, max_aliases: int, max_nodes: int) -> LoadedYaml | None:
    """The file loaded through libyaml with every check of :func:`load_yaml`, or None
    if anything at all goes wrong (the pure-Python loader then reports it)."""
    try:
        loader = _FastComposer(text, max_depth, max_aliases)
        try:
            root = loader.compose_single()
        finally:
            loader.dispose()
        if not isinstance(root, MappingNode):
            return None
        _check_size(root, max_nodes, max_depth)
        marks: dict[KeyPath, Mark] = {(): _mark(root)}
        value_marks: dict[KeyPath, Mark] = {}
        data = _build(root, (), marks, value_marks)
    except Exception:  # noqa: BLE001 - any problem: load again with the loader whose messages we show
        return None
    return LoadedYaml(
        data=data,
        marks=MappingProxyType(marks),
        value_marks=MappingProxyType(value_marks),
        filename=filename,
    )


def load_yaml(
    source: str | bytes,
    filename: str = "<input>",
    *,
    max_bytes: int = MAX_BYTES,
    max_depth: int = MAX_DEPTH,
    max_aliases: int = MAX_ALIASES,
    max_nodes: int = MAX_NODES,
) -> LoadedYaml:
    """Load one YAML project file safely, keeping the position of every key.

    Parameters
    ----------
    source : str or bytes
        The file content; bytes must be UTF-8 (a BOM is allowed).
    filename : str
        The name shown in error messages.
    max_bytes : int
        Size limit [byte], checked before anything is decoded.
    max_depth : int
        Deepest nesting of collections (the top mapping is 1).
    max_aliases : int
        Most alias uses (``*name``).
    max_nodes : int
        Most nodes, counted as if every alias were expanded.

    Returns
    -------
    LoadedYaml
        Plain data (top level a dict) and the marks of every key path.

    Raises
    ------
    ProjectFileError
        For every problem: size, encoding, syntax, limits, duplicate keys,
        YAML 1.1 surprises, disallowed tags, non-text keys, a top level that is
        not a mapping. Nothing else escapes.

    Examples
    --------
    >>> load_yaml(b"\\xef\\xbb\\xbfname: Freezer 2\\ndoors: [1, 2.5, true, null]\\n").data
    {'name': 'Freezer 2', 'doors': [1, 2.5, True, None]}
    >>> load_yaml("a: 1\\na: 2\\n", "p.yaml")
    Traceback (most recent call last):
    ...
    coldroom.errors.ProjectFileError: p.yaml:2:1: a: duplicate key 'a' (first at line 1, again at line 2); remove one
    """
    text = _decode(source, filename, max_bytes)
    if _CLoader is not None:
        fast = _compose_fast(text, filename, max_depth, max_aliases, max_nodes)
        if fast is not None:
            return fast
    try:
        try:
            loader = _Composer(text, max_depth, max_aliases)
        except yaml.reader.ReaderError as exc:
            line, column = _line_col_of_offset(text, exc.position)
            raise ProjectFileError(
                f"character U+{exc.character:04X} is not allowed in a YAML file (control character);"
                " remove it",
                file=filename,
                line=line,
                column=column,
            ) from None
        try:
            root = loader.compose_single()
            if root is None:
                raise ProjectFileError(
                    "file is empty; a project file is a mapping of keys such as 'rooms:'", file=filename
                )
            if not isinstance(root, MappingNode):
                kind = "a list" if isinstance(root, SequenceNode) else "a single value"
                raise _Located(
                    f"the top level must be a mapping of keys (key: value), not {kind}", root.start_mark
                )
            _check_size(root, max_nodes, max_depth)
            marks: dict[KeyPath, Mark] = {(): _mark(root)}
            value_marks: dict[KeyPath, Mark] = {}
            data = _build(root, (), marks, value_marks)
        finally:
            loader.dispose()
    except _Located as exc:
        line, column = _mark(exc.mark)
        raise ProjectFileError(
            exc.message, file=filename, line=line, column=column, key=dotted(exc.path or ()) or None
        ) from None
    except yaml.MarkedYAMLError as exc:
        mark = exc.problem_mark or exc.context_mark
        problem = exc.problem or "invalid YAML"
        message = f"YAML syntax: {problem}"
        if exc.context:
            message += f" ({exc.context}"
            if exc.context_mark is not None and exc.context_mark is not mark:
                message += f" at line {exc.context_mark.line + 1}"
            message += ")"
        raise ProjectFileError(
            message,
            file=filename,
            line=mark.line + 1 if mark is not None else None,
            column=mark.column + 1 if mark is not None else None,
        ) from None
    except yaml.reader.ReaderError as exc:
        line, column = _line_col_of_offset(text, exc.position)
        raise ProjectFileError(
            f"character not allowed in a YAML file: {exc.reason}", file=filename, line=line, column=column
        ) from None
    except yaml.YAMLError as exc:  # any other PyYAML complaint, without a mark
        raise ProjectFileError(f"YAML: {' '.join(str(exc).split())}", file=filename) from None
    except RecursionError:
        raise ProjectFileError(f"nested too deeply (limit {max_depth} levels)", file=filename) from None
    return LoadedYaml(
        data=data,
        marks=MappingProxyType(marks),
        value_marks=MappingProxyType(value_marks),
        filename=filename,
    )
