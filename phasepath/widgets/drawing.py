"""The drawing the planner edits: a route as plain data, and the edits a user makes to it.

A *spec* has the shape of :meth:`phasepath.Route.to_dict` (substance, title, notes, start, legs),
except that ``start`` may be None before the first corner is placed. Every value is kept as the
user gave it (``"25 degC"``, ``"60 bar"`` or an SI number), so switching substance or saving the
route keeps the user's own numbers. Each leg keeps only its target: an isobar its temperature, an
isotherm its pressure, a constant-volume leg its end temperature (or end pressure), a
constant-enthalpy or constant-entropy leg its end pressure, an event-ended leg its event
(``{"kind": "isobar", "until": "fully vapor"}``). The start holds T and p, or T and a density.
A corner's other coordinate comes from the legs before it (or from the equation of state, at the
end of a curved or event-ended leg), so every edit here keeps every leg true to its kind. This
module imports no widget library.
"""

from __future__ import annotations

import copy
import math
from typing import Any

from ..errors import PhasePathError, RouteError
from ..records import LEG_KINDS
from ..route import Route
from ..units import convert, parse_pressure, parse_temperature

Spec = dict[str, Any]

#: The coordinate a click sets for each leg kind (:attr:`phasepath.records.LegKind.moves`): an
#: isobar moves in T (it holds p), an isotherm in p; a constant-volume leg goes to the clicked
#: temperature, a constant-enthalpy or constant-entropy leg to the clicked pressure (the other
#: coordinate comes from the EOS).
MOVES = {name: kind.moves for name, kind in LEG_KINDS.items()}
#: Every leg kind the planner draws, in the order its controls offer them.
KINDS = tuple(LEG_KINDS)
#: Legs that hold T or p fixed (drawn straight), with the coordinate they hold.
_HELD = {name: kind.held for name, kind in LEG_KINDS.items() if kind.held in ("T", "p")}
_STRAIGHT = tuple(_HELD)


def empty(substance: Any) -> Spec:
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


def target(leg: dict[str, Any]) -> str:
    """The key of a leg's target: "T", "p" or "until"."""
    for key in ("until", "T", "p"):
        if key in leg:
            return key
    return MOVES[leg["kind"]]


def is_event(leg: dict[str, Any]) -> bool:
    return "until" in leg


def corners(spec: Spec, route: Route | None = None) -> list[tuple[float, float]]:
    """(T [K], p [Pa]) of every corner: from the core's route where the drawing is valid (pass
    it as ``route`` if already built), else read from the given values (the sketch stops before
    the first leg whose end needs the equation of state)."""
    if spec["start"] is None:
        return []
    if route is None:
        try:
            route = build(spec)
        except PhasePathError:
            route = None
    if route is not None:
        return route.corners()
    start = spec["start"]
    if "T" not in start or "p" not in start:
        return []  # a start given by density or quality needs the EOS
    T = parse_temperature(start["T"])
    p = parse_pressure(start["p"])
    out = [(T, p)]
    for leg in spec["legs"]:
        if leg["kind"] not in _STRAIGHT or is_event(leg):
            break  # a curved or event-ended leg's end needs the core; stop the sketch here
        try:
            if leg["kind"] == "isobar":
                T = parse_temperature(leg["T"])
            else:
                p = parse_pressure(leg["p"])
        except (PhasePathError, KeyError):
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


def add_corner(spec: Spec, T_text: str, p_text: str, kind: str, until: str | None = None) -> Spec:
    """A new last corner: the start if there is none, else a leg of ``kind`` whose target is the
    coordinate of the point that kind moves along (:data:`MOVES`); with ``until`` (an isobar or
    isotherm only) the leg ends on that event instead and the point is not used."""
    new = copy.deepcopy(spec)
    if new["start"] is None:
        new["start"] = {"T": T_text, "p": p_text}
    elif until:
        if kind not in _STRAIGHT:
            raise RouteError(
                f"an event ({until!r}) can end a constant-pressure or constant-temperature leg "
                f"only, not a {kind} leg"
            )
        new["legs"].append({"kind": kind, "until": until})
    else:
        coord = MOVES[kind]
        new["legs"].append({"kind": kind, coord: T_text if coord == "T" else p_text})
    return new


def add_leg(spec: Spec, kind: str, **leg_target: Any) -> Spec:
    """A new last leg with the target as typed (``T=``, ``p=`` or ``until=``)."""
    if spec["start"] is None:
        raise RouteError("place the start first")
    if kind not in MOVES:
        raise RouteError(f"unknown leg kind {kind!r}; known: {', '.join(KINDS)}")
    new = copy.deepcopy(spec)
    new["legs"].append({"kind": kind, **leg_target})
    return new


