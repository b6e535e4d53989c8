"""The project file: safe YAML → pydantic models → a typed project in SI.

This is the only package that reads YAML (through :mod:`coldroom.inputs.safeyaml`).
Every quantity in the file accepts a bare number in the project's unit system
(``project.units: SI`` or ``IP``) or a string with a unit (``"100 mm"``,
``"35 °F"``, ``"2.5 kW"``); after validation every field holds a plain float in
SI (temperatures in °C, durations in s unless the field says otherwise).

Errors are raised as :class:`coldroom.errors.ProjectFileError` carrying the
file, line, column and dotted key, printed by the CLI as
``file:line:col: dotted.key: message``.

Layout of a project file (all keys are ours; see ``coldroom new``)::

    project:      name, client, site, prepared_by, date, units
    design:       outdoor_temperature, outdoor_rh | outdoor_wet_bulb,
                  ground_temperature, altitude | barometric_pressure, hemisphere
    constructions: {name: {layers: [...]} | {u_value: ...}}
    rooms:        [room, ...]
    systems:      [{name, rooms: [room names], refrigerant, condenser settings, diversity}, ...]
    economics:    electricity_price, currency, emission_factor, service_life, leakage_rate, recovery_factor
    quote:        margin, tax_rate, labour_rate, validity, exclusions, terms, electrical_code (coldroom quote)
    options:      [{name, note, changes: {dotted.path: value}}, ...]  (see coldroom.inputs.options)

One module per part of the file; this package re-exports the names callers use:

- ``quantities``: ``Q(kind, …)`` quantity fields, the named field types, ``Strict``;
- ``site``: the ``project`` header and the ``design`` conditions;
- ``envelope``: constructions, the six surfaces, dimensions, doors, infiltration;
- ``contents``: products, people, lighting, fans, appliances, defrost;
- ``refrigeration``: pipework, charge, condensing settings, systems, an existing unit;
- ``schedule``: the design day hour by hour and the pull-down options;
- ``room``: one room and its derived geometry;
- ``model``: the whole project (``ProjectModel``), economics, options, system groups;
- ``quote``: the ``quote:`` block (``QuoteSettings``);
- ``parsing``: validation with located errors, the JSON Schema.

Examples
--------
>>> from coldroom.inputs.opening import open_project_text
>>> p = open_project_text('''
... project: {name: Demo, units: SI}
... design: {outdoor_temperature: 30, outdoor_rh: 50 %, ground_temperature: 12}
... constructions:
...   panel: {layers: [{material: pur_panel, thickness: 100 mm}]}
... rooms:
...   - name: Cooler
...     temperature: 2
...     rh: 85 %
...     dimensions: {length: 4, width: 3, height: 2.6}
...     envelope:
...       walls: {construction: panel, facing: space, temperature: 20}
...       ceiling: {construction: panel, facing: space, temperature: 25}
...       floor: {construction: panel, facing: ground}
... ''')
>>> p.rooms[0].envelope.floor.facing
'ground'
>>> round(p.rooms[0].surface_area("north"), 2)
10.4
"""

from __future__ import annotations

from coldroom.inputs.projectfile.quantities import (
    Q,
    Fraction,
    HoursPerDay,
    Length,
    Mass,
    Name,
    Notes,
    OutdoorTemperature,
    Power,
    Rating,
    RelativeHumidity,
    RoomTemperature,
    Strict,
    Temperature,
    Thickness,
)
from coldroom.inputs.projectfile.site import AmbientBinEntry, DesignConditions, ProjectInfo
from coldroom.inputs.projectfile.envelope import (
    SIDES,
    WALLS,
    Construction,
    Dimensions,
    Door,
    Envelope,
    Infiltration,
    Layer,
    Surface,
)
from coldroom.inputs.projectfile.contents import (
    Appliance,
    Defrost,
    Fans,
    Lighting,
    Packaging,
    People,
    Product,
    ProductProperties,
)
from coldroom.inputs.projectfile.refrigeration import (
    ROOM_LEVEL_KEYS,
    ChargeSettings,
    CompressorPolynomial,
    CondenserRating,
    CondensingSettings,
    ExistingUnit,
    FittingKind,
    GridRows,
    GridTemperatures,
    PipeRun,
    Piping,
    PolynomialCoefficients,
    RatedPoint,
    RatingTable,
    Refrigeration,
    System,
    UnitCoolerRating,
)
from coldroom.inputs.projectfile.schedule import Delivery, DoorWindow, HourOfDay, Pulldown, Schedule, Window
from coldroom.inputs.projectfile.room import Room
from coldroom.inputs.projectfile.model import Economics, Option, ProjectModel
from coldroom.inputs.projectfile.quote import QuoteSettings
from coldroom.inputs.projectfile.parsing import error_at, json_schema, parse_project_data

__all__ = [
    "AmbientBinEntry",
    "Appliance",
    "ChargeSettings",
    "CompressorPolynomial",
    "CondenserRating",
    "CondensingSettings",
    "Construction",
    "Defrost",
    "Delivery",
    "DesignConditions",
    "Dimensions",
    "Door",
    "DoorWindow",
    "Economics",
    "Envelope",
    "ExistingUnit",
    "Fans",
    "FittingKind",
    "GridRows",
    "GridTemperatures",
    "Fraction",
    "HourOfDay",
    "HoursPerDay",
    "Infiltration",
    "Layer",
    "Length",
    "Lighting",
    "Mass",
    "Name",
    "Notes",
    "Option",
    "OutdoorTemperature",
    "Packaging",
    "People",
    "PipeRun",
    "Piping",
    "PolynomialCoefficients",
    "Power",
    "Product",
    "ProductProperties",
    "ProjectInfo",
    "ProjectModel",
    "Pulldown",
    "Q",
    "QuoteSettings",
    "ROOM_LEVEL_KEYS",
    "RatedPoint",
    "RatingTable",
    "Rating",
    "Refrigeration",
    "RelativeHumidity",
    "Room",
    "RoomTemperature",
    "SIDES",
    "Schedule",
    "Strict",
    "Surface",
    "System",
    "Temperature",
    "Thickness",
    "UnitCoolerRating",
    "WALLS",
    "Window",
    "error_at",
    "json_schema",
    "parse_project_data",
]
