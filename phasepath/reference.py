"""Substances of the reference library: a CoolProp fluid with its published curves and models.

:func:`build` makes the :class:`~phasepath.substances.Substance` of one CoolProp fluid: the vapor
pressure from its reference equation of state; the melting curve (IAPWS R14-08 for water; a
published equation from :data:`phasepath.correlations.published_curves.MELTING_EQUATIONS` where
phasepath carries one, which replaces CoolProp's line for helium and normal hydrogen; else
CoolProp's own line, where it has one); the published sublimation curve where one exists
(:data:`SUBLIMATION_CURVES`, with the equations of ``published_curves.SUBLIMATION_EQUATIONS``);
and the solid model where phasepath has a published one (:data:`SOLID_MODELS`). Which substance
gets which curve and model is data, in these tables; :func:`coverage` says it for one fluid.

Junction rules at the triple point
----------------------------------
* **Sublimation curves** are evaluated in reduced variables with the triple point of the fluid's
  equation of state as their reducing point, so that they end exactly there (the published and
  EOS triple points differ by parts per million; a curve without a triple point in its form is
  reduced by its own end point). The curves listed in :data:`UNRELIABLE` (an end point far from
  the EOS triple point, a doubtful slope) are flagged unreliable.
* **Melting curves are used as published**: a melting curve is shifted to meet the EOS triple
  point only where the shift is within the crossing tolerance (1e-9 of the triple-point
  pressure), so that the shift can move no crossing. Otherwise the curve is used as it is and the
  gap between it and the triple point is handled explicitly (see
  :class:`~phasepath.substances.Substance`): where the curve starts above the triple-point
  pressure, the solid-liquid boundary below its start is the isotherm at that start; where it
  starts below the vapor-pressure curve, or above the triple-point temperature, the solid borders
  the vapor along the vapor-pressure curve until the melting curve leaves it. A crossing in such
  a gap carries that note. A curve whose start lies more than 0.05 K along it from the triple
  point is flagged unreliable. No melting line is ever moved onto a point that is not a
  solid-liquid-vapor triple point (CoolProp's helium "triple point" is the lambda point).
* Every crossing of a curve flagged unreliable carries the flag, in its record (``flag``), in
  the boundary name shown in every table and in the hazard texts.
"""

from __future__ import annotations

import math
import re
from collections.abc import Callable
from dataclasses import dataclass

from .boundaries import Boundary
from .correlations import co2, published_curves, sublimation_eos, water_ice_phases
from .correlations import water_iapws as w
from .eos import EOS, fluid_info
from .errors import PhasePathError
from .models import DryIce, EnthalpyDifference, IceModels, NoSolidModel, SolidModel
from .records import TOLERANCE
from .substances import NO_MELTING, NO_SUBLIMATION, Substance

__all__ = [
    "build",
    "coverage",
    "Coverage",
    "SUBLIMATION_CURVES",
    "MELTING_CURVES",
    "SOLID_MODELS",
    "UNRELIABLE",
]

#: CoolProp name -> (published sublimation equation, the triple point (T [K], p [Pa]) it is
#: reduced by, lowest T [K], source id).
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
for _name, (_fn, _tp, _lo, _hi, _src) in published_curves.SUBLIMATION_EQUATIONS.items():
    _f = published_curves.FUNCTIONS[_fn]
    # a form without a triple point is reduced by its own end point (its triple point)
    SUBLIMATION_CURVES.setdefault(
        _name, (_f, _tp if _tp is not None else (_hi, _f(_hi)), _lo, _src)
    )

#: CoolProp name -> (published melting equation, lowest T [K], highest T [K], source id), for the
#: fluids whose melting curve is not CoolProp's own line (water has its five R14-08 branches).
MELTING_CURVES: dict[str, tuple[Callable[[float], float], float, float, str]] = {
    name: (published_curves.FUNCTIONS[fn], lo, hi, src)
    for name, (fn, _tp, lo, hi, src) in published_curves.MELTING_EQUATIONS.items()
}

#: CoolProp name -> the published solid model phasepath has for it.
SOLID_MODELS: dict[str, type[SolidModel]] = {"Water": IceModels, "CarbonDioxide": DryIce}

