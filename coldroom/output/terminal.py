"""What the terminal shows: tables and summaries of ``load``, ``size``, ``check``, ``cycle`` and ``compare``.

Presents results in the project's unit system and computes nothing new; no
heavy imports (CoolProp, reportlab).
"""

from __future__ import annotations

from typing import TYPE_CHECKING, Any, Optional, Sequence

from coldroom.constants import SECONDS_PER_DAY_S
from coldroom.results import COMPONENTS, RoomLoads, Term

if TYPE_CHECKING:  # pragma: no cover
    from coldroom.results import SystemResult
from coldroom.units import (
    display,
    format_capacity,
    format_electrical,
    format_money,
    format_number,
    format_temperature,
    format_terms,
)


def table(headers: Sequence[str], rows: Sequence[Sequence[str]], align: str | None = None) -> str:
    """A simple aligned table: *align* is one character per column, ``l`` or ``r``.

    Examples
    --------
    >>> print(table(["a", "bb"], [["x", "1"], ["yy", "22"]], "lr"))
    a   bb
    --  --
    x    1
    yy  22
    """
    align = align or "l" + "r" * (len(headers) - 1)
    widths = [max(len(str(h)), *(len(str(r[i])) for r in rows)) if rows else len(str(h)) for i, h in enumerate(headers)]

    def line(cells: Sequence[str]) -> str:
        out = []
        for cell, width, a in zip(cells, widths, align):
            out.append(str(cell).rjust(width) if a == "r" else str(cell).ljust(width))
        return "  ".join(out).rstrip()

    rule = "  ".join("-" * w for w in widths)
    return "\n".join([line(headers), rule, *(line(r) for r in rows)])


def room_load_table(loads: RoomLoads, system: str) -> str:
    """The component table of one room with its totals."""
    total = loads.daily_energy
    unit = "Btu/h" if system == "IP" else "W"
    rows = []
    for component in COMPONENTS:
        energy = loads.component_energy(component)
        share = 100.0 * energy / total if total else 0.0
        average = display(energy / SECONDS_PER_DAY_S, "power", system, digits=0).rsplit(" ", 1)[0]
        rows.append([component, format_number(energy / 3.6e6, 1), average, f"{share:.1f}"])
    rows.append(["total", format_number(total / 3.6e6, 1), display(total / SECONDS_PER_DAY_S, "power", system, digits=0).rsplit(" ", 1)[0], "100.0"])
    body = table(["component", "kWh/day", f"average {unit}", "share %"], rows, "lrrr")
    run_h = loads.run_time / 3600.0
    footer = [
        f"run time {run_h:g} h/day ({loads.run_time_basis}), safety factor {loads.safety_factor:.0%}",
        f"required capacity   {format_capacity(loads.required_capacity, system, fixed=False)}",
        f"peak-hour capacity  {format_capacity(loads.peak_capacity, system, fixed=False)}"
        + (
            f"   (design-day schedule, peak hour {loads.design_day.peak_hour:02d}:00)"
            if loads.design_day is not None and loads.design_day.scheduled
            else "   (product at pull-down rate, all internal loads on)"
        ),
        f"design capacity     {format_capacity(loads.design_capacity, system, fixed=False)}   (set by the {loads.governed_by})",
    ]
    return body + "\n" + "\n".join(footer)


def loads_report(rooms: Sequence[RoomLoads], system: str, temperatures: Sequence[float]) -> str:
    """The terminal output of ``coldroom load``."""
    parts = []
    for loads, temperature in zip(rooms, temperatures):
        title = f"{loads.name}  ({display(temperature, 'temperature', system)}, {display(loads.volume, 'volume', system)})"
        parts.append(title + "\n" + room_load_table(loads, system))
        for warning in loads.warnings:
            parts.append(f"  warning: {format_terms(warning, system)}")
    return "\n\n".join(parts)


