"""States of the substance: single phases and mixtures on a boundary, each as a state record.

A state is found from two properties: (T, p) in a known phase (:func:`single_state`), pressure
and enthalpy or entropy (:func:`flash_p`: a valve, a compressor), temperature and specific
volume (:func:`flash_Tv`: a sealed vessel). Where the fixed property falls between those of two
coexisting phases the state is a mixture on the boundary, with the vapor (or solid) fraction by
mass from the lever rule:

* liquid + vapor: the reference EOS on its vapor-pressure curve;
* solid + vapor below the triple-point pressure: the published sublimation curve, the EOS gas
  branch (extrapolated below the triple-point temperature, where the vapor is dilute) and the
  published solid model (water ice Ih: IAPWS R10-06; CO2: Jäger & Span 2012);
* solid + liquid on the melting curve, with the same solid models.

So a CO2 liquid let down through a valve to 1 atm becomes a solid-vapor mixture at the
sublimation temperature (dry-ice snow) instead of a refused state. Every function returns a
:class:`~phasepath.records.StatePoint`; a state no model covers has h, s and rho None and the
reason in ``model``.
"""

from __future__ import annotations

from collections.abc import Callable
from typing import TYPE_CHECKING

from .errors import NoModelError, OutOfRangeError, PhasePathError
from .models import EOS_MODEL, phase_state
from .records import StatePoint
from .rootfind import find_root
from .substances import NO_SUBLIMATION

if TYPE_CHECKING:  # pragma: no cover
    from .boundaries import Boundary
    from .substances import Substance

__all__ = ["single_state", "flash_p", "flash_Tv", "mixture", "temperature_on", "held_value"]

_END_SLACK = (
    1e-9  # a root on a boundary's end may miss the bracket by rounding of the property calls
)


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


def temperature_on(b: Boundary, p: float) -> float:
    """The (first) temperature where boundary ``b`` reaches pressure p [Pa]."""
    roots = b.temperatures_at(p)
    if not roots:
        raise OutOfRangeError(
            f"p = {p!r} Pa is outside the {b.label} curve ({b.T_min:g} K to {b.T_max:g} K)"
        )
    return roots[0].root


def _value(sub: Substance, T: float, p: float, phase: str, prop: str, form: str | None) -> float:
    value = held_value(phase_state(sub, T, p, phase, form), prop)
    assert value is not None
    return value


def _solve_T(
    sub: Substance,
    p: float,
    phase_of: Callable[[float], str],
    prop: str,
    value: float,
    lo: float,
    hi: float,
    what: str,
    form: str | None = None,
) -> StatePoint:
    """The single-phase state at p between lo and hi [K] whose ``prop`` equals ``value``."""
    r = find_root(
        lambda T: _value(sub, T, p, phase_of(T), prop, form) - value,
        lo,
        hi,
        end_slack=_END_SLACK,
        what=what,
    )
    return single_state(sub, r.root, p, phase_of(r.root), form)


def _fluid_by_flash(
    sub: Substance,
    p: float,
    prop: str,
    value: float,
    lo: float,
    hi: float,
    what: str,
    side: str | None = None,
) -> StatePoint:
    """A single-phase fluid state: the reference library's own (p, h) or (p, s) flash, checked;
    else the root finder. ``side`` ("liquid" or "vapor") is the side of the vapor-pressure curve
    the state is on, known from the saturation values; None above the critical pressure."""

    def phase_of(T: float) -> str:
        return side if side is not None else sub.fluid_phase(T, p)

    try:
        T, h, s, rho, q = sub.fluid.flash(prop, p, value)
        if lo <= T <= hi and not (0.0 <= q <= 1.0):
            return StatePoint(T, p, phase_of(T), None, h=h, s=s, rho=rho, model=EOS_MODEL)
    except PhasePathError:
        pass
    return _solve_T(sub, p, phase_of, prop, value, lo, hi, what)


def flash_p(sub: Substance, p: float, prop: str, value: float) -> StatePoint:
    """The state at pressure p [Pa] with h [J/kg] or s [J/(kg K)] equal to ``value``."""
    T_t, p_t = sub.triple
    T_c, p_c = sub.critical
    what = f"{sub.name} at p = {p:.6g} Pa with {prop} = {value:.6g}"
    if p < p_t:
        return _flash_below_triple(sub, p, prop, value, what)
    upper = sub.T_max
    if p < p_c:
        T_s = sub.fluid.T_sat(p)
        liquid, vapor = _saturated(sub, T_s, p)
        v_l, v_v = held_value(liquid, prop), held_value(vapor, prop)
        assert v_l is not None and v_v is not None
        if value > v_v:
            return _fluid_by_flash(sub, p, prop, value, T_s, sub.T_max, what, "vapor")
        if value > v_l or (value == v_l and value == v_v):
            x = (value - v_l) / (v_v - v_l)
            return mixture(T_s, p, "liquid+vapor", liquid, vapor, x)
        upper = T_s
    melt = sub.melting_temperature(p)
    T_low = melt[0] if melt else T_t
    fluid_phase = sub.fluid_phase(T_low * (1 + 1e-12), p)
    fluid_low = phase_state(sub, T_low, p, fluid_phase)
    low_value = held_value(fluid_low, prop)
    assert low_value is not None
    if value >= low_value or melt is None:
        side = "liquid" if p < p_c else None
        return _fluid_by_flash(sub, p, prop, value, T_low, upper, what, side)
    form = melt[1]
    solid = phase_state(sub, T_low, p, "solid", form)
    solid_value = held_value(solid, prop)
    assert solid_value is not None
    if value >= solid_value:
        y = (low_value - value) / (low_value - solid_value)
        return mixture(T_low, p, f"solid+{fluid_phase}", solid, fluid_low, 1.0 - y)
    return _solve_T(sub, p, lambda T: "solid", prop, value, sub.T_min, T_low, what, form)


