"""The Substance: its boundary curves, special points, validity limits, phase regions and the
models it carries (fluid, solid, latent heat).

A substance is built once, by :mod:`phasepath.reference` (a CoolProp fluid) or by
:mod:`phasepath.datasheet` (numbers from a data sheet), and found by name through
:mod:`phasepath.catalog`. What it can compute is given by the model objects it carries; no code
asks a substance its name to decide what to compute.

>>> import phasepath as pp
>>> water = pp.substance("water")
>>> water.name, water.triple
('Water', (273.16, 611.6547710699587))
>>> water.phase(298.15, 101325.0), water.phase(650.0, 25e6), water.phase(260.0, 1000.0)
('liquid', 'supercritical', 'solid')
"""

from __future__ import annotations

import json
import math
import numbers
from collections.abc import Mapping
from functools import cached_property
from typing import Any

from . import bibliography
from .boundaries import Boundary
from .errors import NonFiniteError, OutOfRangeError, PhasePathError
from .records import PHASES
from .rootfind import find_root

__all__ = ["Substance", "PHASES", "NO_SUBLIMATION", "NO_MELTING"]

#: What the diagram and the analyser say below the triple point of a fluid with no published
#: sublimation curve.
NO_SUBLIMATION = "solid or vapor: no published sublimation curve"
#: What they say below the triple-point temperature and above the triple-point pressure of a
#: fluid with no published melting curve.
NO_MELTING = "solid or liquid: no published melting curve"
_JUNCTION_REACH = 0.05  # K: a melting branch starting this close to T_t joins the triple point


