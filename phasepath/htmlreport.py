"""The review-ready HTML report of an analysed route: one self-contained file, no network.

:func:`report_html` builds the page that ``Report.to_html`` returns and ``phasepath report``
writes: the title, the substance, the start and the site; the P-T diagram as inline SVG (and the
p-h view where the substance has an equation of state), both from :mod:`phasepath.plot`; the
crossings and legs tables from :mod:`phasepath.tables`; the hazard flags and the cautions
(``report.cautions``); the models and the published sources used
(:mod:`phasepath.bibliography`); and the provenance: phasepath and CoolProp versions, the
route's SHA-256, the date and time. A print stylesheet gives a clean A4 or Letter document:
the diagram and the tables on the first page, tables not split across pages.

Numbers follow the display-precision policy (:mod:`phasepath.format`). Nothing on the page is
loaded from elsewhere: no scripts, no fonts, no images by address; the figures are inline SVG.
The page's building blocks (:func:`page`, :func:`figure_html`, :func:`tables_html`, ...) also
make the plan comparison's page (:func:`comparison_html`, for :mod:`phasepath.comparison`).

>>> import phasepath as pp, datetime
>>> rep = pp.Route("water", T="20 degC", p="1 atm", title="Kettle").isobar(T="120 degC").analyze()
>>> text = report_html(rep, when=datetime.datetime(2030, 1, 2, 3, 4, 5), figures=False)
>>> text.startswith("<!DOCTYPE html>"), "99.974" in text, "2030-01-02 03:04:05 UTC" in text
(True, True, True)
"""

from __future__ import annotations

import hashlib
import html
import json
import re
from collections.abc import Callable, Sequence
from datetime import datetime, timezone
from typing import TYPE_CHECKING, Any

from . import fileio, plot, tables
from . import format as F
from .bibliography import SOURCES
from .correlations.atmosphere import ambient_pressure
from .eos import library_version
from .errors import PhasePathError
from .format import DisplayUnits
from .records import Analysis
from .version import __version__

if TYPE_CHECKING:  # pragma: no cover
    from .route import Route

__all__ = [
    "report_html",
    "comparison_html",
    "differences_html",
    "page",
    "header_html",
    "figure_html",
    "facts_html",
    "tables_html",
    "hazards_html",
    "sources_html",
    "provenance_html",
    "route_digest",
    "file_digest",
    "inline_svg",
    "DEFAULT_UNITS",
    "CSS",
]

#: Units of a report unless asked otherwise.
DEFAULT_UNITS = DisplayUnits("degC", "bar", "kJ/kg")

