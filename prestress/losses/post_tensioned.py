"""Losses of post-tensioned girders, and the "given" long-term loss method.

Post-tensioned tendons: friction with curvature and wobble (AASHTO LRFD 9th Ed. (2020) Eq.
5.9.3.2.2b-1) from the tendon's angular change along its parabolic profile, anchor set by the
area method, the expected jack elongation (:mod:`prestress.tendons`), and elastic shortening
from stressing N tendons one after another, ΔfpES = (N − 1)/(2N) Ep/Eci fcgp (Eq.
5.9.3.2.3b-1), with fcgp on the girder net of the open ducts (the section at stressing,
:func:`prestress.sections.composite.section_at_stressing`). Time-dependent losses are given by
the engineer (``method = "given"``): the AASHTO estimates of 5.9.3.3 and 5.9.3.4 implemented here
are for pretensioned girders. The tendon stresses are checked against the limits of AASHTO LRFD
9th Ed. (2020) Table 5.9.2.2-1 (:func:`tendon_limit_checks`) and the duct size against 5.4.6.2.
"""

from __future__ import annotations

import math
from dataclasses import dataclass
from typing import TYPE_CHECKING

import numpy as np

from prestress.codes.aashto_lrfd import losses as aashto
from prestress.codes.aashto_lrfd import post_tensioning as pt
from prestress.losses import LossBreakdown, LossComponent, register
from prestress.losses.pretensioned import before_transfer, elastic_shortening_component, finish
from prestress.sections.composite import AssembledSection, section_at_stressing
from prestress.tendons import AnchorSetZone, jack_elongation, post_tensioning_stresses_along

if TYPE_CHECKING:
    from prestress.analysis import Girder
    from prestress.model import Tendon

from prestress.units import KSI_MPA as _KSI  # MPa per ksi


@dataclass(frozen=True)
class TendonState:
    """One tendon's stresses along the girder after friction and anchor set (MPa, mm).

    Attributes:
        tendon: the tendon.
        x: stations from anchor to anchor (evenly spaced, plus the ends of the anchor-set zones
            and the neutral point), mm.
        after_friction: stress after friction at x, MPa.
        after_set: stress after friction and anchor set at x, MPa.
        elongation: expected jack elongation per stressing end, mm (at fpj before seating,
            including the jack length; see :func:`prestress.tendons.jack_elongation`).
        set_zones: the anchor-set zone of each stressing anchorage.
        neutral_point: the neutral point when jacked at both ends, mm, else None.
    """

    tendon: Tendon
    x: np.ndarray
    after_friction: np.ndarray
    after_set: np.ndarray
    elongation: dict[str, float]
    set_zones: tuple[AnchorSetZone, ...] = ()
    neutral_point: float | None = None

    def at(self, x: np.ndarray) -> np.ndarray:
        """Stress after friction and anchor set at positions x (linear between stations)."""
        return np.interp(x, self.x, self.after_set)


def tendon_states(girder: Girder, n: int = 241) -> list[TendonState]:
    """Friction, anchor set and elongation of every tendon, on a fine grid along the girder."""
    job = girder.job
    out = []
    for t in job.tendons:
        prof = t.profile(girder.gross.height)
        r = post_tensioning_stresses_along(
            prof,
            n,
            f_pj_MPa=t.jacking_stress,
            mu=t.mu,
            K_per_mm=t.K,
            E_p_MPa=job.strand.Ep,
            set_mm=t.anchor_set,
            jacking=t.jacking,
        )
        el = jack_elongation(
            prof,
            f_pj_MPa=t.jacking_stress,
            mu=t.mu,
            K_per_mm=t.K,
            E_p_MPa=job.strand.Ep,
            jacking=t.jacking,
            stressing_end_length_mm=t.jack_length,
        )
        out.append(
            TendonState(
                t,
                np.asarray(r.x_mm),
                np.asarray(r.f_px_friction_MPa),
                np.asarray(r.f_p_after_set_MPa),
                el,
                r.anchor_set_zones,
                r.neutral_point_mm,
            )
        )
    return out


def stressing_section(girder: Girder) -> AssembledSection:
    """The section carrying the prestress at stressing: the girder net of the open ducts.

    The girder's ``section_transfer`` (set so by ``analysis.resolve_girder`` for post-tensioned
    jobs); built here the same way when the girder does not carry one.
    """
    if girder.section_transfer is not None:
        return girder.section_transfer
    return section_at_stressing(girder.gross, girder.job.tendons, girder.job.length / 2.0)[0]


