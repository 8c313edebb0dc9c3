"""Console presentation of a check with rich: header, properties, losses, one table per stage.

Every stress table's caption states the unit and the sign convention.
"""

from __future__ import annotations

from rich import box
from rich.console import Console, Group
from rich.markup import escape
from rich.panel import Panel
from rich.table import Table
from rich.text import Text

from prestress.analysis import SIGN_CONVENTION, CheckResult, FiberResult, StageResult
from prestress.present.common import (
    CAUTION,
    FIBER_NAMES,
    LOAD_TITLES,
    fmt,
    label,
    live_load_text,
    loads_caption,
    loads_title,
    signed,
    stage_limits,
    station_matches,
    use_text,
)

PASS = "[green]ok[/]"
FAIL = "[bold red]FAIL[/]"


def _kv_table(rows: list[tuple[str, str]], title: str) -> Table:
    t = Table(
        box=None,
        show_header=False,
        title=title,
        title_justify="left",
        title_style="bold",
        pad_edge=False,
    )
    t.add_column(style="dim", no_wrap=True)
    t.add_column(overflow="fold")  # a long file path folds rather than being cut
    for k, v in rows:
        t.add_row(k, v)
    return t


def header(result: CheckResult, system: str) -> Panel:
    """Job, girder, section and materials."""
    g = result.girder
    job = g.job
    gc = job.girder_concrete
    st = job.strand
    u = lambda role: label(system, role)  # noqa: E731
    rows = [
        ("Job", job.title),
        ("Project", job.project or "—"),
        ("Owner", job.owner or "—"),
        ("Engineer", job.engineer or "—"),
        ("Job file", job.file),
        ("Section", f"{g.section_name}  ({g.section_source or 'no source given'})"),
        (
            "Girder",
            f"length {fmt(job.length, system, 'position')} {u('position')}, "
            f"design span {fmt(job.span, system, 'position')} {u('position')}",
        ),
        (
            "Girder concrete",
            f"f'ci {fmt(gc.fci, system, 'stress')} {u('stress')}, "
            f"f'c {fmt(gc.fc, system, 'stress')} {u('stress')}, "
            f"Eci {fmt(gc.Eci, system, 'modulus_e')} {u('modulus_e')}, "
            f"Ec {fmt(gc.Ec, system, 'modulus_e')} {u('modulus_e')} "
            f"({gc.modulus_source})",
        ),
    ]
    if job.deck is not None:
        dc = job.deck.concrete
        rows.append(
            (
                "Deck concrete",
                f"f'c {fmt(dc.fc, system, 'stress')} {u('stress')}, "
                f"Ec {fmt(dc.Ec, system, 'modulus_e')} {u('modulus_e')}, "
                f"modular ratio n = {g.n_deck:.3f}",
            )
        )
    if job.post_tensioned:
        rows += [
            (
                "Tendons",
                ", ".join(
                    f"{t.name}: {t.strands} × {fmt(st.diameter, system, 'dimension')} "
                    f"{u('dimension')}, fpj {fmt(t.jacking_stress, system, 'stress')} "
                    f"{u('stress')}, jacked {t.jacking}, μ {t.mu:g}"
                    for t in job.tendons
                )
                + f"; Aps {fmt(job.A_ps, system, 'area')} {u('area')}",
            ),
            (
                "Tendon centroid",
                f"{fmt(job.y_ps, system, 'dimension')} {u('dimension')} above the bottom at "
                f"midlength; e = {fmt(g.eccentricity_gross, system, 'dimension')} "
                f"{u('dimension')} below the girder centroid",
            ),
        ]
    else:
        rows += [
            (
                "Strands",
                f"{job.strand_count} × {fmt(st.diameter, system, 'dimension')} {u('dimension')}"
                f" ({st.relaxation}-relaxation), Aps {fmt(job.A_ps, system, 'area')} "
                f"{u('area')}, fpu {fmt(st.fpu, system, 'stress')} {u('stress')}, "
                f"fpj {fmt(st.jacking_stress, system, 'stress')} {u('stress')}, "
                f"Ep {fmt(st.Ep, system, 'modulus_e')} {u('modulus_e')}",
            ),
            (
                "Strand centroid",
                f"{fmt(job.y_ps, system, 'dimension')} {u('dimension')} above the "
                f"bottom at midlength; e = {fmt(g.eccentricity_gross, system, 'dimension')} "
                f"{u('dimension')} below the girder centroid",
            ),
            (
                "Transfer length",
                f"{fmt(job.transfer_length, system, 'dimension')} {u('dimension')} "
                f"({job.transfer_length_source})",
            ),
        ]
    rows += [
        ("Limits", f"{job.limits.name} — {job.limits.source}"),
    ]
    return Panel(
        _kv_table(rows, ""), title="[bold]prestress check[/]", title_align="left", box=box.ROUNDED
    )


