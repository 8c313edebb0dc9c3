"""Parametric section families: named dimensions a precaster would recognise, built into polygons.

Every family turns a table of named dimensions (read from a section library file or a job file)
into one :class:`shapely.Polygon` in millimetres, with y = 0 at the girder bottom, y upward, and
symmetric shapes centred on x = 0. The exterior ring is returned counter-clockwise and holes
(voids) clockwise.

Dimensions arrive from TOML as strings with their unit (``"54 in"``, ``"1372 mm"``) and are
converted once with :func:`prestress.units.to_internal`. Every error is an
:class:`~prestress.errors.InputError` naming the file and the full dotted field, e.g.
``sections/aashto-i-beams.toml: field 'section[2].dimensions.web_width'``.

Families:
    ``i_girder``      I-shaped girder with tapered (haunched) flanges: AASHTO Types I-VI and the
                      AASHTO-PCI bulb-tees are all expressed with it.
    ``bulb_tee``      alias of ``i_girder``: same dimensions, same builder.
    ``box_beam``      adjacent box beam with one or more rectangular voids, optional chamfers.
    ``voided_slab``   solid rectangle with a row of circular voids.
    ``u_beam``        open-top tub: bottom flange, two sloped or vertical webs, top flanges.
    ``inverted_tee``  bottom flange and stem, with optional tapers between them.
    ``rectangle``     solid rectangle.
    ``polygon``       free outline with holes, coordinates in a stated unit.
"""

from __future__ import annotations

import difflib
import math
from collections.abc import Callable, Mapping, Sequence
from dataclasses import dataclass
from typing import Any

import shapely
import shapely.validation
from shapely.geometry.polygon import orient

from prestress.errors import InputError
from prestress.units import to_internal


class _Required:
    """Sentinel type of :data:`REQUIRED` (a dimension with no default)."""

    _instance: _Required | None = None

    def __new__(cls) -> _Required:
        if cls._instance is None:
            cls._instance = super().__new__(cls)
        return cls._instance

    def __repr__(self) -> str:
        return "REQUIRED"


#: Default value marking a dimension the user must give.
REQUIRED: Any = _Required()

#: Number of straight segments used to approximate a circular void. An inscribed regular
#: n-gon has area (n/2) r^2 sin(2 pi/n), so with n = 64 each void's area is short by
#: 1 - sin(2 pi/64) / (2 pi/64) = 0.1606 % (the net section is slightly larger). Vertices lie
#: on the true circle, so the void never exceeds its stated diameter.
CIRCLE_SEGMENTS = 64

#: Relative shortfall of a void's area caused by :data:`CIRCLE_SEGMENTS`.
CIRCLE_AREA_ERROR = 1.0 - math.sin(2.0 * math.pi / CIRCLE_SEGMENTS) / (
    2.0 * math.pi / CIRCLE_SEGMENTS
)

#: Geometric tolerance in mm (unit conversions and sums of tapers are snapped within it).
TOL_MM = 1e-6

#: The kinds of family parameters (see :class:`Param`).
PARAM_KINDS = ("length", "length_pairs", "count", "points", "rings", "unit")


@dataclass(frozen=True)
class Param:
    """One named dimension of a family.

    Attributes:
        name: the TOML key, e.g. ``top_flange_width``.
        kind: "length", "length_pairs", "count", "points", "rings" or "unit".
        description: what a precaster would call it and where it is measured.
        default: :data:`REQUIRED`, or the default value (lengths in mm; ``None`` where the
            description says what ``None`` means).
    """

    name: str
    kind: str
    description: str
    default: Any = REQUIRED

    @property
    def required(self) -> bool:
        """True when the dimension has no default."""
        return self.default is REQUIRED


@dataclass(frozen=True)
class Family:
    """A parametric section family.

    Attributes:
        name: key used in files (``family = "i_girder"``).
        title: a human title.
        params: the dimensions, in the order they are best written.
        build: builds the polygon from parsed dimensions (lengths already in mm).
    """

    name: str
    title: str
    params: tuple[Param, ...]
    build: Callable[[Mapping[str, Any]], shapely.Polygon]

    def param(self, name: str) -> Param:
        """Return the parameter called ``name`` (KeyError if none)."""
        for p in self.params:
            if p.name == name:
                return p
        raise KeyError(name)


# ------------------------------------------------------------------------------------------
# Parsing


