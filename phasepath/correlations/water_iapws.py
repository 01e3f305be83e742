"""Melting and sublimation curves of ordinary water, IAPWS R14-08(2011).

One function per equation of the release: the melting pressure of ice Ih, III, V, VI and VII and
the sublimation pressure of ice Ih. All functions take the temperature in kelvin and return the
pressure in pascal. Source id ``"IAPWS-R14-08"`` in :mod:`phasepath.bibliography`.
"""

from __future__ import annotations

import math

from ..errors import OutOfRangeError

__all__ = [
    "SOURCE",
    "T_TRIPLE",
    "P_TRIPLE",
    "ICE_BRANCHES",
    "melting_pressure_ice_ih",
    "melting_pressure_ice_iii",
    "melting_pressure_ice_v",
    "melting_pressure_ice_vi",
    "melting_pressure_ice_vii",
    "sublimation_pressure_ice_ih",
]

SOURCE = "IAPWS-R14-08"
T_TRIPLE = 273.16  # K, triple point (R14-08, eq. 1)
P_TRIPLE = 611.657  # Pa, triple point (R14-08, eq. 1)

#: (ice form, T_min [K], T_max [K]) of each melting branch, in order of temperature (R14-08 §3).
ICE_BRANCHES = (
    ("Ih", 251.165, 273.16),
    ("III", 251.165, 256.164),
    ("V", 256.164, 273.31),
    ("VI", 273.31, 355.0),
    ("VII", 355.0, 715.0),
)


def _check(T: float, lo: float, hi: float, what: str) -> None:
    if not (lo <= T <= hi):
        raise OutOfRangeError(
            f"T = {T!r} K is outside the {what} of water (IAPWS R14-08): {lo} K to {hi} K"
        )


def melting_pressure_ice_ih(T: float) -> float:
    """Melting pressure of ice Ih, IAPWS R14-08 eq. (2).

    p/pt = 1 + sum_i a_i (1 - theta**b_i), theta = T/Tt, Tt = 273.16 K, pt = 611.657 Pa.

    Parameters
    ----------
    T : float
        Temperature [K], 251.165 K to 273.16 K.

    Returns
    -------
    float
        Melting pressure [Pa].

    Examples
    --------
    Check value of R14-08 Table 3: 138.268 MPa at 260 K.

    >>> round(melting_pressure_ice_ih(260.0) / 1e6, 3)
    138.268
    """
    _check(T, 251.165, 273.16, "ice Ih melting curve")
    th = T / T_TRIPLE
    a = (0.119539337e7, 0.808183159e5, 0.333826860e4)
    b = (0.300000e1, 0.257500e2, 0.103750e3)
    return P_TRIPLE * (1.0 + sum(ai * (1.0 - th**bi) for ai, bi in zip(a, b, strict=False)))


def melting_pressure_ice_iii(T: float) -> float:
    """Melting pressure of ice III, IAPWS R14-08 eq. (3).

    p/p* = 1 - 0.299948 (1 - theta**60), theta = T/T*, T* = 251.165 K, p* = 208.566 MPa.

    Parameters
    ----------
    T : float
        Temperature [K], 251.165 K to 256.164 K.

    Examples
    --------
    Check value of R14-08 Table 3: 268.685 MPa at 254 K.

    >>> round(melting_pressure_ice_iii(254.0) / 1e6, 3)
    268.685
    """
    _check(T, 251.165, 256.164, "ice III melting curve")
    th = T / 251.165
    return 208.566e6 * (1.0 - 0.299948 * (1.0 - th**60))


def melting_pressure_ice_v(T: float) -> float:
    """Melting pressure of ice V, IAPWS R14-08 eq. (4).

    p/p* = 1 - 1.18721 (1 - theta**8), theta = T/T*, T* = 256.164 K, p* = 350.100 MPa.

    Parameters
    ----------
    T : float
        Temperature [K], 256.164 K to 273.31 K.

    Examples
    --------
    Check value of R14-08 Table 3: 479.640 MPa at 265 K.

    >>> round(melting_pressure_ice_v(265.0) / 1e6, 3)
    479.64
    """
    _check(T, 256.164, 273.31, "ice V melting curve")
    th = T / 256.164
    return 350.100e6 * (1.0 - 1.18721 * (1.0 - th**8))


def melting_pressure_ice_vi(T: float) -> float:
    """Melting pressure of ice VI, IAPWS R14-08 eq. (5).

    p/p* = 1 - 1.07476 (1 - theta**4.6), theta = T/T*, T* = 273.31 K, p* = 632.400 MPa.

    Parameters
    ----------
    T : float
        Temperature [K], 273.31 K to 355 K.

    Examples
    --------
    Check value of R14-08 Table 3: 1356.76 MPa at 320 K.

    >>> round(melting_pressure_ice_vi(320.0) / 1e6, 2)
    1356.76
    """
    _check(T, 273.31, 355.0, "ice VI melting curve")
    th = T / 273.31
    return 632.400e6 * (1.0 - 1.07476 * (1.0 - th**4.6))


def melting_pressure_ice_vii(T: float) -> float:
    """Melting pressure of ice VII, IAPWS R14-08 eq. (6).

    ln(p/p*) = 1.73683 (1 - 1/theta) - 0.544606e-1 (1 - theta**5) + 0.806106e-7 (1 - theta**22),
    theta = T/T*, T* = 355 K, p* = 2216 MPa.

    Parameters
    ----------
    T : float
        Temperature [K], 355 K to 715 K.

    Examples
    --------
    Check value of R14-08 Table 3: 6308.71 MPa at 550 K.

    >>> round(melting_pressure_ice_vii(550.0) / 1e6, 2)
    6308.71
    """
    _check(T, 355.0, 715.0, "ice VII melting curve")
    th = T / 355.0
    return 2216e6 * math.exp(
        1.73683 * (1.0 - 1.0 / th) - 0.544606e-1 * (1.0 - th**5) + 0.806106e-7 * (1.0 - th**22)
    )


def sublimation_pressure_ice_ih(T: float) -> float:
    """Sublimation pressure of ice Ih, IAPWS R14-08 eq. (7).

    ln(p/pt) = theta**-1 sum_i a_i theta**b_i, theta = T/Tt, Tt = 273.16 K, pt = 611.657 Pa.

    Parameters
    ----------
    T : float
        Temperature [K], 50 K to 273.16 K.

    Examples
    --------
    Check value of R14-08 Table 3: 8.94735e-6 MPa at 230 K.

    >>> round(sublimation_pressure_ice_ih(230.0), 5)
    8.94735
    """
    _check(T, 50.0, 273.16, "sublimation curve")
    th = T / T_TRIPLE
    a = (-0.212144006e2, 0.273203819e2, -0.610598130e1)
    b = (0.333333333e-2, 0.120666667e1, 0.170333333e1)
    return P_TRIPLE * math.exp(sum(ai * th**bi for ai, bi in zip(a, b, strict=False)) / th)
