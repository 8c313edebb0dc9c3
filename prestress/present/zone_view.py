"""The permissible zone of the cgs drawn in the terminal, and the stations outside it.

The drawing is the girder's elevation, not to scale vertically: the girder depth is spread
over a fixed number of text rows, its length over the console width. The band that keeps
every fiber within its limits at every stage is shaded; the cgs is drawn over it; hold-down
points, debond ends and the checked stations are marked.
"""

from __future__ import annotations

import numpy as np
from rich import box
from rich.table import Table
from rich.text import Text

from prestress.analysis import CheckResult
from prestress.present.common import fmt, label
from prestress.stages import ZoneStation

BAND = "·"
CGS = "━"
OUT = "✖"


def elevation(
    result: CheckResult, profile: tuple[ZoneStation, ...], width: int, rows: int = 16
) -> Text:
    """The elevation with the zone band, the cgs line and the marks, as rich Text."""
    job = result.girder.job
    h = result.girder.gross.height
    L = job.length
    n = len(profile)
    grid = [[" "] * n for _ in range(rows)]
    style = [[""] * n for _ in range(rows)]

    def row_of(y: float) -> int:
        return round((1.0 - min(max(y / h, 0.0), 1.0)) * (rows - 1))

    for j, z in enumerate(profile):
        lo = 0.0 if z.low is None else z.low
        hi = h if z.high is None else z.high
        if z.station.x in (0.0, L):
            continue
        if lo <= hi:
            for r in range(row_of(min(hi, h)), row_of(max(lo, 0.0)) + 1):
                grid[r][j] = BAND
                style[r][j] = "green"
        r = row_of(z.cgs)
        grid[r][j] = CGS if z.inside else OUT
        style[r][j] = "bold" if z.inside else "bold red"
    text = Text()
    marks = [" "] * n
    if job.layout is not None:
        for name, x in job.layout.key_positions():
            j = min(n - 1, max(0, round(x / L * (n - 1))))
            marks[j] = (
                "▼"
                if name.endswith("hold-down")
                else ("┆" if "debond end" in name and not name.endswith("lt") else marks[j])
            )
    text.append(" " + "".join(marks) + "\n", style="cyan")
    text.append("┌" + "─" * n + "┐ girder top\n", style="dim")
    for r in range(rows):
        text.append("│", style="dim")
        for j in range(n):
            text.append(grid[r][j], style=style[r][j] or None)
        text.append("│\n", style="dim")
    text.append("└" + "─" * n + "┘ girder bottom\n", style="dim")
    ticks = [" "] * n
    for st in result.zone:
        j = min(n - 1, max(0, round(st.station.x / L * (n - 1))))
        ticks[j] = "│" if ticks[j] == " " else ticks[j]
    text.append(" " + "".join(ticks) + "\n", style="dim")
    return text


def legend(system: str, result: CheckResult) -> Text:
    """What the marks mean and the scales."""
    job = result.girder.job
    t = Text()
    t.append(f"{BAND}", style="green")
    t.append(" permissible band of the cgs   ")
    t.append(CGS, style="bold")
    t.append(" cgs inside   ")
    t.append(OUT, style="bold red")
    t.append(" cgs outside   ")
    t.append("▼", style="cyan")
    t.append(" hold-down   ")
    t.append("┆", style="cyan")
    t.append(" debond end   │ checked station\n")
    t.append(
        f"Length {fmt(job.length, system, 'position', 2)} {label(system, 'position')} across; "
        f"depth {fmt(result.girder.gross.height, system, 'dimension', 2)} "
        f"{label(system, 'dimension')} from bottom to top (vertical scale exaggerated). "
        "The band is the intersection, over every stage with limits, of the cgs heights "
        "that keep both girder fibers within their limits with that stage's force and "
        "moments.",
        style="dim",
    )
    return t


def zone_table(result: CheckResult, system: str, only_outside: bool = False) -> Table:
    """The zone at each checked station: band, cgs, margin, what sets each bound."""
    du = label(system, "dimension")
    t = Table(
        title="Permissible zone of the cgs at the stations",
        title_justify="left",
        title_style="bold",
        box=box.SIMPLE_HEAD,
        caption=f"Heights in {du} above the girder bottom; x in "
        f"{label(system, 'position')} from the left end; margin: distance from the cgs to "
        "the nearer edge of the band (negative: outside). NO BAND: the lowest permissible "
        "height lies above the highest, so no cgs height satisfies every stage there: the "
        "prestress force (or the loads or limits) must change, not only the cgs.",
        caption_justify="left",
        collapse_padding=True,
        pad_edge=False,
    )
    # only the station (folds) and the bounds' text wrap, so the table fits 80 columns
    t.add_column("Station", overflow="fold", min_width=8)
    for col in ("x", "lowest", "cgs", "highest", "margin", ""):
        t.add_column(col, justify="left" if col == "" else "right", no_wrap=True)
    t.add_column("Bounds set by")
    for z in result.zone:
        if only_outside and z.inside:
            continue
        if z.low is None and z.high is None:
            mark, who = "—", "no prestress developed"
        else:
            mark = (
                "[bold red]NO BAND[/]"
                if z.empty
                else ("[green]inside[/]" if z.inside else "[bold red]OUTSIDE[/]")
            )
            who = "; ".join(
                w
                for w in (
                    z.governing_low and f"low: {z.governing_low}",
                    z.governing_high and f"high: {z.governing_high}",
                )
                if w
            )
        t.add_row(
            z.station.name,
            fmt(z.station.x, system, "position", 2),
            fmt(z.low, system, "dimension", 2),
            fmt(z.cgs, system, "dimension", 2),
            fmt(z.high, system, "dimension", 2),
            fmt(z.margin, system, "dimension", 2),
            mark,
            who.replace("_", " "),
        )
    return t


def dense_profile(result: CheckResult, columns: int) -> tuple[ZoneStation, ...]:
    """The zone evaluated at one point per text column along the girder."""
    from prestress.analysis import zone_at
    from prestress.stages import Station

    L = result.girder.job.length
    xs = np.linspace(0.0, L, columns)
    return zone_at(
        result.girder, result.losses, [Station(f"x{j}", float(x)) for j, x in enumerate(xs)]
    )