def properties(result: CheckResult, system: str) -> Table:
    """Gross girder and composite section properties."""
    g = result.girder
    gross = g.gross
    c = g.composite_section
    t = Table(
        title="Section properties",
        title_justify="left",
        title_style="bold",
        box=box.SIMPLE_HEAD,
        collapse_padding=True,
        caption="Composite: deck transformed into girder concrete by n; "
        "V/S with every outer face exposed."
        if c is not None
        else "No deck: every load on the girder alone. V/S with every outer face exposed.",
        caption_justify="left",
    )
    t.add_column("Property")
    t.add_column("Girder (gross)", justify="right", no_wrap=True)
    if c is not None:
        t.add_column("Composite", justify="right", no_wrap=True)
    t.add_column("Unit")

    def row(name: str, a: float | None, b: float | None, role: str) -> None:
        cells = [name, fmt(a, system, role)]
        if c is not None:
            cells.append(fmt(b, system, role))
        t.add_row(*cells, label(system, role))

    row("Area A", gross.area, c.area if c else None, "area")
    row("Centroid above girder bottom yb", gross.yb, c.yb if c else None, "dimension")
    row("Moment of inertia I", gross.Ix, c.I if c else None, "inertia")
    row(
        "Section modulus, girder bottom Sb",
        gross.Sb,
        c.S("girder_bottom") if c else None,
        "modulus",
    )
    row("Section modulus, girder top St", gross.St, c.S("girder_top") if c else None, "modulus")
    if c is not None:
        row("Section modulus, deck top", None, c.S("deck_top"), "modulus")
    row("Depth", gross.height, c.fibers["deck_top"] if c else None, "dimension")
    row("Volume-to-surface V/S", gross.volume_to_surface, None, "dimension")
    row("Girder self-weight", g.self_weight, None, "line_load")
    row(
        "Non-composite dead load (deck, haunch)" if c is not None else "Other non-composite load",
        g.deck_weight,
        None,
        "line_load",
    )
    return t


def losses(result: CheckResult, system: str) -> Table:
    """The loss breakdown of the job's method."""
    L = result.losses
    A = result.girder.job.A_ps
    su = label(system, "stress")
    t = Table(
        title=f"Prestress losses — {L.method}",
        title_justify="left",
        title_style="bold",
        box=box.SIMPLE_HEAD,
        collapse_padding=True,
        caption=f"Losses positive, gains negative. {L.title}",
        caption_justify="left",
    )
    t.add_column("Mechanism")
    t.add_column("When")
    t.add_column(f"Loss ({su})", justify="right", no_wrap=True)
    t.add_column("% of fpj", justify="right", no_wrap=True)
    t.add_column("Source")
    for comp in L.components:
        mark = "" if comp.applied else " (reported, not applied)"
        t.add_row(
            comp.label + mark,
            comp.period,
            fmt(comp.value, system, "stress", 2),
            f"{100 * comp.value / L.jacking_stress:.1f}".replace("-", "−"),
            comp.short_clause,
        )
    t.add_section()
    t.add_row(
        "[bold]Total[/]",
        "",
        f"[bold]{fmt(L.total, system, 'stress', 2)}[/]",
        f"[bold]{100 * L.total / L.jacking_stress:.1f}[/]",
        "",
    )
    fu = label(system, "force")
    t.add_row(
        "Jacking stress fpj",
        "",
        fmt(L.jacking_stress, system, "stress", 2),
        "100.0",
        f"force {fmt(L.jacking_stress * A, system, 'force', 1)} {fu}",
    )
    t.add_row(
        "Stress after transfer fpt",
        "",
        fmt(L.f_pt, system, "stress", 2),
        f"{100 * L.f_pt / L.jacking_stress:.1f}",
        f"force {fmt(L.f_pt * A, system, 'force', 1)} {fu}",
    )
    t.add_row(
        "Effective stress fpe",
        "final",
        fmt(L.f_pe, system, "stress", 2),
        f"{100 * L.f_pe / L.jacking_stress:.1f}",
        f"force {fmt(L.f_pe * A, system, 'force', 1)} {fu}",
    )
    if abs(L.applied_final - L.f_pe) > 1e-6 * L.jacking_stress:
        # transformed sections: the stages apply the force before elastic shortening and
        # gains, which the section analysis itself gives (AASHTO LRFD 5.9.3.2.3a, C5.9.3.1)
        t.add_row(
            "Applied to the transformed section",
            "final",
            fmt(L.applied_final, system, "stress", 2),
            f"{100 * L.applied_final / L.jacking_stress:.1f}",
            f"P {fmt(L.applied_final * A, system, 'force', 1)} {fu} in the stage tables: "
            "elastic shortening and gains come from the section",
        )
    return t


