"""The design day hour by hour: outdoor temperature profile, schedules, 24 hourly loads.

The 24-hour method (:mod:`coldroom.loads`) gives each load line as energy per
day. This module places that energy in the hours of the design day:

- **outdoor air** follows the design day's profile
  t(h) = t_design − f(h)·DR, f the fraction of the daily range of the hour
  (:data:`FRACTION_OF_DAILY_RANGE`, [ref:ashrae-fund-climate]), DR ``design.daily_range``; the outdoor
  humidity ratio stays at its design value through the day (RH rises as the
  air cools, capped at saturation) [trade]. Surfaces facing outdoors and
  doors or air changes that take outdoor air are recomputed for each hour by
  the same functions as the 24-hour lines; the sun allowance stays as it is
  (a 24-hour allowance);
- **doors** pass their day's passages and standing-open time in the schedule's
  windows, each window's share spread evenly over it (no schedule: evenly
  over the day);
- **people, lighting** in their windows (no schedule: from 08:00 for their
  hours [trade]); equipment and forklifts from 08:00 for their hours unless they
  run 24 h; fans and heaters evenly;
- **product**: each delivery brings its share of the day's intake (mass ÷
  total mass delivered); the product and packaging energy of a delivery is
  removed at the constant pull-down rate (energy ÷ pull-down time) from the
  delivery on, the same rate as the 24-hour method's peak; a pull-down longer
  than a day overlaps the next day's (periodic steady state). Respiration
  is even. No delivery schedule: the whole intake at 08:00 [trade];
- **defrost** heat enters in the defrost periods (schedule: start times; else
  evenly spaced from 00:00 [trade]).

Every line's energy is placed, none added or lost, so the 24 hourly loads average
to the room's daily energy ÷ 86 400 s (one daily energy). With a daily range the
outdoor-dependent lines are smaller in the cooler hours, and their daily energy
is their mean over the design day (:attr:`DesignDay.outdoor_line_means`, which
:func:`coldroom.loads.room_loads` takes for the transmission and infiltration
lines); without one they hold the design dry bulb all day.

The **peak-hour load** is the largest hourly load with the defrost heat left
out (the compressor stands still while the coil defrosts; that heat is removed
after, within the run time — our choice, common practice, no source).

Hour *i* is the hour from i:00 to (i+1):00 local time.
"""

from __future__ import annotations

import math
from dataclasses import dataclass, field
from typing import TYPE_CHECKING, Any, Callable, Iterable, Sequence

from coldroom.constants import SECONDS_PER_DAY_S, SECONDS_PER_HOUR_S
from coldroom.errors import CalculationError, finite, non_negative
from coldroom.results import LoadLine

if TYPE_CHECKING:  # pragma: no cover
    from coldroom.inputs.projectfile import ProjectModel, Room

HOURS = 24

#: Fraction of the daily dry-bulb range below the design dry bulb, for the
#: hours 1 … 24 of the design day (hour 1 = 00:00–01:00 … hour 24 = 23:00–24:00,
#: the value at the hour's end): ASHRAE Handbook—Fundamentals (2009), chapter
#: 14 "Climatic Design Information", Table 6 "Fraction of Daily Temperature
#: Range" [ref:ashrae-fund-climate] [mem]. The warmest hour is 15 (f = 0), the coolest hour 5 (f = 1).
FRACTION_OF_DAILY_RANGE: tuple[float, ...] = (
    0.87, 0.92, 0.96, 0.99, 1.00, 0.98, 0.93, 0.84, 0.71, 0.56, 0.39, 0.23,
    0.11, 0.03, 0.00, 0.03, 0.10, 0.21, 0.34, 0.47, 0.58, 0.68, 0.76, 0.82,
)  # fmt: skip

#: Start of the working day for loads given only as hours a day [h] [trade].
WORKDAY_START = 8.0


def outdoor_temperatures(design_dry_bulb: float, daily_range: float) -> tuple[float, ...]:
    """Outdoor dry bulb of each hour of the design day [°C].

    t(h) = t_design − f(h)·DR with f from :data:`FRACTION_OF_DAILY_RANGE`
    (hour i of the result is the table's hour i + 1) [mem, see the table].

    Parameters
    ----------
    design_dry_bulb : float
        Design dry bulb, the day's maximum [°C].
    daily_range : float
        Mean daily range [K], ≥ 0.

    Returns
    -------
    tuple of 24 float
        [°C], hour 0 = 00:00–01:00.

    Examples
    --------
    >>> t = outdoor_temperatures(32.0, 10.0)
    >>> t[14], t[4], round(t[0], 1)
    (32.0, 22.0, 23.3)
    """
    finite("design dry bulb", design_dry_bulb)
    non_negative("daily range", daily_range, "K")
    return tuple(design_dry_bulb - f * daily_range for f in FRACTION_OF_DAILY_RANGE)


