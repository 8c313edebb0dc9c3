"""The first calculation path: resolve the girder, compute losses, stage stresses and checks.

Flow: :func:`resolve_girder` (library → polygon → gross and composite properties)
→ :func:`prestress.losses.compute_losses` → :func:`stage_transfer` and
:func:`stage_service` (fiber stresses at stations) → :func:`check_fiber` (limits).
Everything in the internal system (N, mm, MPa, N*mm). Sign convention: tension positive,
compression negative; eccentricity positive below the centroid; sagging moment positive.
"""

from __future__ import annotations

import math
from dataclasses import dataclass, field, replace
from pathlib import Path

import numpy as np

from prestress.errors import InputError
from prestress.losses import LossBreakdown, compute_losses
from prestress.model import FiberLimit, Job, PrestressFactors
from prestress.sections.composite import (
    AssembledSection,
    StrandLayer,
    composite,
    noncomposite,
    transformed_composite,
    transformed_girder,
)
from prestress.sections.properties import GrossProperties, ResolvedSection
from prestress.stages import LoadEffects, ZoneStation, fiber_stress  # noqa: F401  (re-exported)
from prestress.units import KSI_MPA, in_both, show_dimension

SIGN_CONVENTION = "tension +, compression −"


@dataclass(frozen=True)
class Girder:
    """A job with its section resolved: polygon, gross and composite properties (mm).

    Attributes:
        job: the job.
        section_name: the section's name.
        section_source: where the shape comes from.
        outline: the girder's outline (mm) and gross properties, as resolved (``polygon``
            gives the shapely polygon).
        gross: gross properties of the girder.
        girder_section: the non-composite section used for stresses (gross).
        composite_section: the composite section (deck transformed), or None without a deck.
        n_deck: modular ratio of the deck to the girder concrete (final moduli).
        self_weight: girder self-weight per length, N/mm.
        deck_weight: deck, haunch and other non-composite load per length, N/mm.
        notices: remarks from resolving (e.g. a user section overriding a shipped one).
    """

    job: Job
    section_name: str
    section_source: str
    outline: ResolvedSection
    gross: GrossProperties
    girder_section: AssembledSection
    composite_section: AssembledSection | None
    n_deck: float
    self_weight: float
    deck_weight: float
    notices: tuple[str, ...] = ()
    basis: str = "gross"
    section_transfer: AssembledSection | None = None
    section_service: AssembledSection | None = None
    section_composite: AssembledSection | None = None
    family: str = ""

    @property
    def polygon(self):
        """The shapely polygon of the girder (mm)."""
        return self.outline.polygon()

    @property
    def eccentricity_gross(self) -> float:
        """Eccentricity of the strand centroid below the gross centroid (mm)."""
        return self.gross.yb - self.job.y_ps

    def eccentricity(self, sec: AssembledSection) -> float:
        """Eccentricity of the strand centroid below a section's centroid (mm)."""
        return sec.yb - self.job.y_ps


def resolve_girder(job: Job, *, cli_libraries: tuple[str, ...] = ()) -> Girder:
    """Find the job's section, build and check its geometry, and compute its properties."""
    from prestress.sections.library import load_library, search_folders
    from prestress.sections.properties import resolve_definition

    notices: list[str] = []
    ref = job.section
    if ref.family is not None:
        assert ref.dimensions is not None
        resolved = resolve_definition(
            ref.family, ref.dimensions, file=job.file, field="girder.section.dimensions"
        )
        name, source, family = ref.name, "defined in the job file", ref.family
    else:
        lib = load_library(search_folders(job.library_paths, cli_libraries))
        entry = lib.get(ref.name, file=job.file, field="girder.section")
        notices += [n for n in lib.notices if entry.name.lower() in n.lower()]
        resolved = resolve_definition(
            entry.family, entry.dimensions, file=entry.file, field=f"{entry.field}.dimensions"
        )
        name, source, family = entry.name, entry.source, entry.family
    notices += _check_strands_inside(job, resolved)
    if job.layout is not None and any(s.y_end is not None for s in job.layout.sets):
        # harped strands: their whole path inside the concrete (shapely only for them)
        from prestress.layout import check_harp_paths

        check_harp_paths(
            job.layout,
            resolved.polygon(),
            job.strand.diameter / 2.0,
            file=job.file,
            system=job.units,
        )
    for concrete in (job.girder_concrete, job.deck.concrete if job.deck else None):
        if concrete is not None and concrete.modulus_note:
            notices.append(concrete.modulus_note)
    gross = resolved.gross
    girder_section = noncomposite(gross)
    comp = None
    n_deck = 1.0
    deck_weight = job.loads.other_noncomposite
    if job.deck is not None:
        deck = job.deck
        if deck.haunch > 0 and deck.haunch_width == 0.0:
            deck = _with_haunch_width(deck, gross.top_width)
            job = _replace_deck(job, deck)
        n_deck = deck.concrete.Ec / job.girder_concrete.Ec
        comp = composite(gross, deck, n_deck)
        w = deck.concrete.unit_weight
        deck_weight += w * (deck.thickness + deck.wearing_surface) * deck.tributary_width
        deck_weight += w * deck.haunch * deck.haunch_width
    sec_t, sec_s, sec_c = girder_section, girder_section, comp
    if job.post_tensioned:  # at stressing the ducts are open: the girder net of the ducts
        from prestress.sections.composite import section_at_stressing

        sec_t, open_ducts = section_at_stressing(gross, job.tendons, job.length / 2.0)
        notices.append(open_ducts)
    if job.loss_basis == "transformed":
        gc = job.girder_concrete
        assert gc.Eci is not None
        # strands at their midlength heights (harped strands: between the hold-downs)
        layers = [StrandLayer(r.count * job.strand.area, r.height) for r in job.rows]
        approximations = []
        if any(r.harp is not None for r in job.rows):
            approximations.append("near the ends of harped strands")
        if job.layout is not None and any(s.debonded for s in job.layout.sets):
            approximations.append("over the debonded lengths")
        notices.append(
            "transformed sections include every strand at its midlength height all along the "
            "girder"
            + (f" (an approximation {' and '.join(approximations)})" if approximations else "")
            + "; the prestress of every stage, the losses after deck placement included, acts "
            "on the girder alone (common simplification)"
        )
        sec_t = transformed_girder(
            gross, layers, job.strand.Ep / gc.Eci, "girder, transformed at transfer (Eci)"
        )
        sec_s = transformed_girder(
            gross, layers, job.strand.Ep / gc.Ec, "girder, transformed in service (Ec)"
        )
        if job.deck is not None:
            sec_c = transformed_composite(gross, job.deck, n_deck, layers, job.strand.Ep / gc.Ec)
    job = _with_distribution_factor(job, gross, comp, n_deck)
    return Girder(
        job=job,
        section_name=name,
        section_source=source,
        outline=resolved,
        gross=gross,
        girder_section=girder_section,
        composite_section=comp,
        n_deck=n_deck,
        self_weight=gross.area * job.girder_concrete.unit_weight,
        deck_weight=deck_weight,
        notices=tuple(notices),
        basis=job.loss_basis,
        section_transfer=sec_t,
        section_service=sec_s,
        section_composite=sec_c,
        family=family or "",
    )


