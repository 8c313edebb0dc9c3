"""Strands that overlap or crowd one another, the names of the job's stations, very dry air.

Sources beside each test:

* Two strands closer than one strand diameter, centre to centre, would overlap: geometry
  (common practice). Touching strands (exactly one diameter) are not refused here.
* The least centre-to-centre spacing of pretensioning strands, AASHTO LRFD 9th Ed. (2020)
  5.10.3.3.1 and Table 5.10.3.3.1-1 (from memory): 1.75 in for 0.5 in strands, 2.00 in for
  0.6 in strands; a detailing note of the check, not an error. The 50 mm pitch of metric
  casting beds stands for the table's 2 in (common practice).
* Station names are looked up without letter case (``plot magnel --station``), so a job's
  station may not take a built-in station's name nor repeat one (this project's rule).
* Relative humidity: no concrete stands in perfectly dry air (common practice), so 0 % is
  refused; below 40 % the AASHTO LRFD 9th Ed. (2020) estimates (5.4.2.3, 5.9.3.3, 5.9.3.4)
  are extrapolated (their calibration range, from memory), and their methods say so.

Job files are invented variants of the shipped (invented) examples.
"""

from __future__ import annotations

from pathlib import Path

import pytest

from prestress.analysis import (
    STRAND_SPACING_TOLERANCE_MM,
    check_file,
    losses_file,
    minimum_strand_spacing,
)
from prestress.design import DEFAULT_PITCH
from prestress.errors import InputError
from prestress.jobfile import load_job
from tests.conftest import EXAMPLES, SI_EXAMPLE, US_EXAMPLE, write_job

INCH = 25.4
HARPED = EXAMPLES / "harl-brook-span1-g2-harped.toml"

#: The rows of the US example (0.6 in strands), replaced in the variants below.
US_ROWS = """[[strands.rows]]
height = "2 in"                       # centre of the row above the girder bottom
count = 12
spacing = "2 in"

[[strands.rows]]
height = "4 in"
count = 4
spacing = "2 in"
"""


def us_variant(tmp_path: Path, rows: str, **replace: str) -> Path:
    """The US example (AASHTO-PCI-BT-54, 0.6 in strands) with other rows (and replacements)."""
    text = US_EXAMPLE.read_text(encoding="utf-8")
    assert US_ROWS in text
    text = text.replace(US_ROWS, rows)
    for old, new in replace.items():
        assert old in text, old
        text = text.replace(old, new)
    return write_job(tmp_path, text)


def error_of(path: Path) -> InputError:
    with pytest.raises(InputError) as info:
        load_job(path)
    assert "\n" not in str(info.value)  # one line
    return info.value


def spacing_notes(path: Path) -> list[str]:
    return [n for n in check_file(path).notes if "5.10.3.3.1" in n]


# ------------------------------------------------------------------------------------------
# Overlapping strands: an error (geometry, common practice)


def test_two_rows_at_the_same_height_overlap(tmp_path: Path) -> None:
    # count 6 and count 2 at 2 in spacing, both at 2 in: the pair of the second row sits on
    # the two central strands of the first (x = ±1 in)
    job = us_variant(
        tmp_path,
        '[[strands.rows]]\nheight = "2 in"\ncount = 6\n\n'
        '[[strands.rows]]\nheight = "2 in"\ncount = 2\n',
    )
    err = error_of(job)
    assert err.field == "strands.rows[1]"
    assert "one strand diameter (0.60 in)" in err.expected
    assert "0.00 in apart at midlength" in err.got
    assert "x = -1.00 in, y = 2.00 in (strands.rows[0])" in err.got
    assert "(strands.rows[1])" in err.got


def test_a_position_given_twice_in_a_row(tmp_path: Path) -> None:
    job = us_variant(
        tmp_path,
        '[[strands.rows]]\nheight = "2 in"\npositions = ["-1 in", "1 in", "1 in", "-1 in"]\n',
    )
    err = error_of(job)
    assert err.field == "strands.rows[0].positions"
    assert "x = 1.00 in, y = 2.00 in and x = 1.00 in, y = 2.00 in" in err.got


def test_rows_closer_than_a_diameter_overlap(tmp_path: Path) -> None:
    # 0.4 in apart, centre to centre, for 0.6 in strands
    job = us_variant(
        tmp_path,
        '[[strands.rows]]\nheight = "2 in"\ncount = 6\n\n'
        '[[strands.rows]]\nheight = "2.4 in"\ncount = 2\n',
    )
    err = error_of(job)
    assert err.field == "strands.rows[1]"
    assert "0.40 in apart" in err.got


