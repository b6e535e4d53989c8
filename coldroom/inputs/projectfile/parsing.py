"""Validate loaded YAML data into a :class:`ProjectModel`, with the first error located at its key; the JSON Schema."""

from __future__ import annotations

import os
from typing import Any

from pydantic import ValidationError

from coldroom.errors import ColdroomError, ProjectFileError
from coldroom.inputs.projectfile.model import ProjectModel
from coldroom.inputs.projectfile.quantities import _SYSTEM


def _system_of(data: Any) -> str:
    if isinstance(data, dict):
        project = data.get("project")
        if isinstance(project, dict) and project.get("units") in ("SI", "IP"):
            return str(project["units"])
    return "SI"


def _message(error: dict[str, Any]) -> str:
    kind = error.get("type", "")
    msg = str(error.get("msg", "invalid value"))
    if msg.startswith("Value error, "):
        msg = msg[len("Value error, ") :]
    if kind == "extra_forbidden":
        return "unknown key (check the spelling; `coldroom schema` lists the valid keys)"
    if kind == "missing":
        return "required key is missing"
    if kind == "literal_error":
        return f"{error.get('input')!r} is not one of the valid choices: {msg.split('Input should be ', 1)[-1]}"
    if kind in ("model_type", "dict_type", "model_attributes_type"):
        return f"expected a mapping (key: value pairs), got {_kind_of(error.get('input'))}"
    if kind == "list_type":
        return f"expected a list (lines starting with '- '), got {_kind_of(error.get('input'))}"
    if kind == "string_type":
        return f"expected text, got {_kind_of(error.get('input'))} {error.get('input')!r} (quote it)"
    if kind == "too_short":
        return f"needs at least {(error.get('ctx') or {}).get('min_length', 1)} item(s); found none"
    if kind in ("float_parsing", "float_type", "int_parsing"):
        return f"{error.get('input')!r} is not a number"
    if kind in ("greater_than_equal", "less_than_equal", "greater_than", "less_than"):
        ctx = error.get("ctx", {})
        return f"{error.get('input')!r} is outside the valid range ({msg.replace('Input should be ', '')}; {ctx})"
    return msg


def _kind_of(value: Any) -> str:
    if isinstance(value, dict):
        return "a mapping"
    if isinstance(value, (list, tuple)):
        return "a list"
    if value is None:
        return "nothing (null)"
    if isinstance(value, bool):
        return "true/false"
    if isinstance(value, (int, float)):
        return "a number"
    return "text"


def parse_project_data(data: Any, filename: str = "<input>", loaded: Any = None) -> ProjectModel:
    """Validate already-loaded YAML data into a :class:`ProjectModel`.

    Raises
    ------
    ProjectFileError
        On the first invalid key, with its position when *loaded* carries marks.
    """
    system = _system_of(data)
    token = _SYSTEM.set(system)
    try:
        model = ProjectModel.model_validate(data, context={"system": system})
    except ValidationError as exc:
        errors = exc.errors(include_url=False)
        first = errors[0]
        loc = _refined_location(first)
        message = _message(first)
        if len(errors) > 1:
            message += f" (and {len(errors) - 1} more error{'s' if len(errors) > 2 else ''})"
        raise error_at(loaded, filename, message, loc) from None
    except ColdroomError as exc:  # pragma: no cover - pydantic wraps ValueErrors; kept as a guard
        raise error_at(loaded, filename, str(exc), ()) from None
    finally:
        _SYSTEM.reset(token)
    model._folder = os.path.dirname(os.path.abspath(filename)) if filename != "<input>" else os.getcwd()
    return model


def _refined_location(error: dict[str, Any]) -> tuple:
    """The error's location, narrowed to the offending key where the model says only the object.

    A model validator that rejects a name (unknown product, material or
    refrigerant) is reported by pydantic at the object; point at the key whose
    text the message quotes instead, so the position is that key's line.
    """
    loc = tuple(part for part in error.get("loc", ()) if part != "[key]")  # a bad mapping key: at the key
    value = error.get("input")
    cause = (error.get("ctx") or {}).get("error")
    if isinstance(cause, ColdroomError) and isinstance(value, dict):
        text = str(cause)
        for key, item in value.items():
            if isinstance(key, str) and isinstance(item, str) and repr(item) in text:
                return loc + (key,)
    return loc


def error_at(loaded: Any, filename: str, message: str, path: tuple) -> ProjectFileError:
    """The :class:`ProjectFileError` for *message* at the key *path*, with its file position when known."""
    if loaded is not None:
        return loaded.error(message, path)
    from coldroom.inputs.safeyaml import dotted

    return ProjectFileError(message, file=filename, key=dotted(path) or None)


def json_schema() -> dict[str, Any]:
    """JSON Schema of the project file, for editors that complete and check YAML."""
    schema = ProjectModel.model_json_schema()
    schema["$schema"] = "https://json-schema.org/draft/2020-12/schema"
    schema["title"] = "coldroom project file"
    return schema
