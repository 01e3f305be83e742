"""The crossing analyser: legs x boundary branches -> crossings, leg summaries, notes, cautions.

Method
------
For each leg every point where the leg meets a boundary branch is a *candidate*:

* constant-temperature leg: each branch covering T is evaluated directly at T (one call);
  the critical isobar p = p_c is a candidate when T > T_c;
* constant-pressure leg: each branch is inverted at p, directly where its source offers an
  inverse (CoolProp's saturation and melting lines), else by the root finder
  (:mod:`phasepath.rootfind`) on the exact equation inside a bracket from the branch's cached
  sample; the temperatures where branches start or end
  (triple point, critical point, water's ice junctions) are candidates too.

The candidates cut the leg into intervals; the phase of each interval is the phase of its
midpoint, computed from the same boundary equations. A crossing is recorded wherever two
neighbouring intervals differ in phase, so a crossing is never reported without a change of
phase on either side of it, and a change of phase is never missed between candidates.

Boundary rule (states exactly on a boundary)
--------------------------------------------
A crossing exactly at a corner of the route is recorded once, on the leg that ends there, and
only if the phase before the corner differs from the phase after it (touching a boundary and
turning back is not a crossing). That leg's end state is the state after the crossing, so its
heat includes the latent heat, and the next leg starts from it. The route's start takes the
phase of the side the first leg leaves into; a route that ends on a boundary ends in the phase
from which it arrives and records no crossing there. Candidates closer than 1e-9 (relative) along
a leg are one point, so a leg running through the triple point changes phase there directly
(solid -> vapor on the triple-point isobar: one sublimation, not a melting and a vaporization).
"""

from __future__ import annotations

import math
from collections.abc import Sequence
from dataclasses import dataclass, replace
from functools import lru_cache
from typing import TYPE_CHECKING

from . import curved, states
from .correlations.atmosphere import ambient_pressure
from .energetics import latent_heat, leg_heat_work
from .errors import PhasePathError, RouteError
from .hazards import NEAR_CRITICAL, cautions, crossing_hazards, leg_hazards
from .records import (
    BASES,
    CURVED_KINDS,
    LEG_KINDS,
    TOLERANCE,
    Crossing,
    LegSummary,
    StatePoint,
    boundary_kind,
    boundary_of,
    crossing_kind,
    describe_change,
    state_key,
)
from .report import Report

if TYPE_CHECKING:  # pragma: no cover
    from .records import Leg
    from .route import Route
    from .substances import Substance

__all__ = ["analyze", "range_warnings", "TOLERANCE", "cache_clear"]

#: Relative distance below which a candidate counts as sitting on a leg's end, and below which
#: two candidates count as one point (three curves meeting at a triple point).
_END_TOL = 1e-9


@dataclass(frozen=True)
class _Candidate:
    x: float  # the leg's moving coordinate (T on an isobar, p on an isotherm)
    T: float
    p: float
    boundary: str
    method: str
    evaluations: int


@dataclass(frozen=True)
class _Trace:
    """What one leg contributes, independent of its neighbours (cached per leg)."""

    candidates: tuple[_Candidate, ...]  # interior candidates, in leg order
    phases: tuple[tuple[str, str | None], ...]  # (phase, form) of each interval


