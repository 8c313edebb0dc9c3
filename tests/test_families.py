"""Unit tests of the parametric section families (prestress.sections.families)."""

from __future__ import annotations

import itertools
import math
import tomllib
from pathlib import Path

import pytest
import shapely

from prestress.errors import InputError
from prestress.sections.families import (
    CIRCLE_AREA_ERROR,
    CIRCLE_SEGMENTS,
    FAMILIES,
    PARAM_KINDS,
    REQUIRED,
    build_polygon,
    parse_dimensions,
    validate_polygon,
)

SECTIONS_DIR = Path(__file__).resolve().parents[1] / "sections"
FILE = "sections/test.toml"
FIELD = "section[2].dimensions"


def shoelace(poly) -> tuple[float, float, float]:
    """Area, centroid height and Ix about the centroid (exact polygon formulas)."""
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


def I_GIRDER(**over) -> dict:
    dims = {
        "depth": "54 in",
        "top_flange_width": "20 in",
        "top_flange_thickness": "8 in",
        "top_tapers": [["6 in", "6 in"]],
        "web_width": "8 in",
        "bottom_flange_width": "26 in",
        "bottom_flange_thickness": "8 in",
        "bottom_tapers": [["9 in", "9 in"]],
    }
    dims.update(over)
    return {k: v for k, v in dims.items() if v is not None}


def _shipped_sections() -> list:
    cases = []
    for path in sorted(SECTIONS_DIR.glob("*.toml")):
        with path.open("rb") as fh:
            data = tomllib.load(fh)
        for i, sec in enumerate(data["section"]):
            cases.append(pytest.param(path.name, i, sec, id=sec["name"]))
    return cases


# --------------------------------------------------------------------------------------------
# Every family and every shipped section builds a valid polygon


def test_every_family_is_exercised_by_the_shipped_files() -> None:
    used = {c.values[2]["family"] for c in _shipped_sections()}
    assert set(FAMILIES) - used == {"bulb_tee"}  # bulb_tee is an alias of i_girder


def test_bulb_tee_is_an_alias_of_i_girder() -> None:
    assert FAMILIES["bulb_tee"].params == FAMILIES["i_girder"].params
    a = build_polygon("bulb_tee", I_GIRDER())
    b = build_polygon("i_girder", I_GIRDER())
    assert a.equals(b)


def test_params_are_described() -> None:
    for fam in FAMILIES.values():
        assert fam.name and fam.title
        for p in fam.params:
            assert p.kind in PARAM_KINDS
            assert len(p.description) > 10
            assert p.required == (p.default is REQUIRED)


@pytest.mark.parametrize(("name", "i", "sec"), _shipped_sections())
def test_shipped_section_builds_valid_polygon(name: str, i: int, sec: dict) -> None:
    poly = build_polygon(
        sec["family"], sec["dimensions"], file=name, field=f"section[{i}].dimensions"
    )
    assert isinstance(poly, shapely.Polygon)
    assert poly.is_valid and poly.area > 0
    assert poly.exterior.is_ccw
    assert all(not r.is_ccw for r in poly.interiors)
    assert poly.bounds[1] == pytest.approx(0.0, abs=1e-9)  # y = 0 at the bottom
    coords = list(poly.exterior.coords)[:-1]
    assert all(a != b for a, b in itertools.pairwise(coords))  # no repeated points
    if sec["family"] != "polygon":  # parametric shapes are symmetric about x = 0
        assert poly.centroid.x == pytest.approx(0.0, abs=1e-6)
        assert poly.bounds[0] == pytest.approx(-poly.bounds[2])


# --------------------------------------------------------------------------------------------
# Closed-form checks


def test_rectangle_area_and_inertia() -> None:
    # closed form (common practice): A = b h, I = b h^3 / 12 about the centroid
    poly = build_polygon("rectangle", {"width": "300 mm", "depth": "500 mm"})
    area, yb, ix = shoelace(poly)
    assert poly.area == pytest.approx(300 * 500, rel=1e-12)
    assert area == pytest.approx(300 * 500, rel=1e-12)
    assert yb == pytest.approx(250, rel=1e-12)
    assert ix == pytest.approx(300 * 500**3 / 12, rel=1e-12)


