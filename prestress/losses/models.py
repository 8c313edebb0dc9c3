"""Creep and shrinkage models for the time-step analysis, one adapter per published model.

Engine units: MPa, mm, days (N/mm³ for unit weights). Every adapter answers the same four
questions, for ages of *its own* concrete (days since that concrete was cast):

* ``E(age)``: modulus of elasticity at that age, MPa (the modulus of the instantaneous strain);
* ``phi(age, age_at_loading)``: the code's own creep coefficient, referred to the modulus the code
  names (``phi_reference`` says which: ``"loading"`` = the modulus at the age at loading,
  ``"28-day"`` = the modulus at 28 days);
* ``compliance(age, age_at_loading)``: the creep function J(t, t0), 1/MPa, the strain at age t
  per unit stress applied at age t0 and held. This is what the engine uses:

      J = (1 + φ(t, t0)) / E(t0)            when φ refers to the modulus at loading (AASHTO, ACI)
      J = 1 / E(t0) + φ(t, t0) / E(28)      when φ refers to the 28-day modulus (MC2010, EN)

* ``shrinkage(age, age_at_end_of_curing=None)``: the free shrinkage strain since casting,
  **negative for shortening** (the project's sign convention); ``None`` takes the adapter's own
  age at the end of curing.

The adapters wrap the pure functions of :mod:`prestress.codes` (which stay in each code's
printed units) and convert once. They are frozen dataclasses; ``MODELS`` maps the names
``"aashto"``, ``"aci209"``, ``"mc2010"`` and ``"en1992"`` to them and :func:`make_model` builds one
by name. :class:`ElasticConcrete` (no creep, no shrinkage) is not a code model: it is offered for
checks of the engine.

Soft limits of the codes (strength, humidity, earliest age at loading) are reported once, when the
adapter is built, not on every array evaluation; each adapter states its earliest age at loading
in ``min_loading_age`` so the engine can warn when a load comes earlier.

Consistency with a job's own concrete figures (what :mod:`prestress.losses.timestep_method` passes):
every adapter takes the 28-day modulus ``E_28`` and the modulus at transfer ``E_ci``, and its
strength-time law is tied to the strength at transfer ``f_ci`` (AASHTO and ACI 209R-92: a fitted
constant of the Eq. 2-1 form; MC2010 and EN 1992-1-1: a temperature-adjusted, equivalent age at
the end of curing). The modulus keeps the code's own development law in shape, E(t) = E_28 ·
r(t)^n with r the code's strength ratio and n the code's exponent (0.33 AASHTO, 0.5 ACI and
MC2010, 0.3 EN), except that n is recalibrated so that E passes exactly through ``E_ci`` at
transfer when it is given (:func:`_calibrated_exponent`). This calibration is a choice of this
module: the job's moduli are the engineer's input and every other part of the analysis (the
transformed sections, the refined estimate) uses them.
"""

from __future__ import annotations

import math
import warnings
from dataclasses import dataclass, field
from typing import Any, ClassVar, Protocol, runtime_checkable

import numpy as np
from numpy.typing import ArrayLike, NDArray

from prestress.codes import aci209r92 as aci
from prestress.codes import en1992_1_1 as en
from prestress.codes import mc2010 as mc
from prestress.codes.aashto_lrfd import creep_shrinkage as aashto_cs
from prestress.units import FOOT_MM, INCH_MM, KIP_N, KSI_MPA, LBF_N

FloatArray = NDArray[np.float64]

#: Unit weight of 1 kcf and of 1 pcf in N/mm³ (exact from the factors of prestress.units).
KCF_N_MM3 = KIP_N / FOOT_MM**3
PCF_N_MM3 = LBF_N / FOOT_MM**3
#: 1 psi in MPa.
PSI_MPA = KSI_MPA / 1000.0


@runtime_checkable
class CreepShrinkageModel(Protocol):
    """What the time-step engine asks of a concrete model (MPa, days; ages of that concrete)."""

    name: str
    phi_reference: str
    min_loading_age: float
    age_at_end_of_curing: float

    def E(self, age: ArrayLike) -> FloatArray:
        """Modulus of elasticity at ``age`` (days), MPa."""
        ...

    def phi(self, age: ArrayLike, age_at_loading: ArrayLike) -> FloatArray:
        """The code's creep coefficient at ``age`` for loading at ``age_at_loading``."""
        ...

    def compliance(self, age: ArrayLike, age_at_loading: ArrayLike) -> FloatArray:
        """Creep function J(t, t0), 1/MPa."""
        ...

    def shrinkage(self, age: ArrayLike, age_at_end_of_curing: float | None = None) -> FloatArray:
        """Free shrinkage strain since casting (negative = shortening)."""
        ...


# --------------------------------------------------------------------------- checks
def _finite_float(name: str, value: Any) -> float:
    try:
        v = float(value)
    except (TypeError, ValueError):
        raise ValueError(f"{name} must be a number, got {value!r}") from None
    if not np.isfinite(v):
        raise ValueError(f"{name} must be finite, got {value!r}")
    return v


def _positive(name: str, value: Any, unit: str) -> float:
    v = _finite_float(name, value)
    if v <= 0.0:
        raise ValueError(f"{name} must be greater than 0 {unit}, got {value!r}")
    return v


