"""Freezing and melting in sealed vessels: the constant-volume leg follows the melting curve as
solid + liquid (lever rule), reports the freezing crossing, the solid fraction and the pressure
reached, and flags it (the burst-pipe case).

Check values and where they come from:

* water: IAPWS R14-08 melting pressure of ice Ih, IAPWS R10-06 ice Ih density and IAPWS-95
  liquid density, all from the independent ``iapws`` package; the lever rule on specific volume
  (a law, no table);
* CO2: the melting line of Span & Wagner (1996, eq. 3.10) through CoolProp 8.0.0's melting_line
  call, CoolProp's ``PropsSI`` for the liquid and phasepath's Jäger & Span (2012) solid
  (checked against their Table 5 in test_correlations);
* that a water-filled vessel cooled below 0 °C reaches pressures of order 100 MPa on the ice Ih
  melting curve, enough to burst a pipe (common practice).

Caution: a liquid freezing in a closed vessel or pipe can burst it; these are check cases, not
procedures; local codes and licensed practice govern real equipment.
"""

from __future__ import annotations

import warnings

import pytest

import phasepath as pp
from phasepath.correlations import co2 as co2_model

iapws = pytest.importorskip("iapws")
from iapws import IAPWS95  # noqa: E402
from iapws._iapws import _Ice, _Melting_Pressure  # noqa: E402

CP = pytest.importorskip("CoolProp.CoolProp")
MPa = 1e6


def _quiet(f, *a, **k):
    with warnings.catch_warnings():
        warnings.simplefilter("ignore")
        return f(*a, **k)


@pytest.mark.parametrize("T_end", [268.15, 263.15, 258.15, 253.15])
def test_a_sealed_water_vessel_freezes_on_the_ice_ih_melting_curve(T_end):
    """Liquid-full water (1000.2 kg/m3 at 10 °C) cooled to T_end: ice + liquid on the ice Ih
    melting curve, at R14-08's melting pressure, with the solid fraction from the lever rule on
    volume (iapws ice Ih and IAPWS-95 liquid at that pressure)."""
    rho = 1000.2
    report = pp.Route("water", T=283.15, density=rho).isochore(T=T_end).analyze()
    (freeze,) = report.crossings
    assert freeze.kind == "freezing" and freeze.to_phase == "solid+liquid"
    assert freeze.to_form == "Ih" and freeze.boundary == "melting (ice Ih)"
    p_m = _Melting_Pressure(freeze.T, ice="Ih") * MPa
    assert freeze.p == pytest.approx(p_m, rel=1e-9)
    end = report.legs[0].end
    assert end.phase == "solid+liquid" and end.form == "Ih"
    p_end = _Melting_Pressure(T_end, ice="Ih") * MPa
    assert end.p == pytest.approx(p_end, rel=1e-9)
    v_ice = 1.0 / _quiet(_Ice, T_end, p_end / MPa)["rho"]
    v_liq = 1.0 / _quiet(IAPWS95, T=T_end, P=p_end / MPa).rho
    y = (1.0 / rho - v_liq) / (v_ice - v_liq)
    assert end.solid_fraction == pytest.approx(y, rel=1e-6)
    assert end.rho == pytest.approx(rho, rel=1e-12)
    kinds = [h.kind for h in report.legs[0].hazards]
    assert "sealed-freezing" in kinds and "sealed-pressure" in kinds
    flag = next(h for h in report.legs[0].hazards if h.kind == "sealed-freezing")
    assert f"{p_end:.5g}" in flag.reason and "local codes" in flag.caution
    assert end.p > 50 * MPa  # the burst-pipe pressures (common practice: order 100 MPa)


def test_warming_the_frozen_vessel_melts_it_back():
    """The same vessel warmed again: melting at the same crossing, liquid at the end."""
    frozen = pp.Route("water", T=283.15, density=1000.2).isochore(T=258.15)
    back = frozen.isochore(T=283.15).analyze()
    out, back_in = back.crossings
    assert out.kind == "freezing" and back_in.kind == "melting"
    assert back_in.p == pytest.approx(out.p, rel=1e-9) and back_in.T == pytest.approx(out.T)
    assert back.legs[1].end.phase == "liquid"


def test_a_sealed_water_vessel_with_a_bubble_freezes_at_the_triple_point():
    """Filled at 10 °C and 1 atm, the vessel's water contracts to 4 °C and a vapor bubble
    forms; at the triple point the liquid freezes and the bubble closes, then ice + liquid
    follow the melting curve."""
    rho = CP.PropsSI("Dmass", "T", 283.15, "P", 101325.0, "Water")
    report = pp.Route("water", T=283.15, density=rho).isochore(T=263.15).analyze()
    kinds = [(c.kind, c.from_phase, c.to_phase) for c in report.crossings]
    assert kinds == [
        ("vaporization", "liquid", "liquid+vapor"),
        ("freezing", "liquid+vapor", "solid+liquid"),
    ]
    triple = report.crossings[1]
    assert triple.boundary == "triple point" and triple.T == pp.substance("water").triple[0]
    assert triple.latent_heat == pytest.approx(333.4e3, rel=1e-3)  # fusion (from memory)
    assert report.legs[0].end.p == pytest.approx(_Melting_Pressure(263.15, "Ih") * MPa, rel=1e-9)


def test_a_sealed_co2_vessel_freezes_on_its_melting_curve_and_reaches_the_triple_point():
    """Liquid CO2 at 1200 kg/m3 cooled from 230 K: solid + liquid on the melting curve (its
    pressure falls: dry ice is denser than the liquid), then solid + vapor below the triple
    point."""
    sub = pp.substance("CO2")
    report = pp.Route(sub, T=230.0, density=1200.0).isochore(T=218.0).analyze()
    (freeze,) = report.crossings
    assert freeze.kind == "freezing" and freeze.to_phase == "solid+liquid"
    a = CP.AbstractState("HEOS", "CarbonDioxide")
    assert freeze.p == pytest.approx(a.melting_line(CP.iP, CP.iT, freeze.T), rel=1e-9)
    rho_l = CP.PropsSI("Dmass", "T", freeze.T, "P", freeze.p, "CO2")
    assert rho_l == pytest.approx(1200.0, rel=1e-6)  # it freezes where the liquid is that dense
    end = report.legs[0].end
    p_m = a.melting_line(CP.iP, CP.iT, 218.0)
    assert end.p == pytest.approx(p_m, rel=1e-9)
    v_s = co2_model.solid_volume_co2(218.0, p_m)
    v_l = 1.0 / CP.PropsSI("Dmass", "T", 218.0, "P", p_m, "CO2")
    y = (1.0 / 1200.0 - v_l) / (v_s - v_l)
    assert end.solid_fraction == pytest.approx(y, rel=1e-7)
    colder = pp.Route(sub, T=230.0, density=1200.0).isochore(T=210.0).analyze()
    assert [c.kind for c in colder.crossings] == ["freezing", "freezing"]
    assert colder.crossings[1].boundary == "triple point"
    assert colder.legs[0].end.phase == "solid+vapor"


def test_a_sealed_vessel_of_solid_is_solved_on_the_solid_model():
    """Dense enough to be all solid: the pressure from the solid model's volume."""
    sub = pp.substance("CO2")
    v_s = co2_model.solid_volume_co2(200.0, 50 * MPa)
    state = pp.states.flash_Tv(sub, 200.0, v_s)
    assert state.phase == "solid" and state.p == pytest.approx(50 * MPa, rel=1e-9)
