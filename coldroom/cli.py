"""Command-line interface (typer).

Thin: parse arguments, call the library, print, map :class:`ColdroomError` to
exit codes. Heavy modules (CoolProp via ``coldroom.physics.refrigerant``, reportlab via
``coldroom.output.pdf``) are imported inside the commands that need them, never at
module level, so ``coldroom --help`` and ``coldroom validate`` stay fast.

Exit codes: 0 ok; 1 calculation impossible; 2 usage; 65 invalid project file;
73 cannot write output.
"""

from __future__ import annotations

import sys
from typing import Callable, Optional

import typer

from coldroom import __version__
from coldroom.rules import CYCLE_DEFAULTS as _CYCLE
from coldroom.errors import ColdroomError

app = typer.Typer(
    name="coldroom",
    help="Heat loads and refrigeration-cycle sizing for walk-in coolers and freezers.",
    add_completion=False,
    no_args_is_help=True,
    pretty_exceptions_enable=False,
    # plain help and usage errors: the rich formatter (rich + markdown-it) costs
    # more to import than typer itself
    rich_markup_mode=None,
)


from coldroom.cli_runtime import (  # noqa: F401  (the commands below use these)
    fail,
    Stopped,
    _stop,
    install_signal_handlers,
    reading,
    _inputs,
    _silence_stdout,
    _Stdout,
    guarded,
    interrupted,
    check_outputs,
    console_for,
    say,
    write_output,
    emit_json,
    _written,
    _read,
)

 
def version_callback(value: bool) -> None:
    if value:
        print(f"coldroom {__version__}")
        raise typer.Exit()


@app.callback()
def _root(
    version: Optional[bool] = typer.Option(
        None, "--version", callback=version_callback, is_eager=True, help="Print the version and exit."
    ),
) -> None:
    """Heat loads and refrigeration-cycle sizing for walk-in coolers and freezers."""
    if not isinstance(sys.stdout, _Stdout):
        sys.stdout = _Stdout(sys.stdout)  # type: ignore[assignment]


# --- commands -------------------------------------------------------------
# Each command lives in its own block below; keep imports of heavy modules
# inside the command body.


@app.command("validate")
def validate_command(
    project: str = typer.Argument(..., help="Project file (YAML)."),
) -> None:
    """Check a project file: syntax, keys, units, ranges and physical sense."""

    def run() -> None:
        from coldroom.inputs.physical_checks import project_warnings
        from coldroom.inputs.opening import open_project

        model = open_project(project).model
        rooms = ", ".join(room.name for room in model.rooms)
        say(f"{project}: valid ({len(model.rooms)} room{'s' if len(model.rooms) != 1 else ''}: {rooms})")
        from coldroom.units import format_terms

        for key, message in project_warnings(model):
            say(f"{project}: warning: {key}: {format_terms(message, model.project.units)}", file=sys.stderr)

    guarded(run)


@app.command("load")
def load_command(
    project: str = typer.Argument(..., help="Project file (YAML)."),
    json_out: Optional[str] = typer.Option(
        None, "--json", help="Also write the result as JSON to FILE ('-' for stdout).", metavar="FILE"
    ),
    force: bool = typer.Option(False, "--force", help="Overwrite an existing JSON file."),
) -> None:
    """Each room's 24-hour heat load, component by component, and the required capacity."""

    def run() -> None:
        (json_target,) = check_outputs(("--json", json_out), force=force, project=project)

        from coldroom.inputs.physical_checks import project_warnings
        from coldroom.loads import project_loads
        from coldroom.inputs.opening import open_project
        from coldroom.output.terminal import loads_report
        from coldroom.units import format_terms
        from coldroom.output.json_contract import load_body

        opened = open_project(project)
        model = opened.model
        reading(*opened.inputs)
        (json_target,) = check_outputs(("--json", json_out), force=force, project=project)
        rooms = project_loads(model)
        warnings = [message for _, message in project_warnings(model)]
        out = console_for(json_target)
        say(loads_report(rooms, model.project.units, [r.temperature for r in model.rooms]), file=out)
        for message in warnings:
            say(f"warning: {format_terms(message, model.project.units)}", file=out)
        emit_json("load", lambda: load_body(rooms, warnings), json_target, force=force, project=project,
                  model=model, content=opened.content, console=out)

    guarded(run)


