"""Shared pieces of the presenters: unit conversion for display, names, the caution."""

from __future__ import annotations

from typing import Any

from prestress.units import ascii_label, from_internal, out_unit

CAUTION = (
    "Caution: these results must be checked by a qualified, licensed engineer; local codes, "
    "standards and owner requirements govern over anything this tool computes."
)

FIBER_NAMES = {"girder_bottom": "girder bottom", "girder_top": "girder top", "deck_top": "deck top"}


def value(v: float, system: str, role: str) -> float:
    """An internal magnitude in the output unit of ``role``."""
    return from_internal(v, system, role)


def label(system: str, role: str) -> str:
    """The display label of the output unit of ``role``."""
    return out_unit(system, role).label


def quantity(v: float | None, system: str, role: str) -> dict[str, Any] | None:
    """A quantity as ``{"value": number, "unit": "text"}`` for machine-readable output."""
    if v is None:
        return None
    return {"value": value(v, system, role), "unit": ascii_label(label(system, role))}


def fmt(v: float | None, system: str, role: str, digits: int = 3) -> str:
    """A number in the output unit with sensible precision ('—' for None)."""
    if v is None:
        return "—"
    x = value(v, system, role)
    mag = abs(x)
    if mag < 0.5 * 10**-digits:
        return "0"
    if mag >= 1e9:
        return f"{x:.4g}"
    if mag >= 1000:
        return f"{x:,.0f}"
    if mag >= 100:
        return f"{x:.1f}"
    if mag >= 10:
        return f"{x:.2f}"
    return f"{x:.{digits}f}"


def signed(v: float, system: str, role: str, digits: int = 3) -> str:
    """A stress with an explicit sign (tension +, compression −)."""
    x = value(v, system, role)
    if abs(x) < 0.5 * 10**-digits:
        return f"{0:.{digits}f}"
    return f"{x:+.{digits}f}".replace("-", "−")