def elastic_shortening_pt(girder: Girder, states: list[TendonState]) -> tuple[float, float]:
    """(ΔfpES, fcgp) at midlength for sequential stressing, Eq. 5.9.3.2.3b-1 (MPa).

    fcgp (5.9.3.2.3a) from the tendon forces after friction and anchor set and the girder's
    self-weight moment on its length, on the section at stressing (net of the open ducts).
    """
    job = girder.job
    g = stressing_section(girder)
    xm = np.array([job.length / 2.0])
    P = sum(s.tendon.area * float(s.at(xm)[0]) for s in states)
    e = g.yb - float(job.cgs_geometric(xm)[0])
    M_g = girder.self_weight * job.length**2 / 8.0
    fcgp = aashto.f_cgp(P, g.area, g.I, e, M_g)
    Eci = job.girder_concrete.Eci
    assert Eci is not None
    N = len(states)
    return pt.delta_f_pES_post_tensioned(N, job.strand.Ep, Eci, max(fcgp, 0.0)), fcgp


def tendon_stress(
    girder: Girder, losses: LossBreakdown, when: str, x: np.ndarray
) -> list[tuple[Tendon, np.ndarray]]:
    """Each tendon's stress at x at a time: after friction and set, less ES and long-term.

    At deck placement, a loss method that gives no losses to deck placement (``given`` without
    ``long_term_to_deck``) has the final time-dependent losses used, as for pretensioned
    girders (a note of the loss breakdown says so).
    """
    states = tendon_states(girder)
    es = next((c.value for c in losses.components if c.key == "elastic_shortening"), 0.0)
    lt = 0.0
    if when == "final" or (when == "deck_placement" and not _gives_deck_losses(losses)):
        lt = sum(c.value for c in losses.components if c.applied and c.period in TIME_DEPENDENT)
    elif when == "deck_placement":
        lt = sum(
            c.value
            for c in losses.components
            if c.applied and c.period == "transfer to deck placement"
        )
    return [(s.tendon, np.clip(s.at(x) - es - lt, 0.0, None)) for s in states]


#: The periods of the time-dependent losses.
TIME_DEPENDENT = ("transfer to deck placement", "deck placement to final", "long term")


def _gives_deck_losses(losses: LossBreakdown) -> bool:
    return any(c.period == "transfer to deck placement" for c in losses.components)


@dataclass(frozen=True)
class TendonLimitCheck:
    """One tendon stress against one row of AASHTO LRFD 9th Ed. (2020) Table 5.9.2.2-1 (MPa, mm).

    Attributes:
        tendon: the tendon's name.
        key: the row (see :data:`prestress.codes.aashto_lrfd.post_tensioning.TENDON_STRESS_LIMITS`).
        condition: the row's condition in words.
        where: where the stress is found, in words (e.g. "left anchorage").
        x: station of that stress, mm from the left end.
        stress: the tendon stress, MPa.
        limit: the limit, MPa.
        limit_text: the limit in words, e.g. "0.70 fpu".
    """

    tendon: str
    key: str
    condition: str
    where: str
    x: float
    stress: float
    limit: float
    limit_text: str

    @property
    def ratio(self) -> float:
        """stress / limit."""
        return self.stress / self.limit

    @property
    def ok(self) -> bool:
        """Whether the stress is within the limit (round-off allowed)."""
        return self.stress <= self.limit * (1.0 + 1e-9)


LIMITS_SOURCE = "AASHTO LRFD 9th Ed. (2020) Table 5.9.2.2-1, post-tensioning, values from memory"


def tendon_limit_checks(
    girder: Girder, states: list[TendonState] | None = None
) -> list[TendonLimitCheck]:
    """Every tendon's stresses against AASHTO LRFD 9th Ed. (2020) Table 5.9.2.2-1.

    Rows (low-relaxation strand, values from memory): fpj prior to seating against 0.90 fpy; the
    stress at each anchorage immediately after anchor set against 0.70 fpu (the dead end is an
    anchorage too; from memory); the highest stress away from the anchorages immediately after
    anchor set against 0.74 fpu (0.70 fpu for stress-relieved strand); the highest effective
    stress after all losses (after set, less elastic shortening and the final time-dependent
    losses of the job) against 0.80 fpy.
    """
    job = girder.job
    states = tendon_states(girder) if states is None else states
    strand = job.strand
    limits = pt.f_p_limits_post_tensioned(strand.fpu / _KSI, strand.fpy / _KSI, strand.relaxation)
    es = elastic_shortening_pt(girder, states)[0] if states else 0.0
    lt_final = job.long_term_given[0] if job.long_term_given is not None else 0.0
    out: list[TendonLimitCheck] = []

    def add(s: TendonState, key: str, where: str, x: float, stress: float) -> None:
        row, lim_ksi = limits[key]
        out.append(
            TendonLimitCheck(
                s.tendon.name, key, row.condition, where, x, stress, lim_ksi * _KSI, row.text
            )
        )

    for s in states:
        t = s.tendon
        x0 = float(s.x[0]) if t.jacking != "right" else float(s.x[-1])
        jacks = "both jacks" if t.jacking == "both" else f"the {t.jacking} jack"
        add(s, "prior_to_seating", f"at {jacks}", x0, t.jacking_stress)
        for side, k in (("left", 0), ("right", -1)):
            dead = "" if t.jacking in (side, "both") else " (dead end)"
            add(
                s,
                "anchorage_after_set",
                f"{side} anchorage{dead}",
                float(s.x[k]),
                float(s.after_set[k]),
            )
        inner = s.after_set[1:-1] if len(s.x) > 2 else s.after_set
        xin = s.x[1:-1] if len(s.x) > 2 else s.x
        k = int(np.argmax(inner))
        add(s, "elsewhere_after_set", "peak after anchor set", float(xin[k]), float(inner[k]))
        fpe = np.clip(s.after_set - es - lt_final, 0.0, None)
        k = int(np.argmax(fpe))
        add(s, "service", "peak effective stress", float(s.x[k]), float(fpe[k]))
    return out


