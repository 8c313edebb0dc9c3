"""A post-tensioned girder through the job file: friction and anchor set along the tendons in
``prestress losses``, sequential elastic shortening (AASHTO LRFD 9th Ed. (2020) Eq.
5.9.3.2.3b-1) by hand on the section net of the open ducts, stresses from the tendon profile,
and bad tendon input. The job is the invented demo example."""

from __future__ import annotations

import json
from pathlib import Path

import numpy as np
import pytest

from prestress.analysis import resolve_girder, run_check
from prestress.cli import main
from prestress.jobfile import load_job
from prestress.losses import compute_losses
from prestress.tendons import post_tensioning_stresses
from tests.conftest import EXAMPLES

PT = EXAMPLES / "corrie-beck-g1-post-tensioned.toml"
KSI = 6.894757293168361


def test_pt_example_passes_and_names_its_stage(capsys) -> None:
    assert main(["check", str(PT)]) == 0
    out = capsys.readouterr().out
    assert "Post-tensioning" in out and "tendon profile point" in out


def test_losses_command_shows_friction_and_anchor_set(capsys) -> None:
    assert main(["losses", str(PT)]) == 0
    out = capsys.readouterr().out
    assert "Tendon T1" in out and "after anchor set" in out and "elongation" in out
    assert main(["losses", str(PT), "--json"]) == 0
    data = json.loads(capsys.readouterr().out)
    keys = [c["key"] for c in data["methods"][0]["components"]]
    assert keys[:3] == ["friction", "anchor_set", "elastic_shortening"]


def test_sequential_elastic_shortening_by_hand() -> None:
    """ΔfpES = (N − 1)/(2N) Ep/Eci fcgp with N = 3 and fcgp at midlength from the tendon forces
    after friction and set and the self-weight on the girder length (5.9.3.2.3a's fcgp)."""
    girder = resolve_girder(load_job(PT))
    b = compute_losses(girder)
    fcgp = b.figures["fcgp (midlength)"][0]
    Eci = girder.job.girder_concrete.Eci
    es = next(c.value for c in b.components if c.key == "elastic_shortening")
    assert es == pytest.approx((3 - 1) / (2 * 3) * girder.job.strand.Ep / Eci * fcgp, rel=1e-12)
    assert fcgp > 0


def test_stage_force_follows_the_tendons() -> None:
    girder = resolve_girder(load_job(PT))
    result = run_check(girder.job)
    b = result.losses
    es = next(c.value for c in b.components if c.key == "elastic_shortening")
    st = next(s for s in result.stages[0].stations if "midspan" in s.name)
    # force at midspan at stressing: Σ A (after friction and set − ES), tendon by tendon
    expected = 0.0
    for t in girder.job.tendons:
        prof = t.profile()
        r = post_tensioning_stresses(
            prof,
            np.array([st.x]),
            f_pj_MPa=t.jacking_stress,
            mu=t.mu,
            K_per_mm=t.K,
            E_p_MPa=girder.job.strand.Ep,
            set_mm=t.anchor_set,
            jacking=t.jacking,
        )
        expected += t.area * (float(r.f_p_after_set_MPa[0]) - es)
    assert st.force == pytest.approx(expected, rel=2e-3)  # interpolated on a 241-point grid
    # the cgs at midspan is the force-weighted mean of the tendons' low points, 4.5, 8.5 and
    # 12.5 in: 8.5 in for equal forces; the forces differ by a few percent here
    assert st.cgs / 25.4 == pytest.approx(8.5, abs=0.05)


@pytest.mark.parametrize(
    ("old", "new", "field"),
    [
        ('["65 ft", "4.5 in"]', '["65 ft", "0.5 in"]', "tendons[2].points"),
        ('method = "given"', 'method = "aashto-approximate"', "losses.method"),
        (
            'jacking_stress = "195 ksi"            # 0.72',
            'jacking_stress = "230 ksi"            # 0.72',
            "tendons[0].jacking_stress",
        ),
        # a tendon anchored inside the girder is refused (anchors at the girder ends)
        (
            '["0 ft", "20 in"], ["65 ft", "4.5 in"]',
            '["2 ft", "20 in"], ["65 ft", "4.5 in"]',
            ("tendons[2].points"),
        ),
        ('["130 ft", "52 in"]]', '["128 ft", "52 in"]]', "tendons[0].points"),
        ('jack_length = "2 ft"', 'jack_length = "-2 ft"', "tendons[0].jack_length"),
        (
            'friction = { mu = 0.25, wobble = "0.0002 /ft" }',
            'friction = { mu = 0.25, wobble = "0.0002" }',
            "tendons[0].friction.wobble",
        ),
    ],
)
def test_bad_tendon_input(tmp_path: Path, capsys, old: str, new: str, field: str) -> None:
    text = PT.read_text(encoding="utf-8")
    assert old in text
    job = tmp_path / "pt.toml"
    job.write_text(text.replace(old, new, 1), encoding="utf-8")
    assert main(["check", str(job)]) == 2
    err = capsys.readouterr().err
    assert field in err and len(err.strip().splitlines()) == 1


