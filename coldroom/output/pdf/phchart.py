"""The pressure–enthalpy chart of a cycle, drawn as a reportlab ``Drawing``.

The chart's lines come from :func:`coldroom.physics.chart_data.chart_data` (SI, cached
per process); this module chooses the window and the round values of the
lines in the project's units, and draws:

* the saturation dome (bubble and dew lines) up to the marked critical point;
* isotherms across subcooled liquid, two-phase (sloped for a zeotrope) and
  superheated vapour; isentropes near the compression; quality lines 0.1…0.9;
* the cycle as the calculation solved it: evaporator inlet 4 → evaporator
  outlet 1e → compressor suction 1 (when the suction line adds superheat or
  loses pressure) → discharge 2 → condenser (gas cooler) outlet 3
  (→ expansion-valve inlet 3v, when the sheet gives the liquid line's pressure
  there) → 4, each state with its pressure and temperature, the isentropic
  discharge 2s, and the SST / SCT (dew) isobars named;
* on one compressor serving several coils, each warmer coil behind an EPR:
  its named dew isobar, its evaporation to its outlet (1a, 1b …) and the
  EPR's isenthalpic throttle down to the coldest coil's pressure;
* the refrigerating effect, compression work and heat of rejection as
  enthalpy spans above the plot, with their values.

Lines are smoothed by a centripetal Catmull–Rom spline through the computed
states (each piece apart, so the physical corners at the bubble and dew lines
stay), and clipped to the plot by geometry (the SVG renderer has no clip
paths). Labels go where an occupancy grid of everything drawn says the space is
free; a label that finds no free place is left out.

What the chart shows is chosen in :mod:`coldroom.output.pdf.ph_window`, the
states and their labels come from :mod:`coldroom.output.pdf.ph_states`, the
smoothing, clipping and label grid from :mod:`coldroom.output.pdf.ph_geometry`.

A ``Drawing`` is a flowable (the sizing sheet places it like a table) and
renders to PDF and to SVG (:mod:`reportlab.graphics.renderSVG`), which gives
the stand-alone page of ``coldroom cycle --out``.
"""

from __future__ import annotations

import hashlib
import math
from dataclasses import dataclass
from functools import lru_cache
from typing import Any, Iterable, Sequence

from reportlab.graphics.shapes import Circle, Drawing, Group, Line, PolyLine, Polygon, Rect, String
from reportlab.lib import colors
from reportlab.platypus.flowables import Flowable
from reportlab.pdfbase.pdfmetrics import stringWidth

from coldroom import units as _units
from coldroom.output.pdf.charts import INK, MUTED, RULE
from coldroom.output.pdf.ph_geometry import Occupancy, catmull_rom, clip
from coldroom.output.pdf.ph_states import cycle_states, short_name, valve_inlet_state, warm_coils
from coldroom.output.pdf.ph_window import Window, choose_window, linear_ticks, log_ticks
from coldroom.output.pdf.text import clean


# --- our palette and line styles -------------------------------------------------------------
PLOT_BG = colors.HexColor("#FBFBF8")
GRID = colors.HexColor("#E3E6E1")
GRID_MINOR = colors.HexColor("#EEF0EC")
DOME = colors.HexColor("#23415F")
ISOTHERM = colors.HexColor("#5E8C76")
ISOTHERM_TEXT = colors.HexColor("#3F6B57")
ISENTROPE = colors.HexColor("#9A6C8E")
ISENTROPE_TEXT = colors.HexColor("#7A4E70")
QUALITY = colors.HexColor("#8FA3B8")
QUALITY_TEXT = colors.HexColor("#5F7389")
CYCLE = colors.HexColor("#C04A2B")
CYCLE_SOFT = colors.HexColor("#E2A593")
SPAN = colors.HexColor("#2E3A44")
EPR_COIL = colors.HexColor("#A8700A")  # warmer coils behind evaporator pressure regulators
EPR_SOFT = colors.HexColor("#DDBE7E")
EPR_TEXT = colors.HexColor("#7F5406")

FONT = "Helvetica"
FONT_BOLD = "Helvetica-Bold"


# --- the chart -------------------------------------------------------------------------------------


def _pressure_text(p_si: float, system: str) -> str:
    unit = _units.DISPLAY_UNITS[system]["pressure"]
    v = _units.to_unit(p_si, "pressure", unit)
    digits = 0 if v >= 100 else 1
    return f"{_units.format_number(v, digits, signed_zero=False)} {unit}"