def systems_report(systems: Sequence["SystemResult"], system: str) -> str:
    """The per-system table of ``coldroom size``: one row per system, a total row, then each system's working."""
    rows = []
    for s in systems:
        e = s.electrical
        rows.append(
            [
                s.name,
                ", ".join(s.rooms),
                s.refrigerant,
                f"{format_temperature(s.suction_temperature, system)} / {format_temperature(s.condensing_temperature, system)}",
                format_capacity(s.design_capacity, system, fixed=False),
                format_electrical(e.compressor_input_power),
                format_capacity(s.heat_of_rejection, system, fixed=False),
                format_electrical(e.connected_load),
                format_number(e.daily_energy / 3.6e6, 1),
            ]
        )
    if len(systems) > 1:
        rows.append(
            [
                "total",
                "",
                "",
                "",
                format_capacity(sum(s.design_capacity for s in systems), system, fixed=False),
                format_electrical(sum(s.electrical.compressor_input_power for s in systems)),
                format_capacity(sum(s.heat_of_rejection for s in systems), system, fixed=False),
                format_electrical(sum(s.electrical.connected_load for s in systems)),
                format_number(sum(s.electrical.daily_energy for s in systems) / 3.6e6, 1),
            ]
        )
    headers = ["system", "rooms", "refrigerant", "SST / SCT", "capacity", "compressor", "rejection", "connected", "kWh/day"]
    lines = [table(headers, rows, "llllrrrrr")]
    for s in systems:
        e = s.electrical
        if len(s.members) > 1:
            coils = "; ".join(
                f"{m.room} {format_temperature(m.evaporating_temperature, system)} {format_capacity(m.duty, system, fixed=False)}"
                + (" behind an EPR" if m.regulated else "")
                for m in s.members
            )
            lines.append(f"{s.name}: coils {coils}; vapour mixed into the suction")
        case = (
            f"defrost: heaters {format_electrical(e.defrost_heater_power)} + evaporator fans "
            f"{format_electrical(e.evaporator_fan_power)} + other heaters {format_electrical(e.other_heater_power)}"
            if e.connected_load_case == "defrost"
            else f"{e.connected_load_case}: its defrost heaters + heaters + compressor + condenser fans + the other "
            "rooms' evaporator fans"
            if e.connected_load_case.startswith("defrost of ")
            else f"refrigerating: compressor {format_electrical(e.compressor_input_power)} + condenser fans "
            f"{format_electrical(e.condenser_fan_power)} + evaporator fans {format_electrical(e.evaporator_fan_power)}"
            f" + heaters {format_electrical(e.other_heater_power)}"
        )
        lines.append(
            f"{s.name}: connected load {format_electrical(e.connected_load)} ({case}); compressor runs "
            f"{e.compressor_run_time / 3600:.1f} h/day"
        )
        works = getattr(s, "pipework", None)
        if works is not None:
            tubes = ""
            if works.piping is not None:
                tubes = "lines " + ", ".join(
                    f"{line.line} {line.chosen.tube.label} "
                    f"({display(line.chosen.saturation_temperature_drop, 'temperature_difference', system, 2)})"
                    for line in works.piping.lines
                ) + "; "
            verdicts = "; ".join(f"{limit.verdict}" + (
                f" (limit {display(limit.limit, 'mass', system)})" if limit.limit is not None else "")
                for limit in works.limits)
            lines.append(
                f"{s.name}: {tubes}"
                + (f"charge {display(works.charge.total, 'mass', system)} (stated)" if works.charge.stated
                   else f"charge about {display(works.charge.total, 'mass', system)} (estimate)")
                + (f"; charge limits: {verdicts}" if verdicts else "")
            )
    return "\n".join(lines)


