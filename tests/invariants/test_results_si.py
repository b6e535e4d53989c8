"""Results stay SI; only the reports speak the project's units.

An IP project's JSON carries no IP unit text (its numbers and wording are SI);
its sheet basis and terminal output carry no SI temperature text.
"""

from __future__ import annotations

import json
import re

import pytest

from pathlib import Path

PROJECT_FILES = Path(__file__).resolve().parents[2] / "project_files"

IP_TEXT = re.compile(r"°F|Btu|\bft\b|ft²|ft³|\blb\b|\bTR\b|\bpsi")


@pytest.fixture(scope="module")
def ip_result():
    from coldroom.inputs.opening import open_project
    from coldroom.design.sizing import size_project

    opened = open_project(PROJECT_FILES / "meat_cooler_ip.yaml")
    assert opened.model.project.units == "IP"
    return opened.model, size_project(opened.model, opened.path, opened.content)


def test_ip_project_json_has_no_ip_unit_text(ip_result) -> None:
    _model, result = ip_result
    data = result.to_json()
    basis = [row["value"] for room in data["rooms"] for row in room["sizing_basis"]]
    assert basis and not [text for text in basis if IP_TEXT.search(text)]
    assert any("°C" in text for text in basis)
    found = IP_TEXT.findall(json.dumps(data, ensure_ascii=False))
    assert not found, found


def test_ip_sheet_basis_shows_the_same_terms_in_ip_units(ip_result) -> None:
    from coldroom.units import format_terms

    _model, result = ip_result
    for what, phrase in result.rooms[0].sizing_basis:
        ip = format_terms(phrase, "IP")
        assert "°C" not in ip, (what, ip)
    shown = dict((what, format_terms(phrase, "IP")) for what, phrase in result.rooms[0].sizing_basis)
    assert shown["Site: outdoor design dry bulb"].endswith("°F")


def test_ip_terminal_summary_speaks_ip(ip_result) -> None:
    from coldroom.output.terminal import size_summary

    model, result = ip_result
    text = size_summary(result, model)
    assert "°F" in text and "°C" not in text


def test_check_report_in_ip_has_no_si_temperatures() -> None:
    """The existing-unit report (verdict, ambient range, warnings) in an IP project reads °F only."""
    from coldroom.design.existing import check_existing_units
    from coldroom.inputs.opening import open_project
    from coldroom.output.terminal import check_report

    model = open_project(PROJECT_FILES / "cooler_to_freezer.yaml").model
    ip = model.model_copy(update={"project": model.project.model_copy(update={"units": "IP"})})
    checks = check_existing_units(ip)
    text = check_report(ip, checks)
    assert "verdict: " in text and "°F" in text
    assert "°C" not in text, [line for line in text.splitlines() if "°C" in line]
