"""A reviewable calculation report of a check: one self-contained HTML (or Markdown) document.

The report holds everything a checking engineer needs to follow the calculation without the
tool: every input as the tool understood it (with units), the section properties with the
section drawn to scale, each loss with its formula, the values substituted and its clause,
the stress tables of every stage with limits and utilisation, the governing checks, the
permissible zone of the cgs, the plots, and its provenance (software version, date, and the
SHA-256 and text of every file the check read: the job file, the limit-set file and the
section library file). The safety caution stands at the top and at the end.

The HTML is polyglot XHTML (well formed as XML, served as HTML): CSS inside the file, plots
as inline SVG, no external resources and no JavaScript; it prints on A4 or Letter. Every
string that comes from the user is escaped. The Markdown variant (for a ``.md`` path) has
the same content, the plots written beside it as SVG files and linked (:func:`write_report`;
:func:`render_markdown` alone embeds them as SVG data URIs).

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
from typing import TYPE_CHECKING

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
    loads_caption,
    signed,
    stage_limits,
    use_text,
    value,
)

if TYPE_CHECKING:
    from prestress.losses.post_tensioned import TendonState
    from prestress.model import Tendon

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


def _coefficient(v: float) -> str:
    """A small coefficient as written by an engineer: 0.0002, else a × 10⁻ⁿ."""
    text = f"{v:.4g}"
    return _ratio(v) if "e" in text else text


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
    return use_text(abs(f.utilisation) if abs(f.utilisation) < 0.005 else f.utilisation)


def _figure_text(name: str, v: float, role: str, system: str) -> str:
    if role == "ratio":
        return f"{name} = {_ratio(v)}"
    return f"{name} = {_q(v, system, role)}"


# ------------------------------------------------------------------------------------------
# Inputs


_JACKED = {"left": "left end", "right": "right end", "both": "both ends"}


def _tendon_inputs(result: CheckResult, system: str) -> list:
    """The post-tensioned tendons as given: stressing, friction, set, duct, jack; profiles."""
    from prestress.units import out_unit

    job = result.girder.job
    su, du, au = label(system, "stress"), label(system, "dimension"), label(system, "area")
    pu = label(system, "position")
    per = out_unit(system, "position")
    rows = []
    for t in job.tendons:
        rows.append(
            (
                _c(t.name),
                _n(t.strands),
                _n(_f(t.area, system, "area")),
                _n(_f(t.jacking_stress, system, "stress", 1)),
                _c(_JACKED.get(t.jacking, t.jacking)),
                _n(f"{t.mu:g}"),
                _n(_coefficient(t.K * per.factor)),
                _n(_f(t.anchor_set, system, "dimension")),
                _n(_f(t.duct_diameter, system, "dimension", 2)),
                _n(_f(t.jack_length, system, "dimension", 2)),
            )
        )
    blocks: list = [
        Table(
            (
                "Tendon",
                "Strands",
                f"Aps ({au})",
                f"Jacking stress fpj ({su})",
                "Jacked at",
                "μ (per rad)",
                f"Wobble K (per {pu})",
                f"Anchor set ({du})",
                f"Duct diameter, outside ({du})",
                f"Jack length ({du})",
            ),
            tuple(rows),
            "Post-tensioned tendons as given, each of the strand type above, jacked at its own "
            "stress fpj (the [strand] jacking stress of the job file does not apply to them); "
            "μ: curvature friction coefficient; K: wobble coefficient per length of tendon; "
            "jack length: free strand from the anchorage to the jack's grip (in the jack "
            "elongation).",
            "wide",
        )
    ]
    prof_rows = []
    for t in job.tendons:
        prof = t.profile()
        points = "; ".join(
            f"({_f(x, system, 'position', 2)}, {_f(y, system, 'dimension', 2)})"
            for x, y in zip(t.x, t.y, strict=True)
        )
        infl = "—"
        if isinstance(prof.inflection_fraction, tuple) and prof.inflection_fraction:
            infl = ", ".join(f"{v:g}" for v in prof.inflection_fraction)
        prof_rows.append(
            (
                _c(t.name),
                _c(points),
                _n(infl),
                _n(_f(prof.tendon_length_mm, system, "position", 2)),
                _n(f"{prof.total_angular_change_rad:.4f}"),
            )
        )
    blocks.append(
        Table(
            (
                "Tendon",
                f"Control points (x {pu} from the left end, height {du} above the bottom)",
                "Inflection fraction",
                f"Length along the tendon ({pu})",
                "Total angle change α (rad)",
            ),
            tuple(prof_rows),
            "Tendon profiles: parabolas through the control points (anchorages at the first "
            "and last; a horizontal tangent at every interior point; reverse curves between "
            "interior points inflect at the given fraction of their distance from the high "
            "point). Length and angle change from anchorage to anchorage along that profile.",
        )
    )
    return blocks


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
    if not job.post_tensioned:  # the tendons are anchored: no transfer length
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
    strand_rows = [
        ("Diameter", _q(st.diameter, system, "dimension")),
        ("Area of one strand", _q(st.area, system, "area")),
        ("fpu", _q(st.fpu, system, "stress")),
        ("fpy", _q(st.fpy, system, "stress")),
        ("Ep", _q(st.Ep, system, "modulus_e")),
        ("Relaxation class", st.relaxation),
    ]
    if job.post_tensioned:
        strand_rows += [
            (
                "Strands in the tendons",
                f"{sum(t.strands for t in job.tendons)} in {len(job.tendons)} tendon(s)",
            ),
            ("Total area Aps", _q(job.A_ps, system, "area")),
            (
                "Tendon centroid at midlength (above bottom)",
                _q(job.y_ps, system, "dimension"),
            ),
        ]
    else:
        strand_rows += [
            ("Jacking stress fpj", _q(st.jacking_stress, system, "stress")),
            ("Stress before transfer fpbt", _q(st.stress_before_transfer, system, "stress")),
            ("Number of strands", str(job.strand_count)),
            ("Total area Aps", _q(job.A_ps, system, "area")),
            ("Strand centroid at midlength (above bottom)", _q(job.y_ps, system, "dimension")),
        ]
    b.append(_kv(strand_rows))
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
    if job.tendons:
        b.append(Heading(3, "Tendons", "inputs-tendons"))
        b += _tendon_inputs(result, system)
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
    titles = {st.key: st.title for st in result.stages}
    combos = [
        (titles.get(k, k.replace("_", " ")), f"dead × {c.dead:g}, live × {c.live:g}")
        for k, c in job.combinations.items()
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
        ("Tendon" if g.job.post_tensioned else "Strand") + " eccentricity at midlength",
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
                "The girder section to scale with its "
                + (
                    "tendons at midlength (each tendon's strands drawn at its duct's centre, "
                    "the ducts on the girder axis)"
                    if g.job.post_tensioned
                    else "strands at midlength"
                )
                + " and the deck (principal dimensions; the centroid marked).",
                "fig-section",
            )
        )
    return sec


# ------------------------------------------------------------------------------------------
# Losses and their formulas


class _Desc(str):
    """A line of words about a formula (shown as text, not as a formula)."""


_ES_CLOSED = "ΔfpES = [Aps fpbt (Ig + em² Ag) − em Mg Ag] / [Aps (Ig + em² Ag) + Ag Ig Eci / Ep]"


def _midlength_end(t: Tendon, xm: float) -> str:
    """The anchorage whose jack governs the stress at xm.

    The jacked end; for a tendon jacked at both ends, the one giving the smaller friction
    loss there.
    """
    if t.jacking in ("left", "right"):
        return t.jacking
    prof = t.profile()
    loss = {
        end: t.K * float(prof.length_along(xm, end)) + t.mu * float(prof.angular_change(xm, end))
        for end in ("left", "right")
    }
    return min(loss, key=lambda end: loss[end])


def _pt_friction(result: CheckResult, system: str) -> list[str]:
    """Eq. 5.9.3.2.2b-1 at the girder's midlength, with the values of every tendon."""
    import math

    from prestress.units import out_unit

    job = result.girder.job
    xm = job.length / 2.0
    per = out_unit(system, "position")
    pu = label(system, "position")
    lines: list[str] = [
        "ΔfpF = fpj (1 − e^−(Kx + μα))   (Eq. 5.9.3.2.2b-1)",
        _Desc(
            f"at the girder's midlength (x = {_q(xm, system, 'position')} from the left end), "
            "per tendon: x the length along the tendon from the jacking end, α the sum of the "
            "absolute changes of the tendon's angle over that length (parabolic profile, exact "
            "arc length and angles); the girder's loss is the tendons' area-weighted mean"
        ),
    ]
    total_a, total = 0.0, 0.0
    for t in job.tendons:
        prof = t.profile()
        if not prof.x_start_mm <= xm <= prof.x_end_mm:
            lines.append(_Desc(f"{t.name}: does not reach midlength"))
            continue
        end = _midlength_end(t, xm)
        x = float(prof.length_along(xm, end))
        alpha = float(prof.angular_change(xm, end))
        exponent = t.K * x + t.mu * alpha
        loss = t.jacking_stress * (1.0 - math.exp(-exponent))
        total_a += t.area
        total += t.area * loss
        lines.append(
            _Desc(
                f"{t.name} ("
                + (
                    f"jacked at both ends; midlength taken from the {end} jack"
                    if t.jacking == "both"
                    else f"jacked from the {end} end"
                )
                + "): fpj = "
                f"{_q(t.jacking_stress, system, 'stress')}, "
                f"K = {_coefficient(t.K * per.factor)} per {pu}, "
                f"x = {_q(x, system, 'position')}, μ = {t.mu:g}, α = {alpha:.4f} rad; "
                f"Kx + μα = {exponent:.5f}; ΔfpF = {_q(loss, system, 'stress', 2)}"
            )
        )
    if len(job.tendons) > 1 and total_a > 0:
        lines.append(
            _Desc(
                "area-weighted mean: ΔfpF = Σ Aps,i ΔfpF,i / Σ Aps,i = "
                f"{_q(total / total_a, system, 'stress', 2)}"
            )
        )
    return lines


