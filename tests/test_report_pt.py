"""The calculation report and the plots of a post-tensioned girder, and the report's provenance.

The job is the shipped demo ``examples/corrie-beck-g1-post-tensioned.toml`` (an invented
project): three parabolic tendons of 15 strands, 0.6 in, jacked from the left end at 195 ksi,
μ = 0.25, K = 0.0002 /ft, anchor set 0.375 in, 130 ft girder; the [strand] table's
jacking_stress (202.5 ksi) does not apply to the tendons. The friction losses are checked
against a hand calculation by AASHTO LRFD 9th Ed. (2020) Eq. 5.9.3.2.2b-1 written out below,
the anchor set against the closed form of a linear friction curve, the elastic shortening
against Eq. 5.9.3.2.3b-1 with the report's own fcgp.
"""

from __future__ import annotations

import dataclasses
import datetime as dt
import hashlib
import math
import re
import xml.etree.ElementTree as ET
from pathlib import Path

import numpy as np
import pytest

from prestress.analysis import CheckResult, check_file
from prestress.model import SectionRef
from prestress.present import plots
from prestress.present.report import (
    build,
    limits_file,
    render_html,
    render_markdown,
    section_file,
    write_report,
)
from prestress.sections.properties import ResolvedSection
from prestress.stages import prestress_at
from prestress.units import INCH_MM

ROOT = Path(__file__).resolve().parents[1]
PT_EXAMPLE = ROOT / "examples" / "corrie-beck-g1-post-tensioned.toml"
HARPED_EXAMPLE = ROOT / "examples" / "harl-brook-span1-g2-harped.toml"
PT_LIMITS = ROOT / "examples" / "limits" / "aashto-lrfd-9th-post-tensioned.toml"
SERVICE_LIMITS = ROOT / "examples" / "limits" / "aashto-lrfd-9th-service.toml"
I_BEAMS = ROOT / "sections" / "aashto-i-beams.toml"
SVG_NS = "{http://www.w3.org/2000/svg}"
FIXED_DATE = dt.datetime(2031, 5, 6, 7, 8, 9, tzinfo=dt.UTC)

#: The tendons of the demo job: (name, height at the anchorages in, height at midlength in).
TENDONS = (("T1", 52.0, 12.5), ("T2", 36.0, 8.5), ("T3", 20.0, 4.5))


@pytest.fixture(scope="module")
def pt() -> CheckResult:
    return check_file(PT_EXAMPLE)


@pytest.fixture(scope="module")
def built(pt: CheckResult) -> tuple[str, list]:
    title, sections, _ = build(pt, job_text=PT_EXAMPLE.read_bytes(), generated=FIXED_DATE)
    return title, sections


@pytest.fixture(scope="module")
def md(built: tuple[str, list]) -> str:
    return render_markdown(*built)


@pytest.fixture(scope="module")
def body(md: str) -> str:
    """The report before its appendices (the files as read follow them)."""
    return md.split("## Appendix", 1)[0]


def _section(md: str, heading: str) -> str:
    start = md.index(heading)
    end = md.find("\n## ", start + len(heading))
    return md[start : end if end > 0 else None]


# ------------------------------------------------------------------------------------------
# Inputs


def test_strand_inputs_hide_the_pretensioning_rows(body: str) -> None:
    strand = _section(body, "### Strand")
    strand = strand[: strand.index("### Tendons")]
    for gone in ("Jacking stress fpj", "Stress before transfer fpbt", "Number of strands"):
        assert gone not in strand, gone
    assert "202.5" not in body  # the [strand] jacking stress appears nowhere but the job file
    assert "Transfer length" not in body  # anchored tendons: no transfer length
    assert "| Strands in the tendons | 45 in 3 tendon(s) |" in strand
    # 45 strands × 0.217 in² (the job file)
    assert "| Total area Aps | 9.765 in² |" in strand


