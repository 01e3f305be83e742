"""Comparing two sets of results: a plan against its expected results (``phasepath check``) and
plan B against plan A (:func:`compare`, ``phasepath diff``). One engine does both.

Both sides are results documents (:func:`phasepath.results.document` of a report, or a results
file read back with :func:`phasepath.results.read`), so a plan compared with itself today and a
plan compared with a file written last year go through the same code. What is compared is what
a review signs off:

* the crossings, paired by leg, kind and phases in route order (moved in T, p or latent heat,
  appeared, disappeared, or on another boundary);
* per leg: its kind and basis, the start of the route, the end state (T, p, phase, ice form,
  vapor and solid mass fraction), the heat and the work per kg; legs that appeared or
  disappeared;
* per leg, the hazard flags on the leg and its crossings, gained or lost.

A difference is a :class:`Difference`; its sign reads like a diff of B against A (or of today's
results against the expected ones): ``~`` moved or changed, ``+`` appeared, ``-`` disappeared.

>>> import phasepath as pp
>>> a = pp.Route("water", T="20 degC", p="1 atm").isobar(T="120 degC")
>>> b = pp.Route("water", T="20 degC", p="2 bar").isobar(T="130 degC")
>>> cmp = compare(a, b)
>>> cmp.agree
False
>>> print(cmp.lines()[0])
~ MOVED leg 1 start p: 1.01325 -> 2 bar (change +97.4 %; tol 0.01 %)
>>> d = cmp.differences[1]
>>> d.sign, d.item, d.field, d.reasons
('~', 'crossing', 'leg 1 vaporization (liquid -> vapor)', ('T', 'p', 'latent heat'))
>>> compare(a, a).agree
True
"""

from __future__ import annotations

import math
from collections.abc import Callable, Iterable, Sequence
from dataclasses import dataclass
from datetime import datetime
from typing import TYPE_CHECKING, Any

from . import fileio, htmlreport, results, tables
from . import format as F
from .errors import PhasePathError
from .format import UNIT_LABELS, DisplayUnits
from .records import phase_text

if TYPE_CHECKING:  # pragma: no cover
    import pandas as pd

    from .report import Report
    from .route import Route

__all__ = [
    "compare",
    "compare_documents",
    "Comparison",
    "Difference",
    "Tolerances",
    "SCOPES",
    "describe",
    "summary",
    "version_changes",
]

#: What a comparison can be limited to (``--only``): all three by default.
SCOPES = ("crossings", "legs", "hazards")

_SIGN = {"moved": "~", "changed": "~", "appeared": "+", "disappeared": "-"}
_ORDER = {"substance": 0, "start": 1, "crossing": 2, "leg": 3, "hazard": 4}


@dataclass(frozen=True)
class Tolerances:
    """How far a number may move before it counts as a difference.

    Attributes
    ----------
    T : float
        Temperatures of crossings and of leg ends [K], absolute. Default 0.01 K (ten times the
        0.001 K a temperature is shown to).
    p : float
        Pressures of crossings and of leg ends, relative. Default 1e-4 (0.01 %).
    latent : float
        Latent heats of crossings, relative. Default 1e-3 (0.1 %).
    energy : float
        Heat and work per leg, relative. Default 1e-3 (0.1 %).
    energy_abs : float
        Heat and work per leg, absolute [J/kg]: a change counts only when it exceeds both
        ``energy`` relative and this. Default 1 J/kg, so that a zero (the work of a
        constant-pressure leg) does not fail on rounding.
    fraction : float
        Vapor and solid mass fractions at a leg's end, absolute. Default 1e-3.
    """

    T: float = results.TOL_T
    p: float = results.TOL_P
    latent: float = results.TOL_LATENT
    energy: float = 1e-3
    energy_abs: float = 1.0
    fraction: float = 1e-3

    def __post_init__(self) -> None:
        for name in ("T", "p", "latent", "energy", "energy_abs", "fraction"):
            x = getattr(self, name)
            if isinstance(x, bool) or not isinstance(x, (int, float)) or not math.isfinite(x):
                raise PhasePathError(f"{x!r} is not a finite number", field=f"tolerance {name}")
            if x < 0:
                raise PhasePathError(f"{x!r} is below 0", field=f"tolerance {name}")

    def text(self, key: str) -> str:
        """The tolerance of one kind of value in words ("0.01 K", "0.1 %")."""
        x = getattr(self, key)
        if key == "T":
            return f"{x:g} K"
        if key == "fraction":
            return f"{x:g}"
        return f"{100 * x:g} %"

    def describe(self) -> str:
        """All tolerances in one line."""
        return (
            f"T {self.text('T')}, p {self.text('p')}, latent heat {self.text('latent')}, "
            f"heat and work {self.text('energy')} (and {self.energy_abs:g} J/kg), "
            f"fractions {self.text('fraction')}"
        )


