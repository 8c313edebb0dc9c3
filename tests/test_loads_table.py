"""Moments and shears per girder: the loads table of ``prestress check`` and its sources.

Checks, each against an outside source or an independent calculation:

* the live-load shear distribution factor of the harped example against AASHTO LRFD 9th Ed.
  (2020) Table 4.6.2.2.3a-1, evaluated by hand (S = 8 ft);
* the live-load shear per girder at the left bearing against the closed form of a simple span
  (statics: the influence line of the support reaction) for the HL-93 load of AASHTO LRFD
  3.6.1.2.2 to 3.6.1.2.4 with IM = 0.33 (3.6.2.1);
* the dead-load moments against w x (S − x) / 2 (statics, common practice);
* the table's moments against the stage engine (the same loads with the Service I factors add
  up to the Service I moments: one statics, two paths);
* the console, JSON and CSV carry it; bad input for the new job key.
"""

from __future__ import annotations

import json
from pathlib import Path

import numpy as np
import pytest

from prestress.analysis import check_file
from prestress.cli import main
from prestress.errors import InputError
from prestress.jobfile import load_job
from tests.conftest import ROOT, write_job

HARPED = ROOT / "examples" / "harl-brook-span1-g2-harped.toml"
KIP = 4448.2216152605  # N per kip (exact)
FT = 304.8  # mm per ft (exact)
KIPFT = KIP * FT  # N*mm per kip*ft


@pytest.fixture(scope="module")
def harped():
    return check_file(HARPED)


def test_shear_distribution_factor_table_4_6_2_2_3a_1(harped) -> None:
    # AASHTO LRFD 9th Ed. (2020) Table 4.6.2.2.3a-1, interior girder, S = 8 ft (job file):
    # one lane 0.36 + 8/25 = 0.68; two or more 0.2 + 8/12 - (8/35)^2 = 0.866667 - 0.052245
    # = 0.814422 (hand computation); the larger governs.
    live = harped.girder.job.loads.live
    assert live.shear_distribution_factor == pytest.approx(0.2 + 8 / 12 - (8 / 35) ** 2, rel=1e-12)
    assert live.shear_distribution_factor == pytest.approx(0.814422, rel=1e-6)
    assert "Table 4.6.2.2.3a-1" in live.shear_distribution_source
    assert "one lane 0.680" in live.shear_distribution_source


def test_live_shear_at_the_bearing_closed_form(harped) -> None:
    # Simple span L = 120 ft; reaction influence line 1 - x/L. Design truck with its 32 kip
    # rear axle over the bearing and 14 ft spacings (statics): 32 + 32 (L-14)/L + 8 (L-28)/L;
    # tandem: 25 + 25 (L-4)/L; lane: 0.64 L / 2 (3.6.1.2.4, no impact); IM = 0.33 on the
    # vehicle only (3.6.2.1); governing vehicle + lane (3.6.1.3.1); times the shear factor.
    L = 120.0
    truck = 32 + 32 * (L - 14) / L + 8 * (L - 28) / L
    tandem = 25 + 25 * (L - 4) / L
    per_lane = 1.33 * max(truck, tandem) + 0.64 * L / 2
    g = harped.girder.job.loads.live.shear_distribution_factor
    le = harped.loads
    assert le.stations[0].name == "left bearing"
    assert le.shear_live[0][0] / KIP == pytest.approx(g * per_lane, rel=1e-9)
    # antisymmetric envelope on a simple span: least shear at the right bearing
    assert le.shear_live[1][-1] == pytest.approx(-le.shear_live[0][0], rel=1e-9)


def test_dead_load_moments_by_statics(harped) -> None:
    job = harped.girder.job
    le = harped.loads
    xb = le.x - job.bearing_offset
    S = job.span
    for key, w in (
        ("deck", harped.girder.deck_weight),
        ("barriers", job.loads.superimposed_dead),
        ("wearing_surface", job.loads.wearing_surface),
    ):
        # M = w x (S - x) / 2 on a simple span (statics)
        np.testing.assert_allclose(le.moments[key], w * xb * (S - xb) / 2, rtol=1e-12, atol=1e-6)
    # barriers 0.30 kip/ft on 120 ft: 0.30 x 120^2 / 8 = 540 kip*ft at midspan (hand)
    i = [s.name for s in le.stations].index("midspan")
    assert le.moments["barriers"][i] / KIPFT == pytest.approx(540.0, rel=1e-9)


def test_loads_table_adds_up_to_the_service_moments(harped) -> None:
    le = harped.loads
    stage = next(s for s in harped.stages if s.key == "service_i")
    combo = harped.girder.job.combinations["service_i"]
    by_name = {s.name: i for i, s in enumerate(le.stations)}
    for st in stage.stations:
        i = by_name[st.name]
        dead = sum(le.moments[k][i] for k in le.moments if k != "live")
        expected = combo.dead * dead + combo.live * le.moments["live"][i]
        assert st.moment == pytest.approx(expected, rel=1e-12, abs=1e-3)


def test_console_json_and_csv_carry_the_loads(tmp_path: Path, capsys) -> None:
    assert main(["check", str(HARPED)]) == 0
    out = capsys.readouterr().out
    assert "Moments and shears per girder, unfactored" in out
    assert "V max" in out and "shear distribution factor 0.814" in out
    assert main(["check", str(HARPED), "--json"]) == 0
    data = json.loads(capsys.readouterr().out)
    live = data["loads"]["live_load"]
    assert live["model"] == "HL-93"
    assert live["distribution_factor_shear"] == pytest.approx(0.814422, rel=1e-6)
    first = data["loads"]["stations"][0]
    assert first["shear_live_max"]["unit"] == "kip"
    assert set(first["moments"]) == {
        "girder",
        "deck",
        "diaphragms",
        "barriers",
        "wearing_surface",
        "live",
    }


def _with_live(tmp_path: Path, live: str) -> Path:
    text = HARPED.read_text(encoding="utf-8")
    start, end = text.index("[loads.live]"), text.index("[handling]")
    return write_job(tmp_path, text[:start] + "[loads.live]\n" + live + "\n\n" + text[end:])


def test_given_factors_and_no_shear_factor(tmp_path: Path) -> None:
    # a given moment factor without a shear factor: no shear, and the output says how to get it
    job = _with_live(tmp_path, 'model = "HL-93"\ndistribution_factor = 0.7')
    r = check_file(job)
    assert r.loads.shear_live is None
    # a given shear factor is used as given
    job = _with_live(
        tmp_path, 'model = "HL-93"\ndistribution_factor = 0.7\nshear_distribution_factor = 0.9'
    )
    r = check_file(job)
    assert r.girder.job.loads.live.shear_distribution_factor == 0.9
    assert r.loads.shear_live is not None


@pytest.mark.parametrize(
    ("live", "expected"),
    [
        (
            'model = "HL-93"\ndistribution_factor = 0.7\nshear_distribution_factor = "aashto"',
            'distribution_factor = "aashto"',
        ),
        (
            'model = "HL-93"\ndistribution_factor = 0.7\nshear_distribution_factor = 4',
            "from 0 to 3",
        ),
        (
            'model = "HL-93"\ndistribution_factor = 0.7\nshear_distribution_factor = "0.8"',
            "from 0 to 3",
        ),
    ],
)
def test_bad_shear_distribution_factor(tmp_path: Path, live: str, expected: str) -> None:
    with pytest.raises(InputError) as info:
        load_job(_with_live(tmp_path, live))
    assert info.value.field == "loads.live.shear_distribution_factor"
    assert expected in str(info.value)
