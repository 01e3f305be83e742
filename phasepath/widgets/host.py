"""What the planner's parts (the pointer handlers, the documents) use of the planner they are
mixed into, declared once for the type checker. No widget library here."""

from __future__ import annotations

from typing import TYPE_CHECKING, Any

__all__ = ["PlannerHost"]


class PlannerHost:
    """The planner's state and methods its mixins rely on (provided by ``RoutePlanner``)."""

    _spec: dict[str, Any]
    _busy: bool

    if TYPE_CHECKING:  # pragma: no cover - provided by the planner

        @property
        def units(self) -> Any: ...
        @property
        def report(self) -> Any: ...
        def _say(self, msg: str, keep_fields: bool = False) -> str: ...
        def _commit(
            self,
            spec: dict[str, Any],
            *,
            force: bool = False,
            fit: bool = False,
            keep_fields: bool = False,
        ) -> str: ...
        def _quiet(self) -> Any: ...
