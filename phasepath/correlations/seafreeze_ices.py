"""Ices II, III, V and VI (and liquid water, for comparison) from seafreeze: optional extra.

The Gibbs-energy representations of Journaux et al. (2020) for ices II, III, V and VI and of
Bollengier, Brown & Shaw (2019) for liquid water (``"water1"``), as packaged in ``seafreeze``
(source ids ``"Journaux2020"`` and ``"Bollengier2019"``). ``seafreeze`` is licensed under the
GPL and is not a dependency of phasepath: install it with ``pip install phasepath[ices]``. It is
imported on first use only; without it every function here raises :class:`MissingExtraError`.

Reference state. seafreeze's ice Ih is the IAPWS R10-06 Gibbs function, which has the
IAPWS-95 reference state (u = s = 0 for liquid water at the triple point, as in CoolProp): at
273.16 K and 611.657 Pa seafreeze gives h = -333444.271 J/kg and s = -1220.69440 J/(kg K),
R10-06 gives -333444.254 J/kg and -1220.69433 J/(kg K). Its liquid (``"water1"``) has the same
reference: there it differs from IAPWS-95 by 0.1 J/kg in g, 71 J/kg in h and 0.26 J/(kg K) in
s, the accuracy of the fit, not an offset. The Gibbs functions of ices II, III, V and VI were
fitted to the phase boundaries with these two, which fixes their free constants (the a + b T a
Gibbs function may carry) on the same reference. So no conversion is needed: :data:`H_OFFSET`
and :data:`S_OFFSET` are zero, and ``h_liquid(IAPWS-95) - h`` of an ice here is its latent
heat of melting. The tests check this against ice Ih of R10-06 (within 0.05 J/kg) and against
the Clausius-Clapeyron equation with the IAPWS R14-08 melting curves: pointwise with their
slopes for ices V and VI (within 1 % and 2 % away from the triple points), integrated along
the branch for ices V and VI (1 %) and III (5 %). On the R14-08 melting curves the Gibbs energy
of ice V or VI here and that of IAPWS-95 liquid differ by 0.15 to 0.4 kJ/kg, the difference
between seafreeze's liquid and IAPWS-95 there; as an a + b T offset it would change a latent
heat by about 0.1 %, well inside that check.

seafreeze's own liquid is not IAPWS-95 at high pressure: at 350 MPa and 256 K its enthalpy is
about 8 kJ/kg below that of IAPWS-95, so latent heats taken against it are 2 to 3 % smaller
than against IAPWS-95. It is offered for comparison only.

Safety: these ices exist only at pressures of 0.2 to 2 GPa, far beyond ordinary pressure
equipment; such work is governed by local codes and licensed practice.
"""

from __future__ import annotations

import math
import warnings
from dataclasses import dataclass
from functools import cache, lru_cache

import numpy as np

from ..errors import OutOfRangeError, PhasePathError, PropertyError
from ._checks import number

__all__ = [
    "SOURCES",
    "FORMS",
    "H_OFFSET",
    "S_OFFSET",
    "MissingExtraError",
    "SeafreezeState",
    "seafreeze_state",
    "prefetch",
]

SOURCES: dict[str, str] = {
    "Journaux2020": (
        "Journaux, Brown, Pakhomova, Collings, Petitgirard, Espinoza, Boffa Ballaran, Vance, "
        "Ott, Cova, Garbarino & Hanfland, Holistic Approach for Studying Planetary Hydrospheres: "
        "Gibbs Representation of Ices Thermodynamics, Elasticity, and the Water Phase Diagram "
        "to 2,300 MPa, J. Geophys. Res. Planets 125, e2019JE006176 (2020), "
        "doi:10.1029/2019JE006176 (software: seafreeze, GPL-3.0)"
    ),
    "Bollengier2019": (
        "Bollengier, Brown & Shaw, Thermodynamics of pure liquid water: Sound speed "
        "measurements to 700 MPa down to the freezing point, and an equation of state to "
        "2300 MPa from 240 to 500 K, J. Chem. Phys. 151, 054501 (2019), doi:10.1063/1.5097179"
    ),
}

