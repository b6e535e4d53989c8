"""Thermal properties of foods from their composition.

All temperatures in this module are in °C (the published correlations are
written in °C); every other quantity is SI: specific heat [J/(kg·K)],
enthalpy and latent heat [J/kg], density [kg/m³], mass fractions [-].

Two property models share one interface (:class:`PropertyModel`):

``"composition"`` (default) — :class:`CompositionModel`
    Component specific heats and densities of Choi & Okos (1986)
    [ref:choi-okos-1986] as functions of temperature (ASHRAE
    Handbook—Refrigeration, chapter "Thermal Properties of Foods", Table 1
    [pub; coefficients recalled, from memory; verify] [ref:ashrae-refrig-foods]);
    ice fraction of Schwartzberg, x_ice = (x_wo − x_b)(1 − t_f/t) with bound
    water x_b ≈ 0.4·x_protein (same chapter, Eq. for ice fraction [mem]);
    enthalpy as the mass-weighted sum of component enthalpies, H = Σ x_i·H_i
    (same chapter, enthalpy-by-composition equation [mem]), the water split
    into ice and unfrozen liquid at each temperature. Enthalpy is relative to
    the product at −40 °C (H(−40 °C) = 0, as in the ASHRAE enthalpy table of
    frozen foods).

``"siebel"`` — :class:`ExplicitModel` built by :func:`siebel`
    c₁ = 0.837 + 3.349·x_w, c₂ = 0.837 + 1.256·x_w [kJ/(kg·K)],
    h_if = 333.6·x_w [kJ/kg], all water freezing at the initial freezing point
    (ASHRAE "Thermal Properties of Foods", Siebel's equations [pub]). Siebel
    overstates the frozen specific heat because not all water freezes.

The water coefficient of Choi & Okos is printed as 4.1289 in the ASHRAE table
and as 4.1762 in the original paper; 4.1762 reproduces liquid water (4.18
kJ/(kg·K) at 20 °C, IAPWS-95) and is used here (see tests/validation/
test_food.py).
"""

from __future__ import annotations

import math
from dataclasses import dataclass, field
from functools import cached_property
from typing import Any, Protocol, runtime_checkable

from coldroom.constants import ZERO_CELSIUS_K
from coldroom.errors import CalculationError, unknown_name
from coldroom.registry import Registry

#: Latent heat of fusion of water at 0 °C [J/kg] (ASHRAE "Thermal Properties
#: of Foods", L₀ = 333.6 kJ/kg [pub]).
LATENT_HEAT_WATER = 333.6e3

#: Reference temperature of the enthalpy (H = 0) [°C] (ASHRAE enthalpy table
#: of frozen foods uses −40 °C [mem]).
REFERENCE_TEMPERATURE = -40.0

#: Bound (non-freezable) water per unit protein mass [-] (Schwartzberg, as
#: given in ASHRAE "Thermal Properties of Foods": x_b ≈ 0.4·x_p [pub]).
BOUND_WATER_PER_PROTEIN = 0.4

#: Water coefficient a₀ of the Choi & Okos liquid-water specific heat
#: [kJ/(kg·K)]: 4.1762 in Choi & Okos (1986), printed 4.1289 in ASHRAE [mem].
CHOI_OKOS_WATER_A0 = 4.1762

# Choi & Okos (1986) component correlations, t in °C, as tabulated in ASHRAE
# Handbook—Refrigeration, "Thermal Properties of Foods", Table 1
# [pub; coefficients from memory; verify]. cp in kJ/(kg·K) as a + b·t + c·t²;
# density in kg/m³ as a + b·t + c·t².
_CP = {
    "water": (CHOI_OKOS_WATER_A0, -9.0864e-5, 5.4731e-6),
    "ice": (2.0623, 6.0769e-3, 0.0),
    "protein": (2.0082, 1.2089e-3, -1.3129e-6),
    "fat": (1.9842, 1.4733e-3, -4.8008e-6),
    "carbohydrate": (1.5488, 1.9625e-3, -5.9399e-6),
    "fibre": (1.8459, 1.8306e-3, -4.6509e-6),
    "ash": (1.0926, 1.8896e-3, -3.6817e-6),
}
_RHO = {
    "water": (997.18, 3.1439e-3, -3.7574e-3),
    "ice": (916.89, -0.13071, 0.0),
    "protein": (1329.9, -0.5184, 0.0),
    "fat": (925.59, -0.41757, 0.0),
    "carbohydrate": (1599.1, -0.31046, 0.0),
    "fibre": (1311.5, -0.36589, 0.0),
    "ash": (2423.8, -0.28063, 0.0),
}
_SOLIDS = ("protein", "fat", "carbohydrate", "fibre", "ash")

