"""Property-based invariants of the analyser (hypothesis), on random routes of a few substances.

1. Every crossing lies on its boundary: the boundary branch named in ``crossing.boundary``,
   evaluated at the crossing's T, gives its p to 1e-9 relative (phasepath.analysis.TOLERANCE);
   crossings at the critical isotherm/isobar or the triple point sit exactly there; corner
   crossings (``at_corner``) sit exactly on a corner of the route.
2. The phase a small step before and after each crossing, along the leg, is the recorded one.
3. The reversed route gives the reversed crossings.
4. Splitting a leg at an interior point leaves the crossings unchanged (apart from step numbers).

Examples are bounded (and derandomized, so CI is reproducible) to keep the file under a minute.
"""

from __future__ import annotations

import math

import pytest
from hypothesis import HealthCheck, assume, given, settings
from hypothesis import strategies as st

import phasepath as pp
from phasepath.analysis import TOLERANCE
from phasepath.errors import PhasePathError

SETTINGS = settings(
    max_examples=60,
    deadline=None,
    derandomize=True,
    database=None,
    suppress_health_check=[HealthCheck.filter_too_much, HealthCheck.too_slow],
)

# (name, T_lo, T_hi [K], p_lo, p_hi [Pa]): boxes that hold every region of each substance.
BOXES = {
    "water": (200.0, 900.0, 10.0, 900e6),
    "CO2": (150.0, 450.0, 1e3, 500e6),
    "N2": (50.0, 250.0, 1e3, 500e6),
    "Ar": (70.0, 300.0, 1e3, 500e6),
    "CH4": (70.0, 400.0, 1e3, 500e6),
    "ammonia": (200.0, 600.0, 1e3, 100e6),
}

REVERSE = {
    "melting": "freezing",
    "freezing": "melting",
    "vaporization": "condensation",
    "condensation": "vaporization",
    "sublimation": "deposition",
    "deposition": "sublimation",
    "supercritical-entry": "supercritical-exit",
    "supercritical-exit": "supercritical-entry",
}


@st.composite
def routes(draw, max_legs: int = 3):
    name = draw(st.sampled_from(sorted(BOXES)))
    sub = pp.substance(name)
    T_lo, T_hi, p_lo, p_hi = BOXES[name]
    T_lo = max(T_lo, sub.T_min + 0.5)
    # pressures: log-uniform over the box, or close to the triple / critical pressures
    special = [sub.triple[1], sub.critical[1]]

    def temperature():
        return draw(
            st.one_of(
                st.floats(T_lo, T_hi),
                st.sampled_from([sub.triple[0], sub.critical[0]]).map(
                    lambda t: min(max(t * draw(st.floats(0.9, 1.1)), T_lo), T_hi)
                ),
            )
        )

    def on_branch(b):  # a pressure on a melting or sublimation branch, then moved off it
        T = draw(st.floats(b.T_min, b.T_max))
        return b.p_of_T(T) * draw(st.floats(0.8, 1.25))

    solid_branches = list(sub.melting) + ([sub.sublimation] if sub.sublimation else [])

    def pressure():
        options = [
            st.floats(math.log(p_lo), math.log(p_hi)).map(math.exp),
            st.sampled_from(special).map(lambda q: q * draw(st.floats(0.5, 2.0))),
        ]
        if solid_branches:
            options.append(st.sampled_from(solid_branches).map(on_branch))
        return draw(st.one_of(options))

    try:
        route = pp.Route(sub, T=temperature(), p=pressure())
        for _ in range(draw(st.integers(1, max_legs))):
            if draw(st.booleans()):
                route.isobar(T=temperature())
            else:
                route.isotherm(p=pressure())
        report = route.analyze()
    except PhasePathError:
        assume(False)
    return route, report


def _boundary(sub, label):
    return next((b for b in (*sub.boundaries, *sub.solid_boundaries) if b.label == label), None)


def _key(c):
    return (c.kind, c.T, c.p)


def _close(a: float, b: float) -> bool:
    return math.isclose(a, b, rel_tol=TOLERANCE, abs_tol=0.0)


