"""The strand-pattern search (prestress.design): a girder whose answer is worked by hand, the
vectorised evaluator against the ordinary full check, exhaustiveness against a brute-force
loop, the detailing rules as hard constraints, the written job file, and bad [design] input.

The hand-worked girder is an invented 16 in × 30 in rectangle with one straight row of 0.5 in
strands; its only limit is the Service III tension at the girder bottom, so the number of
strands follows from one inequality at midspan written out below with the AASHTO LRFD
equations the job's loss method uses (elastic shortening Eq. C5.9.3.2.3a-1, approximate
long-term losses Eq. 5.9.3.3-1).
"""

from __future__ import annotations

import math
import tomllib
from dataclasses import replace
from pathlib import Path

import numpy as np
import pytest

from prestress.analysis import run_check
from prestress.design import (
    design_file,
    governing_of,
    job_with_rows,
    load_job_and_design,
    search,
    write_design_job,
)
from prestress.errors import InputError
from prestress.jobfile import load_job
from prestress.layout import debonding_warnings
from prestress.model import StrandRow
from tests.conftest import EXAMPLES

IN, FT = 25.4, 304.8
HARPED = EXAMPLES / "harl-brook-span1-g2-harped.toml"
DEBONDED = EXAMPLES / "wexcombe-lane-g4-debonded.toml"

RECT_JOB = """\
# Invented test girder: a 16 in x 30 in rectangle, one row of straight strands.
[job]
title = "Test rectangle (invented)"
units = "US"

[girder]
section = {{ name = "R16x30", family = "rectangle", dimensions = {{ width = "16 in", depth = "30 in" }} }}
length = "40 ft"
span = "40 ft"

[girder.concrete]
fci = "5.0 ksi"
fc = "6.0 ksi"
unit_weight = "150 pcf"
modulus = "4000 ksi"
modulus_at_transfer = "3600 ksi"

[strand]
diameter = "0.5 in"
area = "0.153 in^2"
fpu = "270 ksi"
fpy = "243 ksi"
modulus = "28500 ksi"
jacking_stress = "202.5 ksi"

[strands]

[[strands.rows]]
height = "3 in"          # the job's own pattern (replaced by the search's answer)
count = 1

[loads.live]
moment_midspan = "{live}"

[time]
relative_humidity = 70
transfer = "1 day"
deck_placement = "60 day"
final = "20000 day"
{losses}
[limits]
name = "limits of the test (invented)"
{limits}
{design}"""

# The limits are inputs of the tests only (the coefficients are those of AASHTO LRFD 9th Ed.
# Tables 5.9.2.3.1b-1 and 5.9.2.3.2b-1, from memory); nothing here checks the shipped set.
HAND_LIMITS = """\
[limits.service_iii.girder_bottom]
tension = { coefficient = 0.19, root_unit = "ksi" }
"""

HARP_LIMITS = """\
[limits.transfer]
compression = 0.65
tension = { coefficient = 0.0948, root_unit = "ksi", cap = "0.2 ksi" }
[limits.service_iii.girder_bottom]
tension = { coefficient = 0.19, root_unit = "ksi" }
"""

ONE_ROW = """\
[design]
mode = "straight"
heights = ["3 in"]
positions = ["-6 in", "-5 in", "-4 in", "-3 in", "-2 in", "-1 in", "0 in", "1 in", "2 in", "3 in", "4 in", "5 in", "6 in"]
"""

SMALL_HARP = """\
[design]
mode = "harp"
heights = ["2 in", "4 in"]
positions = ["-3 in", "-1 in", "1 in", "3 in"]
harp = { end_height = "24 in", hold_down = 0.4 }
"""


def write_rect(
    folder: Path,
    *,
    design: str = ONE_ROW,
    limits: str = HAND_LIMITS,
    live: str = "335 kip*ft",
    losses: str = "",
    name: str = "rect.toml",
) -> Path:
    path = folder / name
    path.write_text(
        RECT_JOB.format(design=design, limits=limits, live=live, losses=losses), encoding="utf-8"
    )
    return path


# ------------------------------------------------------------------------------------------
# The girder worked by hand


