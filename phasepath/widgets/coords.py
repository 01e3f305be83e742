"""SI values (K, Pa) to the planner's display units and back, for whole arrays (no widget
library here).

>>> x, y = to_display([273.15], [1e5], "degC", "bar")
>>> float(x[0]), float(y[0])
(0.0, 1.0)
>>> [round(v, 6) for v in from_display(0.0, 1.0, "degC", "bar")]
[273.15, 100000.0]
"""

from __future__ import annotations

from typing import Any

import numpy as np

from ..units import affine

__all__ = ["to_display", "from_display"]


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