def _join(prefix: str, key: str) -> str:
    if not prefix:
        return key
    if key.startswith("["):
        return f"{prefix}{key}"
    return f"{prefix}.{key}"


def _describe(value: Any) -> str:
    if isinstance(value, str):
        return f'"{value}"'
    if isinstance(value, bool):
        return f"boolean {str(value).lower()}"
    if isinstance(value, int | float):
        return f"the number {value}"
    if isinstance(value, Mapping):
        return "a table"
    if isinstance(value, list | tuple):
        return f"a list of {len(value)} items"
    return type(value).__name__


def _positive_length(value: Any, *, file: str, field: str, allow_zero: bool = False) -> float:
    mm = to_internal(value, "length", field=field, file=file)
    if mm < 0.0 or (mm == 0.0 and not allow_zero):
        words = "a length of zero or more" if allow_zero else "a positive length"
        raise InputError(words, file=file, field=field, got=_describe(value))
    return mm


def _parse_pairs(value: Any, *, file: str, field: str) -> tuple[tuple[float, float], ...]:
    expected = 'a list of [horizontal, vertical] pairs, e.g. [["6 in", "6 in"]] (may be empty)'
    if not isinstance(value, list | tuple):
        raise InputError(expected, file=file, field=field, got=_describe(value))
    pairs = []
    for i, pair in enumerate(value):
        f_i = f"{field}[{i}]"
        if not isinstance(pair, list | tuple) or len(pair) != 2:
            raise InputError(expected, file=file, field=f_i, got=_describe(pair))
        hv = []
        for j, item in enumerate(pair):
            f_ij = f"{f_i}[{j}]"
            mm = to_internal(item, "length", field=f_ij, file=file)
            if mm < 0.0:
                raise InputError(
                    "a length of zero or more", file=file, field=f_ij, got=_describe(item)
                )
            hv.append(mm)
        if hv[0] == 0.0 and hv[1] == 0.0:
            raise InputError(
                "a taper with a non-zero horizontal or vertical leg",
                file=file,
                field=f_i,
                got="both legs zero",
            )
        pairs.append((hv[0], hv[1]))
    return tuple(pairs)


def _parse_count(value: Any, *, file: str, field: str) -> int:
    if isinstance(value, bool) or not isinstance(value, int) or value < 1:
        raise InputError(
            "a positive whole number, e.g. 2", file=file, field=field, got=_describe(value)
        )
    return int(value)


def _parse_unit(value: Any, *, file: str, field: str) -> float:
    """Return the size in mm of the length unit named by ``value`` (e.g. "in" -> 25.4)."""
    expected = 'the name of a length unit, e.g. "in" or "mm"'
    if not isinstance(value, str) or not value.strip():
        raise InputError(expected, file=file, field=field, got=_describe(value))
    try:
        factor = to_internal(f"1 {value.strip()}", "length", field=field, file=file)
    except InputError:
        raise InputError(expected, file=file, field=field, got=_describe(value)) from None
    if factor <= 0.0:
        raise InputError(expected, file=file, field=field, got=_describe(value))
    return factor


def _parse_points(value: Any, *, file: str, field: str) -> list[tuple[float, float]]:
    expected = "a list of [x, y] number pairs (in the unit given by 'unit'), at least 3 points"
    if not isinstance(value, list | tuple):
        raise InputError(expected, file=file, field=field, got=_describe(value))
    points = []
    for i, pt in enumerate(value):
        f_i = f"{field}[{i}]"
        ok = isinstance(pt, list | tuple) and len(pt) == 2
        ok = ok and all(isinstance(c, int | float) and not isinstance(c, bool) for c in pt)
        if not ok or not all(math.isfinite(c) for c in pt):
            raise InputError("an [x, y] pair of numbers", file=file, field=f_i, got=_describe(pt))
        points.append((float(pt[0]), float(pt[1])))
    if len(points) >= 2 and points[0] == points[-1]:
        points = points[:-1]  # an explicitly closed ring: drop the repeated point
    if len(points) < 3:
        raise InputError(expected, file=file, field=field, got=f"{len(points)} distinct points")
    return points


def _parse_rings(value: Any, *, file: str, field: str) -> list[list[tuple[float, float]]]:
    expected = "a list of rings, each a list of [x, y] number pairs (may be empty)"
    if not isinstance(value, list | tuple):
        raise InputError(expected, file=file, field=field, got=_describe(value))
    return [_parse_points(ring, file=file, field=f"{field}[{i}]") for i, ring in enumerate(value)]


