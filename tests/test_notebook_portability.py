"""The saved outputs of ``notebooks/`` are the same on any machine.

Two checks, neither needing a second machine:

* **digits scan**: no saved output prints a number with more digits than the display-precision
  policy allows (the rule is in ``tests/_digits.py``; a number with more digits than its model
  supports carries the last bits of one machine's floating-point kernels);
* **perturbation run**: each notebook is executed again under nbval, with the shipped sanitizer,
  after a first cell (injected into a copy, never into the package) that moves every output of
  the property library (CoolProp's temperatures, pressures, enthalpies, entropies and densities)
  by a relative 1e-15, multiplies every data-sheet vapor point by (1 + 1e-15) or (1 - 1e-15) and
  reverses the order of those points, as another machine's kernels or another summation order
  would. Every saved output must still match. A canary notebook proves the run can fail: a cell
  that prints a computed pressure with ``repr`` does not survive the perturbation, while the
  same value printed by the policy does.
"""

from __future__ import annotations

import copy
import json
import re
import subprocess
import sys
import xml.etree.ElementTree as ET
from pathlib import Path

import pytest
from _digits import offenders, too_many_digits

REPO = Path(__file__).resolve().parents[1]
NOTEBOOKS = sorted((REPO / "notebooks").glob("*.ipynb"))
SANITIZER = REPO / "phasepath" / "nbval_sanitize.cfg"

PERTURB = r"""
# injected by tests/test_notebook_portability.py (a copy of the notebook; not saved anywhere):
# every property-library output and every data-sheet point moved at the last bits
import json as _json
import CoolProp.CoolProp as _CP

_COUNTS = {"property outputs": 0, "data sheets": 0}
_REL = 1e-15
_OUTPUTS = {"T", "p", "hmass", "smass", "rhomass", "umass", "cpmass", "cvmass", "melting_line"}
_COMPUTED = {_CP.iP, _CP.iT}  # melting_line(iP, iT, T) and (iT, iP, p); not its range limits


class _Perturbed:
    def __init__(self, inner):
        self._inner = inner

    def __getattr__(self, name):
        attr = getattr(self._inner, name)
        if name not in _OUTPUTS:
            return attr

        def call(*args):
            if name == "melting_line" and args[0] not in _COMPUTED:
                return attr(*args)
            _COUNTS["property outputs"] += 1
            return attr(*args) * (1.0 + _REL)

        return call


_AbstractState = _CP.AbstractState
_CP.AbstractState = lambda backend, fluid: _Perturbed(_AbstractState(backend, fluid))

import phasepath as _pp
from phasepath import units as _units

_from_data = _pp.Substance.from_data.__func__


def _moved(points):
    out = []
    for k, (T, p) in enumerate(points):
        T = _units.parse_temperature(T)
        p = _units.parse_pressure(p)
        sign = 1.0 if k % 2 else -1.0
        out.append((T * (1.0 + sign * _REL), p * (1.0 - sign * _REL)))
    return out[::-1]


def _from_data_moved(cls, name, **data):
    if data.get("vapor_points"):
        data["vapor_points"] = _moved(data["vapor_points"])
        _COUNTS["data sheets"] += 1
    return _from_data(cls, name, **data)


_pp.Substance.from_data = classmethod(_from_data_moved)
"""

REPORT_COUNTS = r"""
import json as _json
from pathlib import Path as _Path

_Path("perturbation-counts.json").write_text(_json.dumps(_COUNTS))
"""

CANARY = [
    "import phasepath as pp\nfrom phasepath import format as F\n"
    "rep = pp.Route('CO2', T=250.0, p=20e5).isotherm(p=1e5).analyze()",
    "print(repr(rep.crossings[0].p))  # every bit: another machine differs",
    "print(F.quantity(rep.crossings[0].p, 'pressure', 'bar'))  # the policy: the same anywhere",
]


def _outputs_text(nb: dict) -> list[tuple[int, str]]:
    out = []
    for i, cell in enumerate(nb["cells"]):
        for o in cell.get("outputs", []):
            texts = ["".join(o["text"])] if "text" in o else []
            for key in ("text/plain", "text/html", "text/markdown"):
                if key in o.get("data", {}):
                    v = o["data"][key]
                    texts.append("".join(v) if isinstance(v, list) else v)
            out += [(i, re.sub(r"<[^>]+>", " ", t)) for t in texts]
    return out


def test_there_are_notebooks_with_saved_outputs() -> None:
    assert len(NOTEBOOKS) >= 7
    for path in NOTEBOOKS:
        nb = json.loads(path.read_text(encoding="utf-8"))
        assert _outputs_text(nb), f"{path.name} has no saved outputs to compare"


