"""A reviewable calculation report of a check: one self-contained HTML (or Markdown) document.

The report holds everything a checking engineer needs to follow the calculation without the
tool: every input as the tool understood it (with units), the section properties with the
section drawn to scale, each loss with its formula, the values substituted and its clause,
the stress tables of every stage with limits and utilisation, the governing checks, the
permissible zone of the cgs, the plots, and its provenance (software version, SHA-256 of the
job file, date). The safety caution stands at the top and at the end.

The HTML is polyglot XHTML (well formed as XML, served as HTML): CSS inside the file, plots
as inline SVG, no external resources and no JavaScript; it prints on A4 or Letter. Every
string that comes from the user is escaped. The Markdown variant (for a ``.md`` path) has
the same content, the plots as SVG data URIs.

The document is built once as a list of plain blocks (headings, paragraphs, tables, figures)
and rendered to either format.
"""

from __future__ import annotations

import base64
import datetime as _dt
import hashlib
import html
import re
import tempfile
from collections.abc import Callable, Iterable, Sequence
from dataclasses import dataclass, field
from pathlib import Path

from prestress import __version__
from prestress.analysis import SIGN_CONVENTION, CheckResult, FiberResult, StageResult
from prestress.errors import InputError
from prestress.losses import LossComponent
from prestress.present.common import (
    CAUTION,
    FIBER_NAMES,
    LOAD_TITLES,
    fmt,
    label,
    live_load_text,
    signed,
    value,
)

# ------------------------------------------------------------------------------------------
# Blocks of the document


@dataclass(frozen=True)
class Cell:
    """A table cell: its text and an optional class ("fail", "ok", "num", "strong")."""

    text: str
    cls: str = ""


@dataclass(frozen=True)
class Heading:
    """A heading (level 1 to 4) with an anchor id."""

    level: int
    text: str
    id: str = ""


@dataclass(frozen=True)
class Para:
    """A paragraph; ``cls``: "", "note", "formula", "subst", "result", "verdict-ok" or "-fail"."""

    text: str
    cls: str = ""


@dataclass(frozen=True)
class Table:
    """A table: an optional header row, rows of cells, a caption; numbers right-aligned."""

    header: tuple[str, ...] | None
    rows: tuple[tuple[Cell, ...], ...]
    caption: str = ""
    cls: str = ""


@dataclass(frozen=True)
class Figure:
    """An SVG figure (the SVG text as written by matplotlib) with its caption."""

    svg: str
    caption: str
    id: str


@dataclass(frozen=True)
class Pre:
    """Preformatted text (the job file)."""

    text: str


@dataclass
class Section:
    """A top-level section: id, title and its blocks."""

    id: str
    title: str
    blocks: list = field(default_factory=list)


def _c(text: object, cls: str = "") -> Cell:
    return Cell(str(text), cls)


def _n(text: object) -> Cell:
    return Cell(str(text), "num")


def _kv(rows: Iterable[tuple[str, str]], caption: str = "") -> Table:
    return Table(None, tuple((_c(k, "key"), _c(v)) for k, v in rows), caption, "kv")


# ------------------------------------------------------------------------------------------
# Helpers for values


def _f(v: float | None, system: str, role: str, digits: int = 3) -> str:
    """A number in the output unit: thousands separated, a true minus sign ('—' for None)."""
    if v is None:
        return "—"
    x = value(v, system, role)
    text = f"{x:,.0f}" if abs(x) >= 1e6 else fmt(v, system, role, digits)
    return text.replace("-", "−") if text.startswith("-") else text


def _q(v: float | None, system: str, role: str, digits: int = 3) -> str:
    """A value with its output unit ('—' for None)."""
    if v is None:
        return "—"
    unit = label(system, role)
    return f"{_f(v, system, role, digits)} {unit}".strip()


def _s(v: float | None, system: str) -> str:
    """A signed stress without unit ('—' for None)."""
    return "—" if v is None else signed(v, system, "stress")


_SUPERSCRIPT = str.maketrans("-0123456789", "⁻⁰¹²³⁴⁵⁶⁷⁸⁹")


def _ratio(v: float) -> str:
    """A dimensionless figure with four significant digits; small ones as a × 10⁻ⁿ."""
    if v == 0:
        return "0"
    if abs(v) < 1e-2:
        mantissa, exponent = f"{v:.4e}".split("e")
        text = f"{mantissa} × 10{str(int(exponent)).translate(_SUPERSCRIPT)}"
    else:
        text = f"{v:.4g}"
    return text.replace("-", "−") if text.startswith("-") else text


def _strength(stage: StageResult, system: str) -> str:
    """The stage's strength (stored as "f'ci = 44.8 MPa") in the output units."""
    sym, _, rest = stage.strength_text.partition(" = ")
    try:
        mpa = float(rest.split()[0])
    except (IndexError, ValueError):
        return stage.strength_text
    return f"{sym} = {_q(mpa, system, 'stress')}"


def _use(f: FiberResult) -> str:
    if f.utilisation is None:
        return "—" if f.ok else ">1"
    return f"{abs(f.utilisation) if abs(f.utilisation) < 0.005 else f.utilisation:.2f}"


def _figure_text(name: str, v: float, role: str, system: str) -> str:
    if role == "ratio":
        return f"{name} = {_ratio(v)}"
    return f"{name} = {_q(v, system, role)}"


# ------------------------------------------------------------------------------------------
# Inputs


