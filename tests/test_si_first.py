"""A job written in SI units reads SI first: in notes, the header and error messages.

Notes are written once, before --units may change the tables, so they carry both systems;
the job's own comes first (common practice: a reviewer reads the units the job was given in).
"""

from __future__ import annotations

from pathlib import Path

import pytest

from prestress.analysis import check_file
from prestress.errors import InputError
from prestress.jobfile import load_job
from tests.conftest import SI_EXAMPLE, US_EXAMPLE, write_job


def test_notes_of_an_si_job_quote_si_first() -> None:
    r = check_file(SI_EXAMPLE)
    ld = next(n for n in r.notes if n.startswith("development length"))
    assert "ld = 3.71 m (146 in = 12.2 ft)" in ld and "fps = 1,833 MPa (265.8 ksi)" in ld
    steel = next(n for s in r.stages for n in s.notes if "bonded reinforcement" in n)
    assert "i.e. 1.38 MPa (0.200 ksi), at" in steel and "kN (" in steel
    assert "wc = 22.78 kN/m³ (145.0 pcf)" in load_job(SI_EXAMPLE).girder_concrete.modulus_source


def test_notes_of_a_us_job_quote_us_first() -> None:
    r = check_file(US_EXAMPLE)
    ld = next(n for n in r.notes if n.startswith("development length"))
    assert "in = " in ld and "ft (3." in ld and "ksi (" in ld


def test_an_si_job_error_quotes_metres(tmp_path: Path) -> None:
    text = SI_EXAMPLE.read_text(encoding="utf-8").replace('span = "24.384 m"', 'span = "26 m"')
    with pytest.raises(InputError) as err:
        load_job(write_job(tmp_path, text))
    assert "got 26.00 m" in str(err.value) and "ft" not in str(err.value)


@pytest.mark.parametrize(
    ("old", "new", "words"),
    [
        ('fci = "37.92116511 MPa"', 'fci = "55 MPa"', ["(48.3 MPa)", "got 55 MPa"]),
        ("count = 12", "count = 30", ["x = -737 mm, y = 51 mm"]),
    ],
)
def test_si_input_errors_quote_si(tmp_path: Path, old: str, new: str, words: list[str]) -> None:
    text = SI_EXAMPLE.read_text(encoding="utf-8")
    assert old in text
    with pytest.raises(InputError) as err:
        check_file(write_job(tmp_path, text.replace(old, new, 1)))
    message = str(err.value)
    assert all(w in message for w in words), message
    assert "ksi" not in message.split("expected", 1)[1].split("(", 1)[0]


def test_strand_set_labels_in_the_job_units_whoever_builds_them() -> None:
    """The design search rebuilds layouts outside the job reader: same labels (a review)."""
    from prestress.design import job_with_rows

    job = load_job(SI_EXAMPLE)
    rebuilt = job_with_rows(job, job.rows)
    assert [s.label for s in rebuilt.layout.sets] == [s.label for s in job.layout.sets]
    assert all(" mm" in s.label for s in job.layout.sets)
