"""``prestress design``: a bounded, exhaustive search for the leanest strand pattern that passes.

The search space is stated, finite and enumerated in full (never sampled):

- a strand grid: row heights and horizontal positions (the job's ``[design]`` table, or by
  default the heights of the job's rows and a 2 in (50 mm in SI jobs) grid across the bottom
  flange); positions that do not lie inside the concrete with a strand radius of cover at a
  row's height are left out of that row;
- fill levels: the grid is filled row by row from the bottom, each row from the centre out in
  symmetric groups (a pair at ±x, or a single strand on the axis), the order of a
  ``[strands.grid]`` with ``fill = "bottom-up"``; every level from ``min_strands`` to
  ``max_strands`` is searched;
- per level, in ``mode = "harp"``: every number of harped strands 0..N (whole groups), taken
  from the highest filled positions nearest the axis, with one end height and hold-down pair;
  only positions whose straight path to every place of the end column (on the girder axis)
  stays inside the concrete with a strand radius of cover may be harped (decided once per
  grid, :func:`prestress.layout.paths_to_column_inside`), so a harped strand never leaves the
  web on its way to the end (:func:`prestress.layout.harp_path_error`);
  in ``mode = "debond"``: every symmetric debonding pattern with a small set of debonded
  lengths: in each row 0..m inner groups (the row's outermost group stays bonded), the
  innermost with the longest length, within the detailing rules of
  :func:`prestress.layout.debonding_warnings` taken as hard constraints (exterior strands of a
  row bonded, share per row and in total, number terminating at one section, symmetry);
  ``mode = "straight"``: the fill levels alone.

Preference: the fewest strands that pass every limit at every station of every stage; then
the fewest harped or debonded strands; then the least debonded length; then the lowest
utilisation.

Evaluation is vectorised. For a fixed section, loads and stages, every fiber stress at every
station is linear in the developed steel area Σ A·d(x) and its first moment Σ A·d(x)·y(x)
(d: share of the force developed, y: strand height): with P = fp ΣA·d and P e = fp (yb ΣA·d −
ΣA·d·y), f = n [−P/A − (M − P e) c/I]. Each candidate is a vector of strand counts per
"strand type" (a grid row's bonded straight strands; a row's strands debonded over one
length; one harped strand with its mid and end heights), so a batch of candidates is one
matrix product with the per-type stress coefficients, then element-wise limits
(candidates × stages × stations × fibers), with no Python loop over candidates. Where the
limit set gives factors on the prestress (``prestress_factors``, EN 1992-1-1:2004 5.10.9(1)P,
from memory), the prestress part of each stress is scaled by the stage's lower and upper
factor and each fiber takes the case that governs, as ``prestress check`` does.

Losses and the analysis sections depend on the pattern only through the strands' areas and
heights at midlength (harping between hold-downs that straddle midlength keeps the rows'
heights there; debonding keeps every strand in Aps), i.e. only through the fill level (and
the harped count when the hold-downs do not straddle midlength): the job's own loss method
(:func:`prestress.losses.compute_losses`) and :func:`prestress.analysis.resolve_girder` are
run once per such group on one of its candidates, exactly, with no approximation. The
candidates reported are checked again by :func:`prestress.analysis.run_check` on the job
rebuilt with their pattern, so the answer is exactly what ``prestress check`` says of it.

Engine level: N, mm, MPa, N*mm; tension +, compression −.
"""

from __future__ import annotations

import copy
import math
import time
import tomllib
from collections.abc import Iterator
from dataclasses import dataclass, field, replace
from pathlib import Path
from typing import TYPE_CHECKING, Any

import numpy as np

from prestress.errors import InputError
from prestress.layout import DEBOND_RULES, Layout, StrandSet, paths_to_column_inside
from prestress.model import Job, StrandRow
from prestress.tomlread import Table, read_toml
from prestress.units import FOOT_MM, INCH_MM, to_internal

if TYPE_CHECKING:
    from prestress.analysis import CheckResult, Girder
    from prestress.stages import Station

#: Search modes of the ``[design]`` table.
MODES = ("straight", "harp", "debond")

#: A check passes when the utilisation is at most 1 + PASS_TOL (as in analysis.check_fiber).
PASS_TOL = 1e-12

#: Upper bound on the number of candidates searched unless ``max_candidates`` says otherwise.
DEFAULT_MAX_CANDIDATES = 1_000_000

#: At most this many debonded lengths ("a small set").
MAX_DEBOND_LENGTHS = 6

#: Default grid pitch (mm): 2 in in US jobs, 50 mm in SI jobs (common practice).
DEFAULT_PITCH = {"US": 2.0 * INCH_MM, "SI": 50.0}

#: Candidate batch size of the vectorised evaluator (memory: batch × columns × 8 bytes).
BATCH = 4096

_FIBER_INDEX = {"girder_bottom": 0, "girder_top": 1, "deck_top": 2}
_FIBERS = ("girder_bottom", "girder_top", "deck_top")
_TOL_MM = 1e-6


def show_length(v: float, system: str, *, long: bool = False) -> str:
    """A length for messages: in or ft (US), mm or m (SI)."""
    if system == "SI":
        return f"{v / 1000.0:.4g} m" if long else f"{v:.4g} mm"
    return f"{v / FOOT_MM:.4g} ft" if long else f"{v / INCH_MM:.4g} in"


# ------------------------------------------------------------------------------------------
# The search space


@dataclass(frozen=True)
class HarpSpec:
    """Where harped strands go at the girder ends (mm).

    Attributes:
        end_height: height of the highest harped strand at the ends (mm above the bottom).
        hold_downs: the two hold-down points from the left end (mm).
        end_spacing: vertical spacing of the harped strands in their column at the ends (mm).
        source: where it comes from ("the [design] table" or the job's harped row).
        max_in_column: how many harped strands fit in the end column inside the concrete.
    """

    end_height: float
    hold_downs: tuple[float, float]
    end_spacing: float
    source: str
    max_in_column: int


@dataclass(frozen=True)
class DesignSpace:
    """The space searched, as read from ``[design]`` with its defaults (mm).

    Attributes:
        mode: "straight", "harp" or "debond".
        heights: grid row heights, ascending.
        positions: grid positions across the section, ascending (symmetric about the axis).
        row_groups: per row, the symmetric groups of positions that fit there, centre out.
        min_strands: fewest strands searched.
        max_strands: most strands searched.
        harp: the harp geometry (harp mode).
        max_harped: cap on harped strands (harp mode), None: every count that fits.
        debond_lengths: the debonded lengths, longest first (debond mode).
        rules: the debonding detailing limits used as hard constraints.
        report: how many passing candidates to report.
        max_candidates: the bound on the space's size.
        sources: where the grid came from, by item.
        notes: remarks (positions left out, caps).
        harp_groups: per row, the groups of ``row_groups`` that may be harped: those whose
            path to every place of the end column stays inside the concrete (harp mode).
    """

    mode: str
    heights: tuple[float, ...]
    positions: tuple[float, ...]
    row_groups: tuple[tuple[tuple[float, ...], ...], ...]
    min_strands: int
    max_strands: int
    harp: HarpSpec | None
    max_harped: int | None
    debond_lengths: tuple[float, ...]
    rules: dict[str, float]
    report: int
    max_candidates: int
    sources: dict[str, str] = field(default_factory=dict)
    notes: tuple[str, ...] = ()
    harp_groups: tuple[tuple[tuple[float, ...], ...], ...] = ()

    @property
    def capacity(self) -> int:
        """Number of strand positions of the grid that fit in the section."""
        return sum(len(g) for groups in self.row_groups for g in groups)


def harpable_groups(
    poly: Any,
    heights: tuple[float, ...] | list[float],
    row_groups: tuple[tuple[tuple[float, ...], ...], ...] | list[tuple[tuple[float, ...], ...]],
    column: tuple[float, float],
    radius: float,
) -> tuple[tuple[tuple[float, ...], ...], ...]:
    """Per row, the symmetric groups whose strands may be harped (mm).

    A strand may be harped from a grid position when its straight path to every place of the
    end column (``column``: lowest and highest end heights on the axis) lies inside the
    concrete with a strand radius of cover (:func:`prestress.layout.paths_to_column_inside`);
    a group only when all its strands may. Decided once for the whole grid (one vectorised
    shapely call), so every candidate's harped strands keep their path inside the web
    whatever place of the column they take.
    """
    points = [
        (x, h) for h, groups in zip(heights, row_groups, strict=True) for g in groups for x in g
    ]
    ok = iter(paths_to_column_inside(poly, points, column, radius).tolist())
    out = []
    for groups in row_groups:
        keep = []
        for g in groups:
            flags = [next(ok) for _ in g]
            if all(flags):
                keep.append(g)
        out.append(tuple(keep))
    return tuple(out)


def _fits(poly: Any, x: float, y: float, radius: float) -> bool:
    """Whether a strand at (x, y) lies inside the concrete with its radius of cover.

    The same test as :func:`prestress.analysis._check_strands_inside` applies to a job.
    """
    from shapely.geometry import Point

    p = Point(float(x), float(y))
    return bool(
        poly.contains(p)
        and poly.exterior.distance(p) >= radius
        and all(h.distance(p) >= radius for h in poly.interiors)
    )


def _length_list(t: Table, key: str, *, expected: str) -> list[float]:
    raw = t.raw(key, expected=expected)
    if not isinstance(raw, list) or not raw:
        raise t.error(key, expected, repr(raw))
    return [
        to_internal(v, "length", field=f"{t.field(key)}[{i}]", file=t.file)
        for i, v in enumerate(raw)
    ]


