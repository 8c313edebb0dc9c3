"""Mechanics checks of the stage engine.

Equilibrium: the linear stress field over the girder section has the applied resultants,
∫σ dA = −P and ∫σ (y − yb) dA = −(M − P e) (plane sections, elastic; common practice),
integrated exactly over the polygon with the shoelace formulas for area, first and second
moments. Zone: a cgs placed exactly on a boundary of the permissible zone gives a utilisation
of 1.0 at the fiber and stage that set that boundary.
"""

from __future__ import annotations

import numpy as np
import pytest

from prestress.analysis import resolve_girder
from prestress.jobfile import load_job
from prestress.losses import compute_losses
from prestress.stages import fiber_stress, stage_specs, stage_stresses, stations, zone_bounds
from tests.conftest import EXAMPLES, US_EXAMPLE


def polygon_moments(poly) -> tuple[float, float, float]:
    """Exact A, ∫y dA, ∫y² dA of a polygon with holes (shoelace formulas)."""

    def ring(coords: np.ndarray) -> tuple[float, float, float]:
        x, y = coords[:-1, 0], coords[:-1, 1]
        x1, y1 = coords[1:, 0], coords[1:, 1]
        cross = x * y1 - x1 * y
        return (
            cross.sum() / 2,
            ((y + y1) * cross).sum() / 6,
            ((y**2 + y * y1 + y1**2) * cross).sum() / 12,
        )

    a, sy, syy = ring(np.asarray(poly.exterior.coords))
    for h in poly.interiors:
        ha, hsy, hsyy = ring(np.asarray(h.coords))
        a, sy, syy = a + ha, sy + hsy, syy + hsyy  # holes run clockwise: negative
    return a, sy, syy


def test_stress_resultants_equal_applied_force_and_moment() -> None:
    girder = resolve_girder(load_job(US_EXAMPLE))
    sec = girder.girder_section
    A, Sy, Syy = polygon_moments(girder.polygon)
    yb = Sy / A
    I = Syy - A * yb**2
    P, e, M = 3.0e6, 600.0, 2.0e9  # N, mm, N*mm (invented)
    # the stress at any height follows from the two fiber values (linear field)
    fb = fiber_stress(sec, "girder_bottom", P, e, M)
    ft = fiber_stress(sec, "girder_top", P, e, M)
    h = girder.gross.height
    slope = (ft - fb) / h  # σ(y) = fb + slope y
    N = fb * A + slope * Sy  # ∫σ dA
    Mr = fb * (Sy - yb * A) + slope * (Syy - yb * Sy)  # ∫σ (y − yb) dA
    assert N == pytest.approx(-P, rel=1e-9)
    assert Mr == pytest.approx(-(M - P * e), rel=1e-9)
    assert I == pytest.approx(girder.gross.Ix, rel=1e-9)


@pytest.mark.parametrize("example", [US_EXAMPLE, EXAMPLES / "harl-brook-span1-g2-harped.toml"])
def test_cgs_on_the_zone_boundary_gives_utilisation_one(example) -> None:
    girder = resolve_girder(load_job(example))
    losses = compute_losses(girder)
    sts = stations(girder)
    from prestress.analysis import _limits_of, check_fiber

    checked = 0
    for spec in stage_specs(girder):
        raw = stage_stresses(girder, losses, spec, sts)
        bounds = zone_bounds(raw, _limits_of(girder, spec.key))
        for i, (lo, hi, who_lo, who_hi) in enumerate(bounds):
            for y, who in ((lo, who_lo), (hi, who_hi)):
                if not np.isfinite(y) or not who:
                    continue
                fiber = "girder_top" if " top " in f" {who} " else "girder_bottom"
                sec = raw.section
                e = sec.yb - y
                M_nc = sum(
                    v[i] for k, v in raw.moments.items() if k not in ("superimposed", "live")
                )
                f = fiber_stress(sec, fiber, raw.force[i], e, M_nc)
                if raw.composite is not None and any(
                    k in raw.moments for k in ("superimposed", "live")
                ):
                    M_c = sum(
                        raw.moments[k][i] for k in ("superimposed", "live") if k in raw.moments
                    )
                    f += fiber_stress(raw.composite, fiber, 0.0, 0.0, M_c)
                gc = girder.job.girder_concrete
                strength = gc.fci if spec.strength == "fci" else gc.fc
                r = check_fiber(f, girder.job.limits.get(spec.key, fiber), strength, "f")
                assert r.utilisation == pytest.approx(1.0, rel=1e-9), (spec.key, who)
                checked += 1
    assert checked > 10
