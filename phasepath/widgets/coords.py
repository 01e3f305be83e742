"""SI values to the planner's display units and back, for every view, and the pixels of a figure
(no widget library here).

A view's x and y are quantities (:data:`phasepath.views.AXES`): T, p, h or s. Each has a display
unit: T and p their own selectors, h the energy unit, s the entropy unit that goes with the
energy unit (kJ/kg -> kJ/(kg K)). Every conversion is affine (offset units for T).

>>> x, y = to_display([273.15], [1e5], "degC", "bar")
>>> float(x[0]), float(y[0])
(0.0, 1.0)
>>> [round(v, 6) for v in from_display(0.0, 1.0, "degC", "bar")]
[273.15, 100000.0]
>>> u = DisplayUnits("degC", "bar", "kJ/kg")
>>> view_units("ph", u), view_units("Ts", u)
(('kJ/kg', 'bar'), ('kJ/(kg K)', 'degC'))
"""

from __future__ import annotations

import math
from collections.abc import Mapping
from dataclasses import dataclass
from typing import Any

import numpy as np

from ..format import DisplayUnits
from ..units import affine
from ..views import AXES

__all__ = [
    "to_display",
    "from_display",
    "view_units",
    "to_view",
    "from_view",
    "entropy_unit",
    "Frame",
    "QUANTITY",
    "LABELS",
]

#: The dimension of each view quantity, as the unit parser names it.
QUANTITY = {"T": "temperature", "p": "pressure", "h": "energy", "s": "entropy"}
#: Axis titles.
LABELS = {"T": "Temperature", "p": "Pressure", "h": "Specific enthalpy", "s": "Specific entropy"}
_SI = {"T": "K", "p": "Pa", "h": "J/kg", "s": "J/(kg K)"}
_ENTROPY = {"J/kg": "J/(kg K)", "kJ/kg": "kJ/(kg K)", "Btu/lb": "Btu/(lb degR)"}


def entropy_unit(energy_unit: str) -> str:
    """The entropy unit shown with an energy unit."""
    return _ENTROPY[energy_unit]


def unit_of(q: str, units: DisplayUnits) -> str:
    """The display unit of a view quantity ("T", "p", "h", "s")."""
    return {"T": units.T, "p": units.p, "h": units.energy, "s": entropy_unit(units.energy)}[q]


def view_units(view: str, units: DisplayUnits) -> tuple[str, str]:
    """(x unit, y unit) of a view."""
    qx, qy = AXES[view]
    return unit_of(qx, units), unit_of(qy, units)


def _affine(q: str, unit: str) -> tuple[float, float]:
    return affine(_SI[q], unit, QUANTITY[q])


def to_view(view: str, x: Any, y: Any, units: DisplayUnits) -> tuple[np.ndarray, np.ndarray]:
    """SI arrays of a view -> display units."""
    qx, qy = AXES[view]
    ux, uy = view_units(view, units)
    a, b = _affine(qx, ux)
    c, d = _affine(qy, uy)
    return a * np.asarray(x, dtype=float) + b, c * np.asarray(y, dtype=float) + d


def from_view(view: str, x: float, y: float, units: DisplayUnits) -> tuple[float, float]:
    """A point of a view in display units -> SI."""
    qx, qy = AXES[view]
    ux, uy = view_units(view, units)
    a, b = _affine(qx, ux)
    c, d = _affine(qy, uy)
    return (float(x) - b) / a, (float(y) - d) / c


def to_display(T: Any, p: Any, T_unit: str, p_unit: str) -> tuple[np.ndarray, np.ndarray]:
    """SI arrays (K, Pa) -> display units (affine in T, a scale factor in p)."""
    a, b = affine("K", T_unit, "temperature")
    c, _ = affine("Pa", p_unit, "pressure")
    return a * np.asarray(T, dtype=float) + b, c * np.asarray(p, dtype=float)


