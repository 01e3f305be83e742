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
* CO2 let down through a valve from 20 degC, 60 bar to 1 atm: the end temperature is the normal
  sublimation temperature of CO2, 194.686 K (Span & Wagner 1996, sublimation-pressure equation;
  from memory); the mass fraction of vapor follows from the enthalpy balance h_in = h_vapor -
  (1 - x) L_sub with h from CoolProp called directly and L_sub = 25.2 kJ/mol = 573 kJ/kg (CRC
  Handbook of Chemistry and Physics, enthalpies of phase transition; from memory, +-2 %).
* CO2 sealed at 600 kg/m3: states, the liquid-full temperature (saturated-liquid density = fill
  density) and isentropic compression end states from CoolProp (Span & Wagner 1996 EOS) called
  directly, not through phasepath.
* Everything else is compared with what the core computes for the same route (the widget must
  show the core's numbers, not its own).
"""

from __future__ import annotations

import html
import math
import subprocess
import sys

import numpy as np
import pytest

import phasepath as pp
from phasepath import format as F

W = pytest.importorskip("ipywidgets")
pytest.importorskip("bqplot")

from phasepath.widgets import RoutePlanner  # noqa: E402


def click(planner: RoutePlanner, x: float, y: float, view: str = "pT", **keys: object) -> None:
    """What the page sends for a click at (x, y) in display units: one message with its pixel
    (at whole pixels, as browsers report them), handled as ipyevents hands it over."""
    canvas = planner.canvases[view]
    canvas._dom_click(canvas.page_event(x, y, **keys))


def drag(planner: RoutePlanner, index: int, x: float, y: float, view: str = "pT") -> None:
    """What the page sends at the end of a drag of corner ``index``: the mark's point moved
    (the state update) and the drag-end message with the point."""
    canvas = planner.canvases[view]
    k = canvas._index.index(index)
    s = canvas.corners
    xs, ys = np.array(s.x, dtype=float), np.array(s.y, dtype=float)
    xs[k], ys[k] = x, y
    with s.hold_sync(), s.hold_trait_notifications():
        s.x, s.y = xs, ys
    planner._page_drag_end(view, {"event": "drag_end", "index": k, "point": {"x": x, "y": y}})


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
    # clicks snap to round values at the zoom, kept as typed text in the user's units
    assert r.legs[0].given == {"p": "40 bar"} and r.legs[1].given == {"T": "20 degC"}


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
    assert "condensation" in html and "vaporization" in html
    assert F.pressure(rep.crossings[0].p, "bar") in html  # the display policy's digits
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
    co2._page_drag("pT", {"event": "drag", "index": 2, "point": {"x": 0.0, "y": 40.0}})
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
    # the field shows the route being analysed; what was typed is shown beside it, marked
    assert row.T.value == "20.00" and "warm" in row.error.value
    assert "pp-rejected" in row.T._dom_classes and "keeps 20.00" in row.error.value
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
    co2.diagram.set_window(200.0, 300.0, 1e5, 1e11)
    click(co2, -23.15, 1e5)  # 100 kbar: above the highest pressure of CO2's models
    assert len(co2.route.legs) == 0 and "bar" in co2.message
    assert len(co2.diagram.corners.x) == 1  # nothing of the refused point is drawn


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
    # the links are built on request, not on every refresh
    assert "download=" not in co2.downloads.value
    co2.files_btn.click()
    assert "download='crossings.csv'" in co2.downloads.value
    assert "download='route.json'" in co2.downloads.value
    drag(co2, 2, 25.0, 40.0)  # the route changes: the old links are withdrawn
    assert "download=" not in co2.downloads.value
    co2.save_table(tmp_path / "x.csv")
    text = (tmp_path / "x.csv").read_text()
    assert "condensation" in text and "p [bar]" in text
    path = co2.save_route(tmp_path / "route.json")
    assert pp.Route.from_dict(co2.route.to_dict()).corners() == co2.route.corners()
    from phasepath.routefile import load_route

    assert np.ravel(load_route(path).corners()) == pytest.approx(np.ravel(co2.route.corners()))


def test_report_button_offers_the_review_report(co2):
    import base64
    import re

    two_legs(co2)
    co2.report_btn.click()
    (link,) = re.findall(
        r"download='report.html' href='data:text/html;base64,([^']+)'", co2.downloads.value
    )
    page = base64.b64decode(link).decode("utf-8")
    assert "Crossings" in page and "condensation" in page and "<svg" in page
    assert f"phasepath: <code>{pp.__version__}</code>" in page  # provenance
    for caution in co2.report.cautions:  # the same cautions as every other surface
        assert html.escape(caution, quote=False) in page or caution in page
    drag(co2, 2, 25.0, 40.0)  # the route changes: the old link is withdrawn
    assert "download=" not in co2.downloads.value


# -- new leg kinds, hazards, fractions ----------------------------------------------------------
def test_valve_letdown_lands_on_the_eos_end_state_and_draws_its_true_path(co2):
    CP = pytest.importorskip("CoolProp.CoolProp")
    click(co2, 20.0, 60.0)  # liquid CO2 at 20 degC, 60 bar
    co2.leg_kind = "isenthalp"
    click(co2, 0.0, 1.01325)  # the click sets only the pressure: 1 atm
    (leg,) = co2.route.legs
    assert leg.kind == "isenthalp" and leg.given == {"p": "1 atm"}  # snapped to 1 atm
    rep = co2.report
    T_end, p_end = co2.route.corners()[1]
    # the corner is where the EOS puts it, not where the mouse was (0 degC)
    assert T_end == pytest.approx(194.686, abs=0.02)  # Span & Wagner 1996 (from memory)
    assert co2.diagram.corners.x[1] == pytest.approx(T_end - 273.15, abs=1e-9)
    end = rep.legs[0].end
    assert end.phase == "solid+vapor"
    h_in = CP.PropsSI("H", "T", 293.15, "P", 60e5, "CO2")
    gas = CP.AbstractState("HEOS", "CO2")
    gas.specify_phase(CP.iphase_gas)
    gas.update(CP.PT_INPUTS, p_end, T_end)
    x_expected = 1.0 - (gas.hmass() - h_in) / 573e3  # CRC, from memory
    assert end.vapor_fraction == pytest.approx(x_expected, abs=0.01)
    assert end.solid_fraction == pytest.approx(1.0 - end.vapor_fraction, abs=1e-9)
    # the tables show the detail, the hazard flag and the fractions
    assert [c.kind for c in rep.crossings] == ["vaporization", "deposition"]
    html = co2.results.value
    assert "bubble point: vapor starts to form" in html
    assert html.count("⚠ solid-formation") == 1
    assert f"<td class='pp-c-xv num'>{F.fraction(end.vapor_fraction)}</td>" in html
    assert f"<td class='pp-c-xs num'>{F.fraction(end.solid_fraction)}</td>" in html
    assert co2.cautions.value.count("Dry ice can plug lines") == 1
    # the line follows the leg: through the bubble point and the triple point, and on the
    # vapor-pressure curve (CoolProp, directly) while the state is liquid + vapor
    xs, ys = np.array(co2.diagram.route_line.x), np.array(co2.diagram.route_line.y)
    assert len(xs) > 20
    T_b, p_b = rep.crossings[0].T - 273.15, rep.crossings[0].p / 1e5
    assert np.any(np.isclose(xs, T_b, atol=1e-9) & np.isclose(ys, p_b, rtol=1e-12))
    T_t = 216.592  # CO2 triple point, Span & Wagner 1996 (from memory)
    wet = [
        (T + 273.15, p * 1e5)
        for T, p in zip(xs, ys, strict=True)
        if T_t + 0.05 < T + 273.15 < rep.crossings[0].T - 0.01
    ]
    assert len(wet) > 10
    for T, p in wet:
        assert p == pytest.approx(CP.PropsSI("P", "T", T, "Q", 0, "CO2"), rel=1e-4)
    # below the triple point it runs down the sublimation curve to the corner
    assert xs[-1] == pytest.approx(T_end - 273.15) and ys[-1] == pytest.approx(p_end / 1e5)
    assert np.all(np.diff(ys) <= 1e-12)  # a valve only lets the pressure fall


def test_sealed_vessel_by_fill_density_flags_liquid_full(co2):
    CP = pytest.importorskip("CoolProp.CoolProp")
    co2.start_T.value, co2.start_p.value = "-20", "600 kg/m3"  # a fill density, not a pressure
    co2.start_btn.click()
    assert co2.route.start.given == {"T": "-20 degC", "density": "600 kg/m3"}
    assert co2.route.start.p == pytest.approx(
        CP.PropsSI("P", "T", 253.15, "D", 600, "CO2"), rel=1e-6
    )
    co2.leg_kind = "isochore"
    click(co2, 40.0, 3.0)  # the click sets only the temperature
    assert co2.route.legs[0].given == {"T": "40 degC"}
    T1, p1 = co2.route.corners()[1]
    assert T1 == pytest.approx(313.15)
    assert p1 == pytest.approx(CP.PropsSI("P", "T", 313.15, "D", 600, "CO2"), rel=1e-6)
    full = co2.report.crossings[0]
    assert full.from_phase == "liquid+vapor" and full.to_phase == "liquid"
    assert full.T == pytest.approx(CP.PropsSI("T", "D", 600, "Q", 0, "CO2"), abs=1e-3)
    kinds = [h.kind for h in co2.report.legs[0].hazards]
    assert "liquid-full" in kinds and "sealed-pressure" in kinds
    assert "liquid-full" in co2.results.value
    assert "A liquid-full vessel can burst" in co2.cautions.value
    # the drawn line passes the liquid-full point on the vapor-pressure curve
    xs = np.array(co2.diagram.route_line.x)
    assert np.any(np.isclose(xs, full.T - 273.15, atol=1e-9))
    # the leg list: both fields of a constant-volume corner take a value; a pressure switches
    # its target to the end pressure
    row = co2.legs.rows[1]
    assert not row.T.disabled and not row.p.disabled
    row.p.value = "80"
    assert co2.route.legs[0].given == {"p": "80 bar"}
    assert co2.route.corners()[1][1] == pytest.approx(80e5, rel=1e-9)


def test_event_legs_from_the_ends_control():
    iapws = pytest.importorskip("iapws")
    w = RoutePlanner("water", T_unit="degC", p_unit="kPa")
    w.add_corner(20, 101.325)
    w.leg_kind, w.until = "isobar", "fully vapor"
    click(w, 60.0, 101.325)  # the event ends the leg, not the click
    w.until = "5 K superheat"
    click(w, 60.0, 101.325)
    T_sat = iapws.IAPWS95(P=0.101325, x=1.0).T  # IAPWS-95, via iapws
    (_, _), (T1, _), (T2, _) = w.route.corners()
    assert T1 == pytest.approx(T_sat, abs=1e-3)
    assert T2 == pytest.approx(T_sat + 5.0, abs=1e-3)
    assert [leg.given for leg in w.route.legs] == [
        {"until": "fully vapor"},
        {"until": "5 K superheat"},
    ]
    assert "until fully vapor" in w.legs.rows[1].label.value
    assert "<td class='pp-c-ends'>fully vapor at T =" in w.results.value
    assert w.report.legs[0].end.phase == "vapor"
    # an event cannot end a constant-enthalpy leg: refused plainly, nothing drawn is lost
    w.leg_kind = "isenthalp"
    w.until = "fully vapor"  # ignored for kinds other than constant p and constant T
    click(w, 60.0, 50.0)
    assert w.route.legs[-1].kind == "isenthalp"


def test_legs_typed_in_the_leg_list(co2):
    CP = pytest.importorskip("CoolProp.CoolProp")
    co2.add_corner("20 degC", "10 bar")
    add = co2.legs
    add.add_kind.value, add.add_target.value = "isentrope", "80"  # bare: display unit (bar)
    add.add_btn.click()
    assert add.add_error.value == "" and add.add_target.value == ""
    s0 = CP.PropsSI("S", "T", 293.15, "P", 10e5, "CO2")
    assert co2.route.corners()[1][0] == pytest.approx(
        CP.PropsSI("T", "P", 80e5, "S", s0, "CO2"), abs=1e-3
    )
    assert co2.report.legs[0].kind == "isentrope"
    assert "isentrope" in co2.results.value
    # a typed event, and a bad target that is refused with the value named
    add.add_kind.value, add.add_target.value = "isobar", "until 5 K superheat"
    add.add_btn.click()
    assert "superheat" in add.add_error.value  # 80 bar is above the critical pressure
    assert len(co2.route.legs) == 1
    add.add_kind.value, add.add_target.value = "isochore", "warm"
    add.add_btn.click()
    assert "warm" in add.add_error.value and add.add_target.value == "warm"
    assert co2.add_leg("isenthalp", "20 bar") == ""
    assert co2.route.legs[-1].kind == "isenthalp" and co2.route.legs[-1].p == pytest.approx(20e5)
    # the constant-h corner's temperature comes from the EOS: its T field is read-only
    assert co2.legs.rows[2].T.disabled and not co2.legs.rows[2].p.disabled


def test_drag_moves_curved_corners_along_their_leg(co2):
    click(co2, 20.0, 60.0)
    co2.leg_kind = "isenthalp"
    click(co2, 0.0, 10.0)
    co2.leg_kind = "isobar"
    click(co2, 30.0, 10.0)
    T1 = co2.route.corners()[1][0]
    drag(co2, 1, 50.0, 20.0)  # the mouse's temperature is not the leg's to take
    (_, _), (T1b, p1b), (T2b, p2b) = co2.route.corners()
    assert p1b == pytest.approx(20e5) and p2b == pytest.approx(20e5)  # the isobar followed
    assert T1b != pytest.approx(T1) and T1b != pytest.approx(323.15)
    assert co2.report == co2.route.copy().analyze()
    assert co2.diagram.corners.x[1] == pytest.approx(T1b - 273.15)


def test_spec_edits_keep_curved_and_event_legs_true():
    from phasepath.widgets import drawing as _spec

    spec = _spec.from_route(
        pp.Route("CO2", T="20 degC", p="60 bar").isenthalp(p="10 bar").isobar(T="30 degC")
    )
    with pytest.raises(pp.errors.RouteError, match="isenthalp"):
        _spec.move_corner(spec, 1, T_text="0 degC")  # typed: refused with the reason
    moved = _spec.move_corner(spec, 2, "40 degC", "20 bar")  # the isobar's p is the valve's
    assert moved["legs"] == [
        {"kind": "isenthalp", "p": "20 bar"},
        {"kind": "isobar", "T": "40 degC"},
    ]
    # deleting the start: the valve's two-phase end becomes the start, by its density
    new = _spec.delete_corner(spec, 0)
    assert set(new["start"]) == {"T", "density"}
    assert _spec.corners(new)[0] == pytest.approx(_spec.corners(spec)[1], rel=1e-9)
    ev = _spec.from_route(pp.Route("water", T="20 degC", p="1 atm").isobar(until="fully vapor"))
    assert _spec.move_corner(ev, 1, T_text="120 degC")["legs"] == [
        {"kind": "isobar", "T": "120 degC"}
    ]
    dragged = _spec.move_corner(ev, 1, "120 degC", "2 atm")  # a drag keeps the event
    assert dragged["legs"] == [{"kind": "isobar", "until": "fully vapor"}]
    assert dragged["start"]["p"] == "2 atm"


# -- custom substances -------------------------------------------------------------------------
def test_custom_substances_in_the_picker_and_drawn_without_triple_or_critical(co2):
    # invented demo data: a solvent known only between 300 K and 350 K
    short = pp.Substance.from_data(
        "demo solvent A", vapor_points=[(300.0, 5e3), (320.0, 1.2e4), (350.0, 4e4)]
    )
    assert math.isnan(short.triple[0]) and math.isnan(short.critical[0])
    co2.picker.value = "CO2"  # any refresh offers the substances built since
    co2.clear()
    assert "demo solvent A" in co2.picker.options
    co2.picker.value = "demo solvent A"
    assert co2.substance == "demo solvent A" and co2.message == ""
    d = co2.diagram
    assert len(d.triple.x) == 0 and len(d.critical.x) == 0  # no point drawn where none is given
    assert len(d.curves) == 1 and len(d.curves[0].x) >= 2
    T_lo, T_hi, p_lo, p_hi = d.window()
    assert all(math.isfinite(v) for v in (T_lo, T_hi, p_lo, p_hi)) and T_lo <= 300.0 < 350.0 <= T_hi
    assert co2.add_corner("310 K", "1 kPa") == ""  # vapor
    assert co2.add_corner("310 K", "50 kPa", kind="isotherm") == ""
    assert [c.kind for c in co2.report.crossings] == ["condensation"]


def test_custom_curve_beyond_its_data_is_dotted():
    bridged = pp.Substance.from_data(  # invented demo data, bridged to given end points
        "demo solvent B",
        triple=(180.0, None),
        critical=(560.0, 4.5e6),
        vapor_points=[(300.0, 5e3), (350.0, 4e4)],
    )
    planner = RoutePlanner(bridged, T_unit="K", p_unit="kPa")
    lo, hi = bridged.vapor.T_valid
    pieces = [
        (line.line_style, float(min(line.x)), float(max(line.x))) for line in planner.diagram.curves
    ]
    assert ("solid", lo, hi) in [(s, pytest.approx(a), pytest.approx(b)) for s, a, b in pieces]
    dotted = [(a, b) for s, a, b in pieces if s == "dotted"]
    assert dotted == [
        (pytest.approx(180.0), pytest.approx(lo)),
        (pytest.approx(hi), pytest.approx(560.0)),
    ]
    assert "beyond the data" in planner.legend.value
    planner.substance = "CO2"  # reference curves: no dotted piece, no key
    assert all(line.line_style != "dotted" for line in planner.diagram.curves)
    assert "beyond the data" not in planner.legend.value


# -- speed-related behaviour (the figures are in benchmarks/run.py) ---------------------------
def test_curve_marks_are_kept(co2):
    curves = list(co2.diagram.curves)
    marks = list(co2.diagram.figure.marks)
    two_legs(co2)
    drag(co2, 1, -40.0, 30.0)
    assert co2.diagram.curves == curves and list(co2.diagram.figure.marks) == marks
    co2.substance = "water"  # another substance reuses the same Lines
    assert co2.diagram.curves[: len(curves)] == curves[: len(co2.diagram.curves)]


def test_no_sublimation_strip_is_labelled() -> None:
    """Below the triple point of a fluid with no published sublimation curve the diagram says
    so plainly (issue rule), and shows no solid region there; CO2 has Span & Wagner's curve."""
    from phasepath.substances import NO_SUBLIMATION
    from phasepath.widgets.diagram import PhaseDiagram

    d = PhaseDiagram("K", "bar")
    d.set_substance(pp.substance("R134a"))  # (ammonia has published curves now)
    assert list(d.strip_note.text) == [NO_SUBLIMATION]
    assert float(d.strip_note.x[0]) < pp.substance("R134a").triple[0]
    assert "SOLID" not in list(d.regions.text)
    d.set_substance(pp.substance("CO2"))
    assert list(d.strip_note.text) == []
    assert "SOLID" in list(d.regions.text)


def test_legend_lists_only_the_curves_drawn() -> None:
    """R-134a has neither a melting line in CoolProp nor a published sublimation curve (common
    practice: only curves on the diagram appear in its legend); CO2 has all three."""
    ammonia = pp.widgets.RoutePlanner("R134a")  # (ammonia has published curves now)
    assert "vapor pressure" in ammonia.legend.value
    assert "melting" not in ammonia.legend.value and "sublimation" not in ammonia.legend.value
    co2 = pp.widgets.RoutePlanner("CO2")
    assert "melting" in co2.legend.value and "sublimation" in co2.legend.value


# -- round 2: three linked views, readout, nothing lost, documents -------------------------------
# Check values of this part: states from the reference library CoolProp (Span & Wagner 1996 for
# CO2), called directly through PropsSI, not through phasepath; 1 atm = 101325 Pa (definition,
# common practice); everything else is compared with what the core computes for the same route.


def test_figures_are_the_three_views(co2):
    bq = pytest.importorskip("bqplot")
    assert list(co2.figures) == ["pT", "ph", "Ts"]
    assert all(isinstance(f, bq.Figure) for f in co2.figures.values())
    assert co2.figures["pT"] is co2.diagram.figure
    assert co2.canvases["ph"].ay.label == "Pressure [bar]"
    assert co2.canvases["ph"].ax.label == "Specific enthalpy [kJ/kg]"
    assert co2.canvases["Ts"].ax.label == "Specific entropy [kJ/(kg K)]"
    assert isinstance(co2.canvases["ph"].sy, bq.LogScale)  # log pressure on p-h
    co2.energy_unit = "Btu/lb"
    assert co2.canvases["Ts"].ax.label == "Specific entropy [Btu/(lb °R)]"


def test_crossings_are_drawn_above_the_corners(co2):
    for c in co2.canvases.values():
        marks = list(c.figure.marks)
        assert marks.index(c.crossings) > marks.index(c.corners)


def test_a_corner_dragged_on_ph_moves_in_every_view(co2):
    CP = pytest.importorskip("CoolProp.CoolProp")
    co2.route = pp.Route("CO2", T="20 degC", p="60 bar").isenthalp(p="10 bar").isobar(T="30 degC")
    ph = co2.canvases["ph"]
    k = ph._index.index(1)
    h1 = ph.drawn[k][0]
    drag(co2, 1, h1, 20.0, view="ph")  # the valve's end pressure: 20 bar; the valve holds h
    (_, _), (T1, p1), (T2, p2) = co2.route.corners()
    assert p1 == pytest.approx(20e5) and p2 == pytest.approx(20e5)  # the isobar follows
    h0 = CP.PropsSI("H", "T", 293.15, "P", 60e5, "CO2")
    end = co2.route.legs[0].state  # the valve's outlet
    assert end.h == pytest.approx(h0, rel=1e-6)
    # every view shows the new corner: P-T at (T, p), p-h at (h, p), T-s at (s, T)
    assert co2.diagram.drawn[1] == pytest.approx((T1 - 273.15, 20.0))
    assert ph.drawn[1] == pytest.approx((end.h / 1e3, 20.0))
    assert co2.canvases["Ts"].drawn[1] == pytest.approx((end.s / 1e3, T1 - 273.15))
    assert co2.selected == 1  # the dragged corner is selected in all views
    assert all(len(c.selected.x) == 1 for c in co2.canvases.values())


def test_clicks_on_ph_draw_a_valve_and_an_isobar(co2):
    CP = pytest.importorskip("CoolProp.CoolProp")
    click(co2, 250.0, 60.0, view="ph")  # the start: h = 250 kJ/kg at 60 bar
    T0 = CP.PropsSI("T", "P", 60e5, "H", 250e3, "CO2")
    assert co2.route.start.p == 60e5
    assert co2.route.start.T == pytest.approx(T0, abs=0.051)  # to the drawing's 0.1 K
    click(co2, 250.0, 1.01325, view="ph")  # straight down on p-h: "auto" gives a valve
    assert [leg.kind for leg in co2.route.legs] == ["isenthalp"]
    assert co2.route.legs[0].given == {"p": "1 atm"}
    end = co2.report.legs[0].end
    assert end.phase == "solid+vapor" and end.h == pytest.approx(co2.report.legs[0].start.h)
    click(co2, 500.0, 1.01325, view="ph")  # across: an isobar at 1 atm to h = 500 kJ/kg
    leg = co2.route.legs[1]
    assert leg.kind == "isobar" and leg.p == pytest.approx(101325.0)
    T_h = CP.PropsSI("T", "P", 101325.0, "H", 500e3, "CO2")
    assert leg.T == pytest.approx(T_h, abs=0.051)


def test_clicks_on_Ts_draw_a_compressor_and_an_isotherm(co2):
    CP = pytest.importorskip("CoolProp.CoolProp")
    co2.add_corner("-20 degC", "10 bar")
    s0 = co2.report.legs[0].start.s if co2.report else None
    s0 = CP.PropsSI("S", "T", 253.15, "P", 10e5, "CO2") / 1e3
    click(co2, s0, 60.0, view="Ts")  # straight up on T-s: an ideal compressor to 60 °C
    leg = co2.route.legs[0]
    assert leg.kind == "isentrope"
    p_exp = CP.PropsSI("P", "T", 333.15, "S", s0 * 1e3, "CO2")
    assert leg.p == pytest.approx(p_exp, rel=2e-3)  # the end pressure at drawing precision
    click(co2, s0 - 0.4, 60.0, view="Ts")  # across: an isotherm at the compressor's end T
    assert co2.route.legs[1].kind == "isotherm"
    assert co2.route.legs[1].T == co2.route.legs[0].T


def test_readout_under_the_cursor_in_every_view(co2):
    CP = pytest.importorskip("CoolProp.CoolProp")
    h_l, h_v = (CP.PropsSI("H", "P", 20e5, "Q", q, "CO2") for q in (0, 1))
    h = 0.4 * h_l + 0.6 * h_v
    text = co2.readout_text("ph", h, 20e5)
    assert "liquid+vapor" in text and F.fraction(0.6) in text
    assert "−19.50" in text  # CO2 boils at -19.50 °C at 20 bar (Span & Wagner 1996; from memory)
    pT = co2.readout_text("pT", 250.0, 20e5)
    h_pT = CP.PropsSI("H", "T", 250.0, "P", 20e5, "CO2")
    assert "liquid" in pT and F.quantity(h_pT, "energy", "kJ/kg") in pT
    assert "solid" in co2.readout_text("Ts", -200.0, 190.0)
    # the page's pointer moves (throttled there) write the readout under each figure
    ph = co2.canvases["ph"]
    x0, x1, y0, y1 = ph.shown_window()
    co2._page_move("ph", ph.page_event(h / 1e3, 20.0, type="mousemove"))
    assert "liquid+vapor" in ph.readout.value
    ph._dom_click({"type": "mouseleave"})
    assert "liquid" not in ph.readout.value
    co2._page_move("ph", {"type": "mousemove", "relativeX": float("nan")})  # never raises


def test_every_corner_shows_its_state_in_the_leg_list(co2):
    co2.route = pp.Route("CO2", T="20 degC", p="60 bar").isenthalp(p="1 atm")
    end = co2.report.legs[0].end
    state = co2.legs.rows[1].state.value
    assert "solid+vapor" in state
    assert F.quantity(end.h, "energy", "kJ/kg").replace("-", "−") in state
    assert F.quantity(end.rho, "density", "kg/m3") in state
    assert f"vapor {F.fraction(end.vapor_fraction)}" in state
    assert f"solid {F.fraction(end.solid_fraction)}" in state


def test_clicks_snap_to_round_values_unless_a_modifier_is_held(co2):
    click(co2, 20.6, 0.985)  # near 20 °C and 1 atm at the default zoom
    assert co2.route.start.given == {"T": "20 degC", "p": "1 atm"}
    co2.clear()
    click(co2, 20.6, 0.985, shiftKey=True)  # Shift: the point itself, at drawing precision
    given = co2.route.start.given
    assert given["T"] != "20 degC" and given["p"] != "1 atm"
    assert abs(float(given["T"].split()[0]) - 20.6) < 0.5
    co2.clear()
    click(co2, 20.6, 0.985, altKey=True)
    assert co2.route.start.given["p"] != "1 atm"


def test_ten_quick_clicks_give_ten_corners_in_order(co2):
    co2.leg_kind = "isobar"
    click(co2, -40.0, 10.0)
    Ts = [-30.0 + 5.0 * k for k in range(9)]
    for T in Ts:  # each click its own message, handled in the order it was sent
        click(co2, T, 10.0)
    assert len(co2.route.corners()) == 10
    assert [round(T - 273.15, 6) for T, _ in co2.route.corners()[1:]] == Ts
    assert len(co2.diagram.corners.x) == 10 and len(co2.legs.rows) == 10


def test_a_refused_click_leaves_nothing_and_the_next_is_taken(co2):
    co2.add_corner("-20 degC", "10 bar")
    co2.leg_kind = "isotherm"
    co2.diagram.set_window(200.0, 300.0, 1e4, 1e11)
    click(co2, -20.0, 50000.0)  # 50 kbar: beyond CO2's models
    assert co2.message and len(co2.diagram.corners.x) == 1
    click(co2, -20.0, 50.0)
    assert len(co2.route.legs) == 1 and co2.message == ""


def test_rejected_entry_then_a_valid_one_clears_its_mark(co2):
    two_legs(co2)
    row = co2.legs.rows[2]
    row.T.value = "1+1 degC"  # not one number and one unit: refused, named
    assert "1+1 degC" in row.error.value and "not one number and one unit" in row.error.value
    assert row.T.value == "20.00"  # the route being analysed
    assert "⚠" in co2.status.value
    row.T.value = "25"
    assert co2.route.legs[1].T == pytest.approx(298.15)
    assert row.error.value == "" and "pp-rejected" not in row.T._dom_classes
    assert "⚠" not in co2.status.value and co2.message == ""


def test_substance_switch_clears_stale_messages(co2):
    two_legs(co2)
    co2.legs.rows[1].p.value = "warm"
    co2.legs.add_kind.value, co2.legs.add_target.value = "isochore", "cold"
    co2.legs.add_btn.click()
    assert co2.legs.rows[1].error.value and co2.legs.add_error.value
    co2.substance = "water"
    assert co2.legs.rows[1].error.value == "" and co2.legs.add_error.value == ""
    assert co2.route is not None and co2.message == ""


def test_typed_values_follow_the_core_rules(co2):
    co2.add_corner("\u221220 degC", "1 barg")  # the Unicode minus, a gauge pressure
    assert co2.route.start.T == pytest.approx(253.15)
    assert co2.route.start.p == pytest.approx(1e5 + 101325.0)
    assert co2.add_leg("isotherm", "ambient") == ""
    assert co2.route.legs[0].p == 101325.0
    msg = co2.add_leg("isobar", "5 bar")
    assert "'5 bar' is a pressure, not a temperature" in msg


def test_error_and_hazard_text_in_the_display_units(co2):
    co2.add_corner("-20 degC", "10 bar")
    msg = co2.add_leg("isobar", "2500 degC")  # above CO2's models (2000 K)
    assert "K" not in msg.split("valid")[0] or msg
    shown = co2.status.value
    assert "°C" in shown and "2000 K" not in shown
    assert "1726.850 °C" in shown  # 2000 K, in the display unit at 0.001 K
    co2.route = pp.Route("CO2", T="20 degC", p="60 bar").isenthalp(p="1 atm")
    assert co2.cautions.value and " K " not in co2.cautions.value


def test_route_documents_title_notes_files(co2, tmp_path):
    co2.route = pp.Route("CO2", T="20 degC", p="60 bar", title="vent V-3").isenthalp(p="1 atm")
    assert co2.title_field.value == "vent V-3"
    co2.title_field.value = "vent V-3, revised"
    co2.notes_field.value = "window: vessel above 30 °C"
    assert co2.route.title == "vent V-3, revised"
    assert co2.route.notes == "window: vessel above 30 °C"
    path = co2.save_route(tmp_path / "v3.yaml")
    other = RoutePlanner("water")
    back = other.load_route(path)
    assert other.route is not None and other.substance == "CarbonDioxide"
    assert back.title == "vent V-3, revised" and other.notes_field.value == back.notes
    assert np.ravel(other.route.corners()) == pytest.approx(np.ravel(co2.route.corners()))
    co2.undo()  # the notes are an edit like any other
    assert co2.route.notes == ""


def test_route_file_upload_opens_the_route(co2, tmp_path):
    from phasepath.routefile import dumps_route

    text = dumps_route(pp.Route("water", T="20 degC", p="1 atm").isobar(T="120 degC"), "json")
    co2.upload.value = (_upload("boil.json", text.encode()),)
    assert co2.substance == "Water" and [c.kind for c in co2.report.crossings] == ["vaporization"]
    co2.upload.value = (_upload("bad.json", b"{not json"),)
    assert "bad.json" in co2.message and co2.substance == "Water"


def test_picker_shows_plain_names_with_formula_and_pure_substances_only(co2):
    options = list(co2.picker.options)
    assert "carbon dioxide (CO2)" in options and "water (H2O)" in options
    assert not any(o.startswith(("R410A", "R404A", "air")) for o in options)  # blends
    assert co2.picker.value == "carbon dioxide (CO2)"
    co2.picker.value = "water (H2O)"
    assert co2.substance == "Water" and co2.picker.value == "water (H2O)"


def test_quality_start_field(co2):
    """A start by quality lies on the vapor-pressure curve: at -20 degC the CO2 vapor pressure
    (CoolProp, Span & Wagner 1996, called directly) and the typed vapor fraction."""
    CP = pytest.importorskip("CoolProp.CoolProp")
    co2.start_T.value, co2.start_p.value, co2.start_q.value = "-20 degC", "", "0.3"
    co2.start_btn.click()
    start = co2.route.start.state
    assert start.vapor_fraction == pytest.approx(0.3)
    assert start.p == pytest.approx(CP.PropsSI("P", "T", 253.15, "Q", 0.3, "CO2"), rel=1e-9)
    assert co2.route.to_dict()["start"] == {"T": "-20 degC", "quality": "0.3"}
    for bad in ("1.5", "abc"):  # refused by the core, named, and the route stays as it was
        co2.start_q.value = bad
        co2.start_btn.click()
        assert "⚠" in co2.start_msg.value and repr(bad) in html.unescape(co2.start_msg.value)
        assert co2.route.start.state.vapor_fraction == pytest.approx(0.3)


def test_log_axes_have_one_tick_format(co2):
    for c in (co2.diagram, co2.canvases["ph"]):
        values, fmt = list(c.ay.tick_values), c.ay.tick_format
        assert fmt in ("~f", ".0e") and values
        assert all(math.log10(v) == pytest.approx(round(math.log10(v))) for v in values)
    water = RoutePlanner("water", p_unit="Pa")
    assert water.diagram.ay.tick_format == ".0e"  # 20 Pa to 660 MPa: powers of ten for all


@pytest.mark.parametrize("name", ["CO2", "water", "helium", "nitrogen"])
def test_region_and_point_labels_sit_inside_the_plot(name):
    pl = RoutePlanner(name, T_unit="K", p_unit="bar")
    for c in pl.canvases.values():
        x0, x1, y0, y1 = c.shown_window()
        for x, y in zip(c.regions.x, c.regions.y, strict=True):
            assert x0 < x < x1 and y0 < y < y1
    assert list(pl.diagram.point_labels.text) == ["triple point", "critical point"]
    assert "LIQUID" in list(pl.diagram.regions.text)


def test_fit_gives_the_high_pressure_ices_room():
    pl = RoutePlanner("water", T_unit="degC", p_unit="MPa")
    pl.route = pp.Route("water", T="-20 degC", p="1 bar").isotherm(p="300 MPa")
    T0, T1, p0, p1 = pl.diagram.window()
    assert p1 > 350e6 and p0 > 1e3  # the ice III field (208 to 350 MPa) is not a sliver
    assert math.log10(p1 / p0) < 5.0
    assert "ICE III" in list(pl.diagram.regions.text)


def _upload(name: str, data: bytes) -> dict[str, object]:
    """One file as the upload control holds it after the page sent it."""
    import datetime

    return {
        "name": name,
        "type": "application/json",
        "size": len(data),
        "content": memoryview(data),
        "last_modified": datetime.datetime(2024, 1, 1, tzinfo=datetime.timezone.utc),
    }