def _fib_checks(m: Any) -> float:
    """Checks shared by the MC2010 and EN 1992-1-1 adapters; returns fcm (MPa, fck + 8)."""
    fck = _positive("f_ck", m.f_ck, "MPa")
    fcm = fck + 8.0 if m.f_cm is None else _positive("f_cm", m.f_cm, "MPa")
    _humidity(m.relative_humidity)
    _positive("notional_size", m.notional_size, "mm")
    _positive("age_at_end_of_curing", m.age_at_end_of_curing, "days")
    if m.equivalent_age_at_end_of_curing is not None:
        _positive("equivalent_age_at_end_of_curing", m.equivalent_age_at_end_of_curing, "d")
        if m.f_ci is not None:
            raise ValueError(
                "equivalent_age_at_end_of_curing and f_ci must not both be given (the "
                "equivalent age is fitted to f_ci)"
            )
    if m.f_ci is not None:
        fci = _positive("f_ci", m.f_ci, "MPa")
        if fci > fck:
            raise ValueError(f"f_ci must not exceed f_ck ({fck:g} MPa), got {fci:g} MPa")
    return fcm


def _equivalent_age(f_ci: float, f_ck: float, f_cm: float, s: float) -> float:
    """Temperature-adjusted age at which βcc(t) fcm = f_ci + (fcm − fck), days (≤ 28).

    fib MC2010 (2013) Eq. 5.1-51 and EN 1992-1-1:2004 Eq. 3.2, βcc(t) = exp{s [1 − (28/t)^½]},
    solved for t: t = 28 / [1 − ln(βcc)/s]², with the mean strength at that age taken as the
    characteristic strength at transfer plus fcm − fck (8 MPa, MC2010 Eq. 5.1-1, EN Table 3.1).
    The age so found is the temperature-adjusted (maturity) age of MC2010 5.1.10 (Eq. 5.1-85)
    and EN 1992-1-1 B.1(2) (Eq. B.10) that steam curing reaches at transfer (from memory: EN
    1992-1-1 10.3.1.1(3) estimates the strength of heat-treated precast concrete with that age).

    Args:
        f_ci: characteristic strength at transfer, MPa (≤ f_ck).
        f_ck: characteristic 28-day strength, MPa.
        f_cm: mean 28-day strength, MPa.
        s: coefficient s of the cement class.
    """
    beta_cc = (f_ci + f_cm - f_ck) / f_cm
    return 28.0 / (1.0 - math.log(beta_cc) / s) ** 2


def _humidity(value: Any) -> float:
    v = _finite_float("relative_humidity", value)
    if not 0.0 <= v <= 100.0:
        raise ValueError(f"relative_humidity must be from 0 to 100 percent, got {value!r}")
    return v


def _ages(age: ArrayLike, age_at_loading: ArrayLike) -> tuple[FloatArray, FloatArray]:
    t = np.asarray(age, dtype=float)
    t0 = np.asarray(age_at_loading, dtype=float)
    if np.any(~np.isfinite(t0)) or np.any(t0 <= 0.0):
        raise ValueError("age_at_loading must be greater than 0 days")
    if np.any(~np.isfinite(t)) or np.any(t < t0):
        raise ValueError("age must be finite and not earlier than age_at_loading (days)")
    return np.broadcast_arrays(t, t0)  # type: ignore[return-value]


def _age(age: ArrayLike) -> FloatArray:
    t = np.asarray(age, dtype=float)
    if np.any(~np.isfinite(t)) or np.any(t < 0.0):
        raise ValueError("age must be at least 0 days")
    return t


def _calibrated_exponent(default: float, ratio: float, E_ci: float | None, E_ref: float) -> float:
    """Exponent n of E(t) = E_ref · r(t)^n that gives E_ci where the strength ratio r is ``ratio``.

    A choice of this module (see the module docstring): the code's own development law
    E = E_ref · r^default, with the exponent recalibrated so that the modulus at transfer is the
    job's. ``E_ci`` None keeps the code's exponent.

    Args:
        default: the code's exponent.
        ratio: the model's strength ratio r (to the reference age) at the age of ``E_ci``.
        E_ci: the modulus wanted at that age, MPa, or ``None``.
        E_ref: the modulus at r = 1, MPa.

    Raises:
        ValueError: naming ``E_ci`` when no non-negative exponent reproduces it.
    """
    if E_ci is None:
        return default
    Eci = _positive("E_ci", E_ci, "MPa")
    if abs(math.log(ratio)) < 1e-9:
        if abs(Eci / E_ref - 1.0) > 1e-9:
            raise ValueError(
                f"E_ci must equal the 28-day modulus ({E_ref:g} MPa) when the strength at transfer "
                f"is the 28-day strength (no gain left to grow the modulus), got {Eci:g} MPa"
            )
        return default
    n = math.log(Eci / E_ref) / math.log(ratio)
    if n < 0.0:
        raise ValueError(
            f"E_ci = {Eci:g} MPa would make the modulus fall while the strength grows "
            f"(28-day modulus {E_ref:g} MPa)"
        )
    return n


class _Base:
    """Shared logic: compliance from φ and the stated modulus reference."""

    name: ClassVar[str]
    phi_reference: ClassVar[str]
    age_at_end_of_curing: float
    min_loading_age: float

    @property
    def min_loading_age_source(self) -> str:
        """The clause stating ``min_loading_age`` (empty where the model has no such limit)."""
        return ""

    def E(self, age: ArrayLike) -> FloatArray:  # pragma: no cover - overridden
        """Modulus of elasticity at ``age``, MPa."""
        raise NotImplementedError

    def _phi(self, t: FloatArray, t0: FloatArray) -> FloatArray:  # pragma: no cover
        raise NotImplementedError

    def _shrinkage(self, t: FloatArray, tc: float) -> FloatArray:  # pragma: no cover
        raise NotImplementedError

    def phi(self, age: ArrayLike, age_at_loading: ArrayLike) -> FloatArray:
        """The code's creep coefficient φ(t, t0) (reference modulus: ``phi_reference``)."""
        t, t0 = _ages(age, age_at_loading)
        with warnings.catch_warnings():
            warnings.simplefilter("ignore")  # soft limits were reported when the model was built
            return np.asarray(self._phi(t, t0), dtype=float)

    def compliance(self, age: ArrayLike, age_at_loading: ArrayLike) -> FloatArray:
        """Creep function J(t, t0), 1/MPa (see the module docstring for the two forms)."""
        t, t0 = _ages(age, age_at_loading)
        phi = self.phi(t, t0)
        if self.phi_reference == "loading":
            return (1.0 + phi) / self.E(t0)
        return 1.0 / self.E(t0) + phi / self.E(28.0)

    def shrinkage(self, age: ArrayLike, age_at_end_of_curing: float | None = None) -> FloatArray:
        """Free shrinkage strain since casting at ``age`` (days), negative for shortening.

        Args:
            age: age of the concrete, days (≥ 0). Vectorised.
            age_at_end_of_curing: start of drying, days; ``None`` takes the model's own.

        Returns:
            Strain (negative = shortening); zero before drying starts where the code has
            drying shrinkage only.
        """
        t = _age(age)
        tc = (
            self.age_at_end_of_curing
            if age_at_end_of_curing is None
            else _positive("age_at_end_of_curing", age_at_end_of_curing, "days")
        )
        with warnings.catch_warnings():
            warnings.simplefilter("ignore")
            return np.asarray(self._shrinkage(t, tc), dtype=float)


