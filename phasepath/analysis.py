"""The crossing analyser: legs x boundary branches -> crossings. The only place that root-finds.

Method
------
For each leg every point where the leg meets a boundary branch is a *candidate*:

* constant-temperature leg: each branch covering T is evaluated directly at T (one call);
  the critical isobar p = p_c is a candidate when T > T_c;
* constant-pressure leg: each branch is inverted at p, directly where its source offers an
  inverse (CoolProp's saturation and melting lines), else by ``brentq`` on the exact equation
  inside a bracket from the branch's cached sample; the temperatures where branches start or end
  (triple point, critical point, water's ice junctions) are candidates too.

The candidates cut the leg into intervals; the phase of each interval is the phase of its
midpoint, computed from the same boundary equations. A crossing is recorded wherever two
neighbouring intervals differ in phase, so a crossing is never reported without a change of
phase on either side of it, and a change of phase is never missed between candidates.

Boundary rule (states exactly on a boundary)
--------------------------------------------
A corner of the route that lies exactly on a boundary takes the phase of the side from which the
route arrives; the route's start takes the phase of the side it leaves into. A crossing exactly
at a corner is recorded once, on the leg that ends there, and only if the phase before the corner
differs from the phase after it (touching a boundary and turning back is not a crossing). A route
that ends on a boundary records no crossing there. Candidates closer than 1e-9 (relative) along a
leg are one point, so a leg running through the triple point changes phase there directly (solid ->
vapor on the triple-point isobar: one sublimation, not a melting and a vaporization).
"""

from __future__ import annotations

import math
from dataclasses import dataclass
from functools import lru_cache
from typing import TYPE_CHECKING

from .errors import PhasePathError, RouteError
from .report import Crossing, LegSummary, Report, StatePoint
from .thermo import latent_heat, leg_heat_work

if TYPE_CHECKING:  # pragma: no cover
    from .route import Route
    from .substances import Substance

__all__ = ["analyze", "crossing_kind", "TOLERANCE"]

#: Relative distance below which a candidate counts as sitting on a leg's end, and below which
#: two candidates count as one point (three curves meeting at a triple point).
_END_TOL = 1e-9
#: Guaranteed relative agreement between a crossing and its boundary.
TOLERANCE = 1e-9

_KIND = {
    ("solid", "liquid"): "melting",
    ("liquid", "solid"): "freezing",
    ("liquid", "vapor"): "vaporization",
    ("vapor", "liquid"): "condensation",
    ("solid", "vapor"): "sublimation",
    ("vapor", "solid"): "deposition",
    ("vapor", "supercritical"): "supercritical-entry",
    ("liquid", "supercritical"): "supercritical-entry",
    ("supercritical", "vapor"): "supercritical-exit",
    ("supercritical", "liquid"): "supercritical-exit",
    ("solid", "supercritical"): "melting",
    ("supercritical", "solid"): "freezing",
}


def crossing_kind(from_phase: str, to_phase: str) -> str:
    """Name of the transition from one phase to another.

    >>> crossing_kind("vapor", "solid")
    'deposition'
    """
    return _KIND[(from_phase, to_phase)]


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


def analyze(route: Route) -> Report:
    """Analyse a route: crossings in route order, one summary per leg, notes."""
    sub = route.substance
    corners = route.corners()
    if not route.legs:
        raise RouteError("the route has no legs yet: add an isobar or an isotherm to analyse")
    traces = [
        _trace(sub, leg.kind, *corners[i], *corners[i + 1]) for i, leg in enumerate(route.legs)
    ]
    crossings: list[Crossing] = []
    legs: list[LegSummary] = []
    for i, (leg, tr) in enumerate(zip(route.legs, traces)):
        step = i + 1
        for k, cand in enumerate(tr.candidates):
            before, after = tr.phases[k], tr.phases[k + 1]
            if before[0] != after[0]:
                crossings.append(_crossing(sub, step, cand, before, after, at_corner=False))
        if i + 1 < len(traces):
            before, after = tr.phases[-1], traces[i + 1].phases[0]
            if before[0] != after[0]:
                T, p = corners[i + 1]
                corner = _Candidate(T if leg.kind == "isobar" else p, T, p, "corner", "corner", 0)
                crossings.append(_crossing(sub, step, corner, before, after, at_corner=True))
        (T0, p0), (T1, p1) = corners[i], corners[i + 1]
        start = StatePoint(T0, p0, *tr.phases[0])
        end = StatePoint(T1, p1, *tr.phases[-1])
        heat, work, note = leg_heat_work(sub, leg.kind, start, end)
        legs.append(LegSummary(step, leg.kind, start, end, heat, work, note))
    return Report(route, crossings, legs, list(sub.notes))


