"""Substances beyond the reference library: a phase diagram built from vapor-pressure data.

:func:`from_data` (also ``pp.Substance.from_data``) takes what a data sheet gives (published
Antoine or Wagner coefficients with their range, measured vapor pressures, a normal boiling point
and an enthalpy of vaporization, triple and critical points, a melting curve, an enthalpy of
sublimation or fusion) and builds a :class:`~phasepath.substances.Substance` whose boundaries
are those published forms. What is not given is not guessed: a missing melting curve means
freezing is not detected, a missing sublimation enthalpy means states below the triple point are
refused, and ``Substance.notes`` says so in plain words.

Method
------
* Vapor pressure, in order of preference: Wagner coefficients, Antoine coefficients, measured
  points, a normal boiling point with an enthalpy of vaporization. Two measured points give the
  integrated Clausius-Clapeyron line; three or more are fitted by the Antoine form (least squares
  in ln p, the offset C by a bounded profile search), and the two-parameter Clausius-Clapeyron
  enthalpy is reported alongside with its standard uncertainty and the residuals of both fits
  (the fits are in :mod:`phasepath.vapor_fits`; their names are re-exported here).
* Each boundary carries the temperature range of its data (``Boundary.T_valid``). Between the end
  of the data and a given triple or critical point the vapor-pressure curve is bridged by a
  quadratic in ln p against 1/T that matches the data curve's value and slope at the end of the
  data and passes through the given point (a straight line, if the quadratic would not rise
  monotonically). Bridges and extrapolations are drawn and analysed, and every crossing on them
  is flagged in the report (:func:`range_warnings`).
* Melting: the Simon-Glatzel equation from the triple point, or a straight line through the
  triple point with the given slope. Sublimation: integrated Clausius-Clapeyron from the triple
  point with the enthalpy of sublimation (given, or fusion plus vaporization at the triple point).
* Latent heats (:func:`approximate_latent_heat`): R T^2 d(ln p)/dT along the curve crossed (the
  gas ideal, the condensed phase's volume neglected); fusion from the given enthalpy. They are
  marked approximate in the report. There is no equation of state, so heat and work per leg are
  not computed.

Two vapor points fix the Clausius-Clapeyron line; its enthalpy is R ln(p2/p1) / (1/T1 - 1/T2),
by hand 8.314462618 x ln 8 / (1/300 - 1/350) = 36.31 kJ/mol:

>>> import phasepath as pp
>>> sub = pp.Substance.from_data("demo", critical=(560.0, 4.5e6), triple=(180.0, None),
...     vapor_points=[(300.0, 5.0e3), (350.0, 4.0e4)])
>>> round(sub.source_data.fits["clausius-clapeyron"].enthalpy() / 1e3, 2)
36.31
>>> sub.phase(320.0, 1e5), sub.phase(320.0, 1e3), sub.phase(600.0, 5e6)
('liquid', 'vapor', 'supercritical')
"""

from __future__ import annotations

import json
import math
import re
from collections.abc import Callable, Mapping, Sequence
from dataclasses import dataclass, field
from typing import TYPE_CHECKING, Any

import numpy as np

from .boundaries import Boundary
from .correlations import vapor_pressure as vp
from .errors import NonFiniteError, OutOfRangeError, PhasePathError
from .vapor_fits import (  # the fits live there; their public names are re-exported here
    _T,
    VaporFit,
    _p,
    _points,
    _signed,
    fit_antoine,
    fit_clausius_clapeyron,
)

if TYPE_CHECKING:  # pragma: no cover
    from .report import Crossing
    from .substances import Substance

__all__ = [
    "from_data",
    "from_dict",
    "to_dict",
    "VaporFit",
    "SubstanceData",
    "fit_clausius_clapeyron",
    "fit_antoine",
    "approximate_latent_heat",
    "range_warnings",
    "registered",
    "LATENT_HEAT_MODEL",
    "CC_WINDOW",
]

#: How latent heats of substances built from data are labelled in the report.
LATENT_HEAT_MODEL = "approximate: Clausius-Clapeyron, ideal gas, condensed volume neglected"
#: Half-width [K] of the range accepted around a single vapor point with a constant enthalpy of
#: vaporization. Our choice: an enthalpy drifting by about 0.1 %/K (typical well below the
#: critical point; common practice) moves the pressure by about 1 % at 20 K.
CC_WINDOW = 20.0
#: Default highest pressure of a substance built from data [Pa] (no equation of state limits it).
P_MAX_DEFAULT = 100e6
#: Default lowest temperature of a sublimation curve, as a fraction of the triple-point temperature.
SUBLIMATION_FLOOR = 0.8

