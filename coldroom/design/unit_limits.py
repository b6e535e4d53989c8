"""What an installed unit can still do: the way forward after ``coldroom check``.

Three figures, each found by running the existing-unit check
(:func:`coldroom.design.existing.check_room` — the same balance point, nothing
re-modelled) on the project with one thing changed, and searching for the
change at which the margin is zero:

- **coldest room temperature held**: the room set point at which the capacity
  at balance just covers the required capacity (for a cooler turned freezer:
  the warmest the room must be set to). Products whose final temperature lies
  below that set point are taken to leave at the set point (a room cannot cool
  them further);
- **largest daily intake** at the room's own temperature: every product's
  daily intake and its packaging scaled by one factor (stored product kept);
- **replacement duty**: the room's design capacity at its design SST/SCT
  (:attr:`coldroom.results.RoomLoads.design_capacity`,
  :func:`coldroom.design.sizing.room_design_temperatures`).

The margin rises with the set point (less load, warmer suction) and falls with
the intake, so each search brackets the zero and narrows it by the Illinois
variant of regula falsi (Dowell & Jarratt, BIT 11 (1971) 168–174 [ref:dowell-jarratt-1971] [mem]) to
:data:`TEMPERATURE_TOLERANCE` / :data:`INTAKE_TOLERANCE`. Where the unit has no
balance or its polynomial would be extrapolated, the check says "no capacity",
which counts as not holding.

A unit built for medium temperatures asked to run at low-temperature suction is
named first, before any margin: its compressor is not built for the pressure
ratio, discharge temperature and motor cooling of freezer duty, whatever the
capacity says (:func:`medium_at_low_message`).
"""

from __future__ import annotations

from dataclasses import dataclass
from typing import TYPE_CHECKING, Any, Callable, Optional

from coldroom.results import Note, Term
from coldroom.rules import LOW_TEMPERATURE_BELOW

if TYPE_CHECKING:  # pragma: no cover
    from coldroom.inputs.projectfile import ProjectModel, Room
    from coldroom.results import RoomLoads

#: Room temperatures searched for the coldest held [°C] (the project file's room range).
SEARCH_LOW, SEARCH_HIGH = -50.0, 25.0
TEMPERATURE_STEP = 4.0  # K: the first steps away from the set point while bracketing
TEMPERATURE_TOLERANCE = 0.02  # K
INTAKE_TOLERANCE = 0.002  # of the asked intake
INTAKE_LIMIT = 64.0  # times the asked intake: "more than this" is reported as this
#: Medium-temperature units are rated at a saturated suction of about −10 °C (EN 12900 MT
#: rating point −10/45 °C; LT −35/40 °C [ref:en-12900] [mem]); a unit whose rating suction or envelope
#: floor is above :data:`MT_SUCTION_FLOOR` is taken as a medium-temperature unit, and
#: a design suction below :data:`LT_SUCTION_BELOW` as low-temperature duty: the class boundary of
#: :data:`coldroom.rules.APPLICATION_CLASSES` [trade].
MT_SUCTION_FLOOR = LT_SUCTION_BELOW = LOW_TEMPERATURE_BELOW


