"""Boundaries that involve a solid: water's ice branches and the published sublimation curves.

Junction rule at the triple point: every published sublimation curve is scaled by the constant
factor p_t(EOS) / p_sub(T_t) so that it ends exactly at the triple point of the equation of state
used for the fluid (the factors differ from 1 by a few parts per million); water's ice Ih melting
curve is shifted by the constant p_t(EOS) - p_t(R14-08) (0.002 Pa).
"""

from __future__ import annotations

from collections.abc import Callable
from importlib import import_module

from .boundaries import Boundary
from .correlations import water_iapws as w

__all__ = ["water_boundaries", "sublimation_curve_for", "SUBLIMATION_CURVES"]

#: substance -> (module, function, lowest temperature [K], bibliography id). The highest
#: temperature of each curve is the triple point of the equation of state.
SUBLIMATION_CURVES: dict[str, tuple[str, str, float, str]] = {
    "Water": ("water_iapws", "sublimation_pressure_ice_ih", 50.0, "IAPWS-R14-08"),
}


def _register_optional() -> None:
    """Curves whose modules carry their own range and source constants."""
    for name, (module, func, tmin_attr, src_attr) in {
        "CarbonDioxide": ("co2", "sublimation_pressure_co2", "SUBLIMATION_T_MIN", "SUBLIMATION_SOURCE"),
        "Nitrogen": ("sublimation_eos", "sublimation_pressure_nitrogen", "NITROGEN_T_MIN", "NITROGEN_SOURCE"),
        "Argon": ("sublimation_eos", "sublimation_pressure_argon", "ARGON_T_MIN", "ARGON_SOURCE"),
        "Methane": ("sublimation_eos", "sublimation_pressure_methane", "METHANE_T_MIN", "METHANE_SOURCE"),
    }.items():
        try:
            mod = import_module(f"phasepath.correlations.{module}")
            SUBLIMATION_CURVES[name] = (module, func, float(getattr(mod, tmin_attr)), str(getattr(mod, src_attr)))
        except (ImportError, AttributeError):
            continue


_register_optional()


def _scaled(f: Callable[[float], float], factor: float) -> Callable[[float], float]:
    def p_of_T(T: float) -> float:
        return f(T) * factor

    return p_of_T


def sublimation_curve_for(name: str, T_t: float, p_t: float) -> Boundary | None:
    """The published sublimation curve of a substance, ending at the EOS triple point, or None."""
    entry = SUBLIMATION_CURVES.get(name)
    if entry is None:
        return None
    module, func, T_lo, source = entry
    f = getattr(import_module(f"phasepath.correlations.{module}"), func)
    factor = p_t / f(T_t)
    return Boundary("sublimation", "sublimation", T_lo, T_t, source, _scaled(f, factor))


def water_boundaries(p_t: float) -> tuple[list[Boundary], Boundary]:
    """Water's five melting branches and its sublimation curve (IAPWS R14-08)."""
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
    melting = [
        Boundary(
            "melting", f"melting (ice {form})", lo, hi, w.SOURCE, funcs[form],
            solid_form=form, solid_side="below" if form == "Ih" else "above",
        )
        for form, lo, hi in w.ICE_BRANCHES
    ]
    sub = sublimation_curve_for("Water", w.T_TRIPLE, p_t)
    assert sub is not None
    sub.solid_form = "Ih"
    return melting, sub