@app.command("schema")
def schema_command(
    catalogue: bool = typer.Option(False, "--catalogue", help="The schema of an equipment catalogue instead."),
    result: Optional[str] = typer.Option(
        None, "--result", metavar="COMMAND",
        help="The schema of COMMAND's --json output instead (load, size, check, select, compare, cycle, quote).",
    ),
) -> None:
    """Print the JSON Schema of the project file (or of a catalogue; for editors that complete and check YAML)."""

    def run() -> None:
        from coldroom.output.files import json_text

        if result is not None:
            from coldroom.errors import UsageError
            from coldroom.output.json_contract import COMMANDS

            if catalogue:
                raise UsageError("give --catalogue or --result, not both")
            if result not in COMMANDS:
                raise UsageError(f"--result {result!r}: give one of {', '.join(COMMANDS)}")
            from coldroom.output.json_schema import result_schema

            sys.stdout.write(json_text(result_schema(result)))
            return
        if catalogue:
            from coldroom.inputs.catalogue import json_schema
        else:
            from coldroom.inputs.projectfile import json_schema

        sys.stdout.write(json_text(json_schema()))

    guarded(run)


@app.command("new")
def new_command(
    file: str = typer.Argument(..., help="Where to write the starter project file."),
    force: bool = typer.Option(False, "--force", help="Overwrite an existing file."),
) -> None:
    """Write a commented starter project file to edit."""

    def run() -> None:
        from importlib.resources import files

        from coldroom.output.files import write_atomic

        text = files("coldroom.data").joinpath("starter.yaml").read_text(encoding="utf-8")
        write_atomic(file, text, force=force, option="FILE")
        say(f"wrote {file}; edit it, then run: coldroom validate {file}")

    guarded(run)


@app.command("serve")
def serve_command(
    project: Optional[str] = typer.Argument(None, help="Project file (YAML); without it, the starter of 'new'."),
    port: int = typer.Option(8765, "--port", help="Port on 127.0.0.1 (0: any free port).", min=0, max=65535),
    host: str = typer.Option("127.0.0.1", "--host", help="127.0.0.1 or localhost; nothing else is accepted."),
    no_browser: bool = typer.Option(False, "--no-browser", help="Do not open the page in a browser."),
) -> None:
    """Edit the project file beside its answers in a local browser page (needs the serve extra)."""

    def run() -> None:
        from coldroom.serve.run import serve  # starlette and uvicorn, lazily

        serve(project, port=port, host=host, browser=not no_browser)

    guarded(run)


# --- products (product table listing) ---------------------------------------


@app.command("products")
def products_command(
    text: Optional[str] = typer.Argument(
        None, help="Search text: substring of key, name, alias or category (all products if omitted)."
    ),
) -> None:
    """List or search the product table: freezing point, storage temperature and RH."""

    def run() -> None:
        from coldroom.physics.products import search_products

        found = search_products(text)
        if not found:
            print(f"no product matches {text!r}", file=sys.stderr)
            raise typer.Exit(code=1)
        header = ("key", "name", "category", "t_f °C", "storage °C", "RH %")
        rows = []
        for p in found:
            lo, hi = p.storage_temperature
            rh = "-" if p.storage_humidity is None else f"{p.storage_humidity[0]:g}-{p.storage_humidity[1]:g}"
            rows.append((p.key, p.name, p.category, f"{p.freezing_point:g}", f"{lo:g} … {hi:g}", rh))
        widths = [max(len(str(r[i])) for r in (header, *rows)) for i in range(len(header))]
        for row in (header, *rows):
            print("  ".join(str(c).ljust(w) for c, w in zip(row, widths)).rstrip())

    guarded(run)


# --- size (loads + cycle per room → PDF sizing sheet and JSON) ---------------------------


