"""ACI 209R-92 (reapproved 2008) Chapter 2: creep coefficient and shrinkage strain of concrete.

Units as printed in the report (in.-lb): volume-to-surface ratio v/s and average thickness h in
in., slump s in in., fine aggregate ψ (by weight of total aggregate) and air content α in
percent, cement content c in lb/yd³, relative humidity λ in percent, times in days.

Sign convention as printed: the shrinkage strain is returned as a **positive magnitude**
(in./in., a shortening); the engine gives it the project's sign. Creep coefficients are
positive.

Structure of the model (2.3 / 2.4):

* creep coefficient νt = t^ψ / (d + t^ψ) · νu, t = time after loading; standard ψ = 0.60 and
  d = 10 days for moist- and steam-cured concrete (Eq. 2-8); 2.3 gives the ranges
  ψ = 0.40 to 0.80 and d = 6 to 30 days for other concretes (from memory);
* νu = 2.35 γc, γc the product of the correction factors of 2.5 and 2.6;
* shrinkage (εsh)t = t^α / (f + t^α) · (εsh)u, t = time after the end of initial curing;
  standard α = 1.0 with f = 35 days after 7 days of moist curing (Eq. 2-9) and f = 55 days
  after 1 to 3 days of steam curing (Eq. 2-10); 2.3 gives α = 0.90 to 1.10 and f = 20 to
  130 days for other concretes (from memory);
* (εsh)u = 780 × 10⁻⁶ γsh, γsh the product of the shrinkage correction factors.

Eq. numbers (2-8) to (2-22) are cited as best recalled (`from memory`); the concrete
composition factors of 2.6 are cited by section only, because their equation numbers are not
recalled reliably. Where ACI 209.2R-08 Appendix A transcribes a factor its number is added.

Every factor is a pure function named after its symbol. Arguments may be floats or numpy
arrays; a float comes back when every argument is a scalar.

Range checks (``ValueError``, message names the argument): λ within 0 to 100 %; v/s, h,
slump ≥ 0 or > 0 as stated; ψ and α within 0 to 100 %; c > 0; times ≥ 0 and t ≥ loading age.

Soft limits (``warnings.warn``): λ below 40 % (2.5.4 gives the factors for λ ≥ 40 %);
loading age before 7 days (moist) or 1 day (steam), outside 2.5.1; initial moist curing
outside 1 to 90 days (Table 2.5.3); average thickness outside 2 to 15 in. (2.5.5.1).
"""

from __future__ import annotations

import warnings

import numpy as np
from numpy.typing import ArrayLike, NDArray

from prestress.codes._args import finite as _finite
from prestress.codes._args import in_mm, worst
from prestress.codes._args import non_negative as _non_negative
from prestress.codes._args import out as _out
from prestress.codes._args import positive as _positive

FloatOrArray = float | NDArray[np.float64]

CURING_METHODS: tuple[str, ...] = ("moist", "steam")

#: Standard ultimate creep coefficient of 2.4 (νu = 2.35 γc).
NU_U_STANDARD = 2.35
#: Standard ultimate shrinkage strain of 2.4 ((εsh)u = 780 × 10⁻⁶ γsh), in./in.
EPSILON_SH_U_STANDARD = 780e-6
#: Standard time parameters of Eq. 2-8 (creep) and 2-9 / 2-10 (shrinkage).
PSI_STANDARD = 0.60
D_STANDARD_DAYS = 10.0
F_MOIST_DAYS = 35.0
F_STEAM_DAYS = 55.0

#: Table 2.5.3 (from memory): shrinkage factor γcp against the duration of initial moist
#: curing, days; linear between the tabulated durations (common practice).
TABLE_2_5_3_DAYS = (1.0, 3.0, 7.0, 14.0, 28.0, 60.0, 90.0)
TABLE_2_5_3_GAMMA_CP = (1.2, 1.1, 1.0, 0.93, 0.86, 0.79, 0.75)

