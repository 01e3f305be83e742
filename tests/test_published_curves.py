"""Published melting and sublimation curves: check values, ranges, slopes, and the junction of
each curve with the triple point of its CoolProp 8.0.0 equation of state.

Every check value names its source. "CoolProp 8.0.0" values are cross-checks against the
reference library; values produced by our own code are labelled regression pins.
"""

from __future__ import annotations

import math

import CoolProp.CoolProp as CP
import pytest
from scipy.optimize import brentq

from phasepath.bibliography import SOURCES
from phasepath.correlations import (
    helium,
    melting_published,
    sublimation_reference_eos,
    sublimation_reviews,
)
from phasepath.correlations.published_curves import (
    FLAGS,
    FUNCTIONS,
    MELTING_EQUATIONS,
    SLOPES,
    SUBLIMATION_EQUATIONS,
)
from phasepath.errors import NonFiniteError, OutOfRangeError

ALL = [("sublimation", k, v) for k, v in SUBLIMATION_EQUATIONS.items()] + [
    ("melting", k, v) for k, v in MELTING_EQUATIONS.items()
]
IDS = [f"{kind}-{fluid}" for kind, fluid, _ in ALL]


# --- published check values -------------------------------------------------------------------

CHECKS = [
    # (function, T [K], expected p [Pa], relative tolerance, source)
    (
        sublimation_reference_eos.sublimation_pressure_ammonia_gao2023,
        195.49,
        6053.39,
        1e-5,
        "Gao et al. 2023, triple point 195.49 K, 6.05339 kPa",
    ),
    (
        sublimation_reviews.sublimation_pressure_ammonia_fray_schmitt,
        195.41,
        6053.39,
        0.02,
        "Gao et al. 2023 triple-point pressure (independent of the Fray & Schmitt fit)",
    ),
    (
        sublimation_reference_eos.sublimation_pressure_sf6_guder_wagner,
        223.555,
        231429.0,
        1e-12,
        "Guder & Wagner 2009, triple point 223.555 K, 231.429 kPa",
    ),
    (
        sublimation_reference_eos.sublimation_pressure_n2o_bell,
        182.33,
        87840.0,
        1e-3,
        "Lemmon & Span 2006, N2O triple point 182.33 K, 87.84 kPa",
    ),
    (
        sublimation_reviews.sublimation_pressure_h2s_refprop,
        187.7,
        23300.0,
        5e-3,
        "Lemmon & Span 2006, H2S triple point 187.7 K, 23.3 kPa",
    ),
    (
        sublimation_reviews.sublimation_pressure_parahydrogen_refprop,
        13.8033,
        7041.0,
        1e-4,
        "Leachman et al. 2009, parahydrogen triple point 13.8033 K, 7.041 kPa",
    ),
    (
        melting_published.melting_pressure_ammonia_gao2023,
        195.49,
        6053.39,
        1e-12,
        "Gao et al. 2023, triple point",
    ),
    (
        melting_published.melting_pressure_ammonia_gao2023,
        217.34,
        307.0e6,
        0.005,
        "Yurtseven 2008: solid I-solid II-liquid triple point of NH3, 217.34 K, 3.070 kbar",
    ),
    (
        melting_published.melting_pressure_sf6_guder_wagner,
        223.555,
        231429.0,
        1e-12,
        "Guder & Wagner 2009, triple point",
    ),
    (
        melting_published.melting_pressure_hydrogen_leachman,
        13.957,
        7357.8,
        1e-12,
        "Leachman et al. 2009, normal-hydrogen triple point 13.957 K, 7.3578 kPa",
    ),
    (
        melting_published.melting_pressure_xenon_michels_prins,
        161.405,
        81750.0,
        0.002,
        "Lemmon & Span 2006, xenon triple point 161.405 K, 81.75 kPa",
    ),
]


@pytest.mark.parametrize(
    "f, T, expected, rtol, source", CHECKS, ids=[f"{c[0].__name__}-{c[1]}" for c in CHECKS]
)
def test_published_check_value(f, T, expected, rtol, source):
    assert f(T) == pytest.approx(expected, rel=rtol), source


