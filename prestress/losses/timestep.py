"""Time-step analysis of a composite prestressed section: prestress losses and stresses with time.

Internal units: N, mm, MPa, N·mm, days. Tension positive; heights y measured up from the girder
bottom; sagging moments positive; losses reported positive.

Method (the step-by-step numerical procedure with full superposition of the stress history):

* Plane sections remain plane. Two unknowns per section: the strain ε_r at a reference height
  y_ref and the curvature κ (positive sagging), so the strain at height y is
  ε(y) = ε_r + κ z with z = y_ref − y (z positive below the reference, as an eccentricity).
* Each concrete part (girder, deck) has its own creep function J(t, τ) and free shrinkage from
  :mod:`prestress.losses.models`, evaluated at the part's own age (days since it was cast).
  Within a part the stress stays linear in y, so it is carried as σ(z) = p + q z.
* Time is cut into steps. A stress increment Δσ_i arising during step i is taken as introduced
  at the middle of the step, τ_i; a load at an event age is an instantaneous step (τ = t).
  The strain of a part at t_j is Σ_i Δσ_i J(t_j, τ_i) + ε_sh(t_j), so over step j

      Δε = Δσ_j J(t_j, τ_j) + Σ_{i<j} Δσ_i [J(t_j, τ_i) − J(t_{j−1}, τ_i)] + Δε_sh

  and Δσ_j = Ē_j (Δε − Δε_creep − Δε_sh) with Ē_j = 1 / J(t_j, τ_j). This is the step-by-step
  procedure of Ghali, Favre & Elbadry, "Concrete Structures: Stresses and Deformations", 3rd ed.
  (2002), the chapter on the step-by-step numerical analysis (stress increments at the middle of
  each interval; from memory); Bažant (1972) "Numerical determination of long-range stress
  history from strain history in concrete", Materials and Structures 5, gives the trapezoidal
  variant (from memory; not used here because it needs J at the very age of casting of a deck,
  where the modulus of most models is zero). The age-adjusted effective modulus of Bažant (1972)
  "Prediction of concrete creep effects using age-adjusted effective modulus method", ACI
  Journal 69, is the one-step special case; it is used in the tests as a closed-form check.
  Gilbert & Ranzi, "Time-Dependent Behaviour of Concrete Structures" (2011), describe the same
  cross-section analysis with the two unknowns ε_r and κ (from memory).
* Bonded steel: strand layers (prestressed, with intrinsic relaxation) and optional
  non-prestressed bar layers, each at its own height, possibly different at each station.
* Relaxation: the intrinsic log-time law of Magura, Sozen & Siess (1964) in
  :mod:`prestress.codes.aashto_lrfd.relaxation`, applied to the varying strand stress by the
  equivalent-time method (a choice of this module, common practice in step-by-step loss
  analyses): at the start of each step the strand, at stress f after an accumulated relaxation
  R, is taken as an intrinsic test started at f* = f + R which has already relaxed R; the
  equivalent time t* solves R = f* log10(t*) / C (f*/fpy − 0.55), and the step adds
  f* [log10(t* + Δt) − log10(t*)] / C (f*/fpy − 0.55) (times in hours). At constant length this
  is the law itself; when creep and shrinkage lower the stress, f* and the rate drop, which is
  the reduction of relaxation by the shortening of the concrete. The clock starts when the
  strand is stressed (``StrandLayer.stressing_age``; by default at transfer, as 5.9.3.4.2c counts
  ΔfpR1 from transfer); relaxation in the bed is taken as already in the stress before transfer.

Staging:

* Transfer (``transfer_age``): the parts cast at or before transfer (the girder) and the strand
  and bar layers bond; the force Σ Aps fpbt held by the bed is released, i.e. applied to the
  concrete + steel section as a compressive force at each strand layer (the strand force becomes
  a load on the bonded section); loads of events at that age ("girder") act at the same instant.
* A part cast later (the deck, ``casting_age`` = deck age) joins the section from its casting on,
  unstressed, its age and shrinkage starting then; a "girder" load at that age (the deck weight)
  is carried by the section before the deck joins. "composite" loads must come later than the
  casting of the first later part; they are carried by every part active at that age.
* Differential shrinkage and creep between deck and girder follow from the different J and εsh.

Split of the strand loss by mechanism, exactly by linearity: at each step the section is solved
once for each source with the same stiffness: the loads of the step (elastic), the creep of the
past stresses, the shrinkage of the step and the relaxation of the step. The strand stress change
of each solution is that mechanism's share in the step; the shares add up to the total. (The
creep share therefore includes the creep of the concrete stresses that earlier shrinkage and
relaxation produced.) The creep and shrinkage shares are also split by concrete part (one more
solution per part and mechanism, same stiffness; ``TimeStepResult.losses_by_part``), so the
effect of the deck's shrinkage and creep on the strand is reported apart from the girder's; the
parts' shares add up to the combined share (linearity), which alone enters the totals.

Vectorised over stations: all stations share the concrete parts and the time grid; strand
heights, areas, stresses and the load moments may differ by station. Each step solves one 2×2
system per station with numpy in closed form (no Python loop over stations).
"""

