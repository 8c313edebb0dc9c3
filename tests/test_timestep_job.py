"""The time-step loss methods wired to a job: milestones, the job's concrete, deck shrinkage.

Sources of the checks (beside each one):

* AASHTO LRFD 9th Ed. (2020) 5.9.3.2.3a: on transformed sections the elastic shortening is not a
  separate loss of force (it comes out of the section analysis); Eq. C5.9.3.2.3a-1, the closed
  form of the elastic shortening, which is the exact solution of the compatibility problem of
  the gross concrete with the strands lumped at their centroid (Ep/Eci);
* AASHTO LRFD 9th Ed. (2020) Eq. 5.4.2.4-1, Ec = 120,000 K1 wc² f'c^0.33 (ksi, kcf), written
  out by hand with the job's modulus unit weight (145 pcf) rather than its dead-load weight;
* ACI 209R-92 Eq. 2-1, (f'c)t = t/(a + βt) (f'c)28 with β = 0.95 for steam curing, Type I
  cement (Table 2.2.1, from memory);
* fib MC2010 (2013) Eq. 5.1-51 and EN 1992-1-1:2004 Eq. 3.2, βcc(t) = exp{s[1 − (28/t)^½]},
  checked against structuralcodes (independent implementation), fcm = fck + 8 MPa (MC2010
  Eq. 5.1-1, EN Table 3.1);
* EN 1992-1-1:2004 3.1.4(4): linear creep while |σc| ≤ 0.45 fck(t0); fib MC2010 (2013)
  5.1.9.4.3: |σc| ≤ 0.4 fcm(t0) (from memory);
* the intrinsic log-time relaxation law (Magura, Sozen & Siess 1964, PCI Journal 9(2), as coded
  in prestress.codes.aashto_lrfd.relaxation);
* linearity of the section analysis (common practice: superposition of the shares of the loss).

The jobs are the invented demo job ``examples/harl-brook-span1-g2-harped.toml`` with changes
written in each test (invented inputs).
"""

from __future__ import annotations

import math
import warnings
from pathlib import Path

import numpy as np
import pytest

from prestress.analysis import resolve_girder
from prestress.codes.aashto_lrfd import losses as aashto_losses
from prestress.errors import InputError
from prestress.jobfile import load_job
from prestress.losses import compute_losses
from prestress.losses.timestep_method import analyse, concrete_models
from prestress.present.losses_view import NOT_IN_TOTAL, compare_table
from prestress.stages import applied_stress, stage_specs, stage_stresses, stations
from tests.conftest import EXAMPLES

KSI = 6.894757293168361
HARPED = EXAMPLES / "harl-brook-span1-g2-harped.toml"
BASE = HARPED.read_text(encoding="utf-8").replace(
    'file = "limits/', f'file = "{(EXAMPLES / "limits").as_posix()}/'
)
MODELS = ("aashto", "aci209", "mc2010", "en1992")


def _girder(tmp_path: Path, *changes: tuple[str, str]):
    text = BASE
    for old, new in changes:
        assert old in text, old
        text = text.replace(old, new)
    p = tmp_path / "job.toml"
    p.write_text(text, encoding="utf-8")
    return resolve_girder(load_job(p))


def _method(name: str) -> tuple[str, str]:
    return ('method = "aashto-refined"', f'method = "time-step-{name}"')


TRANSFORMED = ('method = "aashto-refined"', 'method = "aashto-refined"\nsection = "transformed"')


@pytest.fixture(scope="module")
def harped():
    return resolve_girder(load_job(HARPED))


