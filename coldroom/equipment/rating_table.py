"""A condensing unit known by its rating table: capacity and power over SST × condenser air.

Supplier sheets of condensing units give capacity and power on a grid of
saturated suction temperature (dew, at the unit's suction) by ambient air
(the EN 13215 convention [mem] [ref:en-13215]). The grid rates the whole unit,
condenser included, so the condensing temperature is not an input; the
balance code (:mod:`coldroom.equipment.balance`) still works in (S, D): the
unit is paired with a fixed-TD condenser and reads the ambient back as
D − TD. The D it reports is that nominal condensing temperature (the
project's sizing condenser TD above the air), used only for the liquid's
enthalpy in the superheat/subcooling correction and for the discharge
temperature estimate.

* **Inside the grid** capacity and power are interpolated bilinearly
  (linear in SST, then linear in ambient; common practice, no source);
  grid points are reproduced exactly.
* **Outside the grid** the edge cell is extrapolated linearly and the point is
  flagged; beyond :data:`~coldroom.equipment.compressors.ENVELOPE_TOLERANCE`
  the unit counts as outside its envelope, like a polynomial.
* **Job superheat and subcooling.** The mass flow is the table's capacity over
  its refrigerating effect at the rating superheat and subcooling; the job's
  capacity is that mass flow times the job's effect, Q = Q_table·Δh_job/Δh_rating
  (refrigerating-effect ratio, as EN 12900/EN 13215 conversions between rating
  conditions [mem]); the power is kept.
"""

from __future__ import annotations

from dataclasses import dataclass
from typing import Optional, Sequence

from coldroom.equipment.compressors import (
    ENVELOPE_TOLERANCE,
    CompressorPoint,
    Envelope,
    OperatingConditions,
    OutsideEnvelopeError,
    _fluid,
    _liquid_state,
    _suction_state,
)
from coldroom.results import Note, Phrase
from coldroom.results import inline_term as _n


def _cell(values: Sequence[float], x: float) -> tuple[int, float]:
    """Index i of the cell [values[i], values[i+1]] for *x* (edge cells beyond the ends) and the fraction t."""
    i = 0
    while i < len(values) - 2 and x >= values[i + 1]:
        i += 1
    t = (x - values[i]) / (values[i + 1] - values[i])
    return i, t


def bilinear(
    columns: Sequence[float], rows: Sequence[float], table: Sequence[Sequence[float]], x: float, y: float
) -> float:
    """Bilinear interpolation of *table* (rows over *rows*, columns over *columns*) at (x, y).

    Written as a·(1 − t) + b·t so that a grid point returns its own value
    exactly (t = 0 or 1); beyond the grid the edge cell is extrapolated linearly.

    Examples
    --------
    >>> bilinear([0.0, 10.0], [20.0, 40.0], [[1.0, 2.0], [3.0, 4.0]], 5.0, 30.0)
    2.5
    >>> bilinear([0.0, 10.0], [20.0, 40.0], [[1.0, 2.0], [3.0, 4.0]], 10.0, 40.0)
    4.0
    """
    i, t = _cell(columns, x)
    j, u = _cell(rows, y)
    low = table[j][i] * (1.0 - t) + table[j][i + 1] * t
    high = table[j + 1][i] * (1.0 - t) + table[j + 1][i + 1] * t
    return low * (1.0 - u) + high * u


