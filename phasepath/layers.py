"""The boundaries met at a fixed pressure (in rising temperature) or a fixed temperature (in
rising pressure), each with the phases on its two sides: what :mod:`phasepath.states` walks to
find a state from two properties.

At fixed pressure: the sublimation curve below the triple-point pressure; above it the melting
curve (or, in a gap between the triple point and a melting curve's start, the temperature where
the solid meets the fluid) and the vapor-pressure curve below the critical pressure. At fixed
temperature: the sublimation curve and water's ice Ih branch below the triple-point
temperature, the vapor-pressure curve up to the critical temperature, the melting branches.

>>> import phasepath as pp
>>> for layer in layers_at_p(pp.substance("CO2"), 1e6):
...     print(layer.label, layer.below, layer.above)
melting ('solid', None) ('liquid', None)
vapor pressure ('liquid', None) ('vapor', None)
"""

from __future__ import annotations

import math
from dataclasses import dataclass
from typing import TYPE_CHECKING

from .errors import OutOfRangeError
from .substances import NO_SUBLIMATION

if TYPE_CHECKING:  # pragma: no cover
    from .boundaries import Boundary
    from .substances import Substance

__all__ = ["Layer", "layers_at_p", "layers_at_T", "melt_fluid", "temperature_on"]


def temperature_on(b: Boundary, p: float) -> float:
    """The (first) temperature where boundary ``b`` reaches pressure p [Pa]."""
    roots = b.temperatures_at(p)
    if not roots:
        raise OutOfRangeError(
            f"p = {p!r} Pa is outside the {b.label} curve ({b.T_min:g} K to {b.T_max:g} K)"
        )
    return roots[0].root


@dataclass(frozen=True)
class Layer:
    """One boundary met at a fixed pressure (in rising T) or temperature (in rising p).

    ``T``, ``p``: where it is met; ``below`` and ``above``: (phase, form) on its low and high
    side of the moving coordinate; ``label``: the boundary's name.
    """

    T: float
    p: float
    below: tuple[str, str | None]
    above: tuple[str, str | None]
    label: str


def layers_at_p(sub: Substance, p: float) -> list[Layer]:
    """The boundaries met at pressure p [Pa] in rising temperature."""
    T_t, p_t = sub.triple
    p_c = sub.critical[1]
    if p < p_t:
        if sub.sublimation is None:
            raise OutOfRangeError(f"p = {p:.6g} Pa is below the triple point: {NO_SUBLIMATION}")
        T_b = temperature_on(sub.sublimation, p)
        form = sub.form_of_solid(T_b, p, sub.sublimation.solid_form)
        return [Layer(T_b, p, ("solid", form), ("vapor", None), sub.sublimation.label)]
    melt = sub.melting_temperature(p)
    T_s: float | None = sub.fluid.T_sat(p) if (sub.vapor is not None and p < p_c) else None
    if T_s is not None and melt is not None and melt[0] >= T_s:
        # between the triple point and a melting curve's start no liquid exists: the solid
        # meets the vapor on the vapor-pressure curve
        form = sub.form_of_solid(T_s, p, melt[1])
        return [Layer(T_s, p, ("solid", form), ("vapor", None), "vapor pressure")]
    out = []
    if melt is not None:
        T_m = melt[0]
        fluid = melt_fluid(sub, T_m)
        label = _melting_label(sub, T_m, p)
        out.append(
            Layer(T_m, p, ("solid", sub.form_of_solid(T_m, p, melt[1])), (fluid, None), label)
        )
    if T_s is not None:
        out.append(Layer(T_s, p, ("liquid", None), ("vapor", None), "vapor pressure"))
    return out


def layers_at_T(sub: Substance, T: float) -> list[Layer]:
    """The boundaries met at temperature T [K] in rising pressure."""
    T_t = sub.triple[0]
    T_c = sub.critical[0]
    out: list[Layer] = []
    if T < T_t:
        if sub.sublimation is None:
            raise OutOfRangeError(f"T = {T:.6g} K is below the triple point: {NO_SUBLIMATION}")
        p_s = sub.sublimation.p_of_T(T)
        form = sub.form_of_solid(T, p_s, sub.sublimation.solid_form)
        out.append(Layer(T, p_s, ("vapor", None), ("solid", form), sub.sublimation.label))
        for b in sub.melting:
            if b.T_min <= T <= b.T_max:
                p_m = b.p_of_T(T)
                if b.solid_side == "below":
                    below = ("solid", sub.form_of_solid(T, p_m, b.solid_form))
                    out.append(Layer(T, p_m, below, ("liquid", None), b.label))
                else:
                    above = ("solid", sub.form_of_solid(T, p_m, b.solid_form))
                    out.append(Layer(T, p_m, ("liquid", None), above, b.label))
        return sorted(out, key=lambda layer: layer.p)
    vapor = sub.vapor
    if vapor is not None and T <= T_c:
        p_s = vapor.p_of_T(T)
        if sub.in_solid_strip(T):  # no liquid here: the solid meets the vapor
            start = sub.melting_start
            form = sub.form_of_solid(T, p_s, start[2] if start else None)
            return [Layer(T, p_s, ("vapor", None), ("solid", form), "vapor pressure")]
        out.append(Layer(T, p_s, ("vapor", None), ("liquid", None), "vapor pressure"))
    for b in sub.melting:
        if b.solid_side == "above" and b.T_min <= T <= b.T_max:
            p_m = b.p_of_T(T)
            fluid = melt_fluid(sub, T)
            above = ("solid", sub.form_of_solid(T, p_m, b.solid_form))
            out.append(Layer(T, p_m, (fluid, None), above, b.label))
    return sorted(out, key=lambda layer: layer.p)


def melt_fluid(sub: Substance, T: float) -> str:
    """The fluid that meets the solid on a melting curve at T [K]: liquid, or supercritical
    above the critical temperature."""
    return "supercritical" if T > sub.critical[0] else "liquid"


def _melting_label(sub: Substance, T: float, p: float) -> str:
    for b in sub.melting:
        if b.T_min <= T <= b.T_max and math.isclose(b.p_of_T(T), p, rel_tol=1e-6):
            return b.label
    return next((b.label for b in sub.melting), "melting")
