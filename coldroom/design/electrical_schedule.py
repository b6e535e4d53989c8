"""The electrical schedule of a quote: supply and currents per unit, per system; NEC Article 440 figures.

Currents come from the catalogue where it gives them. Otherwise they are
estimated from the electrical input: I = P / (V·cos φ) on a single-phase
supply, I = P / (√3·V·cos φ) on a three-phase one (line current of a balanced
three-phase load, P = √3·V·I·cos φ [trade]); heaters at cos φ = 1, motors at
:data:`DEFAULT_POWER_FACTOR` unless the catalogue gives one [trade]; a
locked-rotor current not given is taken as :data:`LOCKED_ROTOR_MULTIPLE` times
the running current [trade]. Every estimate is marked.

Under ``electrical_code: NEC`` each circuit also gets, by NFPA 70 (NEC)
Article 440 [mem] [ref:nfpa-70]:

* **minimum circuit ampacity** MCA = 1.25 × the largest motor's rated-load
  current + the sum of the other loads' currents (440.33 [mem]);
* **maximum overcurrent protection** MOP = 2.25 × the largest motor's
  rated-load current + the other loads (440.22(A) [mem]), rounded **down** to
  a standard rating of 240.6(A) [mem] (:data:`STANDARD_RATINGS`); never below
  the standard rating that covers the MCA (UL 1995 practice [mem]).

Under IEC the protective device and the cable are the installer's, chosen by the
local wiring rules (IEC 60364 [mem]); the schedule gives currents only and says so.
"""

from __future__ import annotations

import math
from dataclasses import dataclass, field
from typing import Optional, Sequence

#: cos φ of a compressor or fan motor when the catalogue gives none [trade].
DEFAULT_POWER_FACTOR = 0.85
#: Locked-rotor current over running current when not given (hermetic compressors 4–7 [trade]).
LOCKED_ROTOR_MULTIPLE = 5.0
#: Supply assumed for a coil whose catalogue entry gives none [trade].
DEFAULT_COIL_SUPPLY = "230 V 1~ 50 Hz"
#: Standard ampere ratings of fuses and inverse-time breakers, NEC 240.6(A) [mem] [ref:nfpa-70].
STANDARD_RATINGS = (15, 20, 25, 30, 35, 40, 45, 50, 60, 70, 80, 90, 100, 110, 125, 150, 175, 200, 225, 250, 300,
                    350, 400, 450, 500, 600, 700, 800, 1000, 1200, 1600, 2000, 2500, 3000, 4000, 5000, 6000)
IEC_NOTE = ("IEC: protective devices and cables are chosen by the installer to the local wiring rules "
            "(IEC 60364 and national codes); the schedule gives the currents only")
NEC_NOTE = ("NEC: MCA = 1.25 × largest motor RLA + other loads (Article 440.33); MOP = 2.25 × largest RLA + other "
            "loads (440.22(A)), rounded down to a standard rating of 240.6(A) — from memory of NFPA 70: check the "
            "edition in force and the nameplate")


def line_current(power: float, supply: str, power_factor: float) -> float:
    """Line current [A] of a load of *power* [W] on *supply* at *power_factor* (module notes).

    Examples
    --------
    >>> round(line_current(2300.0, "230 V 1~ 50 Hz", 1.0), 3)
    10.0
    >>> round(line_current(6928.2, "400 V 3~ 50 Hz", 1.0), 2)
    10.0
    """
    from coldroom.inputs.catalogue_items import parse_supply

    voltage, phases, _frequency = parse_supply(supply)
    return power / ((math.sqrt(3.0) if phases == 3 else 1.0) * voltage * power_factor)


def round_down_standard(current: float) -> int:
    """The largest standard rating of NEC 240.6(A) not above *current* [A] (15 A at least).

    Examples
    --------
    >>> round_down_standard(34.2), round_down_standard(60.0), round_down_standard(9.0)
    (30, 60, 15)
    """
    below = [r for r in STANDARD_RATINGS if r <= current + 1e-9]
    return below[-1] if below else STANDARD_RATINGS[0]


def round_up_standard(current: float) -> int:
    """The smallest standard rating of NEC 240.6(A) at or above *current* [A]."""
    return next((r for r in STANDARD_RATINGS if r >= current - 1e-9), STANDARD_RATINGS[-1])


@dataclass(frozen=True)
class Load:
    """One load of a circuit: a motor (with its rated-load current) or a heater [A]."""

    what: str
    current: float
    motor: bool


def nec_circuit(loads: Sequence[Load]) -> tuple[float, int, str]:
    """MCA [A], MOP [A] and how the MOP was found, by NEC Article 440 (module notes)."""
    motors = [x.current for x in loads if x.motor]
    largest = max(motors) if motors else 0.0
    others = sum(x.current for x in loads) - largest
    mca = 1.25 * largest + others
    mop_raw = 2.25 * largest + others
    mop = round_down_standard(mop_raw)
    how = f"2.25 × {largest:.1f} A + {others:.1f} A = {mop_raw:.1f} A, rounded down to {mop} A"
    if mop_raw < STANDARD_RATINGS[0]:
        how = f"2.25 × {largest:.1f} A + {others:.1f} A = {mop_raw:.1f} A, below the smallest standard rating: {mop} A"
    elif mop < mca:
        mop = round_up_standard(mca)
        how += f"; below the MCA, so the standard rating covering it: {mop} A"
    return mca, mop, how


