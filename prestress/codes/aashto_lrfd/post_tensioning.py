"""AASHTO LRFD 9th Ed. (2020) Art. 5.9.3.2: instantaneous losses in post-tensioned members.

Pure functions in the units printed in the specification (ksi, in, ft, rad):

- friction, Art. 5.9.3.2.2b, Eq. 5.9.3.2.2b-1 (:func:`delta_f_pF`), with the typical
  coefficients of Table 5.9.3.2.2b-1 (:data:`TYPICAL_FRICTION_COEFFICIENTS`, values from memory);
- elastic shortening from sequential stressing, Art. 5.9.3.2.3b, Eq. 5.9.3.2.3b-1
  (:func:`delta_f_pES_post_tensioned`);
- the anchor-set (wedge-seat, draw-in) relations used by the area method
  (:func:`delta_set_from_area`, :func:`x_set_linear`, :func:`delta_f_pA_linear`,
  :func:`delta_f_pA_linear_long_set`). These are not equations of the specification; they are the
  textbook equal-area relations (e.g. Collins, M.P. and Mitchell, D., *Prestressed Concrete
  Structures*, Prentice Hall, 1991, treatment of anchorage set; also the PTI *Post-Tensioning
  Manual*), written here `from memory`; no page or clause is cited for them;
- the stress limits of the post-tensioning steel, Table 5.9.2.2-1
  (:data:`TENDON_STRESS_LIMITS`, :func:`f_p_limits_post_tensioned`, values from memory);
- the size of ducts for multi-strand tendons, Art. 5.4.6.2 (:func:`duct_area_ratio_ok`, from
  memory).

Losses are returned as positive numbers (a loss reduces the strand stress).
"""

import math
from dataclasses import dataclass, replace
from types import MappingProxyType

import numpy as np
from numpy.typing import ArrayLike, NDArray

__all__ = [
    "DUCT_AREA_RATIO_MIN",
    "TENDON_STRESS_LIMITS",
    "TYPICAL_FRICTION_COEFFICIENTS",
    "FrictionCoefficients",
    "TendonStressLimit",
    "delta_f_pA_linear",
    "delta_f_pA_linear_long_set",
    "delta_f_pES_post_tensioned",
    "delta_f_pF",
    "delta_set_from_area",
    "duct_area_ratio_ok",
    "f_p_limits_post_tensioned",
    "x_set_linear",
]


@dataclass(frozen=True)
class FrictionCoefficients:
    """Wobble and curvature friction coefficients for one steel/duct combination.

    Attributes:
        K_per_ft: Wobble friction coefficient K, per ft of tendon.
        mu_min: Lower end of the curvature friction coefficient range, per rad.
        mu_max: Upper end of the range (equal to ``mu_min`` where a single value is given).
    """

    K_per_ft: float
    mu_min: float
    mu_max: float


# AASHTO LRFD 9th Ed. (2020) Table 5.9.3.2.2b-1, "Friction Coefficients for Post-Tensioning
# Tendons". Every value below is `from memory` (the printed table was not at hand when this was
# written): check it against the specification before relying on it. The specification notes
# that the values are typical and that the designer should use values for the system adopted.
TYPICAL_FRICTION_COEFFICIENTS: MappingProxyType[str, FrictionCoefficients] = MappingProxyType(
    {
        # Wire or strand, rigid and semirigid galvanized metal sheathing: K 0.0002, mu 0.15-0.25.
        "strand, galvanized metal sheathing": FrictionCoefficients(0.0002, 0.15, 0.25),
        # Wire or strand, polyethylene duct: K 0.0002, mu 0.23.
        "strand, polyethylene duct": FrictionCoefficients(0.0002, 0.23, 0.23),
        # Wire or strand, rigid steel pipe deviators for external tendons: K 0.0002, mu 0.25.
        "strand, rigid steel pipe deviator": FrictionCoefficients(0.0002, 0.25, 0.25),
        # High-strength bars, galvanized metal sheathing: K 0.0002, mu 0.30.
        "bar, galvanized metal sheathing": FrictionCoefficients(0.0002, 0.30, 0.30),
    }
)


def _array(name: str, value: ArrayLike) -> NDArray[np.float64]:
    arr = np.asarray(value, dtype=float)
    if not np.all(np.isfinite(arr)):
        raise ValueError(f"{name} must be finite, got {value!r}")
    return arr


