"""report.text.clean: the sheet's text filter for the built-in Helvetica (WinAnsi).

Invariants on generated text: the result always encodes in cp1252 (WinAnsi);
cleaning works character by character (a string cleans to its characters'
cleanings joined, whichever way the implementation batches the work); text
already in WinAnsi without a replaced character comes back unchanged.
"""

from __future__ import annotations

from hypothesis import given
from hypothesis import strategies as st

from coldroom.output.pdf.text import _REPLACE, clean

text = st.text(alphabet=st.characters(max_codepoint=0x33FF) | st.sampled_from(sorted(_REPLACE)), max_size=40)


@given(text)
def test_clean_text_encodes_in_winansi(value):
    clean(value).encode("cp1252")


@given(text)
def test_clean_works_character_by_character(value):
    assert clean(value) == "".join(clean(ch) for ch in value)


@given(st.text(alphabet=st.characters(max_codepoint=0xFF), max_size=40))
def test_winansi_text_is_kept(value):
    try:
        value.encode("cp1252")
    except UnicodeEncodeError:
        return
    if not any(ch in _REPLACE for ch in value):
        assert clean(value) == value
