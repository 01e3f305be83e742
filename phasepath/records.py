"""The records every layer shares: states, legs, crossings, leg summaries, hazards, and the
tables of leg kinds, events and crossing kinds.

Everything here is plain data (frozen dataclasses, tuples, one small table per concept) and
imports nothing of phasepath but its errors. Everything a layer needs to know about a leg kind is
one row of :data:`LEG_KINDS`; a new leg kind starts as a new row there.

>>> LEG_KINDS["isenthalp"].held, LEG_KINDS["isenthalp"].curved, LEG_KINDS["isenthalp"].label
('h', True, 'constant h')
>>> crossing_kind("vapor", "solid+vapor")
'deposition'
>>> phase_text("solid", "VI")
'solid (ice VI)'
"""

from __future__ import annotations

import re
from collections.abc import Sequence
from dataclasses import dataclass, field
from typing import Any, Protocol

from .errors import RouteError

__all__ = [
    "TOLERANCE",
    "PHASES",
    "MIXTURES",
    "BOUNDARY_KINDS",
    "CROSSING_KINDS",
    "LegKind",
    "LEG_KINDS",
    "CURVED_KINDS",
    "EVENTS",
    "EVENT_DELTA",
    "BASES",
    "Hazard",
    "LatentHeat",
    "StatePoint",
    "Leg",
    "Crossing",
    "LegSummary",
    "Analysis",
    "crossing_kind",
    "describe_change",
    "boundary_of",
    "boundary_kind",
    "phase_text",
    "state_key",
]

#: Guaranteed relative agreement between a crossing and its boundary (in pressure).
TOLERANCE = 1e-9

#: The four regions a single-phase state can be in.
PHASES = ("solid", "liquid", "vapor", "supercritical")
#: Two phases in equilibrium on a boundary, as reached on a constant-v, -h or -s leg.
MIXTURES = ("liquid+vapor", "solid+vapor", "solid+liquid")
#: The three kinds of first-order boundary between phases.
BOUNDARY_KINDS = ("vaporization", "melting", "sublimation")
#: Every kind of crossing the analyser reports.
CROSSING_KINDS = (
    "melting",
    "freezing",
    "vaporization",
    "condensation",
    "sublimation",
    "deposition",
    "supercritical-entry",
    "supercritical-exit",
    "solid-transition",
)


@dataclass(frozen=True)
class LegKind:
    """Everything every layer needs to know about one kind of leg.

    Attributes
    ----------
    name : str
        The kind as written in routes and files ("isobar").
    held : {"p", "T", "v", "h", "s"}
        The property the leg holds fixed.
    targets : tuple of str
        The fields that may give its end, exactly one per leg ("T", "p", "until").
    moves : {"T", "p"}
        The coordinate a click or a drag sets for the leg's end.
    curved : bool
        True where the leg's path on the P-T diagram comes from the equation of state.
    flowing : bool
        True for a leg through a flowing line or device (solids forming there plug it); False for
        a sealed vessel.
    label : str
        Short name on screen ("constant p").
    device : str
        What such a leg models, in a few words.
    """

    name: str
    held: str
    targets: tuple[str, ...]
    moves: str
    curved: bool
    flowing: bool
    label: str
    device: str


#: The kinds of leg, in the order the controls offer them.
LEG_KINDS: dict[str, LegKind] = {
    k.name: k
    for k in (
        LegKind("isobar", "p", ("T", "until"), "T", False, True, "constant p", "heater or cooler"),
        LegKind(
            "isotherm",
            "T",
            ("p", "until"),
            "p",
            False,
            True,
            "constant T",
            "compressor with intercooling, or a thermostatted vessel",
        ),
        LegKind(
            "isochore",
            "v",
            ("T", "p"),
            "T",
            True,
            False,
            "constant v",
            "sealed vessel warming or cooling",
        ),
        LegKind(
            "isenthalp", "h", ("p",), "p", True, True, "constant h", "valve or vent (throttle)"
        ),
        LegKind(
            "isentrope", "s", ("p",), "p", True, True, "constant s", "ideal compressor or expander"
        ),
    )
}
#: Leg kinds whose path on the P-T diagram is a curve found from the equation of state.
CURVED_KINDS = tuple(k for k, v in LEG_KINDS.items() if v.curved)