def _symmetric_groups(xs: list[float]) -> tuple[tuple[float, ...], ...]:
    """Symmetric groups of positions, centre out: (0,) and (−x, x); unpaired ones dropped."""
    groups: list[tuple[float, ...]] = []
    pos = sorted(x for x in xs if x > _TOL_MM)
    if any(abs(x) <= _TOL_MM for x in xs):
        groups.append((0.0,))
    for x in pos:
        mirror = [v for v in xs if abs(v + x) <= _TOL_MM]
        if mirror:
            groups.append((mirror[0], x))
    return tuple(groups)


def default_pitch(job: Job) -> tuple[float, str]:
    """The pitch of the default grid (mm) and where it comes from.

    The spacing of the job's rows given by count and spacing when they all agree, else 2 in
    (50 mm in an SI job), the usual strand grid (common practice).
    """
    spacings = {round(r.spacing, 6) for r in job.rows if r.spacing > 0 and r.count > 1}
    if len(spacings) == 1:
        return float(next(iter(spacings))), "the spacing of the job's rows"
    if job.units == "SI":
        return DEFAULT_PITCH["SI"], "the usual 50 mm grid"
    return DEFAULT_PITCH["US"], "the usual 2 in grid"


def _default_positions(job: Job, poly: Any, y: float) -> list[float]:
    """A grid across the bottom flange at height y, symmetric about the axis.

    Pitch: :func:`default_pitch`. Centred on the axis (a strand at x = 0) when a row of the
    job has a strand on the axis, else offset by half a pitch (strands at ±pitch/2,
    ±3 pitch/2, ...), as rows of an even count are laid out; as wide as the section at y less
    a strand radius of cover.
    """
    from shapely.geometry import LineString

    pitch, _ = default_pitch(job)
    minx, _, maxx, _ = poly.bounds
    cut = poly.intersection(LineString([(minx - 1.0, y), (maxx + 1.0, y)]))
    half = max(abs(cut.bounds[0]), abs(cut.bounds[2])) if not cut.is_empty else 0.0
    half -= job.strand.diameter / 2.0
    centred = any(abs(float(x)) <= _TOL_MM for r in job.rows for x in r.x_positions())
    start = 0.0 if centred else pitch / 2.0
    out: list[float] = []
    k = 0
    while start + k * pitch <= half:
        x = start + k * pitch
        out += [x] if x == 0.0 else [-x, x]
        k += 1
    return sorted(out)


def _job_harp(job: Job) -> tuple[float, tuple[float, float], float] | None:
    """The harp geometry of the job's harped rows: the highest end height, hold-downs, step."""
    harped = [r.harp for r in job.rows if r.harp is not None]
    if not harped:
        return None
    top = max(harped, key=lambda h: h[0])
    return top


def read_design(raw: Any, job: Job, girder: Girder, *, file: str = "") -> DesignSpace:
    """Read the ``[design]`` table (or its absence) into the search space.

    Args:
        raw: the raw ``design`` value of the job's TOML (a dict), or None for the defaults.
        job: the job (as loaded).
        girder: the job's resolved girder (for its polygon).
        file: the job file, for messages.

    Raises:
        InputError: naming the field of a bad or unknown value.
    """
    from prestress.jobfile import _hold_downs

    file = file or job.file
    if raw is None:
        raw = {}
    if not isinstance(raw, dict):
        raise InputError("a [design] table", file=file, field="design", got=type(raw).__name__)
    t = Table(raw, file=file, path="design")
    poly = girder.polygon
    radius = job.strand.diameter / 2.0
    sources: dict[str, str] = {}
    notes: list[str] = []

    job_harp = _job_harp(job)
    job_lengths = sorted(
        {v for r in job.rows for _i, a, b in r.debond for v in (a, b) if v > 0}, reverse=True
    )
    if t.has("harp") or (job_harp is not None and not t.has("debond_lengths")):
        default_mode = "harp"
    elif t.has("debond_lengths") or job_lengths:
        default_mode = "debond"
    else:
        default_mode = "straight"
    mode = t.string("mode", default_mode, choices=MODES)

    # the grid
    if t.has("heights"):
        heights = _length_list(t, "heights", expected='a list of row heights, e.g. ["2 in"]')
        for i, h in enumerate(heights):
            if not 0.0 < h < girder.gross.height:
                raise InputError(
                    "a row height inside the girder depth",
                    file=file,
                    field=f"design.heights[{i}]",
                    got=show_length(h, job.units),
                )
        sources["heights"] = "the [design] table"
    else:
        t.raw("heights", None)
        heights = sorted({round(r.height, 9) for r in job.rows})
        sources["heights"] = "the heights of the job's strand rows"
    if len({round(h, 6) for h in heights}) != len(heights):
        raise t.error("heights", "each row height once", "a repeated height")
    heights = sorted(heights)
    if t.has("positions"):
        positions = _length_list(
            t, "positions", expected='a list of horizontal positions, e.g. ["-3 in", "3 in"]'
        )
        if len({round(x, 6) for x in positions}) != len(positions):
            raise t.error("positions", "each position once", "a repeated position")
        for x in positions:
            if not any(abs(v + x) <= _TOL_MM for v in positions):
                raise t.error(
                    "positions",
                    "positions symmetric about the girder axis (every x with its −x), "
                    "for filling in symmetric pairs",
                    f"{show_length(x, job.units)} without its mirror",
                )
        sources["positions"] = "the [design] table"
    else:
        t.raw("positions", None)
        positions = _default_positions(job, poly, heights[0])
        pitch, why = default_pitch(job)
        sources["positions"] = (
            f"a grid across the bottom flange at a pitch of {show_length(pitch, job.units)} "
            f"({why}), as wide as the section at {show_length(heights[0], job.units)}"
        )
    positions = sorted(positions)
    row_groups = []
    for h in heights:
        fit = [x for x in positions if _fits(poly, x, h, radius)]
        groups = _symmetric_groups(fit)
        left_out = len(positions) - sum(len(g) for g in groups)
        if left_out:
            notes.append(
                f"row at {show_length(h, job.units)}: {left_out} of {len(positions)} grid "
                "positions left out (outside the concrete with a strand radius of cover)"
            )
        row_groups.append(groups)
    capacity = sum(len(g) for groups in row_groups for g in groups)
    if capacity == 0:
        raise t.error("positions", "grid positions inside the section", "none fits")

    min_strands = t.integer("min_strands", 1, low=1)
    max_strands = t.integer("max_strands", capacity, low=1)
    if max_strands < min_strands:
        raise t.error("max_strands", f"at least min_strands ({min_strands})", str(max_strands))
    if min_strands > capacity:
        raise t.error(
            "min_strands", f"at most the grid's capacity ({capacity} strands)", str(min_strands)
        )
    if max_strands > capacity:
        notes.append(f"max_strands {max_strands} is more than the grid holds; {capacity} used")
        max_strands = capacity

    # harping
    harp = None
    max_harped: int | None = None
    harp_groups: tuple[tuple[tuple[float, ...], ...], ...] = ()
    h_tab = t.table("harp", required=False)
    if h_tab is not None and mode != "harp":
        raise t.error("harp", "a harp table only with mode = 'harp'", f"mode = '{mode}'")
    if mode == "harp":
        if h_tab is not None:
            end = h_tab.quantity("end_height", "length", positive=True)
            step = h_tab.quantity("end_spacing", "length", 2.0 * INCH_MM, positive=True)
            hds = _hold_downs(h_tab, job.length)
            h_tab.done()
            src = "the [design] table"
            end_field = "design.harp.end_height"
        elif job_harp is not None:
            end, hds, step = job_harp
            src = "the job's harped row"
            end_field = "design.harp"
        else:
            raise t.error(
                "harp",
                "a harp table { end_height = ..., hold_down = ... } (the job has no harped row "
                "to take the harp geometry from)",
                "nothing",
            )
        fit = 0
        while end - fit * step > 0 and _fits(poly, 0.0, end - fit * step, radius):
            fit += 1
        if fit == 0:
            raise InputError(
                "an end height inside the section (harped strands stand on the axis at the ends)",
                file=file,
                field=end_field,
                got=show_length(end, job.units),
            )
        harp = HarpSpec(end, (float(hds[0]), float(hds[1])), step, src, fit)
        if t.has("max_harped"):
            max_harped = t.integer("max_harped", low=0)
        else:
            t.raw("max_harped", None)
        # the places of the end column a harped strand may take: as many as may be harped
        in_column = min(fit, max_strands, fit if max_harped is None else max_harped)
        if in_column > 0:
            column = (end - (in_column - 1) * step, end)
            harp_groups = harpable_groups(poly, heights, row_groups, column, radius)
        else:
            harp_groups = tuple(() for _ in heights)
    else:
        if t.has("max_harped"):
            raise t.error("max_harped", "max_harped only with mode = 'harp'", f"mode = '{mode}'")
        t.raw("max_harped", None)

    # debonding
    lengths: list[float] = []
    if mode == "debond":
        if t.has("debond_lengths"):
            lengths = _length_list(
                t, "debond_lengths", expected='a list of debonded lengths, e.g. ["6 ft", "12 ft"]'
            )
            for i, v in enumerate(lengths):
                if not 0.0 < v < job.length / 2.0:
                    raise InputError(
                        "a debonded length shorter than half the girder length",
                        file=file,
                        field=f"design.debond_lengths[{i}]",
                        got=show_length(v, job.units, long=True),
                    )
            sources["debond_lengths"] = "the [design] table"
        elif job_lengths:
            t.raw("debond_lengths", None)
            lengths = job_lengths
            sources["debond_lengths"] = "the job's debonded strands"
        else:
            raise t.error(
                "debond_lengths",
                'a list of debonded lengths, e.g. ["6 ft", "12 ft"] (the job debonds no strand '
                "to take them from)",
                "nothing",
            )
        if len({round(v, 3) for v in lengths}) != len(lengths):
            raise t.error("debond_lengths", "each length once", "a repeated length")
        if len(lengths) > MAX_DEBOND_LENGTHS:
            raise t.error(
                "debond_lengths",
                f"a small set of at most {MAX_DEBOND_LENGTHS} lengths",
                f"{len(lengths)} lengths",
            )
        lengths = sorted(lengths, reverse=True)
    elif t.has("debond_lengths"):
        raise t.error(
            "debond_lengths", "debond_lengths only with mode = 'debond'", f"mode = '{mode}'"
        )
    else:
        t.raw("debond_lengths", None)

    report = t.integer("report", 5, low=1)
    max_candidates = t.integer("max_candidates", DEFAULT_MAX_CANDIDATES, low=1)
    t.done()
    rules = dict(DEBOND_RULES)
    if job.layout is not None:
        rules.update(job.layout.rules)
    return DesignSpace(
        mode=mode,
        heights=tuple(heights),
        positions=tuple(positions),
        row_groups=tuple(row_groups),
        min_strands=min_strands,
        max_strands=max_strands,
        harp=harp,
        max_harped=max_harped,
        debond_lengths=tuple(lengths),
        rules=rules,
        report=report,
        max_candidates=max_candidates,
        sources=sources,
        notes=tuple(notes),
        harp_groups=harp_groups,
    )


