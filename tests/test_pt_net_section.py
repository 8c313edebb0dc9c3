"""The girder net of the open ducts, the section carrying the prestress at post-tensioning.

Sources:
- AASHTO LRFD 5.9.1.4 (clause number as recalled for the 8th Ed.; `from memory`): before
  bonding of the tendons, the loss of area due to open ducts shall be considered.
- Parallel-axis theorem; a circle of diameter d has area π d²/4 and own second moment π d⁴/64
  (standard geometry).
- Independent check: the exact integrals of the girder polygon with circular holes. The area
  and centroid are shapely's (`Polygon` with interior rings, `.area`, `.centroid`); the second
  moment about the x axis is the exact polygon (Green's theorem) formula
  Ix = 1/12 Σ (x_i y_{i+1} − x_{i+1} y_i)(y_i² + y_i y_{i+1} + y_{i+1}²) over the oriented rings
  (standard geometry). The circles are polygons of N = 4096 sides, whose area and second moment
  fall short of the circle's by a relative (2π/N)²/6 ≈ 4e-7; the holes are 2 % of the section,
  so the whole section agrees to about 1e-8: the tolerance is 1e-6 relative.

The girder is the AASHTO Type VI of the post-tensioned example (invented demo job); the ducts
(3 in outside diameter) sit at the tendons' midlength heights 12.5, 8.5 and 4.5 in on the
girder's vertical axis.
"""

from __future__ import annotations

import math

import numpy as np
import pytest
import shapely
from shapely.geometry import Polygon
from shapely.geometry.polygon import orient

from prestress.analysis import resolve_girder
from prestress.jobfile import load_job
from prestress.sections.composite import DuctHole, net_of_ducts, section_at_stressing
from prestress.sections.properties import GrossProperties
from tests.conftest import EXAMPLES

PT = EXAMPLES / "corrie-beck-g1-post-tensioned.toml"
IN = 25.4


def _circle(xc: float, yc: float, d: float, n: int = 4096) -> list[tuple[float, float]]:
    t = np.linspace(0.0, 2.0 * math.pi, n, endpoint=False)
    return list(zip(xc + d / 2 * np.cos(t), yc + d / 2 * np.sin(t), strict=True))


def _exact_Ix_about_origin(poly: Polygon) -> float:
    """Second moment about y = 0 of a polygon with holes (Green's theorem, exact)."""
    poly = orient(poly, 1.0)  # exterior counter-clockwise, holes clockwise
    total = 0.0
    for ring in [poly.exterior, *poly.interiors]:
        xy = np.asarray(ring.coords)
        x, y = xy[:-1, 0], xy[:-1, 1]
        x2, y2 = xy[1:, 0], xy[1:, 1]
        total += float(np.sum((x * y2 - x2 * y) * (y * y + y * y2 + y2 * y2))) / 12.0
    return total


def _polygon_properties(poly: Polygon) -> tuple[float, float, float]:
    A = poly.area
    yb = poly.centroid.y
    return A, yb, _exact_Ix_about_origin(poly) - A * yb * yb


@pytest.fixture(scope="module")
def girder():
    return resolve_girder(load_job(PT))


def test_gross_properties_are_the_polygon_integrals(girder) -> None:
    # the basis of the parallel-axis assembly: the gross properties of the outline are exact
    A, yb, I = _polygon_properties(girder.polygon)
    assert girder.gross.area == pytest.approx(A, rel=1e-9)
    assert girder.gross.yb == pytest.approx(yb, rel=1e-9)
    assert girder.gross.Ix == pytest.approx(I, rel=1e-9)


