"""Results files: the versioned schema, checked on read, and tampered expected files.

The results file under test is written by phasepath itself (a regression pin by construction);
each case tampers with one field and asserts that ``phasepath check`` refuses the file with exit
status 2 and one line naming the field, never a traceback. The schema is also checked with the
independent ``jsonschema`` library (the JSON Schema 2020-12 reference validator for Python), so
that phasepath's own reader and the published description agree.
"""

from __future__ import annotations

import json

import pytest

from phasepath import cli, results
from phasepath.records import BASES, CROSSING_KINDS, LEG_KINDS, MIXTURES, PHASES

ROUTE = """\
format: phasepath route file
version: 1
substance: CO2
title: Vent check (invented demo)
start: {T: 20 degC, p: 60 bar}
legs:
  - {kind: isenthalp, p: 1 atm}
"""


@pytest.fixture(scope="module")
def files(tmp_path_factory):
    d = tmp_path_factory.mktemp("results")
    route = d / "vent.yaml"
    route.write_text(ROUTE, encoding="utf-8")
    expected = d / "vent.expected.json"
    assert cli.main(["analyze", str(route), "--format", "json", "-o", str(expected)]) == 0
    return route, expected


@pytest.fixture(scope="module")
def doc(files):
    return json.loads(files[1].read_text(encoding="utf-8"))


def _check(capsys, files, text: str, tmp_path) -> tuple[int, str, str]:
    path = tmp_path / "tampered.json"
    path.write_text(text, encoding="utf-8")
    code = cli.main(["check", str(files[0]), str(path)])
    out, err = capsys.readouterr()
    return code, out, err


def _edit(doc, fn):
    d = json.loads(json.dumps(doc))
    fn(d)
    return json.dumps(d)


def _set(path, value):
    def fn(d):
        obj = d
        for k in path[:-1]:
            obj = obj[k]
        obj[path[-1]] = value

    return fn


def _drop(path):
    def fn(d):
        obj = d
        for k in path[:-1]:
            obj = obj[k]
        del obj[path[-1]]

    return fn


# (id, how the document is tampered, what the one error line must say)
CASES = [
    ("T-is-text", _set(["crossings", 0, "T"], "hot"), "field crossings[0].T: 'hot' is text"),
    ("heat-is-text", _set(["legs", 0, "heat"], "154"), "field legs[0].heat: '154' is text"),
    ("step-not-whole", _set(["crossings", 0, "step"], 1.5), "crossings[0].step: 1.5 is a number"),
    ("flag-not-bool", _set(["crossings", 0, "at_corner"], "no"), "crossings[0].at_corner"),
    ("hazards-not-list", _set(["legs", 0, "hazards"], {}), "field legs[0].hazards"),
    ("phase-unknown", _set(["legs", 0, "end", "phase"], "plasma"), "legs[0].end.phase"),
    ("zero-pressure", _set(["crossings", 0, "p"], 0), "crossings[0].p: 0 is not above 0"),
    ("negative-pressure", _set(["legs", 0, "end", "p"], -5.0), "legs[0].end.p: -5.0 is not above"),
    ("negative-temperature", _set(["legs", 0, "start", "T"], -1), "legs[0].start.T"),
    ("missing-leg-field", _drop(["legs", 0, "heat"]), "legs[0]: the field 'heat' is missing"),
    ("missing-top-field", _drop(["coolprop"]), "the field 'coolprop' is missing"),
    ("missing-crossing-T", _drop(["crossings", 0, "T"]), "crossings[0]: the field 'T'"),
    ("unknown-field", _set(["crossings", 0, "colour"], "red"), "unknown field 'colour'"),
    ("unknown-top-field", _set(["reviewed_by"], "me"), "unknown field 'reviewed_by'"),
    ("unknown-state-field", _set(["legs", 0, "end", "x"], 1), "legs[0].end: unknown field 'x'"),
    ("newer-version", _set(["version"], 3), "version 3 is newer than this phasepath"),
    ("older-version", _set(["version"], 1), "version 1 (written by phasepath"),
    ("version-text", _set(["version"], "2"), "field version: '2' is not a format version"),
    ("not-results", _set(["format"], "something else"), "not a phasepath results file"),
    ("crossings-not-list", _set(["crossings"], "none"), "field crossings: 'none' is text"),
]


@pytest.mark.parametrize("edit, message", [c[1:] for c in CASES], ids=[c[0] for c in CASES])
def test_tampered_file_exit_2_one_line(capsys, files, doc, tmp_path, edit, message) -> None:
    code, out, err = _check(capsys, files, _edit(doc, edit), tmp_path)
    assert code == 2, out
    assert err.count("\n") == 1 and err.startswith("phasepath: error: "), err
    assert message in err, err
    assert "tampered.json" in err  # the file is named
    assert "Traceback" not in err + out and "internal error" not in err


