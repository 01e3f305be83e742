"""Solid-solid phase boundaries of ordinary water and the form of ice at a state.

The boundaries between the ices Ih, II, III, V, VI, VII and VIII up to 2300 MPa follow the
equations of Dunaeva, Antsyshkin & Kuskov (2010), Table 2, one row per boundary,

    T = a + b P + c ln P + d / P + e sqrt(P),        T in K, P in bar,

with the melting curves of IAPWS R14-08 on the liquid side (source ids ``"Dunaeva2010"`` and
``"IAPWS-R14-08"``). The published lines are given with temperature ranges that end at triple
points, but they do not pass exactly through them: at its end points a line misses the triple
point by up to 0.19 K (0.33 K for VI-VIII, 0.69 K for VII-VIII). phasepath therefore shifts each
line in temperature so that it passes exactly through its end triple points: by a constant where
one end is a triple point, by a term linear in P where both ends are. (At a triple point with
liquid the line ends on the R14-08 melting branch of the ice on its low-temperature side, within
2.3 kPa of the tabulated point; see :data:`BOUNDARIES`.) The shift is far below the spread
between independent determinations of these lines (tens of MPa for V-VI and II-VI, see the
tests), and it makes the boundaries meet in points and end on the R14-08 melting branches, so
:func:`ice_form` names, just below a melting branch, the ice of that branch.
:func:`dunaeva_2010_temperature` gives the published equation without the shift.

Ranges: Table 2 gives each row a temperature range and a pressure range; they disagree at the
open low-temperature ends (Ih-II: 1500 bar lies at 171 K, below the stated 200 K). phasepath
takes the temperature ranges, which end at the triple points and at 200 K. For VI-VIII this
reaches 1956 MPa at 200 K, 44 MPa below the 2000 MPa the table gives as its lowest pressure.

Pressures are in pascal, temperatures in kelvin. :func:`boundary` returns a
:class:`SolidBoundary` with ``pressure(T)``, ``dpdT(T)`` and ``temperature(p)``;
:func:`ice_form` names the stable ice at (T, p) on the solid side of the melting curves.

Safety: the pressures of these boundaries (0.2 to 2.3 GPa) are far beyond ordinary pressure
equipment; a sealed vessel in which water freezes can burst. Such work is governed by local codes
and licensed practice.
"""

from __future__ import annotations

import math
from dataclasses import dataclass, field

import numpy as np
from scipy.optimize import brentq

from ..errors import OutOfRangeError
from ._checks import number

__all__ = [
    "SOURCES",
    "ICE_FORMS",
    "T_MIN",
    "P_MAX",
    "TriplePoint",
    "TRIPLE_POINTS",
    "triple_point",
    "SolidBoundary",
    "BOUNDARIES",
    "boundary",
    "dunaeva_2010_temperature",
    "ice_form",
]

SOURCES: dict[str, str] = {
    "Dunaeva2010": (
        "Dunaeva, Antsyshkin & Kuskov, Phase diagram of H2O: Thermodynamic functions of the "
        "phase transitions of high-pressure ices, Solar System Research 44, 202-222 (2010), "
        "doi:10.1134/S0038094610030044 (Table 2: equations of the phase boundaries)"
    ),
}

#: Ice forms :func:`ice_form` can name, in order of first appearance with rising pressure.
ICE_FORMS = ("Ih", "II", "III", "V", "VI", "VII", "VIII")
T_MIN = 200.0  # K, lowest temperature of the Ih-II, II-VI and VI-VIII lines (Dunaeva 2010)
P_MAX = 2300.0e6  # Pa, upper pressure of this module


# --- triple points -------------------------------------------------------------------------


@dataclass(frozen=True)
class TriplePoint:
    """A point where three phases of water coexist.

    Attributes
    ----------
    phases : tuple of str
        The three phases: ``"liquid"`` or ice forms of :data:`ICE_FORMS`.
    T : float
        Temperature [K].
    p : float
        Pressure [Pa].
    source : str
        Source id: ``"IAPWS-R14-08"`` (the points with liquid, the reducing parameters of
        eqs. 3 to 6 of the release) or ``"Dunaeva2010"`` (the end points of the temperature and
        pressure ranges of Table 2).
    """

    phases: tuple[str, str, str]
    T: float
    p: float
    source: str


