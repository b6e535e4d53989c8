"""The whole project file (:class:`ProjectModel`) with its economics and options, and how rooms group into systems."""

from __future__ import annotations

from typing import Annotated, Any, Optional, Union

from pydantic import Field, PrivateAttr, field_validator, model_validator

from coldroom.inputs.projectfile.envelope import SIDES, Construction
from coldroom.inputs.projectfile.quantities import Q, Strict
from coldroom.inputs.projectfile.quote import QuoteSettings
from coldroom.inputs.projectfile.refrigeration import ROOM_LEVEL_KEYS, CondensingSettings, Refrigeration, System
from coldroom.inputs.projectfile.room import Room
from coldroom.inputs.projectfile.site import DesignConditions, ProjectInfo


class Economics(Strict):
    """Running cost and TEWI inputs (``coldroom compare``); defaults in :mod:`coldroom.design.tewi`, marked as such."""

    electricity_price: Optional[float] = Field(
        default=None, ge=0.0, le=100.0, description="Electricity price in currency units per kWh (bare number)."
    )
    currency: Optional[str] = Field(default=None, pattern=r"^[A-Za-z$€£¥]{1,8}$", description="e.g. EUR")
    emission_factor: Optional[float] = Field(
        default=None, ge=0.0, le=3.0, description="Grid emission factor in kg CO2e per kWh (bare number)."
    )
    service_life: Optional[float] = Field(default=None, gt=0.0, le=60.0, description="Years in service.")
    leakage_rate: Optional[Q("fraction", si="%", ip="%", ge=0.0, le=1.0)] = Field(  # type: ignore[valid-type]
        default=None, description="Percent of the charge lost per year."
    )
    recovery_factor: Optional[Q("fraction", si="%", ip="%", ge=0.0, le=1.0)] = Field(  # type: ignore[valid-type]
        default=None, description="Percent of the charge recovered at the end of life."
    )


class Option(Strict):
    """One alternative to the project as written: dotted paths to new values (see :mod:`coldroom.inputs.options`)."""

    name: str = Field(min_length=1, max_length=60)
    note: str = Field(default="", max_length=500)
    changes: dict[Annotated[str, Field(min_length=1, max_length=300)], Any] = Field(min_length=1, max_length=50)

    @field_validator("name")
    @classmethod
    def _not_base(cls, value: str) -> str:
        if value.strip().lower() == "base":
            raise ValueError("'base' names the project as written; choose another option name")
        return value


class ProjectModel(Strict):
    """The whole project file."""

    project: ProjectInfo
    design: DesignConditions
    constructions: dict[str, Construction] = Field(default_factory=dict, max_length=50)
    rooms: list[Room] = Field(min_length=1, max_length=50)
    systems: list[System] = Field(
        default_factory=list,
        max_length=50,
        description="Rooms sharing a compressor; a room in none forms a system of its own named after the room.",
    )
    economics: Economics = Economics()
    quote: Optional[QuoteSettings] = None
    options: list[Option] = Field(default_factory=list, max_length=20)
    #: The validated projects of ``options`` (name, note, model), filled by :func:`parse_project_data`.
    _option_models: list[tuple[str, str, "ProjectModel"]] = PrivateAttr(default_factory=list)
    #: Folder of the project file (relative weather paths are resolved against it).
    _folder: str = PrivateAttr(default="")

    @model_validator(mode="after")
    def _unique_options(self) -> "ProjectModel":
        import unicodedata

        seen: set[str] = set()
        for option in self.options:
            key = unicodedata.normalize("NFC", option.name)  # "Café" composed and decomposed are one name
            if key in seen:
                raise ValueError(f"two options are called {option.name!r}")
            seen.add(key)
        return self

    @model_validator(mode="after")
    def _section_thickness(self) -> "ProjectModel":
        # Each room learns how thick its sides are (for outside dimensions and areas); an
        # unknown construction name counts 0 here and is refused by coldroom.inputs.physical_checks.
        for room in self.rooms:
            thickness = {}
            for side in SIDES:
                ref = room.envelope.side(side).construction
                construction = ref if isinstance(ref, Construction) else self.constructions.get(ref)
                thickness[side] = construction.overall_thickness if construction is not None else 0.0
            room._thickness = thickness
        return self

    def construction(self, ref: Union[str, Construction]) -> Construction:
        """Resolve a surface's construction (a name from ``constructions`` or inline)."""
        if isinstance(ref, Construction):
            return ref
        return self.constructions[ref]

    def room_named(self, name: str) -> Room:
        """The room called *name* (exact; the checks have rejected unknown names).

        Raises
        ------
        LookupNameError
            No room has that name (the message lists the closest names).
        """
        for room in self.rooms:
            if room.name == name:
                return room
        from coldroom.errors import unknown_name

        raise unknown_name("room", name, [room.name for room in self.rooms])

    def system_of(self, room: Room) -> Optional[System]:
        """The ``systems`` entry listing *room*, or ``None`` when the room forms a system of its own."""
        for system in self.systems:
            if room.name in system.rooms:
                return system
        return None

    def system_groups(self) -> list[tuple[str, Optional[System], tuple[int, ...]]]:
        """Every system of the project as ``(name, entry or None, member room indices)``.

        Ordered by the first member's place in ``rooms``; a room in no
        ``systems`` entry forms a system of its own named after the room.
        """
        out: list[tuple[str, Optional[System], tuple[int, ...]]] = []
        seen: set[str] = set()
        index = {room.name: i for i, room in reversed(list(enumerate(self.rooms)))}
        for i, room in enumerate(self.rooms):
            system = self.system_of(room)
            if system is None:
                out.append((room.name, None, (i,)))
            elif system.name not in seen:
                seen.add(system.name)
                out.append((system.name, system, tuple(index[name] for name in system.rooms if name in index)))
        return out

    def refrigeration_for(self, room: Room) -> Refrigeration:
        """The refrigeration settings that apply to *room*: its system's, with its own room-level keys.

        For a room in no ``systems`` entry this is the room's own block.
        """
        system = self.system_of(room)
        if system is None:
            return room.refrigeration
        shared = {name: getattr(system, name) for name in CondensingSettings.model_fields}
        own = {name: getattr(room.refrigeration, name) for name in ROOM_LEVEL_KEYS}
        return Refrigeration.model_construct(**shared, **own)
