"""fib Model Code for Concrete Structures 2010 (2013) 5.1.9.4: creep and shrinkage of concrete.

Units as printed: fcm in MPa, notional size h = 2Ac/u in mm, ages and durations in days,
relative humidity RH in percent, temperature in °C.

Sign convention as printed in the Model Code: shrinkage strains are **negative** (shortening),
swelling (βRH = +0.25 at RH ≥ 99 %·βs1) is positive. This matches the project's convention
(tension positive). Creep coefficients are positive.

Every factor is a pure function named after its symbol. Arguments may be floats or numpy
arrays (broadcast together); a float comes back when every argument is a scalar. Eq. numbers
are those of the 2013 printed edition; the two marked `from memory` (5.1-73, 5.1-85) are
recalled, not checked against the page.

Range checks (``ValueError``, message names the argument):

* ``RH`` within 0 to 100 percent;
* ``fcm``, ``h``, ``t0``, ``t0_adj`` strictly positive; ``t`` and ``ts`` at least 0;
* ``t >= t0`` (creep) and ``t >= ts`` (drying shrinkage);
* ``k_sigma`` above 0.6 (5.1.9.4.3 (d) does not cover it); unknown cement class.

Soft limits (``warnings.warn``), the range of applicability stated in 5.1.9.4.2:
fcm from 20 to 130 MPa, RH from 40 to 100 %, age at loading t0 of at least 1 day.
"""

from __future__ import annotations

import warnings

import numpy as np
from numpy.typing import ArrayLike, NDArray

from prestress.codes._args import KSI_MPA, mpa_ksi, worst
from prestress.codes._args import finite as _finite
from prestress.codes._args import non_negative as _non_negative
from prestress.codes._args import not_before as _t_not_before
from prestress.codes._args import out as _out
from prestress.codes._args import positive as _positive

FloatOrArray = float | NDArray[np.float64]

#: Cement strength classes of MC2010 (2013) Table 5.1-9 / 5.1-12, as printed.
CEMENT_CLASSES: tuple[str, ...] = ("32.5 N", "32.5 R", "42.5 N", "42.5 R", "52.5 N", "52.5 R")

# Hardening group of each class: slowly hardening (SL), normal (N), rapid (RS).
_GROUP = {
    "32.5 N": "SL",
    "32.5 R": "N",
    "42.5 N": "N",
    "42.5 R": "RS",
    "52.5 N": "RS",
    "52.5 R": "RS",
}
#: Exponent α of Eq. 5.1-73 per hardening group.
_ALPHA = {"SL": -1, "N": 0, "RS": 1}
#: Table 5.1-12: (αbs, αds1, αds2) per hardening group.
_TABLE_5_1_12 = {"SL": (800.0, 3.0, 0.013), "N": (700.0, 4.0, 0.012), "RS": (600.0, 6.0, 0.012)}

#: Range of applicability of 5.1.9.4.2 (soft limits).
FCM_RANGE_MPA = (20.0, 130.0)
RH_LOWER_PERCENT = 40.0
T0_LOWER_DAYS = 1.0


# --------------------------------------------------------------------------- helpers


def _fcm(fcm: ArrayLike) -> NDArray[np.float64]:
    f = _positive("fcm", fcm, "MPa")
    lo, hi = FCM_RANGE_MPA
    if np.any(f < lo) or np.any(f > hi):
        warnings.warn(
            f"fcm = {mpa_ksi(worst(f, f.max() > hi))} lies outside {lo:g} to {hi:g} MPa "
            f"({lo / KSI_MPA:.2f} to {hi / KSI_MPA:.2f} ksi), the range of applicability of the "
            "fib MC2010 5.1.9.4.2 creep and shrinkage model",
            stacklevel=3,
        )
    return f