# ------------------------------------------------------------------------------------------
# Enumeration


@dataclass(frozen=True)
class Level:
    """One fill level of the grid: the strands in place before any harping or debonding.

    Attributes:
        strands: number of strands.
        filled: per grid row, the filled positions (ascending x).
        groups: per grid row, the filled symmetric groups, centre out.
        harpable: per grid row, the filled groups that may be harped (their path to the end
            column stays inside the concrete), centre out; harp mode only.
    """

    strands: int
    filled: tuple[tuple[float, ...], ...]
    groups: tuple[tuple[tuple[float, ...], ...], ...]
    harpable: tuple[tuple[tuple[float, ...], ...], ...] = ()

    def harp_order(self) -> list[tuple[int, tuple[float, ...]]]:
        """Groups in the order they are harped: highest row first, each from the centre out.

        Only the groups that may be harped (:attr:`harpable`).
        """
        return [(i, g) for i in reversed(range(len(self.harpable))) for g in self.harpable[i]]


def fill_levels(space: DesignSpace) -> list[Level]:
    """Every fill level from min_strands to max_strands: rows bottom-up, groups centre out."""
    order = [(i, g) for i in range(len(space.heights)) for g in space.row_groups[i]]
    filled: list[list[float]] = [[] for _ in space.heights]
    groups: list[list[tuple[float, ...]]] = [[] for _ in space.heights]
    count = 0
    out = []
    for i, g in order:
        filled[i] += list(g)
        groups[i].append(g)
        count += len(g)
        if count > space.max_strands:
            break
        if count >= space.min_strands:
            harpable = (
                tuple(
                    tuple(g for g in gs if g in space.harp_groups[r]) for r, gs in enumerate(groups)
                )
                if space.harp_groups
                else ()
            )
            out.append(
                Level(
                    count,
                    tuple(tuple(sorted(f)) for f in filled),
                    tuple(tuple(gs) for gs in groups),
                    harpable,
                )
            )
    return out


def _compositions(d: int, k: int) -> Iterator[tuple[int, ...]]:
    """Every way to write d as an ordered sum of k non-negative whole numbers."""
    if k == 1:
        yield (d,)
        return
    for first in range(d, -1, -1):
        for rest in _compositions(d - first, k - 1):
            yield (first, *rest)


@dataclass
class Enumeration:
    """The candidates of a space as arrays (one entry per candidate).

    Attributes:
        levels: the fill levels.
        types: the strand types: ("b", row), ("d", row, length index), ("h", row, slot).
        level: level index of each candidate.
        counts: strands of each type per candidate (candidates × types).
        special: harped or debonded strands per candidate.
        debonded_length: Σ over debonded strands of their debonded length at one end (mm).
        sig: station signature (which hold-downs / debond ends exist), per candidate.
        harped: harped strands per candidate (harp mode).
        row_option: per candidate and row, the index of the row's debonding option.
        row_options: per level and row, the options: group counts per length.
        size_before_rules: the size of the space before the detailing rules are applied.
    """

    levels: list[Level]
    types: list[tuple]
    level: np.ndarray
    counts: np.ndarray
    special: np.ndarray
    debonded_length: np.ndarray
    sig: np.ndarray
    harped: np.ndarray
    row_option: np.ndarray
    row_options: list[list[list[tuple[int, ...]]]]
    size_before_rules: int

    @property
    def size(self) -> int:
        """Number of candidates."""
        return len(self.level)

    @property
    def strands(self) -> np.ndarray:
        """Strands of each candidate."""
        counts = np.array([lv.strands for lv in self.levels])
        return counts[self.level]


def _too_many(space: DesignSpace, size: int) -> InputError:
    return InputError(
        f"a search space of at most max_candidates = {space.max_candidates:,} candidates "
        "(narrow the strand range, the grid or the debonded lengths, or raise max_candidates)",
        field="design.max_candidates",
        got=f"{size:,} candidates",
    )


def enumerate_space(space: DesignSpace, *, file: str = "") -> Enumeration:
    """Every candidate of the space, as arrays (see :class:`Enumeration`).

    Raises:
        InputError: when the space is larger than ``max_candidates`` (``design.max_candidates``)
            or holds no fill level.
    """
    levels = fill_levels(space)
    if not levels:
        raise InputError(
            "a strand range holding at least one fill level of the grid",
            file=file,
            field="design.min_strands",
            got=f"{space.min_strands} to {space.max_strands} strands",
        )
    R = len(space.heights)
    if space.mode == "debond":
        return _enumerate_debond(space, levels, file)
    types: list[tuple] = [("b", i) for i in range(R)]
    index = {t: k for k, t in enumerate(types)}
    rows_lvl, rows_counts, rows_harped = [], [], []
    for li, lv in enumerate(levels):
        bonded = np.array([len(f) for f in lv.filled], dtype=np.int64)
        options = [0]
        strand_rows: list[int] = []  # row of each harped strand, in slot order
        if space.mode == "harp":
            assert space.harp is not None
            cap = min(lv.strands, space.harp.max_in_column)
            if space.max_harped is not None:
                cap = min(cap, space.max_harped)
            for i, g in lv.harp_order():
                if len(strand_rows) + len(g) > cap:
                    break
                strand_rows += [i] * len(g)
                options.append(len(strand_rows))
        for n_h in options:
            row = np.zeros(len(types), dtype=np.int64)
            harped_per_row = np.bincount(np.array(strand_rows[:n_h], dtype=np.int64), minlength=R)
            row[:R] = bonded - harped_per_row
            for k in range(n_h):
                key = ("h", strand_rows[k], k)
                if key not in index:
                    index[key] = len(types)
                    types.append(key)
                    row = np.append(row, 0)
                row[index[key]] = 1
            rows_lvl.append(li)
            rows_counts.append(row)
            rows_harped.append(n_h)
            if len(rows_lvl) > space.max_candidates:
                raise _too_many(space, len(rows_lvl)).located(file=file)
    counts = np.zeros((len(rows_counts), len(types)), dtype=np.int16)
    for k, row in enumerate(rows_counts):
        counts[k, : len(row)] = row
    harped = np.array(rows_harped, dtype=np.int64)
    n = len(rows_lvl)
    return Enumeration(
        levels=levels,
        types=types,
        level=np.array(rows_lvl, dtype=np.int64),
        counts=counts,
        special=harped.copy(),
        debonded_length=np.zeros(n),
        sig=(harped > 0).astype(np.int64),
        harped=harped,
        row_option=np.zeros((n, R), dtype=np.int64),
        row_options=[],
        size_before_rules=n,
    )