def _inputs(result: CheckResult, system: str) -> Section:
    g = result.girder
    job = g.job
    sec = Section("inputs", "Inputs as the tool understood them")
    b = sec.blocks
    b.append(
        Para(
            "Every value below is the one the calculation used, converted from the job file "
            f"to the output units ({system}). Positions along the girder are measured from its "
            "left end unless stated; heights from the girder bottom."
        )
    )
    b.append(Heading(3, "Job", "inputs-job"))
    b.append(
        _kv(
            [
                ("Title", job.title),
                ("Project", job.project or "—"),
                ("Owner", job.owner or "—"),
                ("Engineer", job.engineer or "—"),
                ("Job file", job.file),
                ("Output units", system),
            ]
        )
    )
    b.append(Heading(3, "Girder", "inputs-girder"))
    rows = [
        ("Section", f"{g.section_name} ({g.section_source or 'no source given'})"),
        ("Overall length", _q(job.length, system, "position")),
        ("Design span (bearing to bearing)", _q(job.span, system, "position")),
        ("Bearing offset from each end", _q(job.bearing_offset, system, "position")),
    ]
    if job.spacing is not None:
        rows.append(("Girder spacing", _q(job.spacing, system, "dimension")))
    rows.append(
        (
            "Transfer length",
            f"{_q(job.transfer_length, system, 'dimension')} ({job.transfer_length_source})",
        )
    )
    rows.append(("Section basis of the stresses", job.loss_basis))
    b.append(_kv(rows))
    gc = job.girder_concrete
    b.append(Heading(3, "Girder concrete", "inputs-concrete"))
    b.append(
        _kv(
            [
                ("f'ci (at transfer)", _q(gc.fci, system, "stress")),
                ("f'c (design)", _q(gc.fc, system, "stress")),
                ("Unit weight (dead load)", _q(gc.unit_weight, system, "unit_weight")),
                ("Eci", _q(gc.Eci, system, "modulus_e")),
                ("Ec", _q(gc.Ec, system, "modulus_e")),
                ("Moduli from", gc.modulus_source),
            ]
        )
    )
    if job.deck is not None:
        d = job.deck
        b.append(Heading(3, "Deck", "inputs-deck"))
        b.append(
            _kv(
                [
                    ("Structural thickness", _q(d.thickness, system, "dimension")),
                    (
                        "Integral wearing surface (weight only)",
                        _q(d.wearing_surface, system, "dimension"),
                    ),
                    (
                        "Effective width",
                        f"{_q(d.effective_width, system, 'dimension')} "
                        f"({d.effective_width_source})",
                    ),
                    ("Tributary width (dead load)", _q(d.tributary_width, system, "dimension")),
                    ("Haunch thickness", _q(d.haunch, system, "dimension")),
                    ("Haunch width", _q(d.haunch_width, system, "dimension")),
                    ("Haunch in the stiffness", "yes" if d.haunch_in_stiffness else "no"),
                    ("Deck f'c", _q(d.concrete.fc, system, "stress")),
                    ("Deck unit weight", _q(d.concrete.unit_weight, system, "unit_weight")),
                    (
                        "Deck Ec",
                        f"{_q(d.concrete.Ec, system, 'modulus_e')} ({d.concrete.modulus_source})",
                    ),
                    ("Modular ratio n = Ec,deck / Ec,girder", f"{g.n_deck:.4f}"),
                ]
            )
        )
    st = job.strand
    b.append(Heading(3, "Strand", "inputs-strand"))
    b.append(
        _kv(
            [
                ("Diameter", _q(st.diameter, system, "dimension")),
                ("Area of one strand", _q(st.area, system, "area")),
                ("fpu", _q(st.fpu, system, "stress")),
                ("fpy", _q(st.fpy, system, "stress")),
                ("Ep", _q(st.Ep, system, "modulus_e")),
                ("Relaxation class", st.relaxation),
                ("Jacking stress fpj", _q(st.jacking_stress, system, "stress")),
                ("Stress before transfer fpbt", _q(st.stress_before_transfer, system, "stress")),
                ("Number of strands", str(job.strand_count)),
                ("Total area Aps", _q(job.A_ps, system, "area")),
                ("Strand centroid at midlength (above bottom)", _q(job.y_ps, system, "dimension")),
            ]
        )
    )
    if job.rows:
        du = label(system, "dimension")
        rows_t = []
        for i, r in enumerate(job.rows):
            xs = ", ".join(_f(float(x), system, "dimension", 2) for x in r.x_positions())
            harp = "—"
            if r.harp is not None:
                top, (h1, h2), dy = r.harp
                harp = (
                    f"highest strand {_q(top, system, 'dimension')} at the ends, "
                    f"{_q(dy, system, 'dimension')} apart; hold-downs at "
                    f"{_q(h1, system, 'position')} and {_q(h2, system, 'position')}"
                )
            deb = (
                "; ".join(
                    f"{len(idx)} strand(s) {_q(left, system, 'position')} left, "
                    f"{_q(right, system, 'position')} right"
                    for idx, left, right in r.debond
                )
                or "—"
            )
            rows_t.append(
                (
                    _n(i + 1),
                    _n(_f(r.height, system, "dimension", 2)),
                    _n(r.count),
                    _c(xs),
                    _c(harp),
                    _c(deb),
                )
            )
        b.append(
            Table(
                (
                    "Row",
                    f"Height ({du})",
                    "Count",
                    f"Strand x ({du}, from the axis)",
                    "Harped",
                    "Debonded",
                ),
                tuple(rows_t),
                "Strand rows as given (heights between the hold-downs for harped rows).",
            )
        )
    if job.layout is not None:
        sets = []
        for s in job.layout.sets:
            sets.append(
                (
                    _c(s.label),
                    _n(s.count),
                    _n(_f(s.y_mid, system, "dimension", 2)),
                    _n("—" if s.y_end is None else _f(s.y_end, system, "dimension", 2)),
                    _c(
                        "—"
                        if s.hold_downs is None
                        else f"{_f(s.hold_downs[0], system, 'position', 2)}, "
                        f"{_f(s.hold_downs[1], system, 'position', 2)}"
                    ),
                    _n(_f(s.debond_left, system, "position", 2)),
                    _n(_f(s.debond_right, system, "position", 2)),
                )
            )
        du, pu = label(system, "dimension"), label(system, "position")
        b.append(
            Table(
                (
                    "Strand set",
                    "Strands",
                    f"Height at midlength ({du})",
                    f"Height at ends ({du})",
                    f"Hold-downs ({pu})",
                    f"Debonded left ({pu})",
                    f"Debonded right ({pu})",
                ),
                tuple(sets),
                "The strand sets of the layout as analysed (each a path and a bond length).",
            )
        )
    tendons = getattr(job, "tendons", ())
    if tendons:
        b.append(
            Table(
                ("Tendon", "Strands", "Area", "Control points x", "Control points y"),
                tuple(
                    (
                        _c(t.name),
                        _n(t.strands),
                        _n(_q(t.area, system, "area")),
                        _c(", ".join(_f(x, system, "position", 2) for x in t.x)),
                        _c(", ".join(_f(y, system, "dimension", 2) for y in t.y)),
                    )
                    for t in tendons
                ),
                "Post-tensioned tendons.",
            )
        )
    lo = job.loads
    live = lo.live
    b.append(Heading(3, "Loads", "inputs-loads"))
    rows = [
        (
            "Girder self-weight (from the section and unit weight)",
            _q(g.self_weight, system, "line_load"),
        ),
        ("Deck, haunch and other non-composite load", _q(g.deck_weight, system, "line_load")),
        (
            "of which other non-composite load (given)",
            _q(lo.other_noncomposite, system, "line_load"),
        ),
        ("Superimposed dead load DC (composite)", _q(lo.superimposed_dead, system, "line_load")),
        ("Wearing surface DW (composite)", _q(lo.wearing_surface, system, "line_load")),
    ]
    for at, P in lo.diaphragms:
        rows.append(
            (
                f"Diaphragm at {_q(at, system, 'position')} from the left bearing",
                _q(P, system, "force"),
            )
        )
    rows.append(("Live-load model", live.model))
    if live.model == "HL-93":
        rows.append(("Dynamic load allowance IM", f"{live.impact:g}"))
        if live.distribution_factor is not None:
            rows.append(
                (
                    "Distribution factor for moment",
                    f"{live.distribution_factor:.4f} ({live.distribution_source})",
                )
            )
        if live.girders is not None:
            rows.append(("Number of girders", str(live.girders)))
        if live.skew_deg:
            rows.append(("Skew", f"{live.skew_deg:g}°"))
    elif live.moments_tenth_points is not None:
        rows.append(
            (
                "Live-load moments at the tenth points",
                ", ".join(_f(m, system, "moment", 1) for m in live.moments_tenth_points)
                + f" {label(system, 'moment')}",
            )
        )
    elif live.moment_midspan is not None:
        rows.append(
            ("Live-load moment at midspan (given)", _q(live.moment_midspan, system, "moment"))
        )
    b.append(_kv(rows))
    combos = [
        (f"{k}", f"dead × {c.dead:g}, live × {c.live:g}") for k, c in job.combinations.items()
    ]
    if combos:
        b.append(_kv(combos, "Load factors of the service combinations."))
    if job.handling is not None:
        b.append(Heading(3, "Handling", "inputs-handling"))
        b.append(
            _kv(
                [
                    (
                        "Lifting points from each end",
                        _q(job.handling.lift_point, system, "position"),
                    ),
                    (
                        "Dynamic factors (one case each)",
                        ", ".join(f"{f:g}" for f in job.handling.dynamic_factors),
                    ),
                ]
            )
        )
    t = job.times
    b.append(Heading(3, "Environment, ages and losses", "inputs-times"))
    b.append(
        _kv(
            [
                ("Relative humidity", f"{t.relative_humidity:g} %"),
                ("Age at transfer", f"{t.transfer:g} day"),
                ("Age at deck placement", f"{t.deck_placement:g} day"),
                ("Final age", f"{t.final:g} day"),
                ("Loss method", job.loss_method),
            ]
        )
    )
    if job.user_stations:
        b.append(
            _kv(
                [(name, _q(x, system, "position")) for name, x in job.user_stations],
                "Stations added by the job (from the left end).",
            )
        )
    b.append(Heading(3, "Stress limits", "inputs-limits"))
    b.append(Para(f"{job.limits.name} — {job.limits.source}"))
    su = label(system, "stress")
    lim_rows = []
    for stage in result.stages:
        for fiber in ("girder_bottom", "girder_top", "deck_top"):
            fr = next((s.fibers[fiber] for s in stage.stations if fiber in s.fibers), None)
            if fr is None:
                continue
            lim_rows.append(
                (
                    _c(stage.title),
                    _c(FIBER_NAMES[fiber]),
                    _c(fr.limit_text),
                    _n(_s(fr.compression_limit, system)),
                    _n(_s(fr.tension_limit, system)),
                )
            )
    b.append(
        Table(
            ("Stage", "Fiber", "Rule", f"Compression ({su})", f"Tension ({su})"),
            tuple(lim_rows),
            f"Limits as stresses; {SIGN_CONVENTION}.",
        )
    )
    return sec


