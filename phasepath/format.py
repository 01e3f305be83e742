"""Numbers shown to people: the display-precision policy and the display units, in one place.

A number is shown with the digits its model supports and no more, so that what a table, a
notebook or a report shows is the same on every machine (the last bits of a computed value
differ between floating-point kernels; the digits shown here do not). Machine-readable outputs
(JSON results files, ``to_dict``) keep full precision and do not come through here.

========================  =================================================================
quantity                  shown as
========================  =================================================================
temperature               to 0.001 K (three decimals in K, °C and °F)
pressure                  six significant digits
energy (J/kg, kJ/kg...)   six significant digits
entropy, density          six significant digits
mass fraction             four decimals (0.0001)
fitted parameter          to the digits its standard error supports (two digits of the error)
========================  =================================================================

>>> temperature(298.15, "degC"), pressure(101325.0, "bar"), energy(2256470.0, "kJ/kg")
('25.000', '1.01325', '2256.47')
>>> fraction(0.31234567), fitted(8.123456789, 0.0042), fitted(1300.4567, 12.0)
('0.3123', '8.1235', '1300')
>>> quantity(273.15, "temperature", "degC")
'0.000 °C'
"""

from __future__ import annotations

import math
from dataclasses import dataclass

from .errors import UnitError
from .units import DENSITY_UNITS, ENERGY_UNITS, PRESSURE_UNITS, TEMPERATURE_UNITS, convert

__all__ = [
    "UNIT_LABELS",
    "DisplayUnits",
    "number",
    "temperature",
    "pressure",
    "energy",
    "fraction",
    "fitted",
    "quantity",
    "significant",
    "NONE",
]

#: How each display unit is written in headers and beside numbers.
UNIT_LABELS = {
    "degC": "°C",
    "degF": "°F",
    "K": "K",
    "Pa": "Pa",
    "kPa": "kPa",
    "bar": "bar",
    "MPa": "MPa",
    "psi": "psi",
    "atm": "atm",
    "J/kg": "J/kg",
    "kJ/kg": "kJ/kg",
    "Btu/lb": "Btu/lb",
    "kg/m3": "kg/m³",
    "g/cm3": "g/cm³",
    "kg/L": "kg/L",
    "J/(kg K)": "J/(kg K)",
    "kJ/(kg K)": "kJ/(kg K)",
}
#: What a missing value is shown as.
NONE = "—"

_SI = {
    "temperature": "K",
    "pressure": "Pa",
    "energy": "J/kg",
    "density": "kg/m3",
    "entropy": "J/(kg K)",
}
_OFFERED = {
    "temperature": TEMPERATURE_UNITS,
    "pressure": PRESSURE_UNITS,
    "energy": ENERGY_UNITS,
    "density": DENSITY_UNITS,
}
_T_DECIMALS = 3  # temperatures to 0.001 K
_SIGNIFICANT = 6  # pressures, energies, densities, entropies
_FRACTION_DECIMALS = 4


@dataclass(frozen=True)
class DisplayUnits:
    """The units numbers are shown in: temperature, pressure and specific energy.

    >>> DisplayUnits("degC", "bar").labels
    ('°C', 'bar', 'kJ/kg')
    """

    T: str = "K"
    p: str = "Pa"
    energy: str = "kJ/kg"

    def __post_init__(self) -> None:
        for unit, what in ((self.T, "temperature"), (self.p, "pressure"), (self.energy, "energy")):
            if not isinstance(unit, str) or unit not in _OFFERED[what]:
                raise UnitError(
                    f"display unit {unit!r} for {what} is not offered; choose one of "
                    f"{', '.join(_OFFERED[what])}",
                    value=unit,
                )

    @property
    def labels(self) -> tuple[str, str, str]:
        return UNIT_LABELS[self.T], UNIT_LABELS[self.p], UNIT_LABELS[self.energy]

    def unit(self, quantity: str) -> str | None:
        """The display unit of a quantity ("temperature", "pressure", "energy"), else None."""
        return {"temperature": self.T, "pressure": self.p, "energy": self.energy}.get(quantity)


def significant(x: float, digits: int = _SIGNIFICANT) -> str:
    """x to ``digits`` significant digits, in plain notation where it is readable.

    >>> significant(0.000123456789), significant(123456789.0), significant(-0.0)
    ('0.000123457', '1.23457e+08', '0')
    """
    if x == 0.0:
        return "0"
    if not math.isfinite(x):
        return str(x)
    text = f"{x:.{digits}g}"
    return text


def _decimals(x: float, decimals: int) -> str:
    text = f"{x:.{decimals}f}"
    if float(text) == 0.0:  # no "-0.000"
        text = f"{0.0:.{decimals}f}"
    return text


def temperature(T: float, unit: str = "K") -> str:
    """A temperature [K] in ``unit``, to 0.001 K."""
    return _decimals(convert(T, "K", unit, "temperature"), _T_DECIMALS)


def pressure(p: float, unit: str = "Pa") -> str:
    """A pressure [Pa] in ``unit``, six significant digits."""
    return significant(convert(p, "Pa", unit, "pressure"))


def energy(e: float, unit: str = "J/kg") -> str:
    """A specific energy [J/kg] in ``unit``, six significant digits."""
    return significant(convert(e, "J/kg", unit, "energy"))


def fraction(x: float) -> str:
    """A mass fraction, to 0.0001."""
    return _decimals(x, _FRACTION_DECIMALS)


def fitted(value: float, stderr: float) -> str:
    """A fitted parameter to the digits its standard error supports: rounded at the second
    significant digit of the error (six significant digits where the error is not known)."""
    if not (math.isfinite(stderr) and stderr > 0.0) or not math.isfinite(value):
        return significant(value)
    place = math.floor(math.log10(stderr)) - 1  # the error's second digit
    if place >= 0:
        return _decimals(round(value, -place), 0)
    return _decimals(value, -place)


def number(x: float | None, kind: str, unit: str | None = None) -> str:
    """Any shown number by its kind: "temperature", "pressure", "energy", "fraction", "density",
    "entropy" or "count"; ``unit`` is the display unit (SI when None). None shows as "—"."""
    if x is None or (isinstance(x, float) and math.isnan(x)):
        return NONE
    if kind == "temperature":
        return temperature(x, unit or "K")
    if kind == "pressure":
        return pressure(x, unit or "Pa")
    if kind == "energy":
        return energy(x, unit or "J/kg")
    if kind == "fraction":
        return fraction(x)
    if kind == "count":
        return str(int(x))
    if kind == "density":
        return significant(convert(x, "kg/m3", unit, "density") if unit else x)
    if kind == "entropy":
        return significant(x / 1e3 if unit == "kJ/(kg K)" else x)
    raise UnitError(f"no display rule for {kind!r}")


def quantity(x: float | None, kind: str, unit: str | None = None) -> str:
    """A number with its unit label ("25.000 °C")."""
    si = _SI.get(kind)
    unit = unit or si
    text = number(x, kind, unit)
    return text if unit is None or text == NONE else f"{text} {UNIT_LABELS.get(unit, unit)}"