# --------------------------------------------------------------------------- defect 1
def test_deck_placement_milestone_on_transformed_sections(tmp_path: Path) -> None:
    girder = _girder(
        tmp_path,
        ('method = "aashto-refined"', 'method = "time-step-aashto"\nsection = "transformed"'),
    )
    assert girder.basis == "transformed"
    b = compute_losses(girder)
    job = girder.job
    fpj = job.strand.jacking_stress
    m = next(m for m in b.milestones if m.key == "deck_placement")
    upto = b.up_to("transfer to deck placement")
    es = next(c for c in upto if c.key == "elastic_shortening")
    assert not es.applied  # AASHTO 5.9.3.2.3a: reported, not a loss of force, on these sections
    # no elastic gain before deck placement (no load between transfer and the deck)
    assert not any(c.key.startswith("elastic_gain") for c in upto)
    # the real strand stress: fpj less every loss up to deck placement, ES included
    assert m.stress == pytest.approx(fpj - sum(c.value for c in upto), rel=1e-12)
    # the same bookkeeping as the refined method's milestone f_pt − loss up to the deck
    lt1 = sum(c.value for c in upto if c.period == "transfer to deck placement")
    assert m.stress == pytest.approx(b.f_pt - lt1, rel=1e-12)
    # stages.applied_stress adds the transformed-section shift applied_transfer − f_pt, which
    # is the elastic shortening (applied_transfer = fpbt, f_pt = fpbt − ES): so the force the
    # stage engine applies at deck placement is Aps (fpbt − LT1), counting ES once, implicitly
    shift = b.applied_transfer - b.f_pt
    assert shift == pytest.approx(es.value, rel=1e-12)
    fp_applied, note = applied_stress(b, "deck_placement")
    assert note is None
    fpbt = job.strand.stress_before_transfer
    assert fp_applied == pytest.approx(fpbt - lt1, rel=1e-12)
    spec = next(s for s in stage_specs(girder) if s.key == "deck_placement")
    mid = [s for s in stations(girder) if "midspan" in s.name]
    ss = stage_stresses(girder, b, spec, mid)
    # at midspan every strand is developed: the force is (milestone + shift) × Aps
    assert float(ss.force[0]) == pytest.approx((m.stress + shift) * job.A_ps, rel=1e-12)


def test_deck_placement_milestone_on_gross_sections_is_applied_as_is(harped) -> None:
    b = compute_losses(harped, "time-step-mc2010")
    m = next(m for m in b.milestones if m.key == "deck_placement")
    upto = b.up_to("transfer to deck placement")
    assert m.stress == pytest.approx(b.jacking_stress - sum(c.value for c in upto), rel=1e-12)
    assert applied_stress(b, "deck_placement")[0] == pytest.approx(m.stress, rel=1e-12)


# --------------------------------------------------------------------------- defect 2
def test_job_moduli_by_hand(harped) -> None:
    # AASHTO LRFD 9th Ed. (2020) Eq. 5.4.2.4-1 with the job's modulus unit weight 145 pcf
    # (0.145 kcf) and K1 = 1: the figures every time-step model must reproduce
    gc = harped.job.girder_concrete
    assert gc.Eci / KSI == pytest.approx(120_000 * 0.145**2 * 6.5**0.33, rel=1e-12)
    assert gc.Ec / KSI == pytest.approx(120_000 * 0.145**2 * 8.5**0.33, rel=1e-12)


