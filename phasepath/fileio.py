"""Files read and written by phasepath: bounded reads of regular files, atomic writes.

* :func:`read_bytes` opens the file without blocking (a pipe never hangs the read), refuses
  anything that is not a regular file (devices, pipes, directories, sockets) and reads at most
  the limit plus one byte, so a file that reports a size of 0 (``/proc`` files) or lies about
  its size cannot exhaust memory.
* :func:`write_bytes` / :func:`write_text` write to a temporary file in the target's folder,
  flush it to disk and rename it over the target: a write that fails part way (a full disk, a
  character the encoder refuses) leaves the old file exactly as it was.

Every refusal is a phasepath error of the class the caller names, naming the path and the cause.

>>> import os, tempfile
>>> folder = tempfile.mkdtemp()
>>> target = os.path.join(folder, "plan.json")
>>> write_text(target, "{}\\n")
>>> read_bytes(target, 100)
b'{}\\n'
>>> read_bytes(folder, 100)  # doctest: +ELLIPSIS
Traceback (most recent call last):
...
phasepath.errors.PhasePathError: ...: not a regular file (a directory)...
"""

from __future__ import annotations

import os
import stat
import tempfile
from pathlib import Path

from .errors import PhasePathError, shown

__all__ = ["path_text", "read_bytes", "write_bytes", "write_text", "same_file", "MAX_BYTES"]

#: Default limit of what phasepath reads from one file (1 MiB).
MAX_BYTES = 1 << 20

_KINDS = (
    (stat.S_ISDIR, "a directory"),
    (stat.S_ISFIFO, "a pipe"),
    (stat.S_ISCHR, "a character device"),
    (stat.S_ISBLK, "a block device"),
    (stat.S_ISSOCK, "a socket"),
)


def path_text(path: object, error: type[PhasePathError] = PhasePathError) -> str:
    """The path as text, or ``error`` for what is not a usable path (None, an int, bytes, a
    path with a NUL character)."""
    if isinstance(path, (bytes, bytearray)) or isinstance(path, bool) or path is None:
        raise error(f"{shown(path)} is not a file path: give text or a pathlib.Path", value=path)
    try:
        text = os.fspath(path)  # type: ignore[call-overload]
    except TypeError:
        raise error(
            f"{shown(path)} is not a file path: give text or a pathlib.Path", value=path
        ) from None
    if not isinstance(text, str):
        raise error(f"{shown(path)} is not a file path: give text or a pathlib.Path", value=path)
    if "\0" in text:
        raise error(f"{shown(text)} is not a file path: it holds a NUL character", value=path)
    if not text:
        raise error("the file path is empty", value=path)
    return text


def read_bytes(
    path: object, limit: int = MAX_BYTES, error: type[PhasePathError] = PhasePathError
) -> bytes:
    """The content of a regular file of at most ``limit`` bytes."""
    name = path_text(path, error)
    flags = os.O_RDONLY | getattr(os, "O_NONBLOCK", 0) | getattr(os, "O_NOCTTY", 0)
    try:
        fd = os.open(name, flags)
    except OSError as exc:
        raise error(f"cannot read the file: {exc.strerror or exc}", source=name) from None
    try:
        mode = os.fstat(fd).st_mode
        for test, what in _KINDS:
            if test(mode):
                raise error(f"not a regular file ({what}): phasepath reads files only", source=name)
        if not stat.S_ISREG(mode):
            raise error("not a regular file: phasepath reads files only", source=name)
        chunks, size = [], 0
        while size <= limit:
            chunk = os.read(fd, min(1 << 16, limit + 1 - size))
            if not chunk:
                break
            chunks.append(chunk)
            size += len(chunk)
    except OSError as exc:
        raise error(f"cannot read the file: {exc.strerror or exc}", source=name) from None
    finally:
        os.close(fd)
    if size > limit:
        raise error(
            f"the file is more than the {limit} bytes phasepath reads from one file", source=name
        )
    return b"".join(chunks)


def write_text(
    path: object, text: str, error: type[PhasePathError] = PhasePathError, encoding: str = "utf-8"
) -> None:
    """Write ``text`` to ``path`` atomically (see :func:`write_bytes`)."""
    name = path_text(path, error)
    try:
        data = text.encode(encoding)
    except UnicodeEncodeError as exc:
        raise error(
            f"cannot write the file: the text holds a character {encoding} cannot encode "
            f"(position {exc.start})",
            source=name,
        ) from None
    write_bytes(name, data, error)


def write_bytes(path: object, data: bytes, error: type[PhasePathError] = PhasePathError) -> None:
    """Write ``data`` to a temporary file beside ``path``, flush it and rename it over ``path``;
    on any failure the old file is left as it was and the temporary file is removed."""
    name = path_text(path, error)
    target = Path(name)
    folder = target.parent if str(target.parent) else Path(".")
    if target.is_dir():
        raise error("cannot write the file: it is a directory", source=name)
    try:
        mode = stat.S_IMODE(target.stat().st_mode) if target.exists() else _default_mode()
        fd, tmp = tempfile.mkstemp(dir=folder, prefix=f".{target.name}.", suffix=".part")
    except OSError as exc:
        raise error(f"cannot write the file: {exc.strerror or exc}", source=name) from None
    try:
        with os.fdopen(fd, "wb") as fh:
            fh.write(data)
            fh.flush()
            os.fsync(fh.fileno())
        os.chmod(tmp, mode)
        os.replace(tmp, name)
    except OSError as exc:
        try:
            os.unlink(tmp)
        except OSError:
            pass
        raise error(f"cannot write the file: {exc.strerror or exc}", source=name) from None
    except BaseException:
        try:
            os.unlink(tmp)
        except OSError:
            pass
        raise


def same_file(a: object, b: object) -> bool:
    """True where two paths name one existing file."""
    try:
        return os.path.samefile(os.fspath(a), os.fspath(b))  # type: ignore[call-overload]
    except (OSError, TypeError, ValueError):
        return False


def _default_mode() -> int:
    mask = os.umask(0)
    os.umask(mask)
    return 0o666 & ~mask