#: Table 2.5.5.1 (from memory): average-thickness factors for h ≤ 6 in.; linear between the
#: tabulated thicknesses (common practice).
TABLE_2_5_5_1_H_IN = (2.0, 3.0, 4.0, 5.0, 6.0)
TABLE_2_5_5_1_CREEP = (1.30, 1.17, 1.11, 1.04, 1.00)
TABLE_2_5_5_1_SHRINKAGE = (1.35, 1.25, 1.17, 1.08, 1.00)

RH_LOWER_PERCENT = 40.0


# --------------------------------------------------------------------------- helpers


def _percent(name: str, value: ArrayLike) -> NDArray[np.float64]:
    a = _finite(name, value)
    if np.any(a < 0.0) or np.any(a > 100.0):
        raise ValueError(f"{name} must be a percentage from 0 to 100, got {value}")
    return a


def _rh(RH: ArrayLike) -> NDArray[np.float64]:
    r = _finite("RH", RH)
    if np.any(r < 0.0) or np.any(r > 100.0):
        raise ValueError(f"RH must be a relative humidity from 0 to 100 percent, got {RH}")
    if np.any(r < RH_LOWER_PERCENT):
        warnings.warn(
            f"RH = {worst(r, False):g} % is below {RH_LOWER_PERCENT:g} %, the lowest humidity "
            "for which ACI 209R-92 2.5.4 gives its creep and shrinkage correction factors",
            stacklevel=3,
        )
    return r


def _curing(curing: str) -> str:
    key = str(curing).strip().lower()
    if key not in CURING_METHODS:
        raise ValueError(f"curing must be 'moist' or 'steam', got {curing!r}")
    return key


# --------------------------------------------------------------------------- time functions
def nu_t(
    t: ArrayLike,
    nu_u: ArrayLike,
    psi: float = PSI_STANDARD,
    d: float = D_STANDARD_DAYS,
) -> FloatOrArray:
    """ACI 209R-92 Eq. 2-8 (from memory): creep coefficient νt = t^ψ / (d + t^ψ) · νu.

    Args:
        t: time after loading, days (at least 0).
        nu_u: ultimate creep coefficient νu.
        psi: time exponent ψ; 0.60 standard (2.4), 0.40 to 0.80 per 2.3.
        d: time parameter d, days; 10 standard (2.4), 6 to 30 per 2.3.

    Returns:
        νt, dimensionless.
    """
    ta = _non_negative("t", t, "days")
    nu = _non_negative("nu_u", nu_u, "")
    p = float(_positive("psi", psi, ""))
    dd = float(_positive("d", d, "days"))
    tp = ta**p
    return _out(tp / (dd + tp) * nu)


def epsilon_sh_t(
    t: ArrayLike,
    epsilon_sh_u: ArrayLike,
    f: float = F_MOIST_DAYS,
    alpha: float = 1.0,
) -> FloatOrArray:
    """ACI 209R-92 Eq. 2-9 / 2-10 (from memory): shrinkage (εsh)t = t^α / (f + t^α) · (εsh)u.

    Args:
        t: time after the end of initial curing, days (at least 0).
        epsilon_sh_u: ultimate shrinkage strain (εsh)u, in./in. (positive magnitude).
        f: time parameter f, days; 35 after moist curing (Eq. 2-9), 55 after steam curing
            (Eq. 2-10); 20 to 130 per 2.3.
        alpha: time exponent α; 1.0 standard, 0.90 to 1.10 per 2.3.

    Returns:
        (εsh)t, in./in. (positive = shortening).
    """
    ta = _non_negative("t", t, "days")
    eu = _non_negative("epsilon_sh_u", epsilon_sh_u, "")
    ff = float(_positive("f", f, "days"))
    a = float(_positive("alpha", alpha, ""))
    ta_a = ta**a
    return _out(ta_a / (ff + ta_a) * eu)


