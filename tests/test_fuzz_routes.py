"""Property-based tests over random substances and random isobar/isotherm routes.

What is checked on every generated route (the analyser's stated guarantees):

* a crossing lies on its boundary: on the named branch within ``TOLERANCE`` (1e-9 relative in
  pressure at the crossing temperature), or at the triple point, the critical isobar or isotherm,
  a branch junction or a corner of the route;
* the phase just before and just after each crossing, found independently with
  ``Substance.classify``, matches the record;
* a dense independent scan of every leg (``classify`` at many points) finds no change of phase
  that the analyser missed, and none that it reported in the wrong order;
* reversing the route reverses the crossings; splitting a leg anywhere leaves them unchanged;
* the results do not depend on the order in which substances were first used (two fresh
  processes, opposite orders, identical output to the last bit).

The default profile is bounded (a few dozen routes per property). The long profile runs well over
10,000 routes: ``PHASEPATH_FUZZ=long python -m pytest -p no:cacheprovider
tests/test_fuzz_routes.py`` or ``python benchmarks/fuzz_long.py``.
"""

from __future__ import annotations

import json
import math
import os
import subprocess
import sys
import textwrap
from pathlib import Path
from typing import Any

import pytest

hypothesis = pytest.importorskip("hypothesis")
from hypothesis import HealthCheck, assume, given, settings  # noqa: E402
from hypothesis import strategies as st  # noqa: E402

import phasepath as pp  # noqa: E402
from phasepath.analysis import TOLERANCE  # noqa: E402

_COMMON = dict(
    deadline=None,
    derandomize=False,
    print_blob=True,
    suppress_health_check=[HealthCheck.too_slow, HealthCheck.filter_too_much],
)
settings.register_profile("phasepath-default", max_examples=60, **_COMMON)
settings.register_profile("phasepath-long", max_examples=4000, **_COMMON)
_PROFILE = "phasepath-long" if os.environ.get("PHASEPATH_FUZZ") == "long" else "phasepath-default"
_SETTINGS = settings.get_profile(_PROFILE)

#: Substances fuzzed: water (five ice branches and a sublimation curve), the four whose
#: sublimation curves phasepath may carry, fluids with a melting line (propane) and without one
#: in the reference library (R-134a, ammonia).
SUBSTANCES = (
    "Water",
    "CarbonDioxide",
    "Nitrogen",
    "Argon",
    "Methane",
    "n-Propane",
    "R134a",
    "Ammonia",
)

_INVERSE = {
    "melting": "freezing",
    "freezing": "melting",
    "vaporization": "condensation",
    "condensation": "vaporization",
    "sublimation": "deposition",
    "deposition": "sublimation",
    "supercritical-entry": "supercritical-exit",
    "supercritical-exit": "supercritical-entry",
    "solid-transition": "solid-transition",
}
_SCAN = 120  # points per leg in the independent scan
_NUDGE = 1e-7  # relative step beside a crossing where its two phases are read


def _window(sub: pp.Substance) -> tuple[float, float, float, float]:
    """(T_lo, T_hi, p_lo, p_hi) of the region fuzzed: around the triple and critical points,
    inside the range the models cover."""
    T_t, p_t = sub.triple
    T_c, p_c = sub.critical
    T_lo = max(sub.T_min, 0.75 * T_t)
    T_hi = min(sub.T_max, 1.6 * T_c)
    p_lo = 1e-3 * p_t
    p_hi = min(sub.p_max, 60.0 * p_c)
    return T_lo, T_hi, p_lo, p_hi


@st.composite
def routes(draw: Any, max_legs: int = 4) -> pp.Route:
    """A random route of isobars and isotherms inside the fuzzed window of a random substance."""
    sub = pp.substance(draw(st.sampled_from(SUBSTANCES)))
    T_lo, T_hi, p_lo, p_hi = _window(sub)
    Ts = st.floats(T_lo, T_hi, allow_nan=False)
    lps = st.floats(math.log(p_lo), math.log(p_hi), allow_nan=False)
    T0, p0 = draw(Ts), math.exp(draw(lps))
    try:
        route = pp.Route(sub, T=T0, p=p0)
    except pp.PhasePathError:
        assume(False)
    n = draw(st.integers(1, max_legs))
    for _ in range(n):
        kind = draw(st.sampled_from(("isobar", "isotherm")))
        try:
            if kind == "isobar":
                route.isobar(T=draw(Ts))
            else:
                route.isotherm(p=math.exp(draw(lps)))
        except pp.PhasePathError:
            continue  # a leg the models refuse is skipped: the route keeps its good legs
    assume(route.legs)
    return route