@dataclass(frozen=True)
class Difference:
    """One difference between side A (the expected results, or plan A) and side B.

    Attributes
    ----------
    status : {"moved", "changed", "appeared", "disappeared"}
        *moved*: a number beyond its tolerance; *changed*: a text (a phase, a kind) or a number
        that became defined or undefined; *appeared*/*disappeared*: only on side B / side A.
    leg : int
        The leg (1 for the first; 0 for the substance).
    item : {"substance", "start", "crossing", "leg", "hazard"}
    field : str
        What changed: the crossing in words, a leg's field ("end T", "heat", ...), the hazard's
        kind; empty for a whole leg.
    a, b
        The value on each side (SI numbers, text, None; a crossing or leg as plain data).
    quantity : str or None
        How the values are shown ("temperature", "pressure", "energy", "fraction"); None for
        text.
    tolerance : str
        The :class:`Tolerances` field that applied ("" for texts and presence).
    reasons : tuple of str
        Crossings: what moved ("T", "p", "latent heat").
    """

    status: str
    leg: int
    item: str
    field: str
    a: Any
    b: Any
    quantity: str | None = None
    tolerance: str = ""
    reasons: tuple[str, ...] = ()

    @property
    def sign(self) -> str:
        return _SIGN[self.status]


# -- the engine ----------------------------------------------------------------------------------
# (name, value of a leg document, quantity, tolerance); "start ..." fields only for the first leg
_LEG_FIELDS: tuple[tuple[str, Callable[[dict[str, Any]], Any], str | None, str], ...] = (
    ("start T", lambda g: g["start"]["T"], "temperature", "T"),
    ("start p", lambda g: g["start"]["p"], "pressure", "p"),
    ("start phase", lambda g: phase_text(g["start"]["phase"], g["start"]["form"]), None, ""),
    ("kind", lambda g: g["kind"], None, ""),
    ("basis", lambda g: g["basis"], None, ""),
    ("end T", lambda g: g["end"]["T"], "temperature", "T"),
    ("end p", lambda g: g["end"]["p"], "pressure", "p"),
    ("end phase", lambda g: g["end"]["phase"], None, ""),
    ("end ice form", lambda g: g["end"]["form"], None, ""),
    ("end vapor fraction", lambda g: g["end"]["vapor_fraction"], "fraction", "fraction"),
    ("end solid fraction", lambda g: g["end"]["solid_fraction"], "fraction", "fraction"),
    ("heat", lambda g: g["heat"], "energy", "energy"),
    ("work", lambda g: g["work"], "energy", "energy"),
)


def _beyond(a: float, b: float, quantity: str, tol: Tolerances) -> bool:
    d = abs(b - a)
    if quantity == "temperature":
        return d > tol.T
    if quantity == "pressure":
        return d > tol.p * abs(a)
    if quantity == "energy":
        return d > tol.energy * abs(a) and d > tol.energy_abs
    return d > tol.fraction


def _scope(only: Iterable[str] | None) -> tuple[str, ...]:
    if only is None:
        return SCOPES
    chosen = tuple(dict.fromkeys(only))
    for s in chosen:
        if s not in SCOPES:
            raise PhasePathError(
                f"cannot compare only {s!r}: choose from {', '.join(SCOPES)}", field="only"
            )
    if not chosen:
        raise PhasePathError("nothing to compare: name crossings, legs or hazards", field="only")
    return chosen


