"""Results files: the analysed route as plain data (SI, full precision), read back with checks,
and the pairing of crossings that ``phasepath check`` and ``phasepath diff`` build on.

A *phasepath results file* is JSON: ``format`` ("phasepath results"), ``version``, the versions of
phasepath and of the property library (CoolProp) that produced it, the substance, the route as
written, every crossing and every leg (without the sampled path), the notes and the cautions. The
format is described by the JSON Schema ``phasepath/data/results.schema.json`` (:func:`schema`),
and :func:`read` checks a file against that schema, so the file and its description cannot drift
apart: a wrong type, a missing or unknown field, a pressure at or below zero, a non-finite number
or an absurdly long integer is refused with an error naming the field.

>>> import phasepath as pp
>>> doc = document(pp.Route("water", T="20 degC", p="1 atm").isobar(T="120 degC").analyze())
>>> doc["format"], doc["version"], [c["kind"] for c in doc["crossings"]]
('phasepath results', 2, ['vaporization'])
>>> validate(doc)
>>> doc["legs"][0]["end"]["p"] = -1.0
>>> validate(doc)
Traceback (most recent call last):
...
phasepath.errors.ResultsFileError: legs[0].end.p: -1.0 is not above 0 (pressure [Pa])
"""

from __future__ import annotations

import json
import math
from dataclasses import asdict
from functools import lru_cache
from pathlib import Path
from typing import TYPE_CHECKING, Any

from . import fileio
from .eos import library_version
from .errors import ResultsFileError, shown
from .records import phase_text
from .routefile import dumps_route
from .version import __version__

if TYPE_CHECKING:  # pragma: no cover
    from .report import Report

__all__ = [
    "document",
    "dumps",
    "read",
    "loads",
    "validate",
    "schema",
    "compare_crossings",
    "label",
    "FORMAT",
    "VERSION",
    "TOL_T",
    "TOL_P",
    "TOL_LATENT",
]

#: The ``format`` field of a results file.
FORMAT = "phasepath results"
#: The version of the results file format this phasepath writes and reads (1: before the schema,
#: without the property-library version and the cautions).
VERSION = 2
#: Default tolerances of a crossing comparison: absolute in T [K], relative in p and latent heat.
TOL_T = 0.01
TOL_P = 1e-4
TOL_LATENT = 1e-3

_SCHEMA_PATH = Path(__file__).parent / "data" / "results.schema.json"
_LONGEST_INT = 20  # digits: longer integers in a results file are refused unread


