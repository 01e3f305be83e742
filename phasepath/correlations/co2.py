"""Carbon dioxide: sublimation and melting curves, the solid, and latent heats along both curves.

* Sublimation pressure, Span & Wagner (1996) eq. (3.12), and melting pressure, eq. (3.10); source id
  ``"SpanWagner1996"``.
* Solid CO2 (dry ice), the Gibbs-energy equation of state of Jäger & Span (2012); source id
  ``"JagerSpan2012"``. Its reference state is the one of Span & Wagner (1996), the reference state
  CoolProp uses for CO2, so fluid enthalpies from CoolProp and solid enthalpies from here can be
  subtracted directly.
* Latent heats of sublimation and fusion by the Clapeyron equation,
  ``L = T (v_fluid - v_solid) dp/dT``, on the published curves, with the solid volume of
  Jäger & Span (2012) and the fluid volume supplied by the caller.

Everything is SI: K, Pa, J/kg, m3/kg. Outside its range a function raises
:class:`phasepath.errors.OutOfRangeError`.

Safety: solid CO2 is at 194.7 K (-78.5 degC) at atmospheric pressure; it burns skin on contact,
and the gas it gives off displaces air in closed rooms (asphyxiation). Sealed vessels holding
dry ice or liquid CO2 can burst as it warms. Plan and operate such equipment under local codes
and licensed practice; these functions are design aids, not a safety case.
"""

from __future__ import annotations

import math
from functools import lru_cache

from ..rootfind import find_root
from ._checks import in_range

__all__ = [
    "SOURCE_CURVES",
    "SOURCE_SOLID",
    "T_TRIPLE",
    "P_TRIPLE",
    "MOLAR_MASS",
    "SUBLIMATION_T_MIN",
    "MELTING_T_MAX",
    "SOLID_T_MIN",
    "SOLID_T_MAX",
    "SOLID_P_MAX",
    "FUSION_T_MAX",
    "sublimation_pressure_co2",
    "sublimation_dpdT_co2",
    "sublimation_temperature_co2",
    "melting_pressure_co2",
    "melting_dpdT_co2",
    "melting_temperature_co2",
    "solid_gibbs_co2",
    "solid_volume_co2",
    "solid_entropy_co2",
    "solid_enthalpy_co2",
    "solid_cp_co2",
    "latent_heat_sublimation_co2",
    "latent_heat_fusion_co2",
]

SOURCE_CURVES = "SpanWagner1996"
SOURCE_SOLID = "JagerSpan2012"

T_TRIPLE = 216.592  # K, triple point used by Span & Wagner (1996) for eqs. (3.10) and (3.12)
P_TRIPLE = 517950.0  # Pa, idem (0.51795 MPa)
MOLAR_MASS = 0.0440098  # kg/mol, Span & Wagner (1996)

#: Lower end of the sublimation curve [K]. Our choice: below 140 K eq. (3.12) falls more than
#: 1.5 % below the compilation of Fray & Schmitt (2009) and the Jäger & Span (2012) solid, and
#: the latent heat from its slope degrades with it.
SUBLIMATION_T_MIN = 140.0

# Melting curve, eq. (3.10): p/pt = 1 + a1 (T/Tt - 1) + a2 (T/Tt - 1)**2.
_MELT_A1 = 1955.5390
_MELT_A2 = 2055.4593

# Sublimation curve, eq. (3.12): ln(p/pt) = (Tt/T) sum a_i (1 - T/Tt)**t_i.
_SUB_A = (-14.740846, 2.4327015, -5.3061778)
_SUB_T = (1.0, 1.9, 2.9)


def _temperature_at_melting_pressure(p: float) -> float:
    """Inverse of eq. (3.10), the root x = T/Tt - 1 >= 0 of a2 x**2 + a1 x + (1 - p/pt) = 0."""
    c = 1.0 - p / P_TRIPLE
    x = (-_MELT_A1 + math.sqrt(_MELT_A1**2 - 4.0 * _MELT_A2 * c)) / (2.0 * _MELT_A2)
    return T_TRIPLE * (1.0 + x)


