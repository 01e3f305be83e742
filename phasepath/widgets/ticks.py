"""Axis ticks: one label format per axis (no widget library here).

A logarithmic axis gets its tick values chosen here (the decades, with 2 and 5 times them when
few decades show, every digit when less than one does) and one format for all of them: plain
numbers when every tick lies between 0.001 and 100,000 (``"0.01"``, ``"1"``, ``"5000"``), else
powers of ten for all (``"1e+6"``). A linear axis gets a fixed number of decimals for its span.

>>> log_ticks(0.1, 2000.0)
([0.1, 1.0, 10.0, 100.0, 1000.0], '~f')
>>> log_ticks(1.0, 50.0)
([1.0, 2.0, 5.0, 10.0, 20.0, 50.0], '~f')
>>> log_ticks(0.001, 1e9)[1]
'.0e'
>>> linear_format(-60.0, 40.0), linear_format(10.0, 12.0)
('.0f', '.1f')
"""

from __future__ import annotations

import math

__all__ = ["log_ticks", "linear_format"]

_PLAIN = (1e-3, 1e5)  # tick values shown as plain numbers inside this range


def log_ticks(lo: float, hi: float) -> tuple[list[float], str]:
    """(tick values, d3 format) of a log axis from lo to hi (display units)."""
    if not (lo > 0 and hi > lo and math.isfinite(hi)):
        return [], ".0e"
    k0, k1 = math.ceil(math.log10(lo) - 1e-9), math.floor(math.log10(hi) + 1e-9)
    decades = k1 - k0 + 1
    if decades >= 4:
        mantissas: tuple[int, ...] = (1,)
    elif decades >= 2:
        mantissas = (1, 2, 5)
    else:
        mantissas = tuple(range(1, 10))
    values = []
    for k in range(k0 - 1, k1 + 1):
        for m in mantissas:
            v = float(f"{m}e{k}")
            if lo * (1 - 1e-9) <= v <= hi * (1 + 1e-9):
                values.append(v)
    step = max(1, math.ceil(len(values) / 12))
    values = values[::step]
    plain = all(_PLAIN[0] <= v < _PLAIN[1] for v in values) and bool(values)
    return values, "~f" if plain else ".0e"


def linear_format(lo: float, hi: float) -> str:
    """The d3 format of a linear axis from lo to hi: enough decimals for about eight ticks."""
    span = hi - lo
    if not (math.isfinite(span) and span > 0):
        return ".0f"
    step = span / 8.0
    decimals = max(0, -math.floor(math.log10(step)))
    return f".{min(decimals, 6)}f"