@pytest.mark.parametrize("name", MODELS)
def test_each_model_has_the_job_modulus_and_strength_at_transfer(harped, name) -> None:
    job = harped.job
    gc, dc, t_tr = job.girder_concrete, job.deck.concrete, job.times.transfer
    gm, dm = concrete_models(harped, name)
    # the modulus at transfer is the job's Eci and the 28-day modulus the job's Ec, exactly
    # (rel. 1e-9, round-off): each code's modulus law is recalibrated to pass through them
    assert float(gm.E(t_tr)) == pytest.approx(gc.Eci, rel=1e-9)
    assert float(dm.E(28.0)) == pytest.approx(dc.Ec, rel=1e-9)
    if name == "aashto":
        # strength at transfer = f'ci and f'c at 28 days (the two-point law of the adapter)
        assert float(gm.strength(t_tr)) == pytest.approx(gc.fci, rel=1e-9)
        assert float(gm.E(28.0)) == pytest.approx(gc.Ec, rel=1e-9)
    elif name == "aci209":
        # ACI 209R-92 Eq. 2-1 with a fitted: f'ci at transfer; f'c reached at t = a/(1 − β),
        # where the modulus is the job's Ec (the job's Ec is the modulus at f'c)
        assert float(gm.strength(t_tr)) == pytest.approx(gc.fci, rel=1e-9)
        t_fc = gm._a / (1.0 - gm._beta)
        assert float(gm.strength(t_fc)) == pytest.approx(gc.fc, rel=1e-9)
        assert float(gm.E(t_fc)) == pytest.approx(gc.Ec, rel=1e-9)
        # at 28 days (about 1.04 f'c by the fitted law) the modulus is about 1 % above Ec
        assert 1.0 < float(gm.E(28.0)) / gc.Ec < 1.02
    else:
        # mean strength at the equivalent age of transfer = f'ci + 8 MPa (fck(t) = fcm(t) − 8,
        # EN 1992-1-1 3.1.2(5)); the 28-day modulus at the equivalent age of 28 days
        assert float(gm.strength(t_tr)) == pytest.approx(gc.fci + 8.0, rel=1e-9)
        tT = gm.maturity_at_end_of_curing
        assert 1.0 < tT < 28.0
        assert float(gm.E(t_tr + 28.0 - tT)) == pytest.approx(gc.Ec, rel=1e-9)
    if name == "aci209":
        # ACI 209R-92 Eq. 2-1 with β = 0.95 (steam, Type I, Table 2.2.1, from memory) and
        # a = t (f'c/f'ci − β) = 1 × (8.5/6.5 − 0.95) = 0.35769 d, by hand
        assert gm.curing == "steam"
        assert gm._a == pytest.approx(8.5 / 6.5 - 0.95, rel=1e-12)


def test_fib_equivalent_age_against_structuralcodes(harped) -> None:
    # fib MC2010 (2013) Eq. 5.1-51 and EN 1992-1-1:2004 Eq. 3.2, by structuralcodes: at the
    # fitted equivalent age the mean strength is f'ci + 8 MPa
    from structuralcodes.codes import ec2_2004 as ec2
    from structuralcodes.codes import mc2010 as sc

    gc = harped.job.girder_concrete
    fcm = gc.fc + 8.0
    mc_model, _ = concrete_models(harped, "mc2010")
    en_model, _ = concrete_models(harped, "en1992")
    # fcm = 66.6 MPa > 60 MPa: s = 0.20 for every cement class (MC2010 Table 5.1-9)
    tT = mc_model.maturity_at_end_of_curing
    assert fcm * float(sc.beta_cc(tT, fcm, "42.5 N")) == pytest.approx(gc.fci + 8.0, rel=1e-9)
    tT = en_model.maturity_at_end_of_curing
    assert fcm * float(ec2.beta_cc(tT, 0.25)) == pytest.approx(gc.fci + 8.0, rel=1e-9)


