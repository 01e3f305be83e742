"""The ``phasepath`` command line: analyse a route file, check it against saved results, draw.

::

    phasepath analyze ROUTE_FILE [--format table|csv|json] [--units degC,bar,kJ/kg] [-o FILE]
    phasepath check ROUTE_FILE EXPECTED_FILE [--tol-T K] [--tol-p REL] [--tol-latent REL]
    phasepath diagram SUBSTANCE -o FILE.svg|FILE.png [--route ROUTE_FILE] [--units degC,bar]

``analyze --format json`` writes a *phasepath results file* (SI units, full precision); ``check``
re-analyses the route and compares its crossings with such a file. Exit status: 0 all well,
1 ``check`` found a difference, 2 bad input (one line on stderr, never a traceback).
"""

from __future__ import annotations

import argparse
import csv
import io as _stdio
import json
import math
import sys
from dataclasses import asdict
from pathlib import Path
from typing import Any

from .errors import PhasePathError, UnitError
from .io import MAX_BYTES, dumps_route, load_route
from .report import UNIT_LABELS, Report
from .units import ENERGY_UNITS, PRESSURE_UNITS, TEMPERATURE_UNITS, convert

__all__ = [
    "main",
    "format_report",
    "report_cautions",
    "results_document",
    "compare_crossings",
    "RESULTS_FORMAT",
    "RESULTS_VERSION",
]

#: The ``format`` field of a results file written by ``analyze --format json``.
RESULTS_FORMAT = "phasepath results"
RESULTS_VERSION = 1

_DEFAULT_UNITS = ("degC", "bar", "kJ/kg")
#: Default tolerances of ``check``: absolute in T, relative in p and latent heat.
_TOL_T = 0.01  # K
_TOL_P = 1e-4  # relative
_TOL_L = 1e-3  # relative


class _UsageError(PhasePathError):
    """Bad command-line input that is not about a route (a file, an option)."""


# -- entry point -------------------------------------------------------------------------------
def main(argv: list[str] | None = None) -> int:
    """Run the command line; returns the exit status (0 ok, 1 check failed, 2 bad input)."""
    parser = _parser()
    args = parser.parse_args(argv)
    if args.command is None:
        parser.print_help(sys.stderr)
        return 2
    try:
        result: int = args.run(args)
        return result
    except PhasePathError as exc:
        _fail(str(exc))
    except OSError as exc:
        _fail(f"{exc.filename or ''}: {exc.strerror or exc}".lstrip(": "))
    except KeyboardInterrupt:
        print("phasepath: interrupted", file=sys.stderr)
        return 130
    except Exception as exc:  # noqa: BLE001 - the user gets one line, never a traceback
        _fail(f"internal error ({type(exc).__name__}: {exc}); please report it with the route file")
    return 2


def _fail(msg: str) -> None:
    print(f"phasepath: error: {msg}", file=sys.stderr)


