"""Pretensioned strand layouts: straight, harped and debonded strands along the girder.

A layout is a set of :class:`StrandSet` objects, each a group of strands sharing one path
and one bond length: a straight row, the harped part of a row, or the strands of a row that
are debonded over a given length at each end. Engine level: mm, mm^2; positions x along
the girder from its left end; heights y above the girder bottom.

- Harped (draped) strands run straight from their end height to their height between the
  hold-down points; their height varies linearly in between (the usual layout). At the girder
  ends they stand in one vertical column on the girder axis (``END_COLUMN_X``), so a strand
  harped from x ≠ 0 also moves across the section, linearly, between hold-down and end: in
  every cross-section it lies on the straight segment from its hold-down position to its end
  position (:meth:`StrandSet.section_paths`), which must stay inside the concrete
  (:func:`harp_path_error`).
- The force of each strand builds up linearly over the transfer length from the end of its
  debonded length (AASHTO LRFD 9th Ed. (2020) 5.9.4.3.1; 5.9.4.3.3 for debonded strands).
"""

from __future__ import annotations

from dataclasses import dataclass, field
from typing import TYPE_CHECKING, Any

import numpy as np
from numpy.typing import ArrayLike, NDArray

from prestress.errors import InputError
from prestress.units import show_dimension

if TYPE_CHECKING:
    from collections.abc import Sequence

#: Where harped strands stand across the section at the girder ends (mm from the axis): one
#: vertical column on the girder axis (common practice for I-girder and bulb-tee webs; the
#: column built by :func:`prestress.jobfile.build_layout`).
END_COLUMN_X = 0.0

#: Round-off allowed on the cover of a harped strand's path (mm).
PATH_TOL_MM = 1e-6

#: A path in the cross-section: ((x, y) at the hold-down, (x, y) at the girder end), mm.
SectionPath = tuple[tuple[float, float], tuple[float, float]]


@dataclass(frozen=True)
class StrandSet:
    """Strands sharing a path and a bond length.

    Attributes:
        label: what a reviewer calls the group, e.g. "row 1, debonded 6 ft".
        row: index of the job's strand row it belongs to.
        x: horizontal positions of the strands across the section (mm, centred on the axis);
            for harped strands, between the hold-downs (at the ends they stand in the end
            column, x = ``END_COLUMN_X``).
        area: area of one strand (mm^2).
        y_mid: height between the hold-down points, or everywhere for straight strands (mm).
        y_end: height at the girder ends for harped strands (mm), else None.
        hold_downs: positions of the two hold-down points from the left end (mm), else None.
        debond_left: debonded (shielded) length from the left end (mm).
        debond_right: debonded length from the right end (mm).
    """

    label: str
    row: int
    x: tuple[float, ...]
    area: float
    y_mid: float
    y_end: float | None = None
    hold_downs: tuple[float, float] | None = None
    debond_left: float = 0.0
    debond_right: float = 0.0

    @property
    def count(self) -> int:
        """Number of strands."""
        return len(self.x)

    @property
    def total_area(self) -> float:
        """Area of all strands of the set (mm^2)."""
        return self.count * self.area

    @property
    def harped(self) -> bool:
        """Whether the set is harped."""
        return self.y_end is not None

    @property
    def debonded(self) -> bool:
        """Whether the set is debonded at either end."""
        return self.debond_left > 0 or self.debond_right > 0

    def height(self, x: ArrayLike, length: float) -> NDArray[np.float64]:
        """Height of the set's strands at positions x (mm), for a girder of the given length."""
        xs = np.asarray(x, dtype=float)
        if self.y_end is None or self.hold_downs is None:
            return np.full_like(xs, self.y_mid)
        h1, h2 = self.hold_downs
        y = np.full_like(xs, self.y_mid)
        left = xs < h1
        right = xs > h2
        y[left] = self.y_end + (self.y_mid - self.y_end) * np.clip(xs[left], 0, None) / h1
        y[right] = self.y_end + (self.y_mid - self.y_end) * np.clip(length - xs[right], 0, None) / (
            length - h2
        )
        return y

    def lateral(self, xi: float, x: ArrayLike, length: float) -> NDArray[np.float64]:
        """Horizontal position (mm) of the set's strand at xi at positions x along the girder.

        xi: the strand's position across the section between the hold-downs (mm); x: positions
        from the left end of a girder of the given length (mm). Straight and debonded strands
        keep xi; a harped strand moves linearly from xi at the hold-down to the end column
        (``END_COLUMN_X``) at the girder end, as its height does.
        """
        xs = np.asarray(x, dtype=float)
        if self.y_end is None or self.hold_downs is None:
            return np.full_like(xs, xi)
        h1, h2 = self.hold_downs
        share = np.zeros_like(xs)  # 0 between the hold-downs, 1 at the girder ends
        left = xs < h1
        right = xs > h2
        share[left] = 1.0 - np.clip(xs[left], 0, None) / h1
        share[right] = 1.0 - np.clip(length - xs[right], 0, None) / (length - h2)
        return xi + (END_COLUMN_X - xi) * share

    def section_paths(self) -> tuple[SectionPath, ...]:
        """The path of each harped strand in the cross-section (mm), hold-down to girder end.

        ((x, y_mid), (END_COLUMN_X, y_end)) per strand: the strand runs straight between its
        hold-down and the girder end, so every cross-section in between cuts it on that
        segment (:meth:`height` and :meth:`lateral`). Empty for a set that is not harped.
        """
        if self.y_end is None:
            return ()
        return tuple(((float(x), self.y_mid), (END_COLUMN_X, self.y_end)) for x in self.x)

    def developed(self, x: ArrayLike, length: float, transfer_length: float) -> NDArray[np.float64]:
        """Share of the full force developed at x (0 to 1).

        Linear over the transfer length from the end of the debonded length at each end
        (AASHTO LRFD 9th Ed. (2020) 5.9.4.3.1 and 5.9.4.3.3).
        """
        xs = np.asarray(x, dtype=float)
        a = (xs - self.debond_left) / transfer_length
        b = (length - self.debond_right - xs) / transfer_length
        return np.clip(np.minimum(a, b), 0.0, 1.0)