@dataclass(frozen=True)
class UnitLimits:
    """The way forward for an existing unit.

    Attributes
    ----------
    coldest_room_temperature_held : float or None
        Set point at which the unit just holds [°C]; None when it holds at no set point
        in :data:`SEARCH_LOW` … :data:`SEARCH_HIGH`.
    coldest_status : str
        ``"found"``, ``"holds_at_lowest"`` (holds even at :data:`SEARCH_LOW`) or ``"never"``.
    max_daily_intake : float or None
        Largest daily intake at the room's temperature [kg/day]; None when the room takes
        no product in.
    daily_intake : float
        The intake the project asks for [kg/day].
    replacement_capacity : float
        [W].
    replacement_evaporating, replacement_condensing : float or None
        Design SST and SCT (dew) [°C]; condensing None for transcritical R-744.
    room_temperature : float
        The room's set point [°C].
    medium_at_low : Note or None
        The medium-temperature-unit-at-low-temperature-suction message.
    holds : bool
        The verdict at the project's conditions.
    pulldown : PulldownResult or None
        The pull-down after a delivery with this unit (:mod:`coldroom.loads.pulldown`).
    storage_ceiling : (float, str) or None
        The lowest of the room's products' highest recommended storage temperatures [°C] and that
        product's name: no remedy raises the set point above it.
    """

    coldest_room_temperature_held: Optional[float]
    coldest_status: str
    max_daily_intake: Optional[float]
    daily_intake: float
    replacement_capacity: float
    replacement_evaporating: Optional[float]
    replacement_condensing: Optional[float]
    room_temperature: float
    medium_at_low: Optional[Note]
    holds: bool
    pulldown: Any = None
    storage_ceiling: Optional[tuple[float, str]] = None

    def remedies(self) -> tuple[Note, ...]:
        """The way forward as plain sentences, the medium-temperature message first."""
        out: list[Note] = []
        if self.medium_at_low is not None:
            out.append(self.medium_at_low)
        if not self.holds:
            t = self.coldest_room_temperature_held
            ceiling = self.storage_ceiling
            if t is not None and t > self.room_temperature:
                if ceiling is not None and t > ceiling[0]:
                    out.append(Note.fill(
                        f"Raising the set point is no remedy: the unit holds only at {{t}}, above the highest "
                        f"recommended storage temperature of {ceiling[1]} ({{c}}).",
                        t=(t, "temperature"), c=(ceiling[0], "temperature")))
                else:
                    out.append(Note.fill("Raise the set point to {t} (the coldest room this unit still holds).",
                                         t=(t, "temperature")))
            if self.max_daily_intake is not None and self.max_daily_intake < self.daily_intake:
                if self.max_daily_intake > 0:
                    out.append(Note.fill("Or cut the intake to {m}/day at {t}.", m=(self.max_daily_intake, "mass"),
                                         t=(self.room_temperature, "temperature")))
                else:
                    out.append(Note.fill("Cutting the intake does not help: the unit falls short at {t} even "
                                         "with no product coming in.", t=(self.room_temperature, "temperature")))
        out.append(self.replacement_sentence("Or replace it with" if not self.holds else "A replacement needs"))
        return tuple(out)

    def replacement_sentence(self, leading: str = "Replace it with") -> Note:
        """"Replace it with a unit of Z kW at SST a / SCT b." """
        if self.replacement_condensing is None:
            return Note.fill(f"{leading} a unit of {{q}} at evaporating {{e}} (transcritical).",
                             q=(self.replacement_capacity, "power"), e=(self.replacement_evaporating, "temperature"))
        return Note.fill(f"{leading} a unit of {{q}} at SST {{e}} / SCT {{c}}.",
                         q=(self.replacement_capacity, "power"), e=(self.replacement_evaporating, "temperature"),
                         c=(self.replacement_condensing, "temperature"))

    def reason(self) -> Note:
        """The verdict's one-line reason."""
        if self.medium_at_low is not None:
            return Note("a medium-temperature unit asked for low-temperature suction")
        t = self.coldest_room_temperature_held
        if self.holds:
            if self.coldest_status == "holds_at_lowest":
                return Note("holds at every set point searched")
            return Note.fill("holds down to a set point of {t}", t=(t, "temperature"))  # type: ignore[arg-type]
        if t is None:
            return Note("no set point in the room range is held")
        return Note.fill("holds only at a set point of {t} or warmer", t=(t, "temperature"))

    def to_json(self) -> dict[str, Any]:
        """Keys added to the room's ``existing_unit`` object (SI, units in the names)."""
        return {
            "coldest_held_room_temperature_c": self.coldest_room_temperature_held,
            "coldest_held_room_temperature_status": self.coldest_status,
            "max_daily_intake_kg": self.max_daily_intake,
            "replacement_duty": {
                "capacity_w": self.replacement_capacity,
                "evaporating_temperature_c": self.replacement_evaporating,
                "condensing_temperature_c": self.replacement_condensing,
            },
            "medium_temperature_unit_at_low_suction": self.medium_at_low,
            "remedies": list(self.remedies()),
            "pulldown": self.pulldown.to_json() if self.pulldown is not None else None,
        }


