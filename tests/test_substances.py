"""Substances: names, aliases, suggestions, special points, limits and phase regions.

Region cases are states chosen well inside one region (at least a factor 1.3 in pressure or
several kelvin from every boundary), so the expected phase follows from published fixed points
named beside each case, not from phasepath's own curves.
"""

from __future__ import annotations

import math

import numpy as np
import pytest

import phasepath as pp
from phasepath.errors import NonFiniteError, OutOfRangeError, PhasePathError, UnknownSubstanceError
from phasepath.substances import NO_SUBLIMATION, PHASES

# -- names ---------------------------------------------------------------------------------------
ALIASES = [
    ("CarbonDioxide", ["CO2", "co2", "carbon dioxide", "Carbon Dioxide", "CARBONDIOXIDE"]),
    ("Water", ["water", "WATER", "H2O", "h2o", "steam"]),
    ("Nitrogen", ["N2", "n2", "nitrogen", "NITROGEN"]),
    ("Argon", ["Ar", "argon", "ARGON"]),
    ("Methane", ["CH4", "methane", "Methane"]),
    ("Ammonia", ["NH3", "ammonia", "Ammonia"]),
]


@pytest.mark.parametrize("name,aliases", ALIASES, ids=[a[0] for a in ALIASES])
def test_aliases_and_case_resolve_to_one_substance(name, aliases):
    """Common names and formulas, any case, give the same cached Substance (common practice)."""
    sub = pp.substance(name)
    assert sub.name == name
    for alias in aliases:
        assert pp.substance(alias) is sub, alias


def test_substance_passes_through_a_substance():
    sub = pp.substance("CO2")
    assert pp.substance(sub) is sub


def test_substances_lists_coolprop_names():
    names = pp.substances()
    assert len(names) > 100
    assert {"Water", "CarbonDioxide", "Nitrogen", "Argon", "Methane", "Ammonia"} <= set(names)
    assert names == sorted(names)
    # every listed name resolves to itself
    for n in ("Water", "n-Propane", "R134a"):
        assert pp.substance(n).name == n


@pytest.mark.parametrize(
    "typed,expected",
    [
        ("nitrogn", "Nitrogen"),
        ("carbondioxid", "CarbonDioxide"),
        ("watr", "Water"),
        ("methan", "Methane"),
    ],
)
def test_unknown_name_suggests_close_names(typed, expected):
    with pytest.raises(UnknownSubstanceError) as info:
        pp.substance(typed)
    err = info.value
    assert isinstance(err, ValueError) and isinstance(err, PhasePathError)
    assert expected in err.suggestions
    assert typed in str(err) and expected in str(err)


@pytest.mark.parametrize("bad", ["", "   ", None, 42, "unobtainium"])
def test_unknown_or_empty_name_is_a_phasepath_error(bad):
    with pytest.raises(UnknownSubstanceError) as info:
        pp.substance(bad)
    assert repr(bad) in str(info.value)


# -- special points and limits ------------------------------------------------------------------
@pytest.mark.parametrize("name", ["water", "CO2", "N2", "Ar", "CH4", "ammonia"])
def test_special_points_and_limits_are_consistent(name):
    sub = pp.substance(name)
    (T_t, p_t), (T_c, p_c) = sub.triple, sub.critical
    assert 0 < T_t < T_c < sub.T_max
    assert 0 < p_t < p_c < sub.p_max
    assert sub.T_min <= T_t
    assert sub.vapor.T_min == T_t and sub.vapor.T_max == T_c
    assert sub.vapor.p_of_T(T_t) == pytest.approx(p_t, rel=1e-9)
    assert sub.vapor.p_of_T(T_c) == pytest.approx(p_c, rel=1e-6)
    kinds = {b.kind for b in sub.boundaries}
    assert kinds <= {"vaporization", "melting", "sublimation"}
    for b in sub.boundaries:
        assert b.T_min < b.T_max and b.source


# Melting curves at the triple point, as published (changed on purpose from the old junction rule,
# which shifted every line onto the EOS triple point): R14-08 gives 611.657 Pa at 273.16 K (its
# Table 1); CoolProp 8.0.0's own lines are read through its low-level melting_line call.
MELTING_AT_TRIPLE = [("water", 611.657, "IAPWS R14-08, Table 1")] + [
    (name, None, "CoolProp 8.0.0 melting_line") for name in ("CO2", "N2", "Ar", "CH4")
]


