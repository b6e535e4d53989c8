"""What sizing the lines adds to `coldroom size`, as a ratio.

Run by hand (not collected by pytest)::

    .venv/bin/python tests/benchmarks/bench_piping.py [PROJECT.yaml] [--repeat N]

Times two whole ``coldroom size PROJECT --out TMP.pdf --json TMP.json --force``
processes, interleaved (median of N, default 5): the project as given (with
its ``piping:`` blocks) and a copy with every ``piping:`` block removed (the
charge estimate and limits still run). Target: ratio ≤ 1.20 (issue: sizing
the three lines adds no more than 20 %).
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


def without_piping(text: str) -> str:
    """The project text with each ``piping:`` block (and its indented body) removed."""
    out, skip_indent = [], None
    for line in text.splitlines(keepends=True):
        indent = len(line) - len(line.lstrip(" "))
        if skip_indent is not None:
            if line.strip() and indent <= skip_indent:
                skip_indent = None
            else:
                continue
        if line.strip() == "piping:":
            skip_indent = indent
            continue
        out.append(line)
    return "".join(out)


def main() -> None:
    parser = argparse.ArgumentParser(description=__doc__.splitlines()[0])
    parser.add_argument("project", nargs="?", default=str(REPO / "project_files" / "propane_cooler.yaml"))
    parser.add_argument("--repeat", type=int, default=5)
    args = parser.parse_args()
    python = sys.executable
    source = Path(args.project).read_text(encoding="utf-8")
    with tempfile.TemporaryDirectory() as folder:
        bare = Path(folder) / "no_piping.yaml"
        bare.write_text(without_piping(source), encoding="utf-8")
        assert "piping:" in source and "piping:" not in bare.read_text(encoding="utf-8")
        pdf, js = str(Path(folder) / "sheet.pdf"), str(Path(folder) / "result.json")

        def size(project: str) -> list[str]:
            return [python, "-m", "coldroom", "size", project, "--out", pdf, "--json", js, "--force"]

        timed(size(str(bare)))  # warm the file cache
        timed(size(args.project))
        with_times, without_times = [], []
        for _ in range(args.repeat):
            without_times.append(timed(size(str(bare))))
            with_times.append(timed(size(args.project)))
    base, piped = statistics.median(without_times), statistics.median(with_times)
    print(f"project: {Path(args.project).name}")
    print(f"coldroom size without piping: {base:.3f} s (median of {args.repeat})")
    print(f"coldroom size with piping:    {piped:.3f} s (median of {args.repeat})")
    print(f"ratio: {piped / base:.3f}  (target <= 1.20)")


if __name__ == "__main__":
    main()