# ------------------------------------------------------------------------------------------
# Section properties


def _section(result: CheckResult, system: str, drawing: str | None) -> Section:
    g = result.girder
    gross = g.gross
    c = g.composite_section
    sec = Section("section-properties", "Section properties")
    header = ["Property", "Girder (gross)"] + (["Composite"] if c is not None else []) + ["Unit"]
    rows = []

    def row(name: str, a: float | None, bb: float | None, role: str) -> None:
        cells = [_c(name), _n(_f(a, system, role))]
        if c is not None:
            cells.append(_n(_f(bb, system, role)))
        cells.append(_c(label(system, role)))
        rows.append(tuple(cells))

    row("Area A", gross.area, c.area if c else None, "area")
    row("Centroid above the girder bottom yb", gross.yb, c.yb if c else None, "dimension")
    row(
        "Centroid to the girder top yt", gross.yt, (gross.height - c.yb) if c else None, "dimension"
    )
    row("Moment of inertia I", gross.Ix, c.I if c else None, "inertia")
    row("Section modulus, girder bottom", gross.Sb, c.S("girder_bottom") if c else None, "modulus")
    row("Section modulus, girder top", gross.St, c.S("girder_top") if c else None, "modulus")
    if c is not None:
        row("Section modulus, deck top", None, c.S("deck_top"), "modulus")
    row("Overall depth", gross.height, c.fibers["deck_top"] if c else None, "dimension")
    row("Moment of inertia about the vertical axis Iy", gross.Iy, None, "inertia")
    row("Perimeter (outer)", gross.perimeter, None, "dimension")
    row("Volume-to-surface V/S", gross.volume_to_surface, None, "dimension")
    row("Top flange width", gross.top_width, None, "dimension")
    row("Girder self-weight", g.self_weight, None, "line_load")
    row(
        "Strand eccentricity at midlength",
        g.eccentricity_gross,
        (c.yb - g.job.y_ps) if c else None,
        "dimension",
    )
    sec.blocks.append(
        Table(
            tuple(header),
            tuple(rows),
            "Gross properties by sectionproperties (exact polygon); composite: deck transformed "
            "into girder concrete by n, parallel-axis theorem. V/S with every outer face exposed.",
        )
    )
    used = []
    for name, s in (
        ("at transfer", g.section_transfer),
        ("in service (girder alone)", g.section_service),
        ("in service (composite)", g.section_composite),
    ):
        if s is None:
            continue
        used.append(
            (
                _c(name),
                _c(s.name),
                _n(_f(s.area, system, "area")),
                _n(_f(s.yb, system, "dimension")),
                _n(_f(s.I, system, "inertia")),
            )
        )
    if used:
        sec.blocks.append(
            Table(
                (
                    "Stresses computed",
                    "Section",
                    f"A ({label(system, 'area')})",
                    f"yb ({label(system, 'dimension')})",
                    f"I ({label(system, 'inertia')})",
                ),
                tuple(used),
                "The sections carrying each load in the stage tables.",
            )
        )
    if drawing:
        sec.blocks.append(
            Figure(
                drawing,
                "The girder section to scale with its strands at midlength and the "
                "deck (principal dimensions; the centroid marked).",
                "fig-section",
            )
        )
    return sec


# ------------------------------------------------------------------------------------------
# Losses and their formulas


class _Desc(str):
    """A line of words about a formula (shown as text, not as a formula)."""


_ES_CLOSED = "ΔfpES = [Aps fpbt (Ig + em² Ag) − em Mg Ag] / [Aps (Ig + em² Ag) + Ag Ig Eci / Ep]"


