"""Harped strands keep their whole path inside the concrete (prestress.layout, prestress.design).

A harped strand runs straight from its place between the hold-downs to its place in the end
column on the girder axis, so every cross-section between a hold-down and the girder end cuts
it on the straight segment joining the two. That whole segment, not sample points of it, must
lie inside the concrete with the cover every strand position is checked with (a strand radius
of cover): AASHTO LRFD 9th Ed. (2020) 5.10.1 (concrete cover), from memory; harped strands
deflected within the web, common practice.

Every job here is invented test data (invented titles, no real bridge). The review case is a
BT-72 whose whole bottom row of 12 strands (x = ±1 ... ±11 in) is harped to a column on the
axis: the bulb-tee's web is 6 in wide, so strands from |x| > about 3 in leave the web on the
way.
"""

from __future__ import annotations

import numpy as np
import pytest
from shapely.geometry import LineString, Point, Polygon

from prestress.analysis import resolve_girder, run_check
from prestress.cli import main
from prestress.design import job_with_rows, load_job_and_design, search
from prestress.errors import InputError
from prestress.jobfile import load_job
from prestress.layout import (
    END_COLUMN_X,
    StrandSet,
    harp_path_error,
    path_inside,
    paths_to_column_inside,
)
from tests.conftest import EXAMPLES, write_job

IN, FT = 25.4, 304.8
HARPED = EXAMPLES / "harl-brook-span1-g2-harped.toml"

BT72_JOB = """\
# Invented test job: a BT-72 with a straight bottom row and one harped row.
[job]
title = "Harped row test (invented)"

[girder]
section = "AASHTO-PCI-BT-72"
length = "122 ft"
span = "120 ft"
spacing = "8 ft"

[girder.concrete]
fci = "6.5 ksi"
fc = "8.5 ksi"
unit_weight = "150 pcf"
modulus_unit_weight = "145 pcf"

[deck]
thickness = "8 in"

[deck.concrete]
fc = "4.0 ksi"
unit_weight = "150 pcf"

[strand]
diameter = "0.6 in"
area = "0.217 in^2"
fpu = "270 ksi"
fpy = "243 ksi"
modulus = "28500 ksi"
jacking_stress = "202.5 ksi"

[[strands.rows]]
height = "2 in"
count = 12
[[strands.rows]]
height = "4 in"
count = {harped}
harp = {{ end_height = "66 in", hold_down = 0.4 }}
{extra}
[loads.live]
moment_midspan = "2400 kip*ft"

[time]
relative_humidity = 70
transfer = "1 day"
deck_placement = "90 day"
final = "20000 day"

[limits]
set = "aashto-lrfd-9th-service"
"""

#: Further rows of the design job: straight rows in the bulb, clear of the harped 4 in row's
#: column (x = ±1 in), so that no harped path passes through them.
DESIGN_ROWS = """
[[strands.rows]]
height = "6 in"
positions = ["-7 in", "-5 in", "-3 in", "3 in", "5 in", "7 in"]
[[strands.rows]]
height = "8 in"
positions = ["-3 in", "3 in"]
[[strands.rows]]
height = "10 in"
positions = ["-3 in", "3 in"]
"""


def bt72(tmp_path, harped: int, extra: str = "", name: str = "job.toml"):
    """The invented BT-72 job with `harped` strands harped in its 4 in row."""
    return write_job(tmp_path, BT72_JOB.format(harped=harped, extra=extra), name)


# ------------------------------------------------------------------------------------------
# The path check on a section worked by hand


#: An inverted tee (in): bottom flange 20 in wide and 6 in deep, web 6 in wide up to 30 in.
TEE_IN = [(-10, 0), (10, 0), (10, 6), (3, 6), (3, 30), (-3, 30), (-3, 6), (-10, 6)]
TEE = Polygon([(x * IN, y * IN) for x, y in TEE_IN])
R = 0.5 * IN  # strand radius of cover used for the tee (a 1 in strand)


