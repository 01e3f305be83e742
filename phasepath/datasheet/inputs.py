"""Inputs of a substance built from data, read at the edge: numbers, strings with units, pairs,
points and coefficient mappings, each checked and turned into SI floats.

Temperatures and pressures go through :mod:`phasepath.units`; molar enthalpies (J/mol, kJ/mol,
cal/mol, kcal/mol) and molar masses (kg/mol, g/mol, kg/kmol) through :func:`scaled`. Every
refusal is a phasepath error naming the input and the value as given.

>>> temperature("25 degC", "triple")
298.15
>>> scaled("92.14 g/mol", "molar_mass", MOLAR_MASS, "kg/mol")
0.09214
"""

from __future__ import annotations

import math
import re
from collections.abc import Mapping, Sequence
from typing import Any

import numpy as np

from ..errors import NonFiniteError, OutOfRangeError, PhasePathError
from ..units import parse_pressure, parse_temperature

__all__ = [
    "KEYS",
    "MOLAR_ENERGY",
    "MOLAR_MASS",
    "SLOPE",
    "temperature",
    "pressure",
    "points",
    "pair",
    "scaled",
    "enthalpy",
    "number",
    "only",
    "plain",
]

#: Every input :func:`phasepath.datasheet.from_data` takes besides the name.
KEYS = (
    "molar_mass",
    "triple",
    "critical",
    "vapor_points",
    "antoine",
    "wagner",
    "normal_boiling_point",
    "enthalpy_vaporization",
    "melting_point",
    "melting_slope",
    "simon_glatzel",
    "enthalpy_sublimation",
    "enthalpy_fusion",
    "T_min",
    "T_max",
    "p_max",
    "source",
)
MOLAR_ENERGY = {"j/mol": 1.0, "kj/mol": 1e3, "cal/mol": 4.184, "kcal/mol": 4184.0}
MOLAR_MASS = {"kg/mol": 1.0, "g/mol": 1e-3, "kg/kmol": 1e-3}
SLOPE = {"pa/k": 1.0, "mpa/k": 1e6, "bar/k": 1e5}
_NUM = re.compile(r"^\s*([-+]?(?:\d+\.?\d*|\.\d+)(?:[eE][-+]?\d+)?)\s*(.*?)\s*$")


def temperature(value: object, what: str) -> float:
    """A temperature [K] above absolute zero."""
    try:
        T = parse_temperature(value)
    except PhasePathError as exc:
        raise exc.within(what) from exc
    if T <= 0.0:
        raise OutOfRangeError(f"{what} = {value!r} is not above absolute zero", value=value)
    return T


def pressure(value: object, what: str) -> float:
    """A positive pressure [Pa]."""
    try:
        p = parse_pressure(value)
    except PhasePathError as exc:
        raise exc.within(what) from exc
    if p <= 0.0:
        raise OutOfRangeError(f"{what} = {value!r} is not a positive pressure", value=value)
    return p


def points(
    values: Sequence[Sequence[object]], what: str = "vapor_points"
) -> tuple[tuple[float, float], ...]:
    """(T [K], p [Pa]) pairs, sorted by temperature, no two at one temperature."""
    out = []
    try:
        items = list(values)
    except TypeError:
        raise PhasePathError(f"{what} = {values!r} is not a list of (T, p) pairs") from None
    for i, item in enumerate(items):
        try:
            T, p = item  # type: ignore[misc]
        except (TypeError, ValueError):
            raise PhasePathError(f"{what}[{i}] = {item!r} is not a (T, p) pair") from None
        out.append(
            (temperature(T, f"{what}[{i}] temperature"), pressure(p, f"{what}[{i}] pressure"))
        )
    out.sort()
    for (t0, _), (t1, _) in zip(out[:-1], out[1:], strict=True):
        if t1 - t0 <= 1e-9 * t1:
            raise PhasePathError(f"{what}: two points share the temperature {t0:g} K")
    return tuple(out)


def pair(value: object, what: str, p_optional: bool = False) -> tuple[float, float | None]:
    """A (T, p) pair; with ``p_optional`` the pressure may be None."""
    T: object
    p: object
    try:
        T, p = value  # type: ignore[misc]
    except (TypeError, ValueError):
        raise PhasePathError(f"{what} = {value!r} is not a (T, p) pair") from None
    if p is None and p_optional:
        return temperature(T, f"{what} temperature"), None
    return temperature(T, f"{what} temperature"), pressure(p, f"{what} pressure")


def scaled(
    value: object, what: str, units: dict[str, float], si: str, positive: bool = True
) -> float:
    """A number (SI) or a string with one of a few units (J/mol, kJ/mol; kg/mol, g/mol)."""
    if isinstance(value, bool) or value is None:
        raise NonFiniteError(f"{what} = {value!r} is not a number")
    if isinstance(value, (int, float)):
        x = _float(value, what)
    elif isinstance(value, str) and (m := _NUM.match(value)):
        unit = m.group(2).strip().lower().replace(" ", "")
        if unit and unit not in units:
            raise PhasePathError(
                f"{what} = {value!r}: unknown unit {m.group(2)!r}; use "
                f"{', '.join(units)} (a bare number is {si})"
            )
        x = float(m.group(1)) * units.get(unit, 1.0)
    else:
        raise PhasePathError(f"{what} = {value!r} is not a number or a number with a unit ({si})")
    if not math.isfinite(x):
        raise NonFiniteError(f"{what} = {value!r} is not a finite number")
    if positive and x <= 0.0:
        raise OutOfRangeError(f"{what} = {value!r} must be positive")
    return x


def enthalpy(value: object, what: str) -> float:
    """A molar enthalpy [J/mol]."""
    return scaled(value, what, MOLAR_ENERGY, "J/mol")


def number(d: Mapping[str, Any], key: str, what: str, needed: str) -> float:
    """The finite number ``d[key]`` of a coefficient mapping."""
    if key not in d or d[key] is None:
        raise PhasePathError(f"{what}: {key!r} is missing; give {needed}")
    v = d[key]
    if isinstance(v, bool) or not isinstance(v, (int, float)):
        raise NonFiniteError(f"{what}: {key} = {v!r} is not a finite number")
    x = _float(v, f"{what}: {key}")
    if not math.isfinite(x):
        raise NonFiniteError(f"{what}: {key} = {v!r} is not a finite number")
    return x


def only(d: object, allowed: tuple[str, ...], what: str) -> Mapping[str, Any]:
    """``d`` as a mapping holding no key but those allowed."""
    if not isinstance(d, Mapping):
        raise PhasePathError(f"{what} = {d!r} must be a mapping with keys {', '.join(allowed)}")
    extra = [k for k in d if k not in allowed]
    if extra:
        raise PhasePathError(
            f"{what}: unknown key(s) {', '.join(map(repr, extra))}; known: {', '.join(allowed)}"
        )
    return d


def plain(value: object) -> object:
    """Inputs as plain data (lists, dicts, numbers, strings) for files."""
    if isinstance(value, Mapping):
        return {str(k): plain(v) for k, v in value.items()}
    if isinstance(value, (list, tuple)):
        return [plain(v) for v in value]
    if isinstance(value, (np.floating, np.integer)):
        return value.item()
    if hasattr(value, "magnitude") and hasattr(value, "units"):
        return f"{value.magnitude} {value.units}"
    return value


def _float(value: object, what: str) -> float:
    try:
        return float(value)  # type: ignore[arg-type]
    except OverflowError:
        raise NonFiniteError(f"{what} = {value!r} is too large to be a number") from None
