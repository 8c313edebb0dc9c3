"""Presentation of a design search: the space, the best candidates, why the next leaner fails.

Rich tables for the terminal and the same as JSON-ready data.
"""

from __future__ import annotations

from typing import Any

from rich import box
from rich.console import Console
from rich.markup import escape
from rich.table import Table

from prestress.design import Candidate, DesignResult, Governing, RankedCandidate
from prestress.present.common import CAUTION, FIBER_NAMES, fmt, label, quantity, signed, value

SCHEMA = "prestress.design/1"


def _num(v: float, system: str, role: str) -> str:
    """A value in the output unit of a role, with its unit, to four significant digits."""
    return f"{value(v, system, role):.4g} {label(system, role)}"


def pattern_text(c: Candidate, system: str) -> str:
    """The pattern in one line, row by row from the bottom, e.g. "2 in: 12 · 4 in: 6 (4 harped)"."""
    parts = []
    for r in c.by_height():
        extra = []
        if r["harped"]:
            extra.append(f"{r['harped']} harped")
        for length, n in sorted(r["debonded"].items()):
            extra.append(f"{n} debonded {_num(length, system, 'position')}")
        more = f" ({', '.join(extra)})" if extra else ""
        parts.append(f"{_num(r['height'], system, 'dimension')}: {r['count']}{more}")
    return " · ".join(parts)


def _special(c: Candidate) -> str:
    if c.harped:
        return f"{c.harped} harped"
    if c.debonded:
        return f"{c.debonded} debonded"
    return "—"


def space_table(result: DesignResult, system: str | None = None) -> Table:
    """The space searched: what was enumerated, its size, and how fast it was checked."""
    system = system or result.job.units
    t = Table(
        title="Search space",
        title_justify="left",
        title_style="bold",
        box=box.SIMPLE_HEAD,
        show_header=False,
    )
    t.add_column("item", style="bold", no_wrap=True)
    t.add_column("value")
    for key, text in result.description:
        t.add_row(escape(key), escape(text))
    tm = result.timings
    t.add_row(
        "checked",
        f"{result.size:,} candidates in {tm.get('evaluate', 0.0):.3f} s "
        f"({tm.get('rate', 0.0):,.0f} candidates per second, vectorised); "
        f"{result.passing:,} pass",
    )
    return t


def _gov_cells(g: Governing | None, system: str) -> list[str]:
    """The governing check in three cells: where (stage, station, fiber), stress / limit, use."""
    if g is None:
        return ["—"] * 3
    util = "fails" if g.utilisation == float("inf") else f"{g.utilisation:.3f}"
    x = f"{fmt(g.x, system, 'position', 2)} {label(system, 'position')}"
    return [
        f"{escape(g.stage_title)}\n{escape(g.station)} ({x}), {FIBER_NAMES.get(g.fiber, g.fiber)}",
        f"{signed(g.stress, system, 'stress')} / "
        + ("—" if g.limit is None else signed(g.limit, system, "stress")),
        util,
    ]


def _governing_columns(t: Table) -> None:
    """The columns of :func:`_gov_cells`; only the first wraps, so the table fits 80 columns."""
    t.add_column("governing check (stage; station, fiber)", min_width=20)
    t.add_column("stress / limit", justify="right", no_wrap=True)
    t.add_column("use", justify="right", no_wrap=True)


def _design_table(title: str, caption: str) -> Table:
    return Table(
        title=title,
        title_justify="left",
        title_style="bold",
        box=box.SIMPLE_HEAD,
        caption=caption,
        caption_justify="left",
        collapse_padding=True,
        pad_edge=False,
    )


def candidates_table(result: DesignResult, system: str | None = None) -> Table:
    """The best passing candidates, leanest first, each checked in full."""
    system = system or result.job.units
    su = label(system, "stress")
    rows = list(result.best) or ([result.closest] if result.closest else [])
    title = (
        "Best candidates (fewest strands first, then the least harping or debonding)"
        if result.best
        else "No candidate passes: the closest one"
    )
    t = _design_table(
        title,
        f"Stresses in {su}, tension +, compression −; stress / limit of the governing "
        "check; stations at their distance from the left girder end. Each candidate was "
        "checked again by the full check (as prestress check does). Patterns (strands per "
        "row, from the bottom):\n"
        + "\n".join(f"  {k}. {pattern_text(rc.candidate, system)}" for k, rc in enumerate(rows, 1)),
    )
    t.add_column("#", justify="right", no_wrap=True)
    t.add_column("strands", justify="right", no_wrap=True)
    t.add_column("harped /\ndebonded", no_wrap=True)
    _governing_columns(t)
    t.add_column("", no_wrap=True)
    for k, rc in enumerate(rows, 1):
        c = rc.candidate
        t.add_row(
            str(k),
            str(c.strands),
            _special(c),
            *_gov_cells(rc.governing, system),
            "[green]passes[/]" if rc.ok else "[bold red]FAILS[/]",
        )
    return t


