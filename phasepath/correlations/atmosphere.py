"""Ambient pressure at a site's elevation, U.S. Standard Atmosphere 1976.

>>> round(ambient_pressure(0.0))
101325
"""

from __future__ import annotations

import math
import numbers
from decimal import Decimal

from ..errors import NonFiniteError, shown
from ._checks import in_range

__all__ = ["ambient_pressure", "SOURCE", "ELEVATION_RANGE"]

SOURCE = "USSA1976"
#: Geometric elevations [m] covered: the troposphere and the lower stratosphere of the standard.
ELEVATION_RANGE = (-500.0, 20000.0)

_R_EARTH = 6356766.0  # m, effective earth radius of the standard
_G0 = 9.80665  # m/s2
_M = 0.0289644  # kg/mol, molar mass of air in the standard
_R = 8.31432  # J/(mol K), gas constant of the standard
_P0, _T0, _L = 101325.0, 288.15, -0.0065  # sea-level pressure, temperature, lapse rate
_H1 = 11000.0  # m, geopotential height of the tropopause


def ambient_pressure(elevation: float) -> float:
    """Standard-atmosphere pressure [Pa] at a geometric elevation [m] above mean sea level.

    U.S. Standard Atmosphere 1976 (NOAA/NASA/USAF, 1976), eqs. 33a and 33b, with the geometric
    elevation z converted to geopotential height H = r0 z / (r0 + z):
    p = p0 [T0 / (T0 + L H)]^(g0 M / (R L)) up to 11 km, then isothermal at 216.65 K.

    Parameters
    ----------
    elevation : float
        Geometric elevation above mean sea level [m], -500 m to 20,000 m.

    Examples
    --------
    At 1000 m and 5000 m geometric the standard's table gives 8.9876e4 Pa and 5.4048e4 Pa
    (U.S. Standard Atmosphere 1976, Table I; from memory).

    >>> round(ambient_pressure(1000.0)), round(ambient_pressure(5000.0))
    (89876, 54048)
    """
    lo, hi = ELEVATION_RANGE
    if isinstance(elevation, bool) or not isinstance(elevation, (numbers.Real, Decimal)):
        raise NonFiniteError(
            f"elevation {shown(elevation)} is not a number of metres ({lo:g} m to {hi:g} m)",
            value=elevation,
        )
    elevation = in_range("elevation", elevation, lo, hi, "m", "standard atmosphere used here")
    H = _R_EARTH * elevation / (_R_EARTH + elevation)
    expo = _G0 * _M / (_R * _L)
    if H <= _H1:
        return _P0 * (_T0 / (_T0 + _L * H)) ** expo
    T1 = _T0 + _L * _H1
    p1 = _P0 * (_T0 / T1) ** expo
    return p1 * math.exp(-_G0 * _M * (H - _H1) / (_R * T1))