TRIPLE_POINTS: tuple[TriplePoint, ...] = (
    TriplePoint(("liquid", "Ih", "III"), 251.165, 208.566e6, "IAPWS-R14-08"),
    TriplePoint(("liquid", "III", "V"), 256.164, 350.100e6, "IAPWS-R14-08"),
    TriplePoint(("liquid", "V", "VI"), 273.31, 632.400e6, "IAPWS-R14-08"),
    TriplePoint(("liquid", "VI", "VII"), 355.0, 2216.0e6, "IAPWS-R14-08"),
    TriplePoint(("Ih", "II", "III"), 238.5, 213.0e6, "Dunaeva2010"),
    TriplePoint(("II", "III", "V"), 248.9, 344.0e6, "Dunaeva2010"),
    TriplePoint(("II", "V", "VI"), 209.8, 608.0e6, "Dunaeva2010"),
    TriplePoint(("VI", "VII", "VIII"), 278.16, 2120.0e6, "Dunaeva2010"),
)


def triple_point(a: str, b: str, c: str) -> TriplePoint:
    """The triple point of three phases of water, in any order.

    Parameters
    ----------
    a, b, c : str
        Phase names: ``"liquid"`` or an ice form of :data:`ICE_FORMS`.

    Examples
    --------
    The ice V - ice VI - liquid point of IAPWS R14-08: 273.31 K, 632.4 MPa.

    >>> tp = triple_point("liquid", "V", "VI")
    >>> tp.T, tp.p / 1e6
    (273.31, 632.4)
    """
    want = frozenset((a, b, c))
    for tp in TRIPLE_POINTS:
        if frozenset(tp.phases) == want:
            return tp
    known = ", ".join("-".join(tp.phases) for tp in TRIPLE_POINTS)
    raise OutOfRangeError(f"no triple point {a}-{b}-{c} of water is tabulated; known: {known}")


def _tp(*phases: str) -> TriplePoint:
    return triple_point(*phases)


# --- the published lines ---------------------------------------------------------------------

# Dunaeva et al. (2010), Table 2: (low-pressure form, high-pressure form): T range [K],
# P range [bar], (a, b, c, d, e) of T = a + b P + c ln P + d/P + e sqrt(P).
_TABLE2: dict[tuple[str, str], tuple[tuple[float, float], tuple[float, float], tuple]] = {
    ("Ih", "II"): ((200.0, 238.5), (1500.0, 2130.0), (0.2569, 0.1026, 0.2931, 0.5, 0.3789)),
    ("Ih", "III"): (
        (238.5, 251.165),
        (2085.66, 2130.0),
        (18.9177, -0.3447, 124.452, 0.5709, 0.0),
    ),
    ("III", "II"): ((238.5, 248.9), (2130.0, 3440.0), (6.8396, 0.0007, 33.13, 0.5, -0.5162)),
    ("II", "V"): ((209.8, 248.9), (3440.0, 6080.0), (6.6088, -0.028, 36.2934, 0.0086, 0.7358)),
    ("II", "VI"): ((200.0, 209.8), (6080.0, 6500.0), (1.0231, -0.3688, 6.2306, 0.501, 30.7367)),
    ("III", "V"): (
        (248.9, 256.16),
        (3440.0, 3501.0),
        (0.7846, 0.1647, -0.5408, 0.9999, -5.3526),
    ),
    ("V", "VI"): (
        (209.8, 273.31),
        (6080.0, 6324.0),
        (0.1181, 0.4754, -5.8193, 0.9997, -33.7273),
    ),
    ("VI", "VII"): (
        (278.16, 355.0),
        (21200.0, 22160.0),
        (-47.8507, 0.0, -389.006, 0.9932, 28.8539),
    ),
    ("VI", "VIII"): (
        (200.0, 278.16),
        (20000.0, 21200.0),
        (-8.2483, 0.0518, -81.5196, 0.9991, 0.0),
    ),
    ("VIII", "VII"): (
        (100.0, 278.16),
        (21200.0, 620000.0),
        (696.858, -0.0009, -52.7565, 1.4191, 0.8696),
    ),
}