#: Short column titles of the loads table (the caption explains them).
LOAD_SHORT = {
    "girder": "Girder",
    "deck": "Deck",
    "diaphragms": "Diaphr.",
    "barriers": "DC",
    "wearing_surface": "DW",
    "live": "LL+IM",
}


def loads_table(
    result: CheckResult, system: str, stations: tuple[str, ...] | None = None
) -> Group | None:
    """Unfactored moments by load and the live-load shear per girder at the span's stations."""
    le = result.loads
    if le is None:
        return None
    keys = [k for k in LOAD_TITLES if k in le.moments and le.moments[k].any()]
    mu, fu = label(system, "moment"), label(system, "force")
    shear = (
        f" V: {fu}, + where the girder left of the section is pushed up."
        if le.shear_live is not None
        else ""
    )
    t = Table(
        title=loads_title(result),
        title_justify="left",
        title_style="bold",
        box=box.SIMPLE_HEAD,
        collapse_padding=True,
        caption=(
            f"x: {label(system, 'position')} from the left bearing. Moments: {mu}, sagging +."
            f"{shear} "
            + (
                "Deck: deck and haunch"
                if result.girder.job.deck is not None
                else "Other: other non-composite load (no deck)"
            )
            + "; DC: barriers and other superimposed dead load; "
            f"DW: wearing surface. {loads_caption(result)}"
        ),
        caption_justify="left",
    )
    t.add_column("Station", overflow="fold", min_width=8)
    t.add_column("x", justify="right", no_wrap=True)
    for k in keys:
        head = "Other" if k == "deck" and result.girder.job.deck is None else LOAD_SHORT[k]
        t.add_column(head, justify="right", no_wrap=True)
    if le.shear_live is not None:
        t.add_column("V max", justify="right", no_wrap=True)
        t.add_column("V min", justify="right", no_wrap=True)
    a = result.girder.job.bearing_offset
    for i, st in enumerate(le.stations):
        if stations is not None and not station_matches(st.name, stations):
            continue
        cells = [st.name, fmt(st.x - a, system, "position", 2)]
        cells += [fmt(float(le.moments[k][i]), system, "moment", 1) for k in keys]
        if le.shear_live is not None:
            cells += [fmt(float(v[i]), system, "force", 1) for v in le.shear_live]
        t.add_row(*(Text(c) for c in cells))
    live = Text(f"Live load: {live_load_text(result)}.", style="dim")
    return Group(t, live, Text(""))


def _cell(f: FiberResult | None, system: str) -> str:
    if f is None:
        return ""
    text = signed(f.stress, system, "stress")
    return text if f.ok else f"[bold red]{text}[/]"


SHORT_FIBER = {"girder_bottom": "bottom", "girder_top": "top", "deck_top": "deck"}


def stage_table(stage: StageResult, number: int, system: str) -> Group:
    """One stage: stations as rows, fiber stresses, governing utilisation and mark."""
    fibers = [
        f
        for f in ("girder_bottom", "girder_top", "deck_top")
        if any(f in s.fibers for s in stage.stations)
    ]
    su = label(system, "stress")
    is_service = any(s.x_bearing is not None for s in stage.stations)
    origin = "the left bearing" if is_service else "the left girder end"
    units = (
        f"x: {label(system, 'position')} from {origin}; P: {label(system, 'force')}; "
        f"e: {label(system, 'dimension')} below the girder centroid; M: "
        f"{label(system, 'moment')}; stresses: {su}, {SIGN_CONVENTION}."
    )
    t = Table(
        title=f"Stage {number} — {stage.title}" + ("" if stage.ok else "  [bold red]EXCEEDED[/]"),
        title_justify="left",
        title_style="bold",
        box=box.SIMPLE_HEAD,
        # columns one space apart (the box's divider) and no blank edges: with three fibers,
        # long girders' moments and a FAIL the table still fits 80 columns
        padding=(0, 0),
        show_edge=False,
        caption=units,
        caption_justify="left",
    )
    t.add_column("Station", overflow="fold", min_width=9)
    for col in ("x", "P", "e", "M"):
        t.add_column(col, justify="right", no_wrap=True)
    for f in fibers:
        t.add_column(SHORT_FIBER[f].capitalize(), justify="right", no_wrap=True)
    t.add_column("Governs", no_wrap=True)
    t.add_column("Use", justify="right", no_wrap=True)
    t.add_column("", no_wrap=True)
    for s in stage.stations:
        gov = s.governing()
        gov_text = SHORT_FIBER[gov[0]] if gov else "—"
        use = "—" if gov is None else use_text(gov[1])
        t.add_row(
            Text(s.name),
            Text(fmt(s.x_bearing if is_service else s.x, system, "position", 2)),
            Text(fmt(s.force, system, "force", 1)),
            Text(fmt(s.eccentricity, system, "dimension", 2)),
            Text(fmt(s.moment, system, "moment", 1)),
            *[_cell(s.fibers.get(f), system) for f in fibers],
            Text(gov_text),
            Text(use),
            PASS if s.ok else FAIL,
        )
    lines = [f"  {FIBER_NAMES[f]}: {text}" for f, text in stage_limits(stage, fibers, system)]
    limits = Text.from_markup(f"[dim]Limits ({su}):[/]\n" + "\n".join(lines))
    what = Text(f"Acting: {stage.description}.", style="dim")
    notes = [Text(f"Note: {n}", style="dim") for n in stage.notes]
    return Group(t, what, limits, *notes, Text(""))


