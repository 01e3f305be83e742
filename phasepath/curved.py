"""Crossings of curved legs (constant v, h or s) by root-finding on the boundary functions.

A curved leg holds one property c fixed and moves along one coordinate x: the pressure of a
constant-enthalpy or constant-entropy leg (a valve, a compressor), the temperature of a
constant-volume leg (a sealed vessel). Its state changes phase exactly where c equals the held
property of one phase along one boundary: the state is liquid + vapor where h'(p) < h < h''(p)
(s likewise), where v'(T) < v < v''(T) on a sealed vessel; solid + fluid between the solid's and
the fluid's values along the melting and sublimation curves; and it changes between liquid and
supercritical where c equals its value on the critical isotherm (above the critical pressure),
between vapor and supercritical on the critical isobar (above the critical temperature).

Each of these *boundary functions* g(t), with t the temperature along the boundary (the
pressure on the critical isotherm), is sampled once per substance and held property (cached),
split into pieces at its extrema and at those of the leg's coordinate x(t) (each located by the
root finder on the slope), so that on each piece both g and x are monotone: a piece holds at
most one root of g(t) = c. For a leg, every piece that overlaps the leg's range of x is cut to
it; where g - c changes sign between the ends, :func:`phasepath.rootfind.find_root` finds the
root from a guess interpolated in the piece's nodes. Where it does not, there is no root: the
piece is monotone. Nothing is found by sampling the leg.

Guarantee: every crossing of a constant-h, -s or -v leg with a boundary is found, and its
pressure (its temperature on a constant-volume leg) is that of the exact crossing of the
equations to 1e-9 relative (the root is taken where the boundary function equals the held value
within 8 units in its last place, or where the bracket in t has shrunk to four of them). The
points where boundaries end or meet (the triple and critical points, the ends of water's ice
branches, the ends of a model's range) are candidates too, where the leg's state there is on a
boundary. The phase between neighbouring candidates is that of the state at their
midpoint (:mod:`phasepath.states`), so a crossing is never reported without a change of phase.
The samples of a boundary function serve the guesses and the splitting only; a sample spacing
can hide two extrema closer than one spacing (96 nodes per branch), which no boundary of the
reference fluids has.
"""

from __future__ import annotations

import math
from collections.abc import Callable
from dataclasses import dataclass, field
from functools import lru_cache
from typing import TYPE_CHECKING

import numpy as np

from . import states
from .errors import NoModelError, PhasePathError
from .models import phase_state
from .records import StatePoint
from .rootfind import find_root

if TYPE_CHECKING:  # pragma: no cover
    from .substances import Substance

__all__ = [
    "Sheet",
    "Piece",
    "sheets",
    "candidates",
    "state_at",
    "key_at",
    "turning_point",
    "NODES",
]

#: Nodes per boundary function (before the pieces are split at its extrema).
NODES = 96
_ROOT_ULPS = 8.0  # a root is taken where g equals c within this many units in the last place
_INDEX = {"h": 0, "s": 1, "v": 2}
_EPS = 2.220446049250313e-16


@dataclass(eq=False)
class Sheet:
    """One boundary function: the held property of one phase along one boundary.

    ``g(t)`` is the held property, ``x(t)`` the leg's coordinate and ``Tp(t)`` the state
    (T [K], p [Pa]) at the parameter t in ``[lo, hi]``; ``inverse(x)`` gives t at x where the
    boundary has a direct inverse. ``label`` names the boundary in the crossing record.
    """

    label: str
    lo: float
    hi: float
    g: Callable[[float], float] = field(repr=False)
    x: Callable[[float], float] = field(repr=False)
    Tp: Callable[[float], tuple[float, float]] = field(repr=False)
    inverse: Callable[[float], float] | None = field(default=None, repr=False)
    dense_high: bool = False  # nodes denser toward hi (the critical point of the dome)
    prefetch: Callable[[list[float]], None] | None = field(default=None, repr=False)
    _pieces: list[Piece] | None = field(default=None, init=False, repr=False)

    def pieces(self) -> list[Piece]:
        """The monotone pieces (computed once)."""
        if self._pieces is None:
            self._pieces = _split(self)
        return self._pieces


@dataclass(frozen=True)
class Piece:
    """A stretch of a sheet on which g(t) and x(t) are both monotone; nodes in rising t."""

    sheet: Sheet
    t: tuple[float, ...]
    x: tuple[float, ...]
    g: tuple[float, ...]

    @property
    def x_range(self) -> tuple[float, float]:
        return min(self.x[0], self.x[-1]), max(self.x[0], self.x[-1])


