"""Relaxation of prestressing strand.

Sources:
* AASHTO LRFD Bridge Design Specifications, 9th Ed. (2020), 5.9.3.4.2c (Eq. 5.9.3.4.2c-1,
  KL = 30 low-relaxation / 7 other steel, the 1.2 ksi alternative for low-relaxation strand,
  fpt not less than 0.55 fpy) and 5.9.3.4.3c (ΔfpR2 = ΔfpR1).
* Magura, Sozen & Siess (1964), "A study of stress relaxation in prestressing reinforcement",
  PCI Journal 9(2): fpR/fpi = log10(t)/10 (fpi/fpy − 0.55), t in hours, stress-relieved;
  the constant 45 for low-relaxation strand is the value in common use (from memory).

Expected values are worked by hand from those equations in each test. Tolerance rel 1e-12
(round-off) unless a rounded value is written, then one unit of its last digit.
"""

import math

import numpy as np
import pytest

from prestress.codes.aashto_lrfd.relaxation import (
    DELTA_F_PR1_LOW_RELAXATION_SIMPLIFIED_KSI,
    K_L,
    delta_f_pR1,
    delta_f_pR2,
    f_pR_log_time,
    f_pR_log_time_between,
    log_time_constant,
)

EXACT = 1e-12
F_PY = 243.0  # 0.90 × 270 ksi, low-relaxation Grade 270 strand (common practice)


# --- AASHTO 5.9.3.4.2c -------------------------------------------------------------------


def test_K_L_values():
    # 5.9.3.4.2c: KL = 30 for low-relaxation strands and 7 for other prestressing steel
    assert K_L("low_relaxation") == 30.0
    assert K_L("stress_relieved") == 7.0


def test_delta_f_pR1_low_relaxation_hand_value():
    # Eq. 5.9.3.4.2c-1: 190/30 × (190/243 − 0.55) = 6.33333 × 0.231893 = 1.46866 ksi
    value = delta_f_pR1(190.0, F_PY, "low_relaxation")
    assert value == pytest.approx(190.0 / 30.0 * (190.0 / 243.0 - 0.55), rel=EXACT)
    assert value == pytest.approx(1.46866, abs=1e-5)


def test_delta_f_pR1_stress_relieved_hand_value():
    # Eq. 5.9.3.4.2c-1 with KL = 7: 190/7 × 0.231893 = 6.29424 ksi
    value = delta_f_pR1(190.0, F_PY, "stress_relieved")
    assert value == pytest.approx(190.0 / 7.0 * (190.0 / 243.0 - 0.55), rel=EXACT)
    assert value == pytest.approx(6.29424, abs=1e-5)


def test_delta_f_pR1_zero_below_055_fpy():
    # 5.9.3.4.2c: fpt taken not less than 0.55 fpy, so the bracket is zero at or below it
    assert delta_f_pR1(0.55 * F_PY, F_PY) == 0.0
    assert delta_f_pR1(100.0, F_PY) == 0.0


def test_delta_f_pR1_simplified():
    # 5.9.3.4.2c: ΔfpR1 may be assumed equal to 1.2 ksi for low-relaxation strands
    assert DELTA_F_PR1_LOW_RELAXATION_SIMPLIFIED_KSI == 1.2
    assert delta_f_pR1(190.0, F_PY, "low_relaxation", simplified=True) == 1.2
    with pytest.raises(ValueError, match="low-relaxation"):
        delta_f_pR1(190.0, F_PY, "stress_relieved", simplified=True)


def test_delta_f_pR2_equals_delta_f_pR1():
    # Eq. 5.9.3.4.3c-1: ΔfpR2 = ΔfpR1
    for strand in ("low_relaxation", "stress_relieved"):
        assert delta_f_pR2(185.0, F_PY, strand) == delta_f_pR1(185.0, F_PY, strand)
    assert delta_f_pR2(185.0, F_PY, simplified=True) == 1.2


