"""Round values for clicks: a click lands on the roundest value within a few pixels of where it
was made (no widget library here).

On a linear axis the candidates are the multiples of 1, 2 and 5 times a power of ten, the
coarsest that has a multiple within reach winning (20 °C before 21 °C before 21.5 °C). On a
logarithmic axis the special values come first (1 atm, the site's ambient pressure), then the
powers of ten, then 2 and 5 times them, then one, two and three significant digits (5 bar, 40 bar,
1.2 bar). "Within reach" is :data:`REACH_PX` pixels at the current zoom, so zooming in gives finer
values. Holding a modifier key sends the click's own value instead (at drawing precision).

>>> snap_linear(21.3, per_pixel=0.5)
(20.0, '20')
>>> snap_linear(21.3, per_pixel=0.05)
(21.5, '21.5')
>>> snap_log(0.979, per_pixel=0.01, specials=[(1.01325, "1 atm")])
(1.01325, '1 atm')
>>> snap_log(5.3, per_pixel=0.01)
(5.0, '5')
>>> snap_log(43.0, per_pixel=0.004)
(43.0, '43')
"""

from __future__ import annotations

import math
from collections.abc import Sequence

__all__ = ["snap_linear", "snap_log", "REACH_PX"]

#: How far (in pixels) a click is pulled to a round value.
REACH_PX = 4.0
_FAMILIES = (
    (1,),
    (1, 2, 5),
    tuple(range(1, 10)),
    tuple(range(10, 100)),
    tuple(range(100, 1000)),
)


def _text(v: float, decimals: int) -> str:
    text = f"{v:.{max(decimals, 0)}f}"
    return "0" if float(text) == 0.0 else text


def snap_linear(x: float, per_pixel: float, reach: float = REACH_PX) -> tuple[float, str]:
    """The roundest value within ``reach`` pixels of x on a linear axis, and its text."""
    tol = abs(per_pixel) * reach
    if not (math.isfinite(x) and math.isfinite(tol) and tol > 0):
        return x, repr(x)
    top = math.floor(math.log10(max(abs(x), tol))) + 1
    for k in range(top, math.floor(math.log10(tol)) - 2, -1):
        for m in (5, 2, 1):
            step = m * 10.0**k
            v = round(x / step) * step
            if abs(v - x) <= tol:
                decimals = -k if k < 0 else 0
                return round(v, decimals), _text(v, decimals)
    return x, repr(x)  # pragma: no cover - a step of at most 2 tol always has a multiple in reach


def snap_log(
    y: float,
    per_pixel: float,
    specials: Sequence[tuple[float, str]] = (),
    reach: float = REACH_PX,
) -> tuple[float, str]:
    """The roundest value within ``reach`` pixels of y on a log axis (``per_pixel`` in decades
    per pixel), and its text; a special value (with its own text) wins when within reach."""
    tol = abs(per_pixel) * reach
    if not (y > 0 and math.isfinite(y) and math.isfinite(tol) and tol > 0):
        return y, repr(y)
    ly = math.log10(y)
    near = [(abs(math.log10(v) - ly), v, text) for v, text in specials if v > 0]
    near = [c for c in near if c[0] <= tol]
    if near:
        _, v, text = min(near)
        return v, text
    k0 = math.floor(ly)
    for family in _FAMILIES:
        digits = len(str(family[0]))
        best: tuple[float, float, int] | None = None
        for k in (k0 - 1, k0, k0 + 1):
            for m in family:
                e = k - digits + 1
                v = m * 10.0**e
                d = abs(math.log10(v) - ly)
                if d <= tol and (best is None or d < best[0]):
                    best = (d, v, -e)
        if best is not None:
            _, v, decimals = best
            return round(v, max(decimals, 0)), _text(v, decimals)
    digits = max(0, 3 - k0)
    return round(y, digits), _text(y, digits)
