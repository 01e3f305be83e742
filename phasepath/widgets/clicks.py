"""What a click or a drag in any of the three views means for the drawing: pure functions, no
widget library.

A click gives a point of its view in display units. On P–T it is a temperature and a pressure;
on p–h and T–s the core finds the state there (:func:`phasepath.views.state_at`), and the leg's
kind decides what is held: an isobar drawn on p–h keeps the previous corner's pressure and ends
at the temperature where the clicked enthalpy is reached at that pressure; an isotherm drawn on
T–s keeps the temperature and ends at the pressure of the clicked entropy; a constant-entropy leg
drawn on T–s keeps the entropy and ends at the pressure where it reaches the clicked
temperature; a constant-enthalpy leg drawn on p–h ends at the clicked pressure. A start placed
inside a two-phase region is given by its density (the state's own), since a temperature and a
pressure on a boundary do not fix it.

>>> auto_kind("ph", (100.0, 200.0), (180.0, 195.0)), auto_kind("ph", (100.0, 200.0), (102.0, 90.0))
('isobar', 'isenthalp')
>>> auto_kind("Ts", (100.0, 200.0), (102.0, 90.0)), auto_kind("pT", None, (1.0, 2.0))
('isentrope', 'isobar')
"""

from __future__ import annotations

import math
from typing import Any

from .. import format as F
from ..errors import RouteError
from ..format import DisplayUnits
from ..records import LEG_KINDS, StatePoint
from ..substances import Substance
from ..views import state_at
from .drawing import text

__all__ = ["auto_kind", "click_edit", "drag_edit", "point_texts"]

#: The kind "auto" gives for a click mostly across (first) or mostly up or down (second) on
#: the screen, in each view: the legs that run straight there.
AUTO = {
    "pT": ("isobar", "isotherm"),
    "ph": ("isobar", "isenthalp"),
    "Ts": ("isotherm", "isentrope"),
}


def auto_kind(view: str, last: tuple[float, float] | None, new: tuple[float, float]) -> str:
    """The straight kind of the view whose leg runs closer to the click's direction on screen
    (pixels), from the last corner to the click."""
    across, updown = AUTO[view]
    if last is None:
        return across
    dx, dy = abs(new[0] - last[0]), abs(new[1] - last[1])
    return updown if dy > dx else across


def point_texts(view: str, x: float, y: float, units: DisplayUnits) -> dict[str, str]:
    """The typed text of a point's own axes at drawing precision (T 0.1 degree, p four
    significant digits), keyed by quantity ("T", "p")."""
    from ..views import AXES

    out = {}
    for q, v in zip(AXES[view], (x, y), strict=True):
        if q == "T":
            out["T"] = text(v, "temperature", units.T)
        elif q == "p":
            out["p"] = text(v, "pressure", units.p)
    return out


def _start_of(st: StatePoint, units: DisplayUnits, p_text: str | None) -> dict[str, Any]:
    """A start at a state: T and p, or T and density inside a two-phase region."""
    if "+" in st.phase:
        if st.rho is None:
            raise RouteError(f"no model gives the density of {st.text}: place the start elsewhere")
        return {
            "T": text(st.T, "temperature", units.T),
            "density": f"{F.significant(st.rho)} kg/m3",
        }
    return {"T": text(st.T, "temperature", units.T), "p": p_text or text(st.p, "pressure", units.p)}


def click_edit(
    view: str,
    kind: str,
    sub: Substance,
    si: tuple[float, float],
    typed: dict[str, str],
    prev: StatePoint | None,
    units: DisplayUnits,
) -> dict[str, Any]:
    """What a click at ``si`` (the view's SI point) adds: ``{"T": ..., "p": ...}`` texts for the
    next corner (the leg of ``kind`` takes the one it moves along), or the start (``T`` and
    ``p``, or ``T`` and ``density``) when ``prev`` is None. ``typed`` holds the click's own
    axis values as typed text (snapped), keyed "T" and "p" where the view has them."""
    x, y = si
    if view == "pT":
        return {"T": typed["T"], "p": typed["p"]} if prev is not None else _pt_start(typed)
    if prev is None:
        st = state_at(sub, view, x, y)
        return _start_of(st, units, typed.get("p"))
    moves = LEG_KINDS[kind].moves
    if view == "ph":
        h, p = x, y
        if moves == "p":  # the leg takes only the pressure
            return {"T": "", "p": typed["p"]}
        held_p = prev.p if LEG_KINDS[kind].held == "p" else p
        st = state_at(sub, "ph", h, held_p)
        return {"T": text(st.T, "temperature", units.T), "p": text(held_p, "pressure", units.p)}
    s, T = x, y  # Ts
    if moves == "T":
        return {"T": typed["T"], "p": text(prev.p, "pressure", units.p)}
    held = LEG_KINDS[kind].held
    if held == "T":
        st = state_at(sub, "Ts", s, prev.T)
    elif held == "s":
        if prev.s is None:
            raise RouteError(f"no model gives the entropy of the last corner ({prev.text})")
        st = state_at(sub, "Ts", prev.s, T)
    else:
        st = state_at(sub, "Ts", s, T)
    return {"T": text(st.T, "temperature", units.T), "p": text(st.p, "pressure", units.p)}


def _pt_start(typed: dict[str, str]) -> dict[str, Any]:
    return {"T": typed["T"], "p": typed["p"]}


def drag_edit(
    view: str, sub: Substance, si: tuple[float, float], start: bool, units: DisplayUnits
) -> dict[str, Any]:
    """Where a corner dragged to ``si`` (the view's SI point) goes: its T and p texts (a drag:
    each leg takes what its kind moves along), or, for the start inside a two-phase region, T
    and density."""
    x, y = si
    if not (math.isfinite(x) and math.isfinite(y)):
        raise RouteError(f"({x!r}, {y!r}) is not a point of the diagram")
    if view == "pT":
        return {"T": text(x, "temperature", units.T), "p": text(y, "pressure", units.p)}
    st = state_at(sub, view, x, y)
    if start:
        p_text = text(y, "pressure", units.p) if view == "ph" else None
        return _start_of(st, units, p_text)
    return {"T": text(st.T, "temperature", units.T), "p": text(st.p, "pressure", units.p)}
