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
import re
from functools import lru_cache
from typing import Any

from .errors import NonFiniteError, UnitError

__all__ = [
    "parse_temperature",
    "parse_pressure",
    "parse_quantity",
    "convert",
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

_SI = {"temperature": "kelvin", "pressure": "pascal", "energy": "joule / kilogram",
       "density": "kilogram / meter ** 3", "volume": "meter ** 3 / kilogram"}
_DIM = {"temperature": "[temperature]", "pressure": "[mass] / [length] / [time] ** 2",
        "energy": "[length] ** 2 / [time] ** 2", "density": "[mass] / [length] ** 3",
        "volume": "[length] ** 3 / [mass]"}
# Spellings users type that pint does not know by itself.
_ALIASES = {
    "°c": "degC", "c": "degC", "celsius": "degC", "degc": "degC", "°f": "degF", "f": "degF",
    "fahrenheit": "degF", "degf": "degF", "k": "K", "kelvin": "K", "°r": "degR", "r": "degR",
    "psia": "psi", "barа": "bar", "bara": "bar", "kg/m3": "kg/m**3", "kg/l": "kg/L",
    "g/cm3": "g/cm**3", "btu/lb": "Btu/lb",
}
_NUMBER = re.compile(r"^\s*([-+]?(?:\d+\.?\d*|\.\d+)(?:[eE][-+]?\d+)?)\s*(.*?)\s*$")


@lru_cache(maxsize=1)
def _registry() -> Any:
    import pint

    return pint.UnitRegistry(autoconvert_offset_to_baseunit=True)


@lru_cache(maxsize=256)
def _unit(text: str, dimension: str, original: str) -> Any:
    ureg = _registry()
    name = _ALIASES.get(text.strip().lower(), text.strip())
    try:
        unit = ureg.Unit(name)
    except Exception:
        raise UnitError(f"unknown unit {text!r} in {original!r}") from None
    if unit.dimensionality != ureg.get_dimensionality(_DIM[dimension]):
        raise UnitError(
            f"{original!r} is not a {dimension}: its unit {text!r} has dimension "
            f"{unit.dimensionality}"
        )
    return unit


def _finite(x: float, original: object, what: str) -> float:
    if not math.isfinite(x):
        raise NonFiniteError(f"{what} {original!r} is not a finite number")
    return x


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
    if isinstance(value, (int, float)):
        x = _finite(float(value), value, what)
        if default_unit is None:
            return x
        return convert(x, default_unit, _SI[dimension], dimension)
    if hasattr(value, "magnitude") and hasattr(value, "units"):
        mag = float(value.magnitude)
        _finite(mag, value, what)
        unit = _unit(str(value.units), dimension, str(value))
        return float(_registry().Quantity(mag, unit).to(_SI[dimension]).magnitude)
    if isinstance(value, str):
        text = value.strip()
        if not text:
            raise NonFiniteError(f"{what} is empty (got {value!r})")
        m = _NUMBER.match(text)
        if m is None:
            low = text.lower()
            if low in ("nan", "inf", "-inf", "+inf", "infinity", "-infinity"):
                raise NonFiniteError(f"{what} {value!r} is not a finite number")
            raise UnitError(f"cannot read {what} {value!r}: expected a number and a unit, "
                            f"such as '25 degC' or '60 bar'")
        mag = float(m.group(1))
        unit_text = m.group(2)
        if not unit_text:
            if default_unit is None:
                return mag
            return convert(mag, default_unit, _SI[dimension], dimension)
        unit = _unit(unit_text, dimension, value)
        return float(_registry().Quantity(mag, unit).to(_SI[dimension]).magnitude)
    raise UnitError(f"{what} {value!r} is not a number, a string with a unit or a quantity")


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
    ureg = _registry()
    fu = _unit(from_unit, dimension, from_unit)
    tu = _unit(to_unit, dimension, to_unit)
    if fu == tu:
        return float(x)
    return float(ureg.Quantity(x, fu).to(tu).magnitude)