def from_display(x: float, y: float, T_unit: str, p_unit: str) -> tuple[float, float]:
    """Display units -> SI (K, Pa)."""
    a, b = affine("K", T_unit, "temperature")
    c, _ = affine("Pa", p_unit, "pressure")
    return (float(x) - b) / a, float(y) / c


@dataclass(frozen=True)
class Frame:
    """The plot area of a figure on the page and the window it shows (display units).

    The figure's scales have no padding, so a pixel maps to data exactly: x runs from ``x0`` at
    the plot area's left edge to ``x1`` at its right edge, y from ``y0`` at the bottom to ``y1``
    at the top (in log10 where ``log_y``).

    >>> f = Frame(72, 16, 712, 396, 0.0, 100.0, 1.0, 1000.0, True)
    >>> f.data(72 + 356, 16 + 198)
    (50.0, 31.622776601683793)
    >>> f.pixel(50.0, 31.622776601683793)
    (428.0, 214.0)
    """

    left: float
    top: float
    width: float
    height: float
    x0: float
    x1: float
    y0: float
    y1: float
    log_y: bool

    def data(self, px: float, py: float) -> tuple[float, float] | None:
        """The data point at a pixel (relative to the figure), None outside the plot area."""
        u = (px - self.left) / self.width
        v = 1.0 - (py - self.top) / self.height
        if not (0.0 <= u <= 1.0 and 0.0 <= v <= 1.0):
            return None
        x = self.x0 + u * (self.x1 - self.x0)
        if self.log_y:
            y = 10 ** (math.log10(self.y0) + v * (math.log10(self.y1) - math.log10(self.y0)))
        else:
            y = self.y0 + v * (self.y1 - self.y0)
        return x, y

    def pixel(self, x: float, y: float) -> tuple[float, float]:
        """The pixel (relative to the figure) of a data point."""
        u = (x - self.x0) / (self.x1 - self.x0)
        if self.log_y:
            lo, hi = math.log10(self.y0), math.log10(self.y1)
            v = (math.log10(y) - lo) / (hi - lo) if y > 0 else -1.0
        else:
            v = (y - self.y0) / (self.y1 - self.y0)
        return self.left + u * self.width, self.top + (1.0 - v) * self.height

    def per_pixel(self) -> tuple[float, float]:
        """Data per pixel along x, and along y (in log10 units where ``log_y``)."""
        dy = (
            math.log10(self.y1) - math.log10(self.y0) if self.log_y else self.y1 - self.y0
        ) / self.height
        return (self.x1 - self.x0) / self.width, dy


def frame_of(
    event: Mapping[str, Any],
    margin: Mapping[str, float],
    window: tuple[float, float, float, float] | None,
    log_y: bool,
) -> Frame | None:
    """The frame a page event was made in: the figure's size comes with the event, the margins
    and the window from the figure's state. None if anything is missing or not finite."""
    try:
        w = float(event["boundingRectWidth"])
        h = float(event["boundingRectHeight"])
    except (KeyError, TypeError, ValueError):
        return None
    if window is None:
        return None
    width = w - float(margin["left"]) - float(margin["right"])
    height = h - float(margin["top"]) - float(margin["bottom"])
    values = (width, height, *window)
    if not all(isinstance(v, (int, float)) and math.isfinite(v) for v in values):
        return None
    if width <= 1 or height <= 1 or (log_y and not (window[2] > 0 and window[3] > 0)):
        return None
    return Frame(float(margin["left"]), float(margin["top"]), width, height, *window, log_y)


def event_pixel(event: Mapping[str, Any]) -> tuple[float, float] | None:
    """The pointer's pixel relative to the figure, None if the page sent no finite position."""
    try:
        px, py = float(event["relativeX"]), float(event["relativeY"])
    except (KeyError, TypeError, ValueError):
        return None
    return (px, py) if math.isfinite(px) and math.isfinite(py) else None