def test_tendon_inputs_table(body: str) -> None:
    """Every tendon input of the job file, in the job's output units (US)."""
    tendons = _section(body, "### Tendons")
    assert (
        "| Tendon | Strands | Aps (in²) | Jacking stress fpj (ksi) | Jacked at | μ (per rad) | "
        "Wobble K (per ft) | Anchor set (in) | Duct diameter, outside (in) | Jack length (in) |"
    ) in tendons
    for name, _, _ in TENDONS:
        # 15 × 0.217 = 3.255 in²; 195 ksi; left; μ 0.25; 0.0002/ft; 0.375 in; 3 in; 2 ft = 24 in
        row = f"| {name} | 15 | 3.255 | 195.0 | left end | 0.25 | 0.0002 | 0.375 | 3.00 | 24.00 |"
        assert row in tendons, name
    for name, end, mid in TENDONS:
        points = f"(0, {end:.2f}); (65.00, {mid:.2f}); (130.0, {end:.2f})"
        assert f"| {name} | {points} |" in tendons


def test_tendon_inputs_in_si(pt: CheckResult) -> None:
    title, sections, _ = build(pt, job_text=b"", system="SI", generated=FIXED_DATE)
    text = render_markdown(title, sections)
    # K = 0.0002 /ft = 0.0002 / 0.3048 /m = 0.0006562 /m; 195 ksi × 6.894757 = 1,344 MPa
    assert "Wobble K (per m)" in text
    assert "| T1 | 15 | 2,100 | 1,344 | left end | 0.25 | 0.0006562 | 9.525 |" in text


def test_stage_keys_are_shown_as_stage_titles(body: str) -> None:
    for key in ("service_permanent", "service_i", "service_iii"):
        assert key not in body.replace("\\_", "_"), key
    assert "| Final service: Service III | dead × 1, live × 0.8 |" in body


# ------------------------------------------------------------------------------------------
# Losses


def _friction_by_hand() -> dict[str, tuple[float, float, float]]:
    """ΔfpF at midlength per tendon: (x along the tendon ft, α rad, ΔfpF ksi).

    AASHTO LRFD 9th Ed. (2020) Eq. 5.9.3.2.2b-1: ΔfpF = fpj (1 − e^−(Kx + μα)), fpj = 195 ksi,
    K = 0.0002 /ft, μ = 0.25 (the job file). From the left anchorage to the low point at
    midlength the tendon is one parabola y = ym + a u² with its vertex at midlength,
    a = (ye − ym)/u0², u0 = 65 ft = 780 in. Its arc length from the vertex to u0 is
    (t √(1 + t²) + asinh t)/(4a) with t = 2 a u0 (calculus, common practice), and α is the
    angle of the tangent at the anchorage, atan t (the tangent is horizontal at midlength).
    """
    out = {}
    u0 = 65.0 * 12.0
    for name, ye, ym in TENDONS:
        a = (ye - ym) / u0**2
        t = 2.0 * a * u0
        x_ft = (t * math.sqrt(1.0 + t * t) + math.asinh(t)) / (4.0 * a) / 12.0
        alpha = math.atan(t)
        loss = 195.0 * (1.0 - math.exp(-(0.0002 * x_ft + 0.25 * alpha)))
        out[name] = (x_ft, alpha, loss)
    return out


def test_friction_formula_with_the_values_of_each_tendon(body: str, pt: CheckResult) -> None:
    losses = _section(body, "## Prestress losses")
    friction = losses[losses.index("Friction (curvature") : losses.index("### 2.")]
    assert "no closed-form expression" not in friction
    assert "`ΔfpF = fpj (1 − e^−(Kx + μα))   (Eq. 5.9.3.2.2b-1)`" in friction
    hand = _friction_by_hand()
    # by hand: T1 x = 65.11 ft, α = 0.1009 rad, 7.32 ksi; T2 65.05 ft, 0.0704, 5.88 ksi;
    # T3 65.02 ft, 0.0397, 4.42 ksi
    for name, (x_ft, alpha, loss) in hand.items():
        line = next(ln for ln in friction.splitlines() if ln.startswith(f"{name} (jacked"))
        assert f"x = {x_ft:.2f} ft" in line
        assert f"α = {alpha:.4f} rad" in line
        assert f"Kx + μα = {0.0002 * x_ft + 0.25 * alpha:.5f}" in line
        assert f"ΔfpF = {loss:.2f} ksi" in line
    # the tendons have equal areas: the girder's loss is the plain mean, 5.87 ksi
    mean = sum(v[2] for v in hand.values()) / 3.0
    assert f"= {mean:.2f} ksi" in friction
    comp = next(c for c in pt.losses.components if c.key == "friction")
    assert comp.value / 6.894757293168361 == pytest.approx(mean, abs=0.01)


