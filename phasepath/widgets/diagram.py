"""The pressure–temperature diagram: temperature on a linear axis, pressure on a logarithmic one,
in the display units the planner is set to.

Its boundary curves come from :func:`phasepath.views.curves`; its region names (vapor, liquid,
supercritical, the solid or each of water's ices) are written where each region has room inside
the window, found from the core's phase of a grid of points (:mod:`.labels`). "fit" shows the
route and the fields of the solids it reaches (water's ices III, V and VI get room when the route
presses water that far). Below the triple point of a fluid with no published sublimation curve
the diagram says so in the strip there.
"""

from __future__ import annotations

import math
from collections.abc import Sequence
from typing import Any

import bqplot as bq
import numpy as np

from .. import format as F
from ..errors import PhasePathError
from ..format import DisplayUnits
from ..substances import NO_SUBLIMATION, Substance
from .canvas import STYLE, ViewCanvas

__all__ = ["PhaseDiagram", "STYLE", "anchors"]


class PhaseDiagram(ViewCanvas):
    """The bqplot figure of one substance's P–T diagram with a route drawn on it."""

    view = "pT"
    height = "460px"

    def __init__(
        self,
        T_unit: str | DisplayUnits = "degC",
        p_unit: str = "bar",
        energy_unit: str = "kJ/kg",
    ) -> None:
        units = (
            T_unit
            if isinstance(T_unit, DisplayUnits)
            else DisplayUnits(T_unit, p_unit, energy_unit)
        )
        super().__init__(units)
        sc = {"x": self.sx, "y": self.sy}
        empty = np.array([], dtype=float)
        self.strip_note = bq.Label(
            x=empty,
            y=empty,
            text=[],
            scales=sc,
            colors=[STYLE["region"]["color"]],
            default_size=12,
            font_unit="px",
            align="middle",
            rotate_angle=-90,
        )
        self.figure.marks = [self.strip_note, *self.figure.marks]

    def _marks(self) -> list[Any]:
        marks = super()._marks()
        note = getattr(self, "strip_note", None)
        return [note, *marks] if note is not None else marks

    @property
    def T_unit(self) -> str:
        return self.units.T

    @property
    def p_unit(self) -> str:
        return self.units.p

    def fmt_T(self, T: float) -> str:
        return F.quantity(T, "temperature", self.units.T)

    def fmt_p(self, p: float) -> str:
        return F.quantity(p, "pressure", self.units.p)

    # -- regions -------------------------------------------------------------------------------
    def region_of(self, x: float, y: float) -> str | None:
        sub = self.substance
        assert sub is not None
        try:
            phase, form = sub.classify(x, y)
        except PhasePathError:
            return None
        if phase == "solid":
            if form:
                return f"ICE {form}" if sub.solids.name == "ice" else f"SOLID {form}"
            return "SOLID"
        return phase.upper()

    def small_labels(
        self, grid: list[list[str | None]], xs: np.ndarray, ys: np.ndarray, spots: dict[str, Any]
    ) -> list[tuple[float, float, str]]:
        """A named solid (one of water's ices) whose field is too small for its name gets it
        beside the field, pointing at it ("◂ ICE III"), where the cells right of it are free."""
        out = []
        names = {k for row in grid for k in row if k and k not in spots and " " in k}
        ny, nx = len(grid), len(grid[0]) if grid else 0
        for name in sorted(names):
            rows = sorted({i for i in range(ny) for j in range(nx) if grid[i][j] == name})
            for i in rows:  # the first row whose cells right of the field are fluid
                j = max(j for j in range(nx) if grid[i][j] == name)
                beside = grid[i][j + 1 : j + 5]
                if len(beside) == 4 and all(k and " " not in k for k in beside):
                    out.append((float(xs[j + 2]), float(ys[i]), f"◂ {name}"))
                    break
        return out

    def redraw_static(self) -> None:
        super().redraw_static()
        sub = self.substance
        if sub is None:
            return
        window = self.window() or self.default_window()
        T_t = sub.triple[0]
        if sub.sublimation is None and math.isfinite(T_t) and T_t > window[0]:
            p_mid = 10 ** (0.5 * (math.log10(window[2]) + math.log10(window[3])))
            x, y = self.display([window[0] + 0.5 * (T_t - window[0])], [p_mid])
            text = [NO_SUBLIMATION]
        else:
            x = y = np.array([], dtype=float)
            text = []
        with self.strip_note.hold_sync():
            self.strip_note.x, self.strip_note.y, self.strip_note.text = x, y, text

    def widgets(self) -> list[Any]:
        return [*super().widgets(), self.strip_note]

    # -- window --------------------------------------------------------------------------------
    def default_window(self, sub: Substance | None = None) -> tuple[float, float, float, float]:
        """(T_lo, T_hi [K], p_lo, p_hi [Pa]) showing the triple and critical points with margin
        (a substance built from data may lack either: the curves' own ends stand in)."""
        sub = sub or self.substance
        assert sub is not None
        T_t, p_t, T_c, p_c = anchors(sub)
        span = T_c - T_t
        T_lo = max(sub.T_min, T_t - 0.3 * span)
        if sub.sublimation is None and math.isfinite(T_t):
            # show the strip below the triple point, labelled: no published sublimation curve
            T_lo = max(T_t - 0.12 * span, 1.0)
        T_hi = min(sub.T_max, T_c + 0.3 * span)
        p_lo = p_t / 30.0
        if sub.sublimation is not None and sub.sublimation.T_min <= T_lo <= sub.sublimation.T_max:
            p_lo = min(p_lo, sub.sublimation.p_of_T(T_lo) / 3.0)
        p_hi = min(sub.p_max, p_c * 30.0)
        if not T_hi > T_lo:
            T_lo, T_hi = T_lo - 10.0, T_hi + 10.0
        return T_lo, T_hi, max(p_lo, 1e-3), max(p_hi, 10 * max(p_lo, 1e-3))

    def fit_window(
        self,
        points: Sequence[tuple[float, float]],
        forms: Sequence[str] = (),
    ) -> tuple[float, float, float, float]:
        """The window that fits the route's points (T [K], p [Pa]) and the fields of the solid
        forms it reaches, with a margin; the default window without points."""
        sub = self.substance
        assert sub is not None
        pts = [(T, p) for T, p in points if math.isfinite(T) and math.isfinite(p) and p > 0]
        if not pts:
            return self.default_window()
        T_lo, T_hi, p_lo, p_hi = self.default_window()
        span = math.log10(p_hi / p_lo)
        small = []  # forms whose field would be a sliver of the default window
        for form in forms:
            field = _field(sub, form)
            if field:
                ps = [p for _, p in field]
                if math.log10(max(ps) / min(ps)) < 0.15 * span:
                    small.append(form)
                    pts += field
        forms = small
        Ts = [T for T, _ in pts]
        lps = [math.log10(p) for _, p in pts]
        a, b, c, d = min(Ts), max(Ts), min(lps), max(lps)
        if forms:  # the route and the fields of the solids it reaches, with room for them
            dT, dp = max(b - a, 20.0), max(d - c, 1.0)
            mid_T, mid_p = 0.5 * (a + b), 0.5 * (c + d)
            a, b = mid_T - 0.58 * dT, mid_T + 0.58 * dT
            c, d = mid_p - 0.6 * dp, mid_p + 0.6 * dp
            return max(a, 1e-3), b, 10**c, 10**d
        # else the default window, grown to hold the route with a margin
        dT = 0.06 * (max(b, T_hi) - min(a, T_lo))
        T_lo, T_hi = min(T_lo, a - dT), max(T_hi, b + dT)
        p_lo, p_hi = min(p_lo, 10**c / 2.0), max(p_hi, 10**d * 2.0)
        return max(T_lo, 1e-3), T_hi, p_lo, p_hi


