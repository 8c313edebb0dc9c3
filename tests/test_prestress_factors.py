"""Factors on the mean prestress in the stress checks (a limit set's ``prestress_factors``).

Source of the rule: EN 1992-1-1:2004 5.10.9(1)P (from memory): in serviceability
verifications two characteristic values of the prestressing force are used,
P_k,sup = r_sup P_m,t and P_k,inf = r_inf P_m,t, recommended r_sup = 1.05 and r_inf = 0.95 for
pretensioning (and unbonded tendons), r_sup = 1.10 and r_inf = 0.90 for post-tensioning with
bonded tendons. Only the prestress (its force and its moment) is factored, not the loads, and
each fiber takes the case that governs (common practice).

The girders here are invented: a 400 mm × 800 mm rectangle worked by hand, and an invented
bulb-tee beam whose Service III decompression check passes with the mean prestress alone.
"""

from __future__ import annotations

import tomllib
from dataclasses import replace
from pathlib import Path

import numpy as np
import pytest

from prestress.analysis import CheckResult, resolve_girder, run_check, zone_at
from prestress.design import governing_of, load_job_and_design, search
from prestress.errors import InputError
from prestress.jobfile import load_job, read_limits
from prestress.losses import compute_losses
from prestress.model import MEAN_PRESTRESS, STAGES, PrestressFactors
from prestress.stages import stage_specs, stage_stresses, stations
from prestress.tomlread import Table
from tests.conftest import EXAMPLES

# ------------------------------------------------------------------------------------------
# An invented rectangle, worked by hand

RECT_JOB = """\
# Invented test girder: a 400 mm x 800 mm rectangle, one row of straight strands, no deck.
[job]
title = "Test rectangle with factors on the prestress (invented)"
units = "SI"

[girder]
section = {{ name = "R400x800", family = "rectangle", dimensions = {{ width = "400 mm", depth = "800 mm" }} }}
length = "12 m"
span = "12 m"

[girder.concrete]
fci = "35 MPa"
fc = "45 MPa"
unit_weight = "25 kN/m^3"
modulus = "32000 MPa"
modulus_at_transfer = "30000 MPa"

[strand]
diameter = "12.7 mm"
area = "98.7 mm^2"
fpu = "1860 MPa"
fpy = "1675 MPa"
modulus = "195000 MPa"
jacking_stress = "1395 MPa"

[[strands.rows]]
height = "80 mm"
count = 8
spacing = "40 mm"

[loads.live]
moment_midspan = "360 kN*m"

[combinations.service_iii]
dead = 1.0
live = 0.8

[time]
relative_humidity = 70
transfer = "1 day"
deck_placement = "60 day"
final = "20000 day"

[limits]
# inputs of the test (invented): twice fctm at release, so that a straight pattern can pass
name = "limits of the test (invented)"
[limits.transfer]
compression = 0.60
tension = {{ rule = "en1992-fctm", coefficient = 2.0 }}
[limits.service_iii.girder_bottom]
tension = {{ coefficient = 0.0, root_unit = "MPa" }}
{factors}
{design}"""

EN_FACTORS = """\
[limits.prestress_factors]
note = "EN 1992-1-1:2004 5.10.9(1)P (from memory)"
inf = 0.95
sup = 1.05
"""

UNITY_FACTORS = """\
[limits.prestress_factors]
inf = 1.0
sup = 1.0
"""

# b = 400 mm, h = 800 mm: A = b h, I = b h³/12, c = h/2 (common practice); strands at 80 mm
B, H, Y_STRANDS, L = 400.0, 800.0, 80.0, 12_000.0
A_RECT, I_RECT, C_RECT = B * H, B * H**3 / 12.0, H / 2.0
E_RECT = H / 2.0 - Y_STRANDS
APS = 8 * 98.7


def write_rect(folder: Path, factors: str = EN_FACTORS, design: str = "", name: str = "") -> Path:
    path = folder / (name or "rect.toml")
    path.write_text(RECT_JOB.format(factors=factors, design=design), encoding="utf-8")
    return path


def station(result: CheckResult, stage: str, name: str):  # type: ignore[no-untyped-def]
    st = next(s for s in result.stages if s.key == stage)
    return next(s for s in st.stations if s.name == name)


