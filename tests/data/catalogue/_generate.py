"""Build the invented demo catalogue: project_files/catalogue/demo_catalogue.{yaml,csv,xlsx}.

Run from the repository root: ``python tests/data/catalogue/_generate.py``.

Every model, figure and price is made up. The condensing units' EN 12900
polynomials are least-squares fits (ten coefficients, °C and W) to our own
rated-point compressor model (:class:`coldroom.equipment.RatedPointCompressor`)
over each unit's envelope, at the EN 12900 rating conditions 10 K superheat and
0 K subcooling [mem]; two units are given by one rated point instead.
"""

from __future__ import annotations

import csv
import io
import sys
from pathlib import Path

import numpy as np

ROOT = Path(__file__).resolve().parents[3]
sys.path.insert(0, str(ROOT))

from coldroom.inputs.catalogue import catalogue_rows  # noqa: E402
from coldroom.equipment import OperatingConditions, RatedPointCompressor  # noqa: E402

RATING = OperatingConditions(superheat=10.0, suction_line_superheat=0.0, subcooling=0.0)
MT = dict(rating=(-10.0, 45.0), envelope=(-25.0, 10.0, 25.0, 60.0), efficiency=0.62)
LT = dict(rating=(-35.0, 40.0), envelope=(-45.0, -10.0, 25.0, 55.0), efficiency=0.58)

# model, refrigerant, class, rated capacity [W] at the class rating point, price, condenser THR [W] at 15 K, fans [W]
UNITS = [
    ("DX-M12", "R-448A", MT, 1200.0, 1490, 2400.0, 60),
    ("DX-M18", "R-448A", MT, 1800.0, 1690, 3400.0, 75),
    ("DX-M25", "R-448A", MT, 2500.0, 1980, 4600.0, 90),
    ("DX-M35", "R-448A", MT, 3500.0, 2390, 6300.0, 120),
    ("DX-M50", "R-448A", MT, 5000.0, 2950, 9000.0, 2 * 90),
    ("DX-L10", "R-448A", LT, 1000.0, 2180, 2600.0, 75),
    ("DX-L16", "R-448A", LT, 1600.0, 2560, 4000.0, 90),
    ("DX-L24", "R-448A", LT, 2400.0, 3090, 5800.0, 120),
    ("DX-L35", "R-448A", LT, 3500.0, 3780, 8200.0, 2 * 90),
    ("DP-M15", "R-290", MT, 1500.0, 1820, 2900.0, 75),
    ("DP-M30", "R-290", MT, 3000.0, 2460, 5500.0, 120),
    ("DP-L12", "R-290", LT, 1200.0, 2490, 3000.0, 75),
    ("DP-L25", "R-290", LT, 2500.0, 3350, 6000.0, 120),
]
RATED_POINT_UNITS = [
    # one nameplate point only (no envelope): model, refrigerant, S, D, capacity, power, price, THR, fans
    ("OLD-M28 (rated point)", "R-448A", -10.0, 45.0, 2800.0, 1450.0, 1750, 5200.0, 120),
    ("OLD-L20 (rated point)", "R-448A", -35.0, 40.0, 2000.0, 1900.0, 2690, 5000.0, 120),
]
# model, capacity [W], air on, evaporating, air flow [m³/h], throw [m], fans [W], defrost, heater [W], fins [mm], price
COOLERS = [
    ("UC-C10", 1000.0, 0.0, -8.0, 700.0, 5.0, 1 * 35, "off_cycle", 0.0, 4.0, 390),
    ("UC-C16", 1600.0, 0.0, -8.0, 1100.0, 7.0, 1 * 60, "off_cycle", 0.0, 4.0, 470),
    ("UC-C25", 2500.0, 0.0, -8.0, 1700.0, 9.0, 2 * 45, "off_cycle", 0.0, 4.0, 610),
    ("UC-C35", 3500.0, 0.0, -8.0, 2400.0, 11.0, 2 * 60, "off_cycle", 0.0, 4.0, 760),
    ("UC-C50", 5000.0, 0.0, -8.0, 3500.0, 14.0, 3 * 60, "off_cycle", 0.0, 4.0, 990),
    ("UC-CE20", 2000.0, 0.0, -8.0, 1400.0, 8.0, 2 * 45, "electric", 900.0, 4.5, 640),
    ("UC-F08", 800.0, -18.0, -25.0, 800.0, 5.0, 1 * 60, "electric", 900.0, 6.0, 610),
    ("UC-F13", 1300.0, -18.0, -25.0, 1300.0, 7.0, 2 * 45, "electric", 1400.0, 6.0, 720),
    ("UC-F20", 2000.0, -18.0, -25.0, 1900.0, 9.0, 2 * 60, "electric", 2000.0, 7.0, 890),
    ("UC-F30", 3000.0, -18.0, -25.0, 2800.0, 12.0, 3 * 60, "electric", 2900.0, 7.0, 1140),
    ("UC-FH25", 2500.0, -18.0, -25.0, 2300.0, 10.0, 2 * 60, "hot_gas", 0.0, 7.0, 980),
    ("UC-FN15", 1500.0, -18.0, -25.0, 1400.0, 8.0, 2 * 45, "electric", 1500.0, 3.5, 600),
]


