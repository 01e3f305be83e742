"""Controls of the planner: the leg list, the results tables and the cautions.

The leg list shows every corner of the route with its T and p in the display units; a value typed
there goes to the planner, which validates it through the core. A rejected value stays in its field
with the reason next to it, and the route keeps its last good state.
"""

from __future__ import annotations

import html
import math
from collections.abc import Callable

import ipywidgets as W

from ..report import UNIT_LABELS, Report
from ..substances import Substance
from ..units import convert

__all__ = ["LegList", "results_html", "cautions_html", "crossing_tip", "CSS"]

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

_KIND_TEXT = {
    "start": "start",
    "isobar": "constant p",
    "isotherm": "constant T",
    "isochore": "constant v",
    "isenthalp": "constant h",
    "isentrope": "constant s",
}


class LegList(W.VBox):
    """One row per corner: index, the kind of the leg ending there, T and p fields, delete.

    ``on_edit(index, coord, text)`` is called when a field is committed (Enter or leaving it),
    ``on_delete(index)`` when a row's delete button is pressed. Each returns an error message to
    show next to the row, or "" when the edit was taken.
    """

    def __init__(
        self, on_edit: Callable[[int, str, str], str], on_delete: Callable[[int], str]
    ) -> None:
        self._on_edit, self._on_delete = on_edit, on_delete
        self._rows: list[_Row] = []
        self._quiet = False
        self.header = W.HTML()
        self.hint = W.HTML("<span class='pp-err'></span>")
        super().__init__(children=[self.header], layout=W.Layout(min_width="330px"))
        self.add_class("pp-legs")

    def show(
        self, corners: list[tuple[float, float]], kinds: list[str], T_unit: str, p_unit: str
    ) -> None:
        """Write the corners (SI) into the rows in the display units."""
        self.header.value = (
            "<div class='pp-h'>Legs</div><div style='font-size:12px;color:#555'>"
            f"corner · leg kind · T [{UNIT_LABELS[T_unit]}] · p [{UNIT_LABELS[p_unit]}]</div>"
        )
        while len(self._rows) < len(corners):
            self._rows.append(_Row(len(self._rows), self))
        self._quiet = True
        try:
            for i, ((T, p), kind) in enumerate(zip(corners, kinds, strict=True)):
                row = self._rows[i]
                row.label.value = f"<b>{'S' if i == 0 else i}</b> {_KIND_TEXT.get(kind, kind)}"
                row.T.value = _num(convert(T, "K", T_unit, "temperature"), "T")
                row.p.value = _num(convert(p, "Pa", p_unit, "pressure"), "p")
                row.T.disabled = kind != "isobar" and kind != "start"
                row.p.disabled = kind == "isobar"
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


def crossing_tip(c: object, T_unit: str, p_unit: str, energy_unit: str) -> str:
    """Plain-text conditions of a crossing (table row tooltips and diagram marks)."""
    T = convert(c.T, "K", T_unit, "temperature")  # type: ignore[attr-defined]
    p = convert(c.p, "Pa", p_unit, "pressure")  # type: ignore[attr-defined]
    L = c.latent_heat  # type: ignore[attr-defined]
    Ltext = (
        "no latent heat"
        if L is None
        else f"latent heat {convert(L, 'J/kg', energy_unit, 'energy'):.4g} "
        f"{UNIT_LABELS[energy_unit]}"
    )
    return (
        f"leg {c.step}: {c.kind} ({c.from_phase} → {c.to_phase}) at "  # type: ignore[attr-defined]
        f"T = {T:.2f} {UNIT_LABELS[T_unit]}, p = {p:.5g} {UNIT_LABELS[p_unit]}; {Ltext}"
    )