# --------------------------------------------------------------------------- AASHTO LRFD
@dataclass(frozen=True)
class AashtoModel(_Base):
    """AASHTO LRFD 9th Ed. (2020) 5.4.2.3 creep and shrinkage with 5.4.2.4 modulus.

    * Creep: ψ(t, ti) of Eq. 5.4.2.3.2-1 with t = age − age at loading (the maturity of
      5.4.2.3.2 is the time *since loading*) and ti = the age at loading. ψ is the ratio of the
      creep strain to the elastic strain at loading, so J = (1 + ψ) / E(t0) (``phi_reference``
      ``"loading"``; it is how 5.9.3.4 uses it, e.g. (Ep/Eci) fcgp ψb(td, ti)).
    * Shrinkage: −εsh of Eq. 5.4.2.3.3-1 with t = age − age at end of curing (drying time);
      zero before. For a precast girder the end of curing is transfer (common practice).
    * kf and ktd use f'ci; where it is not given, 0.80 f'c (5.4.2.3.2 allows it where the age at
      initial loading is unknown at design time).
    * Modulus: Eq. 5.4.2.4-1, Ec = 120,000 K1 wc² f'c(t)^0.33 (ksi, kcf), with the strength at
      age t following f'c(t) = f'c · t / (a + b t), the form of ACI 209R-92 Eq. 2-1, fitted to pass
      through f'ci at ``age_f_ci`` and f'c at 28 days (b = 1 − a/28), and held at f'c from 28 days
      on. This strength-time law is an assumption of this module (the LRFD text used here gives
      none to cite); it reproduces Eci at transfer and Ec in service exactly as 5.9.3.4 uses them.
      With ``E_28`` given, E(t) = E_28 · (f'c(t)/f'c)^n, n = 0.33, or n recalibrated so that
      E(age_f_ci) = ``E_ci`` when that is given (:func:`_calibrated_exponent`; n = 0.33 exactly
      when the job's moduli come from Eq. 5.4.2.4-1 with any wc and K1).
    * Transfer at 28 days or later: with f'ci = f'c the strength is f'c from then on (a = 0);
      with f'ci < f'c the law cannot reach f'c at 28 days and a ``ValueError`` names
      ``age_f_ci``.

    Attributes:
        f_c: specified compressive strength at 28 days f'c, MPa.
        relative_humidity: H, percent.
        volume_to_surface: V/S, mm.
        unit_weight: wc for Eq. 5.4.2.4-1, N/mm³ (0.090 to 0.155 kcf); not needed with ``E_28``.
        age_at_end_of_curing: start of drying, days.
        f_ci: strength at the first loading (transfer) f'ci, MPa; ``None`` = 0.80 f'c.
        age_f_ci: age at which f'ci is reached, days (> 0; under 28 unless f'ci = f'c);
            ``None`` = the age at the end of curing.
        K_1: aggregate correction factor of Eq. 5.4.2.4-1.
        E_28: modulus at 28 days, MPa, if given (overrides Eq. 5.4.2.4-1).
        E_ci: modulus at ``age_f_ci``, MPa, if given (calibrates the exponent, see above).
    """

    f_c: float
    relative_humidity: float
    volume_to_surface: float
    unit_weight: float | None = None
    age_at_end_of_curing: float = 1.0
    f_ci: float | None = None
    age_f_ci: float | None = None
    K_1: float = 1.0
    E_28: float | None = None
    E_ci: float | None = None
    min_loading_age: float = field(default=0.0, init=False)
    _a: float = field(default=0.0, init=False, repr=False)
    _b: float = field(default=1.0, init=False, repr=False)
    _E28: float = field(default=0.0, init=False, repr=False)
    _n: float = field(default=0.33, init=False, repr=False)

    name: ClassVar[str] = "aashto"
    phi_reference: ClassVar[str] = "loading"
    title: ClassVar[str] = "AASHTO LRFD 9th Ed. (2020) 5.4.2.3 and Eq. 5.4.2.4-1"

    def __post_init__(self) -> None:
        fc = _positive("f_c", self.f_c, "MPa")
        _humidity(self.relative_humidity)
        _positive("volume_to_surface", self.volume_to_surface, "mm")
        tc = _positive("age_at_end_of_curing", self.age_at_end_of_curing, "days")
        fci = 0.80 * fc if self.f_ci is None else _positive("f_ci", self.f_ci, "MPa")
        if fci > fc:
            raise ValueError(f"f_ci must not exceed f_c ({fc:g} MPa), got {fci:g} MPa")
        t1 = tc if self.age_f_ci is None else _positive("age_f_ci", self.age_f_ci, "days")
        if fci >= fc * (1.0 - 1e-12):
            a = 0.0  # no strength gain after the age of f'ci: f'c from then on
        elif t1 < 28.0:
            a = t1 * (fc / fci - 1.0) / (1.0 - t1 / 28.0)
        else:
            raise ValueError(
                f"age_f_ci must be under 28 days when f_ci ({fci:g} MPa) is below f_c "
                f"({fc:g} MPa): the strength law reaches f_c at 28 days; got {t1:g}"
            )
        object.__setattr__(self, "_a", a)
        object.__setattr__(self, "_b", 1.0 - a / 28.0)
        if self.E_28 is not None:
            E28 = _positive("E_28", self.E_28, "MPa")
        else:
            if self.unit_weight is None:
                raise ValueError("unit_weight must be given (N/mm^3) when E_28 is not")
            w = _positive("unit_weight", self.unit_weight, "N/mm^3") / KCF_N_MM3
            if not 0.090 <= w <= 0.155:
                raise ValueError(
                    f"unit_weight must be within 0.090 to 0.155 kcf (5.4.2.4), got {w:.4f} kcf"
                )
            _positive("K_1", self.K_1, "")
            E28 = 120_000.0 * self.K_1 * w**2.0 * (fc / KSI_MPA) ** 0.33 * KSI_MPA
        object.__setattr__(self, "_E28", E28)
        object.__setattr__(self, "_n", _calibrated_exponent(0.33, fci / fc, self.E_ci, E28))
        # surface the code's own soft limits once (f'ci above 15 ksi)
        aashto_cs.k_f(self.f_ci_ksi)

    @property
    def f_ci_ksi(self) -> float:
        """f'ci used in kf and ktd, ksi."""
        return (0.80 * self.f_c if self.f_ci is None else self.f_ci) / KSI_MPA

    def strength(self, age: ArrayLike) -> FloatArray:
        """Compressive strength at ``age`` (days), MPa: the assumed two-point law above."""
        t = _age(age)
        with np.errstate(invalid="ignore", divide="ignore"):
            r = np.where(t > 0.0, t / (self._a + self._b * t), 0.0)
        return self.f_c * np.minimum(r, 1.0)

    def E(self, age: ArrayLike) -> FloatArray:
        """AASHTO LRFD 9th Ed. (2020) Eq. 5.4.2.4-1 at the strength of age t, MPa."""
        return self._E28 * (self.strength(age) / self.f_c) ** self._n

    def _phi(self, t: FloatArray, t0: FloatArray) -> FloatArray:
        return np.asarray(
            aashto_cs.psi(
                t - t0,
                t0,
                self.volume_to_surface / INCH_MM,
                self.relative_humidity,
                self.f_ci_ksi,
            )
        )

    def _shrinkage(self, t: FloatArray, tc: float) -> FloatArray:
        drying = np.maximum(t - tc, 0.0)
        return -np.asarray(
            aashto_cs.epsilon_sh(
                drying, self.volume_to_surface / INCH_MM, self.relative_humidity, self.f_ci_ksi
            )
        )


