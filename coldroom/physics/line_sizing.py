"""Refrigerant line sizing: suction, liquid and discharge lines of one system.

For each line the smallest standard copper tube (:mod:`coldroom.data.tubes`)
is chosen whose friction pressure drop, expressed as the drop in saturation
temperature it causes, stays within the line's limit. The module is pure:
plain numbers and :class:`~coldroom.physics.refrigerant.StatePoint` in, frozen
dataclasses out; ``fluids`` is imported only inside the functions that compute.

Method, with sources:

* Velocity V = ṁ/(ρA); Reynolds number Re = ρVD/μ.
* Darcy–Weisbach: Δp = (f·L/D + ΣK)·ρV²/2 (any pipe-flow text, e.g. Çengel &
  Cimbala, *Fluid Mechanics*, 1st ed., eq. 8-21 [mem] [ref:cengel-cimbala]). Friction factor
  f = 64/Re below Re = 2300, otherwise the explicit Serghides (1984)
  approximation of the Colebrook equation (Chem. Eng. 91 (5) 63–64, as
  implemented in ``fluids.friction.Serghides_1`` [pub]) [ref:serghides-1984] with the drawn-copper
  roughness 1.5 µm.
* Fittings: the Darby 3-K loss coefficients, K = K₁/Re + Kᵢ(1 + K_d/D^0.3)
  (Silverberg & Darby, Chem. Eng. 106 (7) 1999; ``fluids.fittings.Darby3K``
  and its published constants [pub]) [ref:darby-3k], with D the tube's inside diameter in
  inches in place of the nominal pipe size (copper tube has no NPS; [trade]
  approximation). Their equivalent length is ΣK·D/f.
* Saturation-temperature drop: dew temperature (vapour lines) or bubble
  temperature (liquid line) at the line's inlet pressure minus that at the
  inlet pressure less the friction drop. Above the critical pressure
  (transcritical R-744 discharge) the drop is converted with the slope of the
  dew line at 90 % of the critical pressure (common practice, no source).
* The vertical rise adds a static pressure change ρ·g·rise (negative for a
  drop), reported separately: it does not depend on the size and is fed back
  into the cycle with the friction drop, but the size is chosen on friction.
* Limits: suction 1 K, discharge 1 K, liquid 0.5 K of saturation temperature
  [trade] (handbook line-capacity tables are built on about 0.02–0.04 K per
  metre of equivalent length [mem]).
* Oil return in risers (suction and discharge lines with rise > 0): the
  minimum-entrainment criterion for upward annular oil flow, dimensionless
  gas velocity J* = V·√ρ_v / √(g·D·(ρ_oil − ρ_v)) ≥ 0.85 (Jacobs et al.,
  "Oil transport by refrigerant vapor", ASHRAE Trans. 82 (2) 1976, the basis
  of the "minimum refrigeration capacity for oil entrainment up risers"
  tables in ASHRAE Handbook — Refrigeration, ch. 1 "Halocarbon refrigeration
  systems" [mem] [ref:jacobs-1976] [ref:ashrae-refrig-halocarbon]; verify against
  the current edition), checked at the
  system's minimum load. Oil density 900 kg/m³ [trade]. Where the criterion
  cannot be evaluated (a supercritical line) the common floor of 5.1 m/s
  (1000 fpm) in risers is used instead [trade]. Horizontal vapour lines
  below 2.5 m/s (500 fpm) get an advisory [trade].
* Liquid velocity above 1.5 m/s (liquid hammer) and vapour velocity above 20 m/s
  (noise) get an advisory [trade].
"""

from __future__ import annotations

import math
from dataclasses import dataclass, field

from coldroom.constants import STANDARD_GRAVITY_M_S2
from coldroom.data import tubes as tube_data
from coldroom.errors import CalculationError
from coldroom.results import Note

LINES = ("suction", "liquid", "discharge")

#: Default line limits as a drop in saturation temperature [K] [trade].
DEFAULT_LIMITS = {"suction": 1.0, "liquid": 0.5, "discharge": 1.0}