def test_a_spacing_below_the_diameter(tmp_path: Path) -> None:
    job = us_variant(tmp_path, '[[strands.rows]]\nheight = "2 in"\ncount = 4\nspacing = "0.5 in"\n')
    assert error_of(job).field == "strands.rows[0].spacing"


def test_touching_strands_pass_with_a_detailing_note(tmp_path: Path) -> None:
    # exactly one diameter (0.6 in) apart: touching, not overlapping; below the 2.00 in of
    # AASHTO LRFD 9th Ed. (2020) Table 5.10.3.3.1-1 (from memory) for 0.6 in strands
    job = us_variant(
        tmp_path,
        '[[strands.rows]]\nheight = "2 in"\ncount = 6\n\n'
        '[[strands.rows]]\nheight = "2.6 in"\ncount = 2\n',
    )
    load_job(job)
    (note,) = spacing_notes(job)
    assert note.startswith("detailing: row 1 (at 2.00 in) and row 2 (at 2.60 in)")
    assert "0.60 in (15 mm) apart centre to centre all along the girder" in note
    assert "less than 2.00 in (51 mm)" in note and "from memory" in note


def test_harped_rows_sharing_their_end_column(tmp_path: Path) -> None:
    text = HARPED.read_text(encoding="utf-8")
    old = 'harp = { end_height = "62 in", hold_down = 0.4 }'
    assert old in text
    job = write_job(tmp_path, text.replace(old, 'harp = { end_height = "66 in", hold_down = 0.4 }'))
    err = error_of(job)  # the 10 in row now ends where the 12 in row does (rows[5], 66 in)
    assert err.field in ("strands.rows[4].harp.end_height", "strands.rows[5].harp.end_height")
    assert "at the girder ends" in err.got
    assert "x = 0.00 in, y = 66.00 in" in err.got


def test_harped_end_spacing_below_the_diameter(tmp_path: Path) -> None:
    text = HARPED.read_text(encoding="utf-8")
    old = 'harp = { end_height = "66 in", hold_down = 0.4 }'
    new = 'harp = { end_height = "66 in", hold_down = 0.4, end_spacing = "0.5 in" }'
    job = write_job(tmp_path, text.replace(old, new))
    err = error_of(job)
    assert err.field == "strands.rows[5].harp.end_spacing"  # the 12 in row ends at 66 in
    assert "0.50 in apart at the girder ends" in err.got


def test_harped_end_spacing_below_the_minimum_is_a_note(tmp_path: Path) -> None:
    # 1.5 in between the two strands of the end column: < 2.00 in for 0.6 in strands
    # (AASHTO LRFD 9th Ed. (2020) Table 5.10.3.3.1-1, from memory)
    text = HARPED.read_text(encoding="utf-8")
    old = 'harp = { end_height = "66 in", hold_down = 0.4 }'
    new = 'harp = { end_height = "66 in", hold_down = 0.4, end_spacing = "1.5 in" }'
    job = write_job(tmp_path, text.replace(old, new))
    (note,) = spacing_notes(job)
    assert note.startswith("detailing: row 6 (at 12.00 in): two strands 1.50 in (38 mm)")
    assert "at the girder ends" in note


def test_a_straight_strand_in_the_way_of_the_end_column(tmp_path: Path) -> None:
    # a single straight strand on the axis at 56.3 in: 0.3 in from the lowest strand of the
    # end column (58, 56 in), that of the 8 in harped row (rows[3]), at the ends only
    text = HARPED.read_text(encoding="utf-8")
    old = "[loads]\n"
    row = '[[strands.rows]]\nheight = "56.3 in"\npositions = ["0 in"]\n\n'
    job = write_job(tmp_path, text.replace(old, row + old, 1))
    err = error_of(job)
    assert err.field == "strands.rows[3].harp.end_height"
    assert "0.30 in apart at the girder ends" in err.got


def test_grid_heights_and_positions_given_twice(tmp_path: Path) -> None:
    grid = '[strands.grid]\nheights = ["2 in", "2 in"]\npositions = ["-1 in", "1 in"]\ncount = 4\n'
    assert error_of(us_variant(tmp_path, grid)).field == "strands.grid.heights"
    grid = '[strands.grid]\nheights = ["2 in"]\npositions = ["-1 in", "-1 in", "1 in"]\ncount = 3\n'
    assert error_of(us_variant(tmp_path, grid)).field == "strands.grid.positions"


