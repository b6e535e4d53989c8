"""Pull-down after a delivery: a lumped model of room air, product, packaging and panels.

The model (heat balances, our formulation of the lumped-capacitance method;
each mass uniform in temperature — Incropera & DeWitt, *Fundamentals of Heat
and Mass Transfer*, 6th ed., §5.1 "The lumped capacitance method" [ref:incropera-dewitt] [mem])::

    C_air · dT_a/dt = L(T_a) + Σ_i UA_i·(T_i − T_a) − s(T_a)·Q(T_a)
    m_i · dh_i/dt   = UA_i·(T_a − T_i),    T_i = T(h_i)

- T_a room air [°C], C_air = ρ·c_p·V of the room air [J/K];
- masses *i*: the delivered product (specific enthalpy h_i(T) from the food
  property model, so the latent heat of freezing is released as the ice
  forms — :mod:`coldroom.physics.food`), its packaging, the product already stored
  and, optionally, the panels' inner metal skin (constant specific heat:
  h = c·T);
- L(T_a): the room's steady loads (transmission, infiltration, internal,
  respiration) at the room air temperature [W];
- Q(T_a): the unit's capacity with the room air at T_a [W] (the design cycle
  or the existing-unit model: it falls as the room and the suction fall);
- s: the thermostat, a proportional band :data:`THERMOSTAT_BAND` wide
  centred on the set point (0 below, 1 above) [trade].

The air node is fast, the product slow — a stiff system: the equations are
integrated by a Rosenbrock formula written out in plain Python
(:mod:`coldroom.loads.stiff_ode`, [ref:shampine-reichelt-1997]); it agrees with
scipy's LSODA ([ref:petzold-1983]) within 0.1 K and a minute on the demos (tested),
without the ``scipy.integrate`` package import. A product
has reached its final temperature when it is within
:data:`FINAL_TOLERANCE` of it [trade].

Examples
--------
A mass of 1000 kg at c = 3600 J/(kg·K), tied tightly to the air, 10 kW of
capacity against 2 kW of steady load: it falls (10 − 2) kW ÷ 3.6 MJ/K =
8 K in 3600 s.

>>> m = ThermalMass("block", 1000.0, 1e6, 10.0, specific_heat=3600.0, final_temperature=2.5)
>>> r = simulate(0.0, [m], lambda t: 10e3, lambda t: 2e3, set_point=-30.0,
...              initial_air_temperature=10.0, duration=7200.0)
>>> round(r.hours_to_final, 3)   # 10 → 3.0 °C (2.5 °C + 0.5 K) at 8 K/h
0.875
"""

from __future__ import annotations

import math
from bisect import bisect_right
from dataclasses import dataclass
from typing import TYPE_CHECKING, Any, Callable, Optional, Sequence

from coldroom.constants import SECONDS_PER_DAY_S
from coldroom.errors import CalculationError

if TYPE_CHECKING:  # pragma: no cover
    from coldroom.inputs.projectfile import ProjectModel, Room

