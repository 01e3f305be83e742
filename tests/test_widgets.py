"""The route planner widget without a browser: its state is driven through traitlets.

A click on the diagram reaches Python as one more point in the corner Scatter's ``x``/``y``; a
drag ends with one point of it moved. These tests set those arrays as the browser would (inside
``hold_sync``) and read the route, the report and the tables.

Check values:
* CO2 vapor pressure at 243.15 K (-30 degC): 1.4278 MPa; at 293.15 K (20 degC): 5.7291 MPa
  (Span & Wagner 1996, J. Phys. Chem. Ref. Data 25, 1509, saturation table; from memory).
* Water at 101.325 kPa: saturation temperature and latent heat from the ``iapws`` library
  (IAPWS-95), an implementation independent of phasepath's; 2257 kJ/kg at 100 degC is the common
  steam-table value (common practice).
* Everything else is compared with what the core computes for the same route (the widget must
  show the core's numbers, not its own).
"""

from __future__ import annotations

import subprocess
import sys

import numpy as np
import pytest

import phasepath as pp

W = pytest.importorskip("ipywidgets")
pytest.importorskip("bqplot")

from phasepath.widgets import RoutePlanner  # noqa: E402


def click(planner: RoutePlanner, x: float, y: float) -> None:
    """What the browser does on a click: append the point (display units) to the Scatter."""
    s = planner.diagram.corners
    with s.hold_sync(), s.hold_trait_notifications():  # as the page's one message does
        s.x, s.y = np.append(s.x, float(x)), np.append(s.y, float(y))


def drag(planner: RoutePlanner, index: int, x: float, y: float) -> None:
    """What the browser does at the end of a drag: move one point of the Scatter."""
    s = planner.diagram.corners
    xs, ys = np.array(s.x, dtype=float), np.array(s.y, dtype=float)
    xs[index], ys[index] = x, y
    with s.hold_sync(), s.hold_trait_notifications():
        s.x, s.y = xs, ys


@pytest.fixture()
def co2() -> RoutePlanner:
    """An empty CO2 planner in degC and bar."""
    return RoutePlanner("CO2", T_unit="degC", p_unit="bar")


def two_legs(planner: RoutePlanner) -> RoutePlanner:
    """Start vapor at -30 degC, 5 bar; up to 40 bar (constant T); right to +20 degC (constant p)."""
    click(planner, -30.0, 5.0)
    planner.leg_kind = "isotherm"
    click(planner, -29.0, 40.0)  # off the vertical: snapped to -30 degC
    planner.leg_kind = "isobar"
    click(planner, 20.0, 45.0)  # off the horizontal: snapped to 40 bar
    return planner


def test_core_does_not_import_widget_libraries():
    code = (
        "import sys, phasepath as pp; pp.Route('CO2', T=250, p=2e6).isobar(T=300).analyze();"
        "assert 'ipywidgets' not in sys.modules and 'bqplot' not in sys.modules;"
        "pp.widgets; assert 'ipywidgets' in sys.modules"
    )
    subprocess.run([sys.executable, "-c", code], check=True)


def test_clicks_draw_true_isotherm_and_isobar(co2):
    two_legs(co2)
    r = co2.route
    assert [leg.kind for leg in r.legs] == ["isotherm", "isobar"]
    assert r.start.T == pytest.approx(243.15, abs=1e-9)
    assert r.legs[0].T == r.start.T  # snapped: a true isotherm
    assert r.legs[0].p == pytest.approx(40e5, rel=1e-12)
    assert r.legs[1].p == r.legs[0].p  # snapped: a true isobar
    assert r.legs[1].T == pytest.approx(293.15, abs=1e-9)
    # the user's own units are kept as typed text
    assert r.legs[0].given == {"p": "40.00 bar"} and r.legs[1].given == {"T": "20.0 degC"}


