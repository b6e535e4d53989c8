"""Refrigerant catalogue: names, safety classes, GWP, flammability limits.

Pure Python, no CoolProp: listing refrigerants (``coldroom refrigerants``) and
looking one up must stay instant. Properties come from
:mod:`coldroom.physics.refrigerant`, which maps each entry to a CoolProp fluid through
:attr:`RefrigerantInfo.coolprop_name`.

Source keys (every value carries one in :attr:`RefrigerantInfo.sources`):

``ASHRAE 34 [mem]``
    ANSI/ASHRAE Standard 34 / ISO 817 safety group (toxicity A/B, flammability
    1/2L/2/3). Recalled, not read from the standard; verify. [ref:ashrae-34]
    [ref:iso-817]
``IPCC AR4 [mem]``
    100-year GWP, IPCC Fourth Assessment Report (2007), WG1 ch. 2 table 2.14, as
    used by EU Regulation 517/2014; blends as the mass-weighted sum of the
    components. Recalled; verify. [ref:ipcc-ar4]
``IPCC AR5 [mem]``
    100-year GWP, IPCC Fifth Assessment Report (2013), WG1 ch. 8 appendix
    8.A table 8.A.1, blends mass-weighted. Recalled; verify. [ref:ipcc-ar5]
``ISO 817 / EN 378-1 annex [mem]``
    Lower flammability limit (LFL) in kg/m³ as tabulated for charge-limit
    rules. Recalled; verify. [ref:iso-817] [ref:en-378]
``CoolProp 8.0 [pub]``
    The fluid or predefined mixture name present in CoolProp 8.0.0 (checked
    with ``get_global_param_string('fluids_list' / 'predefined_mixtures')``).
    [ref:coolprop]
``ASHRAE 34 numbering [pub]``
    400-series numbers are zeotropic blends (with temperature glide), 500-series
    azeotropic blends (no glide), per the numbering rules of ASHRAE 34.

Model choice (``model``):

``pure``
    A single fluid with its reference equation of state in CoolProp.
``pseudo-pure``
    CoolProp's pseudo-pure equation of state for a blend (Lemmon 2003,
    Int. J. Thermophys. 24 (4) 991-1006 [mem] [ref:lemmon-2003]) with separate ancillary
    equations for bubble and dew pressure. Fast (µs per state) and, for
    R-404A, R-407C and R-507A, within about 0.1 % of the full mixture model
    in latent heat and 0.01 K in bubble/dew temperatures at −10/40 °C (checked
    here against the ``.mix`` models of CoolProp 8.0). Preferred where it exists.
``mixture``
    CoolProp's multi-fluid Helmholtz mixture model with a predefined blend
    (``R448A.mix`` …). Accurate but slow (milliseconds per state); the fast
    routines in :mod:`coldroom.physics.refrigerant` avoid its P–H / P–S flashes.

Examples
--------
>>> lookup("r448a").name
'R-448A'
>>> lookup("R-1234ze(E)") is lookup("R1234ZE")
True
>>> lookup("R-717").safety_class
'B2L'
"""

from __future__ import annotations

from dataclasses import dataclass, field
from types import MappingProxyType
from typing import Mapping

from coldroom.constants import ZERO_CELSIUS_K
from coldroom.registry import Registry

ASHRAE34 = "ASHRAE 34 [mem]"
AR4 = "IPCC AR4 [mem]"
AR5 = "IPCC AR5 [mem]"
LFL_SRC = "ISO 817 / EN 378-1 annex [mem]"
COOLPROP = "CoolProp 8.0 [pub]"
NUMBERING = "ASHRAE 34 numbering [pub]"
NOT_FLAMMABLE = "class 1 (no flame propagation): no LFL [mem]"


