"""Melting and sublimation curves as published: helium and hydrogen, gaps at the triple point,
curves flagged unreliable.

Check values and where they come from:

* helium-4 has no solid-liquid-vapor triple point and needs about 2.5 MPa to solidify at any
  temperature (common practice); liquid helium at 2.19 K and 1 atm is liquid (common practice);
  its melting curve is that of Mills & Grilly, Phys. Rev. 99, 480 (1955):
  p = (-17.80 + 17.31457 T**1.555414) kgf/cm2, evaluated here from the printed formula;
* normal hydrogen's melting curve starts at the triple point of Leachman et al. (2009),
  13.957 K and 7.3578 kPa (the reducing point of the curve in the REFPROP 10 file, attribution
  from memory); CoolProp 8.0.0's own line gives 23.6 MPa there (read from CoolProp here);
* the melting lines of CoolProp 8.0.0 at the triple point (read from CoolProp here) and the
  EOS triple points (CoolProp 8.0.0, read here).
"""

from __future__ import annotations

import numpy as np
import pytest

import phasepath as pp
from phasepath import format_report

CP = pytest.importorskip("CoolProp.CoolProp")

KGF_CM2 = 98066.5  # Pa (common practice: 1 kgf/cm2 = 98.0665 kPa exactly)


def mills_grilly(T: float) -> float:
    """Mills & Grilly (1955), as printed, in Pa."""
    return (-17.80 + 17.31457 * T**1.555414) * KGF_CM2


# -- helium ------------------------------------------------------------------------------------


def test_liquid_helium_at_2_19_K_and_1_atm_is_liquid():
    assert pp.substance("helium").phase(2.19, 101325.0) == "liquid"


def test_helium_freezes_on_the_mills_grilly_curve_at_2_3_K():
    report = pp.Route("He", T=2.3, p=1e3).isotherm(p=10e6).analyze()
    kinds = [c.kind for c in report.crossings]
    assert kinds == ["condensation", "freezing"]
    freeze = report.crossings[1]
    assert freeze.p == pytest.approx(mills_grilly(2.3), rel=1e-9)
    assert freeze.p > 2.5e6
    assert freeze.flag == ""  # on the published curve, not in a gap


@pytest.mark.parametrize("T", np.linspace(2.1768, 5.1, 9).tolist())
def test_helium_never_freezes_below_its_minimum_melting_pressure(T):
    sub = pp.substance("He")
    for p in np.geomspace(1e3, 2.5e6, 40):
        assert sub.phase(T, float(p)) != "solid"
    route = pp.Route("He", T=T, p=1e3).isotherm(p=2.5e6)
    assert all(c.kind not in ("freezing", "melting") for c in route.analyze().crossings)


def test_helium_melting_curve_is_not_moved_onto_the_lambda_point():
    sub = pp.substance("He")
    (b,) = sub.melting
    T_t, p_t = sub.triple  # CoolProp's "triple point": the lambda point at saturation
    assert b.source == "MillsGrilly1955"
    assert b.p_of_T(T_t) == pytest.approx(mills_grilly(T_t), rel=1e-12)
    assert b.p_of_T(T_t) > 700 * p_t
    assert any("lambda" in n for n in sub.notes)


# -- hydrogen ----------------------------------------------------------------------------------


def test_normal_hydrogen_melting_curve_starts_at_its_published_triple_point():
    sub = pp.substance("H2")
    (b,) = sub.melting
    assert b.source == "Leachman2009" and b.reliable
    assert (b.T_min, b.p_of_T(b.T_min)) == (pytest.approx(13.957), pytest.approx(7357.8))
    coolprop = CP.AbstractState("HEOS", "Hydrogen").melting_line(CP.iP, CP.iT, 13.957)
    assert coolprop == pytest.approx(23.6e6, rel=0.01)  # CoolProp's own line, not used
    # liquid hydrogen at 20 K and 1 MPa is liquid, not solid
    assert sub.phase(20.0, 1e6) == "liquid"


# -- gaps at the triple point ------------------------------------------------------------------