#: Fitting kinds a project may name → the Darby 3-K entry used (``fluids``).
FITTINGS: dict[str, str] = {
    "elbow_90": "Elbow, 90°, flanged, welded, bends, (r/D = 1)",
    "long_elbow_90": "Elbow, 90°, (r/D = 2)",
    "elbow_45": "Elbow, 45°, long radius, (r/D = 1.5)",
    "return_bend": "Elbow, 180°, all, (r/D = 1.5)",
    "tee_run": "Tee, Run-through, flanged, (r/D = 1)",
    "tee_branch": "Tee, Through-branch, (as elbow), flanged, (r/D = 1)",
    "ball_valve": "Valve, Ball valve, standard, β = 1",
    "globe_valve": "Valve, Globe valve, standard, β = 1",
    "angle_valve": "Valve, Angle valve, 90°, full line size, β = 1",
    "check_valve": "Valve, Lift check",
}

LAMINAR_LIMIT = 2300.0  # Re [pub, any pipe-flow text]
#: J* for the minimum-entrainment criterion [mem] (see module docstring).
ENTRAINMENT_J_STAR = 0.85
#: Density of the compressor oil film [kg/m³] [trade].
OIL_DENSITY = 900.0
#: Velocity floor in vapour risers where the criterion does not apply [m/s] [trade].
RISER_VELOCITY_FLOOR = 5.1
#: Advisory floor in horizontal vapour lines [m/s] [trade].
HORIZONTAL_VELOCITY_FLOOR = 2.5
#: Advisory ceiling in liquid lines [m/s] [trade].
LIQUID_VELOCITY_CEILING = 1.5
#: Advisory ceiling in vapour lines (noise) [m/s] [trade].
VAPOUR_VELOCITY_CEILING = 20.0

ENTRAINMENT_SOURCE = (
    "minimum entrainment J* >= 0.85, Jacobs et al. 1976 / ASHRAE Handbook - Refrigeration ch. 1 [mem]; "
    "verify against the current edition"
)
FLOOR_SOURCE = "riser velocity floor 5.1 m/s (1000 fpm) [trade]"


@dataclass(frozen=True)
class LineSpec:
    """What the project says about one line (SI).

    Attributes
    ----------
    line : str
        ``"suction"``, ``"liquid"`` or ``"discharge"``.
    length : float
        Run length [m].
    rise : float
        Vertical rise in the flow direction [m]; negative for a drop.
    fittings : tuple of (str, int)
        Fitting kind (a key of :data:`FITTINGS`) and count.
    equivalent_length : float or None
        Total equivalent length including fittings [m]; when given, the
        fittings are not counted again.
    limit : float or None
        Limit as a drop in saturation temperature [K]; ``None`` for the default.
    """

    line: str
    length: float
    rise: float = 0.0
    fittings: tuple[tuple[str, int], ...] = ()
    equivalent_length: float | None = None
    limit: float | None = None

    def __post_init__(self) -> None:
        if self.line not in LINES:
            raise ValueError(f"line must be one of {LINES}, not {self.line!r}")
        for kind, count in self.fittings:
            if kind not in FITTINGS:
                raise ValueError(f"unknown fitting {kind!r}; known: {', '.join(FITTINGS)}")
            if count < 0:
                raise ValueError(f"fitting count must be >= 0, not {count}")
        if not (math.isfinite(self.length) and self.length > 0.0):
            raise ValueError(f"length must be > 0 m, not {self.length}")
        if abs(self.rise) > self.length:
            raise ValueError(f"rise {self.rise} m is longer than the run {self.length} m")

    @property
    def limit_k(self) -> float:
        """The limit in force [K]."""
        return DEFAULT_LIMITS[self.line] if self.limit is None else self.limit


@dataclass(frozen=True)
class LineDrop:
    """One line in one tube size (SI).

    Attributes
    ----------
    tube : Tube
    velocity : float
        Mean velocity at the design flow [m/s].
    reynolds : float
        Reynolds number [1].
    friction_factor : float
        Darcy friction factor [1].
    fittings_k : float
        Sum of the fitting loss coefficients [1].
    equivalent_length : float
        Run plus fittings as equivalent length [m].
    pressure_drop : float
        Friction and fittings pressure drop [Pa].
    static_pressure_change : float
        ρ·g·rise [Pa]: a loss for a rise, a gain (negative) for a drop.
    saturation_temperature_drop : float
        The friction drop as a saturation-temperature drop [K].
    """

    tube: tube_data.Tube
    velocity: float
    reynolds: float
    friction_factor: float
    fittings_k: float
    equivalent_length: float
    pressure_drop: float
    static_pressure_change: float
    saturation_temperature_drop: float


