#!/usr/bin/env bash
# Keep reviewed plans under regression checks: the lines below go into a CI job on any runner
# with Python 3.10+ (run from the repository root that holds plans/ and notebooks/).
# Exit status 1 fails the job when a plan's results moved beyond the tolerances, a crossing or a
# hazard appeared or disappeared; 2 when a file is missing or malformed.
set -euo pipefail
# python -m pip install "phasepath[plot]==0.2.0" pytest nbval   # the version the plans were reviewed with
phasepath check plans/bv12_plan_b.yaml plans/bv12_plan_b.expected.json
pytest --nbval --nbval-current-env --nbval-sanitize-with "$(python -c 'import phasepath, pathlib; print(pathlib.Path(phasepath.__file__).with_name("nbval_sanitize.cfg"))')" notebooks/
