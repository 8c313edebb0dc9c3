"""Tests of the calculation report, the plots and the CSV export (prestress.present).

The examples are the shipped demo jobs (invented projects). The Magnel corners are compared
with a hand calculation written out below for the US example's midspan.
"""

from __future__ import annotations

import csv
import dataclasses
import datetime as dt
import hashlib
import math
import shutil
import subprocess
import xml.etree.ElementTree as ET
from html.parser import HTMLParser
from pathlib import Path
from typing import ClassVar

import pytest

from prestress import __version__
from prestress.analysis import CheckResult, check_file
from prestress.errors import InputError
from prestress.present import plots
from prestress.present.common import CAUTION
from prestress.present.csv_out import write_csv
from prestress.present.report import build, render_html, render_markdown, write_report
from prestress.units import INCH_MM, KIP_N, KSI_MPA

ROOT = Path(__file__).resolve().parents[1]
US_EXAMPLE = ROOT / "examples" / "brannoch-creek-span2-g3.toml"
HARPED_EXAMPLE = ROOT / "examples" / "harl-brook-span1-g2-harped.toml"
OVERSTRESSED_EXAMPLE = ROOT / "examples" / "harl-brook-span1-g2-overstressed.toml"
PNG_MAGIC = b"\x89PNG\r\n\x1a\n"
SVG_NS = "{http://www.w3.org/2000/svg}"
CHROMIUM = Path("/usr/bin/chromium")
FIXED_DATE = dt.datetime(2031, 5, 6, 7, 8, 9, tzinfo=dt.UTC)


@pytest.fixture(scope="module")
def us() -> CheckResult:
    return check_file(US_EXAMPLE)


@pytest.fixture(scope="module")
def harped() -> CheckResult:
    return check_file(HARPED_EXAMPLE)


@pytest.fixture(scope="module")
def results(us: CheckResult, harped: CheckResult) -> dict[str, CheckResult]:
    return {"us": us, "harped": harped}


# ------------------------------------------------------------------------------------------
# Plots


@pytest.mark.parametrize("example", ["us", "harped"])
@pytest.mark.parametrize("kind", sorted(plots.PLOT_KINDS))
def test_every_plot_kind_writes_a_real_svg(
    results: dict[str, CheckResult], example: str, kind: str, tmp_path: Path
) -> None:
    result = results[example]
    out = tmp_path / f"{kind}.svg"
    written = plots.PLOT_KINDS[kind](result, out, result.girder.job.units)
    assert Path(written) == out
    assert out.stat().st_size > 5_000
    root = ET.parse(out).getroot()
    assert root.tag == f"{SVG_NS}svg"
    assert len(list(root.iter(f"{SVG_NS}path"))) > 5  # drawn content, not an empty canvas
    assert not list(tmp_path.glob(".*"))  # no temporary file left behind


def test_png_has_the_png_signature(harped: CheckResult, tmp_path: Path) -> None:
    out = plots.plot_zone(harped, tmp_path / "zone.png", "US")
    data = out.read_bytes()
    assert data.startswith(PNG_MAGIC)
    assert len(data) > 5_000


def test_plot_refuses_an_unknown_suffix(us: CheckResult, tmp_path: Path) -> None:
    with pytest.raises(InputError, match=r"\.svg or \.png"):
        plots.plot_losses(us, tmp_path / "losses.pdf", "US")
    assert not list(tmp_path.iterdir())


def test_plot_axes_carry_the_units_of_the_system(us: CheckResult, tmp_path: Path) -> None:
    us_svg = plots.plot_stresses(us, tmp_path / "us.svg", "US").read_text(encoding="utf-8")
    si_svg = plots.plot_stresses(us, tmp_path / "si.svg", "SI").read_text(encoding="utf-8")
    assert "stress (ksi)" in us_svg and "(ft)" in us_svg
    assert "stress (MPa)" in si_svg and "(m)" in si_svg
    assert "tension +, compression −" in us_svg  # the sign convention is printed