def analyze(route: Route, basis: str = "steady-flow") -> Report:
    """Analyse a route: crossings in route order, one summary per leg, notes.

    ``basis`` is "steady-flow" (per kg through a device) or "closed" (per kg in a closed
    vessel) for the heat and work of each leg; see :func:`phasepath.thermo.leg_heat_work`.
    """
    if basis not in BASES:
        raise RouteError(f"unknown heat-and-work basis {basis!r}; choose one of {', '.join(BASES)}")
    sub = route.substance
    if not route.legs:
        raise RouteError("the route has no legs yet: add an isobar or an isotherm to analyse")
    walks = []
    prev_end = route.start.state
    corners = route.corners()  # once: per leg it made long routes quadratic
    for i, leg in enumerate(route.legs):
        walk = _walk(sub, leg, corners[i], prev_end)
        walks.append(walk)
        # a curved next leg starts from this leg's end state, on the side this leg arrives from
        nxt = route.legs[i + 1] if i + 1 < len(route.legs) else None
        needs = nxt is not None and (
            nxt.kind in CURVED_KINDS or ((nxt.T, nxt.p) == (leg.T, leg.p) and nxt.state)
        )
        prev_end = (
            leg.state
            if leg.state is not None or not needs
            else _single(sub, StatePoint(leg.T, leg.p, "?"), walk.last)
        )
    crossings: list[Crossing] = []
    legs: list[LegSummary] = []
    start_state = route.start.state
    from_mixture = True  # the leg starts from a state given as such (the start, a mixture)
    for i, (leg, walk) in enumerate(zip(route.legs, walks, strict=True)):
        step = i + 1
        found: list[Crossing] = []
        if from_mixture and start_state is not None and state_key(start_state) != walk.first:
            # the leg leaves a mixture (or a given start state) into another phase: the change
            # happens on this leg, at its start, and its heat includes it
            found.append(
                _crossing(
                    sub,
                    step,
                    leg.kind,
                    _corner(leg, start_state),
                    state_key(start_state),
                    walk.first,
                    "corner",
                )
            )
        found += [
            _crossing(
                sub, step, leg.kind, c, before, after, "corner" if c.method == "corner" else ""
            )
            for c, before, after in walk.crossings
        ]
        end_key = walk.last
        # a leg that ends on a mixture ends there (the next leg takes the change at its start);
        # a leg that ends on a boundary takes the change of phase at its corner
        ends_mixed = leg.state is not None and "+" in leg.state.phase
        if i + 1 < len(walks) and walks[i + 1].first != end_key and not ends_mixed:
            T, p = leg.T, leg.p
            corner = _Candidate(T if leg.kind == "isobar" else p, T, p, "corner", "corner", 0)
            found.append(
                _crossing(sub, step, leg.kind, corner, end_key, walks[i + 1].first, "corner")
            )
            end_key = walks[i + 1].first
        start = start_state if start_state is not None else _single(sub, walk.path[0], walk.first)
        end = (
            leg.state
            if (leg.state is not None and state_key(leg.state) == end_key)
            else (_single(sub, walk.path[-1], end_key))
        )
        heat, work, note = leg_heat_work(leg.kind, start, end, basis)
        for flag in dict.fromkeys(c.flag for c in found if c.flag):
            note += f"; {flag}"
        if leg.kind == "isenthalp" and end.p > start.p:
            note += "; pressure rises at constant enthalpy: no valve does this"
        hazards = leg_hazards(sub, leg.kind, list(walk.path), found, leg.event)
        legs.append(
            LegSummary(
                step,
                leg.kind,
                start,
                end,
                heat,
                work,
                note,
                basis,
                tuple(walk.path),
                hazards,
                leg.event,
            )
        )
        crossings += found
        start_state = end
        from_mixture = ends_mixed
    notes = list(sub.notes)
    if route.elevation is not None:
        notes.append(_ambient_note(sub, route.elevation))
    notes += range_warnings(sub, corners, crossings)
    return Report(route, crossings, legs, notes, cautions(sub, legs, crossings))


@dataclass(frozen=True)
class _Walk:
    """One leg walked through: phase keys at its ends, its crossings, sampled states."""

    first: tuple[str, str | None]
    last: tuple[str, str | None]
    crossings: tuple[tuple[_Candidate, tuple[str, str | None], tuple[str, str | None]], ...]
    path: tuple[StatePoint, ...]


def _walk(
    sub: Substance, leg: Leg, corner: tuple[float, float], prev_end: StatePoint | None
) -> _Walk:
    T0, p0 = corner
    if leg.kind in CURVED_KINDS:
        return _walk_curved(sub, leg, T0, p0, prev_end)
    if (leg.T, leg.p) == (T0, p0) and leg.state is not None and prev_end is not None:
        # an event leg that changes the state where it stands ("until fully vapor" from a
        # two-phase state): its change is its own, at its start
        start, end = prev_end.key, leg.state.key
        c = _Candidate(T0 if leg.kind == "isobar" else p0, T0, p0, "corner", "corner", 0)
        here = ((c, start, end),) if start != end else ()
        return _Walk(start, end, here, (prev_end, leg.state))
    tr = _trace(sub, leg.kind, T0, p0, leg.T, leg.p)
    found = [
        (c, tr.phases[k], tr.phases[k + 1])
        for k, c in enumerate(tr.candidates)
        if tr.phases[k] != tr.phases[k + 1]
    ]
    last = tr.phases[-1]
    if leg.state is not None and state_key(leg.state) != last:
        # an event leg ends after its transition ("until fully vapor")
        x = leg.T if leg.kind == "isobar" else leg.p
        found.append(
            (
                _Candidate(
                    x,
                    leg.T,
                    leg.p,
                    boundary_of(crossing_kind(last[0], leg.state.phase)),
                    "event",
                    0,
                ),
                last,
                state_key(leg.state),
            )
        )
        last = state_key(leg.state)
    path = (
        StatePoint(T0, p0, *tr.phases[0]),
        *(StatePoint(c.T, c.p, *tr.phases[k + 1]) for k, c in enumerate(tr.candidates)),
        StatePoint(leg.T, leg.p, *last),
    )
    return _Walk(tr.phases[0], last, tuple(found), path)


