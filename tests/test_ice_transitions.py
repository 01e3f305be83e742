"""Ice-ice transitions: crossings of kind solid-transition, one function naming the ice form, and
the high-pressure ices' properties from the optional seafreeze extra.

Check values and where they come from:

* the solid-solid lines of Dunaeva, Antsyshkin & Kuskov, Solar System Research 44, 202 (2010),
  Table 2, through the triple points (phasepath.correlations.water_ice_phases, checked against
  the paper's end points and against seafreeze in tests/test_ice_phases.py);
* the melting pressures of IAPWS R14-08(2011) through the independent ``iapws`` package;
* the most stable phase of seafreeze (Journaux et al. 2020, J. Geophys. Res. Planets 125,
  e2019JE006176), an independent Gibbs-energy representation, read at the states either side
  of each transition;
* at a transition the Gibbs energies of the two ices are equal, so the enthalpy of transition is
  T times the entropy of transition (Gibbs-Helmholtz; a law, no table), with seafreeze's entropies.

Caution: these pressures (0.2 to 1 GPa) are far beyond ordinary pressure equipment; local codes
and licensed practice govern such work.
"""

from __future__ import annotations

import logging
import warnings

import numpy as np
import pytest

import phasepath as pp
from phasepath.correlations import seafreeze_ices, water_ice_phases
from phasepath.records import CROSSING_KINDS

MPa = 1e6
iapws = pytest.importorskip("iapws")
from iapws._iapws import _Melting_Pressure  # noqa: E402


@pytest.fixture(scope="module")
def sf():
    mod = pytest.importorskip("seafreeze")
    logging.getLogger("lbftd").setLevel(logging.CRITICAL)
    return mod


SF_NAMES = {1: "Ih", 2: "II", 3: "III", 5: "V", 6: "VI"}


def _sf_phase(sf, T: float, p: float) -> str:
    PT = np.empty((1,), dtype=object)
    PT[0] = (p / MPa, T)
    with warnings.catch_warnings():
        warnings.simplefilter("ignore")
        return SF_NAMES.get(int(np.ravel(sf.whichphase(PT))[0]), "other")


def test_solid_transition_is_a_crossing_kind():
    assert "solid-transition" in CROSSING_KINDS


def test_water_pressed_to_500_MPa_at_minus_20_C_both_tables_name_ice_v():
    """The issue's case: at -20 °C, ice Ih melts, the liquid freezes to ice III, and ice III turns
    to ice V on the III-V line; the crossings table and the legs table both say ice V."""
    T = 253.15
    report = pp.Route("water", T=T, p=1e5).isotherm(p=500 * MPa).analyze()
    kinds = [(c.kind, c.from_form, c.to_form) for c in report.crossings]
    assert kinds == [
        ("melting", "Ih", None),
        ("freezing", None, "III"),
        ("solid-transition", "III", "V"),
    ]
    melt, freeze, trans = report.crossings
    assert melt.p == pytest.approx(_Melting_Pressure(T, ice="Ih") * MPa, rel=1e-9)
    assert freeze.p == pytest.approx(_Melting_Pressure(T, ice="III") * MPa, rel=1e-9)
    assert trans.p == pytest.approx(water_ice_phases.boundary("III", "V").pressure(T), rel=1e-9)
    assert trans.boundary == "ice III-ice V" and trans.from_phase == trans.to_phase == "solid"
    assert report.legs[0].end.form == "V" and report.legs[0].end.text == "solid (ice V)"
    table = report.table()
    assert table["to"].iloc[-1] == "solid (ice V)"
    assert report.legs_table()["phase end"].iloc[0] == "solid (ice V)"


TRANSITIONS = [  # (leg, expected (from, to) forms of the solid transitions)
    (("isotherm", 220.0, 100 * MPa, 400 * MPa), [("Ih", "II")]),
    (("isotherm", 240.0, 100 * MPa, 300 * MPa), [("Ih", "III"), ("III", "II")]),
    (("isotherm", 225.0, 250 * MPa, 800 * MPa), [("II", "V"), ("V", "VI")]),
    (("isobar", 300 * MPa, 230.0, 250.0), [("II", "III")]),
    (("isobar", 620 * MPa, 205.0, 250.0), [("VI", "V")]),
]


