"""Determinism and threads: the same route gives the same numbers, to the last bit, on every run,
in every process and from every thread.

CoolProp keeps one ``AbstractState`` per substance in phasepath (``Substance.fluid``, an
``phasepath.eos.EOS``), and an
``AbstractState`` is not safe to update from two threads at once; each ``EOS`` therefore holds an
``RLock`` around every update-and-read. Threaded use is preceded by a warm-up (each substance
loaded and one route analysed, serially), so that CoolProp's fluid library and phasepath's
caches are filled before threads start; first use of a substance is itself serialized.
"""

from __future__ import annotations

import json
import os
import subprocess
import sys
import threading
from concurrent.futures import ThreadPoolExecutor
from pathlib import Path
from typing import Any

import pytest

import phasepath as pp

# Routes in invented scenarios, each crossing at least one boundary.
_PLANS: list[tuple[str, tuple[str, str], list[tuple[str, str]]]] = [
    (
        "water",
        ("20 degC", "1 bar"),
        [
            ("isobar", "180 degC"),
            ("isotherm", "0.2 bar"),
            ("isobar", "-25 degC"),
            ("isotherm", "3000 bar"),
        ],
    ),
    (
        "CO2",
        ("-20 degC", "10 bar"),
        [("isotherm", "90 bar"), ("isobar", "45 degC"), ("isotherm", "4 bar")],
    ),
    (
        "nitrogen",
        ("75 K", "1 bar"),
        [("isotherm", "50 bar"), ("isobar", "150 K"), ("isotherm", "0.3 bar")],
    ),
    ("argon", ("90 K", "1 bar"), [("isotherm", "2000 bar"), ("isobar", "200 K")]),
    ("methane", ("110 K", "1 bar"), [("isobar", "200 K"), ("isotherm", "60 bar")]),
    ("R134a", ("-30 degC", "1 bar"), [("isobar", "70 degC"), ("isotherm", "45 bar")]),
]


def _build(plan: tuple[str, tuple[str, str], list[tuple[str, str]]]) -> pp.Route:
    name, (T, p), legs = plan
    route = pp.Route(name, T=T, p=p)
    for kind, target in legs:
        route.add(kind, **({"T": target} if kind == "isobar" else {"p": target}))
    return route


def _fingerprint(rep: pp.Report) -> list[Any]:
    """Every number of a report as exact hex text, with the names around it."""

    def h(x: float | None) -> str | None:
        return None if x is None else float(x).hex()

    out: list[Any] = [rep.substance.name]
    for c in rep.crossings:
        out.append(
            [
                c.step,
                c.kind,
                c.from_phase,
                c.to_phase,
                c.from_form,
                c.to_form,
                h(c.T),
                h(c.p),
                h(c.latent_heat),
                c.boundary,
                c.method,
            ]
        )
    for g in rep.legs:
        out.append(
            [
                g.step,
                g.kind,
                h(g.start.T),
                h(g.start.p),
                g.start.phase,
                h(g.end.T),
                h(g.end.p),
                g.end.phase,
                h(g.heat),
                h(g.work),
            ]
        )
    return out


def _all() -> list[list[Any]]:
    return [_fingerprint(_build(plan).analyze()) for plan in _PLANS]


def _warm_up() -> None:
    """Load every substance and analyse one route of each, serially, before threads start."""
    for plan in _PLANS:
        _build(plan).analyze()


def test_same_results_on_repeated_runs() -> None:
    first = _all()
    for _ in range(2):
        assert _all() == first
    # each plan crosses at least one boundary
    assert all(len(f) > 1 + len(p[2]) for f, p in zip(first, _PLANS, strict=True))


def test_same_results_in_a_fresh_process() -> None:
    root = Path(__file__).resolve().parents[1]
    code = (
        "import json, sys; sys.path.insert(0, 'tests'); import test_determinism as t; "
        "print(json.dumps(t._all()))"
    )
    env = {
        **os.environ,
        "PYTHONPATH": str(root) + os.pathsep + os.environ.get("PYTHONPATH", ""),
        "PYTHONHASHSEED": "12345",
    }
    done = subprocess.run(
        [sys.executable, "-c", code], cwd=root, env=env, capture_output=True, text=True, timeout=600
    )
    assert done.returncode == 0, done.stderr[-3000:]
    assert json.loads(done.stdout) == json.loads(json.dumps(_all()))


def test_threaded_batch_agrees_with_serial_batch() -> None:
    _warm_up()
    serial = _all()
    jobs = [plan for plan in _PLANS for _ in range(4)]  # every substance from several threads
    with ThreadPoolExecutor(max_workers=6) as pool:
        threaded = list(pool.map(lambda plan: _fingerprint(_build(plan).analyze()), jobs))
    expected = [fp for fp in serial for _ in range(4)]
    assert threaded == expected


def test_shared_equation_of_state_under_threads() -> None:
    # Many threads update one substance's AbstractState at once: the per-substance lock keeps
    # each update-and-read together, so every answer equals the serial one exactly.
    sub = pp.substance("CO2")
    eos = sub.fluid
    assert eos is not None
    assert isinstance(eos._lock, type(threading.RLock()))
    Ts = [220.0 + 0.8 * i for i in range(100)]
    serial = [(eos.p_sat(T), eos.state(T, 2e7, "liquid")) for T in Ts]
    barrier = threading.Barrier(4)

    def work(offset: int) -> list[Any]:
        barrier.wait()
        order = Ts[offset:] + Ts[:offset]
        got = {T: (eos.p_sat(T), eos.state(T, 2e7, "liquid")) for T in order}
        return [got[T] for T in Ts]

    with ThreadPoolExecutor(max_workers=4) as pool:
        results = list(pool.map(work, (0, 25, 50, 75)))
    for r in results:
        assert r == serial


def test_first_use_from_many_threads_gives_one_substance() -> None:
    # Substances not used elsewhere in this file, so that these threads are the first users.
    names = ["Krypton", "Neon", "Ethane"]
    barrier = threading.Barrier(6)

    def load(name: str) -> pp.Substance:
        barrier.wait()
        return pp.substance(name)

    with ThreadPoolExecutor(max_workers=6) as pool:
        subs = list(pool.map(load, names * 2))
    for i, name in enumerate(names):
        assert subs[i] is subs[i + 3] is pp.substance(name)


@pytest.mark.parametrize("T_unit,p_unit", [("K", "Pa"), ("degC", "bar"), ("degF", "psi")])
def test_tables_are_stable(T_unit: str, p_unit: str) -> None:
    # Display conversion is deterministic too: the same table, cell for cell.
    rep = _build(_PLANS[0]).analyze()
    a = rep.table(T_unit=T_unit, p_unit=p_unit).to_csv(index=False)
    b = _build(_PLANS[0]).analyze().table(T_unit=T_unit, p_unit=p_unit).to_csv(index=False)
    assert a == b and a.count("\n") > 1
