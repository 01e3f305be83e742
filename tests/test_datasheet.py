"""Substances built from vapor-pressure data, checked against outside sources.

Tier 2 (reference libraries): three fluids that CoolProp 8.0.0 also covers are built only from the
``chemicals`` package's (version 1.5.2) published tables, and their crossings are compared with
CoolProp's reference equations of state:

* toluene: Wagner 2.5-5 constants, ``chemicals.vapor_pressure.Psat_data_WagnerPoling`` (Poling,
  Prausnitz & O'Connell, The Properties of Gases and Liquids, 5th ed., 2001, Appendix A),
  with that table's own T_c and p_c; triple-point temperature ``chemicals.triple.Tt`` method
  "WEBBOOK" (NIST Chemistry WebBook).
* cyclohexane: Wagner 3-6 constants, ``Psat_data_WagnerMcGarry`` (McGarry, Ind. Eng. Chem.
  Process Des. Dev. 22, 313 (1983)), with that table's T_c and p_c; triple-point temperature
  "WEBBOOK"; Simon-Glatzel melting parameters a = 383.4 MPa, c = 1.41 of Penoncello, Goodwin &
  Jacobsen, Int. J. Thermophys. 16, 519 (1995) (as carried in CoolProp 8.0.0's fluid file).
* n-hexane: Antoine constants, ``Psat_data_AntoinePoling`` (Poling et al. 2001, Appendix A,
  converted by ``chemicals`` to log10(p/Pa) and K), range 254.24 K to 365.25 K; critical point
  ``chemicals.critical`` method "IUPAC" (Ambrose, Tsonopoulos et al., IUPAC critical-data
  series); triple-point temperature method "STAVELEY" (Staveley, Lobo & Calado, Cryogenics 21,
  131 (1981)).

Tolerances (why they are what they are):

* ``TOL_P_DATA`` = 0.3 % in pressure inside the data range, between 5 kPa and 0.9 p_c: the tabulated
  correlations reproduce their source measurements to about 0.1-0.2 %, and the reference equations
  of state carry vapor-pressure uncertainties of the same order (both from memory). A boiling
  temperature is compared through the same tolerance, converted by the reference curve's slope:
  dT = 0.003 / (d ln p / dT). Observed worst cases: 0.22 % (toluene), 0.14 % (cyclohexane),
  0.11 % (n-hexane).
* ``TOL_P_LOW`` = 2 % in the data range between 200 Pa and 5 kPa: measurements at such low pressures
  are few and scatter by a percent or two (from memory); observed worst case 1.4 % (toluene at
  0.23 kPa).
* ``TOL_P_BRIDGE`` = 2 % where the curve is a bridge from the end of the data to the critical
  point (n-hexane above 365 K): an interpolation with no data, as the report warns.
* ``TOL_T_MELT`` = 0.1 % of the melting temperature: the triple-point temperatures of the two
  sources differ by 0.23 K = 0.08 % (279.7 K WebBook, 279.47 K Penoncello 1995).

Tier 3 (known by construction): synthetic Clausius-Clapeyron points with known enthalpy.
"""

from __future__ import annotations

import math

import numpy as np
import pytest

import phasepath as pp
from phasepath.correlations import vapor_pressure as vp
from phasepath.datasheet import fit_antoine, fit_clausius_clapeyron
from phasepath.energetics import latent_heat
from phasepath.errors import OutOfRangeError, PhasePathError
from phasepath.models import ClausiusClapeyron
from phasepath.substances import NO_SUBLIMATION

chemicals = pytest.importorskip("chemicals")
cvp = pytest.importorskip("chemicals.vapor_pressure")
from chemicals import CAS_from_any  # noqa: E402
from chemicals.critical import Pc, Tc  # noqa: E402
from chemicals.triple import Tt  # noqa: E402

TOL_P_DATA = 0.003
TOL_P_LOW = 0.02
TOL_P_BRIDGE = 0.02
TOL_T_MELT = 0.001