def _with_haunch_width(deck, width):  # type: ignore[no-untyped-def]
    return replace(deck, haunch_width=width)


def _replace_deck(job: Job, deck) -> Job:  # type: ignore[no-untyped-def]
    return replace(job, deck=deck)


def _with_distribution_factor(job: Job, gross: GrossProperties, comp, n_deck: float) -> Job:  # type: ignore[no-untyped-def]
    """Compute the HL-93 distribution factors by AASHTO LRFD 4.6.2.2 where the job asks.

    Moment: Table 4.6.2.2.2b-1 (interior) or 4.6.2.2.2d-1 (exterior), with the skew reduction
    of Table 4.6.2.2.2e-1. Shear: Table 4.6.2.2.3a-1 (interior) or 4.6.2.2.3b-1 (exterior),
    with the skew correction of Table 4.6.2.2.3c-1 applied along the whole span (the table
    gives it for the obtuse corner; applying it everywhere errs on the safe side).
    """
    live = job.loads.live
    moment_wanted = live.model == "HL-93" and live.distribution_factor is None
    shear_wanted = (
        live.model == "HL-93" and live.shear_distribution_factor is None and live.shear_by_aashto
    )
    if not (moment_wanted or shear_wanted):
        return job
    from prestress.codes.aashto_lrfd import live_load as ll
    from prestress.units import FOOT_MM

    field = "loads.live.distribution_factor"
    if job.spacing is None or job.deck is None:
        raise InputError(
            "girder.spacing and a [deck] to compute the distribution factor "
            "(AASHTO LRFD 4.6.2.2.2b-1)",
            file=job.file,
            field=field,
        )
    deck = job.deck
    e_g = gross.yt + deck.haunch + deck.thickness / 2.0  # girder centroid to deck centroid
    n = 1.0 / n_deck  # 4.6.2.2.1-2: n = E_beam / E_deck
    Kg = ll.K_g(n, gross.Ix / INCH4, gross.area / INCH2, e_g / 25.4)
    S, L, ts = job.spacing / FOOT_MM, job.span / FOOT_MM, deck.thickness / 25.4
    N_b = live.girders
    exterior = job.position == "exterior"
    try:
        m_one = ll.g_moment_interior_one_lane(S, L, ts, Kg, N_b)
        m_multi = ll.g_moment_interior_multi_lane(S, L, ts, Kg, N_b)
        v_one = ll.g_shear_interior_one_lane(S, L, ts, Kg, N_b)
        v_multi = ll.g_shear_interior_multi_lane(S, L, ts, Kg, N_b)
        skew_m = ll.skew_factor_moment(live.skew_deg, S, L, ts, Kg, N_b) if live.skew_deg else 1.0
        skew_v = ll.skew_factor_shear(live.skew_deg, S, L, ts, Kg, N_b) if live.skew_deg else 1.0
        if exterior:
            if live.curb_distance is None:
                raise InputError(
                    "the distance de from the exterior web to the curb, for an exterior girder",
                    file=job.file,
                    field="loads.live.curb_distance",
                )
            d_e = live.curb_distance / FOOT_MM
            lever = ll.g_exterior_lever_rule(S, d_e)
            m_one, m_multi = lever, ll.e_moment_exterior(d_e) * m_multi
            v_one, v_multi = lever, ll.e_shear_exterior(d_e) * v_multi
    except (ValueError, TypeError) as exc:
        raise InputError(
            f"inputs within the range of AASHTO LRFD Tables 4.6.2.2.2b-1 and 4.6.2.2.3a-1 ({exc})",
            file=job.file,
            field=field,
        ) from None
    ed = "AASHTO LRFD 9th Ed. (2020)"
    if exterior:
        m_head = (
            f"{ed} 4.6.2.2.2d, exterior girder: one lane by the lever rule {m_one:.3f} "
            f"(m = 1.2), two or more lanes e × interior {m_multi:.3f}"
        )
        v_head = (
            f"{ed} 4.6.2.2.3b, exterior girder: one lane by the lever rule {v_one:.3f} "
            f"(m = 1.2), two or more lanes e × interior {v_multi:.3f}"
        )
    else:
        m_head = (
            f"{ed} Table 4.6.2.2.2b-1, interior girder: one lane {m_one:.3f}, "
            f"two or more {m_multi:.3f}"
        )
        v_head = (
            f"{ed} Table 4.6.2.2.3a-1, interior girder: one lane {v_one:.3f}, "
            f"two or more {v_multi:.3f}"
        )
    if moment_wanted:
        g = max(m_one, m_multi) * skew_m
        skew_text = f", skew × {skew_m:.3f}" if skew_m != 1 else ""
        source = f"{m_head}{skew_text}; Kg = {Kg:,.0f} in⁴"
        live = replace(live, distribution_factor=g, distribution_source=source)
    if shear_wanted:
        g_v = max(v_one, v_multi) * skew_v
        source_v = v_head + (
            f", skew × {skew_v:.3f} (Table 4.6.2.2.3c-1, applied along the span)"
            if skew_v != 1
            else ""
        )
        live = replace(live, shear_distribution_factor=g_v, shear_distribution_source=source_v)
    return replace(job, loads=replace(job.loads, live=live))


INCH2 = 25.4**2
INCH4 = 25.4**4