def _job_text(**replacements: str) -> str:
    text = PT.read_text(encoding="utf-8")
    for old, new in replacements.items():
        assert old in text, old
        text = text.replace(old, new)
    return text


def _write(tmp_path: Path, text: str, name: str = "pt.toml") -> Path:
    path = tmp_path / name
    path.write_text(text, encoding="utf-8")
    return path


def test_fcgp_on_the_net_section_by_hand() -> None:
    """fcgp = P/An + P e²/In − Mg e/In (AASHTO LRFD 9th Ed. (2020) 5.9.3.2.3a) on the girder net
    of the three 3 in open ducts at their midlength heights 12.5, 8.5, 4.5 in (5.9.1.4, from
    memory), the net properties by the parallel-axis theorem worked here from the gross ones
    (hole area π d²/4, own inertia π d⁴/64); Mg = w L²/8 on the girder length (statics)."""
    girder = resolve_girder(load_job(PT))
    job = girder.job
    g = girder.gross
    d = 3.0 * 25.4
    ys = [12.5 * 25.4, 8.5 * 25.4, 4.5 * 25.4]
    a = np.pi * d * d / 4.0
    An = g.area - 3 * a
    ybn = (g.area * g.yb - a * sum(ys)) / An
    In = g.Ix + g.area * (ybn - g.yb) ** 2 - sum(a * (ybn - y) ** 2 + np.pi * d**4 / 64 for y in ys)
    from prestress.losses.post_tensioned import tendon_states

    xm = job.length / 2.0
    P = sum(s.tendon.area * float(np.interp(xm, s.x, s.after_set)) for s in tendon_states(girder))
    e = ybn - 8.5 * 25.4  # the tendons' centroid at midlength: equal areas, 8.5 in
    Mg = girder.self_weight * job.length**2 / 8.0
    fcgp = P / An + P * e * e / In - Mg * e / In
    b = compute_losses(girder)
    assert b.figures["fcgp (midlength)"][0] == pytest.approx(fcgp, rel=1e-9)
    es = next(c for c in b.components if c.key == "elastic_shortening")
    assert "net section" in es.label
    # the net section at stressing is 2.0 % smaller than the gross one
    assert 1 - An / g.area == pytest.approx(0.0195, abs=0.0005)


def test_deck_placement_without_long_term_to_deck_uses_the_final_losses(tmp_path: Path) -> None:
    """As for pretensioned girders (stages.applied_stress): a method with no losses at deck
    placement has the final losses used for that stage, and a note says so."""
    text = _job_text(**{'long_term_to_deck = "8 ksi"': "# no long_term_to_deck"})
    r = run_check(load_job(_write(tmp_path, text)))
    deck = next(s for s in r.stages if s.key == "deck_placement")
    final = next(s for s in r.stages if s.key == "service_permanent")
    for a, b in zip(deck.stations, final.stations, strict=True):
        assert a.x == b.x and a.force == pytest.approx(b.force, rel=1e-12)
    assert any("no losses at deck placement" in n and "final losses" in n for n in r.notes)
    # with long_term_to_deck = 8 ksi the force at deck placement is Aps × 8 ksi less than at
    # stressing (same tendon stresses otherwise)
    r8 = run_check(load_job(PT))
    transfer = {s.x: s.force for s in r8.stages[0].stations}
    deck8 = next(s for s in r8.stages if s.key == "deck_placement")
    A_ps = r8.girder.job.A_ps
    for st in deck8.stations:
        if st.x in transfer:
            assert transfer[st.x] - st.force == pytest.approx(A_ps * 8 * KSI, rel=1e-9)
    assert not any("no losses at deck placement" in n for n in r8.notes)


