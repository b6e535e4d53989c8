"""Sheet sections of ``coldroom select``: the chosen models on page 1, and "Selected equipment".

Only presents :class:`coldroom.design.selection.SystemSelection` objects (``ctx.selection``);
both sections return ``[]`` when the sheet is rendered without a selection.
"""

from __future__ import annotations

from typing import Any

from reportlab.platypus import Spacer

from coldroom.output.pdf.text import capacity, temperature
from coldroom.units import display, format_money


def _sheet():  # type: ignore[no-untyped-def]
    from coldroom.output.pdf import layout  # the shared styles and building blocks

    return layout


def selection_summary_section(ctx: Any) -> list:
    """Page 1: per system the chosen condensing unit and coils, and the total price."""
    selections = getattr(ctx, "selection", None)
    if not selections:
        return []
    sh = _sheet()
    currency = selections[0].currency
    rows: list[list[str]] = [["System", "Condensing unit", "Unit coolers", "Price"]]
    for s in selections:
        coils = "; ".join(f"{c.room}: {c.count} × {c.model}" for c in s.coolers)
        rows.append([s.system, s.choice.model, coils, format_money(s.total_price, currency)])
    rows.append(["Total", "", "", format_money(sum(s.total_price for s in selections), currency)])
    w = ctx.width
    return [
        sh.heading("Selected equipment (from the catalogue)", sh.H3),
        sh.grid(rows, [0.2 * w, 0.2 * w, 0.44 * w, 0.16 * w], align_right=(3,), total_rows=(len(rows) - 1,)),
        Spacer(1, 4),
    ]


def selected_equipment_section(ctx: Any) -> list:
    """"Selected equipment": per system the items and prices, the balance point, alternatives, what was set aside."""
    selections = getattr(ctx, "selection", None)
    if not selections:
        return []
    from coldroom.design.selection import REASONS_COOLER, REASONS_UNIT

    sh = _sheet()
    s_ = ctx.system
    w = ctx.width
    from reportlab.platypus import CondPageBreak

    out: list = [CondPageBreak(220), sh.heading("Selected equipment", sh.H2)]
    out.append(sh.note(
        "Chosen from the contractor's catalogue: per room the cheapest unit coolers whose capacity at the room's TD "
        "covers its design capacity (throw shorter than the room: two coils; rooms below 0 °C: electric or hot-gas "
        "defrost, fins at least 6 mm); per system the cheapest condensing unit whose balance point with those coils "
        "at the design condenser air lies inside its envelope and gives the design capacity within the run time.",
        sh.TINY,
    ))
    for s in selections:
        c = s.choice.check
        cur = s.currency
        rows: list[list[str]] = [["Item", "Model", "Count", "Duty", "Capacity", "Price"]]
        for k in s.coolers:
            rows.append([f"Unit cooler, {k.room}", k.model, str(k.count), capacity(k.duty, s_),
                         capacity(k.capacity, s_) + " at TD " + display(k.temperature_difference, "temperature_difference", s_),
                         format_money(k.price, cur)])
        rows.append(["Condensing unit", s.choice.model, "1", capacity(s.required_capacity, s_),
                     capacity(c.capacity_at_balance, s_) + " at balance", format_money(s.choice.price, cur)])
        rows.append(["Total", "", "", "", "", format_money(s.total_price, cur)])
        out += [
            Spacer(1, 4),
            sh.heading(f"System {s.system} ({s.refrigerant})", sh.H3),
            sh.grid(rows, [0.27 * w, 0.17 * w, 0.07 * w, 0.13 * w, 0.22 * w, 0.14 * w], align_right=(2, 3, 4, 5),
                    total_rows=(len(rows) - 1,)),
            Spacer(1, 3),
        ]
        holds = {"found": f"holds up to {temperature(c.max_ambient, s_)} condenser air",
                 "holds_above_range": "holds over the whole range searched (10–55 °C)"}.get(c.max_ambient_status, "")
        facts = [
            ["Balance point (dew)", f"SST {temperature(c.balance_evaporating, s_)} / SCT "
                                    f"{temperature(c.balance_condensing, s_)} at {temperature(s.ambient_temperature, s_)} "
                                    "condenser air"],
            ["Run time needed", f"{c.run_hours_needed:.1f} h/day of {c.run_hours_available:.1f} h; margin "
                                f"{c.margin_percent:+.0f} %" + (f"; {holds}" if holds else "")],
        ]
        for a in s.alternatives:
            ac = a.check
            facts.append(["Alternative", f"{a.model}: total {format_money(s.total_price_with(a), cur)}; SST "
                                         f"{temperature(ac.balance_evaporating, s_)}, margin {ac.margin_percent:+.0f} %"])
        if s.rejected:
            facts.append(["Units set aside", ", ".join(f"{n} {REASONS_UNIT.get(r, r)}" for r, n in s.rejected.items())])
        for k in s.coolers:
            text = k.rule
            if k.rejected:
                text += "; set aside: " + ", ".join(f"{n} {REASONS_COOLER.get(r, r)}" for r, n in k.rejected.items())
            facts.append([f"Coils, {k.room}", text])
        out.append(sh.grid(facts, [0.22 * w, 0.78 * w], header=False))
        if s.warnings:
            out += sh.warning_box(ctx, list(s.warnings))
    return out
