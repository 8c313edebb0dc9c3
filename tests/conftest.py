"""Shared test fixtures: an isolated cache folder and the example paths."""

from __future__ import annotations

import os
from pathlib import Path

import pytest
from hypothesis import settings

#: Property tests draw fresh random examples on a developer's machine, and a fixed sequence
#: under CI (``.ci/run`` sets HYPOTHESIS_PROFILE=ci), so a red CI always means a change broke
#: something, never a new draw. Explore more locally with PRESTRESS_PROPERTY_EXAMPLES=3000.
settings.register_profile("ci", derandomize=True, database=None, print_blob=True)
settings.load_profile(os.environ.get("HYPOTHESIS_PROFILE", "default"))

ROOT = Path(__file__).resolve().parents[1]
EXAMPLES = ROOT / "examples"
US_EXAMPLE = EXAMPLES / "brannoch-creek-span2-g3.toml"
SI_EXAMPLE = EXAMPLES / "brannoch-creek-span2-g3-si.toml"


@pytest.fixture(scope="session", autouse=True)
def _isolated_cache(tmp_path_factory: pytest.TempPathFactory) -> None:
    """Keep the tests' section cache out of the user's cache folder."""
    os.environ["PRESTRESS_CACHE_DIR"] = str(tmp_path_factory.mktemp("prestress-cache"))
    os.environ.pop("PRESTRESS_SECTIONS", None)


def write_job(folder: Path, text: str, name: str = "job.toml") -> Path:
    """Write a variant of an example job into a folder, with the example limit sets beside it.

    The examples point at ``limits/<set>.toml`` relative to themselves; the copy keeps that
    working. Returns the job's path.
    """
    job = folder / name
    job.write_text(text, encoding="utf-8")
    limits = folder / "limits"
    limits.mkdir(exist_ok=True)
    for src in (EXAMPLES / "limits").glob("*.toml"):
        (limits / src.name).write_bytes(src.read_bytes())
    return job
