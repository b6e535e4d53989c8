"""What is inside the room: products and packaging, people, lighting, fans, appliances and defrost."""

from __future__ import annotations

from typing import Literal, Optional

from pydantic import Field, model_validator

from coldroom.constants import SECONDS_PER_DAY_S
from coldroom.inputs.projectfile.quantities import Fraction, HoursPerDay, Mass, Name, Power, Q, Strict, Temperature


class ProductProperties(Strict):
    """Explicit properties for a product not in the table.

    Give ``water_content`` (Siebel's formulas), or the specific heats and latent heat.
    """

    water_content: Optional[Fraction] = None
    specific_heat_above: Optional[Q("specific_heat", gt=0.0, le=10e3)] = None  # type: ignore[valid-type]
    specific_heat_below: Optional[Q("specific_heat", gt=0.0, le=10e3)] = None  # type: ignore[valid-type]
    latent_heat: Optional[Q("specific_energy", ge=0.0, le=400e3)] = None  # type: ignore[valid-type]
    freezing_point: Temperature = -1.0

    @model_validator(mode="after")
    def _enough(self) -> "ProductProperties":
        explicit = (self.specific_heat_above, self.specific_heat_below, self.latent_heat)
        if self.water_content is None and any(v is None for v in explicit):
            raise ValueError(
                "give water_content, or all of specific_heat_above, specific_heat_below and latent_heat"
            )
        return self


class Packaging(Strict):
    """Packaging brought in with the daily intake."""

    mass: Mass = 0.0
    material: Literal["corrugated_board", "wood", "plastic", "other"] = "corrugated_board"
    specific_heat: Optional[Q("specific_heat", gt=0.0, le=5e3)] = None  # type: ignore[valid-type]
    pack: Optional[Literal["loose", "crate", "carton", "pallet"]] = Field(
        default=None,
        description="How the product is packed, for its half-cooling time in the pull-down (default from the "
        "material: corrugated_board carton, wood or plastic crate).",
    )
    pack_mass: Optional[Q("mass", gt=0.0, le=2000.0)] = Field(  # type: ignore[valid-type]
        default=None, description="Product mass of one pack; the half-cooling time scales with its cube root."
    )


class Product(Strict):
    """A product: named from the table or with explicit properties, and its daily movement."""

    product: Optional[str] = None
    properties: Optional[ProductProperties] = None
    daily_intake: Mass = 0.0
    entering_temperature: Optional[Temperature] = None
    final_temperature: Optional[Temperature] = None
    # ≥ 1 h: no walk-in room pulls product down faster (a blast chiller takes about 90 min) [trade]
    pulldown_time: Q("time", si="h", ip="h", ge=3600.0, le=7 * SECONDS_PER_DAY_S) = SECONDS_PER_DAY_S  # type: ignore[valid-type]
    packaging: Optional[Packaging] = None
    stored_mass: Mass = 0.0
    half_cooling_time: Optional[Q("time", si="h", ip="h", ge=600.0, le=7 * SECONDS_PER_DAY_S)] = Field(  # type: ignore[valid-type]
        default=None,
        description="Time for the product's excess over the room air to halve (pull-down); default from its "
        "pack type and size.",
    )

    @model_validator(mode="after")
    def _check(self) -> "Product":
        if (self.product is None) == (self.properties is None):
            raise ValueError("give a product either a table name (product) or properties (exactly one)")
        if self.product is not None:
            from coldroom.physics import products

            products.get_product(self.product)
        if self.daily_intake > 0 and (self.entering_temperature is None or self.final_temperature is None):
            raise ValueError("a daily_intake needs entering_temperature and final_temperature")
        return self


# --- internal loads -------------------------------------------------------------------------


class People(Strict):
    count: float = Field(default=0.0, ge=0.0, le=200.0)
    hours: HoursPerDay = 0.0


class Lighting(Strict):
    """Lighting by power density (``power_density``) or total ``power``."""

    power_density: Optional[Q("power_per_area", ge=0.0, le=100.0)] = None  # type: ignore[valid-type]
    power: Optional[Power] = None
    hours: HoursPerDay = 0.0

    @model_validator(mode="after")
    def _one_of(self) -> "Lighting":
        if (self.power_density is None) == (self.power is None):
            raise ValueError("give lighting either power_density or power (exactly one)")
        return self


class Fans(Strict):
    """Evaporator fan motors. In the air stream the whole input counts."""

    count: float = Field(default=1.0, ge=0.0, le=100.0)
    power: Power = 0.0
    hours: HoursPerDay = SECONDS_PER_DAY_S
    in_air_stream: bool = True
    motor_efficiency: Fraction = 0.6


class Appliance(Strict):
    """Forklift, pallet truck, heater (door frame, drain line) or other equipment."""

    name: Name = Field(min_length=1, max_length=100)
    kind: Literal["equipment", "forklift", "heater"] = "equipment"
    power: Power
    hours: HoursPerDay = SECONDS_PER_DAY_S
    count: float = Field(default=1.0, ge=0.0, le=100.0)


class Defrost(Strict):
    """Defrost: type, frequency, duration, heater power and the share of it reaching the room."""

    type: Literal["off_cycle", "electric", "hot_gas"] = "off_cycle"
    per_day: float = Field(default=4.0, ge=0.0, le=24.0)
    duration: Q("time", si="min", ip="min", ge=0.0, le=7200.0) = 1800.0  # type: ignore[valid-type]
    heater_power: Power = 0.0
    share_to_room: Fraction = Field(default=0.5, description="Share of the heater energy reaching the room (trade 50–100 %).")
