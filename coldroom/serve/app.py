"""The Starlette application behind ``coldroom serve``.

Every request needs the session's token (header ``X-Coldroom-Token`` or query ``token``); the
``Host`` header must name this server on the loopback (``127.0.0.1:PORT`` or ``localhost:PORT``)
and a present ``Origin`` must be this server too (DNS rebinding, other sites): else 403. Request
bodies are bounded by the project-file limit (:data:`coldroom.inputs.safeyaml.MAX_BYTES`, else 413).
Files are read and written only inside the project's folder (no ``..``, no hidden names, no
symbolic link on the way). Every answer comes from :mod:`coldroom.output.produce`, the route the
commands take, so a download equals the command's file for the same text.
"""

from __future__ import annotations

import hashlib
import os
import secrets
import threading
from pathlib import Path, PurePosixPath
from typing import Any, Callable, Optional

from starlette.applications import Starlette
from starlette.concurrency import run_in_threadpool
from starlette.requests import Request
from starlette.responses import HTMLResponse, JSONResponse, Response
from starlette.routing import Route

from coldroom.errors import ColdroomError, ProjectFileError

STATIC = Path(__file__).with_name("static")
CATALOGUE_SUFFIXES = (".csv", ".xlsx", ".yaml", ".yml")
STARTER_NAME = "starter.yaml"  # the envelope's file name until the starter is saved under a name


class Refused(Exception):
    """A request refused with an HTTP status and a one-line message."""

    def __init__(self, status: int, message: str) -> None:
        super().__init__(message)
        self.status = status
        self.message = message


def _digest(data: bytes) -> str:
    return hashlib.sha256(data).hexdigest()


def _one_line(text: str) -> str:
    from coldroom.errors import printable

    return printable(" ".join(str(text).split()))


def error_entry(error: ProjectFileError) -> dict[str, Any]:
    """One error as the page shows it; ``text`` is the line ``coldroom validate`` prints."""
    return {"line": error.line, "column": error.column, "key": error.key, "message": _one_line(error.message),
            "text": _one_line(error.format())}