def compare_documents(
    a: dict[str, Any],
    b: dict[str, Any],
    tolerances: Tolerances | None = None,
    only: Iterable[str] | None = None,
) -> list[Difference]:
    """Every difference of results document ``b`` from ``a``, in route order.

    ``only`` limits the comparison to some of :data:`SCOPES` ("crossings", "legs", "hazards");
    a change of substance is always reported.
    """
    tol = tolerances or Tolerances()
    scope = _scope(only)
    out: list[tuple[tuple[int, int, int], Difference]] = []

    def add(d: Difference) -> None:
        out.append(((d.leg, _ORDER[d.item], len(out)), d))

    if a.get("substance") != b.get("substance"):
        add(
            Difference(
                "changed", 0, "substance", "substance", a.get("substance"), b.get("substance")
            )
        )
    if "crossings" in scope:
        for d in results.compare_crossings(
            a["crossings"], b["crossings"], tol.T, tol.p, tol.latent
        ):
            one = d["expected"] if d["expected"] is not None else d["actual"]
            add(
                Difference(
                    d["status"],
                    int(one["step"]),
                    "crossing",
                    results.label(one),
                    d["expected"],
                    d["actual"],
                    reasons=tuple(d.get("reasons", ())),
                )
            )
    legs_a, legs_b = a["legs"], b["legs"]
    if "legs" in scope:
        for i in range(max(len(legs_a), len(legs_b))):
            ga = legs_a[i] if i < len(legs_a) else None
            gb = legs_b[i] if i < len(legs_b) else None
            if ga is None or gb is None:
                status = "appeared" if ga is None else "disappeared"
                add(Difference(status, i + 1, "leg", "", ga, gb))
                continue
            for name, value, quantity, key in _LEG_FIELDS:
                if name.startswith("start") and i > 0:
                    continue
                va, vb = value(ga), value(gb)
                item = "start" if name.startswith("start") else "leg"
                if quantity is None or va is None or vb is None:
                    if va != vb:
                        add(Difference("changed", i + 1, item, name, va, vb, quantity, key))
                elif _beyond(va, vb, quantity, tol):
                    add(Difference("moved", i + 1, item, name, va, vb, quantity, key))
    if "hazards" in scope:
        hz_a, hz_b = _hazards(a), _hazards(b)
        for step in sorted(set(hz_a) | set(hz_b)):
            ka, kb = hz_a.get(step, {}), hz_b.get(step, {})
            for kind in ka:
                if kind not in kb:
                    add(Difference("disappeared", step, "hazard", kind, ka[kind], None))
            for kind in kb:
                if kind not in ka:
                    add(Difference("appeared", step, "hazard", kind, None, kb[kind]))
    out.sort(key=lambda pair: pair[0])
    return [d for _, d in out]


def _hazards(doc: dict[str, Any]) -> dict[int, dict[str, str]]:
    """Per leg: hazard kind -> its reason, from the leg and from the leg's crossings."""
    out: dict[int, dict[str, str]] = {}
    for c in doc["crossings"]:
        for h in c["hazards"]:
            out.setdefault(int(c["step"]), {}).setdefault(h["kind"], h["reason"])
    for g in doc["legs"]:
        for h in g["hazards"]:
            out.setdefault(int(g["step"]), {}).setdefault(h["kind"], h["reason"])
    return out


def version_changes(a: dict[str, Any], b: dict[str, Any]) -> list[tuple[str, str, str]]:
    """(what, version on side a, version on side b) for phasepath and CoolProp where they
    differ: a change of property data is a reason to re-baseline."""
    out = []
    for key, name in (("phasepath", "phasepath"), ("coolprop", "CoolProp")):
        va, vb = a.get(key), b.get(key)
        if va != vb:
            out.append((name, str(va), str(vb)))
    return out


# -- differences in words --------------------------------------------------------------------------
def _shown(x: Any, quantity: str | None, units: DisplayUnits) -> str:
    if x is None:
        return "none"
    if quantity is None:
        return str(x)
    return F.number(x, quantity, units.unit(quantity))