def test_anchor_set_by_the_area_method(body: str) -> None:
    """Affected length and loss at the anchorage against a linear friction curve.

    For a friction loss p per length that is uniform, the area method gives
    x_set = √(Ep Δset / p) and a loss 2 p x_set at the anchorage (textbook closed form, from
    memory). The tendons' friction is nearly linear (the angle of a parabola grows nearly
    linearly along it), so with p = ΔfpF(midlength) / 65 ft from the hand calculation above
    the area method must agree within 1.5 %.
    """
    losses = _section(body, "## Prestress losses")
    block = losses[losses.index("### 2. Anchor set") : losses.index("### 3.")]
    assert "no closed-form expression:" not in block
    assert "area method" in block and "Ep = 28,500 ksi" in block
    hand = _friction_by_hand()
    pattern = re.compile(
        r"(T\d): Δset = 0\.375 in; from the left anchorage: affected length ([\d.,]+) ft, "
        r"loss at the anchorage ([\d.]+) ksi; loss at midlength ([\d.]+) ksi"
    )
    found = {m.group(1): m.groups()[1:] for m in pattern.finditer(block)}
    assert sorted(found) == ["T1", "T2", "T3"]
    for name, (length, at_anchor, _) in found.items():
        p = hand[name][2] / (65.0 * 12.0)  # ksi per in
        x_set = math.sqrt(28_500.0 * 0.375 / p)  # in
        assert float(length.replace(",", "")) == pytest.approx(x_set / 12.0, rel=0.015)
        assert float(at_anchor) == pytest.approx(2.0 * p * x_set, rel=0.015)


def test_elastic_shortening_and_given_losses(body: str) -> None:
    losses = _section(body, "## Prestress losses")
    es = losses[losses.index("### 3. Elastic shortening") : losses.index("### 4.")]
    assert "`ΔfpES = (N − 1)/(2N) (Ep/Eci) fcgp   (Eq. 5.9.3.2.3b-1)`" in es
    m = re.search(r"with N = 3; Ep = 28,500 ksi; Eci = ([\d,]+) ksi; fcgp = ([\d.]+) ksi", es)
    assert m is not None
    eci, fcgp = float(m.group(1).replace(",", "")), float(m.group(2))
    # Eq. 5.9.3.2.3b-1 by hand on the printed values: (3 − 1)/6 × 28,500/Eci × fcgp
    expected = 2.0 / 6.0 * 28_500.0 / eci * fcgp
    result = float(re.search(r"Result: ([\d.]+) ksi", es).group(1))  # type: ignore[union-attr]
    assert result == pytest.approx(expected, abs=0.011)
    given = losses[losses.index("### 4.") : losses.index("### Summary")]
    assert "no closed-form expression" not in given
    # the job file: long_term_to_deck = 8 ksi, long_term = 22 ksi
    assert "given by the engineer" in given
    assert "long\\_term\\_to\\_deck = 8.00 ksi" in given
    assert "long\\_term − long\\_term\\_to\\_deck = 22.00 ksi − 8.00 ksi" in given


def test_tendon_stress_limits_table(body: str) -> None:
    losses = _section(body, "## Prestress losses")
    assert "### Tendon stress limits" in losses
    # AASHTO LRFD 9th Ed. (2020) Table 5.9.2.2-1 (from memory): 0.90 fpy prior to seating,
    # 0.70 fpu at the anchorages after set; fpy = 243 ksi, fpu = 270 ksi
    assert (
        "| T1 | jacking, prior to seating | at the left jack | 0 | 195.0 | 0.90 fpy = 218.7 |"
        in (losses)
    )
    assert "0.70 fpu = 189.0" in losses