# --------------------------------------------------------------------------- ACI 209R-92
#: ACI 209R-92 Table 2.2.1 (from memory): (a days, β) of Eq. 2-1 by curing and cement type.
ACI_STRENGTH_CONSTANTS = {
    ("moist", "I"): (4.0, 0.85),
    ("moist", "III"): (2.3, 0.92),
    ("steam", "I"): (1.0, 0.95),
    ("steam", "III"): (0.70, 0.98),
}


@dataclass(frozen=True)
class Aci209Model(_Base):
    """ACI 209R-92 Chapter 2 creep and shrinkage with the Eq. 2-1 strength and Eq. 2-5 modulus.

    * Strength: (f'c)t = t / (a + β t) · (f'c)28 (Eq. 2-1), a and β of Table 2.2.1 by curing and
      cement type unless given (from memory). With ``f_ci`` given, β stays that of Table 2.2.1
      (fixed by the curing and cement type) and a is fitted so that the strength at
      ``age_f_ci`` is f'ci: a = t_ci (f'c/f'ci − β) (> 0 for any f'ci ≤ f'c since β < 1). The
      fitted law reaches f'c at t = a/(1 − β) and gives t/(a + βt) somewhat above 1 at 28 days
      (the published pairs of Table 2.2.1 give about 1.01), up to 1/β in the long run.
    * Modulus: Ect = gct [w³ (f'c)t]^½ with gct = 33, w in pcf and (f'c)t in psi (Eq. 2-5, from
      memory). With ``E_28`` given, E(t) = E_28 · [(f'c)t / f_ref]^n with the square root of
      Eq. 2-5, n = ½, or n recalibrated so that E(age_f_ci) = ``E_ci`` when that is given
      (:func:`_calibrated_exponent`); f_ref is the Eq. 2-1 strength at 28 days, or, with
      ``f_ci`` given, f'c itself: ``E_28`` is then the modulus at the strength f'c, as a job's
      Ec is (the fitted law reaches f'c before 28 days for an early transfer, and after it for
      a transfer at 28 days or later, where a 28-day reference would make no sense).
    * Creep: νt of Eq. 2-8 with the factors of 2.5 (loading age, humidity, v/s; the other
      factors at their standard values); νt is the ratio of creep strain to the initial strain
      (2.4, from memory), so J = (1 + νt) / E(t0) (``phi_reference`` ``"loading"``).
    * Shrinkage: −(εsh)t of Eq. 2-9 (moist) or 2-10 (steam) with t counted from the end of initial
      curing ``age_at_end_of_curing`` (also the curing duration of Table 2.5.3); zero before.

    Attributes:
        f_c: 28-day compressive strength, MPa.
        relative_humidity: λ, percent.
        volume_to_surface: v/s, mm.
        unit_weight: w for Eq. 2-5, N/mm³ (not needed with ``E_28``).
        curing: "moist" or "steam".
        age_at_end_of_curing: days (> 0).
        cement_type: "I" or "III" (Table 2.2.1).
        a: a of Eq. 2-1, days; ``None`` from Table 2.2.1, or fitted to ``f_ci`` when that is
            given (giving both is an error).
        beta: β of Eq. 2-1; ``None`` from Table 2.2.1.
        E_28: modulus at 28 days, MPa, if given (overrides Eq. 2-5); with ``f_ci`` given, the
            modulus at the strength f'c (see above).
        f_ci: strength at ``age_f_ci`` (transfer), MPa, if given (fits a, see above).
        age_f_ci: age of ``f_ci`` and ``E_ci``, days; ``None`` = the age at the end of curing.
        E_ci: modulus at ``age_f_ci``, MPa, if given (calibrates the exponent, see above).
    """

    f_c: float
    relative_humidity: float
    volume_to_surface: float
    unit_weight: float | None = None
    curing: str = "moist"
    age_at_end_of_curing: float = 7.0
    cement_type: str = "I"
    a: float | None = None
    beta: float | None = None
    E_28: float | None = None
    f_ci: float | None = None
    age_f_ci: float | None = None
    E_ci: float | None = None
    min_loading_age: float = field(default=7.0, init=False)
    _a: float = field(default=4.0, init=False, repr=False)
    _beta: float = field(default=0.85, init=False, repr=False)
    _E_ref: float = field(default=0.0, init=False, repr=False)
    _ratio_ref: float = field(default=1.0, init=False, repr=False)
    _n: float = field(default=0.5, init=False, repr=False)

    name: ClassVar[str] = "aci209"
    phi_reference: ClassVar[str] = "loading"
    title: ClassVar[str] = "ACI 209R-92 Chapter 2 (Eq. 2-1, 2-5, 2-8 to 2-10)"

    def __post_init__(self) -> None:
        fc = _positive("f_c", self.f_c, "MPa")
        _humidity(self.relative_humidity)
        _positive("volume_to_surface", self.volume_to_surface, "mm")
        _positive("age_at_end_of_curing", self.age_at_end_of_curing, "days")
        curing = str(self.curing).strip().lower()
        if curing not in aci.CURING_METHODS:
            raise ValueError(f"curing must be 'moist' or 'steam', got {self.curing!r}")
        object.__setattr__(self, "curing", curing)
        cement = str(self.cement_type).strip().upper()
        if (curing, cement) not in ACI_STRENGTH_CONSTANTS:
            raise ValueError(f"cement_type must be 'I' or 'III', got {self.cement_type!r}")
        a0, b0 = ACI_STRENGTH_CONSTANTS[(curing, cement)]
        b = b0 if self.beta is None else _positive("beta", self.beta, "")
        t_ci = (
            self.age_at_end_of_curing
            if self.age_f_ci is None
            else _positive("age_f_ci", self.age_f_ci, "days")
        )
        if self.f_ci is not None:
            if self.a is not None:
                raise ValueError("a and f_ci must not both be given (a is fitted to f_ci)")
            fci = _positive("f_ci", self.f_ci, "MPa")
            if fci > fc:
                raise ValueError(f"f_ci must not exceed f_c ({fc:g} MPa), got {fci:g} MPa")
            a = t_ci * (fc / fci - b)
            if a <= 0.0:
                raise ValueError(f"beta must be below f_c / f_ci ({fc / fci:.4g}), got {b:g}")
        else:
            a = a0 if self.a is None else _positive("a", self.a, "days")
        object.__setattr__(self, "_a", a)
        object.__setattr__(self, "_beta", b)
        object.__setattr__(self, "min_loading_age", 7.0 if curing == "moist" else 1.0)
        if self.E_28 is not None:
            E_ref = _positive("E_28", self.E_28, "MPa")
            ratio_ref = 1.0 if self.f_ci is not None else float(self._ratio(28.0))
        else:
            if self.unit_weight is None:
                raise ValueError("unit_weight must be given (N/mm^3) when E_28 is not")
            w = _positive("unit_weight", self.unit_weight, "N/mm^3") / PCF_N_MM3
            E_ref = 33.0 * np.sqrt(w**3 * fc / PSI_MPA) * PSI_MPA
            ratio_ref = 1.0
        object.__setattr__(self, "_E_ref", float(E_ref))
        object.__setattr__(self, "_ratio_ref", ratio_ref)
        r_ci = float(self._ratio(t_ci)) / ratio_ref
        object.__setattr__(self, "_n", _calibrated_exponent(0.5, r_ci, self.E_ci, float(E_ref)))
        # surface the code's own soft limits once (humidity, curing duration)
        aci.gamma_lambda_creep(self.relative_humidity)
        aci.gamma_cp(self.age_at_end_of_curing, curing)

    @property
    def min_loading_age_source(self) -> str:
        """ACI 209R-92 2.5.1: loading from 7 days (moist curing) or 1 day (steam curing)."""
        return f"ACI 209R-92 2.5.1 for {self.curing}-cured concrete"

    def _ratio(self, t: ArrayLike) -> FloatArray:
        tt = np.asarray(t, dtype=float)
        return tt / (self._a + self._beta * tt)

    def strength(self, age: ArrayLike) -> FloatArray:
        """ACI 209R-92 Eq. 2-1: compressive strength at ``age`` (days), MPa."""
        return self.f_c * self._ratio(_age(age))

    def E(self, age: ArrayLike) -> FloatArray:
        """ACI 209R-92 Eq. 2-5 (from memory) at the Eq. 2-1 strength of age t, MPa."""
        return self._E_ref * (self._ratio(_age(age)) / self._ratio_ref) ** self._n

    def _phi(self, t: FloatArray, t0: FloatArray) -> FloatArray:
        return np.asarray(
            aci.creep_coefficient(
                t,
                t0,
                self.relative_humidity,
                v_s=self.volume_to_surface / INCH_MM,
                curing=self.curing,
            )
        )

    def _shrinkage(self, t: FloatArray, tc: float) -> FloatArray:
        return -np.asarray(
            aci.shrinkage_strain(
                np.maximum(t, tc),
                tc,
                self.relative_humidity,
                v_s=self.volume_to_surface / INCH_MM,
                curing=self.curing,
            )
        )


