"""Enthalpy and entropy of route states, latent heats at crossings, heat and work per leg.

Fluid states come from the reference equation of state (CoolProp), with the phase imposed so
that states next to a boundary are computed on the right side of it. Vapor below the triple-point
temperature is the EOS gas branch extrapolated to low pressure (named in the report). Solid states
are covered where phasepath has a published solid model: water's ice Ih (IAPWS R10-06, consistent
with the IAPWS-95 reference state) and solid CO2 (see :mod:`phasepath.correlations.co2`).
"""

from __future__ import annotations

from typing import TYPE_CHECKING

from .errors import PhasePathError

if TYPE_CHECKING:  # pragma: no cover
    from .report import StatePoint
    from .substances import Substance

__all__ = ["state_hs", "latent_heat", "leg_heat_work", "NoModel"]

_FIRST_ORDER = {"melting", "freezing", "vaporization", "condensation", "sublimation", "deposition"}
EOS_MODEL = "reference EOS (CoolProp)"


class NoModel(Exception):
    """No model covers a state; the message is the reason shown to the user."""


def state_hs(sub: Substance, T: float, p: float, phase: str, form: str | None) -> tuple[float, float, str]:
    """(h [J/kg], s [J/(kg K)], model name) of a state, or raise NoModel with the reason."""
    if phase == "solid":
        return _solid_hs(sub, T, p, form)
    if sub.eos is None:
        raise NoModel(f"{sub.name} has no equation of state in phasepath")
    try:
        h, s, _ = sub.eos.state(T, p, phase)
    except PhasePathError as exc:
        raise NoModel(str(exc)) from None
    model = EOS_MODEL
    if T < sub.triple[0]:
        model += ", gas branch extrapolated below the triple point"
    return h, s, model


def _solid_hs(sub: Substance, T: float, p: float, form: str | None) -> tuple[float, float, str]:
    if sub.name == "Water" and form == "Ih":
        try:
            from .correlations import ice_ih
        except ImportError:  # pragma: no cover
            raise NoModel("no model of ice Ih available") from None
        try:
            return ice_ih.enthalpy(T, p), ice_ih.entropy(T, p), "ice Ih: IAPWS R10-06"
        except PhasePathError as exc:
            raise NoModel(str(exc)) from None
    what = f"ice {form}" if sub.name == "Water" and form else f"solid {sub.name}"
    if sub.name == "Water" and not form:
        what = "the high-pressure ice"
    raise NoModel(f"phasepath has no published model of {what}")


def latent_heat(sub: Substance, kind: str, T: float, p: float, before: tuple[str, str | None],
                after: tuple[str, str | None]) -> tuple[float | None, str | None, str]:
    """(latent heat [J/kg] > 0, model, note) of a crossing; (None, None, reason) where unknown."""
    if kind not in _FIRST_ORDER:
        return None, None, "not a first-order transition: no latent heat"
    phases = {before[0], after[0]}
    if phases == {"liquid", "vapor"} and sub.eos is not None:
        try:
            return sub.eos.latent_heat_vaporization(T), EOS_MODEL + ", saturation", ""
        except PhasePathError as exc:
            return None, None, str(exc)
    solid, fluid = (before, after) if before[0] == "solid" else (after, before)
    if solid[0] == "solid":
        special = _solid_latent_heat(sub, kind, T, p, solid, fluid)
        if special is not None:
            return special
        try:
            h_s, _, m_s = state_hs(sub, T, p, "solid", solid[1])
            h_f, _, m_f = state_hs(sub, T, p, fluid[0], fluid[1])
        except NoModel as exc:
            return None, None, str(exc)
        return h_f - h_s, f"{m_f} minus {m_s}", ""
    return None, None, "no model for this transition"


def _solid_latent_heat(sub: Substance, kind: str, T: float, p: float,
                       solid: tuple[str, str | None], fluid: tuple[str, str | None]
                       ) -> tuple[float | None, str | None, str] | None:
    """Latent heats from a substance-specific published solid model (CO2)."""
    if sub.name != "CarbonDioxide" or sub.eos is None:
        return None
    try:
        from .correlations import co2
    except ImportError:  # pragma: no cover
        return None
    phase = fluid[0]
    try:
        if phase == "vapor" and T <= sub.triple[0]:
            _, _, rho = sub.eos.state(T, p, "vapor")
            return co2.latent_heat_sublimation_co2(T, 1.0 / rho), co2.LATENT_HEAT_MODEL, ""
        if phase in ("liquid", "supercritical"):
            _, _, rho = sub.eos.state(T, p, phase)
            return co2.latent_heat_fusion_co2(T, 1.0 / rho), co2.LATENT_HEAT_MODEL, ""
    except (PhasePathError, AttributeError) as exc:
        return None, None, str(exc)
    return None


def leg_heat_work(sub: Substance, kind: str, start: StatePoint, end: StatePoint
                  ) -> tuple[float | None, float | None, str]:
    """Reversible steady-flow heat and work per kg of a constant-p or constant-T leg."""
    try:
        h0, s0, m0 = state_hs(sub, start.T, start.p, start.phase, start.form)
        h1, s1, m1 = state_hs(sub, end.T, end.p, end.phase, end.form)
    except NoModel as exc:
        return None, None, str(exc)
    models = sorted({m0, m1})
    note = "; ".join(models)
    if kind == "isobar":
        return h1 - h0, 0.0, note
    if kind == "isotherm":
        q = start.T * (s1 - s0)
        return q, (h1 - h0) - q, note
    return None, None, f"no heat and work basis for a {kind} leg"  # pragma: no cover