@dataclass(frozen=True)
class Layout:
    """A pretensioned layout on a girder of a given length (mm)."""

    sets: tuple[StrandSet, ...]
    length: float
    transfer_length: float
    rules: dict[str, float] = field(default_factory=dict)

    @property
    def total_area(self) -> float:
        """Total area of prestressing steel (mm^2)."""
        return sum(s.total_area for s in self.sets)

    @property
    def count(self) -> int:
        """Total number of strands."""
        return sum(s.count for s in self.sets)

    def effective_area(self, x: ArrayLike) -> NDArray[np.float64]:
        """Developed steel area at x (mm^2): Σ area × developed share."""
        xs = np.asarray(x, dtype=float)
        out = np.zeros_like(xs)
        for s in self.sets:
            out += s.total_area * s.developed(xs, self.length, self.transfer_length)
        return out

    def cgs(self, x: ArrayLike) -> NDArray[np.float64]:
        """Height of the centroid of the developed prestress force at x (mm).

        Where nothing is developed (the very ends), the centroid of all strands is returned.
        """
        xs = np.asarray(x, dtype=float)
        num = np.zeros_like(xs)
        den = np.zeros_like(xs)
        num_all = np.zeros_like(xs)
        for s in self.sets:
            y = s.height(xs, self.length)
            w = s.total_area * s.developed(xs, self.length, self.transfer_length)
            num += w * y
            den += w
            num_all += s.total_area * y
        with np.errstate(invalid="ignore", divide="ignore"):
            return np.where(den > 0, num / np.where(den > 0, den, 1.0), num_all / self.total_area)

    def cgs_all(self, x: ArrayLike) -> NDArray[np.float64]:
        """Height of the centroid of all strands at x, bonded or not (mm)."""
        xs = np.asarray(x, dtype=float)
        num = np.zeros_like(xs)
        for s in self.sets:
            num += s.total_area * s.height(xs, self.length)
        return num / self.total_area

    def key_positions(self) -> list[tuple[str, float]]:
        """Named positions along the girder (mm from the left end), sorted.

        Hold-down points, the ends of debonding and the ends of their transfer lengths, each
        named with its side ("left hold-down", "right debond end 1 + lt"), so that every
        station of an unsymmetric layout can be asked for by name.
        """
        out: list[tuple[str, float]] = []
        lt, L = self.transfer_length, self.length
        lengths = sorted(
            {round(d, 3) for s in self.sets for d in (s.debond_left, s.debond_right) if d > 0}
        )
        for s in self.sets:
            if s.hold_downs is not None:
                out += [("left hold-down", s.hold_downs[0]), ("right hold-down", s.hold_downs[1])]
            for d, side in ((s.debond_left, "left"), (s.debond_right, "right")):
                if d > 0:
                    k = lengths.index(round(d, 3)) + 1
                    x0 = d if side == "left" else L - d
                    x1 = d + lt if side == "left" else L - d - lt
                    out += [(f"{side} debond end {k}", x0), (f"{side} debond end {k} + lt", x1)]
        return sorted(set(out), key=lambda p: (p[1], p[0]))

    def all_strand_positions(self, x: float) -> list[tuple[float, float]]:
        """(x across, y) of every strand at a position along the girder (mm).

        Harped strands between a hold-down and the end lie on their path to the end column
        (:meth:`StrandSet.lateral`); elsewhere every strand is at its row position.
        """
        pts = []
        at = np.array([x], dtype=float)
        for s in self.sets:
            y = float(s.height(at, self.length)[0])
            pts += [(float(s.lateral(xi, at, self.length)[0]), y) for xi in s.x]
        return pts