# --------------------------------------------------------------------------- fib MC2010
#: fib MC2010 (2013) Table 5.1-9: coefficient s of Eq. 5.1-51 by cement class, fcm ≤ 60 MPa;
#: s = 0.20 for every class above 60 MPa.
MC2010_S = {
    "32.5 N": 0.38,
    "32.5 R": 0.25,
    "42.5 N": 0.25,
    "42.5 R": 0.20,
    "52.5 N": 0.20,
    "52.5 R": 0.20,
}


def _maturity(age: FloatArray, tc: float, tTc: float | None) -> FloatArray:
    """Temperature-adjusted age: tT,c/tc · t during curing, tT,c + (t − tc) after (20 °C)."""
    if tTc is None:
        return age
    return np.where(age <= tc, age * (tTc / tc), tTc + (age - tc))


def _beta_cc(tT: FloatArray, s: float) -> FloatArray:
    """βcc(t) = exp{s [1 − (28/t)^½]} (MC2010 Eq. 5.1-51, EN 1992-1-1 Eq. 3.2); 0 at t = 0."""
    with np.errstate(divide="ignore"):
        return np.where(tT > 0.0, np.exp(s * (1.0 - np.sqrt(28.0 / np.maximum(tT, 1e-300)))), 0.0)


def _fib_maturity(m: Any, exponent: float) -> None:
    """Set the equivalent age at the end of curing and the modulus exponent of a fib model."""
    tTc = m.equivalent_age_at_end_of_curing
    if m.f_ci is not None:
        tTc = _equivalent_age(float(m.f_ci), float(m.f_ck), m._fcm, m._s)
    object.__setattr__(m, "_tTc", tTc)
    t_end = m.age_at_end_of_curing if tTc is None else tTc
    ratio = float(_beta_cc(np.asarray(float(t_end)), m._s))
    object.__setattr__(m, "_n", _calibrated_exponent(exponent, ratio, m.E_ci, m._E28))


