"""The expansion-valve inlet on the p–h chart (state 3v): the liquid after the liquid line.

What is checked, and against what:

* the 3v state's temperature and quality are CoolProp's at (valve pressure,
  condenser-outlet enthalpy): an adiabatic line keeps the enthalpy
  [ref:stoecker-jones], so the property library at that (p, h) is the reference
  (its P–H flash, an independent route from the chart's fast path for blends);
* the chart draws 3v as its own marker on state 3's enthalpy, with its label, and
  the cycle line runs 3 → 3v → 4 (the expansion starts at the valve inlet);
* liquid that has flashed (valve pressure below the bubble pressure at that
  enthalpy) is drawn where it is, inside the dome, with its quality;
* without a valve pressure (``coldroom cycle``) nothing of it appears;
* on the sizing sheet of the demo with a liquid line, the 3v pressure is the one
  whose bubble temperature leaves the subcooling the JSON reports at the valve.
"""

from __future__ import annotations

import re
from pathlib import Path

import pytest
from tests.conftest import drawing_strings

REPO = Path(__file__).resolve().parents[2]


def _coolprop(name: str, p: float, h: float) -> tuple[float, float]:
    """Temperature [°C] and quality (-1 outside the dome) at (p, h): CoolProp's own P–H flash."""
    import CoolProp.CoolProp as CP

    from coldroom.physics.refrigerant import get_fluid

    state = CP.AbstractState("HEOS", get_fluid(name).info.coolprop_name)
    state.update(CP.HmassP_INPUTS, h, p)
    return state.T() - 273.15, state.Q()


def _markers(drawing):
    """Centres of the cycle's state markers (filled circles of radius 2.4 pt)."""
    from reportlab.graphics.shapes import Circle

    return [(c.cx, c.cy) for c in drawing.contents if isinstance(c, Circle) and c.r == 2.4]


def _cycle_path(drawing):
    """The thick polyline(s) of the cycle, as one list of points."""
    from reportlab.graphics.shapes import PolyLine

    points = []
    for item in drawing.contents:
        if isinstance(item, PolyLine) and item.strokeWidth == 1.8:
            pts = item.points
            points += list(zip(pts[0::2], pts[1::2]))
    return points


@pytest.mark.parametrize("name, drop", [("R-134a", 80e3), ("R-448A", 120e3), ("R-134a", -60e3)],
                         ids=["R-134a friction", "R-448A friction", "R-134a static gain"])
def test_valve_inlet_is_its_own_state_on_the_chart(name, drop):
    from coldroom.physics.cycle import solve_cycle
    from coldroom.output.pdf.phchart import ph_chart
    from coldroom.output.pdf.ph_states import state_rows, valve_inlet_state

    cycle = solve_cycle(name, -10.0, 40.0, 5000.0, subcooling=5.0, suction_line_superheat=5.0)
    s3, s4 = cycle.states[2], cycle.states[3]
    pressure = s3.p - drop
    valve = valve_inlet_state(cycle, pressure)
    t_ref, q_ref = _coolprop(name, pressure, s3.h)
    assert valve.h == s3.h and valve.p == pytest.approx(pressure, rel=1e-9)
    assert abs(valve.t - t_ref) < 0.01, (valve.t, t_ref)  # CoolProp P–H flash
    assert valve.quality is None and q_ref < 0  # still liquid (5 K subcooling is worth 130 kPa or more here)

    # the table: a row of its own between 3 and 4, CoolProp's temperature to the shown 0.1 K
    rows = state_rows(cycle, "SI", valve)
    names = [row[0] for row in rows[1:]]
    assert names == ["1  compressor suction", "2  compressor discharge", "3  condenser outlet",
                     "3v expansion-valve inlet", "4  evaporator inlet", "1e evaporator outlet"]
    row = rows[4]
    assert row[1] == f"{pressure / 1000:,.0f} kPa"
    shown = float(row[2].split()[0].replace("−", "-"))
    assert abs(shown - t_ref) <= 0.051

    # the chart: a marker on state 3's enthalpy between 3 and 4, the label, the path 3 → 3v → 4
    drawing = ph_chart(cycle, "SI", 520.0, 420.0, valve_inlet_pressure=pressure)
    plain = ph_chart(cycle, "SI", 520.0, 420.0)
    texts = [s.text for s in drawing_strings(drawing)]
    label = next(t for t in texts if t.startswith("3v:"))
    assert f"{pressure / 1000:,.0f} kPa" in label
    assert abs(float(re.search(r"(−?\d+\.\d) °C", label).group(1).replace("−", "-")) - t_ref) <= 0.051
    assert not any(s.text.startswith("3v") for s in drawing_strings(plain))
    markers, before = _markers(drawing), _markers(plain)
    (new,) = [m for m in markers if m not in before]  # the one marker more: 3v (same window here)
    xv, yv = new
    # 4 and 3 of the plain chart share the condenser-outlet enthalpy with 3v
    (y4, _), (y3, _) = sorted((y, x) for x, y in before if abs(x - xv) < 1e-6)
    assert y4 < yv and (yv < y3 if drop > 0 else yv > y3)
    path = _cycle_path(drawing)
    at = [i for i, pt in enumerate(path) if abs(pt[0] - xv) < 1e-6 and abs(pt[1] - yv) < 1e-6]
    assert at, "the cycle line does not pass through 3v"
    i = at[0]
    # the cycle comes to 3v from 3 and leaves it for 4 (the expansion from the valve inlet)
    assert abs(path[i - 1][1] - y3) < 1e-6 and abs(path[i + 1][1] - y4) < 1e-6
    assert s4.h == s3.h


