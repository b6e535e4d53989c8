"""Heat-exchanger and balance-point numerics of an existing unit: plain numbers in, plain numbers out.

:func:`balance_point` finds the suction and discharge dew points [°C] at
which a compressor (any function ``(S, D) -> (capacity [W], heat rejection
[W])``), the unit cooler and the condenser agree; :func:`highest_holding_ambient`
finds the warmest condenser air [°C] at which a capacity still covers a load.
Neither knows the project model nor the compressor's kind.
"""

from __future__ import annotations

import math
from dataclasses import dataclass, replace
from typing import Any, Callable, Optional, Sequence

from coldroom.rules import AMBIENT_SWEEP
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
BALANCE_ACCEPTANCE = 10.0  # a bracketed root is a balance only within this many tolerances [-]
NEWTON_BUDGET = 40  # compressor evaluations for the quick Newton search before the bracketed one [-]
BRACKET_EDGE = 1e-4  # closest approach of a dew point to its air temperature in the bracketed search [K]
BRACKET_SPAN = 50.0  # farthest a dew point may sit from its air temperature [K]


class _OverBudget(Exception):
    """The quick search used up its compressor evaluations (not a ColdroomError: never leaves this module)."""


class _NoBalance(CalculationError):
    """One of the 1-D searches found no balance (the message says which component limits)."""


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

    First a quick Newton search (:func:`_newton_balance`) with at most
    :data:`NEWTON_BUDGET` compressor evaluations; when it fails or runs out, a
    bracketed search (:func:`_bracketed_balance`) whose brackets come from the
    physics: the suction lies between t_room − 50 K and the room air (where an
    unlimited coil puts it), the condensing between the condenser air (an
    unlimited condenser) and t_amb + 50 K. That search ends within a bounded
    number of evaluations for any ratings, and either finds the balance or
    says which component leaves none.

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

    def counted(s: float, d: float) -> tuple[float, float]:
        counter[0] += 1
        return compressor(s, d)

    def limited(s: float, d: float) -> tuple[float, float]:
        if counter[0] >= NEWTON_BUDGET:
            raise _OverBudget
        return counted(s, d)

    try:
        quick = _newton_balance(
            limited, evaporator, condenser, room_temperature, ambient_temperature,
            guess=guess, tolerance=tolerance, max_iterations=max_iterations,
        )
        return replace(quick, evaluations=counter[0])
    except (_OverBudget, CalculationError):
        pass
    found = _bracketed_balance(counted, evaporator, condenser, room_temperature, ambient_temperature, tolerance)
    return replace(found, evaluations=counter[0])


