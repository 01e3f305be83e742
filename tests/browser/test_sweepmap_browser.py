"""End to end: a sweep map of an invented CO2 vent in headless chromium under Voila. Hovering a
marker shows its row; clicking it opens that point's route in a planner under the map.

Check value: the valve outlet at 1 atm is at CO2's normal sublimation temperature, -78.46 °C
(194.686 K; Span & Wagner 1996; from memory).
"""

from __future__ import annotations

import pytest

pytestmark = pytest.mark.browser

#: The number of corner rows shown in the leg list (rows made ahead are hidden).
VISIBLE_ROWS = (
    "Array.from(document.querySelectorAll('.pp-legs .pp-row'))"
    ".filter(e => e.offsetParent !== null).length"
)


def test_sweep_map_hover_and_click_open_the_route(page, sweepmap_url, artifacts):
    page.goto(sweepmap_url, wait_until="domcontentloaded", timeout=120_000)
    page.wait_for_selector(".pp-view-pT rect.plotarea_events", state="visible", timeout=120_000)
    page.wait_for_function(
        "() => document.querySelectorAll('.pp-view-pT path.dot').length >= 24", timeout=60_000
    )
    page.wait_for_timeout(500)
    page.screenshot(path=str(artifacts / "sweepmap-co2-vent.png"), full_page=True)
    # the sweep's markers are the squares (the corner and point marks have other shapes)
    boxes = page.evaluate(
        "() => Array.from(document.querySelectorAll('.pp-view-pT path.dot'))"
        ".map(d => { const b = d.getBoundingClientRect(); return [b.left + b.width / 2, "
        "b.top + b.height / 2, b.width]; })"
    )
    squares = [b for b in boxes if b[2] > 6]
    x, y, _ = squares[len(squares) // 2]
    page.mouse.move(x, y)
    page.wait_for_function(
        "() => Array.from(document.querySelectorAll('.bqplot_tooltip_div'))"
        ".some(t => t.textContent.includes('end solid fraction'))",
        timeout=30_000,
    )
    page.mouse.click(x, y)
    page.wait_for_function(
        "() => " + VISIBLE_ROWS + " == 2",
        timeout=60_000,
    )
    page.wait_for_timeout(500)
    page.screenshot(path=str(artifacts / "sweepmap-opened-route.png"), full_page=True)
    T_end = page.locator(".pp-legs .pp-row").nth(1).locator("input").first.input_value()
    assert float(T_end.replace("\u2212", "-")) == pytest.approx(-78.46, abs=0.02)