def _row(table: str, name: str):  # one published row of a chemicals table
    return getattr(cvp, table).loc[CAS_from_any(name)]


def _toluene() -> pp.Substance:
    w = _row("Psat_data_WagnerPoling", "toluene")
    return pp.Substance.from_data(
        "toluene (Poling Wagner)",
        triple=(Tt(CAS_from_any("toluene"), method="WEBBOOK"), None),
        critical=(float(w.Tc), float(w.Pc)),
        wagner=dict(
            form="2.5-5",
            a=float(w.A),
            b=float(w.B),
            c=float(w.C),
            d=float(w.D),
            T_min=float(w.Tmin),
            T_max=float(w.Tmax),
        ),
        molar_mass="92.138 g/mol",  # C7H8 from IUPAC standard atomic weights (common practice)
        source="chemicals 1.5.2: Psat_data_WagnerPoling",
    )


def _cyclohexane() -> pp.Substance:
    w = _row("Psat_data_WagnerMcGarry", "cyclohexane")
    return pp.Substance.from_data(
        "cyclohexane (McGarry Wagner)",
        triple=(Tt(CAS_from_any("cyclohexane"), method="WEBBOOK"), None),
        critical=(float(w.Tc), float(w.Pc)),
        wagner=dict(
            form="3-6", a=float(w.A), b=float(w.B), c=float(w.C), d=float(w.D), T_min=float(w.Tmin)
        ),
        simon_glatzel=dict(a=383.4e6, c=1.41),  # Penoncello et al. 1995
        source="chemicals 1.5.2: Psat_data_WagnerMcGarry",
    )


def _hexane() -> pp.Substance:
    a = _row("Psat_data_AntoinePoling", "hexane")
    cas = CAS_from_any("hexane")
    return pp.Substance.from_data(
        "n-hexane (Poling Antoine)",
        triple=(Tt(cas, method="STAVELEY"), None),
        critical=(Tc(cas, method="IUPAC"), Pc(cas, method="IUPAC")),
        antoine=dict(
            A=float(a.A), B=float(a.B), C=float(a.C), T_min=float(a.Tmin), T_max=float(a.Tmax)
        ),
        source="chemicals 1.5.2: Psat_data_AntoinePoling",
    )


FLUIDS = {
    "toluene": (_toluene, "Toluene"),
    "cyclohexane": (_cyclohexane, "CycloHexane"),
    "n-hexane": (_hexane, "n-Hexane"),
}
_BUILT: dict[str, pp.Substance] = {}


def built(key: str) -> tuple[pp.Substance, pp.Substance]:
    if key not in _BUILT:
        _BUILT[key] = FLUIDS[key][0]()
    return _BUILT[key], pp.substance(FLUIDS[key][1])


def _dlnp_dT(ref: pp.Substance, T: float) -> float:
    h = 1e-3
    return math.log(ref.vapor.p_of_T(T + h) / ref.vapor.p_of_T(T - h)) / (2 * h)


def _boiling_on_isobar(sub: pp.Substance, p: float, T_guess: float) -> pp.Crossing:
    lo = max(T_guess - 15.0, sub.T_min)
    rep = pp.Route(sub, T=lo, p=p).isobar(T=T_guess + 15.0).analyze()
    (c,) = rep.crossings
    assert c.kind == "vaporization"
    return c


# -- tier 2: crossings against the reference equations of state ----------------------------------
@pytest.mark.parametrize("key", list(FLUIDS))
def test_boiling_temperatures_on_isobars_match_reference_eos(key: str) -> None:
    sub, ref = built(key)
    lo, hi = sub.vapor.T_valid
    checked = 0
    for T in np.linspace(lo, hi, 12)[1:-1]:
        p = sub.vapor.p_of_T(float(T))
        if not (200.0 <= p <= 0.9 * ref.critical[1]):
            continue
        tol = TOL_P_DATA if p >= 5e3 else TOL_P_LOW
        c = _boiling_on_isobar(sub, p, float(T))
        (T_ref,) = [r.root for r in ref.vapor.temperatures_at(p)]
        assert abs(ref.vapor.p_of_T(c.T) / p - 1.0) < tol, (key, p)
        assert abs(c.T - T_ref) < tol / _dlnp_dT(ref, T_ref), (key, p, c.T, T_ref)
        checked += p >= 5e3
    assert checked >= 5


