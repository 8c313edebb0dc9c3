"""The time-step analysis as a loss method of the job ("time-step"), with a choice of model.

Builds the girder and deck parts, one strand layer per strand set at midlength and the load
history (self-weight at transfer, deck weight at deck placement on the girder alone,
superimposed dead load on the composite section a little later), runs
:func:`prestress.losses.timestep.run_timestep`, and reports the loss of the strands at
midlength by mechanism and period. The concrete areas are gross; the strands are carried as
bonded steel layers, so the analysis is on the transformed section by construction.

Consistency with the job's concrete (:func:`concrete_models`): every model takes the job's
moduli (girder Ec and Eci, deck Ec) and is tied to the job's f'ci at the transfer age:

* AASHTO LRFD 5.4.2.3: f'ci at transfer and f'c at 28 days fix the assumed strength-time law of
  :class:`prestress.losses.models.AashtoModel`; kf and ktd use the job's f'ci.
* ACI 209R-92: β of Eq. 2-1 fixed by the curing (Table 2.2.1, steam when transfer is at 3 days
  or earlier, common practice for precast girders), a fitted so that the strength at transfer is
  f'ci; the modulus is the job's Ec at the strength f'c (which the fitted law reaches before
  28 days for an early transfer: with β = 0.95 it gives about 1.04 f'c at 28 days, so the
  modulus at 28 days is about 1 % above Ec) and the job's Eci at f'ci.
* fib MC2010 and EN 1992-1-1: f'c is taken as fck (fcm = fck + 8 MPa); the girder's
  temperature-adjusted (equivalent) age at transfer is the age at which βcc(t) fcm = f'ci +
  8 MPa (MC2010 5.1.9.1 Eq. 5.1-51 with the maturity of 5.1.10, Eq. 5.1-85; EN 1992-1-1
  3.1.2(6) Eq. 3.2 with B.1(2) Eq. B.10), the published basis for steam-cured precast concrete
  (from memory: EN 1992-1-1 10.3.1.1(3)). That age enters the creep coefficient's age at loading
  (MC2010 Eq. 5.1-73, EN Eq. B.9) and the modulus; shrinkage keeps the real ages.
* Moduli: each code's modulus-development law, recalibrated in its exponent so that it passes
  through the job's Eci at transfer and Ec at 28 days (a choice of this project, see
  :mod:`prestress.losses.models`).

Relaxation clock (a convention of this method): the strands' relaxation is counted from
transfer with the stress fpbt, as AASHTO LRFD 9th Ed. (2020) 5.9.3.4.2c counts ΔfpR1 from
transfer; relaxation in the bed is not computed. The job gives only fpj and fpbt, not when the
strands were stressed nor what fpj − fpbt is made of; where fpbt < fpj includes relaxation in
the bed, the first hours of the log-time law are counted twice (the method's note gives the
size of that overlap).
"""

from __future__ import annotations

from dataclasses import dataclass
from typing import TYPE_CHECKING, Any

import numpy as np

from prestress.errors import InputError
from prestress.losses import LossBreakdown, LossComponent, register, run_recording_warnings
from prestress.losses.models import make_model
from prestress.losses.pretensioned import before_transfer, elastic_shortening_gross, finish
from prestress.losses.refined import deck_volume_to_surface, midspan_noncomposite_moment
from prestress.losses.timestep import ConcretePart, LoadEvent, StrandLayer, run_timestep
from prestress.units import KSI_MPA

if TYPE_CHECKING:
    from prestress.analysis import Girder
    from prestress.losses.models import CreepShrinkageModel
    from prestress.model import Times

#: The creep and shrinkage models the job may name, with what each is.
MODEL_TITLES = {
    "aashto": "AASHTO LRFD 9th Ed. (2020) 5.4.2.3",
    "aci209": "ACI 209R-92",
    "mc2010": "fib Model Code 2010",
    "en1992": "EN 1992-1-1:2004 Annex B",
}

#: Days after deck placement at which the superimposed dead load is applied (common practice:
#: barriers and surfacing follow the deck by some weeks).
SUPERIMPOSED_DELAY_DAYS = 30.0