def _rh(RH: ArrayLike) -> NDArray[np.float64]:
    r = _finite("RH", RH)
    if np.any(r < 0.0) or np.any(r > 100.0):
        raise ValueError(f"RH must be a relative humidity from 0 to 100 percent, got {RH}")
    if np.any(r < RH_LOWER_PERCENT):
        warnings.warn(
            f"RH = {worst(r, False):g} % is below {RH_LOWER_PERCENT:g} %, the lower limit of "
            "applicability of the fib MC2010 5.1.9.4.2 creep and shrinkage model",
            stacklevel=3,
        )
    return r


def _t0(t0: ArrayLike) -> NDArray[np.float64]:
    a = _positive("t0", t0, "days")
    if np.any(a < T0_LOWER_DAYS):
        warnings.warn(
            f"age at loading t0 = {worst(a, False):.3g} d is below {T0_LOWER_DAYS:g} d, the "
            "minimum age at loading of the fib MC2010 5.1.9.4.2 creep model",
            stacklevel=3,
        )
    return a


def _group(cement_class: str) -> str:
    compact = str(cement_class).upper().replace(" ", "")
    key = f"{compact[:-1]} {compact[-1:]}"
    if key not in _GROUP:
        raise ValueError(
            f"cement_class must be one of {', '.join(CEMENT_CLASSES)}, got {cement_class!r}"
        )
    return _GROUP[key]


# --------------------------------------------------------------------------- cement type
def alpha_cement(cement_class: str) -> int:
    """MC2010 (fib Model Code 2010, 2013) Eq. 5.1-73 (from memory): cement-type exponent α.

    Args:
        cement_class: cement strength class, one of ``CEMENT_CLASSES`` ("42.5R" also accepted).

    Returns:
        α = −1 for 32.5 N; 0 for 32.5 R and 42.5 N; +1 for 42.5 R, 52.5 N and 52.5 R.
    """
    return _ALPHA[_group(cement_class)]


def alpha_bs(cement_class: str) -> float:
    """MC2010 (fib Model Code 2010, 2013) Table 5.1-12: basic shrinkage coefficient αbs.

    Args:
        cement_class: cement strength class, one of ``CEMENT_CLASSES``.

    Returns:
        αbs = 800 (32.5 N), 700 (32.5 R, 42.5 N), 600 (42.5 R, 52.5 N, 52.5 R).
    """
    return _TABLE_5_1_12[_group(cement_class)][0]


def alpha_ds1(cement_class: str) -> float:
    """MC2010 (fib Model Code 2010, 2013) Table 5.1-12: drying shrinkage coefficient αds1.

    Args:
        cement_class: cement strength class, one of ``CEMENT_CLASSES``.

    Returns:
        αds1 = 3 (32.5 N), 4 (32.5 R, 42.5 N), 6 (42.5 R, 52.5 N, 52.5 R).
    """
    return _TABLE_5_1_12[_group(cement_class)][1]


def alpha_ds2(cement_class: str) -> float:
    """MC2010 (fib Model Code 2010, 2013) Table 5.1-12: drying shrinkage coefficient αds2.

    Args:
        cement_class: cement strength class, one of ``CEMENT_CLASSES``.

    Returns:
        αds2 = 0.013 (32.5 N), 0.012 (all other classes).
    """
    return _TABLE_5_1_12[_group(cement_class)][2]


# --------------------------------------------------------------------------- ages
def t_T(T: ArrayLike, dt: ArrayLike) -> float:
    """MC2010 (fib Model Code 2010, 2013) Eq. 5.1-85 (from memory): temperature-adjusted age tT.

    tT = Σ Δti · exp[13.65 − 4000 / (273 + T(Δti)/T0)], T0 = 1 °C.

    Args:
        T: mean temperature of each period Δti, °C (above −273 °C).
        dt: length of each period Δti, days (at least 0); same shape as ``T``.

    Returns:
        Temperature-adjusted age tT, days.
    """
    temp = _finite("T", T)
    d = _non_negative("dt", dt, "days")
    if temp.shape != d.shape:
        raise ValueError(f"T and dt must have the same shape, got {temp.shape} and {d.shape}")
    if np.any(temp <= -273.0):
        raise ValueError(f"T must be above -273 °C, got {T}")
    return float(np.sum(d * np.exp(13.65 - 4000.0 / (273.0 + temp))))


