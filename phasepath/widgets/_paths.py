"""The line the planner draws for an analysed route: every leg along its true path.

The core samples each leg (``LegSummary.path``): an isobar or an isotherm holds its corners and
crossings (a straight line on the diagram between them); a constant-volume, -enthalpy or -entropy
leg holds states found from the equation of state. Here the crossings of a curved leg are put in
their place along it, and wherever two neighbouring points both lie on the same two-phase
boundary (a mixture: "liquid+vapor", "solid+vapor", "solid+liquid") the boundary's own cached
nodes between them are added, so the drawn line runs along the saturation curve there instead of
cutting across it. This module imports no widget library.

>>> import phasepath as pp
>>> rep = pp.Route("CO2", T="20 degC", p="60 bar").isenthalp(p="10 bar").analyze()
>>> pts = route_path(rep)
>>> pts[0] == rep.route.corners()[0] and pts[-1] == rep.route.corners()[-1]
True
"""

from __future__ import annotations

import math
from typing import TYPE_CHECKING

import numpy as np

if TYPE_CHECKING:  # pragma: no cover
    from ..boundaries import Boundary
    from ..report import Report
    from ..substances import Substance

__all__ = ["route_path", "leg_path"]

_CURVED = ("isochore", "isenthalp", "isentrope")
_On = frozenset[str]  # the two-phase mixtures a point lies on


def route_path(report: Report) -> list[tuple[float, float]]:
    """(T [K], p [Pa]) points along the whole route, leg after leg (corners not repeated)."""
    out: list[tuple[float, float]] = []
    by_leg: dict[int, list] = {}
    for c in report.crossings:
        by_leg.setdefault(c.step, []).append(c)
    for leg in report.legs:
        pts = leg_path(report.substance, leg, by_leg.get(leg.step, []))
        if out and pts and _same(out[-1], pts[0]):
            pts = pts[1:]
        out += pts
    return out


def leg_path(sub: Substance, leg: object, crossings: list) -> list[tuple[float, float]]:
    """The points of one leg (see the module's text)."""
    states = list(getattr(leg, "path", ()) or ())
    if not states:
        start, end = leg.start, leg.end  # type: ignore[attr-defined]
        return [(start.T, start.p), (end.T, end.p)]
    pts: list[tuple[float, float, _On]] = [(s.T, s.p, _mixtures(s.phase)) for s in states]
    if leg.kind in _CURVED:  # type: ignore[attr-defined]
        along = 0 if leg.kind == "isochore" else 1  # type: ignore[attr-defined]
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
        except Exception:  # drawing only: a refusing curve is simply not followed
            continue
    return None


def _close(x: float, y: float) -> bool:
    return math.isclose(x, y, rel_tol=1e-9)


def _same(a: tuple[float, float], b: tuple[float, float]) -> bool:
    return _close(a[0], b[0]) and _close(a[1], b[1])


def as_arrays(points: list[tuple[float, float]]) -> tuple[np.ndarray, np.ndarray]:
    """The points as (T, p) float arrays."""
    if not points:
        return np.array([], dtype=float), np.array([], dtype=float)
    arr = np.asarray(points, dtype=float)
    return arr[:, 0], arr[:, 1]