_KEYS = (
    "molar_mass",
    "triple",
    "critical",
    "vapor_points",
    "antoine",
    "wagner",
    "normal_boiling_point",
    "enthalpy_vaporization",
    "melting_point",
    "melting_slope",
    "simon_glatzel",
    "enthalpy_sublimation",
    "enthalpy_fusion",
    "T_min",
    "T_max",
    "p_max",
    "source",
)
_MOLAR_ENERGY = {"j/mol": 1.0, "kj/mol": 1e3, "cal/mol": 4.184, "kcal/mol": 4184.0}
_MOLAR_MASS = {"kg/mol": 1.0, "g/mol": 1e-3, "kg/kmol": 1e-3}
_NUM = re.compile(r"^\s*([-+]?(?:\d+\.?\d*|\.\d+)(?:[eE][-+]?\d+)?)\s*(.*?)\s*$")


# -- parsing at the edge -------------------------------------------------------------------------
def _scaled(
    value: object, what: str, units: dict[str, float], si: str, positive: bool = True
) -> float:
    """A number (SI) or a string with one of a few units (J/mol, kJ/mol; kg/mol, g/mol)."""
    if isinstance(value, bool) or value is None:
        raise NonFiniteError(f"{what} = {value!r} is not a number")
    if isinstance(value, (int, float)):
        x = float(value)
    elif isinstance(value, str) and (m := _NUM.match(value)):
        unit = m.group(2).strip().lower().replace(" ", "")
        if unit and unit not in units:
            raise PhasePathError(
                f"{what} = {value!r}: unknown unit {m.group(2)!r}; use "
                f"{', '.join(units)} (a bare number is {si})"
            )
        x = float(m.group(1)) * units.get(unit, 1.0)
    else:
        raise PhasePathError(f"{what} = {value!r} is not a number or a number with a unit ({si})")
    if not math.isfinite(x):
        raise NonFiniteError(f"{what} = {value!r} is not a finite number")
    if positive and x <= 0.0:
        raise OutOfRangeError(f"{what} = {value!r} must be positive")
    return x


def _enthalpy(value: object, what: str) -> float:
    return _scaled(value, what, _MOLAR_ENERGY, "J/mol")


def _number(d: Mapping[str, Any], key: str, what: str, needed: str) -> float:
    if key not in d or d[key] is None:
        raise PhasePathError(f"{what}: {key!r} is missing; give {needed}")
    v = d[key]
    if isinstance(v, bool) or not isinstance(v, (int, float)) or not math.isfinite(v):
        raise NonFiniteError(f"{what}: {key} = {v!r} is not a finite number")
    return float(v)


def _only(d: object, allowed: tuple[str, ...], what: str) -> Mapping[str, Any]:
    if not isinstance(d, Mapping):
        raise PhasePathError(f"{what} = {d!r} must be a mapping with keys {', '.join(allowed)}")
    extra = [k for k in d if k not in allowed]
    if extra:
        raise PhasePathError(
            f"{what}: unknown key(s) {', '.join(map(repr, extra))}; known: {', '.join(allowed)}"
        )
    return d


def _pair(value: object, what: str, p_optional: bool = False) -> tuple[float, float | None]:
    T: object
    p: object
    try:
        T, p = value  # type: ignore[misc]
    except (TypeError, ValueError):
        raise PhasePathError(f"{what} = {value!r} is not a (T, p) pair") from None
    if p is None and p_optional:
        return _T(T, f"{what} temperature"), None
    return _T(T, f"{what} temperature"), _p(p, f"{what} pressure")


def _plain(value: object) -> object:
    """Inputs as plain data (lists, dicts, numbers, strings) for files."""
    if isinstance(value, Mapping):
        return {str(k): _plain(v) for k, v in value.items()}
    if isinstance(value, (list, tuple)):
        return [_plain(v) for v in value]
    if isinstance(value, (np.floating, np.integer)):
        return value.item()
    if hasattr(value, "magnitude") and hasattr(value, "units"):
        return f"{value.magnitude} {value.units}"
    return value


# -- what a substance built from data rests on ----------------------------------------------------
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
class _Curve:
    f: Callable[[float], float]  # the data curve, evaluable beyond its range
    T_valid: tuple[float, float]
    source: str
    text: str


