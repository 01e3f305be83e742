"""A substance in the three views of its phase diagram: pressure–temperature, pressure–enthalpy
and temperature–entropy.

========  ===============  ===============  ==========================================
view      x                y                what a leg looks like there
========  ===============  ===============  ==========================================
``"pT"``  T [K]            p [Pa]           isobar horizontal, isotherm vertical
``"ph"``  h [J/kg]         p [Pa]           isobar horizontal, valve (constant h) vertical
``"Ts"``  s [J/(kg K)]     T [K]            isotherm horizontal, ideal compressor vertical
========  ===============  ===============  ==========================================

:func:`curves` gives the substance's boundaries in a view: on the P–T diagram its boundary
branches; on the p–h and T–s diagrams the saturated liquid and vapor lines of the two-phase dome
(meeting at the critical point), the triple-point line (solid, liquid and vapor at the triple
point), and the solid–fluid lines of the sublimation and melting branches wherever the substance
carries a published solid model (water ice Ih, dry ice). :func:`points` gives the triple and
critical points; :func:`state_at` the state at a point of a view (the readout under the cursor).
Every value is SI; nothing here draws.

>>> import phasepath as pp
>>> co2 = pp.substance("CO2")
>>> [c.label for c in curves(co2, "ph")][:3]
['saturated liquid', 'saturated vapor', 'triple-point line']
>>> st = state_at(co2, "ph", 300e3, 20e5)   # inside the dome at 20 bar
>>> st.phase, round(st.T, 2), round(st.vapor_fraction, 4)
('liquid+vapor', 253.65, 0.5136)

(CO2 boils at 253.65 K, −19.50 °C, at 2 MPa: Span & Wagner 1996, saturation table; from memory.
The vapor fraction is a regression pin.)
"""

from __future__ import annotations

import math
from dataclasses import dataclass
from functools import lru_cache
from typing import TYPE_CHECKING

import numpy as np

from . import states
from .errors import NoModelError, OutOfRangeError, PhasePathError
from .models import phase_state
from .records import StatePoint
from .rootfind import find_root

if TYPE_CHECKING:  # pragma: no cover
    from .boundaries import Boundary
    from .substances import Substance

__all__ = ["VIEWS", "AXES", "ViewCurve", "ViewPoint", "curves", "points", "state_at", "coordinates"]

#: The views, in the order the planner shows them.
VIEWS = ("pT", "ph", "Ts")
#: The quantity on each axis of a view: (x, y).
AXES = {"pT": ("T", "p"), "ph": ("h", "p"), "Ts": ("s", "T")}

_DOME = 90  # temperatures along each side of the dome, denser toward the critical point


@dataclass(frozen=True)
class ViewCurve:
    """One boundary line of a view: SI arrays ``x``, ``y`` (see :data:`AXES`).

    ``kind`` is the boundary kind ("vaporization", "melting", "sublimation") or "triple" for the
    triple-point line; ``label`` says which side it is ("saturated liquid", "solid side of the
    melting (ice Ih) branch"); ``extrapolated`` marks a piece of a branch built from data that
    lies beyond its data (P–T only); ``form`` names the solid (water's ices).
    """

    kind: str
    label: str
    x: np.ndarray
    y: np.ndarray
    extrapolated: bool = False
    form: str | None = None


@dataclass(frozen=True)
class ViewPoint:
    """A labelled point of a view ("triple point", "critical point"), SI."""

    name: str
    x: float
    y: float


def coordinates(state: StatePoint, view: str) -> tuple[float, float] | None:
    """(x, y) of a state in a view; None where no model gives its h or s."""
    _check(view)
    if view == "pT":
        return state.T, state.p
    if view == "ph":
        return None if state.h is None else (state.h, state.p)
    return None if state.s is None else (state.s, state.T)


def _check(view: str) -> None:
    if view not in AXES:
        raise PhasePathError(f"unknown view {view!r}; the views are {', '.join(VIEWS)}")


# -- boundaries -----------------------------------------------------------------------------------
def curves(sub: Substance, view: str) -> tuple[ViewCurve, ...]:
    """The boundary lines of ``sub`` in ``view`` (computed once per substance and view).

    On the p–h and T–s views a substance without an equation of state has none.
    """
    _check(view)
    return _curves(sub, view)


