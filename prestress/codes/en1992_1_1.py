"""EN 1992-1-1:2004 3.1.4, Annex B, 3.3.2 and 5.10.6: creep, shrinkage and steel relaxation.

Units as printed: fck and fcm in MPa, notional size h0 = 2Ac/u in mm, ages in days, relative
humidity RH in percent, temperature in °C; relaxation time t in **hours**, ρ1000 in percent.

Sign convention as printed in EN 1992-1-1: shrinkage strains and relaxation losses are
returned as **positive magnitudes** (a positive shrinkage strain is a shortening; a positive
Δσpr reduces the tendon stress). The engine gives them the project's signs.

Every factor is a pure function named after its symbol. Arguments may be floats or numpy
arrays (broadcast together); a float comes back when every argument is a scalar.

Range checks (``ValueError``, message names the argument):

* ``RH`` within 0 to 100 percent;
* ``fcm``, ``fck``, ``h0``, ``t0`` strictly positive; ``t`` and ``ts`` at least 0;
* ``t >= t0`` (creep) and ``t >= ts`` (drying shrinkage);
* relaxation: ``t`` (hours) > 0, 0 < μ < 1, class 1, 2 or 3; unknown cement class.

Soft limits (``warnings.warn``): RH below 40 %, the lower humidity for which 3.1.4(2) states
its creep values (from memory); fck above 90 MPa (C90/105, the top class of Table 3.1).
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

#: Cement classes of 3.1.2(6): S (slow), N (normal), R (rapid).
CEMENT_CLASSES: tuple[str, ...] = ("S", "N", "R")
#: Eq. B.9: exponent α per cement class.
_ALPHA = {"S": -1, "N": 0, "R": 1}
#: Annex B.2 (Eq. B.11): (αds1, αds2) per cement class.
_ALPHA_DS = {"S": (3.0, 0.13), "N": (4.0, 0.12), "R": (6.0, 0.11)}
#: 3.3.2(6): ρ1000 in percent per relaxation class, the values the clause states.
RHO_1000_PERCENT = {1: 8.0, 2: 2.5, 3: 4.0}
#: Eq. 3.28-3.30: (coefficient, exponent on μ) per relaxation class.
_RELAXATION = {1: (5.39, 6.7), 2: (0.66, 9.1), 3: (1.98, 8.0)}
#: Table 3.3: kh against h0 (mm); kh = 0.70 for h0 ≥ 500 mm.
_TABLE_3_3_H0 = (100.0, 200.0, 300.0, 500.0)
_TABLE_3_3_KH = (1.0, 0.85, 0.75, 0.70)

#: Reference strength fcmo of Eq. B.11, MPa.
F_CMO = 10.0
#: Reference humidity RH0 of Eq. B.12, percent.
RH_0 = 100.0
RH_LOWER_PERCENT = 40.0
FCK_UPPER_MPA = 90.0
#: 3.3.2(8): age at which final relaxation may be taken, hours (about 57 years).
T_FINAL_RELAXATION_HOURS = 500_000.0


# --------------------------------------------------------------------------- helpers


def _rh(RH: ArrayLike) -> NDArray[np.float64]:
    r = _finite("RH", RH)
    if np.any(r < 0.0) or np.any(r > 100.0):
        raise ValueError(f"RH must be a relative humidity from 0 to 100 percent, got {RH}")
    if np.any(r < RH_LOWER_PERCENT):
        warnings.warn(
            f"RH = {worst(r, False):g} % is below {RH_LOWER_PERCENT:g} %, the lowest humidity "
            "EN 1992-1-1:2004 3.1.4(2) states its creep values for",
            stacklevel=3,
        )
    return r


def _cement(cement_class: str) -> str:
    key = str(cement_class).strip().upper()
    if key not in _ALPHA:
        raise ValueError(f"cement_class must be one of S, N or R, got {cement_class!r}")
    return key


def _relaxation_class(relaxation_class: int) -> int:
    if relaxation_class not in _RELAXATION:
        raise ValueError(f"relaxation_class must be 1, 2 or 3, got {relaxation_class!r}")
    return int(relaxation_class)


# --------------------------------------------------------------------------- general
def h_0(A_c: ArrayLike, u: ArrayLike) -> FloatOrArray:
    """EN 1992-1-1:2004 Eq. B.6: notional size h0 = 2 Ac / u.

    Args:
        A_c: concrete cross-sectional area, mm².
        u: perimeter of the member in contact with the atmosphere, mm.

    Returns:
        h0, mm.
    """
    a = _positive("A_c", A_c, "mm²")
    p = _positive("u", u, "mm")
    return _out(2.0 * a / p)


def alpha_cement(cement_class: str) -> int:
    """EN 1992-1-1:2004 Eq. B.9: cement-type exponent α (−1 for S, 0 for N, +1 for R).

    Args:
        cement_class: "S", "N" or "R" (3.1.2(6)).

    Returns:
        α, dimensionless.
    """
    return _ALPHA[_cement(cement_class)]


def t_T(T: ArrayLike, dt: ArrayLike) -> float:
    """EN 1992-1-1:2004 Eq. B.10: temperature-adjusted age tT.

    tT = Σ exp(−(4000 / [273 + T(Δti)] − 13.65)) · Δti.

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
    return float(np.sum(np.exp(-(4000.0 / (273.0 + temp) - 13.65)) * d))