#: Upper end of the melting curve [K]: where eq. (3.10) reaches 800 MPa, the upper pressure of the
#: Span & Wagner (1996) equation of state it accompanies (about 327 K).
MELTING_T_MAX = _temperature_at_melting_pressure(800.0e6)

#: Range of the solid equation of state as stated by Jäger & Span (2012): 80 K to 300 K, to 500 MPa.
SOLID_T_MIN = 80.0
SOLID_T_MAX = 300.0
SOLID_P_MAX = 500.0e6

#: Upper temperature of the fusion latent heat [K]: where the melting curve reaches SOLID_P_MAX.
FUSION_T_MAX = _temperature_at_melting_pressure(SOLID_P_MAX)


def _check_sub_T(T: float) -> float:
    return in_range(
        "T",
        T,
        SUBLIMATION_T_MIN,
        T_TRIPLE,
        "K",
        "CO2 sublimation curve (Span & Wagner 1996 eq. 3.12)",
    )


def _check_melt_T(T: float) -> float:
    return in_range(
        "T", T, T_TRIPLE, MELTING_T_MAX, "K", "CO2 melting curve (Span & Wagner 1996 eq. 3.10)"
    )


def sublimation_pressure_co2(T: float) -> float:
    """Sublimation pressure of CO2, Span & Wagner (1996) eq. (3.12).

    ln(p_sub/p_t) = (T_t/T) [a1 (1 - T/T_t) + a2 (1 - T/T_t)**1.9 + a3 (1 - T/T_t)**2.9],
    a1 = -14.740846, a2 = 2.4327015, a3 = -5.3061778, T_t = 216.592 K, p_t = 0.51795 MPa.

    Parameters
    ----------
    T : float
        Temperature [K], ``SUBLIMATION_T_MIN`` (140 K) to 216.592 K.

    Returns
    -------
    float
        Sublimation pressure [Pa].

    Raises
    ------
    OutOfRangeError
        T outside 140 K to 216.592 K.

    References
    ----------
    Span & Wagner, J. Phys. Chem. Ref. Data 25, 1509 (1996), doi:10.1063/1.555991
    (``SpanWagner1996``).

    Examples
    --------
    At the triple point the equation returns p_t:

    >>> sublimation_pressure_co2(216.592)
    517950.0

    Span & Wagner's normal sublimation temperature, 194.686 K, gives one atmosphere (to 0.1 %):

    >>> round(sublimation_pressure_co2(194.686) / 101325.0, 3)
    1.0
    """
    T = _check_sub_T(T)
    th = 1.0 - T / T_TRIPLE
    s = sum(a * th**t for a, t in zip(_SUB_A, _SUB_T, strict=True))
    return P_TRIPLE * math.exp(T_TRIPLE / T * s)


def sublimation_dpdT_co2(T: float) -> float:
    """Slope dp/dT of the CO2 sublimation curve, the derivative of Span & Wagner (1996) eq. (3.12).

    dp/dT = p_sub [-(T_t/T**2) S - (1/T) dS/dtheta], S = sum a_i theta**t_i, theta = 1 - T/T_t.

    Parameters
    ----------
    T : float
        Temperature [K], 140 K to 216.592 K.

    Returns
    -------
    float
        dp_sub/dT [Pa/K].

    Examples
    --------
    Slope at one atmosphere, about 5.4 kPa/K; compare the central difference of eq. (3.12)
    (a check of the derivative, not a printed value):

    >>> T = 194.686
    >>> fd = (sublimation_pressure_co2(T + 1e-4) - sublimation_pressure_co2(T - 1e-4)) / 2e-4
    >>> abs(sublimation_dpdT_co2(T) / fd - 1) < 1e-7
    True
    """
    T = _check_sub_T(T)
    th = 1.0 - T / T_TRIPLE
    s = sum(a * th**t for a, t in zip(_SUB_A, _SUB_T, strict=True))
    ds = sum(a * t * th ** (t - 1.0) for a, t in zip(_SUB_A, _SUB_T, strict=True))
    p = P_TRIPLE * math.exp(T_TRIPLE / T * s)
    return p * (-T_TRIPLE / T**2 * s - ds / T)