def _flash_below_triple(sub: Substance, p: float, prop: str, value: float, what: str) -> StatePoint:
    if sub.sublimation is None:
        raise OutOfRangeError(f"{what}: below the triple-point pressure, {NO_SUBLIMATION}")
    T_s = temperature_on(sub.sublimation, p)
    form = sub.sublimation.solid_form
    vapor = phase_state(sub, T_s, p, "vapor")
    v_vap = held_value(vapor, prop)
    assert v_vap is not None
    if value >= v_vap:
        return _solve_T(sub, p, lambda T: "vapor", prop, value, T_s, sub.T_max, what)
    solid = phase_state(sub, T_s, p, "solid", form)
    v_sol = held_value(solid, prop)
    assert v_sol is not None
    if value >= v_sol:
        y = (v_vap - value) / (v_vap - v_sol)
        return mixture(T_s, p, "solid+vapor", solid, vapor, 1.0 - y)
    return _solve_T(sub, p, lambda T: "solid", prop, value, sub.T_min, T_s, what, form)


def _saturated(
    sub: Substance, T: float, p: float, sat: tuple[tuple[float, ...], ...] | None = None
) -> tuple[StatePoint, StatePoint]:
    """The saturated liquid and vapor at T [K] on the vapor-pressure curve (vapor pressure p);
    ``sat`` is the fluid model's saturation answer at T where it is known already."""
    (hl, sl, rl), (hv, sv, rv) = sat if sat is not None else sub.fluid.saturated(T)
    return (
        StatePoint(T, p, "liquid", h=hl, s=sl, rho=rl, model=EOS_MODEL),
        StatePoint(T, p, "vapor", h=hv, s=sv, rho=rv, model=EOS_MODEL),
    )


def flash_Tv(sub: Substance, T: float, v: float) -> StatePoint:
    """The state at temperature T [K] with specific volume v [m3/kg] (a sealed vessel)."""
    T_t, _ = sub.triple
    T_c, _ = sub.critical
    rho = 1.0 / v
    what = f"{sub.name} at T = {T:.6g} K and density {rho:.6g} kg/m3"
    if T < T_t:
        return _sealed_below_triple(sub, T, v, what)
    if T <= T_c:
        sat = sub.fluid.saturated(T)
        (_, _, rho_l), (_, _, rho_v) = sat
        if rho_l > rho > rho_v:
            assert sub.vapor is not None
            liquid, vapor = _saturated(sub, T, sub.vapor.p_of_T(T), sat)
            x = (v - 1 / rho_l) / (1 / rho_v - 1 / rho_l)
            return mixture(T, liquid.p, "liquid+vapor", liquid, vapor, x)
    p, h, s = sub.fluid.state_DT(rho, T)
    if p > sub.p_max:
        raise OutOfRangeError(
            f"{what}: the sealed contents would reach p = {p:.6g} Pa, above the highest pressure "
            f"the models of {sub.name} cover ({sub.p_max:.6g} Pa)"
        )
    phase, form = sub.classify(T, p)
    if phase == "solid":
        raise OutOfRangeError(
            f"{what}: the sealed contents would freeze (p = {p:.6g} Pa); "
            f"a solid-liquid split at constant volume is not modelled"
        )
    return StatePoint(T, p, phase, form, h=h, s=s, rho=rho, model=EOS_MODEL)


def _sealed_below_triple(sub: Substance, T: float, v: float, what: str) -> StatePoint:
    rho = 1.0 / v
    if sub.sublimation is None:
        raise OutOfRangeError(f"{what}: below the triple-point temperature, {NO_SUBLIMATION}")
    p_s = sub.sublimation.p_of_T(T)
    vapor = phase_state(sub, T, p_s, "vapor")
    assert vapor.rho is not None
    if rho <= vapor.rho:

        def density_gap(p: float) -> float:
            d = phase_state(sub, T, p, "vapor").rho
            assert d is not None
            return d - rho

        p = find_root(density_gap, p_s * 1e-12, p_s, what=f"the vapor pressure of {what}").root
        return single_state(sub, T, p, "vapor")
    form = sub.sublimation.solid_form
    solid = phase_state(sub, T, p_s, "solid", form)
    assert solid.rho is not None
    if rho > solid.rho:
        raise OutOfRangeError(f"{what}: denser than the solid; no state fits")
    # mass fraction of solid from v = y v_s + (1 - y) v_v
    y = (1 / vapor.rho - v) / (1 / vapor.rho - 1 / solid.rho)
    return mixture(T, p_s, "solid+vapor", solid, vapor, 1.0 - y)
