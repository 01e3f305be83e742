"""Sublimation pressures that accompany reference equations of state (more fluids).

Continues :mod:`.sublimation_eos` (N2, Ar, CH4) for fluids whose CoolProp 8.0.0 equation of
state has no sublimation curve:

==========  =========================================  ======================  ==============
fluid       source id                                  form                    range [K]
==========  =========================================  ======================  ==============
ammonia     ``"Gao2023-NH3"`` (Fray & Schmitt terms)   ln(p/MPa) = sum A_i/T^i 15 to 195.49
SF6         ``"GuderWagner2009"``                      see function            141 to 223.555
xenon       ``"Lemmon-REFPROP10-sub"`` (unpublished)   (T_t/T) sum a_i th^t_i  102 to 161.405
krypton     ``"Lemmon-REFPROP10-sub"`` (unpublished)   (T_t/T) sum a_i th^t_i  73 to 115.775
oxygen      ``"Lemmon-REFPROP10-sub"`` (unpublished)   (T_t/T) sum a_i th^t_i  43.8 to 54.361
hydrogen    ``"Lemmon-REFPROP10-sub"`` (unpublished)   (T_t/T) sum a_i th^t_i  8.8 to 13.957
N2O         ``"Bell-REFPROP10-N2O"`` (unpublished)     ln(p/MPa) = sum A_i/T^i 115 to 182.33
==========  =========================================  ======================  ==============

(th = 1 - T/T_t.) The xenon, krypton, oxygen, normal-hydrogen and N2O equations are not printed
in a journal: they are the one- or two-term fits of E. W. Lemmon (2002-2003) and I. H. Bell (2018)
distributed with the fluid files of NIST REFPROP 10, as quoted identically in two independent
public programs (xenon, krypton, oxygen, hydrogen) or in one (N2O). Their only check is the
triple point they were fitted to; the tests add Clausius-Clapeyron below the triple point.
Normal hydrogen's equation uses p_t = 7.7 kPa, 4.6 % above the triple-point pressure of its
own reference equation (7.3578 kPa, Leachman et al. 2009): flagged, see the tests.

Lower limits: the ammonia terms are Fray & Schmitt's, whose fit runs from 15 K. No other source
states a lower limit that we could confirm; we end those curves at about 0.63 T_t, like
:mod:`.sublimation_eos`, and oxygen at 43.8 K, the gamma-beta transition of the solid (from
memory), below which a one-term fit through the triple point cannot be expected to hold.

Everything is SI (K, Pa). Outside its range a function raises
:class:`phasepath.errors.OutOfRangeError`.

Safety: ammonia is toxic, SF6 and the noble gases displace air without warning, oxygen feeds
fire, hydrogen burns; all are handled here as cryogenic solids that build pressure as they warm
in a closed vessel. Follow local codes and licensed practice; these functions are design aids,
not a safety case.
"""

from __future__ import annotations

import math

from ._forms import MPA, checked_T, inverse_power_series, reduced_exponential

__all__ = [
    "REDUCED_CURVES",
    "sublimation_pressure_ammonia_gao2023",
    "sublimation_dpdT_ammonia_gao2023",
    "sublimation_pressure_sf6_guder_wagner",
    "sublimation_dpdT_sf6_guder_wagner",
    "sublimation_pressure_xenon_lemmon",
    "sublimation_dpdT_xenon_lemmon",
    "sublimation_pressure_krypton_lemmon",
    "sublimation_dpdT_krypton_lemmon",
    "sublimation_pressure_oxygen_lemmon",
    "sublimation_dpdT_oxygen_lemmon",
    "sublimation_pressure_hydrogen_lemmon",
    "sublimation_dpdT_hydrogen_lemmon",
    "sublimation_pressure_n2o_bell",
    "sublimation_dpdT_n2o_bell",
]

_NH3 = (13.63932, -3537.0, -3.31e4, 1.742e6, -2.995e7)
_NH3_T = (15.0, 195.49)
_N2O = (13.7978754, -3181.20979, 63451.5147, -4189965.37)
_N2O_T = (115.0, 182.33)

_SF6_TT = 223.555  # K, Guder & Wagner (2009)
_SF6_PT = 231429.0  # Pa, idem
_SF6_A = 11.6942141
_SF6_E = 1.07
_SF6_TMIN = 141.0

