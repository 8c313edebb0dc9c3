"""Losses of pretensioned girders: elastic shortening and the AASHTO approximate estimate.

Works in the internal system (MPa, N, mm) and converts once to the code's ksi/in for the
equations of :mod:`prestress.codes.aashto_lrfd.losses`.
"""

from __future__ import annotations

from typing import TYPE_CHECKING

from prestress.codes.aashto_lrfd import losses as aashto
from prestress.losses import LossBreakdown, LossComponent, Milestone, register
from prestress.units import KSI_MPA

if TYPE_CHECKING:
    from prestress.analysis import Girder


def elastic_shortening_iterative(
    A_ps: float,
    f_pbt: float,
    A_g: float,
    I_g: float,
    e: float,
    M_g: float,
    E_ci: float,
    E_p: float,
    *,
    tol: float = 1e-9,
    max_iter: int = 200,
) -> float:
    """AASHTO LRFD 9th Ed. (2020) Eq. 5.9.3.2.3a-1 solved by fixed-point iteration (any units).

    ΔfpES = Ep/Eci fcgp, with fcgp = P/Ag + P e²/Ig − Mg e/Ig and P = Aps (fpbt − ΔfpES),
    iterated from ΔfpES = 0 until the change is below ``tol`` times fpbt. It converges to the
    closed form of Eq. C5.9.3.2.3a-1 (the equation is linear in ΔfpES).
    """
    loss = 0.0
    for _ in range(max_iter):
        P = A_ps * (f_pbt - loss)
        new = aashto.delta_f_pES(E_p, E_ci, aashto.f_cgp(P, A_g, I_g, e, M_g))
        if abs(new - loss) <= tol * f_pbt:
            return new
        loss = new
    raise ArithmeticError("elastic shortening iteration did not converge")


def elastic_shortening_gross(girder: Girder) -> tuple[float, dict[str, tuple[float, str]]]:
    """Elastic shortening loss on gross properties at the girder's midspan (MPa) and figures."""
    job = girder.job
    if job.post_tensioned:
        from prestress.errors import InputError

        raise InputError(
            'a pretensioned girder for this method (post-tensioned girders: method = "given")',
            file=job.file,
            field="losses.method",
        )
    g = girder.gross
    e_m = girder.eccentricity_gross
    M_g = girder.self_weight * job.length**2 / 8.0  # girder on its own length, ends supported
    Eci = job.girder_concrete.Eci
    assert Eci is not None
    loss = aashto.delta_f_pES_closed_form(
        job.A_ps, job.strand.stress_before_transfer, g.Ix, e_m, g.area, M_g, Eci, job.strand.Ep
    )
    P_i = job.A_ps * (job.strand.stress_before_transfer - loss)
    figures = {
        "f_pbt": (job.strand.stress_before_transfer, "stress"),
        "A_ps": (job.A_ps, "area"),
        "e_m": (e_m, "dimension"),
        "M_g (girder length)": (M_g, "moment"),
        "E_ci": (Eci, "modulus_e"),
        "E_p": (job.strand.Ep, "modulus_e"),
        "f_cgp": (aashto.f_cgp(P_i, g.area, g.Ix, e_m, M_g), "stress"),
    }
    return loss, figures


#: Relative humidity (percent) below which the AASHTO estimates are extrapolated: the lower end
#: of the humidity range of the data behind AASHTO LRFD 9th Ed. (2020) 5.4.2.3 and the loss
#: estimates of 5.9.3.3 and 5.9.3.4 built on it (from memory).
AASHTO_LOWEST_HUMIDITY = 40.0


def low_humidity_notes(girder: Girder, method: str, equations: str) -> list[str]:
    """A note when the job's relative humidity lies below :data:`AASHTO_LOWEST_HUMIDITY`.

    The job reader refuses 0 % and less; from above 0 to 40 % the AASHTO estimates still give
    numbers (γh = 1.7 − 0.01 H, khs = 2.00 − 0.014 H, khc = 1.56 − 0.008 H grow linearly),
    extrapolated beyond the range they were calibrated for.

    Args:
        girder: the girder (its job's ``times.relative_humidity``, percent).
        method: the method's job-file name, which starts the note.
        equations: the method's humidity terms and their clauses, in words.
    """
    rh = girder.job.times.relative_humidity
    if rh >= AASHTO_LOWEST_HUMIDITY:
        return []
    return [
        f"{method} method: RH = {rh:g} % is below {AASHTO_LOWEST_HUMIDITY:g} %, the lower end "
        f"of the humidity range the AASHTO LRFD 9th Ed. (2020) estimates were calibrated for "
        f"({equations}; range from memory); the long-term losses are extrapolated"
    ]


def before_transfer(girder: Girder) -> list[LossComponent]:
    """The losses in the bed before transfer given by the job (fpj − fpbt), if any."""
    strand = girder.job.strand
    before = strand.jacking_stress - strand.stress_before_transfer
    if before <= 1e-9 * strand.jacking_stress:  # equal within round-off: no loss given
        return []
    return [
        LossComponent(
            "before_transfer",
            "Losses in the bed before transfer",
            before,
            "before transfer",
            "given in the job (fpj − fpbt)",
        )
    ]


