"""The verdict on an existing unit for one room: capacity at balance against the room's requirement.

:func:`check_unit` takes a compressor model, the two heat exchangers and the
room's figures (plain numbers; no project model) and returns a
:class:`CheckResult` (SI; temperatures °C): balance point, run hours needed,
margin, the capacity/load chart over ambient and the highest ambient at which
the unit holds. The verdict's wording lives here once
(:attr:`CheckResult.verdict`, :attr:`CheckResult.verdict_word`).
"""

from __future__ import annotations

from dataclasses import dataclass
from typing import Any, Callable, Optional, Sequence

from coldroom.physics.limits import discharge_temperature_warning
from coldroom.rules import (
    pressure_ratio_advisory,
    required_capacity,
    with_safety_factor,
)
from coldroom.equipment.balance import BalancePoint, HeatExchanger, balance_point, highest_holding_ambient
from coldroom.equipment.compressors import Compressor, CompressorPoint
from coldroom.errors import CalculationError, PropertyRangeError
from coldroom.results import Note, Phrase
from coldroom.units import format_terms

#: Ambient temperatures of the capacity/load chart [°C], inside
#: :data:`coldroom.rules.AMBIENT_SWEEP`.
CHART_AMBIENTS: tuple[float, ...] = tuple(20.0 + 5.0 * i for i in range(6))  # smooth curves: 5 K steps suffice

# --------------------------------------------------------------------------- verdict


