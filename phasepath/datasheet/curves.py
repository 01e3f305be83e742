"""Curves of a substance built from data: the vapor-pressure curve from one of four kinds of input,
the bridges from the end of its data to a given triple or critical point, the melting line and
the sublimation curve.

* Vapor pressure, in order of preference: Wagner coefficients, Antoine coefficients, measured
  points, a normal boiling point with an enthalpy of vaporization. Two measured points give the
  integrated Clausius-Clapeyron line; three or more are fitted by the Antoine form, with the
  two-parameter Clausius-Clapeyron enthalpy reported alongside (:mod:`.fits`).
* Between the end of the data and a given triple or critical point the vapor-pressure curve is
  bridged by a quadratic in ln p against 1/T that matches the data curve's value and slope at the
  end of the data and passes through the given point (a straight line, if the quadratic would not
  rise monotonically).
* Melting: the Simon-Glatzel equation from the triple point, or a straight line through the
  triple point with the given slope. Sublimation: integrated Clausius-Clapeyron from the triple
  point with a constant enthalpy of sublimation.
"""

from __future__ import annotations

import math
from collections.abc import Callable, Mapping
from dataclasses import dataclass
from typing import Any

import numpy as np

from ..boundaries import Boundary
from ..correlations import vapor_pressure as vp
from ..errors import OutOfRangeError, PhasePathError
from ..rootfind import find_root
from . import inputs as I
from .fits import VaporFit, fit_antoine, fit_clausius_clapeyron, signed

__all__ = [
    "DataCurve",
    "CC_WINDOW",
    "vapor_curve",
    "bridge",
    "melting_line",
    "sublimation_curve",
    "check_rising",
]

#: Half-width [K] of the range accepted around a single vapor point with a constant enthalpy of
#: vaporization. Our choice: an enthalpy drifting by about 0.1 %/K (typical well below the
#: critical point; common practice) moves the pressure by about 1 % at 20 K.
CC_WINDOW = 20.0


@dataclass(frozen=True)
class DataCurve:
    """A vapor-pressure curve from data: ``f`` (evaluable beyond its range), the temperature
    range of its data, its source id and its description for the notes."""

    f: Callable[[float], float]
    T_valid: tuple[float, float]
    source: str
    text: str


# -- vapor pressure ------------------------------------------------------------------------------
def vapor_curve(
    name: str,
    args: Mapping[str, Any],
    critical: tuple[float, float] | None,
    notes: list[str],
    fits: dict[str, VaporFit],
) -> DataCurve:
    """The vapor-pressure curve the inputs define; inputs not used to build it are compared with
    it in the notes. Fits made are added to ``fits``."""
    wagner, antoine = args.get("wagner"), args.get("antoine")
    given_points, T_b = args.get("vapor_points"), args.get("normal_boiling_point")
    dH = args.get("enthalpy_vaporization")
    dH = None if dH is None else I.enthalpy(dH, "enthalpy_vaporization")
    Tb = None if T_b is None else I.temperature(T_b, "normal_boiling_point")
    pts = I.points(given_points) if given_points is not None else ()
    if wagner is not None:
        curve = _wagner(wagner, critical)
    elif antoine is not None:
        curve = _antoine(antoine)
    elif pts or Tb is not None:
        curve = _fitted(pts, Tb, dH, fits, notes)
        Tb = None  # it is one of the points
        pts = ()
    else:
        raise PhasePathError(
            f"{name}: a vapor-pressure curve is needed: give wagner=..., antoine=..., "
            "vapor_points=[(T, p), ...] or normal_boiling_point=... with enthalpy_vaporization=..."
        )
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
            f"{_boiling_point(curve):.5g} K."
        )
    return curve


def _boiling_point(curve: DataCurve) -> float:
    lo, hi = curve.T_valid
    try:
        return find_root(
            lambda t: math.log(curve.f(t) / vp.P_ATM), max(0.5 * lo, 1.0), 1.5 * hi
        ).root
    except (OutOfRangeError, OverflowError, ZeroDivisionError, ValueError):
        return math.nan