def _loss_formula(
    comp: LossComponent, result: CheckResult, system: str
) -> tuple[list[str], list[str]]:
    """The formula lines of a loss component and the values substituted in it."""
    b = result.losses
    job = result.girder.job
    fig = b.figures
    gross = result.girder.gross

    def f(name: str, shown: str | None = None) -> str | None:
        if name not in fig:
            return None
        v, role = fig[name]
        return _figure_text(shown or name, v, role, system)

    def vals(*items: str | None) -> list[str]:
        return [i for i in items if i]

    key = comp.key
    approximate = "5.9.3.3" in comp.clause
    refined = "5.9.3.4" in comp.clause
    Ep = _q(job.strand.Ep, system, "modulus_e")
    if key == "before_transfer":
        return (
            ["fpj − fpbt  (losses in the bed before transfer, as given in the job)"],
            [
                f"fpj = {_q(job.strand.jacking_stress, system, 'stress')}",
                f"fpbt = {_q(job.strand.stress_before_transfer, system, 'stress')}",
            ],
        )
    if key == "elastic_shortening" and "C5.9.3.2.3a-1" in comp.clause:
        return (
            [
                _ES_CLOSED + "   (Eq. C5.9.3.2.3a-1)",
                _Desc(
                    "the exact solution of ΔfpES = (Ep/Eci) fcgp (Eq. 5.9.3.2.3a-1) with "
                    "fcgp = Pi/Ag + Pi em²/Ig − Mg em/Ig and Pi = Aps (fpbt − ΔfpES), at midspan, "
                    "gross section, self-weight on the girder length"
                ),
            ],
            vals(
                f("A_ps", "Aps"),
                f("f_pbt", "fpbt"),
                f("e_m", "em"),
                f("M_g (girder length)", "Mg"),
                f"Ag = {_q(gross.area, system, 'area')}",
                f"Ig = {_q(gross.Ix, system, 'inertia')}",
                f("E_ci", "Eci"),
                f("E_p", "Ep"),
                f("f_cgp", "fcgp (compression +)"),
            ),
        )
    gc = job.girder_concrete
    H = job.times.relative_humidity
    if approximate and key in ("creep", "shrinkage", "relaxation"):
        common = vals(
            f("γh (Eq. 5.9.3.3-2)", "γh = 1.7 − 0.01 H"),
            f"H = {H:g} %",
            f("γst (Eq. 5.9.3.3-3)", "γst = 5 / (1 + f'ci)"),
            f"f'ci = {_f(gc.fci, 'US', 'stress')} ksi" if gc.fci is not None else None,
        )
        if key == "creep":
            return (
                [
                    "ΔfpCR = 10.0 (fpi Aps / Ag) γh γst   (first term of Eq. 5.9.3.3-1; ksi as "
                    "printed, fpi = fpbt)"
                ],
                [
                    f"fpi = {_f(job.strand.stress_before_transfer, 'US', 'stress')} ksi",
                    f"Aps = {_q(job.A_ps, system, 'area')}",
                    f"Ag = {_q(gross.area, system, 'area')}",
                    *common,
                ],
            )
        if key == "shrinkage":
            return (
                ["ΔfpSH = 12.0 γh γst   (second term of Eq. 5.9.3.3-1; ksi as printed)"],
                common,
            )
        low = job.strand.relaxation == "low"
        return (
            [
                "ΔfpR = 2.4 ksi for low-relaxation strand   (third term of Eq. 5.9.3.3-1)"
                if low
                else "ΔfpR for stress-relieved strand (see the note of the loss method)"
            ],
            [],
        )
    if not refined:
        return (
            [
                _Desc(
                    "no closed-form expression: this mechanism's share of the strand stress "
                    f"change as computed by the method ({comp.clause})"
                )
            ],
            [],
        )
    kid = vals(
        f("Kid (5.9.3.4.2a-2)", "Kid"),
        f("ψb(tf, ti)"),
    )
    kdf = vals(f("Kdf (5.9.3.4.3a-2)", "Kdf"), f("ψb(tf, ti)"))
    kid_line = (
        "Kid = 1 / [1 + (Ep/Eci)(Aps/Ag)(1 + Ag epg²/Ig)(1 + 0.7 ψb(tf, ti))]   (Eq. 5.9.3.4.2a-2)"
    )
    kdf_line = (
        "Kdf = 1 / [1 + (Ep/Eci)(Aps/Ac)(1 + Ac epc²/Ic)(1 + 0.7 ψb(tf, ti))]   (Eq. 5.9.3.4.3a-2)"
    )
    if key == "shrinkage":
        return (
            [
                "ΔfpSR = εbid Ep Kid   (Eq. 5.9.3.4.2a-1)",
                kid_line,
                _Desc("εbid: girder shrinkage from transfer to deck placement (Eq. 5.4.2.3.3-1)"),
            ],
            vals(
                f("εbid"),
                f"Ep = {Ep}",
                *kid,
                f("ks girder (5.4.2.3.2-2)", "ks"),
                f("khs (5.4.2.3.3-2)", "khs"),
                f("kf girder (5.4.2.3.2-4)", "kf"),
            ),
        )
    if key == "creep":
        return (
            ["ΔfpCR = (Ep/Eci) fcgp ψb(td, ti) Kid   (Eq. 5.9.3.4.2b-1)", kid_line],
            vals(
                f"Ep = {Ep}",
                f"Eci = {_q(gc.Eci, system, 'modulus_e')}",
                f("fcgp"),
                f("ψb(td, ti)"),
                *kid,
                f("khc (5.4.2.3.2-3)", "khc"),
            ),
        )
    if key in ("relaxation", "relaxation_after_deck"):
        kl = 30 if job.strand.relaxation == "low" else 7
        first = (
            "ΔfpR1 = (fpt / KL)(fpt / fpy − 0.55)   (Eq. 5.9.3.4.2c-1; fpt not less than "
            f"0.55 fpy; KL = {kl} for {job.strand.relaxation}-relaxation strand)"
        )
        lines = [first] if key == "relaxation" else ["ΔfpR2 = ΔfpR1   (Eq. 5.9.3.4.3c-1)", first]
        return (
            lines,
            [
                f"fpt = {_q(b.f_pt, system, 'stress')}",
                f"fpy = {_q(job.strand.fpy, system, 'stress')}",
                f"KL = {kl}",
            ],
        )
    if key == "shrinkage_after_deck":
        return (
            [
                "ΔfpSD = εbdf Ep Kdf   (Eq. 5.9.3.4.3a-1)",
                kdf_line,
                _Desc(
                    "εbdf: girder shrinkage from deck placement to the final age (Eq. 5.4.2.3.3-1)"
                ),
            ],
            vals(f("εbdf"), f"Ep = {Ep}", *kdf),
        )
    if key == "creep_after_deck":
        return (
            [
                "ΔfpCD = (Ep/Eci) fcgp [ψb(tf, ti) − ψb(td, ti)] Kdf + (Ep/Ec) Δfcd ψb(tf, td) "
                "Kdf   (Eq. 5.9.3.4.3b-1)",
                _Desc(
                    "Δfcd: change of the concrete stress at the strands from the losses between "
                    "transfer and deck placement and the deck and superimposed loads (negative: a "
                    "gain)"
                ),
            ],
            vals(
                f"Ep = {Ep}",
                f"Eci = {_q(gc.Eci, system, 'modulus_e')}",
                f"Ec = {_q(gc.Ec, system, 'modulus_e')}",
                f("fcgp"),
                f("ψb(tf, ti)"),
                f("ψb(td, ti)"),
                f("Δfcd"),
                f("ψb(tf, td)"),
                f("Kdf (5.9.3.4.3a-2)", "Kdf"),
            ),
        )
    if key == "deck_shrinkage_gain":
        d = job.deck
        return (
            [
                "ΔfpSS = (Ep/Ec) Δfcdf Kdf [1 + 0.7 ψb(tf, td)]   (Eq. 5.9.3.4.3d-1; a gain, "
                "listed as a negative loss)",
                "Δfcdf = εddf Ad Ecd / [1 + 0.7 ψd(tf, td)] (1/Ac − epc ed / Ic)   "
                "(Eq. 5.9.3.4.3d-2, tension at the strands positive)",
            ],
            vals(
                f"Ep = {Ep}",
                f"Ec = {_q(gc.Ec, system, 'modulus_e')}",
                f("Δfcdf (5.9.3.4.3d-2)", "Δfcdf"),
                f("Kdf (5.9.3.4.3a-2)", "Kdf"),
                f("ψb(tf, td)"),
                f("εddf"),
                f("ψd(tf, td)"),
                f"Ad = {_q(d.effective_width * d.thickness, system, 'area')}" if d else None,
                f"Ecd = {_q(d.concrete.Ec, system, 'modulus_e')}" if d else None,
                f("V/S deck"),
                f("ks deck"),
            ),
        )
    return (
        [_Desc(f"as given by {comp.clause} (the figures of the method are listed below)")],
        [],
    )


