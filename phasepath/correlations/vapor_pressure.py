"""Published forms for vapor-pressure, sublimation and melting curves built from data.

One function per published form, each in SI (temperature in kelvin, pressure in pascal, molar
enthalpy in J/mol), with its inverse where the form has a closed one:

==========================  ============================================  ========================
form                        equation                                      source id
==========================  ============================================  ========================
:func:`antoine`             log_b p = A - B / (T + C)                     ``Antoine1888``
:func:`wagner_3_6`          ln(p/pc) = (Tc/T)(a t + b t^1.5 + c t^3 + d t^6)  ``Wagner1973``
:func:`wagner_25_5`         ln(p/pc) = (Tc/T)(a t + b t^1.5 + c t^2.5 + d t^5)  ``Poling2001``
:func:`clausius_clapeyron`  ln(p/p0) = -(dH/R)(1/T - 1/T0)                ``Clausius1850``
:func:`simon_glatzel`       p = p0 + a ((T/T0)^c - 1)                     ``SimonGlatzel1929``
==========================  ============================================  ========================

(t = 1 - T/Tc.) The coefficients belong to one substance and one published fit, so the range of
the fit is a parameter: pass ``T_range=(T_min, T_max)`` and a temperature outside it raises
:class:`~phasepath.errors.OutOfRangeError` naming the value and the range. ``T_range=None``
evaluates the formula anywhere it is defined; :mod:`phasepath.custom` does that only to extend a
curve beyond its data, and flags every such part.
"""

from __future__ import annotations

import math

from ..errors import OutOfRangeError

__all__ = [
    "R",
    "P_ATM",
    "SOURCES",
    "antoine",
    "antoine_temperature",
    "wagner_3_6",
    "wagner_25_5",
    "clausius_clapeyron",
    "clausius_clapeyron_temperature",
    "simon_glatzel",
    "simon_glatzel_temperature",
]

#: Molar gas constant [J/(mol K)], exact since the 2019 SI (CODATA 2018).
R = 8.314462618
#: Standard atmosphere [Pa] (exact by definition): the pressure of a "normal" boiling point.
P_ATM = 101325.0

#: Bibliography ids of the forms in this module (full citations in phasepath.bibliography).
SOURCES = {
    "antoine": "Antoine1888",
    "wagner_3_6": "Wagner1973",
    "wagner_25_5": "Poling2001",
    "clausius_clapeyron": "Clausius1850",
    "simon_glatzel": "SimonGlatzel1929",
}


def _check(T: float, T_range: tuple[float, float] | None, what: str) -> None:
    if not isinstance(T, (int, float)) or not math.isfinite(T) or T <= 0.0:
        raise OutOfRangeError(f"T = {T!r} K is not a positive finite temperature ({what})")
    if T_range is not None and not (T_range[0] <= T <= T_range[1]):
        raise OutOfRangeError(
            f"T = {T!r} K is outside the range of the {what}: {T_range[0]:g} K to {T_range[1]:g} K"
        )


def antoine(
    T: float,
    A: float,
    B: float,
    C: float,
    *,
    base: float = 10.0,
    T_range: tuple[float, float] | None = None,
) -> float:
    """Vapor pressure by the Antoine equation, log_base(p/Pa) = A - B / (T/K + C).

    Parameters
    ----------
    T : float
        Temperature [K].
    A : float
        Constant [-] for the pressure in pascal.
    B : float
        Slope [K].
    C : float
        Temperature offset [K]; ``T + C`` must stay positive.
    base : float
        Base of the logarithm (10 for most tables; ``math.e`` for natural-log tables).
    T_range : (float, float), optional
        Range of the fit [K]; outside it the function raises.

    Returns
    -------
    float
        Vapor pressure [Pa].

    Notes
    -----
    Source: Antoine (1888), bibliography id ``Antoine1888``. Tables give A in many pressure
    units and C for the temperature in degrees Celsius; convert them first (A + log10(1e5) for
    bar, C - 273.15 for Celsius).

    Examples
    --------
    Methane with the coefficients of Poling et al. (2001), Appendix A, in Pa and K, at 100 K;
    the reference library ``chemicals`` 1.5.2 documents the same value (``Antoine`` example):

    >>> round(antoine(100.0, 8.7687, 395.744, -6.469), 6)
    34478.36735

    Outside the range of a fit:

    >>> antoine(50.0, 8.7687, 395.744, -6.469, T_range=(93.0, 120.0))  # doctest: +ELLIPSIS
    Traceback (most recent call last):
    ...
    phasepath.errors.OutOfRangeError: T = 50.0 K is outside the range of ...: 93 K to 120 K
    """
    _check(T, T_range, "Antoine equation")
    if T + C <= 0.0:
        raise OutOfRangeError(
            f"T = {T!r} K is at or below the pole of the Antoine equation (T + C <= 0, C = {C:g} K)"
        )
    return float(base ** (A - B / (T + C)))


