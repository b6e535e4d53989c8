"""`coldroom compare` of the base + 4 options over 8760 EPW hours vs one `coldroom size` of the base.

Run by hand (not collected by pytest)::

    .venv/bin/python tests/benchmarks/bench_compare.py [--repeat N]

The demo ``project_files/farm_shop_options.yaml`` is copied with its ambient bins replaced by
an invented EPW year (8760 hourly rows written here). Both commands are timed as whole
processes in the same run (median of N, default 3): ``coldroom size`` (PDF + JSON) and
``coldroom compare`` (JSON). Target: ratio ≤ 2.
"""

from __future__ import annotations

import argparse
import math
import re
import statistics
import subprocess
import sys
import tempfile
import time
from pathlib import Path

REPO = Path(__file__).resolve().parents[2]
DEMO = REPO / "project_files" / "farm_shop_options.yaml"


def timed(command: list[str]) -> float:
    start = time.perf_counter()
    subprocess.run(command, check=True, stdout=subprocess.DEVNULL, stderr=subprocess.DEVNULL)
    return time.perf_counter() - start


def write_epw(path: Path) -> None:
    header = ["LOCATION,Benchville,BV,Nowhere,Invented,000000,51.5,-0.1,0.0,20.0", "DESIGN CONDITIONS,0",
              "TYPICAL/EXTREME PERIODS,0", "GROUND TEMPERATURES,0", "HOLIDAYS/DAYLIGHT SAVINGS,No,0,0,0",
              "COMMENTS 1,", "COMMENTS 2,", "DATA PERIODS,1,1,Data,Sunday, 1/ 1,12/31"]
    rows = []
    for h in range(8760):
        day, hour = divmod(h, 24)
        t = 10 + 9 * math.sin(2 * math.pi * (day - 110) / 365) + 5 * math.sin(2 * math.pi * (hour - 9) / 24)
        rows.append(f"1999,1,1,{hour + 1},60,flags,{t:.1f},5,70,101325")
    path.write_text("\n".join(header + rows) + "\n", encoding="utf-8")


def main() -> None:
    parser = argparse.ArgumentParser(description=__doc__.splitlines()[0])
    parser.add_argument("--repeat", type=int, default=3)
    args = parser.parse_args()
    python = sys.executable
    with tempfile.TemporaryDirectory() as folder:
        f = Path(folder)
        write_epw(f / "year.epw")
        text = DEMO.read_text(encoding="utf-8")
        text = re.sub(r"  # hours per year.*?\n(?=\neconomics:)", "  weather: year.epw\n", text, flags=re.S)
        assert "weather: year.epw" in text
        project = f / "project.yaml"
        project.write_text(text, encoding="utf-8")
        size = [python, "-m", "coldroom", "size", str(project), "--out", str(f / "s.pdf"), "--json",
                str(f / "s.json"), "--force"]
        compare = [python, "-m", "coldroom", "compare", str(project), "--json", str(f / "c.json"), "--force"]
        timed(size)
        timed(compare)
        size_times, compare_times = [], []
        for _ in range(args.repeat):  # interleaved, so load on the machine hits both alike
            size_times.append(timed(size))
            compare_times.append(timed(compare))
    s, c = statistics.median(size_times), statistics.median(compare_times)
    print(f"coldroom size (base, PDF + JSON):           {s:.3f} s (median of {args.repeat})")
    print(f"coldroom compare (base + 4 options, 8760 h): {c:.3f} s (median of {args.repeat})")
    print(f"ratio: {c / s:.2f}  (target <= 2)")


if __name__ == "__main__":
    main()
