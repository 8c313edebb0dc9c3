"""Development length (AASHTO LRFD 9th Ed. (2020) Eq. 5.9.4.3.2-1 with fps of Eq.
5.6.3.1.1-1, worked by hand; equations from memory) and the shipped limit sets (their
clauses as cited in the files, from memory): the tension limits by hand, and a job naming a
limit set by name."""

from __future__ import annotations

import math
from pathlib import Path

import pytest

from prestress.analysis import run_check
from prestress.codes.aashto_lrfd import materials as m
from prestress.jobfile import load_job
from tests.conftest import US_EXAMPLE


def test_development_length_by_hand() -> None:
    # 0.6 in strand, fpu 270, fpy 243: k = 2 (1.04 − 0.9) = 0.28 (Eq. 5.6.3.1.1-2)
    # Aps = 3.472 in², dp = 60.5 in, b = 96 in, f'c = 4 ksi: β1 = 0.85
    # c = 3.472 × 270 / (0.85 × 4 × 0.85 × 96 + 0.28 × 3.472 × 270 / 60.5) = 937.44 / 281.78
    c = 3.472 * 270 / (0.85 * 4 * 0.85 * 96 + 0.28 * 3.472 * 270 / 60.5)
    fps = 270 * (1 - 0.28 * c / 60.5)
    got_fps, got_c = m.f_ps_rectangular(3.472, 270.0, 243.0, 60.5, 96.0, 4.0)
    assert got_c == pytest.approx(c, rel=1e-12) and got_fps == pytest.approx(fps, rel=1e-12)
    # ld = κ (fps − 2/3 fpe) db with κ = 1.6 (depth > 24 in), fpe = 170 ksi
    assert m.l_d(1.6, fps, 170.0, 0.6) == pytest.approx(1.6 * (fps - 2 / 3 * 170) * 0.6)
    assert m.kappa_development(20.0, False) == 1.0
    assert m.kappa_development(54.0, True) == 2.0
    assert m.beta_1(8.0) == pytest.approx(0.65)  # 0.85 − 0.05 × 4 = 0.65 floor


def test_development_length_is_reported() -> None:
    result = run_check(load_job(US_EXAMPLE))
    assert any("development length of the bonded strands" in n for n in result.notes)


@pytest.mark.parametrize(
    ("limit_set", "fci", "expected_ksi"),
    [
        # with bonded reinforcement: 0.24 √f'ci (Table 5.9.2.3.1b-1) = 0.24 √5.5 = 0.5629
        ("aashto-lrfd-9th-service", 5.5, 0.24 * math.sqrt(5.5)),
        # without: 0.0948 √f'ci ≤ 0.2 ksi = min(0.2223, 0.2) = 0.2
        ("aashto-lrfd-9th-no-bonded-top-steel", 5.5, 0.2),
    ],
)
def test_transfer_tension_limit_of_the_shipped_sets(
    tmp_path: Path, limit_set: str, fci: float, expected_ksi: float
) -> None:
    text = US_EXAMPLE.read_text(encoding="utf-8").replace(
        'file = "limits/aashto-lrfd-9th-service.toml"', f'set = "{limit_set}"'
    )
    job = tmp_path / "job.toml"
    job.write_text(text, encoding="utf-8")
    result = run_check(load_job(job))
    top = result.stages[0].stations[2].fibers["girder_top"]
    assert top.tension_limit / 6.894757293168361 == pytest.approx(expected_ksi, rel=1e-9)


def test_en1992_fctm_of_table_3_1() -> None:
    """EN 1992-1-1:2004 Table 3.1: fctm = 0.30 fck^(2/3); C30/37 → 2.9 MPa (the table rounds)."""
    from prestress.model import TensionLimit

    assert TensionLimit(0.30, "MPa", None, 0.6667).value(30.0) == pytest.approx(2.9, rel=0.01)


def test_alpha_1_of_5_6_2_2() -> None:
    # AASHTO LRFD 9th Ed. (2020) 5.6.2.2 (from memory): 0.85 up to 10 ksi, −0.02 per ksi
    # above, at least 0.75
    from prestress.codes.aashto_lrfd.materials import alpha_1

    assert alpha_1(8.0) == 0.85
    assert alpha_1(10.0) == 0.85
    assert alpha_1(12.0) == pytest.approx(0.81)
    assert alpha_1(18.0) == 0.75


def test_kappa_from_the_girder_depth_and_fps_validity_note(tmp_path) -> None:
    # κ = 1.6 for members deeper than 24 in (5.9.4.3.2, from memory): a 21 in deep girder
    # under a 8 in deck is a 21 in member (κ = 1.0), whatever the composite depth
    from prestress.codes.aashto_lrfd.materials import kappa_development

    assert kappa_development(21.0, False) == 1.0
    assert kappa_development(29.0, False) == 1.6
    # fpe below 0.5 fpu: Eq. 5.6.3.1.1-1 does not apply, and the check says so
    from dataclasses import replace

    from prestress.analysis import development_lengths, losses_file
    from tests.conftest import US_EXAMPLE

    girder, losses = losses_file(US_EXAMPLE)
    low = replace(losses, f_pe=0.45 * girder.job.strand.fpu)
    notes = development_lengths(girder, low)[1]
    assert any("below 0.5 fpu" in n and "5.6.3.1.1" in n for n in notes)
