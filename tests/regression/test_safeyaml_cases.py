"""Hostile and surprising project files: each limit and each YAML trap.

References for the expected readings:
- YAML 1.1 type library, "bool" (yaml.org/type/bool.html): y|Y|yes|Yes|YES|n|N|no|No|NO|
  true|...|on|On|ON|off|Off|OFF are booleans; "int" (yaml.org/type/int.html): a leading 0 is
  octal, 0x hexadecimal, 0b binary, and base 60 ("190:20:30"); "float" (yaml.org/type/float.html):
  .inf/.nan and base 60.
- YAML 1.2.2 specification, section 10.3.2 "Core Schema" tag resolution: only true/True/TRUE,
  false/False/FALSE are booleans; 0o17 is octal and 0x1F hexadecimal.
- PyYAML (the reference library under the loader) keeps the last of duplicate keys; checked
  below so the test fails if that ever changes and the test premise is stale.
- "Billion laughs": the classic entity-expansion attack (first described for XML), here with
  YAML anchors and aliases.
"""

from __future__ import annotations

import time

import pytest
import yaml

from coldroom.errors import ProjectFileError
from coldroom.inputs.safeyaml import MAX_BYTES, dotted, load_yaml

FAST = 0.5  # [s] a hostile file must be rejected within this time (brief: bombs < 0.1 s on an idle machine)


def reject(source, filename="p.yaml", **limits) -> ProjectFileError:
    """Load *source*, assert a ProjectFileError, return it."""
    with pytest.raises(ProjectFileError) as info:
        load_yaml(source, filename, **limits)
    error = info.value
    assert error.file == filename
    return error


def timed_reject(source, **limits) -> tuple[ProjectFileError, float]:
    start = time.perf_counter()
    error = reject(source, **limits)
    return error, time.perf_counter() - start


# --- alias bombs ---------------------------------------------------------------


def billion_laughs(levels: int = 9, fan: int = 9) -> str:
    lines = [f"l0: &l0 [{', '.join(['lol'] * fan)}]"]
    for i in range(1, levels + 1):
        lines.append(f"l{i}: &l{i} [{', '.join([f'*l{i - 1}'] * fan)}]")
    return "\n".join(lines) + "\n"


def count_leaves(value) -> int:
    return sum(count_leaves(v) for v in value) if isinstance(value, list) else 1


def test_premise_pyyaml_builds_a_bomb_from_shared_lists():
    # PyYAML builds the structure by sharing lists; a validator that walks it (pydantic)
    # visits every element. Checked on a small bomb: 4 levels of 9 over 9 leaves = 9**5.
    data = yaml.safe_load(billion_laughs(levels=4))
    assert count_leaves(data["l4"]) == 9**5
    assert data["l4"][0] is data["l4"][1]


def test_billion_laughs_rejected_fast_and_located():
    source = billion_laughs()
    assert len(source) < 1000 and source.count("*") <= 100  # under the alias-count limit
    error, seconds = timed_reject(source)
    assert "more than 100000 values with its aliases (*name) expanded" in error.message
    assert seconds < FAST
    assert error.line is not None and 2 <= error.line <= 10


def test_wide_bomb_under_alias_count_rejected_fast():
    # 6 kB: one list of 2 000 numbers, referenced 99 times -> ~200 000 values
    source = "x: &x [" + ", ".join(["1"] * 2000) + "]\nxs: [" + ", ".join(["*x"] * 99) + "]\n"
    error, seconds = timed_reject(source)
    assert "values with its aliases (*name) expanded" in error.message
    assert seconds < FAST


def test_alias_count_limit():
    source = "x: &x 1\nxs: [" + ", ".join(["*x"] * 101) + "]\n"
    error, seconds = timed_reject(source)
    assert "more than 100 aliases" in error.message
    assert error.line == 2
    assert seconds < FAST
    # 100 aliases of a scalar are fine
    ok = load_yaml("x: &x 1\nxs: [" + ", ".join(["*x"] * 100) + "]\n")
    assert ok.data["xs"] == [1] * 100


def test_recursive_alias_rejected():
    for source in ("a: &x [1, *x]\n", "a: &x {b: *x}\n"):
        error, seconds = timed_reject(source)
        assert "contains it" in error.message
        assert seconds < FAST


def test_aliases_expand_into_independent_copies_with_alias_marks():
    loaded = load_yaml("base: &d {width: 0.9, height: 2.0}\nrooms:\n  - door: *d\n  - door: *d\n")
    assert loaded.data["rooms"][0]["door"] == {"width": 0.9, "height": 2.0}
    assert loaded.data["rooms"][0]["door"] is not loaded.data["rooms"][1]["door"]
    assert loaded.value_marks[("rooms", 1, "door")] == (4, 11)  # where *d stands
    assert loaded.marks[("rooms", 1, "door", "width")] == (1, 11)  # keys: where the anchor's keys stand