class Session:
    """One served project: its file (or the starter), its folder, and what was on disk when loaded.

    Parameters
    ----------
    project : str or None
        The project file as given to ``serve``; None to start from the starter text.
    token : str
        The secret every request must carry.
    port : int
        The port the server listens on (the ``Host`` header must name it).
    """

    def __init__(self, project: Optional[str], token: str, port: int) -> None:
        from coldroom.inputs.safeyaml import read_source

        self.project = project
        self.token = token
        self.port = port
        if project is None:
            from importlib.resources import files

            self.text = files("coldroom.data").joinpath("starter.yaml").read_bytes()
            self.folder = Path.cwd()
            self.disk_digest: Optional[str] = None
        else:
            self.text = read_source(project)
            self.folder = Path(os.path.dirname(os.path.abspath(project)))
            self.disk_digest = _digest(self.text)
        self.lock = threading.Lock()  # one computation at a time (CoolProp's state is global)
        self._sized: dict[str, Any] = {}

    # --- names and files -----------------------------------------------------------------

    @property
    def file(self) -> str:
        """The project's name in every envelope and on every sheet (the path as given to ``serve``)."""
        return self.project if self.project is not None else STARTER_NAME

    def inside(self, name: str) -> Path:
        """*name* (relative, ``/``-separated) as a path inside the project's folder; refused otherwise."""
        parts = PurePosixPath(name).parts
        if (not name or "\\" in name or "\x00" in name or name.startswith("/") or not parts
                or any(part in (".", "..") or part.startswith(".") for part in parts)):
            raise Refused(400, f"{name!r}: give a file name inside the project's folder")
        path = self.folder
        for part in parts:
            path = path / part
            if path.is_symlink():
                raise Refused(400, f"{name!r}: symbolic links are not followed")
        if not path.resolve().is_relative_to(self.folder.resolve()):
            raise Refused(400, f"{name!r}: not inside the project's folder")
        return path

    def as_given(self, name: str) -> str:
        """A file of the project's folder named as the command line would (beside the project as given)."""
        base = os.path.dirname(self.project) if self.project is not None else ""
        return os.path.join(base, *PurePosixPath(name).parts)

    def catalogues(self) -> list[str]:
        """Catalogue files in the project's folder and its subfolders one level down (project files left out)."""
        found = []
        for path in sorted(self.folder.glob("*")) + sorted(self.folder.glob("*/*")):
            name = path.relative_to(self.folder).as_posix()
            if path.suffix.lower() not in CATALOGUE_SUFFIXES or any(p.startswith(".") for p in name.split("/")):
                continue
            if path.is_symlink() or path.parent.is_symlink() or not path.is_file():
                continue
            if path.suffix.lower() in (".yaml", ".yml"):
                try:
                    head = path.read_bytes()[:65536].decode("utf-8", "replace")
                except OSError:
                    continue
                if "\nrooms:" in "\n" + head:  # a project file, not a catalogue
                    continue
            found.append(name)
        return found

    # --- computing (each from the commands' own route) --------------------------------------

    def opened(self, text: bytes) -> Any:
        from coldroom.inputs.opening import open_project_text

        return open_project_text(text, filename=self.file)

    def sized(self, text: bytes) -> tuple[Any, Any]:
        """The model and the sized job for *text* (the last few kept: downloads follow the answers)."""
        from coldroom.output.produce import size_result

        key = _digest(text)
        if key not in self._sized:
            model = self.opened(text)
            self._sized = {key: (model, size_result(model, self.file, text)), **dict(list(self._sized.items())[:3])}
        return self._sized[key]

    def equipment(self, name: str) -> tuple[str, Any]:
        from coldroom.inputs.catalogue import load_catalogue

        path = self.inside(name)
        if not path.is_file():
            raise Refused(404, f"{name}: no such catalogue in the project's folder")
        return self.as_given(name), load_catalogue(path)


# --- the application --------------------------------------------------------------------------


def _allowed_hosts(port: int) -> set[str]:
    return {f"127.0.0.1:{port}", f"localhost:{port}"}


async def _read_text(request: Request) -> bytes:
    """The request body, at most the project-file limit (else 413)."""
    from coldroom.inputs.safeyaml import MAX_BYTES

    length = request.headers.get("content-length")
    if length is not None and (not length.isdigit() or int(length) > MAX_BYTES):
        raise Refused(413, f"the text is larger than the project-file limit of {MAX_BYTES} bytes")
    body = bytearray()
    async for chunk in request.stream():
        body += chunk
        if len(body) > MAX_BYTES:
            raise Refused(413, f"the text is larger than the project-file limit of {MAX_BYTES} bytes")
    return bytes(body)


def _failure(error: Exception) -> JSONResponse:
    if isinstance(error, Refused):
        return JSONResponse({"error": error.message}, status_code=error.status)
    if isinstance(error, ProjectFileError):
        return JSONResponse({"valid": False, "errors": [error_entry(error)], "error": _one_line(error.format())},
                            status_code=422)
    assert isinstance(error, ColdroomError)
    return JSONResponse({"error": _one_line(f"coldroom: {error}"), "exit_code": getattr(error, "exit_code", 1)},
                        status_code=422)