def hand_bottom_stress_ksi(N: int, M_LL_kipft: float) -> float:
    """Service III stress at the bottom fiber at midspan (ksi, tension +), by hand.

    Rectangle b = 16 in, h = 30 in: A = 480 in², I = b h³/12 = 36,000 in⁴, yb = 15 in,
    Sb = 2,400 in³; strands at 3 in, e = 12 in; span = girder length = 40 ft.
    Self-weight w = 0.150 kcf × 480/144 ft² = 0.5 kip/ft, Mg = w L²/8 = 100 kip·ft.
    Service III (AASHTO LRFD Table 3.4.1-1, the job's default factors): M = Mg + 0.8 M_LL.
    Losses by the job's method "aashto-approximate" with fpbt = fpj = 202.5 ksi:
    ΔfpES = [Aps fpbt (I + e² A) − e Mg A] / [Aps (I + e² A) + A I Eci/Ep]
    (AASHTO LRFD 9th Ed. Eq. C5.9.3.2.3a-1), with Eci = 3,600 ksi and Ep = 28,500 ksi;
    ΔfpLT = 10 fpbt Aps/A γh γst + 12 γh γst + 2.4 (Eq. 5.9.3.3-1), γh = 1.7 − 0.01 H = 1.0
    (Eq. 5.9.3.3-2, H = 70), γst = 5/(1 + f'ci) = 5/6 (Eq. 5.9.3.3-3); ΔfpR = 2.4 ksi for
    low-relaxation strand (5.9.3.3).
    f_b = −P/A − P e/Sb + M/Sb with P = Aps (fpbt − ΔfpES − ΔfpLT).
    """
    A, I, e = 480.0, 16.0 * 30.0**3 / 12.0, 12.0
    Sb = I / 15.0
    Aps, fpbt = N * 0.153, 202.5
    Mg = 0.5 * 40.0**2 / 8.0 * 12.0  # kip·in
    es = (Aps * fpbt * (I + e * e * A) - e * Mg * A) / (
        Aps * (I + e * e * A) + A * I * 3600.0 / 28500.0
    )
    gh, gst = 1.7 - 0.01 * 70.0, 5.0 / (1.0 + 5.0)
    lt = 10.0 * fpbt * Aps / A * gh * gst + 12.0 * gh * gst + 2.4
    P = Aps * (fpbt - es - lt)
    M = Mg + 0.8 * M_LL_kipft * 12.0
    return -P / A - P * e / Sb + M / Sb


def test_hand_worked_strand_count(tmp_path: Path) -> None:
    """The leanest count is the smallest N of the fill levels with f_b(N) ≤ 0.19 √f'c."""
    res = design_file(write_rect(tmp_path))
    # fill levels of the one-row grid 0, ±1 in, ..., ±6 in: 1, 3, 5, ..., 13 strands
    assert res.levels == (1, 3, 5, 7, 9, 11, 13)
    assert res.size == 7
    limit = 0.19 * math.sqrt(6.0)  # ksi: the job's tension limit, coefficient 0.19 √f'c (ksi)
    needed = min(N for N in res.levels if hand_bottom_stress_ksi(N, 335.0) <= limit)
    assert needed == 9  # by hand: f_b(7) = 0.479 ksi > 0.465 ksi ≥ f_b(9) = 0.137 ksi
    best = res.leanest
    assert best is not None and best.candidate.strands == needed
    assert best.utilisation == pytest.approx(hand_bottom_stress_ksi(9, 335.0) / limit, rel=1e-9)
    assert (best.governing.stage, best.governing.station, best.governing.fiber) == (
        "service_iii",
        "midspan",
        "girder_bottom",
    )
    nl = res.next_leaner
    assert nl is not None and nl.candidate.strands == 7 and not nl.ok
    g = nl.failures[0]
    assert (g.stage, g.station, g.fiber) == ("service_iii", "midspan", "girder_bottom")
    assert g.utilisation == pytest.approx(hand_bottom_stress_ksi(7, 335.0) / limit, rel=1e-9)
    assert res.passing == 3  # 9, 11 and 13 strands


# ------------------------------------------------------------------------------------------
# The vectorised evaluator agrees with the ordinary check


def full_stresses(job) -> dict[tuple[str, float, str], float]:
    r = run_check(job)
    return {
        (s.key, st.x, f): fr.stress
        for s in r.stages
        for st in s.stations
        for f, fr in st.fibers.items()
    }


