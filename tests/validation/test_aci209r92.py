"""Validation of prestress.codes.aci209r92 against ACI 209R-92 (reapproved 2008), Chapter 2.

Sources, named beside each check:

* ACI 209R-92 Chapter 2 equations (Eq. 2-8 to 2-22, Table 2.5.3, Table 2.5.5.1, 2.6), worked
  by hand in the tests below, step by step. Equation numbers and coefficients are recalled
  (`from memory`), as the module docstring says.
* ACI 209.2R-08 Appendix C, Example C.1 ("ACI 209R-92 model solution", in.-lb column): the
  correction factors and creep coefficients as printed there, read from a public copy of the
  guide. The example's input page was not legible in that copy; the inputs used here
  (t0 = 14 days, h = 70 %, V/S = 4 in., slump 2.95 in. = 75 mm, ψ = 40 %, tc = 7 days) are the
  ones that reproduce every printed factor, so treat them as `from memory` / inferred.

Tolerances: hand-worked values carry 12+ significant digits, so rel 1e-9 (float round-off only).
Printed example values are rounded to 3 decimals: abs 0.0006 (half a unit in the last printed
digit plus round-off of the rounded inputs).
"""

from __future__ import annotations

import math
import warnings

import pytest

from prestress.codes import aci209r92 as aci

HAND = 1e-9


# --------------------------------------------------------------------------- hand-worked
def test_creep_moist_cured_worked_by_hand() -> None:
    """ACI 209R-92 Eq. 2-8, 2-11, 2-14, 2-21 and 2.6 (from memory), by hand.

    Moist cured, loaded at 28 days, λ = 70 %, v/s = 2.0 in., slump 3.0 in., ψ = 45 %,
    air 5 %, 100 days under load.
    """
    # Eq. 2-11: γla = 1.25 · 28^-0.118 = 1.25 · 0.674894 = 0.843617
    assert aci.gamma_la(28.0) == pytest.approx(0.8436170826436094, rel=HAND)
    # Eq. 2-14: γλ = 1.27 − 0.0067 · 70 = 0.801
    assert aci.gamma_lambda_creep(70.0) == pytest.approx(0.801, rel=HAND)
    # Eq. 2-21: γvs = 2/3 · (1 + 1.13 · e^(−0.54 · 2.0)) = 2/3 · (1 + 1.13 · 0.339596) = 0.922495
    assert aci.gamma_vs_creep(2.0) == pytest.approx(0.9224952959858541, rel=HAND)
    # 2.6: γs = 0.82 + 0.067 · 3.0 = 1.021; γψ = 0.88 + 0.0024 · 45 = 0.988;
    #      γα = 0.46 + 0.09 · 5 = 0.91 → not less than 1.0 → 1.0
    assert aci.gamma_s_creep(3.0) == pytest.approx(1.021, rel=HAND)
    assert aci.gamma_psi_creep(45.0) == pytest.approx(0.988, rel=HAND)
    assert aci.gamma_alpha_creep(5.0) == 1.0
    # γc = 0.843617 · 0.801 · 0.922495 · 1.021 · 0.988 · 1.0 = 0.628818; νu = 2.35 γc = 1.477721
    nu_u = aci.nu_u(0.8436170826436094, 0.801, 0.9224952959858541, 1.021, 0.988, 1.0)
    assert nu_u == pytest.approx(1.4777214949192177, rel=HAND)
    # Eq. 2-8: 100^0.6 = 15.848932; 15.848932 / (10 + 15.848932) = 0.613137; νt = 0.906045
    assert aci.nu_t(100.0, nu_u) == pytest.approx(0.9060454584667179, rel=HAND)
    # The whole chain, ages 28 → 128 days.
    whole = aci.creep_coefficient(
        128.0, 28.0, 70.0, v_s=2.0, s=3.0, psi_fines=45.0, alpha_air=5.0, curing="moist"
    )
    assert whole == pytest.approx(0.9060454584667179, rel=HAND)


