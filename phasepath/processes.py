"""States along legs that hold v, h or s constant: sealed vessels, valves, compressors.

A state is found from the leg's fixed property and its moving coordinate (the pressure of a
constant-enthalpy or constant-entropy leg, the temperature of a constant-volume leg). Where the
fixed property falls between those of two coexisting phases the state is a mixture on the
boundary, with the vapor (or solid) fraction by mass from the lever rule:

* liquid + vapor: the reference EOS on its vapor-pressure curve;
* solid + vapor below the triple-point pressure: the published sublimation curve, the EOS gas
  branch (extrapolated below the triple-point temperature, where the vapor is dilute) and the
  published solid model (water ice Ih: IAPWS R10-06; CO2: Jäger & Span 2012);
* solid + liquid on the melting curve, with the same solid models.

So a CO2 liquid let down through a valve to 1 atm becomes a solid-vapor mixture at the
sublimation temperature (dry-ice snow) instead of a refused state.
"""

from __future__ import annotations

import math
from collections.abc import Callable
from typing import TYPE_CHECKING

from scipy.optimize import brentq

from .errors import OutOfRangeError, PhasePathError
from .report import StatePoint
from .thermo import NoModel, phase_props

if TYPE_CHECKING:  # pragma: no cover
    from .boundaries import Boundary
    from .substances import Substance

__all__ = ["single_state", "flash_p", "flash_Tv", "state_key", "CURVED_KINDS", "trace"]

#: Leg kinds whose path on the P-T diagram is a curve found from the equation of state.
CURVED_KINDS = ("isochore", "isenthalp", "isentrope")

_IDX = {"h": 0, "s": 1}
_SAMPLES = 24  # states sampled along a curved leg before refining each change of phase
_REL = 1e-12  # relative width of the bracket at which a change of phase is located


def _v(props: tuple[float, float, float, str], i: int) -> float:
    """Property i (0: h, 1: s, 2: rho) of a (h, s, rho, model) tuple."""
    return float(props[i])


def state_key(s: StatePoint) -> tuple[str, str | None]:
    return s.phase, s.form


def single_state(
    sub: Substance, T: float, p: float, phase: str, form: str | None = None
) -> StatePoint:
    """A single-phase state with h, s, rho where a model covers it (else None, reason in model)."""
    try:
        h, s, rho, model = phase_props(sub, T, p, phase, form)
    except NoModel as exc:
        return StatePoint(T, p, phase, form, model=str(exc))
    return StatePoint(T, p, phase, form, h=h, s=s, rho=rho, model=model)


def _mixture(
    T: float,
    p: float,
    phases: str,
    form: str | None,
    a: tuple[float, float, float, str],
    b: tuple[float, float, float, str],
    frac_b: float,
    solid_first: bool,
) -> StatePoint:
    """Lever-rule mixture of phase a (fraction 1 - frac_b) and phase b (fraction frac_b)."""
    h = (1 - frac_b) * a[0] + frac_b * b[0]
    s = (1 - frac_b) * a[1] + frac_b * b[1]
    v = (1 - frac_b) / a[2] + frac_b / b[2]
    model = "; ".join(sorted({a[3], b[3]}))
    vapor = frac_b if phases.endswith("vapor") else None
    solid = (1 - frac_b) if solid_first else None
    if phases == "liquid+vapor":
        vapor, solid = frac_b, None
    return StatePoint(
        T,
        p,
        phases,
        form,
        vapor_fraction=vapor,
        solid_fraction=solid,
        h=h,
        s=s,
        rho=1.0 / v,
        model=model,
    )


def temperature_on(b: Boundary, p: float) -> float:
    roots = b.temperatures_at(p)
    if not roots:
        raise OutOfRangeError(
            f"p = {p!r} Pa is outside the {b.label} curve ({b.T_min:g} K to {b.T_max:g} K)"
        )
    return roots[0][0]


def _fluid_phase(sub: Substance, T: float, p: float) -> str:
    T_c, p_c = sub.critical
    if T > T_c:
        return "supercritical" if p > p_c else "vapor"
    if T >= sub.triple[0] and sub.vapor is not None and p <= sub.vapor.p_of_T(T):
        return "vapor"
    return "liquid" if T >= sub.triple[0] or p > sub.triple[1] else "vapor"


