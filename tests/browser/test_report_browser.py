"""The HTML report in a real browser, from disk, with the network blocked, and printed to PDF.

Headless Debian chromium opens the file written by ``report.save_html``; every request that is
not the file itself is recorded and refused (none may happen). The page is screenshotted into
``test-artifacts/report-page.png``, printed to PDF on A4 and on Letter through the browser's own
print path (the print stylesheet), and the first page of each PDF is rendered with ``pdftoppm``
(Debian's poppler-utils) into ``test-artifacts/report-<size>-page1.png``. The first page must
hold the diagram (its text and the colours of its vapor-pressure curve and crossing marks) and
both tables (their headings and columns, read back with ``pdftotext``).
"""

from __future__ import annotations

import shutil
import subprocess

import pytest

import phasepath as pp

pytestmark = pytest.mark.browser

PLAN = (
    pp.Route("CO2", T="20 degC", p="50 bar", title="EX-2 plan A: vent straight down (invented)")
    .isotherm(p="300 bar")
    .isobar(T="50 degC")
    .isenthalp(p="1 atm")
)
VAPOR_RGB = (0x0B, 0x5F, 0xA5)  # the vapor-pressure curve (phasepath.plot.STYLE)
CROSSING_RGB = (0xF2, 0xB0, 0x1E)  # the crossing diamonds (phasepath.plot.PLAN_STYLES[0])
CHROMIUM_ARGS = [
    "--headless",
    "--no-sandbox",
    "--disable-gpu",
    "--disable-quic",
    "--no-first-run",
    "--disable-background-networking",
    "--disable-component-update",
    "--disable-sync",
]


def _count_colour(png, rgb, tol=40, top=1.0):
    from PIL import Image

    img = Image.open(png).convert("RGB")
    w, h = img.size
    n = 0
    for y in range(0, int(h * top)):
        for x in range(w):
            r, g, b = img.getpixel((x, y))
            if abs(r - rgb[0]) + abs(g - rgb[1]) + abs(b - rgb[2]) <= tol:
                n += 1
    return n


@pytest.fixture(scope="module")
def report_file(tmp_path_factory):
    pytest.importorskip("matplotlib")
    path = tmp_path_factory.mktemp("report") / "ex2_plan_a.html"
    PLAN.analyze().save_html(path)
    return path


def test_report_offline_screenshot_and_pdf(report_file, chromium_path, artifacts) -> None:
    from playwright.sync_api import sync_playwright

    pdftoppm, pdftotext = shutil.which("pdftoppm"), shutil.which("pdftotext")
    if pdftoppm is None or pdftotext is None:
        pytest.skip(
            "poppler-utils is not installed (apt-get install -y poppler-utils); "
            "scripts/setup.sh installs it"
        )
    url = report_file.as_uri()
    refused: list[str] = []

    def gate(route):
        if route.request.url == url:
            route.continue_()
        else:
            refused.append(route.request.url)
            route.abort()

    with sync_playwright() as p:
        browser = p.chromium.launch(executable_path=chromium_path, args=CHROMIUM_ARGS)
        try:
            context = browser.new_context(viewport={"width": 1280, "height": 1000}, offline=True)
            context.route("**/*", gate)
            page = context.new_page()
            page.goto(url, wait_until="load")
            assert page.title() == "EX-2 plan A: vent straight down (invented)"
            assert page.locator("svg.pp-svg").count() == 2
            assert page.locator("table.pp-x tr").count() == 1 + len(PLAN.analyze().crossings)
            assert page.locator("table.pp-l tr").count() == 1 + len(PLAN.legs)
            box = page.locator("#fig-pt svg").bounding_box()
            assert box is not None and box["width"] > 500 and box["height"] > 300
            page.screenshot(path=str(artifacts / "report-page.png"), full_page=True)
            pdfs = {}
            for size in ("A4", "Letter"):
                pdfs[size] = artifacts / f"report-{size}.pdf"
                page.pdf(path=str(pdfs[size]), format=size, print_background=True)
            context.close()
        finally:
            browser.close()
    assert refused == [], f"the report asked the network for {refused}"

    for size, pdf in pdfs.items():
        stem = artifacts / f"report-{size}-page1"
        subprocess.run(
            [
                pdftoppm,
                "-f",
                "1",
                "-l",
                "1",
                "-r",
                "90",
                "-png",
                "-singlefile",
                str(pdf),
                str(stem),
            ],
            check=True,
            timeout=120,
        )
        png = stem.with_suffix(".png")
        text = subprocess.run(
            [pdftotext, "-f", "1", "-l", "1", "-layout", str(pdf), "-"],
            check=True,
            capture_output=True,
            text=True,
            timeout=120,
        ).stdout
        # the diagram: its title, axes and labels are text in the inline SVG
        for words in ("triple point", "critical point", "temperature [°C]", "pressure [bar]"):
            assert words in text, (size, words)
        # and it is drawn: the vapor-pressure curve and the crossing marks in the top half
        assert _count_colour(png, VAPOR_RGB, top=0.5) > 150, size
        assert _count_colour(png, CROSSING_RGB, top=0.5) > 30, size
        # the tables, on the same first page
        for words in (
            "Crossings",
            "Legs",
            "latent heat [kJ/kg]",
            "phase end",
            "condensation",
            "deposition",
            "isenthalp",
            "solid+vapor",
        ):
            assert words in text, (size, words)
        assert "EX-2 plan A" in text
