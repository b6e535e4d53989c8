"""Building-physics data for transmission loads: conductivities, surface films, sun allowance.

Every entry carries a source key from :data:`SOURCES`; each source names its
entry in docs/references.md. Tags: ``[pub]`` checked in a published source,
``[mem]`` recalled (verify), ``[trade]`` common practice without a single source.

Look-ups go through :class:`coldroom.registry.Registry` (exact after
:func:`coldroom.registry.normalise`; an unknown name raises
:class:`coldroom.errors.LookupNameError` listing the closest valid names;
nothing is guessed).
"""

from __future__ import annotations

from dataclasses import dataclass
from types import MappingProxyType
from typing import Mapping

from coldroom.registry import Registry

__all__ = [
    "SOURCES",
    "Material",
    "MATERIALS",
    "SurfaceFilm",
    "SURFACE_FILMS",
    "SUN_ALLOWANCE_F",
    "SUN_ALLOWANCE_SOURCE",
    "ORIENTATIONS",
    "COLOURS",
    "HEMISPHERES",
    "material",
    "conductivity",
    "surface_film",
    "film_coefficient",
    "sun_allowance_table",
]

SOURCES: Mapping[str, str] = MappingProxyType(
    {
        "ashrae-refrig-si-tables": (
            "[pub] ASHRAE-derived SI tables for refrigerated facilities (insulation conductivities, "
            "film coefficients); ASHRAE Handbook—Refrigeration, chapter 'Refrigerated-Facility Loads' "
            "[ref:ashrae-refrig-loads]"
        ),
        "trade-panel": "[trade] aged PUR/PIR sandwich-panel design conductivity, common practice, no source",
        "iso6946-mem": "[mem] ISO 6946 conventional surface resistances; from memory, verify [ref:iso-6946]",
        "iso10456-mem": "[mem] ISO 10456 design values of building materials; from memory, verify [ref:iso-10456]",
        "ashrae-sun-mem": (
            "[mem] ASHRAE Handbook—Refrigeration, 'Refrigerated-Facility Loads', table 'Allowance for "
            "Sun Effect' (°F added to outdoor temperature); from memory, verify [ref:ashrae-refrig-loads]"
        ),
    }
)



@dataclass(frozen=True)
class Material:
    """A layer material.

    Attributes
    ----------
    name : str
        Table key (normalised).
    conductivity : float
        Design thermal conductivity [W/(m·K)].
    source : str
        Key into :data:`SOURCES`.
    note : str
        Short description.
    """

    name: str
    conductivity: float
    source: str
    note: str = ""


def _materials(*rows: tuple[str, float, str, str]) -> Mapping[str, Material]:
    return MappingProxyType({name: Material(name, k, src, note) for name, k, src, note in rows})


MATERIALS: Mapping[str, Material] = _materials(
    # Insulation, ASHRAE-derived SI tables [pub].
    ("polyurethane", 0.025, "ashrae-refrig-si-tables", "polyurethane foam, board or foamed in place"),
    ("extruded_polystyrene", 0.029, "ashrae-refrig-si-tables", "XPS board"),
    ("expanded_polystyrene", 0.036, "ashrae-refrig-si-tables", "EPS board (bead board)"),
    ("glass_fibre", 0.036, "ashrae-refrig-si-tables", "glass-fibre board or batt"),
    ("cork", 0.043, "ashrae-refrig-si-tables", "corkboard"),
    ("cellular_glass", 0.058, "ashrae-refrig-si-tables", "cellular (foam) glass block, load-bearing floors"),
    # Aged sandwich-panel cores [trade]; panel makers quote 0.022-0.023 W/mK aged.
    ("pur_panel", 0.023, "trade-panel", "aged polyurethane core of a sandwich panel"),
    ("pir_panel", 0.022, "trade-panel", "aged polyisocyanurate core of a sandwich panel"),
    # Structure and finishes, ISO 10456 design values [mem].
    ("concrete", 2.0, "iso10456-mem", "normal-weight concrete, about 2400 kg/m3, unreinforced"),
    ("reinforced_concrete", 2.3, "iso10456-mem", "reinforced concrete (1 % steel)"),
    ("screed", 1.4, "iso10456-mem", "sand-cement screed / topping"),
    ("steel", 50.0, "iso10456-mem", "carbon steel, e.g. panel skin"),
    ("stainless_steel", 17.0, "iso10456-mem", "austenitic stainless steel"),
    ("aluminium", 160.0, "iso10456-mem", "aluminium alloy"),
    ("plywood", 0.13, "iso10456-mem", "plywood, about 500 kg/m3"),
    ("gravel", 2.0, "iso10456-mem", "sand and gravel fill"),
)
_MATERIAL_NAMES: Registry[Material] = Registry("insulation material", MATERIALS)


def material(name: str) -> Material:
    """Look up a material by (normalised) name.

    Parameters
    ----------
    name : str
        Material name, e.g. ``"polyurethane"``, ``"PIR panel"``.

    Returns
    -------
    Material

    Raises
    ------
    LookupNameError
        Unknown name; the message lists the closest valid names.

    Examples
    --------
    >>> material("Extruded Polystyrene").conductivity
    0.029
    """
    return _MATERIAL_NAMES.lookup(name)


