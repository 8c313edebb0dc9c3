"""Staged fiber stresses at stations along the girder, and the permissible zone of the cgs.

For each stage of the girder's life the prestress force of that time (from the loss engine)
and the moments of the loads present act on the section that carries them: prestress, girder
self-weight, deck, haunch and diaphragms on the girder alone; superimposed dead load and live
load on the composite section. Increments are superposed, so each acts on the section that
carried it. Engine level: N, mm, MPa, N*mm; tension +, compression −; eccentricity positive
below the centroid; sagging moments positive.
"""

from __future__ import annotations

from dataclasses import dataclass
from itertools import product
from typing import TYPE_CHECKING

import numpy as np

from prestress import actions
from prestress.model import FIBERS, MEAN_PRESTRESS, Job, PrestressFactors

if TYPE_CHECKING:
    from prestress.analysis import Girder
    from prestress.losses import LossBreakdown
    from prestress.sections.composite import AssembledSection


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


# ------------------------------------------------------------------------------------------
# Stations


@dataclass(frozen=True)
class Station:
    """A point along the girder: its name(s) and position from the left end (mm)."""

    name: str
    x: float


_SAME_STATION_MM = 1.0 + 1e-6
"""Points closer than 1 mm are one station (the 1e-6 mm keeps round-off from unit
conversion on the same side of the tolerance)."""


def stations(girder: Girder) -> list[Station]:
    """Every station an engineer checks, de-duplicated (within 1 mm) and sorted.

    The ends, the bearings, the transfer-length points (pretensioned), each hold-down, each
    debond end and the end of its transfer length, the lifting points (with handling), the
    tenth points of the design span and the job's own.
    """
    job = girder.job
    L, lt, a, S = job.length, job.transfer_length, job.bearing_offset, job.span
    raw: list[tuple[str, float]] = [("left end", 0.0), ("right end", L)]
    if a > 0:
        raw += [("left bearing", a), ("right bearing", L - a)]
    if job.layout is not None:  # pretensioned: the ends of the transfer length
        raw += [("left lt", lt), ("right lt", L - lt)]
        raw += job.layout.key_positions()
    if job.handling is not None:  # the greatest negative moment while lifting
        lp = job.handling.lift_point
        raw += [("left lift point", lp), ("right lift point", L - lp)]
    for t in job.tendons:
        for i, (xt, _y) in enumerate(zip(t.x, t.y, strict=True)):
            if 0 < i < len(t.x) - 1:
                raw.append(("tendon profile point", xt))
    for i in range(11):
        if i in (0, 10):
            name = "left bearing" if i == 0 else "right bearing"
        else:
            name = "midspan" if i == 5 else f"{i / 10:.1f} span"
        raw.append((name, a + S * i / 10.0))
    raw += list(job.user_stations)
    merged: list[tuple[dict[str, int], float]] = []
    order = sorted(range(len(raw)), key=lambda k: raw[k][1])
    for k in order:
        name, x = raw[k]
        x = min(max(x, 0.0), L)
        if merged and abs(merged[-1][1] - x) <= _SAME_STATION_MM:
            names = merged[-1][0]
            names[name] = min(k, names.get(name, k))
        else:
            merged.append(({name: k}, x))
    # names of a merged station in a fixed order (where each is first listed above), so the
    # result does not depend on round-off in positions
    return [Station(" / ".join(sorted(names, key=names.__getitem__)), x) for names, x in merged]


# ------------------------------------------------------------------------------------------
# Stages


@dataclass(frozen=True)
class StageSpec:
    """What acts in a stage: prestress of which time, supports, loads, factors, strength."""

    key: str
    title: str
    prestress: str  # "transfer", "deck_placement" or "final"
    support: str  # "ends", "lifting" or "bearings"
    dead: float  # factor on dead loads
    live: float  # factor on live load
    loads: tuple[str, ...]  # of "girder", "deck", "diaphragms", "superimposed", "live"
    strength: str  # "fci" or "fc"
    description: str
    limits_key: str = ""  # the stage whose limits apply ("" : the key itself)

    @property
    def limit_stage(self) -> str:
        """The key of the stage whose limits apply to this one."""
        return self.limits_key or self.key


#: The dead loads a stage may carry, in time order.
LOAD_KEYS = ("girder", "deck", "diaphragms", "superimposed")


