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
    ("banana", "10 bar"),
    ("", ""),
    ("nan", "1 bar"),
    ("5 bar", "1 bar"),
    ("20 degC", "20 degC"),
    ("1e400", "1 bar"),
    ("-500 degC", "1 bar"),
    ("20 degC", "-3 bar"),
    ("20 degC", "1e12 bar"),
    ("5 __import__('os')", "1 bar"),
    ("1 x" + " " * 50_000 + "y", "1 bar"),
    (None, "1 bar"),
]


@pytest.mark.parametrize(
    "T,p", TYPED_NONSENSE, ids=[f"typed-{i}" for i in range(len(TYPED_NONSENSE))]
)
def test_typed_nonsense_keeps_the_route(planner: RoutePlanner, T: object, p: object) -> None:
    before = _corners(planner)
    report_before = planner.report
    msg = planner.add_corner(T, p, kind="isobar")
    assert msg, "a refused corner must say why"
    assert planner.message == msg
    assert "⚠" in planner.status.value
    assert _corners(planner) == before
    assert planner.report == report_before


@pytest.mark.parametrize(
    "coord,typed",
    [
        ("T", "hot"),
        ("T", "9000 degC"),
        ("p", "0 bar"),
        ("p", "25 degC"),
        ("T", ""),
        ("p", "inf bar"),
    ],
)
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


def _drag_end(pl: RoutePlanner, index: int, x: object, y: object, view: str = "pT") -> None:
    """The page's state update of a dragged corner mark, then its drag-end message."""
    c = pl.canvases[view].corners
    xs, ys = np.array(c.x, dtype=float), np.array(c.y, dtype=float)
    try:
        xs[index], ys[index] = float(x), float(y)  # type: ignore[arg-type]
    except (TypeError, ValueError):
        pass
    with c.hold_sync(), c.hold_trait_notifications():
        c.x, c.y = xs, ys
    pl._page_drag_end(view, {"event": "drag_end", "index": index, "point": {"x": x, "y": y}})


def test_drag_outside_the_models_keeps_the_route(planner: RoutePlanner) -> None:
    before = _corners(planner)
    y_last = float(planner.diagram.corners.y[-1])
    # drag the last corner far beyond the highest pressure CO2's models cover (800 MPa)
    _drag_end(planner, 2, float(planner.diagram.corners.x[-1]), 1e9 * max(y_last, 1.0))
    assert planner.message
    assert _corners(planner) == before
    # the corner mark is put back where the good route has it
    assert list(planner.diagram.corners.y)[-1] == pytest.approx(y_last)


def test_drag_preview_with_garbage_event_does_not_raise(planner: RoutePlanner) -> None:
    for event in (
        {},
        {"index": "x"},
        {"index": 99, "point": {"x": 1, "y": 2}},
        {"index": 1, "point": {"x": float("nan"), "y": -1}},
        {"index": 1, "point": None},
    ):
        for view in ("pT", "ph", "Ts"):
            planner._page_drag(view, event)
            planner._page_drag_end(view, event)
    assert _corners(planner)


BAD_EVENTS = [
    {"type": "click", "relativeX": float("nan"), "relativeY": 100},
    {"type": "click", "relativeX": 300, "relativeY": float("inf")},
    {"type": "click", "relativeX": "left", "relativeY": 100},
    {"type": "click"},
    {
        "type": "click",
        "relativeX": 300,
        "relativeY": 200,
        "boundingRectWidth": float("nan"),
        "boundingRectHeight": 460,
    },
    {
        "type": "click",
        "relativeX": 300,
        "relativeY": 200,
        "boundingRectWidth": 0,
        "boundingRectHeight": 0,
    },
    {
        "type": "click",
        "relativeX": -5000,
        "relativeY": 200,
        "boundingRectWidth": 800,
        "boundingRectHeight": 460,
    },
    None,
]


@pytest.mark.parametrize("event", BAD_EVENTS, ids=[f"event-{i}" for i in range(len(BAD_EVENTS))])
@pytest.mark.parametrize("view", ["pT", "ph", "Ts"])
def test_nan_or_infinite_click_from_the_page_never_escapes_nor_strays(
    planner: RoutePlanner, event: object, view: str
) -> None:
    """Issue 14 item 7: a point at NaN or infinity (or no point at all) from the page never
    raises out of the handler, never becomes a corner, and leaves nothing that swallows the
    next click."""
    before = _corners(planner)
    canvas = planner.canvases[view]
    canvas._dom_click(event if isinstance(event, dict) else {})  # type: ignore[arg-type]
    planner._page_move(view, event if isinstance(event, dict) else {})  # type: ignore[arg-type]
    assert _corners(planner) == before
    assert len(planner.diagram.corners.x) == len(before)
    # the next good click is taken as usual
    planner.leg_kind = "isobar"
    x0, x1, y0, y1 = planner.diagram.shown_window()
    pt = planner.diagram.page_event(x0 + 0.3 * (x1 - x0), float(planner.diagram.corners.y[-1]))
    planner.diagram._dom_click(pt)
    assert len(_corners(planner)) == len(before) + 1


def test_nan_corner_from_the_page_is_put_back(planner: RoutePlanner) -> None:
    before = _corners(planner)
    for bad in (float("nan"), float("inf"), -float("inf")):
        _drag_end(planner, 1, bad, 20.0)
        _drag_end(planner, 1, 10.0, bad)
        assert _corners(planner) == before
        assert np.all(np.isfinite(planner.diagram.corners.x))
        assert np.all(np.isfinite(planner.diagram.corners.y))
    # the page may also set the corner mark's arrays to non-finite values: nothing follows
    c = planner.diagram.corners
    with c.hold_sync():
        c.x = np.array([np.nan] * len(c.x))
    assert _corners(planner) == before


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
