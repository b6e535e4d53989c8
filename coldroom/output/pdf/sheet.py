"""The PDF sizing sheet: a layout of our own, one function per section.

The sheet presents a :class:`coldroom.results.ProjectResult` and echoes the
project's own inputs (room temperature and RH, refrigerant catalogue entry);
it computes nothing new. Every number carries its unit in the project's unit
system (SI: A4 paper; IP: US Letter).

Adding a section
----------------
Write ``def my_section(ctx: SheetContext, index: int) -> list`` returning
reportlab flowables for room *index* (an empty list when it has nothing to
show, e.g. ``ctx.result.rooms[index].check is None``), and insert it into
:data:`ROOM_SECTIONS` where it belongs. Project-wide sections take only
``ctx`` and go into :data:`PROJECT_SECTIONS`. Build it from the blocks of
:mod:`coldroom.output.pdf.layout` (:func:`~coldroom.output.pdf.layout.heading`,
:func:`~coldroom.output.pdf.layout.grid`, :func:`~coldroom.output.pdf.layout.note`,
figure and warning boxes) so the section looks like the others.

The room's cycle and chart are in :mod:`coldroom.output.pdf.cycle_section`, the
safety cautions in :mod:`coldroom.output.pdf.cautions_section`, what every
section reads in :mod:`coldroom.output.pdf.context`.

Determinism: the canvas (:mod:`coldroom.output.pdf.page_frame`) runs with
``invariant=1`` and a fixed creation date (the sheet's date at 00:00 UTC), so
the same input gives the same bytes.
"""

from __future__ import annotations

import io
from typing import Any, Callable

from reportlab.lib.pagesizes import A4, LETTER
from reportlab.lib.styles import ParagraphStyle
from reportlab.lib.units import mm
from reportlab.platypus import (
    KeepTogether,
    PageBreak,
    Spacer,
    Table,
    TableStyle,
)

from coldroom.constants import SECONDS_PER_DAY_S
from coldroom.output.pdf.cautions_section import cautions_section
from coldroom.output.pdf.charts import MUTED, RULE, BarChart
from coldroom.output.pdf.existing_unit_section import existing_unit_section
from coldroom.output.pdf.context import SheetContext, electrical_label, room_conditions, room_cycle, room_system
from coldroom.output.pdf.cycle_section import compressor_figures, cycle_section, duties_and_cycle
from coldroom.output.pdf.layout import (
    document,
    ACCENT,
    CELL,
    CELL_SMALL,
    H1,
    H2,
    H3,
    SMALL,
    TINY,
    Paragraph,
    cell_text,
    figure_boxes,
    grid,
    heading,
    note,
    warning_box,
)
from coldroom.output.pdf.page_frame import canvas_maker
from coldroom.output.pdf.pipework_section import system_pipework_section
from coldroom.output.pdf.selection_section import selected_equipment_section, selection_summary_section
from coldroom.output.pdf.text import capacity, clean, esc, q, temperature
from coldroom.output.pdf.timecharts import design_day_section, pulldown_section
from coldroom.output.pdf.verdict_section import blocking_section, verdict_section
from coldroom.units import format_terms


COMPONENT_LABELS = {
    "transmission": "Transmission (walls, ceiling, floor)",
    "product": "Product and packaging",
    "infiltration": "Infiltration (doors, air changes)",
    "internal": "Internal (people, lights, trucks)",
    "equipment": "Equipment (fans, heaters, defrost)",
}


# --- project sections ------------------------------------------------------------------------


def title_section(ctx: SheetContext) -> list:
    """Title and the project block: project, client, site, date, prepared by, input file."""
    r = ctx.result
    rows = [
        ["Project", r.project_name, "Date", r.date],
        ["Client", r.client or "–", "Prepared by", r.prepared_by or "–"],
        ["Site", r.site or "–", "Input file", r.input_file],
    ]
    label = ParagraphStyle("lab", parent=CELL, textColor=MUTED)
    data = [
        [Paragraph(esc(a), label), Paragraph(esc(b), CELL), Paragraph(esc(c), label), Paragraph(esc(d), CELL)]
        for a, b, c, d in rows
    ]
    w = ctx.width
    table = Table(data, colWidths=[0.12 * w, 0.46 * w, 0.14 * w, 0.28 * w], hAlign="LEFT")
    table.setStyle(
        TableStyle(
            [
                ("VALIGN", (0, 0), (-1, -1), "TOP"),
                ("LINEBELOW", (0, 0), (-1, -1), 0.35, RULE),
                ("LEFTPADDING", (0, 0), (-1, -1), 3),
                ("TOPPADDING", (0, 0), (-1, -1), 3),
                ("BOTTOMPADDING", (0, 0), (-1, -1), 3),
            ]
        )
    )
    units = "SI units" if ctx.system == "SI" else "IP (inch-pound) units"
    return [
        Paragraph("Refrigeration sizing sheet", H1),
        note(
            f"Heat load, equipment duties and refrigerant cycle for {len(r.rooms)} "
            f"room{'s' if len(r.rooms) != 1 else ''}; {units}; pressures absolute.",
            SMALL,
        ),
        Spacer(1, 6),
        table,
        Spacer(1, 10),
    ]


