"""AASHTO LRFD 9th Ed. (2020) 5.9.3.4: refined estimate of time-dependent losses.

For a pretensioned girder made composite with a cast-in-place deck. Units as printed: ksi,
kip, in., in.², in.⁴, days, percent.

Sign conventions (those of the equations as printed, which differ from the project-wide
tension-positive rule; the engine converts):

* losses and the gain ΔfpSS are positive numbers; ΔfpLT = id-losses + df-losses − ΔfpSS;
* ``f_cgp`` is a concrete stress at the strand centroid, **positive for compression**;
* ``delta_f_cd`` (Δfcd) is the change of that compression-positive stress, so it is
  **negative** in the usual case where the long-term losses before deck placement and the
  deck and superimposed loads reduce the compression at the strands; a negative Δfcd makes
  the second term of ΔfpCD a gain;
* eccentricities of the strands (``e_pg``, ``e_pc``) are positive below the relevant
  centroid; the deck eccentricity ``e_d`` is positive when the deck centroid lies above the
  composite centroid (the typical case), as 5.9.3.4.3d defines it;
* ``delta_f_cdf`` (Δfcdf) is returned positive when deck shrinkage puts the concrete at the
  strand centroid into tension, which is what makes ΔfpSS a gain (see :func:`delta_f_cdf`).

How the time-development factor ktd (Eq. 5.4.2.3.2-5) is evaluated for each quantity. 5.4.2.3.2
defines t as the maturity, the time from loading (creep) or from the end of curing
(shrinkage) to the moment considered, and ti as the age at loading; the symbols of 5.9.3.4
name the interval of each quantity. With ti = age at transfer, td = age of the girder at deck
placement, tf = final age of the girder (all girder ages, days):

* εbid (girder shrinkage, transfer to deck placement): ktd(td − ti). Drying is counted from
  transfer, i.e. transfer is taken as the end of curing of the precast girder (common
  practice);
* εbif (girder shrinkage, transfer to final): ktd(tf − ti); εbdf = εbif − εbid (girder
  shrinkage between deck placement and final);
* ψb(td, ti): ktd(td − ti) with loading age ti;
* ψb(tf, ti): ktd(tf − ti) with loading age ti;
* ψb(tf, td): ktd(tf − td) with loading age td (the ti^−0.118 term of Eq. 5.4.2.3.2-1 is
  evaluated at td);
* εddf (deck shrinkage, deck placement to final): ktd(tf − td) with the deck's own ks (deck
  V/S) and the deck strength; drying of the deck is counted from deck placement;
* ψd(tf, td) (deck creep for loads introduced shortly after deck placement): ktd(tf − td)
  with the deck strength and a loading age of the deck ``t_i_deck`` (1 day by default).

The girder factors kf and ktd use the girder f'ci. The deck factors use the deck f'ci, which
defaults to 0.80 f'c of the deck (5.4.2.3.2 allows 0.80 f'c where the age at initial loading
is unknown at design time).
"""

from __future__ import annotations

import warnings
from dataclasses import dataclass

from prestress.codes._args import ksi_mpa
from prestress.codes.aashto_lrfd import creep_shrinkage as cs
from prestress.codes.aashto_lrfd import relaxation as rx


def _positive(**values: float) -> None:
    for name, value in values.items():
        if not value > 0.0:
            raise ValueError(f"{name} must be greater than 0, got {value}")


# --------------------------------------------------------------------------------------
# Between transfer and deck placement (5.9.3.4.2)
# --------------------------------------------------------------------------------------