def test_ammonia_melting_branches_meet_at_solid_i_ii_liquid_point():
    # Gao et al. 2023: both branches give 307 MPa at 217.35 K (the low branch to 1e-8).
    T0, p0 = melting_published.NH3_SOLID_I_II_LIQUID
    low = melting_published.melting_pressure_ammonia_gao2023(T0)
    high = melting_published.melting_pressure_ammonia_gao2023(math.nextafter(T0, 1e3))
    assert low == pytest.approx(p0, rel=1e-8)
    assert high == pytest.approx(p0, rel=1e-12)


def test_helium_mills_grilly_is_the_mccarty_arp_curve():
    # McCarty & Arp 1990 print p/MPa = -1.7455837 + 1.6979793 T**1.555414: the Mills & Grilly
    # 1955 curve in kgf/cm2 times 0.0980665 MPa per kgf/cm2 (common practice).
    for T in (2.2, 4.0, 10.0, 30.0):
        mccarty_arp = 1e6 * (-1.7455837 + 1.6979793 * T**1.555414)
        assert helium.melting_pressure_helium4_mills_grilly(T) == pytest.approx(
            mccarty_arp, rel=1e-7
        )


def test_helium_range_is_the_measured_range():
    # Mills & Grilly 1955 measured 37 to 3500 kgf/cm2.
    f = helium.melting_pressure_helium4_mills_grilly
    assert f(helium.MELTING_T_MIN) == pytest.approx(37.0 * 98066.5, rel=1e-12)
    assert f(helium.MELTING_T_MAX) == pytest.approx(3500.0 * 98066.5, rel=1e-12)
    assert helium.MELTING_T_MIN == pytest.approx(2.0975, abs=1e-4)  # regression pin
    assert helium.MELTING_T_MAX == pytest.approx(30.46, abs=1e-2)  # regression pin


def test_helium_inverse_round_trip():
    # Exact closed-form inverse: T(p(T)) = T to 1e-12 relative.
    for T in (2.1, 3.0, 10.0, 30.0):
        p = helium.melting_pressure_helium4_mills_grilly(T)
        assert helium.melting_temperature_helium4_mills_grilly(p) == pytest.approx(T, rel=1e-12)
    with pytest.raises(OutOfRangeError, match="kgf|Pa"):
        helium.melting_temperature_helium4_mills_grilly(2.5e6)
    with pytest.raises(NonFiniteError):
        helium.melting_temperature_helium4_mills_grilly(float("nan"))


def test_helium_below_2_1_K_is_refused():
    # The curve bends to its minimum (about 2.5 MPa, common practice) below ~1 K; Mills & Grilly
    # does not hold there, and nothing is extrapolated.
    with pytest.raises(OutOfRangeError, match="2.09747 K to 30.462 K"):
        helium.melting_pressure_helium4_mills_grilly(1.5)


# --- ranges and slopes ------------------------------------------------------------------------


@pytest.mark.parametrize("kind, fluid, entry", ALL, ids=IDS)
def test_range_errors(kind, fluid, entry):
    name, _, lo, hi, _ = entry
    f = FUNCTIONS[name]
    for T in (lo * (1 - 1e-6) - 1e-9, hi * (1 + 1e-6) + 1e-9):
        with pytest.raises(OutOfRangeError, match=f"{lo:.6g} K to {hi:.6g} K"):
            f(T)
    for bad in (float("nan"), float("inf"), "warm"):
        with pytest.raises(NonFiniteError):
            f(bad)
    assert math.isfinite(f(lo)) and math.isfinite(f(hi))