def t0_adj(t0_T: ArrayLike, cement_class: str) -> FloatOrArray:
    """MC2010 (fib Model Code 2010, 2013) Eq. 5.1-73 (from memory): adjusted age at loading.

    t0,adj = t0,T · [9 / (2 + t0,T^1.2) + 1]^α ≥ 0.5 days.

    Args:
        t0_T: temperature-adjusted age at loading t0,T (Eq. 5.1-85), days (> 0); equal to t0
            for curing at 20 °C.
        cement_class: cement strength class, one of ``CEMENT_CLASSES``.

    Returns:
        Adjusted age at loading t0,adj, days.
    """
    t0t = _positive("t0_T", t0_T, "days")
    a = alpha_cement(cement_class)
    return _out(np.maximum(t0t * (9.0 / (2.0 + t0t**1.2) + 1.0) ** a, 0.5))


# --------------------------------------------------------------------------- basic creep
def beta_bc_fcm(fcm: ArrayLike) -> FloatOrArray:
    """MC2010 (fib Model Code 2010, 2013) Eq. 5.1-65: strength factor of basic creep βbc(fcm).

    βbc(fcm) = 1.8 / fcm^0.7.

    Args:
        fcm: mean compressive strength at 28 days, MPa.

    Returns:
        βbc(fcm), dimensionless.
    """
    return _out(1.8 / _fcm(fcm) ** 0.7)


def beta_bc_t_t0(t: ArrayLike, t0: ArrayLike, t0_adj: ArrayLike) -> FloatOrArray:
    """MC2010 (fib Model Code 2010, 2013) Eq. 5.1-66: time development of basic creep βbc(t, t0).

    βbc(t, t0) = ln[(30 / t0,adj + 0.035)² · (t − t0) + 1].

    Args:
        t: age of concrete at the moment considered, days (t ≥ t0).
        t0: age at loading, days.
        t0_adj: adjusted age at loading (Eq. 5.1-73), days.

    Returns:
        βbc(t, t0), dimensionless.
    """
    a0 = _t0(t0)
    ta = _t_not_before(t, a0, "t", "t0")
    adj = _positive("t0_adj", t0_adj, "days")
    return _out(np.log((30.0 / adj + 0.035) ** 2 * (ta - a0) + 1.0))


def phi_bc(t: ArrayLike, t0: ArrayLike, fcm: ArrayLike, t0_adj: ArrayLike) -> FloatOrArray:
    """MC2010 (fib Model Code 2010, 2013) Eq. 5.1-64: basic creep coefficient φbc(t, t0).

    φbc(t, t0) = βbc(fcm) · βbc(t, t0).

    Args:
        t: age of concrete at the moment considered, days (t ≥ t0).
        t0: age at loading, days.
        fcm: mean compressive strength at 28 days, MPa.
        t0_adj: adjusted age at loading (Eq. 5.1-73), days.

    Returns:
        φbc(t, t0), dimensionless.
    """
    return _out(np.asarray(beta_bc_fcm(fcm)) * np.asarray(beta_bc_t_t0(t, t0, t0_adj)))


# --------------------------------------------------------------------------- drying creep
def beta_dc_fcm(fcm: ArrayLike) -> FloatOrArray:
    """MC2010 (fib Model Code 2010, 2013) Eq. 5.1-68: strength factor of drying creep βdc(fcm).

    βdc(fcm) = 412 / fcm^1.4.

    Args:
        fcm: mean compressive strength at 28 days, MPa.

    Returns:
        βdc(fcm), dimensionless.
    """
    return _out(412.0 / _fcm(fcm) ** 1.4)


