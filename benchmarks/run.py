"""phasepath benchmarks: one command, every figure of the performance section.

    python benchmarks/run.py            # full run (a few minutes on a busy 2-core machine)
    python benchmarks/run.py --quick    # fewer repeats, no browser, smaller batch

Every time is the median of repeated runs in this process (wall clock, ``time.perf_counter``);
on a shared machine single runs are noisy, medians much less so. Ratios are measured side by
side in the same process, so they carry over between machines better than absolute times.

What is measured
----------------
1. Two 10-leg routes (CO2 and water) that cross every kind of boundary, analysed by phasepath,
   against a dense scan: 2,000 points per leg, at each point every boundary covering its
   temperature looked up directly (CoolProp's low-level ``AbstractState`` for vapor pressure
   and melting, the published equation for water's ices and the sublimation curves), a
   crossing wherever the side of a boundary changes between neighbouring points. Both methods'
   crossings are compared with the exact root of the same boundary equation (``brentq`` to
   machine precision inside the scan's bracket).
2. Property evaluations per crossing, counted (boundary equations and EOS calls).
3. First draw of a substance's diagram (substance loaded, boundary curves computed, diagram
   widget built) and a redraw from the caches.
4. The planner's drag-end-to-table time without a browser (a corner of the drawn route moved
   from Python, as the browser's drag-end message does) and, unless ``--quick``, the
   click-to-table time of the real-browser test.
5. Peak resident memory of a 1,000-route batch (``pp.analyze_many``) in a fresh process.
6. Exact curved legs and cold routes (:func:`section_exact`): a CO2 vent leg (60 bar and
   20 °C to 1 atm) and an ideal-compressor leg (1 bar and 300 K to 80 bar), analysed cold,
   against a scan of 2,000 CoolProp ``PropsSI`` (p, h) and (p, s) flashes along each leg's
   pressure range; and a 10-leg CO2 isotherm/isobar route that no cache has seen against the
   dense scan of 2,000 ``PropsSI`` saturation look-ups per leg. Both sides in this process,
   medians, ratios side by side, and the crossings checked against the scans.
7. The planner in a real browser (Voila and headless chromium, unless ``--quick``): from opening
   the page to the three drawn diagrams, with and without Voila's pre-started kernels; the median
   click-to-table and drag-end-to-table times.
8. Sweeps (``benchmarks/sweeps.py``): a 100 x 100 vent grid on one and two worker processes,
   throughput, the scaling ratio and peak memory (``--sweeps`` runs it; 20 x 20 with ``--quick``).
"""

# ruff: noqa: E402, B023  (imports after the path fallback; closures are timed where made)
from __future__ import annotations

import argparse
import gc
import math
import os
import re
import shutil
import statistics
import subprocess
import sys
import textwrap
import time
from collections.abc import Callable
from pathlib import Path

REPO = Path(__file__).resolve().parents[1]
try:
    import phasepath as pp
except ImportError:  # run from a clone without installing: use the clone's package
    sys.path.insert(0, str(REPO))
    import phasepath as pp

import CoolProp.CoolProp as CP
import numpy as np
from scipy.optimize import brentq

from phasepath import analysis
from phasepath.correlations import co2, ice_ih

SCAN_POINTS = 2000


# -- the scenarios ---------------------------------------------------------------------------------
def co2_route() -> pp.Route:
    """Fictional pilot loop of Brightwater Extracts, CO2: condensation, vaporization,
    supercritical entry and exit, freezing, melting, deposition and sublimation."""
    r = pp.Route("CO2", T=250.0, p=10e5, title="Brightwater pilot loop (benchmark)")
    r.isotherm(p=60e5).isobar(T=300.0).isotherm(p=100e5).isobar(T=320.0).isotherm(p=50e5)
    r.isobar(T=230.0).isotherm(p=3000e5).isotherm(p=2e5).isobar(T=180.0).isotherm(p=0.1e5)
    return r


def water_route() -> pp.Route:
    """Fictional test cell of Kestrel Cold Labs, water: boiling, condensing, ice Ih, ice VI,
    sublimation and deposition at low pressure."""
    r = pp.Route("water", T=300.0, p=1e5, title="Kestrel test cell (benchmark)")
    r.isobar(T=400.0).isotherm(p=5e5).isobar(T=260.0).isotherm(p=300e6).isotherm(p=100.0)
    r.isobar(T=240.0).isotherm(p=1e3).isobar(T=285.0).isotherm(p=950e6).isobar(T=400.0)
    return r


# -- timing ----------------------------------------------------------------------------------------
def forget(sub: pp.Substance) -> Callable[[], None]:
    """A setup step that makes the next analysis cold: no cached legs, crossings or states."""

    def clear() -> None:
        analysis.cache_clear()
        co2._js_terms.cache_clear()  # solid models: one evaluation serves h, s and v
        ice_ih._derivatives.cache_clear()
        for memo_name in ("_states", "_saturated"):  # remembered states and saturation calls
            memo = getattr(sub.fluid, memo_name, None)
            if memo is not None:
                memo.clear()

    return clear


