"""Sweeps (``pp.sweep``): grid shape and order, axis parsing, named errors, failing points,
outcome columns against the analyser, and the same table bit for bit from worker processes.

Check values and their sources:

* CO2 vent from 20 degC, 60 bar through a valve to 1 atm: the end state lies on the sublimation
  curve at 1 atm. Span & Wagner 1996 (J. Phys. Chem. Ref. Data 25, 1509), eq. 3.12, the
  sublimation equation ln(p/p_t) = (T_t/T) [a1 (1 - T/T_t) + a2 (1 - T/T_t)^1.9
  + a3 (1 - T/T_t)^2.9] with T_t = 216.592 K, p_t = 0.51795 MPa, a1 = -14.740846,
  a2 = 2.4327015, a3 = -5.3061778 (from memory), solved here at 101325 Pa: 194.6855 K, the
  normal sublimation temperature (194.686 K, from memory). phasepath uses the EOS's own
  triple-point pressure (14 Pa above the published one), which moves the point by 3e-4 K:
  tolerance 1e-3 K.
* The bubble point on that valve leg (where the saturated liquid has the start enthalpy) and the
  triple point where the dry ice forms: CoolProp 8.0.0 called directly (``PropsSI``, high-level
  interface, Span & Wagner 1996 EOS), solved with ``brentq``; the triple-point temperature
  216.592 K is Span & Wagner's. Tolerances 1e-9 relative (the same EOS, two interfaces).
* Water vapor pressures on isotherm sweeps: CoolProp 8.0.0 ``PropsSI`` (IAPWS-95) directly,
  1e-9 relative, and IAPWS-IF97 (IAPWS R7-97(2012) region 4, eq. 30) from the independent
  ``iapws`` package, 3e-4 relative (IF97 and IAPWS-95 agree to a few hundredths of a percent,
  from memory).
* Heat on a constant-pressure leg of liquid water is the enthalpy change (common practice),
  CoolProp 8.0.0 ``PropsSI`` directly, 1e-9 relative; a valve does no shaft work and exchanges no
  heat (common practice).
* Unit conversions: 1 bar = 1e5 Pa, 1 atm = 101325 Pa, 0 degC = 273.15 K, 1 g/cm3 = 1000 kg/m3
  (definitions; common practice).

Every other expected value is the analyser's own answer for the same route (a consistency check,
not a published value).
"""

from __future__ import annotations

import math

import numpy as np
import pandas as pd
import pytest
from scipy.optimize import brentq

import phasepath as pp
from phasepath.errors import PhasePathError, RouteError, UnitError
from phasepath.sweep import SweepAxisError, to_xarray

SAME_EOS = 1e-9
IF97_TOL = 3e-4


def vent_plan() -> pp.Route:
    """Invented vessel of Larkspur Botanicals: liquid CO2 vented through a valve to 1 atm."""
    return pp.Route("CO2", T="20 degC", p="60 bar", title="Larkspur V-3 vent").isenthalp(p="1 atm")


def cheap_plan() -> pp.Route:
    """Invented cold-box test: CO2 vapor compressed along an isotherm (one crossing at most)."""
    return pp.Route("CO2", T=250.0, p=10e5).isotherm(p=30e5)


def assert_identical(a: pd.DataFrame, b: pd.DataFrame) -> None:
    """Same columns, dtypes and values; every float column equal bit for bit."""
    pd.testing.assert_frame_equal(a, b, check_exact=True)
    for col in a.columns:
        if a[col].dtype == np.float64:
            assert np.array_equal(
                a[col].to_numpy().view(np.uint64), b[col].to_numpy().view(np.uint64)
            )
    assert a.attrs == b.attrs