def parse_dimensions(
    family: Family, raw: Mapping[str, Any], *, file: str, field: str
) -> dict[str, Any]:
    """Check and convert a family's raw TOML dimensions.

    Lengths become floats in mm, ``length_pairs`` tuples of (horizontal, vertical) mm pairs,
    counts ints; ``points``/``rings`` are scaled to mm by the sibling ``unit`` (which becomes the
    unit's size in mm). Missing optional keys take their defaults.

    Args:
        family: the section family.
        raw: the dimensions table as read from TOML.
        file: file the table came from, for error messages.
        field: dotted TOML path of the table (e.g. ``section[2].dimensions``); keys are appended.

    Returns:
        The parsed dimensions, one entry per parameter of the family.

    Raises:
        InputError: not a table, unknown key (with the nearest valid key), missing required key,
            malformed value, or a zero or negative dimension.
    """
    if not isinstance(raw, Mapping):
        raise InputError(
            f"a table of the dimensions of family '{family.name}'",
            file=file,
            field=field,
            got=_describe(raw),
        )
    names = [p.name for p in family.params]
    for key in raw:
        if key not in names:
            close = difflib.get_close_matches(str(key), names, n=1, cutoff=0.5)
            hint = f"did you mean '{close[0]}'?" if close else f"valid keys: {', '.join(names)}"
            raise InputError(
                f"a dimension of family '{family.name}'; {hint}",
                file=file,
                field=_join(field, str(key)),
                got=f"unknown key '{key}'",
            )
    missing = [p.name for p in family.params if p.required and p.name not in raw]
    if missing:
        p = family.param(missing[0])
        raise InputError(
            f"the {p.name} of family '{family.name}' ({p.description})",
            file=file,
            field=_join(field, p.name),
            got="nothing (this key is required)",
        )
    out: dict[str, Any] = {}
    unit_mm = 1.0
    unit_param = next((p for p in family.params if p.kind == "unit"), None)
    if unit_param is not None:
        f_u = _join(field, unit_param.name)
        if unit_param.name in raw:
            unit_mm = _parse_unit(raw[unit_param.name], file=file, field=f_u)
        else:
            unit_mm = _parse_unit(unit_param.default, file=file, field=f_u)
        out[unit_param.name] = unit_mm
    for p in family.params:
        if p.kind == "unit":
            continue
        f_p = _join(field, p.name)
        if p.name not in raw:
            out[p.name] = p.default
            continue
        value = raw[p.name]
        if p.kind == "length":
            # an optional length whose default is 0 (e.g. a chamfer) may be given as zero
            zero_ok = p.default == 0.0 and not p.required
            out[p.name] = _positive_length(value, file=file, field=f_p, allow_zero=zero_ok)
        elif p.kind == "length_pairs":
            out[p.name] = _parse_pairs(value, file=file, field=f_p)
        elif p.kind == "count":
            out[p.name] = _parse_count(value, file=file, field=f_p)
        elif p.kind == "points":
            pts = _parse_points(value, file=file, field=f_p)
            out[p.name] = [(x * unit_mm, y * unit_mm) for x, y in pts]
        elif p.kind == "rings":
            rings = _parse_rings(value, file=file, field=f_p)
            out[p.name] = [[(x * unit_mm, y * unit_mm) for x, y in r] for r in rings]
        else:  # pragma: no cover - a programming error in a family definition
            raise AssertionError(f"unknown parameter kind {p.kind!r}")
    return out


# ------------------------------------------------------------------------------------------
# Polygon checks


def _clean_ring(points: Sequence[tuple[float, float]]) -> list[tuple[float, float]]:
    """Drop consecutive points closer than :data:`TOL_MM` (and a repeated closing point)."""
    out: list[tuple[float, float]] = []
    for x, y in points:
        if out and abs(x - out[-1][0]) <= TOL_MM and abs(y - out[-1][1]) <= TOL_MM:
            continue
        out.append((float(x), float(y)))
    while (
        len(out) > 1
        and abs(out[0][0] - out[-1][0]) <= TOL_MM
        and abs(out[0][1] - out[-1][1]) <= TOL_MM
    ):
        out.pop()
    return out