def _unit(quantity: str | None, units: DisplayUnits) -> str:
    unit = units.unit(quantity) if quantity else None
    return f" {UNIT_LABELS[unit]}" if unit else ""


def _signed(text: str) -> str:
    return text if text.startswith("-") else "+" + text


def _change(a: float, b: float, quantity: str, units: DisplayUnits) -> str:
    d = b - a
    if quantity == "temperature":
        shown = f"{d:.3f}" if abs(d) >= 5e-4 else f"{d:.1e}"
        return _signed(shown) + " K"
    if quantity == "fraction":
        return _signed(F.fraction(d) if abs(d) >= 5e-5 else f"{d:.1e}")
    if a == 0:
        return _signed(F.number(d, quantity, units.unit(quantity))) + _unit(quantity, units)
    return _signed(F.significant(100 * d / abs(a), 3)) + " %"


def _moved(
    name: str,
    a: float,
    b: float,
    quantity: str,
    key: str,
    tol: Tolerances,
    units: DisplayUnits,
    sep: str = " ",
) -> str:
    return (
        f"{name}{sep}{_shown(a, quantity, units)} -> {_shown(b, quantity, units)}"
        f"{_unit(quantity, units)} (change {_change(a, b, quantity, units)}; tol {tol.text(key)})"
    )


def _at(c: dict[str, Any], units: DisplayUnits) -> str:
    return (
        f"T = {F.quantity(c['T'], 'temperature', units.T)}, "
        f"p = {F.quantity(c['p'], 'pressure', units.p)}"
    )


def describe(
    d: Difference, units: DisplayUnits | None = None, tolerances: Tolerances | None = None
) -> str:
    """One difference as one line, numbers by the display-precision policy:
    ``~ MOVED leg 2 heat: 154.213 -> 149.806 kJ/kg (change -2.86 %; tol 0.1 %)``."""
    units = units or DisplayUnits("degC", "bar", "kJ/kg")
    tol = tolerances or Tolerances()
    head = f"{d.sign} {d.status.upper()}"
    if d.item == "substance":
        return f"{head} substance: {d.a} -> {d.b}"
    where = f"leg {d.leg}"
    if d.item == "crossing":
        e, a = d.a, d.b
        if d.status == "moved":
            parts = []
            if "T" in d.reasons:
                parts.append(_moved("T", e["T"], a["T"], "temperature", "T", tol, units))
            if "p" in d.reasons:
                parts.append(_moved("p", e["p"], a["p"], "pressure", "p", tol, units))
            if "latent heat" in d.reasons:
                le, la = e.get("latent_heat"), a.get("latent_heat")
                if le is None or la is None:
                    parts.append(
                        f"latent heat {_shown(le, 'energy', units)} -> "
                        f"{_shown(la, 'energy', units)}{_unit('energy', units)}"
                    )
                else:
                    parts.append(_moved("latent heat", le, la, "energy", "latent", tol, units))
            return f"{head} {d.field}: " + "; ".join(parts)
        if d.status == "changed":
            return f"{head} {d.field}: boundary {e.get('boundary')!r} -> {a.get('boundary')!r}"
        if d.status == "appeared":
            return f"{head} {d.field} at {_at(a, units)}"
        return f"{head} {d.field}, was at {_at(e, units)}"
    if d.item == "hazard":
        return f"{head} {where} hazard {d.field}"
    if d.item == "leg" and not d.field:
        g = d.b if d.status == "appeared" else d.a
        end = g["end"]
        return (
            f"{head} {where} {g['kind']}: ends at {_at(end, units)} "
            f"({phase_text(end['phase'], end['form'])})"
        )
    if d.status == "moved":
        assert d.quantity is not None
        return f"{head} {where} " + _moved(
            d.field, d.a, d.b, d.quantity, d.tolerance, tol, units, sep=": "
        )
    unit = _unit(d.quantity, units) if d.a is not None and d.b is not None else ""
    return (
        f"{head} {where} {d.field}: {_shown(d.a, d.quantity, units)} -> "
        f"{_shown(d.b, d.quantity, units)}{unit}"
    )