def _vapor_curve(
    name: str,
    args: dict[str, Any],
    critical: tuple[float, float] | None,
    notes: list[str],
    fits: dict[str, VaporFit],
) -> _Curve:
    wagner, antoine = args.get("wagner"), args.get("antoine")
    points, T_b = args.get("vapor_points"), args.get("normal_boiling_point")
    dH = args.get("enthalpy_vaporization")
    dH = None if dH is None else _enthalpy(dH, "enthalpy_vaporization")
    Tb = None if T_b is None else _T(T_b, "normal_boiling_point")
    pts = _points(points) if points is not None else ()
    if wagner is not None:
        curve = _wagner_curve(wagner, critical)
    elif antoine is not None:
        curve = _antoine_curve(antoine)
    elif pts or Tb is not None:
        curve = _fitted_curve(pts, Tb, dH, fits, notes)
        Tb = None  # it is one of the points
        pts = ()
    else:
        raise PhasePathError(
            f"{name}: a vapor-pressure curve is needed: give wagner=..., antoine=..., "
            "vapor_points=[(T, p), ...] or normal_boiling_point=... with enthalpy_vaporization=..."
        )
    # what else was given is compared with the curve, not used
    if pts:
        dev = [100.0 * (p / curve.f(T) - 1.0) for T, p in pts]
        k = int(np.argmax(np.abs(dev)))
        notes.append(
            f"The {len(pts)} vapor points given deviate from that curve by up to "
            f"{dev[k]:+.2g} % (at {pts[k][0]:g} K); they are not used to build it."
        )
    if Tb is not None:
        notes.append(
            f"Normal boiling point given {Tb:g} K; the curve reaches 101325 Pa at "
            f"{_solve_T(curve.f, vp.P_ATM, *curve.T_valid):.5g} K."
        )
    return curve


def _solve_T(f: Callable[[float], float], p: float, lo: float, hi: float) -> float:
    from scipy.optimize import brentq

    a, b = 0.5 * lo, 1.5 * hi
    try:
        return float(brentq(lambda t: math.log(f(t) / p), max(a, 1.0), b, xtol=1e-10))
    except (ValueError, OutOfRangeError, OverflowError, ZeroDivisionError):
        return math.nan


def _wagner_curve(d: object, critical: tuple[float, float] | None) -> _Curve:
    keys = ("form", "a", "b", "c", "d", "T_c", "p_c", "T_min", "T_max")
    w = _only(d, keys, "wagner")
    need = "form ('3-6' or '2.5-5'), a, b, c, d, T_min [K] (T_max, T_c, p_c optional)"
    form = str(w.get("form", ""))
    if form not in ("3-6", "2.5-5"):
        raise PhasePathError(f"wagner: form = {w.get('form')!r}; give '3-6' (original) or '2.5-5'")
    coef = tuple(_number(w, k, "wagner", need) for k in "abcd")
    if "T_c" in w or "p_c" in w:
        T_c, p_c = _T(w.get("T_c"), "wagner T_c"), _p(w.get("p_c"), "wagner p_c")
    elif critical is not None:
        T_c, p_c = critical
    else:
        raise PhasePathError(
            "wagner: the Wagner equation needs the critical point it was fitted "
            "with: give T_c and p_c in it, or critical=(T_c, p_c)"
        )
    if "T_min" not in w:
        raise PhasePathError(f"wagner: 'T_min' is missing; give {need}")
    lo = _T(w["T_min"], "wagner T_min")
    hi = _T(w["T_max"], "wagner T_max") if w.get("T_max") is not None else T_c
    hi = min(hi, T_c)
    func = vp.wagner_3_6 if form == "3-6" else vp.wagner_25_5

    def f(T: float) -> float:
        return func(min(T, T_c), T_c, p_c, *coef)

    return _Curve(
        f,
        (lo, hi),
        "Wagner1973" if form == "3-6" else "Poling2001",
        f"Wagner equation ({form} form), published range {lo:g} K to {hi:g} K, "
        f"fitted with T_c = {T_c:g} K, p_c = {p_c:.6g} Pa.",
    )