class _FibStrengthGain:
    """Strength and modulus development shared by the fib MC2010 and EN 1992-1-1 models.

    fcm(t) = βcc(tT) fcm with βcc = exp{s [1 − (28/tT)^½]} (MC2010 Eq. 5.1-50/5.1-51, EN
    1992-1-1 Eq. 3.1/3.2) at the temperature-adjusted age tT; E(t) = E28 βcc(tT)^n (MC2010 Eq.
    5.1-56/5.1-57, EN Eq. 3.5 with the tangent factor 1.05 of 3.1.4(2)), n calibrated to the
    job's moduli (:func:`_fib_maturity`).
    """

    age_at_end_of_curing: float
    _tTc: float | None
    _fcm: float
    _s: float
    _E28: float
    _n: float

    @property
    def maturity_at_end_of_curing(self) -> float:
        """Temperature-adjusted age at the end of curing (given, fitted to f_ci, or real), d."""
        return self.age_at_end_of_curing if self._tTc is None else self._tTc

    def _tT(self, age: FloatArray) -> FloatArray:
        return _maturity(age, self.age_at_end_of_curing, self._tTc)

    def strength(self, age: ArrayLike) -> FloatArray:
        """Mean strength fcm(t) at age t, MPa."""
        return self._fcm * _beta_cc(self._tT(_age(age)), self._s)

    def E(self, age: ArrayLike) -> FloatArray:
        """Tangent modulus at age t, MPa."""
        return self._E28 * _beta_cc(self._tT(_age(age)), self._s) ** self._n


