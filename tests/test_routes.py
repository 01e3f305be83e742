"""Tier 3: routes whose crossings are known from published curves, and heat and work per leg.

Expected temperatures and pressures come from published equations evaluated by an independent
implementation (``iapws`` for water's IAPWS releases) or from values printed in the reference
papers, named beside each check. Tolerances are stated where they are used.
"""

from __future__ import annotations

import math

import pytest

import phasepath as pp
from phasepath.errors import NonFiniteError, OutOfRangeError, PhasePathError, UnitError

iapws = pytest.importorskip("iapws")
from iapws import IAPWS95  # noqa: E402
from iapws._iapws import _Ice, _Melting_Pressure  # noqa: E402

MPa = 1e6
ATM = 101325.0  # Pa, one standard atmosphere (common practice)


def kinds(report):
    return [c.kind for c in report.crossings]


def boundary(sub, label):
    return next(b for b in sub.boundaries if b.label == label)


def needs_sublimation(name):
    sub = pp.substance(name)
    assert sub.sublimation is not None, f"{sub.name} lost its published sublimation curve"
    return sub


# -- several crossings in one leg ----------------------------------------------------------------
def test_nitrogen_at_one_atmosphere_melts_then_boils():
    """N2 at 1 atm from 60 K to 100 K: melting just above the triple point 63.151 K, then
    vaporization at the normal boiling point 77.355 K (Span et al. 2000)."""
    n2 = needs_sublimation("N2")
    report = pp.Route("N2", T=60.0, p=ATM).isobar(T=100.0).analyze()
    assert kinds(report) == ["melting", "vaporization"]
    melt, boil = report.crossings
    assert (melt.from_phase, melt.to_phase) == ("solid", "liquid")
    assert (boil.from_phase, boil.to_phase) == ("liquid", "vapor")
    assert melt.step == boil.step == 1
    # the melting line rises about 4 MPa/K: at 1 atm it lies 0.01-0.03 K above Tt
    assert n2.triple[0] < melt.T < n2.triple[0] + 0.05
    assert boil.T == pytest.approx(77.355, abs=1e-3)
    assert melt.p == boil.p == ATM
    assert boil.latent_heat is not None and boil.latent_heat > 0
    leg = report.legs[0]
    assert (leg.start.phase, leg.end.phase) == ("solid", "vapor")


def test_water_just_above_the_triple_pressure_melts_then_boils():
    """Water at 1 kPa from 260 K to 300 K: melting at 273.16 K (the ice Ih curve is nearly
    vertical, IAPWS R14-08) then boiling at p_sat^-1(1 kPa) = 280.1 K (IAPWS-95, via iapws)."""
    report = pp.Route("water", T=260.0, p=1000.0).isobar(T=300.0).analyze()
    assert kinds(report) == ["melting", "vaporization"]
    melt, boil = report.crossings
    assert melt.T == pytest.approx(273.16, abs=1e-4)
    assert boil.T == pytest.approx(IAPWS95(P=1e-3, x=0).T, abs=1e-6)


# -- re-entrant ice: water compressed at 253 K ---------------------------------------------------
def test_water_compressed_at_253K_melts_ice_ih_then_freezes_to_ice_iii():
    """At 253 K ice Ih melts under pressure and the liquid then freezes to ice III, at the
    R14-08 pressures (evaluated by iapws._Melting_Pressure)."""
    report = pp.Route("water", T=253.0, p=1e5).isotherm(p=300 * MPa).analyze()
    assert kinds(report) == ["melting", "freezing"]
    melt, freeze = report.crossings
    assert (melt.from_phase, melt.from_form, melt.to_phase) == ("solid", "Ih", "liquid")
    assert (freeze.from_phase, freeze.to_phase, freeze.to_form) == ("liquid", "solid", "III")
    # same equations; 1e-12 relative plus the documented 0.002 Pa ice Ih junction shift
    assert melt.p == pytest.approx(_Melting_Pressure(253.0, "Ih") * MPa, rel=1e-12, abs=3e-3)
    assert freeze.p == pytest.approx(_Melting_Pressure(253.0, "III") * MPa, rel=1e-12)
    assert melt.T == freeze.T == 253.0
    # R14-08: about 194.8 MPa and 242.8 MPa (rounded here, common reading of the equations)
    assert 190 * MPa < melt.p < 200 * MPa < 240 * MPa < freeze.p < 245 * MPa
    legs = report.legs
    assert (legs[0].start.form, legs[0].end.form) == ("Ih", "III")


