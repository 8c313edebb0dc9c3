"""Shared test fixtures: an isolated cache folder and the example paths."""

from __future__ import annotations

import os
from pathlib import Path

import pytest

ROOT = Path(__file__).resolve().parents[1]
EXAMPLES = ROOT / "examples"
US_EXAMPLE = EXAMPLES / "brannoch-creek-span2-g3.toml"
SI_EXAMPLE = EXAMPLES / "brannoch-creek-span2-g3-si.toml"


@pytest.fixture(scope="session", autouse=True)
def _isolated_cache(tmp_path_factory: pytest.TempPathFactory) -> None:
    """Keep the tests' section cache out of the user's cache folder."""
    os.environ["PRESTRESS_CACHE_DIR"] = str(tmp_path_factory.mktemp("prestress-cache"))
    os.environ.pop("PRESTRESS_SECTIONS", None)