#: The stylesheet of every phasepath HTML page: screen, and print (A4 or Letter, 12 mm margins:
#: the header, the diagram and the tables on the first page; tables and sections not split).
CSS = """
:root { --ink: #1d1d1f; --muted: #5b5b60; --rule: #d0d0d6; --accent: #0b5fa5;
        --warn: #8a3b00; --warnbg: #fff4e5; --band: #f4f5f8; }
* { box-sizing: border-box; }
body { font-family: "DejaVu Sans", "Liberation Sans", Arial, Helvetica, sans-serif;
       color: var(--ink); margin: 0 auto; padding: 18px 22px 40px; max-width: 1180px;
       font-size: 14px; line-height: 1.4; }
header.pp-head { border-bottom: 3px solid var(--accent); margin-bottom: 10px; }
header.pp-head h1 { font-size: 22px; margin: 0 0 2px; }
header.pp-head p { margin: 0 0 6px; color: var(--muted); }
h2 { font-size: 16px; margin: 16px 0 6px; border-bottom: 1px solid var(--rule); }
h3 { font-size: 14px; margin: 12px 0 4px; }
.pp-top { display: flex; gap: 16px; align-items: flex-start; }
.pp-top > figure { flex: 0 0 64%; }
.pp-top > .pp-facts { flex: 1 1 auto; }
figure.pp-figure { margin: 0; }
figure.pp-figure svg { width: 100%; height: auto; display: block; }
figure.pp-figure figcaption { font-size: 12px; color: var(--muted); }
figure.pp-wide { max-width: 860px; }
dl.pp-facts-list { display: grid; grid-template-columns: max-content 1fr; gap: 2px 10px;
                   margin: 0; font-size: 13px; }
dl.pp-facts-list dt { font-weight: bold; }
dl.pp-facts-list dd { margin: 0; }
table.pp-table { border-collapse: collapse; font-size: 12.5px; margin: 4px 0 8px;
                 font-variant-numeric: tabular-nums; }
table.pp-table th, table.pp-table td { border: 1px solid var(--rule); padding: 2px 6px;
                                       vertical-align: top; }
table.pp-table th { background: var(--band); text-align: left; font-weight: bold; }
table.pp-table td.num { text-align: right; white-space: nowrap; }
table.pp-table td.pp-c-hazards:not(:empty) { color: var(--warn); background: var(--warnbg); }
ul.pp-hazards li, ul.pp-cautions li { margin-bottom: 3px; }
.pp-flag { color: var(--warn); font-weight: bold; }
.pp-note { color: var(--muted); font-size: 12.5px; }
.pp-differ { color: var(--warn); font-weight: bold; }
.pp-agree { color: #2a7d5f; font-weight: bold; }
.pp-sides { display: flex; gap: 18px; align-items: flex-start; }
.pp-sides > .pp-side { flex: 1 1 50%; min-width: 0; overflow-x: auto; }
.pp-sources li { font-size: 12.5px; }
footer.pp-provenance { margin-top: 18px; border-top: 1px solid var(--rule); font-size: 12px;
                       color: var(--muted); }
footer.pp-provenance code { font-size: 11px; word-break: break-all; }
@page { margin: 12mm 11mm; }
@media print {
  body { font-size: 8.5pt; padding: 0; max-width: none; }
  header.pp-head h1 { font-size: 14pt; }
  h2 { font-size: 10.5pt; margin: 7pt 0 3pt; break-after: avoid; page-break-after: avoid; }
  h3 { font-size: 9pt; break-after: avoid; page-break-after: avoid; }
  .pp-top > figure { flex: 0 0 62%; }
  figure.pp-figure svg { max-height: 92mm; }
  figure.pp-figure figcaption { font-size: 7pt; }
  dl.pp-facts-list { font-size: 7.5pt; }
  table.pp-table { font-size: 6.8pt; break-inside: avoid; page-break-inside: avoid; }
  table.pp-table th, table.pp-table td { padding: 1px 3px; }
  tr { break-inside: avoid; page-break-inside: avoid; }
  section.pp-keep, figure.pp-figure, .pp-side { break-inside: avoid; page-break-inside: avoid; }
  .pp-later { break-before: page; page-break-before: always; }
  .pp-sides { display: block; }
  .pp-side + .pp-side { break-before: page; page-break-before: always; }
  .pp-note, ul.pp-note, .pp-sources li, ul.pp-hazards li, ul.pp-cautions li { font-size: 7.5pt; }
  figure.pp-wide svg { max-height: 120mm; }
  footer.pp-provenance { font-size: 7pt; }
}
"""


# -- identities ------------------------------------------------------------------------------------
def route_digest(route: Route) -> tuple[str, str]:
    """("route as typed, SHA-256", hex digest) of the route's canonical JSON (keys sorted,
    values as the user typed them): the same route gives the same digest on every machine."""
    data = route.to_dict()
    sub: Any = data.get("substance")
    if sub is not None and not isinstance(sub, str):
        data["substance"] = sub.to_dict()  # a substance built from data: its inputs
    text = json.dumps(data, sort_keys=True, separators=(",", ":"), ensure_ascii=False, default=str)
    return "route as typed (canonical JSON), SHA-256", hashlib.sha256(text.encode()).hexdigest()


def file_digest(path: object) -> tuple[str, str]:
    """("route file NAME, SHA-256", hex digest of the file's bytes)."""
    name = fileio.path_text(path)
    data = fileio.read_bytes(name)
    return f"route file {name}, SHA-256", hashlib.sha256(data).hexdigest()


# -- blocks ----------------------------------------------------------------------------------------
def inline_svg(data: bytes, prefix: str) -> str:
    """SVG bytes from :mod:`phasepath.plot` as an element to put in a page: no XML prolog, no
    metadata block, sized by the page, every id prefixed (so that several figures share one
    page without clashing)."""
    text = data.decode("utf-8")
    text = text[text.index("<svg") :]
    text = re.sub(r"<metadata>.*?</metadata>\s*", "", text, flags=re.S)
    head_end = text.index(">")
    head = re.sub(r'\s(width|height)="[^"]*"', "", text[:head_end])
    text = head + f' class="pp-svg" role="img" aria-label="{html.escape(prefix)}"' + text[head_end:]
    text = text.replace('id="', f'id="{prefix}-')
    text = text.replace('href="#', f'href="#{prefix}-')
    return text.replace("url(#", f"url(#{prefix}-")


