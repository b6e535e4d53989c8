"""Design rules that sizing, the physical checks, the cycle and the existing-unit check share.

One owner for each rule of thumb; everything here is plain numbers and
imports nothing of coldroom (no CoolProp, no pydantic), so ``coldroom validate`` and every layer above can use
it without an import circle.

* Evaporator TD by room RH, the freezer TD and the condenser TD
  (:func:`evaporator_td_for`, :func:`design_temperatures`,
  :func:`room_design_temperatures`) [trade].
* The cycle defaults (:data:`CYCLE_DEFAULTS`): one table for ``coldroom cycle``,
  :func:`coldroom.physics.cycle.solve_cycle` and a project's ``refrigeration`` block.
* The one pressure-ratio rule by application (:data:`PRESSURE_RATIO_LIMITS`,
  :func:`pressure_ratio_limit`, :func:`single_stage_application`) [trade].
* The one discharge-temperature limit per refrigerant family
  (:data:`DISCHARGE_LIMITS`, :func:`discharge_temperature_limit`) [trade].
* The application classes of compressors (:data:`APPLICATION_CLASSES`,
  :func:`application_mismatch`) [trade].
* The condenser air over a year (:func:`condenser_air_at`, :func:`condenser_air_basis`) [trade].
* The condenser-air range searched by the existing-unit check
  (:data:`AMBIENT_SWEEP`).
* The capacity that removes a daily heat gain: the safety factor
  (:data:`DEFAULT_SAFETY_FACTOR`, :func:`with_safety_factor`) and
  (1 + SF)·E/t_run (:func:`required_capacity`), the one place each is computed.

Temperatures in °C (the trade states TDs against °C room temperatures),
differences in K.

Examples
--------
>>> evaporator_td_for(room_temperature=2.0, relative_humidity=0.90)[0]
4.5
>>> evaporator_td_for(room_temperature=2.0, relative_humidity=0.70)[0]
7.5
>>> evaporator_td_for(room_temperature=-20.0, relative_humidity=0.80)[0]
5.5
>>> pressure_ratio_limit(-30.0), pressure_ratio_limit(-8.0)
(18.0, 8.0)
"""

from __future__ import annotations

from dataclasses import dataclass
from typing import TYPE_CHECKING, Optional


if TYPE_CHECKING:  # pragma: no cover
    from coldroom.inputs.projectfile import ProjectModel, Room

# --------------------------------------------------------------------------- design temperatures

TD_SOURCE = "trade practice, evaporator TD vs room RH [trade]"

#: Evaporator TD (room air − saturated evaporating dew temperature) by room
#: relative humidity, for rooms above :data:`FREEZER_BELOW` [trade, common
#: practice, no source]: 4–5 K ≈ 90 % RH; 5.5–6.5 K ≈ 80–85 %; 6.5–9 K ≈ 65–80 %; 9–12 K ≈ 50–65 %.
#: Each row: (lowest RH of the band [-], TD [K], source). The TD is the middle
#: of the trade band, rounded to 0.5 K; below 50 % RH the top of the last band
#: is used.
EVAPORATOR_TD_BY_RH: tuple[tuple[float, float, str], ...] = (
    (0.875, 4.5, f"4–5 K for about 90 % RH, {TD_SOURCE}"),
    (0.80, 6.0, f"5.5–6.5 K for 80–85 % RH, {TD_SOURCE}"),
    (0.65, 7.5, f"6.5–9 K for 65–80 % RH, {TD_SOURCE}"),
    (0.50, 10.0, f"9–12 K for 50–65 % RH, {TD_SOURCE}"),
    (0.0, 12.0, f"12 K (top of the 9–12 K band) below 50 % RH, {TD_SOURCE}"),
)

#: Rooms colder than this are freezers: RH is not controlled, TD 5–6 K [trade]
#: (the threshold is common practice, no source) [°C].
FREEZER_BELOW = -5.0
FREEZER_TD = (5.5, f"5–6 K for freezers, {TD_SOURCE}")

#: Air-cooled condenser TD above the entering air [K]: 10 K, inside the trade
#: range 8–15 K [trade].
DEFAULT_CONDENSER_TD = 10.0
CONDENSER_TD_SOURCE = "air-cooled condenser, trade range 8–15 K [trade]"


