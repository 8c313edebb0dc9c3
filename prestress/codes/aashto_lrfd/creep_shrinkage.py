"""AASHTO LRFD 9th Ed. (2020) 5.4.2.3: creep coefficient and shrinkage strain of concrete.

US customary units as printed: V/S in in., f'ci in ksi, H in percent, t and ti in days.

Every factor is a pure function named after its symbol. Arguments may be floats or numpy
arrays (broadcast together); a float comes back when every argument is a scalar.

Range checks enforced here (``ValueError``):

* ``H`` (average annual ambient relative humidity) within 0 to 100 percent;
* ``V/S`` strictly positive; ks is floored at 1.0 as Eq. 5.4.2.3.2-2 states;
* ``f'ci`` strictly positive and below 25 ksi (at 25 ksi the term 12(100 − 4f'ci)/(f'ci + 20)
  of Eq. 5.4.2.3.2-5 reaches zero and the equation loses its meaning);
* ``t`` (maturity) at least 0 days; ``ti`` (age at loading) strictly positive.

Soft limit (``warnings.warn``): f'ci above 15.0 ksi, the upper strength for which
5.4.2.3.1 declares the creep and shrinkage equations applicable (from memory).

Definitions used (5.4.2.3.2, as printed): t is the *maturity* of concrete, the time in days
between loading (creep) or the end of curing (shrinkage) and the moment considered; ti is the
age of the concrete, in days, when the load is applied. So ψ(t, ti) here takes the duration
under load ``t``, not the age of the concrete at the end of that duration.
"""

from __future__ import annotations

import warnings

import numpy as np
from numpy.typing import ArrayLike, NDArray

from prestress.codes._args import ksi_mpa, worst

FloatOrArray = float | NDArray[np.float64]

#: Ultimate shrinkage strain basis of Eq. 5.4.2.3.3-1 (0.48 × 10⁻³).
EPSILON_SH_BASIS = 0.48e-3

#: Upper f'c for which 5.4.2.3.1 declares the equations applicable, ksi (from memory).
F_C_UPPER_KSI = 15.0


def _out(value: NDArray[np.float64]) -> FloatOrArray:
    """Return a Python float for a 0-d result, the array otherwise."""
    return float(value) if np.ndim(value) == 0 else value


def _check_H(H: ArrayLike) -> NDArray[np.float64]:
    h = np.asarray(H, dtype=float)
    if np.any(~np.isfinite(h)) or np.any(h < 0.0) or np.any(h > 100.0):
        raise ValueError(f"H must be a relative humidity from 0 to 100 percent, got {H}")
    return h


def _check_f_ci(f_ci: ArrayLike) -> NDArray[np.float64]:
    f = np.asarray(f_ci, dtype=float)
    if np.any(~np.isfinite(f)) or np.any(f <= 0.0) or np.any(f >= 25.0):
        raise ValueError(f"f_ci must be a strength in ksi greater than 0 and below 25, got {f_ci}")
    if np.any(f > F_C_UPPER_KSI):
        warnings.warn(
            f"f'ci = {ksi_mpa(worst(f, True))} exceeds {ksi_mpa(F_C_UPPER_KSI)}, the upper "
            "strength of the AASHTO LRFD 5.4.2.3 creep and shrinkage equations",
            stacklevel=3,
        )
    return f


def k_s(V_S: ArrayLike) -> FloatOrArray:
    """AASHTO LRFD 9th Ed. (2020) Eq. 5.4.2.3.2-2: volume-to-surface factor ks.

    ks = 1.45 − 0.13 (V/S) ≥ 1.0.

    The same factor enters the shrinkage strain (5.4.2.3.3). The floor of 1.0 governs from
    V/S ≥ 3.46 in.

    Args:
        V_S: volume-to-surface ratio, in. (strictly positive).

    Returns:
        ks (dimensionless, at least 1.0).

    Raises:
        ValueError: if V/S is not strictly positive.
    """
    vs = np.asarray(V_S, dtype=float)
    if np.any(~np.isfinite(vs)) or np.any(vs <= 0.0):
        raise ValueError(f"V_S must be a volume-to-surface ratio in in. greater than 0, got {V_S}")
    return _out(np.maximum(1.45 - 0.13 * vs, 1.0))


def k_hc(H: ArrayLike) -> FloatOrArray:
    """AASHTO LRFD 9th Ed. (2020) Eq. 5.4.2.3.2-3: humidity factor for creep khc = 1.56 − 0.008 H.

    Args:
        H: average annual ambient relative humidity, percent (0 to 100).

    Returns:
        khc (dimensionless).
    """
    return _out(1.56 - 0.008 * _check_H(H))


