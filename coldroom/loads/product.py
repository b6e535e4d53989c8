"""Product load: pull-down of the daily intake, its packaging, and respiration.

Pure functions on plain numbers (SI; temperatures in °C because the food
property correlations are written in °C). The product energy comes from
enthalpy differences of a property model (:mod:`coldroom.physics.food`), so partial
freezing below the initial freezing point is counted as the ice actually
forms — not all at once as in the older equation

    Q = m·[c₁(t₁ − t_f) + h_if + c₂(t_f − t₃)]

([ref:ashrae-refrig-loads] ASHRAE Handbook—Refrigeration, "Refrigerated-Facility Loads", product load
[pub]), which is what the ``siebel`` / explicit model reproduces exactly.

The pull-down rate is the product energy divided by the pull-down time: the
load the room sees while the intake cools (the "peak"). The 24-hour average
is the daily energy / 86 400 s.
"""

from __future__ import annotations

import math
from dataclasses import dataclass

from coldroom.constants import SECONDS_PER_DAY_S
from coldroom.errors import CalculationError
from coldroom.registry import Registry
from coldroom.physics.food import CompositionModel, ExplicitModel, PropertyModel
from coldroom.physics.respiration import RespirationData, respiration_heat


#: Packaging specific heats [J/(kg·K)] (common practice, no source [trade]:
#: corrugated board ≈1.3–1.4, wood ≈1.7–2.0, plastic crates ≈1.9–2.3 kJ/(kg·K)).
PACKAGING_SPECIFIC_HEAT = {
    "corrugated_board": 1400.0,
    "wood": 1900.0,
    "plastic": 2000.0,
}
_PACKAGING_ALIASES = {
    "cardboard": "corrugated_board",
    "corrugated": "corrugated_board",
    "carton": "corrugated_board",
    "cartons": "corrugated_board",
    "wooden_crates": "wood",
    "pallets": "wood",
    "plastic_crates": "plastic",
    "crates": "plastic",
}
_PACKAGING_NAMES = Registry("packaging material", PACKAGING_SPECIFIC_HEAT, _PACKAGING_ALIASES)


def _finite(label: str, value: float, low: float = -math.inf, high: float = math.inf) -> float:
    if not isinstance(value, (int, float)) or not math.isfinite(value) or not low <= value <= high:
        raise CalculationError(f"{label} {value!r} outside {low:g} … {high:g}")
    return float(value)


def packaging_specific_heat(material: str) -> float:
    """Default specific heat of a packaging material [J/(kg·K)].

    Keys ``corrugated_board`` 1400, ``wood`` 1900, ``plastic`` 2000
    (common practice, no source [trade]); aliases cardboard, carton(s),
    wooden_crates, pallets, plastic_crates, crates. Names are normalised
    (:func:`coldroom.registry.normalise`).

    Examples
    --------
    >>> packaging_specific_heat("Plastic crates")
    2000.0
    """
    return _PACKAGING_NAMES.lookup(material)


@dataclass(frozen=True)
class ProductPulldown:
    """Energy to bring one day's intake from entering to final temperature.

    Attributes
    ----------
    mass : float
        Daily intake [kg].
    entering_temperature, final_temperature : float
        [°C].
    freezing_point : float
        Initial freezing point of the product [°C].
    sensible_above : float
        Cooling above the freezing point [J/day].
    latent : float
        Heat of fusion of the ice formed, x_ice(t₃)·L(t₃) per kg [J/day]
        (0 if the product ends above its freezing point).
    sensible_below : float
        Cooling below the freezing point, the rest of the enthalpy drop below
        t_f [J/day].
    pulldown_time : float
        [s].
    """

    mass: float
    entering_temperature: float
    final_temperature: float
    freezing_point: float
    sensible_above: float
    latent: float
    sensible_below: float
    pulldown_time: float

    @property
    def daily_energy(self) -> float:
        """Total product energy per day [J/day]."""
        return self.sensible_above + self.latent + self.sensible_below

    @property
    def pulldown_rate(self) -> float:
        """Energy / pull-down time: the load while the intake cools [W]."""
        return self.daily_energy / self.pulldown_time

    @property
    def average_power(self) -> float:
        """24-hour average [W]."""
        return self.daily_energy / SECONDS_PER_DAY_S