def test_water_decompressed_at_253K_reverses_the_re_entrant_crossings():
    report = pp.Route("water", T=253.0, p=300 * MPa).isotherm(p=1e5).analyze()
    assert kinds(report) == ["melting", "freezing"]
    assert [(c.from_form, c.to_form) for c in report.crossings] == [("III", None), (None, "Ih")]


def test_isobar_across_ice_iii_melting():
    """At 250 MPa, warming from 252 K melts ice III at the R14-08 ice III temperature."""
    report = pp.Route("water", T=252.0, p=250 * MPa).isobar(T=262.0).analyze()
    assert kinds(report) == ["melting"]
    (c,) = report.crossings
    assert c.from_form == "III"
    assert _Melting_Pressure(c.T, "III") * MPa == pytest.approx(250 * MPa, rel=1e-9)


# -- the same boundary crossed twice ------------------------------------------------------------
def test_boil_then_condense_on_the_same_curve():
    """Water at 1 atm heated to 400 K and cooled back: the vapor-pressure curve is crossed twice,
    both times at the normal boiling point 373.124 K (Wagner & Pruss 2002)."""
    report = pp.Route("water", T=300.0, p=ATM).isobar(T=400.0).isobar(T=300.0).analyze()
    assert kinds(report) == ["vaporization", "condensation"]
    up, down = report.crossings
    assert (up.step, down.step) == (1, 2)
    assert up.T == down.T == pytest.approx(373.124, abs=1e-3)
    assert up.latent_heat == down.latent_heat
    # heat in and heat out cancel on a closed loop of isobars (Δh = 0)
    assert report.legs[0].heat == pytest.approx(-report.legs[1].heat, rel=1e-12)


def test_one_isotherm_crosses_the_melting_kind_twice_and_the_vapor_curve_once():
    """Water at 253 K from 50 Pa to 300 MPa: deposition, then melting (ice Ih), then freezing
    (ice III); the two melting-kind crossings are different branches of one curve family."""
    report = pp.Route("water", T=253.0, p=50.0).isotherm(p=300 * MPa).analyze()
    assert kinds(report) == ["deposition", "melting", "freezing"]
    assert [c.boundary for c in report.crossings][1:] == ["melting (ice Ih)", "melting (ice III)"]


# -- supercritical entry and exit -----------------------------------------------------------------
def test_water_loop_around_the_critical_point():
    """Water (Tc 647.096 K, pc 22.064 MPa, IAPWS-95): compress vapor at 600 K (condenses at
    p_sat(600 K) = 12.34 MPa), heat at 30 MPa across the critical isotherm (entry), expand at
    700 K across the critical isobar (exit), cool at 10 MPa (stays vapor)."""
    water = pp.substance("water")
    Tc, pc = water.critical
    report = (
        pp.Route("water", T=600.0, p=10 * MPa)
        .isotherm(p=30 * MPa)
        .isobar(T=700.0)
        .isotherm(p=10 * MPa)
        .isobar(T=600.0)
        .analyze()
    )
    assert kinds(report) == ["condensation", "supercritical-entry", "supercritical-exit"]
    cond, entry, exit_ = report.crossings
    assert cond.p == pytest.approx(IAPWS95(T=600.0, x=0).P * MPa, rel=1e-8)
    assert (entry.step, entry.T, entry.p) == (2, Tc, 30 * MPa)
    assert (entry.from_phase, entry.to_phase) == ("liquid", "supercritical")
    assert (exit_.step, exit_.T, exit_.p) == (3, 700.0, pc)
    assert (exit_.from_phase, exit_.to_phase) == ("supercritical", "vapor")
    for c in (entry, exit_):
        assert c.latent_heat is None and c.latent_heat_note  # second-order: no latent heat
    assert [leg.end.phase for leg in report.legs] == ["liquid", "supercritical", "vapor", "vapor"]


