"""Paths of legs: the line a route draws on the diagram, in each view.

:func:`route_line` turns an analysed route into the points drawn for it: an isobar or an
isotherm straight between its corners and crossings; a curved leg (constant v, h or s) through
states sampled along its moving coordinate for the drawing only (the pressure of a
constant-enthalpy or constant-entropy leg, the temperature of a constant-volume leg), with its
crossings and the states its flags were read from put in their place, and along the boundary's
own nodes wherever two neighbouring points lie on the same two-phase boundary (so the drawn line
runs along the saturation curve there instead of cutting across it). Crossings are never found
here: the analyser finds them by root-finding (:mod:`phasepath.curved`).

:func:`route_path` gives the route's path in any of the three views (P–T, p–h, T–s; see
:mod:`phasepath.views`): on p–h and T–s every leg is followed through its states, an isobar
and an isotherm as well as the curved legs, since an isotherm is a curve on p–h and an isobar
a curve on T–s. A crossing of a straight leg is a jump at constant T and p (the latent heat: a
horizontal stretch across the dome on p–h and T–s), drawn through the states on both sides;
the corners and crossings are points of the path. Where no model gives h or s (a solid
without a property model) the path has a gap (NaN).
"""

from __future__ import annotations

import math
from collections.abc import Callable, Sequence
from typing import TYPE_CHECKING

import numpy as np

from . import states as _states
from .errors import PhasePathError
from .records import LEG_KINDS, Crossing, LegSummary, StatePoint
from .views import AXES, coordinates

if TYPE_CHECKING:  # pragma: no cover
    from .boundaries import Boundary
    from .substances import Substance

__all__ = [
    "route_line",
    "leg_line",
    "as_arrays",
    "DRAW_SAMPLES",
    "route_path",
    "route_states",
    "leg_states",
    "view_arrays",
]

#: States sampled along a curved leg for drawing it (not for finding its crossings).
DRAW_SAMPLES = 24


def _drawn_states(sub: Substance, leg: LegSummary) -> list[StatePoint]:
    """States along a curved leg for the drawing: samples in its moving coordinate (equal ratios
    of pressure, equal steps of temperature) merged with the states the analyser recorded."""
    kind = LEG_KINDS[leg.kind]
    prop = kind.held
    value = _states.held_value(leg.start, prop)
    known = list(leg.path)
    if value is None:
        return known
    sealed = prop == "v"
    x0, x1 = (leg.start.T, leg.end.T) if sealed else (leg.start.p, leg.end.p)
    n = DRAW_SAMPLES
    if not sealed and x0 > 0 and x1 > 0:
        xs = [x0 * (x1 / x0) ** (k / n) for k in range(1, n)]
    else:
        xs = [x0 + (x1 - x0) * k / n for k in range(1, n)]
    drawn = []
    for x in xs:
        try:
            drawn.append(
                _states.flash_Tv(sub, x, value) if sealed else _states.flash_p(sub, x, prop, value)
            )
        except PhasePathError:  # drawing only: a state that cannot be drawn is left out
            continue
    out = known + drawn

    def along(s: StatePoint) -> float:
        x = s.T if sealed else s.p
        return (x - x0) / (x1 - x0) if x1 != x0 else 0.0

    first, last = out[0], known[-1] if known else out[-1]
    middle = sorted((s for s in out if s is not first and s is not last), key=along)
    return [first, *middle, last]


# -- the drawn line -----------------------------------------------------------------------------
_On = frozenset[str]  # the two-phase mixtures a point lies on


def route_line(
    sub: Substance, legs: Sequence[LegSummary], crossings: Sequence[Crossing]
) -> list[tuple[float, float]]:
    """(T [K], p [Pa]) points along the whole route, leg after leg (corners not repeated)."""
    out: list[tuple[float, float]] = []
    by_leg: dict[int, list[Crossing]] = {}
    for c in crossings:
        by_leg.setdefault(c.step, []).append(c)
    for leg in legs:
        pts = leg_line(sub, leg, by_leg.get(leg.step, []))
        if out and pts and _same(out[-1], pts[0]):
            pts = pts[1:]
        out += pts
    return out


