"""One view of the route as a bqplot figure: the substance's boundaries, labelled points and
regions, the route, its corners and crossings, a readout line under it, and the page's clicks and
pointer moves (through ipyevents).

The figure holds no state of its own: the planner hands it SI values and the display units, and
it converts them for drawing. Its scales have no padding, so a pixel of the plot area maps to
data exactly (:class:`phasepath.widgets.coords.Frame`); a click on the page arrives as a message
with its pixel, in order, however fast the clicks come, and the planner turns it into an edit.
Subclasses say where the window and the region names go (:mod:`.diagram` for P–T,
:mod:`.energy` for p–h and T–s).
"""

from __future__ import annotations

import math
from collections.abc import Callable, Sequence
from typing import Any

import bqplot as bq
import ipyevents
import ipywidgets as W
import numpy as np

from ..format import UNIT_LABELS, DisplayUnits
from ..substances import Substance
from ..views import AXES, ViewCurve, ViewPoint
from ..views import curves as view_curves
from ..views import points as view_points
from .coords import LABELS, Frame, event_pixel, frame_of, to_view, view_units
from .labels import ROOM, classify_grid, grid_points, label_spots
from .ticks import linear_format, log_ticks

__all__ = ["ViewCanvas", "STYLE", "MARGIN"]

#: Colours and marks of the diagrams. The colours are drawn from a palette chosen to stay
#: distinct for the common forms of colour-blindness; every curve also differs by its dash
#: pattern, so the diagram reads in greyscale print.
STYLE: dict[str, dict[str, Any]] = {
    "vaporization": {"color": "#0b5fa5", "dash": "solid", "width": 2.5, "label": "vapor pressure"},
    "melting": {"color": "#b34700", "dash": "dashed", "width": 2.5, "label": "melting"},
    "sublimation": {
        "color": "#2a7d5f",
        "dash": "dash_dotted",
        "width": 2.5,
        "label": "sublimation",
    },
    "triple": {"color": "#1d1d1f", "dash": "solid", "width": 2.0, "label": "triple-point line"},
    # a custom substance's curve beyond the range of its data (Boundary.T_valid): same colour,
    # dotted and thinner, so an extrapolation never reads as data
    "extrapolated": {"dash": "dotted", "width": 1.8, "label": "beyond the data"},
    "route": {"color": "#1d1d1f", "width": 3.0},
    "route_invalid": {"color": "#8a8a8a", "width": 2.0},
    "corner": {"fill": "#ffffff", "start": "#1d1d1f", "stroke": "#1d1d1f"},
    "selected": {"stroke": "#d1495b"},
    "crossing": {"fill": "#f2b01e", "stroke": "#1d1d1f", "marker": "diamond"},
    "triple_point": {"fill": "#1d1d1f", "marker": "triangle-up"},
    "critical": {"fill": "#ffffff", "marker": "square"},
    "region": {"color": "#7a7a7a"},
    "point_label": {"color": "#3a3a3a"},
}
#: Margins of every figure [px] (the plot area's position in the figure).
MARGIN = {"top": 16, "bottom": 48, "left": 76, "right": 18}

_CSS = """
<style>
.pp-diagram path.line, .pp-diagram text, .pp-diagram .label { pointer-events: none; }
.pp-diagram .plotarea_events { cursor: crosshair; }
/* the crossings (the last mark, before the legend) are drawn above the corners and let the
   pointer through, so a corner under a crossing can still be dragged */
.pp-diagram svg.svg-figure > g > g:first-of-type > g:nth-last-child(2) { pointer-events: none; }
.pp-diagram.pp-pan .plotarea_events { cursor: move; }
.pp-readout { font-size: 12px; color: #333; min-height: 18px; font-variant-numeric: tabular-nums;
  padding: 0 0 0 76px; white-space: nowrap; overflow: hidden; text-overflow: ellipsis; }
</style>
"""
_EMPTY = np.array([], dtype=float)

Handler = Callable[[str, dict[str, Any]], None]


