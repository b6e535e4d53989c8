"""Issue 27's speed targets at job scale, each printed as a ratio measured in this one run.

Run by hand (not collected by pytest), from the repository with its venv::

    .venv/bin/python tests/benchmarks/bench_targets.py [--repeat 7] [--only NAME ...]

Every figure is a pair of whole processes run alternately (A B, B A, …; `_paired.py`): the
median of the pairs' CPU-time ratios is quoted with their min–max (the machine's noise), the
wall-time ratio beside it. The floor is ``python -c "import CoolProp.CoolProp"``. The disk
cache is a temporary folder of this run (``COLDROOM_CACHE_DIR``): "warm" runs find the chart
data there, "cold" runs get an empty folder each.

==========  =====================================================================  ======
name        figure                                                                 target
==========  =====================================================================  ======
warm        `size` one room / CoolProp import, warm cache                          ≤ 1.25
cold        `size` one room / CoolProp import, cold cache                          ≤ 1.45
check       `check` (the cooler-to-freezer demo) / CoolProp import                 ≤ 1.3
scale       `size` 50 rooms on 10 refrigerants / one room, warm                    ≤ 1.4
memory      the same 50 rooms' peak resident memory [MiB] (absolute)               ≤ 150
compare     `compare` 10 options over an hourly EPW year / one-room `size`         ≤ 1.0
select      `select` over 1,000 catalogue rows of each kind / one-room `size`      ≤ 1.15
quote       `quote` on the combo quote demo / `select` on the same (JSON each)     ≤ 1.15
==========  =====================================================================  ======

The one room is the produce-cooler demo (R-448A, the costliest chart data); its `size`
writes the PDF and the JSON. The 50 rooms are that room at 50 temperatures, five on each
of ten refrigerants. The compare project is the farm-shop demo with ten options (six
refrigerants, three panel thicknesses, one of both) over an invented 8760-hour EPW year.
The catalogue is the demo's rows scaled in size and price to 1,000 condensing units and
1,000 unit coolers; `select` writes its JSON and the sheet. A command the CLI does not have
yet is reported as not measured.
"""

from __future__ import annotations

import argparse
import copy
import re
import subprocess
import sys
import tempfile
from pathlib import Path

import yaml

sys.path.insert(0, str(Path(__file__).resolve().parent))

from _paired import paired, report, spread  # noqa: E402

REPO = Path(__file__).resolve().parents[2]
DEMOS = REPO / "project_files"
REFRIGERANTS = ("R-134a", "R-404A", "R-507A", "R-407A", "R-407C", "R-448A", "R-449A", "R-452A", "R-513A", "R-290")
TARGETS = {"warm": 1.25, "cold": 1.45, "check": 1.3, "scale": 1.4, "memory": 150.0, "compare": 1.0,
           "select": 1.15, "quote": 1.15}


def many_rooms(rooms: int) -> dict:
    """The produce-cooler demo with its room copied *rooms* times, distinct temperatures, ten refrigerants."""
    project = yaml.safe_load((DEMOS / "produce_cooler.yaml").read_text(encoding="utf-8"))
    template = project["rooms"][0]
    out = []
    for i in range(rooms):
        room = copy.deepcopy(template)
        t = 0.5 + 0.23 * i
        room["name"] = f"Cooler {i + 1:02d}"
        room["temperature"] = f"{t:.2f} °C"
        room["refrigeration"]["refrigerant"] = REFRIGERANTS[i % len(REFRIGERANTS)]
        for product in room.get("products", []):
            product["final_temperature"] = f"{t + 1.0:.2f} °C"
            product["entering_temperature"] = f"{t + 14.0:.2f} °C"
        out.append(room)
    project["rooms"] = out
    return project


def write_epw(path: Path) -> None:
    """An invented hourly year in EPW form (a seasonal and a daily sine)."""
    import math

    header = ["LOCATION,Benchville,BV,Nowhere,Invented,000000,51.5,-0.1,0.0,20.0", "DESIGN CONDITIONS,0",
              "TYPICAL/EXTREME PERIODS,0", "GROUND TEMPERATURES,0", "HOLIDAYS/DAYLIGHT SAVINGS,No,0,0,0",
              "COMMENTS 1,", "COMMENTS 2,", "DATA PERIODS,1,1,Data,Sunday, 1/ 1,12/31"]
    rows = []
    for h in range(8760):
        day, hour = divmod(h, 24)
        t = 10 + 9 * math.sin(2 * math.pi * (day - 110) / 365) + 5 * math.sin(2 * math.pi * (hour - 9) / 24)
        rows.append(f"1999,1,1,{hour + 1},60,flags,{t:.1f},5,70,101325")
    path.write_text("\n".join(header + rows) + "\n", encoding="utf-8")