def beta_RH_creep(RH: ArrayLike, h: ArrayLike) -> FloatOrArray:
    """MC2010 (fib Model Code 2010, 2013) Eq. 5.1-69: humidity factor of drying creep β(RH).

    β(RH) = (1 − RH/100) / (0.1 · h/100)^(1/3), h in mm.

    Args:
        RH: relative humidity of the ambient environment, percent.
        h: notional size 2Ac/u, mm.

    Returns:
        β(RH), dimensionless.
    """
    r = _rh(RH)
    hh = _positive("h", h, "mm")
    return _out((1.0 - r / 100.0) / np.cbrt(0.1 * hh / 100.0))


def beta_dc_t0(t0_adj: ArrayLike) -> FloatOrArray:
    """MC2010 (fib Model Code 2010, 2013) Eq. 5.1-70: age-at-loading factor of drying creep βdc(t0).

    βdc(t0) = 1 / (0.1 + t0,adj^0.2).

    Args:
        t0_adj: adjusted age at loading (Eq. 5.1-73), days.

    Returns:
        βdc(t0), dimensionless.
    """
    adj = _positive("t0_adj", t0_adj, "days")
    return _out(1.0 / (0.1 + adj**0.2))


def alpha_fcm(fcm: ArrayLike) -> FloatOrArray:
    """MC2010 (fib Model Code 2010, 2013) Eq. 5.1-71d: strength coefficient αfcm = (35 / fcm)^0.5.

    Args:
        fcm: mean compressive strength at 28 days, MPa.

    Returns:
        αfcm, dimensionless.
    """
    return _out(np.sqrt(35.0 / _fcm(fcm)))


def beta_h(h: ArrayLike, fcm: ArrayLike) -> FloatOrArray:
    """MC2010 (fib Model Code 2010, 2013) Eq. 5.1-71c: size coefficient βh of drying creep.

    βh = 1.5 · h + 250 · αfcm ≤ 1500 · αfcm.

    Args:
        h: notional size 2Ac/u, mm.
        fcm: mean compressive strength at 28 days, MPa.

    Returns:
        βh, days.
    """
    hh = _positive("h", h, "mm")
    a = np.asarray(alpha_fcm(fcm))
    return _out(np.minimum(1.5 * hh + 250.0 * a, 1500.0 * a))


def gamma_t0(t0_adj: ArrayLike) -> FloatOrArray:
    """MC2010 (fib Model Code 2010, 2013) Eq. 5.1-71b: exponent γ(t0) = 1 / (2.3 + 3.5 / √t0,adj).

    Args:
        t0_adj: adjusted age at loading (Eq. 5.1-73), days.

    Returns:
        γ(t0), dimensionless.
    """
    adj = _positive("t0_adj", t0_adj, "days")
    return _out(1.0 / (2.3 + 3.5 / np.sqrt(adj)))


def beta_dc_t_t0(
    t: ArrayLike, t0: ArrayLike, h: ArrayLike, fcm: ArrayLike, t0_adj: ArrayLike
) -> FloatOrArray:
    """MC2010 (fib Model Code 2010, 2013) Eq. 5.1-71a: time development of drying creep βdc(t, t0).

    βdc(t, t0) = [(t − t0) / (βh + (t − t0))]^γ(t0).

    Args:
        t: age of concrete at the moment considered, days (t ≥ t0).
        t0: age at loading, days (the actual age: t − t0 is the real duration of loading).
        h: notional size 2Ac/u, mm.
        fcm: mean compressive strength at 28 days, MPa.
        t0_adj: adjusted age at loading (Eq. 5.1-73), days, used in γ(t0).

    Returns:
        βdc(t, t0), dimensionless.
    """
    a0 = _t0(t0)
    ta = _t_not_before(t, a0, "t", "t0")
    dt = ta - a0
    bh = np.asarray(beta_h(h, fcm))
    g = np.asarray(gamma_t0(t0_adj))
    return _out((dt / (bh + dt)) ** g)