def _t_dunaeva(coef: tuple, P: float) -> float:
    a, b, c, d, e = coef
    return a + b * P + c * math.log(P) + d / P + e * math.sqrt(P)


def _dtdp_dunaeva(coef: tuple, P: float) -> float:
    _, b, c, d, e = coef
    return b + c / P - d / (P * P) + e / (2.0 * math.sqrt(P))


def _row(a: str, b: str) -> tuple[tuple[str, str], tuple]:
    for key in ((a, b), (b, a)):
        if key in _TABLE2:
            return key, _TABLE2[key]
    known = ", ".join(f"{lo}-{hi}" for lo, hi in _TABLE2)
    raise OutOfRangeError(f"no solid-solid boundary {a}-{b} of water is tabulated; known: {known}")


def dunaeva_2010_temperature(a: str, b: str, p: float) -> float:
    """Coexistence temperature of two ices, Dunaeva et al. (2010) Table 2, as published.

    T = a + b P + c ln P + d / P + e sqrt(P), P in bar; no shift to the triple points (for
    that, use :func:`boundary`).

    Parameters
    ----------
    a, b : str
        The two ice forms, in any order, e.g. ``"Ih"`` and ``"III"``.
    p : float
        Pressure [Pa], within the pressure range of the row (Table 2).

    Returns
    -------
    float
        Temperature [K].

    References
    ----------
    Dunaeva, Antsyshkin & Kuskov, Solar System Research 44, 202 (2010),
    doi:10.1134/S0038094610030044 (``Dunaeva2010``).

    Examples
    --------
    The ice Ih - ice III row ends at the Ih-III-liquid triple point, 251.165 K and 208.566 MPa
    (the T and P ranges of Table 2); the equation gives 251.16 K there.

    >>> round(dunaeva_2010_temperature("Ih", "III", 208.566e6), 2)
    251.16
    """
    key, (_, (P_lo, P_hi), coef) = _row(a, b)
    p = number("p", p)
    P = p / 1e5
    if not P_lo <= P <= P_hi:
        raise OutOfRangeError(
            f"p = {p!r} Pa is outside the {key[0]}-{key[1]} boundary of Dunaeva et al. (2010): "
            f"{P_lo / 10:g} MPa to {P_hi / 10:g} MPa"
        )
    return _t_dunaeva(coef, P)


# --- the melting and sublimation curves of IAPWS R14-08 (eqs. 2 to 7) -------------------------
# Same equations as phasepath.correlations.water_iapws (a test checks they agree); repeated
# here so that this module depends on nothing of phasepath but its errors.


def _melt_ih(T: float) -> float:
    th = T / 273.16
    a = (0.119539337e7, 0.808183159e5, 0.333826860e4)
    b = (0.300000e1, 0.257500e2, 0.103750e3)
    return 611.657 * (1.0 + sum(ai * (1.0 - th**bi) for ai, bi in zip(a, b, strict=True)))


def _melt_iii(T: float) -> float:
    return 208.566e6 * (1.0 - 0.299948 * (1.0 - (T / 251.165) ** 60))


def _melt_v(T: float) -> float:
    return 350.100e6 * (1.0 - 1.18721 * (1.0 - (T / 256.164) ** 8))


def _melt_vi(T: float) -> float:
    return 632.400e6 * (1.0 - 1.07476 * (1.0 - (T / 273.31) ** 4.6))


def _melt_vii(T: float) -> float:
    th = T / 355.0
    return 2216e6 * math.exp(
        1.73683 * (1.0 - 1.0 / th) - 0.544606e-1 * (1.0 - th**5) + 0.806106e-7 * (1.0 - th**22)
    )


def _sublimation(T: float) -> float:
    th = T / 273.16
    a = (-0.212144006e2, 0.273203819e2, -0.610598130e1)
    b = (0.333333333e-2, 0.120666667e1, 0.170333333e1)
    return 611.657 * math.exp(sum(ai * th**bi for ai, bi in zip(a, b, strict=True)) / th)


