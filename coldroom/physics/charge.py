"""Refrigerant charge estimate and charge-limit cautions for one system.

Pure: densities and volumes in, frozen dataclasses out (SI, kg).

Charge estimate (each part names its basis):

* lines: inside volume (flow area × run length) × the density of what flows
  in them — liquid in the liquid line, vapour in the suction and discharge
  lines;
* evaporator and condenser: internal volume × a mean density
  φ·ρ_liquid + (1 − φ)·ρ_vapour with a liquid volume fraction φ of 0.25 in a
  direct-expansion evaporator and 0.30 in an air-cooled condenser [trade].
  The internal volume comes from the project or a catalogue when given,
  else from a rule of thumb: 1.0 L per kW of refrigerating capacity for the
  evaporator and 0.8 L per kW of heat rejection for the condenser
  (common practice, no source — marked "rule of thumb" on the sheet);
* receiver: its volume × its working liquid level (default 20 % [trade]) ×
  liquid density.

Charge limits — recalled, not read from the standards; every value and rule
here is tagged "from memory; verify against the current edition":

* **Toxicity** (classes A1 and B): m_max = practical limit × room volume
  (EN 378-1:2016 Annex C, Table C.1 and the practical limits of its Annex E;
  ISO 5149-1:2014 Annex A) [ref:en-378] [ref:iso-5149] for location classes I and II. Over it: measures
  (gas detection and alarm, ventilation, a machinery room) per EN 378-3; a
  class B refrigerant in access category a is not permitted.
* **Flammability** (classes 2L, 2, 3): with m₁ = 4 m³ × LFL, m₂ = 26 m³ ×
  LFL, m₃ = 130 m³ × LFL (each × 1.5 for class 2L), a charge up to m₁ is
  allowed in any room; above it the room limit is 0.2 × LFL × room volume,
  capped at m₂ in access category a and at m₃ in b and c (EN 378-1:2016
  C.2/Table C.2; ISO 5149-1:2014 A.5). Up to the cap: measures; above m₃ (or
  m₂ in category a): not permitted.
* **IEC 60335-2-89:2019** self-contained commercial refrigerating appliances
  (when the system is one): per circuit at most 13 × LFL, and not more than
  1.2 kg for class 2L [ref:iec-60335-2-89].

The cold room is the occupied space (people enter it). A system serving
several rooms is judged on its smallest room (a leak there concentrates
most). Defaults when the project says nothing: access category a (general
occupancy) and location class I (refrigerant-containing parts in the occupied
space) — the most restrictive pair, stated on the sheet.
"""

from __future__ import annotations

import math
from dataclasses import dataclass

from coldroom.data.refrigerants import RefrigerantInfo
from coldroom.results import Note

VERIFY = "from memory; verify against the current edition"

#: Where a system's charge comes from (JSON ``charge.basis``, contract values).
STATED = "stated"
ESTIMATE = "estimate"

#: Verdicts (JSON contract values).
WITHIN = "within"
OVER = "over — measures needed"
NOT_PERMITTED = "not permitted"

#: Liquid volume fractions [1] and internal-volume rules of thumb [m³/W] [trade].
EVAPORATOR_LIQUID_FRACTION = 0.25
CONDENSER_LIQUID_FRACTION = 0.30
EVAPORATOR_VOLUME_PER_W = 1.0e-3 / 1e3  # 1.0 L/kW
CONDENSER_VOLUME_PER_W = 0.8e-3 / 1e3  # 0.8 L/kW of heat rejection
RECEIVER_LEVEL = 0.20

DEFAULT_OCCUPANCY = "a"
DEFAULT_LOCATION = "I"
OCCUPANCIES = ("a", "b", "c")
LOCATIONS = ("I", "II", "III", "IV")

