"""Expansion valves for a quote: each coil's valve rated at the coil's own conditions.

A valve's catalogue capacity holds at its rating condition only. Through the
valve's orifice the mass flow follows the orifice equation, ṁ = C·A·√(2·ρ·Δp)
(incompressible flow through a restriction [pub] [ref:ashrae-refrig-control]),
and the capacity is that flow times the refrigerating effect. With the same
orifice (C·A fixed), the capacity at the job's conditions is

    Q = Q_rated · (Δh_job / Δh_rated) · √(ρ_job·Δp_job / (ρ_rated·Δp_rated))

where Δh = h(saturated vapour at the coil's dew point) − h(liquid at the valve
inlet), ρ the liquid density at the valve inlet and Δp the pressure across the
valve [ref:ashrae-refrig-control] [mem]. At the rating condition the valve sees
the whole condensing − evaporating difference (our reading of a rating table
[mem]); on the job it sees

    Δp_job = p_condensing − p_evaporating − liquid-line drop − static head − distributor,

the distributor allowance a project setting (``quote.distributor_pressure_drop``;
default :data:`DISTRIBUTOR_ALLOWANCE` [trade]).

The smallest valve whose capacity at conditions covers the coil's duty is taken;
one above :data:`OVERSIZE_WARNING` times the duty is warned (a valve far too large
hunts at part load [trade]).
"""

from __future__ import annotations

import math
from dataclasses import dataclass
from typing import TYPE_CHECKING, Optional, Sequence

if TYPE_CHECKING:  # pragma: no cover
    from coldroom.inputs.catalogue_items import ExpansionValveEntry

#: Pressure drop across a coil's refrigerant distributor when the project gives none [Pa]
#: (1 bar: distributor nozzle and tubes together, trade figure 0.7–2 bar [trade]).
DISTRIBUTOR_ALLOWANCE = 1.0e5
#: A valve whose capacity at conditions exceeds this multiple of the duty is warned [trade].
OVERSIZE_WARNING = 1.5


@dataclass(frozen=True)
class ValveConditions:
    """What a coil's valve sees on the job (SI; °C).

    Attributes
    ----------
    refrigerant : str
    evaporating_temperature : float
        The coil's saturated evaporating (dew) temperature [°C].
    condensing_temperature : float
        Saturated condensing (dew) temperature [°C].
    subcooling : float
        Liquid subcooling at the condenser outlet [K] (the liquid's state: an adiabatic
        line keeps its enthalpy).
    line_pressure_loss : float
        Liquid-line friction drop plus static head [Pa] (negative: a falling line gains).
    distributor_pressure_drop : float
        [Pa].
    valve_subcooling : float or None
        Subcooling left at the valve inlet after the line [K] (reported; None without a liquid line).
    """

    refrigerant: str
    evaporating_temperature: float
    condensing_temperature: float
    subcooling: float
    line_pressure_loss: float
    distributor_pressure_drop: float
    valve_subcooling: Optional[float] = None


@dataclass(frozen=True)
class ValveState:
    """Refrigerating effect [J/kg], liquid density [kg/m³] and pressure across the valve [Pa]."""

    effect: float
    liquid_density: float
    pressure_drop: float


def valve_state(
    refrigerant: str, evaporating: float, condensing: float, subcooling: float, pressure_loss: float = 0.0
) -> ValveState:
    """Δh, ρ_liquid and Δp of a valve between *condensing* and *evaporating* dew points [°C].

    The liquid leaves the condenser *subcooling* below its bubble point; the liquid
    line's *pressure_loss* [Pa] (drop, head and distributor) comes off the pressure
    difference, not off the liquid's enthalpy (an adiabatic line).
    """
    from coldroom.physics.refrigerant import get_fluid

    fluid = get_fluid(refrigerant)
    p_c = fluid.dew_pressure(condensing)
    p_e = fluid.dew_pressure(evaporating)
    bubble = fluid.saturated_liquid(pressure=p_c)
    liquid = bubble if subcooling <= 0.0 else fluid.state_pt(p_c, bubble.t - subcooling)
    vapour = fluid.saturated_vapour(temperature=evaporating)
    return ValveState(vapour.h - liquid.h, liquid.density, p_c - p_e - pressure_loss)