def evaporator_td_for(room_temperature: float, relative_humidity: float) -> tuple[float, str]:
    """Evaporator TD for a room, from the trade table.

    Parameters
    ----------
    room_temperature : float
        Room air temperature [°C].
    relative_humidity : float
        Target room relative humidity [-].

    Returns
    -------
    (float, str)
        TD [K] and its source text.

    Examples
    --------
    >>> evaporator_td_for(0.0, 0.55)
    (10.0, '9–12 K for 50–65 % RH, trade practice, evaporator TD vs room RH [trade]')
    """
    if room_temperature < FREEZER_BELOW:
        return FREEZER_TD
    for lowest, td, source in EVAPORATOR_TD_BY_RH:
        if relative_humidity >= lowest:
            return td, source
    return EVAPORATOR_TD_BY_RH[-1][1], EVAPORATOR_TD_BY_RH[-1][2]  # pragma: no cover


@dataclass(frozen=True)
class DesignTemperatures:
    """Design temperatures of one room's refrigeration system.

    Attributes
    ----------
    evaporating_temperature : float
        Saturated evaporating (dew) temperature [°C].
    condensing_temperature : float
        Saturated condensing (dew) temperature [°C].
    condenser_air_temperature : float
        Air entering the condenser [°C].
    evaporator_td, condenser_td : float
        The TDs used [K].
    evaporator_td_source, condenser_td_source, condenser_air_source : str
        Where each came from.
    """

    evaporating_temperature: float
    condensing_temperature: float
    condenser_air_temperature: float
    evaporator_td: float
    condenser_td: float
    evaporator_td_source: str
    condenser_td_source: str
    condenser_air_source: str


def design_temperatures(
    room_temperature: float,
    relative_humidity: float,
    outdoor_temperature: float,
    evaporator_td: Optional[float] = None,
    condenser_td: Optional[float] = None,
    condenser_air_temperature: Optional[float] = None,
) -> DesignTemperatures:
    """Evaporating and condensing dew temperatures for one room.

    Evaporating = room − evaporator TD (:func:`evaporator_td_for` unless
    given); condensing = condenser air (the outdoor design dry bulb unless
    given) + condenser TD (:data:`DEFAULT_CONDENSER_TD` unless given).

    Parameters
    ----------
    room_temperature : float
        Room air [°C].
    relative_humidity : float
        Target room RH [-].
    outdoor_temperature : float
        Outdoor design dry bulb [°C], the condenser air unless given.
    evaporator_td, condenser_td : float, optional
        Overrides [K].
    condenser_air_temperature : float, optional
        Air entering the condenser [°C].

    Examples
    --------
    >>> t = design_temperatures(2.0, 0.90, 32.0)
    >>> (t.evaporating_temperature, t.condensing_temperature)
    (-2.5, 42.0)
    """
    if evaporator_td is None:
        td_e, td_e_source = evaporator_td_for(room_temperature, relative_humidity)
    else:
        td_e, td_e_source = evaporator_td, "given in the project file"
    if condenser_td is None:
        td_c, td_c_source = DEFAULT_CONDENSER_TD, CONDENSER_TD_SOURCE
    else:
        td_c, td_c_source = condenser_td, "given in the project file"
    if condenser_air_temperature is None:
        air, air_source = outdoor_temperature, "outdoor design dry bulb"
    else:
        air, air_source = condenser_air_temperature, "given in the project file"
    return DesignTemperatures(
        evaporating_temperature=room_temperature - td_e,
        condensing_temperature=air + td_c,
        condenser_air_temperature=air,
        evaporator_td=td_e,
        condenser_td=td_c,
        evaporator_td_source=td_e_source,
        condenser_td_source=td_c_source,
        condenser_air_source=air_source,
    )


def room_design_temperatures(model: "ProjectModel", room: "Room") -> DesignTemperatures:
    """:func:`design_temperatures` for one room of a project, with its refrigeration overrides
    (the room's own block, or its system's: ``model.refrigeration_for(room)``)."""
    r = model.refrigeration_for(room)
    return design_temperatures(
        room.temperature,
        room.rh,
        model.design.outdoor_temperature,
        evaporator_td=r.evaporator_td,
        condenser_td=r.condenser_td,
        condenser_air_temperature=r.condenser_air_temperature,
    )