def _walk_curved(
    sub: Substance, leg: Leg, T0: float, p0: float, prev_end: StatePoint | None
) -> _Walk:
    """A curved leg: its crossings by root-finding on the boundary functions of the held
    property (:mod:`phasepath.curved`), the phase between them from the state at the middle."""
    assert leg.state is not None
    start = (
        prev_end
        if prev_end is not None
        else _single(sub, StatePoint(T0, p0, "?"), sub.classify(T0, p0))
    )
    prop = LEG_KINDS[leg.kind].held
    value = states.held_value(start, prop)
    if value is None:
        raise RouteError(f"the {leg.kind} leg starts from a state with no model: {start.model}")
    sealed = prop == "v"
    x0, x1 = (start.T, leg.T) if sealed else (start.p, leg.p)
    found = curved.candidates(sub, prop, value, x0, x1)
    cands = _inside([_Candidate(*c) for c in found], x0, x1)
    xs = [x0] + [c.x for c in cands] + [x1]
    keys = [
        curved.key_at(sub, prop, value, 0.5 * (a + b) if sealed else _pmid(a, b))
        for a, b in zip(xs[:-1], xs[1:], strict=True)
    ]
    crossings = []
    points: list[StatePoint] = [start]
    if start.key != keys[0]:
        # the leg starts on a boundary and runs into the next region from it (saturated vapor
        # into the two-phase region): the state does not jump, the change begins on this leg
        corner = _Candidate(x0, start.T, start.p, "corner", "corner", 0)
        crossings.append((corner, start.key, keys[0]))
    for k, c in enumerate(cands):
        if keys[k] == keys[k + 1]:
            continue
        if math.isnan(c.T):  # a fixed point of the coordinate: the state there
            at = curved.state_at(sub, prop, value, c.x)
            c = replace(c, T=at.T, p=at.p, boundary=_fixed_label(sub, c, at))
        label = c.boundary
        if "+" in keys[k][0] and "+" in keys[k + 1][0]:
            label = "triple point"  # one two-phase mixture to another
        crossings.append((replace(c, boundary=label), keys[k], keys[k + 1]))
        points.append(StatePoint(c.T, c.p, *keys[k + 1]))
    points.append(leg.state)
    path = _key_states(sub, prop, value, points, sealed)
    return _Walk(start.key, keys[-1], tuple(crossings), tuple(path))


def _fixed_label(sub: Substance, c: _Candidate, at: StatePoint) -> str:
    """The boundary a fixed point of a curved leg lies on."""
    T_t, p_t = sub.triple
    T_c, p_c = sub.critical
    if math.isclose(at.p, p_t, rel_tol=_END_TOL) or math.isclose(at.T, T_t, rel_tol=_END_TOL):
        return "triple point"
    if math.isclose(at.p, p_c, rel_tol=_END_TOL) and at.T > T_c:
        return "critical isobar"
    if math.isclose(at.T, T_c, rel_tol=_END_TOL):
        return "critical isotherm"
    return "branch junction"


def _key_states(
    sub: Substance, prop: str, value: float, points: list[StatePoint], sealed: bool
) -> list[StatePoint]:
    """The states a curved leg's flags are read from, in leg order: its ends and crossings,
    where its temperature (pressure on a sealed vessel) turns inside a single-phase stretch,
    and where it crosses the edges of the near-critical box (between two such states T and p
    are monotone, so these are all the states that decide a flag)."""
    T_c, p_c = sub.critical
    dT, dp = NEAR_CRITICAL
    box = (T_c * (1 - dT), T_c * (1 + dT), p_c * (1 - dp), p_c * (1 + dp))
    edges = (box[0], box[1]) if sealed else (box[2], box[3])
    out = [points[0]]
    for a, b in zip(points[:-1], points[1:], strict=True):
        xa, xb = (a.T, b.T) if sealed else (a.p, b.p)
        inner = []
        turn = curved.turning_point(sub, prop, value, a, b, xa, xb)
        if turn is not None:
            inner.append(turn)
        for seg_a, seg_b in zip([a, *inner], [*inner, b], strict=True):
            if not _meets(seg_a, seg_b, box):
                continue
            ya, yb = (seg_a.T, seg_b.T) if sealed else (seg_a.p, seg_b.p)
            for x in edges:
                if min(ya, yb) < x < max(ya, yb):
                    inner.append(curved.state_at(sub, prop, value, x))
        inner.sort(key=lambda st: abs((st.T if sealed else st.p) - xa))
        out += [*inner, b]
    return out