def _antoine_curve(d: object) -> _Curve:
    a = _only(d, ("A", "B", "C", "T_min", "T_max", "base"), "antoine")
    need = "A, B, C for log10(p/Pa) = A - B/(T/K + C), T_min and T_max [K]"
    A, B, C = (_number(a, k, "antoine", need) for k in "ABC")
    for k in ("T_min", "T_max"):
        if a.get(k) is None:
            raise PhasePathError(f"antoine: {k!r} is missing; give {need}")
    lo, hi = _T(a["T_min"], "antoine T_min"), _T(a["T_max"], "antoine T_max")
    base = a.get("base", 10)
    base = math.e if base in ("e", "ln") else float(base)
    if lo + C <= 0.0:
        raise OutOfRangeError(
            f"antoine: T_min = {lo:g} K lies at or below the pole of the "
            f"equation (T + C <= 0 with C = {C:g} K)"
        )

    def f(T: float) -> float:
        return base ** (A - B / max(T + C, 1e-3 * (lo + C)))

    return _Curve(
        f,
        (lo, hi),
        "Antoine1888",
        f"Antoine equation log{'10' if base == 10 else f'[{base:g}]'}(p/Pa) = "
        f"{A:.6g} - {B:.6g}/(T/K {_signed(C)}), published range {lo:g} K to {hi:g} K.",
    )


def _fitted_curve(
    pts: tuple[tuple[float, float], ...],
    Tb: float | None,
    dH: float | None,
    fits: dict[str, VaporFit],
    notes: list[str],
) -> _Curve:
    if Tb is not None and all(abs(T - Tb) > 1e-9 * Tb for T, _ in pts):
        pts = tuple(sorted(pts + ((Tb, vp.P_ATM),)))
    if len(pts) == 1:
        if dH is None:
            raise PhasePathError(
                "one vapor point (or a normal boiling point alone) does not fix "
                "a curve: give enthalpy_vaporization=... as well"
            )
        ((T0, p0),) = pts
        lo, hi = T0 - CC_WINDOW, T0 + CC_WINDOW

        def f1(T: float) -> float:
            return vp.clausius_clapeyron(T, T0, p0, dH)

        return _Curve(
            f1,
            (lo, hi),
            "Clausius1850",
            f"Integrated Clausius-Clapeyron through ({T0:g} K, {p0:.6g} Pa) with a "
            f"constant enthalpy of vaporization {dH / 1e3:.4g} kJ/mol; accepted within "
            f"±{CC_WINDOW:g} K of that point.",
        )
    cc = fit_clausius_clapeyron(pts)
    fits["clausius-clapeyron"] = cc
    chosen = cc
    if len(pts) >= 3:
        try:
            chosen = fit_antoine(pts)
        except PhasePathError as exc:
            notes.append(f"Antoine fit not used ({exc}); the Clausius-Clapeyron line is used.")
    fits["vapor"] = chosen
    text = chosen.describe()
    if chosen is not cc:
        text += " " + cc.describe()
    if dH is not None:
        text += (
            f" Enthalpy of vaporization given {dH / 1e3:.4g} kJ/mol (not used: the points "
            "define the curve)."
        )
    return _Curve(
        chosen.pressure,
        chosen.T_range,
        "Antoine1888" if chosen.form == "antoine" else "Clausius1850",
        text,
    )


def _bridge(
    f: Callable[[float], float], T0: float, T1: float, p1: float
) -> tuple[Callable[[float], float], str]:
    """Curve from the end of the data (T0, f(T0)) to a given point (T1, p1), in x = 1/T."""
    x0, x1 = 1.0 / T0, 1.0 / T1
    g0 = math.log(f(T0))
    h = 1e-4 * T0
    s = math.log(f(T0 + h) / f(T0 - h)) / (2 * h)  # d ln p / dT
    d0 = -s * T0 * T0  # d ln p / dx
    dx = x1 - x0
    k = (math.log(p1) - g0 - d0 * dx) / dx**2
    if d0 < 0.0 and d0 + 2.0 * k * dx < 0.0:  # ln p falls with x all along: monotonic in T

        def quad(T: float) -> float:
            u = 1.0 / T - x0
            return math.exp(g0 + d0 * u + k * u * u)

        return quad, "quadratic in ln p against 1/T"
    m = (math.log(p1) - g0) / dx

    def line(T: float) -> float:
        return math.exp(g0 + m * (1.0 / T - x0))

    return line, "straight line in ln p against 1/T"