# ------------------------------------------------------------------------------------------
# Detailing rules for debonded strands (reported as warnings)

#: Default limits of AASHTO LRFD 9th Ed. (2020) 5.9.4.3.3 (the job may change them under
#: [strands.detailing]). The 45 % per row and the debonded-length limit are those of the 9th
#: Edition as summarised by O. Bayrak, "Upcoming changes to the AASHTO LRFD Bridge Design
#: Specifications", ASPIRE, 2019; the other values are from memory.
DEBOND_RULES = {
    "max_share_total": 0.25,
    "max_share_row": 0.45,
    "max_terminations_share": 0.40,
    "max_terminations_count": 4,
}

RULE_CLAUSE = "AASHTO LRFD 9th Ed. (2020) 5.9.4.3.3"


def debonding_warnings(
    layout: Layout,
    rows: list[tuple[float, ...]],
    *,
    web_half_width: float | None = None,
    max_debonded_length: float | None = None,
) -> list[str]:
    """Warnings a reviewer would raise about the debonding, each naming its clause.

    Args:
        layout: the layout.
        rows: the strand x positions of each job row (to find the outer positions).
        web_half_width: half the web width of a single-web section (I-girder, bulb-tee,
            inverted tee), mm; with more than ``max_share_total`` of the strands debonded,
            every strand within the web's horizontal limits should be bonded. None for other
            sections (the share itself is then reported).
        max_debonded_length: the longest debonded length allowed from a girder end of a
            simple span, min(0.2 span, span/2 − ld), mm; None skips the check.
    """
    rules = {**DEBOND_RULES, **layout.rules}
    total = layout.count
    deb = [s for s in layout.sets if s.debonded]
    n_deb = sum(s.count for s in deb)
    out = []
    if total and n_deb / total > rules["max_share_total"] + 1e-12:
        share = (
            f"{n_deb} of {total} strands debonded ({100 * n_deb / total:.0f} %), more than "
            f"{100 * rules['max_share_total']:.0f} % of the total"
        )
        if web_half_width is None:
            out.append(f"{share} ({RULE_CLAUSE}, from memory)")
        else:
            in_web = sum(1 for s in deb for x in s.x if abs(x) <= web_half_width + 1e-6)
            if in_web:
                out.append(
                    f"{share}: every strand within the horizontal limits of the web should "
                    f"then be bonded, and {in_web} debonded strand(s) lie there "
                    f"({RULE_CLAUSE}, from memory)"
                )
    for i, xs in enumerate(rows):
        in_row = sum(s.count for s in deb if s.row == i)
        if xs and in_row / len(xs) > rules["max_share_row"] + 1e-12:
            out.append(
                f"row {i + 1}: {in_row} of {len(xs)} strands debonded, more than "
                f"{100 * rules['max_share_row']:.0f} % of the row unless the owner approves "
                f"({RULE_CLAUSE})"
            )
        outer = {min(xs), max(xs)} if xs else set()
        if any(x in outer for s in deb if s.row == i for x in s.x):
            out.append(
                f"row {i + 1}: a debonded strand in an outer position of the row; the "
                f"exterior strands of each row should be fully bonded ({RULE_CLAUSE}, "
                "from memory)"
            )
    for s in deb:
        xs = sorted(s.x)
        if any(abs(a + b) > 1e-6 for a, b in zip(xs, reversed(xs), strict=True)):
            out.append(
                f"{s.label}: debonded strands are not placed symmetrically about the "
                f"vertical axis ({RULE_CLAUSE}, from memory)"
            )
        longest = max(s.debond_left, s.debond_right)
        if max_debonded_length is not None and longest > max_debonded_length + 1e-6:
            out.append(
                f"{s.label}: debonded for {longest / 304.8:.2f} ft from the end, more than "
                f"{max_debonded_length / 304.8:.2f} ft, the lesser of 0.2 × span and span/2 − "
                f"ld ({RULE_CLAUSE})"
            )
    limit = max(rules["max_terminations_count"], rules["max_terminations_share"] * n_deb)
    for side in ("left", "right"):
        ends: dict[float, int] = {}
        for s in deb:
            d = round(s.debond_left if side == "left" else s.debond_right, 3)
            ends[d] = ends.get(d, 0) + s.count
        for length, n in sorted(ends.items()):
            if length > 0 and n > limit + 1e-12:
                out.append(
                    f"{n} debonded strands terminate at {length / 304.8:.2f} ft from the "
                    f"{side} end, more than max({rules['max_terminations_count']:g}, "
                    f"{100 * rules['max_terminations_share']:.0f} % of the debonded strands) "
                    f"({RULE_CLAUSE}, from memory)"
                )
    return out