def stage_specs(girder: Girder) -> list[StageSpec]:
    """The stages of the job, in time order."""
    job = girder.job
    first = "Post-tensioning" if job.post_tensioned else "Release in the casting bed"
    specs = [
        StageSpec(
            "transfer",
            first,
            "transfer",
            "ends",
            1.0,
            0.0,
            ("girder",),
            "fci",
            "initial prestress and girder self-weight on the girder length, supported at its ends",
        )
    ]
    if job.handling is not None:
        factors = job.handling.dynamic_factors
        for i, factor in enumerate(factors, 1):
            several = len(factors) > 1
            specs.append(
                StageSpec(
                    f"handling_{i}" if several else "handling",
                    "Handling: lifting from the bed"
                    + (f", self-weight × {factor:g}" if several else ""),
                    "transfer",
                    "lifting",
                    factor,
                    0.0,
                    ("girder",),
                    "fci",
                    f"initial prestress and girder self-weight × {factor:g} on the lifting points",
                    limits_key="handling",
                )
            )
    has_deck = job.deck is not None
    specs.append(
        StageSpec(
            "deck_placement",
            "Deck placement on the girder alone"
            if has_deck
            else "Added dead load on the girder (no deck)",
            "deck_placement",
            "bearings",
            1.0,
            0.0,
            ("girder", "deck", "diaphragms"),
            "fc",
            "prestress at deck placement; girder, deck, haunch and diaphragm weights on the "
            "girder alone, on its bearings"
            if has_deck
            else "prestress at time.deck_placement; girder weight, other non-composite load "
            "and diaphragms on the girder, on its bearings",
        )
    )
    dead_loads = LOAD_KEYS
    shrink: tuple[str, ...] = ()
    shrink_text = ""
    if job.loads.deck_shrinkage > 0 and job.deck is not None:
        shrink = ("deck_shrinkage",)
        shrink_text = f", deck shrinkage × {job.loads.deck_shrinkage:g}"
    c_i, c_iii = job.combinations["service_i"], job.combinations["service_iii"]
    specs += [
        StageSpec(
            "service_permanent",
            "Final service: effective prestress and permanent loads",
            "final",
            "bearings",
            1.0,
            0.0,
            (*dead_loads, *shrink),
            "fc",
            f"effective prestress and every permanent load{shrink_text}",
        ),
        StageSpec(
            "service_i",
            "Final service: Service I",
            "final",
            "bearings",
            c_i.dead,
            c_i.live,
            (*dead_loads, *shrink, "live"),
            "fc",
            f"effective prestress, permanent loads × {c_i.dead:g}, live load × {c_i.live:g}"
            f"{shrink_text}",
        ),
        StageSpec(
            "service_iii",
            "Final service: Service III",
            "final",
            "bearings",
            c_iii.dead,
            c_iii.live,
            (*dead_loads, *shrink, "live"),
            "fc",
            f"effective prestress, permanent loads × {c_iii.dead:g}, live load × "
            f"{c_iii.live:g}{shrink_text} (tension check)",
        ),
    ]
    return specs


def applied_stress(losses: LossBreakdown, when: str) -> tuple[float, str | None]:
    """Strand stress whose force acts on the analysis section at a time, and a note.

    The note is set when the loss method gives no figure for that time (the final value is
    then used).
    """
    if when == "transfer":
        return losses.applied_transfer, None
    if when == "final":
        return losses.applied_final, None
    m = next((m for m in losses.milestones if m.key == when), None)
    if m is None:
        return losses.applied_final, (
            f"{losses.method} gives no losses at deck placement; the "
            "final losses are used for that stage"
        )
    shift = losses.applied_transfer - losses.f_pt  # 0 on gross sections; ES on transformed ones
    return m.stress + shift, None


def prestress_at(
    girder: Girder, losses: LossBreakdown, when: str, x: np.ndarray
) -> tuple[np.ndarray, np.ndarray, str | None]:
    """Prestress force (N) and the height of its centroid (mm) at x, at a time; and a note.

    Pretensioned: the stage's strand stress times the developed area of each strand set.
    Post-tensioned: each tendon's stress at x after friction, anchor set, elastic shortening
    and the time-dependent losses of that time, at its profile height.
    """
    job = girder.job
    if job.post_tensioned:
        from prestress.losses.post_tensioned import tendon_stress

        P = np.zeros_like(x)
        Py = np.zeros_like(x)
        for t, f in tendon_stress(girder, losses, when, x):
            Pt = t.area * f
            P += Pt
            Py += Pt * np.asarray(t.profile().height(x))
        cgs = np.where(P > 0, Py / np.where(P > 0, P, 1.0), job.cgs_geometric(x))
        return P, cgs, None
    assert job.layout is not None
    fp, note = applied_stress(losses, when)
    return fp * job.layout.effective_area(x), job.layout.cgs(x), note