#: name -> (T_t [K], p_t [Pa], T_min [K], a_i, t_i, source id) of the reduced-exponential fits.
REDUCED_CURVES: dict[str, tuple[float, float, float, tuple[float, ...], tuple[float, ...], str]] = {
    "xenon": (161.405, 81750.0, 102.0, (-13.9, 14.0), (1.06, 3.1), "Lemmon-REFPROP10-sub"),
    "krypton": (115.775, 73197.0, 73.0, (-11.5616,), (1.0,), "Lemmon-REFPROP10-sub"),
    "oxygen": (54.361, 146.28, 43.8, (-20.714,), (1.06,), "Lemmon-REFPROP10-sub"),
    "hydrogen": (13.957, 7700.0, 8.8, (-8.065,), (0.93,), "Lemmon-REFPROP10-sub"),
}


def _reduced(name: str, T: float) -> tuple[float, float]:
    Tt, pt, Tmin, a, t, src = REDUCED_CURVES[name]
    x = checked_T(T, Tmin, Tt, f"{name} sublimation curve", src)
    return reduced_exponential(x, Tt, pt, a, t)


def _nh3(T: float) -> tuple[float, float]:
    x = checked_T(T, *_NH3_T, "ammonia sublimation curve", "Gao et al. 2023")
    return inverse_power_series(x, MPA, _NH3)


def sublimation_pressure_ammonia_gao2023(T: float) -> float:
    """Sublimation pressure of ammonia, Gao et al. (2023).

    ln(p/MPa) = A_0 + sum_{i=1..4} A_i / T**i, A_0 = 13.63932 (refitted to the triple point of
    the equation of state) and A_1..A_4 = (-3537, -33100, 1.742e6, -2.995e7) of
    Fray & Schmitt (2009).

    Parameters
    ----------
    T : float
        Temperature [K], 15 K to 195.49 K.

    Returns
    -------
    float
        Sublimation pressure [Pa].

    References
    ----------
    Gao, Wu, Bell, Harvey & Lemmon, J. Phys. Chem. Ref. Data 52, 013102 (2023),
    doi:10.1063/5.0128269 (``Gao2023-NH3``); terms of Fray & Schmitt (2009), ``FraySchmitt2009``.

    Examples
    --------
    The triple point printed by Gao et al., 195.49 K and 6.05339 kPa:

    >>> round(sublimation_pressure_ammonia_gao2023(195.49), 1)
    6053.4
    """
    return _nh3(T)[0]


def sublimation_dpdT_ammonia_gao2023(T: float) -> float:
    """Slope dp/dT [Pa/K] of :func:`sublimation_pressure_ammonia_gao2023` (exact derivative).

    Parameters
    ----------
    T : float
        Temperature [K], 15 K to 195.49 K.

    Examples
    --------
    A regression pin:

    >>> round(sublimation_dpdT_ammonia_gao2023(195.49), 2)
    594.77
    """
    return _nh3(T)[1]


def _sf6(T: float) -> tuple[float, float]:
    x = checked_T(T, _SF6_TMIN, _SF6_TT, "SF6 sublimation curve", "Guder & Wagner 2009")
    r = (_SF6_TT / x) ** _SF6_E
    p = _SF6_PT * math.exp(_SF6_A * (1.0 - r))
    return p, p * _SF6_A * _SF6_E * r / x


def sublimation_pressure_sf6_guder_wagner(T: float) -> float:
    """Sublimation pressure of sulfur hexafluoride, Guder & Wagner (2009).

    ln(p/p_t) = a [1 - (T_t/T)**1.07], a = 11.6942141, T_t = 223.555 K, p_t = 231.429 kPa.

    Parameters
    ----------
    T : float
        Temperature [K], 141 K (our lower end, about 0.63 T_t) to 223.555 K.

    Returns
    -------
    float
        Sublimation pressure [Pa].

    References
    ----------
    Guder & Wagner, J. Phys. Chem. Ref. Data 38, 33 (2009), doi:10.1063/1.3037344
    (``GuderWagner2009``), as distributed with the SF6 file of NIST REFPROP 10.

    Examples
    --------
    The published triple point, and a regression pin at 200 K:

    >>> sublimation_pressure_sf6_guder_wagner(223.555)
    231429.0
    >>> round(sublimation_pressure_sf6_guder_wagner(200.0), 0)
    52705.0
    """
    return _sf6(T)[0]