def superimposed_age(t: Times) -> float:
    """Age (days) at which the analysis applies the superimposed dead load.

    30 days after deck placement (common practice), but no later than halfway to the final
    age.
    """
    return min(t.deck_placement + SUPERIMPOSED_DELAY_DAYS, 0.5 * (t.deck_placement + t.final))


#: Moist curing of the cast-in-place deck, days (common practice).
DECK_CURING_DAYS = 7.0

#: ACI 209R-92: the girder counts as steam cured when transfer is at this age or earlier (days;
#: common practice for precast girders released after overnight steam curing).
ACI_STEAM_TRANSFER_DAYS = 3.0

#: Upper limits of the linear creep range as a fraction of the strength at loading: fib MC2010
#: (2013) 5.1.9.4.3: |σc| ≤ 0.4 fcm(t0) (from memory); EN 1992-1-1:2004 3.1.4(4):
#: |σc| ≤ 0.45 fck(t0).
LINEAR_CREEP_LIMIT = {
    "mc2010": (0.40, "fcm(t0)", "fib MC2010 (2013) 5.1.9.4.3 (from memory)"),
    "en1992": (0.45, "fck(t0)", "EN 1992-1-1:2004 3.1.4(4)"),
}

#: Strength difference fcm − fck of MC2010 Eq. 5.1-1 and EN 1992-1-1 Table 3.1, MPa.
DELTA_F_MPA = 8.0


def concrete_models(
    girder: Girder, model_name: str
) -> tuple[CreepShrinkageModel, CreepShrinkageModel]:
    """The girder's and the deck's creep and shrinkage models, consistent with the job.

    See the module docstring for how each model takes the job's f'ci, Eci and Ec.

    Raises:
        InputError: a job the model cannot represent (naming the field), or inputs outside the
            model's range (``losses.model``).
    """
    job = girder.job
    gc, deck, t = job.girder_concrete, job.deck, job.times
    assert deck is not None and gc.fci is not None and gc.Eci is not None
    if gc.Eci > gc.Ec * (1.0 + 1e-9):
        raise InputError(
            "a modulus at transfer no greater than the 28-day modulus (the time-step models "
            "let the modulus grow with the strength)",
            file=job.file,
            field="girder.concrete.modulus_at_transfer",
        )
    if model_name == "aashto" and t.transfer >= 28.0 and gc.fci < gc.fc:
        raise InputError(
            "a transfer age under 28 days for time-step-aashto when f'ci is below f'c (its "
            "strength-time law passes through f'ci at transfer and f'c at 28 days)",
            file=job.file,
            field="time.transfer",
            got=f"{t.transfer:g} day",
        )
    rh = t.relative_humidity
    vs_g, vs_d = girder.gross.volume_to_surface, deck_volume_to_surface(girder)
    dc = deck.concrete
    g_kw: dict[str, Any]
    d_kw: dict[str, Any]
    if model_name in ("aashto", "aci209"):
        g_kw = dict(
            f_c=gc.fc,
            f_ci=gc.fci,
            age_f_ci=t.transfer,
            E_28=gc.Ec,
            E_ci=gc.Eci,
            relative_humidity=rh,
            volume_to_surface=vs_g,
            age_at_end_of_curing=t.transfer,
        )
        d_kw = dict(
            f_c=dc.fc,
            E_28=dc.Ec,
            relative_humidity=rh,
            volume_to_surface=vs_d,
            age_at_end_of_curing=DECK_CURING_DAYS,
        )
        if model_name == "aci209":
            g_kw["curing"] = "steam" if t.transfer <= ACI_STEAM_TRANSFER_DAYS else "moist"
            d_kw["curing"] = "moist"
    else:
        g_kw = dict(
            f_ck=gc.fc,
            f_ci=gc.fci,
            E_28=gc.Ec,
            E_ci=gc.Eci,
            relative_humidity=rh,
            notional_size=2.0 * vs_g,
            age_at_end_of_curing=t.transfer,
        )
        d_kw = dict(
            f_ck=dc.fc,
            E_28=dc.Ec,
            relative_humidity=rh,
            notional_size=2.0 * vs_d,
            age_at_end_of_curing=DECK_CURING_DAYS,
        )
    try:
        return make_model(model_name, **g_kw), make_model(model_name, **d_kw)
    except ValueError as exc:
        raise InputError(
            f"inputs within the range of the {MODEL_TITLES[model_name]} model ({exc})",
            file=job.file,
            field="losses.model",
        ) from None


