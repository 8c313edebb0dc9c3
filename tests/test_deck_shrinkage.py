"""Stresses of the deck's shrinkage on the composite section (optional) and the note when not.

Sources: AASHTO LRFD 9th Ed. (2020) 5.9.3.4.3d, Eq. 5.9.3.4.3d-2 (the restraint force
F = εddf Ad Ecd / (1 + 0.7 ψd) and the stress it causes at the strands, Δfcdf); the
stresses at the fibers from an eccentric axial force on the composite section (statics,
common practice; applied by some owners to Service I/III, at a factor of their choosing).
"""

from __future__ import annotations

from pathlib import Path

import pytest

from prestress.analysis import check_file, losses_file
from prestress.errors import InputError
from prestress.jobfile import load_job
from tests.conftest import ROOT, write_job

HARPED = ROOT / "examples" / "harl-brook-span1-g2-harped.toml"
KSI = 6.894757293168361


def _job(tmp_path: Path, line: str) -> Path:
    text = HARPED.read_text(encoding="utf-8").replace(
        'wearing_surface = "0.25 kip/ft"', f'wearing_surface = "0.25 kip/ft"\n{line}'
    )
    return write_job(tmp_path, text)


def test_force_agrees_with_the_refined_estimate() -> None:
    # Δfcdf of Eq. 5.9.3.4.3d-2 is F (epc ed / Ic − 1/Ac): the force behind the credited gain
    from prestress.losses.refined import deck_shrinkage_force

    girder, losses = losses_file(HARPED)
    F = deck_shrinkage_force(girder)[0]
    c = girder.composite_section
    deck = girder.job.deck
    e_d = girder.gross.height + deck.haunch + deck.thickness / 2 - c.yb
    e_pc = c.yb - girder.job.y_ps
    dfcdf = losses.figures["Δfcdf (5.9.3.4.3d-2)"][0]
    assert F * (e_pc * e_d / c.I - 1 / c.area) == pytest.approx(dfcdf, rel=1e-9)
    # an independent hand evaluation of this job gives F = 690 kip (see
    # tests/validation/test_refined_losses_job_wiring.py for the same inputs)
    assert F / 4448.2216152605 == pytest.approx(690, abs=1)


def test_applied_stresses_equal_the_eccentric_force_on_the_composite_section(
    tmp_path: Path,
) -> None:
    base = check_file(HARPED)
    with_shrink = check_file(_job(tmp_path, "deck_shrinkage = 1.0"))
    girder = base.girder
    c = girder.composite_section
    deck = girder.job.deck
    from prestress.losses.refined import deck_shrinkage_force

    F = deck_shrinkage_force(girder)[0]
    e_d = girder.gross.height + deck.haunch + deck.thickness / 2 - c.yb
    # bottom: −F/Ac + F ed ybc / Ic (tension); top of girder: −F/Ac − F ed (h − ybc)/Ic
    f_bot = -F / c.area + F * e_d * c.yb / c.I
    f_top = -F / c.area - F * e_d * (girder.gross.height - c.yb) / c.I
    assert f_bot / KSI == pytest.approx(0.275, abs=0.001)  # helper's hand figure, ksi
    for key in ("service_permanent", "service_i", "service_iii"):
        a = next(s for s in base.stages if s.key == key)
        b = next(s for s in with_shrink.stages if s.key == key)
        assert "deck shrinkage × 1" in b.description
        for sa, sb in zip(a.stations, b.stations, strict=True):
            d_bot = sb.fibers["girder_bottom"].stress - sa.fibers["girder_bottom"].stress
            d_top = sb.fibers["girder_top"].stress - sa.fibers["girder_top"].stress
            assert d_bot == pytest.approx(f_bot, rel=1e-9)
            assert d_top == pytest.approx(f_top, rel=1e-9)
    # stages before the deck is composite are untouched
    for key in ("transfer", "handling", "deck_placement"):
        a = next(s for s in base.stages if s.key == key)
        b = next(s for s in with_shrink.stages if s.key == key)
        assert [s.fibers["girder_bottom"].stress for s in a.stations] == [
            s.fibers["girder_bottom"].stress for s in b.stations
        ]
    assert any("applied × 1 in the final service stages" in n for n in with_shrink.notes)


def test_note_when_the_gain_is_credited_but_the_stresses_are_not_applied() -> None:
    r = check_file(HARPED)
    note = next(n for n in r.notes if "credit the prestress gain from deck shrinkage" in n)
    assert "+0.275 ksi (+1.90 MPa) at the girder bottom" in note
    assert "[loads] deck_shrinkage = 1" in note


@pytest.mark.parametrize("line", ["deck_shrinkage = -1.0", 'deck_shrinkage = "half"'])
def test_bad_factor(tmp_path: Path, line: str) -> None:
    with pytest.raises(InputError) as info:
        load_job(_job(tmp_path, line))
    assert info.value.field == "loads.deck_shrinkage"


def test_the_verdict_names_what_a_pass_presupposes(capsys) -> None:
    # the harped example passes, but only without the deck-shrinkage stresses (Service III
    # bottom 1.21 with them, see above) and with bonded steel where lifting puts the top in
    # tension: the verdict line, the JSON and the report say so
    import json

    from prestress.cli import main

    r = check_file(HARPED)
    assert r.ok
    assert len(r.conditions) == 2
    assert r.conditions[0].startswith("bonded reinforcement of at least 0.87 in²")
    assert "deck-shrinkage stresses left out" in r.conditions[1]
    assert "1.21" in r.conditions[1] and "EXCEEDED" in r.conditions[1]
    assert main(["check", str(HARPED)]) == 0
    out = capsys.readouterr().out
    assert "provided: (1) bonded reinforcement" in " ".join(out.split())
    assert main(["check", str(HARPED), "--json"]) == 0
    assert json.loads(capsys.readouterr().out)["conditions"] == list(r.conditions)


def test_no_condition_when_the_stresses_are_applied(tmp_path: Path) -> None:
    r = check_file(_job(tmp_path, "deck_shrinkage = 1.0"))
    assert not any("left out" in c for c in r.conditions)