@dataclass(frozen=True)
class Mc2010Model(_FibStrengthGain, _Base):
    """fib Model Code 2010 (2013) 5.1.9.4 creep and shrinkage with the Eq. 5.1-21/5.1-56 modulus.

    * Modulus: Eci = Ec0 αE (fcm/10)^(1/3), Ec0 = 21,500 MPa (Eq. 5.1-21); Eci(t) = βE(t) Eci with
      βE = βcc^0.5 (Eq. 5.1-56, 5.1-57) and βcc = exp{s [1 − (28/t)^0.5]} (Eq. 5.1-51), s by
      cement class (Table 5.1-9; 0.20 for fcm > 60 MPa), t the temperature-adjusted age.
    * Creep: φ(t, t0) of Eq. 5.1-63, referred to the 28-day tangent modulus: J = 1/Eci(t0) +
      φ/Eci (Eq. 5.1-61; ``phi_reference`` ``"28-day"``). The age at loading is adjusted for
      cement type from its temperature-adjusted value (Eq. 5.1-73, 5.1-85).
    * Shrinkage: εcs = εcbs(t) + εcds(t, ts) (Eq. 5.1-75 to 5.1-82), basic shrinkage from casting,
      drying from ``age_at_end_of_curing``; already negative for shortening.
    * ``equivalent_age_at_end_of_curing``: the temperature-adjusted age tT (Eq. 5.1-85) reached at
      the end of curing (e.g. after steam curing); the concrete is taken at 20 °C afterwards.
      ``None`` = cured at 20 °C (tT = t). It enters βcc (strength and modulus) and the adjusted
      age at loading of creep (Eq. 5.1-73); shrinkage keeps the real ages.
    * ``f_ci``: the characteristic strength at the end of curing (transfer of a precast girder);
      when given, the equivalent age is fitted so that fcm(tT) = βcc(tT) fcm = f_ci + 8 MPa
      (:func:`_equivalent_age`, 5.1.9.1 Eq. 5.1-51 with the temperature-adjusted age of 5.1.10).
    * ``E_ci``: the tangent modulus at the end of curing, if given: the exponent ½ of Eq. 5.1-57
      is recalibrated so that E passes through it (:func:`_calibrated_exponent`).

    Attributes:
        f_ck: characteristic strength, MPa.
        relative_humidity: RH, percent.
        notional_size: h = 2 Ac/u, mm.
        cement_class: one of ``mc2010.CEMENT_CLASSES``.
        age_at_end_of_curing: ts, days.
        f_cm: mean strength, MPa; ``None`` = fck + 8 (Eq. 5.1-1).
        alpha_E: aggregate factor αE of Table 5.1-6 (1.0 quartzite).
        equivalent_age_at_end_of_curing: tT at the end of curing, days, or ``None``.
        E_28: 28-day tangent modulus, MPa, if given (overrides Eq. 5.1-21).
        f_ci: characteristic strength at the end of curing, MPa, or ``None``.
        E_ci: tangent modulus at the end of curing, MPa, or ``None``.
    """

    f_ck: float
    relative_humidity: float
    notional_size: float
    cement_class: str = "42.5 N"
    age_at_end_of_curing: float = 7.0
    f_cm: float | None = None
    alpha_E: float = 1.0
    equivalent_age_at_end_of_curing: float | None = None
    E_28: float | None = None
    f_ci: float | None = None
    E_ci: float | None = None
    min_loading_age: float = field(default=mc.T0_LOWER_DAYS, init=False)
    _fcm: float = field(default=0.0, init=False, repr=False)
    _s: float = field(default=0.25, init=False, repr=False)
    _E28: float = field(default=0.0, init=False, repr=False)
    _tTc: float | None = field(default=None, init=False, repr=False)
    _n: float = field(default=0.5, init=False, repr=False)

    name: ClassVar[str] = "mc2010"
    phi_reference: ClassVar[str] = "28-day"
    title: ClassVar[str] = "fib Model Code 2010 (2013) 5.1.9.4, Eq. 5.1-21, 5.1-51, 5.1-56"

    def __post_init__(self) -> None:
        fcm = _fib_checks(self)
        mc.alpha_cement(self.cement_class)  # validates the class (ValueError naming it)
        key = next(
            c
            for c in mc.CEMENT_CLASSES
            if c.replace(" ", "") == str(self.cement_class).upper().replace(" ", "")
        )
        object.__setattr__(self, "_fcm", fcm)
        object.__setattr__(self, "_s", 0.20 if fcm > 60.0 else MC2010_S[key])
        E28 = (
            _positive("E_28", self.E_28, "MPa")
            if self.E_28 is not None
            else 21_500.0 * _positive("alpha_E", self.alpha_E, "") * (fcm / 10.0) ** (1.0 / 3.0)
        )
        object.__setattr__(self, "_E28", E28)
        _fib_maturity(self, 0.5)
        # surface the code's own soft limits once (fcm, RH)
        mc.beta_RH_creep(self.relative_humidity, self.notional_size)
        mc.beta_bc_fcm(fcm)

    @property
    def min_loading_age_source(self) -> str:
        """fib MC2010 (2013) 5.1.9.4.2: the creep model's range starts at an age of 1 day."""
        return "fib MC2010 (2013) 5.1.9.4.2"

    def _phi(self, t: FloatArray, t0: FloatArray) -> FloatArray:
        return np.asarray(
            mc.phi(
                t,
                t0,
                self._fcm,
                self.relative_humidity,
                self.notional_size,
                self.cement_class,
                t0_T=self._tT(t0),
            )
        )

    def _shrinkage(self, t: FloatArray, tc: float) -> FloatArray:
        basic = np.asarray(mc.epsilon_cbs(t, self._fcm, self.cement_class))
        drying = np.asarray(
            mc.epsilon_cds(
                np.maximum(t, tc),
                tc,
                self._fcm,
                self.relative_humidity,
                self.notional_size,
                self.cement_class,
            )
        )
        return basic + drying


# --------------------------------------------------------------------------- EN 1992-1-1
#: EN 1992-1-1:2004 3.1.2(6): coefficient s of Eq. 3.2 by cement class.
EN_S = {"S": 0.38, "N": 0.25, "R": 0.20}