def _wagner(d: object, critical: tuple[float, float] | None) -> DataCurve:
    keys = ("form", "a", "b", "c", "d", "T_c", "p_c", "T_min", "T_max")
    w = I.only(d, keys, "wagner")
    need = "form ('3-6' or '2.5-5'), a, b, c, d, T_min [K] (T_max, T_c, p_c optional)"
    form = str(w.get("form", ""))
    if form not in ("3-6", "2.5-5"):
        raise PhasePathError(f"wagner: form = {w.get('form')!r}; give '3-6' (original) or '2.5-5'")
    coef = tuple(I.number(w, k, "wagner", need) for k in "abcd")
    if "T_c" in w or "p_c" in w:
        T_c, p_c = I.temperature(w.get("T_c"), "wagner T_c"), I.pressure(w.get("p_c"), "wagner p_c")
    elif critical is not None:
        T_c, p_c = critical
    else:
        raise PhasePathError(
            "wagner: the Wagner equation needs the critical point it was fitted "
            "with: give T_c and p_c in it, or critical=(T_c, p_c)"
        )
    if "T_min" not in w:
        raise PhasePathError(f"wagner: 'T_min' is missing; give {need}")
    lo = I.temperature(w["T_min"], "wagner T_min")
    hi = I.temperature(w["T_max"], "wagner T_max") if w.get("T_max") is not None else T_c
    hi = min(hi, T_c)
    func = vp.wagner_3_6 if form == "3-6" else vp.wagner_25_5
    powers = (1.0, 1.5, 3.0, 6.0) if form == "3-6" else (1.0, 1.5, 2.5, 5.0)

    def ln_ratio(T: float) -> float:  # ln(p/p_c) of the Wagner form
        tau = 1.0 - min(T, T_c) / T_c
        return T_c / T * sum(k * tau**n for k, n in zip(coef, powers, strict=True))

    _fits_in_floats(
        "wagner",
        dict(zip("abcd", coef, strict=True)),
        [(T, ln_ratio(T) + math.log(p_c)) for T in (lo, hi)],
    )

    def f(T: float) -> float:
        return func(min(T, T_c), T_c, p_c, *coef)

    return DataCurve(
        f,
        (lo, hi),
        "Wagner1973" if form == "3-6" else "Poling2001",
        f"Wagner equation ({form} form), published range {lo:g} K to {hi:g} K, "
        f"fitted with T_c = {T_c:g} K, p_c = {p_c:.6g} Pa.",
    )


def _antoine(d: object) -> DataCurve:
    a = I.only(d, ("A", "B", "C", "T_min", "T_max", "base"), "antoine")
    need = "A, B, C for log10(p/Pa) = A - B/(T/K + C), T_min and T_max [K]"
    A, B, C = (I.number(a, k, "antoine", need) for k in "ABC")
    for k in ("T_min", "T_max"):
        if a.get(k) is None:
            raise PhasePathError(f"antoine: {k!r} is missing; give {need}")
    lo, hi = I.temperature(a["T_min"], "antoine T_min"), I.temperature(a["T_max"], "antoine T_max")
    base = a.get("base", 10)
    base = math.e if base in ("e", "ln") else float(base)
    if lo + C <= 0.0:
        raise OutOfRangeError(
            f"antoine: T_min = {lo:g} K lies at or below the pole of the "
            f"equation (T + C <= 0 with C = {C:g} K)"
        )

    def exponent(T: float) -> float:
        return A - B / max(T + C, 1e-3 * (lo + C))

    _fits_in_floats(
        "antoine",
        {"A": A, "B": B, "C": C},
        [(T, exponent(T) * math.log(base)) for T in (lo, hi)],
    )

    def f(T: float) -> float:
        return base ** exponent(T)

    return DataCurve(
        f,
        (lo, hi),
        "Antoine1888",
        f"Antoine equation log{'10' if base == 10 else f'[{base:g}]'}(p/Pa) = "
        f"{A:.6g} - {B:.6g}/(T/K {signed(C)}), published range {lo:g} K to {hi:g} K.",
    )


def _fits_in_floats(
    what: str, coefficients: dict[str, float], ln_p: list[tuple[float, float]]
) -> None:
    """Refuse coefficients whose pressure (ln p at the given temperatures) no float can hold:
    they are wrong, or in other units than Pa and K."""
    for T, y in ln_p:
        if not (math.isfinite(y) and -690.0 < y < 700.0):
            shown = ", ".join(f"{k} = {v:g}" for k, v in coefficients.items())
            raise OutOfRangeError(
                f"{what}: the coefficients ({shown}) give a vapor pressure of e^{y:.4g} Pa at "
                f"{T:g} K, beyond any pressure: check them and their units (p in Pa, T in K)",
                value=coefficients,
            )