def _inside(rings: list[np.ndarray], x: float, y: float) -> bool:
    """Whether a point lies inside a polygon with holes (even-odd ray casting)."""
    inside = False
    for ring in rings:
        xs, ys = ring[:-1, 0], ring[:-1, 1]
        x2, y2 = ring[1:, 0], ring[1:, 1]
        crosses = (ys > y) != (y2 > y)
        with np.errstate(divide="ignore", invalid="ignore"):
            xi = xs + (y - ys) * (x2 - xs) / (y2 - ys)
        inside ^= bool(np.count_nonzero(crosses & (x < xi)) % 2)
    return inside


def _distance_to_edges(rings: list[np.ndarray], x: float, y: float) -> float:
    """Shortest distance from a point to the polygon's edges (mm)."""
    best = np.inf
    for ring in rings:
        a, b = ring[:-1], ring[1:]
        d = b - a
        L2 = np.maximum((d**2).sum(axis=1), 1e-30)
        t = np.clip(((x - a[:, 0]) * d[:, 0] + (y - a[:, 1]) * d[:, 1]) / L2, 0.0, 1.0)
        px, py = a[:, 0] + t * d[:, 0], a[:, 1] + t * d[:, 1]
        best = min(best, float(np.sqrt((px - x) ** 2 + (py - y) ** 2).min()))
    return best


#: AASHTO LRFD 9th Ed. (2020) Table 5.10.3.3.1-1 (from memory): least centre-to-centre
#: spacing of pretensioning strands, in., for nominal strand diameters up to the first value,
#: in. (0.52 in: the "0.5 in special" strand).
MIN_STRAND_SPACING_IN = ((0.52, 1.75), (0.60, 2.00))

#: Strand spacings this much (mm) below the minimum pass: the 50 mm pitch of metric casting
#: beds stands for the 2 in of the table (common practice).
STRAND_SPACING_TOLERANCE_MM = 1.0

STRAND_SPACING_CLAUSE = "AASHTO LRFD 9th Ed. (2020) 5.10.3.3.1, Table 5.10.3.3.1-1, from memory"


def minimum_strand_spacing(diameter: float) -> tuple[float, str]:
    """The least centre-to-centre spacing of pretensioning strands (mm) and its basis in words.

    AASHTO LRFD 9th Ed. (2020) 5.10.3.3.1 (from memory): within the transfer length at each
    end, strands not less apart than 1.33 × the maximum aggregate size, clear, nor than the
    centre-to-centre spacing of Table 5.10.3.3.1-1: 1.75 in for strands up to 0.5 in (0.52 in
    "special" included), 2.00 in for 0.6 in strands. Larger strands: 2.00 in × d_b / 0.6 in
    (an extrapolation of this project, not the table's). The aggregate limit is not applied
    (a job gives no aggregate size).

    Args:
        diameter: the nominal strand diameter d_b, mm.
    """
    from prestress.units import INCH_MM

    d_in = diameter / INCH_MM
    for up_to, spacing in MIN_STRAND_SPACING_IN:
        if d_in <= up_to + 1e-3:
            return spacing * INCH_MM, STRAND_SPACING_CLAUSE
    spacing = MIN_STRAND_SPACING_IN[-1][1] * d_in / MIN_STRAND_SPACING_IN[-1][0]
    return spacing * INCH_MM, (
        f"{STRAND_SPACING_CLAUSE}, scaled from 2.00 in for 0.6 in strands by d_b "
        "(an extrapolation of this project)"
    )


def strand_spacing_notes(job: Job) -> list[str]:
    """Detailing notes on strands closer than the minimum spacing (a note, not an error).

    Checked at midlength and at the girder ends (harped strands in their column on the
    axis), one note per pair of rows (two strands of one row: one note for the row) with the
    closest two strands; values in both systems, the job's first (notes are written before
    ``--units`` is known). Strands nearer than one diameter are refused when the job is read
    (:func:`prestress.jobfile.load_job`); a job built otherwise (the design search's
    candidates) gets this note for them too.
    """
    from prestress.jobfile import closest_strands, strand_places

    if not job.rows:
        return []
    least, basis = minimum_strand_spacing(job.strand.diameter)

    def both(v: float) -> str:
        return in_both(job.units, show_dimension(v, "US"), show_dimension(v, "SI"))

    def show(v: float) -> str:
        return show_dimension(v, job.units)

    def label(i: int) -> str:
        return f"row {i + 1} (at {show_dimension(job.rows[i].height, job.units)})"

    mid, ends = strand_places(job.rows)
    harped = {i for i, r in enumerate(job.rows) if r.harp is not None}
    notes = []
    for where, places in (("at midlength", mid), ("at the girder ends", ends)):
        close = closest_strands(places, least - STRAND_SPACING_TOLERANCE_MM)
        for (a, b), (dist, pa, pb) in close.items():
            if not harped & {a, b}:
                if places is ends:
                    continue  # straight strands: as at midlength, reported once
                place = "all along the girder"
            else:
                place = where
            rows = f"{label(a)}" if a == b else f"{label(a)} and {label(b)}"
            notes.append(
                f"detailing: {rows}: two strands {both(dist)} apart centre to centre {place} "
                f"(x = {show(pa[0])}, y = {show(pa[1])} and x = {show(pb[0])}, "
                f"y = {show(pb[1])}), less than {both(least)}, the least spacing of "
                f"{show_dimension(job.strand.diameter, job.units)} strands ({basis}; its "
                "clear distance of 1.33 × the aggregate size is not checked)"
            )
    return notes


