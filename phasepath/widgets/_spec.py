"""The drawing the planner edits: a route as plain data, and the edits a user makes to it.

A *spec* has the shape of :meth:`phasepath.Route.to_dict` (substance, title, notes, start, legs),
except that ``start`` may be None before the first corner is placed. Every value is kept as the
user gave it (``"25 degC"``, ``"60 bar"`` or an SI number), so switching substance or saving the
route keeps the user's own numbers. Each leg keeps only its target (an isobar its temperature, an
isotherm its pressure); a corner's other coordinate comes from the legs before it, so every edit
here keeps every leg a true isobar or isotherm. This module imports no widget library.
"""

from __future__ import annotations

import copy
import math
from typing import Any

from ..errors import PhasePathError, RouteError
from ..route import Route
from ..units import convert, parse_pressure, parse_temperature

Spec = dict[str, Any]

#: The coordinate each leg kind moves along (the other one it holds fixed).
MOVES = {"isobar": "T", "isotherm": "p"}
#: Legs drawn by the planner hold T or p fixed; other kinds (isochore, isenthalp, isentrope) move
#: along p and their end temperature comes from the core.
_STRAIGHT = ("isobar", "isotherm")


def empty(substance: str) -> Spec:
    return {"substance": substance, "title": "", "notes": "", "start": None, "legs": []}


def from_route(route: Route) -> Spec:
    d = route.to_dict()
    d["start"] = dict(d["start"])
    d["legs"] = [dict(leg) for leg in d["legs"]]
    return d


def build(spec: Spec) -> Route | None:
    """The validated :class:`Route`, None without a start; raises the core's errors."""
    if spec["start"] is None:
        return None
    return Route.from_dict(spec)


def corners(spec: Spec) -> list[tuple[float, float]]:
    """(T [K], p [Pa]) of every corner: from the core's route where the drawing is valid, else
    read from the given values (a leg whose end cannot be read is left out)."""
    if spec["start"] is None:
        return []
    try:
        route = build(spec)
    except PhasePathError:
        route = None
    if route is not None:
        return route.corners()
    T = parse_temperature(spec["start"]["T"])
    p = parse_pressure(spec["start"]["p"])
    out = [(T, p)]
    for leg in spec["legs"]:
        try:
            if leg["kind"] == "isobar":
                T = parse_temperature(leg["T"])
            elif leg["kind"] == "isotherm":
                p = parse_pressure(leg["p"])
            else:
                break  # a curved leg's end needs the core; stop the sketch here
        except PhasePathError:
            break
        out.append((T, p))
    return out


def text(value: float, dimension: str, unit: str) -> str:
    """An SI value written in a display unit at drawing precision: 0.1 degree, 4 significant
    figures of pressure ("263.2 K", "-12.5 degC", "4.562 bar")."""
    if dimension == "temperature":
        x = convert(value, "K", unit, "temperature")
        return f"{round(x, 1):.1f} {unit}"
    x = convert(value, "Pa", unit, "pressure")
    digits = 3 - int(math.floor(math.log10(abs(x)))) if x > 0 else 3
    return f"{round(x, digits):.{max(digits, 0)}f} {unit}"


def add_corner(spec: Spec, T_text: str, p_text: str, kind: str) -> Spec:
    """A new last corner: the start if there is none, else a leg of ``kind`` whose target is the
    matching coordinate of the point (the other coordinate snaps to the last corner)."""
    new = copy.deepcopy(spec)
    if new["start"] is None:
        new["start"] = {"T": T_text, "p": p_text}
    else:
        coord = MOVES[kind]
        new["legs"].append({"kind": kind, coord: T_text if coord == "T" else p_text})
    return new


def move_corner(
    spec: Spec, index: int, T_text: str | None = None, p_text: str | None = None
) -> Spec:
    """Move corner ``index`` (0 = start) to the given T and/or p, keeping every leg true.

    The corner's leg takes the new value of the coordinate it moves along as its target. The
    coordinate the leg holds fixed belongs to an earlier target (the last earlier leg of the other
    kind, or the start): that one changes, so the run of same-kind legs before the corner shifts
    with it, and the legs after the corner follow through their own targets.
    """
    new = copy.deepcopy(spec)
    if new["start"] is None:
        raise IndexError("the route has no corners yet")
    legs = new["legs"]
    if not 0 <= index <= len(legs):
        raise IndexError(f"corner {index} does not exist (0 to {len(legs)})")
    for coord, value in (("T", T_text), ("p", p_text)):
        if value is None:
            continue
        j = index
        while j > 0 and legs[j - 1]["kind"] in _STRAIGHT and MOVES[legs[j - 1]["kind"]] != coord:
            j -= 1
        if j == 0:
            new["start"][coord] = value
        elif legs[j - 1]["kind"] in _STRAIGHT or coord == "p":
            legs[j - 1][coord] = value
        else:
            raise RouteError(
                f"the temperature of corner {index} follows from the "
                f"{legs[j - 1]['kind']} leg {j}: change that leg's pressure instead"
            )
    return new


def delete_corner(spec: Spec, index: int) -> Spec:
    """Remove corner ``index``. Deleting the start makes the next corner the start; deleting a
    later corner removes the leg that ends there (the next leg keeps its own target)."""
    new = copy.deepcopy(spec)
    if new["start"] is None:
        raise IndexError("the route has no corners yet")
    legs = new["legs"]
    if not 0 <= index <= len(legs):
        raise IndexError(f"corner {index} does not exist (0 to {len(legs)})")
    if index == 0:
        if not legs:
            new["start"] = None
            return new
        first = legs.pop(0)
        start = dict(new["start"])
        if first["kind"] in _STRAIGHT:
            start[MOVES[first["kind"]]] = first[MOVES[first["kind"]]]
        else:
            T1, p1 = corners(spec)[1]
            start = {"T": T1, "p": p1}
        new["start"] = start
        return new
    legs.pop(index - 1)
    return _drop_zero_legs(new)


def _drop_zero_legs(spec: Spec) -> Spec:
    """Remove legs that end where they start (left behind by a deletion)."""
    try:
        pts = corners(spec)
    except ValueError:
        return spec
    keep = []
    for leg, a, b in zip(spec["legs"], pts[:-1], pts[1:], strict=False):
        if math.isclose(a[0], b[0], rel_tol=1e-12) and math.isclose(a[1], b[1], rel_tol=1e-12):
            continue
        keep.append(leg)
    spec["legs"] = keep
    return spec
