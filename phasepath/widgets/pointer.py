"""The page's pointer in the planner's three views: clicks, drags, hovering and the readout.

Every click reaches Python as its own message with its pixel (through ipyevents), and messages
are handled in the order they were sent, so no click is lost however fast they come, and none is
drawn before the core has taken it: a click the core refuses leaves nothing on the diagram. A
click outside the plot area, or one whose position is not a finite number, does nothing. A click
on (or within a few pixels of) a corner selects that corner in every view. Otherwise the click
snaps to a round value at the current zoom (:mod:`.snap`) unless Shift or Alt is held, and
becomes the next corner (:mod:`.clicks`). A drag of a corner in any view moves it in all.
"""

from __future__ import annotations

import html
import math
from typing import TYPE_CHECKING, Any

from ..correlations.atmosphere import ambient_pressure
from ..errors import PhasePathError
from ..units import STANDARD_ATMOSPHERE, convert
from ..views import AXES, state_at
from . import clicks, drawing, events
from .coords import event_pixel, from_view, unit_of
from .host import PlannerHost
from .readout import coordinate_text, in_display_units, state_text
from .snap import snap_linear, snap_log

if TYPE_CHECKING:  # pragma: no cover
    from .canvas import ViewCanvas

__all__ = ["PointerEvents", "SELECT_PX"]

#: A click this close to a corner (pixels) selects it instead of adding one.
SELECT_PX = 8.0
_FREE = ("shiftKey", "altKey", "ctrlKey", "metaKey")