# ------------------------------------------------------------------------------------------
# The minimum spacing of AASHTO LRFD 9th Ed. (2020) 5.10.3.3.1: a note


@pytest.mark.parametrize(
    ("diameter_in", "spacing_in"),
    [(0.5, 1.75), (0.52, 1.75), (0.6, 2.00)],  # Table 5.10.3.3.1-1 (from memory)
)
def test_minimum_spacing_table(diameter_in: float, spacing_in: float) -> None:
    spacing, basis = minimum_strand_spacing(diameter_in * INCH)
    assert spacing == pytest.approx(spacing_in * INCH)
    assert "5.10.3.3.1" in basis and "from memory" in basis


def test_minimum_spacing_above_0_6_in_is_scaled_and_says_so() -> None:
    # 0.7 in: 2.00 in x 0.7 / 0.6 (an extrapolation of this project, not the table's)
    spacing, basis = minimum_strand_spacing(0.7 * INCH)
    assert spacing == pytest.approx(2.0 * 0.7 / 0.6 * INCH)
    assert "extrapolation" in basis


def test_rows_below_the_minimum_spacing_give_a_note_not_an_error(tmp_path: Path) -> None:
    job = us_variant(
        tmp_path,
        '[[strands.rows]]\nheight = "2 in"\ncount = 6\n\n'
        '[[strands.rows]]\nheight = "3.5 in"\ncount = 6\n',
    )
    (note,) = spacing_notes(job)
    assert "row 1 (at 2.00 in) and row 2 (at 3.50 in)" in note
    assert "1.50 in (38 mm) apart" in note and "less than 2.00 in (51 mm)" in note


def test_half_inch_strands_at_1_75_in_pass_and_at_1_7_in_give_a_note(tmp_path: Path) -> None:
    # 0.5 in strands: 1.75 in (AASHTO LRFD 9th Ed. (2020) Table 5.10.3.3.1-1, from memory)
    half = {
        'diameter = "0.6 in"': 'diameter = "0.5 in"',
        'area = "0.217 in^2"': 'area = "0.153 in^2"',
    }
    row = '[[strands.rows]]\nheight = "2 in"\ncount = 8\nspacing = "{}"\n'
    assert spacing_notes(us_variant(tmp_path, row.format("1.75 in"), **half)) == []
    (note,) = spacing_notes(us_variant(tmp_path, row.format("1.7 in"), **half))
    assert "row 1 (at 2.00 in): two strands 1.70 in (43 mm) apart" in note
    assert "less than 1.75 in (44 mm), the least spacing of 0.50 in strands" in note


def test_shipped_examples_get_no_spacing_note() -> None:
    for path in sorted(EXAMPLES.glob("*.toml")):
        assert spacing_notes(path) == [], path.name


def test_si_job_in_a_50_mm_grid_gets_no_note(tmp_path: Path) -> None:
    # 15.24 mm strands at the 50 mm pitch of metric beds, taken as the table's 2 in
    # (common practice)
    text = SI_EXAMPLE.read_text(encoding="utf-8")
    assert 'spacing = "50.8 mm"' in text
    job = write_job(tmp_path, text.replace('spacing = "50.8 mm"', 'spacing = "50 mm"'))
    assert spacing_notes(job) == []


def test_the_design_search_default_pitch_meets_the_minimum() -> None:
    # prestress design's default grid: 2 in (US) and 50 mm (SI) (common practice)
    least, _ = minimum_strand_spacing(0.6 * INCH)
    assert DEFAULT_PITCH["US"] >= least
    assert DEFAULT_PITCH["SI"] >= least - STRAND_SPACING_TOLERANCE_MM


# ------------------------------------------------------------------------------------------
# Station names (this project's rule: names are looked up without letter case)


def stations_variant(tmp_path: Path, stations: str) -> Path:
    text = US_EXAMPLE.read_text(encoding="utf-8")
    return write_job(tmp_path, f"stations = {stations}\n\n{text}")


@pytest.mark.parametrize(
    "name",
    [
        "midspan",
        " MidSpan ",
        "left end",
        "right bearing",
        "left lt",
        "0.3 span",
        "left lift point",
        "right hold-down",
        "left debond end 2",
        "right debond end 1 + lt",
        "tendon profile point",
    ],
)
def test_a_station_named_as_a_built_in_one(tmp_path: Path, name: str) -> None:
    err = error_of(stations_variant(tmp_path, f'[{{ name = "{name}", at = "10 ft" }}]'))
    assert err.field == "stations[0].name"
    assert "not one of the stations every check lists" in err.expected
    assert repr(name) in err.got


