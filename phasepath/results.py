"""Results files: the analysed route as plain data (SI, full precision), read back with checks,
and the comparison of a re-analysis with them (``phasepath check``).

A *phasepath results file* is JSON: ``format`` ("phasepath results"), ``version``, the versions of
phasepath and of the property library that produced it, the substance, the route as written,
every crossing and every leg (without the sampled path), the notes and the cautions.
"""

from __future__ import annotations

import json
import math
from dataclasses import asdict
from typing import TYPE_CHECKING, Any

from . import fileio
from .eos import library_version
from .errors import ResultsFileError
from .records import phase_text
from .routefile import dumps_route
from .version import __version__

if TYPE_CHECKING:  # pragma: no cover
    from .report import Report

__all__ = [
    "document",
    "dumps",
    "read",
    "compare_crossings",
    "FORMAT",
    "VERSION",
    "TOL_T",
    "TOL_P",
    "TOL_LATENT",
]

#: The ``format`` field of a results file.
FORMAT = "phasepath results"
#: The version of the results file format this phasepath writes and reads.
VERSION = 1
#: Default tolerances of a comparison: absolute in T [K], relative in p and latent heat.
TOL_T = 0.01
TOL_P = 1e-4
TOL_LATENT = 1e-3

_NEED = ("step", "kind", "from_phase", "to_phase", "T", "p")


def document(report: Report) -> dict[str, Any]:
    """The results of an analysed route as plain data (SI units, full precision)."""
    return {
        "format": FORMAT,
        "version": VERSION,
        "phasepath": __version__,
        "coolprop": library_version(),
        "substance": report.substance.name,
        "route": json.loads(dumps_route(report.route, "json")),
        "crossings": [asdict(c) for c in report.crossings],
        "legs": [_leg(leg) for leg in report.legs],
        "notes": list(report.notes),
        "cautions": list(report.cautions),
    }


def dumps(report: Report) -> str:
    """The text of a results file."""
    return json.dumps(document(report), indent=2, ensure_ascii=False, allow_nan=False) + "\n"


def _leg(leg: Any) -> dict[str, Any]:
    d = asdict(leg)
    d.pop("path", None)  # the sampled states along the leg: bulky, and not part of the plan
    return d


def read(path: object) -> dict[str, Any]:
    """A results file, checked: its format and version, and every crossing's fields."""
    name = fileio.path_text(path, ResultsFileError)
    raw = fileio.read_bytes(name, fileio.MAX_BYTES, ResultsFileError)
    try:
        data = json.loads(raw.decode("utf-8-sig"))
    except json.JSONDecodeError as exc:
        raise ResultsFileError(f"not valid JSON: {exc.msg}", source=name, line=exc.lineno) from None
    except UnicodeDecodeError:
        raise ResultsFileError("not UTF-8 text", source=name) from None
    except (ValueError, RecursionError) as exc:
        raise ResultsFileError(f"not a valid results file: {str(exc)[:120]}", source=name) from None
    if not isinstance(data, dict) or data.get("format") != FORMAT:
        raise ResultsFileError(
            f"not a phasepath results file (write one with "
            f"'phasepath analyze ROUTE_FILE --format json -o {name}')",
            source=name,
        )
    if data.get("version") != VERSION:
        raise ResultsFileError(
            f"results file version {data.get('version')!r}; this phasepath reads version {VERSION}",
            source=name,
        )
    crossings = data.get("crossings")
    if not isinstance(crossings, list):
        raise ResultsFileError("expected a list", source=name, field="crossings")
    for i, c in enumerate(crossings):
        if not isinstance(c, dict) or any(k not in c for k in _NEED):
            raise ResultsFileError(
                f"expected a mapping with {', '.join(_NEED)}", source=name, field=f"crossings[{i}]"
            )
        for k in ("T", "p"):
            if not isinstance(c[k], (int, float)) or not math.isfinite(c[k]):
                raise ResultsFileError(
                    f"{c[k]!r} is not a number", source=name, field=f"crossings[{i}].{k}"
                )
    return data


def _key(c: dict[str, Any]) -> tuple[Any, ...]:
    return (
        int(c["step"]),
        c["kind"],
        phase_text(c["from_phase"], c.get("from_form")),
        phase_text(c["to_phase"], c.get("to_form")),
    )


def label(c: dict[str, Any]) -> str:
    """A crossing in words: "leg 2 vaporization (liquid -> vapor)"."""
    step, kind, fr, to = _key(c)
    return f"leg {step} {kind} ({fr} -> {to})"


def compare_crossings(
    expected: list[dict[str, Any]],
    actual: list[dict[str, Any]],
    tol_T: float = TOL_T,
    tol_p: float = TOL_P,
    tol_latent: float = TOL_LATENT,
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
        if abs(a["T"] - e["T"]) > tol_T:
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
