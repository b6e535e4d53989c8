"""reportlab's C accelerator (the ``rl_accel`` package, a dependency) must write
the same PDF bytes as reportlab's own pure-Python routines.

The sheet's bytes depend on these routines only: number formatting for the
content streams (``fp_str``), the ASCII-85 stream encoding, the text encoding
for the standard fonts (``unicode2T1``) and string widths for line breaking and
layout (``instanceStringWidthT1``). Each accelerated routine is compared with
reportlab's Python version on generated inputs (invariant: same output).
"""

from __future__ import annotations

from hypothesis import given
from hypothesis import strategies as st



def _both():
    """reportlab's accelerator interface loaded afresh with its testing switch
    on, so it holds both the compiled routines (``_c_funcs``) and reportlab's
    Python versions (``_py_funcs``)."""
    import importlib.util

    import reportlab

    spec = importlib.util.find_spec("reportlab.lib.rl_accel")
    module = importlib.util.module_from_spec(spec)
    reportlab._rl_testing = True
    try:
        spec.loader.exec_module(module)
    finally:
        del reportlab._rl_testing
    return module._c_funcs, module._py_funcs


C, PY = _both()


def test_the_accelerator_is_in_use():
    from reportlab.lib import rl_accel

    assert {"fp_str", "asciiBase85Encode", "unicode2T1", "instanceStringWidthT1"} <= set(C)
    assert rl_accel.fp_str is C["fp_str"]


numbers = st.floats(min_value=-1e7, max_value=1e7, allow_nan=False) | st.integers(-10**6, 10**6)


@given(st.lists(numbers, min_size=1, max_size=6))
def test_number_formatting_is_the_same(values):
    assert C["fp_str"](*values) == PY["fp_str"](*values)


@given(st.binary(max_size=300))
def test_ascii85_encoding_is_the_same(data):
    assert C["asciiBase85Encode"](data) == PY["asciiBase85Encode"](data)


text = st.text(alphabet=st.characters(max_codepoint=0x2FFF, exclude_categories=("Cs",)), max_size=60)


@given(text, st.sampled_from(["Helvetica", "Helvetica-Bold", "Helvetica-Oblique"]),
       st.floats(min_value=4.0, max_value=40.0))
def test_text_encoding_and_widths_are_the_same(value, font_name, size):
    from reportlab.pdfbase.pdfmetrics import getFont

    font = getFont(font_name)
    fonts = [font] + list(font.substitutionFonts)
    assert C["unicode2T1"](value, fonts) == PY["unicode2T1"](value, fonts)
    assert C["instanceStringWidthT1"](font, value, size) == PY["instanceStringWidthT1"](font, value, size)
