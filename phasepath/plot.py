"""Static figures of a phase diagram with routes, for people who do not open notebooks
(matplotlib, the optional extra ``phasepath[plot]``): the one plotting path of
``phasepath diagram``, the HTML report and the plan comparison.

* :func:`diagram_bytes`: the P-T diagram of a substance (boundary curves, labelled triple and
  critical points, a legend) with a route, its numbered corners and its crossings;
* :func:`comparison_bytes`: two or more plans on one P-T diagram, each in its own style;
* :func:`ph_bytes`: the p-h view of an analysed route (the saturation dome from the equation of
  state, the legs through the states of the report).

Each returns SVG or PNG bytes, the same bytes for the same inputs (no dates or software stamps
in the file). The look follows the planner: the same colours and dash patterns per boundary,
dark route, gold diamonds at crossings. Curved legs are drawn along the states the analysis
found (:func:`phasepath.paths.leg_line`), not straight between their corners.
"""

from __future__ import annotations

import io
import math
from collections.abc import Sequence
from typing import TYPE_CHECKING, Any

from .errors import PhasePathError
from .format import UNIT_LABELS, DisplayUnits
from .paths import leg_line
from .records import Analysis
from .units import affine

if TYPE_CHECKING:  # pragma: no cover
    from .route import Route
    from .substances import Substance

__all__ = ["diagram_bytes", "comparison_bytes", "ph_bytes", "STYLE", "PLAN_STYLES", "COLOURS"]

#: The look of the figures (the planner's colours and dash patterns; every curve differs by its
#: dash pattern too, so the figure reads in greyscale print).
STYLE: dict[str, dict[str, Any]] = {
    "vaporization": {"color": "#0b5fa5", "ls": "-", "label": "vapor pressure"},
    "melting": {"color": "#b34700", "ls": "--", "label": "melting"},
    "sublimation": {"color": "#2a7d5f", "ls": "-.", "label": "sublimation"},
    "extrapolated": {"ls": ":", "lw": 1.3, "label": "beyond the data"},
    "triple": {"marker": "^", "mfc": "#1d1d1f", "mec": "#1d1d1f"},
    "critical": {"marker": "s", "mfc": "#ffffff", "mec": "#1d1d1f"},
    "dome": {"color": "#0b5fa5", "ls": "-", "label": "saturation dome"},
}
#: Line colour of each kind of boundary.
COLOURS = {k: STYLE[k]["color"] for k in ("vaporization", "melting", "sublimation")}
#: How each plan is drawn when several share a diagram (the first is the planner's own look).
PLAN_STYLES: tuple[dict[str, Any], ...] = (
    {"color": "#1d1d1f", "ls": "-", "marker": "D", "mfc": "#f2b01e", "mec": "#1d1d1f"},
    {"color": "#8e3b8e", "ls": "--", "marker": "o", "mfc": "#e4c6e4", "mec": "#8e3b8e"},
    {"color": "#6b6b6b", "ls": ":", "marker": "s", "mfc": "#ffffff", "mec": "#6b6b6b"},
)

_FIGSIZE = (7.5, 5.2)


def _pyplot() -> Any:
    try:
        import matplotlib

        matplotlib.use("Agg", force=True)
        import matplotlib.pyplot as plt
    except ImportError:
        raise PhasePathError(
            "the diagram needs matplotlib: pip install 'phasepath[plot]'"
        ) from None
    return plt


def _finite(x: float) -> bool:
    return isinstance(x, float) and math.isfinite(x) and x > 0


def _anchors(sub: Substance) -> tuple[float, float, float, float]:
    """(T_t, p_t, T_c, p_c) to place the window: the triple and critical points, or where a
    substance built from data lacks one, the ends of its vapor-pressure curve."""
    T_t, p_t = sub.triple
    T_c, p_c = sub.critical
    v = sub.vapor
    if not (_finite(T_t) and _finite(p_t)):
        T_t, p_t = (v.T_min, v.p_of_T(v.T_min)) if v is not None else (sub.T_min, 1e3)
    if not (_finite(T_c) and _finite(p_c)):
        T_c, p_c = (v.T_max, v.p_of_T(v.T_max)) if v is not None else (sub.T_max, 1e7)
    return T_t, p_t, T_c, p_c


