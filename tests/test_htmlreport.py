"""The HTML report (``report.to_html``, ``save_html``, ``phasepath report``) and the static figures.

What is checked: the page is one self-contained file that loads nothing from the network (it is
parsed for every ``src``, ``href``, CSS ``url()`` and ``@import``); it holds what a review needs
(title, substance, start, site, both tables, every hazard flag and caution of the report, the
published sources, the provenance); its numbers follow the display-precision policy; writing is
atomic. The plans are invented demos; the values compared are phasepath's own (regression pins
by construction: the page must show what the report holds).
"""

from __future__ import annotations

import datetime
import hashlib
import html
import re
from html.parser import HTMLParser

import pytest

import phasepath as pp
from phasepath import cli, htmlreport, plot
from phasepath import format as F

pytest.importorskip("matplotlib")

ROUTE = """\
format: phasepath route file
version: 1
substance: CO2
title: EX-2 plan C (invented demo)
notes: staged letdown with reheat
elevation: 350
start: {T: 50 degC, p: 300 bar}
legs:
  - {kind: isobar, T: 95 degC}
  - {kind: isenthalp, p: 40 bar}
  - {kind: isobar, T: 60 degC}
  - {kind: isenthalp, p: 1 atm}
"""

WHEN = datetime.datetime(2031, 5, 6, 7, 8, 9, tzinfo=datetime.timezone.utc)


class _Links(HTMLParser):
    """Every attribute that could load something, and the text of every <style>."""

    def __init__(self) -> None:
        super().__init__()
        self.links: list[tuple[str, str, str]] = []
        self.tags: list[str] = []
        self.styles: list[str] = []
        self._in_style = False

    def handle_starttag(self, tag, attrs):
        self.tags.append(tag)
        self._in_style = tag == "style"
        for k, v in attrs:
            if k in ("src", "href", "xlink:href", "data", "action", "poster", "srcset") or (
                k == "style" and v and "url(" in v
            ):
                self.links.append((tag, k, v or ""))

    def handle_endtag(self, tag):
        self._in_style = False

    def handle_data(self, data):
        if self._in_style:
            self.styles.append(data)


def external_loads(page: str) -> list[str]:
    """What the page would fetch from elsewhere: any link that is not a fragment (#id)."""
    p = _Links()
    p.feed(page)
    bad = [f"<{t} {k}={v!r}>" for t, k, v in p.links if not v.startswith("#")]
    bad += [f"<{t}>" for t in p.tags if t in ("script", "link", "iframe", "img", "object")]
    for css in p.styles:
        bad += [f"url({u})" for u in re.findall(r"url\(([^)]*)\)", css) if not u.startswith("#")]
        bad += ["@import" for _ in re.findall(r"@import", css)]
    return bad


@pytest.fixture(scope="module")
def plan(tmp_path_factory):
    d = tmp_path_factory.mktemp("report")
    path = d / "ex2_plan_c.yaml"
    path.write_text(ROUTE, encoding="utf-8")
    return path


@pytest.fixture(scope="module")
def report(plan):
    return pp.Route.load(plan).analyze()


@pytest.fixture(scope="module")
def page(report, plan):
    return report.to_html(route_file=plan, when=WHEN)


def test_page_loads_nothing_from_the_network(page) -> None:
    assert page.startswith("<!DOCTYPE html>")
    assert external_loads(page) == []
    assert page.count("<svg") == 2  # the P-T diagram and the p-h view, inline


def test_link_parser_finds_what_would_load() -> None:
    """The network check itself can fail: each kind of external load is found."""
    for snippet in (
        "<img src='https://example.org/x.png'>",
        "<link rel='stylesheet' href='style.css'>",
        "<script src='x.js'></script>",
        "<style>body { background: url(http://example.org/a.png) }</style>",
        "<style>@import 'other.css';</style>",
        "<svg><image xlink:href='http://example.org/i.png'/></svg>",
        "<div style=\"background: url('a.png')\"></div>",
    ):
        assert external_loads(snippet), snippet
    assert external_loads("<svg><use xlink:href='#glyph'/></svg>") == []


def test_page_holds_what_a_review_needs(page, report, plan) -> None:
    text = html.unescape(page)
    assert "<title>EX-2 plan C (invented demo)</title>" in page
    assert "CarbonDioxide" in text and "staged letdown with reheat" in text
    start = report.legs[0].start
    assert (
        f"{F.quantity(start.T, 'temperature', 'degC')}, {F.quantity(start.p, 'pressure', 'bar')}"
        in text
    )
    assert "elevation 350 m: ambient pressure" in text  # the site
    assert text.count("<table class='pp-table pp-x'>") == 1
    assert text.count("<table class='pp-table pp-l'>") == 1
    for c in report.crossings:  # every crossing row, by the policy's digits
        assert f"<td class='pp-c-T num'>{F.temperature(c.T, 'degC')}</td>" in page
    for leg in report.legs:
        assert f"<td class='pp-c-T1 num'>{F.temperature(leg.end.T, 'degC')}</td>" in page
        for h in leg.hazards:
            assert h.reason in text
    for caution in report.cautions:
        assert caution in text
    for citation in report.substance.sources():
        assert citation in text
    assert f"phasepath: <code>{pp.__version__}</code>" in page
    digest = hashlib.sha256(plan.read_bytes()).hexdigest()
    assert f"route file {plan}, SHA-256: <code>{digest}</code>" in page
    assert "2031-05-06 07:08:09 UTC" in page
    assert "@media print" in page and "break-inside: avoid" in page