def phi_dc(
    t: ArrayLike,
    t0: ArrayLike,
    fcm: ArrayLike,
    RH: ArrayLike,
    h: ArrayLike,
    t0_adj: ArrayLike,
) -> FloatOrArray:
    """MC2010 (fib Model Code 2010, 2013) Eq. 5.1-67: drying creep coefficient φdc(t, t0).

    φdc(t, t0) = βdc(fcm) · β(RH) · βdc(t0) · βdc(t, t0).

    Args:
        t: age of concrete at the moment considered, days (t ≥ t0).
        t0: age at loading, days.
        fcm: mean compressive strength at 28 days, MPa.
        RH: relative humidity of the ambient environment, percent.
        h: notional size 2Ac/u, mm.
        t0_adj: adjusted age at loading (Eq. 5.1-73), days.

    Returns:
        φdc(t, t0), dimensionless.
    """
    return _out(
        np.asarray(beta_dc_fcm(fcm))
        * np.asarray(beta_RH_creep(RH, h))
        * np.asarray(beta_dc_t0(t0_adj))
        * np.asarray(beta_dc_t_t0(t, t0, h, fcm, t0_adj))
    )


def phi(
    t: ArrayLike,
    t0: ArrayLike,
    fcm: ArrayLike,
    RH: ArrayLike,
    h: ArrayLike,
    cement_class: str = "42.5 N",
    t0_T: ArrayLike | None = None,
) -> FloatOrArray:
    """MC2010 (fib Model Code 2010, 2013) Eq. 5.1-63: creep coefficient φ(t, t0) = φbc + φdc.

    The age at loading is adjusted for cement type (Eq. 5.1-73) starting from the
    temperature-adjusted age t0,T (Eq. 5.1-85); t − t0 stays the real duration of loading.
    Linear creep only (|σc| ≤ 0.4 fcm(t0)); for higher stresses apply :func:`phi_sigma`.

    Args:
        t: age of concrete at the moment considered, days (t ≥ t0).
        t0: age at loading, days.
        fcm: mean compressive strength at 28 days, MPa.
        RH: relative humidity of the ambient environment, percent.
        h: notional size 2Ac/u, mm.
        cement_class: cement strength class, one of ``CEMENT_CLASSES``.
        t0_T: temperature-adjusted age at loading, days; ``None`` takes t0 (curing at 20 °C).

    Returns:
        φ(t, t0), dimensionless.
    """
    _positive("t0", t0, "days")
    adj = t0_adj(t0 if t0_T is None else t0_T, cement_class)
    return _out(np.asarray(phi_bc(t, t0, fcm, adj)) + np.asarray(phi_dc(t, t0, fcm, RH, h, adj)))


def k_sigma(sigma_c: ArrayLike, fcm_t0: ArrayLike) -> FloatOrArray:
    """MC2010 (fib Model Code 2010, 2013) 5.1.9.4.3 (d): stress-strength ratio kσ = |σc| / fcm(t0).

    Args:
        sigma_c: concrete stress applied at t0, MPa (either sign).
        fcm_t0: mean compressive strength at the age at loading, MPa.

    Returns:
        kσ, dimensionless.
    """
    s = _finite("sigma_c", sigma_c)
    f = _positive("fcm_t0", fcm_t0, "MPa")
    return _out(np.abs(s) / f)


def phi_sigma(phi_linear: ArrayLike, k_sigma: ArrayLike) -> FloatOrArray:
    """MC2010 (fib Model Code 2010, 2013) Eq. 5.1-74: creep coefficient at high stress φσ(t, t0).

    φσ = φ · exp[1.5 (kσ − 0.4)] for 0.4 < kσ ≤ 0.6; φ unchanged for kσ ≤ 0.4.

    Args:
        phi_linear: linear creep coefficient φ(t, t0) of Eq. 5.1-63.
        k_sigma: stress-strength ratio |σc| / fcm(t0), at most 0.6.

    Returns:
        φσ(t, t0), dimensionless.
    """
    p = _non_negative("phi_linear", phi_linear, "")
    k = _non_negative("k_sigma", k_sigma, "")
    if np.any(k > 0.6):
        raise ValueError(f"k_sigma must be at most 0.6 (5.1.9.4.3 (d)), got {k_sigma}")
    return _out(np.where(k > 0.4, p * np.exp(1.5 * (k - 0.4)), p))


