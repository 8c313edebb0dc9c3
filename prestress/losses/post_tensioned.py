"""Losses of post-tensioned girders, and the "given" long-term loss method.

Post-tensioned tendons: friction with curvature and wobble (AASHTO LRFD 9th Ed. (2020) Eq.
5.9.3.2.2b-1) from the tendon's angular change along its parabolic profile, anchor set by the
area method, the expected jack elongation (:mod:`prestress.tendons`), and elastic shortening
from stressing N tendons one after another, ΔfpES = (N − 1)/(2N) Ep/Eci fcgp (Eq.
5.9.3.2.3b-1). Time-dependent losses are given by the engineer (``method = "given"``): the
AASHTO estimates of 5.9.3.3 and 5.9.3.4 implemented here are for pretensioned girders.
"""

from __future__ import annotations

from dataclasses import dataclass
from typing import TYPE_CHECKING

import numpy as np

from prestress.codes.aashto_lrfd import losses as aashto
from prestress.codes.aashto_lrfd import post_tensioning as pt
from prestress.losses import LossBreakdown, LossComponent, register
from prestress.losses.pretensioned import before_transfer, elastic_shortening_component, finish
from prestress.tendons import jack_elongation, post_tensioning_stresses

if TYPE_CHECKING:
    from prestress.analysis import Girder
    from prestress.model import Tendon


@dataclass(frozen=True)
class TendonState:
    """One tendon's stresses along the girder after friction and anchor set (MPa, mm)."""

    tendon: Tendon
    x: np.ndarray
    after_friction: np.ndarray
    after_set: np.ndarray
    elongation: dict[str, float]

    def at(self, x: np.ndarray) -> np.ndarray:
        """Stress after friction and anchor set at positions x (linear between stations)."""
        return np.interp(x, self.x, self.after_set)


def tendon_states(girder: Girder, n: int = 241) -> list[TendonState]:
    """Friction, anchor set and elongation of every tendon, on a fine grid along the girder."""
    job = girder.job
    out = []
    for t in job.tendons:
        prof = t.profile(girder.gross.height)
        x = np.linspace(prof.x_start_mm, prof.x_end_mm, n)
        r = post_tensioning_stresses(
            prof,
            x,
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
        )
        out.append(
            TendonState(t, x, np.asarray(r.f_px_friction_MPa), np.asarray(r.f_p_after_set_MPa), el)
        )
    return out


def elastic_shortening_pt(girder: Girder, states: list[TendonState]) -> tuple[float, float]:
    """(ΔfpES, fcgp) at midlength for sequential stressing, Eq. 5.9.3.2.3b-1 (MPa)."""
    job = girder.job
    g = girder.gross
    xm = np.array([job.length / 2.0])
    P = sum(s.tendon.area * float(s.at(xm)[0]) for s in states)
    e = g.yb - float(job.cgs_geometric(xm)[0])
    M_g = girder.self_weight * job.length**2 / 8.0
    fcgp = aashto.f_cgp(P, g.area, g.Ix, e, M_g)
    Eci = job.girder_concrete.Eci
    assert Eci is not None
    N = len(states)
    return pt.delta_f_pES_post_tensioned(N, job.strand.Ep, Eci, max(fcgp, 0.0)), fcgp


def tendon_stress(
    girder: Girder, losses: LossBreakdown, when: str, x: np.ndarray
) -> list[tuple[Tendon, np.ndarray]]:
    """Each tendon's stress at x at a time: after friction and set, less ES and long-term."""
    states = tendon_states(girder)
    es = next((c.value for c in losses.components if c.key == "elastic_shortening"), 0.0)
    lt = 0.0
    if when == "final":
        lt = sum(
            c.value
            for c in losses.components
            if c.applied
            and c.period in ("transfer to deck placement", "deck placement to final", "long term")
        )
    elif when == "deck_placement":
        lt = sum(
            c.value
            for c in losses.components
            if c.applied and c.period == "transfer to deck placement"
        )
    return [(s.tendon, np.clip(s.at(x) - es - lt, 0.0, None)) for s in states]


#: AASHTO LRFD 9th Ed. (2020) Table 5.9.2.2-1, post-tensioning, low-relaxation strand, as
#: fractions of fpu (values from memory): at anchorages after anchor set; elsewhere after set.
PT_LIMIT_AT_ANCHORAGE = 0.70
PT_LIMIT_ELSEWHERE = 0.74


def stress_limit_notes(girder: Girder, states: list[TendonState]) -> list[str]:
    """Tendon stresses after anchor set against Table 5.9.2.2-1 (reported as notes)."""
    fpu = girder.job.strand.fpu
    out = []
    for s in states:
        ends = [s.after_set[0], s.after_set[-1]]
        if max(ends) > PT_LIMIT_AT_ANCHORAGE * fpu * (1 + 1e-9):
            out.append(
                f"tendon {s.tendon.name}: {max(ends) / 6.894757:.1f} ksi at an anchorage "
                f"after anchor set exceeds {PT_LIMIT_AT_ANCHORAGE:.2f} fpu (AASHTO LRFD "
                "Table 5.9.2.2-1, from memory)"
            )
        if s.after_set.max() > PT_LIMIT_ELSEWHERE * fpu * (1 + 1e-9):
            out.append(
                f"tendon {s.tendon.name}: {s.after_set.max() / 6.894757:.1f} ksi after "
                f"anchor set exceeds {PT_LIMIT_ELSEWHERE:.2f} fpu away from the "
                "anchorages (AASHTO LRFD Table 5.9.2.2-1, from memory)"
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
                f"Elastic shortening, {len(states)} tendons stressed in turn",
                es,
                "at transfer",
                "AASHTO LRFD 9th Ed. (2020) Eq. 5.9.3.2.3b-1",
            ),
        ]
        figures["fcgp (midlength)"] = (fcgp, "stress")
        for s in states:
            for end, v in s.elongation.items():
                figures[f"{s.tendon.name} jack elongation ({end})"] = (v, "dimension")
        notes.append(
            "tendon stresses vary along the girder (friction and anchor set); the "
            "stage tables use the stress at each station"
        )
        strand_fpj = fpj
    else:
        es_comp, figures = elastic_shortening_component(girder)
        comps += [*before_transfer(girder), es_comp]
        strand_fpj = job.strand.jacking_stress
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
    )
    if not job.post_tensioned:
        return b
    from dataclasses import replace

    f_pt = strand_fpj - sum(c.value for c in comps if c.period == "at transfer")
    f_pe = f_pt - lt_final
    ms = tuple(
        replace(
            m, stress=strand_fpj if m.key == "jacking" else (f_pt if m.key == "transfer" else f_pe)
        )
        for m in b.milestones
    )
    return replace(
        b,
        jacking_stress=strand_fpj,
        f_pt=f_pt,
        f_pe=f_pe,
        applied_transfer=f_pt,
        applied_final=f_pe,
        milestones=ms,
    )