def test_losses_plot_takes_a_time_step_curve(us: CheckResult, tmp_path: Path) -> None:
    b = us.losses
    curve = [(1.0, b.f_pt), (10.0, b.f_pt - 5.0), (1000.0, b.f_pe + 3.0), (20000.0, b.f_pe)]
    out = plots.plot_losses(us, tmp_path / "l.svg", "US", timestep=curve, timestep_label="TS curve")
    assert "TS curve" in out.read_text(encoding="utf-8")


def test_magnel_unknown_station_is_an_input_error(us: CheckResult) -> None:
    with pytest.raises(InputError, match="station"):
        plots.magnel_lines(us, "no such station")


# ------------------------------------------------------------------------------------------
# Magnel diagram


def test_magnel_corners_match_a_hand_calculation_at_midspan(us: CheckResult) -> None:
    """Magnel's construction at midspan of the US example, by hand in kip and inches.

    Magnel's construction is common practice; the stress limits are those of the shipped
    limit set mirroring AASHTO LRFD 9th Ed. (2020) 5.9.2.3 (values from memory there).
    Sign convention: tension +, compression −; e positive below the centroid; u = 1/Pi.

    Stresses of a force P at e and a moment M on the gross girder section:
        f_top = −P/A + P e/Zt − M/Zt,   f_bot = −P/A − P e/Zb + M/Zb.
    Inequalities (P = Pi at release, P = R Pi in service), each divided by Pi:
        (1) release top tension      e/Zt − 1/A ≤ (fti + Mi/Zt) u
        (2) release bottom compr.    1/A + e/Zb ≤ (Mi/Zb − fci) u
        (3) permanent top compr.     R (e/Zt − 1/A) ≥ (fcp + Mp/Zt) u
        (4) Service I top compr.     R (e/Zt − 1/A) ≥ (fc1 + M1/Zt) u
        (5) Service III bottom tens. R (1/A + e/Zb) ≥ (M3/Zb − fts) u
    with service moments M = Mnc + Mc Z/Sc (composite moments brought to the girder section).
    """
    g = us.girder.gross
    # Gross properties of the shipped BT-54 polygon (the tool's sectionproperties analysis,
    # itself checked against the published shape in tests/validation/test_standard_shapes.py):
    A = g.area / INCH_MM**2  # 659.0 in²
    I = g.Ix / INCH_MM**4  # 268,051 in⁴
    yb = g.yb / INCH_MM  # 27.63 in
    yt = 54.0 - yb  # 26.37 in: the BT-54 is 54 in deep
    Zt, Zb = I / yt, I / yb
    # Composite section: deck 96 in × 7.5 in on a 1.5 in haunch (haunch not in the stiffness),
    # n = Ec,deck/Ec,girder = (4/7)^0.33 (AASHTO LRFD 9th Ed. (2020) Eq. 5.4.2.4-1, same
    # unit weight for both concretes), parallel-axis theorem.
    n = (4.0 / 7.0) ** 0.33  # 0.8314
    Ad, yd = 96.0 * 7.5 * n, 54.0 + 1.5 + 7.5 / 2.0
    Ac = A + Ad
    ybc = (A * yb + Ad * yd) / Ac
    Ic = I + A * (yb - ybc) ** 2 + n * 96.0 * 7.5**3 / 12.0 + Ad * (yd - ybc) ** 2
    Sct, Scb = Ic / (54.0 - ybc), Ic / ybc  # 51,637 in³ and 13,691 in³
    # Moments at midspan (kip·in): girder 0.150 kcf × A; deck (7.5 + 0.5 in) × 96 in and
    # haunch 1.5 × 42 in at 0.150 kcf; 82 ft girder, 80 ft span centred (1 ft overhangs).
    wg = A / 144.0 * 0.150  # 0.6865 kip/ft
    Mi = wg * 82.0**2 / 8.0 * 12.0  # release: ends supported, 577.0 kip·ft
    Mg = wg * (82.0**2 / 8.0 - 82.0 * 1.0 / 2.0) * 12.0  # on the bearings: 548.8 kip·ft
    wd = 0.150 * ((7.5 + 0.5) / 12.0 * 96.0 / 12.0 + 1.5 / 12.0 * 42.0 / 12.0)  # 0.8656 kip/ft
    Md = wd * 80.0**2 / 8.0 * 12.0  # 692.5 kip·ft
    Msdl = (0.25 + 0.20) * 80.0**2 / 8.0 * 12.0  # DC + DW = 360 kip·ft
    Mll = 1150.0 * 12.0  # given midspan live-load moment
    # Forces: Aps = 16 × 0.217 in²; fpt and fpe from the tool's AASHTO approximate losses
    # (checked in their own tests): 190.2 ksi and 170.4 ksi.
    Aps = 16 * 0.217
    Pi = Aps * us.losses.f_pt / KSI_MPA  # 660.4 kip
    R = us.losses.f_pe / us.losses.f_pt  # 0.8957
    # Limits (ksi): 0.24√f'ci, −0.65 f'ci; −0.45 f'c; −0.60 f'c; 0.19√f'c ≤ 0.6.
    fti, fci = 0.24 * math.sqrt(5.5), -0.65 * 5.5  # +0.5628, −3.575
    fcp, fc1 = -0.45 * 7.0, -0.60 * 7.0  # −3.15, −4.20
    fts = min(0.19 * math.sqrt(7.0), 0.6)  # +0.5027

    # Each line as a + b e + c u ≤ 0 (e in in, u in 1/kip):
    def top_compression(fc: float, Mnc: float, Mc: float) -> tuple[float, float, float]:
        Ms = Mnc + Mc * Zt / Sct
        return (R / A, -R / Zt, fc + Ms / Zt)

    lines = {
        "1": (-1.0 / A, 1.0 / Zt, -(fti + Mi / Zt)),
        "2": (1.0 / A, 1.0 / Zb, fci - Mi / Zb),
        "3": top_compression(fcp, Mg + Md, Msdl),
        "4": top_compression(fc1, Mg + Md, Msdl + Mll),
        "5": (-R / A, -R / Zb, (Mg + Md + (Msdl + 0.8 * Mll) * Zb / Scb) / Zb - fts),
    }

    def cross(p: str, q: str) -> tuple[float, float]:
        (a1, b1, c1), (a2, b2, c2) = lines[p], lines[q]
        det = b1 * c2 - b2 * c1
        return ((a2 * c1 - a1 * c2) / det, (a1 * b2 - a2 * b1) / det)

    def on(p: str, e: float) -> tuple[float, float]:
        a, b, c = lines[p]
        return (e, -(a + b * e) / c)

    # The feasible region is the quadrilateral bounded by (2) below, (5) above, (3) on the
    # left and the girder bottom e = yb on the right; (1) and (4) do not touch it:
    hand = [cross("2", "3"), on("2", yb), on("5", yb), cross("5", "3")]
    # ≈ (6.262 in, 5.043e-4 /kip), (27.63, 1.018e-3), (27.63, 1.815e-3), (2.228, 7.263e-4)
    for e, u in hand:
        for a, b, c in lines.values():
            assert a + b * e + c * u <= 1e-12  # every vertex satisfies every inequality
        assert -yt <= e <= yb
    corners = plots.magnel_corners(us)  # (e mm, 1/Pi in 1/N), midspan by default
    got = [(e / INCH_MM, u * KIP_N) for e, u in corners]
    assert len(got) == len(hand)
    for e, u in hand:
        match = min(got, key=lambda p: abs(p[0] - e) / yb + abs(p[1] - u) / u)
        assert match[0] == pytest.approx(e, rel=1e-6, abs=1e-6)  # round-off only
        assert match[1] == pytest.approx(u, rel=1e-6)
    # the design point: e = yb − 2.5 in (16 strands, centroid 2.5 in up), u = 1/Pi
    setup = plots.magnel_lines(us)
    assert setup.e / INCH_MM == pytest.approx(yb - 2.5, rel=1e-9)
    assert setup.u * KIP_N == pytest.approx(1.0 / Pi, rel=1e-9)