def product_pulldown(
    mass: float,
    entering_temperature: float,
    final_temperature: float,
    pulldown_time: float,
    properties: PropertyModel,
) -> ProductPulldown:
    """Product energy of one day's intake, from enthalpy differences.

    Q = m·[h(t₁) − h(t₃)] split at the initial freezing point t_f:
    sensible above = m·[h(t₁) − h(max(t₃, t_f))]; below t_f the latent part is
    the heat released by the ice that forms between the two temperatures, each
    kilogram at the latent heat of the temperature where it forms
    (``properties.latent_heat_between``), and the sensible part below freezing is
    the rest of the enthalpy drop (ASHRAE "Refrigerated-Facility Loads", product
    load, with the enthalpy of "Thermal Properties of Foods" [pub]
    [ref:ashrae-refrig-loads] [ref:ashrae-refrig-foods]). A product entering
    already frozen has both lines when ice still forms as it cools.

    Parameters
    ----------
    mass : float
        Daily intake [kg/day], ≥ 0.
    entering_temperature : float
        Product temperature on arrival t₁ [°C].
    final_temperature : float
        Product temperature at the end of the pull-down t₃ [°C], ≤ t₁.
    pulldown_time : float
        Time to bring the intake down [s], > 0 (86 400 s = 24 h).
    properties : PropertyModel
        From :meth:`coldroom.physics.products.Product.properties`,
        :func:`coldroom.physics.food.siebel`, or :func:`explicit_properties`.

    Returns
    -------
    ProductPulldown

    Raises
    ------
    CalculationError
        Final temperature above the entering one, negative mass, or a
        non-positive pull-down time.

    Examples
    --------
    >>> from coldroom.physics.food import siebel
    >>> r = product_pulldown(1000.0, 5.0, -18.0, 86400.0, siebel(0.75, -2.0))
    >>> round(r.sensible_above / 1e6, 2), round(r.latent / 1e6, 1), round(r.sensible_below / 1e6, 2)
    (23.44, 250.2, 28.46)
    >>> round(r.pulldown_rate)
    3497
    """
    _finite("daily intake mass [kg]", mass, 0.0, 1e8)
    t1 = _finite("entering temperature [°C]", entering_temperature, -60.0, 100.0)
    t3 = _finite("final temperature [°C]", final_temperature, -60.0, 100.0)
    _finite("pull-down time [s]", pulldown_time, 1e-9, 30 * SECONDS_PER_DAY_S)
    if t3 > t1:
        raise CalculationError(
            f"final temperature {t3:g} °C is above the entering temperature {t1:g} °C; "
            "the product load covers cooling only"
        )
    t_f = properties.freezing_point
    h1 = properties.enthalpy(t1)
    h3 = properties.enthalpy(t3)
    if t3 >= t_f:
        above, latent, below = h1 - h3, 0.0, 0.0
    else:
        h_f = properties.enthalpy(t_f) if t1 >= t_f else h1
        above = h1 - h_f
        below_total = h_f - h3
        latent = properties.latent_heat_between(t1, t3)
        below = below_total - latent
    return ProductPulldown(
        mass=mass,
        entering_temperature=t1,
        final_temperature=t3,
        freezing_point=t_f,
        sensible_above=mass * above,
        latent=mass * latent,
        sensible_below=mass * below,
        pulldown_time=pulldown_time,
    )


def explicit_properties(
    freezing_point: float,
    water_content: float | None = None,
    specific_heat_above: float | None = None,
    specific_heat_below: float | None = None,
    latent_heat: float | None = None,
) -> ExplicitModel:
    """Property model for a product not in the table.

    Give ``water_content`` (Siebel's c₁, c₂, h_if — ASHRAE "Thermal Properties
    of Foods" [pub]), or all three of the specific heats and latent heat;
    explicit values override the Siebel values they replace.

    Parameters
    ----------
    freezing_point : float
        Initial freezing point [°C].
    water_content : float, optional
        Water mass fraction [-].
    specific_heat_above, specific_heat_below : float, optional
        [J/(kg·K)].
    latent_heat : float, optional
        [J/kg].

    Examples
    --------
    >>> explicit_properties(-1.0, water_content=0.8).latent_heat
    266880.0
    >>> explicit_properties(-1.0, specific_heat_above=3600, specific_heat_below=1900,
    ...                     latent_heat=250e3).specific_heat_below
    1900
    """
    from coldroom.physics.food import siebel

    if water_content is not None:
        base = siebel(water_content, freezing_point)
        return ExplicitModel(
            specific_heat_above=base.specific_heat_above if specific_heat_above is None else specific_heat_above,
            specific_heat_below=base.specific_heat_below if specific_heat_below is None else specific_heat_below,
            latent_heat=base.latent_heat if latent_heat is None else latent_heat,
            freezing_point=freezing_point,
            water=water_content,
        )
    if specific_heat_above is None or specific_heat_below is None or latent_heat is None:
        raise CalculationError(
            "explicit product properties need water_content, or all of specific_heat_above, "
            "specific_heat_below and latent_heat"
        )
    return ExplicitModel(specific_heat_above, specific_heat_below, latent_heat, freezing_point)