def _window(
    sub: Substance, corners: Sequence[tuple[float, float]]
) -> tuple[float, float, float, float]:
    """(T_lo, T_hi [K], p_lo, p_hi [Pa]): the triple and critical points with a margin, grown to
    hold every corner."""
    T_t, p_t, T_c, p_c = _anchors(sub)
    span = max(T_c - T_t, 10.0)
    T_lo, T_hi = max(sub.T_min, T_t - 0.3 * span), min(sub.T_max, T_c + 0.3 * span)
    p_lo, p_hi = max(p_t / 30.0, 1e-3), min(sub.p_max, 30.0 * p_c)
    if corners:
        Ts = [T for T, _ in corners]
        ps = [p for _, p in corners if p > 0]
        dT = 0.06 * (max(Ts + [T_hi]) - min(Ts + [T_lo]))
        T_lo, T_hi = min([T_lo] + [t - dT for t in Ts]), max([T_hi] + [t + dT for t in Ts])
        if ps:
            p_lo, p_hi = min([p_lo] + [p / 3.0 for p in ps]), max([p_hi] + [p * 3.0 for p in ps])
    return max(T_lo, 1e-3), T_hi, p_lo, p_hi


class _Scale:
    """SI -> display units for the axes."""

    def __init__(self, units: DisplayUnits) -> None:
        self.tB, self.tA = affine("K", units.T, "temperature")
        self.pB, self.pA = affine("Pa", units.p, "pressure")
        self.eB, self.eA = affine("J/kg", units.energy, "energy")

    def T(self, T: Any) -> Any:
        return self.tA + self.tB * T

    def p(self, p: Any) -> Any:
        return self.pA + self.pB * p

    def e(self, e: Any) -> Any:
        return self.eA + self.eB * e


def _boundaries(ax: Any, sub: Substance, window: tuple[float, ...], s: _Scale) -> None:
    import numpy as np

    T_lo, T_hi, p_lo, p_hi = window
    drawn: set[str] = set()
    extrapolated = False
    for b in sub.boundaries:
        T, p = b.curve(p_lo / 10.0, p_hi * 10.0)
        keep = (T >= T_lo - 1.0) & (T <= T_hi + 1.0)
        if keep.sum() < 2:
            continue
        T, p = T[keep], p[keep]
        st = STYLE[b.kind]
        lo, hi = b.T_valid or (b.T_min, b.T_max)
        good = (T >= lo) & (T <= hi) if b.reliable else np.zeros(T.shape, dtype=bool)
        if good.sum() >= 2:
            ax.plot(
                s.T(T[good]),
                s.p(p[good]),
                color=st["color"],
                ls=st["ls"],
                lw=2.0,
                label=st["label"] if b.kind not in drawn else None,
            )
            drawn.add(b.kind)
        if (~good).sum() >= 2:
            ex = STYLE["extrapolated"]
            ax.plot(
                s.T(T[~good]),
                s.p(p[~good]),
                color=st["color"],
                ls=ex["ls"],
                lw=ex["lw"],
                label=ex["label"] if not extrapolated else None,
            )
            extrapolated = True


def _special(ax: Any, sub: Substance, window: tuple[float, ...], s: _Scale) -> None:
    T_lo, T_hi, p_lo, p_hi = window
    for key, name, (T, p) in (
        ("triple", "triple point", sub.triple),
        ("critical", "critical point", sub.critical),
    ):
        if not (_finite(T) and _finite(p)) or not (T_lo <= T <= T_hi and p_lo <= p <= p_hi):
            continue
        st = STYLE[key]
        ax.plot([s.T(T)], [s.p(p)], ls="none", ms=7, zorder=6, label=name, **st)
        ax.annotate(
            name,
            (s.T(T), s.p(p)),
            textcoords="offset points",
            xytext=(7, -11) if key == "triple" else (7, 4),
            fontsize=8,
            color="#1d1d1f",
            zorder=7,
        )