def pt(x: float, y: float) -> tuple[float, float]:
    return (x * IN, y * IN)


def test_path_check_on_an_inverted_tee_by_hand() -> None:
    # Inside the web with cover: |x| ≤ 3 − 0.5 = 2.5 in above y = 6 in (common practice:
    # the strand's centre at least one radius from every face).
    # (2, 3) → (0, 20): at y = 6 in the path is at x = 2 (1 − 3/17) = 1.65 in ≤ 2.5 in; its
    # distance to the re-entrant corner (3, 6) is |1·17 − 3·(−2)| / √(2² + 17²) = 1.34 in ≥ 0.5
    assert path_inside(TEE, pt(2, 3), pt(0, 20), R)
    # (5, 3) → (0, 20): at y = 6 in, x = 5 (1 − 3/17) = 4.12 in > 3 in: out of the concrete
    assert not path_inside(TEE, pt(5, 3), pt(0, 20), R)
    # both ends inside with cover, the middle outside: (8, 3) in the flange → (2, 25) in the
    # web crosses y = 6 in at x = 8 − 6 × 3/22 = 7.18 in, beside the web
    assert Point(pt(8, 3)).buffer(R).within(TEE) and Point(pt(2, 25)).buffer(R).within(TEE)
    assert not path_inside(TEE, pt(8, 3), pt(2, 25), R)
    # vertical paths up the web: at 2.5 in from the axis the cover is exactly the radius
    # (accepted); at 2.6 in it is 0.4 in < 0.5 in (refused)
    assert path_inside(TEE, pt(2.5, 8), pt(2.5, 25), R)
    assert not path_inside(TEE, pt(2.6, 8), pt(2.6, 25), R)


def test_the_whole_path_is_checked_not_sample_points() -> None:
    # a 20 in x 40 in block with a 2 in square void at y = 10 to 12 in on the axis: a path up
    # the axis from y = 2 to 38 in has its ends and its middle (y = 20 in) in the concrete,
    # yet passes through the void
    void = [pt(-1, 10), pt(1, 10), pt(1, 12), pt(-1, 12)]
    block = Polygon([pt(-10, 0), pt(10, 0), pt(10, 40), pt(-10, 40)], [void])
    for y in (2, 20, 38):
        assert Point(pt(0, y)).buffer(R).within(block)
    assert not path_inside(block, pt(0, 2), pt(0, 38), R)
    # beside the void with cover (x = 1 + 0.5 = 1.5 in) the path is accepted
    assert path_inside(block, pt(1.5, 2), pt(1.5, 38), R)


def test_paths_to_every_place_of_the_end_column_by_hand() -> None:
    # the end column on the axis from 2 in to 25 in: from (2, 3) every path stays in the web
    # (the farthest one, to (0, 25), crosses y = 6 in at x = 2 (1 − 3/22) = 1.73 in ≤ 2.5 in);
    # from (5, 3) and (9, 3) the paths to the top of the column leave it (only those to the
    # places low in the column stay in the flange)
    ok = paths_to_column_inside(TEE, [pt(2, 3), pt(5, 3), pt(9, 3)], (2 * IN, 25 * IN), R)
    assert ok.tolist() == [True, False, False]
    # a column of one place: the single path
    one = paths_to_column_inside(TEE, [pt(5, 3)], (4 * IN, 4 * IN), R)
    assert one.tolist() == [path_inside(TEE, pt(5, 3), pt(0, 4), R)] == [True]