def _falling_root(
    f: Callable[[float], Optional[float]],
    favourable: float,
    far: float,
    start: float,
    converged: Callable[[float, float], bool],
    step: float = 0.5,
) -> tuple[str, float, Optional[float]]:
    """Root of *f*, which falls from its *favourable* end to its *far* end; ``None`` from *f*
    means "cannot run here" and counts as negative.

    Returns (outcome, x, f(x)): ``"cannot"`` (None already at the favourable end),
    ``"edge"`` (f ≤ 0 there: the root lies beyond the favourable end), ``"short"``
    (f > 0 up to the far end: no root in range) or ``"root"`` (x the best point found:
    the caller checks its residual). The bracket is found by stepping from *start*
    towards the far end (steps growing fourfold) and refined by the Illinois variant of
    regula falsi (Dowell & Jarratt, BIT 11 (1971) 168 [mem]), by bisection while an end
    cannot run (then only to 0.01 K: a root that close to the edge of what the compressor
    can do is no balance).
    """
    f_fav = f(favourable)
    if f_fav is None:
        return "cannot", favourable, None
    if f_fav <= 0.0:
        return "edge", favourable, f_fav
    direction = 1.0 if far > favourable else -1.0
    pos, f_pos = favourable, f_fav
    x = min(max(start, min(favourable, far)), max(favourable, far))
    while True:
        fx = f(x)
        if fx is None or fx <= 0.0:
            neg, f_neg = x, fx
            break
        if fx is not None and (x - pos) * direction > 0.0:
            pos, f_pos = x, fx
        if x == far:
            return "short", far, fx
        x = min(x + direction * step, far) if direction > 0 else max(x + direction * step, far)
        step *= 4.0
    best_x, best_f = (neg, f_neg) if f_neg is not None and -f_neg < f_pos else (pos, f_pos)
    side = 0
    for _ in range(100):
        if best_f == 0.0 or converged(best_x, best_f):
            break
        width = abs(neg - pos)
        if width < (1e-2 if f_neg is None else 1e-9):
            break
        if f_neg is None:
            x = 0.5 * (pos + neg)
        else:
            x = neg - f_neg * (neg - pos) / (f_neg - f_pos) if f_neg != f_pos else 0.5 * (pos + neg)
            if not min(pos, neg) < x < max(pos, neg):
                x = 0.5 * (pos + neg)
        fx = f(x)
        if fx is not None and abs(fx) < abs(best_f):
            best_x, best_f = x, fx
        if fx is None or fx <= 0.0:
            neg, f_neg = x, fx
            if side == -1 and f_pos is not None:
                f_pos /= 2.0  # Illinois: halve the stale end
            side = -1
        else:
            pos, f_pos = x, fx
            if side == 1 and f_neg is not None:
                f_neg /= 2.0
            side = 1
    return "root", best_x, best_f


