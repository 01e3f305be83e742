"""Sealed vessels, valves and compressors: constant-v, -h and -s legs, event-ended legs, hazard
flags, the heat-and-work bases and site elevation.

Check values and where they come from:

* published: the IAPWS-95 normal boiling point of water, 373.124 K (IAPWS R6-95, Wagner & Pruß
  2002); the normal sublimation temperature of CO2, 194.686 K (Span & Wagner 1996, J. Phys. Chem.
  Ref. Data 25, 1509, their table of characteristic points); U.S. Standard Atmosphere 1976, Table I
  pressures (from memory); the Carnot efficiency 1 - T_cold/T_hot (a law, no table).
* independent reference libraries: ``iapws`` (an independent Python implementation of IAPWS-95,
  IAPWS R10-06 and R14-08) for water; CoolProp's high-level ``PropsSI`` call for other fluids. The
  core reaches CoolProp only through its low-level ``AbstractState`` with an imposed phase and its
  own flash and lever-rule code, so ``PropsSI`` (CoolProp's own phase detection, flash and quality)
  is a separate code path over the same reference equation; agreement checks phasepath's
  flashes, mixtures and bookkeeping, not the equation of state itself.
* common practice: the fill density at which a CO2 cylinder turns liquid-full near room
  temperature (about 0.75 kg/L near 22 °C); water boils about 1 K lower per 300 m of elevation.
* from memory: the latent heat of sublimation of ice near its triple point (about 2834 kJ/kg) and
  of dry ice at 1 atm (about 571 kJ/kg).

Values produced by phasepath itself appear only as regression pins and are labelled so.

Caution: these scenarios involve high pressure, cryogens, dry ice and steam. The routes are check
cases, not operating procedures; local codes and licensed practice govern real equipment.
"""

from __future__ import annotations

import warnings

import numpy as np
import pytest
from hypothesis import HealthCheck, given, settings
from hypothesis import strategies as st
from scipy.optimize import brentq

import phasepath as pp
import phasepath.states
from phasepath.analysis import analyze
from phasepath.correlations import co2 as co2_model
from phasepath.correlations.atmosphere import ambient_pressure
from phasepath.errors import NonFiniteError, OutOfRangeError, RouteError, UnitError

CP = pytest.importorskip("CoolProp.CoolProp")
iapws = pytest.importorskip("iapws")
from iapws import IAPWS95  # noqa: E402
from iapws._iapws import _Ice, _Sublimation_Pressure  # noqa: E402

PropsSI = CP.PropsSI
ATM = 101325.0
MPa = 1e6
DEFER = "local codes"  # every caution defers to local codes and licensed practice


def _iapws(**kw: float) -> IAPWS95:
    """iapws.IAPWS95 with its own extrapolation warnings silenced (vapor below 273.16 K)."""
    with warnings.catch_warnings():
        warnings.simplefilter("ignore")
        return IAPWS95(**kw)


def _ice(T: float, p: float) -> dict:
    with warnings.catch_warnings():
        warnings.simplefilter("ignore")
        return _Ice(T, p / MPa)


def _co2_vapor_density(T: float, p: float) -> float:
    """Gas density [kg/m3] of CO2 at (T, p) from PropsSI on DmassT inputs (works below the
    triple point, where PropsSI refuses (T, p) inputs)."""
    rho_ideal = p * 0.0440098 / (8.314462618 * T)
    return brentq(
        lambda d: PropsSI("P", "T", T, "Dmass", d, "CO2") - p,
        0.5 * rho_ideal,
        2.0 * rho_ideal,
        xtol=1e-14,
        rtol=1e-14,
    )


# =================================================================================================
# The public surface of issue 5
# =================================================================================================


def test_start_from_fill_density_is_a_lever_rule_mixture():
    """Route(T=288.15 K, density=750) lies inside the dome: vapor mass fraction by the lever rule
    on specific volume, with saturated densities from PropsSI (independent code path)."""
    route = pp.Route("CO2", T=288.15, density=750.0)
    s = route.start.state
    rho_l = PropsSI("Dmass", "T", 288.15, "Q", 0, "CO2")
    rho_v = PropsSI("Dmass", "T", 288.15, "Q", 1, "CO2")
    x = (1 / 750.0 - 1 / rho_l) / (1 / rho_v - 1 / rho_l)
    assert s.phase == "liquid+vapor"
    assert s.vapor_fraction == pytest.approx(x, rel=1e-8)
    assert s.solid_fraction is None
    assert route.start.p == pytest.approx(PropsSI("P", "T", 288.15, "Q", 0, "CO2"), rel=1e-9)
    # mixture enthalpy from PropsSI's own quality input
    assert s.h == pytest.approx(PropsSI("Hmass", "T", 288.15, "Q", x, "CO2"), rel=1e-9)


def test_public_chain_runs_and_reports_every_leg():
    """The issue's example chain: isochore, isenthalp, isentrope. End states are checked against
    PropsSI flashes (independent code path), fractions are None where single phase."""
    route = (
        pp.Route("CO2", T=288.15, density=750.0)
        .isochore(T=323.15)
        .isenthalp(p=1e5)
        .isentrope(p=80e5)
    )
    report = route.analyze()
    assert [leg.kind for leg in report.legs] == ["isochore", "isenthalp", "isentrope"]
    l1, l2, l3 = report.legs
    # leg 1: sealed cylinder warmed to 50 °C: single-phase dense fluid at density 750
    assert l1.end.phase == "supercritical"
    assert l1.end.vapor_fraction is None and l1.end.solid_fraction is None
    assert l1.end.p == pytest.approx(PropsSI("P", "T", 323.15, "Dmass", 750.0, "CO2"), rel=1e-9)
    # leg 2: let down to 1 bar: dry-ice snow and vapor at the sublimation temperature
    assert l2.end.phase == "solid+vapor"
    assert l2.end.vapor_fraction + l2.end.solid_fraction == pytest.approx(1.0, abs=1e-12)
    assert 0.0 < l2.end.solid_fraction < 1.0
    # leg 3: ideal compression back to 80 bar: single phase, T from PropsSI's (p, s) flash
    assert l3.end.T == pytest.approx(PropsSI("T", "P", 80e5, "Smass", l2.end.s, "CO2"), rel=1e-7)
    assert l3.work == pytest.approx(l3.end.h - l2.end.h, rel=1e-12)
    assert l3.heat == 0.0