def _enumerate_debond(space: DesignSpace, levels: list[Level], file: str) -> Enumeration:
    """Debonding patterns per level: per-row options, their Cartesian product, the rules."""
    R = len(space.heights)
    L = np.array(space.debond_lengths)
    nL = len(L)
    rules = space.rules
    types: list[tuple] = [("b", i) for i in range(R)] + [
        ("d", i, k) for i in range(R) for k in range(nL)
    ]
    all_lvl, all_deb, all_opt, all_options = [], [], [], []
    before = 0
    total = 0
    for li, lv in enumerate(levels):
        per_row_opts: list[list[tuple[int, ...]]] = []
        per_row_strands: list[np.ndarray] = []
        raw_product = 1
        for i in range(R):
            groups = lv.groups[i]
            n_row = len(lv.filled[i])
            inner = groups[:-1]  # the outermost filled group stays bonded
            opts, strands = [], []
            raw = 0
            for d in range(len(inner) + 1):
                raw += math.comb(d + nL - 1, nL - 1)
                # the strands debonded in the row are those of the d innermost groups,
                # whatever lengths they get: the share per row is a bound on d alone
                if n_row and sum(len(g) for g in inner[:d]) > (
                    rules["max_share_row"] * n_row + PASS_TOL
                ):
                    continue
                for comp in _compositions(d, nL):
                    s = np.zeros(nL, dtype=np.int64)
                    g0 = 0
                    for k, c in enumerate(comp):
                        s[k] = sum(len(g) for g in inner[g0 : g0 + c])
                        g0 += c
                    opts.append(comp)
                    strands.append(s)
            raw_product *= raw
            per_row_opts.append(opts)
            per_row_strands.append(np.array(strands, dtype=np.int64).reshape(-1, nL))
        before += raw_product
        sizes = [len(o) for o in per_row_opts]
        product = math.prod(sizes)
        total += product
        if total > space.max_candidates:
            raise _too_many(space, total).located(file=file)
        idx = np.indices(sizes).reshape(R, -1).T  # (product, R): option of each row
        deb = np.stack([per_row_strands[i][idx[:, i]] for i in range(R)], axis=1)
        n_deb = deb.sum(axis=(1, 2))
        per_length = deb.sum(axis=1)  # (product, nL)
        ok = n_deb <= rules["max_share_total"] * lv.strands + PASS_TOL
        limit = np.maximum(rules["max_terminations_count"], rules["max_terminations_share"] * n_deb)
        ok &= np.all(per_length <= limit[:, None] + PASS_TOL, axis=1)
        all_lvl.append(np.full(int(ok.sum()), li, dtype=np.int64))
        all_deb.append(deb[ok])
        all_opt.append(idx[ok])
        all_options.append(per_row_opts)
    level = np.concatenate(all_lvl)
    deb = np.concatenate(all_deb).astype(np.int16)
    opt = np.concatenate(all_opt)
    filled = np.array([[len(f) for f in lv.filled] for lv in levels], dtype=np.int64)
    counts = np.zeros((len(level), len(types)), dtype=np.int16)
    counts[:, :R] = filled[level] - deb.sum(axis=2)
    counts[:, R:] = deb.reshape(len(level), R * nL)
    per_length = deb.sum(axis=1).astype(np.int64)
    special = per_length.sum(axis=1)
    used = (per_length > 0).astype(np.int64)
    sig = used @ (1 << np.arange(nL, dtype=np.int64))
    return Enumeration(
        levels=levels,
        types=types,
        level=level,
        counts=counts,
        special=special,
        debonded_length=per_length @ L,
        sig=sig,
        harped=np.zeros(len(level), dtype=np.int64),
        row_option=opt,
        row_options=all_options,
        size_before_rules=before,
    )


# ------------------------------------------------------------------------------------------
# Candidates as strand rows and jobs


@dataclass(frozen=True)
class Candidate:
    """One strand pattern of the space.

    Attributes:
        index: its index in the enumeration.
        strands: number of strands.
        harped: harped strands.
        debonded: debonded strands.
        debonded_length: Σ over debonded strands of the debonded length at one end (mm).
        rows: the pattern as the job's strand rows (mm; a row partly harped is split into its
            straight and harped strands at the same height).
    """

    index: int
    strands: int
    harped: int
    debonded: int
    debonded_length: float
    rows: tuple[StrandRow, ...]

    def by_height(self) -> list[dict[str, Any]]:
        """The pattern per row height: count, harped count, debonded counts per length."""
        out: dict[float, dict[str, Any]] = {}
        for r in self.rows:
            d = out.setdefault(
                round(r.height, 6),
                {"height": r.height, "count": 0, "harped": 0, "debonded": {}},
            )
            d["count"] += r.count
            if r.harp is not None:
                d["harped"] += r.count
            for idx, left, _right in r.debond:
                d["debonded"][left] = d["debonded"].get(left, 0) + len(idx)
        return [out[k] for k in sorted(out)]


def candidate(space: DesignSpace, enum: Enumeration, i: int) -> Candidate:
    """The candidate of index i as strand rows."""
    lv = enum.levels[int(enum.level[i])]
    R = len(space.heights)
    rows: list[StrandRow] = []
    if space.mode == "harp" and enum.harped[i] > 0:
        assert space.harp is not None
        n_h = int(enum.harped[i])
        harped: dict[int, list[float]] = {}
        taken = 0
        for ri, g in lv.harp_order():
            if taken >= n_h:
                break
            harped.setdefault(ri, []).extend(g)
            taken += len(g)
        above = 0
        end_heights: dict[int, float] = {}
        for ri in sorted(harped, reverse=True):  # highest row at the top of the end column
            end_heights[ri] = space.harp.end_height - above * space.harp.end_spacing
            above += len(harped[ri])
        for ri in range(R):
            hx = harped.get(ri, [])
            straight = tuple(x for x in lv.filled[ri] if x not in hx)
            if straight:
                rows.append(StrandRow(space.heights[ri], len(straight), 0.0, straight))
            if hx:
                rows.append(
                    StrandRow(
                        space.heights[ri],
                        len(hx),
                        0.0,
                        tuple(sorted(hx)),
                        harp=(end_heights[ri], space.harp.hold_downs, space.harp.end_spacing),
                    )
                )
    else:
        for ri in range(R):
            xs = lv.filled[ri]
            if not xs:
                continue
            debond = []
            if space.mode == "debond":
                comp = enum.row_options[int(enum.level[i])][ri][int(enum.row_option[i, ri])]
                g0 = 0
                inner = lv.groups[ri][:-1]
                for k, c in enumerate(comp):
                    chosen = [x for g in inner[g0 : g0 + c] for x in g]
                    g0 += c
                    if chosen:
                        idx = tuple(sorted(xs.index(x) for x in chosen))
                        length = space.debond_lengths[k]
                        debond.append((idx, length, length))
            rows.append(StrandRow(space.heights[ri], len(xs), 0.0, xs, debond=tuple(debond)))
    rows = [replace(r, index=k) for k, r in enumerate(rows)]
    return Candidate(
        index=int(i),
        strands=lv.strands,
        harped=int(enum.harped[i]),
        debonded=int(enum.special[i]) if space.mode == "debond" else 0,
        debonded_length=float(enum.debonded_length[i]),
        rows=tuple(rows),
    )


def job_with_rows(job: Job, rows: tuple[StrandRow, ...] | list[StrandRow]) -> Job:
    """The job with another strand pattern (its layout rebuilt by the job reader's builder)."""
    from prestress.jobfile import build_layout

    rules = dict(job.layout.rules) if job.layout is not None else {}
    rows = [replace(r, index=k) for k, r in enumerate(rows)]
    layout = build_layout(rows, job.strand.area, job.length, job.transfer_length, rules, job.units)
    return replace(job, rows=tuple(rows), layout=layout)


def loss_groups(space: DesignSpace, enum: Enumeration, length: float) -> np.ndarray:
    """Group candidates whose losses and analysis sections are the same (index per candidate).

    Losses (every method of :mod:`prestress.losses`) and the sections of
    :func:`prestress.analysis.resolve_girder` depend on the strand pattern only through the
    strands' areas and heights at midlength. Within a fill level these are the same for every
    debonding pattern, and for every harped count when the hold-downs straddle midlength
    (harped strands are then at their row's height there); otherwise the harped count is part
    of the key.
    """
    if space.mode != "harp":
        return enum.level.copy()
    assert space.harp is not None
    a, b = space.harp.hold_downs
    if a <= length / 2.0 <= b:
        return enum.level.copy()
    _, group = np.unique(np.stack([enum.level, enum.harped], axis=1), axis=0, return_inverse=True)
    return group.reshape(-1).astype(np.int64)


# ------------------------------------------------------------------------------------------
# The vectorised evaluator


@dataclass
class Evaluation:
    """Results of the vectorised check of candidates (arrays, one entry per candidate).

    Attributes:
        utilisation: the highest utilisation over every stage, station and fiber (inf where a
            fiber fails with no utilisation, e.g. against a zero limit).
        stage: stage index of the governing check.
        station: index (into the evaluator's stations) of the governing station.
        fiber: fiber index (0 girder bottom, 1 girder top, 2 deck top).
        stress: the governing stress (MPa).
        seconds: time the evaluation took.
    """

    utilisation: np.ndarray
    stage: np.ndarray
    station: np.ndarray
    fiber: np.ndarray
    stress: np.ndarray
    seconds: float = 0.0

    @property
    def ok(self) -> np.ndarray:
        """Whether each candidate passes every check."""
        return self.utilisation <= 1.0 + PASS_TOL