# ------------------------------------------------------------------------------------------
# Harped strands: their path in the cross-section must stay inside the concrete

#: The cover rule of a harped strand's path in words (the one every strand position is
#: checked with), for messages.
PATH_RULE = "inside the concrete with a strand radius of cover"


def paths_inside(polygon: Any, geoms: Sequence[Any], radius: float) -> NDArray[np.bool_]:
    """Whether each shapely geometry lies wholly inside the section with ``radius`` of cover.

    The geometries are paths, or the triangles of :func:`paths_to_column_inside`. Exact, for
    the whole geometry rather than sample points: it is covered by the polygon and no nearer
    than ``radius`` to any edge (outline or void), i.e. it lies within the polygon eroded by
    ``radius``, the test every strand position is checked with
    (:func:`prestress.analysis._check_strands_inside`). Vectorised over the geometries.

    Args:
        polygon: the girder's shapely polygon (mm; y = 0 at the bottom, symmetric about x = 0).
        geoms: shapely geometries in the section's plane (mm).
        radius: the strand radius (mm).
    """
    import shapely

    arr = np.asarray(list(geoms), dtype=object)
    if not len(arr):
        return np.zeros(0, dtype=bool)
    covered = shapely.covers(polygon, arr)
    clear = shapely.distance(polygon.boundary, arr) >= radius - PATH_TOL_MM
    return np.asarray(covered & clear, dtype=bool)


def path_inside(
    polygon: Any, start: tuple[float, float], end: tuple[float, float], radius: float
) -> bool:
    """Whether the straight path from start to end stays inside the concrete (whole length).

    start, end: (x, y) in the section (mm); radius: the cover asked (mm), see
    :func:`paths_inside`.
    """
    from shapely.geometry import LineString, Point

    geom = Point(start) if start == end else LineString([start, end])
    return bool(paths_inside(polygon, [geom], radius)[0])


