"""HL-93 live-load envelopes of one lane on a simple span (AASHTO LRFD 9th Ed. (2020) 3.6.1).

Engine level: newton, millimetre, N*mm. The code's kip and ft values come from
:mod:`prestress.codes.aashto_lrfd.live_load` and are converted once, here, with exact
factors (1 kip = 4448.2216152605 N, 1 ft = 304.8 mm).

Method (exact, not sampled). The influence lines of a simply supported beam are piecewise
linear in the load position, so the effect of a group of axles moving over the span is a
piecewise-linear function of the vehicle position. Its kinks where an axle enters or leaves
the span are convex (the slope increases), so a maximum or minimum can only occur with one
axle over the section (for shear, just to the right of the section for the maximum and just
to the left for the minimum). For every station we therefore place each axle in turn over
the station, for both directions of travel (the axle layout and its mirror image) and for
every rear-axle spacing evaluated, and keep the extreme. Axles that do not contribute to the
extreme (a negative ordinate for the maximum, positive for the minimum) are neglected, as
3.6.1.3.1 directs.

Variable rear spacing of the design truck (3.6.1.2.2, 14 to 30 ft). For a given placement the
effect is linear in the spacing with convex kinks only (an axle moving off the span), so the
extreme over the range is at one of its ends; both ends are always evaluated, and the
interior of the range is evaluated too at a step (``truck_step_mm``). On a simple span every
ordinate decreases away from the section, so the 14 ft spacing governs; the envelope records
the spacing that governed the moment so that this is shown rather than assumed.

Lane load (3.6.1.2.4), no dynamic load allowance (3.6.2.1): the whole span for the moment
(w x (L - x) / 2); for shear only the part of the span where the influence line has the sign
sought (w (L - x)² / 2L for the maximum, -w x² / 2L for the minimum), which is common
practice for the extreme force effect.

Combination, 3.6.1.3.1: the larger of (design tandem + lane) and (design truck + lane), the
vehicle with dynamic load allowance. The third case of 3.6.1.3.1, 90 % of two design trucks
at least 50 ft apart with 90 % of the lane load, applies only to negative moment between
points of contraflexure and to reactions at interior piers; a simple span has neither, so it
does not apply here.

Sign convention: sagging moment positive; shear positive when the part of the beam to the
left of the section is pushed up (positive next to the left support).
"""

from __future__ import annotations

import math
from dataclasses import dataclass

import numpy as np

from prestress.codes.aashto_lrfd import live_load as ll

#: Exact conversion factor, newton per kip (1 kip = 1000 lbf, 1 lbf = 4.4482216152605 N).
N_PER_KIP: float = 4448.2216152605
#: Exact conversion factor, millimetre per foot.
MM_PER_FT: float = 304.8

TRUCK_AXLES_N: np.ndarray = np.array(ll.DESIGN_TRUCK_AXLE_WEIGHTS_KIP) * N_PER_KIP
TRUCK_FRONT_SPACING_MM: float = ll.DESIGN_TRUCK_FRONT_SPACING_FT * MM_PER_FT
TRUCK_REAR_SPACING_MIN_MM: float = ll.DESIGN_TRUCK_REAR_SPACING_MIN_FT * MM_PER_FT
TRUCK_REAR_SPACING_MAX_MM: float = ll.DESIGN_TRUCK_REAR_SPACING_MAX_FT * MM_PER_FT
TANDEM_AXLES_N: np.ndarray = np.array(ll.DESIGN_TANDEM_AXLE_WEIGHTS_KIP) * N_PER_KIP
TANDEM_SPACING_MM: float = ll.DESIGN_TANDEM_SPACING_FT * MM_PER_FT
#: Design lane load in N/mm (0.64 kip/ft).
LANE_LOAD_N_PER_MM: float = ll.DESIGN_LANE_LOAD_KLF * N_PER_KIP / MM_PER_FT
#: Default step of the rear-axle spacing evaluated between 14 and 30 ft (1 ft).
DEFAULT_TRUCK_STEP_MM: float = MM_PER_FT

TRUCK_AXLES_N.setflags(write=False)
TANDEM_AXLES_N.setflags(write=False)