@lru_cache(maxsize=64)
def _curves(sub: Substance, view: str) -> tuple[ViewCurve, ...]:
    if view == "pT":
        return tuple(_pT_pieces(sub))
    return tuple(_energy_curves(sub, view))


def points(sub: Substance, view: str) -> tuple[ViewPoint, ...]:
    """The triple and critical points in ``view`` (where the substance has them and, on p–h
    and T–s, where a model gives their h and s). On p–h and T–s the triple point is the liquid
    end of the triple-point line."""
    _check(view)
    return _points(sub, view)


@lru_cache(maxsize=64)
def _points(sub: Substance, view: str) -> tuple[ViewPoint, ...]:
    out = []
    T_t, p_t = sub.triple
    T_c, p_c = sub.critical
    if view == "pT":
        for name, (T, p) in (("triple point", (T_t, p_t)), ("critical point", (T_c, p_c))):
            if math.isfinite(T) and math.isfinite(p):
                out.append(ViewPoint(name, T, p))
        return tuple(out)
    for name, T in (("triple point", T_t), ("critical point", T_c)):
        try:
            (hl, sl, _), (hv, sv, _) = sub.fluid.saturated(T)
        except PhasePathError:
            continue
        if name == "critical point":
            h, s = 0.5 * (hl + hv), 0.5 * (sl + sv)
            p = p_c
        else:
            h, s, p = hl, sl, p_t
        xy = (h, p) if view == "ph" else (s, T)
        out.append(ViewPoint(name, *xy))
    return tuple(out)


def _pT_pieces(sub: Substance) -> list[ViewCurve]:
    """Every boundary's cached sample, split where a branch built from data leaves its data
    range (``Boundary.T_valid``); neighbouring pieces share their end point."""
    out = []
    for b in sub.boundaries:
        T, p = b.curve(0.0, sub.p_max)
        if len(T) < 2:
            continue
        valid = b.T_valid
        if valid is None:
            out.append(ViewCurve(b.kind, b.label, T, p, False, b.solid_form))
            continue
        lo, hi = valid
        cuts = [float(t) for t in (lo, hi) if T[0] < t < T[-1]]
        edges = [float(T[0]), *cuts, float(T[-1])]
        for a, z in zip(edges[:-1], edges[1:], strict=False):
            inside = (T > a) & (T < z)
            Ts = np.concatenate(([a], T[inside], [z]))
            ps = np.concatenate(([_p_at(b, a, T, p)], p[inside], [_p_at(b, z, T, p)]))
            mid = 0.5 * (a + z)
            out.append(ViewCurve(b.kind, b.label, Ts, ps, not (lo <= mid <= hi), b.solid_form))
    return out


def _p_at(b: Boundary, T: float, Ts: np.ndarray, ps: np.ndarray) -> float:
    try:
        return float(b.p_of_T(T))
    except PhasePathError:  # drawing only: the sample's interpolant in ln p
        return float(np.exp(np.interp(T, Ts, np.log(ps))))


def _xy(view: str, st: StatePoint) -> tuple[float, float] | None:
    return coordinates(st, view)


def _line(view: str, kind: str, label: str, sts: list[StatePoint], form: str | None = None):
    xy = [c for c in (_xy(view, s) for s in sts) if c is not None]
    if len(xy) < 2:
        return None
    arr = np.asarray(xy, dtype=float)
    return ViewCurve(kind, label, arr[:, 0], arr[:, 1], False, form)