@dataclass(frozen=True)
class ElectricalItem:
    """A unit on the schedule: its supply and currents [A], and how they were found."""

    item: str
    model: str
    supply: str
    running_current: float
    locked_rotor_current: Optional[float]
    estimated: bool
    basis: str
    loads: tuple[Load, ...] = ()
    minimum_circuit_ampacity: Optional[float] = None
    maximum_overcurrent_protection: Optional[int] = None
    overcurrent_basis: Optional[str] = None

    def to_json(self) -> dict:
        out = {
            "item": self.item,
            "model": self.model,
            "supply": self.supply,
            "running_current_a": self.running_current,
            "locked_rotor_current_a": self.locked_rotor_current,
            "estimated": self.estimated,
            "basis": self.basis,
        }
        if self.minimum_circuit_ampacity is not None:
            out["minimum_circuit_ampacity_a"] = self.minimum_circuit_ampacity
            out["maximum_overcurrent_protection_a"] = self.maximum_overcurrent_protection
            out["overcurrent_basis"] = self.overcurrent_basis
        return out


@dataclass(frozen=True)
class SystemSchedule:
    system: str
    items: tuple[ElectricalItem, ...]
    code: str
    notes: tuple[str, ...] = field(default=())

    @property
    def total_running_current(self) -> float:
        return sum(i.running_current for i in self.items)

    def to_json(self) -> dict:
        out = {
            "system": self.system,
            "electrical_code": self.code,
            "items": [i.to_json() for i in self.items],
            "total_running_current_a": self.total_running_current,
            "notes": list(self.notes),
        }
        if self.code == "NEC":  # the whole system as one circuit: every unit's loads together
            mca, mop, how = nec_circuit([load for item in self.items for load in item.loads])
            out["minimum_circuit_ampacity_a"] = mca
            out["maximum_overcurrent_protection_a"] = mop
            out["overcurrent_basis"] = "the system's units on one circuit: " + how
        return out


def condensing_unit_item(entry, compressor_power: float, code: str) -> ElectricalItem:  # type: ignore[no-untyped-def]
    """The condensing unit (compressor at its balance point + condenser fans) on the schedule."""
    fans = entry.fan_power or 0.0
    supply = entry.supply or "400 V 3~ 50 Hz"
    pf = entry.power_factor or DEFAULT_POWER_FACTOR
    notes = []
    if entry.supply is None:
        notes.append("supply not in the catalogue: 400 V 3~ 50 Hz assumed")
    fan_current = line_current(fans, supply, pf) if fans > 0 else 0.0
    if entry.running_current is not None:
        running = entry.running_current
        compressor = max(running - fan_current, 0.0)
        estimated = False
        notes.append(f"running current {running:.1f} A from the catalogue")
    else:
        compressor = line_current(compressor_power, supply, pf)
        running = compressor + fan_current
        estimated = True
        notes.append(f"estimated from {compressor_power + fans:.0f} W at the balance point, cos φ {pf:.2f}")
    if entry.locked_rotor_current is not None:
        locked: Optional[float] = entry.locked_rotor_current
    else:
        locked = LOCKED_ROTOR_MULTIPLE * compressor
        estimated = True
        notes.append(f"locked-rotor current estimated as {LOCKED_ROTOR_MULTIPLE:g} × running [trade]")
    loads = (Load("compressor", compressor, True),) + ((Load("condenser fans", fan_current, True),) if fans else ())
    return _with_code(ElectricalItem("condensing unit", entry.model, supply, running, locked, estimated,
                                     "; ".join(notes), loads), code)


def coil_item(choice, entry, code: str) -> ElectricalItem:  # type: ignore[no-untyped-def]
    """A room's unit coolers (fans and defrost heaters of all its coils) on the schedule."""
    supply = entry.supply or DEFAULT_COIL_SUPPLY
    pf = entry.power_factor or DEFAULT_POWER_FACTOR
    n = choice.count
    notes = [f"{n} × {entry.model}"]
    if entry.supply is None:
        notes.append(f"supply not in the catalogue: {DEFAULT_COIL_SUPPLY} assumed")
    fan = line_current(entry.fan_power, supply, pf) if entry.fan_power > 0 else 0.0
    heater = line_current(entry.defrost_heater_power, supply, 1.0) if entry.defrost_heater_power > 0 else 0.0
    if entry.running_current is not None:
        fan, estimated = entry.running_current, False
        notes.append("fan current from the catalogue")
    else:
        estimated = True
        notes.append(f"fans estimated from {entry.fan_power:.0f} W at cos φ {pf:.2f}")
    if heater:
        notes.append(f"defrost heaters {entry.defrost_heater_power:.0f} W each at cos φ 1")
    loads = tuple(Load(f"fan {k + 1}", fan, True) for k in range(n)) + tuple(
        Load(f"defrost heater {k + 1}", heater, False) for k in range(n) if heater
    )
    running = n * (fan + heater)
    locked = entry.locked_rotor_current * n if entry.locked_rotor_current is not None else None
    return _with_code(ElectricalItem(f"unit coolers, {choice.room}", entry.model, supply, running, locked, estimated,
                                     "; ".join(notes), loads), code)


def _with_code(item: ElectricalItem, code: str) -> ElectricalItem:
    if code != "NEC":
        return item
    mca, mop, how = nec_circuit(item.loads)
    from dataclasses import replace

    return replace(item, minimum_circuit_ampacity=mca, maximum_overcurrent_protection=mop, overcurrent_basis=how)