def conductivity(name: str) -> float:
    """Design thermal conductivity of a named material [W/(m·K)].

    Examples
    --------
    >>> conductivity("polyurethane")
    0.025
    """
    return material(name).conductivity


@dataclass(frozen=True)
class SurfaceFilm:
    """A surface (film) heat-transfer coefficient.

    Attributes
    ----------
    name : str
        Table key.
    coefficient : float
        Combined convective + radiative coefficient [W/(m²·K)] (= 1/R_s).
    source : str
        Key into :data:`SOURCES`.
    note : str
        Where it applies.
    """

    name: str
    coefficient: float
    source: str
    note: str = ""


SURFACE_FILMS: Mapping[str, SurfaceFilm] = MappingProxyType(
    {
        f.name: f
        for f in (
            SurfaceFilm("still_air", 9.37, "ashrae-refrig-si-tables", "still air, any position"),
            SurfaceFilm("wind_24kmh", 34.1, "ashrae-refrig-si-tables", "moving air, 24 km/h (6.7 m/s) wind"),
            # ISO 6946 R_si 0.10 / 0.13 / 0.17 and R_se 0.04 m²K/W [mem].
            SurfaceFilm("iso6946_inside_upward", 1.0 / 0.10, "iso6946-mem", "inside, heat flow upward (R_si 0.10)"),
            SurfaceFilm(
                "iso6946_inside_horizontal", 1.0 / 0.13, "iso6946-mem", "inside, heat flow horizontal (R_si 0.13)"
            ),
            SurfaceFilm(
                "iso6946_inside_downward", 1.0 / 0.17, "iso6946-mem", "inside, heat flow downward (R_si 0.17)"
            ),
            SurfaceFilm("iso6946_outside", 1.0 / 0.04, "iso6946-mem", "outside, any direction (R_se 0.04)"),
        )
    }
)
_FILM_NAMES: Registry[SurfaceFilm] = Registry("surface film", SURFACE_FILMS)


def surface_film(name: str) -> SurfaceFilm:
    """Look up a surface film by (normalised) name.

    Examples
    --------
    >>> surface_film("still air").coefficient
    9.37
    """
    return _FILM_NAMES.lookup(name)


def film_coefficient(name: str) -> float:
    """Surface film coefficient of a named film [W/(m²·K)].

    Examples
    --------
    >>> round(film_coefficient("iso6946_inside_horizontal"), 3)
    7.692
    """
    return surface_film(name).coefficient


# Sun allowance, °F added to the outdoor design temperature, northern hemisphere
# (ASHRAE Refrigeration, 'Refrigerated-Facility Loads', table "Allowance for Sun Effect") [mem].
# Colour classes: dark = slate/tar roofing, black paint; medium = unpainted wood, brick, red
# tile, dark cement, red/grey/green paint; light = white stone, light cement, white paint.
SUN_ALLOWANCE_F: Mapping[str, Mapping[str, float]] = MappingProxyType(
    {
        "dark": MappingProxyType({"north": 0.0, "east": 8.0, "south": 5.0, "west": 8.0, "roof": 20.0}),
        "medium": MappingProxyType({"north": 0.0, "east": 6.0, "south": 4.0, "west": 6.0, "roof": 15.0}),
        "light": MappingProxyType({"north": 0.0, "east": 4.0, "south": 2.0, "west": 4.0, "roof": 9.0}),
    }
)
SUN_ALLOWANCE_SOURCE = "ashrae-sun-mem"
ORIENTATIONS = ("north", "east", "south", "west", "roof")
COLOURS = ("dark", "medium", "light")
HEMISPHERES = ("north", "south")
_ORIENTATION_NAMES = Registry("orientation", {o: o for o in ORIENTATIONS}, {"flat_roof": "roof"})
_COLOUR_NAMES = Registry("surface colour", {c: c for c in COLOURS})
_HEMISPHERE_NAMES = Registry("hemisphere", {h: h for h in HEMISPHERES})


def sun_allowance_table(orientation: str, colour: str, hemisphere: str = "north") -> float:
    """Sun allowance in kelvin for a wall orientation and surface colour.

    Northern-hemisphere table values in °F converted ×5/9 to K; in the southern
    hemisphere north and south are swapped (the sun-facing wall is the north
    wall) [mem, ASHRAE table, see :data:`SUN_ALLOWANCE_F`].

    Parameters
    ----------
    orientation : str
        ``north``, ``east``, ``south``, ``west`` or ``roof`` (alias ``flat roof``).
    colour : str
        ``dark``, ``medium`` or ``light``.
    hemisphere : str
        ``north`` or ``south``.

    Returns
    -------
    float
        Allowance added to the outdoor temperature [K].

    Examples
    --------
    >>> round(sun_allowance_table("roof", "dark"), 2)
    11.11
    >>> sun_allowance_table("north", "dark", "south") == sun_allowance_table("south", "dark")
    True
    """
    o = _ORIENTATION_NAMES.key(orientation)
    c = _COLOUR_NAMES.key(colour)
    h = _HEMISPHERE_NAMES.key(hemisphere)
    if h == "south" and o in ("north", "south"):
        o = "south" if o == "north" else "north"
    return SUN_ALLOWANCE_F[c][o] * 5.0 / 9.0
