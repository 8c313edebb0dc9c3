"""The job model: plain frozen dataclasses, validated, every quantity in internal units.

Internal base system: mm, N, MPa, N*mm, N/mm, N/mm^3, day (see :mod:`prestress.units`).
Positions along the girder are measured from its left end (mm); heights from its bottom (mm).
"""

from __future__ import annotations

from dataclasses import dataclass, field

import numpy as np

from prestress.layout import Layout


@dataclass(frozen=True)
class Concrete:
    """A concrete: strengths, unit weight and elastic moduli (MPa, N/mm^3).

    Attributes:
        name: label, e.g. "girder" or "deck".
        fc: specified 28-day (design) compressive strength f'c, MPa.
        fci: strength at transfer f'ci, MPa (None for a cast-in-place deck).
        unit_weight: unit weight for dead load, N/mm^3.
        Ec: modulus at the design strength, MPa.
        Eci: modulus at transfer, MPa (None for a deck).
        modulus_source: how the moduli were obtained (formula and clause, or "given").
        modulus_note: a remark on the moduli for the reviewer ("" when none).
    """

    name: str
    fc: float
    fci: float | None
    unit_weight: float
    Ec: float
    Eci: float | None
    modulus_source: str
    modulus_note: str = ""


@dataclass(frozen=True)
class Strand:
    """A prestressing strand type (mm, mm^2, MPa)."""

    diameter: float
    area: float
    fpu: float
    fpy: float
    Ep: float
    relaxation: str  # "low" or "stress-relieved"
    jacking_stress: float
    stress_before_transfer: float  # fpbt: jacking stress less any loss before transfer


@dataclass(frozen=True)
class StrandRow:
    """A horizontal row of strands as the job gives it (mm from the girder bottom).

    Attributes:
        height: height of the row between the hold-downs (everywhere when straight).
        count: number of strands.
        spacing: spacing when the row was given by count and spacing (0 otherwise).
        x: horizontal positions of the strands (mm, centred on the girder axis).
        harp: (end height of the highest strand, (left, right) hold-down positions, vertical
            spacing of the strands at the ends) when the row is harped; at the ends its strands
            stand in one column on the girder axis.
        debond: debonded groups: (strand indices in the row, left length, right length).
        index: the row's index in the job.
    """

    height: float
    count: int
    spacing: float
    x: tuple[float, ...] = ()
    harp: tuple[float, tuple[float, float], float] | None = None
    debond: tuple[tuple[tuple[int, ...], float, float], ...] = ()
    index: int = 0

    def x_positions(self) -> np.ndarray:
        """Horizontal positions of the strands, centred on the girder axis (mm)."""
        if self.x:
            return np.asarray(self.x, dtype=float)
        return (np.arange(self.count) - (self.count - 1) / 2.0) * self.spacing


@dataclass(frozen=True)
class Tendon:
    """A post-tensioned tendon (mm, mm^2, MPa, rad).

    Attributes:
        name: label, e.g. "T1".
        strands: number of strands in the tendon (of the job's strand type).
        area: total strand area, mm^2.
        x: control points along the girder from its left end, mm (anchor, low/high points, anchor).
        y: heights of the control points above the girder bottom, mm.
        inflection: inflection fraction(s) of reverse curves (continuous layouts), or None.
        duct_diameter: outside duct diameter, mm.
        jacking: "left", "right" or "both".
        mu: curvature friction coefficient, per radian.
        K: wobble coefficient, per mm of tendon.
        anchor_set: anchor set (wedge seat), mm.
        jacking_stress: fpj, MPa.
        jack_length: free strand length from the anchorage to the jack's grip, mm (counted in
            the jack elongation at fpj).
    """

    name: str
    strands: int
    area: float
    x: tuple[float, ...]
    y: tuple[float, ...]
    inflection: float | None
    duct_diameter: float
    jacking: str
    mu: float
    K: float
    anchor_set: float
    jacking_stress: float
    jack_length: float = 0.0

    def profile(self, depth: float | None = None):
        """The tendon's parabolic profile (prestress.tendons.TendonProfile)."""
        from prestress.tendons import TendonProfile

        return TendonProfile(self.x, self.y, self.inflection, depth)


