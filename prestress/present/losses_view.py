"""Presentation of prestress losses: a table per stage, a side-by-side comparison, JSON."""

from __future__ import annotations

from typing import Any

from rich import box
from rich.table import Table

from prestress.losses import LossBreakdown, LossComponent
from prestress.present.common import fmt, label, quantity, signed, use_text

#: Mechanisms, in the order a loss table lists them, and what they are called.
MECHANISMS = {
    "before_transfer": "Losses in the bed before transfer",
    "friction": "Friction",
    "anchor_set": "Anchor set",
    "elastic_shortening": "Elastic shortening",
    "shrinkage": "Shrinkage of the girder",
    "creep": "Creep of the girder",
    "relaxation": "Relaxation of the strand",
    "deck_shrinkage_gain": "Deck shrinkage (gain)",
    "deck_creep": "Creep of the deck",
    "elastic_gain": "Elastic gain from later loads",
    "long_term": "Time-dependent losses (given)",
}

#: What the comparison adds to the name of a mechanism that is reported but not in the total.
NOT_IN_TOTAL = " (reported, not in total)"


def in_total(components: list[LossComponent]) -> bool:
    """Whether a mechanism's components count in the total fpj − fpe.

    Elastic shortening always does (on transformed sections it is reported, not applied, but
    fpe is the real strand stress); a component after transfer counts only when applied (the
    elastic gains from later loads are reported, the stage engine applies the loads itself).
    """
    return any(c.applied or c.period in ("before transfer", "at transfer") for c in components)


def mechanism(c: LossComponent) -> str:
    """The mechanism a component belongs to (periods merged)."""
    return c.key.replace("_after_deck", "")


def by_mechanism(
    b: LossBreakdown, components: list[LossComponent] | None = None
) -> dict[str, float]:
    """Sum of the losses of each mechanism (MPa), applied or not."""
    out: dict[str, float] = {}
    for c in components if components is not None else b.components:
        out[mechanism(c)] = out.get(mechanism(c), 0.0) + c.value
    return out


PERIOD_OF_MILESTONE = {
    "transfer": "at transfer",
    "deck_placement": "transfer to deck placement",
    "final": "long term",
}


def stage_tables(b: LossBreakdown, A_ps: float, system: str) -> list[Table]:
    """One table per stage (milestone): the components accumulated to it, stress and force."""
    su, fu = label(system, "stress"), label(system, "force")
    tables = []
    for m in b.milestones:
        if m.key == "jacking":
            continue
        comps = b.up_to(PERIOD_OF_MILESTONE[m.key])
        age = "" if m.age is None else f", girder age {m.age:g} d"
        t = Table(
            title=f"Losses {m.label}{age} — {b.method}",
            title_justify="left",
            title_style="bold",
            box=box.SIMPLE_HEAD,
            caption=f"Stresses in {su}; losses positive, gains negative. {b.title}.",
            caption_justify="left",
        )
        t.add_column("Mechanism")
        t.add_column("Period")
        t.add_column("Loss", justify="right", no_wrap=True)
        t.add_column("% fpj", justify="right", no_wrap=True)
        t.add_column("Source")
        for c in comps:
            note = "" if c.applied else " (reported, not applied)"
            t.add_row(
                c.label + note,
                c.period,
                fmt(c.value, system, "stress", 2),
                f"{100 * c.value / b.jacking_stress:.1f}".replace("-", "−"),
                c.short_clause,
            )
        t.add_section()
        lost = b.jacking_stress - m.stress
        t.add_row(
            "[bold]Total since jacking[/]",
            "",
            f"[bold]{fmt(lost, system, 'stress', 2)}[/]",
            f"[bold]{100 * lost / b.jacking_stress:.1f}[/]",
            "",
        )
        t.add_row(
            "Strand stress",
            "",
            fmt(m.stress, system, "stress", 2),
            f"{100 * m.stress / b.jacking_stress:.1f}",
            f"force {fmt(m.stress * A_ps, system, 'force', 1)} {fu}",
        )
        tables.append(t)
    return tables


