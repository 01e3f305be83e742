"""The route planner: draw, edit and read a route on three linked views of a substance's phase
diagram (P–T, p–h, T–s).

State lives in traitlets (``substance``, ``route``, ``report``, the display units, the leg kind
in force, the event that ends the next drawn leg, the mode, the selected corner). The planner
keeps the user's drawing as plain data (:mod:`.drawing`), translates the page's events into edits
of it (:mod:`.pointer`, :mod:`.clicks`, :mod:`.events`), keeps the edits for undo
(:mod:`.history`), builds a :class:`phasepath.Route` from it through the core and analyses it
with ``Route.analyze``; it never computes a crossing, a state or a caution itself. Each view draws
the path the core gives (:meth:`phasepath.Report.path`). Every change ends in one batched update
of the figures, the leg list and the tables (``hold_sync`` on each touched widget), so the page
redraws once.

>>> import phasepath as pp
>>> route = pp.Route("CO2", T="-20 degC", p="30 bar").isobar(T="20 degC")
>>> planner = pp.widgets.RoutePlanner(route)
>>> planner.report.crossings[0].kind
'vaporization'
>>> list(planner.figures)
['pT', 'ph', 'Ts']
"""

from __future__ import annotations

import contextlib
import functools
import html
from collections.abc import Iterator
from typing import Any

import ipywidgets as W
import traitlets as tl

from ..catalog import display_name, registered
from ..catalog import substance as _substance
from ..catalog import substances as _substances
from ..eos import fluid_info
from ..errors import PhasePathError
from ..format import DisplayUnits
from ..paths import route_line, route_states
from ..records import LEG_KINDS, StatePoint
from ..report import Report
from ..route import Route
from ..substances import Substance
from ..units import ENERGY_UNITS, PRESSURE_UNITS, TEMPERATURE_UNITS, parse_quantity
from ..views import VIEWS, coordinates
from . import controls, drawing, events, export, shapes
from .canvas import ViewCanvas
from .diagram import PhaseDiagram
from .documents import Documents
from .energy import EnergyDiagram
from .history import History
from .panels import cautions_html, legend_html, results_html
from .pointer import PointerEvents
from .readout import in_display_units

__all__ = ["RoutePlanner"]

_HISTORY = 200  # undo steps kept