def _parser() -> argparse.ArgumentParser:
    from . import __version__

    units_help = (
        "display units, comma-separated, any order: one of each of "
        f"{'/'.join(TEMPERATURE_UNITS)}, {'/'.join(PRESSURE_UNITS)}, "
        f"{'/'.join(ENERGY_UNITS)} (default {','.join(_DEFAULT_UNITS)})"
    )
    p = argparse.ArgumentParser(
        prog="phasepath",
        description="Plan compression and heating routes of a pure substance on its phase "
        "diagram: every phase-boundary crossing, its T and p, and the heat per leg.",
    )
    p.add_argument("--version", action="version", version=f"phasepath {__version__}")
    sub = p.add_subparsers(dest="command", metavar="COMMAND")

    a = sub.add_parser(
        "analyze",
        help="analyse a route file and print the results",
        description="Analyse a route file and print its crossings and legs.",
    )
    a.add_argument("route", metavar="ROUTE_FILE", help="route file (.json, .yaml, .yml)")
    a.add_argument(
        "--format",
        choices=("table", "csv", "json"),
        default="table",
        help="table (for people, default), csv (crossings, or legs with --legs) or "
        "json (a results file for 'phasepath check', SI units)",
    )
    a.add_argument("--units", default=None, help=units_help)
    a.add_argument(
        "--legs", action="store_true", help="csv: the per-leg table instead of the crossings"
    )
    a.add_argument("-o", "--output", default=None, help="write to FILE instead of the screen")
    a.set_defaults(run=_analyze)

    c = sub.add_parser(
        "check",
        help="re-analyse a route and compare with saved results",
        description="Re-analyse ROUTE_FILE and compare its crossings with "
        "EXPECTED_FILE (written by 'phasepath analyze --format "
        "json'). Exit status 1 if a crossing moved beyond the "
        "tolerances, appeared or disappeared.",
    )
    c.add_argument("route", metavar="ROUTE_FILE")
    c.add_argument("expected", metavar="EXPECTED_FILE")
    c.add_argument(
        "--tol-T",
        type=_positive,
        default=_TOL_T,
        metavar="KELVIN",
        help=f"largest allowed change of a crossing temperature [K] (default {_TOL_T})",
    )
    c.add_argument(
        "--tol-p",
        type=_positive,
        default=_TOL_P,
        metavar="REL",
        help=f"largest allowed relative change of a crossing pressure (default {_TOL_P:g})",
    )
    c.add_argument(
        "--tol-latent",
        type=_positive,
        default=_TOL_L,
        metavar="REL",
        help=f"largest allowed relative change of a latent heat (default {_TOL_L:g})",
    )
    c.add_argument("--units", default=None, help=units_help)
    c.set_defaults(run=_check)

    d = sub.add_parser(
        "diagram",
        help="draw the phase diagram (and a route) to SVG or PNG",
        description="Draw the phase diagram of SUBSTANCE, with a route if one is "
        "given, to an SVG or PNG file (needs matplotlib: "
        "pip install 'phasepath[plot]').",
    )
    d.add_argument("substance", metavar="SUBSTANCE")
    d.add_argument(
        "-o", "--output", required=True, metavar="FILE", help="output file, .svg or .png"
    )
    d.add_argument("--route", default=None, metavar="ROUTE_FILE", help="route file to draw")
    d.add_argument("--units", default=None, help="display units for the axes, e.g. degC,bar")
    d.add_argument("--title", default=None, help="figure title (default: the route's title)")
    d.set_defaults(run=_diagram)
    return p


def _positive(text: str) -> float:
    try:
        x = float(text)
    except ValueError:
        raise argparse.ArgumentTypeError(f"{text!r} is not a number") from None
    if not math.isfinite(x) or x < 0:
        raise argparse.ArgumentTypeError(f"{text!r} is not a finite number >= 0")
    return x


def _units(text: str | None) -> tuple[str, str, str]:
    """(T, p, energy) display units from "degC,bar" (any order, any subset)."""
    T_u, p_u, e_u = _DEFAULT_UNITS
    if not text:
        return T_u, p_u, e_u
    seen = set()
    for token in (t.strip() for t in text.split(",")):
        if not token:
            continue
        for options, slot in ((TEMPERATURE_UNITS, 0), (PRESSURE_UNITS, 1), (ENERGY_UNITS, 2)):
            match = next((u for u in options if u.lower() == token.lower()), None)
            if match:
                if slot in seen:
                    raise UnitError(f"--units {text!r}: two units for the same quantity")
                seen.add(slot)
                if slot == 0:
                    T_u = match
                elif slot == 1:
                    p_u = match
                else:
                    e_u = match
                break
        else:
            raise UnitError(
                f"--units {text!r}: unknown display unit {token!r}; choose from "
                f"{', '.join(TEMPERATURE_UNITS + PRESSURE_UNITS + ENERGY_UNITS)}"
            )
    return T_u, p_u, e_u


