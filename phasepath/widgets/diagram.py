"""The phase diagram figure: boundary curves, special points, region names, the route, crossings.

Temperature runs on a linear axis and pressure on a logarithmic one, both in the display units the
planner is set to. The figure holds no state of its own: the planner hands it SI values (K, Pa) and
it converts them for drawing. Boundary curves come from the core's cached samples, converted once
per (substance, units) and kept here.
"""

from __future__ import annotations

import math
from typing import Any

import bqplot as bq
import ipywidgets as W
import numpy as np

from .. import format as F
from ..format import UNIT_LABELS
from ..substances import NO_SUBLIMATION, Substance
from .coords import from_display, to_display

__all__ = ["PhaseDiagram", "STYLE"]

#: Colours and marks of the diagram. The colours are drawn from a palette chosen to stay distinct
#: for the common forms of colour-blindness; every curve also differs by its dash pattern, so the
#: diagram reads in greyscale print.
STYLE: dict[str, dict[str, Any]] = {
    "vaporization": {"color": "#0b5fa5", "dash": "solid", "width": 2.5, "label": "vapor pressure"},
    "melting": {"color": "#b34700", "dash": "dashed", "width": 2.5, "label": "melting"},
    "sublimation": {
        "color": "#2a7d5f",
        "dash": "dash_dotted",
        "width": 2.5,
        "label": "sublimation",
    },
    # a custom substance's curve beyond the range of its data (Boundary.T_valid): same colour,
    # dotted and thinner, so an extrapolation never reads as data
    "extrapolated": {"dash": "dotted", "width": 1.8, "label": "beyond the data"},
    "route": {"color": "#1d1d1f", "width": 3.0},
    "route_invalid": {"color": "#8a8a8a", "width": 2.0},
    "corner": {"fill": "#ffffff", "start": "#1d1d1f", "stroke": "#1d1d1f"},
    "crossing": {"fill": "#f2b01e", "stroke": "#1d1d1f", "marker": "diamond"},
    "triple": {"fill": "#1d1d1f", "marker": "triangle-up"},
    "critical": {"fill": "#ffffff", "marker": "square"},
    "region": {"color": "#7a7a7a"},
}

_CSS = """
<style>
.pp-diagram path.line, .pp-diagram text, .pp-diagram .label { pointer-events: none; }
.pp-diagram .plotarea_events { cursor: crosshair; }
.pp-diagram.pp-pan .plotarea_events { cursor: move; }
</style>
"""


