"""Sweeps: a planned route analysed over a grid of its own values, one row of outcomes per point.

``sweep(plan, start_T=[...], leg1_p=[...])`` varies the named values of the plan over the full
grid (the Cartesian product of the axes, the first axis varying slowest) and returns a
:class:`pandas.DataFrame`: the axis values (SI floats), then what happened at that point (the
crossings, the end state, heat and work, hazards) and ``error``, the message of a point that
failed (an empty string where it did not). A failing point never sinks the others.

The points run on the engines of :func:`phasepath.batch.map_routes`: this process, worker
processes (``workers=N``) or a Dask cluster (``address=``). Each point travels as route data,
many points to a task, and each worker sends back the outcome row, not the report, so the
results are the same on every engine, to the last bit.

>>> import phasepath as pp
>>> plan = pp.Route("CO2", T="20 degC", p="60 bar").isenthalp(p="1 atm")
>>> df = pp.sweep(plan, start_p=["60 bar", "100 bar"], progress=False)
>>> df[["start_p", "n_crossings", "crossing_kinds", "end_phase"]]
      start_p  n_crossings            crossing_kinds    end_phase
0   6000000.0            2  vaporization, deposition  solid+vapor
1  10000000.0            2  vaporization, deposition  solid+vapor
"""

from __future__ import annotations

import itertools
import json
import math
import numbers
import re
from collections.abc import Mapping, Sequence
from dataclasses import dataclass
from typing import TYPE_CHECKING, Any

from . import units
from .batch import build_route, map_routes, route_data, versions
from .errors import PhasePathError, RouteError
from .route import Route

if TYPE_CHECKING:  # pragma: no cover
    import pandas as pd
    import xarray as xr

__all__ = ["sweep", "to_xarray", "SweepAxisError", "OUTCOME_COLUMNS"]

#: The outcome columns every sweep has, in order; ``first_<kind>_T``/``_p`` come after
#: ``crossing_kinds`` and ``hazard_<kind>`` after ``hazards``, one per kind met in the sweep.
OUTCOME_COLUMNS = (
    "n_crossings",
    "crossing_kinds",
    "end_T",
    "end_p",
    "end_phase",
    "end_form",
    "end_vapor_fraction",
    "end_solid_fraction",
    "heat",
    "work",
    "hazards",
    "error",
)

_ACCEPTED = {
    "temperature": "a number [K] or text with a temperature unit, such as '20 degC'",
    "pressure": "a number [Pa] or text with an absolute pressure unit, such as '60 bar'",
    "density": "a number [kg/m3] or text with a density unit, such as '750 kg/m3'",
    "elevation": "a number [m] or text in metres, such as '1600 m'",
    "fraction": "a number from 0 (saturated liquid) to 1 (saturated vapor)",
}
# Start values an axis can vary: axis name -> (key of the route's start data, quantity).
_START_AXES = {
    "start_T": ("T", "temperature"),
    "start_p": ("p", "pressure"),
    "start_density": ("density", "density"),
    "start_quality": ("quality", "fraction"),
}
# Axes that will come with later route features: axis name -> why it is refused for now.
_PLANNED_AXES: dict[str, str] = {}
_LEG_AXIS = re.compile(r"^leg([1-9][0-9]*)_(T|p)$")
_LEG_QUANTITY = {"T": "temperature", "p": "pressure"}
_METRES = re.compile(r"^\s*([-+]?(?:\d+\.?\d*|\.\d+)(?:[eE][-+]?\d+)?)\s*(m)?\s*$")
_NO_VALUE = object()


class SweepAxisError(PhasePathError):
    """A sweep axis that names no value of the plan, or a value that axis cannot take.

    Fields: ``axis`` (the keyword as given), ``value`` (the offending value or values),
    ``problem`` and ``accepted`` (what the axis takes).
    """

    def __init__(
        self,
        axis: str,
        value: object = _NO_VALUE,
        problem: str = "",
        accepted: str = "",
        **fields: Any,
    ) -> None:
        if value is not _NO_VALUE:
            fields["value"] = value
        fields.setdefault("field", f"sweep axis {axis}")
        fields.setdefault("valid", f"accepted: {accepted}")
        super().__init__(problem, **fields)
        self.axis = axis
        self.problem = problem
        self.accepted = accepted

    @classmethod
    def _like(cls, old: PhasePathError, detail: str) -> PhasePathError:
        return cls(getattr(old, "axis", ""), problem=detail, accepted=getattr(old, "accepted", ""))