GAPS = [  # (fluid, a pressure inside the gap [Pa]); the gaps are read from CoolProp here
    ("Nitrogen", 12521.0),
    ("Argon", 69000.0),
    ("Krypton", 1e5),
    ("CarbonMonoxide", 5e4),
]


@pytest.mark.parametrize("fluid,p", GAPS, ids=[g[0] for g in GAPS])
def test_an_isobar_through_the_gap_melts_on_the_triple_point_isotherm(fluid, p):
    sub = pp.substance(fluid)
    T_t, p_t = sub.triple
    p_m = CP.AbstractState("HEOS", fluid).melting_line(CP.iP, CP.iT, T_t)
    assert p_t < p < p_m  # the gap: the published line starts above the EOS triple point
    report = pp.Route(fluid, T=T_t - 0.5, p=p).isobar(T=T_t + 0.5 * (sub.critical[0] - T_t))
    melt = report.analyze().crossings[0]
    assert melt.kind == "melting" and melt.T == T_t
    assert "isotherm" in melt.flag and f"{p_m:.6g} Pa" in melt.flag
    assert melt.flag in report.analyze().legs[0].note


def test_co2_melting_curve_starts_below_the_triple_point_pressure():
    """CoolProp's CO2 melting line (Span & Wagner 1996, eq. 3.10, p_t = 0.51795 MPa) starts
    14 Pa below the EOS triple point: for 3 µK above T_t the solid meets the vapor along the
    vapor-pressure curve; liquid CO2 exists only above that."""
    sub = pp.substance("CO2")
    T_t, p_t = sub.triple
    assert CP.AbstractState("HEOS", "CarbonDioxide").melting_line(CP.iP, CP.iT, T_t) == 517950.0
    gap = sub.melting_gap()
    assert "vapor-pressure curve" in gap
    T = T_t + 1e-6
    assert sub.phase(T, sub.vapor.p_of_T(T) * (1 + 1e-9)) == "solid"
    assert sub.phase(T_t + 1e-4, sub.vapor.p_of_T(T_t + 1e-4) * (1 + 1e-9)) == "liquid"


# -- flags on unreliable curves ----------------------------------------------------------------


def test_a_crossing_of_a_flagged_curve_carries_the_flag_everywhere():
    """Krypton's sublimation curve (an unpublished fit whose triple point misses the EOS one by
    0.047 K) is flagged: the crossing record, the boundary shown in the table, the hazard and the
    legs table's note all carry the flag."""
    report = pp.Route("Krypton", T=100.0, p=1e3).isobar(T=80.0).analyze()
    (c,) = report.crossings
    assert c.kind == "deposition"
    assert "unreliable" in c.flag and "0.047 K" in c.flag
    assert c.boundary == "sublimation (unreliable)"
    assert any("unreliable" in h.reason for h in c.hazards)
    assert "unreliable" in report.legs[0].note
    text = format_report(report)
    assert "sublimation (unreliable)" in text and "0.047 K" in text
    assert "unreliable" in report.table()["boundary"].iloc[0]


@pytest.mark.parametrize("fluid", ["OrthoHydrogen", "Ethanol", "Isopentane"])
def test_coolprop_melting_lines_far_from_the_triple_point_are_flagged(fluid):
    sub = pp.substance(fluid)
    (b,) = sub.melting
    assert not b.reliable and "unreliable" in b.label and "K along the curve" in b.note


def test_no_crossing_on_a_flagged_curve_without_the_flag():
    for fluid in ("OrthoHydrogen", "Krypton", "Oxygen", "Hydrogen", "Ethanol"):
        sub = pp.substance(fluid)
        T_t, p_t = sub.triple
        route = pp.Route(sub, T=T_t + 0.2, p=p_t * 2).isotherm(p=min(sub.p_max, 3e8) * 0.9)
        route.isobar(T=T_t + 0.5)
        for c in route.analyze().crossings:
            b = next((b for b in sub.boundaries if b.label == c.boundary), None)
            if b is not None and not b.reliable:
                assert c.flag and "unreliable" in c.flag, c