#: Events that can end a constant-pressure or constant-temperature leg (plus "N K superheat"
#: and "N K subcooling" on a constant-pressure leg, see :data:`EVENT_DELTA`).
EVENTS = ("fully vapor", "fully liquid", "first liquid", "first vapor", "first solid")
#: "N K superheat" / "N K subcooling" on a constant-pressure leg.
EVENT_DELTA = re.compile(r"^\s*([0-9]*\.?[0-9]+)\s*K\s+(superheat|subcooling)\s*$", re.IGNORECASE)

#: Heat-and-work bases a report can be computed on.
BASES = ("steady-flow", "closed")


@dataclass(frozen=True)
class Hazard:
    """A hazard flag on a leg or a crossing: what, why, and the caution that goes with it."""

    kind: str
    reason: str
    caution: str


@dataclass(frozen=True)
class LatentHeat:
    """The latent heat of a crossing: ``value`` [J/kg] (positive) and the ``model`` it comes
    from, or None with the reason in ``note``."""

    value: float | None
    model: str | None = None
    note: str = ""


@dataclass(frozen=True)
class StatePoint:
    """A state on the route.

    ``phase`` is one of the four regions, or a mixture on a boundary ("liquid+vapor",
    "solid+vapor", "solid+liquid") reached on a constant-volume, -enthalpy or -entropy leg.
    ``form`` names the solid (water's ices), else None. ``vapor_fraction`` and
    ``solid_fraction`` are mass fractions, None for a single phase. ``h`` [J/kg],
    ``s`` [J/(kg K)] and ``rho`` [kg/m3] are None where no model covers the state (the reason is
    in ``model``).
    """

    T: float
    p: float
    phase: str
    form: str | None = None
    vapor_fraction: float | None = None
    solid_fraction: float | None = None
    h: float | None = field(default=None, compare=False)
    s: float | None = field(default=None, compare=False)
    rho: float | None = field(default=None, compare=False)
    model: str = field(default="", compare=False)

    @property
    def key(self) -> tuple[str, str | None]:
        """(phase, form): what the analyser compares on either side of a crossing."""
        return self.phase, self.form

    @property
    def text(self) -> str:
        """The phase in words, with the solid's form ("solid (ice III)")."""
        return phase_text(self.phase, self.form)


@dataclass(frozen=True)
class Leg:
    """One leg of a route: its kind, its end state [K, Pa] and the target as the user wrote it.

    ``state`` is the resolved end state where the leg fixes more than (T, p): a leg that ends on
    a mixture (constant v, h or s) or on an event ("fully vapor"); ``event`` says which event.
    """

    kind: str
    T: float
    p: float
    given: dict[str, Any] = field(default_factory=dict, compare=False)
    state: StatePoint | None = field(default=None, compare=False, repr=False)
    event: str = ""


@dataclass(frozen=True)
class Crossing:
    """One crossing of a phase boundary, in route order.

    ``T`` [K] and ``p`` [Pa] lie on the boundary: on a constant-temperature leg ``p`` is the
    boundary pressure evaluated at the leg's temperature; on a constant-pressure leg ``T`` is the
    boundary temperature at the leg's pressure, found by the root finder on the exact equation,
    so that the boundary pressure at ``T`` equals ``p`` within 1e-9 relative (on the steepest
    branches at very low pressure, where one floating-point step in ``T`` moves the pressure by
    more than that, ``T`` is the float closest to the exact crossing).
    ``latent_heat`` [J/kg] is the (positive) enthalpy of the transition, or None with the reason
    in ``latent_heat_note``. ``method`` and ``evaluations`` say how it was found. ``flag`` says
    what to know about the curve crossed: it is flagged unreliable, or the crossing lies in the
    gap between a published melting curve and the triple point ("" otherwise).
    """

    step: int
    kind: str
    from_phase: str
    to_phase: str
    T: float
    p: float
    latent_heat: float | None
    latent_heat_model: str | None
    latent_heat_note: str
    boundary: str
    method: str
    evaluations: int
    from_form: str | None = None
    to_form: str | None = None
    at_corner: bool = False
    detail: str = ""
    hazards: tuple[Hazard, ...] = ()
    flag: str = ""

    @property
    def from_text(self) -> str:
        return phase_text(self.from_phase, self.from_form)

    @property
    def to_text(self) -> str:
        return phase_text(self.to_phase, self.to_form)

    def describe(self) -> str:
        """One line for a human reader (SI, six significant digits)."""
        return (
            f"leg {self.step}: {self.kind} ({self.from_phase} -> {self.to_phase}) at "
            f"T = {self.T:.6g} K, p = {self.p:.6g} Pa"
        )