def create_app(session: Session) -> Starlette:
    """The application serving *session* (see the module's docstring for what every request must carry)."""

    def guarded(handler: Callable[[Request], Any]) -> Callable[[Request], Any]:
        async def endpoint(request: Request) -> Response:
            host = request.headers.get("host", "")
            origin = request.headers.get("origin")
            token = request.headers.get("x-coldroom-token") or request.query_params.get("token") or ""
            if host not in _allowed_hosts(session.port):
                return JSONResponse({"error": "unexpected Host header"}, status_code=403)
            if origin is not None and origin not in {f"http://{h}" for h in _allowed_hosts(session.port)}:
                return JSONResponse({"error": "requests from another site are refused"}, status_code=403)
            if not secrets.compare_digest(token.encode(), session.token.encode()):
                return JSONResponse({"error": "missing or wrong token"}, status_code=403)
            try:
                response = await handler(request)
            except (Refused, ColdroomError) as error:
                return _failure(error)
            response.headers["Cache-Control"] = "no-store"
            response.headers["X-Content-Type-Options"] = "nosniff"
            response.headers["Referrer-Policy"] = "no-referrer"
            return response

        return endpoint

    def computed(work: Callable[[bytes, Request], Response]) -> Callable[[Request], Any]:
        async def handler(request: Request) -> Response:
            text = await _read_text(request)

            def locked() -> Response:
                with session.lock:
                    return work(text, request)

            return await run_in_threadpool(locked)

        return guarded(handler)

    def json_answer(document: dict[str, Any]) -> Response:
        from coldroom.output.produce import json_bytes

        return Response(json_bytes(document), media_type="application/json")

    def download(data: bytes, media_type: str, name: str) -> Response:
        return Response(data, media_type=media_type, headers={"Content-Disposition": f'attachment; filename="{name}"'})

    def stem() -> str:
        return Path(session.file).stem

    # --- endpoints -------------------------------------------------------------------------

    async def index(request: Request) -> Response:
        nonce = secrets.token_urlsafe(16)
        page = (STATIC / "index.html").read_text(encoding="utf-8")
        page = page.replace("{{style}}", (STATIC / "page.css").read_text(encoding="utf-8"))
        page = page.replace("{{script}}", (STATIC / "page.js").read_text(encoding="utf-8"))
        page = page.replace("{{nonce}}", nonce)
        policy = (f"default-src 'none'; script-src 'nonce-{nonce}'; style-src 'nonce-{nonce}' 'unsafe-inline'; "
                  "img-src data: blob:; connect-src 'self'; base-uri 'none'; form-action 'none'; "
                  "frame-ancestors 'none'")
        return HTMLResponse(page, headers={"Content-Security-Policy": policy})

    async def project(request: Request) -> Response:
        return JSONResponse({"file": session.project, "text": session.text.decode("utf-8", "replace"),
                             "catalogues": session.catalogues()})

    def validate(text: bytes, request: Request) -> Response:
        from coldroom.inputs.physical_checks import project_warnings
        from coldroom.units import format_terms

        try:
            model = session.opened(text)
        except ProjectFileError as error:
            return JSONResponse({"valid": False, "errors": [error_entry(error)], "warnings": []})
        warnings = [{"key": key, "message": _one_line(format_terms(message, model.project.units))}
                    for key, message in project_warnings(model)]
        return JSONResponse({"valid": True, "errors": [], "warnings": warnings})

    def size(text: bytes, request: Request) -> Response:
        from coldroom.output.produce import size_document

        model, result = session.sized(text)
        return json_answer(size_document(result, model, session.file, text))

    def size_pdf(text: bytes, request: Request) -> Response:
        from coldroom.output.produce import size_pdf as render

        model, result = session.sized(text)
        return download(render(result, model), "application/pdf", f"{stem()}.pdf")

    def size_json(text: bytes, request: Request) -> Response:
        from coldroom.output.produce import json_bytes, size_document

        model, result = session.sized(text)
        return download(json_bytes(size_document(result, model, session.file, text)), "application/json",
                        f"{stem()}.json")

    def cycle_chart(text: bytes, request: Request) -> Response:
        from coldroom.output.produce import cycle_svg

        model, result = session.sized(text)
        index = request.query_params.get("system", "")
        if not index.isdigit() or int(index) >= len(result.systems) or result.systems[int(index)].cycle is None:
            raise Refused(404, f"system {index!r}: no such system (0 to {len(result.systems) - 1})")
        return Response(cycle_svg(result, model, session.file, int(index)), media_type="image/svg+xml")

    def compare(text: bytes, request: Request) -> Response:
        from coldroom.output.produce import compare_document, compare_result

        model = session.opened(text)
        return json_answer(compare_document(compare_result(model, session.file, text), model, session.file, text))

    def select(text: bytes, request: Request) -> Response:
        from coldroom.output.produce import select_document, selected_job, selections_for

        catalogue, equipment = session.equipment(request.query_params.get("catalogue", ""))
        model = session.opened(text)
        selections = selections_for(model, equipment)
        job = selected_job(model, session.file, text, selections)
        return json_answer(select_document(selections, catalogue, equipment, job, model, session.file, text))

    def quoted(text: bytes, request: Request) -> tuple[Any, Any, Any, str]:
        from coldroom.output.produce import quote_result

        catalogue, equipment = session.equipment(request.query_params.get("catalogue", ""))
        model = session.opened(text)
        quote, result, _selections = quote_result(model, session.file, text, equipment)
        return quote, result, model, catalogue

    def quote(text: bytes, request: Request) -> Response:
        from coldroom.output.produce import quote_document

        quote_, _result, model, catalogue = quoted(text, request)
        return json_answer(quote_document(quote_, catalogue, model, session.file, text))

    def proposal(text: bytes, request: Request) -> Response:
        from coldroom.output.produce import proposal_pdf

        quote_, result, model, _catalogue = quoted(text, request)
        return download(proposal_pdf(quote_, result, model), "application/pdf", f"{stem()}-proposal.pdf")

    def costing(text: bytes, request: Request) -> Response:
        from coldroom.output.produce import costing_xlsx

        quote_, _result, model, _catalogue = quoted(text, request)
        return download(costing_xlsx(quote_, model),
                        "application/vnd.openxmlformats-officedocument.spreadsheetml.sheet", f"{stem()}-costing.xlsx")

    def save(text: bytes, request: Request) -> Response:
        from coldroom.inputs.safeyaml import read_source
        from coldroom.output.files import write_atomic

        if session.project is None:  # the starter: saved under a new name, never over a file
            name = request.query_params.get("name", "")
            if "/" in name or not name.lower().endswith((".yaml", ".yml")):
                raise Refused(400, "give the new project a file name ending in .yaml (in the folder coldroom "
                                   "serve was started from)")
            path = session.inside(name)
            if path.exists() or path.is_symlink():
                raise Refused(409, f"{name} already exists; choose another name")
            write_atomic(path, text, force=False)
            session.project, session.disk_digest, session.text = name, _digest(text), text
            return JSONResponse({"saved": name, "backup": None})
        try:
            current = read_source(session.project)
        except ProjectFileError:
            current = None
        if current is None or _digest(current) != session.disk_digest:
            raise Refused(409, f"{session.project} changed on disk since it was loaded; nothing was saved "
                               "(copy your text, reload the page, and apply your change again)")
        backup = session.project + ".bak"
        write_atomic(backup, current, force=True)
        write_atomic(session.project, text, force=True)
        session.disk_digest, session.text = _digest(text), text
        return JSONResponse({"saved": session.project, "backup": backup})

    routes = [
        Route("/", guarded(index), methods=["GET"]),
        Route("/api/project", guarded(project), methods=["GET"]),
        Route("/api/validate", computed(validate), methods=["POST"]),
        Route("/api/size", computed(size), methods=["POST"]),
        Route("/api/compare", computed(compare), methods=["POST"]),
        Route("/api/cycle.svg", computed(cycle_chart), methods=["POST"]),
        Route("/api/select", computed(select), methods=["POST"]),
        Route("/api/quote", computed(quote), methods=["POST"]),
        Route("/api/download/sheet.pdf", computed(size_pdf), methods=["POST"]),
        Route("/api/download/size.json", computed(size_json), methods=["POST"]),
        Route("/api/download/proposal.pdf", computed(proposal), methods=["POST"]),
        Route("/api/download/costing.xlsx", computed(costing), methods=["POST"]),
        Route("/api/save", computed(save), methods=["POST"]),
    ]
    return Starlette(routes=routes)