def test_magnel_lines_reproduce_the_stage_stresses(us: CheckResult) -> None:
    """On gross sections, Pi (a + b e) + c = ±(f − limit) at the design point (identity)."""
    setup = plots.magnel_lines(us)
    stages = {s.key: s for s in us.stages}
    assert len(setup.lines) == 5
    for ln in setup.lines:
        st = next(s for s in stages[ln.stage].stations if abs(s.x - setup.x) < 1e-6)
        f = st.fibers[ln.fiber].stress
        g = setup.P_i * (ln.a + ln.b * setup.e) + ln.c  # = (f − lim) for tension, (lim − f)
        expected = f - ln.limit if ln.sense == "tension" else ln.limit - f
        assert g == pytest.approx(expected, abs=1e-9 * abs(ln.limit) + 1e-9)
        assert (g <= 0) == st.fibers[ln.fiber].ok  # inside the half-plane ⇔ the check passes


def test_magnel_design_point_outside_when_a_check_fails(tmp_path: Path) -> None:
    result = check_file(OVERSTRESSED_EXAMPLE)
    setup = plots.magnel_lines(result)
    violated = [ln.label for ln in setup.lines if ln.a + ln.b * setup.e + ln.c * setup.u > 0]
    assert violated == ["Service III, bottom tension"]
    plots.plot_magnel(result, tmp_path / "m.svg", "US")  # still drawn


