"""Time-step analysis against the AASHTO LRFD 9th Ed. (2020) 5.9.3.4 refined estimate.

Source compared with: AASHTO LRFD Bridge Design Specifications, 9th Ed. (2020), 5.9.3.4
(refined estimate of time-dependent losses, Eq. 5.9.3.4.1-1 and its components) with the
creep and shrinkage of 5.4.2.3 and the moduli of Eq. 5.4.2.4-1, as coded in
``prestress.codes.aashto_lrfd``; elastic shortening by Eq. C5.9.3.2.3a-1. The girder is
invented (invented inputs): a 72-in. bulb-tee-like section, A = 767 in.², I = 545,894 in.⁴,
yb = 36.6 in., V/S = 2.85 in.; an 8-in. deck 96 in. wide (V/S = 4.0 in., drying through both
faces); 40 × 0.6-in. low-relaxation strands (0.217 in.² each, common practice) with their
centroid 5 in. above the bottom; f'ci = 5.8 ksi at 1 day, f'c = 8 ksi, deck f'c = 4 ksi, wc =
0.150 kcf; H = 70 %; transfer at 1 day, deck cast at 90 days, superimposed dead load on the
composite section at 118 days (28 days after the deck, so that the deck has its 28-day stiffness
as the refined method assumes), final age 20,000 days; fpbt = 202.5 ksi; midspan moments of a
120-ft span: girder 17,260, deck 17,280, superimposed 6,480 kip·in.

What is compared and why the margin is 15 %:

* The time-dependent loss ΔfpLT of Eq. 5.9.3.4.1-1 against the creep + shrinkage + relaxation
  shares of the time-step analysis with the "aashto" model (the same ψ, εsh and Ec equations),
  at 20,000 days. The refined method is a simplified, calibrated estimate: it applies the fixed
  transformed-section factors Kid and Kdf built with 0.7 ψb(tf, ti) (an aging coefficient of 0.7
  and the *final* creep already for the period up to deck placement), gross girder properties,
  the relaxation formula ΔfpR1 = ΔfpR2 = fpt/KL (fpt/fpy − 0.55) for each period, one
  creep coefficient for all load changes after deck placement, and no creep of the girder
  restrained by the deck. The time-step analysis integrates the actual history instead.
  Found: refined 28.2 ksi, time-step 31.5 ksi (+11 %). By period and mechanism:

  - transfer to deck: refined SR 5.9 + CR 18.6 + R1 1.1 = 25.6 ksi; time-step shrinkage 6.9,
    creep 19.2, relaxation 1.5 = 27.5 ksi. Kid (0.75) restrains with the final creep; the
    actual restraint up to 90 days is weaker (effective factor 0.87 for shrinkage);
  - deck to final: refined SD 2.4 + CD 0.4 + R2 1.1 − SS 1.3 = 2.6 ksi; time-step creep 3.1,
    shrinkage (girder less the deck's gain) 0.8, relaxation 0.2 = 4.0 ksi. The refined ΔfpCD
    nets two large terms (+7.5 creep of the transfer stress, −7.1 creep recovery from Δfcd)
    with one set of factors; a small shift in either moves the small net value a lot;
  - relaxation: 2.3 ksi refined against 1.6 ksi time-step, where the log-time law (C = 45 for
    low-relaxation strand, from memory) is reduced by the drop of the strand stress (equivalent
    time).

  So 15 % covers the known differences of method, not numerical error (the time-step result
  changes by less than 0.2 % from 100 to 400 steps).
* All four models on the same girder: each total time-dependent loss is plausible, 10 to 40 ksi
  (common practice for pretensioned bridge girders). Spread found: AASHTO 31.5, ACI 209R-92 36.8,
  fib MC2010 32.6, EN 1992-1-1 30.3 ksi (spread 6.5 ksi, about ±10 % about their mean of
  32.8 ksi), a spread of the usual size between creep and shrinkage models (common practice).
* Elastic shortening at transfer of the time-step analysis (concrete area = gross area, strands
  added with Ep/Eci) equals the closed form of Eq. C5.9.3.2.3a-1 on gross properties, which is
  the exact solution of that same compatibility problem (rel. 1e-9).
"""

from __future__ import annotations

import numpy as np
import pytest

from prestress.codes import mc2010
from prestress.codes.aashto_lrfd import losses as aashto_losses
from prestress.codes.aashto_lrfd.materials import E_c
from prestress.codes.aashto_lrfd.refined_losses import (
    RefinedLossInput,
    delta_f_cd,
    refined_losses,
)
from prestress.losses.models import KCF_N_MM3, make_model
from prestress.losses.timestep import ConcretePart, LoadEvent, StrandLayer, run_timestep
from prestress.units import INCH_MM, KIP_N, KSI_MPA

IN = INCH_MM
KSI = KSI_MPA
KIP_IN = KIP_N * INCH_MM

