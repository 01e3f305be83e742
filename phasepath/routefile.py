"""Route files: a planned route saved as JSON or YAML, read back with strict validation.

The *phasepath route file* holds one route: the substance, the start state, the legs in order,
and a free-text title and notes. Every value is kept as the user wrote it (``"40 degC"``,
``"300 bar"``, or a bare number in SI units), so a saved route reads the same as the plan it came
from. The format is described by the JSON Schema in ``phasepath/data/route.schema.json``
(:func:`schema`).

>>> text = '''
... format: phasepath route file
... version: 1
... substance: CO2
... title: Example
... start: {T: 40 degC, p: 1 bar}
... legs:
...   - {kind: isotherm, p: 300 bar}
... '''
>>> route = loads_route(text, fmt="yaml")
>>> route.legs[0].given
{'p': '300 bar'}
>>> loads_route(text.replace("p: 300 bar", "p: 300 degC"), fmt="yaml")  # doctest: +ELLIPSIS
Traceback (most recent call last):
...
phasepath.errors.RouteFileError: <text>:8: field legs[0].p (leg 1): ...

Reading never executes anything from a file: JSON goes through :mod:`json`, YAML through
``yaml.safe_load`` with aliases refused, and files above :data:`MAX_BYTES` are refused before
they are parsed. Every problem is a :class:`~phasepath.errors.RouteFileError` that names the
field and, where known, the line.
"""

from __future__ import annotations

import json
import math
import os
import re
from functools import lru_cache
from pathlib import Path
from typing import Any

from . import fileio
from .errors import PhasePathError, RouteFileError, UnknownSubstanceError
from .records import LEG_KINDS
from .route import Route
from .substances import Substance
from .units import parse_quantity

__all__ = [
    "load_route",
    "save_route",
    "loads_route",
    "dumps_route",
    "schema",
    "FORMAT",
    "VERSION",
    "MAX_BYTES",
]

#: The value of the ``format`` field of every route file.
FORMAT = "phasepath route file"
#: The version of the format this phasepath writes and reads.
VERSION = 1
#: Larger files are refused before they are parsed (1 MiB).
MAX_BYTES = fileio.MAX_BYTES

_TOP = ("format", "version", "substance", "title", "notes", "elevation", "start", "legs")
_REQUIRED_TOP = ("format", "version", "substance", "start", "legs")
_SCHEMA_PATH = Path(__file__).parent / "data" / "route.schema.json"
_SUFFIX = {".json": "json", ".yaml": "yaml", ".yml": "yaml"}

_EXAMPLE = {
    "T": "40 degC",
    "p": "300 bar",
    "density": "600 kg/m3",
    "quality": 0.0,
    "until": "fully vapor",
}

Path_ = str | os.PathLike


# -- public ------------------------------------------------------------------------------------
def load_route(path: Path_, fmt: str | None = None) -> Route:
    """Read a route file (``.json``, ``.yaml`` or ``.yml``) and build the route.

    Parameters
    ----------
    path : str or path-like
    fmt : {"json", "yaml"}, optional
        Taken from the file's suffix if not given; a file with another suffix is read as JSON
        when it starts with ``{`` and as YAML otherwise.
    """
    name = fileio.path_text(path, RouteFileError)
    raw = fileio.read_bytes(name, MAX_BYTES, RouteFileError)
    try:
        text = raw.decode("utf-8-sig")
    except UnicodeDecodeError as exc:
        line = raw.count(b"\n", 0, exc.start) + 1
        raise _error("route file is not UTF-8 text", name, line=line) from None
    return loads_route(text, fmt or _SUFFIX.get(Path(name).suffix.lower()), source=name)