def _temperature_text(t_c: float, system: str, digits: int = 1) -> str:
    return clean(_units.display(t_c, "temperature", system, digits, signed_zero=False))


def ph_chart(cycle: Any, system: str, width: float, height: float, title: str = "",
             valve_inlet_pressure: float | None = None, coil_names: Sequence[str] | None = None) -> Drawing:
    """The p–h chart of *cycle* (a :class:`coldroom.physics.cycle.CycleResult`) as a Drawing.

    Parameters
    ----------
    cycle : CycleResult
        The solved cycle (states in SI).
    system : {"SI", "IP"}
        Units shown: kPa, kJ/kg, °C or psia, Btu/lb, °F.
    width, height : float
        Size [pt].
    title : str
        Caption above the chart.
    valve_inlet_pressure : float or None
        Pressure at the expansion-valve inlet [Pa] when a liquid line changes
        the liquid's pressure (the sizing sheet knows it from the pipework):
        the state there is drawn as ``3v`` between 3 and the expansion.
    coil_names : sequence of str or None
        Names of the coils in the order of ``cycle.coil_outlets`` (one
        compressor serving several evaporators): each warmer coil behind an
        EPR gets its named dew isobar, its evaporation, its outlet (1a, 1b …)
        and the EPR's isenthalpic throttle to the coldest coil's pressure.
    """
    from reportlab import rl_config

    valve = valve_inlet_state(cycle, valve_inlet_pressure)
    window = choose_window(cycle, system, valve)
    # the shapes are made here from checked numbers: reportlab's per-attribute
    # validation (a development aid) is switched off while they are made
    checking = rl_config.shapeChecking
    rl_config.shapeChecking = 0
    try:
        return _draw(cycle, window, system, width, height, title, valve, coil_names)
    finally:
        rl_config.shapeChecking = checking


@dataclass(frozen=True)
class _Plot:
    """Where the plot sits on the drawing and what its axes span (display units)."""

    x0: float
    y0: float
    x1: float
    y1: float
    h_lo: float
    h_hi: float
    p_lo: float
    p_hi: float
    lp_lo: float
    lp_hi: float
    system: str

    def x(self, h_si: float) -> float:
        """Drawing x [pt] of an SI enthalpy [J/kg]."""
        hd = _display(self.system)[0]
        return self.x0 + (self.x1 - self.x0) * (hd(h_si) - self.h_lo) / (self.h_hi - self.h_lo)

    def y(self, p_si: float) -> float:
        """Drawing y [pt] of an SI pressure [Pa] (logarithmic axis)."""
        pd = _display(self.system)[1]
        return self.y0 + (self.y1 - self.y0) * (math.log10(pd(p_si)) - self.lp_lo) / (self.lp_hi - self.lp_lo)


@lru_cache(maxsize=None)
def _display(system: str) -> tuple[Any, Any]:
    """The display value of an SI enthalpy and of an SI pressure in *system* (two callables)."""
    units = _units.DISPLAY_UNITS[system]
    return (_units.unit_for("specific_energy", units["specific_energy"]).from_si,
            _units.unit_for("pressure", units["pressure"]).from_si)


#: Height of the strip above the plot that carries the enthalpy spans [pt].
_STRIP = 52.0


@dataclass
class _Background:
    """The part of a chart that depends on the refrigerant and the window only (cached)."""

    shapes: list[Any]  # frame, grid, ticks, axis titles, lines, dome, critical point, in drawing order
    occupied: dict[int, int]  # cells covered by anything (rows of Occupancy; never changed)
    strong: dict[int, int]  # cells covered by the dome and the critical point
    quality_pieces: list[tuple[float, list[list[tuple[float, float]]]]]
    isentrope_pieces: list[tuple[float, list[list[tuple[float, float]]]]]
    isotherm_pieces: list[tuple[float, list[list[tuple[float, float]]]]]
    crit: tuple[float, float]
    data: Any
    name: str = ""  # a stable name for the background (a digest of its cache key)