#: phasepath name -> seafreeze material code.
FORMS: dict[str, str] = {
    "Ih": "Ih",
    "II": "II",
    "III": "III",
    "V": "V",
    "VI": "VI",
    "liquid": "water1",
}

H_OFFSET = 0.0  # J/kg: h(IAPWS-95 reference) = h(seafreeze) + H_OFFSET
S_OFFSET = 0.0  # J/(kg K): s(IAPWS-95 reference) = s(seafreeze) + S_OFFSET


class MissingExtraError(PhasePathError, ImportError):
    """An optional dependency is not installed; names the package and the extra to install."""

    def __init__(self, package: str, extra: str) -> None:
        self.package = package
        self.extra = extra
        super().__init__(str(self))

    def __str__(self) -> str:
        return (
            f"this needs the optional package {self.package!r}, which is not installed: "
            f"install phasepath[{self.extra}] (pip install 'phasepath[{self.extra}]'); "
            f"{self.package} is GPL-licensed and not part of phasepath"
        )


@dataclass(frozen=True)
class SeafreezeState:
    """Properties of one phase of water at (T, p) from seafreeze, IAPWS-95 reference state.

    Attributes
    ----------
    form : str
        ``"Ih"``, ``"II"``, ``"III"``, ``"V"``, ``"VI"`` or ``"liquid"``.
    T : float
        Temperature [K].
    p : float
        Pressure [Pa].
    h : float
        Specific enthalpy [J/kg].
    s : float
        Specific entropy [J/(kg K)].
    rho : float
        Density [kg/m3].
    g : float
        Specific Gibbs energy [J/kg].
    """

    form: str
    T: float
    p: float
    h: float
    s: float
    rho: float
    g: float


def _seafreeze():
    try:
        import seafreeze
    except ImportError as exc:
        raise MissingExtraError("seafreeze", "ices") from exc
    return seafreeze


@cache
def _ranges(code: str) -> tuple[tuple[float, float], tuple[float, float]]:
    """(T range [K], p range [Pa]) of a seafreeze material, from its spline knots."""
    sf = _seafreeze()
    r = sf.phase_range(code)
    return (float(r.T[0]), float(r.T[1])), (float(r.P[0]) * 1e6, float(r.P[1]) * 1e6)


_PREFETCHED: dict[tuple[str, float, float], tuple[float, float, float, float]] = {}
_PREFETCH_MAX = 8192


def prefetch(form: str, Ts: list[float], ps: list[float]) -> None:
    """Evaluate many states of one form in a single seafreeze call (about a tenth of the time
    of calling it state by state), for :func:`seafreeze_state` to use. States outside the
    form's range, or a seafreeze failure, are left to the state-by-state call.

    Parameters
    ----------
    form : str
        A form of :data:`FORMS`.
    Ts, ps : list of float
        Temperatures [K] and pressures [Pa] of the states, pairwise.
    """
    if form not in FORMS:
        return
    sf = _seafreeze()
    code = FORMS[form]
    (T_lo, T_hi), (p_lo, p_hi) = _ranges(code)
    todo = [
        (float(T), float(p))
        for T, p in zip(Ts, ps, strict=True)
        if T_lo <= T <= T_hi and p_lo <= p <= p_hi and p > 0.0 and (code, T, p) not in _PREFETCHED
    ]
    if not todo:
        return
    PT = np.empty((len(todo),), dtype=object)
    for i, (T, p) in enumerate(todo):
        PT[i] = (p / 1e6, T)
    try:
        with warnings.catch_warnings():
            warnings.simplefilter("ignore")
            out = sf.getProp(PT, code)
        cols = [np.asarray(getattr(out, k, np.full(len(todo), np.nan))).ravel() for k in _KEYS]
    except Exception:  # noqa: BLE001 - the state-by-state call reports the failure
        return
    if len(_PREFETCHED) + len(todo) > _PREFETCH_MAX:
        _PREFETCHED.clear()
    for i, (T, p) in enumerate(todo):
        _PREFETCHED[(code, T, p)] = tuple(float(c[i]) for c in cols)  # type: ignore[assignment]