#: Width of the thermostat's proportional band around the set point [K] (a
#: 1 K differential, common practice [trade]).
THERMOSTAT_BAND = 1.0
#: A product is at its final temperature within this much of it [K] [trade].
FINAL_TOLERANCE = 0.5
#: Default half-cooling time of product in a cold room with the unit
#: cooler's air movement [s]: 3 h, for product whose pack is not described
#: (common practice, no source).
DEFAULT_HALF_COOLING_TIME = 3.0 * 3600.0
#: Half-cooling time by pack type, room-cooled with the unit cooler's air movement, for a
#: pack of :data:`REFERENCE_PACK_MASS` [s] (common practice, no source [trade]: forced-air
#: cooling is several times faster, a wrapped pallet cools as one block):
PACK_HALF_COOLING_TIMES: dict[str, float] = {
    "loose": 2.0 * 3600.0,  # unpacked, on shelves, hooks or open trays
    "crate": 3.0 * 3600.0,  # open or vented crate (plastic, wood)
    "carton": 6.0 * 3600.0,  # closed corrugated carton
    "pallet": 18.0 * 3600.0,  # cartons stacked and wrapped on a pallet (not scaled by pack mass)
}
#: The pack mass the table is for [kg] [trade].
REFERENCE_PACK_MASS = 10.0
#: Pack type assumed from the packaging material when none is given [trade].
PACK_OF_MATERIAL = {"corrugated_board": "carton", "wood": "crate", "plastic": "crate"}
#: Packaging cools this many times faster than the product it holds [-] [trade].
PACKAGING_SPEED = 3.0
#: Inner panel skin: 0.5 mm steel, 7850 kg/m³, 460 J/(kg·K) (steel properties
#: ASHRAE Fundamentals [mem]; skin thickness common practice [trade]); film
#: coefficient 8 W/(m²·K) to room air with fans running [trade].
SKIN_MASS_PER_AREA = 0.0005 * 7850.0  # kg/m²
SKIN_SPECIFIC_HEAT = 460.0  # J/(kg·K)
SKIN_FILM = 8.0  # W/(m²·K)
#: Room air: ρ·c_p at about 0 °C [J/(m³·K)] (1.27 kg/m³ × 1006 J/(kg·K), ASHRAE
#: Fundamentals, Psychrometrics [mem]); kept constant over the pull-down.
AIR_HEAT_CAPACITY_PER_VOLUME = 1.27 * 1006.0
#: Time steps of the reported curves [s].
REPORT_STEP = 900.0


@dataclass(frozen=True)
class ThermalMass:
    """One lumped mass tied to the room air.

    Attributes
    ----------
    name : str
    mass : float
        [kg].
    conductance : float
        UA to the room air [W/K].
    initial_temperature : float
        [°C].
    enthalpy : callable, optional
        Specific enthalpy h(T) [J/kg] of T [°C], increasing; default c·T.
    specific_heat : float
        [J/(kg·K)] when no *enthalpy* is given.
    final_temperature : float, optional
        Target [°C]: the mass is a product whose time to reach it is reported.
    asked_time : float, optional
        The pull-down time the project asks for [s].
    """

    name: str
    mass: float
    conductance: float
    initial_temperature: float
    enthalpy: Optional[Callable[[float], float]] = None
    specific_heat: float = 0.0
    final_temperature: Optional[float] = None
    asked_time: Optional[float] = None

    def h(self, temperature: float) -> float:
        """Specific enthalpy [J/kg]."""
        if self.enthalpy is not None:
            return self.enthalpy(temperature)
        return self.specific_heat * temperature


@dataclass(frozen=True)
class ProductTrace:
    """One product's pull-down.

    Attributes
    ----------
    name : str
    temperature : tuple of float
        [°C] at :attr:`PulldownResult.time`.
    final_temperature : float
        [°C].
    time_to_final : float or None
        [s]; None when not reached within the simulated time.
    asked_time : float or None
        [s].
    """

    name: str
    temperature: tuple[float, ...]
    final_temperature: float
    time_to_final: Optional[float]
    asked_time: Optional[float]

    @property
    def met(self) -> bool:
        """The asked pull-down time is met (True when none is asked)."""
        if self.asked_time is None:
            return True
        return self.time_to_final is not None and self.time_to_final <= self.asked_time * (1 + 1e-9)