def _losses(result: CheckResult, system: str) -> Section:
    b = result.losses
    A = result.girder.job.A_ps
    sec = Section("losses", "Prestress losses")
    blocks = sec.blocks
    blocks.append(
        Para(
            f"Method: {b.method} — {b.title}. Losses are positive, gains negative; "
            f"stresses on the {b.basis} section basis."
        )
    )
    fpj = b.jacking_stress
    for i, comp in enumerate(b.components, 1):
        blocks.append(Heading(3, f"{i}. {comp.label} ({comp.period})", f"loss-{i}-{comp.key}"))
        lines, subs = _loss_formula(comp, result, system)
        for ln in lines:
            blocks.append(Para(ln, "subst" if isinstance(ln, _Desc) else "formula"))
        if subs:
            blocks.append(Para("with " + "; ".join(subs) + ".", "subst"))
        applied = "" if comp.applied else " — reported, not applied to the stresses"
        blocks.append(
            Para(
                f"Result: {_q(comp.value, system, 'stress', 2)} "
                f"({100.0 * comp.value / fpj:.2f} % of fpj){applied}. Source: {comp.clause}.",
                "result",
            )
        )
    su, fu = label(system, "stress"), label(system, "force")
    rows = [
        (
            _c(c.label + ("" if c.applied else " (not applied)")),
            _c(c.period),
            _n(_f(c.value, system, "stress", 2)),
            _n(f"{100 * c.value / fpj:.1f}"),
            _c(c.short_clause),
        )
        for c in b.components
    ]
    rows.append(
        (
            _c("Total fpj − fpe", "strong"),
            _c(""),
            _n(_f(b.total, system, "stress", 2)),
            _n(f"{100 * b.total / fpj:.1f}"),
            _c(""),
        )
    )
    blocks.append(Heading(3, "Summary of the losses", "losses-summary"))
    blocks.append(
        Table(("Mechanism", "When", f"Loss ({su})", "% of fpj", "Source"), tuple(rows), b.title)
    )
    ms = []
    for m in b.milestones:
        ms.append(
            (
                _c(m.label),
                _n("—" if m.age is None else f"{m.age:g}"),
                _n(_f(m.stress, system, "stress", 2)),
                _n(f"{100 * m.stress / fpj:.1f}"),
                _n(_f(m.stress * A, system, "force", 1)),
            )
        )
    blocks.append(
        Table(
            (
                "Strand stress",
                "Girder age (day)",
                f"Stress ({su})",
                "% of fpj",
                f"Force, all strands ({fu})",
            ),
            tuple(ms),
            "Strand stress at the milestones of the method.",
        )
    )
    if b.figures:
        figs = [
            (
                _c(name),
                _n(_ratio(v) if role == "ratio" else _f(v, system, role)),
                _c("" if role == "ratio" else label(system, role)),
            )
            for name, (v, role) in b.figures.items()
        ]
        blocks.append(Heading(3, "Figures of the loss calculation", "losses-figures"))
        blocks.append(
            Table(
                ("Figure", "Value", "Unit"),
                tuple(figs),
                "Intermediate figures as computed by the method.",
            )
        )
    for n in b.notes:
        blocks.append(Para(f"Note: {n}", "note"))
    return sec


# ------------------------------------------------------------------------------------------
# Stage tables, governing checks, zone


_SHORT_FIBER = {"girder_bottom": "bottom", "girder_top": "top", "deck_top": "deck"}
_MOMENTS = ("girder", "deck", "diaphragms", "superimposed", "live")


def _stage_blocks(stage: StageResult, number: int, system: str) -> list:
    fibers = [
        f
        for f in ("girder_bottom", "girder_top", "deck_top")
        if any(f in s.fibers for s in stage.stations)
    ]
    loads = [k for k in _MOMENTS if any(k in s.moments for s in stage.stations)]
    loads += sorted({k for s in stage.stations for k in s.moments} - set(loads))
    service = any(s.x_bearing is not None for s in stage.stations)
    pu, fu, du = label(system, "position"), label(system, "force"), label(system, "dimension")
    mu, su = label(system, "moment"), label(system, "stress")
    status = "all fibers within their limits" if stage.ok else "LIMIT EXCEEDED"
    out: list = [
        Heading(3, f"Stage {number} — {stage.title}: {status}", f"stage-{stage.key}"),
        Para(f"Acting: {stage.description}. Strength: {_strength(stage, system)}."),
    ]
    head = ["Station", f"x from end ({pu})"]
    if service:
        head.append(f"x from bearing ({pu})")
    head += [f"P ({fu})", f"e ({du})", f"cgs ({du})"]
    head += [f"M {k} ({mu})" for k in loads] + [f"M total ({mu})"]
    rows = []
    for s in stage.stations:
        cells = [_c(s.name), _n(_f(s.x, system, "position", 2))]
        if service:
            cells.append(_n(_f(s.x_bearing, system, "position", 2)))
        cells += [
            _n(_f(s.force, system, "force", 1)),
            _n(_f(s.eccentricity, system, "dimension", 2)),
            _n(_f(s.cgs, system, "dimension", 2)),
        ]
        cells += [_n(_f(s.moments.get(k, 0.0), system, "moment", 1)) for k in loads]
        cells.append(_n(_f(s.moment, system, "moment", 1)))
        rows.append(tuple(cells))
    out.append(
        Table(
            tuple(head),
            tuple(rows),
            f"Stage {number}: prestress force, eccentricity below the girder centroid, cgs "
            "height above the girder bottom and factored moments (sagging +).",
            "wide",
        )
    )
    head = ["Station"]
    for f in fibers:
        head += [f"{_SHORT_FIBER[f]} stress ({su})", f"{_SHORT_FIBER[f]} use"]
    head += ["Governs", "Check"]
    rows = []
    for s in stage.stations:
        cells = [_c(s.name)]
        for f in fibers:
            fr = s.fibers.get(f)
            if fr is None:
                cells += [_c(""), _c("")]
                continue
            cls = "num" if fr.ok else "num fail"
            cells += [Cell(signed(fr.stress, system, "stress"), cls), Cell(_use(fr), cls)]
        gov = s.governing()
        cells.append(_c("—" if gov is None else FIBER_NAMES[gov[0]]))
        cells.append(_c("ok", "ok") if s.ok else _c("FAIL", "fail"))
        rows.append(tuple(cells))
    out.append(
        Table(
            tuple(head),
            tuple(rows),
            f"Stage {number}: fiber stresses in {su}, {SIGN_CONVENTION}; use = stress / "
            "limit of the same sign.",
            "wide",
        )
    )
    lim = []
    for f in fibers:
        fr = next((s.fibers[f] for s in stage.stations if f in s.fibers), None)
        if fr is None:
            continue
        parts = []
        if fr.compression_limit is not None:
            parts.append(f"compression {signed(fr.compression_limit, system, 'stress')} {su}")
        if fr.tension_limit is not None:
            parts.append(f"tension {signed(fr.tension_limit, system, 'stress')} {su}")
        text = ", ".join(parts) + f" ({fr.limit_text})" if parts else "not checked"
        lim.append(f"{FIBER_NAMES[f]}: {text}")
    out.append(Para("Limits — " + "; ".join(lim) + "."))
    for n in stage.notes:
        out.append(Para(f"Note: {n}", "note"))
    return out