#: Practical limits [kg/m³], EN 378-1:2016 Annex E / ISO 5149-1:2014 Annex A
#: [mem] — from memory; verify against the current edition. Classes A1 and B.
PRACTICAL_LIMITS: dict[str, float] = {
    "R-134a": 0.25,
    "R-404A": 0.52,
    "R-507A": 0.53,
    "R-407A": 0.33,
    "R-407C": 0.31,
    "R-407F": 0.32,
    "R-448A": 0.39,
    "R-449A": 0.36,
    "R-452A": 0.42,
    "R-513A": 0.35,
    "R-744": 0.10,
    "R-22": 0.30,
    "R-717": 0.00035,
}

#: IEC 60335-2-89:2019 per-circuit factor on LFL [m³] and the class-2L cap [kg] [mem].
IEC_FACTOR = 13.0
IEC_2L_CAP = 1.2


@dataclass(frozen=True)
class ChargePart:
    """One part of the charge.

    Attributes
    ----------
    part : str
        ``"liquid line"``, ``"evaporator"``, ``"receiver"`` …
    mass : float
        [kg].
    basis : str
        How it was found (volume and density, or the rule of thumb).
    """

    part: str
    mass: float
    basis: str

    def to_json(self) -> dict:
        return {"part": self.part, "charge_kg": self.mass, "basis": self.basis}


@dataclass(frozen=True)
class ChargeEstimate:
    """The charge of one system: stated in the project file, or estimated.

    Attributes
    ----------
    parts : tuple of ChargePart
        What the total is made of (the stated parts, the stated total as one part,
        or the estimate's parts).
    basis : str
        :data:`STATED` (``charge:`` given, it wins everywhere) or :data:`ESTIMATE`.
    estimate_total : float or None
        The estimate [kg] when a stated charge wins over it (shown beside it); ``None`` otherwise.
    """

    parts: tuple[ChargePart, ...]
    basis: str = ESTIMATE
    estimate_total: float | None = None

    @property
    def total(self) -> float:
        """Total charge [kg]."""
        return math.fsum(p.mass for p in self.parts)

    @property
    def stated(self) -> bool:
        """The charge was given in the project file."""
        return self.basis == STATED

    def to_json(self) -> dict:
        """The ``charge`` object (contract keys ``total_kg``, ``basis``, ``parts``; ``estimate_kg`` beside a stated one)."""
        out = {"total_kg": self.total, "basis": self.basis, "parts": [p.to_json() for p in self.parts]}
        if self.estimate_total is not None:
            out["estimate_kg"] = self.estimate_total
        return out


def stated_charge(
    estimate: ChargeEstimate, total: float | None, parts: dict[str, float] | None
) -> ChargeEstimate:
    """The charge that wins: the stated total or parts, else the estimate.

    Parameters
    ----------
    estimate : ChargeEstimate
        The estimate from the cycle and lines.
    total : float or None
        ``charge: {total: …}`` [kg].
    parts : dict of str to float, or None
        ``charge: {parts: {name: mass}}`` [kg]; their sum is the charge when no total is given
        (the project file checks that a total given with them agrees).

    Examples
    --------
    >>> est = ChargeEstimate((ChargePart("evaporator", 0.2, "rule of thumb"),))
    >>> c = stated_charge(est, 1.1, None)
    >>> c.basis, c.total, c.estimate_total
    ('stated', 1.1, 0.2)
    >>> stated_charge(est, None, None) is est
    True
    """
    if parts:
        items = tuple(ChargePart(name, mass, "stated in the project file") for name, mass in parts.items())
    elif total is not None:
        items = (ChargePart("total", total, "stated in the project file"),)
    else:
        return estimate
    return ChargeEstimate(items, STATED, estimate.total)


@dataclass(frozen=True)
class ChargeLimit:
    """One charge-limit rule applied to a system.

    Attributes
    ----------
    rule : str
        The rule's name and source.
    charge : float
        The charge judged [kg] (the stated one when given).
    limit : float or None
        The limit [kg]; ``None`` when the rule sets none here.
    verdict : str
        :data:`WITHIN`, :data:`OVER` or :data:`NOT_PERMITTED`.
    working : str
        The formula with its numbers, for the sheet.
    """

    rule: str
    charge: float
    limit: float | None
    verdict: str
    working: str

    def to_json(self) -> dict:
        """A ``charge_limits`` item (contract keys ``rule``, ``charge_kg``, ``limit_kg``, ``verdict``)."""
        return {
            "rule": self.rule, "charge_kg": self.charge, "limit_kg": self.limit, "verdict": self.verdict,
            "working": self.working,
        }


