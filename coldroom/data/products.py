"""Product table: food commodities stored in walk-in rooms.

The table lives in ``coldroom/data/products.yaml`` (package data; every value
carries a source key, most of them recalled values tagged [mem]). This module
loads it once (``functools.lru_cache``), checks it, and looks products up by
key or alias.

Look-up is exact after normalisation: lower-case, surrounding blanks removed,
runs of spaces and hyphens turned into one underscore ("Beef quarters",
"beef-quarters" → ``beef_quarters``). An unknown name raises
:class:`coldroom.errors.LookupNameError` listing the closest keys.
"""

from __future__ import annotations

import re
from dataclasses import dataclass, field
from functools import lru_cache
from importlib import resources

from coldroom.errors import CalculationError, ColdroomError, unknown_name
from coldroom.food import (
    Composition,
    CompositionModel,
    ExplicitModel,
    RespirationData,
    property_model,
    respiration_heat,
)

#: Categories used in the table.
CATEGORIES = (
    "fruit",
    "vegetable",
    "frozen_vegetable",
    "meat",
    "poultry",
    "fish",
    "dairy",
    "eggs",
    "bakery",
    "beverage",
    "frozen_dessert",
    "cut_flowers",
)


class ProductTableError(ColdroomError):
    """The packaged product table is malformed (a defect in coldroom itself)."""

    exit_code = 1


@dataclass(frozen=True)
class Product:
    """One commodity of the product table.

    Attributes
    ----------
    key : str
        Stable snake_case key.
    name : str
        Display name.
    aliases : tuple of str
        Other accepted names (normalised).
    category : str
        One of :data:`CATEGORIES`.
    composition : Composition
        Mass fractions [-].
    freezing_point : float
        Initial freezing point [°C].
    storage_temperature : tuple of float
        Recommended storage temperature range (low, high) [°C].
    storage_humidity : tuple of float or None
        Recommended relative humidity range (low, high) [%], None where RH
        does not apply (sealed packs, kegs).
    respiration : RespirationData or None
        Respiration of fresh produce, None for non-respiring products.
    ethylene : str or None
        ``producer``, ``sensitive`` or None.
    sources : dict
        Field group → full source text.
    """

    key: str
    name: str
    aliases: tuple[str, ...]
    category: str
    composition: Composition
    freezing_point: float
    storage_temperature: tuple[float, float]
    storage_humidity: tuple[float, float] | None
    respiration: RespirationData | None = None
    ethylene: str | None = None
    sources: dict[str, str] = field(default_factory=dict, compare=False, hash=False)

    @property
    def is_fresh(self) -> bool:
        """True if stored unfrozen (the top of the storage range above t_f).

        Some chilled products are listed slightly below their initial freezing
        point (superchilled meat, eggs); they still count as fresh."""
        return self.storage_temperature[1] > self.freezing_point

    @property
    def water(self) -> float:
        """Water mass fraction [-]."""
        return self.composition.water

    def properties(self, model: str = "composition") -> CompositionModel | ExplicitModel:
        """Thermal property model of this product (``composition`` or ``siebel``).

        Examples
        --------
        >>> m = get_product("strawberries").properties()
        >>> round(m.latent_heat / 1000)
        305
        """
        return property_model(self.composition, self.freezing_point, model, name=self.key)

    def respiration_heat(self, temperature: float) -> float:
        """Heat of respiration [W/kg] at *temperature* [°C]; 0 if none."""
        if self.respiration is None:
            return 0.0
        return respiration_heat(self.respiration, temperature)


def normalise_name(name: str) -> str:
    """Normalise a product name for look-up.

    Examples
    --------
    >>> normalise_name("  Beef  Quarters ")
    'beef_quarters'
    >>> normalise_name("ice-cream")
    'ice_cream'
    """
    return re.sub(r"[\s\-]+", "_", str(name).strip().lower())


def _pair(value: object, what: str, key: str) -> tuple[float, float]:
    if not (isinstance(value, (list, tuple)) and len(value) == 2):
        raise ProductTableError(f"products.yaml: {key}: {what} must be [low, high]")
    low, high = float(value[0]), float(value[1])
    if low > high:
        raise ProductTableError(f"products.yaml: {key}: {what} low {low} > high {high}")
    return low, high