@lru_cache(maxsize=4096)
def _evaluate(code: str, T: float, p: float) -> tuple[float, float, float, float]:
    sf = _seafreeze()  # first: without the package nothing is returned, prefetched or not
    known = _PREFETCHED.get((code, T, p))
    if known is not None:
        return known
    PT = np.empty((1,), dtype=object)
    PT[0] = (p / 1e6, T)
    with warnings.catch_warnings():
        warnings.simplefilter("ignore")
        out = sf.getProp(PT, code)
    g, h, s, rho = (float(np.asarray(getattr(out, k, np.nan)).ravel()[0]) for k in _KEYS)
    return g, h, s, rho


_KEYS = ("G", "H", "S", "rho")


def seafreeze_state(form: str, T: float, p: float) -> SeafreezeState:
    """h, s, rho and g of an ice (or liquid water) at (T, p) from seafreeze.

    Parameters
    ----------
    form : str
        ``"II"``, ``"III"``, ``"V"``, ``"VI"``; ``"Ih"`` (IAPWS R10-06, as in
        :mod:`phasepath.correlations.ice_ih`) and ``"liquid"`` (Bollengier et al. 2019) for
        comparison.
    T : float
        Temperature [K], within the range of the form's representation (II, III: up to
        270 K; V: 300 K; VI: 400 K; liquid: 239 K to 501 K).
    p : float
        Pressure [Pa], within the range of the form's representation (II: to 900 MPa;
        III: 500 MPa; V: 1000 MPa; VI: 3000 MPa; liquid: 2300 MPa).

    Returns
    -------
    SeafreezeState
        h [J/kg], s [J/(kg K)], rho [kg/m3], g [J/kg], on the IAPWS-95 reference state.

    Raises
    ------
    MissingExtraError
        If seafreeze is not installed.
    OutOfRangeError
        Outside the range of the representation (seafreeze would return nothing there).
    PropertyError
        If seafreeze fails or returns a non-finite value.

    References
    ----------
    Journaux et al. (2020), doi:10.1029/2019JE006176; Bollengier et al. (2019),
    doi:10.1063/1.5097179.

    Examples
    --------
    Ice Ih at the triple point, where IAPWS R10-06 gives h = -333444.254 J/kg (Table 6 of
    the release); needs seafreeze, so not run here (the tests check it).

    >>> round(seafreeze_state("Ih", 273.16, 611.657).h)  # doctest: +SKIP
    -333444
    """
    if form not in FORMS:
        raise OutOfRangeError(
            f"form = {form!r} is not one of the phases seafreeze gives here: {', '.join(FORMS)}"
        )
    T = number("T", T)
    p = number("p", p)
    code = FORMS[form]
    (T_lo, T_hi), (p_lo, p_hi) = _ranges(code)
    if not T_lo <= T <= T_hi:
        raise OutOfRangeError(
            f"T = {T!r} K is outside the range of {form} in seafreeze ({code}): "
            f"{T_lo:.6g} K to {T_hi:.6g} K"
        )
    if not (p_lo <= p <= p_hi and p > 0.0):
        raise OutOfRangeError(
            f"p = {p!r} Pa is outside the range of {form} in seafreeze ({code}): "
            f"above {p_lo / 1e6:.6g} MPa to {p_hi / 1e6:.6g} MPa"
        )
    try:
        g, h, s, rho = _evaluate(code, T, p)
    except MissingExtraError:
        raise
    except Exception as exc:
        raise PropertyError(
            f"seafreeze failed for {form} ({code}) at T = {T!r} K, p = {p!r} Pa: {exc}"
        ) from exc
    if not all(math.isfinite(x) for x in (g, h, s, rho)):
        raise PropertyError(
            f"seafreeze returned a non-finite value for {form} ({code}) at T = {T!r} K, "
            f"p = {p!r} Pa: g={g}, h={h}, s={s}, rho={rho}"
        )
    return SeafreezeState(form, T, p, h + H_OFFSET, s + S_OFFSET, rho, g + H_OFFSET - T * S_OFFSET)