def systems_overview_section(ctx: SheetContext) -> list:
    """The whole job: one row per system (compressor / condensing unit) and a total row."""
    systems = getattr(ctx.result, "systems", ())
    if not systems:
        return []
    s = ctx.system
    rows: list[list[str]] = [
        ["System", "Rooms", "Refrigerant", "SST / SCT (dew)", "Design capacity", "Electrical input",
         "Heat of rejection"]
    ]
    for system in systems:
        rows.append(
            [
                system.name,
                ", ".join(system.rooms),
                system.refrigerant,
                f"{temperature(system.suction_temperature, s)} / {temperature(system.condensing_temperature, s)}",
                capacity(system.design_capacity, s),
                electrical_label(system.electrical.compressor_input_power),
                capacity(system.heat_of_rejection, s),
            ]
        )
    rows.append(
        [
            f"Total, {len(systems)} system{'s' if len(systems) != 1 else ''}",
            f"{len(ctx.result.rooms)} room{'s' if len(ctx.result.rooms) != 1 else ''}",
            "",
            "",
            capacity(sum(x.design_capacity for x in systems), s),
            electrical_label(sum(x.electrical.compressor_input_power for x in systems)),
            capacity(sum(x.heat_of_rejection for x in systems), s),
        ]
    )
    w = ctx.width
    widths = [0.13 * w, 0.17 * w, 0.115 * w, 0.165 * w, 0.135 * w, 0.13 * w, 0.155 * w]
    return [
        heading("The job: systems", H3),
        note(
            "One compressor or condensing unit per system. Electrical input is the compressor's, at the design "
            "point (overall isentropic efficiency, motor included)."
            if all(x.equipment_basis == "design" for x in systems)
            else "One compressor or condensing unit per system. Electrical input is the chosen condensing unit's "
            "at its balance point with the chosen coils; the coils' fans and defrost heaters are the catalogue's.",
            TINY,
        ),
        Spacer(1, 2),
        grid(rows, widths, align_right=(4, 5, 6), total_rows=(len(rows) - 1,)),
        Spacer(1, 4),
    ]


def summary_section(ctx: SheetContext) -> list:
    """One line per room: the figures needed to pick the equipment."""
    s = ctx.system
    rows: list[list[str]] = [
        ["Room", "Conditions", "Design capacity", "Refrigerant", "Coil evaporating / SCT (dew)", "Compressor input",
         "Heat of rejection"]
    ]
    for i, room in enumerate(ctx.result.rooms):
        cyc = room_cycle(ctx, i) or {}
        system = room_system(ctx, i)
        shared = f"on {system.name}" if system is not None and not cyc else "–"
        rows.append(
            [
                room.name,
                room_conditions(ctx, i) or "–",
                capacity(room.loads.design_capacity, s),
                str(cyc.get("refrigerant", system.refrigerant if system is not None else "–")),
                f"{temperature(room.evaporating_temperature, s)} / {temperature(room.condensing_temperature, s)}",
                (capacity(cyc["compressor_power_w"], s) if system is None or system.equipment_basis == "design"
                 else capacity(system.electrical.compressor_input_power, s)) if cyc else shared,
                capacity(cyc["condenser_duty_w"], s) if cyc else shared,
            ]
        )
    w = ctx.width
    widths = [0.15 * w, 0.17 * w, 0.13 * w, 0.11 * w, 0.17 * w, 0.135 * w, 0.135 * w]
    return [heading("Rooms", H3), grid(rows, widths, align_right=(2, 5, 6)), Spacer(1, 4)]