#: CoolProp names whose melting and sublimation curves come from IAPWS R14-08 (CoolProp's own
#: melting line is not used).
IAPWS_ICES = ("Water",)

#: (kind, CoolProp name) -> why the curve is flagged unreliable (published curves whose doubt is
#: recorded with them; CoolProp melting lines are judged when built, see :func:`_melting_line`).
UNRELIABLE: dict[tuple[str, str], str] = {
    key: published_curves.FLAGS[key]
    for key in (("sublimation", "Krypton"), ("sublimation", "Oxygen"), ("sublimation", "Hydrogen"))
}

_GAP_LIMIT = 0.05  # K along the curve: a melting curve starting further from T_t is unreliable
_START_LIMIT = 0.05  # K: a melting line that starts further above T_t does not cover it


@dataclass(frozen=True)
class Coverage:
    """What phasepath has for one fluid: the source id of each curve (None: not covered), its
    solid model's name (None: none) and the flags on its curves."""

    name: str
    vaporization: str | None
    melting: str | None
    sublimation: str | None
    solid_model: str | None
    flags: tuple[str, ...]


def coverage(sub: Substance) -> Coverage:
    """The coverage of a substance, read from the curves and models it carries.

    >>> import phasepath as pp
    >>> c = coverage(pp.substance("CO2"))
    >>> c.vaporization, c.melting, c.sublimation, c.solid_model
    ('CoolProp', 'CoolProp', 'SpanWagner1996', 'dry ice')
    """
    sources = {b.kind: b.source for b in reversed(sub.boundaries)}
    flags = tuple(b.note for b in sub.boundaries if not b.reliable and b.note)
    solid = getattr(sub.solids, "name", None) if getattr(sub.solids, "sources", ()) else None
    return Coverage(
        sub.name,
        sources.get("vaporization"),
        sources.get("melting"),
        sources.get("sublimation"),
        solid,
        flags,
    )


def build(name: str) -> Substance:
    """The Substance of the CoolProp fluid ``name`` (a CoolProp name, already resolved)."""
    eos = EOS(name)
    notes: list[str] = []
    T_t, p_t, T_c, p_c = eos.T_triple, eos.p_triple, eos.T_crit, eos.p_crit
    vapor = Boundary("vaporization", "vapor pressure", T_t, T_c, "CoolProp", eos.p_sat, eos.T_sat)
    sublimation = _sublimation(name, T_t, p_t, notes)
    if name in IAPWS_ICES:
        melting = _water_melting()
        notes.append(
            "Melting and sublimation from IAPWS R14-08 (CoolProp's water melting line is not used)."
        )
    elif name in MELTING_CURVES:
        f, lo, hi, source = MELTING_CURVES[name]
        melting = _melting_line(name, eos, f, None, lo, hi, source, notes)
    elif eos.has_melting_line:
        lo, hi, _, _ = eos.melting_range()
        melting = _melting_line(name, eos, eos.p_melt, eos.T_melt, lo, hi, "CoolProp", notes)
    else:
        melting = []
    if not melting:
        notes.append(
            "No published melting curve: freezing under pressure above the triple-point "
            f"temperature is not detected; below it, above the triple-point pressure: {NO_MELTING}."
        )
    if sublimation is None:
        notes.append(f"Below the triple-point temperature: {NO_SUBLIMATION}.")
    flag = published_curves.FLAGS.get(("melting", name))
    if flag and melting:
        notes.append(f"Melting curve: {flag}.")
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
        solid_boundaries=tuple(_ice_lines()) if name in IAPWS_ICES else (),
    )


def _safety_group(name: str) -> str | None:
    """The ANSI/ASHRAE Standard 34 safety group the reference library gives, or None."""
    group = fluid_info(name, "ASHRAE34").strip()
    return group if re.fullmatch(r"[AB](1|2|2L|3)", group) else None


