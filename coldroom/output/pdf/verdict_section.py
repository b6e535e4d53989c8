"""Page 1 of the sheet: each existing unit's verdict, its one-line reason, and the way forward.

Presents ``RoomResult.check`` and ``RoomResult.limits``
(:class:`coldroom.design.unit_limits.UnitLimits`): the coldest room temperature the unit
still holds, the largest daily intake at the room's temperature, the duty a
replacement must have, and the remedies as plain sentences (a
medium-temperature unit asked for low-temperature suction first). Computes
nothing. Hooked in through :data:`coldroom.output.pdf.sheet.PROJECT_SECTIONS`.
"""

from __future__ import annotations

from typing import Any

from coldroom.output.pdf.text import capacity, temperature
from coldroom.units import display, format_terms


def verdict_section(ctx: Any) -> list:
    """One block per room with an existing unit; nothing when there is none."""
    rooms = [(i, r) for i, r in enumerate(ctx.result.rooms) if r.check is not None and r.limits is not None]
    if not rooms:
        return []
    from reportlab.lib.styles import ParagraphStyle
    from reportlab.platypus import KeepTogether, Spacer

    from coldroom.output.pdf.layout import H3, SMALL, Paragraph, figure_boxes, heading, note, warning_box
    from coldroom.output.pdf.text import esc

    s = ctx.system
    out: list = [heading("Existing unit: verdict and the way forward", H3)]
    for _i, room in rooms:
        check, limits = room.check, room.limits
        verdict = check.verdict
        reason = format_terms(limits.reason(), s)
        line = Paragraph(
            f"<b>{esc(room.name)} - {esc(check.name)}: {esc(verdict)}</b> - {esc(reason)}.",
            ParagraphStyle("verdict", parent=SMALL, fontSize=9, leading=12),
        )
        if limits.coldest_status == "never":
            coldest, sub = "none", "no set point in the room range"
        elif limits.coldest_status == "holds_at_lowest":
            coldest, sub = f"below {temperature(limits.coldest_room_temperature_held, s)}", "holds everywhere searched"
        else:
            coldest = temperature(limits.coldest_room_temperature_held, s)
            sub = f"set point asked {temperature(limits.room_temperature, s)}"
        if limits.max_daily_intake is None:
            intake, intake_sub = "-", "no product intake"
        else:
            intake = display(limits.max_daily_intake, "mass", s, digits=0) + "/day"
            intake_sub = f"asked {display(limits.daily_intake, 'mass', s, digits=0)}/day at {temperature(limits.room_temperature, s)}"
        duty_sub = (
            f"SST {temperature(limits.replacement_evaporating, s)} / SCT {temperature(limits.replacement_condensing, s)}"
            if limits.replacement_condensing is not None
            else f"evaporating {temperature(limits.replacement_evaporating, s)}, transcritical"
        )
        boxes = figure_boxes(
            ctx,
            [
                ("Coldest room it holds", coldest, sub),
                ("Largest daily intake", intake, intake_sub),
                ("Replacement duty", capacity(limits.replacement_capacity, s), duty_sub),
            ],
        )
        remedies = [format_terms(r, s) for r in limits.remedies() if r is not limits.medium_at_low]
        block = []
        if limits.medium_at_low is not None:  # said first, before the margin
            block += warning_box(ctx, [limits.medium_at_low]) + [Spacer(1, 3)]
        block += [line, Spacer(1, 3), boxes, Spacer(1, 3), note("The way forward: " + " ".join(remedies))]
        out += [KeepTogether(block), Spacer(1, 6)]
    return out


def blocking_section(ctx: Any) -> list:
    """Page 1: every blocking verdict in one box, before anything else is read."""
    from coldroom.output.terminal import blocking_verdicts

    found = blocking_verdicts(ctx.result)
    if not found:
        return []
    from reportlab.platypus import Spacer

    from coldroom.output.pdf.layout import H3, heading, warning_box

    return [heading("Blocking verdicts", H3), *warning_box(ctx, found), Spacer(1, 4)]
