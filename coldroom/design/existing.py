"""The project glue of the existing-unit check: a room's ``existing_unit`` → :class:`CheckResult`.

The only module of :mod:`coldroom.equipment` that reads the project model:
it builds the compressor model from the file's data, the heat exchangers
from the unit-cooler and condenser ratings (or the sizing TDs), and the
room's load at each condenser-air temperature, then calls
:func:`coldroom.equipment.verdict.check_unit`.
"""

from __future__ import annotations

from dataclasses import replace
from typing import TYPE_CHECKING, Callable, Optional

from coldroom.rules import room_design_temperatures
from coldroom.equipment.balance import HeatExchanger
from coldroom.equipment.compressors import Compressor, Envelope, OperatingConditions, PolynomialCompressor, RatedPointCompressor
from coldroom.equipment.verdict import CHART_AMBIENTS, CheckResult, check_unit
from coldroom.errors import CalculationError
from coldroom.results import inline_term as _n

if TYPE_CHECKING:  # pragma: no cover
    from coldroom.inputs.projectfile import ExistingUnit, ProjectModel, Refrigeration, Room
    from coldroom.results import RoomLoads

_POUND = 0.45359237  # kg, exact (1959 agreement)
_BTU_PER_HOUR = 1055.05585262 / 3600.0  # W per Btu/h, International Table Btu (NIST SP 811)


# --------------------------------------------------------------------------- project glue


def operating_conditions(refrigeration: "Refrigeration") -> OperatingConditions:
    """The project's superheats and subcooling for the existing unit."""
    return OperatingConditions(
        superheat=refrigeration.superheat,
        suction_line_superheat=refrigeration.suction_line_superheat,
        subcooling=refrigeration.subcooling,
    )


_CAPACITY_FACTORS = {"SI": 1.0, "IP": _BTU_PER_HOUR}  # W per unit of the capacity polynomial
_MASS_FLOW_FACTORS = {"SI": 1.0 / 3600.0, "IP": _POUND / 3600.0}  # kg/s per kg/h, per lb/h


def build_compressor(unit: "ExistingUnit", refrigeration: "Refrigeration") -> Compressor:
    """The compressor model of a project file's ``existing_unit`` (a rating table: the whole unit, read
    through a fixed condenser TD, see :mod:`coldroom.equipment.rating_table`).

    Polynomial units: ``SI`` = °C, W, W, kg/h; ``IP`` = °F, Btu/h, W, lb/h
    (AHRI 540 gives power in W in both [mem]).
    """
    from coldroom.data import refrigerants

    name = refrigerants.lookup(unit.refrigerant).name
    operating = operating_conditions(refrigeration)
    if unit.rated_point is not None:
        r = unit.rated_point
        return RatedPointCompressor.from_rating(
            name,
            r.capacity,
            r.evaporating_temperature,
            r.condensing_temperature,
            superheat=r.rating_superheat,
            subcooling=r.subcooling,
            power=r.power,
            swept_volume=r.swept_volume,
            clearance=refrigeration.clearance,
            isentropic_efficiency=refrigeration.isentropic_efficiency,
            operating=operating,
            application=r.application,
        )
    if unit.rating_table is not None:
        from coldroom.equipment.rating_table import RatingTableUnit
        from coldroom.rules import DEFAULT_CONDENSER_TD

        t = unit.rating_table
        return RatingTableUnit(
            refrigerant=name,
            evaporating_temperatures=tuple(t.evaporating_temperatures),
            ambient_temperatures=tuple(t.ambient_temperatures),
            capacity=tuple(tuple(row) for row in t.capacity),
            power=tuple(tuple(row) for row in t.power),
            condenser_td=refrigeration.condenser_td if refrigeration.condenser_td is not None else DEFAULT_CONDENSER_TD,
            operating=operating,
            rating_superheat=t.superheat,
            return_gas_temperature=t.return_gas_temperature,
            rating_subcooling=t.subcooling,
        )
    p = unit.polynomial
    assert p is not None
    return PolynomialCompressor(
        refrigerant=name,
        capacity_coefficients=tuple(p.capacity),
        power_coefficients=tuple(p.power),
        mass_flow_coefficients=tuple(p.mass_flow) if p.mass_flow is not None else None,
        temperature_unit="C" if p.units == "SI" else "F",
        capacity_factor=_CAPACITY_FACTORS[p.units],
        power_factor=1.0,
        mass_flow_factor=_MASS_FLOW_FACTORS[p.units],
        rating_superheat=p.superheat,
        return_gas_temperature=p.return_gas_temperature,
        rating_subcooling=p.subcooling,
        envelope=Envelope(p.suction_min, p.suction_max, p.discharge_min, p.discharge_max),
        density_correction_factor=p.density_correction_factor,
        operating=operating,
    )


def _shifted_model(model: "ProjectModel", shift: float) -> "ProjectModel":
    """The project with the outdoor air *shift* K warmer (humidity as RH)."""
    from coldroom.loads import outdoor_relative_humidity

    design = model.design.model_copy(
        update={
            "outdoor_temperature": model.design.outdoor_temperature + shift,
            "outdoor_rh": outdoor_relative_humidity(model.design),
            "outdoor_wet_bulb": None,
        }
    )
    return model.model_copy(update={"design": design})