@dataclass(frozen=True)
class PulldownResult:
    """The simulated pull-down.

    Attributes
    ----------
    time : tuple of float
        [s] from the delivery.
    air_temperature : tuple of float
        Room air [°C].
    products : tuple of ProductTrace
    duration : float
        Time simulated [s].
    lowest_air_temperature : float
        The room air's lowest temperature during the simulation [°C].
    basis : str
        Where the capacity came from, and the model's assumptions.
    set_point : float or None
        The thermostat set point [°C].
    unit : str
        Which unit's capacity was used: ``"design"``, ``"selected"`` or ``"existing"`` (empty: not said).
    """

    time: tuple[float, ...]
    air_temperature: tuple[float, ...]
    products: tuple[ProductTrace, ...]
    duration: float
    lowest_air_temperature: float
    basis: str = ""
    set_point: Optional[float] = None
    unit: str = ""

    @property
    def highest_air_temperature(self) -> float:
        """The room air's highest temperature after the delivery [°C] (at the report steps)."""
        return max(self.air_temperature)

    def hours_above(self, temperature: float) -> float:
        """Hours the room air spends above *temperature* [°C] (linear between the report steps)."""
        total = 0.0
        pairs = zip(zip(self.time, self.air_temperature), zip(self.time[1:], self.air_temperature[1:]))
        for (t0, a), (t1, b) in pairs:
            if a > temperature and b > temperature:
                total += t1 - t0
            elif a > temperature or b > temperature:  # one crossing inside the step
                total += (t1 - t0) * (max(a, b) - temperature) / abs(b - a)
        return total / 3600.0

    @property
    def hours_above_setpoint_plus_2k(self) -> Optional[float]:
        """Hours the room air is more than 2 K above the set point after the delivery [h]."""
        return None if self.set_point is None else self.hours_above(self.set_point + 2.0)

    def missed(self) -> tuple[ProductTrace, ...]:
        """The products that miss their own asked time."""
        return tuple(p for p in self.products if not p.met)

    @property
    def governing(self) -> Optional[ProductTrace]:
        """The product that reaches its final temperature last (never reached counts last)."""
        if not self.products:
            return None
        return max(self.products, key=lambda p: math.inf if p.time_to_final is None else p.time_to_final)

    @property
    def hours_to_final(self) -> Optional[float]:
        """Hours until every product is at its final temperature (None: not within the simulation)."""
        g = self.governing
        if g is None or g.time_to_final is None:
            return None
        return g.time_to_final / 3600.0

    @property
    def met(self) -> bool:
        """Every product meets the pull-down time asked for it."""
        return all(p.met for p in self.products)

    def to_json(self) -> dict:
        g = self.governing
        return {
            "time_to_final_temperature_h": self.hours_to_final,
            "unit": self.unit or None,
            "lowest_room_air_temperature_c": self.lowest_air_temperature,
            "highest_room_air_temperature_c": self.highest_air_temperature,
            "hours_above_setpoint_plus_2k": self.hours_above_setpoint_plus_2k,
            "time_h": [t / 3600.0 for t in self.time],
            "product_temperature_c": list(g.temperature) if g is not None else [],
            "room_air_temperature_c": list(self.air_temperature),
            "product": g.name if g is not None else None,
            "asked_time_h": g.asked_time / 3600.0 if g is not None and g.asked_time is not None else None,
            "meets_asked_time": self.met,
            "products": [
                {
                    "name": p.name,
                    "time_to_final_temperature_h": None if p.time_to_final is None else p.time_to_final / 3600.0,
                    "final_temperature_c": p.final_temperature,
                    "asked_time_h": None if p.asked_time is None else p.asked_time / 3600.0,
                    "meets_asked_time": p.met,
                }
                for p in self.products
            ],
            "simulated_time_h": self.duration / 3600.0,
            "basis": self.basis,
        }


def thermostat(air_temperature: float, set_point: float, band: float = THERMOSTAT_BAND) -> float:
    """Share of full capacity the thermostat lets the unit give [-] (proportional band).

    Examples
    --------
    >>> thermostat(2.0, 2.0), thermostat(3.0, 2.0), thermostat(1.0, 2.0)
    (0.5, 1.0, 0.0)
    """
    return min(1.0, max(0.0, (air_temperature - (set_point - band / 2.0)) / band))


#: Temperature step of the h(T) tables the pull-down inverts [K]. The nodes sit on whole
#: multiples of it, so the rooms of a job share them: each node's enthalpy is computed once per
#: product model and process (:data:`_NODE_ENTHALPIES`), in plain Python (no numpy import).
TABLE_STEP = 0.125
_NODE_ENTHALPIES: dict[Any, dict[int, float]] = {}


