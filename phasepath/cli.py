"""The ``phasepath`` command line: analyse a route file, check it against saved results, draw.

::

    phasepath analyze ROUTE_FILE [--format table|csv|json] [--units degC,bar,kJ/kg] [-o FILE]
    phasepath check ROUTE_FILE EXPECTED_FILE [--tol-T K] [--tol-p REL] [--tol-latent REL]
    phasepath diagram SUBSTANCE -o FILE.svg|FILE.png [--route ROUTE_FILE] [--units degC,bar]

This module reads the arguments and hands them on: the tables come from
:mod:`phasepath.tables`, results files and their comparison from :mod:`phasepath.results`, the
figure from :mod:`phasepath.plot`. Exit status: 0 all well, 1 ``check`` found a difference, 2 bad
input (one line on stderr, never a traceback).
"""

from __future__ import annotations

import argparse
import math
import sys
from collections.abc import Sequence
from dataclasses import asdict
from pathlib import Path
from typing import Any, NoReturn

from . import fileio, plot, results, tables
from .catalog import substance
from .errors import PhasePathError, UnitError
from .format import UNIT_LABELS, DisplayUnits
from .routefile import load_route
from .units import ENERGY_UNITS, PRESSURE_UNITS, TEMPERATURE_UNITS, convert
from .version import __version__

__all__ = ["main"]

_DEFAULT_UNITS = ("degC", "bar", "kJ/kg")


class _UsageError(PhasePathError):
    """Bad command-line input that is not about a route (a file, an option)."""


class _Parser(argparse.ArgumentParser):
    """argparse that reports a usage error as one line, like every other error."""

    def error(self, message: str) -> NoReturn:
        raise _UsageError(f"{self.prog}: {message} (see '{self.prog} --help')")


# -- entry point -------------------------------------------------------------------------------
def main(argv: list[str] | None = None) -> int:
    """Run the command line; returns the exit status (0 ok, 1 check failed, 2 bad input)."""
    try:
        parser = _parser()
        args = parser.parse_args(argv)
        if args.command is None:
            parser.print_help(sys.stderr)
            return 2
        status: int = args.run(args)
        return status
    except PhasePathError as exc:
        _fail(str(exc))
    except KeyboardInterrupt:
        print("phasepath: interrupted", file=sys.stderr)
        return 130
    except Exception as exc:  # noqa: BLE001 - the user gets one line, never a traceback
        _fail(f"internal error ({type(exc).__name__}: {exc}); please report it with the route file")
    return 2


def _fail(msg: str) -> None:
    print(f"phasepath: error: {msg}", file=sys.stderr)