def summary(result: CheckResult) -> Table:
    """Governing station and utilisation per stage and fiber."""
    t = Table(
        title="Summary: governing station per stage and fiber",
        title_justify="left",
        title_style="bold",
        box=box.SIMPLE_HEAD,
        collapse_padding=True,
    )
    t.add_column("Stage")
    t.add_column("Fiber")
    t.add_column("Governing station")
    t.add_column("Use", justify="right")
    t.add_column("")
    for i, s in enumerate(result.stages, 1):
        fibers = [
            f
            for f in ("girder_bottom", "girder_top", "deck_top")
            if any(f in st.fibers for st in s.stations)
        ]
        first = True
        for fiber in fibers:
            best = s.governing_at(fiber)
            title = f"{i}. {s.title}" if first else ""
            first = False
            if best is None:
                t.add_row(title, FIBER_NAMES[fiber], "—", "not checked", "")
                continue
            st, u, fr = best
            ok = fr.ok
            use = use_text(u)
            t.add_row(title, FIBER_NAMES[fiber], st.name, use, PASS if ok else FAIL)
        t.add_section()
    return t


def verdict(result: CheckResult) -> str:
    """The one-line verdict."""
    govs = [(s, s.governing()) for s in result.stages]
    govs = [(s, g) for s, g in govs if g is not None]
    if result.ok:
        if not govs:
            return "[bold green]PASS[/]: no limit was checked."
        s, (st, fiber, u) = max(govs, key=lambda sg: sg[1][2])
        text = (
            f"[bold green]PASS[/]: every checked fiber at every station is within its limit; "
            f"highest utilisation {u:.2f} ({s.title}, {FIBER_NAMES[fiber]} at {st.name})"
        )
        if result.conditions:
            text += "; provided: " + "; ".join(
                f"({i}) {escape(c)}" for i, c in enumerate(result.conditions, 1)
            )
        return text + "."
    return f"[bold red]FAIL[/]: limits exceeded in {escape(', '.join(result.failures()))}."


def make_console() -> Console:
    """A console: the terminal's width, or 120 columns (``COLUMNS`` overrides) when piped.

    Piped output carries no colour codes (unless ``FORCE_COLOR`` is set); rich's automatic
    highlighting is off, since the presenters style what matters themselves.
    """
    import os
    import sys

    if sys.stdout.isatty():
        return Console(highlight=False, emoji=False)
    try:
        width = int(os.environ.get("COLUMNS", "120"))
    except ValueError:
        width = 120
    color = "auto" if os.environ.get("FORCE_COLOR") else None
    return Console(width=max(60, width), highlight=False, color_system=color, emoji=False)


def render(
    result: CheckResult,
    console: Console,
    system: str | None = None,
    *,
    stages: tuple[str, ...] | None = None,
    stations: tuple[str, ...] | None = None,
) -> None:
    """Print the whole check (``stages``/``stations`` focus the stage tables)."""
    system = system or result.girder.job.units
    console.print(header(result, system))
    console.print(properties(result, system))
    console.print(losses(result, system))
    table = loads_table(result, system, stations)
    if table is not None:
        console.print(table)
    for i, stage in enumerate(result.stages, 1):
        if stages is not None and stage.key not in stages and stage.limits_key not in stages:
            continue
        if stations is not None:
            from dataclasses import replace

            keep = tuple(st for st in stage.stations if station_matches(st.name, stations))
            stage = replace(stage, stations=keep)
            if not keep:
                continue
        console.print(stage_table(stage, i, system))
    console.print(summary(result))
    for n in result.notes:
        console.print(Text(f"Note: {n}", style="dim"))
    console.print(verdict(result))
    console.print(f"[yellow]{CAUTION}[/]")
