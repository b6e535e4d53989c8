"""`POST /api/size` on a running `coldroom serve` against a cold `coldroom size` process (issue 28's target).

Run by hand (not collected by pytest; needs the serve extra)::

    .venv/bin/python tests/benchmarks/bench_serve.py [PROJECT.yaml] [--repeat N]

The server is the application in process (starlette's TestClient: no network between), warmed by
one request, as a page that has been open a while is. Each pair is one cold process
``coldroom size PROJECT --out TMP.pdf --json TMP.json --force`` and one request whose text differs by
a trailing comment (so nothing is answered from the server's last result), in alternating order;
the figure is the median of the pairs' wall-time ratios request / process, with min and max as the
noise. Target: ≤ 0.5 on the combo demo.
"""

from __future__ import annotations

import argparse
import statistics
import subprocess
import sys
import tempfile
import time
import warnings
from pathlib import Path

REPO = Path(__file__).resolve().parents[2]
DEMO = REPO / "project_files" / "combo_cooler_freezer.yaml"
TARGET = 0.5


def main() -> None:
    parser = argparse.ArgumentParser(description=__doc__.splitlines()[0])
    parser.add_argument("project", nargs="?", default=str(DEMO))
    parser.add_argument("--repeat", type=int, default=5)
    args = parser.parse_args()
    with warnings.catch_warnings():
        warnings.simplefilter("ignore")
        from starlette.testclient import TestClient

    from coldroom.serve.app import Session, create_app

    port = 8765
    session = Session(args.project, "bench", port)
    client = TestClient(create_app(session), base_url=f"http://127.0.0.1:{port}")
    client.headers["X-Coldroom-Token"] = "bench"
    text = Path(args.project).read_bytes()
    assert client.post("/api/size", content=text).status_code == 200  # warm: CoolProp, tables, chart data

    folder = Path(tempfile.mkdtemp())
    command = [sys.executable, "-m", "coldroom", "size", args.project, "--out", str(folder / "s.pdf"),
               "--json", str(folder / "s.json"), "--force"]

    def process() -> float:
        start = time.perf_counter()
        subprocess.run(command, check=True, stdout=subprocess.DEVNULL, stderr=subprocess.DEVNULL)
        return time.perf_counter() - start

    def request(k: int) -> float:
        body = text + f"\n# bench run {k}\n".encode()
        start = time.perf_counter()
        answer = client.post("/api/size", content=body)
        elapsed = time.perf_counter() - start
        assert answer.status_code == 200, answer.text
        return elapsed

    process()  # the disk cache warm for the process too
    ratios, requests, processes = [], [], []
    for k in range(args.repeat):
        if k % 2:
            r, p = request(k), process()
        else:
            p, r = process(), request(k)
        requests.append(r)
        processes.append(p)
        ratios.append(r / p)
    print(f"project: {args.project}")
    print(f"POST /api/size (warm server): median {statistics.median(requests):.3f} s")
    print(f"cold `coldroom size` process: median {statistics.median(processes):.3f} s")
    print(f"ratio request/process: {statistics.median(ratios):.2f} ({min(ratios):.2f}-{max(ratios):.2f}),"
          f" target <= {TARGET}")


if __name__ == "__main__":
    main()