def _both(v: float, system: str, role: str, digits: int = 1) -> str:
    """A value in the job's output units, then in the other system's in parentheses.

    Notes are written before the output units are known (``--units`` may change them), so
    they carry both.
    """
    from prestress.units import from_internal, out_unit

    other = "SI" if system == "US" else "US"
    return (
        f"{from_internal(v, system, role):,.{digits}f} {out_unit(system, role).label} "
        f"({from_internal(v, other, role):,.{digits}f} {out_unit(other, role).label})"
    )


def _stress_text(v: float, system: str) -> str:
    return _both(v, system, "stress")


def _position_text(x: float, system: str) -> str:
    return _both(x, system, "position")


def limit_notes(checks: list[TendonLimitCheck], system: str) -> list[str]:
    """The tendon stress checks as notes, values in the job's output units (``"US"``/``"SI"``).

    A warning for each stress above its limit; otherwise one note with the highest ratio.
    """
    out = []
    for c in checks:
        if c.ok:
            continue
        place = (
            f"at the {c.where}"
            if c.key == "anchorage_after_set"
            else (
                f"{c.where}"
                if c.key == "prior_to_seating"
                else f"at {_position_text(c.x, system)} from the left end"
            )
        )
        out.append(
            f"warning: tendon {c.tendon}: {_stress_text(c.stress, system)} {place} exceeds "
            f"{c.limit_text} = {_stress_text(c.limit, system)}, the limit {c.condition} "
            f"({LIMITS_SOURCE}); lower the jacking stress"
            + (" or jack from both ends" if "dead end" in c.where else "")
        )
    if checks and not out:
        c = max(checks, key=lambda c: c.ratio)
        out.append(
            f"tendon stresses within the limits of {LIMITS_SOURCE}: highest ratio "
            f"{c.ratio:.2f}, tendon {c.tendon}, {c.where} "
            f"{_stress_text(c.stress, system)} ≤ {c.limit_text} = {_stress_text(c.limit, system)}"
        )
    return out


def duct_notes(girder: Girder) -> list[str]:
    """Duct size of multi-strand tendons against AASHTO LRFD 9th Ed. (2020) 5.4.6.2 (warnings).

    The job gives the OUTSIDE duct diameter; the inside area is smaller, so a duct whose outside
    area is under 2.0 times the strand area certainly fails the rule (from memory) and is
    reported; one that passes on the outside diameter must still be checked on the inside one.
    """
    from prestress.units import INCH_MM

    job = girder.job
    system = job.units
    out = []
    for t in job.tendons:
        if t.duct_diameter <= 0.0 or t.strands < 2:
            continue
        ratio, ok = pt.duct_area_ratio_ok(t.duct_diameter / INCH_MM, t.area / INCH_MM**2)
        if not ok:
            a_duct = math.pi * t.duct_diameter**2 / 4.0
            out.append(
                f"warning: tendon {t.name}: the duct area from its outside diameter, "
                f"{_both(a_duct, system, 'area', 2)}, is only {ratio:.2f} times the strand area "
                f"{_both(t.area, system, 'area', 3)}; AASHTO LRFD 9th Ed. (2020) 5.4.6.2 "
                f"asks for an inside area of at least {pt.DUCT_AREA_RATIO_MIN:g} times it "
                "(2.5 for the pull-through method; from memory)"
            )
    return out