def system_details_section(ctx: SheetContext) -> list:
    """Per system: the coils it serves and what the electrician must supply."""
    systems = getattr(ctx.result, "systems", ())
    if not systems:
        return []
    s = ctx.system
    w = ctx.width
    out: list = [heading("Systems: coils and electrical supply", H3)]
    shared = [system for system in systems if len(system.members) > 1]
    if shared:
        rows = [["System", "Room (coil)", "Evaporating (dew)", "Evaporator duty", "Mass flow", "Suction control"]]
        for system in shared:
            for m in system.members:
                rows.append(
                    [
                        system.name,
                        m.room,
                        temperature(m.evaporating_temperature, s),
                        capacity(m.duty, s),
                        q(m.mass_flow, "mass_flow", s),
                        "EPR to the suction; vapour mixed in" if m.regulated else "sets the suction",
                    ]
                )
            rows.append(
                [
                    system.name,
                    "compressor suction",
                    temperature(system.suction_temperature, s),
                    capacity(system.design_capacity, s),
                    q(system.cycle.mass_flow, "mass_flow", s),
                    f"coldest coil less {q(system.suction_line_drop, 'temperature_difference', s)} suction-line drop"
                    + (f"; diversity {system.diversity:.0%}" if system.diversity != 1.0 else ""),
                ]
            )
        out += [
            grid(rows, [0.11 * w, 0.17 * w, 0.14 * w, 0.14 * w, 0.13 * w, 0.31 * w], align_right=(2, 3, 4)),
            Spacer(1, 4),
        ]
    for start in range(0, len(systems), 4):
        chunk = systems[start : start + 4]
        col = 0.64 * w / len(chunk)
        e = [x.electrical for x in chunk]
        rows = [
            ["Electrical" + ("" if all(x.equipment_basis == "design" for x in chunk) else " (selected equipment)"),
             *(x.name for x in chunk)],
            ["Compressor electrical input", *(electrical_label(x.compressor_input_power) for x in e)],
            ["Evaporator fans", *(electrical_label(x.evaporator_fan_power) for x in e)],
            ["Condenser fans", *(electrical_label(x.condenser_fan_power) + ("" if x.condenser_fan_basis.startswith("given")
                                  else " (est.)") for x in e)],
            ["Door-frame, drain-line and other heaters", *(electrical_label(x.other_heater_power) for x in e)],
            ["Electric defrost heaters", *(electrical_label(x.defrost_heater_power) for x in e)],
            ["Draw while refrigerating (compressor, fans, heaters)", *(electrical_label(x.refrigerating_load) for x in e)],
            ["Draw while a coil defrosts (largest case)", *(electrical_label(x.defrost_load) for x in e)],
            ["Compressor run time at " + ("design capacity" if all(x.equipment_basis == "design" for x in chunk)
                                          else "the balance point"),
             *(f"{x.compressor_run_time / 3600:.1f} h/day" for x in e)],
            ["Electricity per day", *(f"{x.daily_energy / 3.6e6:.1f} kWh" for x in e)],
            ["Connected load (the larger draw)", *(f"{electrical_label(x.connected_load)} ({x.connected_load_case})" for x in e)],
        ]
        out += [grid(rows, [0.36 * w] + [col] * len(chunk), align_right=tuple(range(1, len(chunk) + 1)),
                     total_rows=(len(rows) - 1,)), Spacer(1, 3)]
    out.append(
        note(
            "Connected load: the largest of compressor + condenser fans + evaporator fans + heaters, and a defrost "
            "case. One room: its defrost heaters with the fans and heaters (compressor stopped). Several rooms: "
            "for each room with electric defrost, its defrost heaters + heaters + compressor + condenser fans + "
            "the other rooms' evaporator fans (the compressor runs on for them); the case in brackets governs. "
            "Electricity per day: the compressor and condenser fans for the time the design capacity needs to "
            "remove the day's heat gain (design-point COP, no part-load correction); fans and heaters for their "
            "hours; defrost heaters for defrosts x duration. Condenser fans marked (est.) are 20 W per kW "
            "rejected [trade]. Supply, protection and cabling to the electrical codes by a qualified person.",
            TINY,
        )
    )
    return out