def median_time(
    fn: Callable[[], object], repeats: int, setup: Callable[[], object] | None = None
) -> float:
    """Median wall time of ``fn()`` [s] over ``repeats`` runs (``setup`` untimed before each)."""
    times = []
    for _ in range(repeats):
        if setup is not None:
            setup()
        t = time.perf_counter()
        fn()
        times.append(time.perf_counter() - t)
    return statistics.median(times)


def fmt_t(seconds: float) -> str:
    if seconds >= 1.0:
        return f"{seconds:.2f} s"
    if seconds >= 1e-3:
        return f"{seconds * 1e3:.2f} ms"
    return f"{seconds * 1e6:.0f} µs"


# -- the dense-scan baseline ----------------------------------------------------------------------
class Scan:
    """The hand-written alternative: look up every boundary at every point of a dense grid."""

    def __init__(self, sub: pp.Substance) -> None:
        self.sub = sub
        self.state = CP.AbstractState("HEOS", sub.name)
        self.branches: list[tuple[pp.boundaries.Boundary, Callable[[float], float]]] = []
        for b in sub.boundaries:
            self.branches.append((b, self._lookup(b)))

    def _lookup(self, b: pp.boundaries.Boundary) -> Callable[[float], float]:
        """The fastest direct look-up of a branch that gives the same numbers as phasepath's."""
        a = self.state
        T_mid = 0.5 * (b.T_min + b.T_max)
        if b.kind == "vaporization" and b.source == "CoolProp":

            def p_sat(T: float) -> float:
                a.update(CP.QT_INPUTS, 0.0, T)
                return a.p()

            candidate = p_sat
        elif b.kind == "melting" and b.source == "CoolProp":
            shift = b.p_of_T(T_mid) - a.melting_line(CP.iP, CP.iT, T_mid)

            def p_melt(T: float) -> float:
                return a.melting_line(CP.iP, CP.iT, T) + shift

            candidate = p_melt
        else:
            return b.p_of_T  # a published equation CoolProp does not carry
        for T in np.linspace(b.T_min, b.T_max, 7)[1:-1]:
            if not math.isclose(candidate(float(T)), b.p_of_T(float(T)), rel_tol=1e-12):
                return b.p_of_T
        return candidate

    def leg(
        self, kind: str, T0: float, p0: float, T1: float, p1: float, n: int = SCAN_POINTS
    ) -> tuple[list[tuple[str, float, float, Callable[[float], float], str]], int]:
        """Brackets [(label, x_a, x_b, look-up, kind)] where a boundary's side changes; look-ups."""
        if kind == "isobar":
            xs = np.linspace(T0, T1, n)
            Ts, ps = xs, np.full(n, p0)
        else:  # pressure spans decades: equal ratios, as anyone scanning by hand would
            xs = np.geomspace(p0, p1, n)
            Ts, ps = np.full(n, T0), xs
        out = []
        lookups = 0
        for b, f in self.branches:
            inside = np.nonzero((Ts >= b.T_min) & (Ts <= b.T_max))[0]
            if len(inside) < 2:
                continue
            pb = np.array([f(t) for t in Ts[inside].tolist()])
            lookups += len(inside)
            above = ps[inside] > pb
            for k in np.nonzero(above[1:] != above[:-1])[0]:
                i, j = inside[k], inside[k + 1]
                if j == i + 1:
                    out.append((b.label, float(xs[i]), float(xs[j]), f, kind))
        T_c, p_c = self.sub.critical
        sc = (Ts > T_c) & (ps > p_c)
        for i in np.nonzero(sc[1:] != sc[:-1])[0]:
            # the critical isotherm or isobar: no look-up, the bracket is found from coordinates
            out.append(("critical", float(xs[i]), float(xs[i + 1]), None, kind))  # type: ignore
        return out, lookups

    def route(self, route: pp.Route) -> tuple[list[tuple], int]:
        corners = route.corners()
        found, total = [], 0
        for i, leg in enumerate(route.legs):
            brackets, n = self.leg(leg.kind, *corners[i], *corners[i + 1])
            total += n
            found += [(i + 1, *b) for b in brackets]
        return found, total


def exact_root(
    kind: str,
    fixed: float,
    f: Callable[[float], float] | None,
    a: float,
    b: float,
    sub: pp.Substance,
) -> float:
    """The exact crossing on a leg: the boundary evaluated at the fixed T (isotherm), or the root
    of p_b(T) = p inside [a, b] to machine precision (isobar)."""
    T_c, p_c = sub.critical
    if f is None:  # the critical isotherm or isobar
        return T_c if kind == "isobar" else p_c
    if kind == "isotherm":
        return f(fixed)
    return brentq(
        lambda t: f(t) - fixed, min(a, b), max(a, b), xtol=1e-300, rtol=8.9e-16, maxiter=200
    )


