"""Static figures of a phase diagram with a route, for people who do not open notebooks
(matplotlib, the optional extra ``phasepath[plot]``).

:func:`diagram_bytes` draws a substance's boundary curves, its triple and critical points and,
if given, a route with its corners and crossings, and returns the figure as SVG or PNG bytes
(the same bytes for the same inputs: no dates or software stamps in the file).
"""

from __future__ import annotations

import io
from typing import TYPE_CHECKING, Any

from .errors import PhasePathError
from .format import UNIT_LABELS, DisplayUnits
from .units import affine

if TYPE_CHECKING:  # pragma: no cover
    from .report import Report
    from .route import Route
    from .substances import Substance

__all__ = ["diagram_bytes", "COLOURS"]

#: Line colour of each kind of boundary in static figures.
COLOURS = {"vaporization": "#1d6a8a", "melting": "#b4512f", "sublimation": "#6b4e9b"}


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


def _window(sub: Substance, route: Route | None) -> tuple[float, float, float, float]:
    T_t, p_t = sub.triple
    T_c, p_c = sub.critical
    T_lo, T_hi = sub.T_min, max(1.2 * T_c, T_c + 40.0)
    p_lo, p_hi = max(min(p_t / 50.0, p_t), 1.0), 20.0 * p_c
    if sub.sublimation is not None:
        p_lo = max(sub.sublimation.p_of_T(sub.sublimation.T_min), 1e-3)
    if route is not None:
        Ts = [T for T, _ in route.corners()]
        ps = [p for _, p in route.corners()]
        T_lo, T_hi = min(T_lo, min(Ts) - 5.0), max(T_hi, max(Ts) + 5.0)
        p_lo, p_hi = min(p_lo, min(ps) / 3.0), max(p_hi, max(ps) * 3.0)
    return max(T_lo, sub.T_min), T_hi, p_lo, p_hi


def diagram_bytes(
    sub: Substance,
    fmt: str = "svg",
    route: Route | None = None,
    report: Report | None = None,
    units: DisplayUnits | None = None,
    title: str | None = None,
) -> bytes:
    """The P-T diagram of ``sub`` (with ``route`` and the crossings of ``report``) as SVG or
    PNG bytes."""
    if fmt not in ("svg", "png"):
        raise PhasePathError(f"the diagram is written as svg or png, not {fmt!r}")
    plt = _pyplot()
    units = units or DisplayUnits("degC", "bar")
    tB, tA = affine("K", units.T, "temperature")
    pB, pA = affine("Pa", units.p, "pressure")
    T_lo, T_hi, p_lo, p_hi = _window(sub, route)
    T_t, p_t = sub.triple
    T_c, p_c = sub.critical

    plt.rcParams["svg.hashsalt"] = "phasepath"
    fig, ax = plt.subplots(figsize=(7.5, 5.2), dpi=120)
    try:
        drawn = set()
        for b in sub.boundaries:
            T, p = b.curve(p_lo, p_hi)
            keep = (T >= T_lo) & (T <= T_hi)
            if keep.sum() < 2:
                continue
            ax.plot(
                tA + tB * T[keep],
                pA + pB * p[keep],
                color=COLOURS[b.kind],
                lw=1.8,
                ls="-" if b.reliable else "--",
                label=b.kind if b.kind not in drawn else None,
            )
            drawn.add(b.kind)
        special = {"marker": "o", "ms": 6, "mfc": "white", "mec": "#222222", "ls": "none"}
        ax.plot([tA + tB * T_t], [pA + pB * p_t], label="triple point", **special)
        if T_c <= T_hi:
            ax.plot(
                [tA + tB * T_c],
                [pA + pB * p_c],
                label="critical point",
                **{**special, "marker": "s"},
            )
        if route is not None:
            _draw_route(ax, route, report, (tA, tB, pA, pB))
        ax.set_yscale("log")
        ax.set_xlim(tA + tB * T_lo, tA + tB * T_hi)
        ax.set_ylim(pA + pB * p_lo, pA + pB * p_hi)
        ax.set_xlabel(f"temperature [{UNIT_LABELS[units.T]}]")
        ax.set_ylabel(f"pressure [{UNIT_LABELS[units.p]}]")
        heading = title or (
            route.title if route is not None and route.title else f"{sub.name}: phase diagram"
        )
        ax.set_title(heading, fontsize=11)
        ax.grid(True, which="major", color="#dddddd", lw=0.6)
        ax.legend(loc="lower right", fontsize=8, frameon=False)
        fig.tight_layout()
        meta = {"Date": None} if fmt == "svg" else {"Software": None}
        buf = io.BytesIO()
        fig.savefig(buf, format=fmt, metadata=meta)
    finally:
        plt.close(fig)
    return buf.getvalue()


def _draw_route(
    ax: Any, route: Route, report: Report | None, scale: tuple[float, float, float, float]
) -> None:
    tA, tB, pA, pB = scale
    cs = route.corners()
    xs = [tA + tB * T for T, _ in cs]
    ys = [pA + pB * p for _, p in cs]
    ax.plot(xs, ys, color="#111111", lw=1.4, label="route")
    for i in range(len(cs) - 1):
        ax.annotate(
            "",
            xy=(xs[i + 1], ys[i + 1]),
            xytext=(xs[i], ys[i]),
            arrowprops={"arrowstyle": "-|>", "color": "#111111", "lw": 1.2},
        )
    for i, (x, y) in enumerate(zip(xs, ys, strict=True)):
        ax.annotate(str(i), (x, y), textcoords="offset points", xytext=(5, 5), fontsize=8)
    if report is not None and report.crossings:
        cx = [tA + tB * c.T for c in report.crossings]
        cy = [pA + pB * c.p for c in report.crossings]
        ax.plot(cx, cy, marker="D", ms=6, mfc="#f2c14e", mec="#111111", ls="none", label="crossing")
