"""The wording of the design limits of :mod:`coldroom.rules` as a warning (one wording, every caller).

:mod:`coldroom.rules` owns the numbers and stays free of :mod:`coldroom.results` (which imports it);
this module words them as a :class:`~coldroom.results.Note` for the design cycle and every balance point.
"""

from __future__ import annotations

from typing import Optional

from coldroom.results import Note
from coldroom.rules import DISCHARGE_LIMITS, discharge_temperature_over, refrigerant_family


def discharge_temperature_warning(discharge_temperature: float, refrigerant: str) -> Optional[Note]:
    """The one wording of a discharge temperature [°C] over its family's limit, else ``None``.

    size (the design cycle), select and check (a unit's balance point) all call this.
    """
    if not discharge_temperature_over(discharge_temperature, refrigerant):
        return None
    limit, source = DISCHARGE_LIMITS[refrigerant_family(refrigerant)]
    return Note.fill(
        f"discharge temperature {{t}} is over the {{lim}} limit for {refrigerant} ({source}): oil breakdown and "
        "valve damage; the compressor must not run like this - reduce superheat or lift, or use injection or "
        "two stages",
        t=(discharge_temperature, "temperature"), lim=(limit, "temperature"),
    )