@dataclass(frozen=True)
class Deck:
    """Cast-in-place deck slab on the girder (mm).

    Attributes:
        thickness: structural thickness (excluding any sacrificial wearing surface).
        wearing_surface: integral sacrificial thickness; its weight counts, not its stiffness.
        effective_width: effective flange width of the deck for the composite section.
        tributary_width: width of deck carried by this girder for dead load (girder spacing).
        haunch: haunch (build-up) thickness between girder top and deck soffit.
        haunch_width: haunch width (usually the girder's top flange width).
        haunch_in_stiffness: whether the haunch counts in the composite section.
        concrete: the deck concrete.
        effective_width_source: where the effective width comes from.
    """

    thickness: float
    wearing_surface: float
    effective_width: float
    tributary_width: float
    haunch: float
    haunch_width: float
    haunch_in_stiffness: bool
    concrete: Concrete
    effective_width_source: str = "given in the job"


@dataclass(frozen=True)
class LiveLoad:
    """Live load per girder.

    Either moments given by the user (a midspan value, distributed along the span as a
    parabola — the shape of the envelope of a uniform load, flagged as such — or values at the
    tenth points), already including dynamic allowance and distribution; or the HL-93 load of
    AASHTO LRFD 3.6.1 moved over the span, times a distribution factor.

    Attributes:
        model: "given" or "HL-93".
        moment_midspan: given midspan moment, N*mm.
        moments_tenth_points: given moments at the 11 tenth points, N*mm.
        distribution_factor: live-load distribution factor for moment (HL-93), lanes per girder.
        distribution_source: where the factor comes from.
        impact: dynamic load allowance IM on truck and tandem (HL-93).
        shear_distribution_factor: live-load distribution factor for shear (HL-93), lanes per
            girder; None where it is neither given nor computed yet.
        shear_distribution_source: where the shear factor comes from.
    """

    moment_midspan: float | None
    moments_tenth_points: tuple[float, ...] | None
    model: str = "given"
    distribution_factor: float | None = 1.0
    distribution_source: str = "given"
    impact: float = 0.33
    girders: int | None = None  # number of girders, for the AASHTO distribution factor
    skew_deg: float = 0.0
    curb_distance: float | None = None  # d_e, exterior web to the curb's inner face, mm
    shear_distribution_factor: float | None = None
    shear_distribution_source: str = ""
    shear_by_aashto: bool = False  # compute the shear factor by AASHTO 4.6.2.2.3

    def moment_at(self, x_from_bearing: np.ndarray, span: float) -> np.ndarray:
        """Live-load moment per girder at positions measured from the left bearing (N*mm)."""
        x = np.asarray(x_from_bearing, dtype=float)
        inside = (x >= 0.0) & (x <= span)
        xc = np.clip(x, 0.0, span)
        if self.model == "HL-93":
            from prestress.loads.hl93 import hl93_envelope

            assert self.distribution_factor is not None
            env = hl93_envelope(span, xc, impact=self.impact)
            return np.where(inside, self.distribution_factor * np.asarray(env.M_LL_IM), 0.0)
        if self.moments_tenth_points is not None:
            xs = np.linspace(0.0, span, 11)
            return np.where(inside, np.interp(xc, xs, np.asarray(self.moments_tenth_points)), 0.0)
        assert self.moment_midspan is not None
        return np.where(inside, 4.0 * self.moment_midspan * xc * (span - xc) / span**2, 0.0)

    def shear_at(
        self, x_from_bearing: np.ndarray, span: float
    ) -> tuple[np.ndarray, np.ndarray] | None:
        """Live-load shear envelope per girder at positions from the left bearing (N).

        Returns (greatest, least) shear, or None for given moments or without a shear
        distribution factor. Shear is positive when the part of the girder left of the
        section is pushed up (``prestress.loads.hl93``).
        """
        if self.model != "HL-93" or self.shear_distribution_factor is None:
            return None
        from prestress.loads.hl93 import hl93_envelope

        x = np.asarray(x_from_bearing, dtype=float)
        inside = (x >= 0.0) & (x <= span)
        env = hl93_envelope(span, np.clip(x, 0.0, span), impact=self.impact)
        g = self.shear_distribution_factor
        return (
            np.where(inside, g * np.asarray(env.V_LL_IM_max), 0.0),
            np.where(inside, g * np.asarray(env.V_LL_IM_min), 0.0),
        )


@dataclass(frozen=True)
class Loads:
    """Loads per girder other than self-weight (N/mm, N, N*mm).

    Attributes:
        superimposed_dead: DC on the composite section (barriers, railings), N/mm.
        wearing_surface: DW on the composite section (future wearing surface, utilities), N/mm.
        other_noncomposite: further uniform dead load on the girder alone (e.g. stay-in-place
            forms), N/mm.
        live: the live load.
        diaphragms: point loads on the girder alone: (position from the left bearing mm, N).
        deck_shrinkage: factor on the restraint force of the deck's shrinkage applied to the
            composite section in the final service stages (0: not applied).
    """

    superimposed_dead: float
    wearing_surface: float
    other_noncomposite: float
    live: LiveLoad
    diaphragms: tuple[tuple[float, float], ...] = ()
    deck_shrinkage: float = 0.0