def _parser() -> argparse.ArgumentParser:
    units_help = (
        "display units, comma-separated, any order: one of each of "
        f"{'/'.join(TEMPERATURE_UNITS)}, {'/'.join(PRESSURE_UNITS)}, "
        f"{'/'.join(ENERGY_UNITS)} (default {','.join(_DEFAULT_UNITS)})"
    )
    p = _Parser(
        prog="phasepath",
        description="Plan compression and heating routes of a pure substance on its phase "
        "diagram: every phase-boundary crossing, its T and p, and the heat per leg.",
    )
    p.add_argument("--version", action="version", version=f"phasepath {__version__}")
    sub = p.add_subparsers(dest="command", metavar="COMMAND", parser_class=_Parser)

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
        description="Re-analyse ROUTE_FILE and compare its crossings with EXPECTED_FILE "
        "(written by 'phasepath analyze --format json'). Exit status 1 if a crossing moved "
        "beyond the tolerances, appeared or disappeared.",
    )
    c.add_argument("route", metavar="ROUTE_FILE")
    c.add_argument("expected", metavar="EXPECTED_FILE")
    for flag, default, meta, what in (
        ("--tol-T", results.TOL_T, "KELVIN", "change of a crossing temperature [K]"),
        ("--tol-p", results.TOL_P, "REL", "relative change of a crossing pressure"),
        ("--tol-latent", results.TOL_LATENT, "REL", "relative change of a latent heat"),
    ):
        c.add_argument(
            flag,
            type=_tolerance,
            default=default,
            metavar=meta,
            help=f"largest allowed {what} (default {default:g})",
        )
    c.add_argument("--units", default=None, help=units_help)
    c.set_defaults(run=_check)

    d = sub.add_parser(
        "diagram",
        help="draw the phase diagram (and a route) to SVG or PNG",
        description="Draw the phase diagram of SUBSTANCE, with a route if one is given, to an "
        "SVG or PNG file (needs matplotlib: pip install 'phasepath[plot]').",
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


def _tolerance(text: str) -> float:
    try:
        x = float(text)
    except ValueError:
        raise argparse.ArgumentTypeError(f"{text!r} is not a number") from None
    if not math.isfinite(x) or x < 0:
        raise argparse.ArgumentTypeError(f"{text!r} is not a finite number >= 0")
    return x


def _units(text: str | None) -> DisplayUnits:
    """Display units from "degC,bar" (any order, any subset; the rest default)."""
    chosen: list[str | None] = [None, None, None]
    for token in (t.strip() for t in (text or "").split(",")):
        if not token:
            continue
        for slot, options in enumerate((TEMPERATURE_UNITS, PRESSURE_UNITS, ENERGY_UNITS)):
            match = next((u for u in options if u.lower() == token.lower()), None)
            if match:
                if chosen[slot] is not None:
                    raise UnitError(f"--units {text!r}: two units for the same quantity")
                chosen[slot] = match
                break
        else:
            raise UnitError(
                f"--units {text!r}: unknown display unit {token!r}; choose from "
                f"{', '.join(TEMPERATURE_UNITS + PRESSURE_UNITS + ENERGY_UNITS)}"
            )
    return DisplayUnits(*(c or d for c, d in zip(chosen, _DEFAULT_UNITS, strict=True)))


def _refuse_overwrite(output: str | None, inputs: Sequence[str]) -> None:
    if output is None:
        return
    for path in inputs:
        if fileio.same_file(output, path):
            raise _UsageError(f"-o {output!r} is one of the command's inputs: choose another file")


def _write(output: str | None, text: str) -> None:
    if output:
        fileio.write_text(output, text, _UsageError)
    else:
        sys.stdout.write(text)


# -- the commands --------------------------------------------------------------------------------
def _analyze(args: argparse.Namespace) -> int:
    _refuse_overwrite(args.output, [args.route])
    route = load_route(args.route)
    report = route.analyze()
    units = _units(args.units)
    if args.format == "json":
        text = results.dumps(report)
    elif args.format == "csv":
        columns, rows = (
            (tables.LEGS, report.legs) if args.legs else (tables.CROSSINGS, report.crossings)
        )
        text = tables.csv_table(columns, rows, units)
    else:
        text = tables.format_report(report, units.T, units.p, units.energy)
    _write(args.output, text)
    return 0


def _check(args: argparse.Namespace) -> int:
    route = load_route(args.route)
    expected_doc = results.read(args.expected)
    report = route.analyze()
    actual = [asdict(c) for c in report.crossings]
    expected = expected_doc["crossings"]
    units = _units(args.units)
    diffs = results.compare_crossings(expected, actual, args.tol_T, args.tol_p, args.tol_latent)
    sub_changed = expected_doc.get("substance") not in (None, report.substance.name)
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
        print("  " + _diff_line(d, units))
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


def _diff_line(d: dict[str, Any], units: DisplayUnits) -> str:
    def T(x: float) -> str:
        return f"{convert(x, 'K', units.T, 'temperature'):.8g} {UNIT_LABELS[units.T]}"

    def P(x: float) -> str:
        return f"{convert(x, 'Pa', units.p, 'pressure'):.8g} {UNIT_LABELS[units.p]}"

    def L(x: float | None) -> str:
        if x is None:
            return "none"
        return f"{convert(x, 'J/kg', units.energy, 'energy'):.6g} {UNIT_LABELS[units.energy]}"

    e, a = d["expected"], d["actual"]
    if d["status"] == "moved":
        parts = []
        if "T" in d["reasons"]:
            parts.append(f"T {T(e['T'])} -> {T(a['T'])} (change {a['T'] - e['T']:+.4g} K)")
        if "p" in d["reasons"]:
            parts.append(
                f"p {P(e['p'])} -> {P(a['p'])} (change {(a['p'] - e['p']) / e['p']:+.3g} relative)"
            )
        if "latent heat" in d["reasons"]:
            parts.append(f"latent heat {L(e.get('latent_heat'))} -> {L(a.get('latent_heat'))}")
        return f"~ MOVED       {results.label(e)}: " + "; ".join(parts)
    if d["status"] == "changed":
        return (
            f"~ CHANGED     {results.label(e)}: boundary {e.get('boundary')!r} -> "
            f"{a.get('boundary')!r}"
        )
    if d["status"] == "appeared":
        return f"+ APPEARED    {results.label(a)} at T = {T(a['T'])}, p = {P(a['p'])}"
    return f"- DISAPPEARED {results.label(e)} (expected at T = {T(e['T'])}, p = {P(e['p'])})"


def _diagram(args: argparse.Namespace) -> int:
    out = Path(fileio.path_text(args.output, _UsageError))
    fmt = out.suffix.lower().lstrip(".")
    if fmt not in ("svg", "png"):
        raise _UsageError(f"-o {args.output!r}: the diagram is written as .svg or .png")
    if args.route:
        _refuse_overwrite(args.output, [args.route])
    sub = substance(args.substance)
    route = load_route(args.route) if args.route else None
    if route is not None and route.substance is not sub:
        raise _UsageError(
            f"the route in {args.route} is for {route.substance.name}, not {sub.name}"
        )
    report = route.analyze() if route is not None and route.legs else None
    units = _units(args.units)
    data = plot.diagram_bytes(sub, fmt, route, report, units, args.title)
    fileio.write_bytes(out, data, _UsageError)
    print(f"wrote {out}")
    return 0


if __name__ == "__main__":  # pragma: no cover
    sys.exit(main())
