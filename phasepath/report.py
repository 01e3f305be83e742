"""The report of an analysed route: crossings, leg summaries, notes and cautions.

A :class:`Report` holds what :func:`phasepath.analysis.analyze` found; its tables and HTML view
come from the one table definition in :mod:`phasepath.tables`.
"""

from __future__ import annotations

import html
from dataclasses import asdict
from typing import TYPE_CHECKING, Any

from . import fileio, htmlreport, tables
from .format import DisplayUnits
from .paths import route_path
from .records import CROSSING_KINDS, Crossing, Hazard, LegSummary, StatePoint
from .substances import Substance

if TYPE_CHECKING:  # pragma: no cover
    from datetime import datetime

    import numpy as np
    import pandas as pd

    from .route import Route

__all__ = ["Report", "Crossing", "StatePoint", "LegSummary", "Hazard", "CROSSING_KINDS"]


class Report:
    """The analysed route.

    Attributes
    ----------
    route : Route
    substance : Substance
    crossings : list of Crossing
        In route order.
    legs : list of LegSummary
        One per leg.
    notes : list of str
        What the models do not cover, site notes, data-range warnings.
    cautions : tuple of str
        Each flagged hazard once, in route order, with its caution, then the substance's own
        cautions (:func:`phasepath.hazards.cautions`): what every surface shows.
    """

    def __init__(
        self,
        route: Route,
        crossings: list[Crossing],
        legs: list[LegSummary],
        notes: list[str],
        cautions: tuple[str, ...] = (),
    ) -> None:
        self.route = route
        self.substance: Substance = route.substance
        self.crossings = list(crossings)
        self.legs = list(legs)
        self.notes = list(notes)
        self.cautions = tuple(cautions)

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

    __hash__ = None  # type: ignore[assignment]

    # -- tables --------------------------------------------------------------------------------
    def table(
        self, T_unit: str = "K", p_unit: str = "Pa", energy_unit: str = "kJ/kg"
    ) -> pd.DataFrame:
        """One row per crossing, numbers in the display units (named in the column headers).

        Parameters
        ----------
        T_unit : {"K", "degC", "degF"}
        p_unit : {"Pa", "kPa", "bar", "MPa", "psi", "atm"}
        energy_unit : {"J/kg", "kJ/kg", "Btu/lb"}
        """
        units = DisplayUnits(T_unit, p_unit, energy_unit)
        return tables.frame(tables.CROSSINGS, self.crossings, units)

    def legs_table(
        self, T_unit: str = "K", p_unit: str = "Pa", energy_unit: str = "kJ/kg"
    ) -> pd.DataFrame:
        """One row per leg: kind, start and end states, fractions, heat and work per kg."""
        units = DisplayUnits(T_unit, p_unit, energy_unit)
        return tables.frame(tables.LEGS, self.legs, units)

    def path(self, view: str = "pT") -> tuple[np.ndarray, np.ndarray]:
        """The route's path in a view, as SI arrays ``(x, y)``: ``"pT"`` (T [K], p [Pa]),
        ``"ph"`` (h [J/kg], p [Pa]) or ``"Ts"`` (s [J/(kg K)], T [K]); curved legs along their
        true path, every corner and crossing a point of it (:func:`phasepath.paths.route_path`).

        >>> import phasepath as pp
        >>> rep = pp.Route("water", T="20 degC", p="1 atm").isobar(T="120 degC").analyze()
        >>> h, p = rep.path("ph")      # an isobar: constant p, across the dome at 100 degC
        >>> bool((p == 101325.0).all()), round(float(max(h[1:] - h[:-1])) / 1e3, 1)
        (True, 2256.5)

        The widest step is the boiling at 1 atm: 2256.5 kJ/kg (IAPWS-95 steam tables; from
        memory).
        """
        return route_path(self.substance, self.legs, self.crossings, view)

    def to_dict(self) -> dict[str, Any]:
        """Plain data (SI, full precision) for JSON output and regression files."""
        return {
            "substance": self.substance.name,
            "crossings": [asdict(c) for c in self.crossings],
            "legs": [asdict(leg) for leg in self.legs],
            "notes": list(self.notes),
            "cautions": list(self.cautions),
        }

    # -- the HTML report -------------------------------------------------------------------------
    def to_html(
        self,
        T_unit: str = "degC",
        p_unit: str = "bar",
        energy_unit: str = "kJ/kg",
        *,
        title: str | None = None,
        route_file: object = None,
        when: datetime | None = None,
    ) -> str:
        """The review-ready report as one self-contained HTML page (no network): diagram, tables,
        hazard flags, cautions, models and sources, provenance; see :mod:`phasepath.htmlreport`.

        ``route_file``: the route file the route came from (its SHA-256 is recorded); ``when``:
        the date and time to record (default now, UTC).
        """
        units = DisplayUnits(T_unit, p_unit, energy_unit)
        return htmlreport.report_html(self, units, title=title, route_file=route_file, when=when)

    def save_html(
        self,
        path: object,
        T_unit: str = "degC",
        p_unit: str = "bar",
        energy_unit: str = "kJ/kg",
        *,
        title: str | None = None,
        route_file: object = None,
        when: datetime | None = None,
    ) -> None:
        """Write :meth:`to_html` (same options) to ``path`` atomically (a failed write leaves
        an existing file as it was)."""
        text = self.to_html(
            T_unit, p_unit, energy_unit, title=title, route_file=route_file, when=when
        )
        fileio.write_text(path, text)

    def _repr_html_(self) -> str:
        units = DisplayUnits("K", "bar", "kJ/kg")
        title = html.escape(self.route.title or f"Route for {self.substance.name}")
        parts = [f"<div class='phasepath-report'><h4>{title}</h4>"]
        if self.crossings:
            parts.append(tables.html_table(tables.CROSSINGS, self.crossings, units))
        else:
            parts.append("<p>No phase boundary is crossed.</p>")
        parts.append(tables.html_table(tables.LEGS, self.legs, units))
        for head, items in (("Cautions", self.cautions), ("Notes", self.notes)):
            if items:
                lis = "".join(f"<li>{html.escape(n)}</li>" for n in items)
                parts.append(f"<p><b>{head}</b></p><ul>{lis}</ul>")
        parts.append("</div>")
        return "".join(parts)
