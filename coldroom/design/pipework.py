"""One system's pipework and charge: lines, their drops fed back, charge and its limits.

Ties :mod:`coldroom.physics.line_sizing` and :mod:`coldroom.physics.charge` to a solved cycle and
the project's ``piping:`` and ``charge:`` blocks; :mod:`coldroom.design.sizing`
calls it per system. Pure apart from property look-ups.

Feeding the lines back into the cycle:

* the suction line's friction drop plus its static change (a vapour riser's
  head is small) lowers the compressor's suction pressure: it is handed to
  the cycle as a loss of saturation temperature at the evaporating pressure;
* the discharge line's drop raises the compressor's discharge pressure above
  the condensing pressure (a rise of saturation temperature at it);
* the liquid line's friction drop and the static head of its rise eat the
  subcooling: subcooling at the expansion valve = bubble temperature at the
  valve's inlet pressure − liquid temperature. At or below zero flash gas
  forms before the valve (warned); a downward liquid line gains pressure.

The cycle's enthalpies do not change through an adiabatic line (the valve
still receives h₃), so the mass flow, and with it the line sizes, stay as
computed from the cycle before feedback.
"""

from __future__ import annotations

from dataclasses import dataclass

from coldroom.physics import charge as charge_rules
from coldroom.physics.line_sizing import LINES, LineSpec, PipingResult, size_lines
from coldroom.results import Note


@dataclass(frozen=True)
class Pipework:
    """Pipework and charge of one system (SI).

    Attributes
    ----------
    piping : PipingResult or None
        The sized lines; ``None`` when the project gives no ``piping:`` block.
    suction_drop : float
        Suction-line loss fed to the cycle, as saturation temperature [K].
    discharge_drop : float
        Discharge-line loss fed to the cycle [K].
    valve_subcooling : float or None
        Subcooling left at the expansion valve [K]; ``None`` without a liquid line.
    valve_inlet_pressure : float or None
        Pressure at the expansion-valve inlet [Pa] (:func:`valve_inlet_pressure`);
        ``None`` without a liquid line. The sheet's p–h chart draws the state there.
    charge : ChargeEstimate
        The charge that counts: stated in the project file when given, else the estimate.
    limits : tuple of ChargeLimit
    room : str
        The room whose volume the limits use (the smallest member).
    room_volume : float
        Its inside volume [m³].
    occupancy, location : str
        EN 378-1 access category and location class used.
    defaults_used : tuple of str
        Which of occupancy / location class came from the conservative default.
    self_contained : bool
    warnings : tuple of Note
    """

    piping: PipingResult | None
    suction_drop: float
    discharge_drop: float
    valve_subcooling: float | None
    charge: charge_rules.ChargeEstimate
    limits: tuple[charge_rules.ChargeLimit, ...]
    room: str
    room_volume: float
    occupancy: str
    location: str
    defaults_used: tuple[str, ...]
    self_contained: bool
    warnings: tuple[Note, ...] = ()
    valve_inlet_pressure: float | None = None

    def to_json(self) -> dict:
        """The contract keys of a system: ``piping``, ``charge``, ``charge_limits`` (and their basis)."""
        piping = None if self.piping is None else self.piping.to_json()
        if piping is not None:
            piping["suction_drop_in_cycle_k"] = self.suction_drop
            piping["discharge_drop_in_cycle_k"] = self.discharge_drop
            piping["liquid_subcooling_at_valve_k"] = self.valve_subcooling
        return {
            "piping": piping,
            "charge": self.charge.to_json(),
            "charge_limits": [limit.to_json() for limit in self.limits],
            "charge_limit_basis": {
                "room": self.room,
                "room_volume_m3": self.room_volume,
                "occupancy_category": self.occupancy,
                "location_class": self.location,
                "defaults_used": list(self.defaults_used),
                "self_contained": self.self_contained,
            },
        }


def line_specs(piping_settings) -> tuple[LineSpec, ...]:
    """The :class:`LineSpec` of each line a project's ``piping:`` block describes.

    Parameters
    ----------
    piping_settings : coldroom.inputs.projectfile.Piping
        The block (SI values).
    """
    specs = []
    for line in LINES:
        run = getattr(piping_settings, line)
        if run is None:
            continue
        specs.append(
            LineSpec(
                line=line,
                length=run.length,
                rise=run.rise,
                fittings=tuple(sorted(run.fittings.items())),
                equivalent_length=run.equivalent_length,
                limit=run.limit,
            )
        )
    return tuple(specs)


def size_system_lines(cycle, piping_settings) -> PipingResult | None:
    """Size a system's lines from its cycle (before feedback).

    Parameters
    ----------
    cycle : coldroom.physics.cycle.CycleResult
    piping_settings : coldroom.inputs.projectfile.Piping or None
    """
    if piping_settings is None:
        return None
    specs = line_specs(piping_settings)
    if not specs:
        return None
    return size_lines(
        cycle.refrigerant,
        cycle.mass_flow,
        cycle.evaporator_outlet,
        cycle.states[2],
        cycle.states[1],
        specs,
        piping_settings.tube_series,
        minimum_load=piping_settings.minimum_load,
    )