@dataclass(frozen=True)
class _Axis:
    """One axis: its name and where its value goes in the route data."""

    name: str
    quantity: str  # a key of _ACCEPTED
    place: str  # "start", "leg" or "elevation"
    key: str = ""  # the field of the start or leg data
    leg: int = -1  # 0-based leg index for place == "leg"


def sweep(
    plan: Route | Mapping[str, Any] | Sequence[Route | dict[str, Any]],
    *,
    workers: int | None = None,
    address: str | None = None,
    progress: bool = True,
    **axes: Any,
) -> pd.DataFrame:
    """Analyse a plan over a grid of its values (or a list of routes); one row per point.

    Parameters
    ----------
    plan : Route, route data, or list of Route or route data
        The planned route whose values the axes vary (a dict is route data, as
        :meth:`Route.to_dict` gives). A list of routes (or of
        :meth:`Route.to_dict` data) instead is analysed as it is, one row per route, and takes
        no axes.
    workers : int, optional
        None or 1: in this process; N >= 2: N worker processes on this machine
        (``concurrent.futures.ProcessPoolExecutor``).
    address : str, optional
        Address of a running Dask scheduler: the points run on that cluster.
    progress : bool
        Show a progress bar.
    **axes : sequence of float or str
        Each keyword names a value of the plan and gives the values it takes:
        ``start_T`` [K], ``start_p`` [Pa], ``start_density`` [kg/m3], ``start_quality``
        (vapor mass fraction, 0 to 1; whichever the plan starts from), ``elevation`` [m], and
        ``leg<N>_T`` [K] or ``leg<N>_p`` [Pa], the target of leg N (1-based) as the plan gives
        it (an isobar's T, an isotherm's p, ...). Numbers are SI; text carries its unit
        (``"20 degC"``, ``"60 bar"``).

    Returns
    -------
    pandas.DataFrame
        One row per grid point, in grid order (the first axis varies slowest): the axis
        columns (SI floats), then ``n_crossings``; ``crossing_kinds`` (the kinds in route order,
        joined by ", "); ``first_<kind>_T`` [K] and ``first_<kind>_p`` [Pa], the first crossing
        of each kind met anywhere in the sweep (NaN where the point has none; ``-`` in a kind
        becomes ``_``); ``end_T`` [K], ``end_p`` [Pa], ``end_phase``, ``end_form`` ("" where
        the end state has no named form), ``end_vapor_fraction``, ``end_solid_fraction``
        (NaN for a single phase); ``heat`` and ``work`` [J/kg], totals over the legs (NaN where
        a leg has none); ``hazards`` (the kinds, joined by ", ") and one boolean column
        ``hazard_<kind>`` per kind met in the sweep; ``error``, the failure of that point as
        "ErrorClass: message" ("" where it was analysed). On a failed point the outcome
        columns are missing values (NaN, None, <NA>). A list of routes gives a ``title``
        column in place of the axis columns.

        ``df.attrs`` holds ``plan`` (the plan's data, :meth:`Route.to_dict` with the substance
        by name or data; None for a list of routes), ``axes`` (name -> list of SI values) and
        ``versions`` (phasepath, CoolProp, numpy, scipy).

    Raises
    ------
    SweepAxisError
        An axis that names no value of this plan (unknown name, a leg the plan does not have,
        a target that leg does not take, p of a plan that starts from a density, ...), or
        values that are not a list of numbers or quantities of the axis's kind. The message
        names the axis, the value and what is accepted.
    BatchError
        Bad ``workers``, an unreachable ``address``, or a worker with other library versions.

    Examples
    --------
    A vent valve on a CO2 vessel, over a 3 x 2 grid of vessel temperatures and pressures:

    >>> import phasepath as pp
    >>> plan = pp.Route("CO2", T="20 degC", p="60 bar").isenthalp(p="1 atm")
    >>> df = pp.sweep(plan, start_T=["10 degC", "20 degC", "30 degC"],
    ...               start_p=["70 bar", "100 bar"], progress=False)
    >>> df.shape[0], list(df.columns[:3])
    (6, ['start_T', 'start_p', 'n_crossings'])
    >>> bool(df["hazard_solid_formation"].all())
    True
    """
    if isinstance(plan, Mapping):
        plan = Route.from_dict(dict(plan))
    if isinstance(plan, Route):
        data = route_data(plan)
        parsed = [_resolve(name, values, data) for name, values in axes.items()]
        grid = list(itertools.product(*(vals for _, vals in parsed)))
        items: list[Any] = [_point(data, [a for a, _ in parsed], point) for point in grid]
        front: dict[str, Any] = {
            a.name: [float(point[k]) for point in grid] for k, (a, _) in enumerate(parsed)
        }
        attrs: dict[str, Any] = {
            "plan": _plain(data),
            "axes": {a.name: list(vals) for a, vals in parsed},
            "versions": versions(),
        }
    elif isinstance(plan, Sequence) and not isinstance(plan, str):
        if axes:
            raise SweepAxisError(
                next(iter(axes)),
                _NO_VALUE,
                "a list of routes is analysed as it is and takes no axes",
                "axes with a single plan (a Route), or a list of routes without axes",
            )
        items = list(plan)
        front = {"title": [_title(r) for r in items]}
        attrs = {"plan": None, "axes": {}, "versions": versions()}
    else:
        raise RouteError(
            f"plan = {plan!r} is not a route: give a Route (and axes), or a list of routes"
        )
    rows = map_routes(
        _outcome, items, workers=workers, address=address, progress=progress, desc="sweeping"
    )
    df = _frame(front, rows)
    df.attrs = attrs
    return df


