"""Undo and redo of the planner's drawing: a bounded stack of drawings (plain data).

>>> h = History(limit=2)
>>> h.push({"n": 1}); h.push({"n": 2}); h.push({"n": 3})
>>> h.undo({"n": 4}), h.undo({"n": 3}), h.undo({"n": 2})
({'n': 3}, {'n': 2}, None)
>>> h.redo({"n": 2})
{'n': 3}
"""

from __future__ import annotations

from typing import Any

__all__ = ["History"]

Drawing = dict[str, Any]


class History:
    """Drawings before the current one (undo) and after it (redo), at most ``limit`` each."""

    def __init__(self, limit: int = 200) -> None:
        self.limit = limit
        self._undo: list[Drawing] = []
        self._redo: list[Drawing] = []

    def push(self, previous: Drawing) -> None:
        """A new edit replaced ``previous``: it can be undone; what was undone is forgotten."""
        self._undo.append(previous)
        del self._undo[: -self.limit]
        self._redo.clear()

    def undo(self, current: Drawing) -> Drawing | None:
        """The drawing before ``current`` (None if there is none); ``current`` can be redone."""
        if not self._undo:
            return None
        self._redo.append(current)
        return self._undo.pop()

    def redo(self, current: Drawing) -> Drawing | None:
        """The drawing undone last (None if there is none); ``current`` can be undone again."""
        if not self._redo:
            return None
        self._undo.append(current)
        return self._redo.pop()

    @property
    def can_undo(self) -> bool:
        return bool(self._undo)

    @property
    def can_redo(self) -> bool:
        return bool(self._redo)