def validate_polygon(poly: Any, *, file: str = "", field: str = "") -> shapely.Polygon:
    """Check a section polygon and return it with the exterior counter-clockwise.

    Repeated consecutive points are removed. The polygon must be a single shapely Polygon,
    non-empty, with closed rings of at least three distinct points, valid in the OGC sense (the
    message then includes :func:`shapely.validation.explain_validity`), of positive area, and
    with every hole inside the outline.

    Args:
        poly: the polygon to check.
        file: file name, for error messages.
        field: dotted TOML path, for error messages.

    Returns:
        ``shapely.geometry.polygon.orient(poly, 1.0)``: exterior counter-clockwise, holes clockwise.

    Raises:
        InputError: any of the conditions above fails.
    """
    if not isinstance(poly, shapely.Polygon):
        raise InputError(
            "a single closed outline (one polygon)", file=file, field=field, got=type(poly).__name__
        )
    if poly.is_empty:
        raise InputError("a non-empty outline", file=file, field=field, got="an empty polygon")
    shell = _clean_ring(poly.exterior.coords)
    holes = [_clean_ring(r.coords) for r in poly.interiors]
    if len(shell) < 3:
        raise InputError(
            "an outline of at least 3 distinct points", file=file, field=field, got=f"{len(shell)}"
        )
    for i, h in enumerate(holes):
        if len(h) < 3:
            raise InputError(
                "holes of at least 3 distinct points",
                file=file,
                field=field,
                got=f"hole {i} with {len(h)} distinct points",
            )
    clean = shapely.Polygon(shell, holes)
    if not (clean.exterior.is_closed and all(r.is_closed for r in clean.interiors)):
        raise InputError(
            "closed rings", file=file, field=field, got="an open ring"
        )  # pragma: no cover
    outline = shapely.Polygon(shell)
    if outline.is_valid:
        for i, h in enumerate(holes):
            ring = shapely.Polygon(h)
            if not ring.is_valid or not outline.contains(ring):
                raise InputError(
                    "every hole strictly inside the outline",
                    file=file,
                    field=field,
                    got=f"hole {i} lies (partly) outside the outline or touches it",
                )
    if not clean.is_valid:
        reason = shapely.validation.explain_validity(clean)
        raise InputError(
            "a valid polygon (no self-intersection, no overlapping holes)",
            file=file,
            field=field,
            got=f"an invalid polygon: {reason}",
        )
    if not clean.area > 0.0:
        raise InputError("an outline of positive area", file=file, field=field, got="zero area")
    return orient(clean, 1.0)


def _error(key: str, expected: str, got: str) -> InputError:
    """An InputError with the field relative to the dimensions table (relocated by the caller)."""
    return InputError(expected, field=key, got=got)


def _mm(v: float) -> str:
    return f"{v:.6g} mm"


def _mirror_right_half(right: Sequence[tuple[float, float]]) -> list[tuple[float, float]]:
    """Close a shape symmetric about x = 0 from its right half, listed bottom to top."""
    left = [(-x, y) for x, y in reversed(right)]
    return _clean_ring([*right, *left])


# ------------------------------------------------------------------------------------------
# Builders


def _taper_steps(
    pairs: Sequence[tuple[float, float]],
    x_start: float,
    y_start: float,
    x_web: float,
    dy_sign: float,
    key: str,
    flange_key: str,
) -> list[tuple[float, float]]:
    """Points stepping from a flange edge inward to the web face (x_web), then onto the web."""
    pts = []
    x, y = x_start, y_start
    for h, v in pairs:
        x -= h
        y += dy_sign * v
        pts.append((x, y))
    if x < x_web - TOL_MM:
        overhang = x_start - x_web
        total = x_start - x
        raise _error(
            key,
            f"taper horizontal legs adding up to at most the flange overhang "
            f"({flange_key} minus web, halved) = {_mm(overhang)}",
            f"{_mm(total)}",
        )
    if pts and abs(x - x_web) <= TOL_MM:
        pts[-1] = (x_web, y)
    else:
        pts.append((x_web, y))  # a horizontal ledge onto the web face
    return pts