def _check_strands_inside(job: Job, outline: ResolvedSection) -> list[str]:
    """Every strand (and duct) must lie inside the concrete with its radius of cover.

    Checked at midlength and, for harped rows, at the girder ends too; tendons along their
    profile on the girder's axis.

    Returns:
        Detailing notes on the strands' spacing (:func:`strand_spacing_notes`).
    """
    rings = [np.asarray(outline.exterior, dtype=float)]
    rings += [np.asarray(h, dtype=float) for h in outline.holes]

    def ok(x: float, y: float, r: float) -> bool:  # a cover of exactly r, to round-off, is r
        return _inside(rings, x, y) and _distance_to_edges(rings, x, y) >= r - 1e-6

    for i, t in enumerate(job.tendons):
        prof = t.profile()
        xs = np.linspace(prof.x_start_mm, prof.x_end_mm, 41)
        r = max(t.duct_diameter, job.strand.diameter) / 2.0
        for y in np.asarray(prof.height(xs)):
            if not ok(0.0, float(y), r):
                raise InputError(
                    "a tendon profile inside the concrete with the duct's radius of cover",
                    file=job.file,
                    field=f"tendons[{i}].points",
                    got=f"a point at y = {show_dimension(y, job.units)} on the girder axis",
                )
    for i, row in enumerate(job.rows):
        points = [(float(x), row.height, False) for x in row.x_positions()]
        if row.harp is not None:  # at the ends: one column on the axis
            points += [(0.0, row.harp[0] - k * row.harp[2], True) for k in range(row.count)]
        for x, y, at_end in points:
            if not ok(x, y, job.strand.diameter / 2.0):
                where = f"x = {show_dimension(x, job.units)}, y = {show_dimension(y, job.units)}"
                if at_end:
                    raise InputError(
                        "the end column of the harped strands inside the concrete with a strand "
                        "radius of cover (end_height, and end_spacing below it, on the axis)",
                        file=job.file,
                        field=f"strands.rows[{i}].harp.end_height",
                        got=f"a strand at the girder ends at {where} outside the section",
                    )
                raise InputError(
                    "every strand inside the concrete (row width (count − 1) × spacing must fit "
                    "the section at that height)",
                    file=job.file,
                    field=f"strands.rows[{i}]",
                    got=f"a strand at {where} outside the section",
                )
    return strand_spacing_notes(job)


# ------------------------------------------------------------------------------------------
# Stations, stresses and checks


@dataclass(frozen=True)
class FiberResult:
    """Stress at one fiber with its limits (MPa) and the check.

    Attributes:
        stress: the fiber stress (tension +, compression −).
        compression_limit: the compression limit as a negative stress, or None.
        tension_limit: the tension limit as a positive stress, or None.
        utilisation: stress / limit of the same sign (None when no limit of that sign applies).
        ok: whether the fiber passes.
        limit_text: the limits in words, e.g. "0.65 f'ci; 0.24√f'ci (ksi)".
        prestress_factor: where the limit set factors the prestress (EN 1992-1-1 5.10.9), the
            factor of the case that governs this fiber; None for the mean prestress alone.
    """

    stress: float
    compression_limit: float | None
    tension_limit: float | None
    utilisation: float | None
    ok: bool
    limit_text: str
    prestress_factor: float | None = None  # the limit set's factor on P that governs, if any

    def rank(self) -> tuple[float, float] | None:
        """How close the fiber is to its limits, to find the governing one (larger: closer).

        First the utilisation (a failing fiber without a limit of its sign counts as
        infinitely used); then, to tell apart fibers of equal utilisation (a zero tension
        limit, as in decompression, gives 0 in compression and "failing" in tension), the
        distance in MPa by which the stress passes the limit that binds it: the tension
        limit in tension or where only a tension limit is set, else the compression limit.
        None where the fiber is not checked.
        """
        u = self.utilisation if self.utilisation is not None else (None if self.ok else np.inf)
        if u is None:
            return None
        if self.tension_limit is not None and (
            self.stress >= 0.0 or self.compression_limit is None
        ):
            return (float(u), self.stress - self.tension_limit)
        if self.compression_limit is not None:
            return (float(u), self.compression_limit - self.stress)
        return (float(u), 0.0)


def rank_beats(a: tuple[float, float], b: tuple[float, float] | None) -> bool:
    """Whether rank a (:meth:`FiberResult.rank`) is clearly higher than rank b.

    Beyond round-off (relative 1e-9), so that ties (the two halves of a symmetric girder)
    go to the first station in any unit system.
    """
    if b is None:
        return True
    finite = math.isfinite(a[0]) and math.isfinite(b[0])
    if a[0] == b[0] or (finite and abs(a[0] - b[0]) <= 1e-9 * abs(b[0]) + 1e-12):
        return a[1] > b[1] + 1e-9 * abs(b[1]) + 1e-9
    return a[0] > b[0]  # an infinite utilisation (a zero limit exceeded) beats any finite one


@dataclass(frozen=True)
class StationResult:
    """One station of one stage."""

    name: str
    x: float  # from the girder's left end, mm
    x_bearing: float | None  # from the left bearing, mm (service stages)
    force: float  # prestress force acting, N
    eccentricity: float  # mm, positive below the girder centroid
    moments: dict[str, float]  # factored moments by load, N*mm
    fibers: dict[str, FiberResult]
    cgs: float | None = None  # height of the cgs above the girder bottom, mm

    @property
    def ok(self) -> bool:
        """Whether every fiber passes."""
        return all(f.ok for f in self.fibers.values())

    @property
    def moment(self) -> float:
        """Total factored moment, N*mm."""
        return sum(self.moments.values())

    def governing(self) -> tuple[str, float] | None:
        """The fiber with the highest utilisation and that utilisation."""
        best = None
        for name, f in self.fibers.items():
            r = f.rank()
            if r is not None and rank_beats(r, None if best is None else best[1]):
                best = (name, r)
        return None if best is None else (best[0], best[1][0])


@dataclass(frozen=True)
class StageResult:
    """One stage (or service case) of the check."""

    key: str
    title: str
    description: str
    strength_text: str
    stations: tuple[StationResult, ...]
    notes: tuple[str, ...] = ()
    limits_key: str = ""  # the stage whose limits apply ("" : the key itself)

    @property
    def ok(self) -> bool:
        """Whether every station passes."""
        return all(s.ok for s in self.stations)

    def governing(self) -> tuple[StationResult, str, float] | None:
        """The station and fiber of the highest utilisation."""
        best = None
        for s in self.stations:
            g = s.governing()
            if g is None:
                continue
            r = s.fibers[g[0]].rank()
            assert r is not None
            if rank_beats(r, None if best is None else best[0]):
                best = (r, s, g[0], g[1])
        return None if best is None else best[1:]

    def governing_at(self, fiber: str) -> tuple[StationResult, float, FiberResult] | None:
        """The station of the highest utilisation of one fiber, that utilisation and result.

        A failing fiber with no limit of its sign counts as infinitely used; None where the
        fiber is nowhere checked.
        """
        best = None
        for st in self.stations:
            fr = st.fibers.get(fiber)
            r = None if fr is None else fr.rank()
            if r is not None and rank_beats(r, None if best is None else best[0]):
                best = (r, st, fr)
        return None if best is None else (best[1], best[0][0], best[2])