def test_harped_strand_moves_across_linearly_to_the_end_column() -> None:
    # the layout's end column is on the axis (common practice for I-girder and bulb-tee
    # webs); a strand harped from x = 5 in moves across as it rises: halfway between the
    # hold-down and the end it is at x = 2.5 in, y = (8 + 66) / 2 = 37 in
    L = 122 * FT
    s = StrandSet("h", 0, (5 * IN,), 140.0, 8 * IN, 66 * IN, (0.4 * L, 0.6 * L))
    x = np.array([0.0, 0.2 * L, 0.4 * L, 0.5 * L, 0.8 * L, L])
    assert END_COLUMN_X == 0.0
    assert s.lateral(5 * IN, x, L) == pytest.approx(np.array([0, 2.5, 5, 5, 2.5, 0]) * IN)
    assert s.section_paths() == (((5 * IN, 8 * IN), (0.0, 66 * IN)),)
    straight = StrandSet("b", 0, (5 * IN,), 140.0, 2 * IN)
    assert straight.section_paths() == ()
    assert straight.lateral(5 * IN, x, L) == pytest.approx(np.full(6, 5 * IN))


# ------------------------------------------------------------------------------------------
# Jobs: the review's wide harp is refused, a harp within the web accepted


def test_wide_harp_of_the_review_is_refused_with_the_row_named(tmp_path) -> None:
    path = bt72(tmp_path, 12)
    with pytest.raises(InputError) as info:  # resolving the girder runs the check
        resolve_girder(load_job(path))
    err = info.value
    msg = str(err)
    assert "\n" not in msg
    assert err.field == "strands.rows[1].harp" and str(path) in msg
    # web 6 in wide, strand radius 0.3 in: the strands harped from ±1 and ±3 in keep inside
    # (from (3, 4) the path to (0, 64) crosses the web's foot, y = 10.5 in, at x = 2.70 in)
    assert "at most 4 of this row's 12 positions (|x| ≤ 3.00 in)" in msg
    assert "8 harped strand(s) whose path leaves the concrete" in msg


def test_harp_of_the_two_central_strands_is_accepted(tmp_path) -> None:
    job = load_job(bt72(tmp_path, 2))
    g = resolve_girder(job)
    assert harp_path_error(job.layout, g.polygon, job.strand.diameter / 2.0) is None
    run_check(job)  # no InputError


def test_prestress_check_refuses_the_wide_harp_in_one_line(tmp_path, capsys) -> None:
    path = bt72(tmp_path, 12)
    assert main(["check", str(path)]) == 2
    err = capsys.readouterr().err.strip()
    assert len(err.splitlines()) == 1
    assert "strands.rows[1].harp" in err and "harped strands within the web" in err


def test_prestress_check_accepts_a_harp_within_the_web(tmp_path, capsys) -> None:
    assert main(["check", str(bt72(tmp_path, 2))]) in (0, 1)  # checked, not refused


def test_shipped_harped_example_keeps_its_harped_paths_inside() -> None:
    job = load_job(HARPED)
    g = resolve_girder(job)
    assert harp_path_error(job.layout, g.polygon, job.strand.diameter / 2.0) is None


def test_shipped_harped_example_passes_with_the_path_check() -> None:
    # its harped strands (x = ±1 in, within the web) pass the path check, and the girder
    # its stress checks (exit 0)
    job = load_job(HARPED)
    assert run_check(job).ok


# ------------------------------------------------------------------------------------------
# Design: harped strands only from positions whose path stays inside the web


def test_design_never_harps_a_strand_out_of_the_web(tmp_path) -> None:
    path = bt72(tmp_path, 2, DESIGN_ROWS)
    job, design = load_job_and_design(path)
    res, ev = search(job, design)
    assert any(
        label == "harpable positions"
        and "harped strands only from positions whose path to the end column stays inside the web"
        in text
        for label, text in res.description
    )
    g = resolve_girder(job)
    poly, r = g.polygon, job.strand.diameter / 2.0
    # an independent test of the whole path: the section eroded by the strand radius (shapely
    # buffer), with 1 µm of slack for the buffer's round-off
    eroded = poly.buffer(-r, quad_segs=64).buffer(1e-3)
    harped_positions = set()
    for i in range(ev.enum.size):
        c = ev.candidate(i)
        cjob = job_with_rows(job, c.rows)
        for s in cjob.layout.sets:
            for a, b in s.section_paths():
                assert eroded.covers(LineString([a, b])), (i, a, b)
                harped_positions.add((round(a[0] / IN, 3), round(a[1] / IN, 3)))
        assert harp_path_error(cjob.layout, poly, r) is None
    # the search did harp strands, and only from positions near the axis (the web is 6 in)
    assert harped_positions
    assert max(abs(x) for x, _y in harped_positions) <= 3.0
    # the review's pattern (all 12 strands of the 4 in row harped) is not in the space
    assert not any(
        h["harped"] > 4 for i in range(ev.enum.size) for h in ev.candidate(i).by_height()
    )


