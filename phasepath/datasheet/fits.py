"""Vapor-pressure curves fitted to measured (T, p) points, with uncertainties and residuals.

Two forms, both fitted by least squares in ln p (every point carries the same relative weight):

* :func:`fit_clausius_clapeyron`: the integrated Clausius-Clapeyron line
  ln p = a - (dH/R)(1/T), two parameters, the enthalpy of vaporization dH taken constant
  (Clausius 1850; ideal gas, condensed volume neglected).
* :func:`fit_antoine`: the Antoine form log10(p/Pa) = A - B/(T/K + C), three parameters
  (Antoine 1888); linear in A and B for a given C, and C found by a bounded profile search.

Each fit is a :class:`VaporFit`: the parameters, one standard uncertainty of each (where the
points leave degrees of freedom to estimate it), the points and their residuals.
:mod:`phasepath.datasheet` builds a substance's vapor-pressure curve from these fits.
"""

from __future__ import annotations

import math
from collections.abc import Sequence
from dataclasses import dataclass
from typing import TYPE_CHECKING

import numpy as np

from .. import format as F
from ..correlations import vapor_pressure as vp
from ..errors import PhasePathError
from .inputs import points as _points

if TYPE_CHECKING:  # pragma: no cover
    import pandas as pd

__all__ = ["VaporFit", "fit_clausius_clapeyron", "fit_antoine", "signed"]


# -- fits -----------------------------------------------------------------------------------------
@dataclass(frozen=True)
class VaporFit:
    """A vapor-pressure curve fitted to measured points, with its uncertainty and residuals.

    Attributes
    ----------
    form : {"antoine", "clausius-clapeyron"}
    params : dict
        Antoine: ``A`` [-], ``B`` [K], ``C`` [K] for log10(p/Pa) = A - B/(T/K + C).
        Clausius-Clapeyron: ``T_ref`` [K], ``p_ref`` [Pa], ``dH`` [J/mol].
    stderr : dict
        One standard uncertainty of each fitted parameter (NaN where the points leave no degree
        of freedom to estimate it).
    points : tuple of (T [K], p [Pa])
    residuals : tuple of float
        ln(p_measured / p_fitted) of each point (about the relative deviation).
    """

    form: str
    params: dict[str, float]
    stderr: dict[str, float]
    points: tuple[tuple[float, float], ...]
    residuals: tuple[float, ...]

    @property
    def dof(self) -> int:
        """Degrees of freedom left: points minus fitted parameters."""
        return len(self.points) - (3 if self.form == "antoine" else 2)

    @property
    def T_range(self) -> tuple[float, float]:
        Ts = [t for t, _ in self.points]
        return min(Ts), max(Ts)

    @property
    def rms(self) -> float:
        """Root-mean-square residual in ln p (about the relative deviation)."""
        return float(np.sqrt(np.mean(np.square(self.residuals))))

    def pressure(self, T: float) -> float:
        """The fitted curve [Pa] at T [K] (no range check: see ``T_range``)."""
        q = self.params
        if self.form == "antoine":
            return vp.antoine(T, q["A"], q["B"], q["C"])
        return vp.clausius_clapeyron(T, q["T_ref"], q["p_ref"], q["dH"])

    def enthalpy(self, T: float | None = None) -> float:
        """Enthalpy of vaporization [J/mol] the fit implies at T [K] (ideal gas).

        For the two-parameter Clausius-Clapeyron fit it is the constant ``dH``; for Antoine it is
        R T^2 ln(10) B / (T + C)^2, by default at the mean of 1/T of the points.
        """
        q = self.params
        if self.form != "antoine":
            return q["dH"]
        if T is None:
            T = 1.0 / float(np.mean([1.0 / t for t, _ in self.points]))
        return vp.R * T * T * math.log(10.0) * q["B"] / (T + q["C"]) ** 2

    @property
    def enthalpy_stderr(self) -> float:
        """One standard uncertainty of the Clausius-Clapeyron ``dH`` [J/mol] (NaN if unknown)."""
        return self.stderr.get("dH", math.nan)

    def table(self) -> pd.DataFrame:
        """One row per point: T, measured p, fitted p, residual in percent."""
        import pandas as pd

        rows = [
            {
                "T [K]": T,
                "p measured [Pa]": p,
                "p fitted [Pa]": self.pressure(T),
                "residual [%]": 100.0 * math.expm1(r),
            }
            for (T, p), r in zip(self.points, self.residuals, strict=True)
        ]
        return pd.DataFrame(rows)

    def describe(self) -> str:
        """One sentence for the substance's notes."""
        lo, hi = self.T_range
        n = len(self.points)
        worst = max(range(n), key=lambda i: abs(self.residuals[i]))
        spread = (
            f"rms residual {100 * self.rms:.2g} % of p, largest "
            f"{100 * math.expm1(self.residuals[worst]):+.2g} % at {self.points[worst][0]:g} K"
            if self.dof > 0
            else "no degree of freedom left: residuals are zero by "
            "construction and the uncertainty is not estimated"
        )
        if self.form == "antoine":
            q, s = self.params, self.stderr
            A, B = F.fitted(q["A"], s["A"]), F.fitted(q["B"], s["B"])
            C = F.fitted(abs(q["C"]), s["C"])
            errors = (
                f"A ± {F.significant(s['A'], 2)}, B ± {F.significant(s['B'], 2)} K, "
                f"C ± {F.significant(s['C'], 2)} K, correlated: the fit holds them in full"
                if math.isfinite(s["C"])
                else "no uncertainty estimated"
            )
            return (
                f"Antoine fitted to {n} vapor points ({lo:g} K to {hi:g} K): "
                f"log10(p/Pa) = {A} - {B}/(T/K {'+' if q['C'] >= 0 else '-'} {C}) "
                f"({errors}); {spread}."
            )
        dh, sd = self.params["dH"], self.enthalpy_stderr
        unc = f" ± {F.significant(sd / 1e3, 2)}" if math.isfinite(sd) else ""
        return (
            f"Two-parameter Clausius-Clapeyron fit of {n} vapor points ({lo:g} K to {hi:g} K): "
            f"enthalpy of vaporization {F.fitted(dh / 1e3, sd / 1e3)}{unc} kJ/mol "
            f"(1 standard uncertainty); {spread}."
        )