@dataclass(frozen=True)
class RatingTableUnit:
    """A condensing unit rated on a grid of SST × ambient (module notes).

    Attributes
    ----------
    refrigerant : str
    evaporating_temperatures, ambient_temperatures : tuple of float
        The grid [°C], rising.
    capacity, power : tuple of tuple of float
        Rows per ambient of columns per SST [W].
    condenser_td : float
        Nominal condensing temperature above the air [K] (module notes).
    rating_superheat : float or None
        [K] (None when a return-gas temperature is given).
    return_gas_temperature : float or None
        [°C].
    rating_subcooling : float
        [K].
    operating : OperatingConditions
    """

    refrigerant: str
    evaporating_temperatures: tuple[float, ...]
    ambient_temperatures: tuple[float, ...]
    capacity: tuple[tuple[float, ...], ...]
    power: tuple[tuple[float, ...], ...]
    condenser_td: float
    operating: OperatingConditions
    rating_superheat: Optional[float] = 10.0
    return_gas_temperature: Optional[float] = None
    rating_subcooling: float = 0.0
    model: str = "rating table"

    @property
    def envelope(self) -> Envelope:
        """The grid as an envelope in (S, nominal D) [°C]."""
        return Envelope(
            self.evaporating_temperatures[0],
            self.evaporating_temperatures[-1],
            self.ambient_temperatures[0] + self.condenser_td,
            self.ambient_temperatures[-1] + self.condenser_td,
        )

    @property
    def rating_suction(self) -> float:
        """The lowest SST of the grid [°C]."""
        return self.evaporating_temperatures[0]

    @property
    def notes(self) -> tuple[Phrase, ...]:
        rating: Phrase = (
            ("rating superheat ", _n(self.rating_superheat, "temperature_difference"))  # type: ignore[arg-type]
            if self.return_gas_temperature is None
            else ("rating return gas ", _n(self.return_gas_temperature, "temperature"))
        )
        return (
            ("rating table (EN 13215 convention): SST ", _n(self.evaporating_temperatures[0], "temperature"), " … ",
             _n(self.evaporating_temperatures[-1], "temperature"), " by ambient ",
             _n(self.ambient_temperatures[0], "temperature"), " … ", _n(self.ambient_temperatures[-1], "temperature"),
             "; ") + rating + (", subcooling ", _n(self.rating_subcooling, "temperature_difference")),
            ("interpolated bilinearly inside the grid; corrected to the job's superheat and subcooling by the "
             "refrigerating-effect ratio; condensing temperature shown as ambient + ",
             _n(self.condenser_td, "temperature_difference"), " (nominal: the table includes the condenser)"),
        )

    def table_values(self, suction_dew: float, ambient: float) -> tuple[float, float]:
        """The table's capacity and power [W] at SST *suction_dew* and *ambient* [°C] (rating conditions)."""
        s, a = self.evaporating_temperatures, self.ambient_temperatures
        return (bilinear(s, a, self.capacity, suction_dew, ambient), bilinear(s, a, self.power, suction_dew, ambient))

    def inside_grid(self, suction_dew: float, ambient: float) -> bool:
        s, a = self.evaporating_temperatures, self.ambient_temperatures
        return s[0] - 1e-9 <= suction_dew <= s[-1] + 1e-9 and a[0] - 1e-9 <= ambient <= a[-1] + 1e-9

    def performance(
        self, suction_dew: float, discharge_dew: float, *, check_envelope: bool = True, discharge: bool = True
    ) -> CompressorPoint:
        """Capacity, power and heat rejection at S and nominal D = ambient + TD [°C].

        Raises
        ------
        OutsideEnvelopeError
            When *check_envelope* and the point lies more than the tolerance outside the grid.
        """
        ambient = discharge_dew - self.condenser_td
        inside = self.envelope.contains(suction_dew, discharge_dew)
        if check_envelope and not inside:
            raise OutsideEnvelopeError(Note(
                "SST ", _n(suction_dew, "temperature"), " at ambient ", _n(ambient, "temperature"),
                " lies outside the unit's rating table: it is not extrapolated",
            ))
        table_capacity, power = self.table_values(suction_dew, ambient)
        fluid = _fluid(self.refrigerant)
        op = self.operating
        p_e = fluid.dew_pressure(suction_dew)
        p_c = fluid.dew_pressure(discharge_dew)
        if self.return_gas_temperature is not None:
            rated_superheat = max(self.return_gas_temperature - suction_dew, 0.0)
        else:
            rated_superheat = float(self.rating_superheat or 0.0)
        rated_effect = (
            _suction_state(fluid, p_e, suction_dew, rated_superheat).h
            - _liquid_state(fluid, p_c, self.rating_subcooling).h
        )
        mass_flow = table_capacity / rated_effect
        suction = _suction_state(fluid, p_e, suction_dew, op.total_superheat)
        outlet = suction if op.suction_line_superheat == 0 else _suction_state(fluid, p_e, suction_dew, op.superheat)
        liquid = _liquid_state(fluid, p_c, op.subcooling)
        capacity = mass_flow * (outlet.h - liquid.h)  # = Q_table·Δh_job/Δh_rating
        heat_rejection = mass_flow * (suction.h - liquid.h) + power
        t2 = None
        if discharge and mass_flow > 0 and power > 0:
            t2 = fluid.state_ph(p_c, suction.h + power / mass_flow).t
        return CompressorPoint(
            suction_dew, discharge_dew, capacity, power, mass_flow, heat_rejection, t2, p_c / p_e, inside
        )

    def flags(self, point: CompressorPoint) -> list[str]:
        """A warning when the balance point lies outside the grid (extrapolated or not rated)."""
        ambient = point.discharge_dew - self.condenser_td
        if self.inside_grid(point.suction_dew, ambient):
            return []
        how = (
            "extrapolated from the nearest cell (within the tolerance of "
            if point.within_envelope else "not rated: the unit is outside its rating table (tolerance "
        )
        return [Note(
            "the balance point SST ", _n(point.suction_dew, "temperature"), " at ambient ", _n(ambient, "temperature"),
            " lies outside the unit's rating table (SST ", _n(self.evaporating_temperatures[0], "temperature"), " … ",
            _n(self.evaporating_temperatures[-1], "temperature"), ", ambient ",
            _n(self.ambient_temperatures[0], "temperature"), " … ", _n(self.ambient_temperatures[-1], "temperature"),
            "): ", how, _n(ENVELOPE_TOLERANCE, "temperature_difference"), ")",
        )]