def summary(differences: Sequence[Difference]) -> str:
    """The differences counted by kind, e.g. 2 moved, 1 appeared (empty when there is none)."""
    counts: dict[str, int] = {}
    for d in differences:
        counts[d.status] = counts.get(d.status, 0) + 1
    return ", ".join(f"{n} {s}" for s, n in counts.items())


# -- two plans -----------------------------------------------------------------------------------
class Comparison:
    """Plan B compared with plan A: what differs, as lines, a table and an HTML page.

    Made by :func:`compare`. ``differences`` is empty when the plans agree within the
    tolerances (``agree``).
    """

    def __init__(
        self,
        report_a: Report,
        report_b: Report,
        tolerances: Tolerances,
        only: tuple[str, ...],
        labels: tuple[str, str],
    ) -> None:
        self.report_a = report_a
        self.report_b = report_b
        self.tolerances = tolerances
        self.only = only
        self.labels = labels
        self.document_a = results.document(report_a)
        self.document_b = results.document(report_b)
        self.differences: tuple[Difference, ...] = tuple(
            compare_documents(self.document_a, self.document_b, tolerances, only)
        )

    #: The columns of the differences table (over the rows of :meth:`rows`).
    columns: tuple[tables.Column, ...] = ()

    def summary(self) -> str:
        """The differences counted by kind ("2 moved, 1 appeared"; empty when they agree)."""
        return summary(self.differences)

    @property
    def agree(self) -> bool:
        """True when no difference goes beyond the tolerances."""
        return not self.differences

    def __repr__(self) -> str:
        n = len(self.differences)
        what = "agree" if not n else f"{n} difference{'s' if n != 1 else ''}"
        return f"<Comparison {self.labels[0]} vs {self.labels[1]}: {what}>"

    def title(self, side: int) -> str:
        rep = (self.report_a, self.report_b)[side]
        return rep.route.title or f"{self.labels[side]}: {rep.substance.name}"

    def lines(self, units: DisplayUnits | None = None) -> list[str]:
        """Each difference as one line (see :func:`describe`)."""
        return [describe(d, units, self.tolerances) for d in self.differences]

    def text(self, units: DisplayUnits | None = None) -> str:
        """The comparison as text: the two plans, the tolerances, the differences, a verdict."""
        out = [
            f"{self.labels[0]}: {self.title(0)}",
            f"{self.labels[1]}: {self.title(1)}",
            f"tolerances: {self.tolerances.describe()}",
            f"compared: {', '.join(self.only)}",
        ]
        out += ["  " + line for line in self.lines(units)]
        if self.differences:
            out.append(f"DIFFER: {summary(self.differences)}")
        else:
            out.append("AGREE: the plans match within the tolerances")
        return "\n".join(out) + "\n"

    def rows(self, units: DisplayUnits | None = None) -> list[dict[str, str]]:
        """One row of text per difference: sign, change, leg, item, field, A, B, change, tol."""
        units = units or DisplayUnits("degC", "bar", "kJ/kg")
        return [_row(d, units, self.tolerances) for d in self.differences]

    def table(
        self, T_unit: str = "degC", p_unit: str = "bar", energy_unit: str = "kJ/kg"
    ) -> pd.DataFrame:
        """The differences as a DataFrame of text, numbers by the display policy."""
        import pandas as pd

        units = DisplayUnits(T_unit, p_unit, energy_unit)
        heads = [c.title(units) for c in DIFFERENCES]
        return pd.DataFrame(
            [[c.shown(r, units) for c in DIFFERENCES] for r in self.rows(units)], columns=heads
        )

    def to_html(self, units: DisplayUnits | None = None, *, when: datetime | None = None) -> str:
        """The side-by-side report: both plans on one diagram in two styles, the differences,
        and each plan's crossings and legs (one self-contained HTML file, no network)."""
        return htmlreport.comparison_html(self, units or htmlreport.DEFAULT_UNITS, when)

    def save_html(
        self, path: object, units: DisplayUnits | None = None, *, when: datetime | None = None
    ) -> None:
        """Write :meth:`to_html` to ``path`` atomically."""
        fileio.write_text(path, self.to_html(units, when=when))

    def _repr_html_(self) -> str:
        units = htmlreport.DEFAULT_UNITS
        body = htmlreport.differences_html(self, units)
        return "<div class='phasepath-comparison'>" + body + "</div>"