def sublimation_dpdT_sf6_guder_wagner(T: float) -> float:
    """Slope dp/dT [Pa/K] of :func:`sublimation_pressure_sf6_guder_wagner` (exact derivative).

    Parameters
    ----------
    T : float
        Temperature [K], 141 K to 223.555 K.

    Examples
    --------
    At T_t the slope is a * 1.07 * p_t / T_t:

    >>> round(sublimation_dpdT_sf6_guder_wagner(223.555), 1)
    12953.5
    """
    return _sf6(T)[1]


def sublimation_pressure_xenon_lemmon(T: float) -> float:
    """Sublimation pressure of xenon, Lemmon (unpublished), as distributed with REFPROP 10.

    ln(p/p_t) = (T_t/T) [-13.9 th**1.06 + 14.0 th**3.1], th = 1 - T/T_t, T_t = 161.405 K,
    p_t = 81.75 kPa.

    Parameters
    ----------
    T : float
        Temperature [K], 102 K to 161.405 K.

    Returns
    -------
    float
        Sublimation pressure [Pa].

    References
    ----------
    ``Lemmon-REFPROP10-sub``: fit of E. W. Lemmon, not printed in a journal; triple point of
    Lemmon & Span, J. Chem. Eng. Data 51, 785 (2006), doi:10.1021/je050186n.

    Examples
    --------
    The triple point of the fit, and a regression pin at 140 K:

    >>> sublimation_pressure_xenon_lemmon(161.405)
    81750.0
    >>> round(sublimation_pressure_xenon_lemmon(140.0), 0)
    12831.0
    """
    return _reduced("xenon", T)[0]


def sublimation_dpdT_xenon_lemmon(T: float) -> float:
    """Slope dp/dT [Pa/K] of :func:`sublimation_pressure_xenon_lemmon` (exact derivative).

    Parameters
    ----------
    T : float
        Temperature [K], 102 K to 161.405 K.

    Examples
    --------
    A regression pin:

    >>> round(sublimation_dpdT_xenon_lemmon(150.0), 1)
    2954.5
    """
    return _reduced("xenon", T)[1]


def sublimation_pressure_krypton_lemmon(T: float) -> float:
    """Sublimation pressure of krypton, Lemmon (unpublished), as distributed with REFPROP 10.

    ln(p/p_t) = (T_t/T) a_1 (1 - T/T_t), a_1 = -11.5616, T_t = 115.775 K, p_t = 73.197 kPa.

    Parameters
    ----------
    T : float
        Temperature [K], 73 K to 115.775 K.

    Returns
    -------
    float
        Sublimation pressure [Pa].

    References
    ----------
    ``Lemmon-REFPROP10-sub``: fit of E. W. Lemmon, not printed in a journal.

    Examples
    --------
    The triple point of the fit, and a regression pin at 100 K:

    >>> sublimation_pressure_krypton_lemmon(115.775)
    73197.0
    >>> round(sublimation_pressure_krypton_lemmon(100.0), 0)
    11814.0
    """
    return _reduced("krypton", T)[0]


def sublimation_dpdT_krypton_lemmon(T: float) -> float:
    """Slope dp/dT [Pa/K] of :func:`sublimation_pressure_krypton_lemmon` (exact derivative).

    Parameters
    ----------
    T : float
        Temperature [K], 73 K to 115.775 K.

    Examples
    --------
    At T_t the slope is -a_1 p_t / T_t:

    >>> round(sublimation_dpdT_krypton_lemmon(115.775), 1)
    7309.6
    """
    return _reduced("krypton", T)[1]


def sublimation_pressure_oxygen_lemmon(T: float) -> float:
    """Sublimation pressure of oxygen, Lemmon (unpublished), as distributed with REFPROP 10.

    ln(p/p_t) = (T_t/T) a_1 (1 - T/T_t)**1.06, a_1 = -20.714, T_t = 54.361 K, p_t = 146.28 Pa.

    Parameters
    ----------
    T : float
        Temperature [K], 43.8 K to 54.361 K.

    Returns
    -------
    float
        Sublimation pressure [Pa].

    References
    ----------
    ``Lemmon-REFPROP10-sub``: fit of E. W. Lemmon, not printed in a journal; triple point of
    Schmidt & Wagner (1985), the oxygen equation of state CoolProp uses.

    Examples
    --------
    The triple point of the fit, and a regression pin at 50 K:

    >>> sublimation_pressure_oxygen_lemmon(54.361)
    146.28
    >>> round(sublimation_pressure_oxygen_lemmon(50.0), 2)
    30.96
    """
    return _reduced("oxygen", T)[0]


