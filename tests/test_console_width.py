"""Every console table fits an 80-column terminal without losing a character.

A table wider than the terminal is cut by rich (an ellipsis in a cell, or a cropped line), so a
number can silently go missing from the screen. The test prints each command at 80 and at 400
columns and compares the characters printed, whitespace and rules aside: wrapping may move
them, but none may be lost (common practice: 80 columns is the narrowest usual terminal).
"""

from __future__ import annotations

import contextlib
import io
from collections import Counter
from pathlib import Path

import pytest

from prestress.cli import main
from tests.conftest import EXAMPLES, write_job

#: characters whose count depends on the width by design: whitespace, table rules, and the
#: glyphs of the zone's text elevation (drawn across the terminal's width)
_LAYOUT = set(" \n─━·▼┆│✖└┘┌┐╭╮╰╯")

HARPED = EXAMPLES / "harl-brook-span1-g2-harped.toml"


def _printed(argv: list[str], columns: int, monkeypatch: pytest.MonkeyPatch) -> Counter[str]:
    monkeypatch.setenv("COLUMNS", str(columns))
    out = io.StringIO()
    with contextlib.redirect_stdout(out), contextlib.redirect_stderr(io.StringIO()):
        main(argv)
    return Counter(c for c in out.getvalue() if c not in _LAYOUT)


def _assert_fits(argv: list[str], monkeypatch: pytest.MonkeyPatch) -> None:
    narrow, wide = _printed(argv, 80, monkeypatch), _printed(argv, 400, monkeypatch)
    assert narrow == wide, (argv, "lost at 80 columns:", dict(wide - narrow))


@pytest.mark.parametrize("example", sorted(EXAMPLES.glob("*.toml")), ids=lambda p: p.stem)
def test_check_fits_80_columns(example: Path, monkeypatch: pytest.MonkeyPatch) -> None:
    _assert_fits(["check", str(example)], monkeypatch)


@pytest.mark.parametrize(
    "argv",
    [
        ["zone", str(HARPED)],
        ["zone", str(EXAMPLES / "wexcombe-lane-g4-debonded.toml"), "--units", "SI"],
        ["losses", "--compare", str(HARPED)],
        ["losses", str(EXAMPLES / "corrie-beck-g1-post-tensioned.toml")],
        ["sections"],
        ["section", "show", "AASHTO-PCI-BT-72"],
        ["examples"],
    ],
    ids=lambda a: " ".join(Path(x).stem if x.endswith(".toml") else x for x in a),
)
def test_other_commands_fit_80_columns(argv: list[str], monkeypatch: pytest.MonkeyPatch) -> None:
    _assert_fits(argv, monkeypatch)


def test_design_search_fits_80_columns(monkeypatch: pytest.MonkeyPatch) -> None:
    """The search prints its own timing, so the clock is made to tick the same in both runs."""
    import prestress.design

    def ticking_clock() -> float:
        ticking_clock.now += 1.0  # type: ignore[attr-defined]
        return ticking_clock.now  # type: ignore[attr-defined]

    ticking_clock.now = 0.0  # type: ignore[attr-defined]
    monkeypatch.setattr(prestress.design.time, "perf_counter", ticking_clock)
    _assert_fits(["design", str(HARPED)], monkeypatch)


def test_time_step_history_fits_80_columns(tmp_path: Path, monkeypatch: pytest.MonkeyPatch) -> None:
    text = HARPED.read_text(encoding="utf-8").replace(
        'method = "aashto-refined"', 'method = "time-step-mc2010"'
    )
    job = write_job(tmp_path, text)
    _assert_fits(["losses", str(job), "--at", "1 day,100 day,3 year,54 year"], monkeypatch)


def test_tendon_limit_table_with_a_failure_fits_80_columns(
    tmp_path: Path, monkeypatch: pytest.MonkeyPatch
) -> None:
    pt = EXAMPLES / "corrie-beck-g1-post-tensioned.toml"
    text = pt.read_text(encoding="utf-8").replace(
        'jacking_stress = "195 ksi"', 'jacking_stress = "205 ksi"', 1
    )
    job = write_job(tmp_path, text)
    _assert_fits(["losses", str(job)], monkeypatch)


def test_a_long_job_path_folds_in_the_header(
    tmp_path: Path, monkeypatch: pytest.MonkeyPatch
) -> None:
    """The job file's path is one word: at 80 columns it folds instead of being cut (a clone
    in a longer folder lost its end)."""
    deep = tmp_path / ("a-rather-long-folder-name-for-the-project-files" * 2)
    deep.mkdir()
    job = write_job(deep, (EXAMPLES / "brannoch-creek-span2-g3.toml").read_text(encoding="utf-8"))
    _assert_fits(["check", str(job)], monkeypatch)