def _non_negative(name: str, value: ArrayLike, unit: str) -> NDArray[np.float64]:
    arr = _array(name, value)
    if np.any(arr < 0.0):
        raise ValueError(f"{name} must be >= 0 {unit}, got {value!r}")
    return arr


def _positive(name: str, value: ArrayLike, unit: str) -> NDArray[np.float64]:
    arr = _array(name, value)
    if np.any(arr <= 0.0):
        raise ValueError(f"{name} must be > 0 {unit}, got {value!r}")
    return arr


def _out(arr: NDArray[np.float64]) -> float | NDArray[np.float64]:
    return float(arr) if arr.ndim == 0 else arr


def delta_f_pF(
    f_pj: ArrayLike, K: ArrayLike, x: ArrayLike, mu: ArrayLike, alpha: ArrayLike
) -> float | NDArray[np.float64]:
    """AASHTO LRFD 9th Ed. (2020) Eq. 5.9.3.2.2b-1: friction loss in post-tensioned steel.

    ΔfpF = fpj (1 − e^−(K x + μ α)).

    Args:
        f_pj: Stress in the prestressing steel at jacking, ksi (> 0).
        K: Wobble friction coefficient, per ft of tendon (>= 0).
        x: Length of tendon from the jacking end to the point considered, ft (>= 0).
        mu: Coefficient of friction (curvature), per rad (>= 0).
        alpha: Sum of the absolute values of angular change of the tendon path from the jacking
            end to the point considered, rad (>= 0).

    Returns:
        Friction loss ΔfpF, ksi (positive); a float for scalar inputs, else an array
        broadcast over the inputs.

    Raises:
        ValueError: If an argument is negative (``f_pj`` not positive) or not finite.
    """
    fpj = _positive("f_pj", f_pj, "ksi")
    k = _non_negative("K", K, "per ft")
    length = _non_negative("x", x, "ft")
    friction = _non_negative("mu", mu, "per rad")
    angle = _non_negative("alpha", alpha, "rad")
    return _out(fpj * -np.expm1(-(k * length + friction * angle)))


def delta_f_pES_post_tensioned(N: int, E_p: float, E_ci: float, f_cgp: float) -> float:
    """AASHTO LRFD 9th Ed. (2020) Eq. 5.9.3.2.3b-1: elastic shortening, sequential stressing.

    ΔfpES = (N − 1)/(2 N) · (Ep/Eci) · fcgp: the average loss of N identical tendons stressed one
    after another, each shortened by the tendons stressed after it.

    Args:
        N: Number of identical prestressing tendons (>= 1). N = 1 gives no loss.
        E_p: Modulus of elasticity of the prestressing steel, ksi (> 0).
        E_ci: Modulus of elasticity of the concrete at the time of stressing, ksi (> 0).
        f_cgp: Concrete stress at the center of gravity of the prestressing tendons due to the
            prestressing force after jacking and the self-weight of the member at the sections
            of maximum moment, ksi. As printed, a compressive stress is a POSITIVE magnitude here
            (engine code with compression negative passes ``-sigma``).

    Returns:
        Loss ΔfpES, ksi (positive).

    Raises:
        ValueError: If ``N`` is not an integer >= 1, a modulus is not positive, or ``f_cgp`` is
            negative (net tension at the tendon level is outside the model).
    """
    if isinstance(N, bool) or not isinstance(N, int | np.integer) or N < 1:
        raise ValueError(f"N must be an integer >= 1 (number of tendons), got {N!r}")
    ep = float(_positive("E_p", E_p, "ksi"))
    eci = float(_positive("E_ci", E_ci, "ksi"))
    fcgp = float(_non_negative("f_cgp", f_cgp, "ksi (compression as a positive magnitude)"))
    return (N - 1) / (2.0 * N) * (ep / eci) * fcgp


def delta_set_from_area(area: float, E_p: float) -> float:
    """Area method, anchor set (textbook equal-area relation, from memory): Δset = A / Ep.

    The strand shortening that the wedges allow is the integral, over the affected length, of the
    strain lost: Δset = (1/Ep) ∫ Δf(x) dx, where Δf(x) is the stress lost to the set.

    Args:
        area: Area between the stress diagram after friction and after anchor set, ksi·in (>= 0).
        E_p: Modulus of elasticity of the prestressing steel, ksi (> 0).

    Returns:
        Anchor set (draw-in) that the area corresponds to, in.

    Raises:
        ValueError: If ``area`` is negative or ``E_p`` not positive.
    """
    a = float(_non_negative("area", area, "ksi*in"))
    ep = float(_positive("E_p", E_p, "ksi"))
    return a / ep