def loads_route(text: str, fmt: str | None = "json", *, source: str = "<text>") -> Route:
    """Build a route from the text of a route file.

    Parameters
    ----------
    text : str
    fmt : {"json", "yaml"} or None
        None: JSON when the text starts with ``{``, YAML otherwise.
    source : str
        Name used in error messages (the file name when called by :func:`load_route`).
    """
    if not isinstance(text, str):
        raise _error(f"route file text must be a str, not {type(text).__name__}", source)
    if len(text.encode("utf-8")) > MAX_BYTES:
        raise _error(f"route file is more than the {MAX_BYTES} bytes phasepath reads", source)
    if fmt is None:
        fmt = "json" if text.lstrip().startswith("{") else "yaml"
    if fmt not in ("json", "yaml"):
        raise _error(f"unknown route file format {fmt!r}; choose 'json' or 'yaml'", source)
    try:
        data, lines = _read_json(text, source) if fmt == "json" else _read_yaml(text, source)
    except RecursionError:
        raise _error(
            "values are nested too deeply: a route file is a few levels deep", source
        ) from None
    except ValueError as exc:  # e.g. an integer of more digits than Python converts
        if isinstance(exc, RouteFileError):
            raise
        raise _error(f"not a valid {fmt.upper()} route file: {str(exc)[:120]}", source) from None
    return _build(data, lines, source)


def dumps_route(route: Route, fmt: str = "json") -> str:
    """The text of a route file for ``route``, in ``fmt`` ("json" or "yaml")."""
    data = _document(route)
    if fmt == "json":
        return json.dumps(data, indent=2, ensure_ascii=False) + "\n"
    if fmt == "yaml":
        import yaml

        body = yaml.safe_dump(
            data, sort_keys=False, allow_unicode=True, default_flow_style=None, width=100
        )
        return "# phasepath route file (YAML); see phasepath/data/route.schema.json\n" + body
    raise RouteFileError(f"unknown route file format {fmt!r}; choose 'json' or 'yaml'")


def save_route(route: Route, path: Path_, fmt: str | None = None) -> Path:
    """Write ``route`` to ``path``; the format follows the suffix (``.json``, ``.yaml``, ``.yml``).

    Returns the path written.
    """
    name = fileio.path_text(path, RouteFileError)
    p = Path(name)
    fmt = fmt or _SUFFIX.get(p.suffix.lower())
    if fmt is None:
        raise RouteFileError(
            f"cannot tell the format of {name!r} from its suffix "
            f"{p.suffix!r}: use .json, .yaml or .yml, or pass fmt="
        )
    fileio.write_text(name, dumps_route(route, fmt), RouteFileError)
    return p


@lru_cache(maxsize=1)
def _schema_text() -> str:
    return _SCHEMA_PATH.read_text(encoding="utf-8")


def schema() -> dict[str, Any]:
    """The JSON Schema (draft 2020-12) of the route file format, as a dict."""
    result: dict[str, Any] = json.loads(_schema_text())
    return result


# -- writing -----------------------------------------------------------------------------------
def _document(route: Route) -> dict[str, Any]:
    d = route.to_dict()
    sub = d["substance"]
    if isinstance(sub, Substance):
        sub = sub.to_dict()  # built from data: its inputs travel with the route
    doc: dict[str, Any] = {
        "format": FORMAT,
        "version": VERSION,
        "substance": sub,
        "title": d.get("title", ""),
        "notes": d.get("notes", ""),
    }
    if d.get("elevation") is not None:
        doc["elevation"] = _plain(d["elevation"], "elevation")
    doc["start"] = {k: _plain(v, f"start.{k}") for k, v in d["start"].items() if v is not None}
    doc["legs"] = [
        {
            "kind": leg["kind"],
            **{
                k: _plain(v, f"legs[{i}].{k}")
                for k, v in leg.items()
                if k != "kind" and v is not None
            },
        }
        for i, leg in enumerate(d["legs"])
    ]
    return doc


def _plain(value: object, field: str) -> float | int | str:
    """A value as the user gave it, in a form JSON and YAML can hold."""
    if isinstance(value, bool):
        raise RouteFileError(f"field {field}: {value!r} is not a number or a value with a unit")
    if isinstance(value, (int, str)):
        return value
    if isinstance(value, float):
        return value
    if hasattr(value, "magnitude") and hasattr(value, "units"):
        return f"{float(value.magnitude)!r} {value.units}"
    try:
        x = float(value)  # type: ignore[arg-type]  # numpy scalars
    except (TypeError, ValueError):
        raise RouteFileError(f"field {field}: {value!r} cannot be saved in a route file") from None
    return x


# -- reading -----------------------------------------------------------------------------------
def _error(
    msg: str,
    source: str,
    field: str | None = None,
    line: int | None = None,
) -> RouteFileError:
    return RouteFileError(msg, source=source, field=field, line=line)


