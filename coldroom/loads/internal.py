"""Internal and equipment loads: people, lighting, motors, forklifts, heaters, defrost.

Convention: every ``*_energy`` function returns the **energy per day in J**.
Operating times are given in **hours per day** [h/day] (the trade's unit);
short durations (one defrost) in seconds. Use :func:`average_power` to turn a
daily energy into the 24-hour average in W and :func:`daily_energy` back.

Sources: ASHRAE Handbook—Refrigeration, chapter "Refrigerated-Facility Loads",
"Internal Load" [mem] [ref:ashrae-refrig-loads]; ASHRAE Handbook—Fundamentals,
chapter "Nonresidential Cooling and Heating Load Calculations", heat gain from
electric motors [mem] [ref:ashrae-fund-loads]; trade practice [trade].

Defrost: count defrost heat **either** as a load here (:func:`defrost_energy`)
**or** through the shorter compressor run time of
:mod:`coldroom.loads.totals` (``RUN_HOURS_BY_DEFROST``) — not both
(project convention [trade]).
"""

from __future__ import annotations

from coldroom.constants import SECONDS_PER_DAY_S, SECONDS_PER_HOUR_S
from coldroom.registry import Registry
from coldroom.errors import CalculationError, finite as _finite, non_negative as _non_negative

__all__ = [
    "average_power",
    "daily_energy",
    "people_heat_rate",
    "people_energy",
    "lighting_energy",
    "MOTOR_LOCATIONS",
    "motor_energy",
    "forklift_energy",
    "equipment_energy",
    "heater_energy",
    "DEFROST_SHARE_RANGE",
    "DEFAULT_DEFROST_SHARE",
    "defrost_energy",
]



def _hours(hours_per_day: float) -> float:
    h = _non_negative("hours per day", hours_per_day, "h")
    if h > 24.0:
        raise CalculationError(f"hours per day {h:g} h must lie between 0 and 24")
    return h


def average_power(daily_energy_value: float) -> float:
    """24-hour average power of a daily energy [W].

    Examples
    --------
    >>> average_power(86_400.0)
    1.0
    """
    return _finite("daily energy", daily_energy_value) / SECONDS_PER_DAY_S


def daily_energy(average_power_value: float) -> float:
    """Daily energy [J] of a 24-hour average power [W].

    Examples
    --------
    >>> daily_energy(1.0)
    86400.0
    """
    return _finite("average power", average_power_value) * SECONDS_PER_DAY_S


# --------------------------------------------------------------------------- people


def people_heat_rate(room_temperature: float) -> float:
    """Heat given off by one person at moderate work, 272 − 6·t W.

    ASHRAE Refrigeration, "Refrigerated-Facility Loads", internal load,
    heat equivalent of occupancy [mem — from memory; verify]. t in °C (trade
    formula in °C). Heavier clothing and work in cold rooms raise the output.

    Parameters
    ----------
    room_temperature : float
        Room temperature [°C], -50..30.

    Returns
    -------
    float
        Heat per person [W].

    Examples
    --------
    >>> people_heat_rate(0.0), people_heat_rate(-20.0)
    (272.0, 392.0)
    """
    t = _finite("room temperature", room_temperature)
    if not (-50.0 <= t <= 30.0):
        raise CalculationError(f"room temperature {t:g} °C is outside the people-load formula range -50 to 30 °C")
    return 272.0 - 6.0 * t


def people_energy(people: float, hours_per_day: float, room_temperature: float) -> float:
    """Daily heat from people working in the room [J].

    Parameters
    ----------
    people : float
        Number of people present while working (average) [-].
    hours_per_day : float
        Hours per day they are in the room [h].
    room_temperature : float
        Room temperature [°C].

    Returns
    -------
    float
        Energy per day [J].

    Examples
    --------
    >>> people_energy(2, 1.0, 0.0)   # 2 × 272 W × 3600 s
    1958400.0
    """
    n = _non_negative("number of people", people, "")
    return n * people_heat_rate(room_temperature) * _hours(hours_per_day) * SECONDS_PER_HOUR_S


# --------------------------------------------------------------------------- lighting

def lighting_energy(power: float, hours_per_day: float) -> float:
    """Daily heat from lighting: all electrical input becomes heat in the room [J].

    Common practice, no source (electrical input × time). For a power density,
    pass ``density × floor area``.

    Parameters
    ----------
    power : float
        Installed lighting electrical power, including drivers/ballasts [W].
    hours_per_day : float
        Hours per day the lights are on [h].

    Returns
    -------
    float
        Energy per day [J].

    Examples
    --------
    >>> lighting_energy(10.0 * 20.0, 4.0)
    2880000.0
    """
    return _non_negative("lighting power", power, "W") * _hours(hours_per_day) * SECONDS_PER_HOUR_S


# --------------------------------------------------------------------------- motors

MOTOR_LOCATIONS = ("in_air_stream", "load_inside_motor_outside", "motor_inside_load_outside")
"""Where the motor and its driven load sit relative to the refrigerated air."""
_MOTOR_LOCATION_NAMES = Registry("motor location", {name: name for name in MOTOR_LOCATIONS})


