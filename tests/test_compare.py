"""Comparing results: ``phasepath check`` on every field a review signs off, ``pp.compare`` and
``phasepath diff`` between two plans, and their exit codes.

Every case is built so that its outcome is known by construction: an expected file written by
phasepath itself (a regression pin) with one field moved by a chosen amount beyond or within its
tolerance, or two plans that differ in one known way (an extra leg, a vent that stops above the
triple-point pressure and so forms no dry ice). The triple-point pressure of CO2, 5.18 bar, is
from Span & Wagner (1996), J. Phys. Chem. Ref. Data 25, 1509, table 3 (0.51795 MPa); the vent
plans sit well clear of it.
"""

from __future__ import annotations

import json

import pytest

import phasepath as pp
from phasepath import cli, comparison, results

ROUTE = """\
format: phasepath route file
version: 1
substance: CO2
title: Cylinder vent (invented demo)
start: {T: 20 degC, p: 60 bar}
legs:
  - {kind: isobar, T: 10 degC}
  - {kind: isenthalp, p: 1 atm}
"""

# the same vessel vented only to 10 bar (above the triple-point pressure: no dry ice)
ROUTE_B = ROUTE.replace("p: 1 atm", "p: 10 bar").replace("Cylinder vent", "Vent to 10 bar")
# plan A with one more leg: the vented gas warmed back to 20 degC
ROUTE_EXTRA = ROUTE + "  - {kind: isobar, T: 20 degC}\n"


def run(capsys, *argv: str) -> tuple[int, str, str]:
    code = cli.main(list(argv))
    out, err = capsys.readouterr()
    return code, out, err


@pytest.fixture(scope="module")
def files(tmp_path_factory):
    d = tmp_path_factory.mktemp("compare")
    paths = {}
    for name, text in (("a", ROUTE), ("b", ROUTE_B), ("extra", ROUTE_EXTRA)):
        paths[name] = d / f"{name}.yaml"
        paths[name].write_text(text, encoding="utf-8")
    paths["expected"] = d / "a.expected.json"
    assert (
        cli.main(["analyze", str(paths["a"]), "--format", "json", "-o", str(paths["expected"])])
        == 0
    )
    return paths


@pytest.fixture(scope="module")
def doc(files):
    return json.loads(files["expected"].read_text(encoding="utf-8"))


def _check_with(capsys, files, doc, tmp_path, edit, *options):
    d = json.loads(json.dumps(doc))
    edit(d)
    path = tmp_path / "expected.json"
    path.write_text(json.dumps(d), encoding="utf-8")
    return run(capsys, "check", str(files["a"]), str(path), *options)


def test_plan_has_what_the_cases_need(doc) -> None:
    """The demo plan: leg 1 subcools the liquid, leg 2 vents it through a valve into dry ice and
    vapor (solid-formation on a flowing leg)."""
    assert [g["kind"] for g in doc["legs"]] == ["isobar", "isenthalp"]
    assert doc["legs"][1]["end"]["phase"] == "solid+vapor"
    assert any(h["kind"] == "solid-formation" for c in doc["crossings"] for h in c["hazards"])


def test_check_unchanged_plan_passes(capsys, files) -> None:
    code, out, _ = run(capsys, "check", str(files["a"]), str(files["expected"]))
    assert code == 0, out
    assert "OK: 2 crossings and 2 legs match within the tolerances" in out


