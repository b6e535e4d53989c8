"""The JSON contract: one envelope around every command's ``--json`` body.

Every document is ``{schema_version, command, versions, project, ...body}``:

- ``schema_version``: :data:`SCHEMA_VERSION`, a string; raised when a key is renamed or
  removed, or changes its meaning or unit (a new key does not raise it);
- ``command``: ``load``, ``size``, ``check``, ``select``, ``compare``, ``cycle`` or ``quote``;
- ``versions``: ``{coldroom, coolprop, python}``;
- ``project``: :func:`project_block` (``null`` for ``cycle``, which reads no project file);
- then the command's own keys (its body), built here for ``load``, ``check`` and ``select``
  and ``quote`` and by the result objects' ``to_json`` for ``size``, ``compare`` and ``cycle``.

The keys follow one naming rule (DEVELOPERS.md "JSON output"); the typed definitions and the
JSON Schema of each document are :mod:`coldroom.output.json_schema`.
"""

from __future__ import annotations

import hashlib
from typing import Any, Mapping, Optional, Sequence

#: The contract's version (a string). Raise it when a key is renamed or removed or changes meaning.
SCHEMA_VERSION = "1"

#: The commands that write the contract, in the order the README lists them.
COMMANDS: tuple[str, ...] = ("load", "size", "check", "select", "compare", "cycle", "quote")


def project_block(model: Any, file: str, content: bytes) -> dict[str, Any]:
    """The ``project`` object: who and where, the unit system, and the file as read.

    Parameters
    ----------
    model : coldroom.inputs.projectfile.ProjectModel
        The opened project.
    file : str
        The project file's path as given on the command line.
    content : bytes
        The file's bytes as read (``sha256`` is their digest).
    """
    from coldroom.design.sizing import sheet_date

    info = model.project
    return {
        "name": info.name,
        "client": info.client,
        "site": info.site,
        "prepared_by": info.prepared_by,
        "date": sheet_date(info.date),  # the date printed on the sheet
        "units": info.units,
        "file": file,
        "sha256": hashlib.sha256(content).hexdigest(),
    }


def document(command: str, body: Mapping[str, Any], project: Optional[Mapping[str, Any]]) -> dict[str, Any]:
    """The envelope and *body* of one command's JSON: the only place a document is put together.

    Examples
    --------
    >>> d = document("cycle", {"refrigerant": "R-134a"}, None)
    >>> list(d)
    ['schema_version', 'command', 'versions', 'project', 'refrigerant']
    >>> d["schema_version"], d["command"], sorted(d["versions"])
    ('1', 'cycle', ['coldroom', 'coolprop', 'python'])
    """
    from coldroom.design.sizing import versions

    if command not in COMMANDS:
        raise ValueError(f"unknown command {command!r}")
    head = {"schema_version": SCHEMA_VERSION, "command": command, "versions": versions(), "project": project}
    clash = head.keys() & body.keys()
    if clash:  # a body never redefines the envelope
        raise ValueError(f"{command} body repeats envelope keys {sorted(clash)}")
    return {**head, **body}


# --- the bodies built from several result objects --------------------------------------------


def load_body(rooms: Sequence[Any], warnings: Sequence[str]) -> dict[str, Any]:
    """``load``: each room's 24-hour loads (:meth:`coldroom.results.RoomLoads.to_json`) and the warnings."""
    return {
        "rooms": [room.to_json() for room in rooms],
        "warnings": [str(message) for message in warnings],  # SI wording, like every JSON figure
    }


def check_body(checks: Sequence[tuple[Any, Any]], limits: Sequence[Any], job: Any = None) -> dict[str, Any]:
    """``check``: per room its required capacity and its existing unit's check with what it can still do; with
    *job* (:func:`coldroom.design.job.existing_result`) also ``systems``, the same keys as ``size`` writes, a
    one-room system with an existing unit at ``equipment_basis: "existing"``."""
    body = {
        "rooms": [
            {
                "name": loads.name,
                "required_capacity_w": loads.required_capacity,
                "existing_unit": None if check is None else {**check.to_json(), **limit.to_json()},
            }
            for (loads, check), limit in zip(checks, limits)
        ],
    }
    if job is not None:
        body["systems"] = job.to_json()["systems"]
    return body


def select_body(selections: Sequence[Any], catalogue: str, currency: str, job: Any = None) -> dict[str, Any]:
    """``select``: the equipment chosen per system and the price of it all (in *currency*); with *job*
    (the sized :class:`coldroom.results.ProjectResult` as equipped by :func:`coldroom.design.job.selected_result`)
    also its ``rooms`` and ``systems``, the same keys as ``size`` writes (``equipment_basis: "selected"``)."""
    body = {
        "catalogue": catalogue,
        "currency": currency,
        "selection": [s.to_json() for s in selections],
        "total_price": sum(s.total_price for s in selections),
    }
    if job is not None:
        sized = job.to_json()
        body["rooms"], body["systems"] = sized["rooms"], sized["systems"]
    return body


def quote_body(quote: Any, catalogue: str) -> dict[str, Any]:
    """``quote``: the priced bill of quantities, valves and electrical schedule (:class:`coldroom.design.quote.Quote`)."""
    return {"catalogue": catalogue, "quote": quote.to_json()}
