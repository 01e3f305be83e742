"""Sublimation-pressure equations of nitrogen, argon and methane.

All three share the form ln(p_sub/p_t) = (T_t/T) sum_i a_i (1 - T/T_t)**t_i, with the triple point
(T_t, p_t) of the reference equation of state of the substance:

========  ==============================================  =================  ===========
fluid     source of a_i, t_i                              T_t [K], p_t [Pa]  T_min [K]
========  ==============================================  =================  ===========
nitrogen  Span et al. (2000), ``"Span2000-N2"``            63.151, 12523      40
argon     Tegeler, Span & Wagner (1999), ``"Tegeler1999"`` 83.8058, 68891     53
methane   Lemmon (2002), ``"Lemmon2002-CH4-sub"``          90.6941, 11696     57
========  ==============================================  =================  ===========

Lower limits: none of the sources states one that we could confirm. We end each curve at about
0.63 T_t, the same reach below the triple point as the CO2 curve of :mod:`.co2`, where comparison
with independent data showed eq. (3.12) of Span & Wagner (1996) still within 1.5 %. For nitrogen
this also keeps above the alpha-beta transition of the solid at 35.6 K (from memory).

Methane: Setzmann & Wagner (1991, ``"SetzmannWagner1991"``) give the triple point used here. We
could not establish the form and coefficients of a sublimation equation of theirs reliably, so
none is implemented under their name. The function below uses the one-term equation of
Lemmon (2002, unpublished) that is distributed with the methane file of NIST REFPROP; its single
coefficient has four significant digits. The tests check it (and the other two) against the
triple-point relation L_sub = L_vap + L_fus.

Everything is SI (K, Pa). Outside its range a function raises
:class:`phasepath.errors.OutOfRangeError`.

Safety: these are cryogens. Liquid and solid nitrogen, argon and methane burn skin on contact;
nitrogen and argon displace air without warning (asphyxiation); methane is also flammable. A
closed vessel holding any of them builds pressure as it warms. Follow local codes and licensed
practice; these functions are design aids, not a safety case.
"""

from __future__ import annotations

import math

from ._checks import in_range

__all__ = [
    "CURVES",
    "sublimation_pressure_nitrogen",
    "sublimation_dpdT_nitrogen",
    "sublimation_pressure_argon",
    "sublimation_dpdT_argon",
    "sublimation_pressure_methane",
    "sublimation_dpdT_methane",
]

#: name -> (T_t [K], p_t [Pa], T_min [K], coefficients a_i, exponents t_i, source id)
CURVES: dict[str, tuple[float, float, float, tuple[float, ...], tuple[float, ...], str]] = {
    "nitrogen": (63.151, 12523.0, 40.0, (-13.088692,), (1.0,), "Span2000-N2"),
    "argon": (83.8058, 68891.0, 53.0, (-11.391604, -0.39513431), (1.0, 2.7), "Tegeler1999"),
    "methane": (90.6941, 11696.0, 57.0, (-12.84,), (1.0,), "Lemmon2002-CH4-sub"),
}


def _check_T(name: str, T: float) -> float:
    Tt, _, Tmin, _, _, source = CURVES[name]
    return in_range("T", T, Tmin, Tt, "K", f"{name} sublimation curve ({source})")


def _pressure(name: str, T: float) -> float:
    Tt, pt, _, a, t, _ = CURVES[name]
    th = 1.0 - T / Tt
    return pt * math.exp(Tt / T * sum(ai * th**ti for ai, ti in zip(a, t, strict=True)))


def _slope(name: str, T: float) -> float:
    Tt, _, _, a, t, _ = CURVES[name]
    th = 1.0 - T / Tt
    s = sum(ai * th**ti for ai, ti in zip(a, t, strict=True))
    ds = sum(ai * ti * th ** (ti - 1.0) for ai, ti in zip(a, t, strict=True))
    return _pressure(name, T) * (-Tt / T**2 * s - ds / T)