class PhaseDiagram:
    """The bqplot figure of one substance's P-T diagram with a route drawn on it.

    The route's corners are a Scatter whose clicks add points (``"click": "add"``) and whose
    points can be dragged; the planner observes that Scatter's ``x`` and ``y``.
    """

    def __init__(self, T_unit: str = "degC", p_unit: str = "bar") -> None:
        self.T_unit, self.p_unit = T_unit, p_unit
        self.sx = bq.LinearScale()
        self.sy = bq.LogScale()
        sc = {"x": self.sx, "y": self.sy}
        self.ax = bq.Axis(
            scale=self.sx,
            label="",
            tick_format=".0f",
            grid_lines="dashed",
            grid_color="#e3e3e3",
            label_offset="36px",
        )
        self.ay = bq.Axis(
            scale=self.sy,
            side="left",
            label="",
            tick_format=".4~g",
            grid_lines="dashed",
            grid_color="#e3e3e3",
            label_offset="52px",
        )
        empty = np.array([], dtype=float)
        self.curves: list[bq.Lines] = []  # rebuilt per substance
        # the strip below the triple point of a fluid with no published sublimation curve
        self.strip_note = bq.Label(
            x=empty,
            y=empty,
            text=[],
            scales=sc,
            colors=[STYLE["region"]["color"]],
            default_size=12,
            font_unit="px",
            align="middle",
            rotate_angle=-90,
        )
        self.regions = bq.Label(
            x=empty,
            y=empty,
            text=[],
            scales=sc,
            colors=[STYLE["region"]["color"]],
            default_size=15,
            font_unit="px",
            font_weight="bold",
            align="middle",
            enable_hover=False,
            apply_clip=True,
        )
        self.route_line = bq.Lines(
            x=empty,
            y=empty,
            scales=sc,
            colors=[STYLE["route"]["color"]],
            stroke_width=STYLE["route"]["width"],
            enable_hover=False,
        )
        self.triple = bq.Scatter(
            x=empty,
            y=empty,
            scales=sc,
            marker=STYLE["triple"]["marker"],
            colors=[STYLE["triple"]["fill"]],
            stroke="#1d1d1f",
            default_size=110,
            enable_hover=True,
            tooltip=W.HTML(),
        )
        self.critical = bq.Scatter(
            x=empty,
            y=empty,
            scales=sc,
            marker=STYLE["critical"]["marker"],
            colors=[STYLE["critical"]["fill"]],
            stroke="#1d1d1f",
            stroke_width=2.0,
            default_size=90,
            enable_hover=True,
            tooltip=W.HTML(),
        )
        self.crossings = bq.Scatter(
            x=empty,
            y=empty,
            scales=sc,
            marker=STYLE["crossing"]["marker"],
            colors=[STYLE["crossing"]["fill"]],
            stroke=STYLE["crossing"]["stroke"],
            stroke_width=1.5,
            default_size=110,
            enable_hover=True,
            tooltip=W.HTML(),
        )
        self.corners = bq.Scatter(
            x=empty,
            y=empty,
            scales=sc,
            marker="circle",
            colors=[STYLE["corner"]["fill"]],
            stroke=STYLE["corner"]["stroke"],
            stroke_width=2.0,
            default_size=70,
            names=[],
            display_names=True,
            enable_move=True,
            interactions={"click": "add"},
            enable_hover=True,
            tooltip=W.HTML(),
            drag_size=1.6,
        )
        self.figure = bq.Figure(
            marks=[
                self.strip_note,
                self.regions,
                self.route_line,
                self.crossings,
                self.triple,
                self.critical,
                self.corners,
            ],
            axes=[self.ax, self.ay],
            display_toolbar=False,
            animation_duration=0,
            fig_margin={"top": 16, "bottom": 48, "left": 72, "right": 16},
            layout=W.Layout(width="100%", height="460px", min_width="420px"),
            padding_x=0.0,
            padding_y=0.0,
        )
        self.figure.add_class("pp-diagram")
        self.css = W.HTML(_CSS, layout=W.Layout(height="0px", overflow="hidden"))
        self._pan = bq.interacts.PanZoom(scales={"x": [self.sx], "y": [self.sy]})
        self.substance: Substance | None = None
        self._drawn: tuple[str, str] | None = None  # units the static parts were drawn in
        self._curve_pool: list[bq.Lines] = []
        #: (kind, beyond the data, T [K], p [Pa]) of each drawn piece of a boundary curve
        self._boundary_si: list[tuple[str, bool, np.ndarray, np.ndarray]] = []
        self._special_si: list[tuple[str, float, float]] = []
        self._region_si: list[tuple[str, float, float]] = []

    # -- substance ---------------------------------------------------------------------------
    def set_substance(self, sub: Substance) -> None:
        """Draw the boundary curves, special points and region names of ``sub``.

        The curve marks are kept and reused: setting the substance already drawn only redraws
        what changed, and another substance reuses the same Lines (new ones only if it has more
        curve pieces), so the page keeps its views instead of building new ones.
        """
        if sub is self.substance and self._drawn == (self.T_unit, self.p_unit):
            return  # already drawn in these units
        same = sub is self.substance
        self.substance = sub
        if not same:
            self._boundary_si = _curve_pieces(sub)
            self._special_si = [
                (name, T, p)
                for name, (T, p) in (("triple point", sub.triple), ("critical point", sub.critical))
            ]
            self._region_si = _region_positions(sub, self.default_window(sub))
            sc = {"x": self.sx, "y": self.sy}
            while len(self._curve_pool) < len(self._boundary_si):
                self._curve_pool.append(
                    bq.Lines(
                        x=np.array([0.0, 1.0]),
                        y=np.array([1.0, 2.0]),
                        scales=sc,
                        enable_hover=False,
                    )
                )
            self.curves = self._curve_pool[: len(self._boundary_si)]
            for line, (kind, extrapolated, _T, _p) in zip(
                self.curves, self._boundary_si, strict=True
            ):
                st = STYLE[kind]
                ex = STYLE["extrapolated"]
                with line.hold_sync():
                    line.colors = [st["color"]]
                    line.line_style = ex["dash"] if extrapolated else st["dash"]
                    line.stroke_width = ex["width"] if extrapolated else st["width"]
            marks = self.curves + [
                self.strip_note,
                self.regions,
                self.route_line,
                self.crossings,
                self.triple,
                self.critical,
                self.corners,
            ]
            if list(self.figure.marks) != marks:
                self.figure.marks = marks
        self.redraw_static()

    def redraw_static(self) -> None:
        """Boundary curves, points and region names in the current units."""
        if self.substance is None:
            return
        self._drawn = (self.T_unit, self.p_unit)
        for line, (_kind, _ex, T, p) in zip(self.curves, self._boundary_si, strict=True):
            x, y = to_display(T, p, self.T_unit, self.p_unit)
            with line.hold_sync():
                line.x, line.y = x, y
        for mark, (name, T, p) in zip((self.triple, self.critical), self._special_si, strict=True):
            if math.isfinite(T) and math.isfinite(p):
                x, y = to_display([T], [p], self.T_unit, self.p_unit)
                tip = (
                    f"<div class='pp-tip'><b>{name}</b><br>{self.fmt_T(T)}<br>{self.fmt_p(p)}</div>"
                )
            else:  # a substance built from data without this point
                x = y = np.array([], dtype=float)
                tip = f"<div class='pp-tip'>no {name} given</div>"
            with mark.hold_sync():
                mark.x, mark.y = x, y
            mark.tooltip.value = tip
        for mark, keep in ((self.regions, False), (self.strip_note, True)):
            rows = [r for r in self._region_si if (r[0] == NO_SUBLIMATION) == keep]
            rx, ry = to_display(
                [r[1] for r in rows], [r[2] for r in rows], self.T_unit, self.p_unit
            )
            with mark.hold_sync():
                mark.x, mark.y = rx, ry
                mark.text = [r[0] for r in rows]
        self.ax.label = f"Temperature [{UNIT_LABELS[self.T_unit]}]"
        self.ay.label = f"Pressure [{UNIT_LABELS[self.p_unit]}]"

    # -- units ---------------------------------------------------------------------------------
    def set_units(self, T_unit: str, p_unit: str) -> None:
        """Switch display units, keeping the visible window."""
        window = self.window()
        self.T_unit, self.p_unit = T_unit, p_unit
        self.redraw_static()
        if window is not None:
            self.set_window(*window)

    def fmt_T(self, T: float) -> str:
        return F.quantity(T, "temperature", self.T_unit)

    def fmt_p(self, p: float) -> str:
        return F.quantity(p, "pressure", self.p_unit)

    # -- window --------------------------------------------------------------------------------
    def default_window(self, sub: Substance) -> tuple[float, float, float, float]:
        """(T_lo, T_hi [K], p_lo, p_hi [Pa]) showing the triple and critical points with margin
        (a substance built from data may lack either: the curves' own ends stand in)."""
        T_t, p_t, T_c, p_c = _anchors(sub)
        span = T_c - T_t
        T_lo = max(sub.T_min, T_t - 0.3 * span)
        if sub.sublimation is None and math.isfinite(T_t):
            # show the strip below the triple point, labelled: no published sublimation curve
            T_lo = max(T_t - 0.12 * span, 1.0)
        T_hi = min(sub.T_max, T_c + 0.3 * span)
        p_lo = p_t / 30.0
        if sub.sublimation is not None and sub.sublimation.T_min <= T_lo <= sub.sublimation.T_max:
            p_lo = min(p_lo, sub.sublimation.p_of_T(T_lo) / 3.0)
        p_hi = min(sub.p_max, p_c * 30.0)
        if not T_hi > T_lo:
            T_lo, T_hi = T_lo - 10.0, T_hi + 10.0
        return T_lo, T_hi, max(p_lo, 1e-3), max(p_hi, 10 * max(p_lo, 1e-3))

    def fit_window(self, corners: list[tuple[float, float]]) -> tuple[float, float, float, float]:
        """The default window grown to hold every corner of the route, with a margin."""
        assert self.substance is not None
        T_lo, T_hi, p_lo, p_hi = self.default_window(self.substance)
        if corners:
            Ts = [c[0] for c in corners]
            ps = [c[1] for c in corners if c[1] > 0]
            dT = 0.06 * (max(Ts + [T_hi]) - min(Ts + [T_lo]))
            T_lo, T_hi = min([T_lo] + [t - dT for t in Ts]), max([T_hi] + [t + dT for t in Ts])
            if ps:
                p_lo, p_hi = (
                    min([p_lo] + [p / 2.0 for p in ps]),
                    max([p_hi] + [p * 2.0 for p in ps]),
                )
        T_lo = max(T_lo, 1e-3)
        return T_lo, T_hi, p_lo, p_hi

    def set_window(self, T_lo: float, T_hi: float, p_lo: float, p_hi: float) -> None:
        """Show T_lo..T_hi [K] and p_lo..p_hi [Pa]."""
        (x0, x1), (y0, y1) = to_display([T_lo, T_hi], [p_lo, p_hi], self.T_unit, self.p_unit)
        with self.sx.hold_sync(), self.sy.hold_sync():
            self.sx.min, self.sx.max = float(min(x0, x1)), float(max(x0, x1))
            self.sy.min, self.sy.max = float(y0), float(y1)

    def window(self) -> tuple[float, float, float, float] | None:
        """The visible window in SI, or None before it is set."""
        if None in (self.sx.min, self.sx.max, self.sy.min, self.sy.max):
            return None
        T0, p0 = from_display(self.sx.min, self.sy.min, self.T_unit, self.p_unit)
        T1, p1 = from_display(self.sx.max, self.sy.max, self.T_unit, self.p_unit)
        return min(T0, T1), max(T0, T1), p0, p1

    def set_mode(self, mode: str) -> None:
        """ "draw" (clicks add corners) or "pan" (drag pans, wheel zooms)."""
        self.figure.interaction = self._pan if mode == "pan" else None
        if mode == "pan":
            self.figure.add_class("pp-pan")
        else:
            self.figure.remove_class("pp-pan")

    # -- route ---------------------------------------------------------------------------------
    def set_route(
        self,
        corners: list[tuple[float, float]],
        valid: bool = True,
        path: list[tuple[float, float]] | None = None,
    ) -> None:
        """Draw the route through ``path`` (SI points along every leg; the corners joined by
        straight lines if None) and the corner markers at ``corners``."""
        if corners:
            x, y = to_display(
                [c[0] for c in corners], [c[1] for c in corners], self.T_unit, self.p_unit
            )
        else:
            x = y = np.array([], dtype=float)
        if path:
            lx, ly = to_display(
                [c[0] for c in path], [c[1] for c in path], self.T_unit, self.p_unit
            )
        else:
            lx, ly = x, y
        st = STYLE["route"] if valid else STYLE["route_invalid"]
        with self.route_line.hold_sync():
            self.route_line.x, self.route_line.y = lx, ly
            self.route_line.colors = [st["color"]]
            self.route_line.stroke_width = st["width"]
            self.route_line.line_style = "solid" if valid else "dashed"
        with self.corners.hold_sync():
            self.corners.x, self.corners.y = x.astype(float), y.astype(float)
            self.corners.names = ["S"] + [str(i) for i in range(1, len(corners))]
            self.corners.colors = [STYLE["corner"]["start"]] + [STYLE["corner"]["fill"]] * max(
                len(corners) - 1, 0
            )

    def preview_route(self, corners: list[tuple[float, float]]) -> None:
        """Move only the route line (while a corner is being dragged)."""
        x, y = to_display(
            [c[0] for c in corners], [c[1] for c in corners], self.T_unit, self.p_unit
        )
        with self.route_line.hold_sync():
            self.route_line.x, self.route_line.y = x, y

    def set_crossings(self, points: list[tuple[float, float]]) -> None:
        """Mark each crossing (SI) on the diagram."""
        if points:
            x, y = to_display(
                [c[0] for c in points], [c[1] for c in points], self.T_unit, self.p_unit
            )
        else:
            x = y = np.array([], dtype=float)
        with self.crossings.hold_sync():
            self.crossings.x, self.crossings.y = x, y

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
            self.triple,
            self.critical,
            self.regions,
            self.strip_note,
            *self._curve_pool,
        ]