@dataclass(frozen=True)
class Hl93Envelope:
    """Envelopes of one lane of HL-93 at the stations of a simple span (N, mm, N*mm).

    Every array has one value per station. Truck and tandem values include the dynamic load
    allowance ``impact``; lane values never do. Moments are the maximum sagging moment (the
    minimum is zero on a simple span). ``*_LL_IM`` are the governing combinations of
    3.6.1.3.1.

    Attributes:
        span_mm: span, centre to centre of bearings, mm.
        stations_mm: stations measured from the left bearing, mm.
        impact: dynamic load allowance IM applied to truck and tandem (fraction).
        M_truck: max moment of the design truck x (1 + IM), N*mm.
        V_truck_max: max shear of the design truck x (1 + IM), N.
        V_truck_min: min shear of the design truck x (1 + IM), N.
        M_tandem: max moment of the design tandem x (1 + IM), N*mm.
        V_tandem_max: max shear of the design tandem x (1 + IM), N.
        V_tandem_min: min shear of the design tandem x (1 + IM), N.
        M_lane: max moment of the design lane load, N*mm.
        V_lane_max: max shear of the design lane load, N.
        V_lane_min: min shear of the design lane load, N.
        M_LL_IM: governing max moment, max(truck, tandem) + lane, N*mm.
        V_LL_IM_max: governing max shear, N.
        V_LL_IM_min: governing min shear, N.
        truck_governs_M: True where the truck (not the tandem) governs the moment.
        truck_rear_spacing_M_mm: rear-axle spacing of the truck that gave ``M_truck``, mm
            (the smallest of equal candidates).
    """

    span_mm: float
    stations_mm: np.ndarray
    impact: float
    M_truck: np.ndarray
    V_truck_max: np.ndarray
    V_truck_min: np.ndarray
    M_tandem: np.ndarray
    V_tandem_max: np.ndarray
    V_tandem_min: np.ndarray
    M_lane: np.ndarray
    V_lane_max: np.ndarray
    V_lane_min: np.ndarray
    M_LL_IM: np.ndarray
    V_LL_IM_max: np.ndarray
    V_LL_IM_min: np.ndarray
    truck_governs_M: np.ndarray
    truck_rear_spacing_M_mm: np.ndarray


def _layouts(spacings_mm: np.ndarray) -> np.ndarray:
    """Axle positions along the span for each axle spacing list and its mirror image.

    Args:
        spacings_mm: (n_cfg, n_axles - 1) spacings, in axle order.

    Returns:
        (2 n_cfg, n_axles) positions relative to the first axle: first the layouts as given
        (first axle on the left), then the same layouts mirrored (travel in the other
        direction).
    """
    n_cfg = spacings_mm.shape[0]
    forward = np.concatenate([np.zeros((n_cfg, 1)), np.cumsum(spacings_mm, axis=1)], axis=1)
    return np.concatenate([forward, -forward], axis=0)


def _group_effects_by_layout(
    span_mm: float, stations_mm: np.ndarray, axles_N: np.ndarray, layouts_mm: np.ndarray
) -> tuple[np.ndarray, np.ndarray, np.ndarray]:
    """Extreme moment and shears of each axle layout, each axle placed over each station.

    Returns:
        ``(M_max, V_max, V_min)``, each (n_stations, n_layouts).
    """
    L = float(span_mm)
    x = np.asarray(stations_mm, dtype=float)[:, None, None, None]
    # p[s, c, i, j]: position of axle j when axle i of layout c is over station s.
    rel = layouts_mm[:, None, :] - layouts_mm[:, :, None]
    p = x + rel[None, :, :, :]
    on_span = (p >= 0.0) & (p <= L)
    w = np.where(on_span, axles_N[None, None, None, :], 0.0)

    # Moment ordinates are >= 0 everywhere on the span: no axle is ever neglected.
    il_M = np.where(p <= x, p * (L - x), x * (L - p)) / L
    M = np.max(np.sum(w * il_M, axis=3), axis=2)
    # Maximum shear: an axle over the station counts as just right of the section.
    il_Vp = np.where(p >= x, 1.0 - p / L, -p / L)
    V_max = np.max(np.sum(w * np.maximum(il_Vp, 0.0), axis=3), axis=2)
    # Minimum shear: an axle over the station counts as just left of the section.
    il_Vm = np.where(p > x, 1.0 - p / L, -p / L)
    V_min = np.min(np.sum(w * np.minimum(il_Vm, 0.0), axis=3), axis=2)
    return M, V_max, V_min