from __future__ import annotations

import itertools
import math
import warnings
from collections.abc import Mapping, Sequence
from dataclasses import dataclass, field
from typing import TYPE_CHECKING

import numpy as np
from numpy.typing import ArrayLike, NDArray

from prestress.codes.aashto_lrfd import relaxation as rx

if TYPE_CHECKING:
    from prestress.losses.models import CreepShrinkageModel

FloatArray = NDArray[np.float64]

#: Keys of :attr:`TimeStepResult.losses`, in time order of first appearance.
LOSS_COMPONENTS = ("elastic_transfer", "creep", "shrinkage", "relaxation", "elastic_later")

#: Sections a load event may act on.
SECTIONS = ("girder", "composite")


# --------------------------------------------------------------------------- inputs
@dataclass(frozen=True)
class ConcretePart:
    """A concrete part of the cross-section (mm, days).

    Attributes:
        name: label, e.g. "girder" or "deck".
        area: area of the concrete, mm² (net or gross, as the caller decides).
        inertia: second moment of area about the part's own horizontal centroidal axis, mm⁴.
        centroid: height of the part's centroid above the girder bottom, mm.
        model: its creep and shrinkage model (an object of :mod:`prestress.losses.models`).
        casting_age: girder age when this part is cast, days: 0 for the girder, the deck age for
            a deck.
        fiber_heights: fibers at which stresses are reported, name → height above the girder
            bottom (mm), e.g. ``{"bottom": 0.0, "top": 1828.8}``.
    """

    name: str
    area: float
    inertia: float
    centroid: float
    model: CreepShrinkageModel
    casting_age: float = 0.0
    fiber_heights: Mapping[str, float] = field(default_factory=dict)


@dataclass(frozen=True)
class StrandLayer:
    """A layer of bonded prestressing strand (mm², mm, MPa, days).

    ``area``, ``height`` and ``stress_before_transfer`` may be scalars or arrays with one value per
    station (a debonded strand has zero area at that station; the stress reported for a layer
    where its area is zero is that of a fictitious strand and has no meaning).

    Attributes:
        area: strand area of the layer, mm².
        height: height of the layer above the girder bottom, mm.
        Ep: modulus of the strand, MPa.
        stress_before_transfer: fpbt, stress just before transfer, MPa.
        fpy: yield strength, MPa.
        relaxation: ``"low_relaxation"``, ``"stress_relieved"`` or ``None`` (no relaxation).
        stressing_age: girder age at which the strand was stressed in the bed, days (≤ transfer);
            ``None`` = at transfer.
        name: label.
    """

    area: ArrayLike
    height: ArrayLike
    Ep: float
    stress_before_transfer: ArrayLike
    fpy: float
    relaxation: str | None = "low_relaxation"
    stressing_age: float | None = None
    name: str = ""


@dataclass(frozen=True)
class BarLayer:
    """A layer of bonded non-prestressed reinforcement (mm², mm, MPa).

    Attributes:
        area: bar area, mm² (scalar or one value per station).
        height: height above the girder bottom, mm (scalar or per station).
        Es: modulus of the bars, MPa.
        part: name of the concrete part the bars are cast in (they bond when it joins).
        name: label.
    """

    area: ArrayLike
    height: ArrayLike
    Es: float
    part: str
    name: str = ""


@dataclass(frozen=True)
class LoadEvent:
    """A load applied at one age (N·mm, N, days).

    Attributes:
        age: girder age at which the load is applied, days.
        moment: moment increment, N·mm, sagging positive (scalar or one value per station).
        axial: axial force increment at the reference height, N, tension positive.
        section: ``"girder"`` (carried by the girder alone, e.g. self-weight at transfer, deck
            weight) or ``"composite"`` (e.g. superimposed dead load).
        label: description.
    """

    age: float
    moment: ArrayLike = 0.0
    axial: ArrayLike = 0.0
    section: str = "girder"
    label: str = ""