def _meets(a: StatePoint, b: StatePoint, box: tuple[float, float, float, float]) -> bool:
    """True where the rectangle spanned by two states overlaps the box (T_lo, T_hi, p_lo, p_hi)."""
    return not (
        max(a.T, b.T) < box[0]
        or min(a.T, b.T) > box[1]
        or max(a.p, b.p) < box[2]
        or min(a.p, b.p) > box[3]
    )


def _single(sub: Substance, where: StatePoint, key: tuple[str, str | None]) -> StatePoint:
    if "+" in key[0]:
        return where
    return states.single_state(sub, where.T, where.p, key[0], key[1])


def _corner(leg: Leg, state: StatePoint) -> _Candidate:
    return _Candidate(
        state.T if leg.kind == "isobar" else state.p, state.T, state.p, "corner", "corner", 0
    )


@lru_cache(maxsize=4096)  # a pure function of its arguments: unchanged legs reuse their records
def _crossing(
    sub: Substance,
    step: int,
    leg_kind: str,
    cand: _Candidate,
    before: tuple[str, str | None],
    after: tuple[str, str | None],
    where: str,
) -> Crossing:
    kind = crossing_kind(before[0], after[0])
    boundary = cand.boundary if where != "corner" else boundary_of(kind)
    L = latent_heat(sub, kind, cand.T, cand.p, before, after)
    c = Crossing(
        step=step,
        kind=kind,
        from_phase=before[0],
        to_phase=after[0],
        T=cand.T,
        p=cand.p,
        latent_heat=L.value,
        latent_heat_model=L.model,
        latent_heat_note=L.note,
        boundary=boundary,
        method=cand.method,
        evaluations=cand.evaluations,
        from_form=before[1],
        to_form=after[1],
        at_corner=where == "corner",
        detail=describe_change(before[0], after[0]),
    )
    flag = _flag(sub, c)
    if flag:
        c = replace(c, flag=flag)
    hz = crossing_hazards(sub, leg_kind, c)
    return replace(c, hazards=hz) if hz else c


def _flag(sub: Substance, c: Crossing) -> str:
    """What to know about the curve a crossing lies on (see ``Crossing.flag``)."""
    for b in sub.boundaries:
        if b.label == c.boundary or (
            c.at_corner and b.kind == boundary_kind(c.kind) and b.T_min <= c.T <= b.T_max
        ):
            if not b.reliable:
                return b.note
    if c.kind in ("melting", "freezing", "sublimation", "deposition") and sub.in_melting_gap(
        c.T, c.p
    ):
        return sub.melting_gap()
    return ""


def _ambient_note(sub: Substance, elevation: float) -> str:
    p = ambient_pressure(elevation)
    text = (
        f"Site elevation {elevation:g} m: ambient pressure {p:.6g} Pa "
        "(U.S. Standard Atmosphere 1976)"
    )
    if sub.vapor is not None and sub.triple[1] <= p <= sub.critical[1]:
        T_b = sub.vapor.temperatures_at(p)[0].root
        text += f"; {sub.name} boils there at {T_b:.6g} K ({T_b - 273.15:.2f} °C)"
    return text + "."


@lru_cache(maxsize=4096)
def _trace(sub: Substance, kind: str, T0: float, p0: float, T1: float, p1: float) -> _Trace:
    if kind == "isobar":
        cands = _isobar_candidates(sub, p0, T0, T1)
    elif kind == "isotherm":
        cands = _isotherm_candidates(sub, T0, p0, p1)
    else:  # pragma: no cover - Route refuses other kinds
        raise RouteError(f"unknown leg kind {kind!r}")
    x0, x1 = (T0, T1) if kind == "isobar" else (p0, p1)
    cands = _inside(cands, x0, x1)
    xs = [x0] + [c.x for c in cands] + [x1]
    phases = []
    for a, b in zip(xs[:-1], xs[1:], strict=False):
        mid = 0.5 * (a + b) if kind == "isobar" else _pmid(a, b)
        T, p = (mid, p0) if kind == "isobar" else (T0, mid)
        try:
            phases.append(sub.classify(T, p))
        except PhasePathError as exc:
            raise type(exc)(
                f"{kind} from (T = {T0:.6g} K, p = {p0:.6g} Pa) to "
                f"(T = {T1:.6g} K, p = {p1:.6g} Pa) passes through {exc}"
            ) from None
    return _Trace(tuple(cands), tuple(phases))