# --- size, depth, encoding --------------------------------------------------------


def test_oversize_rejected_before_parsing():
    source = b"a: 1\n" + b"# padding\n" * (MAX_BYTES // 10 + 1)
    error, seconds = timed_reject(source)
    assert "larger than the limit" in error.message and str(MAX_BYTES) in error.message
    assert seconds < 0.05  # no parsing happened
    error = reject("a: 'xx'\n", max_bytes=5)
    assert "larger than" in error.message


@pytest.mark.parametrize(
    "source",
    [
        "a: " + "[" * 40 + "]" * 40 + "\n",
        "a: " + "[" * 400_000 + "]" * 400_000 + "\n",  # ~0.8 MB of brackets
        "a: " + "{b: " * 40 + "1" + "}" * 40 + "\n",
        "".join(f"{' ' * i}k{i}:\n" for i in range(40)) + " " * 40 + "v: 1\n",  # block nesting
    ],
    ids=["flow40", "flow400k", "flowmap40", "block40"],
)
def test_deep_nesting_rejected_without_recursion_error(source):
    error, seconds = timed_reject(source)
    assert "nested deeper than 32 levels" in error.message
    assert seconds < FAST


def test_depth_32_is_accepted_33_is_not():
    # the top mapping is level 1, so 31 flow lists inside it make 32 levels
    assert load_yaml("a: " + "[" * 31 + "]" * 31 + "\n").data["a"] is not None
    reject("a: " + "[" * 32 + "]" * 32 + "\n")


def test_depth_through_aliases_counts():
    lines = ["l0: &l0 [1]"] + [f"l{i}: &l{i} [*l{i - 1}]" for i in range(1, 40)]
    error = reject("\n".join(lines) + "\n")
    assert "nested deeper than 32 levels (through aliases)" in error.message


def test_non_utf8_names_byte_offset_and_line():
    error = reject(b"name: Dairy\nnote: caf\xe9 au lait\n")
    assert "byte 0xe9 at byte offset 21" in error.message
    assert (error.line, error.column) == (2, 10)


def test_utf16_rejected_with_hint():
    error = reject("a: 1\n".encode("utf-16"))
    assert "UTF-16" in error.message


def test_bom_accepted_and_marks_unshifted():
    loaded = load_yaml(b"\xef\xbb\xbfname: Caf\xc3\xa9\nwidth: 2\n")
    assert loaded.data == {"name": "Café", "width": 2}
    assert loaded.marks[("name",)] == (1, 1)
    assert loaded.marks[("width",)] == (2, 1)


def test_control_character_located():
    error = reject("a: 1\nb: x\x07y\n")
    assert (error.line, error.column) == (2, 5)
    assert "U+0007" in error.message


# --- duplicate keys --------------------------------------------------------------------


def test_premise_pyyaml_keeps_last_duplicate():
    assert yaml.safe_load("a: 1\na: 2\n") == {"a": 2}


def test_duplicate_key_names_both_lines():
    source = "rooms:\n  - name: A\n    width: 3\n    depth: 4\n    width: 5\n"
    error = reject(source)
    assert "duplicate key 'width'" in error.message
    assert "first at line 3, again at line 5" in error.message
    assert (error.line, error.column) == (5, 5)
    assert error.key == "rooms[0].width"
    assert error.format() == f"p.yaml:5:5: rooms[0].width: {error.message}"


def test_duplicate_key_quoted_and_plain_are_the_same_key():
    error = reject("a: 1\n'a': 2\n")
    assert "duplicate key 'a'" in error.message


# --- YAML 1.1 surprises ------------------------------------------------------------


@pytest.mark.parametrize("word", ["no", "No", "NO", "yes", "Yes", "on", "ON", "off", "Off", "y", "Y", "n", "N"])
def test_yaml11_boolean_words_rejected(word):
    # YAML 1.1 "bool" type: these are booleans; YAML 1.2 core schema: text. Neither is safe.
    error = reject(f"defrost: {word}\n")
    assert "true" in error.message and "false" in error.message and "quote" in error.message
    assert error.key == "defrost"
    assert (error.line, error.column) == (1, 10)


def test_premise_pyyaml_reads_no_as_false():
    assert yaml.safe_load("a: no\n") == {"a": False}  # the surprise the loader guards against


@pytest.mark.parametrize("word", ["true", "True", "TRUE", "false", "False", "FALSE"])
def test_core_booleans_accepted(word):
    # YAML 1.2.2 section 10.3.2 core schema booleans
    assert load_yaml(f"a: {word}\n").data["a"] is (word.lower() == "true")


@pytest.mark.parametrize("word", ["'no'", '"yes"', "!!str on", "|\n  off"])
def test_quoted_boolean_words_are_text(word):
    assert load_yaml(f"a: {word}\n").data["a"].strip() in ("no", "yes", "on", "off")


@pytest.mark.parametrize(
    ("text", "fragment"),
    [
        ("010", "leading zero"),  # YAML 1.1 int: octal 8
        ("-012", "leading zero"),
        ("08", "leading zero"),
        ("0x1F", "hexadecimal"),  # YAML 1.1 and 1.2: 31
        ("0o17", "hexadecimal, octal or binary"),  # YAML 1.2 octal 15, text to PyYAML
        ("0b101", "hexadecimal, octal or binary"),  # YAML 1.1 binary 5
        ("1_000", "underscores"),  # YAML 1.1: 1000, YAML 1.2: text
        ("1:30", "base-60"),  # YAML 1.1 sexagesimal: 90
        ("8:00", "base-60"),
        ("1:30.5", "base-60"),  # YAML 1.1 float base 60: 90.5
        (".nan", "not a finite number"),  # YAML 1.1 and 1.2 .nan
        (".NaN", "not a finite number"),
        (".inf", "not a finite number"),
        ("-.inf", "not a finite number"),
        ("+.INF", "not a finite number"),
        ("1e999", "not a finite number"),  # overflows to infinity
        ("9" * 200, "too long for a number"),
    ],
)
def test_numeric_surprises_rejected(text, fragment):
    error = reject(f"room:\n  width: {text}\n")
    assert fragment in error.message
    assert error.key == "room.width"
    assert (error.line, error.column) == (2, 10)


def test_premise_pyyaml_reads_sexagesimal_and_octal():
    assert yaml.safe_load("a: 1:30\nb: 010\n") == {"a": 90, "b": 8}


@pytest.mark.parametrize(
    ("text", "value"),
    [
        ("0", 0),
        ("-0", 0),
        ("+3", 3),
        ("1200", 1200),
        ("2.5", 2.5),
        ("-0.25", -0.25),
        (".5", 0.5),
        ("1.", 1.0),
        ("1e5", 100000.0),  # YAML 1.2 core float; PyYAML (1.1) would return the text '1e5'
        ("1.5e-3", 0.0015),
        ("~", None),
        ("null", None),
        ("", None),
        ("2024-05-01", "2024-05-01"),  # timestamps stay text
        ("1.2.3", "1.2.3"),
        ("R448A", "R448A"),
        ("'010'", "010"),
        ("'1:30'", "1:30"),
        ("'.nan'", ".nan"),  # quoted: text, left to the model to refuse
        ("NaN", "NaN"),
        ("!!float 3", 3.0),
        ("!!int 42", 42),
        ("!!str 010", "010"),
        ("!!null ''", None),
    ],
)
def test_accepted_scalars(text, value):
    result = load_yaml(f"a: {text}\n").data["a"]
    assert result == value and type(result) is type(value)


def test_explicit_core_tag_with_wrong_value():
    assert "not a valid !!int" in reject("a: !!int 2.5\n").message
    assert "yes/no boolean" in reject("a: !!bool yes\n").message
    assert "not a valid !!null" in reject("a: !!null 0\n").message


# --- tags -----------------------------------------------------------------------------------


@pytest.mark.parametrize(
    "source",
    [
        "a: !!python/object/apply:os.system ['echo pwned']\n",
        "!!python/object/apply:os.system\nargs: ['echo pwned']\n",
        "a: !!python/name:os.system\n",
        "a: !!python/object:collections.OrderedDict {}\n",
        "a: !!binary aGVsbG8=\n",
        "a: !!set {x, y}\n",
        "a: !!omap [x: 1]\n",
        "a: !!timestamp 2024-05-01\n",
        "a: !custom x\n",
        "a: !!seq {x: 1}\n",
        "a: !!map [1]\n",
        "!!python/str key: 1\n",
    ],
)
def test_non_standard_tags_rejected(source):
    error, seconds = timed_reject(source)
    assert "tag" in error.message and "not allowed" in error.message
    assert seconds < FAST


# --- keys, merge, structure ---------------------------------------------------------------


@pytest.mark.parametrize(
    ("source", "fragment"),
    [
        ("1: a\n", "must be text (it reads as int)"),
        ("~: a\n", "must be text (it reads as null)"),
        ("true: a\n", "must be text (it reads as bool)"),
        ("2.5: a\n", "must be text (it reads as float)"),
        ("? [a, b]\n: 1\n", "must be text, not a list"),
        ("on: 1\n", "yes/no boolean"),
        ("y: 1\n", "yes/no boolean"),  # YAML 1.1 bool; PyYAML alone would read text
    ],
)
def test_keys_must_be_text(source, fragment):
    assert fragment in reject(source).message


def test_quoted_number_key_is_text():
    assert load_yaml("'1': a\n").data == {"1": "a"}


def test_merge_key_rejected_with_message():
    error = reject("base: &b {width: 1}\nroom:\n  <<: *b\n  depth: 2\n")
    assert "merge keys (<<) are not supported" in error.message
    assert (error.line, error.column) == (3, 3)
    assert error.key == "room"


@pytest.mark.parametrize(
    ("source", "fragment"),
    [
        ("", "empty"),
        ("# only a comment\n", "empty"),
        ("- a\n- b\n", "not a list"),
        ("just text\n", "not a single value"),
        ("a: 1\n---\nb: 2\n", "second document"),
    ],
)
def test_top_level_must_be_one_mapping(source, fragment):
    assert fragment in reject(source).message


@pytest.mark.parametrize(
    ("source", "line", "column"),
    [
        ("a: [1, 2\n", 2, 1),
        ("a: b: c\n", 1, 5),
        ("a:\n\tb: 1\n", 2, 1),
        ("a: 'open\n", 2, 1),
        ("a: *nowhere\n", 1, 4),
        ("a: &x 1\nb: &x 2\n", 2, 4),
    ],
)
def test_syntax_errors_are_project_file_errors_with_marks(source, line, column):
    error = reject(source)
    assert (error.line, error.column) == (line, column)
    assert error.format().startswith(f"p.yaml:{line}:{column}: ")


def test_never_a_yaml_error_for_wrong_input_type():
    assert "cannot read" in reject(12345).message  # type: ignore[arg-type]


# --- marks -------------------------------------------------------------------------------------

PROJECT = """\
# demo
project: Cold store
rooms:
  - name: Dairy
    doors:
      - width: 0.9
        height: 2.0
      - {width: 1.2, height: 2.1}
  - name: "Frozen"
    size: [5, 4, 3]
"""


def test_marks_point_at_keys_and_items():
    loaded = load_yaml(PROJECT, "demo.yaml")
    assert loaded.marks[()] == (2, 1)
    assert loaded.marks[("project",)] == (2, 1)
    assert loaded.marks[("rooms",)] == (3, 1)
    assert loaded.marks[("rooms", 0)] == (4, 5)
    assert loaded.marks[("rooms", 0, "doors", 0, "width")] == (6, 9)
    assert loaded.marks[("rooms", 0, "doors", 0, "height")] == (7, 9)
    assert loaded.marks[("rooms", 0, "doors", 1)] == (8, 9)
    assert loaded.marks[("rooms", 0, "doors", 1, "width")] == (8, 10)
    assert loaded.marks[("rooms", 0, "doors", 1, "height")] == (8, 22)
    assert loaded.marks[("rooms", 1, "name")] == (9, 5)
    assert loaded.marks[("rooms", 1, "size", 2)] == (10, 18)
    assert loaded.value_marks[("rooms", 1, "name")] == (9, 11)
    # every path in the data has a mark
    def paths(value, prefix=()):
        yield prefix
        if isinstance(value, dict):
            for key, item in value.items():
                yield from paths(item, prefix + (key,))
        elif isinstance(value, list):
            for index, item in enumerate(value):
                yield from paths(item, prefix + (index,))

    assert set(paths(loaded.data)) == set(loaded.marks)


def test_position_falls_back_to_longest_existing_prefix():
    loaded = load_yaml(PROJECT, "demo.yaml")
    assert loaded.position(("rooms", 0, "doors", 1, "width")) == (8, 10)
    assert loaded.position(("rooms", 0, "doors", 1, "depth")) == (8, 9)  # missing key
    assert loaded.position(("rooms", 5, "name")) == (3, 1)  # missing item
    assert loaded.position(("rooms", 1, "size", "function-after[check]", 0)) == (10, 5)
    assert loaded.position(("nowhere",)) == (2, 1)
    error = loaded.error("Field required", ("rooms", 1, "doors"))
    assert error.format() == "demo.yaml:9:5: rooms[1].doors: Field required"


def test_crlf_line_endings_marks():
    loaded = load_yaml(b"a: 1\r\nb:\r\n  c: x\r\n")
    assert loaded.data == {"a": 1, "b": {"c": "x"}}
    assert loaded.marks[("b", "c")] == (3, 3)
    error = reject(b"a: 1\r\nb:\r\n  c: off\r\n")
    assert (error.line, error.column, error.key) == (3, 6, "b.c")


def test_dotted():
    assert dotted(("rooms", 0, "doors", 1, "width")) == "rooms[0].doors[1].width"
    assert dotted(("a",)) == "a"
    assert dotted((0,)) == "[0]"
    assert dotted(()) == ""