@pytest.mark.parametrize("key", list(FLUIDS))
def test_normal_boiling_point_matches_reference_eos(key: str) -> None:
    sub, ref = built(key)
    (T_ref,) = [r.root for r in ref.vapor.temperatures_at(101325.0)]
    c = _boiling_on_isobar(sub, 101325.0, T_ref)
    assert abs(c.T - T_ref) < TOL_P_DATA / _dlnp_dT(ref, T_ref)


def test_condensation_pressure_on_isotherm_matches_reference_eos() -> None:
    sub, ref = built("toluene")
    for T in (320.0, 400.0, 480.0):
        rep = pp.Route(sub, T=T, p=100.0).isotherm(p=0.95 * sub.critical[1]).analyze()
        (c,) = rep.crossings
        assert c.kind == "condensation" and c.T == T
        assert abs(c.p / ref.vapor.p_of_T(T) - 1.0) < TOL_P_DATA


def test_bridge_to_critical_point_is_close_and_warned() -> None:
    sub, ref = built("n-hexane")
    lo, hi = sub.vapor.T_valid
    assert hi == pytest.approx(365.25) and sub.vapor.T_max == sub.critical[0]
    assert sub.vapor.p_of_T(sub.critical[0]) == pytest.approx(sub.critical[1], rel=1e-9)
    for T in (390.0, 430.0, 470.0, 500.0):
        p = sub.vapor.p_of_T(T)
        c = _boiling_on_isobar(sub, p, T)
        assert abs(ref.vapor.p_of_T(c.T) / p - 1.0) < TOL_P_BRIDGE
        rep = pp.Route(sub, T=T - 10.0, p=p).isobar(T=T + 10.0).analyze()
        warned = [n for n in rep.notes if n.startswith("Warning: leg 1 crosses the vapor pressure")]
        assert len(warned) == 1 and "outside the range of its data" in warned[0]
    inside = pp.Route(sub, T=320.0, p=101325.0).isobar(T=350.0).analyze()
    assert not [n for n in inside.notes if n.startswith("Warning")]


def test_melting_on_isobars_matches_reference_eos() -> None:
    sub, ref = built("cyclohexane")
    (melt,) = sub.melting
    assert melt.T_min == sub.triple[0] and melt.p_of_T(sub.triple[0]) == sub.triple[1]
    for p in (1e6, 1e7, 5e7, 1e8):
        (T_ref,) = [r.root for r in ref.melting[0].temperatures_at(p)]
        rep = pp.Route(sub, T=T_ref + 20.0, p=p).isobar(T=sub.triple[0] + 0.5).analyze()
        (c,) = rep.crossings
        assert c.kind == "freezing" and c.boundary == "melting"
        assert abs(c.T / T_ref - 1.0) < TOL_T_MELT, (p, c.T, T_ref)


def test_latent_heat_of_vaporization_is_approximate_and_close_at_low_pressure() -> None:
    sub, ref = built("toluene")
    for T in (300.0, 320.0):  # vapor pressure 4 kPa and 10 kPa: the gas is nearly ideal
        c = _boiling_on_isobar(sub, sub.vapor.p_of_T(T), T)
        assert c.latent_heat_model == ClausiusClapeyron.MODEL
        assert "approximate" in c.latent_heat_model
        L_ref = ref.fluid.latent_heat_vaporization(c.T)
        # ideal gas at p < 20 kPa: |1 - Z| of the vapor about 1 % (common practice)
        assert abs(c.latent_heat / L_ref - 1.0) < 0.015
    # at 1 atm the ideal-gas value runs high (Z of the vapor about 0.95): say so, don't hide it
    c = _boiling_on_isobar(sub, 101325.0, 383.0)
    assert 1.0 < c.latent_heat / ref.fluid.latent_heat_vaporization(c.T) < 1.08