# ------------------------------------------------------------------------------------------
# Report


class _Balance(HTMLParser):
    """Checks that every non-void element is closed in order."""

    VOID: ClassVar[set[str]] = {
        "meta",
        "br",
        "img",
        "hr",
        "link",
        "input",
        "col",
        "area",
        "base",
        "wbr",
        "source",
    }

    def __init__(self) -> None:
        super().__init__(convert_charrefs=True)
        self.stack: list[str] = []
        self.errors: list[str] = []
        self.ids: list[str] = []
        self.tags: set[str] = set()
        self.attrs: list[tuple[str, str]] = []

    def handle_starttag(self, tag: str, attrs: list) -> None:
        self._attrs(tag, attrs)
        if tag not in self.VOID:
            self.stack.append(tag)

    def handle_startendtag(self, tag: str, attrs: list) -> None:
        self._attrs(tag, attrs)

    def _attrs(self, tag: str, attrs: list) -> None:
        self.tags.add(tag)
        for k, v in attrs:
            self.attrs.append((k, v or ""))
            if k == "id":
                self.ids.append(v)

    def handle_endtag(self, tag: str) -> None:
        if not self.stack or self.stack[-1] != tag:
            self.errors.append(f"</{tag}> closes {self.stack[-1] if self.stack else 'nothing'}")
            return
        self.stack.pop()


@pytest.fixture(scope="module")
def report_file(harped: CheckResult, tmp_path_factory: pytest.TempPathFactory) -> Path:
    out = tmp_path_factory.mktemp("report") / "harped.html"
    write_report(harped, out, job_text=HARPED_EXAMPLE.read_bytes(), generated=FIXED_DATE)
    return out


@pytest.fixture(scope="module")
def report_html(report_file: Path) -> str:
    return report_file.read_text(encoding="utf-8")