def _energy_curves(sub: Substance, view: str) -> list[ViewCurve]:
    out: list[ViewCurve | None] = []
    T_t, p_t = sub.triple
    T_c, _ = sub.critical
    if sub.vapor is None or not (math.isfinite(T_t) and math.isfinite(T_c)):
        return []
    liquid, vapor = [], []
    u = np.linspace(0.0, 1.0, _DOME)
    for T in T_c - (T_c - T_t) * (1.0 - u) ** 3:
        T = float(min(max(T, T_t), T_c))
        try:
            (hl, sl, rl), (hv, sv, rv) = sub.fluid.saturated(T)
        except PhasePathError:
            continue
        p = sub.vapor.p_of_T(T) if T < T_c else sub.critical[1]
        liquid.append(StatePoint(T, p, "liquid", h=hl, s=sl, rho=rl))
        vapor.append(StatePoint(T, p, "vapor", h=hv, s=sv, rho=rv))
    if not liquid:
        return []
    out.append(_line(view, "vaporization", "saturated liquid", liquid))
    out.append(_line(view, "vaporization", "saturated vapor", vapor))
    # the triple-point line: solid (where modelled), liquid and vapor at the triple point
    triple = [liquid[0], vapor[0]]
    form = sub.sublimation.solid_form if sub.sublimation is not None else None
    try:
        triple.insert(0, phase_state(sub, T_t, p_t, "solid", form or sub.solids.form_at(T_t, p_t)))
    except (NoModelError, OutOfRangeError):
        pass
    out.append(_line(view, "triple", "triple-point line", triple))
    if sub.sublimation is not None:
        out += _solid_fluid(sub, view, sub.sublimation, "vapor")
    for b in sub.melting:
        out += _solid_fluid(sub, view, b, None)
    return [c for c in out if c is not None]


def _solid_fluid(
    sub: Substance, view: str, b: Boundary, fluid: str | None
) -> list[ViewCurve | None]:
    """The solid side and the fluid side of a solid–fluid branch, where a solid model covers
    its states (else nothing: a solid without a model has no h or s)."""
    T, p = b.curve(0.0, sub.p_max)
    solid, other = [], []
    for t, q in zip(T, p, strict=True):
        t, q = float(t), float(q)
        try:
            s_state = phase_state(sub, t, q, "solid", b.solid_form or sub.solids.form_at(t, q))
            f_state = phase_state(sub, t, q, fluid or _dense_phase(sub, t, q))
        except (NoModelError, OutOfRangeError):
            continue
        solid.append(s_state)
        other.append(f_state)
    name = b.label
    return [
        _line(view, b.kind, f"solid side of the {name} branch", solid, b.solid_form),
        _line(view, b.kind, f"fluid side of the {name} branch", other, b.solid_form),
    ]


def _dense_phase(sub: Substance, T: float, p: float) -> str:
    """The fluid beside a melting branch: liquid below the critical temperature, supercritical
    above it (the dense fluid, even where the branch starts at the triple point)."""
    T_c, p_c = sub.critical
    if T < T_c or not math.isfinite(T_c):
        return "liquid"
    return "supercritical" if p > p_c else "vapor"


# -- the state at a point of a view -----------------------------------------------------------
def state_at(sub: Substance, view: str, x: float, y: float) -> StatePoint:
    """The state at the point (x, y) of ``view`` (SI; see :data:`AXES`), with its phase, solid
    form, h, s, density and vapor or solid fraction where the models give them.

    On P–T the state is the single phase at (T, p) (on a boundary, the side the point falls on
    by the boundary equations); on p–h it is the (p, h) flash of :func:`phasepath.states.flash_p`;
    on T–s a mixture where s lies between the coexisting phases at T, else the single-phase state
    at T whose entropy is s, its pressure found by the root finder (where the entropy is not
    monotonic in pressure, as in liquid water below 4 °C, one of the states with that entropy).
    Raises a phasepath error outside the models.
    """
    _check(view)
    for v in (x, y):
        if not (isinstance(v, (int, float)) and math.isfinite(v)):
            raise OutOfRangeError(f"({x!r}, {y!r}) is not a point of the {view} view")
    if view == "pT":
        phase, form = sub.classify(x, y)
        return states.single_state(sub, x, y, phase, form)
    if view == "ph":
        sub.check_state(min(max(sub.T_min, 300.0), sub.T_max), y)
        return states.flash_p(sub, y, "h", x)
    return _state_Ts(sub, y, x)


