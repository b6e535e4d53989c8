"""The refrigerant cycle on the sheet: the state table, the pressure–enthalpy chart and the compressor figures.

Used for a room's own cycle (:func:`cycle_section`, one of the room sections)
and for the cycle of a system of several rooms (:func:`duties_and_cycle`).
"""

from __future__ import annotations

from typing import Any, Optional

from reportlab.platypus import CondPageBreak, KeepTogether, Spacer

from coldroom.output.pdf.context import SheetContext, room_system
from coldroom.output.pdf.layout import SMALL, TINY, grid, heading, note
from coldroom.output.pdf.text import capacity, q, temperature


def compressor_figures(ctx: SheetContext, cyc: dict) -> Any:
    """Mass flow, volume flows, electrical input, discharge temperature, pressure ratio and COP."""
    s = ctx.system
    w = ctx.width
    perf = [
        ["Compressor figures", "Value"],
        ["Refrigerant", str(cyc.get("refrigerant", "–"))],
        ["Mass flow", q(cyc["mass_flow_kg_s"], "mass_flow", s)],
        ["Suction volume flow (state 1)", q(cyc["suction_volume_flow_m3_h"] / 3600.0, "volume_flow", s)],
        ["Compressor displacement (swept volume)", q(cyc["displacement_m3_h"] / 3600.0, "volume_flow", s)],
        ["Compressor electrical input (overall isentropic efficiency)", capacity(cyc["compressor_power_w"], s)],
        ["Discharge temperature", temperature(cyc["discharge_temperature_c"], s)],
        ["Pressure ratio", f"{cyc['pressure_ratio']:.2f}"],
        ["COP (cooling / compressor power)", f"{cyc['cop']:.2f}"],
    ]
    return grid(perf, [0.52 * w, 0.48 * w], align_right=(1,))


def duties_and_cycle(ctx: SheetContext, cycle: Any, cyc: dict, remark: str, system: Any = None) -> list:
    """A system's compressor figures, state table and p–h chart."""
    return [*_cycle_flowables(ctx, cycle, remark, system),
            KeepTogether([heading("Compressor"), compressor_figures(ctx, cyc)])]


def cycle_section(ctx: SheetContext, index: int) -> list:
    """The cycle's states and the pressure–enthalpy chart (on a page of their own when needed)."""
    cycle = ctx.result.rooms[index].cycle
    if cycle is None:
        return []
    return _cycle_flowables(ctx, cycle, system=room_system(ctx, index))


def _valve_inlet(cycle: Any, system: Any) -> tuple[Any, Optional[float]]:
    """The expansion-valve inlet state and pressure of *cycle* when *system*'s liquid line
    changes the liquid's pressure, else ``(None, None)``."""
    from coldroom.errors import ColdroomError
    from coldroom.output.pdf.ph_states import valve_inlet_state

    works = getattr(system, "pipework", None)
    pressure = getattr(works, "valve_inlet_pressure", None)
    if pressure is None or system.cycle is not cycle:
        return None, None
    try:
        return valve_inlet_state(cycle, pressure), pressure
    except ColdroomError:
        return None, None


def _cycle_flowables(ctx: SheetContext, cycle: Any, remark: str = "", system: Any = None) -> list:
    """State table and p–h chart of a solved cycle (a room's, or a system's of several rooms)."""
    from coldroom.output.pdf.ph_states import state_rows, warm_coils

    w = ctx.width
    valve, valve_pressure = _valve_inlet(cycle, system)
    if valve is not None:
        remark = (remark + " " if remark else "") + (
            "State 3v is the liquid at the expansion valve: the condenser-outlet enthalpy at the pressure "
            "the liquid line's friction and height change leave."
        )
    # the coils in the order of cycle.coil_outlets: the system's members (rooms)
    coil_names = [member.room for member in system.members] if system is not None and system.cycle is cycle else None
    marks = [mark for mark, _, _ in warm_coils(cycle, coil_names)]
    if marks:
        remark = (remark + " " if remark else "") + (
            f"State {marks[0]} is the warmer coil's outlet at its own evaporating pressure, before its EPR "
            "throttles the vapour at constant enthalpy to the coldest coil's pressure."
            if len(marks) == 1 else
            f"States {', '.join(marks)} are the warmer coils' outlets at their own evaporating pressures, before "
            "their EPRs throttle the vapour at constant enthalpy to the coldest coil's pressure."
        )
    rows = state_rows(cycle, ctx.system, valve, coil_names)
    table = grid(rows, [0.25 * w, 0.15 * w, 0.14 * w, 0.16 * w, 0.18 * w, 0.12 * w], align_right=(1, 2, 3, 4, 5))
    chart = _ph_chart(ctx, cycle, valve_pressure if valve is not None else None, coil_names)
    return [
        CondPageBreak(ctx.width * 0.95),
        KeepTogether(
            [
                heading("Refrigerant cycle"),
                note(
                    "Pressures absolute. Enthalpy and entropy in the default reference state of the property "
                    "library (IIR for halocarbons); quality shown only inside the two-phase region."
                    + (f" {remark}" if remark else ""),
                    TINY,
                ),
                Spacer(1, 2),
                table,
                Spacer(1, 8),
                chart,
            ]
        ),
    ]


def _ph_chart(ctx: SheetContext, cycle: Any, valve_inlet_pressure: Optional[float] = None,
              coil_names: Optional[list] = None) -> Any:
    from coldroom.errors import ColdroomError
    from coldroom.output.pdf.phchart import SharedBackgroundChart, ph_chart

    try:
        return SharedBackgroundChart(ph_chart(cycle, ctx.system, ctx.width, ctx.width * 0.78,
                                              title=f"Pressure–enthalpy chart, {cycle.refrigerant}",
                                              valve_inlet_pressure=valve_inlet_pressure, coil_names=coil_names))
    except ColdroomError:
        return note("The pressure–enthalpy chart could not be drawn for this refrigerant.", SMALL)
