"""Sublimation pressures from the two reviews of cryogenic solids, and forms built on them.

All equations here share the power series in 1/T of Brown & Ziegler (1980),

    ln(p/p_ref) = A_0 + A_1/T + A_2/T**2 + ... ,

which Fray & Schmitt (2009) kept, converting A_0 from torr to bar, and which the fluid files of
NIST REFPROP 10 keep for several fluids with A_0 refitted (p_ref = 1 MPa) so that the curve meets
the triple point of the reference equation of state of the fluid.

=====================  ==============================  ==============  =====================
fluid                  source id                       p_ref           range [K]
=====================  ==============================  ==============  =====================
CO, alpha solid        ``"BrownZiegler1980"``          torr            14 to 61.544
CO, beta solid         ``"BrownZiegler1980"``          torr            61.544 to 68.127
ammonia                ``"FraySchmitt2009"``           bar             15 to 195.41
ethane                 ``"REFPROP10-BZ"``              MPa             20 to 90.368
neon                   ``"REFPROP10-BZ"``              MPa             7 to 24.556
parahydrogen           ``"REFPROP10-BZ"``              MPa             8.7 to 13.8033
hydrogen sulfide       ``"REFPROP10-FS"``              MPa             118 to 187.7
=====================  ==============================  ==============  =====================

Provenance of the numbers. The Brown & Ziegler CO coefficients are quoted identically (nine
digits) in two independent public programs; the Fray & Schmitt ammonia coefficients likewise in
two. The refitted forms are those of the REFPROP 10 fluid files as quoted in the public data base
of a general-purpose thermodynamics library; there the temperature terms A_1... are Brown &
Ziegler's (ethane, neon, parahydrogen) or Fray & Schmitt's (H2S) to the digits printed, and A_0
is REFPROP's, so that p(T_t) equals the triple-point pressure of the reference EOS. The lower
limits: 14 K and 15 K as quoted with the review coefficients, 20 K and 7 K as stated in the
REFPROP entries; for parahydrogen and H2S no lower limit was stated and we end the curve at about
0.63 T_t, as :mod:`.sublimation_eos` does.

Everything is SI (K, Pa). Outside its range a function raises
:class:`phasepath.errors.OutOfRangeError`.

Safety: these are cryogens, several toxic (CO, NH3, H2S) or flammable (ethane, H2, H2S, CO).
Solids warming in a closed vessel build pressure. Follow local codes and licensed practice; these
functions are design aids, not a safety case.
"""

from __future__ import annotations

from ._forms import BAR, MPA, TORR, checked_T, inverse_power_series

__all__ = [
    "CO_ALPHA_BETA_T",
    "sublimation_pressure_co_brown_ziegler",
    "sublimation_dpdT_co_brown_ziegler",
    "sublimation_pressure_ammonia_fray_schmitt",
    "sublimation_dpdT_ammonia_fray_schmitt",
    "sublimation_pressure_ethane_refprop",
    "sublimation_dpdT_ethane_refprop",
    "sublimation_pressure_neon_refprop",
    "sublimation_dpdT_neon_refprop",
    "sublimation_pressure_parahydrogen_refprop",
    "sublimation_dpdT_parahydrogen_refprop",
    "sublimation_pressure_h2s_refprop",
    "sublimation_dpdT_h2s_refprop",
]

#: Alpha-beta transition of solid CO used by Brown & Ziegler (1980) [K].
CO_ALPHA_BETA_T = 61.544

_CO_ALPHA = (1.80741183e1, -7.69842078e2, -1.21487759e4, 2.73500950e5, -2.90874670e6, 1.20319418e7)
_CO_BETA = (1.68655152e1, -7.48151471e2, -5.84330795e3, 3.93853859e4)
_CO_T = (14.0, 68.127)

_NH3_FS = (1.596e1, -3.537e3, -3.310e4, 1.742e6, -2.995e7)
_NH3_T = (15.0, 195.41)

