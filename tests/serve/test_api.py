"""`coldroom serve`'s API in process: the token, Host and Origin checks, bounded bodies, the answers
and downloads byte-identical to the commands' own files (the reference here is the CLI's output for
the same file), and the save with its backup and its refusal when the file changed on disk."""

from __future__ import annotations

import hashlib
import json
import shutil
from pathlib import Path

import pytest

pytest.importorskip("starlette", reason="the serve extra (starlette) is not installed")
pytest.importorskip("httpx", reason="starlette's TestClient needs httpx")

import warnings  # noqa: E402

with warnings.catch_warnings():  # starlette's notice about httpx's successor package
    warnings.simplefilter("ignore")
    from starlette.testclient import TestClient  # noqa: E402

from coldroom.serve.app import Session, create_app  # noqa: E402

REPO = Path(__file__).resolve().parents[2]
DEMOS = REPO / "project_files"
PORT = 8765


def invoke(*args: str):  # type: ignore[no-untyped-def]
    from typer.testing import CliRunner

    from coldroom.cli import app

    return CliRunner().invoke(app, list(args))


@pytest.fixture(scope="module")
def folder(tmp_path_factory: pytest.TempPathFactory) -> Path:
    where = tmp_path_factory.mktemp("job")
    for name in ("combo_cooler_freezer.yaml", "combo_quote.yaml"):
        shutil.copy(DEMOS / name, where / name)
    shutil.copytree(DEMOS / "catalogue", where / "catalogue")
    return where


def client_for(project: str | None, token: str = "secret-token") -> TestClient:
    session = Session(project, token, PORT)
    client = TestClient(create_app(session), base_url=f"http://127.0.0.1:{PORT}")
    client.headers["X-Coldroom-Token"] = token
    return client


@pytest.fixture(scope="module")
def combo(folder: Path) -> TestClient:
    return client_for(str(folder / "combo_quote.yaml"))


def test_token_host_and_origin(combo: TestClient) -> None:
    text = b"rooms: []\n"
    assert combo.post("/api/validate", content=text).status_code == 200
    bare = TestClient(combo.app, base_url=f"http://127.0.0.1:{PORT}")
    assert bare.post("/api/validate", content=text).status_code == 403
    assert bare.get("/").status_code == 403
    assert bare.post("/api/validate?token=secret-token", content=text).status_code == 200
    assert bare.post("/api/validate", content=text, headers={"X-Coldroom-Token": "wrong"}).status_code == 403
    # DNS rebinding: a page from evil.example whose name now points at 127.0.0.1
    rebound = TestClient(combo.app, base_url=f"http://evil.example:{PORT}")
    assert rebound.post("/api/validate?token=secret-token", content=text).status_code == 403
    other_site = combo.post("/api/validate", content=text, headers={"Origin": "http://evil.example"})
    assert other_site.status_code == 403
    same_site = combo.post("/api/validate", content=text, headers={"Origin": f"http://localhost:{PORT}"})
    assert same_site.status_code == 200
    assert TestClient(combo.app, base_url=f"http://localhost:{PORT}").get("/?token=secret-token").status_code == 200


def test_body_is_bounded(combo: TestClient) -> None:
    from coldroom.inputs.safeyaml import MAX_BYTES

    assert combo.post("/api/validate", content=b"#" * (MAX_BYTES + 1)).status_code == 413


def test_validate_gives_the_line_and_the_commands_text(combo: TestClient, folder: Path, tmp_path: Path) -> None:
    good = (folder / "combo_cooler_freezer.yaml").read_bytes()
    assert combo.post("/api/validate", content=good).json()["valid"] is True
    bad = good.replace(b"temperature:", b"temperature: [", 1)
    answer = combo.post("/api/validate", content=bad).json()
    assert answer["valid"] is False and len(answer["errors"]) == 1
    error = answer["errors"][0]
    assert set(error) >= {"line", "column", "key", "message"}
    # the same text as `coldroom validate` on the same bytes under the same name
    copy = tmp_path / "combo_quote.yaml"
    copy.write_bytes(bad)
    done = invoke("validate", str(copy))
    assert done.exit_code == 65
    printed = done.stderr.strip()
    assert error["message"] in printed and printed.startswith(f"{copy}:{error['line']}:{error['column']}:")


def test_size_json_and_pdf_equal_the_command(combo: TestClient, folder: Path, tmp_path: Path) -> None:
    project = folder / "combo_quote.yaml"
    text = project.read_bytes()
    pdf, data = tmp_path / "sheet.pdf", tmp_path / "sheet.json"
    done = invoke("size", str(project), "--out", str(pdf), "--json", str(data))
    assert done.exit_code == 0, done.stderr
    answer = combo.post("/api/size", content=text)
    assert answer.status_code == 200
    assert answer.content == data.read_bytes()
    document = answer.json()
    assert document["project"]["file"] == str(project)
    assert document["project"]["sha256"] == hashlib.sha256(text).hexdigest()
    assert combo.post("/api/download/size.json", content=text).content == data.read_bytes()
    assert combo.post("/api/download/sheet.pdf", content=text).content == pdf.read_bytes()