def _loads(result: CheckResult, system: str) -> Section | None:
    le = result.loads
    if le is None:
        return None
    sec = Section("loads", "Moments and shears per girder")
    pu, mu, fu = label(system, "position"), label(system, "moment"), label(system, "force")
    keys = [k for k in LOAD_TITLES if k in le.moments and le.moments[k].any()]
    head = ["Station", f"x from bearing ({pu})", *[f"{LOAD_TITLES[k]} ({mu})" for k in keys]]
    if le.shear_live is not None:
        head += [f"V LL+IM max ({fu})", f"V LL+IM min ({fu})"]
    a = result.girder.job.bearing_offset
    rows = []
    for i, st in enumerate(le.stations):
        cells = [_c(st.name), _n(_f(st.x - a, system, "position", 2))]
        cells += [_n(_f(float(le.moments[k][i]), system, "moment", 1)) for k in keys]
        if le.shear_live is not None:
            cells += [_n(_f(float(v[i]), system, "force", 1)) for v in le.shear_live]
        rows.append(tuple(cells))
    sec.blocks.append(
        Table(
            tuple(head),
            tuple(rows),
            "Unfactored moments (sagging +) and live-load shears (+ where the girder left of "
            "the section is pushed up). Girder weight on the bearings; deck, haunch and "
            "diaphragms on the girder alone; barriers (DC), wearing surface (DW) and live load "
            "on the composite section.",
            "wide",
        )
    )
    sec.blocks.append(Para(f"Live load: {live_load_text(result)}."))
    return sec


def _stresses(result: CheckResult, system: str) -> Section:
    sec = Section("stresses", "Fiber stresses by stage")
    sec.blocks.append(
        Para(
            "For every stage, the prestress force of that time and the loads present act on "
            "the section that carries them; stresses are P/A ± P e/S ± M/S superposed. "
            f"Sign convention: {SIGN_CONVENTION}."
        )
    )
    for i, stage in enumerate(result.stages, 1):
        sec.blocks += _stage_blocks(stage, i, system)
    return sec


def _governing(result: CheckResult, system: str) -> Section:
    sec = Section("governing", "Governing checks")
    su = label(system, "stress")
    rows = []
    best_all = None
    for i, s in enumerate(result.stages, 1):
        for fiber in ("girder_bottom", "girder_top", "deck_top"):
            best = None
            for st in s.stations:
                fr = st.fibers.get(fiber)
                if fr is None:
                    continue
                u = (
                    fr.utilisation
                    if fr.utilisation is not None
                    else (float("inf") if not fr.ok else None)
                )
                if u is not None and (best is None or u > best[1]):
                    best = (st, u, fr)
            if best is None:
                if any(fiber in st.fibers for st in s.stations):
                    rows.append(
                        (
                            _c(f"{i}. {s.title}"),
                            _c(FIBER_NAMES[fiber]),
                            _c("—"),
                            _n("—"),
                            _n("—"),
                            _n("not checked"),
                            _c(""),
                        )
                    )
                continue
            st, u, fr = best
            limit = fr.compression_limit if fr.stress < 0 else fr.tension_limit
            cls = "ok" if fr.ok else "fail"
            rows.append(
                (
                    _c(f"{i}. {s.title}"),
                    _c(FIBER_NAMES[fiber]),
                    _c(st.name),
                    _n(signed(fr.stress, system, "stress")),
                    _n(_s(limit, system)),
                    Cell(">1" if u == float("inf") else f"{u:.2f}", f"num {cls}"),
                    _c("ok" if fr.ok else "FAIL", cls),
                )
            )
            if best_all is None or u > best_all[0]:
                best_all = (u, s, fiber, st)
    verdict = "PASS" if result.ok else "FAIL"
    if result.ok and best_all is not None:
        u, s, fiber, st = best_all
        text = (
            f"{verdict}: every checked fiber at every station is within its limit; the "
            f"highest utilisation is {u:.2f} ({s.title}, {FIBER_NAMES[fiber]} at {st.name})."
        )
    elif result.ok:
        text = f"{verdict}: no limit was checked."
    else:
        failing = ", ".join(
            f"{s.title} ({sum(1 for st in s.stations if not st.ok)} station(s))"
            for s in result.stages
            if not s.ok
        )
        text = f"{verdict}: limits exceeded in {failing}."
    sec.blocks.append(Para(text, "verdict-ok" if result.ok else "verdict-fail"))
    sec.blocks.append(
        Table(
            (
                "Stage",
                "Fiber",
                "Governing station",
                f"Stress ({su})",
                f"Limit ({su})",
                "Use",
                "Check",
            ),
            tuple(rows),
            "The station of the highest utilisation for each stage and fiber.",
        )
    )
    return sec


def _zone(result: CheckResult, system: str) -> Section:
    sec = Section("zone", "Permissible zone of the cgs")
    du, pu = label(system, "dimension"), label(system, "position")
    sec.blocks.append(
        Para(
            "At each station, the band of cgs heights that keeps both girder fibers within "
            "their limits in every stage, with that stage's force and moments (the classical "
            "kern construction); the margin is the distance from the cgs to the nearer edge "
            "(negative: outside)."
        )
    )
    rows = []
    for z in result.zone:
        if z.low is None and z.high is None:
            mark, who, cls = "—", "no prestress developed", ""
        else:
            mark, cls = ("inside", "ok") if z.inside else ("OUTSIDE", "fail")
            who = "; ".join(
                w
                for w in (
                    z.governing_low and f"low: {z.governing_low}",
                    z.governing_high and f"high: {z.governing_high}",
                )
                if w
            ).replace("_", " ")
        rows.append(
            (
                _c(z.station.name),
                _n(_f(z.station.x, system, "position", 2)),
                _n(_f(z.low, system, "dimension", 2)),
                _n(_f(z.cgs, system, "dimension", 2)),
                _n(_f(z.high, system, "dimension", 2)),
                _n(_f(z.margin, system, "dimension", 2)),
                _c(mark, cls),
                _c(who),
            )
        )
    sec.blocks.append(
        Table(
            (
                "Station",
                f"x ({pu})",
                f"Lowest ({du})",
                f"cgs ({du})",
                f"Highest ({du})",
                f"Margin ({du})",
                "",
                "Bounds set by",
            ),
            tuple(rows),
            f"Heights in {du} above the girder bottom; x from the left girder end.",
        )
    )
    return sec


# ------------------------------------------------------------------------------------------
# Plots


def _svg_of(make: Callable[[Path], object]) -> str:
    """Run a plotting function into a temporary SVG file and return its text."""
    with tempfile.TemporaryDirectory(prefix="prestress-report-") as tmp:
        path = Path(tmp) / "plot.svg"
        make(path)
        return path.read_text(encoding="utf-8")


def _plots(result: CheckResult, system: str) -> tuple[str | None, Section]:
    """The section drawing and the plots section (plots that cannot be drawn become notes)."""
    from prestress.present import plots

    sec = Section("plots", "Plots")
    drawing = None
    try:
        drawing = _svg_of(lambda p: plots.plot_section(result, p, system))
    except (InputError, ValueError) as exc:  # a shape that cannot be drawn
        sec.blocks.append(Para(f"The section could not be drawn: {exc}", "note"))
    items = [
        (
            "fig-stresses",
            f"Fiber stresses along the girder for every stage, with the limits; {SIGN_CONVENTION}.",
            plots.plot_stresses,
        ),
        (
            "fig-zone",
            "Permissible zone of the cgs along the girder, with the cgs, hold-downs "
            "and debond ends.",
            plots.plot_zone,
        ),
        (
            "fig-losses",
            "Strand stress against the age of the girder (log scale) at the "
            "milestones of the loss method.",
            plots.plot_losses,
        ),
        (
            "fig-magnel",
            "Magnel diagram at midspan: the stress inequalities at release and in "
            "final service in the (e, 1/Pi) plane, the feasible region shaded and the design "
            "point marked.",
            plots.plot_magnel,
        ),
    ]
    for fid, caption, fn in items:
        try:
            svg = _svg_of(lambda p, fn=fn: fn(result, p, system))
        except InputError as exc:
            sec.blocks.append(Para(f"{caption} Not drawn: {exc}", "note"))
            continue
        sec.blocks.append(Figure(svg, caption, fid))
    return drawing, sec


