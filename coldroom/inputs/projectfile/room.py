"""One walk-in room: its fields and its derived geometry (inside and outside box, surface and transmission areas, volume)."""

from __future__ import annotations

from typing import Optional

from pydantic import Field, PrivateAttr, model_validator

from coldroom.constants import SECONDS_PER_DAY_S
from coldroom.rules import DEFAULT_SAFETY_FACTOR
from coldroom.inputs.projectfile.contents import Appliance, Defrost, Fans, Lighting, People, Product
from coldroom.inputs.projectfile.envelope import SIDES, Dimensions, Door, Envelope, Infiltration
from coldroom.inputs.projectfile.quantities import Name, Q, RelativeHumidity, RoomTemperature, Strict
from coldroom.inputs.projectfile.refrigeration import ExistingUnit, Refrigeration
from coldroom.inputs.projectfile.schedule import Pulldown, Schedule


class Room(Strict):
    """One walk-in room."""

    name: Name = Field(min_length=1, max_length=100)
    temperature: RoomTemperature
    rh: RelativeHumidity = 0.85
    dimensions: Optional[Dimensions] = None
    volume: Optional[Q("volume", gt=0.0, le=1e5)] = None  # type: ignore[valid-type]
    envelope: Envelope
    doors: list[Door] = Field(default_factory=list, max_length=20)
    infiltration: Infiltration = Infiltration()
    products: list[Product] = Field(default_factory=list, max_length=50)
    people: People = People()
    lighting: Optional[Lighting] = None
    fans: Optional[Fans] = None
    appliances: list[Appliance] = Field(default_factory=list, max_length=50)
    defrost: Defrost = Defrost()
    safety_factor: Q("fraction", ge=0.0, le=1.0) = DEFAULT_SAFETY_FACTOR  # type: ignore[valid-type]
    run_hours: Optional[Q("time", si="h", ip="h", ge=3600.0, le=SECONDS_PER_DAY_S)] = None  # type: ignore[valid-type]
    refrigeration: Refrigeration = Refrigeration()
    existing_unit: Optional[ExistingUnit] = Field(
        default=None, description="An installed unit to check (see coldroom.equipment)."
    )
    schedule: Optional[Schedule] = Field(
        default=None, description="The design day hour by hour (see coldroom.loads.hourly)."
    )
    pulldown: Pulldown = Pulldown()
    #: Construction thickness of each side [m], filled in by the project (which knows the named
    #: constructions); 0 for a room validated on its own.
    _thickness: dict[str, float] = PrivateAttr(default_factory=dict)

    @model_validator(mode="after")
    def _geometry(self) -> "Room":
        if self.dimensions is None:
            sides_without_area = [s for s in SIDES if self.envelope.side(s).area is None]
            if sides_without_area:
                raise ValueError(
                    f"give dimensions, or an area for every surface (missing: {', '.join(sides_without_area)})"
                )
            if self.volume is None:
                raise ValueError("without dimensions the room needs a volume")
        return self

    # derived geometry (SI)
    def box_dimensions(self, where: str) -> Optional[tuple[float, float, float]]:
        """(length, width, height) [m] of the ``inside`` or ``outside`` of the insulated box.

        Outside = inside + the construction thickness on each side: the length over the east
        and west walls, the width over the north and south walls, the height from the top of
        the floor over the ceiling. The floor build-up is not added to the wall height: below
        the floor's top surface the walls stand against the floor's own section, which counts
        its heat gain over the outside length × width [trade]. ``None`` without dimensions.
        """
        d = self.dimensions
        if d is None:
            return None
        t = self._thickness.get  # each side's construction thickness, 0 when not known (read once:
        # a private attribute costs a pydantic look-up, and this runs for every side at every hour)
        extra = (t("east", 0.0) + t("west", 0.0), t("north", 0.0) + t("south", 0.0), t("ceiling", 0.0))
        sign = {("inside", "inside"): 0.0, ("outside", "outside"): 0.0,
                ("inside", "outside"): 1.0, ("outside", "inside"): -1.0}[(d.measured, where)]
        return (d.length + sign * extra[0], d.width + sign * extra[1], d.height + sign * extra[2])

    @staticmethod
    def _face(box: tuple[float, float, float], side: str) -> float:
        length, width, height = box
        if side in ("north", "south"):
            return length * height
        if side in ("east", "west"):
            return width * height
        return length * width

    def surface_area(self, side: str) -> float:
        """Inside area of *side* [m²]: explicit, or from the inside dimensions."""
        surface = self.envelope.side(side)
        if surface.area is not None:
            return surface.area
        box = self.box_dimensions("inside")
        assert box is not None
        return max(self._face(box, side), 0.0)

    def transmission_area(self, side: str) -> tuple[float, str]:
        """Area of *side* for U·A·ΔT [m²] and its basis, ``"given"`` or ``"outside"``.

        The load method takes the outside surface area of each section (ASHRAE
        Handbook—Refrigeration, "Refrigerated-Facility Loads", transmission load [mem])
        [ref:ashrae-refrig-loads]: the faces of the insulated box over its outside
        dimensions, so edges and corners are counted once on the outside. An explicit
        ``area`` is taken as given.
        """
        surface = self.envelope.side(side)
        if surface.area is not None:
            return surface.area, "given"
        box = self.box_dimensions("outside")
        assert box is not None
        return self._face(box, side), "outside"

    @property
    def floor_area(self) -> float:
        """Floor area [m²]."""
        return self.surface_area("floor")

    @property
    def inside_volume(self) -> float:
        """Inside volume [m³]: given, or from the inside dimensions (0 if the walls leave no room)."""
        if self.volume is not None:
            return self.volume
        box = self.box_dimensions("inside")
        assert box is not None
        length, width, height = box
        return length * width * height if min(box) > 0.0 else 0.0
