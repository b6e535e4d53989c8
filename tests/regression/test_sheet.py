"""Regression pins for the PDF sizing sheet of every demo project.

What is checked, and against what:

* the figures of the JSON result appear on the sheet, formatted the way the
  sheet formats them (the sheet presents the result; it must not show other
  numbers) — read back with pypdf;
* every page renders (pypdfium2) and carries ink, so a broken page fails;
* every page carries the tool version, the CoolProp version, the input's short
  hash and "Page x of y";
* two renders of the same input give identical bytes, with a creation date
  taken from the project date or SOURCE_DATE_EPOCH (no clock time, no random id);
* the design temperatures follow the trade TD table (evaporator
  TD vs room RH and air-cooled condensing 8–15 K above entering air — common
  practice [trade], no single source).
"""

from __future__ import annotations

import datetime as dt
import io
import re
from pathlib import Path

import pytest

REPO = Path(__file__).resolve().parents[2]
DEMOS = sorted(p for p in (REPO / "project_files").glob("*.yaml") if p.stem in {
    "produce_cooler", "meat_cooler_ip", "freezer_heated_slab"})


def _size(path: Path):
    from coldroom.inputs.opening import open_project
    from coldroom.output.pdf.sheet import render_sheet
    from coldroom.design.sizing import size_project

    model = open_project(path).model
    result = size_project(model, str(path), path.read_bytes())
    return model, result, render_sheet(result, model)


@pytest.fixture(scope="module", params=DEMOS, ids=lambda p: p.stem)
def sized(request):
    return _size(request.param)


def _pages_text(pdf: bytes) -> list[str]:
    import pypdf

    reader = pypdf.PdfReader(io.BytesIO(pdf))
    return [page.extract_text() or "" for page in reader.pages]


def _flat(text: str) -> str:
    return re.sub(r"\s+", " ", text)


def test_demo_list_is_complete():
    assert {p.stem for p in DEMOS} == {"produce_cooler", "meat_cooler_ip", "freezer_heated_slab"}


def test_json_figures_are_on_the_sheet(sized):
    from coldroom.output.pdf.text import capacity, q, temperature

    model, result, pdf = sized
    text = _flat(" ".join(_pages_text(pdf)))
    data = result.to_json()
    s = result.unit_system
    assert result.project_name in text
    for room in data["rooms"]:
        cycle = room["cycle"]
        expected = {
            "required capacity": capacity(room["required_capacity_w"], s),
            "design capacity": capacity(room["design_capacity_w"], s),
            "compressor power": capacity(cycle["compressor_power_w"], s),
            "heat of rejection": capacity(cycle["condenser_duty_w"], s),
            "mass flow": q(cycle["mass_flow_kg_s"], "mass_flow", s),
            "displacement": q(cycle["displacement_m3_h"] / 3600.0, "volume_flow", s),
            "suction volume flow": q(cycle["suction_volume_flow_m3_h"] / 3600.0, "volume_flow", s),
            "evaporating temperature": temperature(room["evaporating_temperature_c"], s),
            "condensing temperature": temperature(room["condensing_temperature_c"], s),
            "discharge temperature": temperature(cycle["discharge_temperature_c"], s),
            "COP": f"{cycle['cop']:.2f}",
            "suction pressure": q(cycle["states"][0]["p_pa"], "pressure", s),
            "discharge pressure": q(cycle["states"][1]["p_pa"], "pressure", s),
        }
        for what, shown in expected.items():
            assert shown in text, f"{room['name']}: {what} {shown!r} not on the sheet"
        # what the compressor power is, said beside it (JSON and sheet agree)
        assert cycle["compressor_power_basis"] == "electrical"
        assert "Compressor electrical input" in text
        # which areas the transmission lines use, in the basis and in each line's working
        assert room["transmission_area_basis"] == "outside"
        assert "transmission areas outside surface of each section" in text
        assert re.search(r"(m²|ft²) outside × ", text)
        # every load component's 24-h average, in the load table
        for component, watts in room["loads_w"].items():
            shown = q(watts, "power", s, 0).rsplit(" ", 1)[0]
            assert shown in text, f"{room['name']}: {component} {shown!r} not on the sheet"


def test_every_page_has_footer_and_page_numbers(sized):
    _model, result, pdf = sized
    pages = _pages_text(pdf)
    total = len(pages)
    assert total >= 2
    for number, page in enumerate(pages, start=1):
        flat = _flat(page)
        assert f"Page {number} of {total}" in flat
        assert f"coldroom {result.versions['coldroom']}" in flat
        assert f"CoolProp {result.versions['coolprop']}" in flat
        assert result.input_sha256[:12] in flat


def test_every_page_renders(sized):
    import pypdfium2 as pdfium

    _model, result, pdf = sized
    document = pdfium.PdfDocument(pdf)
    try:
        assert len(document) >= 2
        for index in range(len(document)):
            page = document[index]
            width, height = page.get_size()
            # A4 for SI, US Letter for IP [pt]
            assert (round(width), round(height)) == ((612, 792) if result.unit_system == "IP" else (595, 842))
            image = page.render(scale=0.5).to_pil().convert("L")
            histogram = image.histogram()
            dark = sum(histogram[:200])
            assert dark > 500, f"page {index + 1} is (nearly) blank"
    finally:
        document.close()