# -- building ------------------------------------------------------------------------------------
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
        (:data:`CC_WINDOW`). With vapor points the boiling point is one more point.
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
    from .substances import NO_SUBLIMATION, Substance

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
    recipe: dict[str, Any] = {"name": name, **{k: _plain(v) for k, v in given.items()}}
    notes: list[str] = []
    missing: list[str] = []
    fits: dict[str, VaporFit] = {}
    where = f" ({source})" if source else ""
    notes.append(
        f"{name} is built from data{where}, not from an equation of state: heat and work "
        "per leg are not computed, and latent heats are approximate (Clausius-Clapeyron, "
        "ideal gas)."
    )

    crit = _pair(critical, "critical") if critical is not None else None
    T_c, p_c = crit if crit is not None else (None, None)
    M = _scaled(molar_mass, "molar_mass", _MOLAR_MASS, "kg/mol") if molar_mass is not None else None
    curve = _vapor_curve(name, given, crit, notes, fits)  # type: ignore[arg-type]
    lo, hi = curve.T_valid
    if lo >= hi:
        raise PhasePathError(f"{name}: the vapor-pressure range {lo:g} K to {hi:g} K is empty")

    # -- triple point ------------------------------------------------------------------------
    T_t: float | None = None
    p_t_given: float | None = None
    T_m = _T(melting_point, "melting_point") if melting_point is not None else None
    slope = None
    if melting_slope is not None:
        slope = _scaled(
            melting_slope, "melting_slope", {"pa/k": 1.0, "mpa/k": 1e6, "bar/k": 1e5}, "Pa/K"
        )
    if triple is not None:
        T_t, p_t_given = _pair(triple, "triple", p_optional=True)
    elif T_m is not None:
        if slope is not None:  # where the melting line meets the vapor curve
            T_t = T_m
            for _ in range(3):
                T_t = T_m - (vp.P_ATM - curve.f(T_t)) / slope
            notes.append(
                f"Triple point placed where the melting line meets the vapor-pressure "
                f"curve: {T_t:.5g} K."
            )
        else:
            T_t = T_m
            notes.append(
                f"Triple-point temperature taken as the melting point, {T_m:g} K (they "
                "differ by hundredths of a kelvin for most substances: common practice)."
            )
    else:
        missing.append("triple point")
        notes.append(
            f"No triple point given: the diagram starts at {lo:g} K, the bottom of the "
            "vapor-pressure data; no solid is shown."
        )
    if T_c is None:
        missing.append("critical point")
        notes.append(
            f"No critical point given: the vapor-pressure curve ends at {hi:g} K, the top "
            "of its data; states above it are refused."
        )
    if T_t is not None and T_c is not None and not T_t < T_c:
        raise PhasePathError(
            f"{name}: triple point {T_t:g} K is not below the critical point {T_c:g} K"
        )

    # -- vapor-pressure boundary -------------------------------------------------------------
    T_lo = T_t if T_t is not None else lo
    T_hi = T_c if T_c is not None else hi
    lo, hi = max(lo, T_lo), min(hi, T_hi)
    if lo >= hi:
        raise PhasePathError(
            f"{name}: the vapor-pressure data ({curve.T_valid[0]:g} K to {curve.T_valid[1]:g} K) "
            f"lie outside the liquid range {T_lo:g} K to {T_hi:g} K"
        )
    f, lower, upper = curve.f, None, None
    if T_lo < lo:
        if p_t_given is not None:
            lower, how = _bridge(f, lo, T_lo, p_t_given)
            notes.append(
                f"Below {lo:g} K the vapor-pressure curve is a bridge ({how}) to the "
                "given triple point: an interpolation without data."
            )
        else:
            notes.append(
                f"Below {lo:g} K the vapor-pressure curve is extrapolated to the triple point."
            )
    if T_hi > hi and p_c is not None:
        upper, how = _bridge(f, hi, T_hi, p_c)
        notes.append(
            f"Above {hi:g} K the vapor-pressure curve is a bridge ({how}) to the critical "
            "point: an interpolation without data."
        )
    elif T_c is not None and p_c is not None:
        gap = f(T_c) / p_c - 1.0
        if abs(gap) > 1e-6:
            notes.append(
                f"The vapor-pressure curve ends {100 * gap:+.2g} % from the given "
                "critical pressure."
            )

    def p_vap(T: float, _lo: float = lo, _hi: float = hi) -> float:
        if T < _lo and lower is not None:
            return lower(T)
        if T > _hi and upper is not None:
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
    _check_rising(vapor, name)
    notes.insert(1, "Vapor pressure: " + curve.text)

    p_t = None
    if T_t is not None:
        p_t = p_vap(T_t)
        if p_t_given is not None and abs(p_t / p_t_given - 1.0) > 1e-6:
            notes.append(
                f"Triple-point pressure given {p_t_given:.6g} Pa; the vapor-pressure "
                f"curve gives {p_t:.6g} Pa there, which the diagram uses so that its "
                "curves meet."
            )
        elif p_t_given is None:
            notes.append(
                f"Triple-point pressure not given: taken from the vapor-pressure curve, "
                f"{p_t:.6g} Pa."
            )

    # -- limits --------------------------------------------------------------------------------
    T_top = _T(T_max, "T_max") if T_max is not None else (1.5 * T_c if T_c is not None else T_hi)
    if T_c is None:
        T_top = min(T_top, T_hi)
    P_top = _p(p_max, "p_max") if p_max is not None else max(P_MAX_DEFAULT, 2.0 * (p_c or 0.0))

    # -- melting -------------------------------------------------------------------------------
    melting: list[Boundary] = []
    if T_t is not None and p_t is not None:
        m = _melting(simon_glatzel, slope, T_m, T_t, p_t, T_top, P_top, notes)
        if m is not None:
            melting.append(m)
    if not melting:
        missing.append("melting curve")
        notes.append(
            "No melting curve given: freezing under pressure above the triple-point "
            "temperature is not detected."
        )

    # -- sublimation ---------------------------------------------------------------------------
    dH_sub = (
        _enthalpy(enthalpy_sublimation, "enthalpy_sublimation")
        if enthalpy_sublimation is not None
        else None
    )
    dH_fus = _enthalpy(enthalpy_fusion, "enthalpy_fusion") if enthalpy_fusion is not None else None
    sublimation = None
    T_floor: float
    if T_t is not None and p_t is not None and (dH_sub is not None or dH_fus is not None):
        dH_vap_t = vp.R * T_t * T_t * _dlnp_dT(vapor, T_t)
        if dH_sub is None:
            assert dH_fus is not None
            dH_sub = dH_fus + dH_vap_t
            notes.append(
                f"Enthalpy of sublimation {dH_sub / 1e3:.4g} kJ/mol = fusion "
                f"{dH_fus / 1e3:.4g} + vaporization at the triple point "
                f"{dH_vap_t / 1e3:.4g} (from the vapor-pressure curve's slope)."
            )
        elif dH_fus is None:
            dH_fus = dH_sub - dH_vap_t
            notes.append(
                f"Enthalpy of fusion {dH_fus / 1e3:.4g} kJ/mol = sublimation "
                f"{dH_sub / 1e3:.4g} - vaporization at the triple point "
                f"{dH_vap_t / 1e3:.4g} (from the vapor-pressure curve's slope)."
            )
        T_floor = _T(T_min, "T_min") if T_min is not None else SUBLIMATION_FLOOR * T_t
        if not T_floor < T_t:
            raise OutOfRangeError(f"T_min = {T_min!r} is not below the triple point {T_t:g} K")
        Tt_, pt_, dHs = T_t, p_t, dH_sub

        def p_sub(T: float) -> float:
            return vp.clausius_clapeyron(T, Tt_, pt_, dHs)

        sublimation = Boundary(
            "sublimation",
            "sublimation",
            T_floor,
            T_t,
            "Clausius1850",
            p_sub,
            note=(
                f"Integrated Clausius-Clapeyron from the triple point with a constant enthalpy "
                f"of sublimation {dH_sub / 1e3:.4g} kJ/mol: approximate."
            ),
        )
        notes.append(
            f"Sublimation: {sublimation.note} Drawn down to {T_floor:.4g} K"
            + (" (T_min not given: 0.8 of the triple-point temperature)." if T_min is None else ".")
        )
    else:
        T_floor = T_lo
        if T_t is not None:
            missing.append("sublimation curve")
            notes.append(
                f"Below the triple-point temperature: {NO_SUBLIMATION}. Give "
                "enthalpy_sublimation or enthalpy_fusion to build one."
            )
        if T_min is not None and _T(T_min, "T_min") > T_floor:
            T_floor = _T(T_min, "T_min")
    if M is None:
        missing.append("molar mass")
        notes.append("No molar mass given: latent heats are not given per kilogram.")

    sub = Substance(
        name=name,
        triple=(T_t, p_t) if T_t is not None and p_t is not None else (math.nan, math.nan),
        critical=(T_c, p_c) if T_c is not None and p_c is not None else (math.nan, math.nan),
        T_max=T_top,
        p_max=P_top,
        vapor=vapor,
        melting=tuple(melting),
        sublimation=sublimation,
        notes=tuple(notes),
        eos=None,
        T_min=T_floor,
    )
    sub.source_data = SubstanceData(recipe, fits, M, dH_fus, dH_sub, tuple(missing))
    _register(sub)
    return sub


