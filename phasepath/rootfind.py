"""The one root finder of phasepath, with its result record and its one set of tolerances.

Every root phasepath finds (a boundary's temperature at a pressure, a state's temperature at a
given enthalpy, the end of a sealed-vessel leg at a pressure, an inverse of a published
equation) goes through :func:`find_root`: a bracketed search on the exact equation that returns
a :class:`RootResult` (root, evaluations, converged, method, bracket).

Tolerances (the guarantee)
--------------------------
A root is returned when one of these holds:

* ``|f(x)| <= ftol``, where the caller states what ``ftol`` means for its equation (a boundary
  pressure within 1e-12 relative of the leg's pressure, say); ``ftol = 0`` by default;
* the bracket has shrunk to :data:`RTOL` relative (four machine epsilons, the finest that
  ``scipy.optimize.brentq`` accepts): the root is then the float nearest the exact root to within
  a few units in the last place.

A starting guess (with a slope) from the caller's own interpolant is tried first by secant steps
kept inside the bracket; anything unexpected falls back to Brent's method on what is left of the
bracket, so the guarantee never rests on the guess.

>>> r = find_root(lambda x: x * x - 2.0, 1.0, 2.0)
>>> abs(r.root - 2.0 ** 0.5) <= 4 * RTOL, r.converged, r.method
(True, True, 'brentq')
>>> find_root(lambda x: x - 3.0, 0.0, 1.0, what="x = 3")  # doctest: +ELLIPSIS
Traceback (most recent call last):
...
phasepath.errors.OutOfRangeError: no root of x = 3 between 0 and 1...
"""

from __future__ import annotations

import math
from collections.abc import Callable
from dataclasses import dataclass

from scipy.optimize import brentq

from .errors import OutOfRangeError

__all__ = ["RootResult", "find_root", "nearest_float_root", "RTOL", "XTOL"]

#: Relative width of the bracket at which a root is taken (four machine epsilons).
RTOL = 4.0 * 2.220446049250313e-16
#: Absolute width below which the bracket is not narrowed further (only for roots near zero).
XTOL = 1e-300
_SECANT_STEPS = 8


@dataclass(frozen=True)
class RootResult:
    """A root and how it was found.

    Attributes
    ----------
    root : float
    evaluations : int
        Evaluations of the function made by this call (values passed in are not counted).
    converged : bool
    method : str
        "end" (a bracket end is the root), "secant" (the guess and secant steps met ``ftol``),
        "brentq" (Brent's method to :data:`RTOL`).
    bracket : (float, float)
        The bracket the root was searched in.
    """

    root: float
    evaluations: int
    converged: bool
    method: str
    bracket: tuple[float, float]


def find_root(
    f: Callable[[float], float],
    lo: float,
    hi: float,
    *,
    f_lo: float | None = None,
    f_hi: float | None = None,
    guess: float | None = None,
    slope: float | None = None,
    ftol: float = 0.0,
    end_slack: float = 0.0,
    what: str = "the equation",
) -> RootResult:
    """A root of ``f`` between ``lo`` and ``hi`` (see the module text for the guarantee).

    Parameters
    ----------
    f : callable
        The exact equation, f(x) = 0 at the root.
    lo, hi : float
        The bracket; f must change sign across it (or vanish at an end).
    f_lo, f_hi : float, optional
        f at the bracket ends, where the caller knows them already.
    guess, slope : float, optional
        A first estimate of the root and of f' there, from the caller's interpolant.
    ftol : float
        Accept x once |f(x)| <= ftol.
    end_slack : float
        Accept a bracket end whose |f| is within ``end_slack`` times the larger end value when f
        does not change sign (a root on a boundary's end missed by the rounding of the property
        calls).
    what : str
        The equation in words, for the error raised when the bracket holds no root.

    Raises
    ------
    OutOfRangeError
        When f has the same sign at both ends.
    """
    count = 0

    def g(x: float) -> float:
        nonlocal count
        count += 1
        return f(x)

    if lo > hi:
        lo, hi, f_lo, f_hi = hi, lo, f_hi, f_lo
    a, b = lo, hi
    fa = g(a) if f_lo is None else float(f_lo)
    fb = g(b) if f_hi is None else float(f_hi)
    bracket = (a, b)
    if fa == 0.0:
        return RootResult(a, count, True, "end", bracket)
    if fb == 0.0:
        return RootResult(b, count, True, "end", bracket)
    if (fa > 0.0) == (fb > 0.0) or not (math.isfinite(fa) and math.isfinite(fb)):
        if end_slack > 0.0 and math.isfinite(fa) and math.isfinite(fb):
            end, fend = (a, fa) if abs(fa) < abs(fb) else (b, fb)
            if abs(fend) <= end_slack * max(abs(fa), abs(fb)):
                return RootResult(end, count, True, "end", bracket)
        raise OutOfRangeError(f"no root of {what} between {a:.6g} and {b:.6g}")
    if guess is not None and math.isfinite(guess):
        found = _secant(g, a, b, fa, fb, guess, slope, ftol)
        if isinstance(found, float):
            return RootResult(found, count, True, "secant", bracket)
        a, b, fa, fb = found
    if abs(fa) <= ftol:
        return RootResult(a, count, True, "brentq", bracket)
    if abs(fb) <= ftol:
        return RootResult(b, count, True, "brentq", bracket)
    root, info = brentq(g, a, b, xtol=XTOL, rtol=RTOL, maxiter=200, full_output=True, disp=False)
    return RootResult(float(root), count, bool(info.converged), "brentq", bracket)


def _secant(
    g: Callable[[float], float],
    a: float,
    b: float,
    fa: float,
    fb: float,
    guess: float,
    slope: float | None,
    ftol: float,
) -> float | tuple[float, float, float, float]:
    """Secant steps from the guess, inside [a, b]: the root, or the narrowed bracket."""
    x0 = min(max(guess, a), b)
    g0 = g(x0)
    if abs(g0) <= ftol or g0 == 0.0:
        return x0
    a, b, fa, fb = _narrow(a, b, fa, fb, x0, g0)
    if slope is None or not math.isfinite(slope) or slope == 0.0:
        return a, b, fa, fb
    x1 = x0 - g0 / slope
    for _ in range(_SECANT_STEPS):
        if not (a <= x1 <= b) or x1 == x0:
            break
        g1 = g(x1)
        if abs(g1) <= ftol or g1 == 0.0:
            return x1
        a, b, fa, fb = _narrow(a, b, fa, fb, x1, g1)
        if g1 == g0:
            break
        x0, g0, x1 = x1, g1, x1 - g1 * (x1 - x0) / (g1 - g0)
    return a, b, fa, fb


def _narrow(
    a: float, b: float, fa: float, fb: float, x: float, fx: float
) -> tuple[float, float, float, float]:
    if (fx > 0.0) == (fa > 0.0):
        return x, b, fx, fb
    return a, x, fa, fx


def nearest_float_root(g: Callable[[float], float], t: float, reach: int = 4) -> float:
    """The float within ``reach`` steps of t where |g| is smallest (t itself on ties).

    For equations so steep that one floating-point step in x moves f by more than the caller's
    tolerance: the best x a float can hold.
    """
    best, g_best = t, abs(g(t))
    for direction in (math.inf, -math.inf):
        x = t
        for _ in range(reach):
            x = math.nextafter(x, direction)
            gx = abs(g(x))
            if gx < g_best:
                best, g_best = x, gx
    return best