# -- analyze -----------------------------------------------------------------------------------
def _analyze(args: argparse.Namespace) -> int:
    route = load_route(args.route)
    report = route.analyze()
    units = _units(args.units)
    if args.format == "json":
        text = (
            json.dumps(results_document(report), indent=2, ensure_ascii=False, allow_nan=False)
            + "\n"
        )
    elif args.format == "csv":
        text = _csv(report, units, legs=args.legs)
    else:
        text = format_report(report, *units)
    if args.output:
        Path(args.output).write_text(text, encoding="utf-8", newline="")
    else:
        sys.stdout.write(text)
    return 0


def results_document(report: Report) -> dict[str, Any]:
    """A results file (SI units): the route as written, every crossing and leg, the notes."""
    from . import __version__

    return {
        "format": RESULTS_FORMAT,
        "version": RESULTS_VERSION,
        "phasepath": __version__,
        "substance": report.substance.name,
        "route": json.loads(dumps_route(report.route, "json")),
        "crossings": [asdict(c) for c in report.crossings],
        "legs": [_leg_dict(leg) for leg in report.legs],
        "notes": list(report.notes),
    }


def _leg_dict(leg: Any) -> dict[str, Any]:
    d = asdict(leg)
    d.pop("path", None)  # the sampled states along the leg: bulky, and not part of the plan
    return d


def _num(x: float | None, digits: int = 6) -> str:
    if x is None or (isinstance(x, float) and math.isnan(x)):
        return "-"
    return f"{x:.{digits}g}"


def _phase(phase: str, form: str | None) -> str:
    return f"{phase} (ice {form})" if form else phase


def _rows_crossings(
    report: Report, T_u: str, p_u: str, e_u: str
) -> tuple[list[str], list[list[Any]]]:
    head = [
        "leg",
        "kind",
        "from",
        "to",
        f"T [{T_u}]",
        f"p [{p_u}]",
        f"latent heat [{e_u}]",
        "boundary",
        "hazards",
    ]
    rows = []
    for c in report.crossings:
        rows.append(
            [
                c.step,
                c.kind,
                _phase(c.from_phase, c.from_form),
                _phase(c.to_phase, c.to_form),
                convert(c.T, "K", T_u, "temperature"),
                convert(c.p, "Pa", p_u, "pressure"),
                None if c.latent_heat is None else convert(c.latent_heat, "J/kg", e_u, "energy"),
                c.boundary,
                "; ".join(h.kind for h in getattr(c, "hazards", ())),
            ]
        )
    return head, rows


def _rows_legs(report: Report, T_u: str, p_u: str, e_u: str) -> tuple[list[str], list[list[Any]]]:
    head = [
        "leg",
        "kind",
        f"T start [{T_u}]",
        f"p start [{p_u}]",
        f"T end [{T_u}]",
        f"p end [{p_u}]",
        "phase start",
        "phase end",
        f"heat [{e_u}]",
        f"work [{e_u}]",
        "note",
        "hazards",
    ]

    def e(v: float | None) -> float | None:
        return None if v is None else convert(v, "J/kg", e_u, "energy")

    rows = []
    for leg in report.legs:
        rows.append(
            [
                leg.step,
                leg.kind,
                convert(leg.start.T, "K", T_u, "temperature"),
                convert(leg.start.p, "Pa", p_u, "pressure"),
                convert(leg.end.T, "K", T_u, "temperature"),
                convert(leg.end.p, "Pa", p_u, "pressure"),
                _phase(leg.start.phase, leg.start.form),
                _phase(leg.end.phase, leg.end.form),
                e(leg.heat),
                e(leg.work),
                leg.note,
                "; ".join(h.kind for h in getattr(leg, "hazards", ())),
            ]
        )
    return head, rows


def _text_table(head: list[str], rows: list[list[Any]]) -> str:
    cells = [
        [_num(v) if isinstance(v, float) or v is None else str(v) for v in row] for row in rows
    ]
    numeric = [
        all(isinstance(r[i], (int, float)) or r[i] is None for r in rows) and bool(rows)
        for i in range(len(head))
    ]
    widths = [max([len(h)] + [len(r[i]) for r in cells]) for i, h in enumerate(head)]

    def line(values: list[str]) -> str:
        out = [
            v.rjust(w) if num else v.ljust(w)
            for v, w, num in zip(values, widths, numeric, strict=True)
        ]
        return "  ".join(out).rstrip()

    return "\n".join([line(head), line(["-" * w for w in widths])] + [line(r) for r in cells])


