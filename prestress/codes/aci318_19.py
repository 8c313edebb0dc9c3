"""ACI 318-19, Building Code Requirements for Structural Concrete: selected equations."""

from __future__ import annotations

import math


def E_c(f_c_psi: float, w_c_pcf: float) -> float:
    """ACI 318-19 19.2.2.1(a): Ec = wc^1.5 33 √f'c, psi, for wc from 90 to 160 pcf.

    Args:
        f_c_psi: specified compressive strength f'c, psi.
        w_c_pcf: density of concrete wc, lb/ft^3.

    Returns:
        Ec in psi.
    """
    if f_c_psi <= 0:
        raise ValueError(f"f_c_psi must be positive, got {f_c_psi}")
    if not 90.0 <= w_c_pcf <= 160.0:
        raise ValueError(f"w_c_pcf must be within 90 to 160 pcf (19.2.2.1), got {w_c_pcf:.1f}")
    return w_c_pcf**1.5 * 33.0 * math.sqrt(f_c_psi)