def _analyze(route: pp.Route) -> pp.Report:
    try:
        return route.analyze()
    except pp.PhasePathError as exc:  # a refusal is allowed; a raw error is not
        assume(False)
        raise AssertionError(exc) from None  # pragma: no cover


# -- geometry of a leg ---------------------------------------------------------------------------


def _leg_points(route: pp.Route, step: int) -> tuple[str, tuple[float, float], tuple[float, float]]:
    corners = route.corners()
    leg = route.legs[step - 1]
    return leg.kind, corners[step - 1], corners[step]


def _coord(kind: str, T: float, p: float) -> float:
    """Position along a leg: T on an isobar, ln p on an isotherm."""
    return T if kind == "isobar" else math.log(p)


def _at(kind: str, a: tuple[float, float], b: tuple[float, float], u: float) -> tuple[float, float]:
    """The state a fraction u along the leg from a to b."""
    if kind == "isobar":
        return a[0] + u * (b[0] - a[0]), a[1]
    return a[0], math.exp(math.log(a[1]) + u * (math.log(b[1]) - math.log(a[1])))


def _fraction(
    kind: str, a: tuple[float, float], b: tuple[float, float], T: float, p: float
) -> float:
    x0, x1, x = _coord(kind, *a), _coord(kind, *b), _coord(kind, T, p)
    return (x - x0) / (x1 - x0)


# -- the properties ---------------------------------------------------------------------------


def _check_on_boundary(sub: pp.Substance, route: pp.Route, c: pp.Crossing) -> None:
    T_t, p_t = sub.triple
    T_c, p_c = sub.critical
    branches = {b.label: b for b in (*sub.boundaries, *sub.solid_boundaries)}
    if c.at_corner or c.boundary == "corner":
        assert any(c.T == T and c.p == p for T, p in route.corners()), c
    elif c.boundary in branches:
        b = branches[c.boundary]
        assert b.T_min * (1 - TOLERANCE) <= c.T <= b.T_max * (1 + TOLERANCE), c
        T = min(max(c.T, b.T_min), b.T_max)
        # TOLERANCE in pressure, or a few units in the last place of T where the branch is so
        # steep that one such unit spans more (propane's melting line near its triple point
        # rises by 1e7 Pa/K at 1 Pa: one unit of T there is 1.6e-7 of the pressure).
        h = 1e-7 * T
        lo, hi = max(T - h, b.T_min), min(T + h, b.T_max)
        slope = abs(b.p_of_T(hi) - b.p_of_T(lo)) / (hi - lo)
        allowed = TOLERANCE * c.p + 4 * math.ulp(T) * slope
        assert abs(b.p_of_T(T) - c.p) <= allowed, (c, b.p_of_T(T), allowed)
    elif c.boundary == "triple point":
        assert c.T == pytest.approx(T_t, rel=TOLERANCE) or c.p == pytest.approx(p_t, rel=1e-6), c
    elif c.boundary == "critical isobar":
        assert c.p == pytest.approx(p_c, rel=TOLERANCE), c
    elif c.boundary == "critical isotherm":
        assert c.T == pytest.approx(T_c, rel=TOLERANCE), c
    elif c.boundary == "branch junction":
        assert any(c.T == pytest.approx(T, rel=TOLERANCE) for T in sub.junction_temperatures), c
    else:  # pragma: no cover - the failure message
        pytest.fail(f"crossing on an unnamed boundary: {c}")


def _check_sides(sub: pp.Substance, route: pp.Route, rep: pp.Report) -> None:
    """Read the phase just before and just after each crossing with classify()."""
    by_leg: dict[int, list[pp.Crossing]] = {}
    for c in rep.crossings:
        by_leg.setdefault(c.step, []).append(c)
    for step, crossings in by_leg.items():
        kind, a, b = _leg_points(route, step)
        us = [_fraction(kind, a, b, c.T, c.p) for c in crossings]
        for i, (c, u) in enumerate(zip(crossings, us, strict=False)):
            gap = min([abs(u - v) for j, v in enumerate(us) if j != i] + [1.0])
            if gap < 100 * _NUDGE or c.at_corner:
                continue  # two crossings (nearly) at one point: the chain check covers them
            d = min(_NUDGE, u / 2, (1 - u) / 2)  # stay on the leg (a crossing next to a corner)
            before = sub.classify(*_at(kind, a, b, u - d))
            after = sub.classify(*_at(kind, a, b, u + d))
            assert before == (c.from_phase, c.from_form), (c, before)
            assert after == (c.to_phase, c.to_form), (c, after)