def accuracy(
    route: pp.Route, report: pp.Report, scan: Scan
) -> tuple[list[float], list[float], list[float], int, int]:
    """Relative errors of scan midpoints, scan linear interpolation, phasepath crossings."""
    sub = route.substance
    found, _ = scan.route(route)
    corners = route.corners()
    err_mid, err_lin, err_pp = [], [], []
    matched = 0
    for step, _label, xa, xb, f, kind in found:
        leg_T, leg_p = corners[step]  # end corner: its fixed coordinate equals the leg's
        fixed = leg_p if kind == "isobar" else leg_T
        x_ref = exact_root(kind, fixed, f, xa, xb, sub)
        mid = 0.5 * (xa + xb) if kind == "isobar" else math.sqrt(xa * xb)
        err_mid.append(abs(mid - x_ref) / x_ref)
        if f is not None:  # the side function g changes sign between xa and xb

            def g(x: float) -> float:
                return f(x) - fixed if kind == "isobar" else x - f(fixed)

            ga, gb = g(xa), g(xb)
            lin = xa + (xb - xa) * ga / (ga - gb)
            err_lin.append(abs(lin - x_ref) / x_ref)
        # the phasepath crossing on the same leg nearest to this one
        mine = [c for c in report.crossings if c.step == step]
        if mine:
            c = min(mine, key=lambda c: abs((c.T if kind == "isobar" else c.p) - x_ref))
            x_pp = c.T if kind == "isobar" else c.p
            if abs(x_pp - x_ref) <= abs(xb - xa):
                matched += 1
                err_pp.append(abs(x_pp - x_ref) / x_ref)
    return err_mid, err_lin, err_pp, len(found), matched


# -- counting property evaluations ----------------------------------------------------------------
def count_evaluations(route: pp.Route) -> dict[str, float]:
    """Boundary-equation and EOS calls of one cold analysis of ``route``."""
    sub = route.substance
    counts = {"boundary": 0}
    saved = []
    for b in sub.boundaries:
        saved.append((b, b.p_of_T, b.T_of_p))

        def wrap(f: Callable[[float], float]) -> Callable[[float], float]:
            def counted(x: float) -> float:
                counts["boundary"] += 1
                return f(x)

            return counted

        b.p_of_T = wrap(b.p_of_T)
        if b.T_of_p is not None:
            b.T_of_p = wrap(b.T_of_p)
    try:
        forget(sub)()
        eos0 = getattr(sub.fluid, "calls", 0)
        report = route.analyze()
        eos = getattr(sub.fluid, "calls", 0) - eos0
    finally:
        for b, p_of_T, T_of_p in saved:
            b.p_of_T, b.T_of_p = p_of_T, T_of_p
        analysis.cache_clear()
    located = [c.evaluations for c in report.crossings if not c.at_corner]
    n = max(len(report.crossings), 1)
    return {
        "crossings": len(report.crossings),
        "locate_max": max(located, default=0),
        "locate_mean": statistics.mean(located) if located else 0.0,
        "boundary_per_crossing": counts["boundary"] / n,
        "eos_per_crossing": eos / n,
        "boundary": counts["boundary"],
        "eos": eos,
    }


# -- sections --------------------------------------------------------------------------------------
def section_routes(repeats: int, scan_repeats: int) -> list[str]:
    lines = ["", "1-2. Ten-leg routes against a dense scan (2,000 points per leg); evaluations", ""]
    for make in (co2_route, water_route):
        route = make()
        sub = route.substance
        for b in sub.boundaries:
            b.sample()  # per-substance precomputation, measured in section 3
        scan = Scan(sub)
        report = route.analyze()
        t_scan = median_time(lambda: scan.route(route), scan_repeats)
        _, lookups = scan.route(route)
        t_cold = median_time(route.analyze, repeats, setup=forget(sub))
        route.analyze()
        t_warm = median_time(route.analyze, repeats)
        err_mid, err_lin, err_pp, n_scan, matched = accuracy(route, report, scan)
        ev = count_evaluations(route)
        kinds = sorted({c.kind for c in report.crossings})
        lines += [
            f"   {sub.name}: {len(route.legs)} legs, {len(report.crossings)} crossings "
            f"({', '.join(kinds)})",
            f"     dense scan ({lookups:,} look-ups):        {fmt_t(t_scan):>10}   median of "
            f"{scan_repeats}",
            f"     phasepath analyze(), legs not cached: {fmt_t(t_cold):>10}   median of {repeats}"
            f"   -> {t_scan / t_cold:,.0f}x faster than the scan",
            f"     phasepath analyze(), legs cached:     {fmt_t(t_warm):>10}   "
            f"-> {t_scan / t_warm:,.0f}x",
            f"     crossing error vs exact boundary (relative, max over {n_scan} scan crossings):",
            f"       scan, midpoint of bracketing points:   {max(err_mid):.1e}  "
            f"(median {statistics.median(err_mid):.1e})",
            f"       scan, linear interpolation:            {max(err_lin):.1e}  "
            f"(median {statistics.median(err_lin):.1e})",
            f"       phasepath ({matched} matched):             {max(err_pp):.1e}  "
            f"(median {statistics.median(err_pp):.1e})",
            "     property evaluations per crossing:",
            f"       to locate it (recorded, counted): max {ev['locate_max']}, "
            f"mean {ev['locate_mean']:.2f}",
            f"       whole analysis: {ev['boundary']} boundary-equation calls + {ev['eos']} EOS "
            f"calls for {ev['crossings']} crossings = "
            f"{ev['boundary_per_crossing']:.1f} + {ev['eos_per_crossing']:.1f} per crossing",
            "",
        ]
    return lines