class Evaluator:
    """Checks a whole enumeration at once: candidates × stages × stations × fibers.

    Setup (once): per loss group (:func:`loss_groups`; a fill level as a rule) the resolved
    girder (sections) and the losses of the job's method; the union of the stations of every
    station signature; per stage the moments of the loads at those stations; per strand type
    its developed area and first moment at the stations; the stage limits.
    """

    def __init__(
        self,
        job: Job,
        space: DesignSpace,
        enum: Enumeration,
        *,
        cli_libraries: tuple[str, ...] = (),
    ) -> None:
        from prestress.analysis import _limits_of, resolve_girder
        from prestress.losses import compute_losses
        from prestress.stages import (
            COMPOSITE_LOADS,
            applied_stress,
            deck_shrinkage_stresses,
            moments,
            on_span,
            stage_specs,
        )

        t0 = time.perf_counter()
        self.job = job
        self.space = space
        self.enum = enum
        self.cli_libraries = cli_libraries
        # per loss group (candidates sharing their strands' midlength heights): the resolved
        # girder of a representative candidate and the losses of the job's method, exactly
        self.group = loss_groups(space, enum, job.length)
        n_groups = int(self.group.max()) + 1 if enum.size else 0
        first = np.full(n_groups, -1, dtype=np.int64)
        first[self.group[::-1]] = np.arange(enum.size)[::-1]
        self.girders = []
        self.losses = []
        for rep in first:
            g = resolve_girder(
                job_with_rows(job, candidate(space, enum, int(rep)).rows),
                cli_libraries=cli_libraries,
            )
            self.girders.append(g)
            self.losses.append(compute_losses(g))
        g0 = self.girders[0]
        self.specs = stage_specs(g0)
        self.notes: list[str] = []
        S = len(self.specs)
        # the limit set's factors on the prestress per stage (EN 1992-1-1:2004 5.10.9(1)P,
        # from memory): lower and upper, both 1 for the mean prestress alone
        factors = [job.limits.factors(spec.limit_stage, job.post_tensioned) for spec in self.specs]
        self.factor_inf = np.array([f.cases[0] for f in factors])
        self.factor_sup = np.array([f.cases[-1] for f in factors])
        self.factored = any(not f.unity for f in factors)

        # stations: the union over the signatures, and each signature's own
        self.sig_stations: dict[int, list[Station]] = {}
        for sig in sorted({int(s) for s in np.unique(enum.sig)}):
            self.sig_stations[sig] = self._stations_of(g0, sig)
        xs = sorted({st.x for sts in self.sig_stations.values() for st in sts})
        self.x = np.array(xs)
        self.station_names = {}
        for sts in self.sig_stations.values():
            for st in sts:
                self.station_names.setdefault(st.x, st.name)
        J = len(self.x)
        pos = {x: j for j, x in enumerate(xs)}

        # per strand type: developed area and its first moment at the stations
        L, lt, area = job.length, job.transfer_length, job.strand.area
        T = len(enum.types)
        self.A = np.zeros((T, J))
        self.AY = np.zeros((T, J))
        for k, tp in enumerate(enum.types):
            h = space.heights[tp[1]]
            if tp[0] == "b":
                s = StrandSet("b", 0, (0.0,), area, h)
            elif tp[0] == "d":
                d = space.debond_lengths[tp[2]]
                s = StrandSet("d", 0, (0.0,), area, h, debond_left=d, debond_right=d)
            else:
                assert space.harp is not None
                hp = space.harp
                s = StrandSet(
                    "h", 0, (0.0,), area, h, hp.end_height - tp[2] * hp.end_spacing, hp.hold_downs
                )
            self.A[k] = area * s.developed(self.x, L, lt)
            self.AY[k] = self.A[k] * s.height(self.x, L)

        # per loss group: coefficients of ΣA·d and ΣA·d·y, and the load-only stresses
        self.K0 = np.zeros((n_groups, S, 3))
        self.K1 = np.zeros((n_groups, S, 3))
        self.F = np.zeros((n_groups, S, J, 3))
        self.has_fiber = np.zeros((S, 3), dtype=bool)
        ms = [moments(g0, spec, self.x) for spec in self.specs]
        for li, (g, losses) in enumerate(zip(self.girders, self.losses, strict=True)):
            comp = g.section_composite
            for si, spec in enumerate(self.specs):
                sec = g.section_transfer if spec.prestress == "transfer" else g.section_service
                assert sec is not None
                fp, note = applied_stress(losses, spec.prestress)
                if note and li == 0:
                    self.notes.append(note)
                M_nc = sum((m for k, m in ms[si].items() if k not in COMPOSITE_LOADS), np.zeros(J))
                M_c = sum((m for k, m in ms[si].items() if k in COMPOSITE_LOADS), np.zeros(J))
                carrier = comp if comp is not None else sec
                shrink = deck_shrinkage_stresses(g) if "deck_shrinkage" in spec.loads else {}
                for fiber in ("girder_bottom", "girder_top"):
                    f = _FIBER_INDEX[fiber]
                    n, c = sec.n_fiber[fiber], sec.c(fiber)
                    self.K0[li, si, f] = n * fp * (-1.0 / sec.area + sec.yb * c / sec.I)
                    self.K1[li, si, f] = -n * fp * c / sec.I
                    self.F[li, si, :, f] = (
                        n * (-M_nc * c / sec.I)
                        + carrier.n_fiber[fiber] * (-M_c * carrier.c(fiber) / carrier.I)
                        + shrink.get(fiber, 0.0)
                    )
                    self.has_fiber[si, f] = True
                if comp is not None and any(k in COMPOSITE_LOADS for k in spec.loads):
                    self.F[li, si, :, 2] = comp.n_fiber["deck_top"] * (
                        -M_c * comp.c("deck_top") / comp.I
                    ) + shrink.get("deck_top", 0.0)
                    self.has_fiber[si, 2] = True

        # limits: reciprocal of each limit (0: none of that sign), zero-limit flags
        self.inv_t = np.zeros((S, 3))
        self.inv_c = np.zeros((S, 3))
        self.zero_t = np.zeros((S, 3), dtype=bool)
        self.zero_c = np.zeros((S, 3), dtype=bool)
        self.comp_limit = np.full((S, 3), np.nan)
        self.tens_limit = np.full((S, 3), np.nan)
        for si, spec in enumerate(self.specs):
            lims = dict(_limits_of(g0, spec.limit_stage))
            if job.deck is not None:
                dl = job.limits.get(spec.limit_stage, "deck_top")
                if dl is None:
                    lims["deck_top"] = (None, None)
                else:
                    fcd = job.deck.concrete.fc
                    lims["deck_top"] = (
                        -dl.compression_fraction * fcd
                        if dl.compression_fraction is not None
                        else None,
                        dl.tension.value(fcd) if dl.tension is not None else None,
                    )
            for fiber, (cl, tl) in lims.items():
                f = _FIBER_INDEX[fiber]
                if cl is not None:
                    self.comp_limit[si, f] = cl
                    if cl < 0:
                        self.inv_c[si, f] = 1.0 / cl
                    else:
                        self.zero_c[si, f] = True
                if tl is not None:
                    self.tens_limit[si, f] = tl
                    if tl > 0:
                        self.inv_t[si, f] = 1.0 / tl
                    else:
                        self.zero_t[si, f] = True

        # columns (stage, station, fiber) of each signature
        self.columns: dict[int, tuple[np.ndarray, np.ndarray, np.ndarray]] = {}
        for sig, sts in self.sig_stations.items():
            cs, cj, cf = [], [], []
            for si, spec in enumerate(self.specs):
                for st in sts:
                    if spec.support == "bearings" and not on_span(job, st.x):
                        continue
                    for f in range(3):
                        if self.has_fiber[si, f]:
                            cs.append(si)
                            cj.append(pos[st.x])
                            cf.append(f)
            self.columns[sig] = (np.array(cs), np.array(cj), np.array(cf))
        self.setup_seconds = time.perf_counter() - t0

    def _stations_of(self, g0: Girder, sig: int) -> list[Station]:
        """The stations ``prestress check`` uses for candidates of a station signature."""
        from prestress.stages import stations

        job, space = self.job, self.space
        sets = [StrandSet("bonded", 0, (0.0,), job.strand.area, space.heights[0])]
        if space.mode == "harp" and sig:
            assert space.harp is not None
            hp = space.harp
            sets.append(
                StrandSet(
                    "h", 0, (0.0,), job.strand.area, space.heights[0], hp.end_height, hp.hold_downs
                )
            )
        if space.mode == "debond":
            for k, d in enumerate(space.debond_lengths):
                if sig >> k & 1:
                    sets.append(
                        StrandSet(
                            "d",
                            0,
                            (0.0,),
                            job.strand.area,
                            space.heights[0],
                            debond_left=d,
                            debond_right=d,
                        )
                    )
        layout = Layout(tuple(sets), job.length, job.transfer_length)
        return stations(replace(g0, job=replace(g0.job, layout=layout)))

    def _group_terms(self, li: int, sig: int) -> tuple[np.ndarray, ...]:
        cs, cj, cf = self.columns[sig]
        K0 = self.K0[li, cs, cf]
        K1 = self.K1[li, cs, cf]
        G = self.A[:, cj] * K0 + self.AY[:, cj] * K1  # (types, columns)
        Fc = self.F[li, cs, cj, cf]
        return (
            G,
            Fc,
            self.inv_t[cs, cf],
            self.inv_c[cs, cf],
            self.zero_t[cs, cf],
            self.zero_c[cs, cf],
        )

    @staticmethod
    def _utilisation(
        f: np.ndarray, it: np.ndarray, ic: np.ndarray, zt: np.ndarray, zc: np.ndarray
    ) -> np.ndarray:
        """Utilisation of stresses f against the columns' limits (inf: failing a zero limit)."""
        u = np.maximum(f * it, f * ic)
        if zt.any():
            u = np.where(zt & (f > 0), np.inf, u)
        if zc.any():
            u = np.where(zc & (f < 0), np.inf, u)
        return u

    def _governing_case(
        self, fP: np.ndarray, Fc: np.ndarray, sig: int, terms: tuple[np.ndarray, ...]
    ) -> tuple[np.ndarray, np.ndarray]:
        """Stresses and utilisations of the case that governs each column.

        ``fP``: the stresses of the mean prestress alone (candidates × columns); each column
        is checked with the prestress times its stage's lower and upper factor, the loads
        unfactored, and takes the case of the higher rank, as
        :func:`prestress.analysis.station_results` does (:meth:`FiberResult.rank` and
        :func:`prestress.analysis.rank_beats`: the utilisation, then on a tie to round-off
        the distance past the binding limit; the lower factor on a full tie).
        """
        it, ic, zt, zc = terms
        cs, _cj, cf = self.columns[sig]
        f_inf = fP * self.factor_inf[cs] + Fc
        f_sup = fP * self.factor_sup[cs] + Fc
        u_inf = self._utilisation(f_inf, it, ic, zt, zc)
        u_sup = self._utilisation(f_sup, it, ic, zt, zc)
        tl, cl = self.tens_limit[cs, cf], self.comp_limit[cs, cf]

        def distance(f: np.ndarray) -> np.ndarray:
            by_tension = ~np.isnan(tl) & ((f >= 0.0) | np.isnan(cl))
            return np.where(by_tension, f - tl, np.where(~np.isnan(cl), cl - f, 0.0))

        with np.errstate(invalid="ignore"):
            finite = np.isfinite(u_sup) & np.isfinite(u_inf)
            tie = (u_sup == u_inf) | (
                finite & (np.abs(u_sup - u_inf) <= 1e-9 * np.abs(u_inf) + 1e-12)
            )
            d_inf, d_sup = distance(f_inf), distance(f_sup)
            sup = np.where(tie, d_sup > d_inf + 1e-9 * np.abs(d_inf) + 1e-9, u_sup > u_inf)
        return np.where(sup, f_sup, f_inf), np.where(sup, u_sup, u_inf)

    def evaluate(self, indices: np.ndarray | None = None, *, batch: int = BATCH) -> Evaluation:
        """Check candidates (all, or those of ``indices``) in batches of numpy operations.

        Candidates are grouped by (loss group, station signature): within a group the sections,
        losses and stations are shared, so each batch is one matrix product and a few
        element-wise operations; the Python loop runs over groups and batches only.
        """
        t0 = time.perf_counter()
        enum = self.enum
        idx = np.arange(enum.size) if indices is None else np.asarray(indices, dtype=np.int64)
        n = len(idx)
        util = np.empty(n)
        stage = np.empty(n, dtype=np.int64)
        station = np.empty(n, dtype=np.int64)
        fiber = np.empty(n, dtype=np.int64)
        stress = np.empty(n)
        key = self.group[idx] * (int(enum.sig.max()) + 1 if enum.size else 1) + enum.sig[idx]
        order = np.argsort(key, kind="stable")
        bounds = np.flatnonzero(np.diff(key[order])) + 1
        for grp in np.split(order, bounds):
            if not len(grp):
                continue
            li, sig = int(self.group[idx[grp[0]]]), int(enum.sig[idx[grp[0]]])
            G, Fc, it, ic, zt, zc = self._group_terms(li, sig)
            cs, cj, cf = self.columns[sig]
            used = np.flatnonzero(enum.counts[idx[grp]].any(axis=0))
            Gu = G[used]
            rows = np.arange(batch)
            for b0 in range(0, len(grp), batch):
                sel = grp[b0 : b0 + batch]
                C = enum.counts[idx[sel]][:, used].astype(np.float64)
                f = C @ Gu
                if self.factored:  # factors on the prestress: the governing case per column
                    f, u = self._governing_case(f, Fc, sig, (it, ic, zt, zc))
                else:
                    f += Fc
                    u = self._utilisation(f, it, ic, zt, zc)
                k = u.argmax(axis=1)
                r = rows[: len(sel)]
                util[sel] = u[r, k]
                stress[sel] = f[r, k]
                stage[sel] = cs[k]
                station[sel] = cj[k]
                fiber[sel] = cf[k]
        return Evaluation(util, stage, station, fiber, stress, time.perf_counter() - t0)

    def stresses(self, i: int) -> dict[tuple[str, float, str], float]:
        """Every fiber stress of candidate i by (stage key, station x, fiber) (MPa).

        With factors on the prestress: the stress of the case that governs each fiber.
        """
        enum = self.enum
        li, sig = int(self.group[i]), int(enum.sig[i])
        G, Fc, *terms = self._group_terms(li, sig)
        if self.factored:  # the case that governs each fiber, as the full check shows it
            fP = (enum.counts[i].astype(np.float64) @ G)[None, :]
            f = self._governing_case(fP, Fc[None, :], sig, tuple(terms))[0][0]
        else:
            f = enum.counts[i].astype(np.float64) @ G + Fc
        cs, cj, cf = self.columns[sig]
        return {
            (self.specs[s].key, float(self.x[j]), _FIBERS[fb]): float(v)
            for s, j, fb, v in zip(cs, cj, cf, f, strict=True)
        }

    def candidate(self, i: int) -> Candidate:
        """Candidate i as strand rows."""
        return candidate(self.space, self.enum, i)

    def candidate_job(self, i: int | Candidate) -> Job:
        """The job rebuilt with candidate i's pattern."""
        c = self.candidate(i) if isinstance(i, int | np.integer) else i
        return job_with_rows(self.job, c.rows)


