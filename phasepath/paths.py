"""Paths of legs: the states along a curved leg, and the line a route draws on the diagram.

A curved leg (constant v, h or s) is followed through the states the equation of state gives
along its moving coordinate: the pressure of a constant-enthalpy or constant-entropy leg, the
temperature of a constant-volume leg (:func:`trace`). :func:`route_line` turns an analysed
route into the points drawn for it: an isobar or an isotherm straight between its corners and
crossings; a curved leg through its states, with its crossings put in their place, and along the
boundary's own nodes wherever two neighbouring points lie on the same two-phase boundary (so the
drawn line runs along the saturation curve there instead of cutting across it).
"""

from __future__ import annotations

import math
from collections.abc import Callable, Sequence
from typing import TYPE_CHECKING

import numpy as np

from .errors import PhasePathError
from .records import LEG_KINDS, Crossing, LegSummary, StatePoint

if TYPE_CHECKING:  # pragma: no cover
    from .boundaries import Boundary
    from .substances import Substance

__all__ = ["trace", "route_line", "leg_line", "as_arrays"]

_SAMPLES = 24  # states sampled along a curved leg before refining each change of phase
_REL = 1e-12  # relative width of the bracket at which a change of phase is located


def trace(
    state_at: Callable[[float], StatePoint],
    x0: float,
    x1: float,
    geometric: bool,
    first: StatePoint | None = None,
) -> tuple[list[StatePoint], list[tuple[StatePoint, StatePoint, int]]]:
    """Sample a curved leg and locate every change of phase along it.

    ``state_at(x)`` gives the state at the moving coordinate x. Returns the sampled states (for
    drawing) and, for each change of phase, the states just before and just after it, bracketed
    to 1e-12 relative in x by bisection on the phase, with the number of states evaluated.
    ``first`` is the state the leg starts from, where it is known: at a corner on a boundary
    (saturated vapor after "until fully vapor") ``state_at(x0)`` can land on the other side or on
    a mixture with a fraction of 0 or 1, which would add a change of phase that is not there.
    """
    n = _SAMPLES
    if geometric and x0 > 0 and x1 > 0:
        xs = [x0 * (x1 / x0) ** (k / n) for k in range(n + 1)]
    else:
        xs = [x0 + (x1 - x0) * k / n for k in range(n + 1)]
    xs[0], xs[-1] = x0, x1
    states = [first if k == 0 and first is not None else state_at(x) for k, x in enumerate(xs)]
    events: list[tuple[StatePoint, StatePoint, int]] = []
    for k in range(n):
        a, sa, b, sb = xs[k], states[k], xs[k + 1], states[k + 1]
        while sa.key != sb.key:
            lo, slo, hi, shi = a, sa, b, sb
            count = 0
            while abs(hi - lo) > _REL * max(abs(lo), abs(hi)):
                m = 0.5 * (lo + hi)
                sm = state_at(m)
                count += 1
                if sm.key == slo.key:
                    lo, slo = m, sm
                else:
                    hi, shi = m, sm
            events.append((slo, shi, count))
            a, sa = hi, shi
    return states, events


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
    states = list(leg.path)
    if not states:
        return [(leg.start.T, leg.start.p), (leg.end.T, leg.end.p)]
    pts: list[tuple[float, float, _On]] = [(s.T, s.p, _mixtures(s.phase)) for s in states]
    kind = LEG_KINDS[leg.kind]
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
    x = pt[along]
    for k in range(len(pts) - 1):
        a, b = pts[k][along], pts[k + 1][along]
        if _close(x, a):
            pts[k] = (pts[k][0], pts[k][1], pts[k][2] | pt[2])
            return
        if min(a, b) < x < max(a, b):
            pts.insert(k + 1, pt)
            return
    if pts and _close(x, pts[-1][along]):
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