def _region_positions(
    sub: Substance, window: tuple[float, float, float, float]
) -> list[tuple[str, float, float]]:
    """Where to write the four region names (SI), inside each region and the default window."""
    T_lo, T_hi, p_lo, p_hi = window
    T_t, p_t, T_c, p_c = _anchors(sub)
    lp_t, lp_c = math.log10(p_t), math.log10(p_c)
    out: list[tuple[str, float, float]] = []
    # vapor: below the vapor-pressure curve, right of the triple point, low pressure
    T_v = T_t + 0.55 * (T_c - T_t)
    p_v = 10 ** (0.5 * (math.log10(p_lo) + lp_t)) if p_lo < p_t else p_t / 3
    out.append(("VAPOR", T_v, max(p_v, p_lo * 3)))
    # liquid: just below the critical temperature, well above the vapor-pressure curve
    T_l = T_t + 0.45 * (T_c - T_t)
    p_l = 10 ** (lp_c + 0.45 * (math.log10(p_hi) - lp_c))
    if sub.vapor is not None and sub.vapor.T_min <= T_l <= sub.vapor.T_max:
        p_l = max(p_l, 10 * sub.vapor.p_of_T(T_l))
    for b in sub.melting:
        if b.solid_side == "above" and b.T_min <= T_l <= b.T_max:
            p_l = (
                min(
                    p_l,
                    10
                    ** (
                        0.5
                        * (math.log10(max(sub.vapor.p_of_T(T_l), 1e-3)) + math.log10(b.p_of_T(T_l)))
                    ),
                )
                if sub.vapor
                else p_l
            )
    out.append(("LIQUID", T_l, min(p_l, p_hi / 2)))
    # solid: left of the triple point (only where a solid boundary is known)
    if sub.melting or sub.sublimation is not None:
        T_s = T_lo + 0.35 * (T_t - T_lo) if T_t > T_lo else T_t
        out.append(("SOLID", T_s, 10 ** (0.5 * (lp_t + lp_c))))
    # below the triple point of a fluid with no published sublimation curve: say so plainly
    if sub.sublimation is None and math.isfinite(T_t) and T_t > T_lo:
        # written upright in the strip, centred on the window's pressure range
        p_mid = 10 ** (0.5 * (math.log10(p_lo) + math.log10(p_hi)))
        out.append((NO_SUBLIMATION, T_lo + 0.5 * (T_t - T_lo), p_mid))
    # supercritical: right of and above the critical point (only where one is known)
    if math.isfinite(sub.critical[0]) and math.isfinite(sub.critical[1]):
        out.append(
            (
                "SUPERCRITICAL",
                T_c + 0.55 * (T_hi - T_c),
                10 ** (lp_c + 0.5 * (math.log10(p_hi) - lp_c)),
            )
        )
    return out