#: Valid component names (keys of :func:`component_specific_heat`).
COMPONENTS = tuple(_CP)


def _poly(coefficients: tuple[float, float, float], t: float) -> float:
    a, b, c = coefficients
    return a + b * t + c * t * t


def _poly_integral(coefficients: tuple[float, float, float], t: float) -> float:
    """∫₀ᵗ (a + bτ + cτ²) dτ."""
    a, b, c = coefficients
    return a * t + b * t * t / 2.0 + c * t**3 / 3.0


def component_specific_heat(component: str, temperature: float) -> float:
    """Specific heat of one food component (Choi & Okos 1986).

    Source: ASHRAE Handbook—Refrigeration, "Thermal Properties of Foods",
    Table 1 (Choi & Okos) [pub; coefficients from memory; verify]; water a₀ =
    4.1762 from the original paper (ASHRAE prints 4.1289).

    Parameters
    ----------
    component : str
        One of ``water``, ``ice``, ``protein``, ``fat``, ``carbohydrate``,
        ``fibre``, ``ash``.
    temperature : float
        Temperature [°C].

    Returns
    -------
    float
        Specific heat [J/(kg·K)].

    Examples
    --------
    >>> round(component_specific_heat("water", 20.0))
    4177
    >>> round(component_specific_heat("ice", -10.0))
    2002
    """
    if component not in _CP:
        raise unknown_name("food component", component, list(_CP))
    return 1000.0 * _poly(_CP[component], temperature)


def component_density(component: str, temperature: float) -> float:
    """Density of one food component (Choi & Okos 1986).

    Source: ASHRAE Handbook—Refrigeration, "Thermal Properties of Foods",
    Table 1 [pub; coefficients from memory; verify].

    Parameters
    ----------
    component : str
        Component name (see :data:`COMPONENTS`).
    temperature : float
        Temperature [°C].

    Returns
    -------
    float
        Density [kg/m³].

    Examples
    --------
    >>> round(component_density("water", 4.0), 1)
    997.1
    """
    if component not in _RHO:
        raise unknown_name("food component", component, list(_RHO))
    return _poly(_RHO[component], temperature)


def _component_enthalpy(component: str, temperature: float) -> float:
    """∫₀ᵗ cp dτ [J/kg] (sensible enthalpy relative to 0 °C)."""
    return 1000.0 * _poly_integral(_CP[component], temperature)


def water_latent_heat(temperature: float) -> float:
    """Latent heat of fusion of water freezing at *temperature* (≤ 0 °C).

    Kirchhoff's relation L(t) = L₀ + ∫₀ᵗ (c_water − c_ice) dτ with the Choi &
    Okos water and ice specific heats (thermodynamic identity; L₀ = 333.6
    kJ/kg, ASHRAE [pub]).

    Parameters
    ----------
    temperature : float
        Temperature [°C].

    Returns
    -------
    float
        Latent heat [J/kg].

    Examples
    --------
    >>> water_latent_heat(0.0)
    333600.0
    >>> round(water_latent_heat(-10.0) / 1000, 1)
    312.2
    """
    return LATENT_HEAT_WATER + _component_enthalpy("water", temperature) - _component_enthalpy(
        "ice", temperature
    )


_SOLIDS_NAMES = Registry("solids component", {c: c for c in ("carbohydrate", "protein", "fat", "ash")})

