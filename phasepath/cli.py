"""The ``phasepath`` command line: analyse a route file, check it against saved results,
compare two plans, write the HTML report, draw.

::

    phasepath analyze ROUTE_FILE [--format table|csv|json] [--units degC,bar,kJ/kg] [-o FILE]
    phasepath check ROUTE_FILE EXPECTED_FILE [TOLERANCES] [--only crossings,legs,hazards]
    phasepath diff PLAN_A PLAN_B [TOLERANCES] [--only ...] [--format text|html] [-o FILE]
    phasepath report ROUTE_FILE -o FILE.html [--units degC,bar,kJ/kg] [--title TEXT]
    phasepath diagram SUBSTANCE -o FILE.svg|FILE.png [--route ROUTE_FILE] [--units degC,bar]

    TOLERANCES: [--tol-T K] [--tol-p REL] [--tol-latent REL] [--tol-energy REL]
                [--tol-energy-abs J/kg] [--tol-fraction ABS]

This module reads the arguments and hands them on: the tables come from
:mod:`phasepath.tables`, results files from :mod:`phasepath.results`, the comparison of two sets
of results from :mod:`phasepath.comparison`, the report from :mod:`phasepath.htmlreport`, the
figures from :mod:`phasepath.plot`. Exit status: 0 all well, 1 ``check`` or ``diff`` found a
difference, 2 bad input (one line on stderr, never a traceback).
"""

from __future__ import annotations

import argparse
import math
import sys
from collections.abc import Sequence
from pathlib import Path
from typing import Any, NoReturn

from . import comparison, fileio, plot, results, tables
from .catalog import substance
from .errors import PhasePathError, UnitError
from .format import DisplayUnits
from .routefile import load_route
from .units import ENERGY_UNITS, PRESSURE_UNITS, TEMPERATURE_UNITS
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
        description="Re-analyse ROUTE_FILE and compare it with EXPECTED_FILE (written by "
        "'phasepath analyze --format json'): the crossings, each leg's end state (T, p, phase, "
        "ice form, vapor and solid fraction), heat and work, and the hazard flags. Exit status "
        "1 if anything moved beyond the tolerances, appeared or disappeared.",
    )
    c.add_argument("route", metavar="ROUTE_FILE")
    c.add_argument("expected", metavar="EXPECTED_FILE")
    _comparison_options(c)
    c.add_argument("--units", default=None, help=units_help)
    c.set_defaults(run=_check)

    f = sub.add_parser(
        "diff",
        help="compare plan B with plan A",
        description="Analyse two route files and print what differs in B from A: crossings "
        "moved, appeared or disappeared, legs whose end state, fractions, heat or work changed, "
        "hazards gained or lost. Exit status 1 if the plans differ beyond the tolerances, 0 if "
        "they agree.",
    )
    f.add_argument("plan_a", metavar="PLAN_A", help="route file of plan A")
    f.add_argument("plan_b", metavar="PLAN_B", help="route file of plan B")
    _comparison_options(f)
    f.add_argument("--units", default=None, help=units_help)
    f.add_argument(
        "--format",
        choices=("text", "html"),
        default="text",
        help="text (default) or html: the side-by-side report (both plans on one diagram, the "
        "differences, each plan's tables; needs -o)",
    )
    f.add_argument("-o", "--output", default=None, help="write to FILE instead of the screen")
    f.set_defaults(run=_diff)

    r = sub.add_parser(
        "report",
        help="write the HTML report of a route",
        description="Analyse ROUTE_FILE and write its review-ready report: one self-contained "
        "HTML file (diagram, crossings and legs tables, hazard flags and cautions, models and "
        "sources, versions, the route file's SHA-256, date and time) that prints cleanly on "
        "A4 or Letter. The diagram needs matplotlib: pip install 'phasepath[plot]'.",
    )
    r.add_argument("route", metavar="ROUTE_FILE")
    r.add_argument("-o", "--output", required=True, metavar="FILE", help="output file, .html")
    r.add_argument("--units", default=None, help=units_help)
    r.add_argument("--title", default=None, help="report title (default: the route's title)")
    r.set_defaults(run=_report)

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


#: (flag, Tolerances field, metavar, what it bounds)
_TOLERANCES = (
    ("--tol-T", "T", "KELVIN", "change of a temperature (crossings, leg ends) [K]"),
    ("--tol-p", "p", "REL", "relative change of a pressure (crossings, leg ends)"),
    ("--tol-latent", "latent", "REL", "relative change of a latent heat"),
    ("--tol-energy", "energy", "REL", "relative change of a leg's heat or work"),
    ("--tol-energy-abs", "energy_abs", "J/KG", "change of a leg's heat or work [J/kg]"),
    ("--tol-fraction", "fraction", "ABS", "change of a vapor or solid mass fraction"),
)