def sublimation_temperature_co2(p: float) -> float:
    """Temperature on the CO2 sublimation curve at pressure p, the inverse of eq. (3.12).

    Solved by bracketing (Brent) on ln p between 140 K and the triple point; the returned
    temperature reproduces ln p to 1e-12.

    Parameters
    ----------
    p : float
        Pressure [Pa], from p_sub(140 K) (about 184 Pa) to 0.51795 MPa.

    Returns
    -------
    float
        Sublimation temperature [K].

    Examples
    --------
    Span & Wagner (1996) give 194.686 K for the normal sublimation temperature (0.101325 MPa):

    >>> round(sublimation_temperature_co2(101325.0), 3)
    194.685
    >>> abs(sublimation_temperature_co2(101325.0) - 194.686) < 1e-3
    True
    """
    p_min = sublimation_pressure_co2(SUBLIMATION_T_MIN)
    p = in_range(
        "p", p, p_min, P_TRIPLE, "Pa", "CO2 sublimation curve (Span & Wagner 1996 eq. 3.12)"
    )
    if p == P_TRIPLE:
        return T_TRIPLE
    lnp = math.log(p)
    return find_root(
        lambda T: math.log(sublimation_pressure_co2(T)) - lnp,
        SUBLIMATION_T_MIN,
        T_TRIPLE,
        what=f"the CO2 sublimation temperature at p = {p:g} Pa",
    ).root


def melting_pressure_co2(T: float) -> float:
    """Melting pressure of CO2, Span & Wagner (1996) eq. (3.10).

    p_melt/p_t = 1 + a1 (T/T_t - 1) + a2 (T/T_t - 1)**2, a1 = 1955.5390, a2 = 2055.4593,
    T_t = 216.592 K, p_t = 0.51795 MPa.

    Parameters
    ----------
    T : float
        Temperature [K], 216.592 K to ``MELTING_T_MAX`` (about 327 K, where the curve reaches
        800 MPa, the upper pressure of the Span & Wagner equation of state).

    Returns
    -------
    float
        Melting pressure [Pa].

    Examples
    --------
    >>> melting_pressure_co2(216.592)
    517950.0

    At 250 K (a regression pin computed from the published coefficients; CoolProp 8.0.0 carries
    the same equation and agrees, see the tests):

    >>> round(melting_pressure_co2(250.0) / 1e6, 4)
    182.0759
    """
    T = _check_melt_T(T)
    x = T / T_TRIPLE - 1.0
    return P_TRIPLE * (1.0 + _MELT_A1 * x + _MELT_A2 * x * x)


def melting_dpdT_co2(T: float) -> float:
    """Slope dp/dT of the CO2 melting curve, the derivative of Span & Wagner (1996) eq. (3.10).

    dp/dT = (p_t/T_t) [a1 + 2 a2 (T/T_t - 1)].

    Parameters
    ----------
    T : float
        Temperature [K], 216.592 K to ``MELTING_T_MAX``.

    Returns
    -------
    float
        dp_melt/dT [Pa/K].

    Examples
    --------
    At the triple point the slope is p_t a1 / T_t, about 4.68 MPa/K:

    >>> round(melting_dpdT_co2(216.592) / 1e6, 4)
    4.6764
    """
    T = _check_melt_T(T)
    x = T / T_TRIPLE - 1.0
    return P_TRIPLE / T_TRIPLE * (_MELT_A1 + 2.0 * _MELT_A2 * x)