@dataclass(frozen=True)
class Composition:
    """Mass fractions of a food [-].

    ``carbohydrate`` is the TOTAL carbohydrate including fibre (the USDA
    "by difference" convention, as in the ASHRAE composition table);
    ``fibre`` is the part of it that is fibre. So
    water + protein + fat + carbohydrate + ash = 1.

    Parameters
    ----------
    water, protein, fat, carbohydrate, fibre, ash : float
        Mass fractions [-].

    Examples
    --------
    >>> c = Composition(water=0.9157, protein=0.0061, fat=0.0037,
    ...                 carbohydrate=0.0702, fibre=0.023, ash=0.0043)
    >>> round(c.total, 4)
    1.0
    >>> round(c.solids, 4)
    0.0843
    """

    water: float
    protein: float = 0.0
    fat: float = 0.0
    carbohydrate: float = 0.0
    fibre: float = 0.0
    ash: float = 0.0

    def __post_init__(self) -> None:
        for name in ("water", "protein", "fat", "carbohydrate", "fibre", "ash"):
            value = getattr(self, name)
            if not (isinstance(value, (int, float)) and math.isfinite(value) and 0.0 <= value <= 1.0):
                raise CalculationError(f"{name} mass fraction {value!r} outside 0 … 1")
        if self.fibre > self.carbohydrate + 1e-9:
            raise CalculationError(
                f"fibre {self.fibre} exceeds total carbohydrate {self.carbohydrate} "
                "(carbohydrate is the total including fibre)"
            )
        if abs(self.total - 1.0) > 0.03:
            raise CalculationError(
                f"mass fractions water+protein+fat+carbohydrate+ash sum to {self.total:.3f}; expected 1 ± 0.03"
            )

    @classmethod
    def from_water(cls, water: float, solids: str = "carbohydrate") -> "Composition":
        """Composition from the water content only; the rest is one component.

        Parameters
        ----------
        water : float
            Water mass fraction [-].
        solids : str
            Component that makes up the rest: ``carbohydrate`` (default, produce
            and beverages), ``protein``, ``fat`` or ``ash``.

        Examples
        --------
        >>> Composition.from_water(0.75, "protein").protein
        0.25
        """
        solids = _SOLIDS_NAMES.key(solids)
        if not 0.0 <= water <= 1.0:
            raise CalculationError(f"water mass fraction {water!r} outside 0 … 1")
        return cls(water=water, **{solids: round(1.0 - water, 12)})

    @property
    def total(self) -> float:
        """water + protein + fat + carbohydrate + ash [-]."""
        return self.water + self.protein + self.fat + self.carbohydrate + self.ash

    @property
    def solids(self) -> float:
        """Solids mass fraction 1 − x_w (from the stated fractions) [-]."""
        return self.protein + self.fat + self.carbohydrate + self.ash

    def normalised(self) -> dict[str, float]:
        """Fractions for the Choi & Okos sum, scaled to total exactly 1.

        Non-fibre carbohydrate = carbohydrate − fibre.
        """
        parts = {
            "water": self.water,
            "protein": self.protein,
            "fat": self.fat,
            "carbohydrate": max(self.carbohydrate - self.fibre, 0.0),
            "fibre": self.fibre,
            "ash": self.ash,
        }
        total = sum(parts.values())
        return {k: v / total for k, v in parts.items()}