def _comparison_options(p: argparse.ArgumentParser) -> None:
    defaults = comparison.Tolerances()
    for flag, name, meta, what in _TOLERANCES:
        default = getattr(defaults, name)
        p.add_argument(
            flag,
            dest=f"tol_{name}",
            type=_tolerance,
            default=default,
            metavar=meta,
            help=f"largest allowed {what} (default {default:g})",
        )
    p.add_argument(
        "--only",
        type=_only,
        default=comparison.SCOPES,
        metavar="WHAT",
        help="compare only some of: crossings, legs (end states, fractions, heat, work), "
        "hazards; comma-separated (default: all; '--only crossings' compares crossings alone)",
    )


def _only(text: str) -> tuple[str, ...]:
    chosen = tuple(t.strip() for t in text.split(",") if t.strip())
    bad = [t for t in chosen if t not in comparison.SCOPES]
    if bad or not chosen:
        raise argparse.ArgumentTypeError(
            f"{text!r}: choose from {', '.join(comparison.SCOPES)} (comma-separated)"
        )
    return chosen


def _tolerances(args: argparse.Namespace) -> comparison.Tolerances:
    return comparison.Tolerances(
        **{name: getattr(args, f"tol_{name}") for _, name, _, _ in _TOLERANCES}
    )


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
    expected = results.read(args.expected)
    report = route.analyze()
    actual = results.document(report)
    units = _units(args.units)
    tol = _tolerances(args)
    diffs = comparison.compare_documents(expected, actual, tol, args.only)
    versions = comparison.version_changes(expected, actual)
    print(f"phasepath check: {args.route} against {args.expected}")
    print(f"tolerances: {tol.describe()}")
    if tuple(args.only) != comparison.SCOPES:
        print(f"compared: {', '.join(args.only)} only")
    for name, old, new in versions:
        why = (
            "the property data may have changed: a reason to re-baseline once the differences "
            "are understood"
            if name == "CoolProp"
            else "phasepath's models or rules may have changed"
        )
        print(f"  ! VERSION {name}: expected file from {old}, this run {new} ({why})")
    for d in diffs:
        print("  " + comparison.describe(d, units, tol))
    what = _counts(expected, args.only)
    if diffs:
        found = f"{_counts(actual, args.only)} found"
        cause = ""
        if versions:
            changed = ", ".join(f"{n} {o} -> {w}" for n, o, w in versions)
            cause = f"; versions changed ({changed}): re-baseline if the differences are expected"
        summary = comparison.summary(diffs)
        print(f"FAILED: {summary} ({what} expected, {found}){cause}")
        print(f"phasepath check FAILED for {args.route}: {summary}{cause}", file=sys.stderr)
        return 1
    if tuple(args.only) == ("crossings",):
        print(f"OK: all {what} match within the tolerances")
    else:
        print(f"OK: {what} match within the tolerances")
    return 0


def _counted(n: int, noun: str) -> str:
    return f"{n} {noun}{'s' if n != 1 else ''}"


def _counts(doc: dict[str, Any], only: Sequence[str]) -> str:
    """Counts in words, e.g. 3 crossings and 2 legs (the crossings alone when only they are
    compared)."""
    text = _counted(len(doc["crossings"]), "crossing")
    if tuple(only) != ("crossings",):
        text += f" and {_counted(len(doc['legs']), 'leg')}"
    return text


def _diff(args: argparse.Namespace) -> int:
    if args.format == "html" and not args.output:
        raise _UsageError("--format html writes a file: give -o FILE.html")
    _refuse_overwrite(args.output, [args.plan_a, args.plan_b])
    route_a, route_b = load_route(args.plan_a), load_route(args.plan_b)
    units = _units(args.units)
    cmp = comparison.compare(
        route_a, route_b, tolerances=_tolerances(args), only=args.only, labels=("A", "B")
    )
    if args.format == "html":
        fileio.write_text(args.output, cmp.to_html(units), _UsageError)
        print(f"wrote {args.output}")
        print(
            "AGREE: the plans match within the tolerances"
            if cmp.agree
            else f"DIFFER: {comparison.summary(cmp.differences)}"
        )
    else:
        _write(args.output, cmp.text(units))
    return 0 if cmp.agree else 1


def _report(args: argparse.Namespace) -> int:
    _refuse_overwrite(args.output, [args.route])
    route = load_route(args.route)
    units = _units(args.units)
    report = route.analyze()
    text = report.to_html(units.T, units.p, units.energy, title=args.title, route_file=args.route)
    fileio.write_text(args.output, text, _UsageError)
    print(f"wrote {args.output}")
    return 0


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