def K_id(
    E_p: float,
    E_ci: float,
    A_ps: float,
    A_g: float,
    I_g: float,
    e_pg: float,
    psi_b_tf_ti: float,
) -> float:
    """AASHTO LRFD 9th Ed. (2020) Eq. 5.9.3.4.2a-2: transformed section coefficient Kid.

    Kid = 1 / [1 + (Ep/Eci)(Aps/Ag)(1 + Ag epg²/Ig)(1 + 0.7 ψb(tf, ti))]

    The clause uses gross girder properties; net or transformed properties may be passed
    instead as long as they are used consistently.

    Args:
        E_p: modulus of the prestressing steel, ksi.
        E_ci: modulus of the girder concrete at transfer, ksi.
        A_ps: area of prestressing steel, in.².
        A_g: gross area of the girder section, in.².
        I_g: moment of inertia of the gross girder section, in.⁴.
        e_pg: strand eccentricity from the girder centroid, in. (positive below).
        psi_b_tf_ti: girder creep coefficient at final time for loading at transfer.

    Returns:
        Kid (dimensionless, between 0 and 1).
    """
    _positive(E_p=E_p, E_ci=E_ci, A_g=A_g, I_g=I_g)
    if A_ps < 0.0:
        raise ValueError(f"A_ps must be at least 0, got {A_ps}")
    return 1.0 / (
        1.0 + E_p / E_ci * A_ps / A_g * (1.0 + A_g * e_pg**2 / I_g) * (1.0 + 0.7 * psi_b_tf_ti)
    )


def delta_f_pSR(epsilon_bid: float, E_p: float, K_id: float) -> float:
    """AASHTO LRFD 9th Ed. (2020) Eq. 5.9.3.4.2a-1: girder shrinkage loss ΔfpSR = εbid Ep Kid.

    Args:
        epsilon_bid: girder shrinkage strain between transfer and deck placement (positive
            magnitude, Eq. 5.4.2.3.3-1).
        E_p: modulus of the prestressing steel, ksi.
        K_id: coefficient from Eq. 5.9.3.4.2a-2.

    Returns:
        ΔfpSR, ksi (positive is a loss).
    """
    return epsilon_bid * E_p * K_id


def delta_f_pCR(E_p: float, E_ci: float, f_cgp: float, psi_b_td_ti: float, K_id: float) -> float:
    """AASHTO LRFD 9th Ed. (2020) Eq. 5.9.3.4.2b-1: girder creep loss, transfer to deck placement.

    ΔfpCR = (Ep/Eci) fcgp ψb(td, ti) Kid

    Args:
        E_p: modulus of the prestressing steel, ksi.
        E_ci: modulus of the girder concrete at transfer, ksi.
        f_cgp: concrete stress at the strand centroid due to the prestressing force just
            after transfer and the self-weight at the section of maximum moment, ksi,
            positive for compression.
        psi_b_td_ti: girder creep coefficient at deck placement for loading at transfer.
        K_id: coefficient from Eq. 5.9.3.4.2a-2.

    Returns:
        ΔfpCR, ksi (positive is a loss).
    """
    _positive(E_ci=E_ci)
    return E_p / E_ci * f_cgp * psi_b_td_ti * K_id


# --------------------------------------------------------------------------------------
# Between deck placement and final time (5.9.3.4.3)
# --------------------------------------------------------------------------------------


def K_df(
    E_p: float,
    E_ci: float,
    A_ps: float,
    A_c: float,
    I_c: float,
    e_pc: float,
    psi_b_tf_ti: float,
) -> float:
    """AASHTO LRFD 9th Ed. (2020) Eq. 5.9.3.4.3a-2: transformed section coefficient Kdf.

    Kdf = 1 / [1 + (Ep/Eci)(Aps/Ac)(1 + Ac epc²/Ic)(1 + 0.7 ψb(tf, ti))]

    Args:
        E_p: modulus of the prestressing steel, ksi.
        E_ci: modulus of the girder concrete at transfer, ksi.
        A_ps: area of prestressing steel, in.².
        A_c: area of the gross composite section (deck transformed with the deck-to-girder
            modular ratio), in.².
        I_c: moment of inertia of the gross composite section, in.⁴.
        e_pc: strand eccentricity from the composite centroid, in. (positive below).
        psi_b_tf_ti: girder creep coefficient at final time for loading at transfer.

    Returns:
        Kdf (dimensionless, between 0 and 1).
    """
    _positive(E_p=E_p, E_ci=E_ci, A_c=A_c, I_c=I_c)
    if A_ps < 0.0:
        raise ValueError(f"A_ps must be at least 0, got {A_ps}")
    return 1.0 / (
        1.0 + E_p / E_ci * A_ps / A_c * (1.0 + A_c * e_pc**2 / I_c) * (1.0 + 0.7 * psi_b_tf_ti)
    )