# =================================================================================================
# Sealed vessel (constant volume)
# =================================================================================================


def test_co2_cylinder_turns_liquid_full_near_22_degC_at_0_75_kg_per_L():
    """Common practice: a CO2 cylinder filled to about 0.75 kg/L turns liquid-full near 22 °C.
    The crossing also matches the EOS saturated-liquid density (PropsSI, Q = 0) to 1e-6 K."""
    report = pp.Route("CO2", T="15 degC", density="0.75 kg/L").isochore(T="50 degC").analyze()
    full = [
        c for c in report.crossings if c.from_phase == "liquid+vapor" and c.to_phase == "liquid"
    ]
    assert len(full) == 1
    c = full[0]
    assert c.T == pytest.approx(295.15, abs=1.5)  # common practice: near 22 °C
    T_ref = brentq(
        lambda T: PropsSI("Dmass", "T", T, "Q", 0, "CO2") - 750.0, 280.0, 304.0, xtol=1e-12
    )
    assert c.T == pytest.approx(T_ref, abs=1e-6)
    assert c.p == pytest.approx(PropsSI("P", "T", T_ref, "Q", 0, "CO2"), rel=1e-7)
    hz = {h.kind: h for h in report.legs[0].hazards}
    assert "liquid-full" in hz and "sealed-pressure" in hz
    # the maximum pressure reached is the end pressure of this warming leg (PropsSI at 50 °C)
    p_end = PropsSI("P", "T", 323.15, "Dmass", 750.0, "CO2")
    assert f"{p_end:.5g}" in hz["sealed-pressure"].reason
    assert f"{c.p:.5g}" in hz["liquid-full"].reason


def test_underfilled_cylinder_goes_vapor_full_without_liquid_full_flag():
    """Below the critical density (467.6 kg/m3, Span & Wagner 1996) the liquid evaporates on
    warming: the dome is left on the vapor side (a dew point), and no liquid-full flag."""
    report = pp.Route("CO2", T=288.15, density=300.0).isochore(T=323.15).analyze()
    kinds = [(c.from_phase, c.to_phase) for c in report.crossings]
    assert kinds[0] == ("liquid+vapor", "vapor")
    T_ref = brentq(
        lambda T: PropsSI("Dmass", "T", T, "Q", 1, "CO2") - 300.0, 280.0, 304.0, xtol=1e-12
    )
    assert report.crossings[0].T == pytest.approx(T_ref, abs=1e-6)
    assert "liquid-full" not in {h.kind for h in report.legs[0].hazards}


def test_isochore_to_pressure_lands_on_the_asked_pressure():
    """isochore(p=...) solves for the temperature: the end state has the asked pressure and the
    start density (PropsSI on DmassT, independent code path)."""
    route = pp.Route("CO2", T=288.15, density=750.0).isochore(p="100 bar")
    end = route.end_state()
    assert end.p == pytest.approx(100e5, rel=1e-9)
    assert PropsSI("P", "T", end.T, "Dmass", 750.0, "CO2") == pytest.approx(100e5, rel=1e-8)


def test_cooling_sealed_liquid_reaches_solid_and_vapor():
    """A liquid-filled vessel cooled below the triple point ends as solid + vapor: the solid mass
    fraction follows the lever rule on volume with the vapor density from PropsSI (DmassT) and
    the solid density of Jäger & Span (2012)."""
    report = pp.Route("CO2", T=250.0, density=1100.0).isochore(T=200.0).analyze()
    end = report.legs[0].end
    assert end.phase == "solid+vapor"
    p_sub = pp.substance("CO2").sublimation.p_of_T(200.0)
    v_v = 1 / _co2_vapor_density(200.0, p_sub)
    v_s = co2_model.solid_volume_co2(200.0, p_sub)
    y = (v_v - 1 / 1100.0) / (v_v - v_s)
    assert end.solid_fraction == pytest.approx(y, rel=1e-7)
    assert [c.kind for c in report.crossings] == ["vaporization", "deposition"]
    # a closed vessel is not a flowing line: no solid-formation flag on it
    assert all(not c.hazards for c in report.crossings)


# =================================================================================================
# Valve (constant enthalpy)
# =================================================================================================


def test_liquid_co2_let_down_to_1_atm_deposits_dry_ice_snow():
    """Liquid CO2 (20 °C, 60 bar) throttled to 1 atm: deposition at the triple point, ending as
    solid + vapor at the sublimation temperature. (Changed on purpose: the melting curve is
    used as published, 14 Pa below the EOS triple point, so the liquid freezes 3.08 µK above
    T_t, where that curve meets the vapor pressure: ``Substance.liquid_from``.)

    * sublimation temperature: Span & Wagner (1996), 194.686 K at 0.101325 MPa; 2 mK covers the
      curve being evaluated in reduced variables about the EOS triple point;
    * solid fraction: an independent lever rule, h_vapor from PropsSI on DmassT inputs at the
      sublimation temperature and 1 atm, h_solid from Jäger & Span (2012) (phasepath's
      implementation, checked against their Table 5 in test_correlations), h_start from PropsSI.
    """
    report = pp.Route("CO2", T=293.15, p=60e5).isenthalp(p=ATM).analyze()
    assert [c.kind for c in report.crossings] == ["vaporization", "deposition"]
    dep = report.crossings[1]
    T_t, p_t = pp.substance("CO2").triple
    assert (dep.T, dep.p) == (pytest.approx(T_t, rel=2e-8), pytest.approx(p_t, rel=1e-6))
    assert dep.T == pytest.approx(pp.substance("CO2").liquid_from, rel=1e-12)
    assert [h.kind for h in dep.hazards] == ["solid-formation"]
    assert DEFER in dep.hazards[0].caution and "dry ice" in dep.hazards[0].reason
    end = report.legs[0].end
    assert end.phase == "solid+vapor"
    assert end.T == pytest.approx(194.686, abs=2e-3)
    h0 = PropsSI("Hmass", "T", 293.15, "P", 60e5, "CO2")
    h_v = PropsSI("Hmass", "T", end.T, "Dmass", _co2_vapor_density(end.T, ATM), "CO2")
    h_s = co2_model.solid_enthalpy_co2(end.T, ATM)
    y = (h_v - h0) / (h_v - h_s)
    assert end.solid_fraction == pytest.approx(y, rel=1e-7)
    assert end.vapor_fraction == pytest.approx(1 - y, rel=1e-7)
    assert end.h == pytest.approx(h0, rel=1e-9)  # a valve keeps h
    # shown in both tables
    assert "solid-formation" in report.table()["hazards"].tolist()
    row = report.legs_table().iloc[0]
    assert row["phase end"] == "solid+vapor" and row["solid fraction end"] == pytest.approx(
        y, rel=1e-7
    )