def compare_table(results: list[LossBreakdown], A_ps: float, system: str) -> Table:
    """Every method side by side: each mechanism's total, the total, fpe and Pe."""
    su, fu = label(system, "stress"), label(system, "force")
    t = Table(
        title="Losses by method, jacking to final",
        title_justify="left",
        title_style="bold",
        box=box.SIMPLE_HEAD,
        caption=f"Stresses in {su}, forces in {fu}; losses positive, gains negative; "
        "a mechanism a method does not model is shown as —. Totals are fpj − fpe, jacking to "
        f"final; rows marked{NOT_IN_TOTAL} are not part of them.",
        caption_justify="left",
        padding=(0, 0),
    )
    # only the mechanism wraps, and the columns are one space apart (the box's divider), so
    # six methods side by side fit 80 columns
    t.add_column("Mechanism", min_width=14)
    for b in results:
        t.add_column("\n".join(b.method.rsplit("-", 1)), justify="right", no_wrap=True)
    sums = [by_mechanism(b) for b in results]
    keys = [k for k in MECHANISMS if any(k in s for s in sums)]
    keys += sorted({k for s in sums for k in s} - set(MECHANISMS))  # none left out of the rows
    for k in keys:
        comps = [c for b in results for c in b.components if mechanism(c) == k]
        name = MECHANISMS.get(k, comps[0].label) + ("" if in_total(comps) else NOT_IN_TOTAL)
        t.add_row(name, *[fmt(s[k], system, "stress", 2) if k in s else "—" for s in sums])
    t.add_section()
    t.add_row(
        "[bold]Total (fpj − fpe)[/]",
        *[f"[bold]{fmt(b.total, system, 'stress', 2)}[/]" for b in results],
    )
    t.add_row("% of fpj", *[f"{100 * b.total / b.jacking_stress:.1f}" for b in results])
    t.add_row("Effective stress fpe", *[fmt(b.f_pe, system, "stress", 2) for b in results])
    t.add_row("Effective force Pe", *[fmt(b.f_pe * A_ps, system, "force", 1) for b in results])
    if len(results) > 1:
        totals = [b.total for b in results]
        spread = (max(totals) - min(totals)) / (sum(totals) / len(totals))
        t.caption += f" Spread of the totals: {100 * spread:.0f} % of their mean."
    return t


def to_dict(b: LossBreakdown, A_ps: float, system: str) -> dict[str, Any]:
    """A loss breakdown as JSON-ready data."""
    return {
        "method": b.method,
        "title": b.title,
        "basis": b.basis,
        "jacking_stress": quantity(b.jacking_stress, system, "stress"),
        "components": [
            {
                "key": c.key,
                "mechanism": mechanism(c),
                "label": c.label,
                "period": c.period,
                "loss": quantity(c.value, system, "stress"),
                "percent_of_jacking": 100.0 * c.value / b.jacking_stress,
                "clause": c.clause,
                "applied": c.applied,
            }
            for c in b.components
        ],
        "by_mechanism": {k: quantity(v, system, "stress") for k, v in by_mechanism(b).items()},
        "stages": [
            {
                "name": m.key,
                "label": m.label,
                "age": None if m.age is None else {"value": m.age, "unit": "day"},
                "strand_stress": quantity(m.stress, system, "stress"),
                "force": quantity(m.stress * A_ps, system, "force"),
                "loss_since_jacking": quantity(b.jacking_stress - m.stress, system, "stress"),
            }
            for m in b.milestones
        ],
        "total": quantity(b.total, system, "stress"),
        "effective_stress": quantity(b.f_pe, system, "stress"),
        "effective_force": quantity(b.f_pe * A_ps, system, "force"),
        "figures": {
            k: (quantity(v, system, role) if role != "ratio" else v)
            for k, (v, role) in b.figures.items()
        },
        "notes": list(b.notes),
    }


