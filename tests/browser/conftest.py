"""Fixtures of the browser tests: a Voila server on 127.0.0.1 and headless Debian chromium.

The browser is the system's ``chromium`` launched by its path through Playwright (no browser
download). Without it the tests are skipped with the reason; CI installs it (scripts/setup.sh).
"""

from __future__ import annotations

import contextlib
import json
import os
import shutil
import signal
import socket
import subprocess
import sys
import time
import urllib.error
import urllib.request
from collections.abc import Iterator
from pathlib import Path

import pytest

REPO = Path(__file__).resolve().parents[2]
ARTIFACTS = REPO / "test-artifacts"

CHROMIUM_ARGS = [
    "--headless",
    "--no-sandbox",
    "--disable-gpu",
    "--disable-quic",
    "--no-first-run",
    "--disable-background-networking",
    "--disable-component-update",
    "--disable-sync",
]


def _free_port() -> int:
    with socket.socket() as s:
        s.bind(("127.0.0.1", 0))
        return int(s.getsockname()[1])


def notebook(cells: list[str]) -> dict:
    """A minimal notebook of code cells (nbformat 4) for the server to run."""
    return {
        "cells": [
            {
                "cell_type": "code",
                "execution_count": None,
                "id": f"c{i}",
                "metadata": {},
                "outputs": [],
                "source": src,
            }
            for i, src in enumerate(cells)
        ],
        "metadata": {
            "kernelspec": {"display_name": "Python 3", "language": "python", "name": "python3"}
        },
        "nbformat": 4,
        "nbformat_minor": 5,
    }


@pytest.fixture(scope="session")
def artifacts() -> Path:
    """test-artifacts/ at the repository root (git-ignored): screenshots of the browser tests."""
    ARTIFACTS.mkdir(exist_ok=True)
    return ARTIFACTS


@pytest.fixture(scope="session")
def chromium_path() -> str:
    path = shutil.which("chromium")
    if path is None:
        pytest.skip(
            "Debian's chromium is not installed (apt-get install -y chromium); "
            "scripts/setup.sh installs it in CI"
        )
    pytest.importorskip("playwright.sync_api", reason="Python Playwright is not installed")
    return path


@contextlib.contextmanager
def serve(home: Path, cells: list[str], extra: tuple[str, ...] = ()) -> Iterator[str]:
    """Serve a notebook of ``cells`` under Voila on 127.0.0.1 (a free port); yield its URL and
    stop the server and its kernels afterwards (by pid)."""
    psutil = pytest.importorskip("psutil")
    nb = home / "page.ipynb"
    nb.write_text(json.dumps(notebook(cells)))
    env = dict(os.environ)
    for var, sub in (
        ("JUPYTER_CONFIG_DIR", "config"),
        ("JUPYTER_RUNTIME_DIR", "runtime"),
        ("JUPYTER_DATA_DIR", "data"),
        ("JUPYTERLAB_SETTINGS_DIR", "settings"),
        ("JUPYTERLAB_WORKSPACES_DIR", "workspaces"),
        ("IPYTHONDIR", "ipython"),
    ):
        (home / sub).mkdir(exist_ok=True)
        env[var] = str(home / sub)
    env["PYTHONPATH"] = os.pathsep.join([str(REPO), env.get("PYTHONPATH", "")]).rstrip(os.pathsep)
    port = _free_port()
    log = open(home / "voila.log", "w")  # noqa: SIM115 - closed at teardown
    proc = subprocess.Popen(
        [
            sys.executable,
            "-m",
            "voila",
            "--no-browser",
            f"--port={port}",
            "--Voila.ip=127.0.0.1",
            "--Voila.port_retries=0",
            *extra,
            str(nb),
        ],
        cwd=home,
        env=env,
        stdout=log,
        stderr=subprocess.STDOUT,
    )
    base = f"http://127.0.0.1:{port}"
    deadline = time.monotonic() + 90
    while True:
        if proc.poll() is not None:
            raise RuntimeError("voila exited: " + (home / "voila.log").read_text()[-2000:])
        try:
            urllib.request.urlopen(base + "/voila/static/voila.js", timeout=2)
            break
        except urllib.error.HTTPError:
            break  # any HTTP status: the server answers
        except OSError:
            if time.monotonic() > deadline:
                proc.kill()
                raise RuntimeError("voila did not start within 90 s") from None
            time.sleep(0.3)
    try:
        yield base + "/"
    finally:
        children = psutil.Process(proc.pid).children(recursive=True)
        proc.send_signal(signal.SIGTERM)
        try:
            proc.wait(timeout=15)
        except subprocess.TimeoutExpired:
            proc.kill()
            proc.wait(timeout=5)
        for child in children:
            try:
                child.wait(timeout=5)
            except psutil.TimeoutExpired:
                child.kill()
            except psutil.NoSuchProcess:
                pass
        log.close()


@pytest.fixture(scope="session")
def voila_url(tmp_path_factory: pytest.TempPathFactory, chromium_path: str):
    """Serve a notebook with an empty CO2 route planner under Voila; yield its URL."""
    cells = [
        "import phasepath as pp\n"
        "planner = pp.widgets.RoutePlanner('CO2', T_unit='degC', p_unit='bar')\n"
        "planner",
    ]
    with serve(tmp_path_factory.mktemp("voila"), cells) as url:
        yield url


@pytest.fixture(scope="session")
def sweepmap_url(tmp_path_factory: pytest.TempPathFactory, chromium_path: str):
    """Serve a notebook with a sweep map of an invented CO2 vent (a 6 x 4 grid)."""
    cells = [
        "import phasepath as pp\n"
        "plan = pp.Route('CO2', T='20 degC', p='60 bar', title='demo vent').isenthalp(p='1 atm')\n"
        "df = pp.sweep(plan, start_T=[275.0, 285.0, 295.0, 305.0, 315.0, 325.0],\n"
        "              start_p=[60e5, 75e5, 90e5, 105e5], progress=False)\n"
        "m = pp.widgets.SweepMap(df, color='end_solid_fraction')\n"
        "m",
    ]
    with serve(tmp_path_factory.mktemp("sweepmap"), cells) as url:
        yield url


@pytest.fixture()
def page(chromium_path: str):
    """A fresh page in headless chromium (1440 x 1100)."""
    from playwright.sync_api import sync_playwright

    with sync_playwright() as p:
        browser = p.chromium.launch(executable_path=chromium_path, args=CHROMIUM_ARGS)
        context = browser.new_context(viewport={"width": 1440, "height": 1100})
        pg = context.new_page()
        pg.route("**/cdn.jsdelivr.net/**", lambda r: r.abort())
        try:
            yield pg
        finally:
            context.close()
            browser.close()
