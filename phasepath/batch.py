"""Batch analysis of many routes, and the engines that sweeps share.

``analyze_many`` runs :meth:`Route.analyze` over a list of routes and returns the reports in
input order. It uses existing engines only: this process (serial), a
:class:`concurrent.futures.ProcessPoolExecutor` on one machine, or a Dask cluster when its
address is given (Dask is imported only then and is not a dependency of phasepath).

:func:`map_routes` is the one chunked map over those three engines; ``analyze_many`` and
:func:`phasepath.sweep` both run on it. Routes travel to worker processes as plain data
(:func:`route_data`: :meth:`Route.to_dict`, with a substance built from data sent as its data),
many routes to a task, and plain results travel back, so results are the same whichever engine
computed them. Every task also reports the versions of phasepath, CoolProp, numpy and scipy it
ran with, and a worker whose versions differ from this process's is refused, since it could give
other numbers.

A route that fails does not stop the others: ``analyze_many`` collects every failure and raises
it at the end as one :class:`~phasepath.errors.BatchError` naming each failing route, with the
finished reports kept on the error.

>>> import phasepath as pp
>>> routes = [pp.Route("CO2", T=250.0, p=p).isotherm(p=30e5) for p in (10e5, 20e5)]
>>> [len(r.crossings) for r in pp.analyze_many(routes, progress=False)]
[1, 0]
"""

from __future__ import annotations

import math
from collections.abc import Callable, Iterable, Mapping, Sequence
from functools import cache
from typing import Any

from .errors import BatchError, PhasePathError, RouteError
from .report import Report
from .route import Route
from .version import __version__

__all__ = ["analyze_many", "map_routes", "route_data", "build_route", "versions"]

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
        (None where the route failed). Also raised when ``workers`` is not a positive integer,
        ``address`` is given without Dask installed or cannot be reached, or a worker runs other
        versions of phasepath or its property libraries than this process.
    """
    items = list(routes)
    results = map_routes(
        _analyze_one,
        items,
        workers=workers,
        address=address,
        progress=progress,
        desc="analysing routes",
    )
    return _assemble(items, results)


# -- the one chunked map over three engines -------------------------------------------------------
def map_routes(
    task: Callable[[Any], Any],
    items: Sequence[Any],
    *,
    workers: int | None = None,
    address: str | None = None,
    progress: bool = True,
    desc: str = "analysing routes",
) -> list[Any]:
    """``[task(item) for item in items]`` in this process, in worker processes or on Dask.

    Parameters
    ----------
    task : callable
        A module-level function (it travels by reference) taking a Route or route data and
        returning plain, picklable data. It must not raise for a failing route: it returns the
        failure as data, so that one route never sinks the others.
    items : sequence of Route or dict
        In this process each item is given to ``task`` as it is; to worker processes and to a
        cluster each goes as :func:`route_data`, ``ceil(len(items) / (8 * workers))`` items (at
        least 8) to a task.
    workers, address, progress
        As in :func:`analyze_many`; ``desc`` labels the progress bar.

    Returns
    -------
    list
        The results, in the order of ``items``.
    """
    if workers is not None and (
        isinstance(workers, bool) or not isinstance(workers, int) or workers < 1
    ):
        raise BatchError(
            f"workers = {workers!r} is not a positive whole number of processes "
            "(None or 1 analyses in this process)"
        )
    bar = _progress_bar(len(items), progress, desc)
    try:
        if address is not None:
            return _run_dask(task, address, [route_data(r) for r in items], bar)
        if workers is None or workers == 1 or len(items) <= 1:
            results = []
            for item in items:  # Route objects are analysed as they are, without a round trip
                results.append(task(item))
                bar.update(1)
            return results
        return _run_processes(task, [route_data(r) for r in items], workers, bar)
    finally:
        bar.close()


def _run_processes(task: Callable[[Any], Any], payloads: list[Any], workers: int, bar: Any) -> list:
    from concurrent.futures import ProcessPoolExecutor, as_completed

    # Routes on substances that cannot travel as data stay in this process.
    local = [i for i, p in enumerate(payloads) if not _portable(p)]
    remote = [i for i, p in enumerate(payloads) if _portable(p)]
    results: list[Any] = [None] * len(payloads)
    for i in local:
        results[i] = task(payloads[i])
        bar.update(1)
    if not remote:
        return results
    chunks = _chunks(remote, workers)
    here = versions()
    pool = ProcessPoolExecutor(max_workers=min(workers, len(chunks)))
    try:
        futures = {pool.submit(_run_chunk, task, [payloads[i] for i in idx]): idx for idx in chunks}
        for fut in as_completed(futures):
            idx = futures[fut]
            _place(results, idx, fut.result(), here, "a worker process")
            bar.update(len(idx))
    except BaseException:
        pool.shutdown(wait=True, cancel_futures=True)
        raise
    pool.shutdown(wait=True)
    return results


def _run_dask(task: Callable[[Any], Any], address: str, payloads: list[Any], bar: Any) -> list:
    try:
        from dask.distributed import Client, as_completed
    except ImportError:
        raise BatchError(
            f"address = {address!r} asks for a Dask cluster, but dask.distributed is not "
            "installed: install it (pip install 'phasepath[dask]') or leave address out to "
            "use processes on this machine"
        ) from None
    if any(not _portable(p) for p in payloads):
        raise BatchError(
            "a route on a substance that cannot travel as data (neither a known name nor "
            "built with Substance.from_data) cannot be sent to a Dask cluster: analyse it "
            "without address"
        )
    try:
        client = Client(address)
    except Exception as exc:  # connection failures come in many library-specific types
        raise BatchError(f"cannot reach the Dask scheduler at {address!r}: {exc}") from None
    try:
        threads = max(1, sum(client.nthreads().values()))
        chunks = _chunks(list(range(len(payloads))), threads)
        here = versions()
        futures = [
            client.submit(_run_chunk, task, [payloads[i] for i in idx], pure=False)
            for idx in chunks
        ]
        where = {f.key: idx for f, idx in zip(futures, chunks, strict=True)}
        results: list[Any] = [None] * len(payloads)
        for fut in as_completed(futures):
            idx = where[fut.key]
            _place(results, idx, fut.result(), here, f"a worker of the cluster at {address!r}")
            bar.update(len(idx))
        return results
    finally:
        client.close()


def _chunks(indices: list[int], workers: int) -> list[list[int]]:
    size = max(_MIN_CHUNK, math.ceil(len(indices) / (workers * _TASKS_PER_WORKER)))
    return [indices[k : k + size] for k in range(0, len(indices), size)]


def _run_chunk(task: Callable[[Any], Any], payloads: Sequence[Any]) -> tuple[dict, list]:
    """What a worker runs: its versions, and the task's result for each route of the chunk."""
    return versions(), [task(p) for p in payloads]


