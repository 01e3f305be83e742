"""The three views of a phase diagram (P–T, p–h, T–s): the substance's boundaries in each view
(phasepath.views) and the route's path in each view (Report.path, phasepath.paths.route_path).

Check values:
* Saturated liquid and vapor states, the critical point and single-phase states from the
  reference library CoolProp (Span & Wagner 1996 for CO2, IAPWS-95 for water), called here
  directly through ``PropsSI``, not through phasepath.
* Water at its triple point: latent heat of vaporization 2500.9 kJ/kg (IAPWS-95 steam tables;
  from memory) and of fusion of ice Ih 333.4 kJ/kg (common practice); boiling at 1 atm
  2256.5 kJ/kg (IAPWS-95 steam tables; from memory).
* Everything else is a property of the construction: an isenthalp has one h, an isentrope one
  s, an isotherm one T, an isobar one p, and the path passes through the leg's corners.
"""

from __future__ import annotations

import importlib.util
import math

import numpy as np
import pytest

import phasepath as pp
from phasepath import paths, views

CP = pytest.importorskip("CoolProp.CoolProp")


@pytest.fixture(scope="module")
def co2() -> pp.Substance:
    return pp.substance("CO2")


@pytest.fixture(scope="module")
def water() -> pp.Substance:
    return pp.substance("water")


# -- boundaries in each view -----------------------------------------------------------------------
@pytest.mark.parametrize("name, fluid", [("CO2", "CO2"), ("water", "Water")])
def test_dome_lines_are_the_saturated_states_of_the_reference_library(name, fluid):
    sub = pp.substance(name)
    by = {c.label: c for c in views.curves(sub, "ph")}
    liquid, vapor = by["saturated liquid"], by["saturated vapor"]
    for k in range(1, len(liquid.x) - 1, 11):
        p = float(liquid.y[k])
        assert liquid.x[k] == pytest.approx(CP.PropsSI("H", "P", p, "Q", 0, fluid), rel=1e-7)
        assert vapor.x[k] == pytest.approx(CP.PropsSI("H", "P", p, "Q", 1, fluid), rel=1e-7)
    ts = {c.label: c for c in views.curves(sub, "Ts")}
    for k in range(1, len(ts["saturated liquid"].x) - 1, 13):
        T = float(ts["saturated vapor"].y[k])
        s_v = CP.PropsSI("S", "T", T, "Q", 1, fluid)
        assert ts["saturated vapor"].x[k] == pytest.approx(s_v, rel=1e-7)


def test_dome_closes_at_the_critical_point(co2):
    rho_c = CP.PropsSI("rhomass_critical", "CO2")
    T_c = CP.PropsSI("Tcrit", "CO2")
    h_c = CP.PropsSI("H", "T", T_c, "Dmass", rho_c, "CO2")
    s_c = CP.PropsSI("S", "T", T_c, "Dmass", rho_c, "CO2")
    (crit,) = [pt for pt in views.points(co2, "ph") if pt.name == "critical point"]
    assert crit.x == pytest.approx(h_c, rel=1e-5) and crit.y == pytest.approx(co2.critical[1])
    (crit_s,) = [pt for pt in views.points(co2, "Ts") if pt.name == "critical point"]
    assert crit_s.x == pytest.approx(s_c, rel=1e-5) and crit_s.y == pytest.approx(T_c)
    liquid = next(c for c in views.curves(co2, "ph") if c.label == "saturated liquid")
    vapor = next(c for c in views.curves(co2, "ph") if c.label == "saturated vapor")
    assert liquid.x[-1] == pytest.approx(vapor.x[-1], rel=1e-6)  # the two sides meet


def test_water_triple_point_line_spans_ice_liquid_and_vapor(water):
    (line,) = [c for c in views.curves(water, "ph") if c.kind == "triple"]
    h_ice, h_liquid, h_vapor = line.x
    assert np.all(line.y == water.triple[1])
    assert (h_vapor - h_liquid) / 1e3 == pytest.approx(2500.9, abs=0.3)  # IAPWS-95 (from memory)
    assert (h_liquid - h_ice) / 1e3 == pytest.approx(333.4, abs=0.5)  # common practice
    labels = {c.label for c in views.curves(water, "ph")}
    # ice Ih has a published model (IAPWS R10-06): its melting branch is drawn; ices III, V and
    # VI have one where the optional extra (seafreeze, Journaux et al. 2020) is installed
    assert "solid side of the melting (ice Ih) branch" in labels
    has_ices = importlib.util.find_spec("seafreeze") is not None
    assert any("ice III" in label for label in labels) == has_ices
    assert any("ice III" in c.label for c in views.curves(water, "pT"))