def cycle_drops(cycle, piping: PipingResult | None) -> tuple[float, float]:
    """Suction and discharge losses to feed the cycle [K], friction plus static head, ≥ 0.

    Parameters
    ----------
    cycle : coldroom.physics.cycle.CycleResult
        The cycle the lines were sized on.
    piping : PipingResult or None
    """
    if piping is None:
        return 0.0, 0.0
    from coldroom.physics.refrigerant import get_fluid

    fluid = get_fluid(cycle.refrigerant)
    out = []
    for name, pressure in (("suction", cycle.evaporating_pressure), ("discharge", cycle.discharge_pressure)):
        line = piping.line(name)
        if line is None or cycle.transcritical and name == "discharge":
            out.append(0.0)
            continue
        change = max(0.0, line.total_pressure_change)
        out.append(fluid.dew_temperature(pressure) - fluid.dew_temperature(pressure - change) if change else 0.0)
    return out[0], out[1]


def valve_inlet_pressure(cycle, piping: PipingResult | None) -> float | None:
    """Pressure at the expansion-valve inlet after the liquid line [Pa].

    Condenser-outlet pressure − friction drop − ρ·g·rise (the line's total
    pressure change; a falling line gains pressure); ``None`` without a
    liquid line. The line is adiabatic: the liquid keeps the condenser-outlet
    enthalpy [mem] [ref:stoecker-jones].
    """
    line = None if piping is None else piping.line("liquid")
    if line is None:
        return None
    return cycle.states[2].p - line.total_pressure_change


def valve_subcooling(cycle, piping: PipingResult | None) -> float | None:
    """Subcooling at the expansion valve after the liquid line [K].

    Bubble temperature at :func:`valve_inlet_pressure` minus the liquid
    temperature; ``None`` without a liquid line.
    """
    pressure = valve_inlet_pressure(cycle, piping)
    if pressure is None:
        return None
    from coldroom.physics.refrigerant import get_fluid

    fluid = get_fluid(cycle.refrigerant)
    liquid = cycle.states[2]
    if pressure <= fluid.minimum_pressure:
        return float("-inf")
    if pressure >= fluid.critical_pressure:
        return None  # transcritical gas-cooler outlet: no bubble point
    return fluid.bubble_temperature(pressure) - liquid.t


def pipework(
    cycle,
    piping: PipingResult | None,
    charge_settings,
    room: str,
    room_volume: float,
    suction_drop: float,
    discharge_drop: float,
    subcooling_at_valve: float | None,
) -> Pipework:
    """Charge estimate and charge limits of a system, with its lines.

    Parameters
    ----------
    cycle : coldroom.physics.cycle.CycleResult
        The system's cycle (after feedback).
    piping : PipingResult or None
    charge_settings : coldroom.inputs.projectfile.ChargeSettings
        Volumes, occupancy, location class; fields left unset take the
        conservative defaults (category a, class I).
    room : str
        The member room whose volume the limits use.
    room_volume : float
        Its inside volume [m³].
    suction_drop, discharge_drop : float
        Losses fed to the cycle [K].
    subcooling_at_valve : float or None
        From :func:`valve_subcooling` [K].
    """
    from coldroom.data.refrigerants import lookup

    info = lookup(cycle.refrigerant)
    estimate = charge_rules.estimate_charge(
        cycle,
        piping,
        evaporator_volume=charge_settings.evaporator_volume,
        condenser_volume=charge_settings.condenser_volume,
        receiver_volume=charge_settings.receiver_volume,
        receiver_level=charge_settings.receiver_level,
    )
    # a stated charge (total or parts) wins over the estimate: the limits judge it, the sheet shows it
    estimate = charge_rules.stated_charge(estimate, charge_settings.total, charge_settings.parts)
    given = charge_settings.model_fields_set
    defaults = tuple(
        name for name, key in (("occupancy category", "occupancy"), ("location class", "location_class"))
        if key not in given
    )
    limits = charge_rules.charge_limits(
        info,
        estimate.total,
        room_volume,
        occupancy=charge_settings.occupancy,
        location=charge_settings.location_class,
        self_contained=charge_settings.self_contained,
    )
    warnings: list[Note] = []
    if subcooling_at_valve is not None and subcooling_at_valve <= 0.0:
        warnings.append(
            Note(
                "liquid line: its drop and rise use up all the subcooling - flash gas reaches the expansion "
                "valve; increase subcooling, enlarge the line or reduce the rise"
            )
        )
    elif subcooling_at_valve is not None and subcooling_at_valve < 1.0:
        warnings.append(
            Note.fill(
                "liquid line: only {s} of subcooling left at the expansion valve; flash gas is likely "
                "at part load or with a warmer liquid line",
                s=(subcooling_at_valve, "temperature_difference"),
            )
        )
    if piping is not None:
        for line in piping.lines:
            warnings.extend(line.warnings)
        if info.name == "R-744":
            warnings.append(
                Note(
                    "R-744: the standard copper walls of the tube tables are not rated for its pressures; use tube "
                    "rated for the design pressure (e.g. CuFe2P / K65 or steel) and check every wall [trade]"
                )
            )
    for limit in limits:
        if limit.verdict != charge_rules.WITHIN:
            warnings.append(
                Note.fill(
                    f"{'stated ' if estimate.stated else ''}charge {{m}} against {limit.rule}: {limit.verdict} "
                    "(limit {lim})",
                    m=(estimate.total, "mass"),
                    lim=(limit.limit or 0.0, "mass"),
                )
            )
    return Pipework(
        piping=piping,
        suction_drop=suction_drop,
        discharge_drop=discharge_drop,
        valve_subcooling=subcooling_at_valve,
        charge=estimate,
        limits=limits,
        room=room,
        room_volume=room_volume,
        occupancy=charge_settings.occupancy,
        location=charge_settings.location_class,
        defaults_used=defaults,
        self_contained=charge_settings.self_contained,
        warnings=tuple(warnings),
        valve_inlet_pressure=valve_inlet_pressure(cycle, piping),
    )
