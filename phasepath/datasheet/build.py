"""Assembling a substance from data-sheet numbers: :func:`from_data`.

Each step is a function of its own, in the order the diagram is built: the inputs kept as given
(the recipe), the vapor-pressure curve (:mod:`.curves`), the triple point, the vapor-pressure
boundary with its bridges, the limits, the melting line, the sublimation curve, and the
Substance with its models (no equation of state; approximate latent heats by
Clausius-Clapeyron, :class:`phasepath.models.ClausiusClapeyron`).
"""

from __future__ import annotations

import math
from collections.abc import Mapping, Sequence
from dataclasses import dataclass, field
from typing import Any

from ..boundaries import Boundary
from ..correlations import vapor_pressure as vp
from ..errors import OutOfRangeError, PhasePathError
from ..models import ClausiusClapeyron, NoFluidModel, NoSolidModel
from ..substances import NO_SUBLIMATION, Substance
from . import curves as C
from . import inputs as I
from .fits import VaporFit

__all__ = ["from_data", "SubstanceData", "P_MAX_DEFAULT", "SUBLIMATION_FLOOR"]

#: Default highest pressure of a substance built from data [Pa] (no equation of state limits it).
P_MAX_DEFAULT = 100e6
#: Default lowest temperature of a sublimation curve, as a fraction of the triple-point temperature.
SUBLIMATION_FLOOR = 0.8


@dataclass(frozen=True)
class SubstanceData:
    """What a substance built from data rests on (``Substance.source_data``).

    Attributes
    ----------
    recipe : dict
        The inputs given to :func:`from_data`, as plain data (``to_dict`` output).
    fits : dict of str -> VaporFit
        ``"vapor"``: the fit that defines the vapor-pressure curve (if it was fitted);
        ``"clausius-clapeyron"``: the two-parameter fit of the same points, for comparison.
    molar_mass : float or None
        [kg/mol]; without it latent heats are not given per kilogram.
    enthalpy_fusion, enthalpy_sublimation : float or None
        [J/mol], given or derived at the triple point (see notes).
    missing : tuple of str
        The pieces not given, in plain words.
    """

    recipe: dict[str, Any]
    fits: dict[str, VaporFit] = field(default_factory=dict)
    molar_mass: float | None = None
    enthalpy_fusion: float | None = None
    enthalpy_sublimation: float | None = None
    missing: tuple[str, ...] = ()


@dataclass
class _Draft:
    """What the steps of :func:`from_data` fill in, in order."""

    name: str
    given: dict[str, Any]
    notes: list[str] = field(default_factory=list)
    missing: list[str] = field(default_factory=list)
    fits: dict[str, VaporFit] = field(default_factory=dict)
    T_t: float | None = None
    p_t: float | None = None
    T_c: float | None = None
    p_c: float | None = None


