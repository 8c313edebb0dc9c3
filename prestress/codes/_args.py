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