# --- invented inputs (US units, as the refined method is printed) -------------------------
A_G, I_G, YB_G, H_G, VS_G = 767.0, 545_894.0, 36.6, 72.0, 2.85
B_D, T_D = 96.0, 8.0
A_D, I_D, Y_D, VS_D = B_D * T_D, B_D * T_D**3 / 12.0, H_G + T_D / 2.0, 4.0
N_STRANDS, A_STRAND, Y_PS = 40, 0.217, 5.0
A_PS = N_STRANDS * A_STRAND
E_P, F_PBT, F_PY = 28_500.0, 202.5, 0.90 * 270.0
F_CI, F_C, F_C_DECK, W_C = 5.8, 8.0, 4.0, 0.150
H_RH, T_I, T_DECK, T_SDL, T_F = 70.0, 1.0, 90.0, 118.0, 20_000.0
M_G, M_DECK, M_SDL = 17_260.0, 17_280.0, 6_480.0  # kip·in


def _refined():
    """AASHTO LRFD 9th Ed. (2020) 5.9.3.4 on the invented girder (ksi, in.)."""
    E_ci, E_cg, E_cd = E_c(F_CI, W_C), E_c(F_C, W_C), E_c(F_C_DECK, W_C)
    e_pg = YB_G - Y_PS
    es = aashto_losses.delta_f_pES_closed_form(A_PS, F_PBT, I_G, e_pg, A_G, M_G, E_ci, E_P)
    f_pt = F_PBT - es
    P = A_PS * f_pt
    f_cgp = P / A_G + P * e_pg**2 / I_G - M_G * e_pg / I_G  # compression positive
    n = E_cd / E_cg  # deck transformed by the modular ratio (5.9.3.4.3a)
    A_c = A_G + n * A_D
    yb_c = (A_G * YB_G + n * A_D * Y_D) / A_c
    I_c = I_G + A_G * (yb_c - YB_G) ** 2 + n * I_D + n * A_D * (Y_D - yb_c) ** 2
    e_pc, e_d = yb_c - Y_PS, Y_D - yb_c

    def run(loss_id: float):
        inp = RefinedLossInput(
            A_g=A_G, I_g=I_G, e_pg=e_pg, f_ci=F_CI, f_c=F_C, E_ci=E_ci, E_c=E_cg,
            V_S_girder=VS_G, A_d=A_D, e_d=e_d, E_cd=E_cd, V_S_deck=VS_D, f_c_deck=F_C_DECK,
            A_c=A_c, I_c=I_c, e_pc=e_pc, A_ps=A_PS, E_p=E_P, f_pt=f_pt, f_py=F_PY,
            strand="low_relaxation", f_cgp=f_cgp,
            delta_f_cd=delta_f_cd(loss_id, A_PS, A_G, I_G, e_pg, M_DECK, M_SDL, I_c, e_pc),
            H=H_RH, t_i=T_I, t_d=T_DECK, t_f=T_F,
        )  # fmt: skip
        return refined_losses(inp)

    first = run(0.0)
    return run(first.loss_id), es  # Δfcd with the losses up to deck placement (one pass)


def _models(name: str):
    """Girder and deck models of each code for the invented girder (internal units)."""
    wc = W_C * KCF_N_MM3
    # Steam curing of the girder for 1 day: 6 h at 20 °C then 18 h at 60 °C (invented
    # inputs); its temperature-adjusted age by MC2010 (2013) Eq. 5.1-85 (same as EN Eq. B.10).
    t_T = mc2010.t_T([20.0, 60.0], [0.25, 0.75])
    if name == "aashto":
        common = dict(unit_weight=wc, relative_humidity=H_RH, age_at_end_of_curing=T_I)
        girder = dict(f_c=F_C * KSI, f_ci=F_CI * KSI, volume_to_surface=VS_G * IN, **common)
        deck = dict(f_c=F_C_DECK * KSI, volume_to_surface=VS_D * IN, **common)
    elif name == "aci209":
        girder = dict(
            f_c=F_C * KSI, unit_weight=wc, relative_humidity=H_RH, volume_to_surface=VS_G * IN,
            curing="steam", age_at_end_of_curing=T_I,
            # Eq. 2-1 with β of Table 2.2.1 (steam, Type I) and a fitted to f'ci at 1 day:
            # a = 1 × (F_C/F_CI − 0.95) (the adapter fits it)
            f_ci=F_CI * KSI, age_f_ci=T_I,
        )  # fmt: skip
        deck = dict(
            f_c=F_C_DECK * KSI, unit_weight=wc, relative_humidity=H_RH,
            volume_to_surface=VS_D * IN, curing="moist", age_at_end_of_curing=7.0,
        )  # fmt: skip
    elif name == "mc2010":
        girder = dict(
            f_ck=F_C * KSI, relative_humidity=H_RH, notional_size=2 * VS_G * IN,
            cement_class="52.5 R", age_at_end_of_curing=T_I, equivalent_age_at_end_of_curing=t_T,
        )  # fmt: skip
        deck = dict(
            f_ck=F_C_DECK * KSI, relative_humidity=H_RH, notional_size=2 * VS_D * IN,
            cement_class="42.5 N", age_at_end_of_curing=7.0,
        )  # fmt: skip
    else:
        girder = dict(
            f_ck=F_C * KSI, relative_humidity=H_RH, notional_size=2 * VS_G * IN,
            cement_class="R", age_at_end_of_curing=T_I, equivalent_age_at_end_of_curing=t_T,
        )  # fmt: skip
        deck = dict(
            f_ck=F_C_DECK * KSI, relative_humidity=H_RH, notional_size=2 * VS_D * IN,
            cement_class="N", age_at_end_of_curing=7.0,
        )  # fmt: skip
    return make_model(name, **girder), make_model(name, **deck)