@dataclass(frozen=True)
class RefrigerantInfo:
    """One catalogue entry.

    Attributes
    ----------
    name : str
        ASHRAE 34 designation, e.g. ``"R-448A"``.
    coolprop_name : str
        Fluid name for CoolProp's HEOS backend (``"R134a"``, ``"R404A"``
        pseudo-pure, ``"R448A.mix"`` predefined mixture).
    model : str
        ``"pure"``, ``"pseudo-pure"`` or ``"mixture"`` (see module docstring).
    safety_class : str
        ISO 817 / ASHRAE 34 safety group, e.g. ``"A1"``, ``"A2L"``, ``"B2L"``.
    gwp_ar4 : float
        100-year global warming potential, IPCC AR4 [1].
    gwp_ar5 : float or None
        100-year global warming potential, IPCC AR5 [1]; ``None`` where AR5
        tabulates no value.
    lfl_kg_m3 : float or None
        Lower flammability limit [kg/m³]; ``None`` for class 1 (non-flammable).
    is_blend : bool
        A mixture of two or more components (400- or 500-series).
    zeotropic : bool
        Glide-bearing blend (400-series): bubble and dew temperatures differ
        at one pressure. Azeotropes (500-series) and pure fluids are not.
    chemical : str
        Chemical name or blend composition (mass %), for the listing.
    sources : Mapping[str, str]
        Source key per attribute (``"safety_class" -> "ASHRAE 34 [mem]"`` …).
    note : str
        Anything a user should know (legacy fluid, model accuracy, AR5 "<1").
    """

    name: str
    coolprop_name: str
    model: str
    safety_class: str
    gwp_ar4: float
    gwp_ar5: float | None
    lfl_kg_m3: float | None
    is_blend: bool
    zeotropic: bool
    chemical: str
    sources: Mapping[str, str] = field(default_factory=dict, compare=False, hash=False)
    note: str = ""

    @property
    def flammable(self) -> bool:
        """True for flammability classes 2L, 2 and 3."""
        return self.safety_class[1:] != "1"

    @property
    def higher_toxicity(self) -> bool:
        """True for toxicity class B."""
        return self.safety_class.startswith("B")


def _entry(
    name: str,
    coolprop_name: str,
    model: str,
    safety_class: str,
    gwp_ar4: float,
    gwp_ar5: float | None,
    lfl: float | None,
    chemical: str,
    note: str = "",
    gwp_ar5_source: str = AR5,
    gwp_ar4_source: str = AR4,
) -> RefrigerantInfo:
    number = name.split("-", 1)[1]
    # 400-series zeotropic, 500-series azeotropic (ASHRAE 34 numbering [pub]);
    # "R-600a" and "R-290" are single compounds.
    is_blend = number.startswith(("4", "5")) and number[:3].isdigit() and len(number) == 4
    zeotropic = is_blend and number.startswith("4")
    sources = MappingProxyType(
        {
            "coolprop_name": COOLPROP,
            "model": COOLPROP,
            "safety_class": ASHRAE34,
            "gwp_ar4": gwp_ar4_source,
            "gwp_ar5": gwp_ar5_source,
            "lfl_kg_m3": LFL_SRC if lfl is not None else NOT_FLAMMABLE,
            "is_blend": NUMBERING,
            "zeotropic": NUMBERING,
            "chemical": ASHRAE34,
        }
    )
    return RefrigerantInfo(
        name=name,
        coolprop_name=coolprop_name,
        model=model,
        safety_class=safety_class,
        gwp_ar4=gwp_ar4,
        gwp_ar5=gwp_ar5,
        lfl_kg_m3=lfl,
        is_blend=is_blend,
        zeotropic=zeotropic,
        chemical=chemical,
        sources=sources,
        note=note,
    )


_AR5_BELOW_ONE = "IPCC AR5 [mem]: tabulated as <1, stored as 1"
_AR5_NONE = "IPCC AR5 [mem]: no value tabulated for this hydrocarbon"

