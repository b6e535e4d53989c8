"""Cost of `coldroom size` at job scale: a generated project of 50 rooms at 50
distinct room temperatures against one of its rooms alone.

Run by hand (not collected by pytest)::

    .venv/bin/python tests/benchmarks/bench_scale.py [--rooms 50] [--repeat 3]

The project is the produce-cooler demo with its room copied N times, each at
its own temperature (0.5 °C upwards in 0.23 K steps, products' final
temperatures following); the one-room project is its first room. Both are
sized as whole processes, interleaved so load on the machine hits both alike;
each child's wall time and peak resident memory (``os.wait4``) are recorded.
Targets: time ratio ≤ 2, peak-memory ratio ≤ 1.5.
"""

from __future__ import annotations

import argparse
import copy
import os
import statistics
import subprocess
import sys
import tempfile
import time
from pathlib import Path

import yaml

REPO = Path(__file__).resolve().parents[2]
DEMO = REPO / "project_files" / "produce_cooler.yaml"


def generate(rooms: int) -> dict:
    """The demo project with its room copied *rooms* times at distinct temperatures."""
    project = yaml.safe_load(DEMO.read_text(encoding="utf-8"))
    template = project["rooms"][0]
    out = []
    for i in range(rooms):
        room = copy.deepcopy(template)
        t = 0.5 + 0.23 * i
        room["name"] = f"Cooler {i + 1:02d}"
        room["temperature"] = f"{t:.2f} °C"
        for product in room.get("products", []):
            product["final_temperature"] = f"{t + 1.0:.2f} °C"
            product["entering_temperature"] = f"{t + 14.0:.2f} °C"
        out.append(room)
    project["rooms"] = out
    return project


def run(command: list[str]) -> tuple[float, float]:
    """Wall time [s] and peak resident memory [MiB] of one child process."""
    start = time.perf_counter()
    child = subprocess.Popen(command, stdout=subprocess.DEVNULL, stderr=subprocess.PIPE)
    _, status, usage = os.wait4(child.pid, 0)
    wall = time.perf_counter() - start
    child.returncode = os.waitstatus_to_exitcode(status)
    if child.returncode != 0:
        raise SystemExit(f"{' '.join(command)} failed: {child.stderr.read().decode()}")
    child.stderr.close()
    return wall, usage.ru_maxrss / 1024.0


def main() -> None:
    parser = argparse.ArgumentParser(description=__doc__.splitlines()[0])
    parser.add_argument("--rooms", type=int, default=50)
    parser.add_argument("--repeat", type=int, default=3)
    args = parser.parse_args()
    python = sys.executable
    with tempfile.TemporaryDirectory() as folder:
        base = Path(folder)
        many, one = base / "many.yaml", base / "one.yaml"
        many.write_text(yaml.safe_dump(generate(args.rooms), allow_unicode=True, sort_keys=False), encoding="utf-8")
        one.write_text(yaml.safe_dump(generate(1), allow_unicode=True, sort_keys=False), encoding="utf-8")

        def size(project: Path) -> list[str]:
            return [python, "-m", "coldroom", "size", str(project), "--out", str(project.with_suffix(".pdf")),
                    "--json", str(project.with_suffix(".json")), "--force"]

        run(size(one))  # warm the file cache
        times_many, times_one, mem_many, mem_one = [], [], [], []
        for _ in range(args.repeat):
            wall, rss = run(size(one))
            times_one.append(wall)
            mem_one.append(rss)
            wall, rss = run(size(many))
            times_many.append(wall)
            mem_many.append(rss)
        pages = (base / "many.pdf").read_bytes().count(b"/Type /Page\n") or "?"
    t_many, t_one = statistics.median(times_many), statistics.median(times_one)
    m_many, m_one = max(mem_many), max(mem_one)
    print(f"coldroom size, {args.rooms} rooms at distinct temperatures: {t_many:6.2f} s, peak {m_many:6.1f} MiB "
          f"({pages} pages)")
    print(f"coldroom size, one of its rooms:                  {t_one:6.2f} s, peak {m_one:6.1f} MiB")
    print(f"  time ratio   : {t_many / t_one:5.2f}  (target <= 2; median of {args.repeat}, interleaved)")
    print(f"  memory ratio : {m_many / m_one:5.2f}  (target <= 1.5)")


if __name__ == "__main__":
    main()
