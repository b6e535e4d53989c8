"""Start-up cost of the light commands against importing typer alone.

Run by hand (not collected by pytest)::

    /work/venv/bin/python tests/benchmarks/bench_startup.py [--repeat 7]

Whole processes, interleaved so load on the machine hits all alike, median of
N: ``python -c "import typer"`` (the floor of any typer program),
``python -m coldroom --help`` and ``python -m coldroom validate DEMO``.
Targets: --help ≤ 1.5 ×, validate ≤ 2 × the typer import.
"""

from __future__ import annotations

import argparse
import statistics
import subprocess
import sys
import time
from pathlib import Path

REPO = Path(__file__).resolve().parents[2]
DEMO = REPO / "project_files" / "produce_cooler.yaml"


def timed(command: list[str]) -> float:
    start = time.perf_counter()
    subprocess.run(command, check=True, stdout=subprocess.DEVNULL, stderr=subprocess.DEVNULL, cwd=REPO)
    return time.perf_counter() - start


def main() -> None:
    parser = argparse.ArgumentParser(description=__doc__.splitlines()[0])
    parser.add_argument("--repeat", type=int, default=7)
    args = parser.parse_args()
    python = sys.executable
    commands = {
        "import typer": [python, "-c", "import typer"],
        "coldroom --help": [python, "-m", "coldroom", "--help"],
        "coldroom validate DEMO": [python, "-m", "coldroom", "validate", str(DEMO)],
    }
    for command in commands.values():
        timed(command)  # warm the file cache
    times: dict[str, list[float]] = {name: [] for name in commands}
    for _ in range(args.repeat):
        for name, command in commands.items():
            times[name].append(timed(command))
    median = {name: statistics.median(values) for name, values in times.items()}
    base = median["import typer"]
    for name, value in median.items():
        print(f"{name:24s}: {value:6.3f} s (median of {args.repeat})")
    print(f"  --help / import typer   : {median['coldroom --help'] / base:5.2f}  (target <= 1.5)")
    print(f"  validate / import typer : {median['coldroom validate DEMO'] / base:5.2f}  (target <= 2)")


if __name__ == "__main__":
    main()