# -- tier 3: synthetic data, known by construction -----------------------------------------------
def test_clausius_clapeyron_fit_recovers_enthalpy_exactly() -> None:
    dH = 38_000.0  # J/mol, synthetic
    pts = [(T, vp.clausius_clapeyron(T, 330.0, 5e4, dH)) for T in np.linspace(280, 380, 7)]
    fit = fit_clausius_clapeyron(pts)
    assert fit.enthalpy() == pytest.approx(dH, rel=1e-10)
    assert fit.rms < 1e-12 and fit.dof == 5


def test_clausius_clapeyron_fit_recovers_enthalpy_with_noise_and_uncertainty() -> None:
    dH = 38_000.0  # J/mol, synthetic
    rng = np.random.default_rng(20240508)
    hits = 0
    for _ in range(40):
        pts = [
            (T, vp.clausius_clapeyron(T, 330.0, 5e4, dH) * (1 + 0.005 * rng.standard_normal()))
            for T in np.linspace(280, 380, 8)
        ]
        fit = fit_clausius_clapeyron(pts)
        sd = fit.enthalpy_stderr
        assert 0.0 < sd < 1000.0  # 0.5 % noise over 100 K: a few hundred J/mol
        assert len(fit.residuals) == 8 and abs(fit.rms - 0.005) < 0.004
        hits += abs(fit.enthalpy() - dH) < 2 * sd
    assert hits >= 34  # about 95 % of 40 runs within 2 standard uncertainties


def test_antoine_fit_recovers_published_coefficients() -> None:
    a = _row("Psat_data_AntoinePoling", "hexane")  # Poling et al. 2001 via chemicals 1.5.2
    pts = [(T, vp.antoine(T, a.A, a.B, a.C)) for T in np.linspace(a.Tmin, a.Tmax, 6)]
    q = fit_antoine(pts).params
    assert q["A"] == pytest.approx(a.A, rel=1e-6)
    assert q["B"] == pytest.approx(a.B, rel=1e-6)
    assert q["C"] == pytest.approx(a.C, abs=1e-4)


def test_straight_line_misplaces_boiling_point_antoine_does_not() -> None:
    """Six vapor pressures of toluene (CoolProp 8.0.0 reference EOS) from 330 K to 430 K."""
    ref = pp.substance("Toluene")
    pts = [(T, ref.vapor.p_of_T(T)) for T in np.linspace(330.0, 430.0, 6)]
    (T_b,) = [r.root for r in ref.vapor.temperatures_at(101325.0)]
    line = pp.Substance.from_data(
        "line", critical=ref.critical, triple=(ref.triple[0], None), vapor_points=pts[::5]
    )  # two points: the straight line
    curve = pp.Substance.from_data(
        "curve", critical=ref.critical, triple=(ref.triple[0], None), vapor_points=pts
    )
    T_line = _boiling_on_isobar(line, 101325.0, 383.0).T
    T_curve = _boiling_on_isobar(curve, 101325.0, 383.0).T
    assert curve.source_data.fits["vapor"].form == "antoine"
    assert abs(T_curve - T_b) < 0.02
    assert abs(T_line - T_b) > 0.3
    # the least-squares line through all six points misses by about half a kelvin as well
    cc = curve.source_data.fits["clausius-clapeyron"]
    T_cc = vp.clausius_clapeyron_temperature(
        101325.0, cc.params["T_ref"], cc.params["p_ref"], cc.params["dH"]
    )
    assert 0.3 < abs(T_cc - T_b) < 1.0
    assert any("Clausius-Clapeyron fit of 6 vapor points" in n for n in curve.notes)


# -- what is missing is stated, not guessed ------------------------------------------------------
def _bare() -> pp.Substance:
    return pp.Substance.from_data(
        "bare",
        triple=(180.0, None),
        critical=(560.0, 4.5e6),
        vapor_points=[(300.0, 5e3), (350.0, 4e4)],
    )


