"""Shared pieces of the presenters: unit conversion for display, names, the caution."""

from __future__ import annotations

import math
from typing import TYPE_CHECKING, Any

from prestress.units import ascii_label, from_internal, out_unit

if TYPE_CHECKING:
    from prestress.analysis import CheckResult

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


def use_text(u: float | None) -> str:
    """A utilisation (stress / limit) for tables, two decimals, never "1.00" for a failure.

    A value above 1 by less than 0.5 % gets more decimals (1.0005 → "1.0005"); ">1" for a
    zero limit exceeded; "—" for None.
    """
    if u is None:
        return "—"
    if u == float("inf"):
        return ">1"
    text = f"{u:.2f}"
    digits = 2
    while u > 1.0 and float(text) <= 1.0 and digits < 6:
        digits += 1
        text = f"{u:.{digits}f}"
    return text


def station_matches(name: str, words: tuple[str, ...]) -> bool:
    """Whether a station's name contains one of the words (``--stations``; any case)."""
    return any(w.lower() in name.lower() for w in words)


def fmt(v: float | None, system: str, role: str, digits: int = 3) -> str:
    """A number in the output unit with sensible precision ('—' for None)."""
    if v is None:
        return "—"
    x = value(v, system, role)
    mag = abs(x)
    digits = _digits(system, role, digits)
    if mag < 0.5 * 10**-digits:
        return "0"
    big = 1e6 if role in ("modulus", "inertia") and "mm" in label(system, role) else 1e9
    if mag >= big:  # engineering notation, four figures: 227.2×10⁹ mm⁴, 1.127×10⁹ mm³
        k = 3 * (math.floor(math.log10(mag)) // 3)
        m = x / 10**k
        decimals = 3 - math.floor(math.log10(abs(m)))
        if abs(round(m, decimals)) >= 1000.0:  # 999.96×10⁶ prints as 1.000×10⁹
            k, m, decimals = k + 3, m / 1000.0, 3
        else:  # 9.99996 prints as 10.00, not 10.000: the figures of the rounded mantissa
            decimals = max(0, 3 - math.floor(math.log10(abs(round(m, decimals)))))
        sup = str(k).translate(str.maketrans("0123456789-", "⁰¹²³⁴⁵⁶⁷⁸⁹⁻"))
        return f"{m:.{decimals}f}×10{sup}".replace("-", "−")
    # decimals by magnitude, never more for a larger number, judged on the number as it will
    # be printed (99.996 prints as "100.0", not "100.00"); a true minus sign
    text = f"{x:.{digits}f}"
    for threshold, decimals in ((1000, 0), (100, 1), (10, 2)):
        decimals = min(decimals, digits)
        if abs(round(x, decimals)) >= threshold:
            text = f"{x:,.0f}" if decimals == 0 else f"{x:,.{decimals}f}"
            break
    return text.replace("-", "−")


def _digits(system: str, role: str, digits: int) -> int:
    """Decimals for a role: stresses in MPa to 0.01 (0.001 MPa is beyond any concrete)."""
    if role == "stress" and label(system, role) == "MPa":
        return min(digits, 2)
    return digits


def signed(v: float, system: str, role: str, digits: int = 3) -> str:
    """A stress with an explicit sign (tension +, compression −)."""
    digits = _digits(system, role, digits)
    x = value(v, system, role)
    if abs(x) < 0.5 * 10**-digits:
        return f"{0:.{digits}f}"
    return f"{x:+.{digits}f}".replace("-", "−")


#: Column titles of the loads table, in order.
LOAD_TITLES = {
    "girder": "Girder",
    "deck": "Deck, haunch",
    "diaphragms": "Diaphragms",
    "barriers": "Barriers DC",
    "wearing_surface": "Wearing DW",
    "live": "LL+IM",
}


def live_load_text(result: CheckResult) -> str:
    """How the live load was taken, in one sentence (with its sources)."""
    live = result.girder.job.loads.live
    if live.model == "HL-93":
        text = (
            "HL-93 (AASHTO LRFD 9th Ed. (2020) 3.6.1.2, 3.6.1.3.1): the design truck (rear axle "
            "spacing 14 to 30 ft) or the design tandem, whichever governs, × (1 + IM) with IM = "
            f"{live.impact:g}, plus the lane load, moved over the span; per girder with the "
            f"moment distribution factor {live.distribution_factor:.3f} "
            f"({live.distribution_source})"
        )
        if live.shear_distribution_factor is not None:
            text += (
                f" and the shear distribution factor {live.shear_distribution_factor:.3f} "
                f"({live.shear_distribution_source})"
            )
        else:
            text += (
                "; no shear distribution factor (give loads.live.shear_distribution_factor "
                "to see the live-load shear)"
            )
        return text
    if live.moments_tenth_points is not None:
        return "moments at the tenth points given in the job (with impact and distribution)"
    if not live.moment_midspan:
        return "none in the job"
    return (
        "midspan moment given in the job (with impact and distribution), distributed along "
        "the span as a parabola"
    )


def loads_caption(result: CheckResult) -> str:
    """Which section carries which load, for the caption of a loads table."""
    if result.girder.composite_section is None:
        return "Every load on the girder alone (no deck), the girder weight on its bearings."
    return (
        "Girder weight on the bearings; deck, haunch and diaphragms on the girder alone; "
        "barriers, wearing surface and live load on the composite section."
    )


def loads_title(result: CheckResult) -> str:
    """The title of a loads table: shears only where the live load gives them."""
    le = result.loads
    shear = le is not None and le.shear_live is not None
    return ("Moments and shears" if shear else "Moments") + " per girder, unfactored"


def stage_limits(
    stage: Any, fibers: list[str], system: str, *, unit: bool = False
) -> list[tuple[str, str]]:
    """The limits of a stage per fiber in words: (fiber, "compression −3.825, tension … (rule)").

    The limits are those of the first station that checks the fiber (a stage has one set).
    ``unit``: each value followed by its unit.
    """
    u = f" {label(system, 'stress')}" if unit else ""
    out = []
    for f in fibers:
        fr = next((s.fibers[f] for s in stage.stations if f in s.fibers), None)
        if fr is None:
            continue
        parts = []
        if fr.compression_limit is not None:
            parts.append(f"compression {signed(fr.compression_limit, system, 'stress')}{u}")
        if fr.tension_limit is not None:
            parts.append(f"tension {signed(fr.tension_limit, system, 'stress')}{u}")
        out.append((f, ", ".join(parts) + f" ({fr.limit_text})" if parts else "not checked"))
    return out