def document(report: Report) -> dict[str, Any]:
    """The results of an analysed route as plain JSON data (SI units, full precision)."""
    doc = {
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
    plain: dict[str, Any] = json.loads(json.dumps(doc, allow_nan=False))  # tuples become lists
    return plain


def dumps(report: Report) -> str:
    """The text of a results file."""
    return json.dumps(document(report), indent=2, ensure_ascii=False, allow_nan=False) + "\n"


def _leg(leg: Any) -> dict[str, Any]:
    d = asdict(leg)
    d.pop("path", None)  # the sampled states along the leg: bulky, and not part of the plan
    return d


# -- reading -------------------------------------------------------------------------------------
def read(path: object) -> dict[str, Any]:
    """A results file, checked against its schema (see :func:`loads`)."""
    name = fileio.path_text(path, ResultsFileError)
    raw = fileio.read_bytes(name, fileio.MAX_BYTES, ResultsFileError)
    try:
        text = raw.decode("utf-8-sig")
    except UnicodeDecodeError:
        raise ResultsFileError("not UTF-8 text", source=name) from None
    return loads(text, source=name)


def loads(text: str, source: str = "<text>") -> dict[str, Any]:
    """A results document from its text: JSON, the right ``format``, a version this phasepath
    reads, and every field as the schema says; else a :class:`ResultsFileError` naming the field.
    """

    def no_duplicates(pairs: list[tuple[str, Any]]) -> dict[str, Any]:
        out: dict[str, Any] = {}
        for k, v in pairs:
            if k in out:
                raise ResultsFileError(f"the key {k!r} appears twice in one object", source=source)
            out[k] = v
        return out

    try:
        data = json.loads(
            text,
            parse_int=_parse_int,
            parse_float=_parse_float,
            parse_constant=_NonFinite,
            object_pairs_hook=no_duplicates,
        )
    except json.JSONDecodeError as exc:
        raise ResultsFileError(
            f"not valid JSON: {exc.msg}", source=source, line=exc.lineno
        ) from None
    except ResultsFileError:
        raise
    except (ValueError, RecursionError) as exc:
        raise ResultsFileError(
            f"not a valid results file: {str(exc)[:120]}", source=source
        ) from None
    if not isinstance(data, dict) or data.get("format") != FORMAT:
        raise ResultsFileError(
            f"not a phasepath results file (write one with "
            f"'phasepath analyze ROUTE_FILE --format json -o {source}')",
            source=source,
        )
    version = data.get("version")
    if not isinstance(version, int) or isinstance(version, bool):
        raise ResultsFileError(
            f"{shown(version)} is not a format version (a whole number)",
            source=source,
            field="version",
        )
    if version > VERSION:
        raise ResultsFileError(
            f"results file version {version} is newer than this phasepath {__version__} reads "
            f"(version {VERSION}): upgrade phasepath to check against it",
            source=source,
        )
    if version < VERSION:
        raise ResultsFileError(
            f"results file version {version} (written by phasepath "
            f"{data.get('phasepath', 'of an older version')}) is older than this phasepath reads "
            f"(version {VERSION}, which records the property-data version): write it again with "
            f"'phasepath analyze ROUTE_FILE --format json -o {source}' after reviewing the plan",
            source=source,
        )
    validate(data, source)
    return data


class _NonFinite:
    """A NaN or an infinity found in the text: kept as a marker, refused by :func:`validate`
    with the field it is in."""

    def __init__(self, text: str) -> None:
        self.text = text

    def __repr__(self) -> str:
        return self.text


class _LongInt:
    """An integer with more digits than any results file holds, kept unconverted."""

    def __init__(self, text: str) -> None:
        self.digits = len(text.lstrip("-"))

    def __repr__(self) -> str:
        return f"<an integer of {self.digits} digits>"


def _parse_int(text: str) -> int | _LongInt:
    return _LongInt(text) if len(text.lstrip("-")) > _LONGEST_INT else int(text)


def _parse_float(text: str) -> float | _NonFinite:
    x = float(text)
    return x if math.isfinite(x) else _NonFinite(text)


# -- the schema ------------------------------------------------------------------------------------
@lru_cache(maxsize=1)
def _schema_text() -> str:
    return _SCHEMA_PATH.read_text(encoding="utf-8")


def schema() -> dict[str, Any]:
    """The JSON Schema of results files (a fresh copy)."""
    result: dict[str, Any] = json.loads(_schema_text())
    return result


def validate(data: Any, source: str | None = None) -> None:
    """Check a results document against :func:`schema`; a :class:`ResultsFileError` names the
    first field that does not fit.

    The checker reads the keywords the schema uses (``type``, ``const``, ``enum``,
    ``properties``, ``required``, ``additionalProperties``, ``items``, ``minimum``,
    ``exclusiveMinimum``, ``minLength``, ``maxLength``, ``$ref`` within the file), so what the
    schema says is what is enforced.
    """
    root = _schema()
    _check(data, root, root, "", source)


@lru_cache(maxsize=1)
def _schema() -> dict[str, Any]:
    return schema()


_TYPES = {
    "object": "a mapping",
    "array": "a list",
    "string": "text",
    "number": "a number",
    "integer": "a whole number",
    "boolean": "true or false",
    "null": "null",
}


def _is(value: Any, kind: str) -> bool:
    if kind == "null":
        return value is None
    if kind == "boolean":
        return isinstance(value, bool)
    if kind == "integer":
        return isinstance(value, int) and not isinstance(value, bool)
    if kind == "number":
        return isinstance(value, (int, float)) and not isinstance(value, bool)
    if kind == "string":
        return isinstance(value, str)
    if kind == "array":
        return isinstance(value, list)
    return isinstance(value, dict)


def _check(
    value: Any, rule: dict[str, Any], root: dict[str, Any], where: str, source: str | None
) -> None:
    def fail(detail: str) -> ResultsFileError:
        return ResultsFileError(detail, field=where or None, source=source)

    if "$ref" in rule:
        name = rule["$ref"].rsplit("/", 1)[-1]
        _check(value, root["$defs"][name], root, where, source)
        return
    if isinstance(value, _NonFinite):
        raise fail(f"{value.text} is not a finite number")
    if isinstance(value, _LongInt):
        raise fail(f"an integer of {value.digits} digits is not a value a results file holds")
    if "const" in rule and (value != rule["const"] or type(value) is not type(rule["const"])):
        raise fail(f"{shown(value)} is not {rule['const']!r}")
    if "enum" in rule and not (isinstance(value, str) and value in rule["enum"]):
        raise fail(f"{shown(value)} is not one of {', '.join(map(str, rule['enum']))}")
    kinds = rule.get("type")
    if kinds is not None:
        kinds = [kinds] if isinstance(kinds, str) else list(kinds)
        if not any(_is(value, k) for k in kinds):
            want = " or ".join(_TYPES[k] for k in kinds)
            raise fail(f"{shown(value)} is {_kind_of(value)}, not {want}")
    if _is(value, "number"):
        what = f" ({rule['description']})" if "description" in rule else ""
        if "exclusiveMinimum" in rule and not value > rule["exclusiveMinimum"]:
            raise fail(f"{shown(value)} is not above {rule['exclusiveMinimum']}{what}")
        if "minimum" in rule and not value >= rule["minimum"]:
            raise fail(f"{shown(value)} is below {rule['minimum']}{what}")
    if isinstance(value, str):
        if len(value) < rule.get("minLength", 0):
            raise fail("is empty")
        if "maxLength" in rule and len(value) > rule["maxLength"]:
            raise fail(f"is longer than {rule['maxLength']} characters")
    if isinstance(value, list) and "items" in rule:
        for i, item in enumerate(value):
            _check(item, rule["items"], root, f"{where}[{i}]", source)
    if isinstance(value, dict):
        props = rule.get("properties", {})
        for key in rule.get("required", ()):
            if key not in value:
                raise fail(f"the field {key!r} is missing")
        for key, item in value.items():
            inner = f"{where}.{key}" if where else key
            if key in props:
                _check(item, props[key], root, inner, source)
            elif rule.get("additionalProperties", True) is False:
                raise fail(f"unknown field {key!r}")


def _kind_of(value: Any) -> str:
    for kind in ("null", "boolean", "integer", "number", "string", "array", "object"):
        if _is(value, kind):
            return _TYPES[kind]
    return type(value).__name__


# -- pairing crossings -----------------------------------------------------------------------------
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