def line_part(name: str, inside_area: float, length: float, density: float, what: str) -> ChargePart:
    """Charge in a line [kg]: area × length × density.

    Parameters
    ----------
    name : str
        Part name (``"liquid line"``).
    inside_area : float
        Tube flow area [m²].
    length : float
        Run length [m].
    density : float
        Density of the refrigerant in it [kg/m³].
    what : str
        ``"liquid"`` or ``"vapour"`` (for the basis text).

    Examples
    --------
    >>> round(line_part("liquid line", 1.327e-4, 10.0, 1000.0, "liquid").mass, 3)
    1.327
    """
    volume = inside_area * length
    return ChargePart(
        name, volume * density, Note.fill(f"{{v}} of {what} at {{d}}", v=(volume, "internal_volume"), d=(density, "density"))
    )


def exchanger_part(
    name: str,
    volume: float | None,
    duty: float,
    liquid_density: float,
    vapour_density: float,
    liquid_fraction: float,
    volume_per_w: float,
) -> ChargePart:
    """Hold-up of an evaporator or condenser [kg].

    Parameters
    ----------
    name : str
        ``"evaporator"`` or ``"condenser"``.
    volume : float or None
        Internal volume [m³]; ``None`` to use the rule of thumb.
    duty : float
        Refrigerating capacity (evaporator) or heat rejection (condenser) [W].
    liquid_density, vapour_density : float
        Saturated densities at the exchanger's pressure [kg/m³].
    liquid_fraction : float
        Liquid share of the internal volume [1].
    volume_per_w : float
        Rule-of-thumb internal volume per watt of duty [m³/W].
    """
    if volume is None:
        volume = duty * volume_per_w
        origin = f"rule of thumb {volume_per_w * 1e6:.2g} L per kW [trade]: "
    else:
        origin = "internal volume "
    mean = liquid_fraction * liquid_density + (1.0 - liquid_fraction) * vapour_density
    basis = Note.fill(
        origin + f"{{v}}, {liquid_fraction:.0%} liquid [trade]: mean {{d}}", v=(volume, "internal_volume"), d=(mean, "density")
    )
    return ChargePart(name, volume * mean, basis)


def receiver_part(volume: float, level: float, liquid_density: float) -> ChargePart:
    """Liquid held in a receiver at its working level [kg].

    Parameters
    ----------
    volume : float
        Receiver volume [m³].
    level : float
        Working liquid level as a fraction of the volume [1].
    liquid_density : float
        Liquid density [kg/m³].
    """
    return ChargePart(
        "receiver", volume * level * liquid_density,
        Note.fill(f"{{v}} at {level:.0%} level, liquid {{d}}", v=(volume, "internal_volume"), d=(liquid_density, "density")),
    )


def flammability_masses(info: RefrigerantInfo) -> tuple[float, float, float]:
    """m₁, m₂, m₃ [kg] of EN 378-1 / ISO 5149-1 for a flammable refrigerant [mem].

    m₁ = 4 m³·LFL, m₂ = 26 m³·LFL, m₃ = 130 m³·LFL, each × 1.5 for class 2L.

    Examples
    --------
    >>> from coldroom.data.refrigerants import lookup
    >>> [round(m, 3) for m in flammability_masses(lookup("R-290"))]
    [0.152, 0.988, 4.94]
    """
    if info.lfl_kg_m3 is None:
        raise ValueError(f"{info.name} is not flammable")
    factor = 1.5 if info.safety_class.endswith("2L") else 1.0
    lfl = info.lfl_kg_m3
    return 4.0 * lfl * factor, 26.0 * lfl * factor, 130.0 * lfl * factor