def delta_f_pSD(epsilon_bdf: float, E_p: float, K_df: float) -> float:
    """AASHTO LRFD 9th Ed. (2020) Eq. 5.9.3.4.3a-1: girder shrinkage loss ΔfpSD = εbdf Ep Kdf.

    Args:
        epsilon_bdf: girder shrinkage strain between deck placement and final time
            (positive magnitude).
        E_p: modulus of the prestressing steel, ksi.
        K_df: coefficient from Eq. 5.9.3.4.3a-2.

    Returns:
        ΔfpSD, ksi (positive is a loss).
    """
    return epsilon_bdf * E_p * K_df


def delta_f_pCD(
    E_p: float,
    E_ci: float,
    E_c: float,
    f_cgp: float,
    psi_b_tf_ti: float,
    psi_b_td_ti: float,
    delta_f_cd: float,
    psi_b_tf_td: float,
    K_df: float,
) -> float:
    """AASHTO LRFD 9th Ed. (2020) Eq. 5.9.3.4.3b-1: girder creep loss after deck placement.

    ΔfpCD = (Ep/Eci) fcgp [ψb(tf, ti) − ψb(td, ti)] Kdf + (Ep/Ec) Δfcd ψb(tf, td) Kdf

    Args:
        E_p: modulus of the prestressing steel, ksi.
        E_ci: modulus of the girder concrete at transfer, ksi.
        E_c: modulus of the girder concrete at service (28-day), ksi.
        f_cgp: as in :func:`delta_f_pCR`, ksi, positive for compression.
        psi_b_tf_ti: girder creep coefficient at final time for loading at transfer.
        psi_b_td_ti: girder creep coefficient at deck placement for loading at transfer.
        delta_f_cd: Δfcd, change in the compression-positive concrete stress at the strand
            centroid due to the long-term losses between transfer and deck placement combined
            with deck weight and superimposed loads, ksi; negative when compression is lost
            (the usual case), which makes the second term a gain.
        psi_b_tf_td: girder creep coefficient at final time for loading at deck placement.
        K_df: coefficient from Eq. 5.9.3.4.3a-2.

    Returns:
        ΔfpCD, ksi (positive is a loss; it may come out negative).
    """
    _positive(E_ci=E_ci, E_c=E_c)
    creep_of_transfer_stress = E_p / E_ci * f_cgp * (psi_b_tf_ti - psi_b_td_ti) * K_df
    creep_of_later_change = E_p / E_c * delta_f_cd * psi_b_tf_td * K_df
    return creep_of_transfer_stress + creep_of_later_change


