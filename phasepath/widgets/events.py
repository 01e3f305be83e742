"""What the page's events mean for the drawing: pure functions, no widget library.

A value the user typed gets its display unit when it is a bare number (:func:`typed_text`); a
leg typed in the leg list becomes its target (:func:`typed_target`); a corner added by
:meth:`RoutePlanner.add_corner` with the kind "auto" takes the straight kind closer to its
direction (:func:`auto_kind`). The page's clicks and drags are read in :mod:`.pointer` and
:mod:`.clicks`.

>>> from phasepath.format import DisplayUnits
>>> typed_text("25", "temperature", DisplayUnits("degC", "bar"))
'25 degC'
"""

from __future__ import annotations

import math
from typing import Any

from ..errors import PhasePathError, RouteError
from ..format import DisplayUnits
from ..records import EVENTS, LEG_KINDS
from ..units import parse_quantity

__all__ = [
    "typed_text",
    "typed_target",
    "is_density",
    "auto_kind",
    "event_index",
]


def typed_text(value: object, dimension: str, units: DisplayUnits) -> str:
    """What the user typed, checked, with the display unit added to a bare number."""
    unit = units.T if dimension == "temperature" else units.p
    parse_quantity(value, dimension, unit)
    text = str(value).strip()
    try:
        float(text)
    except ValueError:
        return text
    return f"{text} {unit}"


def typed_target(kind: str, typed: str, units: DisplayUnits) -> dict[str, Any]:
    """The target of a leg typed in the leg list: a value in the coordinate the kind moves
    along (a sealed vessel takes a temperature or a pressure), or ``until <event>`` on a leg
    that can end on an event."""
    text = (typed or "").strip()
    if kind not in LEG_KINDS:
        raise RouteError(f"unknown leg kind {kind!r}; known: {', '.join(LEG_KINDS)}")
    leg = LEG_KINDS[kind]
    if not text:
        raise RouteError(f"type the {kind} leg's target ({leg.moves}) or an event")
    low = text.lower()
    if low.startswith("until "):
        return {"until": text[6:].strip()}
    if low in EVENTS or low.endswith(("superheat", "subcooling")):
        return {"until": text}
    coords = [t for t in leg.targets if t in ("T", "p")]
    errors: list[PhasePathError] = []
    for coord in sorted(coords, key=lambda c: c != leg.moves):
        dim = "temperature" if coord == "T" else "pressure"
        try:
            return {coord: typed_text(text, dim, units)}
        except PhasePathError as exc:
            errors.append(exc)
    raise errors[-1]


def is_density(text: object) -> bool:
    """True for a typed density ("450 kg/m3"), which a start takes instead of a pressure."""
    if not isinstance(text, str) or "/" not in text:
        return False
    try:
        parse_quantity(text, "density")
    except PhasePathError:
        return False
    return True


def auto_kind(
    last: tuple[float, float] | None,
    T1: float,
    p1: float,
    window: tuple[float, float, float, float],
) -> str:
    """The straight kind whose leg runs closer to the click's direction on screen."""
    if last is None:
        return "isobar"
    T0, p0 = last
    dx = abs(T1 - T0) / max(window[1] - window[0], 1e-12)
    dy = abs(math.log10(max(p1, 1e-300) / p0)) / max(math.log10(window[3] / window[2]), 1e-12)
    return "isotherm" if dy > dx else "isobar"


def event_index(event: dict[str, Any]) -> int | None:
    """The index of the mark a hover event is about."""
    data = event.get("data") or {}
    i = data.get("index", event.get("index"))
    return int(i) if i is not None else None