@dataclass(frozen=True)
class LineResult:
    """A sized line.

    Attributes
    ----------
    line : str
    spec : LineSpec
    chosen : LineDrop
        The smallest standard size within the limit (the largest size when
        none is).
    next_smaller : LineDrop or None
        The next smaller standard size, for comparison; ``None`` when the
        chosen size is the smallest of the series.
    limit : float
        Limit in force [K].
    within_limit : bool
    oil_return_ok : bool or None
        Risers of vapour lines only; ``None`` where it does not apply.
    oil_minimum_velocity : float or None
        Velocity needed to carry oil up the riser [m/s].
    oil_check_velocity : float or None
        Velocity at the minimum load [m/s].
    oil_basis : str or None
        The criterion used (entrainment or the velocity floor).
    density : float
        Refrigerant density in the line [kg/m³].
    viscosity : float
        Dynamic viscosity [Pa·s].
    viscosity_basis : str
        ``"CoolProp"`` or the approximation used for a blend.
    warnings : tuple of Note
    """

    line: str
    spec: LineSpec
    chosen: LineDrop
    next_smaller: LineDrop | None
    limit: float
    within_limit: bool
    oil_return_ok: bool | None
    oil_minimum_velocity: float | None
    oil_check_velocity: float | None
    oil_basis: str | None
    density: float
    viscosity: float
    viscosity_basis: str
    warnings: tuple[Note, ...] = ()

    @property
    def total_pressure_change(self) -> float:
        """Friction drop plus static change [Pa] (what the cycle sees)."""
        return self.chosen.pressure_drop + self.chosen.static_pressure_change

    def to_json(self) -> dict:
        """The contract keys of a line (issue: piping lines), SI with units in names."""
        chosen, smaller = self.chosen, self.next_smaller
        return {
            "line": self.line,
            "tube": chosen.tube.label,
            "outside_diameter_mm": chosen.tube.outside_diameter * 1e3,
            "inside_diameter_mm": chosen.tube.inside_diameter * 1e3,
            "length_m": self.spec.length,
            "rise_m": self.spec.rise,
            "equivalent_length_m": chosen.equivalent_length,
            "velocity_m_s": chosen.velocity,
            "pressure_drop_pa": chosen.pressure_drop,
            "static_pressure_change_pa": chosen.static_pressure_change,
            "saturation_temperature_drop_k": chosen.saturation_temperature_drop,
            "limit_k": self.limit,
            "within_limit": self.within_limit,
            "oil_return_ok": self.oil_return_ok,
            "oil_minimum_velocity_m_s": self.oil_minimum_velocity,
            "next_smaller_outside_diameter_mm": None if smaller is None else smaller.tube.outside_diameter * 1e3,
            "next_smaller_saturation_temperature_drop_k": None if smaller is None else smaller.saturation_temperature_drop,
            "viscosity_basis": self.viscosity_basis,
            "warnings": [str(w) for w in self.warnings],
        }


@dataclass(frozen=True)
class PipingResult:
    """The three lines of a system.

    Attributes
    ----------
    tube_series : str
    lines : tuple of LineResult
        In the order given (suction, liquid, discharge where present).
    minimum_load : float
        Fraction of the design mass flow at which oil return is checked [1].
    """

    tube_series: str
    lines: tuple[LineResult, ...]
    minimum_load: float
    notes: tuple[str, ...] = field(default=())

    def line(self, name: str) -> LineResult | None:
        """The result for one line, or ``None`` when the project has no such line."""
        for result in self.lines:
            if result.line == name:
                return result
        return None

    def to_json(self) -> dict:
        """The ``piping`` object of a system (contract keys)."""
        return {
            "tube_series": self.tube_series,
            "minimum_load_fraction": self.minimum_load,
            "lines": [line.to_json() for line in self.lines],
            "notes": list(self.notes),
        }