def t0_adj(t0_T: ArrayLike, cement_class: str = "N") -> FloatOrArray:
    """EN 1992-1-1:2004 Eq. B.9: age at loading adjusted for cement type.

    t0 = t0,T · [9 / (2 + t0,T^1.2) + 1]^α ≥ 0.5 days; used in β(t0) (Eq. B.5) only.

    Args:
        t0_T: temperature-adjusted age at loading (Eq. B.10), days (> 0); equal to t0 for
            curing at 20 °C.
        cement_class: "S", "N" or "R".

    Returns:
        Adjusted age at loading, days.
    """
    t0t = _positive("t0_T", t0_T, "days")
    a = alpha_cement(cement_class)
    return _out(np.maximum(t0t * (9.0 / (2.0 + t0t**1.2) + 1.0) ** a, 0.5))


# --------------------------------------------------------------------------- creep
def alpha_1(fcm: ArrayLike) -> FloatOrArray:
    """EN 1992-1-1:2004 Eq. B.8c: α1 = (35 / fcm)^0.7.

    Args:
        fcm: mean compressive strength at 28 days, MPa.

    Returns:
        α1, dimensionless.
    """
    return _out((35.0 / _positive("fcm", fcm, "MPa")) ** 0.7)


def alpha_2(fcm: ArrayLike) -> FloatOrArray:
    """EN 1992-1-1:2004 Eq. B.8c: α2 = (35 / fcm)^0.2.

    Args:
        fcm: mean compressive strength at 28 days, MPa.

    Returns:
        α2, dimensionless.
    """
    return _out((35.0 / _positive("fcm", fcm, "MPa")) ** 0.2)


def alpha_3(fcm: ArrayLike) -> FloatOrArray:
    """EN 1992-1-1:2004 Eq. B.8c: α3 = (35 / fcm)^0.5.

    Args:
        fcm: mean compressive strength at 28 days, MPa.

    Returns:
        α3, dimensionless.
    """
    return _out((35.0 / _positive("fcm", fcm, "MPa")) ** 0.5)


def phi_RH(RH: ArrayLike, h0: ArrayLike, fcm: ArrayLike) -> FloatOrArray:
    """EN 1992-1-1:2004 Eq. B.3a/B.3b: relative-humidity factor φRH of notional creep.

    φRH = 1 + (1 − RH/100) / (0.1 · h0^(1/3)) for fcm ≤ 35 MPa (B.3a);
    φRH = [1 + (1 − RH/100) / (0.1 · h0^(1/3)) · α1] · α2 for fcm > 35 MPa (B.3b).

    Args:
        RH: relative humidity of the ambient environment, percent.
        h0: notional size 2Ac/u, mm.
        fcm: mean compressive strength at 28 days, MPa.

    Returns:
        φRH, dimensionless.
    """
    r = _rh(RH)
    h = _positive("h0", h0, "mm")
    f = _positive("fcm", fcm, "MPa")
    term = (1.0 - r / 100.0) / (0.1 * np.cbrt(h))
    low = 1.0 + term
    high = (1.0 + term * np.asarray(alpha_1(f))) * np.asarray(alpha_2(f))
    return _out(np.where(f <= 35.0, low, high))


