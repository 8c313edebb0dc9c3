"""Composite and transformed sections, assembled by the parallel-axis theorem.

The girder's gross properties come from sectionproperties (:mod:`.properties`); the deck
and haunch are rectangles and strands are points, so the assembled properties follow
exactly from the parallel-axis theorem on the components, each weighted by its modular
ratio (the usual hand method; a test checks it against sectionproperties' modulus-weighted
analysis of the same composite shape). All lengths in mm; y measured up from the girder
bottom; properties expressed in units of the girder concrete (transformed areas).
"""

from __future__ import annotations

import math
from collections.abc import Iterable
from dataclasses import dataclass

from prestress.model import Deck, Tendon
from prestress.sections.properties import GrossProperties


@dataclass(frozen=True)
class Component:
    """A piece of a section: area, centroid height, own inertia, weighting (modular ratio)."""

    name: str
    area: float
    y: float
    I_own: float
    n: float = 1.0


@dataclass(frozen=True)
class AssembledSection:
    """Transformed properties of an assembly of components (girder-concrete units).

    Attributes:
        name: e.g. "composite, gross girder".
        area: transformed area.
        yb: centroid height above the girder bottom.
        I: transformed second moment of area about the centroid.
        fibers: heights (mm above the girder bottom) of the fibers of interest, by name.
        n_fiber: the modular ratio of the material at each fiber (to turn transformed stress
            into real stress at that fiber: real = n × M y / I).
    """

    name: str
    area: float
    yb: float
    I: float
    fibers: dict[str, float]
    n_fiber: dict[str, float]

    def S(self, fiber: str) -> float:
        """Section modulus at a fiber, I / |y_fiber − yb| (mm^3, always positive)."""
        return self.I / abs(self.fibers[fiber] - self.yb)

    def c(self, fiber: str) -> float:
        """Signed distance of a fiber above the centroid (mm): positive above."""
        return self.fibers[fiber] - self.yb


def assemble(components: Iterable[Component]) -> tuple[float, float, float]:
    """Parallel-axis theorem: (area, centroid y, I about the centroid) of weighted components."""
    comps = list(components)
    area = sum(c.n * c.area for c in comps)
    if area <= 0:
        raise ValueError("the assembled section has no area")
    y = sum(c.n * c.area * c.y for c in comps) / area
    inertia = sum(c.n * (c.I_own + c.area * (c.y - y) ** 2) for c in comps)
    return area, y, inertia


def rectangle(name: str, width: float, depth: float, y_bottom: float, n: float = 1.0) -> Component:
    """A rectangular component (mm) of the given weighting."""
    return Component(name, width * depth, y_bottom + depth / 2.0, width * depth**3 / 12.0, n)


def girder_component(g: GrossProperties) -> Component:
    """The bare girder as a component."""
    return Component("girder", g.area, g.yb, g.Ix, 1.0)


def noncomposite(g: GrossProperties, name: str = "girder, gross") -> AssembledSection:
    """The girder alone (gross), with its bottom and top fibers."""
    return AssembledSection(
        name=name,
        area=g.area,
        yb=g.yb,
        I=g.Ix,
        fibers={"girder_bottom": 0.0, "girder_top": g.height},
        n_fiber={"girder_bottom": 1.0, "girder_top": 1.0},
    )


def deck_components(g: GrossProperties, deck: Deck, n_deck: float) -> list[Component]:
    """Deck slab (structural thickness) and, when it counts, the haunch, as components."""
    comps = []
    if deck.haunch > 0 and deck.haunch_in_stiffness:
        comps.append(rectangle("haunch", deck.haunch_width, deck.haunch, g.height, n_deck))
    comps.append(
        rectangle("deck", deck.effective_width, deck.thickness, g.height + deck.haunch, n_deck)
    )
    return comps


def composite(g: GrossProperties, deck: Deck, n_deck: float) -> AssembledSection:
    """Girder plus deck (and haunch if it counts), deck transformed by n = Ec,deck / Ec,girder.

    Args:
        g: gross girder properties.
        deck: the deck (thickness is the structural one; wearing surface excluded).
        n_deck: modular ratio of the deck concrete to the girder concrete.
    """
    area, yb, inertia = assemble([girder_component(g), *deck_components(g, deck, n_deck)])
    top = g.height + deck.haunch + deck.thickness
    return AssembledSection(
        name="composite (deck transformed)",
        area=area,
        yb=yb,
        I=inertia,
        fibers={"girder_bottom": 0.0, "girder_top": g.height, "deck_top": top},
        n_fiber={"girder_bottom": 1.0, "girder_top": 1.0, "deck_top": n_deck},
    )


# ------------------------------------------------------------------------------------------
# Sections with bonded strands: net and transformed


@dataclass(frozen=True)
class StrandLayer:
    """Bonded steel at one height: total area (mm^2) and height above the girder bottom (mm)."""

    area: float
    y: float


def strand_components(layers: Iterable[StrandLayer], weight: float) -> list[Component]:
    """Strand layers as point components with a weighting (n − 1 transformed, −1 net)."""
    return [Component("strands", s.area, s.y, 0.0, weight) for s in layers]


def _with_strands(
    base: list[Component],
    fibers: dict[str, float],
    n_fiber: dict[str, float],
    layers: list[StrandLayer],
    weight: float,
    name: str,
) -> AssembledSection:
    area, yb, inertia = assemble([*base, *strand_components(layers, weight)])
    return AssembledSection(name=name, area=area, yb=yb, I=inertia, fibers=fibers, n_fiber=n_fiber)


