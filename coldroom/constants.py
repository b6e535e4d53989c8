"""Physical constants and fixed conversions: the one owner of each, with its unit in its name.

Every other module imports these instead of writing the number again; a test
(``tests/invariants/test_one_owner_rules.py``) scans the syntax tree of the package and
fails on any of these literals outside this module (data tables and tests excepted).
"""

from __future__ import annotations

#: The standard atmosphere, exact by definition [pub] [ref:nist-sp811] [Pa]. Gauge
#: pressures are read against it; it is also the sea-level site pressure.
STANDARD_ATMOSPHERE_PA = 101325.0

#: 0 °C in kelvin, exact by the SI definition [pub] [ref:nist-sp811] [K].
ZERO_CELSIUS_K = 273.15

#: Standard acceleration of gravity, exact by definition [pub] [ref:nist-sp811] [ref:iso-80000-3] [m/s²].
STANDARD_GRAVITY_M_S2 = 9.80665

#: Seconds in a day [s].
SECONDS_PER_DAY_S = 86400.0

#: Seconds in an hour [s].
SECONDS_PER_HOUR_S = 3600.0
