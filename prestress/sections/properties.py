"""Gross section properties of a shape, computed by sectionproperties and cached on disk.

sectionproperties' geometric analysis (triangular mesh, exact for polygons with
``mesh_sizes=[0]``) gives area, centroid, second moments and perimeter. Importing it costs
about two seconds, so results are cached on disk (JSON), keyed by a hash of the polygon's
coordinates, the analysis asked for and the package version. A cache entry that cannot be
read, does not match its key or holds a non-finite number is recomputed, never trusted.
Writes are atomic (temporary file, then rename), so concurrent runs cannot corrupt it.
"""

from __future__ import annotations

import json
import math
from dataclasses import asdict, dataclass
from typing import TYPE_CHECKING

from prestress import __version__
from prestress.atomic import write_atomic
from prestress.paths import cache_dir

if TYPE_CHECKING:
    from shapely.geometry import Polygon

CACHE_SCHEMA = 1


@dataclass(frozen=True)
class GrossProperties:
    """Properties of a bare concrete shape (mm, mm^2, mm^4), about its centroidal axes.

    Attributes:
        area: cross-sectional area A.
        yb: height of the centroid above the bottom fiber.
        yt: distance from the centroid to the top fiber.
        height: overall depth.
        Ix: second moment of area about the horizontal centroidal axis.
        Iy: second moment of area about the vertical centroidal axis.
        perimeter: outer perimeter (holes excluded: voids are sealed and not exposed to drying).
        top_width: width of the shape at its top fiber (for the haunch and deck bearing).
        J: St Venant torsion constant (None unless asked for: needs the warping analysis).
    """

    area: float
    yb: float
    yt: float
    height: float
    Ix: float
    Iy: float
    perimeter: float
    top_width: float
    J: float | None = None

    @property
    def Sb(self) -> float:
        """Section modulus at the bottom fiber, Ix / yb (mm^3)."""
        return self.Ix / self.yb

    @property
    def St(self) -> float:
        """Section modulus at the top fiber, Ix / yt (mm^3)."""
        return self.Ix / self.yt

    @property
    def r(self) -> float:
        """Radius of gyration about the horizontal axis, √(Ix/A) (mm)."""
        return math.sqrt(self.Ix / self.area)

    @property
    def kern_top(self) -> float:
        """Upper kern distance above the centroid, Sb / A (mm)."""
        return self.Sb / self.area

    @property
    def kern_bottom(self) -> float:
        """Lower kern distance below the centroid, St / A (mm)."""
        return self.St / self.area

    @property
    def volume_to_surface(self) -> float:
        """Volume-to-surface ratio V/S = A / outer perimeter (mm), for creep and shrinkage.

        All outer faces count as exposed to drying (common practice for a girder before and
        after the deck, as the ends are negligible over a long member); internal voids do not.
        """
        return self.area / self.perimeter


def _key(poly: Polygon, analysis: str) -> str:
    import hashlib

    coords = [[round(x, 6), round(y, 6)] for x, y in poly.exterior.coords]
    holes = [[[round(x, 6), round(y, 6)] for x, y in r.coords] for r in poly.interiors]
    text = json.dumps([CACHE_SCHEMA, __version__, analysis, coords, holes])
    return hashlib.sha256(text.encode()).hexdigest()


def _top_width(poly: Polygon) -> float:
    from shapely.geometry import box

    minx, _miny, maxx, maxy = poly.bounds
    strip = poly.intersection(box(minx - 1.0, maxy - 0.5, maxx + 1.0, maxy + 1.0))
    return float(strip.area / 0.5) if not strip.is_empty else 0.0


def _clean_ring(coords: list[tuple[float, float]], tol: float) -> list[tuple[float, float]]:
    """Drop vertices within ``tol`` of the previous one, and vertices on a straight line."""
    pts = [coords[0]]
    for x, y in coords[1:-1]:
        if math.hypot(x - pts[-1][0], y - pts[-1][1]) > tol:
            pts.append((x, y))
    while len(pts) > 3 and math.hypot(pts[-1][0] - pts[0][0], pts[-1][1] - pts[0][1]) <= tol:
        pts.pop()
    changed = True
    while changed and len(pts) > 3:
        changed = False
        for k in range(len(pts)):
            (ax, ay), (bx, by), (cx, cy) = pts[k - 1], pts[k], pts[(k + 1) % len(pts)]
            cross = (bx - ax) * (cy - ay) - (by - ay) * (cx - ax)
            span = math.hypot(cx - ax, cy - ay)
            if abs(cross) <= tol * max(span, tol):  # b lies within tol of the line a–c
                del pts[k]
                changed = True
                break
    return [*pts, pts[0]]


def mesh_ready(poly: Polygon) -> Polygon:
    """The polygon made safe for the triangle mesher, without changing a sound outline.

    Vertices closer than 1e-9 of the shape's size to their neighbour, and vertices lying on
    the straight line through their neighbours, are dropped: the mesher (Triangle) can crash
    on nearly coincident or collinear points. Ordinary outlines come through unchanged.
    """
    from shapely.geometry import Polygon as ShapelyPolygon

    minx, miny, maxx, maxy = poly.bounds
    tol = 1e-9 * max(maxx - minx, maxy - miny)
    ext = _clean_ring(list(poly.exterior.coords), tol)
    holes = [_clean_ring(list(r.coords), tol) for r in poly.interiors]
    if len(ext) < 4 or any(len(h) < 4 for h in holes):
        return poly
    cleaned = ShapelyPolygon(ext, holes)
    return cleaned if cleaned.is_valid and cleaned.area > 0 else poly


