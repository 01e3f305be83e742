"""States of the substance: single phases and mixtures on a boundary, each as a state record.

A state is found from two properties: (T, p) in a known phase (:func:`single_state`), pressure
and enthalpy or entropy (:func:`flash_p`: a valve, a compressor), temperature and specific
volume (:func:`flash_Tv`: a sealed vessel). Both flashes walk the boundaries met at the fixed
coordinate (:func:`layers_at_p`: in rising temperature; :func:`layers_at_T`: in rising
pressure). Across each boundary the held property jumps, in the same direction every time:
at fixed pressure h and s rise with temperature within a phase and across every boundary (the
phase on the warm side holds the latent heat); at fixed temperature the volume falls with
pressure within a phase and across every boundary (the phase on the high-pressure side is the
denser). So a value lies either inside one single-phase stretch, solved there by the root finder
(or the reference library's own flash, checked), or inside the jump of one boundary, where the
state is a mixture on that boundary with the fractions by mass from the lever rule:

* liquid + vapor: the reference EOS on its vapor-pressure curve;
* solid + vapor below the triple-point pressure: the published sublimation curve, the EOS gas
  branch (extrapolated below the triple-point temperature, where the vapor is dilute) and the
  published solid model (water ice Ih: IAPWS R10-06; CO2: Jäger & Span 2012);
* solid + liquid on the melting curve, with the same solid models: a sealed vessel of liquid
  water cooled below 0 °C climbs the ice Ih melting curve as ice + liquid (the burst pipe).

A value exactly at the held property of a boundary phase is that saturated (or coexisting)
single phase, not a mixture: a start at exactly the saturated-liquid density is the saturated
liquid. So a CO2 liquid let down through a valve to 1 atm becomes a solid-vapor mixture at the
sublimation temperature (dry-ice snow) instead of a refused state. Every function returns a
:class:`~phasepath.records.StatePoint`; a state no model covers has h, s and rho None and the
reason in ``model``. A curved leg through a change of the solid's form (one ice to another) is
refused: the solid-solid mixtures are not modelled.
"""

from __future__ import annotations

import math
from collections.abc import Callable
from dataclasses import replace
from typing import TYPE_CHECKING

from .errors import NoModelError, OutOfRangeError, PhasePathError
from .layers import Layer, layers_at_p, layers_at_T, melt_fluid, temperature_on
from .models import EOS_MODEL, phase_state
from .records import StatePoint
from .rootfind import RootResult, find_root

if TYPE_CHECKING:  # pragma: no cover
    from .substances import Substance

__all__ = [
    "single_state",
    "flash_p",
    "flash_Tv",
    "mixture",
    "temperature_on",
    "held_value",
    "root",
    "saturated_mixture",
    "Layer",
    "layers_at_p",
    "layers_at_T",
    "melt_fluid",
    "phase_key_p",
    "phase_key_T",
]

_END_SLACK = 1e-9  # a root on a boundary's end may miss the bracket by rounding of the calls
_SCALE = {
    "h": 1e3,
    "s": 1.0,
    "v": 1e-6,
}  # floors of the scale of a held value (J/kg, J/(kg K), m3/kg)
_ORDER = ("solid", "liquid", "supercritical", "vapor")  # the phases of a mixture, in writing order


def root(
    f: Callable[[float], float],
    lo: float,
    hi: float,
    *,
    f_lo: float | None = None,
    f_hi: float | None = None,
    **kw: object,
) -> RootResult:
    """:func:`phasepath.rootfind.find_root`, guarded: where values known beforehand at the
    bracket's ends disagree in the last digits with the function there (a boundary's value from
    the saturation call, the state from an imposed phase), the ends are evaluated afresh; no raw
    library error leaves it."""
    given = f_lo is not None or f_hi is not None
    try:
        return find_root(f, lo, hi, f_lo=f_lo, f_hi=f_hi, **kw)  # type: ignore[arg-type]
    except PhasePathError:
        if not given:
            raise
    except ValueError as exc:  # scipy: the ends do not bracket a root after all
        if not given:
            raise OutOfRangeError(f"no root of {kw.get('what', 'the equation')}: {exc}") from None
    try:
        return find_root(f, lo, hi, **kw)  # type: ignore[arg-type]
    except PhasePathError:
        raise
    except ValueError as exc:
        raise OutOfRangeError(f"no root of {kw.get('what', 'the equation')}: {exc}") from None


def single_state(
    sub: Substance, T: float, p: float, phase: str, form: str | None = None
) -> StatePoint:
    """A single-phase state with h, s, rho where a model covers it (else None, reason in model)."""
    try:
        return phase_state(sub, T, p, phase, form)
    except NoModelError as exc:
        return StatePoint(T, p, phase, form, model=str(exc))


