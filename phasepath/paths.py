"""Paths of legs: the line a route draws on the diagram.

:func:`route_line` turns an analysed route into the points drawn for it: an isobar or an
isotherm straight between its corners and crossings; a curved leg (constant v, h or s) through
states sampled along its moving coordinate for the drawing only (the pressure of a
constant-enthalpy or constant-entropy leg, the temperature of a constant-volume leg), with its
crossings and the states its flags were read from put in their place, and along the boundary's
own nodes wherever two neighbouring points lie on the same two-phase boundary (so the drawn line
runs along the saturation curve there instead of cutting across it). Crossings are never found
here: the analyser finds them by root-finding (:mod:`phasepath.curved`).
"""

from __future__ import annotations

import math
from collections.abc import Sequence
from typing import TYPE_CHECKING

import numpy as np

from . import states as st
from .errors import PhasePathError
from .records import LEG_KINDS, Crossing, LegSummary, StatePoint

if TYPE_CHECKING:  # pragma: no cover
    from .boundaries import Boundary
    from .substances import Substance

__all__ = ["route_line", "leg_line", "as_arrays", "DRAW_SAMPLES"]

#: States sampled along a curved leg for drawing it (not for finding its crossings).
DRAW_SAMPLES = 24


def _drawn_states(sub: Substance, leg: LegSummary) -> list[StatePoint]:
    """States along a curved leg for the drawing: samples in its moving coordinate (equal ratios
    of pressure, equal steps of temperature) merged with the states the analyser recorded."""
    kind = LEG_KINDS[leg.kind]
    prop = kind.held
    value = st.held_value(leg.start, prop)
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
            drawn.append(st.flash_Tv(sub, x, value) if sealed else st.flash_p(sub, x, prop, value))
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
    x = float(pt[along])  # type: ignore[arg-type]
    for k in range(len(pts) - 1):
        a, b = float(pts[k][along]), float(pts[k + 1][along])  # type: ignore[arg-type]
        if _close(x, a):
            pts[k] = (pts[k][0], pts[k][1], pts[k][2] | pt[2])
            return
        if min(a, b) < x < max(a, b):
            pts.insert(k + 1, pt)
            return
    if pts and _close(x, float(pts[-1][along])):  # type: ignore[arg-type]
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