def test_i_shape_without_tapers_by_parallel_axis_theorem() -> None:
    # three rectangles, parallel-axis theorem I = sum(I_i + A_i d_i^2) (common practice)
    dims = {
        "depth": "1000 mm",
        "top_flange_width": "600 mm",
        "top_flange_thickness": "150 mm",
        "web_width": "200 mm",
        "bottom_flange_width": "500 mm",
        "bottom_flange_thickness": "200 mm",
    }
    parts = [  # (width, height, centroid height)
        (500.0, 200.0, 100.0),
        (200.0, 650.0, 200.0 + 325.0),
        (600.0, 150.0, 1000.0 - 75.0),
    ]
    A = sum(b * h for b, h, _ in parts)
    yb = sum(b * h * y for b, h, y in parts) / A
    ix = sum(b * h**3 / 12 + b * h * (y - yb) ** 2 for b, h, y in parts)
    poly = build_polygon("i_girder", dims)
    area, yb_poly, ix_poly = shoelace(poly)
    assert poly.area == pytest.approx(A, rel=1e-12)
    assert area == pytest.approx(A, rel=1e-12)
    assert poly.centroid.y == pytest.approx(yb, rel=1e-12)
    assert yb_poly == pytest.approx(yb, rel=1e-12)
    assert ix_poly == pytest.approx(ix, rel=1e-12)


def test_i_girder_tapers_add_trapezoids() -> None:
    # AASHTO Type IV by hand (from memory, dims of sections/aashto-i-beams.toml):
    # 160 + 84 + 184 + 153 + 208 = 789 in^2
    poly = build_polygon("i_girder", I_GIRDER())
    assert poly.area / 25.4**2 == pytest.approx(789.0, rel=1e-12)


def test_taper_shorter_than_overhang_leaves_a_ledge() -> None:
    poly = build_polygon("i_girder", I_GIRDER(bottom_tapers=[["5 in", "5 in"]]))
    # bottom flange 26 x 8, trapezoid 26 -> 16 over 5, ledge, web 8 from 13 to 40, top as before
    expected = 26 * 8 + (26 + 16) / 2 * 5 + 8 * 27 + 84 + 160
    assert poly.area / 25.4**2 == pytest.approx(expected, rel=1e-12)


def test_voided_slab_area_within_stated_polygon_error() -> None:
    # closed form A = b h - n pi d^2 / 4; each void is an inscribed 64-gon whose area is short
    # by CIRCLE_AREA_ERROR = 1 - sin(2 pi/64)/(2 pi/64) = 0.1606 % of pi d^2 / 4
    b, h, n, d = 1200.0, 450.0, 3, 250.0
    poly = build_polygon(
        "voided_slab",
        {
            "width": "1200 mm",
            "depth": "450 mm",
            "void_count": n,
            "void_diameter": "250 mm",
            "void_spacing": "375 mm",
        },
    )
    void = n * math.pi * d**2 / 4
    exact = b * h - void
    assert CIRCLE_SEGMENTS == 64
    assert pytest.approx(0.0016056, abs=1e-7) == CIRCLE_AREA_ERROR
    assert poly.area == pytest.approx(exact + CIRCLE_AREA_ERROR * void, rel=1e-12)
    assert abs(poly.area - exact) <= 1.001 * CIRCLE_AREA_ERROR * void
    assert len(poly.interiors) == n
    assert poly.centroid.y == pytest.approx(h / 2, rel=1e-12)


def test_box_beam_area_by_hand() -> None:
    # outer 1220 x 840 minus a 970 x 560 void with four 75 mm chamfers (common practice)
    poly = build_polygon(
        "box_beam",
        {
            "width": "1220 mm",
            "depth": "840 mm",
            "top_thickness": "140 mm",
            "bottom_thickness": "140 mm",
            "side_thickness": "125 mm",
            "void_chamfer": "75 mm",
        },
    )
    void = 970 * 560 - 4 * 75**2 / 2
    assert poly.area == pytest.approx(1220 * 840 - void, rel=1e-12)
    _, yb, _ = shoelace(poly)
    assert yb == pytest.approx(420, rel=1e-12)


def test_two_void_box() -> None:
    poly = build_polygon(
        "box_beam",
        {
            "width": "1000 mm",
            "depth": "800 mm",
            "top_thickness": "100 mm",
            "bottom_thickness": "100 mm",
            "side_thickness": "100 mm",
            "void_count": 2,
            "interior_web_thickness": "200 mm",
        },
    )
    assert len(poly.interiors) == 2
    assert poly.area == pytest.approx(1000 * 800 - 2 * 300 * 600, rel=1e-12)