# --------------------------------------------------------------------------- cycle defaults


@dataclass(frozen=True)
class CycleDefaults:
    """Defaults of a single-stage cycle, shared by ``coldroom cycle`` and a project's ``refrigeration`` block.

    Attributes
    ----------
    superheat : float
        Useful superheat at the evaporator outlet [K]: 4–7 K with a
        thermostatic expansion valve [trade].
    suction_line_superheat : float
        Further (useless) superheat picked up in the suction line [K] [trade].
    subcooling : float
        Liquid subcooling at the condenser outlet [K] [trade].
    isentropic_efficiency : float
        Overall isentropic efficiency of a small reciprocating or scroll
        compressor [1]; 0.6–0.75 typical [trade].
    clearance : float
        Clearance volume ratio C [1]; 0.03–0.06 for reciprocating compressors
        [mem, textbooks, e.g. Stoecker & Jones 2nd ed. ch. 11] [ref:stoecker-jones].
    """

    superheat: float = 5.0
    suction_line_superheat: float = 5.0
    subcooling: float = 2.0
    isentropic_efficiency: float = 0.65
    clearance: float = 0.04


#: The one table of cycle defaults.
CYCLE_DEFAULTS = CycleDefaults()

# --------------------------------------------------------------------------- pressure ratio

#: Evaporating dew temperature below which a compressor works in the
#: low-temperature (low back pressure) application [°C]; manufacturers' LBP
#: envelopes start at about −20 °C suction [trade].
LOW_TEMPERATURE_BELOW = -20.0

#: The one pressure-ratio rule, by application [1], each entry (limit, source).
#: Medium temperature: a single-stage unit normally runs at 3–6; past 8 a
#: medium-temperature compressor is working at low-temperature suction (an
#: advisory: a low-temperature unit does it) [trade]. Low temperature: single-stage
#: low-temperature condensing units are rated at −35 °C suction (EN 13215 [mem]), a
#: pressure ratio of 11–13 with R-404A / R-448A, and their envelopes reach about
#: −40 °C at 45 °C condensing (16–19); past 18 there is no standard single-stage
#: application: two stages or a compound system [trade]. An ordinary −22 °C walk-in
#: (ratio about 10) is well inside it.
PRESSURE_RATIO_LIMITS: dict[str, tuple[float, str]] = {
    "medium": (8.0, "medium-temperature single stage to ≈8 [trade]"),
    "low": (18.0, "single-stage low-temperature envelopes to ≈18 [trade]"),
}


def application_of(evaporating_temperature: float) -> str:
    """``"low"`` below :data:`LOW_TEMPERATURE_BELOW` evaporating [°C], else ``"medium"``."""
    return "low" if evaporating_temperature < LOW_TEMPERATURE_BELOW else "medium"


def pressure_ratio_limit(evaporating_temperature: float) -> float:
    """The pressure ratio [1] above which the advisory is given, for this suction.

    Parameters
    ----------
    evaporating_temperature : float
        Saturated suction (dew) temperature at the compressor [°C].
    """
    return PRESSURE_RATIO_LIMITS[application_of(evaporating_temperature)][0]


def single_stage_application(pressure_ratio: float, evaporating_temperature: float) -> bool:
    """Whether a standard single-stage unit is built for this lift (the low-temperature limit; [trade]).

    A medium-temperature suction past 8 is still a single-stage (low-temperature unit's) duty.

    Examples
    --------
    >>> single_stage_application(10.2, -28.0), single_stage_application(21.0, -40.0)
    (True, False)
    """
    return pressure_ratio <= PRESSURE_RATIO_LIMITS["low"][0]


def pressure_ratio_advisory(pressure_ratio: float, evaporating_temperature: float) -> Optional[str]:
    """The advisory text when *pressure_ratio* [1] is past the limit for the application, else None.

    Examples
    --------
    >>> pressure_ratio_advisory(10.2, -28.0) is None
    True
    >>> pressure_ratio_advisory(8.7, -10.0)[:20]
    'pressure ratio 8.7 i'
    """
    application = application_of(evaporating_temperature)
    limit, source = PRESSURE_RATIO_LIMITS[application]
    if pressure_ratio <= limit:
        return None
    if application == "medium":
        advice = "a medium-temperature compressor is working at low-temperature suction: use a low-temperature unit"
    else:
        advice = "no standard single-stage application: two stages or a compound system"
    return f"pressure ratio {pressure_ratio:.1f} is above {limit:g} for {application}-temperature suction ({source}): {advice}"


