"""The pull-down's own integrator (coldroom.loads.stiff_ode, the Rosenbrock formula of ode23s) against
scipy's LSODA (ODEPACK, [ref:petzold-1983]) as the reference, on every demo room that takes product in.

The same equations, start and report times go to both; LSODA runs as the pull-down ran before
(``odeint``, rtol 1e-6, atol 1e-3, steps of at most one report interval). Agreement asked by
issue #27: every reported temperature (room air and each product) within 0.1 K, every time to
the final temperature within one minute. Above 3 s: each demo room's design cycle is solved to
build its capacity curve (about 0.3 s a room).
"""

from __future__ import annotations

import pytest

from coldroom.inputs.opening import open_project_data
from coldroom.inputs.safeyaml import load_yaml
from tests.conftest import PROJECT_FILES

DEMOS = sorted(PROJECT_FILES.glob("*.yaml"))


def lsoda(f, y0, times, *, rtol, atol, jacobian=None):
    """The reference: scipy's odeint (LSODA) as the pull-down called it before (issue #27)."""
    from scipy.integrate import odeint

    ys, info = odeint(lambda y, _t: f([float(v) for v in y]), y0, times, rtol=1e-6, atol=1e-3,
                      hmax=900.0, mxstep=100000, full_output=True)
    assert info["message"] == "Integration successful."
    return ys.tolist()


@pytest.mark.parametrize("path", DEMOS, ids=lambda p: p.stem)
def test_rosenbrock_agrees_with_lsoda_on_the_demos(path, monkeypatch) -> None:
    import coldroom.loads.pulldown as pulldown
    from coldroom.design.sizing import size_system

    calls = []
    simulate = pulldown.simulate

    def recorded(*args, **kwargs):
        calls.append((args, kwargs))
        return simulate(*args, **kwargs)

    monkeypatch.setattr(pulldown, "simulate", recorded)
    model = open_project_data(load_yaml(path.read_bytes(), path.name).data, path.name)
    for name, entry, indices in model.system_groups():
        size_system(model, name, indices, entry.diversity if entry is not None else 1.0)
    if not calls:
        pytest.skip(f"{path.name}: no room takes product in")
    for args, kwargs in calls:
        ours = simulate(*args, **kwargs)
        reference = simulate(*args, **{**kwargs, "integrator": lsoda})
        assert ours.time == reference.time
        assert ours.air_temperature == pytest.approx(reference.air_temperature, abs=0.1)
        for mine, theirs in zip(ours.products, reference.products, strict=True):
            assert mine.temperature == pytest.approx(theirs.temperature, abs=0.1)
            assert (mine.time_to_final is None) == (theirs.time_to_final is None)
            if theirs.time_to_final is not None:
                assert mine.time_to_final == pytest.approx(theirs.time_to_final, abs=60.0)
