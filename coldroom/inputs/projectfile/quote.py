"""The ``quote:`` block: the commercial terms of ``coldroom quote`` (see :mod:`coldroom.design.quote`)."""

from __future__ import annotations

from typing import Annotated, Literal, Optional

from pydantic import Field

from coldroom.inputs.projectfile.quantities import Q, Strict


class QuoteSettings(Strict):
    """The commercial terms of ``coldroom quote`` (prices in the currency of ``economics`` / the catalogue).

    ``margin`` is added to the bill of quantities' subtotal, ``tax_rate`` to the subtotal plus margin.
    """

    margin: Q("fraction", si="%", ip="%", ge=0.0, le=5.0) = 0.0  # type: ignore[valid-type]
    tax_rate: Q("fraction", si="%", ip="%", ge=0.0, le=1.0) = 0.0  # type: ignore[valid-type]
    labour_rate: float = Field(default=0.0, ge=0.0, le=10000.0, description="Currency units per hour.")
    validity: int = Field(default=30, ge=1, le=365, description="Days the offer stands.")
    exclusions: list[Annotated[str, Field(min_length=1, max_length=300)]] = Field(default_factory=list, max_length=30)
    terms: str = Field(default="", max_length=4000)
    electrical_code: Literal["NEC", "IEC"] = "IEC"
    tube_allowance: Q("fraction", si="%", ip="%", ge=0.0, le=1.0) = Field(  # type: ignore[valid-type]
        default=0.10, description="Added to the piping lengths for offcuts and bends (10 % [trade])."
    )
    distributor_pressure_drop: Optional[Q("pressure", ge=0.0, le=500e3)] = Field(  # type: ignore[valid-type]
        default=None, description="Across a coil's liquid distributor, taken off the valve's pressure drop "
        "(default 1 bar [trade] on coils with a distributor)."
    )