@dataclass(frozen=True)
class CheckResult:
    """Everything ``prestress check`` shows."""

    girder: Girder
    losses: LossBreakdown
    stages: tuple[StageResult, ...]
    notes: tuple[str, ...] = field(default_factory=tuple)
    zone: tuple[ZoneStation, ...] = ()
    loads: LoadEffects | None = None
    conditions: tuple[str, ...] = ()  # what a pass presupposes (bonded steel, left-out stresses)
    other_failures: tuple[str, ...] = ()  # limits exceeded outside the stages (tendon stresses)

    @property
    def ok(self) -> bool:
        """Whether every stage passes and no other limit is exceeded."""
        return all(s.ok for s in self.stages) and not self.other_failures

    def failures(self) -> list[str]:
        """What fails, in words: each failing stage and its count of stations, then the rest."""
        return [
            f"{s.title} ({sum(1 for st in s.stations if not st.ok)} station(s))"
            for s in self.stages
            if not s.ok
        ] + list(self.other_failures)


def check_fiber(stress: float, limit: FiberLimit | None, strength: float, sym: str) -> FiberResult:
    """Compare a fiber stress with its limits (MPa): compression fraction × f, tension limit.

    Args:
        stress: the fiber stress, tension +.
        limit: the fiber's limits, or None (not checked).
        strength: the concrete strength the limits refer to (f'ci or f'c), MPa.
        sym: the strength's symbol for the limit text, e.g. "f'ci".
    """
    if abs(stress) < 1e-9:  # round-off about zero (MPa) is zero, not a tension
        stress = 0.0
    if limit is None:
        return FiberResult(stress, None, None, None, True, "not checked")
    comp = (
        -limit.compression_fraction * strength if limit.compression_fraction is not None else None
    )
    tens = limit.tension.value(strength) if limit.tension is not None else None
    texts = []
    if limit.compression_fraction is not None:
        texts.append(f"{limit.compression_fraction:g} {sym}")
    if limit.tension is not None:
        texts.append(limit.tension.text(sym))
    util: float | None = None
    ok = True
    if stress < 0 and comp is not None:
        util = stress / comp if comp < 0 else None
        ok = comp < 0 and stress >= comp * (1 + 1e-12)
    elif stress >= 0 and tens is not None:
        if tens > 0:
            util = stress / tens
            ok = util <= 1.0 + 1e-12
        else:
            util = 0.0 if stress == 0 else None
            ok = stress <= 0
    elif comp is not None or tens is not None:
        util = 0.0  # a limit of the other sign only: checked, and far from it
    return FiberResult(stress, comp, tens, util, ok, "; ".join(texts) or "not checked")


def _limits_of(girder: Girder, key: str) -> dict[str, tuple[float | None, float | None]]:
    """(compression, tension) limit stresses of each girder fiber in a stage (MPa)."""
    job = girder.job
    gc = job.girder_concrete
    strength = gc.fci if key in ("transfer", "handling") else gc.fc
    assert strength is not None
    out = {}
    for fiber in ("girder_bottom", "girder_top"):
        lim = job.limits.get(key, fiber)
        if lim is None:
            out[fiber] = (None, None)
            continue
        comp = (
            -lim.compression_fraction * strength if lim.compression_fraction is not None else None
        )
        tens = lim.tension.value(strength) if lim.tension is not None else None
        out[fiber] = (comp, tens)
    return out


def zone_at(
    girder: Girder, losses: LossBreakdown, stations_: list, raws: list | None = None
) -> tuple[ZoneStation, ...]:
    """The permissible zone of the cgs at the given stations, from every stage's limits.

    ``raws``: the stages' results at these stations when already computed.
    """
    from prestress.stages import stage_specs, stage_stresses, zone_bounds

    bounds: dict[float, list[tuple[float, float, str, str]]] = {}
    if raws is None:
        raws = [stage_stresses(girder, losses, spec, stations_) for spec in stage_specs(girder)]
    for raw in raws:
        spec = raw.spec
        bounds_of_stage = zone_bounds(raw, _limits_of(girder, spec.limit_stage))
        for st, b in zip(raw.stations, bounds_of_stage, strict=True):
            bounds.setdefault(round(st.x, 3), []).append(b)
    zone = []
    from prestress.stages import prestress_at

    cgs = prestress_at(girder, losses, "final", np.array([st.x for st in stations_]))[1]
    for st, y in zip(stations_, cgs, strict=True):
        lo, hi, who_lo, who_hi = -np.inf, np.inf, "", ""
        # stages in time order; a later stage takes over a bound only when it is tighter by
        # more than round-off (1e-6 mm), so ties name the earlier stage in any unit system
        for b_lo, b_hi, w_lo, w_hi in bounds.get(round(st.x, 3), []):
            if b_lo > lo + 1e-6:
                lo, who_lo = b_lo, w_lo
            if b_hi < hi - 1e-6:
                hi, who_hi = b_hi, w_hi
        zone.append(
            ZoneStation(
                st,
                None if lo == -np.inf else float(lo),
                None if hi == np.inf else float(hi),
                float(y),
                who_lo,
                who_hi,
            )
        )
    return tuple(zone)


