"""EN 1992-1-1:2004 Section 3.1: concrete strength and modulus (Table 3.1)."""

from __future__ import annotations


def f_cm(f_ck: float) -> float:
    """EN 1992-1-1:2004 Table 3.1: mean compressive strength fcm = fck + 8, MPa."""
    if f_ck <= 0:
        raise ValueError(f"f_ck must be positive, got {f_ck}")
    return f_ck + 8.0


def f_ctm(f_ck: float) -> float:
    """EN 1992-1-1:2004 Table 3.1: mean axial tensile strength fctm, MPa.

    fctm = 0.30 fck^(2/3) up to C50/60; fctm = 2.12 ln(1 + fcm/10) above C50/60.

    Args:
        f_ck: characteristic cylinder strength fck, MPa (positive).

    Returns:
        fctm, MPa.
    """
    import math

    if f_ck <= 0:
        raise ValueError(f"f_ck must be positive, got {f_ck}")
    if f_ck <= 50.0:
        return 0.30 * f_ck ** (2.0 / 3.0)
    return 2.12 * math.log(1.0 + f_cm(f_ck) / 10.0)


def E_cm(f_cm_mpa: float) -> float:
    """EN 1992-1-1:2004 Table 3.1: secant modulus Ecm = 22 (fcm/10)^0.3, GPa → returned in MPa.

    Args:
        f_cm_mpa: mean compressive strength fcm, MPa.

    Returns:
        Ecm in MPa (quartzite aggregates; 3.1.3(2) reduces it by 10% for limestone).
    """
    if f_cm_mpa <= 0:
        raise ValueError(f"f_cm_mpa must be positive, got {f_cm_mpa}")
    return 22_000.0 * (f_cm_mpa / 10.0) ** 0.3
