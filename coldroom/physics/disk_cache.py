"""Results kept on disk between runs: computed once per key, read back in later processes.

What is kept: the p–h chart's lines (:mod:`coldroom.physics.chart_data`), which cost
a few tenths of a second of property calls per refrigerant and pressure window, and
the blends' saturation tables (:mod:`coldroom.physics.refrigerant.blend_table`, eight
CoolProp flashes per segment); both are the same in every run with the same
refrigerant, window, coldroom version and CoolProp version — the key of every entry
holds them.

The folder:

- ``COLDROOM_CACHE_DIR`` when set to a folder;
- ``COLDROOM_CACHE_DIR=off`` switches the cache off (nothing is read or written);
- otherwise (unset or empty) ``$XDG_CACHE_HOME/coldroom``, or ``~/.cache/coldroom`` when
  ``XDG_CACHE_HOME`` is unset, empty or not an absolute path (the XDG Base Directory
  specification's rule).

An entry is a JSON file named by a digest of its key, holding the key and the value;
it is written to a temporary file in the folder and moved into place
(``os.replace``), so a reader sees the old file or the new one, never a part. A file
that cannot be read, does not parse or holds another key is treated as missing: the
value is computed again and the file rewritten. A folder that cannot be written is
no error (the run goes on without the cache). The JSON is strict (a value holding a
NaN or an infinity is not kept); floats go through it as their shortest round-trip text, so a value read back is the value stored, bit for bit: a
run's outputs are byte-identical with the cache cold, warm or off (tested).

Examples
--------
>>> folder({"COLDROOM_CACHE_DIR": "off"}) is None
True
>>> str(folder({"COLDROOM_CACHE_DIR": "/tmp/c"}))
'/tmp/c'
>>> str(folder({"XDG_CACHE_HOME": "/var/cache/me"}))
'/var/cache/me/coldroom'
"""

from __future__ import annotations

import hashlib
import json
import os
import tempfile
from pathlib import Path
from typing import Any, Mapping, Optional

#: The environment variable that names the cache folder or, set to :data:`OFF`, switches it off.
ENVIRONMENT = "COLDROOM_CACHE_DIR"
#: The value of :data:`ENVIRONMENT` that switches the cache off.
OFF = "off"


def folder(environ: Optional[Mapping[str, str]] = None) -> Optional[Path]:
    """The cache folder, or None when the cache is off (see the module notes).

    Parameters
    ----------
    environ : mapping, optional
        The environment (default ``os.environ``).
    """
    env = os.environ if environ is None else environ
    given = env.get(ENVIRONMENT, "")
    if given == OFF:
        return None
    if given:
        return Path(given).expanduser()
    xdg = env.get("XDG_CACHE_HOME", "")
    base = Path(xdg) if xdg and os.path.isabs(xdg) else Path("~").expanduser() / ".cache"
    return base / "coldroom"


def _full_key(kind: str, key: Mapping[str, Any]) -> dict[str, Any]:
    from coldroom import __version__

    if "CoolProp" not in key:
        raise ValueError("a disk-cache key names the CoolProp version")
    return {"kind": kind, "coldroom": __version__, **key}


#: Strict JSON (RFC 8259): a NaN or an infinity is refused (ValueError), not written as a bare word.
_ENCODER = json.JSONEncoder(allow_nan=False, separators=(",", ":"), sort_keys=True)


def _path(where: Path, kind: str, full_key: Mapping[str, Any]) -> Path:
    digest = hashlib.sha256(_ENCODER.encode(full_key).encode("utf-8")).hexdigest()[:32]
    return where / f"{kind}-{digest}.json"


def load(kind: str, key: Mapping[str, Any]) -> Any:
    """The value kept under (*kind*, *key*), or None when there is none, it is unreadable or the cache is off.

    Parameters
    ----------
    kind : str
        What the value is (a file-name prefix, e.g. ``"chart"``).
    key : mapping
        JSON-able values that determine the value, the CoolProp version among them (under
        ``"CoolProp"``; the caller reads it, this module imports no property library); the
        coldroom version is added.
    """
    where = folder()
    if where is None:
        return None
    full = _full_key(kind, key)
    try:
        with open(_path(where, kind, full), "rb") as stream:
            entry = json.loads(stream.read())
        if entry["key"] != json.loads(_ENCODER.encode(full)):
            return None
        return entry["value"]
    except (OSError, ValueError, KeyError, TypeError):
        return None


def store(kind: str, key: Mapping[str, Any], value: Any) -> None:
    """Keep *value* (JSON-able) under (*kind*, *key*), atomically; silently nothing when the cache
    is off or its folder cannot be written."""
    where = folder()
    if where is None:
        return
    full = _full_key(kind, key)
    try:
        text = _ENCODER.encode({"key": full, "value": value})
    except ValueError:  # a NaN or an infinity: not kept (strict JSON only)
        return
    target = _path(where, kind, full)
    try:
        where.mkdir(parents=True, exist_ok=True)
        handle, temporary = tempfile.mkstemp(prefix=f".{target.stem}-", suffix=".tmp", dir=where)
        try:
            with os.fdopen(handle, "wb") as stream:
                stream.write(text.encode("utf-8"))
            os.replace(temporary, target)
        except BaseException:
            try:
                os.unlink(temporary)
            except OSError:
                pass
            raise
    except OSError:
        return
