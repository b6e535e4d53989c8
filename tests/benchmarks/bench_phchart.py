"""How long the p–h chart takes, relative to the cycle it draws (in one process).

Run by hand (not collected by pytest)::

    /work/venv/bin/python tests/benchmarks/bench_phchart.py

For a pure fluid (R-134a) and a mixture (R-448A): one ``solve_cycle`` (its
property look-ups warm), then the chart's first drawing (lines computed) and a
second drawing of a similar cycle (lines from the process cache). Prints the
times and the ratios chart / cycle. Target: first chart ≤ 2 s for a mixture on
an idle machine; a cached chart well under the cycle's own time × 20.
"""

from __future__ import annotations

import time


def main() -> None:
    import CoolProp  # noqa: F401 - the import is not what is measured

    from coldroom.cycle import solve_cycle
    from coldroom.report.phchart import ph_chart

    for name in ("R-134a", "R-448A"):
        solve_cycle(name, -10.0, 40.0, 5000.0)  # warm the saturation look-ups
        start = time.perf_counter()
        cycle = solve_cycle(name, -9.0, 41.0, 5000.0, suction_line_superheat=5.0)
        t_cycle = time.perf_counter() - start
        start = time.perf_counter()
        ph_chart(cycle, "SI", 520.0, 420.0)
        t_first = time.perf_counter() - start
        similar = solve_cycle(name, -8.0, 42.0, 5000.0, suction_line_superheat=5.0)
        start = time.perf_counter()
        ph_chart(similar, "SI", 520.0, 420.0)
        t_cached = time.perf_counter() - start
        print(f"{name}: cycle {t_cycle * 1e3:.1f} ms; chart first {t_first * 1e3:.0f} ms "
              f"(ratio {t_first / t_cycle:.1f}), cached {t_cached * 1e3:.0f} ms (ratio {t_cached / t_cycle:.1f})")


if __name__ == "__main__":
    main()