def signed(x: float) -> str:
    """x written with its sign apart: "+ 12.5", "- 3"."""
    return f"{'+' if x >= 0 else '-'} {abs(x):.5g}"


def fit_clausius_clapeyron(points: Sequence[Sequence[object]]) -> VaporFit:
    """Least-squares line ln p = a - (dH/R)(1/T) through two or more (T [K], p [Pa]) points.

    The reference temperature is the mean of 1/T of the points (so that ``T_ref`` and ``dH`` are
    uncorrelated); standard uncertainties from the residual variance with n - 2 degrees of freedom.

    Points on an exact line with dH = 35 kJ/mol (synthetic, known by construction):

    >>> pts = [(T, vp.clausius_clapeyron(T, 320.0, 2e4, 35e3)) for T in (300.0, 320.0, 340.0)]
    >>> fit = fit_clausius_clapeyron(pts)
    >>> round(fit.enthalpy(), 6), fit.dof
    (35000.0, 1)
    """
    pts = _points(points)
    if len(pts) < 2:
        raise PhasePathError("a Clausius-Clapeyron fit needs at least two vapor points")
    x = np.array([1.0 / t for t, _ in pts])
    y = np.log([p for _, p in pts])
    xm = float(x.mean())
    X = np.column_stack([np.ones_like(x), x - xm])
    coef, *_ = np.linalg.lstsq(X, y, rcond=None)
    res = y - X @ coef
    n = len(pts)
    dH = -coef[1] * vp.R
    if n > 2:
        s2 = float(res @ res) / (n - 2)
        cov = s2 * np.linalg.inv(X.T @ X)
        sd_dH = float(np.sqrt(cov[1, 1])) * vp.R
        sd_p = float(np.sqrt(cov[0, 0])) * math.exp(coef[0])
    else:
        sd_dH = sd_p = math.nan
    return VaporFit(
        "clausius-clapeyron",
        {"T_ref": 1.0 / xm, "p_ref": float(math.exp(coef[0])), "dH": float(dH)},
        {"T_ref": 0.0, "p_ref": sd_p, "dH": sd_dH},
        pts,
        tuple(float(r) for r in res),
    )


def fit_antoine(points: Sequence[Sequence[object]]) -> VaporFit:
    """Least-squares Antoine curve log10(p/Pa) = A - B/(T/K + C) through three or more points.

    Residuals are taken in ln p (equal relative weight for every point). For each trial C the
    problem is linear in A and B; C is found by a grid scan and a bounded refinement of that
    profile over -0.9 T_min < C < 0.5 T_min. Standard uncertainties from the Jacobian with
    n - 3 degrees of freedom.

    Raises :class:`~phasepath.errors.PhasePathError` if the best C lies on a bound (the points do
    not determine the curvature).

    >>> pts = [(T, vp.antoine(T, 9.0, 1300.0, -55.0)) for T in (290.0, 320.0, 350.0, 380.0)]
    >>> q = fit_antoine(pts).params
    >>> round(q["A"], 6), round(q["B"], 3), round(q["C"], 4)
    (9.0, 1300.0, -55.0)
    """
    from scipy.optimize import minimize_scalar

    pts = _points(points)
    n = len(pts)
    if n < 3:
        raise PhasePathError("an Antoine fit needs at least three vapor points")
    T = np.array([t for t, _ in pts])
    y = np.log([p for _, p in pts])
    lo, hi = -0.9 * T.min(), 0.5 * T.min()

    def solve(C: float) -> tuple[np.ndarray, np.ndarray]:
        X = np.column_stack([np.ones_like(T), -1.0 / (T + C)])
        coef, *_ = np.linalg.lstsq(X, y, rcond=None)
        return coef, y - X @ coef

    def ssr(C: float) -> float:
        r = solve(C)[1]
        return float(r @ r)

    grid = np.linspace(lo, hi, 241)
    k = int(np.argmin([ssr(c) for c in grid]))
    a, b = grid[max(k - 1, 0)], grid[min(k + 1, len(grid) - 1)]
    C = float(
        minimize_scalar(ssr, bounds=(a, b), method="bounded", options={"xatol": 1e-9 * T.min()}).x
    )
    if min(C - lo, hi - C) < 1e-3 * T.min():
        raise PhasePathError(
            f"the vapor points ({T.min():g} K to {T.max():g} K) do not determine the Antoine "
            f"curvature: the best offset C lies on its bound ({C:.4g} K)"
        )
    coef, res = solve(C)
    ln10 = math.log(10.0)
    A, B = coef[0] / ln10, coef[1] / ln10
    if n > 3:
        J = np.column_stack([np.ones_like(T), -1.0 / (T + C), coef[1] / (T + C) ** 2])
        cov = float(res @ res) / (n - 3) * np.linalg.inv(J.T @ J)
        sd = np.sqrt(np.diag(cov))
        stderr = {"A": sd[0] / ln10, "B": sd[1] / ln10, "C": float(sd[2])}
    else:
        stderr = {"A": math.nan, "B": math.nan, "C": math.nan}
    return VaporFit(
        "antoine",
        {"A": float(A), "B": float(B), "C": C},
        {k_: float(v) for k_, v in stderr.items()},
        pts,
        tuple(float(r) for r in res),
    )
