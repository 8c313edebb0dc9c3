"""The governing station of a fiber is the one nearest its limit, also with a zero tension limit.

With a decompression check (a tension limit of zero, EN 1992-1-1:2004 7.3.1 Table 7.1N for
prestressed members; the shipped EN limit set's Service III) every compressed fiber has a
utilisation of 0 and every tensile one fails without a finite utilisation: the governing
station is then the one with the least compression, or the greatest tension (common practice:
the station nearest decompression is the one a reviewer asks about).
"""

from __future__ import annotations

from prestress.analysis import StageResult, StationResult, check_fiber
from prestress.model import FiberLimit, TensionLimit

DECOMPRESSION = FiberLimit(compression_fraction=None, tension=TensionLimit(0.0, "MPa", None))
AASHTO_LIKE = FiberLimit(compression_fraction=0.45, tension=TensionLimit(0.5, "MPa", None))


def _stage(stresses: dict[str, float], limit: FiberLimit) -> StageResult:
    stations = tuple(
        StationResult(
            name=name,
            x=1000.0 * k,
            x_bearing=1000.0 * k,
            force=1.0e6,
            eccentricity=500.0,
            moments={},
            fibers={"girder_bottom": check_fiber(s, limit, 50.0, "fck")},
        )
        for k, (name, s) in enumerate(stresses.items())
    )
    return StageResult("service_iii", "Service III", "", "fck", stations)


def test_all_compressed_under_decompression_governs_the_least_compressed() -> None:
    stage = _stage({"left bearing": -7.17, "0.4 span": -5.6, "midspan": -5.12}, DECOMPRESSION)
    station, use, fiber = stage.governing_at("girder_bottom")
    assert station.name == "midspan" and use == 0.0 and fiber.ok
    assert stage.governing()[0].name == "midspan"


def test_tension_under_decompression_governs_the_greatest_tension() -> None:
    stage = _stage({"left bearing": -7.17, "0.4 span": 1.14, "midspan": 2.38}, DECOMPRESSION)
    station, _use, fiber = stage.governing_at("girder_bottom")
    assert station.name == "midspan" and not fiber.ok
    assert stage.governing()[0].name == "midspan"


def test_finite_utilisations_still_rank_first() -> None:
    """With finite limits the highest stress / limit governs, as before."""
    # tension limit 0.5√50 = 3.54 MPa; compression limit 0.45 × 50 = −22.5 MPa
    stage = _stage({"a": 2.0, "b": -20.0, "c": 3.0}, AASHTO_LIKE)
    station, use, _ = stage.governing_at("girder_bottom")
    assert station.name == "b" and abs(use - 20.0 / 22.5) < 1e-12


def test_an_exceeded_zero_limit_outranks_any_finite_utilisation() -> None:
    """A tension past a zero limit (infinite use) governs over a finite use, whatever the
    distances (rank_beats compared them as a tie)."""
    from prestress.analysis import rank_beats

    assert rank_beats((float("inf"), 0.01), (0.99, 50.0))
    assert not rank_beats((0.99, 50.0), (float("inf"), 0.01))
    assert rank_beats((float("inf"), 2.0), (float("inf"), 1.0))