def beta_fcm(fcm: ArrayLike) -> FloatOrArray:
    """EN 1992-1-1:2004 Eq. B.4: strength factor β(fcm) = 16.8 / √fcm.

    Args:
        fcm: mean compressive strength at 28 days, MPa.

    Returns:
        β(fcm), dimensionless.
    """
    return _out(16.8 / np.sqrt(_positive("fcm", fcm, "MPa")))


def beta_t0(t0: ArrayLike) -> FloatOrArray:
    """EN 1992-1-1:2004 Eq. B.5: age-at-loading factor β(t0) = 1 / (0.1 + t0^0.20).

    Args:
        t0: age at loading, days, adjusted by Eq. B.9 where cement type or temperature matter.

    Returns:
        β(t0), dimensionless.
    """
    return _out(1.0 / (0.1 + _positive("t0", t0, "days") ** 0.20))


def phi_0(RH: ArrayLike, h0: ArrayLike, fcm: ArrayLike, t0: ArrayLike) -> FloatOrArray:
    """EN 1992-1-1:2004 Eq. B.2: notional creep coefficient φ0 = φRH · β(fcm) · β(t0).

    Args:
        RH: relative humidity of the ambient environment, percent.
        h0: notional size 2Ac/u, mm.
        fcm: mean compressive strength at 28 days, MPa.
        t0: age at loading (adjusted by Eq. B.9 if relevant), days.

    Returns:
        φ0, dimensionless.
    """
    return _out(
        np.asarray(phi_RH(RH, h0, fcm)) * np.asarray(beta_fcm(fcm)) * np.asarray(beta_t0(t0))
    )


def beta_H(RH: ArrayLike, h0: ArrayLike, fcm: ArrayLike) -> FloatOrArray:
    """EN 1992-1-1:2004 Eq. B.8a/B.8b: humidity and size coefficient βH.

    βH = 1.5 [1 + (0.012 RH)^18] h0 + 250 ≤ 1500 for fcm ≤ 35 MPa (B.8a);
    βH = 1.5 [1 + (0.012 RH)^18] h0 + 250 α3 ≤ 1500 α3 for fcm > 35 MPa (B.8b).

    Args:
        RH: relative humidity of the ambient environment, percent.
        h0: notional size 2Ac/u, mm.
        fcm: mean compressive strength at 28 days, MPa.

    Returns:
        βH, days.
    """
    r = _rh(RH)
    h = _positive("h0", h0, "mm")
    f = _positive("fcm", fcm, "MPa")
    a3 = np.where(f <= 35.0, 1.0, np.asarray(alpha_3(f)))
    return _out(np.minimum(1.5 * (1.0 + (0.012 * r) ** 18) * h + 250.0 * a3, 1500.0 * a3))


def beta_c(
    t: ArrayLike, t0: ArrayLike, RH: ArrayLike, h0: ArrayLike, fcm: ArrayLike
) -> FloatOrArray:
    """EN 1992-1-1:2004 Eq. B.7: development of creep with time βc(t, t0).

    βc(t, t0) = [(t − t0) / (βH + t − t0)]^0.3, t − t0 the non-adjusted duration of loading.

    Args:
        t: age of concrete at the moment considered, days (t ≥ t0).
        t0: age at loading (not adjusted), days.
        RH: relative humidity of the ambient environment, percent.
        h0: notional size 2Ac/u, mm.
        fcm: mean compressive strength at 28 days, MPa.

    Returns:
        βc(t, t0), dimensionless.
    """
    a0 = _positive("t0", t0, "days")
    ta = _t_not_before(t, a0, "t", "t0")
    dt = ta - a0
    bh = np.asarray(beta_H(RH, h0, fcm))
    return _out((dt / (bh + dt)) ** 0.3)