def _plan(
    ax: Any,
    route: Route,
    report: Analysis | None,
    s: _Scale,
    style: dict[str, Any],
    label: str,
    numbers: bool,
) -> None:
    """One route: its legs (along their paths where a report is given), arrows, corner names
    ("S", 1, 2, ...) and crossings."""
    sub = route.substance
    if report is not None and report.legs:
        by_leg: dict[int, list[Any]] = {}
        for c in report.crossings:
            by_leg.setdefault(c.step, []).append(c)
        lines = [leg_line(sub, leg, by_leg.get(leg.step, [])) for leg in report.legs]
    else:
        cs = route.corners()
        lines = [[cs[i], cs[i + 1]] for i in range(len(cs) - 1)]
    first = True
    for pts in lines:
        if len(pts) < 2:
            continue
        xs = [s.T(T) for T, _ in pts]
        ys = [s.p(p) for _, p in pts]
        ax.plot(
            xs,
            ys,
            color=style["color"],
            ls=style["ls"],
            lw=2.2,
            zorder=4,
            label=label if first else None,
        )
        first = False
        ax.annotate(
            "",
            xy=(xs[-1], ys[-1]),
            xytext=(xs[-2], ys[-2]),
            arrowprops={"arrowstyle": "-|>", "color": style["color"], "lw": 1.2},
            zorder=4,
        )
    corners = route.corners()
    cx = [s.T(T) for T, _ in corners]
    cy = [s.p(p) for _, p in corners]
    ax.plot(cx, cy, ls="none", marker="o", ms=4.5, mfc="#ffffff", mec=style["color"], zorder=5)
    if numbers:
        for i, (x, y) in enumerate(zip(cx, cy, strict=True)):
            ax.annotate(
                "S" if i == 0 else str(i),
                (x, y),
                textcoords="offset points",
                xytext=(5, 5),
                fontsize=8,
                color=style["color"],
                zorder=7,
            )
    if report is not None and report.crossings:
        ax.plot(
            [s.T(c.T) for c in report.crossings],
            [s.p(c.p) for c in report.crossings],
            ls="none",
            marker=style["marker"],
            ms=6.5,
            mfc=style["mfc"],
            mec=style["mec"],
            zorder=6,
            label=f"crossings ({label})" if label != "route" else "crossing",
        )


def _finish(plt: Any, fig: Any, ax: Any, fmt: str, xlabel: str, ylabel: str, title: str) -> bytes:
    """Labels, grid and legend of a figure, then its bytes."""
    ax.set_xlabel(xlabel)
    ax.set_ylabel(ylabel)
    ax.set_title(title, fontsize=11)
    ax.grid(True, which="major", color="#e3e3e3", lw=0.6)
    ax.legend(loc="lower right", fontsize=7.5, frameon=True, framealpha=0.9)
    fig.tight_layout()
    return _save(plt, fig, fmt)


def _save(plt: Any, fig: Any, fmt: str) -> bytes:
    meta = (
        {"Date": None, "Creator": None, "Format": None, "Type": None}
        if fmt == "svg"
        else {"Software": None}
    )
    buf = io.BytesIO()
    fig.savefig(buf, format=fmt, metadata=meta)
    return buf.getvalue()


def _figure(plt: Any) -> tuple[Any, Any]:
    plt.rcParams["svg.hashsalt"] = "phasepath"
    plt.rcParams["svg.fonttype"] = "none"  # text stays text: selectable, searchable, small
    return plt.subplots(figsize=_FIGSIZE, dpi=120)


def _check_fmt(fmt: str) -> None:
    if fmt not in ("svg", "png"):
        raise PhasePathError(f"the diagram is written as svg or png, not {fmt!r}")