def system_cycles_section(ctx: SheetContext) -> list:
    """The cycle of each system of several rooms (one-room systems show theirs on the room's page)."""
    out: list = []
    for k, system in enumerate(getattr(ctx.result, "systems", ())):
        if len(system.members) < 2:
            continue
        key = ("system cycle", k)
        if key not in ctx.cache:
            ctx.cache[key] = system.cycle.to_json()
        cyc = ctx.cache[key]
        out.append(PageBreak())
        out.append(heading(f"System {system.name}: {', '.join(system.rooms)}", H2))
        s = ctx.system
        boxes = [
            ("Design capacity", capacity(system.design_capacity, s),
             f"sum of the rooms' design capacities x {system.diversity:.0%}"),
            ("SST / SCT (dew)", f"{temperature(system.suction_temperature, s)} / "
             f"{temperature(system.condensing_temperature, s)}",
             f"condenser air {temperature(system.condenser_air_temperature, s)}"),
            ("Electrical input", electrical_label(system.electrical.compressor_input_power), f"COP {cyc['cop']:.2f}"),
            ("Heat of rejection", capacity(system.heat_of_rejection, s), "condenser duty"),
        ]
        out += [figure_boxes(ctx, boxes), Spacer(1, 4)]
        out += duties_and_cycle(ctx, system.cycle, cyc,
                                 "State 1 is the warmer coils' vapour (through their EPRs) mixed with the "
                                 "coldest coil's, then the suction-line superheat and drop.", system)
        if system.warnings:
            out += [heading("Check these"), *warning_box(ctx, system.warnings)]
    return out


def project_warnings_section(ctx: SheetContext) -> list:
    """Warnings about the project file as a whole (implausible inputs)."""
    if not ctx.result.warnings:
        return []
    return [heading("Check these inputs"), *warning_box(ctx, ctx.result.warnings)]


# --- room sections ------------------------------------------------------------------------------


def room_title_section(ctx: SheetContext, index: int) -> list:
    """Room heading and its four key figures."""
    room = ctx.result.rooms[index]
    s = ctx.system
    cyc = room_cycle(ctx, index)
    n = len(ctx.result.rooms)
    title = f"Room {index + 1} of {n}: {room.name}"
    cond = room_conditions(ctx, index)
    boxes = [
        ("Design capacity", capacity(room.loads.design_capacity, s), f"set by the {room.loads.governed_by}"),
        (
            "Evaporating / condensing (dew)",
            f"{temperature(room.evaporating_temperature, s)} / {temperature(room.condensing_temperature, s)}",
            f"room air {cond}" if cond else "",
        ),
    ]
    system = room_system(ctx, index)
    if not cyc and system is not None:
        boxes += [("Condensing unit", system.name, f"shared with {len(system.members) - 1} other room(s)")]
    if cyc:
        boxes += [
            ("Compressor input", capacity(cyc["compressor_power_w"], s), f"COP {cyc['cop']:.2f}"),
            ("Heat of rejection", capacity(cyc["condenser_duty_w"], s),
             f"condenser air {temperature(room.condenser_air_temperature, s)}"),
        ]
    return [heading(title, H2), figure_boxes(ctx, boxes), Spacer(1, 4)]


def basis_section(ctx: SheetContext, index: int) -> list:
    """Basis of design: conditions, constructions with U-values, doors, products, operation, refrigeration."""
    room = ctx.result.rooms[index]
    if not room.sizing_basis:
        return []
    rows: list[list[Any]] = []
    group_rows: list[int] = []
    current = None
    for what, value in room.sizing_basis:
        group, _, label = what.partition(": ")
        if not label:
            group, label = "", what
        if group != current:
            current = group
            group_rows.append(len(rows))
            rows.append([group, ""])
        rows.append([label, format_terms(value, ctx.system)])
    w = ctx.width
    label_style = ParagraphStyle("g", parent=CELL_SMALL, fontName="Helvetica-Bold", textColor=ACCENT)
    data = []
    pad = 4 + 6  # left padding below + reportlab's default right padding
    for r, (a, b) in enumerate(rows):
        if r in group_rows:
            data.append([cell_text(a, label_style, 0.36 * w, pad), ""])
        else:
            data.append([cell_text(a, CELL_SMALL, 0.36 * w, pad), cell_text(b, CELL_SMALL, 0.64 * w, pad)])
    table = Table(data, colWidths=[0.36 * w, 0.64 * w], hAlign="LEFT")
    commands = [
        ("VALIGN", (0, 0), (-1, -1), "TOP"),
        ("LEFTPADDING", (0, 0), (-1, -1), 4),
        ("TOPPADDING", (0, 0), (-1, -1), 1.4),
        ("BOTTOMPADDING", (0, 0), (-1, -1), 1.4),
        ("FONT", (0, 0), (-1, -1), CELL_SMALL.fontName, CELL_SMALL.fontSize, CELL_SMALL.leading),
        ("TEXTCOLOR", (0, 0), (-1, -1), CELL_SMALL.textColor),
    ]
    for r in group_rows:
        commands += [("LINEBELOW", (0, r), (-1, r), 0.5, RULE), ("TOPPADDING", (0, r), (-1, r), 5),
                     ("FONT", (0, r), (-1, r), label_style.fontName, label_style.fontSize, label_style.leading),
                     ("TEXTCOLOR", (0, r), (-1, r), label_style.textColor),
                     ("FONT", (1, r), (1, r), "Helvetica", 10, 12)]  # the empty cell: reportlab's default, as before
    table.setStyle(TableStyle(commands))
    return [heading("Basis of design"), table]