def nu_u(
    gamma_la: ArrayLike = 1.0,
    gamma_lambda: ArrayLike = 1.0,
    gamma_size: ArrayLike = 1.0,
    gamma_s: ArrayLike = 1.0,
    gamma_psi: ArrayLike = 1.0,
    gamma_alpha: ArrayLike = 1.0,
) -> FloatOrArray:
    """ACI 209R-92 2.4: ultimate creep coefficient νu = 2.35 γc, γc the product of the factors.

    Args:
        gamma_la: loading-age factor (Eq. 2-11 / 2-12).
        gamma_lambda: ambient relative humidity factor (Eq. 2-14).
        gamma_size: member-size factor, γvs (Eq. 2-21) or γh (Table 2.5.5.1, Eq. 2-17/2-18).
        gamma_s: slump factor (2.6).
        gamma_psi: fine aggregate factor (2.6).
        gamma_alpha: air content factor (2.6).

    Returns:
        νu, dimensionless.
    """
    factors = [
        _non_negative(name, value, "")
        for name, value in (
            ("gamma_la", gamma_la),
            ("gamma_lambda", gamma_lambda),
            ("gamma_size", gamma_size),
            ("gamma_s", gamma_s),
            ("gamma_psi", gamma_psi),
            ("gamma_alpha", gamma_alpha),
        )
    ]
    return _out(NU_U_STANDARD * np.prod(np.broadcast_arrays(*factors), axis=0))


def epsilon_sh_u(
    gamma_cp: ArrayLike = 1.0,
    gamma_lambda: ArrayLike = 1.0,
    gamma_size: ArrayLike = 1.0,
    gamma_s: ArrayLike = 1.0,
    gamma_psi: ArrayLike = 1.0,
    gamma_c: ArrayLike = 1.0,
    gamma_alpha: ArrayLike = 1.0,
) -> FloatOrArray:
    """ACI 209R-92 2.4: ultimate shrinkage (εsh)u = 780 × 10⁻⁶ γsh, γsh the product of factors.

    Args:
        gamma_cp: initial moist curing factor (Table 2.5.3; 1.0 after steam curing).
        gamma_lambda: ambient relative humidity factor (Eq. 2-15 / 2-16).
        gamma_size: member-size factor, γvs (Eq. 2-22) or γh (Table 2.5.5.1, Eq. 2-19/2-20).
        gamma_s: slump factor (2.6).
        gamma_psi: fine aggregate factor (2.6).
        gamma_c: cement content factor (2.6).
        gamma_alpha: air content factor (2.6).

    Returns:
        (εsh)u, in./in. (positive = shortening).
    """
    factors = [
        _non_negative(name, value, "")
        for name, value in (
            ("gamma_cp", gamma_cp),
            ("gamma_lambda", gamma_lambda),
            ("gamma_size", gamma_size),
            ("gamma_s", gamma_s),
            ("gamma_psi", gamma_psi),
            ("gamma_c", gamma_c),
            ("gamma_alpha", gamma_alpha),
        )
    ]
    return _out(EPSILON_SH_U_STANDARD * np.prod(np.broadcast_arrays(*factors), axis=0))


# --------------------------------------------------------------------------- creep factors
def gamma_la(t_la: ArrayLike, curing: str = "moist") -> FloatOrArray:
    """ACI 209R-92 Eq. 2-11 / 2-12 (from memory): loading-age factor γla of creep.

    Moist cured (Eq. 2-11): γla = 1.25 t_la^−0.118; steam cured (Eq. 2-12): γla = 1.13 t_la^−0.094.

    Args:
        t_la: age at loading, days (> 0); 2.5.1 covers loading later than 7 days (moist) or
            1 to 3 days (steam).
        curing: "moist" or "steam".

    Returns:
        γla, dimensionless.
    """
    t = _positive("t_la", t_la, "days")
    method = _curing(curing)
    earliest = 7.0 if method == "moist" else 1.0
    if np.any(t < earliest):
        warnings.warn(
            f"age at loading t_la = {worst(t, False):.3g} d is earlier than {earliest:g} d, "
            f"outside ACI 209R-92 2.5.1 for {method}-cured concrete",
            stacklevel=2,
        )
    if method == "moist":
        return _out(1.25 * t**-0.118)
    return _out(1.13 * t**-0.094)