def _build_i_girder(d: Mapping[str, Any]) -> shapely.Polygon:
    D = d["depth"]
    btf, ttf = d["bottom_flange_width"], d["top_flange_width"]
    bt, tt = d["bottom_flange_thickness"], d["top_flange_thickness"]
    bw = d["web_width"]
    for key, width in (("top_flange_width", ttf), ("bottom_flange_width", btf)):
        if width < bw - TOL_MM:
            raise _error(key, f"a flange at least as wide as the web ({_mm(bw)})", _mm(width))
    for key, pairs, width in (
        ("top_tapers", d["top_tapers"], ttf),
        ("bottom_tapers", d["bottom_tapers"], btf),
    ):
        if pairs and width - bw <= TOL_MM:
            raise _error(key, "no tapers on a flange as wide as the web", f"{len(pairs)} tapers")
    bottom = _taper_steps(
        d["bottom_tapers"], btf / 2, bt, bw / 2, +1.0, "bottom_tapers", "bottom_flange_width"
    )
    top = _taper_steps(
        d["top_tapers"], ttf / 2, D - tt, bw / 2, -1.0, "top_tapers", "top_flange_width"
    )
    y_web_bottom, y_web_top = bottom[-1][1], top[-1][1]
    if y_web_bottom > y_web_top + TOL_MM:
        stack = D - y_web_top + y_web_bottom
        raise _error(
            "depth",
            f"a depth at least the sum of both flange thicknesses and taper heights ({_mm(stack)})",
            _mm(D),
        )
    right = [
        (btf / 2, 0.0),
        (btf / 2, bt),
        *bottom,
        *reversed(top),
        (ttf / 2, D - tt),
        (ttf / 2, D),
    ]
    return shapely.Polygon(_mirror_right_half(right))


def _build_inverted_tee(d: Mapping[str, Any]) -> shapely.Polygon:
    D, bf, bt, sw = (
        d["depth"],
        d["bottom_flange_width"],
        d["bottom_flange_thickness"],
        d["stem_width"],
    )
    if bf < sw - TOL_MM:
        raise _error(
            "bottom_flange_width", f"a flange at least as wide as the stem ({_mm(sw)})", _mm(bf)
        )
    if d["tapers"] and bf - sw <= TOL_MM:
        raise _error(
            "tapers", "no tapers on a flange as wide as the stem", f"{len(d['tapers'])} tapers"
        )
    steps = _taper_steps(d["tapers"], bf / 2, bt, sw / 2, +1.0, "tapers", "bottom_flange_width")
    if steps[-1][1] >= D - TOL_MM:
        raise _error(
            "depth",
            f"a depth greater than the flange thickness plus taper heights ({_mm(steps[-1][1])})",
            _mm(D),
        )
    right = [(bf / 2, 0.0), (bf / 2, bt), *steps, (sw / 2, D)]
    return shapely.Polygon(_mirror_right_half(right))


def _build_rectangle(d: Mapping[str, Any]) -> shapely.Polygon:
    b, h = d["width"], d["depth"]
    return shapely.Polygon([(-b / 2, 0.0), (b / 2, 0.0), (b / 2, h), (-b / 2, h)])


def _chamfered_rect(
    x0: float, y0: float, x1: float, y1: float, c: float
) -> list[tuple[float, float]]:
    """Counter-clockwise rectangle with 45-degree chamfers of leg ``c`` at its four corners."""
    if c <= 0.0:
        return [(x0, y0), (x1, y0), (x1, y1), (x0, y1)]
    return [
        (x0 + c, y0),
        (x1 - c, y0),
        (x1, y0 + c),
        (x1, y1 - c),
        (x1 - c, y1),
        (x0 + c, y1),
        (x0, y1 - c),
        (x0, y0 + c),
    ]


def _build_box_beam(d: Mapping[str, Any]) -> shapely.Polygon:
    b, D = d["width"], d["depth"]
    tt, tb, ts = d["top_thickness"], d["bottom_thickness"], d["side_thickness"]
    n = d["void_count"]
    ti = d["interior_web_thickness"]
    if n > 1 and ti is None:
        raise _error(
            "interior_web_thickness",
            "the thickness of the web between voids (needed when void_count > 1)",
            "nothing",
        )
    ti = ti or 0.0
    void_h = D - tt - tb
    if void_h <= TOL_MM:
        raise _error(
            "depth",
            f"a depth greater than top_thickness plus bottom_thickness ({_mm(tt + tb)})",
            _mm(D),
        )
    void_w = (b - 2 * ts - (n - 1) * ti) / n
    if void_w <= TOL_MM:
        raise _error(
            "width",
            "a width greater than the two side walls plus interior webs "
            f"({_mm(2 * ts + (n - 1) * ti)})",
            _mm(b),
        )
    c = d["void_chamfer"]
    if 2 * c >= min(void_w, void_h) - TOL_MM:
        raise _error(
            "void_chamfer",
            "a chamfer leg under half the void's width and height "
            f"({_mm(min(void_w, void_h) / 2)})",
            _mm(c),
        )
    holes = []
    for i in range(n):
        x0 = -b / 2 + ts + i * (void_w + ti)
        holes.append(list(reversed(_chamfered_rect(x0, tb, x0 + void_w, tb + void_h, c))))
    shell = [(-b / 2, 0.0), (b / 2, 0.0), (b / 2, D), (-b / 2, D)]
    return shapely.Polygon(shell, holes)


