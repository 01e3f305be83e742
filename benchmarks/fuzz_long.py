"""The long fuzz profile: the route properties of tests/test_fuzz_routes.py over >= 10,000 routes.

Run from the repository root::

    python benchmarks/fuzz_long.py

It runs the three hypothesis properties with 4,000 routes each (12,000 routes, random
substances) plus the order-of-first-use check, prints hypothesis' statistics and the wall time,
and exits with pytest's status. Not part of the default test run.
"""

from __future__ import annotations

import os
import subprocess
import sys
import time
from pathlib import Path

ROOT = Path(__file__).resolve().parents[1]


def main() -> int:
    env = {
        **os.environ,
        "PHASEPATH_FUZZ": "long",
        "PYTHONPATH": str(ROOT) + os.pathsep + os.environ.get("PYTHONPATH", ""),
    }
    cmd = [
        sys.executable,
        "-m",
        "pytest",
        "-q",
        "-p",
        "no:cacheprovider",
        "--hypothesis-show-statistics",
        "-W",
        "ignore::DeprecationWarning",
        "tests/test_fuzz_routes.py",
        *sys.argv[1:],
    ]
    t0 = time.perf_counter()
    status = subprocess.call(cmd, cwd=ROOT, env=env)
    print(f"long fuzz profile: exit status {status}, wall time {time.perf_counter() - t0:.0f} s")
    return status


if __name__ == "__main__":
    raise SystemExit(main())