def test_u_beam_area_by_hand() -> None:
    # vertical webs make it a sum of rectangles (common practice)
    poly = build_polygon(
        "u_beam",
        {
            "depth": "1000 mm",
            "top_width": "2000 mm",
            "bottom_width": "2000 mm",
            "bottom_flange_thickness": "200 mm",
            "web_width": "150 mm",
            "top_flange_width": "400 mm",
            "top_flange_thickness": "100 mm",
        },
    )
    expected = 2000 * 200 + 2 * 150 * 800 + 2 * 250 * 100
    assert poly.area == pytest.approx(expected, rel=1e-12)
    no_flange = build_polygon(
        "u_beam",
        {
            "depth": "1000 mm",
            "top_width": "2400 mm",
            "bottom_width": "1600 mm",
            "bottom_flange_thickness": "200 mm",
            "web_width": "150 mm",
        },
    )
    # sloped webs of horizontal width 150: each web is a parallelogram 150 x 800
    assert no_flange.area == pytest.approx((1600 + 400 * 0.2) * 200 + 2 * 150 * 800, rel=1e-12)


def test_inverted_tee_area_by_hand() -> None:
    poly = build_polygon(
        "inverted_tee",
        {
            "depth": "600 mm",
            "bottom_flange_width": "900 mm",
            "bottom_flange_thickness": "150 mm",
            "stem_width": "250 mm",
            "tapers": [["50 mm", "50 mm"]],
        },
    )
    # flange, then a 50 x 50 taper (900 -> 800 wide), a ledge onto the stem, the stem 250 x 400
    expected = 900 * 150 + (900 + 800) / 2 * 50 + 250 * 400
    assert poly.area == pytest.approx(expected, rel=1e-12)


def _polygon_dims(outline, holes=()) -> dict:
    return {
        "unit": "mm",
        "outline": [list(p) for p in outline],
        "holes": [list(map(list, h)) for h in holes],
    }


L_SHAPE = [(0, 0), (400, 0), (400, 100), (100, 100), (100, 600), (0, 600)]
L_HOLE = [(20, 150), (80, 150), (80, 550), (20, 550)]


@pytest.mark.parametrize(
    "transform",
    [
        pytest.param(lambda x, y: (x + 1234.5, y + 678.9), id="translate"),
        pytest.param(lambda x, y: (-x, y), id="mirror-x"),
        pytest.param(lambda x, y: (x, -y), id="mirror-y"),
        pytest.param(lambda x, y: (-x - 50.0, 300.0 - y), id="rotate-180"),
    ],
)
def test_rigid_motion_keeps_area_and_centroidal_inertia(transform) -> None:
    # area and centroidal moment of inertia are invariant under translation and reflection
    # (common practice); reflections reverse the ring orientation, which validate_polygon fixes
    base = build_polygon("polygon", _polygon_dims(L_SHAPE, [L_HOLE]))
    moved = build_polygon(
        "polygon",
        _polygon_dims([transform(*p) for p in L_SHAPE], [[transform(*p) for p in L_HOLE]]),
    )
    a0, _, i0 = shoelace(base)
    a1, _, i1 = shoelace(moved)
    assert a1 == pytest.approx(a0, rel=1e-12)
    assert i1 == pytest.approx(i0, rel=1e-9)
    assert moved.area == pytest.approx(base.area, rel=1e-12)
    assert moved.bounds[1] == pytest.approx(0.0, abs=1e-9)


def test_polygon_unit_scales_coordinates() -> None:
    dims = {"unit": "in", "outline": [[0, 0], [10, 0], [10, 20], [0, 20]]}
    poly = build_polygon("polygon", dims)
    assert poly.area == pytest.approx(200 * 25.4**2, rel=1e-12)
    closed = dict(dims, outline=[*dims["outline"], [0, 0]])  # explicitly closed ring
    assert build_polygon("polygon", closed).area == pytest.approx(poly.area)


def test_parse_dimensions_converts_and_defaults() -> None:
    dims = parse_dimensions(FAMILIES["i_girder"], I_GIRDER(top_tapers=None), file=FILE, field=FIELD)
    assert dims["depth"] == pytest.approx(54 * 25.4)
    assert dims["top_tapers"] == ()
    assert dims["bottom_tapers"] == ((pytest.approx(9 * 25.4), pytest.approx(9 * 25.4)),)


def test_validate_polygon_removes_repeated_points_and_orients() -> None:
    cw = shapely.Polygon([(0, 0), (0, 10), (0, 10), (10, 10), (10, 0)])
    out = validate_polygon(cw)
    assert out.exterior.is_ccw
    assert len(out.exterior.coords) == 5


# --------------------------------------------------------------------------------------------
# Bad dimensions: InputError naming file and full dotted field


def _raises(family: str, dims: dict, field: str, *words: str) -> InputError:
    with pytest.raises(InputError) as exc:
        build_polygon(family, dims, file=FILE, field=FIELD)
    msg = str(exc.value)
    assert f"{FILE}: field '{field}'" in msg, msg
    for w in words:
        assert w in msg, msg
    return exc.value