def _crossing(sub: Substance, step: int, cand: _Candidate, before: tuple[str, str | None],
              after: tuple[str, str | None], at_corner: bool) -> Crossing:
    kind = crossing_kind(before[0], after[0])
    boundary = cand.boundary if not at_corner else _boundary_name(kind)
    L, model, note = latent_heat(sub, kind, cand.T, cand.p, before, after)
    return Crossing(
        step=step, kind=kind, from_phase=before[0], to_phase=after[0], T=cand.T, p=cand.p,
        latent_heat=L, latent_heat_model=model, latent_heat_note=note, boundary=boundary,
        method=cand.method, evaluations=cand.evaluations, from_form=before[1],
        to_form=after[1], at_corner=at_corner,
    )


def _boundary_name(kind: str) -> str:
    return {"melting": "melting", "freezing": "melting", "vaporization": "vapor pressure",
            "condensation": "vapor pressure", "sublimation": "sublimation",
            "deposition": "sublimation"}.get(kind, "critical point region")


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
    for a, b in zip(xs[:-1], xs[1:]):
        mid = 0.5 * (a + b) if kind == "isobar" else _pmid(a, b)
        T, p = (mid, p0) if kind == "isobar" else (T0, mid)
        try:
            phases.append(sub.classify(T, p))
        except PhasePathError as exc:
            raise type(exc)(f"{kind} from (T = {T0:.6g} K, p = {p0:.6g} Pa) to "
                            f"(T = {T1:.6g} K, p = {p1:.6g} Pa) passes through {exc}") from None
    return _Trace(tuple(cands), tuple(phases))


def _pmid(a: float, b: float) -> float:
    return math.sqrt(a * b) if a > 0 and b > 0 else 0.5 * (a + b)


def _inside(cands: list[_Candidate], x0: float, x1: float) -> list[_Candidate]:
    """Candidates strictly inside the leg, in leg order, merged where they coincide."""
    lo, hi = min(x0, x1), max(x0, x1)
    keep = [c for c in cands
            if lo < c.x < hi and abs(c.x - x0) > _END_TOL * abs(x0) and abs(c.x - x1) > _END_TOL * abs(x1)]
    keep.sort(key=lambda c: c.x, reverse=x1 < x0)
    out: list[_Candidate] = []
    for c in keep:
        if out and abs(c.x - out[-1].x) <= _END_TOL * abs(c.x):
            prev = out[-1]
            if prev.method == "junction":  # prefer a real branch to a junction
                out[-1] = c
            elif c.method != "junction" and c.boundary != prev.boundary:
                # two branches meet here: a triple point
                out[-1] = _Candidate(prev.x, prev.T, prev.p, "triple point", prev.method,
                                     prev.evaluations + c.evaluations)
            continue
        out.append(c)
    return out


def _isotherm_candidates(sub: Substance, T: float, p0: float, p1: float) -> list[_Candidate]:
    out = []
    for b in sub.boundaries:
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
    for b in sub.boundaries:
        if b.T_max < lo or b.T_min > hi:
            continue
        for T, method, n in b.temperatures_at(p):
            out.append(_Candidate(T, T, p, b.label, method, n))
    T_c = sub.critical[0]
    for T in sub.junction_temperatures:
        if lo < T < hi:
            name = "critical isotherm" if T == T_c else "branch junction"
            out.append(_Candidate(T, T, p, name, "junction", 0))
    return out


def cache_clear() -> None:
    """Forget cached leg traces (for benchmarks of cold analysis)."""
    _trace.cache_clear()
