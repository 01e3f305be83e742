"""Published correlations against published check values and independent reference libraries.

Every check value names its source beside it; "from memory" and "common practice" mark values
without a document at hand; tolerances are explicit (rel = relative, abs in the unit given).
"""

from __future__ import annotations

import csv
import math
import warnings
from pathlib import Path

import CoolProp.CoolProp as CP
import pytest

from phasepath.correlations import co2, ice_ih, sublimation_eos
from phasepath.errors import NonFiniteError, OutOfRangeError, PhasePathError

DATA = Path(__file__).parent / "data"


def _rows(name: str) -> list[dict[str, float]]:
    with open(DATA / name, newline="") as fh:
        lines = [line for line in fh if not line.startswith("#")]
    return [{k: float(v) for k, v in row.items()} for row in csv.DictReader(lines)]


def _coolprop_vapour(fluid: str, T: float, p: float) -> CP.AbstractState:
    """CoolProp state of the vapour at (T, p), from (density, T) inputs.

    CoolProp 8.0.0 refuses (p, T) inputs below the triple-point temperature, so the density is
    solved for p by bisection on the ideal-gas bracket.
    """
    from scipy.optimize import brentq

    st = CP.AbstractState("HEOS", fluid)
    M = st.molar_mass()
    rho_ig = p * M / (8.314462618 * T)

    def dp(rho: float) -> float:
        st.update(CP.DmassT_INPUTS, rho, T)
        return st.p() - p

    rho = brentq(dp, 0.5 * rho_ig, 1.5 * rho_ig, xtol=1e-14, rtol=1e-13)
    st.update(CP.DmassT_INPUTS, rho, T)
    return st


# --------------------------------------------------------------------------------------------
# Ice Ih, IAPWS R10-06(2009)
# --------------------------------------------------------------------------------------------

TABLE6 = _rows("iapws_r10_06_table6.csv")  # IAPWS R10-06(2009) Table 6


@pytest.mark.parametrize("row", TABLE6, ids=lambda r: f"R10-06-T6-{r['T_K']}K")
def test_ice_ih_release_table6(row: dict[str, float]) -> None:
    T, p = row["T_K"], row["p_Pa"]
    # Table 6 prints 12 significant digits (9 for g at the triple point): rel 1e-9.
    assert ice_ih.gibbs_energy_ice_ih(T, p) == pytest.approx(row["g_J_per_kg"], rel=1e-9)
    assert ice_ih.enthalpy_ice_ih(T, p) == pytest.approx(row["h_J_per_kg"], rel=1e-11)
    assert ice_ih.entropy_ice_ih(T, p) == pytest.approx(row["s_J_per_kgK"], rel=1e-11)
    assert 1.0 / ice_ih.volume_ice_ih(T, p) == pytest.approx(row["rho_kg_per_m3"], rel=1e-11)
    assert ice_ih.cp_ice_ih(T, p) == pytest.approx(row["cp_J_per_kgK"], rel=1e-11)


ICE_GRID = [
    (T, p)
    for T in (1.0, 20.0, 80.0, 150.0, 200.0, 250.0, 273.16)
    for p in (611.657, 101325.0, 1e7, 1e8, 2.0e8)
]
ICE_GRID += [(T, 0.1) for T in (150.0, 200.0, 250.0)]  # iapws refuses p < p_t below 50 K


@pytest.mark.parametrize("T,p", ICE_GRID, ids=lambda v: f"{v:g}")
def test_ice_ih_against_iapws_package(T: float, p: float) -> None:
    """Independent implementation: iapws._iapws._Ice (iapws package; kJ and MPa units)."""
    from iapws._iapws import _Ice

    with warnings.catch_warnings():
        warnings.simplefilter("ignore")  # iapws warns for metastable states; same equation
        ref = _Ice(T, p / 1e6)
    assert ice_ih.gibbs_energy_ice_ih(T, p) == pytest.approx(ref["g"] * 1e3, rel=1e-10, abs=1e-6)
    assert ice_ih.enthalpy_ice_ih(T, p) == pytest.approx(ref["h"] * 1e3, rel=1e-10)
    assert ice_ih.entropy_ice_ih(T, p) == pytest.approx(ref["s"] * 1e3, rel=1e-10, abs=1e-9)
    assert ice_ih.volume_ice_ih(T, p) == pytest.approx(ref["v"], rel=1e-10)
    assert ice_ih.cp_ice_ih(T, p) == pytest.approx(ref["cp"] * 1e3, rel=1e-9, abs=1e-9)


