"""The planner's route document: its title and notes, opening and saving route files, the
typed start (T and p, T and density, or a quality), the tables and the exports (mixed into
RoutePlanner).

A route file opened here (``planner.load_route(path)`` or the upload control) is read by the
core's strict reader (:mod:`phasepath.routefile`) and drawn; the planner saves the same format.
"""

from __future__ import annotations

import html
from pathlib import Path
from typing import TYPE_CHECKING, Any

from .. import routefile
from ..errors import PhasePathError
from ..route import Route
from . import drawing, events, export
from .host import PlannerHost

if TYPE_CHECKING:  # pragma: no cover
    import ipywidgets as W

__all__ = ["Documents"]


class Documents(PlannerHost):
    """Title, notes, route files, the typed start and the exports of the planner."""

    route: Route | None
    message: str
    start_T: W.Text
    start_p: W.Text
    start_q: W.Text
    start_msg: W.HTML
    upload: W.FileUpload
    downloads: W.HTML
    figures: dict[str, Any]

    if TYPE_CHECKING:  # pragma: no cover - provided by the planner

        @property
        def T_unit(self) -> str: ...
        @property
        def p_unit(self) -> str: ...
        @property
        def energy_unit(self) -> str: ...
        def _shown(self, msg: str) -> str: ...

    def load_route(self, path: str | Path) -> Route:
        """Open a route file (JSON or YAML) in the planner; returns the route."""
        route = routefile.load_route(path)
        self.route = route
        return route

    def prepare_files(self) -> None:
        """Build the download links (route.json, crossings.csv, legs.csv) of the route shown;
        they are built on request only, and withdrawn when the route changes."""
        self.downloads.value = export.download_links(self.route, self.report, self.units)

    def prepare_report(self) -> None:
        """Build the download link of report.html, the review report of the route shown (see
        :meth:`phasepath.Report.to_html`), in the display units; withdrawn when the route
        changes."""
        self.downloads.value = export.report_link(self.report, self.units)

    def crossings_table(self) -> Any:
        """The crossings as a DataFrame in the display units (empty without a report)."""
        import pandas as pd

        if self.report is None:
            return pd.DataFrame()
        return self.report.table(self.T_unit, self.p_unit, self.energy_unit)

    def legs_table(self) -> Any:
        """Heat and work per leg as a DataFrame in the display units."""
        import pandas as pd

        if self.report is None:
            return pd.DataFrame()
        return self.report.legs_table(self.T_unit, self.p_unit, self.energy_unit)

    def save_route(self, path: str | Path) -> Path:
        """Save the current route as a route file (JSON or YAML by suffix)."""
        return export.save_route_file(self.route, path, self.message)

    def save_table(self, path: str | Path) -> Path:
        """Save the crossings table as CSV in the display units."""
        return export.save_crossings_csv(self.report, path, self.units)

    def save_png(self, filename: str = "phase-route.png") -> None:
        """Download the three diagrams as PNG (done by the browser showing the planner)."""
        stem = filename.rsplit(".", 1)[0]
        for view, fig in self.figures.items():
            fig.save_png(f"{stem}-{view}.png")

    def save_svg(self, filename: str = "phase-route.svg") -> None:
        """Download the three diagrams as SVG (done by the browser showing the planner)."""
        stem = filename.rsplit(".", 1)[0]
        for view, fig in self.figures.items():
            fig.save_svg(f"{stem}-{view}.svg")

    def _typed_start(self) -> None:
        try:
            start = self._start_fields()
        except PhasePathError as exc:
            self.start_msg.value = f"<span class='pp-err'>⚠ {html.escape(str(exc))}</span>"
            return
        if "T" in start and "p" in start and self._spec["start"] is None:
            spec = drawing.add_corner(self._spec, start["T"], start["p"], "isobar")
        else:
            spec = {**self._spec, "start": start}
        msg = self._commit(spec, fit=True)
        self.start_msg.value = (
            f"<span class='pp-err'>⚠ {html.escape(self._shown(msg))}</span>" if msg else ""
        )

    def _start_fields(self) -> dict[str, Any]:
        """The start as typed in the start box: T and p, T and density, or a quality with T or
        p (where the core's Route takes a quality)."""
        T_in, p_in, q_in = (f.value.strip() for f in (self.start_T, self.start_p, self.start_q))
        start: dict[str, Any] = {}
        if T_in:
            start["T"] = events.typed_text(T_in, "temperature", self.units)
        if q_in:  # kept as typed: the core checks it (a number from 0 to 1)
            q = q_in
            if p_in:  # on the saturation curve at p (a temperature typed too is not needed)
                return {"p": events.typed_text(p_in, "pressure", self.units), "quality": q}
            if "T" not in start:
                raise PhasePathError("a quality start needs its temperature or its pressure")
            return {"T": start["T"], "quality": q}
        if "T" not in start:
            raise PhasePathError("type the start temperature")
        if events.is_density(p_in):
            start["density"] = p_in
        else:
            start["p"] = events.typed_text(p_in, "pressure", self.units)
        return start

    def _doc_edited(self, key: str, value: str) -> None:
        if self._busy or self._spec.get(key, "") == value:
            return
        self._commit({**self._spec, key: value}, force=True)

    def _uploaded(self, change: dict[str, Any]) -> None:
        if self._busy or not change["new"]:
            return
        item = change["new"][0]
        name = str(item.get("name", "route.json"))
        try:
            text = bytes(item["content"]).decode("utf-8")
            fmt = "yaml" if name.lower().endswith((".yaml", ".yml")) else "json"
            route = routefile.loads_route(text, fmt, source=name)
        except (PhasePathError, UnicodeDecodeError, KeyError) as exc:
            self._say(f"{name}: {exc}")
        else:
            self.route = route
        with self._quiet():
            self.upload.value = ()