def melting_temperature_co2(p: float) -> float:
    """Temperature on the CO2 melting curve at pressure p, the exact inverse of eq. (3.10).

    Parameters
    ----------
    p : float
        Pressure [Pa], 0.51795 MPa to 800 MPa.

    Returns
    -------
    float
        Melting temperature [K].

    Examples
    --------
    >>> round(melting_temperature_co2(melting_pressure_co2(250.0)), 9)
    250.0
    """
    p = in_range("p", p, P_TRIPLE, 800.0e6, "Pa", "CO2 melting curve (Span & Wagner 1996 eq. 3.10)")
    return _temperature_at_melting_pressure(p)


# --- Solid CO2: Jäger & Span (2012), eqs. (8), (9), (21), (22) --------------------------------
# Constants of their Table 1. g/(R T0) is dimensionless; T0 = 150 K, p0 = 101325 Pa.
_JS_R = 8.314472  # J/(mol K), the gas constant of the model
_JS_T0 = 150.0
_JS_P0 = 101325.0
_JS_G = (
    -2.6385478,
    4.5088732,
    -2.0109135,
    -2.7976237,
    2.6427834e-1,
    3.8259935,
    3.1711996e-1,
    2.2087195e-3,
    -1.1289668,
    9.2923982e-3,
    3.3914617e3,
)
_JS_GA = (
    3.9993365e-2,
    2.3945101e-3,
    3.2839467e-1,
    5.7918471e-2,
    2.3945101e-3,
    -2.6531689e-3,
    1.6419734e-1,
    1.7594802e-1,
    2.6531689e-3,
)
_JS_GK = (2.2690751e-1, -7.5019750e-2, 2.6442913e-1)
_JS_NU = 6.0 / 7.0  # (n - 1)/n with n = 7


@lru_cache(maxsize=512)
def _js_terms(T: float, p: float) -> tuple[float, float, float, float]:
    """Reduced Gibbs energy of the solid and its derivatives: (G, G_t, G_tt, G_pi).

    Cached: h, s and v of one state come from one evaluation.
    """
    g0, g1, g2, g3, g4, g5, g6, g7, g8, g9, g10 = _JS_G
    a0, a1, a2, a3, a4, a5, a6, a7, a8 = _JS_GA
    k0, k1, k2 = _JS_GK
    t = T / _JS_T0
    pi = p / _JS_P0
    dt = t - 1.0
    dpi = pi - 1.0

    def lterm(c: float) -> tuple[float, float, float]:
        at = math.atan(t / c) - math.atan(1.0 / c)
        val = math.log((t * t + c * c) / (1.0 + c * c)) - 2.0 * t / c * at
        return val, -2.0 / c * at, -2.0 / (t * t + c * c)

    l4, l4_t, l4_tt = lterm(g4)
    l6, l6_t, l6_tt = lterm(g6)

    q1 = t * t - a2 * t + a3
    q2 = t * t + a2 * t + a3
    u1 = (t - a6) / a7
    u2 = (t + a6) / a7
    f = (
        a0 * (t * t - 1.0)
        + a1 * math.log(q1 / (1.0 - a2 + a3))
        + a4 * math.log(q2 / (1.0 + a2 + a3))
        + a5 * (math.atan(u1) - math.atan((1.0 - a6) / a7))
        + a8 * (math.atan(u2) - math.atan((1.0 + a6) / a7))
    )
    f_t = (
        2.0 * a0 * t
        + a1 * (2.0 * t - a2) / q1
        + a4 * (2.0 * t + a2) / q2
        + a5 / a7 / (1.0 + u1 * u1)
        + a8 / a7 / (1.0 + u2 * u2)
    )
    f_tt = (
        2.0 * a0
        + a1 * (2.0 * q1 - (2.0 * t - a2) ** 2) / q1**2
        + a4 * (2.0 * q2 - (2.0 * t + a2) ** 2) / q2**2
        - a5 / a7**2 * 2.0 * u1 / (1.0 + u1 * u1) ** 2
        - a8 / a7**2 * 2.0 * u2 / (1.0 + u2 * u2) ** 2
    )
    ef = math.exp(f)

    K = k0 * t * t + k1 * t + k2
    K_t = 2.0 * k0 * t + k1
    K_tt = 2.0 * k0
    w = (pi + g10) ** _JS_NU - (1.0 + g10) ** _JS_NU

    G = g0 + g1 * dt + g2 * dt * dt + g3 * l4 + g5 * l6 + g7 * dpi * (ef + K * g8) + g9 * K * w
    G_t = (
        g1 + 2.0 * g2 * dt + g3 * l4_t + g5 * l6_t + g7 * dpi * (ef * f_t + K_t * g8) + g9 * K_t * w
    )
    G_tt = (
        2.0 * g2
        + g3 * l4_tt
        + g5 * l6_tt
        + g7 * dpi * (ef * (f_tt + f_t * f_t) + K_tt * g8)
        + g9 * K_tt * w
    )
    G_pi = g7 * (ef + K * g8) + g9 * K * _JS_NU * (pi + g10) ** (_JS_NU - 1.0)
    return G, G_t, G_tt, G_pi