def analyse(
    girder: Girder, model_name: str, n_steps: int = 120, extra_ages: tuple[float, ...] = ()
):
    """Run the time-step analysis of the girder at midlength; return (result, ages dict).

    ``extra_ages``: further girder ages (days, from transfer to the final age) to record.
    """
    job = girder.job
    if job.deck is None or girder.composite_section is None:
        raise InputError(
            "a [deck] table: the time-step method models the deck and its shrinkage",
            file=job.file,
            field="losses.method",
        )
    if job.layout is None:
        raise InputError(
            "a pretensioned girder with strand rows (the time-step method here is for "
            'pretensioned girders; post-tensioned girders: method = "given")',
            file=job.file,
            field="strands",
        )
    g, deck = girder.gross, job.deck
    t = job.times
    girder_model, deck_model = concrete_models(girder, model_name)
    y_deck = g.height + deck.haunch + deck.thickness / 2.0
    parts = [
        ConcretePart(
            "girder",
            g.area,
            g.Ix,
            g.yb,
            girder_model,
            0.0,
            {"girder_bottom": 0.0, "girder_top": g.height},
        ),
        ConcretePart(
            "deck",
            deck.effective_width * deck.thickness,
            deck.effective_width * deck.thickness**3 / 12.0,
            y_deck,
            deck_model,
            t.deck_placement,
            {"deck_top": y_deck + deck.thickness / 2.0},
        ),
    ]
    x_mid = np.array([job.length / 2.0])
    # stressing_age is left at transfer: the relaxation clock starts at transfer (see the
    # module docstring)
    layers = [
        StrandLayer(
            area=s.total_area,
            height=float(s.height(x_mid, job.length)[0]),
            Ep=job.strand.Ep,
            stress_before_transfer=job.strand.stress_before_transfer,
            fpy=job.strand.fpy,
            relaxation="low_relaxation" if job.strand.relaxation == "low" else "stress_relieved",
            name=s.label,
        )
        for s in job.layout.sets
    ]
    M_len = girder.self_weight * job.length**2 / 8.0
    a = job.bearing_offset
    M_span = girder.self_weight * (job.length**2 / 8.0 - job.length * a / 2.0)
    M_deck = midspan_noncomposite_moment(girder)
    M_sdl = (job.loads.superimposed_dead + job.loads.wearing_surface) * job.span**2 / 8.0
    t_sdl = superimposed_age(t)
    events = [
        LoadEvent(t.transfer, M_len, 0.0, "girder", "girder self-weight (girder length)"),
        LoadEvent(
            t.deck_placement,
            M_deck + (M_span - M_len),
            0.0,
            "girder",
            "deck, haunch; girder moved to its bearings",
        ),
        LoadEvent(t_sdl, M_sdl, 0.0, "composite", "superimposed dead load"),
    ]
    ages = {"transfer": t.transfer, "deck_placement": t.deck_placement, "final": t.final}
    try:
        res = run_timestep(
            parts,
            layers,
            events,
            sorted(set(ages.values()) | set(extra_ages)),
            n_steps=n_steps,
            transfer_age=t.transfer,
        )
    except ValueError as exc:
        raise InputError(
            f"inputs the time-step analysis accepts ({exc})", file=job.file, field="losses"
        ) from None
    return res, ages


#: An age asked for beyond the job's final age by at most this fraction is taken as the final
#: age: a year is 365.25 d to the unit library and 365 d to many engineers, so "75 year" is
#: 0.07 % beyond a final age of 75 × 365 = 27,375 d (common practice: the two year lengths).
FINAL_AGE_TOLERANCE = 1e-3