# -- grid ------------------------------------------------------------------------------------------
def test_grid_shape_and_order() -> None:
    Ts, ps = [240.0, 250.0, 260.0], [5e5, 8e5]
    df = pp.sweep(cheap_plan(), start_T=Ts, start_p=ps, progress=False)
    assert df.shape[0] == 6
    assert list(df.columns[:2]) == ["start_T", "start_p"]
    assert df["start_T"].tolist() == [240.0, 240.0, 250.0, 250.0, 260.0, 260.0]  # slowest
    assert df["start_p"].tolist() == [5e5, 8e5] * 3
    assert list(df.index) == list(range(6))
    # the axes in the other order: the other column first, the other axis slowest
    df2 = pp.sweep(cheap_plan(), start_p=ps, start_T=Ts, progress=False)
    assert list(df2.columns[:2]) == ["start_p", "start_T"]
    assert df2["start_p"].tolist() == [5e5] * 3 + [8e5] * 3
    assert df.attrs["axes"] == {"start_T": Ts, "start_p": ps}
    assert df.attrs["plan"] == cheap_plan().to_dict() | {"substance": "CarbonDioxide"}
    assert set(df.attrs["versions"]) >= {"phasepath", "CoolProp"}
    assert df.attrs["versions"]["CoolProp"] == "8.0.0"


def test_columns_in_order() -> None:
    df = pp.sweep(vent_plan(), start_T=[288.15, 293.15], progress=False)
    assert list(df.columns) == [
        "start_T",
        "n_crossings",
        "crossing_kinds",
        "first_vaporization_T",
        "first_vaporization_p",
        "first_deposition_T",
        "first_deposition_p",
        "end_T",
        "end_p",
        "end_phase",
        "end_form",
        "end_vapor_fraction",
        "end_solid_fraction",
        "heat",
        "work",
        "hazards",
        "hazard_solid_formation",
        "hazard_pressurized",
        "error",
    ]
    assert df["crossing_kinds"].tolist() == ["vaporization, deposition"] * 2
    assert df["hazards"].tolist() == ["solid-formation, pressurized"] * 2


def test_no_axes_is_one_point() -> None:
    df = pp.sweep(cheap_plan(), progress=False)
    assert df.shape[0] == 1 and df.columns[0] == "n_crossings"


def test_axis_values_with_units() -> None:
    df = pp.sweep(
        vent_plan(),
        start_T=["20 degC", 300.0],
        start_p=["60 bar", 7e6],
        leg1_p=["1 atm", "2 bar"],
        progress=False,
    )
    assert df.attrs["axes"] == {
        "start_T": [293.15, 300.0],
        "start_p": [6e6, 7e6],
        "leg1_p": [101325.0, 2e5],
    }
    for col in ("start_T", "start_p", "leg1_p"):
        assert df[col].dtype == np.float64
    row = df.iloc[0]
    assert row["end_p"] == 101325.0
    assert df.iloc[1]["end_p"] == 2e5
    # the point is the plan with the values put in, analysed as any route
    route = pp.Route("CO2", T=293.15, p=6e6).isenthalp(p=101325.0)
    assert row["end_T"] == route.analyze().legs[-1].end.T


def test_density_and_elevation_axes() -> None:
    plan = pp.Route("CO2", T=288.15, density=750.0).isochore(T="30 degC")
    df = pp.sweep(plan, start_density=["600 kg/m3", "0.75 g/cm3", 800.0], progress=False)
    assert df["start_density"].tolist() == pytest.approx([600.0, 750.0, 800.0], rel=1e-15)
    for rho, (_, row) in zip(df["start_density"], df.iterrows(), strict=True):
        rep = pp.Route("CO2", T=288.15, density=rho).isochore(T=303.15).analyze()
        assert row["end_p"] == rep.legs[-1].end.p
    water = pp.Route("water", T="20 degC", p="ambient").isobar(T="120 degC")
    dfe = pp.sweep(water, elevation=[0.0, "1600 m"], progress=False)
    assert dfe["elevation"].tolist() == [0.0, 1600.0]
    boil = dfe["first_vaporization_T"].to_numpy()
    assert boil[1] < boil[0]  # water boils cooler up a mountain (common practice)


