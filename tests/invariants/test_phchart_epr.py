"""Several coils on one compressor: the warmer coils behind EPRs on the p–h chart.

What is checked, and against what:

* each coil's outlet state the cycle exposes (``coil_outlets``) sits at the
  coil's evaporating dew pressure and its superheat, by CoolProp's own Q–T and
  P–T flashes, and the coils' outlets mixed by their mass flows give the
  evaporator outlet the cycle used (adiabatic mixing: an energy balance);
* the chart draws the warmer coil's dew isobar with its name and dew temperature
  (CoolProp's), its outlet (1a) with its label, the coil's evaporation at its
  pressure and the EPR's throttle at constant enthalpy down to the coldest
  coil's pressure; the state table gets the outlet's row;
* no label overlaps another (the occupancy-grid placer) on such a chart;
* a single coil's chart has none of it.
"""

from __future__ import annotations

import pytest
from reportlab.pdfbase.pdfmetrics import stringWidth
from tests.conftest import drawing_strings

COILS = [(-25.0, 6.0, 3000.0), (-4.0, 5.0, 2000.0)]  # freezer coil, cooler coil behind an EPR


@pytest.fixture(scope="module", params=["R-448A", "R-134a"])
def system_cycle(request):
    from coldroom.physics.system_cycle import solve_system_cycle

    return request.param, solve_system_cycle(request.param, COILS, 40.0, suction_line_superheat=5.0)


def _coolprop(name: str):
    import CoolProp.CoolProp as CP

    from coldroom.physics.refrigerant import get_fluid

    return CP, CP.AbstractState("HEOS", get_fluid(name).info.coolprop_name)


def test_coil_outlets_are_each_coils_own_state(system_cycle):
    name, cycle = system_cycle
    CP, state = _coolprop(name)
    assert len(cycle.coil_outlets) == len(COILS)
    for (t, superheat, _q), outlet in zip(COILS, cycle.coil_outlets):
        state.update(CP.QT_INPUTS, 1.0, t + 273.15)  # dew pressure at the coil's temperature
        assert outlet.p == pytest.approx(state.p(), rel=1e-5)
        assert outlet.t == pytest.approx(t + superheat, abs=1e-6)
        state.update(CP.PT_INPUTS, outlet.p, outlet.t + 273.15)
        assert outlet.h == pytest.approx(state.hmass(), abs=5.0)
    # the vapours mix adiabatically into the evaporator outlet the cycle used
    flows = cycle.evaporator_flows
    mixed = sum(m * o.h for m, o in zip(flows, cycle.coil_outlets)) / sum(flows)
    assert mixed == pytest.approx(cycle.evaporator_outlet.h, abs=1e-6)
    # the coldest coil is the compressor's evaporating pressure; the warmer one above it
    assert cycle.coil_outlets[0].p == pytest.approx(cycle.evaporating_pressure, rel=1e-9)
    assert cycle.coil_outlets[1].p > 1.5 * cycle.evaporating_pressure


def _boxes(drawing, x0, y0, x1, y1):
    """Boxes of the labels inside the plot (the placer's text: anchors start, end, middle)."""
    out = []
    for s in drawing_strings(drawing):
        w = stringWidth(s.text, s.fontName, s.fontSize)
        bx0 = s.x if s.textAnchor == "start" else s.x - w if s.textAnchor == "end" else s.x - w / 2
        box = (bx0, s.y - 1.0, bx0 + w, s.y + 0.7 * s.fontSize)
        if x0 < box[0] and box[2] < x1 and y0 < box[1] and box[3] < y1:
            out.append((s.text, box))
    return out


def test_chart_draws_the_warmer_coil_and_its_throttle(system_cycle):
    from reportlab.graphics.shapes import Circle, Line, PolyLine

    from coldroom.output.pdf.phchart import CYCLE_SOFT, EPR_COIL, EPR_SOFT, ph_chart
    from coldroom.output.pdf.ph_states import state_rows

    name, cycle = system_cycle
    CP, state = _coolprop(name)
    warm = cycle.coil_outlets[1]
    drawing = ph_chart(cycle, "SI", 520.0, 420.0, coil_names=["Freezer", "Cooler"])
    texts = [s.text for s in drawing_strings(drawing)]
    # the isobar's name: the coil's dew temperature at its pressure, by CoolProp
    state.update(CP.PQ_INPUTS, warm.p, 1.0)
    t_dew = state.T() - 273.15
    assert f"Cooler coil {t_dew:.1f} °C dew (EPR)".replace("-", "−") in [t.replace("-", "−") for t in texts]
    label = next(t for t in texts if t.startswith("1a:"))
    assert f"{warm.p / 1000:,.0f} kPa" in label and f"{warm.t:.1f} °C".replace("-", "−") in label.replace("-", "−")
    # the isobars: the warmer coil's (EPR colours) above the compressor's SST
    y_warm = [item.y1 for item in drawing.contents if isinstance(item, Line) and item.strokeColor == EPR_SOFT]
    y_sst = [item.y1 for item in drawing.contents if isinstance(item, Line) and item.strokeColor == CYCLE_SOFT][0]
    assert len(y_warm) == 1 and y_warm[0] > y_sst
    # the outlet marker on the warm isobar; the coil's evaporation ends there, the throttle
    # leaves it at constant enthalpy (vertical) and ends on the SST isobar
    (marker,) = [(c.cx, c.cy) for c in drawing.contents if isinstance(c, Circle) and c.fillColor == EPR_COIL]
    assert marker[1] == pytest.approx(y_warm[0])
    lines = [list(zip(p.points[0::2], p.points[1::2])) for p in drawing.contents
             if isinstance(p, PolyLine) and p.strokeColor == EPR_COIL]
    coil = [pts for pts in lines if pts[0][1] == pytest.approx(pts[-1][1])]
    throttle = [pts for pts in lines if pts[0][0] == pytest.approx(pts[-1][0])]
    assert coil and throttle
    assert coil[0][-1] == pytest.approx(marker) and coil[0][0][0] < marker[0]
    assert throttle[0][0] == pytest.approx(marker) and throttle[0][-1][1] == pytest.approx(y_sst)
    # the table
    rows = state_rows(cycle, "SI", coil_names=["Freezer", "Cooler"])
    row = next(r for r in rows if r[0].startswith("1a"))
    assert row[0] == "1a outlet, Cooler (EPR)" and row[1] == f"{warm.p / 1000:,.0f} kPa"
    # no two labels in the plot overlap
    plot = next(item for item in drawing.contents if isinstance(item, Line) and item.strokeColor == CYCLE_SOFT)
    x0, x1 = plot.x1, plot.x2
    boxes = _boxes(drawing, x0, 0.0, x1, 420.0)
    assert len(boxes) > 20 and any(t.startswith("1a:") for t, _ in boxes)
    for i, (ta, a) in enumerate(boxes):
        for tb, b in boxes[i + 1:]:
            overlap = min(a[2], b[2]) - max(a[0], b[0]) > 0.5 and min(a[3], b[3]) - max(a[1], b[1]) > 0.5
            assert not overlap, f"{ta!r} overlaps {tb!r}"