def illinois(f: Callable[[float], float], a: float, b: float, fa: float, fb: float, tolerance: float) -> float:
    """A zero of *f* between *a* and *b* (fa, fb of opposite signs), to within *tolerance* in x.

    Regula falsi with the Illinois modification (Dowell & Jarratt 1971 [mem]); when f jumps
    (a discontinuity) it returns the end of the final bracket where f ≥ 0.

    Examples
    --------
    >>> round(illinois(lambda x: x * x - 2.0, 0.0, 2.0, -2.0, 2.0, 1e-9), 9)
    1.414213562
    """
    side = 0
    for _ in range(100):
        if abs(b - a) <= tolerance:
            break
        c = b - fb * (b - a) / (fb - fa) if fb != fa else 0.5 * (a + b)
        if not min(a, b) < c < max(a, b):
            c = 0.5 * (a + b)
        fc = f(c)
        if fc == 0.0:
            return c
        if (fc > 0) == (fb > 0):
            b, fb = c, fc
            if side == -1:
                fa /= 2.0
            side = -1
        else:
            a, fa = c, fc
            if side == 1:
                fb /= 2.0
            side = 1
        if abs(b - a) <= tolerance:
            break
    return a if fa >= 0 else b


def _bracket(
    f: Callable[[float], float], x0: float, f0: float, step: Optional[float], limit: float
) -> Optional[tuple[tuple[float, float], tuple[float, float]]]:
    """Two points around a sign change of *f*, stepping from *x0* towards *limit*.

    *step* None doubles x (x0 > 0) each time; 0.0 jumps straight to *limit*; else adds *step*.
    Returns None when *f* keeps the sign of *f0* up to *limit*.
    """
    x, fx = x0, f0
    while True:
        if step is None:
            nxt = min(2.0 * x, limit)
        elif step == 0.0:
            nxt = limit
        else:
            nxt = max(x + step, limit) if step < 0 else min(x + step, limit)
        if nxt == x:
            return None
        fn = f(nxt)
        if (fn >= 0) != (fx >= 0):
            return (x, fx), (nxt, fn)
        x, fx = nxt, fn


def at_room_temperature(model: "ProjectModel", index: int, temperature: float) -> "ProjectModel":
    """The project with room *index* set to *temperature* [°C] (products leave no colder than it)."""
    room = model.rooms[index]
    products = []
    for p in room.products:
        update: dict[str, Any] = {}
        if p.final_temperature is not None and p.final_temperature < temperature:
            update["final_temperature"] = temperature
            if p.entering_temperature is not None and p.entering_temperature < temperature:
                update["entering_temperature"] = temperature
        products.append(p.model_copy(update=update) if update else p)
    new_room = room.model_copy(update={"temperature": temperature, "products": products})
    rooms = list(model.rooms)
    rooms[index] = new_room
    return model.model_copy(update={"rooms": rooms})


def with_intake_scaled(model: "ProjectModel", index: int, factor: float) -> "ProjectModel":
    """The project with room *index*'s daily intake, its packaging and deliveries scaled by *factor*."""
    room = model.rooms[index]
    products = []
    for p in room.products:
        update: dict[str, Any] = {"daily_intake": p.daily_intake * factor}
        if p.packaging is not None:
            update["packaging"] = p.packaging.model_copy(update={"mass": p.packaging.mass * factor})
        products.append(p.model_copy(update=update))
    update_room: dict[str, Any] = {"products": products}
    if room.schedule is not None and room.schedule.deliveries is not None:
        deliveries = [d.model_copy(update={"mass": d.mass * factor}) for d in room.schedule.deliveries]
        if factor > 0:
            update_room["schedule"] = room.schedule.model_copy(update={"deliveries": deliveries})
        else:
            update_room["schedule"] = room.schedule.model_copy(update={"deliveries": None})
    rooms = list(model.rooms)
    rooms[index] = room.model_copy(update=update_room)
    return model.model_copy(update={"rooms": rooms})