def delta_f_cdf(
    epsilon_ddf: float,
    A_d: float,
    E_cd: float,
    psi_d_tf_td: float,
    A_c: float,
    I_c: float,
    e_pc: float,
    e_d: float,
) -> float:
    """AASHTO LRFD 9th Ed. (2020) Eq. 5.9.3.4.3d-2: stress at the strands due to deck shrinkage.

    As printed: Δfcdf = εddf Ad Ecd / [1 + 0.7 ψd(tf, td)] · (1/Ac − epc ed / Ic).

    Sign. A deck that shrinks while bonded to the girder acts on the composite section as a
    compressive force F = εddf Ad Ecd / [1 + 0.7 ψd] at the deck centroid, a distance ed above
    the composite centroid. At the strands (epc below) it gives the tensile stress
    F (epc ed / Ic − 1/Ac): for usual sections the bending term governs and the strand level
    goes into tension, which stretches the strands, hence the *gain* ΔfpSS of Eq.
    5.9.3.4.3d-1. The printed expression gives that tensile stress when εddf is entered as a
    shortening (negative strain). Because Eq. 5.4.2.3.3-1 of the 9th Edition returns shrinkage
    as a positive magnitude, this function takes ``epsilon_ddf`` as that positive magnitude and
    returns

        Δfcdf = −εddf Ad Ecd / [1 + 0.7 ψd(tf, td)] · (1/Ac − epc ed / Ic),

    positive for tension at the strand centroid (the reading of the sign is this module's,
    from the mechanics above).

    Args:
        epsilon_ddf: shrinkage strain of the deck between deck placement and final time,
            positive magnitude (Eq. 5.4.2.3.3-1 with the deck's own factors).
        A_d: area of the deck concrete, in.².
        E_cd: modulus of the deck concrete, ksi.
        psi_d_tf_td: creep coefficient of the deck at final time for loading introduced
            shortly after deck placement.
        A_c: area of the gross composite section, in.².
        I_c: moment of inertia of the gross composite section, in.⁴.
        e_pc: strand eccentricity from the composite centroid, in. (positive below).
        e_d: eccentricity of the deck centroid from the composite centroid, in. (positive
            when the deck is above, as in typical construction).

    Returns:
        Δfcdf, ksi, positive for tension at the strand centroid.
    """
    _positive(A_c=A_c, I_c=I_c)
    if A_d < 0.0 or E_cd < 0.0:
        raise ValueError(f"A_d and E_cd must be at least 0, got {A_d}, {E_cd}")
    force = epsilon_ddf * A_d * E_cd / (1.0 + 0.7 * psi_d_tf_td)
    return -force * (1.0 / A_c - e_pc * e_d / I_c)


def delta_f_pSS(
    E_p: float, E_c: float, delta_f_cdf: float, K_df: float, psi_b_tf_td: float
) -> float:
    """AASHTO LRFD 9th Ed. (2020) Eq. 5.9.3.4.3d-1: prestress gain due to deck shrinkage.

    ΔfpSS = (Ep/Ec) Δfcdf Kdf [1 + 0.7 ψb(tf, td)]

    Args:
        E_p: modulus of the prestressing steel, ksi.
        E_c: modulus of the girder concrete at service, ksi.
        delta_f_cdf: Δfcdf from :func:`delta_f_cdf`, ksi, positive for tension at the strands.
        K_df: coefficient from Eq. 5.9.3.4.3a-2.
        psi_b_tf_td: girder creep coefficient at final time for loading at deck placement.

    Returns:
        ΔfpSS, ksi (positive is a gain, subtracted in Eq. 5.9.3.4.1-1).
    """
    _positive(E_c=E_c)
    return E_p / E_c * delta_f_cdf * K_df * (1.0 + 0.7 * psi_b_tf_td)


def delta_f_pLT(
    delta_f_pSR: float,
    delta_f_pCR: float,
    delta_f_pR1: float,
    delta_f_pSD: float,
    delta_f_pCD: float,
    delta_f_pR2: float,
    delta_f_pSS: float,
) -> float:
    """AASHTO LRFD 9th Ed. (2020) Eq. 5.9.3.4.1-1: total time-dependent loss.

    ΔfpLT = (ΔfpSR + ΔfpCR + ΔfpR1)id + (ΔfpSD + ΔfpCD + ΔfpR2 − ΔfpSS)df

    Args:
        delta_f_pSR: girder shrinkage loss, transfer to deck placement, ksi.
        delta_f_pCR: girder creep loss, transfer to deck placement, ksi.
        delta_f_pR1: relaxation loss, transfer to deck placement, ksi.
        delta_f_pSD: girder shrinkage loss, deck placement to final, ksi.
        delta_f_pCD: girder creep loss, deck placement to final, ksi.
        delta_f_pR2: relaxation loss, deck placement to final, ksi.
        delta_f_pSS: gain due to deck shrinkage, ksi (positive is a gain).

    Returns:
        ΔfpLT, ksi (positive is a loss).
    """
    return (delta_f_pSR + delta_f_pCR + delta_f_pR1) + (
        delta_f_pSD + delta_f_pCD + delta_f_pR2 - delta_f_pSS
    )


