"""The first calculation path: resolve the girder, compute losses, stage stresses and checks.

Flow: :func:`resolve_girder` (library → polygon → gross and composite properties)
→ :func:`prestress.losses.compute_losses` → :func:`stage_transfer` and
:func:`stage_service` (fiber stresses at stations) → :func:`check_fiber` (limits).
Everything in the internal system (N, mm, MPa, N*mm). Sign convention: tension positive,
compression negative; eccentricity positive below the centroid; sagging moment positive.
"""

from __future__ import annotations

from dataclasses import dataclass, field
from pathlib import Path

import numpy as np

from prestress.errors import InputError
from prestress.losses import LossBreakdown, compute_losses
from prestress.model import FIBERS, FiberLimit, Job
from prestress.sections.composite import (
    AssembledSection,
    StrandLayer,
    composite,
    noncomposite,
    transformed_composite,
    transformed_girder,
)
from prestress.sections.properties import GrossProperties, gross_properties

SIGN_CONVENTION = "tension +, compression −"


@dataclass(frozen=True)
class Girder:
    """A job with its section resolved: polygon, gross and composite properties (mm).

    Attributes:
        job: the job.
        section_name: the section's name.
        section_source: where the shape comes from.
        polygon: the shapely polygon of the girder (mm).
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
    polygon: object
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

    @property
    def eccentricity_gross(self) -> float:
        """Eccentricity of the strand centroid below the gross centroid (mm)."""
        return self.gross.yb - self.job.y_ps

    def eccentricity(self, sec: AssembledSection) -> float:
        """Eccentricity of the strand centroid below a section's centroid (mm)."""
        return sec.yb - self.job.y_ps


def resolve_girder(job: Job, *, cli_libraries: tuple[str, ...] = ()) -> Girder:
    """Find the job's section, build and check its geometry, and compute its properties."""
    from prestress.sections.families import build_polygon
    from prestress.sections.library import load_library, search_folders

    notices: list[str] = []
    ref = job.section
    if ref.family is not None:
        assert ref.dimensions is not None
        poly = build_polygon(
            ref.family, ref.dimensions, file=job.file, field="girder.section.dimensions"
        )
        name, source = ref.name, "defined in the job file"
    else:
        lib = load_library(search_folders(job.library_paths, cli_libraries))
        entry = lib.get(ref.name, file=job.file, field="girder.section")
        notices += [n for n in lib.notices if entry.name.lower() in n.lower()]
        poly = build_polygon(
            entry.family, entry.dimensions, file=entry.file, field=f"{entry.field}.dimensions"
        )
        name, source = entry.name, entry.source
    _check_strands_inside(job, poly)
    gross = gross_properties(poly)
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
    if job.loss_basis == "transformed":
        gc = job.girder_concrete
        assert gc.Eci is not None
        layers = [StrandLayer(r.count * job.strand.area, r.height) for r in job.rows]
        sec_t = transformed_girder(
            gross, layers, job.strand.Ep / gc.Eci, "girder, transformed at transfer (Eci)"
        )
        sec_s = transformed_girder(
            gross, layers, job.strand.Ep / gc.Ec, "girder, transformed in service (Ec)"
        )
        if job.deck is not None:
            sec_c = transformed_composite(gross, job.deck, n_deck, layers, job.strand.Ep / gc.Ec)
    return Girder(
        job=job,
        section_name=name,
        section_source=source,
        polygon=poly,
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
    )


def _with_haunch_width(deck, width):  # type: ignore[no-untyped-def]
    from dataclasses import replace

    return replace(deck, haunch_width=width)


def _replace_deck(job: Job, deck) -> Job:  # type: ignore[no-untyped-def]
    from dataclasses import replace

    return replace(job, deck=deck)


