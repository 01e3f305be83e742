"""Published melting curves of fluids whose CoolProp 8.0.0 equation of state has none.

==============  ============================  ==============================  ===================
fluid           source id                     form                            range [K]
==============  ============================  ==============================  ===================
ammonia         ``"Gao2023-NH3"``             two branches, see function      195.49 to 725
xenon           ``"MichelsPrins1962"``        p/atm = a0 + a1 T**c            161.405 to 215.4
SF6             ``"GuderWagner2009"``         p/p_t = 1 + a (T/T_t - 1)**t    223.555 to 396.0
hydrogen        ``"Leachman2009"`` (normal)   p/p_t = 1 + sum a_i x**t_i      13.957 to 164.5
==============  ============================  ==============================  ===================

Normal hydrogen is here although CoolProp has a melting line for it: CoolProp 8.0.0's line for
``Hydrogen`` (a Simon fit credited to Datchi et al. 2000, with T_0 = 1 K) gives 23.6 MPa at the
triple point 13.957 K, where the melting pressure is 7.36 kPa; it is unusable below room
temperature. The equation below is the one of the normal-hydrogen reference equation of state.

Provenance. The ammonia and SF6 coefficients are those of the papers as quoted in public data
files (the ammonia low-temperature branch is a Simon form whose coefficient makes it meet the
high-temperature branch at the solid I-solid II-liquid triple point, 217.35 K and 307 MPa, to
1e-8). The xenon equation is the Simon fit of Michels & Prins (1962) with the constant as
adjusted in NIST REFPROP 10 so that the curve passes through the triple point 161.405 K,
81.75 kPa (an older REFPROP constant, -2573.936225 atm, gives 184 kPa there); the original
constant of the paper could not be confirmed. The normal-hydrogen coefficients are those of the
REFPROP 10 hydrogen file, whose entry names no source; the attribution to Leachman et al. (2009)
is from memory.

Upper limits: ammonia 725 K, the upper temperature of the Gao et al. equation of state; xenon
where the curve reaches 1500 atm, the top of Michels & Prins's measurements; SF6 where it
reaches 150 MPa and hydrogen where it reaches 2000 MPa, the upper pressures of their equations
of state (our choice: no source states a limit we could confirm).

Everything is SI (K, Pa). Outside its range a function raises
:class:`phasepath.errors.OutOfRangeError`.

Safety: melting pressures run to hundreds of MPa. Vessels, fittings and gauges at such
pressures are special equipment under local pressure-equipment codes; ammonia is toxic and
hydrogen flammable. These functions are design aids, not a safety case.
"""

from __future__ import annotations

from scipy.optimize import brentq

from ._forms import (
    ATM,
    checked_T,
    reduced_power_melting,
    simon_absolute,
    simon_absolute_inverse,
)

__all__ = [
    "NH3_TRIPLE",
    "NH3_SOLID_I_II_LIQUID",
    "melting_pressure_ammonia_gao2023",
    "melting_dpdT_ammonia_gao2023",
    "melting_pressure_xenon_michels_prins",
    "melting_dpdT_xenon_michels_prins",
    "melting_pressure_sf6_guder_wagner",
    "melting_dpdT_sf6_guder_wagner",
    "melting_pressure_hydrogen_leachman",
    "melting_dpdT_hydrogen_leachman",
]

#: Triple point (T [K], p [Pa]) of Gao et al. (2023).
NH3_TRIPLE = (195.49, 6053.39)
#: Where the two branches of Gao et al. (2023) meet: (T [K], p [Pa]).
NH3_SOLID_I_II_LIQUID = (217.35, 307.0e6)
_NH3_A = 516.613763e6  # Pa
_NH3_C = 4.4
_NH3_B = 1135.0e6  # Pa
_NH3_E = 1.51
_NH3_TMAX = 725.0

_XE = (ATM, -2575.0728, 0.7983277028, 1.589165)
_XE_TMIN = 161.405
_XE_TMAX = simon_absolute_inverse(1500.0 * ATM, *_XE)

_SF6_TT, _SF6_PT = 223.555, 231429.0
_SF6_A, _SF6_T = (966.603148,), (1.555,)

_H2_TT, _H2_PT = 13.957, 7357.8
_H2_A, _H2_T = (5626.3, 2717.2), (1.0, 1.83)