def test_dry_ice_latent_heat_of_sublimation_at_1_atm():
    """An isobar at 1 atm through the CO2 sublimation curve: about 571 kJ/kg (from memory;
    handbook value for dry ice at -78.5 °C), 1 %; and h_vapor - h_solid from PropsSI and
    Jäger & Span at the crossing, 1e-8."""
    report = pp.Route("CO2", T=180.0, p=ATM).isobar(T=250.0).analyze()
    (c,) = report.crossings
    assert c.kind == "sublimation"
    assert c.latent_heat == pytest.approx(571e3, rel=0.01)
    h_v = PropsSI("Hmass", "T", c.T, "Dmass", _co2_vapor_density(c.T, ATM), "CO2")
    assert c.latent_heat == pytest.approx(h_v - co2_model.solid_enthalpy_co2(c.T, ATM), rel=1e-8)


@pytest.mark.parametrize(
    "fluid,T,p0,p1",
    [
        ("Nitrogen", 300.0, 200e5, 1e5),
        ("Nitrogen", 150.0, 100e5, 5e5),
        ("Argon", 300.0, 150e5, 1e5),
        ("CO2", 320.0, 80e5, 10e5),
    ],
    ids=["N2-300K", "N2-150K", "Ar-300K", "CO2-320K"],
)
def test_joule_thomson_cooling_vs_propssi(fluid, T, p0, p1):
    """Throttled gas cools (Joule-Thomson). End temperature from PropsSI's own (h, p) flash
    (independent code path); 1e-7 relative, above the two flash tolerances."""
    report = pp.Route(fluid, T=T, p=p0).isenthalp(p=p1).analyze()
    end = report.legs[0].end
    h0 = PropsSI("Hmass", "T", T, "P", p0, fluid)
    T_ref = PropsSI("T", "P", p1, "Hmass", h0, fluid)
    assert end.T == pytest.approx(T_ref, rel=1e-7)
    assert end.T < T
    assert report.legs[0].heat == 0.0 and report.legs[0].work == 0.0


def test_joule_thomson_coefficient_of_nitrogen():
    """A 2-bar throttle of nitrogen at 300 K and 50 bar: ΔT/Δp equals PropsSI's
    d(T)/d(P)|Hmass at the mid pressure within 1 % (the curvature over 2 bar)."""
    end = pp.Route("N2", T=300.0, p=51e5).isenthalp(p=49e5).end_state()
    mu = PropsSI("d(T)/d(P)|Hmass", "T", 300.0, "P", 50e5, "Nitrogen")
    assert (end.T - 300.0) / (49e5 - 51e5) == pytest.approx(mu, rel=0.01)


def test_throttled_steam_vs_iapws():
    """Superheated steam 500 K, 10 bar throttled to 1 bar: T from iapws.IAPWS95(P, h), 1e-7.
    Wet steam (a two-phase start) throttled to 1 bar: quality from iapws, 1e-7."""
    end = pp.Route("water", T=500.0, p=10e5).isenthalp(p=1e5).end_state()
    h0 = _iapws(T=500.0, P=1.0).h
    assert end.T == pytest.approx(_iapws(P=0.1, h=h0).T, rel=1e-7)
    route = pp.Route("water", T=453.0, density=20.0).isenthalp(p=1e5)
    start, end = route.start.state, route.end_state()
    assert end.phase == "liquid+vapor"
    ref = _iapws(P=0.1, h=start.h / 1e3)
    assert end.vapor_fraction == pytest.approx(ref.x, rel=1e-7)
    assert end.T == pytest.approx(ref.T, rel=1e-8)


# =================================================================================================
# Ideal compressor or expander (constant entropy)
# =================================================================================================


def test_isentropic_steam_compression_work_vs_iapws():
    """Steam 400 K, 1 bar compressed isentropically to 10 bar: work = Δh with the end state from
    iapws.IAPWS95(P, s); 1e-6 relative."""
    leg = pp.Route("water", T=400.0, p=1e5).isentrope(p=10e5).analyze().legs[0]
    a = _iapws(T=400.0, P=0.1)
    b = _iapws(P=1.0, s=a.s)
    assert leg.end.T == pytest.approx(b.T, rel=1e-7)
    assert leg.work == pytest.approx((b.h - a.h) * 1e3, rel=1e-6)
    assert leg.heat == 0.0


@pytest.mark.parametrize(
    "fluid,T,p0,p1",
    [
        ("CO2", 260.0, 10e5, 60e5),
        ("Nitrogen", 80.0, 2e5, 30e5),
        ("Nitrogen", 300.0, 1e5, 8e5),
    ],
    ids=["CO2", "N2-cold", "N2-air-like"],
)
def test_isentropic_compression_vs_propssi(fluid, T, p0, p1):
    """Isentropic compression of a gas: end T and work from PropsSI's (p, s) flash, 1e-6."""
    leg = pp.Route(fluid, T=T, p=p0).isentrope(p=p1).analyze().legs[0]
    s0 = PropsSI("Smass", "T", T, "P", p0, fluid)
    h0 = PropsSI("Hmass", "T", T, "P", p0, fluid)
    assert leg.end.T == pytest.approx(PropsSI("T", "P", p1, "Smass", s0, fluid), rel=1e-7)
    assert leg.work == pytest.approx(PropsSI("Hmass", "P", p1, "Smass", s0, fluid) - h0, rel=1e-6)


def test_isentropic_expansion_of_saturated_vapor_gives_wet_steam():
    """Dry saturated steam at 10 bar expanded isentropically to 1 bar condenses partly: quality
    from iapws.IAPWS95(P, s), 1e-7."""
    T_s = _iapws(P=1.0, x=1).T
    route = pp.Route("water", T=T_s + 1e-6, p=10e5).isentrope(p=1e5)
    end = route.end_state()
    s0 = _iapws(P=1.0, x=1).s  # 1 µK of superheat changes s by about 1e-9 relative
    ref = _iapws(P=0.1, s=s0)
    assert end.phase == "liquid+vapor"
    assert end.vapor_fraction == pytest.approx(ref.x, rel=1e-6)


