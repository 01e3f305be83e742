"""Batch analysis of many routes, for design sweeps.

``analyze_many`` runs :func:`phasepath.analysis.analyze` over a list of routes and returns the
reports in input order. It uses existing engines only: this process (serial), a
:class:`concurrent.futures.ProcessPoolExecutor` on one machine, or a Dask cluster when its
address is given (Dask is imported only then and is not a dependency of phasepath).

Routes travel to worker processes as plain data (:meth:`Route.to_dict`), and the crossings and
leg summaries travel back, so results are the same whichever path computed them. A route that
fails does not stop the others: every failure is collected and raised at the end as one
:class:`~phasepath.errors.BatchError` naming each failing route, with the finished reports kept
on the error.

>>> import phasepath as pp
>>> routes = [pp.Route("CO2", T=250.0, p=p).isotherm(p=30e5) for p in (10e5, 20e5)]
>>> [len(r.crossings) for r in pp.analyze_many(routes, progress=False)]
[1, 0]
"""

from __future__ import annotations

import math
from collections.abc import Iterable, Sequence
from typing import TYPE_CHECKING, Any

from .errors import BatchError, PhasePathError

if TYPE_CHECKING:  # pragma: no cover
    from .report import Report
    from .route import Route

__all__ = ["analyze_many"]

# One task per this many routes at least: a task round trip costs far more than one analysis.
_MIN_CHUNK = 8
# Aim for this many tasks per worker, so that the progress bar moves and the load evens out.
_TASKS_PER_WORKER = 8


def analyze_many(
    routes: Iterable[Route | dict[str, Any]],
    *,
    workers: int | None = None,
    progress: bool = True,
    address: str | None = None,
) -> list[Report]:
    """Analyse many routes; the reports come back in input order.

    Parameters
    ----------
    routes : iterable of Route or dict
        Routes, or route data in the form of :meth:`Route.to_dict` (rebuilt and validated here;
        a dict that does not make a route counts as a failed route).
    workers : int, optional
        None or 1: analyse in this process. An integer of 2 or more: that many worker processes
        on this machine (``concurrent.futures.ProcessPoolExecutor``). Ignored when ``address``
        is given (the cluster decides).
    progress : bool
        Show a progress bar (``tqdm.auto``: a widget in a notebook, text in a terminal).
    address : str, optional
        Address of a running Dask scheduler (``"tcp://10.0.0.5:8786"``): the routes are
        analysed on that cluster. Needs ``dask.distributed`` installed.

    Returns
    -------
    list of Report
        One report per route, in input order.

    Raises
    ------
    BatchError
        If any route fails: the message names every failing route (input index, title) and
        its error; ``exc.failures`` maps index -> error and ``exc.reports`` holds the reports
        (None where the route failed). Also raised when ``workers`` is not a positive integer
        or ``address`` is given without Dask installed.
    """
    items = list(routes)
    if workers is not None and (
        isinstance(workers, bool) or not isinstance(workers, int) or workers < 1
    ):
        raise BatchError(
            f"workers = {workers!r} is not a positive whole number of processes "
            "(None or 1 analyses in this process)"
        )
    payloads = [_payload(r) for r in items]
    bar = _progress_bar(len(items), progress)
    try:
        if address is not None:
            results = _run_dask(address, payloads, bar)
        elif workers is None or workers == 1 or len(items) <= 1:
            results = []
            for item in items:  # Route objects are analysed as they are, without a round trip
                results.append(_analyze_one(item))
                bar.update(1)
        else:
            results = _run_processes(payloads, workers, bar)
    finally:
        bar.close()
    return _assemble(items, results)


# -- the three engines ----------------------------------------------------------------------------
def _run_processes(payloads: list[Any], workers: int, bar: Any) -> list[Any]:
    from concurrent.futures import ProcessPoolExecutor, as_completed

    # Routes on substances that cannot be rebuilt from a name stay in this process.
    local = [i for i, p in enumerate(payloads) if not _portable(p)]
    remote = [i for i, p in enumerate(payloads) if _portable(p)]
    results: list[Any] = [None] * len(payloads)
    for i in local:
        results[i] = _analyze_one(payloads[i])
        bar.update(1)
    if not remote:
        return results
    chunks = _chunks(remote, workers)
    with ProcessPoolExecutor(max_workers=min(workers, len(chunks))) as pool:
        futures = {pool.submit(_analyze_chunk, [payloads[i] for i in idx]): idx for idx in chunks}
        for fut in as_completed(futures):
            idx = futures[fut]
            for i, res in zip(idx, fut.result(), strict=True):
                results[i] = res
            bar.update(len(idx))
    return results


