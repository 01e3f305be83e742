"""Panels of the planner: the results tables, the cautions and the legends (the leg list is in
:mod:`.leglist`). The core's texts (cautions, hazard reasons) are shown with their temperatures
and pressures in the display units at the display precision (:func:`.readout.in_display_units`).
"""

from __future__ import annotations

import html

from .. import format as F
from .. import tables
from ..format import DisplayUnits
from ..records import Crossing, LegSummary
from ..report import Report
from .readout import in_display_units

__all__ = [
    "results_html",
    "cautions_html",
    "crossing_tip",
    "legend_html",
    "energy_legend_html",
    "CSS",
]

#: Styles of the planner's HTML parts (tables, messages, legend).
CSS = """
<style>
.pp-planner { font-family: system-ui, -apple-system, 'Segoe UI', sans-serif; color: #1d1d1f; }
.pp-planner .pp-status { padding: 4px 8px; border-radius: 4px; font-size: 13px; }
.pp-planner .pp-ok { background: #eef5ee; border-left: 4px solid #2a7d5f; }
.pp-planner .pp-bad { background: #fdf1e6; border-left: 4px solid #b34700; }
.pp-planner table.pp-table { border-collapse: collapse; font-size: 13px; margin: 4px 0 10px 0; }
.pp-planner table.pp-table th { background: #f0f2f5; text-align: left; padding: 4px 10px;
  border-bottom: 2px solid #c9ced6; font-weight: 600; }
.pp-planner table.pp-table td { padding: 3px 10px; border-bottom: 1px solid #e3e6ea; }
.pp-planner table.pp-table td.num { text-align: right; font-variant-numeric: tabular-nums; }
.pp-planner table.pp-table tr:hover td { background: #fff6dc; }
.pp-planner .pp-h { font-weight: 600; font-size: 14px; margin: 6px 0 2px 0; }
.pp-planner .pp-legend span.pp-key { margin-right: 16px; white-space: nowrap; font-size: 12px; }
.pp-planner .pp-caution { font-size: 12px; color: #4a3b00; background: #fff8e1;
  border-left: 4px solid #f2b01e; padding: 4px 8px; }
.pp-planner .pp-err { color: #9a3412; font-size: 12px; }
.pp-planner .pp-legs .widget-text input { font-variant-numeric: tabular-nums; }
.pp-planner .pp-legs .pp-rejected input { border: 2px solid #b34700; background: #fdf1e6; }
.pp-planner .pp-legs .pp-typed { font-family: monospace; text-decoration: line-through; }
.pp-planner .pp-legs .pp-state { font-size: 11px; color: #444; padding-left: 4px;
  font-variant-numeric: tabular-nums; }
.pp-planner .pp-legs .pp-selected { background: #fdecee; border-left: 3px solid #d1495b; }
.pp-planner .pp-doc textarea { font-size: 12px; }
</style>
"""


def crossing_tip(c: Crossing, units: DisplayUnits) -> str:
    """Plain-text conditions of a crossing (table row tooltips and diagram marks)."""
    L = (
        "no latent heat"
        if c.latent_heat is None
        else f"latent heat {F.quantity(c.latent_heat, 'energy', units.energy)}"
    )
    return (
        f"leg {c.step}: {c.kind} ({c.from_text} → {c.to_text}) at "
        f"T = {F.quantity(c.T, 'temperature', units.T)}, "
        f"p = {F.quantity(c.p, 'pressure', units.p)}; {L}"
    )


def _leg_tip(leg: LegSummary, units: DisplayUnits) -> str:
    T0, T1 = F.temperature(leg.start.T, units.T), F.temperature(leg.end.T, units.T)
    p0, p1 = F.pressure(leg.start.p, units.p), F.pressure(leg.end.p, units.p)
    Tl, pl, _ = units.labels
    return f"leg {leg.step} ({leg.kind}): {T0} → {T1} {Tl}, {p0} → {p1} {pl}"


