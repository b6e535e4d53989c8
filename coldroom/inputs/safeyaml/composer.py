"""The guarded composer of the safe loader: parser events to a node graph with the limits checked.

Nesting depth and alias count are checked while the graph is composed, the
node count with every alias expanded (without expanding) before any Python
object is built; PyYAML's constructors are never used.
"""

from __future__ import annotations

import copy
from typing import TYPE_CHECKING, Any

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

from coldroom.inputs.safeyaml.scalars import _MAP, _SEQ

if TYPE_CHECKING:
    from coldroom.inputs.safeyaml.loader import KeyPath, Mark


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
