"""Where to write region names so that they sit inside their region and inside the plot
(no widget library here).

The visible window is covered by a grid; each cell is given the region it lies in (by the
caller: the core's phase of the cell's centre on P–T, the dome and solid lines on p–h and T–s).
Each region's name goes at the cell farthest from any other region and from the window's edges,
if that cell has room for it (:data:`ROOM` cells); a region with less room is not labelled.

>>> grid = [["a", "a", "a", "b"], ["a", "a", "a", "b"], ["a", "a", "a", "b"]]
>>> spots = label_spots(grid, room=0.5)
>>> spots["a"][:2], "b" in spots
((1, 1), False)
"""

from __future__ import annotations

import math
from collections.abc import Callable, Sequence

import numpy as np

__all__ = ["label_spots", "grid_points", "ROOM"]

#: The least distance (in cells; horizontal cells count half) from other regions and the edges
#: that a label needs.
ROOM = 1.0


def label_spots(
    grid: Sequence[Sequence[str | None]], room: float = ROOM
) -> dict[str, tuple[int, int, float]]:
    """{region: (row, column, room)} of the best cell of each region; None cells belong to no
    region (outside the models) and are never labelled."""
    keys = np.array([[k or "" for k in row] for row in grid], dtype=object)
    ny, nx = keys.shape
    rows, cols = np.mgrid[0:ny, 0:nx]
    out: dict[str, tuple[int, int, float]] = {}
    for key in sorted({k for k in keys.ravel() if k}):
        inside = keys == key
        other = ~inside
        oy, ox = rows[other], cols[other]
        best: tuple[float, int, int] | None = None
        for i, j in zip(rows[inside], cols[inside], strict=True):
            # labels are wide: horizontal distances count at half their length
            d = min(i + 0.5, ny - 0.5 - i, (j + 0.5) * 0.5, (nx - 0.5 - j) * 0.5)
            if len(oy):
                d = min(d, float(np.min(np.hypot(oy - i, (ox - j) * 0.5))))
            if best is None or d > best[0]:
                best = (d, int(i), int(j))
        if best is not None and best[0] >= room:
            out[key] = (best[1], best[2], float(best[0]))
    return out


def grid_points(
    window: tuple[float, float, float, float], nx: int, ny: int, log_y: bool
) -> tuple[np.ndarray, np.ndarray]:
    """Cell centres (x of each column, y of each row, the first row at the top) of a window
    (x0, x1, y0, y1)."""
    x0, x1, y0, y1 = window
    xs = x0 + (np.arange(nx) + 0.5) / nx * (x1 - x0)
    v = 1.0 - (np.arange(ny) + 0.5) / ny
    if log_y:
        ys = 10 ** (math.log10(y0) + v * (math.log10(y1) - math.log10(y0)))
    else:
        ys = y0 + v * (y1 - y0)
    return xs, ys


def classify_grid(
    region: Callable[[float, float], str | None], xs: np.ndarray, ys: np.ndarray
) -> list[list[str | None]]:
    """The region of every cell, rows from the top."""
    return [[region(float(x), float(y)) for x in xs] for y in ys]