# =================================================================================================
# Water on the freeze-drying side (ice Ih sublimation)
# =================================================================================================


def test_freeze_drying_isobar_sublimes_ice_at_20_Pa():
    """Ice warmed at 20 Pa sublimes. Crossing T: the R14-08 sublimation pressure of iapws gives
    20 Pa back within 1e-5 (the curve is reduced about the EOS triple point, 0.002 Pa away).
    Latent heat: iapws IAPWS-95 vapor minus iapws R10-06 ice, 1e-9; and about 2834 kJ/kg near
    the triple point, rising a little as T falls (from memory), 0.5 %."""
    report = pp.Route("water", T=230.0, p=20.0).isobar(T=260.0).analyze()
    (c,) = report.crossings
    assert c.kind == "sublimation" and c.from_form == "Ih"
    assert _Sublimation_Pressure(c.T) * MPa == pytest.approx(20.0, rel=1e-5)
    ref = (_iapws(T=c.T, P=c.p / MPa).h - _ice(c.T, c.p)["h"]) * 1e3
    assert c.latent_heat == pytest.approx(ref, rel=1e-9)
    assert c.latent_heat == pytest.approx(2834e3, rel=0.005)
    assert not c.hazards  # ice sublimes away here: nothing forms a solid
    # heat of the leg: from iapws end to end (ice at 230 K, vapor at 260 K)
    q_ref = (_iapws(T=260.0, P=20.0 / MPa).h - _ice(230.0, 20.0)["h"]) * 1e3
    assert report.legs[0].heat == pytest.approx(q_ref, rel=1e-8)


# =================================================================================================
# Legs that end on an event
# =================================================================================================


def test_heat_until_fully_vapor_at_1_atm_ends_at_normal_boiling_point():
    """IAPWS-95 normal boiling point 373.124 K (IAPWS R6-95; Wagner & Pruß 2002), 0.5 mK; the end
    state is saturated vapor and the heat is h''(373.124 K) - h(300 K) from iapws."""
    report = pp.Route("water", T=300.0, p=ATM).isobar(until="fully vapor").analyze()
    leg = report.legs[0]
    assert leg.end.T == pytest.approx(373.124, abs=5e-4)
    assert leg.end.phase == "vapor"
    assert "fully vapor" in leg.event
    assert [c.kind for c in report.crossings] == ["vaporization"]
    q_ref = (_iapws(P=ATM / MPa, x=1).h - _iapws(T=300.0, P=ATM / MPa).h) * 1e3
    assert leg.heat == pytest.approx(q_ref, rel=1e-7)


def test_heat_until_5_K_superheat():
    """5 K above the IAPWS-95 normal boiling point: 378.124 K; heat from iapws, 1e-7."""
    report = pp.Route("water", T=300.0, p=ATM).isobar(until="5 K superheat").analyze()
    leg = report.legs[0]
    assert leg.end.T == pytest.approx(378.124, abs=5e-4)
    assert leg.end.phase == "vapor"
    q_ref = (_iapws(T=leg.end.T, P=ATM / MPa).h - _iapws(T=300.0, P=ATM / MPa).h) * 1e3
    assert leg.heat == pytest.approx(q_ref, rel=1e-7)


def test_subcooling_and_first_liquid_events():
    """Cool steam at 1 atm until first liquid (saturated vapor, no crossing) and until 3 K
    subcooling (liquid at 370.124 K): published normal boiling point 373.124 K."""
    r1 = pp.Route("water", T=400.0, p=ATM).isobar(until="first liquid").analyze()
    assert r1.legs[0].end.T == pytest.approx(373.124, abs=5e-4)
    assert r1.legs[0].end.phase == "vapor" and not r1.crossings
    r2 = pp.Route("water", T=400.0, p=ATM).isobar(until="3 K subcooling").analyze()
    assert r2.legs[0].end.T == pytest.approx(370.124, abs=5e-4)
    assert [c.kind for c in r2.crossings] == ["condensation"]


def test_compress_until_liquid_and_cool_until_first_solid():
    """CO2 vapor compressed at 250 K until fully liquid: ends at the EOS vapor pressure
    (PropsSI, Q = 0) as liquid. Liquid CO2 cooled at 20 bar until first solid: ends on the
    melting curve of Span & Wagner (1996) eq. (3.10) (phasepath's implementation, checked
    against their table in test_correlations). phasepath anchors that curve at the EOS triple
    point, 14 Pa above the published 0.51795 MPa, hence 20 Pa. The melting curve is steep: near
    the triple point dp/dT is several MPa/K (from memory), so 20 bar melts under 1 K above
    216.592 K (Span & Wagner 1996)."""
    r = pp.Route("CO2", T=250.0, p=5e5).isotherm(until="fully liquid").analyze()
    assert r.legs[0].end.p == pytest.approx(PropsSI("P", "T", 250.0, "Q", 0, "CO2"), rel=1e-9)
    assert r.legs[0].end.phase == "liquid"
    assert [c.kind for c in r.crossings] == ["condensation"]
    r = pp.Route("CO2", T=250.0, p=20e5).isobar(until="first solid").analyze()
    T1 = r.legs[0].end.T
    assert co2_model.melting_pressure_co2(T1) == pytest.approx(20e5, abs=20.0)
    assert 0.0 < T1 - 216.592 < 1.0
    assert r.legs[0].end.phase == "liquid" and not r.crossings


@pytest.mark.parametrize(
    "until,next_leg,T_next",
    [
        ("fully vapor", "isochore", 450.0),
        ("fully vapor", "isentrope", None),
    ],
    ids=["then-sealed", "then-compressed"],
)
def test_event_corner_then_curved_leg_adds_no_phantom_crossing(until, next_leg, T_next):
    """Water boiled at 1 bar until fully vapor, then sealed and heated (or compressed): the
    corner is saturated vapor, so the only crossing is the boiling on leg 1, and both legs have
    their heat: leg 1 from iapws (h'' at 1 bar minus h at 300 K), 1e-7."""
    route = pp.Route("water", T=300.0, p=1e5).isobar(until=until)
    route = route.isochore(T=T_next) if next_leg == "isochore" else route.isentrope(p=5e5)
    report = route.analyze()
    assert [(c.step, c.kind) for c in report.crossings] == [(1, "vaporization")]
    assert all(leg.heat is not None and leg.work is not None for leg in report.legs)
    q_ref = (_iapws(P=0.1, x=1).h - _iapws(T=300.0, P=0.1).h) * 1e3
    assert report.legs[0].heat == pytest.approx(q_ref, rel=1e-7)
    assert report.legs[1].start.phase == report.legs[0].end.phase == "vapor"