def section_draw(repeats: int) -> list[str]:
    import importlib

    catalog = importlib.import_module("phasepath.catalog")

    lines = ["3. Diagram drawing (substance loaded, boundary curves computed)", ""]
    try:
        from phasepath.widgets.diagram import PhaseDiagram
    except Exception as exc:  # the widget layer is optional for this figure
        PhaseDiagram = None
        lines.append(f"   (diagram widget not importable: {exc}; core curves only)")

    for name in ("CO2", "water"):

        def cold_core() -> object:
            sub = pp.substance(name)
            return [b.curve(0.0, sub.p_max) for b in sub.boundaries]

        def cold_draw() -> object:
            sub = pp.substance(name)
            d = PhaseDiagram("degC", "bar")
            d.set_substance(sub)
            return d

        def unload() -> None:
            catalog._reference.cache_clear()
            gc.collect()

        t_core = median_time(cold_core, repeats, setup=unload)
        t_core_warm = median_time(cold_core, repeats * 4)
        row = [
            f"   {pp.substance(name).name}: first load + curves {fmt_t(t_core)}, "
            f"cached {fmt_t(t_core_warm)}"
        ]
        if PhaseDiagram is not None:
            t_draw = median_time(cold_draw, repeats, setup=unload)
            d = cold_draw()
            sub = pp.substance(name)
            other = pp.substance("water" if sub.name != "Water" else "CO2")
            d.set_substance(other)  # both substances' curves are now cached

            def switch_back_and_forth() -> None:
                d.set_substance(other)
                d.set_substance(sub)

            # a redraw of the same substance is skipped by the widget: time a real switch
            t_redraw = median_time(switch_back_and_forth, repeats * 4) / 2
            row.append(
                f"; diagram widget first draw {fmt_t(t_draw)}, "
                f"cached redraw (switch to another substance and back, per draw) "
                f"{fmt_t(t_redraw)}"
            )
        lines.append("".join(row))
    return lines + [""]


def section_drag(repeats: int, browser: bool) -> list[str]:
    lines = ["4. Planner: drag-end to updated table", ""]
    try:
        from phasepath.widgets import RoutePlanner
    except Exception as exc:
        return lines + [f"   planner not importable ({exc}): not measured", ""]
    planner = RoutePlanner(route=co2_route())
    c = planner.diagram.corners
    i = 5  # a middle corner: two legs change, eight are unchanged
    y0 = list(c.y)
    times, updated = [], 0
    for k in range(repeats):
        x, y = list(c.x), list(c.y)  # as the page holds them after the last redraw
        y[i] = y0[i] * (1.0 + 1e-3 * (k + 1))  # a new pressure every time: nothing cached for it
        before = (planner.report, planner.results.value)
        t = time.perf_counter()
        with c.hold_trait_notifications():  # one drag-end message carries both coordinates
            c.x, c.y = np.array(x, dtype=float), np.array(y, dtype=float)
        times.append(time.perf_counter() - t)
        updated += planner.report is not before[0] and planner.results.value != before[1]
    lines.append(
        f"   without a browser (CO2 route, corner {i} of 10 moved): median "
        f"{fmt_t(statistics.median(times))} over {repeats} drags; table updated "
        f"{updated}/{repeats} times"
    )
    if browser:
        lines.append("   " + browser_click_to_table())
    return lines + [""]


def browser_click_to_table() -> str:
    test = REPO / "tests" / "browser" / "test_planner_browser.py"
    if not test.exists() or not (shutil.which("chromium") or Path("/usr/bin/chromium").exists()):
        return "in the real browser: not measured (no browser test or no chromium here)"
    cmd = [
        sys.executable,
        "-m",
        "pytest",
        "-q",
        "-s",
        "-p",
        "no:cacheprovider",
        str(test),
        "-k",
        "click",
    ]
    try:
        out = subprocess.run(cmd, cwd=REPO, capture_output=True, text=True, timeout=600)
    except subprocess.TimeoutExpired:
        return "in the real browser: the browser test timed out"
    found = re.findall(r"click-to-table time \(browser, Voila\): (\d+) ms", out.stdout)
    if not found:
        tail = (out.stdout + out.stderr).strip().splitlines()[-1:] or ["no output"]
        return f"in the real browser: no figure printed ({tail[0]})"
    return f"in the real browser (Voila + headless chromium, one click): {found[-1]} ms"