# --- the boundaries phasepath uses -----------------------------------------------------------


@dataclass(frozen=True)
class SolidBoundary:
    """Coexistence line of two ices: Dunaeva et al. (2010) through its end triple points.

    ``T(p) = T_Dunaeva(p) + shift0 + shift1 (p - p_ref)``; see the module docstring.

    Attributes
    ----------
    low, high : str
        The ice stable on the low-pressure and on the high-pressure side at fixed temperature.
    T_min, T_max : float
        Temperature range [K]; each end is a triple point or the end of the published range.
    p_at_T_min, p_at_T_max : float
        Coexistence pressure at ``T_min`` and ``T_max`` [Pa].
    ends : tuple
        The :class:`TriplePoint` (or ``None`` for an open end) at ``T_min`` and at ``T_max``.
    source : str
        Source id, ``"Dunaeva2010"``.
    """

    low: str
    high: str
    T_min: float
    T_max: float
    p_at_T_min: float
    p_at_T_max: float
    ends: tuple[TriplePoint | None, TriplePoint | None]
    source: str = "Dunaeva2010"
    _coef: tuple = field(default=(), repr=False)
    _shift0: float = field(default=0.0, repr=False)  # K
    _shift1: float = field(default=0.0, repr=False)  # K/Pa
    _p_ref: float = field(default=0.0, repr=False)  # Pa

    @property
    def forms(self) -> tuple[str, str]:
        """(low-pressure form, high-pressure form)."""
        return (self.low, self.high)

    @property
    def p_min(self) -> float:
        """Lowest pressure of the line in its temperature range [Pa]."""
        return min(self.p_at_T_min, self.p_at_T_max)

    @property
    def p_max(self) -> float:
        """Highest pressure of the line in its temperature range [Pa]."""
        return max(self.p_at_T_min, self.p_at_T_max)

    def _t(self, p: float) -> float:
        return _t_dunaeva(self._coef, p / 1e5) + self._shift0 + self._shift1 * (p - self._p_ref)

    def _dtdp(self, p: float) -> float:  # K/Pa
        return _dtdp_dunaeva(self._coef, p / 1e5) / 1e5 + self._shift1

    def _name(self) -> str:
        return f"ice {self.low}-ice {self.high} boundary (Dunaeva et al. 2010)"

    def temperature(self, p: float) -> float:
        """Coexistence temperature [K] at pressure ``p`` [Pa], ``p_min`` to ``p_max``."""
        p = number("p", p)
        if not self.p_min <= p <= self.p_max:
            raise OutOfRangeError(
                f"p = {p!r} Pa is outside the {self._name()}: "
                f"{self.p_min / 1e6:.6g} MPa to {self.p_max / 1e6:.6g} MPa"
            )
        return self._t(p)

    def pressure(self, T: float) -> float:
        """Coexistence pressure [Pa] at temperature ``T`` [K], ``T_min`` to ``T_max``.

        The line is monotone in its range (checked when the module loads: the zeros of dT/dp
        are the positive roots of a quartic in sqrt(p), none inside the range), so the root of
        T(p) = T found by Brent's method on the pressure range (widened by 1e-9 against
        rounding) is the only one; it is within 1e-6 Pa + 4 eps |p| of the exact root.

        Examples
        --------
        Both ends are triple points: ice Ih-II-III of Dunaeva et al. (2010), 238.5 K and
        213.0 MPa, and ice Ih-III-liquid of IAPWS R14-08, 251.165 K and 208.566 MPa.

        >>> b = boundary("Ih", "III")
        >>> round(b.pressure(238.5) / 1e6, 3), round(b.pressure(251.165) / 1e6, 3)
        (213.0, 208.566)
        """
        T = number("T", T)
        if not self.T_min <= T <= self.T_max:
            raise OutOfRangeError(
                f"T = {T!r} K is outside the {self._name()}: {self.T_min} K to {self.T_max} K"
            )
        if T == self.T_min:
            return self.p_at_T_min
        if T == self.T_max:
            return self.p_at_T_max
        lo, hi = self.p_min * (1.0 - _WIDEN), self.p_max * (1.0 + _WIDEN)
        return float(brentq(lambda p: self._t(p) - T, lo, hi, xtol=1e-6, rtol=4 * _EPS))

    def dpdT(self, T: float) -> float:
        """Slope dp/dT of the line [Pa/K] at temperature ``T`` [K] (exact derivative)."""
        return 1.0 / self._dtdp(self.pressure(T))