def _check_solid(T: float, p: float) -> tuple[float, float]:
    T = in_range(
        "T",
        T,
        SOLID_T_MIN,
        SOLID_T_MAX,
        "K",
        "range of the solid CO2 equation of state (Jäger & Span 2012)",
    )
    p = in_range(
        "p",
        p,
        0.0,
        SOLID_P_MAX,
        "Pa",
        "range of the solid CO2 equation of state (Jäger & Span 2012)",
        open_low=True,
    )
    return T, p


def solid_gibbs_co2(T: float, p: float) -> float:
    """Specific Gibbs energy of solid CO2, Jäger & Span (2012) eq. (8).

    g/(R T0) = g0 + g1 dt + g2 dt**2 + g3 L(t; g4) + g5 L(t; g6)
    + g7 dpi [exp(f_alpha(t)) + K(t) g8] + g9 K(t) [(pi + g10)**(6/7) - (1 + g10)**(6/7)],
    with t = T/T0, dt = t - 1, pi = p/p0, dpi = pi - 1, T0 = 150 K, p0 = 101325 Pa,
    L(t; c) = ln[(t**2 + c**2)/(1 + c**2)] - (2t/c)[atan(t/c) - atan(1/c)], f_alpha and K of
    eqs. (21) and (22), constants of their Table 1. Reference state: Span & Wagner (1996).

    Parameters
    ----------
    T : float
        Temperature [K], 80 K to 300 K.
    p : float
        Pressure [Pa], above 0 to 500 MPa.

    Returns
    -------
    float
        Specific Gibbs energy [J/kg].

    References
    ----------
    Jäger & Span, J. Chem. Eng. Data 57, 590 (2012), doi:10.1021/je2011677 (``JagerSpan2012``).

    Examples
    --------
    Check values of Jäger & Span (2012) Table 5, in J/mol: -1.447007522e3 at 216.592 K and
    0.51795 MPa, -2.961795962e3 at 100 K and 100 MPa.

    >>> f"{solid_gibbs_co2(216.592, 0.51795e6) * MOLAR_MASS:.9e}"
    '-1.447007522e+03'
    >>> f"{solid_gibbs_co2(100.0, 100e6) * MOLAR_MASS:.9e}"
    '-2.961795962e+03'
    """
    T, p = _check_solid(T, p)
    G = _js_terms(T, p)[0]
    return _JS_R * _JS_T0 * G / MOLAR_MASS