def antoine_temperature(p: float, A: float, B: float, C: float, *, base: float = 10.0) -> float:
    """Inverse of :func:`antoine`: the temperature [K] where the vapor pressure is p [Pa].

    T = B / (A - log_base p) - C.

    >>> round(antoine_temperature(antoine(100.0, 8.7687, 395.744, -6.469),
    ...                           8.7687, 395.744, -6.469), 9)
    100.0
    """
    if not (isinstance(p, (int, float)) and math.isfinite(p) and p > 0.0):
        raise OutOfRangeError(f"p = {p!r} Pa is not a positive finite pressure (Antoine equation)")
    d = A - math.log(p) / math.log(base)
    if d <= 0.0:
        raise OutOfRangeError(
            f"p = {p!r} Pa is beyond the top of the Antoine equation (log p >= A)"
        )
    return B / d - C


def _wagner(
    T: float,
    T_c: float,
    p_c: float,
    coef: tuple[float, float, float, float],
    powers: tuple[float, float, float, float],
    T_range: tuple[float, float] | None,
    what: str,
) -> float:
    _check(T, T_range, what)
    if T > T_c:
        raise OutOfRangeError(f"T = {T!r} K is above the critical temperature {T_c:g} K ({what})")
    tau = 1.0 - T / T_c
    s = sum(k * tau**n for k, n in zip(coef, powers, strict=True))
    return float(p_c * math.exp(s * T_c / T))


def wagner_3_6(
    T: float,
    T_c: float,
    p_c: float,
    a: float,
    b: float,
    c: float,
    d: float,
    *,
    T_range: tuple[float, float] | None = None,
) -> float:
    """Vapor pressure by the Wagner equation in its original 3-6 form.

    ln(p/p_c) = (T_c/T) (a tau + b tau^1.5 + c tau^3 + d tau^6), tau = 1 - T/T_c.

    Parameters
    ----------
    T : float
        Temperature [K], at most T_c.
    T_c : float
        Critical temperature of the fit [K].
    p_c : float
        Critical pressure of the fit [Pa].
    a, b, c, d : float
        Coefficients [-].
    T_range : (float, float), optional
        Range of the fit [K].

    Returns
    -------
    float
        Vapor pressure [Pa].

    Notes
    -----
    Source: Wagner (1973), bibliography id ``Wagner1973``; McGarry (1983) tabulates the
    coefficients of some 250 liquids in this form.

    Examples
    --------
    Methane with McGarry's (1983) coefficients at 100 K; the reference library ``chemicals``
    1.5.2 documents the same value (``Wagner_original`` example):

    >>> round(wagner_3_6(100.0, 190.53, 4596420.0, -6.00435, 1.1885, -0.834082, -1.22833), 6)
    34520.446015

    At the critical temperature the curve ends at the critical pressure:

    >>> wagner_3_6(190.53, 190.53, 4596420.0, -6.00435, 1.1885, -0.834082, -1.22833)
    4596420.0
    """
    return _wagner(
        T, T_c, p_c, (a, b, c, d), (1.0, 1.5, 3.0, 6.0), T_range, "Wagner equation (3-6 form)"
    )


def wagner_25_5(
    T: float,
    T_c: float,
    p_c: float,
    a: float,
    b: float,
    c: float,
    d: float,
    *,
    T_range: tuple[float, float] | None = None,
) -> float:
    """Vapor pressure by the Wagner equation in its 2.5-5 form.

    ln(p/p_c) = (T_c/T) (a tau + b tau^1.5 + c tau^2.5 + d tau^5), tau = 1 - T/T_c.

    Parameters
    ----------
    T : float
        Temperature [K], at most T_c.
    T_c : float
        Critical temperature of the fit [K].
    p_c : float
        Critical pressure of the fit [Pa].
    a, b, c, d : float
        Coefficients [-].
    T_range : (float, float), optional
        Range of the fit [K].

    Returns
    -------
    float
        Vapor pressure [Pa].

    Notes
    -----
    Source: Poling, Prausnitz & O'Connell (2001), chapter 7 and Appendix A, bibliography id
    ``Poling2001``.

    Examples
    --------
    Methane with the coefficients of Poling et al. (2001), Appendix A, at 100 K; the reference
    library ``chemicals`` 1.5.2 documents the same value (``Wagner`` example):

    >>> round(wagner_25_5(100.0, 190.551, 4599200.0, -6.02242, 1.26652, -0.5707, -1.366), 6)
    34415.004763
    """
    return _wagner(
        T, T_c, p_c, (a, b, c, d), (1.0, 1.5, 2.5, 5.0), T_range, "Wagner equation (2.5-5 form)"
    )


