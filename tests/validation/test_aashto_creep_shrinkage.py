"""AASHTO LRFD Bridge Design Specifications, 9th Ed. (2020), 5.4.2.3: creep and shrinkage.

Each expected value is worked by hand in the test from the printed equation named beside it
(no published worked example is used here). Inputs are chosen so the arithmetic is short:
f'ci = 4.0 ksi gives kf = 1.0 and 12(100 − 4f'ci)/(f'ci + 20) = 42 days, H = 70 % gives
khc = 1.00, and V/S ≥ 3.46 in. puts ks on its floor of 1.0.

Tolerance: rel 1e-12 for the closed forms (floating-point round-off only); where a value
below is written with rounded digits, the tolerance is one unit of its last digit.
"""

import warnings

import numpy as np
import pytest

from prestress.codes.aashto_lrfd.creep_shrinkage import (
    epsilon_sh,
    k_f,
    k_hc,
    k_hs,
    k_s,
    k_td,
    psi,
)

EXACT = 1e-12


# --- ks, Eq. 5.4.2.3.2-2: ks = 1.45 − 0.13 V/S ≥ 1.0 -----------------------------------


def test_k_s_above_floor():
    # Eq. 5.4.2.3.2-2: 1.45 − 0.13 × 3.0 = 1.06; 1.45 − 0.13 × 2.0 = 1.19
    assert k_s(3.0) == pytest.approx(1.06, rel=EXACT)
    assert k_s(2.0) == pytest.approx(1.19, rel=EXACT)


def test_k_s_floor_at_one():
    # Eq. 5.4.2.3.2-2 "≥ 1.0": 1.45 − 0.13 × 4.0 = 0.93 → 1.0; floor reached at V/S = 0.45/0.13
    assert k_s(4.0) == 1.0
    assert k_s(10.0) == 1.0
    assert k_s(0.45 / 0.13) == pytest.approx(1.0, rel=EXACT)
    assert k_s(0.45 / 0.13 - 0.01) > 1.0


def test_k_s_vectorised():
    out = k_s(np.array([2.0, 3.0, 4.0]))
    assert isinstance(out, np.ndarray)
    np.testing.assert_allclose(out, [1.19, 1.06, 1.0], rtol=EXACT)


@pytest.mark.parametrize("bad", [0.0, -1.0, float("nan")])
def test_k_s_rejects_non_positive_v_s(bad):
    with pytest.raises(ValueError, match="V_S"):
        k_s(bad)


# --- khc, Eq. 5.4.2.3.2-3 and khs, Eq. 5.4.2.3.3-2 ----------------------------------------


def test_k_hc_values():
    # Eq. 5.4.2.3.2-3: 1.56 − 0.008 H
    assert k_hc(70.0) == pytest.approx(1.00, rel=EXACT)
    assert k_hc(0.0) == pytest.approx(1.56, rel=EXACT)
    assert k_hc(100.0) == pytest.approx(0.76, rel=EXACT)


def test_k_hs_values():
    # Eq. 5.4.2.3.3-2: 2.00 − 0.014 H
    assert k_hs(70.0) == pytest.approx(1.02, rel=EXACT)
    assert k_hs(0.0) == pytest.approx(2.00, rel=EXACT)
    assert k_hs(100.0) == pytest.approx(0.60, rel=EXACT)


@pytest.mark.parametrize("bad", [-0.1, 100.1, float("nan")])
def test_humidity_out_of_range(bad):
    with pytest.raises(ValueError, match="H must be"):
        k_hc(bad)
    with pytest.raises(ValueError, match="H must be"):
        k_hs(bad)


# --- kf, Eq. 5.4.2.3.2-4 ---------------------------------------------------------------


def test_k_f_values():
    # Eq. 5.4.2.3.2-4: 5 / (1 + f'ci)
    assert k_f(4.0) == pytest.approx(1.0, rel=EXACT)
    assert k_f(5.8) == pytest.approx(5.0 / 6.8, rel=EXACT)  # 0.7353
    assert k_f(5.8) == pytest.approx(0.7353, abs=1e-4)


@pytest.mark.parametrize("bad", [0.0, -2.0, 25.0])
def test_k_f_rejects_bad_strength(bad):
    with pytest.raises(ValueError, match="f_ci"):
        k_f(bad)


def test_k_f_warns_above_15_ksi():
    # 5.4.2.3.1: equations stated for concrete strengths up to 15.0 ksi (from memory)
    with pytest.warns(UserWarning, match="15"):
        k_f(16.0)


# --- ktd, Eq. 5.4.2.3.2-5 ----------------------------------------------------------------


def test_k_td_hand_values():
    # Eq. 5.4.2.3.2-5 with f'ci = 4.0 ksi: 12(100 − 16)/(24) = 42 days, so ktd(42) = 0.5
    assert k_td(42.0, 4.0) == pytest.approx(0.5, rel=EXACT)
    assert k_td(0.0, 4.0) == 0.0
    # f'ci = 5.8 ksi: 12(100 − 23.2)/25.8 = 35.7209 days; ktd(89) = 89/124.7209 = 0.71359
    assert k_td(89.0, 5.8) == pytest.approx(89.0 / (12.0 * 76.8 / 25.8 + 89.0), rel=EXACT)
    assert k_td(89.0, 5.8) == pytest.approx(0.71359, abs=1e-5)


