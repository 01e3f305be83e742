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

Values are read as engineers type them: one number and one unit, nothing else (``"1+1 bar"`` and
``"2 bar bar"`` are refused, naming the text); the Unicode minus sign (``"−20 °C"``) is a minus;
``"ambient"`` is the ambient pressure; gauge units (``barg``, ``psig``, ``kPag``, ``bar(g)``)
read against the ambient pressure (1 atm unless the caller gives the site's):

>>> parse_pressure("5 barg"), parse_pressure("ambient"), parse_temperature("\u221220 degC")
(601325.0, 101325.0, 253.14999999999998)
>>> parse_pressure("0 psig", ambient=89876.0)
89876.0
>>> parse_temperature("5 bar")
Traceback (most recent call last):
...
phasepath.errors.UnitError: '5 bar' is a pressure, not a temperature
"""

from __future__ import annotations

import math
import numbers
import re
from functools import lru_cache
from typing import Any

from .errors import NonFiniteError, OutOfRangeError, UnitError

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
    "ENTROPY_UNITS",
    "STANDARD_ATMOSPHERE",
    "is_relative",
]

#: Display units offered for temperature, pressure and specific energy (our own short list).
TEMPERATURE_UNITS = ("K", "degC", "degF")
PRESSURE_UNITS = ("Pa", "kPa", "bar", "MPa", "psi", "atm")
ENERGY_UNITS = ("J/kg", "kJ/kg", "Btu/lb")
DENSITY_UNITS = ("kg/m3", "g/cm3", "kg/L")
#: Units of specific entropy, one per energy unit (the planner shows entropy in the one that goes
#: with the energy unit in force).
ENTROPY_UNITS = ("J/(kg K)", "kJ/(kg K)", "Btu/(lb degR)")
#: The standard atmosphere [Pa]: the ambient pressure of a gauge reading or of "ambient" where the
#: caller gives none (sea level; 1 atm by definition).
STANDARD_ATMOSPHERE = 101325.0

_SI = {
    "temperature": "kelvin",
    "pressure": "pascal",
    "energy": "joule / kilogram",
    "density": "kilogram / meter ** 3",
    "volume": "meter ** 3 / kilogram",
    "entropy": "joule / kilogram / kelvin",
}
_DIM = {
    "temperature": "[temperature]",
    "pressure": "[mass] / [length] / [time] ** 2",
    "energy": "[length] ** 2 / [time] ** 2",
    "density": "[mass] / [length] ** 3",
    "volume": "[length] ** 3 / [mass]",
    "entropy": "[length] ** 2 / [time] ** 2 / [temperature]",
}
# What each parsed dimension is called, and what other units measure, in words (for "'5 bar' is a
# pressure, not a temperature"); other dimensionalities are named by their base dimensions.
_WORDS = {
    "temperature": "temperature",
    "pressure": "pressure",
    "energy": "specific energy",
    "density": "density",
    "volume": "specific volume",
    "entropy": "specific entropy",
}
_OTHER = {
    "[length]": "length",
    "[mass]": "mass",
    "[time]": "time",
    "[length] ** 3": "volume",
    "[length] / [time]": "speed",
    "[mass] * [length] ** 2 / [time] ** 2": "energy",
    "[mass] * [length] ** 2 / [time] ** 3": "power",
    "[mass] / [time]": "mass flow",
    "[length] ** 3 / [time]": "volume flow",
    "[mass] * [length] / [time] ** 2": "force",
    "[substance]": "amount of substance",
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
    "deg c": "degC",
    "deg f": "degF",
    "kg/m3": "kg/m**3",
    "kg/l": "kg/L",
    "g/cm3": "g/cm**3",
    "btu/lb": "Btu/lb",
    "j/(kg k)": "J/(kg K)",
    "kj/(kg k)": "kJ/(kg K)",
    "btu/(lb degr)": "Btu/(lb degR)",
    "bar(a)": "bar",
    "psi(a)": "psi",
    "kpa(a)": "kPa",
    "mpa(a)": "MPa",
}
# Gauge spellings of a pressure unit (read against the ambient pressure): barg, bar(g), psig,
# psi(g), kPag, kPa(g), MPag, MPa(g); the case of the Pa family matters (mPa is not MPa).
_GAUGE = re.compile(r"^(?:(bar|mbar|psi)|(kPa|MPa|Pa))\s*(?:g|\(g\))$", re.IGNORECASE)
_MINUS = str.maketrans({"\u2212": "-"})  # the Unicode minus sign
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
            f"{_short(original)} is {_a(_measures(unit))}, not {_a(_WORDS[dimension])}",
            value=original,
        )
    return unit


def _measures(unit: Any) -> str:
    """What a unit measures, in words ("pressure", "length", or its base dimensions)."""
    ureg = _registry()
    if unit.dimensionless:
        return "pure number"
    for key, dim in (*_DIM.items(), *((k, k) for k in _OTHER)):
        if unit.dimensionality == ureg.get_dimensionality(dim):
            return _WORDS.get(key) or _OTHER[key]
    return f"quantity of dimension {unit.dimensionality}"


def _a(words: str) -> str:
    return ("an " if words[0] in "aeiou" else "a ") + words


def _check_one_unit(unit_text: str, original: object, what: str) -> None:
    """Refuse unit text that is not one unit: a second number ("1+1 bar", "1 2 bar"), a second
    unit ("2 bar bar") or arithmetic ("5 bar * 2"), naming the text as typed."""
    text = unit_text.strip()
    bad = f"{_short(original)} is not one number and one unit"
    example = _EXAMPLES.get(what, "'60 bar'")
    hint = f"type the {what} as a number and a unit, such as {example}"
    if re.match(r"[0-9.,+\-]", text):
        extra = " (use a decimal point, not a comma)" if text.startswith(",") else ""
        raise UnitError(f"{bad}: {_short(text)} follows the number{extra}; {hint}", value=original)
    top = re.sub(r"\([^()]*\)", "()", text)  # a product inside parentheses is one unit
    top = re.sub(r"\s*([/*·^])\s*", r"\1", top)
    if re.search(r"\s", top):
        raise UnitError(f"{bad}: {_short(text)} is more than one unit; {hint}", value=original)
    rest = re.sub(r"(\*\*|\^)[-+]?\d+(\.\d+)?", "", text)  # exponents: m**3, m^-3
    rest = re.sub(r"(?<=[A-Za-z_°µμ])\d+", "", rest)  # digits inside a name: m3, inH2O
    if re.search(r"[0-9+=,;]", rest) or re.search(r"(?<![/*(])-", rest):
        raise UnitError(
            f"{bad}: {_short(text)} holds arithmetic or a second number; {hint}", value=original
        )


_EXAMPLES = {
    "temperature": "'25 degC'",
    "pressure": "'60 bar'",
    "energy": "'250 kJ/kg'",
    "density": "'450 kg/m3'",
    "volume": "'0.002 m3/kg'",
    "entropy": "'1.2 kJ/(kg K)'",
}


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


def parse_quantity(
    value: object,
    dimension: str,
    default_unit: str | None = None,
    *,
    ambient: float | None = None,
) -> float:
    """Turn a number, a string with a unit or a pint quantity into an SI float.

    Parameters
    ----------
    value : int, float, str or pint.Quantity
        A bare number is taken as SI (K, Pa, J/kg, kg/m3) unless ``default_unit`` is given. Text
        is one number and one unit (``"25 degC"``, ``"−20 °C"`` with the Unicode minus,
        ``"60 bar"``); anything else is refused, naming the text. A pressure may also be
        ``"ambient"`` or a gauge reading (``"5 barg"``, ``"30 psig"``, ``"200 kPag"``,
        ``"2 bar(g)"``), both read against ``ambient``.
    dimension : {"temperature", "pressure", "energy", "density", "volume", "entropy"}
    default_unit : str, optional
        Unit of a bare number or a string without a unit.
    ambient : float, optional
        The ambient pressure [Pa] of "ambient" and of gauge units (a route passes its site's);
        the standard atmosphere, 101325 Pa, when None.
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
        text = value.strip().translate(_MINUS)
        if not text:
            raise NonFiniteError(f"{what} is empty (got {value!r})")
        if text.lower() == "ambient":
            if dimension != "pressure":
                raise UnitError(
                    f"{value!r} is a pressure (the ambient pressure), not {_a(_WORDS[what])}",
                    value=value,
                )
            return _ambient(ambient)
        m = _NUMBER.fullmatch(text)
        if m is None:
            low = text.lower()
            if low in ("nan", "inf", "-inf", "+inf", "infinity", "-infinity"):
                raise NonFiniteError(f"{what} {value!r} is not a finite number")
            raise UnitError(
                f"cannot read {what} {_short(value)}: expected a number and a unit, "
                f"such as {_EXAMPLES.get(what, repr('60 bar'))}"
            )
        mag = _finite(float(m.group(1)), value, what)
        unit_text = m.group(2)
        if not unit_text:
            if default_unit is None:
                return mag
            return _finite(convert(mag, default_unit, _SI[dimension], dimension), value, what)
        if len(unit_text) > _MAX_UNIT_TEXT:  # before any pattern: long text costs no time
            raise UnitError(f"unknown unit {_short(unit_text)} in {_short(value)}")
        gauge = _GAUGE.fullmatch(unit_text.strip())
        if gauge is not None:
            if dimension != "pressure":
                raise UnitError(
                    f"{_short(value)} is a gauge pressure, not {_a(_WORDS[what])}", value=value
                )
            stem = gauge.group(1).lower() if gauge.group(1) else gauge.group(2)
            base = _ambient(ambient)
            p = base + _to_si(mag, _unit(stem, dimension, value), dimension, value)
            if not p > 0.0:
                raise OutOfRangeError(
                    f"{_short(value)} is below vacuum: {p:.6g} Pa absolute, read against an "
                    f"ambient pressure of {base:.6g} Pa",
                    value=value,
                )
            return p
        if unit_text.strip().lower() not in _ALIASES:
            _check_one_unit(unit_text, value, what)
        unit = _unit(unit_text, dimension, value)
        return _to_si(mag, unit, dimension, value)
    raise UnitError(f"{what} {_short(value)} is not a number, a string with a unit or a quantity")


def is_relative(value: object) -> bool:
    """True for a pressure read against the ambient pressure: ``"ambient"`` or a gauge reading
    (``"5 barg"``); such a value means another pressure at another site.

    >>> is_relative("5 barg"), is_relative("ambient"), is_relative("5 bar")
    (True, True, False)
    """
    if not isinstance(value, str):
        return False
    text = value.strip().translate(_MINUS)
    if text.lower() == "ambient":
        return True
    m = _NUMBER.fullmatch(text)
    unit = m.group(2).strip() if m else ""
    return bool(unit) and len(unit) <= _MAX_UNIT_TEXT and _GAUGE.fullmatch(unit) is not None


def _ambient(ambient: float | None) -> float:
    if ambient is None:
        return STANDARD_ATMOSPHERE
    if not (isinstance(ambient, numbers.Real) and math.isfinite(ambient) and ambient > 0):
        raise NonFiniteError(f"ambient pressure {ambient!r} is not a positive number of pascals")
    return float(ambient)


def parse_temperature(value: object, default_unit: str | None = None) -> float:
    """Temperature in kelvin from a number (K), a string such as ``"25 degC"`` or a quantity."""
    return parse_quantity(value, "temperature", default_unit)


def parse_pressure(
    value: object, default_unit: str | None = None, *, ambient: float | None = None
) -> float:
    """Pressure in pascal from a number (Pa), a string such as ``"60 bar"``, ``"ambient"``, a
    gauge reading (``"5 barg"``, read against ``ambient`` [Pa], 1 atm when None) or a quantity."""
    return parse_quantity(value, "pressure", default_unit, ambient=ambient)


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