def _circle(xc: float, yc: float, r: float, n: int = CIRCLE_SEGMENTS) -> list[tuple[float, float]]:
    """Inscribed regular n-gon (vertices on the circle), counter-clockwise."""
    return [
        (xc + r * math.cos(2 * math.pi * k / n), yc + r * math.sin(2 * math.pi * k / n))
        for k in range(n)
    ]


def _build_voided_slab(d: Mapping[str, Any]) -> shapely.Polygon:
    b, D = d["width"], d["depth"]
    n, dia = d["void_count"], d["void_diameter"]
    yc = d["void_center_height"]
    yc = D / 2 if yc is None else yc
    s = d["void_spacing"]
    if n > 1 and s is None:
        raise _error(
            "void_spacing",
            "the centre-to-centre spacing of the voids (needed when void_count > 1)",
            "nothing",
        )
    s = s or 0.0
    r = dia / 2
    if yc - r <= TOL_MM:
        raise _error(
            "void_diameter",
            f"voids clear of the soffit: diameter under twice void_center_height ({_mm(2 * yc)})",
            _mm(dia),
        )
    if yc + r >= D - TOL_MM:
        raise _error(
            "void_diameter",
            "voids clear of the top: diameter under 2 x (depth - void_center_height) "
            f"({_mm(2 * (D - yc))})",
            _mm(dia),
        )
    if n > 1 and s <= dia + TOL_MM:
        raise _error(
            "void_spacing", f"a spacing greater than the void diameter ({_mm(dia)})", _mm(s)
        )
    extent = (n - 1) * s + dia
    if extent >= b - TOL_MM:
        raise _error(
            "width",
            "a width greater than the row of voids, (void_count - 1) x spacing + diameter "
            f"({_mm(extent)})",
            _mm(b),
        )
    holes = [list(reversed(_circle((i - (n - 1) / 2) * s, yc, r))) for i in range(n)]
    shell = [(-b / 2, 0.0), (b / 2, 0.0), (b / 2, D), (-b / 2, D)]
    return shapely.Polygon(shell, holes)


def _build_u_beam(d: Mapping[str, Any]) -> shapely.Polygon:
    D, tw, bw = d["depth"], d["top_width"], d["bottom_width"]
    bft, web = d["bottom_flange_thickness"], d["web_width"]
    tfw, tft = d["top_flange_width"], d["top_flange_thickness"]
    has_flange = tfw is not None or tft is not None
    if has_flange and (tfw is None or tft is None):
        missing = "top_flange_thickness" if tft is None else "top_flange_width"
        raise _error(
            missing, "both top_flange_width and top_flange_thickness, or neither", "only one"
        )

    def x_out(y: float) -> float:  # outer web face
        return bw / 2 + (tw / 2 - bw / 2) * y / D

    def x_in(y: float) -> float:  # inner web face, web_width measured horizontally
        return x_out(y) - web

    if bft >= D - TOL_MM:
        raise _error("bottom_flange_thickness", f"less than the depth ({_mm(D)})", _mm(bft))
    if x_in(bft) <= TOL_MM:
        raise _error(
            "web_width",
            f"webs that leave an open tub: at the bottom flange top the inner faces meet "
            f"(web width must be under {_mm(x_out(bft))})",
            _mm(web),
        )
    right = [(bw / 2, 0.0), (tw / 2, D)]
    if has_flange:
        y_f = D - tft
        if y_f <= bft + TOL_MM:
            raise _error(
                "top_flange_thickness",
                f"less than depth minus bottom_flange_thickness ({_mm(D - bft)})",
                _mm(tft),
            )
        x_tip = tw / 2 - tfw
        if x_tip >= x_in(y_f) - TOL_MM:
            raise _error(
                "top_flange_width",
                f"a top flange projecting inside the web: wider than the web at its underside "
                f"({_mm(tw / 2 - x_in(y_f))})",
                _mm(tfw),
            )
        if x_tip <= TOL_MM:
            raise _error(
                "top_flange_width",
                f"top flanges that leave the top open: under half the top width ({_mm(tw / 2)})",
                _mm(tfw),
            )
        right += [(x_tip, D), (x_tip, y_f), (x_in(y_f), y_f)]
    else:
        if x_in(D) <= TOL_MM:
            raise _error("web_width", "webs that leave the top open", _mm(web))
        right += [(x_in(D), D)]
    right += [(x_in(bft), bft)]
    return shapely.Polygon(_mirror_right_half(right))