def compare_rows(comparison: Any, system: str) -> tuple[list[str], list[list[str]]]:
    """Headers and rows of the options table (terminal and PDF share them): one row per option."""
    base = comparison.options[0]
    headers = [
        "option", "feasible", "refrigerant (class)", "design capacity", "compressor input", "kWh/year", "cost/year",
        "charge", "GWP", "TEWI t CO2e (direct + indirect)", "vs base: cost/year", "vs base: TEWI t",
    ]
    rows = []
    for o in comparison.options:
        cur = o.currency
        refrigerants = ", ".join(
            f"{s.refrigerant} ({s.safety_class})"
            for s in {s.refrigerant: s for s in o.systems}.values()
        )
        t = o.tewi
        tewi_text = (
            "n/a (no charge)" if t is None
            else f"{t.total / 1000:.1f} ({(t.direct_leakage + t.direct_end_of_life) / 1000:.1f} + {t.indirect / 1000:.1f})"
        )
        if o is base:
            d_cost = d_tewi = "–"
        elif not o.feasible:  # never read as better: it cannot be built as written
            d_cost = d_tewi = "n/a: not feasible"
        else:
            d_cost = f"{o.annual_cost - base.annual_cost:+,.0f} {cur}"
            d_tewi = (
                f"{(t.total - base.tewi.total) / 1000:+.1f}" if t is not None and base.tewi is not None else "n/a"
            )
        rows.append([
            o.name,
            "yes" if o.feasible else f"NO ({len(o.blocking)} blocking)",
            refrigerants,
            display(o.design_capacity, "power_large", system) if system == "SI" else display(o.design_capacity, "power", system),
            display(o.compressor_input_power, "power_large", "SI"),
            f"{o.annual_energy:,.0f}",
            f"{o.annual_cost:,.0f} {cur}",
            "n/a" if o.charge is None else display(o.charge, "mass", system),
            "n/a" if o.gwp is None else f"{o.gwp:,.0f}",
            tewi_text,
            d_cost,
            d_tewi,
        ])
    return headers, rows


def compare_text(comparison: Any, system: str) -> str:
    """The terminal view of ``coldroom compare``: basis lines, the options table, warnings."""
    base = comparison.options[0]
    econ = base.economics
    marked = set(econ.get("defaulted", ()))

    def m(key: str, text: str) -> str:
        return text + (" (default)" if key in marked else "")

    lines = [
        f"{comparison.project_name}: options compared over a year",
        f"ambient: {comparison.ambient_source}, {len(comparison.bins)} bins, "
        f"{sum(b.hours for b in comparison.bins):,.0f} h",
        *(f"ambient of option {o.name}: {o.ambient_source}, {len(o.bins)} bins, {sum(b.hours for b in o.bins):,.0f} h"
          for o in comparison.options if o.ambient_source),
        "economics: "
        + ", ".join([
            m("electricity_price", f"{econ['electricity_price']:g} {econ['currency']}/kWh"),
            m("emission_factor", f"{econ['emission_factor']:g} kg CO2e/kWh"),
            m("service_life", f"{econ['service_life']:g} years"),
            m("leakage_rate", f"leakage {econ['leakage_rate']:.0%}/year"),
            m("recovery_factor", f"recovery {econ['recovery_factor']:.0%}"),
        ])
        + "; GWP AR4 (IPCC 2007, 100 years)",
        "",
    ]
    headers, rows = compare_rows(comparison, system)
    lines.append(table(headers, rows, "lllrrrrrrrrr"))
    notes = blocking_notes(comparison)
    notes += [condenser_air_note(comparison)]
    notes += [f"{o.name}: {o.note}" for o in comparison.options if o.note and o.name != "base"]
    notes += charge_notes(comparison)
    for o in comparison.options:
        notes.extend(f"warning: {o.name}: {w}" for w in o.warnings)
    if notes:
        lines += [""] + notes
    return "\n".join(lines)


def condenser_air_note(comparison: Any) -> str:
    """How the condenser air moves over the year, per system (each option's systems share the project's basis)."""
    by_basis: dict[str, list[str]] = {}
    for o in comparison.options:
        for s in o.systems:
            names = by_basis.setdefault(s.condenser_air_basis, [])
            if s.name not in names:
                names.append(s.name)
    parts = []
    for basis, names in by_basis.items():
        how = (
            "the condensing temperature stays at its design value" if basis.startswith("fixed")
            else "keeping its design-day offset above the outdoor air; condensing floats down to the minimum "
            "condensing temperature"
        )
        parts.append(f"condenser air {basis} ({', '.join(names)}): {how}")
    text = "; ".join(parts)
    return text[:1].upper() + text[1:] + "." if text else ""


def blocking_notes(comparison: Any) -> list[str]:
    """One line per reason an option cannot be built as written (terminal and PDF share them)."""
    return [f"NOT FEASIBLE: {o.name}: {reason}" for o in comparison.options for reason in o.blocking]