def _sublimation(name: str, T_t: float, p_t: float, notes: list[str]) -> Boundary | None:
    """The published sublimation curve of a substance, ending at the EOS triple point, or None.

    Every curve here is evaluated with the EOS triple point (T_t, p_t) as its reducing point,
    so that it ends exactly there: p(T) = f(T T_pub/T_t) p_t/p_pub.
    """
    entry = SUBLIMATION_CURVES.get(name)
    if entry is None:
        return None
    f, (T_pub, p_pub), T_lo, source = entry
    t_scale, p_scale = T_pub / T_t, p_t / p_pub

    def p_of_T(T: float) -> float:
        return f(min(T * t_scale, T_pub)) * p_scale

    form = "Ih" if name in IAPWS_ICES else None
    reason = UNRELIABLE.get(("sublimation", name))
    flag = published_curves.FLAGS.get(("sublimation", name), "")
    if flag:
        notes.append(f"Sublimation curve: {flag}.")
    return Boundary(
        "sublimation",
        "sublimation" + (" (unreliable)" if reason else ""),
        T_lo / t_scale,
        T_t,
        source,
        p_of_T,
        solid_form=form,
        reliable=reason is None,
        note=f"sublimation curve of {name}, flagged unreliable: {reason}" if reason else "",
    )


def _water_melting() -> list[Boundary]:
    """Water's five melting branches (IAPWS R14-08), as published."""
    funcs = {
        "Ih": w.melting_pressure_ice_ih,
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


def _ice_lines() -> list[Boundary]:
    """Water's solid-solid boundaries (Dunaeva et al. 2010 through the triple points)."""
    return [
        Boundary(
            "solid-solid",
            f"ice {bd.low}-ice {bd.high}",
            bd.T_min,
            bd.T_max,
            bd.source,
            bd.pressure,
            bd.temperature,
            solid_form=bd.high,
        )
        for bd in water_ice_phases.BOUNDARIES
    ]


def _melting_line(
    name: str,
    eos: EOS,
    f: Callable[[float], float],
    inverse: Callable[[float], float] | None,
    T_lo: float,
    T_hi: float,
    source: str,
    notes: list[str],
) -> list[Boundary]:
    """One melting branch from its lowest temperature at or above the EOS triple point.

    Used as published unless the shift to meet the EOS triple point is within the crossing
    tolerance (then shifted, moving no crossing); flagged unreliable where its start lies more
    than 0.05 K along the curve from the triple point.
    """
    T_t, p_t = eos.T_triple, eos.p_triple
    T0 = max(T_lo, T_t)
    if T0 - T_t > _START_LIMIT:
        notes.append(
            f"The melting line of {name} starts at {T0:g} K, {T0 - T_t:.3g} K above the triple "
            f"point: it is not used, so freezing under pressure is not detected."
        )
        return []
    try:
        p0 = f(T0)
        slope = (f(T0 + 0.01) - p0) / 0.01
    except PhasePathError:
        notes.append(
            f"The melting line of {name} cannot be evaluated at {T0:g} K: it is not used, so "
            "freezing under pressure is not detected."
        )
        return []
    shift = p_t - p0 if T0 == T_t and abs(p_t - p0) <= TOLERANCE * p_t else 0.0
    if shift:
        gap_K = 0.0
    else:
        gap_K = abs(p0 - p_t) / slope + (T0 - T_t) if slope > 0 else math.inf
    reason = ""
    if gap_K > _GAP_LIMIT and ("melting", name) not in published_curves.FLAGS:
        reason = (
            f"it starts {abs(p0 - p_t):.4g} Pa from the EOS triple point (about {gap_K:.3g} K "
            f"along the curve)"
        )
        notes.append(f"The melting line of {name} is flagged unreliable: {reason}.")

    p_of_T: Callable[[float], float] = f
    T_of_p = inverse
    if shift:

        def p_of_T(T: float) -> float:
            return f(T) + shift

        T_of_p = None if inverse is None else (lambda p: inverse(p - shift))
    return [
        Boundary(
            "melting",
            "melting" + (" (unreliable)" if reason else ""),
            T0,
            T_hi,
            source,
            p_of_T,
            T_of_p,
            reliable=not reason,
            note=f"melting curve of {name}, flagged unreliable: {reason}" if reason else "",
        )
    ]
