"""The sheet's Paragraph keeps its line breaking for the width last asked
(coldroom.output.pdf.layout.Paragraph). Invariant: the PDF is byte-for-byte the one
reportlab's own Paragraph writes for a document whose paragraphs split across
pages, sit in tables and in KeepTogether groups; asked at any sequence of widths
it answers (size and lines) as a fresh Paragraph would; a paragraph whose lines a
refused split discarded is broken afresh. (The demo sheets' bytes are pinned by
tests/regression/test_sheet.py.)
"""

from __future__ import annotations

import io

import pytest
from hypothesis import given, settings
from hypothesis import strategies as st
from reportlab.platypus import Paragraph as PlainParagraph

from coldroom.output.pdf import layout

@pytest.fixture
def plain_wrap(monkeypatch):
    """Switch the cache off: layout.Paragraph.wrap becomes reportlab's own."""

    def use_plain() -> None:
        monkeypatch.setattr(layout.Paragraph, "wrap", PlainParagraph.wrap)

    return use_plain


def _story():
    from reportlab.platypus import KeepTogether, Spacer

    words = "evaporator superheat subcooling transmission infiltration defrost glide pressure".split()
    text = " ".join(words[i % len(words)] for i in range(260))
    story = []
    for k in range(6):
        story.append(layout.heading(f"Section {k}"))
        story.append(layout.Paragraph(text, layout.BODY))  # splits across pages
        story.append(KeepTogether([layout.note(text[: 300 + 40 * k]), Spacer(1, 4)]))
        story.append(layout.grid([["Item", "Working"]] + [[f"line {i}", text[: 90 + 13 * i]] for i in range(12)],
                                 [80.0, 300.0]))
    return story


def _document() -> bytes:
    from reportlab.lib.pagesizes import A4

    buffer = io.BytesIO()
    doc = layout.document(buffer, A4, 40.0, title="t", author="", subject="", creator="")
    doc.build(_story())
    return buffer.getvalue()


def test_split_tables_and_groups_write_the_same_bytes(plain_wrap):
    cached = _document()
    plain_wrap()
    assert _document() == cached


@settings(max_examples=40)
@given(st.lists(st.floats(min_value=20.0, max_value=500.0), min_size=1, max_size=6),
       st.integers(min_value=1, max_value=60))
def test_any_sequence_of_widths_gives_the_plain_paragraphs_sizes(widths, words):
    # whatever widths it is asked at, in any order and repeated, the cached
    # paragraph answers as a fresh reportlab Paragraph would at each width
    text = " ".join(f"word{i % 7}" * (1 + i % 3) for i in range(words))
    cached = layout.Paragraph(text, layout.BODY)
    for width in widths + widths[::-1]:
        fresh = PlainParagraph(text, layout.BODY)
        assert cached.wrap(width, 800.0) == fresh.wrap(width, 800.0)
        assert [line[1] if isinstance(line, tuple) else line.words for line in cached.blPara.lines] == \
            [line[1] if isinstance(line, tuple) else line.words for line in fresh.blPara.lines]


def test_lines_discarded_by_a_refused_split_are_broken_again():
    p = layout.Paragraph("one two three four five six seven eight nine ten " * 4, layout.BODY)
    width, height = p.wrap(120.0, 1000.0)
    assert p.split(120.0, 5.0) == []  # not even one line fits: reportlab drops its lines
    assert "blPara" not in p.__dict__
    assert p.wrap(120.0, 1000.0) == (width, height)
    assert "blPara" in p.__dict__


def test_the_sheet_builds_its_paragraphs_from_layout_only():
    # every coldroom module takes Paragraph from coldroom.output.pdf.layout (the one that keeps its
    # line breaking); only layout itself imports reportlab's
    import ast
    from pathlib import Path

    package = Path(layout.__file__).resolve().parents[1]
    offenders = []
    for path in package.rglob("*.py"):
        for node in ast.walk(ast.parse(path.read_text(encoding="utf-8"))):
            if isinstance(node, ast.ImportFrom) and (node.module or "").startswith("reportlab"):
                if any(alias.name == "Paragraph" for alias in node.names) and path.name != "layout.py":
                    offenders.append(str(path.relative_to(package)))
    assert offenders == []
