"""How long `coldroom size` takes on a demo, relative to importing CoolProp alone.

Run by hand (not collected by pytest)::

    .venv/bin/python tests/benchmarks/bench_size.py [PROJECT.yaml] [--repeat N]

Both are timed as whole processes in the same run (median of N, default 5):
``python -c "import CoolProp"`` and ``coldroom size PROJECT --out TMP.pdf
--json TMP.json --force``. Target: ratio ≤ 1.5.
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


def timed(command: list[str]) -> float:
    start = time.perf_counter()
    subprocess.run(command, check=True, stdout=subprocess.DEVNULL, stderr=subprocess.DEVNULL)
    return time.perf_counter() - start


def main() -> None:
    parser = argparse.ArgumentParser(description=__doc__.splitlines()[0])
    parser.add_argument("project", nargs="?", default=str(REPO / "project_files" / "produce_cooler.yaml"))
    parser.add_argument("--repeat", type=int, default=5)
    args = parser.parse_args()
    python = sys.executable
    with tempfile.TemporaryDirectory() as folder:
        pdf, js = str(Path(folder) / "sheet.pdf"), str(Path(folder) / "result.json")
        size = [python, "-m", "coldroom", "size", args.project, "--out", pdf, "--json", js, "--force"]
        baseline = [python, "-c", "import CoolProp"]
        timed(baseline)  # warm the file cache for both
        timed(size)
        base_times, size_times = [], []
        for _ in range(args.repeat):  # interleaved, so load on the machine hits both alike
            base_times.append(timed(baseline))
            size_times.append(timed(size))
    base, whole = statistics.median(base_times), statistics.median(size_times)
    print(f"project: {Path(args.project).name}")
    print(f"python -c 'import CoolProp': {base:.3f} s (median of {args.repeat})")
    print(f"coldroom size (PDF + JSON):  {whole:.3f} s (median of {args.repeat})")
    print(f"ratio: {whole / base:.2f}  (target <= 1.5)")


if __name__ == "__main__":
    main()
