"""Rooms on one compressor: the system's capacity, suction temperature and electrical figures.

Pure functions on plain floats (SI; temperatures in °C). :mod:`coldroom.design.sizing`
gathers each system's rooms, solves its cycle
(:func:`coldroom.physics.system_cycle.solve_system_cycle`) and calls these for the rest.

One system is one compressor (or condensing unit) at one suction pressure:

- design capacity = Σ member design capacities × diversity
  (:func:`system_design_capacity`; diversity default 100 %, our choice);
- suction (dew) temperature = the coldest member's evaporating temperature
  less the suction-line drop (:func:`suction_temperature`); warmer members run
  their coils at their own evaporating temperature behind an evaporator
  pressure regulator (EPR), their vapour mixing into the suction;
- compressor electrical input = the cycle's ṁ(h₂ − h₁) with the *overall*
  isentropic efficiency on the electrical input, motor included (the basis
  chosen for ``compressor_input_power_w``; see :mod:`coldroom.physics.cycle`);
- condenser fans: given, else :data:`CONDENSER_FAN_SHARE` of the heat of
  rejection [trade];
- connected load = the largest simultaneous draw (:func:`electrical_figures`):
  the refrigerating case (compressor, condenser fans, evaporator fans,
  door-frame and drain-line heaters), and a defrost case. A one-room system
  stops its compressor while its coil defrosts: defrost heaters, evaporator
  fans and heaters. In a system of several rooms the compressor runs on for
  the other rooms while one room defrosts, so each room with electric
  defrost is its own case: its defrost heaters, the heaters, the compressor
  and condenser fans, and the other rooms' evaporator fans (the defrosting
  coil's fans stopped) [trade]; the case that governs is named;
- electricity per day: the compressor and condenser fans for the time the
  design capacity needs to remove the members' daily heat gain
  (:func:`compressor_run_time`, design-point COP, no part-load correction
  [trade]); evaporator fans and heaters for their hours; defrost heaters for
  defrosts × duration.

Examples
--------
>>> system_design_capacity([1000.0, 1500.0], 0.8)
2000.0
>>> suction_temperature([-4.0, -25.5], 1.0)
-26.5
"""

from __future__ import annotations

from dataclasses import dataclass
from typing import Optional, Sequence

from coldroom.constants import SECONDS_PER_DAY_S
from coldroom.errors import CalculationError, finite
from coldroom.results import SystemElectrical


#: Condenser fan input per watt of heat rejected when the project gives none:
#: 20 W per kW, within the 15–30 W/kW of small air-cooled condensers
#: (common practice, no source) [trade] [-].
CONDENSER_FAN_SHARE = 0.02


@dataclass(frozen=True)
class MemberDraw:
    """The electrical consumers of one member room (SI).

    Attributes
    ----------
    daily_heat_gain : float
        The room's heat gain per day, before the safety factor [J].
    evaporator_fan_power : float
        Electrical input of the room's evaporator fans [W].
    evaporator_fan_time : float
        Fan running time per day [s].
    heater_power : float
        Door-frame, drain-line and other heaters running together [W].
    heater_energy : float
        Their electricity per day [J].
    defrost_heater_power : float
        Electric defrost heaters [W] (0 for off-cycle or hot-gas defrost).
    defrost_time : float
        Defrost heater time per day, defrosts × duration [s].
    room : str
        The room's name (names the defrost case that governs).
    """

    daily_heat_gain: float
    evaporator_fan_power: float = 0.0
    evaporator_fan_time: float = 0.0
    heater_power: float = 0.0
    heater_energy: float = 0.0
    defrost_heater_power: float = 0.0
    defrost_time: float = 0.0
    room: str = ""


def system_design_capacity(member_capacities: Sequence[float], diversity: float = 1.0) -> float:
    """The system's design capacity: Σ member design capacities × diversity [W].

    Parameters
    ----------
    member_capacities : sequence of float
        Each member room's design capacity [W], >= 0.
    diversity : float
        Share of the sum the system is sized for [-], 0 < diversity <= 1.

    Examples
    --------
    >>> system_design_capacity([990.0, 1010.0])
    2000.0
    """
    diversity = finite("diversity", diversity)
    if not 0.0 < diversity <= 1.0:
        raise CalculationError(f"diversity {diversity:g} must lie in (0, 1]")
    capacities = [finite("member capacity", q) for q in member_capacities]
    if not capacities or any(q < 0.0 for q in capacities):
        raise CalculationError("a system needs members with non-negative design capacities")
    return sum(capacities) * diversity


def suction_temperature(evaporating_temperatures: Sequence[float], suction_line_drop: float = 0.0) -> float:
    """Saturated (dew) temperature at the compressor suction [°C].

    The coldest member's evaporating temperature less the suction-line drop
    (the line's pressure drop written as a loss of saturation temperature [K]).

    Examples
    --------
    >>> suction_temperature([-2.5], 0.0)
    -2.5
    """
    temperatures = [finite("evaporating temperature", t) for t in evaporating_temperatures]
    if not temperatures:
        raise CalculationError("a system needs at least one evaporating temperature")
    drop = finite("suction-line drop", suction_line_drop)
    if drop < 0.0:
        raise CalculationError(f"suction-line drop {drop:g} K must not be negative")
    return min(temperatures) - drop