# --------------------------------------------------------------------------- result
@dataclass(frozen=True)
class TimeStepResult:
    """Results of :func:`run_timestep` at every recorded time (ages of the girder, days).

    Records: the state just before transfer, then the state at the end of every step. An age
    with loads appears twice: just before and just after them (see :meth:`index`).

    Attributes:
        ages: girder age of each record, days, shape (n,).
        kinds: "before transfer", "transfer", "event" or "step" for each record.
        stations: station positions (or indices), shape (S,).
        y_ref: reference height of the strain and curvature, mm above the girder bottom.
        strain_ref: strain at y_ref, shape (n, S).
        curvature: curvature, 1/mm, sagging positive, shape (n, S).
        strand_stress: stress in each strand layer, MPa, shape (n, S, L).
        losses: loss of each strand layer by mechanism (keys :data:`LOSS_COMPONENTS`), MPa,
            positive = loss, shape (n, S, L) each; they add up to fpbt − strand stress.
        concrete_stress: part name → fiber name → stress, MPa, shape (n, S).
        stress_at_ref: part name → stress the part would have at y_ref (the linear law extended),
            MPa, shape (n, S).
        stress_slope: part name → dσ/dz of the part, MPa/mm, z = y_ref − y, shape (n, S).
        bar_stress: stress in each bar layer, MPa, shape (n, S, B).
        part_active: part name → whether the part is in the section at each record, shape (n,).
        layer_names: names of the strand layers.
        bar_names: names of the bar layers.
        ages_out: the output ages the caller asked for.
        losses_by_part: ``"creep"`` and ``"shrinkage"`` → part name → that part's share of the
            loss of each strand layer, MPa, shape (n, S, L); the parts' shares add up to
            ``losses["creep"]`` and ``losses["shrinkage"]`` (to round-off).
    """

    ages: FloatArray
    kinds: tuple[str, ...]
    stations: FloatArray
    y_ref: float
    strain_ref: FloatArray
    curvature: FloatArray
    strand_stress: FloatArray
    losses: dict[str, FloatArray]
    concrete_stress: dict[str, dict[str, FloatArray]]
    stress_at_ref: dict[str, FloatArray]
    stress_slope: dict[str, FloatArray]
    bar_stress: FloatArray
    part_active: dict[str, NDArray[np.bool_]]
    layer_names: tuple[str, ...]
    bar_names: tuple[str, ...]
    ages_out: tuple[float, ...]
    losses_by_part: dict[str, dict[str, FloatArray]] = field(default_factory=dict)

    @property
    def total_loss(self) -> FloatArray:
        """Total loss of each strand layer since just before transfer, MPa, shape (n, S, L)."""
        return sum(self.losses[k] for k in LOSS_COMPONENTS)  # type: ignore[return-value]

    @property
    def long_term_loss(self) -> FloatArray:
        """Creep + shrinkage + relaxation shares (the time-dependent loss), MPa, (n, S, L)."""
        return self.losses["creep"] + self.losses["shrinkage"] + self.losses["relaxation"]

    def index(self, age: float, *, after: bool = True) -> int:
        """Index of the record at ``age``: after the loads of that age, or just before them.

        Args:
            age: a girder age on the time grid (an event, casting or output age), days.
            after: the state after the loads of that age (default) or just before them.

        Raises:
            ValueError: if the age is not on the time grid.
        """
        hits = np.flatnonzero(np.isclose(self.ages, age, rtol=1e-12, atol=1e-9))
        if hits.size == 0:
            raise ValueError(f"age {age} d is not on the time grid (pass it in ages_out)")
        return int(hits[-1] if after else hits[0])

    def stress_at(self, part: str, y: ArrayLike) -> FloatArray:
        """Stress of a part at height(s) ``y`` above the girder bottom, MPa, shape (n, S).

        Args:
            part: part name.
            y: height, mm, scalar or one value per station (e.g. the strand centroid).
        """
        if part not in self.stress_at_ref:
            raise ValueError(f"part must be one of {', '.join(self.stress_at_ref)}; got {part!r}")
        z = self.y_ref - np.asarray(y, dtype=float)
        return self.stress_at_ref[part] + self.stress_slope[part] * z


# --------------------------------------------------------------------------- helpers
def _num(name: str, value: object) -> float:
    try:
        v = float(value)  # type: ignore[arg-type]
    except (TypeError, ValueError):
        raise ValueError(f"{name} must be a number, got {value!r}") from None
    if not math.isfinite(v):
        raise ValueError(f"{name} must be finite, got {value!r}")
    return v


def _station_array(name: str, value: ArrayLike, n: int) -> FloatArray:
    a = np.asarray(value, dtype=float)
    if a.ndim > 1 or (a.ndim == 1 and a.size not in (1, n)):
        raise ValueError(f"{name} must be a scalar or have one value per station ({n})")
    if np.any(~np.isfinite(a)):
        raise ValueError(f"{name} must be finite")
    return np.broadcast_to(a.reshape(-1) if a.ndim else a, (n,)).astype(float)


def _station_count(values: list[tuple[str, ArrayLike]], stations: ArrayLike | None) -> int:
    if stations is not None:
        s = np.asarray(stations, dtype=float).reshape(-1)
        if s.size == 0:
            raise ValueError("stations must hold at least one station")
        return int(s.size)
    n = 1
    for name, v in values:
        a = np.asarray(v)
        if a.ndim > 1:
            raise ValueError(f"{name} must be a scalar or a 1-D array (one value per station)")
        if a.ndim == 1 and a.size > 1:
            if n > 1 and a.size != n:
                raise ValueError(f"{name} has {a.size} values; other inputs have {n} stations")
            n = a.size
    return n


def _allocate(lengths: FloatArray, n_steps: int, first_step: float) -> NDArray[np.int_]:
    """Share n_steps among intervals in proportion to 1 + log10(length / first_step), ≥ 1 each."""
    w = 1.0 + np.maximum(np.log10(lengths / first_step), 0.0)
    raw = n_steps * w / w.sum()
    m = np.maximum(np.floor(raw).astype(int), 1)
    frac = raw - np.floor(raw)
    for k in np.argsort(-frac):  # hand out what rounding left, largest remainders first
        if m.sum() >= n_steps:
            break
        m[k] += 1
    for k in np.argsort(frac):  # or take back where the minimum of one overshot
        if m.sum() <= n_steps:
            break
        if m[k] > 1:
            m[k] -= 1
    return m