def J(phi_t_t0: ArrayLike, E_ci_t0: ArrayLike, E_ci: ArrayLike) -> FloatOrArray:
    """MC2010 (fib Model Code 2010, 2013) Eq. 5.1-61: creep compliance = 1/Eci(t0) + φ/Eci.

    Args:
        phi_t_t0: creep coefficient φ(t, t0).
        E_ci_t0: tangent modulus at the age at loading, MPa.
        E_ci: tangent modulus at 28 days, MPa.

    Returns:
        J(t, t0), 1/MPa.
    """
    p = _non_negative("phi_t_t0", phi_t_t0, "")
    e0 = _positive("E_ci_t0", E_ci_t0, "MPa")
    e = _positive("E_ci", E_ci, "MPa")
    return _out(1.0 / e0 + p / e)


# --------------------------------------------------------------------------- shrinkage
def epsilon_cbs0(fcm: ArrayLike, cement_class: str = "42.5 N") -> FloatOrArray:
    """MC2010 (fib Model Code 2010, 2013) Eq. 5.1-78: notional basic shrinkage εcbs0(fcm).

    εcbs0 = −αbs · [(0.1 fcm) / (6 + 0.1 fcm)]^2.5 · 10⁻⁶.

    Args:
        fcm: mean compressive strength at 28 days, MPa.
        cement_class: cement strength class, one of ``CEMENT_CLASSES`` (Table 5.1-12).

    Returns:
        εcbs0, strain (negative = shortening).
    """
    f = _fcm(fcm)
    return _out(-alpha_bs(cement_class) * ((0.1 * f) / (6.0 + 0.1 * f)) ** 2.5 * 1e-6)


def beta_bs(t: ArrayLike) -> FloatOrArray:
    """MC2010 (fib Model Code 2010, 2013) Eq. 5.1-79: time function of basic shrinkage βbs(t).

    βbs(t) = 1 − exp(−0.2 · √t).

    Args:
        t: age of concrete, days (at least 0).

    Returns:
        βbs(t), dimensionless.
    """
    ta = _non_negative("t", t, "days")
    return _out(1.0 - np.exp(-0.2 * np.sqrt(ta)))


def epsilon_cbs(t: ArrayLike, fcm: ArrayLike, cement_class: str = "42.5 N") -> FloatOrArray:
    """MC2010 (fib Model Code 2010, 2013) Eq. 5.1-76: basic shrinkage εcbs(t) = εcbs0(fcm) · βbs(t).

    Args:
        t: age of concrete, days.
        fcm: mean compressive strength at 28 days, MPa.
        cement_class: cement strength class, one of ``CEMENT_CLASSES``.

    Returns:
        εcbs(t), strain (negative = shortening).
    """
    return _out(np.asarray(epsilon_cbs0(fcm, cement_class)) * np.asarray(beta_bs(t)))


def epsilon_cds0(fcm: ArrayLike, cement_class: str = "42.5 N") -> FloatOrArray:
    """MC2010 (fib Model Code 2010, 2013) Eq. 5.1-80: notional drying shrinkage εcds0(fcm).

    εcds0 = [(220 + 110 αds1) · exp(−αds2 · fcm)] · 10⁻⁶, fcm in MPa.

    Args:
        fcm: mean compressive strength at 28 days, MPa.
        cement_class: cement strength class, one of ``CEMENT_CLASSES`` (Table 5.1-12).

    Returns:
        εcds0, positive magnitude (the sign comes from βRH).
    """
    f = _fcm(fcm)
    a1 = alpha_ds1(cement_class)
    a2 = alpha_ds2(cement_class)
    return _out((220.0 + 110.0 * a1) * np.exp(-a2 * f) * 1e-6)


def beta_s1(fcm: ArrayLike) -> FloatOrArray:
    """MC2010 (fib Model Code 2010, 2013) Eq. 5.1-83: coefficient βs1 = (35 / fcm)^0.1 ≤ 1.0.

    Args:
        fcm: mean compressive strength at 28 days, MPa.

    Returns:
        βs1, dimensionless.
    """
    return _out(np.minimum((35.0 / _fcm(fcm)) ** 0.1, 1.0))