def test_elastic_shortening_of_time_step_aashto_equals_the_closed_form(tmp_path: Path) -> None:
    # AASHTO LRFD 9th Ed. (2020) Eq. C5.9.3.2.3a-1 with the job's Eci, gross Ag and Ig, the
    # strands lumped at their centroid, Mg of the girder on its own length; on transformed
    # sections the time-step analysis is the same compatibility problem (gross concrete and
    # bonded strands with Ep/Eci). Tolerance 1e-3: the time-step analysis keeps each strand set
    # at its own height, which adds their second moment about their own centroid, n Σ Ap (y −
    # ȳ)², to the stiffness (found 1.5e-4 here); it also shows that the modulus at transfer
    # used by the analysis is the job's Eci (a 1 % change of Eci changes ES by about 0.9 %).
    girder = _girder(
        tmp_path,
        ('method = "aashto-refined"', 'method = "time-step-aashto"\nsection = "transformed"'),
    )
    job = girder.job
    g = girder.gross
    closed = aashto_losses.delta_f_pES_closed_form(
        job.A_ps,
        job.strand.stress_before_transfer,
        g.Ix,
        girder.eccentricity_gross,
        g.area,
        girder.self_weight * job.length**2 / 8.0,
        job.girder_concrete.Eci,
        job.strand.Ep,
    )
    b = compute_losses(girder)
    es = next(c.value for c in b.components if c.key == "elastic_shortening")
    assert es == pytest.approx(closed, rel=1e-3)
    # every model has the same Eci, hence the same elastic shortening
    for name in ("aci209", "mc2010", "en1992"):
        other = compute_losses(girder, f"time-step-{name}")
        es_other = next(c.value for c in other.components if c.key == "elastic_shortening")
        assert es_other == pytest.approx(es, rel=1e-9)


@pytest.mark.parametrize("name", MODELS)
def test_linear_creep_range_note(harped, name) -> None:
    b = compute_losses(harped, f"time-step-{name}")
    sigma = abs(b.figures["σc at the strand centroid just after transfer"][0])
    noted = any("linear creep" in n for n in b.notes)
    gc = harped.job.girder_concrete
    if name == "en1992":
        # EN 1992-1-1:2004 3.1.4(4): 0.45 fck(t0), fck(t0) = f'ci = 6.5 ksi = 44.82 MPa;
        # 0.45 × 44.82 = 20.17 MPa < 21.1 MPa found at the cgs
        assert 0.45 * gc.fci == pytest.approx(20.17, abs=0.01)
        assert sigma > 0.45 * gc.fci and noted
    elif name == "mc2010":
        # fib MC2010 5.1.9.4.3 (from memory): 0.4 fcm(t0) = 0.4 (44.82 + 8) = 21.13 MPa
        assert noted == (sigma > 0.4 * (gc.fci + 8.0))
    else:
        assert not noted
    assert not any("differs from the job's Eci" in n for n in b.notes)


def test_time_step_aashto_transfer_at_28_days_or_later(tmp_path: Path, capsys) -> None:
    late = ('transfer = "1 day"', 'transfer = "30 day"')
    girder = _girder(tmp_path, late, _method("aashto"))
    with pytest.raises(InputError) as err:
        compute_losses(girder)
    assert err.value.field == "time.transfer"
    # with f'ci = f'c the strength law is flat from transfer on and the method works
    girder = _girder(tmp_path, late, _method("aashto"), ('fci = "6.5 ksi"', 'fci = "8.5 ksi"'))
    b = compute_losses(girder)
    assert 0.10 < b.total / b.jacking_stress < 0.30
    # the other models take any transfer age (ACI a fitted; fib equivalent age from f'ci)
    for name in ("aci209", "mc2010", "en1992"):
        with warnings.catch_warnings():
            warnings.simplefilter("ignore")
            b = compute_losses(_girder(tmp_path, late, _method(name)))
        assert 0.10 < b.total / b.jacking_stress < 0.30


def test_given_modulus_at_transfer_above_the_28_day_modulus(tmp_path: Path) -> None:
    girder = _girder(
        tmp_path,
        _method("mc2010"),
        ('modulus = "aashto"', 'modulus = "5000 ksi"\nmodulus_at_transfer = "5200 ksi"'),
    )
    with pytest.raises(InputError) as err:
        compute_losses(girder)
    assert err.value.field == "girder.concrete.modulus_at_transfer"


def test_given_moduli_are_used(tmp_path: Path) -> None:
    girder = _girder(
        tmp_path,
        _method("en1992"),
        ('modulus = "aashto"', 'modulus = "5400 ksi"\nmodulus_at_transfer = "4300 ksi"'),
    )
    gm, _ = concrete_models(girder, "en1992")
    assert float(gm.E(girder.job.times.transfer)) == pytest.approx(4300 * KSI, rel=1e-9)