def tendon_tables(girder, system: str) -> list[Table]:
    """Post-tensioned tendons: stresses after friction and anchor set, elongation, stress limits.

    One table per tendon, then the limits of AASHTO LRFD Table 5.9.2.2-1
    (:func:`tendon_limit_table`).
    """
    import numpy as np

    from prestress.losses.post_tensioned import tendon_limit_checks, tendon_states
    from prestress.units import out_unit

    su, pu, du = label(system, "stress"), label(system, "position"), label(system, "dimension")
    per = out_unit(system, "position")
    states = tendon_states(girder)
    out = []
    for s in states:
        t = s.tendon
        xs = np.linspace(s.x[0], s.x[-1], 11)
        ends = "both ends" if t.jacking == "both" else f"the {t.jacking} end"
        zones = []
        for z in s.set_zones:
            side = "left" if z.x_anchor_mm <= s.x[0] else "right"
            reach = (
                (
                    " (reaches the neutral point)"
                    if s.neutral_point is not None
                    else " (reaches the far end)"
                )
                if z.reaches_limit
                else ""
            )
            affected = fmt(abs(z.x_set_mm - z.x_anchor_mm), system, "position", 2)
            zones.append(
                f"from the {side} anchorage over {affected} {pu}{reach}, loss "
                f"{fmt(z.loss_at_anchor_MPa, system, 'stress', 2)} {su} there"
            )
        k = int(np.argmax(s.after_set))
        jack = fmt(t.jack_length, system, "dimension", 2)
        tab = Table(
            title=f"Tendon {t.name}: {t.strands} strands, jacked at {ends} to "
            f"{fmt(t.jacking_stress, system, 'stress', 1)} {su}",
            title_justify="left",
            title_style="bold",
            box=box.SIMPLE_HEAD,
            caption=f"x in {pu} from the left end; heights in {du}; stresses in {su}. "
            f"Friction (AASHTO LRFD 9th Ed. Eq. 5.9.3.2.2b-1): μ = {t.mu:g} per radian, "
            f"K = {t.K * per.factor:.3g} per {per.label} of tendon. "
            f"Anchor set {fmt(t.anchor_set, system, 'dimension', 3)} {du} by the area method: "
            + ("; ".join(zones) if zones and t.anchor_set > 0 else "none")
            + f". Peak stress after set {fmt(float(s.after_set[k]), system, 'stress', 1)} {su} "
            f"at x = {fmt(float(s.x[k]), system, 'position', 2)} {pu}. "
            "Expected jack elongation "
            + ", ".join(
                f"{end} {fmt(v, system, 'dimension', 2)} {du}" for end, v in s.elongation.items()
            )
            + f": at fpj before seating (anchor set not deducted), from zero stress, "
            f"∫ fpx ds / Ep along the tendon plus the jack length {jack} {du} at fpj; the "
            "concrete's own elastic shortening is excluded; field measurements usually agree "
            "within about ±5–7 % (common practice).",
            caption_justify="left",
        )
        for col in (  # two-line headers, so the table fits 80 columns
            "x",
            "height",
            "after\nfriction",
            "friction\nloss",
            "after\nanchor set",
            "set\nloss",
            "% fpj",
        ):
            tab.add_column(col, justify="right", no_wrap=True)
        prof = t.profile()
        fr = np.interp(xs, s.x, s.after_friction)
        st = np.interp(xs, s.x, s.after_set)
        for x, h, f1, f2 in zip(xs, np.asarray(prof.height(xs)), fr, st, strict=True):
            tab.add_row(
                fmt(x, system, "position", 2),
                fmt(h, system, "dimension", 2),
                fmt(f1, system, "stress", 1),
                fmt(t.jacking_stress - f1, system, "stress", 2),
                fmt(f2, system, "stress", 1),
                fmt(f1 - f2, system, "stress", 2),
                f"{100 * f2 / t.jacking_stress:.1f}",
            )
        out.append(tab)
    out.append(tendon_limit_table(tendon_limit_checks(girder, states), system))
    return out