def test_coolprop_water_reference_state_is_iapws95() -> None:
    """IAPWS-95 defines u = s = 0 for the saturated liquid at the triple point (IAPWS R6-95)."""
    st = CP.AbstractState("HEOS", "Water")
    st.update(CP.QT_INPUTS, 0.0, 273.16)
    assert abs(st.umass()) < 1e-6  # J/kg
    assert abs(st.smass()) < 1e-6  # J/(kg K)
    # so h = p v = 611.655 Pa * 1.0002e-3 m3/kg = 0.6118 J/kg
    assert st.hmass() == pytest.approx(st.p() / st.rhomass(), abs=1e-6)
    assert st.hmass() == pytest.approx(0.6118, abs=1e-4)


def test_ice_ih_latent_heat_of_melting_with_coolprop_liquid() -> None:
    """h_liquid(CoolProp IAPWS-95) - h_ice(R10-06) at the normal melting point.

    Check value 333.4 kJ/kg at 0 degC and one atmosphere: common practice (tolerance 0.3 kJ/kg).
    """
    T, p = 273.152519, 101325.0  # normal melting point of R10-06 Table 6
    st = CP.AbstractState("HEOS", "Water")
    st.update(CP.PT_INPUTS, p, T)
    L = ice_ih.latent_heat_melting_ice_ih(T, p, st.hmass())
    assert L == pytest.approx(333.4e3, abs=0.3e3)


def test_ice_ih_melting_enthalpy_obeys_clapeyron_on_r14_08() -> None:
    """Consistency of two IAPWS releases: L = T (v_l - v_ice) dp/dT on the R14-08 melting curve.

    Liquid from CoolProp (IAPWS-95), ice from R10-06, dp/dT by central difference of R14-08
    eq. (2). Tolerance rel 2e-3 (R14-08 is a fit to the curve these equations imply).
    """
    from phasepath.correlations.water_iapws import melting_pressure_ice_ih

    for T in (255.0, 265.0, 272.0):
        p = melting_pressure_ice_ih(T)
        dpdT = (melting_pressure_ice_ih(T + 1e-3) - melting_pressure_ice_ih(T - 1e-3)) / 2e-3
        st = CP.AbstractState("HEOS", "Water")
        st.update(CP.PT_INPUTS, p, T)
        L = ice_ih.latent_heat_melting_ice_ih(T, p, st.hmass())
        L_clap = T * (1.0 / st.rhomass() - ice_ih.volume_ice_ih(T, p)) * dpdT
        assert L == pytest.approx(L_clap, rel=2e-3), T


@pytest.mark.parametrize(
    "T,p",
    [(273.17, 611.657), (0.0, 611.657), (-5.0, 1e5), (250.0, 0.0), (250.0, 210.1e6), (250.0, -1.0)],
)
def test_ice_ih_out_of_range(T: float, p: float) -> None:
    with pytest.raises(OutOfRangeError):
        ice_ih.enthalpy_ice_ih(T, p)


def test_ice_ih_non_finite() -> None:
    with pytest.raises(NonFiniteError):
        ice_ih.volume_ice_ih(float("nan"), 1e5)
    with pytest.raises(PhasePathError):
        ice_ih.latent_heat_melting_ice_ih(273.0, 1e5, float("inf"))


# --------------------------------------------------------------------------------------------
# CO2: Span & Wagner (1996) curves, Jäger & Span (2012) solid, Clapeyron latent heats
# --------------------------------------------------------------------------------------------


def test_co2_normal_sublimation_temperature() -> None:
    # Span & Wagner (1996): 194.686 K at 0.101325 MPa; abs 1e-3 K (the printed digits).
    assert co2.sublimation_temperature_co2(101325.0) == pytest.approx(194.686, abs=1e-3)


