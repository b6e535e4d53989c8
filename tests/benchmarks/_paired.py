"""The paired A/B loop the benchmark scripts share: whole processes, interleaved, ratios pair by pair.

A noisy machine (shared cores; the same process varies ±15 % from minute to minute) moves
lone times a lot and ratios of neighbouring runs much less: each pair is A then B (or B then
A, alternating), and what is quoted is the median of the pairs' ratios, with their min and
max as the noise. Each child's CPU time (user + system) and peak resident memory come from
the operating system (``os.wait4``, the same accounting ``/usr/bin/time -v`` prints); wall
time from ``time.perf_counter``.
"""

from __future__ import annotations

import os
import statistics
import subprocess
import time
from dataclasses import dataclass
from typing import Callable, Mapping, Optional, Sequence, Union

Command = Union[Sequence[str], Callable[[], tuple[Sequence[str], Optional[Mapping[str, str]]]]]


@dataclass(frozen=True)
class Sample:
    """One finished child process."""

    cpu: float  # user + system [s]
    wall: float  # [s]
    peak_mib: float  # peak resident memory [MiB]


def run(command: Sequence[str], env: Optional[Mapping[str, str]] = None) -> Sample:
    """Run *command* to the end (output thrown away) and measure it; a failure stops the benchmark."""
    start = time.perf_counter()
    child = subprocess.Popen(list(command), stdout=subprocess.DEVNULL, stderr=subprocess.PIPE,
                             env=None if env is None else {**os.environ, **env})
    _, status, usage = os.wait4(child.pid, 0)
    wall = time.perf_counter() - start
    assert child.stderr is not None
    errors = child.stderr.read().decode(errors="replace")
    child.stderr.close()
    if os.waitstatus_to_exitcode(status) != 0:
        raise SystemExit(f"{' '.join(command)} failed:\n{errors}")
    return Sample(usage.ru_utime + usage.ru_stime, wall, usage.ru_maxrss / 1024.0)


def _resolve(command: Command) -> tuple[Sequence[str], Optional[Mapping[str, str]]]:
    return command() if callable(command) else (command, None)


def paired(a: Command, b: Command, repeat: int, warmup: int = 1) -> list[tuple[Sample, Sample]]:
    """*repeat* pairs of (A, B), run alternately A B, B A, A B …, after *warmup* runs of each.

    A command is a list of words, or a callable giving (words, extra environment) anew for
    each run (e.g. a fresh cache folder for a cold run).
    """
    for _ in range(warmup):
        run(*_resolve(a))
        run(*_resolve(b))
    pairs = []
    for k in range(repeat):
        if k % 2 == 0:
            sa = run(*_resolve(a))
            sb = run(*_resolve(b))
        else:
            sb = run(*_resolve(b))
            sa = run(*_resolve(a))
        pairs.append((sa, sb))
    return pairs


def ratios(pairs: Sequence[tuple[Sample, Sample]], figure: str = "cpu") -> list[float]:
    """A/B of *figure* ("cpu", "wall" or "peak_mib") pair by pair."""
    return [getattr(sa, figure) / getattr(sb, figure) for sa, sb in pairs]


def spread(values: Sequence[float]) -> str:
    """"median (min–max)" of *values*."""
    return f"{statistics.median(values):.2f} ({min(values):.2f}–{max(values):.2f})"


def report(label: str, pairs: Sequence[tuple[Sample, Sample]], target: Optional[float] = None) -> float:
    """Print the CPU-time ratio (and the wall-time ratio) of *pairs*; return the CPU ratio's median."""
    cpu = ratios(pairs, "cpu")
    wall = ratios(pairs, "wall")
    median = statistics.median(cpu)
    verdict = "" if target is None else f"  target <= {target:g}: {'met' if median <= target else 'NOT met'}"
    print(f"{label}: cpu ratio {spread(cpu)}, wall ratio {spread(wall)}, n={len(pairs)}{verdict}")
    return median