def _overlap(start: float, length: float) -> list[float]:
    """Hours of each clock hour covered by [start, start + length) repeated every 24 h [h]."""
    out = [0.0] * HOURS
    if length <= 0.0:
        return out
    start %= 24.0
    end = start + length
    day = 0
    while day * 24.0 < end:
        for h in range(HOURS):
            lo, hi = day * 24.0 + h, day * 24.0 + h + 1
            cover = min(hi, end) - max(lo, start)
            if cover > 0.0:
                out[h] += cover
        day += 1
    return out


def window_coverage(windows: Iterable[tuple[float, float]]) -> list[float]:
    """Share of each clock hour inside the windows [-] (their sum is the windows' hours).

    Parameters
    ----------
    windows : iterable of (start, end)
        Hours after midnight; an end before the start runs past midnight.

    Examples
    --------
    >>> window_coverage([(8, 10.5)])[7:12]
    [0.0, 1.0, 1.0, 0.5, 0.0]
    >>> sum(window_coverage([(22, 2)]))
    4.0
    """
    out = [0.0] * HOURS
    for start, end in windows:
        for h, c in enumerate(_overlap(start, (end - start) % 24.0)):
            out[h] += c
    return out


def shares_in_windows(windows: Iterable[tuple[float, float, float]]) -> list[float]:
    """Share of a daily quantity in each hour, each window's share spread evenly over it [-].

    Parameters
    ----------
    windows : iterable of (start, end, share)

    Examples
    --------
    >>> s = shares_in_windows([(8, 12, 0.8), (12, 20, 0.2)])
    >>> round(s[9], 3), round(s[15], 3), round(sum(s), 6)
    (0.2, 0.025, 1.0)
    """
    out = [0.0] * HOURS
    for start, end, share in windows:
        length = (end - start) % 24.0
        for h, c in enumerate(_overlap(start, length)):
            out[h] += share * c / length
    return out


def after_events(events: Iterable[tuple[float, float]], duration: float) -> list[float]:
    """Share of each hour in a load removed at a constant rate for *duration* after each event [-].

    Parameters
    ----------
    events : iterable of (time, weight)
        Time of day [h] and the event's share of the daily energy [-].
    duration : float
        How long each event's energy takes to remove [h] (may exceed 24 h:
        the days overlap).

    Examples
    --------
    >>> s = after_events([(6.0, 1.0)], 4.0)
    >>> s[5:11]
    [0.0, 0.25, 0.25, 0.25, 0.25, 0.0]
    >>> round(sum(after_events([(6.0, 0.5), (18.0, 0.5)], 30.0)), 9)
    1.0
    """
    if not (duration > 0.0 and math.isfinite(duration)):
        raise CalculationError(f"duration {duration!r} h must be positive")
    out = [0.0] * HOURS
    for time, weight in events:
        for h, c in enumerate(_overlap(time, duration)):
            out[h] += weight * c / duration
    return out


def even() -> list[float]:
    """An even share in every hour."""
    return [1.0 / HOURS] * HOURS


def spread(daily_energy: float, shares: Sequence[float]) -> list[float]:
    """Hourly power [W] of *daily_energy* [J] placed by *shares* (normalised to sum 1)."""
    total = sum(shares)
    if total <= 0.0:
        shares, total = even(), 1.0
    return [daily_energy * s / total / SECONDS_PER_HOUR_S for s in shares]


def run_hours(hourly_load: Sequence[float], capacity: float) -> float:
    """Compressor run hours a day to remove the day's hourly loads at *capacity* [h].

    Σ q(h)·1 h ÷ capacity: every hour's heat is removed within the day, the
    unit cycling off when it has caught up.

    Examples
    --------
    >>> run_hours([1000.0] * 24, 1500.0)
    16.0
    """
    if not capacity > 0.0:
        raise CalculationError(f"capacity {capacity!r} W must be positive")
    return sum(hourly_load) / capacity