def _build_polygon(d: Mapping[str, Any]) -> shapely.Polygon:
    outline = _clean_ring(d["outline"])
    holes = [_clean_ring(h) for h in d["holes"]]
    shell = shapely.Polygon(outline)
    if not shell.is_valid:
        raise _error(
            "outline",
            "an outline that does not cross itself",
            f"an invalid outline: {shapely.validation.explain_validity(shell)}",
        )
    for i, h in enumerate(holes):
        ring = shapely.Polygon(h)
        key = f"holes[{i}]"
        if not ring.is_valid:
            raise _error(
                key,
                "a hole that does not cross itself",
                f"an invalid hole: {shapely.validation.explain_validity(ring)}",
            )
        if not shell.contains(ring):
            raise _error(
                key, "a hole strictly inside the outline", "a hole (partly) outside the outline"
            )
        for j in range(i):
            if ring.intersects(shapely.Polygon(holes[j])):
                raise _error(
                    key, f"holes that do not touch or overlap (overlaps holes[{j}])", "an overlap"
                )
    y0 = min(y for _, y in outline)  # move the lowest point onto y = 0
    return shapely.Polygon(
        [(x, y - y0) for x, y in outline], [[(x, y - y0) for x, y in h] for h in holes]
    )


# ------------------------------------------------------------------------------------------
# The families

_I_PARAMS = (
    Param("depth", "length", "overall depth of the girder, soffit to top of the top flange"),
    Param("top_flange_width", "length", "full width of the top flange, at its top face"),
    Param(
        "top_flange_thickness",
        "length",
        "thickness of the top flange at its outer edge (vertical edge, top face down)",
    ),
    Param(
        "top_tapers",
        "length_pairs",
        "[horizontal, vertical] steps of the top flange's underside taper, from the lower edge "
        "of the flange tip inward to the web face (empty list: square flange)",
        (),
    ),
    Param("web_width", "length", "thickness of the web, measured horizontally"),
    Param("bottom_flange_width", "length", "full width of the bottom flange, at the soffit"),
    Param(
        "bottom_flange_thickness",
        "length",
        "thickness of the bottom flange at its outer edge (vertical edge, soffit up)",
    ),
    Param(
        "bottom_tapers",
        "length_pairs",
        "[horizontal, vertical] steps of the bottom flange's top-face taper, from the upper edge "
        "of the flange tip inward to the web face (empty list: square flange)",
        (),
    ),
)