def paths_to_column_inside(
    polygon: Any,
    points: Sequence[tuple[float, float]],
    column: tuple[float, float],
    radius: float,
) -> NDArray[np.bool_]:
    """Whether a strand harped from each point keeps its path inside, wherever it ends.

    points: hold-down positions (x, y) in the section (mm). The end column runs on the axis
    (``END_COLUMN_X``) from ``column[0]`` to ``column[1]`` (lowest and highest end heights,
    mm); the paths from a point to every place in it fill the triangle of the point and the
    column's ends, so the test is that this triangle lies inside the section with ``radius``
    of cover (:func:`paths_inside`). Used by the design search to decide once per grid which
    positions may be harped.
    """
    import shapely

    lo, hi = sorted(column)
    pts = [((float(x), float(y)), (END_COLUMN_X, lo), (END_COLUMN_X, hi)) for x, y in points]
    if not pts:
        return np.zeros(0, dtype=bool)
    hulls = shapely.convex_hull(shapely.multipoints(np.array(pts, dtype=float)))
    return paths_inside(polygon, hulls, radius)


def _first_exit(
    polygon: Any, start: tuple[float, float], end: tuple[float, float], radius: float
) -> tuple[float, float] | None:
    """Roughly where a path first leaves the concrete (for the message only; mm)."""
    import shapely

    t = np.linspace(0.0, 1.0, 401)
    xs = start[0] + (end[0] - start[0]) * t
    ys = start[1] + (end[1] - start[1]) * t
    pts = shapely.points(xs, ys)
    ok = shapely.covers(polygon, pts) & (
        shapely.distance(polygon.boundary, pts) >= radius - PATH_TOL_MM
    )
    bad = np.flatnonzero(~ok)
    return (float(xs[bad[0]]), float(ys[bad[0]])) if len(bad) else None


def harp_path_error(
    layout: Layout, polygon: Any, radius: float, *, file: str = "", system: str = "US"
) -> InputError | None:
    """The error for the first job row with a harped strand whose path leaves the concrete.

    A harped strand runs straight from its position between the hold-downs to its place in
    the end column (:meth:`StrandSet.section_paths`); the whole of that path must lie inside
    the concrete with a strand radius of cover, the rule every strand position is checked
    with (AASHTO LRFD 9th Ed. (2020) 5.10.1, concrete cover, from memory; common practice:
    harped strands are deflected within the web). None when every path stays inside.

    Args:
        layout: the job's layout (one set per harped strand, as the job reader builds it).
        polygon: the girder's shapely polygon (mm).
        radius: the strand radius (mm).
        file: the job file, for the message.
        system: "US" or "SI", the units of the message.

    Returns:
        An InputError naming ``strands.rows[i].harp``, or None.
    """
    from shapely.geometry import LineString, Point

    by_row: dict[int, list[SectionPath]] = {}
    for s in layout.sets:
        by_row.setdefault(s.row, []).extend(s.section_paths())
    for row in sorted(by_row):
        paths = by_row[row]
        if not paths:
            continue
        geoms = [Point(a) if a == b else LineString([a, b]) for a, b in paths]
        ok = paths_inside(polygon, geoms, radius)
        if ok.all():
            continue
        n_ok = int(ok.sum())
        if n_ok:
            reach = max(abs(a[0]) for (a, _b), good in zip(paths, ok, strict=True) if good)
            allowed = (
                f"at most {n_ok} of this row's {len(paths)} positions "
                f"(|x| ≤ {show_dimension(reach, system)})"
            )
        else:
            allowed = f"none of this row's {len(paths)} positions"
        bad = np.flatnonzero(~ok)
        (a, b) = paths[int(bad[0])]
        exit_at = _first_exit(polygon, a, b, radius)
        near = f", leaving it near y = {show_dimension(exit_at[1], system)}" if exit_at else ""
        return InputError(
            f"harped strands within the web: {allowed} keep their straight path from the "
            f"hold-down to the end column on the girder axis {PATH_RULE}",
            file=file,
            field=f"strands.rows[{row}].harp",
            got=f"{len(bad)} harped strand(s) whose path leaves the concrete, the first from "
            f"x = {show_dimension(a[0], system)}, y = {show_dimension(a[1], system)} to x = "
            f"{show_dimension(b[0], system)}, y = {show_dimension(b[1], system)}{near}",
        )
    return None


def check_harp_paths(
    layout: Layout, polygon: Any, radius: float, *, file: str = "", system: str = "US"
) -> None:
    """Raise the InputError of :func:`harp_path_error` when a harped path leaves the concrete."""
    err = harp_path_error(layout, polygon, radius, file=file, system=system)
    if err is not None:
        raise err