def comparison_bytes(
    plans: Sequence[tuple[str, Route, Analysis | None]],
    fmt: str = "svg",
    units: DisplayUnits | None = None,
    title: str | None = None,
) -> bytes:
    """Plans (label, route, report or None) of one substance on one P-T diagram, each in its
    style from :data:`PLAN_STYLES`, as SVG or PNG bytes."""
    _check_fmt(fmt)
    if not plans:
        raise PhasePathError("no plan to draw")
    if len(plans) > len(PLAN_STYLES):
        raise PhasePathError(f"at most {len(PLAN_STYLES)} plans share one diagram")
    sub = plans[0][1].substance
    for label, route, _ in plans:
        if route.substance is not sub:
            raise PhasePathError(
                f"plan {label!r} is for {route.substance.name}, not {sub.name}: one diagram "
                f"shows one substance"
            )
    plt = _pyplot()
    units = units or DisplayUnits("degC", "bar")
    s = _Scale(units)
    window = _window(sub, [c for _, route, _ in plans for c in route.corners()])
    fig, ax = _figure(plt)
    try:
        _boundaries(ax, sub, window, s)
        _special(ax, sub, window, s)
        single = len(plans) == 1
        for (label, route, report), style in zip(plans, PLAN_STYLES, strict=False):
            _plan(ax, route, report, s, style, "route" if single else label, numbers=True)
        T_lo, T_hi, p_lo, p_hi = window
        ax.set_yscale("log")
        ax.set_xlim(s.T(T_lo), s.T(T_hi))
        ax.set_ylim(s.p(p_lo), s.p(p_hi))
        heading = title or f"{sub.name}: phase diagram"
        return _finish(
            plt,
            fig,
            ax,
            fmt,
            f"temperature [{UNIT_LABELS[units.T]}]",
            f"pressure [{UNIT_LABELS[units.p]}]",
            heading,
        )
    finally:
        plt.close(fig)


def diagram_bytes(
    sub: Substance,
    fmt: str = "svg",
    route: Route | None = None,
    report: Analysis | None = None,
    units: DisplayUnits | None = None,
    title: str | None = None,
) -> bytes:
    """The P-T diagram of ``sub`` (with ``route`` and the crossings of ``report``) as SVG or
    PNG bytes."""
    _check_fmt(fmt)
    heading = title or (
        route.title if route is not None and route.title else f"{sub.name}: phase diagram"
    )
    if route is not None:
        return comparison_bytes([("route", route, report)], fmt, units, heading)
    plt = _pyplot()
    units = units or DisplayUnits("degC", "bar")
    s = _Scale(units)
    window = _window(sub, [])
    fig, ax = _figure(plt)
    try:
        _boundaries(ax, sub, window, s)
        _special(ax, sub, window, s)
        T_lo, T_hi, p_lo, p_hi = window
        ax.set_yscale("log")
        ax.set_xlim(s.T(T_lo), s.T(T_hi))
        ax.set_ylim(s.p(p_lo), s.p(p_hi))
        ax.set_xlabel(f"temperature [{UNIT_LABELS[units.T]}]")
        ax.set_ylabel(f"pressure [{UNIT_LABELS[units.p]}]")
        ax.set_title(heading, fontsize=11)
        ax.grid(True, which="major", color="#e3e3e3", lw=0.6)
        ax.legend(loc="lower right", fontsize=7.5, frameon=True, framealpha=0.9)
        fig.tight_layout()
        return _save(plt, fig, fmt)
    finally:
        plt.close(fig)


def _dome(sub: Substance) -> tuple[list[float], list[float]]:
    """(h [J/kg], p [Pa]) around the saturation dome, from the triple point up the liquid side
    to near the critical point and down the vapor side (the fluid model's saturation states)."""
    T_t, T_c = sub.triple[0], sub.critical[0]
    if not (_finite(T_t) and _finite(T_c)) or sub.vapor is None:
        raise PhasePathError(f"no p-h view: {sub.name} has no saturation dome to draw")
    n = 48
    temps = [T_t + (T_c - T_t) * (1.0 - (1.0 - k / n) ** 2) for k in range(n)]
    temps.append(T_c - 1e-4 * (T_c - T_t))
    hl, hv, ps = [], [], []
    for T in temps:
        (h_l, _, _), (h_v, _, _) = sub.fluid.saturated(T)
        hl.append(h_l)
        hv.append(h_v)
        ps.append(sub.vapor.p_of_T(T))
    return hl + hv[::-1], ps + ps[::-1]