# (id, edit of the expected document, exit code, a line the output must hold)
FIELD_CASES = [
    (
        "heat-moved",
        lambda d: d["legs"][0].__setitem__("heat", d["legs"][0]["heat"] * 1.002),
        1,
        "~ MOVED leg 1 heat: ",
    ),
    (
        "heat-within",
        lambda d: d["legs"][0].__setitem__("heat", d["legs"][0]["heat"] * 1.0005),
        0,
        "OK: ",
    ),
    (
        "work-moved",
        lambda d: d["legs"][0].__setitem__("work", 5000.0),
        1,
        "~ MOVED leg 1 work: 5 -> 0 kJ/kg (change -100 %; tol 0.1 %)",
    ),
    ("work-within-floor", lambda d: d["legs"][0].__setitem__("work", 0.5), 0, "OK: "),
    (
        "heat-undefined",
        lambda d: d["legs"][1].__setitem__("heat", None),
        1,
        "~ CHANGED leg 2 heat: none -> 0",
    ),
    (
        "end-T-moved",
        lambda d: d["legs"][1]["end"].__setitem__("T", d["legs"][1]["end"]["T"] - 0.02),
        1,
        "~ MOVED leg 2 end T: -78.485 -> -78.465 °C (change +0.020 K; tol 0.01 K)",
    ),
    (
        "end-T-within",
        lambda d: d["legs"][1]["end"].__setitem__("T", d["legs"][1]["end"]["T"] - 0.004),
        0,
        "OK: ",
    ),
    (
        "end-p-moved",
        lambda d: d["legs"][0]["end"].__setitem__("p", 6.1e6),
        1,
        "~ MOVED leg 1 end p: 61 -> 60 bar (change -1.64 %; tol 0.01 %)",
    ),
    (
        "end-phase",
        lambda d: d["legs"][0]["end"].__setitem__("phase", "vapor"),
        1,
        "~ CHANGED leg 1 end phase: vapor -> liquid",
    ),
    (
        "end-ice-form",
        lambda d: d["legs"][1]["end"].__setitem__("form", "Ih"),
        1,
        "~ CHANGED leg 2 end ice form: Ih -> none",
    ),
    (
        "vapor-fraction",
        lambda d: d["legs"][1]["end"].__setitem__(
            "vapor_fraction", d["legs"][1]["end"]["vapor_fraction"] + 0.01
        ),
        1,
        "~ MOVED leg 2 end vapor fraction: ",
    ),
    (
        "solid-fraction-within",
        lambda d: d["legs"][1]["end"].__setitem__(
            "solid_fraction", d["legs"][1]["end"]["solid_fraction"] + 0.0005
        ),
        0,
        "OK: ",
    ),
    (
        "solid-fraction-moved",
        lambda d: d["legs"][1]["end"].__setitem__(
            "solid_fraction", d["legs"][1]["end"]["solid_fraction"] - 0.002
        ),
        1,
        "(change +0.0020; tol 0.001)",
    ),
    (
        "hazard-appeared",
        lambda d: [c["hazards"].clear() for c in d["crossings"]],
        1,
        "+ APPEARED leg 2 hazard solid-formation",
    ),
    (
        "hazard-disappeared",
        lambda d: d["legs"][0]["hazards"].append(
            {"kind": "cryogenic", "reason": "r", "caution": "c"}
        ),
        1,
        "- DISAPPEARED leg 1 hazard cryogenic",
    ),
    ("leg-appeared", lambda d: d["legs"].pop(), 1, "+ APPEARED leg 2 isenthalp: ends at T = "),
    (
        "leg-disappeared",
        lambda d: d["legs"].append({**d["legs"][1], "step": 3, "kind": "isobar"}),
        1,
        "- DISAPPEARED leg 3 isobar: ends at",
    ),
    (
        "kind-changed",
        lambda d: d["legs"][0].__setitem__("kind", "isotherm"),
        1,
        "~ CHANGED leg 1 kind: isotherm -> isobar",
    ),
    (
        "start-moved",
        lambda d: d["legs"][0]["start"].__setitem__("T", 290.0),
        1,
        "~ MOVED leg 1 start T: 16.850 -> 20.000 °C (change +3.150 K; tol 0.01 K)",
    ),
    (
        "basis-changed",
        lambda d: d["legs"][1].__setitem__("basis", "closed"),
        1,
        "~ CHANGED leg 2 basis: closed -> steady-flow",
    ),
]


@pytest.mark.parametrize(
    "edit, code, line", [c[1:] for c in FIELD_CASES], ids=[c[0] for c in FIELD_CASES]
)
def test_check_each_field(capsys, files, doc, tmp_path, edit, code, line) -> None:
    got, out, err = _check_with(capsys, files, doc, tmp_path, edit)
    assert got == code, out
    assert line in out, out
    if code == 1:
        assert "FAILED: " in out and "FAILED" in err and err.count("\n") == 1


def test_only_crossings_keeps_the_crossing_check(capsys, files, doc, tmp_path) -> None:
    """--only crossings: a changed heat or hazard passes, a moved crossing still fails."""

    def edit(d):
        d["legs"][0]["heat"] *= 1.5
        d["legs"][0]["hazards"] = []

    code, out, _ = _check_with(capsys, files, doc, tmp_path, edit, "--only", "crossings")
    assert code == 0 and "OK: all 2 crossings match within the tolerances" in out

    def move(d):
        d["crossings"][0]["T"] += 1.0

    code, out, _ = _check_with(capsys, files, doc, tmp_path, move, "--only", "crossings")
    assert code == 1 and "~ MOVED leg 2 vaporization (liquid -> liquid+vapor): T " in out
    assert "(2 crossings expected, 2 crossings found)" in out
    code, out, _ = _check_with(capsys, files, doc, tmp_path, edit, "--only", "legs")
    assert code == 1 and "MOVED leg 1 heat" in out and "hazard" not in out
    code, out, _ = _check_with(capsys, files, doc, tmp_path, edit, "--only", "hazards")
    assert code == 1 and "APPEARED leg 1 hazard pressurized" in out and "leg 1 heat" not in out