def moments(girder: Girder, spec: StageSpec, x: np.ndarray) -> dict[str, np.ndarray]:
    """Factored moments of the stage's loads at x from the left end (N*mm), by load."""
    job = girder.job
    L, a, S = job.length, job.bearing_offset, job.span
    xb = x - a
    w = girder.self_weight
    out: dict[str, np.ndarray] = {}
    if "girder" in spec.loads:
        if spec.support == "ends":
            out["girder"] = actions.uniform_on_two_supports(w, L, 0.0, L, x)
        elif spec.support == "lifting":
            assert job.handling is not None
            lp = job.handling.lift_point
            out["girder"] = spec.dead * actions.uniform_on_two_supports(w, L, lp, L - lp, x)
        else:
            out["girder"] = spec.dead * actions.uniform_on_two_supports(w, L, a, L - a, x)
    if "deck" in spec.loads:
        out["deck"] = spec.dead * actions.uniform_on_span(girder.deck_weight, S, xb)
    if "diaphragms" in spec.loads and job.loads.diaphragms:
        m = np.zeros_like(x)
        for at, P in job.loads.diaphragms:
            m += actions.point_on_span(P, at, S, xb)
        out["diaphragms"] = spec.dead * m
    if "superimposed" in spec.loads:
        w_c = job.loads.superimposed_dead + job.loads.wearing_surface
        out["superimposed"] = spec.dead * actions.uniform_on_span(w_c, S, xb)
    if "live" in spec.loads and spec.live > 0:
        out["live"] = spec.live * job.loads.live.moment_at(xb, S)
    return out


COMPOSITE_LOADS = ("superimposed", "live")


@dataclass(frozen=True)
class LoadEffects:
    """Unfactored moments by load and the live-load shear per girder at the span's stations.

    Attributes:
        stations: the stations between the bearings.
        x: their positions from the left girder end, mm.
        moments: N*mm by load, each an array over the stations: "girder" (self-weight on the
            bearings), "deck" (deck, haunch and other loads on the girder alone), "diaphragms",
            "barriers" (superimposed DC on the composite section), "wearing_surface" (DW on
            the composite section), "live" (live load with impact, per girder).
        shear_live: (greatest, least) live-load shear per girder, N, or None when the live
            load gives no shear (given moments, or no shear distribution factor).
    """

    stations: list[Station]
    x: np.ndarray
    moments: dict[str, np.ndarray]
    shear_live: tuple[np.ndarray, np.ndarray] | None


def on_span(job: Job, x: float) -> bool:
    """Whether a point x (mm from the left end) lies between the bearings (1 mm tolerance)."""
    a, L = job.bearing_offset, job.length
    return a - _SAME_STATION_MM <= x <= L - a + _SAME_STATION_MM


def span_stations(girder: Girder, all_stations: list[Station]) -> list[Station]:
    """The stations on the span, between the bearings (1 mm tolerance)."""
    return [s for s in all_stations if on_span(girder.job, s.x)]


def load_effects(girder: Girder, all_stations: list[Station]) -> LoadEffects:
    """Moments of every load (unfactored) and the live-load shear at the span's stations.

    The same statics as the stages (:func:`moments`) with every factor 1: the girder on its
    bearings, the loads on the design span.
    """
    job = girder.job
    sts = span_stations(girder, all_stations)
    x = np.array([s.x for s in sts])
    xb = x - job.bearing_offset
    spec = StageSpec("loads", "", "final", "bearings", 1.0, 1.0, (*LOAD_KEYS, "live"), "fc", "")
    ms = moments(girder, spec, x)
    out: dict[str, np.ndarray] = {k: ms[k] for k in ("girder", "deck", "diaphragms") if k in ms}
    loads = job.loads
    out["barriers"] = actions.uniform_on_span(loads.superimposed_dead, job.span, xb)
    out["wearing_surface"] = actions.uniform_on_span(loads.wearing_surface, job.span, xb)
    if "live" in ms:
        out["live"] = ms["live"]
    return LoadEffects(sts, x, out, loads.live.shear_at(xb, job.span))