def format_report(
    report: Report, T_unit: str = "degC", p_unit: str = "bar", energy_unit: str = "kJ/kg"
) -> str:
    """The results as fixed-format text: title, crossings, legs and notes (6 significant digits).

    The same text on every machine for the same results, so it can be kept under regression.
    """
    T_u, p_u, e_u = (UNIT_LABELS[u] for u in (T_unit, p_unit, energy_unit))
    route = report.route
    n = len(report.legs)
    out = [f"{route.title or 'Route'} ({report.substance.name}, {n} leg{'s' if n != 1 else ''})"]
    out.append("")
    out.append("Crossings")
    head, rows = _rows_crossings(report, T_unit, p_unit, energy_unit)
    head = [
        h.replace(f"[{T_unit}]", f"[{T_u}]")
        .replace(f"[{p_unit}]", f"[{p_u}]")
        .replace(f"[{energy_unit}]", f"[{e_u}]")
        for h in head
    ]
    out.append(_text_table(head, rows) if rows else "(no phase boundary is crossed)")
    out.append("")
    out.append("Legs")
    head, rows = _rows_legs(report, T_unit, p_unit, energy_unit)
    head = [
        h.replace(f"[{T_unit}]", f"[{T_u}]")
        .replace(f"[{p_unit}]", f"[{p_u}]")
        .replace(f"[{energy_unit}]", f"[{e_u}]")
        for h in head
    ]
    out.append(_text_table(head, rows))
    cautions = report_cautions(report)
    if cautions:
        out.append("")
        out.append("Cautions")
        out += [f"- {c}" for c in cautions]
    if report.notes:
        out.append("")
        out.append("Notes")
        out += [f"- {n}" for n in report.notes]
    return "\n".join(out) + "\n"


def report_cautions(report: Report) -> list[str]:
    """Each hazard flagged on the route, once, with where it occurs and its caution.

    In route order; a flag that repeats on several legs is listed once with all its legs.
    """
    found: dict[tuple[str, str], list[int]] = {}
    for leg in report.legs:
        for h in getattr(leg, "hazards", ()):
            found.setdefault((h.kind, h.caution), []).append(leg.step)
    for c in report.crossings:
        for h in getattr(c, "hazards", ()):
            found.setdefault((h.kind, h.caution), []).append(c.step)
    out = []
    for (kind, caution), steps in found.items():
        legs = sorted(set(steps))
        where = ("leg " if len(legs) == 1 else "legs ") + ", ".join(map(str, legs))
        out.append(f"{kind} ({where}): {caution}")
    return out


def _csv(report: Report, units: tuple[str, str, str], legs: bool) -> str:
    head, rows = (_rows_legs if legs else _rows_crossings)(report, *units)
    buf = _stdio.StringIO()
    w = csv.writer(buf, lineterminator="\n")
    w.writerow(head)
    for r in rows:
        w.writerow(["" if v is None else (repr(v) if isinstance(v, float) else v) for v in r])
    return buf.getvalue()


# -- check -------------------------------------------------------------------------------------
def _read_results(path: str) -> dict[str, Any]:
    p = Path(path)
    if p.stat().st_size > MAX_BYTES:
        raise _UsageError(f"{path}: more than the {MAX_BYTES} bytes phasepath reads")
    try:
        data = json.loads(p.read_text(encoding="utf-8-sig"))
    except json.JSONDecodeError as exc:
        raise _UsageError(f"{path}:{exc.lineno}: not valid JSON: {exc.msg}") from None
    except UnicodeDecodeError:
        raise _UsageError(f"{path}: not UTF-8 text") from None
    if not isinstance(data, dict) or data.get("format") != RESULTS_FORMAT:
        raise _UsageError(
            f"{path}: not a phasepath results file (write one with "
            f"'phasepath analyze ROUTE_FILE --format json -o {path}')"
        )
    if data.get("version") != RESULTS_VERSION:
        raise _UsageError(
            f"{path}: results file version {data.get('version')!r}; this "
            f"phasepath reads version {RESULTS_VERSION}"
        )
    crossings = data.get("crossings")
    if not isinstance(crossings, list):
        raise _UsageError(f"{path}: field crossings: expected a list")
    need = ("step", "kind", "from_phase", "to_phase", "T", "p")
    for i, c in enumerate(crossings):
        if not isinstance(c, dict) or any(k not in c for k in need):
            raise _UsageError(
                f"{path}: field crossings[{i}]: expected a mapping with {', '.join(need)}"
            )
        for k in ("T", "p"):
            if not isinstance(c[k], (int, float)) or not math.isfinite(c[k]):
                raise _UsageError(f"{path}: field crossings[{i}].{k}: {c[k]!r} is not a number")
    return data


