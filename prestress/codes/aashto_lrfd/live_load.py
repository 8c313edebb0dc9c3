"""AASHTO LRFD 9th Ed. (2020) 3.6 and 4.6.2.2: HL-93 vehicular live load and its distribution.

Units as printed in the specification: kip, ft (span, spacing, axle spacing), in (slab
thickness, section properties), kip/ft (lane load), degrees (skew).

Part 1, the load (Section 3.6):

* design truck, 3.6.1.2.2: axles of 8, 32 and 32 kip; 14 ft from the front axle to the
  middle axle; 14 to 30 ft, varied to produce the extreme effect, from the middle axle to
  the rear axle; wheels 6 ft apart transversely;
* design tandem, 3.6.1.2.3: two 25 kip axles 4 ft apart;
* design lane load, 3.6.1.2.4: 0.64 kip/ft over a 10 ft width, without dynamic load
  allowance;
* dynamic load allowance IM, 3.6.2.1 and Table 3.6.2.1-1;
* multiple presence factor m, 3.6.1.1.2 and Table 3.6.1.1.2-1;
* number of design lanes, 3.6.1.1.1.

Part 2, the distribution to the girders (4.6.2.2), for a concrete deck on precast concrete
I or bulb-tee girders (cross-section type "k" of Table 4.6.2.2.1-1) and on cast-in-place
concrete tee beams (type "e"), for which the tables give the same formulas. The factors are
in lanes per girder and include the multiple presence factor, except the lever rule, where
it is applied explicitly (4.6.2.2.1).
"""

from __future__ import annotations

import math
from typing import Literal

# --------------------------------------------------------------------------------------------
# 3.6.1.2: design vehicular live load HL-93
# --------------------------------------------------------------------------------------------

#: 3.6.1.2.2: design truck axle weights, front to rear, kip.
DESIGN_TRUCK_AXLE_WEIGHTS_KIP: tuple[float, float, float] = (8.0, 32.0, 32.0)
#: 3.6.1.2.2: spacing from the 8 kip front axle to the first 32 kip axle, ft.
DESIGN_TRUCK_FRONT_SPACING_FT: float = 14.0
#: 3.6.1.2.2: least spacing between the two 32 kip axles, ft.
DESIGN_TRUCK_REAR_SPACING_MIN_FT: float = 14.0
#: 3.6.1.2.2: greatest spacing between the two 32 kip axles, ft.
DESIGN_TRUCK_REAR_SPACING_MAX_FT: float = 30.0
#: 3.6.1.2.2 (Figure 3.6.1.2.2-1): transverse spacing of the wheels of an axle, ft.
WHEEL_GAUGE_FT: float = 6.0
#: 3.6.1.2.3: design tandem axle weights, kip.
DESIGN_TANDEM_AXLE_WEIGHTS_KIP: tuple[float, float] = (25.0, 25.0)
#: 3.6.1.2.3: design tandem axle spacing, ft.
DESIGN_TANDEM_SPACING_FT: float = 4.0
#: 3.6.1.2.4: design lane load, kip/ft.
DESIGN_LANE_LOAD_KLF: float = 0.64
#: 3.6.1.2.4: transverse width over which the lane load is spread, ft.
DESIGN_LANE_LOAD_WIDTH_FT: float = 10.0
#: 3.6.1.3.1: least distance from the centre of a wheel to the edge of the design lane for
#: the design of components other than the deck overhang, ft.
WHEEL_TO_LANE_EDGE_FT: float = 2.0
#: 3.6.1.4.1: the fatigue truck is one design truck with a constant 30 ft rear spacing, ft.
FATIGUE_TRUCK_REAR_SPACING_FT: float = 30.0
#: 3.6.1.1.1: width of a design lane, ft.
DESIGN_LANE_WIDTH_FT: float = 12.0

# --------------------------------------------------------------------------------------------
# 3.6.2.1: dynamic load allowance, Table 3.6.2.1-1 (as a fraction, not percent)
# --------------------------------------------------------------------------------------------

#: Table 3.6.2.1-1: deck joints, all limit states.
IM_DECK_JOINTS: float = 0.75
#: Table 3.6.2.1-1: all other components, fatigue and fracture limit state.
IM_FATIGUE: float = 0.15
#: Table 3.6.2.1-1: all other components, all other limit states.
IM_ALL_OTHER: float = 0.33

