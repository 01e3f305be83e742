#!/usr/bin/env bash
# Set up and start the route planner: JupyterLab on 127.0.0.1 with the planner notebook open.
# Headless: no browser is started; open the printed address yourself.
set -euo pipefail
here="$(cd "$(dirname "${BASH_SOURCE[0]}")/.." && pwd)"
PHASEPATH_BROWSER=0 source "$here/scripts/setup.sh"
cd "$here"
port="${PHASEPATH_PORT:-8888}"
root_flag=()
[ "$(id -u)" = "0" ] && root_flag=(--ServerApp.allow_root=True)
echo "phasepath: starting the planner at http://127.0.0.1:${port}/lab/tree/notebooks/planner.ipynb (the full address with its token follows)"
exec jupyter lab --no-browser --ServerApp.ip=127.0.0.1 --ServerApp.port="$port" \
  --ServerApp.port_retries=0 --ServerApp.root_dir="$here" "${root_flag[@]}" \
  --LabApp.news_url=None notebooks/planner.ipynb
