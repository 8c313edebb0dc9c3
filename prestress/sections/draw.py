"""Scale drawing of a girder cross-section (SVG or PNG), with its principal dimensions.

A heavy path: matplotlib is imported inside :func:`draw_section` only, and drawn with the Agg
canvas (no pyplot, no global backend switch). The drawing is plain and printable: the concrete
in light grey with a black outline, voids white, the deck and haunch lighter above it, the
centroid marked with the usual circle-and-cross symbol on a dash-dot axis, strands as black dots,
dimension lines thin with arrowheads and their value in the chosen units.
"""

from __future__ import annotations

import math
import os
from collections.abc import Sequence
from dataclasses import dataclass
from pathlib import Path
from typing import Any

import shapely
from shapely.geometry.polygon import orient

from prestress.atomic import save_figure_atomic
from prestress.units import INCH_MM

#: Display of lengths: (unit label, size of the unit in mm).
_UNITS = {"US": ("in", INCH_MM), "SI": ("mm", 1.0)}

_CONCRETE = "#d4d4d4"
_DECK = "#ececec"
_INK = "#000000"
_DIM_INK = "#333333"
_FONT_PT = 8.5


@dataclass(frozen=True)
class DimensionLine:
    """A labelled dimension line, in mm in the section's coordinates.

    Attributes:
        start: first measured point (on the shape), (x, y) in mm.
        end: second measured point, (x, y) in mm.
        at: where the dimension line is drawn: its y for a horizontal dimension, its x for a
            vertical one. Thin extension lines join each measured point to it.
        vertical: True to measure the vertical distance, False the horizontal one.
        label: text to show; None shows the measured length in the drawing's units.
    """

    start: tuple[float, float]
    end: tuple[float, float]
    at: float
    vertical: bool = False
    label: str | None = None

    @property
    def length_mm(self) -> float:
        """The measured distance in mm."""
        i = 1 if self.vertical else 0
        return abs(self.end[i] - self.start[i])


def format_length(mm: float, units: str) -> str:
    """Format a length for a drawing: inches to 0.01 in ("US") or whole mm ("SI")."""
    label, size = _UNITS[units]
    value = mm / size
    text = f"{value:.2f}".rstrip("0").rstrip(".") if units == "US" else f"{value:.0f}"
    return f"{text} {label}"


def _slice(poly: shapely.Polygon, y: float) -> list[tuple[float, float]]:
    """Solid segments (x0, x1) of a horizontal cut through the polygon at height y."""
    x0, _, x1, _ = poly.bounds
    pad = 1.0 + (x1 - x0)
    cut = poly.intersection(shapely.LineString([(x0 - pad, y), (x1 + pad, y)]))
    segments = []
    for g in getattr(cut, "geoms", [cut]):
        if isinstance(g, shapely.LineString) and not g.is_empty:
            xs = [c[0] for c in g.coords]
            segments.append((min(xs), max(xs)))
    return sorted(segments)


