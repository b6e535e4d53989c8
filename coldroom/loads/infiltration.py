"""Infiltration load: warm outside air entering the room, sensible + latent.

Two methods (``infiltration.method`` of a room; :mod:`coldroom.loads` calls the one named):

``door``
    Buoyancy-driven air exchange through an open doorway, Gosney & Olama as
    presented in ASHRAE Handbook—Refrigeration, chapter "Refrigerated-Facility
    Loads", "Infiltration Air Load" [mem — equations from memory; verify]
    [ref:gosney-olama-1975] [ref:ashrae-refrig-loads]:

        q   = 0.221 A (h_i − h_r) ρ_r (1 − ρ_i/ρ_r)^0.5 (g H)^0.5 F_m   [kW, kJ/kg]
        F_m = [2 / (1 + (ρ_r/ρ_i)^(1/3))]^1.5
        q_t = q D_t D_f (1 − E)
        D_t = (P θ_p + 60 θ_o) / (3600 θ_d)

    Implemented in SI: with h in J/kg the same expression gives W. The period
    θ_d is one day here (24 h), so ``passages_per_day`` and
    ``standing_open_time`` are per day and q_t is the 24-hour average.

``air_changes``
    Average air changes per 24 h by room volume, from the older ASHRAE table
    (separate rows for rooms above and below 0 °C; ×2 heavy use, ×0.6 long
    storage) [mem — table values from memory; verify]. The air volume is taken
    at the **outside** air state: the dry-air mass per day is
    V · n · ρ_da,outside, and the heat is that mass times (h_outside − h_room).

Densities: buoyancy and the ρ_r prefactor use **moist-air** density (kg of
moist air per m³) from :mod:`coldroom.physics.psychrometrics`; enthalpies are per kg
dry air, at the site barometric pressure given by the caller.

Energy convention: results carry both the 24-hour average power [W] and the
daily energy [J] (= average × 86 400 s).
"""

from __future__ import annotations

import math
from dataclasses import dataclass
from types import MappingProxyType
from typing import Mapping

from coldroom.constants import SECONDS_PER_DAY_S, STANDARD_ATMOSPHERE_PA, STANDARD_GRAVITY_M_S2
from coldroom.registry import Registry
from coldroom.errors import CalculationError, finite as _finite, non_negative as _non_negative
from coldroom.physics.psychrometrics import MoistAirState, moist_air_state

__all__ = [
    "DoorProtection",
    "DOOR_PROTECTION",
    "door_protection_effectiveness",
    "doorway_flow_factor",
    "open_time_factor",
    "density_factor",
    "DoorInfiltration",
    "door_infiltration",
    "AIR_CHANGES_ABOVE_FREEZING",
    "AIR_CHANGES_BELOW_FREEZING",
    "USAGE_FACTORS",
    "table_air_changes",
    "AirChangeInfiltration",
    "air_change_infiltration",
]


_FT3 = 0.028316846592  # m³ per cubic foot (exact)


# --------------------------------------------------------------------------- door protection


@dataclass(frozen=True)
class DoorProtection:
    """A doorway protective device and the effectiveness used for it.

    Attributes
    ----------
    name : str
        Table key.
    effectiveness : float
        E in q_t = q·D_t·D_f·(1 − E) [-].
    source : str
        Where the number comes from and why this value was chosen.
    """

    name: str
    effectiveness: float
    source: str


DOOR_PROTECTION: Mapping[str, DoorProtection] = MappingProxyType(
    {
        p.name: p
        for p in (
            DoorProtection("none", 0.0, "no device"),
            DoorProtection(
                "strip_curtain",
                0.85,
                "[mem/trade] ASHRAE gives 0.85–0.95 for new strip curtains; Pham & Oliver measured ≈0.93 [pub]. "  # [ref:pham-oliver-1983]
                "0.85 chosen here for a curtain in service (worn, strips pushed aside) — own choice",
            ),
            DoorProtection(
                "air_curtain",
                0.70,
                "[mem/trade] 0.6–0.8; Pham & Oliver measured 0.75–0.80 [pub]. Mid-range 0.70 chosen — own choice",
            ),
            DoorProtection(
                "vestibule",
                0.90,
                "[mem/trade] 0.90–0.95 for a vestibule/airlock; low end 0.90 chosen — own choice",
            ),
        )
    }
)

_PROTECTION_NAMES = Registry("door protection", DOOR_PROTECTION)