def from_data(
    name: str,
    *,
    triple: Sequence[object] | None = None,
    critical: Sequence[object] | None = None,
    vapor_points: Sequence[Sequence[object]] | None = None,
    antoine: Mapping[str, Any] | None = None,
    wagner: Mapping[str, Any] | None = None,
    normal_boiling_point: object = None,
    enthalpy_vaporization: object = None,
    molar_mass: object = None,
    melting_point: object = None,
    melting_slope: float | None = None,
    simon_glatzel: Mapping[str, Any] | None = None,
    enthalpy_sublimation: object = None,
    enthalpy_fusion: object = None,
    T_min: object = None,
    T_max: object = None,
    p_max: object = None,
    source: str = "",
) -> Substance:
    """A :class:`~phasepath.substances.Substance` built from data-sheet numbers.

    Temperatures and pressures are SI numbers (K, Pa) or strings with a unit (``"25 degC"``,
    ``"3 bar"``); molar enthalpies J/mol or ``"35 kJ/mol"``; molar mass kg/mol or ``"92 g/mol"``.

    Parameters
    ----------
    name : str
        How the substance is called in reports.
    triple : (T, p) or (T, None), optional
        Triple point. Without p, the vapor-pressure curve's value at T is used.
    critical : (T, p), optional
        Critical point; the vapor-pressure curve ends there. Without it the curve (and the
        substance) ends at the top of its data.
    vapor_points : list of (T, p), optional
        Measured vapor pressures. Two points: the Clausius-Clapeyron line; three or more: an
        Antoine fit, with the Clausius-Clapeyron enthalpy reported alongside.
    antoine : dict, optional
        ``A``, ``B``, ``C`` for log10(p/Pa) = A - B/(T/K + C), with ``T_min``, ``T_max`` [K]
        (``base`` optional: 10 or "e").
    wagner : dict, optional
        ``form`` ("3-6" or "2.5-5"), ``a``, ``b``, ``c``, ``d``, ``T_min`` [K], optional
        ``T_max`` [K] and ``T_c``, ``p_c`` of the fit (default: ``critical``).
    normal_boiling_point, enthalpy_vaporization : optional
        Boiling temperature at 101325 Pa [K] and molar enthalpy of vaporization [J/mol]:
        the Clausius-Clapeyron curve through that point, accepted within ±20 K
        (:data:`phasepath.datasheet.curves.CC_WINDOW`). With vapor points the boiling point is
        one more point.
    molar_mass : optional
        [kg/mol]; needed for latent heats per kilogram.
    melting_point, melting_slope : optional
        Melting temperature at 101325 Pa [K] and the slope of the melting curve dp/dT [Pa/K]
        (positive): a straight melting line through the triple point. A melting point without a
        slope only places the triple point.
    simon_glatzel : dict, optional
        ``a`` [Pa], ``c`` [-], optional ``T_max`` [K]: p = p_t + a((T/T_t)^c - 1) from the triple
        point (``T_ref``, ``p_ref`` override the reference point).
    enthalpy_sublimation, enthalpy_fusion : optional
        [J/mol]: the sublimation curve by Clausius-Clapeyron from the triple point (fusion is
        added to vaporization at the triple point); fusion also gives melting latent heats.
    T_min, T_max, p_max : optional
        Limits of states [K, K, Pa]. Defaults: the sublimation curve's end (0.8 T_t) or the
        triple point; 1.5 T_c; 100 MPa.
    source : str
        Where the numbers come from (a data sheet, a handbook table), kept in the notes.
    """
    if not isinstance(name, str) or not name.strip():
        raise PhasePathError(f"name = {name!r}: a substance built from data needs a name")
    given = {
        k: v
        for k, v in dict(
            triple=triple,
            critical=critical,
            vapor_points=vapor_points,
            antoine=antoine,
            wagner=wagner,
            normal_boiling_point=normal_boiling_point,
            enthalpy_vaporization=enthalpy_vaporization,
            molar_mass=molar_mass,
            melting_point=melting_point,
            melting_slope=melting_slope,
            simon_glatzel=simon_glatzel,
            enthalpy_sublimation=enthalpy_sublimation,
            enthalpy_fusion=enthalpy_fusion,
            T_min=T_min,
            T_max=T_max,
            p_max=p_max,
            source=source or None,
        ).items()
        if v is not None
    }
    d = _Draft(name, given)
    where = f" ({source})" if source else ""
    d.notes.append(
        f"{name} is built from data{where}, not from an equation of state: heat and work "
        "per leg are not computed, and latent heats are approximate (Clausius-Clapeyron, "
        "ideal gas)."
    )
    crit = I.pair(critical, "critical") if critical is not None else None
    if crit is not None:
        d.T_c, d.p_c = crit  # type: ignore[assignment]
    M = (
        I.scaled(molar_mass, "molar_mass", I.MOLAR_MASS, "kg/mol")
        if molar_mass is not None
        else None
    )
    curve = C.vapor_curve(name, given, crit, d.notes, d.fits)  # type: ignore[arg-type]
    if curve.T_valid[0] >= curve.T_valid[1]:
        raise PhasePathError(
            f"{name}: the vapor-pressure range {curve.T_valid[0]:g} K to {curve.T_valid[1]:g} K "
            "is empty"
        )
    slope = (
        I.scaled(melting_slope, "melting_slope", I.SLOPE, "Pa/K")
        if melting_slope is not None
        else None
    )
    T_m = I.temperature(melting_point, "melting_point") if melting_point is not None else None
    p_t_given = _triple_point(d, triple, T_m, slope, curve)
    vapor = _vapor_boundary(d, curve, p_t_given)
    T_top, P_top = _limits(d, T_max, p_max, vapor.T_max)
    melting = _melting(d, simon_glatzel, slope, T_m, T_top, P_top)
    sublimation, dH_fus, dH_sub, T_floor = _sublimation(
        d, vapor, enthalpy_sublimation, enthalpy_fusion, T_min, vapor.T_min
    )
    if M is None:
        d.missing.append("molar mass")
        d.notes.append("No molar mass given: latent heats are not given per kilogram.")
    recipe: dict[str, Any] = {"name": name, **{k: I.plain(v) for k, v in given.items()}}
    nan = (math.nan, math.nan)
    return Substance(
        name,
        triple=(d.T_t, d.p_t) if d.T_t is not None and d.p_t is not None else nan,
        critical=(d.T_c, d.p_c) if d.T_c is not None and d.p_c is not None else nan,
        T_max=T_top,
        p_max=P_top,
        vapor=vapor,
        melting=tuple(melting),
        sublimation=sublimation,
        notes=tuple(d.notes),
        fluid=NoFluidModel(name),
        solids=NoSolidModel(name),
        latent=ClausiusClapeyron(M, dH_fus),
        T_min=T_floor,
        source_data=SubstanceData(recipe, d.fits, M, dH_fus, dH_sub, tuple(d.missing)),
    )


