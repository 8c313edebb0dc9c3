"""Standard girder shapes of the shipped library against their published section properties.

Source of the reference values: PCI Bridge Design Manual (3rd ed.), tables of section properties
of the standard AASHTO I-beams (Types I-VI) and of the AASHTO-PCI bulb-tees (BT-54, BT-63,
BT-72); table numbers not checked. Both the dimensions in ``sections/*.toml`` and the published
area, Ix and yb were recalled from memory (each file says so).

Each shape's area, moment of inertia about the horizontal centroidal axis (Ix) and centroid
height above the soffit (yb) are computed two independent ways:

(a) shapely's exact polygon integrals (``poly.area``, ``poly.centroid``) and the exact polygon
    (shoelace) second-moment formula written below;
(b) sectionproperties' finite-element geometric analysis (exact for polygons: its 6-node
    triangles integrate the quadratic integrands exactly).

Tolerances:
    1 % against the published tables: the published values are rounded to 3-4 significant
    figures and the drawings round fillet and taper dimensions.
    1e-9 relative between (a) and (b): both are exact for straight-sided polygons, so they
    differ by floating-point rounding only.
"""

from __future__ import annotations

import itertools
import math
import tomllib
from pathlib import Path

import pytest
import sectionproperties.analysis.section as sp_section  # slow import: once per module
import sectionproperties.pre.geometry as sp_geometry

from prestress.sections.families import build_polygon
from prestress.units import to_internal

SECTIONS_DIR = Path(__file__).resolve().parents[2] / "sections"
STANDARD_FILES = ("aashto-i-beams.toml", "aashto-pci-bulb-tees.toml")

#: Relative tolerance against the published tables (see module docstring).
PUBLISHED_RTOL = 0.01
#: Relative tolerance between the two exact methods (see module docstring).
EXACT_RTOL = 1e-9


def _standard_sections() -> list:
    cases = []
    for name in STANDARD_FILES:
        path = SECTIONS_DIR / name
        with path.open("rb") as fh:
            data = tomllib.load(fh)
        for i, sec in enumerate(data["section"]):
            cases.append(pytest.param(f"sections/{name}", i, sec, id=sec["name"]))
    return cases


CASES = _standard_sections()


def shoelace_properties(poly) -> tuple[float, float, float]:
    """Area, centroid height and Ix about the centroid, by the exact polygon formulas.

    For a closed ring (x_i, y_i), with c_i = x_i y_{i+1} - x_{i+1} y_i:
    A = sum c_i / 2; S_x = sum c_i (y_i + y_{i+1}) / 6;
    I_x (about y = 0) = sum c_i (y_i^2 + y_i y_{i+1} + y_{i+1}^2) / 12.
    Holes are clockwise, so their terms subtract. Then Ix_c = I_x - A yb^2 (parallel axis).
    """
    area = first = second = 0.0
    for ring in (poly.exterior, *poly.interiors):
        pts = list(ring.coords)
        for (x0, y0), (x1, y1) in itertools.pairwise(pts):
            c = x0 * y1 - x1 * y0
            area += c / 2.0
            first += c * (y0 + y1) / 6.0
            second += c * (y0 * y0 + y0 * y1 + y1 * y1) / 12.0
    yb = first / area
    return area, yb, second - area * yb * yb


def _published(sec: dict, file: str, i: int) -> tuple[float, float, float]:
    pub = sec["published"]
    f = f"section[{i}].published"
    return (
        to_internal(pub["area"], "area", file=file, field=f"{f}.area"),
        to_internal(pub["yb"], "length", file=file, field=f"{f}.yb"),
        to_internal(pub["inertia"], "inertia", file=file, field=f"{f}.inertia"),
    )


@pytest.mark.parametrize(("file", "i", "sec"), CASES)
def test_published_source_is_marked(file: str, i: int, sec: dict) -> None:
    # rule of the project: a value recalled from memory says so
    assert "from memory" in sec["published"]["source"]
    assert "from memory" in sec["source"]


@pytest.mark.parametrize(("file", "i", "sec"), CASES)
def test_exact_polygon_integrals_match_published_table(file: str, i: int, sec: dict) -> None:
    # PCI Bridge Design Manual (3rd ed.), AASHTO I-beam / bulb-tee property tables (from memory)
    poly = build_polygon(
        sec["family"], sec["dimensions"], file=file, field=f"section[{i}].dimensions"
    )
    area_pub, yb_pub, ix_pub = _published(sec, file, i)
    area, yb, ix = shoelace_properties(poly)
    assert math.isclose(poly.area, area, rel_tol=EXACT_RTOL)
    assert math.isclose(poly.centroid.y, yb, rel_tol=EXACT_RTOL)
    assert abs(poly.centroid.x) < 1e-9 * math.sqrt(area)  # symmetric about x = 0
    assert area == pytest.approx(area_pub, rel=PUBLISHED_RTOL)
    assert yb == pytest.approx(yb_pub, rel=PUBLISHED_RTOL)
    assert ix == pytest.approx(ix_pub, rel=PUBLISHED_RTOL)


@pytest.mark.parametrize(("file", "i", "sec"), CASES)
def test_sectionproperties_matches_published_table(file: str, i: int, sec: dict) -> None:
    # PCI Bridge Design Manual (3rd ed.), AASHTO I-beam / bulb-tee property tables (from memory);
    # sectionproperties 3.x geometric analysis as the independent reference computation.
    poly = build_polygon(
        sec["family"], sec["dimensions"], file=file, field=f"section[{i}].dimensions"
    )
    geom = sp_geometry.Geometry(poly)
    geom.create_mesh(mesh_sizes=[0])
    section = sp_section.Section(geom)
    section.calculate_geometric_properties()
    area = section.get_area()
    _, cy = section.get_c()
    ixx_c, _, _ = section.get_ic()
    area_pub, yb_pub, ix_pub = _published(sec, file, i)
    assert area == pytest.approx(area_pub, rel=PUBLISHED_RTOL)
    assert cy == pytest.approx(yb_pub, rel=PUBLISHED_RTOL)
    assert ixx_c == pytest.approx(ix_pub, rel=PUBLISHED_RTOL)
    # and the two exact methods agree to rounding
    a_exact, yb_exact, ix_exact = shoelace_properties(poly)
    assert area == pytest.approx(a_exact, rel=EXACT_RTOL)
    assert cy == pytest.approx(yb_exact, rel=EXACT_RTOL)
    assert ixx_c == pytest.approx(ix_exact, rel=EXACT_RTOL)
