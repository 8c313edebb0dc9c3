"""The AASHTO LRFD refined estimate of time-dependent losses (5.9.3.4) for a job's girder.

Gathers the section, material, load and age figures the estimate needs at midspan, converts
them once to ksi/in/kip, and calls :func:`prestress.codes.aashto_lrfd.refined_losses`.
Δfcd depends on the losses between transfer and deck placement, which depend on nothing
after deck placement: a first evaluation gives them, a second one uses them in Δfcd (exact).
"""

from __future__ import annotations

from typing import TYPE_CHECKING

from prestress.codes.aashto_lrfd import losses as aashto
from prestress.codes.aashto_lrfd import refined_losses as rl
from prestress.errors import InputError
from prestress.losses import LossBreakdown, LossComponent, register
from prestress.losses.pretensioned import (
    before_transfer,
    elastic_shortening_component,
    finish,
    low_humidity_notes,
)
from prestress.units import INCH_MM, KIP_N, KSI_MPA, in_both

if TYPE_CHECKING:
    from prestress.analysis import Girder

CLAUSE = "AASHTO LRFD 9th Ed. (2020)"


def midspan_noncomposite_moment(girder: Girder) -> float:
    """Moment at midspan of the loads placed on the girder alone after transfer (N*mm).

    Deck, haunch and other non-composite load on the span, and the diaphragms.
    """
    from prestress.actions import point_on_span

    job = girder.job
    S = job.span
    m = girder.deck_weight * S**2 / 8.0
    for at, P in job.loads.diaphragms:
        m += float(point_on_span(P, at, S, [S / 2.0])[0])
    return m


def deck_volume_to_surface(girder: Girder) -> float:
    """V/S of the deck slab (mm): both faces exposed except over the girder's top flange.

    common practice: the slab's soffit over the flange is not exposed to drying.
    """
    deck = girder.job.deck
    assert deck is not None
    b, t = deck.effective_width, deck.thickness
    exposed = 2.0 * b - min(girder.gross.top_width, b)
    return b * t / exposed


def refined_input(girder: Girder, f_pt: float, loss_id: float = 0.0) -> rl.RefinedLossInput:
    """The refined estimate's inputs at midspan, in ksi/in/kip, from the resolved girder.

    Args:
        girder: the resolved girder.
        f_pt: strand stress just after transfer, MPa.
        loss_id: the time-dependent losses between transfer and deck placement, ksi, that
            enter Δfcd (0 for a first evaluation).
    """
    job = girder.job
    if job.deck is None or girder.composite_section is None:
        raise InputError(
            "a [deck] table: the refined estimate (5.9.3.4) is for girders with a composite deck",
            file=job.file,
            field="losses.method",
            got="'aashto-refined' without a deck",
        )
    g = girder.gross
    c = girder.composite_section
    deck = job.deck
    gc = job.girder_concrete
    e_pg = girder.eccentricity_gross
    e_pc = c.yb - job.y_ps
    y_deck = g.height + deck.haunch + deck.thickness / 2.0
    M_g = girder.self_weight * job.length**2 / 8.0
    P_i = job.A_ps * f_pt
    f_cgp = aashto.f_cgp(P_i, g.area, g.Ix, e_pg, M_g)
    M_deck = midspan_noncomposite_moment(girder)
    M_sdl = (job.loads.superimposed_dead + job.loads.wearing_surface) * job.span**2 / 8.0
    inch2, inch4, kipin = INCH_MM**2, INCH_MM**4, KIP_N * INCH_MM
    assert gc.fci is not None and gc.Eci is not None
    return rl.RefinedLossInput(
        A_g=g.area / inch2,
        I_g=g.Ix / inch4,
        e_pg=e_pg / INCH_MM,
        f_ci=gc.fci / KSI_MPA,
        f_c=gc.fc / KSI_MPA,
        E_ci=gc.Eci / KSI_MPA,
        E_c=gc.Ec / KSI_MPA,
        V_S_girder=g.volume_to_surface / INCH_MM,
        A_d=deck.effective_width * deck.thickness / inch2,
        e_d=(y_deck - c.yb) / INCH_MM,
        E_cd=deck.concrete.Ec / KSI_MPA,
        V_S_deck=deck_volume_to_surface(girder) / INCH_MM,
        f_c_deck=deck.concrete.fc / KSI_MPA,
        A_c=c.area / inch2,
        I_c=c.I / inch4,
        e_pc=e_pc / INCH_MM,
        A_ps=job.A_ps / inch2,
        E_p=job.strand.Ep / KSI_MPA,
        f_pt=f_pt / KSI_MPA,
        f_py=job.strand.fpy / KSI_MPA,
        strand="low_relaxation" if job.strand.relaxation == "low" else "stress_relieved",
        f_cgp=f_cgp / KSI_MPA,
        delta_f_cd=rl.delta_f_cd(
            loss_id,
            job.A_ps / inch2,
            g.area / inch2,
            g.Ix / inch4,
            e_pg / INCH_MM,
            M_deck / kipin,
            M_sdl / kipin,
            c.I / inch4,
            e_pc / INCH_MM,
        ),
        H=job.times.relative_humidity,
        t_i=job.times.transfer,
        t_d=job.times.deck_placement,
        t_f=job.times.final,
    )