def test_shrinkage_moist_cured_worked_by_hand() -> None:
    """ACI 209R-92 Eq. 2-9, Table 2.5.3, Eq. 2-15, 2-22 and 2.6 (from memory), by hand.

    14 days of moist curing, λ = 60 %, v/s = 3.0 in., slump 4.0 in., ψ = 60 %,
    cement 650 lb/yd³, air 7 %, 90 days of drying.
    """
    # Table 2.5.3: 14 days → 0.93
    assert aci.gamma_cp(14.0) == pytest.approx(0.93, rel=HAND)
    # Eq. 2-15: γλ = 1.40 − 0.0102 · 60 = 0.788
    assert aci.gamma_lambda_shrinkage(60.0) == pytest.approx(0.788, rel=HAND)
    # Eq. 2-22: γvs = 1.2 · e^(−0.12 · 3.0) = 1.2 · 0.697676 = 0.837212
    assert aci.gamma_vs_shrinkage(3.0) == pytest.approx(0.8372115912852373, rel=HAND)
    # 2.6: γs = 0.89 + 0.041 · 4 = 1.054; γψ (ψ > 50) = 0.90 + 0.002 · 60 = 1.02;
    #      γc = 0.75 + 0.00036 · 650 = 0.984; γα = 0.95 + 0.008 · 7 = 1.006
    assert aci.gamma_s_shrinkage(4.0) == pytest.approx(1.054, rel=HAND)
    assert aci.gamma_psi_shrinkage(60.0) == pytest.approx(1.02, rel=HAND)
    assert aci.gamma_c_shrinkage(650.0) == pytest.approx(0.984, rel=HAND)
    assert aci.gamma_alpha_shrinkage(7.0) == pytest.approx(1.006, rel=HAND)
    # γsh = 0.93 · 0.788 · 0.837212 · 1.054 · 1.02 · 0.984 · 1.006 = 0.652947
    # (εsh)u = 780e-6 · 0.652947 = 509.299e-6
    eu = aci.epsilon_sh_u(0.93, 0.788, 0.8372115912852373, 1.054, 1.02, 0.984, 1.006)
    assert eu == pytest.approx(0.0005092990464848254, rel=HAND)
    # Eq. 2-9: 90 / (35 + 90) = 0.72 → (εsh)t = 0.72 · 509.299e-6 = 366.695e-6
    assert aci.epsilon_sh_t(90.0, eu) == pytest.approx(0.00036669531346907426, rel=HAND)
    whole = aci.shrinkage_strain(
        104.0, 14.0, 60.0, v_s=3.0, s=4.0, psi_fines=60.0, c=650.0, alpha_air=7.0
    )
    assert whole == pytest.approx(0.00036669531346907426, rel=HAND)


def test_steam_cured_worked_by_hand() -> None:
    """ACI 209R-92 Eq. 2-8, 2-10, 2-12, 2-14, 2-16 (from memory), by hand; standard others."""
    # Eq. 2-12: γla = 1.13 · 3^−0.094 = 1.019129; Eq. 2-14 at 90 %: 1.27 − 0.603 = 0.667
    # νu = 2.35 · 1.019129 · 0.667 = 1.597433; Eq. 2-8 after 50 days:
    # 50^0.6 = 10.456396 → 10.456396 / 20.456396 = 0.511155 → νt = 0.816537
    assert aci.gamma_la(3.0, "steam") == pytest.approx(1.0191287316232212, rel=HAND)
    assert aci.creep_coefficient(53.0, 3.0, 90.0, curing="steam") == pytest.approx(
        0.8165365549175112, rel=HAND
    )
    # Eq. 2-16 at 90 %: γλ = 3.00 − 0.030 · 90 = 0.30; (εsh)u = 780e-6 · 0.30 = 234e-6;
    # Eq. 2-10 (f = 55) after 100 days: 100 / 155 = 0.645161 → 150.968e-6. γcp = 1 (steam).
    assert aci.gamma_cp(2.0, "steam") == 1.0
    assert aci.shrinkage_strain(102.0, 2.0, 90.0, curing="steam") == pytest.approx(
        0.000150967741935484, rel=HAND
    )


def test_humidity_factor_of_shrinkage_reaches_zero_at_saturation() -> None:
    """ACI 209R-92 Eq. 2-16 (from memory): γλ = 3.00 − 0.030 · 100 = 0 at λ = 100 %."""
    assert aci.gamma_lambda_shrinkage(100.0) == pytest.approx(0.0, abs=1e-12)
    assert aci.gamma_lambda_shrinkage(80.0) == pytest.approx(1.40 - 0.0102 * 80.0, rel=HAND)


def test_table_2_5_3_interpolation() -> None:
    """ACI 209R-92 Table 2.5.3 (from memory); linear between 14 and 28 days (common practice)."""
    # 21 days: 0.93 + (21 − 14)/(28 − 14) · (0.86 − 0.93) = 0.895
    assert aci.gamma_cp(21.0) == pytest.approx(0.895, rel=HAND)
    assert aci.gamma_cp([1.0, 3.0, 7.0, 28.0, 60.0, 90.0]) == pytest.approx(
        [1.2, 1.1, 1.0, 0.86, 0.79, 0.75], rel=HAND
    )