def _triple_point(
    d: _Draft,
    triple: Sequence[object] | None,
    T_m: float | None,
    slope: float | None,
    curve: C.DataCurve,
) -> float | None:
    """Set the triple-point temperature (given, or from the melting point); returns the
    triple-point pressure as given (None if not given)."""
    p_t_given: float | None = None
    lo, hi = curve.T_valid
    if triple is not None:
        d.T_t, p_t_given = I.pair(triple, "triple", p_optional=True)
    elif T_m is not None:
        if slope is not None:  # where the melting line meets the vapor curve
            T_t = T_m
            for _ in range(3):
                T_t = T_m - (vp.P_ATM - curve.f(T_t)) / slope
            d.T_t = T_t
            d.notes.append(
                f"Triple point placed where the melting line meets the vapor-pressure "
                f"curve: {T_t:.5g} K."
            )
        else:
            d.T_t = T_m
            d.notes.append(
                f"Triple-point temperature taken as the melting point, {T_m:g} K (they "
                "differ by hundredths of a kelvin for most substances: common practice)."
            )
    else:
        d.missing.append("triple point")
        d.notes.append(
            f"No triple point given: the diagram starts at {lo:g} K, the bottom of the "
            "vapor-pressure data; no solid is shown."
        )
    if d.T_c is None:
        d.missing.append("critical point")
        d.notes.append(
            f"No critical point given: the vapor-pressure curve ends at {hi:g} K, the top "
            "of its data; states above it are refused."
        )
    if d.T_t is not None and d.T_c is not None and not d.T_t < d.T_c:
        raise PhasePathError(
            f"{d.name}: triple point {d.T_t:g} K is not below the critical point {d.T_c:g} K"
        )
    return p_t_given


def _vapor_boundary(d: _Draft, curve: C.DataCurve, p_t_given: float | None) -> Boundary:
    """The vapor-pressure boundary from the triple point (or the data's start) to the critical
    point (or the data's end), bridged where the data stop short; sets the triple pressure."""
    lo, hi = curve.T_valid
    T_lo = d.T_t if d.T_t is not None else lo
    T_hi = d.T_c if d.T_c is not None else hi
    lo, hi = max(lo, T_lo), min(hi, T_hi)
    if lo >= hi:
        raise PhasePathError(
            f"{d.name}: the vapor-pressure data ({curve.T_valid[0]:g} K to "
            f"{curve.T_valid[1]:g} K) lie outside the liquid range {T_lo:g} K to {T_hi:g} K"
        )
    f, lower, upper = curve.f, None, None
    if T_lo < lo:
        if p_t_given is not None:
            lower, how = C.bridge(f, lo, T_lo, p_t_given)
            d.notes.append(
                f"Below {lo:g} K the vapor-pressure curve is a bridge ({how}) to the "
                "given triple point: an interpolation without data."
            )
        else:
            d.notes.append(
                f"Below {lo:g} K the vapor-pressure curve is extrapolated to the triple point."
            )
    if T_hi > hi and d.p_c is not None:
        upper, how = C.bridge(f, hi, T_hi, d.p_c)
        d.notes.append(
            f"Above {hi:g} K the vapor-pressure curve is a bridge ({how}) to the critical "
            "point: an interpolation without data."
        )
    elif d.T_c is not None and d.p_c is not None:
        gap = f(d.T_c) / d.p_c - 1.0
        if abs(gap) > 1e-6:
            d.notes.append(
                f"The vapor-pressure curve ends {100 * gap:+.2g} % from the given "
                "critical pressure."
            )

    def p_vap(T: float) -> float:
        if T < lo and lower is not None:
            return lower(T)
        if T > hi and upper is not None:
            return upper(T)
        return f(T)

    vapor = Boundary(
        "vaporization",
        "vapor pressure",
        T_lo,
        T_hi,
        curve.source,
        p_vap,
        note=curve.text,
        T_valid=(lo, hi),
    )
    C.check_rising(vapor, d.name)
    d.notes.insert(1, "Vapor pressure: " + curve.text)
    if d.T_t is not None:
        d.p_t = p_vap(d.T_t)
        if p_t_given is not None and abs(d.p_t / p_t_given - 1.0) > 1e-6:
            d.notes.append(
                f"Triple-point pressure given {p_t_given:.6g} Pa; the vapor-pressure "
                f"curve gives {d.p_t:.6g} Pa there, which the diagram uses so that its "
                "curves meet."
            )
        elif p_t_given is None:
            d.notes.append(
                f"Triple-point pressure not given: taken from the vapor-pressure curve, "
                f"{d.p_t:.6g} Pa."
            )
    return vapor


