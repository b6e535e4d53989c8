"""Heat-exchanger and balance-point numerics of an existing unit: plain numbers in, plain numbers out.

:func:`balance_point` finds the suction and discharge dew points [°C] at
which a compressor (any function ``(S, D) -> (capacity [W], heat rejection
[W])``), the unit cooler and the condenser agree; :func:`highest_holding_ambient`
finds the warmest condenser air [°C] at which a capacity still covers a load.
Neither knows the project model nor the compressor's kind.
"""

from __future__ import annotations

import math
from dataclasses import dataclass
from typing import Callable, Optional, Sequence

from coldroom.design import AMBIENT_SWEEP
from coldroom.errors import CalculationError, PropertyRangeError
from coldroom.results import Note, Phrase
from coldroom.results import inline_term as _n

# --------------------------------------------------------------------------- heat exchangers


@dataclass(frozen=True)
class HeatExchanger:
    """Unit cooler or air-cooled condenser, linear in its temperature difference.

    Either a conductance K (capacity = K·ΔT: unit cooler K·DT1, EN 328 [mem] [ref:en-328];
    condenser THR = K·(SCT − ambient) [trade]) or, without rating data, a fixed
    temperature difference (the sizing TD).

    Attributes
    ----------
    conductance : float or None
        K [W/K].
    temperature_difference : float or None
        Fixed ΔT [K] when no rating is known.
    basis : str
        Where the figure came from (for the report).
    """

    conductance: Optional[float] = None
    temperature_difference: Optional[float] = None
    basis: Phrase = ()

    @classmethod
    def from_rating(cls, capacity: float, temperature_difference: float, what: str = "heat exchanger") -> "HeatExchanger":
        """K = rated capacity / rated ΔT [W/K]."""
        if capacity <= 0 or temperature_difference <= 0:
            raise CalculationError(f"{what}: rated capacity and ΔT must be positive")
        k = capacity / temperature_difference
        return cls(
            conductance=k,
            basis=(
                f"{what} rated ", _n(capacity, "power"), " at ΔT ", _n(temperature_difference, "temperature_difference"),
                ": K = ", _n(k, "conductance"),
            ),
        )

    @classmethod
    def fixed(cls, temperature_difference: float, basis: Phrase) -> "HeatExchanger":
        """No rating: the saturation temperature sits a fixed TD [K] from the air."""
        return cls(temperature_difference=temperature_difference, basis=basis)

    @property
    def is_fixed(self) -> bool:
        return self.conductance is None


# --------------------------------------------------------------------------- balance point


@dataclass(frozen=True)
class BalancePoint:
    """Where compressor, evaporator and condenser agree.

    Attributes
    ----------
    suction_dew, discharge_dew : float
        Balance dew points SST, SCT [°C].
    compressor_capacity, evaporator_capacity : float
        [W]; equal at balance (unless the evaporator TD is fixed).
    compressor_heat_rejection, condenser_heat_rejection : float
        [W]; equal at balance (unless the condenser TD is fixed).
    evaluations : int
        Compressor evaluations used.
    """

    suction_dew: float
    discharge_dew: float
    compressor_capacity: float
    evaporator_capacity: float
    compressor_heat_rejection: float
    condenser_heat_rejection: float
    evaluations: int


def _at(before: str, suction: float, discharge: float, after: str = "") -> Note:
    """A message naming a suction/discharge dew-point pair [°C], shown in the report's units."""
    return Note(before, "S ", _n(suction, "temperature"), " / D ", _n(discharge, "temperature"), after)


CompressorFunction = Callable[[float, float], tuple[float, float]]

BALANCE_TOLERANCE = 1e-6  # relative residual of both balance equations [-]


