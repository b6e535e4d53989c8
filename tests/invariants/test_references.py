"""The project stands alone: every reference key cited exists, every entry is cited.

Code, data and tests cite published sources by key, ``[ref:KEY]``; the keys are the
``### `KEY` `` headings of docs/references.md. This checks both directions, that each
entry names an edition or year, and that nothing points at a document outside the
repository.
"""

from __future__ import annotations

import re
from pathlib import Path

ROOT = Path(__file__).resolve().parents[2]
REFERENCES = ROOT / "docs" / "references.md"
KEY = r"[a-z0-9][a-z0-9.-]*"
CITATION = re.compile(r"\[ref:([^\]\s]*)\]")
ENTRY = re.compile(rf"^### `({KEY})`\s*$", re.M)


def _entries() -> dict[str, str]:
    text = REFERENCES.read_text(encoding="utf-8")
    keys = ENTRY.findall(text)
    assert len(keys) == len(set(keys)), "a key is listed twice in docs/references.md"
    bodies = re.split(ENTRY, text)[1:]
    return {key: body for key, body in zip(bodies[0::2], bodies[1::2])}


def _sources() -> list[Path]:
    files = [ROOT / "README.md", ROOT / "DEVELOPERS.md"]
    for folder in ("coldroom", "tests"):
        for pattern in ("*.py", "*.yaml", "*.md"):
            files += sorted((ROOT / folder).rglob(pattern))
    here = Path(__file__).resolve()
    return [f for f in files if f.resolve() != here and f.is_file()]


def _citations() -> dict[str, list[str]]:
    cited: dict[str, list[str]] = {}
    for path in _sources():
        text = path.read_text(encoding="utf-8", errors="replace")
        for match in CITATION.finditer(text):
            line = text.count("\n", 0, match.start()) + 1
            cited.setdefault(match.group(1), []).append(f"{path.relative_to(ROOT)}:{line}")
    return cited


def test_every_cited_key_is_listed() -> None:
    entries = _entries()
    unknown = {key: places for key, places in _citations().items() if key not in entries}
    assert not unknown, f"keys cited but not in docs/references.md: {unknown}"


def test_every_listed_entry_is_cited() -> None:
    cited = _citations()
    unused = [key for key in _entries() if key not in cited]
    assert not unused, f"entries of docs/references.md that nothing cites: {unused}"


def test_every_entry_names_an_edition_or_year() -> None:
    for key, body in _entries().items():
        assert re.search(r"\b(1[89]|20)\d\d\b|edition", body), key


def test_citations_use_well_formed_keys() -> None:
    bad = {key: places for key, places in _citations().items() if not re.fullmatch(KEY, key)}
    assert not bad, bad


def test_nothing_points_outside_the_repository() -> None:
    outside = re.compile("|".join(("REFERENCES" + r"\.md", "DESIGN" + r"\.md", r"\.\./" + "shared")))
    hits = []
    for path in _sources() + [REFERENCES]:
        text = path.read_text(encoding="utf-8", errors="replace")
        hits += [f"{path.relative_to(ROOT)}: {m.group(0)}" for m in outside.finditer(text)]
    assert not hits, hits
