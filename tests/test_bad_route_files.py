"""Route files under bad input: every broken, hostile or odd file gets a RouteFileError that says
what is wrong, and nothing in a file is ever executed.

Cases: truncated text, wrong types, huge numbers, deep nesting, oversized files, bytes that are
not UTF-8, YAML tags that try to construct Python objects, YAML aliases (the "billion laughs"
shape), and a hypothesis fuzz of the loader over random text and random documents.
"""

from __future__ import annotations

import json
from pathlib import Path
from typing import Any

import pytest
from hypothesis import HealthCheck, given, settings
from hypothesis import strategies as st

import phasepath as pp
from phasepath.errors import RouteFileError
from phasepath.routefile import MAX_BYTES, dumps_route, load_route, loads_route

_GOOD = {
    "format": "phasepath route file",
    "version": 1,
    "substance": "CO2",
    "title": "Bottling line 3 trial (invented)",
    "start": {"T": "40 degC", "p": "1 bar"},
    "legs": [{"kind": "isotherm", "p": "80 bar"}, {"kind": "isobar", "T": "10 degC"}],
}
_GOOD_JSON = json.dumps(_GOOD)
_MARKER = Path(__file__).with_name("_route_file_marker_should_not_exist")


def _with(**changes: Any) -> str:
    doc = json.loads(_GOOD_JSON)
    doc.update(changes)
    return json.dumps(doc)


def _yaml_exec(tag: str) -> str:
    return (
        f"format: phasepath route file\nversion: 1\nsubstance: {tag} "
        f'["touch {_MARKER}"]\nstart: {{T: 300, p: 1e5}}\nlegs: []\n'
    )


