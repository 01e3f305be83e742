"""Substances: names and aliases, triple and critical points, validity limits, phase regions.

>>> import phasepath as pp
>>> water = pp.substance("water")
>>> water.name, water.triple
('Water', (273.16, 611.6547710699587))
>>> water.phase(298.15, 101325.0), water.phase(650.0, 25e6), water.phase(260.0, 1000.0)
('liquid', 'supercritical', 'solid')
"""

from __future__ import annotations

import difflib
import math
import numbers
import re
import threading
from collections.abc import Mapping
from functools import cache, cached_property, lru_cache
from typing import Any

from . import bibliography
from .boundaries import Boundary
from .eos import EOS, fluid_names
from .errors import NonFiniteError, OutOfRangeError, PhasePathError, UnknownSubstanceError
from .solids import sublimation_curve_for, water_boundaries

__all__ = ["Substance", "substance", "substances", "PHASES", "NO_SUBLIMATION"]

#: The four regions a state can be in.
PHASES = ("solid", "liquid", "vapor", "supercritical")

#: What the diagram and the analyser say below the triple point of a fluid with no published
#: sublimation curve.
NO_SUBLIMATION = "solid or vapor: no published sublimation curve"

# Common names that CoolProp's alias lists do not already hold.
_EXTRA_ALIASES = {
    "water": "Water",
    "steam": "Water",
    "h2o": "Water",
    "carbon dioxide": "CarbonDioxide",
    "carbon monoxide": "CarbonMonoxide",
    "nitrogen": "Nitrogen",
    "argon": "Argon",
    "methane": "Methane",
    "oxygen": "Oxygen",
    "hydrogen": "Hydrogen",
    "helium": "Helium",
    "neon": "Neon",
    "krypton": "Krypton",
    "xenon": "Xenon",
    "ammonia": "Ammonia",
    "propane": "n-Propane",
    "butane": "n-Butane",
    "ethane": "Ethane",
    "ethylene": "Ethylene",
    "ethanol": "Ethanol",
    "methanol": "Methanol",
    "nitrous oxide": "NitrousOxide",
    "sulfur dioxide": "SulfurDioxide",
    "hydrogen sulfide": "HydrogenSulfide",
    "heavy water": "HeavyWater",
    "air": "Air",
}

_TRIPLE_SHIFT_LIMIT = 0.05  # K: temperature offset above which a melting line is flagged unreliable


def _key(text: str) -> str:
    return re.sub(r"[\s\-_,()]+", "", text).lower()


@lru_cache(maxsize=1)
def _alias_map() -> dict[str, str]:
    import CoolProp.CoolProp as CP

    out: dict[str, str] = {}
    for name in fluid_names():
        out[_key(name)] = name
        for alias in CP.get_fluid_param_string(name, "aliases").split(","):
            if alias.strip():
                out.setdefault(_key(alias), name)
    for alias, name in _EXTRA_ALIASES.items():
        if name in out.values():
            out[_key(alias)] = name
    return out


def substances() -> list[str]:
    """Every substance phasepath supports, by its CoolProp name.

    >>> "CarbonDioxide" in substances() and len(substances()) > 100
    True
    """
    return fluid_names()


def substance(name: object) -> Substance:
    """The :class:`Substance` for a name or alias (case-insensitive), or a Substance itself.

    >>> substance("carbon dioxide").name
    'CarbonDioxide'
    >>> substance("Nitrogen") is substance("N2")
    True
    """
    if isinstance(name, Substance):
        return name
    if isinstance(name, Mapping):  # a substance built from data, as saved in a route file
        return Substance.from_dict(name)
    if not isinstance(name, str) or not name.strip():
        raise UnknownSubstanceError(name)
    key = _key(name)
    resolved = _alias_map().get(key)
    if resolved is None:
        from .custom import registered  # substances built from data in this session, by name

        if name.strip() in registered():
            return registered()[name.strip()]
        keys = _alias_map()
        close = difflib.get_close_matches(key, list(keys), n=4, cutoff=0.6)
        names: list[str] = []
        for c in close:
            if keys[c] not in names:
                names.append(keys[c])
        raise UnknownSubstanceError(name, names[:3])
    with _LOADING:  # first use from several threads at once: one Substance, one CoolProp load
        return _coolprop_substance(resolved)


_LOADING = threading.RLock()


@cache
def _coolprop_substance(name: str) -> Substance:
    eos = EOS(name)
    notes: list[str] = []
    T_t, p_t, T_c, p_c = eos.T_triple, eos.p_triple, eos.T_crit, eos.p_crit
    vapor = Boundary("vaporization", "vapor pressure", T_t, T_c, "CoolProp", eos.p_sat, eos.T_sat)
    if name == "Water":
        melting, water_sub = water_boundaries(p_t)
        sublimation: Boundary | None = water_sub
        notes.append(
            "Melting and sublimation from IAPWS R14-08 (CoolProp's water melting line is not used)."
        )
    else:
        melting = _coolprop_melting(eos, notes)
        sublimation = sublimation_curve_for(name, T_t, p_t)
        if not melting and not eos.has_melting_line:
            notes.append(
                "No published melting curve in the reference library: freezing under pressure "
                "above the triple-point temperature is not detected."
            )
        if sublimation is None:
            notes.append(f"Below the triple-point temperature: {NO_SUBLIMATION}.")
    return Substance(
        name=name,
        triple=(T_t, p_t),
        critical=(T_c, p_c),
        T_max=eos.T_max,
        p_max=eos.p_max,
        vapor=vapor,
        melting=tuple(melting),
        sublimation=sublimation,
        notes=tuple(notes),
        eos=eos,
    )