def test_hand_check_at_midspan(tmp_path: Path) -> None:
    """Bottom at Service III: σ_loads + 0.95 σ_P; top and bottom at release with 1.05 σ_P.

    EN 1992-1-1:2004 5.10.9(1)P (from memory): P_k,inf = 0.95 P_m,t, P_k,sup = 1.05 P_m,t,
    recommended for pretensioning. Fiber stresses of a rectangle (common practice):
    σ_P = −P/A ∓ P e c/I from the prestress, σ_M = ± M c/I from the loads (bottom: upper
    sign); self-weight w = 25 kN/m³ × b h, M_g = w L²/8 on the girder length (supported at
    its ends at release, on its bearings in service: the same 12 m). Service III:
    M = M_g + 0.8 M_LL (the job's combination). The force P is the tool's mean value
    (P_m,t = the strand stress of its loss method × Aps).
    """
    result = run_check(load_job(write_rect(tmp_path)))
    losses = result.losses
    w = 25e-6 * A_RECT  # N/mm
    M_g = w * L**2 / 8.0

    # Service III, girder bottom at midspan: the lower value governs the decompression check
    mid = station(result, "service_iii", "midspan")
    P = losses.applied_final * APS
    assert mid.force == pytest.approx(P, rel=1e-12)  # the P column: the mean value
    sigma_P = -P / A_RECT - P * E_RECT * C_RECT / I_RECT
    sigma_M = (M_g + 0.8 * 360e6) * C_RECT / I_RECT
    bottom = mid.fibers["girder_bottom"]
    assert bottom.stress == pytest.approx(sigma_M + 0.95 * sigma_P, rel=1e-9, abs=1e-9)
    # with the mean prestress it would pass; with 0.95 P it does not (the test's numbers)
    assert sigma_M + sigma_P < 0.0 < sigma_M + 0.95 * sigma_P
    assert not bottom.ok

    # release at midspan: the upper value governs the top tension and the bottom compression
    rel = station(result, "transfer", "midspan")
    P_t = losses.applied_transfer * APS
    assert rel.force == pytest.approx(P_t, rel=1e-12)
    top_P = -P_t / A_RECT + P_t * E_RECT * C_RECT / I_RECT
    top_M = -M_g * C_RECT / I_RECT
    bottom_P = -P_t / A_RECT - P_t * E_RECT * C_RECT / I_RECT
    assert top_M + top_P > 0.0  # tension at the top: the higher force makes more
    assert rel.fibers["girder_top"].stress == pytest.approx(top_M + 1.05 * top_P, rel=1e-9)
    assert rel.fibers["girder_bottom"].stress == pytest.approx(-top_M + 1.05 * bottom_P, rel=1e-9)

    # the stage's notes say which factors were applied, and that P is the mean value
    for stage in result.stages:
        note = next(n for n in stage.notes if n.startswith("prestress × 0.95 or × 1.05"))
        assert "whichever governs each fiber" in note and "5.10.9(1)P" in note
        assert "P: the mean value" in note


def stresses_of(result: CheckResult) -> dict[tuple[str, str, str], float]:
    return {
        (s.key, st.name, f): fr.stress
        for s in result.stages
        for st in s.stations
        for f, fr in st.fibers.items()
    }


def test_factors_of_one_change_nothing(tmp_path: Path) -> None:
    """No factors, or both 1: the mean prestress alone, every figure exactly as before.

    The AASHTO sets give none (AASHTO LRFD 9th Ed. (2020) 5.9.2.3 checks the stresses with
    the effective prestress; from memory).
    """
    without = run_check(load_job(write_rect(tmp_path, factors="", name="none.toml")))
    unity = run_check(load_job(write_rect(tmp_path, factors=UNITY_FACTORS, name="one.toml")))
    assert stresses_of(without) == stresses_of(unity)  # exactly equal
    assert [s.notes for s in without.stages] == [s.notes for s in unity.stages]
    assert not any("prestress ×" in n for s in without.stages for n in s.notes)
    assert [(z.low, z.high, z.governing_low, z.governing_high) for z in without.zone] == [
        (z.low, z.high, z.governing_low, z.governing_high) for z in unity.zone
    ]
    # the engine keeps no factored cases then, and its mean stresses are the table's
    job = load_job(write_rect(tmp_path, factors="", name="none.toml"))
    girder = resolve_girder(job)
    losses = compute_losses(girder)
    sts = stations(girder)
    for spec, stage in zip(stage_specs(girder), without.stages, strict=True):
        raw = stage_stresses(girder, losses, spec, sts)
        assert raw.cases == () and raw.factors == MEAN_PRESTRESS
        for i, st in enumerate(stage.stations):
            for fiber, fr in st.fibers.items():
                assert (
                    fr.stress == float(raw.stresses[fiber][i]) or abs(raw.stresses[fiber][i]) < 1e-9
                )
    # the mean stresses are the same with the factors: only the checked cases are added
    with_f = load_job(write_rect(tmp_path))
    g_f = resolve_girder(with_f)
    for spec in stage_specs(g_f):
        a = stage_stresses(g_f, compute_losses(g_f), spec, stations(g_f))
        b = stage_stresses(girder, losses, spec, sts)
        assert [g for g, _ in a.cases] == [0.95, 1.05]
        for fiber in b.stresses:
            np.testing.assert_array_equal(a.stresses[fiber], b.stresses[fiber])


