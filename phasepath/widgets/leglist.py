"""The leg list: every corner of the route with its T and p in the display units and its state
(phase, h, s, ρ, vapor or solid fraction), and a last row to type a new leg.

The fields always show the route being analysed. A value typed there goes to the planner, which
validates it through the core; a rejected value is shown beside its field, marked, with the
reason, until the next accepted edit (the field itself goes back to the analysed value), so
what the user typed is never lost and never mistaken for the route.
"""

from __future__ import annotations

import html
import math
from collections.abc import Callable, Sequence

import ipywidgets as W

from ..format import UNIT_LABELS, DisplayUnits
from ..records import LEG_KINDS, StatePoint
from ..units import convert
from .readout import minus, state_parts

__all__ = ["LegList"]

_BATCH = 8  # rows made at a time


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
    """One row per corner: index, the kind of the leg ending there, T and p fields, its state,
    delete; and a last row to type a new leg (kind, target, add).

    ``on_edit(index, coord, text)`` is called when a field is committed (Enter or leaving it),
    ``on_delete(index)`` when a row's delete button is pressed, ``on_add(kind, text)`` when a
    typed leg is added, ``on_select(index)`` when a row's label is clicked. Each edit returns an
    error message ("" when the edit was taken).
    """

    def __init__(
        self,
        on_edit: Callable[[int, str, str], str],
        on_delete: Callable[[int], str],
        on_add: Callable[[str, str], str] | None = None,
        on_select: Callable[[int], None] | None = None,
    ) -> None:
        self._on_edit, self._on_delete, self._on_add = on_edit, on_delete, on_add
        self._on_select = on_select
        self._rows: list[_Row] = []
        self._quiet = False
        self._units = DisplayUnits("degC", "bar", "kJ/kg")
        #: (index, coord) -> (the text the user typed, why it was refused)
        self.rejected: dict[tuple[int, str], tuple[str, str]] = {}
        self.header = W.HTML()
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
            lambda ch: setattr(self.add_target, "placeholder", _hint(ch["new"])), names="value"
        )
        self.add_btn.on_click(lambda _b: self._added())
        self.add_box = W.VBox(
            [
                W.HTML("<div style='font-size:12px;color:#555;margin-top:6px'>type a leg</div>"),
                W.HBox([self.add_kind, self.add_target, self.add_btn]),
                self.add_error,
            ]
        )
        self.empty = W.HTML(
            "<span style='font-size:12px;color:#555'>Click on any diagram to place the start, "
            "then click again for each leg, or type a start above.</span>"
        )
        super().__init__(children=[self.header], layout=W.Layout(min_width="340px"))
        self.add_class("pp-legs")

    def show(
        self,
        corners: Sequence[tuple[float, float]],
        kinds: Sequence[str],
        units: DisplayUnits,
        events: Sequence[str] | None = None,
        states: Sequence[StatePoint | None] | None = None,
        selected: int | None = None,
    ) -> None:
        """Write the corners (SI) into the rows in the display units, each with its state.
        ``events`` holds, per corner, the event its leg ends on ("" for a leg that ends at its
        target)."""
        self._units = units
        Tl, pl = UNIT_LABELS[units.T], UNIT_LABELS[units.p]
        self.header.value = (
            "<div class='pp-h'>Legs</div><div style='font-size:12px;color:#555'>"
            f"corner · leg kind · T [{Tl}] · p [{pl}] · state</div>"
        )
        events = list(events or [""] * len(corners))
        states = list(states or [None] * len(corners))
        while len(self._rows) < len(corners):  # rows are made ahead, in batches, hidden:
            for _ in range(_BATCH):  # a new corner then shows a row instead of making one
                self._rows.append(_Row(len(self._rows), self))
        self.rejected = {k: v for k, v in self.rejected.items() if k[0] < len(corners)}
        self._shown: dict[tuple[int, str], str] = {}
        self._quiet = True
        try:
            for i, ((T, p), kind) in enumerate(zip(corners, kinds, strict=True)):
                row = self._rows[i]
                label = LEG_KINDS[kind].label if kind in LEG_KINDS else kind
                until = f"<br><span style='font-size:11px'>until {html.escape(events[i])}</span>"
                row.label.value = f"<b>{'S' if i == 0 else i}</b> {label}" + (
                    until if events[i] else ""
                )
                row.T.value = _num(convert(T, "K", units.T, "temperature"), "T")
                row.p.value = _num(convert(p, "Pa", units.p, "pressure"), "p")
                self._shown[(i, "T")], self._shown[(i, "p")] = row.T.value, row.p.value
                targets = LEG_KINDS[kind].targets if kind in LEG_KINDS else ("T", "p")
                row.T.disabled = "T" not in targets  # the leg holds T, or T follows from the EOS
                row.p.disabled = "p" not in targets
                row.state.value = _state_html(states[i], units)
                self._mark(i)
                if selected == i:
                    row.box.add_class("pp-selected")
                else:
                    row.box.remove_class("pp-selected")
        finally:
            self._quiet = False
        for k, r in enumerate(self._rows):
            display = None if k < len(corners) else "none"
            if r.box.layout.display != display:
                r.box.layout.display = display
        self.empty.layout.display = "none" if corners else None
        self.add_box.layout.display = None if corners else "none"
        children = [self.header, self.empty, *(r.box for r in self._rows), self.add_box]
        shown: list[W.Widget] = list(getattr(self, "children", ()))
        if shown != children:
            self.children = children

    def _mark(self, i: int) -> None:
        """Show the rejected entries of row i beside its fields, marked, with the reason."""
        row = self._rows[i]
        notes = []
        for coord, field in (("T", row.T), ("p", row.p)):
            if (i, coord) in self.rejected:
                typed, why = self.rejected[(i, coord)]
                field.add_class("pp-rejected")
                notes.append(
                    f"<span class='pp-err'>⚠ <span class='pp-typed'>{html.escape(typed)}</span> "
                    f"({coord}) was not taken: {html.escape(why)}; the route keeps "
                    f"{html.escape(field.value)}</span>"
                )
            else:
                field.remove_class("pp-rejected")
        row.error.value = "<br>".join(notes)

    def reject(self, index: int, coord: str, typed: str, why: str) -> None:
        """Mark what the user typed in a field as refused (shown until the next accepted edit)."""
        self.rejected[(index, coord)] = (typed, why)
        if 0 <= index < len(self._rows):
            self._mark(index)

    def clear_rejections(self) -> None:
        self.rejected.clear()
        for i in range(len(self._rows)):
            self._mark(i)

    def row_error(self, index: int, message: str) -> None:
        if 0 <= index < len(self._rows):
            self._rows[index].error.value = (
                f"<span class='pp-err'>⚠ {html.escape(message)}</span>" if message else ""
            )

    @property
    def rows(self) -> list[_Row]:
        """The rows in use (for tests)."""
        return [r for r in self._rows if r.box.layout.display != "none"]

    def _edited(self, index: int, coord: str, typed: str) -> None:
        if self._quiet:
            return
        msg = self._on_edit(index, coord, typed)
        if msg:  # the field goes back to the route's value; what was typed shows beside it
            row = self._rows[index]
            field = row.T if coord == "T" else row.p
            shown = getattr(self, "_shown", {}).get((index, coord))
            if shown is not None and field.value != shown:
                self._quiet = True
                try:
                    field.value = shown
                finally:
                    self._quiet = False
            self.reject(index, coord, typed, msg)

    def _deleted(self, index: int) -> None:
        msg = self._on_delete(index)
        if msg:
            self.row_error(index, msg)

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
        self.label = W.HTML(layout=W.Layout(width="112px"))
        self.pick = W.Button(
            icon="crosshairs",
            tooltip=f"show corner {index or 'S'} in every view",
            layout=W.Layout(width="30px"),
        )
        self.T = W.Text(continuous_update=False, layout=W.Layout(width="88px"))
        self.p = W.Text(continuous_update=False, layout=W.Layout(width="88px"))
        self.delete = W.Button(
            icon="trash", tooltip=f"delete corner {index or 'S'}", layout=W.Layout(width="32px")
        )
        self.state = W.HTML(layout=W.Layout(margin="0 0 0 4px"))
        self.error = W.HTML()
        self.T.observe(lambda ch: owner._edited(index, "T", ch["new"]), names="value")
        self.p.observe(lambda ch: owner._edited(index, "p", ch["new"]), names="value")
        self.delete.on_click(lambda _b: owner._deleted(index))
        self.pick.on_click(lambda _b: owner._on_select and owner._on_select(index))
        self.box = W.VBox(
            [W.HBox([self.label, self.T, self.p, self.pick, self.delete]), self.state, self.error],
            layout=W.Layout(margin="0 0 3px 0"),
        )
        self.box.add_class("pp-row")


def _state_html(st: StatePoint | None, units: DisplayUnits) -> str:
    if st is None:
        return ""
    p = state_parts(st, units)
    bits = [html.escape(p["phase"])]
    for key, name in (("h", "h"), ("s", "s"), ("rho", "ρ")):
        bits.append(f"{name} {html.escape(p[key])}")
    bits += [html.escape(p[k]) for k in ("x", "solid") if k in p]
    return f"<div class='pp-state'>{' · '.join(bits)}</div>"


def _num(x: float, coord: str) -> str:
    if coord == "T":
        return minus(f"{x:.2f}") if x < 0 else f"{x:.2f}"
    if x == 0 or not math.isfinite(x):
        return f"{x}"
    digits = max(0, 4 - int(math.floor(math.log10(abs(x)))))
    return f"{x:.{digits}f}" if abs(x) < 1e7 else f"{x:.5g}"
