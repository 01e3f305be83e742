"""The models a substance carries: single-phase states, the solid, latent heats.

A :class:`~phasepath.substances.Substance` holds three model objects, chosen when it is built:

* ``fluid``: the reference equation of state (:class:`phasepath.eos.EOS`), or a
  :class:`NoFluidModel` that says why there is none (a substance built from data);
* ``solids``: a :class:`SolidModel`: the solid's common name ("dry ice"), the forms it names
  (water's ices) and its published property model where phasepath has one
  (:class:`IceModels`: water ice Ih, IAPWS R10-06; :class:`DryIce`: Jäger & Span 2012);
* ``latent``: a latent-heat model (:class:`EnthalpyDifference` from the fluid and solid models,
  or :class:`ClausiusClapeyron` for a substance built from data).

:func:`phase_state` is the one door to a single-phase state: it returns the state record with
h, s and rho, or raises :class:`~phasepath.errors.NoModelError` with the reason.

Fluid states come from the reference equation of state with the phase imposed, so that states
next to a boundary are computed on the right side of it. Vapor below the triple-point temperature
is the EOS gas branch extrapolated to low pressure (named in the state's ``model``). The solid
models share the reference state of the fluid's equation of state (IAPWS-95 for water, Span &
Wagner 1996 for CO2), so a latent heat is a plain difference of enthalpies.
"""

from __future__ import annotations

from typing import TYPE_CHECKING

from .correlations import co2, ice_ih, seafreeze_ices, water_ice_phases
from .correlations.vapor_pressure import R
from .errors import NoModelError, OutOfRangeError, PhasePathError
from .records import CROSSING_KINDS, LatentHeat, StatePoint

if TYPE_CHECKING:  # pragma: no cover
    from .substances import Substance

__all__ = [
    "phase_state",
    "NoFluidModel",
    "SolidModel",
    "NoSolidModel",
    "IceModels",
    "DryIce",
    "EnthalpyDifference",
    "ClausiusClapeyron",
    "EOS_MODEL",
    "FIRST_ORDER",
]

EOS_MODEL = "reference EOS (CoolProp)"
#: Crossing kinds that have a latent heat (every kind but the supercritical ones).
FIRST_ORDER = tuple(k for k in CROSSING_KINDS if not k.startswith("supercritical"))


def phase_state(
    sub: Substance, T: float, p: float, phase: str, form: str | None = None
) -> StatePoint:
    """A single-phase state with h, s and rho, or NoModelError with the reason."""
    if phase == "solid":
        return sub.solids.state(T, p, form)
    try:
        h, s, rho = sub.fluid.state(T, p, phase)
    except NoModelError:
        raise
    except PhasePathError as exc:
        raise NoModelError(str(exc)) from exc
    model = EOS_MODEL
    if T < sub.triple[0] and phase == "vapor":
        model += ", gas branch extrapolated below the triple point"
    return StatePoint(T, p, phase, h=h, s=s, rho=rho, model=model)


# -- fluid ----------------------------------------------------------------------------------------
class NoFluidModel:
    """The fluid model of a substance without an equation of state: every call says why."""

    def __init__(self, name: str) -> None:
        self.name = name
        self.reason = f"{name} has no equation of state in phasepath"

    def _refuse(self, *args: object) -> tuple[float, ...]:
        raise NoModelError(self.reason)

    state = saturated = state_DT = flash = latent_heat_vaporization = T_sat = p_sat = _refuse


# -- solids ---------------------------------------------------------------------------------------
class SolidModel:
    """What phasepath knows of a substance's solid.

    Attributes
    ----------
    name : str
        Its common name in hazard texts ("dry ice", "ice", "solid nitrogen").
    sources : tuple of str
        Bibliography ids of the property model.
    """

    name = "solid"
    sources: tuple[str, ...] = ()

    def form_at(self, T: float, p: float) -> str | None:
        """The named form of the solid stable at (T, p) below every melting branch, or None."""
        return None

    def state(self, T: float, p: float, form: str | None = None) -> StatePoint:
        """The solid state with h, s and rho, or NoModelError."""
        raise NoModelError(f"phasepath has no published model of {self.name}")

    def prefetch(self, Ts: list[float], ps: list[float], forms: list[str | None]) -> None:
        """Evaluate many states at once where the model can (a speed-up only)."""