_EPS = float(np.finfo(float).eps)
_WIDEN = 1e-9  # relative widening of the root bracket, against rounding at the range ends


def _stationary_pressures(coef: tuple, shift1: float) -> list[float]:
    """Pressures [Pa] where dT/dp of a shifted Dunaeva line is zero.

    dT/dP = b' + c/P - d/P**2 + e/(2 sqrt(P)) with b' = b + shift1 * 1e5 [K/bar]; times P**2
    and with x = sqrt(P): b' x**4 + (e/2) x**3 + c x**2 - d = 0.
    """
    _, b, c, d, e = coef
    roots = np.roots([b + shift1 * 1e5, e / 2.0, c, 0.0, -d])
    return sorted(
        float(r.real) ** 2 * 1e5 for r in roots if abs(r.imag) < 1e-12 * abs(r) and r.real > 0
    )


def _build(
    low: str,
    high: str,
    lo_end: TriplePoint | None,
    hi_end: TriplePoint | None,
    T_open: float | None = None,
    p_open: float | None = None,
    hi_p: float | None = None,
) -> SolidBoundary:
    """Shift a Table 2 row through its end triple points; find its open end, if any.

    ``hi_p`` replaces the pressure of the upper end (see :data:`BOUNDARIES`).
    """
    _, ((_T_lo, _T_hi), (P_lo, P_hi), coef) = _row(low, high)
    points = [(lo_end.T, lo_end.p)] if lo_end is not None else []
    if hi_end is not None:
        points.append((hi_end.T, hi_end.p if hi_p is None else hi_p))
    (Ta, pa) = points[0]
    shift0 = Ta - _t_dunaeva(coef, pa / 1e5)
    shift1 = 0.0
    if len(points) == 2:
        Tb, pb = points[1]
        shift1 = ((Tb - _t_dunaeva(coef, pb / 1e5)) - shift0) / (pb - pa)
    proto = SolidBoundary(
        low,
        high,
        0.0,
        0.0,
        0.0,
        0.0,
        (lo_end, hi_end),
        _coef=coef,
        _shift0=shift0,
        _shift1=shift1,
        _p_ref=pa,
    )
    ends_Tp: list[tuple[float, float]] = []
    for tp, p_end in ((lo_end, None), (hi_end, hi_p)):
        if tp is not None:
            ends_Tp.append((tp.T, tp.p if p_end is None else p_end))
        elif p_open is not None:
            ends_Tp.append((proto._t(p_open), p_open))
        else:
            assert T_open is not None
            bracket = (0.9 * P_lo * 1e5, 1.1 * P_hi * 1e5)
            p = float(brentq(lambda q: proto._t(q) - T_open, *bracket, xtol=1e-6, rtol=4 * _EPS))
            ends_Tp.append((T_open, p))
    (T1, p1), (T2, p2) = sorted(ends_Tp)
    lo, hi = min(p1, p2) * (1.0 - _WIDEN), max(p1, p2) * (1.0 + _WIDEN)
    for q in _stationary_pressures(coef, shift1):
        if lo <= q <= hi:
            raise RuntimeError(f"the {low}-{high} line is not monotone at {q} Pa")
    return SolidBoundary(
        low,
        high,
        T1,
        T2,
        p1,
        p2,
        (lo_end, hi_end),
        _coef=coef,
        _shift0=shift0,
        _shift1=shift1,
        _p_ref=pa,
    )


