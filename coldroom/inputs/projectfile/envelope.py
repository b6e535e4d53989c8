"""The room's box: constructions and their layers, the six surfaces and what lies beyond each, dimensions, doors and infiltration."""

from __future__ import annotations

from typing import Literal, Optional, Union

from pydantic import Field, model_validator

from coldroom.constants import SECONDS_PER_DAY_S
from coldroom.inputs.projectfile.quantities import (
    Fraction,
    Length,
    Name,
    OutdoorTemperature,
    Q,
    RelativeHumidity,
    Strict,
    Temperature,
    Thickness,
)


SIDES = ("north", "east", "south", "west", "ceiling", "floor")
WALLS = ("north", "east", "south", "west")


class Layer(Strict):
    """One layer of a construction: a material from the table, or an explicit conductivity."""

    material: Optional[str] = None
    conductivity: Optional[Q("conductivity", gt=0.0, le=400.0)] = None  # type: ignore[valid-type]
    thickness: Thickness

    @model_validator(mode="after")
    def _one_of(self) -> "Layer":
        if (self.material is None) == (self.conductivity is None):
            raise ValueError("give a layer either a material name or a conductivity (exactly one)")
        if self.material is not None:
            from coldroom.data import materials

            materials.material(self.material)  # raises LookupNameError listing close names
        return self


class Construction(Strict):
    """Wall, ceiling or floor build-up: insulation layers, or a known U-value."""

    layers: Optional[list[Layer]] = Field(default=None, min_length=1, max_length=20)
    u_value: Optional[Q("u_value", gt=0.0, le=10.0)] = None  # type: ignore[valid-type]
    thickness: Optional[Thickness] = Field(
        default=None,
        description="Overall thickness of a construction given by its u_value (for outside areas); "
        "layers give their own sum.",
    )
    description: Name = ""

    @model_validator(mode="after")
    def _one_of(self) -> "Construction":
        if (self.layers is None) == (self.u_value is None):
            raise ValueError("give a construction either layers or a u_value (exactly one)")
        if self.layers is not None and self.thickness is not None:
            raise ValueError("thickness goes with a u_value; a layered construction is as thick as its layers")
        return self

    @property
    def overall_thickness(self) -> float:
        """Thickness of the construction [m]: the sum of its layers, or the given ``thickness`` (else 0)."""
        if self.layers is not None:
            return sum(layer.thickness for layer in self.layers)
        return self.thickness or 0.0


class Surface(Strict):
    """One side of the room and what lies beyond it.

    ``facing``: ``outdoors`` (sun allowance from ``colour`` and orientation),
    ``space`` or ``roof_void`` (another space at ``temperature``), ``room``
    (another room of the project, named by ``room``: its design temperature),
    ``ground`` (the design ground temperature) or ``heated_slab`` (a freezer
    floor over a heated plane held at ``temperature``; the heater's own power
    is not added).

    Heat leaving the room through a surface to a colder space or room is not
    credited unless ``credit: true`` (the neighbour can be off, defrosting or
    emptied; see :func:`coldroom.loads.transmission.credited_heat_gain`).
    """

    construction: Union[str, Construction]
    facing: Literal["outdoors", "space", "roof_void", "room", "ground", "heated_slab"]
    temperature: Optional[Temperature] = None
    room: Optional[str] = Field(default=None, min_length=1, max_length=100)
    credit: bool = Field(
        default=False, description="Count heat lost to a colder neighbour as a credit (default: not credited)."
    )
    colour: Optional[Literal["light", "medium", "dark"]] = None
    area: Optional[Q("area", gt=0.0, le=10000.0)] = None  # type: ignore[valid-type]

    @model_validator(mode="after")
    def _facing_needs(self) -> "Surface":
        if self.facing in ("space", "roof_void", "heated_slab") and self.temperature is None:
            raise ValueError(f"a surface facing {self.facing} needs the temperature on the other side")
        if self.facing == "outdoors" and self.temperature is not None:
            raise ValueError("a surface facing outdoors takes the design outdoor temperature; remove temperature")
        if self.facing == "room":
            if self.room is None:
                raise ValueError("a surface facing room needs `room:` naming the other room of the project")
            if self.temperature is not None:
                raise ValueError(
                    "a surface facing room takes that room's design temperature; remove temperature"
                )
        elif self.room is not None:
            raise ValueError("`room:` applies only to a surface with facing: room")
        if self.credit and self.facing not in ("space", "roof_void", "room"):
            raise ValueError("credit applies only to surfaces facing space, roof_void or room")
        if self.facing != "outdoors" and self.colour is not None:
            raise ValueError("colour (for the sun allowance) applies only to surfaces facing outdoors")
        return self


