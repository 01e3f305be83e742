"""The pressure–enthalpy and temperature–entropy diagrams of a substance (its dome, triple-point
line and solid lines from :func:`phasepath.views.curves`), pressure on a logarithmic axis on
p–h, temperature linear on T–s.

Region names are placed from the lines themselves (inside the dome: liquid + vapor; left of it:
liquid; right: vapor; between the solid lines and the triple-point line: solid + vapor, solid +
liquid), then each chosen spot is checked against the core's state there
(:func:`phasepath.views.state_at`) and left out if the core disagrees.
"""

from __future__ import annotations

import math
from collections.abc import Sequence

import numpy as np

from ..errors import PhasePathError
from ..format import DisplayUnits
from ..substances import Substance
from ..views import ViewCurve, state_at
from .canvas import STYLE, ViewCanvas

__all__ = ["EnergyDiagram"]

_EXPECT = {
    "LIQUID": ("liquid",),
    "VAPOR": ("vapor",),
    "LIQUID + VAPOR": ("liquid+vapor",),
    "SOLID + VAPOR": ("solid+vapor",),
    "SOLID + LIQUID": ("solid+liquid", "solid+supercritical"),
    "SOLID": ("solid",),
    "SUPERCRITICAL": ("supercritical",),
}


class EnergyDiagram(ViewCanvas):
    """The p–h (``view="ph"``) or T–s (``view="Ts"``) figure of a substance and route."""

    height = "380px"

    def __init__(self, view: str, units: DisplayUnits) -> None:
        if view not in ("ph", "Ts"):
            raise ValueError(f"an energy diagram is 'ph' or 'Ts', not {view!r}")
        self.view = view
        super().__init__(units)
        self._shapes: dict[str, tuple[np.ndarray, np.ndarray]] = {}

    def curve_style(self, c: ViewCurve) -> tuple[str, str, float]:
        st = STYLE.get(c.kind, STYLE["vaporization"])
        if c.kind == "vaporization":
            return st["color"], "solid", 2.2
        if c.kind == "triple":
            return st["color"], "solid", 1.6
        # the solid side of a solid-fluid branch dashed, its fluid side solid and thin
        solid = c.label.startswith("solid side")
        return st["color"], "dashed" if solid else "solid", 1.8 if solid else 1.3

    def set_substance(self, sub: Substance) -> None:
        if sub is not self.substance:
            self._shapes = {}
        super().set_substance(sub)

    # -- window --------------------------------------------------------------------------------
    def default_window(self) -> tuple[float, float, float, float]:
        """The dome and the triple-point line with margin (on p–h pressure from a thirtieth of
        the triple-point pressure to thirty times the critical pressure)."""
        sub = self.substance
        assert sub is not None
        dome = [c for c in self._curves_si if c.kind in ("vaporization", "triple")]
        if not dome:
            return (-1e5, 1e6, 1e3, 1e7) if self.view == "ph" else (0.0, 5e3, 100.0, 500.0)
        xs = np.concatenate([c.x for c in dome])
        x0, x1 = float(np.nanmin(xs)), float(np.nanmax(xs))
        span = x1 - x0
        x0, x1 = x0 - 0.12 * span, x1 + 0.25 * span
        T_t, p_t = sub.triple
        T_c, p_c = sub.critical
        if self.view == "ph":
            return x0, x1, max(p_t / 30.0, 1e-3), min(sub.p_max, p_c * 30.0)
        dT = T_c - T_t
        return x0, x1, max(sub.T_min, T_t - 0.3 * dT), min(sub.T_max, T_c + 0.35 * dT)

    def fit_window(
        self, points: Sequence[tuple[float, float]]
    ) -> tuple[float, float, float, float]:
        """The default window grown (or narrowed) to the route's points, with a margin."""
        pts = [(x, y) for x, y in points if math.isfinite(x) and math.isfinite(y)]
        if self.log_y:
            pts = [(x, y) for x, y in pts if y > 0]
        base = self.default_window()
        if not pts:
            return base
        xs, ys = [x for x, _ in pts], [y for _, y in pts]
        a, b = min(xs + [base[0]]), max(xs + [base[1]])
        if self.log_y:
            c = min(math.log10(min(ys)) - 0.3, math.log10(base[2]))
            d = max(math.log10(max(ys)) + 0.3, math.log10(base[3]))
            return a, b, 10**c, 10**d
        dy = max(ys) - min(ys)
        return a, b, min(min(ys) - 0.08 * dy, base[2]), max(max(ys) + 0.08 * dy, base[3])

    # -- regions -------------------------------------------------------------------------------
    def label_grid(self) -> tuple[int, int]:
        return 20, 14

    def _shape(self, label: str) -> tuple[np.ndarray, np.ndarray] | None:
        if label not in self._shapes:
            for c in self._curves_si:
                if c.label == label:
                    order = np.argsort(c.y)
                    self._shapes[label] = (c.x[order], c.y[order])
        return self._shapes.get(label)

    def _x_on(self, label: str, y: float) -> float | None:
        """x of a boundary line at height y (interpolated; None outside its range)."""
        shape = self._shape(label)
        if shape is None or len(shape[1]) < 2:
            return None
        xs, ys = shape
        if not (ys[0] <= y <= ys[-1]):
            return None
        if self.log_y:
            return float(np.interp(math.log10(y), np.log10(ys), xs))
        return float(np.interp(y, ys, xs))

    def region_of(self, x: float, y: float) -> str | None:
        sub = self.substance
        assert sub is not None
        T_t, p_t = sub.triple
        T_c, p_c = sub.critical
        y_t, y_c = (p_t, p_c) if self.view == "ph" else (T_t, T_c)
        if y < y_t:
            solid = self._x_on("solid side of the sublimation branch", y)
            gas = self._x_on("fluid side of the sublimation branch", y)
            if gas is not None and x > gas:
                return "VAPOR"
            if solid is not None and gas is not None:
                return "SOLID + VAPOR" if x >= solid else "SOLID"
            return None
        if y >= y_c:
            return "SUPERCRITICAL" if self.view == "ph" else None
        liquid = self._x_on("saturated liquid", y)
        vapor = self._x_on("saturated vapor", y)
        if liquid is None or vapor is None:
            return None
        if x > vapor:
            return "VAPOR"
        if x >= liquid:
            return "LIQUID + VAPOR"
        melts = [c.label for c in self._curves_si if c.kind == "melting"]
        for lab in melts:
            if lab.startswith("fluid side"):
                edge = self._x_on(lab, y)
                solid_edge = self._x_on(lab.replace("fluid side", "solid side"), y)
                if edge is not None and x < edge:
                    return (
                        "SOLID" if solid_edge is not None and x < solid_edge else "SOLID + LIQUID"
                    )
        return "LIQUID"

    def place_labels(self) -> None:
        super().place_labels()
        sub = self.substance
        if sub is None or not len(self.regions.x):
            return
        keep = []
        for x, y, text in zip(self.regions.x, self.regions.y, self.regions.text, strict=True):
            from .coords import from_view

            xs, ys = from_view(self.view, float(x), float(y), self.units)
            try:
                phase = state_at(sub, self.view, xs, ys).phase
            except PhasePathError:
                continue
            if phase in _EXPECT.get(text, ()):
                keep.append((float(x), float(y), text))
        with self.regions.hold_sync():
            self.regions.x = np.array([k[0] for k in keep], dtype=float)
            self.regions.y = np.array([k[1] for k in keep], dtype=float)
            self.regions.text = [k[2] for k in keep]