# ------------------------------------------------------------------------------------------
# Harped paths may not pass through other strands (a user review)


def test_a_harped_path_through_a_straight_strand_is_found_exactly() -> None:
    """Point-to-segment distance worked by hand (geometry, common practice): the strand
    harped from (3, 2) in to (0, 66) in passes (3, 6) in at 4 × 3 / √(3² + 64²) = 0.187 in."""
    from prestress.jobfile import closest_on_paths
    from prestress.model import StrandRow

    L, hd = 100.0 * FT, (40.0 * FT, 60.0 * FT)
    harped = StrandRow(2 * IN, 1, 0.0, (3 * IN,), (66 * IN, hd, 2 * IN))
    straight = StrandRow(6 * IN, 1, 0.0, (3 * IN,))
    found = closest_on_paths([harped, straight], L, 0.6 * IN)
    assert found is not None
    d, station, (a, _pa), (b, pb) = found
    assert d / IN == pytest.approx(4 * 3 / (3**2 + 64**2) ** 0.5, rel=1e-9)
    assert (a, b) == (0, 1) and pb == (3 * IN, 6 * IN) and 0 < station < hd[0]
    far = StrandRow(6 * IN, 1, 0.0, (7 * IN,))
    assert closest_on_paths([harped, far], L, 0.6 * IN) is None


def test_crossing_harped_rows_are_refused(tmp_path) -> None:
    """Rows that swap places in the bundle (8 in to the top of the end column, 12 in lower)
    cross on the way: an error naming the harp (the shipped example keeps its order)."""
    text = HARPED.read_text(encoding="utf-8")
    text = text.replace('end_height = "58 in"', 'end_height = "TOP"').replace(
        'end_height = "66 in"', 'end_height = "58 in"'
    )
    text = text.replace('end_height = "TOP"', 'end_height = "66 in"')
    with pytest.raises(InputError) as info:
        load_job(write_job(tmp_path, text))
    assert info.value.field.endswith(".harp") and "rising path" in str(info.value)


def test_design_leaves_out_patterns_whose_harped_paths_cross_strands() -> None:
    from prestress.design import design_file
    from prestress.jobfile import closest_on_paths

    result = design_file(HARPED)
    job = result.job
    for rc in result.best:
        rows = list(rc.candidate.rows)
        assert closest_on_paths(rows, job.length, job.strand.diameter - 1e-6) is None


@pytest.mark.parametrize(("end", "ok"), [("71.7 in", True), ("71.8 in", False)])
def test_end_column_at_the_top_cover(tmp_path, end: str, ok: bool) -> None:
    """BT-72, 0.6 in strands: the highest end place may have exactly its radius of cover
    (72 − 0.3 = 71.7 in; common practice); above it the error names the harp's end_height."""
    path = bt72(tmp_path, 2)
    path.write_text(
        path.read_text(encoding="utf-8").replace('end_height = "66 in"', f'end_height = "{end}"'),
        encoding="utf-8",
    )
    if ok:
        resolve_girder(load_job(path))
        return
    with pytest.raises(InputError) as info:
        resolve_girder(load_job(path))
    assert info.value.field == "strands.rows[1].harp.end_height"