def leg_line(
    sub: Substance, leg: LegSummary, crossings: Sequence[Crossing]
) -> list[tuple[float, float]]:
    """The points of one leg (see the module's text)."""
    kind = LEG_KINDS[leg.kind]
    states = _drawn_states(sub, leg) if kind.curved else list(leg.path)
    if not states:
        return [(leg.start.T, leg.start.p), (leg.end.T, leg.end.p)]
    pts: list[tuple[float, float, _On]] = [(s.T, s.p, _mixtures(s.phase)) for s in states]
    if kind.curved:
        along = 0 if kind.held == "v" else 1  # a sealed vessel moves in T, the others in p
        for c in crossings:
            if c.at_corner:
                continue
            _insert(pts, (c.T, c.p, _mixtures(c.from_phase) | _mixtures(c.to_phase)), along)
        pts = _along_boundaries(sub, pts)
    out = [(T, p) for T, p, _ in pts]
    return [pt for k, pt in enumerate(out) if k == 0 or not _same(out[k - 1], pt)]


def _mixtures(phase: str) -> _On:
    return frozenset([phase]) if "+" in phase else frozenset()


def _insert(pts: list[tuple[float, float, _On]], pt: tuple[float, float, _On], along: int) -> None:
    """Put ``pt`` between the two neighbours whose coordinate ``along`` (0: T, 1: p) brackets
    it; a point that matches an existing one only adds what it lies on."""

    def at(q: tuple[float, float, _On]) -> float:
        return q[0] if along == 0 else q[1]

    x = at(pt)
    for k in range(len(pts) - 1):
        a, b = at(pts[k]), at(pts[k + 1])
        if _close(x, a):
            pts[k] = (pts[k][0], pts[k][1], pts[k][2] | pt[2])
            return
        if min(a, b) < x < max(a, b):
            pts.insert(k + 1, pt)
            return
    if pts and _close(x, at(pts[-1])):
        pts[-1] = (pts[-1][0], pts[-1][1], pts[-1][2] | pt[2])


def _along_boundaries(
    sub: Substance, pts: list[tuple[float, float, _On]]
) -> list[tuple[float, float, _On]]:
    out = pts[:1]
    for a, b in zip(pts[:-1], pts[1:], strict=False):
        shared = a[2] & b[2]
        if shared:
            curve = _curve_for(sub, next(iter(shared)), a, b)
            if curve is not None:
                T, p = curve.sample()
                lo, hi = min(a[0], b[0]), max(a[0], b[0])
                inside = (T > lo) & (T < hi)
                Ts, ps = T[inside], p[inside]
                if a[0] > b[0]:
                    Ts, ps = Ts[::-1], ps[::-1]
                out += [(float(t), float(q), shared) for t, q in zip(Ts, ps, strict=True)]
        out.append(b)
    return out


def _curve_for(
    sub: Substance, mixture: str, a: tuple[float, float, _On], b: tuple[float, float, _On]
) -> Boundary | None:
    """The boundary a two-phase mixture lies on, if both points lie on it (within 1e-3 in p)."""
    if mixture == "liquid+vapor":
        candidates = [sub.vapor]
    elif mixture == "solid+vapor":
        candidates = [sub.sublimation]
    else:
        candidates = list(sub.melting)
    for curve in candidates:
        if curve is None:
            continue
        if not all(curve.T_min <= pt[0] <= curve.T_max for pt in (a, b)):
            continue
        try:
            if all(math.isclose(curve.p_of_T(pt[0]), pt[1], rel_tol=1e-3) for pt in (a, b)):
                return curve
        except PhasePathError:  # drawing only: a curve that refuses is simply not followed
            continue
    return None


def _close(x: float, y: float) -> bool:
    return math.isclose(x, y, rel_tol=1e-9)


def _same(a: tuple[float, float], b: tuple[float, float]) -> bool:
    return _close(a[0], b[0]) and _close(a[1], b[1])


def as_arrays(points: Sequence[tuple[float, float]]) -> tuple[np.ndarray, np.ndarray]:
    """The points as (T, p) float arrays."""
    if not points:
        return np.array([], dtype=float), np.array([], dtype=float)
    arr = np.asarray(points, dtype=float)
    return arr[:, 0], arr[:, 1]


