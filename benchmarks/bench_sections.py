"""Cached section lookup against a fresh mesh-and-analyse of the same composite transformed
section, measured side by side in one run (target: cached path at least 100 times faster).

    python benchmarks/bench_sections.py [--quick]
"""

from __future__ import annotations

import argparse
import os
import statistics
import tempfile
import time

os.environ.setdefault("PRESTRESS_CACHE_DIR", tempfile.mkdtemp(prefix="prestress-bench-"))

from prestress.model import Concrete, Deck
from prestress.sections.api import open_library, polygon_of
from prestress.sections.composite import StrandLayer, transformed_composite
from prestress.sections.properties import gross_properties

IN = 25.4
DECK = Deck(
    thickness=8 * IN,
    wearing_surface=0.0,
    effective_width=96 * IN,
    tributary_width=96 * IN,
    haunch=1 * IN,
    haunch_width=42 * IN,
    haunch_in_stiffness=True,
    concrete=Concrete("deck", 27.6, None, 2.36e-5, 27_000.0, None, "given"),
)
LAYERS = [
    StrandLayer(12 * 0.217 * IN**2, 2 * IN),
    StrandLayer(12 * 0.217 * IN**2, 4 * IN),
    StrandLayer(8 * 0.217 * IN**2, 6 * IN),
]


def cached(entry) -> float:
    """The tool's path: library polygon → cached gross properties → assembled section."""
    poly = polygon_of(entry)
    g = gross_properties(poly)
    return transformed_composite(g, DECK, 27_000.0 / 33_000.0, LAYERS, 196_500.0 / 33_000.0).I


def fresh(entry) -> float:
    """Mesh and analyse the same composite transformed section with sectionproperties."""
    from sectionproperties.analysis.section import Section
    from sectionproperties.pre.geometry import Geometry
    from sectionproperties.pre.pre import Material
    from shapely.geometry import box

    poly = polygon_of(entry)
    girder = Material("girder", 33_000.0, 0.2, 1.0, 0.0024, "grey")
    deck = Material("deck", 27_000.0, 0.2, 1.0, 0.0024, "lightgrey")
    steel = Material("strand", 196_500.0, 0.3, 1.0, 0.00785, "black")
    h = poly.bounds[3]
    geom = (
        Geometry(poly, material=girder)
        + Geometry(box(-21 * IN, h, 21 * IN, h + IN), material=deck)
        + Geometry(box(-48 * IN, h + IN, 48 * IN, h + 9 * IN), material=deck)
    )
    for layer in LAYERS:  # lumped steel per layer, as a thin bar across the flange
        a = layer.area / (20 * IN)
        geom = geom + Geometry(
            box(-10 * IN, layer.y - a / 2, 10 * IN, layer.y + a / 2), material=steel
        )
    geom.create_mesh(mesh_sizes=[0])
    sec = Section(geom)
    sec.calculate_geometric_properties()
    return sec.get_eic(e_ref=33_000.0)[0]


def median_time(fn, arg, repeats: int) -> float:
    times = []
    for _ in range(repeats):
        t0 = time.perf_counter()
        fn(arg)
        times.append(time.perf_counter() - t0)
    return statistics.median(times)


def main() -> None:
    parser = argparse.ArgumentParser(description=__doc__)
    parser.add_argument("--quick", action="store_true", help="few repeats (CI)")
    args = parser.parse_args()
    entry = open_library().get("AASHTO-PCI-BT-72")
    import sectionproperties.analysis.section  # noqa: F401  (import cost not counted)

    fresh(entry)  # warm-up (and fills nothing: fresh never caches)
    cached(entry)  # first call fills the disk cache
    n_fresh, n_cached = (2, 20) if args.quick else (7, 200)
    t_fresh = median_time(fresh, entry, n_fresh)
    t_cached = median_time(cached, entry, n_cached)
    print(f"fresh mesh-and-analyse (composite, transformed): {t_fresh * 1e3:8.2f} ms")
    print(f"cached lookup + assembly (same section):         {t_cached * 1e3:8.2f} ms")
    print(f"ratio fresh / cached: {t_fresh / t_cached:,.0f} (target >= 100)")


if __name__ == "__main__":
    main()
