"""Loss methods in the engine: ``prestress losses`` per stage and ``--compare``, the refined
estimate wired to the job, and transformed sections (AASHTO LRFD 9th Ed. (2020) 5.9.3.2.3a:
no separate elastic shortening loss when stresses are computed on transformed sections)."""

from __future__ import annotations

import json
from pathlib import Path

import pytest

from prestress.analysis import resolve_girder, run_check
from prestress.cli import main
from prestress.jobfile import load_job
from prestress.losses import compute_losses
from prestress.losses.refined import deck_volume_to_surface
from tests.conftest import ROOT, US_EXAMPLE

BASE = US_EXAMPLE.read_text(encoding="utf-8").replace(
    'file = "limits/', f'file = "{(ROOT / "examples" / "limits").as_posix()}/'
)


def _job(tmp_path: Path, old: str = "", new: str = "") -> Path:
    p = tmp_path / "job.toml"
    p.write_text(BASE.replace(old, new) if old else BASE, encoding="utf-8")
    return p


def test_losses_command_stage_tables(capsys) -> None:
    assert main(["losses", str(US_EXAMPLE), "--method", "aashto-refined"]) == 0
    out = capsys.readouterr().out
    for text in (
        "just after transfer",
        "at deck placement",
        "final (effective)",
        "Eq. 5.9.3.4.2a-1",
        "Deck shrinkage (gain)",
        "licensed engineer",
    ):
        assert text in out, text


def test_losses_compare_json(capsys) -> None:
    assert main(["losses", str(US_EXAMPLE), "--compare", "--json"]) == 0
    data = json.loads(capsys.readouterr().out)
    methods = {m["method"]: m for m in data["methods"]}
    assert {"aashto-approximate", "aashto-refined"} <= set(methods)
    for m in methods.values():
        # the components add up to the total from jacking to final
        total = sum(c["loss"]["value"] for c in m["components"] if c["applied"])
        assert total == pytest.approx(m["total"]["value"], rel=1e-9)
        assert m["stages"][-1]["name"] == "final"
        assert 5.0 < 100 * m["total"]["value"] / m["jacking_stress"]["value"] < 40.0
    ref = methods["aashto-refined"]
    assert ref["by_mechanism"]["deck_shrinkage_gain"]["value"] < 0  # a gain


def test_refined_needs_a_deck(tmp_path: Path, capsys) -> None:
    text = BASE.replace('method = "aashto-approximate"', 'method = "aashto-refined"')
    start, end = text.index("[deck]"), text.index("[strand]")
    job = tmp_path / "nodeck.toml"
    job.write_text(text[:start] + text[end:], encoding="utf-8")
    assert main(["check", str(job)]) == 2
    err = capsys.readouterr().err
    assert "losses.method" in err and "deck" in err
    assert main(["losses", str(job), "--compare", "--method", "aashto-approximate"]) == 0
    assert "Not applicable: aashto-refined" in capsys.readouterr().out


def test_unknown_method_on_the_command_line(capsys) -> None:
    assert main(["losses", str(US_EXAMPLE), "--method", "guess"]) == 2
    assert "--method" in capsys.readouterr().err


def test_deck_volume_to_surface_by_hand() -> None:
    # 7.5 in × 96 in slab; exposed: top 96 in + soffit 96 − 42 in (flange covers 42 in)
    # V/S = 7.5 × 96 / (96 + 54) = 4.8 in — common practice for the covered soffit
    girder = resolve_girder(load_job(US_EXAMPLE))
    assert deck_volume_to_surface(girder) / 25.4 == pytest.approx(7.5 * 96 / 150, rel=1e-12)


def test_refined_inputs_by_hand() -> None:
    """fcgp at midspan (5.9.3.2.3a) and Δfcd (5.9.3.4.3b) of the example, by hand."""
    girder = resolve_girder(load_job(US_EXAMPLE))
    b = compute_losses(girder, "aashto-refined")
    g = girder.gross
    A, I, e = g.area / 645.16, g.Ix / 25.4**4, girder.eccentricity_gross / 25.4
    Aps = 16 * 0.217
    fpt = b.f_pt / 6.894757293168361
    w = A / 144 * 0.150  # kip/ft
    Mg = w * 82**2 / 8 * 12  # kip-in, girder length
    fcgp = Aps * fpt / A + Aps * fpt * e**2 / I - Mg * e / I
    assert b.figures["fcgp"][0] / 6.894757293168361 == pytest.approx(fcgp, rel=1e-9)


