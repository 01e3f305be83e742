"""End to end: draw a two-leg CO2 route with the mouse in a real browser and read the crossings.

Voila serves a notebook with an empty planner; headless chromium clicks three points on the
diagram (start, then straight up, then straight right: the planner's "auto" kind makes the first
leg an isotherm and the second an isobar) and the test reads the crossings table in the page.

Check values: the saturation pressure and temperature of CO2 at the clicked conditions from the
reference library CoolProp (Span & Wagner 1996 equation of state), called here directly, not
through phasepath; and, for the first crossing, CO2's vapor pressure at -30 degC, 14.28 bar
(Span & Wagner 1996, J. Phys. Chem. Ref. Data 25, 1509, Table 34: 1.4278 MPa at 243.15 K; from
memory), within the width of one pixel of the click.
"""

from __future__ import annotations

import math
import re
import time

import pytest

pytestmark = pytest.mark.browser

_CALIBRATE = """() => {
  // Each tick's screen position is the translation of its own coordinate system; along an axis
  // only one of the two coordinates changes from tick to tick.
  const fig = document.querySelector('.pp-diagram');
  const out = {x: [], y: []};
  for (const axis of fig.querySelectorAll('svg.svg-background g.axis')) {
    const ticks = [];
    for (const tick of axis.querySelectorAll('g.tick')) {
      const label = tick.querySelector('text');
      if (!label || !label.textContent.trim()) continue;
      const m = tick.getScreenCTM();
      ticks.push({text: label.textContent, e: m.e, f: m.f});
    }
    if (ticks.length < 2) continue;
    const spreadE = Math.max(...ticks.map(t => t.e)) - Math.min(...ticks.map(t => t.e));
    const spreadF = Math.max(...ticks.map(t => t.f)) - Math.min(...ticks.map(t => t.f));
    const key = spreadE > spreadF ? 'x' : 'y';
    for (const t of ticks) out[key].push({text: t.text, px: key === 'x' ? t.e : t.f});
  }
  const area = fig.querySelector('svg.svg-figure rect.plotarea_events').getBoundingClientRect();
  out.area = {left: area.left, top: area.top, width: area.width, height: area.height};
  return out;
}"""


def _number(text: str) -> float:
    return float(text.replace("\u2212", "-").replace("−", "-"))


def _fit(points: list[tuple[float, float]]) -> tuple[float, float]:
    """Least squares value = a + b * pixel."""
    n = len(points)
    mx = sum(p for p, _ in points) / n
    my = sum(v for _, v in points) / n
    b = sum((p - mx) * (v - my) for p, v in points) / sum((p - mx) ** 2 for p, _ in points)
    return my - b * mx, b


def _rows(page, selector: str = "table.pp-crossings tr.pp-crossing") -> list[dict[str, str]]:
    """The rows of a results table, each cell keyed by its column (its ``pp-c-<key>`` class)."""
    return page.eval_on_selector_all(
        selector,
        "rows => rows.map(r => Object.fromEntries(Array.from(r.querySelectorAll('td')).map("
        "td => [Array.from(td.classList).find(c => c.startsWith('pp-c-')).slice(5), "
        "td.textContent])))",
    )


def test_click_two_legs_shows_crossings(page, voila_url, artifacts):
    CP = pytest.importorskip("CoolProp.CoolProp")
    page.goto(voila_url, wait_until="domcontentloaded", timeout=120_000)
    page.wait_for_selector(".pp-diagram rect.plotarea_events", state="visible", timeout=120_000)
    page.wait_for_selector(".pp-diagram path.line", state="attached", timeout=30_000)
    page.wait_for_function(
        "() => document.querySelectorAll('.pp-diagram g.axis g.tick text').length > 6",
        timeout=30_000,
    )
    page.wait_for_timeout(300)  # let the last layout pass settle
    cal = page.evaluate(_CALIBRATE)
    ax, bx = _fit([(t["px"], _number(t["text"])) for t in cal["x"]])
    ay, by = _fit([(t["px"], math.log10(_number(t["text"]))) for t in cal["y"]])

    # ticks are drawn half a pixel past the scale's own position (bqplot), hence the 0.5
    def px_of(T_degC: float, p_bar: float) -> tuple[int, int]:
        return round((T_degC - ax) / bx - 0.5), round((math.log10(p_bar) - ay) / by - 0.5)

    def at(px: int, py: int) -> tuple[float, float]:
        return ax + bx * (px + 0.5), 10 ** (ay + by * (py + 0.5))

    # start: vapor at -30 degC, 5 bar; up to 40 bar (condensation); right to +20 degC
    # (vaporization at the 40 bar saturation temperature, about +5 degC)
    x0, y0 = px_of(-30.0, 5.0)
    _, y1 = px_of(-30.0, 40.0)
    x2, _ = px_of(20.0, 40.0)
    area = cal["area"]
    for x, y in ((x0, y0), (x0, y1), (x2, y1)):
        assert area["left"] < x < area["left"] + area["width"]
        assert area["top"] < y < area["top"] + area["height"]

    page.mouse.click(x0, y0)
    page.wait_for_function(
        "() => document.querySelectorAll('.pp-legs input').length >= 2", timeout=30_000
    )
    page.mouse.click(x0, y1)
    page.wait_for_function(
        "() => document.querySelectorAll('tr.pp-crossing').length >= 1", timeout=30_000
    )
    t_click = time.perf_counter()
    page.mouse.click(x2, y1)
    page.wait_for_function(
        "() => document.querySelectorAll('tr.pp-crossing').length >= 2", timeout=30_000
    )
    click_to_table = time.perf_counter() - t_click
    page.wait_for_timeout(250)
    page.screenshot(path=str(artifacts / "planner-co2-two-legs.png"), full_page=True)
    print(f"\nclick-to-table time (browser, Voila): {click_to_table * 1000:.0f} ms")

    rows = _rows(page)
    assert [r["leg"] for r in rows] == ["1", "2"]
    assert [r["kind"] for r in rows] == ["condensation", "vaporization"]

    # one pixel of the axes, in data units (the allowed error of a click)
    T_px = abs(bx)
    T_click, _ = at(x0, y0)
    _, p_click = at(x0, y1)
    logp_px = abs(by)

    # crossing 1: constant T at the clicked temperature, p on the vapor-pressure curve
    T1, p1 = _number(rows[0]["T"]), _number(rows[0]["p"])
    assert abs(T1 - T_click) <= T_px + 0.05
    p_sat = CP.PropsSI("P", "T", T1 + 273.15, "Q", 0, "CO2") / 1e5
    assert p1 == pytest.approx(p_sat, rel=1e-3)
    # Span & Wagner (1996) Table 34, 243.15 K: 1.4278 MPa (from memory); the click is within a
    # pixel of -30 degC, and dp/dT there is about 0.45 bar/K (common practice estimate)
    assert p1 == pytest.approx(14.278, abs=0.45 * (T_px + 0.1) + 0.02)

    # crossing 2: constant p at the clicked pressure, T on the vapor-pressure curve
    T2, p2 = _number(rows[1]["T"]), _number(rows[1]["p"])
    assert abs(math.log10(p2) - math.log10(p_click)) <= logp_px + 1e-3
    T_sat = CP.PropsSI("T", "P", p2 * 1e5, "Q", 0, "CO2") - 273.15
    assert T2 == pytest.approx(T_sat, abs=0.02)
    # latent heats are present and positive
    assert all(_number(r["latent"]) > 0 for r in rows)
    assert re.search(r"2 leg\(s\), 2 crossing\(s\)", page.inner_text(".pp-planner"))