def solid_volume_co2(T: float, p: float) -> float:
    """Specific volume of solid CO2, v = (dg/dp)_T of Jäger & Span (2012) eq. (8).

    v = (R T0/p0) {g7 [exp(f_alpha(t)) + K(t) g8] + g9 K(t) (6/7) (pi + g10)**(-1/7)} / M.

    Parameters
    ----------
    T : float
        Temperature [K], 80 K to 300 K.
    p : float
        Pressure [Pa], above 0 to 500 MPa.

    Returns
    -------
    float
        Specific volume [m3/kg].

    Examples
    --------
    Jäger & Span (2012) Table 5, in m3/mol: 2.848595255e-5 at 216.592 K and 0.51795 MPa,
    2.614596591e-5 at 100 K and 100 MPa.

    >>> f"{solid_volume_co2(216.592, 0.51795e6) * MOLAR_MASS:.9e}"
    '2.848595255e-05'
    >>> f"{solid_volume_co2(100.0, 100e6) * MOLAR_MASS:.9e}"
    '2.614596591e-05'
    """
    T, p = _check_solid(T, p)
    G_pi = _js_terms(T, p)[3]
    return _JS_R * _JS_T0 / _JS_P0 * G_pi / MOLAR_MASS


def solid_entropy_co2(T: float, p: float) -> float:
    """Specific entropy of solid CO2, s = -(dg/dT)_p of Jäger & Span (2012) eq. (8).

    Parameters
    ----------
    T : float
        Temperature [K], 80 K to 300 K.
    p : float
        Pressure [Pa], above 0 to 500 MPa.

    Returns
    -------
    float
        Specific entropy [J/(kg K)], Span & Wagner (1996) reference state.

    Examples
    --------
    Jäger & Span (2012) Table 5, in J/(mol K): -1.803247012e1 at 216.592 K and 0.51795 MPa,
    -5.623154438e1 at 100 K and 100 MPa.

    >>> f"{solid_entropy_co2(216.592, 0.51795e6) * MOLAR_MASS:.9e}"
    '-1.803247012e+01'
    >>> f"{solid_entropy_co2(100.0, 100e6) * MOLAR_MASS:.9e}"
    '-5.623154438e+01'
    """
    T, p = _check_solid(T, p)
    G_t = _js_terms(T, p)[1]
    return -_JS_R * G_t / MOLAR_MASS


def solid_enthalpy_co2(T: float, p: float) -> float:
    """Specific enthalpy of solid CO2, h = g - T (dg/dT)_p of Jäger & Span (2012) eq. (8).

    Parameters
    ----------
    T : float
        Temperature [K], 80 K to 300 K.
    p : float
        Pressure [Pa], above 0 to 500 MPa.

    Returns
    -------
    float
        Specific enthalpy [J/kg], Span & Wagner (1996) reference state (the one CoolProp uses
        for CO2), so ``h_fluid - solid_enthalpy_co2`` is a latent heat.

    Examples
    --------
    From the Table 5 values of g and s: h = g + T s = -1447.007522 + 216.592 * (-18.03247012)
    = -5352.696 J/mol at the triple point.

    >>> round(solid_enthalpy_co2(216.592, 0.51795e6) * MOLAR_MASS, 3)
    -5352.696
    """
    T, p = _check_solid(T, p)
    G, G_t, _, _ = _js_terms(T, p)
    return (_JS_R * _JS_T0 * G - T * _JS_R * G_t) / MOLAR_MASS


def solid_cp_co2(T: float, p: float) -> float:
    """Specific isobaric heat capacity of solid CO2, c_p = -T (d2g/dT2)_p, Jäger & Span (2012).

    Parameters
    ----------
    T : float
        Temperature [K], 80 K to 300 K.
    p : float
        Pressure [Pa], above 0 to 500 MPa.

    Returns
    -------
    float
        c_p [J/(kg K)].

    Examples
    --------
    Jäger & Span (2012) Table 5, in J/(mol K): 5.913420271e1 at 216.592 K and 0.51795 MPa,
    3.911045710e1 at 100 K and 100 MPa.

    >>> f"{solid_cp_co2(216.592, 0.51795e6) * MOLAR_MASS:.9e}"
    '5.913420271e+01'
    >>> f"{solid_cp_co2(100.0, 100e6) * MOLAR_MASS:.9e}"
    '3.911045710e+01'
    """
    T, p = _check_solid(T, p)
    G_tt = _js_terms(T, p)[2]
    return -T * _JS_R / _JS_T0 * G_tt / MOLAR_MASS