def test_report_has_every_section(report_html: str, harped: CheckResult) -> None:
    p = _Balance()
    p.feed(report_html)
    p.close()
    for ident in (
        "caution-top",
        "overview",
        "inputs",
        "section-properties",
        "fig-section",
        "losses",
        "stresses",
        "governing",
        "zone",
        "plots",
        "fig-stresses",
        "fig-zone",
        "fig-losses",
        "fig-magnel",
        "provenance",
        "job-file",
        "caution-end",
    ):
        assert ident in p.ids, ident
    for stage in harped.stages:
        assert f"stage-{stage.key}" in p.ids
    for comp in harped.losses.components:  # one block per loss, with its clause
        assert comp.clause in report_html
    assert "Eq. 5.9.3.4.2a-1" in report_html and "Eq. C5.9.3.2.3a-1" in report_html
    assert report_html.count(CAUTION) == 2  # at the top and at the end
    assert report_html.index(CAUTION) < report_html.index('id="inputs"')
    assert report_html.rindex(CAUTION) > report_html.index('id="job-file"')
    assert hashlib.sha256(HARPED_EXAMPLE.read_bytes()).hexdigest() in report_html
    assert f"prestress {__version__}" in report_html
    assert "2031-05-06T07:08:09+00:00" in report_html
    assert "Span 1 interior girder G2 (harped)" in report_html


def test_report_is_well_formed_and_self_contained(report_html: str) -> None:
    p = _Balance()
    p.feed(report_html)
    p.close()
    assert p.errors == [] and p.stack == []
    assert len(p.ids) == len(set(p.ids))  # figure ids are prefixed: no clash between SVGs
    # polyglot XHTML: parses as XML too
    root = ET.fromstring(report_html.split("\n", 1)[1])
    assert root.tag == "{http://www.w3.org/1999/xhtml}html"
    assert len(list(root.iter(f"{SVG_NS}svg"))) == 5
    # no JavaScript, no external resources
    assert "script" not in p.tags and "link" not in p.tags and "iframe" not in p.tags
    for k, v in p.attrs:
        if k in ("src", "href", "xlink:href"):
            assert v.startswith("#"), (k, v)
        assert not k.startswith("on"), k
    assert "@import" not in report_html and "url(http" not in report_html


def test_report_escapes_user_strings(harped: CheckResult) -> None:
    bad = '<script>alert("x")</script> & <b>Co</b>'
    job = dataclasses.replace(harped.girder.job, title=bad, engineer=bad)
    result = dataclasses.replace(harped, girder=dataclasses.replace(harped.girder, job=job))
    title, sections, _ = build(result, job_text=b"title = '<script>'\n", generated=FIXED_DATE)
    text = render_html(title, sections)
    assert "<script" not in text and "<b>Co" not in text
    assert "&lt;script&gt;alert(&quot;x&quot;)&lt;/script&gt; &amp; &lt;b&gt;Co&lt;/b&gt;" in text
    md = render_markdown(title, sections)
    body, appendix = md.split("## Appendix", 1)  # the job file's appendix comes first
    assert "<script" not in body and "&lt;script&gt;" in body
    assert "~~~~toml\ntitle = '<script>'" in appendix  # inside a code fence: shown as text


def test_markdown_report(us: CheckResult, tmp_path: Path) -> None:
    out = write_report(us, tmp_path / "r.md", job_text=US_EXAMPLE.read_bytes(), system="SI")
    text = out.read_text(encoding="utf-8")
    # the figures are SVG files beside the report, linked (not embedded as data URIs)
    figures = sorted(p.name for p in tmp_path.glob("r-figure-*.svg"))
    assert figures == [f"r-figure-{i}.svg" for i in range(1, 6)]
    for name in figures:
        assert f"]({name})" in text
        root = ET.parse(tmp_path / name).getroot()
        assert root.tag == f"{SVG_NS}svg"
    assert "data:image/svg+xml;base64," not in text
    assert not list(tmp_path.glob(".*"))  # no temporary file left behind
    for heading in (
        "## Inputs as the tool understood them",
        "## Section properties",
        "## Prestress losses",
        "## Fiber stresses by stage",
        "## Governing checks",
        "## Permissible zone of the cgs",
        "## Plots",
        "## Provenance",
    ):
        assert heading in text
    assert text.count(CAUTION) == 2
    assert hashlib.sha256(US_EXAMPLE.read_bytes()).hexdigest() in text
    assert "Loss (MPa)" in text and "Loss (ksi)" not in text  # the output system
    # render_markdown alone (no files) embeds the figures
    title, sections, _ = build(us, job_text=US_EXAMPLE.read_bytes(), generated=FIXED_DATE)
    assert render_markdown(title, sections).count("data:image/svg+xml;base64,") == 5