# ---------------------------------------------------------------------- core
def friction_factor(reynolds: float, relative_roughness: float) -> float:
    """Darcy friction factor: 64/Re laminar, Serghides (1984) explicit above.

    Parameters
    ----------
    reynolds : float
        Reynolds number [1], > 0.
    relative_roughness : float
        Roughness over inside diameter [1].

    Returns
    -------
    float
        Darcy friction factor [1].

    Examples
    --------
    >>> round(friction_factor(1000.0, 0.0), 3)
    0.064
    >>> round(friction_factor(1e5, 0.0), 4)       # smooth: Colebrook gives 0.0180
    0.018
    """
    if reynolds < LAMINAR_LIMIT:
        return 64.0 / reynolds
    from fluids.friction import Serghides_1

    return float(Serghides_1(reynolds, relative_roughness))


def fitting_k(kind: str, inside_diameter: float, reynolds: float) -> float:
    """Loss coefficient of one fitting (Darby 3-K) [1].

    Parameters
    ----------
    kind : str
        A key of :data:`FITTINGS`.
    inside_diameter : float
        Tube inside diameter [m].
    reynolds : float
        Reynolds number in the tube [1].
    """
    from fluids.fittings import Darby3K

    return float(Darby3K(NPS=inside_diameter / tube_data.INCH, Re=reynolds, name=FITTINGS[kind]))


def line_drop(
    tube: tube_data.Tube,
    spec: LineSpec,
    mass_flow: float,
    density: float,
    viscosity: float,
    saturation_temperature_drop,
    roughness: float = tube_data.COPPER_ROUGHNESS,
) -> LineDrop:
    """Pressure drop of one line in one tube size.

    Parameters
    ----------
    tube : Tube
        The tube size.
    spec : LineSpec
        Length, rise, fittings or equivalent length.
    mass_flow : float
        Refrigerant mass flow [kg/s], > 0.
    density : float
        Refrigerant density [kg/m³].
    viscosity : float
        Dynamic viscosity [Pa·s].
    saturation_temperature_drop : callable
        Pressure drop [Pa] → saturation-temperature drop [K].
    roughness : float
        Absolute wall roughness [m]; drawn copper by default.

    Returns
    -------
    LineDrop
    """
    diameter = tube.inside_diameter
    velocity = mass_flow / (density * tube.flow_area)
    reynolds = density * velocity * diameter / viscosity
    f = friction_factor(reynolds, roughness / diameter)
    if spec.equivalent_length is not None:
        k_sum = 0.0
        equivalent_length = spec.equivalent_length
    else:
        k_sum = sum(count * fitting_k(kind, diameter, reynolds) for kind, count in spec.fittings)
        equivalent_length = spec.length + k_sum * diameter / f
    dynamic = 0.5 * density * velocity**2
    drop = f * equivalent_length / diameter * dynamic
    return LineDrop(
        tube=tube,
        velocity=velocity,
        reynolds=reynolds,
        friction_factor=f,
        fittings_k=k_sum,
        equivalent_length=equivalent_length,
        pressure_drop=drop,
        static_pressure_change=density * STANDARD_GRAVITY_M_S2 * spec.rise,
        saturation_temperature_drop=saturation_temperature_drop(drop),
    )


def entrainment_velocity(inside_diameter: float, vapour_density: float, oil_density: float = OIL_DENSITY) -> float:
    """Minimum vapour velocity that carries oil up a riser [m/s].

    V_min = J*·√(g·D·(ρ_oil − ρ_v)/ρ_v) with J* = 0.85 (see module docstring).

    Parameters
    ----------
    inside_diameter : float
        Riser inside diameter [m].
    vapour_density : float
        Vapour density [kg/m³].
    oil_density : float
        Oil density [kg/m³].

    Examples
    --------
    >>> round(entrainment_velocity(0.026, 10.0), 2)   # 28 mm tube, suction vapour
    4.05
    """
    return ENTRAINMENT_J_STAR * math.sqrt(STANDARD_GRAVITY_M_S2 * inside_diameter * (oil_density - vapour_density) / vapour_density)