def capacity_at_conditions(valve: "ExpansionValveEntry", job: ValveState) -> float:
    """The valve's capacity at the job's state by the orifice relation (module notes) [W].

    0 when the job leaves no pressure across the valve.
    """
    rated = valve_state(
        valve.refrigerant, valve.rated_evaporating_temperature, valve.rated_condensing_temperature,
        valve.rated_subcooling,
    )
    if job.pressure_drop <= 0.0 or job.effect <= 0.0:
        return 0.0
    return valve.rated_capacity * (job.effect / rated.effect) * math.sqrt(
        job.liquid_density * job.pressure_drop / (rated.liquid_density * rated.pressure_drop)
    )


@dataclass(frozen=True)
class ValveChoice:
    """A coil's valve (or none that covers its duty)."""

    room: str
    model: Optional[str]
    price: Optional[float]
    duty: float
    capacity: float
    pressure_drop: float
    subcooling: float
    basis: str
    warning: Optional[str] = None

    def to_json(self) -> dict:
        return {
            "room": self.room,
            "model": self.model,
            "duty_w": self.duty,
            "capacity_at_conditions_w": self.capacity,
            "pressure_drop_pa": self.pressure_drop,
            "subcooling_k": self.subcooling,
        }


def choose_valve(
    valves: Sequence["ExpansionValveEntry"], room: str, duty: float, conditions: ValveConditions
) -> ValveChoice:
    """The smallest catalogue valve of the refrigerant that covers *duty* [W] at *conditions*."""
    from coldroom.data import refrigerants

    job = valve_state(
        conditions.refrigerant, conditions.evaporating_temperature, conditions.condensing_temperature,
        conditions.subcooling, conditions.line_pressure_loss + conditions.distributor_pressure_drop,
    )
    at_valve = conditions.subcooling if conditions.valve_subcooling is None else conditions.valve_subcooling
    where = (
        f"at {conditions.evaporating_temperature:.1f} °C evaporating / {conditions.condensing_temperature:.1f} °C "
        f"condensing, {conditions.subcooling:.1f} K subcooling at the condenser, {at_valve:.1f} K at the valve, "
        f"Δp {job.pressure_drop / 1e5:.2f} bar "
        f"(liquid line {conditions.line_pressure_loss / 1e5:.2f} bar, distributor "
        f"{conditions.distributor_pressure_drop / 1e5:.2f} bar off)"
    )
    name = refrigerants.lookup(conditions.refrigerant).name
    rated = sorted(
        ((capacity_at_conditions(v, job), v) for v in valves if refrigerants.lookup(v.refrigerant).name == name),
        key=lambda pair: (pair[0], pair[1].price),
    )
    for capacity, valve in rated:
        if capacity >= duty:
            warning = None
            if capacity > OVERSIZE_WARNING * duty:
                from coldroom.results import Note

                warning = Note.fill(
                    f"{room}: the smallest valve that covers {{d}}, {valve.model}, gives {{c}} at the coil's "
                    f"conditions ({capacity / duty * 100:.0f} % of the duty, above {OVERSIZE_WARNING * 100:.0f} %): "
                    "it may hunt at part load; check the valve's orifice range",
                    d=(duty, "power"), c=(capacity, "power"),
                )
            return ValveChoice(room, valve.model, valve.price, duty, capacity, job.pressure_drop,
                               at_valve, f"smallest {name} valve covering the coil's duty {where}", warning)
    best = rated[-1][0] if rated else 0.0
    from coldroom.results import Note

    return ValveChoice(
        room, None, None, duty, best, job.pressure_drop, at_valve,
        f"no {name} valve in the catalogue covers {duty:.0f} W {where}",
        Note.fill(f"{room}: no {name} expansion valve in the catalogue covers the coil's {{d}} at its conditions "
                  "(largest {c}): price one by hand", d=(duty, "power"), c=(best, "power")),
    )
