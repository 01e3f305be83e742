"""The layers of the package hold (the import-linter contract in pyproject.toml), with no more than
the three facades that point up, and the cautions are made in one place (the hazards module) and
shown as they are on every surface: the report, the command line and the planner."""

from __future__ import annotations

import html
import re
import subprocess
import sys
from pathlib import Path

import pytest
import tomllib

import phasepath as pp
from phasepath import cli

REPO = Path(__file__).resolve().parents[1]

FACADES = {
    "phasepath.route -> phasepath.analysis",  # Route.analyze
    "phasepath.route -> phasepath.routefile",  # Route.load / Route.save
    "phasepath.substances -> phasepath.catalog",  # Substance.from_data / from_dict
}


def test_layers_contract_holds() -> None:
    linter = Path(sys.executable).with_name("lint-imports")
    if not linter.exists():
        pytest.skip("import-linter is not installed in this environment")
    out = subprocess.run(
        [str(linter), "--config", str(REPO / "pyproject.toml")],
        cwd=REPO,
        capture_output=True,
        text=True,
        timeout=300,
    )
    assert out.returncode == 0, out.stdout + out.stderr
    assert "1 kept, 0 broken" in out.stdout


def test_only_the_three_facades_point_up() -> None:
    config = tomllib.loads((REPO / "pyproject.toml").read_text(encoding="utf-8"))
    (contract,) = config["tool"]["importlinter"]["contracts"]
    assert set(contract["ignore_imports"]) == FACADES
    # every layer names a module or package that exists
    for layer in contract["layers"]:
        for name in re.split(r"[|:]", layer):
            name = name.strip()
            assert (REPO / "phasepath" / f"{name}.py").exists() or (
                REPO / "phasepath" / name / "__init__.py"
            ).exists(), name


# -- cautions: one source, every surface -----------------------------------------------------------
HAZARDOUS = {
    # liquid CO2 vented through a valve to 1 atm: dry-ice snow in the line
    "co2-vent": lambda: pp.Route("CO2", T="20 degC", p="60 bar").isenthalp(p="1 atm"),
    # a CO2 cylinder filled to 750 kg/m3 warmed in the sun: liquid-full, sealed pressure
    "co2-cylinder": lambda: pp.Route("CO2", T="15 degC", density="750 kg/m3").isochore(T="50 degC"),
    # nitrogen cooled to 70 K at 1 bar: cryogenic liquid
    "n2-cooled": lambda: pp.Route("N2", T="300 K", p="1 bar").isobar(T="70 K"),
    # water pressed to 300 MPa at room temperature
    "water-300MPa": lambda: pp.Route("water", T="20 degC", p="1 bar").isotherm(p="300 MPa"),
}


def _cli_cautions(route: pp.Route, tmp_path: Path, capsys: pytest.CaptureFixture[str]) -> list[str]:
    path = tmp_path / "plan.json"
    route.save(path)
    capsys.readouterr()
    assert cli.main(["analyze", str(path)]) == 0
    text = capsys.readouterr().out
    section = text.split("\nCautions\n", 1)[1].split("\n\n", 1)[0]
    return [line[2:] for line in section.splitlines() if line.startswith("- ")]


def _planner_cautions(route: pp.Route) -> list[str]:
    pytest.importorskip("ipywidgets")
    from phasepath.widgets import RoutePlanner

    box = RoutePlanner(route).cautions.value
    return [html.unescape(item) for item in re.findall(r"<li>(.*?)</li>", box, flags=re.S)]


@pytest.mark.parametrize("name", list(HAZARDOUS))
def test_cautions_are_the_same_strings_on_every_surface(name, tmp_path, capsys) -> None:
    route = HAZARDOUS[name]()
    report = route.analyze()
    assert report.cautions, "a hazardous route must carry cautions"
    assert len(set(report.cautions)) == len(report.cautions)  # each once
    assert _cli_cautions(route, tmp_path, capsys) == list(report.cautions)
    assert _planner_cautions(route) == list(report.cautions)
    assert all("local codes" in c for c in report.cautions)  # every caution defers to codes


def test_expected_flags_of_the_hazardous_routes() -> None:
    """The flags where the physics puts them (thresholds: common practice, see hazards.py)."""
    kinds = {
        name: {c.split(" ", 1)[0].rstrip(":") for c in make().analyze().cautions}
        for name, make in HAZARDOUS.items()
    }
    assert {"solid-formation", "asphyxiation"} <= kinds["co2-vent"]
    assert {"liquid-full", "sealed-pressure", "pressurized"} <= kinds["co2-cylinder"]
    assert {"cryogenic", "asphyxiation"} <= kinds["n2-cooled"]
    assert "pressurized" in kinds["water-300MPa"]
    assert "asphyxiation" not in kinds["water-300MPa"]  # water is not a gas at 20 degC, 1 atm