def margin(model: "ProjectModel", index: int) -> float:
    """The check's margin (capacity at balance ÷ required − 1) [-].

    −1 when the unit has no capacity there, or when the changed room cannot be calculated
    at all (a set point the refrigerant or the property models do not reach): the search
    then treats it as a room the unit does not hold.
    """
    check = _check_or_none(model, index)
    if check is None or check.capacity_at_balance is None or check.margin_percent is None or check.not_suitable:
        return -1.0
    return check.margin_percent / 100.0


def _check_or_none(model: "ProjectModel", index: int) -> Any:
    from coldroom.design.existing import check_room
    from coldroom.errors import CalculationError

    try:
        return check_room(model, model.rooms[index], chart=False)
    except CalculationError:
        return None


def _unit_suction_floor(room: "Room") -> Optional[float]:
    """The unit's rating suction or envelope floor [°C]; ``None`` when it is not a medium-temperature unit."""
    from coldroom.rules import application_class_of_rating

    unit = room.existing_unit
    if unit is None:
        return None
    if unit.polynomial is not None:
        return unit.polynomial.suction_min
    if unit.rating_table is not None:
        return unit.rating_table.evaporating_temperatures[0]
    assert unit.rated_point is not None
    r = unit.rated_point
    if (r.application or application_class_of_rating(r.evaporating_temperature)) == "LT":
        return None  # declared (or rated as) a low-temperature unit
    return r.evaporating_temperature


def medium_at_low_message(room: "Room", design_evaporating: float) -> Optional[Note]:
    """The message when a medium-temperature unit is asked for low-temperature suction, else None.

    Parameters
    ----------
    room : Room
    design_evaporating : float
        The room's design SST [°C].
    """
    floor = _unit_suction_floor(room)
    if floor is None or floor < MT_SUCTION_FLOOR or design_evaporating >= LT_SUCTION_BELOW:
        return None
    unit = room.existing_unit
    assert unit is not None
    how = "rated at" if unit.rated_point is not None else "with an envelope down to"
    return Note(
        f"This is a medium-temperature unit ({how} SST ",
        Term(floor, "temperature", sep=""),
        ") asked to run at low-temperature suction (",
        Term(design_evaporating, "temperature", sep=""),
        "): its compressor is not built for that pressure ratio, discharge temperature and motor "
        "cooling, whatever the margin says.",
    )


def storage_ceiling(room: "Room") -> Optional[tuple[float, str]]:
    """The lowest highest-recommended storage temperature among the room's products [°C], and whose.

    From the product table (:mod:`coldroom.physics.products`); products given by composition only
    (no table entry) set none.
    """
    from coldroom.errors import ColdroomError
    from coldroom.physics.products import get_product

    found: Optional[tuple[float, str]] = None
    for item in room.products:
        name = getattr(item, "product", None)
        if not isinstance(name, str):
            continue
        try:
            product = get_product(name)
        except (ColdroomError, KeyError, ValueError):
            continue
        high = product.storage_temperature[1]
        if found is None or high < found[0]:
            found = (high, product.name)
    return found


#: Room air temperatures (above the set point) at which the existing unit's capacity is found for the
#: pull-down; linear in between [K].
PULLDOWN_OFFSETS = (0.0, 3.0, 8.0, 16.0)


