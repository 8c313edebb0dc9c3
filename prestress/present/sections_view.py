"""Presentation of the section library: listing and property tables, console and JSON."""

from __future__ import annotations

from typing import Any

from rich import box
from rich.table import Table

from prestress.present.common import fmt, label, quantity
from prestress.sections.api import SectionReport, SectionSummary


def listing_table(rows: list[SectionSummary], unit_weight: float, system: str) -> Table:
    """The library as a table: name, family, depth, area, weight, source."""
    wu = label(system, "line_load")
    t = Table(
        title="Section library",
        title_justify="left",
        title_style="bold",
        box=box.SIMPLE_HEAD,
        caption=f"Weight from a unit weight of {fmt(unit_weight, system, 'unit_weight', 4)} "
        f"{label(system, 'unit_weight')}.",
        caption_justify="left",
        collapse_padding=True,
        pad_edge=False,
    )
    # units under the headers and only the source wrapping, so the table fits 80 columns
    t.add_column("Name", no_wrap=True)
    t.add_column("Family", no_wrap=True)
    t.add_column(f"Depth\n({label(system, 'dimension')})", justify="right", no_wrap=True)
    t.add_column(f"Area\n({label(system, 'area')})", justify="right", no_wrap=True)
    t.add_column(f"Weight\n({wu})", justify="right", no_wrap=True)
    t.add_column("Source")
    for r in rows:
        t.add_row(
            r.name,
            r.family,
            fmt(r.depth, system, "dimension", 2),
            fmt(r.area, system, "area", 1),
            fmt(r.area * unit_weight, system, "line_load"),
            r.source,
        )
    return t


def listing_json(rows: list[SectionSummary], unit_weight: float, system: str) -> dict[str, Any]:
    """The library listing as JSON-ready data."""
    return {
        "units": system,
        "unit_weight": quantity(unit_weight, system, "unit_weight"),
        "sections": [
            {
                "name": r.name,
                "family": r.family,
                "depth": quantity(r.depth, system, "dimension"),
                "area": quantity(r.area, system, "area"),
                "weight": quantity(r.area * unit_weight, system, "line_load"),
                "source": r.source,
                "file": r.file,
                "description": r.description,
            }
            for r in rows
        ],
    }


def _rows(rep: SectionReport) -> list[tuple[str, float | None, float | None, str]]:
    g = rep.gross
    c = rep.composite
    rows: list[tuple[str, float | None, float | None, str]] = [
        ("Area A", g.area, c.area if c else None, "area"),
        ("Depth h", g.height, c.fibers["deck_top"] if c else None, "dimension"),
        ("Centroid above girder bottom yb", g.yb, c.yb if c else None, "dimension"),
        ("Centroid to girder top yt", g.yt, (g.height - c.yb) if c else None, "dimension"),
        ("Moment of inertia Ix", g.Ix, c.I if c else None, "inertia"),
        ("Moment of inertia Iy", g.Iy, None, "inertia"),
        ("Section modulus, girder bottom Sb", g.Sb, c.S("girder_bottom") if c else None, "modulus"),
        ("Section modulus, girder top St", g.St, c.S("girder_top") if c else None, "modulus"),
    ]
    if c is not None:
        rows.append(("Section modulus, deck top", None, c.S("deck_top"), "modulus"))
    rows += [
        ("Radius of gyration r", g.r, None, "dimension"),
        ("Upper kern above centroid kt = Sb/A", g.kern_top, None, "dimension"),
        ("Lower kern below centroid kb = St/A", g.kern_bottom, None, "dimension"),
        ("Perimeter (outer)", g.perimeter, None, "dimension"),
        ("Volume-to-surface V/S", g.volume_to_surface, None, "dimension"),
        ("Top flange width", g.top_width, None, "dimension"),
        ("Weight per length", rep.weight, None, "line_load"),
    ]
    if g.J is not None:
        rows.append(("Torsion constant J", g.J, None, "inertia"))
    return rows


def properties_table(rep: SectionReport, system: str) -> Table:
    """A property table of one section (gross, and composite when a deck is given)."""
    c = rep.composite
    cap = "V/S with every outer face exposed to drying, voids sealed."
    if c is not None and rep.deck is not None:
        cap += (
            f" Composite: deck {fmt(rep.deck.thickness, system, 'dimension')} × "
            f"{fmt(rep.deck.effective_width, system, 'dimension')} "
            f"{label(system, 'dimension')} transformed by n = {rep.n_deck:.3f}; haunch "
            f"{fmt(rep.deck.haunch, system, 'dimension')} {label(system, 'dimension')} "
            f"({'in' if rep.deck.haunch_in_stiffness else 'not in'} the stiffness)."
        )
    t = Table(
        title=f"{rep.entry.name} — {rep.entry.family}",
        title_justify="left",
        title_style="bold",
        box=box.SIMPLE_HEAD,
        caption=cap,
        caption_justify="left",
    )
    t.add_column("Property")
    t.add_column("Girder (gross)", justify="right", no_wrap=True)
    if c is not None:
        t.add_column("Composite", justify="right", no_wrap=True)
    t.add_column("Unit", no_wrap=True)
    for name, a, b, role in _rows(rep):
        cells = [name, fmt(a, system, role)]
        if c is not None:
            cells.append(fmt(b, system, role))
        t.add_row(*cells, label(system, role))
    return t


def properties_json(rep: SectionReport, system: str) -> dict[str, Any]:
    """One section's properties as JSON-ready data (one object, with its name)."""
    g = rep.gross
    out: dict[str, Any] = {
        "name": rep.entry.name,
        "family": rep.entry.family,
        "source": rep.entry.source,
        "gross": {
            "area": quantity(g.area, system, "area"),
            "height": quantity(g.height, system, "dimension"),
            "yb": quantity(g.yb, system, "dimension"),
            "yt": quantity(g.yt, system, "dimension"),
            "Ix": quantity(g.Ix, system, "inertia"),
            "Iy": quantity(g.Iy, system, "inertia"),
            "Sb": quantity(g.Sb, system, "modulus"),
            "St": quantity(g.St, system, "modulus"),
            "r": quantity(g.r, system, "dimension"),
            "kern_top": quantity(g.kern_top, system, "dimension"),
            "kern_bottom": quantity(g.kern_bottom, system, "dimension"),
            "perimeter": quantity(g.perimeter, system, "dimension"),
            "volume_to_surface": quantity(g.volume_to_surface, system, "dimension"),
            "top_width": quantity(g.top_width, system, "dimension"),
            "weight": quantity(rep.weight, system, "line_load"),
            "J": quantity(g.J, system, "inertia"),
        },
    }
    c = rep.composite
    if c is not None:
        out["composite"] = {
            "modular_ratio_deck": rep.n_deck,
            "area": quantity(c.area, system, "area"),
            "yb": quantity(c.yb, system, "dimension"),
            "I": quantity(c.I, system, "inertia"),
            "S": {k: quantity(c.S(k), system, "modulus") for k in c.fibers},
            "fibers": {k: quantity(v, system, "dimension") for k, v in c.fibers.items()},
        }
    return out