def test_valve_letdown_draws_its_path_and_flags_dry_ice(page, voila_url, artifacts):
    """Liquid CO2 at 20 degC, 60 bar let down through a valve (constant h) to 1 atm: the corner
    lands at the sublimation temperature, the crossings table shows the bubble point and the
    dry-ice deposition with its hazard flag, and the line follows the saturation curve.

    Check value: the normal sublimation temperature of CO2, -78.46 degC (194.686 K; Span &
    Wagner 1996; from memory), within the pressure of one pixel of the click (the sublimation
    curve rises about 5.5 kPa/K there; common practice estimate)."""
    page.goto(voila_url, wait_until="domcontentloaded", timeout=120_000)
    page.wait_for_selector(".pp-diagram rect.plotarea_events", state="visible", timeout=120_000)
    page.wait_for_selector(".pp-diagram path.line", state="attached", timeout=30_000)
    page.wait_for_function(
        "() => document.querySelectorAll('.pp-diagram g.axis g.tick text').length > 6",
        timeout=30_000,
    )
    page.wait_for_timeout(300)
    cal = page.evaluate(_CALIBRATE)
    ax, bx = _fit([(t["px"], _number(t["text"])) for t in cal["x"]])
    ay, by = _fit([(t["px"], math.log10(_number(t["text"]))) for t in cal["y"]])

    def px_of(T_degC: float, p_bar: float) -> tuple[int, int]:
        return round((T_degC - ax) / bx - 0.5), round((math.log10(p_bar) - ay) / by - 0.5)

    x0, y0 = px_of(20.0, 60.0)
    x1, y1 = px_of(-20.0, 1.01325)
    page.mouse.click(x0, y0)
    page.wait_for_function(
        "() => document.querySelectorAll('.pp-legs input').length >= 2", timeout=30_000
    )
    page.get_by_role("button", name="constant h").click()
    page.mouse.click(x1, y1)
    page.wait_for_function(
        "() => document.querySelectorAll('tr.pp-crossing').length >= 2", timeout=30_000
    )
    page.wait_for_timeout(250)
    page.screenshot(path=str(artifacts / "planner-co2-valve-letdown.png"), full_page=True)

    rows = _rows(page)
    assert [r["kind"] for r in rows] == ["vaporization", "deposition"]
    assert "bubble point" in rows[0]["detail"]
    assert "solid-formation" in rows[1]["hazards"]
    p_click = 10 ** (ay + by * (y1 + 0.5))
    legs = _rows(page, "table.pp-legsum tr.pp-leg")
    assert (legs[0]["phase0"], legs[0]["phase1"]) == ("liquid", "solid+vapor")
    assert 0.0 < _number(legs[0]["xv"]) < 1.0 and 0.0 < _number(legs[0]["xs"]) < 1.0
    T_end = _number(page.eval_on_selector_all(".pp-legs input", "els => els[2].value"))
    dT = abs(p_click - 1.01325) * 1e5 / 5.5e3  # one pixel's pressure, in kelvin
    assert T_end == pytest.approx(-78.46, abs=dT + 0.05)
    # the line is drawn along the path (many points), not straight between the two corners
    n = page.evaluate(
        "() => Math.max(...Array.from(document.querySelectorAll('.pp-diagram path.line'))"
        ".map(p => (p.getAttribute('d') || '').split('L').length))"
    )
    assert n > 40
    assert "Dry ice can plug lines" in page.inner_text(".pp-planner")