@pytest.mark.parametrize("kind, fluid, entry", ALL, ids=IDS)
def test_slope_is_the_derivative(kind, fluid, entry):
    # Central difference (common practice), step 1e-6 K; agreement to 1e-5 relative.
    name, _, lo, hi, _ = entry
    f, d = FUNCTIONS[name], SLOPES[name]
    h = 1e-6
    for frac in (0.1, 0.5, 0.9):
        T = lo + frac * (hi - lo)
        if name.endswith("ammonia_gao2023") and kind == "melting" and abs(T - 217.35) < 1e-3:
            continue
        numeric = (f(T + h) - f(T - h)) / (2 * h)
        assert d(T) == pytest.approx(numeric, rel=1e-5, abs=1e-9 * f(T))


@pytest.mark.parametrize("kind, fluid, entry", ALL, ids=IDS)
def test_curves_rise_with_temperature(kind, fluid, entry):
    # Sublimation and these melting curves rise with T (common practice); checked on a grid
    # of 200 points, which is a test, not a root search.
    name, _, lo, hi, _ = entry
    f = FUNCTIONS[name]
    ps = [f(lo + (hi - lo) * i / 199) for i in range(200)]
    assert all(b > a for a, b in zip(ps, ps[1:], strict=False))


@pytest.mark.parametrize("kind, fluid, entry", ALL, ids=IDS)
def test_table_entries(kind, fluid, entry):
    name, triple, lo, hi, source = entry
    assert source in SOURCES
    assert lo < hi
    assert name.startswith(f"{kind}_pressure_")
    if triple is not None:
        Tt, pt = triple
        # the equation passes through the triple point it is written with (printed in the
        # source; Gao et al.'s A_0 is fitted to it, to 2e-6)
        assert FUNCTIONS[name](Tt) == pytest.approx(pt, rel=5e-6)
    for flagged_kind, flagged_fluid in FLAGS:
        assert flagged_kind in ("sublimation", "melting")
        assert flagged_fluid in (
            SUBLIMATION_EQUATIONS if flagged_kind == "sublimation" else MELTING_EQUATIONS
        )


def test_fluids_are_coolprop_fluids_without_the_curve():
    # The melting table covers fluids CoolProp 8.0.0 has no melting line for, plus helium and
    # normal hydrogen, whose CoolProp lines are wrong at low temperature (see below).
    for fluid in MELTING_EQUATIONS:
        has = CP.AbstractState("HEOS", fluid).has_melting_line()
        assert has == (fluid in ("Helium", "Hydrogen")), fluid
    for fluid in SUBLIMATION_EQUATIONS:
        CP.AbstractState("HEOS", fluid)  # a CoolProp name


# --- junction with the CoolProp EOS triple point ----------------------------------------------


def _eos_triple(fluid):
    a = CP.AbstractState("HEOS", fluid)
    T = a.Ttriple()
    a.update(CP.QT_INPUTS, 0.0, T)
    return T, a.p()


def _miss(entry, fluid):
    """(dp [Pa], dT [K]): the curve at the EOS triple temperature (or the nearest end of its
    range) minus the EOS triple-point pressure, and the temperature along the curve at which it
    reaches that pressure minus the EOS triple temperature (exact root where the pressure is on
    the curve, else a tangent step from the nearest end)."""
    name, _, lo, hi, _ = entry
    f, d = FUNCTIONS[name], SLOPES[name]
    Tt, pt = _eos_triple(fluid)
    Tc = min(max(Tt, lo), hi)
    dp = f(Tc) - pt
    if min(f(lo), f(hi)) <= pt <= max(f(lo), f(hi)):
        Tstar = brentq(lambda T: f(T) - pt, lo, hi, xtol=1e-13, rtol=1e-15)
    else:
        s = d(Tc)
        Tstar = Tc + (pt - f(Tc)) / s if s > 0 and math.isfinite(s) else Tc
    return dp, Tstar - Tt