def figure_html(make: Callable[[], bytes], prefix: str, caption: str, css_class: str = "") -> str:
    """A figure from a function returning SVG bytes, or a note saying why there is none."""
    try:
        svg = inline_svg(make(), prefix)
    except PhasePathError as exc:
        return f"<p class='pp-note pp-nofigure'>No figure: {html.escape(str(exc))}</p>"
    return (
        f"<figure class='pp-figure {html.escape(css_class)}' id='{html.escape(prefix)}'>{svg}"
        f"<figcaption>{html.escape(caption)}</figcaption></figure>"
    )


def header_html(title: str, subtitle: str) -> str:
    return (
        f"<header class='pp-head'><h1>{html.escape(title)}</h1>"
        f"<p>{html.escape(subtitle)}</p></header>"
    )


def _state(T: float, p: float, units: DisplayUnits) -> str:
    return f"{F.quantity(T, 'temperature', units.T)}, {F.quantity(p, 'pressure', units.p)}"


def facts_html(report: Analysis, units: DisplayUnits) -> str:
    """The substance, its triple and critical points, the start, the site and the basis."""
    sub, route = report.substance, report.route
    start = report.legs[0].start if report.legs else None
    items: list[tuple[str, str]] = [("substance", sub.name)]
    for name, (T, p) in (("triple point", sub.triple), ("critical point", sub.critical)):
        ok = all(isinstance(x, float) and x == x for x in (T, p))
        items.append((name, _state(T, p, units) if ok else "not known"))
    if start is not None:
        items.append(("start", f"{_state(start.T, start.p, units)}, {start.text}"))
    else:
        items.append(("start", _state(route.start.T, route.start.p, units)))
    given = ", ".join(f"{k} = {v}" for k, v in route.start.given.items())
    if given:
        items.append(("start as typed", given))
    if route.elevation is None:
        items.append(("site", "elevation not given: 'ambient' is sea level (1 atm)"))
    else:
        p_amb = ambient_pressure(route.elevation)
        items.append(
            (
                "site",
                f"elevation {route.elevation:g} m: ambient pressure "
                f"{F.quantity(p_amb, 'pressure', units.p)} (U.S. Standard Atmosphere 1976)",
            )
        )
    n, m = len(report.legs), len(report.crossings)
    items.append(
        ("legs, crossings", f"{n} leg{'s' if n != 1 else ''}, {m} crossing{'s' if m != 1 else ''}")
    )
    if report.legs:
        items.append(("heat and work basis", f"{report.legs[0].basis}, per kg of substance"))
    if route.notes:
        items.append(("plan notes", route.notes))
    rows = "".join(f"<dt>{html.escape(k)}</dt><dd>{html.escape(v)}</dd>" for k, v in items)
    return f"<div class='pp-facts'><dl class='pp-facts-list'>{rows}</dl></div>"


_CROSSING_COLUMNS = tuple(c for c in tables.CROSSINGS if c.brief)
_LEG_COLUMNS = tuple(c for c in tables.LEGS if c.key != "note")


def tables_html(report: Analysis, units: DisplayUnits, level: int = 2) -> str:
    """The crossings and legs tables (the legs' notes listed under them)."""
    h = f"h{level}"
    parts = [f"<section class='pp-keep pp-crossings'><{h}>Crossings</{h}>"]
    if report.crossings:
        parts.append(
            tables.html_table(_CROSSING_COLUMNS, report.crossings, units, table_class="pp-x")
        )
    else:
        parts.append("<p>No phase boundary is crossed.</p>")
    parts.append(f"</section><section class='pp-keep pp-legs'><{h}>Legs</{h}>")
    parts.append(tables.html_table(_LEG_COLUMNS, report.legs, units, table_class="pp-l"))
    notes = [(g.step, g.note) for g in report.legs if g.note]
    if notes:
        lis = "".join(f"<li>leg {s}: {html.escape(t)}</li>" for s, t in notes)
        parts.append(f"<ul class='pp-note'>{lis}</ul>")
    parts.append(
        "<p class='pp-note'>Heat = ∫T ds into the substance, work = ∫v dp done on it, per kg "
        "(reversible); heat + work = Δh.</p></section>"
    )
    return "".join(parts)


