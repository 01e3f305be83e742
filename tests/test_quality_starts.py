"""Saturated and two-phase starts (quality), one rule for starts exactly on a boundary, events
from a two-phase state, and the start_quality sweep axis.

Check values: CoolProp's high-level ``PropsSI`` with quality inputs (its own saturation
solver), an independent code path from phasepath's low-level calls; the lever rule and the
latent heat as h'' - h' (laws, no table). Values produced by phasepath itself appear only as
regression pins and are labelled so.
"""

from __future__ import annotations

import json
import math

import pytest

import phasepath as pp
from phasepath import routefile
from phasepath.errors import OutOfRangeError, RouteError, RouteFileError

CP = pytest.importorskip("CoolProp.CoolProp")
PropsSI = CP.PropsSI


@pytest.mark.parametrize("x", [0.0, 0.25, 1.0])
def test_quality_start_at_a_pressure(x):
    route = pp.Route("N2", p=1e6, quality=x)
    s = route.start.state
    assert route.start.T == pytest.approx(PropsSI("T", "P", 1e6, "Q", 0, "Nitrogen"), rel=1e-9)
    assert s.h == pytest.approx(PropsSI("Hmass", "P", 1e6, "Q", x, "Nitrogen"), rel=1e-9)
    assert s.rho == pytest.approx(PropsSI("Dmass", "P", 1e6, "Q", x, "Nitrogen"), rel=1e-9)
    assert s.vapor_fraction == x
    assert s.phase == {0.0: "liquid", 1.0: "vapor"}.get(x, "liquid+vapor")


def test_quality_start_at_a_temperature_with_units():
    route = pp.Route("CO2", T="5 degC", quality=0.3)
    s = route.start.state
    assert route.start.p == pytest.approx(PropsSI("P", "T", 278.15, "Q", 0, "CO2"), rel=1e-9)
    assert s.s == pytest.approx(PropsSI("Smass", "T", 278.15, "Q", 0.3, "CO2"), rel=1e-9)


@pytest.mark.parametrize(
    "kwargs, error, words",
    [
        (dict(T=100.0, p=1e6, quality=0.5), RouteError, "not both"),
        (dict(quality=0.5), RouteError, "T or its pressure p"),
        (dict(p=1e6, quality=1.5), OutOfRangeError, "outside 0"),
        (dict(p=1e6, quality=-0.1), OutOfRangeError, "outside 0"),
        (dict(p=1e6, quality=True), RouteError, "not a number"),
        (dict(p=1e6, quality="half"), RouteError, "not a number"),
        (dict(T=100.0, quality=0.5, density=300.0), RouteError, "quality or the start density"),
        (dict(T=200.0, quality=0.5), OutOfRangeError, "below the critical point"),
        (dict(p=5e6, quality=0.5), OutOfRangeError, "below the critical point"),
        (dict(p=1e3, quality=0.5), OutOfRangeError, "from the triple point"),
    ],
)
def test_bad_quality_starts_are_refused_with_the_reason(kwargs, error, words):
    with pytest.raises(error) as info:
        pp.Route("N2", **kwargs)
    assert words in str(info.value)


def test_quality_start_round_trips_through_plain_data_and_files(tmp_path):
    route = pp.Route("N2", p="10 bar", quality=0.0).isobar(T="-150 degC")
    data = route.to_dict()
    assert data["start"] == {"p": "10 bar", "quality": 0.0}
    back = pp.Route.from_dict(data)
    assert back.start.state == route.start.state and back.to_dict() == data
    for name in ("plan.yaml", "plan.json"):
        saved = route.save(tmp_path / name)
        assert pp.Route.load(saved).to_dict() == data
    assert json.loads((tmp_path / "plan.json").read_text())["start"] == data["start"]


def test_route_files_check_the_quality():
    text = (
        "format: phasepath route file\nversion: 1\nsubstance: N2\n"
        "start: {T: 90 K, quality: 0.5}\nlegs:\n  - {kind: isobar, T: 120 K}\n"
    )
    route = routefile.loads_route(text, fmt="yaml")
    assert route.start.state.vapor_fraction == 0.5
    for bad, words in (
        ("{T: 90 K, quality: 1.2}", "vapor mass fraction"),
        ("{T: 90 K, quality: half}", "vapor mass fraction"),
        ("{T: 90 K, p: 1 bar, quality: 0.5}", "give only one of"),
        ("{T: 90 K, density: 300, quality: 0.5}", "not both"),
        ("{quality: 0.5}", "missing value"),
    ):
        with pytest.raises(RouteFileError) as info:
            routefile.loads_route(text.replace("{T: 90 K, quality: 0.5}", bad), fmt="yaml")
        assert words in str(info.value) and "start" in str(info.value)


def test_the_schema_takes_a_quality_start():
    jsonschema = pytest.importorskip("jsonschema")
    schema = routefile.schema()
    doc = {
        "format": "phasepath route file",
        "version": 1,
        "substance": "N2",
        "start": {"p": "10 bar", "quality": 0.0},
        "legs": [{"kind": "isobar", "T": 120.0}],
    }
    jsonschema.validate(doc, schema)
    for start in (
        {"p": 1e6, "quality": 2.0},
        {"T": 90.0, "p": 1e5, "quality": 0.5},
        {"T": 90.0, "density": 300.0, "quality": 0.5},
    ):
        with pytest.raises(jsonschema.ValidationError):
            jsonschema.validate({**doc, "start": start}, schema)