def x_set_linear(E_p: float, delta_set: float, p: float) -> float:
    """Area method, anchor set (textbook closed form, from memory): x_set = sqrt(Ep Δset / p).

    For a friction diagram that falls linearly, f(x) = fpj − p x, the stress after set near the
    anchor is its mirror image about the stress at x_set, so the area lost is p x_set² and
    Δset = p x_set² / Ep. Valid while x_set does not exceed the tendon length (else use
    :func:`delta_f_pA_linear_long_set`).

    Args:
        E_p: Modulus of elasticity of the prestressing steel, ksi (> 0).
        delta_set: Anchor set (wedge seat), in (>= 0).
        p: Friction loss per unit length of tendon (slope of the friction diagram), ksi/in (> 0).

    Returns:
        Length affected by the anchor set, x_set, in.

    Raises:
        ValueError: If an argument is out of range.
    """
    ep = float(_positive("E_p", E_p, "ksi"))
    d = float(_non_negative("delta_set", delta_set, "in"))
    slope = float(_positive("p", p, "ksi/in"))
    return math.sqrt(ep * d / slope)


def delta_f_pA_linear(p: float, x_set: float) -> float:
    """Area method, anchor set (textbook closed form, from memory): ΔfpA = 2 p x_set.

    Stress lost at the anchorage for a linear friction diagram of slope ``p`` when the affected
    length ``x_set`` lies within the tendon; the loss falls linearly (slope 2 p) to zero at x_set.

    Args:
        p: Friction loss per unit length of tendon, ksi/in (>= 0).
        x_set: Length affected by the anchor set, in (>= 0).

    Returns:
        Loss at the anchorage ΔfpA, ksi (positive).

    Raises:
        ValueError: If an argument is negative.
    """
    slope = float(_non_negative("p", p, "ksi/in"))
    length = float(_non_negative("x_set", x_set, "in"))
    return 2.0 * slope * length


def delta_f_pA_linear_long_set(
    E_p: float, delta_set: float, p: float, L: float
) -> tuple[float, float]:
    """Area method, anchor set reaching the far end (textbook relation, from memory).

    When sqrt(Ep Δset / p) > L, the set loss reaches the dead end. The stress after set is the
    mirror image of the (linear) friction diagram lowered by a uniform amount c, with
    p L² + c L = Ep Δset, so the loss is p L + Ep Δset / L at the anchorage and
    Ep Δset / L − p L at the far end. With p = 0 both reduce to the short-tendon value Ep Δset / L.

    Args:
        E_p: Modulus of elasticity of the prestressing steel, ksi (> 0).
        delta_set: Anchor set (wedge seat), in (>= 0).
        p: Friction loss per unit length of tendon, ksi/in (>= 0).
        L: Tendon length from the stressing anchorage to the far end, in (> 0).

    Returns:
        (loss at the stressing anchorage, loss at the far end), ksi.

    Raises:
        ValueError: If an argument is out of range or the set does not reach the far end
            (Ep Δset < p L²; use :func:`x_set_linear`).
    """
    ep = float(_positive("E_p", E_p, "ksi"))
    d = float(_non_negative("delta_set", delta_set, "in"))
    slope = float(_non_negative("p", p, "ksi/in"))
    length = float(_positive("L", L, "in"))
    if ep * d < slope * length**2:
        raise ValueError(
            "delta_set does not reach the far end (E_p*delta_set < p*L**2); use x_set_linear"
        )
    c = ep * d / length - slope * length
    return slope * length + ep * d / length, c


# --------------------------------------------------------------------------- stress limits
@dataclass(frozen=True)
class TendonStressLimit:
    """One row of AASHTO LRFD 9th Ed. (2020) Table 5.9.2.2-1 for post-tensioning.

    Attributes:
        key: ``"prior_to_seating"``, ``"anchorage_after_set"``, ``"elsewhere_after_set"`` or
            ``"service"``.
        condition: the condition in the words of the table.
        fraction: the limit as a fraction of ``of``.
        of: ``"fpy"`` or ``"fpu"``.
    """

    key: str
    condition: str
    fraction: float
    of: str

    @property
    def text(self) -> str:
        """The limit in words, e.g. ``"0.70 fpu"``."""
        return f"{self.fraction:.2f} {self.of}"


