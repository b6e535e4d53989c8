"""Speed of the cycle (run by hand: .venv/bin/python tests/benchmarks/bench_cycle.py).

Prints, from one run:
1. a full R-448A cycle by the fast path (solve_cycle, memoised saturation
   cleared before every run) against the same cycle computed with CoolProp's
   own flashes (P–T, P–S, P–H on the HEOS mixture, as a naive implementation
   would) — ratio, target ≥ 50×;
2. R-448A cycles per second over distinct conditions (no cache hits), target
   ≥ 500: first with the saturation table cold (its segments are fitted as the
   conditions reach them), then over other distinct conditions in the same
   range with the table built (the steady state of a long job); CPU time
   beside wall time, so a busy machine shows as a gap between the two;
3. R-134a cycles per second over distinct conditions (no cache hits), target ≥ 2000;
4. wall time of the whole process `coldroom cycle --refrigerant R448A ...`
   over the wall time of `python -c "import CoolProp"`, target ≤ 1.3.
Not collected by pytest (tests/benchmarks is in norecursedirs).
"""

from __future__ import annotations

import os
import statistics
import subprocess
import sys
import time

import CoolProp.CoolProp as CP
from CoolProp.CoolProp import AbstractState

from coldroom.physics.cycle import solve_cycle
from coldroom.physics.refrigerant import get_fluid

K = 273.15


def naive_cycle(te: float, tc: float, capacity: float, superheat=5.0, subcooling=2.0, eta=0.70) -> dict:
    """The same cycle as solve_cycle's defaults, with CoolProp's own flashes only."""
    st = AbstractState("HEOS", "R448A.mix")
    st.update(CP.QT_INPUTS, 1.0, te + K)
    pe = st.p()
    st.update(CP.QT_INPUTS, 1.0, tc + K)
    pc = st.p()
    st.update(CP.PQ_INPUTS, pc, 0.0)
    t_bubble = st.T()
    st.update(CP.PT_INPUTS, pe, te + K + superheat)
    h1, s1 = st.hmass(), st.smass()
    st.update(CP.PSmass_INPUTS, pc, s1)
    h2s = st.hmass()
    h2 = h1 + (h2s - h1) / eta
    st.update(CP.HmassP_INPUTS, h2, pc)
    t2 = st.T() - K
    st.update(CP.PT_INPUTS, pc, t_bubble - subcooling)
    h3 = st.hmass()
    st.update(CP.HmassP_INPUTS, h3, pe)
    t4 = st.T() - K
    m = capacity / (h1 - h3)
    return {"cop": (h1 - h3) / (h2 - h1), "t2": t2, "t4": t4, "m": m}


def bench_blend() -> None:
    te, tc, q = -10.0, 40.0, 5000.0
    fluid = get_fluid("R448A")  # build once (CoolProp mixture set-up, ~15 ms) outside the timing
    fast_times = []
    for _ in range(20):
        fluid.clear_cache()
        t0 = time.perf_counter()
        r = solve_cycle("R448A", te, tc, q)
        fast_times.append(time.perf_counter() - t0)
    slow_times = []
    for _ in range(2):
        t0 = time.perf_counter()
        n = naive_cycle(te, tc, q)
        slow_times.append(time.perf_counter() - t0)
    fast, slow = statistics.median(fast_times), statistics.median(slow_times)
    print(f"R-448A cycle, fast path      : {fast * 1e3:8.2f} ms (median of 20, caches cleared)")
    print(f"R-448A cycle, CoolProp flashes: {slow * 1e3:8.1f} ms (median of 2)")
    print(f"  ratio                       : {slow / fast:8.1f}x   (target >= 50x)")
    # the agreement on the naive cycle's own inputs (5 K superheat at the suction, none in the
    # line, 2 K subcooling, isentropic efficiency 0.70)
    r = solve_cycle("R448A", te, tc, q, superheat=5.0, suction_line_superheat=0.0, subcooling=2.0,
                    isentropic_efficiency=0.70)
    print(f"  agreement: COP {r.cop:.6f} vs {n['cop']:.6f}; t2 {r.discharge_temperature:.4f} vs {n['t2']:.4f} °C; "
          f"t4 {r.states[3].t:.4f} vs {n['t4']:.4f} °C")


def bench_blend_rate() -> None:
    get_fluid("R448A")
    rows = []
    for offset in (0.0, 0.05):  # table cold, then built; all conditions distinct
        conditions = [(-40.0 + 0.137 * i + offset, 25.0 + 0.113 * i + offset) for i in range(300)]
        wall0, cpu0 = time.perf_counter(), time.process_time()
        for te, tc in conditions:
            solve_cycle("R448A", te, tc, 5000.0)
        wall, cpu = time.perf_counter() - wall0, time.process_time() - cpu0
        rows.append((len(conditions) / wall, len(conditions) / cpu))
    (cold_wall, cold_cpu), (warm_wall, warm_cpu) = rows
    print(f"R-448A cycles per second     : {warm_wall:8.0f}   (target >= 500; table built; CPU-time rate {warm_cpu:.0f})")
    print(f"  same, table cold           : {cold_wall:8.0f}   (CPU-time rate {cold_cpu:.0f}; evaporating -40…+1 °C, "
          "condensing 25…59 °C)")


def bench_r134a() -> None:
    get_fluid("R134a")
    conditions = [(-40.0 + 0.0137 * i, 25.0 + 0.0113 * i) for i in range(3000)]  # all distinct
    t0 = time.perf_counter()
    for te, tc in conditions:
        solve_cycle("R134a", te, tc, 5000.0)
    elapsed = time.perf_counter() - t0
    print(f"R-134a cycles per second     : {len(conditions) / elapsed:8.0f}   (target >= 2000; "
          f"{elapsed / len(conditions) * 1e6:.0f} µs each, {os.cpu_count()} cores)")


def bench_process() -> None:
    def wall(cmd: list[str]) -> float:
        t0 = time.perf_counter()
        subprocess.run(cmd, check=True, capture_output=True)
        return time.perf_counter() - t0

    coldroom = [sys.executable, "-m", "coldroom", "cycle", "--refrigerant", "R448A", "--evaporating", "-10",
                "--condensing", "40", "--capacity", "5 kW"]
    importer = [sys.executable, "-c", "import CoolProp"]
    runs_c, runs_i = [], []
    for _ in range(3):  # interleaved, so machine load hits both alike
        runs_i.append(wall(importer))
        runs_c.append(wall(coldroom))
    c, i = min(runs_c), min(runs_i)
    print(f"process `coldroom cycle R448A`: {c:6.2f} s; `python -c 'import CoolProp'`: {i:6.2f} s (min of 3)")
    print(f"  ratio                       : {c / i:8.2f}   (target <= 1.3)")


if __name__ == "__main__":
    bench_blend()
    bench_blend_rate()
    bench_r134a()
    bench_process()
