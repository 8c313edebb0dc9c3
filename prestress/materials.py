"""Material properties from published formulas, in the internal system (MPa, N/mm^3).

Thin wrappers that convert once to each code's own units and call the equation in
:mod:`prestress.codes`.
"""

from __future__ import annotations

from prestress.codes import aci318_19, en1992_1_1_materials
from prestress.codes.aashto_lrfd import materials as aashto
from prestress.units import FOOT_MM, KIP_N, KSI_MPA, LBF_N

#: Formulas the job may name for the concrete modulus, with the clause they implement.
MODULUS_FORMULAS = {
    "aashto": "AASHTO LRFD 9th Ed. (2020) Eq. 5.4.2.4-1",
    "aci318": "ACI 318-19 19.2.2.1(a)",
    "en1992": "EN 1992-1-1:2004 Table 3.1 (Ecm, fcm = fck + 8 MPa)",
}


def concrete_modulus(strength: float, unit_weight: float, formula: str, K_1: float = 1.0) -> float:
    """Modulus of elasticity of concrete (MPa) for a strength (MPa) by a named formula.

    Args:
        strength: compressive strength f'c or f'ci (fck for EN 1992-1-1), MPa.
        unit_weight: unit weight of the concrete, N/mm^3 (used by the AASHTO and ACI forms).
        formula: a key of :data:`MODULUS_FORMULAS`.
        K_1: AASHTO aggregate correction factor K1.
    """
    if formula == "aashto":
        w_kcf = unit_weight * FOOT_MM**3 / KIP_N
        return aashto.E_c(strength / KSI_MPA, w_kcf, K_1) * KSI_MPA
    if formula == "aci318":
        w_pcf = unit_weight * FOOT_MM**3 / LBF_N
        return aci318_19.E_c(strength / KSI_MPA * 1000.0, w_pcf) * KSI_MPA / 1000.0
    if formula == "en1992":
        return en1992_1_1_materials.E_cm(en1992_1_1_materials.f_cm(strength))
    raise ValueError(f"unknown modulus formula {formula!r}")