@dataclass(frozen=True)
class HistoryRow:
    """The state of the girder at midlength at one age, from the time-step analysis.

    Attributes:
        age: girder age, days (the final age where the age asked for was taken as it).
        strand_stress: strand stress, area-weighted over the strand layers, MPa.
        loss: loss since jacking, fpj − strand stress, MPa.
        fibers: fiber → concrete stress, MPa (tension +); the deck top only once the deck is
            cast.
        requested_age: the age asked for, days, where it differs from ``age`` (an age just
            beyond the final age, see :data:`FINAL_AGE_TOLERANCE`); ``None`` otherwise.
    """

    age: float
    strand_stress: float
    loss: float
    fibers: dict[str, float]
    requested_age: float | None = None


class History(list[HistoryRow]):
    """The rows of :func:`history`, with the notes an engineer should read beside them.

    Attributes:
        notes: ages taken as the final age, and the soft limits of the model met during the
            analysis (what would otherwise be Python warnings), each once.
    """

    notes: tuple[str, ...] = ()


def final_age_note(requested: float, final: float) -> str:
    """The note for an age asked for just beyond the final age and taken as it (days)."""
    beyond = 100.0 * (requested / final - 1.0)
    return (
        f"the age {requested:.1f} d ({requested / 365.25:.4g} years of 365.25 d) is "
        f"{beyond:.2g} % beyond the final age of the job and is taken as the final age "
        f"{final:g} d ({final / 365.0:.4g} years of 365 d); an age up to "
        f"{100 * FINAL_AGE_TOLERANCE:g} % beyond the final age is taken as it"
    )


def history(girder: Girder, model_name: str, ages: tuple[float, ...]) -> History:
    """Strand and concrete stresses at midlength at the given ages (days), by time steps.

    The stresses are those of the time-step analysis itself: prestress, girder self-weight,
    deck and superimposed dead load with creep, shrinkage (girder and deck) and relaxation;
    no live load. Ages must lie from transfer to the final age of the job; an age beyond the
    final age by at most :data:`FINAL_AGE_TOLERANCE` (0.1 %) is taken as the final age, with a
    note. Soft-limit warnings of the model become notes (``History.notes``), as for every loss
    method (:func:`prestress.losses.run_recording_warnings`).
    """
    t = girder.job.times
    used: list[float] = []
    notes: list[str] = []
    for age in ages:
        if t.final < age <= t.final * (1.0 + FINAL_AGE_TOLERANCE):
            used.append(t.final)
            note = final_age_note(age, t.final)
            if note not in notes:
                notes.append(note)
            continue
        if not t.transfer <= age <= t.final:
            raise InputError(
                f"ages from transfer ({t.transfer:g} d) to the final age ({t.final:g} d; "
                f"up to {100 * FINAL_AGE_TOLERANCE:g} % beyond it is taken as it)",
                file="command line",
                field="--at",
                got=f"{age:g} d",
            )
        used.append(age)
    (res, _), warned = run_recording_warnings(
        f"time-step-{model_name}", lambda: analyse(girder, model_name, extra_ages=tuple(used))
    )
    areas = np.array([s.total_area for s in girder.job.layout.sets])  # type: ignore[union-attr]
    fpj = girder.job.strand.jacking_stress
    rows = History()
    for asked, age in zip(ages, used, strict=True):
        i = res.index(age)
        fp = _mean(res.strand_stress, i, areas)
        fibers = {f: float(v[i, 0]) for f, v in res.concrete_stress["girder"].items()}
        if res.part_active["deck"][i]:
            fibers |= {f: float(v[i, 0]) for f, v in res.concrete_stress["deck"].items()}
        rows.append(
            HistoryRow(age, fp, fpj - fp, fibers, requested_age=None if asked == age else asked)
        )
    rows.notes = (*notes, *warned)
    return rows


def _mpa_ksi(v: float) -> str:
    """A stress for a note, in both systems (the method does not know the output units)."""
    return f"{v:.1f} MPa ({v / KSI_MPA:.2f} ksi)"


