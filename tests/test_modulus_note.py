"""A modulus computed from a dead-load unit weight is pointed out.

AASHTO LRFD 9th Ed. (2020) Eq. 5.4.2.4-1 takes wc, the unit weight of the concrete itself;
Table 3.5.1-1 gives 0.145 kcf up to 5 ksi and 0.140 + 0.001 f'c from 5 to 15 ksi, and
reinforcement adds about 0.005 kcf for dead load (from memory). A job that gives only 150 pcf
gets Ec from 150 pcf, about 7 % high at 145: the check says so.
"""

from __future__ import annotations

from pathlib import Path

import pytest

from prestress.analysis import check_file
from tests.conftest import ROOT, write_job

HARPED = ROOT / "examples" / "harl-brook-span1-g2-harped.toml"


def test_note_when_the_modulus_takes_the_dead_load_weight(tmp_path: Path) -> None:
    text = HARPED.read_text(encoding="utf-8").replace('modulus_unit_weight = "145 pcf"', "")
    r = check_file(write_job(tmp_path, text))
    notes = [n for n in r.notes if "dead-load unit weight 150 pcf" in n]
    # the 4 ksi deck: 150 pcf > 0.145 + 0.0025 kcf; the 8.5 ksi girder: 150 pcf is within
    # 0.140 + 0.0085 + 0.0025 = 0.151 kcf, plausible for the concrete itself
    assert len(notes) == 1
    assert "deck.concrete.modulus_unit_weight" in notes[0]
    # Ec ∝ wc² (Eq. 5.4.2.4-1): (150/145)² = 1.070 times the modulus at 145 pcf
    base = check_file(HARPED)
    ratio = r.girder.job.girder_concrete.Ec / base.girder.job.girder_concrete.Ec
    assert abs(ratio - (150 / 145) ** 2) < 1e-9


def test_no_note_when_the_modulus_weight_is_given() -> None:
    r = check_file(HARPED)
    assert not any("dead-load unit weight" in n for n in r.notes)


def test_threshold_follows_table_3_5_1_1() -> None:
    from prestress.jobfile import plain_concrete_weight

    kcf = 4.4482216152605 * 1000 / 304.8**3  # N/mm³ per kcf
    ksi = 6.894757293168361
    assert plain_concrete_weight(4.0 * ksi) / kcf == pytest.approx(0.1475)
    assert plain_concrete_weight(10.0 * ksi) / kcf == pytest.approx(0.1525)
    assert plain_concrete_weight(20.0 * ksi) / kcf == pytest.approx(0.1575)


def test_no_note_for_a_formula_without_density(tmp_path: Path) -> None:
    text = (
        HARPED.read_text(encoding="utf-8")
        .replace('modulus_unit_weight = "145 pcf"', "")
        .replace('modulus = "aashto"', 'modulus = "en1992"')
    )
    r = check_file(write_job(tmp_path, text))
    assert not any("girder modulus uses the dead-load" in n for n in r.notes)
