"""The proposal for the customer (``coldroom quote --out FILE.pdf``): our own layout, A4.

What the customer reads: the scope (rooms, sizes, temperatures, what each
system holds), the equipment with its duties and balance point, the price
(net, tax, total: no internal costs or margin), validity and terms, what is
included (quantities, no unit prices) and excluded, the electrical supply the
job needs, and the safety notes (refrigerant, charge against its limits, the
codes that apply). A quote with lines still needing a price prints as a
DRAFT that says so on its first page.
"""

from __future__ import annotations

import datetime as _dt
import io
from typing import TYPE_CHECKING, Any

from reportlab.lib.pagesizes import A4
from reportlab.lib.styles import ParagraphStyle
from reportlab.platypus import KeepTogether, Spacer

from coldroom.output.pdf.layout import (
    BODY, H1, H2, SMALL, WARN, Paragraph, document, grid, heading, note, warning_box,
)
from coldroom.output.pdf.text import capacity, clean, esc, q, temperature
from coldroom.output.quote_text import quantity_text
from coldroom.units import format_money

if TYPE_CHECKING:  # pragma: no cover
    from coldroom.design.quote import Quote
    from coldroom.inputs.projectfile import ProjectModel
    from coldroom.results import ProjectResult

MARGIN = 42.0
CODES = ("EN 378 (parts 1–4)", "ISO 5149 (parts 1–4)", "ASHRAE 15", "IEC 60335-2-89 (and IEC 60335-2-40 where it "
         "applies)", "the local building, electrical and pressure-equipment codes")


class _Ctx:
    def __init__(self, width: float, system: str) -> None:
        self.width = width
        self.system = system


def _valid_until(date: str, days: int) -> str:
    try:
        return (_dt.date.fromisoformat(date) + _dt.timedelta(days=days)).isoformat()
    except ValueError:
        return f"{days} days from the date above"


def _header(quote: "Quote", result: "ProjectResult", ctx: _Ctx) -> list:
    days = quote.settings.validity
    rows = [["Customer", result.client or "–"], ["Site", result.site or "–"],
            ["Prepared by", result.prepared_by or "–"], ["Date", result.date],
            ["Valid until", f"{_valid_until(result.date, days)} ({days} days)"]]
    out: list = [Paragraph(esc(f"Proposal: {result.project_name}"), H1), Spacer(1, 6),
                 grid(rows, [90, ctx.width - 90], header=False)]
    if not quote.complete:
        out += [Spacer(1, 6)] + warning_box(ctx, [
            f"DRAFT — not to be sent: {len(quote.missing_prices)} item(s) still need a price "
            f"({'; '.join(quote.missing_prices)})."
        ])
    return out


def _scope(model: "ProjectModel", result: "ProjectResult", quote: "Quote", ctx: _Ctx) -> list:
    s = ctx.system
    rows: list[list[Any]] = [["Room", "Inside size (L × W × H)", "Held at", "Stores", "System"]]
    for room, rr in zip(model.rooms, result.rooms):
        box = room.box_dimensions("inside")
        size = " × ".join(q(x, "length", s, 2) for x in box) if box else q(room.inside_volume, "volume", s)
        products = ", ".join(sorted({(p.product or "product").replace("_", " ") for p in room.products})) or "–"
        rows.append([room.name, size, temperature(room.temperature, s), products, rr.system])
    w = ctx.width
    out = [heading("Scope", H2), note(
        "Insulated cold rooms of sandwich panels with their doors, and the refrigeration that holds them: "
        "unit coolers in the rooms, a condensing unit per system, the pipework between them, the refrigerant "
        "charge, local isolators, commissioning."),
        Spacer(1, 4), grid(rows, [0.2 * w, 0.22 * w, 0.12 * w, 0.32 * w, 0.14 * w])]
    return out


