"""The results tables: one definition of the columns of crossings and of legs, and the renderers
that turn it into a DataFrame, fixed-format text, CSV and HTML.

Every surface that shows results (``Report.table``, the command line, notebooks, the planner, the
HTML report) uses these columns; numbers are shown by the display-precision policy of
:mod:`phasepath.format`, except in the DataFrame, which holds floats in the display units.

>>> import phasepath as pp
>>> rep = pp.Route("water", T="20 degC", p="1 atm").isobar(T="120 degC").analyze()
>>> print(text_table(CROSSINGS, rep.crossings, DisplayUnits("degC", "bar")))
leg  kind          from    to     T [°C]  p [bar]  latent heat [kJ/kg]  boundary        hazards
---  ------------  ------  -----  ------  -------  -------------------  --------------  -------
  1  vaporization  liquid  vapor  99.974  1.01325              2256.47  vapor pressure
"""

from __future__ import annotations

import csv
import html
import io
from collections.abc import Callable, Sequence
from dataclasses import dataclass
from typing import TYPE_CHECKING, Any

from . import format as F
from .format import DisplayUnits
from .records import Analysis, Crossing, LegSummary
from .units import convert

if TYPE_CHECKING:  # pragma: no cover
    import pandas as pd


__all__ = [
    "Column",
    "CROSSINGS",
    "LEGS",
    "frame",
    "text_table",
    "csv_table",
    "html_table",
    "format_report",
    "DisplayUnits",
]


@dataclass(frozen=True)
class Column:
    """One column of a results table.

    Attributes
    ----------
    key : str
        Its id (also its CSS class, ``pp-c-<key>``).
    header : str
        The header; ``{T}``, ``{p}``, ``{e}`` stand for the display units' labels.
    kind : str or None
        How its numbers are shown (:func:`phasepath.format.number`): "temperature",
        "pressure", "energy", "fraction", "count"; None for text.
    value : callable
        The record's value (SI for numbers, or text).
    brief : bool
        Shown in the compact text table (the command line, ``format_report``).
    mark : str
        Put before a non-empty cell in HTML ("⚠ " before hazard flags).
    """

    key: str
    header: str
    kind: str | None
    value: Callable[[Any], Any]
    brief: bool = True
    mark: str = ""

    def title(self, units: DisplayUnits) -> str:
        T, p, e = units.labels
        return self.header.format(T=T, p=p, e=e)

    def shown(self, record: Any, units: DisplayUnits, none: str = F.NONE) -> str:
        """The cell as shown to people."""
        v = self.value(record)
        if self.kind is None:
            return "" if v is None else str(v)
        if v is None:
            return none
        return F.number(v, self.kind, units.unit(self.kind))

    def data(self, record: Any, units: DisplayUnits) -> Any:
        """The cell as data: a float in the display unit, an int, text or None."""
        v = self.value(record)
        if v is None or self.kind is None or self.kind in ("count", "fraction"):
            return v
        unit = units.unit(self.kind)
        si = {"temperature": "K", "pressure": "Pa", "energy": "J/kg"}[self.kind]
        return convert(v, si, unit or si, self.kind)


def _kinds(item: Crossing | LegSummary) -> str:
    return "; ".join(dict.fromkeys(h.kind for h in item.hazards))


#: The columns of the crossings table, in order.
CROSSINGS: tuple[Column, ...] = (
    Column("leg", "leg", "count", lambda c: c.step),
    Column("kind", "kind", None, lambda c: c.kind),
    Column("from", "from", None, lambda c: c.from_text),
    Column("to", "to", None, lambda c: c.to_text),
    Column("T", "T [{T}]", "temperature", lambda c: c.T),
    Column("p", "p [{p}]", "pressure", lambda c: c.p),
    Column("latent", "latent heat [{e}]", "energy", lambda c: c.latent_heat),
    Column("boundary", "boundary", None, lambda c: c.boundary),
    Column("detail", "what happens", None, lambda c: c.detail, brief=False),
    Column("hazards", "hazards", None, _kinds, mark="⚠ "),
    Column(
        "model",
        "latent heat model",
        None,
        lambda c: c.latent_heat_model or c.latent_heat_note,
        brief=False,
    ),
)