@dataclass(frozen=True)
class StageStresses:
    """Raw results of one stage at its stations (arrays over stations)."""

    spec: StageSpec
    stations: list[Station]
    x: np.ndarray
    force: np.ndarray  # N
    cgs: np.ndarray  # mm above the girder bottom
    eccentricity: np.ndarray  # mm below the centroid of the girder section used
    moments: dict[str, np.ndarray]
    stresses: dict[str, np.ndarray]  # by fiber, with the mean prestress
    section: AssembledSection  # the girder-alone section carrying the prestress
    composite: AssembledSection | None
    note: str | None
    factors: PrestressFactors = MEAN_PRESTRESS  # on the prestress in the checks
    # (factor, stresses by fiber with the prestress × factor) for each factor of a limit set
    # that gives them (lower first); () when the mean prestress alone is checked
    cases: tuple[tuple[float, dict[str, np.ndarray]], ...] = ()

    def checked_cases(self) -> tuple[tuple[float, dict[str, np.ndarray]], ...]:
        """(factor on the prestress, stresses by fiber) of every case the checks consider."""
        return self.cases or ((1.0, self.stresses),)


def stage_stresses(
    girder: Girder, losses: LossBreakdown, spec: StageSpec, all_stations: list[Station]
) -> StageStresses:
    """Fiber stresses of one stage at its stations (vectorised over the stations).

    ``stresses`` are those of the mean prestress. Where the job's limit set gives factors on
    the prestress for the stage (:meth:`prestress.model.LimitSet.factors`), ``cases`` holds
    the stresses with the prestress force and its moment times each factor, the loads
    unfactored (P_k,inf and P_k,sup of EN 1992-1-1:2004 5.10.9(1)P, from memory).
    """
    job = girder.job
    sts = span_stations(girder, all_stations) if spec.support == "bearings" else list(all_stations)
    x = np.array([s.x for s in sts])
    sec = girder.section_transfer if spec.prestress == "transfer" else girder.section_service
    assert sec is not None
    comp = girder.section_composite
    P, cgs, note = prestress_at(girder, losses, spec.prestress, x)
    e = sec.yb - cgs
    ms = moments(girder, spec, x)
    M_nc = sum((m for k, m in ms.items() if k not in COMPOSITE_LOADS), np.zeros_like(x))
    M_c = sum((m for k, m in ms.items() if k in COMPOSITE_LOADS), np.zeros_like(x))
    composite_stage = any(k in COMPOSITE_LOADS for k in spec.loads)
    shrink = deck_shrinkage_stresses(girder) if "deck_shrinkage" in spec.loads else {}

    def stresses_for(P_acting: np.ndarray) -> dict[str, np.ndarray]:
        stresses: dict[str, np.ndarray] = {}
        for fiber in FIBERS:
            if fiber == "deck_top":
                if comp is None or not composite_stage:
                    continue
                f_deck = comp.n_fiber[fiber] * (-M_c * comp.c(fiber) / comp.I)
                stresses[fiber] = f_deck + shrink.get(fiber, 0.0)
                continue
            f = sec.n_fiber[fiber] * (
                -P_acting / sec.area - (M_nc - P_acting * e) * sec.c(fiber) / sec.I
            )
            carrier = comp if comp is not None else sec
            f = f + carrier.n_fiber[fiber] * (-M_c * carrier.c(fiber) / carrier.I)
            stresses[fiber] = f + shrink.get(fiber, 0.0)
        return stresses

    factors = job.limits.factors(spec.limit_stage, job.post_tensioned)
    cases = () if factors.unity else tuple((g, stresses_for(g * P)) for g in factors.cases)
    return StageStresses(
        spec, sts, x, P, cgs, e, ms, stresses_for(P), sec, comp, note, factors, cases
    )


