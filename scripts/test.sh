#!/usr/bin/env bash
# Set up and run every test: doctests, unit and reference tests, widget tests, the browser
# end-to-end tests (headless Debian chromium) and the notebooks under nbval.
set -euo pipefail
here="$(cd "$(dirname "${BASH_SOURCE[0]}")/.." && pwd)"
source "$here/scripts/setup.sh"
cd "$here"
python -m pytest \
  --nbval --nbval-current-env --nbval-sanitize-with phasepath/nbval_sanitize.cfg \
  phasepath tests notebooks "$@"