def delta_f_cd(
    loss_id: float,
    A_ps: float,
    A_g: float,
    I_g: float,
    e_pg: float,
    M_deck: float,
    M_sdl: float,
    I_c: float,
    e_pc: float,
) -> float:
    """AASHTO LRFD 9th Ed. (2020) 5.9.3.4.3b: Δfcd from its definition (common practice reading).

    5.9.3.4.3b defines Δfcd as the change in concrete stress at the strand centroid due to the
    long-term losses between transfer and deck placement, combined with deck weight and
    superimposed loads. The usual elastic reading, compression positive, is

        Δfcd = −loss_id Aps (1/Ag + epg²/Ig) − M_deck epg / Ig − M_sdl epc / Ic

    with the losses acting on the girder section, the deck (and other loads placed before the
    section is composite) on the girder section and the superimposed loads on the composite
    section. This is not an equation printed in the specification.

    Args:
        loss_id: ΔfpSR + ΔfpCR + ΔfpR1, ksi (positive is a loss).
        A_ps: area of prestressing steel, in.².
        A_g: gross girder area, in.².
        I_g: gross girder moment of inertia, in.⁴.
        e_pg: strand eccentricity from the girder centroid, in. (positive below).
        M_deck: moment on the non-composite girder from the deck and other loads placed before
            the deck acts compositely, kip·in. (positive sagging).
        M_sdl: moment on the composite section from superimposed dead loads, kip·in.
            (positive sagging).
        I_c: gross composite moment of inertia, in.⁴.
        e_pc: strand eccentricity from the composite centroid, in. (positive below).

    Returns:
        Δfcd, ksi, compression positive (negative when compression is lost).
    """
    _positive(A_g=A_g, I_g=I_g, I_c=I_c)
    return -loss_id * A_ps * (1.0 / A_g + e_pg**2 / I_g) - M_deck * e_pg / I_g - M_sdl * e_pc / I_c


# --------------------------------------------------------------------------------------
# Orchestration
# --------------------------------------------------------------------------------------


@dataclass(frozen=True)
class RefinedLossInput:
    """Inputs of the AASHTO LRFD 9th Ed. (2020) 5.9.3.4 refined estimate, units as printed.

    Attributes:
        A_g: gross area of the girder, in.².
        I_g: moment of inertia of the gross girder section, in.⁴.
        e_pg: strand eccentricity from the gross girder centroid, in. (positive below).
        f_ci: specified compressive strength of the girder concrete at transfer f'ci, ksi.
        f_c: specified 28-day compressive strength of the girder concrete f'c, ksi (used for
            the applicability warning of 5.4.2.3 only).
        E_ci: modulus of the girder concrete at transfer, ksi.
        E_c: modulus of the girder concrete at service, ksi.
        V_S_girder: volume-to-surface ratio of the girder, in.
        A_d: area of the deck concrete, in.².
        e_d: eccentricity of the deck centroid from the composite centroid, in. (positive
            when the deck is above, the typical case).
        E_cd: modulus of the deck concrete, ksi.
        V_S_deck: volume-to-surface ratio of the deck, in. (its own ks).
        f_c_deck: specified 28-day compressive strength of the deck concrete, ksi.
        A_c: area of the gross composite section (deck transformed by the deck-to-girder
            modular ratio), in.².
        I_c: moment of inertia of the gross composite section, in.⁴.
        e_pc: strand eccentricity from the composite centroid, in. (positive below).
        A_ps: area of prestressing steel, in.².
        E_p: modulus of the prestressing steel, ksi.
        f_pt: stress in the strands immediately after transfer, ksi.
        f_py: yield strength of the prestressing steel, ksi.
        strand: relaxation class, ``"low_relaxation"`` or ``"stress_relieved"``.
        f_cgp: concrete stress at the strand centroid due to the prestressing force just after
            transfer and the self-weight at the section of maximum moment, ksi, positive for
            compression.
        delta_f_cd: Δfcd of 5.9.3.4.3b, ksi, compression positive (negative in the usual
            case; :func:`delta_f_cd` computes it from its definition).
        H: average annual ambient relative humidity, percent.
        t_i: age of the girder concrete at transfer, days.
        t_d: age of the girder concrete at deck placement, days.
        t_f: final age of the girder concrete, days.
        f_ci_deck: f'ci of the deck for kf and ktd, ksi; ``None`` takes 0.80 f'c of the deck
            (5.4.2.3.2).
        t_i_deck: age of the deck concrete when the loads that make it creep are introduced,
            days ("shortly after deck placement", 5.9.3.4.3d); 1 day by default.
        relaxation_simplified: take ΔfpR1 = ΔfpR2 = 1.2 ksi for low-relaxation strand
            (5.9.3.4.2c) instead of Eq. 5.9.3.4.2c-1.
    """

    # girder
    A_g: float
    I_g: float
    e_pg: float
    f_ci: float
    f_c: float
    E_ci: float
    E_c: float
    V_S_girder: float
    # deck
    A_d: float
    e_d: float
    E_cd: float
    V_S_deck: float
    f_c_deck: float
    # composite section
    A_c: float
    I_c: float
    e_pc: float
    # strand
    A_ps: float
    E_p: float
    f_pt: float
    f_py: float
    strand: rx.StrandClass
    # stresses at the strand centroid
    f_cgp: float
    delta_f_cd: float
    # environment and ages
    H: float
    t_i: float
    t_d: float
    t_f: float
    # options
    f_ci_deck: float | None = None
    t_i_deck: float = 1.0
    relaxation_simplified: bool = False