def test_co2_curves_meet_at_triple_point() -> None:
    # Span & Wagner (1996): T_t = 216.592 K, p_t = 0.51795 MPa.
    assert co2.sublimation_pressure_co2(216.592) == 517950.0
    assert co2.melting_pressure_co2(216.592) == 517950.0
    # CoolProp 8.0.0's Span & Wagner triple pressure: 517964 Pa, rel 1e-4
    assert CP.PropsSI("ptriple", "CO2") == pytest.approx(517950.0, rel=1e-4)


@pytest.mark.parametrize("T", [216.592, 230.0, 250.0, 280.0, 300.0, 327.0])
def test_co2_melting_pressure_against_coolprop(T: float) -> None:
    """CoolProp 8.0.0 carries eq. (3.10) in its CO2 file (BibTeX Span-JPCRD-1996); rel 1e-12."""
    st = CP.AbstractState("HEOS", "CO2")
    assert co2.melting_pressure_co2(T) == pytest.approx(st.melting_line(CP.iP, CP.iT, T), rel=1e-12)


def test_co2_melting_temperature_inverse() -> None:
    for T in (216.592, 240.0, 300.0, 327.0):
        assert co2.melting_temperature_co2(co2.melting_pressure_co2(T)) == pytest.approx(
            T, abs=1e-9
        )


# Fray & Schmitt (2009), CO2 below 194.7 K: ln(p/bar) = sum A_i / T**i, A_0..A_5 (their Table).
_FS = (1.476e1, -2.571e3, -7.781e4, 4.325e6, -1.207e8, 1.350e9)


@pytest.mark.parametrize("T", [140.0, 150.0, 160.0, 170.0, 180.0, 190.0, 194.0])
def test_co2_sublimation_against_fray_schmitt(T: float) -> None:
    """Independent compilation (Fray & Schmitt 2009, 4-digit coefficients); rel 1.5e-2."""
    p_fs = math.exp(sum(a / T**i for i, a in enumerate(_FS))) * 1e5
    assert co2.sublimation_pressure_co2(T) == pytest.approx(p_fs, rel=1.5e-2)


@pytest.mark.parametrize("T", [140.001, 170.0, 194.686, 210.0, 216.5])
def test_co2_sublimation_slope_is_derivative(T: float) -> None:
    h = 1e-4
    fd = (co2.sublimation_pressure_co2(T + h) - co2.sublimation_pressure_co2(T - h)) / (2 * h)
    assert co2.sublimation_dpdT_co2(T) == pytest.approx(fd, rel=1e-6)
    assert co2.melting_dpdT_co2(220.0) == pytest.approx(
        (co2.melting_pressure_co2(220.0 + h) - co2.melting_pressure_co2(220.0 - h)) / (2 * h),
        rel=1e-8,
    )


TABLE5 = _rows("jager_span_2012_table5.csv")  # Jäger & Span (2012) Table 5


@pytest.mark.parametrize("row", TABLE5, ids=lambda r: f"JS2012-T5-{r['T_K']}K")
def test_co2_solid_jager_span_table5(row: dict[str, float]) -> None:
    T, p, M = row["T_K"], row["p_Pa"], co2.MOLAR_MASS
    # Table 5 prints 10 significant digits: rel 1e-9.
    assert co2.solid_gibbs_co2(T, p) * M == pytest.approx(row["g_J_per_mol"], rel=1e-9)
    assert co2.solid_volume_co2(T, p) * M == pytest.approx(row["v_m3_per_mol"], rel=1e-9)
    assert co2.solid_entropy_co2(T, p) * M == pytest.approx(row["s_J_per_molK"], rel=1e-9)
    assert co2.solid_cp_co2(T, p) * M == pytest.approx(row["cp_J_per_molK"], rel=1e-9)


def test_co2_solid_reference_state_matches_coolprop() -> None:
    """Jäger & Span (2012) fix the solid to Span & Wagner's reference state with a melting
    enthalpy of 8875 J/mol at the triple point; CoolProp's liquid there must give it back
    (abs 1 J/mol)."""
    st = CP.AbstractState("HEOS", "CO2")
    st.update(CP.QT_INPUTS, 0.0, 216.592)
    dh = (st.hmass() - co2.solid_enthalpy_co2(216.592, 517950.0)) * co2.MOLAR_MASS
    assert dh == pytest.approx(8875.0, abs=1.0)


