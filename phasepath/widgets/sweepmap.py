"""A sweep on the substance's diagram: one marker per swept state, coloured by an outcome.

``SweepMap(table, color="end_solid_fraction")`` draws the rows of a sweep
(:func:`phasepath.sweep`) over the swept start states on the P–T diagram (or the p–h diagram,
``view="ph"``), with the substance's boundaries and a colour bar in the display units. A column
of text or of flags (``end_phase``, ``hazard_solid_formation``) is drawn by category, with a key.
Hovering a marker shows its row; clicking it opens that point's route in a
:class:`~phasepath.widgets.RoutePlanner` under the map (``sweep_map.planner``). Points that
failed (a non-empty ``error``) are drawn as grey crosses and say why when hovered.

A sweep that varies no start value (only leg targets) is drawn over the end states instead. A
mass fraction that the sweep leaves empty for a single phase is shown as the phase's own: 0
solid for a fluid, 1 for a solid (and the same for the vapor fraction).

>>> import phasepath as pp
>>> plan = pp.Route("CO2", T="20 degC", p="60 bar").isenthalp(p="1 atm")
>>> df = pp.sweep(plan, start_T=["10 degC", "25 degC"], start_p=["60 bar", "80 bar"],
...               progress=False)
>>> m = pp.widgets.SweepMap(df, color="end_solid_fraction")
>>> len(m.points.x), m.color_axis.label
(4, 'end solid fraction')
"""

from __future__ import annotations

import html
import math
from typing import Any

import bqplot as bq
import ipywidgets as W
import numpy as np

from .. import format as F
from ..catalog import substance as _substance
from ..errors import PhasePathError
from ..format import UNIT_LABELS, DisplayUnits
from ..route import Route
from ..units import convert, parse_pressure, parse_temperature
from .canvas import ViewCanvas
from .diagram import PhaseDiagram
from .energy import EnergyDiagram
from .panels import CSS
from .readout import minus

__all__ = ["SweepMap"]

#: Colours of the categories of a categorical map (distinct for the common colour blindness).
CATEGORY_COLORS = (
    "#0b5fa5",
    "#e69f00",
    "#2a7d5f",
    "#d1495b",
    "#7b5ea7",
    "#56b4e9",
    "#b34700",
    "#6b6b6b",
)
_COLD_HOT = ("#f7fbff", "#6baed6", "#08306b")
# What each column holds: its kind in the display-precision policy, and its words.
_KINDS = {
    "start_T": ("temperature", "start temperature"),
    "start_p": ("pressure", "start pressure"),
    "start_density": ("density", "start density"),
    "end_T": ("temperature", "end temperature"),
    "end_p": ("pressure", "end pressure"),
    "end_vapor_fraction": ("fraction", "end vapor fraction"),
    "end_solid_fraction": ("fraction", "end solid fraction"),
    "heat": ("energy", "heat"),
    "work": ("energy", "work"),
    "n_crossings": ("count", "number of crossings"),
}
_START = {"start_T": "T", "start_p": "p", "start_density": "density"}


def _kind(column: str) -> tuple[str | None, str]:
    if column in _KINDS:
        return _KINDS[column]
    if column.startswith("first_") and column[-2:] in ("_T", "_p"):
        what = column[6:-2].replace("_", " ")
        return (
            "temperature" if column.endswith("_T") else "pressure"
        ), f"first {what} {column[-1]}"
    if column.startswith("leg") and column[-2:] in ("_T", "_p"):
        return ("temperature" if column.endswith("_T") else "pressure"), column.replace("_", " ")
    return None, column.replace("_", " ")