@pytest.mark.parametrize("name", ["", "   "])
def test_an_empty_station_name(tmp_path: Path, name: str) -> None:
    err = error_of(stations_variant(tmp_path, f'[{{ name = "{name}", at = "10 ft" }}]'))
    assert err.field == "stations[0].name"
    assert "not empty" in err.expected


def test_a_station_name_given_twice(tmp_path: Path) -> None:
    job = stations_variant(
        tmp_path, '[{ name = "splice", at = "10 ft" }, { name = "Splice", at = "20 ft" }]'
    )
    err = error_of(job)
    assert err.field == "stations[1].name"
    assert "stations[0] has it already" in err.expected


def test_own_station_names_pass(tmp_path: Path) -> None:
    job = stations_variant(
        tmp_path,
        '[{ name = "splice", at = "10 ft" }, { at = "20 ft" }, { at = "30 ft" },'
        ' { name = "midspan diaphragm", at = "41 ft" }]',
    )
    names = [n for n, _ in load_job(job).user_stations]
    assert names == ["splice", "station 2", "station 3", "midspan diaphragm"]


# ------------------------------------------------------------------------------------------
# Relative humidity


@pytest.mark.parametrize("value", ["0", '"0 percent"'])
def test_zero_humidity_is_refused(tmp_path: Path, value: str) -> None:
    job = us_variant(
        tmp_path, US_ROWS, **{"relative_humidity = 70 ": f"relative_humidity = {value} "}
    )
    err = error_of(job)
    assert err.field == "time.relative_humidity"
    assert "above 0" in err.expected and "0 to 100" in err.expected


@pytest.mark.parametrize("method", ["aashto-approximate", "aashto-refined"])
@pytest.mark.parametrize("rh", [5, 39])
def test_aashto_methods_note_humidity_below_40(tmp_path: Path, method: str, rh: int) -> None:
    # below 40 %: outside the range the AASHTO LRFD 9th Ed. (2020) estimates were calibrated
    # for (5.4.2.3, 5.9.3.3, 5.9.3.4; range from memory)
    job = us_variant(tmp_path, US_ROWS, **{"relative_humidity = 70 ": f"relative_humidity = {rh} "})
    _, losses = losses_file(job, method=method)
    (note,) = [n for n in losses.notes if "RH =" in n]
    assert note.startswith(f"{method} method: RH = {rh} % is below 40 %")
    assert "from memory" in note and "extrapolated" in note


@pytest.mark.parametrize("method", ["aashto-approximate", "aashto-refined"])
def test_aashto_methods_no_humidity_note_at_40(tmp_path: Path, method: str) -> None:
    job = us_variant(tmp_path, US_ROWS, **{"relative_humidity = 70 ": "relative_humidity = 40 "})
    _, losses = losses_file(job, method=method)
    assert not [n for n in losses.notes if "RH =" in n]


def test_time_step_humidity_notes_unchanged(tmp_path: Path) -> None:
    # the ACI 209R-92 time-step method keeps its own note (ACI 209R-92 2.5.4, 40 % lowest)
    job = us_variant(tmp_path, US_ROWS, **{"relative_humidity = 70 ": "relative_humidity = 30 "})
    _, losses = losses_file(job, method="time-step-aci209")
    rh_notes = [n for n in losses.notes if "RH =" in n]
    assert rh_notes == [
        "time-step-aci209 method: RH = 30 % is below 40 %, the lowest humidity for which "
        "ACI 209R-92 2.5.4 gives its creep and shrinkage correction factors"
    ]


def test_every_station_the_checks_name_is_a_reserved_name() -> None:
    """The reserved names cover every station the engine names (so they cannot drift apart):
    every station of every shipped example, its merged parts each."""
    from prestress.analysis import resolve_girder
    from prestress.jobfile import _DEBOND_END_STATION, BUILT_IN_STATION_NAMES
    from prestress.stages import stations
    from tests.conftest import EXAMPLES

    for path in sorted(EXAMPLES.glob("*.toml")):
        girder = resolve_girder(load_job(path))
        for st in stations(girder):
            for part in st.name.split(" / "):
                assert part in BUILT_IN_STATION_NAMES or _DEBOND_END_STATION.fullmatch(part), (
                    path.name,
                    part,
                )