def test_shipped_sets() -> None:
    """The EN set gives 0.95/1.05 (pretensioned) and 0.90/1.10 (post-tensioned, bonded).

    EN 1992-1-1:2004 5.10.9(1)P, recommended values (from memory); the AASHTO sets none.
    """
    folder = EXAMPLES / "limits"
    for path in sorted(folder.glob("*.toml")):
        ls = read_limits(Table(tomllib.loads(path.read_text("utf-8")), file=str(path)))
        for stage in STAGES:
            pre, post = ls.factors(stage, False), ls.factors(stage, True)
            if path.stem.startswith("en1992"):
                assert (pre.inf, pre.sup, post.inf, post.sup) == (0.95, 1.05, 0.90, 1.10)
                assert "5.10.9(1)P" in pre.source and "bonded" in post.source
            else:
                assert pre == post == MEAN_PRESTRESS


def test_per_stage_and_post_tensioned_tables_resolve() -> None:
    """The most specific table wins, value by value (the rule of docs/job-file.md)."""
    data = {
        "transfer": {"compression": 0.6},
        "prestress_factors": {
            "inf": 0.95,
            "sup": 1.05,
            "transfer": {"sup": 1.0},
            "post_tensioned": {"inf": 0.9, "sup": 1.1, "service_iii": {"inf": 0.8}},
        },
    }
    ls = read_limits(Table(data, file="set.toml"))
    assert (ls.factors("transfer").inf, ls.factors("transfer").sup) == (0.95, 1.0)
    assert (ls.factors("service_i").inf, ls.factors("service_i").sup) == (0.95, 1.05)
    pt = ls.factors("transfer", True)
    # the stage's table beats the kind-wide post_tensioned one, value by value: sup from
    # the stage (a National Annex at transfer applies to both kinds), inf from post_tensioned
    assert (pt.inf, pt.sup) == (0.9, 1.0)
    assert (ls.factors("service_i", True).inf, ls.factors("service_i", True).sup) == (0.9, 1.1)
    assert (ls.factors("service_iii", True).inf, ls.factors("service_iii", True).sup) == (0.8, 1.1)
    assert PrestressFactors(0.9, 0.9).cases == (0.9,) and MEAN_PRESTRESS.cases == (1.0,)


def test_post_tensioned_job_takes_the_post_tensioned_factors() -> None:
    """A girder with tendons: r_inf = 0.90, r_sup = 1.10 (EN 1992-1-1:2004 5.10.9(1)P)."""
    job = load_job(EXAMPLES / "corrie-beck-g1-post-tensioned.toml")
    en = EXAMPLES / "limits" / "en1992-1-1-2004.toml"
    limits = read_limits(Table(tomllib.loads(en.read_text("utf-8")), file=str(en)))
    result = run_check(replace(job, limits=limits))
    for stage in result.stages:
        assert any(n.startswith("prestress × 0.9 or × 1.1,") for n in stage.notes)


# ------------------------------------------------------------------------------------------
# An invented bulb-tee beam: Service III decompression passes only with the mean prestress