def chang_tao_freezing_point(water: float, group: str) -> float:
    """Initial freezing point from the water content (Chang & Tao 1981).

    Source: ASHRAE Handbook—Refrigeration, "Thermal Properties of Foods",
    Chang & Tao correlations [pub; coefficients from memory; verify], T in K:

    - meat (also fish, poultry): T_f = 271.18 + 1.47·x_wo
    - fruit_vegetable: T_f = 287.56 − 49.19·x_wo + 37.07·x_wo²
    - juice: T_f = 120.47 + 327.35·x_wo − 176.49·x_wo²

    The recalled fruit/vegetable fit rises above 0 °C for x_wo > 0.88, so the
    result is limited to −0.2 °C (the highest initial freezing point in the
    ASHRAE product table, lettuce [mem]). Prefer a tabulated value.

    Parameters
    ----------
    water : float
        Water mass fraction [-].
    group : str
        ``meat``, ``fruit_vegetable`` or ``juice``.

    Returns
    -------
    float
        Initial freezing point [°C].

    Examples
    --------
    >>> round(chang_tao_freezing_point(0.74, "meat"), 2)
    -0.88
    >>> round(chang_tao_freezing_point(0.88, "juice"), 2)
    -1.29
    """
    x = water
    group = _FREEZING_GROUP_NAMES.key(group)
    if group == "meat":
        kelvin = 271.18 + 1.47 * x
    elif group == "fruit_vegetable":
        kelvin = 287.56 - 49.19 * x + 37.07 * x * x
    else:  # juice
        kelvin = 120.47 + 327.35 * x - 176.49 * x * x
    return min(kelvin - ZERO_CELSIUS_K, -0.2)


_FREEZING_GROUP_NAMES = Registry("freezing-point group", {g: g for g in ("meat", "fruit_vegetable", "juice")})

@runtime_checkable
class PropertyModel(Protocol):
    """What the product load needs from a property model (SI, t in °C)."""

    freezing_point: float

    def enthalpy(self, temperature: float) -> float:
        """Enthalpy relative to the product at −40 °C [J/kg]."""

    def ice_fraction(self, temperature: float) -> float:
        """Mass of ice per mass of product [-]."""

    def specific_heat(self, temperature: float) -> float:
        """Apparent specific heat dH/dt (includes latent release) [J/(kg·K)]."""

    @property
    def latent_heat(self) -> float:
        """Latent heat of fusion of the product (333.6 kJ/kg × water) [J/kg]."""

    def latent_heat_between(self, warmer: float, colder: float) -> float:
        """Latent heat released by the ice that forms from *warmer* down to *colder* [J/kg]."""