def test_missing_pieces_are_stated_and_never_crossed() -> None:
    sub = _bare()
    assert sub.melting == () and sub.sublimation is None
    assert {"melting curve", "sublimation curve", "molar mass"} <= set(sub.source_data.missing)
    assert any("No melting curve given" in n for n in sub.notes)
    assert any(NO_SUBLIMATION in n for n in sub.notes)
    rep = pp.Route(sub, T=300.0, p=50e6).isobar(T=185.0).analyze()  # no freezing is invented
    assert rep.crossings == []
    with pytest.raises(OutOfRangeError, match="no published sublimation curve"):
        pp.Route(sub, T=170.0, p=1.0)
    c = pp.Route(sub, T=300.0, p=1e4).isobar(T=340.0).analyze().crossings[0]
    assert c.latent_heat is None and "no molar mass given" in c.latent_heat_note
    assert rep.legs[0].heat is None and "no equation of state" in rep.legs[0].note


def test_no_critical_point_ends_the_diagram_at_the_data() -> None:
    sub = pp.Substance.from_data("short", vapor_points=[(300.0, 5e3), (320.0, 1.2e4), (350.0, 4e4)])
    assert math.isnan(sub.critical[0]) and math.isnan(sub.triple[0])
    assert sub.T_min == 300.0 and sub.T_max == 350.0
    assert "critical point" in sub.source_data.missing
    with pytest.raises(OutOfRangeError):
        pp.Route(sub, T=360.0, p=1e5)


def test_sublimation_from_fusion_enthalpy() -> None:
    sub = pp.Substance.from_data(
        "solid-too",
        triple=(180.0, None),
        critical=(560.0, 4.5e6),
        vapor_points=[(300.0, 5e3), (350.0, 4e4)],
        enthalpy_fusion="9 kJ/mol",
        molar_mass="100 g/mol",
        melting_slope=3e6,
    )
    T_t, p_t = sub.triple
    dH_vap = sub.source_data.fits["clausius-clapeyron"].enthalpy()
    assert sub.source_data.enthalpy_sublimation == pytest.approx(9000.0 + dH_vap, rel=1e-6)
    assert sub.sublimation.p_of_T(T_t) == pytest.approx(p_t, rel=1e-12)
    rep = pp.Route(sub, T=170.0, p=p_t / 10).isotherm(p=p_t * 10).analyze()
    (c,) = rep.crossings
    assert c.kind == "deposition"
    assert c.latent_heat == pytest.approx((9000.0 + dH_vap) / 0.1, rel=1e-4)
    melt = pp.Route(sub, T=200.0, p=10e6).isobar(T=175.0).analyze().crossings[0]
    assert melt.kind == "freezing" and melt.T == pytest.approx(T_t + (10e6 - p_t) / 3e6)
    assert melt.latent_heat == pytest.approx(90_000.0) and "approximate" in melt.latent_heat_model


def test_melting_point_and_slope_place_the_triple_point() -> None:
    sub = pp.Substance.from_data(
        "no-triple",
        critical=(560.0, 4.5e6),
        vapor_points=[(300.0, 5e3), (350.0, 4e4)],
        melting_point=250.0,
        melting_slope=2.5e6,
    )
    T_t, p_t = sub.triple
    assert T_t == pytest.approx(250.0 - (101325.0 - p_t) / 2.5e6, abs=1e-9)
    assert sub.melting[0].p_of_T(250.0) == pytest.approx(101325.0)


# -- files --------------------------------------------------------------------------------------
def test_round_trip_through_plain_data() -> None:
    sub, _ = built("cyclohexane")
    d = sub.to_dict()
    assert d["name"] == sub.name and d["wagner"]["form"] == "3-6"
    import json

    again = pp.Substance.from_dict(json.loads(json.dumps(d)))
    assert again is pp.Substance.from_dict(d)  # identical mappings give one object
    route = pp.Route(d, T=300.0, p=101325.0).isobar(T=400.0)
    assert route.analyze().crossings[0].T == pytest.approx(
        pp.Route(sub, T=300.0, p=101325.0).isobar(T=400.0).analyze().crossings[0].T, rel=1e-12
    )
    assert pp.substance("CO2").to_dict() == {"name": "CarbonDioxide"}