def _inverse_table(mass: ThermalMass, low: float, high: float) -> tuple[list[float], list[float]]:
    """(enthalpies, temperatures) on the :data:`TABLE_STEP` nodes that cover [*low*, *high*]
    (dense enough to invert h(T) by linear interpolation)."""
    nodes = range(math.floor(low / TABLE_STEP), math.ceil(high / TABLE_STEP) + 1)
    temps = [k * TABLE_STEP for k in nodes]
    known: Optional[dict[int, float]] = None
    if mass.enthalpy is not None:
        # the model behind a bound method, compared by value (a frozen dataclass), not by identity
        key = (getattr(mass.enthalpy, "__func__", mass.enthalpy), getattr(mass.enthalpy, "__self__", None))
        try:
            known = _NODE_ENTHALPIES.get(key)
            if known is None:
                if len(_NODE_ENTHALPIES) >= 256:
                    _NODE_ENTHALPIES.clear()
                known = _NODE_ENTHALPIES[key] = {}
        except TypeError:  # an unhashable model: no sharing
            known = None
    if known is None:
        enth = [mass.h(t) for t in temps]
    else:
        enth = []
        for k, t in zip(nodes, temps):
            h = known.get(k)
            if h is None:
                h = known[k] = mass.h(t)
            enth.append(h)
    for a, b in zip(enth, enth[1:]):
        if not b > a:
            raise CalculationError(f"the enthalpy of {mass.name} does not rise with temperature")
    return enth, temps


class _Interpolant:
    """y(x) through points with *x* rising: linear between them, flat beyond the ends.

    Gives exactly ``np.interp(x, xs, ys)`` — the same bracket xs[j] ≤ x < xs[j+1] (a
    binary search), the same arithmetic ``slope·(x − xs[j]) + ys[j]`` in double
    precision, the ends clamped — so results are bit-identical (tested). Plain Python:
    the integrator asks hundreds of times per room, and numpy's per-call overhead is
    most of the cost of one answer.
    """

    def __init__(self, xs: Sequence[float], ys: Sequence[float]) -> None:
        self.xs = [float(v) for v in xs]
        self.ys = [float(v) for v in ys]
        x, y = self.xs, self.ys
        self.slopes = [(y[k + 1] - y[k]) / (x[k + 1] - x[k]) for k in range(len(x) - 1)]

    def __call__(self, x: float) -> float:
        j = bisect_right(self.xs, x)  # points at or below x
        if j == 0:
            return self.ys[0]
        if j == len(self.xs):
            return self.ys[-1]
        return float(self.slopes[j - 1] * (x - self.xs[j - 1]) + self.ys[j - 1])

    def slope(self, x: float) -> float:
        """dy/dx at *x*: the slope of the piece that holds it (0 beyond the ends)."""
        j = bisect_right(self.xs, x)
        if j == 0 or j == len(self.xs):
            return 0.0
        return self.slopes[j - 1]


def capacity_curve(air: Sequence[float], capacity: Sequence[float]) -> Callable[[float], float]:
    """A unit's capacity [W] against the room air [°C] through the points (*air* rising):
    linear between them, flat beyond the ends — exactly ``np.interp`` (:class:`_Interpolant`)."""
    return _Interpolant(air, capacity)


class _Inverse:
    """T(h) of every mass at once, from tables on one temperature grid: row *i* is
    ``np.interp(h[i], enthalpies[i], temperatures)`` (bit-identical, :class:`_Interpolant`)."""

    def __init__(self, tables: Sequence[tuple[Sequence[float], Sequence[float]]]) -> None:
        self.rows = [_Interpolant(enthalpies, temperatures) for enthalpies, temperatures in tables]

    def __call__(self, h: Sequence[float]) -> list[float]:
        return [row(float(x)) for row, x in zip(self.rows, h)]


