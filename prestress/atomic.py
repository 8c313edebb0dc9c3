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