def _run_dask(address: str, payloads: list[Any], bar: Any) -> list[Any]:
    try:
        from dask.distributed import Client, as_completed
    except ImportError:
        raise BatchError(
            f"address = {address!r} asks for a Dask cluster, but dask.distributed is not "
            "installed: install it (pip install 'dask[distributed]') or leave address out to "
            "use processes on this machine"
        ) from None
    if any(not _portable(p) for p in payloads):
        raise BatchError(
            "a route on a substance that cannot be rebuilt from its name cannot "
            "be sent to a Dask cluster: analyse it without address"
        )
    try:
        client = Client(address)
    except Exception as exc:  # connection failures come in many library-specific types
        raise BatchError(f"cannot reach the Dask scheduler at {address!r}: {exc}") from None
    try:
        n = max(1, len(client.scheduler_info().get("workers", {})))
        chunks = _chunks(list(range(len(payloads))), n)
        futures = client.map(
            _analyze_chunk, [[payloads[i] for i in idx] for idx in chunks], pure=False
        )
        where = {f.key: idx for f, idx in zip(futures, chunks, strict=True)}
        results: list[Any] = [None] * len(payloads)
        for fut in as_completed(futures):
            idx = where[fut.key]
            for i, res in zip(idx, fut.result(), strict=True):
                results[i] = res
            bar.update(len(idx))
        return results
    finally:
        client.close()


def _chunks(indices: list[int], workers: int) -> list[list[int]]:
    size = max(_MIN_CHUNK, math.ceil(len(indices) / (workers * _TASKS_PER_WORKER)))
    return [indices[k : k + size] for k in range(0, len(indices), size)]


# -- one route ------------------------------------------------------------------------------------
def _payload(route: Any) -> Any:
    """What travels to a worker: the route's plain data, or the object itself if not a Route."""
    from .route import Route

    if isinstance(route, Route):
        return route.to_dict()
    return route


def _portable(payload: Any) -> bool:
    return not isinstance(payload, dict) or isinstance(payload.get("substance"), str)


def _analyze_chunk(payloads: Sequence[Any]) -> list[Any]:
    return [_analyze_one(p) for p in payloads]


def _analyze_one(payload: Any) -> tuple[str, Any]:
    """("ok", (crossings, legs, notes)) or ("error", (class name, message)).

    Only phasepath errors count as a failed route; anything else is a defect and propagates.
    """
    from .analysis import analyze
    from .route import Route

    try:
        if isinstance(payload, Route):
            route = payload
        elif isinstance(payload, dict):
            route = Route.from_dict(payload)
        else:
            raise BatchError(
                f"{payload!r} is not a route: give Route objects or Route.to_dict() data"
            )
        report = analyze(route)
    except PhasePathError as exc:
        return "error", (type(exc).__name__, str(exc))
    except KeyError as exc:
        return "error", ("RouteError", f"route data lacks the field {exc.args[0]!r}")
    return "ok", (report.crossings, report.legs, report.notes)


def _assemble(items: list[Any], results: list[Any]) -> list[Report]:
    from .report import Report
    from .route import Route

    reports: list[Report | None] = []
    failures: dict[int, PhasePathError] = {}
    for i, (item, (status, value)) in enumerate(zip(items, results, strict=True)):
        if status == "error":
            failures[i] = _rebuild_error(*value)
            reports.append(None)
            continue
        crossings, legs, notes = value
        route = item if isinstance(item, Route) else Route.from_dict(item)
        reports.append(Report(route, crossings, legs, notes))
    if failures:
        lines = []
        for i, exc in failures.items():
            title = (
                items[i].title
                if isinstance(items[i], Route)
                else (items[i].get("title", "") if isinstance(items[i], dict) else "")
            )
            name = f"route {i}" + (f" ({title!r})" if title else "")
            lines.append(f"{name}: {type(exc).__name__}: {exc}")
        err = BatchError(f"{len(failures)} of {len(items)} routes failed:\n" + "\n".join(lines))
        err.failures = failures
        err.reports = reports
        raise err
    return reports  # type: ignore[return-value]


def _rebuild_error(name: str, message: str) -> PhasePathError:
    """The error class the worker raised, with its message."""
    from . import errors

    cls = getattr(errors, name, PhasePathError)
    if not (isinstance(cls, type) and issubclass(cls, PhasePathError)):
        cls = PhasePathError
    return cls(message)


def _progress_bar(total: int, enabled: bool) -> Any:
    from tqdm.auto import tqdm

    return tqdm(total=total, desc="analysing routes", unit="route", disable=not enabled)
