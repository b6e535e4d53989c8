"""The states of a solved cycle as the p–h chart and the state table show them.

In flow order with their labels (``4``, ``1e``, ``1``, ``2``, ``3``, ``3v``),
the warmer coils behind evaporator pressure regulators (``1a``, ``1b`` …), the
expansion-valve inlet after the liquid line, and the state table in the
project's units.
"""

from __future__ import annotations

from typing import Any, Sequence

from coldroom.output.pdf.text import clean


def valve_inlet_state(cycle: Any, pressure: float | None) -> Any:
    """The state at the expansion-valve inlet, or ``None``.

    The liquid line is adiabatic: the condenser-outlet enthalpy at *pressure*
    [Pa] (condenser-outlet pressure less the line's friction drop and static
    rise, :func:`coldroom.design.pipework.valve_inlet_pressure`), through
    :meth:`coldroom.physics.refrigerant.Fluid.state_ph`. A pressure below the bubble
    pressure at that enthalpy gives a two-phase state (flash gas). ``None``
    when *pressure* is ``None`` or state 3's own pressure (no change to draw).
    """
    if pressure is None:
        return None
    s3 = cycle.states[2]
    if abs(pressure - s3.p) <= 1e-6 * s3.p:
        return None
    from dataclasses import replace

    from coldroom.physics.refrigerant import get_fluid

    state = get_fluid(cycle.refrigerant).state_ph(pressure, s3.h)
    return replace(state, h=s3.h)


def cycle_states(cycle: Any, valve_inlet: Any = None) -> list[tuple[str, Any]]:
    """The states the calculation used, in flow order, with their chart labels.

    ``4`` evaporator inlet, ``1e`` evaporator outlet (only when it differs from
    the compressor suction), ``1`` suction, ``2`` discharge, ``3`` condenser or
    gas-cooler outlet, ``3v`` expansion-valve inlet (only when given: the state
    after the liquid line, :func:`valve_inlet_state`).
    """
    s1, s2, s3, s4 = cycle.states
    out = [("4", s4)]
    e = cycle.evaporator_outlet
    if abs(e.h - s1.h) > 1e-6 * max(abs(s1.h), 1.0) or abs(e.p - s1.p) > 1e-6 * s1.p:
        out.append(("1e", e))
    out += [("1", s1), ("2", s2), ("3", s3)]
    if valve_inlet is not None:
        out.append(("3v", valve_inlet))
    return out


def warm_coils(cycle: Any, coil_names: Sequence[str] | None = None) -> list[tuple[str, str, Any]]:
    """The coils that evaporate above the compressor's evaporating pressure, behind EPRs.

    (mark, name, outlet state) for each, in the order of ``cycle.coil_outlets``,
    marked ``1a``, ``1b`` …; *coil_names* name the coils in that order (the
    rooms on the sheet), else ``coil 1``, ``coil 2`` … Empty for a single coil.
    """
    outlets = getattr(cycle, "coil_outlets", ()) or ()
    out: list[tuple[str, str, Any]] = []
    for i, state in enumerate(outlets):
        if state.p > cycle.evaporating_pressure * (1.0 + 1e-6) and len(out) < 26:
            name = coil_names[i] if coil_names is not None and i < len(coil_names) else f"coil {i + 1}"
            out.append((f"1{chr(ord('a') + len(out))}", name, state))
    return out


def short_name(name: str, most: int = 18) -> str:
    name = clean(" ".join(str(name).split()))
    return name if len(name) <= most else name[: most - 1] + "…"


def state_rows(cycle: Any, system: str, valve_inlet: Any = None,
               coil_names: Sequence[str] | None = None) -> list[list[str]]:
    """The state table (header row first) in *system* units: 1, 2, 3, 4, and 3v and 1e when
    present, then the outlets of the warmer coils behind EPRs (1a, 1b …, :func:`warm_coils`)."""
    from coldroom.output.pdf.text import q, temperature

    names = {
        "1": "1  compressor suction",
        "2": "2  compressor discharge",
        "3": "3  gas-cooler outlet" if cycle.transcritical else "3  condenser outlet",
        "3v": "3v expansion-valve inlet",
        "4": "4  evaporator inlet",
        "1e": "1e evaporator outlet",
    }
    by_name = dict(cycle_states(cycle, valve_inlet))
    rows = [["State", "Pressure", "Temperature", "Enthalpy", "Entropy", "Quality"]]
    warm = warm_coils(cycle, coil_names)
    for mark, name, st in warm:
        names[mark] = f"{mark} outlet, {short_name(name)} (EPR)"
        by_name[mark] = st
    for key in ("1", "2", "3", "3v", "4", "1e", *(m for m, _, _ in warm)):
        st = by_name.get(key)
        if st is None:
            continue
        rows.append(
            [
                names[key],
                q(st.p, "pressure", system),
                temperature(st.t, system),
                q(st.h, "specific_energy", system, 1),
                q(st.s, "specific_heat", system, 4),
                "–" if st.quality is None else f"{st.quality:.3f}",
            ]
        )
    return rows
