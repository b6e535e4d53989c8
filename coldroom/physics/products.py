"""Product table: food commodities stored in walk-in rooms.

The table lives in ``coldroom/data/products.yaml`` (package data; every value
carries a source key, most of them recalled values tagged [mem]). This module
loads it once (``functools.lru_cache``), checks it, and looks products up by
key or alias.

Look-up goes through :class:`coldroom.registry.Registry`: exact after
:func:`coldroom.registry.normalise` ("Beef quarters", "beef-quarters" →
``beef_quarters``); an unknown name raises
:class:`coldroom.errors.LookupNameError` listing the closest keys.
"""

from __future__ import annotations

from dataclasses import dataclass, field
from functools import lru_cache
from importlib import resources

from coldroom.errors import CalculationError, ColdroomError
from coldroom.registry import DuplicateNameError, Registry, normalise
from coldroom.results import Note, Term
from coldroom.physics.food import (
    Composition,
    CompositionModel,
    ExplicitModel,
    property_model,
)
from coldroom.physics.respiration import RespirationData, respiration_heat

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
            aliases=tuple(normalise(a) for a in entry.get("aliases", []) or []),
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
    # The C loader (libyaml) when available: about ten times faster on this trusted package data.
    loader = getattr(yaml, "CSafeLoader", yaml.SafeLoader)
    raw = yaml.load(text, Loader=loader)  # noqa: S506 - a safe loader either way
    sources = raw["sources"]
    products: dict[str, Product] = {}
    for key, entry in raw["products"].items():
        if normalise(key) != key:
            raise ProductTableError(f"products.yaml: key {key!r} is not normalised snake_case")
        products[key] = _build(key, entry, sources)
    return products


@lru_cache(maxsize=1)
def _names() -> Registry[Product]:
    products = load_products()
    aliases: dict[str, str] = {}
    for key, product in products.items():
        for alias in product.aliases:
            if aliases.get(alias, key) != key:
                raise ProductTableError(
                    f"products.yaml: name {alias!r} used by both {aliases[alias]!r} and {key!r}"
                )
            aliases[alias] = key
    try:
        return Registry("product", products, aliases)
    except DuplicateNameError as error:
        raise ProductTableError(f"products.yaml: {error}") from None


def product_keys() -> list[str]:
    """All product keys, in table order."""
    return list(load_products())


def get_product(name: str) -> Product:
    """Look a product up by key or alias (exact after :func:`coldroom.registry.normalise`).

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
    return _names().lookup(name)


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
    needle = normalise(text)
    plain = text.strip().lower()
    hits = []
    for p in products:
        haystack = [p.key, normalise(p.name), p.name.lower(), p.category, *p.aliases]
        if any(needle in h or plain in h for h in haystack):
            hits.append(p)
    return hits


#: Lowest recommended storage temperature at or above which a fresh product is
#: treated as chilling-sensitive [°C] (tropical/subtropical produce stored at
#: 7 °C or warmer; common practice, no source [trade]).
CHILLING_SENSITIVE_FROM = 7.0


def _t(celsius: float, bare: bool = False) -> Term:
    """A temperature inside a warning, shown in the report's unit system (*bare*: without its unit)."""
    return Term(celsius, "temperature:bare" if bare else "temperature", sep="")