@register("given")
def given(girder: Girder) -> LossBreakdown:
    """Losses at transfer by the clauses above; time-dependent losses as given in the job."""
    job = girder.job
    if job.long_term_given is None:
        from prestress.errors import InputError

        raise InputError(
            'losses.long_term in the job for the method "given"',
            file=job.file,
            field="losses.long_term",
        )
    lt_final, lt_deck = job.long_term_given
    comps: list[LossComponent] = []
    figures: dict[str, tuple[float, str]] = {}
    notes = ["time-dependent losses as given in the job (losses.long_term)"]
    if job.post_tensioned:
        states = tendon_states(girder)
        xm = np.array([job.length / 2.0])
        areas = np.array([s.tendon.area for s in states])
        fpj = float(np.dot(areas, [s.tendon.jacking_stress for s in states]) / areas.sum())
        fr = float(
            np.dot(areas, [fpj - np.interp(xm, s.x, s.after_friction)[0] for s in states])
            / areas.sum()
        )
        st = float(
            np.dot(areas, [np.interp(xm, s.x, s.after_friction - s.after_set)[0] for s in states])
            / areas.sum()
        )
        es, fcgp = elastic_shortening_pt(girder, states)
        checks = tendon_limit_checks(girder, states)
        sec = stressing_section(girder)
        net = sec.area < girder.gross.area
        comps += [
            LossComponent(
                "friction",
                "Friction (curvature and wobble), at midlength",
                fr,
                "at transfer",
                "AASHTO LRFD 9th Ed. (2020) Eq. 5.9.3.2.2b-1",
            ),
            LossComponent(
                "anchor_set",
                "Anchor set, at midlength",
                st,
                "at transfer",
                "area method on the friction curve (from memory)",
            ),
            LossComponent(
                "elastic_shortening",
                f"Elastic shortening, {len(states)} tendons stressed in turn"
                + (", net section" if net else ""),
                es,
                "at transfer",
                "AASHTO LRFD 9th Ed. (2020) Eq. 5.9.3.2.3b-1",
            ),
        ]
        figures["fcgp (midlength)"] = (fcgp, "stress")
        figures[f"area of the {sec.name} section"] = (sec.area, "area")
        figures[f"yb of the {sec.name} section"] = (sec.yb, "dimension")
        figures[f"I of the {sec.name} section"] = (sec.I, "inertia")
        for s in states:
            for end, v in s.elongation.items():
                figures[f"{s.tendon.name} jack elongation ({end})"] = (v, "dimension")
        notes.append(
            "tendon stresses vary along the girder (friction and anchor set); the "
            "stage tables use the stress at each station"
        )
        if lt_deck is None:
            notes.append(
                "given gives no losses at deck placement (no losses.long_term_to_deck); the "
                "final losses are used for that stage"
            )
        notes += limit_notes(checks, job.units)
        notes += duct_notes(girder)
        strand_fpj = fpj
        f_pt_real = fpj - fr - st - es
    else:
        es_comp, figures = elastic_shortening_component(girder)
        comps += [*before_transfer(girder), es_comp]
        strand_fpj = job.strand.jacking_stress
        f_pt_real = job.strand.stress_before_transfer - es_comp.value
    if lt_deck is not None:
        comps.append(
            LossComponent(
                "long_term",
                "Time-dependent losses (given)",
                lt_deck,
                "transfer to deck placement",
                "given in the job",
            )
        )
        comps.append(
            LossComponent(
                "long_term_after_deck",
                "Time-dependent losses (given)",
                lt_final - lt_deck,
                "deck placement to final",
                "given in the job",
            )
        )
    else:
        comps.append(
            LossComponent(
                "long_term",
                "Time-dependent losses (given)",
                lt_final,
                "long term",
                "given in the job",
            )
        )
    b = finish(
        girder,
        method="given",
        title="losses at transfer by the code; time-dependent losses given by the engineer",
        components=comps,
        figures=figures,
        notes=notes,
        deck_stress=None if lt_deck is None else f_pt_real - lt_deck,
    )
    if not job.post_tensioned:
        return b
    from dataclasses import replace

    f_pt = strand_fpj - sum(c.value for c in comps if c.period == "at transfer")
    f_pe = f_pt - lt_final
    by_key = {"jacking": strand_fpj, "transfer": f_pt, "final": f_pe}
    if lt_deck is not None:
        by_key["deck_placement"] = f_pt - lt_deck
    ms = tuple(replace(m, stress=by_key[m.key]) for m in b.milestones)
    return replace(
        b,
        jacking_stress=strand_fpj,
        f_pt=f_pt,
        f_pe=f_pe,
        applied_transfer=f_pt,
        applied_final=f_pe,
        milestones=ms,
    )