@dataclass(frozen=True)
class CheckResult:
    """The verdict on an existing unit for one room (SI; temperatures °C).

    Attributes
    ----------
    name, refrigerant, model : str
        Unit name, refrigerant and compressor model (``"rated point"`` or ``"polynomial"``).
    room_temperature, ambient_temperature : float
        Room air and condenser air at design [°C].
    balance_evaporating, balance_condensing : float or None
        Balance dew points SST, SCT [°C] (None when no balance exists).
    capacity_at_balance : float or None
        Useful capacity at balance [W]; None when no balance exists or the
        balance lies outside a polynomial's envelope (never extrapolated).
    power_at_balance, heat_rejection_at_balance, mass_flow : float or None
        [W], [W], [kg/s].
    discharge_temperature : float or None
        Upper estimate [°C].
    pressure_ratio : float or None
        [-].
    required_capacity : float
        (1 + SF)·daily energy / run time [W].
    peak_capacity : float
        Peak-hour load with safety factor [W].
    daily_energy : float
        24-hour heat gain before the safety factor [J].
    safety_factor : float
        [-].
    run_hours_available : float
        The room's compressor run time [h/day].
    run_hours_needed : float or None
        daily energy·(1 + SF) / capacity [h/day].
    margin_percent : float or None
        (capacity / required − 1)·100 [%].
    holds : bool
        True when the unit is suitable and the capacity at balance covers the required capacity.
    within_envelope : bool
        False when the balance lies outside a polynomial's envelope or the unit's application class.
    max_ambient : float or None
        Highest condenser-air temperature at which the unit still holds [°C]
        (None when it holds over the whole search range, or nowhere in it —
        see *max_ambient_status*).
    max_ambient_status : str
        ``"found"``, ``"holds_above_range"``, ``"fails_below_range"`` or
        ``"not_searched"``.
    evaporator_basis, condenser_basis : Phrase
        How the evaporator and condenser were modelled.
    compressor_basis : tuple of Phrase
        How the compressor was modelled.
    warnings : tuple of str
    chart_ambient : tuple of float
        Condenser-air temperatures of the chart [°C].
    chart_capacity : tuple of (float or None)
        Unit capacity at balance at each chart ambient [W] (None: no balance or outside envelope).
    chart_load : tuple of float
        Required capacity of the room at each chart ambient [W].
    not_suitable : str or None
        Why the unit is not suitable here (outside its application class, e.g. "medium-temperature
        unit at low-temperature suction"); ``None`` when it is. Such a unit never holds.
    """

    name: str
    refrigerant: str
    model: str
    room_temperature: float
    ambient_temperature: float
    balance_evaporating: Optional[float]
    balance_condensing: Optional[float]
    capacity_at_balance: Optional[float]
    power_at_balance: Optional[float]
    heat_rejection_at_balance: Optional[float]
    mass_flow: Optional[float]
    discharge_temperature: Optional[float]
    pressure_ratio: Optional[float]
    required_capacity: float
    peak_capacity: float
    daily_energy: float
    safety_factor: float
    run_hours_available: float
    run_hours_needed: Optional[float]
    margin_percent: Optional[float]
    holds: bool
    within_envelope: bool
    max_ambient: Optional[float]
    max_ambient_status: str
    evaporator_basis: Phrase
    condenser_basis: Phrase
    compressor_basis: tuple[Phrase, ...] = ()
    warnings: tuple[str, ...] = ()
    chart_ambient: tuple[float, ...] = ()
    chart_capacity: tuple[Optional[float], ...] = ()
    chart_load: tuple[float, ...] = ()
    not_suitable: Optional[str] = None

    @property
    def verdict_word(self) -> str:
        """``"HOLDS"``, ``"DOES NOT HOLD"``, ``"NOT RATED"`` or ``"NOT SUITABLE"`` (the one wording every report uses)."""
        if self.not_suitable is not None:
            return "NOT SUITABLE"
        if self.capacity_at_balance is None and not self.within_envelope:
            return "NOT RATED"
        return "HOLDS" if self.holds else "DOES NOT HOLD"

    @property
    def verdict_detail(self) -> str:
        """Why, in a few words: the margin, or what stopped the rating."""
        if self.not_suitable is not None:
            return self.not_suitable
        if self.capacity_at_balance is None:
            if not self.within_envelope:
                return "outside the compressor envelope"
            return "no capacity at the balance point" if self.balance_evaporating is not None else "no balance point"
        return f"margin {self.margin_percent:+.0f} %"

    @property
    def verdict(self) -> str:
        """One line: holds / does not hold / cannot be rated / not suitable, and why."""
        if self.not_suitable is not None:
            return f"NOT SUITABLE: {self.not_suitable}"
        if self.capacity_at_balance is None:
            if not self.within_envelope:
                return f"{self.verdict_word} for these conditions (balance {self.verdict_detail})"
            return f"{self.verdict_word} ({self.verdict_detail})"
        if self.holds:
            return f"{self.verdict_word} ({self.verdict_detail})"
        return f"{self.verdict_word} (short by {-self.margin_percent:.0f} %)"  # type: ignore[operator]

    def chart(self) -> dict[str, list[Optional[float]]]:
        """Arrays for the capacity/load-vs-ambient chart (SI, keys name units)."""
        return {
            "ambient_temperature_c": list(self.chart_ambient),
            "unit_capacity_w": list(self.chart_capacity),
            "room_load_w": list(self.chart_load),
        }

    def to_json(self) -> dict[str, Any]:
        """JSON object, SI numbers, every numeric key names its unit."""
        return {
            "name": self.name,
            "refrigerant": self.refrigerant,
            "model": self.model,
            "verdict": self.verdict,
            "holds": self.holds,
            "within_envelope": self.within_envelope,
            "suitable": self.not_suitable is None,
            "not_suitable_reason": self.not_suitable,
            "room_temperature_c": self.room_temperature,
            "ambient_temperature_c": self.ambient_temperature,
            "balance_evaporating_temperature_c": self.balance_evaporating,
            "balance_condensing_temperature_c": self.balance_condensing,
            "capacity_at_balance_w": self.capacity_at_balance,
            "power_at_balance_w": self.power_at_balance,
            "heat_rejection_at_balance_w": self.heat_rejection_at_balance,
            "mass_flow_kg_s": self.mass_flow,
            "discharge_temperature_c": self.discharge_temperature,
            "pressure_ratio": self.pressure_ratio,
            "required_capacity_w": self.required_capacity,
            "peak_capacity_w": self.peak_capacity,
            "daily_energy_kwh": self.daily_energy / 3.6e6,
            "safety_factor": self.safety_factor,
            "daily_run_time_available_h": self.run_hours_available,
            "daily_run_time_needed_h": self.run_hours_needed,
            "margin_percent": self.margin_percent,
            "max_ambient_temperature_c": self.max_ambient,
            "max_ambient_temperature_status": self.max_ambient_status,
            "evaporator_basis": format_terms(self.evaporator_basis, "SI"),
            "condenser_basis": format_terms(self.condenser_basis, "SI"),
            "compressor_basis": [format_terms(note, "SI") for note in self.compressor_basis],
            "warnings": list(self.warnings),
            "chart": self.chart(),
        }



