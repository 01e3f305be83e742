"""The route planner: draw, edit and read a route on a substance's phase diagram.

State lives in traitlets (``substance``, ``route``, ``report``, the display units, the leg kind
in force, the event that ends the next drawn leg, the mode). The planner keeps the user's drawing
as plain data (:mod:`.drawing`), translates the page's events into edits of it (:mod:`.events`),
keeps the edits for undo (:mod:`.history`), builds a :class:`phasepath.Route` from it through the
core and analyses it with ``Route.analyze``; it never computes a crossing, a state or a caution
itself. Each leg is drawn along the path the core gives (:func:`phasepath.paths.route_line`).
Every change ends in one batched update of the figure, the leg list and the tables
(``hold_sync`` on each touched widget), so the page redraws once.

>>> import phasepath as pp
>>> route = pp.Route("CO2", T="-20 degC", p="30 bar").isobar(T="20 degC")
>>> planner = pp.widgets.RoutePlanner(route)
>>> planner.report.crossings[0].kind
'vaporization'
"""

from __future__ import annotations

import contextlib
import html
from collections.abc import Iterator
from pathlib import Path
from typing import Any

import ipywidgets as W
import traitlets as tl

from ..catalog import registered
from ..catalog import substance as _substance
from ..catalog import substances as _substances
from ..errors import PhasePathError
from ..format import DisplayUnits
from ..paths import route_line
from ..records import EVENTS, LEG_KINDS
from ..report import Report
from ..route import Route
from ..substances import Substance
from ..units import ENERGY_UNITS, PRESSURE_UNITS, TEMPERATURE_UNITS, parse_quantity
from . import drawing, events, export
from .diagram import PhaseDiagram
from .history import History
from .panels import CSS, LegList, cautions_html, crossing_tip, legend_html, results_html

__all__ = ["RoutePlanner"]

_KINDS = ("auto", *drawing.KINDS)
_KIND_BUTTONS = [("auto", "auto", "pick constant T or constant p from the click's direction")] + [
    (kind.label, name, f"next leg: {kind.device}") for name, kind in LEG_KINDS.items()
]
#: Events offered for ending a drawn constant-p or constant-T leg ("" = at the click).
_EVENT_CHOICES = (*EVENTS, "5 K superheat", "5 K subcooling")
_UNIT_TEXT = {"degC": "°C", "degF": "°F", "K": "K"}
_HISTORY = 200  # undo steps kept