# -- the path in every view -----------------------------------------------------------------------
_STRAIGHT_SAMPLES = 8  # states along each stretch of one phase of a straight leg, before refining
_REFINE_DEPTH = 5  # halvings of a stretch where the path bends away from its chord
_BEND = 2e-3  # the chord tolerance, as a fraction of the leg's extent in each view's axes


def route_path(
    sub: Substance, legs: Sequence[LegSummary], crossings: Sequence[Crossing], view: str
) -> tuple[np.ndarray, np.ndarray]:
    """The route's path in ``view`` as SI arrays ``(x, y)``: "pT" (T, p), "ph" (h, p),
    "Ts" (s, T); NaN marks a gap where no model gives h or s."""
    if view not in AXES:
        raise PhasePathError(f"unknown view {view!r}; the views are {', '.join(AXES)}")
    if view == "pT":
        return as_arrays(route_line(sub, legs, crossings))
    return view_arrays(route_states(sub, legs, crossings), view)


def view_arrays(points: Sequence[StatePoint], view: str) -> tuple[np.ndarray, np.ndarray]:
    """(x, y) float arrays of states in a view, NaN where a state has no h or s."""
    xy = [coordinates(st, view) or (math.nan, math.nan) for st in points]
    if not xy:
        return np.array([], dtype=float), np.array([], dtype=float)
    arr = np.asarray(xy, dtype=float)
    return arr[:, 0], arr[:, 1]


def route_states(
    sub: Substance, legs: Sequence[LegSummary], crossings: Sequence[Crossing]
) -> list[StatePoint]:
    """The states along the whole route, leg after leg (a corner shared by two legs once)."""
    by_leg: dict[int, list[Crossing]] = {}
    for c in crossings:
        by_leg.setdefault(c.step, []).append(c)
    out: list[StatePoint] = []
    for leg in legs:
        pts = leg_states(sub, leg, by_leg.get(leg.step, []))
        if out and pts and _same_state(out[-1], pts[0]):
            pts = pts[1:]
        out += pts
    return out


def leg_states(sub: Substance, leg: LegSummary, crossings: Sequence[Crossing]) -> list[StatePoint]:
    """The states along one leg, its start and end states first and last, every crossing's
    states on both sides in between."""
    kind = LEG_KINDS[leg.kind]
    if kind.curved:
        pts = _curved_states(sub, leg, crossings)
    else:
        pts = _straight_states(sub, leg)
    if not pts or not _same_state(pts[0], leg.start):
        pts.insert(0, leg.start)
    if not _same_state(pts[-1], leg.end):
        pts.append(leg.end)
    return [st for k, st in enumerate(pts) if k == 0 or not _same_state(pts[k - 1], st)]


def _curved_states(
    sub: Substance, leg: LegSummary, crossings: Sequence[Crossing]
) -> list[StatePoint]:
    """The drawn states of a curved leg, with the state at each crossing put in its place
    (h, s and v are continuous along such a leg: one state per crossing)."""
    # the analyser's marks at crossings carry only (T, p, phase); the crossings' full states are
    # put in below
    pts = [s for s in _drawn_states(sub, leg) if s.h is not None]
    held = LEG_KINDS[leg.kind].held
    along = 0 if held == "v" else 1
    for c in crossings:
        if c.at_corner:
            continue
        try:
            if held == "v":
                if leg.start.rho is None:
                    continue
                st = _states.flash_Tv(sub, c.T, 1.0 / leg.start.rho)
            else:
                value = leg.start.h if held == "h" else leg.start.s
                if value is None:
                    continue
                st = _states.flash_p(sub, c.p, held, value)
        except PhasePathError:  # drawing only: the crossing's state is left out
            continue
        x = (c.T, c.p)[along]
        for k in range(len(pts) - 1):
            a, b = (pts[k].T, pts[k].p)[along], (pts[k + 1].T, pts[k + 1].p)[along]
            if min(a, b) < x < max(a, b):
                pts.insert(k + 1, st)
                break
    return pts