def solve_balance(
    compressor: Compressor,
    evaporator: HeatExchanger,
    condenser: HeatExchanger,
    room_temperature: float,
    ambient_temperature: float,
    guess: Optional[tuple[float, float]] = None,
) -> tuple[BalancePoint, CompressorPoint]:
    def function(s: float, d: float) -> tuple[float, float]:
        p = compressor.performance(s, d, check_envelope=False, discharge=False)
        return p.capacity, p.heat_rejection

    bp = balance_point(function, evaporator, condenser, room_temperature, ambient_temperature, guess=guess)
    try:
        point = compressor.performance(bp.suction_dew, bp.discharge_dew, check_envelope=False, discharge=True)
    except PropertyRangeError as exc:
        raise CalculationError(f"no discharge state at the balance point ({exc})") from None
    return bp, point


def _mismatch(compressor: Compressor, suction_dew: float, design: bool = False) -> Optional[str]:
    """The compressor's application mismatch at this suction [°C]; a model without classes has none."""
    ask = getattr(compressor, "application_mismatch", None)
    return None if ask is None else ask(suction_dew, design=design)


def _message(error: Exception) -> str:
    """The error's message, keeping a :class:`Note` (SI numbers, shown in the report's units) as it is."""
    first = error.args[0] if error.args else ""
    return first if isinstance(first, Note) else str(error)