# -- the boundary functions of a substance -------------------------------------------------------
@lru_cache(maxsize=256)
def sheets(sub: Substance, prop: str) -> tuple[tuple[Sheet, ...], tuple[tuple[float, bool], ...]]:
    """The boundary functions of ``prop`` ("h", "s" or "v") of a substance, and the fixed
    points of the leg's coordinate where boundaries end or meet (cached per substance), each
    marked True where it ends a model's range and is always a candidate."""
    return _x_p_sheets(sub, prop) if prop in ("h", "s") else _x_T_sheets(sub)


def _held(state: StatePoint, prop: str) -> float:
    value = states.held_value(state, prop)
    if value is None:  # pragma: no cover - phase_state returns modelled states only
        raise NoModelError(state.model)
    return value


def _model(sub: Substance, T: float, p: float, phase: str, form: str | None, prop: str) -> float:
    return _held(phase_state(sub, T, p, phase, form), prop)


def _x_p_sheets(
    sub: Substance, prop: str
) -> tuple[tuple[Sheet, ...], tuple[tuple[float, bool], ...]]:
    """Boundary functions along the pressure (constant-h and constant-s legs)."""
    T_t, p_t = sub.triple
    T_c, p_c = sub.critical
    i = _INDEX[prop]
    out: list[Sheet] = []
    fixed = {p_t, p_c}
    always: set[float] = set()  # ends of a model's range: the stretch beyond is always cut off
    vap = sub.vapor
    if vap is not None:

        def Tp_sat(T: float) -> tuple[float, float]:
            return T, vap.p_of_T(T)

        for side in (0, 1):  # saturated liquid, saturated vapor

            def g_sat(T: float, side: int = side) -> float:
                return float(sub.fluid.saturated(T)[side][i])

            out.append(
                Sheet("vapor pressure", T_t, T_c, g_sat, vap.p_of_T, Tp_sat, vap.T_of_p, True)
            )
        out += _strip_sheets(sub, prop, x_is_p=True)
        if sub.in_solid_strip(T_t):
            fixed.add(vap.p_of_T(sub.liquid_from))
    p_top = _critical_isotherm_top(sub)
    if p_top > p_c:

        def g_ci(p: float) -> float:
            if p > p_c:
                try:  # unique phase there: no phase imposed, the density converged tightly
                    h, s, rho = sub.fluid.state_unimposed(T_c, p)
                    return {"h": h, "s": s}[prop]
                except PhasePathError:
                    pass
            return _model(sub, T_c, p, "supercritical", None, prop)

        out.append(Sheet("critical isotherm", p_c, p_top, g_ci, _same, lambda p: (T_c, p)))
        always.add(p_top)
    for b in sub.melting:
        lo, hi = _melting_span(sub, b)
        fixed.add(b.p_of_T(lo))
        always.add(b.p_of_T(hi))
        out += _curve_sheets(sub, prop, b, lo, hi, x_is_p=True)
    out += _gap_sheets(sub, prop, fixed)
    if sub.sublimation is not None:
        b = sub.sublimation
        always.add(b.p_of_T(b.T_min))
        out += _curve_sheets(sub, prop, b, b.T_min, b.T_max, x_is_p=True)
    return tuple(out), _marked(fixed, always)


def _x_T_sheets(sub: Substance) -> tuple[tuple[Sheet, ...], tuple[tuple[float, bool], ...]]:
    """Boundary functions along the temperature (constant-volume legs)."""
    T_t, _ = sub.triple
    T_c, p_c = sub.critical
    out: list[Sheet] = []
    fixed = set(sub.junction_temperatures)
    always: set[float] = {sub.T_max}
    vap = sub.vapor
    if vap is not None:

        def Tp_sat(T: float) -> tuple[float, float]:
            return T, vap.p_of_T(T)

        for side in (0, 1):

            def g_sat(T: float, side: int = side) -> float:
                return 1.0 / float(sub.fluid.saturated(T)[side][2])

            out.append(Sheet("vapor pressure", T_t, T_c, g_sat, _same, Tp_sat, None, True))
        out += _strip_sheets(sub, "v", x_is_p=False)
        if sub.in_solid_strip(T_t):
            fixed.add(sub.liquid_from)

    def g_cb(T: float) -> float:
        return _model(sub, T, p_c, "supercritical", None, "v")

    out.append(Sheet("critical isobar", T_c, sub.T_max, g_cb, _same, lambda T: (T, p_c)))
    for b in sub.melting:
        lo, hi = _melting_span(sub, b)
        fixed.add(lo)
        always.add(hi)
        out += _curve_sheets(sub, "v", b, lo, hi, x_is_p=False)
    if sub.sublimation is not None:
        b = sub.sublimation
        always.add(b.T_min)
        out += _curve_sheets(sub, "v", b, b.T_min, b.T_max, x_is_p=False)
    return tuple(out), _marked(fixed, always)