def test_condense_until_fully_liquid_then_seal_keeps_the_latent_heat():
    """CO2 vapor cooled at 20 bar until fully liquid, then sealed and warmed: leg 1's heat is
    h'(20 bar) - h(280 K, 20 bar) from PropsSI (latent heat included), 1e-7; the sealed leg
    starts liquid-full and does not re-cross the boundary."""
    report = (
        pp.Route("CO2", T=280.0, p=20e5).isobar(until="fully liquid").isochore(T=260.0).analyze()
    )
    assert [(c.step, c.kind) for c in report.crossings] == [(1, "condensation")]
    q_ref = PropsSI("Hmass", "P", 20e5, "Q", 0, "CO2") - PropsSI(
        "Hmass", "T", 280.0, "P", 20e5, "CO2"
    )
    assert report.legs[0].heat == pytest.approx(q_ref, rel=1e-7)
    assert report.legs[1].start.phase == "liquid"
    assert report.legs[1].end.p == pytest.approx(
        PropsSI("P", "T", 260.0, "Dmass", report.legs[1].start.rho, "CO2"), rel=1e-8
    )


def test_curved_leg_after_first_solid_starts_on_the_arrival_side():
    """Liquid CO2 cooled at 20 bar until first solid, then compressed isentropically: the corner
    is liquid (the side the leg arrives from), so the compression starts from the liquid's
    entropy (PropsSI at the corner, 1e-9) instead of the solid's."""
    route = pp.Route("CO2", T=250.0, p=20e5).isobar(until="first solid").isentrope(p=40e5)
    report = route.analyze()
    T1 = report.legs[0].end.T
    assert report.legs[1].start.phase == "liquid"
    s_liq = PropsSI("Smass", "T", T1, "P", 20e5, "CO2")
    assert report.legs[1].start.s == pytest.approx(s_liq, rel=1e-9)
    assert report.legs[0].heat is not None and report.legs[1].work is not None


def test_throttled_saturated_co2_vapor_partly_condenses():
    """Saturated CO2 vapor at 20 bar (253.6 K) throttled to 5 bar: h'' of CO2 peaks near 248 K,
    so the vapor first condenses a little, then dries out again (PropsSI h'' along the way). The
    quality just below 20 bar matches PropsSI's (p, h) flash, 1e-6."""
    report = (
        pp.Route("CO2", T=280.0, p=20e5).isobar(until="first liquid").isenthalp(p=5e5).analyze()
    )
    kinds = [(c.step, c.from_phase, c.to_phase) for c in report.crossings]
    assert kinds == [(2, "vapor", "liquid+vapor"), (2, "liquid+vapor", "vapor")]
    h0 = report.legs[1].start.h
    assert h0 == pytest.approx(PropsSI("Hmass", "P", 20e5, "Q", 1, "CO2"), rel=1e-9)
    out = report.crossings[1]  # dries out where h''(T) = h0 again, on the low side of the peak
    assert PropsSI("Hmass", "T", out.T, "Q", 1, "CO2") == pytest.approx(h0, rel=1e-9)
    mid = pp.states.flash_p(pp.substance("CO2"), 18e5, "h", h0)
    assert mid.vapor_fraction == pytest.approx(
        PropsSI("Q", "P", 18e5, "Hmass", h0, "CO2"), rel=1e-6
    )


# =================================================================================================
# Heat and work: energy balance, bases, splitting legs
# =================================================================================================


def _carnot_route() -> tuple[pp.Route, float, float]:
    """Nitrogen gas round a Carnot cycle, 600 K / 300 K; the corner pressures from PropsSI."""
    T_hot, T_cold, pA, pB = 600.0, 300.0, 20e5, 10e5
    sA = PropsSI("Smass", "T", T_hot, "P", pA, "Nitrogen")
    sB = PropsSI("Smass", "T", T_hot, "P", pB, "Nitrogen")
    pC = PropsSI("P", "T", T_cold, "Smass", sB, "Nitrogen")
    pD = PropsSI("P", "T", T_cold, "Smass", sA, "Nitrogen")
    route = (
        pp.Route("N2", T=T_hot, p=pA).isotherm(p=pB).isentrope(p=pC).isotherm(p=pD).isentrope(p=pA)
    )
    return route, T_hot, T_cold


@pytest.mark.parametrize("basis", ["steady-flow", "closed"])
def test_carnot_cycle_closes_and_has_carnot_efficiency(basis):
    """Round a closed cycle, net heat = -net work (first law), and net work over heat in equals
    1 - T_cold/T_hot (Carnot), on both bases; 1e-6 of the heat in (the cycle closes to the
    precision of the flashes)."""
    route, T_hot, T_cold = _carnot_route()
    report = analyze(route, basis=basis)
    assert report.legs[-1].end.T == pytest.approx(T_hot, rel=1e-8)
    q = [leg.heat for leg in report.legs]
    w = [leg.work for leg in report.legs]
    q_in = sum(x for x in q if x > 0)
    assert sum(q) + sum(w) == pytest.approx(0.0, abs=1e-6 * q_in)
    assert -sum(w) / q_in == pytest.approx(1 - T_cold / T_hot, rel=1e-6)
    assert all(leg.basis == basis for leg in report.legs)