def _T_at(f, p: float, lo: float, hi: float) -> float:
    return brentq(lambda T: f(T)[0] - p, lo, hi, xtol=1e-12, rtol=1e-15)


_SF6_TMAX = _T_at(
    lambda T: reduced_power_melting(T, _SF6_TT, _SF6_PT, _SF6_A, _SF6_T), 150.0e6, 224.0, 2000.0
)
_H2_TMAX = _T_at(
    lambda T: reduced_power_melting(T, _H2_TT, _H2_PT, _H2_A, _H2_T), 2000.0e6, 14.0, 2000.0
)


def _nh3(T: float) -> tuple[float, float]:
    Tt, pt = NH3_TRIPLE
    x = checked_T(T, Tt, _NH3_TMAX, "ammonia melting curve", "Gao et al. 2023")
    T0, p0 = NH3_SOLID_I_II_LIQUID
    if x <= T0:
        r = x / Tt
        return pt + _NH3_A * (r**_NH3_C - 1.0), _NH3_A * _NH3_C * r ** (_NH3_C - 1.0) / Tt
    y = x / T0 - 1.0
    return p0 + _NH3_B * y**_NH3_E, _NH3_B * _NH3_E * y ** (_NH3_E - 1.0) / T0


def melting_pressure_ammonia_gao2023(T: float) -> float:
    """Melting pressure of ammonia, Gao et al. (2023), solid I and solid II branches.

    For T_t <= T <= 217.35 K: p = p_t + a [(T/T_t)**4.4 - 1], a = 516.613763 MPa,
    T_t = 195.49 K, p_t = 6.05339 kPa. For 217.35 K < T <= 725 K:
    p = 307 MPa + 1135 MPa (T/217.35 K - 1)**1.51.

    Parameters
    ----------
    T : float
        Temperature [K], 195.49 K to 725 K.

    Returns
    -------
    float
        Melting pressure [Pa].

    References
    ----------
    Gao, Wu, Bell, Harvey & Lemmon, J. Phys. Chem. Ref. Data 52, 013102 (2023),
    doi:10.1063/5.0128269 (``Gao2023-NH3``).

    Examples
    --------
    The published triple point, and the solid I-solid II-liquid triple point where the branches
    meet (217.34 K and 307.0 MPa in the literature, e.g. Yurtseven 2008):

    >>> melting_pressure_ammonia_gao2023(195.49)
    6053.39
    >>> round(melting_pressure_ammonia_gao2023(217.35) / 1e6, 3)
    307.0
    """
    return _nh3(T)[0]


def melting_dpdT_ammonia_gao2023(T: float) -> float:
    """Slope dp/dT [Pa/K] of :func:`melting_pressure_ammonia_gao2023` (exact derivative).

    The slope jumps at 217.35 K (a triple point of solid I, solid II and liquid); the value
    there is that of the low-temperature branch, and the high branch's slope is zero at its start.

    Parameters
    ----------
    T : float
        Temperature [K], 195.49 K to 725 K.

    Examples
    --------
    At T_t the slope is 4.4 a / T_t:

    >>> round(melting_dpdT_ammonia_gao2023(195.49) / 1e6, 4)
    11.6277
    """
    return _nh3(T)[1]


def _xe(T: float) -> tuple[float, float]:
    x = checked_T(T, _XE_TMIN, _XE_TMAX, "xenon melting curve", "Michels & Prins 1962")
    return simon_absolute(x, *_XE)


def melting_pressure_xenon_michels_prins(T: float) -> float:
    """Melting pressure of xenon, Simon equation of Michels & Prins (1962), REFPROP 10 constant.

    p/atm = -2575.0728 + 0.7983277028 T**1.589165 (T in K), 1 atm = 101325 Pa.

    Parameters
    ----------
    T : float
        Temperature [K], 161.405 K to 215.4 K (1500 atm).

    Returns
    -------
    float
        Melting pressure [Pa].

    References
    ----------
    Michels & Prins, Physica 28, 101 (1962), doi:10.1016/0031-8914(62)90096-4
    (``MichelsPrins1962``), constant as in the xenon file of NIST REFPROP 10.

    Examples
    --------
    Through the triple point of Lemmon & Span (2006), 161.405 K and 81.75 kPa (81.8 kPa here),
    and 1500 atm at the upper end:

    >>> round(melting_pressure_xenon_michels_prins(161.405) / 1e3, 1)
    81.8
    >>> round(melting_pressure_xenon_michels_prins(_XE_TMAX) / 101325.0, 6)
    1500.0
    """
    return _xe(T)[0]