def _limits(d: _Draft, T_max: object, p_max: object, T_hi: float) -> tuple[float, float]:
    """(highest T [K], highest p [Pa]) of states: given, or 1.5 T_c and 100 MPa (or 2 p_c)."""
    if T_max is not None:
        T_top = I.temperature(T_max, "T_max")
    else:
        T_top = 1.5 * d.T_c if d.T_c is not None else T_hi
    if d.T_c is None:
        T_top = min(T_top, T_hi)
    if p_max is not None:
        P_top = I.pressure(p_max, "p_max")
    else:
        P_top = max(P_MAX_DEFAULT, 2.0 * (d.p_c or 0.0))
    return T_top, P_top


def _melting(
    d: _Draft,
    simon_glatzel: Mapping[str, Any] | None,
    slope: float | None,
    T_m: float | None,
    T_top: float,
    P_top: float,
) -> list[Boundary]:
    melting: list[Boundary] = []
    if d.T_t is not None and d.p_t is not None:
        m = C.melting_line(simon_glatzel, slope, T_m, d.T_t, d.p_t, T_top, P_top, d.notes)
        if m is not None:
            melting.append(m)
    if not melting:
        d.missing.append("melting curve")
        d.notes.append(
            "No melting curve given: freezing under pressure above the triple-point "
            "temperature is not detected."
        )
    return melting


def _sublimation(
    d: _Draft,
    vapor: Boundary,
    enthalpy_sublimation: object,
    enthalpy_fusion: object,
    T_min: object,
    T_lo: float,
) -> tuple[Boundary | None, float | None, float | None, float]:
    """(sublimation curve or None, enthalpy of fusion, of sublimation [J/mol], lowest T [K])."""
    dH_sub = (
        I.enthalpy(enthalpy_sublimation, "enthalpy_sublimation")
        if enthalpy_sublimation is not None
        else None
    )
    dH_fus = I.enthalpy(enthalpy_fusion, "enthalpy_fusion") if enthalpy_fusion is not None else None
    T_t, p_t = d.T_t, d.p_t
    if T_t is None or p_t is None or (dH_sub is None and dH_fus is None):
        T_floor = T_lo
        if T_t is not None:
            d.missing.append("sublimation curve")
            d.notes.append(
                f"Below the triple-point temperature: {NO_SUBLIMATION}. Give "
                "enthalpy_sublimation or enthalpy_fusion to build one."
            )
        if T_min is not None and I.temperature(T_min, "T_min") > T_floor:
            T_floor = I.temperature(T_min, "T_min")
        return None, dH_fus, dH_sub, T_floor
    dH_vap_t = vp.R * T_t * T_t * vapor.slope(T_t)
    if dH_sub is None:
        assert dH_fus is not None
        dH_sub = dH_fus + dH_vap_t
        d.notes.append(
            f"Enthalpy of sublimation {dH_sub / 1e3:.4g} kJ/mol = fusion "
            f"{dH_fus / 1e3:.4g} + vaporization at the triple point "
            f"{dH_vap_t / 1e3:.4g} (from the vapor-pressure curve's slope)."
        )
    elif dH_fus is None:
        dH_fus = dH_sub - dH_vap_t
        d.notes.append(
            f"Enthalpy of fusion {dH_fus / 1e3:.4g} kJ/mol = sublimation "
            f"{dH_sub / 1e3:.4g} - vaporization at the triple point "
            f"{dH_vap_t / 1e3:.4g} (from the vapor-pressure curve's slope)."
        )
    T_floor = I.temperature(T_min, "T_min") if T_min is not None else SUBLIMATION_FLOOR * T_t
    if not T_floor < T_t:
        raise OutOfRangeError(f"T_min = {T_min!r} is not below the triple point {T_t:g} K")
    sublimation = C.sublimation_curve(T_t, p_t, dH_sub, T_floor)
    d.notes.append(
        f"Sublimation: {sublimation.note} Drawn down to {T_floor:.4g} K"
        + (" (T_min not given: 0.8 of the triple-point temperature)." if T_min is None else ".")
    )
    return sublimation, dH_fus, dH_sub, T_floor