def simulate(
    air_heat_capacity: float,
    masses: Sequence[ThermalMass],
    capacity: Callable[[float], float],
    steady_load: Callable[[float], float],
    *,
    set_point: float,
    initial_air_temperature: float,
    duration: float,
    band: float = THERMOSTAT_BAND,
    basis: str = "",
    integrator: Optional[Callable[..., Any]] = None,
) -> PulldownResult:
    """Integrate the pull-down (see the module notes for the equations).

    Parameters
    ----------
    air_heat_capacity : float
        ρ·c_p·V of the room air [J/K], ≥ 0 (0: the air is taken as massless).
    masses : sequence of ThermalMass
    capacity : callable
        Unit capacity [W] at a room air temperature [°C], ≥ 0.
    steady_load : callable
        The room's other loads [W] at a room air temperature [°C].
    set_point : float
        Thermostat set point [°C].
    initial_air_temperature : float
        [°C].
    duration : float
        Time to simulate [s], > 0.
    band : float
        Thermostat proportional band [K], > 0.
    integrator : callable, optional
        ``integrator(f, y0, times, rtol=, atol=)`` → the states at *times*, for y' = f(y)
        (lists of float); default :func:`coldroom.loads.stiff_ode.integrate`. The tests
        pass scipy's LSODA here as the reference.

    Returns
    -------
    PulldownResult

    Raises
    ------
    CalculationError
        The integrator fails.
    """
    if not duration > 0.0:
        raise CalculationError(f"pull-down duration {duration!r} s must be positive")
    if not band > 0.0:
        raise CalculationError(f"thermostat band {band!r} K must be positive")
    if integrator is None:
        from coldroom.loads.stiff_ode import integrate as integrator
    temps0 = [initial_air_temperature, set_point] + [m.initial_temperature for m in masses]
    low, high = min(temps0) - 40.0, max(temps0) + 10.0
    # one table per enthalpy function (a product's delivery and its stored stock share one)
    tables, known = [], {}
    for m in masses:
        key = (m.enthalpy, None if m.enthalpy is not None else m.specific_heat)
        try:
            table = known[key]
        except KeyError:
            table = known[key] = _inverse_table(m, low, high)
        except TypeError:  # an unhashable enthalpy callable
            table = _inverse_table(m, low, high)
        tables.append(table)
    temperatures = _Inverse(tables)  # h → T of every mass at once
    inverse = temperatures.rows
    ua = [float(m.conductance) for m in masses]
    ua_per_mass = [float(m.conductance) / float(m.mass) for m in masses]
    n = len(masses)
    massless_air = air_heat_capacity <= 0.0

    def air_balance(ta: float, tm: list[float]) -> float:
        exchange = 0.0
        for u, t in zip(ua, tm):
            exchange += u * (t - ta)
        return steady_load(ta) + exchange - thermostat(ta, set_point, band) * capacity(ta)

    def quasi_steady_air(tm: list[float]) -> float:
        # massless air: the air temperature where the balance is zero (monotone falling in T_a)
        a, b = low, high
        fa = air_balance(a, tm)
        for _ in range(80):
            mid = 0.5 * (a + b)
            fm = air_balance(mid, tm)
            if (fm > 0) == (fa > 0):
                a, fa = mid, fm
            else:
                b = mid
            if b - a < 1e-7:
                break
        return 0.5 * (a + b)

    def rhs(y: list[float]) -> list[float]:
        if massless_air:
            tm = temperatures(y)
            ta = quasi_steady_air(tm)
            return [k * (ta - t) for k, t in zip(ua_per_mass, tm)]
        ta = y[0]
        tm = temperatures(y[1:])
        return [air_balance(ta, tm) / air_heat_capacity] + [k * (ta - t) for k, t in zip(ua_per_mass, tm)]

    def air_part(ta: float) -> float:  # the air balance's own terms: steady load less the unit's
        return steady_load(ta) - thermostat(ta, set_point, band) * capacity(ta)

    def own_slope(ta: float) -> float:  # d(air_part)/dT_a, a forward difference
        step = 1e-6 * max(abs(ta), 1.0)
        return (air_part(ta + step) - air_part(ta)) / step

    def jacobian(y: list[float], fy: list[float]) -> list[list[float]]:
        if massless_air:
            # T_a(T_1 … T_n) from the balance: ∂T_a/∂T_j = UA_j / (ΣUA − ∂(air_part)/∂T_a)
            slopes = [row.slope(x) for row, x in zip(inverse, y)]  # dT_i/dh_i
            ta = quasi_steady_air(temperatures(y))
            share = [u / (sum(ua) - own_slope(ta)) for u in ua]
            return [
                [ua_per_mass[i] * (share[j] * slopes[j] - (slopes[i] if i == j else 0.0)) for j in range(n)]
                for i in range(n)
            ]
        # the air couples to every mass, the masses only to the air: ∂f/∂y is an arrowhead
        ta = y[0]
        slopes = [row.slope(x) for row, x in zip(inverse, y[1:])]  # dT_i/dh_i
        rows = [[(own_slope(ta) - sum(ua)) / air_heat_capacity]
                + [u * d / air_heat_capacity for u, d in zip(ua, slopes)]]
        for i in range(n):
            row = [0.0] * (n + 1)
            row[0] = ua_per_mass[i]
            row[i + 1] = -ua_per_mass[i] * slopes[i]
            rows.append(row)
        return rows

    y0 = [m.h(m.initial_temperature) for m in masses]
    if not massless_air:
        y0 = [initial_air_temperature] + y0
    steps = max(2, int(math.ceil(duration / REPORT_STEP)) + 1)
    t_eval = [k * (duration / (steps - 1)) for k in range(steps)]  # as np.linspace(0, duration, steps)
    t_eval[-1] = float(duration)
    # a Rosenbrock formula for the stiff system (the air fast, the product slow), the report
    # times interpolated within its steps; tolerances chosen so every demo stays within 0.1 K
    # and a minute of LSODA (the validation test; the largest seen: 4 mK and 20 s)
    states = integrator(rhs, [float(v) for v in y0], t_eval, rtol=1e-5, atol=1e-2, jacobian=jacobian)
    columns = [list(map(float, row)) for row in states]
    first = 0 if massless_air else 1
    mass_t = [[inverse[i](row[first + i]) for row in columns] for i in range(n)]
    if massless_air:
        air = [quasi_steady_air([mass_t[i][k] for i in range(n)]) for k in range(len(columns))]
    else:
        air = [row[0] for row in columns]
    traces = []
    for i, m in enumerate(masses):
        if m.final_temperature is None:
            continue
        target = m.final_temperature + FINAL_TOLERANCE
        reached = None
        series = mass_t[i]
        for k in range(len(series)):
            if series[k] <= target:
                if k == 0:
                    reached = 0.0
                else:  # linear interpolation between the reported steps
                    t0, t1, a, b = t_eval[k - 1], t_eval[k], series[k - 1], series[k]
                    reached = float(t0 + (t1 - t0) * (a - target) / (a - b))
                break
        traces.append(
            ProductTrace(
                name=m.name,
                temperature=tuple(float(x) for x in series),
                final_temperature=m.final_temperature,
                time_to_final=reached,
                asked_time=m.asked_time,
            )
        )
    return PulldownResult(
        time=tuple(float(t) for t in t_eval),
        air_temperature=tuple(float(x) for x in air),
        products=tuple(traces),
        duration=duration,
        lowest_air_temperature=float(min(air)),
        basis=basis,
        set_point=set_point,
    )