def packaging_energy(
    mass: float,
    entering_temperature: float,
    final_temperature: float,
    specific_heat: float | None = None,
    material: str = "corrugated_board",
) -> float:
    """Packaging load m·c·Δt per day [J/day] (common practice, no source).

    Parameters
    ----------
    mass : float
        Packaging brought in per day [kg/day].
    entering_temperature, final_temperature : float
        [°C]; the packaging follows the product.
    specific_heat : float, optional
        [J/(kg·K)]; default from *material* (:func:`packaging_specific_heat`).
    material : str
        ``corrugated_board`` (default), ``wood`` or ``plastic``.

    Examples
    --------
    >>> packaging_energy(100.0, 20.0, 2.0, material="wood")
    3420000.0
    """
    _finite("packaging mass [kg]", mass, 0.0, 1e8)
    _finite("entering temperature [°C]", entering_temperature, -60.0, 100.0)
    _finite("final temperature [°C]", final_temperature, -60.0, 100.0)
    if final_temperature > entering_temperature:
        raise CalculationError(
            f"final temperature {final_temperature:g} °C is above the entering temperature "
            f"{entering_temperature:g} °C"
        )
    c = packaging_specific_heat(material) if specific_heat is None else _finite(
        "packaging specific heat [J/(kg·K)]", specific_heat, 1.0, 10e3
    )
    return mass * c * (entering_temperature - final_temperature)


@dataclass(frozen=True)
class RespirationLoad:
    """Respiration of the stored produce.

    Attributes
    ----------
    stored_mass : float
        [kg].
    room_temperature : float
        [°C].
    specific_rate : float
        Heat of respiration [W/kg].
    """

    stored_mass: float
    room_temperature: float
    specific_rate: float

    @property
    def power(self) -> float:
        """Continuous heat of respiration [W]."""
        return self.stored_mass * self.specific_rate

    @property
    def daily_energy(self) -> float:
        """Over 24 h [J/day]."""
        return self.power * SECONDS_PER_DAY_S


def respiration_load(
    stored_mass: float, room_temperature: float, respiration: RespirationData | None
) -> RespirationLoad:
    """Heat of respiration of the stored produce at the room temperature.

    q = m·q_resp(t) (Becker, Misra & Fricke coefficients or tabulated heats,
    :func:`coldroom.physics.respiration.respiration_heat` [mem]); counted over 24 h. A
    product without respiration data (meat, frozen goods) gives 0.

    Parameters
    ----------
    stored_mass : float
        Mass held in the room [kg].
    room_temperature : float
        [°C]; the stored produce is taken at room temperature.
    respiration : RespirationData or None
        ``Product.respiration``.

    Examples
    --------
    >>> from coldroom.physics.respiration import RespirationData
    >>> r = respiration_load(2000.0, 0.0, RespirationData(f=3.6683e-4, g=3.0330))
    >>> round(r.power), round(r.daily_energy / 1e6, 1)
    (80, 6.9)
    """
    _finite("stored mass [kg]", stored_mass, 0.0, 1e8)
    _finite("room temperature [°C]", room_temperature, -60.0, 60.0)
    rate = 0.0 if respiration is None else respiration_heat(respiration, room_temperature)
    return RespirationLoad(stored_mass=stored_mass, room_temperature=room_temperature, specific_rate=rate)