# ------------------------------------------------------------------------------------------
# Results


@dataclass(frozen=True)
class Governing:
    """The governing check of a candidate (as ``prestress check`` reports it).

    Attributes:
        stage: the stage key.
        stage_title: the stage in words.
        station: the station's name.
        x: its position from the girder's left end (mm).
        fiber: the fiber.
        stress: the stress there (MPa, tension +).
        limit: the limit of the stress's sign (MPa), or None.
        utilisation: stress / limit (inf when failing without one).
        ok: whether it passes.
    """

    stage: str
    stage_title: str
    station: str
    x: float
    fiber: str
    stress: float
    limit: float | None
    utilisation: float
    ok: bool


@dataclass(frozen=True)
class RankedCandidate:
    """A candidate with its full check.

    Attributes:
        candidate: the pattern.
        ok: whether ``prestress check`` passes it.
        utilisation: its highest utilisation.
        governing: the check with that utilisation.
        failures: the worst failing station of each failing (stage, fiber), worst first.
        vector_utilisation: the highest utilisation the vectorised evaluator found.
        notes: the check's notes (detailing warnings among them).
    """

    candidate: Candidate
    ok: bool
    utilisation: float
    governing: Governing | None
    failures: tuple[Governing, ...]
    vector_utilisation: float
    notes: tuple[str, ...] = ()


@dataclass(frozen=True)
class DesignResult:
    """The outcome of a design search.

    Attributes:
        job: the job searched (as loaded).
        space: the space.
        size: number of candidates searched (after the detailing rules).
        size_before_rules: number of patterns before the detailing rules (debond mode).
        levels: the strand counts of the fill levels searched.
        description: the space in words, (item, text) pairs.
        passing: number of candidates that pass (vectorised check).
        best: the best passing candidates in order of preference, each checked in full.
        next_leaner: the best candidate with the next fewer strands than the leanest passing
            one, with why it fails (None when the leanest is the smallest level).
        closest: when none passes, the candidate of the lowest utilisation.
        timings: seconds: setup, enumerate, evaluate, verify; and the evaluation rate.
        notes: remarks.
    """

    job: Job
    space: DesignSpace
    size: int
    size_before_rules: int
    levels: tuple[int, ...]
    description: tuple[tuple[str, str], ...]
    passing: int
    best: tuple[RankedCandidate, ...]
    next_leaner: RankedCandidate | None
    closest: RankedCandidate | None
    timings: dict[str, float]
    notes: tuple[str, ...] = ()

    @property
    def leanest(self) -> RankedCandidate | None:
        """The leanest passing candidate (the answer), or None."""
        return self.best[0] if self.best else None

    @property
    def ok(self) -> bool:
        """Whether a passing pattern was found."""
        return bool(self.best)


def governing_of(
    result: CheckResult,
) -> tuple[bool, float, Governing | None, tuple[Governing, ...]]:
    """The verdict, highest utilisation, governing check and failures of a full check."""
    best: Governing | None = None
    worst_fail: dict[tuple[str, str], Governing] = {}
    for stage in result.stages:
        for st in stage.stations:
            for fiber, fr in st.fibers.items():
                u = fr.utilisation if fr.utilisation is not None else (0.0 if fr.ok else math.inf)
                lim = fr.compression_limit if fr.stress < 0 else fr.tension_limit
                gv = Governing(
                    stage.key, stage.title, st.name, st.x, fiber, fr.stress, lim, u, fr.ok
                )
                if best is None or u > best.utilisation:
                    best = gv
                if not fr.ok:
                    k = (stage.key, fiber)
                    if k not in worst_fail or u > worst_fail[k].utilisation:
                        worst_fail[k] = gv
    fails = tuple(sorted(worst_fail.values(), key=lambda g: -g.utilisation))
    return result.ok, (best.utilisation if best else 0.0), best, fails