@pytest.mark.parametrize("basis", ["steady-flow", "closed"])
def test_steam_cycle_through_phase_changes_closes(basis):
    """Water heated and boiled at 1 bar, compressed isentropically to 10 bar, cooled and condensed
    at 10 bar, and brought back isothermally to 1 bar: net heat = -net work; each steady-flow
    duty from iapws (IAPWS-95), 1e-6."""
    route = (
        pp.Route("water", T=300.0, p=1e5)
        .isobar(T=400.0)
        .isentrope(p=10e5)
        .isobar(T=300.0)
        .isotherm(p=1e5)
    )
    report = analyze(route, basis=basis)
    q = [leg.heat for leg in report.legs]
    w = [leg.work for leg in report.legs]
    assert sum(q) + sum(w) == pytest.approx(0.0, abs=1e-6 * max(q))
    if basis == "steady-flow":
        a = _iapws(T=300.0, P=0.1)
        b = _iapws(T=400.0, P=0.1)
        c = _iapws(P=1.0, s=b.s)
        d = _iapws(T=300.0, P=1.0)
        ref_q = [b.h - a.h, 0.0, d.h - c.h, 300.0 * (a.s - d.s)]
        ref_w = [0.0, c.h - b.h, 0.0, (a.h - d.h) - 300.0 * (a.s - d.s)]
        assert q == pytest.approx([x * 1e3 for x in ref_q], rel=1e-6, abs=1e-3)
        assert w[:3] == pytest.approx([x * 1e3 for x in ref_w[:3]], rel=1e-6, abs=1e-3)
        # the isothermal liquid leg's work is a small difference: absolute 0.5 J/kg
        assert w[3] == pytest.approx(ref_w[3] * 1e3, abs=0.5)


def test_closed_basis_isochore_and_throttle():
    """Closed vessel: an isochore does no work and its heat is Δu (PropsSI Umass); a throttle has
    no closed-vessel form (None with the reason)."""
    route = pp.Route("CO2", T=288.15, density=750.0).isochore(T=300.0)
    leg = analyze(route, basis="closed").legs[0]
    x0 = route.start.state.vapor_fraction
    u0 = PropsSI("Umass", "T", 288.15, "Q", x0, "CO2")
    u1 = PropsSI("Umass", "T", 300.0, "Dmass", 750.0, "CO2")
    assert leg.work == 0.0
    assert leg.heat == pytest.approx(u1 - u0, rel=1e-7)
    # steady flow through the same states: w = v Δp, q = Δh - v Δp = Δu
    sf = route.analyze().legs[0]
    assert sf.work == pytest.approx((leg.end.p - leg.start.p) / 750.0, rel=1e-9)
    assert sf.heat == pytest.approx(leg.heat, rel=1e-9)
    valve = analyze(pp.Route("CO2", T=293.15, p=60e5).isenthalp(p=10e5), basis="closed").legs[0]
    assert valve.heat is None and valve.work is None and "flow process" in valve.note


def _same_crossings(a: list, b: list) -> None:
    assert [(c.kind, c.from_phase, c.to_phase, c.from_form, c.to_form) for c in a] == [
        (c.kind, c.from_phase, c.to_phase, c.from_form, c.to_form) for c in b
    ]
    for x, y in zip(a, b, strict=True):
        assert x.T == pytest.approx(y.T, rel=1e-9)
        assert x.p == pytest.approx(y.p, rel=1e-8)
        if x.latent_heat is not None:
            assert x.latent_heat == pytest.approx(y.latent_heat, rel=1e-8)


def _totals(report: pp.Report) -> tuple[float, float]:
    return sum(leg.heat for leg in report.legs), sum(leg.work for leg in report.legs)


@pytest.mark.parametrize(
    "whole,split",
    [
        (
            lambda: pp.Route("CO2", T=293.15, p=60e5).isenthalp(p=ATM),
            lambda: pp.Route("CO2", T=293.15, p=60e5).isenthalp(p=10e5).isenthalp(p=ATM),
        ),
        (
            lambda: pp.Route("CO2", T=288.15, density=750.0).isochore(T=323.15),
            lambda: pp.Route("CO2", T=288.15, density=750.0).isochore(T=300.0).isochore(T=323.15),
        ),
        (
            lambda: pp.Route("CO2", T=194.0, density=50.0).isochore(T=280.0),
            lambda: pp.Route("CO2", T=194.0, density=50.0).isochore(T=210.0).isochore(T=280.0),
        ),
        (
            lambda: pp.Route("water", T=250.0, p=1e5).isentrope(p=10.0),
            lambda: pp.Route("water", T=250.0, p=1e5).isentrope(p=1e3).isentrope(p=10.0),
        ),
        (
            lambda: pp.Route("CO2", T=200.0, p=1e5).isentrope(p=80e5),
            lambda: pp.Route("CO2", T=200.0, p=1e5).isentrope(p=20e5).isentrope(p=80e5),
        ),
    ],
    ids=[
        "isenthalp-co2-snow",
        "isochore-liquid-full",
        "isochore-from-solid+vapor",
        "isentrope-ice",
        "isentrope-co2-vapor",
    ],
)
@pytest.mark.parametrize("basis", ["steady-flow", "closed"])
def test_splitting_a_leg_leaves_crossings_and_duties_unchanged(whole, split, basis):
    """A leg cut in two at a point off every boundary gives the same crossings (1e-9 in T) and the
    same total heat and work (1e-7 of the larger, or 1 mJ/kg); by construction. A throttle has
    no closed-vessel heat and work: there both sides must say so."""
    r1, r2 = whole(), split()
    if basis == "closed" and r1.legs[0].kind == "isenthalp":
        legs = analyze(r1, basis=basis).legs + analyze(r2, basis=basis).legs
        assert all(leg.heat is None and leg.work is None for leg in legs)
        return
    a, b = analyze(r1, basis=basis), analyze(r2, basis=basis)
    _same_crossings(a.crossings, b.crossings)
    qa, wa = _totals(a)
    qb, wb = _totals(b)
    scale = max(abs(qa), abs(wa), 1.0)
    assert qb == pytest.approx(qa, abs=max(1e-7 * scale, 1e-3))
    assert wb == pytest.approx(wa, abs=max(1e-7 * scale, 1e-3))
    assert b.legs[-1].end.T == pytest.approx(a.legs[-1].end.T, rel=1e-9)
    assert b.legs[-1].end.phase == a.legs[-1].end.phase