def half_cooling_conductance(mass: float, specific_heat: float, half_cooling_time: float) -> float:
    """UA [W/K] of a lumped mass whose excess over steady air halves in *half_cooling_time*.

    UA = ln 2 · m·c / t½ (exponential decay of the lumped capacitance method [ref:incropera-dewitt] [mem]).

    Examples
    --------
    >>> round(half_cooling_conductance(1000.0, 3600.0, 3 * 3600.0), 2)
    231.05
    """
    return math.log(2.0) * mass * specific_heat / half_cooling_time


def product_half_cooling_time(item: Any) -> tuple[float, str]:
    """A product's half-cooling time [s] and where it came from.

    ``half_cooling_time`` given wins; else its packaging's pack type (``packaging.pack``, or the
    one its material implies, :data:`PACK_OF_MATERIAL`) from :data:`PACK_HALF_COOLING_TIMES`
    [trade], scaled by (pack mass ÷ :data:`REFERENCE_PACK_MASS`)^(1/3) when ``packaging.pack_mass``
    is given: for geometrically similar packs t½ = ln 2·m·c/(h·A) with A ∝ m^(2/3) (lumped
    capacitance [ref:incropera-dewitt] [mem]); else :data:`DEFAULT_HALF_COOLING_TIME`.

    Examples
    --------
    >>> from types import SimpleNamespace as N
    >>> product_half_cooling_time(N(half_cooling_time=7200.0, packaging=None))[0]
    7200.0
    >>> pack = N(pack="carton", pack_mass=80.0, material="corrugated_board", mass=1.0)
    >>> round(product_half_cooling_time(N(half_cooling_time=None, packaging=pack))[0] / 3600, 1)
    12.0
    """
    given = getattr(item, "half_cooling_time", None)
    if given is not None:
        return given, "given"
    pack = item.packaging
    kind = None
    if pack is not None:
        kind = getattr(pack, "pack", None) or PACK_OF_MATERIAL.get(pack.material)
    if kind is None:
        return DEFAULT_HALF_COOLING_TIME, "pack not described [trade]"
    t = PACK_HALF_COOLING_TIMES[kind]
    size = getattr(pack, "pack_mass", None)
    if size is not None and kind != "pallet":
        t *= (size / REFERENCE_PACK_MASS) ** (1.0 / 3.0)
        return t, f"{kind}, {size:g} kg packs [trade]"
    return t, f"{kind} [trade]"