def phi(
    t: ArrayLike,
    t0: ArrayLike,
    RH: ArrayLike,
    h0: ArrayLike,
    fcm: ArrayLike,
    cement_class: str = "N",
    t0_T: ArrayLike | None = None,
) -> FloatOrArray:
    """EN 1992-1-1:2004 Eq. B.1: creep coefficient φ(t, t0) = φ0 · βc(t, t0).

    β(t0) uses the age at loading adjusted by Eq. B.9 (from t0,T, Eq. B.10); βc uses the
    real duration of loading t − t0. Linear creep (|σc| ≤ 0.45 fck(t0)); see :func:`phi_nl`.

    Args:
        t: age of concrete at the moment considered, days (t ≥ t0).
        t0: age at loading, days.
        RH: relative humidity of the ambient environment, percent.
        h0: notional size 2Ac/u, mm.
        fcm: mean compressive strength at 28 days, MPa.
        cement_class: "S", "N" or "R".
        t0_T: temperature-adjusted age at loading, days; ``None`` takes t0 (curing at 20 °C).

    Returns:
        φ(t, t0), dimensionless.
    """
    _positive("t0", t0, "days")
    adj = t0_adj(t0 if t0_T is None else t0_T, cement_class)
    return _out(np.asarray(phi_0(RH, h0, fcm, adj)) * np.asarray(beta_c(t, t0, RH, h0, fcm)))


def phi_nl(phi_linear: ArrayLike, k_sigma: ArrayLike) -> FloatOrArray:
    """EN 1992-1-1:2004 Eq. 3.7: non-linear notional creep φnl = φ · exp[1.5 (kσ − 0.45)].

    Applies when kσ = σc / fck(t0) exceeds 0.45; below that φ is returned unchanged.

    Args:
        phi_linear: linear creep coefficient φ(t, t0).
        k_sigma: stress-strength ratio |σc| / fck(t0) (≥ 0).

    Returns:
        φnl, dimensionless.
    """
    p = _non_negative("phi_linear", phi_linear, "")
    k = _non_negative("k_sigma", k_sigma, "")
    return _out(np.where(k > 0.45, p * np.exp(1.5 * (k - 0.45)), p))


# --------------------------------------------------------------------------- shrinkage
def alpha_ds1(cement_class: str) -> float:
    """EN 1992-1-1:2004 B.2 (Eq. B.11): αds1 = 3 (S), 4 (N), 6 (R).

    Args:
        cement_class: "S", "N" or "R".

    Returns:
        αds1, dimensionless.
    """
    return _ALPHA_DS[_cement(cement_class)][0]


def alpha_ds2(cement_class: str) -> float:
    """EN 1992-1-1:2004 B.2 (Eq. B.11): αds2 = 0.13 (S), 0.12 (N), 0.11 (R).

    Args:
        cement_class: "S", "N" or "R".

    Returns:
        αds2, dimensionless.
    """
    return _ALPHA_DS[_cement(cement_class)][1]


def beta_RH(RH: ArrayLike) -> FloatOrArray:
    """EN 1992-1-1:2004 Eq. B.12: humidity factor of drying shrinkage βRH = 1.55 [1 − (RH/RH0)³].

    Args:
        RH: relative humidity of the ambient environment, percent (RH0 = 100 %).

    Returns:
        βRH, dimensionless.
    """
    r = _rh(RH)
    return _out(1.55 * (1.0 - (r / RH_0) ** 3))


def epsilon_cd_0(RH: ArrayLike, fcm: ArrayLike, cement_class: str = "N") -> FloatOrArray:
    """EN 1992-1-1:2004 Eq. B.11: basic drying shrinkage εcd,0.

    εcd,0 = 0.85 [(220 + 110 αds1) · exp(−αds2 · fcm / fcmo)] · 10⁻⁶ · βRH, fcmo = 10 MPa.

    Args:
        RH: relative humidity of the ambient environment, percent.
        fcm: mean compressive strength at 28 days, MPa.
        cement_class: "S", "N" or "R".

    Returns:
        εcd,0, positive magnitude (shortening).
    """
    f = _positive("fcm", fcm, "MPa")
    a1 = alpha_ds1(cement_class)
    a2 = alpha_ds2(cement_class)
    return _out(
        0.85 * ((220.0 + 110.0 * a1) * np.exp(-a2 * f / F_CMO)) * 1e-6 * np.asarray(beta_RH(RH))
    )


