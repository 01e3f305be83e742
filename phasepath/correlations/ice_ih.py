"""Ice Ih: the Gibbs function of IAPWS R10-06(2009) and the properties that follow from it.

The Equation of State 2006 for H2O Ice Ih (Feistel & Wagner 2006), revised release of 2009,
source id ``"IAPWS-R10-06"``:

    g(T, p) = g0(p) - s0 T_t tau + T_t Re{ sum_{k=1,2} r_k(p) [ (t_k - tau) ln(t_k - tau)
              + (t_k + tau) ln(t_k + tau) - 2 t_k ln t_k - tau**2 / t_k ] },

    g0(p) = sum_{k=0..4} g0k (pi - pi0)**k,   r1 constant,   r2(p) = sum_{k=0..2} r2k (pi - pi0)**k,

with tau = T/T_t, pi = p/p_t, pi0 = 101325 Pa / p_t, T_t = 273.16 K, p_t = 611.657 Pa; t_k, r_k
complex. Valid for 0 < T <= 273.16 K and 0 < p <= 210 MPa.

The reference state is that of IAPWS-95: u = s = 0 for liquid water at the triple point. CoolProp
8.0.0 (``HEOS``, ``Water``) uses the same one: saturated liquid at 273.16 K has h = 0.6118 J/kg,
u = -6.6e-8 J/kg, s = -1.8e-10 J/(kg K) there. So ``h_liquid(CoolProp) - enthalpy_ice_ih`` is
the latent heat of melting and ``h_vapour(CoolProp) - enthalpy_ice_ih`` that of sublimation.

Safety: the melting and sublimation of ice are benign, but the steam and hot water at the other
end of a heating route scald; pressure vessels and boilers are governed by local codes and
licensed practice.
"""

from __future__ import annotations

import cmath
from functools import lru_cache

from ._checks import in_range, number

__all__ = [
    "SOURCE",
    "T_TRIPLE",
    "P_TRIPLE",
    "P_MAX",
    "gibbs_energy_ice_ih",
    "enthalpy_ice_ih",
    "entropy_ice_ih",
    "volume_ice_ih",
    "cp_ice_ih",
    "latent_heat_melting_ice_ih",
    "latent_heat_sublimation_ice_ih",
]

SOURCE = "IAPWS-R10-06"
T_TRIPLE = 273.16  # K
P_TRIPLE = 611.657  # Pa
P_MAX = 210.0e6  # Pa, upper pressure of the release
_PI0 = 101325.0 / P_TRIPLE

# Table 2 of R10-06(2009).
_G0 = (
    -0.632020233335886e6,
    0.655022213658955,
    -0.189369929326131e-7,
    0.339746123271053e-14,
    -0.556464869058991e-21,
)  # J/kg
_S0 = -0.332733756492168e4  # J/(kg K), the IAPWS-95-consistent value
_T1 = complex(0.368017112855051e-1, 0.510878114959572e-1)
_R1 = complex(0.447050716285388e2, 0.656876847463481e2)  # J/(kg K)
_T2 = complex(0.337315741065416, 0.335449415919309)
_R2 = (
    complex(-0.725974574329220e2, -0.781008427112870e2),
    complex(-0.557107698030123e-4, 0.464578634580806e-4),
    complex(0.234801409215913e-10, -0.285651142904972e-10),
)  # J/(kg K)


def _check(T: float, p: float) -> tuple[float, float]:
    what = "range of ice Ih (IAPWS R10-06)"
    return (
        in_range("T", T, 0.0, T_TRIPLE, "K", what, open_low=True),
        in_range("p", p, 0.0, P_MAX, "Pa", what, open_low=True),
    )


def _bracket(t: complex, tau: float) -> complex:
    return (
        (t - tau) * cmath.log(t - tau)
        + (t + tau) * cmath.log(t + tau)
        - 2.0 * t * cmath.log(t)
        - tau * tau / t
    )


def _bracket_tau(t: complex, tau: float) -> complex:
    return -cmath.log(t - tau) + cmath.log(t + tau) - 2.0 * tau / t


def _bracket_tautau(t: complex, tau: float) -> complex:
    return 1.0 / (t - tau) + 1.0 / (t + tau) - 2.0 / t