@app.command("size")
def size_command(
    project: str = typer.Argument(..., help="Project file (YAML)."),
    out: Optional[str] = typer.Option(
        None, "--out", help="PDF sizing sheet to write (default: PROJECT.pdf beside the input).", metavar="FILE.pdf"
    ),
    json_out: Optional[str] = typer.Option(
        None, "--json", help="Also write the result as JSON to FILE ('-' for stdout).", metavar="FILE"
    ),
    force: bool = typer.Option(False, "--force", help="Overwrite existing output files."),
) -> None:
    """Size every room: loads, design temperatures, cycle; write the PDF sizing sheet (and JSON)."""

    def run() -> None:
        from pathlib import Path

        from coldroom.inputs.opening import open_project

        source = Path(project)
        pdf_target, json_target = check_outputs(
            ("--out", out if out is not None else str(source.with_suffix(".pdf"))), ("--json", json_out),
            force=force, project=project,
        )

        opened = open_project(project)
        model = opened.model
        reading(*opened.inputs)
        pdf_target, json_target = check_outputs(
            ("--out", out if out is not None else str(source.with_suffix(".pdf"))), ("--json", json_out),
            force=force, project=project,
        )
        from coldroom.output.produce import size_pdf, size_result
        from coldroom.output.terminal import size_summary

        result = size_result(model, project, opened.content)
        pdf = size_pdf(result, model)
        console = console_for(pdf_target, json_target)
        say(size_summary(result, model), file=console)
        console.flush()  # a full disk behind the terminal text stops the run before any file is written
        write_output(pdf_target, pdf, force=force, project=project, console=console)
        emit_json("size", result.to_json, json_target, force=force, project=project, model=model,
                  content=opened.content, console=console)

    guarded(run)


# --- compare: the base and its options over a year ---------------------------


@app.command("compare")
def compare_command(
    project: str = typer.Argument(..., help="Project file (YAML) with options: and design.weather or design.ambient_bins."),
    json_out: Optional[str] = typer.Option(
        None, "--json", help="Also write the comparison as JSON to FILE ('-' for stdout).", metavar="FILE"
    ),
    out: Optional[str] = typer.Option(None, "--out", help="PDF of the comparison to write.", metavar="FILE.pdf"),
    force: bool = typer.Option(False, "--force", help="Overwrite existing output files."),
) -> None:
    """Compare the project and its options: annual energy and cost, charge, GWP, TEWI."""

    def run() -> None:
        from coldroom.inputs.opening import open_project

        pdf_target, json_target = check_outputs(("--out", out), ("--json", json_out), force=force, project=project)
        opened = open_project(project)
        raw, model = opened.content, opened.model
        reading(*opened.inputs)  # the weather files of the base and of every option
        pdf_target, json_target = check_outputs(("--out", out), ("--json", json_out), force=force, project=project)
        from coldroom.output.produce import compare_pdf, compare_result
        from coldroom.output.terminal import compare_text

        result = compare_result(model, project, raw)
        console = console_for(pdf_target, json_target)
        say(compare_text(result, model.project.units), file=console)
        if pdf_target is not None:
            pdf = compare_pdf(result, model, project, raw)
            console.flush()
            write_output(pdf_target, pdf, force=force, project=project, console=console)
        emit_json("compare", result.to_json, json_target, force=force, project=project, model=model, content=raw,
                  console=console)

    guarded(run)


# --- refrigerants and the cycle (catalogue listing; `coldroom cycle`) -------


@app.command("refrigerants")
def refrigerants_command() -> None:
    """List the refrigerant catalogue: safety class, GWP, flammability limit, model."""

    def run() -> None:
        from coldroom.data.refrigerants import CATALOGUE

        header = ("name", "class", "GWP AR4", "GWP AR5", "LFL kg/m³", "blend", "property model", "composition")
        rows = []
        for r in CATALOGUE:
            blend = "zeotrope" if r.zeotropic else ("azeotrope" if r.is_blend else "-")
            rows.append(
                (
                    r.name,
                    r.safety_class,
                    f"{r.gwp_ar4:g}",
                    "-" if r.gwp_ar5 is None else f"{r.gwp_ar5:g}",
                    "-" if r.lfl_kg_m3 is None else f"{r.lfl_kg_m3:g}",
                    blend,
                    f"{r.model} ({r.coolprop_name})",
                    r.chemical,
                )
            )
        widths = [max(len(str(row[i])) for row in (header, *rows)) for i in range(len(header))]
        for row in (header, *rows):
            print("  ".join(str(c).ljust(w) for c, w in zip(row, widths)).rstrip())
        print("GWP: IPCC AR4/AR5 100-year values; classes ISO 817/ASHRAE 34 (values recalled, verify for compliance).")

    guarded(run)


