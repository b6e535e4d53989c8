"""The PDF sizing sheet (reportlab). Only this package imports reportlab.

Modules:

``sheet``    the document: page frame, one function per section, :func:`sheet.render_sheet`
``charts``   the load-breakdown bar chart (a flowable drawn on the canvas)
``phchart``  the pressure–enthalpy diagram (a flowable; dome data from coldroom.physics.refrigerant)
``text``     text helpers: characters the built-in Helvetica can show, number formatting

The sheet only presents a :class:`coldroom.results.ProjectResult` (and echoes
the project's own inputs); it computes nothing new. Part of ``output`` (stage 7).
"""

from __future__ import annotations

__all__ = ["render_sheet"]


def render_sheet(result, model=None) -> bytes:  # type: ignore[no-untyped-def]
    """Render the sizing sheet of *result* as PDF bytes (see :func:`coldroom.output.pdf.sheet.render_sheet`)."""
    from coldroom.output.pdf.sheet import render_sheet as _render

    return _render(result, model)