def development_lengths(
    girder: Girder, losses: LossBreakdown
) -> tuple[dict[bool, float], list[str]]:
    """ld of bonded (key False) and debonded (key True) strands, mm, and the notes on them.

    fps at midspan for rectangular behaviour of the composite section (the deck as the
    compression flange; the girder's top flange without a deck), Eq. 5.6.3.1.1-1.
    """
    from prestress.codes.aashto_lrfd import materials as m
    from prestress.units import INCH_MM, KSI_MPA

    job = girder.job
    if job.post_tensioned or job.layout is None:
        return {}, []
    g = girder.gross
    if job.deck is not None:
        top = g.height + job.deck.haunch + job.deck.thickness
        b, fc = job.deck.effective_width, job.deck.concrete.fc
    else:
        top, b, fc = g.height, g.top_width, job.girder_concrete.fc
    d_p = top - job.y_ps
    A = job.A_ps / INCH_MM**2
    fps, c = m.f_ps_rectangular(
        A,
        job.strand.fpu / KSI_MPA,
        job.strand.fpy / KSI_MPA,
        d_p / INCH_MM,
        b / INCH_MM,
        fc / KSI_MPA,
    )
    fpe = losses.f_pe / KSI_MPA
    depth_in = g.height / INCH_MM  # the member's depth: the girder (κ of 5.9.4.3.2)
    out = []
    lengths: dict[bool, float] = {}
    for debonded in (False, True):
        if debonded and not any(s.debonded for s in job.layout.sets):
            continue
        kappa = m.kappa_development(depth_in, debonded)
        ld = m.l_d(kappa, fps, fpe, job.strand.diameter / INCH_MM)
        lengths[debonded] = ld * INCH_MM
        kind = "debonded strands" if debonded else "bonded strands"
        length = in_both(
            job.units, f"{ld:.0f} in = {ld / 12:.1f} ft", f"{ld * INCH_MM / 1000:.2f} m"
        )
        out.append(
            f"development length of the {kind}: ld = {length} (AASHTO LRFD Eq. 5.9.4.3.2-1, "
            f"κ = {kappa:g}, fps = {_ksi_mpa(job.units, fps, decimals=(1, 0))} by Eq. "
            f"5.6.3.1.1-1 at midspan, fpe = {_ksi_mpa(job.units, fpe, decimals=(1, 0))}), from "
            "the end of bonding"
        )
    if fpe < 0.5 * job.strand.fpu / KSI_MPA:
        out.append(
            f"fpe = {_ksi_mpa(job.units, fpe, decimals=(1, 0))} is below 0.5 fpu: Eq. "
            "5.6.3.1.1-1 for fps (and the development length from it) does not apply (AASHTO "
            "LRFD 5.6.3.1.1); use strain compatibility"
        )
    if job.deck is not None and c > job.deck.thickness / INCH_MM:
        depth = in_both(job.units, f"{c:.1f} in", f"{c * INCH_MM:.0f} mm")
        out.append(
            f"the neutral axis at nominal resistance lies below the deck (c = {depth}): fps "
            "assumed rectangular behaviour; check T-section behaviour"
        )
    return lengths, out


def _ksi_mpa(system: str, ksi: float, sign: str = "", decimals: tuple[int, int] = (3, 2)) -> str:
    """A stress given in ksi, written in both systems, the job's first.

    ``decimals``: of the ksi and the MPa figures (3 and 2 for concrete stresses; 1 and 0 for
    strand stresses); ``sign``: "+" to write the sign of tension too.
    """
    k, m = decimals
    return in_both(system, f"{ksi:{sign}.{k}f} ksi", f"{ksi * KSI_MPA:{sign},.{m}f} MPa")


#: Stress in the bonded reinforcement that carries the tensile force at release, MPa:
#: 0.5 fy ≤ 30 ksi (AASHTO LRFD 9th Ed. (2020) Table 5.9.2.3.1b-1, from memory), with
#: fy ≥ 60 ksi.
RELEASE_STEEL_STRESS_MPA = 30.0 * KSI_MPA


def lower_release_tension_limit(f_ci: float) -> float:
    """AASHTO LRFD 9th Ed. (2020) Table 5.9.2.3.1b-1: tension without bonded steel, MPa.

    0.0948 λ√f'ci ≤ 0.2 ksi (λ = 1, normal-weight concrete; from memory).
    """
    return min(0.0948 * (f_ci / KSI_MPA) ** 0.5, 0.2) * KSI_MPA


def station_results(girder: Girder, spec, raw) -> list[StationResult]:  # type: ignore[no-untyped-def]
    """The stresses of one stage checked against the limits, station by station.

    Where the limit set gives factors on the prestress (``raw.cases``), each fiber is checked
    with the prestress times each factor and takes the case that governs (the higher
    :meth:`FiberResult.rank`; the lower factor on a tie). The force P stays the mean value.
    """
    job = girder.job
    gc = job.girder_concrete
    strength = gc.fci if spec.strength == "fci" else gc.fc
    sym = "f'ci" if spec.strength == "fci" else "f'c"
    assert strength is not None
    cases = raw.checked_cases()
    out = []
    for i, st in enumerate(raw.stations):
        fibers = {}
        for fiber in raw.stresses:
            limit = job.limits.get(spec.limit_stage, fiber)
            if fiber == "deck_top":
                assert job.deck is not None
                fiber_strength, fiber_sym = job.deck.concrete.fc, "f'c,deck"
            else:
                fiber_strength, fiber_sym = strength, sym
            governing: FiberResult | None = None
            for factor, stresses in cases:
                fr = check_fiber(float(stresses[fiber][i]), limit, fiber_strength, fiber_sym)
                if len(cases) > 1:
                    fr = replace(fr, prestress_factor=factor)
                r = fr.rank()
                if governing is None or (r is not None and rank_beats(r, governing.rank())):
                    governing = fr
            assert governing is not None
            fibers[fiber] = governing
        out.append(
            StationResult(
                name=st.name,
                x=st.x,
                x_bearing=st.x - job.bearing_offset if spec.support == "bearings" else None,
                force=float(raw.force[i]),
                eccentricity=float(raw.eccentricity[i]),
                moments={k: float(v[i]) for k, v in raw.moments.items()},
                fibers=fibers,
                cgs=float(raw.cgs[i]),
            )
        )
    return out


def prestress_factors_note(factors: PrestressFactors) -> str:
    """The stage note on the factors applied to the prestress ("" for the mean alone).

    E.g. "prestress × 0.95 or × 1.05, whichever governs each fiber (EN 1992-1-1:2004
    5.10.9(1)P ...); P: the mean value P_m,t".
    """
    if factors.unity:
        return ""
    cases = " or ".join(f"× {g:g}" for g in factors.cases)
    which = ", whichever governs each fiber" if len(factors.cases) > 1 else ""
    return f"prestress {cases}{which}, loads unfactored ({factors.source}); P: the mean value P_m,t"