def hazards_html(report: Analysis, level: int = 2) -> str:
    """The hazard flags, leg by leg, and the cautions (``report.cautions``)."""
    h = f"h{level}"
    flags: list[str] = []
    for leg in report.legs:
        own = [(h_, "") for h_ in leg.hazards]
        own += [
            (h_, f" at the {c.kind}")
            for c in report.crossings
            if c.step == leg.step
            for h_ in c.hazards
        ]
        for hz, where in own:
            flags.append(
                f"<li><span class='pp-flag'>⚠ {html.escape(hz.kind)}</span> — leg {leg.step} "
                f"({html.escape(leg.kind)}){html.escape(where)}: {html.escape(hz.reason)}</li>"
            )
    parts = [f"<section class='pp-keep pp-flags'><{h}>Hazard flags</{h}>"]
    parts.append(
        f"<ul class='pp-hazards'>{''.join(flags)}</ul>" if flags else "<p>No leg is flagged.</p>"
    )
    parts.append(f"</section><section class='pp-keep'><{h}>Cautions</{h}>")
    if report.cautions:
        lis = "".join(f"<li>{html.escape(c)}</li>" for c in report.cautions)
        parts.append(f"<ul class='pp-cautions'>{lis}</ul>")
    parts.append(
        "<p class='pp-note'>The flags are planning prompts, not a safety assessment: follow "
        "local codes, site procedures and licensed practice.</p></section>"
    )
    return "".join(parts)


def _models(report: Analysis) -> list[str]:
    seen: dict[str, None] = {}
    for c in report.crossings:
        if c.latent_heat_model:
            seen.setdefault(f"latent heat: {c.latent_heat_model}")
    for leg in report.legs:
        for s in (leg.start, leg.end):
            if s.model:
                seen.setdefault(f"{s.text} states: {s.model}")
    for b in report.substance.boundaries:
        seen.setdefault(f"{b.label}: {b.source}" + ("" if b.reliable else " (approximate)"))
    return list(seen)


def sources_html(report: Analysis, level: int = 2) -> str:
    """The models used (by name) and the published sources behind them (full citations)."""
    h = f"h{level}"
    models = "".join(f"<li>{html.escape(m)}</li>" for m in _models(report))
    cites = "".join(f"<li>{html.escape(c)}</li>" for c in report.substance.sources())
    ids = {b.source for b in report.substance.boundaries}
    unknown = sorted(i for i in ids if i not in SOURCES)
    extra = (
        f"<p class='pp-note'>Without a bibliography entry: {html.escape(', '.join(unknown))}.</p>"
        if unknown
        else ""
    )
    return (
        f"<section class='pp-keep pp-sources'><{h}>Models and sources</{h}>"
        f"<ul>{models}</ul><{h}>Published sources</{h}><ol>{cites}</ol>{extra}</section>"
    )


def provenance_html(routes: Sequence[tuple[str, str]], when: datetime | None = None) -> str:
    """phasepath and CoolProp versions, the routes' digests, and the date and time (UTC)."""
    moment = when or datetime.now(timezone.utc)
    if moment.tzinfo is not None:  # a naive time is taken as UTC
        moment = moment.astimezone(timezone.utc)
    stamp = moment.strftime("%Y-%m-%d %H:%M:%S") + " UTC"
    items = [
        ("phasepath", __version__),
        ("CoolProp", library_version()),
        *routes,
        ("written", stamp),
    ]
    rows = "".join(f"<li>{html.escape(k)}: <code>{html.escape(v)}</code></li>" for k, v in items)
    return f"<footer class='pp-provenance'><h2>Provenance</h2><ul>{rows}</ul></footer>"


def page(title: str, body: str) -> str:
    """A whole HTML document around ``body``, with the phasepath stylesheet."""
    return (
        "<!DOCTYPE html>\n<html lang='en'><head><meta charset='utf-8'>"
        "<meta name='viewport' content='width=device-width, initial-scale=1'>"
        "<meta name='generator' content='phasepath'>"
        f"<title>{html.escape(title)}</title><style>{CSS}</style></head>"
        f"<body>{body}</body></html>\n"
    )