@dataclass(frozen=True)
class Handling:
    """Lifting the girder out of the bed: lifting points from each end (mm), dynamic factors.

    Each factor on the self-weight is a handling case of its own (e.g. 0.8 and 1.2 for a
    sudden lift or drop; common practice), checked with the limits of the stage "handling".
    """

    lift_point: float
    dynamic_factors: tuple[float, ...] = (1.0,)


@dataclass(frozen=True)
class Times:
    """Environment and ages (percent, days after casting the girder)."""

    relative_humidity: float
    transfer: float
    deck_placement: float
    final: float


@dataclass(frozen=True)
class TensionLimit:
    """Tension limit: coefficient × √(strength in ``root_unit``), in ``root_unit``, capped.

    Stored with the coefficient and unit as written, so reports can echo the formula. With
    ``rule = "en1992-fctm"`` the limit is the coefficient times fctm of EN 1992-1-1:2004
    Table 3.1 (both branches, below and above C50/60) for the strength taken as fck.
    """

    coefficient: float
    root_unit: str  # "ksi", "psi" or "MPa"
    cap: float | None  # MPa, or None
    exponent: float = 0.5  # 0.5: square root (AASHTO, ACI)
    rule: str = "power"  # "power" or "en1992-fctm"

    def value(self, strength_mpa: float) -> float:
        """The limit (MPa, positive) for a concrete strength (MPa)."""
        from prestress.units import KSI_MPA

        if self.rule == "en1992-fctm":
            from prestress.codes.en1992_1_1_materials import f_ctm

            limit = self.coefficient * f_ctm(strength_mpa)
            return min(limit, self.cap) if self.cap is not None else limit
        unit_mpa = {"ksi": KSI_MPA, "psi": KSI_MPA / 1000.0, "MPa": 1.0}[self.root_unit]
        limit = self.coefficient * (strength_mpa / unit_mpa) ** self.exponent * unit_mpa
        return min(limit, self.cap) if self.cap is not None else limit

    def text(self, sym: str = "f") -> str:
        """The limit's formula in words, e.g. "0.24√f'ci (ksi)"."""
        cap = "" if self.cap is None else " ≤ cap"
        if self.coefficient == 0.0:
            return "no tension"
        if self.rule == "en1992-fctm":
            core = "fctm" if self.coefficient == 1.0 else f"{self.coefficient:g} fctm"
            return f"{core}({sym}) (EN 1992-1-1 Table 3.1){cap}"
        if abs(self.exponent - 0.5) < 1e-12:
            core = f"{self.coefficient:g}√{sym}"
        else:
            core = f"{self.coefficient:g} {sym}^{self.exponent:.4g}"
        return f"{core} ({self.root_unit}){cap}"


@dataclass(frozen=True)
class FiberLimit:
    """Limits at one fiber for one stage: compression as a fraction of the strength, tension."""

    compression_fraction: float | None
    tension: TensionLimit | None


#: The fibers checked: girder bottom, girder top and (on the composite section) deck top.
FIBERS = ("girder_bottom", "girder_top", "deck_top")

#: The stages (and service cases) a limit set may give limits for, in time order.
STAGES = (
    "transfer",
    "handling",
    "deck_placement",
    "service_permanent",
    "service_i",
    "service_iii",
)


@dataclass(frozen=True)
class PrestressFactors:
    """Factors on the mean prestress force for the stress checks of a stage.

    The fiber stresses are computed with the prestress force (and its moment) times ``inf``
    and times ``sup``, the loads unfactored, and each fiber takes the case that governs:
    the characteristic values P_k,inf = r_inf P_m,t and P_k,sup = r_sup P_m,t of
    EN 1992-1-1:2004 5.10.9(1)P (from memory). Both 1: the mean force alone (AASHTO).

    Attributes:
        inf: the lower factor r_inf (0 < inf ≤ 1).
        sup: the upper factor r_sup (1 ≤ sup ≤ 1.5).
        source: where the factors come from (the limit set's note), "" when none is given.
    """

    inf: float = 1.0
    sup: float = 1.0
    source: str = ""

    @property
    def unity(self) -> bool:
        """Whether both factors are 1 (the mean prestress alone)."""
        return self.inf == 1.0 and self.sup == 1.0

    @property
    def cases(self) -> tuple[float, ...]:
        """The factors to check, lower first: (1.0,) when both are 1, (inf,) when equal."""
        if self.unity:
            return (1.0,)
        return (self.inf,) if self.inf == self.sup else (self.inf, self.sup)