class NoSolidModel(SolidModel):
    """A solid without a published property model in phasepath."""

    def __init__(self, substance_name: str) -> None:
        self.name = f"solid {substance_name}"


class IceModels(SolidModel):
    """Water's ices, named by one function and modelled where a published model exists.

    The form of ice at a state is :func:`phasepath.correlations.water_ice_phases.ice_form`
    (Dunaeva et al. 2010 between the ices, IAPWS R14-08 at the melting curves) from 200 K up;
    below 200 K, outside the solid-solid lines of that source, ice Ih is named up to the
    Ih-III-liquid triple-point pressure (IAPWS R14-08, Table 1: 208.566 MPa) and no form above.
    Properties: ice Ih from IAPWS R10-06 (reference state of IAPWS-95); ices II, III, V and VI
    from the Gibbs-energy representations of Journaux et al. (2020) where the optional package
    seafreeze is installed (``pip install phasepath[ices]``, same reference state); none for
    ice VII.
    """

    name = "ice"
    sources = (ice_ih.SOURCE, "Dunaeva2010", "Journaux2020")
    MODEL = "ice Ih: IAPWS R10-06"
    SEAFREEZE_MODEL = "ice {form}: Journaux et al. 2020 (seafreeze)"
    #: Below 200 K ice Ih is named up to the Ih-III-liquid triple point (IAPWS R14-08, Table 1:
    #: 208.566 MPa).
    IH_TOP = 208.566e6

    def form_at(self, T: float, p: float) -> str | None:
        if T >= water_ice_phases.T_MIN and p <= water_ice_phases.P_MAX:
            try:
                return water_ice_phases.ice_form(T, p)
            except OutOfRangeError:  # on the fluid side of R14-08 by rounding: the branch's ice
                pass
        return "Ih" if p <= self.IH_TOP else None

    def prefetch(self, Ts: list[float], ps: list[float], forms: list[str | None]) -> None:
        for form in {f for f in forms if f in ("II", "III", "V", "VI")}:
            pick = [(T, p) for T, p, f in zip(Ts, ps, forms, strict=True) if f == form]
            try:
                seafreeze_ices.prefetch(form, [T for T, _ in pick], [p for _, p in pick])
            except seafreeze_ices.MissingExtraError:
                return

    def state(self, T: float, p: float, form: str | None = None) -> StatePoint:
        if form in ("II", "III", "V", "VI"):
            try:
                st = seafreeze_ices.seafreeze_state(form, T, p)
            except seafreeze_ices.MissingExtraError as exc:
                raise NoModelError(f"ice {form} needs its optional model: {exc}") from exc
            except PhasePathError as exc:
                raise NoModelError(str(exc)) from exc
            model = self.SEAFREEZE_MODEL.format(form=form)
            return StatePoint(T, p, "solid", form, h=st.h, s=st.s, rho=st.rho, model=model)
        if form != "Ih":
            what = f"ice {form}" if form else "the high-pressure ice"
            raise NoModelError(f"phasepath has no published model of {what}")
        try:
            h = ice_ih.enthalpy_ice_ih(T, p)
            s = ice_ih.entropy_ice_ih(T, p)
            v = ice_ih.volume_ice_ih(T, p)
        except PhasePathError as exc:
            raise NoModelError(str(exc)) from exc
        return StatePoint(T, p, "solid", form, h=h, s=s, rho=1.0 / v, model=self.MODEL)


class DryIce(SolidModel):
    """Solid CO2 from the Gibbs-energy equation of Jäger & Span (2012), whose reference state is
    that of Span & Wagner (1996)."""

    name = "dry ice"
    sources = (co2.SOURCE_SOLID,)
    MODEL = "solid CO2: Jäger & Span 2012"

    def state(self, T: float, p: float, form: str | None = None) -> StatePoint:
        try:
            h = co2.solid_enthalpy_co2(T, p)
            s = co2.solid_entropy_co2(T, p)
            v = co2.solid_volume_co2(T, p)
        except PhasePathError as exc:
            raise NoModelError(str(exc)) from exc
        return StatePoint(T, p, "solid", form, h=h, s=s, rho=1.0 / v, model=self.MODEL)


