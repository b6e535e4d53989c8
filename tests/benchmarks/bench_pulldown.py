"""What the pull-down simulation adds to `coldroom size` on a demo (target: ≤ 30 %).

Run by hand (not collected by pytest)::

    .venv/bin/python tests/benchmarks/bench_pulldown.py [PROJECT.yaml] [--repeat N]

Two whole processes are timed in the same run, interleaved (median of N, default 5): `coldroom
size PROJECT` as it is, and the same with ``coldroom.loads.pulldown.room_pulldown`` replaced by a stub
that returns None (no scipy import, no integration). The ratio (with − without) / without is
printed. The produce-cooler demo asks pull-downs of 12 and 24 h, so 48 h are simulated —
longer than the 24 h the target names.
"""

from __future__ import annotations

import argparse
import statistics
import subprocess
import sys
import tempfile
import time
from pathlib import Path

REPO = Path(__file__).resolve().parents[2]

RUN = """
import sys
if sys.argv[1] == "off":
    import coldroom.loads.pulldown
    coldroom.loads.pulldown.room_pulldown = lambda *args, **kwargs: None
sys.argv = ["coldroom", "size", sys.argv[2], "--out", sys.argv[3], "--force"]
from coldroom.cli import main
main()
"""


def timed(command: list[str]) -> float:
    start = time.perf_counter()
    subprocess.run(command, check=True, stdout=subprocess.DEVNULL, stderr=subprocess.DEVNULL, cwd=REPO)
    return time.perf_counter() - start


def main() -> None:
    parser = argparse.ArgumentParser(description=__doc__.splitlines()[0])
    parser.add_argument("project", nargs="?", default=str(REPO / "project_files" / "produce_cooler.yaml"))
    parser.add_argument("--repeat", type=int, default=5)
    args = parser.parse_args()
    with tempfile.TemporaryDirectory() as folder:
        pdf = str(Path(folder) / "sheet.pdf")
        with_run = [sys.executable, "-c", RUN, "on", args.project, pdf]
        without = [sys.executable, "-c", RUN, "off", args.project, pdf]
        timed(with_run)  # warm the file cache for both
        on, off = [], []
        for _ in range(args.repeat):  # interleaved, so load on the machine hits both alike
            off.append(timed(without))
            on.append(timed(with_run))
    a, b = statistics.median(on), statistics.median(off)
    print(f"project: {Path(args.project).name}")
    print(f"coldroom size without the pull-down: {b:.3f} s (median of {args.repeat})")
    print(f"coldroom size with the pull-down:    {a:.3f} s (median of {args.repeat})")
    print(f"the pull-down adds {100.0 * (a - b) / b:.1f} % (target ≤ 30 %)")


if __name__ == "__main__":
    main()