def _place(
    results: list[Any], idx: list[int], done: tuple[dict, list], here: dict, who: str
) -> None:
    there, values = done
    if there != here:
        raise BatchError(
            f"{who} runs {_versions_text(there)}, this process {_versions_text(here)}: its "
            "results could differ; install the same versions on every worker"
        )
    for i, value in zip(idx, values, strict=True):
        results[i] = value


@cache
def _versions() -> tuple[tuple[str, str], ...]:
    from importlib.metadata import PackageNotFoundError, version

    out = [("phasepath", __version__)]
    for dist in ("CoolProp", "numpy", "scipy"):
        try:
            out.append((dist, version(dist)))
        except PackageNotFoundError:  # pragma: no cover - they are dependencies
            out.append((dist, "not installed"))
    return tuple(out)


def versions() -> dict[str, str]:
    """Versions of phasepath and of the libraries its numbers depend on, in this process."""
    return dict(_versions())


def _versions_text(v: dict[str, str]) -> str:
    return ", ".join(f"{k} {val}" for k, val in v.items())


# -- one route ------------------------------------------------------------------------------------
def route_data(route: Any) -> Any:
    """What travels to a worker: a route's plain data (:meth:`Route.to_dict`), its substance by
    name or, for a substance built from data, by that data; anything else as it is."""
    data = route.to_dict() if isinstance(route, Route) else route
    if not isinstance(data, dict):
        return data
    sub = data.get("substance")
    if sub is None or isinstance(sub, (str, Mapping)):
        return data
    try:
        recipe = sub.to_dict()
    except (AttributeError, PhasePathError):
        return data
    if len(recipe) > 1:  # the inputs it was built from, not just a name
        return {**data, "substance": recipe}
    return data


def _portable(payload: Any) -> bool:
    return not isinstance(payload, dict) or isinstance(payload.get("substance"), (str, Mapping))


def _analyze_one(payload: Any) -> tuple[str, Any]:
    """("ok", (crossings, legs, notes, cautions)) or ("error", the error as plain data).

    Only phasepath errors count as a failed route; anything else is a defect and propagates.
    """
    try:
        report = build_route(payload).analyze()
    except PhasePathError as exc:
        return "error", exc.plain()
    return "ok", (report.crossings, report.legs, report.notes, report.cautions)


def build_route(payload: Any) -> Route:
    """The Route a payload stands for (a Route, or route data rebuilt and validated)."""
    if isinstance(payload, Route):
        return payload
    if not isinstance(payload, dict):
        raise BatchError(f"{payload!r} is not a route: give Route objects or Route.to_dict() data")
    try:
        return Route.from_dict(payload)
    except KeyError as exc:
        raise RouteError(f"route data lacks the field {exc.args[0]!r}") from None


def _assemble(items: list[Any], results: list[Any]) -> list[Report]:
    reports: list[Report | None] = []
    failures: dict[int, PhasePathError] = {}
    for i, (item, (status, value)) in enumerate(zip(items, results, strict=True)):
        if status == "error":
            failures[i] = value
            reports.append(None)
            continue
        crossings, legs, notes, cautions = value
        route = item if isinstance(item, Route) else Route.from_dict(item)
        reports.append(Report(route, crossings, legs, notes, cautions))
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
        raise BatchError(
            f"{len(failures)} of {len(items)} routes failed:\n" + "\n".join(lines),
            failures=failures,
            reports=reports,
        )
    return reports  # type: ignore[return-value]


def _progress_bar(total: int, enabled: bool, desc: str) -> Any:
    from tqdm.auto import tqdm

    return tqdm(total=total, desc=desc, unit="route", disable=not enabled)
