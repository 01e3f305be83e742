"""Route files: round trips, strict validation with field and line, safe loading, the schema.

Check values: the normal boiling point of water used at the end is taken from the independent
``iapws`` library (IAPWS-95, IAPWS R6-95(2018)); everything else here checks the file format
against itself and against an independent JSON Schema validator (``jsonschema``).
"""

from __future__ import annotations

import json

import pytest

import phasepath as pp
from phasepath import routefile as io
from phasepath.errors import RouteFileError

yaml = pytest.importorskip("yaml")

YAML_TEXT = """\
# Example plan (invented): warm-up of a water sample at the lab's bench pressure
format: phasepath route file
version: 1
substance: water
title: Bench warm-up
notes: invented demo route
start: {T: 20 degC, p: 1 atm}
legs:
  - {kind: isobar, T: 120 degC}
  - {kind: isotherm, p: 3 bar}
"""


def _routes() -> dict[str, pp.Route]:
    return {
        "water-units-as-typed": pp.Route(
            "water", T="20 degC", p="1 atm", title="Bench", notes="line one\nline two"
        )
        .isobar(T="120 degC")
        .isotherm(p="3 bar"),
        "water-numbers-si": pp.Route("water", T=293.15, p=101325).isobar(T=400),
        "co2-valve": pp.Route("CO2", T="40 degC", p="100 bar").isenthalp(p="20 bar"),
        "nitrogen-psi": pp.Route("nitrogen", T="-180 degC", p="14.7 psi").isotherm(p="10 bar"),
    }


@pytest.mark.parametrize("fmt", ["json", "yaml"])
@pytest.mark.parametrize("name", list(_routes()))
def test_round_trip_keeps_values_as_typed(name: str, fmt: str) -> None:
    route = _routes()[name]
    text = io.dumps_route(route, fmt)
    back = io.loads_route(text, fmt)
    assert back.to_dict() == route.to_dict()
    assert back.corners() == route.corners()  # exact: the same text is parsed the same way


def test_yaml_file_reads_with_units_as_written(tmp_path) -> None:
    path = tmp_path / "bench.yaml"
    path.write_text(YAML_TEXT, encoding="utf-8")
    route = pp.Route.load(path)
    assert route.title == "Bench warm-up"
    assert route.start.given == {"T": "20 degC", "p": "1 atm"}
    assert [leg.given for leg in route.legs] == [{"T": "120 degC"}, {"p": "3 bar"}]


@pytest.mark.parametrize("suffix", [".json", ".yaml", ".yml"])
def test_save_then_load_by_suffix(tmp_path, suffix: str) -> None:
    route = _routes()["co2-valve"]
    path = route.save(tmp_path / f"plan{suffix}")
    text = path.read_text(encoding="utf-8")
    assert ("{" if suffix == ".json" else "format: phasepath route file") in text
    assert pp.Route.load(path).to_dict() == route.to_dict()


def test_save_refuses_unknown_suffix(tmp_path) -> None:
    with pytest.raises(RouteFileError, match=r"\.txt"):
        io.save_route(_routes()["water-numbers-si"], tmp_path / "plan.txt")


def _line_of(text: str, needle: str) -> int:
    return text[: text.index(needle)].count("\n") + 1