def deck_shrinkage_left_out(girder: Girder, losses: LossBreakdown, all_stations) -> str:  # type: ignore[no-untyped-def]
    """What the final stages would give with the deck-shrinkage stresses ("" if not left out).

    Only where the losses credit the prestress gain from deck shrinkage and the job does not
    apply the stresses (``[loads] deck_shrinkage = 0``): the highest utilisation of the final
    service stages with them applied in full, as a condition of the verdict.
    """
    from prestress.stages import stage_specs, stage_stresses

    job = girder.job
    if job.deck is None or job.loads.deck_shrinkage > 0:
        return ""
    if not any(c.key == "deck_shrinkage_gain" for c in losses.components):
        return ""
    one = replace(girder, job=replace(job, loads=replace(job.loads, deck_shrinkage=1.0)))
    best: tuple[tuple[float, float], str, str, str, FiberResult] | None = None
    for spec in stage_specs(one):
        if "deck_shrinkage" not in spec.loads:
            continue
        for st in station_results(one, spec, stage_stresses(one, losses, spec, all_stations)):
            g = st.governing()
            if g is None:
                continue
            fr = st.fibers[g[0]]
            r = fr.rank()
            assert r is not None
            if rank_beats(r, None if best is None else best[0]):
                best = (r, spec.title, g[0], st.name, fr)
    if best is None:
        return ""
    (use, _), title, fiber, where, fr = best
    verdict = "still within the limits" if fr.ok else "EXCEEDED"
    if math.isinf(use):  # a stress of the sign of a zero limit (decompression)
        stress = _ksi_mpa(job.units, fr.stress / KSI_MPA, "+")
        amount = f"{stress} against a zero tension limit"
    else:
        amount = f"highest utilisation {use:.2f}"
    return (
        f"the deck-shrinkage stresses left out (with them: {amount}, {title}, "
        f"{fiber.replace('_', ' ')} at {where}: {verdict})"
    )


def release_tension_steel(girder: Girder, stations: list[StationResult]) -> tuple[str, str] | None:
    """Where the tension at release or handling needs bonded steel: (note, condition) or None.

    AASHTO LRFD 9th Ed. (2020) Table 5.9.2.3.1b-1 (from memory): beyond 0.0948 λ√f'ci ≤
    0.2 ksi, tension up to 0.24 λ√f'ci is allowed only with bonded reinforcement sufficient
    to resist the tensile force in the concrete computed on an uncracked section,
    proportioned at 0.5 fy ≤ 30 ksi. The note gives the largest tensile force over the
    stations where the tension exceeds the lower limit, and the steel it needs; the
    condition says what a pass presupposes.
    """
    from prestress.stages import tensile_force
    from prestress.units import INCH_MM, KIP_N

    job = girder.job
    limits = job.limits
    if "AASHTO" not in f"{limits.name} {limits.source}":
        return None  # the rule is AASHTO's; other codes' limit sets say their own
    assert job.girder_concrete.fci is not None
    lower = lower_release_tension_limit(job.girder_concrete.fci)
    ext = np.asarray(girder.outline.exterior, dtype=float)
    holes = [np.asarray(h, dtype=float) for h in girder.outline.holes]
    h = girder.gross.height
    best: tuple[float, StationResult] | None = None
    for st in stations:
        fb, ft = st.fibers.get("girder_bottom"), st.fibers.get("girder_top")
        if fb is None or ft is None or max(fb.stress, ft.stress) <= lower * (1 + 1e-9):
            continue
        force = tensile_force(ext, holes, fb.stress, ft.stress, h)
        # the first of equal forces (symmetric girders) in any unit system: beyond round-off
        if best is None or force > best[0] * (1.0 + 1e-9) + 1e-6:
            best = (force, st)
    if best is None or best[0] <= 0.0:
        return None
    force, st = best
    As = force / RELEASE_STEEL_STRESS_MPA
    units = girder.job.units
    steel = in_both(units, f"{As / INCH_MM**2:.2f} in²", f"{As:,.0f} mm²")
    note = (
        f"the tension exceeds 0.0948√f'ci ≤ 0.2 ksi, i.e. "
        f"{in_both(units, f'{lower / KSI_MPA:.3f} ksi', f'{lower:.2f} MPa')}, at {st.name}: "
        "it is allowed up to 0.24√f'ci only with bonded reinforcement for the tensile force "
        "on the uncracked section, "
        f"{in_both(units, f'{force / KIP_N:.1f} kip', f'{force / 1000:.0f} kN')} there, i.e. "
        f"at least {steel} at 0.5 fy ≤ 30 ksi (AASHTO LRFD 9th Ed. (2020) Table 5.9.2.3.1b-1, "
        "from memory)"
    )
    return note, f"bonded reinforcement of at least {steel} in the tension zone at {st.name}"


def deck_shrinkage_notes(girder: Girder, losses: LossBreakdown) -> list[str]:
    """What the check does with the stresses of the deck's shrinkage, with their size.

    Applied (``[loads] deck_shrinkage`` > 0): the force and its factor. Not applied while the
    loss method credits the prestress gain from deck shrinkage: the stresses left out.
    """
    from prestress.losses.refined import deck_shrinkage_force
    from prestress.stages import deck_shrinkage_stresses
    from prestress.units import KSI_MPA

    job = girder.job
    if job.deck is None or girder.section_composite is None:
        return []
    factor = job.loads.deck_shrinkage
    text = deck_shrinkage_force(girder)[1]
    if losses.method.startswith("time-step"):
        text += (
            f" — by AASHTO 5.4.2.3, not by the {losses.method} model, whose own deck-shrinkage "
            "gain the losses report"
        )
    if factor > 0:
        return [f"{text}; applied × {factor:g} in the final service stages"]
    if not any(c.key == "deck_shrinkage_gain" for c in losses.components):
        return []
    one = replace(girder, job=replace(job, loads=replace(job.loads, deck_shrinkage=1.0)))
    f = deck_shrinkage_stresses(one)
    return [
        f"the losses credit the prestress gain from deck shrinkage, but the stresses of the "
        f"{text} are not applied: {_ksi_mpa(job.units, f['girder_bottom'] / KSI_MPA, '+')} at "
        f"the girder bottom, {_ksi_mpa(job.units, f['girder_top'] / KSI_MPA, '+')} at its top "
        "along the span; [loads] deck_shrinkage = 1 (or the owner's factor) applies them"
    ]


#: Families whose section has one web (the debonding rule on strands within the web).
SINGLE_WEB_FAMILIES = ("i_girder", "bulb_tee", "inverted_tee")