#: The catalogue, in listing order. Values recalled from the named sources
#: (tags [mem]); blend compositions are nominal mass fractions.
CATALOGUE: tuple[RefrigerantInfo, ...] = (
    _entry("R-134a", "R134a", "pure", "A1", 1430, 1300, None, "1,1,1,2-tetrafluoroethane"),
    _entry(
        "R-404A", "R404A", "pseudo-pure", "A1", 3922, 3943, None, "R-125/143a/134a (44/52/4)",
        note="pseudo-pure model; glide about 0.7 K; GWP >= 2500",
    ),
    _entry(
        "R-507A", "R507A", "pseudo-pure", "A1", 3985, 3985, None, "R-125/143a (50/50)",
        note="pseudo-pure model; azeotrope; GWP >= 2500",
    ),
    _entry("R-407A", "R407A.mix", "mixture", "A1", 2107, 1923, None, "R-32/125/134a (20/40/40)"),
    _entry(
        "R-407C", "R407C", "pseudo-pure", "A1", 1774, 1624, None, "R-32/125/134a (23/25/52)",
        note="pseudo-pure model with separate bubble/dew ancillaries; glide about 7 K",
    ),
    _entry("R-407F", "R407F.mix", "mixture", "A1", 1825, 1674, None, "R-32/125/134a (30/30/40)"),
    _entry(
        "R-448A", "R448A.mix", "mixture", "A1", 1387, 1273, None,
        "R-32/125/1234yf/134a/1234ze(E) (26/26/20/21/7)",
    ),
    _entry(
        "R-449A", "R449A.mix", "mixture", "A1", 1397, 1282, None, "R-32/125/1234yf/134a (24.3/24.7/25.3/25.7)",
    ),
    _entry("R-452A", "R452A.mix", "mixture", "A1", 2140, 1945, None, "R-32/125/1234yf (11/59/30)"),
    _entry("R-513A", "R513A.mix", "mixture", "A1", 631, 573, None, "R-1234yf/134a (56/44)", note="azeotrope"),
    _entry("R-454C", "R454C.mix", "mixture", "A2L", 148, 146, 0.293, "R-32/1234yf (21.5/78.5)"),
    _entry("R-455A", "R455A.mix", "mixture", "A2L", 148, 146, 0.431, "R-744/32/1234yf (3/21.5/75.5)"),
    _entry(
        "R-290", "n-Propane", "pure", "A3", 3, None, 0.038, "propane",
        gwp_ar5_source=_AR5_NONE, gwp_ar4_source="IPCC AR4 [mem] (commonly quoted value; verify)",
    ),
    _entry(
        "R-600a", "IsoButane", "pure", "A3", 3, None, 0.043, "isobutane",
        gwp_ar5_source=_AR5_NONE, gwp_ar4_source="IPCC AR4 [mem] (commonly quoted value; verify)",
    ),
    _entry("R-717", "Ammonia", "pure", "B2L", 0, 0, 0.116, "ammonia"),
    _entry(
        "R-744", "CarbonDioxide", "pure", "A1", 1, 1, None, "carbon dioxide",
        note="critical point 31 °C: transcritical above it (give a gas-cooler outlet temperature)",
    ),
    _entry(
        "R-1234yf", "R1234yf", "pure", "A2L", 4, 1, 0.289, "2,3,3,3-tetrafluoropropene",
        gwp_ar5_source=_AR5_BELOW_ONE,
    ),
    _entry(
        "R-1234ze(E)", "R1234ze(E)", "pure", "A2L", 7, 1, 0.303, "trans-1,3,3,3-tetrafluoropropene",
        gwp_ar5_source=_AR5_BELOW_ONE,
    ),
    _entry(
        "R-22", "R22", "pure", "A1", 1810, 1760, None, "chlorodifluoromethane",
        note="legacy HCFC (ozone-depleting, phased out): for existing installations only",
    ),
)

_BY_NAME: dict[str, RefrigerantInfo] = {info.name: info for info in CATALOGUE}


# Explicit extra spellings (never a fuzzy guess): chemical names and the short
# form "R-1234ze" that the trade uses for the (E) isomer.
_ALIASES: dict[str, str] = {
    "R-1234ze": "R-1234ze(E)",
    "HFO-1234ze(E)": "R-1234ze(E)",
    "HFO-1234yf": "R-1234yf",
    "propane": "R-290",
    "isobutane": "R-600a",
    "ammonia": "R-717",
    "NH3": "R-717",
    "CO2": "R-744",
    "carbon dioxide": "R-744",
}

#: Designations are compared with separators ignored (``R448A`` = ``R-448A``).
_NAMES: Registry[RefrigerantInfo] = Registry("refrigerant", _BY_NAME, _ALIASES, compact=True)


def names() -> tuple[str, ...]:
    """All catalogue names in listing order.

    Examples
    --------
    >>> "R-744" in names()
    True
    """
    return tuple(info.name for info in CATALOGUE)


def lookup(name: str) -> RefrigerantInfo:
    """Find a refrigerant by name.

    Exact after :func:`coldroom.registry.normalise` with separators ignored:
    case-insensitive; spaces, hyphens, underscores and parentheses ignored, so
    ``R448A``, ``R-448A``, ``r448a`` and ``R-1234ze(E)`` / ``R1234ZEE`` all
    match; plus the aliases ``R1234ZE`` (the (E) isomer), ``propane``, ``isobutane``, ``ammonia``/``NH3``,
    ``CO2``.

    Parameters
    ----------
    name : str
        Refrigerant designation.

    Returns
    -------
    RefrigerantInfo

    Raises
    ------
    coldroom.errors.LookupNameError
        Unknown name; the message lists the closest valid names.

    Examples
    --------
    >>> lookup("R-290").coolprop_name
    'n-Propane'
    >>> lookup("R999")
    Traceback (most recent call last):
    ...
    coldroom.errors.LookupNameError: unknown refrigerant 'R999'...
    """
    if isinstance(name, RefrigerantInfo):
        return name
    return _NAMES.lookup(name)