def _field_name(path: tuple[Any, ...]) -> str:
    out = ""
    for part in path:
        out += f"[{part}]" if isinstance(part, int) else (f".{part}" if out else str(part))
    if len(path) >= 2 and path[0] == "legs" and isinstance(path[1], int):
        out += f" (leg {path[1] + 1})"
    return out


def _read_json(text: str, source: str) -> tuple[Any, dict[tuple[Any, ...], int]]:
    def no_duplicates(pairs: list[tuple[str, Any]]) -> dict[str, Any]:
        out: dict[str, Any] = {}
        for k, v in pairs:
            if k in out:
                raise _DuplicateKey(k)
            out[k] = v
        return out

    def no_constant(name: str) -> Any:
        raise _Constant(name)

    try:
        data = json.loads(text, object_pairs_hook=no_duplicates, parse_constant=no_constant)
    except json.JSONDecodeError as exc:
        raise _error(
            f"not valid JSON: {exc.msg} (column {exc.colno})", source, line=exc.lineno
        ) from None
    except _DuplicateKey as exc:
        lines = _json_lines(text, dupes_ok=True)
        line = next((ln for path, ln in lines.items() if path and path[-1] == exc.key), None)
        raise _error(f"the key {exc.key!r} appears twice", source, line=line) from None
    except _Constant as exc:
        raise _error(f"{exc.name} is not allowed in a route file", source) from None
    return data, _json_lines(text)


class _DuplicateKey(Exception):
    def __init__(self, key: str) -> None:
        self.key = key


class _Constant(Exception):
    def __init__(self, name: str) -> None:
        self.name = name


_WS = re.compile(r"[ \t\n\r]*")


def _json_lines(text: str, dupes_ok: bool = False) -> dict[tuple[Any, ...], int]:
    """Line of every value in a valid JSON text, keyed by its path (keys and list indices)."""
    decoder = json.JSONDecoder()
    lines: dict[tuple[Any, ...], int] = {}

    def skip(i: int) -> int:
        return _WS.match(text, i).end()  # type: ignore[union-attr]

    def line(i: int) -> int:
        return text.count("\n", 0, i) + 1

    def value(i: int, path: tuple[Any, ...]) -> int:
        i = skip(i)
        lines.setdefault(path, line(i))
        c = text[i]
        if c == "{":
            i = skip(i + 1)
            if text[i] == "}":
                return i + 1
            while True:
                key, i = json.decoder.scanstring(text, i + 1)  # type: ignore[attr-defined]
                lines.setdefault(path + (key,), line(i))
                i = skip(i)  # at ':'
                i = value(i + 1, path + (key,))
                i = skip(i)
                if text[i] == "}":
                    return i + 1
                i = skip(i + 1)  # past ','
        if c == "[":
            i = skip(i + 1)
            if text[i] == "]":
                return i + 1
            n = 0
            while True:
                i = value(i, path + (n,))
                n += 1
                i = skip(i)
                if text[i] == "]":
                    return i + 1
                i += 1
        _, end = decoder.raw_decode(text, i)
        return int(end)

    try:
        value(0, ())
    except (ValueError, IndexError):  # pragma: no cover - the text was parsed before
        pass
    return lines


_BRACKETS = re.compile(r"[^\[\]{}]+")
_MAX_DEPTH = 64  # a route file is 3 levels deep; the YAML reader slows quadratically with depth


def _bracket_depth(text: str) -> int:
    """Deepest nesting of [ and { in the text (a cheap bound, quotes not considered)."""
    depth = deepest = 0
    for c in _BRACKETS.sub("", text):
        depth = depth + 1 if c in "[{" else max(depth - 1, 0)
        deepest = max(deepest, depth)
    return deepest


