"""The computation core imports no widget library (STYLE.md: a pure core, thin widgets on top)."""

from __future__ import annotations

import json
import os
import subprocess
import sys
from pathlib import Path

REPO = Path(__file__).resolve().parents[1]

_SCRIPT = """
import json, sys
import phasepath
report = phasepath.Route("CO2", T=250.0, p=20e5).isotherm(p=1e5).isobar(T=260.0).analyze()
report.table()
report._repr_html_()
print(json.dumps({
    "crossings": len(report.crossings),
    "widgets": sorted(m for m in ("ipywidgets", "bqplot", "traitlets", "IPython")
                      if m in sys.modules),
}))
"""


def test_core_import_and_analysis_leave_widget_libraries_unloaded():
    """A fresh interpreter that imports phasepath, analyses a route and builds its table and HTML
    has not imported ipywidgets or bqplot."""
    out = subprocess.run(
        [sys.executable, "-c", _SCRIPT],
        cwd=REPO,
        capture_output=True,
        text=True,
        timeout=300,
        env={**os.environ, "PYTHONPATH": str(REPO)},
    )
    assert out.returncode == 0, out.stderr
    result = json.loads(out.stdout.strip().splitlines()[-1])
    assert result["crossings"] == 1  # the route did real work: it boils the liquid CO2
    assert "ipywidgets" not in result["widgets"]
    assert "bqplot" not in result["widgets"]