def results_html(report: Report | None, units: DisplayUnits) -> str:
    """The crossings table and the per-leg table (heat, work, fractions, the event a leg ends
    on, hazard flags), as HTML, from the one table definition of :mod:`phasepath.tables`."""
    if report is None:
        return (
            "<div class='pp-h'>Crossings</div><div style='font-size:13px;color:#555'>"
            "Draw at least one leg to see where the route changes phase.</div>"
        )
    out = ["<div class='pp-h'>Crossings</div>"]
    if report.crossings:
        index = {id(c): k for k, c in enumerate(report.crossings)}

        def crossing_data(c: Crossing) -> dict[str, str]:
            return {"index": str(index[id(c)]), "leg": str(c.step), "kind": c.kind}

        def crossing_title(c: Crossing) -> str:
            tip = crossing_tip(c, units)
            return tip + (f" ({c.latent_heat_note})" if c.latent_heat_note else "")

        out.append(
            tables.html_table(
                tables.CROSSINGS,
                report.crossings,
                units,
                table_class="pp-crossings",
                row_class="pp-crossing",
                row_title=crossing_title,
                row_data=crossing_data,
            )
        )
    else:
        out.append("<div style='font-size:13px;color:#555'>No phase boundary is crossed.</div>")
    out.append("<div class='pp-h'>Heat and work per leg</div>")
    out.append(
        tables.html_table(
            tables.LEGS,
            report.legs,
            units,
            table_class="pp-legsum",
            row_class="pp-leg",
            row_title=lambda leg: _leg_tip(leg, units),
            row_data=lambda leg: {"leg": str(leg.step)},
        )
    )
    out.append(
        "<div style='font-size:11px;color:#555'>Reversible steady flow per kg: "
        "heat = ∫T ds, work = ∫v dp, heat + work = Δh. Fractions are by mass (lever rule); "
        "— for a single phase.</div>"
    )
    return "".join(out)


def cautions_html(report: Report | None, units: DisplayUnits | None = None) -> str:
    """The route's cautions as the core gives them (``Report.cautions``), their temperatures
    and pressures in the display units."""
    if report is None or not report.cautions:
        return ""
    shown = [in_display_units(c, units) if units is not None else c for c in report.cautions]
    items = "".join(f"<li>{html.escape(c)}</li>" for c in shown)
    return f"<div class='pp-caution'><b>Cautions</b><ul>{items}</ul></div>"


def legend_html(extrapolated: bool = False, kinds: tuple[str, ...] | None = None) -> str:
    """The legend under the diagram; ``extrapolated`` adds the key of curves beyond their data
    (drawn for substances built from data); ``kinds`` limits the curve keys to the boundary kinds
    the substance has (all three when None)."""
    from .canvas import STYLE

    def line(kind: str) -> str:
        st = STYLE[kind]
        dash = {
            "solid": "",
            "dashed": "stroke-dasharray='7 4'",
            "dash_dotted": "stroke-dasharray='7 3 2 3'",
            "dotted": "stroke-dasharray='2 3'",
        }[st.get("dash", "solid")]
        return (
            f"<span class='pp-key'><svg width='30' height='10'><line x1='0' y1='5' x2='30' "
            f"y2='5' stroke='{st.get('color', '#555')}' stroke-width='2.5' {dash}/></svg> "
            f"{st['label']}</span>"
        )

    return (
        "<div class='pp-legend'>"
        + "".join(
            line(k)
            for k in ("vaporization", "melting", "sublimation")
            if kinds is None or k in kinds
        )
        + (line("extrapolated") if extrapolated else "")
        + "<span class='pp-key'><svg width='12' height='12'><polygon points='6,1 11,11 1,11' "
        "fill='#1d1d1f'/></svg> triple point</span>"
        + "<span class='pp-key'><svg width='12' height='12'><rect x='1.5' y='1.5' width='9' "
        "height='9' fill='#fff' stroke='#1d1d1f' stroke-width='2'/></svg> critical point"
        "</span>"
        + "<span class='pp-key'><svg width='30' height='12'><line x1='0' y1='6' x2='30' y2='6' "
        "stroke='#1d1d1f' stroke-width='3'/><circle cx='15' cy='6' r='4' fill='#fff' "
        "stroke='#1d1d1f' stroke-width='2'/></svg> route (drag a corner)</span>"
        + "<span class='pp-key'><svg width='14' height='14'><polygon points='7,1 13,7 7,13 1,7'"
        " fill='#f2b01e' stroke='#1d1d1f' stroke-width='1.2'/></svg> crossing</span></div>"
    )


def energy_legend_html() -> str:
    """The key of the p–h and T–s diagrams."""
    from .canvas import STYLE

    def key(color: str, dash: str, text: str) -> str:
        return (
            f"<span class='pp-key'><svg width='30' height='10'><line x1='0' y1='5' x2='30' "
            f"y2='5' stroke='{color}' stroke-width='2.2' {dash}/></svg> {text}</span>"
        )

    return (
        "<div class='pp-legend'>"
        + key(STYLE["vaporization"]["color"], "", "saturated liquid and vapor (the dome)")
        + key(STYLE["triple"]["color"], "", "triple-point line")
        + key(STYLE["melting"]["color"], "stroke-dasharray='7 4'", "solid side (melting)")
        + key(STYLE["sublimation"]["color"], "stroke-dasharray='7 4'", "solid side (sublimation)")
        + "</div>"
    )