def deck_shrinkage_force(girder: Girder) -> tuple[float, str]:
    """Restraint force of the deck's shrinkage from deck placement to final (N), and its text.

    F = εddf Ad Ecd / [1 + 0.7 ψd(tf, td)], the force of AASHTO LRFD 9th Ed. (2020)
    Eq. 5.9.3.4.3d-2, with the deck shrinkage and creep of 5.4.2.3 evaluated as in the
    refined estimate (deck f'ci = 0.80 f'c, loading age of the deck 1 day, the deck's V/S).
    It acts on the composite section at the deck's centroid, compressing it; the deck itself
    carries the tension F/Ad that restrains it.
    """
    from prestress.codes.aashto_lrfd import creep_shrinkage as cs

    job = girder.job
    deck = job.deck
    assert deck is not None
    t = job.times
    fc_d = deck.concrete.fc / KSI_MPA
    fci_d = 0.80 * fc_d
    vs = deck_volume_to_surface(girder) / INCH_MM
    eps = float(cs.epsilon_sh(t.final - t.deck_placement, vs, t.relative_humidity, fci_d))
    psi_d = float(cs.psi(t.final - t.deck_placement, 1.0, vs, t.relative_humidity, fci_d))
    A_d = deck.effective_width * deck.thickness
    F = eps * A_d * deck.concrete.Ec / (1.0 + 0.7 * psi_d)
    force = in_both(job.units, f"{F / KIP_N:.0f} kip", f"{F / 1000:.0f} kN")
    text = (
        f"deck shrinkage restraint force F = εddf Ad Ecd / (1 + 0.7 ψd) = {force} with "
        f"εddf = {eps:.3e}, ψd = {psi_d:.3f} ({CLAUSE} Eq. 5.9.3.4.3d-2 with 5.4.2.3)"
    )
    return F, text