def time_grid(
    key_ages: Sequence[float], n_steps: int, first_step: float = 0.01
) -> list[list[tuple[float, float]]]:
    """Log-spaced time steps between consecutive key ages (days).

    Each interval [a, b] gets m steps whose ends are a + geomspace(d1, b − a, m) with
    d1 = min(first_step, (b − a)/m); the ``n_steps`` are shared among the intervals in proportion
    to 1 + log10((b − a)/first_step), at least one each (common practice: creep, shrinkage and
    relaxation all progress roughly with the logarithm of the time since their start).

    Args:
        key_ages: sorted distinct ages, days.
        n_steps: total number of steps (at least one per interval).
        first_step: length of the first step after each key age, days.

    Returns:
        For each interval, the (start, end) of its steps, in order.
    """
    a = np.asarray(key_ages, dtype=float)
    lengths = np.diff(a)
    if lengths.size == 0:
        return []
    grid: list[list[tuple[float, float]]] = []
    for start, length, count in zip(
        a[:-1], lengths, _allocate(lengths, n_steps, first_step), strict=True
    ):
        if count == 1:
            ends = np.array([length])
        else:
            ends = np.geomspace(min(first_step, length / count), length, count)
        points = [float(start)] + [float(start + e) for e in ends[:-1]] + [float(start + length)]
        grid.append(list(itertools.pairwise(points)))
    return grid


def _check_model(name: str, model: object) -> None:
    for attr in ("E", "compliance", "shrinkage"):
        if not callable(getattr(model, attr, None)):
            raise ValueError(
                f"parts[{name!r}].model must be a creep and shrinkage model "
                f"(prestress.losses.models), got {type(model).__name__}"
            )


# --------------------------------------------------------------------------- engine
def young_loading_text(part: ConcretePart, age: float) -> str:
    """The caveat when a part is loaded younger than its creep model covers (for an engineer).

    Args:
        part: the concrete part; its model's ``min_loading_age`` (days), ``title`` and
            ``min_loading_age_source`` (the clause stating that age) are quoted where present.
        age: the part's earliest age at loading, days.
    """
    model = part.model
    title = getattr(model, "title", "")
    source = getattr(model, "min_loading_age_source", "") or title
    min_age = float(getattr(model, "min_loading_age", 0.0))
    when = f"{age:.3g} d ({age * 24.0:.3g} h)" if age < 2.0 else f"{age:.3g} d"
    covers = f" ({min_age:g} d and later, {source})" if source else f" ({min_age:g} d and later)"
    return (
        f"the {part.name} concrete is loaded at an age of {when}, earlier than its creep model "
        f"covers{covers}; the creep under that load is extrapolated from the model"
    )


