"""A small stiff integrator in plain Python: the Rosenbrock formula of order 2(3) of ``ode23s``.

The pull-down's equations (:mod:`coldroom.loads.pulldown`) are stiff: the room air
settles in seconds, the product over hours. They are integrated by the modified
Rosenbrock formula of Shampine & Reichelt, "The MATLAB ODE Suite", *SIAM J. Sci.
Comput.* 18(1), 1997, §3.1 [ref:shampine-reichelt-1997] [mem]; for y' = f(y) (no
explicit time) and a step h, with d = 1/(2 + √2), e₃₂ = 6 + √2, W = I − h·d·J and J
the Jacobian ∂f/∂y at the step's start::

    F₀ = f(y₀)
    k₁ = W⁻¹ F₀
    F₁ = f(y₀ + ½h·k₁)
    k₂ = W⁻¹ (F₁ − k₁) + k₁
    y₁ = y₀ + h·k₂                      (second order, L-stable)
    F₂ = f(y₁)
    k₃ = W⁻¹ (F₂ − e₃₂·(k₂ − F₁) − 2·(k₁ − F₀))
    error ≈ h/6 · (k₁ − 2k₂ + k₃)

F₂ is the next step's F₀. The Jacobian is taken by forward differences each step,
the linear systems solved by Gaussian elimination with partial pivoting (the
systems have a handful of unknowns); a step is accepted when every component's
error is within ``atol + rtol·|y|`` and the next step is the usual
h·min(5, max(0.2, 0.8·err^(−1/3))) (Hairer & Wanner, *Solving Ordinary
Differential Equations II*, 2nd ed., §IV.8 step-size control [ref:hairer-wanner-1996] [mem]).

It replaces scipy's ``odeint`` (LSODA), whose package import (``scipy.integrate``
pulls in special, optimize, sparse and linalg) cost more than a room's whole
pull-down; the demos' pull-downs agree with LSODA's within 0.1 K and a minute
(``tests/validation/test_pulldown_integrator.py``).

Examples
--------
Exponential decay y' = −y from 1 over one unit of time: e⁻¹ = 0.367879…

>>> rows = integrate(lambda y: [-y[0]], [1.0], [0.0, 1.0], rtol=1e-6, atol=1e-9)
>>> round(rows[-1][0], 4)
0.3679
"""

from __future__ import annotations

import math
from typing import Callable, Optional, Sequence

from coldroom.errors import CalculationError

_D = 1.0 / (2.0 + math.sqrt(2.0))
_E32 = 6.0 + math.sqrt(2.0)
#: Relative step of the forward-difference Jacobian (√ of the double precision epsilon).
_JACOBIAN_STEP = math.sqrt(2.220446049250313e-16)


def _factor(matrix: list[list[float]]) -> tuple[list[list[float]], list[int]]:
    """LU factors of *matrix* in place (Gaussian elimination with partial pivoting) and the row order."""
    n = len(matrix)
    a = [list(row) for row in matrix]
    order = list(range(n))
    for col in range(n):
        pivot = max(range(col, n), key=lambda r: abs(a[r][col]))
        if a[pivot][col] == 0.0:
            raise CalculationError("the pull-down simulation failed: a singular iteration matrix")
        if pivot != col:
            a[col], a[pivot] = a[pivot], a[col]
            order[col], order[pivot] = order[pivot], order[col]
        head = a[col]
        inv = 1.0 / head[col]
        for r in range(col + 1, n):
            row = a[r]
            factor = row[col] * inv
            row[col] = factor
            if factor != 0.0:
                for c in range(col + 1, n):
                    row[c] -= factor * head[c]
    return a, order


def _solve(factors: tuple[list[list[float]], list[int]], rhs: Sequence[float]) -> list[float]:
    """x with matrix·x = rhs, from :func:`_factor`'s factors."""
    a, order = factors
    n = len(order)
    x = [rhs[order[r]] for r in range(n)]
    for r in range(1, n):
        row = a[r]
        x[r] -= sum(row[c] * x[c] for c in range(r))
    for r in range(n - 1, -1, -1):
        row = a[r]
        x[r] = (x[r] - sum(row[c] * x[c] for c in range(r + 1, n))) / row[r]
    return x


def numerical_jacobian(f: Callable[[list[float]], list[float]], y: list[float], fy: list[float]) -> list[list[float]]:
    """∂f/∂y [row i, column j = ∂f_i/∂y_j] by forward differences, column by column."""
    n = len(y)
    columns = []
    for j in range(n):
        step = _JACOBIAN_STEP * max(abs(y[j]), 1.0)
        shifted = list(y)
        shifted[j] = y[j] + step
        step = shifted[j] - y[j]  # the step actually represented
        fs = f(shifted)
        columns.append([(fs[i] - fy[i]) / step for i in range(n)])
    return [[columns[j][i] for j in range(n)] for i in range(n)]


