"""The safe loader itself: size and encoding checks, plain data with the marks of every key, located errors.

The public names are re-exported by :mod:`coldroom.inputs.safeyaml`.
"""

from __future__ import annotations

import os
from dataclasses import dataclass, field
from types import MappingProxyType
from typing import Any, Mapping, Sequence, Union

import yaml
from yaml.nodes import MappingNode, Node, ScalarNode, SequenceNode

from coldroom.errors import ProjectFileError
from coldroom.inputs.safeyaml.composer import _CLoader, _check_size, _Composer, _Located, _mark
from coldroom.inputs.safeyaml.scalars import _MAP, _SEQ, _Reject, _scalar, _show, _tagname

if _CLoader is not None:
    from coldroom.inputs.safeyaml.composer import _FastComposer

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


def read_source(
    path: "str | os.PathLike[str]", *, max_bytes: int = MAX_BYTES, what: str = "project file",
    typical: str = "a project file is a few kB",
) -> bytes:
    """Read an input file (project, catalogue, weather), at most *max_bytes* + 1 bytes of it.

    A device that never ends (``/dev/zero``, ``/dev/urandom``) or a huge
    sparse file is refused after ``max_bytes + 1`` bytes instead of filling
    the memory. A named pipe or a socket is refused before anything is read
    (reading one waits for a writer that may never come); the file is opened
    without blocking for that reason.

    Parameters
    ----------
    path : str or os.PathLike
        The file.
    max_bytes : int
        Size limit [byte].
    what, typical : str
        What the file is, and how large one usually is (for the messages).

    Raises
    ------
    ProjectFileError
        Missing, a directory, a pipe or socket, unreadable, or larger than *max_bytes* (exit 65).
    """
    import stat

    name = os.fspath(path)
    if name == "":
        raise ProjectFileError(f"'' is not a file name; give the {what}", file=name)
    try:
        fd = os.open(name, os.O_RDONLY | getattr(os, "O_NONBLOCK", 0) | getattr(os, "O_CLOEXEC", 0))
    except FileNotFoundError:
        raise ProjectFileError("no such file", file=name) from None
    except IsADirectoryError:
        raise ProjectFileError(f"is a directory, not a {what}", file=name) from None
    except OSError as exc:
        raise ProjectFileError(f"cannot read: {exc.strerror or exc}", file=name) from None
    try:
        mode = os.fstat(fd).st_mode
        if stat.S_ISDIR(mode):
            raise ProjectFileError(f"is a directory, not a {what}", file=name)
        if stat.S_ISFIFO(mode) or stat.S_ISSOCK(mode):
            kind = "a named pipe" if stat.S_ISFIFO(mode) else "a socket"
            raise ProjectFileError(f"is {kind}, not a {what}; give a regular file", file=name)
        if hasattr(os, "set_blocking"):
            os.set_blocking(fd, True)
        with os.fdopen(fd, "rb", closefd=True) as handle:
            fd = -1
            raw = handle.read(max_bytes + 1)
    except OSError as exc:
        raise ProjectFileError(f"cannot read: {exc.strerror or exc}", file=name) from None
    finally:
        if fd >= 0:
            os.close(fd)
    if len(raw) > max_bytes:
        raise ProjectFileError(f"file is larger than the limit of {max_bytes} bytes; {typical}", file=name)
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