def _solve_T(f: Callable[[float], float], lo: float, hi: float, what: str) -> float:
    flo, fhi = f(lo), f(hi)
    if flo * fhi > 0:
        # a root on a boundary end can miss the bracket by rounding of the property calls
        end, fend = (lo, flo) if abs(flo) < abs(fhi) else (hi, fhi)
        if abs(fend) <= 1e-9 * max(abs(flo), abs(fhi)):
            return end
    if flo == 0.0:
        return lo
    if fhi == 0.0:
        return hi
    if flo * fhi > 0:
        raise OutOfRangeError(f"{what}: no temperature between {lo:.6g} K and {hi:.6g} K fits")
    return float(brentq(f, lo, hi, xtol=1e-10, rtol=1e-13))


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
    """A single-phase fluid state: CoolProp's own (p, h) or (p, s) flash, checked; else brentq.

    ``side`` ("liquid" or "vapor") is the side of the vapor-pressure curve the state is on,
    known from the saturation values; None above the critical pressure.
    """
    assert sub.eos is not None

    def phase_of(T: float) -> str:
        return side if side is not None else _fluid_phase(sub, T, p)

    try:
        T, h, s, rho, q = sub.eos.flash(prop, p, value)
        if lo <= T <= hi and not (0.0 <= q <= 1.0):
            return StatePoint(
                T, p, phase_of(T), None, h=h, s=s, rho=rho, model="reference EOS (CoolProp)"
            )
    except PhasePathError:
        pass
    i = _IDX[prop]
    T = _solve_T(lambda T: _v(phase_props(sub, T, p, phase_of(T)), i) - value, lo, hi, what)
    return single_state(sub, T, p, phase_of(T))


def melting_temperature(sub: Substance, p: float) -> tuple[float, str | None] | None:
    """Lowest fluid temperature at pressure p (the melting temperature) and the solid's form."""
    best: tuple[float, str | None] | None = None
    for b in sub.melting:
        for T, _, _ in b.temperatures_at(p):
            if best is None or T > best[0]:
                best = (T, b.solid_form)
    return best


def flash_p(sub: Substance, p: float, prop: str, value: float) -> StatePoint:
    """The state at pressure p [Pa] with h [J/kg] or s [J/(kg K)] equal to ``value``."""
    i = _IDX[prop]
    T_t, p_t = sub.triple
    T_c, p_c = sub.critical
    what = f"{sub.name} at p = {p:.6g} Pa with {prop} = {value:.6g}"
    if sub.eos is None:
        raise NoModel(f"{sub.name} has no equation of state: {prop} cannot be held constant")
    if p < p_t:
        if sub.sublimation is None:
            from .substances import NO_SUBLIMATION

            raise OutOfRangeError(f"{what}: below the triple-point pressure, {NO_SUBLIMATION}")
        T_s = temperature_on(sub.sublimation, p)
        form = sub.sublimation.solid_form
        vap = phase_props(sub, T_s, p, "vapor")
        if value >= _v(vap, i):
            T = _solve_T(
                lambda T: _v(phase_props(sub, T, p, "vapor"), i) - value, T_s, sub.T_max, what
            )
            return single_state(sub, T, p, "vapor")
        sol = phase_props(sub, T_s, p, "solid", form)
        if value >= _v(sol, i):
            y = (_v(vap, i) - value) / (_v(vap, i) - _v(sol, i))
            return _mixture(T_s, p, "solid+vapor", form, sol, vap, 1.0 - y, solid_first=True)
        T = _solve_T(
            lambda T: _v(phase_props(sub, T, p, "solid", form), i) - value, sub.T_min, T_s, what
        )
        return single_state(sub, T, p, "solid", form)
    upper = sub.T_max
    if p < p_c:
        assert sub.eos is not None
        T_s = sub.eos.T_sat(p)
        sat_l, sat_v = sub.eos.saturated(T_s)
        lq = (*sat_l, "reference EOS (CoolProp)")
        vp = (*sat_v, "reference EOS (CoolProp)")
        if value > _v(vp, i):
            return _fluid_by_flash(sub, p, prop, value, T_s, sub.T_max, what, "vapor")
        if value > _v(lq, i) or (value == _v(lq, i) and value == _v(vp, i)):
            x = (value - _v(lq, i)) / (_v(vp, i) - _v(lq, i))
            return _mixture(T_s, p, "liquid+vapor", None, lq, vp, x, solid_first=False)
        upper = T_s
    melt = melting_temperature(sub, p)
    T_low = melt[0] if melt else T_t
    fluid_low = phase_props(sub, T_low, p, _fluid_phase(sub, T_low * (1 + 1e-12), p))
    if value >= _v(fluid_low, i) or melt is None:
        side = "liquid" if p < p_c else None
        return _fluid_by_flash(sub, p, prop, value, T_low, upper, what, side)
    form = melt[1]
    sol = phase_props(sub, T_low, p, "solid", form)
    if value >= _v(sol, i):
        y = (_v(fluid_low, i) - value) / (_v(fluid_low, i) - _v(sol, i))
        fl = _fluid_phase(sub, T_low * (1 + 1e-12), p)
        return _mixture(T_low, p, f"solid+{fl}", form, sol, fluid_low, 1.0 - y, solid_first=True)
    T = _solve_T(
        lambda T: _v(phase_props(sub, T, p, "solid", form), i) - value, sub.T_min, T_low, what
    )
    return single_state(sub, T, p, "solid", form)


