"""AASHTO LRFD 9th Ed. (2020) 5.9.3.4.2c and 5.9.3.4.3c: relaxation of prestressing strand.

Also the intrinsic log-time relaxation law used in time-step analyses (Magura, Sozen & Siess,
1964). AASHTO terms are in ksi as printed. The log-time law is a ratio, so any consistent stress
unit works there.

Strand classes are given as strings: ``"low_relaxation"`` or ``"stress_relieved"``.

Not implemented: a reduction of the intrinsic relaxation for the simultaneous shortening of
the concrete by creep and shrinkage (such as the reduced relaxation coefficient χr of Ghali,
Favre & Elbadry). No published table or formula for it could be checked here, so none is
offered rather than one recalled from memory.
"""

from __future__ import annotations

from typing import Literal

import numpy as np
from numpy.typing import ArrayLike, NDArray

StrandClass = Literal["low_relaxation", "stress_relieved"]

FloatOrArray = float | NDArray[np.float64]

#: AASHTO LRFD 9th Ed. (2020) 5.9.3.4.2c: KL for low-relaxation strand.
K_L_LOW_RELAXATION = 30.0
#: AASHTO LRFD 9th Ed. (2020) 5.9.3.4.2c: KL for other (stress-relieved) prestressing steel.
K_L_STRESS_RELIEVED = 7.0
#: AASHTO LRFD 9th Ed. (2020) 5.9.3.4.2c: ΔfpR1 "may be assumed equal to 1.2 ksi for
#: low-relaxation strands", ksi.
DELTA_F_PR1_LOW_RELAXATION_SIMPLIFIED_KSI = 1.2

#: Log-time constant C for stress-relieved strand (Magura, Sozen & Siess 1964).
C_STRESS_RELIEVED = 10.0
#: Log-time constant C for low-relaxation strand, the value in common use in PCI literature
#: (from memory).
C_LOW_RELAXATION = 45.0


def _check_strand(strand: str) -> None:
    if strand not in ("low_relaxation", "stress_relieved"):
        raise ValueError(f"strand must be 'low_relaxation' or 'stress_relieved', got {strand!r}")


def K_L(strand: StrandClass) -> float:
    """AASHTO LRFD 9th Ed. (2020) 5.9.3.4.2c: KL = 30 for low-relaxation strand, 7 otherwise.

    Args:
        strand: ``"low_relaxation"`` or ``"stress_relieved"``.

    Returns:
        KL (dimensionless).
    """
    _check_strand(strand)
    return K_L_LOW_RELAXATION if strand == "low_relaxation" else K_L_STRESS_RELIEVED


def delta_f_pR1(
    f_pt: float,
    f_py: float,
    strand: StrandClass = "low_relaxation",
    simplified: bool = False,
) -> float:
    """AASHTO LRFD 9th Ed. (2020) Eq. 5.9.3.4.2c-1: relaxation between transfer and deck placement.

    ΔfpR1 = fpt / KL (fpt / fpy − 0.55), with fpt taken not less than 0.55 fpy (so the loss
    is zero for strand stressed below 0.55 fpy).

    With ``simplified=True`` the clause's alternative for low-relaxation strand is returned:
    ΔfpR1 = 1.2 ksi.

    Args:
        f_pt: stress in the prestressing strands immediately after transfer, ksi (> 0).
        f_py: yield strength of the prestressing steel, ksi (> 0).
        strand: ``"low_relaxation"`` (KL = 30) or ``"stress_relieved"`` (KL = 7).
        simplified: return the 1.2 ksi value the clause allows for low-relaxation strand.

    Returns:
        ΔfpR1, ksi (positive is a loss).

    Raises:
        ValueError: for non-positive stresses, an unknown strand class, or ``simplified``
            with stress-relieved strand (the 1.2 ksi value is for low-relaxation strand only).
    """
    _check_strand(strand)
    if simplified:
        if strand != "low_relaxation":
            raise ValueError(
                "simplified: the 1.2 ksi value of 5.9.3.4.2c applies to low-relaxation strand only"
            )
        return DELTA_F_PR1_LOW_RELAXATION_SIMPLIFIED_KSI
    if f_pt <= 0.0:
        raise ValueError(f"f_pt must be a stress in ksi greater than 0, got {f_pt}")
    if f_py <= 0.0:
        raise ValueError(f"f_py must be a stress in ksi greater than 0, got {f_py}")
    f_pt_eff = max(f_pt, 0.55 * f_py)
    return f_pt_eff / K_L(strand) * (f_pt_eff / f_py - 0.55)