def condenser_fan_power(heat_of_rejection: float, given: Optional[float] = None) -> tuple[float, str]:
    """Condenser fan electrical input [W] and where it came from.

    Examples
    --------
    >>> condenser_fan_power(5000.0)
    (100.0, 'estimated, 20 W per kW of heat rejected [trade]')
    >>> condenser_fan_power(5000.0, 150.0)
    (150.0, 'given in the project file')
    """
    if given is not None:
        return finite("condenser fan power", given), "given in the project file"
    heat = finite("heat of rejection", heat_of_rejection)
    return CONDENSER_FAN_SHARE * heat, f"estimated, {CONDENSER_FAN_SHARE * 1000:g} W per kW of heat rejected [trade]"


def compressor_run_time(daily_heat_gain: float, design_capacity: float) -> float:
    """Compressor running time per day [s]: the day's heat gain removed at the design capacity.

    Capped at 24 h (a diversity so low that the system cannot keep up is
    flagged by the caller).

    Examples
    --------
    >>> compressor_run_time(36e6, 1000.0) / 3600
    10.0
    """
    heat = finite("daily heat gain", daily_heat_gain)
    capacity = finite("design capacity", design_capacity)
    if capacity <= 0.0:
        raise CalculationError(f"design capacity {capacity:g} W must be positive")
    return min(SECONDS_PER_DAY_S, max(0.0, heat) / capacity)


def electrical_figures(
    compressor_input_power: float,
    design_capacity: float,
    condenser_fans: tuple[float, str],
    members: Sequence[MemberDraw],
) -> SystemElectrical:
    """Connected load and daily electricity of one system (see the module note for the cases).

    Parameters
    ----------
    compressor_input_power : float
        Compressor electrical input at the design point [W].
    design_capacity : float
        The system's design capacity [W].
    condenser_fans : (float, str)
        Condenser fan input [W] and its basis (:func:`condenser_fan_power`).
    members : sequence of MemberDraw
        The member rooms' consumers.

    Returns
    -------
    SystemElectrical

    Examples
    --------
    >>> e = electrical_figures(800.0, 2000.0, (100.0, "given"),
    ...                        [MemberDraw(86.4e6, 120.0, 86400.0), MemberDraw(43.2e6, 90.0, 86400.0, 100.0,
    ...                                    8.64e6, 2000.0, 4800.0, "Freezer")])
    >>> e.refrigerating_load, e.defrost_load, e.connected_load_case
    (1210.0, 3120.0, 'defrost of Freezer')
    >>> round(e.compressor_run_time / 3600, 2)
    18.0
    """
    compressor = finite("compressor input power", compressor_input_power)
    fans_c, basis = condenser_fans
    fans_e = sum(m.evaporator_fan_power for m in members)
    heaters = sum(m.heater_power for m in members)
    defrost = sum(m.defrost_heater_power for m in members)
    run = compressor_run_time(sum(m.daily_heat_gain for m in members), design_capacity)
    parts = (
        ("compressor", compressor * run),
        ("condenser fans", fans_c * run),
        ("evaporator fans", sum(m.evaporator_fan_power * m.evaporator_fan_time for m in members)),
        ("heaters", sum(m.heater_energy for m in members)),
        ("defrost heaters", sum(m.defrost_heater_power * m.defrost_time for m in members)),
    )
    defrost_load, defrost_case = defrost_draw(compressor, fans_c, members)
    return SystemElectrical(
        compressor_input_power=compressor,
        evaporator_fan_power=fans_e,
        condenser_fan_power=fans_c,
        condenser_fan_basis=basis,
        defrost_heater_power=defrost,
        other_heater_power=heaters,
        refrigerating_load=compressor + fans_c + fans_e + heaters,
        defrost_load=defrost_load,
        compressor_run_time=run,
        daily_energy_parts=parts,
        defrost_case=defrost_case,
    )


def defrost_draw(
    compressor_input_power: float, condenser_fan_power: float, members: Sequence[MemberDraw]
) -> tuple[float, str]:
    """The largest draw while a coil defrosts [W] and the case's name (module note).

    One room: its defrost heaters, evaporator fans and heaters, the compressor
    stopped (``"defrost"``). Several rooms: for each room with electric
    defrost, its defrost heaters + every heater + compressor + condenser fans +
    the other rooms' evaporator fans (``"defrost of ROOM"``). (0, "defrost")
    without electric defrost.

    Examples
    --------
    >>> defrost_draw(800.0, 100.0, [MemberDraw(0.0, 120.0, 0.0, 50.0, 0.0, 1000.0, 0.0, "A")])
    (1170.0, 'defrost')
    >>> defrost_draw(800.0, 100.0, [MemberDraw(0.0, 120.0, room="Cooler"),
    ...                             MemberDraw(0.0, 90.0, 0.0, 0.0, 0.0, 2000.0, 0.0, "Freezer")])
    (3020.0, 'defrost of Freezer')
    """
    fans_e = sum(m.evaporator_fan_power for m in members)
    heaters = sum(m.heater_power for m in members)
    if len(members) == 1:
        defrost = members[0].defrost_heater_power
        return ((defrost + fans_e + heaters) if defrost > 0.0 else 0.0), "defrost"
    best = (0.0, "defrost")
    for m in members:
        if m.defrost_heater_power <= 0.0:
            continue
        draw = m.defrost_heater_power + heaters + compressor_input_power + condenser_fan_power + (
            fans_e - m.evaporator_fan_power
        )
        if draw > best[0]:
            best = (draw, f"defrost of {m.room}")
    return best
