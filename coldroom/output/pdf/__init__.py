"""The PDF sizing sheet (reportlab). Only this package imports reportlab.

Modules:

``sheet``              the sizing sheet: the project and room sections in order, :func:`sheet.render_sheet`
``context``            ``SheetContext``, what every section reads, and the look-ups sections share
``page_frame``         header, footer and "page x of y" of the sheet and the comparison
``layout``             the look: colours, paragraph styles, headings, grids, figure and warning boxes
``cycle_section``      a cycle's state table, p–h chart and compressor figures on the sheet
``cautions_section``   the safety cautions (refrigerant class, people shut in, frozen ground, electrical)
``existing_unit_section``, ``verdict_section``, ``selection_section``, ``pipework_section``, ``timecharts``
                       the existing-unit check, page-1 verdict, selected equipment, pipework and
                       charge, design-day and pull-down sections
``charts``             the load-breakdown bar chart (a flowable drawn on the canvas)
``phchart``            the pressure–enthalpy diagram (a flowable; line data from coldroom.physics.chart_data)
``ph_window``          what a p–h chart shows: window, round line values, ticks
``ph_states``          a cycle's states in flow order with their labels; the state table
``ph_geometry``        spline smoothing, clipping and the label-occupancy grid of the chart
``cyclepage``          the stand-alone cycle page of ``coldroom cycle --out``
``comparepage``        the options comparison of ``coldroom compare --out``
``proposal``           the customer's proposal of ``coldroom quote --out``
``text``               text helpers: characters the built-in Helvetica can show, number formatting

The sheet only presents a :class:`coldroom.results.ProjectResult` (and echoes
the project's own inputs); it computes nothing new. Part of ``output`` (stage 7).
"""

from __future__ import annotations

__all__ = ["render_sheet"]


def render_sheet(result, model=None) -> bytes:  # type: ignore[no-untyped-def]
    """Render the sizing sheet of *result* as PDF bytes (see :func:`coldroom.output.pdf.sheet.render_sheet`)."""
    from coldroom.output.pdf.sheet import render_sheet as _render

    return _render(result, model)