# --------------------------------------------------------------------------- application class

#: A compressor's (condensing unit's) application class: the saturated suction range at the
#: compressor it is built for [°C], (lowest, highest, words). Manufacturers' convention of
#: low/medium/high back pressure (LBP/MBP/HBP) envelopes [trade]; EN 13215 rates
#: condensing units of the classes at −35 °C (LT) and −10 °C (MT) suction [mem] [ref:en-13215].
APPLICATION_CLASSES: dict[str, tuple[float, float, str]] = {
    "LT": (-45.0, -15.0, "low-temperature"),
    "MT": (-20.0, 10.0, "medium-temperature"),
    "HT": (-5.0, 15.0, "high-temperature"),
}


def application_class_of_rating(rating_suction: float) -> str:
    """The class of a unit known by one rated point [°C] when the catalogue names none [trade].

    Rated at −20 °C suction or colder: LT (EN 13215's LT point is −35 °C [mem]); up to 0 °C: MT
    (its MT point −10 °C); warmer: HT.

    >>> application_class_of_rating(-35.0), application_class_of_rating(-10.0), application_class_of_rating(5.0)
    ('LT', 'MT', 'HT')
    """
    if rating_suction <= LOW_TEMPERATURE_BELOW:
        return "LT"
    return "MT" if rating_suction <= 0.0 else "HT"


def suction_class(suction_temperature: float) -> str:
    """The class a saturated suction at the compressor [°C] calls for (LT below −20 °C, MT to +10, HT above)."""
    if suction_temperature < LOW_TEMPERATURE_BELOW:
        return "LT"
    return "MT" if suction_temperature <= APPLICATION_CLASSES["MT"][1] else "HT"


def application_mismatch(application: str, suction_temperature: float) -> Optional[str]:
    """Why a unit of class *application* is not suitable at this suction [°C], or ``None`` when it is.

    Examples
    --------
    >>> application_mismatch("MT", -29.0)
    'medium-temperature unit at low-temperature suction'
    >>> application_mismatch("LT", -9.6)
    'low-temperature unit at medium-temperature suction'
    >>> application_mismatch("LT", -29.0) is None
    True
    """
    low, high, words = APPLICATION_CLASSES[application]
    if low <= suction_temperature <= high:
        return None
    needed = APPLICATION_CLASSES[suction_class(suction_temperature)][2]
    if needed == words:  # inside the class's name but past its range (colder than −45 °C …)
        side = "below" if suction_temperature < low else "above"
        return f"{words} unit at a suction {side} its range"
    return f"{words} unit at {needed} suction"


# --------------------------------------------------------------------------- discharge temperature

#: The one discharge-temperature limit per refrigerant family [°C], each (limit, source),
#: at the compressor's discharge (the cycle's state 2, an upper estimate of the line
#: temperature). Fluorinated refrigerants and hydrocarbons on ester or mineral oil:
#: 135 °C, the limit commonly applied against oil breakdown [trade]. R-744: its
#: compressors are built for hotter discharge gas, 140 °C [trade]. R-717: 150 °C [trade].
DISCHARGE_LIMITS: dict[str, tuple[float, str]] = {
    "fluorinated": (135.0, "oil breakdown, commonly applied to HFC/HFO/HCFC [trade]"),
    "hydrocarbon": (135.0, "oil breakdown, commonly applied to hydrocarbons [trade]"),
    "carbon dioxide": (140.0, "R-744 compressors, commonly applied [trade]"),
    "ammonia": (150.0, "R-717 compressors, commonly applied [trade]"),
}

_HYDROCARBONS = frozenset({"R290", "R600", "R600A", "R1270", "R170", "R441A", "R436A", "R436B"})


