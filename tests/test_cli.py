"""The command line: analyze, check (fails loudly on a moved crossing), diagram, errors.

Check values: the normal boiling point and the ice-point of water under 1 atm are taken from
the independent ``iapws`` library (IAPWS-95, IAPWS R6-95(2018); IAPWS R14-08 for melting).
The ``check`` tests perturb a results file written by phasepath itself (a regression pin by
construction) and assert that the command notices.
"""

from __future__ import annotations

import csv
import io as stdio
import json
import shutil
import subprocess
import sys

import pytest

from phasepath import cli, results

ROUTE = """\
format: phasepath route file
version: 1
substance: water
title: Kettle check (invented demo)
start: {T: -5 degC, p: 1 atm}
legs:
  - {kind: isobar, T: 110 degC}
"""


@pytest.fixture(scope="module")
def files(tmp_path_factory):
    d = tmp_path_factory.mktemp("cli")
    route = d / "kettle.yaml"
    route.write_text(ROUTE, encoding="utf-8")
    expected = d / "kettle.expected.json"
    assert cli.main(["analyze", str(route), "--format", "json", "-o", str(expected)]) == 0
    return route, expected


def run(capsys, *argv: str) -> tuple[int, str, str]:
    code = cli.main(list(argv))
    out, err = capsys.readouterr()
    return code, out, err


def test_analyze_table(capsys, files) -> None:
    code, out, err = run(capsys, "analyze", str(files[0]), "--units", "K,kPa")
    assert code == 0 and err == ""
    assert out.startswith("Kettle check (invented demo) (Water, 1 leg)")
    assert "T [K]" in out and "p [kPa]" in out
    lines = [ln for ln in out.splitlines() if ln.lstrip().startswith("1  ")]
    assert [ln.split()[1] for ln in lines[:2]] == ["melting", "vaporization"]


def test_analyze_json_matches_iapws(files) -> None:
    """Crossings in the results file agree with IAPWS (iapws library) at 1 atm.

    Boiling: IAPWS-95 saturation temperature at 0.101325 MPa, tolerance 1e-3 K (same equation).
    Melting: IAPWS R14-08 ice Ih melting curve at 0.101325 MPa (iapws._Melting_Pressure),
    inverted here; tolerance 1e-3 K.
    """
    iapws = pytest.importorskip("iapws")
    from scipy.optimize import brentq

    doc = json.loads(files[1].read_text(encoding="utf-8"))
    assert doc["format"] == results.FORMAT and doc["version"] == results.VERSION
    kinds = {c["kind"]: c for c in doc["crossings"]}
    assert kinds["vaporization"]["T"] == pytest.approx(iapws.IAPWS95(P=0.101325, x=0.0).T, abs=1e-3)
    from iapws._iapws import _Melting_Pressure

    T_melt = brentq(lambda T: _Melting_Pressure(T, "Ih") - 0.101325, 272.0, 273.16)
    assert kinds["melting"]["T"] == pytest.approx(T_melt, abs=1e-3)


def test_analyze_csv(capsys, files) -> None:
    code, out, _ = run(
        capsys, "analyze", str(files[0]), "--format", "csv", "--units", "degF,psi,Btu/lb"
    )
    assert code == 0
    rows = list(csv.DictReader(stdio.StringIO(out)))
    assert [r["kind"] for r in rows] == ["melting", "vaporization"]
    # 1 atm boiling on ITS-90 is 99.974 degC = 211.953 degF (IAPWS-95 via the iapws library,
    # converted with F = (K - 273.15) * 9/5 + 32, common practice); tolerance 0.002 degF
    iapws = pytest.importorskip("iapws")
    T_F = (iapws.IAPWS95(P=0.101325, x=0.0).T - 273.15) * 9.0 / 5.0 + 32.0
    assert float(rows[1]["T [°F]"]) == pytest.approx(T_F, abs=0.002)
    code, out, _ = run(capsys, "analyze", str(files[0]), "--format", "csv", "--legs")
    assert code == 0 and out.splitlines()[0].startswith("leg,kind,ends,T start")


def test_check_passes_on_unchanged_plan(capsys, files) -> None:
    code, out, _ = run(capsys, "check", str(files[0]), str(files[1]))
    assert code == 0
    assert "OK: 2 crossings and 1 leg match within the tolerances" in out


def _perturbed(files, tmp_path, edit) -> str:
    doc = json.loads(files[1].read_text(encoding="utf-8"))
    edit(doc["crossings"])
    path = tmp_path / "expected.json"
    path.write_text(json.dumps(doc), encoding="utf-8")
    return str(path)


def test_check_fails_loudly_on_moved_crossing(capsys, files, tmp_path) -> None:
    def shift(cs):
        cs[1]["T"] += 0.5  # the expected boiling point 0.5 K away from today's result

    expected = _perturbed(files, tmp_path, shift)
    code, out, err = run(capsys, "check", str(files[0]), expected)
    assert code == 1
    assert "~ MOVED leg 1 vaporization (liquid -> vapor): T 100.474 -> 99.974 °C" in out
    assert "change -0.500 K; tol 0.01 K" in out
    assert "FAILED: 1 moved" in out
    assert "FAILED" in err  # one loud line on stderr too, for CI logs