def latent_heat_sublimation_co2(T: float, v_vapour: float) -> float:
    """Latent heat of sublimation of CO2 at T, by the Clapeyron equation on eq. (3.12).

    L_sub = T [v_vapour - v_solid(T, p_sub)] dp_sub/dT, with p_sub and its slope from
    Span & Wagner (1996) eq. (3.12) and v_solid from Jäger & Span (2012).

    Parameters
    ----------
    T : float
        Temperature on the sublimation curve [K], 140 K to 216.592 K.
    v_vapour : float
        Specific volume of the saturated vapour at (T, p_sub(T)) [m3/kg], from the caller's
        fluid equation of state (CoolProp's Span & Wagner value, for instance). Below the
        triple point CoolProp 8.0.0 refuses (p, T) inputs for CO2; solve its (density, T) inputs
        for p = p_sub(T) instead.

    Returns
    -------
    float
        Latent heat of sublimation [J/kg].

    Examples
    --------
    At one atmosphere with the ideal-gas vapour volume R T / (M p), a stand-in that is 2 % too
    large here, the result (a regression pin) is 25.8 kJ/mol; with the Span & Wagner vapour
    volume it is 25.3 kJ/mol, against the 25.2 kJ/mol usually quoted for dry ice (from memory):

    >>> T = 194.686
    >>> v_ig = 8.314462618 * T / (MOLAR_MASS * sublimation_pressure_co2(T))
    >>> round(latent_heat_sublimation_co2(T, v_ig) * MOLAR_MASS / 1e3, 1)
    25.8
    """
    T = _check_sub_T(T)
    v_vapour = in_range(
        "v_vapour", v_vapour, 0.0, math.inf, "m3/kg", "range of specific volumes", open_low=True
    )
    p = sublimation_pressure_co2(T)
    v_s = solid_volume_co2(T, p)
    return T * (v_vapour - v_s) * sublimation_dpdT_co2(T)


def latent_heat_fusion_co2(T: float, v_liquid: float) -> float:
    """Latent heat of fusion of CO2 at T, by the Clapeyron equation on eq. (3.10).

    L_fus = T [v_liquid - v_solid(T, p_melt)] dp_melt/dT, with p_melt and its slope from
    Span & Wagner (1996) eq. (3.10) and v_solid from Jäger & Span (2012).

    Parameters
    ----------
    T : float
        Temperature on the melting curve [K], 216.592 K to ``FUSION_T_MAX`` (about 295 K, where
        the melting pressure reaches 500 MPa, the upper end of the solid equation of state).
    v_liquid : float
        Specific volume of the liquid at (T, p_melt(T)) [m3/kg], from the caller's fluid
        equation of state.

    Returns
    -------
    float
        Latent heat of fusion [J/kg]. It agrees with h_liquid - h_solid (CoolProp liquid,
        Jäger & Span solid) within 1 % up to 260 K; the two part to 3 % at 290 K (466 MPa).

    Examples
    --------
    At the triple point, with the saturated-liquid density 1178.46 kg/m3 of the Span & Wagner
    equation (CoolProp 8.0.0), the result, 8973 J/mol, is within 1.5 % of the 8875 J/mol that
    Jäger & Span (2012) adopt:

    >>> L = latent_heat_fusion_co2(216.592, 1.0 / 1178.46)
    >>> round(L * MOLAR_MASS)
    8973
    >>> abs(L * MOLAR_MASS / 8875.0 - 1) < 0.015
    True
    """
    T = in_range(
        "T",
        T,
        T_TRIPLE,
        FUSION_T_MAX,
        "K",
        "CO2 melting curve covered by the solid equation of state",
    )
    v_liquid = in_range(
        "v_liquid", v_liquid, 0.0, math.inf, "m3/kg", "range of specific volumes", open_low=True
    )
    p = melting_pressure_co2(T)
    v_s = solid_volume_co2(T, p)
    return T * (v_liquid - v_s) * melting_dpdT_co2(T)