def _pt_anchor_set(
    result: CheckResult, system: str, states: list[TendonState] | None = None
) -> list[str]:
    """The anchor set by the area method: per tendon the affected length and the losses."""
    import numpy as np

    from prestress.losses.post_tensioned import tendon_states

    g = result.girder
    job = g.job
    xm = job.length / 2.0
    states = tendon_states(g) if states is None else states
    pu = label(system, "position")
    lines: list[str] = [
        "Δset = (2/Ep) ∫ [fpx(s) − fpx(xset)] ds over the affected length, s along the tendon "
        "(area method)",
        _Desc(
            "by the area method on the friction curve (no closed-form expression for a "
            "parabolic profile): the stress after set is the mirror image of the friction "
            "curve about its value at the end xset of the affected length, and xset is found "
            "so that the strand shortening over that length equals the anchor set Δset; where "
            "the set is not absorbed before the far end (or the neutral point), the whole "
            "mirror image is lowered by a uniform amount; "
            f"Ep = {_q(job.strand.Ep, system, 'modulus_e')}"
        ),
    ]
    for s in states:
        t = s.tendon
        at_mid = float(np.interp(xm, s.x, s.after_friction - s.after_set))
        zones = []
        for z in s.set_zones:
            side = "left" if z.x_anchor_mm <= float(s.x[0]) else "right"
            length = abs(z.x_set_mm - z.x_anchor_mm)
            text = (
                f"from the {side} anchorage: affected length {_f(length, system, 'position', 2)}"
                f" {pu}, loss at the anchorage {_q(z.loss_at_anchor_MPa, system, 'stress', 2)}"
            )
            if z.reaches_limit:
                where = "the neutral point" if s.neutral_point is not None else "the far end"
                text += (
                    f" (the set reaches {where}; loss there "
                    f"{_q(z.loss_at_x_set_MPa, system, 'stress', 2)})"
                )
            zones.append(text)
        body = "; ".join(zones) if zones and t.anchor_set > 0 else "no anchor set"
        lines.append(
            _Desc(
                f"{t.name}: Δset = {_q(t.anchor_set, system, 'dimension')}; {body}; loss at "
                f"midlength {_q(at_mid, system, 'stress', 2)}"
            )
        )
    if len(states) > 1:
        lines.append(_Desc("the girder's loss at midlength is the tendons' area-weighted mean"))
    return lines