def test_quote_downloads_equal_the_command(combo: TestClient, folder: Path, tmp_path: Path) -> None:
    project = folder / "combo_quote.yaml"
    text = project.read_bytes()
    catalogue = "catalogue/quote_catalogue.yaml"
    pdf, xlsx, data = tmp_path / "p.pdf", tmp_path / "c.xlsx", tmp_path / "q.json"
    done = invoke("quote", str(project), "--catalogue", str(folder / catalogue), "--out", str(pdf),
                  "--costing", str(xlsx), "--json", str(data))
    assert done.exit_code == 0, done.stderr
    assert combo.post(f"/api/quote?catalogue={catalogue}", content=text).content == data.read_bytes()
    assert combo.post(f"/api/download/proposal.pdf?catalogue={catalogue}", content=text).content == pdf.read_bytes()
    assert combo.post(f"/api/download/costing.xlsx?catalogue={catalogue}", content=text).content == xlsx.read_bytes()
    selected = tmp_path / "s.json"
    done = invoke("select", str(project), "--catalogue", str(folder / catalogue), "--json", str(selected))
    assert done.exit_code == 0, done.stderr
    assert combo.post(f"/api/select?catalogue={catalogue}", content=text).content == selected.read_bytes()
    assert "catalogue/quote_catalogue.yaml" in combo.get("/api/project").json()["catalogues"]


def test_compare_equals_the_command(folder: Path, tmp_path: Path) -> None:
    shutil.copy(DEMOS / "farm_shop_options.yaml", folder / "farm_shop_options.yaml")
    for extra in DEMOS.glob("*.epw"):
        shutil.copy(extra, folder / extra.name)
    project = folder / "farm_shop_options.yaml"
    data = tmp_path / "compare.json"
    done = invoke("compare", str(project), "--json", str(data))
    if done.exit_code != 0:
        pytest.skip(f"the options demo does not compare here: {done.stderr.strip()}")
    client = client_for(str(project))
    assert client.post("/api/compare", content=project.read_bytes()).content == data.read_bytes()


@pytest.mark.parametrize("name", ["../combo_quote.yaml", "/etc/passwd", "catalogue/../../x.csv", ".hidden.csv",
                                  "linked/quote_catalogue.yaml"])
def test_catalogue_stays_in_the_folder(combo: TestClient, folder: Path, tmp_path: Path, name: str) -> None:
    outside = tmp_path / "elsewhere"
    outside.mkdir()
    shutil.copy(DEMOS / "catalogue" / "quote_catalogue.yaml", outside / "quote_catalogue.yaml")
    link = folder / "linked"
    if not link.exists():
        link.symlink_to(outside, target_is_directory=True)
    answer = combo.post(f"/api/quote?catalogue={name}", content=(folder / "combo_quote.yaml").read_bytes())
    assert answer.status_code in (400, 404) and answer.json()["error"]


def test_save_keeps_a_backup_and_refuses_a_file_changed_on_disk(tmp_path: Path) -> None:
    project = tmp_path / "job.yaml"
    shutil.copy(DEMOS / "produce_cooler.yaml", project)
    first = project.read_bytes()
    client = client_for(str(project))
    edited = first + b"# checked on site\n"
    answer = client.post("/api/save", content=edited)
    assert answer.status_code == 200, answer.text
    assert project.read_bytes() == edited
    assert (tmp_path / "job.yaml.bak").read_bytes() == first
    project.write_bytes(first + b"# someone else's edit\n")
    refused = client.post("/api/save", content=edited + b"# again\n")
    assert refused.status_code == 409 and "changed on disk" in refused.json()["error"]
    assert project.read_bytes() == first + b"# someone else's edit\n"


def test_the_starter_is_saved_under_a_new_name_only(tmp_path: Path, monkeypatch: pytest.MonkeyPatch) -> None:
    monkeypatch.chdir(tmp_path)
    client = client_for(None)
    text = client.get("/api/project").json()["text"]
    from importlib.resources import files

    assert text == files("coldroom.data").joinpath("starter.yaml").read_text(encoding="utf-8")
    assert client.post("/api/save", content=text.encode()).status_code == 400  # no name yet
    (tmp_path / "taken.yaml").write_text("x: 1\n")
    assert client.post("/api/save?name=taken.yaml", content=text.encode()).status_code == 409
    assert client.post("/api/save?name=../up.yaml", content=text.encode()).status_code == 400
    assert client.post("/api/save?name=walkin.yaml", content=text.encode()).status_code == 200
    assert (tmp_path / "walkin.yaml").read_text() == text
    assert json.loads(client.post("/api/size", content=text.encode()).content)["project"]["file"] == "walkin.yaml"


def test_a_remote_host_is_refused() -> None:
    done = invoke("serve", "--host", "0.0.0.0", "--no-browser")
    assert done.exit_code == 2 and "loopback" in done.stderr


def test_ctrl_c_stops_the_server_with_exit_130(tmp_path: Path) -> None:
    import signal
    import subprocess
    import sys

    probe = "import sys; from coldroom.cli import main; sys.argv[0] = 'coldroom'; main()"
    server = subprocess.Popen([sys.executable, "-c", probe, "serve", str(DEMOS / "produce_cooler.yaml"),
                               "--no-browser", "--port", "0"], stdout=subprocess.PIPE, stderr=subprocess.PIPE,
                              text=True, cwd=tmp_path)
    try:
        line = server.stdout.readline()  # type: ignore[union-attr]
        assert line.startswith("coldroom: serving http://127.0.0.1:") and "/?token=" in line, line
        server.send_signal(signal.SIGINT)
        _out, err = server.communicate(timeout=30)
    finally:
        server.kill()
    assert server.returncode == 130, err
    assert list(tmp_path.iterdir()) == []


def test_the_ph_chart_is_the_cycle_commands_svg_drawing(combo: TestClient, folder: Path) -> None:
    text = (folder / "combo_quote.yaml").read_bytes()
    chart = combo.post("/api/cycle.svg?system=0", content=text)
    assert chart.status_code == 200 and chart.headers["content-type"].startswith("image/svg+xml")
    assert b"<svg" in chart.content and b"Refrigerant cycle" in chart.content
    assert combo.post("/api/cycle.svg?system=9", content=text).status_code == 404
