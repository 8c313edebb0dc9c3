"""Section library services behind ``prestress sections`` and ``prestress section ...``.

Scriptable from Python: :func:`list_sections` (fast: shapely only, no meshing) and
:func:`section_properties` (gross, optionally composite, through the cached analysis).
Everything in internal units (mm, MPa, N/mm^3).
"""

from __future__ import annotations

from dataclasses import dataclass
from pathlib import Path

from prestress.model import Concrete, Deck
from prestress.sections.composite import AssembledSection, composite
from prestress.sections.families import build_polygon
from prestress.sections.library import Library, SectionEntry, load_library, search_folders
from prestress.sections.properties import GrossProperties, gross_properties


@dataclass(frozen=True)
class SectionSummary:
    """One line of the library listing (mm, mm^2)."""

    name: str
    family: str
    depth: float
    area: float
    source: str
    file: str
    description: str


def open_library(folders: tuple[str, ...] = ()) -> Library:
    """The library of the given user folders, the environment's and the shipped one."""
    return load_library(search_folders((), folders))


def polygon_of(entry: SectionEntry):
    """The validated polygon of a library entry (mm)."""
    return build_polygon(
        entry.family, entry.dimensions, file=entry.file, field=f"{entry.field}.dimensions"
    )


def list_sections(
    lib: Library,
    *,
    family: str | None = None,
    min_depth: float | None = None,
    max_depth: float | None = None,
) -> list[SectionSummary]:
    """Every section of the library, optionally filtered by family and depth range (mm)."""
    out = []
    for e in sorted(lib.entries.values(), key=lambda e: (e.family, e.name)):
        if family is not None and e.family != family:
            continue
        poly = polygon_of(e)
        depth = poly.bounds[3] - poly.bounds[1]
        if min_depth is not None and depth < min_depth:
            continue
        if max_depth is not None and depth > max_depth:
            continue
        out.append(
            SectionSummary(
                e.name, e.family, depth, float(poly.area), e.source, e.file, e.description
            )
        )
    return out


@dataclass(frozen=True)
class SectionReport:
    """Properties of one section, optionally with a deck (internal units)."""

    entry: SectionEntry
    polygon: object
    gross: GrossProperties
    unit_weight: float
    composite: AssembledSection | None
    n_deck: float | None
    deck: Deck | None

    @property
    def weight(self) -> float:
        """Self-weight per length (N/mm)."""
        return self.gross.area * self.unit_weight


def section_properties(
    lib: Library,
    name: str,
    *,
    unit_weight: float,
    deck: Deck | None = None,
    n_deck: float | None = None,
    torsion: bool = False,
) -> SectionReport:
    """Gross (and composite, with a deck) properties of a named section."""
    entry = lib.get(name, file="command line", field="NAME")
    poly = polygon_of(entry)
    gross = gross_properties(poly, torsion=torsion)
    comp = None
    if deck is not None:
        if deck.haunch > 0 and deck.haunch_width == 0.0:
            from dataclasses import replace

            deck = replace(deck, haunch_width=gross.top_width)
        assert n_deck is not None
        comp = composite(gross, deck, n_deck)
    return SectionReport(entry, poly, gross, unit_weight, comp, n_deck, deck)


def simple_deck(
    thickness: float,
    width: float,
    haunch: float,
    concrete: Concrete,
    haunch_in_stiffness: bool = False,
) -> Deck:
    """A deck for a property report (no wearing surface; haunch width = girder top width)."""
    return Deck(
        thickness=thickness,
        wearing_surface=0.0,
        effective_width=width,
        tributary_width=width,
        haunch=haunch,
        haunch_width=0.0,
        haunch_in_stiffness=haunch_in_stiffness,
        concrete=concrete,
    )


def source_file_name(entry: SectionEntry) -> str:
    """The library file's name (for listings)."""
    return Path(entry.file).name
