"""AASHTO LRFD 9th Ed. (2020) Section 5.4: concrete and prestressing steel properties."""

from __future__ import annotations

import math


def E_c(f_c_ksi: float, w_c_kcf: float, K_1: float = 1.0) -> float:
    """AASHTO LRFD 9th Ed. (2020) Eq. 5.4.2.4-1: modulus of elasticity of concrete.

    Ec = 120,000 K1 wc^2.0 f'c^0.33.

    Args:
        f_c_ksi: specified compressive strength f'c (or f'ci at transfer), ksi.
        w_c_kcf: unit weight of concrete, kcf (the spec allows 0.090 to 0.155 kcf).
        K_1: correction factor for source of aggregate (1.0 unless determined by test).

    Returns:
        Ec in ksi.
    """
    if f_c_ksi <= 0:
        raise ValueError(f"f_c_ksi must be positive, got {f_c_ksi}")
    if not 0.090 <= w_c_kcf <= 0.155:
        raise ValueError(f"w_c_kcf must be within 0.090 to 0.155 kcf (5.4.2.4), got {w_c_kcf:.4f}")
    if K_1 <= 0:
        raise ValueError(f"K_1 must be positive, got {K_1}")
    return 120_000.0 * K_1 * w_c_kcf**2.0 * f_c_ksi**0.33


def l_t(d_b: float) -> float:
    """AASHTO LRFD 9th Ed. (2020) 5.9.4.3.1: transfer length of a pretensioned strand, 60 d_b.

    Args:
        d_b: nominal strand diameter, any length unit.

    Returns:
        Transfer length in the unit of ``d_b``.
    """
    if d_b <= 0:
        raise ValueError(f"d_b must be positive, got {d_b}")
    return 60.0 * d_b


def f_r(f_c_ksi: float, lam: float = 1.0) -> float:
    """AASHTO LRFD 9th Ed. (2020) 5.4.2.6: modulus of rupture 0.24 λ √f'c, ksi (f'c in ksi)."""
    if f_c_ksi <= 0:
        raise ValueError(f"f_c_ksi must be positive, got {f_c_ksi}")
    return 0.24 * lam * math.sqrt(f_c_ksi)


def kappa_development(depth_in: float, debonded: bool) -> float:
    """AASHTO LRFD 9th Ed. (2020) 5.9.4.3.2 and 5.9.4.3.3: κ of the development length.

    κ = 1.0 for pretensioned members up to 24 in deep, 1.6 deeper; 2.0 for debonded strands
    (values from memory).
    """
    if debonded:
        return 2.0
    return 1.0 if depth_in <= 24.0 else 1.6


def l_d(kappa: float, f_ps: float, f_pe: float, d_b: float) -> float:
    """AASHTO LRFD 9th Ed. (2020) Eq. 5.9.4.3.2-1: development length ld ≥ κ (fps − 2/3 fpe) db.

    Args:
        kappa: κ (see :func:`kappa_development`).
        f_ps: average stress in the strand at nominal flexural resistance, ksi.
        f_pe: effective stress in the strand after losses, ksi.
        d_b: nominal strand diameter, in.

    Returns:
        ld in in.
    """
    if d_b <= 0 or kappa <= 0:
        raise ValueError("d_b and kappa must be positive")
    return kappa * (f_ps - 2.0 / 3.0 * f_pe) * d_b


def beta_1(f_c_ksi: float) -> float:
    """AASHTO LRFD 9th Ed. (2020) 5.6.2.2: stress-block factor β1 = 0.85 − 0.05 (f'c − 4) ≥ 0.65."""
    return min(0.85, max(0.65, 0.85 - 0.05 * (f_c_ksi - 4.0)))


def alpha_1(f_c_ksi: float) -> float:
    """AASHTO LRFD 9th Ed. (2020) 5.6.2.2: stress-block factor α1.

    α1 = 0.85 up to 10 ksi, reduced by 0.02 per ksi above 10 ksi, not below 0.75 (from
    memory).
    """
    return min(0.85, max(0.75, 0.85 - 0.02 * (f_c_ksi - 10.0)))


def f_ps_rectangular(
    A_ps: float, f_pu: float, f_py: float, d_p: float, b: float, f_c_ksi: float
) -> tuple[float, float]:
    """AASHTO LRFD 9th Ed. (2020) Eqs. 5.6.3.1.1-1, -2 and -4: fps for rectangular behaviour.

    fps = fpu (1 − k c/dp), k = 2 (1.04 − fpy/fpu), c = Aps fpu / (α1 f'c β1 b + k Aps fpu/dp),
    with α1 of 5.6.2.2 and no mild reinforcement (kip, in, ksi). The equations hold for
    fpe ≥ 0.5 fpu (5.6.3.1.1), which the caller checks.

    Returns:
        (fps in ksi, c in in).
    """
    k = 2.0 * (1.04 - f_py / f_pu)
    b1 = beta_1(f_c_ksi)
    c = A_ps * f_pu / (alpha_1(f_c_ksi) * f_c_ksi * b1 * b + k * A_ps * f_pu / d_p)
    return f_pu * (1.0 - k * c / d_p), c