# ------------------------------------------------------------------------------------------
# Assembling


def _title(result: CheckResult) -> str:
    job = result.girder.job
    return f"Prestressed girder check — {job.title}"


def build(
    result: CheckResult,
    *,
    job_text: bytes,
    system: str | None = None,
    generated: _dt.datetime | None = None,
) -> tuple[str, list[Section], dict[str, str]]:
    """The report's title, its sections in order and its provenance (no file written).

    Args:
        result: the check.
        job_text: the bytes of the job file (hashed and reproduced in the appendix).
        system: "US" or "SI" (default: the job's output units).
        generated: the date and time to print (default: now, UTC).
    """
    system = system or result.girder.job.units
    job = result.girder.job
    when = (generated or _dt.datetime.now(_dt.UTC)).replace(microsecond=0)
    sha = hashlib.sha256(job_text).hexdigest()
    provenance = {
        "Software": f"prestress {__version__}",
        "Job file": job.file,
        "SHA-256 of the job file": sha,
        "Generated": when.isoformat(),
        "Output units": system,
        "Loss method": result.losses.method,
        "Limit set": job.limits.name,
    }
    drawing, plot_sec = _plots(result, system)
    overview = Section("overview", "Overview")
    overview.blocks.append(
        _kv(
            [
                ("Job", job.title),
                ("Project", job.project or "—"),
                ("Section", result.girder.section_name),
                (
                    "Verdict",
                    ("PASS" if result.ok else "FAIL (limits exceeded)")
                    + (
                        "; a pass presupposes: " + "; ".join(result.conditions)
                        if result.conditions
                        else ""
                    ),
                ),
                ("Software", provenance["Software"]),
                ("SHA-256 of the job file", sha),
                ("Generated", provenance["Generated"]),
            ]
        )
    )
    overview.blocks.append(
        Para(
            "Not checked by this tool: strength (flexure), shear, camber and deflection; the "
            "time-dependent losses of post-tensioned girders are entered by the engineer.",
            "note",
        )
    )
    notes = Section("notes", "Notes")
    all_notes = list(result.notes)
    if job.loads.live.model == "HL-93" and job.loads.live.distribution_source:
        all_notes.append(f"live-load distribution: {job.loads.live.distribution_source}")
    for n in all_notes or ["none"]:
        notes.blocks.append(Para(n, "note"))
    prov = Section("provenance", "Provenance")
    prov.blocks.append(_kv(list(provenance.items())))
    appendix = Section("job-file", "Appendix: the job file")
    appendix.blocks.append(Para(f"The job file as read ({len(job_text)} bytes; SHA-256 {sha})."))
    appendix.blocks.append(Pre(job_text.decode("utf-8", errors="replace")))
    sections = [
        overview,
        _inputs(result, system),
        _section(result, system, drawing),
        _losses(result, system),
        *([loads] if (loads := _loads(result, system)) is not None else []),
        _stresses(result, system),
        _governing(result, system),
        _zone(result, system),
        plot_sec,
        notes,
        prov,
        appendix,
    ]
    return _title(result), sections, provenance


# ------------------------------------------------------------------------------------------
# HTML


_CSS = """
@page { size: A4; margin: 14mm 12mm 16mm 12mm; }
html { background: #fff; }
body { font-family: "Helvetica Neue", Helvetica, Arial, "Liberation Sans", sans-serif;
  font-size: 10pt; line-height: 1.4; color: #111; max-width: 200mm; margin: 0 auto;
  padding: 8mm 6mm; }
h1 { font-size: 17pt; margin: 0 0 4pt 0; }
h2 { font-size: 13pt; border-bottom: 1.5pt solid #111; padding-bottom: 2pt;
  margin: 18pt 0 6pt 0; break-after: avoid; page-break-after: avoid; }
h3 { font-size: 11pt; margin: 12pt 0 4pt 0; break-after: avoid; page-break-after: avoid; }
p { margin: 3pt 0; }
p.formula { font-family: "DejaVu Sans Mono", Menlo, Consolas, monospace; font-size: 9pt;
  background: #f4f4f4; border-left: 2pt solid #888; padding: 2pt 6pt; }
p.subst { font-size: 9pt; color: #333; }
p.result { font-weight: bold; }
p.note { font-size: 9pt; color: #333; }
p.verdict-ok, p.verdict-fail { font-weight: bold; font-size: 11pt; padding: 4pt 6pt;
  border: 1.5pt solid #111; }
p.verdict-fail { border-color: #a00000; color: #a00000; }
.caution { border: 2pt solid #111; background: #fff4d6; padding: 6pt 8pt; margin: 8pt 0;
  font-weight: bold; }
table { border-collapse: collapse; margin: 4pt 0 8pt 0; font-size: 8.5pt; width: 100%; }
table.kv { width: auto; min-width: 60%; }
caption { caption-side: bottom; text-align: left; font-size: 8pt; color: #333;
  padding-top: 2pt; }
th, td { border: 0.5pt solid #999; padding: 1.5pt 4pt; vertical-align: top; }
th { background: #e8e8e8; text-align: left; font-weight: bold; }
td.key { color: #333; white-space: nowrap; }
td.num { text-align: right; white-space: nowrap; font-variant-numeric: tabular-nums; }
td.fail { color: #a00000; font-weight: bold; }
td.ok { color: #1b5e20; }
td.strong { font-weight: bold; }
table.wide { font-size: 7.5pt; }
thead { display: table-header-group; }
tr { break-inside: avoid; page-break-inside: avoid; }
figure { margin: 8pt 0; break-inside: avoid; page-break-inside: avoid; text-align: center; }
figure svg { max-width: 100%; height: auto; }
figcaption { font-size: 8.5pt; color: #333; text-align: left; }
pre { font-family: "DejaVu Sans Mono", Menlo, Consolas, monospace; font-size: 8pt;
  background: #f7f7f7; border: 0.5pt solid #bbb; padding: 6pt; white-space: pre-wrap;
  word-break: break-word; }
nav ol { columns: 2; font-size: 9pt; margin: 4pt 0; }
a { color: #123f7a; }
@media print { a { color: inherit; text-decoration: none; } body { padding: 0; } }
"""


def _e(text: str) -> str:
    return html.escape(text, quote=True)


_SVG_ID = re.compile(r'\bid="([^"]+)"')


def inline_svg(svg: str, prefix: str) -> str:
    """An SVG file's text made fit to sit inline in an HTML document.

    The XML declaration, the DOCTYPE and the metadata are dropped, and every id (with the
    references to it) is prefixed, so several figures cannot clash.
    """
    start = svg.find("<svg")
    if start < 0:
        raise ValueError("not an SVG document")
    body = svg[start:]
    body = re.sub(r"<metadata>.*?</metadata>\s*", "", body, flags=re.S)
    ids = set(_SVG_ID.findall(body))

    def repl(m: re.Match[str]) -> str:
        return m.group(1) + prefix + m.group(2) if m.group(2) in ids else m.group(0)

    return re.sub(r'(\bid="|url\(#|href="#)([^")]+)', repl, body).strip()


