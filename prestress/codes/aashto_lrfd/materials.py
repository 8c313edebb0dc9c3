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