def _given_long_term(comp: LossComponent, result: CheckResult, system: str) -> list[str]:
    """Time-dependent losses entered by the engineer: which job-file values they are."""
    job = result.girder.job
    given = job.long_term_given
    if given is None:
        return [_Desc("given by the engineer in the job file (not computed by the tool)")]
    final, to_deck = given
    start = "stressing" if job.post_tensioned else "transfer"
    if comp.key == "long_term_after_deck" and to_deck is not None:
        text = (
            "given by the engineer, not computed by the tool: from deck placement to the final "
            f"age, [losses] long_term − long_term_to_deck = {_q(final, system, 'stress', 2)} − "
            f"{_q(to_deck, system, 'stress', 2)}"
        )
    elif comp.period == "transfer to deck placement" and to_deck is not None:
        text = (
            f"given by the engineer, not computed by the tool: from {start} to deck placement, "
            f"[losses] long_term_to_deck = {_q(to_deck, system, 'stress', 2)}"
        )
    else:
        text = (
            f"given by the engineer, not computed by the tool: from {start} to the final age, "
            f"[losses] long_term = {_q(final, system, 'stress', 2)}"
        )
    return [_Desc(text)]


def _loss_formula(
    comp: LossComponent,
    result: CheckResult,
    system: str,
    states: list[TendonState] | None = None,
) -> tuple[list[str], list[str]]:
    """The formula lines of a loss component and the values substituted in it.

    ``states``: the tendons' stresses after friction and anchor set of a post-tensioned job
    (:func:`prestress.losses.post_tensioned.tendon_states`), computed here when not given.
    """
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
    if job.post_tensioned and key == "friction" and "5.9.3.2.2b-1" in comp.clause:
        return _pt_friction(result, system), []
    if job.post_tensioned and key == "anchor_set":
        return _pt_anchor_set(result, system, states), []
    if key == "elastic_shortening" and "5.9.3.2.3b-1" in comp.clause:
        return (
            [
                "ΔfpES = (N − 1)/(2N) (Ep/Eci) fcgp   (Eq. 5.9.3.2.3b-1)",
                _Desc(
                    "N tendons stressed one after another; fcgp: the concrete stress at the "
                    "tendons' centroid at midlength from the tendon forces after friction and "
                    "anchor set and the girder's self-weight, on the section at stressing "
                    "(compression positive; 5.9.3.2.3a)"
                ),
            ],
            vals(
                f"N = {len(job.tendons)}",
                f"Ep = {Ep}",
                f"Eci = {_q(job.girder_concrete.Eci, system, 'modulus_e')}",
                f("fcgp (midlength)", "fcgp"),
            ),
        )
    if comp.clause == "given in the job" and key in ("long_term", "long_term_after_deck"):
        return _given_long_term(comp, result, system), []
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
    states = None
    if result.girder.job.post_tensioned:
        from prestress.losses.post_tensioned import tendon_states

        states = tendon_states(result.girder)
        blocks.append(
            Para(
                "The tendons' stresses vary along the girder (friction and anchor set): the "
                "losses at transfer below are those at the girder's midlength, as the "
                "tendons' area-weighted mean, and fpj is their area-weighted jacking stress; "
                "the stage tables use each tendon's stress at each station."
            )
        )
    for i, comp in enumerate(b.components, 1):
        blocks.append(Heading(3, f"{i}. {comp.label} ({comp.period})", f"loss-{i}-{comp.key}"))
        lines, subs = _loss_formula(comp, result, system, states)
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
    if states is not None:
        blocks += _tendon_limits(result, system, states)
    for n in b.notes:
        blocks.append(Para(f"Note: {n}", "note"))
    return sec