def charge_notes(comparison: Any) -> list[str]:
    """Where the charges came from, said once for all options that share a basis."""
    by_basis: dict[str, list[str]] = {}
    for o in comparison.options:
        for s in o.systems:
            by_basis.setdefault(s.charge_basis, [])
            if o.name not in by_basis[s.charge_basis]:
                by_basis[s.charge_basis].append(o.name)
    everyone = len(comparison.options)
    out = []
    for basis, names in by_basis.items():
        who = "every option" if len(names) == everyone else ", ".join(names)
        out.append(f"charge {basis}: {who}" + ("; give charge: for the real figure" if basis.startswith("estimated") else ""))
    return out


def selection_report(selections: Sequence[object], system: str) -> str:
    """The equipment chosen per system (``coldroom select``): coils, unit, balance, prices, alternatives."""
    from coldroom.design.selection import REASONS_COOLER, REASONS_UNIT

    def t(x: object) -> str:
        return format_temperature(x, system, missing="-")  # type: ignore[arg-type]

    lines: list[str] = []
    grand = 0.0
    currency = ""
    for s in selections:
        currency = s.currency  # type: ignore[attr-defined]
        c = s.choice.check  # type: ignore[attr-defined]
        lines.append(f"System {s.system} ({s.refrigerant}): needs {format_capacity(s.required_capacity, system, fixed=False)} "  # type: ignore[attr-defined]
                     f"in {s.run_hours_available:.1f} h/day at {t(s.ambient_temperature)} condenser air")  # type: ignore[attr-defined]
        rows = []
        for k in s.coolers:  # type: ignore[attr-defined]
            rows.append([k.room, f"{k.count} × {k.model}", format_capacity(k.duty, system, fixed=False), format_capacity(k.capacity, system, fixed=False),
                         format_money(k.price, currency)])
        rows.append(["condensing unit", s.choice.model, format_capacity(s.required_capacity, system, fixed=False),  # type: ignore[attr-defined]
                     format_capacity(c.capacity_at_balance, system, fixed=False), format_money(s.choice.price, currency)])  # type: ignore[attr-defined]
        rows.append(["total", "", "", "", format_money(s.total_price, currency)])  # type: ignore[attr-defined]
        lines.append(table(["item", "model", "duty", "capacity", "price"], rows, "llrrr"))
        holds = (f"holds up to {t(c.max_ambient)} condenser air" if c.max_ambient_status == "found"
                 else {"holds_above_range": "holds over the whole range searched (10…55 °C)"}.get(c.max_ambient_status, ""))
        lines.append(f"  balance: SST {t(c.balance_evaporating)} / SCT {t(c.balance_condensing)}, run "
                     f"{c.run_hours_needed:.1f} h/day of {c.run_hours_available:.1f}, margin {c.margin_percent:+.0f} %"
                     + (f"; {holds}" if holds else ""))
        for k in s.coolers:  # type: ignore[attr-defined]
            lines.append(f"  {k.room}: {k.rule}")
        for a in s.alternatives:  # type: ignore[attr-defined]
            ac = a.check
            lines.append(f"  alternative: {a.model}, total {format_money(s.total_price_with(a), currency)}; SST "  # type: ignore[attr-defined]
                         f"{t(ac.balance_evaporating)}, margin {ac.margin_percent:+.0f} %")
        if s.rejected:  # type: ignore[attr-defined]
            lines.append("  condensing units not chosen: " + ", ".join(
                f"{n} {REASONS_UNIT.get(r, r)}" for r, n in s.rejected.items()))  # type: ignore[attr-defined]
        for k in s.coolers:  # type: ignore[attr-defined]
            if k.rejected:
                lines.append(f"  unit coolers not used in {k.room}: " + ", ".join(
                    f"{n} {REASONS_COOLER.get(r, r)}" for r, n in k.rejected.items()))
        for w in s.warnings:  # type: ignore[attr-defined]
            lines.append(f"  WARNING: {format_terms(w, system)}")
        lines.append("")
        grand += s.total_price  # type: ignore[attr-defined]
    if len(selections) > 1:
        lines.append(f"Total for the project: {format_money(grand, currency)}")
    return "\n".join(lines).rstrip()