_C2H6 = (12.8111, -2207.46, -24113.0, 774440.0, -1.1615e7, 6.7633e7)
_C2H6_T = (20.0, 90.368)
_NE = (8.3071, -308.555, 986.02, -9069.3, 35142.0)
_NE_T = (7.0, 24.556)
_PH2 = (4.78288, -148.5636, 232.321, -560.207, 664.126, -289.06)
_PH2_T = (8.7, 13.8033)
_H2S = (6.6247, -726.0, -3.504e5, 2.724e7, -8.582e8)
_H2S_T = (118.0, 187.7)


def _co(T: float) -> tuple[float, float]:
    x = checked_T(T, *_CO_T, "CO sublimation curve", "Brown & Ziegler 1980")
    return inverse_power_series(x, TORR, _CO_ALPHA if x < CO_ALPHA_BETA_T else _CO_BETA)


def sublimation_pressure_co_brown_ziegler(T: float) -> float:
    """Sublimation pressure of carbon monoxide, Brown & Ziegler (1980), alpha and beta solid.

    ln(p/torr) = sum_i A_i / T**i with, for alpha-CO (T < 61.544 K),
    A = (18.0741183, -769.842078, -12148.7759, 273500.950, -2908746.70, 12031941.8) and, for
    beta-CO (61.544 K to 68.127 K), A = (16.8655152, -748.151471, -5843.30795, 39385.3859);
    1 torr = 101325/760 Pa.

    Parameters
    ----------
    T : float
        Temperature [K], 14 K to 68.127 K (Brown & Ziegler's triple point).

    Returns
    -------
    float
        Sublimation pressure [Pa].

    References
    ----------
    Brown & Ziegler, Adv. Cryog. Eng. 25, 662 (1980), doi:10.1007/978-1-4613-9856-1_76
    (``BrownZiegler1980``). Fray & Schmitt (2009) keep the beta-CO terms A_1 to A_3.

    Examples
    --------
    At 68.127 K the curve is within 0.9 % of the triple-point pressure 15.537 kPa (68.16 K) of
    the CO reference equation of state (the tests check the junction); regression pins:

    >>> round(sublimation_pressure_co_brown_ziegler(68.127), 1)
    15400.3
    >>> round(sublimation_pressure_co_brown_ziegler(40.0), 3)
    0.539
    """
    return _co(T)[0]


def sublimation_dpdT_co_brown_ziegler(T: float) -> float:
    """Slope dp/dT [Pa/K] of :func:`sublimation_pressure_co_brown_ziegler` (exact derivative).

    Parameters
    ----------
    T : float
        Temperature [K], 14 K to 68.127 K.

    Examples
    --------
    A regression pin:

    >>> round(sublimation_dpdT_co_brown_ziegler(68.127), 1)
    2967.2
    """
    return _co(T)[1]


def _nh3(T: float) -> tuple[float, float]:
    x = checked_T(T, *_NH3_T, "ammonia sublimation curve", "Fray & Schmitt 2009")
    return inverse_power_series(x, BAR, _NH3_FS)


def sublimation_pressure_ammonia_fray_schmitt(T: float) -> float:
    """Sublimation pressure of ammonia, the fit recommended by Fray & Schmitt (2009).

    ln(p/bar) = A_0 + sum_{i=1..4} A_i / T**i, A = (15.96, -3537, -33100, 1.742e6, -2.995e7).

    Parameters
    ----------
    T : float
        Temperature [K], 15 K to 195.41 K.

    Returns
    -------
    float
        Sublimation pressure [Pa].

    References
    ----------
    Fray & Schmitt, Planet. Space Sci. 57, 2053 (2009), doi:10.1016/j.pss.2009.09.011
    (``FraySchmitt2009``).

    Examples
    --------
    Gao et al. (2023) print the triple point 195.49 K, 6.05339 kPa; this older fit is 1.8 % above
    it there (Gao et al. refitted A_0, see :mod:`.sublimation_reference_eos`):

    >>> p = sublimation_pressure_ammonia_fray_schmitt(195.41)
    >>> round(p, 0)
    6116.0
    """
    return _nh3(T)[0]