class SweepMap(W.VBox):
    """A sweep drawn on the substance's diagram, coloured by a column.

    Parameters
    ----------
    table : pandas.DataFrame
        The result of :func:`phasepath.sweep` over a plan's values (its ``attrs`` hold the plan
        and the axes).
    color : str
        The column that colours the markers.
    view : {"pT", "ph"}
        The diagram to draw on.
    categorical : bool, optional
        Colour by category (default: for text and flag columns).
    T_unit, p_unit, energy_unit : str
        Display units.

    Attributes
    ----------
    figure : bqplot.Figure
    points : bqplot.Scatter
        One marker per analysed row (``rows`` gives the row index of each).
    planner : RoutePlanner or None
        The planner a click on a marker opened (None before the first click).
    """

    def __init__(
        self,
        table: Any,
        color: str = "end_solid_fraction",
        view: str = "pT",
        *,
        categorical: bool | None = None,
        T_unit: str = "degC",
        p_unit: str = "bar",
        energy_unit: str = "kJ/kg",
    ) -> None:
        plan = getattr(table, "attrs", {}).get("plan")
        if plan is None:
            raise PhasePathError(
                "SweepMap draws the result of pp.sweep over a plan's values (its attrs hold the "
                "plan and the axes); a list of routes has no grid to draw"
            )
        if color not in table.columns:
            raise PhasePathError(
                f"column {color!r} is not in the sweep; its columns: {', '.join(table.columns)}"
            )
        if view not in ("pT", "ph"):
            raise PhasePathError(f"a sweep map is drawn on 'pT' or 'ph', not {view!r}")
        super().__init__(layout=W.Layout(width="100%"))
        self.add_class("pp-planner")
        self.table = table
        self.plan = dict(plan)
        self.color = color
        self.view = view
        self.units = DisplayUnits(T_unit, p_unit, energy_unit)
        self.sub = _substance(plan["substance"])
        series = table[color]
        self.categorical = (
            categorical
            if categorical is not None
            else not np.issubdtype(np.asarray(series.dropna()).dtype, np.number)
            or str(series.dtype) == "boolean"
        )
        self.canvas: ViewCanvas = (
            PhaseDiagram(self.units) if view == "pT" else EnergyDiagram("ph", self.units)
        )
        self.canvas.set_substance(self.sub)
        self.routes = [self._route_data(i) for i in range(len(table))]
        ok = [i for i in range(len(table)) if not table["error"].iloc[i]]
        failed = [i for i in range(len(table)) if table["error"].iloc[i]]
        self.rows = ok
        xy_ok = [self._position(i) for i in ok]
        keep = [(i, xy) for i, xy in zip(ok, xy_ok, strict=True) if xy is not None]
        self.rows = [i for i, _ in keep]
        sc = {"x": self.canvas.sx, "y": self.canvas.sy}
        x, y = self.canvas.display([xy[0] for _, xy in keep], [xy[1] for _, xy in keep])
        self.color_scale, values, label = self._colors(series.iloc[self.rows])
        self.points = bq.Scatter(
            x=x,
            y=y,
            color=values,
            scales={**sc, "color": self.color_scale},
            marker="square",
            default_size=90,
            stroke="#333333",
            stroke_width=0.5,
            enable_hover=True,
            tooltip=W.HTML(),
            interactions={"hover": "tooltip", "click": "select"},
        )
        given = [(i, self._given_position(i)) for i in failed]
        bad = [(i, xy) for i, xy in given if xy is not None]
        self.failed_rows = [i for i, _ in bad]
        fx, fy = self.canvas.display([xy[0] for _, xy in bad], [xy[1] for _, xy in bad])
        self.failed = bq.Scatter(
            x=fx,
            y=fy,
            scales=sc,
            marker="cross",
            colors=["#8a8a8a"],
            default_size=60,
            enable_hover=True,
            tooltip=W.HTML(),
        )
        self.color_axis = bq.ColorAxis(scale=self.color_scale, label=label, side="right")
        fig = self.canvas.figure
        fig.marks = [*fig.marks, self.points, self.failed]
        fig.axes = [*fig.axes, self.color_axis]
        fig.fig_margin = {**fig.fig_margin, "right": 140}
        self.figure = fig
        self.points.on_hover(self._hover)
        self.failed.on_hover(self._hover_failed)
        self.points.on_element_click(lambda _m, e: self.open_row(self._row_of(e)))
        self.planner: Any = None
        self.key = W.HTML(self._key_html())
        self.note = W.HTML(
            "<div style='font-size:12px;color:#555'>hover a marker for its row; click it to open "
            "its route in a planner below</div>"
        )
        self.planner_box = W.VBox()
        self.canvas.set_window(*self._window([xy for _, xy in keep + bad]))
        self.children = [
            W.HTML(CSS, layout=W.Layout(height="0px", overflow="hidden")),
            self.canvas.box,
            self.key,
            self.note,
            self.canvas.css,
            self.planner_box,
        ]

    # -- data ----------------------------------------------------------------------------------
    def _route_data(self, i: int) -> dict[str, Any]:
        """The route data of row i: the plan with the row's axis values put in."""
        row = self.table.iloc[i]
        data = {**self.plan, "start": dict(self.plan["start"]), "legs": list(self.plan["legs"])}
        for name in self.table.attrs.get("axes", {}):
            v = float(row[name])
            if name in _START:
                data["start"][_START[name]] = v
            elif name == "elevation":
                data["elevation"] = v
            elif name.startswith("leg"):
                k, q = name[3:].split("_")
                legs = data["legs"]
                legs[int(k) - 1] = {**legs[int(k) - 1], q: v}
        return data

    def route(self, i: int) -> Route:
        """The route of row i."""
        return Route.from_dict(self.routes[i])

    def _position(self, i: int) -> tuple[float, float] | None:
        """Where row i is drawn (SI, in the map's view): its start state, or its end state
        where the sweep varies no start value."""
        axes = self.table.attrs.get("axes", {})
        row = self.table.iloc[i]
        on_start = any(a in _START for a in axes)
        try:
            if on_start:
                start = Route.from_dict({**self.routes[i], "legs": []})
                st = start.end_state()
            else:
                T, p = float(row["end_T"]), float(row["end_p"])
                if not (math.isfinite(T) and math.isfinite(p)):
                    return None
                if self.view == "pT":
                    return T, p
                st = self.route(i).analyze().legs[-1].end
        except PhasePathError:
            return None
        if self.view == "pT":
            return st.T, st.p
        return (st.h, st.p) if st.h is not None else None

    def _given_position(self, i: int) -> tuple[float, float] | None:
        """Where a failed row is drawn on P–T: its start as given (no state is needed)."""
        if self.view != "pT":
            return None
        start = self.routes[i]["start"]
        try:
            T = parse_temperature(start["T"])
            p = parse_pressure(start["p"])
        except (KeyError, PhasePathError):
            return None
        return T, p

    def _colors(self, series: Any) -> tuple[Any, np.ndarray, str]:
        kind, words = _kind(self.color)
        if self.categorical:
            cats = [str(v) for v in series]
            domain = sorted(set(cats))
            scale = bq.OrdinalColorScale(
                domain=domain, colors=list(CATEGORY_COLORS[: max(len(domain), 1)])
            )
            self._domain = domain
            return scale, np.array(cats, dtype=object), words
        values = np.array(series, dtype=float)
        if self.color in ("end_solid_fraction", "end_vapor_fraction"):
            values = self._fill_fractions(values)
        unit = self.units.unit(kind) if kind else None
        if kind in ("temperature", "pressure", "energy") and unit:
            si = {"temperature": "K", "pressure": "Pa", "energy": "J/kg"}[kind]
            values = np.array([convert(v, si, unit, kind) for v in values], dtype=float)
            words += f" [{UNIT_LABELS[unit]}]"
        finite = values[np.isfinite(values)]
        lo, hi = (float(finite.min()), float(finite.max())) if len(finite) else (0.0, 1.0)
        if kind == "fraction":
            lo, hi = 0.0, 1.0
        if hi <= lo:
            hi = lo + 1.0
        scale = bq.ColorScale(min=lo, max=hi, colors=list(_COLD_HOT))
        return scale, values, words

    def _fill_fractions(self, values: np.ndarray) -> np.ndarray:
        phases = [str(p) for p in self.table["end_phase"].iloc[self.rows]]
        out = values.copy()
        for k, (v, phase) in enumerate(zip(values, phases, strict=True)):
            if not math.isfinite(v):
                solid = 1.0 if phase == "solid" else 0.0
                fluid = 1.0 if phase in ("vapor", "supercritical") else 0.0
                out[k] = solid if self.color == "end_solid_fraction" else fluid
        return out

    def _window(self, pts: list[tuple[float, float]]) -> tuple[float, float, float, float]:
        """The swept states with half a step of room around them (in log p on a log axis), and
        the marker size that fills a step."""
        if not pts:
            return self.canvas.default_window()
        xs = sorted({p[0] for p in pts})
        ys = sorted({p[1] for p in pts})
        log = self.canvas.log_y
        ly = [math.log10(y) for y in ys] if log else ys
        dx = min((b - a for a, b in zip(xs, xs[1:], strict=False)), default=0.0)
        dy = min((b - a for a, b in zip(ly, ly[1:], strict=False)), default=0.0)
        span_x = max(xs[-1] - xs[0], 1e-9)
        span_y = max(ly[-1] - ly[0], 1e-9)
        dx = dx or 0.1 * span_x or 10.0
        dy = dy or 0.1 * span_y or (0.3 if log else 10.0)
        x0, x1 = xs[0] - dx, xs[-1] + dx
        y0, y1 = ly[0] - dy, ly[-1] + dy
        # the size of one step on a plot of about 720 x 400 pixels
        cell = min(720 * dx / (x1 - x0), 400 * dy / (y1 - y0))
        self.points.default_size = int(min(max((0.85 * cell) ** 2, 30), 1600))
        if log:
            return x0, x1, 10**y0, 10**y1
        return x0, x1, y0, y1

    # -- page events ---------------------------------------------------------------------------
    def _row_of(self, event: dict[str, Any]) -> int:
        data = event.get("data") or {}
        k = int(data.get("index", event.get("index", -1)))
        return self.rows[k]

    def row_text(self, i: int) -> str:
        """One row of the sweep in words, numbers in the display units."""
        row = self.table.iloc[i]
        parts = []
        for name in self.table.attrs.get("axes", {}):
            parts.append(f"{name} {self._value(name, row[name])}")
        parts.append(f"ends {row['end_phase']} at {self._value('end_T', row['end_T'])}")
        parts.append(f"{_kind(self.color)[1]}: {self._value(self.color, row[self.color])}")
        if row["hazards"]:
            parts.append(f"⚠ {row['hazards']}")
        return " · ".join(parts)

    def _value(self, column: str, v: Any) -> str:
        kind, _ = _kind(column)
        if kind is None:
            return str(v)
        if kind in ("temperature", "pressure", "energy"):
            return minus(F.quantity(float(v), kind, self.units.unit(kind)))
        if kind == "density":
            return F.quantity(float(v), "density", "kg/m3")
        return F.number(None if v is None or v != v else float(v), kind)

    def _hover(self, _mark: Any, event: dict[str, Any]) -> None:
        try:
            i = self._row_of(event)
        except (ValueError, IndexError, TypeError):
            return
        self.points.tooltip.value = f"<div class='pp-tip'>{html.escape(self.row_text(i))}</div>"

    def _hover_failed(self, _mark: Any, event: dict[str, Any]) -> None:
        data = event.get("data") or {}
        k = int(data.get("index", -1))
        if not 0 <= k < len(self.failed_rows):
            return
        i = self.failed_rows[k]
        err = str(self.table["error"].iloc[i])
        self.failed.tooltip.value = f"<div class='pp-tip'>{html.escape(err)}</div>"

    def open_row(self, i: int) -> Any:
        """Open the route of row i in a RoutePlanner under the map; returns the planner."""
        from .planner import RoutePlanner

        route = self.route(i)
        if self.planner is None:
            self.planner = RoutePlanner(
                route, T_unit=self.units.T, p_unit=self.units.p, energy_unit=self.units.energy
            )
            self.planner_box.children = [
                W.HTML("<div class='pp-h'>The route of the clicked point</div>"),
                self.planner,
            ]
        else:
            self.planner.route = route
        return self.planner

    def _key_html(self) -> str:
        if not self.categorical:
            return ""
        keys = "".join(
            f"<span class='pp-key'><svg width='12' height='12'><rect width='12' height='12' "
            f"fill='{CATEGORY_COLORS[k % len(CATEGORY_COLORS)]}'/></svg> {html.escape(c)}</span>"
            for k, c in enumerate(self._domain)
        )
        return f"<div class='pp-legend'><b>{html.escape(_kind(self.color)[1])}</b>: {keys}</div>"
