"""The sweep map widget without a browser: a sweep (pp.sweep) drawn on the substance's diagram,
coloured by an outcome, hovered and clicked.

Check values: the normal sublimation temperature of CO2, 194.686 K (Span & Wagner 1996; from
memory); everything else is compared with what the core computes for the same points (the map
must show the sweep's numbers, not its own).
"""

from __future__ import annotations

import numpy as np
import pytest

import phasepath as pp
from phasepath import format as F

pytest.importorskip("ipywidgets")
pytest.importorskip("bqplot")

from phasepath.widgets import RoutePlanner, SweepMap  # noqa: E402

# An invented vent line: CO2 let down through a valve from the vessel to 1 atm.
PLAN = pp.Route("CO2", T="20 degC", p="60 bar", title="demo vent").isenthalp(p="1 atm")


@pytest.fixture(scope="module")
def grid():
    return pp.sweep(
        PLAN, start_T=[270.0, 285.0, 300.0, 315.0], start_p=[60e5, 90e5], progress=False
    )


def test_markers_sit_on_the_swept_start_states_and_carry_the_column(grid):
    m = SweepMap(grid, color="end_solid_fraction")
    assert len(m.points.x) == len(grid) == 8
    x = np.array(m.points.x)
    assert x == pytest.approx(grid["start_T"].to_numpy() - 273.15)  # degC, the display unit
    assert np.array(m.points.y) == pytest.approx(grid["start_p"].to_numpy() / 1e5)
    filled = grid["end_solid_fraction"].fillna(0.0).to_numpy()  # fluid ends: no solid
    assert np.array(m.points.color, dtype=float) == pytest.approx(filled)
    assert m.color_scale.min == 0.0 and m.color_scale.max == 1.0
    assert m.color_axis.label == "end solid fraction"
    assert m.points in m.figure.marks and len(m.canvas.curves) == 3  # the boundaries


def test_colour_bar_in_display_units(grid):
    m = SweepMap(grid, color="end_T", T_unit="K")
    assert m.color_axis.label == "end temperature [K]"
    assert np.array(m.points.color, dtype=float) == pytest.approx(grid["end_T"].to_numpy())
    assert float(m.points.color[0]) == pytest.approx(194.686, abs=0.02)  # Span & Wagner 1996
    m2 = SweepMap(grid, color="first_vaporization_p", p_unit="MPa")
    assert m2.color_axis.label.endswith("[MPa]")
    assert float(m2.points.color[0]) == pytest.approx(grid["first_vaporization_p"][0] / 1e6)


def test_categorical_outcomes(grid):
    m = SweepMap(grid, color="end_phase")
    assert m.categorical and list(m.color_scale.domain) == sorted(set(grid["end_phase"]))
    assert "end phase" in m.key.value
    flags = SweepMap(grid, color="hazard_solid_formation")
    assert flags.categorical and set(flags.color_scale.domain) <= {"True", "False"}


def test_hover_shows_the_row_and_click_opens_its_route(grid):
    m = SweepMap(grid, color="end_solid_fraction")
    m._hover(m.points, {"data": {"index": 3}})
    row = grid.iloc[m.rows[3]]
    tip = m.points.tooltip.value
    assert F.temperature(row["start_T"], "degC") in tip.replace("\u2212", "-")
    assert F.fraction(row["end_solid_fraction"]) in tip
    m.points._handle_custom_msg({"event": "element_click", "data": {"index": 3}}, [])
    assert isinstance(m.planner, RoutePlanner)
    expected = PLAN.to_dict()
    expected["start"] = {"T": row["start_T"], "p": row["start_p"]}
    assert m.planner.route.corners() == pp.Route.from_dict(expected).corners()
    assert m.planner.report == pp.Route.from_dict(expected).analyze()
    m.open_row(m.rows[0])  # a second click reuses the same planner
    assert m.planner.route.start.T == pytest.approx(grid["start_T"].iloc[m.rows[0]])


def test_failed_points_are_drawn_apart_and_say_why():
    df = pp.sweep(PLAN, start_T=[280.0, 2500.0], progress=False)  # 2500 K: beyond the models
    m = SweepMap(df, color="end_T")
    assert len(m.points.x) == 1 and m.failed_rows == [1]
    assert np.array(m.failed.x) == pytest.approx([2500.0 - 273.15])  # drawn where it was given
    m._hover_failed(m.failed, {"data": {"index": 0}})
    assert (
        "2500" in m.failed.tooltip.value and df["error"][1].split(":")[0] in m.failed.tooltip.value
    )


def test_ph_view_and_leg_target_sweeps():
    df = pp.sweep(PLAN, leg1_p=["1 atm", "3 bar", "10 bar"], progress=False)
    m = SweepMap(df, color="end_solid_fraction", view="ph")
    assert m.canvas.view == "ph" and len(m.points.x) == 3
    # no start value varies: the points sit on the end states (their own h, as the valve holds h)
    assert np.array(m.points.y) == pytest.approx(df["end_p"].to_numpy() / 1e5)
    h0 = PLAN.analyze().legs[0].start.h / 1e3
    assert np.array(m.points.x) == pytest.approx(h0, rel=1e-6)


def test_refuses_what_it_cannot_draw(grid):
    with pytest.raises(pp.PhasePathError, match="column 'nope'"):
        SweepMap(grid, color="nope")
    with pytest.raises(pp.PhasePathError, match="'pT' or 'ph'"):
        SweepMap(grid, view="Ts")
    routes = pp.sweep([PLAN, PLAN.copy()], progress=False)
    with pytest.raises(pp.PhasePathError, match="a list of routes"):
        SweepMap(routes)