def _anchors(sub: Substance) -> tuple[float, float, float, float]:
    """(T_t, p_t, T_c, p_c) for placing the window and the region names: the triple and
    critical points, or, where a substance built from data lacks one, the low and high ends of
    its vapor-pressure curve (else of its temperature range)."""
    T_t, p_t = sub.triple
    T_c, p_c = sub.critical
    v = sub.vapor
    if not (math.isfinite(T_t) and math.isfinite(p_t) and p_t > 0):
        if v is not None:
            T_t, p_t = v.T_min, v.p_of_T(v.T_min)
        else:
            T_t, p_t = sub.T_min, 1e3
    if not (math.isfinite(T_c) and math.isfinite(p_c) and p_c > 0):
        if v is not None:
            T_c, p_c = v.T_max, v.p_of_T(v.T_max)
        else:
            T_c, p_c = sub.T_max, 1e7
    if not T_c > T_t:
        T_c = T_t + 1.0
    if not p_c > p_t:
        p_c = p_t * 10.0
    return T_t, p_t, T_c, p_c


def _curve_pieces(sub: Substance) -> list[tuple[str, bool, np.ndarray, np.ndarray]]:
    """(kind, beyond the data, T [K], p [Pa]) of each piece to draw: every boundary's cached
    sample, split where a branch built from data (``Boundary.T_valid``) leaves its data range.
    Neighbouring pieces share their end point, so the curve is drawn unbroken."""
    out = []
    for b in sub.boundaries:
        T, p = b.curve(0.0, sub.p_max)
        if len(T) < 2:
            continue
        valid = getattr(b, "T_valid", None)
        if valid is None:
            out.append((b.kind, False, T, p))
            continue
        lo, hi = valid
        cuts = [float(t) for t in (lo, hi) if T[0] < t < T[-1]]
        edges = [float(T[0]), *cuts, float(T[-1])]
        for a, z in zip(edges[:-1], edges[1:], strict=False):
            inside = (T > a) & (T < z)
            Ts = np.concatenate(([a], T[inside], [z]))
            ps = np.concatenate(([_p_at(b, a, T, p)], p[inside], [_p_at(b, z, T, p)]))
            mid = 0.5 * (a + z)
            out.append((b.kind, not (lo <= mid <= hi), Ts, ps))
    return out


def _p_at(b: Any, T: float, Ts: np.ndarray, ps: np.ndarray) -> float:
    try:
        return float(b.p_of_T(T))
    except Exception:  # drawing only: fall back to the sample's interpolant in ln p
        return float(np.exp(np.interp(T, Ts, np.log(ps))))
