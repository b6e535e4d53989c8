"""The sheet's "pipework and charge" part of a system: line sizes, charge, charge limits.

Presents a :class:`coldroom.design.pipework.Pipework`; computes nothing new. The
sheet's building blocks are imported from :mod:`coldroom.output.pdf.layout` inside
the function, so the sheet can import this module without a cycle.
"""

from __future__ import annotations

from typing import Any

from coldroom.output.pdf.text import clean, q
from coldroom.units import format_terms

PSI = 6894.757293168  # Pa per lbf/in² [ref:nist-sp811]


def _drop(pascal: float, system: str) -> str:
    if system == "IP":
        return f"{pascal / PSI:.2f} psi"
    return f"{pascal / 1e3:.1f} kPa"


def _dt(kelvin: float | None, system: str) -> str:
    if kelvin is None:
        return "–"
    return q(kelvin, "temperature_difference", system, 2)


def pipework_flowables(ctx: Any, pipework: Any, system_name: str) -> list:
    """Flowables for one system's pipework, charge and charge limits.

    Parameters
    ----------
    ctx : coldroom.output.pdf.context.SheetContext
    pipework : coldroom.design.pipework.Pipework
    system_name : str
    """
    from reportlab.platypus import KeepTogether, Spacer

    from coldroom.output.pdf.layout import CELL_SMALL, TINY, grid, heading, note, warning_box

    system = ctx.system
    width = ctx.width
    flow: list = []
    piping = pipework.piping
    if piping is not None:
        rows = [["Line", "Tube", "Run / rise", "Equiv. length", "Velocity", "Drop", "Sat. drop / limit",
                 "Next smaller", "Oil up riser"]]
        for line in piping.lines:
            c = line.chosen
            smaller = line.next_smaller
            if line.oil_return_ok is None:
                oil = "n/a"
            else:
                oil = ("yes" if line.oil_return_ok else "NO") + f" (needs {q(line.oil_minimum_velocity, 'velocity', system, 1)})"
            rows.append([
                line.line,
                c.tube.label,
                f"{q(line.spec.length, 'length', system, 1)} / {q(line.spec.rise, 'length', system, 1)}",
                q(c.equivalent_length, "length", system, 1),
                q(c.velocity, "velocity", system, 2 if system == "SI" else 0),
                _drop(c.pressure_drop, system),
                f"{_dt(c.saturation_temperature_drop, system)} / {_dt(line.limit, system)}"
                + ("" if line.within_limit else " OVER"),
                "–" if smaller is None else f"{smaller.tube.label}: {_dt(smaller.saturation_temperature_drop, system)}",
                oil,
            ])
        w = width / 100.0
        flow.append(KeepTogether([
            heading(f"Pipework - {system_name}"),
            note(
                f"Copper tube {piping.tube_series}: the smallest standard size whose friction drop, as a drop in "
                "saturation temperature, stays within the line's limit (suction 1 K, discharge 1 K, liquid 0.5 K "
                "unless the project says otherwise [trade]). Darcy-Weisbach with the Serghides friction factor; "
                "fittings by the Darby 3-K constants. Oil return checked in risers at "
                f"{piping.minimum_load:.0%} of the design flow (minimum-entrainment criterion, ASHRAE Handbook - "
                "Refrigeration; velocity floor where it does not apply).",
                TINY,
            ),
            grid(rows, [9 * w, 11 * w, 12 * w, 9 * w, 9 * w, 9 * w, 13 * w, 14 * w, 14 * w],
                 align_right=(3, 4, 5), style=CELL_SMALL),
        ]))
        fed = (
            f"The cycle uses these lines: suction-line loss {_dt(pipework.suction_drop, system)} (lowers the "
            f"compressor's suction pressure), discharge-line loss {_dt(pipework.discharge_drop, system)} (raises "
            "its discharge pressure)"
        )
        if pipework.valve_subcooling is not None:
            fed += f"; subcooling left at the expansion valve {_dt(pipework.valve_subcooling, system)}"
        flow.append(note(fed + ".", TINY))
        for text in piping.notes:
            flow.append(note(f"Transport properties - {text}.", TINY))
    else:
        flow.append(heading(f"Pipework - {system_name}"))
        flow.append(note(
            "No piping block in the project: lines not sized, left out of the charge, and the cycle uses the "
            "suction-line drop given in the system settings.", TINY))

    charge = pipework.charge
    rows = [["Charge part", "Mass", "Basis"]]
    for part in charge.parts:
        rows.append([part.part, q(part.mass, "mass", system), clean(format_terms(part.basis, system))])
    if charge.stated:
        rows.append(["total", q(charge.total, "mass", system),
                     f"stated in the project file (the estimate was {q(charge.estimate_total or 0.0, 'mass', system)}); "
                     "the limits judge the stated charge"])
    else:
        rows.append(["total", q(charge.total, "mass", system), "estimate; weigh the actual charge in"])
    flow.append(Spacer(1, 4))
    flow.append(KeepTogether([
        heading(f"Refrigerant charge - {system_name}"),
        grid(rows, [0.2 * width, 0.14 * width, 0.66 * width], align_right=(1,), total_rows=(len(rows) - 1,),
             style=CELL_SMALL),
    ]))

    limit_rows = [["Charge-limit rule", "Charge judged", "Limit", "Verdict"]]
    for limit in pipework.limits:
        limit_rows.append([limit.rule, q(limit.charge, "mass", system),
                           "–" if limit.limit is None else q(limit.limit, "mass", system), limit.verdict])
    defaults = ""
    if pipework.defaults_used:
        defaults = (
            f" The project does not state the {' and the '.join(pipework.defaults_used)}: the most restrictive "
            "(access category a, general occupancy; location class I, refrigerant parts in the occupied space) is "
            "assumed - set charge.occupancy and charge.location_class."
        )
    basis = (
        f"Judged on room {pipework.room} ({q(pipework.room_volume, 'volume', system, 1)}), the cold room being the "
        f"occupied space; access category {pipework.occupancy}, location class {pipework.location}."
        + defaults
    )
    block = [heading(f"Charge limits - {system_name}")]
    if len(limit_rows) > 1:
        block.append(grid(limit_rows, [0.5 * width, 0.13 * width, 0.13 * width, 0.24 * width], align_right=(1, 2),
                          style=CELL_SMALL))
    else:
        block.append(note("No room-volume charge limit applies to this refrigerant and location class.", TINY))
    block.append(note(basis, TINY))
    for limit in pipework.limits:
        block.append(note(f"{limit.rule}: {format_terms(limit.working, system)}", TINY))
    block.append(note(
        "Charge limits recalled from EN 378-1 Annex C, ISO 5149-1 and IEC 60335-2-89, not read from the "
        "standards: verify against the current editions. Local codes and licensed practice govern.", TINY))
    flow.append(Spacer(1, 4))
    flow.append(KeepTogether(block))
    if pipework.warnings:
        flow.extend(warning_box(ctx, list(pipework.warnings)))
    return flow


def system_pipework_section(ctx: Any) -> list:
    """Every system's pipework, charge and charge limits (A1 included), deferring to the codes."""
    # The codes deferred to: [ref:en-378] [ref:iso-5149] [ref:iec-60335-2-89].
    from reportlab.platypus import CondPageBreak

    out: list = []
    for system in getattr(ctx.result, "systems", ()):
        works = getattr(system, "pipework", None)
        if works is None:
            continue
        out.append(CondPageBreak(220))
        out += pipework_flowables(ctx, works, system.name)
    return out
