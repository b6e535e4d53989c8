"""Copper refrigeration tube: the standard size tables line sizing chooses from.

Two series, named as a project's ``piping.tube_series`` names them:

``EN 12735-1``
    Metric seamless copper tube for refrigeration and air-conditioning piping,
    EN 12735-1:2016 "Copper and copper alloys — Seamless, round tubes for air
    conditioning and refrigeration — Part 1: Tubes for piping systems",
    Table 4 (nominal outside diameters and wall thicknesses) [ref:en-12735-1]. The standard
    lists several walls for most diameters; the wall stored here is one
    commonly stocked for each outside diameter [mem] — recalled, not read
    from the standard: verify against the current edition, and check the wall
    against the design pressure (R-744 and other high-pressure refrigerants
    need thicker walls or CuFe2P tube).
``ASTM B280``
    Inch ACR copper tube, designated by its actual outside diameter, ASTM
    B280-20 "Seamless Copper Tube for Air Conditioning and Refrigeration Field
    Service", Table 1 (straight lengths, drawn temper) [pub] for 1/4 in to
    2-1/8 in [ref:astm-b280]; 2-5/8 in to 4-1/8 in recalled [mem] (they equal the type L
    walls of ASTM B88 at the same outside diameter).

Internal roughness of drawn copper tube: 1.5 µm (0.0015 mm), "copper or brass
tubing" in Çengel & Cimbala, *Fluid Mechanics: Fundamentals and
Applications*, 1st ed., table 8-2 [mem] [ref:cengel-cimbala].

Examples
--------
>>> t = series("EN 12735-1")[4]
>>> t.label, round(t.inside_diameter * 1e3, 1)
('15 x 1.0 mm', 13.0)
>>> series("astm b280")[0].label
'1/4 in'
"""

from __future__ import annotations

from dataclasses import dataclass

from coldroom.registry import Registry

INCH = 0.0254  # m, exact

#: Absolute roughness of drawn copper tube [m] (see module docstring).
COPPER_ROUGHNESS = 1.5e-6


@dataclass(frozen=True)
class Tube:
    """One standard tube size.

    Attributes
    ----------
    label : str
        The trade designation (``"22 x 1.0 mm"``, ``"7/8 in"``).
    outside_diameter : float
        Outside diameter [m].
    wall : float
        Nominal wall thickness [m].
    source : str
        Where the size comes from, with its tag.
    """

    label: str
    outside_diameter: float
    wall: float
    source: str

    @property
    def inside_diameter(self) -> float:
        """Inside diameter [m]: outside diameter less two walls."""
        return self.outside_diameter - 2.0 * self.wall

    @property
    def flow_area(self) -> float:
        """Internal cross-section [m²]."""
        return 3.141592653589793 / 4.0 * self.inside_diameter**2


_EN_SOURCE = "EN 12735-1:2016 Table 4 [mem]; verify against the current edition"
_B280_SOURCE = "ASTM B280-20 Table 1, straight lengths, drawn temper [pub]"
_B280_LARGE_SOURCE = "ASTM B280-20 Table 1 [mem] (= ASTM B88 type L wall); verify"

# (outside diameter [mm], wall [mm])
_EN_12735_1 = (
    (6.0, 1.0), (8.0, 1.0), (10.0, 1.0), (12.0, 1.0), (15.0, 1.0), (18.0, 1.0), (22.0, 1.0),
    (28.0, 1.0), (35.0, 1.5), (42.0, 1.5), (54.0, 2.0), (64.0, 2.0), (76.1, 2.0), (88.9, 2.0),
    (108.0, 2.5),
)

# (designation, outside diameter [in], wall [in], source)
_ASTM_B280 = (
    ("1/4", 0.250, 0.025, _B280_SOURCE),
    ("3/8", 0.375, 0.030, _B280_SOURCE),
    ("1/2", 0.500, 0.035, _B280_SOURCE),
    ("5/8", 0.625, 0.040, _B280_SOURCE),
    ("3/4", 0.750, 0.042, _B280_SOURCE),
    ("7/8", 0.875, 0.045, _B280_SOURCE),
    ("1-1/8", 1.125, 0.050, _B280_SOURCE),
    ("1-3/8", 1.375, 0.055, _B280_SOURCE),
    ("1-5/8", 1.625, 0.060, _B280_SOURCE),
    ("2-1/8", 2.125, 0.070, _B280_SOURCE),
    ("2-5/8", 2.625, 0.080, _B280_LARGE_SOURCE),
    ("3-1/8", 3.125, 0.090, _B280_LARGE_SOURCE),
    ("3-5/8", 3.625, 0.100, _B280_LARGE_SOURCE),
    ("4-1/8", 4.125, 0.110, _B280_LARGE_SOURCE),
)


def _mm(value: float) -> str:
    return f"{value:g}"


SERIES: dict[str, tuple[Tube, ...]] = {
    "EN 12735-1": tuple(
        Tube(f"{_mm(od)} x {wall:.1f} mm", od / 1e3, wall / 1e3, _EN_SOURCE) for od, wall in _EN_12735_1
    ),
    "ASTM B280": tuple(
        Tube(f"{name} in", od * INCH, wall * INCH, source) for name, od, wall, source in _ASTM_B280
    ),
}


def names() -> tuple[str, ...]:
    """The tube series names."""
    return tuple(SERIES)


#: Series names compared with separators ignored (``EN12735-1`` = ``en 12735 1``).
_SERIES_NAMES: Registry[tuple[Tube, ...]] = Registry("tube series", SERIES, compact=True)


def series(name: str) -> tuple[Tube, ...]:
    """The sizes of a tube series, smallest first.

    Parameters
    ----------
    name : str
        ``"EN 12735-1"`` or ``"ASTM B280"`` (case, spaces and hyphens ignored).

    Raises
    ------
    coldroom.errors.LookupNameError
        Unknown series; the message lists the valid names.
    """
    return _SERIES_NAMES.lookup(name)