def clausius_clapeyron(
    T: float, T_ref: float, p_ref: float, dH: float, *, T_range: tuple[float, float] | None = None
) -> float:
    """Vapor or sublimation pressure by the integrated Clausius-Clapeyron equation.

    ln(p/p_ref) = -(dH/R) (1/T - 1/T_ref): the gas ideal, the condensed phase's volume neglected
    and the enthalpy of the transition constant.

    Parameters
    ----------
    T : float
        Temperature [K].
    T_ref, p_ref : float
        A point on the curve [K, Pa] (a normal boiling point, a triple point).
    dH : float
        Molar enthalpy of vaporization or sublimation [J/mol], positive.
    T_range : (float, float), optional
        Range where the constant-enthalpy assumption is accepted [K].

    Returns
    -------
    float
        Pressure on the curve [Pa].

    Notes
    -----
    Source: Clausius (1850), bibliography id ``Clausius1850``.

    Examples
    --------
    Water from its normal boiling point (373.124 K at 101325 Pa) with the enthalpy of
    vaporization there, 40.651 kJ/mol, both from IAPWS-95 (as computed by the ``iapws``
    package), at 363.15 K. IAPWS-95 gives 70.182 kPa there, so 10 K away the ideal-gas,
    constant-enthalpy curve is 0.7 % high:

    >>> round(clausius_clapeyron(363.15, 373.124, 101325.0, 40651.0) / 1e3, 2)
    70.7
    """
    _check(T, T_range, "Clausius-Clapeyron equation")
    return float(p_ref * math.exp(-dH / R * (1.0 / T - 1.0 / T_ref)))


def clausius_clapeyron_temperature(p: float, T_ref: float, p_ref: float, dH: float) -> float:
    """Inverse of :func:`clausius_clapeyron`: the temperature [K] where the pressure is p [Pa].

    >>> round(clausius_clapeyron_temperature(101325.0, 373.124, 101325.0, 40651.0), 9)
    373.124
    """
    if not (isinstance(p, (int, float)) and math.isfinite(p) and p > 0.0):
        raise OutOfRangeError(
            f"p = {p!r} Pa is not a positive finite pressure (Clausius-Clapeyron equation)"
        )
    x = 1.0 / T_ref - R * math.log(p / p_ref) / dH
    if x <= 0.0:
        raise OutOfRangeError(f"p = {p!r} Pa is beyond the Clausius-Clapeyron curve (1/T <= 0)")
    return 1.0 / x


def simon_glatzel(
    T: float,
    T_ref: float,
    p_ref: float,
    a: float,
    c: float,
    *,
    T_range: tuple[float, float] | None = None,
) -> float:
    """Melting pressure by the Simon-Glatzel equation, p = p_ref + a ((T/T_ref)^c - 1).

    Parameters
    ----------
    T : float
        Temperature [K].
    T_ref, p_ref : float
        Reference point on the melting curve [K, Pa], usually the triple point.
    a : float
        Pressure coefficient [Pa], positive.
    c : float
        Exponent [-], positive.
    T_range : (float, float), optional
        Range of the fit [K].

    Returns
    -------
    float
        Melting pressure [Pa].

    Notes
    -----
    Source: Simon & Glatzel (1929), bibliography id ``SimonGlatzel1929``.

    Examples
    --------
    Methane with the parameters of Abramson (2011) as carried by CoolProp 8.0.0
    (T_ref = 90.6941 K, p_ref = 11.7 kPa, a = 208 MPa, c = 1.698) at 150 K; CoolProp's own
    melting line gives 280.77 MPa there (cross-check with the reference library):

    >>> round(simon_glatzel(150.0, 90.6941, 11700.0, 208e6, 1.698) / 1e6, 2)
    280.77
    """
    _check(T, T_range, "Simon-Glatzel equation")
    return float(p_ref + a * ((T / T_ref) ** c - 1.0))


def simon_glatzel_temperature(p: float, T_ref: float, p_ref: float, a: float, c: float) -> float:
    """Inverse of :func:`simon_glatzel`: the melting temperature [K] at p [Pa].

    T = T_ref ((p - p_ref)/a + 1)^(1/c).

    >>> round(simon_glatzel_temperature(simon_glatzel(150.0, 90.6941, 11700.0, 208e6, 1.698),
    ...                                 90.6941, 11700.0, 208e6, 1.698), 9)
    150.0
    """
    x = (p - p_ref) / a + 1.0
    if not math.isfinite(x) or x <= 0.0:
        raise OutOfRangeError(f"p = {p!r} Pa is below the Simon-Glatzel curve's reach")
    return float(T_ref * x ** (1.0 / c))