def test_tolerance_options_do_what_they_say(capsys, files, doc, tmp_path) -> None:
    def edit(d):
        d["legs"][0]["heat"] *= 1.002
        d["legs"][1]["end"]["vapor_fraction"] += 0.01

    code, out, _ = _check_with(capsys, files, doc, tmp_path, edit)
    assert code == 1 and "2 moved" in out
    code, out, _ = _check_with(
        capsys, files, doc, tmp_path, edit, "--tol-energy", "0.01", "--tol-fraction", "0.02"
    )
    assert code == 0, out
    assert "heat and work 1 %" in out and "fractions 0.02" in out
    # an absolute floor of heat above the change lets it pass too
    code, out, _ = _check_with(
        capsys, files, doc, tmp_path, edit, "--tol-energy-abs", "1e6", "--tol-fraction", "0.02"
    )
    assert code == 0, out


def test_check_names_changed_versions(capsys, files, doc, tmp_path) -> None:
    def old(d):
        d["coolprop"] = "7.0.0"

    code, out, _ = _check_with(capsys, files, doc, tmp_path, old)
    assert code == 0
    assert "! VERSION CoolProp: expected file from 7.0.0, this run " in out
    assert "re-baseline" in out

    def old_and_moved(d):
        d["coolprop"] = "7.0.0"
        d["phasepath"] = "0.0.1"
        d["legs"][0]["heat"] *= 1.01

    code, out, err = _check_with(capsys, files, doc, tmp_path, old_and_moved)
    assert code == 1
    assert "versions changed (phasepath 0.0.1 -> " in out and "CoolProp 7.0.0 -> " in out
    assert "CoolProp 7.0.0 -> " in err


# -- two plans ---------------------------------------------------------------------------------
@pytest.fixture(scope="module")
def plans(files):
    return {k: pp.Route.load(files[k]) for k in ("a", "b", "extra")}


def test_identical_plans_agree(plans) -> None:
    cmp = pp.compare(plans["a"], plans["a"].copy())
    assert cmp.agree and cmp.differences == ()
    assert "AGREE" in cmp.text()
    assert list(cmp.table().columns)[1:3] == ["difference", "leg"] and cmp.table().empty


def test_a_lost_hazard_and_a_moved_end_show_with_their_sign(plans) -> None:
    """Venting only to 10 bar (B) loses the dry-ice flag of A: '-' for the hazard, '~' for the
    moved end pressure, '-' for the deposition crossing."""
    cmp = pp.compare(plans["a"], plans["b"])
    assert not cmp.agree
    by = {(d.item, d.field): d for d in cmp.differences}
    lost = by[("hazard", "solid-formation")]
    assert lost.sign == "-" and lost.status == "disappeared" and lost.leg == 2
    end_p = by[("leg", "end p")]
    assert end_p.sign == "~" and end_p.b > end_p.a  # B ends higher
    gone = [d for d in cmp.differences if d.item == "crossing" and "deposition" in d.field]
    assert gone and all(d.sign == "-" for d in gone)
    # and the other way round, the hazard is gained
    back = pp.compare(plans["b"], plans["a"])
    gained = [d for d in back.differences if d.item == "hazard" and d.field == "solid-formation"]
    assert gained and gained[0].sign == "+"


def test_a_moved_crossing_has_the_right_sign() -> None:
    """Heating liquid water at 2 bar instead of 1 atm: the boiling crossing moves up in T and p
    (saturation temperature rises with pressure, common practice)."""
    a = pp.Route("water", T="20 degC", p="1 atm").isobar(T="150 degC")
    b = pp.Route("water", T="20 degC", p="2 bar").isobar(T="150 degC")
    d = next(x for x in pp.compare(a, b).differences if x.item == "crossing")
    assert d.status == "moved" and d.sign == "~" and set(d.reasons) >= {"T", "p"}
    assert d.b["T"] > d.a["T"] and d.b["p"] > d.a["p"]
    line = comparison.describe(d)
    assert line.startswith("~ MOVED leg 1 vaporization (liquid -> vapor): T 99.974 -> ")
    assert "(change +" in line


