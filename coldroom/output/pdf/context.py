"""What every section of the sheet reads (:class:`SheetContext`) and the look-ups sections share.

A section is ``section(ctx)`` or ``section(ctx, index)``; it finds the room's
cycle, conditions and system through the helpers here (a room's cycle data is
made once per render and kept in ``ctx.cache``).
"""

from __future__ import annotations

from dataclasses import dataclass, field
from typing import Any, Optional

from coldroom.output.pdf.text import clean, temperature
from coldroom.units import format_electrical


@dataclass
class SheetContext:
    """What every section reads.

    Attributes
    ----------
    result : ProjectResult
    model : ProjectModel or None
        The project (for echoing inputs: room temperature and RH).
    system : str
        ``"SI"`` or ``"IP"``.
    width : float
        Usable frame width [pt].
    cache : dict
        Per-render scratch space (diagram data).
    """

    result: Any
    model: Any
    system: str
    width: float
    cache: dict = field(default_factory=dict)
    selection: Any = None  # tuple of coldroom.design.selection.SystemSelection (``coldroom select --out``)

    def room_input(self, index: int) -> Any:
        if self.model is None:
            return None
        return self.model.rooms[index]


def room_cycle(ctx: SheetContext, index: int) -> Optional[dict]:
    room = ctx.result.rooms[index]
    if room.cycle is None:
        return None
    key = ("cycle", index)
    if key not in ctx.cache:
        ctx.cache[key] = room.cycle.to_json()
    return ctx.cache[key]


def room_conditions(ctx: SheetContext, index: int) -> str:
    room = ctx.room_input(index)
    if room is None:
        return ""
    return f"{temperature(room.temperature, ctx.system)}, {room.rh:.0%} RH"


def room_system(ctx: SheetContext, index: int) -> Any:
    """The system result serving room *index* (None for results without systems)."""
    name = ctx.result.rooms[index].system
    return next((system for system in getattr(ctx.result, "systems", ()) if system.name == name), None)


def electrical_label(watts: float) -> str:
    """Electrical power: W below 1 kW, else kW, in both unit systems (electricians work in kW)."""
    return clean(format_electrical(watts))
