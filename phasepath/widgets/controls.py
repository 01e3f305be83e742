"""Controls of the planner: the leg list, the results tables and the cautions.

The leg list shows every corner of the route with its T and p in the display units; a value typed
there goes to the planner, which validates it through the core. A rejected value stays in its field
with the reason next to it, and the route keeps its last good state.
"""

from __future__ import annotations

import html
import math
import re
from collections.abc import Callable

import ipywidgets as W

from ..report import UNIT_LABELS, Report
from ..substances import Substance
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

_KIND_TEXT = {
    "start": "start",
    "isobar": "constant p",
    "isotherm": "constant T",
    "isochore": "constant v",
    "isenthalp": "constant h",
    "isentrope": "constant s",
}


#: What a typed target may be for each leg kind (placeholder of the add-a-leg field).
_TARGET_HINT = {
    "isobar": "T, or until fully vapor",
    "isotherm": "p, or until first liquid",
    "isochore": "end T or end p",
    "isenthalp": "end p, e.g. 1 atm",
    "isentrope": "end p, e.g. 80 bar",
}


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
            options=[(_KIND_TEXT[k], k) for k in _TARGET_HINT],
            value="isobar",
            layout=W.Layout(width="120px"),
        )
        self.add_target = W.Text(placeholder=_TARGET_HINT["isobar"], layout=W.Layout(width="188px"))
        self.add_btn = W.Button(
            description="add", tooltip="add this leg at the end", layout=W.Layout(width="52px")
        )
        self.add_error = W.HTML()
        self.add_kind.observe(
            lambda ch: setattr(self.add_target, "placeholder", _TARGET_HINT[ch["new"]]),
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
                label = _KIND_TEXT.get(kind, kind)
                until = f"<br><span style='font-size:11px'>until {html.escape(event)}</span>"
                row.label.value = f"<b>{'S' if i == 0 else i}</b> {label}" + (
                    until if event else ""
                )
                row.T.value = _num(convert(T, "K", T_unit, "temperature"), "T")
                row.p.value = _num(convert(p, "Pa", p_unit, "pressure"), "p")
                row.T.disabled = kind in ("isotherm", "isenthalp", "isentrope")
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
    """The crossings table (with what happens there and its hazard flags) and the per-leg
    table (heat, work, the end state's vapor and solid fractions, the event a leg ends on and
    its hazard flags), as HTML."""
    if report is None:
        return (
            "<div class='pp-h'>Crossings</div><div style='font-size:13px;color:#555'>"
            "Draw at least one leg to see where the route changes phase.</div>"
        )
    tl, pl, el = UNIT_LABELS[T_unit], UNIT_LABELS[p_unit], UNIT_LABELS[energy_unit]
    T_of = _affine_of(T_unit, "K", "temperature")
    p_of = _affine_of(p_unit, "Pa", "pressure")
    e_of = _affine_of(energy_unit, "J/kg", "energy")
    out = ["<div class='pp-h'>Crossings</div>"]
    if report.crossings:
        out.append(
            "<table class='pp-table pp-crossings'><tr><th>leg</th><th>transition</th>"
            f"<th>from → to</th><th>T [{tl}]</th><th>p [{pl}]</th>"
            f"<th>latent heat [{el}]</th><th>what happens</th><th>hazards</th></tr>"
        )
        for k, c in enumerate(report.crossings):
            T, p = T_of(c.T), p_of(c.p)
            L = "—" if c.latent_heat is None else f"{e_of(c.latent_heat):.4g}"
            tip = html.escape(
                crossing_tip(c, T_unit, p_unit, energy_unit)
                + (f" ({c.latent_heat_note})" if c.latent_heat_note else ""),
                quote=True,
            )
            frm = c.from_phase + (f" ({c.from_form})" if c.from_form else "")
            to = c.to_phase + (f" ({c.to_form})" if c.to_form else "")
            detail = getattr(c, "detail", "") or ""
            out.append(
                f"<tr class='pp-crossing' data-index='{k}' data-leg='{c.step}' "
                f"data-kind='{html.escape(c.kind)}' data-t='{T:.6g}' data-p='{p:.6g}' "
                f"title='{tip}'><td class='num'>{c.step}</td><td>{html.escape(c.kind)}</td>"
                f"<td>{html.escape(frm)} → {html.escape(to)}</td><td class='num'>{T:.2f}</td>"
                f"<td class='num'>{p:.5g}</td><td class='num'>{L}</td>"
                f"<td class='pp-detail'>{html.escape(detail)}</td>{_hazard_cell(c)}</tr>"
            )
        out.append("</table>")
    else:
        out.append("<div style='font-size:13px;color:#555'>No phase boundary is crossed.</div>")
    out.append(
        "<div class='pp-h'>Heat and work per leg</div>"
        "<table class='pp-table pp-legsum'><tr><th>leg</th><th>kind</th><th>ends</th>"
        "<th>start → end phase</th><th>vapor fraction at end</th><th>solid fraction at end</th>"
        f"<th>heat in [{el}]</th><th>work in [{el}]</th><th>hazards</th><th>basis</th></tr>"
    )

    def e(v: float | None) -> str:
        return "—" if v is None else f"{e_of(v):.4g}"

    for leg in report.legs:
        tip = html.escape(
            f"leg {leg.step} ({leg.kind}): {T_of(leg.start.T):.2f} → {T_of(leg.end.T):.2f} {tl}, "
            f"{p_of(leg.start.p):.5g} → {p_of(leg.end.p):.5g} {pl}",
            quote=True,
        )
        event = getattr(leg, "event", "") or ""
        out.append(
            f"<tr class='pp-leg' data-leg='{leg.step}' title='{tip}'><td class='num'>{leg.step}"
            f"</td><td>{_KIND_TEXT.get(leg.kind, leg.kind)}</td>"
            f"<td class='pp-event'>{html.escape(event) if event else 'at target'}</td>"
            f"<td>{html.escape(_phase(leg.start))} → {html.escape(_phase(leg.end))}</td>"
            f"<td class='num pp-xv'>{_fraction(leg.end.vapor_fraction)}</td>"
            f"<td class='num pp-xs'>{_fraction(leg.end.solid_fraction)}</td>"
            f"<td class='num'>{e(leg.heat)}</td>"
            f"<td class='num'>{e(leg.work)}</td>{_hazard_cell(leg)}"
            f"<td style='font-size:11px;color:#555'>"
            f"{html.escape(leg.note)}</td></tr>"
        )
    out.append(
        "</table><div style='font-size:11px;color:#555'>Reversible steady flow per kg: "
        "heat = ∫T ds, work = ∫v dp, heat + work = Δh. Fractions are by mass (lever rule); "
        "— for a single phase.</div>"
    )
    return "".join(out)


def _affine_of(unit: str, si: str, dimension: str) -> Callable[[float], float]:
    """SI -> display unit as a plain affine function (one unit conversion per table)."""
    a = convert(0.0, si, unit, dimension)
    b = convert(1.0, si, unit, dimension) - a
    return lambda x: a + b * x


def _phase(state: object) -> str:
    phase = state.phase  # type: ignore[attr-defined]
    form = state.form  # type: ignore[attr-defined]
    return f"{phase} (ice {form})" if form else phase


def _fraction(x: float | None) -> str:
    return "—" if x is None else f"{x:.3f}"


def _hazard_cell(item: object) -> str:
    """The hazard flags of a leg or a crossing: their kinds, the reasons in the tooltip."""
    hazards = list(getattr(item, "hazards", ()) or ())
    if not hazards:
        return "<td class='pp-hazards'></td>"
    tip = html.escape(" ".join(f"{h.kind}: {h.reason}." for h in hazards), quote=True)
    kinds = html.escape(", ".join(dict.fromkeys(h.kind for h in hazards)))
    return (
        f"<td class='pp-hazards' title='{tip}' style='color:#9a3412;font-weight:600'>⚠ {kinds}</td>"
    )


def cautions_html(
    sub: Substance, corners: list[tuple[float, float]], report: Report | None = None
) -> str:
    """Plain cautions: the core's hazard flags on the route, then the substance and the
    conditions the route reaches."""
    items: list[str] = []
    if report is not None:
        seen: set[str] = set()
        for h in [h for leg in report.legs for h in getattr(leg, "hazards", ())] + [
            h for c in report.crossings for h in getattr(c, "hazards", ())
        ]:
            # deduplicated by sentence: the flags share their closing sentence
            for sentence in re.split(r"(?<=\.)\s+", h.caution or ""):
                if sentence and sentence not in seen:
                    seen.add(sentence)
                    items.append(sentence)
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