def ten_options(folder: Path) -> Path:
    """The farm-shop demo over an invented EPW year with ten options."""
    write_epw(folder / "year.epw")
    text = (DEMOS / "farm_shop_options.yaml").read_text(encoding="utf-8")
    text = re.sub(r"  # hours per year.*?\n(?=\neconomics:)", "  weather: year.epw\n", text, flags=re.S)
    assert "weather: year.epw" in text
    project = yaml.safe_load(text)
    options = [{"name": r, "changes": {"systems.CU-1.refrigerant": r}}
               for r in ("R-290", "R-744", "R-134a", "R-449A", "R-513A", "R-454C")]
    options += [{"name": f"{mm} mm panels", "changes": {"constructions.panel_100.layers.0.thickness": f"{mm} mm"}}
                for mm in (120, 150, 200)]
    options.append({"name": "R-290 + 150 mm", "changes": {"systems.CU-1.refrigerant": "R-290",
                                                          "constructions.panel_100.layers.0.thickness": "150 mm"}})
    project["options"] = options
    path = folder / "options.yaml"
    path.write_text(yaml.safe_dump(project, allow_unicode=True, sort_keys=False), encoding="utf-8")
    return path


def _scaled(text: str, factor: float) -> str:
    number, unit = text.split(" ", 1)
    return f"{float(number) * factor:.6g} {unit}"


def big_catalogue(path: Path, rows: int) -> None:
    """The demo catalogue scaled to *rows* condensing units and *rows* unit coolers."""
    demo = yaml.safe_load((DEMOS / "catalogue" / "demo_catalogue.yaml").read_text(encoding="utf-8"))
    units, coolers = [], []
    for k in range(rows):
        scale = 0.6 + 0.05 * (k % 25)
        entry = copy.deepcopy(demo["condensing_units"][k % len(demo["condensing_units"])])
        entry["model"] = f"{entry['model']} x{k}"
        entry["price"] = round(entry["price"] * (0.7 + 0.3 * scale) + k % 7, 2)
        if "polynomial" in entry:
            entry["polynomial"]["capacity"] = [c * scale for c in entry["polynomial"]["capacity"]]
            entry["polynomial"]["power"] = [c * scale for c in entry["polynomial"]["power"]]
        else:
            for key in ("capacity", "power"):
                entry["rated_point"][key] = _scaled(entry["rated_point"][key], scale)
        if entry.get("condenser"):
            entry["condenser"]["heat_rejection"] = _scaled(entry["condenser"]["heat_rejection"], scale)
        units.append(entry)
        cooler = copy.deepcopy(demo["unit_coolers"][k % len(demo["unit_coolers"])])
        cooler["model"] = f"{cooler['model']} x{k}"
        cooler["price"] = round(cooler["price"] * (0.7 + 0.3 * scale) + k % 5, 2)
        cooler["capacity"] = _scaled(cooler["capacity"], scale)
        cooler["air_flow"] = _scaled(cooler["air_flow"], scale)
        coolers.append(cooler)
    demo["condensing_units"], demo["unit_coolers"] = units, coolers
    path.write_text(yaml.safe_dump(demo, allow_unicode=True, sort_keys=False), encoding="utf-8")


def has_command(name: str) -> bool:
    result = subprocess.run([sys.executable, "-m", "coldroom", name, "--help"], capture_output=True)
    return result.returncode == 0