def delta_f_pR2(
    f_pt: float,
    f_py: float,
    strand: StrandClass = "low_relaxation",
    simplified: bool = False,
) -> float:
    """AASHTO LRFD 9th Ed. (2020) Eq. 5.9.3.4.3c-1: relaxation after deck placement, ΔfpR2 = ΔfpR1.

    Args:
        f_pt: stress in the strands immediately after transfer, ksi.
        f_py: yield strength of the prestressing steel, ksi.
        strand: ``"low_relaxation"`` or ``"stress_relieved"``.
        simplified: use the 1.2 ksi value for low-relaxation strand (see :func:`delta_f_pR1`).

    Returns:
        ΔfpR2, ksi (positive is a loss).
    """
    return delta_f_pR1(f_pt, f_py, strand=strand, simplified=simplified)


def log_time_constant(strand: StrandClass) -> float:
    """Constant C of the log-time relaxation law: 10 stress-relieved, 45 low-relaxation.

    Magura, Sozen & Siess (1964), "A study of stress relaxation in prestressing
    reinforcement", PCI Journal 9(2), give C = 10 for stress-relieved strand; C = 45 for
    low-relaxation strand is the value in common use in PCI literature (from memory).

    Args:
        strand: ``"low_relaxation"`` or ``"stress_relieved"``.

    Returns:
        C (dimensionless).
    """
    _check_strand(strand)
    return C_LOW_RELAXATION if strand == "low_relaxation" else C_STRESS_RELIEVED


def _log10_hours(t_hours: ArrayLike, name: str) -> NDArray[np.float64]:
    t = np.asarray(t_hours, dtype=float)
    if np.any(~np.isfinite(t)) or np.any(t < 0.0):
        raise ValueError(f"{name} must be a time in hours of at least 0, got {t_hours}")
    # The law is written for t >= 1 h (log10 t >= 0); earlier times give no relaxation.
    return np.log10(np.maximum(t, 1.0))


def _stress_ratio_term(f_pi: float, f_py: float) -> float:
    if f_pi <= 0.0:
        raise ValueError(f"f_pi must be a stress greater than 0, got {f_pi}")
    if f_py <= 0.0:
        raise ValueError(f"f_py must be a stress greater than 0, got {f_py}")
    return max(f_pi / f_py - 0.55, 0.0)


def f_pR_log_time(
    t_hours: ArrayLike,
    f_pi: float,
    f_py: float,
    strand: StrandClass = "low_relaxation",
) -> FloatOrArray:
    """Magura, Sozen & Siess (1964), PCI Journal 9(2): intrinsic relaxation at constant strain.

    fpR / fpi = log10(t) / C · (fpi / fpy − 0.55), t in hours, C from
    :func:`log_time_constant`. Zero when fpi / fpy ≤ 0.55. The law is written for t ≥ 1 h;
    this function returns zero for 0 ≤ t < 1 h (a choice of this module).

    Args:
        t_hours: time since stressing, hours (≥ 0). Vectorised.
        f_pi: initial stress in the strand, any stress unit (> 0).
        f_py: yield strength of the strand, same unit (> 0).
        strand: ``"low_relaxation"`` or ``"stress_relieved"``.

    Returns:
        Relaxation loss fpR in the unit of ``f_pi`` (positive is a loss).
    """
    ratio = _stress_ratio_term(f_pi, f_py)
    C = log_time_constant(strand)
    value = f_pi * _log10_hours(t_hours, "t_hours") / C * ratio
    return float(value) if np.ndim(value) == 0 else value


def f_pR_log_time_between(
    t1_hours: ArrayLike,
    t2_hours: ArrayLike,
    f_p1: float,
    f_py: float,
    strand: StrandClass = "low_relaxation",
) -> FloatOrArray:
    """Magura, Sozen & Siess (1964), PCI Journal 9(2): relaxation between two times t1 < t2.

    ΔfpR = fp1 (log10 t2 − log10 t1) / C · (fp1 / fpy − 0.55), times in hours, where fp1 is
    the strand stress at the start of the interval (the usual step-by-step use of the law).
    Zero when fp1 / fpy ≤ 0.55. Times below 1 h are taken as 1 h (see :func:`f_pR_log_time`).

    Args:
        t1_hours: start of the interval, hours since stressing (≥ 0). Vectorised.
        t2_hours: end of the interval, hours since stressing (≥ t1). Vectorised.
        f_p1: strand stress at t1, any stress unit (> 0).
        f_py: yield strength of the strand, same unit (> 0).
        strand: ``"low_relaxation"`` or ``"stress_relieved"``.

    Returns:
        Relaxation loss over the interval, in the unit of ``f_p1`` (positive is a loss).
    """
    t1 = np.asarray(t1_hours, dtype=float)
    t2 = np.asarray(t2_hours, dtype=float)
    if np.any(t2 < t1):
        raise ValueError(f"t2_hours must not be earlier than t1_hours, got {t1_hours}, {t2_hours}")
    ratio = _stress_ratio_term(f_p1, f_py)
    C = log_time_constant(strand)
    value = f_p1 * (_log10_hours(t2, "t2_hours") - _log10_hours(t1, "t1_hours")) / C * ratio
    return float(value) if np.ndim(value) == 0 else value