def _plot(window: Window, system: str, width: float, height: float, title: str) -> _Plot:
    hd, pd = _display(system)
    # layout: title, the span strip, the plot, the axes
    top_title = 14.0 if title else 0.0
    left, right, bottom = 50.0, 14.0, 42.0
    x0, y0 = left, bottom
    x1, y1 = width - right, height - top_title - _STRIP
    h_lo, h_hi = hd(window.enthalpy_low), hd(window.enthalpy_high)
    h_ticks = linear_ticks(h_lo, h_hi, 8)
    step = h_ticks[1] - h_ticks[0] if len(h_ticks) > 1 else (h_hi - h_lo)
    h_lo = math.floor(h_lo / step) * step
    h_hi = math.ceil(h_hi / step) * step
    p_lo, p_hi = pd(window.pressure_low), pd(window.pressure_high)
    return _Plot(x0, y0, x1, y1, h_lo, h_hi, p_lo, p_hi, math.log10(p_lo), math.log10(p_hi), system)


_BACKGROUNDS: dict[tuple, _Background] = {}


def _background(refrigerant: str, window: Window, system: str, plot: _Plot) -> _Background:
    """The chart's background for *refrigerant* on *plot*, computed once per process.

    Rooms of one job mostly share a refrigerant and, the window being on round
    values, a window: their charts differ only in the cycle and the labels.
    The shapes are shared between drawings (reportlab only reads them).
    """
    key = (refrigerant, window.pressure_low, window.pressure_high, window.isotherms, window.isentropes, system, plot)
    found = _BACKGROUNDS.get(key)
    if found is None:
        if len(_BACKGROUNDS) >= 64:
            _BACKGROUNDS.clear()
        found = _BACKGROUNDS[key] = _build_background(refrigerant, window, system, plot)
        found.name = "phchart" + hashlib.sha1(repr(key).encode("utf-8")).hexdigest()[:16]
    return found