@register("aashto-refined")
def aashto_refined(girder: Girder) -> LossBreakdown:
    """Elastic shortening (C5.9.3.2.3a-1) and the refined estimate (5.9.3.4)."""
    job = girder.job
    es_comp, figures = elastic_shortening_component(girder)
    f_pt = job.strand.stress_before_transfer - es_comp.value
    # Δfcd includes the losses between transfer and deck placement, which do not depend on it
    first = rl.refined_losses(refined_input(girder, f_pt))
    inp = refined_input(girder, f_pt, first.loss_id)
    res = rl.refined_losses(inp)
    k = KSI_MPA
    id_, df = "transfer to deck placement", "deck placement to final"
    comps = [
        *before_transfer(girder),
        es_comp,
        LossComponent(
            "shrinkage",
            "Shrinkage of the girder",
            res.delta_f_pSR * k,
            id_,
            f"{CLAUSE} Eq. 5.9.3.4.2a-1",
        ),
        LossComponent(
            "creep", "Creep of the girder", res.delta_f_pCR * k, id_, f"{CLAUSE} Eq. 5.9.3.4.2b-1"
        ),
        LossComponent(
            "relaxation",
            "Relaxation of the strand",
            res.delta_f_pR1 * k,
            id_,
            f"{CLAUSE} Eq. 5.9.3.4.2c-1",
        ),
        LossComponent(
            "shrinkage_after_deck",
            "Shrinkage of the girder",
            res.delta_f_pSD * k,
            df,
            f"{CLAUSE} Eq. 5.9.3.4.3a-1",
        ),
        LossComponent(
            "creep_after_deck",
            "Creep of the girder",
            res.delta_f_pCD * k,
            df,
            f"{CLAUSE} Eq. 5.9.3.4.3b-1",
        ),
        LossComponent(
            "relaxation_after_deck",
            "Relaxation of the strand",
            res.delta_f_pR2 * k,
            df,
            f"{CLAUSE} Eq. 5.9.3.4.3c-1",
        ),
        LossComponent(
            "deck_shrinkage_gain",
            "Deck shrinkage (gain)",
            -res.delta_f_pSS * k,
            df,
            f"{CLAUSE} Eq. 5.9.3.4.3d-1",
        ),
    ]
    figures.update(
        {
            "ks girder (5.4.2.3.2-2)": (res.k_s_girder, "ratio"),
            "ks deck": (res.k_s_deck, "ratio"),
            "khc (5.4.2.3.2-3)": (res.k_hc, "ratio"),
            "khs (5.4.2.3.3-2)": (res.k_hs, "ratio"),
            "kf girder (5.4.2.3.2-4)": (res.k_f_girder, "ratio"),
            "ψb(td, ti)": (res.psi_b_td_ti, "ratio"),
            "ψb(tf, ti)": (res.psi_b_tf_ti, "ratio"),
            "ψb(tf, td)": (res.psi_b_tf_td, "ratio"),
            "ψd(tf, td)": (res.psi_d_tf_td, "ratio"),
            "εbid": (res.epsilon_bid, "ratio"),
            "εbdf": (res.epsilon_bdf, "ratio"),
            "εddf": (res.epsilon_ddf, "ratio"),
            "Kid (5.9.3.4.2a-2)": (res.K_id, "ratio"),
            "Kdf (5.9.3.4.3a-2)": (res.K_df, "ratio"),
            "fcgp": (inp.f_cgp * k, "stress"),
            "Δfcd": (inp.delta_f_cd * k, "stress"),
            "Δfcdf (5.9.3.4.3d-2)": (res.delta_f_cdf * k, "stress"),
            "V/S deck": (inp.V_S_deck * INCH_MM, "dimension"),
        }
    )
    figures.update(
        {
            "f'ci deck (0.80 f'c, 5.4.2.3.2)": (res.f_ci_deck * k, "stress"),
            "kf deck": (res.k_f_deck, "ratio"),
        }
    )
    deck_stress = f_pt - res.loss_id * k
    notes = [
        "refined estimate: girder shrinkage counted from transfer (transfer taken as the end "
        "of curing, common practice); deck shrinkage and creep from deck placement with the "
        f"deck f'ci = 0.80 f'c ({CLAUSE} 5.4.2.3.2) and a loading age of the deck of "
        f"{inp.t_i_deck:g} day for ψd; the deck's V/S with its soffit over the top flange "
        "not exposed (common practice)",
        *low_humidity_notes(
            girder, "aashto-refined", "khc and khs of Eqs. 5.4.2.3.2-3 and 5.4.2.3.3-2 in 5.9.3.4"
        ),
    ]
    return finish(
        girder,
        method="aashto-refined",
        title=f"{CLAUSE}: elastic shortening C5.9.3.2.3a-1; refined estimate 5.9.3.4 "
        "with creep and shrinkage of 5.4.2.3",
        components=comps,
        figures=figures,
        notes=notes,
        deck_stress=deck_stress,
    )
