"""Build the invented quote catalogue: project_files/catalogue/quote_catalogue.{yaml,csv}.

Run from the repository root: ``python tests/data/catalogue/_generate_quote.py``.

The demo catalogue's units and coils (``_generate.py``) with their electrical data, one unit
given by a rating table over SST × ambient, and every kind a quote draws on: panels, doors,
expansion valves, accessories, tube, insulation, refrigerant and labour. Every model, figure
and price is made up.
"""

from __future__ import annotations

import json
import sys
from pathlib import Path

ROOT = Path(__file__).resolve().parents[3]
sys.path.insert(0, str(ROOT))
sys.path.insert(0, str(Path(__file__).resolve().parent))

from _generate import RATING, to_csv  # noqa: E402
from _generate import data as demo_data  # noqa: E402

from coldroom.equipment import RatedPointCompressor  # noqa: E402
from coldroom.inputs.catalogue import catalogue_rows  # noqa: E402

# model -> supply, running current [A] or None (then estimated from power), locked-rotor current [A] or None
ELECTRICAL = {
    "DX-M12": ("230 V 1~ 50 Hz", 6.1, 27.0), "DX-M18": ("230 V 1~ 50 Hz", 8.4, 38.0),
    "DX-M25": ("400 V 3~ 50 Hz", 3.6, 20.0), "DX-M35": ("400 V 3~ 50 Hz", 4.9, 26.0),
    "DX-M50": ("400 V 3~ 50 Hz", 6.8, 36.0), "DX-L10": ("400 V 3~ 50 Hz", 3.9, 22.0),
    "DX-L16": ("400 V 3~ 50 Hz", 5.6, 30.0), "DX-L24": ("400 V 3~ 50 Hz", None, None),
    "DX-L35": ("400 V 3~ 50 Hz", 11.2, 58.0),
}
SST = [-35.0, -25.0, -15.0, -10.0, -5.0, 0.0]
AMBIENT = [20.0, 27.0, 32.0, 38.0, 43.0]
PANELS = [(80, 38.0), (100, 44.0), (120, 51.0), (150, 60.0), (200, 74.0)]
DOORS = [("HD-0820", 0.8, 2.0, 1450), ("HD-0920", 0.9, 2.0, 1580), ("HD-1021", 1.0, 2.1, 1790),
         ("SD-1221", 1.2, 2.1, 2650)]
VALVES = [  # model, refrigerant, rated capacity [W] at −10 °C / 38 °C, 1 K subcooling, price
    ("TXV-A05", "R-448A", 1500.0, 96), ("TXV-A10", "R-448A", 3000.0, 104), ("TXV-A20", "R-448A", 6000.0, 118),
    ("TXV-A35", "R-448A", 10500.0, 139), ("TXV-P05", "R-290", 1800.0, 112), ("TXV-P10", "R-290", 3600.0, 124),
]
ACCESSORIES = [  # model, role, connection [mm], price
    ("FD-052", "filter_drier", 6.0, 18), ("FD-032", "filter_drier", 8.0, 19), ("FD-053", "filter_drier", 10.0, 21), ("FD-084", "filter_drier", 12.0, 27),
    ("FD-165", "filter_drier", 15.0, 34), ("SG-06", "sight_glass", 6.0, 22), ("SG-08", "sight_glass", 8.0, 23), ("SG-10", "sight_glass", 10.0, 24),
    ("SG-12", "sight_glass", 12.0, 28), ("SG-15", "sight_glass", 15.0, 33), ("SV-06", "solenoid_valve", 6.0, 58),
    ("SV-08", "solenoid_valve", 8.0, 61),
    ("SV-10", "solenoid_valve", 10.0, 64), ("SV-12", "solenoid_valve", 12.0, 72), ("SV-15", "solenoid_valve", 15.0, 85),
    ("EPR-12", "pressure_regulator", 12.0, 145), ("EPR-15", "pressure_regulator", 15.0, 168),
    ("EPR-18", "pressure_regulator", 18.0, 184),
    ("EPR-22", "pressure_regulator", 22.0, 205),
]
ISOLATORS = [("ISO-4", 4000.0, 24), ("ISO-7", 7500.0, 31), ("ISO-15", 15000.0, 46)]  # AC-23A rating [W]
TUBES = [("6 x 1.0 mm", 4.9), ("8 x 1.0 mm", 5.8), ("10 x 1.0 mm", 6.9), ("12 x 1.0 mm", 8.2),
         ("15 x 1.0 mm", 10.1), ("18 x 1.0 mm", 12.6), ("22 x 1.0 mm", 15.4), ("28 x 1.0 mm", 19.8),
         ("35 x 1.5 mm", 29.5)]
INSULATION = [("12 x 1.0 mm", 13, 3.1), ("15 x 1.0 mm", 13, 3.4), ("18 x 1.0 mm", 19, 4.6),
              ("22 x 1.0 mm", 19, 5.2), ("28 x 1.0 mm", 19, 6.1), ("35 x 1.5 mm", 25, 8.3)]
