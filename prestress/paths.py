"""Where the shipped data lives, in a source checkout and in an installed copy.

Lookup order for the shipped section library and examples: the source tree
(``<repo>/sections``, ``<repo>/examples``) when running from a checkout or an editable
install, otherwise the copies packaged inside the wheel (``prestress/_data/...``).
"""

from __future__ import annotations

import os
import sys
from pathlib import Path

_PACKAGE = Path(__file__).resolve().parent


def _data_dir(name: str) -> Path:
    source = _PACKAGE.parent / name
    if source.is_dir() and (_PACKAGE.parent / "pyproject.toml").is_file():
        return source
    return _PACKAGE / "_data" / name


def shipped_sections_dir() -> Path:
    """The shipped section library folder."""
    return _data_dir("sections")


def shipped_examples_dir() -> Path:
    """The shipped examples folder."""
    return _data_dir("examples")


def cache_dir() -> Path:
    """The user cache folder (``PRESTRESS_CACHE_DIR`` overrides the platform's convention)."""
    env = os.environ.get("PRESTRESS_CACHE_DIR")
    if env:
        return Path(env)
    if sys.platform.startswith("linux"):
        # the XDG Base Directory convention, as platformdirs applies it (cheaper to import)
        base = os.environ.get("XDG_CACHE_HOME", "").strip()
        return (Path(base) if base and Path(base).is_absolute() else Path.home() / ".cache") / (
            "prestress"
        )
    import platformdirs

    return Path(platformdirs.user_cache_dir("prestress", appauthor=False))
