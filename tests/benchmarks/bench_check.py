"""Benchmark: the balance-point search for an R-448A unit, in process (target < 1 s).

Run by hand: ``.venv/bin/python tests/benchmarks/bench_check.py``. Prints the
time of one cold balance-point search (fresh states, nothing cached for these
temperatures), a warm-started one, and the full check of the demo project
(balance, 11-point chart, maximum-ambient search). CoolProp's import and the
first creation of the R-448A mixture are timed separately: they are paid once
per process.
"""

from __future__ import annotations

import time
from pathlib import Path

REPO = Path(__file__).resolve().parents[2]


def main() -> None:
    t0 = time.perf_counter()
    from coldroom import equipment as E
    from coldroom.design import existing
    from coldroom.physics.refrigerant import get_fluid

    get_fluid("R-448A").dew_pressure(0.0)
    setup = time.perf_counter() - t0

    operating = E.OperatingConditions(superheat=5.0, suction_line_superheat=5.0, subcooling=2.0)
    compressor = E.RatedPointCompressor.from_rating(
        "R-448A", 4500.0, -10.0, 45.0, superheat=10.0, subcooling=0.0, power=2200.0, operating=operating
    )
    evaporator = E.HeatExchanger.from_rating(4000.0, 8.0, "unit cooler")
    condenser = E.HeatExchanger.from_rating(7500.0, 15.0, "condenser")

    t1 = time.perf_counter()
    bp, point = E.solve_balance(compressor, evaporator, condenser, -18.0, 32.0)
    cold = time.perf_counter() - t1
    t2 = time.perf_counter()
    bp2, _ = E.solve_balance(compressor, evaporator, condenser, -18.0, 34.0, guess=(bp.suction_dew, bp.discharge_dew))
    warm = time.perf_counter() - t2

    from coldroom.inputs.opening import open_project

    model = open_project(REPO / "project_files" / "cooler_to_freezer.yaml").model
    t3 = time.perf_counter()
    existing.check_existing_units(model)
    full = time.perf_counter() - t3

    print(f"CoolProp import + R-448A setup (once per process): {setup:.2f} s")
    print(
        f"balance point R-448A, cold start: {cold * 1e3:.0f} ms ({bp.evaluations} compressor evaluations) "
        f"-> SST {bp.suction_dew:.2f} °C, SCT {bp.discharge_dew:.2f} °C, capacity {point.capacity:.0f} W"
    )
    print(f"balance point R-448A, warm start: {warm * 1e3:.0f} ms ({bp2.evaluations} evaluations)")
    print(f"full check of cooler_to_freezer.yaml (balance + chart + max ambient): {full:.2f} s")
    print("target: balance-point search < 1 s:", "OK" if cold < 1.0 else "TOO SLOW")


if __name__ == "__main__":
    main()