def principal_dimensions(
    poly: shapely.Polygon,
    *,
    deck: tuple[float, float, float] | None = None,
    avoid_y: float | None = None,
) -> list[DimensionLine]:
    """Dimension lines for the overall depth, top and bottom widths, web width and deck width.

    The web width is the narrowest right-hand solid segment of horizontal cuts through the
    middle 80 % of the depth (the web of an I-girder, the side wall of a box or tub), shown only
    when it is clearly narrower than both flanges.

    Args:
        poly: the section polygon, mm.
        deck: (width, thickness, haunch) in mm, or None.
        avoid_y: a height (mm) to keep the web dimension away from, e.g. the centroid's, where
            the drawing puts its own label.

    Returns:
        The dimension lines, placed outside the shape.
    """
    xmin, ymin, xmax, ymax = poly.bounds
    depth = ymax - ymin
    size = max(xmax - xmin, depth, deck[0] if deck else 0.0)
    gap = 0.07 * size
    eps = 1e-6 * depth
    bottom = _slice(poly, ymin + eps)
    top = _slice(poly, ymax - eps)
    dims = []
    # overall depth, on the left
    dims.append(
        DimensionLine((bottom[0][0], ymin), (top[0][0], ymax), at=xmin - gap, vertical=True)
    )
    # bottom width, below
    dims.append(DimensionLine((bottom[0][0], ymin), (bottom[-1][1], ymin), at=ymin - gap))
    # top width (and deck width), above everything
    y_top = ymax + (deck[2] + deck[1] if deck else 0.0)
    dims.append(DimensionLine((top[0][0], ymax), (top[-1][1], ymax), at=y_top + gap))
    if deck:
        w = deck[0]
        dims.append(DimensionLine((-w / 2, y_top), (w / 2, y_top), at=y_top + 2 * gap))
    # web width across the web, at the middle of the run of narrowest cuts
    n = 41
    heights = [ymin + depth * (0.1 + 0.8 * k / (n - 1)) for k in range(n)]
    widths = []
    for y in heights:
        segs = _slice(poly, y)
        widths.append((segs[-1][1] - segs[-1][0]) if segs else math.inf)
    w_min = min(widths)
    flange = min(bottom[-1][1] - bottom[0][0], top[-1][1] - top[0][0])
    if w_min < 0.95 * flange:
        runs = [k for k, w in enumerate(widths) if w <= w_min * (1 + 1e-9) + 1e-9]
        middle = heights[runs[len(runs) // 2]]
        candidates = [heights[k] for k in runs]
        if avoid_y is not None:  # keep clear of the centroid label (no room: no web dimension)
            candidates = [y for y in candidates if abs(y - avoid_y) >= 0.12 * depth]
        if candidates:
            y_web = min(candidates, key=lambda y: abs(y - middle))
            x0, x1 = _slice(poly, y_web)[-1]
            dims.append(DimensionLine((x0, y_web), (x1, y_web), at=y_web))
    return dims


def _as_dimension(item: Any) -> DimensionLine:
    if isinstance(item, DimensionLine):
        return item
    if isinstance(item, Sequence) and 3 <= len(item) <= 5:
        return DimensionLine(*item)
    raise TypeError(f"expected a DimensionLine, got {type(item).__name__}")


def draw_section(
    poly: shapely.Polygon,
    *,
    out_path: str | os.PathLike[str],
    title: str,
    dims: Sequence[DimensionLine] | None = None,
    centroid_y_mm: float | None = None,
    strands_mm: Sequence[tuple[float, float]] | None = None,
    deck: tuple[float, float, float] | None = None,
    units: str = "US",
    ducts_mm: Sequence[tuple[float, float, float, int]] | None = None,
) -> None:
    """Draw a cross-section to scale and write it as SVG or PNG (by the file suffix).

    The file is written to a temporary file in the same folder, then moved into place
    atomically with :func:`os.replace`.

    Args:
        poly: the girder polygon in mm (y = 0 at the bottom), e.g. from ``build_polygon``.
        out_path: the ``.svg`` or ``.png`` file to write.
        title: title printed above the drawing.
        dims: dimension lines to draw; None draws :func:`principal_dimensions` (depth, flange
            widths, web width, deck width); an empty list draws none. Tuples
            ``(start, end, at[, vertical[, label]])`` are accepted too.
        centroid_y_mm: height of the centroid above the girder bottom, mm (None: not marked).
        strands_mm: strand positions (x, y) in mm, or None.
        deck: (width, thickness, haunch) of the deck slab in mm, drawn centred above the girder,
            or None.
        units: "US" (inches) or "SI" (mm) for the dimension values.
        ducts_mm: post-tensioning ducts (x, y, outside diameter, strand count) in mm, drawn
            as circles to scale with their strand count beside them, or None.

    Raises:
        ValueError: unknown units or file suffix, or an empty polygon.
    """
    from matplotlib.backends.backend_agg import FigureCanvasAgg
    from matplotlib.figure import Figure
    from matplotlib.patches import Circle, PathPatch, Rectangle
    from matplotlib.path import Path as MplPath

    if units not in _UNITS:
        raise ValueError(f"units must be 'US' or 'SI', got {units!r}")
    out = Path(out_path)
    fmt = out.suffix.lower().lstrip(".")
    if fmt not in ("svg", "png"):
        raise ValueError(f"out_path must end in .svg or .png, got {out.name!r}")
    if poly.is_empty:
        raise ValueError("poly must not be empty")
    dim_lines = (
        principal_dimensions(poly, deck=deck, avoid_y=centroid_y_mm) if dims is None else list(dims)
    )
    dim_lines = [_as_dimension(d) for d in dim_lines]

    xmin, ymin, xmax, ymax = poly.bounds
    top = ymax + (deck[2] + deck[1] if deck else 0.0)
    left, right = xmin, xmax
    if deck:
        left, right = min(left, -deck[0] / 2), max(right, deck[0] / 2)
    size = max(right - left, top - ymin)

    # drawing extents: the shape, the dimension lines, room for labels
    label_room = 0.09 * size
    x_lo, x_hi, y_lo, y_hi = left, right, ymin, top
    for d in dim_lines:
        if d.vertical:
            x_lo, x_hi = min(x_lo, d.at - label_room), max(x_hi, d.at + label_room)
        else:
            y_lo, y_hi = min(y_lo, d.at - label_room), max(y_hi, d.at + label_room)
    if centroid_y_mm is not None:
        x_hi = max(x_hi, xmax + 0.32 * size)  # room for the centroid label
    pad = 0.03 * size
    x_lo, x_hi, y_lo, y_hi = x_lo - pad, x_hi + pad, y_lo - pad, y_hi + pad

    width_in = 7.0
    plot_h_in = width_in * (y_hi - y_lo) / (x_hi - x_lo)
    if plot_h_in > 8.0:  # tall and narrow: limit the height instead
        plot_h_in, width_in = 8.0, 8.0 * (x_hi - x_lo) / (y_hi - y_lo)
    title_in, foot_in = 0.45, 0.35
    fig = Figure(figsize=(width_in, plot_h_in + title_in + foot_in))
    FigureCanvasAgg(fig)
    total_h = plot_h_in + title_in + foot_in
    ax = fig.add_axes((0.0, foot_in / total_h, 1.0, plot_h_in / total_h))
    ax.set_xlim(x_lo, x_hi)
    ax.set_ylim(y_lo, y_hi)
    ax.set_aspect("equal", adjustable="datalim")
    ax.set_axis_off()
    mm_per_pt = (x_hi - x_lo) / (width_in * 72.0)  # data units per typographic point

    # concrete: one compound path, holes reversed relative to the shell
    shell = orient(poly, 1.0)
    verts: list[tuple[float, float]] = []
    codes: list[int] = []
    for ring in (shell.exterior, *shell.interiors):
        pts = list(ring.coords)
        verts += pts
        codes += [MplPath.MOVETO] + [MplPath.LINETO] * (len(pts) - 2) + [MplPath.CLOSEPOLY]
    ax.add_patch(
        PathPatch(MplPath(verts, codes), facecolor=_CONCRETE, edgecolor=_INK, lw=1.2, zorder=2)
    )

    # haunch and deck
    if deck:
        w, t, h = deck
        top_cut = _slice(poly, ymax - 1e-6 * (ymax - ymin))
        tx0, tx1 = top_cut[0][0], top_cut[-1][1]
        if h > 0:
            ax.add_patch(
                Rectangle(
                    (tx0, ymax), tx1 - tx0, h, facecolor=_DECK, edgecolor=_INK, lw=0.8, zorder=2
                )
            )
        ax.add_patch(
            Rectangle((-w / 2, ymax + h), w, t, facecolor=_DECK, edgecolor=_INK, lw=1.0, zorder=2)
        )
        ax.text(
            -w / 2 + 0.02 * size,
            ymax + h + t / 2,
            "deck",
            fontsize=_FONT_PT - 1,
            va="center",
            ha="left",
            color=_DIM_INK,
            zorder=5,
        )

    # strands
    n_strands = 0
    if strands_mm:
        xs = [p[0] for p in strands_mm]
        ys = [p[1] for p in strands_mm]
        n_strands = len(xs)
        ax.scatter(xs, ys, s=9.0, c=_INK, marker="o", linewidths=0, zorder=4)

    # ducts: circles to scale, the strand count beside each
    for x, y, d, n in ducts_mm or ():
        ax.add_patch(Circle((x, y), d / 2.0, facecolor="white", edgecolor=_INK, lw=0.8, zorder=4))
        ax.text(
            x + d / 2.0 + 0.01 * size,
            y,
            f"{n}",
            fontsize=_FONT_PT - 1,
            va="center",
            ha="left",
            color=_DIM_INK,
            zorder=5,
        )

    # centroid: circle-and-cross symbol on a dash-dot axis, labelled on the right
    if centroid_y_mm is not None:
        cx = shell.centroid.x
        ax.plot(
            [xmin - 0.02 * size, xmax + 0.04 * size],
            [centroid_y_mm, centroid_y_mm],
            color=_DIM_INK,
            lw=0.6,
            ls="-.",
            zorder=3,
        )
        r = 4.0 * mm_per_pt
        ax.add_patch(
            Circle((cx, centroid_y_mm), r, facecolor="white", edgecolor=_INK, lw=0.8, zorder=5)
        )
        ax.plot([cx - r, cx + r], [centroid_y_mm] * 2, color=_INK, lw=0.8, zorder=6)
        ax.plot([cx, cx], [centroid_y_mm - r, centroid_y_mm + r], color=_INK, lw=0.8, zorder=6)
        ax.text(
            xmax + 0.06 * size,
            centroid_y_mm,
            f"centroid\nyb = {format_length(centroid_y_mm - ymin, units)}",
            fontsize=_FONT_PT,
            va="center",
            ha="left",
            zorder=5,
        )

    for d in dim_lines:
        _draw_dimension(ax, d, units=units, mm_per_pt=mm_per_pt)

    fig.text(0.5, 1.0 - 0.28 / total_h, title, ha="center", va="center", fontsize=11)
    note = f"dimensions in {_UNITS[units][0]}; drawn to scale"
    if ducts_mm:
        n_tendon_strands = sum(n for *_xyd, n in ducts_mm)
        note += (
            f"; {len(ducts_mm)} duct{'s' if len(ducts_mm) != 1 else ''} to scale, "
            f"{n_tendon_strands} strands in all (count beside each duct)"
        )
    elif n_strands:
        note += f"; {n_strands} strand{'s' if n_strands != 1 else ''} shown as dots"
    fig.text(0.02, 0.16 / total_h, note, ha="left", va="center", fontsize=_FONT_PT - 1)

    out.parent.mkdir(parents=True, exist_ok=True)

    save_figure_atomic(fig, out, fmt)


def _draw_dimension(ax: Any, d: DimensionLine, *, units: str, mm_per_pt: float) -> None:
    """Draw one dimension line with extension lines, arrowheads and its label."""
    label = d.label if d.label is not None else format_length(d.length_mm, units)
    thin = {"color": _DIM_INK, "lw": 0.5, "zorder": 3}
    over = 3.0 * mm_per_pt  # extension lines run a little past the dimension line
    gap = 2.0 * mm_per_pt  # and stop short of the shape
    text_len = 0.6 * _FONT_PT * len(label) * mm_per_pt
    if d.vertical:
        a, b = (d.at, d.start[1]), (d.at, d.end[1])
        for x, y in (d.start, d.end):
            if abs(x - d.at) > gap:
                sign = 1.0 if d.at > x else -1.0
                ax.plot([x + sign * gap, d.at + sign * over], [y, y], **thin)
    else:
        a, b = (d.start[0], d.at), (d.end[0], d.at)
        for x, y in (d.start, d.end):
            if abs(y - d.at) > gap:
                sign = 1.0 if d.at > y else -1.0
                ax.plot([x, x], [y + sign * gap, d.at + sign * over], **thin)
    ax.annotate(
        "",
        xy=b,
        xytext=a,
        arrowprops={
            "arrowstyle": "<|-|>,head_length=0.5,head_width=0.18",
            "color": _DIM_INK,
            "lw": 0.6,
            "shrinkA": 0,
            "shrinkB": 0,
        },
        zorder=3,
    )
    text_kw = {"fontsize": _FONT_PT, "zorder": 5, "color": _INK}
    if d.vertical:
        ym = (a[1] + b[1]) / 2
        ax.text(d.at - 2.5 * mm_per_pt, ym, label, rotation=90, ha="right", va="center", **text_kw)
        return
    xm = (a[0] + b[0]) / 2
    inside_shape = abs(d.start[1] - d.at) <= gap and abs(d.end[1] - d.at) <= gap
    if inside_shape or text_len > 0.9 * abs(b[0] - a[0]):
        # a short dimension across the shape (e.g. the web): label beside it, right
        x_text = max(a[0], b[0]) + 4.0 * mm_per_pt
        box = {"facecolor": "white", "edgecolor": "none", "pad": 1.0}
        ax.text(x_text, d.at, label, ha="left", va="center", bbox=box, **text_kw)
        return
    below = d.at < min(d.start[1], d.end[1])
    offset = -2.5 * mm_per_pt if below else 2.5 * mm_per_pt
    ax.text(xm, d.at + offset, label, ha="center", va="top" if below else "bottom", **text_kw)