def _marked(fixed: set[float], always: set[float]) -> tuple[tuple[float, bool], ...]:
    """The fixed points in rising order, each marked True where it is always a candidate."""
    return tuple(sorted({(x, x in always) for x in fixed | always}))


def _same(t: float) -> float:
    return t


def _critical_isotherm_top(sub: Substance) -> float:
    """Highest pressure of the critical isotherm: the melting curve there, or the models' top."""
    T_c = sub.critical[0]
    top = sub.p_max
    for b in sub.melting:
        if b.solid_side == "above" and b.T_min <= T_c <= b.T_max:
            top = min(top, b.p_of_T(T_c))
    return top


def _melting_span(sub: Substance, b: object) -> tuple[float, float]:
    """The temperatures where a melting branch divides solid from fluid within the models: from
    where liquid exists (above a gap next to the triple point) to where it leaves p_max."""
    from .boundaries import Boundary

    assert isinstance(b, Boundary)
    lo = b.T_min
    if b.solid_side == "above" and b.T_min <= sub.liquid_from <= b.T_max:
        lo = max(b.T_min, sub.liquid_from)  # the branch at the triple point, past its gap
    return lo, _top_T(b, sub.p_max)


def _top_T(b: object, p_max: float) -> float:
    """Highest temperature of a branch whose pressure stays within the models (p <= p_max)."""
    from .boundaries import Boundary

    assert isinstance(b, Boundary)
    if b.p_of_T(b.T_max) <= p_max or b.p_of_T(b.T_min) > p_max:
        return b.T_max
    return find_root(lambda T: b.p_of_T(T) - p_max, b.T_min, b.T_max, what="p_max on a curve").root


def _curve_sheets(
    sub: Substance, prop: str, b: object, lo: float, hi: float, x_is_p: bool
) -> list[Sheet]:
    """Both sides of one melting or sublimation branch: the fluid's and the solid's values."""
    from .boundaries import Boundary

    assert isinstance(b, Boundary)
    sublimation = b.kind == "sublimation"

    def Tp(T: float) -> tuple[float, float]:
        return T, b.p_of_T(T)

    def fluid_key(T: float) -> str:
        return "vapor" if sublimation else states.melt_fluid(sub, T)

    def g_fluid(T: float) -> float:
        return _model(sub, T, b.p_of_T(T), fluid_key(T), None, prop)

    def g_solid(T: float) -> float:
        p = b.p_of_T(T)
        return _model(sub, T, p, "solid", sub.form_of_solid(T, p, b.solid_form), prop)

    def prefetch(ts: list[float]) -> None:
        ps = [b.p_of_T(T) for T in ts]
        forms = [sub.form_of_solid(T, p, b.solid_form) for T, p in zip(ts, ps, strict=True)]
        sub.solids.prefetch(ts, ps, forms)

    x = b.p_of_T if x_is_p else _same
    inverse = None if not x_is_p else _branch_inverse(b)
    return [
        Sheet(b.label, lo, hi, g_fluid, x, Tp, inverse),
        Sheet(b.label, lo, hi, g_solid, x, Tp, inverse, prefetch=prefetch),
    ]


def _branch_inverse(b: object) -> Callable[[float], float] | None:
    from .boundaries import Boundary

    assert isinstance(b, Boundary)
    return b.T_of_p


def _strip_sheets(sub: Substance, prop: str, x_is_p: bool) -> list[Sheet]:
    """Where no liquid exists next to the triple point, the solid's value on the vapor curve."""
    T_t = sub.triple[0]
    vap = sub.vapor
    start = sub.melting_start
    if vap is None or start is None or not sub.in_solid_strip(T_t):
        return []
    form = start[2]

    def g(T: float) -> float:
        p = vap.p_of_T(T)
        return _model(sub, T, p, "solid", sub.form_of_solid(T, p, form), prop)

    def Tp(T: float) -> tuple[float, float]:
        return T, vap.p_of_T(T)

    x = vap.p_of_T if x_is_p else _same
    return [Sheet("vapor pressure", T_t, sub.liquid_from, g, x, Tp, vap.T_of_p if x_is_p else None)]