class ViewCanvas:
    """The bqplot figure of one view (``"pT"``, ``"ph"`` or ``"Ts"``) of a substance and route.

    ``on_click(view, event)``, ``on_move(view, event)``, ``on_drag_end(view, event)`` and
    ``on_drag(view, event)`` are called with the page's event messages (set by the planner).
    """

    view = "pT"
    height = "460px"

    def __init__(self, units: DisplayUnits) -> None:
        self.units = units
        qx, qy = AXES[self.view]
        self.log_y = qy == "p"
        self.sx = bq.LinearScale(allow_padding=False)
        self.sy = (
            bq.LogScale(allow_padding=False) if self.log_y else bq.LinearScale(allow_padding=False)
        )
        sc = {"x": self.sx, "y": self.sy}
        grid = {"grid_lines": "dashed", "grid_color": "#e3e3e3"}
        self.ax = bq.Axis(scale=self.sx, label="", tick_format=".0f", label_offset="36px", **grid)
        self.ay = bq.Axis(
            scale=self.sy,
            side="left",
            label="",
            tick_format=".4~g",
            label_offset="56px",
            **grid,
        )
        self.curves: list[bq.Lines] = []  # in use for the substance
        self._curve_pool: list[bq.Lines] = []
        self.regions = bq.Label(
            x=_EMPTY,
            y=_EMPTY,
            text=[],
            scales=sc,
            colors=[STYLE["region"]["color"]],
            default_size=14,
            font_unit="px",
            font_weight="bold",
            align="middle",
            enable_hover=False,
            apply_clip=True,
        )
        self.point_labels = bq.Label(
            x=_EMPTY,
            y=_EMPTY,
            text=[],
            scales=sc,
            colors=[STYLE["point_label"]["color"]],
            default_size=11,
            font_unit="px",
            align="start",
            x_offset=8,
            y_offset=-8,
            enable_hover=False,
            apply_clip=True,
        )
        self.route_line = bq.Lines(
            x=_EMPTY,
            y=_EMPTY,
            scales=sc,
            colors=[STYLE["route"]["color"]],
            stroke_width=STYLE["route"]["width"],
            enable_hover=False,
        )
        self.triple = bq.Scatter(
            x=_EMPTY,
            y=_EMPTY,
            scales=sc,
            marker=STYLE["triple_point"]["marker"],
            colors=[STYLE["triple_point"]["fill"]],
            stroke="#1d1d1f",
            default_size=90,
            enable_hover=True,
            tooltip=W.HTML(),
        )
        self.critical = bq.Scatter(
            x=_EMPTY,
            y=_EMPTY,
            scales=sc,
            marker=STYLE["critical"]["marker"],
            colors=[STYLE["critical"]["fill"]],
            stroke="#1d1d1f",
            stroke_width=2.0,
            default_size=80,
            enable_hover=True,
            tooltip=W.HTML(),
        )
        self.selected = bq.Scatter(
            x=_EMPTY,
            y=_EMPTY,
            scales=sc,
            marker="circle",
            colors=["transparent"],
            stroke=STYLE["selected"]["stroke"],
            stroke_width=3.0,
            default_size=320,
            enable_hover=False,
        )
        self.corners = bq.Scatter(
            x=_EMPTY,
            y=_EMPTY,
            scales=sc,
            marker="circle",
            colors=[STYLE["corner"]["fill"]],
            stroke=STYLE["corner"]["stroke"],
            stroke_width=2.0,
            default_size=90,
            names=[],
            display_names=True,
            enable_move=True,
            enable_hover=True,
            tooltip=W.HTML(),
            drag_size=1.6,
        )
        # crossings are drawn above the corners, smaller, so a corner stays grabbable around one
        self.crossings = bq.Scatter(
            x=_EMPTY,
            y=_EMPTY,
            scales=sc,
            marker=STYLE["crossing"]["marker"],
            colors=[STYLE["crossing"]["fill"]],
            stroke=STYLE["crossing"]["stroke"],
            stroke_width=1.2,
            default_size=60,
            enable_hover=False,
        )
        self.figure = bq.Figure(
            marks=self._marks(),
            axes=[self.ax, self.ay],
            display_toolbar=False,
            animation_duration=0,
            fig_margin=dict(MARGIN),
            layout=W.Layout(width="100%", height=self.height, min_width="380px"),
            padding_x=0.0,
            padding_y=0.0,
        )
        self.figure.add_class("pp-diagram")
        self.figure.add_class(f"pp-view-{self.view}")
        self.readout = W.HTML("<div class='pp-readout'>&nbsp;</div>")
        self.css = W.HTML(_CSS, layout=W.Layout(height="0px", overflow="hidden"))
        self.box = W.VBox([self.figure, self.readout], layout=W.Layout(min_width="0"))
        self._pan = bq.interacts.PanZoom(scales={"x": [self.sx], "y": [self.sy]})
        self.clicks = ipyevents.Event(source=self.figure, watched_events=["click", "mouseleave"])
        self.moves = ipyevents.Event(
            source=self.figure,
            watched_events=["mousemove"],
            throttle_or_debounce="throttle",
            wait=60,
        )
        self.on_click: Handler | None = None
        self.on_move: Handler | None = None
        self.on_drag_end: Handler | None = None
        self.on_drag: Handler | None = None
        self.clicks.on_dom_event(self._dom_click)
        self.moves.on_dom_event(lambda e: self.on_move and self.on_move(self.view, e))
        self.corners.on_drag_end(lambda _m, e: self.on_drag_end and self.on_drag_end(self.view, e))
        self.corners.on_drag(lambda _m, e: self.on_drag and self.on_drag(self.view, e))
        self.sx.observe(self._window_moved, names=["min", "max"])
        self.sy.observe(self._window_moved, names=["min", "max"])
        self.substance: Substance | None = None
        self._curves_si: tuple[ViewCurve, ...] = ()
        self._points_si: tuple[ViewPoint, ...] = ()
        self._route: tuple[Any, ...] = ((), (_EMPTY, _EMPTY), (), True, None)
        self._quiet = False

    def _marks(self) -> list[Any]:
        return [
            *self.curves,
            self.regions,
            self.point_labels,
            self.route_line,
            self.triple,
            self.critical,
            self.selected,
            self.corners,
            self.crossings,
        ]

    def _dom_click(self, event: dict[str, Any]) -> None:
        if event.get("type") == "mouseleave":
            self.readout.value = "<div class='pp-readout'>&nbsp;</div>"
            return
        if self.on_click is not None:
            self.on_click(self.view, event)

    # -- units and labels ------------------------------------------------------------------------
    def axis_labels(self) -> tuple[str, str]:
        qx, qy = AXES[self.view]
        ux, uy = view_units(self.view, self.units)
        return (
            f"{LABELS[qx]} [{UNIT_LABELS.get(ux, ux).replace('degR', '°R')}]",
            f"{LABELS[qy]} [{UNIT_LABELS.get(uy, uy)}]",
        )

    def set_units(self, units: DisplayUnits) -> None:
        """Switch display units, keeping the visible window."""
        window = self.window()
        self.units = units
        self.redraw_static()
        self._draw_route()
        if window is not None:
            self.set_window(*window)

    def display(self, x: Any, y: Any) -> tuple[np.ndarray, np.ndarray]:
        """SI arrays of this view -> display units."""
        return to_view(self.view, x, y, self.units)

    # -- substance -------------------------------------------------------------------------------
    def set_substance(self, sub: Substance) -> None:
        """Draw the boundaries and special points of ``sub`` (the Lines are kept and reused)."""
        same = sub is self.substance
        self.substance = sub
        if not same:
            self._curves_si = view_curves(sub, self.view)
            self._points_si = view_points(sub, self.view)
            sc = {"x": self.sx, "y": self.sy}
            while len(self._curve_pool) < len(self._curves_si):
                self._curve_pool.append(
                    bq.Lines(
                        x=np.array([0.0, 1.0]),
                        y=np.array([1.0, 2.0]),
                        scales=sc,
                        enable_hover=False,
                    )
                )
            self.curves = self._curve_pool[: len(self._curves_si)]
            for line, c in zip(self.curves, self._curves_si, strict=True):
                color, dash, width = self.curve_style(c)
                with line.hold_sync():
                    line.colors, line.line_style, line.stroke_width = [color], dash, width
            marks = self._marks()
            if list(self.figure.marks) != marks:
                self.figure.marks = marks
        self.redraw_static()

    def curve_style(self, c: ViewCurve) -> tuple[str, str, float]:
        """(colour, dash, width) of a boundary line."""
        st = STYLE.get(c.kind, STYLE["vaporization"])
        if c.extrapolated:
            ex = STYLE["extrapolated"]
            return st["color"], ex["dash"], ex["width"]
        return st["color"], st["dash"], st["width"]

    def redraw_static(self) -> None:
        """Boundaries, points and labels in the current units."""
        if self.substance is None:
            return
        for line, c in zip(self.curves, self._curves_si, strict=True):
            x, y = self.display(c.x, c.y)
            with line.hold_sync():
                line.x, line.y = x, y
        for mark, name in ((self.triple, "triple point"), (self.critical, "critical point")):
            pts = [p for p in self._points_si if p.name == name]
            if pts:
                x, y = self.display([pts[0].x], [pts[0].y])
                tip = f"<div class='pp-tip'><b>{name}</b><br>{self.point_tip(pts[0])}</div>"
            else:  # a substance built from data without this point
                x = y = _EMPTY
                tip = f"<div class='pp-tip'>no {name} given</div>"
            with mark.hold_sync():
                mark.x, mark.y = x, y
            mark.tooltip.value = tip
        names = [p.name for p in self._points_si]
        px, py = self.display([p.x for p in self._points_si], [p.y for p in self._points_si])
        with self.point_labels.hold_sync():
            self.point_labels.x, self.point_labels.y, self.point_labels.text = px, py, names
        self.ax.label, self.ay.label = self.axis_labels()
        self.place_labels()

    def point_tip(self, pt: ViewPoint) -> str:
        from .readout import coordinate_text

        return coordinate_text(self.view, pt.x, pt.y, self.units)

    # -- region names ----------------------------------------------------------------------------
    def region_of(self, x: float, y: float) -> str | None:
        """The region name at a point (SI) for labelling; None outside the models."""
        return None

    def label_grid(self) -> tuple[int, int]:
        return 22, 16

    def small_labels(
        self, grid: list[list[str | None]], xs: np.ndarray, ys: np.ndarray, spots: dict[str, Any]
    ) -> list[tuple[float, float, str]]:
        """Labels of regions too small for their name inside them (SI points and texts)."""
        return []

    def place_labels(self) -> None:
        """Write each region's name where it has room, inside the window."""
        if self.substance is None:
            return
        window = self.window() or self.default_window()
        nx, ny = self.label_grid()
        xs, ys = grid_points(window, nx, ny, self.log_y)
        grid = classify_grid(self.region_of, xs, ys)
        spots = label_spots(grid, ROOM)
        texts = sorted(spots)
        lx = [float(xs[spots[k][1]]) for k in texts]
        ly = [float(ys[spots[k][0]]) for k in texts]
        for ex, ey, text in self.small_labels(grid, xs, ys, spots):
            lx.append(ex)
            ly.append(ey)
            texts.append(text)
        x, y = self.display(lx, ly)
        with self.regions.hold_sync():
            self.regions.x, self.regions.y, self.regions.text = x, y, texts

    # -- window ----------------------------------------------------------------------------------
    def default_window(self) -> tuple[float, float, float, float]:
        raise NotImplementedError

    def set_window(self, x0: float, x1: float, y0: float, y1: float) -> None:
        """Show x0..x1 and y0..y1 (SI)."""
        (a, b), (c, d) = self.display([x0, x1], [y0, y1])
        old, self._quiet = self._quiet, True
        try:
            with self.sx.hold_sync(), self.sy.hold_sync():
                self.sx.min, self.sx.max = float(min(a, b)), float(max(a, b))
                self.sy.min, self.sy.max = float(min(c, d)), float(max(c, d))
        finally:
            self._quiet = old
        self._window_changed()

    def window(self) -> tuple[float, float, float, float] | None:
        """The visible window in SI (x0, x1, y0, y1), or None before it is set."""
        shown = self.shown_window()
        if shown is None:
            return None
        from .coords import from_view

        x0, y0 = from_view(self.view, shown[0], shown[2], self.units)
        x1, y1 = from_view(self.view, shown[1], shown[3], self.units)
        return min(x0, x1), max(x0, x1), min(y0, y1), max(y0, y1)

    def shown_window(self) -> tuple[float, float, float, float] | None:
        """The visible window in display units, or None before it is set."""
        values = (self.sx.min, self.sx.max, self.sy.min, self.sy.max)
        if any(v is None for v in values):
            return None
        x0, x1, y0, y1 = (float(v) for v in values)  # type: ignore[arg-type]
        if not all(math.isfinite(v) for v in (x0, x1, y0, y1)) or x1 <= x0 or y1 <= y0:
            return None
        return x0, x1, y0, y1

    def _window_moved(self, _change: Any) -> None:
        if not self._quiet:  # a pan or zoom in the page
            self._window_changed()

    def _window_changed(self) -> None:
        shown = self.shown_window()
        if shown is None:
            return
        x0, x1, y0, y1 = shown
        with self.ax.hold_sync():
            self.ax.tick_format = linear_format(x0, x1)
        if self.log_y:
            values, fmt = log_ticks(y0, y1)
            with self.ay.hold_sync():
                self.ay.tick_values, self.ay.tick_format = values, fmt
        else:
            with self.ay.hold_sync():
                self.ay.tick_format = linear_format(y0, y1)
        self.place_labels()

    def frame(self, event: dict[str, Any]) -> Frame | None:
        """The frame (plot area and window) a page event was made in."""
        return frame_of(event, MARGIN, self.shown_window(), self.log_y)

    def event_point(self, event: dict[str, Any]) -> tuple[Frame, float, float] | None:
        """(frame, x, y in display units) of a page event inside the plot area, else None."""
        frame = self.frame(event)
        px = event_pixel(event)
        if frame is None or px is None:
            return None
        xy = frame.data(*px)
        if xy is None or not all(math.isfinite(v) for v in xy):
            return None
        return frame, xy[0], xy[1]

    def page_event(
        self, x: float, y: float, type: str = "click", width: float = 800.0, **flags: Any
    ) -> dict[str, Any]:
        """The message the page sends for a pointer event at (x, y) in display units, on a figure
        ``width`` pixels wide (at whole pixels, as browsers report them): for tests and
        benchmarks that drive the planner without a browser."""
        height = float(self.height.rstrip("px"))
        shown = self.shown_window()
        if shown is None:
            raise ValueError("the figure has no window yet")
        frame = Frame(
            MARGIN["left"],
            MARGIN["top"],
            width - MARGIN["left"] - MARGIN["right"],
            height - MARGIN["top"] - MARGIN["bottom"],
            *shown,
            self.log_y,
        )
        px, py = frame.pixel(x, y)
        event = {
            "type": type,
            "relativeX": round(px),
            "relativeY": round(py),
            "boundingRectWidth": width,
            "boundingRectHeight": height,
            "target": {"tagName": "rect"},
        }
        event.update(flags)
        return event

    def set_mode(self, mode: str) -> None:
        """ "draw" (clicks add corners) or "pan" (drag pans, wheel zooms)."""
        self.figure.interaction = self._pan if mode == "pan" else None
        if mode == "pan":
            self.figure.add_class("pp-pan")
        else:
            self.figure.remove_class("pp-pan")

    # -- route -----------------------------------------------------------------------------------
    def set_route(
        self,
        corners: Sequence[tuple[float, float] | None],
        line: tuple[np.ndarray, np.ndarray],
        crossings: Sequence[tuple[float, float] | None],
        valid: bool = True,
        selected: int | None = None,
    ) -> None:
        """Draw the route: ``corners`` and ``crossings`` as SI points of this view (None where a
        point has no coordinates here), ``line`` the path's SI arrays."""
        self._route = (tuple(corners), line, tuple(crossings), valid, selected)
        self._draw_route()

    def _draw_route(self) -> None:
        corners, line, crossings, valid, selected = self._route
        known = [(i, c) for i, c in enumerate(corners) if c is not None]
        x, y = self.display([c[0] for _, c in known], [c[1] for _, c in known])
        lx, ly = self.display(*line) if len(line[0]) else (x, y)
        st = STYLE["route"] if valid else STYLE["route_invalid"]
        with self.route_line.hold_sync():
            self.route_line.x, self.route_line.y = lx, ly
            self.route_line.colors = [st["color"]]
            self.route_line.stroke_width = st["width"]
            self.route_line.line_style = "solid" if valid else "dashed"
        with self.corners.hold_sync():
            self.corners.x, self.corners.y = x.astype(float), y.astype(float)
            self.corners.names = ["S" if i == 0 else str(i) for i, _ in known]
            self.corners.colors = [
                STYLE["corner"]["start"] if i == 0 else STYLE["corner"]["fill"] for i, _ in known
            ]
        self._index = [i for i, _ in known]
        self.drawn = list(zip(x.tolist(), y.tolist(), strict=True))  # as last drawn here
        pts = [c for c in crossings if c is not None]
        cx, cy = self.display([c[0] for c in pts], [c[1] for c in pts])
        with self.crossings.hold_sync():
            self.crossings.x, self.crossings.y = cx, cy
        sel = corners[selected] if selected is not None and selected < len(corners) else None
        sx, sy = self.display([sel[0]], [sel[1]]) if sel is not None else (_EMPTY, _EMPTY)
        with self.selected.hold_sync():
            self.selected.x, self.selected.y = sx, sy

    def corner_of_mark(self, k: int) -> int | None:
        """The corner index of the k-th point of the corner mark."""
        index = getattr(self, "_index", [])
        return index[k] if 0 <= k < len(index) else None

    def nearest_corner(self, frame: Frame, px: float, py: float, reach: float) -> int | None:
        """The corner drawn within ``reach`` pixels of a pixel, nearest first."""
        best: tuple[float, int] | None = None
        for k, (x, y) in enumerate(getattr(self, "drawn", [])):
            if not (math.isfinite(x) and math.isfinite(y)) or (self.log_y and y <= 0):
                continue
            qx, qy = frame.pixel(float(x), float(y))
            d = math.hypot(qx - px, qy - py)
            if d <= reach and (best is None or d < best[0]):
                best = (d, k)
        return None if best is None else self.corner_of_mark(best[1])

    def preview(self, index: int, x: float, y: float) -> None:
        """While corner ``index`` is dragged: the line straight through the corners, the dragged
        one at (x, y) in display units (no analysis)."""
        drawn = getattr(self, "drawn", [])
        k = getattr(self, "_index", []).index(index) if index in getattr(self, "_index", []) else -1
        if k < 0:
            return
        xs, ys = [a for a, _ in drawn], [b for _, b in drawn]
        xs[k], ys[k] = x, y
        with self.route_line.hold_sync():
            self.route_line.x = np.array(xs, dtype=float)
            self.route_line.y = np.array(ys, dtype=float)

    def show_readout(self, html: str) -> None:
        self.readout.value = f"<div class='pp-readout'>{html or '&nbsp;'}</div>"

    def widgets(self) -> list[W.Widget]:
        """Every widget whose state a redraw may touch (for batched updates)."""
        return [
            self.figure,
            self.sx,
            self.sy,
            self.ax,
            self.ay,
            self.route_line,
            self.corners,
            self.crossings,
            self.selected,
            self.triple,
            self.critical,
            self.regions,
            self.point_labels,
            *self._curve_pool,
        ]