def refrigerant_family(refrigerant: str) -> str:
    """The family whose discharge-temperature limit applies to *refrigerant* (``"R-290"``, ``"r290"`` …).

    >>> refrigerant_family("R-744"), refrigerant_family("r290"), refrigerant_family("R448A")
    ('carbon dioxide', 'hydrocarbon', 'fluorinated')
    """
    compact = "".join(c for c in refrigerant.upper() if c.isalnum())
    if compact == "R744":
        return "carbon dioxide"
    if compact == "R717":
        return "ammonia"
    if compact in _HYDROCARBONS:
        return "hydrocarbon"
    return "fluorinated"


def discharge_temperature_limit(refrigerant: str) -> float:
    """The discharge-temperature limit [°C] of *refrigerant*'s family (:data:`DISCHARGE_LIMITS`).

    Examples
    --------
    >>> discharge_temperature_limit("R-448A"), discharge_temperature_limit("R-744")
    (135.0, 140.0)
    """
    return DISCHARGE_LIMITS[refrigerant_family(refrigerant)][0]


def discharge_temperature_over(discharge_temperature: float, refrigerant: str) -> bool:
    """Whether *discharge_temperature* [°C] is over the family's limit (a blocking verdict)."""
    return discharge_temperature > discharge_temperature_limit(refrigerant)


# --------------------------------------------------------------------------- condenser air over a year

#: ``condenser_air_basis`` values (JSON contract).
CONDENSER_AIR_FOLLOWS = "follows outdoor air"
CONDENSER_AIR_FIXED = "fixed (indoors)"


def condenser_air_basis(location: str) -> str:
    """How the condenser air moves over a year: ``"follows outdoor air"`` or ``"fixed (indoors)"``."""
    return CONDENSER_AIR_FIXED if location == "indoors" else CONDENSER_AIR_FOLLOWS


def condenser_air_at(
    outdoor_temperature: float, design_outdoor_temperature: float, design_condenser_air: float, location: str
) -> float:
    """The air on the condenser [°C] when the outdoor air is *outdoor_temperature* [°C].

    Outdoors it keeps its design-day offset above the outdoor air (a roof or yard that runs warmer
    than the weather station stays so); indoors it stays at its design value [trade].

    >>> condenser_air_at(10.0, 30.0, 35.0, "outdoors"), condenser_air_at(10.0, 30.0, 35.0, "indoors")
    (15.0, 35.0)
    """
    if location == "indoors":
        return design_condenser_air
    return outdoor_temperature + (design_condenser_air - design_outdoor_temperature)


# --------------------------------------------------------------------------- ambient sweep

#: Condenser-air range [°C] over which the existing-unit check searches the
#: highest ambient at which a unit holds (common practice, no source: covers
#: temperate to hot-climate condenser air).
AMBIENT_SWEEP = (10.0, 55.0)

# --------------------------------------------------------------------------- capacity

#: Safety factor on the calculated load [-]: 10 % (ASHRAE Handbook—Refrigeration,
#: "Refrigerated-Facility Loads", safety factor) [mem] [ref:ashrae-refrig-loads]. The default
#: of a room's ``safety_factor``.
DEFAULT_SAFETY_FACTOR = 0.10


def with_safety_factor(quantity: float, safety_factor: float) -> float:
    """A daily heat gain [J] or a load [W] with the safety factor added: (1 + SF)·quantity.

    Examples
    --------
    >>> with_safety_factor(1000.0, 0.10)
    1100.0
    """
    return (1.0 + safety_factor) * quantity


def required_capacity(daily_energy: float, run_time: float, safety_factor: float) -> float:
    """Refrigeration capacity that removes a daily heat gain in the compressor's run time [W].

    Q = (1 + SF)·E / t_run (ASHRAE Handbook—Refrigeration, "Refrigerated-Facility
    Loads", safety factor and operating time) [mem] [ref:ashrae-refrig-loads]. The
    inputs are checked where they are read (the project file: run time 1–24 h,
    safety factor 0–1).

    Parameters
    ----------
    daily_energy : float
        Heat gain over 24 h, before the safety factor [J].
    run_time : float
        Compressor run time per day [s], > 0.
    safety_factor : float
        Fraction added to the daily energy [-].

    Examples
    --------
    >>> round(required_capacity(86_400_000.0, 16 * 3600.0, 0.10), 6)   # 1 kW average, 16 h, +10 %
    1650.0
    """
    return with_safety_factor(daily_energy, safety_factor) / run_time