BEAM_JOB = """\
# Invented job: Ardlow Burn Underpass, beam B2, SI, EN 1992-1-1 limits, time-step EN losses.
[job]
title = "Beam B2 (EN limits, SI)"
project = "Ardlow Burn Underpass (invented)"
units = "SI"

[girder]
section = "AASHTO-PCI-BT-63"
length = "30.6 m"
span = "30.0 m"
spacing = "2.5 m"

[girder.concrete]
fci = "55 MPa"
fc = "55 MPa"
unit_weight = "25 kN/m^3"
modulus = "en1992"

[deck]
thickness = "200 mm"
haunch = "30 mm"
effective_width = "2500 mm"

[deck.concrete]
fc = "35 MPa"
unit_weight = "25 kN/m^3"
modulus = "en1992"

[strand]
diameter = "15.7 mm"
area = "150 mm^2"
fpu = "1860 MPa"
fpy = "1640 MPa"
modulus = "195 GPa"
relaxation = "low"
jacking_stress = "1395 MPa"

[[strands.rows]]
height = "50 mm"
count = 12
spacing = "50 mm"
debond = [ { count = 4, length = "4 m", positions = [3, 4, 9, 10] } ]

[[strands.rows]]
height = "100 mm"
count = 10
spacing = "50 mm"

[loads]
superimposed_dead = "4.5 kN/m"
wearing_surface = "5.0 kN/m"

[loads.live]
moment_midspan = "1800 kN*m"

[combinations.service_iii]
dead = 1.0
live = 0.75

[time]
relative_humidity = 80
transfer = "2 day"
deck_placement = "60 day"
final = "36500 day"

[losses]
method = "time-step-en1992"

[limits]
{limits}
"""


def en_set_without_factors(folder: Path) -> Path:
    """The shipped EN set with its prestress_factors tables cut out (the set as it was)."""
    text = (EXAMPLES / "limits" / "en1992-1-1-2004.toml").read_text("utf-8")
    head, rest = text.split("[prestress_factors]", 1)
    path = folder / "en-mean-only.toml"
    path.write_text(head + "[transfer]" + rest.split("\n[transfer]", 1)[1], encoding="utf-8")
    return path


def test_beam_fails_decompression_with_the_lower_prestress(tmp_path: Path) -> None:
    """−0.30 MPa at midspan with P_m,t; σ − 0.05 σ_P ≈ +0.85 MPa with 0.95 P_m,t.

    EN 1992-1-1:2004 Table 7.1N decompression (the set's no tension at the girder bottom)
    with P_k,inf = 0.95 P_m,t of 5.10.9(1)P (from memory); at release P_k,sup = 1.05 P_m,0
    raises the top tension past fctm (7.1(2), Table 3.1).
    """
    mean_set = en_set_without_factors(tmp_path)
    mean = tmp_path / "mean.toml"
    mean.write_text(
        BEAM_JOB.replace("{limits}", f'file = "{mean_set.as_posix()}"'), encoding="utf-8"
    )
    factored = tmp_path / "factored.toml"
    factored.write_text(BEAM_JOB.replace("{limits}", 'set = "en1992-1-1-2004"'), encoding="utf-8")
    r_mean, r_f = run_check(load_job(mean)), run_check(load_job(factored))
    st_mean, st_f = (
        station(r_mean, "service_iii", "midspan"),
        station(r_f, "service_iii", "midspan"),
    )
    f_mean = st_mean.fibers["girder_bottom"].stress
    assert f_mean == pytest.approx(-0.30, abs=0.01) and st_mean.ok
    # by hand: only the prestress part changes, by −0.05 of the mean prestress's stress
    sec = r_f.girder.section_service
    assert sec is not None
    P, e = st_f.force, st_f.eccentricity
    assert P == st_mean.force  # the P column: the mean value in both
    c = sec.c("girder_bottom")
    sigma_P = sec.n_fiber["girder_bottom"] * (-P / sec.area + P * e * c / sec.I)
    f_inf = st_f.fibers["girder_bottom"].stress
    assert f_inf == pytest.approx(f_mean - 0.05 * sigma_P, rel=1e-9)
    assert f_inf == pytest.approx(0.85, abs=0.02)
    assert not st_f.ok
    assert next(s for s in r_mean.stages if s.key == "service_iii").ok
    assert not next(s for s in r_f.stages if s.key == "service_iii").ok
    # release: the upper value raises the top tension at the end of the transfer length
    assert next(s for s in r_mean.stages if s.key == "transfer").ok
    top = station(r_f, "transfer", "left lt").fibers["girder_top"]
    assert top.stress > station(r_mean, "transfer", "left lt").fibers["girder_top"].stress
    assert not top.ok


