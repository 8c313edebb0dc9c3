"""Atomic file writes: a temporary file in the same folder, then ``os.replace``."""

from __future__ import annotations

import contextlib
import os
from pathlib import Path


def write_atomic(path: str | Path, data: str | bytes) -> None:
    """Write ``data`` to ``path`` atomically (readers see the old file or the new, never half)."""
    import tempfile  # imported here: it costs start-up time on paths that write nothing

    target = Path(path)
    target.parent.mkdir(parents=True, exist_ok=True)
    mode = "wb" if isinstance(data, bytes) else "w"
    fd, tmp = tempfile.mkstemp(prefix=f".{target.name}.", suffix=".tmp", dir=target.parent)
    try:
        with os.fdopen(fd, mode, **({} if isinstance(data, bytes) else {"encoding": "utf-8"})) as f:
            f.write(data)
            f.flush()
            os.fsync(f.fileno())
        umask = os.umask(0)
        os.umask(umask)
        os.chmod(tmp, 0o666 & ~umask)  # the usual mode of a new file (mkstemp makes it 0600)
        os.replace(tmp, target)
    except BaseException:
        with contextlib.suppress(OSError):
            os.unlink(tmp)
        raise


def check_output_path(
    target: str | Path, *, inputs: tuple[Path, ...] | list[Path] = (), force: bool = False
) -> None:
    """Refuse an output path that is a folder, an input, or an existing file without force.

    An input is refused even with ``force``: the user's files are never overwritten.

    Raises:
        InputError: naming the output file.
    """
    from prestress.errors import InputError

    target = Path(target)
    if target.is_dir():
        raise InputError(
            "a file path for the output, not a folder",
            file=str(target),
            got="an existing folder",
        )
    for src in inputs:
        if target.resolve() == Path(src).resolve():
            raise InputError(
                "an output path different from the input files",
                file=str(target),
                got="the path of an input file",
            )
    if target.exists() and not force:
        raise InputError(
            "a path that does not exist yet (or --force to replace it)",
            file=str(target),
            got="an existing file",
        )


def save_figure_atomic(fig, out: Path, fmt: str) -> None:
    """Save a matplotlib figure atomically (SVG without a date, so runs are reproducible)."""
    import tempfile

    import matplotlib

    out.parent.mkdir(parents=True, exist_ok=True)
    fd, tmp = tempfile.mkstemp(prefix=f".{out.stem}-", suffix=f".{fmt}", dir=out.parent)
    os.close(fd)
    try:
        umask = os.umask(0)
        os.umask(umask)
        os.chmod(tmp, 0o666 & ~umask)  # mkstemp makes the file private; use the usual mode
        with matplotlib.rc_context({"svg.hashsalt": "prestress", "svg.fonttype": "none"}):
            meta = {"Date": None} if fmt == "svg" else {}
            fig.savefig(tmp, format=fmt, dpi=150, facecolor="white", metadata=meta)
        os.replace(tmp, out)
    except BaseException:
        if os.path.exists(tmp):
            os.remove(tmp)
        raise