def _steady_load(model: "ProjectModel", room: "Room") -> Callable[[float], float]:
    """The room's loads other than the delivery, as a function of the room air [W].

    Transmission follows the room air (U·A of the envelope, found as the change of the
    transmission lines for 1 K); infiltration, internal and equipment loads (defrost
    left out) and respiration stay at their 24-hour averages at the set point.
    """
    from coldroom.loads import internal_lines, infiltration_lines, product_lines, transmission_lines

    def transmission(temperature: float) -> float:
        r = room if temperature == room.temperature else room.model_copy(update={"temperature": temperature})
        return sum(line.average_power for line in transmission_lines(model, r))

    at_set = transmission(room.temperature)
    envelope_ua = at_set - transmission(room.temperature + 1.0)
    others = sum(line.average_power for line in infiltration_lines(model, room))
    others += sum(
        line.average_power for line in internal_lines(model, room) if not line.item.startswith("defrost")
    )
    others += sum(line.average_power for line in product_lines(model, room) if line.item.endswith("respiration"))
    set_point = room.temperature

    def load(air: float) -> float:
        return at_set + others + envelope_ua * (set_point - air)

    return load


def _reference_specific_heat(properties: Any, temperature: float) -> float:
    """Specific heat for the product's conductance: the enthalpy slope over the 1 K below *temperature* [J/(kg·K)]."""
    return properties.enthalpy(temperature) - properties.enthalpy(temperature - 1.0)


