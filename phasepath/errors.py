"""The phasepath error family.

Every error phasepath raises for bad input is a :class:`PhasePathError`, itself a
:class:`ValueError`, so ``except ValueError`` catches them all. An error carries fields, not only
text: the value as the user typed it (``value``), the field it was given for (``field``), the
valid range (``valid``) and, for files, the file and line (``source``, ``line``). Its message is
built from those fields in one place, :meth:`PhasePathError.__str__`.

Context is added on the way up by raising a new error of the same class *from* the old one
(:meth:`PhasePathError.within`), never by editing or rebuilding an exception:

>>> inner = OutOfRangeError("T = 5000 K is above 2000 K", value=5000.0)
>>> outer = inner.within("start temperature", value="5000 K")
>>> str(outer)
"start temperature '5000 K': T = 5000 K is above 2000 K"
>>> outer.value, type(outer).__name__
('5000 K', 'OutOfRangeError')
>>> str(RouteFileError("'5 degC' is not a pressure", field="legs[0].p", source="plan.yaml", line=9))
"plan.yaml:9: field legs[0].p: '5 degC' is not a pressure"
"""

from __future__ import annotations

from typing import Any

__all__ = [
    "PhasePathError",
    "UnknownSubstanceError",
    "OutOfRangeError",
    "UnitError",
    "NonFiniteError",
    "RouteError",
    "PropertyError",
    "NoModelError",
    "RouteFileError",
    "ResultsFileError",
    "BatchError",
    "shown",
]

_UNSET: Any = type("_Unset", (), {"__repr__": lambda self: "<unset>"})()
_SHOWN = 80  # longest repr of a value shown whole in a message


def shown(value: object, limit: int = _SHOWN) -> str:
    """repr of a value as the user gave it, cut short in the middle when very long.

    >>> shown("a" * 200, limit=20)
    "'aaaaaaaaa…aaaaaaaaa' (202 characters)"
    """
    try:
        text = repr(value)
    except Exception:  # noqa: BLE001 - a value whose repr fails is still named by its type
        text = f"<{type(value).__name__}>"
    if len(text) <= limit:
        return text
    half = limit // 2
    return f"{text[:half]}…{text[-half:]} ({len(text)} characters)"


class PhasePathError(ValueError):
    """Base class of every error phasepath raises for bad input.

    Parameters
    ----------
    detail : str
        What is wrong, in one sentence.
    value : object, optional
        The value as the user gave it (shown after ``field`` unless ``detail`` already shows it).
    field : str, optional
        What the value was given for ("start temperature", "legs[0].p (leg 1)").
    valid : str, optional
        The valid range, in words ("Water: valid T 50 K to 2000 K").
    source, line : optional
        The file (and line) the value was read from.
    """

    def __init__(
        self,
        detail: str = "",
        *,
        value: object = _UNSET,
        field: str | None = None,
        valid: str | None = None,
        source: str | None = None,
        line: int | None = None,
    ) -> None:
        super().__init__(detail)
        self.detail = str(detail)
        self.value = None if value is _UNSET else value
        self._has_value = value is not _UNSET
        self.field = field
        self.valid = valid
        self.source = source
        self.line = line

    def __str__(self) -> str:
        parts = []
        if self.source:
            parts.append(self.source + (f":{self.line}" if self.line is not None else ""))
        if self.field:
            lead = f"field {self.field}" if self.source else self.field
            if self._has_value and shown(self.value) not in self.detail:
                lead += f" {shown(self.value)}"
            parts.append(lead)
        text = self.detail
        if self.valid and self.valid not in text:
            text += f" ({self.valid})"
        parts.append(text)
        return ": ".join(parts)

    def within(
        self,
        field: str | None = None,
        *,
        value: object = _UNSET,
        valid: str | None = None,
        source: str | None = None,
        line: int | None = None,
    ) -> PhasePathError:
        """A new error of the same class that puts this one in context; raise it ``from`` this one.

        The new error's detail is this error's whole message; fields not given are taken from
        this error (so ``value`` stays the value as typed by the user).
        """
        err = type(self)._like(self, str(self))
        err.field = field
        err.source = source
        err.line = line
        err.valid = valid or (self.valid if self.valid and self.valid not in err.detail else None)
        if value is not _UNSET:
            err.value, err._has_value = value, True
        else:
            err.value, err._has_value = self.value, False
        return err

    def plain(self) -> PhasePathError:
        """A copy of this error that carries its message (and its class's own data) but not the
        value as typed, so that it can travel between processes."""
        return type(self)._like(self, str(self))

    @classmethod
    def _like(cls, old: PhasePathError, detail: str) -> PhasePathError:
        """An error of this class with ``detail``, keeping what a subclass carries besides."""
        return cls(detail)


class UnknownSubstanceError(PhasePathError):
    """A substance name that phasepath does not know; carries close-name suggestions."""

    def __init__(self, detail: str = "", *, suggestions: tuple[str, ...] = (), **fields: Any):
        super().__init__(detail, **fields)
        self.suggestions = tuple(suggestions)

    @property
    def name(self) -> object:
        """The name as given."""
        return self.value

    @classmethod
    def _like(cls, old: PhasePathError, detail: str) -> PhasePathError:
        return cls(detail, suggestions=getattr(old, "suggestions", ()))


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


class NoModelError(PhasePathError):
    """No model covers a state (a solid without a published model, a substance without an
    equation of state); the message is the reason shown to the user."""


class RouteFileError(PhasePathError):
    """A route file that cannot be read or written: names the file, the field and the line."""


class ResultsFileError(PhasePathError):
    """A results file that cannot be read or written: names the file and the field."""


class BatchError(PhasePathError):
    """Routes of a batch that failed (``failures``: index -> error; ``reports``: the rest)."""

    def __init__(
        self,
        detail: str = "",
        *,
        failures: dict[int, PhasePathError] | None = None,
        reports: list[Any] | None = None,
        **fields: Any,
    ) -> None:
        super().__init__(detail, **fields)
        self.failures: dict[int, PhasePathError] = dict(failures or {})
        self.reports: list[Any] = list(reports or [])

    @classmethod
    def _like(cls, old: PhasePathError, detail: str) -> PhasePathError:
        return cls(
            detail, failures=getattr(old, "failures", None), reports=getattr(old, "reports", None)
        )