def _verdict(charge: float, limit: float, ceiling: float | None) -> str:
    if charge <= limit:
        return WITHIN
    if ceiling is not None and charge > ceiling:
        return NOT_PERMITTED
    return OVER


def charge_limits(
    info: RefrigerantInfo,
    charge: float,
    room_volume: float,
    occupancy: str = DEFAULT_OCCUPANCY,
    location: str = DEFAULT_LOCATION,
    self_contained: bool = False,
) -> tuple[ChargeLimit, ...]:
    """The charge-limit rules that apply to a system, with verdicts.

    Parameters
    ----------
    info : RefrigerantInfo
        The refrigerant.
    charge : float
        Circuit charge [kg].
    room_volume : float
        Volume of the (smallest) occupied room the system serves [m³].
    occupancy : str
        Access category ``"a"`` (general), ``"b"`` (supervised) or ``"c"``
        (authorised only).
    location : str
        Location class ``"I"`` … ``"IV"`` of the refrigerating system.
    self_contained : bool
        The system is a self-contained appliance (IEC 60335-2-89 applies).

    Returns
    -------
    tuple of ChargeLimit

    Examples
    --------
    >>> from coldroom.data.refrigerants import lookup
    >>> r = charge_limits(lookup("R-290"), 0.15, 28.0)
    >>> r[0].verdict, round(r[0].limit, 3)
    ('within', 0.213)
    """
    if occupancy not in OCCUPANCIES:
        raise ValueError(f"occupancy category must be one of {OCCUPANCIES}, not {occupancy!r}")
    if location not in LOCATIONS:
        raise ValueError(f"location class must be one of {LOCATIONS}, not {location!r}")
    where = f"access category {occupancy}, location class {location}"
    results: list[ChargeLimit] = []
    in_room = location in ("I", "II")
    if not info.flammable or info.higher_toxicity:
        limit_per_m3 = PRACTICAL_LIMITS.get(info.name)
        if limit_per_m3 is not None and in_room:
            limit = limit_per_m3 * room_volume
            verdict = _verdict(charge, limit, None)
            if verdict == OVER and info.higher_toxicity and occupancy == "a":
                verdict = NOT_PERMITTED
            results.append(
                ChargeLimit(
                    f"EN 378-1 Annex C / ISO 5149-1 toxicity, {where}",
                    charge,
                    limit,
                    verdict,
                    Note.fill(
                        f"practical limit {{pl}} × room {{v}} = {{m}} ({VERIFY})",
                        pl=(limit_per_m3, "density"), v=(room_volume, "volume"), m=(limit, "mass"),
                    ),
                )
            )
        elif limit_per_m3 is not None:
            results.append(
                ChargeLimit(
                    f"EN 378-1 Annex C / ISO 5149-1 toxicity, {where}",
                    charge,
                    None,
                    WITHIN,
                    "all refrigerant-containing parts outside the occupied space: the room volume sets no "
                    f"limit; machinery-room or enclosure rules of EN 378-3 apply ({VERIFY})",
                )
            )
    if info.flammable:
        m1, m2, m3 = flammability_masses(info)
        cap = m2 if occupancy == "a" else m3
        lfl = info.lfl_kg_m3
        masses = Note.fill("m1 {m1}, m2 {m2}, m3 {m3}", m1=(m1, "mass"), m2=(m2, "mass"), m3=(m3, "mass"))
        if in_room:
            room = 0.2 * lfl * room_volume
            limit = max(m1, min(room, cap))
            working = Note(
                *Note.fill(
                    "max(m1, min(0.2 × LFL {lfl} × room {v} = {room}, cap {cap})) = {lim}; ",
                    lfl=(lfl, "density"), v=(room_volume, "volume"), room=(room, "mass"), cap=(cap, "mass"),
                    lim=(limit, "mass"),
                ).phrase,
                *masses.phrase,
                f" ({VERIFY})",
            )
            results.append(
                ChargeLimit(
                    f"EN 378-1 Annex C / ISO 5149-1 flammability, {where}",
                    charge,
                    limit,
                    _verdict(charge, limit, cap),
                    working,
                )
            )
        else:
            results.append(
                ChargeLimit(
                    f"EN 378-1 Annex C / ISO 5149-1 flammability, {where}",
                    charge,
                    cap,
                    _verdict(charge, cap, None),
                    Note("outside the occupied space: the cap applies; ", *masses.phrase, f" ({VERIFY})"),
                )
            )
        if self_contained:
            limit = IEC_FACTOR * lfl
            working = Note.fill("13 m³ × LFL {lfl} = {m}", lfl=(lfl, "density"), m=(limit, "mass"))
            if info.safety_class.endswith("2L") and limit > IEC_2L_CAP:
                limit = IEC_2L_CAP
                working = Note(*working.phrase, *Note.fill(", class 2L cap {c}", c=(IEC_2L_CAP, "mass")).phrase)
            results.append(
                ChargeLimit(
                    "IEC 60335-2-89:2019 self-contained appliance, per circuit",
                    charge,
                    limit,
                    WITHIN if charge <= limit else NOT_PERMITTED,
                    Note(*working.phrase, f" ({VERIFY})"),
                )
            )
    return tuple(results)