def _read_yaml(text: str, source: str) -> tuple[Any, dict[tuple[Any, ...], int]]:
    import yaml

    if _bracket_depth(text) > _MAX_DEPTH:
        raise _error(
            f"values are nested too deeply (more than {_MAX_DEPTH} levels of [ or {{): "
            f"a route file is a few levels deep",
            source,
        )
    try:
        for event in yaml.parse(text, Loader=yaml.SafeLoader):
            if isinstance(event, yaml.AliasEvent):
                raise _error(
                    "YAML aliases (*name) are not allowed in a route file",
                    source,
                    line=event.start_mark.line + 1,
                )
        node = yaml.compose(text, Loader=yaml.SafeLoader)
        data = yaml.safe_load(text)
    except yaml.MarkedYAMLError as exc:
        mark = exc.problem_mark or exc.context_mark
        line = mark.line + 1 if mark is not None else None
        raise _error(f"not valid YAML: {exc.problem or exc.context}", source, line=line) from None
    except yaml.YAMLError as exc:
        raise _error(f"not valid YAML: {exc}", source) from None
    lines: dict[tuple[Any, ...], int] = {}
    if node is not None:
        dup = _yaml_lines(node, (), lines)
        if dup is not None:
            key, ln = dup
            raise _error(f"the key {key!r} appears twice", source, line=ln)
    return data, lines


def _yaml_lines(
    node: Any, path: tuple[Any, ...], lines: dict[tuple[Any, ...], int]
) -> tuple[str, int] | None:
    import yaml

    lines.setdefault(path, node.start_mark.line + 1)
    if isinstance(node, yaml.MappingNode):
        seen: set[str] = set()
        for knode, vnode in node.value:
            key = knode.value
            if key in seen:
                return key, knode.start_mark.line + 1
            seen.add(key)
            lines.setdefault(path + (key,), knode.start_mark.line + 1)
            dup = _yaml_lines(vnode, path + (key,), lines)
            if dup is not None:
                return dup
    elif isinstance(node, yaml.SequenceNode):
        for i, item in enumerate(node.value):
            dup = _yaml_lines(item, path + (i,), lines)
            if dup is not None:
                return dup
    return None


def _build(data: Any, lines: dict[tuple[Any, ...], int], source: str) -> Route:
    def fail(msg: str, *path: Any) -> RouteFileError:
        where = path
        while where and where not in lines:
            where = where[:-1]
        return _error(msg, source, _field_name(path) if path else None, lines.get(where))

    if not isinstance(data, dict):
        raise fail(
            f"a route file holds one mapping of fields ({', '.join(_TOP)}), not {_type_name(data)}"
        )
    _keys(data, _TOP, _REQUIRED_TOP, (), fail)
    if data["format"] != FORMAT:
        raise fail(
            f"{data['format']!r} is not a phasepath route file: expected {FORMAT!r}", "format"
        )
    version = data["version"]
    if not isinstance(version, int) or isinstance(version, bool) or version < 1:
        raise fail(f"{version!r} is not a format version (a whole number, 1 or more)", "version")
    if version > VERSION:
        raise fail(
            f"version {version} was written by a newer phasepath; this one reads version {VERSION}",
            "version",
        )
    for key in ("substance", "title", "notes"):
        if key == "substance" and isinstance(data[key], dict):
            continue  # a substance built from data (Substance.to_dict)
        if key in data and not isinstance(data[key], str):
            hint = " (in YAML, put quotes around it)" if key == "substance" else ""
            raise fail(f"{data[key]!r} is not text{hint}", key)
    if isinstance(data["substance"], dict):
        try:
            Substance.from_dict(data["substance"])
        except PhasePathError as exc:
            raise fail(str(exc), "substance") from None
    elif not data["substance"].strip():
        raise fail("is empty: name a substance, such as 'CO2' or 'water'", "substance")
    elevation = data.get("elevation")
    if elevation is not None and (
        isinstance(elevation, bool)
        or not isinstance(elevation, (int, float))
        or not math.isfinite(elevation)
    ):
        raise fail(f"{elevation!r} is not a number (the site elevation in metres)", "elevation")
    start = data["start"]
    if not isinstance(start, dict):
        raise fail(
            f"expected a mapping with T and p (or T and density), not {_type_name(start)}", "start"
        )
    _keys(start, ("T", "p", "density", "quality"), (), ("start",), fail)
    if "quality" in start:  # on the vapor-pressure curve: T or p with the vapor fraction
        _one_of(start, ("T", "p"), ("start",), fail)
        if "density" in start:
            raise fail("give the quality or the density, not both", "start", "density")
    else:
        if "T" not in start:
            raise fail("missing value: this field is required", "start", "T")
        _one_of(start, ("p", "density"), ("start",), fail)
    for key in start:
        _value(start[key], key, ("start", key), fail)
    legs = data["legs"]
    if not isinstance(legs, list):
        raise fail(f"expected a list of legs, not {_type_name(legs)}", "legs")
    try:
        route = Route(
            data["substance"],
            T=start.get("T"),
            p=start.get("p"),
            density=start.get("density"),
            quality=start.get("quality"),
            elevation=elevation,
            title=data.get("title", ""),
            notes=data.get("notes", ""),
        )
    except UnknownSubstanceError as exc:
        raise fail(str(exc), "substance") from exc
    except PhasePathError as exc:
        if "elevation" in str(exc) and elevation is not None:
            raise fail(str(exc), "elevation") from exc
        raise fail(str(exc), "start") from exc
    for i, leg in enumerate(legs):
        if not isinstance(leg, dict):
            raise fail(
                f"expected a mapping such as {{kind: isobar, T: 40 degC}}, not {_type_name(leg)}",
                "legs",
                i,
            )
        kind = leg.get("kind")
        if kind is None:
            raise fail(
                f"missing value: every leg needs a kind ({', '.join(LEG_KINDS)})",
                "legs",
                i,
                "kind",
            )
        if not isinstance(kind, str) or kind not in LEG_KINDS:
            raise fail(
                f"unknown leg kind {kind!r}; known: {', '.join(LEG_KINDS)}", "legs", i, "kind"
            )
        targets = LEG_KINDS[kind].targets
        _keys(leg, ("kind",) + targets, ("kind",), ("legs", i), fail)
        target = _one_of(leg, targets, ("legs", i), fail)
        _value(leg[target], target, ("legs", i, target), fail)
        try:
            route.add(kind, **{target: leg[target]})
        except PhasePathError as exc:
            raise fail(str(exc), "legs", i, target) from exc
    return route