def axle_group_envelope(
    span_mm: float, stations_mm: np.ndarray, axles_N: np.ndarray, layouts_mm: np.ndarray
) -> tuple[np.ndarray, np.ndarray, np.ndarray]:
    """Exact moment and shear envelopes of a moving group of point loads on a simple span.

    Each axle of each layout is placed over each station (see the module docstring for why
    that is exact). Axles with an ordinate of the wrong sign are neglected (3.6.1.3.1).

    Args:
        span_mm: span L, mm.
        stations_mm: (n,) stations, 0 <= x <= L, mm.
        axles_N: (n_axles,) axle loads, N (downward positive).
        layouts_mm: (n_layouts, n_axles) axle positions along the span relative to any
            origin, mm; include the mirror image of a layout for the other direction of
            travel.

    Returns:
        ``(M_max, V_max, V_min)``: (n,) max moment (N*mm, >= 0), max shear (N, >= 0) and
        min shear (N, <= 0).
    """
    M, V_max, V_min = _group_effects_by_layout(span_mm, stations_mm, axles_N, layouts_mm)
    return (
        np.maximum(M.max(axis=1), 0.0),
        np.maximum(V_max.max(axis=1), 0.0),
        np.minimum(V_min.min(axis=1), 0.0),
    )


def lane_load_envelope(
    span_mm: float, stations_mm: np.ndarray, w_N_per_mm: float = LANE_LOAD_N_PER_MM
) -> tuple[np.ndarray, np.ndarray, np.ndarray]:
    """Moment and shear envelopes of a uniform lane load on a simple span (statics).

    The moment takes the whole span loaded; the shear loads only the part of the span where
    the influence line has the sign sought (common practice for the extreme force effect).

    Args:
        span_mm: span L, mm.
        stations_mm: (n,) stations, mm.
        w_N_per_mm: lane load, N/mm (default 0.64 kip/ft, 3.6.1.2.4).

    Returns:
        ``(M_max, V_max, V_min)``: w x (L - x) / 2, w (L - x)² / 2L, -w x² / 2L.
    """
    L = float(span_mm)
    x = np.asarray(stations_mm, dtype=float)
    return (
        w_N_per_mm * x * (L - x) / 2.0,
        w_N_per_mm * (L - x) ** 2 / (2.0 * L),
        -w_N_per_mm * x**2 / (2.0 * L),
    )


def truck_rear_spacings_mm(truck_step_mm: float | None = None) -> np.ndarray:
    """Rear-axle spacings evaluated for the design truck, 14 to 30 ft, both ends included.

    Args:
        truck_step_mm: largest increment between evaluated spacings, mm; None for 1 ft
            (304.8 mm). The range is divided evenly.

    Returns:
        Ascending spacings in mm, first 14 ft (4267.2 mm), last 30 ft (9144 mm).
    """
    step = DEFAULT_TRUCK_STEP_MM if truck_step_mm is None else float(truck_step_mm)
    if not (step > 0.0 and math.isfinite(step)):
        raise ValueError(f"truck_step_mm must be a positive number of mm, got {truck_step_mm}")
    lo, hi = TRUCK_REAR_SPACING_MIN_MM, TRUCK_REAR_SPACING_MAX_MM
    n = max(math.ceil((hi - lo) / step - 1e-9), 1)
    return np.linspace(lo, hi, n + 1)