def _melting(
    sg: Mapping[str, Any] | None,
    slope: float | None,
    T_m: float | None,
    T_t: float,
    p_t: float,
    T_top: float,
    P_top: float,
    notes: list[str],
) -> Boundary | None:
    from scipy.optimize import brentq

    if sg is not None:
        d = _only(sg, ("a", "c", "T_max", "T_ref", "p_ref"), "simon_glatzel")
        need = "a [Pa] and c [-] (T_max [K], T_ref [K], p_ref [Pa] optional)"
        a, c = _number(d, "a", "simon_glatzel", need), _number(d, "c", "simon_glatzel", need)
        if a <= 0 or c <= 0:
            raise OutOfRangeError(f"simon_glatzel: a = {a:g} Pa and c = {c:g} must be positive")
        T_ref = _T(d["T_ref"], "simon_glatzel T_ref") if d.get("T_ref") is not None else T_t
        p_ref = _p(d["p_ref"], "simon_glatzel p_ref") if d.get("p_ref") is not None else p_t
        shift = p_t - vp.simon_glatzel(T_t, T_ref, p_ref, a, c)

        def p_m(T: float) -> float:
            return vp.simon_glatzel(T, T_ref, p_ref, a, c) + shift

        source = "SimonGlatzel1929"
        text = (
            f"Simon-Glatzel equation, a = {a:.6g} Pa, c = {c:.5g}, from ({T_ref:g} K, "
            f"{p_ref:.6g} Pa)"
        )
        valid_top = _T(d["T_max"], "simon_glatzel T_max") if d.get("T_max") is not None else None
    elif slope is not None:

        def p_m(T: float) -> float:
            return p_t + slope * (T - T_t)

        source = "common practice"
        text = f"straight melting line through the triple point, slope {slope:.4g} Pa/K"
        valid_top = T_m if T_m is not None and T_m > T_t else T_t + vp.P_ATM / slope
    else:
        if T_m is not None:
            notes.append(
                "Melting point given without a slope: it places the triple point but "
                "does not define a melting curve."
            )
        return None
    top = T_top
    if sg is not None and valid_top is not None:
        top = min(top, valid_top)  # the published range of the parameters ends there
    if p_m(top) > P_top:
        top = float(brentq(lambda t: p_m(t) - P_top, T_t, top, xtol=1e-10))
    valid = (T_t, min(valid_top, top)) if valid_top is not None else None
    if sg is not None and abs(shift) > 1e-9 * max(p_t, 1.0):
        text += f", shifted by {shift:.4g} Pa to meet the triple point"
    note = text + (f"; data up to {valid[1]:g} K" if valid else "") + "."
    notes.append("Melting: " + note)
    return Boundary("melting", "melting", T_t, top, source, p_m, note=note, T_valid=valid)


