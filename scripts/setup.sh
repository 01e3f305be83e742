#!/usr/bin/env bash
# Set up a fresh machine for phasepath: Debian packages (chromium and poppler-utils for the
# browser tests, when asked), a virtual environment in .venv and phasepath installed into it
# with its test extras.
# Sourced by scripts/test.sh and scripts/serve.sh; safe to run again (it only adds what is missing).
set -euo pipefail
here="$(cd "$(dirname "${BASH_SOURCE[0]}")/.." && pwd)"
cd "$here"

want_browser="${PHASEPATH_BROWSER:-1}"
# chromium for the browser tests; poppler-utils (pdftoppm, pdftotext) to read back the report's PDF
missing=""
if [ "$want_browser" = "1" ]; then
  command -v chromium >/dev/null 2>&1 || missing="$missing chromium"
  command -v pdftoppm >/dev/null 2>&1 || missing="$missing poppler-utils"
fi
if [ -n "$missing" ]; then
  if [ "$(id -u)" = "0" ]; then SUDO=""; elif command -v sudo >/dev/null 2>&1; then SUDO="sudo"; else SUDO="none"; fi
  if [ "$SUDO" != "none" ] && command -v apt-get >/dev/null 2>&1; then
    echo "phasepath setup: installing Debian's$missing for the browser tests"
    $SUDO apt-get update -qq
    # shellcheck disable=SC2086
    DEBIAN_FRONTEND=noninteractive $SUDO apt-get install -y -qq $missing >/dev/null
  else
    echo "phasepath setup: cannot install$missing here (no root, no apt-get); browser tests will be skipped" >&2
  fi
fi

py="${PYTHON:-python3}"
if [ ! -x .venv/bin/python ]; then
  echo "phasepath setup: creating .venv"
  "$py" -m venv .venv
fi
stamp=".venv/.phasepath-installed"
if [ ! -f "$stamp" ] || [ pyproject.toml -nt "$stamp" ]; then
  echo "phasepath setup: installing phasepath and its test extras into .venv"
  .venv/bin/python -m pip install -q --upgrade pip
  .venv/bin/python -m pip install -q -e ".[test]"
  touch "$stamp"
fi
export PATH="$here/.venv/bin:$PATH"