def test_co2_entry_across_the_critical_isobar_and_exit_across_the_critical_isotherm():
    """CO2 (Tc 304.1282 K, pc 7.3773 MPa, Span & Wagner 1996): compress at 320 K (entry at pc),
    cool at 10 MPa (exit at Tc into liquid)."""
    co2 = pp.substance("CO2")
    report = pp.Route("CO2", T=320.0, p=5 * MPa).isotherm(p=10 * MPa).isobar(T=290.0).analyze()
    assert kinds(report) == ["supercritical-entry", "supercritical-exit"]
    entry, exit_ = report.crossings
    assert entry.p == pytest.approx(7.3773 * MPa, rel=1e-6) and entry.T == 320.0
    assert exit_.T == pytest.approx(304.1282, abs=1e-6) and exit_.p == 10 * MPa
    assert (entry.from_phase, exit_.to_phase) == ("vapor", "liquid")
    assert co2.critical == (pytest.approx(304.1282, abs=1e-6), pytest.approx(7.3773e6, rel=1e-6))


# -- exactly on a boundary ------------------------------------------------------------------------
# The rule (phasepath.analysis): a crossing exactly at a corner is recorded once, on the leg that
# ends there, and only if the phase changes across the corner; the route's start takes the phase
# of the side it leaves into; a route that ends on a boundary records no crossing there.
def _t_boil() -> float:
    return pp.substance("water").vapor.T_of_p(ATM)


def test_leg_ending_on_the_curve_then_leaving_it_records_one_corner_crossing():
    Tb = _t_boil()
    report = pp.Route("water", T=300.0, p=ATM).isobar(T=Tb).isobar(T=400.0).analyze()
    assert kinds(report) == ["vaporization"]
    (c,) = report.crossings
    assert c.step == 1 and c.at_corner and (c.T, c.p) == (Tb, ATM)
    assert c.latent_heat == pytest.approx(
        IAPWS95(T=Tb, x=1).h * 1e3 - IAPWS95(T=Tb, x=0).h * 1e3, rel=1e-7
    )
    first, second = report.legs
    assert first.end.phase == c.to_phase == second.start.phase == "vapor"
    # no heat lost at the corner: the two legs add up to the one-leg route
    whole = pp.Route("water", T=300.0, p=ATM).isobar(T=400.0).analyze()
    assert first.heat + second.heat == pytest.approx(whole.legs[0].heat, rel=1e-9)


def test_touching_the_curve_and_turning_back_is_not_a_crossing():
    Tb = _t_boil()
    report = pp.Route("water", T=300.0, p=ATM).isobar(T=Tb).isobar(T=300.0).analyze()
    assert kinds(report) == []
    assert [leg.end.phase for leg in report.legs] == ["liquid", "liquid"]


@pytest.mark.parametrize("T_end,phase", [(400.0, "vapor"), (300.0, "liquid")])
def test_route_starting_on_the_curve_takes_the_side_it_leaves_into(T_end, phase):
    report = pp.Route("water", T=_t_boil(), p=ATM).isobar(T=T_end).analyze()
    assert kinds(report) == []
    assert report.legs[0].start.phase == report.legs[0].end.phase == phase


def test_route_ending_on_the_curve_records_no_crossing():
    report = pp.Route("water", T=300.0, p=ATM).isobar(T=_t_boil()).analyze()
    assert kinds(report) == []
    assert report.legs[0].end.phase == "liquid"


def test_isotherm_ending_exactly_on_the_vapor_pressure_then_compressing():
    water = pp.substance("water")
    p_sat = water.vapor.p_of_T(450.0)  # 0.932203564 MPa (IAPWS R6-95 Table 8)
    assert p_sat == pytest.approx(0.932203564 * MPa, rel=2e-8)
    report = pp.Route("water", T=450.0, p=0.5 * MPa).isotherm(p=p_sat).isotherm(p=2 * MPa).analyze()
    assert kinds(report) == ["condensation"]
    assert report.crossings[0].at_corner and report.crossings[0].step == 1


