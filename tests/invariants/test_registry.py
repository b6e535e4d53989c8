"""Name look-ups: one normalisation, exact look-up, closest names on a miss.

Invariants of :mod:`coldroom.registry` and of every table that uses it: each key is
found again however a person spells it (case, blanks, hyphens, slashes), the
normal form is idempotent, and an unknown name is refused with the closest names.
"""

from __future__ import annotations

import pytest
from hypothesis import given
from hypothesis import strategies as st

from coldroom.data import materials, refrigerants, tubes
from coldroom.physics import products
from coldroom.errors import LookupNameError
from coldroom.physics.food import Composition, chang_tao_freezing_point, property_model
from coldroom.loads import infiltration, internal, product, totals
from coldroom.registry import DuplicateNameError, Registry, normalise

# Every registry the project builds, by the module attribute that holds it.
REGISTRIES = [
    materials._MATERIAL_NAMES,
    materials._FILM_NAMES,
    materials._ORIENTATION_NAMES,
    materials._COLOUR_NAMES,
    materials._HEMISPHERE_NAMES,
    refrigerants._NAMES,
    products._names(),
    infiltration._PROTECTION_NAMES,
    infiltration._USAGE_NAMES,
    internal._MOTOR_LOCATION_NAMES,
    totals._DEFROST_NAMES,
    product._PACKAGING_NAMES,
    tubes._SERIES_NAMES,
]


def _respell(name: str) -> list[str]:
    """Spellings a person might type for a key."""
    spaced = name.replace("_", " ")
    return [name, name.upper(), f"  {spaced.title()} ", name.replace("_", "-"), spaced.replace(" ", "  ")]


@pytest.mark.parametrize("registry", REGISTRIES, ids=lambda r: r.kind)
def test_every_key_and_alias_is_found_in_any_spelling(registry: Registry) -> None:
    for name in registry.names(aliases=True):
        key = registry.key(name)
        for spelling in _respell(name):
            assert registry.key(spelling) == key, (registry.kind, spelling)


@pytest.mark.parametrize("registry", REGISTRIES, ids=lambda r: r.kind)
def test_unknown_name_lists_closest(registry: Registry) -> None:
    first = registry.names()[0]
    wrong = first + "qq"
    with pytest.raises(LookupNameError) as caught:
        registry.lookup(wrong)
    text = str(caught.value)
    assert text.startswith(f"unknown {registry.kind} {wrong!r}")
    assert "closest:" in text and first in text


@given(st.text(max_size=30))
def test_normalise_is_idempotent(text: str) -> None:
    once = normalise(text)
    assert normalise(once) == once
    assert once == once.strip("_") and "__" not in once


@given(st.text(alphabet="abcXYZ -_/()", min_size=1, max_size=20))
def test_separators_do_not_matter_in_normal_form(text: str) -> None:
    assert normalise(text) == normalise(text.replace("-", " ").replace("/", "_").upper())


def test_two_names_that_normalise_alike_are_refused() -> None:
    with pytest.raises(DuplicateNameError):
        Registry("thing", {"hot_gas": 1, "Hot-Gas": 2})
    with pytest.raises(DuplicateNameError):
        Registry("thing", {"a": 1}, {"b": "missing"})
    with pytest.raises(DuplicateNameError):
        Registry("refrigerant", {"R-448A": 1, "R448A": 2}, compact=True)


def test_public_look_ups_go_through_one_normalisation() -> None:
    # The same spelling rule everywhere: case, blanks and hyphens never matter.
    assert materials.material("Glass Fibre") is materials.material("glass-fibre")
    assert products.get_product("Ice Cream") is products.get_product("ICE-CREAM")
    assert refrigerants.lookup("r 448 a") is refrigerants.lookup("R-448A")
    assert refrigerants.lookup("Carbon-Dioxide").name == "R-744"
    assert tubes.series("en 12735-1") is tubes.series("EN12735 1")
    assert infiltration.door_protection_effectiveness("Strip-Curtain") == infiltration.door_protection_effectiveness("strip curtain")
    assert totals.run_hours_for_defrost("HOT GAS") == totals.run_hours_for_defrost("hot_gas")
    assert product.packaging_specific_heat("Plastic-Crates") == product.packaging_specific_heat("plastic")
    assert property_model(Composition.from_water(0.8), -1.0, " Siebel ").latent_heat > 0
    assert Composition.from_water(0.75, "Protein").protein == pytest.approx(0.25)
    assert chang_tao_freezing_point(0.74, "Meat") == chang_tao_freezing_point(0.74, "meat")
    with pytest.raises(LookupNameError, match="closest: siebel"):
        property_model(Composition.from_water(0.8), -1.0, "siebl")