#: The mean prestress alone (a limit set without ``prestress_factors``).
MEAN_PRESTRESS = PrestressFactors()


@dataclass(frozen=True)
class LimitSet:
    """Stress limits as data: for each stage name, for each fiber, a FiberLimit.

    Attributes:
        name: the set's name.
        source: the documents it mirrors.
        stages: for each stage key, for each fiber, its limits.
        prestress_factors: factors on the mean prestress by (stage key, post-tensioned?),
            already resolved for every stage of :data:`STAGES` and both kinds of girder;
            empty when the set gives none (the mean prestress alone).
    """

    name: str
    source: str
    stages: dict[str, dict[str, FiberLimit]]
    prestress_factors: dict[tuple[str, bool], PrestressFactors] = field(default_factory=dict)

    def get(self, stage: str, fiber: str) -> FiberLimit | None:
        """The limits of a fiber in a stage, or None when none is given."""
        return self.stages.get(stage, {}).get(fiber)

    def factors(self, stage: str, post_tensioned: bool = False) -> PrestressFactors:
        """The factors on the mean prestress in a stage (its limits' key, e.g. "handling")."""
        return self.prestress_factors.get((stage, post_tensioned), MEAN_PRESTRESS)


@dataclass(frozen=True)
class Combination:
    """Load factors of a service combination, and where they come from."""

    dead: float
    live: float
    source: str = ""


@dataclass(frozen=True)
class SectionRef:
    """Which section the girder uses: a library name, or an inline definition."""

    name: str
    family: str | None = None
    dimensions: dict | None = None  # raw inline dimensions (parsed by the family)


@dataclass(frozen=True)
class Job:
    """A complete, validated job (internal units)."""

    file: str
    title: str
    project: str
    owner: str
    engineer: str
    units: str  # "US" or "SI": output system
    section: SectionRef
    length: float
    span: float
    girder_concrete: Concrete
    deck: Deck | None
    strand: Strand
    rows: tuple[StrandRow, ...]
    loads: Loads
    times: Times
    limits: LimitSet
    loss_method: str
    transfer_length: float
    transfer_length_source: str
    combinations: dict[str, Combination]
    library_paths: tuple[str, ...] = field(default_factory=tuple)
    loss_basis: str = "gross"  # "gross" or "transformed": sections the stresses are computed on
    spacing: float | None = None
    position: str = "interior"  # "interior" or "exterior" girder
    layout: Layout | None = None
    handling: Handling | None = None
    tendons: tuple[Tendon, ...] = ()
    long_term_given: tuple[float, float | None] | None = None  # (final, to deck) loss, MPa
    user_stations: tuple[tuple[str, float], ...] = ()  # (name, x from the left end, mm)

    @property
    def bearing_offset(self) -> float:
        """Distance from each girder end to the bearing centreline (mm), span centred."""
        return (self.length - self.span) / 2.0

    @property
    def strand_count(self) -> int:
        """Total number of pretensioned strands."""
        return sum(r.count for r in self.rows)

    @property
    def A_ps(self) -> float:
        """Total prestressing steel area (mm^2): pretensioned strands and tendons."""
        return self.strand_count * self.strand.area + sum(t.area for t in self.tendons)

    @property
    def post_tensioned(self) -> bool:
        """Whether the girder is post-tensioned (tendons, no pretensioned strands)."""
        return bool(self.tendons)

    def cgs_geometric(self, x: np.ndarray) -> np.ndarray:
        """Height of the centroid of all prestressing steel at x, bonded or not (mm)."""
        if self.tendons:
            num = sum(t.area * np.asarray(t.profile().height(x)) for t in self.tendons)
            return np.asarray(num, dtype=float) / sum(t.area for t in self.tendons)
        assert self.layout is not None
        return self.layout.cgs_all(x)

    @property
    def y_ps(self) -> float:
        """Height of the centroid of all strands at midlength (mm above the girder bottom)."""
        if self.tendons or self.layout is not None:
            return float(self.cgs_geometric(np.array([self.length / 2.0]))[0])
        return sum(r.count * r.height for r in self.rows) / self.strand_count