def size_line(
    spec: LineSpec,
    tube_series: str,
    mass_flow: float,
    density: float,
    viscosity: float,
    saturation_temperature_drop,
    minimum_load: float = 1.0,
    supercritical: bool = False,
    viscosity_basis: str = "CoolProp",
) -> LineResult:
    """Choose the smallest standard size within the line's limit.

    Parameters
    ----------
    spec : LineSpec
    tube_series : str
        ``"EN 12735-1"`` or ``"ASTM B280"``.
    mass_flow : float
        Design mass flow [kg/s], > 0.
    density : float
        Refrigerant density in the line [kg/m³].
    viscosity : float
        Dynamic viscosity [Pa·s].
    saturation_temperature_drop : callable
        Pressure drop [Pa] → saturation-temperature drop [K], non-decreasing.
    minimum_load : float
        Fraction of the design mass flow at minimum load [1], 0 < x ≤ 1.
    supercritical : bool
        The line runs above the critical pressure (oil check by velocity floor).
    viscosity_basis : str
        Where the viscosity came from.

    Returns
    -------
    LineResult
    """
    if not (mass_flow > 0.0 and math.isfinite(mass_flow)):
        raise CalculationError(f"{spec.line} line: mass flow must be > 0 kg/s, not {mass_flow}")
    if not (0.0 < minimum_load <= 1.0):
        raise CalculationError(f"minimum load fraction must be in (0, 1], not {minimum_load}")
    sizes = tube_data.series(tube_series)
    previous: LineDrop | None = None
    chosen: LineDrop | None = None
    for tube in sizes:
        drop = line_drop(tube, spec, mass_flow, density, viscosity, saturation_temperature_drop)
        if drop.saturation_temperature_drop <= spec.limit_k:
            chosen = drop
            break
        previous = drop
    within = chosen is not None
    warnings: list[Note] = []
    if chosen is None:
        chosen, previous = previous, None
        if len(sizes) > 1:
            previous = line_drop(sizes[-2], spec, mass_flow, density, viscosity, saturation_temperature_drop)
        warnings.append(
            Note.fill(
                f"{spec.line} line: no {tube_series} size keeps the drop within {{limit}}; "
                f"the largest ({chosen.tube.label}) gives {{drop}}: run parallel lines or shorten the run",
                limit=(spec.limit_k, "temperature_difference"),
                drop=(chosen.saturation_temperature_drop, "temperature_difference"),
            )
        )
    oil_ok = oil_min = oil_v = oil_basis = None
    if spec.line != "liquid" and chosen.velocity > VAPOUR_VELOCITY_CEILING:
        warnings.append(
            Note.fill(
                f"{spec.line} line: {{v}} is above the usual {{vmax}} (noise, vibration) [trade]",
                v=(chosen.velocity, "velocity"),
                vmax=(VAPOUR_VELOCITY_CEILING, "velocity"),
            )
        )
    if spec.line != "liquid":
        check_velocity = chosen.velocity * minimum_load
        if spec.rise > 0.0:
            oil_v = check_velocity
            if supercritical:
                oil_min, oil_basis = RISER_VELOCITY_FLOOR, FLOOR_SOURCE
            else:
                oil_min, oil_basis = entrainment_velocity(chosen.tube.inside_diameter, density), ENTRAINMENT_SOURCE
            oil_ok = check_velocity >= oil_min
            if not oil_ok:
                warnings.append(
                    Note.fill(
                        f"{spec.line} riser: {{v}} at minimum load is below the {{vmin}} needed to carry oil up: "
                        "use a smaller riser (double riser or oil trap at its foot)",
                        v=(check_velocity, "velocity"),
                        vmin=(oil_min, "velocity"),
                    )
                )
        elif check_velocity < HORIZONTAL_VELOCITY_FLOOR:
            warnings.append(
                Note.fill(
                    f"{spec.line} line: {{v}} at minimum load is below the usual {{vmin}} for oil "
                    "along horizontal runs [trade]: pitch the line towards the compressor",
                    v=(check_velocity, "velocity"),
                    vmin=(HORIZONTAL_VELOCITY_FLOOR, "velocity"),
                )
            )
    elif chosen.velocity > LIQUID_VELOCITY_CEILING:
        warnings.append(
            Note.fill(
                "liquid line: {v} is above the usual {vmax} (liquid hammer when the solenoid closes) [trade]",
                v=(chosen.velocity, "velocity"),
                vmax=(LIQUID_VELOCITY_CEILING, "velocity"),
            )
        )
    return LineResult(
        line=spec.line,
        spec=spec,
        chosen=chosen,
        next_smaller=previous,
        limit=spec.limit_k,
        within_limit=within,
        oil_return_ok=oil_ok,
        oil_minimum_velocity=oil_min,
        oil_check_velocity=oil_v,
        oil_basis=oil_basis,
        density=density,
        viscosity=viscosity,
        viscosity_basis=viscosity_basis,
        warnings=tuple(warnings),
    )


