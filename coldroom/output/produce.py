"""From an opened project to a command's outputs: the one route the CLI and ``coldroom serve`` share.

Each function takes what a command has opened (the model, the project file's name as given
and its bytes) and returns the outputs as data: the JSON document (the envelope of
:mod:`coldroom.output.json_contract`), the PDF bytes, the costing workbook bytes. The CLI
writes them to files; the server sends them. Neither computes anything of its own, so a
download from the server equals what the command writes for the same bytes.

Heavy modules (CoolProp, reportlab, openpyxl) are imported inside the functions.
"""

from __future__ import annotations

import hashlib
import os
from typing import Any, Optional


def json_document(command: str, body: Any, model: Any, file: str, content: bytes) -> dict[str, Any]:
    """*command*'s JSON document around *body* (a mapping or a function making it)."""
    from coldroom.output.json_contract import document, project_block

    return document(command, body() if callable(body) else body, project_block(model, file, content))


def json_bytes(document: dict[str, Any]) -> bytes:
    """A JSON document as the commands write it (strict JSON, UTF-8)."""
    from coldroom.output.files import json_text

    return json_text(document).encode("utf-8")


# --- size -------------------------------------------------------------------------------------


def size_result(model: Any, file: str, content: bytes) -> Any:
    """The sized job (:func:`coldroom.design.sizing.size_project`)."""
    from coldroom.design.sizing import size_project  # CoolProp, lazily

    return size_project(model, file, content)


def size_pdf(result: Any, model: Any, selection: Optional[Any] = None) -> bytes:
    """The PDF sizing sheet (with the selected equipment when *selection* is given)."""
    from coldroom.output.pdf.sheet import render_sheet  # reportlab, lazily

    if selection is None:
        return render_sheet(result, model)
    return render_sheet(result, model, selection=selection)


def size_document(result: Any, model: Any, file: str, content: bytes) -> dict[str, Any]:
    """``coldroom size --json``'s document."""
    return json_document("size", result.to_json, model, file, content)


# --- compare ----------------------------------------------------------------------------------


def compare_result(model: Any, file: str, content: bytes) -> Any:
    """The base and its options over a year (:func:`coldroom.design.annual.compare`).

    Raises
    ------
    ProjectFileError
        No year's ambient in the project, or the weather named cannot be used (at the key's line).
    """
    from coldroom.errors import ProjectFileError
    from coldroom.inputs.safeyaml import load_yaml

    if model.design.weather is None and model.design.ambient_bins is None:
        raise load_yaml(content, filename=file).error(
            "compare needs the year's ambient: design.weather (an EPW file) or design.ambient_bins",
            ("design",),
        )
    from coldroom.design.annual import compare  # CoolProp, lazily

    try:
        return compare(model)
    except ProjectFileError as exc:
        if exc.file and exc.file != file:  # the weather file's own line
            raise
        raise load_yaml(content, filename=file).error(exc.message, ("design", "weather")) from None


def compare_pdf(result: Any, model: Any, file: str, content: bytes) -> bytes:
    """The comparison's PDF."""
    from coldroom.design.sizing import sheet_date, versions
    from coldroom.output.pdf.comparepage import render_compare  # reportlab, lazily

    meta = {
        "date": sheet_date(model.project.date),
        "input_file": os.path.basename(file),
        "input_sha256": hashlib.sha256(content).hexdigest(),
        "versions": versions(),
        "prepared_by": model.project.prepared_by,
        "client": model.project.client,
        "site": model.project.site,
    }
    return render_compare(result, model.project.units, meta)


def compare_document(result: Any, model: Any, file: str, content: bytes) -> dict[str, Any]:
    """``coldroom compare --json``'s document."""
    return json_document("compare", result.to_json, model, file, content)


# --- select and quote -------------------------------------------------------------------------


def selections_for(model: Any, equipment: Any) -> Any:
    """Each system's selection from the catalogue; when nothing fits, the duty is named in the project's units."""
    from coldroom.design.selection import NothingFitsError, select_project  # CoolProp, lazily
    from coldroom.units import format_terms

    try:
        return select_project(model, equipment)
    except NothingFitsError as exc:
        raise NothingFitsError(format_terms(exc.args[0], model.project.units)) from None


def selected_job(model: Any, file: str, content: bytes, selections: Any) -> Any:
    """The sized job equipped as chosen (:func:`coldroom.design.job.selected_result`)."""
    from coldroom.design.job import selected_result

    return selected_result(model, size_result(model, file, content), selections)


def select_document(selections: Any, catalogue: str, equipment: Any, job: Any, model: Any, file: str,
                    content: bytes) -> dict[str, Any]:
    """``coldroom select --json``'s document (*catalogue*: the catalogue's name as given; *job*: :func:`selected_job`)."""
    from coldroom.output.json_contract import select_body

    return json_document("select", lambda: select_body(selections, catalogue, equipment.currency, job), model, file,
                         content)


def quote_result(model: Any, file: str, content: bytes, equipment: Any) -> tuple[Any, Any, Any]:
    """The quote, the sized job and the selections it priced."""
    from coldroom.design.quote import build_quote

    selections = selections_for(model, equipment)
    result = size_result(model, file, content)
    return build_quote(model, equipment, result, selections), result, selections


def proposal_pdf(quote: Any, result: Any, model: Any) -> bytes:
    """The proposal for the customer (PDF)."""
    from coldroom.output.pdf.proposal import render_proposal  # reportlab, lazily

    return render_proposal(quote, result, model)


def costing_xlsx(quote: Any, model: Any) -> bytes:
    """The costing workbook (XLSX)."""
    from coldroom.output.costing import costing_workbook  # openpyxl, lazily

    return costing_workbook(quote, model)


def quote_document(quote: Any, catalogue: str, model: Any, file: str, content: bytes) -> dict[str, Any]:
    """``coldroom quote --json``'s document."""
    from coldroom.output.json_contract import quote_body

    return json_document("quote", lambda: quote_body(quote, catalogue), model, file, content)


# --- the p-h chart of a sized system ------------------------------------------------------------


def cycle_svg(result: Any, model: Any, file: str, index: int) -> bytes:
    """The p–h chart page of system *index* of a sized job as SVG (the drawing ``coldroom cycle --out x.svg`` makes)."""
    from coldroom.design.sizing import sheet_date, versions
    from coldroom.output.pdf.cyclepage import render_cycle_page  # reportlab, lazily

    system = result.systems[index]
    return render_cycle_page(system.cycle, model.project.units, "svg", sheet_date(model.project.date),
                             [os.path.basename(file), system.name], versions())