def _equipment(quote: "Quote", result: "ProjectResult", ctx: _Ctx) -> list:
    s = ctx.system
    out: list = [heading("Equipment, duties and balance point", H2)]
    systems = {x.name: x for x in result.systems}
    for sel in quote.selections:
        check = sel.choice.check
        rows: list[list[Any]] = [["Item", "Model", "Duty", "Capacity"]]
        for c in sel.coolers:
            rows.append([f"Unit cooler{'s' if c.count > 1 else ''}, {c.room}", f"{c.count} × {c.model}",
                         capacity(c.duty, s), capacity(c.capacity, s)])
        rows.append([f"Condensing unit ({sel.refrigerant})", sel.choice.model, capacity(sel.required_capacity, s),
                     capacity(check.capacity_at_balance or 0.0, s)])
        w = ctx.width
        balance = (
            f"Balance point of the condensing unit with these coils at {temperature(sel.ambient_temperature, s)} "
            f"outdoor air: saturated suction {temperature(check.balance_evaporating, s)}, condensing "
            f"{temperature(check.balance_condensing, s)}; it runs about {check.run_hours_needed or 0:.1f} h a day "
            f"to hold the rooms at design conditions"
            + (f" and holds them up to {temperature(check.max_ambient, s)} outdoor air." if check.max_ambient else ".")
        )
        system = systems.get(sel.system)
        rooms = ", ".join(m.room for m in system.members) if system is not None else ""
        out += [KeepTogether([heading(f"System {sel.system}" + (f": {rooms}" if rooms else ""), ),
                              grid(rows, [0.34 * w, 0.26 * w, 0.2 * w, 0.2 * w], align_right=(2, 3)),
                              Spacer(1, 3), note(balance)])]
    return out


def _included(quote: "Quote", ctx: _Ctx) -> list:
    labels = {"panels": "Insulated panels", "doors": "Doors", "equipment": "Refrigeration equipment",
              "valves": "Expansion valves", "accessories": "Line accessories and regulators",
              "pipework": "Copper pipework and insulation", "refrigerant": "Refrigerant charge",
              "electrical": "Local isolators"}
    rows: list[list[Any]] = [["Included", "Quantity"]]
    bands = []
    section = None
    for line in quote.lines:
        if line.section == "labour":
            continue
        if line.section != section:
            section = line.section
            bands.append(len(rows))
            rows.append([labels[section], ""])
        text = line.item + (f" ({line.model})" if line.model and line.section != "pipework" else "")
        qty = clean(quantity_text(line.quantity, line.unit, ctx.system))
        rows.append([text[:1].upper() + text[1:], qty])
    rows.append(["Installation, pipework, wiring from the isolators to the units, evacuation, charging and "
                 "commissioning", "–"])
    w = ctx.width
    out = [heading("What is included", H2), grid(rows, [0.8 * w, 0.2 * w], align_right=(1,), total_rows=bands)]
    exclusions = list(quote.settings.exclusions)
    if exclusions:
        out += [heading("What is not included"),
                grid([[f"• {x}"] for x in exclusions], [w], header=False)]
    return out


def _electrical(quote: "Quote", ctx: _Ctx) -> list:
    rows: list[list[Any]] = [["System", "Unit", "Supply", "Running", "Starting"]]
    nec = quote.settings.electrical_code == "NEC"
    if nec:
        rows[0] += ["MCA", "MOP"]
    for schedule in quote.electrical:
        for item in schedule.items:
            row = [schedule.system, f"{item.item} ({item.model})", item.supply,
                   f"{item.running_current:.1f} A" + (" *" if item.estimated else ""),
                   "–" if item.locked_rotor_current is None else f"{item.locked_rotor_current:.0f} A"]
            if nec:
                row += [f"{item.minimum_circuit_ampacity:.1f} A", f"{item.maximum_overcurrent_protection} A"]
            rows.append(row)
        rows.append([schedule.system, "total running current", "", f"{schedule.total_running_current:.1f} A", ""]
                    + (["", ""] if nec else []))
    w = ctx.width
    widths = [0.12, 0.38, 0.18, 0.16, 0.16] if not nec else [0.1, 0.3, 0.16, 0.11, 0.11, 0.11, 0.11]
    totals = [i for i, r in enumerate(rows) if r[1] == "total running current"]
    code_note = ("MCA and MOP by NEC Article 440 (440.33, 440.22(A)), MOP rounded down to a standard rating of "
                 "240.6(A)." if nec else "Protective devices and cables: chosen by the electrician to the local "
                 "wiring rules (IEC 60364 and national codes).")
    return [heading("Electrical supply", H2),
            grid(rows, [x * w for x in widths], align_right=tuple(range(3, len(rows[0]))), total_rows=totals),
            Spacer(1, 3),
            note("* estimated from the unit's electrical input (no current in the maker's data): confirm on the "
                 "nameplate. " + code_note)]


