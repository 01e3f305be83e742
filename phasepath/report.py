"""The report of an analysed route: crossings, leg summaries, a table and an HTML view."""

from __future__ import annotations

import html
from dataclasses import asdict, dataclass, field
from typing import TYPE_CHECKING, Any

from .units import convert

if TYPE_CHECKING:  # pragma: no cover
    import pandas as pd

    from .route import Route
    from .substances import Substance

__all__ = [
    "Crossing",
    "StatePoint",
    "LegSummary",
    "Hazard",
    "Report",
    "CROSSING_KINDS",
    "UNIT_LABELS",
]

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
)

#: How each display unit is written in column headers.
UNIT_LABELS = {
    "degC": "°C",
    "degF": "°F",
    "K": "K",
    "Pa": "Pa",
    "kPa": "kPa",
    "bar": "bar",
    "MPa": "MPa",
    "psi": "psi",
    "atm": "atm",
    "J/kg": "J/kg",
    "kJ/kg": "kJ/kg",
    "Btu/lb": "Btu/lb",
}


@dataclass(frozen=True)
class Hazard:
    """A hazard flag on a leg or a crossing: what, why, and the caution that goes with it."""

    kind: str
    reason: str
    caution: str


@dataclass(frozen=True)
class Crossing:
    """One crossing of a phase boundary, in route order.

    ``T`` [K] and ``p`` [Pa] lie on the boundary: on a constant-temperature leg ``p`` is the
    boundary pressure evaluated at the leg's temperature; on a constant-pressure leg ``T`` is the
    boundary temperature at the leg's pressure, found directly or by ``brentq`` on the exact
    equation, so that the boundary pressure at ``T`` equals ``p`` within 1e-9 relative (on the
    steepest branches at very low pressure, where one floating-point step in ``T`` moves the
    pressure by more than that, ``T`` is the float closest to the exact crossing).
    ``latent_heat`` [J/kg] is the (positive) enthalpy of the transition, or None with the reason
    in ``latent_heat_note``.
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

    def describe(self) -> str:
        """One line for a human reader."""
        return (
            f"leg {self.step}: {self.kind} ({self.from_phase} -> {self.to_phase}) at "
            f"T = {self.T:.6g} K, p = {self.p:.6g} Pa"
        )


@dataclass(frozen=True)
class StatePoint:
    """A state on the route.

    ``phase`` is one of the four regions, or a mixture on a boundary ("liquid+vapor",
    "solid+vapor", "solid+liquid") reached on a constant-volume, -enthalpy or -entropy leg.
    ``vapor_fraction`` and ``solid_fraction`` are mass fractions, None for a single phase.
    ``h`` [J/kg], ``s`` [J/(kg K)] and ``rho`` [kg/m3] are None where no model covers the state
    (the reason is in ``model``).
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