def estimate_charge(
    cycle,
    piping=None,
    evaporator_volume: float | None = None,
    condenser_volume: float | None = None,
    receiver_volume: float | None = None,
    receiver_level: float = RECEIVER_LEVEL,
) -> ChargeEstimate:
    """Estimate a system's charge from its cycle and lines.

    Parameters
    ----------
    cycle : coldroom.physics.cycle.CycleResult
        The system's cycle (pressures, capacity, heat rejection).
    piping : coldroom.physics.line_sizing.PipingResult, optional
        The sized lines; without it the lines are left out.
    evaporator_volume, condenser_volume : float, optional
        Internal volumes [m³]; the rule of thumb per kW when not given.
    receiver_volume : float, optional
        Receiver volume [m³]; no receiver when not given.
    receiver_level : float
        Working liquid level of the receiver [1].

    Returns
    -------
    ChargeEstimate

    Examples
    --------
    >>> from coldroom.physics.cycle import solve_cycle
    >>> est = estimate_charge(solve_cycle("R-290", -10.0, 40.0, 5000.0))
    >>> [p.part for p in est.parts]
    ['evaporator', 'condenser']
    """
    from coldroom.physics.refrigerant import get_fluid

    fluid = get_fluid(cycle.refrigerant)
    parts: list[ChargePart] = []
    if piping is not None:
        for line in piping.lines:
            what = "liquid" if line.line == "liquid" else "vapour"
            parts.append(
                line_part(f"{line.line} line", line.chosen.tube.flow_area, line.spec.length, line.density, what)
            )
    p_evap = cycle.evaporating_pressure
    parts.append(
        exchanger_part(
            "evaporator", evaporator_volume, cycle.capacity,
            fluid.saturated_liquid(pressure=p_evap).density, fluid.saturated_vapour(pressure=p_evap).density,
            EVAPORATOR_LIQUID_FRACTION, EVAPORATOR_VOLUME_PER_W,
        )
    )
    liquid_out = cycle.states[2]
    if cycle.transcritical:
        vapour_density = cycle.states[1].density
        liquid_density = liquid_out.density
    else:
        p_cond = fluid.dew_pressure(cycle.condensing_temperature)
        vapour_density = fluid.saturated_vapour(pressure=p_cond).density
        liquid_density = fluid.saturated_liquid(pressure=p_cond).density
    parts.append(
        exchanger_part(
            "condenser", condenser_volume, cycle.condenser_duty, liquid_density, vapour_density,
            CONDENSER_LIQUID_FRACTION, CONDENSER_VOLUME_PER_W,
        )
    )
    if receiver_volume:
        parts.append(receiver_part(receiver_volume, receiver_level, liquid_out.density))
    return ChargeEstimate(tuple(parts))