def _gap_sheets(sub: Substance, prop: str, fixed: set[float]) -> list[Sheet]:
    """The triple-point isotherm below a melting curve that starts above the triple point."""
    start = sub.melting_start
    T_t, p_t = sub.triple
    if start is None or start[0] != T_t or start[1] <= p_t:
        return []
    T0, p0, form = start
    fixed.add(p0)
    label = next((b.label for b in sub.melting if b.T_min == T0 or b.T_max == T0), "melting")

    def g_fluid(p: float) -> float:
        return _model(sub, T0, p, "liquid", None, prop)

    def g_solid(p: float) -> float:
        return _model(sub, T0, p, "solid", sub.form_of_solid(T0, p, form), prop)

    def Tp(p: float) -> tuple[float, float]:
        return T0, p

    return [Sheet(label, p_t, p0, g_fluid, _same, Tp), Sheet(label, p_t, p0, g_solid, _same, Tp)]


# -- splitting a sheet into monotone pieces (once) ----------------------------------------------
def _nodes(sheet: Sheet) -> np.ndarray:
    u = np.linspace(0.0, 1.0, NODES)
    if sheet.dense_high:
        u = 1.0 - (1.0 - u) ** 2
    t = sheet.lo + u * (sheet.hi - sheet.lo)
    t[0], t[-1] = sheet.lo, sheet.hi
    return t


def _evaluate(sheet: Sheet, t: float) -> tuple[float, float] | None:
    try:
        g, x = sheet.g(t), sheet.x(t)
    except PhasePathError:
        return None
    return (g, x) if math.isfinite(g) and math.isfinite(x) else None


def _split(sheet: Sheet) -> list[Piece]:
    """Sample the sheet, keep the stretches a model covers, split them at the extrema."""
    ts = _nodes(sheet)
    if sheet.prefetch is not None:
        try:
            sheet.prefetch(ts.tolist())
        except PhasePathError:  # a speed-up only: the nodes are evaluated one by one below
            pass
    values = [_evaluate(sheet, float(t)) for t in ts]
    pieces: list[Piece] = []
    run: list[tuple[float, float, float]] = []
    for t, v in zip(ts.tolist(), values, strict=True):
        if v is None:
            pieces += _monotone(sheet, run)
            run = []
        else:
            run.append((t, v[1], v[0]))
    pieces += _monotone(sheet, run)
    return pieces


def _monotone(sheet: Sheet, run: list[tuple[float, float, float]]) -> list[Piece]:
    """Split one covered stretch of nodes (t, x, g) at the extrema of x and of g, each located
    by the root finder on the slope between the nodes either side of it."""
    if len(run) < 2:
        return []
    nodes = list(run)
    cuts = []
    for k in range(1, len(nodes) - 1):
        for j in (1, 2):  # x, then g
            if (nodes[k][j] - nodes[k - 1][j]) * (nodes[k + 1][j] - nodes[k][j]) < 0.0:
                t_e = _extremum(sheet, j, nodes[k - 1][0], nodes[k + 1][0], nodes[k][0])
                v = _evaluate(sheet, t_e)
                if v is not None:
                    nodes[k] = (t_e, v[1], v[0])
                cuts.append(k)
                break
    out = []
    start = 0
    for k in cuts:
        out.append(_piece(sheet, nodes[start : k + 1]))
        start = k
    out.append(_piece(sheet, nodes[start:]))
    return [p for p in out if len(p.t) >= 2]


def _piece(sheet: Sheet, nodes: list[tuple[float, float, float]]) -> Piece:
    t, x, g = zip(*nodes, strict=True)
    return Piece(sheet, tuple(t), tuple(x), tuple(g))


def _extremum(sheet: Sheet, j: int, a: float, b: float, mid: float) -> float:
    """The parameter of the extremum of x (j = 1) or g (j = 2) between a and b: the root of
    its slope (central differences), or the middle node where the slope will not bracket."""
    f = sheet.x if j == 1 else sheet.g
    h = 1e-7 * max(abs(a), abs(b), 1.0)

    def slope(t: float) -> float:
        return (f(t + h) - f(t - h)) / (2 * h)

    try:
        lo, hi = a + 2 * h, b - 2 * h
        return find_root(slope, lo, hi, what="an extremum of a boundary function").root
    except PhasePathError:
        return mid


