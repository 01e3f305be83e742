"""Files phasepath reads and writes: bounded reads of regular files only (a pipe never blocks, a
device never floods memory), and atomic writes (a write that fails part way leaves the old file
byte for byte as it was). Failures are injected for real: a child process with a file-size limit
(``resource.RLIMIT_FSIZE``), a character the encoder refuses, a pipe, a character device."""

from __future__ import annotations

import os
import subprocess
import sys
import textwrap
from pathlib import Path

import pytest

import phasepath as pp
from phasepath import cli, fileio
from phasepath.errors import PhasePathError, RouteFileError

posix = pytest.mark.skipif(sys.platform == "win32", reason="POSIX files and limits")


def _plan(tmp_path: Path) -> Path:
    path = tmp_path / "plan.yaml"
    pp.Route("water", T="20 degC", p="1 atm", title="kettle").isobar(T="120 degC").save(path)
    return path


def _run(code: str, timeout: float = 120.0) -> subprocess.CompletedProcess[str]:
    """Run ``code`` in a fresh interpreter (so limits and signals stay there)."""
    return subprocess.run(
        [sys.executable, "-c", textwrap.dedent(code)],
        capture_output=True,
        text=True,
        timeout=timeout,
    )


# -- reads --------------------------------------------------------------------------------------
@posix
def test_a_pipe_is_refused_at_once_and_never_blocks(tmp_path: Path) -> None:
    fifo = tmp_path / "plan.yaml"
    os.mkfifo(fifo)
    # in a child with a short timeout: a blocking open or read would hang it, not this run
    out = _run(
        f"""
        import phasepath as pp
        try:
            pp.Route.load({str(fifo)!r})
        except pp.RouteFileError as exc:
            print("refused:", exc)
        """,
        timeout=60.0,
    )
    assert out.returncode == 0, out.stderr
    assert "refused:" in out.stdout and "not a regular file (a pipe)" in out.stdout
    assert str(fifo) in out.stdout


@posix
@pytest.mark.parametrize("device", ["/dev/zero", "/dev/urandom"])
def test_a_character_device_is_refused(device: str) -> None:
    if not os.path.exists(device):
        pytest.skip(f"{device} is not on this machine")
    with pytest.raises(RouteFileError, match=r"not a regular file \(a character device\)"):
        pp.Route.load(device)
    with pytest.raises(PhasePathError, match="not a regular file"):
        fileio.read_bytes(device, 10)


def test_a_directory_is_refused(tmp_path: Path) -> None:
    with pytest.raises(RouteFileError, match=r"a directory") as info:
        pp.Route.load(tmp_path)
    assert str(tmp_path) in str(info.value)


def test_reads_stop_at_the_limit(tmp_path: Path) -> None:
    big = tmp_path / "big.yaml"
    big.write_bytes(b"#" * (fileio.MAX_BYTES + 1))
    with pytest.raises(RouteFileError, match="more than the 1048576 bytes"):
        pp.Route.load(big)
    assert fileio.read_bytes(big, fileio.MAX_BYTES + 1) == b"#" * (fileio.MAX_BYTES + 1)


@posix
def test_a_file_that_reports_size_zero_is_read_whole_and_bounded() -> None:
    status = Path("/proc/self/status")
    if not status.exists():
        pytest.skip("no /proc here")
    assert status.stat().st_size == 0  # the kernel reports 0: only the bounded read is safe
    assert b"Name:" in fileio.read_bytes(status, 1 << 16)
    with pytest.raises(PhasePathError, match="more than the 10 bytes"):
        fileio.read_bytes(status, 10)


@pytest.mark.parametrize(
    "path, says",
    [
        (None, "not a file path"),
        (42, "not a file path"),
        (b"plan.yaml", "not a file path"),
        ("plan\0.yaml", "NUL character"),
        ("", "empty"),
    ],
)
def test_paths_that_are_no_paths(path: object, says: str) -> None:
    with pytest.raises(RouteFileError, match=says):
        pp.Route.load(path)
    route = pp.Route("water", T=300.0, p=1e5).isobar(T=310.0)
    with pytest.raises(RouteFileError, match=says):
        route.save(path)


# -- writes -------------------------------------------------------------------------------------
def test_a_write_the_encoder_refuses_leaves_the_old_file(tmp_path: Path) -> None:
    path = tmp_path / "plan.json"  # JSON keeps the character as it is; UTF-8 cannot encode it
    pp.Route("water", T="20 degC", p="1 atm").isobar(T="120 degC").save(path)
    before = path.read_bytes()
    route = pp.Route("water", T="20 degC", p="1 atm", title="bad \ud800 title").isobar(T="30 degC")
    with pytest.raises(RouteFileError, match="cannot write") as info:
        route.save(path)
    assert str(path) in str(info.value)
    assert path.read_bytes() == before
    assert [p.name for p in tmp_path.iterdir()] == ["plan.json"]  # no temporary file left


@posix
def test_a_full_disk_leaves_the_old_route_file_byte_identical(tmp_path: Path) -> None:
    """A child process may write at most 4 kB per file (RLIMIT_FSIZE); saving a route with a
    long note over a valid file fails with "File too large", and the file is as it was."""
    path = _plan(tmp_path)
    before = path.read_bytes()
    out = _run(
        f"""
        import resource, signal
        import phasepath as pp
        route = pp.Route("water", T="20 degC", p="1 atm", notes="n" * 100_000).isobar(T="30 degC")
        signal.signal(signal.SIGXFSZ, signal.SIG_IGN)  # the write fails instead of killing us
        resource.setrlimit(resource.RLIMIT_FSIZE, (4096, 4096))
        try:
            route.save({str(path)!r})
        except pp.RouteFileError as exc:
            print("refused:", exc)
        """
    )
    assert out.returncode == 0, out.stderr
    assert "refused:" in out.stdout and str(path) in out.stdout
    assert "too large" in out.stdout.lower()
    assert path.read_bytes() == before
    assert sorted(p.name for p in tmp_path.iterdir()) == ["plan.yaml"]


@posix
def test_a_full_disk_leaves_old_results_byte_identical(tmp_path: Path) -> None:
    plan = _plan(tmp_path)
    results = tmp_path / "plan.expected.json"
    assert cli.main(["analyze", str(plan), "--format", "json", "-o", str(results)]) == 0
    before = results.read_bytes()
    out = _run(
        f"""
        import resource, signal, sys
        from phasepath import cli
        signal.signal(signal.SIGXFSZ, signal.SIG_IGN)
        resource.setrlimit(resource.RLIMIT_FSIZE, (512, 512))
        sys.exit(cli.main(["analyze", {str(plan)!r}, "--format", "json", "-o", {str(results)!r}]))
        """
    )
    assert out.returncode == 2
    assert out.stderr.count("\n") == 1 and "too large" in out.stderr.lower()
    assert results.read_bytes() == before


def test_output_over_the_input_is_refused(tmp_path: Path, capsys: pytest.CaptureFixture) -> None:
    plan = _plan(tmp_path)
    before = plan.read_bytes()
    assert cli.main(["analyze", str(plan), "-o", str(plan)]) == 2
    err = capsys.readouterr().err
    assert "is one of the command's inputs" in err and err.count("\n") == 1
    assert plan.read_bytes() == before


def test_atomic_write_keeps_the_mode_of_the_file_it_replaces(tmp_path: Path) -> None:
    path = tmp_path / "notes.txt"
    path.write_text("old")
    path.chmod(0o640)
    fileio.write_text(path, "new")
    assert path.read_text() == "new"
    assert path.stat().st_mode & 0o777 == 0o640