# -- latent heats -------------------------------------------------------------------------------
def _involved(before: str, after: str) -> tuple[str, str] | None:
    """The (lost, gained) single phases of a transition between phases or mixtures; between two
    mixtures at the triple point, the liquid and the solid (the latent heat of fusion)."""
    b, a = set(before.split("+")), set(after.split("+"))
    if len(a) == 2 and len(b) == 2 and {"solid", "liquid"} <= a | b:
        return ("liquid", "solid") if "solid" in a - b or "liquid" in b - a else ("solid", "liquid")
    lost, gained = b - a, a - b
    if len(lost) == 1 and len(gained) == 1:
        return next(iter(lost)), next(iter(gained))
    both = b | a
    if len(both) == 2:  # e.g. liquid -> liquid+vapor: liquid turns to vapor
        x, y = sorted(both)
        return (x, y) if gained == {y} or lost == {x} else (y, x)
    return None


class EnthalpyDifference:
    """Latent heats as differences of enthalpies from the substance's fluid and solid models:
    h'' - h' on the vapor-pressure curve, h_fluid - h_solid on the melting and sublimation
    curves."""

    def latent_heat(
        self,
        sub: Substance,
        T: float,
        p: float,
        before: tuple[str, str | None],
        after: tuple[str, str | None],
    ) -> LatentHeat:
        if before[0] == after[0] == "solid":  # one ice to another
            try:
                a = phase_state(sub, T, p, "solid", before[1])
                b = phase_state(sub, T, p, "solid", after[1])
            except NoModelError as exc:
                return LatentHeat(None, None, str(exc))
            assert a.h is not None and b.h is not None
            return LatentHeat(abs(b.h - a.h), f"{b.model} minus {a.model}")
        pair = _involved(before[0], after[0])
        if pair is None:
            return LatentHeat(None, None, "no single pair of phases to take a latent heat between")
        phases = set(pair)
        if phases == {"liquid", "vapor"}:
            try:
                return LatentHeat(sub.fluid.latent_heat_vaporization(T), EOS_MODEL + ", saturation")
            except PhasePathError as exc:
                return LatentHeat(None, None, str(exc))
        if "solid" in phases:
            fluid = (phases - {"solid"}).pop()
            form = before[1] if "solid" in before[0] else after[1]
            try:
                solid = phase_state(sub, T, p, "solid", form)
                other = phase_state(sub, T, p, fluid)
            except NoModelError as exc:
                return LatentHeat(None, None, str(exc))
            assert solid.h is not None and other.h is not None
            return LatentHeat(other.h - solid.h, f"{other.model} minus {solid.model}")
        return LatentHeat(None, None, "no model for this transition")


class ClausiusClapeyron:
    """Approximate latent heats of a substance built from data, without an equation of state.

    Vaporization and sublimation: L = R T^2 d(ln p)/dT / M along the curve crossed (ideal gas,
    condensed volume neglected). Fusion: the given or derived enthalpy of fusion / M.

    Parameters
    ----------
    molar_mass : float or None
        [kg/mol]; without it latent heats are not given per kilogram.
    enthalpy_fusion : float or None
        [J/mol].
    """

    MODEL = "approximate: Clausius-Clapeyron, ideal gas, condensed volume neglected"
    FUSION_MODEL = "approximate: enthalpy of fusion at the triple point, taken constant"

    def __init__(self, molar_mass: float | None, enthalpy_fusion: float | None) -> None:
        self.molar_mass = molar_mass
        self.enthalpy_fusion = enthalpy_fusion

    def latent_heat(
        self,
        sub: Substance,
        T: float,
        p: float,
        before: tuple[str, str | None],
        after: tuple[str, str | None],
    ) -> LatentHeat:
        phases = {before[0], after[0]}
        molar: float | None = None
        model = self.MODEL
        if phases == {"liquid", "vapor"} and sub.vapor is not None:
            molar = R * T * T * sub.vapor.slope(T)
        elif phases == {"solid", "vapor"} and sub.sublimation is not None:
            molar = R * T * T * sub.sublimation.slope(T)
        elif phases == {"solid", "liquid"}:
            if self.enthalpy_fusion is None:
                return LatentHeat(None, None, "no enthalpy of fusion given")
            molar = self.enthalpy_fusion
            model = self.FUSION_MODEL
        if molar is None:
            return LatentHeat(None, None, "no model for this transition")
        if self.molar_mass is None:
            return LatentHeat(
                None, None, f"no molar mass given: about {molar / 1e3:.4g} kJ/mol ({self.MODEL})"
            )
        return LatentHeat(molar / self.molar_mass, model)