def melting_dpdT_xenon_michels_prins(T: float) -> float:
    """Slope dp/dT [Pa/K] of :func:`melting_pressure_xenon_michels_prins` (exact derivative).

    Parameters
    ----------
    T : float
        Temperature [K], 161.405 K to 215.4 K.

    Examples
    --------
    A regression pin:

    >>> round(melting_dpdT_xenon_michels_prins(161.405) / 1e6, 4)
    2.5698
    """
    return _xe(T)[1]


def _sf6(T: float) -> tuple[float, float]:
    x = checked_T(T, _SF6_TT, _SF6_TMAX, "SF6 melting curve", "Guder & Wagner 2009")
    return reduced_power_melting(x, _SF6_TT, _SF6_PT, _SF6_A, _SF6_T)


def melting_pressure_sf6_guder_wagner(T: float) -> float:
    """Melting pressure of sulfur hexafluoride, Guder & Wagner (2009).

    p/p_t = 1 + 966.603148 (T/T_t - 1)**1.555, T_t = 223.555 K, p_t = 231.429 kPa.

    Parameters
    ----------
    T : float
        Temperature [K], 223.555 K to about 396 K (150 MPa).

    Returns
    -------
    float
        Melting pressure [Pa].

    References
    ----------
    Guder & Wagner, J. Phys. Chem. Ref. Data 38, 33 (2009), doi:10.1063/1.3037344
    (``GuderWagner2009``). The REFPROP 10 entry that quotes it cites doi:10.1063/1.5005537,
    which we could not resolve.

    Examples
    --------
    The published triple point, and a regression pin at 250 K:

    >>> melting_pressure_sf6_guder_wagner(223.555)
    231429.0
    >>> round(melting_pressure_sf6_guder_wagner(250.0) / 1e6, 3)
    8.325
    """
    return _sf6(T)[0]


def melting_dpdT_sf6_guder_wagner(T: float) -> float:
    """Slope dp/dT [Pa/K] of :func:`melting_pressure_sf6_guder_wagner` (zero at T_t).

    Parameters
    ----------
    T : float
        Temperature [K], 223.555 K to about 396 K.

    Examples
    --------
    A regression pin:

    >>> round(melting_dpdT_sf6_guder_wagner(250.0) / 1e6, 4)
    0.4759
    """
    return _sf6(T)[1]


def _h2(T: float) -> tuple[float, float]:
    x = checked_T(T, _H2_TT, _H2_TMAX, "normal-hydrogen melting curve", "Leachman et al. 2009")
    return reduced_power_melting(x, _H2_TT, _H2_PT, _H2_A, _H2_T)


def melting_pressure_hydrogen_leachman(T: float) -> float:
    """Melting pressure of normal hydrogen, as in the REFPROP 10 hydrogen file (Leachman 2009).

    p/p_t = 1 + 5626.3 (T/T_t - 1) + 2717.2 (T/T_t - 1)**1.83, T_t = 13.957 K, p_t = 7.3578 kPa.

    Parameters
    ----------
    T : float
        Temperature [K], 13.957 K to about 164.5 K (2000 MPa).

    Returns
    -------
    float
        Melting pressure [Pa].

    References
    ----------
    Leachman, Jacobsen, Penoncello & Lemmon, J. Phys. Chem. Ref. Data 38, 721 (2009),
    doi:10.1063/1.3160306 (``Leachman2009``); attribution from memory, see the module notes.

    Examples
    --------
    The triple point of Leachman et al. (2009), and a regression pin at 20 K:

    >>> melting_pressure_hydrogen_leachman(13.957)
    7357.8
    >>> round(melting_pressure_hydrogen_leachman(20.0) / 1e6, 3)
    22.252
    """
    return _h2(T)[0]


def melting_dpdT_hydrogen_leachman(T: float) -> float:
    """Slope dp/dT [Pa/K] of :func:`melting_pressure_hydrogen_leachman` (exact derivative).

    Parameters
    ----------
    T : float
        Temperature [K], 13.957 K to about 164.5 K.

    Examples
    --------
    At T_t the slope is 5626.3 p_t / T_t:

    >>> round(melting_dpdT_hydrogen_leachman(13.957) / 1e6, 4)
    2.9661
    """
    return _h2(T)[1]