def sublimation_dpdT_oxygen_lemmon(T: float) -> float:
    """Slope dp/dT [Pa/K] of :func:`sublimation_pressure_oxygen_lemmon` (exact derivative).

    Parameters
    ----------
    T : float
        Temperature [K], 43.8 K to 54.361 K.

    Examples
    --------
    A regression pin:

    >>> round(sublimation_dpdT_oxygen_lemmon(50.0), 3)
    12.647
    """
    return _reduced("oxygen", T)[1]


def sublimation_pressure_hydrogen_lemmon(T: float) -> float:
    """Sublimation pressure of normal hydrogen, Lemmon (unpublished), as in REFPROP 10.

    ln(p/p_t) = (T_t/T) a_1 (1 - T/T_t)**0.93, a_1 = -8.065, T_t = 13.957 K, p_t = 7.7 kPa.
    Its p_t is 4.6 % above the triple-point pressure of the hydrogen equation of state
    (7.3578 kPa): the curve misses that triple point (see the tests). Its slope is infinite at
    T_t (exponent below 1).

    Parameters
    ----------
    T : float
        Temperature [K], 8.8 K to 13.957 K.

    Returns
    -------
    float
        Sublimation pressure [Pa].

    References
    ----------
    ``Lemmon-REFPROP10-sub``: fit of E. W. Lemmon, not printed in a journal.

    Examples
    --------
    The triple point of the fit, and a regression pin at 12 K:

    >>> sublimation_pressure_hydrogen_lemmon(13.957)
    7700.0
    >>> round(sublimation_pressure_hydrogen_lemmon(12.0), 0)
    1702.0
    """
    return _reduced("hydrogen", T)[0]


def sublimation_dpdT_hydrogen_lemmon(T: float) -> float:
    """Slope dp/dT [Pa/K] of :func:`sublimation_pressure_hydrogen_lemmon`; ``inf`` at T_t.

    Parameters
    ----------
    T : float
        Temperature [K], 8.8 K to 13.957 K.

    Examples
    --------
    A regression pin, and the infinite slope at T_t:

    >>> round(sublimation_dpdT_hydrogen_lemmon(12.0), 1)
    1435.1
    >>> sublimation_dpdT_hydrogen_lemmon(13.957)
    inf
    """
    return _reduced("hydrogen", T)[1]


def _n2o(T: float) -> tuple[float, float]:
    x = checked_T(T, *_N2O_T, "N2O sublimation curve", "Bell, REFPROP 10")
    return inverse_power_series(x, MPA, _N2O)


def sublimation_pressure_n2o_bell(T: float) -> float:
    """Sublimation pressure of nitrous oxide, Bell (2018, unpublished), as in REFPROP 10.

    ln(p/MPa) = sum_{i=0..3} A_i / T**i, A = (13.7978754, -3181.20979, 63451.5147, -4189965.37).

    Parameters
    ----------
    T : float
        Temperature [K], 115 K to 182.33 K.

    Returns
    -------
    float
        Sublimation pressure [Pa].

    References
    ----------
    ``Bell-REFPROP10-N2O``: fit of I. H. Bell (2018), not printed in a journal; triple point of
    Lemmon & Span (2006), 182.33 K and 87.84 kPa.

    Examples
    --------
    The triple point of Lemmon & Span (2006), 87.84 kPa at 182.33 K:

    >>> round(sublimation_pressure_n2o_bell(182.33) / 1e3, 2)
    87.84
    """
    return _n2o(T)[0]


def sublimation_dpdT_n2o_bell(T: float) -> float:
    """Slope dp/dT [Pa/K] of :func:`sublimation_pressure_n2o_bell` (exact derivative).

    Parameters
    ----------
    T : float
        Temperature [K], 115 K to 182.33 K.

    Examples
    --------
    A regression pin:

    >>> round(sublimation_dpdT_n2o_bell(182.33), 1)
    7565.4
    """
    return _n2o(T)[1]