class RoutePlanner(W.VBox):
    """A phase diagram on which a route is drawn with the mouse or typed in, with its results.

    Parameters
    ----------
    substance : str, Substance or Route
        The substance to start with (``"CO2"``, ``"water"``, a substance built with
        ``pp.Substance.from_data``), or a route to draw.
    route : Route, optional
        A route to draw (its substance wins over ``substance``).
    T_unit, p_unit, energy_unit : str
        Display units: ``"K"``, ``"degC"``, ``"degF"``; ``"Pa"``, ``"kPa"``, ``"bar"``, ``"MPa"``,
        ``"psi"``, ``"atm"``; ``"J/kg"``, ``"kJ/kg"``, ``"Btu/lb"``.

    Attributes
    ----------
    route : Route or None
        The current route (None before a start is placed, or while the drawing is not a valid
        route of the substance; ``message`` then says why). Assigning a route draws it.
    report : Report or None
        The analysis of ``route`` (None without legs).
    leg_kind : str
        The kind of the next leg drawn with the mouse: "auto" (constant T or constant p, from the
        click's direction), or a kind of :data:`phasepath.records.LEG_KINDS`.
    until : str
        An event that ends the next constant-p or constant-T leg instead of the click's
        coordinate ("fully vapor", "first solid", "5 K superheat", ...); "" for the click.
    message : str
        The last error or status, as shown above the table.
    """

    substance = tl.Unicode("CarbonDioxide")
    route = tl.Instance(Route, allow_none=True)
    report = tl.Instance(Report, allow_none=True, read_only=True)
    T_unit = tl.Enum(TEMPERATURE_UNITS, "degC")
    p_unit = tl.Enum(PRESSURE_UNITS, "bar")
    energy_unit = tl.Enum(ENERGY_UNITS, "kJ/kg")
    leg_kind = tl.Enum(_KINDS, "auto")
    until = tl.Unicode("")
    mode = tl.Enum(("draw", "pan"), "draw")
    message = tl.Unicode("")

    def __init__(
        self,
        substance: Any = "CO2",
        route: Route | None = None,
        *,
        T_unit: str = "degC",
        p_unit: str = "bar",
        energy_unit: str = "kJ/kg",
    ) -> None:
        if isinstance(substance, Route):
            route, substance = substance, substance.substance
        sub = route.substance if route is not None else _substance(substance)
        super().__init__(layout=W.Layout(width="100%"))
        self.add_class("pp-planner")
        self._busy = True
        self._history = History(_HISTORY)
        self._valid = True
        self._shown: list[tuple[float, float]] = []
        self._corners: list[tuple[float, float]] = []  # of the drawing in force (SI)
        self._path: list[tuple[float, float]] | None = None  # along every leg (SI)
        self._sub: Substance = sub
        self._names: tuple[str, ...] = ()
        self.T_unit, self.p_unit, self.energy_unit = T_unit, p_unit, energy_unit
        self.substance = sub.name
        self.diagram = PhaseDiagram(T_unit, p_unit)
        self._build_controls()
        self._layout()
        self._busy = False
        self._spec = drawing.from_route(route) if route is not None else drawing.empty(_key_of(sub))
        self.diagram.set_substance(sub)
        self.legend.value = _legend(sub)
        self._apply(self._spec, fit=True)

    @property
    def units(self) -> DisplayUnits:
        """The display units in force."""
        return DisplayUnits(self.T_unit, self.p_unit, self.energy_unit)

    # -- construction --------------------------------------------------------------------------
    def _build_controls(self) -> None:
        self._names = self._picker_names()
        self.picker = W.Combobox(
            options=list(self._names),
            ensure_option=False,
            continuous_update=False,
            placeholder="type to filter…",
            description="Substance",
            layout=W.Layout(width="260px"),
        )
        self.kind_toggle = W.ToggleButtons(
            options=[(label, kind) for label, kind, _ in _KIND_BUTTONS],
            value="auto",
            tooltips=[tip for _, _, tip in _KIND_BUTTONS],
            style={"button_width": "84px"},
        )
        self.until_pick = W.Combobox(
            options=list(_EVENT_CHOICES),
            value="",
            ensure_option=False,
            continuous_update=False,
            placeholder="at the click",
            description="ends",
            tooltip="end the next constant-p or constant-T leg on an event",
            style={"description_width": "initial"},
            layout=W.Layout(width="165px"),
        )
        self.mode_toggle = W.ToggleButtons(
            options=[("draw", "draw"), ("pan/zoom", "pan")],
            value="draw",
            style={"button_width": "80px"},
            tooltips=[
                "clicks add corners; drag a corner to move it",
                "drag to pan, scroll to zoom",
            ],
        )
        button = W.Layout(width="80px")
        self.fit_btn = W.Button(
            description="fit",
            icon="expand",
            tooltip="show the whole route",
            layout=W.Layout(width="70px"),
        )
        self.undo_btn = W.Button(description="undo", icon="undo", layout=button)
        self.redo_btn = W.Button(description="redo", icon="repeat", layout=button)
        self.clear_btn = W.Button(description="clear", icon="eraser", layout=button)
        initial = {"description_width": "initial"}
        self.T_pick = W.Dropdown(
            options=[(_UNIT_TEXT[u], u) for u in TEMPERATURE_UNITS],
            description="temperature",
            style=initial,
            layout=W.Layout(width="170px"),
        )
        self.p_pick = W.Dropdown(
            options=list(PRESSURE_UNITS),
            description="pressure",
            style=initial,
            layout=W.Layout(width="160px"),
        )
        self.e_pick = W.Dropdown(
            options=list(ENERGY_UNITS),
            description="energy",
            style=initial,
            layout=W.Layout(width="160px"),
        )
        self.start_T = W.Text(placeholder="T, e.g. 25 degC", layout=W.Layout(width="120px"))
        self.start_p = W.Text(placeholder="p, e.g. 1 bar", layout=W.Layout(width="120px"))
        self.start_btn = W.Button(description="place start", layout=W.Layout(width="110px"))
        self.start_msg = W.HTML()
        self.legs = LegList(self._edit_corner, self._delete_corner, self._typed_leg)
        self.status = W.HTML()
        self.results = W.HTML()
        self.legend = W.HTML(legend_html())
        self.cautions = W.HTML()
        self.files_btn = W.Button(
            description="files",
            icon="download",
            layout=button,
            tooltip="prepare route.json, crossings.csv and legs.csv of the route shown",
        )
        self.downloads = W.HTML(export.ON_REQUEST)
        self.png_btn = W.Button(description="PNG", icon="image", layout=button)
        self.svg_btn = W.Button(description="SVG", icon="image", layout=button)
        self.style_html = W.HTML(CSS, layout=W.Layout(height="0px", overflow="hidden"))

        self.picker.observe(self._picked, names="value")
        for trait, control in (
            ("leg_kind", self.kind_toggle),
            ("until", self.until_pick),
            ("mode", self.mode_toggle),
            ("T_unit", self.T_pick),
            ("p_unit", self.p_pick),
            ("energy_unit", self.e_pick),
        ):
            tl.link((self, trait), (control, "value"))
        self.fit_btn.on_click(lambda _b: self.fit())
        self.undo_btn.on_click(lambda _b: self.undo())
        self.redo_btn.on_click(lambda _b: self.redo())
        self.clear_btn.on_click(lambda _b: self.clear())
        self.start_btn.on_click(lambda _b: self._typed_start())
        self.files_btn.on_click(lambda _b: self.prepare_files())
        self.png_btn.on_click(lambda _b: self.save_png())
        self.svg_btn.on_click(lambda _b: self.save_svg())
        c = self.diagram.corners
        c.observe(self._corners_changed, names=["x", "y"])
        c.on_drag(self._dragging)
        c.on_hover(self._hover_corner)
        self.diagram.crossings.on_hover(self._hover_crossing)

    def _layout(self) -> None:
        bar = W.HBox(
            [
                self.picker,
                self.kind_toggle,
                self.until_pick,
                self.mode_toggle,
                self.fit_btn,
                self.undo_btn,
                self.redo_btn,
                self.clear_btn,
            ],
            layout=W.Layout(flex_flow="row wrap", align_items="center"),
        )
        units = W.HBox(
            [W.HTML("<b>Units</b>&nbsp;&nbsp;"), self.T_pick, self.p_pick, self.e_pick],
            layout=W.Layout(align_items="center"),
        )
        self.start_box = W.VBox(
            [
                W.HTML("<div class='pp-h'>Start state</div>"),
                W.HBox([self.start_T, self.start_p, self.start_btn]),
                W.HTML(
                    "<span style='font-size:11px;color:#555'>p may be a fill density "
                    "instead (e.g. 450 kg/m3)</span>"
                ),
                self.start_msg,
            ]
        )
        side = W.VBox(
            [self.start_box, self.legs], layout=W.Layout(flex="0 0 380px", padding="0 0 0 12px")
        )
        plot = W.VBox(
            [self.diagram.figure, self.legend, self.diagram.css], layout=W.Layout(flex="1 1 auto")
        )
        files = W.HBox(
            [
                W.HTML("<b>Export</b>&nbsp;"),
                self.files_btn,
                self.downloads,
                W.HTML("&nbsp;diagram:&nbsp;"),
                self.png_btn,
                self.svg_btn,
            ],
            layout=W.Layout(align_items="center", flex_flow="row wrap"),
        )
        self.children = [
            self.style_html,
            bar,
            units,
            W.HBox([plot, side]),
            self.status,
            self.results,
            files,
            self.cautions,
        ]

    # -- public --------------------------------------------------------------------------------
    def undo(self) -> None:
        """Go back one edit."""
        previous = self._history.undo(self._spec)
        if previous is not None:
            self._apply(previous)

    def redo(self) -> None:
        """Redo the last undone edit."""
        later = self._history.redo(self._spec)
        if later is not None:
            self._apply(later)

    def clear(self) -> None:
        """Remove every corner (undoable)."""
        self._commit(drawing.empty(self.substance), force=True)

    def fit(self) -> None:
        """Show the whole diagram and the whole route."""
        self.diagram.set_window(*self.diagram.fit_window(list(self._corners)))

    def add_corner(self, T: object, p: object, kind: str | None = None) -> str:
        """Add the next corner at (T, p) as a click would (snapped to ``kind``, or to
        ``leg_kind``). Numbers are in the display units; strings may carry a unit. Returns the
        error message, or "" when the corner was added."""
        try:
            Ts = events.typed_text(T, "temperature", self.units)
            ps = events.typed_text(p, "pressure", self.units)
        except PhasePathError as exc:
            return self._say(str(exc))
        return self._add(Ts, ps, kind)

    def add_leg(self, kind: str, target: object = None, *, until: str | None = None) -> str:
        """Add a leg at the end as typed in the leg list: ``add_leg("isenthalp", "1 atm")``,
        ``add_leg("isobar", until="fully vapor")``. A bare number is in the display unit of the
        coordinate the kind moves along. Returns the error message, or "" when it was added."""
        text = f"until {until}" if until else ("" if target is None else str(target))
        return self._typed_leg(kind, text)

    def prepare_files(self) -> None:
        """Build the download links (route.json, crossings.csv, legs.csv) of the route shown;
        they are built on request only, and withdrawn when the route changes."""
        self.downloads.value = export.download_links(self.route, self.report, self.units)

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
        """Download the diagram as PNG (done by the browser showing the planner)."""
        self.diagram.figure.save_png(filename)

    def save_svg(self, filename: str = "phase-route.svg") -> None:
        """Download the diagram as SVG (done by the browser showing the planner)."""
        self.diagram.figure.save_svg(filename)

    # -- trait observers -----------------------------------------------------------------------
    @tl.observe("route")
    def _route_assigned(self, change: dict[str, Any]) -> None:
        if self._busy or change["new"] is None:
            return
        route: Route = change["new"]
        self._use_substance(route.substance)
        self._commit(drawing.from_route(route), force=True, fit=True)

    @tl.observe("substance")
    def _substance_set(self, change: dict[str, Any]) -> None:
        if self._busy:
            return
        try:
            sub = self._resolve(change["new"])
        except PhasePathError as exc:
            with self._quiet():
                self.substance = change["old"]
            self._say(str(exc))
            return
        self._switch(sub)

    @tl.observe("T_unit", "p_unit", "energy_unit")
    def _units_set(self, change: dict[str, Any]) -> None:
        if self._busy:
            return
        self.diagram.set_units(self.T_unit, self.p_unit)
        self._refresh()

    @tl.observe("mode")
    def _mode_set(self, change: dict[str, Any]) -> None:
        self.diagram.set_mode(change["new"])

    # -- events from the page ------------------------------------------------------------------
    def _picked(self, change: dict[str, Any]) -> None:
        if self._busy or not change["new"]:
            return
        try:
            sub = self._resolve(change["new"])
        except PhasePathError as exc:
            self._say(str(exc))
            return
        if sub is not self._sub:
            self._switch(sub)

    def _corners_changed(self, change: dict[str, Any]) -> None:
        """A click added a point to the corner Scatter, or a drag ended and moved one."""
        if self._busy:
            return
        c = self.diagram.corners
        x, y = list(c.x), list(c.y)
        what, i = events.read_change(self._shown, x, y)
        if what in ("add", "move") and i is not None:
            Ts, ps = events.point_text(x[i], y[i], self.units)
            if what == "add":
                self._add(Ts, ps, None)
            else:
                self._move(i, Ts, ps)
        elif what == "redraw":
            self._redraw()

    def _dragging(self, _mark: Any, event: dict[str, Any]) -> None:
        """While a corner is dragged: move only the route line, straight between the corners
        (no analysis; the true path is drawn when the drag ends)."""
        try:
            i = int(event["index"])
            Ts, ps = events.point_text(event["point"]["x"], event["point"]["y"], self.units)
            spec = drawing.move_corner(self._spec, i, Ts, ps)
            self.diagram.preview_route(drawing.corners(spec))
        except (KeyError, TypeError, ValueError, IndexError):
            return

    def _hover_corner(self, _mark: Any, event: dict[str, Any]) -> None:
        i = events.event_index(event)
        pts = self._corners
        if i is None or i >= len(pts):
            return
        T, p = pts[i]
        phase = ""
        if self.report is not None:
            legs = self.report.legs
            st = legs[0].start if i == 0 else legs[min(i, len(legs)) - 1].end
            phase = f"<br>{html.escape(_state_text(st))}"
        self.diagram.corners.tooltip.value = (
            f"<div class='pp-tip'><b>corner {'S' if i == 0 else i}</b><br>"
            f"{self.diagram.fmt_T(T)}<br>{self.diagram.fmt_p(p)}{phase}</div>"
        )

    def _hover_crossing(self, _mark: Any, event: dict[str, Any]) -> None:
        i = events.event_index(event)
        if self.report is None or i is None or i >= len(self.report.crossings):
            return
        c = self.report.crossings[i]
        self.diagram.crossings.tooltip.value = (
            "<div class='pp-tip'>"
            + html.escape(crossing_tip(c, self.units))
            + (f"<br>{html.escape(c.detail)}" if c.detail else "")
            + "".join(f"<br>⚠ {html.escape(h.kind)}: {html.escape(h.reason)}" for h in c.hazards)
            + "</div>"
        )

    def _edit_corner(self, index: int, coord: str, typed: str) -> str:
        if index == 0 and coord == "p" and events.is_density(typed):
            spec = drawing.copy_with_start(self._spec, density=typed.strip())
            return self._commit(spec, keep_fields=True)
        try:
            dimension = "temperature" if coord == "T" else "pressure"
            value = events.typed_text(typed, dimension, self.units)
        except PhasePathError as exc:
            return self._say(str(exc), keep_fields=True)
        kw = {"T_text": value} if coord == "T" else {"p_text": value}
        return self._move(index, keep_fields=True, **kw)

    def _delete_corner(self, index: int) -> str:
        try:
            spec = drawing.delete_corner(self._spec, index)
        except IndexError as exc:
            return self._say(str(exc), keep_fields=True)
        return self._commit(spec)

    def _typed_start(self) -> None:
        try:
            Ts = events.typed_text(self.start_T.value, "temperature", self.units)
            if events.is_density(self.start_p.value):
                ps, density = None, self.start_p.value.strip()
            else:
                ps = events.typed_text(self.start_p.value, "pressure", self.units)
                density = None
        except PhasePathError as exc:
            self.start_msg.value = f"<span class='pp-err'>⚠ {html.escape(str(exc))}</span>"
            return
        if density is not None:
            spec = drawing.copy_with_start(self._spec, T=Ts, density=density)
        elif self._spec["start"] is None:
            spec = drawing.add_corner(self._spec, Ts, ps or "", "isobar")
        else:
            spec = drawing.move_corner(self._spec, 0, Ts, ps)
        msg = self._commit(spec, fit=True)
        self.start_msg.value = f"<span class='pp-err'>⚠ {html.escape(msg)}</span>" if msg else ""

    def _typed_leg(self, kind: str, typed: str) -> str:
        """A leg typed in the leg list (see :func:`phasepath.widgets.events.typed_target`)."""
        try:
            target = events.typed_target(kind, typed, self.units)
            spec = drawing.add_leg(self._spec, kind, **target)
        except PhasePathError as exc:
            return self._say(str(exc), keep_fields=True)
        return self._commit(spec, fit=True)

    # -- edits ---------------------------------------------------------------------------------
    def _add(self, T_text: str, p_text: str, kind: str | None) -> str:
        kind = kind or self.leg_kind
        if kind == "auto":
            window = self.diagram.window() or self.diagram.fit_window(self._corners)
            last = self._corners[-1] if self._corners else None
            T1 = parse_quantity(T_text, "temperature")
            p1 = parse_quantity(p_text, "pressure")
            kind = events.auto_kind(last, T1, p1, window)
        until = self.until.strip() if "until" in LEG_KINDS[kind].targets else ""
        try:
            spec = drawing.add_corner(self._spec, T_text, p_text, kind, until or None)
        except PhasePathError as exc:
            self._say(str(exc))
            self._redraw()
            return str(exc)
        return self._commit(spec)

    def _move(
        self,
        index: int,
        T_text: str | None = None,
        p_text: str | None = None,
        keep_fields: bool = False,
    ) -> str:
        try:
            spec = drawing.move_corner(self._spec, index, T_text, p_text)
        except (IndexError, PhasePathError) as exc:
            msg = self._say(str(exc), keep_fields=keep_fields)
            if not keep_fields:
                self._redraw()  # the dragged corner goes back where it was
            return msg
        return self._commit(spec, keep_fields=keep_fields)

    def _commit(
        self,
        spec: drawing.Spec,
        *,
        force: bool = False,
        fit: bool = False,
        keep_fields: bool = False,
    ) -> str:
        """Take an edit if it gives a valid, analysable route (or ``force``); else keep the last
        good route. Returns the error message ("" when the edit was taken and is valid)."""
        result = _evaluate(spec)
        err = result[2]
        if err and not force and self._valid:
            self._say(err, keep_fields=keep_fields)
            if not keep_fields:
                self._redraw()
            return err
        self._history.push(self._spec)
        self._apply(spec, fit=fit, result=result)
        return err

    def _switch(self, sub: Substance) -> None:
        self._use_substance(sub)
        self._commit({**self._spec, "substance": _key_of(sub)}, force=True, fit=True)

    def _use_substance(self, sub: Substance) -> None:
        """Make ``sub`` the planner's substance: the trait, the diagram's curves, the legend."""
        if sub is self._sub and self.substance == sub.name:
            return
        self._sub = sub
        with self._quiet():
            self.substance = sub.name
        self.diagram.set_substance(sub)
        self.legend.value = _legend(sub)

    def _resolve(self, name: object) -> Substance:
        """The substance for a name (the planner's own one first: a substance built from data
        may share its name with nothing else)."""
        if isinstance(name, Substance):
            return name
        if isinstance(name, str) and name == self._sub.name:
            return self._sub
        return _substance(name)

    # -- state -> view -------------------------------------------------------------------------
    def _apply(
        self,
        spec: drawing.Spec,
        fit: bool = False,
        result: tuple[Route | None, Report | None, str] | None = None,
    ) -> None:
        """Make ``spec`` the drawing: build and analyse the route, then redraw once."""
        try:
            sub = self._resolve(spec["substance"])
        except PhasePathError:
            sub = self._sub
        self._use_substance(sub)
        self._spec = spec
        route, report, msg = result if result is not None else _evaluate(spec)
        self._valid = not msg
        try:
            self._corners = drawing.corners(spec, route)
        except PhasePathError:
            self._corners = []
        ok = report is not None and not msg
        self._path = route_line(report.substance, report.legs, report.crossings) if ok else None
        with self._quiet():
            self.route = route if not msg else None
            self.set_trait("report", report if not msg else None)
        self._refresh(msg, fit=fit)

    def _refresh(self, msg: str | None = None, fit: bool = False) -> None:
        if msg is None:
            msg = self.message
        pts = self._corners
        with self._batch():
            if fit:
                self.fit()
            self._draw_route(pts)
            kinds = ["start"] + [leg["kind"] for leg in self._spec["legs"]]
            ends = [""] + [str(leg.get("until", "")) for leg in self._spec["legs"]]
            if self.route is not None:  # the core's words for the event ("fully vapor at ...")
                ends = [""] + [leg.event or "" for leg in self.route.legs]
            self.legs.show(pts, kinds[: len(pts)], self.T_unit, self.p_unit, ends[: len(pts)])
            self.start_box.layout.display = "none" if pts else None
            self.results.value = results_html(self.report, self.units)
            if self.downloads.value != export.ON_REQUEST:
                self.downloads.value = export.ON_REQUEST  # links of an older route: withdrawn
            self.cautions.value = cautions_html(self.report)
            self.undo_btn.disabled = not self._history.can_undo
            self.redo_btn.disabled = not self._history.can_redo
            names = self._picker_names()
            if names != self._names:
                self._names = names
                self.picker.options = list(names)
            with self._quiet():
                self.picker.value = self._sub.name
            self._say(msg)

    def _redraw(self) -> None:
        with self._batch():
            self._draw_route(self._corners)

    def _draw_route(self, pts: list[tuple[float, float]]) -> None:
        with self._quiet():
            self.diagram.set_route(pts, valid=self._valid, path=self._path if self._valid else None)
            self._shown = list(zip(self.diagram.corners.x, self.diagram.corners.y, strict=True))
        cross = [(c.T, c.p) for c in self.report.crossings] if self.report else []
        self.diagram.set_crossings(cross)

    def _say(self, msg: str, keep_fields: bool = False) -> str:
        self.message = msg
        if msg:
            self.status.value = f"<div class='pp-status pp-bad'>⚠ {html.escape(msg)}</div>"
        elif self.report is not None:
            n = len(self.report.crossings)
            nh = len(self.report.cautions)
            flags = f", {nh} caution(s): see the tables and the cautions" if nh else ""
            self.status.value = (
                f"<div class='pp-status pp-ok'>{html.escape(self._sub.name)}: "
                f"{len(self.report.legs)} leg(s), {n} crossing(s){flags}.</div>"
            )
        else:
            self.status.value = ""
        return msg

    # -- helpers -------------------------------------------------------------------------------
    def _picker_names(self) -> tuple[str, ...]:
        """Substances built from data in this session first, then the reference substances."""
        custom = [n for n in registered() if n]
        if self._sub.name not in custom and not self._sub.named:
            custom.append(self._sub.name)
        return tuple(custom + sorted(_substances(), key=str.lower))

    @contextlib.contextmanager
    def _quiet(self) -> Iterator[None]:
        old, self._busy = self._busy, True
        try:
            yield
        finally:
            self._busy = old

    @contextlib.contextmanager
    def _batch(self) -> Iterator[None]:
        """Hold every touched widget's messages until the end: the page redraws once."""
        with contextlib.ExitStack() as stack:
            for w in [
                *self.diagram.widgets(),
                self.legs,
                self.results,
                self.status,
                self.downloads,
                self.cautions,
                self.start_box,
                self.picker,
            ]:
                stack.enter_context(w.hold_sync())
            yield