def _describe(space: DesignSpace, enum: Enumeration, system: str) -> tuple[tuple[str, str], ...]:
    """The space in words: (item, text) pairs."""

    def ln(v: float) -> str:
        return show_length(v, system)

    def pos(v: float) -> str:
        return show_length(v, system, long=True)

    per_row = ", ".join(
        f"{ln(h)}: {sum(len(g) for g in gs)}"
        for h, gs in zip(space.heights, space.row_groups, strict=True)
    )
    counts = [lv.strands for lv in enum.levels]
    lines = [
        ("mode", space.mode),
        (
            "grid rows",
            f"{', '.join(ln(h) for h in space.heights)} ({space.sources.get('heights', '')})",
        ),
        (
            "grid positions",
            f"{', '.join(ln(x) for x in space.positions)} ({space.sources.get('positions', '')})",
        ),
        ("positions that fit", f"{per_row} ({space.capacity} in all)"),
        (
            "fill order",
            "rows from the bottom, each from the centre out in symmetric groups "
            "(a pair at ±x, or one strand on the axis)",
        ),
        ("fill levels", f"{len(counts)}, from {counts[0]} to {counts[-1]} strands"),
    ]
    if space.mode == "harp":
        hp = space.harp
        assert hp is not None
        cap = "" if space.max_harped is None else f", at most {space.max_harped}"
        per_row_h = ", ".join(
            f"{ln(h)}: {sum(len(g) for g in gs)}"
            for h, gs in zip(space.heights, space.harp_groups, strict=True)
        )
        lines.append(
            (
                "harped strands",
                "0 to N per level in whole groups, from the highest rows' positions "
                f"nearest the axis{cap}; at most {hp.max_in_column} fit the end column; end height "
                f"{ln(hp.end_height)}, end spacing {ln(hp.end_spacing)}, hold-downs at "
                f"{pos(hp.hold_downs[0])} and {pos(hp.hold_downs[1])} ({hp.source})",
            )
        )
        lines.append(
            (
                "harpable positions",
                "harped strands only from positions whose path to the end column stays inside "
                f"the web (inside the concrete with a strand radius of cover): {per_row_h}",
            )
        )
    if space.mode == "debond":
        r = space.rules
        lines.append(
            (
                "debonding",
                "per row 0..m inner symmetric groups (the outermost filled group "
                "bonded), innermost with the longest length; lengths "
                + ", ".join(pos(v) for v in space.debond_lengths)
                + f" ({space.sources.get('debond_lengths', '')})",
            )
        )
        lines.append(
            (
                "detailing rules",
                "hard constraints: at most "
                f"{100 * r['max_share_row']:.0f} % of a "
                f"row and {100 * r['max_share_total']:.0f} % of all strands debonded; at most "
                f"max({r['max_terminations_count']:g}, {100 * r['max_terminations_share']:.0f} % "
                "of the debonded strands) ending at one section; symmetric; exterior strands of "
                "each row bonded (AASHTO LRFD 9th Ed. (2020) 5.9.4.3.3; the total share is kept "
                "at or below its limit, stricter than the 9th Ed., which allows more with the "
                "strands within the web bonded); the debonded lengths are checked by "
                "'prestress check'",
            )
        )
        lines.append(
            (
                "debonding patterns",
                f"{enum.size_before_rules:,} before the rules; {enum.size:,} within them",
            )
        )
    lines.append(
        (
            "size",
            f"{enum.size:,} candidates, every one checked at every station of every stage "
            "(exhaustive, no sampling)",
        )
    )
    return tuple(lines)


def _ranked(
    ev: Evaluator, i: int, vector_util: float, *, cache: dict[int, RankedCandidate]
) -> RankedCandidate:
    from prestress.analysis import run_check

    if i in cache:
        return cache[i]
    c = ev.candidate(i)
    res = run_check(ev.candidate_job(c), cli_libraries=ev.cli_libraries)
    ok, u, gov, fails = governing_of(res)
    rc = RankedCandidate(c, ok, u, gov, fails, float(vector_util), tuple(res.notes))
    cache[i] = rc
    return rc


def search(
    job: Job,
    design: Any = None,
    *,
    file: str = "",
    cli_libraries: tuple[str, ...] = (),
) -> tuple[DesignResult, Evaluator]:
    """Search the space of ``design`` (the raw ``[design]`` table) for the job.

    Returns:
        The result and the evaluator (for further inspection).
    """
    from prestress.analysis import resolve_girder

    t0 = time.perf_counter()
    file = file or job.file
    girder = resolve_girder(job, cli_libraries=cli_libraries)
    space = read_design(design, job, girder, file=file)
    t1 = time.perf_counter()
    enum = enumerate_space(space, file=file)
    t2 = time.perf_counter()
    ev = Evaluator(job, space, enum, cli_libraries=cli_libraries)
    t3 = time.perf_counter()
    evaluation = ev.evaluate()
    t4 = time.perf_counter()
    notes = list(space.notes) + ev.notes
    util = evaluation.utilisation
    passing = np.flatnonzero(evaluation.ok)
    strands = enum.strands
    cache: dict[int, RankedCandidate] = {}
    best: list[RankedCandidate] = []
    order = passing[
        np.lexsort(
            (util[passing], enum.debonded_length[passing], enum.special[passing], strands[passing])
        )
    ]
    from prestress.jobfile import closest_on_paths

    crossing = 0
    for checked, i in enumerate(order):
        if len(best) >= space.report or checked >= space.report + 20:
            break
        rows = list(ev.candidate(int(i)).rows)
        if closest_on_paths(rows, job.length, job.strand.diameter - 1e-6) is not None:
            crossing += 1  # a harped path through another strand: the layout cannot be built
            continue
        rc = _ranked(ev, int(i), util[i], cache=cache)
        if rc.ok:
            best.append(rc)
        else:
            notes.append(
                f"candidate {int(i)} passed the vectorised check (utilisation {util[i]:.12g}) "
                f"but not the full check ({rc.utilisation:.12g}); left out"
            )
    if crossing:
        notes.append(
            f"{crossing} passing pattern(s) left out: a harped strand's rising path would pass "
            "through another strand (harp the top strands of the central columns)"
        )
    next_leaner = None
    closest = None
    if best:
        fewer = np.flatnonzero(strands < best[0].candidate.strands)
        if len(fewer):
            top = strands[fewer].max()
            at = fewer[strands[fewer] == top]
            # the closest to passing; among equals (to round-off) the least harped or debonded
            j = int(at[np.lexsort((enum.special[at], np.round(util[at], 9)))[0]])
            next_leaner = _ranked(ev, j, util[j], cache=cache)
    elif enum.size:
        j = int(np.argmin(util))
        closest = _ranked(ev, j, util[j], cache=cache)
    for rc in [*best, *([next_leaner] if next_leaner else [])]:
        if abs(rc.utilisation - rc.vector_utilisation) > 1e-9 * max(1.0, abs(rc.utilisation)):
            notes.append(
                f"candidate {rc.candidate.index}: the vectorised utilisation "
                f"{rc.vector_utilisation:.12g} differs from the full check's {rc.utilisation:.12g}"
            )
    t5 = time.perf_counter()
    timings = {
        "read": t1 - t0,
        "enumerate": t2 - t1,
        "setup": t3 - t2,
        "evaluate": t4 - t3,
        "verify": t5 - t4,
        "rate": enum.size / max(evaluation.seconds, 1e-12),
    }
    result = DesignResult(
        job=job,
        space=space,
        size=enum.size,
        size_before_rules=enum.size_before_rules,
        levels=tuple(lv.strands for lv in enum.levels),
        description=_describe(space, enum, job.units),
        passing=len(passing),
        best=tuple(best),
        next_leaner=next_leaner,
        closest=closest,
        timings=timings,
        notes=tuple(notes),
    )
    return result, ev


def load_job_and_design(path: str | Path) -> tuple[Job, Any]:
    """Load a job file and return it with its raw ``[design]`` table (or None)."""
    from prestress import jobfile

    path = Path(path)
    return jobfile.load_job(path), read_toml(path).get("design")


def design_file(path: str | Path, *, cli_libraries: tuple[str, ...] = ()) -> DesignResult:
    """Load a job file with its ``[design]`` table and search (behind ``prestress design``)."""
    job, design = load_job_and_design(path)
    if job.post_tensioned:
        raise InputError(
            "a pretensioned job (strand rows or a strand grid): the search covers strand "
            "patterns, not tendons",
            file=str(path),
            field="tendons",
            got="a post-tensioned girder",
        )
    result, _ev = search(job, design, file=str(path), cli_libraries=cli_libraries)
    return result


# ------------------------------------------------------------------------------------------
# Writing the chosen pattern into a new job file (text-based)


@dataclass(frozen=True)
class _Segment:
    kind: str  # "header", "kv", "comment", "blank"
    start: int
    end: int
    path: tuple[str, ...] = ()  # header: the table's path; kv: the key (relative)


def _key_path(text: str) -> tuple[str, ...]:
    """The dotted key of a TOML header or key, unquoted (parsed by tomllib itself)."""
    data = tomllib.loads(f"{text.strip()} = 0")
    path = []
    while isinstance(data, dict):
        (k, data), *_ = data.items()
        path.append(k)
    return tuple(path)


def _skip_string(text: str, i: int) -> int:
    """Index just past the TOML string starting at i (basic, literal or multi-line)."""
    for q in ('"""', "'''"):
        if text.startswith(q, i):
            j = i + 3
            while True:
                k = text.find(q, j)
                if k < 0:
                    return len(text)
                if q == '"""':
                    bs = 0
                    while text[k - 1 - bs] == "\\":
                        bs += 1
                    if bs % 2:
                        j = k + 1
                        continue
                run = 0
                while k + run < len(text) and text[k + run] == q[0]:
                    run += 1
                return k + min(run, 5)  # up to two quotes may end the content
    q = text[i]
    j = i + 1
    while j < len(text):
        c = text[j]
        if q == '"' and c == "\\":
            j += 2
            continue
        if c in (q, "\n"):
            return j + 1
        j += 1
    return j


def _eol(text: str, i: int) -> int:
    """Index just past the end of the line containing i."""
    k = text.find("\n", i)
    return len(text) if k < 0 else k + 1


def _segments(text: str) -> list[_Segment]:
    """The TOML document cut into headers, key/value statements, comments and blank lines."""
    out: list[_Segment] = []
    i, n = 0, len(text)
    while i < n:
        j = i
        while j < n and text[j] in " \t":
            j += 1
        if j >= n or text[j] in "\r\n":
            end = _eol(text, j)
            out.append(_Segment("blank", i, end))
            i = end
            continue
        if text[j] == "#":
            end = _eol(text, j)
            out.append(_Segment("comment", i, end))
            i = end
            continue
        if text[j] == "[":
            double = text.startswith("[[", j)
            k = j + (2 if double else 1)
            name_start = k
            while k < n and text[k] != "]":
                if text[k] in "\"'":
                    k = _skip_string(text, k)
                    continue
                k += 1
            name = text[name_start:k]
            end = _eol(text, k)
            out.append(_Segment("header", i, end, _key_path(name)))
            i = end
            continue
        # key = value
        k = j
        while k < n and text[k] != "=":
            if text[k] in "\"'":
                k = _skip_string(text, k)
                continue
            if text[k] == "\n":
                raise ValueError("a key without a value")
            k += 1
        key = _key_path(text[j:k])
        k += 1
        depth = 0
        while k < n:
            c = text[k]
            if c in "\"'":
                k = _skip_string(text, k)
                continue
            if c == "#":
                k = text.find("\n", k)
                k = n if k < 0 else k
                continue
            if c in "[{":
                depth += 1
            elif c in "]}":
                depth -= 1
            elif c == "\n" and depth <= 0:
                k += 1
                break
            k += 1
        out.append(_Segment("kv", i, k, key))
        i = k
    return out