def room_masses(room: "Room", half_cooling_time: Optional[float] = None) -> list[ThermalMass]:
    """The lumped masses of *room* just after a delivery.

    The delivery is the largest of the schedule's deliveries (else the whole daily
    intake), shared among the products in proportion to their intake; its packaging
    comes with it; the stored product and, when ``pulldown.panel_skin`` is set, the
    panels' inner skin start at the set point. Each product cools with its own
    half-cooling time (:func:`product_half_cooling_time`) unless *half_cooling_time* [s]
    is given for all.
    """
    from coldroom.loads import product_properties
    from coldroom.loads.product import packaging_specific_heat

    share = 1.0
    schedule = room.schedule
    if schedule is not None and schedule.deliveries is not None:
        delivered = sum(d.mass for d in schedule.deliveries)
        share = max(d.mass for d in schedule.deliveries) / delivered
    masses: list[ThermalMass] = []
    for item in room.products:
        properties, _respiration, label = product_properties(item)
        label = label.replace("_", " ")
        own = product_half_cooling_time(item)[0] if half_cooling_time is None else half_cooling_time
        if item.daily_intake > 0:
            assert item.entering_temperature is not None and item.final_temperature is not None
            m = item.daily_intake * share
            c = _reference_specific_heat(properties, item.entering_temperature)
            masses.append(
                ThermalMass(
                    label,
                    m,
                    half_cooling_conductance(m, c, own),
                    item.entering_temperature,
                    enthalpy=properties.enthalpy,
                    final_temperature=item.final_temperature,
                    asked_time=item.pulldown_time,
                )
            )
            pack = item.packaging
            if pack is not None and pack.mass > 0:
                cp = pack.specific_heat
                if cp is None:
                    cp = packaging_specific_heat(pack.material if pack.material != "other" else "corrugated_board")
                mp = pack.mass * share
                masses.append(
                    ThermalMass(
                        f"{label} packaging",
                        mp,
                        half_cooling_conductance(mp, cp, own / PACKAGING_SPEED),
                        item.entering_temperature,
                        specific_heat=cp,
                    )
                )
        if item.stored_mass > 0:
            c = _reference_specific_heat(properties, room.temperature)
            masses.append(
                ThermalMass(
                    f"{label} stored",
                    item.stored_mass,
                    half_cooling_conductance(item.stored_mass, c, own),
                    room.temperature,
                    enthalpy=properties.enthalpy,
                )
            )
    if room.pulldown.panel_skin:
        area = sum(room.surface_area(side) for side in ("north", "east", "south", "west", "ceiling", "floor"))
        masses.append(
            ThermalMass(
                "panel inner skin",
                area * SKIN_MASS_PER_AREA,
                area * SKIN_FILM,
                room.temperature,
                specific_heat=SKIN_SPECIFIC_HEAT,
            )
        )
    return masses


def simulated_time(room: "Room") -> float:
    """Time to simulate [s]: given, else twice the longest asked pull-down time, 24 h to 7 days."""
    if room.pulldown.hours is not None:
        return room.pulldown.hours
    asked = [p.pulldown_time for p in room.products if p.daily_intake > 0]
    return min(7 * SECONDS_PER_DAY_S, max(SECONDS_PER_DAY_S, 2.0 * max(asked, default=0.0)))


def room_pulldown(
    model: "ProjectModel", room: "Room", capacity: Callable[[float], float], basis: str, unit: str = ""
) -> Optional[PulldownResult]:
    """Simulate the pull-down after a delivery in *room* with a unit of *capacity*.

    Parameters
    ----------
    model : ProjectModel
    room : Room
    capacity : callable
        Unit capacity [W] at a room air temperature [°C].
    basis : str
        Where the capacity comes from (printed with the result).
    unit : str
        ``"design"``, ``"selected"`` or ``"existing"``: the unit whose capacity is used.

    Returns
    -------
    PulldownResult or None
        None when the room takes no product in.
    """
    if not any(p.daily_intake > 0 for p in room.products):
        return None
    masses = room_masses(room)
    halves = []
    for item in room.products:
        if item.daily_intake > 0:
            t, origin = product_half_cooling_time(item)
            name = (item.product or "product").replace("_", " ")
            halves.append(f"{name} {t / 3600:.3g} h ({origin})")
    text = (
        f"{basis}; room air, product (food enthalpy, freezing included), packaging"
        + (", panel inner skin" if room.pulldown.panel_skin else "")
        + f" as lumped masses; half-cooling time {', '.join(halves)}, packaging "
        f"{PACKAGING_SPEED:g}× faster; thermostat: proportional band {THERMOSTAT_BAND:g} K centred on the set "
        f"point (the air settles up to {THERMOSTAT_BAND / 2:g} K below it) [trade]; steady loads at their "
        f"averages, defrost off; final temperature reached within {FINAL_TOLERANCE:g} K; Rosenbrock 2(3) integrator"
    )
    result = simulate(
        AIR_HEAT_CAPACITY_PER_VOLUME * room.inside_volume,
        masses,
        capacity,
        _steady_load(model, room),
        set_point=room.temperature,
        initial_air_temperature=room.temperature,
        duration=simulated_time(room),
        basis=text,
    )
    from dataclasses import replace

    return replace(result, unit=unit)