@dataclass(frozen=True)
class ProductLoad:
    """All product-related load lines of one product in one room.

    Attributes
    ----------
    name : str
    pulldown : ProductPulldown
    packaging : float
        Packaging energy [J/day].
    respiration : RespirationLoad
    """

    name: str
    pulldown: ProductPulldown
    packaging: float
    respiration: RespirationLoad

    @property
    def daily_energy(self) -> float:
        """Product + packaging + respiration [J/day]."""
        return self.pulldown.daily_energy + self.packaging + self.respiration.daily_energy

    @property
    def average_power(self) -> float:
        """24-hour average [W]."""
        return self.daily_energy / SECONDS_PER_DAY_S

    @property
    def pulldown_rate(self) -> float:
        """(product + packaging) / pull-down time + respiration [W]: the load
        while the intake cools."""
        return (self.pulldown.daily_energy + self.packaging) / self.pulldown.pulldown_time + self.respiration.power

    def lines(self) -> list[tuple[str, float]]:
        """(item, J/day) pairs for a load breakdown, zero lines left out."""
        pairs = [
            (f"{self.name}: sensible above freezing", self.pulldown.sensible_above),
            (f"{self.name}: latent", self.pulldown.latent),
            (f"{self.name}: sensible below freezing", self.pulldown.sensible_below),
            (f"{self.name}: packaging", self.packaging),
            (f"{self.name}: respiration", self.respiration.daily_energy),
        ]
        return [(item, value) for item, value in pairs if value > 0.0]


def product_load(
    name: str,
    properties: CompositionModel | ExplicitModel,
    mass: float = 0.0,
    entering_temperature: float | None = None,
    final_temperature: float | None = None,
    pulldown_time: float = SECONDS_PER_DAY_S,
    packaging_mass: float = 0.0,
    packaging_material: str = "corrugated_board",
    packaging_specific_heat: float | None = None,
    stored_mass: float = 0.0,
    room_temperature: float | None = None,
    respiration: RespirationData | None = None,
) -> ProductLoad:
    """Pull-down, packaging and respiration of one product, in one call.

    Parameters
    ----------
    name : str
        Label for the load lines.
    properties : CompositionModel or ExplicitModel
        Property model.
    mass : float
        Daily intake [kg/day]; 0 → no pull-down.
    entering_temperature, final_temperature : float
        [°C]; the final temperature defaults to the room temperature.
    pulldown_time : float
        [s].
    packaging_mass : float
        [kg/day].
    packaging_material : str
        Default-c key (:data:`PACKAGING_SPECIFIC_HEAT`).
    packaging_specific_heat : float, optional
        [J/(kg·K)], overrides the material default.
    stored_mass : float
        Produce held for respiration [kg].
    room_temperature : float
        [°C]; needed for respiration and as the default final temperature.
    respiration : RespirationData or None

    Examples
    --------
    >>> from coldroom.physics.products import get_product
    >>> p = get_product("strawberries")
    >>> load = product_load("strawberries", p.properties(), mass=500.0, entering_temperature=20.0,
    ...                     final_temperature=1.0, pulldown_time=8 * 3600.0, packaging_mass=40.0,
    ...                     stored_mass=1500.0, room_temperature=1.0, respiration=p.respiration)
    >>> round(load.average_power), round(load.pulldown_rate)
    (519, 1416)
    """
    t_room = room_temperature
    t3 = final_temperature if final_temperature is not None else t_room
    if mass > 0.0 or packaging_mass > 0.0:
        if entering_temperature is None or t3 is None:
            raise CalculationError(
                f"{name}: a daily intake needs an entering and a final (or room) temperature"
            )
        pull = product_pulldown(mass, entering_temperature, t3, pulldown_time, properties)
        pack = packaging_energy(
            packaging_mass, entering_temperature, t3, packaging_specific_heat, packaging_material
        )
    else:
        t = t3 if t3 is not None else 0.0
        pull = product_pulldown(0.0, t, t, pulldown_time, properties)
        pack = 0.0
    if stored_mass > 0.0 and respiration is not None and t_room is None:
        raise CalculationError(f"{name}: respiration of stored produce needs the room temperature")
    resp = respiration_load(stored_mass, t_room if t_room is not None else 0.0, respiration)
    return ProductLoad(name=name, pulldown=pull, packaging=pack, respiration=resp)


__all__ = [
    "PACKAGING_SPECIFIC_HEAT",
    "ProductLoad",
    "ProductPulldown",
    "RespirationLoad",
    "explicit_properties",
    "packaging_energy",
    "packaging_specific_heat",
    "product_load",
    "product_pulldown",
    "respiration_load",
]