def test_missing_required_key() -> None:
    _raises("i_girder", I_GIRDER(web_width=None), f"{FIELD}.web_width", "required")


def test_unknown_key_suggests_nearest() -> None:
    dims = I_GIRDER()
    dims["web_widht"] = dims.pop("web_width")
    _raises("i_girder", dims, f"{FIELD}.web_widht", "did you mean 'web_width'")


def test_unknown_key_without_close_match_lists_keys() -> None:
    _raises("rectangle", {"width": "1 m", "depth": "1 m", "zzz": 1}, f"{FIELD}.zzz", "valid keys")


def test_unknown_family_suggests_nearest() -> None:
    _raises("i_girdr", I_GIRDER(), "section[2].family", "did you mean 'i_girder'")


@pytest.mark.parametrize("value", ["-8 in", "0 in"])
def test_negative_or_zero_dimension(value: str) -> None:
    _raises("i_girder", I_GIRDER(web_width=value), f"{FIELD}.web_width", "positive")


def test_bare_number_and_wrong_unit() -> None:
    _raises("i_girder", I_GIRDER(depth=54), f"{FIELD}.depth")
    _raises("i_girder", I_GIRDER(depth="54 kip"), f"{FIELD}.depth")


def test_negative_taper_leg() -> None:
    _raises("i_girder", I_GIRDER(top_tapers=[["6 in", "-6 in"]]), f"{FIELD}.top_tapers[0][1]")


def test_malformed_taper_pair() -> None:
    _raises("i_girder", I_GIRDER(top_tapers=[["6 in"]]), f"{FIELD}.top_tapers[0]")
    _raises("i_girder", I_GIRDER(top_tapers="6 in"), f"{FIELD}.top_tapers")


def test_flange_narrower_than_web() -> None:
    _raises("i_girder", I_GIRDER(top_flange_width="6 in"), f"{FIELD}.top_flange_width", "web")


def test_tapers_wider_than_overhang() -> None:
    _raises(
        "i_girder",
        I_GIRDER(bottom_tapers=[["9 in", "9 in"], ["1 in", "1 in"]]),
        f"{FIELD}.bottom_tapers",
        "overhang",
    )


def test_tapers_taller_than_depth() -> None:
    _raises("i_girder", I_GIRDER(depth="30 in"), f"{FIELD}.depth", "taper")


def test_voids_breaking_through_walls() -> None:
    slab = {"width": "1200 mm", "depth": "450 mm", "void_count": 3, "void_spacing": "375 mm"}
    _raises("voided_slab", {**slab, "void_diameter": "460 mm"}, f"{FIELD}.void_diameter")
    _raises("voided_slab", {**slab, "void_diameter": "380 mm"}, f"{FIELD}.void_spacing")
    _raises(
        "voided_slab",
        {**slab, "void_diameter": "250 mm", "void_center_height": "100 mm"},
        f"{FIELD}.void_diameter",
        "soffit",
    )
    _raises(
        "voided_slab", {**slab, "void_diameter": "250 mm", "width": "1000 mm"}, f"{FIELD}.width"
    )
    box = {
        "width": "1000 mm",
        "depth": "800 mm",
        "top_thickness": "400 mm",
        "bottom_thickness": "400 mm",
        "side_thickness": "100 mm",
    }
    _raises("box_beam", box, f"{FIELD}.depth", "top_thickness")
    box.update(top_thickness="100 mm", side_thickness="500 mm")
    _raises("box_beam", box, f"{FIELD}.width", "side walls")
    box.update(side_thickness="100 mm", void_chamfer="400 mm")
    _raises("box_beam", box, f"{FIELD}.void_chamfer")
    box.update(void_chamfer="-10 mm")
    _raises("box_beam", box, f"{FIELD}.void_chamfer", "zero or more")
    box.update(void_chamfer="0 mm")  # an explicit zero chamfer is the default, square corners
    assert build_polygon("box_beam", box).area == pytest.approx(1000 * 800 - 800 * 300)


def test_box_two_voids_need_interior_web() -> None:
    box = {
        "width": "1000 mm",
        "depth": "800 mm",
        "top_thickness": "100 mm",
        "bottom_thickness": "100 mm",
        "side_thickness": "100 mm",
        "void_count": 2,
    }
    _raises("box_beam", box, f"{FIELD}.interior_web_thickness")