# ------------------------------------------------------------------------------------------
# Plots


@pytest.mark.parametrize("kind", sorted(plots.PLOT_KINDS))
def test_every_plot_kind_draws_a_post_tensioned_girder(
    pt: CheckResult, kind: str, tmp_path: Path
) -> None:
    out = plots.PLOT_KINDS[kind](pt, tmp_path / f"{kind}.svg", "US")
    root = ET.parse(out).getroot()
    assert root.tag == f"{SVG_NS}svg"
    assert len(list(root.iter(f"{SVG_NS}path"))) > 5
    text = out.read_text(encoding="utf-8")
    if kind == "section":  # 45 strands in 3 ducts drawn to scale
        assert "tendon ducts at midlength" in text and "45 strands" in text
    if kind == "zone":
        assert "tendon profiles" in text
    if kind == "losses":  # jacked at 195 ksi at 28 days (no casting bed, no 202.5 ksi)
        assert "jacking 195 ksi, 28 d" in text and "202.5" not in text
    if kind == "magnel":
        assert "stressing, top tension" in text and "net of the open ducts" in text


def test_magnel_lines_of_a_post_tensioned_girder_reproduce_the_check(pt: CheckResult) -> None:
    """Pi (a + b e) + c = ±(f − limit) at the design point, stressing on the net section.

    An identity of the formulation (common practice: stresses P/A ± P e/S ± M/S): the lines
    use the check's own forces and sections, so the stage stresses come back exactly.
    """
    setup = plots.magnel_lines(pt)
    stages = {s.key: s for s in pt.stages}
    transfer = next(s for s in stages["transfer"].stations if abs(s.x - setup.x) < 1e-6)
    assert setup.P_i == pytest.approx(transfer.force, rel=1e-12)
    P_e = float(prestress_at(pt.girder, pt.losses, "final", np.array([setup.x]))[0][0])
    assert setup.P_e == pytest.approx(P_e, rel=1e-12)
    assert setup.e == pytest.approx(pt.girder.gross.yb - transfer.cgs, rel=1e-12)
    assert {ln.stage for ln in setup.lines} >= {"transfer", "service_iii"}
    for ln in setup.lines:
        st = next(s for s in stages[ln.stage].stations if abs(s.x - setup.x) < 1e-6)
        f = st.fibers[ln.fiber].stress
        g = setup.P_i * (ln.a + ln.b * setup.e) + ln.c
        expected = f - ln.limit if ln.sense == "tension" else ln.limit - f
        assert g == pytest.approx(expected, abs=1e-9 * abs(ln.limit) + 1e-9)
        assert (g <= 0) == st.fibers[ln.fiber].ok


def test_section_plot_draws_the_ducts(pt: CheckResult, tmp_path) -> None:
    ducts = plots.tendon_ducts_at_midlength(pt)
    assert sum(n for *_xyd, n in ducts) == 45 and len(ducts) == 3
    # heights at midlength: the low points of the job file, 12.5, 8.5 and 4.5 in, on the axis
    assert sorted(round(y / INCH_MM, 6) for _, y, _d, _n in ducts) == [4.5, 8.5, 12.5]
    assert all(x == 0.0 for x, *_ in ducts)
    assert [d for *_xy, d, _n in ducts] == [t.duct_diameter for t in pt.girder.job.tendons]
    out = plots.plot_section(pt, tmp_path / "pt-section.svg", "US")
    svg = out.read_text(encoding="utf-8")
    assert "3 ducts to scale, 45 strands in all" in svg


# ------------------------------------------------------------------------------------------
# The report as a whole and its provenance


def test_report_draws_every_figure(built: tuple[str, list]) -> None:
    html = render_html(*built)
    assert "Not drawn" not in html
    root = ET.fromstring(html.split("\n", 1)[1])
    assert len(list(root.iter(f"{SVG_NS}svg"))) == 5


