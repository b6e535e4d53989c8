"""Settings for every pytest run in this repository (tests/ and the doctests in coldroom/).

The disk cache (:mod:`coldroom.physics.disk_cache`) goes to a temporary folder of this run,
never to the user's cache folder: ``COLDROOM_CACHE_DIR`` is set before any test runs (the
subprocesses that tests start inherit it), and the folder is removed at exit. A test that
wants the cache off or another folder sets the variable itself (monkeypatch.setenv).
"""

from __future__ import annotations

import atexit
import os
import shutil
import tempfile

_CACHE = tempfile.mkdtemp(prefix="coldroom-test-cache-")
os.environ["COLDROOM_CACHE_DIR"] = _CACHE
atexit.register(shutil.rmtree, _CACHE, True)
