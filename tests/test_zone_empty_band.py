"""An empty permissible band is named as such, with no margin that suggests moving the cgs.

Where the lowest permissible cgs height lies above the highest, no eccentricity satisfies
every stage with the prestress force given: the force (or the loads, or the limits) must
change (the classical kern construction read backwards, common practice).
"""

from __future__ import annotations

from prestress.stages import Station, ZoneStation


def _zone(low: float | None, high: float | None, cgs: float) -> ZoneStation:
    return ZoneStation(Station("midspan", 18_000.0), low, high, cgs, "", "")


def test_an_empty_band_has_no_margin_and_is_not_inside() -> None:
    z = _zone(353.3, 239.5, 175.8)  # mm: lowest above highest
    assert z.empty and not z.inside and z.margin is None


def test_a_band_keeps_its_signed_margin() -> None:
    z = _zone(100.0, 300.0, 80.0)
    assert not z.empty and not z.inside and z.margin == -20.0
    z = _zone(100.0, 300.0, 150.0)
    assert z.inside and z.margin == 50.0
    assert not _zone(None, 300.0, 150.0).empty and not _zone(100.0, None, 150.0).empty
