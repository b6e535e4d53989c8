"""One compressor serving several evaporators, the warmer ones behind evaporator pressure regulators.

Each coil
evaporates at its own dew temperature; the warmer ones sit behind an
evaporator pressure regulator (EPR), an isenthalpic throttle down to the
coldest coil's pressure. Each coil's flow is ṁᵢ = Qᵢ/(h_out,i − h₃); the
streams mix adiabatically at the coldest coil's pressure, h_mix = Σṁᵢh_out,i/Σṁᵢ
(steady-flow energy balance of a mixing tee; two evaporators on one compressor
with a back-pressure valve, Stoecker & Jones 2nd ed. ch. 16 multipressure
systems [mem] [ref:stoecker-jones]); state 1 is then the mixture heated by
the suction-line superheat at the suction pressure. The cycle reports the
coldest coil's evaporating temperature, the total capacity and the mixture as
the evaporator outlet (its superheat over the coldest dew point as
``superheat``).

The mixing itself is done inside :func:`coldroom.physics.cycle.solve_cycle` (its
``_warmer`` coils); this module checks the coils, picks the coldest and puts the
flows back in the order given.
"""

from __future__ import annotations

from dataclasses import replace

from coldroom.errors import CalculationError
from coldroom.physics.cycle import CycleResult, _check, solve_cycle


def _coldest_first(
    evaporators: "list[tuple[float, float, float]] | tuple[tuple[float, float, float], ...]",
) -> tuple[list[tuple[float, ...]], int]:
    """The coils checked, and the index of the coldest (the compressor's suction)."""
    coils = [tuple(float(x) for x in coil) for coil in evaporators]
    if not coils:
        raise CalculationError("a system needs at least one evaporator")
    for t, sh, q in coils:
        _check("evaporator duty", q, 0.0, 1e9, "W", low_open=True)
        _check("evaporating temperature", t, -100.0, 60.0, "°C")
        _check("superheat", sh, 0.0, 60.0, "K")
    return coils, min(range(len(coils)), key=lambda i: coils[i][0])


def compressor_performance(
    refrigerant: str,
    evaporators: "list[tuple[float, float, float]] | tuple[tuple[float, float, float], ...]",
    condensing_temperature: float | None,
    **options: float | None,
) -> tuple[float, float]:
    """(displacement [m³/s], compressor power [W]): exactly ``solve_system_cycle(...).displacement``
    and ``.compressor_power`` for the same arguments (one coil: :func:`solve_cycle`'s), without
    the expansion outlet, the glide, the warnings and the result record. For the part-load
    grid of the annual energy (as :func:`coldroom.physics.cycle.compressor_displacement` for
    capacity curves).

    Examples
    --------
    >>> coils = [(-10.0, 5.0, 3000.0), (-2.0, 5.0, 2000.0)]
    >>> full = solve_system_cycle("R134a", coils, 40.0)
    >>> compressor_performance("R134a", coils, 40.0) == (full.displacement, full.compressor_power)
    True
    """
    coils, coldest = _coldest_first(evaporators)
    others = tuple(coils[i] for i in range(len(coils)) if i != coldest)
    te, superheat, _q = coils[coldest]
    total = sum(q for _t, _sh, q in coils)
    return solve_cycle(  # type: ignore[return-value]
        refrigerant, te, condensing_temperature, total, superheat=superheat, _warmer=others,  # type: ignore[arg-type]
        _performance_only=True, **options,  # type: ignore[arg-type]
    )


def solve_system_cycle(
    refrigerant: str,
    evaporators: "list[tuple[float, float, float]] | tuple[tuple[float, float, float], ...]",
    condensing_temperature: float | None,
    **options: float | None,
) -> CycleResult:
    """One compressor serving several evaporators, the warmer ones behind EPRs.

    Parameters
    ----------
    refrigerant : str
        Catalogue name.
    evaporators : sequence of (float, float, float)
        Each coil's evaporating dew temperature [°C], superheat at its outlet
        [K] and duty [W] (> 0).
    condensing_temperature : float or None
        Condensing dew temperature [°C] (``None`` for transcritical R-744 with
        ``gas_cooler_outlet_temperature``).
    **options
        The other keywords of :func:`solve_cycle` (subcooling, isentropic
        efficiency, suction-line superheat, suction pressure drop, clearance,
        gas-cooler outlet temperature, high-side pressure, discharge pressure drop).

    Returns
    -------
    CycleResult
        At the coldest coil's evaporating temperature, capacity = Σ duties;
        ``evaporator_flows`` in the order of *evaporators*. One coil gives
        exactly :func:`solve_cycle`.

    Examples
    --------
    >>> r = solve_system_cycle("R134a", [(-10.0, 5.0, 3000.0), (-2.0, 5.0, 2000.0)], 40.0)
    >>> r.evaporating_temperature, r.capacity
    (-10.0, 5000.0)
    >>> abs(sum(r.evaporator_flows) - r.mass_flow) < 1e-12
    True
    """
    coils, coldest = _coldest_first(evaporators)
    others = tuple(coils[i] for i in range(len(coils)) if i != coldest)
    te, superheat, _q = coils[coldest]
    total = sum(q for _t, _sh, q in coils)
    result = solve_cycle(
        refrigerant, te, condensing_temperature, total, superheat=superheat, _warmer=others, **options  # type: ignore[arg-type]
    )
    if not others:
        return result
    def in_given_order(values: tuple) -> tuple:
        """*values* (coldest coil first, then the others) in the order of *evaporators*."""
        ordered = [values[0]] * len(coils)
        rest = iter(values[1:])
        for i in range(len(coils)):
            if i != coldest:
                ordered[i] = next(rest)
        return tuple(ordered)

    return replace(result, evaporator_flows=in_given_order(result.evaporator_flows),
                   coil_outlets=in_given_order(result.coil_outlets))