#: Measured misses (regression pins of this code against CoolProp 8.0.0): dp [Pa], dT [K].
MISSES = {
    ("sublimation", "Ammonia"): (-2.41, -0.00095),
    ("sublimation", "CarbonMonoxide"): (-136.56, +0.01302),
    ("sublimation", "Ethane"): (+0.00003, -0.00009),
    ("sublimation", "Neon"): (-87.07, +0.00059),
    ("sublimation", "ParaHydrogen"): (+0.068, -0.00002),
    ("sublimation", "HydrogenSulfide"): (+0.015, -0.00001),
    ("sublimation", "SulfurHexafluoride"): (+4.53, -0.00035),
    ("sublimation", "Xenon"): (-16.68, +0.00434),
    ("sublimation", "Krypton"): (-342.38, +0.04686),
    ("sublimation", "Oxygen"): (+0.0024, -0.00009),
    ("sublimation", "Hydrogen"): (+342.17, -0.05305),
    ("sublimation", "NitrousOxide"): (-0.0071, 0.0),
    ("melting", "Ammonia"): (+58138.6, -0.00500),
    ("melting", "Xenon"): (+21.92, +0.00499),
    ("melting", "SulfurHexafluoride"): (+4.53, 0.0),
    ("melting", "Hydrogen"): (-0.028, 0.0),
    ("melting", "Helium"): (+3942886.5, -0.96919),
}

#: A junction is "small" within 0.02 K along the curve (and, for sublimation, 1 % in pressure).
LARGE = {("sublimation", "Krypton"), ("sublimation", "Hydrogen"), ("melting", "Helium")}


@pytest.mark.parametrize("kind, fluid, entry", ALL, ids=IDS)
def test_triple_point_junction(kind, fluid, entry):
    dp, dT = _miss(entry, fluid)
    pin_dp, pin_dT = MISSES[(kind, fluid)]
    assert dp == pytest.approx(pin_dp, rel=1e-3, abs=1e-3)
    assert dT == pytest.approx(pin_dT, abs=1e-5)
    _, pt = _eos_triple(fluid)
    small = abs(dT) <= 0.02 and (kind == "melting" or abs(dp) <= 0.01 * pt)
    assert small == ((kind, fluid) not in LARGE)
    if not small:
        assert (kind, fluid) in FLAGS, "a large miss must be flagged in the table"


def test_helium_has_no_triple_point_to_join():
    # CoolProp's helium "triple point" is the lambda point at SVP, 2.1768 K (ITS-90 range
    # boundary, common practice), 5.04 kPa; the liquid freezes there only at 3.95 MPa.
    Tt, pt = _eos_triple("Helium")
    assert Tt == pytest.approx(2.1768, abs=1e-9)
    assert pt == pytest.approx(5039.33, rel=1e-4)  # CoolProp 8.0.0
    assert MELTING_EQUATIONS["Helium"][1] is None
    assert "lambda" in FLAGS[("melting", "Helium")]


# --- CoolProp's own helium and hydrogen melting lines, as they are ----------------------------


def _coolprop_melting(fluid, T):
    return CP.AbstractState("HEOS", fluid).melting_line(CP.iP, CP.iT, T)


def test_coolprop_helium_melting_line_is_datchi_extrapolated():
    # CoolProp 8.0.0: Simon fit credited to Datchi et al. 2000, range 2.1768 K to 700 K.
    a = CP.AbstractState("HEOS", "Helium")
    assert a.melting_line(CP.iT_min, -1, 0) == pytest.approx(2.1768, abs=1e-9)
    # p = p0 + a ((T/T0)**c - 1) with p0 = -a = -1.6067 MPa, T0 = 1 K, c = 1.565
    for T in (2.1768, 4.0, 20.0):
        assert _coolprop_melting("Helium", T) == pytest.approx(
            1.6067e6 * (T**1.565 - 2.0), rel=1e-9
        )
    # At the lambda point: CoolProp 2.214 MPa against Mills & Grilly 3.948 MPa (regression pins).
    cp_lambda = _coolprop_melting("Helium", 2.1768)
    mg_lambda = helium.melting_pressure_helium4_mills_grilly(2.1768)
    assert cp_lambda == pytest.approx(2.21436e6, rel=1e-5)
    assert mg_lambda == pytest.approx(3.94793e6, rel=1e-5)
    # At 4 K: 10.85 MPa against 12.92 MPa; at 20 K: 171.8 MPa against 177.5 MPa.
    assert _coolprop_melting("Helium", 4.0) / helium.melting_pressure_helium4_mills_grilly(
        4.0
    ) == pytest.approx(0.8398, abs=1e-3)