def _evaluate(spec: drawing.Spec) -> tuple[Route | None, Report | None, str]:
    """(route, report, error message) of a drawing; the core does all the work."""
    try:
        route = drawing.build(spec)
        report = route.analyze() if route is not None and route.legs else None
        return route, report, ""
    except PhasePathError as exc:
        return None, None, str(exc)
    except Exception as exc:  # noqa: BLE001 - a defect in phasepath: say so, keep the drawing
        return (
            None,
            None,
            f"phasepath could not analyse this route ({type(exc).__name__}: {exc}); the "
            f"drawing is kept. Please report this route.",
        )


def _key_of(sub: Substance) -> Any:
    """How a drawing names a substance: its name, or the substance itself where the name alone
    would not find it again (built from data under a reference substance's name)."""
    try:
        return sub.name if _substance(sub.name) is sub else sub
    except PhasePathError:
        return sub


def _legend(sub: Substance) -> str:
    ranged = any(b.T_valid is not None for b in sub.boundaries)
    return legend_html(ranged, tuple({b.kind for b in sub.boundaries}))


def _state_text(st: Any) -> str:
    parts = []
    if st.vapor_fraction is not None:
        parts.append(f"vapor {st.vapor_fraction:.1%}")
    if st.solid_fraction is not None:
        parts.append(f"solid {st.solid_fraction:.1%}")
    return st.text + (f", {', '.join(parts)} by mass" if parts else "")