def existing_unit_capacity(model: "ProjectModel", index: int) -> Callable[[float], float]:
    """Capacity at balance of the room's existing unit as the room air moves [W] of [°C].

    The check's own balance point (:func:`coldroom.design.existing.check_room`) with the room air at
    the set point plus :data:`PULLDOWN_OFFSETS` (and 2 K below), at the design condenser air;
    no balance or outside the envelope counts as no capacity. Linear in between.
    """
    t0 = model.rooms[index].temperature
    xs, ys = [], []
    for offset in (-2.0,) + PULLDOWN_OFFSETS:
        t = min(t0 + offset, SEARCH_HIGH)
        if xs and t <= xs[-1]:
            continue
        shifted = at_room_temperature(model, index, t)
        check = _check_or_none(shifted, index)
        xs.append(t)
        ys.append(0.0 if check is None or check.capacity_at_balance is None else check.capacity_at_balance)
    from coldroom.loads.pulldown import capacity_curve

    return capacity_curve(xs, ys)


def unit_limits(
    model: "ProjectModel", index: int, loads: "RoomLoads", holds: bool, pulldown: bool = False
) -> UnitLimits:
    """The three figures and the remedies for room *index* of *model* (which has an existing unit).

    Parameters
    ----------
    model : ProjectModel
    index : int
        Room index.
    loads : RoomLoads
        The room's loads at the project's conditions.
    holds : bool
        The check's verdict at the project's conditions.
    pulldown : bool
        Also simulate the pull-down after a delivery with this unit.
    """
    from coldroom.rules import room_design_temperatures

    room = model.rooms[index]
    temps = room_design_temperatures(model, room)

    # coldest room temperature held: step away from the set point until the sign changes, then narrow
    def f_temp(t: float) -> float:
        return margin(at_room_temperature(model, index, t), index)

    t0 = room.temperature
    f0 = f_temp(t0)
    coldest: Optional[float]
    step = -TEMPERATURE_STEP if f0 >= 0 else TEMPERATURE_STEP
    found = _bracket(f_temp, t0, f0, step, SEARCH_LOW if f0 >= 0 else SEARCH_HIGH)
    if found is None:
        coldest, status = (SEARCH_LOW, "holds_at_lowest") if f0 >= 0 else (None, "never")
    else:
        (a, fa), (b, fb) = found
        coldest, status = illinois(f_temp, a, b, fa, fb, TEMPERATURE_TOLERANCE), "found"

    # largest daily intake at the room's temperature: scale the intake until the margin changes sign
    intake = sum(p.daily_intake for p in room.products)
    largest: Optional[float] = None
    if intake > 0:

        def f_intake(k: float) -> float:
            return margin(with_intake_scaled(model, index, k), index)

        if f0 >= 0:
            found = _bracket(f_intake, 1.0, f0, None, INTAKE_LIMIT)
            if found is None:
                largest = INTAKE_LIMIT * intake
        else:
            found = _bracket(f_intake, 1.0, f0, 0.0, 0.0)
            if found is None:
                largest = 0.0
        if found is not None:
            (a, fa), (b, fb) = found
            largest = illinois(f_intake, a, b, fa, fb, INTAKE_TOLERANCE) * intake

    simulated = None
    if pulldown and intake > 0:
        from coldroom.loads.pulldown import room_pulldown

        unit = room.existing_unit
        assert unit is not None
        simulated = room_pulldown(
            model, room, existing_unit_capacity(model, index),
            f"existing unit {unit.name!r}: capacity at balance at the design condenser air as the room air moves",
            unit="existing",
        )
    return UnitLimits(
        storage_ceiling=storage_ceiling(room),
        pulldown=simulated,
        coldest_room_temperature_held=coldest,
        coldest_status=status,
        max_daily_intake=largest,
        daily_intake=intake,
        replacement_capacity=loads.design_capacity,
        replacement_evaporating=temps.evaporating_temperature,
        replacement_condensing=temps.condensing_temperature,
        room_temperature=t0,
        medium_at_low=medium_at_low_message(room, temps.evaporating_temperature),
        holds=holds,
    )