_BATCH_CHILD = textwrap.dedent("""
    import resource, sys, time
    sys.path.insert(0, sys.argv[3])
    import phasepath as pp
    n, workers = int(sys.argv[1]), int(sys.argv[2])
    def route(k):
        p0 = 8e5 + 2e5 * (k % 20)          # start pressure swept (8 to 46 bar)
        T2 = 280.0 + 0.05 * k              # heating target swept
        r = pp.Route("CO2", T=250.0, p=p0).isotherm(p=60e5).isobar(T=T2)
        return r.isotherm(p=3e5).isobar(T=190.0).isotherm(p=0.5e5)
    routes = [route(k) for k in range(n)]
    pp.substance("CO2").vapor.sample()
    base = resource.getrusage(resource.RUSAGE_SELF).ru_maxrss
    t = time.perf_counter()
    reports = pp.analyze_many(routes, workers=None if workers == 1 else workers, progress=False)
    dt = time.perf_counter() - t
    peak = resource.getrusage(resource.RUSAGE_SELF).ru_maxrss
    child = resource.getrusage(resource.RUSAGE_CHILDREN).ru_maxrss
    print(base, peak, child, dt, sum(len(r.crossings) for r in reports))
""")


def section_memory(n: int) -> list[str]:
    lines = [f"5. Batch of {n:,} five-leg CO2 routes (pp.analyze_many), fresh process each", ""]
    for workers in (1, 2):
        out = subprocess.run(
            [sys.executable, "-c", _BATCH_CHILD, str(n), str(workers), str(REPO)],
            capture_output=True,
            text=True,
            timeout=1800,
        )
        if out.returncode != 0:
            lines.append(f"   workers={workers}: failed: {out.stderr.strip().splitlines()[-1:]}")
            continue
        base, peak, child, dt, ncross = out.stdout.split()
        base_mb, peak_mb, child_mb = int(base) / 1024, int(peak) / 1024, int(child) / 1024
        what = "in this process" if workers == 1 else f"{workers} worker processes"
        extra = f", largest worker {child_mb:.0f} MB" if workers > 1 else ""
        lines.append(
            f"   {what}: {float(dt):.2f} s ({n / float(dt):,.0f} routes/s, "
            f"{ncross} crossings); peak RSS {peak_mb:.0f} MB (after import and "
            f"before the batch {base_mb:.0f} MB, +{peak_mb - base_mb:.0f} MB){extra}"
        )
    return lines + [""]


# -- 6. exact curved legs and cold routes ----------------------------------------------------------
def _scan_flashes(route: pp.Route, n: int = SCAN_POINTS) -> tuple[list[float], int]:
    """The hand-written alternative for a curved leg: n PropsSI flashes along its pressure
    range, the bracket midpoints where CoolProp's phase (its quality) changes."""
    leg = route.legs[0]
    end = leg.state
    assert end is not None
    key, value = ("H", end.h) if leg.kind == "isenthalp" else ("S", end.s)
    ps = np.geomspace(route.start.p, leg.p, n)
    phases = []
    for p in ps.tolist():
        try:
            q = CP.PropsSI("Q", "P", p, key, value, sub_name(route))
        except ValueError:
            q = math.nan  # below the triple point: CoolProp has no solid, the scan gives up there
        phases.append("two-phase" if 0.0 <= q <= 1.0 else ("?" if math.isnan(q) else "one"))
    marks = [
        math.sqrt(ps[i] * ps[i + 1])
        for i in range(n - 1)
        if phases[i] != phases[i + 1] and "?" not in (phases[i], phases[i + 1])
    ]
    return marks, n


def sub_name(route: pp.Route) -> str:
    return route.substance.name


def _scan_saturation(route: pp.Route, n: int = SCAN_POINTS) -> int:
    """The dense scan of a straight route: n PropsSI saturation look-ups per leg."""
    corners = route.corners()
    name = sub_name(route)
    T_t = route.substance.triple[0]
    T_c = route.substance.critical[0]
    calls = 0
    for (T0, _), (T1, _) in zip(corners[:-1], corners[1:], strict=True):
        for T in np.linspace(T0, T1, n).tolist():
            Tq = min(max(T, T_t), T_c - 1e-6)  # a look-up on the curve at (or next to) T
            CP.PropsSI("P", "T", Tq, "Q", 0, name)
            calls += 1
    return calls


