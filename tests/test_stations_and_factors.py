"""Stations where an engineer looks, and the Service III live-load factor by default.

* Lifting points are stations when the job has handling: the greatest negative moment while
  lifting is there, −w a²/2 (statics, common practice).
* Transfer-length stations only for pretensioned girders (a post-tensioned tendon has none).
* Service III live-load factor: 1.0 with the refined estimate used with elastic gains
  (transformed sections), 0.8 otherwise — AASHTO LRFD 9th Ed. (2020) Table 3.4.1-4
  (from memory).
"""

from __future__ import annotations

import pytest

from prestress.analysis import check_file
from prestress.jobfile import load_job, service_iii_default
from tests.conftest import ROOT, write_job

HARPED = ROOT / "examples" / "harl-brook-span1-g2-harped.toml"
PT = ROOT / "examples" / "corrie-beck-g1-post-tensioned.toml"
KIPFT = 4448.2216152605 * 304.8


def test_lift_points_are_stations_with_the_cantilever_moment() -> None:
    r = check_file(HARPED)
    handling = next(s for s in r.stages if s.key == "handling")
    names = [s.name for s in handling.stations]
    assert "left lift point" in names and "right lift point" in names
    st = handling.stations[names.index("left lift point")]
    # lift point 4 ft from the end (job file); w = 0.7990 kip/ft (767 in^2 x 150 pcf):
    # M = -w a^2 / 2 = -0.7990 x 16 / 2 = -6.39 kip*ft (statics)
    w = r.girder.self_weight * 304.8 / 4448.2216152605  # kip/ft
    assert st.x == pytest.approx(4 * 304.8)
    assert st.moment / KIPFT == pytest.approx(-w * 4**2 / 2, rel=1e-9)
    assert st.moment / KIPFT == pytest.approx(-6.39, abs=0.01)


def test_no_transfer_length_stations_for_post_tensioning() -> None:
    r = check_file(PT)
    for stage in r.stages:
        assert not any(" lt" in s.name for s in stage.stations), stage.key


@pytest.mark.parametrize(
    ("method", "basis", "live"),
    [
        ("aashto-refined", "transformed", 1.0),
        ("time-step-aashto", "transformed", 1.0),
        ("aashto-refined", "gross", 0.8),
        ("aashto-approximate", "transformed", 0.8),
        ("aashto-approximate", "gross", 0.8),
        ("given", "gross", 0.8),
    ],
)
def test_service_iii_live_load_factor_table_3_4_1_4(method: str, basis: str, live: float) -> None:
    combo = service_iii_default(method, basis)
    assert (combo.dead, combo.live) == (1.0, live)
    assert "3.4.1-4" in combo.source


def test_service_iii_factor_given_in_the_job_wins_and_is_said(tmp_path) -> None:
    text = HARPED.read_text(encoding="utf-8").replace(
        "[limits]", "[combinations.service_iii]\ndead = 1.0\nlive = 1.0\n\n[limits]"
    )
    job = write_job(tmp_path, text)
    c = load_job(job).combinations["service_iii"]
    assert (c.live, c.source) == (1.0, "given in the job")
    r = check_file(job)
    s3 = next(s for s in r.stages if s.key == "service_iii")
    assert any("load factors: given in the job" in n for n in s3.notes)


def test_two_handling_factors_are_two_cases(tmp_path) -> None:
    # a sudden lift and a drop: self-weight × 1.2 and × 0.8 (common practice); each case is
    # checked with the limits of the stage "handling"; the moment at midspan scales with the
    # factor (statics)
    text = HARPED.read_text(encoding="utf-8").replace(
        "dynamic_factor = 1.0", "dynamic_factor = [0.8, 1.2]"
    )
    job = write_job(tmp_path, text)
    r = check_file(job)
    base = check_file(HARPED)
    keys = [s.key for s in r.stages]
    assert keys[:3] == ["transfer", "handling_1", "handling_2"]
    one = next(s for s in base.stages if s.key == "handling")
    for key, factor in (("handling_1", 0.8), ("handling_2", 1.2)):
        st = next(s for s in r.stages if s.key == key)
        assert st.limits_key == "handling"
        assert f"× {factor:g}" in st.title
        i = [s.name for s in st.stations].index("midspan")
        assert st.stations[i].moment == pytest.approx(factor * one.stations[i].moment, rel=1e-12)
        lim = st.stations[i].fibers["girder_top"]
        assert lim.compression_limit == one.stations[i].fibers["girder_top"].compression_limit
    assert any("handling ×1.2" in z.governing_low or "handling ×0.8" in z.governing_low
               for z in r.zone)  # fmt: skip


@pytest.mark.parametrize("value", ["[]", "[0.8, 1.2, 1.0, 1.1]", "[0.8, 0.8]", "3.0", '"1.2"'])
def test_bad_dynamic_factor(tmp_path, value: str) -> None:
    from prestress.errors import InputError

    text = HARPED.read_text(encoding="utf-8").replace(
        "dynamic_factor = 1.0", f"dynamic_factor = {value}"
    )
    job = write_job(tmp_path, text)
    with pytest.raises(InputError) as info:
        load_job(job)
    assert info.value.field == "handling.dynamic_factor"