def move_corner(
    spec: Spec, index: int, T_text: str | None = None, p_text: str | None = None
) -> Spec:
    """Move corner ``index`` (0 = start) to the given T and/or p, keeping every leg true.

    The corner's own leg takes the value of the coordinate it moves along as its new target
    (a constant-volume leg keeps the kind of target it has, T or p; a typed value of the other
    kind switches it). A drag gives both coordinates: a curved or event-ended leg then takes only
    its own coordinate, and its end lands where the equation of state puts it. The coordinate a
    straight leg holds fixed belongs to an earlier target (the last earlier leg that moves along
    it, or the start): that one changes, so the run of legs holding it shifts with it, and the
    legs after the corner follow through their own targets. A single typed value that no leg can
    take (the temperature at the end of a constant-enthalpy leg) is refused with the reason; a
    drag then moves the corner along its own leg only.
    """
    new = _copy_with_corner(spec, index)
    legs = new["legs"]
    drag = T_text is not None and p_text is not None
    values = {"T": T_text, "p": p_text}
    if index == 0:
        for coord, value in values.items():
            if value is not None:
                _set_start(new, coord, value)
        return new
    own = legs[index - 1]
    kind = own["kind"]
    if kind in _STRAIGHT:
        mine, held = MOVES[kind], _HELD[kind]
        if values[mine] is not None and not (drag and is_event(own)):
            own.pop("until", None)
            own[mine] = values[mine]
        held_value = values[held]
        if held_value is not None:
            try:
                _set_held(new, index - 1, held, held_value, index)
            except RouteError:
                if not drag:
                    raise
                # a drag: the held coordinate follows from an event or the EOS; the corner
                # slides along its own leg only
        return new
    if set(LEG_KINDS[kind].targets) == {"T", "p"}:  # a sealed vessel: to T or to p
        key = target(own) if drag else ("T" if T_text is not None else "p")
        own.pop("T", None)
        own.pop("p", None)
        own[key] = values[key]
        return new
    # constant enthalpy or entropy: only the end pressure is the user's
    if p_text is None:
        raise RouteError(
            f"the temperature of corner {index} follows from its {kind} leg (the equation of "
            f"state puts it there): change that leg's pressure instead"
        )
    own["p"] = p_text
    return new


def _copy_with_corner(spec: Spec, index: int) -> Spec:
    """A copy of the drawing, refused (IndexError) where corner ``index`` does not exist."""
    if spec["start"] is None:
        raise IndexError("the route has no corners yet")
    if not 0 <= index <= len(spec["legs"]):
        raise IndexError(f"corner {index} does not exist (0 to {len(spec['legs'])})")
    return copy.deepcopy(spec)


def _set_start(spec: Spec, coord: str, value: str) -> None:
    start = spec["start"]
    if coord == "p":
        start.pop("density", None)
    start[coord] = value


def _set_held(spec: Spec, j: int, coord: str, value: str, index: int) -> None:
    """Set the held coordinate ``coord`` of the straight leg ``j``: on the last earlier leg that
    moves along it, or on the start (legs ``<= j`` holding it shift with it)."""
    legs = spec["legs"]
    while j > 0 and legs[j - 1]["kind"] in _STRAIGHT and _HELD[legs[j - 1]["kind"]] == coord:
        j -= 1
    if j == 0:
        _set_start(spec, coord, value)
        return
    leg = legs[j - 1]
    if is_event(leg):
        raise RouteError(
            f"the {'temperature' if coord == 'T' else 'pressure'} of corner {index} follows "
            f"from the event of leg {j} ({leg['until']!r}): change that leg instead"
        )
    if coord in LEG_KINDS[leg["kind"]].targets:
        for other in LEG_KINDS[leg["kind"]].targets:
            leg.pop(other, None)
        leg[coord] = value
        return
    raise RouteError(
        f"the temperature of corner {index} follows from the {leg['kind']} leg {j}: change "
        f"that leg's pressure instead"
    )


def delete_corner(spec: Spec, index: int) -> Spec:
    """Remove corner ``index``. Deleting the start makes the next corner the start (by its
    density where it is a two-phase mixture); deleting a later corner removes the leg that ends
    there (the next leg keeps its own target)."""
    new = _copy_with_corner(spec, index)
    legs = new["legs"]
    if index == 0:
        if not legs:
            new["start"] = None
            return new
        first = legs.pop(0)
        if first["kind"] in _STRAIGHT and not is_event(first) and "p" in new["start"]:
            start = dict(new["start"])
            start[MOVES[first["kind"]]] = first[MOVES[first["kind"]]]
        else:
            start = _state_start(spec)
        new["start"] = start
        return new
    legs.pop(index - 1)
    return _drop_zero_legs(new)


def _state_start(spec: Spec) -> dict[str, Any]:
    """The end of the first leg as a start: T and p, or T and density for a mixture."""
    try:
        route = build({**spec, "legs": spec["legs"][:1]})
    except PhasePathError:
        route = None
    if route is None or not route.legs:
        T1, p1 = corners(spec)[1]
        return {"T": T1, "p": p1}
    leg = route.legs[0]
    state = leg.state
    if state is not None and "+" in state.phase and state.rho is not None:
        return {"T": leg.T, "density": state.rho}
    return {"T": leg.T, "p": leg.p}


def _drop_zero_legs(spec: Spec) -> Spec:
    """Remove legs that end where they start (left behind by a deletion); legs past the end of
    the sketch (after a curved leg) are kept as they are."""
    try:
        pts = corners(spec)
    except ValueError:
        return spec
    keep = []
    for k, leg in enumerate(spec["legs"]):
        if k + 1 < len(pts):
            (Ta, pa), (Tb, pb) = pts[k], pts[k + 1]
            if math.isclose(Ta, Tb, rel_tol=1e-12) and math.isclose(pa, pb, rel_tol=1e-12):
                continue
        keep.append(leg)
    spec["legs"] = keep
    return spec


def copy_with_start(spec: Spec, **start: Any) -> Spec:
    """The drawing with the start's T, p or density replaced (a density replaces p, and the
    other way round); a start is created if there is none (it then needs T)."""
    new = copy.deepcopy(spec)
    old = dict(new["start"] or {})
    if "density" in start:
        old.pop("p", None)
    if "p" in start:
        old.pop("density", None)
    old.update(start)
    if "T" not in old:
        raise RouteError("type the start temperature too")
    new["start"] = old
    return new