def _one_of(obj: dict[str, Any], names: tuple[str, ...], path: tuple[Any, ...], fail: Any) -> str:
    """The one field of ``names`` present in ``obj``; an error if none or several."""
    present = [n for n in names if n in obj]
    if len(present) == 1:
        return present[0]
    if not present:
        choice = " or ".join(names)
        raise fail(f"missing value: give {choice}, such as {names[0]}: {_EXAMPLE[names[0]]}", *path)
    raise fail(f"give only one of {', '.join(present)}", *path, present[1])


def _keys(
    obj: dict[str, Any],
    allowed: tuple[str, ...],
    required: tuple[str, ...],
    path: tuple[Any, ...],
    fail: Any,
) -> None:
    for key, value in obj.items():
        if key not in allowed:
            raise fail(f"unknown field {key!r}; allowed here: {', '.join(allowed)}", *path, key)
        if value is None:
            raise fail("missing value: the field is empty", *path, key)
    for key in required:
        if key not in obj:
            raise fail("missing value: this field is required", *path, key)


def _value(value: Any, name: str, path: tuple[Any, ...], fail: Any) -> None:
    """Check one value as written; the route parses the same text again."""
    if name == "until":
        if not isinstance(value, str) or not value.strip():
            raise fail(
                f"{value!r} is not an event, such as 'fully vapor' or '5 K superheat'", *path
            )
        return
    if isinstance(value, bool) or not isinstance(value, (int, float, str)):
        raise fail(
            f"{value!r} is not a number or a value with a unit, such as {_EXAMPLE[name]!r}", *path
        )
    if isinstance(value, float) and not math.isfinite(value):
        raise fail(f"{value!r} is not a finite number", *path)
    if name == "quality":
        if isinstance(value, str) or not 0.0 <= value <= 1.0:
            raise fail(
                f"{value!r} is not a vapor mass fraction: a number from 0 (saturated liquid) "
                "to 1 (saturated vapor)",
                *path,
            )
        return
    if name == "p" and isinstance(value, str) and value.strip().lower() == "ambient":
        return
    dimension = {"T": "temperature", "p": "pressure", "density": "density"}[name]
    try:
        parse_quantity(value, dimension)
    except PhasePathError as exc:
        raise fail(str(exc), *path) from None


def _type_name(value: Any) -> str:
    return {
        dict: "a mapping",
        list: "a list",
        str: "text",
        type(None): "nothing",
        bool: "true/false",
    }.get(type(value), f"a {type(value).__name__}")