@pytest.mark.parametrize(
    "name,p_pub,source", MELTING_AT_TRIPLE, ids=[m[0] for m in MELTING_AT_TRIPLE]
)
def test_melting_curve_at_the_triple_point_is_the_published_curve(name, p_pub, source):
    """Junction rule (documented in phasepath.reference): a melting curve is used as published
    where the shift onto the EOS triple point would exceed the crossing tolerance, and the gap is
    described by Substance.melting_gap()."""
    import CoolProp.CoolProp as CP

    sub = pp.substance(name)
    T_t, p_t = sub.triple
    at_triple = [b for b in sub.melting if b.T_min <= T_t <= b.T_max]
    assert at_triple, f"no melting branch of {sub.name} covers T_t = {T_t} K"
    if p_pub is None:
        p_pub = CP.AbstractState("HEOS", sub.name).melting_line(CP.iP, CP.iT, T_t)
    assert any(b.p_of_T(T_t) == pytest.approx(p_pub, rel=1e-12) for b in at_triple), source
    assert abs(p_pub - p_t) > 1e-9 * p_t  # too far to shift within the crossing tolerance
    assert f"{p_t:.6g} Pa" in sub.melting_gap()


def test_out_of_range_states_name_value_substance_and_range():
    sub = pp.substance("CO2")
    with pytest.raises(OutOfRangeError) as info:
        sub.check_state(2500.0, 1e5)
    msg = str(info.value)
    assert "2500.0" in msg and "CarbonDioxide" in msg and "2000" in msg
    with pytest.raises(OutOfRangeError) as info:
        sub.check_state(300.0, 9e8)
    msg = str(info.value)
    assert "900000000.0" in msg and "CarbonDioxide" in msg and "8e+08" in msg
    for T, p in ((0.0, 1e5), (-5.0, 1e5), (300.0, 0.0), (300.0, -1.0)):
        with pytest.raises(OutOfRangeError):
            sub.check_state(T, p)


@pytest.mark.parametrize("T,p", [(math.nan, 1e5), (300.0, math.inf), (-math.inf, 1e5)])
def test_non_finite_states_are_refused(T, p):
    with pytest.raises(NonFiniteError):
        pp.substance("water").phase(T, p)