@app.command("cycle")
def cycle_command(
    refrigerant: str = typer.Option(..., "--refrigerant", "-r", help="Refrigerant, e.g. R448A, R-134a, R744."),
    evaporating: Optional[str] = typer.Option(None, "--evaporating", help="Evaporating dew temperature (°C unless a unit is given, e.g. '14 °F')."),
    condensing: Optional[str] = typer.Option(None, "--condensing", help="Condensing dew temperature (°C unless a unit is given)."),
    suction_pressure: Optional[str] = typer.Option(None, "--suction-pressure", help="Measured suction pressure instead of --evaporating: '2.1 bar(g)', '45 psig' (gauge) or '350 kPa', '3.1 bar' (absolute)."),
    discharge_pressure: Optional[str] = typer.Option(None, "--discharge-pressure", help="Measured discharge pressure instead of --condensing (R-744 above critical: the gas-cooler pressure)."),
    capacity: str = typer.Option(..., "--capacity", help="Refrigerating capacity: '5 kW', '17000 Btu/h', '1.5 TR'; bare number = W."),
    superheat: str = typer.Option(
        f"{_CYCLE.superheat:g}", "--superheat", help="Useful superheat at the evaporator outlet [K]."
    ),
    suction_line_superheat: str = typer.Option(
        f"{_CYCLE.suction_line_superheat:g}", "--suction-line-superheat",
        help="Further superheat picked up in the suction line, no useful cooling [K].",
    ),
    subcooling: str = typer.Option(f"{_CYCLE.subcooling:g}", "--subcooling", help="Subcooling at the condenser outlet [K]."),
    isentropic_efficiency: float = typer.Option(
        _CYCLE.isentropic_efficiency, "--isentropic-efficiency", help="Compressor isentropic efficiency (0-1]."
    ),
    clearance: float = typer.Option(_CYCLE.clearance, "--clearance", help="Clearance volume ratio for the volumetric efficiency."),
    gas_cooler_outlet: Optional[str] = typer.Option(None, "--gas-cooler-outlet", help="R-744 transcritical: gas-cooler outlet temperature (°C)."),
    units: str = typer.Option("SI", "--units", help="Units of the chart page: SI or IP."),
    out: Optional[str] = typer.Option(None, "--out", metavar="FILE.pdf|FILE.svg", help="Write the p-h chart and state table as one page (PDF or SVG by the name's ending)."),
    force: bool = typer.Option(False, "--force", help="Overwrite an existing --out file."),
    as_json: bool = typer.Option(False, "--json", help="Print the result as JSON on stdout."),
) -> None:
    """Size one vapour-compression cycle without a project file (and draw it with --out).

    The defaults are a project's (coldroom.rules.CYCLE_DEFAULTS), so the same duty gives the same answer.
    --superheat 0 --suction-line-superheat 0 --subcooling 0 --isentropic-efficiency 1 is the ideal cycle.
    Gauge pressures are read against the standard atmosphere (101.325 kPa).
    """

    def run() -> None:
        import os

        from coldroom.data.refrigerants import lookup
        from coldroom.errors import CalculationError, UsageError, command_line_values
        from coldroom.units import parse_quantity

        def value(option: str, text: Optional[str], kind: str, unit: str) -> Optional[float]:
            with command_line_values(option):
                return None if text is None else parse_quantity(text, kind, default_unit=unit)

        with command_line_values("--refrigerant"):
            lookup(refrigerant)
        te = value("--evaporating", evaporating, "temperature", "°C")
        tc = value("--condensing", condensing, "temperature", "°C")
        for option, text in (("--suction-pressure", suction_pressure), ("--discharge-pressure", discharge_pressure)):
            try:
                float((text or "").strip())
            except ValueError:
                continue
            # a gauge reading typed without its unit (45 psig as "45") would be read as 45 kPa absolute
            raise UsageError(
                f"{option} {text!r} has no unit: give one, e.g. '{text.strip()} psig' or '{text.strip()} bar(g)' "
                f"(gauge), '{text.strip()} kPa' or '{text.strip()} bar' (absolute)"
            )
        p_suction = value("--suction-pressure", suction_pressure, "pressure", "kPa")
        p_discharge = value("--discharge-pressure", discharge_pressure, "pressure", "kPa")
        q = value("--capacity", capacity, "power", "W")
        sh = value("--superheat", superheat, "temperature_difference", "K")
        slsh = value("--suction-line-superheat", suction_line_superheat, "temperature_difference", "K")
        sc = value("--subcooling", subcooling, "temperature_difference", "K")
        tgc = value("--gas-cooler-outlet", gas_cooler_outlet, "temperature", "°C")
        if (te is None) == (p_suction is None):
            raise UsageError("give one of --evaporating or --suction-pressure")
        if te is None and tc is None and p_discharge is None and tgc is None:
            raise UsageError("give --condensing or --discharge-pressure (or --gas-cooler-outlet for transcritical R-744)")
        if tc is not None and p_discharge is not None:
            raise UsageError("give --condensing or --discharge-pressure, not both")
        if tc is None and p_discharge is None and tgc is None:
            raise UsageError("give --condensing (or --gas-cooler-outlet for transcritical R-744)")
        for name, p in (("suction", p_suction), ("discharge", p_discharge)):
            if p is not None and p <= 0:
                raise UsageError(
                    f"{name} pressure {p / 1e3:.1f} kPa absolute is not above zero (gauge pressures are read against 101.325 kPa)"
                )
        system = units.strip().upper()
        if system not in ("SI", "IP"):
            raise UsageError(f"--units must be SI or IP, not {units!r}")
        fmt = None
        (out_target,) = check_outputs(("--out", out), force=force)
        if out is not None:
            fmt = out.rsplit(".", 1)[-1].lower() if "." in os.path.basename(out) else ""
            if fmt not in ("pdf", "svg"):
                if out_target is not None and out_target.kind in ("stdout", "device"):
                    fmt = "pdf"  # standard output, /dev/null, a pipe: the page as PDF
                else:
                    raise UsageError(f"--out {out!r}: the name must end in .pdf or .svg")
            if as_json and out_target is not None and out_target.kind == "stdout":
                raise UsageError("--json and --out both go to standard output; send the page to a file")

        from coldroom.physics.cycle import check_cycle_inputs, solve_cycle
        from coldroom.physics.refrigerant import get_fluid
        from coldroom.output.terminal import cycle_table

        fluid = get_fluid(refrigerant)

        def dew(pressure: float, option: str) -> float:
            try:
                return fluid.dew_temperature(pressure)
            except ColdroomError as error:
                raise CalculationError(f"{option} {pressure / 1e3:.1f} kPa absolute: {error}") from None

        evap = te if te is not None else dew(p_suction, "--suction-pressure")  # type: ignore[arg-type]
        cond, high_side = tc, None
        if fluid.info.name == "R-744":
            from coldroom.physics.cycle import r744_boundary, r744_transcritical

            t_edge, p_edge = r744_boundary()
            edge = (f"R-744's transcritical boundary ({p_edge / 1e5:.2f} bar absolute, {t_edge:.1f} °C; critical "
                    f"{fluid.critical_pressure / 1e5:.2f} bar, {fluid.critical_temperature:.1f} °C)")
            if p_discharge is not None and r744_transcritical(pressure=p_discharge):
                if p_discharge <= fluid.critical_pressure:
                    raise CalculationError(f"--discharge-pressure {p_discharge / 1e5:.2f} bar absolute lies between "
                                           f"{edge} and the critical pressure: neither a condensing nor a "
                                           "gas-cooler pressure; measure again or give --condensing")
                if tgc is None:
                    raise UsageError(f"--discharge-pressure {p_discharge / 1e5:.2f} bar absolute is above {edge}: "
                                     "the cycle is transcritical; give the gas-cooler outlet temperature with "
                                     "--gas-cooler-outlet")
                high_side = p_discharge
            elif tc is not None and tgc is None and r744_transcritical(tc):
                raise UsageError(f"--condensing {tc:g} °C is at or above {edge}: the cycle is transcritical; "
                                 "give the gas-cooler outlet temperature with --gas-cooler-outlet")
        if p_discharge is not None and high_side is None:
            cond = dew(p_discharge, "--discharge-pressure")
        with command_line_values():  # a dew point from a measured pressure is checked by the cycle itself
            check_cycle_inputs(te, q, sh, sc, isentropic_efficiency, slsh, clearance=clearance)  # type: ignore[arg-type]
        try:
            result = solve_cycle(
                refrigerant, evap, cond, q, superheat=sh, subcooling=sc, isentropic_efficiency=isentropic_efficiency,  # type: ignore[arg-type]
                suction_line_superheat=slsh, clearance=clearance, gas_cooler_outlet_temperature=tgc,  # type: ignore[arg-type]
                high_side_pressure=high_side,
            )
        except CalculationError as error:
            if p_suction is None and p_discharge is None:
                raise
            given = [f"--suction-pressure {p_suction / 1e3:.1f} kPa absolute (dew {evap:.2f} °C)"] if p_suction else []
            if p_discharge is not None and cond is not None:
                given.append(f"--discharge-pressure {p_discharge / 1e3:.1f} kPa absolute (dew {cond:.2f} °C)")
            raise CalculationError(f"{'; '.join(given)}: {error}") from None
        if as_json:
            from coldroom.output.files import json_text
            from coldroom.output.json_contract import document

            sys.stdout.write(json_text(document("cycle", result.to_json(), None)))
        else:  # the table goes to stderr when the page itself goes to standard output
            say(cycle_table(result), file=sys.stderr if out_target is not None and out_target.kind == "stdout" else None)
        if out_target is not None:
            from coldroom.output.pdf.cyclepage import render_cycle_page
            from coldroom.design.sizing import sheet_date, versions

            # the footer's input hash: the options as given (not sys.argv, which an embedding caller owns)
            given = [refrigerant, evaporating, condensing, suction_pressure, discharge_pressure, capacity, superheat,
                     suction_line_superheat, subcooling, repr(isentropic_efficiency), repr(clearance),
                     gas_cooler_outlet, system]
            data = render_cycle_page(result, system, fmt, sheet_date(None), ["" if g is None else g for g in given],
                                     versions())
            console = sys.stderr if as_json or out_target.kind == "stdout" else sys.stdout
            write_output(out_target, data, force=force, project=None, console=console)

    guarded(run)