# -- the triple-point isobar ---------------------------------------------------------------------
@pytest.mark.parametrize("name,T0,T1", [("water", 260.0, 300.0), ("CO2", 200.0, 240.0)])
def test_isobar_at_the_triple_point_pressure_sublimes_at_the_triple_point(name, T0, T1):
    """Rule (phasepath.analysis): a leg along the triple-point isobar changes phase once, solid ->
    vapor, at the triple point (273.16 K for water, IAPWS; 216.592 K for CO2, Span & Wagner)."""
    sub = needs_sublimation(name)
    T_t, p_t = sub.triple
    report = pp.Route(sub, T=T0, p=p_t).isobar(T=T1).analyze()
    assert kinds(report) == ["sublimation"]
    (c,) = report.crossings
    assert (c.T, c.p) == (T_t, p_t)
    assert (c.from_phase, c.to_phase) == ("solid", "vapor")


@pytest.mark.parametrize(
    "factor,expected", [(1.001, ["melting", "vaporization"]), (0.999, ["sublimation"])]
)
def test_isobars_either_side_of_the_triple_pressure(factor, expected):
    water = pp.substance("water")
    report = pp.Route("water", T=260.0, p=water.triple[1] * factor).isobar(T=300.0).analyze()
    assert kinds(report) == expected


# -- the issue's CO2 example route -------------------------------------------------------------
def _span_wagner_sublimation_pressure(T: float) -> float:
    """Span & Wagner 1996 eq. (3.12), written out here from the paper's coefficients (from
    memory): ln(p/pt) = (Tt/T) [a1 (1 - T/Tt) + a2 (1 - T/Tt)^1.9 + a3 (1 - T/Tt)^2.9]."""
    Tt, pt = 216.592, 0.51795e6
    x = 1.0 - T / Tt
    return pt * math.exp(Tt / T * (-14.740846 * x + 2.4327015 * x**1.9 - 5.3061778 * x**2.9))


def test_issue_co2_example_route():
    """Liquid CO2 at 250 K, 20 bar, expanded to 1 bar (boils at p_sat(250 K) = 1.785 MPa, Span
    & Wagner 1996 tables, from memory), then cooled at 1 bar to 180 K (deposits as dry ice at the
    Span & Wagner sublimation temperature for 0.1 MPa, 194.52 K)."""
    needs_sublimation("CO2")
    report = pp.Route("CO2", T=250.0, p=20e5).isotherm(p=1e5).isobar(T=180.0).analyze()
    assert kinds(report) == ["vaporization", "deposition"]
    boil, dep = report.crossings
    assert (boil.step, dep.step) == (1, 2)
    assert boil.T == 250.0 and boil.p == pytest.approx(1.785e6, rel=1e-3)
    assert dep.p == 1e5
    # the curve is scaled by p_t(EOS)/p_t(S&W) = 1 + 2.8e-5 to meet the EOS triple point: about
    # 2e-4 K at this temperature, so 1e-3 K
    assert _span_wagner_sublimation_pressure(dep.T) == pytest.approx(1e5, rel=2e-4)
    assert dep.T == pytest.approx(194.52, abs=0.01)
    assert (dep.from_phase, dep.to_phase) == ("vapor", "solid")
    # dry ice: about 25.2 kJ/mol = 573 kJ/kg near 1 atm (from memory); 1 % allowed
    assert dep.latent_heat == pytest.approx(25.2e3 / 0.0440098, rel=0.01)
    assert dep.latent_heat_model
    assert [leg.end.phase for leg in report.legs] == ["vapor", "solid"]
    table = report.table(T_unit="degC", p_unit="bar", energy_unit="kJ/kg")
    assert list(table["kind"]) == ["vaporization", "deposition"]
    assert table["T [°C]"].iloc[1] == pytest.approx(dep.T - 273.15, abs=1e-9)
    assert table["p [bar]"].iloc[1] == pytest.approx(1.0, rel=1e-12)
    assert table["latent heat [kJ/kg]"].iloc[1] == pytest.approx(dep.latent_heat / 1e3, rel=1e-12)
    html = report._repr_html_()
    assert "<table" in html and "deposition" in html