#: Table 3.6.1.1.2-1: multiple presence factor m for 1, 2, 3 and more than 3 loaded lanes.
MULTIPLE_PRESENCE_FACTORS: dict[int, float] = {1: 1.20, 2: 1.00, 3: 0.85}
#: Table 3.6.1.1.2-1: m for more than three loaded lanes.
MULTIPLE_PRESENCE_FACTOR_MORE_THAN_3: float = 0.65

# Ranges of applicability shared by Tables 4.6.2.2.2b-1, 4.6.2.2.3a-1, 4.6.2.2.2e-1 and
# 4.6.2.2.3c-1 for cross-section types "e" and "k".
_S_RANGE_FT = (3.5, 16.0)
_TS_RANGE_IN = (4.5, 12.0)
_L_RANGE_FT = (20.0, 240.0)
_KG_RANGE_IN4 = (10_000.0, 7_000_000.0)
_NB_MIN = 4
_DE_RANGE_FT = (-1.0, 5.5)


#: Relative round-off allowed at the ends of a range: a bound written in other units (42 in,
#: 1.0668 m for 3.5 ft) converts to 3.4999999... ft (the ranges are inclusive).
_RANGE_ROUND_OFF = 1e-9


def _check_range(name: str, value: float, lo: float, hi: float, unit: str, table: str) -> None:
    """Raise ValueError unless lo <= value <= hi, bounds included to round-off (NaN fails)."""
    tol = _RANGE_ROUND_OFF * max(abs(lo), abs(hi))
    if not (lo - tol <= value <= hi + tol):
        raise ValueError(
            f"{name} = {value:g} {unit} is outside the range of applicability "
            f"{lo:g} <= {name} <= {hi:g} {unit} of {table}"
        )


def _check_N_b(N_b: int, table: str) -> None:
    """Raise ValueError unless the number of beams is at least 4."""
    if N_b < _NB_MIN:
        raise ValueError(
            f"N_b = {N_b} is outside the range of applicability N_b >= {_NB_MIN} of {table} "
            "(for N_b = 3 the specification takes the lesser of the formula with N_b = 3 and "
            "the lever rule)"
        )


def _check_common(S: float, L: float, t_s: float, K_g: float, N_b: int, table: str) -> None:
    """Range checks of the interior-beam formulas for types e and k."""
    _check_range("S", S, *_S_RANGE_FT, "ft", table)
    _check_range("t_s", t_s, *_TS_RANGE_IN, "in", table)
    _check_range("L", L, *_L_RANGE_FT, "ft", table)
    _check_range("K_g", K_g, *_KG_RANGE_IN4, "in^4", table)
    _check_N_b(N_b, table)


def IM(case: Literal["other", "fatigue", "deck_joints"] = "other") -> float:
    """AASHTO LRFD 9th Ed. (2020) Table 3.6.2.1-1: dynamic load allowance IM, as a fraction.

    The static effect of the design truck or tandem is multiplied by (1 + IM); IM is not
    applied to the design lane load nor to pedestrian loads (3.6.2.1).

    Args:
        case: ``"other"`` for all other components at all other limit states (0.33),
            ``"fatigue"`` for all other components at the fatigue and fracture limit state
            (0.15), ``"deck_joints"`` for deck joints at all limit states (0.75).

    Returns:
        IM as a fraction (0.33 for 33 %).
    """
    values = {"other": IM_ALL_OTHER, "fatigue": IM_FATIGUE, "deck_joints": IM_DECK_JOINTS}
    if case not in values:
        raise ValueError(f"case must be one of {sorted(values)}, got {case!r}")
    return values[case]


def m_multiple_presence(n_loaded_lanes: int) -> float:
    """AASHTO LRFD 9th Ed. (2020) Table 3.6.1.1.2-1: multiple presence factor m.

    Args:
        n_loaded_lanes: number of loaded lanes (1 or more).

    Returns:
        m: 1.20 for one lane, 1.00 for two, 0.85 for three, 0.65 for more than three.
    """
    if int(n_loaded_lanes) != n_loaded_lanes or n_loaded_lanes < 1:
        raise ValueError(
            f"n_loaded_lanes must be an integer >= 1 (Table 3.6.1.1.2-1), got {n_loaded_lanes}"
        )
    return MULTIPLE_PRESENCE_FACTORS.get(int(n_loaded_lanes), MULTIPLE_PRESENCE_FACTOR_MORE_THAN_3)


