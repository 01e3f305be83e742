"""Enthalpy, entropy and density of route states; latent heats; heat and work per leg.

Fluid states come from the reference equation of state (CoolProp), with the phase imposed so
that states next to a boundary are computed on the right side of it. Vapor below the triple-point
temperature is the EOS gas branch extrapolated to low pressure (named in the report). Solid states
are covered where phasepath has a published solid model whose reference state matches the
fluid's equation of state:

* water ice Ih: IAPWS R10-06 (reference state of IAPWS-95, which CoolProp uses for water);
* solid CO2: Jäger & Span (2012) (reference state of Span & Wagner 1996, which CoolProp uses).

So a latent heat is a plain difference of enthalpies, h_fluid - h_solid or h'' - h'.
"""

from __future__ import annotations

from typing import TYPE_CHECKING

from .errors import PhasePathError

if TYPE_CHECKING:  # pragma: no cover
    from .report import StatePoint
    from .substances import Substance

__all__ = ["phase_props", "latent_heat", "leg_heat_work", "NoModel", "BASES", "EOS_MODEL"]

_FIRST_ORDER = {"melting", "freezing", "vaporization", "condensation", "sublimation", "deposition"}
EOS_MODEL = "reference EOS (CoolProp)"
ICE_MODEL = "ice Ih: IAPWS R10-06"
CO2_SOLID_MODEL = "solid CO2: Jäger & Span 2012"

#: Heat-and-work bases a report can be computed on.
BASES = ("steady-flow", "closed")


class NoModel(PhasePathError):
    """No model covers a state; the message is the reason shown to the user."""


def phase_props(
    sub: Substance, T: float, p: float, phase: str, form: str | None = None
) -> tuple[float, float, float, str]:
    """(h [J/kg], s [J/(kg K)], rho [kg/m3], model) of a single-phase state, or raise NoModel."""
    if phase == "solid":
        return _solid_props(sub, T, p, form)
    if sub.eos is None:
        raise NoModel(f"{sub.name} has no equation of state in phasepath")
    try:
        h, s, rho = sub.eos.state(T, p, phase)
    except PhasePathError as exc:
        raise NoModel(str(exc)) from None
    model = EOS_MODEL
    if T < sub.triple[0] and phase == "vapor":
        model += ", gas branch extrapolated below the triple point"
    return h, s, rho, model


def _solid_props(
    sub: Substance, T: float, p: float, form: str | None
) -> tuple[float, float, float, str]:
    try:
        if sub.name == "Water" and form == "Ih":
            from .correlations import ice_ih

            return (
                ice_ih.enthalpy_ice_ih(T, p),
                ice_ih.entropy_ice_ih(T, p),
                1.0 / ice_ih.volume_ice_ih(T, p),
                ICE_MODEL,
            )
        if sub.name == "CarbonDioxide":
            from .correlations import co2

            return (
                co2.solid_enthalpy_co2(T, p),
                co2.solid_entropy_co2(T, p),
                1.0 / co2.solid_volume_co2(T, p),
                CO2_SOLID_MODEL,
            )
    except PhasePathError as exc:
        raise NoModel(str(exc)) from None
    if sub.name == "Water":
        what = f"ice {form}" if form else "the high-pressure ice"
    else:
        what = f"solid {sub.name}"
    raise NoModel(f"phasepath has no published model of {what}")


def _involved(before: str, after: str) -> tuple[str, str] | None:
    """The (lost, gained) single phases of a transition between phases or mixtures."""
    b, a = set(before.split("+")), set(after.split("+"))
    lost, gained = b - a, a - b
    if len(lost) == 1 and len(gained) == 1:
        return lost.pop(), gained.pop()
    both = b | a
    if len(both) == 2:  # e.g. liquid -> liquid+vapor: liquid turns to vapor
        x, y = sorted(both)
        return (x, y) if gained == {y} or lost == {x} else (y, x)
    return None


def latent_heat(
    sub: Substance,
    kind: str,
    T: float,
    p: float,
    before: tuple[str, str | None],
    after: tuple[str, str | None],
) -> tuple[float | None, str | None, str]:
    """(latent heat [J/kg] > 0, model, note) of a crossing; (None, None, reason) where unknown."""
    if kind not in _FIRST_ORDER:
        return None, None, "not a first-order transition: no latent heat"
    if sub.eos is None:  # built from vapor-pressure data: Clausius-Clapeyron, marked approximate
        from .custom import approximate_latent_heat

        return approximate_latent_heat(sub, kind, T, p, before, after)
    pair = _involved(before[0], after[0])
    if pair is None:
        return None, None, "no single pair of phases to take a latent heat between"
    phases = set(pair)
    if phases == {"liquid", "vapor"} and sub.eos is not None:
        try:
            return sub.eos.latent_heat_vaporization(T), EOS_MODEL + ", saturation", ""
        except PhasePathError as exc:
            return None, None, str(exc)
    if "solid" in phases:
        fluid = (phases - {"solid"}).pop()
        form = before[1] if "solid" in before[0] else after[1]
        try:
            h_s, _, _, m_s = phase_props(sub, T, p, "solid", form)
            h_f, _, _, m_f = phase_props(sub, T, p, fluid)
        except NoModel as exc:
            return None, None, str(exc)
        return h_f - h_s, f"{m_f} minus {m_s}", ""
    return None, None, "no model for this transition"


def leg_heat_work(
    kind: str, start: StatePoint, end: StatePoint, basis: str = "steady-flow"
) -> tuple[float | None, float | None, str]:
    """Heat into and work done on the substance per kg over a leg, on the chosen basis.

    steady-flow (per kg flowing through a device; reversible except the throttle):
    isobar q = Δh, w = 0; isotherm q = TΔs, w = Δh - TΔs; isochore w = vΔp, q = Δh - vΔp;
    isenthalp (valve) q = 0, w = 0; isentrope (ideal compressor/expander) q = 0, w = Δh.
    closed (per kg in a closed vessel, reversible): w = -∫p dv, q = Δu - w; isochore w = 0;
    isotherm q = TΔs; isentrope q = 0. A throttle has no closed-vessel form.
    """
    if None in (start.h, end.h, start.s, end.s, start.rho, end.rho):
        return None, None, start.model if start.h is None else end.model
    assert start.h is not None and end.h is not None and start.s is not None and end.s is not None
    assert start.rho is not None and end.rho is not None
    dh, ds = end.h - start.h, end.s - start.s
    u0, u1 = start.h - start.p / start.rho, end.h - end.p / end.rho
    du = u1 - u0
    note = "; ".join(sorted({start.model, end.model}))
    if basis == "steady-flow":
        if kind == "isobar":
            return dh, 0.0, note
        if kind == "isotherm":
            return start.T * ds, dh - start.T * ds, note
        if kind == "isochore":
            w = (end.p - start.p) / start.rho
            return dh - w, w, note
        if kind == "isenthalp":
            return 0.0, 0.0, note + "; throttling: adiabatic, no shaft work"
        if kind == "isentrope":
            return 0.0, dh, note
    elif basis == "closed":
        if kind == "isobar":
            w = -start.p * (1.0 / end.rho - 1.0 / start.rho)
            return du - w, w, note
        if kind == "isotherm":
            return start.T * ds, du - start.T * ds, note
        if kind == "isochore":
            return du, 0.0, note
        if kind == "isentrope":
            return 0.0, du, note
        if kind == "isenthalp":
            return None, None, "a throttle is a flow process: no closed-vessel heat and work"
    return None, None, f"no heat and work basis {basis!r} for a {kind} leg"