def blocking_verdicts(result: Any) -> list:
    """Every verdict that blocks the job as sized (Notes, SI wording): the sheet's page 1 and the terminal.

    A charge over a charge limit (stated or estimated), an existing unit that does not hold or is not
    suitable, a pull-down that does not meet a product's asked time (design unit or existing unit).
    Computes nothing: reads the result.
    """
    from coldroom.results import Note

    out: list = []
    for system in getattr(result, "systems", ()) or ():
        works = getattr(system, "pipework", None)
        if works is None:
            continue
        how = "stated" if works.charge.stated else "estimated"
        for limit in works.limits:
            if limit.verdict == "within":
                continue
            out.append(Note.fill(
                f"{system.name}: {how} charge {{m}} against {limit.rule}: {limit.verdict.upper()} (limit {{lim}})",
                m=(limit.charge, "mass"), lim=(limit.limit or 0.0, "mass"),
            ))
    for room in result.rooms:
        check = getattr(room, "check", None)
        if check is not None and not check.holds:
            out.append(Note(f"{room.name}: existing unit {check.name}: {check.verdict}"))
        runs = [("design unit", getattr(room, "pulldown", None))]
        limits = getattr(room, "limits", None)
        if limits is not None:
            runs.append(("existing unit", limits.pulldown))
        for unit, run in runs:
            if run is None:
                continue
            for product in run.products:
                if product.met:
                    continue
                reached = (
                    f"reaches it in {product.time_to_final / 3600.0:.1f} h" if product.time_to_final is not None
                    else f"not within {run.duration / 3600.0:.0f} h"
                )
                out.append(Note(
                    f"{room.name}: pull-down NOT MET with the {unit}: {product.name} asked "
                    f"{(product.asked_time or 0.0) / 3600.0:g} h, {reached}"
                ))
    return out


def size_summary(result: Any, model: Any) -> str:
    """The terminal summary of ``coldroom size`` (presents the result, computes nothing)."""
    from coldroom.output.pdf.text import capacity, q, temperature

    s = result.unit_system
    lines = [f"{result.project_name}  ({result.date}, {s} units)"]
    lines += [f"BLOCKING: {format_terms(v, s)}" for v in blocking_verdicts(result)]
    for room, room_in in zip(result.rooms, model.rooms):
        loads = room.loads
        lines.append("")
        lines.append(f"{room.name}  ({temperature(room_in.temperature, s)}, {room_in.rh:.0%} RH)")
        lines.append(
            f"  required capacity   {capacity(loads.required_capacity, s)} (24 h)   "
            f"design {capacity(loads.design_capacity, s)} (set by the {loads.governed_by})"
        )
        lines.append(
            f"  evaporating / condensing (dew)   {temperature(room.evaporating_temperature, s)} / "
            f"{temperature(room.condensing_temperature, s)}   condenser air {temperature(room.condenser_air_temperature, s)}"
        )
        if room.cycle is not None:
            c = room.cycle.to_json()
            lines.append(
                f"  {c['refrigerant']}: mass flow {q(c['mass_flow_kg_s'], 'mass_flow', s)}   "
                f"displacement {q(c['displacement_m3_h'] / 3600.0, 'volume_flow', s)}   "
                f"compressor input {capacity(c['compressor_power_w'], s)}"
            )
            lines.append(
                f"  heat of rejection {capacity(c['condenser_duty_w'], s)}   COP {c['cop']:.2f}   "
                f"discharge {temperature(c['discharge_temperature_c'], s)}"
            )
        if room.check is not None:
            k = room.check
            at_balance = capacity(k.capacity_at_balance, s) if k.capacity_at_balance is not None else "n/a"
            lines.append(
                f"  existing unit: {k.verdict}; {at_balance} at balance vs "
                f"{capacity(k.required_capacity, s)} required; see `coldroom check`"
            )
        for message in list(loads.warnings) + list(room.warnings):
            lines.append(f"  warning: {format_terms(message, s)}")
    if result.systems:
        lines += [
            "",
            "Systems: design capacity, SST / SCT (dew), compressor electrical input, heat of rejection, "
            "connected load, electricity per day",
        ]
        lines.append(systems_report(result.systems, s))
        for system in result.systems:
            if len(system.members) > 1:  # a one-room system's warnings are the room's, printed above
                lines += [f"warning: {format_terms(message, s)}" for message in system.warnings]
    for message in result.warnings:
        lines.append(f"warning: {format_terms(message, s)}")
    return "\n".join(lines)