def N_L(w_ft: float) -> int:
    """AASHTO LRFD 9th Ed. (2020) 3.6.1.1.1: number of design lanes, INT(w/12.0).

    Roadway widths from 20 to 24 ft have two design lanes, each half the roadway width.

    Args:
        w_ft: clear roadway width between curbs and/or barriers, ft.

    Returns:
        Number of design lanes.
    """
    if w_ft <= 0:
        raise ValueError(f"w_ft must be positive, got {w_ft}")
    if 20.0 <= w_ft <= 24.0:
        return 2
    return int(w_ft // DESIGN_LANE_WIDTH_FT)


def n_modular(E_B: float, E_D: float) -> float:
    """AASHTO LRFD 9th Ed. (2020) Eq. 4.6.2.2.1-2: modular ratio n = E_B / E_D.

    Args:
        E_B: modulus of elasticity of the beam material, ksi.
        E_D: modulus of elasticity of the deck material, ksi.

    Returns:
        n (dimensionless).
    """
    if E_B <= 0 or E_D <= 0:
        raise ValueError(f"E_B and E_D must be positive, got E_B={E_B}, E_D={E_D}")
    return E_B / E_D


def K_g(n: float, I: float, A: float, e_g: float) -> float:
    """AASHTO LRFD 9th Ed. (2020) Eq. 4.6.2.2.1-1: longitudinal stiffness Kg = n (I + A eg²).

    Args:
        n: modular ratio between beam and deck materials, Eq. 4.6.2.2.1-2.
        I: moment of inertia of the non-composite beam, in^4.
        A: area of the non-composite beam, in^2.
        e_g: distance between the centres of gravity of the non-composite beam and the deck,
            in.

    Returns:
        Kg in in^4.
    """
    if n <= 0 or I <= 0 or A <= 0:
        raise ValueError(f"n, I and A must be positive, got n={n}, I={I}, A={A}")
    return n * (I + A * e_g**2)


def g_moment_interior_one_lane(S: float, L: float, t_s: float, K_g: float, N_b: int) -> float:
    """AASHTO LRFD 9th Ed. (2020) Table 4.6.2.2.2b-1: moment in interior beams, one lane loaded.

    Types e and k: g = 0.06 + (S/14)^0.4 (S/L)^0.3 (Kg / (12.0 L ts³))^0.1. The multiple
    presence factor is included.

    Args:
        S: spacing of beams, ft (3.5 to 16.0).
        L: span of beam, ft (20 to 240).
        t_s: depth of the concrete slab, in (4.5 to 12.0).
        K_g: longitudinal stiffness parameter, Eq. 4.6.2.2.1-1, in^4 (10,000 to 7,000,000).
        N_b: number of beams (4 or more).

    Returns:
        Distribution factor, lanes per beam.
    """
    _check_common(S, L, t_s, K_g, N_b, "Table 4.6.2.2.2b-1")
    return 0.06 + (S / 14.0) ** 0.4 * (S / L) ** 0.3 * (K_g / (12.0 * L * t_s**3)) ** 0.1


def g_moment_interior_multi_lane(S: float, L: float, t_s: float, K_g: float, N_b: int) -> float:
    """AASHTO LRFD 9th Ed. (2020) Table 4.6.2.2.2b-1: moment in interior beams, 2+ lanes loaded.

    Types e and k: g = 0.075 + (S/9.5)^0.6 (S/L)^0.2 (Kg / (12.0 L ts³))^0.1. The multiple
    presence factors are included.

    Args:
        S: spacing of beams, ft (3.5 to 16.0).
        L: span of beam, ft (20 to 240).
        t_s: depth of the concrete slab, in (4.5 to 12.0).
        K_g: longitudinal stiffness parameter, Eq. 4.6.2.2.1-1, in^4 (10,000 to 7,000,000).
        N_b: number of beams (4 or more).

    Returns:
        Distribution factor, lanes per beam.
    """
    _check_common(S, L, t_s, K_g, N_b, "Table 4.6.2.2.2b-1")
    return 0.075 + (S / 9.5) ** 0.6 * (S / L) ** 0.2 * (K_g / (12.0 * L * t_s**3)) ** 0.1


def g_shear_interior_one_lane(S: float, L: float, t_s: float, K_g: float, N_b: int) -> float:
    """AASHTO LRFD 9th Ed. (2020) Table 4.6.2.2.3a-1: shear in interior beams, one lane loaded.

    Types e and k: g = 0.36 + S/25.0. L, t_s and K_g do not enter the formula but bound its
    range of applicability, so they are checked.

    Args:
        S: spacing of beams, ft (3.5 to 16.0).
        L: span of beam, ft (20 to 240).
        t_s: depth of the concrete slab, in (4.5 to 12.0).
        K_g: longitudinal stiffness parameter, Eq. 4.6.2.2.1-1, in^4 (10,000 to 7,000,000).
        N_b: number of beams (4 or more).

    Returns:
        Distribution factor, lanes per beam.
    """
    _check_common(S, L, t_s, K_g, N_b, "Table 4.6.2.2.3a-1")
    return 0.36 + S / 25.0


def g_shear_interior_multi_lane(S: float, L: float, t_s: float, K_g: float, N_b: int) -> float:
    """AASHTO LRFD 9th Ed. (2020) Table 4.6.2.2.3a-1: shear in interior beams, 2+ lanes loaded.

    Types e and k: g = 0.2 + S/12 - (S/35)^2.0. L, t_s and K_g bound the range of
    applicability and are checked.

    Args:
        S: spacing of beams, ft (3.5 to 16.0).
        L: span of beam, ft (20 to 240).
        t_s: depth of the concrete slab, in (4.5 to 12.0).
        K_g: longitudinal stiffness parameter, Eq. 4.6.2.2.1-1, in^4 (10,000 to 7,000,000).
        N_b: number of beams (4 or more).

    Returns:
        Distribution factor, lanes per beam.
    """
    _check_common(S, L, t_s, K_g, N_b, "Table 4.6.2.2.3a-1")
    return 0.2 + S / 12.0 - (S / 35.0) ** 2.0


def skew_factor_moment(
    theta_deg: float, S: float, L: float, t_s: float, K_g: float, N_b: int
) -> float:
    """AASHTO LRFD 9th Ed. (2020) Table 4.6.2.2.2e-1: reduction of moment factors for skew.

    Types e and k: 1 - c1 (tan θ)^1.5 with c1 = 0.25 (Kg / (12.0 L ts³))^0.25 (S/L)^0.5;
    c1 = 0 if θ < 30°, and θ = 60° is used if θ > 60° (as the table directs). The table's
    range of applicability is 30° <= θ <= 60° with those two rules, S 3.5 to 16.0 ft,
    L 20 to 240 ft, N_b >= 4.

    Args:
        theta_deg: skew angle θ, degrees (0 <= θ < 90).
        S: spacing of beams, ft.
        L: span of beam, ft.
        t_s: depth of the concrete slab, in (positive).
        K_g: longitudinal stiffness parameter, in^4 (positive).
        N_b: number of beams.

    Returns:
        Factor (<= 1) multiplying the moment distribution factor.
    """
    table = "Table 4.6.2.2.2e-1"
    if not (0.0 <= theta_deg < 90.0):
        raise ValueError(
            f"theta_deg = {theta_deg:g} deg must satisfy 0 <= theta_deg < 90 ({table})"
        )
    _check_range("S", S, *_S_RANGE_FT, "ft", table)
    _check_range("L", L, *_L_RANGE_FT, "ft", table)
    _check_N_b(N_b, table)
    if t_s <= 0 or K_g <= 0:
        raise ValueError(f"t_s and K_g must be positive, got t_s={t_s}, K_g={K_g}")
    if theta_deg < 30.0:
        return 1.0
    theta = math.radians(min(theta_deg, 60.0))
    c_1 = 0.25 * (K_g / (12.0 * L * t_s**3)) ** 0.25 * (S / L) ** 0.5
    return 1.0 - c_1 * math.tan(theta) ** 1.5


def skew_factor_shear(
    theta_deg: float, S: float, L: float, t_s: float, K_g: float, N_b: int
) -> float:
    """AASHTO LRFD 9th Ed. (2020) Table 4.6.2.2.3c-1: correction of shear factors for skew.

    Types e and k: 1.0 + 0.20 (12.0 L ts³ / Kg)^0.3 tan θ, for the exterior beam at the
    obtuse corner of the span (4.6.2.2.3c). Range 0° <= θ <= 60°, S 3.5 to 16.0 ft,
    L 20 to 240 ft, ts 4.5 to 12.0 in, N_b >= 4.

    Args:
        theta_deg: skew angle θ, degrees (0 to 60).
        S: spacing of beams, ft.
        L: span of beam, ft.
        t_s: depth of the concrete slab, in.
        K_g: longitudinal stiffness parameter, in^4 (positive).
        N_b: number of beams.

    Returns:
        Factor (>= 1) multiplying the shear distribution factor.
    """
    table = "Table 4.6.2.2.3c-1"
    _check_range("theta_deg", theta_deg, 0.0, 60.0, "deg", table)
    _check_range("S", S, *_S_RANGE_FT, "ft", table)
    _check_range("L", L, *_L_RANGE_FT, "ft", table)
    _check_range("t_s", t_s, *_TS_RANGE_IN, "in", table)
    _check_N_b(N_b, table)
    if K_g <= 0:
        raise ValueError(f"K_g must be positive, got {K_g}")
    return 1.0 + 0.20 * (12.0 * L * t_s**3 / K_g) ** 0.3 * math.tan(math.radians(theta_deg))


def e_moment_exterior(d_e: float) -> float:
    """AASHTO LRFD 9th Ed. (2020) Table 4.6.2.2.2d-1: exterior-beam moment, 2+ lanes: e factor.

    Types e and k: g_exterior = e g_interior with e = 0.77 + de/9.1; range -1.0 <= de <= 5.5
    ft. (With one lane loaded the table uses the lever rule, :func:`g_exterior_lever_rule`.)

    Args:
        d_e: distance from the centreline of the exterior web to the interior edge of the curb
            or traffic barrier, ft; positive when the web is inboard of the barrier.

    Returns:
        Correction factor e.
    """
    _check_range("d_e", d_e, *_DE_RANGE_FT, "ft", "Table 4.6.2.2.2d-1")
    return 0.77 + d_e / 9.1


def e_shear_exterior(d_e: float) -> float:
    """AASHTO LRFD 9th Ed. (2020) Table 4.6.2.2.3b-1: exterior-beam shear, 2+ lanes: e factor.

    Types e and k: g_exterior = e g_interior with e = 0.6 + de/10; range -1.0 <= de <= 5.5 ft.
    (With one lane loaded the table uses the lever rule, :func:`g_exterior_lever_rule`.)

    Args:
        d_e: distance from the centreline of the exterior web to the interior edge of the curb
            or traffic barrier, ft; positive when the web is inboard of the barrier.

    Returns:
        Correction factor e.
    """
    _check_range("d_e", d_e, *_DE_RANGE_FT, "ft", "Table 4.6.2.2.3b-1")
    return 0.6 + d_e / 10.0


def g_exterior_lever_rule(S: float, d_e: float, *, apply_multiple_presence: bool = True) -> float:
    """AASHTO LRFD 9th Ed. (2020) 4.6.2.2.1, Tables 4.6.2.2.2d-1 and 4.6.2.2.3b-1: lever rule.

    Exterior beam, one lane loaded. The deck is taken as hinged over the first interior beam
    and the reaction of the exterior beam is found by statics (C4.6.2.2.1). One truck is
    placed with the centre of its outer wheel 2.0 ft from the edge of the design lane, taken
    at the face of the barrier (3.6.1.3.1), and its inner wheel 6.0 ft further in
    (3.6.1.2.2). Each wheel carries half the axle. A wheel at or beyond the first interior
    beam adds nothing to the exterior beam. The multiple presence factor of one lane, 1.20,
    must be applied when the lever rule is used (3.6.1.1.2, 4.6.2.2.1) and is applied unless
    ``apply_multiple_presence`` is False (e.g. for fatigue, 3.6.1.1.2).

    Args:
        S: spacing between the exterior beam and the first interior beam, ft (positive).
        d_e: distance from the centreline of the exterior web to the interior face of the
            barrier, ft; positive when the web is inboard of the barrier (the wheel can then
            sit over the overhang, outboard of the web).
        apply_multiple_presence: multiply by m = 1.20 (Table 3.6.1.1.2-1).

    Returns:
        Distribution factor of the exterior beam, lanes per beam.
    """
    if S <= 0:
        raise ValueError(f"S must be positive, got {S}")
    x_outer = WHEEL_TO_LANE_EDGE_FT - d_e  # from the exterior web, positive inboard
    reaction = 0.0
    for x_wheel in (x_outer, x_outer + WHEEL_GAUGE_FT):
        if x_wheel < S:
            reaction += 0.5 * (S - x_wheel) / S
    return reaction * (m_multiple_presence(1) if apply_multiple_presence else 1.0)