def hl93_envelope(
    span_mm: float,
    stations_mm: np.ndarray,
    *,
    impact: float = ll.IM_ALL_OTHER,
    truck_step_mm: float | None = None,
) -> Hl93Envelope:
    """AASHTO LRFD 9th Ed. (2020) 3.6.1.3.1: HL-93 envelopes of one lane on a simple span.

    Design truck (3.6.1.2.2, rear spacing 14 to 30 ft), design tandem (3.6.1.2.3) and design
    lane load (3.6.1.2.4), moved over the span exactly in both directions; governing
    combination (truck or tandem) x (1 + IM) + lane. No distribution factor and no multiple
    presence factor are applied (one lane). The "90 % of two trucks" case of 3.6.1.3.1 does
    not apply to a simple span (no negative moment, no interior pier).

    Args:
        span_mm: span, centre to centre of bearings, mm (positive).
        stations_mm: stations from the left bearing, mm, each within 0 to ``span_mm``.
        impact: dynamic load allowance IM, fraction (default 0.33, Table 3.6.2.1-1); applied
            to truck and tandem only. Use 0.0 for static effects.
        truck_step_mm: largest step of the design truck's rear-axle spacing evaluated
            between 14 and 30 ft, mm (None: 1 ft); the vehicle positions are not stepped.
            The two ends of the range are always evaluated, which is enough for an exact
            result (module docstring); the interior points show it.

    Returns:
        :class:`Hl93Envelope` in N and N*mm.
    """
    L = float(span_mm)
    if not (L > 0.0 and math.isfinite(L)):
        raise ValueError(f"span_mm must be a positive finite number, got {span_mm}")
    x = np.atleast_1d(np.asarray(stations_mm, dtype=float))
    if x.ndim != 1 or x.size == 0:
        raise ValueError("stations_mm must be a non-empty 1-D array")
    if not np.all(np.isfinite(x)) or np.any(x < 0.0) or np.any(x > L):
        raise ValueError(f"stations_mm must lie within 0 to span_mm = {L:g} mm")
    if not (0.0 <= impact <= 1.0):
        raise ValueError(f"impact = {impact:g} must be a fraction within 0 to 1 (e.g. 0.33)")
    x = x.copy()
    factor = 1.0 + impact

    rear = truck_rear_spacings_mm(truck_step_mm)
    truck_spacings = np.column_stack([np.full(rear.size, TRUCK_FRONT_SPACING_MM), rear])
    M_lay, Vp_lay, Vm_lay = _group_effects_by_layout(L, x, TRUCK_AXLES_N, _layouts(truck_spacings))
    # Both directions of travel for each spacing, then the extremes over the spacings.
    M_sp = np.maximum(M_lay[:, : rear.size], M_lay[:, rear.size :])
    M_tr = np.maximum(M_sp.max(axis=1), 0.0)
    Vp_tr = np.maximum(Vp_lay.max(axis=1), 0.0)
    Vm_tr = np.minimum(Vm_lay.min(axis=1), 0.0)
    # Smallest spacing attaining the maximum moment (to a relative 1e-12).
    attains = M_sp >= M_tr[:, None] * (1.0 - 1e-12)
    rear_M = rear[np.argmax(attains, axis=1)]

    M_ta, Vp_ta, Vm_ta = axle_group_envelope(
        L, x, TANDEM_AXLES_N, _layouts(np.array([[TANDEM_SPACING_MM]]))
    )
    M_la, Vp_la, Vm_la = lane_load_envelope(L, x)

    M_tr, Vp_tr, Vm_tr = factor * M_tr, factor * Vp_tr, factor * Vm_tr
    M_ta, Vp_ta, Vm_ta = factor * M_ta, factor * Vp_ta, factor * Vm_ta
    fields = {
        "M_truck": M_tr,
        "V_truck_max": Vp_tr,
        "V_truck_min": Vm_tr,
        "M_tandem": M_ta,
        "V_tandem_max": Vp_ta,
        "V_tandem_min": Vm_ta,
        "M_lane": M_la,
        "V_lane_max": Vp_la,
        "V_lane_min": Vm_la,
        "M_LL_IM": np.maximum(M_tr, M_ta) + M_la,
        "V_LL_IM_max": np.maximum(Vp_tr, Vp_ta) + Vp_la,
        "V_LL_IM_min": np.minimum(Vm_tr, Vm_ta) + Vm_la,
        "truck_governs_M": M_tr >= M_ta,
        "truck_rear_spacing_M_mm": rear_M,
        "stations_mm": x,
    }
    for arr in fields.values():
        arr.setflags(write=False)
    return Hl93Envelope(span_mm=L, impact=float(impact), **fields)