@pytest.mark.parametrize(
    "case",
    [
        "harped example (refined losses, HL-93, handling)",
        "debonded example, four lengths",
        "rectangle on transformed sections, harped",
        "rectangle, hold-downs both left of midlength",
    ],
)
def test_vectorised_stresses_agree_with_run_check(case: str, tmp_path: Path) -> None:
    if case.startswith("harped"):
        job, design = load_job(HARPED), None
    elif case.startswith("debonded"):
        job, design = load_job(DEBONDED), {"debond_lengths": ["6 ft", "10 ft", "14 ft", "20 ft"]}
    elif case.startswith("rectangle on"):
        path = write_rect(
            tmp_path,
            design=SMALL_HARP,
            limits=HARP_LIMITS,
            losses='\n[losses]\nsection = "transformed"\n',
        )
        job, design = load_job_and_design(path)
    else:
        # the harped strands' height at midlength, hence Aps's eccentricity there and the
        # losses, then depend on the harped count: one loss group per (level, harped count)
        lopsided = SMALL_HARP.replace("hold_down = 0.4", 'hold_downs = ["8 ft", "16 ft"]')
        job, design = load_job_and_design(write_rect(tmp_path, design=lopsided, limits=HARP_LIMITS))
    res, ev = search(job, design)
    if case.startswith("rectangle, hold-downs"):
        assert ev.group.max() + 1 == ev.enum.size > len(ev.enum.levels)
    evaluation = ev.evaluate()
    rng = np.random.default_rng(2024)
    for i in rng.choice(ev.enum.size, size=min(5, ev.enum.size), replace=False):
        vec = ev.stresses(int(i))
        cj = ev.candidate_job(int(i))
        full = full_stresses(cj)
        assert set(vec) == set(full)  # same stages, stations and fibers
        scale = max(abs(v) for v in full.values())
        for k, v in full.items():
            assert vec[k] == pytest.approx(v, rel=1e-9, abs=1e-9 * scale), k
        ok, util, _gov, _fails = governing_of(run_check(cj))
        assert ok == bool(evaluation.ok[i])
        assert evaluation.utilisation[i] == pytest.approx(util, rel=1e-9)
    # the reported candidates were checked in full and agree with the vectorised figures
    for rc in res.best:
        assert rc.ok and rc.utilisation == pytest.approx(rc.vector_utilisation, rel=1e-9)


# ------------------------------------------------------------------------------------------
# Exhaustive: the same best candidate as a brute-force loop of the full check


def brute_force_patterns() -> list[tuple[int, int, list[StrandRow]]]:
    """Every pattern of SMALL_HARP by hand: (strands, harped, rows).

    Grid rows at 2 and 4 in, positions ±1 and ±3 in; fill bottom-up, centre out in pairs:
    2, 4, 6, 8 strands. Harped pairs come from the top filled row, centre out; at the ends
    they stand in one column on the axis, the highest at 24 in, 2 in apart, the strands of
    the higher row at the top. Hold-downs at 0.4 L = 16 ft from each end.
    """
    hd = (0.4 * 40 * FT, 0.6 * 40 * FT)
    fills = [
        {2: [-1, 1]},
        {2: [-3, -1, 1, 3]},
        {2: [-3, -1, 1, 3], 4: [-1, 1]},
        {2: [-3, -1, 1, 3], 4: [-3, -1, 1, 3]},
    ]
    out = []
    for fill in fills:
        n = sum(len(v) for v in fill.values())
        harp_order = [(h, p) for h in sorted(fill, reverse=True) for p in (1, 3) if p in fill[h]]
        for k in range(len(harp_order) + 1):
            harped = harp_order[:k]
            rows, top = [], 24 * IN
            for h in sorted(fill, reverse=True):
                hx = [x for hh, p in harped if hh == h for x in (-p, p)]
                sx = [x for x in fill[h] if x not in hx]
                if hx:
                    rows.append(
                        StrandRow(
                            h * IN,
                            len(hx),
                            0.0,
                            tuple(sorted(x * IN for x in hx)),
                            harp=(top, hd, 2 * IN),
                        )
                    )
                    top -= len(hx) * 2 * IN
                if sx:
                    rows.append(StrandRow(h * IN, len(sx), 0.0, tuple(x * IN for x in sx)))
            out.append((n, 2 * k, rows))
    return out