def held_value(state: StatePoint, prop: str) -> float | None:
    """The value of ``prop`` ("h", "s" or "v") of a state, None where no model covers it."""
    if prop == "v":
        return None if state.rho is None else 1.0 / state.rho
    return state.h if prop == "h" else state.s


def mixture(
    T: float, p: float, phases: str, a: StatePoint, b: StatePoint, frac_b: float
) -> StatePoint:
    """Lever-rule mixture of state a (mass fraction 1 - frac_b) and state b (frac_b).

    ``phases`` is "liquid+vapor" (a: liquid, b: vapor), "solid+vapor" or "solid+liquid" /
    "solid+supercritical" (a: the solid). The vapor fraction is frac_b where b is the vapor; the
    solid fraction is 1 - frac_b where a is the solid.
    """
    assert a.h is not None and b.h is not None and a.s is not None and b.s is not None
    assert a.rho is not None and b.rho is not None
    h = (1 - frac_b) * a.h + frac_b * b.h
    s = (1 - frac_b) * a.s + frac_b * b.s
    v = (1 - frac_b) / a.rho + frac_b / b.rho
    model = "; ".join(sorted({a.model, b.model}))
    solid_first = phases.startswith("solid")
    vapor = frac_b if phases.endswith("vapor") else None
    solid = (1 - frac_b) if solid_first else None
    return StatePoint(
        T,
        p,
        phases,
        a.form if solid_first else None,
        vapor_fraction=vapor,
        solid_fraction=solid,
        h=h,
        s=s,
        rho=1.0 / v,
        model=model,
    )


def saturated_mixture(sub: Substance, T: float, p: float, x: float) -> StatePoint:
    """The state on the vapor-pressure curve at T [K] (vapor pressure p [Pa]) with vapor mass
    fraction x: the saturated liquid for x = 0 and the saturated vapor for x = 1 (single
    phases, with their vapor fraction 0 and 1), a liquid + vapor mixture between."""
    (hl, sl, rl), (hv, sv, rv) = sub.fluid.saturated(T)
    liquid = StatePoint(T, p, "liquid", vapor_fraction=0.0, h=hl, s=sl, rho=rl, model=EOS_MODEL)
    vapor = StatePoint(T, p, "vapor", vapor_fraction=1.0, h=hv, s=sv, rho=rv, model=EOS_MODEL)
    if x == 0.0:
        return liquid
    if x == 1.0:
        return vapor
    return mixture(T, p, "liquid+vapor", liquid, vapor, x)


# -- the flashes --------------------------------------------------------------------------------
def flash_p(sub: Substance, p: float, prop: str, value: float) -> StatePoint:
    """The state at pressure p [Pa] with h [J/kg] or s [J/(kg K)] equal to ``value``."""
    out = _walk_p(sub, p, prop, value, False)
    assert isinstance(out, StatePoint)
    return out


def phase_key_p(sub: Substance, p: float, prop: str, value: float) -> tuple[str, str | None]:
    """(phase, form) of the state :func:`flash_p` would give, without solving for it."""
    out = _walk_p(sub, p, prop, value, True)
    return out.key if isinstance(out, StatePoint) else out


def flash_Tv(sub: Substance, T: float, v: float) -> StatePoint:
    """The state at temperature T [K] with specific volume v [m3/kg] (a sealed vessel)."""
    out = _walk_T(sub, T, v, False)
    assert isinstance(out, StatePoint)
    return out


def phase_key_T(sub: Substance, T: float, v: float) -> tuple[str, str | None]:
    """(phase, form) of the state :func:`flash_Tv` would give, without solving for it."""
    out = _walk_T(sub, T, v, True)
    return out.key if isinstance(out, StatePoint) else out


_Key = tuple[str, "str | None"]