class RoutePlanner(PointerEvents, Documents, W.VBox):
    """Three linked views of a route (P–T, p–h, T–s) drawn with the mouse or typed in, with its
    results.

    Parameters
    ----------
    substance : str, Substance or Route
        The substance to start with (``"CO2"``, ``"water"``, a substance built with
        ``pp.Substance.from_data``), or a route to draw.
    route : Route, optional
        A route to draw (its substance wins over ``substance``).
    T_unit, p_unit, energy_unit : str
        Display units: ``"K"``, ``"degC"``, ``"degF"``; ``"Pa"``, ``"kPa"``, ``"bar"``, ``"MPa"``,
        ``"psi"``, ``"atm"``; ``"J/kg"``, ``"kJ/kg"``, ``"Btu/lb"`` (entropy follows it).

    Attributes
    ----------
    route : Route or None
        The current route (None before a start is placed, or while the drawing is not a valid
        route of the substance; ``message`` then says why). Assigning a route draws it.
    report : Report or None
        The analysis of ``route`` (None without legs).
    figures : dict
        The three bqplot figures, keyed by view: ``"pT"``, ``"ph"``, ``"Ts"``.
    selected : int or None
        The selected corner (0 is the start), marked in every view and in the leg list.
    leg_kind, until, mode, message
        The kind of the next leg drawn ("auto" or a kind of
        :data:`phasepath.records.LEG_KINDS`), the event that ends it ("" for the click), "draw"
        or "pan", and the last error or status shown.
    """

    substance = tl.Unicode("CarbonDioxide")
    route = tl.Instance(Route, allow_none=True)
    report = tl.Instance(Report, allow_none=True, read_only=True)
    T_unit = tl.Enum(TEMPERATURE_UNITS, "degC")
    p_unit = tl.Enum(PRESSURE_UNITS, "bar")
    energy_unit = tl.Enum(ENERGY_UNITS, "kJ/kg")
    leg_kind = tl.Enum(controls.KIND_CHOICES, "auto")
    until = tl.Unicode("")
    mode = tl.Enum(("draw", "pan"), "draw")
    message = tl.Unicode("")
    selected = tl.Int(None, allow_none=True)

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
        self._corners: list[tuple[float, float]] = []  # of the drawing in force (SI)
        self._states: list[StatePoint | None] = []  # the state at each corner
        self._path: list[StatePoint] = []  # along the whole route (p-h and T-s)
        self._view_crossings: dict[str, list[Any]] = {}
        self._sub: Substance = sub
        self._names: tuple[str, ...] = ()
        self._by_name: dict[str, Any] = {}
        self.T_unit, self.p_unit, self.energy_unit = T_unit, p_unit, energy_unit
        self.substance = sub.name
        units = self.units
        self.canvases: dict[str, ViewCanvas] = {
            "pT": PhaseDiagram(units),
            "ph": EnergyDiagram("ph", units),
            "Ts": EnergyDiagram("Ts", units),
        }
        self.diagram: PhaseDiagram = self.canvases["pT"]  # type: ignore[assignment]
        self.figures = {view: self.canvases[view].figure for view in VIEWS}
        self._names = self._picker_names()
        controls.build(self)
        self.children = controls.arrange(self)
        self._wire()
        self._busy = False
        self._spec = drawing.from_route(route) if route is not None else drawing.empty(_key_of(sub))
        for c in self.canvases.values():
            c.set_substance(sub)
        self.legend.value = _legend(sub)
        self._apply(self._spec, fit=True)

    @property
    def units(self) -> DisplayUnits:
        """The display units in force."""
        return DisplayUnits(self.T_unit, self.p_unit, self.energy_unit)

    def _wire(self) -> None:
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
        self.report_btn.on_click(lambda _b: self.prepare_report())
        self.png_btn.on_click(lambda _b: self.save_png())
        self.svg_btn.on_click(lambda _b: self.save_svg())
        self.title_field.observe(lambda ch: self._doc_edited("title", ch["new"]), names="value")
        self.notes_field.observe(lambda ch: self._doc_edited("notes", ch["new"]), names="value")
        self.upload.observe(self._uploaded, names="value")
        self._connect_pointer()

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
        self._commit(drawing.empty(_key_of(self._sub)), force=True)

    def select(self, index: int | None) -> None:
        """Select corner ``index`` (None: none) in every view and in the leg list."""
        if index is not None and not 0 <= index < len(self._corners):
            index = None
        self.selected = index

    def fit(self) -> None:
        """Show the whole route in every view, with the curves it reaches."""
        forms = sorted({st.form for st in self._path if st.form} | self._crossed_forms())
        pts = list(self._corners) + self._line_pT()
        self.diagram.set_window(*self.diagram.fit_window(pts, forms))
        for view in ("ph", "Ts"):
            c = self.canvases[view]
            xy = [coordinates(st, view) for st in self._path or self._known_states()]
            c.set_window(*c.fit_window([q for q in xy if q is not None]))  # type: ignore[attr-defined]

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
        for c in self.canvases.values():
            c.set_units(self.units)
        self._refresh()

    @tl.observe("mode")
    def _mode_set(self, change: dict[str, Any]) -> None:
        for c in self.canvases.values():
            c.set_mode(change["new"])

    @tl.observe("selected")
    def _selected_set(self, change: dict[str, Any]) -> None:
        if not self._busy:
            self._refresh()

    # -- events from the controls --------------------------------------------------------------
    def _picked(self, change: dict[str, Any]) -> None:
        if self._busy or not change["new"]:
            return
        try:
            sub = self._resolve(self._by_name.get(change["new"], change["new"]))
        except PhasePathError as exc:
            self._say(str(exc))
            return
        if sub is not self._sub:
            self._switch(sub)

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
            last = self._corners[-1] if self._corners else None
            window = self.diagram.window() or self.diagram.default_window()
            try:
                T1 = parse_quantity(T_text, "temperature")
                p1 = parse_quantity(p_text, "pressure")
            except PhasePathError as exc:
                return self._say(str(exc))
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
            self._redraw()  # a dragged corner goes back where it was
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
            self._redraw()
            return err
        self._history.push(self._spec)
        self._apply(spec, fit=fit, result=result)
        return err

    def _switch(self, sub: Substance) -> None:
        self._use_substance(sub)
        self._clear_notes()
        self._commit({**self._spec, "substance": _key_of(sub)}, force=True, fit=True)

    def _use_substance(self, sub: Substance) -> None:
        """Make ``sub`` the planner's substance: the trait, the diagrams' curves, the legend."""
        if sub is self._sub and self.substance == sub.name:
            return
        self._sub = sub
        with self._quiet():
            self.substance = sub.name
        for c in self.canvases.values():
            c.set_substance(sub)
        self.legend.value = _legend(sub)

    def _resolve(self, name: object) -> Substance:
        """The substance for a name (the planner's own one first: a substance built from data
        may share its name with nothing else)."""
        if isinstance(name, Substance):
            return name
        if isinstance(name, str) and name == self._sub.name:
            return self._sub
        if isinstance(name, str) and name in self._by_name:
            return self._resolve(self._by_name[name])
        return _substance(name)

    def _clear_notes(self) -> None:
        """Messages whose cause is gone: rejected entries, the start box's and the typed leg's."""
        self.legs.clear_rejections()
        self.legs.add_error.value = ""
        self.start_msg.value = ""

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
        self._states = shapes.corner_states(route if not msg else None, report if ok else None)
        self._path = route_states(sub, report.legs, report.crossings) if ok and report else []
        with self._quiet():
            self.route = route if not msg else None
            self.set_trait("report", report if ok else None)
            if self.selected is not None and self.selected >= len(self._corners):
                self.selected = None
        if not msg:
            self._clear_notes()
        self._refresh(msg, fit=fit)

    def _line_pT(self) -> list[tuple[float, float]]:
        rep = self.report
        return route_line(rep.substance, rep.legs, rep.crossings) if rep is not None else []

    def _known_states(self) -> list[StatePoint]:
        return [st for st in self._states if st is not None]

    def _crossed_forms(self) -> set[str]:
        rep = self.report
        if rep is None:
            return set()
        return {f for c in rep.crossings for f in (c.from_form, c.to_form) if f}

    def _refresh(self, msg: str | None = None, fit: bool = False) -> None:
        if msg is None:
            msg = self.message
        pts = self._corners
        with self._batch():
            if fit:
                self.fit()
            self._draw_route()
            kinds = ["start"] + [leg["kind"] for leg in self._spec["legs"]]
            ends = [""] + [str(leg.get("until", "")) for leg in self._spec["legs"]]
            if self.route is not None:  # the core's words for the event ("fully vapor at ...")
                ends = [""] + [in_display_units(leg.event, self.units) for leg in self.route.legs]
            states = (self._states + [None] * len(pts))[: len(pts)]
            self.legs.show(
                pts, kinds[: len(pts)], self.units, ends[: len(pts)], states, self.selected
            )
            self.start_box.layout.display = "none" if pts else None
            self.results.value = results_html(self.report, self.units)
            if self.downloads.value != export.ON_REQUEST:
                self.downloads.value = export.ON_REQUEST  # links of an older route: withdrawn
            self.cautions.value = cautions_html(self.report, self.units)
            self.undo_btn.disabled = not self._history.can_undo
            self.redo_btn.disabled = not self._history.can_redo
            names = self._picker_names()
            if names != self._names:
                self._names = names
                self.picker.options = list(names)
            with self._quiet():
                self.picker.value = self._label_of(self._sub)
                self.title_field.value = str(self._spec.get("title", "") or "")
                self.notes_field.value = str(self._spec.get("notes", "") or "")
            self._say(msg)

    def _redraw(self) -> None:
        with self._batch():
            self._draw_route()

    def _draw_route(self) -> None:
        rep = self.report if self._valid else None
        with self._quiet():
            for view, c in self.canvases.items():
                states = self._states if self._valid else []
                shape = shapes.view_shape(
                    view, self._corners, states, self._path, self._line_pT(), rep
                )
                self._view_crossings[view] = shape.records
                c.set_route(shape.corners, shape.line, shape.crossings, self._valid, self.selected)

    def _say(self, msg: str, keep_fields: bool = False) -> str:
        self.message = msg
        if msg:
            shown = html.escape(self._shown(msg))
            self.status.value = f"<div class='pp-status pp-bad'>⚠ {shown}</div>"
        elif self.report is not None:
            n = len(self.report.crossings)
            nh = len(self.report.cautions)
            flags = f", {nh} caution(s): see the tables and the cautions" if nh else ""
            self.status.value = (
                f"<div class='pp-status pp-ok'>{html.escape(display_name(self._sub))}: "
                f"{len(self.report.legs)} leg(s), {n} crossing(s){flags}.</div>"
            )
        else:
            self.status.value = ""
        return msg

    def _shown(self, msg: str) -> str:
        """A core message with its numbers in the display units."""
        return in_display_units(msg, self.units)

    # -- helpers -------------------------------------------------------------------------------
    def _label_of(self, sub: Substance) -> str:
        try:
            return display_name(sub) if sub.named else sub.name
        except PhasePathError:
            return sub.name

    def _picker_names(self) -> tuple[str, ...]:
        """Substances built from data in this session first, then the pure reference substances
        by their plain names with formula ("carbon dioxide (CO2)")."""
        custom = [n for n in registered() if n]
        if self._sub.name not in custom and not self._sub.named:
            custom.append(self._sub.name)
        shown, self._by_name = _reference_names()
        return tuple(custom) + shown

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
            for c in self.canvases.values():
                for w in c.widgets():
                    stack.enter_context(w.hold_sync())
            for w in [
                self.legs,
                self.results,
                self.status,
                self.downloads,
                self.cautions,
                self.start_box,
                self.picker,
                self.title_field,
                self.notes_field,
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


@functools.lru_cache(maxsize=1)
def _reference_names() -> tuple[tuple[str, ...], dict[str, str]]:
    """The pure reference substances by their plain names, and name -> CoolProp name (blends
    are not pure substances: not offered)."""
    by_name = {display_name(n): n for n in _substances() if fluid_info(n, "pure") == "true"}
    return tuple(sorted(by_name, key=str.lower)), by_name


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