def _mean(vals: np.ndarray, i: int, areas: np.ndarray) -> float:
    """Area-weighted mean over the strand layers of record i at the (single) station, MPa."""
    return float((vals[i, 0, :] * areas).sum() / areas.sum())


def _model_notes(
    girder: Girder, model_name: str, girder_model: Any, sigma_cgs: float
) -> tuple[list[str], dict[str, tuple[float, str]]]:
    """Notes and figures on how the model was tied to the job, and the linear-creep check."""
    job = girder.job
    gc, t = job.girder_concrete, job.times
    assert gc.fci is not None
    t_tr = t.transfer
    E_tr = float(girder_model.E(t_tr))
    f_tr = float(girder_model.strength(t_tr))
    figures: dict[str, tuple[float, str]] = {
        "E girder at transfer (model)": (E_tr, "modulus_e"),
        "E girder at an age of 28 days (model)": (float(girder_model.E(28.0)), "modulus_e"),
        "σc at the strand centroid just after transfer": (sigma_cgs, "stress"),
    }
    notes: list[str] = []
    if model_name == "aashto":
        figures["f'c girder at transfer (model)"] = (f_tr, "stress")
        notes.append(
            "AASHTO model: strength f'c(t) = f'c t/(a + b t) through f'ci at transfer and f'c "
            "at 28 days (an assumption of this project, ACI 209R-92 Eq. 2-1 form), modulus of "
            "Eq. 5.4.2.4-1 at that strength scaled to the job's Eci and Ec; kf and ktd "
            "(5.4.2.3.2) with the job's f'ci"
        )
    elif model_name == "aci209":
        figures["f'c girder at transfer (model)"] = (f_tr, "stress")
        figures["a of Eq. 2-1 (fitted)"] = (float(girder_model._a), "time")
        figures["β of Eq. 2-1 (Table 2.2.1)"] = (float(girder_model._beta), "ratio")
        notes.append(
            f"ACI 209R-92 model: girder {girder_model.curing} cured; Eq. 2-1 with β = "
            f"{girder_model._beta:g} (Table 2.2.1, from memory) and a = "
            f"{girder_model._a:.3g} d fitted so that the strength at transfer is f'ci; "
            "modulus the job's Ec at the strength f'c and the job's Eci at f'ci (the square "
            "root of Eq. 2-5 recalibrated)"
        )
    else:
        tT = float(girder_model.maturity_at_end_of_curing)
        figures["fcm girder at transfer (model)"] = (f_tr, "stress")
        figures["equivalent age of the girder at transfer"] = (tT, "time")
        clause = (
            "fib MC2010 (2013) 5.1.9.1 Eq. 5.1-51 with the temperature-adjusted age of 5.1.10 "
            "(Eq. 5.1-85)"
            if model_name == "mc2010"
            else "EN 1992-1-1:2004 3.1.2(6) Eq. 3.2 with the temperature-adjusted age of B.1(2) "
            "(Eq. B.10)"
        )
        notes.append(
            f"{MODEL_TITLES[model_name]} model: fck = f'c, fcm = fck + 8 MPa; the girder's "
            f"equivalent (temperature-adjusted) age at transfer is {tT:.3g} d, at which "
            f"βcc fcm = f'ci + 8 MPa ({clause}; steam curing of precast concrete, from memory "
            "EN 1992-1-1 10.3.1.1(3)); it is the age at loading of the creep coefficient and "
            "sets the modulus at transfer; cement class "
            f"{girder_model.cement_class}; moduli scaled to the job's Eci and Ec"
        )
        k, sym, source = LINEAR_CREEP_LIMIT[model_name]
        strength = f_tr if sym == "fcm(t0)" else f_tr - DELTA_F_MPA
        if abs(sigma_cgs) > k * strength:
            notes.append(
                f"the concrete stress at the strand centroid just after transfer, "
                f"{_mpa_ksi(abs(sigma_cgs))} in compression, exceeds {k:g} {sym} = "
                f"{_mpa_ksi(k * strength)}, the upper limit of linear creep ({source}); "
                "creep non-linearity is not modelled here, so creep may be underestimated"
            )
    if abs(E_tr / gc.Eci - 1.0) > 1e-6:
        notes.append(
            f"the model's modulus at transfer ({E_tr:.0f} MPa) differs from the job's Eci "
            f"({gc.Eci:.0f} MPa, {gc.Eci / KSI_MPA:.0f} ksi)"
        )
    return notes, figures