def test_k_td_vectorised_and_monotone():
    t = np.array([0.0, 1.0, 10.0, 42.0, 1000.0, 1.0e6])
    out = k_td(t, 4.0)
    np.testing.assert_allclose(out, t / (42.0 + t), rtol=EXACT)
    assert np.all(np.diff(out) > 0.0)
    assert out[-1] < 1.0


def test_k_td_rejects_negative_time():
    with pytest.raises(ValueError, match="t must be"):
        k_td(-1.0, 4.0)


# --- ψ(t, ti), Eq. 5.4.2.3.2-1 -------------------------------------------------------------


def test_psi_hand_value_loaded_at_one_day():
    # Eq. 5.4.2.3.2-1: 1.9 ks khc kf ktd ti^-0.118 = 1.9 × 1.0 × 1.00 × 1.0 × 0.5 × 1 = 0.95
    assert psi(42.0, 1.0, V_S=4.0, H=70.0, f_ci=4.0) == pytest.approx(0.95, rel=EXACT)


def test_psi_hand_value_loading_age():
    # Eq. 5.4.2.3.2-1 with ti = 10 days: 10^-0.118 = 0.76208; 0.95 × 0.76208 = 0.72398
    value = psi(42.0, 10.0, V_S=4.0, H=70.0, f_ci=4.0)
    assert value == pytest.approx(0.95 * 10.0**-0.118, rel=EXACT)
    assert value == pytest.approx(0.72398, abs=1e-5)


def test_psi_hand_value_all_factors():
    # Eq. 5.4.2.3.2-1, V/S = 3 in. (ks 1.06), H = 60 % (khc 1.08), f'ci = 5.8 (kf 5/6.8),
    # t = 89 d (ktd 0.713593), ti = 1 d
    expected = 1.9 * 1.06 * 1.08 * (5.0 / 6.8) * (89.0 / (12.0 * 76.8 / 25.8 + 89.0))
    assert psi(89.0, 1.0, V_S=3.0, H=60.0, f_ci=5.8) == pytest.approx(expected, rel=EXACT)
    assert expected == pytest.approx(1.14129, abs=1e-5)


def test_psi_vectorised_over_t():
    t = np.array([0.0, 42.0, 420.0])
    out = psi(t, 1.0, V_S=4.0, H=70.0, f_ci=4.0)
    np.testing.assert_allclose(out, 1.9 * t / (42.0 + t), rtol=EXACT)


@pytest.mark.parametrize("bad_ti", [0.0, -5.0])
def test_psi_rejects_non_positive_loading_age(bad_ti):
    with pytest.raises(ValueError, match="t_i"):
        psi(100.0, bad_ti, V_S=3.0, H=70.0, f_ci=5.0)


# --- εsh, Eq. 5.4.2.3.3-1 ----------------------------------------------------------------


def test_epsilon_sh_hand_value():
    # Eq. 5.4.2.3.3-1: ks khs kf ktd 0.48e-3 = 1.0 × 1.02 × 1.0 × 0.5 × 0.48e-3 = 2.448e-4
    assert epsilon_sh(42.0, V_S=4.0, H=70.0, f_ci=4.0) == pytest.approx(2.448e-4, rel=EXACT)


def test_epsilon_sh_hand_value_all_factors():
    # Eq. 5.4.2.3.3-1, V/S = 2 in. (ks 1.19), H = 80 % (khs 0.88), f'ci = 6 ksi (kf 5/7),
    # t = 100 d: ktd = 100 / (12 × 76/26 + 100) = 100/135.0769 = 0.740319;
    # 1.19 × 0.88 × 0.714286 × 0.740319 × 0.48e-3 = 2.6580e-4
    ktd = 100.0 / (12.0 * 76.0 / 26.0 + 100.0)
    expected = 1.19 * 0.88 * (5.0 / 7.0) * ktd * 0.48e-3
    assert epsilon_sh(100.0, V_S=2.0, H=80.0, f_ci=6.0) == pytest.approx(expected, rel=EXACT)
    assert expected == pytest.approx(2.6580e-4, abs=1e-8)


def test_epsilon_sh_vectorised_and_bounded():
    t = np.linspace(0.0, 1.0e5, 11)
    out = epsilon_sh(t, V_S=4.0, H=70.0, f_ci=4.0)
    assert out[0] == 0.0
    assert np.all(np.diff(out) > 0.0)
    # Upper bound for t → ∞: ks khs kf 0.48e-3 = 1.02 × 0.48e-3
    assert out[-1] < 1.02 * 0.48e-3


def test_epsilon_sh_less_at_higher_humidity():
    # Eq. 5.4.2.3.3-2: khs decreases with H, so shrinkage does too
    dry = epsilon_sh(365.0, V_S=3.0, H=40.0, f_ci=5.0)
    wet = epsilon_sh(365.0, V_S=3.0, H=90.0, f_ci=5.0)
    assert wet < dry


def test_scalar_inputs_give_python_float():
    with warnings.catch_warnings():
        warnings.simplefilter("error")
        value = epsilon_sh(42.0, V_S=4.0, H=70.0, f_ci=4.0)
    assert type(value) is float