def to_xarray(df: pd.DataFrame) -> xr.Dataset:
    """The sweep of a grid as an :class:`xarray.Dataset`, one dimension per axis.

    Built with ``df.set_index(axes).to_xarray()``. Nullable columns become plain ones
    (``n_crossings`` float with NaN, ``hazard_*`` object with None) where a point failed.
    ``ds.attrs`` holds ``plan``, ``axes`` and ``versions`` as JSON text, so that the dataset
    can be written to netCDF. Needs xarray installed.

    >>> import phasepath as pp
    >>> from phasepath.sweep import to_xarray
    >>> plan = pp.Route("CO2", T=300.0, p=70e5).isenthalp(p=101325.0)
    >>> df = pp.sweep(plan, start_T=[300.0, 310.0], start_p=[70e5, 80e5, 90e5], progress=False)
    >>> to_xarray(df)["end_T"].dims
    ('start_T', 'start_p')
    """
    axes = list(df.attrs.get("axes") or {})
    if not axes:
        raise PhasePathError(
            "to_xarray needs the result of a sweep over axes (df.attrs['axes'] is empty): "
            "a list of routes has no grid"
        )
    try:
        import xarray  # noqa: F401
    except ImportError:
        raise PhasePathError(
            "to_xarray needs xarray: install it (pip install xarray), or use the DataFrame"
        ) from None
    for name in axes:
        values = df.attrs["axes"][name]
        if len(set(values)) != len(values):
            raise SweepAxisError(
                name,
                values,
                "the axis repeats a value, so the sweep is not a grid",
                "distinct values along each axis",
            )
    out = df.copy()
    for col in out.columns:
        dtype = str(out[col].dtype)
        if dtype == "Int64":
            out[col] = out[col].astype("float64") if out[col].isna().any() else out[col].astype(int)
        elif dtype == "boolean":
            out[col] = (
                out[col].astype(object).where(out[col].notna(), None)
                if out[col].isna().any()
                else out[col].astype(bool)
            )
    ds = out.set_index(axes).to_xarray()
    ds.attrs = {k: json.dumps(df.attrs.get(k), default=str) for k in ("plan", "axes", "versions")}
    return ds


# -- axes -----------------------------------------------------------------------------------------
def _resolve(name: str, values: Any, plan: dict[str, Any]) -> tuple[_Axis, list[float]]:
    """The axis a keyword names in this plan, and its values parsed to SI floats."""
    axis = _axis(name, values, plan)
    if isinstance(values, (str, bytes, Mapping)) or not _iterable(values):
        raise SweepAxisError(
            name,
            values,
            "is not a list of values (for one value write [value])",
            f"a list or 1-D array of values, each {_ACCEPTED[axis.quantity]}",
        )
    items = list(values)
    if not items:
        raise SweepAxisError(name, values, "has no values", _ACCEPTED[axis.quantity])
    return axis, [_value(axis, v) for v in items]


