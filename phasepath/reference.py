"""Substances of the reference library: a CoolProp fluid with its published curves and models.

:func:`build` makes the :class:`~phasepath.substances.Substance` of one CoolProp fluid: the vapor
pressure from its reference equation of state, the melting line (IAPWS R14-08 for water; else
CoolProp's, where it has one), the published sublimation curve where one exists
(:data:`SUBLIMATION_CURVES`), and the solid model where phasepath has a published one
(:data:`SOLID_MODELS`). Which substance gets which curve and model is data, in these two tables.

Junction rule at the triple point: every published sublimation curve is evaluated in reduced
variables with the triple point of the fluid's equation of state as its reducing point, so that it
ends exactly there (the published and EOS triple points differ by parts per million); water's ice
Ih melting curve is shifted by the constant p_t(EOS) - p_t(R14-08) (0.002 Pa); CoolProp's
melting lines are shifted by the constant that makes them pass through the EOS triple point, and
flagged unreliable where that shift amounts to more than 0.05 K along the curve.
"""

from __future__ import annotations

import math
import re
from collections.abc import Callable

from .boundaries import Boundary
from .correlations import co2, sublimation_eos
from .correlations import water_iapws as w
from .eos import EOS, fluid_info
from .errors import PhasePathError
from .models import DryIce, EnthalpyDifference, IceModels, NoSolidModel, SolidModel
from .substances import NO_SUBLIMATION, Substance

__all__ = ["build", "SUBLIMATION_CURVES", "SOLID_MODELS"]

#: CoolProp name -> (published sublimation equation, its triple point (T [K], p [Pa]),
#: lowest T [K], source id).
SUBLIMATION_CURVES: dict[str, tuple[Callable[[float], float], tuple[float, float], float, str]] = {
    "Water": (w.sublimation_pressure_ice_ih, (w.T_TRIPLE, w.P_TRIPLE), 50.0, w.SOURCE),
    "CarbonDioxide": (
        co2.sublimation_pressure_co2,
        (co2.T_TRIPLE, co2.P_TRIPLE),
        co2.SUBLIMATION_T_MIN,
        co2.SOURCE_CURVES,
    ),
    **{
        name: (
            getattr(sublimation_eos, f"sublimation_pressure_{key}"),
            sublimation_eos.CURVES[key][:2],
            sublimation_eos.CURVES[key][2],
            sublimation_eos.CURVES[key][5],
        )
        for name, key in (("Nitrogen", "nitrogen"), ("Argon", "argon"), ("Methane", "methane"))
    },
}

#: CoolProp name -> the published solid model phasepath has for it.
SOLID_MODELS: dict[str, type[SolidModel]] = {"Water": IceModels, "CarbonDioxide": DryIce}

#: CoolProp names whose melting and sublimation curves come from IAPWS R14-08 (CoolProp's own
#: melting line is not used).
IAPWS_ICES = ("Water",)

_TRIPLE_SHIFT_LIMIT = 0.05  # K: temperature offset above which a melting line is flagged unreliable


def build(name: str) -> Substance:
    """The Substance of the CoolProp fluid ``name`` (a CoolProp name, already resolved)."""
    eos = EOS(name)
    notes: list[str] = []
    T_t, p_t, T_c, p_c = eos.T_triple, eos.p_triple, eos.T_crit, eos.p_crit
    vapor = Boundary("vaporization", "vapor pressure", T_t, T_c, "CoolProp", eos.p_sat, eos.T_sat)
    sublimation = _sublimation(name, T_t, p_t)
    if name in IAPWS_ICES:
        melting = _water_melting(p_t)
        notes.append(
            "Melting and sublimation from IAPWS R14-08 (CoolProp's water melting line is not used)."
        )
    else:
        melting = _coolprop_melting(eos, notes)
        if not melting and not eos.has_melting_line:
            notes.append(
                "No published melting curve in the reference library: freezing under pressure "
                "above the triple-point temperature is not detected."
            )
        if sublimation is None:
            notes.append(f"Below the triple-point temperature: {NO_SUBLIMATION}.")
    solids = SOLID_MODELS.get(name)
    return Substance(
        name,
        triple=(T_t, p_t),
        critical=(T_c, p_c),
        T_max=eos.T_max,
        p_max=eos.p_max,
        vapor=vapor,
        melting=tuple(melting),
        sublimation=sublimation,
        notes=tuple(notes),
        fluid=eos,
        solids=solids() if solids is not None else NoSolidModel(name),
        latent=EnthalpyDifference(),
        safety_group=_safety_group(name),
    )