def gamma_lambda_creep(RH: ArrayLike) -> FloatOrArray:
    """ACI 209R-92 Eq. 2-14 (from memory): relative humidity factor of creep γλ = 1.27 − 0.0067 λ.

    Args:
        RH: ambient relative humidity λ, percent (2.5.4: λ ≥ 40 %).

    Returns:
        γλ, dimensionless.
    """
    return _out(1.27 - 0.0067 * _rh(RH))


def gamma_vs_creep(v_s: ArrayLike) -> FloatOrArray:
    """ACI 209R-92 Eq. 2-21 (from memory): volume-to-surface factor of creep.

    γvs = (2/3) [1 + 1.13 exp(−0.54 v/s)], v/s in in.

    Args:
        v_s: volume-to-surface ratio v/s, in. (> 0).

    Returns:
        γvs, dimensionless.
    """
    vs = _positive("v_s", v_s, "in.")
    return _out(2.0 / 3.0 * (1.0 + 1.13 * np.exp(-0.54 * vs)))


def _h_in(h: ArrayLike) -> NDArray[np.float64]:
    hh = _positive("h", h, "in.")
    if np.any(hh < 2.0) or np.any(hh > 15.0):
        warnings.warn(
            f"average thickness h = {in_mm(worst(hh, hh.max() > 15.0))} lies outside 2 to "
            "15 in. (51 to 381 mm), the thicknesses ACI 209R-92 2.5.5.1 covers; the nearest "
            "tabulated value or the equations are used",
            stacklevel=3,
        )
    return hh


def _period(period: str) -> str:
    key = str(period).strip().lower()
    if key not in ("first_year", "ultimate"):
        raise ValueError(f"period must be 'first_year' or 'ultimate', got {period!r}")
    return key


def gamma_h_creep(h: ArrayLike, period: str = "ultimate") -> FloatOrArray:
    """ACI 209R-92 Table 2.5.5.1, Eq. 2-17 / 2-18 (from memory): thickness factor of creep.

    h ≤ 6 in.: Table 2.5.5.1 (2 in. → 1.30, 3 → 1.17, 4 → 1.11, 5 → 1.04, 6 → 1.00);
    h > 6 in.: γh = 1.14 − 0.023 h during the first year after loading (Eq. 2-17),
    γh = 1.10 − 0.017 h for ultimate values (Eq. 2-18). An alternative to :func:`gamma_vs_creep`.

    Args:
        h: average thickness of the member, in.
        period: "first_year" or "ultimate" (only matters above 6 in.).

    Returns:
        γh, dimensionless.
    """
    hh = _h_in(h)
    eq = 1.14 - 0.023 * hh if _period(period) == "first_year" else 1.10 - 0.017 * hh
    table = np.interp(hh, TABLE_2_5_5_1_H_IN, TABLE_2_5_5_1_CREEP)
    return _out(np.where(hh <= 6.0, table, eq))


def gamma_s_creep(s: ArrayLike) -> FloatOrArray:
    """ACI 209R-92 2.6 (from memory): slump factor of creep γs = 0.82 + 0.067 s, s in in.

    Args:
        s: slump of the fresh concrete, in. (at least 0).

    Returns:
        γs, dimensionless.
    """
    return _out(0.82 + 0.067 * _non_negative("s", s, "in."))


def gamma_psi_creep(psi: ArrayLike) -> FloatOrArray:
    """ACI 209R-92 2.6 (from memory): fine aggregate factor of creep γψ = 0.88 + 0.0024 ψ.

    Args:
        psi: ratio of fine aggregate to total aggregate by weight ψ, percent.

    Returns:
        γψ, dimensionless.
    """
    return _out(0.88 + 0.0024 * _percent("psi", psi))


def gamma_alpha_creep(alpha: ArrayLike) -> FloatOrArray:
    """ACI 209R-92 2.6 (from memory): air content factor of creep γα = 0.46 + 0.09 α ≥ 1.0.

    Args:
        alpha: air content α, percent.

    Returns:
        γα, dimensionless.
    """
    return _out(np.maximum(0.46 + 0.09 * _percent("alpha", alpha), 1.0))