def _field(sub: Substance, form: str) -> list[tuple[float, float]]:
    """Points that bound the field of a named solid form (the ends of its branches)."""
    out = []
    for b in sub.boundaries:
        if b.solid_form == form:
            for T in (b.T_min, b.T_max):
                try:
                    out.append((T, b.p_of_T(T)))
                except PhasePathError:
                    continue
    return out


def anchors(sub: Substance) -> tuple[float, float, float, float]:
    """(T_t, p_t, T_c, p_c) for placing the window: the triple and critical points, or, where a
    substance built from data lacks one, the low and high ends of its vapor-pressure curve (else
    of its temperature range)."""
    T_t, p_t = sub.triple
    T_c, p_c = sub.critical
    v = sub.vapor
    if not (math.isfinite(T_t) and math.isfinite(p_t) and p_t > 0):
        if v is not None:
            T_t, p_t = v.T_min, v.p_of_T(v.T_min)
        else:
            T_t, p_t = sub.T_min, 1e3
    if not (math.isfinite(T_c) and math.isfinite(p_c) and p_c > 0):
        if v is not None:
            T_c, p_c = v.T_max, v.p_of_T(v.T_max)
        else:
            T_c, p_c = sub.T_max, 1e7
    if not T_c > T_t:
        T_c = T_t + 1.0
    if not p_c > p_t:
        p_c = p_t * 10.0
    return T_t, p_t, T_c, p_c