def _check_dense_scan(sub: pp.Substance, route: pp.Route, rep: pp.Report) -> None:
    """Every change of phase between scan points is reported, in order, on that leg."""
    for step in range(1, len(route.legs) + 1):
        kind, a, b = _leg_points(route, step)
        leg_crossings = [c for c in rep.crossings if c.step == step and not c.at_corner]
        us = [(i + 0.5) / _SCAN for i in range(_SCAN)]
        # phases only: a change of solid form alone (water's ice Ih to a high-pressure ice below
        # 251 K) is not a crossing of the phase diagram's fluid-solid boundaries
        phases = [(sub.classify(*_at(kind, a, b, u))[0], None) for u in us]
        for u0, u1, ph0, ph1 in zip(us[:-1], us[1:], phases[:-1], phases[1:], strict=False):
            inside = [c for c in leg_crossings if u0 <= _fraction(kind, a, b, c.T, c.p) <= u1]
            if ph0 == ph1 and not inside:
                continue
            # the crossings between two scan points chain the phase at one to the phase at the other
            assert inside, f"leg {step}: {ph0} -> {ph1} between u={u0:.4f} and {u1:.4f} missed"
            chain = [ph0]
            for c in inside:
                assert chain[-1][0] == c.from_phase, (chain, c)
                chain.append((c.to_phase, None))
            assert chain[-1][0] == ph1[0], (chain, ph1)
        # the leg's start and end phases agree with the scan next to them
        leg = rep.legs[step - 1]
        first = [c for c in leg_crossings if _fraction(kind, a, b, c.T, c.p) < us[0]]
        last = [c for c in leg_crossings if _fraction(kind, a, b, c.T, c.p) > us[-1]]
        if not first:
            assert leg.start.phase == phases[0][0] or _near_boundary(sub, *a), leg.start
        if not last:
            assert leg.end.phase == phases[-1][0] or _near_boundary(sub, *b), (leg.end, phases[-1])


def _near_boundary(sub: pp.Substance, T: float, p: float) -> bool:
    """A corner within 1/_SCAN of a leg from a boundary: its own phase may differ from the scan."""
    for dT, f in ((0.0, 1.0), (0.0, 1.02), (0.0, 0.98), (0.01 * T, 1.0), (-0.01 * T, 1.0)):
        try:
            if sub.phase(T + dT, p * f) != sub.phase(T, p):
                return True
        except pp.PhasePathError:
            return True
    return False


def _signature(c: pp.Crossing) -> tuple[Any, ...]:
    return (c.kind, c.from_phase, c.to_phase, c.from_form, c.to_form)


@settings(_SETTINGS)
@given(route=routes())
def test_crossings_on_boundary_sides_and_dense_scan(route: pp.Route) -> None:
    sub = route.substance
    rep = _analyze(route)
    for c in rep.crossings:
        _check_on_boundary(sub, route, c)
    _check_sides(sub, route, rep)
    _check_dense_scan(sub, route, rep)


@settings(_SETTINGS)
@given(route=routes())
def test_reversing_reverses_the_crossings(route: pp.Route) -> None:
    rep = _analyze(route)
    try:
        back = route.reversed()
    except pp.PhasePathError as exc:  # pragma: no cover - a valid route reverses
        pytest.fail(f"reversing a valid route was refused: {exc}")
    rev = _analyze(back)
    n = len(route.legs)
    assert len(rev.crossings) == len(rep.crossings)
    for c, r in zip(rep.crossings, reversed(rev.crossings), strict=False):
        assert r.kind == _INVERSE[c.kind]
        assert (r.from_phase, r.to_phase) == (c.to_phase, c.from_phase)
        assert (r.from_form, r.to_form) == (c.to_form, c.from_form)
        assert r.T == pytest.approx(c.T, rel=TOLERANCE) and r.p == pytest.approx(c.p, rel=TOLERANCE)
        if not c.at_corner:
            assert r.step == n + 1 - c.step


