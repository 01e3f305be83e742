"""Units at the edges: parse what the user typed into SI floats, format SI floats for display.

Only this module imports pint. Inside phasepath every temperature is a float in kelvin and every
pressure a float in pascal.

>>> parse_temperature("25 degC")
298.15
>>> round(parse_pressure("14.7 psi"), 3)
101352.932
>>> parse_pressure("60 bar")
6000000.0
>>> round(parse_temperature("-40 degF"), 6)
233.15
"""

from __future__ import annotations

import math
import numbers
import re
from functools import lru_cache
from typing import Any

from .errors import NonFiniteError, UnitError

__all__ = [
    "parse_temperature",
    "parse_pressure",
    "parse_quantity",
    "convert",
    "affine",
    "TEMPERATURE_UNITS",
    "PRESSURE_UNITS",
    "ENERGY_UNITS",
    "DENSITY_UNITS",
]

#: Display units offered for temperature, pressure and specific energy (our own short list).
TEMPERATURE_UNITS = ("K", "degC", "degF")
PRESSURE_UNITS = ("Pa", "kPa", "bar", "MPa", "psi", "atm")
ENERGY_UNITS = ("J/kg", "kJ/kg", "Btu/lb")
DENSITY_UNITS = ("kg/m3", "g/cm3", "kg/L")

_SI = {
    "temperature": "kelvin",
    "pressure": "pascal",
    "energy": "joule / kilogram",
    "density": "kilogram / meter ** 3",
    "volume": "meter ** 3 / kilogram",
}
_DIM = {
    "temperature": "[temperature]",
    "pressure": "[mass] / [length] / [time] ** 2",
    "energy": "[length] ** 2 / [time] ** 2",
    "density": "[mass] / [length] ** 3",
    "volume": "[length] ** 3 / [mass]",
}
# Spellings users type that pint does not know by itself.
_ALIASES = {
    "°c": "degC",
    "c": "degC",
    "celsius": "degC",
    "degc": "degC",
    "°f": "degF",
    "f": "degF",
    "fahrenheit": "degF",
    "degf": "degF",
    "k": "K",
    "kelvin": "K",
    "°r": "degR",
    "r": "degR",
    "psia": "psi",
    "barа": "bar",
    "bara": "bar",
    "kg/m3": "kg/m**3",
    "kg/l": "kg/L",
    "g/cm3": "g/cm**3",
    "btu/lb": "Btu/lb",
}
# Matched against stripped text only: no trailing ``\s*`` after a lazy group, which made the
# match time grow with the square of the length of a run of blanks inside the text.
_NUMBER = re.compile(r"([-+]?(?:\d+\.?\d*|\.\d+)(?:[eE][-+]?\d+)?)\s*(.*)", re.DOTALL)
#: Longest unit text handed to pint (longer text is refused as an unknown unit).
_MAX_UNIT_TEXT = 40


@lru_cache(maxsize=1)
def _registry() -> Any:
    import pint

    return pint.UnitRegistry(autoconvert_offset_to_baseunit=True)


@lru_cache(maxsize=256)
def _unit(text: str, dimension: str, original: str) -> Any:
    ureg = _registry()
    name = _ALIASES.get(text.strip().lower(), text.strip())
    if len(name) > _MAX_UNIT_TEXT:
        raise UnitError(f"unknown unit {_short(text)} in {_short(original)}")
    try:
        unit = ureg.Unit(name)
    except Exception:
        raise UnitError(f"unknown unit {text!r} in {_short(original)}") from None
    if unit.dimensionality != ureg.get_dimensionality(_DIM[dimension]):
        raise UnitError(
            f"{_short(original)} is not a {dimension}: its unit {text!r} has dimension "
            f"{unit.dimensionality}"
        )
    return unit


def _finite(x: float, original: object, what: str) -> float:
    if not math.isfinite(x):
        raise NonFiniteError(f"{what} {_short(original)} is not a finite number")
    return x


def _short(value: object, limit: int = 60) -> str:
    """repr of a value as the user gave it, cut short in the middle when very long."""
    text = repr(value)
    return (
        text
        if len(text) <= limit
        else f"{text[: limit // 2]}…{text[-limit // 2 :]} ({len(text)} characters)"
    )


