"""The phasepath error family.

Every error phasepath raises for bad input is a :class:`PhasePathError`, itself a
:class:`ValueError`, so ``except ValueError`` catches them all. Each message names the
value as the user gave it and, where one exists, the valid range.
"""

from __future__ import annotations

__all__ = [
    "PhasePathError",
    "UnknownSubstanceError",
    "OutOfRangeError",
    "UnitError",
    "NonFiniteError",
    "RouteError",
    "PropertyError",
    "RouteFileError",
    "BatchError",
]


class PhasePathError(ValueError):
    """Base class of every error phasepath raises for bad input."""


class UnknownSubstanceError(PhasePathError):
    """A substance name that phasepath does not know; carries close-name suggestions."""

    def __init__(self, name: object, suggestions: list[str] | tuple[str, ...] = ()) -> None:
        self.name = name
        self.suggestions = tuple(suggestions)
        hint = (
            f"; did you mean {', '.join(repr(s) for s in self.suggestions)}?" if suggestions else ""
        )
        shown = (
            repr(name)
            if len(repr(name)) <= 80
            else f"{repr(name)[:60]}… ({len(repr(name))} characters)"
        )
        super().__init__(
            f"unknown substance {shown}{hint} (phasepath.substances() lists the "
            f"names it knows; aliases such as 'CO2' or 'water' work too)"
        )


class OutOfRangeError(PhasePathError):
    """A state or value outside the range the models cover."""


class UnitError(PhasePathError):
    """A value with an unknown unit or a unit of the wrong dimension."""


class NonFiniteError(PhasePathError):
    """NaN, an infinity, None or an empty string where a number was expected."""


class RouteError(PhasePathError):
    """A route or leg that cannot be built as asked (zero length, wrong arguments)."""


class PropertyError(PhasePathError):
    """The property library could not evaluate a state; names the state and substance."""


class RouteFileError(PhasePathError):
    """A route file that cannot be read: names the field and, where known, the line."""


class BatchError(PhasePathError):
    """Routes of a batch that failed (``failures``: index -> error; ``reports``: the rest)."""

    failures: dict[int, PhasePathError]
    reports: list