def _coolprop_melting(eos: EOS, notes: list[str]) -> list[Boundary]:
    """CoolProp's melting line as one branch that starts at the EOS triple point.

    Junction rule: the line is shifted by the constant Δp = p_t - p_m(T_t) so that it passes
    through the EOS triple point. Where that shift amounts to more than 0.05 K along the curve
    (|Δp| / (dp_m/dT) at T_t) the branch is flagged unreliable.
    """
    if not eos.has_melting_line:
        return []
    T_lo, T_hi, _, _ = eos.melting_range()
    T_t, p_t = eos.T_triple, eos.p_triple
    T_lo = max(T_lo, T_t)
    try:
        shift = p_t - eos.p_melt(T_t)
        slope = (eos.p_melt(T_t + 0.01) - eos.p_melt(T_t)) / 0.01
    except PhasePathError:
        notes.append(
            f"CoolProp's melting line of {eos.name} cannot be evaluated at the triple point "
            f"({T_t} K): it is not used, so freezing under pressure is not detected."
        )
        return []
    offset_K = abs(shift) / slope if slope > 0 else math.inf
    reliable = offset_K <= _TRIPLE_SHIFT_LIMIT
    note = (
        f"CoolProp's melting line misses the triple point by {-shift:.4g} Pa; shifted to meet it."
    )
    if not reliable:
        notes.append(
            f"The melting line of {eos.name} misses the triple point by {abs(shift):.3g} Pa "
            f"(about {offset_K:.3g} K along the curve): treat melting results as unreliable."
        )

    def p_of_T(T: float) -> float:
        return eos.p_melt(T) + shift

    def T_of_p(p: float) -> float:
        return eos.T_melt(p - shift)

    return [
        Boundary(
            "melting",
            "melting",
            T_lo,
            T_hi,
            "CoolProp",
            p_of_T,
            T_of_p,
            reliable=reliable,
            note=note,
        )
    ]


class Substance:
    """A pure substance: its boundary curves, special points, limits and phase regions.

    Inside, every temperature is in kelvin and every pressure in pascal.

    Attributes
    ----------
    name : str
        The reference library's name (``"CarbonDioxide"``).
    triple, critical : tuple of float
        (T [K], p [Pa]) of the triple point and of the critical point.
    T_min, T_max, p_max : float
        Validity limits of states [K, K, Pa].
    vapor : Boundary
        The vapor-pressure curve, triple point to critical point.
    melting : tuple of Boundary
        Melting branches (water: ice Ih, III, V, VI, VII).
    sublimation : Boundary or None
        The sublimation curve, or None where no published curve exists.
    notes : tuple of str
        Plain-language notes on what the models do not cover.
    source_data : phasepath.custom.SubstanceData or None
        For a substance built by :meth:`from_data`: its inputs, fits and missing pieces.
    """

    source_data: Any = None

    @classmethod
    def from_data(cls, name: str, **data: Any) -> Substance:
        """A substance built from data-sheet numbers: see :func:`phasepath.custom.from_data`."""
        from .custom import from_data

        return from_data(name, **data)

    @classmethod
    def from_dict(cls, data: Mapping[str, Any]) -> Substance:
        """The substance a :meth:`to_dict` mapping describes."""
        from .custom import from_dict

        return from_dict(data)

    def to_dict(self) -> dict[str, Any]:
        """Plain data: ``{"name": ...}``, or the inputs of :meth:`from_data` for such one."""
        from .custom import to_dict

        return to_dict(self)

    def __init__(
        self,
        name: str,
        triple: tuple[float, float],
        critical: tuple[float, float],
        T_max: float,
        p_max: float,
        vapor: Boundary | None,
        melting: tuple[Boundary, ...] = (),
        sublimation: Boundary | None = None,
        notes: tuple[str, ...] = (),
        eos: EOS | None = None,
        T_min: float | None = None,
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
        self.eos = eos
        if T_min is None:
            T_min = sublimation.T_min if sublimation is not None else self.triple[0]
        self.T_min = float(T_min)
        self._melt_top = max(
            (b.T_max for b in self.melting if b.solid_side == "above"), default=None
        )

    def __repr__(self) -> str:
        return f"<Substance {self.name}>"

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
        for b in self.boundaries:
            ts.update((b.T_min, b.T_max))
        return tuple(sorted(ts))

    # -- validity ------------------------------------------------------------------------------
    def check_state(self, T: float, p: float) -> None:
        """Raise a phasepath error unless (T, p) lies where the models are valid."""
        for v, what in ((T, "T"), (p, "p")):
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
                        return "solid", b.solid_form
                    solid = self._solid_above(T, p)
                    return ("solid", solid[1]) if solid else ("liquid", None)
            return "solid", self._deep_solid_form(T, p)
        solid = self._solid_above(T, p)
        if solid:
            return "solid", solid[1]
        T_c, p_c = self.critical
        if T > T_c:
            return ("supercritical" if p > p_c else "vapor"), None
        assert self.vapor is not None
        return ("liquid" if p > self.vapor.p_of_T(T) else "vapor"), None

    def _solid_above(self, T: float, p: float) -> tuple[bool, str | None] | None:
        for b in self.melting:
            if b.solid_side == "above" and b.T_min <= T <= b.T_max and p > b.p_of_T(T):
                return True, b.solid_form
        return None

    def _deep_solid_form(self, T: float, p: float) -> str | None:
        """Name of the solid below every melting branch (water: ice Ih up to the Ih-III line)."""
        if self.name == "Water" and p <= 208.566e6:
            return "Ih"
        return None

    def sources(self) -> list[str]:
        """Full citations of the sources behind this substance's curves."""
        ids: list[str] = []
        for b in self.boundaries:
            if b.source not in ids:
                ids.append(b.source)
        return [bibliography.cite(i) for i in ids]