def _hermite(y0: list[float], f0: list[float], y1: list[float], f1: list[float], h: float, s: float) -> list[float]:
    """The cubic through (y0, f0) at s = 0 and (y1, f1) at s = 1 on a step of length *h*, at *s*
    (cubic Hermite dense output, Hairer, Nørsett & Wanner, *Solving Ordinary Differential
    Equations I*, 2nd ed., §II.6 [ref:hairer-wanner-1996] [mem])."""
    s2, s3 = s * s, s * s * s
    a0, b0 = 2.0 * s3 - 3.0 * s2 + 1.0, (s3 - 2.0 * s2 + s) * h
    a1, b1 = 3.0 * s2 - 2.0 * s3, (s3 - s2) * h
    return [a0 * y0[i] + b0 * f0[i] + a1 * y1[i] + b1 * f1[i] for i in range(len(y0))]


def integrate(
    f: Callable[[list[float]], list[float]],
    y0: Sequence[float],
    times: Sequence[float],
    *,
    rtol: float,
    atol: float,
    jacobian: Optional[Callable[[list[float], list[float]], list[list[float]]]] = None,
    max_steps: int = 100000,
) -> list[list[float]]:
    """The solution of y' = f(y) at *times* (rising, the first the start) [the units of *y*].

    Parameters
    ----------
    f : callable
        f(y) → y' for a list *y* (autonomous: no time argument).
    y0 : sequence of float
        The state at ``times[0]``.
    times : sequence of float
        Report times, rising; steps run past them and the state there is the step's cubic
        Hermite interpolant; the last is reached exactly.
    rtol, atol : float
        Error tolerances of each component (relative [-], absolute [the unit of y]).
    jacobian : callable, optional
        jacobian(y, f(y)) → ∂f/∂y as rows; default :func:`numerical_jacobian`.
    max_steps : int
        Bound on the accepted and rejected steps together.

    Returns
    -------
    list of list of float
        The state at each report time (the first is *y0*).

    Raises
    ------
    CalculationError
        Too many steps, or a step that cannot be made small enough.
    """
    y = [float(v) for v in y0]
    n = len(y)
    rows = [list(y)]
    fy = f(y)
    t, end = float(times[0]), float(times[-1])
    h = (end - t) * 1e-5
    nxt = 1
    steps = 0
    while nxt < len(times):
        last = h >= end - t
        if last:
            h = end - t
        steps += 1
        if steps > max_steps:
            raise CalculationError(f"the pull-down simulation failed: more than {max_steps} steps")
        jac = jacobian(y, fy) if jacobian is not None else numerical_jacobian(f, y, fy)
        gamma = h * _D
        w = _factor([[(1.0 if r == c else 0.0) - gamma * jac[r][c] for c in range(n)] for r in range(n)])
        k1 = _solve(w, fy)
        f1 = f([y[i] + 0.5 * h * k1[i] for i in range(n)])
        k2 = _solve(w, [f1[i] - k1[i] for i in range(n)])
        k2 = [k2[i] + k1[i] for i in range(n)]
        y_new = [y[i] + h * k2[i] for i in range(n)]
        f2 = f(y_new)
        k3 = _solve(w, [f2[i] - _E32 * (k2[i] - f1[i]) - 2.0 * (k1[i] - fy[i]) for i in range(n)])
        err = 0.0
        for i in range(n):
            scale = atol + rtol * max(abs(y[i]), abs(y_new[i]))
            e = abs(h / 6.0 * (k1[i] - 2.0 * k2[i] + k3[i])) / scale
            if not e <= err:  # also takes a NaN, which rejects the step
                err = e
        if not err <= 1.0:  # rejected (a NaN too)
            h *= 0.2 if err != err or math.isinf(err) else max(0.2, 0.8 * err ** (-1.0 / 3.0))
            if h < 1e-10 * max(1.0, abs(end)):
                raise CalculationError("the pull-down simulation failed: the step became too small")
            continue
        t_new = end if last else t + h
        while nxt < len(times) and times[nxt] <= t_new:
            if times[nxt] == t_new:
                rows.append(list(y_new))
            else:
                rows.append(_hermite(y, fy, y_new, f2, h, (times[nxt] - t) / h))
            nxt += 1
        t, y, fy = t_new, y_new, f2
        h *= 5.0 if err == 0.0 else min(5.0, max(0.2, 0.8 * err ** (-1.0 / 3.0)))
    return rows