def _row(d: Difference, units: DisplayUnits, tol: Tolerances) -> dict[str, str]:
    def side(x: Any) -> str:
        if d.item == "crossing":
            return "" if x is None else _at(x, units)
        if d.item == "leg" and not d.field:
            return "" if x is None else f"{x['kind']} to {_at(x['end'], units)}"
        if d.item == "hazard":
            return "" if x is None else str(x)
        return _shown(x, d.quantity, units) + (_unit(d.quantity, units) if x is not None else "")

    change = ""
    if d.status == "moved" and d.item == "crossing":
        parts = []
        for r, key, q in (("T", "T", "temperature"), ("p", "p", "pressure")):
            if r in d.reasons:
                parts.append(f"Δ{r} {_change(d.a[key], d.b[key], q, units)}")
        if "latent heat" in d.reasons:
            le, la = d.a.get("latent_heat"), d.b.get("latent_heat")
            parts.append(
                "latent heat "
                + (_change(le, la, "energy", units) if le and la else "defined/undefined")
            )
        change = "; ".join(parts)
    elif d.status == "moved" and d.quantity is not None:
        change = _change(d.a, d.b, d.quantity, units)
    tol_text = ""
    if d.status == "moved":
        if d.item == "crossing":
            keys = {"T": "T", "p": "p", "latent heat": "latent"}
            tol_text = ", ".join(f"{r} {tol.text(keys[r])}" for r in d.reasons)
        else:
            tol_text = tol.text(d.tolerance)
    return {
        "sign": d.sign,
        "status": d.status,
        "leg": str(d.leg) if d.leg else "",
        "item": d.item,
        "field": d.field,
        "a": side(d.a),
        "b": side(d.b),
        "change": change,
        "tol": tol_text,
    }


def _text_column(key: str, header: str) -> tables.Column:
    return tables.Column(key, header, None, lambda r: r[key])


#: The columns of the differences table (rows from :meth:`Comparison.rows`).
DIFFERENCES: tuple[tables.Column, ...] = (
    _text_column("sign", ""),
    _text_column("status", "difference"),
    _text_column("leg", "leg"),
    _text_column("item", "what"),
    _text_column("field", "field"),
    _text_column("a", "A"),
    _text_column("b", "B"),
    _text_column("change", "change"),
    _text_column("tol", "tolerance"),
)


Comparison.columns = DIFFERENCES


def compare(
    a: Route | Report,
    b: Route | Report,
    *,
    tolerances: Tolerances | None = None,
    only: Iterable[str] | None = None,
    labels: tuple[str, str] = ("A", "B"),
) -> Comparison:
    """Compare plan ``b`` with plan ``a`` (routes, analysed here, or reports).

    Parameters
    ----------
    a, b : Route or Report
    tolerances : Tolerances, optional
        What counts as a difference (defaults: see :class:`Tolerances`).
    only : iterable of {"crossings", "legs", "hazards"}, optional
        Limit the comparison (default: all three).
    labels : (str, str)
        What the two plans are called in the text and the HTML ("A", "B").
    """
    rep_a, rep_b = _report(a, "a"), _report(b, "b")
    return Comparison(rep_a, rep_b, tolerances or Tolerances(), _scope(only), labels)


def _report(x: Any, name: str) -> Report:
    if hasattr(x, "crossings") and hasattr(x, "legs") and hasattr(x, "route"):
        return x  # type: ignore[no-any-return]
    if hasattr(x, "analyze") and hasattr(x, "corners"):
        return x.analyze()  # type: ignore[no-any-return]
    raise PhasePathError(f"{type(x).__name__} is not a Route or a Report", field=name)
