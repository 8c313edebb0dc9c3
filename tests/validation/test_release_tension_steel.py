"""Tensile force on the uncracked section at release, and the bonded steel it needs.

Sources:
* the resultant of a linear stress over a region equals the stress at the region's centroid
  times its area (statics); checked against a rectangle in closed form (triangular stress
  block: T = b c f_t / 2) and against shapely's exact polygon area and centroid of the
  clipped section (shapely, reference library on PyPI);
* AASHTO LRFD 9th Ed. (2020) Table 5.9.2.3.1b-1 (from memory): with bonded reinforcement
  proportioned at 0.5 fy ≤ 30 ksi to resist the tensile force of an uncracked section, the
  tension limit at release is 0.24 λ√f'ci.
"""

from __future__ import annotations

import numpy as np
import pytest
from shapely.geometry import Polygon, box

from prestress.analysis import check_file
from prestress.stages import tensile_force
from tests.conftest import ROOT

HARPED = ROOT / "examples" / "harl-brook-span1-g2-harped.toml"


def test_rectangle_triangular_block_closed_form() -> None:
    b, h = 300.0, 800.0
    ring = np.array([(-b / 2, 0), (b / 2, 0), (b / 2, h), (-b / 2, h)])
    # bottom −10 MPa, top +2 MPa: neutral axis at h × 10/12; c = h/6; T = b c f_t / 2
    T = tensile_force(ring, [], -10.0, 2.0, h)
    assert T == pytest.approx(b * (h / 6) * 2.0 / 2, rel=1e-12)
    # bottom in tension instead
    T = tensile_force(ring, [], 3.0, -9.0, h)
    assert T == pytest.approx(b * (h / 4) * 3.0 / 2, rel=1e-12)
    # all in tension: mean stress times area
    assert tensile_force(ring, [], 1.0, 3.0, h) == pytest.approx(2.0 * b * h, rel=1e-12)
    assert tensile_force(ring, [], -1.0, -3.0, h) == 0.0


def test_section_with_a_void_against_shapely() -> None:
    # an invented box-like outline with a void; stress −8 MPa at the bottom, +1.5 MPa at top
    outer = [(-600, 0), (600, 0), (600, 100), (200, 150), (200, 900), (700, 950), (700, 1000),
             (-700, 1000), (-700, 950), (-200, 900), (-200, 150), (-600, 100)]  # fmt: skip
    hole = [(-100, 700), (100, 700), (100, 960), (-100, 960)]
    h, fb, ft = 1000.0, -8.0, 1.5
    y0 = h * fb / (fb - ft)
    clipped = Polygon(outer, [hole]).intersection(box(-1e4, y0, 1e4, 1e4))
    expected = clipped.area * (fb + (ft - fb) * clipped.centroid.y / h)
    got = tensile_force(np.array(outer, float), [np.array(hole, float)], fb, ft, h)
    assert got == pytest.approx(expected, rel=1e-9)


def test_notes_of_the_harped_example() -> None:
    r = check_file(HARPED)
    release = next(s for s in r.stages if s.key == "transfer")
    handling = next(s for s in r.stages if s.key == "handling")
    # at release the top reaches +0.129 ksi (left lt), below 0.0948√6.5 = 0.242 ksi capped at
    # 0.2 ksi: no bonded steel is needed, so no note (Table 5.9.2.3.1b-1, from memory)
    assert not any("bonded reinforcement" in n for n in release.notes)
    # lifting at 4 ft: +0.261 ksi at the lift point, above 0.2 ksi: the note gives the force
    # of the tension block (26.0 kip, by the integration checked against shapely above) and
    # As = 26.0 / 30 = 0.87 in²
    notes = [n for n in handling.notes if "bonded" in n]
    assert len(notes) == 1 and "5.9.2.3.1b-1" in notes[0]
    assert "at left lift point" in notes[0]
    assert "26.0 kip" in notes[0] and "0.87 in²" in notes[0]
    assert "0.200 ksi" in notes[0]


def test_no_note_below_the_lower_limit_and_the_limit_itself() -> None:
    from prestress.analysis import lower_release_tension_limit

    KSI = 6.894757293168361
    # 0.0948 √f'ci ≤ 0.2 ksi: 0.242 ksi at 6.5 ksi is capped at 0.2; 0.0948 √4 = 0.190 ksi
    assert lower_release_tension_limit(6.5 * KSI) / KSI == pytest.approx(0.2)
    assert lower_release_tension_limit(4.0 * KSI) / KSI == pytest.approx(0.1896)
