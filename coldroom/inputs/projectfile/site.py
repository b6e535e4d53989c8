"""The project header (who and where) and the site's design conditions (outdoor air, ground, pressure, weather)."""

from __future__ import annotations

import datetime as _dt
from typing import Any, Literal, Optional

from pydantic import Field, field_validator, model_validator
from pydantic_core import PydanticCustomError

from coldroom.inputs.projectfile.quantities import Name, Notes, OutdoorTemperature, Q, RelativeHumidity, Strict, Temperature


class ProjectInfo(Strict):
    """Who and where: printed in the sheet's header."""

    name: Name = Field(min_length=1, max_length=200)
    client: Name = Field(default="", max_length=200)
    site: Name = Field(default="", max_length=200)
    prepared_by: Name = Field(default="", max_length=200)
    date: Optional[str] = Field(
        default=None,
        description="ISO date YYYY-MM-DD printed on the sheet; when omitted, SOURCE_DATE_EPOCH or today.",
    )
    units: Literal["SI", "IP"] = "SI"
    notes: Notes = Field(default="", max_length=2000)

    @field_validator("date", mode="before")
    @classmethod
    def _date(cls, value: Any) -> Any:
        if value is None:
            return None
        if isinstance(value, (_dt.date, _dt.datetime)):
            return value.isoformat()[:10]
        try:
            return _dt.date.fromisoformat(str(value)).isoformat()
        except ValueError:
            raise PydanticCustomError(
                "coldroom_date", "{value} is not a date; write YYYY-MM-DD", {"value": repr(value)}
            ) from None


class AmbientBinEntry(Strict):
    """Hours per year at one ambient temperature (``design.ambient_bins``)."""

    temperature: Q("temperature", ge=-60.0, le=60.0)  # type: ignore[valid-type]
    hours: float = Field(ge=0.0, le=8784.0)


class DesignConditions(Strict):
    """Site design conditions.

    Give the outdoor humidity as ``outdoor_rh`` or ``outdoor_wet_bulb`` (not
    both), and the site's pressure as ``altitude`` or ``barometric_pressure``
    (default: sea level, 101.325 kPa).
    """

    outdoor_temperature: OutdoorTemperature
    outdoor_rh: Optional[RelativeHumidity] = None
    outdoor_wet_bulb: Optional[OutdoorTemperature] = None
    ground_temperature: Temperature = Field(
        default=12.0, description="Annual mean ground temperature under slabs [°C] (10–15 °C typical [trade])."
    )
    altitude: Optional[Q("length", ge=-500.0, le=5000.0)] = None  # type: ignore[valid-type]
    barometric_pressure: Optional[Q("pressure", ge=50e3, le=110e3)] = None  # type: ignore[valid-type]
    hemisphere: Literal["north", "south"] = "north"
    daily_range: Q("temperature_difference", ge=0.0, le=30.0) = Field(  # type: ignore[valid-type]
        default=0.0,
        description="Design-day dry-bulb daily range (mean daily range of the warmest month) [K]; "
        "0 keeps the outdoor air at the design dry bulb all day (see coldroom.loads.hourly).",
    )

    weather: Optional[str] = Field(
        default=None,
        min_length=1,
        max_length=500,
        description="EPW weather file for the annual energy (`coldroom compare`); relative to the project file.",
    )
    ambient_bins: Optional[list["AmbientBinEntry"]] = Field(
        default=None,
        min_length=1,
        max_length=200,
        description="Hours per year at each ambient temperature (instead of a weather file); 8760 h ± 1 %.",
    )

    @model_validator(mode="after")
    def _one_of(self) -> "DesignConditions":
        if self.weather is not None and self.ambient_bins is not None:
            raise ValueError("give weather (an EPW file) or ambient_bins, not both")
        if self.ambient_bins is not None:
            from coldroom.inputs.weather import AmbientBin, year_hours_error

            problem = year_hours_error([AmbientBin(b.temperature, b.hours) for b in self.ambient_bins])
            if problem is not None:
                raise ValueError(f"ambient_bins: {problem}")
        if self.outdoor_rh is not None and self.outdoor_wet_bulb is not None:
            raise ValueError("give outdoor_rh or outdoor_wet_bulb, not both")
        if self.outdoor_rh is None and self.outdoor_wet_bulb is None:
            raise ValueError("give the outdoor humidity as outdoor_rh or outdoor_wet_bulb")
        if self.altitude is not None and self.barometric_pressure is not None:
            raise ValueError("give altitude or barometric_pressure, not both")
        return self