def test_single_coil_chart_has_no_epr_parts():
    from reportlab.graphics.shapes import Circle, Line, PolyLine

    from coldroom.physics.system_cycle import solve_system_cycle
    from coldroom.output.pdf.phchart import EPR_COIL, EPR_SOFT, ph_chart

    cycle = solve_system_cycle("R-448A", [COILS[0]], 40.0)
    assert cycle.coil_outlets == ()
    drawing = ph_chart(cycle, "SI", 520.0, 420.0, coil_names=["Freezer"])
    assert not any("EPR" in s.text or s.text.startswith("1a") for s in drawing_strings(drawing))
    assert not any(getattr(item, "strokeColor", None) in (EPR_COIL, EPR_SOFT) or
                   (isinstance(item, Circle) and item.fillColor == EPR_COIL)
                   for item in drawing.contents if isinstance(item, (Line, PolyLine, Circle)))


def test_three_coils_every_warmer_isobar_is_named_and_no_label_overlaps():
    """Two warmer coils close together (a long room name): each isobar keeps a label,
    with the coil's name or at least its mark, and the labels stay apart (IP units)."""
    from reportlab.graphics.shapes import Line

    from coldroom.physics.system_cycle import solve_system_cycle
    from coldroom.output.pdf.phchart import CYCLE_SOFT, EPR_SOFT, ph_chart

    coils = COILS + [(2.0, 5.0, 1000.0)]
    cycle = solve_system_cycle("R-448A", coils, 40.0, suction_line_superheat=5.0)
    names = ["Freezer", "Cooler", "Very long produce room name"]
    drawing = ph_chart(cycle, "IP", 520.0, 420.0, coil_names=names, valve_inlet_pressure=cycle.states[2].p - 50e3)
    texts = [s.text for s in drawing_strings(drawing)]
    assert len([item for item in drawing.contents if isinstance(item, Line) and item.strokeColor == EPR_SOFT]) == 2
    for mark, name in (("1a", "Cooler"), ("1b", "Very long")):
        assert any(t.startswith(f"{mark}:") for t in texts), mark
        assert any(t.endswith("dew (EPR)") and (t.startswith(name) or t.startswith(f"{mark} ")) for t in texts), name
    plot = next(item for item in drawing.contents if isinstance(item, Line) and item.strokeColor == CYCLE_SOFT)
    boxes = _boxes(drawing, plot.x1, 0.0, plot.x2, 420.0)
    for i, (ta, a) in enumerate(boxes):
        for tb, b in boxes[i + 1:]:
            overlap = min(a[2], b[2]) - max(a[0], b[0]) > 0.5 and min(a[3], b[3]) - max(a[1], b[1]) > 0.5
            assert not overlap, f"{ta!r} overlaps {tb!r}"


def test_sheet_of_the_combination_demo_names_the_warmer_coil():
    """The demo with a cooler and a freezer on one condensing unit: the system's page names
    the cooler's coil on its isobar, with the dew temperature the sizing gave the cooler,
    and lists its outlet at the pressure CoolProp gives that dew temperature."""
    import io
    import re
    from pathlib import Path

    import pypdf

    from coldroom.inputs.opening import open_project
    from coldroom.output.pdf.sheet import render_sheet
    from coldroom.design.sizing import size_project

    path = Path(__file__).resolve().parents[2] / "project_files" / "combo_cooler_freezer.yaml"
    model = open_project(path).model
    result = size_project(model, str(path), path.read_bytes())
    (system,) = [s for s in result.systems if len(s.members) > 1]
    (cooler,) = [m for m in system.members if m.regulated]
    CP, state = _coolprop(system.refrigerant)
    state.update(CP.QT_INPUTS, 1.0, cooler.evaporating_temperature + 273.15)
    text = " ".join(page.extract_text() or "" for page in pypdf.PdfReader(io.BytesIO(render_sheet(result, model))).pages)
    text = re.sub(r"\s+", " ", text).replace("−", "-")
    assert f"{cooler.room} coil {cooler.evaporating_temperature:.1f} °C dew (EPR)" in text
    assert f"1a outlet, {cooler.room} (EPR) {state.p() / 1000:,.0f} kPa" in text