def k_hs(H: ArrayLike) -> FloatOrArray:
    """AASHTO LRFD 9th Ed. (2020) Eq. 5.4.2.3.3-2: humidity factor for shrinkage, 2.00 − 0.014 H.

    Args:
        H: average annual ambient relative humidity, percent (0 to 100).

    Returns:
        khs (dimensionless).
    """
    return _out(2.00 - 0.014 * _check_H(H))


def k_f(f_ci: ArrayLike) -> FloatOrArray:
    """AASHTO LRFD 9th Ed. (2020) Eq. 5.4.2.3.2-4: concrete strength factor kf = 5 / (1 + f'ci).

    5.4.2.3.2 defines f'ci as the specified compressive strength at prestressing for
    pretensioned members, or at initial loading for other members; where the age at initial
    loading is unknown at design time it may be taken as 0.80 f'c.

    Args:
        f_ci: f'ci, ksi.

    Returns:
        kf (dimensionless).
    """
    return _out(5.0 / (1.0 + _check_f_ci(f_ci)))


def k_td(t: ArrayLike, f_ci: ArrayLike) -> FloatOrArray:
    """AASHTO LRFD 9th Ed. (2020) Eq. 5.4.2.3.2-5: time development factor.

    ktd = t / [12 (100 − 4 f'ci) / (f'ci + 20) + t]

    Args:
        t: maturity of the concrete, days: the time since loading (creep) or since the end of
            curing (shrinkage) up to the moment considered; at least 0. Vectorised.
        f_ci: f'ci, ksi (see :func:`k_f`).

    Returns:
        ktd (dimensionless, 0 at t = 0, tending to 1).
    """
    tt = np.asarray(t, dtype=float)
    if np.any(~np.isfinite(tt)) or np.any(tt < 0.0):
        raise ValueError(f"t must be a maturity in days of at least 0, got {t}")
    f = _check_f_ci(f_ci)
    return _out(tt / (12.0 * (100.0 - 4.0 * f) / (f + 20.0) + tt))


def psi(
    t: ArrayLike,
    t_i: ArrayLike,
    V_S: ArrayLike,
    H: ArrayLike,
    f_ci: ArrayLike,
) -> FloatOrArray:
    """AASHTO LRFD 9th Ed. (2020) Eq. 5.4.2.3.2-1: creep coefficient ψ(t, ti).

    ψ(t, ti) = 1.9 ks khc kf ktd ti^−0.118

    Args:
        t: maturity, days: time under load, from loading to the moment considered (≥ 0).
        t_i: age of the concrete when the load is applied, days (> 0).
        V_S: volume-to-surface ratio, in.
        H: average annual ambient relative humidity, percent.
        f_ci: f'ci, ksi.

    Returns:
        Creep coefficient ψ (ratio of creep strain to the initial elastic strain).
    """
    ti = np.asarray(t_i, dtype=float)
    if np.any(~np.isfinite(ti)) or np.any(ti <= 0.0):
        raise ValueError(f"t_i must be an age at loading in days greater than 0, got {t_i}")
    value = (
        1.9
        * np.asarray(k_s(V_S))
        * np.asarray(k_hc(H))
        * np.asarray(k_f(f_ci))
        * np.asarray(k_td(t, f_ci))
        * ti**-0.118
    )
    return _out(value)


def epsilon_sh(t: ArrayLike, V_S: ArrayLike, H: ArrayLike, f_ci: ArrayLike) -> FloatOrArray:
    """AASHTO LRFD 9th Ed. (2020) Eq. 5.4.2.3.3-1: shrinkage strain εsh = ks khs kf ktd 0.48 × 10⁻³.

    Returned as a positive magnitude (a shortening), as the 9th Edition prints it.

    Args:
        t: drying time, days: from the end of curing to the moment considered (≥ 0).
        V_S: volume-to-surface ratio, in.
        H: average annual ambient relative humidity, percent.
        f_ci: f'ci, ksi.

    Returns:
        Shrinkage strain (dimensionless, positive).
    """
    value = (
        np.asarray(k_s(V_S))
        * np.asarray(k_hs(H))
        * np.asarray(k_f(f_ci))
        * np.asarray(k_td(t, f_ci))
        * EPSILON_SH_BASIS
    )
    return _out(value)