def elastic_shortening_component(girder: Girder) -> tuple[LossComponent, dict]:
    """Elastic shortening at transfer: applied on gross sections, reported on transformed ones."""
    es, figures = elastic_shortening_gross(girder)
    transformed = girder.basis == "transformed"
    clause = "AASHTO LRFD 9th Ed. (2020) Eq. C5.9.3.2.3a-1, gross"
    if transformed:
        clause += "; for information (5.9.3.2.3a: implicit in transformed sections)"
    comp = LossComponent(
        "elastic_shortening",
        "Elastic shortening",
        es,
        "at transfer",
        clause,
        applied=not transformed,
    )
    return comp, figures


def finish(
    girder: Girder,
    *,
    method: str,
    title: str,
    components: list[LossComponent],
    figures: dict,
    notes: list[str],
    deck_stress: float | None = None,
) -> LossBreakdown:
    """Assemble a LossBreakdown: real stresses, applied stresses for the basis, milestones."""
    job = girder.job
    strand = job.strand
    fpbt = strand.stress_before_transfer
    es = sum(c.value for c in components if c.key == "elastic_shortening")
    time_dep = sum(
        c.value
        for c in components
        if c.applied and c.period not in ("before transfer", "at transfer")
    )
    f_pt = fpbt - es
    f_pe = f_pt - time_dep
    if girder.basis == "transformed":
        applied_transfer, applied_final = fpbt, fpbt - time_dep
        notes = [
            *notes,
            "transformed sections: elastic shortening and the elastic gains from "
            "later loads come out of the section analysis, so the force applied is Aps "
            "(fpbt − time-dependent losses) (AASHTO LRFD 5.9.3.2.3a and C5.9.3.1)",
        ]
    else:
        applied_transfer, applied_final = f_pt, f_pe
    milestones = [
        Milestone("jacking", "at jacking", None, strand.jacking_stress),
        Milestone("transfer", "just after transfer", job.times.transfer, f_pt),
    ]
    if deck_stress is not None:
        milestones.append(
            Milestone("deck_placement", "at deck placement", job.times.deck_placement, deck_stress)
        )
    milestones.append(Milestone("final", "final (effective)", job.times.final, f_pe))
    return LossBreakdown(
        method=method,
        title=title,
        jacking_stress=strand.jacking_stress,
        components=tuple(components),
        f_pt=f_pt,
        f_pe=f_pe,
        applied_transfer=applied_transfer,
        applied_final=applied_final,
        basis=girder.basis,
        milestones=tuple(milestones),
        figures=figures,
        notes=tuple(notes),
    )


@register("aashto-approximate")
def aashto_approximate(girder: Girder) -> LossBreakdown:
    """Elastic shortening (C5.9.3.2.3a-1, gross section) and the approximate estimate (5.9.3.3)."""
    job = girder.job
    strand = job.strand
    es_comp, figures = elastic_shortening_component(girder)
    fci_ksi = job.girder_concrete.fci / KSI_MPA  # type: ignore[operator]
    low = strand.relaxation == "low"
    lt = aashto.delta_f_pLT_approximate(
        strand.stress_before_transfer / KSI_MPA,
        job.A_ps,
        girder.gross.area,
        job.times.relative_humidity,
        fci_ksi,
        aashto.DELTA_F_PR_LOW_RELAXATION_KSI if low else aashto.DELTA_F_PR_STRESS_RELIEVED_KSI,
    )
    figures["γh (Eq. 5.9.3.3-2)"] = (lt["gamma_h"], "ratio")
    figures["γst (Eq. 5.9.3.3-3)"] = (lt["gamma_st"], "ratio")
    clause = "AASHTO LRFD 9th Ed. (2020) Eq. 5.9.3.3-1"
    comps = [
        *before_transfer(girder),
        es_comp,
        LossComponent(
            "creep",
            "Creep of the girder concrete",
            lt["creep"] * KSI_MPA,
            "long term",
            clause + " (creep term)",
        ),
        LossComponent(
            "shrinkage",
            "Shrinkage of the girder concrete",
            lt["shrinkage"] * KSI_MPA,
            "long term",
            clause + " (shrinkage term)",
        ),
        LossComponent(
            "relaxation",
            "Relaxation of the strand",
            lt["relaxation"] * KSI_MPA,
            "long term",
            clause + " (ΔfpR)",
        ),
    ]
    notes = low_humidity_notes(girder, "aashto-approximate", "γh = 1.7 − 0.01 H of Eq. 5.9.3.3-2")
    if not low:
        notes.append(
            "ΔfpR for stress-relieved strand taken as 10 ksi (5.9.3.3, from memory); "
            "the approximate method is intended for low-relaxation strand."
        )
    return finish(
        girder,
        method="aashto-approximate",
        title="AASHTO LRFD 9th Ed. (2020): elastic shortening C5.9.3.2.3a-1; "
        "approximate long-term estimate 5.9.3.3",
        components=comps,
        figures=figures,
        notes=notes,
    )