# (id, edit of the YAML text, field named, text the line must contain, message part)
YAML_CASES = [
    ("unknown-top-field", lambda t: t + "colour: red\n", "colour", "colour: red", "unknown field"),
    (
        "unknown-leg-field",
        lambda t: t.replace("T: 120 degC}", "T: 120 degC, speed: 3}"),
        "legs[0].speed (leg 1)",
        "speed: 3",
        "unknown field",
    ),
    (
        "wrong-unit",
        lambda t: t.replace("p: 3 bar", "p: 3 degC"),
        "legs[1].p (leg 2)",
        "p: 3 degC",
        "is a temperature, not a pressure",
    ),
    (
        "unknown-unit",
        lambda t: t.replace("T: 120 degC", "T: 120 blorps"),
        "legs[0].T (leg 1)",
        "120 blorps",
        "unknown unit",
    ),
    (
        "missing-leg-target",
        lambda t: t.replace("{kind: isotherm, p: 3 bar}", "{kind: isotherm}"),
        "legs[1] (leg 2)",
        "kind: isotherm",
        "missing value",
    ),
    ("empty-value", lambda t: t.replace("p: 1 atm}", "p: }"), "start.p", "p: }", "missing value"),
    (
        "missing-start",
        lambda t: t.replace("start: {T: 20 degC, p: 1 atm}\n", ""),
        "start",
        None,
        "required",
    ),
    (
        "unknown-kind",
        lambda t: t.replace("kind: isobar", "kind: isobaric"),
        "legs[0].kind (leg 1)",
        "isobaric",
        "unknown leg kind",
    ),
    (
        "two-targets",
        lambda t: t.replace("T: 120 degC}", "T: 120 degC, until: fully vapor}"),
        "legs[0].until (leg 1)",
        "until: fully vapor",
        "only one",
    ),
    (
        "out-of-range",
        lambda t: t.replace("T: 120 degC", "T: 9000 K"),
        "legs[0].T (leg 1)",
        "9000 K",
        "above the highest temperature",
    ),
    (
        "unknown-substance",
        lambda t: t.replace("substance: water", "substance: unobtainium"),
        "substance",
        "unobtainium",
        "unknown substance",
    ),
    (
        "not-text",
        lambda t: t.replace("substance: water", "substance: NO"),
        "substance",
        "substance: NO",
        "quotes",
    ),
    (
        "newer-version",
        lambda t: t.replace("version: 1", "version: 7"),
        "version",
        "version: 7",
        "newer phasepath",
    ),
    (
        "wrong-format",
        lambda t: t.replace("format: phasepath route file", "format: other"),
        "format",
        "format: other",
        "not a phasepath route file",
    ),
]


@pytest.mark.parametrize("case", YAML_CASES, ids=[c[0] for c in YAML_CASES])
def test_yaml_errors_name_field_and_line(case) -> None:
    _, edit, field, line_text, message = case
    text = edit(YAML_TEXT)
    with pytest.raises(RouteFileError) as info:
        io.loads_route(text, "yaml", source="plan.yaml")
    exc = info.value
    assert exc.field == field
    assert message in str(exc)
    assert str(exc).startswith("plan.yaml:")
    if line_text is not None:
        assert exc.line == _line_of(text, line_text)
    assert "Traceback" not in str(exc)


def test_json_errors_name_field_and_line() -> None:
    text = io.dumps_route(_routes()["water-units-as-typed"], "json")
    bad = text.replace('"p": "3 bar"', '"p": "3 kJ/kg"')
    with pytest.raises(RouteFileError) as info:
        io.loads_route(bad, "json")
    assert info.value.field == "legs[1].p (leg 2)"
    assert info.value.line == _line_of(bad, '"p": "3 kJ/kg"')
    bad = text.replace('"kind": "isotherm",', '"kind": "isotherm", "extra": 1,')
    with pytest.raises(RouteFileError) as info:
        io.loads_route(bad, "json")
    assert info.value.field == "legs[1].extra (leg 2)"
    assert info.value.line == _line_of(bad, '"extra"')


@pytest.mark.parametrize(
    "text, message",
    [
        ('{"format": "phasepath route file", "format": "x"}', "appears twice"),
        ('{"format": NaN}', "NaN is not allowed"),
        ('{"format": "phasepath route file",\n "version": 1,', "not valid JSON"),
        ("[1, 2]", "one mapping of fields"),
    ],
    ids=["duplicate-key", "nan", "truncated", "not-a-mapping"],
)
def test_json_syntax_errors(text: str, message: str) -> None:
    with pytest.raises(RouteFileError, match=message):
        io.loads_route(text, "json")


def test_yaml_duplicate_key_named_with_line() -> None:
    text = YAML_TEXT.replace("title: Bench warm-up\n", "title: Bench warm-up\ntitle: again\n")
    with pytest.raises(RouteFileError, match="appears twice") as info:
        io.loads_route(text, "yaml")
    assert info.value.line == _line_of(text, "title: again")