# -- events from a two-phase start ----------------------------------------------------------------
@pytest.mark.parametrize("x", [0.1, 0.5, 0.9])
def test_until_fully_vapor_from_a_two_phase_start_is_a_real_leg(x):
    """Heat to finish the vaporization at 10 bar: (1 - x) (h'' - h'), PropsSI."""
    report = pp.Route("N2", p=1e6, quality=x).isobar(until="fully vapor").analyze()
    (c,) = report.crossings
    assert c.kind == "vaporization" and c.step == 1
    L = PropsSI("Hmass", "P", 1e6, "Q", 1, "Nitrogen") - PropsSI(
        "Hmass", "P", 1e6, "Q", 0, "Nitrogen"
    )
    assert report.legs[0].heat == pytest.approx((1 - x) * L, rel=1e-9)
    assert report.legs[0].end.phase == "vapor"
    back = pp.Route("N2", p=1e6, quality=x).isobar(until="fully liquid").analyze()
    assert [c.kind for c in back.crossings] == ["condensation"]
    assert back.legs[0].heat == pytest.approx(-x * L, rel=1e-9)


def test_first_liquid_from_a_two_phase_start_is_refused():
    with pytest.raises(RouteError, match="both present already"):
        pp.Route("N2", p=1e6, quality=0.5).isobar(until="first liquid")


def test_saturated_liquid_into_a_valve_starts_boiling_at_once():
    """Saturated liquid nitrogen at 10 bar through a valve to 1 bar: the vaporization is on the
    valve leg, at its start; the outlet quality from PropsSI's (p, h) flash."""
    report = pp.Route("N2", p=1e6, quality=0.0).isenthalp(p=1e5).analyze()
    (c,) = report.crossings
    assert (c.kind, c.step, c.p) == ("vaporization", 1, 1e6)
    h = PropsSI("Hmass", "P", 1e6, "Q", 0, "Nitrogen")
    assert report.legs[0].end.vapor_fraction == pytest.approx(
        PropsSI("Q", "P", 1e5, "Hmass", h, "Nitrogen"), rel=1e-7
    )


# -- one rule for a start exactly on a boundary --------------------------------------------------
ON_CURVE = [  # (leg, the side it leaves into, the start's property, PropsSI quality of that side)
    (lambda r: r.isobar(T=260.0), "vapor", None, None),
    (lambda r: r.isobar(T=240.0), "liquid", None, None),
    (lambda r: r.isotherm(p=30e5), "liquid", None, None),
    (lambda r: r.isotherm(p=10e5), "vapor", None, None),
    (lambda r: r.isenthalp(p=10e5), "vapor", "Hmass", 1),
    (lambda r: r.isentrope(p=30e5), "liquid", "Smass", 0),
    (lambda r: r.isochore(T=260.0), "vapor", "Dmass", 1),
    (lambda r: r.isochore(T=240.0), "liquid", "Dmass", 0),
]


@pytest.mark.parametrize("make, side, key, q", ON_CURVE)
def test_a_start_on_the_vapor_pressure_curve_takes_the_side_the_leg_leaves_into(make, side, key, q):
    """CO2 at 250 K exactly at its vapor pressure: every leg kind starts on the side it moves
    into (the held value is that of the saturated phase there, PropsSI)."""
    sub = pp.substance("CO2")
    p_s = sub.vapor.p_of_T(250.0)
    report = make(pp.Route(sub, T=250.0, p=p_s)).analyze()
    start = report.legs[0].start
    assert start.phase == side  # (a saturated liquid cooled at constant volume boils at once)
    if key is not None:
        value = {"Hmass": start.h, "Smass": start.s, "Dmass": start.rho}[key]
        assert value == pytest.approx(PropsSI(key, "T", 250.0, "Q", q, "CO2"), rel=1e-9)


@pytest.mark.parametrize("q, phase", [(0, "liquid"), (1, "vapor")])
def test_a_density_start_at_exactly_the_saturated_density_is_that_saturated_state(q, phase):
    rho = PropsSI("Dmass", "T", 280.0, "Q", q, "CO2")
    s = pp.Route("CO2", T=280.0, density=rho).start.state
    assert (s.phase, s.vapor_fraction) == (phase, float(q))
    assert s.p == pytest.approx(PropsSI("P", "T", 280.0, "Q", q, "CO2"), rel=1e-12)
    assert s.h == pytest.approx(PropsSI("Hmass", "T", 280.0, "Q", q, "CO2"), rel=1e-12)


# -- sweeps over the start quality ----------------------------------------------------------------
def test_sweep_over_the_start_quality():
    """A CO2 vessel vented from 5 °C at three vapor fractions: the wetter the charge, the more
    dry ice at the outlet (lever rule); the first row equals the route analysed alone."""
    plan = pp.Route("CO2", T="5 degC", quality=0.5).isenthalp(p="1 atm")
    df = pp.sweep(plan, start_quality=[0.0, 0.5, 1.0], progress=False)
    assert list(df["start_quality"]) == [0.0, 0.5, 1.0]
    assert not df["error"].astype(bool).any()
    solid = list(df["end_solid_fraction"])
    assert solid[0] > solid[1] > solid[2] >= 0.0 or math.isnan(solid[2])
    alone = pp.Route("CO2", T="5 degC", quality=0.0).isenthalp(p="1 atm").analyze()
    assert df["end_solid_fraction"].iloc[0] == alone.legs[0].end.solid_fraction