@dataclass(frozen=True)
class CompositionModel:
    """Composition-based property model (Choi & Okos + Schwartzberg).

    Parameters
    ----------
    composition : Composition
        Mass fractions.
    freezing_point : float
        Initial freezing point t_f [°C], ≤ 0.

    Examples
    --------
    >>> water = CompositionModel(Composition(water=1.0), freezing_point=0.0)
    >>> round(water.specific_heat(20.0))
    4177
    >>> round((water.enthalpy(0.0) - water.enthalpy(-1e-9)) / 1000, 1)
    333.6
    >>> water.ice_fraction(-0.01)
    1.0
    """

    composition: Composition
    freezing_point: float
    name: str = field(default="", compare=False)

    def __post_init__(self) -> None:
        if not (math.isfinite(self.freezing_point) and -60.0 < self.freezing_point <= 0.0):
            raise CalculationError(
                f"initial freezing point {self.freezing_point!r} °C outside −60 … 0 °C"
            )

    # The composition is frozen: the derived fractions, bound water and the
    # reference enthalpy are computed once per model (the pull-down tables ask
    # for thousands of enthalpies of the same product).
    @cached_property
    def _fractions(self) -> dict[str, float]:
        return self.composition.normalised()

    @cached_property
    def bound_water(self) -> float:
        """Bound (non-freezable) water x_b = 0.4·x_protein, at most x_w [-]
        (Schwartzberg, ASHRAE [pub])."""
        f = self._fractions
        return min(BOUND_WATER_PER_PROTEIN * f["protein"], f["water"])

    @property
    def latent_heat(self) -> float:
        """L₀·x_w [J/kg] (ASHRAE "Thermal Properties of Foods", latent heat
        column of the product table = 333.6 kJ/kg × water content [pub])."""
        return LATENT_HEAT_WATER * self._fractions["water"]

    def ice_fraction(self, temperature: float) -> float:
        """Ice mass fraction x_ice = (x_wo − x_b)(1 − t_f/t) below t_f, else 0.

        Schwartzberg's equation as given in ASHRAE "Thermal Properties of
        Foods" [pub]. For pure water (t_f = 0) every t < 0 gives x_ice = 1.

        Parameters
        ----------
        temperature : float
            Product temperature [°C].

        Returns
        -------
        float
            Ice mass per product mass [-].
        """
        t_f = self.freezing_point
        if temperature >= t_f:
            return 0.0
        freezable = self._fractions["water"] - self.bound_water
        return min(max(freezable * (1.0 - t_f / temperature), 0.0), freezable)

    def _ice_fraction_slope(self, temperature: float) -> float:
        """d x_ice / dt [1/K] (≤ 0)."""
        t_f = self.freezing_point
        if temperature >= t_f or t_f == 0.0:
            return 0.0
        freezable = self._fractions["water"] - self.bound_water
        return freezable * t_f / (temperature * temperature)

    def _absolute_enthalpy(self, temperature: float) -> float:
        """H = Σ x_i·H_i relative to components at 0 °C, ice at 0 °C = 0 [J/kg]."""
        return self._enthalpy_terms(temperature, self.ice_fraction(temperature))

    def _enthalpy_terms(self, temperature: Any, ice: Any) -> Any:
        """Σ x_i·H_i at *temperature* with ice fraction *ice* (floats, or numpy arrays alike)."""
        f = self._fractions
        h = sum(f[c] * _component_enthalpy(c, temperature) for c in _SOLIDS)
        liquid = f["water"] - ice
        h += ice * _component_enthalpy("ice", temperature)
        # Unfrozen (liquid) water: L₀ plus the Choi & Okos liquid-water
        # sensible enthalpy, extrapolated below 0 °C for the unfrozen part
        # (an assumption of this model, stated).
        h += liquid * (LATENT_HEAT_WATER + _component_enthalpy("water", temperature))
        return h

    def enthalpy(self, temperature: float) -> float:
        """Enthalpy relative to the product at −40 °C [J/kg].

        Parameters
        ----------
        temperature : float
            Product temperature [°C].

        Returns
        -------
        float
            Enthalpy [J/kg].
        """
        return self._absolute_enthalpy(temperature) - self._reference_enthalpy

    @cached_property
    def _reference_enthalpy(self) -> float:
        return self._absolute_enthalpy(REFERENCE_TEMPERATURE)

    def sensible_specific_heat(self, temperature: float) -> float:
        """Specific heat without latent release: Σ x_i·c_i with the water split
        into ice and unfrozen liquid [J/(kg·K)]."""
        f = self._fractions
        ice = self.ice_fraction(temperature)
        c = sum(f[s] * component_specific_heat(s, temperature) for s in _SOLIDS)
        c += ice * component_specific_heat("ice", temperature)
        c += (f["water"] - ice) * component_specific_heat("water", temperature)
        return c

    def specific_heat(self, temperature: float) -> float:
        """Apparent specific heat dH/dt [J/(kg·K)], latent release included.

        Below t_f: c_app = Σ x_i c_i − (dx_ice/dt)·L(t), with L(t) the latent
        heat of water at t (Kirchhoff, :func:`water_latent_heat`).

        Parameters
        ----------
        temperature : float
            Product temperature [°C].

        Returns
        -------
        float
            Apparent specific heat [J/(kg·K)].
        """
        return self.sensible_specific_heat(temperature) - self._ice_fraction_slope(
            temperature
        ) * water_latent_heat(temperature)

    def latent_heat_between(self, warmer: float, colder: float) -> float:
        """Latent heat released by the ice that forms from *warmer* down to *colder* [J/kg].

        Each kilogram of ice gives up the latent heat of water at the temperature where
        it forms: q = ∫ L(t)·(−dx_ice/dt) dt over [colder, min(warmer, t_f)], with
        L(t) of :func:`water_latent_heat` (Kirchhoff) and x_ice of Schwartzberg
        [ref:ashrae-refrig-foods]. With x_ice = F(1 − t_f/t) and L(t) = L₀ + d₁t + d₂t²
        + d₃t³ the integral is closed:
        q = −F·t_f·[L₀(1/lo − 1/hi) + d₁ ln(hi/lo) + d₂(hi − lo) + d₃(hi² − lo²)/2].
        The sensible heat below freezing is the rest of the enthalpy drop, so the two
        lines always add up to it (dH/dt = Σ x_i c_i − L·dx_ice/dt exactly).

        Parameters
        ----------
        warmer : float
            Temperature at the start of the cooling [°C].
        colder : float
            Temperature at the end [°C], ≤ *warmer*.

        Returns
        -------
        float
            Latent heat [J/kg], ≥ 0; 0 when no ice forms in the range.

        Examples
        --------
        >>> peas = CompositionModel(Composition.from_water(0.79), -0.6)
        >>> round(peas.latent_heat_between(-12.0, -18.0))   # already frozen: ice still forms
        3977
        """
        t_f = self.freezing_point
        hi, lo = min(warmer, t_f), colder
        if lo >= hi:
            return 0.0
        freezable = self._fractions["water"] - self.bound_water
        if t_f == 0.0:  # pure water: all of it freezes at 0 °C
            return freezable * water_latent_heat(0.0) if warmer >= 0.0 else 0.0
        (a_w, b_w, c_w), (a_i, b_i, c_i) = _CP["water"], _CP["ice"]
        d1, d2, d3 = 1000.0 * (a_w - a_i), 500.0 * (b_w - b_i), 1000.0 * (c_w - c_i) / 3.0
        integral = (
            LATENT_HEAT_WATER * (1.0 / lo - 1.0 / hi)
            + d1 * math.log(hi / lo)
            + d2 * (hi - lo)
            + d3 * (hi * hi - lo * lo) / 2.0
        )
        return -freezable * t_f * integral

    def density(self, temperature: float) -> float:
        """Density 1/ρ = Σ x_i/ρ_i (no porosity) [kg/m³] (ASHRAE "Thermal
        Properties of Foods", density by composition [pub])."""
        f = self._fractions
        ice = self.ice_fraction(temperature)
        v = sum(f[s] / component_density(s, temperature) for s in _SOLIDS)
        v += ice / component_density("ice", temperature)
        v += (f["water"] - ice) / component_density("water", temperature)
        return 1.0 / v