def _fresh_co2_route(k: int) -> pp.Route:
    """The 10-leg CO2 route of section 1 with every coordinate moved by a new factor: no cache
    has seen its legs."""
    f = 1.0 + 1e-7 * (k + 1)
    r = pp.Route("CO2", T=250.0 * f, p=10e5 * f)
    r.isotherm(p=60e5 * f).isobar(T=300.0 * f).isotherm(p=100e5 * f).isobar(T=320.0 * f)
    r.isotherm(p=50e5 * f).isobar(T=230.0 * f).isotherm(p=3000e5 * f).isotherm(p=2e5 * f)
    return r.isobar(T=180.0 * f).isotherm(p=0.1e5 * f)


def section_exact(repeats: int, scan_repeats: int) -> list[str]:
    """Curved legs (vent, compressor) and a cold 10-leg route against PropsSI scans."""
    lines = [
        "6. Exact curved legs and cold routes against CoolProp PropsSI scans (2,000 per leg)",
        "",
    ]
    vent = pp.Route("CO2", T=293.15, p=60e5, title="vent").isenthalp(p=101325.0)
    comp = pp.Route("CO2", T=300.0, p=1e5, title="compressor").isentrope(p=80e5)
    sub = vent.substance
    t_first = time.perf_counter()
    vent.analyze(), comp.analyze()  # the substance's boundary functions: built once, kept
    t_first = time.perf_counter() - t_first
    total_scan = total_pp = 0.0
    for route in (vent, comp):
        leg = route.legs[0]
        report = route.analyze()
        marks, _ = _scan_flashes(route)
        t_scan = median_time(lambda: _scan_flashes(route), scan_repeats)
        t_cold = median_time(route.analyze, repeats, setup=forget(sub))
        total_scan += t_scan
        total_pp += t_cold
        mine = [c.p for c in report.crossings if c.boundary == "vapor pressure"]
        found = all(any(abs(m / x - 1) < 5e-3 for x in mine) for m in marks)
        lines += [
            f"   {leg.kind} {route.title} ({route.start.p / 1e5:g} bar, {route.start.T:g} K -> "
            f"{leg.p / 1e5:.5g} bar): {len(report.crossings)} crossings "
            f"({', '.join(c.kind for c in report.crossings)})",
            f"     scan, 2,000 PropsSI flashes:          {fmt_t(t_scan):>10}   median of "
            f"{scan_repeats}; its changes of phase {len(marks)}, all found by phasepath: "
            f"{'yes' if found else 'NO'}",
            f"     phasepath analyze(), cold:            {fmt_t(t_cold):>10}   median of "
            f"{repeats}   -> {t_scan / t_cold:,.0f}x",
        ]
    lines += [
        f"   both legs: scan {fmt_t(total_scan)}, phasepath {fmt_t(total_pp)} -> "
        f"{total_scan / total_pp:,.0f}x (target 300x); the substance's boundary functions, "
        f"built once on first use: {fmt_t(t_first)}",
        "",
    ]
    # a cold 10-leg route that no cache has seen
    _fresh_co2_route(-1).analyze()
    fresh = [_fresh_co2_route(k) for k in range(max(repeats, 5))]
    times = []
    for r in fresh:
        t = time.perf_counter()
        r.analyze()
        times.append(time.perf_counter() - t)
    t_route = statistics.median(times)
    calls = _scan_saturation(fresh[0])
    t_sat = median_time(lambda: _scan_saturation(fresh[0]), scan_repeats)
    ev = count_evaluations(_fresh_co2_route(10_000))
    lines += [
        f"   10-leg CO2 isotherm/isobar route, new coordinates every run "
        f"({len(fresh[0].analyze().crossings)} crossings):",
        f"     scan, {calls:,} PropsSI saturation look-ups:  {fmt_t(t_sat):>10}   median of "
        f"{scan_repeats}",
        f"     phasepath analyze(), no cache has seen it: {fmt_t(t_route):>10}   median of "
        f"{len(fresh)}   -> {t_sat / t_route:,.0f}x (target 1000x)",
        f"     what it costs: {ev['eos']} EOS calls and {ev['boundary']} boundary-equation "
        f"calls for {ev['crossings']} crossings (the states at the 11 corners, for heat and "
        "work, are most of it)",
        "",
    ]
    return lines


_PLANNER_NB = {
    "cells": [
        {
            "cell_type": "code",
            "execution_count": None,
            "id": "planner",
            "metadata": {},
            "outputs": [],
            "source": "import phasepath as pp\n"
            "planner = pp.widgets.RoutePlanner('CO2', T_unit='degC', p_unit='bar')\n"
            "planner",
        }
    ],
    "metadata": {
        "kernelspec": {"display_name": "Python 3", "language": "python", "name": "python3"}
    },
    "nbformat": 4,
    "nbformat_minor": 5,
}
#: The number of corner rows shown in the leg list (rows made ahead are hidden).
VISIBLE_ROWS = (
    "Array.from(document.querySelectorAll('.pp-legs .pp-row'))"
    ".filter(e => e.offsetParent !== null).length"
)