# -- regions --------------------------------------------------------------------------------------
# (substance, T [K], p [Pa], phase, form, why)
REGIONS = [
    # water: IAPWS-95 (Tc 647.096 K, pc 22.064 MPa, normal boiling point 373.124 K) and
    # IAPWS R14-08 (melting and sublimation pressures)
    ("water", 298.15, 101325.0, "liquid", None, "below the normal boiling point 373.124 K"),
    ("water", 400.0, 101325.0, "vapor", None, "above the normal boiling point"),
    ("water", 700.0, 30e6, "supercritical", None, "T > Tc and p > pc"),
    ("water", 700.0, 10e6, "vapor", None, "T > Tc, p < pc: vapor by the issue's rule"),
    ("water", 600.0, 30e6, "liquid", None, "T < Tc, p > pc: liquid by the issue's rule"),
    ("water", 260.0, 101325.0, "solid", "Ih", "R14-08: p_sub(260 K) 196 Pa, p_melt 138 MPa"),
    ("water", 260.0, 100.0, "vapor", None, "R14-08: below p_sub(260 K) = 196 Pa"),
    ("water", 200.0, 1.0, "solid", "Ih", "R14-08: p_sub(200 K) = 0.16 Pa"),
    ("water", 253.0, 220e6, "liquid", None, "R14-08: between ice Ih (194.8 MPa) and III (242.8)"),
    ("water", 253.0, 300e6, "solid", "III", "R14-08: above ice III melting (242.8 MPa)"),
    ("water", 265.0, 600e6, "solid", "V", "R14-08: above ice V melting (479.6 MPa)"),
    ("water", 290.0, 950e6, "solid", "VI", "R14-08: above ice VI melting at 290 K (846 MPa)"),
    ("water", 290.0, 500e6, "liquid", None, "R14-08: below ice VI melting at 290 K"),
    # CO2: Span & Wagner 1996 (Tt 216.592 K, Tc 304.1282 K, pc 7.3773 MPa; vapor pressure
    # 1.785 MPa at 250 K; melting pressure 182 MPa at 250 K from their eq. 3.10)
    ("CO2", 250.0, 30e5, "liquid", None, "above p_sat(250 K) = 1.785 MPa"),
    ("CO2", 250.0, 101325.0, "vapor", None, "below p_sat(250 K)"),
    ("CO2", 350.0, 10e6, "supercritical", None, "T > Tc, p > pc"),
    ("CO2", 350.0, 5e6, "vapor", None, "T > Tc, p < pc"),
    ("CO2", 290.0, 10e6, "liquid", None, "T < Tc, p > pc"),
    ("CO2", 250.0, 300e6, "solid", None, "above the melting pressure at 250 K (182 MPa)"),
    # nitrogen: Span et al. 2000 (Tt 63.151 K, normal boiling point 77.355 K, Tc 126.192 K,
    # pc 3.3958 MPa); melting pressure at 70 K about 32 MPa (their melting equation, from memory)
    ("N2", 70.0, 101325.0, "liquid", None, "below the normal boiling point 77.355 K"),
    ("N2", 100.0, 101325.0, "vapor", None, "above the normal boiling point"),
    ("N2", 300.0, 10e6, "supercritical", None, "T > Tc, p > pc"),
    ("N2", 300.0, 1e6, "vapor", None, "T > Tc, p < pc"),
    ("N2", 100.0, 10e6, "liquid", None, "T < Tc, p > pc"),
    ("N2", 70.0, 100e6, "solid", None, "above the melting pressure at 70 K (~32 MPa)"),
    # argon: Tegeler et al. 1999 (Tt 83.8058 K, normal boiling point 87.302 K, Tc 150.687 K,
    # pc 4.863 MPa); melting pressure at 90 K about 25 MPa (their melting equation, from memory)
    ("Ar", 85.0, 101325.0, "liquid", None, "below the normal boiling point 87.302 K"),
    ("Ar", 120.0, 101325.0, "vapor", None, "above the normal boiling point"),
    ("Ar", 200.0, 10e6, "supercritical", None, "T > Tc, p > pc"),
    ("Ar", 200.0, 2e6, "vapor", None, "T > Tc, p < pc"),
    ("Ar", 120.0, 10e6, "liquid", None, "T < Tc, p > pc"),
    ("Ar", 90.0, 100e6, "solid", None, "above the melting pressure at 90 K (~25 MPa)"),
    # methane: Setzmann & Wagner 1991 (Tt 90.6941 K, normal boiling point 111.667 K, Tc
    # 190.564 K, pc 4.5992 MPa); melting pressure at 100 K about 38 MPa (from memory)
    ("CH4", 100.0, 101325.0, "liquid", None, "below the normal boiling point 111.667 K"),
    ("CH4", 150.0, 101325.0, "vapor", None, "above the normal boiling point"),
    ("CH4", 250.0, 10e6, "supercritical", None, "T > Tc, p > pc"),
    ("CH4", 250.0, 2e6, "vapor", None, "T > Tc, p < pc"),
    ("CH4", 150.0, 10e6, "liquid", None, "T < Tc, p > pc"),
    ("CH4", 100.0, 100e6, "solid", None, "above the melting pressure at 100 K (~38 MPa)"),
    # ammonia: Tillner-Roth et al. 1993 EOS in CoolProp (Tt 195.495 K, Tc 405.56 K, pc 11.363 MPa,
    # normal boiling point 239.8 K; from memory). Melting curve of Gao et al. (2023): 372 MPa at
    # 250 K (their equation, phasepath's implementation checked in test_published_curves).
    ("ammonia", 300.0, 101325.0, "vapor", None, "above the normal boiling point 239.8 K"),
    ("ammonia", 300.0, 2e6, "liquid", None, "above p_sat(300 K) = 1.06 MPa"),
    ("ammonia", 450.0, 20e6, "supercritical", None, "T > Tc, p > pc"),
    ("ammonia", 450.0, 5e6, "vapor", None, "T > Tc, p < pc"),
    ("ammonia", 350.0, 15e6, "liquid", None, "T < Tc, p > pc"),
    ("ammonia", 250.0, 500e6, "solid", None, "above the Gao 2023 melting curve (372 MPa)"),
    ("ammonia", 250.0, 300e6, "liquid", None, "below the Gao 2023 melting curve (372 MPa)"),
    # R-134a: no melting curve: fluid at any pressure above the triple-point temperature
    ("R134a", 250.0, 50e6, "liquid", None, "no melting curve: freezing is not detected"),
]


@pytest.mark.parametrize(
    "name,T,p,phase,form,why", REGIONS, ids=[f"{r[0]}-{r[1]}K-{r[2]:.4g}Pa" for r in REGIONS]
)
def test_phase_in_every_region(name, T, p, phase, form, why):
    sub = pp.substance(name)
    assert sub.phase(T, p) == phase, why
    assert sub.classify(T, p) == (phase, form), why