def results_html(report: Report | None, T_unit: str, p_unit: str, energy_unit: str) -> str:
    """The crossings table and the per-leg heat and work table, as HTML."""
    if report is None:
        return (
            "<div class='pp-h'>Crossings</div><div style='font-size:13px;color:#555'>"
            "Draw at least one leg to see where the route changes phase.</div>"
        )
    tl, pl, el = UNIT_LABELS[T_unit], UNIT_LABELS[p_unit], UNIT_LABELS[energy_unit]
    out = ["<div class='pp-h'>Crossings</div>"]
    if report.crossings:
        out.append(
            "<table class='pp-table pp-crossings'><tr><th>leg</th><th>transition</th>"
            f"<th>from → to</th><th>T [{tl}]</th><th>p [{pl}]</th>"
            f"<th>latent heat [{el}]</th></tr>"
        )
        for k, c in enumerate(report.crossings):
            T = convert(c.T, "K", T_unit, "temperature")
            p = convert(c.p, "Pa", p_unit, "pressure")
            L = (
                "—"
                if c.latent_heat is None
                else f"{convert(c.latent_heat, 'J/kg', energy_unit, 'energy'):.4g}"
            )
            tip = html.escape(
                crossing_tip(c, T_unit, p_unit, energy_unit)
                + (f" ({c.latent_heat_note})" if c.latent_heat_note else "")
            )
            frm = c.from_phase + (f" ({c.from_form})" if c.from_form else "")
            to = c.to_phase + (f" ({c.to_form})" if c.to_form else "")
            out.append(
                f"<tr class='pp-crossing' data-index='{k}' data-leg='{c.step}' "
                f"data-kind='{html.escape(c.kind)}' data-t='{T:.6g}' data-p='{p:.6g}' "
                f"title='{tip}'><td class='num'>{c.step}</td><td>{html.escape(c.kind)}</td>"
                f"<td>{html.escape(frm)} → {html.escape(to)}</td><td class='num'>{T:.2f}</td>"
                f"<td class='num'>{p:.5g}</td><td class='num'>{L}</td></tr>"
            )
        out.append("</table>")
    else:
        out.append("<div style='font-size:13px;color:#555'>No phase boundary is crossed.</div>")
    out.append(
        "<div class='pp-h'>Heat and work per leg</div>"
        "<table class='pp-table pp-legsum'><tr><th>leg</th><th>kind</th>"
        f"<th>start → end phase</th><th>heat in [{el}]</th><th>work in [{el}]</th>"
        "<th>hazards</th><th>basis</th></tr>"
    )
    for leg in report.legs:

        def e(v: float | None) -> str:
            return "—" if v is None else f"{convert(v, 'J/kg', energy_unit, 'energy'):.4g}"

        tip = html.escape(
            f"leg {leg.step} ({leg.kind}): {convert(leg.start.T, 'K', T_unit, 'temperature'):.2f}"
            f" → {convert(leg.end.T, 'K', T_unit, 'temperature'):.2f} {tl}, "
            f"{convert(leg.start.p, 'Pa', p_unit, 'pressure'):.5g} → "
            f"{convert(leg.end.p, 'Pa', p_unit, 'pressure'):.5g} {pl}"
        )
        out.append(
            f"<tr class='pp-leg' data-leg='{leg.step}' title='{tip}'><td class='num'>{leg.step}"
            f"</td><td>{_KIND_TEXT.get(leg.kind, leg.kind)}</td>"
            f"<td>{html.escape(leg.start.phase)} → "
            f"{html.escape(leg.end.phase)}</td><td class='num'>{e(leg.heat)}</td>"
            f"<td class='num'>{e(leg.work)}</td>{_hazard_cell(leg)}"
            f"<td style='font-size:11px;color:#555'>"
            f"{html.escape(leg.note)}</td></tr>"
        )
    out.append(
        "</table><div style='font-size:11px;color:#555'>Reversible steady flow per kg: "
        "heat = ∫T ds, work = ∫v dp, heat + work = Δh.</div>"
    )
    return "".join(out)


def _hazard_cell(leg: object) -> str:
    hazards = list(getattr(leg, "hazards", ()) or ())
    if not hazards:
        return "<td></td>"
    tip = html.escape(" ".join(f"{h.kind}: {h.reason}." for h in hazards))
    kinds = html.escape(", ".join(dict.fromkeys(h.kind for h in hazards)))
    return f"<td title='{tip}' style='color:#9a3412;font-weight:600'>⚠ {kinds}</td>"


def cautions_html(
    sub: Substance, corners: list[tuple[float, float]], report: Report | None = None
) -> str:
    """Plain cautions: the core's hazard flags on the route, then the substance and the
    conditions the route reaches."""
    items: list[str] = []
    if report is not None:
        for h in [h for leg in report.legs for h in getattr(leg, "hazards", ())] + [
            h for c in report.crossings for h in getattr(c, "hazards", ())
        ]:
            if h.caution and h.caution not in items:
                items.append(h.caution)
    p_max = max((p for _, p in corners), default=0.0)
    T_min = min((T for T, _ in corners), default=math.inf)
    T_max = max((T for T, _ in corners), default=-math.inf)
    if p_max > 1.5e5:
        items.append(
            f"The route reaches {p_max / 1e5:.4g} bar: pressure equipment must be rated "
            "and relieved for it."
        )
    if T_min < 200.0:
        items.append(
            "Cryogenic temperatures: cold burns, embrittlement of ordinary steels, and "
            "pressure build-up as trapped liquid warms."
        )
    if T_max > 330.0:
        items.append("Hot surfaces, hot liquid and steam: scald and burn risk.")
    name = sub.name
    if name in ("CarbonDioxide", "Nitrogen", "Argon", "Helium", "Neon"):
        items.append(
            f"{name} displaces air: asphyxiation risk in closed rooms; ventilate and "
            "monitor oxygen."
        )
    if name == "CarbonDioxide":
        items.append(
            "Solid CO2 (dry ice) causes cold burns and sublimes to gas: never seal it in "
            "a closed vessel."
        )
    if name in ("Methane", "Hydrogen", "Ethane", "n-Propane", "n-Butane", "Ethylene"):
        items.append(
            f"{name} is flammable: keep ignition sources away and follow hazardous-area rules."
        )
    items.append(
        "Results are model values for planning, not a safety assessment. Follow local "
        "codes, the equipment's ratings and licensed practice before any run."
    )
    return (
        "<div class='pp-caution'><b>Cautions.</b> "
        + " ".join(html.escape(i) for i in items)
        + "</div>"
    )