def test_report_is_the_cores_and_matches_published_vapor_pressure(co2):
    two_legs(co2)
    rep = co2.report
    assert rep == co2.route.copy().analyze()
    kinds = [c.kind for c in rep.crossings]
    assert kinds == ["condensation", "vaporization"]
    # Span & Wagner 1996 saturation table, 243.15 K: 1.4278 MPa (from memory)
    assert rep.crossings[0].p == pytest.approx(1.4278e6, rel=5e-4)
    # the table in the page shows the same numbers in the chosen units
    table = co2.crossings_table()
    assert list(table["kind"]) == kinds
    assert table["p [bar]"].iloc[0] == pytest.approx(14.278, rel=5e-4)
    assert table["T [°C]"].iloc[0] == pytest.approx(-30.0, abs=1e-9)
    html = co2.results.value
    assert "condensation" in html and "vaporization" in html and "14.278" in html
    assert html.count("class='pp-crossing'") == 2
    # each crossing is marked on the diagram
    assert len(co2.diagram.crossings.x) == 2
    assert co2.diagram.crossings.y[0] == pytest.approx(rep.crossings[0].p / 1e5)


def test_water_boiling_at_one_atmosphere_against_iapws():
    iapws = pytest.importorskip("iapws")
    planner = RoutePlanner("water", T_unit="degC", p_unit="kPa")
    planner.add_corner("90 degC", "101.325 kPa")
    assert planner.add_corner("110 degC", "101.325 kPa", kind="isobar") == ""
    (c,) = planner.report.crossings
    sat = iapws.IAPWS95(P=0.101325, x=0.0)  # MPa
    sat_v = iapws.IAPWS95(P=0.101325, x=1.0)
    assert c.kind == "vaporization"
    assert c.T == pytest.approx(sat.T, abs=1e-3)
    assert c.latent_heat == pytest.approx((sat_v.h - sat.h) * 1e3, rel=1e-4)
    assert c.latent_heat == pytest.approx(2257e3, rel=2e-3)  # common practice (steam tables)


def test_auto_kind_follows_the_click_direction(co2):
    co2.leg_kind = "auto"
    click(co2, -30.0, 5.0)
    click(co2, -29.5, 60.0)  # mostly upward on screen -> constant T
    click(co2, 10.0, 55.0)  # mostly rightward -> constant p
    assert [leg.kind for leg in co2.route.legs] == ["isotherm", "isobar"]


def test_drag_keeps_neighbouring_legs_true_and_updates_report(co2):
    two_legs(co2)
    before = co2.report
    # drag corner 1 (end of the isotherm) to -40 degC, 30 bar
    drag(co2, 1, -40.0, 30.0)
    r = co2.route
    (T0, p0), (T1, p1), (T2, p2) = r.corners()
    assert T0 == T1 == pytest.approx(233.15)  # the isotherm moved with it
    assert p1 == p2 == pytest.approx(30e5)  # the isobar followed
    assert T2 == pytest.approx(293.15)  # the last corner kept its own target
    assert co2.report is not before
    assert co2.report == r.copy().analyze()
    # one drag is one undo step
    co2.undo()
    assert co2.route.corners()[1] == pytest.approx((243.15, 40e5))
    co2.redo()
    assert co2.route.corners()[1] == pytest.approx((233.15, 30e5))


def test_drag_preview_moves_only_the_line(co2):
    two_legs(co2)
    report = co2.report
    co2._dragging(
        co2.diagram.corners, {"event": "drag", "index": 2, "point": {"x": 0.0, "y": 40.0}}
    )
    assert co2.diagram.route_line.x[-1] == pytest.approx(0.0)
    assert co2.report is report  # no analysis while dragging


def test_undo_redo_and_delete(co2):
    two_legs(co2)
    co2.undo()
    assert len(co2.route.legs) == 1
    co2.redo()
    assert len(co2.route.legs) == 2
    co2.legs.rows[2].delete.click()
    assert len(co2.route.legs) == 1 and len(co2.report.crossings) == 1
    co2.legs.rows[0].delete.click()  # deleting the start: corner 1 becomes the start
    assert co2.route.start.p == pytest.approx(40e5) and co2.report is None