def _pmid(a: float, b: float) -> float:
    return math.sqrt(a * b) if a > 0 and b > 0 else 0.5 * (a + b)


def _inside(cands: list[_Candidate], x0: float, x1: float) -> list[_Candidate]:
    """Candidates strictly inside the leg, in leg order, merged where they coincide."""
    lo, hi = min(x0, x1), max(x0, x1)
    keep = [
        c
        for c in cands
        if lo < c.x < hi
        and abs(c.x - x0) > _END_TOL * abs(x0)
        and abs(c.x - x1) > _END_TOL * abs(x1)
    ]
    keep.sort(key=lambda c: c.x, reverse=x1 < x0)
    out: list[_Candidate] = []
    for c in keep:
        if out and abs(c.x - out[-1].x) <= _END_TOL * abs(c.x):
            prev = out[-1]
            if prev.method == "junction":  # prefer a real branch to a junction
                out[-1] = c
            elif c.method != "junction" and c.boundary != prev.boundary:
                # two branches meet here: a triple point
                out[-1] = _Candidate(
                    prev.x,
                    prev.T,
                    prev.p,
                    "triple point",
                    prev.method,
                    prev.evaluations + c.evaluations,
                )
            continue
        out.append(c)
    return out


def _isotherm_candidates(sub: Substance, T: float, p0: float, p1: float) -> list[_Candidate]:
    out = []
    for b in (*sub.boundaries, *sub.solid_boundaries):
        if b.T_min <= T <= b.T_max:
            p = b.p_of_T(T)
            out.append(_Candidate(p, T, p, b.label, "direct", 1))
    T_c, p_c = sub.critical
    if T > T_c:
        out.append(_Candidate(p_c, T, p_c, "critical isobar", "direct", 0))
    return out


def _isobar_candidates(sub: Substance, p: float, T0: float, T1: float) -> list[_Candidate]:
    lo, hi = min(T0, T1), max(T0, T1)
    out = []
    for b in (*sub.boundaries, *sub.solid_boundaries):
        if b.T_max < lo or b.T_min > hi:
            continue
        for r in b.temperatures_at(p):
            out.append(_Candidate(r.root, r.root, p, b.label, r.method, r.evaluations))
    T_c = sub.critical[0]
    for T in sub.junction_temperatures:
        if lo < T < hi:
            name = "critical isotherm" if T == T_c else "branch junction"
            out.append(_Candidate(T, T, p, name, "junction", 0))
    return out


def cache_clear() -> None:
    """Forget cached leg traces and crossing records (for benchmarks of cold analysis)."""
    _trace.cache_clear()
    _crossing.cache_clear()


def range_warnings(
    sub: Substance, corners: Sequence[tuple[float, float]], crossings: Sequence[Crossing]
) -> list[str]:
    """Warnings for a route that leaves the data range of a boundary (``Boundary.T_valid``).

    One line for each crossing that lies on a boundary outside its data range, and one for the
    route's states whose phase rests on the extrapolated (or bridged) part of the vapor-pressure
    curve.
    """
    ranged = {b.label: b for b in sub.boundaries if b.T_valid is not None}
    out = []
    for c in crossings:
        b = ranged.get(c.boundary)
        if b is None or b.T_valid is None:
            continue
        lo, hi = b.T_valid
        if not (lo * (1 - 1e-9) <= c.T <= hi * (1 + 1e-9)):
            out.append(
                f"Warning: leg {c.step} crosses the {b.label} curve at T = {c.T:.5g} K, "
                f"outside the range of its data ({lo:.5g} K to {hi:.5g} K): the curve is "
                "extrapolated there and the crossing is uncertain."
            )
    v = ranged.get("vapor pressure")
    if v is not None and v.T_valid is not None:
        lo, hi = v.T_valid
        outside = sorted({T for T, _ in corners if v.T_min <= T <= v.T_max and not (lo <= T <= hi)})
        if outside:
            Ts = ", ".join(f"{T:.5g} K" for T in outside)
            out.append(
                f"Warning: the route reaches {Ts}, outside the range of the vapor-pressure "
                f"data ({lo:.5g} K to {hi:.5g} K): the phases there rest on the "
                "extrapolated curve."
            )
    return out
