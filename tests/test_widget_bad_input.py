"""The route planner under bad input, driven without a browser through its traitlets and the
same handlers a page event calls: typed nonsense, a drag outside the models, a switch to a
substance where the route is impossible. Each gets a message in the widget, the last good route
is kept (or, on a substance switch, the drawing is kept and comes back), and no exception
escapes into the notebook.
"""

from __future__ import annotations

import numpy as np
import pytest

pytest.importorskip("ipywidgets")
pytest.importorskip("bqplot")

import phasepath as pp  # noqa: E402

RoutePlanner = pytest.importorskip("phasepath.widgets").RoutePlanner


@pytest.fixture()
def planner() -> RoutePlanner:
    # An invented trial: CO2 for a dry-ice pelletiser at Norrvik Cold Works, -20 degC, 10 bar.
    route = pp.Route("CO2", T="-20 degC", p="10 bar").isobar(T="20 degC").isotherm(p="70 bar")
    return RoutePlanner(route)


def _corners(pl: RoutePlanner) -> list[tuple[float, float]]:
    assert pl.route is not None
    return pl.route.corners()


TYPED_NONSENSE = [
    ("banana", "10 bar"), ("", ""), ("nan", "1 bar"), ("5 bar", "1 bar"), ("20 degC", "20 degC"),
    ("1e400", "1 bar"), ("-500 degC", "1 bar"), ("20 degC", "-3 bar"), ("20 degC", "1e12 bar"),
    ("5 __import__('os')", "1 bar"), ("1 x" + " " * 50_000 + "y", "1 bar"), (None, "1 bar"),
]


@pytest.mark.parametrize("T,p", TYPED_NONSENSE,
                         ids=[f"typed-{i}" for i in range(len(TYPED_NONSENSE))])
def test_typed_nonsense_keeps_the_route(planner: RoutePlanner, T: object, p: object) -> None:
    before = _corners(planner)
    report_before = planner.report
    msg = planner.add_corner(T, p, kind="isobar")
    assert msg, "a refused corner must say why"
    assert planner.message == msg
    assert "⚠" in planner.status.value
    assert _corners(planner) == before
    assert planner.report == report_before


@pytest.mark.parametrize("coord,typed", [("T", "hot"), ("T", "9000 degC"), ("p", "0 bar"),
                                         ("p", "25 degC"), ("T", ""), ("p", "inf bar")])
def test_typed_nonsense_in_the_leg_list(planner: RoutePlanner, coord: str, typed: str) -> None:
    before = _corners(planner)
    msg = planner._edit_corner(1, coord, typed)
    assert msg and planner.message
    assert _corners(planner) == before


def test_typed_nonsense_in_the_start_fields() -> None:
    pl = RoutePlanner("water")
    pl.start_T.value, pl.start_p.value = "twenty", "1 bar"
    pl._typed_start()
    assert "⚠" in pl.start_msg.value
    assert pl.start_T.value == "twenty"  # what the user typed is kept for correcting
    pl.start_T.value = "20 degC"
    pl._typed_start()
    assert pl.route is not None and pl.route.start.T == pytest.approx(293.15)


def test_drag_outside_the_models_keeps_the_route(planner: RoutePlanner) -> None:
    before = _corners(planner)
    c = planner.diagram.corners
    x, y = np.array(c.x, dtype=float), np.array(c.y, dtype=float)
    # drag the last corner far beyond the highest pressure CO2's models cover (800 MPa)
    y[-1] = 1e9 * max(y[-1], 1.0)
    with c.hold_sync():
        c.x, c.y = x, y
    assert planner.message
    assert _corners(planner) == before
    # the corner mark is put back where the good route has it
    assert list(planner.diagram.corners.y)[-1] != pytest.approx(y[-1])


def test_drag_preview_with_garbage_event_does_not_raise(planner: RoutePlanner) -> None:
    for event in ({}, {"index": "x"}, {"index": 99, "point": {"x": 1, "y": 2}},
                  {"index": 1, "point": {"x": float("nan"), "y": -1}}):
        planner._dragging(None, event)
    assert _corners(planner)


def test_switch_to_unknown_substance(planner: RoutePlanner) -> None:
    good = _corners(planner)
    planner.substance = "unobtainium"
    assert "unobtainium" in planner.message
    assert planner.substance == "CarbonDioxide"
    assert _corners(planner) == good
    planner.picker.value = "carbn dioxide"
    assert planner.message
    assert _corners(planner) == good


def test_switch_to_impossible_substance_keeps_the_drawing() -> None:
    # An invented hydro-test loop: water at 300 K pressed to 100 MPa. R-134a's models stop at
    # 70 MPa, so the same route is impossible for it: a message, no exception, the drawing kept,
    # and switching back gives the same route.
    pl = RoutePlanner(pp.Route("Water", T=300.0, p=1e5).isotherm(p=1e8))
    good = _corners(pl)
    pl.substance = "R134a"
    assert pl.route is None
    assert "R134a" in pl.message and "⚠" in pl.status.value
    pl.substance = "Water"
    assert pl.route is not None and _corners(pl) == good