def test_substance_without_solid_model_has_no_solid_lines_and_no_eos_has_no_energy_view():
    n2 = pp.substance("nitrogen")
    kinds = {c.kind for c in views.curves(n2, "ph")}
    assert kinds == {"vaporization", "triple"}
    demo = pp.Substance.from_data(  # invented demo data
        "demo views solvent", vapor_points=[(300.0, 5e3), (320.0, 1.2e4), (350.0, 4e4)]
    )
    assert views.curves(demo, "ph") == () and views.points(demo, "Ts") == ()
    assert len(views.curves(demo, "pT")) == 1
    with pytest.raises(pp.PhasePathError):
        views.state_at(demo, "ph", 1e5, 1e4)


def test_unknown_view_is_refused(co2):
    with pytest.raises(pp.PhasePathError, match="pT, ph, Ts"):
        views.curves(co2, "hs")


# -- the state at a point of a view ----------------------------------------------------------------
@pytest.mark.parametrize(
    "fluid, name, T, p",
    [
        ("CO2", "CO2", 250.0, 30e5),
        ("CO2", "CO2", 350.0, 100e5),
        ("CO2", "CO2", 260.0, 5e5),
        ("Water", "water", 300.0, 1e5),
        ("Water", "water", 500.0, 1e5),
    ],
    ids=["co2-liquid", "co2-supercritical", "co2-vapor", "water-liquid", "water-steam"],
)
def test_state_at_finds_single_phase_states_from_h_or_s(fluid, name, T, p):
    sub = pp.substance(name)
    h = CP.PropsSI("H", "T", T, "P", p, fluid)
    s = CP.PropsSI("S", "T", T, "P", p, fluid)
    st = views.state_at(sub, "ph", h, p)
    assert st.T == pytest.approx(T, abs=1e-6) and st.s == pytest.approx(s, rel=1e-7)
    st = views.state_at(sub, "Ts", s, T)
    assert st.p == pytest.approx(p, rel=1e-6) and st.h == pytest.approx(h, rel=1e-7)
    st = views.state_at(sub, "pT", T, p)
    assert st.h == pytest.approx(h, rel=1e-9) and st.vapor_fraction is None


def test_state_at_inside_the_dome_gives_the_quality(co2):
    p = 20e5
    h_l, h_v = (CP.PropsSI("H", "P", p, "Q", q, "CO2") for q in (0, 1))
    h = 0.3 * h_l + 0.7 * h_v
    st = views.state_at(co2, "ph", h, p)
    assert st.phase == "liquid+vapor"
    assert st.vapor_fraction == pytest.approx(CP.PropsSI("Q", "P", p, "H", h, "CO2"), abs=1e-7)
    assert st.T == pytest.approx(CP.PropsSI("T", "P", p, "Q", 0, "CO2"), abs=1e-6)
    T = 240.0
    s_l, s_v = (CP.PropsSI("S", "T", T, "Q", q, "CO2") for q in (0, 1))
    st = views.state_at(co2, "Ts", 0.5 * (s_l + s_v), T)
    assert st.phase == "liquid+vapor" and st.vapor_fraction == pytest.approx(0.5, abs=1e-9)


def test_state_at_below_the_triple_point_gives_dry_ice_snow(co2):
    st = views.state_at(co2, "Ts", -200.0, 190.0)
    assert st.phase == "solid+vapor" and 0.0 < st.solid_fraction < 1.0
    assert st.p == pytest.approx(co2.sublimation.p_of_T(190.0), rel=1e-12)
    assert st.s == pytest.approx(-200.0, rel=1e-9)


@pytest.mark.parametrize("x, y", [(math.nan, 1e5), (1e5, math.inf)])
def test_state_at_refuses_non_finite_points(co2, x, y):
    with pytest.raises(pp.OutOfRangeError):
        views.state_at(co2, "ph", x, y)


# -- the route's path in each view ----------------------------------------------------------------
def test_valve_is_vertical_on_ph_and_passes_its_crossings(co2):
    rep = pp.Route("CO2", T="20 degC", p="60 bar").isenthalp(p="1 atm").analyze()
    h, p = rep.path("ph")
    h0 = rep.legs[0].start.h
    assert np.all(np.abs(h - h0) <= 1e-6 * abs(h0))  # constant h, to the flash's precision
    assert p[0] == pytest.approx(60e5) and p[-1] == pytest.approx(101325.0)
    for c in rep.crossings:  # every crossing is a point of the path
        assert np.any(np.isclose(p, c.p, rtol=1e-12))
    s, T = rep.path("Ts")
    assert T[-1] == pytest.approx(rep.legs[0].end.T) and s[-1] == pytest.approx(rep.legs[0].end.s)
    assert np.all(np.diff(s) >= -1e-9)  # a throttle only makes entropy


