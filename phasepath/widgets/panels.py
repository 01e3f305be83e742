"""Panels of the planner: the leg list, the results tables, the cautions and the legend.

The leg list shows every corner of the route with its T and p in the display units; a value typed
there goes to the planner, which validates it through the core. A rejected value stays in its field
with the reason next to it, and the route keeps its last good state.
"""

from __future__ import annotations

import html
import math
from collections.abc import Callable

import ipywidgets as W

from .. import format as F
from .. import tables
from ..format import UNIT_LABELS, DisplayUnits
from ..records import LEG_KINDS, Crossing, LegSummary
from ..report import Report
from ..units import convert

__all__ = ["LegList", "results_html", "cautions_html", "crossing_tip", "legend_html", "CSS"]

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
</style>
"""


def _hint(kind: str) -> str:
    """What a typed target may be for a leg kind (placeholder of the add-a-leg field)."""
    targets = LEG_KINDS[kind].targets
    if "until" in targets:
        coord = next(t for t in targets if t != "until")
        return f"{coord}, or until an event"
    if len(targets) > 1:
        return " or ".join(f"end {t}" for t in targets)
    return f"end {targets[0]}, e.g. {'1 atm' if targets[0] == 'p' else '20 degC'}"


class LegList(W.VBox):
    """One row per corner: index, the kind of the leg ending there, T and p fields, delete; and
    a last row to type a new leg (kind, target, add).

    ``on_edit(index, coord, text)`` is called when a field is committed (Enter or leaving it),
    ``on_delete(index)`` when a row's delete button is pressed, ``on_add(kind, text)`` when a
    typed leg is added. Each returns an error message to show next to the row, or "" when the
    edit was taken.
    """

    def __init__(
        self,
        on_edit: Callable[[int, str, str], str],
        on_delete: Callable[[int], str],
        on_add: Callable[[str, str], str] | None = None,
    ) -> None:
        self._on_edit, self._on_delete, self._on_add = on_edit, on_delete, on_add
        self._rows: list[_Row] = []
        self._quiet = False
        self.header = W.HTML()
        self.hint = W.HTML("<span class='pp-err'></span>")
        self.add_kind = W.Dropdown(
            options=[(kind.label, name) for name, kind in LEG_KINDS.items()],
            value="isobar",
            layout=W.Layout(width="120px"),
        )
        self.add_target = W.Text(placeholder=_hint("isobar"), layout=W.Layout(width="188px"))
        self.add_btn = W.Button(
            description="add", tooltip="add this leg at the end", layout=W.Layout(width="52px")
        )
        self.add_error = W.HTML()
        self.add_kind.observe(
            lambda ch: setattr(self.add_target, "placeholder", _hint(ch["new"])),
            names="value",
        )
        self.add_btn.on_click(lambda _b: self._added())
        self.add_box = W.VBox(
            [
                W.HTML("<div style='font-size:12px;color:#555;margin-top:6px'>type a leg</div>"),
                W.HBox([self.add_kind, self.add_target, self.add_btn]),
                self.add_error,
            ]
        )
        super().__init__(children=[self.header], layout=W.Layout(min_width="330px"))
        self.add_class("pp-legs")

    def show(
        self,
        corners: list[tuple[float, float]],
        kinds: list[str],
        T_unit: str,
        p_unit: str,
        events: list[str] | None = None,
    ) -> None:
        """Write the corners (SI) into the rows in the display units. ``events`` holds, per
        corner, the event its leg ends on ("" for a leg that ends at its target)."""
        self.header.value = (
            "<div class='pp-h'>Legs</div><div style='font-size:12px;color:#555'>"
            f"corner · leg kind · T [{UNIT_LABELS[T_unit]}] · p [{UNIT_LABELS[p_unit]}]</div>"
        )
        events = events or [""] * len(corners)
        while len(self._rows) < len(corners):
            self._rows.append(_Row(len(self._rows), self))
        self._quiet = True
        try:
            for i, ((T, p), kind, event) in enumerate(zip(corners, kinds, events, strict=True)):
                row = self._rows[i]
                label = LEG_KINDS[kind].label if kind in LEG_KINDS else kind
                until = f"<br><span style='font-size:11px'>until {html.escape(event)}</span>"
                row.label.value = f"<b>{'S' if i == 0 else i}</b> {label}" + (
                    until if event else ""
                )
                row.T.value = _num(convert(T, "K", T_unit, "temperature"), "T")
                row.p.value = _num(convert(p, "Pa", p_unit, "pressure"), "p")
                targets = LEG_KINDS[kind].targets if kind in LEG_KINDS else ("T", "p")
                row.T.disabled = "T" not in targets  # the leg holds T, or T follows from the EOS
                row.p.disabled = "p" not in targets
                row.error.value = ""
        finally:
            self._quiet = False
        rows = [r.box for r in self._rows[: len(corners)]]
        if not corners:
            rows = [
                W.HTML(
                    "<span style='font-size:12px;color:#555'>Click on the diagram to "
                    "place the start, then click again for each leg, or type a start "
                    "below.</span>"
                )
            ]
        else:
            rows.append(self.add_box)
        if list(self.children) != [self.header, *rows]:
            self.children = [self.header, *rows]

    def row_error(self, index: int, message: str) -> None:
        if 0 <= index < len(self._rows):
            self._rows[index].error.value = (
                f"<span class='pp-err'>⚠ {html.escape(message)}</span>" if message else ""
            )

    @property
    def rows(self) -> list[_Row]:
        """The rows in use (for tests)."""
        return [r for r in self._rows if r.box in self.children]

    def _edited(self, index: int, coord: str, text: str) -> None:
        if self._quiet:
            return
        msg = self._on_edit(index, coord, text)
        self.row_error(index, msg)

    def _deleted(self, index: int) -> None:
        self.row_error(index, self._on_delete(index))

    def _added(self) -> None:
        if self._on_add is None:
            return
        msg = self._on_add(self.add_kind.value, self.add_target.value)
        self.add_error.value = f"<span class='pp-err'>⚠ {html.escape(msg)}</span>" if msg else ""
        if not msg:
            self.add_target.value = ""


class _Row:
    def __init__(self, index: int, owner: LegList) -> None:
        self.index = index
        self.label = W.HTML(layout=W.Layout(width="120px"))
        self.T = W.Text(continuous_update=False, layout=W.Layout(width="92px"))
        self.p = W.Text(continuous_update=False, layout=W.Layout(width="92px"))
        self.delete = W.Button(
            icon="trash", tooltip=f"delete corner {index or 'S'}", layout=W.Layout(width="34px")
        )
        self.error = W.HTML()
        self.T.observe(lambda ch: owner._edited(index, "T", ch["new"]), names="value")
        self.p.observe(lambda ch: owner._edited(index, "p", ch["new"]), names="value")
        self.delete.on_click(lambda _b: owner._deleted(index))
        self.box = W.VBox(
            [W.HBox([self.label, self.T, self.p, self.delete]), self.error],
            layout=W.Layout(margin="0 0 2px 0"),
        )


def _num(x: float, coord: str) -> str:
    if coord == "T":
        return f"{x:.2f}"
    if x == 0 or not math.isfinite(x):
        return f"{x}"
    digits = max(0, 4 - int(math.floor(math.log10(abs(x)))))
    return f"{x:.{digits}f}" if abs(x) < 1e7 else f"{x:.5g}"


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


def cautions_html(report: Report | None) -> str:
    """The route's cautions, exactly as the core gives them (``Report.cautions``)."""
    if report is None or not report.cautions:
        return ""
    items = "".join(f"<li>{html.escape(c)}</li>" for c in report.cautions)
    return f"<div class='pp-caution'><b>Cautions</b><ul>{items}</ul></div>"


def legend_html(extrapolated: bool = False, kinds: tuple[str, ...] | None = None) -> str:
    """The legend under the diagram; ``extrapolated`` adds the key of curves beyond their data
    (drawn for substances built from data); ``kinds`` limits the curve keys to the boundary kinds
    the substance has (all three when None)."""
    from .diagram import STYLE

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