_DRAWN = (
    "() => ['pT', 'ph', 'Ts'].every(v => { const f = document.querySelector('.pp-view-' + v); "
    "return f && f.querySelectorAll('path.line').length > 2 && "
    "f.querySelectorAll('g.axis g.tick text').length > 4; })"
)


def _voila(home: Path, extra: list[str]) -> tuple[subprocess.Popen[bytes], str]:
    """A Voila server of the planner notebook on 127.0.0.1 (stopped by the caller)."""
    import json
    import socket
    import urllib.error
    import urllib.request

    nb = home / "planner_bench.ipynb"
    nb.write_text(json.dumps(_PLANNER_NB))
    env = dict(os.environ)
    for var in ("JUPYTER_CONFIG_DIR", "JUPYTER_RUNTIME_DIR", "JUPYTER_DATA_DIR", "IPYTHONDIR"):
        (home / var.lower()).mkdir(exist_ok=True)
        env[var] = str(home / var.lower())
    env["PYTHONPATH"] = os.pathsep.join([str(REPO), env.get("PYTHONPATH", "")]).rstrip(os.pathsep)
    with socket.socket() as sock:
        sock.bind(("127.0.0.1", 0))
        port = sock.getsockname()[1]
    proc = subprocess.Popen(
        [
            sys.executable,
            "-m",
            "voila",
            "--no-browser",
            f"--port={port}",
            "--Voila.ip=127.0.0.1",
            "--Voila.port_retries=0",
            *extra,
            str(nb),
        ],
        cwd=home,
        env=env,
        stdout=subprocess.DEVNULL,
        stderr=subprocess.DEVNULL,
    )
    base = f"http://127.0.0.1:{port}"
    deadline = time.monotonic() + 90
    while time.monotonic() < deadline:
        try:
            urllib.request.urlopen(base + "/voila/static/voila.js", timeout=2)
            break
        except urllib.error.HTTPError:
            break
        except OSError:
            time.sleep(0.3)
    return proc, base + "/"


def _stop(proc: subprocess.Popen[bytes]) -> None:
    import psutil

    children = psutil.Process(proc.pid).children(recursive=True)
    proc.terminate()
    try:
        proc.wait(timeout=15)
    except subprocess.TimeoutExpired:
        proc.kill()
    for child in children:
        try:
            child.wait(timeout=5)
        except psutil.TimeoutExpired:
            child.kill()
        except psutil.NoSuchProcess:
            pass


def _first_view(browser: object, url: str) -> float:
    page = browser.new_page(viewport={"width": 1440, "height": 1100})  # type: ignore[attr-defined]
    page.route("**/cdn.jsdelivr.net/**", lambda r: r.abort())
    t = time.perf_counter()
    page.goto(url, wait_until="commit", timeout=120_000)
    page.wait_for_function(_DRAWN, timeout=120_000, polling=20)
    dt = time.perf_counter() - t
    page.close()
    return dt


