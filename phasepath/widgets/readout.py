"""What the planner says about a state: the readout under the cursor and the state of each corner
in the leg list, in the display units with the display precision (no widget library here); and
the core's messages with their SI numbers written in the display units.

>>> import phasepath as pp
>>> from phasepath.format import DisplayUnits
>>> st = pp.Route("CO2", T="-20 degC", p="30 bar").end_state()
>>> state_text(st, DisplayUnits("degC", "bar", "kJ/kg"))  # regression pin  # doctest: +ELLIPSIS
'T −20.000 °C · p 30 bar · liquid · h 154.2... kJ/kg · s 0.828... kJ/(kg K) · ρ 1036... kg/m³'
>>> in_display_units("T = 243.14999999999998 K, p = 101325.0 Pa", DisplayUnits("degC", "bar"))
'T = −30.000 °C, p = 1.01325 bar'
"""

from __future__ import annotations

import re

from .. import format as F
from ..format import UNIT_LABELS, DisplayUnits
from ..records import StatePoint
from ..units import convert
from ..views import AXES
from .coords import entropy_unit, unit_of

__all__ = ["state_text", "state_parts", "coordinate_text", "in_display_units", "minus"]


def minus(text: str) -> str:
    """A leading hyphen-minus as the Unicode minus sign (the way the planner shows numbers)."""
    return text.replace("-", "\u2212") if text.startswith("-") else text


def _entropy(s: float, unit: str) -> str:
    value = F.significant(convert(s, "J/(kg K)", unit, "entropy"))
    return f"{minus(value)} {UNIT_LABELS.get(unit, unit).replace('degR', '°R')}"


def _q(x: float | None, kind: str, unit: str | None) -> str:
    text = F.quantity(x, kind, unit)
    return minus(text)


def state_parts(st: StatePoint, units: DisplayUnits) -> dict[str, str]:
    """The shown quantities of a state, each with its unit ("—" where no model gives it)."""
    parts = {
        "T": _q(st.T, "temperature", units.T),
        "p": _q(st.p, "pressure", units.p),
        "phase": st.text,
        "h": _q(st.h, "energy", units.energy) if st.h is not None else F.NONE,
        "s": _entropy(st.s, entropy_unit(units.energy)) if st.s is not None else F.NONE,
        "rho": _q(st.rho, "density", "kg/m3") if st.rho is not None else F.NONE,
    }
    if st.vapor_fraction is not None:
        parts["x"] = f"vapor {F.fraction(st.vapor_fraction)}"
    if st.solid_fraction is not None:
        parts["solid"] = f"solid {F.fraction(st.solid_fraction)}"
    return parts


def state_text(st: StatePoint, units: DisplayUnits) -> str:
    """One line: T · p · phase (and ice form) · h · s · ρ · vapor or solid fraction."""
    p = state_parts(st, units)
    out = [f"T {p['T']}", f"p {p['p']}", p["phase"]]
    for key, name in (("h", "h"), ("s", "s"), ("rho", "ρ")):
        if p[key] != F.NONE:
            out.append(f"{name} {p[key]}")
    out += [p[k] for k in ("x", "solid") if k in p]
    if st.h is None and st.model:
        out.append("no h or s: " + st.model)
    return " · ".join(out)


def coordinate_text(view: str, x: float, y: float, units: DisplayUnits) -> str:
    """A point of a view (SI) in words: "−56.558 °C, 5.17964 bar"."""
    out = []
    for q, v in zip(AXES[view], (x, y), strict=True):
        unit = unit_of(q, units)
        if q == "s":
            out.append(_entropy(v, unit))
        else:
            kind = {"T": "temperature", "p": "pressure", "h": "energy"}[q]
            out.append(_q(v, kind, unit))
    return ", ".join(out)


_NUM = r"([-+]?(?:\d+\.?\d*|\.\d+)(?:[eE][-+]?\d+)?)"
_T_EQ = re.compile(r"\b(T(?:_sat|_t|_c)?|temperature)\s*=\s*" + _NUM + r"\s*K\b")
_P_EQ = re.compile(r"(?<![\w.])" + _NUM + r"\s*Pa\b")
_T_AT = re.compile(r"(?<![\w.=])" + _NUM + r"\s*K\b(?!\s*(?:superheat|subcooling|/|per\b))")


def in_display_units(text: str, units: DisplayUnits) -> str:
    """A core message with its temperatures [K] and pressures [Pa] written in the display
    units at the display precision (a temperature difference such as "5 K superheat" is left
    as it is)."""

    def temp(m: re.Match[str]) -> str:
        return f"{m.group(1)} = {_q(float(m.group(2)), 'temperature', units.T)}"

    def pres(m: re.Match[str]) -> str:
        return _q(float(m.group(1)), "pressure", units.p)

    def bare(m: re.Match[str], whole: str) -> str:
        start = m.start()
        before = whole[max(0, start - 3) : start]
        if before.endswith("by "):
            return m.group(0)
        return _q(float(m.group(1)), "temperature", units.T)

    out = _P_EQ.sub(pres, _T_EQ.sub(temp, text))
    return _T_AT.sub(lambda m: bare(m, out), out)