def ph_bytes(
    report: Analysis,
    fmt: str = "svg",
    units: DisplayUnits | None = None,
    title: str | None = None,
) -> bytes:
    """The p-h view of an analysed route as SVG or PNG bytes.

    The dome comes from the fluid model's saturated states; each leg is drawn through the states
    the report holds: a constant-pressure leg straight between its ends (exact on p-h), a curved
    leg through its traced states, a constant-temperature leg dotted between its ends (its path
    on p-h is not in the report). States without an enthalpy (a solid with no model) are left
    out. A substance without an equation of state has no p-h view (a PhasePathError says so).
    """
    _check_fmt(fmt)
    sub = report.substance
    dome_h, dome_p = _dome(sub)  # raises for a substance without an equation of state
    plt = _pyplot()
    units = units or DisplayUnits("degC", "bar", "kJ/kg")
    s = _Scale(units)
    fig, ax = _figure(plt)
    style = PLAN_STYLES[0]
    try:
        st = STYLE["dome"]
        ax.plot(
            [s.e(h) for h in dome_h],
            [s.p(p) for p in dome_p],
            color=st["color"],
            ls=st["ls"],
            lw=1.8,
            label=st["label"],
        )
        T_c, p_c = sub.critical
        i_top = len(dome_h) // 2
        ax.plot(
            [s.e(0.5 * (dome_h[i_top - 1] + dome_h[i_top]))],
            [s.p(p_c)],
            ls="none",
            ms=7,
            label="critical point",
            **STYLE["critical"],
        )
        dotted_label = True
        solid_label = True
        corners: list[tuple[float, float]] = []
        for leg in report.legs:
            if leg.kind == "isotherm" or not leg.path:
                states = [leg.start, leg.end]
            else:
                states = [leg.start, *leg.path, leg.end]
            pts = [(st_.h, st_.p) for st_ in states if st_.h is not None]
            if leg.kind == "isobar":
                pts = [pts[0], pts[-1]] if len(pts) >= 2 else []
            if len(pts) < 2:
                continue
            dotted = leg.kind == "isotherm"
            lab = None
            if dotted and dotted_label:
                lab, dotted_label = "constant T (ends only)", False
            elif not dotted and solid_label:
                lab, solid_label = "route", False
            xs = [s.e(h) for h, _ in pts]
            ys = [s.p(p) for _, p in pts]
            ax.plot(xs, ys, color=style["color"], ls=":" if dotted else "-", lw=2.0, label=lab)
            ax.annotate(
                "",
                xy=(xs[-1], ys[-1]),
                xytext=(xs[-2], ys[-2]),
                arrowprops={"arrowstyle": "-|>", "color": style["color"], "lw": 1.1},
            )
            corners += [pts[0], pts[-1]]
        names = ["S"] + [str(leg.step) for leg in report.legs]
        ends = [report.legs[0].start] + [leg.end for leg in report.legs] if report.legs else []
        for name, state in zip(names, ends, strict=False):
            if state.h is None:
                continue
            x, y = s.e(state.h), s.p(state.p)
            ax.plot([x], [y], ls="none", marker="o", ms=4.5, mfc="#ffffff", mec=style["color"])
            ax.annotate(name, (x, y), textcoords="offset points", xytext=(5, 5), fontsize=8)
        ax.set_yscale("log")
        ps = dome_p + [p for _, p in corners]
        ax.set_ylim(s.p(min(ps) / 2.0), s.p(max(ps) * 2.0))
        heading = title or f"{report.route.title or sub.name}: p-h view"
        return _finish(
            plt,
            fig,
            ax,
            fmt,
            f"specific enthalpy [{UNIT_LABELS[units.energy]}]",
            f"pressure [{UNIT_LABELS[units.p]}]",
            heading,
        )
    finally:
        plt.close(fig)