def balance_point(
    compressor: CompressorFunction,
    evaporator: HeatExchanger,
    condenser: HeatExchanger,
    room_temperature: float,
    ambient_temperature: float,
    *,
    guess: Optional[tuple[float, float]] = None,
    tolerance: float = BALANCE_TOLERANCE,
    max_iterations: int = 60,
) -> BalancePoint:
    """Solve for the suction and discharge dew points where the components agree.

    Equations (the balance-point method: compressor capacity = evaporator
    capacity and heat rejection = condenser capacity; common practice [trade]):

    * Q_comp(S, D) = K_e·(t_room − S)   (or S = t_room − TD_e when fixed)
    * THR_comp(S, D) = K_c·(D − t_amb)  (or D = t_amb + TD_c when fixed)

    Solved by Newton's method with a finite-difference Jacobian (kept while
    each step at least halves the residual: chord method), steps limited
    to 8 K and kept inside S < t_room, D > t_amb, halved while the residual grows.

    Parameters
    ----------
    compressor : callable
        ``compressor(S, D) -> (capacity [W], heat_rejection [W])``.
    evaporator, condenser : HeatExchanger
    room_temperature, ambient_temperature : float
        Air on the evaporator and on the condenser [°C].
    guess : (float, float), optional
        Starting S, D [°C].
    tolerance : float
        Relative residual of each equation [-].

    Raises
    ------
    CalculationError
        No balance (the compressor cannot run at any point the heat exchangers allow).

    Examples
    --------
    Linear compressor Q = 3000 + 100·S, THR = 1.3·Q; K_e = 400 W/K at +2 °C room;
    K_c = 500 W/K at 30 °C: S = (400·2 − 3000)/(100 + 400) = −4.4 °C,
    Q = 2560 W, D = 30 + 1.3·2560/500 = 36.656 °C.

    >>> comp = lambda s, d: (3000 + 100 * s, 1.3 * (3000 + 100 * s))
    >>> b = balance_point(comp, HeatExchanger(400.0), HeatExchanger(500.0), 2.0, 30.0)
    >>> round(b.suction_dew, 6), round(b.discharge_dew, 6)
    (-4.4, 36.656)
    """
    counter = [0]

    def comp(s: float, d: float) -> tuple[float, float]:
        counter[0] += 1
        try:
            return compressor(s, d)
        except PropertyRangeError as exc:
            raise CalculationError(_at("no balance point: the compressor cannot run at ", s, d, f" ({exc})")) from None

    s_fixed = room_temperature - evaporator.temperature_difference if evaporator.is_fixed else None  # type: ignore[operator]
    d_fixed = ambient_temperature + condenser.temperature_difference if condenser.is_fixed else None  # type: ignore[operator]
    s_low, s_high = room_temperature - 50.0, room_temperature - 0.05
    d_low, d_high = ambient_temperature + 0.05, ambient_temperature + 50.0

    def residuals(s: float, d: float) -> tuple[float, float, float, float]:
        q, thr = comp(s, d)
        r1 = 0.0 if s_fixed is not None else q - evaporator.conductance * (room_temperature - s)  # type: ignore[operator]
        r2 = 0.0 if d_fixed is not None else thr - condenser.conductance * (d - ambient_temperature)  # type: ignore[operator]
        return r1, r2, q, thr

    s = s_fixed if s_fixed is not None else (guess[0] if guess else room_temperature - 8.0)
    d = d_fixed if d_fixed is not None else (guess[1] if guess else ambient_temperature + 12.0)
    s = min(max(s, s_low), s_high) if s_fixed is None else s
    d = min(max(d, d_low), d_high) if d_fixed is None else d
    r1, r2, q, thr = residuals(s, d)

    def converged(r1: float, r2: float, q: float, thr: float) -> bool:
        scale = max(abs(q), abs(thr), 1.0)
        return abs(r1) <= tolerance * scale and abs(r2) <= tolerance * scale

    step_h = 0.01  # K, finite-difference step
    jacobian: Optional[tuple[float, float, float, float]] = None
    for _ in range(max_iterations):
        if converged(r1, r2, q, thr):
            break
        # Jacobian by forward differences in the free variables; kept (chord
        # method) while each step at least halves the residual, else renewed.
        if jacobian is None:
            j11 = j21 = j12 = j22 = 0.0
            if s_fixed is None:
                a1, a2, _, _ = residuals(s + step_h, d)
                j11, j21 = (a1 - r1) / step_h, (a2 - r2) / step_h
            if d_fixed is None:
                b1, b2, _, _ = residuals(s, d + step_h)
                j12, j22 = (b1 - r1) / step_h, (b2 - r2) / step_h
            jacobian = (j11, j12, j21, j22)
        j11, j12, j21, j22 = jacobian
        if s_fixed is None and d_fixed is None:
            det = j11 * j22 - j12 * j21
            if det == 0 or not math.isfinite(det):
                raise CalculationError("no balance point: singular balance equations")
            ds = (-r1 * j22 + r2 * j12) / det
            dd = (-r2 * j11 + r1 * j21) / det
        elif s_fixed is None:
            if j11 == 0:
                raise CalculationError("no balance point: capacity does not depend on suction temperature")
            ds, dd = -r1 / j11, 0.0
        else:
            if j22 == 0:
                raise CalculationError("no balance point: heat rejection balance does not depend on SCT")
            ds, dd = 0.0, -r2 / j22
        largest = max(abs(ds), abs(dd))
        if largest > 8.0:
            ds, dd = ds * 8.0 / largest, dd * 8.0 / largest
        norm = math.hypot(r1, r2)
        for _halving in range(12):
            s_new = min(max(s + ds, s_low), s_high)
            d_new = min(max(d + dd, d_low), d_high)
            try:
                n1, n2, nq, nthr = residuals(s_new, d_new)
            except CalculationError:
                ds, dd = ds / 2, dd / 2
                continue
            if math.hypot(n1, n2) < norm or _halving == 11:
                break
            ds, dd = ds / 2, dd / 2
        else:
            raise CalculationError("no balance point: the search left the range the refrigerant model covers")
        if math.hypot(n1, n2) > 0.5 * norm:
            jacobian = None
        s, d, r1, r2, q, thr = s_new, d_new, n1, n2, nq, nthr
    else:
        raise CalculationError(
            _at(f"no balance point found in {max_iterations} iterations (last ", s, d, ")")
        )
    if not converged(r1, r2, q, thr):  # pragma: no cover - loop exits only when converged
        raise CalculationError("no balance point")
    if s >= s_high or d <= d_low:
        raise CalculationError(
            _at("no balance point: the compressor has no capacity left at ", s, d)
        )
    evap = q if s_fixed is not None else evaporator.conductance * (room_temperature - s)  # type: ignore[operator]
    cond = thr if d_fixed is not None else condenser.conductance * (d - ambient_temperature)  # type: ignore[operator]
    return BalancePoint(s, d, q, evap, thr, cond, counter[0])


