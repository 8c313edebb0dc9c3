"""Bad input: exit status 2 and one line naming the file and the field, never a traceback.

Each case takes the shipped US example and makes one realistic mistake in it.
"""

from __future__ import annotations

import subprocess
import sys
from pathlib import Path

import pytest

from prestress.cli import main
from tests.conftest import ROOT, US_EXAMPLE

BASE = US_EXAMPLE.read_text(encoding="utf-8").replace(
    'file = "limits/', f'file = "{(ROOT / "examples" / "limits").as_posix()}/'
)

CASES = [
    # (id, old text, new text, words the message must contain)
    ("missing field", 'span = "80 ft"', "", ["girder.span", "missing"]),
    ("bare number", 'fc = "7.0 ksi"', "fc = 7.0", ["girder.concrete.fc", "bare number"]),
    ("wrong dimension", 'length = "82 ft"', 'length = "82 ksi"', ["girder.length", "dimension"]),
    ("no unit", 'thickness = "7.5 in"', 'thickness = "7.5"', ["deck.thickness", "no unit"]),
    (
        "unknown section",
        '"AASHTO-PCI-BT-54"',
        '"AASHTO-PCI-BT-55"',
        ["girder.section", "did you mean"],
    ),
    (
        "path as section",
        '"AASHTO-PCI-BT-54"',
        '"../../etc/passwd"',
        ["girder.section", "not a path"],
    ),
    ("fci above fc", 'fci = "5.5 ksi"', 'fci = "8.0 ksi"', ["girder.concrete.fci", "no greater"]),
    ("strands outside", "count = 12", "count = 14", ["strands.rows[0]", "outside"]),
    ("misspelt key", 'span = "80 ft"', 'spna = "80 ft"', ["girder.spna", "did you mean 'span'"]),
    ("span longer", 'span = "80 ft"', 'span = "90 ft"', ["girder.span", "no longer"]),
    (
        "ages out of order",
        'deck_placement = "90 day"',
        'deck_placement = "0.5 day"',
        ["time.deck_placement", "later than transfer"],
    ),
    (
        "humidity",
        "relative_humidity = 70",
        "relative_humidity = 120",
        ["time.relative_humidity", "0 to 100"],
    ),
    (
        "jacking too high",
        'jacking_stress = "202.5 ksi"',
        'jacking_stress = "230 ksi"',
        ["strand.jacking_stress", "0.75 fpu"],
    ),
    (
        "unknown loss method",
        'method = "aashto-approximate"',
        'method = "aashto-guess"',
        ["losses.method", "one of"],
    ),
    (
        "negative thickness",
        'thickness = "7.5 in"',
        'thickness = "-7.5 in"',
        ["deck.thickness", "positive"],
    ),
    (
        "strength units slip",
        'fc = "7.0 ksi"',
        'fc = "7000 ksi"',
        ["girder.concrete.fc", "strength"],
    ),
    ("unit choice", 'units = "US"', 'units = "imperial"', ["job.units", "one of"]),
    ("malformed toml", "[girder]\n", "[girder\n", ["valid TOML"]),
    (
        "limits file missing",
        "aashto-lrfd-9th-service.toml",
        "nope.toml",
        ["limits.file", "no file"],
    ),
    (
        "user station beyond the girder",
        "[loads]\n",
        '[[stations]]\nname = "splice"\nat = "90 ft"\n\n[loads]\n',
        ["stations[0].at", "0 to 82.00 ft", "got 90.00 ft"],
    ),
    (
        "debond count disagrees with positions",
        'count = 12\nspacing = "2 in"\n',
        'count = 12\nspacing = "2 in"\n'
        'debond = [ { count = 3, length = "5 ft", positions = [5, 8] } ]\n',
        ["strands.rows[0].debond[0].count", "positions (2)", "got 3"],
    ),
]


@pytest.mark.parametrize(("old", "new", "words"), [c[1:] for c in CASES], ids=[c[0] for c in CASES])
def test_bad_job_exits_2_with_one_line(
    tmp_path: Path, capsys, old: str, new: str, words: list[str]
) -> None:
    assert old in BASE, old
    job = tmp_path / "job.toml"
    job.write_text(BASE.replace(old, new, 1), encoding="utf-8")
    code = main(["check", str(job)])
    err = capsys.readouterr().err
    assert code == 2
    lines = err.strip().splitlines()
    assert len(lines) == 1, err
    assert "Traceback" not in err
    assert lines[0].startswith("prestress: error: ")
    for w in words:
        assert w in lines[0], (w, lines[0])
    if "limits file" not in err and "no such file" not in words:
        assert str(job) in lines[0]


@pytest.mark.parametrize(
    ("content", "words"),
    [(b"", "empty file"), (b"\xff\xfe\x00bad", "UTF-8"), (b"[job]\ntitle = ", "valid TOML")],
    ids=["empty", "not utf-8", "truncated"],
)
def test_unreadable_files(tmp_path: Path, capsys, content: bytes, words: str) -> None:
    job = tmp_path / "job.toml"
    job.write_bytes(content)
    assert main(["check", str(job)]) == 2
    err = capsys.readouterr().err.strip()
    assert len(err.splitlines()) == 1 and words in err and str(job) in err


def test_missing_file(capsys) -> None:
    assert main(["check", "no-such-job.toml"]) == 2
    assert "no such file" in capsys.readouterr().err


def test_no_traceback_from_the_console_script(tmp_path: Path) -> None:
    job = tmp_path / "job.toml"
    job.write_text(BASE.replace('fc = "7.0 ksi"', "fc = 7.0"), encoding="utf-8")
    proc = subprocess.run(
        [sys.executable, "-m", "prestress", "check", str(job)],
        capture_output=True,
        text=True,
        timeout=120,
    )
    assert proc.returncode == 2
    assert "Traceback" not in proc.stderr and len(proc.stderr.strip().splitlines()) == 1
    debug = subprocess.run(
        [sys.executable, "-m", "prestress", "check", str(job), "--debug"],
        capture_output=True,
        text=True,
        timeout=120,
    )
    assert "Traceback" in debug.stderr  # --debug shows it


def test_output_never_overwrites_input_or_existing(tmp_path: Path, capsys) -> None:
    job = tmp_path / "job.toml"
    job.write_text(BASE, encoding="utf-8")
    before = job.read_bytes()
    assert main(["check", str(job), "--json", str(job)]) == 2
    assert job.read_bytes() == before
    out = tmp_path / "out.json"
    out.write_text("keep me", encoding="utf-8")
    assert main(["check", str(job), "--json", str(out)]) == 2
    assert out.read_text(encoding="utf-8") == "keep me"
    assert main(["check", str(job), "--json", str(out), "--force"]) == 0
    assert out.read_text(encoding="utf-8").startswith("{")
    capsys.readouterr()


def test_usage_error_exits_2(capsys) -> None:
    with pytest.raises(SystemExit) as exc:
        main(["check"])
    assert exc.value.code == 2