def test_provenance_hashes_the_limit_set_and_the_section_file(md: str, body: str) -> None:
    prov = _section(body, "## Provenance")
    lim_sha = hashlib.sha256(PT_LIMITS.read_bytes()).hexdigest()
    sec_sha = hashlib.sha256(I_BEAMS.read_bytes()).hexdigest()
    assert f"| SHA-256 of the limit-set file | {lim_sha} |" in prov
    assert "shipped limit set 'aashto-lrfd-9th-post-tensioned'" in prov
    assert f"| SHA-256 of the section library file | {sec_sha} |" in prov
    assert "AASHTO-Type-VI" in prov and "shipped library, entry section" in prov
    # the files themselves follow the job file
    assert "## Appendix: the limit-set file" in md and "## Appendix: the section library file" in md
    limits_text = PT_LIMITS.read_text(encoding="utf-8").splitlines()[0]
    assert limits_text in _section(md, "## Appendix: the limit-set file")
    assert 'name = "AASHTO-Type-VI"' in _section(md, "## Appendix: the section library file")


def test_limit_set_file_named_in_the_job(tmp_path: Path) -> None:
    result = check_file(HARPED_EXAMPLE)  # [limits] file = "limits/aashto-lrfd-9th-service.toml"
    f = limits_file(result)
    assert f.path is not None and f.path.resolve() == SERVICE_LIMITS.resolve()
    assert f.sha256 == hashlib.sha256(SERVICE_LIMITS.read_bytes()).hexdigest()
    # limits inline in the job file: no separate file
    inline = tmp_path / "job.toml"
    inline.write_text('[limits]\nname = "inline"\n', encoding="utf-8")
    job = dataclasses.replace(result.girder.job, file=str(inline))
    other = dataclasses.replace(result, girder=dataclasses.replace(result.girder, job=job))
    f = limits_file(other)
    assert f.path is None and "inline" in f.description


def test_section_defined_in_the_job_or_not_found_again(pt: CheckResult) -> None:
    g = pt.girder
    job = dataclasses.replace(
        g.job, section=SectionRef("box", family="rectangle", dimensions={"width": "1 ft"})
    )
    inline = dataclasses.replace(pt, girder=dataclasses.replace(g, job=job))
    assert "defined in the job file" in section_file(inline).description
    # a library shape whose outline is not the girder's (e.g. from a --library folder)
    square = ((0.0, 0.0), (100.0, 0.0), (100.0, 100.0), (0.0, 100.0), (0.0, 0.0))
    moved = dataclasses.replace(g, outline=ResolvedSection(square, (), g.gross))
    f = section_file(dataclasses.replace(pt, girder=moved))
    assert f.path is None and "--library" in f.description


def test_markdown_report_writes_its_figures(pt: CheckResult, tmp_path: Path) -> None:
    out = write_report(pt, tmp_path / "pt.md", job_text=PT_EXAMPLE.read_bytes())
    text = out.read_text(encoding="utf-8")
    names = sorted(p.name for p in tmp_path.glob("pt-figure-*.svg"))
    assert names == [f"pt-figure-{i}.svg" for i in range(1, 6)]
    assert all(f"]({n})" in text for n in names)
    assert "data:image" not in text


def test_friction_of_a_tendon_jacked_at_both_ends_says_so(tmp_path: Path) -> None:
    """A tendon jacked at both ends is not described as jacked from one (a review finding)."""
    from tests.conftest import write_job

    text = PT_EXAMPLE.read_text(encoding="utf-8").replace('jacking = "left"', 'jacking = "both"', 1)
    result = check_file(write_job(tmp_path, text))
    title, sections, _ = build(result, job_text=text.encode(), generated=FIXED_DATE)
    friction = render_markdown(title, sections)
    t1 = next(ln for ln in friction.splitlines() if ln.startswith("T1 ("))
    assert t1.startswith("T1 (jacked at both ends; midlength taken from the ")
    assert any(ln.startswith("T2 (jacked from the left end)") for ln in friction.splitlines())
