"""The safety cautions of the sheet: the refrigerant's class and pressures, people shut in, frozen ground, electrical work.

The cautions defer to EN 378, ISO 5149, ASHRAE 15, IEC 60335-2-89 and the local
codes; the comparison page reuses :func:`refrigerant_cautions` and
:func:`people_cautions`.
"""

from __future__ import annotations

from reportlab.lib.styles import ParagraphStyle
from reportlab.platypus import KeepTogether

from coldroom.output.pdf.context import SheetContext, room_cycle, room_system
from coldroom.output.pdf.layout import SMALL, TINY, Paragraph, heading, note
from coldroom.output.pdf.text import esc


def safety_cautions(ctx: SheetContext, index: int) -> list[str]:
    """The safety cautions that fit this room and its refrigerant (text only)."""
    room = ctx.result.rooms[index]
    cyc = room_cycle(ctx, index) or {}
    system = room_system(ctx, index)
    refrigerant = cyc.get("refrigerant") or (system.refrigerant if system is not None else None)
    cautions: list[str] = refrigerant_cautions(refrigerant) if refrigerant else []
    cautions += people_cautions()
    room_in = ctx.room_input(index)
    cold = room_in is not None and room_in.temperature < 0.0
    if room_in is None and room.evaporating_temperature is not None:
        cold = room.evaporating_temperature < -10.0
    if cold:
        cautions.append(
            "Below 0 °C the ground under the room freezes unless the slab is heated or ventilated: frost heave "
            "lifts floors and walls. Check that slab heating is designed, installed and monitored."
        )
    cautions.append(
        "Electrical work (supplies, heaters, controls, earthing) must be done by qualified persons to the "
        "local electrical code."
    )
    return cautions


def people_cautions() -> list[str]:
    """The caution about people shut in a cold room."""
    return [
        "People can be shut in a cold room. Fit an inside door release that works without a key, "
        "lighting on an independent supply, and an alarm button inside that is heard where people are."
    ]


def refrigerant_cautions(refrigerant: str) -> list[str]:
    """The cautions that go with a refrigerant's safety class, pressures and GWP (text only)."""
    from coldroom.data import refrigerants

    cautions: list[str] = []
    try:
        info = refrigerants.lookup(refrigerant)
    except Exception:  # noqa: BLE001 - an unknown name only drops the refrigerant cautions
        info = None
    if info is not None:
        cls = info.safety_class
        if cls.endswith("2L") and cls.startswith("A"):
            cautions.append(
                f"{info.name} is class A2L (lower flammability). The charge allowed in an occupied space is "
                "limited by its lower flammability limit and the room volume (EN 378-1, ISO 5149-1, "
                "IEC 60335-2-89): check the system charge against them, keep ignition sources away from "
                "possible leak points, use A2L-rated components and leak detection where required."
            )
        if cls.endswith("3"):
            cautions.append(
                f"{info.name} is class A3 (highly flammable). Charge limits are strict (EN 378-1, ISO 5149-1; "
                "IEC 60335-2-89 for self-contained appliances): check the charge per circuit, keep all ignition "
                "sources out of the refrigerant's reach, ventilate, and use only equipment rated for A3."
            )
        if cls.startswith("B"):
            cautions.append(
                f"{info.name} is class {cls} (higher toxicity"
                + (", lower flammability" if cls.endswith("2L") else "")
                + "). A leak endangers people: gas detection, alarms, ventilation and machinery-room rules "
                "apply (EN 378, ISO 5149, ASHRAE 15)."
            )
        if info.name == "R-744":
            cautions.append(
                "R-744 (CO2) works at high pressure: standstill and operating pressures far above those of "
                "other refrigerants. Every component and relief valve must be rated for them; only trained "
                "persons may work on the system."
            )
        if info.note and "GWP" in info.note:
            cautions.append(f"{info.name}: {info.note}. Check the F-gas or other regulations that apply to new equipment.")
    return cautions


def cautions_section(ctx: SheetContext, index: int) -> list:
    """Safety cautions, deferring to codes and licensed practice."""
    # The codes deferred to: [ref:en-378] [ref:iso-5149] [ref:ashrae-15] [ref:iec-60335-2-89].
    items = safety_cautions(ctx, index)
    flow: list = [heading("Safety cautions")]
    for text in items:
        flow.append(Paragraph("\u2022 " + esc(text), ParagraphStyle("bul", parent=SMALL, leftIndent=8, firstLineIndent=-8, spaceAfter=2)))
    flow.append(
        note(
            "This sheet sizes equipment; it does not replace the design rules of EN 378, ISO 5149, ASHRAE 15, "
            "IEC 60335-2-89 and the local building and electrical codes. Installation, charging and "
            "commissioning by licensed persons only.",
            TINY,
        )
    )
    return [KeepTogether(flow)]
