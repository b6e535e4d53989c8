"""Fuzzed command-line options of `coldroom cycle` and `coldroom check`: never an internal error.

Whatever is typed, the run ends with one of the documented exit codes (0 ok, 1 calculation
impossible, 2 usage, 65 project file, 73 output) and never with an unexpected exception
(exit 70 "internal error … please report it" in a real process). Hypothesis with the
project's derandomized profile (tests/conftest.py), kept small: every example runs in-process.
"""

from __future__ import annotations

import shutil
from pathlib import Path

from hypothesis import given, settings
from hypothesis import strategies as st
from typer.testing import CliRunner

from coldroom.cli import app

REPO = Path(__file__).resolve().parents[2]
COOLER = REPO / "project_files" / "produce_cooler.yaml"  # no existing unit: `check` stays quick
DOCUMENTED = {0, 1, 2, 65, 73}

NUMBERS = st.one_of(
    st.sampled_from(["0", "-0", "1e-320", "4.9e-324", "1e308", "-1e308", "nan", "inf", "-inf", "1,5", "1_000", "", " "]),
    st.floats(allow_nan=True, allow_infinity=True).map(repr),
    st.floats(-200.0, 200.0).map(lambda x: f"{x:g}"),
)
UNITS = st.sampled_from(["", " °C", " °F", " K", " kW", " W", " mW", " MW", " Btu/h", " TR", " hp", " kg", " %", " furlongs"])
QUANTITY = st.builds(lambda n, u: n + u, NUMBERS, UNITS)
REFRIGERANT = st.sampled_from(["R134a", "R-448A", "R449A", "R404A", "R290", "R744", "R717", "R999", "", "r-134A", "CO2"])
FRACTION = st.one_of(st.floats(allow_nan=True, allow_infinity=True), st.sampled_from([0.0, 1e-9, 1.0, 1.0000001, -1.0]))


def invoke(args: list[str]):  # type: ignore[no-untyped-def]
    result = CliRunner().invoke(app, args)
    assert result.exception is None or isinstance(result.exception, SystemExit), (args, repr(result.exception))
    assert result.exit_code in DOCUMENTED, (args, result.exit_code, result.output)
    return result


TYPICAL = {
    "--refrigerant": st.sampled_from(["R134a", "R-448A", "R404A", "R290", "R744", "R717", "R-1234yf", "R449A"]),
    "--evaporating": st.floats(-45.0, 5.0).map(lambda x: f"{x:.4g} °C"),
    "--condensing": st.floats(20.0, 60.0).map(lambda x: f"{x:.4g}"),
    "--capacity": st.floats(100.0, 1e5).map(lambda x: f"{x:.5g} W"),
    "--superheat": st.floats(0.0, 20.0).map(lambda x: f"{x:.3g}"),
    "--isentropic-efficiency": st.floats(0.4, 1.0).map(repr),
    "--clearance": st.floats(0.0, 0.1).map(repr),
}
GARBAGE = {
    "--refrigerant": REFRIGERANT,
    "--isentropic-efficiency": FRACTION.map(repr),
    "--clearance": FRACTION.map(repr),
}


@settings(max_examples=40)
@given(
    values=st.fixed_dictionaries(TYPICAL),
    corrupt=st.lists(st.sampled_from([*TYPICAL, "--gas-cooler-outlet"]), max_size=2),
    data=st.data(),
)
def test_cycle_options_never_end_in_an_internal_error(values, corrupt, data) -> None:
    """A plausible cycle with up to two options replaced by anything (so most runs calculate)."""
    for option in corrupt:
        values[option] = data.draw(GARBAGE.get(option, QUANTITY), label=option)
    args = ["cycle", "--json"]
    for option, value in values.items():
        args += [option, value]
    invoke(args)


@settings(max_examples=30)
@given(
    project=st.sampled_from(["cooler", "missing", "directory", "/dev/null", "empty", ""]),
    json_out=st.one_of(
        st.none(),
        st.sampled_from(["", "-", "/dev/stdout", "/dev/null", "out/", ".", "input", "existing", "a" * 300, "b" * 240,
                         "missing/x.json", "x.json"]),
        st.text(st.characters(blacklist_categories=("Cs",), blacklist_characters="\x00/"), max_size=20),
    ),
    force=st.booleans(),
)
def test_check_options_never_end_in_an_internal_error(project, json_out, force, tmp_path_factory) -> None:
    folder = tmp_path_factory.mktemp("fuzz")
    cooler = folder / "cooler.yaml"
    shutil.copyfile(COOLER, cooler)
    (folder / "existing").write_text("keep\n")
    (folder / "empty").write_text("")
    (folder / "directory").mkdir()
    paths = {"cooler": str(cooler), "missing": str(folder / "missing.yaml"), "directory": str(folder / "directory"),
             "empty": str(folder / "empty")}
    args = ["check", paths.get(project, project)]
    if json_out is not None:
        target = {"input": str(cooler)}.get(json_out, json_out)
        if target and not target.startswith(("/", "-")):
            target = str(folder / target)
        args += ["--json", target]
    if force:
        args.append("--force")
    invoke(args)
    assert (folder / "existing").read_text() == "keep\n" or force
    assert cooler.read_bytes() == COOLER.read_bytes()  # never over the input