def relaxation_source(strand_class: str) -> str:
    """The source of the relaxation rows: the log-time law and its constant C.

    The time-step analysis relaxes the strands by the intrinsic log-time law of Magura, Sozen
    and Siess (1964), PCI Journal 9(2) (:func:`prestress.codes.aashto_lrfd.relaxation.
    f_pR_log_time`, applied step by step in :mod:`prestress.losses.timestep`), whatever the
    creep and shrinkage model.

    Args:
        strand_class: the job's strand relaxation class, ``"low"`` or ``"stress_relieved"``.
    """
    from prestress.codes.aashto_lrfd import relaxation as rx

    kind = "low_relaxation" if strand_class == "low" else "stress_relieved"
    C = rx.log_time_constant(kind)  # type: ignore[arg-type]
    return (
        "time-step, log-time relaxation of Magura, Sozen and Siess (1964), C = "
        f"{C:g} ({'low-relaxation' if kind == 'low_relaxation' else 'stress-relieved'} strand)"
    )


def _relaxation_note(girder: Girder) -> list[str]:
    """The relaxation-clock convention, with the size of the overlap when fpbt < fpj."""
    from prestress.codes.aashto_lrfd import relaxation as rx

    job = girder.job
    strand = job.strand
    text = (
        "relaxation of the strand by the intrinsic log-time law of Magura, Sozen and Siess "
        "(1964), PCI Journal 9(2), "
        + (
            "with C = 45 for low-relaxation strand (the value in common use in PCI literature, "
            "from memory)"
            if strand.relaxation == "low"
            else "with C = 10 for stress-relieved strand"
        )
        + ", applied to the varying strand stress step by step (whatever the creep and "
        "shrinkage model); counted from transfer at fpbt (AASHTO LRFD 5.9.3.4.2c counts ΔfpR1 "
        "from transfer); relaxation in the bed is not computed"
    )
    if strand.stress_before_transfer < strand.jacking_stress:
        kind = "low_relaxation" if strand.relaxation == "low" else "stress_relieved"
        bed = rx.f_pR_log_time(
            job.times.transfer * 24.0, strand.stress_before_transfer, strand.fpy, kind
        )
        text += (
            f"; if fpj − fpbt includes relaxation in the bed, up to about {_mpa_ksi(bed)} of "
            "relaxation (the log-time law over the girder's age at transfer) is counted twice"
        )
    return [text]