def _axis(name: str, values: Any, plan: dict[str, Any]) -> _Axis:
    start = plan.get("start", {})
    legs = plan.get("legs", [])
    known = _known_axes(plan)
    if name in _PLANNED_AXES:
        raise SweepAxisError(name, values, _PLANNED_AXES[name], ", ".join(known))
    if name == "elevation":
        return _Axis(name, "elevation", "elevation")
    if name in _START_AXES:
        key, quantity = _START_AXES[name]
        if start.get(key) is None:
            has = " and ".join(
                k for k in ("T", "p", "density", "quality") if start.get(k) is not None
            )
            how = f"T or p and {key}" if key == "quality" else f"T and {key}"
            raise SweepAxisError(
                name,
                values,
                f"the plan starts from {has}, so it has no start {key} to vary "
                f"(start the plan from {how} to sweep it)",
                ", ".join(known),
            )
        return _Axis(name, quantity, "start", key)
    m = _LEG_AXIS.match(name)
    if not m:
        raise SweepAxisError(name, values, "names no value of the plan", ", ".join(known))
    n, key = int(m.group(1)), m.group(2)
    if n > len(legs):
        raise SweepAxisError(
            name,
            values,
            f"the plan has {len(legs)} leg{'s' if len(legs) != 1 else ''}",
            ", ".join(known),
        )
    leg = legs[n - 1]
    if key not in leg:
        targets = [k for k in ("T", "p") if k in leg]
        has = (
            f"its target is {targets[0]}"
            if targets
            else f"it ends on an event (until={leg.get('until')!r}), not on a T or p target"
        )
        raise SweepAxisError(
            name, values, f"leg {n} is an {leg.get('kind')} leg and {has}", ", ".join(known)
        )
    return _Axis(name, _LEG_QUANTITY[key], "leg", key, n - 1)


def _known_axes(plan: dict[str, Any]) -> list[str]:
    """The axis names this plan offers."""
    start = plan.get("start", {})
    out = [name for name, (key, _) in _START_AXES.items() if start.get(key) is not None]
    out.append("elevation")
    for n, leg in enumerate(plan.get("legs", []), 1):
        out += [f"leg{n}_{k}" for k in ("T", "p") if k in leg]
    return out


def _value(axis: _Axis, v: Any) -> float:
    """One axis value as an SI float (numbers are SI already)."""
    accepted = _ACCEPTED[axis.quantity]
    if isinstance(v, bool) or v is None:
        raise SweepAxisError(axis.name, v, "is not a number or a quantity", accepted)
    if isinstance(v, numbers.Real):
        x = float(v)
        if not math.isfinite(x):
            raise SweepAxisError(axis.name, v, "is not a finite number", accepted)
        if axis.quantity == "fraction" and not 0.0 <= x <= 1.0:
            raise SweepAxisError(axis.name, v, "is outside 0 to 1", accepted)
        return x
    if axis.quantity == "fraction":
        raise SweepAxisError(axis.name, v, "is not a number", accepted)
    if axis.quantity == "elevation":
        m = _METRES.match(v) if isinstance(v, str) else None
        if m is None:
            raise SweepAxisError(axis.name, v, "is not an elevation in metres", accepted)
        return _value(axis, float(m.group(1)))
    if units.is_relative(v):  # "ambient" or a gauge reading
        raise SweepAxisError(
            axis.name,
            v,
            "'ambient' and gauge pressures depend on the elevation; give the pressure itself",
            accepted,
        )
    try:
        if axis.quantity == "temperature":
            x = units.parse_temperature(v)
        elif axis.quantity == "pressure":
            x = units.parse_pressure(v)
        else:
            x = units.parse_quantity(v, "density")
    except PhasePathError as exc:
        raise SweepAxisError(axis.name, v, str(exc), accepted) from exc
    return float(x)


def _iterable(values: Any) -> bool:
    try:
        iter(values)
    except TypeError:
        return False
    return getattr(values, "ndim", 1) == 1


def _point(plan: dict[str, Any], axes: list[_Axis], values: tuple[float, ...]) -> dict[str, Any]:
    """The route data of one grid point: the plan with the axes' values put in."""
    data = {**plan, "start": dict(plan["start"]), "legs": list(plan["legs"])}
    for axis, v in zip(axes, values, strict=True):
        if axis.place == "start":
            data["start"][axis.key] = v
        elif axis.place == "elevation":
            data["elevation"] = v
        else:
            data["legs"][axis.leg] = {**data["legs"][axis.leg], axis.key: v}
    return data


