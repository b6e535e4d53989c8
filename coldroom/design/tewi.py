"""Total equivalent warming impact (TEWI) of a refrigerating system over its life.

The published form [pub] [ref:en-378] (EN 378-1 Annex B) and [ref:airah-tewi-2012]
(AIRAH 2012 best-practice guideline, section 2.1, after the BRA guideline)::

    TEWI = GWP·m·L_annual·n            direct: leakage over the service life
         + GWP·m·(1 − α_recovery)      direct: the part not recovered at the end of life
         + E_annual·β·n                indirect: electricity generation

m the charge [kg], L_annual the leakage rate [1/year], n the service life
[year], α_recovery the recovery factor [-], E_annual the annual electricity
[kWh], β the grid emission factor [kg CO2e/kWh]. Results in kg CO2e.

Defaults (used when the project's ``economics:`` block leaves a key out; each
is marked as a default wherever it is shown):

- service life 15 years [trade] (commercial condensing units, 10–20 years);
- leakage 10 % of the charge per year [mem] [ref:airah-tewi-2012] (the guideline's
  table puts small commercial systems in the 5–15 %/year range; verify);
- recovery 70 % [mem] [ref:airah-tewi-2012] (verify);
- emission factor 0.4 kg CO2e/kWh [trade] (a mid-range grid; use the local figure);
- electricity price 0.25 per kWh in EUR [trade] (a placeholder; use the tariff).

Examples
--------
>>> t = tewi(gwp=1000.0, charge=2.0, leakage_rate=0.1, service_life=10.0, recovery_factor=0.7,
...          annual_energy=1000.0, emission_factor=0.5)
>>> (t.direct_leakage, round(t.direct_end_of_life, 6), t.indirect, round(t.total, 6))
(2000.0, 600.0, 5000.0, 7600.0)
"""

from __future__ import annotations

from dataclasses import dataclass

from coldroom.errors import CalculationError, finite

DEFAULT_SERVICE_LIFE = 15.0  # years [trade]
DEFAULT_LEAKAGE_RATE = 0.10  # per year [mem] [ref:airah-tewi-2012]
DEFAULT_RECOVERY_FACTOR = 0.70  # [mem] [ref:airah-tewi-2012]
DEFAULT_EMISSION_FACTOR = 0.4  # kg CO2e/kWh [trade]
DEFAULT_ELECTRICITY_PRICE = 0.25  # currency units per kWh [trade]
DEFAULT_CURRENCY = "EUR"


@dataclass(frozen=True)
class Tewi:
    """TEWI over the service life, in kg CO2e.

    Attributes
    ----------
    direct_leakage : float
        GWP × charge × leakage rate × service life [kg CO2e].
    direct_end_of_life : float
        GWP × charge × (1 − recovery factor) [kg CO2e].
    indirect : float
        Annual electricity × emission factor × service life [kg CO2e].
    """

    direct_leakage: float
    direct_end_of_life: float
    indirect: float

    @property
    def total(self) -> float:
        """Direct plus indirect [kg CO2e]."""
        return self.direct_leakage + self.direct_end_of_life + self.indirect

    def to_json(self) -> dict[str, float]:
        return {
            "direct_leakage": self.direct_leakage,
            "direct_end_of_life": self.direct_end_of_life,
            "indirect": self.indirect,
            "total": self.total,
        }


def tewi(
    gwp: float,
    charge: float,
    leakage_rate: float,
    service_life: float,
    recovery_factor: float,
    annual_energy: float,
    emission_factor: float,
) -> Tewi:
    """TEWI by the EN 378-1 Annex B / AIRAH 2012 equation (see the module note).

    Parameters
    ----------
    gwp : float
        100-year global warming potential of the refrigerant [kg CO2e/kg].
    charge : float
        Refrigerant charge [kg].
    leakage_rate : float
        Share of the charge lost per year [1/year].
    service_life : float
        Years in service [year].
    recovery_factor : float
        Share of the charge recovered at the end of life [-].
    annual_energy : float
        Electricity per year [kWh].
    emission_factor : float
        Grid emission factor [kg CO2e/kWh].

    Raises
    ------
    CalculationError
        A negative input, or a recovery factor outside 0–1.
    """
    values = {
        "GWP": gwp, "charge": charge, "leakage rate": leakage_rate, "service life": service_life,
        "annual energy": annual_energy, "emission factor": emission_factor,
    }
    for name, value in values.items():
        if finite(name, value) < 0.0:
            raise CalculationError(f"TEWI: {name} {value:g} must not be negative")
    if not 0.0 <= finite("recovery factor", recovery_factor) <= 1.0:
        raise CalculationError(f"TEWI: recovery factor {recovery_factor:g} must lie in 0–1")
    return Tewi(
        direct_leakage=gwp * charge * leakage_rate * service_life,
        direct_end_of_life=gwp * charge * (1.0 - recovery_factor),
        indirect=annual_energy * emission_factor * service_life,
    )
