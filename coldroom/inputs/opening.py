"""Opening a project: read → validate each field → check the physics (and each option), in one call every command uses.

:mod:`coldroom.inputs.projectfile` validates fields (pydantic) and knows nothing of
the physical checks; :mod:`coldroom.inputs.physical_checks` checks combinations of fields and
knows nothing of YAML. This module puts them in order and attaches the file
position of the offending key to a physical-check error, so every command
reports bad input the same way (``file:line:col: dotted.key: message``, exit 65).

Examples
--------
>>> from importlib.resources import files
>>> text = files("coldroom.data").joinpath("starter.yaml").read_text(encoding="utf-8")
>>> open_project_text(text, "starter.yaml").rooms[0].name
'Cooler'
"""

from __future__ import annotations

import os
from dataclasses import dataclass
from typing import TYPE_CHECKING

if TYPE_CHECKING:  # pragma: no cover
    from coldroom.inputs.projectfile import ProjectModel


@dataclass(frozen=True)
class OpenProject:
    """A project file read, validated and checked.

    Attributes
    ----------
    path : str
        The file name as given on the command line.
    content : bytes
        The file's bytes (their SHA-256 goes on every page of the sheet).
    model : ProjectModel
        The validated project, SI inside.
    """

    path: str
    content: bytes
    model: "ProjectModel"

    @property
    def inputs(self) -> tuple[str, ...]:
        """Every file a run on this project reads: the project file and the weather files of the base and
        of each option (no output may be written over any of them)."""
        from coldroom.inputs.weather import weather_path

        files = [self.path]
        for model in (self.model, *(option for _name, _note, option in self.model._option_models)):
            path = weather_path(model)
            if path is not None and str(path) not in files:
                files.append(str(path))
        return tuple(files)


def open_project_data(data: object, filename: str = "<input>", loaded: object = None) -> "ProjectModel":
    """Validate and check already-loaded YAML data (*loaded*, when given, supplies file positions).

    Raises
    ------
    ProjectFileError
        Invalid or physically impossible input.
    """
    from coldroom.inputs.physical_checks import check_physics
    from coldroom.inputs.projectfile import error_at, parse_project_data
    from coldroom.units import format_terms

    model = parse_project_data(data, filename=filename, loaded=loaded)
    check_physics(
        model, lambda message, path: error_at(loaded, filename, format_terms(message, model.project.units), path)
    )
    if model.options and isinstance(data, dict):
        from coldroom.inputs.options import validate_options

        validate_options(model, data, filename, loaded)
    return model


def open_project_text(text: str | bytes, filename: str = "<input>") -> "ProjectModel":
    """Validate and check a project given as YAML text.

    Raises
    ------
    ProjectFileError
        Malformed, invalid or physically impossible input, with the key's position.
    """
    from coldroom.inputs.safeyaml import load_yaml

    loaded = load_yaml(text, filename=filename)
    return open_project_data(loaded.data, filename=filename, loaded=loaded)


def open_project(path: str | os.PathLike[str]) -> OpenProject:
    """Read, validate and check the project file at *path*.

    Raises
    ------
    ProjectFileError
        Unreadable (missing, a directory, too large), malformed, invalid or physically
        impossible input (exit code 65).
    """
    from coldroom.inputs.safeyaml import read_source

    content = read_source(path)
    return OpenProject(path=str(path), content=content, model=open_project_text(content, filename=str(path)))