def test_coolprop_normal_hydrogen_melting_line_misses_the_triple_point_by_23_MPa():
    # CoolProp 8.0.0 "Hydrogen": Simon fit credited to Datchi et al. 2000 with T0 = 1 K,
    # p0 = -0.2362 MPa, a = 0.231 MPa, c = 1.7627. At the EOS triple point 13.957 K it gives
    # 23.6 MPa; the melting pressure there is 7.3578 kPa (Leachman et al. 2009).
    Tt, pt = _eos_triple("Hydrogen")
    p_cp = _coolprop_melting("Hydrogen", Tt)
    assert p_cp == pytest.approx(23.606e6, rel=1e-4)  # CoolProp 8.0.0, regression pin
    assert melting_published.melting_pressure_hydrogen_leachman(Tt) == pytest.approx(pt, rel=1e-5)
    # Along CoolProp's curve the EOS triple-point pressure is reached only near 1.50 K.
    T_cp = ((pt + 236200.0) / 231000.0 + 1.0) ** (1.0 / 1.7627)
    assert T_cp - Tt == pytest.approx(-12.45, abs=0.01)


def test_coolprop_parahydrogen_melting_line_is_close():
    # CoolProp 8.0.0 "ParaHydrogen": Younglove 1982, two Simon parts, 13.8033 K to 170 K.
    Tt, pt = _eos_triple("ParaHydrogen")
    p_cp = _coolprop_melting("ParaHydrogen", Tt)
    assert p_cp - pt == pytest.approx(855.0, abs=1.0)  # Pa, regression pin
    a = CP.AbstractState("HEOS", "ParaHydrogen")
    dT = (pt - p_cp) / (125746.643 * 1.955 * Tt**0.955)  # tangent step along Younglove's part
    assert dT == pytest.approx(-2.8e-4, abs=1e-5)  # K
    assert a.melting_line(CP.iT_max, -1, 0) == pytest.approx(170.0)


# --- Clausius-Clapeyron below the triple point ---------------------------------------------

#: Fits whose implied fusion heat falls outside the band below (flagged in the table).
CLAPEYRON_OUTLIERS = {"Oxygen"}


@pytest.mark.parametrize("fluid", list(SUBLIMATION_EQUATIONS), ids=str)
def test_sublimation_heat_exceeds_vaporization_heat(fluid):
    # At the triple point L_sub = L_vap + L_fus (common practice), and the fusion heat of these
    # molecular solids is a modest part of L_sub, 5 % to 35 % (common practice). L_sub from the
    # integrated Clausius-Clapeyron equation (ideal gas, constant L; Clausius 1850) over the
    # chord from 0.95 T_t to T_t, compared with CoolProp 8.0.0's molar L_vap at the triple point.
    # The chord, not the slope at T_t: fits with exponents other than 1 have a zero or infinite
    # slope exactly at T_t.
    name, _, lo, hi, _ = SUBLIMATION_EQUATIONS[fluid]
    a = CP.AbstractState("HEOS", fluid)
    Tt = a.Ttriple()
    a.update(CP.QT_INPUTS, 1.0, Tt)
    h_vap = a.hmolar()
    a.update(CP.QT_INPUTS, 0.0, Tt)
    L_vap = h_vap - a.hmolar()
    f = FUNCTIONS[name]
    T2 = min(Tt, hi)
    T1 = max(lo, 0.95 * T2)
    L_sub = 8.314462618 * math.log(f(T2) / f(T1)) / (1.0 / T1 - 1.0 / T2)
    share = 1.0 - L_vap / L_sub
    inside = 0.05 < share < 0.35
    assert inside == (fluid not in CLAPEYRON_OUTLIERS), (fluid, share)
    if not inside:
        assert "Clapeyron" in FLAGS[("sublimation", fluid)]