def test_an_extra_leg_appears(plans) -> None:
    cmp = pp.compare(plans["a"], plans["extra"])
    legs = [d for d in cmp.differences if d.item == "leg" and not d.field]
    assert [(d.sign, d.leg) for d in legs] == [("+", 3)]
    back = pp.compare(plans["extra"], plans["a"])
    assert [(d.sign, d.leg) for d in back.differences if d.item == "leg" and not d.field] == [
        ("-", 3)
    ]


def test_compare_options_and_refusals(plans) -> None:
    cmp = pp.compare(plans["a"], plans["b"], only=["hazards"])
    assert {d.item for d in cmp.differences} == {"hazard"}
    loose = comparison.Tolerances(p=10.0, T=1000.0, energy=10.0, fraction=1.0, latent=10.0)
    assert pp.compare(plans["a"], plans["a"], tolerances=loose).agree
    with pytest.raises(pp.PhasePathError, match="tolerance T"):
        comparison.Tolerances(T=-1.0)
    with pytest.raises(pp.PhasePathError, match="tolerance p"):
        comparison.Tolerances(p=float("nan"))
    with pytest.raises(pp.PhasePathError, match="cannot compare only 'heat'"):
        pp.compare(plans["a"], plans["b"], only=["heat"])
    with pytest.raises(pp.PhasePathError, match="not a Route or a Report"):
        pp.compare(plans["a"], "plan.yaml")
    report = plans["a"].analyze()
    assert pp.compare(report, plans["a"]).agree  # a report is taken as it is


def test_diff_exit_codes(capsys, files, tmp_path) -> None:
    code, out, _ = run(capsys, "diff", str(files["a"]), str(files["a"]))
    assert code == 0 and "AGREE" in out
    code, out, _ = run(capsys, "diff", str(files["a"]), str(files["b"]))
    assert code == 1
    assert "- DISAPPEARED leg 2 hazard solid-formation" in out
    assert out.rstrip().splitlines()[-1].startswith("DIFFER: ")
    code, out, _ = run(capsys, "diff", str(files["a"]), str(files["extra"]))
    assert code == 1 and "+ APPEARED leg 3 isobar" in out
    code, out, _ = run(
        capsys,
        "diff",
        str(files["a"]),
        str(files["b"]),
        "--only",
        "crossings",
        "--tol-T",
        "1000",
        "--tol-p",
        "100",
        "--tol-latent",
        "100",
    )
    assert code == 1 and "DISAPPEARED" in out and "hazard" not in out
    for argv, message in (
        (["diff", str(files["a"]), "missing.yaml"], "cannot read the file"),
        (["diff", str(files["a"]), str(files["b"]), "--only", "heat"], "choose from crossings"),
        (["diff", str(files["a"]), str(files["b"]), "--tol-T", "-1"], "not a finite number >= 0"),
        (["diff", str(files["a"]), str(files["b"]), "--format", "html"], "give -o FILE.html"),
        (["diff", str(files["a"]), str(files["b"]), "-o", str(files["a"])], "one of the command"),
        (["diff", str(files["a"])], "the following arguments are required"),
    ):
        code, out, err = run(capsys, *argv)
        assert code == 2, argv
        assert message in err and err.count("\n") == 1 and "Traceback" not in err, err


def test_diff_html_writes_the_side_by_side_report(capsys, files, tmp_path) -> None:
    pytest.importorskip("matplotlib")
    out_file = tmp_path / "diff.html"
    code, out, _ = run(
        capsys, "diff", str(files["a"]), str(files["b"]), "--format", "html", "-o", str(out_file)
    )
    assert code == 1 and "wrote" in out and "DIFFER" in out
    text = out_file.read_text(encoding="utf-8")
    assert "Cylinder vent (invented demo)" in text and "Vent to 10 bar" in text
    assert "class='pp-table pp-diffs'" in text and "solid-formation" in text
    assert text.count("<svg") == 1  # both plans on one diagram
    assert text.count("<table class='pp-table pp-x'>") == 2  # each plan's crossings
    code, _, _ = run(
        capsys, "diff", str(files["a"]), str(files["a"]), "--format", "html", "-o", str(out_file)
    )
    assert code == 0 and "agree within the tolerances" in out_file.read_text(encoding="utf-8")


def test_results_round_trip_compare_equal(files) -> None:
    """The engine on a file read back and on the live document finds nothing."""
    route = pp.Route.load(files["a"])
    live = results.document(route.analyze())
    assert comparison.compare_documents(results.read(files["expected"]), live) == []