# --------------------------------------------------------------------------- defect 3
@pytest.mark.parametrize("name", ["aashto", "mc2010"])
def test_split_by_part_adds_up_to_the_unsplit_total(harped, name) -> None:
    res, _ = analyse(harped, name)
    for mech in ("creep", "shrinkage"):
        parts = res.losses_by_part[mech]
        assert set(parts) == {"girder", "deck"}
        total = parts["girder"] + parts["deck"]
        # linearity: one right-hand side per part, same stiffness (common practice)
        scale = np.abs(res.losses[mech]).max()
        np.testing.assert_allclose(total, res.losses[mech], rtol=0, atol=1e-9 * scale)
        # the deck does nothing before it is cast
        before = res.ages < harped.job.times.deck_placement - 1e-9
        assert np.all(parts["deck"][before] == 0.0)
    b = compute_losses(harped, f"time-step-{name}")
    comps = {c.key: c for c in b.components}
    # deck shrinkage reported on its own row with the refined method's key, a gain
    assert comps["deck_shrinkage_gain"].value < 0.0
    assert comps["deck_shrinkage_gain"].period == "deck placement to final"
    # the breakdown's components still add up to its total fpj − fpe
    applied = sum(c.value for c in b.components if c.applied)
    assert applied == pytest.approx(b.total, rel=1e-9)
    areas = np.array([s.total_area for s in harped.job.layout.sets])
    i_tr, i_fin = res.index(harped.job.times.transfer), res.index(harped.job.times.final)
    lt = (res.long_term_loss[i_fin, 0] - res.long_term_loss[i_tr, 0]) @ areas / areas.sum()
    time_dep = sum(
        c.value
        for c in b.components
        if c.applied and c.period not in ("before transfer", "at transfer")
    )
    assert time_dep == pytest.approx(lt, rel=1e-9)


def test_compare_table_marks_the_elastic_gain_and_says_what_totals_are(harped) -> None:
    results = [compute_losses(harped, m) for m in ("aashto-refined", "time-step-aashto")]
    t = compare_table(results, harped.job.A_ps, "US")
    names = list(t.columns[0].cells)
    assert "Elastic gain from later loads" + NOT_IN_TOTAL in names
    assert "Deck shrinkage (gain)" in names and "Creep of the deck" in names
    assert "fpj − fpe" in str(t.caption)
    # what the table sums: every row not so marked adds up to the total (ES included)
    for b in results:
        counted = sum(c.value for c in b.components if not c.key.startswith("elastic_gain"))
        assert counted == pytest.approx(b.total, rel=1e-9)


# --------------------------------------------------------------------------- defect 5
def test_relaxation_clock_note(tmp_path: Path, harped) -> None:
    b = compute_losses(harped, "time-step-aashto")
    assert any("counted from transfer" in n for n in b.notes)
    assert not any("counted twice" in n for n in b.notes)
    girder = _girder(
        tmp_path,
        _method("aashto"),
        ('jacking_stress = "202.5 ksi"', 'jacking_stress = "202.5 ksi"\n'
         'stress_before_transfer = "200 ksi"'),
    )  # fmt: skip
    b = compute_losses(girder)
    note = next(n for n in b.notes if "counted twice" in n)
    # log-time law over the first day (24 h) at fpbt = 200 ksi, fpy = 243 ksi, C = 45
    # (low-relaxation, from memory): 200 × log10(24)/45 × (200/243 − 0.55) = 1.68 ksi
    by_hand = 200.0 * math.log10(24.0) / 45.0 * (200.0 / 243.0 - 0.55)
    assert by_hand == pytest.approx(1.68, abs=0.01)
    assert f"{by_hand:.2f} ksi" in note