def make_method(model_name: str):
    """The registered loss method for one creep and shrinkage model."""

    def method(girder: Girder) -> LossBreakdown:
        job = girder.job
        if model_name == "aashto":  # the soft limit of 5.4.2.3 on f'c, as the refined estimate
            from prestress.codes.aashto_lrfd.refined_losses import warn_strengths_beyond_range

            deck_fc = job.deck.concrete.fc if job.deck is not None else None
            warn_strengths_beyond_range(
                job.girder_concrete.fc / KSI_MPA,
                None if deck_fc is None else deck_fc / KSI_MPA,
            )
        res, ages = analyse(girder, model_name)
        assert job.layout is not None
        areas = np.array([s.total_area for s in job.layout.sets])
        i_tr = res.index(ages["transfer"])
        i_deck = res.index(ages["deck_placement"], after=False)
        i_fin = res.index(ages["final"])
        source = f"time-step, {MODEL_TITLES[model_name]}"
        comps = [*before_transfer(girder)]
        es = _mean(res.losses["elastic_transfer"], i_tr, areas)
        comps.append(
            LossComponent(
                "elastic_shortening",
                "Elastic shortening",
                es,
                "at transfer",
                "time-step analysis (transformed section)",
                applied=girder.basis != "transformed",
            )
        )
        by_part = res.losses_by_part
        # (key, label, loss array): the girder's own creep and shrinkage, the strand's
        # relaxation, then the deck's creep and shrinkage (the deck is cast at deck placement)
        rows = [
            ("shrinkage", "Shrinkage of the girder", by_part["shrinkage"]["girder"]),
            ("creep", "Creep of the girder", by_part["creep"]["girder"]),
            ("relaxation", "Relaxation of the strand", res.losses["relaxation"]),
        ]
        # relaxation is the strand's intrinsic log-time law, not the concrete model's
        sources = {"relaxation": relaxation_source(job.strand.relaxation)}
        deck_rows = [
            ("deck_shrinkage_gain", "Deck shrinkage (gain)", by_part["shrinkage"]["deck"]),
            ("deck_creep", "Creep of the deck", by_part["creep"]["deck"]),
        ]
        for period, (i0, i1), suffix in (
            ("transfer to deck placement", (i_tr, i_deck), ""),
            ("deck placement to final", (i_deck, i_fin), "_after_deck"),
        ):
            for key, label, vals in rows:
                v = _mean(vals, i1, areas) - _mean(vals, i0, areas)
                comps.append(
                    LossComponent(key + suffix, label, v, period, sources.get(key, source))
                )
            if suffix:
                for key, label, vals in deck_rows:
                    v = _mean(vals, i1, areas) - _mean(vals, i0, areas)
                    comps.append(
                        LossComponent(
                            key, label, v, period, source + " (deck cast at deck placement)"
                        )
                    )
            vals = res.losses["elastic_later"]
            gain = _mean(vals, i1, areas) - _mean(vals, i0, areas)
            if abs(gain) > 0:
                comps.append(
                    LossComponent(
                        "elastic_gain" + suffix,
                        "Elastic gain from later loads",
                        gain,
                        period,
                        "time-step analysis (reported; the stage engine applies the loads itself)",
                        applied=False,
                    )
                )
        # the real strand stress at deck placement, as the refined method gives it: fpbt less
        # elastic shortening (always: the stage engine adds it back on transformed sections,
        # stages.applied_stress) less the time-dependent losses applied up to deck placement
        deck_stress = (
            job.strand.stress_before_transfer
            - es
            - sum(c.value for c in comps if c.period == "transfer to deck placement" and c.applied)
        )
        y_cgs = float(
            np.sum(
                [
                    s.total_area * s.height(np.array([job.length / 2.0]), job.length)[0]
                    for s in job.layout.sets
                ]
            )
            / areas.sum()
        )
        sigma_cgs = float(res.stress_at("girder", y_cgs)[i_tr, 0])
        girder_model = concrete_models(girder, model_name)[0]  # cheap: no arrays
        model_notes, figures = _model_notes(girder, model_name, girder_model, sigma_cgs)
        notes = [
            f"time-step analysis at midlength with the {MODEL_TITLES[model_name]} creep and "
            f"shrinkage model; superimposed dead load applied {SUPERIMPOSED_DELAY_DAYS:g} "
            "days after deck placement (common practice)",
            *model_notes,
            "deck shrinkage and deck creep are reported on their own rows (the split by "
            "concrete part is exact by linearity); the creep of each part includes the creep "
            "of the stresses that shrinkage, of either part, has produced in it",
            *_relaxation_note(girder),
        ]
        es_gross, _ = elastic_shortening_gross(girder)
        figures["ΔfpES closed form, C5.9.3.2.3a-1 with the job's Eci"] = (es_gross, "stress")
        return finish(
            girder,
            method=f"time-step-{model_name}",
            title=f"time-step analysis (step-by-step superposition) with the "
            f"{MODEL_TITLES[model_name]} creep and shrinkage model",
            components=comps,
            figures=figures,
            notes=notes,
            deck_stress=deck_stress,
        )

    return method


for _name in MODEL_TITLES:
    register(f"time-step-{_name}")(make_method(_name))