def deck_shrinkage_stresses(girder: Girder) -> dict[str, float]:
    """Fiber stresses of the deck's shrinkage (MPa), times the job's factor.

    The restraint force F (:func:`prestress.losses.refined.deck_shrinkage_force`) compresses
    the composite section at the deck's centroid, ed above the composite centroid:
    f = n (−F/Ac − F ed c / Ic) at a fiber c above the centroid; the deck itself carries the
    restraining tension F/Ad on top of that (AASHTO LRFD 9th Ed. (2020) 5.9.3.4.3d, the
    force of Eq. 5.9.3.4.3d-2; common practice for the stresses). Uniform along the span
    (a simplification at the ends, where the force is transferred to the girder).
    """
    job = girder.job
    comp = girder.section_composite
    if job.deck is None or comp is None or job.loads.deck_shrinkage == 0.0:
        return {}
    from prestress.losses.refined import deck_shrinkage_force

    F = deck_shrinkage_force(girder)[0] * job.loads.deck_shrinkage
    deck = job.deck
    y_deck = girder.gross.height + deck.haunch + deck.thickness / 2.0
    e_d = y_deck - comp.yb
    out = {}
    for fiber in FIBERS:
        if fiber not in comp.fibers:
            continue
        f = comp.n_fiber[fiber] * (-F / comp.area - F * e_d * comp.c(fiber) / comp.I)
        if fiber == "deck_top":
            f += F / (deck.effective_width * deck.thickness)
        out[fiber] = f
    return out


# ------------------------------------------------------------------------------------------
# Tensile force on the uncracked section (for the bonded reinforcement at release)


def _clip_ring(ring: np.ndarray, y0: float, keep_above: bool) -> np.ndarray:
    """The part of a closed ring on one side of the line y = y0 (Sutherland–Hodgman)."""
    pts = ring[:-1] if np.allclose(ring[0], ring[-1]) else ring
    out: list[np.ndarray] = []
    n = len(pts)
    for i in range(n):
        a, b = pts[i], pts[(i + 1) % n]
        ina = a[1] >= y0 if keep_above else a[1] <= y0
        inb = b[1] >= y0 if keep_above else b[1] <= y0
        if ina:
            out.append(a)
        if ina != inb:
            t = (y0 - a[1]) / (b[1] - a[1])
            out.append(a + t * (b - a))
    return np.array(out) if out else np.zeros((0, 2))


def _area_and_centroid_y(ring: np.ndarray) -> tuple[float, float]:
    """Area (absolute) and centroid height of a polygon ring (shoelace formula)."""
    if len(ring) < 3:
        return 0.0, 0.0
    x, y = ring[:, 0], ring[:, 1]
    x2, y2 = np.roll(x, -1), np.roll(y, -1)
    cross = x * y2 - x2 * y
    a = cross.sum() / 2.0
    if abs(a) < 1e-12:
        return 0.0, 0.0
    return abs(a), float(((y + y2) * cross).sum() / (6.0 * a))


def tensile_force(
    exterior: np.ndarray, holes: list[np.ndarray], f_bottom: float, f_top: float, height: float
) -> float:
    """Resultant of the tensile stresses on an uncracked section, N (0 without tension).

    The stress varies linearly from ``f_bottom`` at y = 0 to ``f_top`` at y = ``height``
    (MPa, tension +). Over the tensile part of the section (clipped at the neutral axis),
    the integral of a linear stress is its value at the part's centroid times the part's
    area (exact). Used for the bonded reinforcement that AASHTO LRFD Table 5.9.2.3.1b-1 asks
    for with the higher tension limit at release.
    """
    if f_bottom <= 0.0 and f_top <= 0.0:
        return 0.0

    def stress(y: float) -> float:
        return f_bottom + (f_top - f_bottom) * y / height

    if f_bottom > 0.0 and f_top > 0.0:
        rings, y0, above = [exterior, *holes], None, True
    else:
        y0 = height * f_bottom / (f_bottom - f_top)  # neutral axis
        above = f_top > 0.0
        rings = [exterior, *holes]
    force = 0.0
    for k, ring in enumerate(rings):
        part = ring if y0 is None else _clip_ring(np.asarray(ring, dtype=float), y0, above)
        area, yc = _area_and_centroid_y(np.asarray(part, dtype=float))
        force += (1.0 if k == 0 else -1.0) * area * stress(yc)
    return max(force, 0.0)


# ------------------------------------------------------------------------------------------
# The permissible zone of the cgs


