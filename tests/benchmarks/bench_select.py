"""Benchmark: `coldroom select` over a 200-model catalogue vs a `coldroom check` of one unit (target ≤ 3×).

Run by hand: ``.venv/bin/python tests/benchmarks/bench_select.py``. Both sides run in
one process on the same project (the R-448A freezer demo), after CoolProp and the
R-448A tables are set up, so what is compared is the work each command does:

* select: the unit coolers per room and the condensing unit from 200 models (the
  demo's units scaled in size and price, both refrigerants), including the
  highest-ambient search for the choice and its two alternatives;
* check: `equipment.check_existing_units` with the chosen unit written as the room's
  ``existing_unit`` (balance, chart, highest-ambient search), as `coldroom check` runs it.

Each side is timed as the best of three runs.
"""

from __future__ import annotations

import sys
import time
from pathlib import Path

REPO = Path(__file__).resolve().parents[2]
sys.path.insert(0, str(REPO))


def big_catalogue(size: int = 200):  # type: ignore[no-untyped-def]
    from coldroom.inputs.catalogue import Catalogue, load_catalogue

    demo = load_catalogue(REPO / "project_files" / "catalogue" / "demo_catalogue.yaml")
    units = []
    k = 0
    while len(units) < size:
        for entry in demo.condensing_units:
            if len(units) >= size:
                break
            scale = 0.6 + 0.05 * (k % 25)
            update: dict = {"model": f"{entry.model} x{k}", "price": round(entry.price * (0.7 + 0.3 * scale) + k % 7, 2)}
            if entry.polynomial is not None:
                p = entry.polynomial
                update["polynomial"] = p.model_copy(update={
                    "capacity": [c * scale for c in p.capacity], "power": [c * scale for c in p.power]})
            else:
                r = entry.rated_point
                update["rated_point"] = r.model_copy(update={"capacity": r.capacity * scale, "power": r.power * scale})
            if entry.condenser is not None:
                update["condenser"] = entry.condenser.model_copy(
                    update={"heat_rejection": entry.condenser.heat_rejection * scale})
            units.append(entry.model_copy(update=update))
            k += 1
    return Catalogue.model_construct(currency=demo.currency, condensing_units=units, unit_coolers=demo.unit_coolers)


def best_of(n: int, work) -> float:  # type: ignore[no-untyped-def]
    times = []
    for _ in range(n):
        t = time.perf_counter()
        work()
        times.append(time.perf_counter() - t)
    return min(times)


def main() -> None:
    from coldroom.design.existing import check_existing_units as check_project
    from coldroom.inputs.opening import open_project
    from coldroom.inputs.projectfile import ExistingUnit
    from coldroom.design.selection import select_project

    model = open_project(REPO / "project_files" / "cooler_to_freezer.yaml").model
    model = model.model_copy(update={"rooms": [model.rooms[0].model_copy(update={"existing_unit": None})]})
    catalogue = big_catalogue()
    (first,) = select_project(model, catalogue)  # warm-up: CoolProp, R-448A and R-290 tables
    unit = ExistingUnit.model_validate(first.existing_unit, context={"system": "SI"})
    checked = model.model_copy(update={"rooms": [model.rooms[0].model_copy(update={"existing_unit": unit})]})
    check_project(checked)

    select_time = best_of(3, lambda: select_project(model, catalogue))
    check_time = best_of(3, lambda: check_project(checked))
    print(f"catalogue: {len(catalogue.condensing_units)} condensing units, {len(catalogue.unit_coolers)} unit coolers")
    print(f"chosen: {first.choice.model}; set aside: {first.rejected}")
    print(f"select over the catalogue: {select_time:.3f} s")
    print(f"check of one unit:         {check_time:.3f} s")
    ratio = select_time / check_time
    print(f"ratio select / check: {ratio:.2f} (target ≤ 3): {'OK' if ratio <= 3.0 else 'TOO SLOW'}")


if __name__ == "__main__":
    main()