_LIMIT_ROWS = {
    "prior_to_seating": "jacking, prior to seating",
    "anchorage_after_set": "at an anchorage, after set",
    "elsewhere_after_set": "away from the anchorages, after set",
    "service": "service, after all losses",
}


def _tendon_limits(result: CheckResult, system: str, states: list[TendonState]) -> list:
    """The tendon stresses against AASHTO LRFD 9th Ed. (2020) Table 5.9.2.2-1, one row each."""
    from prestress.losses.post_tensioned import LIMITS_SOURCE, tendon_limit_checks

    su, pu = label(system, "stress"), label(system, "position")
    rows = []
    for c in tendon_limit_checks(result.girder, states):
        cls = "ok" if c.ok else "fail"
        rows.append(
            (
                _c(c.tendon),
                _c(_LIMIT_ROWS.get(c.key, c.condition)),
                _c(c.where),
                _n(_f(c.x, system, "position", 2)),
                _n(_f(c.stress, system, "stress", 1)),
                _n(f"{c.limit_text} = {_f(c.limit, system, 'stress', 1)}"),
                Cell(f"{c.ratio:.2f}", f"num {cls}"),
                _c("ok" if c.ok else "EXCEEDED", cls),
            )
        )
    return [
        Heading(3, "Tendon stress limits", "losses-tendon-limits"),
        Table(
            (
                "Tendon",
                "Condition",
                "Where",
                f"x ({pu})",
                f"Stress ({su})",
                f"Limit ({su})",
                "Ratio",
                "Check",
            ),
            tuple(rows),
            f"{LIMITS_SOURCE}. x from the left end. After set: immediately after anchor set; "
            "after all losses: after anchor set, elastic shortening and the final "
            "time-dependent losses given in the job.",
        ),
    ]