def test_zone_with_factors_lies_inside_the_zone_without(tmp_path: Path) -> None:
    """Both cases must hold, so the band with factors is the intersection: never wider."""
    mean_set = en_set_without_factors(tmp_path)
    mean = tmp_path / "mean.toml"
    mean.write_text(
        BEAM_JOB.replace("{limits}", f'file = "{mean_set.as_posix()}"'), encoding="utf-8"
    )
    factored = tmp_path / "factored.toml"
    factored.write_text(BEAM_JOB.replace("{limits}", 'set = "en1992-1-1-2004"'), encoding="utf-8")
    zones = []
    for path in (mean, factored):
        girder = resolve_girder(load_job(path))
        zones.append(zone_at(girder, compute_losses(girder), stations(girder)))
    tighter = 0
    for z0, z1 in zip(*zones, strict=True):
        assert z0.station == z1.station
        lo0 = -np.inf if z0.low is None else z0.low
        lo1 = -np.inf if z1.low is None else z1.low
        hi0 = np.inf if z0.high is None else z0.high
        hi1 = np.inf if z1.high is None else z1.high
        assert lo1 >= lo0 - 1e-9 and hi1 <= hi0 + 1e-9
        tighter += lo1 > lo0 + 1e-6 or hi1 < hi0 - 1e-6
    assert tighter > 0
    assert any("(P × 0.95)" in z.governing_low or "(P × 1.05)" in z.governing_low for z in zones[1])


# ------------------------------------------------------------------------------------------
# Bad input: one line naming the field


@pytest.mark.parametrize(
    ("table", "field", "words"),
    [
        ("inf = 0.0", "limits.prestress_factors.inf", "greater than 0"),
        ("inf = -0.5", "limits.prestress_factors.inf", "greater than 0"),
        ("inf = 1.05", "limits.prestress_factors.inf", "at most 1"),
        ("sup = 0.95", "limits.prestress_factors.sup", "from 1 to 1.5"),
        ("sup = 1.6", "limits.prestress_factors.sup", "from 1 to 1.5"),
        ('inf = "0.95"', "limits.prestress_factors.inf", "a number"),
        ("infimum = 0.95", "limits.prestress_factors.infimum", "did you mean 'inf'"),
        (
            "[limits.prestress_factors.post_tensioned]\ninf = 0.0",
            "limits.prestress_factors.post_tensioned.inf",
            "greater than 0",
        ),
        (
            "[limits.prestress_factors.transfer]\nsup = 2.0",
            "limits.prestress_factors.transfer.sup",
            "from 1 to 1.5",
        ),
        (
            "[limits.prestress_factors.transfr]\nsup = 1.1",
            "limits.prestress_factors.transfr",
            "did you mean 'transfer'",
        ),
    ],
)
def test_bad_factors_name_the_field(tmp_path: Path, table: str, field: str, words: str) -> None:
    """0 < inf ≤ 1 ≤ sup ≤ 1.5 (the rule of docs/job-file.md; r of EN 1992-1-1 5.10.9)."""
    body = table if table.startswith("[") else f"[limits.prestress_factors]\n{table}"
    with pytest.raises(InputError) as exc:
        load_job(write_rect(tmp_path, factors=body))
    assert exc.value.field == field
    message = str(exc.value)
    assert "\n" not in message and words in message and field in message


def test_factors_not_a_table(tmp_path: Path) -> None:
    path = write_rect(tmp_path, factors="")
    text = path.read_text("utf-8").replace(
        'name = "limits of the test (invented)"',
        'name = "limits of the test (invented)"\nprestress_factors = 0.95',
    )
    path.write_text(text, encoding="utf-8")
    with pytest.raises(InputError, match="prestress_factors") as exc:
        load_job(path)
    assert "a table" in str(exc.value)


# ------------------------------------------------------------------------------------------
# prestress design applies the same two cases

DESIGN = """\
[design]
mode = "straight"
heights = ["80 mm", "140 mm"]
positions = ["-160 mm", "-120 mm", "-80 mm", "-40 mm", "0 mm", "40 mm", "80 mm", "120 mm", "160 mm"]
"""


def full_stresses(job) -> dict[tuple[str, float, str], float]:  # type: ignore[no-untyped-def]
    r = run_check(job)
    return {
        (s.key, st.x, f): fr.stress
        for s in r.stages
        for st in s.stations
        for f, fr in st.fibers.items()
    }