@pytest.mark.parametrize("count", [0, -1, 1.5, "2", True])
def test_bad_count(count) -> None:
    dims = {"width": "1 m", "depth": "0.5 m", "void_count": count, "void_diameter": "0.2 m"}
    _raises("voided_slab", dims, f"{FIELD}.void_count", "whole number")


def test_u_beam_inconsistent() -> None:
    u = {
        "depth": "1000 mm",
        "top_width": "2000 mm",
        "bottom_width": "2000 mm",
        "bottom_flange_thickness": "200 mm",
        "web_width": "150 mm",
        "top_flange_width": "100 mm",
        "top_flange_thickness": "100 mm",
    }
    _raises("u_beam", u, f"{FIELD}.top_flange_width", "web")
    _raises("u_beam", {**u, "top_flange_width": "1100 mm"}, f"{FIELD}.top_flange_width", "open")
    _raises("u_beam", {**u, "web_width": "1100 mm"}, f"{FIELD}.web_width")
    _raises("u_beam", {**u, "top_flange_thickness": None}, f"{FIELD}.top_flange_thickness")


def test_self_intersecting_polygon_explains() -> None:
    bowtie = {"unit": "mm", "outline": [[0, 0], [100, 100], [100, 0], [0, 100]]}
    _raises("polygon", bowtie, f"{FIELD}.outline", "Self-intersection")


def test_hole_outside_outline() -> None:
    dims = {
        "unit": "mm",
        "outline": [[0, 0], [100, 0], [100, 100], [0, 100]],
        "holes": [[[150, 10], [180, 10], [180, 40]]],
    }
    _raises("polygon", dims, f"{FIELD}.holes[0]", "outside")


def test_overlapping_holes() -> None:
    dims = {
        "unit": "mm",
        "outline": [[0, 0], [100, 0], [100, 100], [0, 100]],
        "holes": [
            [[10, 10], [50, 10], [50, 50], [10, 50]],
            [[40, 40], [80, 40], [80, 80], [40, 80]],
        ],
    }
    _raises("polygon", dims, f"{FIELD}.holes[1]", "overlap")


def test_polygon_bad_points_and_unit() -> None:
    base = {"unit": "mm", "outline": [[0, 0], [100, 0], [100, 100]]}
    _raises("polygon", {**base, "outline": [[0, 0], [1, "a"], [2, 2]]}, f"{FIELD}.outline[1]")
    _raises("polygon", {**base, "outline": [[0, 0], [1, 1]]}, f"{FIELD}.outline", "3")
    _raises("polygon", {**base, "unit": "kip"}, f"{FIELD}.unit", "length unit")
    _raises("polygon", {"outline": base["outline"]}, f"{FIELD}.unit", "required")


def test_dimensions_not_a_table() -> None:
    _raises("rectangle", ["1 m", "1 m"], FIELD, "table")


def test_validate_polygon_errors_name_file_and_field() -> None:
    bowtie = shapely.Polygon([(0, 0), (10, 10), (10, 0), (0, 10)])
    with pytest.raises(InputError, match=r"sections/test\.toml: field 'x\.y'.*Self-intersection"):
        validate_polygon(bowtie, file=FILE, field="x.y")
    outside = shapely.Polygon([(0, 0), (10, 0), (10, 10), (0, 10)], [[(20, 1), (25, 1), (25, 5)]])
    with pytest.raises(InputError, match=r"sections/test\.toml: field 'x\.y'.*outside"):
        validate_polygon(outside, file=FILE, field="x.y")
    with pytest.raises(InputError, match="one polygon"):
        validate_polygon(shapely.MultiPolygon([shapely.box(0, 0, 1, 1), shapely.box(2, 0, 3, 1)]))
    with pytest.raises(InputError, match="3 distinct"):
        validate_polygon(shapely.Polygon([(0, 0), (1, 0), (1, 0), (0, 0)]))


def test_mesh_ready_drops_degenerate_vertices_only() -> None:
    """Near-duplicate and collinear vertices (which can crash the triangle mesher) are dropped;
    a sound outline is left exactly as it is (common practice for meshing input)."""
    from shapely.geometry import Polygon

    from prestress.sections.properties import gross_properties, mesh_ready

    square = Polygon([(0, 0), (100, 0), (100, 50), (0, 50)])
    assert mesh_ready(square).equals_exact(square, 0.0)
    messy = Polygon([(0, 0), (50, 0), (100, 0), (100, 1e-12), (100, 50), (0, 50), (0, 50 - 1e-12)])
    clean = mesh_ready(messy)
    assert len(clean.exterior.coords) == 5
    a = gross_properties(clean, use_cache=False)
    assert a.area == pytest.approx(5000.0) and a.Ix == pytest.approx(100 * 50**3 / 12)
