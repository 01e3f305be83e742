"""Boundaries that involve a solid: water's ice branches and the published sublimation curves.

Junction rule at the triple point: every published sublimation curve is evaluated in reduced
variables with the triple point of the fluid's equation of state as its reducing point, so that it
ends exactly there (the published and EOS triple points differ by parts per million); water's ice
Ih melting curve is shifted by the constant p_t(EOS) - p_t(R14-08) (0.002 Pa).
"""

from __future__ import annotations

from importlib import import_module

from .boundaries import Boundary
from .correlations import water_iapws as w

__all__ = ["water_boundaries", "sublimation_curve_for", "SUBLIMATION_CURVES"]

#: substance -> (module, function, its triple point (T [K], p [Pa]), lowest T [K], source id).
SUBLIMATION_CURVES: dict[str, tuple[str, str, tuple[float, float], float, str]] = {
    "Water": (
        "water_iapws",
        "sublimation_pressure_ice_ih",
        (w.T_TRIPLE, w.P_TRIPLE),
        50.0,
        w.SOURCE,
    ),
}


def _register() -> None:
    from .correlations import co2, sublimation_eos

    SUBLIMATION_CURVES["CarbonDioxide"] = (
        "co2",
        "sublimation_pressure_co2",
        (co2.T_TRIPLE, co2.P_TRIPLE),
        co2.SUBLIMATION_T_MIN,
        co2.SOURCE_CURVES,
    )
    for name, key in (("Nitrogen", "nitrogen"), ("Argon", "argon"), ("Methane", "methane")):
        T_t, p_t, T_min, _, _, source = sublimation_eos.CURVES[key]
        SUBLIMATION_CURVES[name] = (
            "sublimation_eos",
            f"sublimation_pressure_{key}",
            (T_t, p_t),
            T_min,
            source,
        )


_register()


def sublimation_curve_for(name: str, T_t: float, p_t: float) -> Boundary | None:
    """The published sublimation curve of a substance, ending at the EOS triple point, or None.

    Every curve here has the form ln(p/p_t) = F(T/T_t); it is evaluated with the EOS triple
    point (T_t, p_t) as the reducing point, so that it ends exactly there. The published and EOS
    triple points differ by parts per million (argon: 0.2 mK, 1 Pa).
    """
    entry = SUBLIMATION_CURVES.get(name)
    if entry is None:
        return None
    module, func, (T_pub, p_pub), T_lo, source = entry
    f = getattr(import_module(f"phasepath.correlations.{module}"), func)
    t_scale, p_scale = T_pub / T_t, p_t / p_pub

    def p_of_T(T: float) -> float:
        return f(min(T * t_scale, T_pub)) * p_scale

    return Boundary("sublimation", "sublimation", T_lo / t_scale, T_t, source, p_of_T)


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
    sub = sublimation_curve_for("Water", w.T_TRIPLE, p_t)
    assert sub is not None
    sub.solid_form = "Ih"
    return melting, sub