@pytest.mark.parametrize(("f_pt", "f_py"), [(0.0, 243.0), (190.0, 0.0), (-1.0, 243.0)])
def test_delta_f_pR1_rejects_bad_stresses(f_pt, f_py):
    with pytest.raises(ValueError, match="f_p"):
        delta_f_pR1(f_pt, f_py)


def test_unknown_strand_class():
    with pytest.raises(ValueError, match="strand"):
        delta_f_pR1(190.0, F_PY, "bar")  # type: ignore[arg-type]


# --- Magura, Sozen & Siess (1964) --------------------------------------------------------


def test_log_time_constants():
    # Magura et al. (1964): C = 10 stress-relieved; C = 45 low-relaxation (from memory)
    assert log_time_constant("stress_relieved") == 10.0
    assert log_time_constant("low_relaxation") == 45.0


def test_log_time_stress_relieved_hand_value():
    # fpi = 175, fpy = 212.5, t = 1000 h: 175 × 3/10 × (175/212.5 − 0.55) = 14.3603
    value = f_pR_log_time(1000.0, 175.0, 212.5, "stress_relieved")
    assert value == pytest.approx(175.0 * 3.0 / 10.0 * (175.0 / 212.5 - 0.55), rel=EXACT)
    assert value == pytest.approx(14.3603, abs=1e-4)


def test_log_time_low_relaxation_hand_value():
    # fpi = 202.5, fpy = 243, t = 1000 h: 202.5 × 3/45 × (0.833333 − 0.55) = 3.825 ksi
    value = f_pR_log_time(1000.0, 202.5, F_PY, "low_relaxation")
    assert value == pytest.approx(3.825, rel=1e-12)


def test_log_time_low_relaxation_within_1000_hour_limit():
    # Sanity: ASTM A416 limits the 1000 h relaxation of low-relaxation strand loaded to 70 %
    # of its specified tensile strength to 2.5 % (from memory). At 0.70 × 270 = 189 ksi the
    # log-time law gives 189 × 3/45 × (189/243 − 0.55) = 2.870 ksi = 1.52 % of 189 ksi.
    value = f_pR_log_time(1000.0, 189.0, F_PY, "low_relaxation")
    assert value == pytest.approx(2.8700, abs=1e-4)
    assert value / 189.0 < 0.025


def test_log_time_zero_at_or_below_055():
    assert f_pR_log_time(1.0e5, 0.55 * F_PY, F_PY) == 0.0
    assert f_pR_log_time(1.0e5, 120.0, F_PY) == 0.0


def test_log_time_first_hour_is_zero_and_vectorised():
    t = np.array([0.0, 0.5, 1.0, 10.0, 100.0])
    out = f_pR_log_time(t, 202.5, F_PY)
    expected = 202.5 * np.log10(np.maximum(t, 1.0)) / 45.0 * (202.5 / 243.0 - 0.55)
    np.testing.assert_allclose(out, expected, rtol=EXACT, atol=0.0)
    assert out[0] == out[1] == out[2] == 0.0


def test_between_two_times_is_difference_at_constant_stress():
    # ΔfpR(t1, t2) = fp1 (log t2 − log t1)/C (fp1/fpy − 0.55)
    between = f_pR_log_time_between(24.0, 2400.0, 202.5, F_PY)
    assert between == pytest.approx(202.5 * 2.0 / 45.0 * (202.5 / 243.0 - 0.55), rel=EXACT)
    assert between == pytest.approx(
        f_pR_log_time(2400.0, 202.5, F_PY) - f_pR_log_time(24.0, 202.5, F_PY), rel=EXACT
    )
    assert math.isclose(f_pR_log_time_between(50.0, 50.0, 202.5, F_PY), 0.0, abs_tol=0.0)


def test_between_rejects_reversed_or_negative_times():
    with pytest.raises(ValueError, match="t2_hours"):
        f_pR_log_time_between(100.0, 10.0, 202.5, F_PY)
    with pytest.raises(ValueError, match="hours"):
        f_pR_log_time(-1.0, 202.5, F_PY)
