"""The few equation forms the published melting and sublimation curves share (private).

Each evaluator returns the pressure and its exact temperature derivative, so that the public
functions of :mod:`.sublimation_reviews`, :mod:`.sublimation_reference_eos`,
:mod:`.melting_published` and :mod:`.helium` stay one short function per published equation.
Everything is SI (K, Pa, Pa/K) except where a form takes a stated reference pressure.
"""

from __future__ import annotations

import math
from collections.abc import Sequence

from ._checks import in_range

#: Unit pressures the sources write their equations in [Pa].
TORR = 101325.0 / 760.0  # mmHg (1 atm = 760 Torr exactly, common practice)
BAR = 1.0e5
MPA = 1.0e6
ATM = 101325.0
KGF_CM2 = 98066.5  # kgf/cm2 (standard gravity 9.80665 m/s2, common practice)


def checked_T(T: float, lo: float, hi: float, what: str, source: str) -> float:
    """T as a float, or an error naming the value and the range ``lo`` to ``hi`` [K]."""
    return in_range("T", T, lo, hi, "K", f"{what} ({source})", digits=".6g")


def inverse_power_series(T: float, p_ref: float, A: Sequence[float]) -> tuple[float, float]:
    """ln(p/p_ref) = sum_i A_i / T**i (i = 0, 1, ...); returns (p, dp/dT)."""
    s = 0.0
    ds = 0.0
    for i, a in enumerate(A):
        s += a / T**i
        ds -= i * a / T ** (i + 1)
    p = p_ref * math.exp(s)
    return p, p * ds


def reduced_exponential(
    T: float, Tt: float, pt: float, a: Sequence[float], t: Sequence[float]
) -> tuple[float, float]:
    """ln(p/p_t) = (T_t/T) sum_i a_i (1 - T/T_t)**t_i; returns (p, dp/dT).

    At T = T_t a term with t_i < 1 has an infinite slope; dp/dT is then ``inf`` (the equation's
    own behaviour, not an error of evaluation).
    """
    th = 1.0 - T / Tt
    s = 0.0
    ds = 0.0  # d/dtheta of the sum
    for ai, ti in zip(a, t, strict=True):
        s += ai * th**ti
        if th > 0.0:
            ds += ai * ti * th ** (ti - 1.0)
        elif ti == 1.0:
            ds += ai
        elif ti < 1.0:
            ds += math.inf if ai > 0 else -math.inf
    p = pt * math.exp(Tt / T * s)
    # d/dT [ (Tt/T) s(theta) ] = -(Tt/T**2) s + (Tt/T) s'(theta) * (-1/Tt)
    slope = p * (-Tt / T**2 * s - ds / T)
    return p, slope


def reduced_power_melting(
    T: float, Tt: float, pt: float, a: Sequence[float], t: Sequence[float]
) -> tuple[float, float]:
    """p/p_t = 1 + sum_i a_i (T/T_t - 1)**t_i; returns (p, dp/dT)."""
    x = T / Tt - 1.0
    s = 1.0
    ds = 0.0
    for ai, ti in zip(a, t, strict=True):
        s += ai * x**ti
        if x > 0.0:
            ds += ai * ti * x ** (ti - 1.0)
        elif ti == 1.0:
            ds += ai
    return pt * s, pt * ds / Tt


def simon_absolute(T: float, p_ref: float, a0: float, a1: float, c: float) -> tuple[float, float]:
    """p/p_ref = a0 + a1 T**c (T in kelvin); returns (p, dp/dT)."""
    return p_ref * (a0 + a1 * T**c), p_ref * a1 * c * T ** (c - 1.0)


def simon_absolute_inverse(p: float, p_ref: float, a0: float, a1: float, c: float) -> float:
    """Temperature [K] at which :func:`simon_absolute` gives ``p`` [Pa] (closed form)."""
    return ((p / p_ref - a0) / a1) ** (1.0 / c)