@dataclass(frozen=True)
class ExplicitModel:
    """Two specific heats and a latent heat released at the freezing point.

    The form of the ASHRAE product-load equation Q = m[c₁(t₁ − t_f) + h_if +
    c₂(t_f − t₃)] ("Refrigerated-Facility Loads" [pub]). Used for Siebel's
    values (:func:`siebel`) and for products given by explicit properties.

    Parameters
    ----------
    specific_heat_above : float
        c₁ above freezing [J/(kg·K)].
    specific_heat_below : float
        c₂ below freezing [J/(kg·K)].
    latent_heat : float
        h_if [J/kg], released entirely at the freezing point.
    freezing_point : float
        t_f [°C].
    water : float
        Water mass fraction [-], used only to report the ice fraction (all
        freezable water frozen below t_f); 0 if unknown.

    Examples
    --------
    >>> m = ExplicitModel(3600.0, 1900.0, 250e3, -1.0)
    >>> round(m.enthalpy(5.0) - m.enthalpy(-10.0))
    288700
    """

    specific_heat_above: float
    specific_heat_below: float
    latent_heat: float
    freezing_point: float
    water: float = 0.0
    name: str = field(default="", compare=False)

    def __post_init__(self) -> None:
        for label, value, low, high in (
            ("specific heat above freezing", self.specific_heat_above, 500.0, 5000.0),
            ("specific heat below freezing", self.specific_heat_below, 500.0, 5000.0),
            ("latent heat", self.latent_heat, 0.0, LATENT_HEAT_WATER),
            ("freezing point", self.freezing_point, -60.0, 0.0),
            ("water fraction", self.water, 0.0, 1.0),
        ):
            if not (math.isfinite(value) and low <= value <= high):
                raise CalculationError(f"{label} {value!r} outside {low:g} … {high:g}")

    def enthalpy(self, temperature: float) -> float:
        """Enthalpy relative to −40 °C [J/kg]; the latent heat counts as
        released just below t_f."""
        t_f = self.freezing_point
        if temperature < t_f:
            return self.specific_heat_below * (temperature - REFERENCE_TEMPERATURE)
        return (
            self.specific_heat_below * (t_f - REFERENCE_TEMPERATURE)
            + self.latent_heat
            + self.specific_heat_above * (temperature - t_f)
        )

    def ice_fraction(self, temperature: float) -> float:
        """All water frozen below t_f (the assumption of Siebel's method) [-]."""
        return self.water if temperature < self.freezing_point else 0.0

    def specific_heat(self, temperature: float) -> float:
        """c₁ at or above t_f, c₂ below [J/(kg·K)] (latent heat is a step)."""
        return self.specific_heat_above if temperature >= self.freezing_point else self.specific_heat_below

    def latent_heat_between(self, warmer: float, colder: float) -> float:
        """h_if when the cooling crosses t_f (all of it released there), else 0 [J/kg].

        In this model no more ice forms below t_f, so a product entering frozen has
        no latent line.
        """
        t_f = self.freezing_point
        return self.latent_heat if colder < t_f <= warmer else 0.0