def test_sheet_uses_only_builtin_fonts(sized):
    _model, _result, pdf = sized
    fonts = set(re.findall(rb"/BaseFont /([A-Za-z\-]+)", pdf))
    assert fonts and fonts <= {b"Helvetica", b"Helvetica-Bold"}
    assert b"/FontFile" not in pdf  # nothing embedded: same bytes on every machine


def test_two_renders_are_identical_and_dated_from_the_project(sized):
    from coldroom.output.pdf.sheet import render_sheet

    model, result, pdf = sized
    assert render_sheet(result, model) == pdf
    stamp = "D:" + result.date.replace("-", "") + "000000+00'00'"
    assert stamp.encode() in pdf
    assert pdf.count(b"/CreationDate") == 1


def test_date_from_source_date_epoch(tmp_path, monkeypatch):
    """Without project.date the sheet is dated from SOURCE_DATE_EPOCH (UTC), reproducibly."""
    source = (REPO / "project_files" / "produce_cooler.yaml").read_text(encoding="utf-8")
    undated = re.sub(r"(?m)^\s*date:.*\n", "", source)
    assert "date:" not in undated
    path = tmp_path / "undated.yaml"
    path.write_text(undated, encoding="utf-8")
    epoch = 1_790_000_000  # 2026-09-21 (UTC)
    monkeypatch.setenv("SOURCE_DATE_EPOCH", str(epoch))
    _m1, r1, pdf1 = _size(path)
    _m2, _r2, pdf2 = _size(path)
    expected = dt.datetime.fromtimestamp(epoch, tz=dt.timezone.utc).date().isoformat()
    assert r1.date == expected == "2026-09-21"
    assert pdf1 == pdf2
    assert expected in _flat(" ".join(_pages_text(pdf1)))


# Design temperatures: trade TD table ([trade], common practice, no single source).
@pytest.mark.parametrize(
    "stem, evaporating, condensing",
    [
        # 2 °C at 90 % RH: TD 4.5 K (4–5 K ≈ 90 % RH); condenser air 32 °C + 10 K
        ("produce_cooler", 2.0 - 4.5, 32.0 + 10.0),
        # freezer with evaporator_td 6 K given; condenser air 30 °C + 10 K
        ("freezer_heated_slab", -20.0 - 6.0, 30.0 + 10.0),
    ],
)
def test_design_temperatures_follow_the_td_table(stem, evaporating, condensing):
    from coldroom.inputs.opening import open_project
    from coldroom.rules import design_temperatures

    model = open_project(REPO / "project_files" / f"{stem}.yaml").model
    room = model.rooms[0]
    r = room.refrigeration
    t = design_temperatures(
        room.temperature, room.rh, model.design.outdoor_temperature, r.evaporator_td, r.condenser_td,
        r.condenser_air_temperature,
    )
    assert t.evaporating_temperature == pytest.approx(evaporating, abs=1e-9)
    assert t.condensing_temperature == pytest.approx(condensing, abs=1e-9)


@pytest.mark.parametrize(
    "rh, td",
    [(0.95, 4.5), (0.90, 4.5), (0.85, 6.0), (0.80, 6.0), (0.75, 7.5), (0.65, 7.5), (0.60, 10.0), (0.40, 12.0)],
)
def test_td_inside_the_trade_band(rh, td):
    """The chosen TD lies inside the trade band for the RH [trade]."""
    from coldroom.rules import evaporator_td_for

    bands = [(0.875, 1.01, 4.0, 5.0), (0.80, 0.875, 5.5, 6.5), (0.65, 0.80, 6.5, 9.0), (0.50, 0.65, 9.0, 12.0),
             (0.0, 0.50, 9.0, 12.0)]
    chosen, source = evaporator_td_for(5.0, rh)
    assert chosen == td
    low, high = next((lo, hi) for a, b, lo, hi in bands if a <= rh < b)
    assert low <= chosen <= high
    assert "[trade]" in source


def test_freezer_td_is_the_freezer_band():
    from coldroom.rules import evaporator_td_for

    td, _source = evaporator_td_for(-25.0, 0.9)
    assert 5.0 <= td <= 6.0  # freezers ≈ 5–6 K [trade]


def test_combo_sheet_page_one_shows_the_whole_job():
    """Page 1 of a job with one system of two rooms: the systems table with its total row above the rooms."""
    from coldroom.output.pdf.text import capacity, temperature

    path = REPO / "project_files" / "combo_cooler_freezer.yaml"
    model, result, pdf = _size(path)
    pages = [_flat(t) for t in _pages_text(pdf)]
    first = pages[0]
    system = result.systems[0]
    assert first.index("The job: systems") < first.index("Total, 1 system") < first.index("Room Conditions")
    for shown in (
        capacity(system.design_capacity, "SI"),
        capacity(system.heat_of_rejection, "SI"),
        temperature(system.suction_temperature, "SI"),
        "Connected load",
        "Electricity per day",
        f"{system.electrical.daily_energy / 3.6e6:.1f} kWh",
    ):
        assert shown in first, shown
    everything = " ".join(pages)
    for member in system.members:  # each coil keeps its own evaporating temperature and duty
        assert temperature(member.evaporating_temperature, "SI") in everything
        assert capacity(member.duty, "SI") in everything
    assert "not credited" in everything  # the cooler's partition to the freezer, with its working
    assert any("System CU-1: Cooler, Freezer" in page and "Pressure" in page for page in pages[1:])
