"""What the planner exports: the route file and the two tables of the route shown, as download
links built on request, and the same written to files (atomically). No widget library here.
"""

from __future__ import annotations

import base64
import html
from pathlib import Path

from .. import fileio, tables
from ..errors import PhasePathError
from ..format import DisplayUnits
from ..report import Report
from ..route import Route
from ..routefile import dumps_route, save_route

__all__ = [
    "download_links",
    "report_link",
    "save_route_file",
    "save_crossings_csv",
    "NOTHING_YET",
    "ON_REQUEST",
]

NOTHING_YET = "<span style='font-size:12px;color:#555'>nothing to export yet</span>"
ON_REQUEST = (
    "<span style='font-size:12px;color:#555'>press “files” for route.json, crossings.csv "
    "and legs.csv, or “report” for report.html</span>"
)


def download_links(route: Route | None, report: Report | None, units: DisplayUnits) -> str:
    """Data links of the route file and the two tables (CSV in the display units)."""
    files = []
    if route is not None:
        files.append(("route.json", "application/json", dumps_route(route, "json")))
    if report is not None:
        files.append(
            (
                "crossings.csv",
                "text/csv",
                tables.csv_table(tables.CROSSINGS, report.crossings, units),
            )
        )
        files.append(("legs.csv", "text/csv", tables.csv_table(tables.LEGS, report.legs, units)))
    return _links(files)


def report_link(report: Report | None, units: DisplayUnits) -> str:
    """The data link of report.html, the review report of the route shown."""
    if report is None:
        return NOTHING_YET
    return _links([("report.html", "text/html", report.to_html(units.T, units.p, units.energy))])


def _links(files: list[tuple[str, str, str]]) -> str:
    if not files:
        return NOTHING_YET
    parts = []
    for name, mime, data in files:
        b64 = base64.b64encode(data.encode("utf-8")).decode("ascii")
        parts.append(
            f"<a download='{html.escape(name)}' href='data:{mime};base64,{b64}' "
            f"style='margin-right:12px'>⬇ {html.escape(name)}</a>"
        )
    return "".join(parts)


def save_route_file(route: Route | None, path: str | Path, why_not: str = "") -> Path:
    """Save the route as a route file (JSON or YAML by suffix)."""
    if route is None:
        raise PhasePathError(f"there is no valid route to save: {why_not or 'draw one first'}")
    return save_route(route, path)


def save_crossings_csv(report: Report | None, path: str | Path, units: DisplayUnits) -> Path:
    """Save the crossings table as CSV in the display units."""
    if report is None:
        raise PhasePathError("there are no results to save: draw at least one leg")
    fileio.write_text(path, tables.csv_table(tables.CROSSINGS, report.crossings, units))
    return Path(fileio.path_text(path))