# --------------------------------------------------------------------------- shrinkage factors
def gamma_cp(t_c: ArrayLike, curing: str = "moist") -> FloatOrArray:
    """ACI 209R-92 Table 2.5.3 (from memory): initial moist curing factor γcp of shrinkage.

    Moist curing for 1, 3, 7, 14, 28, 60, 90 days: 1.2, 1.1, 1.0, 0.93, 0.86, 0.79, 0.75,
    linear between (common practice) and held at the end values outside 1..90 days (with a
    warning). Steam curing for 1 to 3 days: 1.0.

    Args:
        t_c: duration of initial moist curing, days (> 0).
        curing: "moist" or "steam".

    Returns:
        γcp, dimensionless.
    """
    t = _positive("t_c", t_c, "days")
    if _curing(curing) == "steam":
        return _out(np.ones_like(t))
    if np.any(t < 1.0) or np.any(t > 90.0):
        warnings.warn(
            f"moist-curing period t_c = {worst(t, t.max() > 90.0):.3g} d lies outside 1 to "
            "90 d, the range of ACI 209R-92 Table 2.5.3",
            stacklevel=2,
        )
    return _out(np.interp(t, TABLE_2_5_3_DAYS, TABLE_2_5_3_GAMMA_CP))


def gamma_sh_tc(t_c: ArrayLike) -> FloatOrArray:
    """ACI 209.2R-08 Eq. A-6 (from memory): curve fit γsh,tc = 1.202 − 0.2337 log10(tc).

    ACI 209.2R-08 A.1 uses this line for the initial moist curing factor; it stays close to
    Table 2.5.3 of ACI 209R-92 (1.0045 at 7 days where the table gives 1.0). Offered for
    comparison with that guide's worked example; :func:`gamma_cp` is the ACI 209R-92 factor.

    Args:
        t_c: duration of initial moist curing, days (> 0).

    Returns:
        γsh,tc, dimensionless.
    """
    return _out(1.202 - 0.2337 * np.log10(_positive("t_c", t_c, "days")))


def gamma_lambda_shrinkage(RH: ArrayLike) -> FloatOrArray:
    """ACI 209R-92 Eq. 2-15 / 2-16 (from memory): relative humidity factor of shrinkage γλ.

    γλ = 1.40 − 0.0102 λ for 40 ≤ λ ≤ 80 % (Eq. 2-15); γλ = 3.00 − 0.030 λ for 80 < λ ≤ 100 %
    (Eq. 2-16). (ACI 209.2R-08 Eq. A-7 writes 1.40 − 1.02h and 3.00 − 3h with h = λ/100.)

    Args:
        RH: ambient relative humidity λ, percent.

    Returns:
        γλ, dimensionless (0 at 100 %).
    """
    r = _rh(RH)
    return _out(np.where(r <= 80.0, 1.40 - 0.0102 * r, 3.00 - 0.030 * r))


def gamma_vs_shrinkage(v_s: ArrayLike) -> FloatOrArray:
    """ACI 209R-92 Eq. 2-22 (from memory): volume-to-surface factor of shrinkage γvs.

    γvs = 1.2 exp(−0.12 v/s), v/s in in. (ACI 209.2R-08 Eq. A-8.)

    Args:
        v_s: volume-to-surface ratio v/s, in. (> 0).

    Returns:
        γvs, dimensionless.
    """
    return _out(1.2 * np.exp(-0.12 * _positive("v_s", v_s, "in.")))