#: The columns of the legs table, in order.
LEGS: tuple[Column, ...] = (
    Column("leg", "leg", "count", lambda g: g.step),
    Column("kind", "kind", None, lambda g: g.kind),
    Column("ends", "ends", None, lambda g: g.event or "at target"),
    Column("T0", "T start [{T}]", "temperature", lambda g: g.start.T),
    Column("p0", "p start [{p}]", "pressure", lambda g: g.start.p),
    Column("phase0", "phase start", None, lambda g: g.start.text),
    Column("T1", "T end [{T}]", "temperature", lambda g: g.end.T),
    Column("p1", "p end [{p}]", "pressure", lambda g: g.end.p),
    Column("phase1", "phase end", None, lambda g: g.end.text),
    Column("xv", "vapor fraction end", "fraction", lambda g: g.end.vapor_fraction),
    Column("xs", "solid fraction end", "fraction", lambda g: g.end.solid_fraction),
    Column("heat", "heat [{e}]", "energy", lambda g: g.heat),
    Column("work", "work [{e}]", "energy", lambda g: g.work),
    Column("hazards", "hazards", None, _kinds, mark="⚠ "),
    Column("note", "note", None, lambda g: g.note),
)


def _columns(columns: Sequence[Column], brief: bool) -> list[Column]:
    return [c for c in columns if c.brief or not brief]


def frame(columns: Sequence[Column], records: Sequence[Any], units: DisplayUnits) -> pd.DataFrame:
    """A DataFrame: one row per record, numbers as floats in the display units."""
    import pandas as pd

    heads = [c.title(units) for c in columns]
    rows = [[c.data(r, units) for c in columns] for r in records]
    return pd.DataFrame(rows, columns=heads)


def text_table(
    columns: Sequence[Column], records: Sequence[Any], units: DisplayUnits, brief: bool = True
) -> str:
    """A fixed-format text table (numbers right-aligned), the same on every machine."""
    cols = _columns(columns, brief)
    head = [c.title(units) for c in cols]
    cells = [[c.shown(r, units) for c in cols] for r in records]
    widths = [max([len(h)] + [len(row[i]) for row in cells]) for i, h in enumerate(head)]
    right = [c.kind is not None for c in cols]

    def line(values: list[str]) -> str:
        out = [
            v.rjust(w) if num else v.ljust(w)
            for v, w, num in zip(values, widths, right, strict=True)
        ]
        return "  ".join(out).rstrip()

    return "\n".join([line(head), line(["-" * w for w in widths])] + [line(r) for r in cells])


def csv_table(columns: Sequence[Column], records: Sequence[Any], units: DisplayUnits) -> str:
    """CSV for people (numbers by the display policy; an empty cell for a missing value)."""
    buf = io.StringIO()
    w = csv.writer(buf, lineterminator="\n")
    w.writerow([c.title(units) for c in columns])
    for r in records:
        w.writerow([c.shown(r, units, none="") for c in columns])
    return buf.getvalue()


def html_table(
    columns: Sequence[Column],
    records: Sequence[Any],
    units: DisplayUnits,
    *,
    table_class: str = "",
    row_class: str = "",
    row_title: Callable[[Any], str] | None = None,
    row_data: Callable[[Any], dict[str, str]] | None = None,
) -> str:
    """An HTML table; ``row_title`` and ``row_data`` add a tooltip and data- attributes."""
    head = "".join(f"<th>{html.escape(c.title(units))}</th>" for c in columns)
    out = [f"<table class='pp-table {html.escape(table_class)}'><tr>{head}</tr>"]
    for r in records:
        attrs = f" class='{html.escape(row_class)}'" if row_class else ""
        for k, v in (row_data(r) if row_data else {}).items():
            attrs += f" data-{k}='{html.escape(v, quote=True)}'"
        if row_title is not None:
            attrs += f" title='{html.escape(row_title(r), quote=True)}'"
        cells = []
        for c in columns:
            text = c.shown(r, units)
            css = f"pp-c-{c.key}" + (" num" if c.kind is not None else "")
            shown = html.escape(c.mark + text if c.mark and text else text)
            cells.append(f"<td class='{css}'>{shown}</td>")
        out.append(f"<tr{attrs}>{''.join(cells)}</tr>")
    out.append("</table>")
    return "".join(out)


def format_report(
    report: Analysis, T_unit: str = "degC", p_unit: str = "bar", energy_unit: str = "kJ/kg"
) -> str:
    """The results as fixed-format text: title, crossings, legs, cautions and notes, numbers by
    the display-precision policy, so the text is the same on every machine for the same results
    and can be kept under regression."""
    units = DisplayUnits(T_unit, p_unit, energy_unit)
    n = len(report.legs)
    title = report.route.title or "Route"
    out = [f"{title} ({report.substance.name}, {n} leg{'s' if n != 1 else ''})", "", "Crossings"]
    if report.crossings:
        out.append(text_table(CROSSINGS, report.crossings, units))
    else:
        out.append("(no phase boundary is crossed)")
    out += ["", "Legs", text_table(LEGS, report.legs, units)]
    if report.cautions:
        out += ["", "Cautions"] + [f"- {c}" for c in report.cautions]
    if report.notes:
        out += ["", "Notes"] + [f"- {n}" for n in report.notes]
    return "\n".join(out) + "\n"