def _build_background(refrigerant: str, window: Window, system: str, plot: _Plot) -> _Background:
    from coldroom.physics.chart_data import chart_data

    data = chart_data(refrigerant, window.pressure_low, window.pressure_high, window.isotherms, window.isentropes)
    h_unit = _units.DISPLAY_UNITS[system]["specific_energy"]
    p_unit = _units.DISPLAY_UNITS[system]["pressure"]
    x0, y0, x1, y1 = plot.x0, plot.y0, plot.x1, plot.y1
    h_lo, h_hi, lp_lo, lp_hi = plot.h_lo, plot.h_hi, plot.lp_lo, plot.lp_hi
    box = (x0, y0, x1, y1)
    drawing = Drawing(1, 1)  # a container: its contents are the shapes
    occupied = Occupancy()
    strong = Occupancy()
    X, Y = plot.x, plot.y

    def xy(points: Iterable[tuple[float, float]]) -> list[tuple[float, float]]:
        return [(X(h), Y(p)) for h, p in points]

    # --- frame, grid, ticks -----------------------------------------------------------
    drawing.add(Rect(x0, y0, x1 - x0, y1 - y0, fillColor=PLOT_BG, strokeColor=None))
    major, minor = log_ticks(plot.p_lo, plot.p_hi)
    for v in minor:
        y = y0 + (y1 - y0) * (math.log10(v) - lp_lo) / (lp_hi - lp_lo)
        drawing.add(Line(x0, y, x1, y, strokeColor=GRID_MINOR, strokeWidth=0.35))
        drawing.add(Line(x0 - 2.0, y, x0, y, strokeColor=MUTED, strokeWidth=0.4))
    for v in major:
        y = y0 + (y1 - y0) * (math.log10(v) - lp_lo) / (lp_hi - lp_lo)
        drawing.add(Line(x0, y, x1, y, strokeColor=GRID, strokeWidth=0.5))
        drawing.add(Line(x0 - 4.0, y, x0, y, strokeColor=MUTED, strokeWidth=0.5))
        drawing.add(String(x0 - 6.0, y - 2.4, f"{v:,}", fontName=FONT, fontSize=6.8, fillColor=MUTED, textAnchor="end"))
    for v in linear_ticks(h_lo, h_hi, 8):
        x = x0 + (x1 - x0) * (v - h_lo) / (h_hi - h_lo)
        drawing.add(Line(x, y0, x, y1, strokeColor=GRID, strokeWidth=0.5))
        drawing.add(Line(x, y0 - 4.0, x, y0, strokeColor=MUTED, strokeWidth=0.5))
        drawing.add(String(x, y0 - 12.0, f"{v:,}", fontName=FONT, fontSize=6.8, fillColor=MUTED, textAnchor="middle"))
    drawing.add(
        String((x0 + x1) / 2.0, y0 - 23.0, clean(f"specific enthalpy h  [{h_unit}]"), fontName=FONT, fontSize=7.5,
               fillColor=INK, textAnchor="middle")
    )
    axis = Group(
        String(0, 0, clean(f"pressure p  [{p_unit}, absolute; logarithmic]"), fontName=FONT, fontSize=7.5,
               fillColor=INK, textAnchor="middle")
    )
    axis.transform = (0, 1, -1, 0, x0 - 36.0, (y0 + y1) / 2.0)
    drawing.add(axis)

    def add_line(points: Sequence[tuple[float, float]], color: Any, width_pt: float, dash: Any = None,
                 smooth: bool = True, mark: bool = True) -> list[list[tuple[float, float]]]:
        screen = catmull_rom(points) if smooth else list(points)
        pieces = clip(screen, box)
        for piece in pieces:
            drawing.add(PolyLine(piece, strokeColor=color, strokeWidth=width_pt, strokeDashArray=dash,
                                 strokeLineJoin=1, strokeLineCap=1))
            if mark:
                occupied.line(piece)
        return pieces

    crit = (X(data.critical_enthalpy), Y(data.critical_pressure))

    # --- quality lines (to the critical point) ------------------------------------------
    quality_pieces = []
    for line in data.qualities:
        pts = xy(line.segments[0])
        pts.append(crit)
        quality_pieces.append((line.value, add_line(pts, QUALITY, 0.45, (1.2, 1.6))))
    # --- isentropes ------------------------------------------------------------------------
    isentrope_pieces = []
    for line in data.isentropes:
        pieces = []
        for seg in line.segments:
            pieces += add_line(xy(seg), ISENTROPE, 0.55, (4, 2.2))
        isentrope_pieces.append((line.value, pieces))
    # --- isotherms --------------------------------------------------------------------------
    isotherm_pieces = []
    for line in data.isotherms:
        pieces = []
        for seg, phase in zip(line.segments, line.phases):
            got = add_line(xy(seg), ISOTHERM, 0.55)
            if phase in ("vapour", "supercritical"):
                pieces += got
        isotherm_pieces.append((line.value, pieces))
    # --- the dome up to the critical point ----------------------------------------------
    # smooth each branch apart (the critical point is where they meet with a common tangent)
    bubble_pts = catmull_rom(xy(data.bubble) + [crit])
    dew_pts = catmull_rom([crit] + list(reversed(xy(data.dew))))
    for piece in clip(bubble_pts[:-1] + dew_pts, box):
        drawing.add(PolyLine(piece, strokeColor=DOME, strokeWidth=1.4, strokeLineJoin=1, strokeLineCap=1))
        occupied.line(piece, pad=1.0)
        strong.line(piece, pad=1.0)
    if box[0] <= crit[0] <= box[2] and box[1] <= crit[1] <= box[3]:
        cx, cy = crit
        drawing.add(Polygon([cx, cy + 3.4, cx + 3.4, cy, cx, cy - 3.4, cx - 3.4, cy], fillColor=DOME, strokeColor=None))
        occupied.box(cx - 4, cy - 4, cx + 4, cy + 4)
        strong.box(cx - 4, cy - 4, cx + 4, cy + 4)
    return _Background(list(drawing.contents), occupied.rows, strong.rows,
                       quality_pieces, isentrope_pieces, isotherm_pieces, crit, data)


