"""Argument checks shared by the code modules.

Array-friendly; each raises ValueError naming the argument and what it must be.
"""

from __future__ import annotations

import numpy as np
from numpy.typing import ArrayLike, NDArray

FloatOrArray = float | NDArray[np.float64]


def out(value: NDArray[np.float64]) -> FloatOrArray:
    """Return a Python float for a 0-d result, the array otherwise."""
    return float(value) if np.ndim(value) == 0 else value


def finite(name: str, value: ArrayLike) -> NDArray[np.float64]:
    """The value as a float array; every element must be finite."""
    a = np.asarray(value, dtype=float)
    if np.any(~np.isfinite(a)):
        raise ValueError(f"{name} must be finite, got {value}")
    return a


def positive(name: str, value: ArrayLike, unit: str) -> NDArray[np.float64]:
    """The value as a float array; every element must be greater than zero."""
    a = finite(name, value)
    if np.any(a <= 0.0):
        raise ValueError(f"{name} must be greater than 0 {unit}, got {value}")
    return a


def non_negative(name: str, value: ArrayLike, unit: str) -> NDArray[np.float64]:
    """The value as a float array; every element must be zero or more."""
    a = finite(name, value)
    if np.any(a < 0.0):
        raise ValueError(f"{name} must be at least 0 {unit}, got {value}")
    return a


def not_before(
    t: ArrayLike, t_start: NDArray[np.float64], name: str, start: str
) -> NDArray[np.float64]:
    """The time as a float array; every element zero or more and not before ``t_start``."""
    a = non_negative(name, t, "days")
    if np.any(a < t_start):
        raise ValueError(f"{name} must be at least {start} (days), got {name} = {t}")
    return a


# --------------------------------------------------------------------------- warning texts
#: 1 ksi in MPa (exact: 4.4482216152605 N / 25.4² mm² × 1000), for the warnings' second unit.
KSI_MPA = 4448.2216152605 / 25.4**2


def worst(value: ArrayLike, upper: bool) -> float:
    """The element of ``value`` furthest beyond a limit: the largest for an upper limit."""
    a = np.asarray(value, dtype=float)
    return float(np.max(a) if upper else np.min(a))


def mpa_ksi(value_mpa: float) -> str:
    """A stress in MPa for a warning, with ksi beside it (the output units are not known)."""
    return f"{value_mpa:.1f} MPa ({value_mpa / KSI_MPA:.2f} ksi)"


def ksi_mpa(value_ksi: float) -> str:
    """A stress in ksi for a warning, with MPa beside it."""
    return f"{value_ksi:.2f} ksi ({value_ksi * KSI_MPA:.1f} MPa)"


def in_mm(value_in: float) -> str:
    """A length in inches for a warning, with millimetres beside it."""
    return f"{value_in:.3g} in. ({value_in * 25.4:.0f} mm)"