def sublimation_dpdT_ammonia_fray_schmitt(T: float) -> float:
    """Slope dp/dT [Pa/K] of :func:`sublimation_pressure_ammonia_fray_schmitt`.

    Parameters
    ----------
    T : float
        Temperature [K], 15 K to 195.41 K.

    Examples
    --------
    A regression pin:

    >>> round(sublimation_dpdT_ammonia_fray_schmitt(195.41), 2)
    601.39
    """
    return _nh3(T)[1]


def _refit(T: float, rng: tuple[float, float], A: tuple[float, ...], what: str, src: str):
    x = checked_T(T, *rng, what, src)
    return inverse_power_series(x, MPA, A)


def sublimation_pressure_ethane_refprop(T: float) -> float:
    """Sublimation pressure of ethane: Brown & Ziegler (1980) terms, A_0 refitted in REFPROP 10.

    ln(p/MPa) = sum_{i=0..5} A_i / T**i,
    A = (12.8111, -2207.46, -24113, 774440, -1.1615e7, 6.7633e7).

    Parameters
    ----------
    T : float
        Temperature [K], 20 K to 90.368 K.

    Returns
    -------
    float
        Sublimation pressure [Pa].

    References
    ----------
    Brown & Ziegler (1980), ``BrownZiegler1980``, as distributed with the ethane file of NIST
    REFPROP 10 (``REFPROP10-BZ``).

    Examples
    --------
    Bücker & Wagner (2006) print the ethane triple point 90.368 K, 1.1421 Pa (1.142 Pa here):

    >>> round(sublimation_pressure_ethane_refprop(90.368), 4)
    1.1421
    """
    return _refit(T, _C2H6_T, _C2H6, "ethane sublimation curve", "REFPROP 10 / Brown & Ziegler")[0]


def sublimation_dpdT_ethane_refprop(T: float) -> float:
    """Slope dp/dT [Pa/K] of :func:`sublimation_pressure_ethane_refprop`.

    Parameters
    ----------
    T : float
        Temperature [K], 20 K to 90.368 K.

    Examples
    --------
    A regression pin:

    >>> round(sublimation_dpdT_ethane_refprop(90.368), 4)
    0.3517
    """
    return _refit(T, _C2H6_T, _C2H6, "ethane sublimation curve", "REFPROP 10 / Brown & Ziegler")[1]


def sublimation_pressure_neon_refprop(T: float) -> float:
    """Sublimation pressure of neon: Brown & Ziegler (1980) terms, A_0 refitted in REFPROP 10.

    ln(p/MPa) = sum_{i=0..4} A_i / T**i, A = (8.3071, -308.555, 986.02, -9069.3, 35142).

    Parameters
    ----------
    T : float
        Temperature [K], 7 K to 24.556 K.

    Returns
    -------
    float
        Sublimation pressure [Pa].

    References
    ----------
    Brown & Ziegler (1980), ``BrownZiegler1980``, as distributed with the neon file of NIST
    REFPROP 10 (``REFPROP10-BZ``).

    Examples
    --------
    Regression pin at the triple point of the REFPROP neon file, 24.556 K (the tests compare with
    the triple point of CoolProp's neon equation, 24.56 K, 43.42 kPa):

    >>> round(sublimation_pressure_neon_refprop(24.556), 0)
    43330.0
    """
    return _refit(T, _NE_T, _NE, "neon sublimation curve", "REFPROP 10 / Brown & Ziegler")[0]


