"""The time-step analysis as a loss method of the job ("time-step"), with a choice of model.

Builds the girder and deck parts, one strand layer per strand set at midlength and the load
history (self-weight at transfer, deck weight at deck placement on the girder alone,
superimposed dead load on the composite section a little later), runs
:func:`prestress.losses.timestep.run_timestep`, and reports the loss of the strands at
midlength by mechanism and period. The concrete areas are gross; the strands are carried as
bonded steel layers, so the analysis is on the transformed section by construction.
"""

from __future__ import annotations

from typing import TYPE_CHECKING

import numpy as np

from prestress.errors import InputError
from prestress.losses import LossBreakdown, LossComponent, register
from prestress.losses.models import make_model
from prestress.losses.pretensioned import before_transfer, finish
from prestress.losses.refined import deck_volume_to_surface, midspan_noncomposite_moment
from prestress.losses.timestep import ConcretePart, LoadEvent, StrandLayer, run_timestep

if TYPE_CHECKING:
    from prestress.analysis import Girder

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


def _model(
    name: str,
    fc: float,
    fci: float | None,
    rh: float,
    vs: float,
    w: float,
    age_curing: float,
    age_fci: float | None,
):
    if name == "aashto":
        return make_model(
            "aashto",
            f_c=fc,
            relative_humidity=rh,
            volume_to_surface=vs,
            unit_weight=w,
            age_at_end_of_curing=age_curing,
            f_ci=fci,
            age_f_ci=age_fci,
        )
    if name == "aci209":
        return make_model(
            "aci209",
            f_c=fc,
            relative_humidity=rh,
            volume_to_surface=vs,
            unit_weight=w,
            curing="steam" if age_curing <= 3 else "moist",
            age_at_end_of_curing=age_curing,
        )
    return make_model(
        name, f_ck=fc, relative_humidity=rh, notional_size=2.0 * vs, age_at_end_of_curing=age_curing
    )


def analyse(girder: Girder, model_name: str, n_steps: int = 120):
    """Run the time-step analysis of the girder at midlength; return (result, ages dict)."""
    job = girder.job
    if job.deck is None or girder.composite_section is None:
        raise InputError(
            "a [deck] table: the time-step method models the deck and its shrinkage",
            file=job.file,
            field="losses.method",
        )
    if job.layout is None:
        raise InputError("strand rows", file=job.file, field="strands")
    g, deck, gc = girder.gross, job.deck, job.girder_concrete
    t = job.times
    rh = t.relative_humidity
    w_mod = gc.unit_weight
    try:
        girder_model = _model(
            model_name, gc.fc, gc.fci, rh, g.volume_to_surface, w_mod, t.transfer, t.transfer
        )
        deck_model = _model(
            model_name,
            deck.concrete.fc,
            None,
            rh,
            deck_volume_to_surface(girder),
            deck.concrete.unit_weight,
            7.0,
            None,
        )
    except ValueError as exc:
        raise InputError(
            f"inputs within the range of the {MODEL_TITLES[model_name]} model ({exc})",
            file=job.file,
            field="losses.model",
        ) from None
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
    t_sdl = min(t.deck_placement + SUPERIMPOSED_DELAY_DAYS, 0.5 * (t.deck_placement + t.final))
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
            sorted(set(ages.values())),
            n_steps=n_steps,
            transfer_age=t.transfer,
        )
    except ValueError as exc:
        raise InputError(
            f"inputs the time-step analysis accepts ({exc})", file=job.file, field="losses"
        ) from None
    return res, ages


def _mean(res, key: str, i: int, areas: np.ndarray) -> float:
    vals = res.losses[key][i, 0, :]
    return float((vals * areas).sum() / areas.sum())


def make_method(model_name: str):
    """The registered loss method for one creep and shrinkage model."""

    def method(girder: Girder) -> LossBreakdown:
        job = girder.job
        res, ages = analyse(girder, model_name)
        assert job.layout is not None
        areas = np.array([s.total_area for s in job.layout.sets])
        i_tr = res.index(ages["transfer"])
        i_deck = res.index(ages["deck_placement"], after=False)
        i_fin = res.index(ages["final"])
        comps = [*before_transfer(girder)]
        es = _mean(res, "elastic_transfer", i_tr, areas)
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
        labels = {
            "shrinkage": "Shrinkage of the girder",
            "creep": "Creep of the girder",
            "relaxation": "Relaxation of the strand",
        }
        for period, (i0, i1), suffix in (
            ("transfer to deck placement", (i_tr, i_deck), ""),
            ("deck placement to final", (i_deck, i_fin), "_after_deck"),
        ):
            for key, label in labels.items():
                v = _mean(res, key, i1, areas) - _mean(res, key, i0, areas)
                comps.append(
                    LossComponent(
                        key + suffix, label, v, period, f"time-step, {MODEL_TITLES[model_name]}"
                    )
                )
            gain = _mean(res, "elastic_later", i1, areas) - _mean(res, "elastic_later", i0, areas)
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
        deck_stress = job.strand.stress_before_transfer - sum(
            c.value
            for c in comps
            if c.period in ("at transfer", "transfer to deck placement") and c.applied
        )
        notes = [
            f"time-step analysis at midlength with the {MODEL_TITLES[model_name]} creep and "
            f"shrinkage model; superimposed dead load applied {SUPERIMPOSED_DELAY_DAYS:g} "
            "days after deck placement (common practice)"
        ]
        return finish(
            girder,
            method=f"time-step-{model_name}",
            title=f"time-step analysis (step-by-step superposition) with the "
            f"{MODEL_TITLES[model_name]} creep and shrinkage model",
            components=comps,
            figures={},
            notes=notes,
            deck_stress=deck_stress,
        )

    return method


for _name in MODEL_TITLES:
    register(f"time-step-{_name}")(make_method(_name))