def flash_Tv(sub: Substance, T: float, v: float) -> StatePoint:
    """The state at temperature T [K] with specific volume v [m3/kg] (a sealed vessel)."""
    if sub.eos is None:
        raise NoModel(f"{sub.name} has no equation of state: the volume cannot be held constant")
    T_t, _ = sub.triple
    T_c, _ = sub.critical
    rho = 1.0 / v
    what = f"{sub.name} at T = {T:.6g} K and density {rho:.6g} kg/m3"
    if T < T_t:
        if sub.sublimation is None:
            from .substances import NO_SUBLIMATION

            raise OutOfRangeError(f"{what}: below the triple-point temperature, {NO_SUBLIMATION}")
        p_s = sub.sublimation.p_of_T(T)
        vap = phase_props(sub, T, p_s, "vapor")
        if rho <= vap[2]:
            p = float(
                brentq(
                    lambda p: phase_props(sub, T, p, "vapor")[2] - rho,
                    p_s * 1e-12,
                    p_s,
                    xtol=1e-300,
                    rtol=1e-13,
                )
            )
            return single_state(sub, T, p, "vapor")
        form = sub.sublimation.solid_form
        sol = phase_props(sub, T, p_s, "solid", form)
        if rho > sol[2]:
            raise OutOfRangeError(f"{what}: denser than the solid; no state fits")
        # mass fraction of solid from v = y v_s + (1 - y) v_v
        y = (1 / vap[2] - v) / (1 / vap[2] - 1 / sol[2])
        return _mixture(T, p_s, "solid+vapor", form, sol, vap, 1.0 - y, solid_first=True)
    if T <= T_c:
        sat_l, sat_v = sub.eos.saturated(T)
        if sat_l[2] > rho > sat_v[2]:
            x = (v - 1 / sat_l[2]) / (1 / sat_v[2] - 1 / sat_l[2])
            p = sub.vapor.p_of_T(T) if sub.vapor is not None else math.nan
            lq = (*sat_l, "reference EOS (CoolProp)")
            vp = (*sat_v, "reference EOS (CoolProp)")
            return _mixture(T, p, "liquid+vapor", None, lq, vp, x, solid_first=False)
    p, h, s = sub.eos.state_DT(rho, T)
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
    return StatePoint(T, p, phase, form, h=h, s=s, rho=rho, model="reference EOS (CoolProp)")


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
        while state_key(sa) != state_key(sb):
            lo, slo, hi, shi = a, sa, b, sb
            count = 0
            while abs(hi - lo) > _REL * max(abs(lo), abs(hi)):
                m = 0.5 * (lo + hi)
                sm = state_at(m)
                count += 1
                if state_key(sm) == state_key(slo):
                    lo, slo = m, sm
                else:
                    hi, shi = m, sm
            events.append((slo, shi, count))
            a, sa = hi, shi
    return states, events


def describe_change(before: str, after: str) -> str:
    """A few words on what happens at a change between phases or mixtures."""
    table = {
        ("liquid", "liquid+vapor"): "bubble point: vapor starts to form",
        ("liquid+vapor", "vapor"): "dew point: the last liquid has vaporized",
        ("vapor", "liquid+vapor"): "dew point: liquid starts to form",
        ("liquid+vapor", "liquid"): "bubble point: no vapor left (liquid-full)",
        ("liquid+vapor", "solid+vapor"): (
            "triple point: the liquid turns to solid and vapor (latent heat shown: fusion)"
        ),
        ("solid+vapor", "liquid+vapor"): "triple point: the solid melts",
        ("vapor", "solid+vapor"): "solid starts to deposit from the vapor",
        ("solid+vapor", "vapor"): "the last solid has sublimed",
        ("solid", "solid+vapor"): "sublimation starts",
        ("solid+vapor", "solid"): "the last vapor has deposited",
        ("liquid", "solid+liquid"): "freezing starts",
        ("solid+liquid", "liquid"): "the last solid has melted",
        ("solid+liquid", "solid"): "the last liquid has frozen",
        ("solid", "solid+liquid"): "melting starts",
    }
    return table.get((before, after), "")