@dataclass(frozen=True)
class RefinedLossResult:
    """Components and intermediate factors of the 5.9.3.4 refined estimate (ksi, days).

    Attributes:
        k_s_girder: ks of the girder (Eq. 5.4.2.3.2-2).
        k_s_deck: ks of the deck, with the deck V/S.
        k_hc: khc (Eq. 5.4.2.3.2-3).
        k_hs: khs (Eq. 5.4.2.3.3-2).
        k_f_girder: kf with the girder f'ci (Eq. 5.4.2.3.2-4).
        k_f_deck: kf with the deck f'ci.
        f_ci_deck: deck f'ci used, ksi.
        k_td_id: girder ktd at t = td − ti (Eq. 5.4.2.3.2-5).
        k_td_if: girder ktd at t = tf − ti.
        k_td_df: girder ktd at t = tf − td.
        k_td_deck: deck ktd at t = tf − td (deck f'ci).
        psi_b_td_ti: ψb(td, ti).
        psi_b_tf_ti: ψb(tf, ti).
        psi_b_tf_td: ψb(tf, td).
        psi_d_tf_td: ψd(tf, td).
        epsilon_bid: girder shrinkage, transfer to deck placement.
        epsilon_bif: girder shrinkage, transfer to final.
        epsilon_bdf: girder shrinkage, deck placement to final (εbif − εbid).
        epsilon_ddf: deck shrinkage, deck placement to final.
        K_id: Eq. 5.9.3.4.2a-2.
        K_df: Eq. 5.9.3.4.3a-2.
        delta_f_cdf: Δfcdf, ksi, positive for tension at the strands (Eq. 5.9.3.4.3d-2).
        delta_f_pSR: ksi, Eq. 5.9.3.4.2a-1.
        delta_f_pCR: ksi, Eq. 5.9.3.4.2b-1.
        delta_f_pR1: ksi, Eq. 5.9.3.4.2c-1.
        delta_f_pSD: ksi, Eq. 5.9.3.4.3a-1.
        delta_f_pCD: ksi, Eq. 5.9.3.4.3b-1.
        delta_f_pR2: ksi, Eq. 5.9.3.4.3c-1.
        delta_f_pSS: ksi, gain, Eq. 5.9.3.4.3d-1.
        loss_id: ΔfpSR + ΔfpCR + ΔfpR1, ksi.
        loss_df: ΔfpSD + ΔfpCD + ΔfpR2 − ΔfpSS, ksi.
        delta_f_pLT: total time-dependent loss, ksi, Eq. 5.9.3.4.1-1.
    """

    k_s_girder: float
    k_s_deck: float
    k_hc: float
    k_hs: float
    k_f_girder: float
    k_f_deck: float
    f_ci_deck: float
    k_td_id: float
    k_td_if: float
    k_td_df: float
    k_td_deck: float
    psi_b_td_ti: float
    psi_b_tf_ti: float
    psi_b_tf_td: float
    psi_d_tf_td: float
    epsilon_bid: float
    epsilon_bif: float
    epsilon_bdf: float
    epsilon_ddf: float
    K_id: float
    K_df: float
    delta_f_cdf: float
    delta_f_pSR: float
    delta_f_pCR: float
    delta_f_pR1: float
    delta_f_pSD: float
    delta_f_pCD: float
    delta_f_pR2: float
    delta_f_pSS: float
    loss_id: float
    loss_df: float
    delta_f_pLT: float