class Substance:
    """A pure substance: its boundary curves, special points, limits, phase regions and models.

    Inside, every temperature is in kelvin and every pressure in pascal.

    Attributes
    ----------
    name : str
        The reference library's name (``"CarbonDioxide"``), or the name given to a substance
        built from data.
    triple, critical : tuple of float
        (T [K], p [Pa]) of the triple point and of the critical point (NaN where a substance
        built from data lacks one).
    T_min, T_max, p_max : float
        Validity limits of states [K, K, Pa].
    vapor : Boundary
        The vapor-pressure curve, triple point to critical point.
    melting : tuple of Boundary
        Melting branches (water: ice Ih, III, V, VI, VII).
    sublimation : Boundary or None
        The sublimation curve, or None where no published curve exists.
    solid_boundaries : tuple of Boundary
        Boundaries between two forms of the solid (water's ices: Dunaeva et al. 2010), kind
        "solid-solid"; crossed by isobars and isotherms as solid-transition crossings.
    fluid : object
        The fluid model: the reference equation of state (:class:`phasepath.eos.EOS`), or a
        model that says why there is none (:class:`phasepath.models.NoFluidModel`).
    solids : phasepath.models.SolidModel
        What phasepath knows of the solid: its name, its forms, its published model if any.
    latent : phasepath.models.LatentHeatModel
        How latent heats are computed.
    notes : tuple of str
        Plain-language notes on what the models do not cover.
    source_data : phasepath.datasheet.SubstanceData or None
        For a substance built from data: its inputs, fits and missing pieces.
    safety_group : str or None
        Its safety group in ANSI/ASHRAE Standard 34 ("A1", "A3", "B2"...), where the reference
        library gives one.
    """

    def __init__(
        self,
        name: str,
        *,
        triple: tuple[float, float],
        critical: tuple[float, float],
        T_max: float,
        p_max: float,
        vapor: Boundary | None,
        fluid: Any,
        solids: Any,
        latent: Any,
        melting: tuple[Boundary, ...] = (),
        sublimation: Boundary | None = None,
        notes: tuple[str, ...] = (),
        T_min: float | None = None,
        source_data: Any = None,
        safety_group: str | None = None,
        solid_boundaries: tuple[Boundary, ...] = (),
    ) -> None:
        self.name = name
        self.triple = (float(triple[0]), float(triple[1]))
        self.critical = (float(critical[0]), float(critical[1]))
        self.T_max = float(T_max)
        self.p_max = float(p_max)
        self.vapor = vapor
        self.melting = tuple(melting)
        self.sublimation = sublimation
        self.notes = tuple(notes)
        self.fluid = fluid
        self.solids = solids
        self.latent = latent
        self.source_data = source_data
        self.safety_group = safety_group
        self.solid_boundaries = tuple(solid_boundaries)
        if T_min is None:
            T_min = sublimation.T_min if sublimation is not None else self.triple[0]
        self.T_min = float(T_min)
        self._melt_top = max(
            (b.T_max for b in self.melting if b.solid_side == "above"), default=None
        )
        self._melt_start, self._liquid_from = self._junction()

    def __repr__(self) -> str:
        return f"<Substance {self.name}>"

    # -- how the substance is written down ---------------------------------------------------
    @classmethod
    def from_data(cls, name: str, **data: Any) -> Substance:
        """A substance built from data-sheet numbers: see :func:`phasepath.datasheet.from_data`."""
        from .catalog import from_data  # facade: the catalog registers it by name

        return from_data(name, **data)

    @classmethod
    def from_dict(cls, data: Mapping[str, Any]) -> Substance:
        """The substance a :meth:`to_dict` mapping describes."""
        from .catalog import from_dict  # facade

        return from_dict(data)

    def to_dict(self) -> dict[str, Any]:
        """Plain data: ``{"name": ...}``, or the inputs of :meth:`from_data` for such a one."""
        if self.source_data is None:
            return {"name": self.name}
        return json.loads(json.dumps(self.source_data.recipe))

    @property
    def named(self) -> bool:
        """True where the name alone finds this substance again (a reference substance)."""
        return self.source_data is None

    # -- curves -------------------------------------------------------------------------------
    @cached_property
    def boundaries(self) -> tuple[Boundary, ...]:
        """Every boundary branch: vapor pressure, melting branches, sublimation."""
        out = [self.vapor] if self.vapor is not None else []
        out += list(self.melting)
        if self.sublimation is not None:
            out.append(self.sublimation)
        return tuple(out)

    @property
    def has_sublimation(self) -> bool:
        return self.sublimation is not None

    @cached_property
    def junction_temperatures(self) -> tuple[float, ...]:
        """Temperatures where branches start or end (the triple and critical points among them).

        A constant-pressure leg through one of these may change phase there even where two
        branches do not quite meet; the analyser tests each of them.
        """
        ts = {self.triple[0], self.critical[0]}
        for b in (*self.boundaries, *self.solid_boundaries):
            ts.update((b.T_min, b.T_max))
        return tuple(sorted(ts))

    def melting_temperature(self, p: float) -> tuple[float, str | None] | None:
        """Highest melting temperature at pressure p [Pa] and the solid's form, or None.

        Between the triple-point pressure and the start of a melting curve that does not pass
        through the triple point (see :meth:`melting_gap`), the temperature where the curve
        starts: there the solid-liquid boundary is the isotherm at the curve's start, or, below
        the vapor-pressure curve, the solid meets the vapor directly.
        """
        best: tuple[float, str | None] | None = None
        for b in self.melting:
            for r in b.temperatures_at(p):
                if best is None or r.root > best[0]:
                    best = (r.root, b.solid_form)
        start = self._melt_start
        if best is None and start is not None and self.triple[1] < p <= start[1]:
            best = (start[0], start[2])
        return best

    def melting_gap(self) -> str:
        """How the melting curve meets the triple point, in words ("" where it passes through).

        >>> import phasepath as pp
        >>> pp.substance("water").melting_gap()  # doctest: +ELLIPSIS
        'the published melting curve starts at 273.16 K and 611.657 Pa...'
        """
        start = self._melt_start
        if start is None:
            return ""
        T0, p0, _ = start
        T_t, p_t = self.triple
        if T0 == T_t and p0 == p_t:
            return ""
        text = (
            f"the published melting curve starts at {T0:.6g} K and {p0:.6g} Pa, not at the "
            f"triple point of the equation of state ({T_t:.6g} K, {p_t:.6g} Pa)"
        )
        if self._liquid_from > T_t:
            text += (
                f"; from the triple point to {self._liquid_from - T_t:.3g} K above it the solid "
                "meets the vapor along the vapor-pressure curve"
            )
        if p0 > p_t and T0 == T_t:
            text += (
                f"; between {p_t:.6g} Pa and {p0:.6g} Pa the solid-liquid boundary is the "
                f"isotherm T = {T0:.6g} K"
            )
        return text

    @property
    def melting_start(self) -> tuple[float, float, str | None] | None:
        """(T [K], p [Pa], form) where the melting curve at the triple point starts, or None."""
        return self._melt_start

    @property
    def liquid_from(self) -> float:
        """The temperature [K] from which liquid exists above the vapor-pressure curve (the
        triple point, or higher where a melting curve starts below or after it)."""
        return self._liquid_from

    def in_solid_strip(self, T: float) -> bool:
        """True for a temperature from the triple point up to where a melting curve that starts
        below the vapor-pressure curve (or above the triple-point temperature) rises through it:
        there no liquid exists, and the solid meets the vapor on the vapor-pressure curve."""
        return self.triple[0] <= T < self._liquid_from

    def in_melting_gap(self, T: float, p: float) -> bool:
        """True where (T, p) lies on the explicit part of the solid boundary between a published
        melting curve and the triple point (see :meth:`melting_gap`), within 1e-9."""
        start = self._melt_start
        if start is None:
            return False
        T0, p0, _ = start
        T_t, p_t = self.triple
        tol = 1e-9
        if abs(T - T0) <= tol * T0 and p_t * (1 - tol) <= p <= p0 * (1 + tol) and p0 > p_t:
            return True  # the isotherm below the curve's start
        return T_t * (1 - tol) <= T <= self._liquid_from * (1 + tol) and self._liquid_from > T_t

    def _junction(self) -> tuple[tuple[float, float, str | None] | None, float]:
        """(T0, p0, form) where the lowest melting branch with solid above starts, and the
        temperature from which liquid exists above the vapor-pressure curve."""
        T_t, p_t = self.triple
        if not (math.isfinite(T_t) and math.isfinite(p_t)) or self.vapor is None:
            return None, T_t
        near = _JUNCTION_REACH
        for b in self.melting:  # a branch with the solid below it ending at the triple point
            if b.solid_side == "below" and abs(b.T_max - T_t) <= near:
                p0 = b.p_of_T(b.T_max)
                return ((b.T_max, p0, b.solid_form) if p0 >= p_t else None), T_t
        above = [b for b in self.melting if b.solid_side == "above" and abs(b.T_min - T_t) <= near]
        if not above:
            return None, T_t
        b = min(above, key=lambda b: b.T_min)
        T0 = b.T_min
        try:
            p0 = b.p_of_T(T0)
            p_floor = self.vapor.p_of_T(T0) if self.vapor.T_min <= T0 <= self.vapor.T_max else p_t
        except PhasePathError:  # pragma: no cover - a curve that cannot be evaluated at its start
            return None, T_t
        if p0 >= p_floor:
            return (T0, p0, b.solid_form), T0
        # the curve starts below the vapor-pressure curve: liquid exists only from where it
        # rises through it
        vapor = self.vapor

        def gap(T: float) -> float:
            return b.p_of_T(T) - vapor.p_of_T(T)

        hi = min(b.T_max, vapor.T_max)
        try:
            T_x = find_root(
                gap, T0, hi, what=f"the melting curve of {self.name} meeting its vapor pressure"
            ).root
        except PhasePathError:  # pragma: no cover - a melting curve under the vapor curve
            return None, T_t
        return (T0, p0, b.solid_form), T_x

    def sources(self) -> list[str]:
        """Full citations of the sources behind this substance's curves and models."""
        ids: list[str] = []
        for b in self.boundaries:
            if b.source not in ids:
                ids.append(b.source)
        for source in getattr(self.solids, "sources", ()):
            if source not in ids:
                ids.append(source)
        return [bibliography.cite(i) for i in ids]

    # -- validity ------------------------------------------------------------------------------
    def valid_range(self, what: str = "T") -> str:
        """The valid range of T or p, in words ("Water: valid T 50 K to 2000 K")."""
        if what == "T":
            return f"{self.name}: valid T {self.T_min:g} K to {self.T_max:g} K"
        return f"{self.name}: valid p above 0 Pa, up to {self.p_max:.6g} Pa"

    def check_state(self, T: float, p: float) -> None:
        """Raise a phasepath error unless (T, p) lies where the models are valid."""
        for v, what in ((T, "T"), (p, "p")):
            if type(v) is float and v - v == 0.0:  # the common case: a finite float
                continue
            if not isinstance(v, numbers.Real) or isinstance(v, bool) or not math.isfinite(v):
                raise NonFiniteError(
                    f"{what} = {v!r} is not a finite number ({self.name}: "
                    f"valid T {self.T_min:g} K to {self.T_max:g} K, "
                    f"p above 0 Pa, up to {self.p_max:.6g} Pa)"
                )
        if T <= 0.0:
            raise OutOfRangeError(
                f"T = {T!r} K is not above absolute zero ({self.name}: "
                f"valid {self.T_min:g} K to {self.T_max:g} K)"
            )
        if p <= 0.0:
            raise OutOfRangeError(
                f"p = {p!r} Pa is not positive ({self.name}: valid above 0 Pa, "
                f"up to {self.p_max:.6g} Pa)"
            )
        if T > self.T_max:
            raise OutOfRangeError(
                f"T = {T!r} K is above the highest temperature the models of {self.name} cover: "
                f"valid {self.T_min:g} K to {self.T_max:g} K"
            )
        if p > self.p_max:
            raise OutOfRangeError(
                f"p = {p!r} Pa is above the highest pressure the models of {self.name} cover: "
                f"valid up to {self.p_max:.6g} Pa"
            )
        if T < self.T_min:
            if self.sublimation is None and T < self.triple[0]:
                raise OutOfRangeError(
                    f"T = {T!r} K is below the triple point of {self.name} ({self.triple[0]} K): "
                    f"{NO_SUBLIMATION}; valid {self.T_min:g} K to {self.T_max:g} K"
                )
            raise OutOfRangeError(
                f"T = {T!r} K is below the lowest temperature the models of {self.name} cover: "
                f"valid {self.T_min:g} K to {self.T_max:g} K"
            )
        if not self.melting and T < self.triple[0] and p > self.triple[1]:
            raise OutOfRangeError(
                f"T = {T!r} K, p = {p!r} Pa lies below the triple-point temperature of "
                f"{self.name} ({self.triple[0]:g} K) and above its triple-point pressure "
                f"({self.triple[1]:.6g} Pa): {NO_MELTING}"
            )
        if self._melt_top is not None and T > self._melt_top:
            top = max(self.melting, key=lambda b: b.T_max)
            p_top = top.p_of_T(top.T_max)
            if p > p_top:
                raise OutOfRangeError(
                    f"p = {p!r} Pa at T = {T!r} K lies beyond the end of the melting curve of "
                    f"{self.name} ({top.T_max:g} K, {p_top:.6g} Pa): solid or fluid is not known"
                )

    # -- regions -------------------------------------------------------------------------------
    def phase(self, T: float, p: float) -> str:
        """The region of (T [K], p [Pa]): "solid", "liquid", "vapor" or "supercritical".

        Above the critical temperature and below the critical pressure is "vapor"; below the
        critical temperature, above the vapor-pressure curve and short of freezing is "liquid".
        """
        return self.classify(T, p)[0]

    def classify(self, T: float, p: float) -> tuple[str, str | None]:
        """(phase, solid form) of a state; the form names water's ice, else None."""
        self.check_state(T, p)
        T_t = self.triple[0]
        if T < T_t:
            sub = self.sublimation
            if sub is None:  # pragma: no cover - check_state refuses these
                raise OutOfRangeError(f"T = {T!r} K, p = {p!r} Pa: {NO_SUBLIMATION}")
            if p < sub.p_of_T(T):
                return "vapor", None
            for b in self.melting:
                if b.solid_side == "below" and b.T_min <= T <= b.T_max:
                    if p <= b.p_of_T(T):
                        return "solid", self.form_of_solid(T, p, b.solid_form)
                    above = self._solid_above(T, p)
                    if above is None:
                        return "liquid", None
                    return "solid", self.form_of_solid(T, p, above.solid_form)
            return "solid", self.solids.form_at(T, p)
        vapor = self.vapor
        T_c, p_c = self.critical
        if vapor is not None and not T > T_c and p <= vapor.p_of_T(T):
            return "vapor", None  # below the vapor-pressure curve, whatever a melting line says
        if T < self._liquid_from:  # the gap below a melting curve's start: no liquid here
            start = self._melt_start
            return "solid", self.solids.form_at(T, p) if start is None else start[2]
        above = self._solid_above(T, p)
        if above is not None:
            return "solid", self.form_of_solid(T, p, above.solid_form)
        if T > T_c:
            return ("supercritical" if p > p_c else "vapor"), None
        if vapor is not None:  # above the vapor-pressure curve (checked above)
            return "liquid", None
        return self.fluid_phase(T, p), None

    def form_of_solid(self, T: float, p: float, branch_form: str | None) -> str | None:
        """The form of the solid at (T, p): the solid model's one naming function where it names
        forms (water's ices), else the melting branch's."""
        if branch_form is None:
            return self.solids.form_at(T, p)
        named = self.solids.form_at(T, p)
        return named if named is not None else branch_form

    def fluid_phase(self, T: float, p: float) -> str:
        """The fluid region of (T, p), the solid left aside: "liquid", "vapor" or
        "supercritical" (below the triple-point temperature: vapor below the triple-point
        pressure, else liquid)."""
        T_c, p_c = self.critical
        if T > T_c:
            return "supercritical" if p > p_c else "vapor"
        if not T < self.triple[0] and self.vapor is not None:  # (a triple point may be unknown)
            return "liquid" if p > self.vapor.p_of_T(T) else "vapor"
        return "liquid" if p > self.triple[1] else "vapor"

    def _solid_above(self, T: float, p: float) -> Boundary | None:
        """The melting branch (T, p) lies above on its solid side, else None."""
        for b in self.melting:
            if b.solid_side == "above" and b.T_min <= T <= b.T_max and p > b.p_of_T(T):
                return b
        return None