@dataclass(frozen=True)
class En1992Model(_FibStrengthGain, _Base):
    """EN 1992-1-1:2004 Annex B creep, 3.1.4(6) shrinkage, 3.1.3(3) modulus development.

    * Modulus: Ecm = 22 (fcm/10)^0.3 GPa (Table 3.1); Ecm(t) = [fcm(t)/fcm]^0.3 Ecm (Eq. 3.5) with
      fcm(t) = βcc(t) fcm (Eq. 3.1), βcc = exp{s [1 − (28/t)^½]} (Eq. 3.2), s by cement class
      (3.1.2(6)), t the temperature-adjusted age. ``E(age)`` returns the tangent modulus
      Ec(t) = 1.05 Ecm(t) (3.1.4(2) refers φ to Ec = 1.05 Ecm).
    * Creep: φ(t, t0) of Eq. B.1 (age at loading adjusted by Eq. B.9 from its temperature-adjusted
      value), referred to the 28-day tangent modulus (3.1.4(3)): J = 1/Ec(t0) + φ/Ec(28)
      (``phi_reference`` ``"28-day"``; taking the tangent modulus at t0 for the elastic part is
      this module's choice, the same form as MC2010 Eq. 5.1-61).
    * Shrinkage: −εcs = −(εcd + εca) (Eq. 3.8 to 3.13), autogenous from casting, drying from
      ``age_at_end_of_curing``.
    * ``equivalent_age_at_end_of_curing``: as for :class:`Mc2010Model` (Eq. B.10).
    * ``f_ci``: the characteristic strength at the end of curing (transfer); when given, the
      equivalent age is fitted so that fcm(tT) = βcc(tT) fcm = f_ci + 8 MPa (3.1.2(6), Eq. 3.1
      and 3.2; fck(t) = fcm(t) − 8 MPa, 3.1.2(5)) with the temperature-adjusted age of B.1(2)
      Eq. B.10 (:func:`_equivalent_age`).
    * ``E_ci``: the tangent modulus at the end of curing, if given: the exponent 0.3 of Eq. 3.5
      is recalibrated so that E passes through it (:func:`_calibrated_exponent`).

    Attributes:
        f_ck: characteristic strength, MPa.
        relative_humidity: RH, percent.
        notional_size: h0 = 2 Ac/u, mm.
        cement_class: "S", "N" or "R".
        age_at_end_of_curing: ts, days.
        f_cm: mean strength, MPa; ``None`` = fck + 8 (Table 3.1).
        equivalent_age_at_end_of_curing: tT at the end of curing, days, or ``None``.
        E_28: 28-day tangent modulus Ec, MPa, if given (overrides 1.05 Ecm of Table 3.1).
        f_ci: characteristic strength at the end of curing, MPa, or ``None``.
        E_ci: tangent modulus at the end of curing, MPa, or ``None``.
    """

    f_ck: float
    relative_humidity: float
    notional_size: float
    cement_class: str = "N"
    age_at_end_of_curing: float = 7.0
    f_cm: float | None = None
    equivalent_age_at_end_of_curing: float | None = None
    E_28: float | None = None
    f_ci: float | None = None
    E_ci: float | None = None
    min_loading_age: float = field(default=0.0, init=False)
    _fcm: float = field(default=0.0, init=False, repr=False)
    _s: float = field(default=0.25, init=False, repr=False)
    _E28: float = field(default=0.0, init=False, repr=False)
    _tTc: float | None = field(default=None, init=False, repr=False)
    _n: float = field(default=0.3, init=False, repr=False)

    name: ClassVar[str] = "en1992"
    phi_reference: ClassVar[str] = "28-day"
    title: ClassVar[str] = "EN 1992-1-1:2004 Annex B, 3.1.3(3), 3.1.4"

    def __post_init__(self) -> None:
        fcm = _fib_checks(self)
        cls = str(self.cement_class).strip().upper()
        en.alpha_cement(cls)  # validates the class
        object.__setattr__(self, "cement_class", cls)
        object.__setattr__(self, "_fcm", fcm)
        object.__setattr__(self, "_s", EN_S[cls])
        E28 = (
            _positive("E_28", self.E_28, "MPa")
            if self.E_28 is not None
            else 1.05 * 22_000.0 * (fcm / 10.0) ** 0.3
        )
        object.__setattr__(self, "_E28", E28)
        _fib_maturity(self, 0.3)
        # surface the code's own soft limits once (RH, fck)
        en.beta_RH(self.relative_humidity)
        en.epsilon_ca_inf(self.f_ck)

    def _phi(self, t: FloatArray, t0: FloatArray) -> FloatArray:
        return np.asarray(
            en.phi(
                t,
                t0,
                self.relative_humidity,
                self.notional_size,
                self._fcm,
                self.cement_class,
                t0_T=self._tT(t0),
            )
        )

    def _shrinkage(self, t: FloatArray, tc: float) -> FloatArray:
        drying = np.asarray(
            en.epsilon_cd(
                np.maximum(t, tc),
                tc,
                self.relative_humidity,
                self.notional_size,
                self._fcm,
                self.cement_class,
            )
        )
        autogenous = np.asarray(en.epsilon_ca(t, self.f_ck))
        return -(drying + autogenous)


# --------------------------------------------------------------------------- for checks
@dataclass(frozen=True)
class ElasticConcrete(_Base):
    """Concrete with a constant modulus, no creep and no shrinkage (for checks of the engine).

    Attributes:
        E_c: modulus, MPa.
        age_at_end_of_curing: kept for the interface, days.
    """

    E_c: float
    age_at_end_of_curing: float = 1.0
    min_loading_age: float = field(default=0.0, init=False)

    name: ClassVar[str] = "elastic"
    phi_reference: ClassVar[str] = "loading"
    title: ClassVar[str] = "elastic concrete, no creep, no shrinkage (for checks)"

    def __post_init__(self) -> None:
        _positive("E_c", self.E_c, "MPa")

    def E(self, age: ArrayLike) -> FloatArray:
        """The constant modulus, MPa."""
        return np.full(np.shape(_age(age)), float(self.E_c))

    def _phi(self, t: FloatArray, t0: FloatArray) -> FloatArray:
        return np.zeros(np.shape(t))

    def _shrinkage(self, t: FloatArray, tc: float) -> FloatArray:
        return np.zeros(np.shape(t))


#: The published models by the name a job or a caller uses.
MODELS: dict[str, type] = {
    "aashto": AashtoModel,
    "aci209": Aci209Model,
    "mc2010": Mc2010Model,
    "en1992": En1992Model,
}


def make_model(name: str, **kwargs: Any) -> CreepShrinkageModel:
    """Build the creep and shrinkage model ``name`` with its constructor arguments.

    Args:
        name: one of ``MODELS`` ("aashto", "aci209", "mc2010", "en1992").
        **kwargs: the adapter's attributes (see each class), internal units.

    Returns:
        The model.

    Raises:
        ValueError: unknown name (the message lists the choices), or a bad argument.
    """
    key = str(name).strip().lower()
    if key not in MODELS:
        raise ValueError(f"model must be one of {', '.join(MODELS)}; got {name!r}")
    return MODELS[key](**kwargs)