def _key(c: dict[str, Any]) -> tuple[Any, ...]:
    return (
        int(c["step"]),
        c["kind"],
        _phase(c["from_phase"], c.get("from_form")),
        _phase(c["to_phase"], c.get("to_form")),
    )


def _label(c: dict[str, Any]) -> str:
    step, kind, fr, to = _key(c)
    return f"leg {step} {kind} ({fr} -> {to})"


def compare_crossings(
    expected: list[dict[str, Any]],
    actual: list[dict[str, Any]],
    tol_T: float = _TOL_T,
    tol_p: float = _TOL_P,
    tol_latent: float = _TOL_L,
) -> list[dict[str, Any]]:
    """Differences between two lists of crossings (dicts with SI values), in route order.

    Crossings are paired by (leg, kind, phases) in route order. A pair *moved* when
    ``|ΔT| > tol_T`` [K], ``|Δp| > tol_p * |p_expected|`` or the latent heat changed by more than
    ``tol_latent`` relative (or became defined or undefined); it *changed* when only the boundary
    name differs. Unpaired crossings *appeared* or *disappeared*. Each difference is a dict with
    ``status`` in {"moved", "changed", "appeared", "disappeared"}, ``expected`` and ``actual``.
    """
    groups: dict[tuple[Any, ...], list[dict[str, Any]]] = {}
    for c in actual:
        groups.setdefault(_key(c), []).append(c)
    out: list[dict[str, Any]] = []
    used: set[int] = set()
    for e in expected:
        pool = groups.get(_key(e), [])
        a = pool.pop(0) if pool else None
        if a is None:
            out.append({"status": "disappeared", "expected": e, "actual": None, "order": e})
            continue
        used.add(id(a))
        reasons = []
        dT = a["T"] - e["T"]
        if abs(dT) > tol_T:
            reasons.append("T")
        if abs(a["p"] - e["p"]) > tol_p * abs(e["p"]):
            reasons.append("p")
        le, la = e.get("latent_heat"), a.get("latent_heat")
        if (le is None) != (la is None) or (
            le is not None and la is not None and abs(la - le) > tol_latent * abs(le)
        ):
            reasons.append("latent heat")
        if reasons:
            out.append(
                {"status": "moved", "expected": e, "actual": a, "reasons": reasons, "order": a}
            )
        elif e.get("boundary") != a.get("boundary"):
            out.append({"status": "changed", "expected": e, "actual": a, "order": a})
    for c in actual:
        if id(c) not in used:
            out.append({"status": "appeared", "expected": None, "actual": c, "order": c})
    out.sort(key=lambda d: (int(d["order"]["step"]), d["status"] == "appeared"))
    for d in out:
        del d["order"]
    return out