def test_transformed_basis(tmp_path: Path) -> None:
    gross = run_check(load_job(US_EXAMPLE))
    job = _job(
        tmp_path,
        'method = "aashto-approximate"',
        'method = "aashto-approximate"\nsection = "transformed"',
    )
    tr = run_check(load_job(job))
    es = next(c for c in tr.losses.components if c.key == "elastic_shortening")
    assert not es.applied  # reported for information only
    fpbt = 202.5 * 6.894757293168361
    assert tr.losses.applied_transfer == pytest.approx(fpbt)
    # transfer, midlength, by hand on the transformed section (n = Ep/Eci):
    sec = tr.girder.section_transfer
    assert sec is not None and sec.area > tr.girder.gross.area
    st = next(s for s in tr.stages[0].stations if s.name == "midspan")
    P = 16 * 0.217 * 645.16 * fpbt
    e = sec.yb - 2.5 * 25.4
    M = tr.girder.self_weight * (82 * 304.8) ** 2 / 8
    top = -P / sec.area + (P * e - M) * (sec.fibers["girder_top"] - sec.yb) / sec.I
    assert st.fibers["girder_top"].stress == pytest.approx(top, rel=1e-9)
    # the two bases agree closely at transfer (the usual result; a few percent at most)
    g0 = (
        next(s for s in gross.stages[0].stations if s.name == "midspan")
        .fibers["girder_bottom"]
        .stress
    )
    t0 = st.fibers["girder_bottom"].stress
    assert t0 == pytest.approx(g0, rel=0.03)


def test_compare_marks_what_is_not_in_the_total(capsys, monkeypatch) -> None:
    """The elastic gain from later loads is reported but not in fpj − fpe (the stage engine
    applies the loads itself); deck shrinkage of the time-step methods has its own row."""
    monkeypatch.setenv("COLUMNS", "250")
    harped = ROOT / "examples" / "harl-brook-span1-g2-harped.toml"
    assert main(["losses", str(harped), "--compare"]) == 0
    out = capsys.readouterr().out
    assert "Elastic gain from later loads (reported, not in total)" in out
    assert "Totals are fpj − fpe" in " ".join(out.split())  # the caption wraps
    row = next(line for line in out.splitlines() if "Deck shrinkage (gain)" in line)
    assert row.count("—") == 1  # only the approximate method does not model it
    assert main(["losses", str(harped), "--compare", "--json"]) == 0
    data = json.loads(capsys.readouterr().out)
    for m in data["methods"]:
        if m["method"].startswith("time-step"):
            keys = {c["key"] for c in m["components"]}
            assert {"deck_shrinkage_gain", "deck_creep", "shrinkage_after_deck"} <= keys
            gain = m["by_mechanism"]["deck_shrinkage_gain"]["value"]
            assert gain < 0.0


def test_a_girder_without_deck_is_not_described_with_one(tmp_path: Path, capsys) -> None:
    """No deck: the second stage is the added dead load, no composite caption (common practice)."""
    start, end = BASE.index("[deck]"), BASE.index("[strand]")
    job = tmp_path / "nodeck.toml"
    job.write_text(BASE[:start] + BASE[end:], encoding="utf-8")
    assert main(["check", str(job)]) in (0, 1)
    out = " ".join(capsys.readouterr().out.split())
    assert "Added dead load on the girder (no deck)" in out
    assert "Deck placement on the girder alone" not in out
    assert "Composite: deck transformed" not in out and "No deck: every load" in out
    assert "Other non-composite load" in out and "Other: other non-composite load" in out


def test_transformed_sections_show_the_force_the_stages_apply(tmp_path: Path, capsys) -> None:
    """On transformed sections the stage tables apply Aps (fpbt − time-dependent losses): the
    losses table says so beside fpe (AASHTO LRFD 9th Ed. 5.9.3.2.3a and C5.9.3.1, from
    memory), so that P in the stage tables is explained."""
    job = tmp_path / "transformed.toml"
    job.write_text(
        BASE.replace(
            'method = "aashto-approximate"',
            'method = "aashto-approximate"\nsection = "transformed"',
        ),
        encoding="utf-8",
    )
    r = run_check(load_job(job))
    assert r.losses.applied_final > r.losses.f_pe  # no elastic shortening deducted
    assert main(["check", str(job)]) in (0, 1)
    out = " ".join(capsys.readouterr().out.split())
    P = r.losses.applied_final * r.girder.job.A_ps / 4448.2216152605  # kip
    assert "Applied to the transformed section" in out and f"P {P:,.1f} kip" in out
    midspan = next(s for s in r.stages if s.key == "service_permanent").stations
    assert any(abs(st.force / 4448.2216152605 - P) < 0.05 for st in midspan)


def test_report_of_a_girder_without_deck_names_its_load(tmp_path: Path) -> None:
    """The report's stage tables head the added load 'other non-composite' without a deck."""
    from prestress.analysis import check_file
    from prestress.present.report import build, render_markdown

    start, end = BASE.index("[deck]"), BASE.index("[strand]")
    job = tmp_path / "nodeck.toml"
    job.write_text(BASE[:start] + BASE[end:], encoding="utf-8")
    title, sections, _ = build(check_file(job), job_text=job.read_bytes())
    md = render_markdown(title, sections)
    assert "M other non-composite (" in md and "M deck (" not in md