def _check_rising(b: Boundary, name: str) -> None:
    T, p = b.sample()
    if not (np.all(np.isfinite(p)) and np.all(p > 0) and np.all(np.diff(p) > 0)):
        k = int(np.argmax(~(np.diff(p) > 0))) if np.all(np.isfinite(p)) else 0
        raise PhasePathError(
            f"{name}: the vapor-pressure curve does not rise with temperature near {T[k]:.5g} K; "
            "check the coefficients and their units (pressure in Pa, temperature in K)"
        )


def _dlnp_dT(b: Boundary, T: float) -> float:
    """d(ln p)/dT along a branch: central difference, second-order one-sided at its ends."""
    h = 1e-3

    def g(t: float) -> float:
        return math.log(b.p_of_T(t))

    if T - h >= b.T_min and T + h <= b.T_max:
        return (g(T + h) - g(T - h)) / (2 * h)
    s = 1.0 if T - h < b.T_min else -1.0
    return s * (-3 * g(T) + 4 * g(T + s * h) - g(T + 2 * s * h)) / (2 * h)


# -- names and files ----------------------------------------------------------------------------
_CACHE: dict[str, Substance] = {}
_REGISTRY: dict[str, Substance] = {}


def _register(sub: Substance) -> None:
    from .substances import _alias_map, _key

    if _key(sub.name) in _alias_map():
        return  # the reference substance keeps its name; pass this one as an object
    _REGISTRY[sub.name] = sub


def registered() -> dict[str, Substance]:
    """Substances built from data in this session, by name (the latest of each name).

    ``pp.substance(name)`` and everything that takes a name (routes, widgets) find them, after
    the reference substances: a substance built under a reference name is reachable only as an
    object.
    """
    return dict(_REGISTRY)