def _float(value: object, what: str) -> float:
    try:
        return float(value)  # type: ignore[arg-type]
    except OverflowError:
        raise NonFiniteError(f"{what} {_short(value)} is too large to be a number") from None


def _to_si(mag: float, unit: Any, dimension: str, original: object) -> float:
    try:
        x = float(_registry().Quantity(mag, unit).to(_SI[dimension]).magnitude)
    except (ArithmeticError, ValueError):
        x = math.nan
    return _finite(x, original, dimension)


def parse_quantity(value: object, dimension: str, default_unit: str | None = None) -> float:
    """Turn a number, a string with a unit or a pint quantity into an SI float.

    Parameters
    ----------
    value : int, float, str or pint.Quantity
        A bare number is taken as SI (K, Pa, J/kg, kg/m3) unless ``default_unit`` is given.
    dimension : {"temperature", "pressure", "energy", "density", "volume"}
    default_unit : str, optional
        Unit of a bare number or a string without a unit.
    """
    what = dimension
    if value is None:
        raise NonFiniteError(f"{what} is missing (got None)")
    if isinstance(value, bool):
        raise UnitError(f"{what} {value!r} is not a number")
    if isinstance(value, numbers.Real):
        x = _finite(_float(value, what), value, what)
        if default_unit is None:
            return x
        return _finite(convert(x, default_unit, _SI[dimension], dimension), value, what)
    if hasattr(value, "magnitude") and hasattr(value, "units"):
        mag = _float(value.magnitude, what)
        _finite(mag, value, what)
        unit = _unit(str(value.units), dimension, str(value))
        return _to_si(mag, unit, dimension, value)
    if isinstance(value, str):
        text = value.strip()
        if not text:
            raise NonFiniteError(f"{what} is empty (got {value!r})")
        m = _NUMBER.fullmatch(text)
        if m is None:
            low = text.lower()
            if low in ("nan", "inf", "-inf", "+inf", "infinity", "-infinity"):
                raise NonFiniteError(f"{what} {value!r} is not a finite number")
            raise UnitError(
                f"cannot read {what} {_short(value)}: expected a number and a unit, "
                f"such as '25 degC' or '60 bar'"
            )
        mag = _finite(float(m.group(1)), value, what)
        unit_text = m.group(2)
        if not unit_text:
            if default_unit is None:
                return mag
            return _finite(convert(mag, default_unit, _SI[dimension], dimension), value, what)
        unit = _unit(unit_text, dimension, value)
        return _to_si(mag, unit, dimension, value)
    raise UnitError(f"{what} {_short(value)} is not a number, a string with a unit or a quantity")


def parse_temperature(value: object, default_unit: str | None = None) -> float:
    """Temperature in kelvin from a number (K), a string such as ``"25 degC"`` or a quantity."""
    return parse_quantity(value, "temperature", default_unit)


def parse_pressure(value: object, default_unit: str | None = None) -> float:
    """Pressure in pascal from a number (Pa), a string such as ``"60 bar"`` or a quantity."""
    return parse_quantity(value, "pressure", default_unit)


def convert(x: float, from_unit: str, to_unit: str, dimension: str) -> float:
    """Convert a float between two units of one dimension (offset units handled).

    >>> convert(300.0, "K", "degC", "temperature")
    26.850000000000023
    """
    scale, offset = affine(from_unit, to_unit, dimension)
    return float(x) * scale + offset


@lru_cache(maxsize=256)
def affine(from_unit: str, to_unit: str, dimension: str) -> tuple[float, float]:
    """(scale, offset) with to = scale * from + offset, from pint once per pair of units.

    Every unit phasepath converts between is linear or affine (degC, degF); a pint quantity per
    value made each results table cost milliseconds per cell.
    """
    ureg = _registry()
    fu = _unit(from_unit, dimension, from_unit)
    tu = _unit(to_unit, dimension, to_unit)
    if fu == tu:
        return 1.0, 0.0
    zero = float(ureg.Quantity(0.0, fu).to(tu).magnitude)
    if zero == 0.0:
        return float(ureg.Quantity(1.0, fu).to(tu).magnitude), 0.0
    span = 1e6  # offset units: the slope over a wide span, free of the offset's rounding
    return (float(ureg.Quantity(span, fu).to(tu).magnitude) - zero) / span, zero