def main() -> None:
    parser = argparse.ArgumentParser(description=__doc__.splitlines()[0])
    parser.add_argument("--repeat", type=int, default=7, help="pairs per figure (default 7)")
    parser.add_argument("--only", nargs="*", choices=sorted(TARGETS), help="measure only these figures")
    args = parser.parse_args()
    wanted = set(args.only or TARGETS)
    python = sys.executable
    coldroom = [python, "-m", "coldroom"]
    floor = [python, "-c", "import CoolProp.CoolProp"]
    with tempfile.TemporaryDirectory() as name:
        folder = Path(name)
        warm_cache = {"COLDROOM_CACHE_DIR": str(folder / "cache")}
        cold_count = [0]

        def cold_cache() -> dict:
            cold_count[0] += 1
            return {"COLDROOM_CACHE_DIR": str(folder / f"cold{cold_count[0]}")}

        one = DEMOS / "produce_cooler.yaml"

        def size(project: Path) -> list[str]:
            return coldroom + ["size", str(project), "--out", str(folder / f"{project.stem}.pdf"),
                               "--json", str(folder / f"{project.stem}.json"), "--force"]

        warm_size = lambda: (size(one), warm_cache)  # noqa: E731
        if "warm" in wanted:
            report("warm    size one room / import CoolProp, warm cache", paired(warm_size, floor, args.repeat),
                   TARGETS["warm"])
        if "cold" in wanted:
            report("cold    size one room / import CoolProp, cold cache",
                   paired(lambda: (size(one), cold_cache()), floor, args.repeat), TARGETS["cold"])
        if "check" in wanted:
            check = coldroom + ["check", str(DEMOS / "cooler_to_freezer.yaml"), "--json", str(folder / "check.json"),
                                "--force"]
            report("check   check demo / import CoolProp, warm cache",
                   paired(lambda: (check, warm_cache), floor, args.repeat), TARGETS["check"])
        if wanted & {"scale", "memory"}:
            fifty, first = folder / "fifty.yaml", folder / "first.yaml"
            fifty.write_text(yaml.safe_dump(many_rooms(50), allow_unicode=True, sort_keys=False), encoding="utf-8")
            first.write_text(yaml.safe_dump(many_rooms(1), allow_unicode=True, sort_keys=False), encoding="utf-8")
            pairs = paired(lambda: (size(fifty), warm_cache), lambda: (size(first), warm_cache), args.repeat)
            if "scale" in wanted:
                report("scale   size 50 rooms on 10 refrigerants / one room, warm", pairs, TARGETS["scale"])
            if "memory" in wanted:
                peaks = [a.peak_mib for a, _ in pairs]
                import statistics

                median = statistics.median(peaks)
                print(f"memory  size 50 rooms, peak resident memory: {spread(peaks)} MiB (one room "
                      f"{statistics.median(b.peak_mib for _, b in pairs):.0f} MiB)  target <= 150 MiB: "
                      f"{'met' if median <= TARGETS['memory'] else 'NOT met'}")
        if "compare" in wanted:
            options = ten_options(folder)
            compare = coldroom + ["compare", str(options), "--json", str(folder / "compare.json"), "--force"]
            report("compare compare 10 options, 8760 h / size one room",
                   paired(lambda: (compare, warm_cache), warm_size, args.repeat), TARGETS["compare"])
        if wanted & {"select", "quote"}:
            catalogue = folder / "catalogue.yaml"
            big_catalogue(catalogue, 1000)
            select = coldroom + ["select", str(one), "--catalogue", str(catalogue), "--json",
                                 str(folder / "select.json"), "--out", str(folder / "select.pdf"), "--force"]
            if "select" in wanted:
                report("select  select over 1,000 rows of each kind / size one room",
                       paired(lambda: (select, warm_cache), warm_size, args.repeat), TARGETS["select"])
            if "quote" in wanted:
                if not has_command("quote"):
                    print("quote   not measured: this coldroom has no `quote` command")
                else:
                    combo = DEMOS / "combo_quote.yaml"
                    prices = DEMOS / "catalogue" / "quote_catalogue.yaml"
                    quote = coldroom + ["quote", str(combo), "--catalogue", str(prices), "--json",
                                        str(folder / "quote.json"), "--force"]
                    select_combo = coldroom + ["select", str(combo), "--catalogue", str(prices), "--json",
                                               str(folder / "combo.json"), "--force"]
                    report("quote   quote combo demo / select combo demo",
                           paired(lambda: (quote, warm_cache), lambda: (select_combo, warm_cache), args.repeat),
                           TARGETS["quote"])


if __name__ == "__main__":
    main()