@dataclass(frozen=True)
class LegSummary:
    """One leg: its kind, start and end states, and heat and work per kg (reversible).

    Basis: a reversible steady-flow process per kg of substance. ``heat`` = ∫T ds (into the
    substance), ``work`` = ∫v dp (shaft work done on the substance), so ``heat + work = Δh``.
    On a constant-pressure leg heat = Δh and work = 0; on a constant-temperature leg
    heat = T Δs and work = Δh - T Δs. None, with the reason in ``note``, where a model does not
    cover a state of the leg.
    """

    step: int
    kind: str
    start: StatePoint
    end: StatePoint
    heat: float | None
    work: float | None
    note: str = ""
    basis: str = "steady-flow"
    path: tuple[StatePoint, ...] = field(default=(), compare=False, repr=False)
    hazards: tuple[Hazard, ...] = ()
    event: str = ""


class Analysis(Protocol):
    """What an analysed route offers to the renderers (tables, figures, HTML pages): the shape of
    :class:`phasepath.report.Report`, named here so that the renderers need not import it."""

    @property
    def route(self) -> Any: ...  # a phasepath.route.Route

    @property
    def substance(self) -> Any: ...  # a phasepath.substances.Substance

    @property
    def crossings(self) -> Sequence[Crossing]: ...

    @property
    def legs(self) -> Sequence[LegSummary]: ...

    @property
    def notes(self) -> Sequence[str]: ...

    @property
    def cautions(self) -> Sequence[str]: ...


def state_key(s: StatePoint) -> tuple[str, str | None]:
    """(phase, form) of a state."""
    return s.phase, s.form


def phase_text(phase: str, form: str | None) -> str:
    """A phase in words, with the named solid form where there is one."""
    return f"{phase} (ice {form})" if form else phase


_KIND = {
    ("solid", "liquid"): "melting",
    ("liquid", "solid"): "freezing",
    ("liquid", "vapor"): "vaporization",
    ("vapor", "liquid"): "condensation",
    ("solid", "vapor"): "sublimation",
    ("vapor", "solid"): "deposition",
    ("vapor", "supercritical"): "supercritical-entry",
    ("liquid", "supercritical"): "supercritical-entry",
    ("supercritical", "vapor"): "supercritical-exit",
    ("supercritical", "liquid"): "supercritical-exit",
    ("solid", "supercritical"): "melting",
    ("supercritical", "solid"): "freezing",
}