def _straight_states(sub: Substance, leg: LegSummary) -> list[StatePoint]:
    """States along an isobar or an isotherm: each stretch of one phase between the corners and
    crossings (``leg.path``) sampled in its own phase, refined where it bends."""
    marks = list(leg.path)
    if len(marks) < 2:
        return []
    isobar = leg.kind == "isobar"
    out: list[StatePoint] = []
    for a, b in zip(marks[:-1], marks[1:], strict=False):
        x0, x1 = (a.T, b.T) if isobar else (a.p, b.p)

        def state(x: float, a: StatePoint = a) -> StatePoint:
            T, p = (x, a.p) if isobar else (a.T, x)
            return _states.single_state(sub, T, p, a.phase, a.form)

        out += _stretch(state, x0, x1, geometric=not isobar)
    return out


def _stretch(
    state: Callable[[float], StatePoint], x0: float, x1: float, geometric: bool
) -> list[StatePoint]:
    n = _STRAIGHT_SAMPLES
    if geometric and x0 > 0 and x1 > 0:
        xs = [x0 * (x1 / x0) ** (k / n) for k in range(n + 1)]
    else:
        xs = [x0 + (x1 - x0) * k / n for k in range(n + 1)]
    xs[0], xs[-1] = x0, x1
    pts = [state(x) for x in xs]
    scale = _extent(pts)
    out = [pts[0]]
    for k in range(n):
        out += _refine(state, xs[k], xs[k + 1], pts[k], pts[k + 1], scale, geometric, 0)
    return out


def _refine(
    state: Callable[[float], StatePoint],
    xa: float,
    xb: float,
    sa: StatePoint,
    sb: StatePoint,
    scale: tuple[float, ...],
    geometric: bool,
    depth: int,
) -> list[StatePoint]:
    """The states after ``sa`` up to ``sb``, halving the step where the midpoint lies off the
    chord by more than :data:`_BEND` of the leg's extent on p–h or T–s."""
    if depth >= _REFINE_DEPTH:
        return [sb]
    xm = math.sqrt(xa * xb) if geometric and xa > 0 and xb > 0 else 0.5 * (xa + xb)
    sm = state(xm)
    if not _bends(sa, sm, sb, scale):
        return [sb]
    return _refine(state, xa, xm, sa, sm, scale, geometric, depth + 1) + _refine(
        state, xm, xb, sm, sb, scale, geometric, depth + 1
    )


def _axes(st: StatePoint) -> tuple[float, ...] | None:
    """The coordinates a path is refined in: h, ln p, s, T."""
    if st.h is None or st.s is None or not st.p > 0:
        return None
    return st.h, math.log(st.p), st.s, st.T


def _extent(pts: Sequence[StatePoint]) -> tuple[float, ...]:
    coords = [c for c in (_axes(s) for s in pts) if c is not None]
    if not coords:
        return (1.0, 1.0, 1.0, 1.0)
    arr = np.asarray(coords)
    span = arr.max(axis=0) - arr.min(axis=0)
    return tuple(float(v) if v > 0 else 1.0 for v in span)


def _bends(a: StatePoint, m: StatePoint, b: StatePoint, scale: tuple[float, ...]) -> bool:
    ca, cm, cb = _axes(a), _axes(m), _axes(b)
    if ca is None or cm is None or cb is None:
        return False
    for i, j in ((0, 1), (2, 3)):  # the p–h and the T–s views
        ax, ay = ca[i] / scale[i], ca[j] / scale[j]
        bx, by = cb[i] / scale[i], cb[j] / scale[j]
        mx, my = cm[i] / scale[i], cm[j] / scale[j]
        dx, dy = bx - ax, by - ay
        length = math.hypot(dx, dy)
        off = (
            math.hypot(mx - ax, my - ay)
            if length == 0.0
            else abs(dx * (my - ay) - dy * (mx - ax)) / length
        )
        if off > _BEND:
            return True
    return False


def _same_state(a: StatePoint, b: StatePoint) -> bool:
    if not (_close(a.T, b.T) and _close(a.p, b.p)):
        return False
    if a.h is None or b.h is None:
        return a.key == b.key
    return math.isclose(a.h, b.h, rel_tol=1e-9, abs_tol=1e-6)