def test_markdown_figures_are_not_overwritten_without_force(
    us: CheckResult, tmp_path: Path
) -> None:
    job_text = US_EXAMPLE.read_bytes()
    mine = tmp_path / "r-figure-3.svg"
    mine.write_text("keep me", encoding="utf-8")
    with pytest.raises(InputError, match=r"r-figure-3\.svg.*force"):
        write_report(us, tmp_path / "r.md", job_text=job_text)
    assert sorted(p.name for p in tmp_path.iterdir()) == ["r-figure-3.svg"]  # nothing written
    assert mine.read_text(encoding="utf-8") == "keep me"
    write_report(us, tmp_path / "r.md", job_text=job_text, force=True)
    assert mine.read_text(encoding="utf-8").lstrip().startswith("<?xml")
    assert len(list(tmp_path.glob("r-figure-*.svg"))) == 5


def test_report_refusals(us: CheckResult, tmp_path: Path) -> None:
    job_text = US_EXAMPLE.read_bytes()
    with pytest.raises(InputError, match=r"\.html, \.htm or \.md"):
        write_report(us, tmp_path / "r.pdf", job_text=job_text)
    existing = tmp_path / "r.html"
    existing.write_text("keep me", encoding="utf-8")
    with pytest.raises(InputError, match="force"):
        write_report(us, existing, job_text=job_text)
    assert existing.read_text(encoding="utf-8") == "keep me"
    job_copy = tmp_path / "job.md"
    shutil.copy(US_EXAMPLE, job_copy)
    job = dataclasses.replace(us.girder.job, file=str(job_copy))
    result = dataclasses.replace(us, girder=dataclasses.replace(us.girder, job=job))
    with pytest.raises(InputError, match="job file"):
        write_report(result, job_copy, job_text=job_text, force=True)
    assert job_copy.read_bytes() == job_text


@pytest.mark.skipif(not CHROMIUM.exists(), reason="needs /usr/bin/chromium")
def test_report_renders_in_a_headless_browser(report_file: Path, tmp_path: Path) -> None:
    page = report_file
    shot = tmp_path / "r.png"
    cmd = [
        str(CHROMIUM),
        "--headless",
        "--no-sandbox",
        "--disable-gpu",
        "--disable-background-networking",
        "--disable-component-update",
        "--disable-sync",
        "--no-first-run",
        f"--user-data-dir={tmp_path / 'profile'}",
        f"--screenshot={shot}",
        "--window-size=1200,2000",
        page.resolve().as_uri(),
    ]
    subprocess.run(cmd, capture_output=True, timeout=90, check=False)
    assert shot.exists()
    assert shot.read_bytes().startswith(PNG_MAGIC)
    assert shot.stat().st_size > 20_000  # a rendered page, not a blank one


# ------------------------------------------------------------------------------------------
# CSV


def _read(path: Path) -> list[list[str]]:
    with path.open(newline="", encoding="utf-8") as fh:
        return list(csv.reader(fh))