def web_half_width(girder: Girder) -> float | None:
    """Half the web width at mid-depth of a single-web section (mm); None for others.

    Read off the outline: the horizontal extent of the exterior ring at half the depth.
    """
    if girder.family not in SINGLE_WEB_FAMILIES:
        return None
    ring = np.asarray(girder.outline.exterior, dtype=float)
    y = girder.gross.height / 2.0
    a, b = ring, np.roll(ring, -1, axis=0)
    crosses = (a[:, 1] - y) * (b[:, 1] - y) < 0
    if not crosses.any():
        return None
    t = (y - a[crosses, 1]) / (b[crosses, 1] - a[crosses, 1])
    xs = a[crosses, 0] + t * (b[crosses, 0] - a[crosses, 0])
    return float(xs.max() - xs.min()) / 2.0


def run_check(job: Job, *, cli_libraries: tuple[str, ...] = ()) -> CheckResult:
    """Run the whole check of a job: section, losses, stresses per stage, limits, zone."""
    from prestress.stages import load_effects, stage_specs, stage_stresses, stations

    girder = resolve_girder(job, cli_libraries=cli_libraries)
    job = girder.job
    losses = compute_losses(girder)
    all_st = stations(girder)
    gc = job.girder_concrete
    results = []
    notes = list(girder.notices + losses.notes)
    raws = []
    conditions: list[str] = []
    for spec in stage_specs(girder):
        raw = stage_stresses(girder, losses, spec, all_st)
        raws.append(raw)
        sym = "f'ci" if spec.strength == "fci" else "f'c"
        strength = gc.fci if spec.strength == "fci" else gc.fc
        assert strength is not None
        st_results = station_results(girder, spec, raw)
        stage_notes = []
        if raw.note:
            stage_notes.append(raw.note)
        factors_note = prestress_factors_note(raw.factors)
        if factors_note:
            stage_notes.append(factors_note)
        combo = job.combinations.get(spec.key)
        if combo is not None and combo.source and spec.live > 0:
            text = f"load factors: {combo.source}"
            not_aashto = "AASHTO" not in f"{job.limits.name} {job.limits.source}"
            if not_aashto and combo.source.startswith("AASHTO"):
                text += (
                    "; the limit set is not AASHTO's: give its own combination's factors "
                    f"under [combinations.{spec.key}]"
                )
            stage_notes.append(text)
        if spec.strength == "fci":
            steel = release_tension_steel(girder, st_results)
            if steel is not None:
                stage_notes.append(steel[0])
                conditions.append(f"{steel[1]} ({spec.title})")
        if (
            "live" in spec.loads
            and job.loads.live.model == "given"
            and job.loads.live.moments_tenth_points is None
            and spec.live > 0
        ):
            stage_notes.append(
                "live-load moment distributed along the span as a parabola "
                "from the midspan value given in the job"
            )
        results.append(
            StageResult(
                key=spec.key,
                limits_key=spec.limit_stage,
                title=spec.title,
                description=f"{spec.description}; prestress on the {raw.section.name} section"
                + (
                    f", superimposed and live loads on the {raw.composite.name} section"
                    if raw.composite is not None
                    and any(k in spec.loads for k in ("superimposed", "live"))
                    else ""
                ),
                strength_text=f"{sym} = {strength:.6g} MPa",
                stations=tuple(st_results),
                notes=tuple(stage_notes),
            )
        )
    zone = zone_at(girder, losses, all_st, raws)
    notes += deck_shrinkage_notes(girder, losses)
    left_out = deck_shrinkage_left_out(girder, losses, all_st)
    if left_out:
        conditions.append(left_out)
    lds, ld_notes = development_lengths(girder, losses)
    notes += ld_notes
    if job.layout is not None:
        from prestress.layout import debonding_warnings

        longest = None
        if True in lds:  # simple span: min(0.2 S, S/2 − ld), 5.9.4.3.3 of the 9th Ed.
            longest = min(0.2 * job.span, job.span / 2.0 - lds[True])
        notes += [
            f"detailing: {w}"
            for w in debonding_warnings(
                job.layout,
                [r.x if r.x else tuple(r.x_positions()) for r in job.rows],
                web_half_width=web_half_width(girder),
                max_debonded_length=longest,
            )
        ]
    return CheckResult(
        girder=girder,
        losses=losses,
        stages=tuple(results),
        notes=tuple(notes),
        zone=tuple(zone),
        loads=load_effects(girder, all_st),
        conditions=tuple(conditions),
        other_failures=tuple(tendon_limit_failures(girder)),
    )


def tendon_limit_failures(girder: Girder) -> list[str]:
    """Each tendon stress above its limit of AASHTO LRFD Table 5.9.2.2-1, in words.

    A code limit like the stage limits, so it fails the check (the values and the clause are
    in the losses' notes and the tendon tables).
    """
    if not girder.job.post_tensioned:
        return []
    from prestress.losses.post_tensioned import tendon_limit_checks

    return [
        f"tendon {c.tendon}, {c.where}: {c.condition}, above {c.limit_text} "
        "(AASHTO LRFD Table 5.9.2.2-1)"
        for c in tendon_limit_checks(girder)
        if not c.ok
    ]


def check_file(path: str | Path, *, cli_libraries: tuple[str, ...] = ()) -> CheckResult:
    """Load a job file and check it (the Python entry point behind ``prestress check``)."""
    from prestress.jobfile import load_job

    return run_check(load_job(path), cli_libraries=cli_libraries)


def losses_file(
    path: str | Path, *, method: str | None = None, cli_libraries: tuple[str, ...] = ()
) -> tuple[Girder, LossBreakdown]:
    """Load a job file and compute its losses by the job's (or the given) method."""
    from prestress.jobfile import load_job

    girder = resolve_girder(load_job(path), cli_libraries=cli_libraries)
    return girder, compute_losses(girder, method)


def compare_losses(girder: Girder) -> tuple[list[LossBreakdown], list[str]]:
    """Every registered loss method that applies to the girder, and why the others do not."""
    from prestress.losses import METHODS, load_methods

    load_methods()
    results, skipped = [], []
    for name in METHODS:
        try:
            results.append(compute_losses(girder, name))
        except InputError as exc:
            skipped.append(f"{name}: {exc.expected}")
    return results, skipped