def _fitted(
    pts: tuple[tuple[float, float], ...],
    Tb: float | None,
    dH: float | None,
    fits: dict[str, VaporFit],
    notes: list[str],
) -> DataCurve:
    if Tb is not None and all(abs(T - Tb) > 1e-9 * Tb for T, _ in pts):
        pts = tuple(sorted(pts + ((Tb, vp.P_ATM),)))
    if len(pts) == 1:
        if dH is None:
            raise PhasePathError(
                "one vapor point (or a normal boiling point alone) does not fix "
                "a curve: give enthalpy_vaporization=... as well"
            )
        ((T0, p0),) = pts
        dH0 = dH

        def f1(T: float) -> float:
            return vp.clausius_clapeyron(T, T0, p0, dH0)

        return DataCurve(
            f1,
            (T0 - CC_WINDOW, T0 + CC_WINDOW),
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
    return DataCurve(
        chosen.pressure,
        chosen.T_range,
        "Antoine1888" if chosen.form == "antoine" else "Clausius1850",
        text,
    )


def bridge(
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


def check_rising(b: Boundary, name: str) -> None:
    """Refuse a vapor-pressure curve that does not rise with temperature everywhere."""
    T, p = b.sample()
    if not (np.all(np.isfinite(p)) and np.all(p > 0) and np.all(np.diff(p) > 0)):
        k = int(np.argmax(~(np.diff(p) > 0))) if np.all(np.isfinite(p)) else 0
        raise PhasePathError(
            f"{name}: the vapor-pressure curve does not rise with temperature near {T[k]:.5g} K; "
            "check the coefficients and their units (pressure in Pa, temperature in K)"
        )


# -- melting and sublimation ------------------------------------------------------------------
def melting_line(
    sg: Mapping[str, Any] | None,
    slope: float | None,
    T_m: float | None,
    T_t: float,
    p_t: float,
    T_top: float,
    P_top: float,
    notes: list[str],
) -> Boundary | None:
    """The melting branch from the triple point: Simon-Glatzel or a straight line, or None."""
    if sg is not None:
        p_m, source, text, valid_top, shift = _simon_glatzel(sg, T_t, p_t)
    elif slope is not None:
        dpdT = slope

        def p_m(T: float) -> float:
            return p_t + dpdT * (T - T_t)

        source, shift = "common practice", 0.0
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
        top = find_root(lambda t: p_m(t) - P_top, T_t, top, what="the melting line at p_max").root
    valid = (T_t, min(valid_top, top)) if valid_top is not None else None
    if abs(shift) > 1e-9 * max(p_t, 1.0):
        text += f", shifted by {shift:.4g} Pa to meet the triple point"
    note = text + (f"; data up to {valid[1]:g} K" if valid else "") + "."
    notes.append("Melting: " + note)
    return Boundary("melting", "melting", T_t, top, source, p_m, note=note, T_valid=valid)


def _simon_glatzel(
    sg: Mapping[str, Any], T_t: float, p_t: float
) -> tuple[Callable[[float], float], str, str, float | None, float]:
    d = I.only(sg, ("a", "c", "T_max", "T_ref", "p_ref"), "simon_glatzel")
    need = "a [Pa] and c [-] (T_max [K], T_ref [K], p_ref [Pa] optional)"
    a, c = I.number(d, "a", "simon_glatzel", need), I.number(d, "c", "simon_glatzel", need)
    if a <= 0 or c <= 0:
        raise OutOfRangeError(f"simon_glatzel: a = {a:g} Pa and c = {c:g} must be positive")
    has = d.get
    T_ref = I.temperature(d["T_ref"], "simon_glatzel T_ref") if has("T_ref") is not None else T_t
    p_ref = I.pressure(d["p_ref"], "simon_glatzel p_ref") if has("p_ref") is not None else p_t
    shift = p_t - vp.simon_glatzel(T_t, T_ref, p_ref, a, c)

    def p_m(T: float) -> float:
        return vp.simon_glatzel(T, T_ref, p_ref, a, c) + shift

    text = (
        f"Simon-Glatzel equation, a = {a:.6g} Pa, c = {c:.5g}, from ({T_ref:g} K, {p_ref:.6g} Pa)"
    )
    top = I.temperature(d["T_max"], "simon_glatzel T_max") if has("T_max") is not None else None
    return p_m, "SimonGlatzel1929", text, top, shift


def sublimation_curve(T_t: float, p_t: float, dH_sub: float, T_floor: float) -> Boundary:
    """Integrated Clausius-Clapeyron from the triple point with a constant enthalpy [J/mol]."""

    def p_sub(T: float) -> float:
        return vp.clausius_clapeyron(T, T_t, p_t, dH_sub)

    return Boundary(
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