def check_unit(
    compressor: Compressor,
    evaporator: HeatExchanger,
    condenser: HeatExchanger,
    *,
    room_temperature: float,
    ambient_temperature: float,
    daily_energy: float,
    safety_factor: float,
    run_time: float,
    peak_capacity: float = 0.0,
    load_at_ambient: Optional[Callable[[float], float]] = None,
    chart_ambients: Sequence[float] = CHART_AMBIENTS,
    search_max_ambient: bool = True,
    name: str = "existing unit",
    design_suction: Optional[float] = None,
) -> CheckResult:
    """The verdict on one unit for one room.

    Parameters
    ----------
    compressor : RatedPointCompressor or PolynomialCompressor
    evaporator, condenser : HeatExchanger
    room_temperature : float
        Room air on the unit cooler [°C].
    ambient_temperature : float
        Air on the condenser at design [°C].
    daily_energy : float
        24-hour heat gain before the safety factor [J].
    safety_factor : float
        [-].
    run_time : float
        Compressor run time the room allows [s/day].
    peak_capacity : float
        Peak-hour load with safety factor [W] (only for a warning).
    load_at_ambient : callable, optional
        Required capacity [W] of the room at a condenser-air temperature [°C];
        default: the design required capacity at every ambient.
    chart_ambients : sequence of float
        Ambients of the chart [°C] (empty: no chart).
    search_max_ambient : bool
        Search the highest ambient at which the unit holds (1-D, to 0.1 K).
    design_suction : float, optional
        The system's design SST at the compressor [°C]: a unit whose application class (or
        envelope) does not include it is not suitable, wherever its balance point lands.

    Returns
    -------
    CheckResult
        Run hours needed = daily energy·(1 + SF)/capacity (ASHRAE
        Handbook—Refrigeration, "Refrigerated-Facility Loads": required
        capacity = (1 + SF)·E/run hours, solved for the hours [pub]).
    """
    required = required_capacity(daily_energy, run_time, safety_factor)
    load = load_at_ambient or (lambda _t: required)
    warnings: list[str] = []
    evap_basis = evaporator.basis
    cond_basis = condenser.basis

    def capacity_at(ambient: float, guess: Optional[tuple[float, float]]) -> tuple[Optional[float], Optional[tuple[float, float]]]:
        try:
            bp, point = solve_balance(compressor, evaporator, condenser, room_temperature, ambient, guess)
        except CalculationError:
            return None, guess
        if not point.within_envelope or not_suitable is not None or _mismatch(compressor, bp.suction_dew):
            return None, (bp.suction_dew, bp.discharge_dew)
        return point.capacity, (bp.suction_dew, bp.discharge_dew)

    # 1. design ambient
    bp: Optional[BalancePoint] = None
    point: Optional[CompressorPoint] = None
    try:
        bp, point = solve_balance(compressor, evaporator, condenser, room_temperature, ambient_temperature)
    except CalculationError as exc:
        warnings.append(_message(exc))
    within = point.within_envelope if point is not None else True
    # a unit outside its application class never holds, whatever its extrapolated capacity says
    not_suitable: Optional[str] = None
    at_suction = design_suction
    if bp is not None:
        not_suitable, at_suction = _mismatch(compressor, bp.suction_dew), bp.suction_dew
    if not_suitable is None and design_suction is not None:
        not_suitable, at_suction = _mismatch(compressor, design_suction, design=True), design_suction
    if not_suitable is not None:
        within = False
        warnings.append(
            Note.fill(
                f"NOT SUITABLE: {not_suitable} (SST {{s}}); its compressor is not built for this "
                "suction (pressure ratio, discharge temperature, motor cooling), so no capacity is credited",
                s=(at_suction, "temperature"),
            )
        )
    capacity = point.capacity if (point is not None and within and point.capacity > 0) else None
    if point is not None:
        if not_suitable is None:  # the not-suitable warning already says what a rated point's flag would
            warnings += compressor.flags(point)
        t2 = point.discharge_temperature
        too_hot = None if t2 is None else discharge_temperature_warning(t2, compressor.refrigerant)
        if too_hot is not None:
            warnings.append(too_hot)
        advisory = pressure_ratio_advisory(point.pressure_ratio, point.suction_dew)
        if advisory is not None:
            warnings.append(advisory)
    run_hours_needed = margin = None
    holds = False
    if capacity is not None:
        run_hours_needed = with_safety_factor(daily_energy, safety_factor) / capacity / 3600.0
        margin = (capacity / required - 1.0) * 100.0
        holds = capacity >= required
        if run_hours_needed > 24.0:
            warnings.append(
                f"the unit would need {run_hours_needed:.1f} h/day: it cannot hold the room even running continuously"
            )
        if holds and capacity < peak_capacity:
            warnings.append(
                Note.fill(
                    "capacity {c} covers the 24-hour requirement but not the peak-hour load {p}: "
                    "pull-down will be slower than planned",
                    c=(capacity, "power"),
                    p=(peak_capacity, "power"),
                )
            )
    # 2. chart over ambient, warm-started from the previous balance
    ambients = sorted(set(float(a) for a in chart_ambients))
    chart_capacity: list[Optional[float]] = []
    chart_load: list[float] = []
    design_guess = (bp.suction_dew, bp.discharge_dew) if bp is not None else None
    samples = [(ambient_temperature, capacity, design_guess)]
    guess = design_guess
    for ambient in ambients:
        value, guess = capacity_at(ambient, guess)
        chart_capacity.append(value)
        chart_load.append(load(ambient))
        if ambient == ambient_temperature:
            continue
        # The search assumes one crossing (capacity falls, load rises with ambient), and the
        # design point decides: a chart point that contradicts it (holds above a design that
        # fails, fails below a design that holds) is a solver artefact and is left out, so
        # the highest ambient agrees with the verdict.
        held = value is not None and value >= load(ambient)
        if (ambient > ambient_temperature and held and not holds) or (ambient < ambient_temperature and not held and holds):
            continue
        samples.append((ambient, value, guess))
    # 3. highest ambient at which it holds (regula falsi on capacity − load, to 0.05 K)
    max_ambient: Optional[float] = None
    status = "not_searched"
    if search_max_ambient:
        max_ambient, status = highest_holding_ambient(capacity_at, load, samples)
    return CheckResult(
        name=name,
        refrigerant=compressor.refrigerant,
        model=compressor.model,
        room_temperature=room_temperature,
        ambient_temperature=ambient_temperature,
        balance_evaporating=bp.suction_dew if bp is not None else None,
        balance_condensing=bp.discharge_dew if bp is not None else None,
        capacity_at_balance=capacity,
        power_at_balance=point.power if point is not None and within else None,
        heat_rejection_at_balance=point.heat_rejection if point is not None and within else None,
        mass_flow=point.mass_flow if point is not None and within else None,
        discharge_temperature=point.discharge_temperature if point is not None and within else None,
        pressure_ratio=point.pressure_ratio if point is not None else None,
        required_capacity=required,
        peak_capacity=peak_capacity,
        daily_energy=daily_energy,
        safety_factor=safety_factor,
        run_hours_available=run_time / 3600.0,
        run_hours_needed=run_hours_needed,
        margin_percent=margin,
        holds=holds,
        within_envelope=within,
        max_ambient=max_ambient,
        max_ambient_status=status,
        evaporator_basis=evap_basis,
        condenser_basis=cond_basis,
        compressor_basis=tuple(compressor.notes),
        warnings=tuple(warnings),
        chart_ambient=tuple(ambients),
        chart_capacity=tuple(chart_capacity),
        chart_load=tuple(chart_load),
        not_suitable=not_suitable,
    )
