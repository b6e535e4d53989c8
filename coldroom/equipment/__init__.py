"""Existing units: will the installed unit still hold the room at its new conditions?

A condensing unit's capacity is not its nameplate: it depends on the suction
and condensing dew points it actually runs at, and it falls steeply as the
suction temperature falls (the suction gas gets thinner, the pressure ratio
rises and the volumetric efficiency drops). This package

1. models the compressor at any suction dew point S and discharge dew point D,
   either from **one rated point** (:class:`RatedPointCompressor`) or from the
   **AHRI 540 / EN 12900 ten-coefficient polynomials** [ref:ahri-540] [ref:en-12900]
   (:class:`PolynomialCompressor`);
2. finds the **balance point** of compressor, evaporator and condenser
   (:func:`balance_point`): S and D such that compressor capacity = unit-cooler
   capacity K_e·(t_room − S) and compressor heat rejection = condenser capacity
   K_c·(D − t_ambient);
3. gives the **verdict** (:func:`check_unit` → :class:`CheckResult`): capacity
   at balance vs the room's required capacity, run hours per day needed,
   margin, the highest ambient at which the unit still holds, and warnings.

Modules, each importing only those above it:

* :mod:`~coldroom.equipment.compressors` — the compressor models (the only
  one that evaluates refrigerant properties);
* :mod:`~coldroom.equipment.balance` — heat exchangers, the balance-point
  search and the highest-ambient search, plain numbers only;
* :mod:`~coldroom.equipment.verdict` — :func:`check_unit` and :class:`CheckResult`;
A room of the project is turned into a check by
:mod:`coldroom.design.existing` (:func:`~coldroom.design.existing.check_room`,
:func:`~coldroom.design.existing.check_existing_units`), one stage up.

The public names are importable from ``coldroom.equipment`` itself.

Stage 4 of the layout. May import: the foundation, ``data`` and ``physics``.

Conventions and choices (documented here once):

* Temperatures in °C (saturated **dew** points for S and D, as in EN 12900 and
  AHRI 540 [pub]); capacities and powers in W; mass flow in kg/s.
* "Capacity" of the unit at a point is the **useful** refrigerating effect
  in the project's terms: ṁ·(h at evaporator outlet (dew + superheat) − h of
  the liquid (bubble − subcooling)); suction-line superheat heats the gas the
  compressor draws but does no useful cooling (common practice, no source).
* Heat rejection THR = ṁ·(h_suction gas − h_liquid) + P: all electrical power
  ends up in the refrigerant (hermetic / semi-hermetic compressor, shell
  losses ignored) [trade]. The discharge temperature follows from
  h₂ = h_suction + P/ṁ and is therefore an upper estimate.
* **Envelope (decision).** A polynomial is a curve fit, valid only inside the
  published envelope [pub]. :meth:`PolynomialCompressor.performance` *refuses*
  (raises :class:`OutsideEnvelopeError`) a point more than
  :data:`ENVELOPE_TOLERANCE` outside it. The balance search evaluates the
  polynomial freely while iterating (the solver needs a continuous function),
  but when the balance point lies outside the envelope the check reports
  **no capacity** (``capacity_at_balance_w = null``), ``holds = false`` and
  ``within_envelope = false`` with a warning naming the point and the envelope
  — the extrapolated number is never shown as a capacity.
  A rated-point model has no envelope (it is physics, not a fit), but when
  asked to run more than :data:`RATING_SUCTION_GAP` below its rating suction it
  is flagged as a medium-temperature unit at low-temperature suction [trade].
* Without unit-cooler (or condenser) data the evaporating (condensing)
  temperature is fixed by the sizing TD (:func:`coldroom.rules.design_temperatures`):
  S = t_room − TD_evap, D = t_ambient + TD_cond. The evaporator is then
  assumed able to take whatever the compressor pumps at that TD — an
  optimistic assumption stated in the result's ``evaporator_basis``.
* **Verdict.** ``holds`` when the capacity at balance covers the room's
  required capacity (1 + SF)·E/run time (ASHRAE Handbook—Refrigeration,
  "Refrigerated-Facility Loads" [pub]); equivalently when the run hours
  needed, (1 + SF)·E/capacity, fit in the room's run time. A capacity below
  the peak-hour load is a warning, not a failure.
* **Ambient.** "Ambient" is the air on the condenser. For the chart and the
  highest-ambient search the outdoor design air moves with it (same shift,
  outdoor RH held; surfaces facing other spaces keep their temperatures) and
  the room load is recomputed at each ambient (:func:`check_room`).

Examples
--------
The ten-coefficient form evaluated by hand (only C1, C2, C3 non-zero):

>>> ahri540_polynomial([1000.0, 50.0, -10.0] + [0.0] * 7, -10.0, 40.0)
100.0
>>> evaporator = HeatExchanger.from_rating(4500.0, 9.0, "unit cooler")
>>> round(evaporator.conductance, 1)
500.0
"""

from __future__ import annotations

from coldroom.equipment.balance import (
    BALANCE_TOLERANCE,
    BalancePoint,
    CompressorFunction,
    HeatExchanger,
    balance_point,
    highest_holding_ambient,
)
from coldroom.equipment.compressors import (
    DEFAULT_RATING_SUPERHEAT,
    ENVELOPE_TOLERANCE,
    RATING_SUCTION_GAP,
    RICE_DABIRI_F,
    Compressor,
    CompressorPoint,
    Envelope,
    OperatingConditions,
    OutsideEnvelopeError,
    PolynomialCompressor,
    RatedPointCompressor,
    ahri540_polynomial,
    clearance_volumetric_efficiency,
)
from coldroom.equipment.verdict import CHART_AMBIENTS, CheckResult, check_unit, solve_balance

__all__ = [
    "BALANCE_TOLERANCE",
    "CHART_AMBIENTS",
    "DEFAULT_RATING_SUPERHEAT",
    "ENVELOPE_TOLERANCE",
    "RATING_SUCTION_GAP",
    "RICE_DABIRI_F",
    "BalancePoint",
    "CheckResult",
    "Compressor",
    "CompressorFunction",
    "CompressorPoint",
    "Envelope",
    "HeatExchanger",
    "OperatingConditions",
    "OutsideEnvelopeError",
    "PolynomialCompressor",
    "RatedPointCompressor",
    "ahri540_polynomial",
    "balance_point",
    "check_unit",
    "clearance_volumetric_efficiency",
    "highest_holding_ambient",
    "solve_balance",
]