def test_search_is_exhaustive_against_brute_force(tmp_path: Path) -> None:
    path = write_rect(tmp_path, design=SMALL_HARP, limits=HARP_LIMITS, live="150 kip*ft")
    job, design = load_job_and_design(path)
    res, ev = search(job, design)
    patterns = brute_force_patterns()
    assert res.size == len(patterns) == 14  # 2 + 3 + 4 + 5 harp options over the 4 levels
    assert any(label == "size" and "14 candidates" in text for label, text in res.description)
    # the enumeration holds exactly the hand-made patterns
    enumerated = {
        (c.strands, c.harped, tuple((r["height"], r["count"], r["harped"]) for r in c.by_height()))
        for c in (ev.candidate(i) for i in range(ev.enum.size))
    }
    by_hand = set()
    for n, nh, rows in patterns:
        per: dict[float, list[int]] = {}
        for r in rows:
            d = per.setdefault(r.height, [0, 0])
            d[0] += r.count
            d[1] += r.count if r.harp else 0
        by_hand.add((n, nh, tuple((h, c, hh) for h, (c, hh) in sorted(per.items()))))

    def rounded(items):
        return {(a, b, tuple((round(h, 6), c, hh) for h, c, hh in r)) for a, b, r in items}

    assert rounded(enumerated) == rounded(by_hand)
    # brute force: the full check of every pattern, best by the stated preference
    checked = []
    for n, nh, rows in patterns:
        ok, util, _g, _f = governing_of(run_check(job_with_rows(job, rows)))
        checked.append((ok, n, nh, util))
    passing = sorted((n, nh, util) for ok, n, nh, util in checked if ok)
    assert passing, "the small space should hold a passing pattern"
    n_best, nh_best, u_best = passing[0]
    best = res.leanest
    assert best is not None
    assert (best.candidate.strands, best.candidate.harped) == (n_best, nh_best)
    assert best.utilisation == pytest.approx(u_best, rel=1e-9)
    assert nh_best > 0  # harping is what makes the leanest count work here
    assert res.passing == len(passing)


# ------------------------------------------------------------------------------------------
# Debonding: the detailing rules are hard constraints


def test_debonding_patterns_respect_the_detailing_rules() -> None:
    job = load_job(DEBONDED)
    res, ev = search(job, {"debond_lengths": ["6 ft", "12 ft"]})
    assert res.size < res.size_before_rules  # the rules cut the space
    rng = np.random.default_rng(5)
    for i in [*rng.choice(ev.enum.size, size=25, replace=False), res.leanest.candidate.index]:
        cj = ev.candidate_job(int(i))
        assert debonding_warnings(cj.layout, [r.x for r in cj.rows]) == []
    assert not any(n.startswith("detailing:") for n in res.leanest.notes)
    assert res.leanest.candidate.debonded > 0
    # AASHTO LRFD 9th Ed. 5.9.4.3.3 (limits from memory): at most 25 % of the strands
    c = res.leanest.candidate
    assert c.debonded <= 0.25 * c.strands


# ------------------------------------------------------------------------------------------
# The written job file


def test_written_job_loads_and_checks(tmp_path: Path) -> None:
    src = write_rect(tmp_path, design=SMALL_HARP, limits=HARP_LIMITS, live="150 kip*ft")
    res = design_file(src)
    out = tmp_path / "designed.toml"
    write_design_job(src, res.leanest, out)
    job = load_job(out)  # the [design] table is kept as a comment
    check = run_check(job)
    assert check.ok
    assert governing_of(check)[1] == pytest.approx(res.leanest.utilisation, rel=1e-9)
    assert job.strand_count == res.leanest.candidate.strands
    assert sum(r.count for r in job.rows if r.harp) == res.leanest.candidate.harped
    # everything but the strand rows (and the [design] table) is as it was
    before = tomllib.loads(src.read_text(encoding="utf-8"))
    after = tomllib.loads(out.read_text(encoding="utf-8"))
    before.pop("design")
    assert {k: v for k, v in before.items() if k != "strands"} == {
        k: v for k, v in after.items() if k != "strands"
    }
    text = out.read_text(encoding="utf-8")
    assert "# Invented test girder" in text and "# [design]" in text
    # never over an existing file without force, never over the input
    with pytest.raises(InputError, match="does not exist yet"):
        write_design_job(src, res.leanest, out)
    write_design_job(src, res.leanest, out, force=True)
    with pytest.raises(InputError, match="different from the input"):
        write_design_job(src, res.leanest, src, force=True)


def test_written_job_replaces_a_strand_grid(tmp_path: Path) -> None:
    src = write_rect(tmp_path)
    text = src.read_text(encoding="utf-8").replace(
        '[[strands.rows]]\nheight = "3 in"          # the job\'s own pattern (replaced by the '
        "search's answer)\ncount = 1\n",
        '[strands.grid]\nheights = ["3 in"]\npositions = ["-1 in", "1 in"]\ncount = 2\n'
        'order = [\n  [1, 1],\n  [1, 2],\n]\nfill = "given"\n',
    )
    src.write_text(text, encoding="utf-8")
    res = design_file(src)
    out = tmp_path / "from-grid.toml"
    write_design_job(src, res.leanest, out)
    after = tomllib.loads(out.read_text(encoding="utf-8"))
    assert "grid" not in after["strands"] and len(after["strands"]["rows"]) == 1
    job = load_job(out)
    assert job.strand_count == 9 and run_check(job).ok


# ------------------------------------------------------------------------------------------
# Bad [design] input names the field