def beta_ds(t: ArrayLike, ts: ArrayLike, h0: ArrayLike) -> FloatOrArray:
    """EN 1992-1-1:2004 Eq. 3.10: time function of drying shrinkage βds(t, ts).

    βds = (t − ts) / [(t − ts) + 0.04 · √(h0³)].

    Args:
        t: age of concrete, days (t ≥ ts).
        ts: age at the beginning of drying (end of curing), days.
        h0: notional size 2Ac/u, mm.

    Returns:
        βds(t, ts), dimensionless.
    """
    s = _non_negative("ts", ts, "days")
    ta = _t_not_before(t, s, "t", "ts")
    h = _positive("h0", h0, "mm")
    dt = ta - s
    return _out(dt / (dt + 0.04 * np.sqrt(h**3)))


def k_h(h0: ArrayLike) -> FloatOrArray:
    """EN 1992-1-1:2004 Table 3.3: coefficient kh against the notional size h0.

    h0 = 100 → 1.0; 200 → 0.85; 300 → 0.75; ≥ 500 → 0.70, linear between (common practice);
    below 100 mm kh = 1.0 (common practice: the table starts at 100 mm).

    Args:
        h0: notional size 2Ac/u, mm.

    Returns:
        kh, dimensionless.
    """
    h = _positive("h0", h0, "mm")
    return _out(np.interp(h, _TABLE_3_3_H0, _TABLE_3_3_KH))


def epsilon_cd(
    t: ArrayLike,
    ts: ArrayLike,
    RH: ArrayLike,
    h0: ArrayLike,
    fcm: ArrayLike,
    cement_class: str = "N",
) -> FloatOrArray:
    """EN 1992-1-1:2004 Eq. 3.9: drying shrinkage εcd(t) = βds(t, ts) · kh · εcd,0.

    Args:
        t: age of concrete, days (t ≥ ts).
        ts: age at the beginning of drying, days.
        RH: relative humidity of the ambient environment, percent.
        h0: notional size 2Ac/u, mm.
        fcm: mean compressive strength at 28 days, MPa.
        cement_class: "S", "N" or "R".

    Returns:
        εcd(t), positive magnitude (shortening).
    """
    return _out(
        np.asarray(beta_ds(t, ts, h0))
        * np.asarray(k_h(h0))
        * np.asarray(epsilon_cd_0(RH, fcm, cement_class))
    )


def _fck(fck: ArrayLike) -> NDArray[np.float64]:
    f = _positive("fck", fck, "MPa")
    if np.any(f > FCK_UPPER_MPA):
        warnings.warn(
            f"fck = {mpa_ksi(worst(f, True))} exceeds {FCK_UPPER_MPA:g} MPa "
            f"({FCK_UPPER_MPA / KSI_MPA:.2f} ksi), the top strength class of EN 1992-1-1:2004 "
            "Table 3.1",
            stacklevel=3,
        )
    return f


def epsilon_ca_inf(fck: ArrayLike) -> FloatOrArray:
    """EN 1992-1-1:2004 Eq. 3.12: final autogenous shrinkage εca(∞) = 2.5 (fck − 10) · 10⁻⁶.

    Args:
        fck: characteristic cylinder strength, MPa.

    Returns:
        εca(∞), positive magnitude (negative below fck = 10 MPa, as the formula gives).
    """
    return _out(2.5 * (_fck(fck) - 10.0) * 1e-6)


def beta_as(t: ArrayLike) -> FloatOrArray:
    """EN 1992-1-1:2004 Eq. 3.13: autogenous shrinkage time function βas(t) = 1 − exp(−0.2 t^0.5).

    Args:
        t: age of concrete, days (at least 0).

    Returns:
        βas(t), dimensionless.
    """
    ta = _non_negative("t", t, "days")
    return _out(1.0 - np.exp(-0.2 * np.sqrt(ta)))


def epsilon_ca(t: ArrayLike, fck: ArrayLike) -> FloatOrArray:
    """EN 1992-1-1:2004 Eq. 3.11: autogenous shrinkage εca(t) = βas(t) · εca(∞).

    Args:
        t: age of concrete, days.
        fck: characteristic cylinder strength, MPa.

    Returns:
        εca(t), positive magnitude (shortening).
    """
    return _out(np.asarray(beta_as(t)) * np.asarray(epsilon_ca_inf(fck)))