def sublimation_pressure_nitrogen(T: float) -> float:
    """Sublimation pressure of nitrogen, from the reference equation of Span et al. (2000).

    ln(p_sub/p_t) = (T_t/T) a1 (1 - T/T_t), a1 = -13.088692, T_t = 63.151 K, p_t = 12.523 kPa.

    Parameters
    ----------
    T : float
        Temperature [K], 40 K to 63.151 K.

    Returns
    -------
    float
        Sublimation pressure [Pa].

    References
    ----------
    Span, Lemmon, Jacobsen, Wagner & Yokozeki, J. Phys. Chem. Ref. Data 29, 1361 (2000),
    doi:10.1063/1.1349047 (``Span2000-N2``). NIST REFPROP's nitrogen file carries the same
    coefficient, credited to Lemmon (1999).

    Examples
    --------
    The published triple-point pressure at T_t, and a regression pin at 50 K (no printed value
    confirmed; the tests check the curve against L_sub = L_vap + L_fus at the triple point):

    >>> sublimation_pressure_nitrogen(63.151)
    12523.0
    >>> round(sublimation_pressure_nitrogen(50.0), 2)
    400.51
    """
    return _pressure("nitrogen", _check_T("nitrogen", T))


def sublimation_dpdT_nitrogen(T: float) -> float:
    """Slope dp_sub/dT [Pa/K] of :func:`sublimation_pressure_nitrogen` (its exact derivative).

    Parameters
    ----------
    T : float
        Temperature [K], 40 K to 63.151 K.

    Examples
    --------
    At T_t the slope is -a1 p_t / T_t:

    >>> round(sublimation_dpdT_nitrogen(63.151), 2)
    2595.52
    """
    return _slope("nitrogen", _check_T("nitrogen", T))


def sublimation_pressure_argon(T: float) -> float:
    """Sublimation pressure of argon, Tegeler, Span & Wagner (1999).

    ln(p_sub/p_t) = (T_t/T) [a1 (1 - T/T_t) + a2 (1 - T/T_t)**2.7], a1 = -11.391604,
    a2 = -0.39513431, T_t = 83.8058 K, p_t = 68.891 kPa.

    Parameters
    ----------
    T : float
        Temperature [K], 53 K to 83.8058 K.

    Returns
    -------
    float
        Sublimation pressure [Pa].

    References
    ----------
    Tegeler, Span & Wagner, J. Phys. Chem. Ref. Data 28, 779 (1999), doi:10.1063/1.556037
    (``Tegeler1999``). (NIST REFPROP's argon file uses a different one-term fit, Lemmon 2002.)

    Examples
    --------
    The published triple-point pressure at T_t, and a regression pin at 70 K:

    >>> sublimation_pressure_argon(83.8058)
    68891.0
    >>> round(sublimation_pressure_argon(70.0), 1)
    7258.5
    """
    return _pressure("argon", _check_T("argon", T))


def sublimation_dpdT_argon(T: float) -> float:
    """Slope dp_sub/dT [Pa/K] of :func:`sublimation_pressure_argon` (its exact derivative).

    Parameters
    ----------
    T : float
        Temperature [K], 53 K to 83.8058 K.

    Examples
    --------
    At T_t the a2 term has zero slope, so dp/dT = -a1 p_t / T_t:

    >>> round(sublimation_dpdT_argon(83.8058), 2)
    9364.26
    """
    return _slope("argon", _check_T("argon", T))


def sublimation_pressure_methane(T: float) -> float:
    """Sublimation pressure of methane, the one-term equation of Lemmon (2002).

    ln(p_sub/p_t) = (T_t/T) a1 (1 - T/T_t), a1 = -12.84, with the triple point of
    Setzmann & Wagner (1991), T_t = 90.6941 K, p_t = 11.696 kPa. Not an equation of
    Setzmann & Wagner: see the module notes.

    Parameters
    ----------
    T : float
        Temperature [K], 57 K to 90.6941 K.

    Returns
    -------
    float
        Sublimation pressure [Pa].

    References
    ----------
    Lemmon (2002), unpublished, distributed with the NIST REFPROP methane file
    (``Lemmon2002-CH4-sub``); triple point from Setzmann & Wagner, J. Phys. Chem. Ref. Data 20,
    1061 (1991), doi:10.1063/1.555898 (``SetzmannWagner1991``).

    Examples
    --------
    The triple-point pressure at T_t, and a regression pin at 77 K:

    >>> sublimation_pressure_methane(90.6941)
    11696.0
    >>> round(sublimation_pressure_methane(77.0), 1)
    1192.1
    """
    return _pressure("methane", _check_T("methane", T))


def sublimation_dpdT_methane(T: float) -> float:
    """Slope dp_sub/dT [Pa/K] of :func:`sublimation_pressure_methane` (its exact derivative).

    Parameters
    ----------
    T : float
        Temperature [K], 57 K to 90.6941 K.

    Examples
    --------
    >>> round(sublimation_dpdT_methane(90.6941), 3)
    1655.859
    """
    return _slope("methane", _check_T("methane", T))