def tendon_limit_table(checks: list[Any], system: str) -> Table:
    """The tendon stresses against AASHTO LRFD 9th Ed. (2020) Table 5.9.2.2-1, one row each."""
    from prestress.losses.post_tensioned import LIMITS_SOURCE

    su, pu = label(system, "stress"), label(system, "position")
    tab = Table(
        title=f"Tendon stress limits — {LIMITS_SOURCE}",
        title_justify="left",
        title_style="bold",
        box=box.SIMPLE_HEAD,
        caption=f"Stresses in {su}; x in {pu} from the left end. After set: immediately after "
        "anchor set; effective: after anchor set, elastic shortening and the final "
        "time-dependent losses given in the job.",
        caption_justify="left",
        collapse_padding=True,
        pad_edge=False,
    )
    for col in ("Tendon", "Condition", "Where", "x", "Stress", "Limit", "Ratio", ""):
        if col == "Tendon":
            tab.add_column(col, no_wrap=True)
        elif col in ("Condition", "Where"):  # wrap at words; a word longer than this folds
            tab.add_column(col, overflow="fold", min_width=11)
        else:
            tab.add_column(col, justify="right", no_wrap=True)
    short = {
        "prior_to_seating": "jacking, prior to seating",
        "anchorage_after_set": "at an anchorage, after set",
        "elsewhere_after_set": "away from anchorages, after set",
        "service": "service, after all losses",
    }
    for c in checks:
        tab.add_row(
            c.tendon,
            short.get(c.key, c.condition),
            c.where,
            fmt(c.x, system, "position", 2),
            fmt(c.stress, system, "stress", 1),
            f"{c.limit_text} = {fmt(c.limit, system, 'stress', 1)}",
            use_text(c.ratio),
            "ok" if c.ok else "[bold red]FAIL[/]",
        )
    return tab


def history_table(girder: Any, rows: list[Any], method: str, system: str) -> Table:
    """The time-step history at midlength: strand stress, loss and fiber stresses by age."""
    su, tu = label(system, "stress"), label(system, "time")
    t = Table(
        title=f"Time-step history at midlength — {method}",
        title_justify="left",
        title_style="bold",
        box=box.SIMPLE_HEAD,
        collapse_padding=True,
        caption=f"Ages of the girder ({tu}); stresses ({su}), concrete tension +, compression "
        "−. Loss: fpj − strand stress, the elastic gains from the later loads included (the "
        "loss tables' totals leave them out, as the stage checks apply those loads "
        "themselves). The analysis's own loads: prestress, girder, deck and superimposed dead "
        "load with creep, shrinkage and relaxation; no live load. The deck top once the deck "
        "is cast.",
        caption_justify="left",
    )
    for col in ("age", "strand stress", "loss", "% fpj", "girder bottom", "girder top", "deck top"):
        t.add_column(col, justify="right", no_wrap=True)
    fpj = girder.job.strand.jacking_stress
    for r in rows:
        deck = r.fibers.get("deck_top")
        t.add_row(
            fmt(r.age, system, "time", 1),
            fmt(r.strand_stress, system, "stress", 2),
            fmt(r.loss, system, "stress", 2),
            f"{100 * r.loss / fpj:.1f}",
            signed(r.fibers["girder_bottom"], system, "stress"),
            signed(r.fibers["girder_top"], system, "stress"),
            "—" if deck is None else signed(deck, system, "stress"),
        )
    return t


def history_dict(rows: list[Any], method: str, system: str) -> dict[str, Any]:
    """The time-step history as JSON-ready data."""
    return {
        "units": system,
        "method": method,
        "history": [
            {
                "age": quantity(r.age, system, "time"),
                "strand_stress": quantity(r.strand_stress, system, "stress"),
                "loss": quantity(r.loss, system, "stress"),
                "fibers": {k: quantity(v, system, "stress") for k, v in r.fibers.items()},
            }
            for r in rows
        ],
        "notes": list(getattr(rows, "notes", ())),
    }
