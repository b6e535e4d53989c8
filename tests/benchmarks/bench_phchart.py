"""How long the p–h chart takes, relative to importing CoolProp (the cost every cycle pays first).

Run by hand (not collected by pytest)::

    .venv/bin/python tests/benchmarks/bench_phchart.py

Baseline: ``python -c "import CoolProp"`` as a whole process (median of 3).
For a pure fluid (R-134a) and a mixture (R-448A), in this process: the
chart's first drawing of a cycle (lines computed) and the drawing of a similar
cycle (lines from the process cache, only the drawing itself). Prints times
and ratios to the baseline. Targets: first chart of a mixture ≤ 1.5 × the
baseline, a cached chart ≤ 0.3 ×.
"""

from __future__ import annotations

import statistics
import subprocess
import sys
import time


def main() -> None:
    base = []
    for _ in range(3):
        start = time.perf_counter()
        subprocess.run([sys.executable, "-c", "import CoolProp"], check=True)
        base.append(time.perf_counter() - start)
    baseline = statistics.median(base)
    print(f"python -c 'import CoolProp': {baseline:.3f} s (median of 3)")

    from coldroom.physics.cycle import solve_cycle
    from coldroom.output.pdf.phchart import ph_chart

    for name in ("R-134a", "R-448A"):
        cycle = solve_cycle(name, -9.0, 41.0, 5000.0, suction_line_superheat=5.0)
        start = time.perf_counter()
        ph_chart(cycle, "SI", 520.0, 420.0)
        t_first = time.perf_counter() - start
        similar = solve_cycle(name, -8.0, 42.0, 5000.0, suction_line_superheat=5.0)
        start = time.perf_counter()
        ph_chart(similar, "SI", 520.0, 420.0)
        t_cached = time.perf_counter() - start
        print(f"{name}: chart first {t_first:.3f} s (ratio {t_first / baseline:.2f}), "
              f"cached {t_cached:.3f} s (ratio {t_cached / baseline:.2f})")


if __name__ == "__main__":
    main()