# ------------------------------------------------------------------------------------------
# Stage tables, governing checks, zone


_SHORT_FIBER = {"girder_bottom": "bottom", "girder_top": "top", "deck_top": "deck"}
_MOMENTS = ("girder", "deck", "diaphragms", "superimposed", "live")


def _stage_blocks(stage: StageResult, number: int, system: str, *, no_deck: bool = False) -> list:
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
    head += [
        f"M {'other non-composite' if k == 'deck' and no_deck else k} ({mu})" for k in loads
    ] + [f"M total ({mu})"]
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
    lim = [
        f"{FIBER_NAMES[f]}: {text}" for f, text in stage_limits(stage, fibers, system, unit=True)
    ]
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
    titles = dict(LOAD_TITLES)
    if result.girder.job.deck is None:
        titles["deck"] = "Other non-composite"
    head = ["Station", f"x from bearing ({pu})", *[f"{titles[k]} ({mu})" for k in keys]]
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
            f"the section is pushed up). {loads_caption(result)}",
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
        sec.blocks += _stage_blocks(stage, i, system, no_deck=result.girder.job.deck is None)
    return sec


def _governing(result: CheckResult, system: str) -> Section:
    sec = Section("governing", "Governing checks")
    su = label(system, "stress")
    rows = []
    best_all = None
    for i, s in enumerate(result.stages, 1):
        for fiber in ("girder_bottom", "girder_top", "deck_top"):
            best = s.governing_at(fiber)
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
            # the limit of the stress's sign; where none, the only one given (a compressed
            # fiber under a tension-only limit: use 0, and the limit it is kept from)
            same, other = (
                (fr.compression_limit, fr.tension_limit)
                if fr.stress < 0
                else (fr.tension_limit, fr.compression_limit)
            )
            limit = same if same is not None else other
            cls = "ok" if fr.ok else "fail"
            rows.append(
                (
                    _c(f"{i}. {s.title}"),
                    _c(FIBER_NAMES[fiber]),
                    _c(st.name),
                    _n(signed(fr.stress, system, "stress")),
                    _n(_s(limit, system)),
                    Cell(use_text(u), f"num {cls}"),
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
        text = f"{verdict}: limits exceeded in {', '.join(result.failures())}."
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
            "The station of the highest utilisation for each stage and fiber (among equal "
            "ones, the nearest to its limit). Use: stress / limit of the same sign; 0.00 for a "
            "fiber in compression where only a tension limit applies (that limit is shown).",
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
            "(negative: outside). NO BAND: the lowest permissible height lies above the "
            "highest, so no cgs height satisfies every stage there: the prestress force (or the "
            "loads or limits) must change, not only the cgs."
        )
    )
    rows = []
    for z in result.zone:
        if z.low is None and z.high is None:
            mark, who, cls = "—", "no prestress developed", ""
        else:
            mark, cls = (
                ("NO BAND", "fail")
                if z.empty
                else (("inside", "ok") if z.inside else ("OUTSIDE", "fail"))
            )
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
    pt = result.girder.job.post_tensioned
    items = [
        (
            "fig-stresses",
            f"Fiber stresses along the girder for every stage, with the limits; {SIGN_CONVENTION}.",
            plots.plot_stresses,
        ),
        (
            "fig-zone",
            "Permissible zone of the cgs along the girder, with the cgs"
            + (" and the tendon profiles." if pt else ", hold-downs and debond ends."),
            plots.plot_zone,
        ),
        (
            "fig-losses",
            ("Tendon stress at midlength" if pt else "Strand stress")
            + " against the age of the girder (log scale) at the milestones of the loss method.",
            plots.plot_losses,
        ),
        (
            "fig-magnel",
            "Magnel diagram at midspan: the stress inequalities at "
            + ("stressing" if pt else "release")
            + " and in final service in the (e, 1/Pi) plane, the feasible region shaded and "
            "the design point marked.",
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
# Provenance: the files the check read


@dataclass(frozen=True)
class InputFile:
    """A file the check read besides the job file, for the provenance and the appendices.

    Attributes:
        role: what it is, e.g. "limit-set file".
        description: where it comes from, in words.
        path: the file, or None when the data sit in the job file or the file is not known.
        data: its bytes as read now (None without a file).
    """

    role: str
    description: str
    path: Path | None = None
    data: bytes | None = None

    @property
    def sha256(self) -> str:
        """SHA-256 of the bytes ('' without a file)."""
        return hashlib.sha256(self.data).hexdigest() if self.data is not None else ""


def _read(role: str, description: str, path: Path) -> InputFile:
    try:
        return InputFile(role, description, path, path.read_bytes())
    except OSError as exc:
        return InputFile(role, f"{description}; the file could not be read ({exc.strerror})")


def limits_file(result: CheckResult) -> InputFile:
    """The limit-set file of the job, found as the job reader finds it (``inputs.limits_path``).

    ``[limits] set = "name"``: the shipped ``examples/limits/<name>.toml``; ``[limits] file``:
    that path, relative to the job file's folder; otherwise the limits are inline in the job
    file.
    """
    from prestress.inputs import limits_path

    role = "limit-set file"
    try:
        path, how = limits_path(result.girder.job)
    except InputError:
        return InputFile(role, "not known (the job file could not be read again)")
    if path is None:
        return InputFile(role, "given inline in the job file ([limits])")
    if how == "file":
        return _read(role, "[limits] file of the job", path)
    return _read(role, f"shipped limit {how} ([limits] set)", path)


def section_file(result: CheckResult) -> InputFile:
    """Where the girder's section definition was read: the job file or a library file.

    A library section is looked up again in the job's library folders, the folders of
    ``PRESTRESS_SECTIONS`` and the shipped library; the entry found is taken as the one used
    only when its outline is the girder's (a folder given with ``--library`` is not known
    here, so a shape found only there is reported as such).
    """
    from prestress.sections.library import load_library, search_folders
    from prestress.sections.properties import resolve_definition

    g = result.girder
    job = g.job
    role = "section library file"
    if job.section.family is not None:
        return InputFile(role, "defined in the job file ([girder.section])")
    try:
        lib = load_library(search_folders(job.library_paths))
        entry = lib.entries.get(job.section.name.lower())
        same = entry is not None and (
            resolve_definition(
                entry.family, entry.dimensions, file=entry.file, field=entry.field
            ).exterior
            == g.outline.exterior
        )
    except InputError:
        entry, same = None, False
    if entry is None or not same:
        return InputFile(
            role,
            "not found again in the job's library folders, PRESTRESS_SECTIONS or the shipped "
            "library (a folder given with --library?)",
        )
    where = "shipped library" if entry.shipped else "user library"
    return _read(role, f"{where}, entry {entry.field} '{entry.name}'", Path(entry.file))


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
    lim_file, sec_file = limits_file(result), section_file(result)
    provenance = {
        "Software": f"prestress {__version__}",
        "Job file": job.file,
        "SHA-256 of the job file": sha,
        "Generated": when.isoformat(),
        "Output units": system,
        "Loss method": result.losses.method,
        "Limit set": f"{job.limits.name} — {job.limits.source}",
        "Limit-set file": str(lim_file.path) if lim_file.path else lim_file.description,
    }
    if lim_file.path is not None:
        provenance["Limit set read from"] = lim_file.description
        provenance["SHA-256 of the limit-set file"] = lim_file.sha256
    g = result.girder
    from prestress.sections.families import FAMILIES

    family = FAMILIES[g.family].title if g.family in FAMILIES else "family not recorded"
    provenance["Section"] = f"{g.section_name} ({family}) — {g.section_source or 'no source given'}"
    provenance["Section definition"] = sec_file.description
    if sec_file.path is not None:
        provenance["Section library file"] = str(sec_file.path)
        provenance["SHA-256 of the section library file"] = sec_file.sha256
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
    appendices = [appendix]
    for ident, title, f in (
        ("limits-file", "Appendix: the limit-set file", lim_file),
        ("section-file", "Appendix: the section library file", sec_file),
    ):
        if f.path is None or f.data is None:
            continue
        extra = Section(ident, title)
        extra.blocks.append(
            Para(
                f"The {f.role} {f.path} ({f.description}) as read when the report was written "
                f"({len(f.data)} bytes; SHA-256 {f.sha256})."
            )
        )
        extra.blocks.append(Pre(f.data.decode("utf-8", errors="replace")))
        appendices.append(extra)
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
        *appendices,
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


def figures_of(sections: Sequence[Section]) -> list[Figure]:
    """The figures of the document, in the order they are numbered."""
    return [b for s in sections for b in s.blocks if isinstance(b, Figure)]


def render_markdown(
    title: str, sections: Sequence[Section], figure_files: Sequence[str] | None = None
) -> str:
    """The whole document as Markdown.

    Args:
        title: the document's title.
        sections: its sections.
        figure_files: the names of the SVG files holding the figures, in order (relative to
            the Markdown file; see :func:`write_report`); None embeds them as SVG data URIs.
    """
    from urllib.parse import quote

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
                if figure_files is not None:
                    link = quote(figure_files[n_fig - 1])
                else:
                    data = base64.b64encode(b.svg.encode("utf-8")).decode("ascii")
                    link = f"data:image/svg+xml;base64,{data}"
                out.append(f"![Figure {n_fig}. {_m(b.caption)}]({link})")
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

    A Markdown report ``NAME.md`` links its figures, written beside it as ``NAME-figure-1.svg``,
    ``NAME-figure-2.svg``, … (each atomically; many Markdown viewers do not show images
    embedded as data URIs). Every output path is checked before anything is written: none
    may be an input file, nor exist without ``force``.

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
        InputError: an unknown suffix, the path of an input file, or an existing file
            (the report or a figure file) without ``force``.
    """
    from prestress.atomic import check_output_path, write_atomic

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
    if suffix != ".md":
        write_atomic(target, render_html(title, sections))
        return target
    figures = figures_of(sections)
    names = [f"{target.stem}-figure-{i}.svg" for i in range(1, len(figures) + 1)]
    inputs = [Path(job_file)] if job_file else []
    inputs += [f.path for f in (limits_file(result), section_file(result)) if f.path is not None]
    for name in names:  # refuse before writing anything
        check_output_path(target.parent / name, inputs=inputs, force=force)
    for name, fig in zip(names, figures, strict=True):
        write_atomic(target.parent / name, fig.svg)
    write_atomic(target, render_markdown(title, sections, names))
    return target