#: Critical points of the predefined mixtures [K, Pa], computed once with
#: CoolProp 8.0.0 ``AbstractState("HEOS", name).all_critical_points()`` (the
#: physical root with the highest temperature and positive pressure). Computing
#: them at run time costs up to 7 s per mixture, so they are stored here, once: the
#: property model (:mod:`coldroom.physics.refrigerant`) and :data:`LIMITS` read them.
#: Source: CoolProp 8.0.0 [pub, computed]; a test re-checks one of them.
MIXTURE_CRITICAL_POINTS: dict[str, tuple[float, float]] = {
    "R407A.mix": (355.3968669716282, 4513894.305323166),
    "R407F.mix": (355.7537022332468, 4749227.883990307),
    "R448A.mix": (355.94090315929117, 4605180.921074508),
    "R449A.mix": (355.63530092292876, 4516517.7319519725),
    "R452A.mix": (348.248967281918, 3983776.6491352622),
    "R513A.mix": (368.5606761258613, 3655093.999046059),
    "R454C.mix": (360.7933602886933, 4370459.600637634),
    "R455A.mix": (358.7847327606565, 4601904.683892602),
}


def _mixture_critical_temperature(coolprop_name: str) -> float:
    """A ``.mix`` blend's critical temperature [°C], from :data:`MIXTURE_CRITICAL_POINTS`, to 0.01 K."""
    return round(MIXTURE_CRITICAL_POINTS[coolprop_name][0] - ZERO_CELSIUS_K, 2)


#: Temperature limits of each refrigerant's property model [°C]: the lowest
#: saturated evaporating temperature (triple point of a pure fluid; the lower
#: limit of CoolProp's pseudo-pure or mixture model for a blend) and the
#: critical temperature (for a ``.mix`` blend, the mixture critical point of the
#: nominal composition from :data:`MIXTURE_CRITICAL_POINTS`, rounded like the rest). Values
#: read from CoolProp 8.0 (``PropsSI('Ttriple'|'Tcrit', fluid)``) [pub: CoolProp 8.0 / NIST
#: REFPROP values]. Kept as plain numbers so that ``coldroom validate`` never imports CoolProp.
LIMITS: dict[str, tuple[float, float]] = {
    # name: (lowest evaporating temperature [°C], critical temperature [°C])
    "R-134a": (-103.30, 101.06),
    "R-404A": (-73.15, 72.12),  # pseudo-pure model's lower limit
    "R-507A": (-73.15, 70.62),  # pseudo-pure model's lower limit
    "R-407A": (-114.11, _mixture_critical_temperature("R407A.mix")),
    "R-407C": (-73.15, 86.20),  # pseudo-pure model's lower limit
    "R-407F": (-118.61, _mixture_critical_temperature("R407F.mix")),
    "R-448A": (-124.62, _mixture_critical_temperature("R448A.mix")),
    "R-449A": (-125.81, _mixture_critical_temperature("R449A.mix")),
    "R-452A": (-122.41, _mixture_critical_temperature("R452A.mix")),
    "R-513A": (-128.99, _mixture_critical_temperature("R513A.mix")),
    "R-454C": (-146.02, _mixture_critical_temperature("R454C.mix")),
    "R-455A": (-140.56, _mixture_critical_temperature("R455A.mix")),
    "R-290": (-187.62, 96.74),
    "R-600a": (-159.42, 134.66),
    "R-717": (-77.65, 132.41),
    "R-744": (-56.56, 30.98),
    "R-1234yf": (-151.55, 94.70),
    "R-1234ze(E)": (-104.53, 109.36),
    "R-22": (-157.42, 96.15),
}

def limits(name: str) -> tuple[float, float]:
    """(lowest evaporating temperature, critical temperature) [°C] of a catalogue refrigerant.

    Examples
    --------
    >>> limits("CO2")
    (-56.56, 30.98)
    """
    return LIMITS[lookup(name).name]