def run_timestep(
    parts: Sequence[ConcretePart],
    layers: Sequence[StrandLayer],
    events: Sequence[LoadEvent],
    ages_out: Sequence[float],
    n_steps: int = 100,
    stations: ArrayLike | None = None,
    *,
    transfer_age: float,
    bars: Sequence[BarLayer] = (),
    y_ref: float | None = None,
    first_step: float = 0.01,
) -> TimeStepResult:
    """Time-step analysis of losses and stresses of a pretensioned (composite) girder section.

    See the module docstring for the method, the staging and the split of the losses.

    Args:
        parts: the concrete parts; those cast at or before transfer form the girder (at least
            one), later ones (the deck) join at their ``casting_age``.
        layers: strand layers (bonded at transfer).
        events: loads, in order of age (not earlier than transfer).
        ages_out: girder ages at which results are wanted (days); the analysis ends at the
            largest. Every one is a point of the time grid.
        n_steps: number of time steps between the key ages (transfer, castings, events, output
            ages), log-spaced after each key age; at least one per interval.
        stations: positions of the stations (mm, used as labels), or ``None`` to take the count
            from the per-station arrays.
        transfer_age: girder age at transfer, days (> 0).
        bars: non-prestressed bar layers.
        y_ref: reference height for strain and curvature, mm; ``None`` = the centroid of the
            girder concrete (the parts cast by transfer).
        first_step: length of the first time step after each key age, days.

    Returns:
        The :class:`TimeStepResult`.

    Raises:
        ValueError: for negative or non-finite times, events out of order or before transfer,
            an unknown section, a composite load before the deck is cast, bad geometry, or
            inconsistent station counts; the message names the argument.
    """
    # ---------------------------------------------------------------- validation
    t_tr = _num("transfer_age", transfer_age)
    if t_tr <= 0.0:
        raise ValueError(f"transfer_age must be greater than 0 days, got {transfer_age!r}")
    if int(n_steps) != n_steps or n_steps < 1:
        raise ValueError(f"n_steps must be a whole number of at least 1, got {n_steps!r}")
    fs = _num("first_step", first_step)
    if fs <= 0.0:
        raise ValueError(f"first_step must be greater than 0 days, got {first_step!r}")
    if not parts:
        raise ValueError("parts must hold at least one concrete part")
    names = [p.name for p in parts]
    if len(set(names)) != len(names):
        raise ValueError(f"parts must have distinct names, got {names}")
    for p in parts:
        if _num(f"parts[{p.name!r}].area", p.area) <= 0.0:
            raise ValueError(f"parts[{p.name!r}].area must be greater than 0 mm^2")
        if _num(f"parts[{p.name!r}].inertia", p.inertia) <= 0.0:
            raise ValueError(f"parts[{p.name!r}].inertia must be greater than 0 mm^4")
        _num(f"parts[{p.name!r}].centroid", p.centroid)
        if _num(f"parts[{p.name!r}].casting_age", p.casting_age) < 0.0:
            raise ValueError(f"parts[{p.name!r}].casting_age must be at least 0 days")
        for f_name, f_y in p.fiber_heights.items():
            _num(f"parts[{p.name!r}].fiber_heights[{f_name!r}]", f_y)
        _check_model(p.name, p.model)
    girder_idx = [k for k, p in enumerate(parts) if p.casting_age <= t_tr]
    later_idx = [k for k, p in enumerate(parts) if p.casting_age > t_tr]
    if not girder_idx:
        raise ValueError("parts: at least one part must be cast at or before transfer_age")
    first_later = min((parts[k].casting_age for k in later_idx), default=math.inf)

    out = [_num("ages_out", a) for a in ages_out]
    if not out:
        raise ValueError("ages_out must hold at least one age")
    if any(a < 0.0 for a in out):
        raise ValueError(f"ages_out must be ages of at least 0 days, got {out}")
    if any(a < t_tr for a in out):
        raise ValueError(f"ages_out must not be earlier than transfer_age ({t_tr:g} d), got {out}")
    t_end = max(out)
    if t_end <= t_tr:
        raise ValueError("ages_out must reach an age later than transfer_age")

    prev = -math.inf
    for i, ev in enumerate(events):
        age = _num(f"events[{i}].age", ev.age)
        if age < 0.0:
            raise ValueError(f"events[{i}].age must be at least 0 days, got {ev.age!r}")
        if age < prev:
            raise ValueError(
                f"events must be in order of age: events[{i}].age {age:g} d < {prev:g}"
            )
        prev = age
        if age < t_tr:
            raise ValueError(f"events[{i}].age {age:g} d is before transfer_age ({t_tr:g} d)")
        if age > t_end:
            raise ValueError(f"events[{i}].age {age:g} d is after the last of ages_out")
        if ev.section not in SECTIONS:
            raise ValueError(
                f"events[{i}].section must be 'girder' or 'composite', got {ev.section!r}"
            )
        if ev.section == "girder" and age > first_later:
            raise ValueError(
                f"events[{i}]: a 'girder' load at {age:g} d comes after a part is cast "
                f"({first_later:g} d); use 'composite'"
            )
        if ev.section == "composite" and not age > first_later:
            raise ValueError(
                f"events[{i}]: a 'composite' load needs a part cast before it (a deck cast "
                f"earlier than {age:g} d)"
            )
    for p in parts:
        if p.casting_age > t_tr and p.casting_age >= t_end:
            raise ValueError(f"parts[{p.name!r}].casting_age must be before the last of ages_out")

    per_station: list[tuple[str, ArrayLike]] = []
    for i, lay in enumerate(layers):
        per_station += [
            (f"layers[{i}].area", lay.area),
            (f"layers[{i}].height", lay.height),
            (f"layers[{i}].stress_before_transfer", lay.stress_before_transfer),
        ]
    for i, bar in enumerate(bars):
        per_station += [(f"bars[{i}].area", bar.area), (f"bars[{i}].height", bar.height)]
    for i, ev in enumerate(events):
        per_station += [(f"events[{i}].moment", ev.moment), (f"events[{i}].axial", ev.axial)]
    S = _station_count(per_station, stations)
    st = np.arange(S, dtype=float) if stations is None else np.asarray(stations, float).ravel()

    # ---------------------------------------------------------------- geometry
    if y_ref is None:
        a_g = sum(parts[k].area for k in girder_idx)
        yr = sum(parts[k].area * parts[k].centroid for k in girder_idx) / a_g
    else:
        yr = _num("y_ref", y_ref)
    P = len(parts)
    A = np.array([p.area for p in parts], float)
    zc = yr - np.array([p.centroid for p in parts], float)
    Sz = A * zc
    Iz = np.array([p.inertia for p in parts], float) + A * zc**2

    L = len(layers)
    Ap = np.zeros((S, L))
    zp = np.zeros((S, L))
    fpbt = np.zeros((S, L))
    Ep = np.zeros(L)
    fpy = np.ones(L)
    C = np.ones(L)
    relax = np.zeros(L, bool)
    stress_age = np.zeros(L)
    for i, lay in enumerate(layers):
        Ap[:, i] = _station_array(f"layers[{i}].area", lay.area, S)
        zp[:, i] = yr - _station_array(f"layers[{i}].height", lay.height, S)
        fpbt[:, i] = _station_array(
            f"layers[{i}].stress_before_transfer", lay.stress_before_transfer, S
        )
        if np.any(Ap[:, i] < 0.0):
            raise ValueError(f"layers[{i}].area must be at least 0 mm^2")
        if np.any(fpbt[:, i] < 0.0):
            raise ValueError(f"layers[{i}].stress_before_transfer must be at least 0 MPa")
        Ep[i] = _num(f"layers[{i}].Ep", lay.Ep)
        fpy[i] = _num(f"layers[{i}].fpy", lay.fpy)
        if Ep[i] <= 0.0 or fpy[i] <= 0.0:
            raise ValueError(f"layers[{i}].Ep and layers[{i}].fpy must be greater than 0 MPa")
        if lay.relaxation is not None:
            if lay.relaxation not in ("low_relaxation", "stress_relieved"):
                raise ValueError(
                    f"layers[{i}].relaxation must be 'low_relaxation', 'stress_relieved' or "
                    f"None, got {lay.relaxation!r}"
                )
            relax[i] = True
            C[i] = rx.log_time_constant(lay.relaxation)  # type: ignore[arg-type]
        sa = (
            t_tr
            if lay.stressing_age is None
            else _num(f"layers[{i}].stressing_age", lay.stressing_age)
        )
        if not 0.0 <= sa <= t_tr:
            raise ValueError(f"layers[{i}].stressing_age must be from 0 to transfer_age days")
        stress_age[i] = sa

    B = len(bars)
    Ab = np.zeros((S, B))
    zb = np.zeros((S, B))
    Es = np.zeros(B)
    bar_part = np.zeros(B, int)
    for i, bar in enumerate(bars):
        Ab[:, i] = _station_array(f"bars[{i}].area", bar.area, S)
        zb[:, i] = yr - _station_array(f"bars[{i}].height", bar.height, S)
        Es[i] = _num(f"bars[{i}].Es", bar.Es)
        if Es[i] <= 0.0 or np.any(Ab[:, i] < 0.0):
            raise ValueError(f"bars[{i}].Es must be greater than 0 and area at least 0")
        if bar.part not in names:
            raise ValueError(f"bars[{i}].part must be one of {', '.join(names)}; got {bar.part!r}")
        bar_part[i] = names.index(bar.part)

    # ---------------------------------------------------------------- time grid
    instants: dict[float, list[int]] = {t_tr: []}
    for i, ev in enumerate(events):
        instants.setdefault(float(ev.age), []).append(i)
    keys = sorted(
        {
            t_tr,
            t_end,
            *out,
            *(float(ev.age) for ev in events),
            *(parts[k].casting_age for k in later_idx),
        }
    )
    intervals = time_grid(keys, int(n_steps), fs)
    t0s: list[float] = []
    t1s: list[float] = []
    kinds: list[str] = []
    step_events: list[list[int]] = []
    for idx, key in enumerate(keys):
        if key in instants:
            t0s.append(key)
            t1s.append(key)
            kinds.append("transfer" if key == t_tr else "event")
            step_events.append(instants[key])
        if idx < len(intervals):
            for a0, a1 in intervals[idx]:
                t0s.append(a0)
                t1s.append(a1)
                kinds.append("step")
                step_events.append([])
    n = len(t0s)
    ts = np.array(t0s)
    te = np.array(t1s)
    instant = np.array([k != "step" for k in kinds])
    tau = np.where(instant, te, 0.5 * (ts + te))

    # first step of each part in the section
    join = np.zeros(P, int)
    for k, p in enumerate(parts):
        if p.casting_age <= t_tr:
            join[k] = 0
        else:
            join[k] = int(np.flatnonzero((~instant) & (ts >= p.casting_age - 1e-12))[0])

    # ---------------------------------------------------------------- creep functions
    E_eff = np.zeros((P, n))
    dJ = np.zeros((P, n, n))
    dsh = np.zeros((P, n))
    young: dict[str, float] = {}
    for k, p in enumerate(parts):
        s0 = join[k]
        c = p.casting_age
        m_idx, i_idx = np.tril_indices(n - s0)
        m_idx = m_idx + s0
        i_idx = i_idx + s0
        Jv = np.asarray(p.model.compliance(te[m_idx] - c, tau[i_idx] - c), float)
        if np.any(~np.isfinite(Jv)) or np.any(Jv <= 0.0):
            raise ValueError(f"parts[{p.name!r}].model gives a non-positive or infinite J(t, t0)")
        Jfull = np.zeros((n, n))
        Jfull[m_idx, i_idx] = Jv
        E_eff[k, s0:] = 1.0 / np.diag(Jfull)[s0:]
        D = np.zeros((n, n))
        D[1:] = Jfull[1:] - Jfull[:-1]
        D[np.triu_indices(n)] = 0.0
        dJ[k] = D
        sh_end = np.asarray(p.model.shrinkage(np.maximum(te - c, 0.0)), float)
        sh_start = np.asarray(p.model.shrinkage(np.maximum(ts - c, 0.0)), float)
        d = np.where(instant, 0.0, sh_end - sh_start)
        d[:s0] = 0.0
        dsh[k] = d
        min_age = float(getattr(p.model, "min_loading_age", 0.0))
        loaded = [j for j in range(s0, n) if instant[j] and (step_events[j] or j == 0)]
        for j in loaded:
            if te[j] - c < min_age:
                young[p.name] = min(young.get(p.name, math.inf), te[j] - c)
    for p in parts:
        if p.name in young:
            warnings.warn(young_loading_text(p, young[p.name]), stacklevel=2)

    # ---------------------------------------------------------------- loads per step
    dN_ext = np.zeros((n, S))
    dM_ext = np.zeros((n, S))
    for j in range(n):
        for i in step_events[j]:
            ev = events[i]
            dN_ext[j] += _station_array(f"events[{i}].axial", ev.axial, S)
            dM_ext[j] += _station_array(f"events[{i}].moment", ev.moment, S)
    release = Ap * fpbt
    dN_ext[0] -= release.sum(axis=1)
    dM_ext[0] -= (release * zp).sum(axis=1)

    # steel stiffness per station
    ks11 = (Ep * Ap).sum(axis=1)
    ks12 = (Ep * Ap * zp).sum(axis=1)
    ks22 = (Ep * Ap * zp**2).sum(axis=1)
    kb = np.zeros((P, 3, S))
    for i in range(B):
        kb[bar_part[i], 0] += Es[i] * Ab[:, i]
        kb[bar_part[i], 1] += Es[i] * Ab[:, i] * zb[:, i]
        kb[bar_part[i], 2] += Es[i] * Ab[:, i] * zb[:, i] ** 2

    # relaxation state
    hours_bed = (t_tr - stress_age) * 24.0
    R_acc = np.zeros((S, L))
    for i in range(L):
        if relax[i] and hours_bed[i] > 1.0:
            r = np.zeros(S)
            for _ in range(6):
                fi = fpbt[:, i] + r
                r = fi * np.log10(hours_bed[i]) / C[i] * np.maximum(fi / fpy[i] - 0.55, 0.0)
            R_acc[:, i] = r

    # ---------------------------------------------------------------- records
    nr = n + 1
    rec_e = np.zeros((nr, S))
    rec_k = np.zeros((nr, S))
    rec_fp = np.zeros((nr, S, L))
    rec_loss = {c: np.zeros((nr, S, L)) for c in LOSS_COMPONENTS}
    rec_part = np.zeros((2, P, nr, S, L))  # creep, shrinkage by part
    rec_p = np.zeros((P, nr, S))
    rec_q = np.zeros((P, nr, S))
    rec_fb = np.zeros((nr, S, B))
    hist = np.zeros((P, n, 2 * S))

    e_r = np.zeros(S)
    kap = np.zeros(S)
    fp = fpbt.copy()
    loss = {c: np.zeros((S, L)) for c in LOSS_COMPONENTS}
    loss_part = np.zeros((2, P, S, L))
    p_c = np.zeros((P, S))
    q_c = np.zeros((P, S))
    fb = np.zeros((S, B))
    rec_fp[0] = fp

    for j in range(n):
        active = [k for k in range(P) if join[k] <= j]
        # concrete stiffness (same for all stations) and steel (per station)
        k11 = ks11.copy()
        k12 = ks12.copy()
        k22 = ks22.copy()
        # right-hand sides: loads, creep, shrinkage, relaxation, then creep of each part and
        # shrinkage of each part (for the split by part only; rows 4.. are not added to rows 0..3)
        F1 = np.zeros((4 + 2 * P, S))
        F2 = np.zeros((4 + 2 * P, S))
        F1[0] = dN_ext[j]
        F2[0] = dM_ext[j]
        creep_a = np.zeros((P, S))
        creep_b = np.zeros((P, S))
        for k in active:
            Ek = E_eff[k, j]
            k11 += Ek * A[k] + kb[k, 0]
            k12 += Ek * Sz[k] + kb[k, 1]
            k22 += Ek * Iz[k] + kb[k, 2]
            if j > 0 and not instant[j]:
                ab = dJ[k, j, :j] @ hist[k, :j]
                creep_a[k] = ab[:S]
                creep_b[k] = ab[S:]
                F1[4 + k] = Ek * (A[k] * creep_a[k] + Sz[k] * creep_b[k])
                F2[4 + k] = Ek * (Sz[k] * creep_a[k] + Iz[k] * creep_b[k])
                F1[4 + P + k] = Ek * A[k] * dsh[k, j]
                F2[4 + P + k] = Ek * Sz[k] * dsh[k, j]
                F1[1] += F1[4 + k]
                F2[1] += F2[4 + k]
                F1[2] += F1[4 + P + k]
                F2[2] += F2[4 + P + k]
        dR = np.zeros((S, L))
        if not instant[j] and relax.any():
            dR = _relaxation_step(fp, R_acc, fpy, C, relax, ts[j], te[j], stress_age)
            R_acc += dR
            F1[3] = (Ap * dR).sum(axis=1)
            F2[3] = (Ap * dR * zp).sum(axis=1)
        det = k11 * k22 - k12**2
        de = (k22 * F1 - k12 * F2) / det
        dk = (k11 * F2 - k12 * F1) / det
        de_t = de[:4].sum(axis=0)
        dk_t = dk[:4].sum(axis=0)
        e_r += de_t
        kap += dk_t
        for k in active:
            Ek = E_eff[k, j]
            dp = Ek * (de_t - creep_a[k] - dsh[k, j])
            dq = Ek * (dk_t - creep_b[k])
            hist[k, j, :S] = dp
            hist[k, j, S:] = dq
            p_c[k] += dp
            q_c[k] += dq
        # strand stress change by mechanism
        dfp = Ep * (de[:, :, None] + dk[:, :, None] * zp[None])  # (4 + 2P, S, L)
        dfp[3] -= dR
        fp += dfp[:4].sum(axis=0)
        loss["elastic_transfer" if j == 0 else "elastic_later"] -= dfp[0]
        loss["creep"] -= dfp[1]
        loss["shrinkage"] -= dfp[2]
        loss["relaxation"] -= dfp[3]
        loss_part[0] -= dfp[4 : 4 + P]
        loss_part[1] -= dfp[4 + P :]
        if B:
            on = np.array([join[bar_part[i]] <= j for i in range(B)])
            fb += np.where(on, Es * (de_t[:, None] + dk_t[:, None] * zb), 0.0)
        r = j + 1
        rec_e[r] = e_r
        rec_k[r] = kap
        rec_fp[r] = fp
        for c in LOSS_COMPONENTS:
            rec_loss[c][r] = loss[c]
        rec_part[:, :, r] = loss_part
        rec_p[:, r] = p_c
        rec_q[:, r] = q_c
        rec_fb[r] = fb

    # ---------------------------------------------------------------- result
    ages = np.concatenate(([t_tr], te))
    rec_kinds = ("before transfer", *kinds)
    stress: dict[str, dict[str, FloatArray]] = {}
    at_ref: dict[str, FloatArray] = {}
    slope: dict[str, FloatArray] = {}
    active_rec: dict[str, NDArray[np.bool_]] = {}
    for k, p in enumerate(parts):
        at_ref[p.name] = rec_p[k]
        slope[p.name] = rec_q[k]
        stress[p.name] = {
            f_name: rec_p[k] + rec_q[k] * (yr - float(f_y))
            for f_name, f_y in p.fiber_heights.items()
        }
        act = np.zeros(nr, bool)
        act[join[k] + 1 :] = True
        active_rec[p.name] = act
    return TimeStepResult(
        ages=ages,
        kinds=rec_kinds,
        stations=st,
        y_ref=float(yr),
        strain_ref=rec_e,
        curvature=rec_k,
        strand_stress=rec_fp,
        losses=rec_loss,
        concrete_stress=stress,
        stress_at_ref=at_ref,
        stress_slope=slope,
        bar_stress=rec_fb,
        part_active=active_rec,
        layer_names=tuple(lay.name or f"layer {i + 1}" for i, lay in enumerate(layers)),
        bar_names=tuple(bar.name or f"bars {i + 1}" for i, bar in enumerate(bars)),
        ages_out=tuple(out),
        losses_by_part={
            mech: {p.name: rec_part[i, k] for k, p in enumerate(parts)}
            for i, mech in enumerate(("creep", "shrinkage"))
        },
    )