def motor_energy(
    input_power: float,
    hours_per_day: float,
    location: str = "in_air_stream",
    efficiency: float = 1.0,
) -> float:
    """Daily heat from an electric motor (evaporator fan, conveyor, pump) [J].

    Heat equivalent of electric motors, ASHRAE Fundamentals (nonresidential
    cooling load chapter) [mem]:

    * ``in_air_stream`` — motor and driven load both in the room (evaporator
      fans): the whole electrical input, P_in.
    * ``load_inside_motor_outside`` — only the shaft power reaches the room:
      P_in · η.
    * ``motor_inside_load_outside`` — only the motor losses: P_in · (1 − η).

    Parameters
    ----------
    input_power : float
        Electrical input power of the motor [W] (nameplate or measured).
    hours_per_day : float
        Running hours per day [h].
    location : str
        One of :data:`MOTOR_LOCATIONS`.
    efficiency : float
        Motor efficiency η [-], 0 < η <= 1; not used for ``in_air_stream``.

    Returns
    -------
    float
        Energy per day [J].

    Examples
    --------
    >>> motor_energy(150.0, 24.0)   # evaporator fans, counted whole
    12960000.0
    >>> motor_energy(1000.0, 1.0, "load_inside_motor_outside", 0.8)
    2880000.0
    """
    p = _non_negative("motor input power", input_power, "W")
    h = _hours(hours_per_day)
    key = _MOTOR_LOCATION_NAMES.key(location)
    eta = _finite("motor efficiency", efficiency)
    if not (0.0 < eta <= 1.0):
        raise CalculationError(f"motor efficiency {eta:g} must lie in (0, 1]")
    share = {"in_air_stream": 1.0, "load_inside_motor_outside": eta, "motor_inside_load_outside": 1.0 - eta}[key]
    return p * share * h * SECONDS_PER_HOUR_S


def forklift_energy(power: float, hours_per_day: float) -> float:
    """Daily heat from a battery forklift working in the room [J].

    ≈ battery energy drawn while in the room: average electrical draw × hours
    [trade, common practice]. (If only the battery energy per shift is known,
    pass energy/hours as ``power``.)

    Parameters
    ----------
    power : float
        Average electrical power drawn while working [W].
    hours_per_day : float
        Hours per day the forklift works in the room [h].

    Returns
    -------
    float
        Energy per day [J].

    Examples
    --------
    >>> forklift_energy(4000.0, 2.0)
    28800000.0
    """
    return _non_negative("forklift power", power, "W") * _hours(hours_per_day) * SECONDS_PER_HOUR_S


def equipment_energy(power: float, hours_per_day: float) -> float:
    """Daily heat from other electrical equipment in the room: power × hours [J].

    Common practice, no source (all electrical input ends as heat in the room).

    Examples
    --------
    >>> equipment_energy(100.0, 10.0)
    3600000.0
    """
    return _non_negative("equipment power", power, "W") * _hours(hours_per_day) * SECONDS_PER_HOUR_S


def heater_energy(nameplate_power: float, hours_per_day: float = 24.0) -> float:
    """Daily heat from door-frame, pressure-relief or drain-line heaters [J].

    Nameplate power × hours [trade]; door-frame heaters usually run 24 h.
    Do **not** pass an anti-frost-heave floor heater here (see
    ``transmission.heated_slab_floor_heat_gain``).

    Parameters
    ----------
    nameplate_power : float
        Heater power [W].
    hours_per_day : float
        Hours per day energised [h].

    Returns
    -------
    float
        Energy per day [J].

    Examples
    --------
    >>> heater_energy(50.0)
    4320000.0
    """
    return _non_negative("heater power", nameplate_power, "W") * _hours(hours_per_day) * SECONDS_PER_HOUR_S


# --------------------------------------------------------------------------- defrost

DEFROST_SHARE_RANGE = (0.5, 1.0)
"""Share of defrost heater energy reaching the room load, 50–100 % [trade]."""
DEFAULT_DEFROST_SHARE = 0.75
"""Mid-range of :data:`DEFROST_SHARE_RANGE`, own choice [trade]."""


def defrost_energy(
    heater_power: float,
    defrosts_per_day: float,
    defrost_duration: float,
    share_to_room: float = DEFAULT_DEFROST_SHARE,
) -> float:
    """Daily defrost heat that the refrigeration must remove again [J].

    E = P_heater · n_defrosts · duration · share [trade]. Electric defrost:
    pass the total heater power of the coil(s). Hot-gas defrost: pass an
    equivalent heat input if known. Off-cycle defrost adds no heat (use 0
    and the 16 h run time). Count defrost **either** here **or** by the
    run-time allowance, not both (see the module note).

    Parameters
    ----------
    heater_power : float
        Total defrost heater power [W].
    defrosts_per_day : float
        Number of defrosts per day [-].
    defrost_duration : float
        Heater-on time per defrost [s].
    share_to_room : float
        Share of the heater energy that becomes room load [-], 0..1
        (trade range 0.5–1.0).

    Returns
    -------
    float
        Energy per day [J].

    Examples
    --------
    >>> defrost_energy(3000.0, 4, 20 * 60.0, share_to_room=0.5)
    7200000.0
    """
    p = _non_negative("defrost heater power", heater_power, "W")
    n = _non_negative("defrosts per day", defrosts_per_day, "")
    d = _non_negative("defrost duration", defrost_duration, "s")
    s = _finite("defrost share to room", share_to_room)
    if not (0.0 <= s <= 1.0):
        raise CalculationError(f"defrost share to room {s:g} must lie between 0 and 1")
    if n * d > SECONDS_PER_DAY_S:
        raise CalculationError(f"defrost time {n * d:g} s per day exceeds one day")
    return p * n * d * s
