"""Transformed sections with bonded strands (parallel-axis theorem, strands at (n − 1) times
their area) against sectionproperties' modulus-weighted analysis of the concrete with holes at
the strands plus steel squares of modulus Ep (sectionproperties 3.x, "materials" / composite
analysis). Net sections (strand area removed) likewise. The strand squares have their own
(tiny) inertia A·a²/12, which the point-strand model neglects: tolerance 1e-6 relative."""

from __future__ import annotations

import pytest
from sectionproperties.analysis.section import Section
from sectionproperties.pre.geometry import Geometry
from sectionproperties.pre.pre import Material
from shapely.geometry import box

from prestress.sections.composite import StrandLayer, net_girder, transformed_girder
from prestress.sections.families import build_polygon
from prestress.sections.properties import gross_properties

IN = 25.4
DIMS = {
    "depth": "54 in",
    "top_flange_width": "20 in",
    "top_flange_thickness": "8 in",
    "top_tapers": [["6 in", "6 in"]],
    "web_width": "8 in",
    "bottom_flange_width": "26 in",
    "bottom_flange_thickness": "8 in",
    "bottom_tapers": [["9 in", "9 in"]],
}
STRANDS = [(x * 2 * IN, 2 * IN) for x in range(-5, 6)] + [(x * 2 * IN, 4 * IN) for x in (-2, 0, 2)]
A_STRAND = 0.153 * IN**2


def _squares():
    a = A_STRAND**0.5
    return [box(x - a / 2, y - a / 2, x + a / 2, y + a / 2) for x, y in STRANDS]


def _layers() -> list[StrandLayer]:
    return [StrandLayer(A_STRAND, y) for _x, y in STRANDS]


@pytest.mark.parametrize("Ec", [28_000.0, 33_000.0])  # at transfer (Eci) and in service (Ec)
def test_transformed_girder(Ec: float) -> None:
    Ep = 196_500.0
    poly = build_polygon("i_girder", DIMS)
    g = gross_properties(poly, use_cache=False)
    ours = transformed_girder(g, _layers(), Ep / Ec)
    conc = Material("concrete", Ec, 0.2, 1.0, 0.0024, "lightgrey")
    steel = Material("strand", Ep, 0.3, 1.0, 0.00785, "black")
    holed = poly
    for sq in _squares():
        holed = holed.difference(sq)
    geom = Geometry(holed, material=conc)
    for sq in _squares():
        geom = geom + Geometry(sq, material=steel)
    geom.create_mesh(mesh_sizes=[0])
    sec = Section(geom)
    sec.calculate_geometric_properties()
    assert ours.area == pytest.approx(sec.get_ea() / Ec, rel=1e-9)
    assert ours.yb == pytest.approx(sec.get_c()[1], rel=1e-9)
    assert ours.I == pytest.approx(sec.get_eic(e_ref=Ec)[0], rel=1e-6)
    net = net_girder(g, _layers())
    assert net.area == pytest.approx(g.area - len(STRANDS) * A_STRAND, rel=1e-12)
    assert net.yb > g.yb  # removing steel low in the section raises the centroid