def test_net_section_equals_the_polygon_with_circular_holes(girder) -> None:
    d = 3.0 * IN
    heights = [12.5 * IN, 8.5 * IN, 4.5 * IN]
    outline = girder.polygon
    holed = Polygon(outline.exterior.coords, holes=[_circle(0.0, y, d) for y in heights])
    assert holed.is_valid and shapely.covers(outline, holed)
    A, yb, I = _polygon_properties(holed)
    net = net_of_ducts(girder.gross, [DuctHole(d, y) for y in heights])
    assert net.area == pytest.approx(A, rel=1e-6)
    assert net.yb == pytest.approx(yb, rel=1e-6)
    assert net.I == pytest.approx(I, rel=1e-6)
    # the figures the reviewer worked by hand (in, in², in⁴): 1063.8, 36.936, 716,270
    assert net.area / IN**2 == pytest.approx(1063.8, abs=0.05)
    assert net.yb / IN == pytest.approx(36.936, abs=0.001)
    assert net.I / IN**4 == pytest.approx(716_270, rel=1e-5)


def test_rectangle_with_one_hole_by_hand() -> None:
    """b × h = 200 × 600 mm, one 80 mm hole centred 150 mm above the bottom (hand calculation).

    A = 120,000 − 5026.548 = 114,973.452 mm²; yb = (120,000 × 300 − 5026.548 × 150) / A
    = 306.558 mm; I = 200 × 600³/12 + 120,000 (300 − yb)² − [π 80⁴/64 + 5026.548 (yb − 150)²]
    = 3.6e9 + 5.1607e6 − (2.0106e6 + 1.23203e8) = 3.479948e9 mm⁴.
    """
    g = GrossProperties(
        area=120_000.0,
        yb=300.0,
        yt=300.0,
        height=600.0,
        Ix=200 * 600**3 / 12,
        Iy=600 * 200**3 / 12,
        perimeter=1600.0,
        top_width=200.0,
    )
    net = net_of_ducts(g, [DuctHole(80.0, 150.0)])
    a_hole = math.pi * 80**2 / 4
    assert a_hole == pytest.approx(5026.548, abs=1e-3)
    assert net.area == pytest.approx(120_000 - a_hole, rel=1e-12)
    assert net.yb == pytest.approx(306.558, abs=1e-3)
    assert net.I == pytest.approx(3.479948e9, rel=1e-6)


def test_stressing_stage_uses_net_section_later_stages_gross(girder) -> None:
    from prestress.losses import compute_losses
    from prestress.stages import stage_specs, stage_stresses, stations

    sec = girder.section_transfer
    assert sec.name == "girder, net (open ducts)"
    assert sec.area < girder.gross.area
    assert girder.section_service.area == girder.gross.area  # after grouting: gross
    expected, notice = section_at_stressing(girder.gross, girder.job.tendons, girder.job.length / 2)
    assert (sec.area, sec.yb, sec.I) == (expected.area, expected.yb, expected.I)
    assert "midlength" in notice and "5.9.1.4" in notice and notice in girder.notices
    losses = compute_losses(girder)
    specs = {s.key: s for s in stage_specs(girder)}
    sts = stations(girder)
    raw = stage_stresses(girder, losses, specs["transfer"], sts)
    assert raw.section is sec
    assert stage_stresses(girder, losses, specs["service_i"], sts).section.area == (
        girder.gross.area
    )
    # the bottom fiber at midspan by hand: −P/A − (M − P e)(0 − yb)/I on the net section
    i = next(k for k, s in enumerate(raw.stations) if "midspan" in s.name)
    P, M = raw.force[i], sum(m[i] for m in raw.moments.values())
    e = sec.yb - raw.cgs[i]
    bottom = -P / sec.area - (M - P * e) * (0.0 - sec.yb) / sec.I
    assert raw.stresses["girder_bottom"][i] == pytest.approx(bottom, rel=1e-12)


def test_no_duct_diameter_gives_gross_section_and_says_so(girder) -> None:
    from dataclasses import replace

    tendons = [replace(t, duct_diameter=0.0) for t in girder.job.tendons]
    sec, notice = section_at_stressing(girder.gross, tendons, girder.job.length / 2)
    assert sec.area == girder.gross.area and sec.I == girder.gross.Ix
    assert "no tendon gives a duct_diameter" in notice