def room_load_at(
    model: "ProjectModel", room: "Room", loads: "RoomLoads", ambient: float, figure: str = "required_capacity"
) -> Callable[[float], float]:
    """The room's required capacity [W] as a function of the condenser air [°C] (cached).

    At *ambient* (the design condenser air) it is ``loads.required_capacity``;
    elsewhere the outdoor air moves with the condenser air (:func:`_shifted_model`)
    and the room's loads are recomputed. *figure* names the :class:`RoomLoads`
    figure (``"design_capacity"`` for what ``size`` and ``select`` aim at).
    """
    from coldroom.loads import room_loads

    cache: dict[float, float] = {}
    index = model.rooms.index(room)

    def load_at(t: float) -> float:
        key = round(t, 6)
        if key not in cache:
            if abs(t - ambient) < 1e-9:
                cache[key] = getattr(loads, figure)
            else:
                shifted = _shifted_model(model, t - ambient)
                cache[key] = getattr(room_loads(shifted, shifted.rooms[index]), figure)
        return cache[key]

    return load_at


def check_room(
    model: "ProjectModel",
    room: "Room",
    loads: "Optional[RoomLoads]" = None,
    *,
    chart: bool = True,
    suction_drop: Optional[float] = None,
) -> Optional[CheckResult]:
    """Check the room's existing unit, if it has one (the single call sizing uses).

    The ambient is the condenser air (``refrigeration.condenser_air_temperature``,
    else the outdoor design dry bulb). For the chart and the maximum-ambient
    search the outdoor air moves with it (same shift; surfaces facing other
    spaces keep their temperatures; outdoor RH held) and the room load is
    recomputed at each ambient.

    Parameters
    ----------
    model : ProjectModel
    room : Room
    loads : RoomLoads, optional
        The room's loads at design (computed when not given).
    chart : bool
        Compute the chart arrays and the maximum ambient.
    suction_drop : float, optional
        The system's suction-line drop as saturation temperature [K] (the sized line's, as
        :func:`coldroom.design.sizing.design_system` finds it); default the given
        ``suction_line_drop``. The coil evaporates this much above the compressor's SST, so
        the balance is solved with the room air lowered by it (as ``select`` does).

    Returns
    -------
    CheckResult or None
        None when the room has no ``existing_unit``.

    Raises
    ------
    CalculationError
        The unit's data are inconsistent (message names the room).
    """
    unit = room.existing_unit
    if unit is None:
        return None
    from coldroom.data import refrigerants
    from coldroom.loads import room_loads

    if loads is None:
        loads = room_loads(model, room)
    r = model.refrigeration_for(room)
    temps = room_design_temperatures(model, room)
    try:
        compressor = build_compressor(unit, r)
    except CalculationError as exc:
        raise type(exc)(f"room {room.name!r}: existing unit {unit.name!r}: {exc}") from None
    drop = r.suction_line_drop if suction_drop is None else suction_drop
    if unit.unit_cooler is not None:
        evaporator = HeatExchanger.from_rating(
            unit.unit_cooler.capacity, unit.unit_cooler.dt1, "unit cooler (EN 328 DT1)" + drop_words(drop)
        )
    else:
        evaporator = HeatExchanger.fixed(
            temps.evaporator_td,
            (
                "no unit-cooler data: evaporating temperature fixed at room − ",
                _n(temps.evaporator_td, "temperature_difference"),
                f" ({temps.evaporator_td_source}); assumes the coil takes whatever the compressor pumps",
            ),
        )
    if unit.condenser is not None:
        condenser = HeatExchanger.from_rating(
            unit.condenser.heat_rejection, unit.condenser.temperature_difference, "air-cooled condenser"
        )
    else:
        condenser = HeatExchanger.fixed(
            temps.condenser_td,
            (
                "no condenser data: condensing temperature fixed at air + ",
                _n(temps.condenser_td, "temperature_difference"),
                f" ({temps.condenser_td_source})",
            ),
        )
    ambient = temps.condenser_air_temperature
    load_at = room_load_at(model, room, loads, ambient)
    design_suction = temps.evaporating_temperature - drop  # SST at the compressor

    result = check_unit(
        compressor,
        evaporator,
        condenser,
        room_temperature=room.temperature - drop,
        ambient_temperature=ambient,
        daily_energy=loads.daily_energy,
        safety_factor=loads.safety_factor,
        run_time=loads.run_time,
        peak_capacity=loads.peak_capacity,
        load_at_ambient=load_at,
        chart_ambients=CHART_AMBIENTS if chart else (),
        search_max_ambient=chart,
        name=unit.name,
        design_suction=design_suction,
    )
    if drop:
        result = replace(result, room_temperature=room.temperature)
    if compressor.refrigerant != refrigerants.lookup(r.refrigerant).name:
        result = replace(
            result,
            warnings=result.warnings
            + (
                f"the existing unit is given with {compressor.refrigerant} but the room's refrigeration block names "
                f"{refrigerants.lookup(r.refrigerant).name}; the check uses {compressor.refrigerant} (a retrofit to "
                "another refrigerant changes capacity: give the unit's data for the refrigerant it will run on)",
            ),
        )
    return result


def drop_words(drop: float) -> str:
    """How a coil's rating basis names the suction-line drop (nothing without one)."""
    return f", evaporating {drop:.2f} K above the compressor's SST (suction-line drop)" if drop else ""


def check_existing_units(
    model: "ProjectModel", suction_drops: Optional[dict[int, float]] = None
) -> tuple[tuple["RoomLoads", Optional[CheckResult]], ...]:
    """:func:`check_room` for every room, with its loads, in file order.

    *suction_drops* maps a room's index to its system's suction-line drop [K]
    (:func:`coldroom.design.sizing.existing_unit_checks` passes the designed ones); a room
    not in it takes the given ``suction_line_drop``.
    """
    from coldroom.loads import room_loads

    drops = suction_drops or {}
    out = []
    for i, room in enumerate(model.rooms):
        loads = room_loads(model, room)
        out.append((loads, check_room(model, room, loads, suction_drop=drops.get(i))))
    return tuple(out)