# A line that ends on a liquid triple point ends there on the melting branch of the ice on its
# low-temperature side (III at 256.164 K, V at 273.31 K, VI at 355 K), not at the tabulated
# pressure: the branches of R14-08 miss the tabulated points by up to 2.3 kPa (ice VI at 355 K:
# 2216.002257 MPa), and a line ending below its branch would leave, next to the triple point,
# states just above that branch on the far side of the line.
BOUNDARIES: tuple[SolidBoundary, ...] = (
    _build("Ih", "II", None, _tp("Ih", "II", "III"), T_open=T_MIN),
    _build("Ih", "III", _tp("Ih", "II", "III"), _tp("Ih", "liquid", "III")),
    _build("III", "II", _tp("Ih", "II", "III"), _tp("II", "III", "V")),
    _build("II", "V", _tp("II", "V", "VI"), _tp("II", "III", "V")),
    _build("II", "VI", None, _tp("II", "V", "VI"), T_open=T_MIN),
    _build("III", "V", _tp("II", "III", "V"), _tp("III", "liquid", "V"), hi_p=_melt_iii(256.164)),
    _build("V", "VI", _tp("II", "V", "VI"), _tp("V", "liquid", "VI"), hi_p=_melt_v(273.31)),
    _build("VI", "VII", _tp("VI", "VII", "VIII"), _tp("VI", "liquid", "VII"), hi_p=_melt_vi(355.0)),
    _build("VI", "VIII", None, _tp("VI", "VII", "VIII"), T_open=T_MIN),
    _build("VIII", "VII", None, _tp("VI", "VII", "VIII"), p_open=P_MAX),
)


def boundary(a: str, b: str) -> SolidBoundary:
    """The coexistence line of two ices, in any order (see :class:`SolidBoundary`).

    Parameters
    ----------
    a, b : str
        Ice forms of :data:`ICE_FORMS` that share a boundary below 2300 MPa and above 200 K:
        Ih-II, Ih-III, II-III, II-V, II-VI, III-V, V-VI, VI-VII, VI-VIII, VII-VIII.

    Examples
    --------
    Ice V - ice VI ends at the V-VI-liquid triple point of IAPWS R14-08, 632.4 MPa at 273.31 K,
    and at the II-V-VI point of Dunaeva et al. (2010), 608.0 MPa at 209.8 K.

    >>> b = boundary("VI", "V")
    >>> b.low, b.high, b.T_min, b.T_max
    ('V', 'VI', 209.8, 273.31)
    >>> round(b.pressure(273.31) / 1e6, 1), round(b.pressure(209.8) / 1e6, 1)
    (632.4, 608.0)
    """
    want = frozenset((a, b))
    for bd in BOUNDARIES:
        if frozenset(bd.forms) == want:
            return bd
    known = ", ".join(f"{bd.low}-{bd.high}" for bd in BOUNDARIES)
    raise OutOfRangeError(f"ice {a} and ice {b} share no boundary here; known: {known}")


_B = {frozenset(bd.forms): bd for bd in BOUNDARIES}


def _p(a: str, b: str, T: float) -> float:
    return _B[frozenset((a, b))].pressure(T)


def _require_solid(T: float, p: float) -> None:
    """Raise unless (T, p) is on the solid side of the R14-08 melting and sublimation curves."""
    state = f"(T, p) = ({T!r} K, {p!r} Pa)"
    if T <= 273.16 and p < _sublimation(T):
        raise OutOfRangeError(
            f"{state} is water vapour: below the sublimation pressure of ice Ih, "
            f"{_sublimation(T):.6g} Pa (IAPWS R14-08)"
        )
    if T <= 251.165:
        return
    if T <= 273.16:
        if p <= _melt_ih(T):
            return
        upper, name = (_melt_iii(T), "III") if T <= 256.164 else (_melt_v(T), "V")
        if p < upper:
            raise OutOfRangeError(
                f"{state} is liquid water: between the melting pressures of ice Ih, "
                f"{_melt_ih(T) / 1e6:.6g} MPa, and ice {name}, {upper / 1e6:.6g} MPa "
                "(IAPWS R14-08)"
            )
        return
    if T <= 273.31:
        melt, name = _melt_v(T), "V"
    elif T <= 355.0:
        melt, name = _melt_vi(T), "VI"
    elif T <= 715.0:
        melt, name = _melt_vii(T), "VII"
    else:
        melt, name = math.inf, "VII"
    if p < melt:
        raise OutOfRangeError(
            f"{state} is fluid water: below the melting pressure of ice {name}, "
            f"{melt / 1e6:.6g} MPa (IAPWS R14-08)"
        )