def test_yaml_never_executes_anything(tmp_path) -> None:
    marker = tmp_path / "ran"
    text = YAML_TEXT + f"title2: !!python/object/apply:os.system ['touch {marker}']\n"
    with pytest.raises(RouteFileError, match="not valid YAML"):
        io.loads_route(text, "yaml")
    assert not marker.exists()


def test_yaml_aliases_refused() -> None:
    # a "billion laughs" style document must be refused before it is expanded
    text = "a: &a [x, x, x]\nb: &b [*a, *a, *a]\nc: [*b, *b, *b]\n"
    with pytest.raises(RouteFileError, match="aliases") as info:
        io.loads_route(text, "yaml")
    assert info.value.line == 2


def test_oversize_file_refused_before_parsing(tmp_path) -> None:
    path = tmp_path / "huge.yaml"
    path.write_bytes(b"#" * (io.MAX_BYTES + 1))
    with pytest.raises(RouteFileError, match="more than"):
        io.load_route(path)
    with pytest.raises(RouteFileError, match="more than"):
        io.loads_route("#" * (io.MAX_BYTES + 1), "yaml")


def test_missing_and_binary_files(tmp_path) -> None:
    with pytest.raises(RouteFileError, match="cannot read"):
        io.load_route(tmp_path / "absent.json")
    path = tmp_path / "binary.json"
    path.write_bytes(b'{"format": "\xff\xfe"}')
    with pytest.raises(RouteFileError, match="not UTF-8"):
        io.load_route(path)


def test_every_leg_kind_has_file_fields() -> None:
    """The schema offers every leg kind of the table of leg kinds, with exactly its targets."""
    from phasepath.records import LEG_KINDS

    shapes = io.schema()["properties"]["legs"]["items"]["oneOf"]
    fields = {
        shape["properties"]["kind"]["const"]: set(shape["properties"]) - {"kind"}
        for shape in shapes
    }
    assert fields == {name: set(kind.targets) for name, kind in LEG_KINDS.items()}


# -- the JSON Schema, cross-checked with an independent validator --------------------------------
jsonschema = pytest.importorskip("jsonschema")


def _validator():
    schema = io.schema()
    jsonschema.Draft202012Validator.check_schema(schema)
    return jsonschema.Draft202012Validator(schema)


@pytest.mark.parametrize("name", list(_routes()))
def test_written_files_satisfy_the_schema(name: str) -> None:
    doc = json.loads(io.dumps_route(_routes()[name], "json"))
    assert list(_validator().iter_errors(doc)) == []


@pytest.mark.parametrize(
    "case",
    [
        c
        for c in YAML_CASES
        if c[0]
        in (
            "unknown-top-field",
            "unknown-leg-field",
            "missing-leg-target",
            "missing-start",
            "unknown-kind",
            "two-targets",
            "not-text",
            "newer-version",
            "wrong-format",
            "empty-value",
        )
    ],
    ids=lambda c: c[0],
)
def test_schema_rejects_what_the_reader_rejects(case) -> None:
    doc = yaml.safe_load(case[1](YAML_TEXT))
    assert list(_validator().iter_errors(doc)), case[0]


def test_schema_accepts_the_readme_example() -> None:
    assert list(_validator().iter_errors(yaml.safe_load(YAML_TEXT))) == []


# -- a loaded file gives the physics of the plan -------------------------------------------------
def test_loaded_route_boils_where_iapws95_says() -> None:
    """Water at 1 atm boils at the IAPWS-95 saturation temperature (iapws library, R6-95(2018)).

    Tolerance 1e-3 K: CoolProp and the iapws package implement the same IAPWS-95 equation.
    """
    iapws = pytest.importorskip("iapws")
    route = io.loads_route(YAML_TEXT, "yaml")
    boil = [c for c in route.analyze().crossings if c.kind == "vaporization"]
    assert len(boil) == 1
    T_ref = iapws.IAPWS95(P=0.101325, x=0.0).T
    assert boil[0].T == pytest.approx(T_ref, abs=1e-3)