def cycle_table(result: Any) -> str:
    """Readable table of a CycleResult for ``coldroom cycle`` (display units: kPa, kJ/kg, kW, m³/h)."""
    lines = []
    r = result
    high = (
        f"gas cooler outlet {r.gas_cooler_outlet_temperature:.1f} °C (transcritical)"
        if r.transcritical
        else f"condensing {r.condensing_temperature:.1f} °C (dew)"
    )
    lines.append(f"{r.refrigerant}  [{r.safety_class}, GWP {r.gwp_ar4:g} AR4]  {r.property_model}")
    lines.append(
        f"evaporating {r.evaporating_temperature:.1f} °C (dew), {high}; capacity {r.capacity / 1e3:.3f} kW"
    )
    lines.append(
        f"superheat {r.superheat:g} K (+ {r.suction_line_superheat:g} K suction line), subcooling {r.subcooling:g} K, "
        f"isentropic efficiency {r.isentropic_efficiency:g}, clearance {r.clearance:g}"
    )
    lines.append("")
    lines.append(f"{'state':<26}{'p kPa':>10}{'t °C':>9}{'h kJ/kg':>10}{'s kJ/kg·K':>11}{'quality':>9}")
    labels = ("1 compressor suction", "2 compressor discharge", "3 condenser outlet", "4 evaporator inlet")
    for label, s in zip(labels, r.states):
        q = "-" if s.quality is None else f"{s.quality:.3f}"
        lines.append(f"{label:<26}{s.p / 1e3:>10.1f}{s.t:>9.1f}{s.h / 1e3:>10.2f}{s.s / 1e3:>11.4f}{q:>9}")
    lines.append("")
    rows = [
        ("refrigerating effect", f"{r.refrigerating_effect / 1e3:.2f} kJ/kg"),
        ("mass flow", f"{r.mass_flow * 3600:.2f} kg/h  ({r.mass_flow * 1e3:.3f} g/s)"),
        ("suction volume flow", f"{r.suction_volume_flow * 3600:.3f} m³/h"),
        ("volumetric efficiency", f"{r.volumetric_efficiency:.3f}"),
        ("displacement", f"{r.displacement * 3600:.3f} m³/h"),
        ("compressor power", f"{r.compressor_power / 1e3:.3f} kW"),
        ("condenser duty (THR)", f"{r.condenser_duty / 1e3:.3f} kW"),
        ("COP", f"{r.cop:.2f}  (Carnot {r.carnot_cop:.2f}, ratio {r.carnot_ratio:.2f})"),
        ("discharge temperature", f"{r.discharge_temperature:.1f} °C"),
        ("pressure ratio", f"{r.pressure_ratio:.2f}"),
        ("glide evaporator / condenser", f"{r.glide_evaporator:.2f} K / "
         + ("-" if r.glide_condenser is None else f"{r.glide_condenser:.2f} K")),
    ]
    if r.suction_line_heat_gain:
        rows.insert(7, ("suction-line heat gain", f"{r.suction_line_heat_gain / 1e3:.3f} kW"))
    width = max(len(k) for k, _ in rows)
    lines.extend(f"{k:<{width}}  {v}" for k, v in rows)
    for w in r.warnings:
        lines.append(f"warning: {w}")
    return "\n".join(lines)