# -- the report ----------------------------------------------------------------------------------
def report_html(
    report: Analysis,
    units: DisplayUnits | None = None,
    *,
    title: str | None = None,
    route_file: object = None,
    when: datetime | None = None,
    figures: bool = True,
) -> str:
    """The HTML report of an analysed route (see the module's text).

    Parameters
    ----------
    report : Analysis
    units : DisplayUnits, optional
        Units of the numbers and the axes (default °C, bar, kJ/kg).
    title : str, optional
        The page's title (default: the route's title).
    route_file : path, optional
        The route file the route was read from: its SHA-256 is recorded (else the digest of
        the route as typed).
    when : datetime, optional
        The date and time recorded (default: now, UTC).
    figures : bool
        False leaves the figures out (no matplotlib needed).
    """
    units = units or DEFAULT_UNITS
    sub, route = report.substance, report.route
    heading = title or route.title or f"Route for {sub.name}"
    n = len(report.legs)
    subtitle = f"{sub.name}: {n} leg{'s' if n != 1 else ''} — phasepath route report"
    if figures:
        pt = figure_html(
            lambda: plot.diagram_bytes(sub, "svg", route, report, units, heading),
            "fig-pt",
            "P-T diagram: the route (S = start, numbered corners) and its crossings (diamonds).",
        )
        ph = figure_html(
            lambda: plot.ph_bytes(report, "svg", units),
            "fig-ph",
            "p-h view: constant-pressure legs are exact straight lines, curved legs follow their "
            "traced states, constant-temperature legs are dotted between their ends.",
            "pp-wide",
        )
    else:
        pt = ph = ""
    digest = file_digest(route_file) if route_file is not None else route_digest(route)
    notes = ""
    if report.notes:
        lis = "".join(f"<li>{html.escape(x)}</li>" for x in report.notes)
        notes = f"<section class='pp-keep'><h2>Notes</h2><ul class='pp-note'>{lis}</ul></section>"
    body = (
        header_html(heading, subtitle)
        + f"<div class='pp-top'>{pt}{facts_html(report, units)}</div>"
        + tables_html(report, units)
        + "<div class='pp-later'>"
        + hazards_html(report)
        + (f"<section class='pp-keep'><h2>p-h view</h2>{ph}</section>" if ph else "")
        + notes
        + sources_html(report)
        + "</div>"
        + provenance_html([digest], when)
    )
    return page(heading, body)


# -- the plan comparison -------------------------------------------------------------------------
def differences_html(cmp: Any, units: DisplayUnits) -> str:
    """The table of differences of a :class:`phasepath.comparison.Comparison` (or the word that
    the plans agree)."""
    tol = html.escape(cmp.tolerances.describe())
    if not cmp.differences:
        return f"<p class='pp-agree'>The plans agree within the tolerances ({tol}).</p>"
    rows = cmp.rows(units)
    table = tables.html_table(
        cmp.columns, rows, units, table_class="pp-diffs", row_data=lambda r: {"status": r["status"]}
    )
    la, lb = (html.escape(x) for x in cmp.labels)
    n = len(rows)
    return (
        f"<p class='pp-differ'>{n} difference{'s' if n != 1 else ''} "
        f"({html.escape(cmp.summary())}) beyond the tolerances ({tol}). Sign: ~ moved or "
        f"changed, + only in {lb}, - only in {la}.</p>" + table
    )


def comparison_html(cmp: Any, units: DisplayUnits, when: datetime | None = None) -> str:
    """The side-by-side page of a comparison: both plans on one diagram in two styles, the
    differences, and each plan's facts, tables, flags and cautions."""
    a, b = cmp.report_a, cmp.report_b
    la, lb = cmp.labels
    title = f"{cmp.title(0)} vs {cmp.title(1)}"
    figure = figure_html(
        lambda: plot.comparison_bytes(
            [(f"{la}: {cmp.title(0)}", a.route, a), (f"{lb}: {cmp.title(1)}", b.route, b)],
            "svg",
            units,
            title=f"{la} and {lb} on the {a.substance.name} phase diagram",
        ),
        "fig-compare",
        f"{la} (solid line, diamonds) and {lb} (dashed line, circles) on one diagram.",
        "pp-wide",
    )
    sides = []
    for label, rep in ((la, a), (lb, b)):
        sides.append(
            "<div class='pp-side'>"
            f"<h2>{html.escape(label)}: {html.escape(rep.route.title or rep.substance.name)}</h2>"
            + facts_html(rep, units)
            + tables_html(rep, units, level=3)
            + hazards_html(rep, level=3)
            + "</div>"
        )
    digests = []
    for label, rep in ((la, a), (lb, b)):
        what, digest = route_digest(rep.route)
        digests.append((f"{label}: {what}", digest))
    body = (
        header_html(title, f"Plan comparison: {a.substance.name}")
        + figure
        + "<section class='pp-keep'><h2>What differs</h2>"
        + differences_html(cmp, units)
        + "</section><div class='pp-sides'>"
        + "".join(sides)
        + "</div>"
        + provenance_html(digests, when)
    )
    return page(title, body)