# -- heat and work per leg (reversible steady flow) ----------------------------------------------
def _h(T: float, p: float) -> float:
    return IAPWS95(T=T, P=p / MPa).h * 1e3


def _s(T: float, p: float) -> float:
    return IAPWS95(T=T, P=p / MPa).s * 1e3


def test_isobar_heat_is_the_enthalpy_rise_and_work_is_zero():
    """Water at 1 atm, 300 K liquid to 400 K vapor: q = Δh (IAPWS-95 via iapws), w = 0.
    1e-7 relative: both sides evaluate IAPWS-95 with their own density solvers."""
    leg = pp.Route("water", T=300.0, p=ATM).isobar(T=400.0).analyze().legs[0]
    assert leg.heat == pytest.approx(_h(400.0, ATM) - _h(300.0, ATM), rel=1e-7)
    assert leg.work == 0.0


@pytest.mark.parametrize(
    "T,p0,p1",
    [(300.0, ATM, 10 * MPa), (400.0, ATM, 1 * MPa), (700.0, 10 * MPa, 40 * MPa)],
    ids=["liquid", "condensing", "supercritical"],
)
def test_isotherm_heat_is_T_delta_s_and_work_the_rest(T, p0, p1):
    """q = T Δs, w = Δh - T Δs (reversible steady flow), against IAPWS-95 via iapws."""
    leg = pp.Route("water", T=T, p=p0).isotherm(p=p1).analyze().legs[0]
    q = T * (_s(T, p1) - _s(T, p0))
    dh = _h(T, p1) - _h(T, p0)
    assert leg.heat == pytest.approx(q, rel=1e-6)
    assert leg.work == pytest.approx(dh - q, rel=1e-6, abs=1e-3 * abs(q))
    assert leg.heat + leg.work == pytest.approx(dh, rel=1e-6)


# -- latent heats ----------------------------------------------------------------------------------
def test_vaporization_latent_heat_at_one_atmosphere_vs_iapws():
    (c,) = pp.Route("water", T=300.0, p=ATM).isobar(T=400.0).analyze().crossings
    ref = (IAPWS95(T=c.T, x=1).h - IAPWS95(T=c.T, x=0).h) * 1e3  # about 2256.5 kJ/kg
    assert c.latent_heat == pytest.approx(ref, rel=1e-7)


def test_ice_ih_melting_latent_heat_at_the_triple_point():
    """Melting at 1 kPa (0.1 mK from the triple point): 333.4 kJ/kg (IAPWS R10-06 with IAPWS-95,
    the published enthalpy of melting at the triple point), and equal to h_liquid (iapws IAPWS95)
    minus h_ice (iapws _Ice, R10-06) at the crossing."""
    report = pp.Route("water", T=260.0, p=1000.0).isobar(T=275.0).analyze()
    (c,) = report.crossings
    assert c.kind == "melting" and c.latent_heat is not None, c.latent_heat_note
    assert c.latent_heat == pytest.approx(333.4e3, abs=0.05e3)
    h_ice = _Ice(c.T, c.p / MPa)["h"] * 1e3
    h_liq = _h(c.T, c.p)
    assert c.latent_heat == pytest.approx(h_liq - h_ice, rel=1e-6)
    assert "R10-06" in c.latent_heat_model


def test_ice_ih_melting_latent_heat_at_one_atmosphere_vs_iapws():
    (c,) = pp.Route("water", T=260.0, p=ATM).isobar(T=280.0).analyze().crossings
    assert c.kind == "melting"
    assert c.T == pytest.approx(273.152519, abs=1e-5)  # R14-08 at 0.101325 MPa (via iapws below)
    assert _Melting_Pressure(c.T, "Ih") * MPa == pytest.approx(ATM, rel=1e-4)
    ref = _h(c.T, c.p) - _Ice(c.T, c.p / MPa)["h"] * 1e3
    assert c.latent_heat == pytest.approx(ref, rel=1e-6)