# -- errors ----------------------------------------------------------------------------------------
@pytest.mark.parametrize(
    ("axes", "named", "says"),
    [
        ({"start_X": [1.0]}, "start_X", "names no value of the plan"),
        ({"leg3_p": [1e5]}, "leg3_p", "the plan has 1 leg"),
        ({"leg1_T": [250.0]}, "leg1_T", "isenthalp leg and its target is p"),
        ({"leg0_p": [1e5]}, "leg0_p", "names no value"),
        ({"start_density": [700.0]}, "start_density", "no start density"),
        ({"start_quality": [0.5]}, "start_quality", "no start quality to vary"),
        ({"start_T": 300.0}, "start_T", "not a list of values"),
        ({"start_T": "20 degC"}, "start_T", "not a list of values"),
        ({"start_T": []}, "start_T", "has no values"),
        ({"start_T": np.ones((2, 2))}, "start_T", "not a list of values"),
        ({"start_T": [300.0, math.nan]}, "start_T", "not a finite number"),
        ({"start_T": [True]}, "start_T", "not a number"),
        ({"start_T": ["20 bar"]}, "start_T", "is a pressure, not a temperature"),
        ({"start_p": ["60 barg"]}, "start_p", "60 barg"),
        ({"start_p": ["ambient"]}, "start_p", "give the pressure itself"),
        ({"elevation": ["5000 ft"]}, "elevation", "not an elevation in metres"),
    ],
    ids=lambda v: str(v)[:30] if isinstance(v, str) else None,
)
def test_bad_axes_are_named(axes: dict, named: str, says: str) -> None:
    with pytest.raises(SweepAxisError) as info:
        pp.sweep(vent_plan(), progress=False, **axes)
    err = info.value
    assert isinstance(err, PhasePathError)
    assert err.axis == named
    msg = str(err)
    assert msg.startswith(f"sweep axis {named}") and says in msg
    assert "accepted:" in msg and err.accepted


def test_error_lists_the_accepted_axes_and_value() -> None:
    with pytest.raises(SweepAxisError) as info:
        pp.sweep(vent_plan(), leg1_T=[250.0, 260.0], progress=False)
    assert info.value.value == [250.0, 260.0]
    assert "[250.0, 260.0]" in str(info.value)
    assert info.value.accepted == "start_T, start_p, elevation, leg1_p"


def test_unit_error_is_kept_as_cause() -> None:
    with pytest.raises(SweepAxisError) as info:
        pp.sweep(vent_plan(), start_T=["20 bar"], progress=False)
    assert isinstance(info.value.__cause__, UnitError)
    assert info.value.value == "20 bar"


def test_start_p_of_a_density_plan_is_refused() -> None:
    plan = pp.Route("CO2", T=288.15, density=750.0).isochore(T=300.0)
    with pytest.raises(SweepAxisError, match="starts from T and density"):
        pp.sweep(plan, start_p=[5e6], progress=False)


def test_axes_with_a_list_of_routes_are_refused() -> None:
    with pytest.raises(SweepAxisError, match="takes no axes"):
        pp.sweep([cheap_plan()], start_T=[250.0], progress=False)


def test_not_a_plan() -> None:
    with pytest.raises(RouteError, match="not a route"):
        pp.sweep(42, start_T=[250.0], progress=False)  # type: ignore[arg-type]


def test_failing_points_give_error_rows() -> None:
    # 30 bar is where the isotherm ends (a zero-length leg); 3000 K is beyond CO2's EOS.
    df = pp.sweep(cheap_plan(), start_T=[250.0, 3000.0], start_p=[10e5, 30e5], progress=False)
    errors = df["error"].tolist()
    assert errors[0] == ""
    assert errors[1].startswith("RouteError: ") and "zero length" in errors[1]
    assert errors[2].startswith("OutOfRangeError: ") and "3000" in errors[2]
    assert errors[3].startswith("OutOfRangeError: ")
    good, bad = df.iloc[0], df.iloc[1]
    assert good["n_crossings"] == 1 and good["end_phase"] == "liquid"
    assert pd.isna(bad["n_crossings"]) and pd.isna(bad["end_phase"])
    assert math.isnan(bad["end_T"]) and math.isnan(bad["heat"])
    assert pd.isna(bad["crossing_kinds"]) and pd.isna(bad["hazards"])
    assert bad["start_T"] == 250.0 and bad["start_p"] == 30e5  # the axes are always there