def _bracketed_balance(
    compressor: CompressorFunction,
    evaporator: HeatExchanger,
    condenser: HeatExchanger,
    room_temperature: float,
    ambient_temperature: float,
    tolerance: float,
) -> BalancePoint:
    """The balance as two nested 1-D root searches, each bracketed by the heat exchangers' limits.

    Inner: at a discharge dew D, the suction S where Q_comp(S, D) = K_e·(t_room − S);
    g(S) = Q_comp − K_e·(t_room − S) rises with S (the compressor's capacity rises, the
    coil's falls), so g ≤ 0 at t_room − :data:`BRACKET_EDGE` means the coil takes all the
    compressor pumps (S at the room air, coil capacity = compressor capacity) and g > 0 at
    t_room − :data:`BRACKET_SPAN` means the coil is too small for any suction. Outer:
    h(D) = THR(S(D), D) − K_c·(D − t_amb) falls with D, read the same way. Where the
    compressor cannot run, g and h count as "below the balance". A root is a balance only
    when its residual is within :data:`BALANCE_ACCEPTANCE` tolerances.
    """
    def run(s: float, d: float) -> Optional[tuple[float, float]]:
        try:
            q, thr = compressor(s, d)
        except CalculationError:  # PropertyRangeError, no flow, outside a model: cannot run here
            return None
        return (q, thr) if math.isfinite(q) and math.isfinite(thr) else None

    accept = BALANCE_ACCEPTANCE * tolerance
    s_fixed = room_temperature - evaporator.temperature_difference if evaporator.is_fixed else None  # type: ignore[operator]
    d_fixed = ambient_temperature + condenser.temperature_difference if condenser.is_fixed else None  # type: ignore[operator]
    s_low, s_high = room_temperature - BRACKET_SPAN, room_temperature - BRACKET_EDGE
    d_low, d_high = ambient_temperature + BRACKET_EDGE, ambient_temperature + BRACKET_SPAN
    last_s = [room_temperature - 8.0]

    def suction(d: float) -> tuple[float, float, float, float]:
        """(S, Q, THR, unit-cooler capacity) where compressor and unit cooler agree at *d*."""
        if s_fixed is not None:
            v = run(s_fixed, d)
            if v is None:
                raise _NoBalance(_at("no balance point: the compressor cannot run at ", s_fixed, d))
            return s_fixed, v[0], v[1], v[0]
        k: float = evaporator.conductance  # type: ignore[assignment]
        memo: dict[float, Optional[tuple[float, float]]] = {}

        def g(s: float) -> Optional[float]:
            memo[s] = v = run(s, d)
            return None if v is None else v[0] - k * (room_temperature - s)

        outcome, s, gs = _falling_root(
            lambda x: g(-x),  # in −S, g falls from the room air downwards
            -s_high, -s_low, -last_s[0],
            lambda x, fx: abs(fx) <= tolerance * max(abs(memo[-x][0]), 1.0),  # type: ignore[index]
        )
        s = -s
        if outcome == "cannot":
            raise _NoBalance(_at("no balance point: the compressor cannot run even at ", s, d))
        v = memo[s]
        if outcome == "edge":  # the coil is not what limits: it takes all the compressor pumps
            return s, v[0], v[1], v[0]  # type: ignore[index]
        if outcome == "short":
            raise _NoBalance(_at("no balance point: the unit cooler is too small for the compressor (balance below ", s, d, ")"))
        if v is None or abs(gs) > accept * max(abs(v[0]), 1.0):  # type: ignore[arg-type]
            raise _NoBalance(_at("no balance point: the compressor cannot run where the unit cooler needs it, ", s, d))
        last_s[0] = s
        return s, v[0], v[1], k * (room_temperature - s)

    if d_fixed is not None:
        s, q, thr, evap = suction(d_fixed)
        return BalancePoint(s, d_fixed, q, evap, thr, thr, 0)
    kc: float = condenser.conductance  # type: ignore[assignment]
    found: dict[float, Any] = {}

    def h(d: float) -> Optional[float]:
        try:
            found[d] = v = suction(d)
        except _NoBalance as exc:
            found[d] = exc
            return None
        return v[2] - kc * (d - ambient_temperature)

    outcome, d, hd = _falling_root(
        h, d_low, d_high, ambient_temperature + 12.0,
        lambda x, fx: abs(fx) <= tolerance * max(abs(found[x][2]), 1.0),
    )
    v = found[d]
    if outcome == "cannot":
        raise v
    if outcome == "edge":  # the condenser is not what limits: it rejects all the compressor gives
        s, q, thr, evap = v
        return BalancePoint(s, d, q, evap, thr, thr, 0)
    if outcome == "short":
        raise _NoBalance(_at("no balance point: the condenser is too small for the compressor (balance above ", v[0], d, ")"))
    if not isinstance(v, tuple) or abs(hd) > accept * max(abs(v[2]), 1.0):  # type: ignore[arg-type]
        raise _NoBalance(_at("no balance point: the compressor cannot run where the condenser needs it, ", last_s[0], d))
    s, q, thr, evap = v
    return BalancePoint(s, d, q, evap, thr, kc * (d - ambient_temperature), 0)


def _newton_balance(
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
    """Newton's method on both balance equations (see :func:`balance_point`).

    Finite-difference Jacobian, kept while each step at least halves the residual
    (chord method); steps limited to 8 K and kept inside S < t_room, D > t_amb,
    halved while the residual grows. Quick from a good start; no bracket, so it may
    fail on extreme ratings, where :func:`_bracketed_balance` decides.
    """
    counter = [0]

    def comp(s: float, d: float) -> tuple[float, float]:
        counter[0] += 1
        try:
            q, thr = compressor(s, d)
        except PropertyRangeError as exc:
            raise CalculationError(_at("no balance point: the compressor cannot run at ", s, d, f" ({exc})")) from None
        if not (math.isfinite(q) and math.isfinite(thr)):
            raise CalculationError(_at("no balance point: the compressor model gives no finite capacity at ", s, d))
        return q, thr

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
    """The highest ambient [°C] at which capacity ≥ load, within :data:`coldroom.rules.AMBIENT_SWEEP`.

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