def _safety_group(name: str) -> str | None:
    """The ANSI/ASHRAE Standard 34 safety group the reference library gives, or None."""
    group = fluid_info(name, "ASHRAE34").strip()
    return group if re.fullmatch(r"[AB](1|2|2L|3)", group) else None


def _sublimation(name: str, T_t: float, p_t: float) -> Boundary | None:
    """The published sublimation curve of a substance, ending at the EOS triple point, or None.

    Every curve here has the form ln(p/p_t) = F(T/T_t); it is evaluated with the EOS triple
    point (T_t, p_t) as the reducing point, so that it ends exactly there. The published and EOS
    triple points differ by parts per million (argon: 0.2 mK, 1 Pa).
    """
    entry = SUBLIMATION_CURVES.get(name)
    if entry is None:
        return None
    f, (T_pub, p_pub), T_lo, source = entry
    t_scale, p_scale = T_pub / T_t, p_t / p_pub

    def p_of_T(T: float) -> float:
        return f(min(T * t_scale, T_pub)) * p_scale

    form = "Ih" if name in IAPWS_ICES else None
    return Boundary(
        "sublimation", "sublimation", T_lo / t_scale, T_t, source, p_of_T, solid_form=form
    )


def _water_melting(p_t: float) -> list[Boundary]:
    """Water's five melting branches (IAPWS R14-08), ice Ih shifted to the EOS triple point."""
    shift = p_t - w.P_TRIPLE

    def ih(T: float) -> float:
        return w.melting_pressure_ice_ih(T) + shift

    funcs = {
        "Ih": ih,
        "III": w.melting_pressure_ice_iii,
        "V": w.melting_pressure_ice_v,
        "VI": w.melting_pressure_ice_vi,
        "VII": w.melting_pressure_ice_vii,
    }
    return [
        Boundary(
            "melting",
            f"melting (ice {form})",
            lo,
            hi,
            w.SOURCE,
            funcs[form],
            solid_form=form,
            solid_side="below" if form == "Ih" else "above",
        )
        for form, lo, hi in w.ICE_BRANCHES
    ]


def _coolprop_melting(eos: EOS, notes: list[str]) -> list[Boundary]:
    """CoolProp's melting line as one branch that starts at the EOS triple point.

    Junction rule: the line is shifted by the constant Δp = p_t - p_m(T_t) so that it passes
    through the EOS triple point. Where that shift amounts to more than 0.05 K along the curve
    (|Δp| / (dp_m/dT) at T_t) the branch is flagged unreliable.
    """
    if not eos.has_melting_line:
        return []
    T_lo, T_hi, _, _ = eos.melting_range()
    T_t, p_t = eos.T_triple, eos.p_triple
    T_lo = max(T_lo, T_t)
    try:
        shift = p_t - eos.p_melt(T_t)
        slope = (eos.p_melt(T_t + 0.01) - eos.p_melt(T_t)) / 0.01
    except PhasePathError:
        notes.append(
            f"CoolProp's melting line of {eos.name} cannot be evaluated at the triple point "
            f"({T_t} K): it is not used, so freezing under pressure is not detected."
        )
        return []
    offset_K = abs(shift) / slope if slope > 0 else math.inf
    reliable = offset_K <= _TRIPLE_SHIFT_LIMIT
    note = (
        f"CoolProp's melting line misses the triple point by {-shift:.4g} Pa; shifted to meet it."
    )
    if not reliable:
        notes.append(
            f"The melting line of {eos.name} misses the triple point by {abs(shift):.3g} Pa "
            f"(about {offset_K:.3g} K along the curve): treat melting results as unreliable."
        )

    def p_of_T(T: float) -> float:
        return eos.p_melt(T) + shift

    def T_of_p(p: float) -> float:
        return eos.T_melt(p - shift)

    return [
        Boundary(
            "melting",
            "melting",
            T_lo,
            T_hi,
            "CoolProp",
            p_of_T,
            T_of_p,
            reliable=reliable,
            note=note,
        )
    ]
