"""Energetics of a route: the latent heat of each crossing and the heat and work of each leg.

Latent heats come from the substance's latent-heat model (:mod:`phasepath.models`); heat and work
per kg follow from the states at the ends of a leg on the chosen basis (:data:`BASES`).
"""

from __future__ import annotations

from typing import TYPE_CHECKING

from .models import FIRST_ORDER
from .records import BASES, LatentHeat, StatePoint

if TYPE_CHECKING:  # pragma: no cover
    from .substances import Substance

__all__ = ["latent_heat", "leg_heat_work", "BASES"]


def latent_heat(
    sub: Substance,
    kind: str,
    T: float,
    p: float,
    before: tuple[str, str | None],
    after: tuple[str, str | None],
) -> LatentHeat:
    """The latent heat [J/kg] of a crossing of ``kind`` at (T, p) between two (phase, form)."""
    if kind not in FIRST_ORDER:
        return LatentHeat(None, None, "not a first-order transition: no latent heat")
    result: LatentHeat = sub.latent.latent_heat(sub, T, p, before, after)
    return result


def leg_heat_work(
    kind: str, start: StatePoint, end: StatePoint, basis: str = "steady-flow"
) -> tuple[float | None, float | None, str]:
    """(heat into, work done on the substance per kg [J/kg], note) over a leg, on the basis.

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
