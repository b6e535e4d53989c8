"""Running ``coldroom serve``: bind the loopback, print the address with its token, open the browser."""

from __future__ import annotations

import secrets
import socket
import sys
from typing import Optional

from coldroom.errors import OutputError, UsageError

LOOPBACK_NAMES = {"127.0.0.1": "127.0.0.1", "localhost": "127.0.0.1"}


def loopback(host: str) -> str:
    """The address to bind for *host*; anything but the loopback is refused (exit 2)."""
    if host not in LOOPBACK_NAMES:
        raise UsageError(f"--host {host!r}: coldroom serve listens on the loopback only (127.0.0.1 or localhost)")
    return LOOPBACK_NAMES[host]


def serve(project: Optional[str], *, port: int, host: str, browser: bool) -> None:
    """Serve *project* (or the starter) until Ctrl-C.

    Raises
    ------
    UsageError
        A host other than the loopback, or the serve extra is not installed.
    OutputError
        The port cannot be bound.
    ProjectFileError
        The project file cannot be read.
    """
    address = loopback(host)
    try:
        import uvicorn

        from coldroom.serve.app import Session, create_app
    except ImportError as exc:
        raise UsageError(f"coldroom serve needs the serve extra: pip install 'coldroom[serve]' ({exc.name} missing)") \
            from None
    listener = socket.socket(socket.AF_INET, socket.SOCK_STREAM)
    listener.setsockopt(socket.SOL_SOCKET, socket.SO_REUSEADDR, 1)
    try:
        listener.bind((address, port))
    except OSError as exc:
        listener.close()
        raise OutputError(f"cannot listen on {address}:{port}: {exc.strerror or exc}") from None
    port = listener.getsockname()[1]
    session = Session(project, secrets.token_urlsafe(24), port)
    url = f"http://127.0.0.1:{port}/?token={session.token}"
    print(f"coldroom: serving {url}", flush=True)
    if browser:
        import webbrowser

        webbrowser.open(url)
    config = uvicorn.Config(create_app(session), log_level="warning", access_log=False, lifespan="off")
    server = uvicorn.Server(config)
    server.run(sockets=[listener])
    sys.stdout.flush()