def _plain(data: dict[str, Any]) -> dict[str, Any]:
    """The plan's data as plain values for ``df.attrs`` (a substance object by its name)."""
    sub = data.get("substance")
    if isinstance(sub, (str, Mapping)) or sub is None:
        return data
    return {**data, "substance": getattr(sub, "name", str(sub))}


def _title(item: Any) -> str:
    if isinstance(item, dict):
        return str(item.get("title", ""))
    return str(getattr(item, "title", ""))


# -- one point (runs on the workers) ------------------------------------------------------------
def _outcome(payload: Any) -> dict[str, Any]:
    """The outcome of one point as plain data; a phasepath error becomes its ``error``.

    Anything other than a phasepath error is a defect and propagates.
    """
    try:
        report = build_route(payload).analyze()
    except PhasePathError as exc:
        return {"error": f"{type(exc).__name__}: {exc}"}
    first: dict[str, tuple[float, float]] = {}
    for c in report.crossings:
        first.setdefault(c.kind, (c.T, c.p))
    hazards: list[str] = []
    for leg in report.legs:
        on_leg = [h for c in report.crossings if c.step == leg.step for h in c.hazards]
        for h in (*on_leg, *leg.hazards):
            if h.kind not in hazards:
                hazards.append(h.kind)
    end = report.legs[-1].end
    return {
        "n_crossings": len(report.crossings),
        "crossing_kinds": ", ".join(c.kind for c in report.crossings),
        "first": first,
        "end_T": end.T,
        "end_p": end.p,
        "end_phase": end.phase,
        "end_form": end.form or "",
        "end_vapor_fraction": _nan(end.vapor_fraction),
        "end_solid_fraction": _nan(end.solid_fraction),
        "heat": _total([leg.heat for leg in report.legs]),
        "work": _total([leg.work for leg in report.legs]),
        "hazards": hazards,
        "error": "",
    }


def _nan(x: float | None) -> float:
    return math.nan if x is None else float(x)


def _total(values: list[float | None]) -> float:
    """Sum over the legs (correctly rounded, so in any order the same), NaN if one is None."""
    if any(v is None for v in values):
        return math.nan
    return math.fsum(values)  # type: ignore[arg-type]


# -- the table ------------------------------------------------------------------------------------
def _frame(front: dict[str, list[Any]], rows: list[dict[str, Any]]) -> pd.DataFrame:
    import numpy as np
    import pandas as pd

    kinds: dict[str, None] = {}
    hazard_kinds: dict[str, None] = {}
    for row in rows:  # first appearance in grid order, then in route order
        kinds.update(dict.fromkeys(row.get("first", ())))
        hazard_kinds.update(dict.fromkeys(row.get("hazards", ())))
    ok = [not row["error"] for row in rows]

    def floats(key: str) -> Any:
        return np.array([row.get(key, math.nan) for row in rows], dtype=float)

    def texts(key: str) -> list[Any]:
        return [row[key] if good else None for row, good in zip(rows, ok, strict=True)]

    cols: dict[str, Any] = {}
    for name, values in front.items():
        cols[name] = np.array(values, dtype=float) if name != "title" else list(values)
    cols["n_crossings"] = pd.array(
        [row["n_crossings"] if good else None for row, good in zip(rows, ok, strict=True)],
        dtype="Int64",
    )
    cols["crossing_kinds"] = texts("crossing_kinds")
    for kind in kinds:
        for i, q in enumerate(("T", "p")):
            cols[f"first_{_column(kind)}_{q}"] = np.array(
                [
                    row["first"][kind][i] if kind in row.get("first", {}) else math.nan
                    for row in rows
                ],
                dtype=float,
            )
    for key in ("end_T", "end_p"):
        cols[key] = floats(key)
    for key in ("end_phase", "end_form"):
        cols[key] = texts(key)
    for key in ("end_vapor_fraction", "end_solid_fraction", "heat", "work"):
        cols[key] = floats(key)
    cols["hazards"] = [
        ", ".join(row["hazards"]) if good else None for row, good in zip(rows, ok, strict=True)
    ]
    for kind in hazard_kinds:
        cols[f"hazard_{_column(kind)}"] = pd.array(
            [kind in row["hazards"] if good else None for row, good in zip(rows, ok, strict=True)],
            dtype="boolean",
        )
    cols["error"] = [row["error"] for row in rows]
    return pd.DataFrame(cols, index=pd.RangeIndex(len(rows)))


def _column(kind: str) -> str:
    return kind.replace("-", "_").replace(" ", "_")