@pytest.mark.parametrize("leg,expected", TRANSITIONS, ids=[str(t[0]) for t in TRANSITIONS])
def test_transitions_lie_on_the_dunaeva_lines_and_match_seafreeze_either_side(sf, leg, expected):
    kind, fixed, a, b = leg
    if kind == "isotherm":
        route = pp.Route("water", T=fixed, p=a).isotherm(p=b)
    else:
        route = pp.Route("water", T=a, p=fixed).isobar(T=b)
    report = route.analyze()
    found = [c for c in report.crossings if c.kind == "solid-transition"]
    assert [(c.from_form, c.to_form) for c in found] == expected
    # seafreeze's most stable phase agrees between the crossings (its lines differ from
    # Dunaeva's by up to tens of MPa near II-VI and V-VI): read at the middle of the stretch
    # before each transition and of the stretch after it (the leg's end for the last one)
    xs = [a] + [c.p if kind == "isotherm" else c.T for c in report.crossings] + [b]
    for c in found:
        line = water_ice_phases.boundary(c.from_form, c.to_form)
        assert c.p == pytest.approx(line.pressure(c.T), rel=1e-9)
        k = xs.index(c.p if kind == "isotherm" else c.T)
        before = 0.5 * (xs[k - 1] + xs[k])
        after = xs[k + 1] if k + 1 == len(xs) - 1 else 0.5 * (xs[k] + xs[k + 1])
        if {c.from_form, c.to_form} == {"V", "VI"} and kind == "isobar":
            continue  # seafreeze's V-VI line lies 20-40 MPa above Dunaeva's below 270 K
        for x, form in ((before, c.from_form), (after, c.to_form)):
            state = (fixed, x) if kind == "isotherm" else (x, fixed)
            assert _sf_phase(sf, *state) == form, (c, state)


def test_reversed_route_reverses_the_solid_transitions():
    route = pp.Route("water", T=240.0, p=100 * MPa).isotherm(p=300 * MPa)
    fwd = [(c.kind, c.from_form, c.to_form) for c in route.analyze().crossings]
    back = [(c.kind, c.from_form, c.to_form) for c in route.reversed().analyze().crossings]
    assert back == [(k, b, a) for k, a, b in reversed(fwd)]


def test_latent_heat_of_a_transition_from_seafreeze_is_T_delta_s(sf):
    report = pp.Route("water", T=253.15, p=1e5).isotherm(p=500 * MPa).analyze()
    trans = report.crossings[-1]
    a = seafreeze_ices.seafreeze_state("III", trans.T, trans.p)
    b = seafreeze_ices.seafreeze_state("V", trans.T, trans.p)
    assert trans.latent_heat == pytest.approx(abs(b.h - a.h), rel=1e-12)
    assert "Journaux" in trans.latent_heat_model
    # Gibbs-Helmholtz at equilibrium: dh = T ds; the Dunaeva line sits within a few MPa of
    # seafreeze's own III-V line here, where g_V - g_III is small against h_V - h_III
    assert trans.latent_heat == pytest.approx(abs(trans.T * (b.s - a.s)), rel=0.05)
    # the legs table has heat and work across the high-pressure ices now
    assert report.legs[0].heat is not None and report.legs[0].work is not None


def test_without_seafreeze_the_reason_says_install_the_extra(monkeypatch):
    def missing():
        raise seafreeze_ices.MissingExtraError("seafreeze", "ices")

    from phasepath import analysis

    monkeypatch.setattr(seafreeze_ices, "_seafreeze", missing)
    seafreeze_ices._evaluate.cache_clear()
    analysis.cache_clear()
    try:
        report = pp.Route("water", T=253.15, p=1e5).isotherm(p=500 * MPa).analyze()
    finally:
        seafreeze_ices._evaluate.cache_clear()
        analysis.cache_clear()
    trans = report.crossings[-1]
    assert trans.latent_heat is None and "install phasepath[ices]" in trans.latent_heat_note
    assert report.legs[0].heat is None and "phasepath[ices]" in report.legs[0].note


@pytest.mark.parametrize(
    "T,p,form",
    [
        (253.15, 500 * MPa, "V"),  # the state
        (253.0, 300 * MPa, "III"),
        (220.0, 300 * MPa, "II"),
        (260.0, 800 * MPa, "VI"),
        (263.15, 101325.0, "Ih"),
        (150.0, 101325.0, "Ih"),  # below 200 K: ice Ih up to 208.566 MPa
    ],
)
def test_one_function_names_the_ice(T, p, form):
    water = pp.substance("water")
    assert water.classify(T, p) == ("solid", form)
    assert water.solids.form_at(T, p) == form