def _walk_p(sub: Substance, p: float, prop: str, value: float, key_only: bool) -> StatePoint | _Key:
    """The walk at fixed p, from the warmest boundary down: h and s rise through every
    boundary in turn, so a value at or above a boundary's cold side is decided there without
    the boundaries below it (a state in the two-phase region needs the saturation call only)."""
    what = f"{sub.name} at p = {p:.6g} Pa with {prop} = {value:.6g}"
    layers = layers_at_p(sub, p)
    T_hi, f_hi = sub.T_max, None
    above_key = layers[-1].above if layers else (_fluid_key(sub, sub.T_max, p), None)
    for layer in reversed(layers):
        up = _on(sub, layer, "above")
        a = held_value(up, prop)
        assert a is not None
        if value > a:  # above this boundary, below the one above it
            if key_only:
                return _region_p(sub, p, prop, value, layer.T, T_hi, above_key)
            return _solve_T(sub, p, prop, value, layer.T, T_hi, above_key, what, a - value, f_hi)
        if value == a:
            return _exact(layer, up)
        down = _on(sub, layer, "below")
        b = held_value(down, prop)
        assert b is not None
        if value > b:
            return _lever(layer, down, up, b, a, value)
        if value == b:
            return _exact(layer, down)
        T_hi, f_hi, above_key = layer.T, b - value, layer.below  # look further down
    T_lo = sub.T_min
    if not layers or layers[0].below[0] != "solid":
        T_lo = max(sub.T_min, sub.triple[0])
    if key_only:
        return _region_p(sub, p, prop, value, T_lo, T_hi, above_key)
    return _solve_T(sub, p, prop, value, T_lo, T_hi, above_key, what, None, f_hi)


def _walk_T(sub: Substance, T: float, v: float, key_only: bool) -> StatePoint | _Key:
    rho = 1.0 / v
    what = f"{sub.name} at T = {T:.6g} K and density {rho:.6g} kg/m3"
    layers = layers_at_T(sub, T)
    p_lo = 0.0
    f_lo: float | None = None
    for layer in layers:  # v falls with p, and jumps down across every boundary
        down = _on(sub, layer, "below")
        b = held_value(down, "v")
        assert b is not None
        if v > b:
            if key_only:
                return _region_T(sub, T, v, p_lo, layer.p, layer.below)
            return _solve_p(sub, T, v, p_lo, layer.p, layer.below, what, f_lo, b - v)
        if v == b:
            return _exact(layer, down)
        up = _on(sub, layer, "above")
        a = held_value(up, "v")
        assert a is not None
        if v > a:
            return _lever(layer, down, up, b, a, v)
        if v == a:
            return _exact(layer, up)
        p_lo, f_lo = layer.p, a - v
    above = layers[-1].above if layers else (_fluid_key(sub, T, sub.p_max), None)
    if key_only:
        return _region_T(sub, T, v, p_lo, sub.p_max, above)
    return _solve_p(sub, T, v, p_lo, sub.p_max, above, what, f_lo, None)


def _region_p(
    sub: Substance, p: float, prop: str, value: float, lo: float, hi: float, key: _Key
) -> _Key:
    """The (phase, form) of a single-phase stretch at p between lo and hi [K]: one phase, but
    a fluid above the critical pressure is liquid up to the critical temperature and
    supercritical beyond it."""
    T_c, p_c = sub.critical
    if key[0] == "solid" or not (p > p_c and lo < T_c < hi):
        return key
    at_c = held_value(phase_state(sub, T_c, p, "supercritical"), prop)
    assert at_c is not None
    return ("supercritical" if value > at_c else "liquid"), None


def _region_T(sub: Substance, T: float, v: float, lo: float, hi: float, key: _Key) -> _Key:
    """The (phase, form) of a single-phase stretch at T between lo and hi [Pa]: above the
    critical temperature a fluid is vapor up to the critical pressure, supercritical beyond."""
    T_c, p_c = sub.critical
    if key[0] == "solid" or T <= T_c:
        return key
    if not lo < p_c < hi:
        return ("supercritical" if lo >= p_c else "vapor"), None
    at_c = held_value(phase_state(sub, T, p_c, "supercritical"), "v")
    assert at_c is not None
    return ("vapor" if v > at_c else "supercritical"), None


def _on(sub: Substance, layer: Layer, side: str) -> StatePoint:
    """The state on one side of a boundary: on the vapor-pressure curve the saturated liquid or
    vapor of the reference EOS (its saturation call, exact on the curve), else the phase's model
    at the boundary point."""
    key = layer.above if side == "above" else layer.below
    if (
        layer.label == "vapor pressure"
        and key[0] in ("liquid", "vapor")
        and ({layer.below[0], layer.above[0]} == {"liquid", "vapor"})
    ):
        (hl, sl, rl), (hv, sv, rv) = sub.fluid.saturated(layer.T)
        if key[0] == "liquid":
            return StatePoint(layer.T, layer.p, "liquid", h=hl, s=sl, rho=rl, model=EOS_MODEL)
        return StatePoint(layer.T, layer.p, "vapor", h=hv, s=sv, rho=rv, model=EOS_MODEL)
    return phase_state(sub, layer.T, layer.p, *key)


