"""The design day hour by hour (door, people and lighting windows, deliveries, defrosts) and the pull-down options."""

from __future__ import annotations

from typing import Annotated, Any, Optional

from pydantic import BeforeValidator, Field, model_validator
from pydantic_core import PydanticCustomError

from coldroom.constants import SECONDS_PER_DAY_S
from coldroom.inputs.projectfile.quantities import Fraction, Q, Strict


def _hour_of_day(value: Any) -> Any:
    """A time of day as hours after midnight: a number 0–24 or text ``"HH:MM"``."""
    if isinstance(value, str) and ":" in value:
        hours, _, minutes = value.strip().partition(":")
        try:
            h, m = int(hours), int(minutes)
        except ValueError:
            raise PydanticCustomError(
                "coldroom_time", "{value} is not a time of day; write HH:MM or hours after midnight", {"value": repr(value)}
            ) from None
        if not (0 <= h <= 24 and 0 <= m < 60) or h * 60 + m > 24 * 60:
            raise PydanticCustomError("coldroom_time", "{value} is not a time of day (00:00 … 24:00)", {"value": repr(value)})
        return h + m / 60.0
    return value


HourOfDay = Annotated[float, BeforeValidator(_hour_of_day), Field(ge=0.0, le=24.0)]


class Window(Strict):
    """A stretch of the day from ``start`` to ``end`` (hours after midnight or ``"HH:MM"``).

    An ``end`` earlier than ``start`` runs past midnight (``{start: 22, end: 6}``).
    """

    start: HourOfDay
    end: HourOfDay

    @model_validator(mode="after")
    def _not_empty(self) -> "Window":
        if self.start % 24.0 == self.end % 24.0:
            raise ValueError("a window needs an end different from its start (for all day, leave the schedule out)")
        return self

    @property
    def hours(self) -> float:
        """Length of the window [h]."""
        return (self.end - self.start) % 24.0


class DoorWindow(Window):
    """Door traffic window and the share of the day's passages (and standing-open time) in it."""

    share: Fraction


class Delivery(Strict):
    """A product delivery: time of day and mass (the room's products share it in proportion to their intake)."""

    time: HourOfDay
    mass: Q("mass", gt=0.0, le=1e7)  # type: ignore[valid-type]


class Schedule(Strict):
    """The room's design day hour by hour (optional; see :mod:`coldroom.loads.hourly`).

    Each list is optional; what it leaves out keeps its default placing: door
    traffic spread evenly over the day, people, lighting and equipment from
    08:00 for their hours, the daily intake delivered at 08:00, defrosts
    evenly spaced from midnight [trade]. With a schedule the peak-hour design
    figure comes from the hour-by-hour profile.
    """

    doors: Optional[list[DoorWindow]] = Field(default=None, min_length=1, max_length=24)
    people: Optional[list[Window]] = Field(default=None, min_length=1, max_length=24)
    lighting: Optional[list[Window]] = Field(default=None, min_length=1, max_length=24)
    deliveries: Optional[list[Delivery]] = Field(default=None, min_length=1, max_length=48)
    defrost: Optional[list[HourOfDay]] = Field(
        default=None, min_length=1, max_length=24, description="Defrost start times (one per defrost a day)."
    )


class Pulldown(Strict):
    """Options of the pull-down simulation (see :mod:`coldroom.loads.pulldown`)."""

    panel_skin: bool = Field(
        default=False, description="Count the inner metal skin of the panels as thermal mass (0.5 mm steel [trade])."
    )
    hours: Optional[Q("time", si="h", ip="h", ge=3600.0, le=7 * SECONDS_PER_DAY_S)] = Field(  # type: ignore[valid-type]
        default=None, description="Time simulated; default twice the longest pull-down time asked, at least 24 h."
    )