def next_leaner_table(result: DesignResult, system: str | None = None) -> Table | None:
    """Why the next leaner candidate fails: each failing stage and fiber at its worst station."""
    system = system or result.job.units
    rc = result.next_leaner
    if rc is None:
        return None
    c = rc.candidate
    t = _design_table(
        f"Why {c.strands} strands are not enough: the closest candidate with "
        f"{c.strands} strands ({_special(c)}; {pattern_text(c, system)})",
        "Every candidate with fewer strands fails too (the search is exhaustive).",
    )
    _governing_columns(t)
    for g in rc.failures:
        t.add_row(*_gov_cells(g, system))
    return t


def render(result: DesignResult, console: Console, system: str | None = None) -> None:
    """Print the whole design search."""
    system = system or result.job.units
    console.print(f"[bold]{escape(result.job.title)}[/] — strand pattern search")
    console.print(space_table(result, system))
    console.print(candidates_table(result, system))
    nl = next_leaner_table(result, system)
    if nl is not None:
        console.print(nl)
    for note in result.notes:
        console.print(f"[dim]note: {escape(note)}[/]")
    if result.leanest is not None:
        c = result.leanest.candidate
        console.print(
            f"[bold green]Leanest passing pattern: {c.strands} strands[/] "
            f"({_special(c)}), utilisation {result.leanest.utilisation:.3f}."
        )
    else:
        console.print("[bold red]No pattern of the space passes every check.[/]")
    console.print(f"[dim]{CAUTION}[/]")


def _governing_dict(g: Governing | None, system: str) -> dict[str, Any] | None:
    if g is None:
        return None
    return {
        "stage": g.stage,
        "stage_title": g.stage_title,
        "station": g.station,
        "position_from_girder_end": quantity(g.x, system, "position"),
        "fiber": g.fiber,
        "stress": quantity(g.stress, system, "stress"),
        "limit": quantity(g.limit, system, "stress"),
        "utilisation": None if g.utilisation == float("inf") else g.utilisation,
        "ok": g.ok,
    }


def candidate_dict(rc: RankedCandidate, system: str) -> dict[str, Any]:
    """One checked candidate as plain data."""
    c = rc.candidate
    return {
        "strands": c.strands,
        "harped": c.harped,
        "debonded": c.debonded,
        "rows": [
            {
                "height": quantity(r["height"], system, "dimension"),
                "count": r["count"],
                "harped": r["harped"],
                "debonded": [
                    {"length": quantity(length, system, "position"), "count": n}
                    for length, n in sorted(r["debonded"].items())
                ],
            }
            for r in c.by_height()
        ],
        "ok": rc.ok,
        "utilisation": None if rc.utilisation == float("inf") else rc.utilisation,
        "governing": _governing_dict(rc.governing, system),
        "failures": [_governing_dict(g, system) for g in rc.failures],
    }


def to_dict(result: DesignResult, system: str | None = None) -> dict[str, Any]:
    """The design result as JSON-ready data."""
    system = system or result.job.units
    return {
        "schema": SCHEMA,
        "job": {"file": result.job.file, "title": result.job.title},
        "space": {
            "mode": result.space.mode,
            "size": result.size,
            "size_before_rules": result.size_before_rules,
            "strand_counts": list(result.levels),
            "description": {k: v for k, v in result.description},
        },
        "passing": result.passing,
        "ok": result.ok,
        "best": [candidate_dict(rc, system) for rc in result.best],
        "next_leaner": None
        if result.next_leaner is None
        else candidate_dict(result.next_leaner, system),
        "closest": None if result.closest is None else candidate_dict(result.closest, system),
        "timings_s": {k: v for k, v in result.timings.items() if k != "rate"},
        "candidates_per_second": result.timings.get("rate"),
        "notes": list(result.notes),
        "sign_convention": "tension +, compression −",
        "caution": CAUTION,
    }