def _compute(poly: Polygon, torsion: bool) -> GrossProperties:
    """Run sectionproperties (heavy import) on the polygon."""
    from sectionproperties.analysis.section import Section
    from sectionproperties.pre.geometry import Geometry

    geom = Geometry(mesh_ready(poly))
    geom.create_mesh(mesh_sizes=[0])
    sec = Section(geom)
    sec.calculate_geometric_properties()
    J = None
    if torsion:
        sec.calculate_warping_properties()
        J = float(sec.get_j())
    area = float(sec.get_area())
    _cx, cy = sec.get_c()
    ixx, iyy, _ixy = sec.get_ic()
    miny, maxy = poly.bounds[1], poly.bounds[3]
    return GrossProperties(
        area=area,
        yb=float(cy - miny),
        yt=float(maxy - cy),
        height=float(maxy - miny),
        Ix=float(ixx),
        Iy=float(iyy),
        perimeter=float(poly.exterior.length),
        top_width=_top_width(poly),
        J=J,
    )


def _read_cache(path, key: str) -> GrossProperties | None:
    try:
        data = json.loads(path.read_text(encoding="utf-8"))
        if data.get("key") != key:
            return None
        props = GrossProperties(**data["properties"])
    except (OSError, ValueError, TypeError, KeyError, AttributeError):
        return None
    values = [v for v in asdict(props).values() if v is not None]
    if not all(isinstance(v, int | float) and math.isfinite(v) for v in values):
        return None
    if props.area <= 0 or props.Ix <= 0 or props.yb <= 0 or props.yt <= 0:
        return None
    return props


def gross_properties(
    poly: Polygon, *, torsion: bool = False, use_cache: bool = True
) -> GrossProperties:
    """Gross properties of a validated polygon (mm), from the cache or from sectionproperties.

    Args:
        poly: the shape, in mm, y up, valid and oriented (see ``families.validate_polygon``).
        torsion: also compute the torsion constant J (warping analysis, about a second slower).
        use_cache: read and write the on-disk cache.
    """
    analysis = "geometric+warping" if torsion else "geometric"
    key = _key(poly, analysis)
    path = cache_dir() / "sections" / f"{key}.json"
    if use_cache:
        cached = _read_cache(path, key)
        if cached is not None:
            return cached
    props = _compute(poly, torsion)
    if use_cache:
        try:
            write_atomic(path, json.dumps({"key": key, "properties": asdict(props)}))
        except OSError:
            pass  # a read-only cache folder only costs speed
    return props


def clear_cache() -> int:
    """Delete every cached section analysis (and the unit-factor table); return the count."""
    folder = cache_dir() / "sections"
    count = 0
    if folder.is_dir():
        for p in folder.glob("*.json"):
            p.unlink(missing_ok=True)
            count += 1
    for p in cache_dir().glob("unit-factors-*.json"):
        p.unlink(missing_ok=True)
    return count


# ------------------------------------------------------------------------------------------
# Resolved definitions: family + raw dimensions → outline and properties, cached together


@dataclass(frozen=True)
class ResolvedSection:
    """A section definition resolved once: its outline (mm) and gross properties.

    Attributes:
        exterior: the outer ring, counter-clockwise, as (x, y) pairs (mm).
        holes: the voids, each a ring of (x, y) pairs (mm).
        gross: the gross properties.
    """

    exterior: tuple[tuple[float, float], ...]
    holes: tuple[tuple[tuple[float, float], ...], ...]
    gross: GrossProperties

    def polygon(self):
        """The shapely polygon of the outline."""
        from shapely.geometry import Polygon

        return Polygon(self.exterior, self.holes)


def resolve_definition(
    family: str, dimensions: dict, *, file: str = "", field: str = ""
) -> ResolvedSection:
    """Outline and gross properties of a family's section, from the cache when possible.

    The key is a hash of the family, the raw dimensions as written and the package version,
    so a warm start neither builds the polygon (shapely) nor analyses it (sectionproperties).
    Errors in the dimensions are found when the definition is first built (then cached only
    if valid).
    """
    import zlib  # cheaper to import than hashlib; the full text is compared on reading

    text = json.dumps(
        [CACHE_SCHEMA, __version__, "definition", family, dimensions], sort_keys=True, default=str
    )
    key = text
    raw = text.encode()
    path = cache_dir() / "sections" / f"def-{zlib.crc32(raw):08x}{zlib.adler32(raw):08x}.json"
    try:
        data = json.loads(path.read_text(encoding="utf-8"))
        if data.get("key") == key:
            g = GrossProperties(**data["gross"])
            ext = tuple((float(x), float(y)) for x, y in data["exterior"])
            holes = tuple(tuple((float(x), float(y)) for x, y in h) for h in data["holes"])
            values = [v for v in asdict(g).values() if v is not None]
            if len(ext) >= 4 and all(math.isfinite(v) for v in values) and g.area > 0:
                return ResolvedSection(ext, holes, g)
    except (OSError, ValueError, TypeError, KeyError, AttributeError):
        pass
    from prestress.sections.families import build_polygon

    poly = build_polygon(family, dimensions, file=file, field=field)
    g = gross_properties(poly)
    res = ResolvedSection(
        tuple((float(x), float(y)) for x, y in poly.exterior.coords),
        tuple(tuple((float(x), float(y)) for x, y in r.coords) for r in poly.interiors),
        g,
    )
    try:
        write_atomic(
            path,
            json.dumps(
                {"key": key, "gross": asdict(g), "exterior": res.exterior, "holes": res.holes}
            ),
        )
    except OSError:
        pass
    return res
