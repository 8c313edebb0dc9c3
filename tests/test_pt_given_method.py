"""The "given" loss method (prestress/losses/post_tensioned.py) at deck placement.

With ``long_term_to_deck`` the deck-placement stage carries the strand stress just after
transfer less that given loss; without it the final losses are used for that stage and a note
says so (as stages.applied_stress does for methods without a deck milestone). Hand arithmetic on
the invented demo jobs; AASHTO LRFD 9th Ed. (2020) 5.9.3.1 (total loss = losses at transfer +
time-dependent losses) is the bookkeeping.
"""

from __future__ import annotations

from pathlib import Path

import pytest

from prestress.analysis import run_check
from prestress.jobfile import load_job
from tests.conftest import EXAMPLES, US_EXAMPLE

KSI = 6.894757293168361


def _pretensioned_given(tmp_path: Path, to_deck: str | None) -> Path:
    text = US_EXAMPLE.read_text(encoding="utf-8")
    losses = 'method = "given"\nlong_term = "30 ksi"\n' + (
        f'long_term_to_deck = "{to_deck}"\n' if to_deck else ""
    )
    text = text.replace('method = "aashto-approximate"\n', losses)
    text = text.replace('file = "limits/', f'file = "{(EXAMPLES / "limits").as_posix()}/')
    path = tmp_path / "given.toml"
    path.write_text(text, encoding="utf-8")
    return path


def test_pretensioned_given_to_deck_is_used_at_deck_placement(tmp_path: Path) -> None:
    r = run_check(load_job(_pretensioned_given(tmp_path, "10 ksi")))
    b = r.losses
    deck = next(m for m in b.milestones if m.key == "deck_placement")
    assert deck.stress == pytest.approx(b.f_pt - 10 * KSI, rel=1e-12)
    assert b.f_pe == pytest.approx(b.f_pt - 30 * KSI, rel=1e-12)
    stage = next(s for s in r.stages if s.key == "deck_placement")
    assert not stage.notes or not any("no losses at deck placement" in n for n in stage.notes)
    mid = next(s for s in stage.stations if "midspan" in s.name)
    final = next(s for s in r.stages if s.key == "service_permanent")
    mid_f = next(s for s in final.stations if "midspan" in s.name)
    # same strands developed at midspan: the forces are in the ratio of the strand stresses
    assert mid.force / mid_f.force == pytest.approx(deck.stress / b.f_pe, rel=1e-12)


def test_pretensioned_given_without_to_deck_uses_final_and_says_so(tmp_path: Path) -> None:
    r = run_check(load_job(_pretensioned_given(tmp_path, None)))
    assert not any(m.key == "deck_placement" for m in r.losses.milestones)
    stage = next(s for s in r.stages if s.key == "deck_placement")
    assert any("no losses at deck placement" in n for n in stage.notes)