def _check(args: argparse.Namespace) -> int:
    route = load_route(args.route)
    expected_doc = _read_results(args.expected)
    report = route.analyze()
    actual = [asdict(c) for c in report.crossings]
    expected = expected_doc["crossings"]
    T_unit, p_unit, e_unit = _units(args.units)
    diffs = compare_crossings(expected, actual, args.tol_T, args.tol_p, args.tol_latent)
    sub_changed = expected_doc.get("substance") not in (None, report.substance.name)

    def T(x: float) -> str:
        return f"{convert(x, 'K', T_unit, 'temperature'):.8g} {UNIT_LABELS[T_unit]}"

    def P(x: float) -> str:
        return f"{convert(x, 'Pa', p_unit, 'pressure'):.8g} {UNIT_LABELS[p_unit]}"

    def L(x: float | None) -> str:
        return (
            "none"
            if x is None
            else (f"{convert(x, 'J/kg', e_unit, 'energy'):.6g} {UNIT_LABELS[e_unit]}")
        )

    print(f"phasepath check: {args.route} against {args.expected}")
    print(
        f"tolerances: T {args.tol_T:g} K, p {args.tol_p:g} relative, latent heat "
        f"{args.tol_latent:g} relative"
    )
    if sub_changed:
        print(
            f"  ! substance: expected {expected_doc.get('substance')}, "
            f"route is {report.substance.name}"
        )
    for d in diffs:
        e, a = d["expected"], d["actual"]
        if d["status"] == "moved":
            parts = []
            if "T" in d["reasons"]:
                parts.append(f"T {T(e['T'])} -> {T(a['T'])} (change {a['T'] - e['T']:+.4g} K)")
            if "p" in d["reasons"]:
                parts.append(
                    f"p {P(e['p'])} -> {P(a['p'])} "
                    f"(change {(a['p'] - e['p']) / e['p']:+.3g} relative)"
                )
            if "latent heat" in d["reasons"]:
                parts.append(f"latent heat {L(e.get('latent_heat'))} -> {L(a.get('latent_heat'))}")
            print(f"  ~ MOVED       {_label(e)}: " + "; ".join(parts))
        elif d["status"] == "changed":
            print(
                f"  ~ CHANGED     {_label(e)}: boundary {e.get('boundary')!r} -> "
                f"{a.get('boundary')!r}"
            )
        elif d["status"] == "appeared":
            print(f"  + APPEARED    {_label(a)} at T = {T(a['T'])}, p = {P(a['p'])}")
        else:
            print(f"  - DISAPPEARED {_label(e)} (expected at T = {T(e['T'])}, p = {P(e['p'])})")
    if diffs or sub_changed:
        counts: dict[str, int] = {}
        for d in diffs:
            counts[d["status"]] = counts.get(d["status"], 0) + 1
        summary = ", ".join(f"{n} {s}" for s, n in counts.items()) or "substance changed"
        print(f"FAILED: {summary} ({len(expected)} crossings expected, {len(actual)} found)")
        print(f"phasepath check FAILED for {args.route}: {summary}", file=sys.stderr)
        return 1
    print(f"OK: all {len(expected)} crossings match within the tolerances")
    return 0


# -- diagram -----------------------------------------------------------------------------------
_COLOURS = {"vaporization": "#1d6a8a", "melting": "#b4512f", "sublimation": "#6b4e9b"}


def _linear(from_unit: str, to_unit: str, dimension: str) -> tuple[float, float]:
    a = convert(0.0, from_unit, to_unit, dimension)
    return a, convert(1.0, from_unit, to_unit, dimension) - a


