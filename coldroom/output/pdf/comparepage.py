"""The options comparison as a PDF of one or two pages (``coldroom compare --out``).

Our own layout in the sizing sheet's style and palette: the basis (ambient, tariff,
emission factor, service life, leakage and recovery, defaults marked), the options
table, two bar charts (annual running cost; TEWI over the service life, direct and
indirect) and the notes and cautions. It presents an :class:`coldroom.design.annual.Comparison`
and computes nothing new. ``invariant=1`` and the project's date make it byte-identical
run to run.
"""

from __future__ import annotations

import io
from types import SimpleNamespace
from typing import Any

from reportlab.lib.pagesizes import A4, LETTER, landscape
from reportlab.lib.units import mm
from reportlab.platypus import CondPageBreak, Spacer

from coldroom.output.pdf.charts import BarChart
from coldroom.output.pdf.cautions_section import people_cautions, refrigerant_cautions
from coldroom.output.pdf.layout import CELL_SMALL, H1, SMALL, TINY, document, grid, heading, note
from coldroom.output.pdf.page_frame import canvas_maker
from coldroom.output.pdf.text import clean, temperature
from coldroom.output.terminal import blocking_notes, charge_notes, compare_rows, condenser_air_note


def _basis_rows(comparison: Any, system: str = "SI") -> list[list[str]]:
    base = comparison.options[0]
    econ = base.economics
    marked = set(econ.get("defaulted", ()))

    def m(key: str, text: str) -> str:
        return text + ("  (default; set it under economics:)" if key in marked else "")

    hours = sum(b.hours for b in comparison.bins)
    low = min(b.temperature for b in comparison.bins)
    high = max(b.temperature for b in comparison.bins)
    return [
        ["basis", "value"],
        ["Ambient", f"{comparison.ambient_source}: {len(comparison.bins)} bins, "
                    f"{hours:,.0f} h, {temperature(low, system)} to {temperature(high, system)} "
                    "(an EPW file's hours are binned at 1 K)"],
        *([f"Ambient of {o.name}", f"{o.ambient_source}: {len(o.bins)} bins, {sum(b.hours for b in o.bins):,.0f} h"]
          for o in comparison.options if o.ambient_source),
        ["Electricity price", m("electricity_price", f"{econ['electricity_price']:g} {econ['currency']} per kWh")],
        ["Grid emission factor", m("emission_factor", f"{econ['emission_factor']:g} kg CO2e per kWh")],
        ["Service life", m("service_life", f"{econ['service_life']:g} years")],
        ["Leakage", m("leakage_rate", f"{econ['leakage_rate']:.0%} of the charge per year")],
        ["Recovery at end of life", m("recovery_factor", f"{econ['recovery_factor']:.0%} of the charge")],
        ["GWP", "IPCC AR4 (2007), 100 years; charge-weighted where refrigerants differ"],
        ["TEWI", "GWP x charge x leakage x life + GWP x charge x (1 - recovery) + kWh/year x emission factor x life "
                 "(EN 378-1 Annex B; AIRAH 2012 guideline)"],
    ]


def render_compare(comparison: Any, system: str, meta: dict) -> bytes:
    """The comparison as PDF bytes.

    Parameters
    ----------
    comparison : coldroom.design.annual.Comparison
    system : str
        ``"SI"`` or ``"IP"`` (page size and capacity units).
    meta : dict
        ``date``, ``input_file``, ``input_sha256``, ``versions``, ``prepared_by``, ``client``, ``site``.
    """
    pagesize = landscape(LETTER if system == "IP" else A4)
    margin = 14 * mm
    buffer = io.BytesIO()
    doc = document(
        buffer,
        pagesize,
        margin,
        title=f"Options compared: {comparison.project_name}",
        author=meta.get("prepared_by") or "",
        subject=f"{meta['input_file']} sha256 {meta['input_sha256']}",
        creator=f"coldroom {meta['versions'].get('coldroom', '')}",
    )
    width = doc.width
    story: list = [
        heading("Options compared over a year", H1),
        note(" · ".join(x for x in (comparison.project_name, meta.get("client"), meta.get("site")) if x)),
        Spacer(1, 6),
    ]
    basis = _basis_rows(comparison, system)
    story.append(grid(basis, [width * 0.2, width * 0.8], style=CELL_SMALL))
    story.append(heading("Base and options"))
    headers, rows = compare_rows(comparison, system)
    fractions = [0.1, 0.07, 0.1, 0.07, 0.07, 0.065, 0.075, 0.065, 0.05, 0.13, 0.09, 0.08]
    story.append(grid([headers] + rows, [width * f / sum(fractions) for f in fractions],
                      align_right=range(3, 12), style=CELL_SMALL))
    blocking = blocking_notes(comparison)
    if blocking:  # page 1 carries every blocking verdict
        story += [note(text, SMALL) for text in blocking]
    story.append(note(
        "Design capacity: sum of the rooms' design capacities (as on the sizing sheet). Compressor input: electrical, "
        "at the design condition. kWh/year: compressor, fans, defrost and other (heaters, lights) over the ambient "
        "bins, the design compressor's capacity at each bin. " + condenser_air_note(comparison)
        + " 'vs base' = option minus base.", TINY))
    story.append(CondPageBreak(230))
    base = comparison.options[0]
    cur = base.currency
    half = (width - 18) / 2
    cost = BarChart([(o.name, o.annual_cost, f"{o.annual_cost:,.0f} {o.currency}") for o in comparison.options],
                    half, title=f"Annual running cost ({cur}/year)")
    tewi_rows = []
    for o in comparison.options:
        t = o.tewi
        if t is None:
            tewi_rows.append((o.name, 0.0, "not available (no charge)"))
        else:
            direct = t.direct_leakage + t.direct_end_of_life
            tewi_rows.append((o.name, t.total, f"{t.total / 1000:.1f} t ({direct / 1000:.1f} direct + "
                                               f"{t.indirect / 1000:.1f} indirect)"))
    life = base.economics["service_life"]
    tewi_chart = BarChart(tewi_rows, half, title=f"TEWI over {life:g} years (t CO2e)")
    from reportlab.platypus import Table

    charts = Table([[cost, tewi_chart]], colWidths=[half + 9, half + 9], hAlign="LEFT")
    story += [heading("Running cost and climate impact"), charts]
    notes = [f"{o.name}: {o.note}" for o in comparison.options if o.note and o.name != "base"]
    notes += charge_notes(comparison)
    for o in comparison.options:
        notes += [f"{o.name}: {w}" for w in o.warnings]
    if notes:
        story.append(heading("Notes"))
        story += [note(n, SMALL) for n in notes]
    refrigerants: list[str] = []
    for o in comparison.options:
        for name in o.refrigerants:
            if name not in refrigerants:
                refrigerants.append(name)
    cautions = [c for name in refrigerants for c in refrigerant_cautions(name)] + people_cautions()
    cautions.append(
        "Figures for comparing options, not a guarantee of running cost. Safety: EN 378, ISO 5149, ASHRAE 15, "
        "IEC 60335-2-89, local codes and licensed practice govern; the charge limits and the equipment must "
        "be checked for the refrigerant chosen."
    )
    story.append(heading("Cautions"))
    story += [note(c, TINY) for c in cautions]
    header = SimpleNamespace(
        project_name=comparison.project_name, date=meta["date"], versions=meta["versions"],
        input_file=meta["input_file"], input_sha256=meta["input_sha256"],
    )
    doc.build(story, canvasmaker=canvas_maker(header, pagesize[0], margin, kind="Options compared"))
    return buffer.getvalue()