def test_digit_rule() -> None:
    """The scan's rule catches float noise and over-long prints, and passes the policy's own
    output (examples from phasepath.format's table)."""
    for bad in ("50.00000000000001", "188110.207", "0.000123456789", "1234567", "273.1500001"):
        assert too_many_digits(f"value {bad} kPa"), bad
    for good in (
        "99.974 °C",
        "1273.150 K",
        "2256.47 kJ/kg",
        "0.491431 Pa",
        "3e+07 Pa",
        "0.3123",
        "9.439 ± 0.038",
        "CoolProp 8.0.0",
        "R14-08",
        "101325 Pa",
    ):
        assert not too_many_digits(good), good


@pytest.mark.parametrize("path", NOTEBOOKS, ids=[p.stem for p in NOTEBOOKS])
def test_saved_outputs_follow_the_digits_policy(path) -> None:
    nb = json.loads(path.read_text(encoding="utf-8"))
    bad = [(i, n, line) for i, text in _outputs_text(nb) for n, line in offenders(text)]
    assert not bad, "\n".join(f"cell {i}: {n} in {line!r}" for i, n, line in bad)


def _inject(nb: dict) -> dict:
    out = copy.deepcopy(nb)

    def cell(src: str, cid: str) -> dict:
        return {
            "cell_type": "code",
            "execution_count": None,
            "id": cid,
            "metadata": {},
            "outputs": [],
            "source": src,
        }

    out["cells"] = [cell(PERTURB, "perturb")] + out["cells"] + [cell(REPORT_COUNTS, "counts")]
    return out


def _canary(tmp: Path) -> Path:
    """A small notebook executed here without perturbation (its saved outputs)."""
    import nbformat
    from nbclient import NotebookClient

    nb = nbformat.v4.new_notebook()
    nb.metadata["kernelspec"] = {
        "name": "python3",
        "display_name": "Python 3",
        "language": "python",
    }
    for i, src in enumerate(CANARY):
        c = nbformat.v4.new_code_cell(src)
        c["id"] = f"canary-{i}"
        nb.cells.append(c)
    NotebookClient(
        nb, timeout=300, kernel_name="python3", resources={"metadata": {"path": str(tmp)}}
    ).execute()
    folder = tmp / "canary"
    folder.mkdir()
    path = folder / "canary.ipynb"
    nbformat.write(nb, path)
    return path


def test_outputs_survive_a_last_bit_perturbation(tmp_path) -> None:
    pytest.importorskip("nbval")
    pytest.importorskip("nbclient")
    canary = _canary(tmp_path)
    targets = [canary]
    for path in NOTEBOOKS:
        folder = tmp_path / path.stem
        folder.mkdir()
        nb = json.loads(path.read_text(encoding="utf-8"))
        (folder / path.name).write_text(json.dumps(_inject(nb)), encoding="utf-8")
        targets.append(folder / path.name)
    nb = json.loads(canary.read_text(encoding="utf-8"))
    canary.write_text(json.dumps(_inject(nb)), encoding="utf-8")
    (tmp_path / "pytest.ini").write_text("[pytest]\n", encoding="utf-8")
    junit = tmp_path / "junit.xml"
    proc = subprocess.run(
        [
            sys.executable,
            "-m",
            "pytest",
            "-q",
            "-p",
            "no:cacheprovider",
            "-c",
            str(tmp_path / "pytest.ini"),
            "--rootdir",
            str(tmp_path),
            "--nbval",
            "--nbval-current-env",
            "--nbval-sanitize-with",
            str(SANITIZER),
            "--junitxml",
            str(junit),
            *map(str, targets),
        ],
        cwd=tmp_path,
        capture_output=True,
        text=True,
        timeout=900,
    )
    assert junit.exists(), proc.stdout[-3000:] + proc.stderr[-3000:]
    failed: dict[str, list[str]] = {}
    cases = ET.parse(junit).getroot().iter("testcase")
    ran = 0
    for case in cases:
        ran += 1
        if case.find("failure") is not None or case.find("error") is not None:
            failed.setdefault(case.get("classname", "") + case.get("name", ""), []).append(
                (
                    case.find("failure") if case.find("failure") is not None else case.find("error")
                ).get("message", "")[:300]
            )
    assert ran > len(NOTEBOOKS) * 3, proc.stdout[-2000:]
    canary_fails = [k for k in failed if "canary" in k]
    others = {k: v for k, v in failed.items() if "canary" not in k}
    assert not others, (
        "outputs changed under a last-bit perturbation:\n"
        + "\n".join(f"{k}: {v}" for k, v in others.items())
        + proc.stdout[-4000:]
    )
    # the canary: exactly its repr cell fails (Cell 2: nbval counts the injected cell), the
    # policy's cell passes
    assert len(canary_fails) == 1 and canary_fails[0].endswith("Cell 2"), (
        canary_fails,
        proc.stdout,
    )
    # and the perturbation really reached every notebook
    for target in targets:
        counts = json.loads((target.parent / "perturbation-counts.json").read_text())
        assert sum(counts.values()) > 0, target.name
        if "custom_solvent" in target.name:
            assert counts["data sheets"] >= 1