def section_planner_latency(clicks: int, drags: int) -> list[str]:
    """The planner in headless chromium under Voila: first view, click-to-table and
    drag-end-to-table (the table of legs updated in the page)."""
    import tempfile

    lines = ["6. Planner in a real browser (Voila + headless chromium)", ""]
    chromium = shutil.which("chromium")
    try:
        from playwright.sync_api import sync_playwright
    except ImportError:
        chromium = None
    if chromium is None:
        return lines + ["   not measured: no chromium or no Playwright here", ""]
    args = [
        "--headless",
        "--no-sandbox",
        "--disable-gpu",
        "--disable-quic",
        "--no-first-run",
        "--disable-background-networking",
        "--disable-component-update",
        "--disable-sync",
    ]
    with tempfile.TemporaryDirectory() as tmp, sync_playwright() as p:
        browser = p.chromium.launch(executable_path=chromium, args=args)
        firsts: dict[str, list[float]] = {}
        for name, extra in (
            ("new kernel", []),
            ("pre-started kernel", ["--preheat_kernel=True", "--pool_size=1"]),
        ):
            home = Path(tmp) / name.replace(" ", "-")
            home.mkdir()
            proc, url = _voila(home, extra)
            try:
                times = []
                for _ in range(3):
                    if extra:
                        time.sleep(20.0)  # the pool's kernel runs the notebook before it serves
                    times.append(_first_view(browser, url))
                firsts[name] = times
            finally:
                _stop(proc)
        for name, times in firsts.items():
            lines.append(
                f"   first view (page opened -> three diagrams drawn), {name}: median "
                f"{statistics.median(times):.2f} s over {len(times)} loads"
            )
        home = Path(tmp) / "latency"
        home.mkdir()
        proc, url = _voila(home, [])
        try:
            page = browser.new_page(viewport={"width": 1440, "height": 1100})
            page.route("**/cdn.jsdelivr.net/**", lambda r: r.abort())
            page.goto(url, wait_until="domcontentloaded", timeout=120_000)
            page.wait_for_function(_DRAWN, timeout=120_000)
            page.wait_for_timeout(500)
            area = page.evaluate(
                "() => { const a = document.querySelector('.pp-view-pT rect.plotarea_events')"
                ".getBoundingClientRect(); return [a.left, a.top, a.width, a.height]; }"
            )
            page.get_by_role("button", name="constant p").click()
            y = area[1] + 0.55 * area[3]
            count = "() => document.querySelectorAll('table.pp-legsum tr.pp-leg').length"
            page.mouse.click(area[0] + 0.15 * area[2], y)
            page.wait_for_function("() => " + VISIBLE_ROWS)
            click_times = []
            for k in range(clicks):
                x = area[0] + (0.2 + 0.7 * (k + 1) / (clicks + 1)) * area[2]
                t = time.perf_counter()
                page.mouse.click(x, y)
                page.wait_for_function(f"() => ({count})() >= {k + 1}", polling=5)
                click_times.append(time.perf_counter() - t)
            # drags: the last corner up and down (its isobar leg follows); the end of the drag
            # (mouse up) to the legs table showing the new pressure
            page.get_by_role("button", name="constant T").click()
            x_last = area[0] + (0.2 + 0.7 * clicks / (clicks + 1)) * area[2]
            page.mouse.click(x_last, area[1] + 0.3 * area[3])
            page.wait_for_function(f"() => ({count})() >= {clicks + 1}", polling=5)
            cell = "table.pp-legsum tr.pp-leg:last-child td.pp-c-p1"
            drag_times = []
            for k in range(drags):
                before = page.inner_text(cell)
                y0 = area[1] + (0.3 if k % 2 == 0 else 0.2) * area[3]
                y1 = area[1] + (0.2 if k % 2 == 0 else 0.3) * area[3]
                page.mouse.move(x_last, y0)
                page.mouse.down()
                page.mouse.move(x_last, (y0 + y1) / 2, steps=3)
                page.mouse.move(x_last, y1, steps=3)
                t = time.perf_counter()
                page.mouse.up()
                page.wait_for_function(
                    "([sel, old]) => { const c = document.querySelector(sel); "
                    "return c && c.textContent !== old; }",
                    arg=[cell, before],
                    polling=5,
                    timeout=30_000,
                )
                drag_times.append(time.perf_counter() - t)
            page.close()
        finally:
            _stop(proc)
            browser.close()
    lines.append(
        f"   click-to-table: median {statistics.median(click_times) * 1e3:.0f} ms over "
        f"{len(click_times)} clicks (target 100 ms)"
    )
    lines.append(
        f"   drag-end-to-table: median {statistics.median(drag_times) * 1e3:.0f} ms over "
        f"{len(drag_times)} drags (target 60 ms)"
    )
    return lines + [""]


def section_sweeps(quick: bool) -> list[str]:
    """8. The sweep benchmark of ``benchmarks/sweeps.py`` (each run in a fresh process)."""
    sys.path.insert(0, str(Path(__file__).resolve().parent))
    import sweeps

    return ["8. Sweeps: a vent grid on one and two worker processes", "", *sweeps.run(quick), ""]


def main(argv: list[str] | None = None) -> int:
    ap = argparse.ArgumentParser(description=__doc__.splitlines()[0])
    ap.add_argument(
        "--quick", action="store_true", help="fewer repeats, a 200-route batch, no browser"
    )
    ap.add_argument("--no-browser", action="store_true", help="skip the real-browser figure")
    ap.add_argument(
        "--planner", action="store_true", help="only the planner in a real browser (section 7)"
    )
    ap.add_argument("--sweeps", action="store_true", help="only the sweep benchmark (section 8)")
    args = ap.parse_args(argv)
    if args.planner:
        for line in section_planner_latency(clicks=15, drags=15):
            print(line, flush=True)
        return 0
    if args.sweeps:
        for line in section_sweeps(args.quick):
            print(line, flush=True)
        return 0
    repeats, scan_repeats = (15, 3) if args.quick else (101, 9)
    print(
        f"phasepath {pp.__version__} benchmarks  (python {sys.version.split()[0]}, "
        f"CoolProp {CP.get_global_param_string('version')}, {os.cpu_count()} CPUs; "
        f"times are medians of repeated runs)"
    )
    for line in section_routes(repeats, scan_repeats):
        print(line, flush=True)
    for line in section_draw(5 if args.quick else 21):
        print(line, flush=True)
    for line in section_drag(10 if args.quick else 41, browser=not (args.quick or args.no_browser)):
        print(line, flush=True)
    for line in section_memory(200 if args.quick else 1000):
        print(line, flush=True)
    for line in section_exact(15 if args.quick else 101, 3 if args.quick else 9):
        print(line, flush=True)
    if not (args.quick or args.no_browser):
        for line in section_planner_latency(clicks=15, drags=15):
            print(line, flush=True)
    for line in section_sweeps(args.quick):
        print(line, flush=True)
    return 0


if __name__ == "__main__":
    raise SystemExit(main())