def test_compressor_is_vertical_on_Ts_and_isotherm_curves_on_ph(co2):
    rep = (
        pp.Route("CO2", T="-20 degC", p="10 bar")
        .isentrope(p="60 bar")
        .isotherm(p="100 bar")
        .analyze()
    )
    s, T = rep.path("Ts")
    s0 = rep.legs[0].start.s
    n1 = len(paths.leg_states(co2, rep.legs[0], []))
    assert np.all(np.abs(s[:n1] - s0) <= 1e-7 * abs(s0))
    # the isotherm: one temperature on every point after the compressor's end
    assert np.all(np.isclose(T[n1 - 1 :], rep.legs[1].start.T, rtol=1e-12))
    h, p = rep.path("ph")
    T_iso = rep.legs[1].start.T
    for hk, pk in zip(h[n1:], p[n1:], strict=True):  # the states lie on the isotherm (CoolProp)
        assert hk == pytest.approx(CP.PropsSI("H", "P", pk, "T", T_iso, "CO2"), rel=1e-9)
    assert len(h) > n1 + 5  # an isotherm is a curve on p–h: followed, not a straight line


def test_isobar_crosses_the_dome_horizontally_through_both_saturated_states(water):
    rep = pp.Route("water", T="20 degC", p="1 atm").isobar(T="150 degC").analyze()
    (c,) = rep.crossings
    h, p = rep.path("ph")
    assert np.all(p == 101325.0)
    h_l, h_v = (CP.PropsSI("H", "P", 101325.0, "Q", q, "Water") for q in (0, 1))
    assert np.any(np.isclose(h, h_l, rtol=1e-9)) and np.any(np.isclose(h, h_v, rtol=1e-9))
    assert (h_v - h_l) / 1e3 == pytest.approx(2256.5, abs=0.2)  # IAPWS-95 (from memory)
    s, T = rep.path("Ts")
    at = np.isclose(T, c.T, rtol=1e-12)
    assert at.sum() >= 2  # the jump across the dome at the boiling temperature
    assert h[0] == pytest.approx(rep.legs[0].start.h) and h[-1] == pytest.approx(rep.legs[0].end.h)


def test_pT_path_is_the_drawn_line(co2):
    rep = pp.Route("CO2", T="20 degC", p="60 bar").isenthalp(p="1 atm").analyze()
    T, p = rep.path("pT")
    line = paths.route_line(rep.substance, rep.legs, rep.crossings)
    assert list(zip(T, p, strict=True)) == line


def test_path_has_a_gap_where_no_model_gives_h():
    # nitrogen cooled at 1 bar until it freezes (63.2 K, on the melting line of the reference
    # EOS): solid nitrogen has no property model in phasepath, so the path on p-h stops there
    rep = pp.Route("N2", T="70 K", p="1 bar").isobar(T="50 K").analyze()
    assert [(c.kind, c.to_phase) for c in rep.crossings] == [("freezing", "solid")]
    h, p = rep.path("ph")
    assert np.isnan(h).any() and np.isfinite(h).any()
    T, p_T = rep.path("pT")
    assert np.all(np.isfinite(T))


def test_unknown_view_of_a_report_is_refused(co2):
    rep = pp.Route("CO2", T=250.0, p=20e5).isobar(T=300.0).analyze()
    with pytest.raises(pp.PhasePathError, match="unknown view"):
        rep.path("hs")


def test_melting_lines_start_at_the_ends_of_the_triple_point_line(co2):
    by = {c.label: c for c in views.curves(co2, "ph")}
    (triple,) = [c for c in views.curves(co2, "ph") if c.kind == "triple"]
    h_solid, h_liquid, _ = triple.x
    fluid = by["fluid side of the melting branch"]
    solid = by["solid side of the melting branch"]
    assert fluid.x[0] == pytest.approx(h_liquid, rel=1e-6)  # the liquid beside the solid
    assert solid.x[0] == pytest.approx(h_solid, rel=1e-6)
    melt = co2.melting[0]  # used as published: it starts at 0.51795 MPa (Span & Wagner 1996,
    # eq. 3.10), 14 Pa below the triple point of the equation of state
    assert fluid.y[0] == pytest.approx(melt.p_of_T(melt.T_min), rel=1e-9)
    assert fluid.y[0] == pytest.approx(co2.triple[1], rel=3e-5)
    assert np.all(np.diff(fluid.y) > 0)  # up the melting curve