def warn_strengths_beyond_range(f_c: float, f_c_deck: float | None) -> None:
    """Warn where a specified strength (ksi) exceeds that of the 5.4.2.3 equations.

    AASHTO LRFD 9th Ed. (2020) 5.4.2.3.1 (from memory): the creep and shrinkage equations
    are stated for specified concrete strengths up to 15.0 ksi; beyond it the estimates are
    extrapolated (a soft limit: a warning, which a loss method turns into its note).
    """
    for name, value in (("f'c of the girder", f_c), ("f'c of the deck", f_c_deck)):
        if value is not None and value > cs.F_C_UPPER_KSI:
            warnings.warn(
                f"{name} = {ksi_mpa(value)} exceeds {ksi_mpa(cs.F_C_UPPER_KSI)}, the upper "
                "strength of the AASHTO LRFD 5.4.2.3 creep and shrinkage equations",
                stacklevel=3,
            )


def refined_losses(inp: RefinedLossInput) -> RefinedLossResult:
    """AASHTO LRFD 9th Ed. (2020) 5.9.3.4: refined estimate of time-dependent losses.

    Evaluates every factor and component of 5.9.3.4.2 and 5.9.3.4.3 and the total of
    Eq. 5.9.3.4.1-1 for a pretensioned girder with a composite deck. The intervals at which
    ktd is evaluated are listed in the module docstring.

    Args:
        inp: the inputs, see :class:`RefinedLossInput`.

    Returns:
        The components, the total and every intermediate factor.

    Raises:
        ValueError: if the ages are not 0 < ti < td < tf, or for inputs outside the ranges
            of the equations (see :mod:`prestress.codes.aashto_lrfd.creep_shrinkage`).
    """
    _positive(t_i=inp.t_i, t_i_deck=inp.t_i_deck)
    if not inp.t_i < inp.t_d < inp.t_f:
        raise ValueError(
            "ages must satisfy 0 < t_i < t_d < t_f (days), got "
            f"t_i={inp.t_i}, t_d={inp.t_d}, t_f={inp.t_f}"
        )
    _positive(
        A_g=inp.A_g,
        I_g=inp.I_g,
        E_ci=inp.E_ci,
        E_c=inp.E_c,
        E_cd=inp.E_cd,
        E_p=inp.E_p,
        A_c=inp.A_c,
        I_c=inp.I_c,
        f_c=inp.f_c,
        f_c_deck=inp.f_c_deck,
    )
    warn_strengths_beyond_range(inp.f_c, inp.f_c_deck)
    f_ci_d = 0.80 * inp.f_c_deck if inp.f_ci_deck is None else inp.f_ci_deck

    # Correction factors (5.4.2.3.2, 5.4.2.3.3)
    ks_g = float(cs.k_s(inp.V_S_girder))
    ks_d = float(cs.k_s(inp.V_S_deck))
    khc = float(cs.k_hc(inp.H))
    khs = float(cs.k_hs(inp.H))
    kf_g = float(cs.k_f(inp.f_ci))
    kf_d = float(cs.k_f(f_ci_d))
    ktd_id = float(cs.k_td(inp.t_d - inp.t_i, inp.f_ci))
    ktd_if = float(cs.k_td(inp.t_f - inp.t_i, inp.f_ci))
    ktd_df = float(cs.k_td(inp.t_f - inp.t_d, inp.f_ci))
    ktd_deck = float(cs.k_td(inp.t_f - inp.t_d, f_ci_d))

    # Creep coefficients (Eq. 5.4.2.3.2-1)
    psi_td_ti = float(cs.psi(inp.t_d - inp.t_i, inp.t_i, inp.V_S_girder, inp.H, inp.f_ci))
    psi_tf_ti = float(cs.psi(inp.t_f - inp.t_i, inp.t_i, inp.V_S_girder, inp.H, inp.f_ci))
    psi_tf_td = float(cs.psi(inp.t_f - inp.t_d, inp.t_d, inp.V_S_girder, inp.H, inp.f_ci))
    psi_d = float(cs.psi(inp.t_f - inp.t_d, inp.t_i_deck, inp.V_S_deck, inp.H, f_ci_d))

    # Shrinkage strains (Eq. 5.4.2.3.3-1)
    eps_bid = float(cs.epsilon_sh(inp.t_d - inp.t_i, inp.V_S_girder, inp.H, inp.f_ci))
    eps_bif = float(cs.epsilon_sh(inp.t_f - inp.t_i, inp.V_S_girder, inp.H, inp.f_ci))
    eps_bdf = eps_bif - eps_bid
    eps_ddf = float(cs.epsilon_sh(inp.t_f - inp.t_d, inp.V_S_deck, inp.H, f_ci_d))

    # 5.9.3.4.2: transfer to deck placement
    kid = K_id(inp.E_p, inp.E_ci, inp.A_ps, inp.A_g, inp.I_g, inp.e_pg, psi_tf_ti)
    sr = delta_f_pSR(eps_bid, inp.E_p, kid)
    cr = delta_f_pCR(inp.E_p, inp.E_ci, inp.f_cgp, psi_td_ti, kid)
    r1 = rx.delta_f_pR1(inp.f_pt, inp.f_py, inp.strand, simplified=inp.relaxation_simplified)

    # 5.9.3.4.3: deck placement to final
    kdf = K_df(inp.E_p, inp.E_ci, inp.A_ps, inp.A_c, inp.I_c, inp.e_pc, psi_tf_ti)
    sd = delta_f_pSD(eps_bdf, inp.E_p, kdf)
    cd = delta_f_pCD(
        inp.E_p, inp.E_ci, inp.E_c, inp.f_cgp, psi_tf_ti, psi_td_ti, inp.delta_f_cd, psi_tf_td, kdf
    )
    r2 = rx.delta_f_pR2(inp.f_pt, inp.f_py, inp.strand, simplified=inp.relaxation_simplified)
    fcdf = delta_f_cdf(eps_ddf, inp.A_d, inp.E_cd, psi_d, inp.A_c, inp.I_c, inp.e_pc, inp.e_d)
    ss = delta_f_pSS(inp.E_p, inp.E_c, fcdf, kdf, psi_tf_td)

    loss_id = sr + cr + r1
    loss_df = sd + cd + r2 - ss
    return RefinedLossResult(
        k_s_girder=ks_g,
        k_s_deck=ks_d,
        k_hc=khc,
        k_hs=khs,
        k_f_girder=kf_g,
        k_f_deck=kf_d,
        f_ci_deck=f_ci_d,
        k_td_id=ktd_id,
        k_td_if=ktd_if,
        k_td_df=ktd_df,
        k_td_deck=ktd_deck,
        psi_b_td_ti=psi_td_ti,
        psi_b_tf_ti=psi_tf_ti,
        psi_b_tf_td=psi_tf_td,
        psi_d_tf_td=psi_d,
        epsilon_bid=eps_bid,
        epsilon_bif=eps_bif,
        epsilon_bdf=eps_bdf,
        epsilon_ddf=eps_ddf,
        K_id=kid,
        K_df=kdf,
        delta_f_cdf=fcdf,
        delta_f_pSR=sr,
        delta_f_pCR=cr,
        delta_f_pR1=r1,
        delta_f_pSD=sd,
        delta_f_pCD=cd,
        delta_f_pR2=r2,
        delta_f_pSS=ss,
        loss_id=loss_id,
        loss_df=loss_df,
        delta_f_pLT=delta_f_pLT(sr, cr, r1, sd, cd, r2, ss),
    )