def _saturation_drop(fluid, inlet_pressure: float, side: str):
    """Pressure drop [Pa] → saturation-temperature drop [K] at *inlet_pressure*.

    *side* is ``"dew"`` or ``"bubble"``. Above 99.5 % of the critical pressure
    the slope of the dew line at 90 % of it converts the drop (see module
    docstring).
    """
    if inlet_pressure >= 0.95 * fluid.critical_pressure:
        p_ref = 0.9 * fluid.critical_pressure
        slope = (fluid.dew_temperature(p_ref) - fluid.dew_temperature(0.98 * p_ref)) / (0.02 * p_ref)
        return lambda drop: drop * slope
    temperature = fluid.dew_temperature if side == "dew" else fluid.bubble_temperature
    t_in = temperature(inlet_pressure)
    floor = fluid.minimum_pressure * 1.001

    def convert(drop: float) -> float:
        outlet = inlet_pressure - drop
        if outlet <= floor:
            return math.inf
        return t_in - temperature(outlet)

    return convert


def size_lines(
    refrigerant: str,
    mass_flow: float,
    suction_state,
    liquid_state,
    discharge_state,
    specs: tuple[LineSpec, ...],
    tube_series: str,
    minimum_load: float = 1.0,
) -> PipingResult:
    """Size the given lines of one system.

    Parameters
    ----------
    refrigerant : str
        Catalogue name.
    mass_flow : float
        Design refrigerant mass flow [kg/s].
    suction_state : StatePoint
        Vapour leaving the evaporator (suction-line inlet) [Pa, °C].
    liquid_state : StatePoint
        Liquid leaving the condenser or receiver (liquid-line inlet).
    discharge_state : StatePoint
        Compressor discharge (discharge-line inlet).
    specs : tuple of LineSpec
        The lines the project describes.
    tube_series : str
        ``"EN 12735-1"`` or ``"ASTM B280"``.
    minimum_load : float
        Minimum-load fraction of the design mass flow for the oil check [1].

    Returns
    -------
    PipingResult

    Examples
    --------
    >>> from coldroom.physics.cycle import solve_cycle
    >>> c = solve_cycle("R-134a", -10.0, 40.0, 5000.0)
    >>> r = size_lines("R-134a", c.mass_flow, c.evaporator_outlet, c.states[2], c.states[1],
    ...                (LineSpec("suction", 15.0),), "EN 12735-1")
    >>> r.lines[0].chosen.tube.label
    '22 x 1.0 mm'
    """
    from coldroom.physics.refrigerant import get_fluid

    fluid = get_fluid(refrigerant)
    inlet = {"suction": (suction_state, "vapour", "dew"), "liquid": (liquid_state, "liquid", "bubble"),
             "discharge": (discharge_state, "vapour", "dew")}
    results = []
    bases = []
    for spec in specs:
        state, phase, side = inlet[spec.line]
        viscosity, basis = fluid.viscosity(state, phase)
        if basis not in bases:
            bases.append(basis)
        results.append(
            size_line(
                spec,
                tube_series,
                mass_flow,
                state.density,
                viscosity,
                _saturation_drop(fluid, state.p, side),
                minimum_load=minimum_load,
                supercritical=state.p >= fluid.critical_pressure,
                viscosity_basis=basis,
            )
        )
    notes = tuple(f"viscosity: {b}" for b in bases if b != "CoolProp")
    return PipingResult(tube_series=tube_data.series(tube_series) and _canonical(tube_series),
                        lines=tuple(results), minimum_load=minimum_load, notes=notes)


def _canonical(tube_series: str) -> str:
    key = "".join(ch for ch in tube_series.upper() if ch.isalnum())
    for name in tube_data.names():
        if "".join(ch for ch in name.upper() if ch.isalnum()) == key:
            return name
    return tube_series