def test_public_surface_from_the_issue() -> None:
    sub = pp.Substance.from_data(
        "my-solvent",
        triple=(180.0, 1.0),
        critical=(560.0, 4.5e6),
        vapor_points=[(280.0, 2.0e3), (320.0, 1.3e4), (360.0, 5.3e4), (400.0, 1.6e5)],
    )
    route = pp.Route(sub, T=300.0, p=101325.0)
    assert route.substance is sub
    assert sub.vapor.p_of_T(180.0) == pytest.approx(1.0, rel=1e-9)  # bridged to the triple point


# -- bad input names the value and the way out --------------------------------------------------
@pytest.mark.parametrize(
    "kwargs, match",
    [
        (dict(antoine=dict(A=9.0, B=1300.0, C=-55.0, T_min=280.0)), "'T_max' is missing"),
        (dict(vapor_points=[(300.0, 1e4)]), "enthalpy_vaporization"),
        (dict(vapor_points=[(300.0, 1e4), (300.0, 2e4)]), "share the temperature 300 K"),
        (dict(vapor_points=[(300.0, -1.0), (320.0, 2e4)]), "not a positive pressure"),
        (dict(), "a vapor-pressure curve is needed"),
        (dict(wagner=dict(form="3-5", a=-7, b=1, c=-2, d=-3, T_min=200)), "form = '3-5'"),
        (
            dict(
                vapor_points=[(300.0, 1e4), (350.0, 5e4)],
                enthalpy_fusion="9 kJ/kg",
                triple=(180.0, None),
            ),
            "unknown unit 'kJ/kg'",
        ),
    ],
)
def test_bad_input_raises_phasepath_error(kwargs: dict, match: str) -> None:
    with pytest.raises(PhasePathError, match=match):
        pp.Substance.from_data("bad", critical=(560.0, 4.5e6), **kwargs)


def test_unknown_key_in_a_saved_substance() -> None:
    with pytest.raises(PhasePathError, match="unknown key"):
        pp.Substance.from_dict({"name": "x", "vapour_points": [[300, 1e4], [350, 5e4]]})


def test_latent_heat_helper_refuses_what_it_cannot_know() -> None:
    sub = _bare()
    L = latent_heat(sub, "melting", 200.0, 1e6, ("solid", None), ("liquid", None))
    assert L.value is None and L.model is None and L.note == "no enthalpy of fusion given"


def test_route_file_embeds_a_substance_built_from_data(tmp_path) -> None:
    io = pytest.importorskip("phasepath.routefile")
    sub, _ = built("toluene")
    route = pp.Route(sub, T=300.0, p=101325.0, title="embedded").isobar(T=420.0)
    for fmt in ("json", "yaml"):
        text = io.dumps_route(route, fmt)
        again = io.loads_route(text, fmt)
        assert again.substance.to_dict() == sub.to_dict()
        assert again.analyze().crossings[0].T == pytest.approx(
            route.analyze().crossings[0].T, rel=1e-12
        )
    bad = io.dumps_route(route, "json").replace('"form": "2.5-5"', '"form": "2-5"')
    with pytest.raises(pp.RouteFileError, match="substance"):
        io.loads_route(bad, "json")


def test_picked_by_name_after_reference_names() -> None:
    sub = pp.Substance.from_data(
        "Kestrel test solvent", critical=(560.0, 4.5e6), vapor_points=[(300.0, 5e3), (350.0, 4e4)]
    )
    assert pp.substance("Kestrel test solvent") is sub
    assert pp.Route("Kestrel test solvent", T=320.0, p=1e5).substance is sub
    shadow = pp.Substance.from_data(
        "toluene", critical=(560.0, 4.5e6), vapor_points=[(300.0, 5e3), (350.0, 4e4)]
    )
    assert pp.substance("toluene") is not shadow  # a reference name keeps its substance
