"""Sweep benchmark: a vent-valve grid on one and two worker processes.

    python benchmarks/sweeps.py            # 100 x 100 grid (a few minutes on a busy 2-core machine)
    python benchmarks/sweeps.py --quick    # 20 x 20 grid, three runs of each

The scenario (invented): the extraction vessel of Larkspur Botanicals holds CO2 at a temperature
and pressure somewhere in a grid of 280-320 K by 60-200 bar, and is vented through a valve to
1 atm (one constant-enthalpy leg). ``pp.sweep`` analyses every point of the grid

* in this process (``workers=None``) and
* on two worker processes (``workers=2``, ``concurrent.futures.ProcessPoolExecutor``),

each run in a fresh Python process that first analyses one point (so that both start from
loaded substance data and the pool's processes inherit it) and then times the sweep, pool start
included, with ``time.perf_counter``, and its CPU time (``resource.getrusage``, itself and its
joined worker processes): CPU time over wall time is the number of cores the run really had,
which on a shared machine can be fewer than asked for. The same process reports its peak
resident memory (``ru_maxrss``: ``RUSAGE_SELF`` for itself, ``RUSAGE_CHILDREN`` for the largest
worker process) and a hash of the resulting table, so that the runs can be checked to agree bit
for bit.
In quick mode each run is repeated three times and the median is shown.

``run(quick)`` returns the printable lines; ``benchmarks/run.py`` can call it.
"""

from __future__ import annotations

import json
import os
import statistics
import subprocess
import sys
import textwrap
from pathlib import Path

REPO = Path(__file__).resolve().parents[1]

#: Scaling from one to two worker processes that the sweep engine aims for on two free cores.
TARGET_RATIO = 1.7

_CHILD = textwrap.dedent("""
    import json, resource, sys, time
    sys.path.insert(0, sys.argv[3])
    import numpy as np
    import pandas as pd
    import phasepath as pp
    n, workers = int(sys.argv[1]), int(sys.argv[2])
    plan = pp.Route("CO2", T="20 degC", p="60 bar", title="Larkspur vessel vent").isenthalp(
        p="1 atm")
    axes = dict(start_T=np.linspace(280.0, 320.0, n), start_p=np.linspace(60e5, 200e5, n))
    pp.sweep(plan, start_T=[293.15], progress=False)  # substance data loaded, as in use
    def cpu():
        return sum(r.ru_utime + r.ru_stime for r in (
            resource.getrusage(resource.RUSAGE_SELF), resource.getrusage(resource.RUSAGE_CHILDREN)))
    base = resource.getrusage(resource.RUSAGE_SELF).ru_maxrss
    c0 = cpu()
    t = time.perf_counter()
    df = pp.sweep(plan, workers=None if workers == 1 else workers, progress=False, **axes)
    dt = time.perf_counter() - t
    cpu_s = cpu() - c0  # this process and its joined worker processes
    out = {
        "seconds": dt,
        "cpu_seconds": cpu_s,
        "points": len(df),
        "failed": int((df["error"] != "").sum()),
        "base_kb": base,
        "peak_kb": resource.getrusage(resource.RUSAGE_SELF).ru_maxrss,
        "worker_kb": resource.getrusage(resource.RUSAGE_CHILDREN).ru_maxrss,
        "hash": int(pd.util.hash_pandas_object(df, index=True).sum()),
    }
    print(json.dumps(out))
""")


def _child(n: int, workers: int) -> dict:
    out = subprocess.run(
        [sys.executable, "-c", _CHILD, str(n), str(workers), str(REPO)],
        capture_output=True,
        text=True,
        timeout=3600,
    )
    if out.returncode != 0:
        tail = out.stderr.strip().splitlines()[-1:] or ["no output"]
        raise RuntimeError(f"sweep benchmark child (workers={workers}) failed: {tail[0]}")
    return json.loads(out.stdout.strip().splitlines()[-1])


def run(quick: bool) -> list[str]:
    """Measure the vent sweep; return printable lines."""
    n = 20 if quick else 100
    repeats = 3 if quick else 1
    load = ", ".join(f"{x:.2f}" for x in os.getloadavg())
    lines = [
        f"Sweep: {n} x {n} CO2 vent grid (pp.sweep, one isenthalp leg to 1 atm), fresh process "
        f"per run, {'median of ' + str(repeats) + ' runs' if repeats > 1 else 'one run'} "
        f"each ({os.cpu_count()} CPUs, load average {load} before the runs)",
        "",
    ]
    runs: dict[int, list[dict]] = {1: [], 2: []}
    for _ in range(repeats):
        for workers in (1, 2):  # interleaved, so that a change in machine load hits both
            runs[workers].append(_child(n, workers))
    rate, cpu_per_route = {}, {}
    for workers, results in runs.items():
        seconds = statistics.median(r["seconds"] for r in results)
        rate[workers] = n * n / seconds
        cpu_s = statistics.median(r["cpu_seconds"] for r in results)
        cpu_per_route[workers] = cpu_s / (n * n)
        peak = statistics.median(r["peak_kb"] for r in results) / 1024
        base = statistics.median(r["base_kb"] for r in results) / 1024
        worker = max(r["worker_kb"] for r in results) / 1024
        failed = results[0]["failed"]
        what = "in this process   " if workers == 1 else f"{workers} worker processes"
        extra = f", largest worker {worker:.0f} MB" if workers > 1 else ""
        lines.append(
            f"   {what}: {seconds:.2f} s, {rate[workers]:,.0f} routes/s "
            f"({1e3 / rate[workers]:.1f} ms per route wall clock; {failed} of {n * n} points "
            f"failed); peak RSS {peak:.0f} MB ({base:.0f} MB before the sweep){extra}"
        )
        lines.append(
            f"      CPU {cpu_s:.2f} s ({1e3 * cpu_per_route[workers]:.1f} ms per route): "
            f"{cpu_s / seconds:.2f} cores busy on average"
        )
    ratio = rate[2] / rate[1]
    verdict = "met" if ratio >= TARGET_RATIO else "NOT met"
    lines.append(
        f"   scaling 1 -> 2 workers: {ratio:.2f}x (target >= {TARGET_RATIO}x on two cores: "
        f"{verdict}; other work on the machine takes cores too)"
    )
    overhead = cpu_per_route[2] / cpu_per_route[1]
    lines.append(
        f"   CPU per route on 2 workers / in this process: {overhead:.3f}; with two free cores "
        f"the scaling would be about {2 / overhead:.2f}x (an estimate from the CPU times)"
    )
    hashes = {r["hash"] for results in runs.values() for r in results}
    lines.append(
        "   tables of every run identical (hash of all values): "
        + ("yes" if len(hashes) == 1 else f"NO ({len(hashes)} different tables)")
    )
    return lines + [""]


def main(argv: list[str] | None = None) -> int:
    args = sys.argv[1:] if argv is None else argv
    for line in run(quick="--quick" in args):
        print(line, flush=True)
    return 0


if __name__ == "__main__":
    raise SystemExit(main())