def gamma_h_shrinkage(h: ArrayLike, period: str = "ultimate") -> FloatOrArray:
    """ACI 209R-92 Table 2.5.5.1, Eq. 2-19 / 2-20 (from memory): thickness factor of shrinkage.

    h ≤ 6 in.: Table 2.5.5.1 (2 in. → 1.35, 3 → 1.25, 4 → 1.17, 5 → 1.08, 6 → 1.00);
    h > 6 in.: γh = 1.23 − 0.038 h during the first year of drying (Eq. 2-19),
    γh = 1.17 − 0.029 h for ultimate values (Eq. 2-20). An alternative to
    :func:`gamma_vs_shrinkage`.

    Args:
        h: average thickness of the member, in.
        period: "first_year" or "ultimate" (only matters above 6 in.).

    Returns:
        γh, dimensionless.
    """
    hh = _h_in(h)
    eq = 1.23 - 0.038 * hh if _period(period) == "first_year" else 1.17 - 0.029 * hh
    table = np.interp(hh, TABLE_2_5_5_1_H_IN, TABLE_2_5_5_1_SHRINKAGE)
    return _out(np.where(hh <= 6.0, table, eq))


def gamma_s_shrinkage(s: ArrayLike) -> FloatOrArray:
    """ACI 209R-92 2.6 (from memory): slump factor of shrinkage γs = 0.89 + 0.041 s, s in in.

    (ACI 209.2R-08 Eq. A-11.)

    Args:
        s: slump of the fresh concrete, in. (at least 0).

    Returns:
        γs, dimensionless.
    """
    return _out(0.89 + 0.041 * _non_negative("s", s, "in."))


def gamma_psi_shrinkage(psi: ArrayLike) -> FloatOrArray:
    """ACI 209R-92 2.6 (from memory): fine aggregate factor of shrinkage γψ.

    γψ = 0.30 + 0.014 ψ for ψ ≤ 50 %; γψ = 0.90 + 0.002 ψ for ψ > 50 % (ACI 209.2R-08 Eq. A-12).

    Args:
        psi: ratio of fine aggregate to total aggregate by weight ψ, percent.

    Returns:
        γψ, dimensionless.
    """
    p = _percent("psi", psi)
    return _out(np.where(p <= 50.0, 0.30 + 0.014 * p, 0.90 + 0.002 * p))


def gamma_c_shrinkage(c: ArrayLike) -> FloatOrArray:
    """ACI 209R-92 2.6 (from memory): cement content factor of shrinkage γc = 0.75 + 0.00036 c.

    (ACI 209.2R-08 Eq. A-13, c in lb/yd³.)

    Args:
        c: cement content, lb/yd³ (> 0).

    Returns:
        γc, dimensionless.
    """
    return _out(0.75 + 0.00036 * _positive("c", c, "lb/yd³"))


def gamma_alpha_shrinkage(alpha: ArrayLike) -> FloatOrArray:
    """ACI 209R-92 2.6 (from memory): air content factor of shrinkage γα = 0.95 + 0.008 α ≥ 1.

    The lower bound 1.0 is as ACI 209.2R-08 Eq. A-14 prints it.

    Args:
        alpha: air content α, percent.

    Returns:
        γα, dimensionless.
    """
    return _out(np.maximum(0.95 + 0.008 * _percent("alpha", alpha), 1.0))