def sublimation_dpdT_neon_refprop(T: float) -> float:
    """Slope dp/dT [Pa/K] of :func:`sublimation_pressure_neon_refprop`.

    Parameters
    ----------
    T : float
        Temperature [K], 7 K to 24.556 K.

    Examples
    --------
    A regression pin:

    >>> round(sublimation_dpdT_neon_refprop(24.556), 0)
    18962.0
    """
    return _refit(T, _NE_T, _NE, "neon sublimation curve", "REFPROP 10 / Brown & Ziegler")[1]


def sublimation_pressure_parahydrogen_refprop(T: float) -> float:
    """Sublimation pressure of parahydrogen: Brown & Ziegler (1980) terms, A_0 from REFPROP 10.

    ln(p/MPa) = sum_{i=0..5} A_i / T**i,
    A = (4.78288, -148.5636, 232.321, -560.207, 664.126, -289.06).

    Parameters
    ----------
    T : float
        Temperature [K], 8.7 K to 13.8033 K (lower end: our choice, about 0.63 T_t).

    Returns
    -------
    float
        Sublimation pressure [Pa].

    References
    ----------
    Brown & Ziegler (1980), ``BrownZiegler1980``, as distributed with the parahydrogen file of
    NIST REFPROP 10 (``REFPROP10-BZ``).

    Examples
    --------
    Leachman et al. (2009) print the parahydrogen triple point 13.8033 K, 7.041 kPa:

    >>> round(sublimation_pressure_parahydrogen_refprop(13.8033), 0)
    7041.0
    """
    return _refit(
        T, _PH2_T, _PH2, "parahydrogen sublimation curve", "REFPROP 10 / Brown & Ziegler"
    )[0]


def sublimation_dpdT_parahydrogen_refprop(T: float) -> float:
    """Slope dp/dT [Pa/K] of :func:`sublimation_pressure_parahydrogen_refprop`.

    Parameters
    ----------
    T : float
        Temperature [K], 8.7 K to 13.8033 K.

    Examples
    --------
    A regression pin:

    >>> round(sublimation_dpdT_parahydrogen_refprop(13.8033), 0)
    4536.0
    """
    return _refit(
        T, _PH2_T, _PH2, "parahydrogen sublimation curve", "REFPROP 10 / Brown & Ziegler"
    )[1]


def sublimation_pressure_h2s_refprop(T: float) -> float:
    """Sublimation pressure of hydrogen sulfide: Fray & Schmitt (2009) terms, A_0 from REFPROP 10.

    ln(p/MPa) = sum_{i=0..4} A_i / T**i, A = (6.6247, -726, -3.504e5, 2.724e7, -8.582e8).

    Parameters
    ----------
    T : float
        Temperature [K], 118 K to 187.7 K (lower end: our choice, about 0.63 T_t).

    Returns
    -------
    float
        Sublimation pressure [Pa].

    References
    ----------
    Fray & Schmitt (2009), ``FraySchmitt2009``, as distributed with the hydrogen sulfide file of
    NIST REFPROP 10 (``REFPROP10-FS``).

    Examples
    --------
    Lemmon & Span (2006) print the H2S triple point 187.7 K, 23.3 kPa:

    >>> round(sublimation_pressure_h2s_refprop(187.7) / 1e3, 1)
    23.3
    """
    return _refit(T, _H2S_T, _H2S, "H2S sublimation curve", "REFPROP 10 / Fray & Schmitt")[0]


def sublimation_dpdT_h2s_refprop(T: float) -> float:
    """Slope dp/dT [Pa/K] of :func:`sublimation_pressure_h2s_refprop`.

    Parameters
    ----------
    T : float
        Temperature [K], 118 K to 187.7 K.

    Examples
    --------
    A regression pin:

    >>> round(sublimation_dpdT_h2s_refprop(187.7), 1)
    1755.5
    """
    return _refit(T, _H2S_T, _H2S, "H2S sublimation curve", "REFPROP 10 / Fray & Schmitt")[1]