def storage_warnings(
    product: Product, room_temperature: float, room_humidity: float | None = None
) -> list[str]:
    """Advice when a room's conditions do not suit a product.

    Checks the recommended storage range (temperature and RH) of the table,
    freezing damage of a fresh product below its initial freezing point, and
    chilling injury of chilling-sensitive produce (recommended low end ≥ 7 °C,
    common practice, no source) held below its range.

    Parameters
    ----------
    product : Product
        From :func:`get_product`.
    room_temperature : float
        Room air temperature [°C].
    room_humidity : float, optional
        Room relative humidity [%] (0–100); not checked if None.

    Returns
    -------
    list of str
        One sentence per finding; empty if the room suits the product.

    Examples
    --------
    >>> storage_warnings(get_product("bananas"), 2.0)[0]
    'Bananas (green, ripening): room 2.0 °C is below the recommended 13.0 … 14.0 °C — chilling injury risk'
    >>> storage_warnings(get_product("apples"), 0.0, 92.0)
    []
    """
    low, high = product.storage_temperature
    t = room_temperature
    out: list[str] = []
    if product.is_fresh and t < product.freezing_point:
        out.append(
            Note(
                f"{product.name}: room ", _t(t), " is below the product's initial freezing point ",
                _t(product.freezing_point), " — freezing damage to a fresh product",
            )
        )
    elif t < low:
        why = ""
        if product.is_fresh and low >= CHILLING_SENSITIVE_FROM:
            why = " — chilling injury risk"
        out.append(Note(f"{product.name}: room ", _t(t), " is below the recommended ", _t(low, True), " … ", _t(high), why))
    if t > high:
        why = " — the product will not stay frozen" if not product.is_fresh and t > product.freezing_point else ""
        out.append(
            Note(
                f"{product.name}: room ", _t(t), " is above the recommended ", _t(low, True), " … ", _t(high),
                f" — shorter storage life{why}",
            )
        )
    if room_humidity is not None and product.storage_humidity is not None:
        rh_low, rh_high = product.storage_humidity
        if room_humidity < rh_low:
            out.append(
                f"{product.name}: room RH {room_humidity:g} % is below the recommended "
                f"{rh_low:g} … {rh_high:g} % — weight loss and wilting/drying"
            )
        elif room_humidity > rh_high:
            out.append(
                f"{product.name}: room RH {room_humidity:g} % is above the recommended "
                f"{rh_low:g} … {rh_high:g} % — mould and surface-moisture risk"
            )
    return out


def mix_warnings(products: list[Product] | tuple[Product, ...]) -> list[str]:
    """Advice on products stored together in one room.

    Flags pairs whose recommended temperature ranges do not overlap, pairs
    whose recommended RH ranges do not overlap, and ethylene-sensitive
    products stored with ethylene producers (USDA Agriculture Handbook 66
    compatibility guidance [mem]).

    Parameters
    ----------
    products : list of Product
        The products sharing the room (duplicates ignored).

    Returns
    -------
    list of str

    Examples
    --------
    >>> mix_warnings([get_product("apples"), get_product("lettuce")])[-1]
    'Lettuce, iceberg (ethylene-sensitive) stored with ethylene producers: Apples'
    >>> mix_warnings([get_product("bananas"), get_product("strawberries")])[0]
    'Bananas (green, ripening) (13 … 14 °C) and Strawberries (0 … 0.5 °C): recommended temperature ranges do not overlap'
    """
    unique: list[Product] = []
    for p in products:
        if p.key not in {u.key for u in unique}:
            unique.append(p)
    out: list[str] = []
    for i, a in enumerate(unique):
        for b in unique[i + 1 :]:
            (a_lo, a_hi), (b_lo, b_hi) = a.storage_temperature, b.storage_temperature
            if a_hi < b_lo or b_hi < a_lo:
                out.append(
                    f"{a.name} ({a_lo:g} … {a_hi:g} °C) and {b.name} ({b_lo:g} … {b_hi:g} °C): "
                    "recommended temperature ranges do not overlap"
                )
            if a.storage_humidity and b.storage_humidity:
                (ar_lo, ar_hi), (br_lo, br_hi) = a.storage_humidity, b.storage_humidity
                if ar_hi < br_lo or br_hi < ar_lo:
                    out.append(
                        f"{a.name} ({ar_lo:g} … {ar_hi:g} % RH) and {b.name} ({br_lo:g} … {br_hi:g} % RH): "
                        "recommended humidity ranges do not overlap"
                    )
    producers = [p for p in unique if p.ethylene == "producer"]
    for p in unique:
        if p.ethylene == "sensitive":
            others = [q.name for q in producers if q.key != p.key]
            if others:
                out.append(f"{p.name} (ethylene-sensitive) stored with ethylene producers: {', '.join(others)}")
    return out


__all__ = [
    "CATEGORIES",
    "Product",
    "ProductTableError",
    "CHILLING_SENSITIVE_FROM",
    "get_product",
    "mix_warnings",
    "storage_warnings",
    "load_products",
    "product_keys",
    "search_products",
]
