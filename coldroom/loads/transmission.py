"""Transmission (conduction) heat gain through walls, ceiling and floor.

ASHRAE Handbook—Refrigeration, chapter "Refrigerated-Facility Loads",
"Transmission Load" [pub] [ref:ashrae-refrig-loads]:

    U = 1 / (1/h_i + Σ x/λ + 1/h_o)
    q = U · A · (t_o + Δt_sun − t_r)

Sign convention
---------------
:func:`surface_heat_gain` returns the heat flowing **into** the room, in W. It
is positive when the space beyond the surface is warmer than the room and
**negative** when it is colder (for example a cooler wall shared with a
freezer). The function does not clip: :func:`credited_heat_gain` decides
whether a negative gain is credited (a 24-hour average gain can only be
negative through surfaces facing colder spaces; conservative sizing counts
such a surface as 0 unless told otherwise).

Temperatures are in °C (only differences matter); areas in m², U in W/(m²·K).
"""

from __future__ import annotations

from typing import Iterable, Sequence

from coldroom.data.materials import sun_allowance_table
from coldroom.errors import CalculationError, finite as _finite

__all__ = [
    "u_value",
    "sun_allowance",
    "surface_heat_gain",
    "floor_on_grade_heat_gain",
    "heated_slab_floor_heat_gain",
    "credited_heat_gain",
]


def u_value(
    layers: Iterable[Sequence[float]],
    inside_film: float | None,
    outside_film: float | None,
) -> float:
    """Overall heat-transfer coefficient of a flat multilayer construction.

    U = 1 / (1/h_i + Σ x_j/λ_j + 1/h_o), ASHRAE Refrigeration, "Refrigerated-
    Facility Loads", transmission load [pub]. Thermal bridges (panel joints,
    fixings) are not included.

    Parameters
    ----------
    layers : iterable of (thickness, conductivity)
        Each layer's thickness [m] (> 0) and thermal conductivity [W/(m·K)] (> 0).
        May be empty (films only).
    inside_film : float or None
        Inside surface coefficient [W/(m²·K)], e.g. 9.37 still air; ``None`` for
        no film (surface in contact with a solid, e.g. a heated plane).
    outside_film : float or None
        Outside surface coefficient [W/(m²·K)], e.g. 34.1 for 24 km/h wind;
        ``None`` for a surface in contact with ground or a heated slab.

    Returns
    -------
    float
        U [W/(m²·K)].

    Raises
    ------
    CalculationError
        Non-positive thickness, conductivity or film coefficient, or no
        resistance at all.

    Examples
    --------
    100 mm polyurethane (0.025 W/mK), still air inside and outside:

    >>> round(u_value([(0.100, 0.025)], 9.37, 9.37), 4)
    0.2373
    """
    resistance = 0.0
    for i, layer in enumerate(layers):
        try:
            thickness, conductivity = layer
        except (TypeError, ValueError):
            raise CalculationError(f"layer {i} must be a (thickness, conductivity) pair, got {layer!r}") from None
        thickness = _finite(f"layer {i} thickness", thickness)
        conductivity = _finite(f"layer {i} conductivity", conductivity)
        if thickness <= 0.0:
            raise CalculationError(f"layer {i} thickness {thickness:g} m must be greater than 0")
        if conductivity <= 0.0:
            raise CalculationError(f"layer {i} conductivity {conductivity:g} W/(m·K) must be greater than 0")
        resistance += thickness / conductivity
    for name, film in (("inside film", inside_film), ("outside film", outside_film)):
        if film is None:
            continue
        film = _finite(name, film)
        if film <= 0.0:
            raise CalculationError(f"{name} coefficient {film:g} W/(m²·K) must be greater than 0")
        resistance += 1.0 / film
    if resistance <= 0.0:
        raise CalculationError("a construction needs at least one layer or surface film")
    return 1.0 / resistance


def sun_allowance(orientation: str, colour: str, hemisphere: str = "north") -> float:
    """Sun allowance added to the outdoor temperature of a sunlit surface [K].

    Table values of ASHRAE Refrigeration, "Refrigerated-Facility Loads",
    "Allowance for Sun Effect" [mem, verify], converted from °F; north and south
    swap in the southern hemisphere. Use 0 for shaded or interior surfaces.

    Parameters
    ----------
    orientation : str
        ``north``, ``east``, ``south``, ``west`` or ``roof``.
    colour : str
        ``dark``, ``medium`` or ``light``.
    hemisphere : str
        ``north`` or ``south``.

    Returns
    -------
    float
        Allowance [K].

    Examples
    --------
    >>> round(sun_allowance("west", "medium"), 3)
    3.333
    """
    return sun_allowance_table(orientation, colour, hemisphere)