@settings(_SETTINGS)
@given(route=routes(max_legs=3), where=st.data())
def test_splitting_a_leg_leaves_the_crossings(route: pp.Route, where: st.DataObject) -> None:
    rep = _analyze(route)
    step = where.draw(st.integers(1, len(route.legs)))
    u = where.draw(st.floats(0.02, 0.98))
    kind, a, b = _leg_points(route, step)
    for c in rep.crossings:  # a split exactly on a crossing makes a corner crossing: skip those
        if c.step == step:
            assume(abs(_fraction(kind, a, b, c.T, c.p) - u) > 1e-6)
    mid = _at(kind, a, b, u)
    split = pp.Route(route.substance, T=route.start.T, p=route.start.p)
    for i, leg in enumerate(route.legs, start=1):
        if i == step:
            split.isobar(T=mid[0]) if kind == "isobar" else split.isotherm(p=mid[1])
        split.isobar(T=leg.T) if leg.kind == "isobar" else split.isotherm(p=leg.p)
    rep2 = _analyze(split)
    assert [_signature(c) for c in rep2.crossings] == [_signature(c) for c in rep.crossings]
    for c, d in zip(rep.crossings, rep2.crossings, strict=False):
        assert d.T == pytest.approx(c.T, rel=TOLERANCE) and d.p == pytest.approx(c.p, rel=TOLERANCE)
        if c.step < step:
            assert d.step == c.step
        elif c.step > step:
            assert d.step == c.step + 1
        else:  # the split leg is now two legs
            assert d.step in (step, step + 1)
        if c.latent_heat is not None:
            assert d.latent_heat == pytest.approx(c.latent_heat, rel=1e-9)


# -- order of first use (fresh processes) -----------------------------------------------------

_ORDER_SCRIPT = textwrap.dedent("""
    import json, sys
    import phasepath as pp
    ROUTES = {
        "Water": [("isobar", "150 degC"), ("isotherm", "0.05 bar"), ("isobar", "-30 degC"),
                  ("isotherm", "2000 bar")],
        "CarbonDioxide": [("isotherm", "80 bar"), ("isobar", "40 degC"), ("isotherm", "5 bar")],
        "Nitrogen": [("isotherm", "40 bar"), ("isobar", "140 K"), ("isotherm", "0.5 bar")],
        "R134a": [("isobar", "60 degC"), ("isotherm", "50 bar")],
        "Methane": [("isotherm", "3000 bar"), ("isobar", "200 K")],
    }
    START = {"Water": ("20 degC", "1 bar"), "CarbonDioxide": ("-20 degC", "10 bar"),
             "Nitrogen": ("80 K", "1 bar"), "R134a": ("-20 degC", "2 bar"),
             "Methane": ("120 K", "1 bar")}
    out = {}
    for name in sys.argv[1:]:
        T, p = START[name]
        route = pp.Route(name, T=T, p=p)
        for kind, target in ROUTES[name]:
            route.add(kind, **({"T": target} if kind == "isobar" else {"p": target}))
        rep = route.analyze()
        out[name] = {
            "crossings": [[c.kind, c.T.hex(), c.p.hex(), None if c.latent_heat is None
                           else c.latent_heat.hex(), c.boundary] for c in rep.crossings],
            "legs": [[None if g.heat is None else g.heat.hex(),
                      None if g.work is None else g.work.hex()] for g in rep.legs],
        }
    print(json.dumps(out, sort_keys=True))
""")


def _run_order(names: list[str]) -> dict[str, Any]:
    root = Path(__file__).resolve().parents[1]
    env = {**os.environ, "PYTHONPATH": str(root) + os.pathsep + os.environ.get("PYTHONPATH", "")}
    done = subprocess.run(
        [sys.executable, "-c", _ORDER_SCRIPT, *names],
        capture_output=True,
        text=True,
        timeout=600,
        env=env,
        cwd=root,
    )
    assert done.returncode == 0, done.stderr[-3000:]
    result: dict[str, Any] = json.loads(done.stdout)
    return result


def test_results_independent_of_first_use_order() -> None:
    from concurrent.futures import ThreadPoolExecutor

    names = ["Water", "CarbonDioxide", "Nitrogen", "R134a", "Methane"]
    with ThreadPoolExecutor(2) as pool:  # the two processes side by side
        forward_job = pool.submit(_run_order, names)
        backward_job = pool.submit(_run_order, list(reversed(names)))
        forward, backward = forward_job.result(), backward_job.result()
    assert forward == backward
    assert any(forward[n]["crossings"] for n in names)  # the routes do cross boundaries


def test_window_is_inside_the_models() -> None:
    # The fuzzed window's corners are states the models cover (else the fuzz tests little).
    for name in SUBSTANCES:
        sub = pp.substance(name)
        T_lo, T_hi, p_lo, p_hi = _window(sub)
        assert T_lo <= sub.triple[0] < sub.critical[0] < T_hi
        assert p_lo < sub.triple[1] < sub.critical[1] < p_hi <= sub.p_max
        sub.check_state(sub.critical[0], p_hi)