def door_protection_effectiveness(protection: str) -> float:
    """Effectiveness E of a named doorway protective device [-].

    Parameters
    ----------
    protection : str
        ``none``, ``strip_curtain``, ``air_curtain`` or ``vestibule``
        (normalised: ``"Strip curtain"`` works).

    Returns
    -------
    float
        E, 0..1.

    Examples
    --------
    >>> door_protection_effectiveness("Strip curtain")
    0.85
    """
    return _PROTECTION_NAMES.lookup(protection).effectiveness


# --------------------------------------------------------------------------- door method


def doorway_flow_factor(outside_temperature: float, room_temperature: float) -> float:
    """Doorway flow factor D_f: 0.8 when ΔT > 11 K, else 1.1.

    ASHRAE Refrigeration, "Refrigerated-Facility Loads", infiltration through
    doorways [mem — from memory; verify]. ΔT = outside − room.

    Parameters
    ----------
    outside_temperature : float
        Temperature of the infiltrating air [°C].
    room_temperature : float
        Room temperature [°C].

    Returns
    -------
    float
        D_f [-].

    Examples
    --------
    >>> doorway_flow_factor(30.0, -20.0), doorway_flow_factor(10.0, 2.0)
    (0.8, 1.1)
    """
    return 0.8 if (outside_temperature - room_temperature) > 11.0 else 1.1


def open_time_factor(passages_per_day: float, passage_time: float, standing_open_time: float = 0.0) -> float:
    """Doorway open-time factor D_t over one day.

    D_t = (P θ_p + 60 θ_o)/(3600 θ_d) (ASHRAE Refrigeration, "Refrigerated-
    Facility Loads") [mem], here with θ_o in seconds and θ_d = 24 h:
    D_t = (P θ_p + θ_o)/86 400.

    Parameters
    ----------
    passages_per_day : float
        Number of doorway passages per day, P [-].
    passage_time : float
        Door open-close time per passage, θ_p [s] (ASHRAE: 15–25 s typical
        for a manual door [mem]).
    standing_open_time : float
        Time the door simply stands open per day, θ_o [s].

    Returns
    -------
    float
        D_t [-], 0..1.

    Raises
    ------
    CalculationError
        Negative inputs or a total open time longer than a day.

    Examples
    --------
    >>> round(open_time_factor(100, 20.0, 600.0), 4)
    0.0301
    """
    p = _non_negative("passages per day", passages_per_day, "")
    tp = _non_negative("passage time", passage_time, "s")
    to = _non_negative("standing-open time", standing_open_time, "s")
    open_seconds = p * tp + to
    if open_seconds > SECONDS_PER_DAY_S * (1.0 + 1e-12):
        raise CalculationError(
            f"door open time {open_seconds:g} s per day (passages × passage time + standing-open time) "
            f"exceeds one day ({SECONDS_PER_DAY_S:g} s)"
        )
    return min(open_seconds / SECONDS_PER_DAY_S, 1.0)


def density_factor(room_density: float, outside_density: float) -> float:
    """Density factor F_m = [2/(1 + (ρ_r/ρ_i)^(1/3))]^1.5 (Gosney & Olama, in ASHRAE) [mem].

    Parameters
    ----------
    room_density : float
        ρ_r, room (cold) air density [kg/m³].
    outside_density : float
        ρ_i, infiltrating (warm) air density [kg/m³].

    Returns
    -------
    float
        F_m [-]; 1 for equal densities, slightly below 1 for a cold room.

    Examples
    --------
    >>> density_factor(1.2, 1.2)
    1.0
    """
    return (2.0 / (1.0 + (room_density / outside_density) ** (1.0 / 3.0))) ** 1.5


@dataclass(frozen=True)
class DoorInfiltration:
    """Result of the door (Gosney & Olama) infiltration method.

    Attributes
    ----------
    method : str
        ``"door"``.
    average_power : float
        24-hour average heat gain q_t, sensible + latent [W].
    daily_energy : float
        Heat gain per day [J] (= average_power × 86 400).
    full_open_power : float
        Instantaneous heat gain with the door fully open and unprotected, q [W].
    full_open_dry_air_flow : float
        Dry-air mass flow entering with the door fully open, unprotected [kg/s].
    open_time_factor : float
        D_t [-].
    flow_factor : float
        D_f [-].
    effectiveness : float
        E of the protective device [-].
    density_factor : float
        F_m [-].
    door_area : float
        A [m²].
    outside : MoistAirState
        Infiltrating-air state.
    room : MoistAirState
        Room-air state.
    """

    method: str
    average_power: float
    daily_energy: float
    full_open_power: float
    full_open_dry_air_flow: float
    open_time_factor: float
    flow_factor: float
    effectiveness: float
    density_factor: float
    door_area: float
    outside: MoistAirState
    room: MoistAirState