def _html_table(t: Table) -> str:
    cls = f' class="{_e(t.cls)}"' if t.cls else ""
    out = [f"<table{cls}>"]
    if t.caption:
        out.append(f"<caption>{_e(t.caption)}</caption>")
    if t.header:
        out.append("<thead><tr>" + "".join(f"<th>{_e(h)}</th>" for h in t.header) + "</tr></thead>")
    out.append("<tbody>")
    for row in t.rows:
        cells = []
        for c in row:
            ca = f' class="{_e(c.cls)}"' if c.cls else ""
            cells.append(f"<td{ca}>{_e(c.text)}</td>")
        out.append("<tr>" + "".join(cells) + "</tr>")
    out.append("</tbody></table>")
    return "\n".join(out)


def _html_block(b: object, n_fig: list[int]) -> str:
    if isinstance(b, Heading):
        ident = f' id="{_e(b.id)}"' if b.id else ""
        return f"<h{b.level}{ident}>{_e(b.text)}</h{b.level}>"
    if isinstance(b, Para):
        cls = f' class="{_e(b.cls)}"' if b.cls else ""
        return f"<p{cls}>{_e(b.text)}</p>"
    if isinstance(b, Table):
        return _html_table(b)
    if isinstance(b, Figure):
        n_fig[0] += 1
        svg = inline_svg(b.svg, f"f{n_fig[0]}-")
        return (
            f'<figure id="{_e(b.id)}">\n{svg}\n<figcaption>Figure {n_fig[0]}. '
            f"{_e(b.caption)}</figcaption>\n</figure>"
        )
    if isinstance(b, Pre):
        return f"<pre>{_e(b.text)}</pre>"
    raise TypeError(f"unknown block {type(b).__name__}")


def render_html(title: str, sections: Sequence[Section]) -> str:
    """The whole document as polyglot XHTML text."""
    n_fig = [0]
    caution = f'<p class="caution">{_e(CAUTION)}</p>'
    toc = "".join(f'<li><a href="#{_e(s.id)}">{_e(s.title)}</a></li>' for s in sections)
    parts = [
        "<!DOCTYPE html>",
        '<html xmlns="http://www.w3.org/1999/xhtml" lang="en">',
        "<head>",
        '<meta charset="utf-8"/>',
        '<meta name="viewport" content="width=device-width, initial-scale=1"/>',
        f'<meta name="generator" content="prestress {_e(__version__)}"/>',
        f"<title>{_e(title)}</title>",
        f"<style>{_CSS}</style>",
        "</head>",
        "<body>",
        "<header>",
        f"<h1>{_e(title)}</h1>",
        f'<div id="caution-top">{caution}</div>',
        f'<nav id="contents"><ol>{toc}</ol></nav>',
        "</header>",
        "<main>",
    ]
    for s in sections:
        parts.append(f'<section id="{_e(s.id)}">')
        parts.append(f"<h2>{_e(s.title)}</h2>")
        parts += [_html_block(b, n_fig) for b in s.blocks]
        parts.append("</section>")
    parts += ["</main>", f'<footer id="caution-end">{caution}</footer>', "</body>", "</html>"]
    return "\n".join(parts) + "\n"


# ------------------------------------------------------------------------------------------
# Markdown

_MD_SPECIAL = re.compile(r"([\\`*_\[\]|#])")


def _m(text: str) -> str:
    """Markdown-escape a user string (HTML specials as entities, Markdown specials escaped)."""
    return _MD_SPECIAL.sub(r"\\\1", html.escape(text, quote=False)).replace("\n", " ")


def _md_table(t: Table) -> str:
    width = len(t.header) if t.header else max((len(r) for r in t.rows), default=1)
    head = list(t.header) if t.header else [""] * width
    lines = ["| " + " | ".join(_m(h) for h in head) + " |"]
    aligns = []
    for i in range(width):
        num = any(i < len(r) and "num" in r[i].cls for r in t.rows)
        aligns.append("---:" if num else "---")
    lines.append("| " + " | ".join(aligns) + " |")
    for r in t.rows:
        cells = []
        for c in r:
            text = _m(c.text)
            cells.append(f"**{text}**" if "fail" in c.cls and text else text)
        lines.append("| " + " | ".join(cells) + " |")
    if t.caption:
        lines.append("")
        lines.append(f"*{_m(t.caption)}*")
    return "\n".join(lines)


def render_markdown(title: str, sections: Sequence[Section]) -> str:
    """The whole document as Markdown (plots as SVG data URIs)."""
    out = [f"# {_m(title)}", "", f"> **{_m(CAUTION)}**", ""]
    n_fig = 0
    for s in sections:
        out += [f'<a id="{_e(s.id)}"></a>', "", f"## {_m(s.title)}", ""]
        for b in s.blocks:
            if isinstance(b, Heading):
                out.append(f"{'#' * max(3, b.level)} {_m(b.text)}")
            elif isinstance(b, Para):
                text = _m(b.text)
                if b.cls == "formula":
                    text = "`" + b.text.replace("`", "'") + "`"
                elif b.cls.startswith("verdict") or b.cls == "result":
                    text = f"**{text}**"
                out.append(text)
            elif isinstance(b, Table):
                out.append(_md_table(b))
            elif isinstance(b, Figure):
                n_fig += 1
                data = base64.b64encode(b.svg.encode("utf-8")).decode("ascii")
                out.append(f"![Figure {n_fig}. {_m(b.caption)}](data:image/svg+xml;base64,{data})")
                out.append("")
                out.append(f"*Figure {n_fig}. {_m(b.caption)}*")
            elif isinstance(b, Pre):
                out.append("~~~~toml\n" + b.text.replace("~~~~", "~ ~ ~ ~") + "\n~~~~")
            out.append("")
    out += [f"> **{_m(CAUTION)}**", ""]
    return "\n".join(out)


# ------------------------------------------------------------------------------------------
# Writing


REPORT_SUFFIXES = (".html", ".htm", ".md")


def write_report(
    result: CheckResult,
    path: str | Path,
    *,
    job_text: bytes,
    system: str | None = None,
    force: bool = False,
    generated: _dt.datetime | None = None,
) -> Path:
    """Write the calculation report: HTML (``.html``/``.htm``) or Markdown (``.md``), atomically.

    Args:
        result: the check.
        path: the report file.
        job_text: the bytes of the job file (hashed with SHA-256 and reproduced).
        system: "US" or "SI" (default: the job's output units).
        force: replace an existing file.
        generated: the date and time to print (default: now, UTC).

    Returns:
        The path written.

    Raises:
        InputError: an unknown suffix, the path of the job file, or an existing file
            without ``force``.
    """
    from prestress.atomic import write_atomic

    target = Path(path)
    suffix = target.suffix.lower()
    if suffix not in REPORT_SUFFIXES:
        raise InputError(
            "a report file ending in .html, .htm or .md",
            file=str(target),
            got=f"'{target.suffix}'" if target.suffix else "no suffix",
        )
    job_file = result.girder.job.file
    if job_file and target.resolve() == Path(job_file).resolve():
        raise InputError(
            "an output path different from the job file",
            file=str(target),
            got="the path of the job file",
        )
    if target.exists() and not force:
        raise InputError(
            "a path that does not exist yet (or --force to replace it)",
            file=str(target),
            got="an existing file",
        )
    title, sections, _ = build(result, job_text=job_text, system=system, generated=generated)
    text = render_markdown(title, sections) if suffix == ".md" else render_html(title, sections)
    write_atomic(target, text)
    return target