# -- a leg --------------------------------------------------------------------------------------
def candidates(
    sub: Substance, prop: str, value: float, x0: float, x1: float
) -> list[tuple[float, float, float, str, str, int]]:
    """Every point of the leg from x0 to x1 where the held ``value`` of ``prop`` meets a
    boundary function, and the fixed points inside it: (x, T, p, boundary, method, evaluations)
    tuples, not sorted. x is the pressure [Pa] for "h" and "s", the temperature [K] for "v"."""
    lo, hi = min(x0, x1), max(x0, x1)
    found = []
    all_sheets, fixed = sheets(sub, prop)
    for sheet in all_sheets:
        if sheet.x(sheet.lo) > hi and sheet.x(sheet.hi) > hi:
            continue
        for piece in sheet.pieces():
            px_lo, px_hi = piece.x_range
            if px_hi < lo or px_lo > hi:
                continue
            g_a, g_b = piece.g[0], piece.g[-1]
            if value < min(g_a, g_b) or value > max(g_a, g_b):
                continue  # monotone: no stretch of this piece reaches the value
            r = _root(piece, value, max(lo, px_lo), min(hi, px_hi))
            if r is not None:
                found.append(r)
    for x, always in fixed:
        if lo < x < hi and (always or _matters(sub, prop, x, value)):
            found.append((x, math.nan, math.nan, "junction", "junction", 0))
    return found


def _matters(sub: Substance, prop: str, x: float, value: float) -> bool:
    """Whether the phase can change at a fixed point x for a leg holding ``value``: only where
    the state there is a mixture on a boundary (both sides of x: the values between the two
    phases of each boundary met there), or across the critical isobar (isotherm on a sealed
    vessel) on the supercritical side."""
    lo, hi = _window(sub, prop, x)
    slack = 1e-9 * max(abs(value), abs(lo) if math.isfinite(lo) else 0.0, 1e-300)
    return lo - slack <= value <= hi + slack


@lru_cache(maxsize=4096)
def _window(sub: Substance, prop: str, x: float) -> tuple[float, float]:
    """The range of held values for which the phase can change at the fixed point x (cached)."""
    T_c, p_c = sub.critical
    lo, hi = math.inf, -math.inf
    for y in (x * (1 - 1e-9), x * (1 + 1e-9)):
        try:
            layers = states.layers_at_T(sub, y) if prop == "v" else states.layers_at_p(sub, y)
            for layer in layers:
                for side in (layer.below, layer.above):
                    T, p = (y, layer.p) if prop == "v" else (layer.T, y)
                    v = _held(_side_state(sub, T, p, side), prop)
                    lo, hi = min(lo, v), max(hi, v)
        except PhasePathError:
            return -math.inf, math.inf  # a model ends here: always a candidate
    if prop == "v" and x == T_c:
        lo = -math.inf  # denser than critical: liquid below T_c, supercritical above
    elif prop != "v" and x == p_c:
        hi = math.inf  # hotter than critical: vapor below p_c, supercritical above
        lo = min(lo, _model(sub, T_c, p_c, "supercritical", None, prop))
    return lo, hi


def _side_state(sub: Substance, T: float, p: float, side: tuple[str, str | None]) -> StatePoint:
    if side[0] in ("liquid", "vapor") and sub.vapor is not None and T <= sub.critical[0]:
        try:
            if math.isclose(sub.vapor.p_of_T(T), p, rel_tol=1e-6):
                (hl, sl, rl), (hv, sv, rv) = sub.fluid.saturated(T)
                h, s_, r = (hl, sl, rl) if side[0] == "liquid" else (hv, sv, rv)
                return StatePoint(T, p, side[0], h=h, s=s_, rho=r)
        except PhasePathError:
            pass
    return phase_state(sub, T, p, *side)