def epsilon_cs(
    t: ArrayLike,
    ts: ArrayLike,
    RH: ArrayLike,
    h0: ArrayLike,
    fck: ArrayLike,
    cement_class: str = "N",
    fcm: ArrayLike | None = None,
) -> FloatOrArray:
    """EN 1992-1-1:2004 Eq. 3.8: total shrinkage εcs = εcd + εca.

    Args:
        t: age of concrete, days (t ≥ ts).
        ts: age at the beginning of drying, days.
        RH: relative humidity of the ambient environment, percent.
        h0: notional size 2Ac/u, mm.
        fck: characteristic cylinder strength, MPa (autogenous part, Eq. 3.12).
        cement_class: "S", "N" or "R".
        fcm: mean strength, MPa, for the drying part; ``None`` takes fck + 8 (Table 3.1).

    Returns:
        εcs, positive magnitude (shortening).
    """
    f_cm = np.asarray(fck, dtype=float) + 8.0 if fcm is None else fcm
    return _out(
        np.asarray(epsilon_cd(t, ts, RH, h0, f_cm, cement_class)) + np.asarray(epsilon_ca(t, fck))
    )


# --------------------------------------------------------------------------- relaxation
def rho_1000(relaxation_class: int) -> float:
    """EN 1992-1-1:2004 3.3.2(6): relaxation loss at 1000 h and 20 °C ρ1000, percent.

    Args:
        relaxation_class: 1 (wire or strand, ordinary relaxation), 2 (wire or strand, low
            relaxation) or 3 (hot rolled and processed bars).

    Returns:
        ρ1000 = 8 % (class 1), 2.5 % (class 2), 4 % (class 3), the values 3.3.2(6) states.
    """
    return RHO_1000_PERCENT[_relaxation_class(relaxation_class)]


def mu(sigma_pi: ArrayLike, f_pk: ArrayLike) -> FloatOrArray:
    """EN 1992-1-1:2004 3.3.2(7): stress ratio μ = σpi / fpk.

    Args:
        sigma_pi: initial tendon stress σpi (absolute value), MPa.
        f_pk: characteristic tensile strength of the tendon, MPa.

    Returns:
        μ, dimensionless.
    """
    s = _positive("sigma_pi", sigma_pi, "MPa")
    f = _positive("f_pk", f_pk, "MPa")
    return _out(s / f)


def delta_sigma_pr_over_sigma_pi(
    mu: ArrayLike,
    t: ArrayLike,
    relaxation_class: int,
    rho_1000: float | None = None,
) -> FloatOrArray:
    """EN 1992-1-1:2004 Eq. 3.28 / 3.29 / 3.30: relaxation loss ratio Δσpr / σpi.

    Class 1 (3.28): 5.39 ρ1000 e^(6.7 μ) (t/1000)^(0.75 (1 − μ)) · 10⁻⁵;
    Class 2 (3.29): 0.66 ρ1000 e^(9.1 μ) (t/1000)^(0.75 (1 − μ)) · 10⁻⁵;
    Class 3 (3.30): 1.98 ρ1000 e^(8 μ) (t/1000)^(0.75 (1 − μ)) · 10⁻⁵; ρ1000 in percent.

    Args:
        mu: σpi / fpk, strictly between 0 and 1.
        t: time after tensioning, **hours** (> 0); 500 000 h for the final value (3.3.2(8)).
        relaxation_class: 1, 2 or 3.
        rho_1000: ρ1000 in percent; ``None`` takes the value 3.3.2(6) states for the class.

    Returns:
        Δσpr / σpi, dimensionless (positive = loss).
    """
    cls = _relaxation_class(relaxation_class)
    m = _finite("mu", mu)
    if np.any(m <= 0.0) or np.any(m >= 1.0):
        raise ValueError(f"mu must be strictly between 0 and 1, got {mu}")
    th = _positive("t", t, "hours")
    rho = RHO_1000_PERCENT[cls] if rho_1000 is None else float(rho_1000)
    if not np.isfinite(rho) or rho <= 0.0:
        raise ValueError(f"rho_1000 must be greater than 0 percent, got {rho_1000}")
    coefficient, exponent = _RELAXATION[cls]
    return _out(
        coefficient * rho * np.exp(exponent * m) * (th / 1000.0) ** (0.75 * (1.0 - m)) * 1e-5
    )