@settings(max_examples=8, deadline=None, suppress_health_check=[HealthCheck.too_slow])
@given(p_mid=st.floats(min_value=1.2e5, max_value=59e5))
def test_splitting_a_valve_anywhere_leaves_the_outcome_unchanged(p_mid):
    """Property: a let-down split at any intermediate pressure gives the same crossings and the
    same end state (solid fraction to 1e-8)."""
    T_t, p_t = pp.substance("CO2").triple
    if abs(p_mid / p_t - 1) < 1e-3:
        return  # a split exactly on the triple point adds a corner; not this property
    whole = pp.Route("CO2", T=293.15, p=60e5).isenthalp(p=ATM).analyze()
    split = pp.Route("CO2", T=293.15, p=60e5).isenthalp(p=p_mid).isenthalp(p=ATM).analyze()
    _same_crossings(whole.crossings, split.crossings)
    assert split.legs[-1].end.solid_fraction == pytest.approx(
        whole.legs[-1].end.solid_fraction, rel=1e-8
    )


# =================================================================================================
# Site elevation (U.S. Standard Atmosphere 1976)
# =================================================================================================

# U.S. Standard Atmosphere 1976, Table I (geometric altitude), pressure [Pa]; from memory.
USSA_TABLE = [
    (0.0, 101325.0),
    (1000.0, 89876.0),
    (2000.0, 79501.0),
    (3000.0, 70121.0),
    (4000.0, 61660.0),
    (5000.0, 54048.0),
]


@pytest.mark.parametrize("z,p_ref", USSA_TABLE, ids=[f"{z:g}m" for z, _ in USSA_TABLE])
def test_ambient_pressure_vs_standard_atmosphere_table(z, p_ref):
    """Table I of the U.S. Standard Atmosphere 1976 (from memory), 5 significant digits."""
    assert ambient_pressure(z) == pytest.approx(p_ref, rel=2e-5)


@pytest.mark.parametrize("z", [0.0, 500.0, 1500.0, 2400.0, 3600.0, 4500.0])
def test_water_boils_lower_at_elevation(z):
    """An open kettle at the site: "ambient" pressure from the standard atmosphere, boiling
    point from iapws (IAPWS-95 saturation, independent implementation) within 1 mK; the report's
    note gives the same temperature; and common practice: about 1 K lower per 300 m (±1.5 K)."""
    route = pp.Route("water", T="20 degC", p="ambient", elevation=z).isobar(until="fully vapor")
    report = route.analyze()
    p = ambient_pressure(z)
    assert route.start.p == pytest.approx(p, rel=1e-12)
    T_ref = _iapws(P=p / MPa, x=0).T
    T_b = report.legs[0].end.T
    assert T_b == pytest.approx(T_ref, abs=1e-3)
    assert any(f"{T_b:.6g} K" in n and "Standard Atmosphere 1976" in n for n in report.notes)
    assert T_b == pytest.approx(373.124 - z / 300.0, abs=1.5)  # common practice


def test_valve_to_ambient_at_elevation():
    """A vent to "ambient" at 1600 m lets down to the standard-atmosphere pressure there."""
    route = pp.Route("water", T=450.0, p=10e5, elevation=1600.0).isenthalp(p="ambient")
    assert route.end.p == pytest.approx(ambient_pressure(1600.0), rel=1e-12)
    end = route.end_state()
    assert end.T == pytest.approx(_iapws(P=end.p / MPa, x=0).T, abs=1e-5)


# =================================================================================================
# Hazard flags
# =================================================================================================


def _kinds(report: pp.Report) -> set[str]:
    out = {h.kind for leg in report.legs for h in leg.hazards}
    return out | {h.kind for c in report.crossings for h in c.hazards}


@pytest.mark.parametrize(
    "make,present,absent",
    [
        (
            lambda: pp.Route("CO2", T=293.15, p=60e5).isenthalp(p=ATM),
            {"solid-formation"},
            {"liquid-full", "sealed-pressure", "cryogenic"},
        ),
        (
            lambda: pp.Route("CO2", T=293.15, p=60e5).isenthalp(p=10e5),
            set(),
            {"solid-formation", "liquid-full", "sealed-pressure", "cryogenic"},
        ),
        (
            lambda: pp.Route("CO2", T=288.15, density=750.0).isochore(T=300.0),
            {"liquid-full", "sealed-pressure"},
            {"solid-formation", "cryogenic"},
        ),
        (
            lambda: pp.Route("CO2", T=300.0, density=750.0).isochore(T=288.15),
            set(),
            {"liquid-full", "sealed-pressure", "solid-formation"},
        ),
        (
            lambda: pp.Route("CO2", T=300.0, density=467.6).isochore(T=310.0),
            {"near-critical", "sealed-pressure"},
            {"liquid-full", "cryogenic"},
        ),
        (
            lambda: pp.Route("N2", T=77.0, p=1e5).isobar(T=300.0),
            {"cryogenic"},
            {"near-critical", "solid-formation"},
        ),
        (
            lambda: pp.Route("N2", T=77.3, density=600.0).isochore(T=150.0),
            {"cryogenic", "liquid-full", "sealed-pressure"},
            {"solid-formation"},
        ),
        (
            lambda: pp.Route("water", T=500.0, p=10e5).isenthalp(p=1e5),
            set(),
            {"solid-formation", "liquid-full", "sealed-pressure", "near-critical", "cryogenic"},
        ),
        (
            lambda: pp.Route("water", T=300.0, p=1e5).isobar(T=260.0),
            {"solid-formation"},
            {"cryogenic", "near-critical"},
        ),
        (
            lambda: pp.Route("water", T=300.0, p=1e5).isobar(until="first solid"),
            {"solid-formation"},
            {"cryogenic", "liquid-full"},
        ),
        (
            lambda: pp.Route("CO2", T=280.0, p=20e5).isobar(until="fully liquid").isochore(T=265.0),
            {"liquid-full", "sealed-pressure"},
            {"solid-formation"},
        ),
        (
            lambda: pp.Route("CO2", T=250.0, density=1100.0).isochore(T=240.0),
            set(),
            {"liquid-full", "sealed-pressure", "solid-formation"},
        ),
    ],
    ids=[
        "co2-snow",
        "co2-valve-no-snow",
        "liquid-full",
        "sealed-cooling",
        "near-critical",
        "ln2-boiloff",
        "ln2-sealed",
        "steam-valve",
        "water-freezes-in-line",
        "cooled-until-first-solid",
        "sealed-after-fully-liquid",
        "sealed-liquid-cooled",
    ],
)
def test_hazard_flags_present_and_absent(make, present, absent):
    """Flags where the physics puts them, and none where it does not. Thresholds: cryogenic below
    -150 °C (common practice); near-critical within 2 % in T and 10 % in p (phasepath's own
    planning threshold); the critical density of CO2 467.6 kg/m3 (Span & Wagner 1996)."""
    report = make().analyze()
    kinds = _kinds(report)
    assert present <= kinds
    assert not (absent & kinds)
    for h in [h for leg in report.legs for h in leg.hazards]:
        assert DEFER in h.caution and h.reason
    table_text = " ".join(
        report.legs_table()["hazards"].tolist() + report.table()["hazards"].tolist()
    )
    for k in present:
        assert k in table_text