@lru_cache(maxsize=512)
def _derivatives(T: float, p: float) -> tuple[float, float, float, float]:
    """g [J/kg], g_T [J/(kg K)], g_TT [J/(kg K2)], g_p [m3/kg] of R10-06 Table 3 and 4."""
    tau = T / T_TRIPLE
    d = p / P_TRIPLE - _PI0
    g0 = sum(c * d**k for k, c in enumerate(_G0))
    g0_p = sum(k * c * d ** (k - 1) for k, c in enumerate(_G0) if k > 0) / P_TRIPLE
    r2 = sum(c * d**k for k, c in enumerate(_R2))
    r2_p = (_R2[1] + 2.0 * _R2[2] * d) / P_TRIPLE

    g = (
        g0
        - _S0 * T_TRIPLE * tau
        + T_TRIPLE * (_R1 * _bracket(_T1, tau) + r2 * _bracket(_T2, tau)).real
    )
    g_T = -_S0 + (_R1 * _bracket_tau(_T1, tau) + r2 * _bracket_tau(_T2, tau)).real
    g_TT = (_R1 * _bracket_tautau(_T1, tau) + r2 * _bracket_tautau(_T2, tau)).real / T_TRIPLE
    g_p = g0_p + T_TRIPLE * (r2_p * _bracket(_T2, tau)).real
    return g, g_T, g_TT, g_p


def gibbs_energy_ice_ih(T: float, p: float) -> float:
    """Specific Gibbs energy of ice Ih, IAPWS R10-06(2009) eq. (1).

    Parameters
    ----------
    T : float
        Temperature [K], above 0 K to 273.16 K.
    p : float
        Pressure [Pa], above 0 Pa to 210 MPa.

    Returns
    -------
    float
        g [J/kg], IAPWS-95 reference state.

    References
    ----------
    IAPWS R10-06(2009); Feistel & Wagner, J. Phys. Chem. Ref. Data 35, 1021 (2006),
    doi:10.1063/1.2183324 (``IAPWS-R10-06``).

    Examples
    --------
    R10-06 Table 6 check values: 0.611784135 J/kg at (273.16 K, 611.657 Pa),
    0.10134274069e3 J/kg at (273.152519 K, 101325 Pa), -0.222296513088e6 J/kg at (100 K, 100 MPa).

    >>> round(gibbs_energy_ice_ih(273.16, 611.657), 9)
    0.611784135
    >>> f"{gibbs_energy_ice_ih(273.152519, 101325.0):.10e}"
    '1.0134274069e+02'
    >>> f"{gibbs_energy_ice_ih(100.0, 100e6):.11e}"
    '-2.22296513088e+05'
    """
    return _derivatives(*_check(T, p))[0]


def enthalpy_ice_ih(T: float, p: float) -> float:
    """Specific enthalpy of ice Ih, h = g - T (dg/dT)_p, IAPWS R10-06(2009).

    Parameters
    ----------
    T : float
        Temperature [K], above 0 K to 273.16 K.
    p : float
        Pressure [Pa], above 0 Pa to 210 MPa.

    Returns
    -------
    float
        h [J/kg], IAPWS-95 reference state.

    Examples
    --------
    R10-06 Table 6: -0.333444253966e6, -0.333354873637e6 and -0.483491635676e6 J/kg.

    >>> f"{enthalpy_ice_ih(273.16, 611.657):.11e}"
    '-3.33444253966e+05'
    >>> f"{enthalpy_ice_ih(273.152519, 101325.0):.11e}"
    '-3.33354873637e+05'
    >>> f"{enthalpy_ice_ih(100.0, 100e6):.11e}"
    '-4.83491635676e+05'
    """
    T, p = _check(T, p)
    g, g_T, _, _ = _derivatives(T, p)
    return g - T * g_T


def entropy_ice_ih(T: float, p: float) -> float:
    """Specific entropy of ice Ih, s = -(dg/dT)_p, IAPWS R10-06(2009).

    Parameters
    ----------
    T : float
        Temperature [K], above 0 K to 273.16 K.
    p : float
        Pressure [Pa], above 0 Pa to 210 MPa.

    Returns
    -------
    float
        s [J/(kg K)], IAPWS-95 reference state.

    Examples
    --------
    R10-06 Table 6: -0.122069433940e4, -0.122076932550e4 and -0.261195122589e4 J/(kg K).

    >>> f"{entropy_ice_ih(273.16, 611.657):.11e}"
    '-1.22069433940e+03'
    >>> f"{entropy_ice_ih(273.152519, 101325.0):.11e}"
    '-1.22076932550e+03'
    >>> f"{entropy_ice_ih(100.0, 100e6):.11e}"
    '-2.61195122589e+03'
    """
    T, p = _check(T, p)
    return -_derivatives(T, p)[1]