CASES: dict[str, tuple[str, str | None, tuple[str, ...]]] = {
    # id: (text, format, pieces of text the message holds)
    "empty": ("", "json", ("not valid JSON",)),
    "truncated-json": (_GOOD_JSON[: len(_GOOD_JSON) // 2], "json", ("not valid JSON",)),
    "truncated-yaml": (
        "format: phasepath route file\nversion: 1\nstart: {T: 300",
        "yaml",
        ("not valid YAML",),
    ),
    "null-document": ("null", "json", ("one mapping",)),
    "list-document": ("[1, 2]", "json", ("one mapping",)),
    "wrong-format-name": (_with(format="something else"), "json", ("format",)),
    "version-text": (_with(version="1"), "json", ("version",)),
    "version-float": (_with(version=1.0), "json", ("version",)),
    "version-from-future": (_with(version=99), "json", ("version 99",)),
    "version-huge-int": (
        _GOOD_JSON.replace('"version": 1', '"version": ' + "9" * 5000),
        "json",
        ("route file",),
    ),
    "substance-list": (_with(substance=["CO2"]), "json", ("substance", "not text")),
    "substance-unknown": (_with(substance="unobtainium"), "json", ("substance", "'unobtainium'")),
    "yaml-substance-no": (
        "format: phasepath route file\nversion: 1\nsubstance: no\n"
        "start: {T: 300, p: 1e5}\nlegs: []\n",
        "yaml",
        ("substance", "quotes"),
    ),
    "start-list": (_with(start=[300, 1e5]), "json", ("start",)),
    "start-missing-p": (_with(start={"T": 300}), "json", ("start", "missing value")),
    "start-T-huge-int": (
        _GOOD_JSON.replace('"40 degC"', "1" + "0" * 5000),
        "json",
        ("route file",),
    ),
    "start-T-1e400": (_GOOD_JSON.replace('"40 degC"', "1e400"), "json", ("start.T", "finite")),
    "start-T-NaN-literal": (_GOOD_JSON.replace('"40 degC"', "NaN"), "json", ("NaN",)),
    "start-T-bool": (_with(start={"T": True, "p": "1 bar"}), "json", ("start.T",)),
    "start-T-wrong-dimension": (
        _with(start={"T": "5 bar", "p": "1 bar"}),
        "json",
        ("start.T", "'5 bar'", "not a temperature"),
    ),
    "start-p-negative": (_with(start={"T": "40 degC", "p": "-1 bar"}), "json", ("'-1 bar'",)),
    "yaml-date-as-T": (
        "format: phasepath route file\nversion: 1\nsubstance: CO2\n"
        "start: {T: 2001-12-14, p: 1 bar}\nlegs: []\n",
        "yaml",
        ("start.T",),
    ),
    "legs-mapping": (_with(legs={"kind": "isobar"}), "json", ("legs", "list")),
    "leg-kind-list": (
        _with(legs=[{"kind": ["isobar"], "T": 300}]),
        "json",
        ("legs[0].kind", "unknown leg kind"),
    ),
    "leg-kind-unknown": (_with(legs=[{"kind": "warp", "T": 300}]), "json", ("'warp'",)),
    "leg-missing-kind": (_with(legs=[{"T": 300}]), "json", ("legs[0].kind",)),
    "leg-extra-field": (
        _with(legs=[{"kind": "isobar", "T": 300, "shell": "rm"}]),
        "json",
        ("'shell'",),
    ),
    "leg-zero-length": (
        _with(legs=[{"kind": "isobar", "T": "40 degC"}]),
        "json",
        ("legs[0]", "zero length"),
    ),
    "leg-beyond-model": (
        _with(legs=[{"kind": "isotherm", "p": "1e12 bar"}]),
        "json",
        ("legs[0]", "'1e12 bar'"),
    ),
    "duplicate-key": (
        _GOOD_JSON.replace('"version": 1', '"version": 1, "version": 1'),
        "json",
        ("'version' appears twice",),
    ),
    "deep-json-list": ("[" * 100_000 + "]" * 100_000, "json", ("nested too deeply",)),
    "deep-json-object": ('{"a":' * 50_000 + "1" + "}" * 50_000, "json", ("nested",)),
    "deep-json-inside-legs": (
        _GOOD_JSON.replace('"legs": [', '"legs": [' + "[" * 5000 + "]" * 5000 + ","),
        "json",
        (),
    ),
    "deep-yaml-flow": ("[" * 100_000 + "]" * 100_000, "yaml", ("nested",)),
    "yaml-alias-bomb": (
        "a: &a [x, x, x]\nb: &b [*a, *a, *a]\nc: [*b, *b, *b]\n",
        "yaml",
        ("aliases",),
    ),
    "yaml-python-apply": (
        _yaml_exec("!!python/object/apply:os.system"),
        "yaml",
        ("not valid YAML",),
    ),
    "yaml-python-new": (
        _yaml_exec("!!python/object/new:subprocess.Popen"),
        "yaml",
        ("not valid YAML",),
    ),
    "yaml-python-name": ("format: !!python/name:os.system\n", "yaml", ("not valid YAML",)),
    "yaml-unknown-local-tag": ("format: !shell ls\n", "yaml", ("not valid YAML",)),
    "oversized-text": ('{"title": "' + "x" * (MAX_BYTES + 10) + '"}', "json", ("bytes",)),
    "unknown-format-argument": (_GOOD_JSON, "toml", ("'toml'",)),
}


@pytest.mark.parametrize("case_id", list(CASES))
def test_bad_route_text(case_id: str) -> None:
    text, fmt, must = CASES[case_id]
    with pytest.raises(RouteFileError) as info:
        loads_route(text, fmt=fmt)
    msg = str(info.value)
    for piece in must:
        assert piece in msg, f"{piece!r} missing from: {msg}"
    assert len(msg) < 1500
    assert not _MARKER.exists()


def test_good_document_loads() -> None:
    # The base of every case above is itself valid: each failure comes from its one change.
    route = loads_route(_GOOD_JSON, fmt="json")
    assert [leg.kind for leg in route.legs] == ["isotherm", "isobar"]


def test_oversized_file_refused_before_reading(tmp_path: Path) -> None:
    path = tmp_path / "big.json"
    path.write_bytes(b"{" + b" " * (MAX_BYTES + 1) + b"}")
    with pytest.raises(RouteFileError, match="bytes"):
        load_route(path)


def test_not_utf8_file(tmp_path: Path) -> None:
    path = tmp_path / "latin.yaml"
    path.write_bytes(_GOOD_JSON.replace("invented", "inv\xe9nted").encode("latin-1"))
    with pytest.raises(RouteFileError, match="UTF-8"):
        load_route(path)


def test_missing_file_and_directory(tmp_path: Path) -> None:
    with pytest.raises(RouteFileError, match="cannot read"):
        load_route(tmp_path / "absent.json")
    with pytest.raises(RouteFileError):
        load_route(tmp_path)


def test_round_trip_of_a_good_route() -> None:
    route = loads_route(_GOOD_JSON, fmt="json")
    for fmt in ("json", "yaml"):
        again = loads_route(dumps_route(route, fmt), fmt=fmt)
        assert again.corners() == route.corners()


# -- fuzzing the loader ---------------------------------------------------------------------------

_FUZZ = settings(max_examples=150, deadline=None, suppress_health_check=[HealthCheck.too_slow])
_json_values = st.recursive(
    st.none() | st.booleans() | st.integers() | st.floats(allow_nan=False) | st.text(max_size=20),
    lambda children: (
        st.lists(children, max_size=4) | st.dictionaries(st.text(max_size=8), children, max_size=4)
    ),
    max_leaves=20,
)


def _loads_or_clear_error(text: str, fmt: str | None) -> None:
    try:
        loads_route(text, fmt=fmt)
    except RouteFileError as exc:
        assert str(exc)
    assert not _MARKER.exists()


@_FUZZ
@given(text=st.text(max_size=400), fmt=st.sampled_from(["json", "yaml", None]))
def test_fuzz_random_text(text: str, fmt: str | None) -> None:
    _loads_or_clear_error(text, fmt)


@_FUZZ
@given(
    field=st.sampled_from(["format", "version", "substance", "title", "start", "legs", "extra"]),
    value=_json_values,
    fmt=st.sampled_from(["json", "yaml"]),
)
def test_fuzz_one_field_replaced(field: str, value: Any, fmt: str) -> None:
    doc = json.loads(_GOOD_JSON)
    doc[field] = value
    text = json.dumps(doc)  # JSON is valid YAML 1.2 flow style too
    _loads_or_clear_error(text, fmt)


@_FUZZ
@given(
    leg=st.dictionaries(
        st.sampled_from(["kind", "T", "p", "until", "x"]), _json_values, max_size=3
    ),
    start=st.dictionaries(
        st.sampled_from(["T", "p", "density"]),
        st.one_of(st.floats(), st.integers(), st.text(max_size=12)),
        max_size=3,
    ),
)
def test_fuzz_start_and_legs(leg: dict[str, Any], start: dict[str, Any]) -> None:
    doc = json.loads(_GOOD_JSON)
    doc["start"], doc["legs"] = start, [leg]
    try:
        text = json.dumps(doc, allow_nan=True)
    except ValueError:  # pragma: no cover
        return
    _loads_or_clear_error(text, "json")


@_FUZZ
@given(cut=st.integers(0, len(_GOOD_JSON)), fmt=st.sampled_from(["json", "yaml"]))
def test_fuzz_truncation(cut: int, fmt: str) -> None:
    _loads_or_clear_error(_GOOD_JSON[:cut], fmt)


def test_nothing_executed_marker_absent_at_end() -> None:
    assert not _MARKER.exists()
    assert pp.PhasePathError in RouteFileError.__mro__