def test_hazards_reach_the_html_report():
    html = pp.Route("CO2", T=293.15, p=60e5).isenthalp(p=ATM).analyze()._repr_html_()
    assert "solid-formation" in html


# =================================================================================================
# Bad input
# =================================================================================================


@pytest.mark.parametrize(
    "build,err,words",
    [
        (
            lambda: pp.Route("CO2", T=288.15, density=750.0).isochore(T=300.0, p=80e5),
            RouteError,
            ["not both"],
        ),
        (lambda: pp.Route("CO2", T=288.15, density=750.0).isochore(), RouteError, ["T", "p"]),
        (
            lambda: pp.Route("CO2", T=288.15, density=750.0, p=50e5),
            RouteError,
            ["density", "not both"],
        ),
        (lambda: pp.Route("CO2", T=288.15, density=-5), OutOfRangeError, ["-5"]),
        (lambda: pp.Route("CO2", T=288.15, density="0.75 bar"), UnitError, ["0.75 bar"]),
        (
            lambda: pp.Route("water", T=300.0, p=1e5).isobar(until="boiling"),
            RouteError,
            ["'boiling'", "fully vapor"],
        ),
        (
            lambda: pp.Route("water", T=300.0, p=1e5).isobar(T=350.0, until="fully vapor"),
            RouteError,
            ["not both"],
        ),
        (
            lambda: pp.Route("water", T=350.0, p=1e5).isotherm(until="5 K superheat"),
            RouteError,
            ["'5 K superheat'", "constant-pressure"],
        ),
        (
            lambda: pp.Route("water", T=600.0, p=300e5).isobar(until="fully vapor"),
            RouteError,
            ["critical point"],
        ),
        (
            lambda: pp.Route("CO2", T=288.15, density=1150.0).isochore(T=1900.0),
            OutOfRangeError,
            ["T=1900.0", "8e+08"],
        ),
        (
            lambda: pp.Route("CO2", T=288.15, density=750.0).isochore(p="1e5 bar"),
            OutOfRangeError,
            ["1e5 bar", "8e+08"],
        ),
        (
            lambda: pp.Route("CO2", T=288.15, p=10e5).isenthalp(p=float("nan")),
            NonFiniteError,
            ["nan"],
        ),
        (
            lambda: pp.Route("CO2", T=288.15, p=10e5).add("isentrope", T=300.0),
            RouteError,
            ["isentrope", "'T'"],
        ),
        (
            lambda: pp.Route("water", T=300.0, p="ambient", elevation=30000.0),
            OutOfRangeError,
            ["30000", "20000"],
        ),
        (
            lambda: pp.Route("water", T=300.0, p="ambient", elevation=float("nan")),
            NonFiniteError,
            ["nan"],
        ),
        (
            lambda: analyze(pp.Route("water", T=300.0, p=1e5).isobar(T=350.0), basis="batch"),
            RouteError,
            ["'batch'", "steady-flow", "closed"],
        ),
    ],
    ids=[
        "isochore-T-and-p",
        "isochore-neither",
        "density-and-p",
        "density-negative",
        "density-wrong-unit",
        "unknown-event",
        "event-and-target",
        "superheat-on-isotherm",
        "event-above-critical",
        "sealed-above-pmax",
        "isochore-p-above-pmax",
        "valve-nan",
        "isentrope-with-T",
        "elevation-too-high",
        "elevation-nan",
        "unknown-basis",
    ],
)
def test_bad_input_gets_a_phasepath_error_naming_the_value(build, err, words):
    with pytest.raises(err) as info:
        build()
    assert isinstance(info.value, ValueError)
    for w in words:
        assert w in str(info.value)


@pytest.mark.parametrize(
    "start,kind,until",
    [
        ((300.0, ATM), "isobar", "first liquid"),
        ((300.0, ATM), "isobar", "fully liquid"),
        ((400.0, ATM), "isobar", "first vapor"),
        ((400.0, ATM), "isobar", "fully vapor"),
        ((350.0, 1e3), "isotherm", "fully vapor"),
        ((350.0, 1e5), "isotherm", "first liquid"),
        ((250.0, ATM), "isobar", "first solid"),
    ],
    ids=[
        "first-liquid-from-liquid",
        "fully-liquid-from-liquid",
        "first-vapor-from-vapor",
        "fully-vapor-from-vapor",
        "isotherm-fully-vapor-from-vapor",
        "isotherm-first-liquid-from-liquid",
        "first-solid-from-ice",
    ],
)
def test_event_that_the_leg_cannot_reach_is_refused(start, kind, until):
    """An event on the far side of the start ("first liquid" from a liquid) is refused with the
    start phase named, and the route keeps its legs."""
    route = pp.Route("water", T=start[0], p=start[1])
    with pytest.raises(RouteError) as info:
        getattr(route, kind)(until=until)
    assert repr(until) in str(info.value)
    assert not route.legs


def test_refused_sealed_leg_leaves_the_route_as_it_was():
    route = pp.Route("CO2", T=288.15, density=1150.0).isochore(T=300.0)
    before = route.to_dict()
    with pytest.raises(OutOfRangeError):
        route.isochore(T=1900.0)
    assert route.to_dict() == before and len(route.legs) == 1


def test_round_trip_of_new_leg_kinds_through_plain_data():
    """to_dict / from_dict keeps the density start, the new legs and the events."""
    route = (
        pp.Route("CO2", T=288.15, density="750 kg/m^3")
        .isochore(T=300.0)
        .isenthalp(p="1 atm")
        .isentrope(p=20e5)
        .isobar(until="5 K superheat")
    )
    again = pp.Route.from_dict(route.to_dict())
    assert np.ravel(again.corners()) == pytest.approx(np.ravel(route.corners()), rel=1e-12)
    assert again.analyze() == route.analyze()