REFRIGERANTS = [("R-448A", 96.0), ("R-290", 58.0)]
LABOUR = [("panels", 0.35, "m2"), ("door", 3.0, "item"), ("condensing_unit", 4.0, "item"),
          ("unit_cooler", 2.5, "item"), ("pipework", 0.6, "m"), ("electrical", 4.0, "system"),
          ("commissioning", 5.0, "system")]


def rating_table() -> dict:
    """An invented 2.4 kW R-448A unit: our rated-point model at SCT = ambient + 12 K, 10 K superheat."""
    comp = RatedPointCompressor.from_rating("R448A", 2400.0, -10.0, 45.0, superheat=10.0, subcooling=0.0,
                                            isentropic_efficiency=0.6, operating=RATING)
    rows = [[comp.performance(s, a + 12.0, check_envelope=False, discharge=False) for s in SST] for a in AMBIENT]
    return {
        "superheat": "10 K", "subcooling": "0 K",
        "evaporating_temperatures": SST, "ambient_temperatures": AMBIENT,
        "capacity": [[round(p.capacity, -1) for p in row] for row in rows],
        "power": [[round(p.power, -1) for p in row] for row in rows],
    }


def data() -> dict:
    d = demo_data()
    for unit in d["condensing_units"]:
        if unit["model"] in ELECTRICAL:
            supply, running, locked = ELECTRICAL[unit["model"]]
            unit["supply"] = supply
            if running is not None:
                unit["running_current"] = f"{running:g} A"
                unit["locked_rotor_current"] = f"{locked:g} A"
            else:
                unit["power_factor"] = 0.82
    d["condensing_units"].append({
        "model": "DX-T24 (rating table)", "refrigerant": "R-448A", "price": 1890, "rating_table": rating_table(),
        "fan_power": "90 W", "supply": "230 V 1~ 50 Hz", "power_factor": 0.85,
    })
    for cooler in d["unit_coolers"]:
        cooler["supply"] = "230 V 1~ 50 Hz"
    d["panels"] = [{"model": f"PIR-{t}", "thickness": f"{t} mm", "price": p} for t, p in PANELS]
    d["doors"] = [{"model": m, "width": f"{w:g} m", "height": f"{h:g} m", "price": p} for m, w, h, p in DOORS]
    d["expansion_valves"] = [
        {"model": m, "refrigerant": r, "rated_capacity": f"{q:g} W", "rated_evaporating_temperature": "-10 °C",
         "rated_condensing_temperature": "38 °C", "rated_subcooling": "1 K", "price": p}
        for m, r, q, p in VALVES
    ]
    d["accessories"] = [{"model": m, "role": r, "connection": f"{c:g} mm", "price": p} for m, r, c, p in ACCESSORIES]
    d["accessories"] += [{"model": m, "role": "isolator", "capacity": f"{q:g} W", "price": p} for m, q, p in ISOLATORS]
    d["tubes"] = [{"series": "EN 12735-1", "size": s, "price": p} for s, p in TUBES]
    d["insulation"] = [{"tube_size": s, "thickness": f"{t} mm", "price": p} for s, t, p in INSULATION]
    d["refrigerants"] = [{"refrigerant": r, "price": p} for r, p in REFRIGERANTS]
    d["labour"] = [{"task": t, "hours": h, "per": per} for t, h, per in LABOUR]
    return d


HEADER = """\
# Quote catalogue (invented): the demo catalogue's condensing units and unit coolers with
# their electrical data, one unit given by a rating table (SST x ambient, EN 13215 style),
# and everything else a quote prices: panels (per m²), doors, expansion valves, accessories,
# tube and insulation (per m), refrigerant (per kg) and labour hours. Made-up models and prices.
# For `coldroom quote PROJECT --catalogue quote_catalogue.yaml`; the same as a table: quote_catalogue.csv.
# Regenerate with: python tests/data/catalogue/_generate_quote.py
"""


def to_yaml(d: dict) -> str:
    out = [HEADER, f"currency: {d['currency']}\n"]
    for group, entries in d.items():
        if group == "currency":
            continue
        out.append(f"\n{group}:\n")
        for entry in entries:
            first = True
            for key, value in entry.items():
                lead = "  - " if first else "    "
                first = False
                if isinstance(value, dict):
                    out.append(f"{lead}{key}:\n")
                    for k, v in value.items():
                        out.append(f"      {k}: {json.dumps(v, ensure_ascii=False)}\n")
                else:
                    out.append(f"{lead}{key}: {json.dumps(value, ensure_ascii=False)}\n")
    return "".join(out)


def main() -> None:
    d = data()
    folder = ROOT / "project_files" / "catalogue"
    (folder / "quote_catalogue.yaml").write_text(to_yaml(d), encoding="utf-8")
    (folder / "quote_catalogue.csv").write_text(to_csv(catalogue_rows(d)), encoding="utf-8")


if __name__ == "__main__":
    main()