def _price(quote: "Quote", ctx: _Ctx) -> list:
    c = quote.currency
    net = quote.subtotal_price + quote.margin_price
    rows = [["Supply and installation as described, net", format_money(net, c, 2)],
            [f"Tax ({quote.tax_rate * 100:g} %)", format_money(quote.tax_price, c, 2)],
            ["Total", format_money(quote.total_price, c, 2)]]
    w = ctx.width
    out = [heading("Price", H2), grid(rows, [0.7 * w, 0.3 * w], header=False, align_right=(1,), total_rows=(2,))]
    terms = quote.settings.terms.strip()
    out += [heading("Validity and terms"),
            note(f"This offer is valid for {quote.settings.validity} days from its date. " + (terms or ""))]
    return out


def _safety(quote: "Quote", result: "ProjectResult", ctx: _Ctx) -> list:
    from coldroom.data import refrigerants

    out: list = [heading("Safety", H2)]
    for system in result.systems:
        info = refrigerants.lookup(system.refrigerant)
        pw = system.pipework
        text = (f"System {system.name}: {info.name}, safety class {info.safety_class}, GWP {info.gwp_ar4:g} (AR4).")
        if pw is not None:
            charge = pw.charge
            how = "as stated" if charge.stated else "estimated; weighed in at commissioning and recorded on the unit"
            text += f" Charge {charge.total:.2f} kg ({how})."
            for limit in pw.limits:
                if limit.limit is not None:
                    text += f" {limit.rule}: limit {limit.limit:.2f} kg in {pw.room} — {limit.verdict}."
        out.append(note(text, BODY))
        out.append(Spacer(1, 3))
    flammable = any(refrigerants.lookup(s.refrigerant).safety_class.startswith(("A2", "A3")) for s in result.systems)
    points = [
        "The installation is designed, built and commissioned to " + ", ".join(CODES[:-1]) + " and " + CODES[-1]
        + "; where they differ, the stricter applies.",
        "A person inside a cold room must be able to open the door and raise an alarm: the doors quoted open "
        "from inside; the alarm and emergency lighting follow the codes above.",
        "The system is pressure-tested, evacuated and leak-checked before charging; the charge and leak-check "
        "records are handed over with the installation.",
        "Electrical work is carried out by a qualified electrician to the local wiring rules; each unit has a "
        "local isolator.",
    ]
    if flammable:
        points.insert(1, "The refrigerant is flammable: the charge limits above, ventilation, ignition sources and "
                         "the marking of the equipment follow EN 378 / ISO 5149 and IEC 60335-2-89.")
    out += [grid([[f"• {p}"] for p in points], [ctx.width], header=False)]
    return out


def render_proposal(quote: "Quote", result: "ProjectResult", model: "ProjectModel") -> bytes:
    """The proposal's PDF bytes (module notes)."""
    from coldroom.output.pdf.page_frame import canvas_maker

    buffer = io.BytesIO()
    doc = document(buffer, A4, MARGIN, title=f"Proposal: {result.project_name}", author=result.prepared_by,
                   subject="Cold rooms and refrigeration: proposal", creator="coldroom quote")
    ctx = _Ctx(doc.width, result.unit_system)
    story: list = []
    story += _header(quote, result, ctx)
    story += [Spacer(1, 8)] + _scope(model, result, quote, ctx)
    story += [Spacer(1, 8)] + _equipment(quote, result, ctx)
    story += [Spacer(1, 8), KeepTogether(_price(quote, ctx))]
    story += [Spacer(1, 8)] + _included(quote, ctx)
    story += [Spacer(1, 8)] + _electrical(quote, ctx)
    story += [Spacer(1, 8), KeepTogether(_safety(quote, result, ctx))]
    doc.build(story, canvasmaker=canvas_maker(result, A4[0], MARGIN, kind="Proposal"))
    return buffer.getvalue()