# --- check (existing unit at the room's new conditions) ----------------------------


@app.command("check")
def check_command(
    project: str = typer.Argument(..., help="Project file (YAML)."),
    json_out: Optional[str] = typer.Option(
        None, "--json", help="Also write the result as JSON to FILE ('-' for stdout).", metavar="FILE"
    ),
    force: bool = typer.Option(False, "--force", help="Overwrite an existing JSON file."),
) -> None:
    """Check each room's existing unit at the room's new conditions (capacity at balance vs load)."""

    def run() -> None:
        (json_target,) = check_outputs(("--json", json_out), force=force, project=project)

        from coldroom.inputs.opening import open_project

        opened = open_project(project)
        model = opened.model
        reading(*opened.inputs)
        (json_target,) = check_outputs(("--json", json_out), force=force, project=project)
        from coldroom.design.sizing import existing_unit_checks  # CoolProp, lazily
        from coldroom.output.terminal import check_report
        from coldroom.design.unit_limits import unit_limits

        checks = existing_unit_checks(model)
        limits = [
            None if check is None else unit_limits(model, i, loads, check.holds, pulldown=True)
            for i, (loads, check) in enumerate(checks)
        ]
        console = console_for(json_target)
        say(check_report(model, checks, limits), file=console)
        from coldroom.output.json_contract import check_body

        def body() -> dict:  # the sized job with the existing units as they stand (systems[], "existing")
            from coldroom.design.job import existing_result
            from coldroom.design.sizing import size_project

            return check_body(checks, limits, existing_result(model, size_project(model, project, opened.content)))

        emit_json("check", body, json_target, force=force, project=project, model=model, content=opened.content,
                  console=console)

    guarded(run)