def highest_holding_ambient(
    capacity_at: Callable[[float, Optional[tuple[float, float]]], tuple[Optional[float], Optional[tuple[float, float]]]],
    load: Callable[[float], float],
    samples: Sequence[tuple[float, Optional[float], Optional[tuple[float, float]]]],
    resolution: float = 0.05,
) -> tuple[Optional[float], str]:
    """The highest ambient [°C] at which capacity ≥ load, within :data:`coldroom.design.AMBIENT_SWEEP`.

    *samples* are already computed (ambient, capacity or None, balance guess).
    Assumes capacity falls and load rises with ambient (one crossing). The
    crossing is bracketed from the samples (extended to the range ends when
    needed) and refined by the Illinois variant of regula falsi on
    f = capacity − load, falling back to bisection where no capacity exists.
    """
    low_limit, high_limit = AMBIENT_SWEEP
    known = {t: (c, g) for t, c, g in samples}

    def sample(t: float, guess: Optional[tuple[float, float]]) -> tuple[Optional[float], Optional[tuple[float, float]]]:
        if t not in known:
            known[t] = capacity_at(t, guess)
        return known[t]

    def f(t: float, capacity: Optional[float]) -> Optional[float]:
        return None if capacity is None else capacity - load(t)

    ordered = sorted(known)
    holding = [t for t in ordered if (f(t, known[t][0]) or -1.0) >= 0.0]
    if not holding:
        first = ordered[0] if ordered else high_limit
        c, g = sample(low_limit, known[first][1] if ordered else None)
        if f(low_limit, c) is None or f(low_limit, c) < 0:  # type: ignore[operator]
            return None, "fails_below_range"
        good = low_limit
        bad = min([t for t in ordered if t > low_limit] or [high_limit])
    else:
        good = max(holding)
        above = [t for t in sorted(known) if t > good]
        if not above:
            c, g = sample(high_limit, known[good][1])
            if f(high_limit, c) is not None and f(high_limit, c) >= 0:  # type: ignore[operator]
                return None, "holds_above_range"
            bad = high_limit
        else:
            bad = min(above)
    f_good = f(good, known[good][0])
    f_bad = f(bad, known[bad][0])
    side = 0
    for _ in range(60):
        if bad - good <= resolution:
            break
        if f_good is not None and f_bad is not None and f_good != f_bad:
            middle = good - f_good * (bad - good) / (f_bad - f_good)
            middle = min(max(middle, good + 0.1 * resolution), bad - 0.1 * resolution)
        else:
            middle = 0.5 * (good + bad)
        c, _g = sample(middle, known[good][1])
        value = f(middle, c)
        if value is not None and value >= 0.0:
            if abs(value) <= 1e-4 * max(load(middle), 1.0):
                return middle, "found"
            good, f_good = middle, value
            if side == -1 and f_bad is not None:
                f_bad /= 2.0  # Illinois: halve the stale end
            side = -1
        else:
            bad, f_bad = middle, value
            if side == 1 and f_good is not None:
                f_good /= 2.0
            side = 1
    return good, "found"