def test_average_thickness_factors() -> None:
    """ACI 209R-92 Table 2.5.5.1 and Eq. 2-17 to 2-20 (from memory), by hand."""
    # Table: 4 in. → creep 1.11, shrinkage 1.17; 4.5 in. → midway (common practice).
    assert aci.gamma_h_creep(4.0) == pytest.approx(1.11, rel=HAND)
    assert aci.gamma_h_shrinkage(4.0) == pytest.approx(1.17, rel=HAND)
    assert aci.gamma_h_creep(4.5) == pytest.approx(1.075, rel=HAND)
    assert aci.gamma_h_shrinkage(4.5) == pytest.approx(1.125, rel=HAND)
    # 10 in.: Eq. 2-17 1.14 − 0.23 = 0.91; Eq. 2-18 1.10 − 0.17 = 0.93;
    #         Eq. 2-19 1.23 − 0.38 = 0.85; Eq. 2-20 1.17 − 0.29 = 0.88.
    assert aci.gamma_h_creep(10.0, "first_year") == pytest.approx(0.91, rel=HAND)
    assert aci.gamma_h_creep(10.0, "ultimate") == pytest.approx(0.93, rel=HAND)
    assert aci.gamma_h_shrinkage(10.0, "first_year") == pytest.approx(0.85, rel=HAND)
    assert aci.gamma_h_shrinkage(10.0, "ultimate") == pytest.approx(0.88, rel=HAND)


def test_factors_near_one_at_standard_conditions() -> None:
    """ACI 209R-92 2.4 standard conditions give factors of 1.0 within 1 % (consistency check).

    Standard conditions (2.4, from memory): loading at 7 days (moist), λ = 40 %, v/s = 1.5 in.,
    slump 2.7 in., fine aggregate 50 %, air 6 % or less, 7 days of moist curing. The fitted
    constants of the factor equations only give 1.0 to within 1 % there.
    """
    creep = [
        aci.gamma_la(7.0),
        aci.gamma_lambda_creep(40.0),
        aci.gamma_vs_creep(1.5),
        aci.gamma_s_creep(2.7),
        aci.gamma_psi_creep(50.0),
        aci.gamma_alpha_creep(6.0),
    ]
    shrinkage = [
        aci.gamma_cp(7.0),
        aci.gamma_lambda_shrinkage(40.0),
        aci.gamma_vs_shrinkage(1.5),
        aci.gamma_s_shrinkage(2.7),
        aci.gamma_psi_shrinkage(50.0),
        aci.gamma_alpha_shrinkage(6.0),
    ]
    assert creep == pytest.approx([1.0] * 6, abs=0.01)
    assert shrinkage == pytest.approx([1.0] * 6, abs=0.01)


# --------------------------------------------------------------------------- ACI 209.2R-08
EX = 0.0006  # printed values have 3 decimals


def test_aci2092r08_example_c1_creep() -> None:
    """ACI 209.2R-08 Appendix C, Example C.1 b), in.-lb column, as printed (inputs inferred).

    Printed: γc,to = 0.916, γc,RH = 0.801, γc,vs = 0.754, γc,s = 1.018, γc,ψ = 0.976,
    γc,α = 1.000, γc = 0.549, φu = 1.29; φ(t, 14) = 0.423, 0.643, 0.740, 0.880, 0.995 at
    t = 28, 60, 90, 180, 365 days.
    """
    factors = {
        "gamma_la": aci.gamma_la(14.0),
        "gamma_lambda": aci.gamma_lambda_creep(70.0),
        "gamma_size": aci.gamma_vs_creep(4.0),
        "gamma_s": aci.gamma_s_creep(2.95),
        "gamma_psi": aci.gamma_psi_creep(40.0),
        "gamma_alpha": aci.gamma_alpha_creep(2.0),
    }
    printed = [0.916, 0.801, 0.754, 1.018, 0.976, 1.000]
    assert list(factors.values()) == pytest.approx(printed, abs=EX)
    gamma_c = math.prod(factors.values())
    assert gamma_c == pytest.approx(0.549, abs=EX)
    assert aci.nu_u(**factors) == pytest.approx(1.29, abs=0.005)  # printed with 2 decimals
    ages = [28.0, 60.0, 90.0, 180.0, 365.0]
    phis = aci.creep_coefficient(ages, 14.0, 70.0, v_s=4.0, s=2.95, psi_fines=40.0, alpha_air=2.0)
    assert phis == pytest.approx([0.423, 0.643, 0.740, 0.880, 0.995], abs=EX)


