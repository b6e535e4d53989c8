"""The terminal summary of ``coldroom quote``: the bill of quantities by section, the totals, what is missing."""

from __future__ import annotations

from typing import TYPE_CHECKING

from coldroom.units import format_money

if TYPE_CHECKING:  # pragma: no cover
    from coldroom.design.quote import Quote


#: The quote's SI units and the quantity kind each is shown as in the project's system.
KINDS = {"m²": ("area", 1), "m": ("length", 1), "kg": ("mass", 2)}


def quantity_text(value: float, unit: str, system: str = "SI") -> str:
    """A line's quantity in the project's unit system (items as counts, hours as hours)."""
    if unit == "item":
        return f"{value:g}"
    if unit in KINDS:
        from coldroom.units import display

        kind, digits = KINDS[unit]
        return display(value, kind, system, digits)
    return f"{value:.1f} {unit}"


def quote_report(quote: "Quote", system: str = "SI") -> str:
    """Plain text: one row per line, totals, missing prices and warnings."""
    c = quote.currency
    rows = []
    section = None
    for line in quote.lines:
        if line.section != section:
            section = line.section
            rows.append(f"{section.upper()}")
        price = format_money(line.total_price, c, 2) if line.total_price is not None else "PRICE NEEDED"
        model = f" [{line.model}]" if line.model else ""
        rows.append(f"  {line.item}{model}: {quantity_text(line.quantity, line.unit, system)}  {price}")
    rows += [
        "",
        f"subtotal          {format_money(quote.subtotal_price, c, 2)}",
        f"margin {quote.margin * 100:5.1f} %    {format_money(quote.margin_price, c, 2)}",
        f"tax {quote.tax_rate * 100:5.1f} %       {format_money(quote.tax_price, c, 2)}",
        f"total             {format_money(quote.total_price, c, 2)}",
    ]
    if not quote.complete:
        rows.append(f"INCOMPLETE: {len(quote.missing_prices)} line(s) need a price: " + "; ".join(quote.missing_prices))
    for schedule in quote.electrical:
        rows.append(f"electrical, {schedule.system}: total running current {schedule.total_running_current:.1f} A")
    from coldroom.units import format_terms

    rows += [f"  WARNING: {format_terms(w, system) if hasattr(w, 'phrase') else w}" for w in quote.warnings]
    return "\n".join(rows)