def delta_sigma_pr(
    sigma_pi: ArrayLike,
    f_pk: ArrayLike,
    t: ArrayLike,
    relaxation_class: int,
    rho_1000: float | None = None,
) -> FloatOrArray:
    """EN 1992-1-1:2004 Eq. 3.28-3.30: relaxation loss Δσpr of a tendon, MPa.

    Args:
        sigma_pi: initial tendon stress (absolute value), MPa; for pre-tensioning the
            maximum tensile stress applied minus the immediate losses (3.3.2(7)).
        f_pk: characteristic tensile strength of the tendon, MPa.
        t: time after tensioning, hours (> 0).
        relaxation_class: 1, 2 or 3.
        rho_1000: ρ1000 in percent; ``None`` takes the value 3.3.2(6) states for the class.

    Returns:
        Δσpr, MPa (positive = loss).
    """
    m = mu(sigma_pi, f_pk)
    ratio = delta_sigma_pr_over_sigma_pi(m, t, relaxation_class, rho_1000)
    return _out(np.asarray(ratio) * np.asarray(sigma_pi, dtype=float))


def delta_sigma_pr_reduced(delta_sigma_pr: ArrayLike) -> FloatOrArray:
    """EN 1992-1-1:2004 5.10.6(1) Eq. 5.46: relaxation reduced for creep and shrinkage, 0.8 Δσpr.

    Args:
        delta_sigma_pr: relaxation loss Δσpr (absolute value), MPa.

    Returns:
        0.8 · Δσpr, MPa.
    """
    return _out(0.8 * _non_negative("delta_sigma_pr", delta_sigma_pr, "MPa"))


def delta_sigma_p_csr(
    epsilon_cs: ArrayLike,
    E_p: ArrayLike,
    E_cm: ArrayLike,
    delta_sigma_pr: ArrayLike,
    phi: ArrayLike,
    sigma_c_QP: ArrayLike,
    A_p: ArrayLike,
    A_c: ArrayLike,
    I_c: ArrayLike,
    z_cp: ArrayLike,
) -> FloatOrArray:
    """EN 1992-1-1:2004 Eq. 5.46: time-dependent tendon stress loss Δσp,c+s+r.

    Δσp,c+s+r = [εcs Ep + 0.8 Δσpr + (Ep/Ecm) φ(t,t0) σc,QP]
                / [1 + (Ep/Ecm)(Ap/Ac)(1 + (Ac/Ic) zcp²)(1 + 0.8 φ(t,t0))].

    As 5.10.6(1) asks, compressive stresses and the corresponding strains enter positive.

    Args:
        epsilon_cs: shrinkage strain (absolute value, 3.1.4(6)).
        E_p: modulus of the prestressing steel, MPa.
        E_cm: modulus of the concrete, MPa.
        delta_sigma_pr: relaxation loss Δσpr (absolute value) for σp = σp(G + Pm0 + ψ2 Q), MPa.
        phi: creep coefficient φ(t, t0).
        sigma_c_QP: concrete stress next to the tendons under self-weight, initial prestress
            and other quasi-permanent actions, MPa, compression positive.
        A_p: area of all tendons at the section, mm².
        A_c: area of the concrete section, mm².
        I_c: second moment of area of the concrete section, mm⁴.
        z_cp: distance between the centroid of the concrete section and the tendons, mm.

    Returns:
        Δσp,c+s+r, MPa (positive = loss); multiply by Ap for ΔPc+s+r.
    """
    eps = _finite("epsilon_cs", epsilon_cs)
    ep = _positive("E_p", E_p, "MPa")
    ec = _positive("E_cm", E_cm, "MPa")
    dpr = _non_negative("delta_sigma_pr", delta_sigma_pr, "MPa")
    ph = _non_negative("phi", phi, "")
    sc = _finite("sigma_c_QP", sigma_c_QP)
    ap = _positive("A_p", A_p, "mm²")
    ac = _positive("A_c", A_c, "mm²")
    ic = _positive("I_c", I_c, "mm⁴")
    z = _finite("z_cp", z_cp)
    n = ep / ec
    numerator = eps * ep + 0.8 * dpr + n * ph * sc
    denominator = 1.0 + n * ap / ac * (1.0 + ac / ic * z**2) * (1.0 + 0.8 * ph)
    return _out(numerator / denominator)