def volume_ice_ih(T: float, p: float) -> float:
    """Specific volume of ice Ih, v = (dg/dp)_T, IAPWS R10-06(2009).

    Parameters
    ----------
    T : float
        Temperature [K], above 0 K to 273.16 K.
    p : float
        Pressure [Pa], above 0 Pa to 210 MPa.

    Returns
    -------
    float
        v [m3/kg].

    Examples
    --------
    R10-06 Table 6 densities: 0.916709492200e3, 0.916721463419e3 and 0.941678203297e3 kg/m3.

    >>> f"{1.0 / volume_ice_ih(273.16, 611.657):.11e}"
    '9.16709492200e+02'
    >>> f"{1.0 / volume_ice_ih(273.152519, 101325.0):.11e}"
    '9.16721463419e+02'
    >>> f"{1.0 / volume_ice_ih(100.0, 100e6):.11e}"
    '9.41678203297e+02'
    """
    T, p = _check(T, p)
    return _derivatives(T, p)[3]


def cp_ice_ih(T: float, p: float) -> float:
    """Specific isobaric heat capacity of ice Ih, c_p = -T (d2g/dT2)_p, IAPWS R10-06(2009).

    Parameters
    ----------
    T : float
        Temperature [K], above 0 K to 273.16 K.
    p : float
        Pressure [Pa], above 0 Pa to 210 MPa.

    Returns
    -------
    float
        c_p [J/(kg K)].

    Examples
    --------
    R10-06 Table 6: 0.209678431622e4, 0.209671391024e4 and 0.866333195517e3 J/(kg K).

    >>> f"{cp_ice_ih(273.16, 611.657):.11e}"
    '2.09678431622e+03'
    >>> f"{cp_ice_ih(273.152519, 101325.0):.11e}"
    '2.09671391024e+03'
    >>> f"{cp_ice_ih(100.0, 100e6):.11e}"
    '8.66333195517e+02'
    """
    T, p = _check(T, p)
    return -T * _derivatives(T, p)[2]


def latent_heat_melting_ice_ih(T: float, p: float, h_liquid: float) -> float:
    """Latent heat of melting of ice Ih at (T, p): h_liquid - h_ice(T, p).

    Parameters
    ----------
    T : float
        Temperature on the melting curve [K], above 0 K to 273.16 K.
    p : float
        Pressure [Pa], above 0 Pa to 210 MPa.
    h_liquid : float
        Specific enthalpy of liquid water at (T, p) [J/kg] on the IAPWS-95 reference state, for
        instance from CoolProp (``HEOS``, ``Water``).

    Returns
    -------
    float
        Latent heat of melting [J/kg].

    Examples
    --------
    At the triple point, with the IAPWS-95 liquid enthalpy h = p_t v_liquid = 0.611783 J/kg
    (u = 0 there by definition), the latent heat is 333.44 kJ/kg (common practice: 333.4 kJ/kg):

    >>> round(latent_heat_melting_ice_ih(273.16, 611.657, 0.611783) / 1e3, 2)
    333.44
    """
    T, p = _check(T, p)
    h = number("h_liquid", h_liquid)
    return h - enthalpy_ice_ih(T, p)


def latent_heat_sublimation_ice_ih(T: float, p: float, h_vapour: float) -> float:
    """Latent heat of sublimation of ice Ih at (T, p): h_vapour - h_ice(T, p).

    Parameters
    ----------
    T : float
        Temperature on the sublimation curve [K], above 0 K to 273.16 K.
    p : float
        Pressure [Pa], above 0 Pa to 210 MPa.
    h_vapour : float
        Specific enthalpy of water vapour at (T, p) [J/kg] on the IAPWS-95 reference state.

    Returns
    -------
    float
        Latent heat of sublimation [J/kg].

    Examples
    --------
    At the triple point, with the IAPWS-95 saturated-vapour enthalpy 2500915 J/kg
    (CoolProp 8.0.0), the result is 2834.36 kJ/kg (about 2834 kJ/kg, from memory):

    >>> round(latent_heat_sublimation_ice_ih(273.16, 611.657, 2500915.19) / 1e3, 2)
    2834.36
    """
    T, p = _check(T, p)
    h = number("h_vapour", h_vapour)
    return h - enthalpy_ice_ih(T, p)
