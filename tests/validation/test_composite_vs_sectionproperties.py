"""Composite section by the parallel-axis theorem (prestress.sections.composite) against
sectionproperties' modulus-weighted analysis of the same girder-and-deck shape.

Source of the method: sectionproperties 3.x documentation, "Composite geometry" / materials
with elastic modulus weighting (transformed properties about the elastic centroid). Both are
exact for polygons, so they agree to round-off (tolerance 1e-9 relative).
"""

from __future__ import annotations

import pytest
from sectionproperties.analysis.section import Section
from sectionproperties.pre.geometry import Geometry
from sectionproperties.pre.pre import Material
from shapely.geometry import box

from prestress.model import Concrete, Deck
from prestress.sections.composite import composite
from prestress.sections.families import build_polygon
from prestress.sections.properties import gross_properties

IN = 25.4


def test_composite_bulb_tee_matches_modulus_weighted_analysis() -> None:
    dims = {
        "depth": "72 in",
        "top_flange_width": "42 in",
        "top_flange_thickness": "3.5 in",
        "top_tapers": [["16 in", "2 in"], ["2 in", "2 in"]],
        "web_width": "6 in",
        "bottom_flange_width": "26 in",
        "bottom_flange_thickness": "6 in",
        "bottom_tapers": [["10 in", "4.5 in"]],
    }
    poly = build_polygon("i_girder", dims)
    g = gross_properties(poly, use_cache=False)
    Eg, Ed = 33_000.0, 26_000.0  # MPa (invented)
    conc = Concrete("deck", 28.0, None, 2.4e-5, Ed, None, "given")
    deck = Deck(
        thickness=8 * IN,
        wearing_surface=0.0,
        effective_width=96 * IN,
        tributary_width=96 * IN,
        haunch=2 * IN,
        haunch_width=42 * IN,
        haunch_in_stiffness=True,
        concrete=conc,
    )
    ours = composite(g, deck, Ed / Eg)

    mat_g = Material("girder", Eg, 0.2, 1.0, 0.0024, "grey")
    mat_d = Material("deck", Ed, 0.2, 1.0, 0.0024, "lightgrey")
    h = 72 * IN
    geom = (
        Geometry(poly, material=mat_g)
        + Geometry(box(-21 * IN, h, 21 * IN, h + 2 * IN), material=mat_d)
        + Geometry(box(-48 * IN, h + 2 * IN, 48 * IN, h + 10 * IN), material=mat_d)
    )
    geom.create_mesh(mesh_sizes=[0])
    sec = Section(geom)
    sec.calculate_geometric_properties()
    ea = sec.get_ea()
    _cx, cy = sec.get_c()
    eixx, _eiyy, _eixy = sec.get_eic(e_ref=Eg)
    assert ours.area == pytest.approx(ea / Eg, rel=1e-9)
    assert ours.yb == pytest.approx(cy, rel=1e-9)
    assert ours.I == pytest.approx(eixx, rel=1e-9)