def net_girder(g: GrossProperties, layers: list[StrandLayer]) -> AssembledSection:
    """The girder with the strand area removed (holes at the strand positions)."""
    return _with_strands(
        [girder_component(g)],
        {"girder_bottom": 0.0, "girder_top": g.height},
        {"girder_bottom": 1.0, "girder_top": 1.0},
        layers,
        -1.0,
        "girder, net",
    )


def transformed_girder(
    g: GrossProperties, layers: list[StrandLayer], n_p: float, name: str = "girder, transformed"
) -> AssembledSection:
    """The girder with bonded strands added at (n − 1) times their area, n = Ep / Ec (or Eci).

    Equivalent to sectionproperties' modulus-weighted analysis of the concrete with holes at
    the strands plus steel of modulus Ep (a test checks it); the parallel-axis form is exact
    for strands, whose own inertia is negligible.
    """
    return _with_strands(
        [girder_component(g)],
        {"girder_bottom": 0.0, "girder_top": g.height},
        {"girder_bottom": 1.0, "girder_top": 1.0},
        layers,
        n_p - 1.0,
        name,
    )


def transformed_composite(
    g: GrossProperties, deck: Deck, n_deck: float, layers: list[StrandLayer], n_p: float
) -> AssembledSection:
    """Composite section (deck transformed by n_deck) with strands at (n_p − 1) times their area."""
    top = g.height + deck.haunch + deck.thickness
    return _with_strands(
        [girder_component(g), *deck_components(g, deck, n_deck)],
        {"girder_bottom": 0.0, "girder_top": g.height, "deck_top": top},
        {"girder_bottom": 1.0, "girder_top": 1.0, "deck_top": n_deck},
        layers,
        n_p - 1.0,
        "composite, transformed",
    )


# ------------------------------------------------------------------------------------------
# Post-tensioned girders before grouting: the section net of the open ducts


@dataclass(frozen=True)
class DuctHole:
    """An open (ungrouted) duct: outside diameter and centre height above the girder bottom (mm)."""

    diameter: float
    y: float


def duct_components(ducts: Iterable[DuctHole]) -> list[Component]:
    """Open ducts as circular holes: area π d²/4, own inertia π d⁴/64, weighting −1."""
    return [
        Component("duct", math.pi * d.diameter**2 / 4.0, d.y, math.pi * d.diameter**4 / 64.0, -1.0)
        for d in ducts
        if d.diameter > 0.0
    ]


def net_of_ducts(
    g: GrossProperties, ducts: Iterable[DuctHole], name: str = "girder, net (open ducts)"
) -> AssembledSection:
    """The girder with circular holes at the open ducts, by the parallel-axis theorem (mm).

    Exact for holes lying wholly inside the concrete and not overlapping each other in the real
    girder (the job reader checks the duct cover); a test checks it against the exact integrals
    of the polygon with circular holes. Area, centroid height and inertia about the horizontal
    centroidal axis do not depend on the holes' horizontal positions, so ducts side by side at
    one height are counted right although they are all described on the girder's axis.
    """
    area, yb, inertia = assemble([girder_component(g), *duct_components(ducts)])
    return AssembledSection(
        name=name,
        area=area,
        yb=yb,
        I=inertia,
        fibers={"girder_bottom": 0.0, "girder_top": g.height},
        n_fiber={"girder_bottom": 1.0, "girder_top": 1.0},
    )


def section_at_stressing(
    g: GrossProperties, tendons: Iterable[Tendon], x: float
) -> tuple[AssembledSection, str]:
    """The section carrying the prestress of post-tensioned tendons at stressing, and a notice.

    Before the ducts are grouted the tendons are not bonded and the ducts are holes: AASHTO
    LRFD 5.9.1.4 (clause number as recalled for the 8th Ed.; from memory): "before bonding of
    tendons, the loss of area due to open ducts shall be considered". The ducts' heights vary
    along the girder; one section is used for the stage, with every duct at its height at
    station ``x`` (midlength, as the transformed sections of pretensioned girders take the
    strands at their midlength heights), on the girder's vertical axis.

    Args:
        g: gross girder properties.
        tendons: the job's tendons (outside duct diameter, profile).
        x: station whose duct heights are used, mm from the left end.

    Returns:
        (the net section, a notice saying what was done).
    """
    tendons = list(tendons)
    holes = [DuctHole(t.duct_diameter, float(t.profile().height(x))) for t in tendons]
    if not any(h.diameter > 0.0 for h in holes):
        return noncomposite(g), (
            "post-tensioning stage on the gross section: no tendon gives a duct_diameter, so the "
            "loss of area due to the open ducts (AASHTO LRFD 5.9.1.4, from memory) is not counted"
        )
    sec = net_of_ducts(g, holes)
    loss = 100.0 * (1.0 - sec.area / g.area)
    return sec, (
        "post-tensioning stage and its elastic shortening on the girder net of the open ducts "
        f"(area {loss:.1f} % less than gross; AASHTO LRFD 5.9.1.4, from memory: before bonding, "
        "the loss of area due to open ducts is considered), with the ducts at their midlength "
        "heights on the girder axis (an approximation near the ends, where they rise); the "
        "later stages, after grouting, use the gross section"
    )