def _root(
    piece: Piece, c: float, a: float, b: float
) -> tuple[float, float, float, str, str, int] | None:
    """The root of g(t) = c on the piece between the leg coordinates a <= x <= b, if any."""
    sheet = piece.sheet
    ts = piece.t
    xs, gs = piece.x, piece.g
    rising_x = xs[-1] > xs[0]
    evals = 0
    ends = []
    for x_end in (a, b):
        if x_end == xs[0]:
            ends.append((ts[0], gs[0]))
        elif x_end == xs[-1]:
            ends.append((ts[-1], gs[-1]))
        else:
            t = _t_at(piece, x_end, rising_x)
            ends.append((t, sheet.g(t)))
            evals += 2
    (ta, ga), (tb, gb) = ends
    fa, fb = ga - c, gb - c
    if fa * fb > 0.0:
        return None
    lo_t, hi_t = (ta, tb) if ta < tb else (tb, ta)
    f_lo, f_hi = (fa, fb) if ta < tb else (fb, fa)
    guess, slope = _guess(piece, c, lo_t, hi_t)
    r = states.root(
        lambda t: sheet.g(t) - c,
        lo_t,
        hi_t,
        f_lo=f_lo,
        f_hi=f_hi,
        guess=guess,
        slope=slope,
        ftol=_ROOT_ULPS * _EPS * abs(c),
        what=f"the {sheet.label} crossing",
    )
    T, p = sheet.Tp(r.root)
    return sheet.x(r.root), T, p, sheet.label, "root", evals + r.evaluations + 1


def _t_at(piece: Piece, x: float, rising: bool) -> float:
    """The parameter where the piece's coordinate is x (monotone on the piece)."""
    sheet = piece.sheet
    if sheet.x is _same:
        return x
    if sheet.inverse is not None:
        try:
            t = sheet.inverse(x)
            if piece.t[0] <= t <= piece.t[-1]:
                return t
        except PhasePathError:
            pass
    xs = piece.x if rising else piece.x[::-1]
    ts = piece.t if rising else piece.t[::-1]
    guess = float(np.interp(x, xs, ts))
    return find_root(
        lambda t: sheet.x(t) - x,
        piece.t[0],
        piece.t[-1],
        guess=guess,
        slope=(piece.x[-1] - piece.x[0]) / (piece.t[-1] - piece.t[0]),
        ftol=1e-13 * abs(x),
        what=f"the {sheet.label} at the leg's end",
    ).root


def _guess(piece: Piece, c: float, lo: float, hi: float) -> tuple[float, float]:
    """A first estimate of the root and the slope of g there, from the piece's nodes."""
    ts, gs = np.asarray(piece.t), np.asarray(piece.g)
    if gs[-1] < gs[0]:
        ts, gs = ts[::-1], gs[::-1]
    t = float(np.interp(c, gs, ts))
    k = int(np.clip(np.searchsorted(gs, c), 1, len(gs) - 1))
    dt = ts[k] - ts[k - 1]
    slope = (gs[k] - gs[k - 1]) / dt if dt != 0 else 0.0
    return min(max(t, lo), hi), float(slope)


def state_at(sub: Substance, prop: str, value: float, x: float) -> StatePoint:
    """The state of the leg at coordinate x."""
    if prop == "v":
        return states.flash_Tv(sub, x, value)
    return states.flash_p(sub, x, prop, value)


def key_at(sub: Substance, prop: str, value: float, x: float) -> tuple[str, str | None]:
    """(phase, form) of the leg's state at coordinate x, without solving for the state."""
    if prop == "v":
        return states.phase_key_T(sub, x, value)
    return states.phase_key_p(sub, x, prop, value)


def turning_point(
    sub: Substance, prop: str, value: float, a: StatePoint, b: StatePoint, x_a: float, x_b: float
) -> StatePoint | None:
    """Where the temperature (on a constant-h or -s leg) or the pressure (constant v) turns
    between two fluid states of one single-phase stretch: the root of its slope along the leg
    (the reference library's derivative), None where the slope has one sign at both ends."""
    if a.phase != b.phase or a.phase not in ("liquid", "vapor", "supercritical"):
        return None
    slope_at = getattr(sub.fluid, "slope_along", None)
    if slope_at is None:
        return None

    def slope(x: float, state: StatePoint | None = None) -> float:
        st = state if state is not None else state_at(sub, prop, value, x)
        return float(slope_at(prop, st.T, st.p, a.phase))

    try:
        if slope(x_a, a) * slope(x_b, b) >= 0.0:
            return None
        # the same function at both ends of the bracket: states solved a hair inside it
        lo, hi = sorted((x_a, x_b))
        eps = 1e-9 * (hi - lo)
        lo, hi = lo + eps, hi - eps
        f_lo, f_hi = slope(lo), slope(hi)
        if f_lo * f_hi >= 0.0:
            return None
        x = states.root(slope, lo, hi, f_lo=f_lo, f_hi=f_hi, what="a turning point").root
        return state_at(sub, prop, value, x)
    except PhasePathError:
        return None