def test_design_with_factors_agrees_with_run_check(tmp_path: Path) -> None:
    """The vectorised search ranks with both cases, as the full check does, candidate by
    candidate; its answer needs at least as many strands as with the mean prestress alone.
    """
    job, design = load_job_and_design(write_rect(tmp_path, design=DESIGN))
    res, ev = search(job, design)
    assert ev.factored
    evaluation = ev.evaluate()
    for i in range(ev.enum.size):
        cj = ev.candidate_job(i)
        vec, full = ev.stresses(i), full_stresses(cj)
        assert set(vec) == set(full)
        scale = max(abs(v) for v in full.values())
        for k, v in full.items():
            assert vec[k] == pytest.approx(v, rel=1e-9, abs=1e-9 * scale), k
        ok, util, _gov, _fails = governing_of(run_check(cj))
        assert ok == bool(evaluation.ok[i])
        assert evaluation.utilisation[i] == pytest.approx(util, rel=1e-9)
    best = res.leanest
    assert best is not None and best.ok
    assert best.utilisation == pytest.approx(best.vector_utilisation, rel=1e-9)
    assert not any("differs from the full check" in n for n in res.notes)
    job0, design0 = load_job_and_design(
        write_rect(tmp_path, factors="", design=DESIGN, name="m.toml")
    )
    res0, ev0 = search(job0, design0)
    assert res0.leanest is not None
    assert best.candidate.strands >= res0.leanest.candidate.strands
    # the factors matter here: a pattern that passes with P_m,t fails with 1.05 P_m,0 at release
    ok0, ok1 = ev0.evaluate().ok, evaluation.ok
    assert (ok0 & ~ok1).any() and not (ok1 & ~ok0).any()


def test_stress_plot_says_its_curves_are_the_mean(tmp_path: Path) -> None:
    """The plotted curves are the mean prestress; with factors the plot says the check
    takes the factored cases (the stage tables), without them it says nothing of it."""
    from prestress.analysis import check_file
    from prestress.present import plots

    factored = check_file(write_rect(tmp_path, name="factored.toml"))
    svg = plots.plot_stresses(factored, tmp_path / "f.svg", "SI").read_text(encoding="utf-8")
    assert "Curves with the mean prestress" in svg
    mean = check_file(write_rect(tmp_path, factors="", name="mean.toml"))
    svg = plots.plot_stresses(mean, tmp_path / "m.svg", "SI").read_text(encoding="utf-8")
    assert "Curves with the mean prestress" not in svg


def test_magnel_diagram_takes_the_factors(tmp_path: Path) -> None:
    """Each Magnel line is drawn for each factor, so the design point is inside the region
    exactly where the check passes at that station (a review found the mean alone)."""
    from prestress.analysis import check_file
    from prestress.present import plots

    r = check_file(write_rect(tmp_path))
    setup = plots.magnel_lines(r)
    stages = {s.key: s for s in r.stages}
    assert any("(P × 0.95)" in ln.label for ln in setup.lines)
    assert any("(P × 1.05)" in ln.label for ln in setup.lines)
    by_fiber: dict[tuple[str, str], bool] = {}
    for ln in setup.lines:
        feasible = setup.P_i * (ln.a + ln.b * setup.e) + ln.c <= 1e-12
        key = (ln.stage, ln.fiber)
        by_fiber[key] = by_fiber.get(key, True) and feasible
    for (stage, fiber), feasible in by_fiber.items():
        st = next(s for s in stages[stage].stations if abs(s.x - setup.x) < 1e-6)
        assert feasible == st.fibers[fiber].ok, (stage, fiber)
    assert not all(by_fiber.values())  # this girder fails with the lower factor


def test_json_says_which_factor_governs_each_fiber(tmp_path: Path) -> None:
    """The JSON stress is that of the governing case: its factor is given beside it (a review
    found no way to tell from the force), null for the mean prestress alone."""
    from prestress.analysis import check_file
    from prestress.present.jsonout import to_dict

    data = to_dict(check_file(write_rect(tmp_path)), "SI")
    factors = {
        f["prestress_factor"]
        for stage in data["stages"]
        for st in stage["stations"]
        for f in st["fibers"].values()
    }
    assert factors <= {0.95, 1.05, None} and {0.95, 1.05} <= factors
    mean = to_dict(check_file(write_rect(tmp_path, factors="", name="mean.toml")), "SI")
    assert all(
        f["prestress_factor"] is None
        for stage in mean["stages"]
        for st in stage["stations"]
        for f in st["fibers"].values()
    )