def surface_heat_gain(
    area: float,
    u: float,
    outside_temperature: float,
    inside_temperature: float,
    sun_allowance: float = 0.0,
) -> float:
    """Heat gain through one surface, q = U·A·(t_o + Δt_sun − t_r).

    ASHRAE Refrigeration, "Refrigerated-Facility Loads", transmission load [pub].
    For a surface facing another space, ``outside_temperature`` is that
    space's temperature and the sun allowance is 0.

    Parameters
    ----------
    area : float
        Surface area [m²], >= 0.
    u : float
        Overall coefficient [W/(m²·K)], >= 0.
    outside_temperature : float
        Temperature beyond the surface [°C] (ambient, adjacent room, ground).
    inside_temperature : float
        Room temperature [°C].
    sun_allowance : float
        Added to the outside temperature [K], >= 0.

    Returns
    -------
    float
        Heat flow into the room [W]; negative when the space beyond is colder
        (see the module's sign convention; the caller decides whether to credit it).

    Examples
    --------
    >>> round(surface_heat_gain(10.0, 0.25, 30.0, 2.0, sun_allowance=2.0))
    75
    >>> surface_heat_gain(10.0, 0.25, -20.0, 2.0) < 0   # wall shared with a freezer
    True
    """
    area = _finite("area", area)
    u = _finite("U value", u)
    outside_temperature = _finite("outside temperature", outside_temperature)
    inside_temperature = _finite("inside temperature", inside_temperature)
    sun_allowance = _finite("sun allowance", sun_allowance)
    if area < 0.0:
        raise CalculationError(f"area {area:g} m² must not be negative")
    if u < 0.0:
        raise CalculationError(f"U value {u:g} W/(m²·K) must not be negative")
    if sun_allowance < 0.0:
        raise CalculationError(f"sun allowance {sun_allowance:g} K must not be negative")
    return u * area * (outside_temperature + sun_allowance - inside_temperature)


def floor_on_grade_heat_gain(area: float, u: float, ground_temperature: float, inside_temperature: float) -> float:
    """Heat gain through an unheated floor on grade.

    q = U·A·(t_ground − t_r) with the ground at its annual mean temperature,
    typically 10–15 °C [trade]. Build U with ``outside_film=None`` (the slab
    sits on the ground, no air film below).

    Parameters
    ----------
    area : float
        Floor area [m²].
    u : float
        U of the floor build-up, inside film to underside [W/(m²·K)].
    ground_temperature : float
        Ground temperature under the slab [°C].
    inside_temperature : float
        Room temperature [°C].

    Returns
    -------
    float
        Heat flow into the room [W].

    Examples
    --------
    >>> u = u_value([(0.1, 0.029), (0.15, 2.0)], 5.88, None)
    >>> round(floor_on_grade_heat_gain(20.0, u, 12.0, -20.0))
    173
    """
    return surface_heat_gain(area, u, ground_temperature, inside_temperature)


def heated_slab_floor_heat_gain(
    area: float, u_above_heated_plane: float, heated_plane_temperature: float, inside_temperature: float
) -> float:
    """Heat gain through a freezer floor laid over a heated (anti-frost-heave) slab.

    q = U'·A·(t_heated_plane − t_r), where U' counts only the layers between
    the heated plane and the room (insulation, topping, inside film; build it
    with ``outside_film=None``). The heated plane is designed at about 4–13 °C
    [trade]. **No double counting**: the heater's electrical power is NOT added
    as a load — the heat it sends upward is exactly this U'·ΔT flow, and the
    rest goes into the ground. Do not also count the floor-heater wattage as
    an internal load.

    Parameters
    ----------
    area : float
        Floor area [m²].
    u_above_heated_plane : float
        U from the heated plane to the room air [W/(m²·K)].
    heated_plane_temperature : float
        Controlled temperature of the heated plane [°C].
    inside_temperature : float
        Room temperature [°C].

    Returns
    -------
    float
        Heat flow into the room [W].

    Examples
    --------
    >>> u = u_value([(0.15, 0.029), (0.12, 2.0)], 5.88, None)
    >>> round(heated_slab_floor_heat_gain(50.0, u, 8.0, -25.0))
    305
    """
    return surface_heat_gain(area, u_above_heated_plane, heated_plane_temperature, inside_temperature)


def credited_heat_gain(heat_gain: float, credit: bool = False) -> float:
    """The part of a surface's heat gain that the room's load counts [W].

    Heat leaving the room to a colder neighbour (a negative gain) is not
    credited unless *credit* is true: the neighbour can be switched off,
    defrosting or emptied, and the room must still hold its temperature
    (common practice, no source [trade]). A positive gain always counts.

    Parameters
    ----------
    heat_gain : float
        Heat flow into the room through the surface [W] (negative: heat lost).
    credit : bool
        Count a negative gain as a credit.

    Returns
    -------
    float
        *heat_gain*, or 0 for an uncredited loss [W].

    Examples
    --------
    >>> credited_heat_gain(-120.0), credited_heat_gain(-120.0, credit=True), credited_heat_gain(80.0)
    (0.0, -120.0, 80.0)
    """
    heat_gain = _finite("heat gain", heat_gain)
    return heat_gain if credit or heat_gain >= 0.0 else 0.0
