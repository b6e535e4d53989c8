"""`coldroom serve` in a real headless Chromium (selenium, the system's chromium and chromedriver): an
error typed shows at its line, fixing it updates the answers, saving writes the file and its .bak,
and the sheet PDF fetched by the page is the same bytes as `coldroom size` writes. Skipped, with the
reason, where no browser is installed. COLDROOM_SCREENSHOT=FILE.png keeps a screenshot of the page."""

from __future__ import annotations

import base64
import os
import shutil
import socket
import threading
import time
from pathlib import Path

import pytest

pytest.importorskip("starlette", reason="the serve extra (starlette) is not installed")
pytest.importorskip("uvicorn", reason="the serve extra (uvicorn) is not installed")
pytest.importorskip("selenium", reason="selenium is not installed")

CHROMIUM = shutil.which("chromium") or shutil.which("chromium-browser")
CHROMEDRIVER = shutil.which("chromedriver")
if not (CHROMIUM and CHROMEDRIVER):
    pytest.skip("no chromium and chromedriver installed (apt-get install chromium chromium-driver)",
                allow_module_level=True)

REPO = Path(__file__).resolve().parents[2]
DEMO = REPO / "project_files" / "combo_cooler_freezer.yaml"
WAIT_S = 60.0  # a generous bound for a busy machine, not a speed check


def wait_for(check, what: str):  # type: ignore[no-untyped-def]
    end = time.monotonic() + WAIT_S
    while time.monotonic() < end:
        value = check()
        if value:
            return value
        time.sleep(0.1)
    raise AssertionError(f"the page never showed {what}")


@pytest.fixture(scope="module")
def served(tmp_path_factory: pytest.TempPathFactory):  # type: ignore[no-untyped-def]
    import uvicorn

    from coldroom.serve.app import Session, create_app

    folder = tmp_path_factory.mktemp("job")
    shutil.copy(DEMO, folder / "combo.yaml")
    home = os.getcwd()
    os.chdir(folder)  # the project named as a user types it (the page and the sheet show the name as given)
    project = Path("combo.yaml")
    listener = socket.socket()
    listener.bind(("127.0.0.1", 0))
    port = listener.getsockname()[1]
    session = Session(str(project), "browser-test-token", port)
    server = uvicorn.Server(uvicorn.Config(create_app(session), log_level="warning", lifespan="off"))
    thread = threading.Thread(target=server.run, kwargs={"sockets": [listener]}, daemon=True)
    thread.start()
    wait_for(lambda: server.started, "the server start")
    from selenium import webdriver
    from selenium.webdriver.chrome.service import Service

    options = webdriver.ChromeOptions()
    options.binary_location = CHROMIUM
    for flag in ("--headless=new", "--no-sandbox", "--disable-dev-shm-usage", "--disable-gpu",
                 "--window-size=1280,760"):
        options.add_argument(flag)
    try:
        driver = webdriver.Chrome(service=Service(CHROMEDRIVER), options=options)
    except Exception as exc:  # noqa: BLE001 - a browser that does not start is a skip, with why
        server.should_exit = True
        os.chdir(home)
        pytest.skip(f"chromium did not start: {str(exc).splitlines()[0]}")
    driver.get(f"http://127.0.0.1:{port}/?token={session.token}")
    yield driver, project, session
    driver.quit()
    server.should_exit = True
    thread.join(timeout=10)
    os.chdir(home)


def set_text(driver, text: str) -> None:  # type: ignore[no-untyped-def]
    """Put *text* in the editor as typing would (an input event per change)."""
    driver.execute_script(
        "const t = document.getElementById('text'); t.value = arguments[0];"
        "t.dispatchEvent(new Event('input'));", text)


def answers_text(driver) -> str:  # type: ignore[no-untyped-def]
    return driver.execute_script("return document.getElementById('answers').innerText")


def test_an_error_shows_at_its_line_and_fixing_it_updates_the_answers(served) -> None:  # type: ignore[no-untyped-def]
    driver, project, _session = served
    wait_for(lambda: "System CU-1" in answers_text(driver), "the first answers")
    good = project.read_text(encoding="utf-8")
    lines = good.split("\n")
    number = next(i for i, line in enumerate(lines) if line.strip().startswith("height:")) + 1
    lines[number - 1] = lines[number - 1].split(":")[0] + ": -3 m"
    set_text(driver, "\n".join(lines))
    marked = wait_for(lambda: driver.execute_script(
        "const e = document.querySelector('#gutter .err'); return e ? e.textContent : null"), "an error line")
    assert int(marked) == number
    problem = driver.execute_script("return document.getElementById('problems').innerText")
    assert f":{number}:" in problem and "height" in problem
    assert driver.execute_script("return document.getElementById('answers').classList.contains('stale')")
    renamed = good.replace("name: Combination cooler and freezer", "name: Renamed in the browser", 1)
    assert renamed != good
    set_text(driver, renamed)
    wait_for(lambda: "Renamed in the browser" in answers_text(driver), "the updated answers")
    assert not driver.execute_script("return document.getElementById('answers').classList.contains('stale')")
    assert driver.execute_script("return document.querySelectorAll('.chart img').length") >= 1
    shot = os.environ.get("COLDROOM_SCREENSHOT")
    if shot:
        set_text(driver, good)
        wait_for(lambda: "Combination cooler and freezer" in answers_text(driver), "the demo's answers")
        time.sleep(1.0)
        driver.save_screenshot(shot)


def test_save_writes_the_file_and_its_backup(served) -> None:  # type: ignore[no-untyped-def]
    driver, project, _session = served
    before = project.read_bytes()
    edited = before.decode("utf-8") + "# saved from the page\n"
    set_text(driver, edited)
    driver.find_element("id", "save").click()
    wait_for(lambda: "saved" in driver.find_element("id", "state").text, "the save")
    assert project.read_text(encoding="utf-8") == edited
    assert Path(str(project) + ".bak").read_bytes() == before


def test_the_sheet_pdf_is_the_same_bytes_as_coldroom_size(served, tmp_path: Path) -> None:  # type: ignore[no-untyped-def]
    from typer.testing import CliRunner

    from coldroom.cli import app

    driver, project, session = served
    driver.set_script_timeout(WAIT_S)
    fetched = driver.execute_async_script(
        "const done = arguments[arguments.length - 1];"
        "fetch('/api/download/sheet.pdf', {method: 'POST', headers: {'X-Coldroom-Token': arguments[0]},"
        " body: arguments[1]}).then(r => r.arrayBuffer()).then(b => {"
        " let s = ''; const u = new Uint8Array(b); for (let i = 0; i < u.length; i++) s += String.fromCharCode(u[i]);"
        " done(btoa(s)); });", session.token, project.read_text(encoding="utf-8"))
    pdf = tmp_path / "sheet.pdf"
    done = CliRunner().invoke(app, ["size", str(project), "--out", str(pdf)])
    assert done.exit_code == 0, done.stderr
    assert base64.b64decode(fetched) == pdf.read_bytes()