# -- outcomes against the analyser and against CoolProp -----------------------------------------
def _expected_row(route: pp.Route, kinds: list[str], hazard_kinds: list[str]) -> dict:
    rep = route.analyze()
    end = rep.legs[-1].end
    row: dict = {
        "n_crossings": len(rep.crossings),
        "crossing_kinds": ", ".join(c.kind for c in rep.crossings),
        "end_T": end.T,
        "end_p": end.p,
        "end_phase": end.phase,
        "end_form": end.form or "",
        "end_vapor_fraction": math.nan if end.vapor_fraction is None else end.vapor_fraction,
        "end_solid_fraction": math.nan if end.solid_fraction is None else end.solid_fraction,
    }
    for what in ("heat", "work"):
        vals = [getattr(leg, what) for leg in rep.legs]
        row[what] = math.nan if None in vals else math.fsum(vals)
    for kind in kinds:
        first = next((c for c in rep.crossings if c.kind == kind), None)
        name = kind.replace("-", "_")
        row[f"first_{name}_T"] = math.nan if first is None else first.T
        row[f"first_{name}_p"] = math.nan if first is None else first.p
    found = {h.kind for leg in rep.legs for h in leg.hazards}
    found |= {h.kind for c in rep.crossings for h in c.hazards}
    for kind in hazard_kinds:
        row[f"hazard_{kind.replace('-', '_')}"] = kind in found
    return row


def _same(a: object, b: object) -> bool:
    if isinstance(a, float) and isinstance(b, float) and math.isnan(a) and math.isnan(b):
        return True
    return a == b


def test_outcomes_match_route_analyze() -> None:
    """Every outcome column of every point equals what the analyser reports for the same route
    (consistency check: the expected values are the analyser's own)."""
    plan = pp.Route("CO2", T=250.0, p=10e5).isotherm(p=80e5).isobar(T=300.0).isotherm(p=5e5)
    df = pp.sweep(plan, start_T=[230.0, 250.0, 290.0], leg2_T=[260.0, 320.0], progress=False)
    routes = []
    for T0 in (230.0, 250.0, 290.0):
        for T2 in (260.0, 320.0):
            routes.append(
                pp.Route("CO2", T=T0, p=10e5).isotherm(p=80e5).isobar(T=T2).isotherm(p=5e5)
            )
    reports = [r.analyze() for r in routes]
    # kinds in order of first appearance over the grid, then along each route
    kinds = list(dict.fromkeys(c.kind for rep in reports for c in rep.crossings))
    hazard_kinds = list(
        dict.fromkeys(
            h.kind
            for rep in reports
            for leg in rep.legs
            for h in (
                *[h for c in rep.crossings if c.step == leg.step for h in c.hazards],
                *leg.hazards,
            )
        )
    )
    assert {"condensation", "vaporization", "supercritical-entry", "supercritical-exit"} <= set(
        kinds
    )
    first_cols = [f"first_{k.replace('-', '_')}_{q}" for k in kinds for q in ("T", "p")]
    assert [c for c in df.columns if c.startswith("first_")] == first_cols
    hazard_cols = [f"hazard_{k.replace('-', '_')}" for k in hazard_kinds]
    assert [c for c in df.columns if c.startswith("hazard_")] == hazard_cols
    for route, (_, row) in zip(routes, df.iterrows(), strict=True):
        assert (row["start_T"], row["leg2_T"]) == (route.start.T, route.legs[1].T)
        for col, value in _expected_row(route, kinds, hazard_kinds).items():
            assert _same(row[col], value), (col, row[col], value)
        assert row["error"] == ""