def _relaxation_step(
    fp: FloatArray,
    R_acc: FloatArray,
    fpy: FloatArray,
    C: FloatArray,
    relax: NDArray[np.bool_],
    t_start: float,
    t_end: float,
    stressing_age: FloatArray,
) -> FloatArray:
    """Relaxation of each strand over one step by the equivalent-time method, MPa (S, L)."""
    f_star = fp + R_acc
    ratio = f_star / fpy - 0.55
    ok = relax & (ratio > 0.0) & (f_star > 0.0)
    h0 = np.broadcast_to((t_start - stressing_age) * 24.0, fp.shape)
    dh = (t_end - t_start) * 24.0
    started = R_acc > 0.0
    with np.errstate(divide="ignore", invalid="ignore", over="ignore"):
        # log10 t* (t* ≥ 1 h once relaxation has started); gain = log10(1 + Δt / t*)
        log_t = np.where(ok & started, C * R_acc / (f_star * ratio), 0.0)
        gain_started = np.log10(1.0 + dh * 10.0 ** (-log_t))
    gain_fresh = np.log10(np.maximum(h0 + dh, 1.0)) - np.log10(np.maximum(h0, 1.0))
    gain = np.where(started, gain_started, gain_fresh)
    return np.where(ok, f_star * ratio / C * gain, 0.0)