def _draw(cycle: Any, window: Window, system: str, width: float, height: float, title: str,
          valve: Any = None, coil_names: Sequence[str] | None = None) -> Drawing:
    h_unit = _units.DISPLAY_UNITS[system]["specific_energy"]
    s_unit = _units.DISPLAY_UNITS[system]["specific_heat"]
    hd = _display(system)[0]  # display value of an SI enthalpy

    plot = _plot(window, system, width, height, title)
    x0, y0, x1, y1 = plot.x0, plot.y0, plot.x1, plot.y1
    box = (x0, y0, x1, y1)
    states = cycle_states(cycle, valve)
    s1, s2, s3, s4 = cycle.states
    evap_out = cycle.evaporator_outlet
    X, Y = plot.x, plot.y

    drawing = Drawing(width, height)
    if title:
        drawing.add(String(0, height - 10.0, clean(title), fontName=FONT_BOLD, fontSize=9, fillColor=INK))
    bg = _background(cycle.refrigerant, window, system, plot)
    start = len(drawing.contents)
    drawing.contents.extend(bg.shapes)
    drawing._shared_background = (start, len(drawing.contents), bg.name)  # for SharedBackgroundChart
    occupied = Occupancy(bg.occupied)  # everything drawn (a copy of the background's)
    strong = Occupancy(bg.strong)  # the dome, the cycle, markers and labels: never covered
    data, crit = bg.data, bg.crit
    quality_pieces, isentrope_pieces, isotherm_pieces = bg.quality_pieces, bg.isentrope_pieces, bg.isotherm_pieces

    # --- SST / SCT isobars across the chart --------------------------------------------------
    isobars = [(cycle.evaporating_pressure, f"SST {_temperature_text(cycle.evaporating_temperature, system)} dew")]
    if cycle.transcritical:
        isobars.append((cycle.discharge_pressure, f"gas cooler {_pressure_text(cycle.discharge_pressure, system)}"))
    else:
        isobars.append((cycle.discharge_pressure, f"SCT {_temperature_text(cycle.condensing_temperature, system)} dew"))
    if abs(cycle.suction_pressure - cycle.evaporating_pressure) > 1e-6 * cycle.evaporating_pressure:
        isobars.append((cycle.suction_pressure, f"suction {_pressure_text(cycle.suction_pressure, system)}"))
    for p, _ in isobars:
        y = Y(p)
        if y0 <= y <= y1:
            drawing.add(Line(x0, y, x1, y, strokeColor=CYCLE_SOFT, strokeWidth=0.6, strokeDashArray=(6, 2, 1, 2)))
            occupied.line([(x0, y), (x1, y)], pad=0.4)
    # the warmer coils' evaporating pressures (behind EPRs), named by their dew temperature
    warm = warm_coils(cycle, coil_names)
    warm_isobars = []
    if warm:
        from coldroom.physics.refrigerant import get_fluid

        fluid = get_fluid(cycle.refrigerant)
        for mark, name, st in warm:
            t_dew = fluid.dew_temperature(st.p)
            warm_isobars.append((st.p, f"{short_name(name)} coil {_temperature_text(t_dew, system)} dew (EPR)",
                                 f"{mark} {_temperature_text(t_dew, system)} dew (EPR)"))
    for p, *_ in warm_isobars:
        y = Y(p)
        if y0 <= y <= y1:
            drawing.add(Line(x0, y, x1, y, strokeColor=EPR_SOFT, strokeWidth=0.6, strokeDashArray=(6, 2, 1, 2)))
            occupied.line([(x0, y), (x1, y)], pad=0.4)

    # --- the cycle ----------------------------------------------------------------------------------
    ring = [(X(s.h), Y(s.p)) for _, s in states]
    # the compression is drawn as a straight line between its end states
    path = ring + [ring[0]]
    for piece in clip(path, box):
        drawing.add(PolyLine(piece, strokeColor=CYCLE, strokeWidth=1.8, strokeLineJoin=1, strokeLineCap=1))
        occupied.line(piece, pad=1.2)
        strong.line(piece, pad=1.2)
    # isentropic discharge 2s: a hollow marker on the dashed ideal compression
    s2s = cycle.isentropic_discharge
    i1 = next(i for i, (name, _) in enumerate(states) if name == "1")
    p2s = (X(s2s.h), Y(s2s.p))
    drawing.add(Line(ring[i1][0], ring[i1][1], p2s[0], p2s[1], strokeColor=CYCLE, strokeWidth=0.6, strokeDashArray=(2, 1.5)))
    occupied.line([ring[i1], p2s])
    strong.line([ring[i1], p2s])
    drawing.add(Circle(p2s[0], p2s[1], 1.9, fillColor=colors.white, strokeColor=CYCLE, strokeWidth=0.7))
    for x, y in ring:
        drawing.add(Circle(x, y, 2.4, fillColor=CYCLE, strokeColor=colors.white, strokeWidth=0.6))
        occupied.box(x - 3, y - 3, x + 3, y + 3)
        strong.box(x - 3, y - 3, x + 3, y + 3)
    # warmer coils: evaporation at their own pressure from the liquid's enthalpy to their
    # outlet, then the EPR's isenthalpic throttle down to the coldest coil's pressure, where
    # the vapours mix (the cycle's model)
    warm_points = []
    y_mix = Y(cycle.evaporating_pressure)
    for mark, name, st in warm:
        xo, yo = X(st.h), Y(st.p)
        for pts, dash, lw in (([(X(s3.h), yo), (xo, yo)], None, 1.1), ([(xo, yo), (xo, y_mix)], (3, 1.6), 0.9)):
            for piece in clip(pts, box):
                drawing.add(PolyLine(piece, strokeColor=EPR_COIL, strokeWidth=lw, strokeDashArray=dash,
                                     strokeLineJoin=1, strokeLineCap=1))
                occupied.line(piece, pad=1.0)
                strong.line(piece, pad=1.0)
        if x0 <= xo <= x1 and y0 <= yo <= y1:
            drawing.add(Circle(xo, yo, 2.2, fillColor=EPR_COIL, strokeColor=colors.white, strokeWidth=0.6))
            occupied.box(xo - 3, yo - 3, xo + 3, yo + 3)
            strong.box(xo - 3, yo - 3, xo + 3, yo + 3)
            warm_points.append((mark, st, xo, yo))

    # --- enthalpy spans above the plot --------------------------------------------------------------
    rows = [
        (evap_out.h, s4.h, "refrigerating effect"),
        (s2.h, s1.h, "compression work"),
        (s2.h, s3.h, "heat of rejection" if not cycle.transcritical else "heat rejected in the gas cooler"),
    ]
    row_y = [y1 + 8.0, y1 + 22.0, y1 + 36.0]
    for x_state in sorted({round(X(s.h), 3) for _, s in states}):
        if x0 <= x_state <= x1:
            drawing.add(Line(x_state, y1, x_state, y1 + _STRIP - 6.0, strokeColor=RULE, strokeWidth=0.5, strokeDashArray=(1, 1.5)))
    for (ha, hb, name), y in zip(rows, row_y):
        xa, xb = sorted((min(max(X(hb), x0), x1), min(max(X(ha), x0), x1)))
        _span(drawing, xa, xb, y, f"{name} {_units.format_number(hd(ha) - hd(hb), 1, signed_zero=False)} {h_unit}")
    drawing.add(Line(x0, y1, x1, y1, strokeColor=MUTED, strokeWidth=0.5))
    drawing.add(Rect(x0, y0, x1 - x0, y1 - y0, fillColor=None, strokeColor=MUTED, strokeWidth=0.6))

    _legend(drawing, x0, x1, 4.0, s_unit, epr=bool(warm))

    # --- labels -----------------------------------------------------------------------------------------
    def place(text: str, candidates: Iterable[tuple], color: Any, size: float = 6.3,
              bold: bool = False, anchor: str = "start", pad: float = 0.8,
              patch_only: bool | None = None) -> tuple[float, float] | None:
        """Put *text* at the first candidate (x, y) or (x, y, anchor) where nothing is drawn;
        failing that, at the first where only thin lines are, on a patch of the plot's
        background that hides them. Returns the (x, y) used, or None."""
        font = FONT_BOLD if bold else FONT
        w = stringWidth(text, font, size)
        boxes = []
        for cand in candidates:
            x, y = cand[0], cand[1]
            a = cand[2] if len(cand) > 2 else anchor
            bx0 = x if a == "start" else x - w if a == "end" else x - w / 2
            bx1 = bx0 + w
            by0, by1 = y - 1.6, y + size * 0.76
            if bx0 < x0 + 1 or bx1 > x1 - 1 or by0 < y0 + 1 or by1 > y1 - 1:
                continue
            boxes.append((x, y, a, bx0 - pad, by0 - pad, bx1 + pad, by1 + pad))
        for patch in ((False, True) if patch_only is None else (patch_only,)):
            grid = strong if patch else occupied
            for x, y, a, ba, bb, bc, bd in boxes:
                if grid.free(ba, bb, bc, bd):
                    if patch:
                        drawing.add(Rect(ba, bb, bc - ba, bd - bb, fillColor=PLOT_BG, strokeColor=None))
                    drawing.add(String(x, y, text, fontName=font, fontSize=size, fillColor=color, textAnchor=a))
                    occupied.box(ba, bb, bc, bd)
                    strong.box(ba, bb, bc, bd)
                    return (x, y)
        return None

    def along(pieces: Sequence[Sequence[tuple[float, float]]], dx: float, dy: float, every: int = 3) -> list[tuple[float, float]]:
        out = []
        for piece in pieces:
            for k in range(0, len(piece), every):
                out.append((piece[k][0] + dx, piece[k][1] + dy))
        return out

    def ring_around(x: float, y: float, size: float, radii: Sequence[float]) -> list[tuple[float, float, str]]:
        """Candidate label positions around (x, y): (text x, baseline y, anchor)."""
        out = []
        for r in radii:
            for deg in (35, -35, 145, -145, 90, -90, 0, 180, 60, -60, 120, -120):
                a = math.radians(deg)
                cx, cy = x + r * math.cos(a), y + r * math.sin(a)
                anchor = "start" if math.cos(a) > 0.2 else "end" if math.cos(a) < -0.2 else "middle"
                out.append((cx, cy - size * 0.35, anchor))
        return out

    def place_near(text: str, x: float, y: float, color: Any, size: float, bold: bool = False,
                   radii: Sequence[float] = (6, 10, 15, 22, 30, 40, 52, 66)) -> bool:
        """*text* near (x, y): the first free spot around it, then the first over thin lines only;
        a leader line when it sits more than 12 pt away."""
        ring = ring_around(x, y, size, radii)
        for patch in (False, True):
            spot = place(text, ring, color, size, bold=bold, pad=0.4, patch_only=patch)
            if spot is not None:
                cx, cy = spot
                if math.dist((cx, cy + size * 0.35), (x, y)) > 12:
                    drawing.add(Line(x, y, cx, cy + size * 0.35, strokeColor=color, strokeWidth=0.35))
                return True
        return False

    # states: number, pressure and temperature
    for (name, s), (x, y) in zip(states, ring):
        text = f"{name}:  {_pressure_text(s.p, system)}, {_temperature_text(s.t, system)}"
        if name == "3v" and s.quality is not None:
            text += f", x = {s.quality:.3f}"  # flash gas before the valve
        place_near(text, x, y, CYCLE, 6.6, bold=True) or place_near(name, x, y, CYCLE, 7.0, bold=True)
    for mark, st, x, y in warm_points:
        text = f"{mark}:  {_pressure_text(st.p, system)}, {_temperature_text(st.t, system)}"
        place_near(text, x, y, EPR_TEXT, 6.4, bold=True) or place_near(mark, x, y, EPR_TEXT, 6.8, bold=True)
    place_near("2s", p2s[0], p2s[1], CYCLE, 6.0, radii=(5, 8))
    # SST / SCT names at the right end of their isobars
    for (p, *texts), color in [(i, CYCLE) for i in isobars] + [(i, EPR_TEXT) for i in warm_isobars]:
        y = Y(p)
        if y0 <= y <= y1:
            for text in texts:  # a warmer coil's: with its name, else with its mark only
                if place(clean(text), [(x1 - 4 - k * 12.0, y + 2.0) for k in range(40)] + [(x1 - 4 - k * 12.0, y - 8.0) for k in range(40)],
                         color, 6.4, anchor="end", pad=0.3):
                    break
    # the critical point
    cx, cy = crit
    crit_text = f"critical point {_temperature_text(data.critical_temperature, system)}, {_pressure_text(data.critical_pressure, system)}"
    place_near(clean(crit_text), cx, cy, DOME, 6.3)
    # isotherms: at the upper part of their vapour piece, right of the line
    t_unit = _units.DISPLAY_UNITS[system]["temperature"]
    for value, pieces in isotherm_pieces:
        label = clean(_units.format_number(_units.to_unit(value, "temperature", t_unit), 0, signed_zero=False) + f" {t_unit}")
        place(label, along(pieces, 2.5, 2.0, 2), ISOTHERM_TEXT, 6.2, pad=0.5)
    # isentropes: near their upper end
    for value, pieces in isentrope_pieces:
        v = _units.to_unit(value, "specific_heat", s_unit)
        label = clean(f"s = {v:.2f}" if system == "SI" else f"s = {v:.3f}")
        cands = []
        for piece in pieces:
            cands += [(x + 3.0, y - 2.0) for x, y in reversed(piece[::2])]
        place(label, cands, ISENTROPE_TEXT, 6.0, pad=0.5)
    # quality lines: near the bottom of the dome
    for value, pieces in quality_pieces:
        cands = []
        for piece in pieces:
            cands += [(x + 1.5, y + 1.0) for x, y in piece[2:len(piece) // 2:2]]
        place(f"x = {value:.1f}", cands, QUALITY_TEXT, 5.8, pad=0.4)
    return drawing


def _span(drawing: Drawing, xa: float, xb: float, y: float, text: str) -> None:
    """A double-headed dimension line from *xa* to *xb* at height *y*, its text above."""
    text = clean(text)
    drawing.add(Line(xa, y, xb, y, strokeColor=SPAN, strokeWidth=0.7))
    for x, sign in ((xa, 1), (xb, -1)):
        drawing.add(Polygon([x, y, x + sign * 4.0, y + 1.6, x + sign * 4.0, y - 1.6], fillColor=SPAN, strokeColor=None))
        drawing.add(Line(x, y - 3.5, x, y + 3.5, strokeColor=SPAN, strokeWidth=0.6))
    w = stringWidth(text, FONT, 6.6)
    mid = (xa + xb) / 2.0
    drawing.add(String(mid, y + 3.2, text, fontName=FONT, fontSize=6.6, fillColor=SPAN, textAnchor="middle"))
    del w


def _legend(drawing: Drawing, x0: float, x1: float, y: float, s_unit: str, epr: bool = False) -> None:
    """The key, one row under the enthalpy axis (*epr*: with the warmer coils' entry)."""
    rows = [
        (DOME, 1.4, None, "saturation (bubble, dew)"),
        (ISOTHERM, 0.55, None, "isotherm"),
        (ISENTROPE, 0.55, (4, 2.2), clean(f"isentrope, s in {s_unit}")),
        (QUALITY, 0.45, (1.2, 1.6), "vapour quality x" if not epr else "quality x"),
        (CYCLE, 1.8, None, "this cycle"),
        (CYCLE_SOFT, 0.6, (6, 2, 1, 2), "SST / SCT (dew)"),
    ]
    if epr:
        rows.append((EPR_COIL, 1.1, None, "coil behind EPR"))
    key, gap, after = 16.0, 4.0, 10.0  # key line, gap to its text, space after the text [pt]
    widths = [key + gap + stringWidth(r[3], FONT, 6.3) + after for r in rows]
    if epr and sum(widths) - after > x1 - x0:  # the extra entry makes it too wide: shorter words and keys
        short = {"saturation (bubble, dew)": "saturation", "SST / SCT (dew)": "SST / SCT"}
        rows = [(c, lw, dash, short.get(text, text)) for c, lw, dash, text in rows]
        key, gap, after = 12.0, 3.0, 7.0
        widths = [key + gap + stringWidth(r[3], FONT, 6.3) + after for r in rows]
    x = x0 + max(0.0, ((x1 - x0) - sum(widths)) / 2.0)
    for (color, lw, dash, text), w in zip(rows, widths):
        drawing.add(Line(x, y + 2.2, x + key, y + 2.2, strokeColor=color, strokeWidth=lw, strokeDashArray=dash))
        drawing.add(String(x + key + gap, y, text, fontName=FONT, fontSize=6.3, fillColor=INK))
        x += w


class SharedBackgroundChart(Flowable):
    """A chart from :func:`ph_chart` that draws its background into a PDF form once per document.

    The sizing sheet has one chart per room, and rooms on one refrigerant mostly share
    a background (frame, grid, dome and the lines of constant temperature, entropy and
    quality): the first chart defines it as a form XObject, every chart shows it by
    name and draws only its own title, cycle and labels on top. The page looks the same
    as with the plain drawing; the PDF is smaller and quicker to write. Other renderers
    (SVG) take the plain drawing.
    """

    def __init__(self, drawing: Drawing) -> None:
        super().__init__()
        self.drawing = drawing
        self.width, self.height = drawing.width, drawing.height
        self.hAlign = getattr(drawing, "hAlign", "LEFT")

    def wrap(self, available_width: float, available_height: float) -> tuple[float, float]:
        return self.drawing.wrap(available_width, available_height)

    def draw(self) -> None:
        from reportlab.graphics import renderPDF

        d, canv = self.drawing, self.canv
        span = getattr(d, "_shared_background", None)
        if span is None:
            renderPDF.draw(d, canv, 0, 0)
            return
        start, end, name = span
        if not canv.hasForm(name):
            canv.beginForm(name, -60.0, -60.0, d.width + 60.0, d.height + 60.0)
            renderPDF.draw(Drawing(d.width, d.height, *d.contents[start:end]), canv, 0, 0)
            canv.endForm()
        if start:
            renderPDF.draw(Drawing(d.width, d.height, *d.contents[:start]), canv, 0, 0)
        canv.doForm(name)
        renderPDF.draw(Drawing(d.width, d.height, *d.contents[end:]), canv, 0, 0)