def test_bad_typed_value_keeps_last_good_route(co2):
    two_legs(co2)
    good = co2.route
    row = co2.legs.rows[2]
    row.T.value = "warm"
    assert co2.route is good
    assert "warm" in row.error.value and row.T.value == "warm"
    row.T.value = "-250 degC"  # below every model of CO2
    assert co2.route is good
    assert "-250 degC" in row.error.value
    assert len(co2.diagram.corners.x) == 3  # nothing drawn is lost
    row.T.value = "10"  # a bare number is in the display unit (degC)
    assert co2.route.legs[1].T == pytest.approx(283.15)
    assert row.error.value == ""


def test_typed_start_and_out_of_range_click(co2):
    co2.start_T.value, co2.start_p.value = "250 K", "3 bar"
    co2.start_btn.click()
    assert co2.route.start.T == 250.0 and co2.route.start.p == pytest.approx(3e5)
    co2.leg_kind = "isotherm"
    click(co2, -23.15, 1e5)  # 100 kbar: above the highest pressure of CO2's models
    assert len(co2.route.legs) == 0 and "Pa" in co2.message
    assert len(co2.diagram.corners.x) == 1  # the refused point is taken off the diagram


def test_units_switch_converts_table_and_fields(co2):
    two_legs(co2)
    co2.T_unit, co2.p_unit, co2.energy_unit = "K", "MPa", "J/kg"
    t = co2.crossings_table()
    assert t["T [K]"].iloc[0] == pytest.approx(243.15)
    assert t["p [MPa]"].iloc[0] == pytest.approx(1.4278, rel=5e-4)
    assert "T [K]" in co2.results.value and "p [MPa]" in co2.results.value
    assert co2.legs.rows[0].T.value == "243.15"
    assert co2.diagram.ax.label == "Temperature [K]"
    assert co2.diagram.corners.x[0] == pytest.approx(243.15)


def test_substance_switch_keeps_numbers_or_says_why(co2):
    two_legs(co2)
    given = co2.route.to_dict()["legs"]
    co2.substance = "water"
    assert co2.route.substance.name == "Water"
    assert co2.route.to_dict()["legs"] == given
    assert co2.report == co2.route.copy().analyze()
    co2.picker.value = "benzene"  # no sublimation curve; -30 degC is below its triple point
    assert co2.substance == "Benzene"
    assert co2.route is None and co2.report is None
    assert "triple point" in co2.message
    co2.picker.value = "carbon dioxide"
    assert co2.route.substance.name == "CarbonDioxide"
    assert [c.kind for c in co2.report.crossings] == ["condensation", "vaporization"]


def test_unknown_substance_is_refused_plainly(co2):
    co2.picker.value = "unobtainium"
    assert co2.substance == "CarbonDioxide"
    assert "unobtainium" in co2.message


def test_assigning_and_constructing_with_a_route():
    r = pp.Route("N2", T="70 K", p="1 bar").isobar(T="90 K")
    planner = RoutePlanner(r, T_unit="K", p_unit="bar")
    assert planner.substance == "Nitrogen"
    assert planner.report == r.copy().analyze()
    assert list(planner.diagram.corners.x) == pytest.approx([70.0, 90.0])
    r2 = pp.Route("water", T="20 degC", p="1 atm").isobar(T="120 degC")
    planner.route = r2
    assert planner.substance == "Water"
    assert [c.kind for c in planner.report.crossings] == ["vaporization"]
    assert list(planner.diagram.corners.x) == pytest.approx([293.15, 393.15])


def test_exports(co2, tmp_path):
    two_legs(co2)
    assert "download='crossings.csv'" in co2.downloads.value
    co2.save_table(tmp_path / "x.csv")
    text = (tmp_path / "x.csv").read_text()
    assert "condensation" in text and "p [bar]" in text
    path = co2.save_route(tmp_path / "route.json")
    assert pp.Route.from_dict(co2.route.to_dict()).corners() == co2.route.corners()
    from phasepath.io import load_route

    assert load_route(path).corners() == pytest.approx(co2.route.corners())