def _exact(layer: Layer, state: StatePoint) -> StatePoint:
    """A state exactly at one side of a boundary: on the vapor-pressure curve the saturated
    liquid (vapor fraction 0) or vapor (1) it is."""
    if layer.label == "vapor pressure" and {layer.below[0], layer.above[0]} == {"liquid", "vapor"}:
        return replace(state, vapor_fraction=0.0 if state.phase == "liquid" else 1.0)
    return state


def _lever(
    layer: Layer, down: StatePoint, up: StatePoint, b: float, a: float, value: float
) -> StatePoint:
    """The mixture on ``layer`` whose held property is ``value`` (between b and a)."""
    first, second = sorted((down, up), key=lambda s: _ORDER.index(s.phase))
    x = (value - b) / (a - b)  # mass fraction of the 'up' phase
    frac_second = x if second is up else 1.0 - x
    phases = f"{first.phase}+{second.phase}"
    return mixture(layer.T, layer.p, phases, first, second, frac_second)


def _fluid_key(sub: Substance, T: float, p: float) -> str:
    return sub.fluid_phase(T, p)


def _check_form(sub: Substance, state: StatePoint, key: tuple[str, str | None]) -> StatePoint:
    """Refuse a solid state whose stable form is not the one of the stretch it was solved in."""
    if state.phase == "solid" and key[1] is not None:
        form = sub.solids.form_at(state.T, state.p)
        if form is not None and form != key[1]:
            raise NoModelError(
                f"{sub.name} at T = {state.T:.6g} K, p = {state.p:.6g} Pa: the solid there is "
                f"ice {form}, not ice {key[1]}: a constant-h, -s or -v leg across a change of "
                "the solid's form is not modelled"
            )
    return state


def _solve_T(
    sub: Substance,
    p: float,
    prop: str,
    value: float,
    lo: float,
    hi: float,
    key: tuple[str, str | None],
    what: str,
    f_lo: float | None,
    f_hi: float | None,
) -> StatePoint:
    """The single-phase state at p between lo and hi [K] whose ``prop`` equals ``value``: the
    root finder from a guess interpolated between the ends of the stretch (h and s rise
    smoothly with T in one phase), to 1e-12 of the temperature."""
    phase, form = key
    fluid = phase != "solid"

    def phase_of(T: float) -> str:
        return sub.fluid_phase(T, p) if fluid else "solid"

    def f(T: float) -> float:
        got = held_value(phase_state(sub, T, p, phase_of(T), form), prop)
        assert got is not None
        return got - value

    if f_lo is None:
        f_lo = f(lo)
    if f_hi is None:
        f_hi = f(hi)
    # in the variable where the held property is nearly linear: T for h, ln T for s (c_p
    # varies slowly), so that the secant steps from the interpolated guess converge at once
    log = prop == "s" and lo > 0.0
    u_lo, u_hi = (math.log(lo), math.log(hi)) if log else (lo, hi)

    def g(u: float) -> float:
        return f(math.exp(u) if log else u)

    guess = slope = None
    if f_lo < 0.0 < f_hi and u_hi > u_lo:
        slope = (f_hi - f_lo) / (u_hi - u_lo)
        guess = u_lo - f_lo / slope
    # |f| within 1e-12 of the stretch's rise over one relative unit of T: T to about 1e-12
    ftol = 1e-12 * abs(slope) * (1.0 if log else hi) if slope else 0.0
    r = root(
        g,
        u_lo,
        u_hi,
        f_lo=f_lo,
        f_hi=f_hi,
        guess=guess,
        slope=slope,
        ftol=ftol,
        end_slack=_END_SLACK,
        what=what,
    )
    T = min(max(math.exp(r.root), lo), hi) if log else r.root
    state = single_state(sub, T, p, phase_of(T), form)
    got = held_value(state, prop)
    if fluid and got is not None and abs(got - value) > 1e-9 * max(abs(value), 1.0):
        near = _near_critical(sub, p, prop, value, lo, hi)  # T is ill-conditioned there
        if near is not None:
            return near
    return _check_form(sub, state, key)


_CRITICAL_BAND = 1e-2  # relative band in T about T_c where a near-critical isobar is solved in rho