@app.command("select")
def select_command(
    project: str = typer.Argument(..., help="Project file (YAML)."),
    catalogue: str = typer.Option(..., "--catalogue", help="Equipment catalogue (.yaml, .csv or .xlsx).",
                                  metavar="FILE"),
    json_out: Optional[str] = typer.Option(
        None, "--json", help="Also write the selection as JSON to FILE ('-' for stdout).", metavar="FILE"
    ),
    out: Optional[str] = typer.Option(
        None, "--out", help="Also write the sizing sheet with the selected equipment.", metavar="FILE.pdf"
    ),
    force: bool = typer.Option(False, "--force", help="Overwrite existing output files."),
) -> None:
    """Choose unit coolers and the cheapest condensing unit that holds, per system, from a catalogue."""

    def run() -> None:
        from coldroom.errors import UsageError

        if not catalogue.strip():
            raise UsageError("--catalogue '': give the catalogue file (.yaml, .csv or .xlsx)")
        reading(catalogue)
        pdf_target, json_target = check_outputs(("--out", out), ("--json", json_out), force=force, project=project)
        from coldroom.inputs.catalogue import load_catalogue
        from coldroom.inputs.opening import open_project

        opened = open_project(project)
        model = opened.model
        reading(*opened.inputs)
        pdf_target, json_target = check_outputs(("--out", out), ("--json", json_out), force=force, project=project)
        equipment = load_catalogue(catalogue)
        from coldroom.output.produce import selected_job, selections_for, size_pdf
        from coldroom.output.terminal import selection_report

        selections = selections_for(model, equipment)
        console = console_for(pdf_target, json_target)
        say(selection_report(selections, model.project.units), file=console)
        job = None
        if pdf_target is not None or json_target is not None:  # the sized job, equipped as chosen
            job = selected_job(model, project, opened.content, selections)
        if pdf_target is not None:
            write_output(pdf_target, size_pdf(job, model, selection=selections), force=force,
                         project=project, console=console)
        from coldroom.output.json_contract import select_body

        emit_json("select", lambda: select_body(selections, catalogue, equipment.currency, job), json_target,
                  force=force, project=project, model=model, content=opened.content, console=console)

    guarded(run)


