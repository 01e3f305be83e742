"""Helium-4: the published melting curve, and why it does not start at the lambda point.

Helium-4 has no solid-liquid-vapor triple point. The liquid does not freeze under its own vapor
pressure at any temperature; it needs about 2.5 MPa near absolute zero, and the melting curve has
a shallow minimum below 1 K (common practice). The point CoolProp calls the triple point of
helium, 2.1768 K and about 5.04 kPa, is the lambda point at saturated vapor pressure, where
normal liquid He I, superfluid He II and vapor coexist. The lambda line, a second-order transition
with no latent heat, runs from there to the melting curve near 1.76 K and 3.0 MPa (common
practice). A melting line must therefore never be shifted to meet the vapor-pressure curve.

What is here: the melting curve of Mills & Grilly (1955),

    p = (-17.80 + 17.31457 T**1.555414) kgf/cm2,

valid over their measurements, 37 to 3500 kgf/cm2 (2.10 K to 30.5 K). McCarty & Arp (1990)
print the same curve in MPa, p = -1.7455837 + 1.6979793 T**1.555414, and use it from 2.1768 K
with their equation of state; the tests check that the two are one equation.

What is not here, and why: the melting curve between about 0.8 K and 2.1 K (its minimum, about
2.5 MPa) and the lambda line. Their published equations (e.g. Grilly 1973 for the melting curve,
Kierstead 1967 for the lambda line) could not be obtained with their coefficients; nothing is
guessed in their place. Below 2.10 K this module raises OutOfRangeError.

CoolProp 8.0.0's own helium melting line is a Simon fit credited to Datchi et al. (2000),
p = 1.6067 MPa T**1.565 - 3.2134 MPa, measured from room temperature to 750 K; CoolProp applies
it down to 2.1768 K, where it gives 2.214 MPa against 3.948 MPa from Mills & Grilly (the tests
report both numbers).

Everything is SI (K, Pa). Source ids ``"MillsGrilly1955"`` and ``"McCartyArp1990"``.

Safety: liquid helium is at 4.2 K at atmospheric pressure; it burns skin, displaces air without
warning, and a closed vessel holding it bursts as it warms (about 750 times its liquid volume as
gas at room conditions, common practice). Pressures on the melting curve reach hundreds of MPa.
Follow local codes and licensed practice; these functions are design aids, not a safety case.
"""

from __future__ import annotations

from ._checks import in_range
from ._forms import KGF_CM2, checked_T, simon_absolute, simon_absolute_inverse

__all__ = [
    "SOURCE",
    "MELTING_T_MIN",
    "MELTING_T_MAX",
    "melting_pressure_helium4_mills_grilly",
    "melting_dpdT_helium4_mills_grilly",
    "melting_temperature_helium4_mills_grilly",
]

SOURCE = "MillsGrilly1955"

_MG = (KGF_CM2, -17.80, 17.31457, 1.555414)

#: Ends of the measured range of Mills & Grilly (1955): 37 and 3500 kgf/cm2 [K].
MELTING_T_MIN = simon_absolute_inverse(37.0 * KGF_CM2, *_MG)
MELTING_T_MAX = simon_absolute_inverse(3500.0 * KGF_CM2, *_MG)


def _mg(T: float) -> tuple[float, float]:
    x = checked_T(T, MELTING_T_MIN, MELTING_T_MAX, "helium-4 melting curve", "Mills & Grilly 1955")
    return simon_absolute(x, *_MG)


def melting_pressure_helium4_mills_grilly(T: float) -> float:
    """Melting pressure of helium-4, Mills & Grilly (1955).

    p = (-17.80 + 17.31457 T**1.555414) kgf/cm2, T in K, 1 kgf/cm2 = 98066.5 Pa.

    Parameters
    ----------
    T : float
        Temperature [K], ``MELTING_T_MIN`` (2.0975 K, 37 kgf/cm2) to ``MELTING_T_MAX``
        (30.46 K, 3500 kgf/cm2).

    Returns
    -------
    float
        Melting pressure [Pa].

    Raises
    ------
    OutOfRangeError
        T outside the measured range; in particular below 2.0975 K, where the curve bends to
        its minimum near 2.5 MPa and this equation does not hold.

    References
    ----------
    Mills & Grilly, Phys. Rev. 99, 480 (1955), doi:10.1103/PhysRev.99.480
    (``MillsGrilly1955``); the same curve in MPa: McCarty & Arp, Adv. Cryog. Eng. 35, 1465
    (1990), doi:10.1007/978-1-4613-0639-9_174 (``McCartyArp1990``).

    Examples
    --------
    At the lambda point 2.1768 K (CoolProp's "triple point") the liquid freezes only at
    3.95 MPa; a regression pin at 4 K:

    >>> round(melting_pressure_helium4_mills_grilly(2.1768) / 1e6, 4)
    3.9479
    >>> round(melting_pressure_helium4_mills_grilly(4.0) / 1e6, 3)
    12.923
    """
    return _mg(T)[0]


def melting_dpdT_helium4_mills_grilly(T: float) -> float:
    """Slope dp/dT [Pa/K] of :func:`melting_pressure_helium4_mills_grilly` (exact derivative).

    Parameters
    ----------
    T : float
        Temperature [K], 2.0975 K to 30.46 K.

    Examples
    --------
    A regression pin:

    >>> round(melting_dpdT_helium4_mills_grilly(4.0) / 1e6, 4)
    5.7039
    """
    return _mg(T)[1]


def melting_temperature_helium4_mills_grilly(p: float) -> float:
    """Melting temperature [K] of helium-4 at pressure ``p`` [Pa], Mills & Grilly (1955), exact.

    The closed-form inverse of :func:`melting_pressure_helium4_mills_grilly`.

    Parameters
    ----------
    p : float
        Pressure [Pa], 37 to 3500 kgf/cm2 (3.63 MPa to 343.2 MPa).

    Examples
    --------
    >>> round(melting_temperature_helium4_mills_grilly(10.0e6), 4)
    3.4675
    """
    lo, hi = 37.0 * KGF_CM2, 3500.0 * KGF_CM2
    what = "helium-4 melting curve (Mills & Grilly 1955)"
    x = in_range("p", p, lo, hi, "Pa", what, digits=".6g")
    return simon_absolute_inverse(x, *_MG)