def _fmt_len(v: float, system: str, *, long: bool = False) -> str:
    """A length as a TOML string with its unit: in/ft (US) or mm/m (SI)."""
    if system == "SI":
        return f'"{v / 1000.0:.10g} m"' if long else f'"{v:.10g} mm"'
    return f'"{v / FOOT_MM:.10g} ft"' if long else f'"{v / INCH_MM:.10g} in"'


def rows_toml(rows: tuple[StrandRow, ...] | list[StrandRow], system: str) -> str:
    """The strand rows as ``[[strands.rows]]`` tables (plain string building, units given)."""
    out = []
    for r in rows:
        xs = tuple(r.x) if r.x else tuple(float(v) for v in r.x_positions())
        lines = ["[[strands.rows]]", f"height = {_fmt_len(r.height, system)}"]
        pitch = DEFAULT_PITCH.get(system, DEFAULT_PITCH["US"])
        even = all(abs(x - (k - (len(xs) - 1) / 2.0) * pitch) <= _TOL_MM for k, x in enumerate(xs))
        if even:
            lines += [f"count = {len(xs)}", f"spacing = {_fmt_len(pitch, system)}"]
        else:
            lines.append("positions = [" + ", ".join(_fmt_len(x, system) for x in xs) + "]")
        if r.harp is not None:
            end, (a, b), step = r.harp
            lines.append(
                f"harp = {{ end_height = {_fmt_len(end, system)}, hold_downs = "
                f"[{_fmt_len(a, system, long=True)}, {_fmt_len(b, system, long=True)}], "
                f"end_spacing = {_fmt_len(step, system)} }}"
            )
        if r.debond:
            items = []
            for idx, left, right in r.debond:
                pos = ", ".join(str(k + 1) for k in idx)
                if abs(left - right) <= _TOL_MM:
                    items.append(
                        f"{{ positions = [{pos}], length = {_fmt_len(left, system, long=True)} }}"
                    )
                else:
                    items.append(
                        f"{{ positions = [{pos}], left = {_fmt_len(left, system, long=True)}, "
                        f"right = {_fmt_len(right, system, long=True)} }}"
                    )
            lines.append("debond = [" + ", ".join(items) + "]")
        out.append("\n".join(lines) + "\n")
    return "\n".join(out)


def _is_strands_pattern(path: tuple[str, ...]) -> bool:
    return len(path) >= 2 and path[0] == "strands" and path[1] in ("rows", "grid")


def design_job_text(
    original_text: str,
    rows: tuple[StrandRow, ...],
    system: str,
    *,
    title: str = "",
    keep_design: bool = False,
) -> str:
    """The original job text with its strand rows and grid replaced by ``rows``.

    Everything else is kept as written, comments included. The ``[design]`` table is kept
    as a comment unless ``keep_design`` (``prestress check`` does not read it). The result is
    verified: parsed, it equals the original with only the strand pattern changed.

    Raises:
        ValueError: when the strand tables cannot be rewritten as text.
    """
    segs = _segments(original_text)
    section: tuple[str, ...] = ()
    tags: list[str] = []  # per segment: "keep", "drop", "design"
    paths: list[tuple[str, ...]] = []
    for s in segs:
        if s.kind == "header":
            section = s.path
            full = s.path
        elif s.kind == "kv":
            full = section + s.path
        else:
            full = section
        paths.append(full)
        if s.kind in ("header", "kv") and _is_strands_pattern(full):
            tags.append("drop")
        elif s.kind in ("header", "kv") and full[:1] == ("design",) and not keep_design:
            tags.append("design")
        elif s.kind in ("comment", "blank") and (
            _is_strands_pattern(section) or (section[:1] == ("design",) and not keep_design)
        ):
            tags.append("drop" if _is_strands_pattern(section) else "design")
        else:
            tags.append("keep")
    # comments and blank lines ending a dropped section stay when a kept table follows
    for k in range(len(segs) - 1, -1, -1):
        if tags[k] not in ("drop", "design") or segs[k].kind not in ("comment", "blank"):
            continue
        m = k + 1
        while m < len(segs) and segs[m].kind in ("comment", "blank"):
            m += 1
        if m >= len(segs) or (segs[m].kind == "header" and tags[m] == "keep"):
            tags[k] = "keep"
    head = "# strand pattern written by prestress design"
    block = f"{head}{': ' + title if title else ''}\n" + rows_toml(rows, system)
    out: list[str] = []
    inserted = False
    design_noted = False
    after_block = False
    for s, tag in zip(segs, tags, strict=True):
        piece = original_text[s.start : s.end]
        if tag == "drop":
            if not inserted:
                out.append(block)
                inserted = after_block = True
            continue
        if after_block:
            if s.kind != "blank":
                out.append("\n")
            after_block = False
        if tag == "design":
            if not design_noted:
                out.append(
                    "# the [design] table of the search, kept as a comment "
                    "(prestress check does not read it):\n"
                )
                design_noted = True
            out.append("".join(f"# {ln}\n" for ln in piece.rstrip("\n").split("\n")))
            continue
        out.append(piece)
    if not inserted:
        raise ValueError("no [[strands.rows]] or [strands.grid] tables to replace")
    text = "".join(out)
    if not text.endswith("\n"):
        text += "\n"
    expected = copy.deepcopy(tomllib.loads(original_text))
    expected.setdefault("strands", {})
    expected["strands"].pop("grid", None)
    expected["strands"]["rows"] = tomllib.loads(rows_toml(rows, system))["strands"]["rows"]
    if not keep_design:
        expected.pop("design", None)
    try:
        got = tomllib.loads(text)
    except tomllib.TOMLDecodeError as exc:
        raise ValueError(f"the rewritten text is not valid TOML ({exc})") from None
    if got != expected:
        raise ValueError("the rewritten text does not keep the rest of the job as it was")
    return text


def write_design_job(
    original_toml_path: str | Path,
    candidate: Candidate | RankedCandidate,
    out_path: str | Path,
    *,
    force: bool = False,
    keep_design: bool = False,
    inputs: list[Path] | None = None,
) -> Path:
    """Write a new job file: the original, with the candidate's pattern as its strand rows.

    The text of the original is kept as it was except its ``[[strands.rows]]`` and
    ``[strands.grid]`` tables, replaced by the candidate's rows (values with units, in the
    job's unit system), and its ``[design]`` table, kept as a comment unless ``keep_design``.
    The file is written atomically.

    Raises:
        InputError: when out_path is the input file, exists without ``force``, or the
            original's strand tables cannot be rewritten as text.
    """
    from prestress.atomic import check_output_path, write_atomic

    src, target = Path(original_toml_path), Path(out_path)
    # never over the original, nor any other file it reads (``inputs``, e.g. its limit set)
    check_output_path(target, inputs=[src, *(inputs or [])], force=force)
    c = candidate.candidate if isinstance(candidate, RankedCandidate) else candidate
    raw = src.read_bytes().decode("utf-8")
    data = read_toml(src)
    system = data.get("job", {}).get("units", "US") if isinstance(data.get("job"), dict) else "US"
    system = system if system in ("US", "SI") else "US"
    special = (
        f", {c.harped} harped" if c.harped else (f", {c.debonded} debonded" if c.debonded else "")
    )
    try:
        text = design_job_text(
            raw,
            c.rows,
            system,
            title=f"{c.strands} strands{special}",
            keep_design=keep_design,
        )
    except ValueError as exc:
        raise InputError(
            "a job whose strand pattern is given in [[strands.rows]] or [strands.grid] tables "
            f"that can be rewritten as text ({exc})",
            file=str(src),
            field="strands",
        ) from None
    text = _relocate_paths(text, src.resolve().parent, target.resolve().parent)
    write_atomic(target, text)
    return target


def _relocate_paths(text: str, src_dir: Path, dest_dir: Path) -> str:
    """Keep the job's relative references valid when the new job is written elsewhere.

    ``limits.file`` and ``job.section_libraries`` are rewritten relative to the new file's
    folder.
    """
    import os
    import re

    if src_dir == dest_dir:
        return text

    def fix(path_text: str) -> str:
        if Path(path_text).is_absolute():
            return path_text
        return Path(os.path.relpath(src_dir / path_text, dest_dir)).as_posix()

    out, table = [], ""
    for line in text.splitlines(keepends=True):
        head = re.match(r"^\s*\[+\s*([A-Za-z0-9_.\- ]+?)\s*\]+", line)
        if head:
            table = head.group(1).strip()
        m = re.match(r'^(\s*file\s*=\s*")([^"]*)(".*)$', line, re.S)
        if table == "limits" and m:
            line = m.group(1) + fix(m.group(2)) + m.group(3)
        m = re.match(r"^(\s*section_libraries\s*=\s*\[)(.*)(\].*)$", line, re.S)
        if table == "job" and m:
            items = re.sub(r'"([^"]*)"', lambda mm: '"' + fix(mm.group(1)) + '"', m.group(2))
            line = m.group(1) + items + m.group(3)
        out.append(line)
    return "".join(out)
