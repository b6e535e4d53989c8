"""TEWI against the worked form of the AIRAH guideline.

Source: AIRAH, *Methods of calculating Total Equivalent Warming Impact (TEWI) 2012*, best
practice guideline, section 2.1 (the equation, after the BRA guideline and EN 378-1 Annex B)
and Appendix B (sample calculations) [ref:airah-tewi-2012].

The sample below follows the guideline's Appendix B layout for a small commercial condensing
unit; the inputs and the expected figures are from memory and hand arithmetic — verify against
the guideline before relying on them. The expected numbers are written out as literals (not
recomputed from the equation here).
"""

from __future__ import annotations

import pytest

from coldroom.data.refrigerants import lookup
from coldroom.design.tewi import tewi


def test_condensing_unit_sample_r404a() -> None:
    # 5 kg R-404A (GWP 3922, AR4), 10 %/year leakage, 10 years, 70 % recovered,
    # 10 000 kWh/year at 1.0 kg CO2e/kWh [mem]
    result = tewi(gwp=3922.0, charge=5.0, leakage_rate=0.10, service_life=10.0, recovery_factor=0.70,
                  annual_energy=10_000.0, emission_factor=1.0)
    assert result.direct_leakage == pytest.approx(19_610.0)
    assert result.direct_end_of_life == pytest.approx(5_883.0)
    assert result.indirect == pytest.approx(100_000.0)
    assert result.total == pytest.approx(125_493.0)


def test_catalogue_gwp_of_the_sample_refrigerant() -> None:
    # the sample's GWP is the AR4 100-year value of R-404A [mem] [ref:ipcc-ar4]
    assert lookup("R404A").gwp_ar4 == pytest.approx(3922.0, abs=1.0)


def test_natural_refrigerant_direct_part_is_small() -> None:
    # the guideline's point for R-744 (GWP 1): the direct part is negligible beside the indirect
    result = tewi(gwp=1.0, charge=5.0, leakage_rate=0.10, service_life=10.0, recovery_factor=0.70,
                  annual_energy=10_000.0, emission_factor=1.0)
    assert result.direct_leakage + result.direct_end_of_life == pytest.approx(6.5)
    assert result.total == pytest.approx(100_006.5)