@dataclass(frozen=True)
class DesignDay:
    """The room's design day hour by hour.

    Attributes
    ----------
    hourly_load : tuple of 24 float
        Heat entering the room in each hour, every line included [W].
    components : dict
        The same by load component (:data:`coldroom.results.COMPONENTS`) [W].
    outdoor_temperature : tuple of 24 float
        Outdoor dry bulb [°C].
    defrost : tuple of 24 float
        Defrost heat in each hour [W] (part of *hourly_load*).
    scheduled : bool
        The project gives a schedule for this room (the peak-hour design figure
        then comes from this profile).
    notes : tuple of str
        Doubts about the schedule (a door open more than the whole hour, …).
    outdoor_line_means : tuple of (tuple of float, tuple of float)
        The transmission lines' and the infiltration lines' mean power over the day [W],
        in the order the load functions make them (empty without a daily range).
    """

    hourly_load: tuple[float, ...]
    components: dict[str, tuple[float, ...]]
    outdoor_temperature: tuple[float, ...]
    defrost: tuple[float, ...]
    scheduled: bool
    notes: tuple[str, ...] = field(default=())
    outdoor_line_means: tuple[tuple[float, ...], tuple[float, ...]] = ((), ())

    @property
    def daily_energy(self) -> float:
        """Heat of the design day [J]."""
        return sum(self.hourly_load) * SECONDS_PER_HOUR_S

    @property
    def peak_hour(self) -> int:
        """The hour (0–23) with the largest load, defrost heat left out."""
        loads = [q - d for q, d in zip(self.hourly_load, self.defrost)]
        return max(range(HOURS), key=lambda h: (loads[h], -h))

    @property
    def peak_load(self) -> float:
        """The peak-hour load, defrost heat left out [W]."""
        h = self.peak_hour
        return self.hourly_load[h] - self.defrost[h]


def _outdoor_rh(temperature: float, humidity_ratio: float, pressure: float) -> float:
    from coldroom.physics import psychrometrics

    saturated = psychrometrics.saturation_humidity_ratio(temperature, pressure)
    if humidity_ratio >= saturated:
        return 1.0
    return psychrometrics.relative_humidity(temperature, humidity_ratio, pressure)


def _hour_model(model: "ProjectModel", temperature: float, rh: float) -> "ProjectModel":
    design = model.design.model_copy(
        update={"outdoor_temperature": temperature, "outdoor_rh": rh, "outdoor_wet_bulb": None}
    )
    return model.model_copy(update={"design": design})


@dataclass(frozen=True)
class LineSources:
    """The load-line functions of :mod:`coldroom.loads` this module places in the hours.

    ``loads`` hands them in (``coldroom.loads.design_day``), so this module does
    not import ``loads`` and the two form no import circle.
    """

    product_loads: Callable[..., Any]
    transmission_lines: Callable[..., Any]
    infiltration_lines: Callable[..., Any]
    internal_lines: Callable[..., Any]
    outdoor_relative_humidity: Callable[..., Any]
    site_pressure: Callable[..., Any]