def door_infiltration(
    *,
    door_width: float,
    door_height: float,
    room_temperature: float,
    room_relative_humidity: float,
    outside_temperature: float,
    outside_relative_humidity: float,
    passages_per_day: float,
    passage_time: float,
    standing_open_time: float = 0.0,
    protection: str = "none",
    effectiveness: float | None = None,
    flow_factor: float | None = None,
    pressure: float = STANDARD_ATMOSPHERE_PA,
) -> DoorInfiltration:
    """Infiltration through a doorway, Gosney & Olama as presented in ASHRAE.

    q = 0.221 A (h_i − h_r) ρ_r (1 − ρ_i/ρ_r)^0.5 (g H)^0.5 F_m, averaged as
    q_t = q D_t D_f (1 − E) over 24 h (ASHRAE Refrigeration, "Refrigerated-
    Facility Loads", infiltration air load) [mem — from memory; verify]. With
    h in J/kg the expression gives W.

    When the outside air is not lighter than the room air (the room is not the
    colder side) there is no buoyant inflow into this room by this model and
    the result is zero; the exchange belongs to the colder room's load. The
    enthalpy difference may still be negative (very dry warm air into a humid
    room): the result is then a (small) negative gain, not clipped.

    Parameters
    ----------
    door_width : float
        Clear door width [m].
    door_height : float
        Clear door height H [m].
    room_temperature : float
        Room air temperature [°C].
    room_relative_humidity : float
        Room relative humidity [-], 0..1.
    outside_temperature : float
        Temperature of the air beyond the door [°C] (ambient, corridor, anteroom).
    outside_relative_humidity : float
        Relative humidity of that air [-], 0..1.
    passages_per_day : float
        Doorway passages per day, P.
    passage_time : float
        Open-close time per passage, θ_p [s].
    standing_open_time : float
        Time the door stands open per day, θ_o [s].
    protection : str
        Protective device name, see :data:`DOOR_PROTECTION`; ignored when
        ``effectiveness`` is given.
    effectiveness : float or None
        Explicit effectiveness E [-], 0..1 (overrides ``protection``).
    flow_factor : float or None
        Explicit doorway flow factor D_f [-]; default from
        :func:`doorway_flow_factor`.
    pressure : float
        Site barometric pressure [Pa] (see ``psychrometrics.standard_pressure``).

    Returns
    -------
    DoorInfiltration

    Examples
    --------
    A 1.2 m × 2.4 m freezer door, -25 °C/90 % inside, 25 °C/60 % outside,
    200 passages of 15 s per day, strip curtain:

    >>> r = door_infiltration(door_width=1.2, door_height=2.4, room_temperature=-25.0,
    ...     room_relative_humidity=0.9, outside_temperature=25.0, outside_relative_humidity=0.6,
    ...     passages_per_day=200, passage_time=15.0, protection="strip_curtain")
    >>> round(r.full_open_power / 1000, 1), round(r.average_power)
    (139.0, 579)
    """
    width = _non_negative("door width", door_width, "m")
    height = _non_negative("door height", door_height, "m")
    if effectiveness is None:
        e = door_protection_effectiveness(protection)
    else:
        e = _finite("door protection effectiveness", effectiveness)
        if not (0.0 <= e <= 1.0):
            raise CalculationError(f"door protection effectiveness {e:g} must lie between 0 and 1")
    if flow_factor is None:
        df = doorway_flow_factor(outside_temperature, room_temperature)
    else:
        df = _finite("doorway flow factor", flow_factor)
        if df < 0.0:
            raise CalculationError(f"doorway flow factor {df:g} must not be negative")
    dt = open_time_factor(passages_per_day, passage_time, standing_open_time)
    room = moist_air_state(room_temperature, room_relative_humidity, pressure)
    outside = moist_air_state(outside_temperature, outside_relative_humidity, pressure)
    rho_r = room.moist_air_density
    rho_i = outside.moist_air_density
    area = width * height
    fm = density_factor(rho_r, rho_i)
    if rho_i >= rho_r:
        volume_term = 0.0
    else:
        # Volume-flow part of Gosney & Olama (ASHRAE eq. as above) [mem]:
        # m_dot = 0.221 A ρ_r (1 − ρ_i/ρ_r)^0.5 (g H)^0.5 F_m   [kg/s]
        volume_term = 0.221 * area * rho_r * math.sqrt(1.0 - rho_i / rho_r) * math.sqrt(STANDARD_GRAVITY_M_S2 * height) * fm
    dh = outside.enthalpy - room.enthalpy
    q = volume_term * dh
    q_avg = q * dt * df * (1.0 - e)
    return DoorInfiltration(
        method="door",
        average_power=q_avg,
        daily_energy=q_avg * SECONDS_PER_DAY_S,
        full_open_power=q,
        full_open_dry_air_flow=volume_term,
        open_time_factor=dt,
        flow_factor=df,
        effectiveness=e,
        density_factor=fm,
        door_area=area,
        outside=outside,
        room=room,
    )