def test_flashed_liquid_is_drawn_inside_the_dome_with_its_quality():
    from coldroom.physics.cycle import solve_cycle
    from coldroom.physics.refrigerant import get_fluid
    from coldroom.output.pdf.phchart import ph_chart
    from coldroom.output.pdf.ph_states import state_rows, valve_inlet_state

    cycle = solve_cycle("R-134a", -10.0, 40.0, 5000.0, subcooling=1.0)
    s3 = cycle.states[2]
    # a long riser: 200 kPa lost, more than the 1 K of subcooling is worth (about 27 kPa)
    pressure = s3.p - 200e3
    t_ref, q_ref = _coolprop("R-134a", pressure, s3.h)
    assert 0.0 < q_ref < 0.2
    valve = valve_inlet_state(cycle, pressure)
    assert valve.quality == pytest.approx(q_ref, abs=1e-4)  # CoolProp P–H flash
    assert abs(valve.t - get_fluid("R-134a").dew_temperature(pressure)) < 0.01  # pure fluid: on the isobar's saturation
    rows = state_rows(cycle, "SI", valve)
    assert rows[4][0].startswith("3v") and rows[4][5] == f"{q_ref:.3f}"
    texts = [s.text for s in drawing_strings(ph_chart(cycle, "SI", 520.0, 420.0, valve_inlet_pressure=pressure))]
    label = next(t for t in texts if t.startswith("3v:"))
    assert f"x = {q_ref:.3f}" in label


def test_no_valve_point_without_a_pressure_change():
    from coldroom.physics.cycle import solve_cycle
    from coldroom.output.pdf.ph_states import cycle_states, valve_inlet_state

    cycle = solve_cycle("R-134a", -10.0, 40.0, 5000.0)
    assert valve_inlet_state(cycle, None) is None
    assert valve_inlet_state(cycle, cycle.states[2].p) is None
    assert "3v" not in [n for n, _ in cycle_states(cycle)]


def test_sheet_of_the_demo_with_a_liquid_line_shows_the_valve_inlet():
    import io

    import pypdf

    from coldroom.inputs.opening import open_project
    from coldroom.physics.refrigerant import get_fluid
    from coldroom.output.pdf.sheet import render_sheet
    from coldroom.design.sizing import size_project

    path = REPO / "project_files" / "propane_cooler.yaml"
    model = open_project(path).model
    result = size_project(model, str(path), path.read_bytes())
    system = result.systems[0]
    data = system.to_json()
    works = system.pipework
    assert works.valve_inlet_pressure is not None
    # the pressure drawn is the one the JSON's subcooling at the valve belongs to: its bubble
    # temperature less the liquid temperature (CoolProp's saturation through the wrapper)
    fluid = get_fluid(system.refrigerant)
    subcooling = fluid.bubble_temperature(works.valve_inlet_pressure) - system.cycle.states[2].t
    assert subcooling == pytest.approx(data["piping"]["liquid_subcooling_at_valve_k"], abs=1e-9)
    text = " ".join(page.extract_text() or "" for page in pypdf.PdfReader(io.BytesIO(render_sheet(result, model))).pages)
    text = re.sub(r"\s+", " ", text)
    p_text = f"{works.valve_inlet_pressure / 1000:,.0f} kPa"
    assert f"3v expansion-valve inlet {p_text}" in text
    assert f"3v: {p_text}" in text