# AASHTO LRFD 9th Ed. (2020) Table 5.9.2.2-1, "Stress Limits for Prestressing Steel",
# post-tensioning rows. Every value is `from memory` (the printed table was not at hand): check
# it against the specification before relying on it.
_LOW_RELAXATION_LIMITS = (
    TendonStressLimit(
        "prior_to_seating", "prior to seating, short-term fpbt may be allowed", 0.90, "fpy"
    ),
    TendonStressLimit(
        "anchorage_after_set",
        "at anchorages and couplers immediately after anchor set",
        0.70,
        "fpu",
    ),
    TendonStressLimit(
        "elsewhere_after_set",
        "elsewhere along the length of the member away from anchorages and couplers "
        "immediately after anchor set",
        0.74,
        "fpu",
    ),
    TendonStressLimit("service", "at the service limit state after all losses, fpe", 0.80, "fpy"),
)

TENDON_STRESS_LIMITS: MappingProxyType[str, tuple[TendonStressLimit, ...]] = MappingProxyType(
    {
        "low": _LOW_RELAXATION_LIMITS,
        # stress-relieved strand: the same rows, 0.70 fpu away from the anchorages too
        "stress-relieved": tuple(
            replace(r, fraction=0.70) if r.key == "elsewhere_after_set" else r
            for r in _LOW_RELAXATION_LIMITS
        ),
    }
)


def f_p_limits_post_tensioned(
    f_pu: float, f_py: float, relaxation: str = "low"
) -> dict[str, tuple[TendonStressLimit, float]]:
    """AASHTO LRFD 9th Ed. (2020) Table 5.9.2.2-1: stress limits for post-tensioning steel.

    Values from memory (see :data:`TENDON_STRESS_LIMITS`). Low-relaxation strand: 0.90 fpy prior
    to seating; 0.70 fpu at anchorages and couplers immediately after anchor set; 0.74 fpu
    elsewhere along the length, away from anchorages and couplers, immediately after anchor set;
    0.80 fpy at the service limit state after all losses. Stress-relieved strand: the same but
    0.70 fpu elsewhere after anchor set.

    Args:
        f_pu: Specified tensile strength of the prestressing steel, ksi (> 0).
        f_py: Yield strength of the prestressing steel, ksi (> 0).
        relaxation: ``"low"`` (low-relaxation strand) or ``"stress-relieved"``.

    Returns:
        For each row key, the row and its limit stress in ksi.

    Raises:
        ValueError: If a strength is not positive or the relaxation type is unknown.
    """
    fpu = float(_positive("f_pu", f_pu, "ksi"))
    fpy = float(_positive("f_py", f_py, "ksi"))
    if relaxation not in TENDON_STRESS_LIMITS:
        raise ValueError(
            f"relaxation must be one of {tuple(TENDON_STRESS_LIMITS)}, got {relaxation!r}"
        )
    base = {"fpu": fpu, "fpy": fpy}
    return {r.key: (r, r.fraction * base[r.of]) for r in TENDON_STRESS_LIMITS[relaxation]}


#: AASHTO LRFD 9th Ed. (2020) Art. 5.4.6.2 (from memory): for tendons of several strands the
#: inside area of the duct is at least 2.0 times the net area of the prestressing steel (2.5
#: where the tendons are placed by the pull-through method).
DUCT_AREA_RATIO_MIN = 2.0


def duct_area_ratio_ok(
    duct_inside_diameter: float, A_ps: float, ratio: float = DUCT_AREA_RATIO_MIN
) -> tuple[float, bool]:
    """AASHTO LRFD 9th Ed. (2020) Art. 5.4.6.2: duct area against the strand area (from memory).

    Args:
        duct_inside_diameter: Inside diameter of the duct, in (> 0). Given the outside diameter
            instead, the ratio is an upper bound (the inside area is smaller).
        A_ps: Net area of the prestressing steel in the duct, in^2 (> 0).
        ratio: Least ratio of the duct area to the steel area (2.0; 2.5 for pull-through).

    Returns:
        (duct area / A_ps, True if it is at least ``ratio``).

    Raises:
        ValueError: If an argument is not positive.
    """
    d = float(_positive("duct_inside_diameter", duct_inside_diameter, "in"))
    a = float(_positive("A_ps", A_ps, "in^2"))
    r = float(_positive("ratio", ratio, "(ratio)"))
    got = math.pi * d * d / 4.0 / a
    return got, got >= r * (1.0 - 1e-12)