# --------------------------------------------------------------------------- air-change method

# Average air changes per 24 h for storage rooms due to door openings and infiltration,
# older ASHRAE Refrigeration Handbook table (IP edition, room volume in ft³), separate tables
# for rooms above and below 32 °F. Values from memory; verify [mem].
# Columns: volume [ft³], air changes per 24 h.
_ABOVE_FT3 = (
    (200, 44.0), (300, 34.5), (400, 29.5), (500, 26.0), (600, 23.0), (800, 20.0), (1000, 17.5),
    (1500, 14.0), (2000, 12.0), (3000, 9.5), (4000, 8.2), (5000, 7.2), (6000, 6.5), (8000, 5.5),
    (10000, 4.9), (15000, 3.9), (20000, 3.5), (25000, 3.0), (30000, 2.7), (40000, 2.3),
    (50000, 2.0), (75000, 1.6), (100000, 1.4),
)  # fmt: skip
_BELOW_FT3 = (
    (200, 33.5), (300, 26.2), (400, 22.5), (500, 20.0), (600, 18.0), (800, 15.3), (1000, 13.5),
    (1500, 11.0), (2000, 9.3), (3000, 7.4), (4000, 6.3), (5000, 5.6), (6000, 5.0), (8000, 4.3),
    (10000, 3.8), (15000, 3.0), (20000, 2.6), (25000, 2.3), (30000, 2.1), (40000, 1.8),
    (50000, 1.6), (75000, 1.3), (100000, 1.1),
)  # fmt: skip

AIR_CHANGES_ABOVE_FREEZING: tuple[tuple[float, float], ...] = tuple((v * _FT3, n) for v, n in _ABOVE_FT3)
"""(room volume [m³], air changes per 24 h) for rooms at or above 0 °C [mem, older ASHRAE table]."""
AIR_CHANGES_BELOW_FREEZING: tuple[tuple[float, float], ...] = tuple((v * _FT3, n) for v, n in _BELOW_FT3)
"""(room volume [m³], air changes per 24 h) for rooms below 0 °C [mem, older ASHRAE table]."""

USAGE_FACTORS: Mapping[str, float] = MappingProxyType({"normal": 1.0, "heavy": 2.0, "long_storage": 0.6})
"""Multipliers on the table air changes: heavy use ×2, long storage ×0.6 [mem, same ASHRAE table notes]."""
_USAGE_NAMES = Registry("room usage", USAGE_FACTORS)


def table_air_changes(room_volume: float, room_temperature: float) -> float:
    """Average air changes per 24 h from the older ASHRAE table.

    Rows for rooms at or above 0 °C and below 0 °C [mem]; between rows the
    value is interpolated linearly in log(volume)–log(air changes) (own
    choice; the table itself is smooth on log axes). Volumes outside the table
    (≈5.7 to 2832 m³) are refused rather than extrapolated.

    Parameters
    ----------
    room_volume : float
        Inside room volume [m³].
    room_temperature : float
        Room temperature [°C]; selects the row set.

    Returns
    -------
    float
        Air changes per 24 h [-].

    Examples
    --------
    >>> round(table_air_changes(28.316846592, 2.0), 2)    # 1000 ft³ above 0 °C
    17.5
    >>> round(table_air_changes(28.316846592, -20.0), 2)  # 1000 ft³ below 0 °C
    13.5
    """
    volume = _finite("room volume", room_volume)
    _finite("room temperature", room_temperature)
    rows = AIR_CHANGES_ABOVE_FREEZING if room_temperature >= 0.0 else AIR_CHANGES_BELOW_FREEZING
    low, high = rows[0][0], rows[-1][0]
    if not (low * (1 - 1e-12) <= volume <= high * (1 + 1e-12)):
        raise CalculationError(
            f"room volume {volume:g} m³ is outside the air-change table ({low:.1f} to {high:.0f} m³); "
            "use the door infiltration method"
        )
    volume = min(max(volume, low), high)
    for (v0, n0), (v1, n1) in zip(rows, rows[1:]):
        if v0 <= volume <= v1:
            f = math.log(volume / v0) / math.log(v1 / v0)
            return math.exp(math.log(n0) + f * (math.log(n1) - math.log(n0)))
    raise AssertionError("unreachable")  # pragma: no cover