def fit(refrigerant: str, cls: dict, capacity: float) -> dict:
    s_r, d_r = cls["rating"]
    comp = RatedPointCompressor.from_rating(
        refrigerant, capacity, s_r, d_r, superheat=10.0, subcooling=0.0,
        isentropic_efficiency=cls["efficiency"], operating=RATING,
    )
    s_min, s_max, d_min, d_max = cls["envelope"]
    rows, q, p = [], [], []
    for s in np.linspace(s_min, s_max, 8):
        for d in np.linspace(d_min, d_max, 8):
            point = comp.performance(float(s), float(d), check_envelope=False, discharge=False)
            rows.append([1, s, d, s * s, s * d, d * d, s ** 3, d * s * s, s * d * d, d ** 3])
            q.append(point.capacity)
            p.append(point.power)
    a = np.array(rows)
    cq = np.linalg.lstsq(a, np.array(q), rcond=None)[0]
    cp = np.linalg.lstsq(a, np.array(p), rcond=None)[0]
    return {
        "units": "SI",
        "capacity": [float(f"{c:.6g}") for c in cq],
        "power": [float(f"{c:.6g}") for c in cp],
        "superheat": "10 K",
        "subcooling": "0 K",
        "suction_min": f"{s_min:g} °C",
        "suction_max": f"{s_max:g} °C",
        "discharge_min": f"{d_min:g} °C",
        "discharge_max": f"{d_max:g} °C",
    }


def data() -> dict:
    units = []
    for model, refrigerant, cls, capacity, price, thr, fans in UNITS:
        units.append({
            "model": model, "refrigerant": refrigerant, "price": price,
            "polynomial": fit(refrigerant, cls, capacity),
            "condenser": {"heat_rejection": f"{thr:g} W", "temperature_difference": "15 K"},
            "fan_power": f"{fans} W",
        })
    for model, refrigerant, s, d, capacity, power, price, thr, fans in RATED_POINT_UNITS:
        units.append({
            "model": model, "refrigerant": refrigerant, "price": price,
            "rated_point": {
                "capacity": f"{capacity:g} W", "evaporating_temperature": f"{s:g} °C",
                "condensing_temperature": f"{d:g} °C", "superheat": "10 K", "subcooling": "0 K",
                "power": f"{power:g} W",
            },
            "condenser": {"heat_rejection": f"{thr:g} W", "temperature_difference": "15 K"},
            "fan_power": f"{fans} W",
        })
    coolers = []
    for model, cap, air_on, evap, flow, throw, fans, defrost, heater, fins, price in COOLERS:
        coolers.append({
            "model": model, "capacity": f"{cap:g} W", "air_on": f"{air_on:g} °C",
            "evaporating_temperature": f"{evap:g} °C", "air_flow": f"{flow:g} m³/h", "throw": f"{throw:g} m",
            "fan_power": f"{fans} W", "defrost": defrost, "defrost_heater_power": f"{heater:g} W",
            "fin_spacing": f"{fins:g} mm", "price": price,
        })
    return {"currency": "EUR", "condensing_units": units, "unit_coolers": coolers}


HEADER = """\
# Demo equipment catalogue (invented): condensing units and unit coolers of made-up
# makes with made-up prices, for `coldroom select PROJECT --catalogue demo_catalogue.yaml`.
# The same list as a table: demo_catalogue.csv and demo_catalogue.xlsx.
# Polynomials: EN 12900 form, °C and W, rated at 10 K superheat and 0 K subcooling.
# Unit coolers: capacity at the stated air-on and evaporating temperatures (DT1).
# Regenerate with: python tests/data/catalogue/_generate.py
"""


def to_yaml(d: dict) -> str:
    import json

    out = [HEADER, f"currency: {d['currency']}\n"]
    for group in ("condensing_units", "unit_coolers"):
        out.append(f"\n{group}:\n")
        for entry in d[group]:
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


def to_csv(rows: list) -> str:
    buffer = io.StringIO()
    writer = csv.writer(buffer, lineterminator="\n")
    for row in rows:
        writer.writerow(["" if v is None else v for v in row])
    return buffer.getvalue()


def to_xlsx(rows: list, path: Path) -> None:
    import openpyxl

    book = openpyxl.Workbook()
    sheet = book.active
    sheet.title = "catalogue"
    for row in rows:
        sheet.append(row)
    book.save(path)


def main() -> None:
    d = data()
    rows = catalogue_rows(d)
    (ROOT / "project_files" / "catalogue" / "demo_catalogue.yaml").write_text(to_yaml(d), encoding="utf-8")
    (ROOT / "project_files" / "catalogue" / "demo_catalogue.csv").write_text(to_csv(rows), encoding="utf-8")
    to_xlsx(rows, ROOT / "project_files" / "catalogue" / "demo_catalogue.xlsx")


if __name__ == "__main__":
    main()