def _near_critical(
    sub: Substance, p: float, prop: str, value: float, lo: float, hi: float
) -> StatePoint | None:
    """A single-phase state on an isobar near the critical pressure, solved in density: there
    h and s change smoothly with density but are ill-conditioned in T (c_p grows without
    bound at the critical point). ``lo``, ``hi``: the stretch of T it lies in."""
    T_c, p_c = sub.critical
    band = (T_c * (1 - _CRITICAL_BAND), T_c * (1 + _CRITICAL_BAND))
    if not (abs(p / p_c - 1.0) <= 1e-3 and lo < band[1] and hi > band[0]):
        return None
    T_lo, T_hi = max(lo, band[0]), min(hi, band[1])
    fluid = sub.fluid

    def end_rho(T: float) -> float:
        if T in (lo, hi) and p < p_c and sub.vapor is not None and T < T_c:
            liquid, vapor = fluid.saturated(T)  # the stretch ends on the vapor-pressure curve
            return float(vapor[2] if T == lo else liquid[2])
        rho = phase_state(sub, T, p, sub.fluid_phase(T, p)).rho
        assert rho is not None
        return rho

    def T_of(rho: float) -> float:
        return find_root(
            lambda T: fluid.state_DT(rho, T)[0] - p,
            T_lo,
            T_hi,
            end_slack=1e-9,
            what="an isobar near T_c",
        ).root

    def g(rho: float) -> float:
        _, h, s = fluid.state_DT(rho, T_of(rho))
        return (h if prop == "h" else s) - value

    try:
        rho_dense, rho_light = end_rho(T_lo), end_rho(T_hi)
        rho = find_root(g, rho_light, rho_dense, what="an isobar near the critical point").root
        T = T_of(rho)
        _, h, s = fluid.state_DT(rho, T)
    except PhasePathError:
        return None
    if abs((h if prop == "h" else s) - value) > 1e-9 * max(abs(value), 1.0):
        return None
    return StatePoint(T, p, sub.fluid_phase(T, p), None, h=h, s=s, rho=rho, model=EOS_MODEL)


def _solve_p(
    sub: Substance,
    T: float,
    v: float,
    lo: float,
    hi: float,
    key: tuple[str, str | None],
    what: str,
    f_lo: float | None,
    f_hi: float | None,
) -> StatePoint:
    """The single-phase state at T between lo and hi [Pa] whose specific volume is v."""
    phase, form = key
    rho = 1.0 / v
    if phase != "solid":
        if T >= sub.triple[0]:  # the reference library's own (rho, T) state first
            try:
                p, h, s = sub.fluid.state_DT(rho, T)
            except PhasePathError:
                p = math.nan
            if lo <= p <= hi:
                return _check_p(
                    sub,
                    StatePoint(
                        T, p, sub.fluid_phase(T, p), None, h=h, s=s, rho=rho, model=EOS_MODEL
                    ),
                    what,
                )
            if p > hi == sub.p_max:
                _too_high(sub, what, p)
        if lo <= 0.0:  # dilute vapor: the bracket in ln p down from its top
            lo = hi * 1e-12

    def gap(p: float) -> float:
        try:
            got = held_value(
                phase_state(
                    sub, T, p, sub.fluid_phase(T, p) if phase != "solid" else "solid", form
                ),
                "v",
            )
        except NoModelError:
            if phase == "solid" and p > lo:
                return -math.inf  # beyond the solid model's range: denser than any state there
            raise
        assert got is not None
        return got - v

    if phase == "solid":
        hi = _solid_top(gap, lo, hi)
        f_hi = None
    r = root(
        lambda p: _finite(gap(p)), lo, hi, f_lo=f_lo, f_hi=f_hi, end_slack=_END_SLACK, what=what
    )
    state = single_state(
        sub, T, r.root, sub.fluid_phase(T, r.root) if phase != "solid" else "solid", form
    )
    return _check_p(sub, _check_form(sub, state, key), what)


def _solid_top(gap: Callable[[float], float], lo: float, hi: float) -> float:
    """A pressure above lo where the solid is denser than asked, within its model's range."""
    p = max(lo, 1.0)
    while p < hi:
        p = min(hi, p * 2.0)
        g = gap(p)
        if g < 0.0 and math.isfinite(g):
            return p
        if not math.isfinite(g):  # beyond its model: search back
            top = p
            base = p / 2.0
            for _ in range(60):
                mid = 0.5 * (base + top)
                gm = gap(mid)
                if not math.isfinite(gm):
                    top = mid
                elif gm < 0.0:
                    return mid
                else:
                    base = mid
            break
    raise NoModelError(
        "the sealed contents would be a solid denser than its model covers at any pressure it "
        "models"
    )


def _finite(x: float) -> float:
    return x if math.isfinite(x) else -1e300


def _check_p(sub: Substance, state: StatePoint, what: str) -> StatePoint:
    if state.p > sub.p_max:
        _too_high(sub, what, state.p)
    return state


def _too_high(sub: Substance, what: str, p: float) -> None:
    raise OutOfRangeError(
        f"{what}: the sealed contents would reach p = {p:.6g} Pa, above the highest pressure "
        f"the models of {sub.name} cover ({sub.p_max:.6g} Pa)"
    )