def beta_RH_shrinkage(RH: ArrayLike, fcm: ArrayLike) -> FloatOrArray:
    """MC2010 (fib Model Code 2010, 2013) Eq. 5.1-81: humidity factor of drying shrinkage βRH(RH).

    βRH = −1.55 · [1 − (RH/100)³] for 40 ≤ RH < 99 %·βs1; βRH = +0.25 for RH ≥ 99 %·βs1.

    Args:
        RH: relative humidity of the ambient environment, percent.
        fcm: mean compressive strength at 28 days, MPa (through βs1, Eq. 5.1-83).

    Returns:
        βRH, dimensionless (negative = drying, positive = swelling).
    """
    r = _rh(RH)
    bs1 = np.asarray(beta_s1(fcm))
    return _out(np.where(r >= 99.0 * bs1, 0.25, -1.55 * (1.0 - (r / 100.0) ** 3)))


def beta_ds(t: ArrayLike, ts: ArrayLike, h: ArrayLike) -> FloatOrArray:
    """MC2010 (fib Model Code 2010, 2013) Eq. 5.1-82: time function of drying shrinkage βds(t − ts).

    βds = [(t − ts) / (0.035 · h² + (t − ts))]^0.5, h in mm.

    Args:
        t: age of concrete, days (t ≥ ts).
        ts: age at the beginning of drying, days.
        h: notional size 2Ac/u, mm.

    Returns:
        βds(t − ts), dimensionless.
    """
    s = _non_negative("ts", ts, "days")
    ta = _t_not_before(t, s, "t", "ts")
    hh = _positive("h", h, "mm")
    dt = ta - s
    return _out(np.sqrt(dt / (0.035 * hh**2 + dt)))


def epsilon_cds(
    t: ArrayLike,
    ts: ArrayLike,
    fcm: ArrayLike,
    RH: ArrayLike,
    h: ArrayLike,
    cement_class: str = "42.5 N",
) -> FloatOrArray:
    """MC2010 (fib Model Code 2010, 2013) Eq. 5.1-77: drying shrinkage εcds(t, ts).

    εcds(t, ts) = εcds0(fcm) · βRH(RH) · βds(t − ts).

    Args:
        t: age of concrete, days (t ≥ ts).
        ts: age at the beginning of drying, days.
        fcm: mean compressive strength at 28 days, MPa.
        RH: relative humidity of the ambient environment, percent.
        h: notional size 2Ac/u, mm.
        cement_class: cement strength class, one of ``CEMENT_CLASSES``.

    Returns:
        εcds(t, ts), strain (negative = shortening).
    """
    return _out(
        np.asarray(epsilon_cds0(fcm, cement_class))
        * np.asarray(beta_RH_shrinkage(RH, fcm))
        * np.asarray(beta_ds(t, ts, h))
    )


def epsilon_cs(
    t: ArrayLike,
    ts: ArrayLike,
    fcm: ArrayLike,
    RH: ArrayLike,
    h: ArrayLike,
    cement_class: str = "42.5 N",
) -> FloatOrArray:
    """MC2010 (fib Model Code 2010, 2013) Eq. 5.1-75: total shrinkage εcs = εcbs + εcds.

    Args:
        t: age of concrete, days (t ≥ ts).
        ts: age at the beginning of drying, days.
        fcm: mean compressive strength at 28 days, MPa.
        RH: relative humidity of the ambient environment, percent.
        h: notional size 2Ac/u, mm.
        cement_class: cement strength class, one of ``CEMENT_CLASSES``.

    Returns:
        εcs(t, ts), strain (negative = shortening).
    """
    return _out(
        np.asarray(epsilon_cbs(t, fcm, cement_class))
        + np.asarray(epsilon_cds(t, ts, fcm, RH, h, cement_class))
    )
