"""The design-day outdoor profile against the published fraction-of-daily-range table.

Source: ASHRAE Handbook—Fundamentals (2009), chapter 14 "Climatic Design Information", Table 6
"Fraction of Daily Temperature Range" [ref:ashrae-fund-climate] (from memory; verify): the percentage of the daily range
below the design dry bulb, by hour of the day. The same percentages stood in earlier editions'
cooling-load chapter ("percentage of daily range"). Read here hour by hour, as printed:
hour 1 87 %, 5 100 % (the coolest), 8 84 %, 12 23 %, 15 0 % (the warmest), 18 21 %, 21 58 %,
24 82 %.
"""

from __future__ import annotations

import pytest

from coldroom.loads.hourly import outdoor_temperatures

# (table hour, percent of daily range) as printed
PUBLISHED = [(1, 87), (5, 100), (8, 84), (12, 23), (15, 0), (18, 21), (21, 58), (24, 82)]


@pytest.mark.parametrize("hour, percent", PUBLISHED)
def test_profile_matches_the_published_fraction(hour, percent) -> None:
    # design dry bulb 35 °C, daily range 12 K: t = 35 − percent/100 × 12
    profile = outdoor_temperatures(35.0, 12.0)
    assert profile[hour - 1] == pytest.approx(35.0 - percent / 100.0 * 12.0, abs=1e-9)


def test_design_dry_bulb_is_the_days_maximum_in_mid_afternoon() -> None:
    profile = outdoor_temperatures(35.0, 12.0)
    assert max(profile) == 35.0 and profile.index(35.0) == 14  # 14:00–15:00, table hour 15
    assert min(profile) == pytest.approx(23.0) and profile.index(min(profile)) == 4  # table hour 5
    # the published profile's daily mean lies a little above the middle of the range
    assert 35.0 - 12.0 * 0.60 < sum(profile) / 24 < 35.0 - 12.0 * 0.45
