"""Plot geometry of the p–h chart: spline smoothing, clipping to the plot, the label-occupancy grid.

Screen coordinates [pt] in, screen coordinates out; nothing here knows the
refrigerant or the units.
"""

from __future__ import annotations

import math
from typing import Sequence


# --- geometry helpers ----------------------------------------------------------------------------


def catmull_rom(points: Sequence[tuple[float, float]], per_segment: int = 8) -> list[tuple[float, float]]:
    """Centripetal Catmull–Rom spline through *points* (screen coordinates), densified.

    Centripetal parametrisation (α = 0.5) does not overshoot or form loops
    between unevenly spaced points [ref:yuksel-2011] [mem].
    """
    pts = [p for i, p in enumerate(points) if i == 0 or math.dist(p, points[i - 1]) > 1e-6]
    if len(pts) < 3:
        return list(pts)
    ext = [(2 * pts[0][0] - pts[1][0], 2 * pts[0][1] - pts[1][1])] + pts + [
        (2 * pts[-1][0] - pts[-2][0], 2 * pts[-1][1] - pts[-2][1])
    ]
    out = [pts[0]]
    for i in range(1, len(ext) - 2):
        p0, p1, p2, p3 = ext[i - 1], ext[i], ext[i + 1], ext[i + 2]
        t0 = 0.0
        t1 = t0 + max(math.dist(p0, p1), 1e-9) ** 0.5
        t2 = t1 + max(math.dist(p1, p2), 1e-9) ** 0.5
        t3 = t2 + max(math.dist(p2, p3), 1e-9) ** 0.5
        steps = max(1, min(per_segment, math.ceil(math.dist(p1, p2) / 2.5)))  # about every 2.5 pt
        for k in range(1, steps + 1):
            t = t1 + (t2 - t1) * k / steps
            a1 = _lerp(p0, p1, t0, t1, t)
            a2 = _lerp(p1, p2, t1, t2, t)
            a3 = _lerp(p2, p3, t2, t3, t)
            b1 = _lerp(a1, a2, t0, t2, t)
            b2 = _lerp(a2, a3, t1, t3, t)
            out.append(_lerp(b1, b2, t1, t2, t))
    return out


def _lerp(a: tuple[float, float], b: tuple[float, float], ta: float, tb: float, t: float) -> tuple[float, float]:
    wa, wb = (tb - t) / (tb - ta), (t - ta) / (tb - ta)
    return (wa * a[0] + wb * b[0], wa * a[1] + wb * b[1])


def clip(points: Sequence[tuple[float, float]], box: tuple[float, float, float, float]) -> list[list[tuple[float, float]]]:
    """Pieces of the polyline *points* inside *box* = (x0, y0, x1, y1) (Liang–Barsky per segment)."""
    x0, y0, x1, y1 = box
    pieces: list[list[tuple[float, float]]] = []
    current: list[tuple[float, float]] = []
    for a, b in zip(points, points[1:]):
        dx, dy = b[0] - a[0], b[1] - a[1]
        t_in, t_out = 0.0, 1.0
        ok = True
        for p, q in ((-dx, a[0] - x0), (dx, x1 - a[0]), (-dy, a[1] - y0), (dy, y1 - a[1])):
            if p == 0:
                if q < 0:
                    ok = False
                    break
            else:
                r = q / p
                if p < 0:
                    t_in = max(t_in, r)
                else:
                    t_out = min(t_out, r)
        if not ok or t_in > t_out:
            if current:
                pieces.append(current)
                current = []
            continue
        start = (a[0] + t_in * dx, a[1] + t_in * dy)
        end = (a[0] + t_out * dx, a[1] + t_out * dy)
        if not current or math.dist(current[-1], start) > 1e-6:
            if current:
                pieces.append(current)
            current = [start]
        current.append(end)
        if t_out < 1.0:
            pieces.append(current)
            current = []
    if current:
        pieces.append(current)
    return [p for p in pieces if len(p) >= 2]


class Occupancy:
    """Which cells (2 pt square) of the drawing something already covers.

    One integer per row of cells, bit i set when cell i of that row is covered
    (cells left of the drawing's origin are shifted by :attr:`SHIFT` bits), so a
    label's box is marked and tested a row at a time. Lines may run past the
    drawing's left edge; labels never do (they stay inside the plot), so the cells
    more than SHIFT columns to the left may share bit 0: nothing asks about them,
    and the rows stay short integers (quick to combine).
    """

    CELL = 2.0
    SHIFT = 64  # bit position of cell column 0; columns left of -SHIFT share bit 0

    def __init__(self, rows: dict[int, int] | None = None) -> None:
        self.rows: dict[int, int] = dict(rows) if rows else {}

    def line(self, points: Sequence[tuple[float, float]], pad: float = 0.6) -> None:
        """Mark the cells under a polyline, widened by *pad* [pt] across it (sampled every 1.6 pt)."""
        c = self.CELL
        rows = self.rows
        shift = self.SHIFT

        def mark(x: float, y: float) -> None:
            j = int(y // c)
            rows[j] = rows.get(j, 0) | (1 << max(int(x // c) + shift, 0))

        for a, b in zip(points, points[1:]):
            length = math.dist(a, b)
            n = max(1, int(length / 1.6))
            dx, dy = (b[0] - a[0]) / n, (b[1] - a[1]) / n
            # the offset across the segment that widens it by pad
            ox, oy = (-dy * pad / (length / n), dx * pad / (length / n)) if length > 0 else (pad, pad)
            for k in range(n + 1):
                x, y = a[0] + dx * k, a[1] + dy * k
                mark(x, y)
                mark(x + ox, y + oy)
                mark(x - ox, y - oy)

    def _bits(self, x0: float, x1: float) -> int:
        c, shift = self.CELL, self.SHIFT
        i0, i1 = max(int(x0 // c) + shift, 0), max(int(x1 // c) + shift, 0)
        return ((1 << (i1 - i0 + 1)) - 1) << i0

    def box(self, x0: float, y0: float, x1: float, y1: float) -> None:
        c = self.CELL
        bits = self._bits(x0, x1)
        rows = self.rows
        for j in range(int(y0 // c), int(y1 // c) + 1):
            rows[j] = rows.get(j, 0) | bits

    def free(self, x0: float, y0: float, x1: float, y1: float) -> bool:
        c = self.CELL
        bits = self._bits(x0, x1)
        rows = self.rows
        for j in range(int(y0 // c), int(y1 // c) + 1):
            if rows.get(j, 0) & bits:
                return False
        return True