class Envelope(Strict):
    """The six sides of the room. ``walls`` sets all four walls; a named side overrides it."""

    walls: Optional[Surface] = None
    north: Optional[Surface] = None
    east: Optional[Surface] = None
    south: Optional[Surface] = None
    west: Optional[Surface] = None
    ceiling: Surface
    floor: Surface

    @model_validator(mode="after")
    def _complete(self) -> "Envelope":
        missing = [w for w in WALLS if getattr(self, w) is None and self.walls is None]
        if missing:
            raise ValueError(f"walls {', '.join(missing)} have no surface; give `walls` or each side")
        if self.floor.facing == "outdoors" and self.floor.colour is not None:
            raise ValueError("a floor gets no sun allowance; remove colour")
        return self

    def side(self, name: str) -> Surface:
        """The surface of side *name* (``north`` … ``floor``)."""
        own = getattr(self, name)
        return own if own is not None else self.walls  # type: ignore[return-value]


class Dimensions(Strict):
    """Room dimensions. North and south walls are length × height; east and west are width × height.

    ``measured: inside`` (default) gives the clear inside dimensions; ``measured: outside`` gives
    the outside dimensions of the insulated box: length and width over the walls, height from
    the top of the floor to the top of the ceiling.
    """

    length: Length
    width: Length
    height: Q("length", ge=1.5, le=30.0)  # type: ignore[valid-type]
    measured: Literal["inside", "outside"] = Field(
        default="inside", description="Whether length, width and height are inside or outside dimensions."
    )


# --- doors and infiltration -------------------------------------------------------------


class Door(Strict):
    """A door and its traffic (Gosney & Olama door method)."""

    name: Name = Field(default="door", max_length=100)
    wall: Optional[Literal["north", "east", "south", "west"]] = None
    width: Q("length", ge=0.3, le=10.0)  # type: ignore[valid-type]
    height: Q("length", ge=0.5, le=10.0)  # type: ignore[valid-type]
    passages_per_day: float = Field(default=0.0, ge=0.0, le=20000.0)
    passage_time: Q("time", si="s", ip="s", ge=0.0, le=600.0) = 15.0  # type: ignore[valid-type]
    open_time: Q("time", si="min", ip="min", ge=0.0, le=SECONDS_PER_DAY_S) = 0.0  # type: ignore[valid-type]
    protection: Literal["none", "strip_curtain", "air_curtain", "vestibule"] = "none"
    effectiveness: Optional[Fraction] = None
    other_side_temperature: Optional[OutdoorTemperature] = Field(
        default=None, description="Air temperature beyond the door (a corridor, an anteroom); default outdoors."
    )
    other_side_rh: Optional[RelativeHumidity] = Field(
        default=None, description="Relative humidity beyond the door; default the outdoor design RH."
    )
    to_room: Optional[str] = Field(
        default=None,
        min_length=1,
        max_length=100,
        description="The door opens into this room of the project: its design temperature and RH lie beyond.",
    )

    @model_validator(mode="after")
    def _other_side(self) -> "Door":
        if self.to_room is not None and (self.other_side_temperature is not None or self.other_side_rh is not None):
            given = [k for k in ("other_side_temperature", "other_side_rh") if getattr(self, k) is not None]
            raise ValueError(
                f"a door to_room takes that room's design temperature and RH; remove {' and '.join(given)}"
            )
        return self


class Infiltration(Strict):
    """How infiltration is counted: ``door`` (per door) or ``air_changes`` (by room volume)."""

    method: Literal["door", "air_changes"] = "door"
    usage: Literal["normal", "heavy", "long_storage"] = "normal"
    air_changes_per_day: Optional[float] = Field(default=None, gt=0.0, le=500.0)