def to_dict(sub: Substance) -> dict[str, Any]:
    """Plain data of a substance: ``{"name": ...}`` for a reference substance, else the inputs
    given to :func:`from_data` (name included)."""
    data = getattr(sub, "source_data", None)
    if data is None:
        return {"name": sub.name}
    return json.loads(json.dumps(data.recipe))


def from_dict(data: Mapping[str, Any]) -> Substance:
    """The substance a :func:`to_dict` mapping describes (identical mappings give one object)."""
    from .substances import substance

    if not isinstance(data, Mapping) or "name" not in data:
        raise PhasePathError(f"a substance mapping needs a 'name' (got {data!r})")
    extra = [k for k in data if k != "name" and k not in _KEYS]
    if extra:
        raise PhasePathError(
            f"substance {data.get('name')!r}: unknown key(s) "
            f"{', '.join(map(repr, extra))}; known: name, {', '.join(_KEYS)}"
        )
    if len(data) == 1:
        return substance(data["name"])
    try:
        key = json.dumps(data, sort_keys=True)
    except (TypeError, ValueError):
        key = ""
    if key and key in _CACHE:
        return _CACHE[key]
    args = {k: v for k, v in data.items() if k != "name"}
    if isinstance(args.get("triple"), list):
        args["triple"] = tuple(args["triple"])
    sub = from_data(data["name"], **args)
    if key:
        _CACHE[key] = sub
    return sub


# -- latent heats and range warnings (used by thermo and analysis) -------------------------------
def approximate_latent_heat(
    sub: Substance,
    kind: str,
    T: float,
    p: float,
    before: tuple[str, str | None],
    after: tuple[str, str | None],
) -> tuple[float | None, str | None, str]:
    """(latent heat [J/kg], model, note) at a crossing of a substance without an equation of state.

    Vaporization and sublimation: L = R T^2 d(ln p)/dT / M along the curve crossed (ideal gas,
    condensed volume neglected). Fusion: the given or derived enthalpy of fusion / M.
    """
    data: SubstanceData | None = getattr(sub, "source_data", None)
    phases = {before[0], after[0]}
    molar: float | None = None
    model = LATENT_HEAT_MODEL
    if phases == {"liquid", "vapor"} and sub.vapor is not None:
        molar = vp.R * T * T * _dlnp_dT(sub.vapor, T)
    elif phases == {"solid", "vapor"} and sub.sublimation is not None:
        molar = vp.R * T * T * _dlnp_dT(sub.sublimation, T)
    elif phases == {"solid", "liquid"}:
        if data is None or data.enthalpy_fusion is None:
            return None, None, "no enthalpy of fusion given"
        molar = data.enthalpy_fusion
        model = "approximate: enthalpy of fusion at the triple point, taken constant"
    if molar is None:
        return None, None, "no model for this transition"
    if data is None or data.molar_mass is None:
        return (
            None,
            None,
            (f"no molar mass given: about {molar / 1e3:.4g} kJ/mol ({LATENT_HEAT_MODEL})"),
        )
    return molar / data.molar_mass, model, ""


def range_warnings(
    sub: Substance, corners: Sequence[tuple[float, float]], crossings: Sequence[Crossing]
) -> list[str]:
    """Warnings for a route that leaves the data range of a boundary (``Boundary.T_valid``).

    One line for each crossing that lies on a boundary outside its data range, and one for the
    route's states whose phase rests on the extrapolated (or bridged) part of the vapor-pressure
    curve.
    """
    ranged = {b.label: b for b in sub.boundaries if b.T_valid is not None}
    if not ranged:
        return []
    out = []
    for c in crossings:
        b = ranged.get(c.boundary)
        if b is None or b.T_valid is None:
            continue
        lo, hi = b.T_valid
        if not (lo * (1 - 1e-9) <= c.T <= hi * (1 + 1e-9)):
            out.append(
                f"Warning: leg {c.step} crosses the {b.label} curve at T = {c.T:.5g} K, "
                f"outside the range of its data ({lo:.5g} K to {hi:.5g} K): the curve is "
                "extrapolated there and the crossing is uncertain."
            )
    v = ranged.get("vapor pressure")
    if v is not None and v.T_valid is not None:
        lo, hi = v.T_valid
        outside = sorted({T for T, _ in corners if v.T_min <= T <= v.T_max and not (lo <= T <= hi)})
        if outside:
            Ts = ", ".join(f"{T:.5g} K" for T in outside)
            out.append(
                f"Warning: the route reaches {Ts}, outside the range of the vapor-pressure "
                f"data ({lo:.5g} K to {hi:.5g} K): the phases there rest on the "
                "extrapolated curve."
            )
    return out