def test_numbers_follow_the_display_policy(page) -> None:
    """No number in the tables has more digits than the policy allows (see the notebook
    digits scan for the rule)."""
    from _digits import too_many_digits

    cells = re.findall(r"<td class='[^']*num'>([^<]*)</td>", page)
    assert cells and not [c for c in cells if too_many_digits(c)]


def test_route_digest_without_a_file(report) -> None:
    label, digest = htmlreport.route_digest(report.route)
    assert "SHA-256" in label and len(digest) == 64
    again = pp.Route.from_dict(report.route.to_dict())
    assert htmlreport.route_digest(again) == (label, digest)
    other = report.route.copy().isobar(T="20 degC")
    assert htmlreport.route_digest(other)[1] != digest


def test_save_html_is_atomic(report, tmp_path, monkeypatch) -> None:
    target = tmp_path / "plan.html"
    report.save_html(target, "K", "MPa", when=WHEN)
    text = target.read_text(encoding="utf-8")
    assert "T [K]" in text and "p [MPa]" in text
    with pytest.raises(pp.PhasePathError, match="cannot write the file"):
        report.save_html(tmp_path / "no-such-folder" / "plan.html")
    # a write that fails at the last step leaves the old report as it was, and no stray file
    import os

    def refuse(*args):
        raise OSError(28, "No space left on device")

    monkeypatch.setattr(os, "replace", refuse)
    with pytest.raises(pp.PhasePathError, match="No space left"):
        report.save_html(target)
    assert target.read_text(encoding="utf-8") == text
    assert sorted(p.name for p in tmp_path.iterdir()) == ["plan.html"]


def test_cli_report(capsys, plan, tmp_path) -> None:
    out_file = tmp_path / "plan.html"
    code = cli.main(["report", str(plan), "-o", str(out_file), "--units", "K,MPa"])
    out, err = capsys.readouterr()
    assert code == 0 and f"wrote {out_file}" in out and err == ""
    page = out_file.read_text(encoding="utf-8")
    assert external_loads(page) == [] and "T [K]" in page
    assert hashlib.sha256(plan.read_bytes()).hexdigest() in page
    for argv, message in (
        (["report", str(plan), "-o", str(plan)], "one of the command's inputs"),
        (["report", "missing.yaml", "-o", str(out_file)], "cannot read the file"),
        (["report", str(plan)], "the following arguments are required: -o"),
        (["report", str(plan), "-o", str(out_file), "--units", "furlongs"], "unknown display"),
    ):
        code = cli.main(argv)
        out, err = capsys.readouterr()
        assert code == 2 and message in err and err.count("\n") == 1, err


def test_substance_without_eos_has_no_ph_view() -> None:
    """A substance built from data has no equation of state: the report says so instead of
    drawing a p-h view, and the page is still whole."""
    solvent = pp.Substance.from_data(
        "demo solvent K-12",
        triple=(180.0, None),
        critical=(560.0, 4.5e6),
        vapor_points=[(300.0, 5.0e3), (325.0, 1.6e4), (350.0, 4.0e4)],
    )
    rep = pp.Route(solvent, T=310.0, p=1e5, title="K-12 boil").isobar(T=400.0).analyze()
    page = rep.to_html(when=WHEN)
    assert page.count("<svg") == 1 and "No figure: " in page
    assert external_loads(page) == []


def test_report_without_figures_needs_no_matplotlib(report) -> None:
    page = htmlreport.report_html(report, figures=False, when=WHEN)
    assert "<svg" not in page and "Crossings" in page


# -- figures -----------------------------------------------------------------------------------
def test_figures_are_reproducible_and_labelled(report) -> None:
    sub = report.substance
    a = plot.diagram_bytes(sub, "svg", report.route, report)
    assert a == plot.diagram_bytes(sub, "svg", report.route, report)
    svg = a.decode()
    for label in (
        "triple point",
        "critical point",
        "vapor pressure",
        "crossing",
        "route",
        "EX-2 plan C (invented demo)",
        "temperature [°C]",
        "pressure [bar]",
    ):
        assert label in svg, label
    ph = plot.ph_bytes(report).decode()
    assert "saturation dome" in ph and "specific enthalpy [kJ/kg]" in ph
    assert plot.diagram_bytes(sub, "png")[:8] == b"\x89PNG\r\n\x1a\n"
    with pytest.raises(pp.PhasePathError, match="svg or png"):
        plot.diagram_bytes(sub, "pdf")


def test_comparison_figure_refuses_two_substances(report) -> None:
    water = pp.Route("water", T="20 degC", p="1 atm").isobar(T="50 degC")
    with pytest.raises(pp.PhasePathError, match="one diagram shows one substance"):
        plot.comparison_bytes([("A", report.route, report), ("B", water, None)])
    both = plot.comparison_bytes(
        [("A", report.route, report), ("B", report.route.copy(), None)]
    ).decode()
    assert "crossings (A)" in both and "B" in both


def test_inline_svg_prefixes_ids(report) -> None:
    svg = plot.diagram_bytes(report.substance, "svg", report.route, report)
    one = htmlreport.inline_svg(svg, "f1")
    ids = re.findall(r'id="([^"]+)"', one)
    assert ids and all(i.startswith("f1-") for i in ids)
    refs = re.findall(r'href="#([^"]+)"', one) + re.findall(r"url\(#([^)]+)\)", one)
    assert all(r.startswith("f1-") for r in refs) and set(refs) <= set(ids)
    assert "<metadata>" not in one and "<?xml" not in one