def test_vent_against_coolprop_and_span_wagner_sublimation() -> None:
    import CoolProp.CoolProp as CP

    df = pp.sweep(vent_plan(), start_T=["20 degC"], start_p=["60 bar"], progress=False)
    row = df.iloc[0]
    # Span & Wagner 1996 eq. 3.12 (coefficients from memory), solved at 1 atm: 194.6855 K
    T_t, p_t = 216.592, 0.51795e6
    a1, a2, a3 = -14.740846, 2.4327015, -5.3061778

    def p_sub(T: float) -> float:
        x = 1.0 - T / T_t
        return p_t * math.exp(T_t / T * (a1 * x + a2 * x**1.9 + a3 * x**2.9))

    T_sub = brentq(lambda T: p_sub(T) - 101325.0, 150.0, 216.0, xtol=1e-12)
    assert T_sub == pytest.approx(194.686, abs=1e-3)  # the normal sublimation point (from memory)
    assert row["end_T"] == pytest.approx(T_sub, abs=1e-3)
    assert row["end_p"] == 101325.0
    assert row["end_phase"] == "solid+vapor"
    assert 0.0 < row["end_solid_fraction"] < 1.0
    assert row["end_solid_fraction"] + row["end_vapor_fraction"] == pytest.approx(1.0, abs=1e-12)
    assert row["heat"] == 0.0 and row["work"] == 0.0  # a valve (common practice)
    assert bool(row["hazard_solid_formation"])
    # bubble point on the valve leg, CoolProp called directly
    h0 = CP.PropsSI("H", "T", 293.15, "P", 60e5, "CO2")
    T_b = brentq(
        lambda T: CP.PropsSI("H", "T", T, "Q", 0, "CO2") - h0, 250.0, 293.15, xtol=1e-13, rtol=1e-15
    )
    p_b = CP.PropsSI("P", "T", T_b, "Q", 0, "CO2")
    assert row["first_vaporization_T"] == pytest.approx(T_b, rel=SAME_EOS)
    assert row["first_vaporization_p"] == pytest.approx(p_b, rel=SAME_EOS)
    # the dry ice forms at the triple point (Span & Wagner's T_t; the EOS's triple pressure):
    # 3.08 µK and 0.07 Pa above it, where the published melting curve (14 Pa below the EOS
    # triple point) meets the vapor pressure (changed on purpose: melting curves as published)
    assert row["first_deposition_T"] == pytest.approx(216.592, rel=2e-8)
    p_t_eos = CP.PropsSI("P", "T", CP.PropsSI("Ttriple", "CO2"), "Q", 0, "CO2")
    assert row["first_deposition_p"] == pytest.approx(p_t_eos, rel=2e-7)
    assert row["first_deposition_p"] == pytest.approx(p_t, rel=1e-4)  # published p_t


def test_water_isotherms_against_coolprop_and_if97() -> None:
    import CoolProp.CoolProp as CP
    from iapws.iapws97 import _PSat_T  # IAPWS R7-97(2012) eq. 30, p in MPa

    plan = pp.Route("water", T=300.0, p=60e5).isotherm(p=300.0)
    temps = [300.0, 350.0, 400.0, 450.0]
    df = pp.sweep(plan, start_T=temps, progress=False)
    assert df["crossing_kinds"].tolist() == ["vaporization"] * 4
    for T, (_, row) in zip(temps, df.iterrows(), strict=True):
        assert row["first_vaporization_T"] == T
        p_cp = CP.PropsSI("P", "T", T, "Q", 0, "Water")
        assert row["first_vaporization_p"] == pytest.approx(p_cp, rel=SAME_EOS)
        assert row["first_vaporization_p"] == pytest.approx(_PSat_T(T) * 1e6, rel=IF97_TOL)
        assert row["end_phase"] == "vapor"


def test_water_isobar_heat_against_coolprop() -> None:
    import CoolProp.CoolProp as CP

    plan = pp.Route("water", T=300.0, p=1e5).isobar(T=320.0)
    targets = [310.0, 330.0, 350.0]
    df = pp.sweep(plan, leg1_T=targets, progress=False)
    h0 = CP.PropsSI("H", "T", 300.0, "P", 1e5, "Water")
    for T1, (_, row) in zip(targets, df.iterrows(), strict=True):
        assert row["n_crossings"] == 0 and row["end_phase"] == "liquid"
        dh = CP.PropsSI("H", "T", T1, "P", 1e5, "Water") - h0
        assert row["heat"] == pytest.approx(dh, rel=SAME_EOS)
        assert row["work"] == 0.0