def check_report(model: Any, checks: Sequence[tuple[RoomLoads, Any]], limits: Optional[Sequence[Any]] = None) -> str:
    """The terminal output of ``coldroom check``: the verdict per room in the project's unit system,
    with what the unit can still do (*limits*: :class:`coldroom.design.unit_limits.UnitLimits` per room, or None)."""
    from coldroom.rules import AMBIENT_SWEEP

    system = model.project.units
    low, high = AMBIENT_SWEEP
    sweep = format_terms((Term(low, "temperature:bare", sep=""), "…", Term(high, "temperature", sep="")), system)

    def t(x):  # type: ignore[no-untyped-def]
        return format_temperature(x, system, missing="-")

    def q(x):  # type: ignore[no-untyped-def]
        if x is None:
            return "-"
        if system == "IP":  # Btu/h with tons beside it, as IP contractors read capacities
            return f"{display(x, 'power', system)} ({display(x, 'power_large', system)})"
        return display(x, "power_large", system)

    def electric(x):  # type: ignore[no-untyped-def]
        return "-" if x is None else display(x, "power_large", "SI")  # electrical input in kW in both systems

    lines = [f"{model.project.name}: existing-unit check"]
    for k, (loads, check) in enumerate(checks):
        limit = limits[k] if limits is not None else None
        lines.append("")
        lines.append(f"Room: {loads.name}")
        if check is None:
            lines.append("  no existing unit given")
            continue
        c = check
        lines.append(f"  unit: {c.name} ({c.refrigerant}, {c.model} model)")
        if limit is not None and limit.medium_at_low is not None:  # said first, before the margin
            lines.append(f"  FIRST: {format_terms(limit.medium_at_low, system)}")
        lines.append(f"  verdict: {c.verdict}")
        lines.append(f"  room {t(c.room_temperature)}, condenser air {t(c.ambient_temperature)}")
        lines.append(f"  balance: evaporating {t(c.balance_evaporating)} / condensing {t(c.balance_condensing)} (dew)")
        lines.append(f"  capacity at balance   {q(c.capacity_at_balance)}")
        lines.append(
            f"  required capacity     {q(c.required_capacity)}  "
            f"((1 + {c.safety_factor:.0%}) × daily load / {c.run_hours_available:.1f} h)"
        )
        if c.run_hours_needed is not None:
            lines.append(
                f"  run time needed       {c.run_hours_needed:.1f} h/day of {c.run_hours_available:.1f} h allowed; "
                f"margin {c.margin_percent:+.0f} %"
            )
        if c.power_at_balance is not None:
            t2 = "-" if c.discharge_temperature is None else t(c.discharge_temperature)
            lines.append(
                f"  power {electric(c.power_at_balance)}, heat rejection {q(c.heat_rejection_at_balance)}, "
                f"discharge about {t2}, pressure ratio {c.pressure_ratio:.1f}"
            )
        if c.max_ambient_status == "found":
            lines.append(f"  holds up to a condenser air of {t(c.max_ambient)}")
        elif c.max_ambient_status == "holds_above_range":
            lines.append(f"  holds over the whole ambient range searched ({sweep})")
        elif c.max_ambient_status == "fails_below_range":
            lines.append(f"  does not hold at any ambient in the range searched ({sweep})")
        lines.append(f"  evaporator: {format_terms(c.evaporator_basis, system)}")
        lines.append(f"  condenser: {format_terms(c.condenser_basis, system)}")
        for note in c.compressor_basis:
            lines.append(f"  compressor: {format_terms(note, system)}")
        for warning in c.warnings:
            lines.append(f"  WARNING: {format_terms(warning, system)}")
        if limit is not None:
            lines.append(f"  why: {format_terms(limit.reason(), system)}")
            if limit.coldest_status == "found":
                lines.append(f"  coldest room it holds   {t(limit.coldest_room_temperature_held)}")
            elif limit.coldest_status == "never":
                lines.append("  coldest room it holds   none in the room range")
            else:
                lines.append(f"  coldest room it holds   below {t(limit.coldest_room_temperature_held)}")
            if limit.max_daily_intake is not None:
                lines.append(
                    f"  largest daily intake    {display(limit.max_daily_intake, 'mass', system, digits=0)}/day "
                    f"at {t(limit.room_temperature)}"
                )
            lines.append(
                f"  replacement duty        {q(limit.replacement_capacity)} at SST {t(limit.replacement_evaporating)}"
                f" / SCT {t(limit.replacement_condensing)}"
            )
            pull = limit.pulldown
            if pull is not None:
                reached = (
                    f"{pull.hours_to_final:.1f} h" if pull.hours_to_final is not None
                    else f"not within {pull.duration / 3600:g} h"
                )
                lines.append(f"  pull-down after a delivery with this unit: {reached}; highest room air "
                             f"{t(pull.highest_air_temperature)}, {pull.hours_above_setpoint_plus_2k:.1f} h more than "
                             "2 K above the set point")
                for p in pull.missed():  # each product with its own asked time
                    got = "not reached" if p.time_to_final is None else f"{p.time_to_final / 3600:.1f} h"
                    lines.append(f"  pull-down NOT MET: {p.name}: {got}, asked {(p.asked_time or 0.0) / 3600:g} h")
            for sentence in limit.remedies():
                if sentence is not limit.medium_at_low:
                    lines.append(f"  - {format_terms(sentence, system)}")
    return "\n".join(lines)