# --------------------------------------------------------------------------- whole model
def creep_coefficient(
    t: ArrayLike,
    t_la: ArrayLike,
    RH: ArrayLike,
    v_s: ArrayLike | None = None,
    s: ArrayLike | None = None,
    psi_fines: ArrayLike | None = None,
    alpha_air: ArrayLike | None = None,
    curing: str = "moist",
    psi: float = PSI_STANDARD,
    d: float = D_STANDARD_DAYS,
) -> FloatOrArray:
    """ACI 209R-92 Eq. 2-8 with 2.4 to 2.6: creep coefficient at age t of concrete loaded at t_la.

    νt = (t − t_la)^ψ / (d + (t − t_la)^ψ) · 2.35 · γla γλ γvs γs γψ γα. A factor whose
    input is ``None`` is taken at the standard condition of 2.4 (factor 1.0).

    Args:
        t: age of concrete at the moment considered, days (t ≥ t_la).
        t_la: age at loading, days.
        RH: ambient relative humidity λ, percent.
        v_s: volume-to-surface ratio, in.; ``None`` = standard (1.5 in.).
        s: slump, in.; ``None`` = standard (2.7 in.).
        psi_fines: fine aggregate percentage ψ; ``None`` = standard (50 %).
        alpha_air: air content, percent; ``None`` = standard (6 % or less).
        curing: "moist" or "steam" (loading-age factor Eq. 2-11 / 2-12).
        psi: time exponent ψ of Eq. 2-8 (0.60 standard).
        d: time parameter d of Eq. 2-8, days (10 standard).

    Returns:
        νt, dimensionless.
    """
    la = _positive("t_la", t_la, "days")
    ta = _non_negative("t", t, "days")
    if np.any(ta < la):
        raise ValueError(f"t must be at least t_la (days), got t = {t}")
    nu = nu_u(
        gamma_la=gamma_la(la, curing),
        gamma_lambda=gamma_lambda_creep(RH),
        gamma_size=1.0 if v_s is None else gamma_vs_creep(v_s),
        gamma_s=1.0 if s is None else gamma_s_creep(s),
        gamma_psi=1.0 if psi_fines is None else gamma_psi_creep(psi_fines),
        gamma_alpha=1.0 if alpha_air is None else gamma_alpha_creep(alpha_air),
    )
    return nu_t(ta - la, nu, psi=psi, d=d)


def shrinkage_strain(
    t: ArrayLike,
    t_c: ArrayLike,
    RH: ArrayLike,
    v_s: ArrayLike | None = None,
    s: ArrayLike | None = None,
    psi_fines: ArrayLike | None = None,
    c: ArrayLike | None = None,
    alpha_air: ArrayLike | None = None,
    curing: str = "moist",
    f: float | None = None,
    alpha: float = 1.0,
) -> FloatOrArray:
    """ACI 209R-92 Eq. 2-9 / 2-10 with 2.4 to 2.6: shrinkage at age t after curing ended at t_c.

    (εsh)t = (t − t_c)^α / (f + (t − t_c)^α) · 780 × 10⁻⁶ · γcp γλ γvs γs γψ γc γα. A factor
    whose input is ``None`` is taken at the standard condition of 2.4 (factor 1.0).

    Args:
        t: age of concrete at the moment considered, days (t ≥ t_c).
        t_c: age at the end of initial curing = duration of initial curing, days.
        RH: ambient relative humidity λ, percent.
        v_s: volume-to-surface ratio, in.; ``None`` = standard (1.5 in.).
        s: slump, in.; ``None`` = standard (2.7 in.).
        psi_fines: fine aggregate percentage ψ; ``None`` = standard (50 %).
        c: cement content, lb/yd³; ``None`` = standard (factor 1.0).
        alpha_air: air content, percent; ``None`` = standard (6 % or less).
        curing: "moist" (f = 35 days, Table 2.5.3 factor) or "steam" (f = 55 days, factor 1.0).
        f: time parameter f, days; ``None`` takes 35 (moist) or 55 (steam).
        alpha: time exponent α (1.0 standard).

    Returns:
        (εsh)t, in./in. (positive = shortening).
    """
    tc = _positive("t_c", t_c, "days")
    ta = _non_negative("t", t, "days")
    if np.any(ta < tc):
        raise ValueError(f"t must be at least t_c (days), got t = {t}")
    method = _curing(curing)
    eu = epsilon_sh_u(
        gamma_cp=gamma_cp(tc, method),
        gamma_lambda=gamma_lambda_shrinkage(RH),
        gamma_size=1.0 if v_s is None else gamma_vs_shrinkage(v_s),
        gamma_s=1.0 if s is None else gamma_s_shrinkage(s),
        gamma_psi=1.0 if psi_fines is None else gamma_psi_shrinkage(psi_fines),
        gamma_c=1.0 if c is None else gamma_c_shrinkage(c),
        gamma_alpha=1.0 if alpha_air is None else gamma_alpha_shrinkage(alpha_air),
    )
    f_days = (F_MOIST_DAYS if method == "moist" else F_STEAM_DAYS) if f is None else f
    return epsilon_sh_t(ta - tc, eu, f=f_days, alpha=alpha)
