"""AASHTO LRFD 9th Ed. (2020) 4.6.2.6.1: effective flange width of a deck on girders."""

from __future__ import annotations

import warnings


def b_eff_interior(S: float) -> float:
    """AASHTO LRFD 9th Ed. (2020) 4.6.2.6.1: interior girder, the tributary width S.

    The clause takes the effective flange width as the tributary width perpendicular to the
    girder's axis where L/S ≥ 2.0 (from memory); see :func:`check_span_ratio`.

    Args:
        S: girder spacing (any length unit).

    Returns:
        Effective width in the unit of ``S``.
    """
    if S <= 0:
        raise ValueError(f"S (girder spacing) must be positive, got {S}")
    return S


def b_eff_exterior(S: float, overhang: float) -> float:
    """AASHTO LRFD 9th Ed. (2020) 4.6.2.6.1: exterior girder, S / 2 plus the deck overhang.

    Args:
        S: spacing to the adjacent girder (any length unit).
        overhang: deck overhang beyond the exterior girder's centreline, same unit.
    """
    if S <= 0:
        raise ValueError(f"S (girder spacing) must be positive, got {S}")
    if overhang < 0:
        raise ValueError(f"overhang must be zero or more, got {overhang}")
    return S / 2.0 + overhang


def check_span_ratio(L: float, S: float) -> None:
    """Warn when L/S < 2.0, where 4.6.2.6.1 asks for a refined analysis instead (from memory)."""
    if L / S < 2.0:
        warnings.warn(
            f"span / spacing = {L / S:.2f} < 2.0: AASHTO LRFD 4.6.2.6.1 calls for a "
            "refined analysis of the effective width",
            stacklevel=2,
        )