def test_aci2092r08_example_c1_shrinkage() -> None:
    """ACI 209.2R-08 Appendix C, Example C.1 a), in.-lb column, as printed (inputs inferred).

    Printed: γsh,RH = 0.686, γsh,vs = 0.743, γsh,s = 1.011, γsh,ψ = 0.860, γsh,α = 1.000,
    γsh = 0.444, εshu = 347 × 10⁻⁶ (tc = 7 days, f = 35, α = 1).

    Two differences from ACI 209R-92 show up in this example and are checked as such:
    * the guide writes γsh,RH = 1.40 − 1.02 h, which is Eq. 2-15 with h = λ/100 → 0.686 at 70 %;
    * its γsh = 0.444 needs γsh,tc ≈ 1.0045, the ACI 209.2R-08 curve 1.202 − 0.2337 log(tc) at
      7 days (from memory), where Table 2.5.3 of ACI 209R-92 gives 1.0 — with 1.0 the product
      would be 0.442. The module offers that curve as ``gamma_sh_tc``.
    The cement content is not legible in the copy; 688 lb/yd³ (408 kg/m³) reproduces the
    printed γsh,c = 0.998. The printed εshu = 347e-6 lies 0.2 % above 780e-6 × (product of the
    printed factors) = 346.2e-6, so it is checked to 0.5 %.
    """
    assert aci.gamma_lambda_shrinkage(70.0) == pytest.approx(0.686, abs=EX)
    assert aci.gamma_vs_shrinkage(4.0) == pytest.approx(0.743, abs=EX)
    assert aci.gamma_s_shrinkage(2.95) == pytest.approx(1.011, abs=EX)
    assert aci.gamma_psi_shrinkage(40.0) == pytest.approx(0.860, abs=EX)
    assert aci.gamma_c_shrinkage(688.0) == pytest.approx(0.998, abs=EX)
    assert aci.gamma_alpha_shrinkage(2.0) == pytest.approx(1.000, abs=EX)
    assert aci.gamma_sh_tc(7.0) == pytest.approx(1.0045, abs=0.0001)
    eu = aci.epsilon_sh_u(
        gamma_cp=aci.gamma_sh_tc(7.0),
        gamma_lambda=aci.gamma_lambda_shrinkage(70.0),
        gamma_size=aci.gamma_vs_shrinkage(4.0),
        gamma_s=aci.gamma_s_shrinkage(2.95),
        gamma_psi=aci.gamma_psi_shrinkage(40.0),
        gamma_c=aci.gamma_c_shrinkage(688.0),
        gamma_alpha=aci.gamma_alpha_shrinkage(2.0),
    )
    assert eu / 780e-6 == pytest.approx(0.444, abs=EX)
    assert eu == pytest.approx(347e-6, rel=0.005)


# --------------------------------------------------------------------------- range errors
@pytest.mark.parametrize("rh", [-1.0, 100.5])
def test_rh_outside_0_100_raises(rh: float) -> None:
    with pytest.raises(ValueError, match="RH"):
        aci.gamma_lambda_creep(rh)
    with pytest.raises(ValueError, match="RH"):
        aci.gamma_lambda_shrinkage(rh)
    with pytest.raises(ValueError, match="RH"):
        aci.creep_coefficient(100.0, 28.0, rh)


def test_rh_below_40_warns() -> None:
    with pytest.warns(UserWarning, match="RH"):
        aci.gamma_lambda_creep(30.0)


def test_t_before_loading_age_raises() -> None:
    with pytest.raises(ValueError, match="t must be at least t_la"):
        aci.creep_coefficient(20.0, 28.0, 70.0)
    with pytest.raises(ValueError, match="t must be at least t_c"):
        aci.shrinkage_strain(5.0, 7.0, 70.0)
    with pytest.raises(ValueError, match="t must be at least 0"):
        aci.nu_t(-1.0, 2.35)


@pytest.mark.parametrize(
    ("call", "name"),
    [
        (lambda: aci.gamma_vs_creep(-1.5), "v_s"),
        (lambda: aci.gamma_vs_shrinkage(0.0), "v_s"),
        (lambda: aci.gamma_h_creep(-4.0), "h"),
        (lambda: aci.gamma_h_shrinkage(-4.0), "h"),
        (lambda: aci.gamma_s_creep(-1.0), "s"),
        (lambda: aci.gamma_c_shrinkage(-10.0), "c"),
        (lambda: aci.gamma_psi_creep(120.0), "psi"),
        (lambda: aci.gamma_alpha_shrinkage(-2.0), "alpha"),
        (lambda: aci.gamma_la(0.0), "t_la"),
        (lambda: aci.gamma_la(28.0, "oven"), "curing"),
        (lambda: aci.gamma_h_creep(8.0, "decade"), "period"),
    ],
)
def test_invalid_arguments_raise_naming_the_argument(call, name: str) -> None:
    with pytest.raises(ValueError, match=rf"^{name} "):
        call()


def test_early_loading_warns() -> None:
    with pytest.warns(UserWarning, match="t_la"):
        aci.gamma_la(3.0, "moist")
    with warnings.catch_warnings():
        warnings.simplefilter("error")
        aci.gamma_la(3.0, "steam")