def _timestep(name: str, n_steps: int = 150):
    g, d = _models(name)
    parts = [
        ConcretePart("girder", A_G * IN**2, I_G * IN**4, YB_G * IN, g, 0.0,
                     {"bottom": 0.0, "top": H_G * IN}),
        ConcretePart("deck", A_D * IN**2, I_D * IN**4, Y_D * IN, d, T_DECK,
                     {"top": (H_G + T_D) * IN}),
    ]  # fmt: skip
    layers = [StrandLayer(A_PS * IN**2, Y_PS * IN, E_P * KSI, F_PBT * KSI, F_PY * KSI)]
    events = [
        LoadEvent(T_I, M_G * KIP_IN, 0.0, "girder", "girder self-weight"),
        LoadEvent(T_DECK, M_DECK * KIP_IN, 0.0, "girder", "deck weight"),
        LoadEvent(T_SDL, M_SDL * KIP_IN, 0.0, "composite", "superimposed dead load"),
    ]
    return run_timestep(parts, layers, events, [T_F], n_steps, transfer_age=T_I)


def test_total_long_term_loss_within_15_percent_of_the_refined_estimate():
    ref, _ = _refined()
    r = _timestep("aashto")
    ts_total = r.long_term_loss[-1, 0, 0] / KSI
    assert ref.delta_f_pLT == pytest.approx(28.21, abs=0.01)  # value found, see docstring
    assert ts_total == pytest.approx(ref.delta_f_pLT, rel=0.15)
    # transfer to deck placement: the period where both use the same ψb(td, ti) and εbid;
    # within 10 % (Kid with the final creep against the actual restraint, see docstring)
    i = r.index(T_DECK, after=False)
    ts_id = r.long_term_loss[i, 0, 0] / KSI
    assert ts_id == pytest.approx(ref.loss_id, rel=0.10)
    ts_creep_id = r.losses["creep"][i, 0, 0] / KSI
    assert ts_creep_id == pytest.approx(ref.delta_f_pCR, rel=0.10)
    # relaxation: both small, the time-step one reduced by the falling strand stress
    ts_relax = r.losses["relaxation"][-1, 0, 0] / KSI
    assert 0.0 < ts_relax < ref.delta_f_pR1 + ref.delta_f_pR2 < 3.0


def test_elastic_shortening_equals_the_closed_form_of_c5_9_3_2_3a_1():
    _, es = _refined()
    r = _timestep("aashto", n_steps=20)
    assert r.losses["elastic_transfer"][-1, 0, 0] / KSI == pytest.approx(es, rel=1e-9)


def test_time_step_result_is_converged_in_the_number_of_steps():
    # common practice: the discretisation error must be small against the 15 % margin
    coarse = _timestep("aashto", n_steps=100).long_term_loss[-1, 0, 0]
    fine = _timestep("aashto", n_steps=400).long_term_loss[-1, 0, 0]
    assert coarse == pytest.approx(fine, rel=2e-3)


@pytest.mark.parametrize("name", ["aashto", "aci209", "mc2010", "en1992"])
def test_each_model_gives_a_plausible_total(name):
    # 10 to 40 ksi of time-dependent loss (common practice); found 30.3 to 36.8 ksi
    r = _timestep(name)
    total = r.long_term_loss[-1, 0, 0] / KSI
    assert 10.0 < total < 40.0
    # and each share has its expected sign: creep, shrinkage and relaxation are losses
    for key in ("creep", "shrinkage", "relaxation"):
        assert r.losses[key][-1, 0, 0] > 0.0
    # bottom fiber still in compression under the permanent loads
    assert r.concrete_stress["girder"]["bottom"][-1, 0] < 0.0


def test_spread_of_the_four_models():
    totals = np.array(
        [
            _timestep(n).long_term_loss[-1, 0, 0] / KSI
            for n in ("aashto", "aci209", "mc2010", "en1992")
        ]
    )
    # found: 31.5, 36.8, 32.6, 30.3 ksi (see the module docstring)
    np.testing.assert_allclose(totals, [31.5, 36.8, 32.6, 30.3], atol=0.15)
    assert totals.max() - totals.min() < 0.25 * totals.mean()
