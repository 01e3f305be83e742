"""Boundary branches of a phase diagram: pressure as a function of temperature on [T_min, T_max].

A :class:`Boundary` is one branch of one curve (the vapor-pressure curve, one melting branch, the
sublimation curve). It evaluates the published equation exactly, inverts it directly where the
source offers an inverse (CoolProp's saturation and melting lines) and otherwise by a bracketed
root finder on the exact equation, and keeps a cached sample for drawing and bracketing.
"""

from __future__ import annotations

import math
from collections.abc import Callable
from dataclasses import dataclass, field

import numpy as np
from scipy.optimize import brentq

from .errors import OutOfRangeError, PhasePathError

__all__ = ["Boundary", "KINDS"]

#: The three kinds of first-order boundary between phases.
KINDS = ("vaporization", "melting", "sublimation")

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

    def curve(self, p_floor: float = 0.0, p_ceiling: float = math.inf) -> tuple[np.ndarray, np.ndarray]:
        """(T, p) arrays for drawing, clipped to p_floor <= p <= p_ceiling."""
        T, p = self.sample()
        keep = (p >= p_floor) & (p <= p_ceiling)
        return T[keep], p[keep]

    def temperatures_at(self, p: float) -> list[tuple[float, str, int]]:
        """Every temperature on the branch where its pressure equals p.

        Returns a list of ``(T, method, evaluations)``. A direct inverse is used where the source
        has one; otherwise each sign change of the cached sample is refined with ``brentq`` on the
        exact equation (relative tolerance 4 eps), then moved to the neighbouring float where the
        branch pressure is closest to p. On steep branches (ice Ih melting, about -13 MPa/K) a
        tolerance in T alone is not enough: 1e-12 K there is 1e-8 of p at 1 kPa.
        """
        T, pp = self.sample()
        lo, hi = (pp[0], pp[-1]) if pp[0] <= pp[-1] else (pp[-1], pp[0])
        monotonic = bool(np.all(np.diff(pp) > 0) or np.all(np.diff(pp) < 0))
        if monotonic and not (lo <= p <= hi):
            return []
        if monotonic and self.T_of_p is not None:
            try:
                t = self.T_of_p(p)
            except PhasePathError:
                t = math.nan  # the source's inverse refused: fall back to the bracketed search
            if self.T_min <= t <= self.T_max:
                return [(t, "direct", 1)]
        out: list[tuple[float, str, int]] = []
        f = pp - p
        for i in range(len(T) - 1):
            a, b = f[i], f[i + 1]
            if a == 0.0:
                out.append((float(T[i]), "node", 1))
            elif a * b < 0.0:
                count = [0]

                def g(t: float) -> float:
                    count[0] += 1
                    return self.p_of_T(t) - p

                root = brentq(g, float(T[i]), float(T[i + 1]), xtol=1e-300,
                              rtol=4 * np.finfo(float).eps)
                out.append((_nearest_float_root(g, float(root)), "brentq", count[0]))
        if f[-1] == 0.0:
            out.append((float(T[-1]), "node", 1))
        return out


def _nearest_float_root(g: Callable[[float], float], t: float, reach: int = 4) -> float:
    """The float within ``reach`` steps of t where |g| is smallest (t itself on ties)."""
    best, g_best = t, abs(g(t))
    for direction in (math.inf, -math.inf):
        x = t
        for _ in range(reach):
            x = math.nextafter(x, direction)
            gx = abs(g(x))
            if gx < g_best:
                best, g_best = x, gx
    return best