def room_design_day(model: "ProjectModel", room: "Room", sources: LineSources) -> DesignDay:
    """The design day of *room*: the 24-hour lines placed in the hours by the schedule.

    Parameters
    ----------
    model : ProjectModel
        The validated project (``design.daily_range`` sets the outdoor profile).
    room : Room
        One of its rooms; ``room.schedule`` may be ``None`` (default placing).
    sources : LineSources
        The load-line functions (``coldroom.loads.design_day`` passes them).

    Returns
    -------
    DesignDay
    """
    from coldroom.physics import psychrometrics
    from coldroom.results import COMPONENTS

    _product_loads = sources.product_loads
    infiltration_lines = sources.infiltration_lines
    internal_lines = sources.internal_lines
    outdoor_relative_humidity = sources.outdoor_relative_humidity
    site_pressure = sources.site_pressure
    transmission_lines = sources.transmission_lines

    design = model.design
    schedule = room.schedule
    temps = outdoor_temperatures(design.outdoor_temperature, design.daily_range)
    pressure = site_pressure(design)
    w_out = psychrometrics.humidity_ratio(design.outdoor_temperature, outdoor_relative_humidity(design), pressure)
    notes: list[str] = []
    by: dict[str, list[float]] = {c: [0.0] * HOURS for c in COMPONENTS}
    defrost = [0.0] * HOURS

    def add(component: str, watts: Sequence[float]) -> None:
        row = by[component]
        for h in range(HOURS):
            row[h] += watts[h]

    # transmission and infiltration: recomputed at each hour's outdoor air
    door_shares = (
        shares_in_windows((w.start, w.end, w.share) for w in schedule.doors)
        if schedule is not None and schedule.doors is not None
        else even()
    )
    # the lines depend on the hour only through its outdoor temperature: computed once per
    # distinct temperature (once for a flat day, daily range 0, the default), summed per hour
    # in the same order as before, so the figures are the same to the last digit
    same_day = design.daily_range == 0.0
    outdoor_lines: dict[float, tuple[list[float], list[float]]] = {}
    line_sums: tuple[list[float], list[float]] = ([], [])
    for h in range(HOURS):
        try:
            transmission_powers, infiltration_powers = outdoor_lines[temps[h]]
        except KeyError:
            if same_day:
                hour_model = model
            else:
                hour_model = _hour_model(model, temps[h], _outdoor_rh(temps[h], w_out, pressure))
            transmission_powers = [line.average_power for line in transmission_lines(hour_model, room)]
            infiltration_powers = [line.average_power for line in infiltration_lines(hour_model, room)]
            outdoor_lines[temps[h]] = transmission_powers, infiltration_powers
        if not line_sums[0] and not line_sums[1]:
            line_sums[0].extend([0.0] * len(transmission_powers))
            line_sums[1].extend([0.0] * len(infiltration_powers))
        for i, power in enumerate(transmission_powers):
            by["transmission"][h] += power
            line_sums[0][i] += power
        for i, power in enumerate(infiltration_powers):
            factor = HOURS * door_shares[h] if room.infiltration.method == "door" else 1.0
            by["infiltration"][h] += power * factor
            line_sums[1][i] += power * factor
    if room.infiltration.method == "door":
        for door in room.doors:
            open_fraction = (door.passages_per_day * door.passage_time + door.open_time) / SECONDS_PER_DAY_S
            worst = max(door_shares) * HOURS * open_fraction
            if worst > 1.0:
                notes.append(
                    f"{room.name}: door {door.name!r} would stand open {worst:.0%} of its busiest hour; "
                    "the schedule packs more traffic into that hour than it has"
                )

    # product: each delivery's share pulled down at a constant rate; respiration even
    products = _product_loads(room)
    total_intake = sum(p.daily_intake for p in room.products)
    if schedule is not None and schedule.deliveries is not None:
        delivered = sum(d.mass for d in schedule.deliveries)
        events = [(d.time, d.mass / delivered) for d in schedule.deliveries]
    else:
        events = [(WORKDAY_START, 1.0)]
    for item, load in zip(room.products, products):
        for what, energy in load.lines():
            if what.endswith("respiration") or total_intake <= 0.0:
                add("product", spread(energy, even()))
            else:
                add("product", spread(energy, after_events(events, item.pulldown_time / SECONDS_PER_HOUR_S)))

    # internal and equipment lines, in the order coldroom.loads.internal_lines makes them
    lines = iter(internal_lines(model, room))

    def take() -> LoadLine:
        return next(lines)

    def workday(hours_per_day: float) -> list[float]:
        hours = hours_per_day / SECONDS_PER_HOUR_S
        return even() if hours >= 24.0 else window_coverage([(WORKDAY_START, WORKDAY_START + hours)])

    if room.people.count > 0 and room.people.hours > 0:
        line = take()
        windows = schedule.people if schedule is not None and schedule.people is not None else None
        shape = window_coverage((w.start, w.end) for w in windows) if windows else workday(room.people.hours)
        add(line.component, spread(line.daily_energy, shape))
    if room.lighting is not None and room.lighting.hours > 0:
        line = take()
        windows = schedule.lighting if schedule is not None and schedule.lighting is not None else None
        shape = window_coverage((w.start, w.end) for w in windows) if windows else workday(room.lighting.hours)
        add(line.component, spread(line.daily_energy, shape))
    for appliance in room.appliances:
        line = take()
        shape = even() if appliance.kind == "heater" else workday(appliance.hours)
        add(line.component, spread(line.daily_energy, shape))
    if room.fans is not None and room.fans.power > 0 and room.fans.hours > 0:
        line = take()
        add(line.component, spread(line.daily_energy, even()))
    d = room.defrost
    if d.type != "off_cycle" and d.heater_power > 0 and d.per_day > 0:
        line = take()
        if schedule is not None and schedule.defrost is not None:
            starts = list(schedule.defrost)
        else:
            count = max(1, round(d.per_day))
            starts = [i * 24.0 / count for i in range(count)]
        if d.duration > 0.0:
            watts = spread(line.daily_energy, after_events(((t, 1.0) for t in starts), d.duration / SECONDS_PER_HOUR_S))
        else:  # a zero-length defrost puts no heat in: its line is 0 J
            watts = spread(line.daily_energy, even())
        add(line.component, watts)
        defrost = watts
    rest = list(lines)
    if rest:  # pragma: no cover - internal_lines grew a line this module does not place
        raise CalculationError(f"design day: unplaced load lines {[line.item for line in rest]}")

    total = tuple(sum(by[c][h] for c in COMPONENTS) for h in range(HOURS))
    return DesignDay(
        hourly_load=total,
        components={c: tuple(v) for c, v in by.items()},
        outdoor_temperature=temps,
        defrost=tuple(defrost),
        scheduled=schedule is not None,
        notes=tuple(notes),
        outdoor_line_means=((), ()) if same_day else (
            tuple(x / HOURS for x in line_sums[0]), tuple(x / HOURS for x in line_sums[1])
        ),
    )
