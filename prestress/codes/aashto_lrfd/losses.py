"""AASHTO LRFD 9th Ed. (2020) 5.9.3: instantaneous losses and the approximate long-term estimate.

Elastic shortening of pretensioned members (5.9.3.2.3a and its commentary) and the
approximate estimate of time-dependent losses (5.9.3.3). The refined estimate lives in
:mod:`prestress.codes.aashto_lrfd.refined_losses`.
"""

from __future__ import annotations


def delta_f_pES(E_p: float, E_ct: float, f_cgp: float) -> float:
    """AASHTO LRFD 9th Ed. (2020) Eq. 5.9.3.2.3a-1: elastic shortening loss, ΔfpES = Ep/Ect fcgp.

    Args:
        E_p: modulus of the prestressing steel (any stress unit).
        E_ct: modulus of the concrete at transfer, same unit.
        f_cgp: concrete stress at the centre of gravity of the strands due to the prestressing
            force at transfer and the self-weight at the section of maximum moment, as a
            compressive magnitude (positive for compression), same stress unit.

    Returns:
        ΔfpES, in the stress unit of ``f_cgp`` (positive is a loss).
    """
    if E_p <= 0 or E_ct <= 0:
        raise ValueError("E_p and E_ct must be positive")
    return E_p / E_ct * f_cgp


def delta_f_pES_closed_form(
    A_ps: float,
    f_pbt: float,
    I_g: float,
    e_m: float,
    A_g: float,
    M_g: float,
    E_ci: float,
    E_p: float,
) -> float:
    """AASHTO LRFD 9th Ed. (2020) Eq. C5.9.3.2.3a-1: elastic shortening, closed form, gross section.

    ΔfpES = Aps fpbt (Ig + em² Ag) − em Mg Ag  /  [Aps (Ig + em² Ag) + Ag Ig Eci / Ep]

    It is the exact solution of Eq. 5.9.3.2.3a-1 with fcgp = P/Ag + P em²/Ig − Mg em/Ig and
    P = Aps (fpbt − ΔfpES). Any consistent units (e.g. kip, in, ksi, kip·in).

    Args:
        A_ps: area of prestressing steel.
        f_pbt: stress in the strands immediately prior to transfer.
        I_g: moment of inertia of the gross section.
        e_m: average strand eccentricity at midspan (positive below the centroid).
        A_g: gross area.
        M_g: midspan moment due to member self-weight (positive sagging).
        E_ci: modulus of the concrete at transfer.
        E_p: modulus of the prestressing steel.

    Returns:
        ΔfpES in the stress unit of ``f_pbt``.
    """
    if min(A_ps, I_g, A_g, E_ci, E_p) <= 0:
        raise ValueError("A_ps, I_g, A_g, E_ci and E_p must be positive")
    numerator = A_ps * f_pbt * (I_g + e_m**2 * A_g) - e_m * M_g * A_g
    denominator = A_ps * (I_g + e_m**2 * A_g) + A_g * I_g * E_ci / E_p
    return numerator / denominator


def f_cgp(P_i: float, A_g: float, I_g: float, e: float, M_g: float) -> float:
    """AASHTO LRFD 9th Ed. (2020) 5.9.3.2.3a: fcgp = Pi/Ag + Pi e²/Ig − Mg e/Ig (compression +).

    Args:
        P_i: prestressing force after transfer (positive).
        A_g: gross area.
        I_g: gross moment of inertia.
        e: strand eccentricity (positive below the centroid).
        M_g: self-weight moment at the section (positive sagging).

    Returns:
        Concrete compressive stress at the strand centroid, positive for compression.
    """
    return P_i / A_g + P_i * e**2 / I_g - M_g * e / I_g


def gamma_h(H: float) -> float:
    """AASHTO LRFD 9th Ed. (2020) Eq. 5.9.3.3-2: humidity correction factor γh = 1.7 − 0.01 H.

    Args:
        H: average annual ambient relative humidity, percent (0 to 100).
    """
    if not 0.0 <= H <= 100.0:
        raise ValueError(f"H must be a relative humidity from 0 to 100 percent, got {H}")
    return 1.7 - 0.01 * H


def gamma_st(f_ci_ksi: float) -> float:
    """AASHTO LRFD 9th Ed. (2020) Eq. 5.9.3.3-3: strength correction factor γst = 5 / (1 + f'ci).

    Args:
        f_ci_ksi: specified compressive strength of concrete at transfer, ksi.
    """
    if f_ci_ksi <= 0:
        raise ValueError(f"f_ci_ksi must be positive, got {f_ci_ksi}")
    return 5.0 / (1.0 + f_ci_ksi)


#: AASHTO LRFD 9th Ed. (2020) 5.9.3.3: relaxation term ΔfpR, ksi, for low-relaxation strand.
DELTA_F_PR_LOW_RELAXATION_KSI = 2.4

#: AASHTO LRFD 5.9.3.3: relaxation term for stress-relieved strand, ksi (from memory).
DELTA_F_PR_STRESS_RELIEVED_KSI = 10.0


def delta_f_pLT_approximate(
    f_pi_ksi: float,
    A_ps: float,
    A_g: float,
    H: float,
    f_ci_ksi: float,
    delta_f_pR_ksi: float = DELTA_F_PR_LOW_RELAXATION_KSI,
) -> dict[str, float]:
    """AASHTO LRFD 9th Ed. (2020) Eq. 5.9.3.3-1: approximate estimate of time-dependent losses.

    ΔfpLT = 10.0 fpi Aps/Ag γh γst + 12.0 γh γst + ΔfpR   (ksi)

    The first term is attributed to creep, the second to shrinkage, the third to relaxation
    (the commentary's reading of the three terms). The clause applies to standard precast,
    pretensioned members of normal-weight concrete under normal loading and climate.

    Args:
        f_pi_ksi: prestressing steel stress immediately prior to transfer, ksi.
        A_ps: area of prestressing steel (any area unit, same as ``A_g``).
        A_g: gross area of the section.
        H: average annual ambient relative humidity, percent.
        f_ci_ksi: f'ci, ksi.
        delta_f_pR_ksi: relaxation loss, ksi (2.4 ksi for low-relaxation strand).

    Returns:
        Mapping with the components ``creep``, ``shrinkage``, ``relaxation``, the total ``total``
        and the factors ``gamma_h`` and ``gamma_st`` (stresses in ksi).
    """
    if A_g <= 0 or A_ps < 0:
        raise ValueError("A_g must be positive and A_ps non-negative")
    gh = gamma_h(H)
    gst = gamma_st(f_ci_ksi)
    creep = 10.0 * f_pi_ksi * A_ps / A_g * gh * gst
    shrinkage = 12.0 * gh * gst
    return {
        "creep": creep,
        "shrinkage": shrinkage,
        "relaxation": delta_f_pR_ksi,
        "total": creep + shrinkage + delta_f_pR_ksi,
        "gamma_h": gh,
        "gamma_st": gst,
    }