def loads_section(ctx: SheetContext, index: int) -> list:
    """The 24-hour heat load by component: table, totals and a bar chart."""
    room = ctx.result.rooms[index]
    loads = room.loads
    s = ctx.system
    total = loads.daily_energy
    energy_unit = "kWh/day" if s == "SI" else "Btu/day"
    power_unit = "W" if s == "SI" else "Btu/h"

    def energy(joules: float) -> str:
        if s == "SI":
            return clean(f"{joules / 3.6e6:,.1f}")
        return q(joules, "energy", s, 0).rsplit(" ", 1)[0]

    def power(watts: float) -> str:
        return q(watts, "power", s, 0).rsplit(" ", 1)[0]

    rows = [["Component", energy_unit, f"24-h average, {power_unit}", "Share"]]
    bars = []
    for component, label in COMPONENT_LABELS.items():
        e = loads.component_energy(component)
        share = e / total if total else 0.0
        rows.append([label, energy(e), power(e / SECONDS_PER_DAY_S), f"{share:.1%}"])
        bars.append((label.split(" (")[0], e, f"{power(e / SECONDS_PER_DAY_S)} {power_unit}  ({share:.0%})"))
    rows.append(["Total heat gain", energy(total), power(total / SECONDS_PER_DAY_S), "100.0%"])
    totals = [
        ["Safety factor", f"{loads.safety_factor:.0%}"],
        ["Compressor run time", f"{loads.run_time / 3600:g} h/day ({loads.run_time_basis})"],
        ["Required capacity (24-h energy x safety / run time)", capacity(loads.required_capacity, s)],
        [
            "Peak-hour capacity (design-day schedule, peak hour x safety)"
            if loads.design_day is not None and loads.design_day.scheduled
            else "Peak-hour capacity (product pull-down, all internal loads on)",
            capacity(loads.peak_capacity, s),
        ],
        [f"Design capacity (the larger; set by the {loads.governed_by})", capacity(loads.design_capacity, s)],
    ]
    w = ctx.width
    widths = [0.46 * w, 0.17 * w, 0.22 * w, 0.15 * w]
    table = grid(rows, widths, align_right=(1, 2, 3), total_rows=(len(rows) - 1,))
    totals_table = grid(totals, [0.63 * w, 0.37 * w], header=False, align_right=(1,), total_rows=(len(totals) - 1,))
    chart = BarChart(bars, w, title="Where the heat comes from (24-hour average)")
    return [
        KeepTogether([heading("Heat load over 24 hours"), table, Spacer(1, 3), totals_table]),
        Spacer(1, 8),
        chart,
    ]


def load_lines_section(ctx: SheetContext, index: int) -> list:
    """Every load line with the working behind it (the audit trail)."""
    room = ctx.result.rooms[index]
    s = ctx.system
    power_unit = "W" if s == "SI" else "Btu/h"
    rows = [["Component", "Item", f"Average, {power_unit}", "Working"]]
    for line in room.loads.lines:
        rows.append(
            [
                line.component,
                line.item,
                q(line.average_power, "power", s, 0).rsplit(" ", 1)[0],
                format_terms(line.basis, s),
            ]
        )
    w = ctx.width
    return [
        heading("Load lines"),
        note("Each line as calculated, with the inputs behind it.",
             ParagraphStyle("tinynext", parent=TINY, keepWithNext=1)),
        Spacer(1, 2),
        grid(rows, [0.13 * w, 0.25 * w, 0.12 * w, 0.50 * w], align_right=(2,), style=CELL_SMALL),
    ]