# Below the triple point: solid or vapor, once a published sublimation curve is in.
# (substance, T [K], p [Pa], phase, why)
BELOW_TRIPLE = [
    (
        "CO2",
        194.0,
        101325.0,
        "solid",
        "below the normal sublimation point 194.686 K (Span & Wagner 1996)",
    ),
    ("CO2", 200.0, 101325.0, "vapor", "above the normal sublimation point"),
    ("N2", 60.0, 101325.0, "solid", "below the triple point 63.151 K, above p_sub (~7 kPa)"),
    ("N2", 60.0, 1000.0, "vapor", "below p_sub(60 K) of about 7 kPa (from memory)"),
    ("Ar", 80.0, 101325.0, "solid", "below the triple point 83.806 K, above p_sub (~41 kPa)"),
    ("Ar", 80.0, 5000.0, "vapor", "below p_sub(80 K) of about 41 kPa (from memory)"),
    ("CH4", 85.0, 101325.0, "solid", "below the triple point 90.694 K, above p_sub (~5 kPa)"),
    ("CH4", 85.0, 500.0, "vapor", "below p_sub(85 K) of about 5 kPa (from memory)"),
]


@pytest.mark.parametrize(
    "name,T,p,phase,why", BELOW_TRIPLE, ids=[f"{r[0]}-{r[1]}K-{r[2]:.4g}Pa" for r in BELOW_TRIPLE]
)
def test_phase_below_the_triple_point(name, T, p, phase, why):
    sub = pp.substance(name)
    assert sub.sublimation is not None, f"{sub.name} lost its published sublimation curve"
    assert sub.phase(T, p) == phase, why


def test_below_triple_point_without_sublimation_is_refused_with_the_reason():
    r134a = pp.substance("R134a")
    assert r134a.melting == () and r134a.sublimation is None
    T_t = r134a.triple[0]
    with pytest.raises(OutOfRangeError) as info:
        r134a.phase(T_t - 5.0, 101325.0)
    assert NO_SUBLIMATION in str(info.value) and str(T_t - 5.0) in str(info.value)
    assert any("melting" in n for n in r134a.notes)


def test_below_triple_point_without_melting_is_refused_above_the_triple_pressure():
    """Hydrogen sulfide has a sublimation curve but no melting curve: below its triple-point
    temperature the state is solid or vapor under the triple-point pressure, and refused above
    it (solid or liquid: no published melting curve)."""
    from phasepath.substances import NO_MELTING

    h2s = pp.substance("H2S")
    (T_t, p_t) = h2s.triple
    assert h2s.melting == () and h2s.sublimation is not None
    assert h2s.phase(T_t - 5.0, 0.9 * h2s.sublimation.p_of_T(T_t - 5.0)) == "vapor"
    assert h2s.phase(T_t - 5.0, 0.5 * (h2s.sublimation.p_of_T(T_t - 5.0) + p_t)) == "solid"
    with pytest.raises(OutOfRangeError) as info:
        h2s.phase(T_t - 5.0, 2.0 * p_t)
    assert NO_MELTING in str(info.value)
    assert any(NO_MELTING in n for n in h2s.notes)


@pytest.mark.parametrize("name", ["water", "CO2", "N2", "Ar", "CH4", "ammonia"])
def test_phase_is_always_one_of_four(name):
    """Over a log grid of the whole valid range, phase() returns one of the four names or raises
    a phasepath error, never anything else."""
    sub = pp.substance(name)
    for T in np.geomspace(sub.T_min, min(sub.T_max, 3 * sub.critical[0]), 15):
        for p in np.geomspace(1.0, sub.p_max, 15):
            try:
                ph = sub.phase(float(T), float(p))
            except PhasePathError:
                continue
            assert ph in PHASES


@pytest.mark.parametrize("name", ["water", "CO2", "N2", "Ar", "CH4"])
def test_supercritical_quadrant_rule(name):
    """Just across the critical point in each direction (the issue's region rules)."""
    sub = pp.substance(name)
    T_c, p_c = sub.critical
    assert sub.phase(T_c * 1.01, p_c * 1.01) == "supercritical"
    assert sub.phase(T_c * 1.01, p_c * 0.99) == "vapor"
    assert sub.phase(T_c * 0.99, p_c * 1.01) == "liquid"
    assert sub.phase(T_c * 0.99, sub.vapor.p_of_T(T_c * 0.99) * 0.99) == "vapor"