@pytest.mark.parametrize(
    "dT, tol, code", [(0.004, "0.01", 0), (0.02, "0.01", 1), (0.02, "0.05", 0)]
)
def test_check_tolerance_is_what_it_says(capsys, files, tmp_path, dT, tol, code) -> None:
    def shift(cs):
        cs[0]["T"] += dT

    expected = _perturbed(files, tmp_path, shift)
    assert run(capsys, "check", str(files[0]), expected, "--tol-T", tol)[0] == code


def test_check_pressure_and_latent_heat(capsys, files, tmp_path) -> None:
    def shift(cs):
        cs[1]["p"] *= 1.001
        cs[1]["latent_heat"] *= 1.01

    code, out, _ = run(capsys, "check", str(files[0]), _perturbed(files, tmp_path, shift))
    assert code == 1 and "p 1.0142" in out and "latent heat" in out


def test_check_appeared_and_disappeared(capsys, files, tmp_path) -> None:
    code, out, _ = run(capsys, "check", str(files[0]),
                       _perturbed(files, tmp_path, lambda cs: cs.pop(0)))
    assert code == 1 and "+ APPEARED leg 1 melting" in out

    def extra(cs):
        cs.append({**cs[1], "kind": "condensation", "from_phase": "vapor", "to_phase": "liquid"})

    code, out, _ = run(capsys, "check", str(files[0]), _perturbed(files, tmp_path, extra))
    assert code == 1 and "- DISAPPEARED leg 1 condensation" in out


def test_compare_crossings_pairs_in_order() -> None:
    a = {
        "step": 1,
        "kind": "melting",
        "from_phase": "solid",
        "to_phase": "liquid",
        "T": 1.0,
        "p": 1.0,
        "latent_heat": None,
        "boundary": "b",
    }
    b = {**a, "T": 2.0}
    assert results.compare_crossings([a, b], [a, b]) == []
    diffs = results.compare_crossings([a, b], [a])
    assert [d["status"] for d in diffs] == ["disappeared"] and diffs[0]["expected"] == b


@pytest.mark.parametrize(
    "argv, message",
    [
        (["analyze", "no-such-file.yaml"], "cannot read the file"),
        (["analyze", "{route}", "--units", "degC,furlongs"], "unknown display unit 'furlongs'"),
        (["check", "{route}", "{route}"], "not valid JSON"),
        (["diagram", "water", "-o", "plot.pdf"], ".svg or .png"),
        (["diagram", "unobtainium", "-o", "plot.svg"], "unknown substance"),
    ],
    ids=["missing-file", "bad-units", "not-results", "bad-suffix", "bad-substance"],
)
def test_errors_are_one_line_exit_2(capsys, files, argv, message) -> None:
    argv = [a.replace("{route}", str(files[0])) for a in argv]
    code, out, err = run(capsys, *argv)
    assert code == 2
    assert message in err
    assert err.count("\n") == 1 and err.startswith("phasepath: error: ")
    assert "Traceback" not in err + out


def test_diagram_svg_and_png(capsys, files, tmp_path) -> None:
    pytest.importorskip("matplotlib")
    svg = tmp_path / "water.svg"
    code, _, _ = run(
        capsys, "diagram", "water", "-o", str(svg), "--route", str(files[0]), "--units", "degC,bar"
    )
    assert code == 0
    text = svg.read_text(encoding="utf-8")
    assert text.lstrip().startswith("<?xml") and "<svg" in text
    svg2 = tmp_path / "again.svg"
    assert (
        run(
            capsys,
            "diagram",
            "water",
            "-o",
            str(svg2),
            "--route",
            str(files[0]),
            "--units",
            "degC,bar",
        )[0]
        == 0
    )
    assert svg2.read_text(encoding="utf-8") == text  # reproducible for reports under review
    png = tmp_path / "water.png"
    assert run(capsys, "diagram", "water", "-o", str(png))[0] == 0
    assert png.read_bytes()[:8] == b"\x89PNG\r\n\x1a\n"


def test_console_script(files) -> None:
    exe = shutil.which("phasepath")
    if exe is None:
        pytest.skip("phasepath is not installed as a command in this environment")
    proc = subprocess.run(
        [exe, "check", str(files[0]), str(files[1])], capture_output=True, text=True, timeout=300
    )
    assert proc.returncode == 0, proc.stderr
    proc = subprocess.run(
        [sys.executable, "-m", "phasepath.cli", "analyze", "missing.yaml"],
        capture_output=True,
        text=True,
        timeout=300,
    )
    assert proc.returncode == 2 and "Traceback" not in proc.stderr


def test_shipped_plan_still_matches_its_expected_results(capsys) -> None:
    """The staged-letdown plan of the CO2 notebook against its saved results.

    The expected file is a regression pin (written by ``phasepath analyze --format json``):
    this is the check a team runs in CI to keep a plan under review.
    """
    from pathlib import Path

    routes = Path(__file__).resolve().parents[1] / "notebooks" / "routes"
    code, out, _ = run(
        capsys,
        "check",
        str(routes / "ex2_staged_letdown.yaml"),
        str(routes / "ex2_staged_letdown.expected.json"),
    )
    assert code == 0, out