_FAMILY_LIST = (
    Family(
        "i_girder",
        "I-girder with tapered flanges (AASHTO Types I-VI, bulb-tees)",
        _I_PARAMS,
        _build_i_girder,
    ),
    Family(
        "bulb_tee",
        "Bulb-tee girder (alias of i_girder: same dimensions, same builder)",
        _I_PARAMS,
        _build_i_girder,
    ),
    Family(
        "box_beam",
        "Adjacent box beam with rectangular voids",
        (
            Param("width", "length", "overall width of the box, outside face to outside face"),
            Param("depth", "length", "overall depth of the box, soffit to top face"),
            Param("top_thickness", "length", "thickness of the top slab, top face to top of void"),
            Param(
                "bottom_thickness",
                "length",
                "thickness of the bottom slab, soffit to bottom of void",
            ),
            Param(
                "side_thickness", "length", "thickness of each exterior web, outside face to void"
            ),
            Param("void_count", "count", "number of rectangular voids side by side", 1),
            Param(
                "interior_web_thickness",
                "length",
                "thickness of each interior web between two voids (required when void_count > 1)",
                None,
            ),
            Param(
                "void_chamfer",
                "length",
                "leg of the 45-degree chamfer at each corner of each void (0: square corners)",
                0.0,
            ),
        ),
        _build_box_beam,
    ),
    Family(
        "voided_slab",
        "Voided slab with circular voids",
        (
            Param("width", "length", "overall width of the slab"),
            Param("depth", "length", "overall depth of the slab, soffit to top face"),
            Param("void_count", "count", "number of circular voids in the row"),
            Param("void_diameter", "length", "diameter of each circular void"),
            Param(
                "void_spacing",
                "length",
                "centre-to-centre spacing of the voids (required when void_count > 1); the row "
                "is centred on the slab",
                None,
            ),
            Param(
                "void_center_height",
                "length",
                "height of the void centres above the soffit (default: mid-depth)",
                None,
            ),
        ),
        _build_voided_slab,
    ),
    Family(
        "u_beam",
        "U-beam (open-top tub) with sloped or vertical webs",
        (
            Param("depth", "length", "overall depth, soffit to top of the top flanges"),
            Param("top_width", "length", "overall width at the top, outside edge to outside edge"),
            Param(
                "bottom_width",
                "length",
                "overall width of the soffit, outside face to outside face",
            ),
            Param(
                "bottom_flange_thickness",
                "length",
                "thickness of the bottom flange, soffit to its top face inside the tub",
            ),
            Param(
                "web_width",
                "length",
                "thickness of each web, measured horizontally (inner face parallel to outer)",
            ),
            Param(
                "top_flange_width",
                "length",
                "width of each top flange, from the outer top edge inward to the flange tip "
                "(omit with top_flange_thickness for webs without top flanges)",
                None,
            ),
            Param(
                "top_flange_thickness",
                "length",
                "thickness of each top flange at its tip, top face down",
                None,
            ),
        ),
        _build_u_beam,
    ),
    Family(
        "inverted_tee",
        "Inverted-tee beam",
        (
            Param("depth", "length", "overall depth, soffit to top of the stem"),
            Param(
                "bottom_flange_width", "length", "full width of the bottom flange, at the soffit"
            ),
            Param(
                "bottom_flange_thickness",
                "length",
                "thickness of the bottom flange at its outer edge (vertical edge, soffit up)",
            ),
            Param("stem_width", "length", "thickness of the stem, measured horizontally"),
            Param(
                "tapers",
                "length_pairs",
                "[horizontal, vertical] steps from the upper edge of the flange tip inward to the "
                "stem face (empty list: square flange)",
                (),
            ),
        ),
        _build_inverted_tee,
    ),
    Family(
        "rectangle",
        "Solid rectangle",
        (
            Param("width", "length", "overall width"),
            Param("depth", "length", "overall depth"),
        ),
        _build_rectangle,
    ),
    Family(
        "polygon",
        "Free polygon with holes",
        (
            Param("unit", "unit", 'length unit of the coordinates, e.g. "in" or "mm"'),
            Param(
                "outline",
                "points",
                "outline as [[x, y], ...] in 'unit', any orientation; the shape is moved "
                "vertically so its lowest point is at y = 0, x is kept",
            ),
            Param("holes", "rings", "voids, each a list of [x, y] points in 'unit'", ()),
        ),
        _build_polygon,
    ),
)

#: The families by name.
FAMILIES: dict[str, Family] = {f.name: f for f in _FAMILY_LIST}


def build_polygon(
    family_name: str, raw_dims: Mapping[str, Any], *, file: str = "", field: str = ""
) -> shapely.Polygon:
    """Build and check the polygon of a section from its family name and raw TOML dimensions.

    Args:
        family_name: a key of :data:`FAMILIES`.
        raw_dims: the dimensions table as read from TOML (lengths as strings with units).
        file: the file they came from, for error messages.
        field: dotted TOML path of the dimensions table, e.g. ``section[2].dimensions``.

    Returns:
        The section polygon in mm, y = 0 at the bottom, exterior counter-clockwise.

    Raises:
        InputError: unknown family, bad or inconsistent dimensions, invalid polygon.
    """
    family = FAMILIES.get(family_name) if isinstance(family_name, str) else None
    if family is None:
        names = list(FAMILIES)
        close = difflib.get_close_matches(str(family_name), names, n=1, cutoff=0.5)
        hint = f"; did you mean '{close[0]}'?" if close else ""
        fam_field = (
            field[: -len(".dimensions")] + ".family" if field.endswith(".dimensions") else field
        )
        raise InputError(
            f"a section family, one of {', '.join(names)}{hint}",
            file=file,
            field=fam_field,
            got=_describe(family_name),
        )
    dims = parse_dimensions(family, raw_dims, file=file, field=field)
    try:
        poly = family.build(dims)
    except InputError as exc:
        raise exc.located(file=file, prefix=field) from None
    return validate_polygon(poly, file=file, field=field)