def _diagram(args: argparse.Namespace) -> int:
    from .substances import substance

    out = Path(args.output)
    fmt = out.suffix.lower().lstrip(".")
    if fmt not in ("svg", "png"):
        raise _UsageError(f"-o {args.output!r}: the diagram is written as .svg or .png")
    try:
        import matplotlib

        matplotlib.use("Agg", force=True)
        import matplotlib.pyplot as plt
    except ImportError:
        raise _UsageError("the diagram needs matplotlib: pip install 'phasepath[plot]'") from None
    sub = substance(args.substance)
    route = load_route(args.route) if args.route else None
    if route is not None and route.substance is not sub:
        raise _UsageError(
            f"the route in {args.route} is for {route.substance.name}, not {sub.name}"
        )
    report = route.analyze() if route is not None and route.legs else None
    T_unit, p_unit, _ = _units(args.units)
    tA, tB = _linear("K", T_unit, "temperature")
    pA, pB = _linear("Pa", p_unit, "pressure")

    T_t, p_t = sub.triple
    T_c, p_c = sub.critical
    T_lo, T_hi = sub.T_min, max(1.2 * T_c, T_c + 40.0)
    p_lo, p_hi = max(min(p_t / 50.0, p_t), 1.0), 20.0 * p_c
    if sub.sublimation is not None:
        p_lo = max(sub.sublimation.p_of_T(sub.sublimation.T_min), 1e-3)
    if route is not None:
        Ts = [T for T, _ in route.corners()]
        ps = [p for _, p in route.corners()]
        T_lo, T_hi = min(T_lo, min(Ts) - 5.0), max(T_hi, max(Ts) + 5.0)
        p_lo, p_hi = min(p_lo, min(ps) / 3.0), max(p_hi, max(ps) * 3.0)
    T_lo = max(T_lo, sub.T_min)

    plt.rcParams["svg.hashsalt"] = "phasepath"
    fig, ax = plt.subplots(figsize=(7.5, 5.2), dpi=120)
    try:
        drawn = set()
        for b in sub.boundaries:
            T, p = b.curve(p_lo, p_hi)
            keep = (T >= T_lo) & (T <= T_hi)
            if keep.sum() < 2:
                continue
            label = b.kind if b.kind not in drawn else None
            drawn.add(b.kind)
            ax.plot(
                tA + tB * T[keep],
                pA + pB * p[keep],
                color=_COLOURS[b.kind],
                lw=1.8,
                ls="-" if b.reliable else "--",
                label=label,
            )
        ax.plot(
            [tA + tB * T_t],
            [pA + pB * p_t],
            marker="o",
            ms=6,
            mfc="white",
            mec="#222222",
            ls="none",
            label="triple point",
        )
        if T_c <= T_hi:
            ax.plot(
                [tA + tB * T_c],
                [pA + pB * p_c],
                marker="s",
                ms=6,
                mfc="white",
                mec="#222222",
                ls="none",
                label="critical point",
            )
        if route is not None:
            cs = route.corners()
            xs = [tA + tB * T for T, _ in cs]
            ys = [pA + pB * p for _, p in cs]
            ax.plot(xs, ys, color="#111111", lw=1.4, label="route")
            for i in range(len(cs) - 1):
                ax.annotate(
                    "",
                    xy=(xs[i + 1], ys[i + 1]),
                    xytext=(xs[i], ys[i]),
                    arrowprops={"arrowstyle": "-|>", "color": "#111111", "lw": 1.2},
                )
            for i, (x, y) in enumerate(zip(xs, ys, strict=True)):
                ax.annotate(str(i), (x, y), textcoords="offset points", xytext=(5, 5), fontsize=8)
            if report is not None and report.crossings:
                cx = [tA + tB * c.T for c in report.crossings]
                cy = [pA + pB * c.p for c in report.crossings]
                ax.plot(
                    cx,
                    cy,
                    marker="D",
                    ms=6,
                    mfc="#f2c14e",
                    mec="#111111",
                    ls="none",
                    label="crossing",
                )
        ax.set_yscale("log")
        ax.set_xlim(tA + tB * T_lo, tA + tB * T_hi)
        ax.set_ylim(pA + pB * p_lo, pA + pB * p_hi)
        ax.set_xlabel(f"temperature [{UNIT_LABELS[T_unit]}]")
        ax.set_ylabel(f"pressure [{UNIT_LABELS[p_unit]}]")
        title = args.title or (
            route.title if route is not None and route.title else f"{sub.name}: phase diagram"
        )
        ax.set_title(title, fontsize=11)
        ax.grid(True, which="major", color="#dddddd", lw=0.6)
        ax.legend(loc="lower right", fontsize=8, frameon=False)
        fig.tight_layout()
        meta = {"Date": None} if fmt == "svg" else {"Software": None}
        fig.savefig(out, format=fmt, metadata=meta)
    finally:
        plt.close(fig)
    print(f"wrote {out}")
    return 0


if __name__ == "__main__":  # pragma: no cover
    sys.exit(main())
