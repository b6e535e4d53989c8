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

The loader is in three parts: :mod:`.loader` (the public functions and the
marks), :mod:`.composer` (the node graph under the limits) and :mod:`.scalars`
(the plain-scalar rules).

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

from coldroom.inputs.safeyaml.loader import (
    MAX_ALIASES,
    MAX_BYTES,
    MAX_DEPTH,
    MAX_NODES,
    KeyPath,
    LoadedYaml,
    Mark,
    dotted,
    load_yaml,
    read_source,
)

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