def crossing_kind(from_phase: str, to_phase: str) -> str:
    """Name of the transition from one phase (or mixture on a boundary) to another.

    >>> crossing_kind("vapor", "solid")
    'deposition'
    >>> crossing_kind("liquid+vapor", "solid+vapor")
    'deposition'
    >>> crossing_kind("liquid+vapor", "supercritical")
    'supercritical-entry'
    >>> crossing_kind("solid", "solid")  # one form of the solid to another (water's ices)
    'solid-transition'
    >>> crossing_kind("liquid+vapor", "solid+liquid")  # sealed water at its triple point
    'freezing'
    """
    if from_phase == to_phase == "solid":
        return "solid-transition"
    if (from_phase, to_phase) in _KIND:
        return _KIND[(from_phase, to_phase)]
    b, a = set(from_phase.split("+")), set(to_phase.split("+"))
    if len(a) == 2 and len(b) == 2 and "liquid" in a | b and "solid" in a | b:
        # one mixture to another at the triple point: named for what the liquid does there
        if "liquid" in b and "liquid" not in a:
            return "deposition" if "solid" not in b else "freezing"
        if "liquid" in a and "liquid" not in b:
            return "melting"
        return "freezing" if "solid" in a else "melting"
    if "solid" in a and "vapor" in a and "solid" not in b:
        return "deposition"  # solid now forms beside the vapor (dry-ice snow)
    if "solid" in b and "vapor" in b and "solid" not in a:
        return "sublimation" if "liquid" not in a else "melting"
    lost, gained = b - a, a - b
    if len(lost) == 1 and len(gained) == 1:
        one = (next(iter(lost)), next(iter(gained)))
        if one in _KIND:
            return _KIND[one]
    both = sorted(b | a)
    if len(both) == 2:
        x, y = both
        if (x, y) in _KIND and (y in a - b or x in b - a):
            return _KIND[(x, y)]
        if (y, x) in _KIND:
            return _KIND[(y, x)]
    if "+" in from_phase and to_phase == "supercritical":
        return "supercritical-entry"  # a sealed vessel at the critical density
    if from_phase == "supercritical" and "+" in to_phase:
        return "supercritical-exit"
    raise RouteError(f"no name for a change from {from_phase} to {to_phase}")


_BOUNDARY_OF = {
    "melting": "melting",
    "freezing": "melting",
    "vaporization": "vapor pressure",
    "condensation": "vapor pressure",
    "sublimation": "sublimation",
    "deposition": "sublimation",
    "solid-transition": "solid-solid",
}


def boundary_of(kind: str) -> str:
    """The boundary a crossing of this kind lies on ("vapor pressure" for a condensation)."""
    return _BOUNDARY_OF.get(kind, "critical point region")


def boundary_kind(kind: str) -> str:
    """The kind of boundary (:data:`BOUNDARY_KINDS`) a crossing of this kind lies on, or ""."""
    return {
        "melting": "melting",
        "vapor pressure": "vaporization",
        "sublimation": "sublimation",
    }.get(_BOUNDARY_OF.get(kind, ""), "")


_CHANGES = {
    ("liquid", "liquid+vapor"): "bubble point: vapor starts to form",
    ("liquid+vapor", "vapor"): "dew point: the last liquid has vaporized",
    ("vapor", "liquid+vapor"): "dew point: liquid starts to form",
    ("liquid+vapor", "liquid"): "bubble point: no vapor left (liquid-full)",
    ("liquid+vapor", "solid+vapor"): (
        "triple point: the liquid turns to solid and vapor (latent heat shown: fusion)"
    ),
    ("solid+vapor", "liquid+vapor"): "triple point: the solid melts",
    ("vapor", "solid+vapor"): "solid starts to deposit from the vapor",
    ("solid+vapor", "vapor"): "the last solid has sublimed",
    ("solid", "solid+vapor"): "sublimation starts",
    ("solid+vapor", "solid"): "the last vapor has deposited",
    ("liquid", "solid+liquid"): "freezing starts",
    ("solid+liquid", "liquid"): "the last solid has melted",
    ("solid+liquid", "solid"): "the last liquid has frozen",
    ("solid", "solid+liquid"): "melting starts",
    ("liquid+vapor", "solid+liquid"): (
        "triple point: the liquid starts to freeze and the vapor is gone (latent heat shown: "
        "fusion)"
    ),
    ("solid+liquid", "liquid+vapor"): "triple point: the last solid melts and vapor forms",
    ("solid+liquid", "solid+vapor"): (
        "triple point: the last liquid turns to solid and vapor (latent heat shown: fusion)"
    ),
    ("solid+vapor", "solid+liquid"): "triple point: the solid starts to melt; the vapor is gone",
}


def describe_change(before: str, after: str) -> str:
    """A few words on what happens at a change between phases or mixtures."""
    return _CHANGES.get((before, after), "")