@SETTINGS
@given(routes())
def test_every_crossing_lies_on_its_boundary(case):
    route, report = case
    sub = route.substance
    corners = route.corners()
    for c in report.crossings:
        if c.at_corner:
            assert (c.T, c.p) in corners, c
            continue
        b = _boundary(sub, c.boundary)
        if b is not None:
            assert b.T_min <= c.T <= b.T_max, c
            assert abs(b.p_of_T(c.T) / c.p - 1.0) <= TOLERANCE, (c, b.p_of_T(c.T))
        elif c.boundary == "critical isotherm":
            assert c.T == sub.critical[0], c
        elif c.boundary == "critical isobar":
            assert c.p == sub.critical[1], c
        elif c.boundary == "triple point":
            assert (c.T, c.p) == sub.triple, c
        elif c.boundary == "branch junction":
            assert c.T in sub.junction_temperatures, c
        else:
            pytest.fail(f"crossing on an unknown boundary {c.boundary!r}: {c}")


def _nudge(leg_kind: str, T: float, p: float, towards: tuple[float, float], rel: float):
    """A point a relative step `rel` from (T, p) along the leg towards the given corner."""
    if leg_kind == "isobar":
        dT = towards[0] - T
        return T + math.copysign(min(abs(dT) / 2, rel * T), dT), p
    dp = towards[1] - p
    return T, p * math.exp(math.copysign(min(abs(math.log(towards[1] / p)) / 2, rel), dp))


@SETTINGS
@given(routes())
def test_phase_either_side_of_a_crossing_matches_its_record(case):
    route, report = case
    sub = route.substance
    corners = route.corners()
    rel = 1e-7
    xs = list(report.crossings)
    for c in xs:
        i = c.step - 1
        kind = route.legs[i].kind
        if c.at_corner:
            before = _nudge(kind, c.T, c.p, corners[i], rel)
            after = _nudge(route.legs[i + 1].kind, c.T, c.p, corners[i + 2], rel)
        else:
            before = _nudge(kind, c.T, c.p, corners[i], rel)
            after = _nudge(kind, c.T, c.p, corners[i + 1], rel)
        # skip where another crossing lies within the step (three curves meeting)
        if any(
            o is not c and abs(o.T / c.T - 1) < 10 * rel and abs(o.p / c.p - 1) < 10 * rel
            for o in xs
        ):
            continue
        assert sub.phase(*before) == c.from_phase, (c, before)
        assert sub.phase(*after) == c.to_phase, (c, after)


@SETTINGS
@given(routes())
def test_reversed_route_gives_reversed_crossings(case):
    route, report = case
    back = route.reversed().analyze()
    forward = list(reversed(report.crossings))
    assert len(back.crossings) == len(forward), (report.crossings, back.crossings)
    n = len(route.legs)
    for f, b in zip(forward, back.crossings, strict=True):
        assert b.kind == REVERSE[f.kind], (f, b)
        assert (b.from_phase, b.to_phase) == (f.to_phase, f.from_phase)
        assert _close(b.T, f.T) and _close(b.p, f.p), (f, b)
        if not f.at_corner:
            assert b.step == n + 1 - f.step


@SETTINGS
@given(routes(max_legs=2), st.integers(0, 1), st.floats(0.02, 0.98))
def test_splitting_a_leg_leaves_the_crossings_unchanged(case, which, fraction):
    route, report = case
    i = min(which, len(route.legs) - 1)
    corners = route.corners()
    (T0, p0), (T1, p1) = corners[i], corners[i + 1]
    leg = route.legs[i]
    split = pp.Route(route.substance, T=corners[0][0], p=corners[0][1])
    for k, other in enumerate(route.legs):
        if k == i:
            if leg.kind == "isobar":
                split.isobar(T=T0 + fraction * (T1 - T0))
            else:
                split.isotherm(p=math.exp(math.log(p0) + fraction * math.log(p1 / p0)))
        split.isobar(T=other.T) if other.kind == "isobar" else split.isotherm(p=other.p)
    again = split.analyze()
    assert len(again.crossings) == len(report.crossings), (report.crossings, again.crossings)
    for a, b in zip(report.crossings, again.crossings, strict=True):
        assert a.kind == b.kind and (a.from_phase, a.to_phase) == (b.from_phase, b.to_phase)
        assert _close(a.T, b.T) and _close(a.p, b.p), (a, b)