@dataclass(frozen=True)
class AirChangeInfiltration:
    """Result of the air-change infiltration method.

    Attributes
    ----------
    method : str
        ``"air_changes"``.
    average_power : float
        24-hour average heat gain, sensible + latent [W].
    daily_energy : float
        Heat gain per day [J].
    air_changes_per_day : float
        Air changes used (table × usage factor, or the explicit value) [1/day].
    table_air_changes_per_day : float or None
        Table value before the usage factor (None when given explicitly).
    usage_factor : float
        Multiplier applied to the table value [-].
    heat_per_volume : float
        Heat removed per m³ of infiltrating air measured at outside conditions [J/m³].
    dry_air_mass_per_day : float
        Dry air entering per day [kg].
    outside : MoistAirState
    room : MoistAirState
    """

    method: str
    average_power: float
    daily_energy: float
    air_changes_per_day: float
    table_air_changes_per_day: float | None
    usage_factor: float
    heat_per_volume: float
    dry_air_mass_per_day: float
    outside: MoistAirState
    room: MoistAirState


def air_change_infiltration(
    *,
    room_volume: float,
    room_temperature: float,
    room_relative_humidity: float,
    outside_temperature: float,
    outside_relative_humidity: float,
    usage: str = "normal",
    air_changes_per_day: float | None = None,
    pressure: float = STANDARD_ATMOSPHERE_PA,
) -> AirChangeInfiltration:
    """Infiltration by average air changes per day.

    Q_day = V · n · ρ_da,outside · (h_outside − h_room): the volume V·n is
    taken at the outside air state (dry-air density 1/v_outside,
    ASHRAE Fundamentals, Psychrometrics eq. 26) [pub]; n from
    :func:`table_air_changes` × usage factor [mem].

    Parameters
    ----------
    room_volume : float
        Inside room volume [m³].
    room_temperature : float
        Room temperature [°C].
    room_relative_humidity : float
        Room relative humidity [-], 0..1.
    outside_temperature : float
        Temperature of the air outside the door [°C].
    outside_relative_humidity : float
        Its relative humidity [-], 0..1.
    usage : str
        ``normal`` (×1), ``heavy`` (×2) or ``long_storage`` (×0.6); ignored
        when ``air_changes_per_day`` is given.
    air_changes_per_day : float or None
        Explicit air changes per 24 h [1/day] (overrides the table).
    pressure : float
        Site barometric pressure [Pa].

    Returns
    -------
    AirChangeInfiltration

    Examples
    --------
    >>> r = air_change_infiltration(room_volume=60.0, room_temperature=2.0, room_relative_humidity=0.85,
    ...     outside_temperature=30.0, outside_relative_humidity=0.5)
    >>> round(r.air_changes_per_day, 2), round(r.average_power)
    (11.61, 486)
    """
    volume = _non_negative("room volume", room_volume, "m³")
    room = moist_air_state(room_temperature, room_relative_humidity, pressure)
    outside = moist_air_state(outside_temperature, outside_relative_humidity, pressure)
    if air_changes_per_day is None:
        factor = _USAGE_NAMES.lookup(usage)
        table = table_air_changes(volume, room_temperature)
        n = table * factor
    else:
        n = _non_negative("air changes per day", air_changes_per_day, "1/day")
        table = None
        factor = 1.0
    heat_per_volume = outside.dry_air_density * (outside.enthalpy - room.enthalpy)
    dry_air_mass = volume * n * outside.dry_air_density
    daily = volume * n * heat_per_volume
    return AirChangeInfiltration(
        method="air_changes",
        average_power=daily / SECONDS_PER_DAY_S,
        daily_energy=daily,
        air_changes_per_day=n,
        table_air_changes_per_day=table,
        usage_factor=factor,
        heat_per_volume=heat_per_volume,
        dry_air_mass_per_day=dry_air_mass,
        outside=outside,
        room=room,
    )