def _build(key: str, entry: dict, sources: dict[str, str]) -> Product:
    try:
        if "composition" in entry:
            c = entry["composition"]
            composition = Composition(
                water=c["water"] / 100.0,
                protein=c.get("protein", 0.0) / 100.0,
                fat=c.get("fat", 0.0) / 100.0,
                carbohydrate=c.get("carbohydrate", 0.0) / 100.0,
                fibre=c.get("fibre", 0.0) / 100.0,
                ash=c.get("ash", 0.0) / 100.0,
            )
        else:
            composition = Composition.from_water(
                entry["water_content"] / 100.0, entry.get("solids", "carbohydrate")
            )
        storage = entry["storage"]
        rh = storage.get("rh")
        resp = entry.get("respiration")
        src = {group: sources[skey] for group, skey in entry["sources"].items()}
        respiration = None
        if resp is not None:
            table = tuple((float(t), float(q) / 1000.0) for t, q in resp.get("heat_mw_per_kg", ()))
            respiration = RespirationData(
                f=resp.get("f"), g=resp.get("g"), table=table, source=src.get("respiration", "")
            )
        return Product(
            key=key,
            name=str(entry["name"]),
            aliases=tuple(normalise_name(a) for a in entry.get("aliases", []) or []),
            category=str(entry["category"]),
            composition=composition,
            freezing_point=float(entry["freezing_point"]),
            storage_temperature=_pair(storage["temperature"], "storage.temperature", key),
            storage_humidity=None if rh is None else _pair(rh, "storage.rh", key),
            respiration=respiration,
            ethylene=entry.get("ethylene"),
            sources=src,
        )
    except (KeyError, TypeError) as error:
        raise ProductTableError(f"products.yaml: {key}: missing or malformed field {error}") from None
    except CalculationError as error:
        raise ProductTableError(f"products.yaml: {key}: {error}") from None


@lru_cache(maxsize=1)
def load_products() -> dict[str, Product]:
    """Load and check the packaged product table (cached).

    Returns
    -------
    dict
        key → :class:`Product`, in table order.

    Examples
    --------
    >>> len(load_products()) >= 40
    True
    """
    import yaml

    text = resources.files("coldroom").joinpath("data/products.yaml").read_text(encoding="utf-8")
    raw = yaml.safe_load(text)
    sources = raw["sources"]
    products: dict[str, Product] = {}
    for key, entry in raw["products"].items():
        if normalise_name(key) != key:
            raise ProductTableError(f"products.yaml: key {key!r} is not normalised snake_case")
        products[key] = _build(key, entry, sources)
    return products


@lru_cache(maxsize=1)
def _index() -> dict[str, str]:
    index: dict[str, str] = {}
    for key, product in load_products().items():
        for name in (key, *product.aliases):
            if name in index and index[name] != key:
                raise ProductTableError(
                    f"products.yaml: name {name!r} used by both {index[name]!r} and {key!r}"
                )
            index[name] = key
    return index


def product_keys() -> list[str]:
    """All product keys, in table order."""
    return list(load_products())


def get_product(name: str) -> Product:
    """Look a product up by key or alias (exact after :func:`normalise_name`).

    Parameters
    ----------
    name : str
        Key or alias, e.g. ``"strawberries"``, ``"Beef quarters"``.

    Returns
    -------
    Product

    Raises
    ------
    coldroom.errors.LookupNameError
        Unknown name; the message lists the closest keys.

    Examples
    --------
    >>> get_product("Ice-Cream").key
    'ice_cream'
    >>> get_product("strawbery")
    Traceback (most recent call last):
    ...
    coldroom.errors.LookupNameError: unknown product 'strawbery'; closest: ...
    """
    normal = normalise_name(name)
    key = _index().get(normal)
    if key is None:
        raise unknown_name("product", name, list(_index()))
    return load_products()[key]


def search_products(text: str | None = None) -> list[Product]:
    """Products whose key, name, alias or category contains *text*
    (case-insensitive substring; spaces and hyphens match underscores).

    Examples
    --------
    >>> [p.key for p in search_products("berr")]
    ['strawberries', 'blueberries']
    """
    products = list(load_products().values())
    if not text:
        return products
    needle = normalise_name(text)
    plain = text.strip().lower()
    hits = []
    for p in products:
        haystack = [p.key, normalise_name(p.name), p.name.lower(), p.category, *p.aliases]
        if any(needle in h or plain in h for h in haystack):
            hits.append(p)
    return hits


__all__ = [
    "CATEGORIES",
    "Product",
    "ProductTableError",
    "get_product",
    "load_products",
    "normalise_name",
    "product_keys",
    "search_products",
]
