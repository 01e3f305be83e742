"""Boundary branches of a phase diagram: pressure as a function of temperature on [T_min, T_max].

A :class:`Boundary` is one branch of one curve (the vapor-pressure curve, one melting branch, the
sublimation curve). It evaluates the published equation exactly, inverts it directly where the
source offers an inverse (CoolProp's saturation and melting lines) and otherwise by a bracketed
root finder on the exact equation (:mod:`phasepath.rootfind`), and keeps a cached sample for
drawing and bracketing.
"""

from __future__ import annotations

import math
from collections.abc import Callable
from dataclasses import dataclass, field

import numpy as np

from .errors import OutOfRangeError, PhasePathError
from .rootfind import RootResult, find_root, nearest_float_root

__all__ = ["Boundary"]

_SAMPLES = 96  # nodes of the cached sample used for bracketing


@dataclass(eq=False)
class Boundary:
    """One branch of a phase boundary, p(T) on [T_min, T_max].

    Attributes
    ----------
    kind : {"vaporization", "melting", "sublimation"}
    label : str
        What the branch separates, e.g. ``"melting (ice III)"``.
    T_min, T_max : float
        Temperature range of the branch [K].
    source : str
        Bibliography id of the published equation (see :mod:`phasepath.bibliography`).
    solid_form : str or None
        The named solid on the solid side (water's ices), else None.
    solid_side : {"above", "below"}
        Melting branches only: which side of the branch (in pressure) is solid. "below" for
        water's ice Ih, whose melting pressure falls as temperature rises.
    reliable : bool
        False where the source is known to be poor (stated in ``note``).
    T_valid : (float, float) or None
        Temperature range [K] where the branch rests on data (a fitted or published range).
        Outside it, within [T_min, T_max], the branch is an extrapolation: drawn and analysed,
        but flagged in the report. None: the whole branch is valid.
    """

    kind: str
    label: str
    T_min: float
    T_max: float
    source: str
    p_of_T: Callable[[float], float] = field(repr=False)
    T_of_p: Callable[[float], float] | None = field(default=None, repr=False)
    solid_form: str | None = None
    solid_side: str = "above"
    reliable: bool = True
    note: str = ""
    T_valid: tuple[float, float] | None = None
    _sample: tuple[np.ndarray, np.ndarray] | None = field(default=None, init=False, repr=False)
    _shape: tuple[float, float, bool] | None = field(default=None, init=False, repr=False)

    def pressure(self, T: float) -> float:
        """Pressure on the branch [Pa] at temperature T [K]."""
        if not (self.T_min <= T <= self.T_max):
            raise OutOfRangeError(
                f"T = {T!r} K is outside the {self.label} branch: {self.T_min} K to {self.T_max} K"
            )
        return self.p_of_T(T)

    def sample(self) -> tuple[np.ndarray, np.ndarray]:
        """Cached (T, p) nodes along the branch, denser where ln p curves most."""
        if self._sample is None:
            u = np.linspace(0.0, 1.0, _SAMPLES)
            if self.kind == "sublimation":
                # equal steps in 1/T: ln p is close to linear there
                T = 1.0 / (1.0 / self.T_min + u * (1.0 / self.T_max - 1.0 / self.T_min))
            else:
                T = self.T_min + u * (self.T_max - self.T_min)
            T[0], T[-1] = self.T_min, self.T_max
            p = np.array([self.p_of_T(float(t)) for t in T])
            self._sample = (T, p)
        return self._sample

    def curve(
        self, p_floor: float = 0.0, p_ceiling: float = math.inf
    ) -> tuple[np.ndarray, np.ndarray]:
        """(T, p) arrays for drawing, clipped to p_floor <= p <= p_ceiling."""
        T, p = self.sample()
        keep = (p >= p_floor) & (p <= p_ceiling)
        return T[keep], p[keep]

    def temperatures_at(self, p: float) -> list[RootResult]:
        """Every temperature on the branch where its pressure equals p, in rising T.

        A direct inverse is used where the source has one (``method`` "direct"). Otherwise each
        sign change of the cached sample brackets a root, refined by
        :func:`phasepath.rootfind.find_root` on the exact equation from a guess interpolated in
        ln p against 1/T (in p against T on melting branches), until the branch pressure is
        within 1e-12 of p, usually after two or three evaluations. Where that tolerance lies
        below one float step in T (steep branches at low pressure: ice Ih melting, about
        -13 MPa/K, at 1 kPa) the root is the float nearest it.
        """
        T, pp = self.sample()
        lo, hi, monotonic = self._span()
        if monotonic and not (lo <= p <= hi):
            return []
        if monotonic and self.T_of_p is not None:
            try:
                t = self.T_of_p(p)
            except PhasePathError:
                t = math.nan  # the source's inverse refused: fall back to the bracketed search
            if self.T_min <= t <= self.T_max:
                return [RootResult(t, 1, True, "direct", (self.T_min, self.T_max))]
        out: list[RootResult] = []
        f = pp - p
        for i in np.nonzero(f[:-1] * f[1:] <= 0.0)[0].tolist():
            a, b = f[i], f[i + 1]
            if a == 0.0:
                out.append(RootResult(float(T[i]), 1, True, "node", (float(T[i]), float(T[i]))))
            elif b != 0.0:
                out.append(
                    self._refine(p, float(T[i]), float(T[i + 1]), float(pp[i]), float(pp[i + 1]))
                )
        if f[-1] == 0.0:
            out.append(RootResult(float(T[-1]), 1, True, "node", (float(T[-1]), float(T[-1]))))
        return out

    def _span(self) -> tuple[float, float, bool]:
        """(lowest p, highest p, monotonic) of the cached sample, computed once."""
        if self._shape is None:
            _, pp = self.sample()
            d = np.diff(pp)
            self._shape = (float(pp.min()), float(pp.max()), bool(np.all(d > 0) or np.all(d < 0)))
        return self._shape

    def _refine(self, p: float, Ta: float, Tb: float, pa: float, pb: float) -> RootResult:
        """The root of p_of_T(T) = p between two sample nodes whose pressures straddle p."""

        def g(t: float) -> float:
            return self.p_of_T(t) - p

        # guess and slope from the interpolant through the two nodes
        if self.kind != "melting" and pa > 0.0 and pb > 0.0 and p > 0.0:
            k = math.log(pb / pa) / (1.0 / Tb - 1.0 / Ta)  # ln p = c + k / T
            t0 = 1.0 / (1.0 / Ta + math.log(p / pa) / k)
            slope = -k * p / (t0 * t0)
        else:
            slope = (pb - pa) / (Tb - Ta)
            t0 = Ta - (pa - p) / slope
        if not (math.isfinite(t0) and math.isfinite(slope) and slope != 0.0):
            t0, slope = 0.5 * (Ta + Tb), (pb - pa) / (Tb - Ta)
        # within 1e-12 of p, or within about half a float step in T of the root (steep branches)
        tol = max(1e-12 * abs(p), 0.6 * abs(slope) * math.ulp(t0))
        r = find_root(g, Ta, Tb, f_lo=pa - p, f_hi=pb - p, guess=t0, slope=slope, ftol=tol)
        if r.method == "secant":
            return r
        polished = nearest_float_root(g, r.root)
        return RootResult(polished, r.evaluations + 8, r.converged, r.method, r.bracket)

    def slope(self, T: float) -> float:
        """d(ln p)/dT along the branch [1/K] at T: central difference, second-order one-sided at
        the branch's ends (h = 1e-3 K)."""
        h = 1e-3

        def g(t: float) -> float:
            return math.log(self.p_of_T(t))

        if T - h >= self.T_min and T + h <= self.T_max:
            return (g(T + h) - g(T - h)) / (2 * h)
        s = 1.0 if T - h < self.T_min else -1.0
        return s * (-3 * g(T) + 4 * g(T + s * h) - g(T + 2 * s * h)) / (2 * h)