def siebel(water: float, freezing_point: float, name: str = "") -> ExplicitModel:
    """Siebel's specific heats and latent heat from the water content.

    c₁ = 0.837 + 3.349·x_w, c₂ = 0.837 + 1.256·x_w [kJ/(kg·K)],
    h_if = 333.6·x_w [kJ/kg] (ASHRAE Handbook—Refrigeration, "Thermal
    Properties of Foods", Siebel's equations [pub]).

    Parameters
    ----------
    water : float
        Water mass fraction [-].
    freezing_point : float
        Initial freezing point [°C].

    Returns
    -------
    ExplicitModel

    Examples
    --------
    >>> m = siebel(0.9157, -0.8)
    >>> round(m.specific_heat_above), round(m.specific_heat_below), round(m.latent_heat)
    (3904, 1987, 305478)
    """
    return ExplicitModel(
        specific_heat_above=1000.0 * (0.837 + 3.349 * water),
        specific_heat_below=1000.0 * (0.837 + 1.256 * water),
        latent_heat=LATENT_HEAT_WATER * water,
        freezing_point=freezing_point,
        water=water,
        name=name,
    )


#: Property-model registry: name → builder(composition, freezing_point, name).
PROPERTY_MODELS = ("composition", "siebel")
_MODEL_NAMES = Registry("property model", {name: name for name in PROPERTY_MODELS})


def property_model(
    composition: Composition, freezing_point: float, model: str = "composition", name: str = ""
) -> CompositionModel | ExplicitModel:
    """Build a property model by name (``composition`` default, ``siebel``).

    Parameters
    ----------
    composition : Composition
        Mass fractions.
    freezing_point : float
        Initial freezing point [°C].
    model : str
        ``composition`` or ``siebel``.

    Examples
    --------
    >>> property_model(Composition.from_water(0.9), -1.0, "siebel").latent_heat
    300240.0
    """
    key = _MODEL_NAMES.key(model)
    if key == "composition":
        return CompositionModel(composition, freezing_point, name=name)
    if key == "siebel":
        return siebel(composition.water, freezing_point, name=name)
    raise AssertionError(key)  # pragma: no cover - the registry admits only PROPERTY_MODELS


__all__ = [
    "BOUND_WATER_PER_PROTEIN",
    "CHOI_OKOS_WATER_A0",
    "COMPONENTS",
    "Composition",
    "CompositionModel",
    "ExplicitModel",
    "LATENT_HEAT_WATER",
    "PROPERTY_MODELS",
    "PropertyModel",
    "REFERENCE_TEMPERATURE",
    "chang_tao_freezing_point",
    "component_density",
    "component_specific_heat",
    "property_model",
    "siebel",
    "water_latent_heat",
]