def test_co2_fusion_latent_heat_at_the_triple_point():
    """CO2 melting just above the triple point: 8875 J/mol (the value Jäger & Span 2012 adopt,
    from memory); 1 % allowed."""
    co2 = pp.substance("CO2")
    report = pp.Route("CO2", T=210.0, p=co2.triple[1] * 1.001).isobar(T=216.6).analyze()
    assert kinds(report) == ["melting"]  # boils only at 216.615 K, past the leg's end
    c = report.crossings[0]
    assert "Jäger & Span" in c.latent_heat_model
    assert c.latent_heat * 0.0440098 == pytest.approx(8875.0, rel=0.01)


def test_no_latent_heat_without_a_solid_model_says_why():
    report = pp.Route("N2", T=70.0, p=1e6).isotherm(p=100 * MPa).analyze()
    (freeze,) = report.crossings
    assert freeze.kind == "freezing"
    assert freeze.latent_heat is None and "solid Nitrogen" in freeze.latent_heat_note
    # ice III: a model from the optional extra (changed on purpose: seafreeze, when installed),
    # else the reason names the extra to install
    report = pp.Route("water", T=253.0, p=1e5).isotherm(p=300 * MPa).analyze()
    freeze = report.crossings[1]
    assert freeze.to_form == "III"
    try:
        import seafreeze  # noqa: F401
    except ImportError:
        assert freeze.latent_heat is None and "phasepath[ices]" in freeze.latent_heat_note
    else:
        assert freeze.latent_heat is not None and "Journaux" in freeze.latent_heat_model


# -- input at the edges ------------------------------------------------------------------------
@pytest.mark.parametrize(
    "T,p,T_si,p_si",
    [
        ("25 degC", "14.7 psi", 298.15, 14.7 * 6894.757293168361),
        ("-40 degF", "60 bar", 233.15, 60e5),
        (300, 101325, 300.0, 101325.0),
    ],
)
def test_units_are_accepted_everywhere(T, p, T_si, p_si):
    """Unit conversions: 1 psi = 6894.757293168 Pa, -40 degF = -40 degC (common practice)."""
    route = pp.Route("water", T=T, p=p)
    assert route.start.T == pytest.approx(T_si, rel=1e-12)
    assert route.start.p == pytest.approx(p_si, rel=1e-9)
    route.isotherm(p="2 MPa").isobar(T="80 degC")
    assert route.legs[1].T == pytest.approx(353.15, rel=1e-12)
    assert route.legs[1].given == {"T": "80 degC"}


def test_pint_quantities_are_accepted():
    import pint

    ureg = pint.UnitRegistry()
    route = pp.Route("N2", T=ureg.Quantity(80.0, "kelvin"), p=ureg.Quantity(2.0, "bar"))
    assert (route.start.T, route.start.p) == (80.0, pytest.approx(2e5))


@pytest.mark.parametrize(
    "kwargs,error,text",
    [
        ({"T": "-300 degC", "p": "1 bar"}, OutOfRangeError, "-300 degC"),
        ({"T": "5 bar", "p": "1 bar"}, UnitError, "5 bar"),
        ({"T": "300 K", "p": "1 parsec"}, UnitError, "1 parsec"),
        ({"T": float("nan"), "p": "1 bar"}, NonFiniteError, "nan"),
        ({"T": 300.0, "p": "90000 bar"}, OutOfRangeError, "90000 bar"),
    ],
)
def test_bad_start_is_a_phasepath_error_quoting_the_input(kwargs, error, text):
    with pytest.raises(error) as info:
        pp.Route("CO2", **kwargs)
    assert isinstance(info.value, PhasePathError) and isinstance(info.value, ValueError)
    assert text in str(info.value)


def test_bad_leg_is_refused_and_the_route_is_kept():
    route = pp.Route("CO2", T=250.0, p=20e5).isotherm(p="10 bar")
    with pytest.raises(OutOfRangeError) as info:
        route.isotherm(p="2000 MPa")
    assert "2000 MPa" in str(info.value)
    assert len(route.legs) == 1  # nothing the user entered is lost
    assert kinds(route.analyze()) == ["vaporization"]