def test_csv_files_and_rows(us: CheckResult, tmp_path: Path) -> None:
    files = write_csv(us, tmp_path / "out", "US")
    names = [p.name for p in files]
    assert names == [f"{s.key}.csv" for s in us.stages] + ["loads.csv", "losses.csv", "zone.csv"]
    for stage in us.stages:
        rows = _read(tmp_path / "out" / f"{stage.key}.csv")
        header, body = rows[0], rows[1:]
        assert len(body) == len(stage.stations)
        assert "x from left end [ft]" in header and "force P [kip]" in header
        assert "moment total [kip*ft]" in header
        assert "stress girder_bottom [ksi]" in header
        col = {h: i for i, h in enumerate(header)}
        for row, st in zip(body, stage.stations, strict=True):
            assert len(row) == len(header)
            assert row[0] == st.name
            assert float(row[col["x from left end [ft]"]]) == pytest.approx(st.x / 304.8)
            f = st.fibers["girder_bottom"]
            assert float(row[col["stress girder_bottom [ksi]"]]) == pytest.approx(
                f.stress / KSI_MPA, rel=1e-9, abs=1e-12
            )
            assert row[col["ok girder_bottom"]] == ("true" if f.ok else "false")
            assert row[col["ok"]] == ("true" if st.ok else "false")
            if f.compression_limit is None:
                assert row[col["compression limit girder_bottom [ksi]"]] == ""
    losses = _read(tmp_path / "out" / "losses.csv")
    b = us.losses
    comps = [r for r in losses[1:] if r[0] == "loss" and r[1] != "total"]
    assert len(comps) == len(b.components)
    total = next(r for r in losses[1:] if r[1] == "total")
    assert sum(float(r[5]) for r in comps) == pytest.approx(float(total[5]), rel=1e-9)
    assert float(total[5]) == pytest.approx(b.total / KSI_MPA, rel=1e-9)
    assert [r[1] for r in losses[1:] if r[0] == "stress"] == [m.key for m in b.milestones]
    zone = _read(tmp_path / "out" / "zone.csv")
    assert len(zone) == len(us.zone) + 1
    loads = _read(tmp_path / "out" / "loads.csv")
    assert us.loads is not None and len(loads) == len(us.loads.stations) + 1
    col = {h: i for i, h in enumerate(loads[0])}
    for row, st in zip(loads[1:], us.loads.stations, strict=True):
        assert row[0] == st.name
        for key, m in us.loads.moments.items():
            i = us.loads.stations.index(st)
            assert float(row[col[f"moment {key} [kip*ft]"]]) == pytest.approx(
                m[i] / 1.3558179483314004e6, rel=1e-9, abs=1e-9
            )
    assert zone[0][:4] == ["station", "x from left end [ft]", "lowest cgs [in]", "cgs [in]"]


def test_csv_refuses_to_overwrite_without_force(us: CheckResult, tmp_path: Path) -> None:
    folder = tmp_path / "out"
    folder.mkdir()
    (folder / "zone.csv").write_text("mine\n", encoding="utf-8")
    with pytest.raises(InputError, match=r"zone\.csv"):
        write_csv(us, folder, "SI")
    assert [p.name for p in folder.iterdir()] == ["zone.csv"]  # nothing written
    files = write_csv(us, folder, "SI", force=True)
    assert (folder / "zone.csv").read_text(encoding="utf-8") != "mine\n"
    assert "stress girder_top [MPa]" in _read(files[0])[0]


def test_loss_formulas_only_where_the_clause_gives_them(us: CheckResult) -> None:
    """A component of another method with the same key gets no AASHTO formula (invented data)."""
    from prestress.losses import LossComponent
    from prestress.present.report import _loss_formula

    other = LossComponent("shrinkage", "Shrinkage", 30.0, "transfer to deck placement", "time-step")
    lines, subs = _loss_formula(other, us, "US")
    assert "no closed-form expression" in lines[0] and subs == []
    approx = next(c for c in us.losses.components if c.key == "shrinkage")
    lines, subs = _loss_formula(approx, us, "US")
    assert lines[0].startswith("ΔfpSH = 12.0 γh γst")  # AASHTO LRFD 9th Ed. Eq. 5.9.3.3-1
    assert any(s.startswith("γst = 5 / (1 + f'ci) = 0.7692") for s in subs)  # 5/(1 + 5.5)