class PointerEvents(PlannerHost):
    """The planner's handlers of the page's pointer events (mixed into RoutePlanner)."""

    canvases: dict[str, ViewCanvas]
    mode: str
    leg_kind: str
    _sub: Any
    _corners: list[tuple[float, float]]
    _states: list[Any]
    _view_crossings: dict[str, list[Any]]

    if TYPE_CHECKING:  # pragma: no cover - provided by the planner

        def select(self, index: int | None) -> None: ...
        def _add(self, T_text: str, p_text: str, kind: str | None) -> str: ...
        def _move(
            self,
            index: int,
            T_text: str | None = None,
            p_text: str | None = None,
            keep_fields: bool = False,
        ) -> str: ...
        def _redraw(self) -> None: ...

        selected: int | None

    def _connect_pointer(self) -> None:
        for view, c in self.canvases.items():
            c.on_click = self._page_click
            c.on_move = self._page_move
            c.on_drag_end = self._page_drag_end
            c.on_drag = self._page_drag
            c.corners.on_hover(lambda _m, e, v=view: self._hover_corner(v, e))

    # -- clicks ------------------------------------------------------------------------------
    def _page_click(self, view: str, event: dict[str, Any]) -> None:
        """A click on a view: select the corner under it, or add the next corner."""
        if self.mode != "draw":
            return
        canvas = self.canvases[view]
        got = canvas.event_point(event)
        px = event_pixel(event)
        if got is None or px is None:
            return  # outside the plot area, or no finite position: nothing happens
        frame, x, y = got
        hit = canvas.nearest_corner(frame, px[0], px[1], SELECT_PX)
        if hit is not None:
            self.select(hit)
            return
        free = any(bool(event.get(k)) for k in _FREE)
        try:
            typed, si = self._snapped(view, frame, x, y, free)
            if self._spec["start"] is None or not self._corners:
                edit = clicks.click_edit(view, "isobar", self._sub, si, typed, None, self.units)
                if "density" in edit:
                    self._commit(drawing.copy_with_start(self._spec, **edit))
                else:
                    self._add(edit["T"], edit["p"], "isobar")
                return
            kind = self.leg_kind
            if kind == "auto":
                last = self._last_pixel(view, frame)
                kind = clicks.auto_kind(view, last, px)
            prev = self._states[-1] if self._states else None
            if prev is None:
                raise PhasePathError("the last corner has no state yet: fix the route first")
            edit = clicks.click_edit(view, kind, self._sub, si, typed, prev, self.units)
        except PhasePathError as exc:
            self._say(str(exc))
            return
        self._add(edit["T"], edit["p"], kind)

    def _snapped(
        self, view: str, frame: Any, x: float, y: float, free: bool
    ) -> tuple[dict[str, str], tuple[float, float]]:
        """The click's axis values as typed text (snapped unless ``free``) and its SI point."""
        per_x, per_y = frame.per_pixel()
        qx, qy = AXES[view]
        values = []
        typed: dict[str, str] = {}
        for q, v, per in ((qx, x, per_x), (qy, y, per_y)):
            unit = unit_of(q, self.units)
            if free:
                sv, text = v, ""
            elif q == "p":
                sv, text = snap_log(v, per, self._specials(unit))
            else:
                sv, text = snap_linear(v, per)
            values.append(sv)
            if q in ("T", "p"):
                if text.endswith("atm") or text == "ambient":
                    typed[q] = text
                elif text:
                    typed[q] = f"{text} {unit}"
        si = from_view(view, values[0], values[1], self.units)
        if free:
            typed.update(clicks.point_texts(view, *si, self.units))
        return typed, si

    def _specials(self, p_unit: str) -> list[tuple[float, str]]:
        """Pressures a click snaps to first: 1 atm, and the site's ambient pressure."""
        out = [(convert(STANDARD_ATMOSPHERE, "Pa", p_unit, "pressure"), "1 atm")]
        elevation = self._spec.get("elevation")
        if elevation is not None:
            try:
                out.insert(
                    0, (convert(ambient_pressure(elevation), "Pa", p_unit, "pressure"), "ambient")
                )
            except PhasePathError:
                pass
        return out

    def _last_pixel(self, view: str, frame: Any) -> tuple[float, float] | None:
        drawn = self.canvases[view].drawn
        if not drawn or not all(math.isfinite(v) for v in drawn[-1]):
            return None
        if self.canvases[view].log_y and drawn[-1][1] <= 0:
            return None
        return frame.pixel(float(drawn[-1][0]), float(drawn[-1][1]))

    # -- drags -------------------------------------------------------------------------------
    def _page_drag_end(self, view: str, event: dict[str, Any]) -> None:
        """A corner dropped in a view: move it in the drawing (every view follows)."""
        canvas = self.canvases[view]
        try:
            k = int(event["index"])
            x, y = float(event["point"]["x"]), float(event["point"]["y"])
        except (KeyError, TypeError, ValueError):
            self._redraw()
            return
        i = canvas.corner_of_mark(k)
        if i is None or not (math.isfinite(x) and math.isfinite(y)):
            self._redraw()  # a point from the page that is no corner: put the marks back
            return
        drawn = canvas.drawn  # where this view drew the corner (the page has moved its mark)
        if k < len(drawn) and _same(drawn[k][0], x) and _same(drawn[k][1], y):
            self.select(i)  # pressed and released without moving: a selection
            return
        try:
            si = from_view(view, x, y, self.units)
            edit = clicks.drag_edit(view, self._sub, si, i == 0, self.units)
        except PhasePathError as exc:
            self._say(str(exc))
            self._redraw()
            return
        with self._quiet():  # the selection is drawn with the moved route: one redraw
            self.selected = i
        if "density" in edit:
            self._commit(drawing.copy_with_start(self._spec, **edit))
            return
        self._move(i, edit["T"], edit["p"])

    def _page_drag(self, view: str, event: dict[str, Any]) -> None:
        """While a corner is dragged: only that view's line moves, straight between the corners
        (no analysis; the true path is drawn when the drag ends)."""
        try:
            k = int(event["index"])
            x, y = float(event["point"]["x"]), float(event["point"]["y"])
        except (KeyError, TypeError, ValueError):
            return
        canvas = self.canvases[view]
        i = canvas.corner_of_mark(k)
        if i is not None and math.isfinite(x) and math.isfinite(y):
            canvas.preview(i, x, y)

    # -- the readout ---------------------------------------------------------------------------
    def _page_move(self, view: str, event: dict[str, Any]) -> None:
        """The pointer moved over a view (throttled by the page): the state under it."""
        canvas = self.canvases[view]
        got = canvas.event_point(event)
        if got is None:
            canvas.show_readout("")
            return
        _, x, y = got
        si = from_view(view, x, y, self.units)
        canvas.show_readout(html.escape(self.readout_text(view, *si)))

    def readout_text(self, view: str, x: float, y: float) -> str:
        """The readout at a point of a view (SI): the state the core finds there."""
        where = coordinate_text(view, x, y, self.units)
        try:
            st = state_at(self._sub, view, x, y)
        except PhasePathError as exc:
            return f"{where}: {in_display_units(_first(str(exc)), self.units)}"
        return state_text(st, self.units)

    def _hover_corner(self, view: str, event: dict[str, Any]) -> None:
        canvas = self.canvases[view]
        k = events.event_index(event)
        i = canvas.corner_of_mark(k) if k is not None else None
        if i is None or i >= len(self._states):
            return
        st = self._states[i]
        body = html.escape(state_text(st, self.units)) if st is not None else ""
        canvas.corners.tooltip.value = (
            f"<div class='pp-tip'><b>corner {'S' if i == 0 else i}</b><br>{body}</div>"
        )


def _same(a: float, b: float) -> bool:
    return math.isclose(float(a), float(b), rel_tol=1e-9, abs_tol=1e-12)


def _first(text: str, limit: int = 140) -> str:
    return text if len(text) <= limit else text[: limit - 1] + "…"