# --- the form of ice at a state --------------------------------------------------------------


def ice_form(T: float, p: float) -> str:
    """The stable form of ice at (T, p): "Ih", "II", "III", "V", "VI", "VII" or "VIII".

    The solid region is that of the IAPWS R14-08 melting and sublimation curves; within it the
    lines of :data:`BOUNDARIES` divide the forms. On a solid-solid line the high-pressure form
    is named; on a melting curve, the ice of that branch. Because the lines end on the R14-08
    branches at the triple points, a state just on the solid side of a melting branch is named
    after that branch, also next to the triple points, with one exception the release makes:
    its Ih and III equations differ by 566 Pa at 251.165 K and overlap up to 251.165024 K;
    there ice Ih is named.

    Parameters
    ----------
    T : float
        Temperature [K], 200 K or above.
    p : float
        Pressure [Pa], above 0 Pa to 2300 MPa.

    Returns
    -------
    str
        The ice form.

    Raises
    ------
    OutOfRangeError
        If (T, p) is liquid or vapour, or outside 200 K and 0 Pa to 2300 MPa.

    References
    ----------
    Dunaeva et al. (2010), doi:10.1134/S0038094610030044; IAPWS R14-08(2011).

    Examples
    --------
    Ice Ih at 1 atm, ice II at 220 K and 300 MPa, ice III at 250 K and 250 MPa, ice VI at 300 K
    and 1 GPa (common practice, any phase diagram of water).

    >>> ice_form(263.15, 101325.0), ice_form(220.0, 300e6), ice_form(250.0, 250e6)
    ('Ih', 'II', 'III')
    >>> ice_form(300.0, 1.0e9)
    'VI'
    """
    T = number("T", T)
    p = number("p", p)
    if T < T_MIN:
        raise OutOfRangeError(
            f"T = {T!r} K is below {T_MIN} K, where the ice Ih-II, II-VI and VI-VIII boundaries "
            "of Dunaeva et al. (2010) begin"
        )
    if not 0.0 < p <= P_MAX:
        raise OutOfRangeError(
            f"p = {p!r} Pa is outside the range of the ice boundaries: above 0 Pa to 2300 MPa"
        )
    _require_solid(T, p)

    # ices VII and VIII, above the VI-VIII and VI-VII lines
    T_678 = 278.16
    if T >= T_678:
        if T > 355.0 or p >= _p("VI", "VII", T):
            return "VII"
    elif p >= _p("VI", "VIII", T):
        b78 = _B[frozenset(("VII", "VIII"))]
        return "VII" if T >= b78.T_min and p >= b78.pressure(T) else "VIII"
    # ice VI, above the II-VI and V-VI lines
    if T > 273.31:
        return "VI"
    if p >= (_p("V", "VI", T) if T >= 209.8 else _p("II", "VI", T)):
        return "VI"
    # ices Ih, II, III, V
    if T >= 251.165:  # liquid lies between ice Ih and ices III, V
        if T <= 273.16 and p <= _melt_ih(T):
            return "Ih"  # also where the Ih and III branches overlap, up to 251.165024 K
        return "III" if T < 256.164 and p < _p("III", "V", T) else "V"
    if T < 238.5:
        if p < _p("Ih", "II", T):
            return "Ih"
        if T < 209.8:
            return "II"
        return "II" if p < _p("II", "V", T) else "V"
    if p < _p("Ih", "III", T):
        return "Ih"
    if T >= 248.9:
        return "III" if p < _p("III", "V", T) else "V"
    if p < _p("III", "II", T):
        return "III"
    return "II" if p < _p("II", "V", T) else "V"