def _check_strands_inside(job: Job, poly) -> None:  # type: ignore[no-untyped-def]
    """Every strand must lie inside the concrete with at least its own radius of cover."""
    from shapely.geometry import Point

    for i, row in enumerate(job.rows):
        for x in row.x_positions():
            p = Point(float(x), row.height)
            if (
                not poly.contains(p)
                or poly.exterior.distance(p) < job.strand.diameter / 2.0
                or any(h.distance(p) < job.strand.diameter / 2.0 for h in poly.interiors)
            ):
                raise InputError(
                    "every strand inside the concrete (row width (count − 1) × spacing must fit "
                    "the section at that height)",
                    file=job.file,
                    field=f"strands.rows[{i}]",
                    got=f"a strand at x = {x / 25.4:.2f} in, y = {row.height / 25.4:.2f} in "
                    "outside the section",
                )


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
    """

    stress: float
    compression_limit: float | None
    tension_limit: float | None
    utilisation: float | None
    ok: bool
    limit_text: str


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
            u = f.utilisation if f.utilisation is not None else (np.inf if not f.ok else None)
            if u is not None and (best is None or u > best[1]):
                best = (name, u)
        return best


@dataclass(frozen=True)
class StageResult:
    """One stage (or service case) of the check."""

    key: str
    title: str
    description: str
    strength_text: str
    stations: tuple[StationResult, ...]
    notes: tuple[str, ...] = ()

    @property
    def ok(self) -> bool:
        """Whether every station passes."""
        return all(s.ok for s in self.stations)

    def governing(self) -> tuple[StationResult, str, float] | None:
        """The station and fiber of the highest utilisation."""
        best = None
        for s in self.stations:
            g = s.governing()
            if g is not None and (best is None or g[1] > best[2]):
                best = (s, g[0], g[1])
        return best


@dataclass(frozen=True)
class CheckResult:
    """Everything ``prestress check`` shows."""

    girder: Girder
    losses: LossBreakdown
    stages: tuple[StageResult, ...]
    notes: tuple[str, ...] = field(default_factory=tuple)

    @property
    def ok(self) -> bool:
        """Whether every stage passes."""
        return all(s.ok for s in self.stages)


def check_fiber(stress: float, limit: FiberLimit | None, strength: float, sym: str) -> FiberResult:
    """Compare a fiber stress with its limits (MPa): compression fraction × f, tension limit.

    Args:
        stress: the fiber stress, tension +.
        limit: the fiber's limits, or None (not checked).
        strength: the concrete strength the limits refer to (f'ci or f'c), MPa.
        sym: the strength's symbol for the limit text, e.g. "f'ci".
    """
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
        t = limit.tension
        cap = "" if t.cap is None else " ≤ cap"
        texts.append(f"{t.coefficient:g}√{sym} ({t.root_unit}){cap}")
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
    return FiberResult(stress, comp, tens, util, ok, "; ".join(texts) or "not checked")


def fiber_stress(sec: AssembledSection, fiber: str, P: float, e: float, M: float) -> float:
    """Stress at a fiber of a section (MPa): −P/A − (M − P e)(y − yb)/I, times its modular ratio.

    Args:
        sec: the section carrying the increment.
        fiber: fiber name.
        P: prestress force on this section, N (positive; compression in the concrete).
        e: its eccentricity below this section's centroid, mm.
        M: applied moment, N*mm (sagging +).
    """
    return sec.n_fiber[fiber] * (-P / sec.area - (M - P * e) * sec.c(fiber) / sec.I)


def force_factor(job: Job, x: float) -> float:
    """Share of the full prestress force developed at x (mm from the left end).

    Linear over the transfer length from each end (AASHTO LRFD 9th Ed. (2020) 5.9.4.3.1).
    """
    lt = job.transfer_length
    return float(min(1.0, max(0.0, x) / lt, max(0.0, job.length - x) / lt))


def _span_moment(w: float, span: float, x: float) -> float:
    """Moment of a uniform load w (N/mm) on a simple span at x (mm): w x (L − x) / 2."""
    x = min(max(x, 0.0), span)
    return w * x * (span - x) / 2.0


def stage_transfer(girder: Girder, losses: LossBreakdown) -> StageResult:
    """Release in the casting bed: initial prestress and self-weight on the girder length."""
    job = girder.job
    sec = girder.section_transfer
    assert sec is not None
    e = girder.eccentricity(sec)
    lt = job.transfer_length
    L = job.length
    stations = [
        ("left lt", lt),
        ("midlength", L / 2.0),
        ("right lt", L - lt),
    ]
    fci = job.girder_concrete.fci
    assert fci is not None
    results = []
    for name, x in sorted(stations, key=lambda s: s[1]):
        P = job.A_ps * losses.applied_transfer * force_factor(job, x)
        M = _span_moment(girder.self_weight, L, x)
        fibers = {}
        for fiber in ("girder_bottom", "girder_top"):
            f = fiber_stress(sec, fiber, P, e, M)
            fibers[fiber] = check_fiber(f, job.limits.get("transfer", fiber), fci, "f'ci")
        results.append(StationResult(name, x, None, P, e, {"girder": M}, fibers))
    return StageResult(
        key="transfer",
        title="Release in the casting bed",
        description="initial prestress and girder self-weight on the girder length, supported "
        f"at its ends; section: {sec.name}",
        strength_text=f"f'ci = {fci:.6g} MPa",
        stations=tuple(results),
    )


SERVICE_TITLES = {
    "service_permanent": (
        "Final service: effective prestress and permanent loads",
        "Service I without live load",
    ),
    "service_i": ("Final service: Service I", "effective prestress, permanent loads and live load"),
    "service_iii": (
        "Final service: Service III",
        "effective prestress, permanent loads and factored live load (tension check)",
    ),
}


def stage_service(girder: Girder, losses: LossBreakdown, key: str) -> StageResult:
    """Final service at the tenth points of the design span for one service combination."""
    job = girder.job
    combo = job.combinations[key]
    nc = girder.section_service
    assert nc is not None
    comp = girder.section_composite
    e = girder.eccentricity(nc)
    span = job.span
    fc = job.girder_concrete.fc
    results = []
    for i in range(11):
        xb = span * i / 10.0
        x = job.bearing_offset + xb
        P = job.A_ps * losses.applied_final * force_factor(job, x)
        M_nc = {
            "girder": combo.dead * _span_moment(girder.self_weight, span, xb),
            "deck": combo.dead * _span_moment(girder.deck_weight, span, xb),
        }
        M_c = {
            "superimposed": combo.dead
            * _span_moment(job.loads.superimposed_dead + job.loads.wearing_surface, span, xb),
            "live": combo.live * float(job.loads.live.moment_at(np.array([xb]), span)[0]),
        }
        M_nc_total = sum(M_nc.values())
        M_c_total = sum(M_c.values())
        fibers = {}
        for fiber in FIBERS:
            if fiber == "deck_top":
                if comp is None:
                    continue
                f = fiber_stress(comp, fiber, 0.0, 0.0, M_c_total)
                assert job.deck is not None
                strength, sym = job.deck.concrete.fc, "f'c,deck"
            else:
                f = fiber_stress(nc, fiber, P, e, M_nc_total)
                if comp is not None:
                    f += fiber_stress(comp, fiber, 0.0, 0.0, M_c_total)
                else:
                    f += fiber_stress(nc, fiber, 0.0, 0.0, M_c_total)
                strength, sym = fc, "f'c"
            fibers[fiber] = check_fiber(f, job.limits.get(key, fiber), strength, sym)
        name = "bearing" if i in (0, 10) else ("midspan" if i == 5 else f"{i / 10:.1f} span")
        results.append(StationResult(name, x, xb, P, e, {**M_nc, **M_c}, fibers))
    title, desc = SERVICE_TITLES[key]
    notes = []
    if job.loads.live.moments_tenth_points is None and combo.live > 0:
        notes.append(
            "live-load moment distributed along the span as a parabola from the "
            "midspan value given in the job"
        )
    return StageResult(
        key=key,
        title=title,
        description=f"{desc}; load factors: dead {combo.dead:g}, live {combo.live:g}; "
        f"prestress, girder and deck weights on the {nc.name} section"
        + (f", superimposed dead and live load on the {comp.name} section" if comp else ""),
        strength_text=f"f'c = {fc:.6g} MPa",
        stations=tuple(results),
        notes=tuple(notes),
    )


def run_check(job: Job, *, cli_libraries: tuple[str, ...] = ()) -> CheckResult:
    """Run the whole check of a job: section, losses, stresses per stage, limits."""
    girder = resolve_girder(job, cli_libraries=cli_libraries)
    losses = compute_losses(girder)
    stages = [stage_transfer(girder, losses)]
    for key in ("service_permanent", "service_i", "service_iii"):
        stages.append(stage_service(girder, losses, key))
    return CheckResult(
        girder=girder, losses=losses, stages=tuple(stages), notes=girder.notices + losses.notes
    )


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