@pytest.mark.parametrize("T", [180.0, 194.686, 205.0, 216.592])
def test_co2_sublimation_latent_heat_two_routes(T: float) -> None:
    """Clapeyron on eq. (3.12) against h_vapour(CoolProp) - h_solid(Jäger & Span); rel 5e-3."""
    p = co2.sublimation_pressure_co2(T)
    vap = _coolprop_vapour("CO2", T, p)
    L_clap = co2.latent_heat_sublimation_co2(T, 1.0 / vap.rhomass())
    L_h = vap.hmass() - co2.solid_enthalpy_co2(T, p)
    assert L_clap == pytest.approx(L_h, rel=5e-3)


def test_co2_sublimation_latent_heat_at_one_atmosphere() -> None:
    # 25.2 kJ/mol for dry ice at 194.7 K (from memory; NIST WebBook compilation); rel 1.5e-2.
    T = 194.686
    vap = _coolprop_vapour("CO2", T, co2.sublimation_pressure_co2(T))
    L = co2.latent_heat_sublimation_co2(T, 1.0 / vap.rhomass())
    assert L * co2.MOLAR_MASS == pytest.approx(25.2e3, rel=1.5e-2)


def test_co2_fusion_latent_heat_at_triple_point() -> None:
    """Clapeyron on eq. (3.10) with CoolProp's liquid: Jäger & Span's 8875 J/mol (rel 1.5e-2)
    and the CRC value of the chemicals package (rel 1.5e-2)."""
    from chemicals.phase_change import Hfus

    st = CP.AbstractState("HEOS", "CO2")
    st.update(CP.QT_INPUTS, 0.0, 216.592)
    L = co2.latent_heat_fusion_co2(216.592, 1.0 / st.rhomass()) * co2.MOLAR_MASS
    assert L == pytest.approx(8875.0, rel=1.5e-2)
    assert L == pytest.approx(Hfus("124-38-9"), rel=1.5e-2)


@pytest.mark.parametrize("T", [220.0, 230.0, 250.0, 260.0, 270.0])
def test_co2_fusion_latent_heat_two_routes(T: float) -> None:
    """Clapeyron on eq. (3.10) against h_liquid(CoolProp) - h_solid(Jäger & Span); rel 2e-2.

    The two routes part with rising pressure (3 % at 290 K, 466 MPa): eq. (3.10) and the solid
    equation are not fully consistent there, as Jäger & Span's own comparison shows.
    """
    p = co2.melting_pressure_co2(T)
    st = CP.AbstractState("HEOS", "CO2")
    st.update(CP.PT_INPUTS, p, T)
    L_clap = co2.latent_heat_fusion_co2(T, 1.0 / st.rhomass())
    L_h = st.hmass() - co2.solid_enthalpy_co2(T, p)
    assert L_clap == pytest.approx(L_h, rel=2e-2)


def test_co2_triple_point_sum_rule() -> None:
    """At the triple point L_sub = L_vap + L_fus (a law); all from this module and CoolProp."""
    T = 216.592
    st = CP.AbstractState("HEOS", "CO2")
    st.update(CP.QT_INPUTS, 1.0, T)
    v_g, h_g = 1.0 / st.rhomass(), st.hmass()
    st.update(CP.QT_INPUTS, 0.0, T)
    v_l, h_l = 1.0 / st.rhomass(), st.hmass()
    L_sub = co2.latent_heat_sublimation_co2(T, v_g)
    L_fus = co2.latent_heat_fusion_co2(T, v_l)
    assert L_sub == pytest.approx((h_g - h_l) + L_fus, rel=1e-2)


@pytest.mark.parametrize(
    "func,args",
    [
        (co2.sublimation_pressure_co2, (139.9,)),
        (co2.sublimation_pressure_co2, (216.6,)),
        (co2.sublimation_dpdT_co2, (100.0,)),
        (co2.sublimation_temperature_co2, (1.0,)),
        (co2.sublimation_temperature_co2, (6e5,)),
        (co2.melting_pressure_co2, (216.5,)),
        (co2.melting_pressure_co2, (330.0,)),
        (co2.melting_dpdT_co2, (400.0,)),
        (co2.melting_temperature_co2, (9e8,)),
        (co2.solid_volume_co2, (79.0, 1e5)),
        (co2.solid_volume_co2, (301.0, 1e5)),
        (co2.solid_volume_co2, (200.0, 0.0)),
        (co2.solid_volume_co2, (200.0, 5.1e8)),
        (co2.latent_heat_sublimation_co2, (194.7, -1.0)),
        (co2.latent_heat_fusion_co2, (300.0, 1e-3)),
    ],
)
def test_co2_out_of_range(func, args) -> None:
    with pytest.raises(OutOfRangeError) as err:
        func(*args)
    assert "to" in str(err.value)  # the message names the range