# Tampering that only the text can carry: non-finite numbers, huge integers, duplicate keys.
TEXT_CASES = [
    ("nan", '"T": NaN', "crossings[0].T: NaN is not a finite number"),
    ("infinity", '"T": Infinity', "crossings[0].T: Infinity is not a finite number"),
    ("minus-infinity", '"T": -Infinity', "crossings[0].T: -Infinity is not a finite number"),
    ("overflow", '"T": 1e999', "crossings[0].T: 1e999 is not a finite number"),
    ("5000-digit-int", '"step": 1' + "0" * 4999, "an integer of 5000 digits"),
    ("5000-digit-T", '"T": 3' + "0" * 4999, "crossings[0].T: an integer of 5000 digits"),
]


@pytest.mark.parametrize(
    "replace, message", [c[1:] for c in TEXT_CASES], ids=[c[0] for c in TEXT_CASES]
)
def test_tampered_text_exit_2_one_line(capsys, files, tmp_path, replace, message) -> None:
    text = files[1].read_text(encoding="utf-8")
    key = replace.split(":")[0]
    start = text.index(key + ":", text.index('"crossings"'))
    end = text.index(",", start)
    code, out, err = _check(capsys, files, text[:start] + replace + text[end:], tmp_path)
    assert code == 2, out
    assert err.count("\n") == 1 and message in err, err
    assert "Traceback" not in err


def test_duplicate_key_and_bad_json(capsys, files, tmp_path) -> None:
    text = files[1].read_text(encoding="utf-8")
    dup = text.replace('"substance": ', '"substance": "x", "substance": ', 1)
    code, _, err = _check(capsys, files, dup, tmp_path)
    assert code == 2 and "the key 'substance' appears twice" in err
    code, _, err = _check(capsys, files, text[: len(text) // 2], tmp_path)
    assert code == 2 and "not valid JSON" in err and err.count("\n") == 1
    code, _, err = _check(capsys, files, "[1, 2]", tmp_path)
    assert code == 2 and "not a phasepath results file" in err
    deep = "[" * 100000 + "]" * 100000
    code, _, err = _check(capsys, files, deep, tmp_path)
    assert code == 2 and "Traceback" not in err


def test_read_back_equals_document(files, doc) -> None:
    """What analyze writes, read reads back unchanged (full precision)."""
    assert results.read(files[1]) == doc
    assert doc["version"] == results.VERSION == 2
    assert doc["coolprop"] and doc["phasepath"]


def test_schema_agrees_with_jsonschema(doc) -> None:
    """The shipped schema is valid JSON Schema 2020-12, the document written by phasepath
    validates, and every tampered document phasepath refuses is refused by jsonschema too."""
    jsonschema = pytest.importorskip("jsonschema")
    schema = results.schema()
    jsonschema.Draft202012Validator.check_schema(schema)
    validator = jsonschema.Draft202012Validator(schema)
    assert not list(validator.iter_errors(doc))
    for name, edit, _ in CASES:
        if name in ("not-results",):
            continue
        tampered = json.loads(_edit(doc, edit))
        assert list(validator.iter_errors(tampered)), name


def test_schema_names_what_the_records_name() -> None:
    """The schema's enumerations are the records' tables (they cannot drift apart)."""
    s = results.schema()["$defs"]
    assert s["crossing"]["properties"]["kind"]["enum"] == list(CROSSING_KINDS)
    assert s["leg"]["properties"]["kind"]["enum"] == list(LEG_KINDS)
    assert s["leg"]["properties"]["basis"]["enum"] == list(BASES)
    assert s["state"]["properties"]["phase"]["enum"] == list(PHASES) + list(MIXTURES)


@pytest.mark.parametrize(
    "build",
    [
        lambda pp: (
            pp.Route("CO2", T="20 degC", p="50 bar")
            .isotherm(p="300 bar")
            .isobar(T="50 degC")
            .isenthalp(p="1 atm")
        ),
        lambda pp: pp.Route("water", T="-20 degC", p="1 bar").isotherm(p="300 MPa"),
        lambda pp: (
            pp.Route("water", T="20 degC", p="1 atm")
            .isobar(T="-45 degC")
            .isotherm(p="13 Pa")
            .isobar(T="25 degC")
        ),
        lambda pp: (
            pp.Route("CO2", T=288.15, density=750.0)
            .isochore(T="50 degC")
            .isenthalp(p="1 atm")
            .isentrope(p="80 bar")
        ),
        lambda pp: pp.Route("nitrogen", T="20 degC", p="1.2 bar").isobar(T="-195 degC"),
        lambda pp: pp.Route(
            pp.Substance.from_data(
                "demo solvent K-12",
                triple=(180.0, None),
                critical=(560.0, 4.5e6),
                vapor_points=[(300.0, 5.0e3), (325.0, 1.6e4), (350.0, 4.0e4)],
            ),
            T=310.0,
            p=1e5,
        ).isobar(T=400.0),
    ],
    ids=["co2-vent", "water-ices", "freeze-dry", "sealed-cylinder", "nitrogen", "from-data"],
)
def test_every_kind_of_document_validates(build) -> None:
    """Documents of routes through every kind of leg and state fit the schema (both readers)."""
    import phasepath as pp

    doc = results.document(build(pp).analyze())
    results.validate(doc)
    jsonschema = pytest.importorskip("jsonschema")
    assert not list(jsonschema.Draft202012Validator(results.schema()).iter_errors(doc))
    assert results.loads(json.dumps(doc)) == doc