class Report:
    """The analysed route: ``crossings`` (route order), ``legs`` (one per leg) and notes."""

    def __init__(
        self, route: Route, crossings: list[Crossing], legs: list[LegSummary], notes: list[str]
    ) -> None:
        self.route = route
        self.substance: Substance = route.substance
        self.crossings = list(crossings)
        self.legs = list(legs)
        self.notes = list(notes)

    def __repr__(self) -> str:
        return (
            f"<Report {self.substance.name}: {len(self.legs)} legs, "
            f"{len(self.crossings)} crossings>"
        )

    def __eq__(self, other: object) -> bool:
        return (
            isinstance(other, Report)
            and self.crossings == other.crossings
            and self.legs == other.legs
        )

    # -- tables --------------------------------------------------------------------------------
    def table(
        self, T_unit: str = "K", p_unit: str = "Pa", energy_unit: str = "kJ/kg"
    ) -> pd.DataFrame:
        """One row per crossing, with the units in the column names.

        Parameters
        ----------
        T_unit : {"K", "degC", "degF"}
        p_unit : {"Pa", "kPa", "bar", "MPa", "psi", "atm"}
        energy_unit : {"J/kg", "kJ/kg", "Btu/lb"}
        """
        import pandas as pd

        tl, pl, el = _labels(T_unit, p_unit, energy_unit)
        rows = []
        for c in self.crossings:
            rows.append(
                {
                    "leg": c.step,
                    "kind": c.kind,
                    "from": _phase_text(c.from_phase, c.from_form),
                    "to": _phase_text(c.to_phase, c.to_form),
                    f"T [{tl}]": convert(c.T, "K", T_unit, "temperature"),
                    f"p [{pl}]": convert(c.p, "Pa", p_unit, "pressure"),
                    f"latent heat [{el}]": (
                        None
                        if c.latent_heat is None
                        else convert(c.latent_heat, "J/kg", energy_unit, "energy")
                    ),
                    "boundary": c.boundary,
                    "latent heat model": c.latent_heat_model or c.latent_heat_note,
                    "detail": c.detail,
                    "hazards": "; ".join(h.kind for h in c.hazards),
                }
            )
        cols = [
            "leg",
            "kind",
            "from",
            "to",
            f"T [{tl}]",
            f"p [{pl}]",
            f"latent heat [{el}]",
            "boundary",
            "latent heat model",
            "detail",
            "hazards",
        ]
        return pd.DataFrame(rows, columns=cols)

    def legs_table(
        self, T_unit: str = "K", p_unit: str = "Pa", energy_unit: str = "kJ/kg"
    ) -> pd.DataFrame:
        """One row per leg: kind, start and end states, heat and work per kg."""
        import pandas as pd

        tl, pl, el = _labels(T_unit, p_unit, energy_unit)

        def e(v: float | None) -> float | None:
            return None if v is None else convert(v, "J/kg", energy_unit, "energy")

        rows = []
        for leg in self.legs:
            rows.append(
                {
                    "leg": leg.step,
                    "kind": leg.kind,
                    f"T start [{tl}]": convert(leg.start.T, "K", T_unit, "temperature"),
                    f"p start [{pl}]": convert(leg.start.p, "Pa", p_unit, "pressure"),
                    "phase start": _phase_text(leg.start.phase, leg.start.form),
                    f"T end [{tl}]": convert(leg.end.T, "K", T_unit, "temperature"),
                    f"p end [{pl}]": convert(leg.end.p, "Pa", p_unit, "pressure"),
                    "phase end": _phase_text(leg.end.phase, leg.end.form),
                    "vapor fraction end": leg.end.vapor_fraction,
                    "solid fraction end": leg.end.solid_fraction,
                    f"heat [{el}]": e(leg.heat),
                    f"work [{el}]": e(leg.work),
                    "hazards": "; ".join(f"{h.kind}: {h.reason}" for h in leg.hazards),
                    "note": leg.note if not leg.event else f"{leg.event}; {leg.note}",
                }
            )
        return pd.DataFrame(rows)

    def to_dict(self) -> dict[str, Any]:
        """Plain data (SI) for JSON output and regression files."""
        return {
            "substance": self.substance.name,
            "crossings": [asdict(c) for c in self.crossings],
            "legs": [asdict(leg) for leg in self.legs],
            "notes": list(self.notes),
        }

    def _repr_html_(self) -> str:
        title = html.escape(self.route.title or f"Route for {self.substance.name}")
        parts = [f"<div class='phasepath-report'><h4>{title}</h4>"]
        if self.crossings:
            parts.append(self.table("K", "bar").to_html(index=False, float_format=_fmt, na_rep="—"))
        else:
            parts.append("<p>No phase boundary is crossed.</p>")
        parts.append(
            self.legs_table("K", "bar").to_html(index=False, float_format=_fmt, na_rep="—")
        )
        if self.notes:
            parts.append(
                "<ul>" + "".join(f"<li>{html.escape(n)}</li>" for n in self.notes) + "</ul>"
            )
        parts.append("</div>")
        return "".join(parts)


def _fmt(x: float) -> str:
    return f"{x:.6g}"


def _labels(T_unit: str, p_unit: str, energy_unit: str) -> tuple[str, str, str]:
    from .errors import UnitError
    from .units import ENERGY_UNITS, PRESSURE_UNITS, TEMPERATURE_UNITS

    for u, allowed, what in (
        (T_unit, TEMPERATURE_UNITS, "temperature"),
        (p_unit, PRESSURE_UNITS, "pressure"),
        (energy_unit, ENERGY_UNITS, "energy"),
    ):
        if u not in allowed:
            raise UnitError(
                f"display unit {u!r} for {what} is not offered; choose one of {', '.join(allowed)}"
            )
    return UNIT_LABELS[T_unit], UNIT_LABELS[p_unit], UNIT_LABELS[energy_unit]


def _phase_text(phase: str, form: str | None) -> str:
    return f"{phase} (ice {form})" if form else phase