def test_co2_non_finite() -> None:
    for bad in (float("nan"), float("inf"), None, "warm"):
        with pytest.raises(NonFiniteError):
            co2.sublimation_pressure_co2(bad)


# --------------------------------------------------------------------------------------------
# Sublimation equations of nitrogen, argon and methane
# --------------------------------------------------------------------------------------------

SUB = {
    # name: (pressure function, slope function, CoolProp fluid, CAS number)
    "nitrogen": (
        sublimation_eos.sublimation_pressure_nitrogen,
        sublimation_eos.sublimation_dpdT_nitrogen,
        "Nitrogen",
        "7727-37-9",
    ),
    "argon": (
        sublimation_eos.sublimation_pressure_argon,
        sublimation_eos.sublimation_dpdT_argon,
        "Argon",
        "7440-37-1",
    ),
    "methane": (
        sublimation_eos.sublimation_pressure_methane,
        sublimation_eos.sublimation_dpdT_methane,
        "Methane",
        "74-82-8",
    ),
}


@pytest.mark.parametrize("name", SUB)
def test_sublimation_eos_triple_point(name: str) -> None:
    Tt, pt = sublimation_eos.CURVES[name][:2]
    f, _, fluid, _ = SUB[name]
    assert f(Tt) == pt  # published triple-point pressure (source of each curve)
    # the reference equation of state in CoolProp 8.0.0 has the same triple point: rel 5e-4
    assert CP.PropsSI("Ttriple", fluid) == pytest.approx(Tt, abs=1e-3)
    assert CP.PropsSI("ptriple", fluid) == pytest.approx(pt, rel=5e-4)


@pytest.mark.parametrize("name", SUB)
def test_sublimation_eos_triple_point_sum_rule(name: str) -> None:
    """L_sub(T_t) by Clapeyron on the published curve = L_vap (CoolProp reference EOS) + L_fus
    (CRC Handbook value in the chemicals package). The solid volume is neglected (below 0.1 %
    of the vapour volume). Tolerance rel 1.5e-2: the data behind the fusion enthalpies and the
    one-term curves are good to about 1 %."""
    from chemicals.phase_change import Hfus

    Tt = sublimation_eos.CURVES[name][0]
    _, slope, fluid, cas = SUB[name]
    st = CP.AbstractState("HEOS", fluid)
    st.update(CP.QT_INPUTS, 1.0, Tt)
    v_g, h_g, M = 1.0 / st.rhomass(), st.hmass(), st.molar_mass()
    st.update(CP.QT_INPUTS, 0.0, Tt)
    L_vap = h_g - st.hmass()
    L_sub = Tt * v_g * slope(Tt)
    assert L_sub == pytest.approx(L_vap + Hfus(cas) / M, rel=1.5e-2)


@pytest.mark.parametrize("name", SUB)
def test_sublimation_eos_slope_is_derivative(name: str) -> None:
    Tt, _, Tmin = sublimation_eos.CURVES[name][:3]
    f, slope, _, _ = SUB[name]
    h = 1e-4
    for T in (Tmin + h, 0.5 * (Tmin + Tt), Tt - h):
        assert slope(T) == pytest.approx((f(T + h) - f(T - h)) / (2 * h), rel=1e-6)


@pytest.mark.parametrize("name", SUB)
def test_sublimation_eos_out_of_range(name: str) -> None:
    Tt, _, Tmin = sublimation_eos.CURVES[name][:3]
    f, slope, _, _ = SUB[name]
    for T in (Tmin - 0.01, Tt + 0.01, 0.0, -10.0):
        with pytest.raises(OutOfRangeError):
            f(T)
        with pytest.raises(OutOfRangeError):
            slope(T)
    with pytest.raises(NonFiniteError):
        f(float("nan"))