def _state_Ts(sub: Substance, T: float, s: float) -> StatePoint:
    sub.check_state(T, min(1e5, sub.p_max))
    T_t, p_t = sub.triple
    T_c, _ = sub.critical
    what = f"{sub.name} at T = {T:.6g} K with s = {s:.6g} J/(kg K)"
    if T < T_t:
        if sub.sublimation is None:
            raise OutOfRangeError(f"{what}: below the triple point, no sublimation curve")
        p_s = sub.sublimation.p_of_T(T)
        gas = states.single_state(sub, T, p_s, "vapor")
        form = sub.sublimation.solid_form or sub.solids.form_at(T, p_s)
        return _split(sub, T, p_s, s, "solid+vapor", gas, form, what, low=True)
    if T < T_c and sub.vapor is not None:
        p_v = sub.vapor.p_of_T(T)
        liquid = states.saturated_mixture(sub, T, p_v, 0.0)
        vapor = states.saturated_mixture(sub, T, p_v, 1.0)
        assert liquid.s is not None and vapor.s is not None
        if liquid.s <= s <= vapor.s:
            frac = (s - liquid.s) / (vapor.s - liquid.s)
            return states.saturated_mixture(sub, T, p_v, frac)
        if s > vapor.s:
            return _single_by_s(sub, T, s, p_v * 1e-12, p_v, "vapor", None, what)
        return _dense(sub, T, s, p_v, "liquid", what)
    return _dense(sub, T, s, 0.0, None, what)


def _dense(sub: Substance, T: float, s: float, p_lo: float, phase: str | None, what: str):
    """A fluid state above ``p_lo`` at T (up to the melting pressure, then solid + fluid and
    solid where a solid model covers them)."""
    melt = [b for b in sub.melting if b.solid_side == "above" and b.T_min <= T <= b.T_max]
    p_top = min([b.p_of_T(T) for b in melt] + [sub.p_max])
    if p_lo <= 0.0:
        p_lo = min(1.0, p_top * 1e-9)
    fluid = phase or sub.fluid_phase(T, p_top)
    top = _safe(sub, T, p_top, phase)
    if top is None or top.s is None or s >= top.s:
        return _single_by_s(sub, T, s, p_lo, p_top, phase, None, what)
    if not melt:
        raise OutOfRangeError(f"{what}: beyond the highest pressure the models cover")
    b = min(melt, key=lambda c: c.p_of_T(T))
    form = b.solid_form
    return _split(sub, T, p_top, s, f"solid+{fluid}", top, form, what, low=False)


def _split(
    sub: Substance,
    T: float,
    p: float,
    s: float,
    phases: str,
    fluid_state: StatePoint,
    form: str | None,
    what: str,
    low: bool,
) -> StatePoint:
    """On a solid–fluid branch at (T, p): the fluid beyond it, the mixture on it, or the solid."""
    assert fluid_state.s is not None
    if low and s > fluid_state.s:  # vapor below the sublimation pressure
        return _single_by_s(sub, T, s, p * 1e-12, p, "vapor", None, what)
    solid = phase_state(sub, T, p, "solid", form)  # NoModelError where no solid model
    assert solid.s is not None
    if solid.s <= s <= fluid_state.s:
        frac_fluid = (s - solid.s) / (fluid_state.s - solid.s)
        return states.mixture(T, p, phases, solid, fluid_state, frac_fluid)
    if s < solid.s:
        # up to the melting pressure where the solid melts as it is pressed (ice Ih)
        below = [b for b in sub.melting if b.solid_side == "below" and b.T_min <= T <= b.T_max]
        p_hi = min([b.p_of_T(T) for b in below] + [sub.p_max]) if low else sub.p_max
        return _single_by_s(sub, T, s, p, p_hi, "solid", form, what)
    raise OutOfRangeError(f"{what}: no state of the models has this entropy")


def _safe(sub: Substance, T: float, p: float, phase: str | None) -> StatePoint | None:
    try:
        return states.single_state(sub, T, p, phase or sub.fluid_phase(T, p))
    except PhasePathError:
        return None


def _single_by_s(
    sub: Substance,
    T: float,
    s: float,
    p_lo: float,
    p_hi: float,
    phase: str | None,
    form: str | None,
    what: str,
) -> StatePoint:
    """The single-phase state at T between p_lo and p_hi [Pa] whose entropy is s."""

    def state(lp: float) -> StatePoint:
        p = math.exp(lp)
        return phase_state(sub, T, p, phase or sub.fluid_phase(T, p), form)

    def gap(lp: float) -> float:
        value = state(lp).s
        assert value is not None
        return value - s

    r = find_root(gap, math.log(p_lo), math.log(p_hi), end_slack=1e-9, what=what)
    p = math.exp(r.root)
    return states.single_state(sub, T, p, phase or sub.fluid_phase(T, p), form)