def test_tendon_stress_limits_warn_for_218_ksi(tmp_path: Path) -> None:
    """fpj = 218 ksi ≤ 0.90 fpy = 218.7 ksi is accepted, but after anchor set the stress exceeds
    0.70 fpu = 189.0 ksi at the anchorages and 0.74 fpu = 199.8 ksi elsewhere (AASHTO LRFD 9th
    Ed. (2020) Table 5.9.2.2-1, post-tensioning, low-relaxation strand; from memory)."""
    text = PT.read_text(encoding="utf-8").replace(
        'jacking_stress = "195 ksi"', 'jacking_stress = "218 ksi"'
    )
    r = run_check(load_job(_write(tmp_path, text)))
    warnings = [n for n in r.notes if n.startswith("warning: tendon")]
    from prestress.losses.post_tensioned import tendon_states

    st1 = tendon_states(r.girder)[0]
    left = st1.after_set[0] / KSI
    assert left > 189.0
    assert any(
        f"tendon T1: {left:.1f} ksi ({left * KSI:,.1f} MPa) at the left anchorage exceeds "
        "0.70 fpu = 189.0 ksi (1,303.1 MPa)" in w
        for w in warnings
    )
    assert any("T1" in w and "exceeds 0.74 fpu = 199.8 ksi" in w for w in warnings)
    assert any("right anchorage (dead end)" in w for w in warnings)
    assert not any("0.90 fpy" in w for w in warnings)  # allowed before seating
    # a code limit like the stage limits: the check fails and says why
    assert not r.ok and all(st.ok for st in r.stages)
    assert any(
        f.startswith("tendon T1, right anchorage (dead end)") and "above 0.70 fpu" in f
        for f in r.failures()
    )
    # the same job in SI units: the values in MPa first (0.70 fpu = 0.70 × 1861.6 = 1303.1
    # MPa), then in ksi (notes are written before --units may change the output units)
    si = _write(tmp_path, text.replace('units = "US"', 'units = "SI"'), "si.toml")
    notes = [n for n in run_check(load_job(si)).notes if n.startswith("warning: tendon")]
    assert any("0.70 fpu = 1,303.1 MPa (189.0 ksi)" in n for n in notes)


def test_example_meets_the_tendon_stress_limits() -> None:
    r = run_check(load_job(PT))
    assert r.ok and r.failures() == []
    assert not any(n.startswith("warning") for n in r.notes)
    assert any("tendon stresses within the limits" in n for n in r.notes)


def test_losses_table_says_what_it_shows(capsys, tmp_path: Path) -> None:
    assert main(["losses", str(PT)]) == 0
    out = " ".join(capsys.readouterr().out.split())
    assert "jacked at the left end to 195.0 ksi" in out
    assert "K = 0.0002 per ft of tendon" in out
    assert "from the left anchorage over" in out and "Peak stress after set" in out
    assert "at fpj before seating" in out and "jack length 24.00 in" in out
    assert "elastic shortening is excluded" in out and "±5–7 %" in out
    assert "Tendon stress limits" in out and "0.74 fpu = 199.8" in out
    both = _write(
        tmp_path, PT.read_text(encoding="utf-8").replace('jacking = "left"', 'jacking = "both"')
    )
    assert main(["losses", str(both)]) == 0
    out = " ".join(capsys.readouterr().out.split())
    assert "jacked at both ends" in out and "the both" not in out


def test_jack_length_adds_fpj_L_over_Ep() -> None:
    """The free strand in the jack, 2 ft at fpj = 195 ksi: Δ = fpj L / Ep = 195 × 24 / 28,500
    = 0.16421 in (Hooke's law)."""
    from prestress.tendons import jack_elongation

    girder = resolve_girder(load_job(PT))
    b = compute_losses(girder)
    t = girder.job.tendons[0]
    bare = jack_elongation(
        t.profile(), f_pj_MPa=t.jacking_stress, mu=t.mu, K_per_mm=t.K, E_p_MPa=girder.job.strand.Ep
    )["left"]
    shown = b.figures["T1 jack elongation (left)"][0]
    assert (shown - bare) / 25.4 == pytest.approx(195 * 24 / 28_500, rel=1e-9)


def test_duct_area_ratio_warning(tmp_path: Path) -> None:
    """AASHTO LRFD 9th Ed. (2020) 5.4.6.2 (from memory): duct area at least 2.0 × strand area.
    A 2.5 in duct: π 2.5²/4 = 4.909 in² against 15 × 0.217 = 3.255 in², ratio 1.51."""
    text = PT.read_text(encoding="utf-8").replace(
        'duct_diameter = "3 in"', 'duct_diameter = "2.5 in"', 1
    )
    r = run_check(load_job(_write(tmp_path, text)))
    w = [n for n in r.notes if "5.4.6.2" in n]
    assert len(w) == 1 and "T1" in w[0] and "1.51 times" in w[0] and "4.91 in²" in w[0]
    assert not any("5.4.6.2" in n for n in run_check(load_job(PT)).notes)  # 3 in: 2.17


def test_tendon_over_its_limit_fails_check_with_exit_1(tmp_path: Path, capsys) -> None:
    """The verdict, the exit status and the JSON name the tendon (Table 5.9.2.2-1, from memory)."""
    text = PT.read_text(encoding="utf-8").replace(
        'jacking_stress = "195 ksi"', 'jacking_stress = "218 ksi"'
    )
    job = _write(tmp_path, text)
    assert main(["check", str(job)]) == 1
    out = capsys.readouterr().out
    assert "FAIL: limits exceeded in tendon T1" in " ".join(out.split())
    assert main(["check", str(job), "--json"]) == 1
    data = json.loads(capsys.readouterr().out)
    assert data["ok"] is False and any("Table 5.9.2.2-1" in f for f in data["failures"])
