"""Options in the project file: the same project with a few values changed, each validated whole.

An option names dotted paths into the project as written and the value each
takes instead::

    options:
      - name: R-290
        note: propane condensing unit
        changes:
          systems.CU-1.refrigerant: R-290
          rooms.Cooler.refrigeration.evaporator_td: 5 K
          constructions.panel_100.layers.0.thickness: 150 mm

A path walks mappings by key and lists by the item's ``name`` (or by a
0-based index, for lists without names such as ``layers``). A missing last key
(or a missing mapping on the way) is created, so an option may add a setting
the base leaves at its default. The changed project is then validated exactly
like a project file; any error is reported at the option's change, as one line
``file:line:col: options[i].changes.<path>: option 'name': <where>: <message>``
(exit 65).

Examples
--------
>>> data = {"rooms": [{"name": "Cooler", "rh": 0.85}], "constructions": {"p": {"layers": [{"thickness": 0.1}]}}}
>>> new, where = apply_changes(data, {"rooms.Cooler.rh": 0.9, "constructions.p.layers.0.thickness": 0.15})
>>> new["rooms"][0]["rh"], new["constructions"]["p"]["layers"][0]["thickness"], data["rooms"][0]["rh"]
(0.9, 0.15, 0.85)
>>> where["rooms.Cooler.rh"]
('rooms', 0, 'rh')
"""

from __future__ import annotations

import copy
from typing import TYPE_CHECKING, Any, Mapping

from coldroom.errors import ProjectFileError

if TYPE_CHECKING:  # pragma: no cover
    from coldroom.inputs.projectfile import ProjectModel


class ChangeError(ValueError):
    """A path that does not lead anywhere in the project (``path`` names the change)."""

    path: str = ""


def _list_index(items: list, parts: list[str], at: int, walked: str) -> tuple[int, int]:
    """The index of the list item that parts[at:] start to name, and how many parts the name took."""
    names = [item.get("name") if isinstance(item, dict) else None for item in items]
    for end in range(len(parts), at, -1):  # longest first: names may hold dots
        candidate = ".".join(parts[at:end])
        if candidate in names:
            return names.index(candidate), end - at
    token = parts[at]
    if token.isascii() and token.isdigit():  # ASCII digits only: int("١") is 1, int("¹") raises
        index = int(token)
        if index < len(items):
            return index, 1
        raise ChangeError(f"{walked} has {len(items)} item(s); index {index} is past the end")
    known = ", ".join(repr(n) for n in names if n is not None) or "none (address items by index)"
    raise ChangeError(f"{walked} has no item named {token!r}; names: {known}")


def apply_changes(data: Mapping[str, Any], changes: Mapping[str, Any]) -> tuple[dict, dict[str, tuple]]:
    """A deep copy of *data* with each dotted path of *changes* set to its value.

    Parameters
    ----------
    data : mapping
        The project as loaded (plain dicts and lists).
    changes : mapping of str to any
        Dotted path → new value.

    Returns
    -------
    (dict, dict)
        The changed data, and for each path the key path (keys and list indices) it reached.

    Raises
    ------
    ChangeError
        A path through a value that is not a mapping or list, an unknown item name, an index past the end.
    """
    out = copy.deepcopy(dict(data))
    reached: dict[str, tuple] = {}
    for path, value in changes.items():
        try:
            reached[path] = _set(out, str(path), value)
        except ChangeError as exc:
            exc.path = str(path)
            raise
    return out, reached


def _set(out: dict, path: str, value: Any) -> tuple:
    parts = [p.strip() for p in str(path).split(".")]
    if any(not p for p in parts):
        raise ChangeError(f"{path!r} is not a dotted path (empty segment)")
    node: Any = out
    keys: list[Any] = []
    i = 0
    while True:
        walked = ".".join(parts[:i]) or "the project"
        last = False
        if isinstance(node, dict):
            key: Any = parts[i]
            step = 1
        elif isinstance(node, list):
            key, step = _list_index(node, parts, i, walked)
        else:
            raise ChangeError(f"{walked} is a single value, not a mapping or list; cannot go to {parts[i]!r}")
        last = i + step >= len(parts)
        keys.append(key)
        if last:
            node[key] = copy.deepcopy(value)
            break
        if isinstance(node, dict) and node.get(key) is None:
            node[key] = {}
        node = node[key]
        i += step
    return tuple(keys)


def _dotted(path: tuple) -> str:
    from coldroom.inputs.safeyaml import dotted

    return dotted(path)


def validate_options(model: "ProjectModel", data: Mapping[str, Any], filename: str, loaded: Any) -> None:
    """Validate every option of *model* as a whole project; keep the results on the model.

    Raises
    ------
    ProjectFileError
        At the option's change (or its ``changes`` key) with the option's name in the message.
    """
    from coldroom.inputs.physical_checks import check_physics
    from coldroom.inputs.projectfile import error_at, parse_project_data
    from coldroom.units import format_terms

    base = {k: v for k, v in data.items() if k != "options"}
    results = []
    for index, option in enumerate(model.options):
        here: tuple = ("options", index, "changes")

        def located(message: str, path: tuple = here) -> ProjectFileError:
            text = f"option {option.name!r}: {message}"
            if loaded is not None:
                return loaded.error(text, path)
            return ProjectFileError(text, file=filename, key=_dotted(path))

        try:
            changed, reached = apply_changes(base, option.changes)
        except ChangeError as exc:
            raise located(str(exc), here + ((exc.path,) if exc.path else ())) from None
        for key, path in reached.items():
            if path and path[0] == "options":
                raise located("an option cannot change the options", here + (key,))
        try:
            result = parse_project_data(changed, filename=filename, loaded=None)
            check_physics(  # each option is a whole project: the same checks as the base
                result, lambda message, path: error_at(None, filename, format_terms(message, result.project.units), path)
            )
        except ProjectFileError as exc:
            where = exc.key or ""
            path = here
            for key, keys in reached.items():
                full = _dotted(keys)
                if where == full or where.startswith(full + ".") or where.startswith(full + "["):
                    path = here + (key,)
                    break
            raise located(f"{where}: {exc.message}" if where else exc.message, path) from None
        for keys, label, base_value, value, why in (
            (("project", "units"), "project.units", model.project.units, result.project.units,
             "the base's bare numbers are written in its own units and would be read in the other system; "
             "give the option's values with their units instead"),
            (("economics", "currency"), "the currency", model.economics.currency, result.economics.currency,
             "money in two currencies cannot be compared or subtracted; give the option's prices in the "
             "base's currency"),
        ):
            if value != base_value:
                change = next((key for key, path in reached.items()
                               if tuple(path[: len(keys)]) == keys[: len(path)]), None)
                shown = lambda v: repr(v) if v is not None else "not given"  # noqa: E731
                raise located(f"an option cannot change {label} ({shown(base_value)} in the base, "
                              f"{shown(value)} here): {why}", here + ((change,) if change else ()))
        results.append((option.name, option.note, result))
    model._option_models = results