# -- a list of routes ----------------------------------------------------------------------------
def test_list_of_routes() -> None:
    routes = [
        pp.Route("CO2", T=250.0, p=p, title=f"cold box {k}").isotherm(p=30e5)
        for k, p in enumerate((10e5, 20e5))
    ]
    routes.append({"substance": "unobtainium", "start": {"T": 300.0, "p": 1e5}, "legs": []})
    df = pp.sweep(routes, progress=False)
    assert df["title"].tolist() == ["cold box 0", "cold box 1", ""]
    assert df["n_crossings"].tolist()[:2] == [len(r.analyze().crossings) for r in routes[:2]]
    assert df["error"].iloc[2].startswith("UnknownSubstanceError")
    assert df.attrs["plan"] is None and df.attrs["axes"] == {}
    assert pp.sweep([], progress=False).shape[0] == 0


# -- engines ---------------------------------------------------------------------------------------
def test_process_pool_equals_serial_bit_for_bit() -> None:
    """A 7 x 7 vent grid (several tasks per worker) with failing points in it."""
    Ts = [283.15, 288.15, 293.15, 298.15, 303.15, 3000.0, 290.0]
    ps = [60e5, 70e5, 80e5, 101325.0, 100e5, 150e5, 200e5]  # 1 atm: a zero-length leg
    serial = pp.sweep(vent_plan(), start_T=Ts, start_p=ps, progress=False)
    pooled = pp.sweep(vent_plan(), start_T=Ts, start_p=ps, workers=2, progress=False)
    assert_identical(serial, pooled)
    assert (serial["error"] != "").sum() == 7 + 6  # the 3000 K row and the 1 atm column


def test_custom_substance_travels_as_data() -> None:
    sub = pp.Substance.from_data(
        "Fenwick solvent F-7 (invented)",
        critical=(560.0, 4.5e6),
        triple=(180.0, None),
        vapor_points=[(300.0, 5.0e3), (350.0, 4.0e4), (400.0, 1.9e5)],
    )
    plan = pp.Route(sub, T=300.0, p=2e4).isobar(T=380.0)
    temps = [300.0 + 2.0 * k for k in range(20)]
    serial = pp.sweep(plan, start_T=temps, progress=False)
    pooled = pp.sweep(plan, start_T=temps, workers=2, progress=False)
    assert_identical(serial, pooled)
    assert serial["crossing_kinds"].iloc[0] == "vaporization"
    assert isinstance(serial.attrs["plan"]["substance"], dict)  # its data, not an object


def test_bad_workers() -> None:
    from phasepath.errors import BatchError

    with pytest.raises(BatchError, match="workers"):
        pp.sweep(cheap_plan(), start_T=[250.0], workers=0, progress=False)


def test_progress_bar_shows(capsys: pytest.CaptureFixture[str]) -> None:
    pp.sweep(cheap_plan(), start_T=[250.0, 260.0], progress=True)
    assert "sweeping" in capsys.readouterr().err


# -- xarray ----------------------------------------------------------------------------------------
def test_to_xarray_grid() -> None:
    pytest.importorskip("xarray")
    Ts, ps = [240.0, 250.0, 260.0], [5e5, 8e5]
    df = pp.sweep(cheap_plan(), start_T=Ts, start_p=ps, progress=False)
    ds = to_xarray(df)
    assert ds["end_T"].dims == ("start_T", "start_p")
    assert ds["end_T"].shape == (3, 2)
    assert ds["start_T"].values.tolist() == Ts
    for i, T in enumerate(Ts):
        for j, p in enumerate(ps):
            row = df[(df.start_T == T) & (df.start_p == p)].iloc[0]
            assert ds["end_phase"].values[i, j] == row["end_phase"]
            assert ds["n_crossings"].values[i, j] == row["n_crossings"]
    assert '"start_T"' in ds.attrs["axes"]


def test_to_xarray_refuses_what_is_not_a_grid() -> None:
    pytest.importorskip("xarray")
    with pytest.raises(PhasePathError, match="no grid"):
        to_xarray(pp.sweep([cheap_plan()], progress=False))
    df = pp.sweep(cheap_plan(), start_T=[240.0, 240.0], progress=False)
    with pytest.raises(SweepAxisError, match="repeats a value"):
        to_xarray(df)
