"""Moments along a simply supported girder (engine level: N, mm, N*mm; sagging positive).

Statics of the usual cases: a uniform load over the whole girder on two supports anywhere
(casting-bed ends, lifting points, bearings with overhangs), a uniform load on the span
between bearings, point loads on the span, and a live-load envelope given at stations.
"""

from __future__ import annotations

import numpy as np
from numpy.typing import ArrayLike, NDArray


def uniform_on_two_supports(
    w: float, length: float, a1: float, a2: float, x: ArrayLike
) -> NDArray[np.float64]:
    """Moment of a uniform load w (N/mm) over the whole length, supports at a1 < a2 (mm).

    M(x) = −w x²/2 + R1 ⟨x − a1⟩ + R2 ⟨x − a2⟩, with R1 + R2 = wL and moments about a1
    (statics of a beam with overhangs; common practice).
    """
    xs = np.asarray(x, dtype=float)
    if not 0.0 <= a1 < a2 <= length:
        raise ValueError(f"supports must satisfy 0 <= a1 < a2 <= length, got {a1}, {a2}, {length}")
    R2 = w * length * (length / 2.0 - a1) / (a2 - a1)
    R1 = w * length - R2
    return -w * xs**2 / 2.0 + R1 * np.clip(xs - a1, 0.0, None) + R2 * np.clip(xs - a2, 0.0, None)


def uniform_on_span(w: float, span: float, xb: ArrayLike) -> NDArray[np.float64]:
    """Moment of a uniform load w (N/mm) on a simple span, at xb from the left bearing (mm).

    M = w xb (S − xb) / 2 within the span, zero outside it.
    """
    x = np.asarray(xb, dtype=float)
    inside = (x >= 0.0) & (x <= span)
    return np.where(inside, w * x * (span - x) / 2.0, 0.0)


def point_on_span(P: float, a: float, span: float, xb: ArrayLike) -> NDArray[np.float64]:
    """Moment of a point load P (N) at a (mm from the left bearing) on a simple span.

    M = P (S − a) xb / S left of the load, P a (S − xb) / S right of it; zero outside the span.
    """
    x = np.asarray(xb, dtype=float)
    if not 0.0 <= a <= span:
        raise ValueError(f"a point load must lie on the span, got a = {a} on {span}")
    m = np.where(x <= a, P * (span - a) * x / span, P * a * (span - x) / span)
    return np.where((x >= 0.0) & (x <= span), m, 0.0)
