"""The argument checks every published correlation makes: a finite number, inside the range of
the equation. One place, so that every correlation refuses in the same words.

>>> in_range("T", 300.0, 200.0, 400.0, "K", "demo curve")
300.0
>>> in_range("T", 500.0, 200.0, 400.0, "K", "demo curve")  # doctest: +ELLIPSIS
Traceback (most recent call last):
...
phasepath.errors.OutOfRangeError: T = 500.0 K is outside the demo curve: 200 K to 400 K
"""

from __future__ import annotations

import math

from ..errors import NonFiniteError, OutOfRangeError, shown

__all__ = ["number", "in_range"]


def number(name: str, value: object) -> float:
    """``value`` as a finite float, or an error naming it."""
    try:
        x = float(value)  # type: ignore[arg-type]
    except OverflowError:
        raise NonFiniteError(
            f"{name} = {shown(value)} is too large to be a number", value=value
        ) from None
    except (TypeError, ValueError):
        raise NonFiniteError(f"{name} = {shown(value)} is not a number", value=value) from None
    if not math.isfinite(x):
        raise NonFiniteError(f"{name} = {shown(value)} is not a finite number", value=value)
    return x


def in_range(
    name: str,
    value: object,
    lo: float,
    hi: float,
    unit: str,
    what: str,
    open_low: bool = False,
    digits: str = "g",
) -> float:
    """``value`` as a float inside [lo, hi] (or (lo, hi] with ``open_low``), or an error naming
    the value and the range of ``what`` (the equation and its source)."""
    x = number(name, value)
    if (x <= lo if open_low else x < lo) or x > hi:
        low = f"above {lo:{digits}} {unit}" if open_low else f"{lo:{digits}} {unit}"
        raise OutOfRangeError(
            f"{name} = {shown(value)} {unit} is outside the {what}: {low} to {hi:{digits}} {unit}",
            value=value,
        )
    return x
