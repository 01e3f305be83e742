"""The display-precision policy of :mod:`phasepath.format` as a check on printed text.

A printed number passes when it has at most six significant digits (pressures, energies,
densities, fitted values, fractions to 0.0001 all fit), or exactly three decimals and at most
seven significant digits (temperatures to 0.001 K up to 9999.999). Anything longer (float noise
such as ``50.00000000000001``, or ``188110.207`` kPa) has more digits than any model supports.
Numbers inside words, versions (``8.0.0``), hashes and identifiers are not numbers shown to
people and are skipped. Integers are counted without their trailing zeros.
"""

from __future__ import annotations

import re

__all__ = ["NUMBER", "significant_digits", "too_many_digits", "offenders"]

#: A number as printed: not glued to a word, a dot or another number.
NUMBER = re.compile(r"(?<![\w.])[-+]?(\d+(?:\.\d+)?)(?:[eE][-+]?\d+)?(?!\w|\.\d)")


def significant_digits(mantissa: str) -> tuple[int, int]:
    """(significant digits, decimals) of a printed mantissa ("0.00123" -> (3, 5))."""
    whole, _, decimals = mantissa.partition(".")
    digits = (whole + decimals).lstrip("0")
    if not decimals:
        digits = digits.rstrip("0")
    return max(len(digits), 1), len(decimals)


def too_many_digits(text: str) -> list[str]:
    """The numbers in ``text`` printed with more digits than the policy allows."""
    out = []
    for m in NUMBER.finditer(text):
        sig, dec = significant_digits(m.group(1))
        if sig <= 6 or (dec == 3 and sig <= 7):
            continue
        out.append(m.group(0))
    return out


def offenders(text: str) -> list[tuple[str, str]]:
    """(number, its line) for every number with too many digits."""
    return [(n, line.strip()) for line in text.splitlines() for n in too_many_digits(line)]