@dataclass(frozen=True)
class ZoneStation:
    """The permissible band of cgs heights at one station, and the actual cgs.

    The band (mm above the girder bottom) keeps every girder fiber within its limits in
    every stage.

    Attributes:
        station: the station.
        low: lowest permissible cgs height (None: no lower bound).
        high: highest permissible cgs height (None: no upper bound).
        cgs: actual height of the cgs.
        governing_low: "stage fiber" setting the lower bound.
        governing_high: "stage fiber" setting the upper bound.
    """

    station: Station
    low: float | None
    high: float | None
    cgs: float
    governing_low: str
    governing_high: str

    @property
    def inside(self) -> bool:
        """Whether the cgs lies inside the band (and the band is not empty)."""
        lo = -np.inf if self.low is None else self.low
        hi = np.inf if self.high is None else self.high
        return lo <= hi and lo - 1e-6 <= self.cgs <= hi + 1e-6

    @property
    def empty(self) -> bool:
        """Whether no cgs height works here: the lower bound lies above the upper one."""
        return self.low is not None and self.high is not None and self.low > self.high + 1e-6

    @property
    def margin(self) -> float | None:
        """Distance from the cgs to the nearer edge (mm; negative outside).

        None if unbounded, or if the band is empty (no height would do: a distance to one
        edge would suggest a move of the cgs that breaks the other bound).
        """
        if self.empty:
            return None
        edges = [
            v
            for v in (
                None if self.low is None else self.cgs - self.low,
                None if self.high is None else self.high - self.cgs,
            )
            if v is not None
        ]
        return min(edges) if edges else None


#: Short stage names for messages.
STAGE_SHORT = {
    "transfer": "release",
    "handling": "handling",
    "deck_placement": "deck placement",
    "service_permanent": "permanent",
    "service_i": "Service I",
    "service_iii": "Service III",
}


def zone_bounds(
    r: StageStresses, limits: dict[str, tuple[float | None, float | None]]
) -> list[tuple[float, float, str, str]]:
    """Bounds on the cgs height at each station of a stage from its girder-fiber limits.

    Each girder fiber's stress is linear in the eccentricity e for the stage's force P:
    f(e) = f(e0) + n P c / I (e − e0). The limits comp ≤ f ≤ tens bound e, hence the cgs
    height y = yb − e. With factors on the prestress (``r.cases``) the force of each case is
    the factor times P, and the band is the intersection of the cases' bands. Returns (low,
    high, who sets low, who sets high) per station, with ±inf where unbounded.
    """
    sec = r.section
    out = []
    for i in range(len(r.x)):
        lo, hi, who_lo, who_hi = -np.inf, np.inf, "", ""
        for (g, stresses), (fiber, (comp, tens)) in product(r.checked_cases(), limits.items()):
            if fiber not in stresses or fiber == "deck_top":
                continue
            P = g * r.force[i]
            k = sec.n_fiber[fiber] * P * sec.c(fiber) / sec.I  # ∂f/∂e
            f0 = stresses[fiber][i]
            e0 = r.eccentricity[i]
            if abs(k) < 1e-15:
                continue
            for lim in (comp, tens):
                if lim is None:
                    continue
                e_lim = e0 + (lim - f0) / k  # eccentricity at which f = lim
                y_lim = sec.yb - e_lim
                # f grows with e when k > 0, i.e. grows as y falls
                is_comp = lim is comp
                # feasible side: for compression f ≥ comp; for tension f ≤ tens
                upper_bound_on_e = (k < 0) if is_comp else (k > 0)
                short = STAGE_SHORT.get(r.spec.limit_stage, r.spec.limit_stage)
                if r.spec.key == "transfer" and r.section.name.startswith("net"):
                    short = "stressing"  # post-tensioning, on the section net of the ducts
                if r.spec.key != r.spec.limit_stage:  # one of several handling cases
                    short += f" ×{r.spec.dead:g}"
                tag = (
                    f"{short} {fiber.replace('girder_', '')} "
                    f"{'compression' if is_comp else 'tension'}"
                )
                if g != 1.0:  # a case of the limit set's factors on the prestress
                    tag += f" (P × {g:g})"
                if upper_bound_on_e:  # e ≤ e_lim  ⇔  y ≥ y_lim
                    if y_lim > lo:
                        lo, who_lo = y_lim, tag
                else:  # e ≥ e_lim ⇔ y ≤ y_lim
                    if y_lim < hi:
                        hi, who_hi = y_lim, tag
        out.append((lo, hi, who_lo, who_hi))
    return out