@app.command("quote")
def quote_command(
    project: str = typer.Argument(..., help="Project file (YAML), with a quote: block."),
    catalogue: str = typer.Option(..., "--catalogue", help="Catalogue with prices (.yaml, .csv or .xlsx).",
                                  metavar="FILE"),
    out: Optional[str] = typer.Option(None, "--out", help="Write the proposal for the customer (PDF).",
                                      metavar="FILE.pdf"),
    costing: Optional[str] = typer.Option(None, "--costing", help="Write the costing workbook (XLSX).",
                                          metavar="FILE.xlsx"),
    json_out: Optional[str] = typer.Option(
        None, "--json", help="Also write the quote as JSON to FILE ('-' for stdout).", metavar="FILE"
    ),
    force: bool = typer.Option(False, "--force", help="Overwrite existing output files."),
) -> None:
    """Select the equipment, then price the whole job: bill of quantities, valves, electrical schedule."""

    def run() -> None:
        from coldroom.errors import UsageError
        from coldroom.output.files import check_targets

        if not catalogue.strip():
            raise UsageError("--catalogue '': give the catalogue file (.yaml, .csv or .xlsx)")

        pdf_target, xlsx_target, json_target = check_targets(
            (("--out", out), ("--costing", costing), ("--json", json_out)), force=force, inputs=[project, catalogue]
        )
        from coldroom.inputs.catalogue import load_catalogue
        from coldroom.inputs.opening import open_project

        opened = open_project(project)
        model = opened.model
        equipment = load_catalogue(catalogue)
        from coldroom.output.produce import costing_xlsx, proposal_pdf, quote_result
        from coldroom.output.quote_text import quote_report

        quote, result, _selections = quote_result(model, project, opened.content, equipment)
        console = console_for(pdf_target, xlsx_target, json_target)
        say(quote_report(quote, model.project.units), file=console)
        if pdf_target is not None:
            write_output(pdf_target, proposal_pdf(quote, result, model), force=force, project=project,
                         console=console)
        if xlsx_target is not None:
            write_output(xlsx_target, costing_xlsx(quote, model), force=force, project=project, console=console)
        from coldroom.output.json_contract import quote_body

        emit_json("quote", lambda: quote_body(quote, catalogue), json_target, force=force, project=project,
                  model=model, content=opened.content, console=console)

    guarded(run)


def main() -> None:
    """Console-script entry point.

    A ColdroomError is reported by the commands themselves. SIGTERM and SIGHUP
    are handled like Ctrl-C. Anything else is a bug in coldroom: it is reported
    on one line with exit code 70 (set COLDROOM_DEBUG=1 to see the traceback).
    """
    import os

    install_signal_handlers()
    try:
        app()
    except SystemExit:
        raise
    except KeyboardInterrupt as stop:
        raise SystemExit(interrupted(stop)) from None
    except BrokenPipeError:
        _silence_stdout()
        raise SystemExit(141) from None
    except ColdroomError as error:  # raised outside a guarded block
        raise SystemExit(fail(error).exit_code) from None
    except Exception as error:  # pragma: no cover - defensive
        if os.environ.get("COLDROOM_DEBUG"):
            raise
        print(f"coldroom: internal error ({type(error).__name__}: {error}); please report it", file=sys.stderr)
        raise SystemExit(70) from None


if __name__ == "__main__":  # pragma: no cover
    main()
