"""What each view draws of the route: its corners, its path and its crossings as SI points of
the view (no widget library here).

On P–T the corners are (T, p) and the path the core's drawn line; on p–h and T–s the corners are
the states at the corners (a corner whose state has no h or s is not drawn there), the path the
states along the route, and a crossing sits at the first state of the path at its T and p: the
side the route comes from (a bubble point on the saturated-liquid line).
"""

from __future__ import annotations

from collections.abc import Sequence
from dataclasses import dataclass, field

import numpy as np

from ..paths import as_arrays, view_arrays
from ..records import Crossing, StatePoint
from ..report import Report
from ..route import Route
from ..views import coordinates

__all__ = ["Shape", "view_shape", "corner_states"]

_EMPTY = np.array([], dtype=float)


@dataclass
class Shape:
    """The route in one view (SI): corner points (None where not drawn), the path's arrays,
    crossing points and the crossings they show."""

    corners: list[tuple[float, float] | None]
    line: tuple[np.ndarray, np.ndarray]
    crossings: list[tuple[float, float]] = field(default_factory=list)
    records: list[Crossing] = field(default_factory=list)


def view_shape(
    view: str,
    corners: Sequence[tuple[float, float]],
    states: Sequence[StatePoint | None],
    path: Sequence[StatePoint],
    line_pT: Sequence[tuple[float, float]],
    report: Report | None,
) -> Shape:
    """The route in ``view``. Without a report: on P–T the corners joined by straight lines (a
    sketch, also of a drawing the core refused); on p–h and T–s the corners whose states are
    known (a start alone)."""
    if view == "pT":
        if report is None:
            return Shape(list(corners), as_arrays(list(corners)))
        return Shape(
            list(corners),
            as_arrays(list(line_pT)),
            [(c.T, c.p) for c in report.crossings],
            list(report.crossings),
        )
    shown = [coordinates(st, view) if st is not None else None for st in states]
    if report is None:  # a start alone, or a drawing the core refused (no states then)
        return Shape(shown, (_EMPTY, _EMPTY))
    out = Shape(shown, view_arrays(list(path), view))
    for c in report.crossings:
        xy = crossing_xy(path, c, view)
        if xy is not None:
            out.crossings.append(xy)
            out.records.append(c)
    return out


def crossing_xy(path: Sequence[StatePoint], c: Crossing, view: str) -> tuple[float, float] | None:
    """Where a crossing sits in a view: the first state of the path at its T and p."""
    for st in path:
        if abs(st.T - c.T) <= 1e-9 * c.T and abs(st.p - c.p) <= 1e-9 * c.p:
            return coordinates(st, view)
    return None


def corner_states(route: Route | None, report: Report | None) -> list[StatePoint | None]:
    """The state at each corner: the start and every leg's end (a curved or event-ended leg's
    own end state, such as a valve's outlet; else the state the next leg starts from); only
    the start's without legs."""
    if report is not None:
        out: list[StatePoint | None] = [report.legs[0].start]
        for k, leg in enumerate(report.legs):  # a curved leg's own end (a valve's outlet)
            own = route.legs[k].state if route is not None and k < len(route.legs) else None
            out.append(own if own is not None and own.h is not None else leg.end)
        return out
    if route is not None:
        try:
            return [route.end_state()]
        except Exception:  # noqa: BLE001 - a start no model covers has no state to show
            return [None]
    return []