def duties_section(ctx: SheetContext, index: int) -> list:
    """Required evaporator, condensing-unit and condenser duties with their rating conditions."""
    room = ctx.result.rooms[index]
    cyc = room_cycle(ctx, index)
    s = ctx.system
    cap = capacity(room.loads.design_capacity, s)
    te = temperature(room.evaporating_temperature, s)
    tc = temperature(room.condensing_temperature, s)
    air = temperature(room.condenser_air_temperature, s)
    room_in = ctx.room_input(index)
    room_air = temperature(room_in.temperature, s) if room_in is not None else "the room air"
    system = room_system(ctx, index)
    rows = [
        ["Equipment", "Required duty", "At"],
        ["Evaporator (unit cooler)", cap, f"coil evaporating {te} (dew), air on {room_air}"],
    ]
    if system is not None and len(system.members) > 1:
        others = ", ".join(name for name in system.rooms if name != room.name)
        rows.append(
            [
                f"Condensing unit: system {system.name}",
                capacity(system.design_capacity, s),
                f"shared with {others}; SST {temperature(system.suction_temperature, s)} at the compressor / SCT {tc} (dew)"
                + ("; this coil behind an evaporator pressure regulator" if any(
                    m.regulated for m in system.members if m.room == room.name) else ""),
            ]
        )
    else:
        sst = temperature(system.suction_temperature, s) if system is not None else te
        rows.append(["Condensing unit", cap, f"SST {sst} at the compressor / SCT {tc} (dew), condenser air {air}"])
    if cyc:
        rows.append(["Condenser: heat of rejection", capacity(cyc["condenser_duty_w"], s), f"SCT {tc}, air on {air}"])
    w = ctx.width
    out = [heading("Required equipment duties"), grid(rows, [0.3 * w, 0.22 * w, 0.48 * w], align_right=(1,))]
    if cyc:
        out += [Spacer(1, 4), compressor_figures(ctx, cyc)]
    return [KeepTogether(out)]


def room_warnings_section(ctx: SheetContext, index: int) -> list:
    """Warnings for this room (loads and cycle)."""
    room = ctx.result.rooms[index]
    messages = list(room.loads.warnings) + list(room.warnings)
    if not messages:
        return []
    return [KeepTogether([heading("Warnings"), *warning_box(ctx, messages)])]


#: Project-wide sections, printed first.
PROJECT_SECTIONS: list[Callable[[SheetContext], list]] = [
    title_section,
    blocking_section,
    systems_overview_section,
    selection_summary_section,
    summary_section,
    verdict_section,
    project_warnings_section,
    system_details_section,
    system_cycles_section,
    system_pipework_section,
    selected_equipment_section,
]

#: Sections printed for every room, in order. Insert new ones here.
ROOM_SECTIONS: list[Callable[[SheetContext, int], list]] = [
    room_title_section,
    basis_section,
    loads_section,
    design_day_section,
    duties_section,
    pulldown_section,
    cycle_section,
    existing_unit_section,
    room_warnings_section,
    cautions_section,
    load_lines_section,
]


def build_story(ctx: SheetContext) -> list:
    """All flowables of the sheet: project sections, then each room's sections."""
    story: list = []
    for section in PROJECT_SECTIONS:
        story += section(ctx)
    for index in range(len(ctx.result.rooms)):
        if index > 0 or len(story) > 0:
            story.append(PageBreak())  # each room section starts on a new page
        for section in ROOM_SECTIONS:
            story += section(ctx, index)
    return story


def render_sheet(result: Any, model: Any = None, selection: Any = None) -> bytes:
    """Render the sizing sheet as PDF bytes.

    Parameters
    ----------
    result : ProjectResult
        What to present.
    model : ProjectModel, optional
        The project, for echoing inputs (room temperature and RH).
    selection : tuple of SystemSelection, optional
        Equipment chosen by ``coldroom select`` (page-1 table and "Selected equipment").

    Returns
    -------
    bytes
        The PDF; identical for identical input.
    """
    system = result.unit_system
    pagesize = LETTER if system == "IP" else A4
    margin = 16 * mm
    buffer = io.BytesIO()
    doc = document(
        buffer,
        pagesize,
        margin,
        title=f"Sizing sheet: {result.project_name}",
        author=result.prepared_by or "",
        subject=f"{result.input_file} sha256 {result.input_sha256}",
        creator=f"coldroom {result.versions.get('coldroom', '')}",
    )
    ctx = SheetContext(result=result, model=model, system=system, width=doc.width, selection=selection)
    story = build_story(ctx)
    doc.build(story, canvasmaker=canvas_maker(result, pagesize[0], margin))
    return buffer.getvalue()