@pytest.mark.parametrize(
    ("design", "field"),
    [
        ("[design]\nmax_strand = 10\n", "design.max_strand"),
        ('[design]\nmode = "harped"\n', "design.mode"),
        ("[design]\nmin_strands = 9\nmax_strands = 5\n", "design.max_strands"),
        ('[design]\npositions = ["-1 in", "3 in"]\n', "design.positions"),
        ('[design]\nheights = ["2 in", 4]\n', "design.heights[1]"),
        ('[design]\nmode = "harp"\n', "design.harp"),
        ('[design]\nmode = "debond"\n', "design.debond_lengths"),
        ('[design]\nmode = "debond"\ndebond_lengths = ["25 ft"]\n', "design.debond_lengths[0]"),
        ('[design]\nmode = "straight"\ndebond_lengths = ["5 ft"]\n', "design.debond_lengths"),
        ('[design]\nmode = "harp"\nharp = { end_height = "24 in" }\n', "design.harp.hold_down"),
        (
            '[design]\nmode = "harp"\nharp = { end_height = "40 in", hold_down = 0.4 }\n',
            "design.harp.end_height",
        ),
        ("[design]\nmax_candidates = 3\n", "design.max_candidates"),
        ("[design]\nreport = 0\n", "design.report"),
    ],
)
def test_bad_design_input_names_the_field(tmp_path: Path, design: str, field: str) -> None:
    path = write_rect(tmp_path, design=design)
    with pytest.raises(InputError) as exc:
        design_file(path)
    assert exc.value.field == field
    assert str(path) in str(exc.value)


def test_job_file_with_a_design_table_still_loads(tmp_path: Path) -> None:
    job, design = load_job_and_design(write_rect(tmp_path))
    assert design["mode"] == "straight" and job.strand_count == 1
    assert replace(job).title == "Test rectangle (invented)"


def test_rewriting_keeps_tricky_toml_as_it_was() -> None:
    from prestress.design import design_job_text

    original = '''\
[job]
title = "x # not a comment [not a table]"   # a comment
[strands]
transfer_length = "30 in"
[[strands.rows]]
height = "2 in"
positions = [
  "-1 in",  # left
  "1 in",   # right ]
]
[strands.rows.harp]
end_height = "20 in"
hold_down = 0.4
[[strands.rows]]
height = '4 in'
count = 2
[design]
mode = "harp"
[design.harp]
end_height = "20 in"
hold_down = 0.4

# about the loads
[loads]
note = """multi
[not a header]
line"""
'''
    rows = (StrandRow(2 * IN, 2, 0.0, (-IN, IN)),)
    text = design_job_text(original, rows, "US")
    data = tomllib.loads(text)
    assert data["strands"] == {
        "transfer_length": "30 in",
        "rows": [{"height": "2 in", "count": 2, "spacing": "2 in"}],
    }
    assert "design" not in data and "# [design.harp]" in text
    assert data["job"]["title"] == "x # not a comment [not a table]"
    assert data["loads"]["note"] == "multi\n[not a header]\nline"
    assert "\n\n# about the loads\n[loads]" in text and "# # about" not in text


def test_written_job_in_another_folder_keeps_its_references(tmp_path) -> None:
    """A pattern written elsewhere still finds the limit file the original names."""
    from prestress.analysis import run_check
    from prestress.design import design_file, write_design_job
    from prestress.jobfile import load_job
    from tests.conftest import EXAMPLES

    src = EXAMPLES / "harl-brook-span1-g2-harped.toml"
    result = design_file(src)
    out = tmp_path / "elsewhere" / "leaner.toml"
    out.parent.mkdir()
    write_design_job(src, result.leanest, out)
    assert run_check(load_job(out)).ok


def test_write_with_no_passing_pattern_shows_the_search_and_writes_nothing(
    tmp_path: Path, capsys: pytest.CaptureFixture[str]
) -> None:
    """Nothing passes: the search is still shown (exit 1, a failing verdict), no file written."""
    from prestress.cli import main

    src = write_rect(tmp_path, live="5000 kip*ft")
    out = tmp_path / "never.toml"
    assert main(["design", str(src), "--write", str(out)]) == 1
    captured = capsys.readouterr()
    assert "No pattern of the space passes" in captured.out
    assert "not written" in captured.err and not out.exists()


def test_design_of_a_post_tensioned_job_is_a_clear_error(capsys) -> None:
    """The search is for strand patterns; a job with tendons gets exit 2, not a crash."""
    from prestress.cli import main

    assert main(["design", str(EXAMPLES / "corrie-beck-g1-post-tensioned.toml")]) == 2
    err = capsys.readouterr().err
    assert "tendons" in err and "internal error" not in err
