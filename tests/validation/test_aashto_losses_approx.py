"""AASHTO LRFD 9th Ed. (2020): elastic shortening (5.9.3.2.3a and C5.9.3.2.3a-1), the
approximate estimate of time-dependent losses (5.9.3.3) and Ec (5.4.2.4), against values
worked by hand from the printed equations (the equations are recalled from memory; the
arithmetic is shown step by step)."""

from __future__ import annotations

import math

import pytest

from prestress.codes import aci318_19, en1992_1_1_materials
from prestress.codes.aashto_lrfd import losses, materials
from prestress.losses.pretensioned import elastic_shortening_iterative


def test_Ec_aashto_by_hand() -> None:
    # Eq. 5.4.2.4-1: Ec = 120,000 K1 wc^2.0 f'c^0.33; wc = 0.145 kcf, f'c = 5 ksi.
    # 0.145^2 = 0.021025; 5^0.33 = exp(0.33 ln 5) = exp(0.531114) = 1.700833
    # Ec = 120,000 × 0.021025 × 1.700833 = 4291.2 ksi
    assert materials.E_c(5.0, 0.145) == pytest.approx(4291.2, rel=1e-4)
    with pytest.raises(ValueError, match="w_c_kcf"):
        materials.E_c(5.0, 0.2)


def test_Ec_aci318_by_hand() -> None:
    # ACI 318-19 19.2.2.1(a): Ec = wc^1.5 × 33 √f'c = 145^1.5 × 33 × √5000 = 1746.03 × 33 × 70.7107
    assert aci318_19.E_c(5000.0, 145.0) == pytest.approx(4_074_281.0, rel=1e-5)


def test_Ecm_en1992_table_3_1() -> None:
    # EN 1992-1-1:2004 Table 3.1: C30/37 has fcm = 38 MPa and Ecm = 33 GPa (the table rounds)
    assert en1992_1_1_materials.E_cm(en1992_1_1_materials.f_cm(30.0)) == pytest.approx(
        33_000.0, rel=0.01
    )


def test_transfer_length_60_db() -> None:
    # 5.9.4.3.1: 60 strand diameters; 0.6 in strand → 36 in
    assert materials.l_t(0.6) == pytest.approx(36.0)


# A pretensioned girder worked by hand (invented inputs, consistent kip-in-ksi units):
A_PS = 20 * 0.153  # 20 strands 0.5 in: 3.06 in²
F_PBT = 202.5  # ksi
A_G, I_G, E_M = 789.0, 260_730.0, 20.0  # in², in⁴, in (Type IV-like)
M_G = 0.822 * 80.0**2 / 8.0 * 12.0  # kip-in: 0.822 kip/ft on 80 ft = 7891.2 kip-in
E_CI, E_P = 4000.0, 28_500.0


def test_elastic_shortening_closed_form_by_hand() -> None:
    # C5.9.3.2.3a-1:
    # Ig + em² Ag = 260,730 + 400 × 789 = 576,330 in⁴
    # numerator = 3.06 × 202.5 × 576,330 − 20 × 7891.2 × 789 = 357,122,884.5 − 124,523,136 = 232,599,748.5
    # denominator = 3.06 × 576,330 + 789 × 260,730 × 4000 / 28,500 = 1,763,569.8 + 28,872,751.6 = 30,636,321.4
    # ΔfpES = 7.5922 ksi
    num = 3.06 * 202.5 * 576_330 - 20 * 7891.2 * 789
    den = 3.06 * 576_330 + 789 * 260_730 * 4000 / 28_500
    assert num / den == pytest.approx(7.5922, rel=1e-4)
    got = losses.delta_f_pES_closed_form(A_PS, F_PBT, I_G, E_M, A_G, M_G, E_CI, E_P)
    assert got == pytest.approx(num / den, rel=1e-12)


def test_closed_form_equals_iteration() -> None:
    """5.9.3.2.3a: iterating ΔfpES = Ep/Eci fcgp converges to the commentary's closed form."""
    closed = losses.delta_f_pES_closed_form(A_PS, F_PBT, I_G, E_M, A_G, M_G, E_CI, E_P)
    iterated = elastic_shortening_iterative(A_PS, F_PBT, A_G, I_G, E_M, M_G, E_CI, E_P)
    assert iterated == pytest.approx(closed, rel=1e-8)


def test_approximate_long_term_by_hand() -> None:
    # 5.9.3.3: H = 70 % → γh = 1.7 − 0.70 = 1.0; f'ci = 4 ksi → γst = 5 / 5 = 1.0
    # ΔfpLT = 10 × 202.5 × 3.06 / 789 × 1 × 1 + 12 × 1 × 1 + 2.4 = 7.8536 + 12 + 2.4 = 22.2536 ksi
    r = losses.delta_f_pLT_approximate(202.5, 3.06, 789.0, 70.0, 4.0)
    assert r["gamma_h"] == pytest.approx(1.0)
    assert r["gamma_st"] == pytest.approx(1.0)
    assert r["creep"] == pytest.approx(10 * 202.5 * 3.06 / 789, rel=1e-12)
    assert r["total"] == pytest.approx(22.2536, rel=1e-4)
    # H = 40 %: γh = 1.3; f'ci = 6 ksi: γst = 5/7 → shrinkage term 12 × 1.3 × 5/7 = 11.1429 ksi
    r = losses.delta_f_pLT_approximate(202.5, 3.06, 789.0, 40.0, 6.0)
    assert r["shrinkage"] == pytest.approx(11.142857, rel=1e-6)


@pytest.mark.parametrize("H", [-1.0, 101.0, math.nan])
def test_humidity_out_of_range(H: float) -> None:
    with pytest.raises(ValueError, match="H must be"):
        losses.gamma_h(H)
