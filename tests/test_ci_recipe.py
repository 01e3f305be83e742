"""The CI recipe of the README, run as written (``examples/ci/ci-check.sh``).

The plan and its expected results in ``examples/ci/plans`` are an invented demo; the expected
file is written by phasepath itself (a regression pin). The recipe must pass on the plan as
reviewed, fail with status 1 when the expected results are moved, and its nbval line must find
the sanitizer shipped inside the installed package.
"""

from __future__ import annotations

import json
import os
import shutil
import subprocess
import sys
from pathlib import Path

import pytest

REPO = Path(__file__).resolve().parents[1]
RECIPE = REPO / "examples" / "ci"


def _lines() -> list[str]:
    text = (RECIPE / "ci-check.sh").read_text(encoding="utf-8")
    return [ln for ln in text.splitlines() if ln and not ln.startswith(("#", "set "))]


def _run(line: str, cwd: Path) -> subprocess.CompletedProcess[str]:
    env = dict(os.environ)
    env["PATH"] = str(Path(sys.executable).parent) + os.pathsep + env.get("PATH", "")
    return subprocess.run(
        ["bash", "-c", line], cwd=cwd, env=env, capture_output=True, text=True, timeout=600
    )


def test_the_readme_shows_the_recipe_as_tested() -> None:
    readme = (REPO / "README.md").read_text(encoding="utf-8")
    lines = _lines()
    assert [ln.split()[0] for ln in lines] == ["phasepath", "pytest"]
    for line in lines:
        assert line in readme, line


def test_check_line_passes_and_fails(tmp_path) -> None:
    if shutil.which("phasepath", path=str(Path(sys.executable).parent)) is None:
        pytest.skip("phasepath is not installed as a command in this environment")
    check = _lines()[0]
    proc = _run(check, RECIPE)
    assert proc.returncode == 0, proc.stdout + proc.stderr
    assert "OK: 1 crossing and 2 legs match within the tolerances" in proc.stdout
    # the same line on a copy whose expected heat of the vaporizer leg is 1 % off
    shutil.copytree(RECIPE / "plans", tmp_path / "plans")
    expected = tmp_path / "plans" / "bv12_plan_b.expected.json"
    doc = json.loads(expected.read_text(encoding="utf-8"))
    doc["legs"][0]["heat"] *= 1.01
    expected.write_text(json.dumps(doc), encoding="utf-8")
    proc = _run(check, tmp_path)
    assert proc.returncode == 1
    assert "~ MOVED leg 1 heat: " in proc.stdout and "FAILED" in proc.stderr


def test_nbval_line_runs_with_the_shipped_sanitizer(tmp_path) -> None:
    pytest.importorskip("nbval")
    line = _lines()[1]
    (tmp_path / "notebooks").mkdir()
    shutil.copy(REPO / "notebooks" / "freeze_drying_cycle.ipynb", tmp_path / "notebooks")
    (tmp_path / "pytest.ini").write_text("[pytest]\n", encoding="utf-8")
    proc = _run(line + " -p no:cacheprovider -q", tmp_path)
    assert proc.returncode == 0, proc.stdout[-3000:] + proc.stderr[-2000:]
    assert " passed" in proc.stdout
