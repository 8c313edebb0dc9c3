"""Post-tensioned tendons: parabolic profile, friction, anchor set and jack elongation.

Engine-level module in the internal base system: newton, millimetre, MPa (N/mm^2), rad.
Stations ``x`` are horizontal distances along the girder; heights ``y`` are measured upward from
the girder bottom. Losses are positive numbers (a loss reduces the strand stress).

Profile (:class:`TendonProfile`). The tendon is given by control points, left to right:

- the first and last points are the end anchorages;
- every interior point is a point of horizontal tangent: a low point in a span or a high point
  over an interior support.

The points are joined by parabolic segments:

- end anchorage to the adjacent interior point: one parabola with its vertex (horizontal
  tangent) at the interior point;
- between two interior points (a high point and a low point): two parabolas of opposite
  curvature, each with its vertex at one of the two points, meeting with a common tangent at the
  inflection point. The inflection point lies at ``inflection_fraction * d`` from the HIGH point,
  ``d`` being the horizontal distance between the two points; it falls on the straight chord
  between them and the tangent there is twice the chord slope (standard geometry). A small
  fraction gives a short, sharp reverse curve over the support.

Friction (:func:`friction_stress`) follows AASHTO LRFD 9th Ed. (2020) Eq. 5.9.3.2.2b-1, with
``x`` taken as the length measured ALONG the tendon (exact parabola arc length) and ``alpha``
the sum of absolute changes of the tangent angle (exact ``atan`` of the slope, not the
small-angle slope difference). Both differ from the horizontal projection and small-angle forms
by well under 0.5 % for usual girder profiles.

Anchor set (:func:`anchor_set_area_method`) is found by the area method on the actual friction
curve: the stress after set is the mirror image of the friction curve about the stress at the end
x_set of the affected zone (reverse friction equal to forward friction), and x_set is the root of
(2/Ep) ∫ (fpx − fpx(x_set)) ds = Δset, found by bisection (the left side grows monotonically with
x_set). If the set cannot be absorbed within the available length (the far end, or the neutral
point when jacking at both ends), the loss reaches that point and the whole mirror image is
lowered by a uniform amount c found from the same area condition (see :class:`AnchorSetZone`).
"""

import itertools
import math
from collections.abc import Callable, Sequence
from dataclasses import dataclass, field
from typing import Literal

import numpy as np
from numpy.typing import ArrayLike, NDArray

from prestress.codes.aashto_lrfd import post_tensioning as pt

__all__ = [
    "AnchorEnd",
    "AnchorSetZone",
    "JackingEnd",
    "ParabolicSegment",
    "PostTensionedStresses",
    "TendonProfile",
    "anchor_set_area_method",
    "anchor_set_length_linear",
    "elongation_deviation",
    "friction_stress",
    "jack_elongation",
    "neutral_point",
    "post_tensioning_stresses",
    "post_tensioning_stresses_along",
]

JackingEnd = Literal["left", "right", "both"]
AnchorEnd = Literal["left", "right"]
StressCurve = Callable[[NDArray[np.float64]], NDArray[np.float64]]

_MPA_PER_KSI = 6.894757293168361  # 1 ksi = 4448.2216152605 N / 645.16 mm^2 (exact definitions)
_MM_PER_IN = 25.4
_MM_PER_FT = 304.8
_GL_NODES, _GL_WEIGHTS = np.polynomial.legendre.leggauss(16)
_JACKING_ENDS = ("left", "right", "both")


def _out(arr: NDArray[np.float64]) -> float | NDArray[np.float64]:
    return float(arr) if arr.ndim == 0 else arr


def _finite(name: str, value: float) -> float:
    v = float(value)
    if not math.isfinite(v):
        raise ValueError(f"{name} must be finite, got {value!r}")
    return v


def _positive(name: str, value: float, unit: str) -> float:
    v = _finite(name, value)
    if v <= 0.0:
        raise ValueError(f"{name} must be > 0 {unit}, got {value!r}")
    return v


def _non_negative(name: str, value: float, unit: str) -> float:
    v = _finite(name, value)
    if v < 0.0:
        raise ValueError(f"{name} must be >= 0 {unit}, got {value!r}")
    return v


def _check_end(jacking: str, allowed: Sequence[str] = _JACKING_ENDS) -> str:
    if jacking not in allowed:
        raise ValueError(f"jacking must be one of {tuple(allowed)}, got {jacking!r}")
    return jacking


@dataclass(frozen=True)
class ParabolicSegment:
    """One parabola of a tendon profile, ``y = y_vertex + a (x − x_vertex)²`` on [x_start, x_end].

    Attributes:
        x_start_mm: Station where the segment starts, mm.
        x_end_mm: Station where the segment ends, mm (> ``x_start_mm``).
        x_vertex_mm: Station of the vertex (horizontal tangent), mm; it is one of the two ends.
        y_vertex_mm: Height of the vertex above the girder bottom, mm.
        a_per_mm: Coefficient ``a``, 1/mm (> 0 sagging, < 0 hogging, 0 straight).
    """

    x_start_mm: float
    x_end_mm: float
    x_vertex_mm: float
    y_vertex_mm: float
    a_per_mm: float

    def height(self, x_mm: ArrayLike) -> NDArray[np.float64]:
        """Height above the girder bottom, mm."""
        u = np.asarray(x_mm, dtype=float) - self.x_vertex_mm
        return self.y_vertex_mm + self.a_per_mm * u * u

    def slope(self, x_mm: ArrayLike) -> NDArray[np.float64]:
        """Slope dy/dx, dimensionless."""
        return 2.0 * self.a_per_mm * (np.asarray(x_mm, dtype=float) - self.x_vertex_mm)

    def arc_length_from_vertex(self, x_mm: ArrayLike) -> NDArray[np.float64]:
        """Signed arc length from the vertex to ``x``, mm (closed form for a parabola)."""
        u = np.asarray(x_mm, dtype=float) - self.x_vertex_mm
        a = self.a_per_mm
        if a == 0.0:
            return u
        t = 2.0 * a * u
        return (t * np.sqrt(1.0 + t * t) + np.arcsinh(t)) / (4.0 * a)


@dataclass(frozen=True)
class TendonProfile:
    """Tendon profile through control points joined by parabolas (see the module docstring).

    Attributes:
        x_mm: Stations of the control points, mm, strictly increasing: end anchorage, interior
            points of horizontal tangent (low points in spans, high points over supports), end
            anchorage. At least three points.
        y_mm: Heights of the control points above the girder bottom, mm (>= 0).
        inflection_fraction: Position of the inflection point of each reverse curve between two
            interior points, as a fraction (0 < λ < 1) of the horizontal distance between them,
            measured from the HIGH point. One value for all, or one per pair of consecutive
            interior points (left to right). Required only when there are such pairs
            (continuous layouts); ignored for a single span (anchor, low point, anchor).
        girder_depth_mm: Overall girder depth, mm; if given, every control point must lie
            within 0 <= y <= depth (the parabolas never leave the range of the control points).
        segments: The parabolic segments, left to right (derived).
    """

    x_mm: tuple[float, ...]
    y_mm: tuple[float, ...]
    inflection_fraction: float | tuple[float, ...] | None = None
    girder_depth_mm: float | None = None
    segments: tuple[ParabolicSegment, ...] = field(init=False, repr=False, compare=False)
    _breaks: NDArray[np.float64] = field(init=False, repr=False, compare=False)
    _alpha_start: NDArray[np.float64] = field(init=False, repr=False, compare=False)
    _s_start: NDArray[np.float64] = field(init=False, repr=False, compare=False)
    _alpha_total: float = field(init=False, repr=False, compare=False)
    _length_total: float = field(init=False, repr=False, compare=False)

    def __post_init__(self) -> None:
        x = tuple(_finite("x_mm", v) for v in self.x_mm)
        y = tuple(_finite("y_mm", v) for v in self.y_mm)
        if len(x) != len(y):
            raise ValueError(f"x_mm and y_mm must have the same length, got {len(x)} and {len(y)}")
        if len(x) < 3:
            raise ValueError(
                "x_mm must hold at least 3 control points (anchor, low point, anchor), "
                f"got {len(x)}"
            )
        if any(b <= a for a, b in itertools.pairwise(x)):
            raise ValueError(f"x_mm must be strictly increasing, got {x}")
        if any(v < 0.0 for v in y):
            raise ValueError(f"y_mm must be >= 0 (measured up from the girder bottom), got {y}")
        depth = self.girder_depth_mm
        if depth is not None:
            depth = _positive("girder_depth_mm", depth, "mm")
            if any(v > depth for v in y):
                raise ValueError(
                    f"y_mm must lie within the girder depth 0..{depth} mm "
                    f"(girder_depth_mm), got {y}"
                )
        n_pairs = len(x) - 3
        fractions = self._fractions(n_pairs)
        object.__setattr__(self, "x_mm", x)
        object.__setattr__(self, "y_mm", y)
        object.__setattr__(self, "girder_depth_mm", depth)
        object.__setattr__(self, "inflection_fraction", fractions if n_pairs else None)
        segments = self._build_segments(x, y, fractions)
        object.__setattr__(self, "segments", segments)
        self._precompute()

    def _fractions(self, n_pairs: int) -> tuple[float, ...]:
        value = self.inflection_fraction
        if n_pairs == 0:
            return ()
        if value is None:
            raise ValueError(
                "inflection_fraction is required when the profile has a high point over an "
                "interior support (0 < fraction < 1, measured from the high point)"
            )
        if isinstance(value, int | float):
            fractions = (float(value),) * n_pairs
        else:
            fractions = tuple(float(v) for v in value)
            if len(fractions) != n_pairs:
                raise ValueError(
                    f"inflection_fraction must hold one value per pair of interior points "
                    f"({n_pairs}), got {len(fractions)}"
                )
        for f in fractions:
            if not (0.0 < f < 1.0):
                raise ValueError(f"inflection_fraction must lie in (0, 1), got {f!r}")
        return fractions

    @staticmethod
    def _build_segments(
        x: tuple[float, ...], y: tuple[float, ...], fractions: tuple[float, ...]
    ) -> tuple[ParabolicSegment, ...]:
        segs: list[ParabolicSegment] = []
        # End anchorage to the first interior point: vertex at the interior point.
        segs.append(ParabolicSegment(x[0], x[1], x[1], y[1], (y[0] - y[1]) / (x[0] - x[1]) ** 2))
        for k, lam in enumerate(fractions):
            i = k + 1
            x0, x1, y0, y1 = x[i], x[i + 1], y[i], y[i + 1]
            d = x1 - x0
            if y0 == y1:
                segs.append(ParabolicSegment(x0, x1, x0, y0, 0.0))
                continue
            drop = abs(y1 - y0)
            if y0 > y1:  # high point on the left
                x_inf = x0 + lam * d
                segs.append(ParabolicSegment(x0, x_inf, x0, y0, -drop / (lam * d * d)))
                segs.append(ParabolicSegment(x_inf, x1, x1, y1, drop / ((1.0 - lam) * d * d)))
            else:  # high point on the right
                x_inf = x1 - lam * d
                segs.append(ParabolicSegment(x0, x_inf, x0, y0, drop / ((1.0 - lam) * d * d)))
                segs.append(ParabolicSegment(x_inf, x1, x1, y1, -drop / (lam * d * d)))
        # Last interior point to the end anchorage: vertex at the interior point.
        segs.append(
            ParabolicSegment(x[-2], x[-1], x[-2], y[-2], (y[-1] - y[-2]) / (x[-1] - x[-2]) ** 2)
        )
        return tuple(segs)

    def _precompute(self) -> None:
        segs = self.segments
        breaks = np.array([s.x_start_mm for s in segs] + [segs[-1].x_end_mm])
        alpha_start = np.zeros(len(segs))
        s_start = np.zeros(len(segs))
        alpha, length = 0.0, 0.0
        theta_prev_end: float | None = None
        for k, s in enumerate(segs):
            theta_a = math.atan(float(s.slope(s.x_start_mm)))
            theta_b = math.atan(float(s.slope(s.x_end_mm)))
            if theta_prev_end is not None:  # a kink at a join (zero by construction)
                alpha += abs(theta_a - theta_prev_end)
            alpha_start[k] = alpha
            s_start[k] = length
            alpha += abs(theta_b - theta_a)
            length += float(s.arc_length_from_vertex(s.x_end_mm)) - float(
                s.arc_length_from_vertex(s.x_start_mm)
            )
            theta_prev_end = theta_b
        object.__setattr__(self, "_breaks", breaks)
        object.__setattr__(self, "_alpha_start", alpha_start)
        object.__setattr__(self, "_s_start", s_start)
        object.__setattr__(self, "_alpha_total", alpha)
        object.__setattr__(self, "_length_total", length)

    # ----------------------------------------------------------------- geometry
    @property
    def x_start_mm(self) -> float:
        """Station of the left end anchorage, mm."""
        return self.x_mm[0]

    @property
    def x_end_mm(self) -> float:
        """Station of the right end anchorage, mm."""
        return self.x_mm[-1]

    @property
    def joints_mm(self) -> tuple[float, ...]:
        """Stations where two parabolas meet (control points and inflection points), mm."""
        return tuple(float(v) for v in self._breaks[1:-1])

    @property
    def inflection_points_mm(self) -> tuple[float, ...]:
        """Stations of the inflection points of the reverse curves, mm."""
        controls = set(self.x_mm)
        return tuple(v for v in self.joints_mm if v not in controls)

    @property
    def tendon_length_mm(self) -> float:
        """Length of the tendon along its curved path, anchor to anchor, mm."""
        return self._length_total

    @property
    def total_angular_change_rad(self) -> float:
        """Sum of the absolute angular changes from one anchorage to the other, rad."""
        return self._alpha_total

    def _locate(self, x_mm: ArrayLike) -> tuple[NDArray[np.float64], NDArray[np.intp]]:
        x = np.asarray(x_mm, dtype=float)
        x0, x1 = self.x_mm[0], self.x_mm[-1]
        tol = 1e-9 * (x1 - x0)
        if np.any(~np.isfinite(x)) or np.any(x < x0 - tol) or np.any(x > x1 + tol):
            raise ValueError(f"x_mm must lie within the tendon, {x0} to {x1} mm")
        x = np.clip(x, x0, x1)
        idx = np.clip(np.searchsorted(self._breaks, x, side="right") - 1, 0, len(self.segments) - 1)
        return x, idx

    def _params(self, idx: NDArray[np.intp]) -> tuple[NDArray[np.float64], ...]:
        segs = self.segments
        xs = np.array([s.x_start_mm for s in segs])[idx]
        xv = np.array([s.x_vertex_mm for s in segs])[idx]
        yv = np.array([s.y_vertex_mm for s in segs])[idx]
        a = np.array([s.a_per_mm for s in segs])[idx]
        return xs, xv, yv, a

    def height(self, x_mm: ArrayLike) -> float | NDArray[np.float64]:
        """Height of the tendon above the girder bottom at stations ``x_mm``, mm."""
        x, idx = self._locate(x_mm)
        _, xv, yv, a = self._params(idx)
        return _out(yv + a * (x - xv) ** 2)

    def slope(self, x_mm: ArrayLike) -> float | NDArray[np.float64]:
        """Slope dy/dx of the tendon at stations ``x_mm`` (positive rising to the right)."""
        x, idx = self._locate(x_mm)
        _, xv, _, a = self._params(idx)
        return _out(2.0 * a * (x - xv))

    def length_weight(self, x_mm: ArrayLike) -> float | NDArray[np.float64]:
        """Ratio ds/dx of tendon length to horizontal length at stations ``x_mm``."""
        x, idx = self._locate(x_mm)
        _, xv, _, a = self._params(idx)
        return _out(np.sqrt(1.0 + (2.0 * a * (x - xv)) ** 2))

    def angular_change(
        self, x_mm: ArrayLike, from_end: AnchorEnd = "left"
    ) -> float | NDArray[np.float64]:
        """Cumulative angular change α from an end anchorage to stations ``x_mm``, rad.

        α is the sum of the absolute changes of the tangent angle atan(dy/dx) along the path,
        computed exactly per parabola (the slope, hence the angle, is monotonic within each).

        Args:
            x_mm: Stations, mm.
            from_end: ``"left"`` or ``"right"`` anchorage (the jacking end).

        Returns:
            α, rad (>= 0).
        """
        _check_end(from_end, ("left", "right"))
        x, idx = self._locate(x_mm)
        xs, xv, _, a = self._params(idx)
        alpha = self._alpha_start[idx] + np.abs(
            np.arctan(2.0 * a * (x - xv)) - np.arctan(2.0 * a * (xs - xv))
        )
        if from_end == "right":
            alpha = self._alpha_total - alpha
        return _out(np.maximum(alpha, 0.0))

    def length_along(
        self, x_mm: ArrayLike, from_end: AnchorEnd = "left"
    ) -> float | NDArray[np.float64]:
        """Length measured along the tendon from an end anchorage to stations ``x_mm``, mm."""
        _check_end(from_end, ("left", "right"))
        x, idx = self._locate(x_mm)
        xs = self._params(idx)[0]
        segs = self.segments
        s = np.empty_like(x)
        for k in np.unique(idx):
            m = idx == k
            seg = segs[int(k)]
            s[m] = self._s_start[k] + (
                seg.arc_length_from_vertex(x[m]) - seg.arc_length_from_vertex(xs[m])
            )
        if from_end == "right":
            s = self._length_total - s
        return _out(np.maximum(s, 0.0))


# --------------------------------------------------------------------------- quadrature
def _integrate(func: StressCurve, a: float, b: float, breakpoints: Sequence[float] = ()) -> float:
    """Integral of ``func`` on [a, b] (a <= b), 16-point Gauss-Legendre between breakpoints."""
    if b <= a:
        return 0.0
    cuts = [a, *sorted(v for v in breakpoints if a < v < b), b]
    lo = np.asarray(cuts[:-1])
    hi = np.asarray(cuts[1:])
    half = 0.5 * (hi - lo)
    mid = 0.5 * (hi + lo)
    nodes = (mid[:, None] + half[:, None] * _GL_NODES[None, :]).ravel()
    values = np.asarray(func(nodes), dtype=float).reshape(len(lo), -1)
    return float(np.sum(half * (values @ _GL_WEIGHTS)))


# --------------------------------------------------------------------------- friction
def _friction_one_end(
    profile: TendonProfile,
    x_mm: ArrayLike,
    f_pj_MPa: float,
    mu: float,
    K_per_mm: float,
    end: AnchorEnd,
) -> NDArray[np.float64]:
    s = np.asarray(profile.length_along(x_mm, end), dtype=float)
    alpha = np.asarray(profile.angular_change(x_mm, end), dtype=float)
    loss_ksi = pt.delta_f_pF(
        f_pj_MPa / _MPA_PER_KSI, K_per_mm * _MM_PER_FT, s / _MM_PER_FT, mu, alpha
    )
    return f_pj_MPa - np.asarray(loss_ksi, dtype=float) * _MPA_PER_KSI


def _check_friction_args(f_pj_MPa: float, mu: float, K_per_mm: float) -> tuple[float, ...]:
    return (
        _positive("f_pj_MPa", f_pj_MPa, "MPa"),
        _non_negative("mu", mu, "per rad"),
        _non_negative("K_per_mm", K_per_mm, "per mm"),
    )


def friction_stress(
    profile: TendonProfile,
    x_mm: ArrayLike,
    *,
    f_pj_MPa: float,
    mu: float,
    K_per_mm: float,
    jacking: JackingEnd = "left",
) -> float | NDArray[np.float64]:
    """Strand stress after friction, fpx = fpj − ΔfpF (AASHTO LRFD 9th Ed. Eq. 5.9.3.2.2b-1).

    Args:
        profile: Tendon profile.
        x_mm: Stations, mm.
        f_pj_MPa: Jacking stress, MPa (> 0).
        mu: Curvature friction coefficient, per rad (>= 0).
        K_per_mm: Wobble coefficient per mm of tendon (0.0002 /ft = 6.5617e-7 /mm).
        jacking: ``"left"``, ``"right"`` or ``"both"`` (both ends: the larger of the two one-end
            stresses at each station).

    Returns:
        Stress after friction at each station, MPa.
    """
    f_pj_MPa, mu, K_per_mm = _check_friction_args(f_pj_MPa, mu, K_per_mm)
    _check_end(jacking)
    if jacking == "both":
        left = _friction_one_end(profile, x_mm, f_pj_MPa, mu, K_per_mm, "left")
        right = _friction_one_end(profile, x_mm, f_pj_MPa, mu, K_per_mm, "right")
        return _out(np.maximum(left, right))
    return _out(_friction_one_end(profile, x_mm, f_pj_MPa, mu, K_per_mm, jacking))


def neutral_point(profile: TendonProfile, *, f_pj_MPa: float, mu: float, K_per_mm: float) -> float:
    """Station where the friction curves from the two ends cross (jacking at both ends), mm.

    It is the point of lowest stress after friction, and the point that does not move when both
    ends are stressed. Without any friction (mu = K = 0) it is taken at mid-length of the tendon.

    Args:
        profile: Tendon profile.
        f_pj_MPa: Jacking stress (same at both ends), MPa.
        mu: Curvature friction coefficient, per rad.
        K_per_mm: Wobble coefficient, per mm.

    Returns:
        Station of the neutral point, mm.
    """
    f_pj_MPa, mu, K_per_mm = _check_friction_args(f_pj_MPa, mu, K_per_mm)
    lo, hi = profile.x_start_mm, profile.x_end_mm
    if mu == 0.0 and K_per_mm == 0.0:
        half = 0.5 * profile.tendon_length_mm

        def gap(x: float) -> float:
            return float(profile.length_along(x)) - half
    else:

        def gap(x: float) -> float:
            left = _friction_one_end(profile, x, f_pj_MPa, mu, K_per_mm, "left")
            right = _friction_one_end(profile, x, f_pj_MPa, mu, K_per_mm, "right")
            return float(right - left)  # increases from <= 0 at the left end to >= 0

    for _ in range(200):
        mid = 0.5 * (lo + hi)
        if gap(mid) < 0.0:
            lo = mid
        else:
            hi = mid
        if hi - lo <= 1e-13 * (profile.x_end_mm - profile.x_start_mm):
            break
    return 0.5 * (lo + hi)


# --------------------------------------------------------------------------- anchor set
@dataclass(frozen=True)
class AnchorSetZone:
    """Result of the area method for one stressing anchorage.

    Inside the zone (between the anchorage and ``x_set_mm``) the loss to anchor set at a station
    with stress after friction fpx is ``2 (fpx − f_px_at_x_set_MPa) + loss_at_x_set_MPa``;
    outside it is zero.

    Attributes:
        x_anchor_mm: Station of the stressing anchorage, mm.
        x_set_mm: Station where the set zone ends, mm. When ``reaches_limit`` it is the limit
            point (the far end, or the neutral point when jacking at both ends).
        length_mm: Length of the zone measured along the tendon, mm.
        set_mm: Anchor set (draw-in) accommodated, mm.
        f_px_at_x_set_MPa: Stress after friction at ``x_set_mm`` (axis of the mirror image), MPa.
        loss_at_anchor_MPa: Loss to anchor set at the anchorage, MPa.
        loss_at_x_set_MPa: Uniform lowering c of the mirror image, equal to the loss at
            ``x_set_mm``: zero unless ``reaches_limit``.
        reaches_limit: True if the set could not be absorbed before the limit point.
    """

    x_anchor_mm: float
    x_set_mm: float
    length_mm: float
    set_mm: float
    f_px_at_x_set_MPa: float
    loss_at_anchor_MPa: float
    loss_at_x_set_MPa: float
    reaches_limit: bool

    def loss_MPa(self, x_mm: ArrayLike, f_px_MPa: ArrayLike) -> NDArray[np.float64]:
        """Loss to anchor set at stations ``x_mm`` whose stress after friction is ``f_px_MPa``.

        Args:
            x_mm: Stations, mm.
            f_px_MPa: Stress after friction (from the same anchorage) at those stations, MPa.

        Returns:
            Loss to anchor set, MPa (>= 0; zero outside the zone).
        """
        x = np.asarray(x_mm, dtype=float)
        f = np.asarray(f_px_MPa, dtype=float)
        lo, hi = sorted((self.x_anchor_mm, self.x_set_mm))
        inside = (x >= lo) & (x <= hi) & (self.set_mm > 0.0)
        loss = 2.0 * (f - self.f_px_at_x_set_MPa) + self.loss_at_x_set_MPa
        return np.where(inside, np.maximum(loss, 0.0), 0.0)


def anchor_set_area_method(
    stress: StressCurve,
    *,
    x_anchor_mm: float,
    x_limit_mm: float,
    set_mm: float,
    E_p_MPa: float,
    length_weight: StressCurve | None = None,
    breakpoints_mm: Sequence[float] = (),
) -> AnchorSetZone:
    """Anchor-set (draw-in) zone by the area method on a given friction curve.

    Solves (2/Ep) ∫ (f(x) − f(x_set)) w(x) dx = Δset over the zone from the anchorage to x_set,
    with w = ds/dx (tendon length per horizontal length), by bisection on [anchor, limit]: the
    left side grows monotonically with x_set because f does not increase away from the anchor.
    If the set is not absorbed by the limit point, the loss reaches it and the mirror image is
    lowered by the uniform amount c = (Ep Δset − 2 ∫ (f − f(limit)) w dx) / ∫ w dx.
    The area method relation is the textbook one (see
    :func:`prestress.codes.aashto_lrfd.post_tensioning.delta_set_from_area`, from memory).

    Args:
        stress: Vectorised stress after friction f(x), MPa, non-increasing away from the anchor.
        x_anchor_mm: Station of the stressing anchorage, mm.
        x_limit_mm: Farthest station the set may reach (far end or neutral point), mm.
        set_mm: Anchor set (wedge seat), mm (>= 0); 3/8 in = 9.525 mm is common practice.
        E_p_MPa: Modulus of elasticity of the strand, MPa (> 0).
        length_weight: Vectorised ds/dx; ``None`` for a straight horizontal tendon (w = 1).
        breakpoints_mm: Stations where f or w has a kink (for the quadrature).

    Returns:
        The anchor-set zone.

    Raises:
        ValueError: If ``set_mm`` is negative, ``E_p_MPa`` not positive, or the anchorage and
            the limit coincide while the set is positive.
    """
    set_mm = _non_negative("set_mm", set_mm, "mm")
    E_p_MPa = _positive("E_p_MPa", E_p_MPa, "MPa")
    xa = _finite("x_anchor_mm", x_anchor_mm)
    xl = _finite("x_limit_mm", x_limit_mm)
    span = abs(xl - xa)
    sign = 1.0 if xl >= xa else -1.0

    def f_at(x: float) -> float:
        return float(np.asarray(stress(np.array([x], dtype=float)), dtype=float)[0])

    f_anchor = f_at(xa)
    if set_mm == 0.0:
        return AnchorSetZone(xa, xa, 0.0, 0.0, f_anchor, 0.0, 0.0, False)
    if span == 0.0:
        raise ValueError("x_limit_mm must differ from x_anchor_mm when set_mm > 0")

    def weight(x: NDArray[np.float64]) -> NDArray[np.float64]:
        if length_weight is None:
            return np.ones_like(x)
        return np.asarray(length_weight(x), dtype=float)

    def fw(x: NDArray[np.float64]) -> NDArray[np.float64]:
        return np.asarray(stress(x), dtype=float) * weight(x)

    def integrals(t: float) -> tuple[float, float, float]:
        xt = xa + sign * t
        lo, hi = sorted((xa, xt))
        return (
            _integrate(fw, lo, hi, breakpoints_mm),
            _integrate(weight, lo, hi, breakpoints_mm),
            f_at(xt),
        )

    target = E_p_MPa * set_mm

    def area(t: float) -> float:
        fw_int, w_int, f_t = integrals(t)
        return 2.0 * (fw_int - f_t * w_int)

    if area(span) <= target:  # the set reaches the limit point
        fw_int, w_int, f_lim = integrals(span)
        c = (target - 2.0 * (fw_int - f_lim * w_int)) / w_int
        return AnchorSetZone(
            x_anchor_mm=xa,
            x_set_mm=xl,
            length_mm=w_int,
            set_mm=set_mm,
            f_px_at_x_set_MPa=f_lim,
            loss_at_anchor_MPa=2.0 * (f_anchor - f_lim) + c,
            loss_at_x_set_MPa=c,
            reaches_limit=True,
        )
    lo, hi = 0.0, span
    for _ in range(200):
        mid = 0.5 * (lo + hi)
        if area(mid) < target:
            lo = mid
        else:
            hi = mid
        if hi - lo <= 1e-12 * span:
            break
    t = 0.5 * (lo + hi)
    _, w_int, f_t = integrals(t)
    return AnchorSetZone(
        x_anchor_mm=xa,
        x_set_mm=xa + sign * t,
        length_mm=w_int,
        set_mm=set_mm,
        f_px_at_x_set_MPa=f_t,
        loss_at_anchor_MPa=2.0 * (f_anchor - f_t),
        loss_at_x_set_MPa=0.0,
        reaches_limit=False,
    )


def anchor_set_length_linear(E_p_MPa: float, set_mm: float, p_MPa_per_mm: float) -> float:
    """Closed-form anchor-set length for a linear friction curve, x_set = sqrt(Ep Δset / p), mm.

    Engine wrapper of :func:`prestress.codes.aashto_lrfd.post_tensioning.x_set_linear`
    (textbook relation, from memory), used as a check of the area method.

    Args:
        E_p_MPa: Modulus of elasticity of the strand, MPa (> 0).
        set_mm: Anchor set, mm (>= 0).
        p_MPa_per_mm: Friction loss per mm of tendon, MPa/mm (> 0).

    Returns:
        x_set, mm.
    """
    x_in = pt.x_set_linear(
        E_p_MPa / _MPA_PER_KSI, set_mm / _MM_PER_IN, p_MPa_per_mm * _MM_PER_IN / _MPA_PER_KSI
    )
    return x_in * _MM_PER_IN


# --------------------------------------------------------------------------- full profile
@dataclass(frozen=True, eq=False)
class PostTensionedStresses:
    """Strand stresses and instantaneous losses (friction, anchor set) at given stations.

    Attributes:
        x_mm: Stations, mm.
        f_pj_MPa: Jacking stress, MPa.
        f_px_friction_MPa: Stress after friction, MPa.
        f_p_after_set_MPa: Stress after friction and anchor set, MPa.
        loss_friction_MPa: Friction loss fpj − fpx, MPa.
        loss_anchor_set_MPa: Anchor-set loss, MPa.
        loss_total_MPa: Sum of the two, fpj − stress after set, MPa.
        anchor_set_zones: One zone per stressing anchorage (left first).
        neutral_point_mm: Neutral point when jacking at both ends, else ``None``.
    """

    x_mm: NDArray[np.float64]
    f_pj_MPa: float
    f_px_friction_MPa: NDArray[np.float64]
    f_p_after_set_MPa: NDArray[np.float64]
    loss_friction_MPa: NDArray[np.float64]
    loss_anchor_set_MPa: NDArray[np.float64]
    loss_total_MPa: NDArray[np.float64]
    anchor_set_zones: tuple[AnchorSetZone, ...]
    neutral_point_mm: float | None


def _zones(
    profile: TendonProfile,
    f_pj_MPa: float,
    mu: float,
    K_per_mm: float,
    E_p_MPa: float,
    set_mm: float,
    jacking: str,
) -> tuple[tuple[tuple[AnchorSetZone, AnchorEnd], ...], float | None]:
    def curve(end: AnchorEnd) -> StressCurve:
        def f(x: NDArray[np.float64]) -> NDArray[np.float64]:
            return _friction_one_end(profile, x, f_pj_MPa, mu, K_per_mm, end)

        return f

    def weight(x: NDArray[np.float64]) -> NDArray[np.float64]:
        return np.asarray(profile.length_weight(x), dtype=float)

    x0, x1 = profile.x_start_mm, profile.x_end_mm
    xn = (
        neutral_point(profile, f_pj_MPa=f_pj_MPa, mu=mu, K_per_mm=K_per_mm)
        if jacking == "both"
        else None
    )
    plan: list[tuple[float, float, AnchorEnd]] = []
    if jacking in ("left", "both"):
        plan.append((x0, x1 if xn is None else xn, "left"))
    if jacking in ("right", "both"):
        plan.append((x1, x0 if xn is None else xn, "right"))
    zones = tuple(
        (
            anchor_set_area_method(
                curve(end),
                x_anchor_mm=xa,
                x_limit_mm=xl,
                set_mm=set_mm,
                E_p_MPa=E_p_MPa,
                length_weight=weight,
                breakpoints_mm=profile.joints_mm,
            ),
            end,
        )
        for xa, xl, end in plan
    )
    return zones, xn


def post_tensioning_stresses(
    profile: TendonProfile,
    x_mm: ArrayLike,
    *,
    f_pj_MPa: float,
    mu: float,
    K_per_mm: float,
    E_p_MPa: float,
    set_mm: float,
    jacking: JackingEnd = "left",
) -> PostTensionedStresses:
    """Strand stress after friction and anchor set, and the loss of each mechanism, at stations.

    Friction by AASHTO LRFD 9th Ed. (2020) Eq. 5.9.3.2.2b-1; anchor set by the area method
    (:func:`anchor_set_area_method`). Jacking at both ends: the friction curve is the larger of
    the two one-end curves; each anchorage's set zone is limited to its own side of the
    neutral point (if a zone reaches it, its side is lowered uniformly as for a dead end; at the
    neutral point itself the larger of the two losses is kept). This is exact for a symmetric
    tendon stressed at both ends and an approximation otherwise.

    Args:
        profile: Tendon profile.
        x_mm: Stations, mm.
        f_pj_MPa: Jacking stress, MPa (> 0).
        mu: Curvature friction coefficient, per rad (>= 0).
        K_per_mm: Wobble coefficient per mm of tendon (>= 0).
        E_p_MPa: Modulus of elasticity of the strand, MPa (> 0).
        set_mm: Anchor set (wedge seat), mm (>= 0).
        jacking: ``"left"``, ``"right"`` or ``"both"``.

    Returns:
        Stresses and losses at the stations.

    Raises:
        ValueError: If an argument is out of range, or the set is so large that the stress after
            set would be negative somewhere.
    """
    x = np.atleast_1d(np.asarray(x_mm, dtype=float))
    profile._locate(x)  # range check of the stations
    args, zones, xn = _checked_zones(profile, f_pj_MPa, mu, K_per_mm, E_p_MPa, set_mm, jacking)
    return _evaluate(profile, x, zones, xn, *args, jacking)


def _checked_zones(
    profile: TendonProfile,
    f_pj_MPa: float,
    mu: float,
    K_per_mm: float,
    E_p_MPa: float,
    set_mm: float,
    jacking: JackingEnd,
) -> tuple[
    tuple[float, float, float, float], tuple[tuple[AnchorSetZone, AnchorEnd], ...], float | None
]:
    """The arguments checked, and the anchor-set zones and neutral point they give.

    Returns ((f_pj, mu, K, set), zones, neutral point).
    """
    f_pj_MPa, mu, K_per_mm = _check_friction_args(f_pj_MPa, mu, K_per_mm)
    E_p_MPa = _positive("E_p_MPa", E_p_MPa, "MPa")
    set_mm = _non_negative("set_mm", set_mm, "mm")
    _check_end(jacking)
    zones, xn = _zones(profile, f_pj_MPa, mu, K_per_mm, E_p_MPa, set_mm, jacking)
    return (f_pj_MPa, mu, K_per_mm, set_mm), zones, xn


def post_tensioning_stresses_along(
    profile: TendonProfile,
    n: int = 241,
    *,
    f_pj_MPa: float,
    mu: float,
    K_per_mm: float,
    E_p_MPa: float,
    set_mm: float,
    jacking: JackingEnd = "left",
) -> PostTensionedStresses:
    """Stresses after friction and set from anchor to anchor, with the set-zone ends as stations.

    :func:`post_tensioning_stresses` on ``n`` evenly spaced stations from anchor to anchor, plus
    the ends of the anchor-set zones and the neutral point. The stress after set has a kink
    (its peak) at the end of each anchor-set zone; having that station in the grid makes the
    peak exact and linear interpolation between stations close.

    Args:
        profile: Tendon profile.
        n: Number of evenly spaced stations (>= 2).
        f_pj_MPa: Jacking stress, MPa (> 0).
        mu: Curvature friction coefficient, per rad (>= 0).
        K_per_mm: Wobble coefficient per mm of tendon (>= 0).
        E_p_MPa: Modulus of elasticity of the strand, MPa (> 0).
        set_mm: Anchor set (wedge seat), mm (>= 0).
        jacking: ``"left"``, ``"right"`` or ``"both"``.

    Returns:
        Stresses and losses at the stations (sorted, without duplicates).
    """
    if n < 2:
        raise ValueError(f"n must be >= 2, got {n!r}")
    args, zones, xn = _checked_zones(profile, f_pj_MPa, mu, K_per_mm, E_p_MPa, set_mm, jacking)
    x0, x1 = profile.x_start_mm, profile.x_end_mm
    extra = [z.x_set_mm for z, _ in zones] + ([] if xn is None else [xn])
    x = np.unique(np.concatenate([np.linspace(x0, x1, n), np.clip(extra, x0, x1)]))
    return _evaluate(profile, x, zones, xn, *args, jacking)


def _evaluate(
    profile: TendonProfile,
    x: NDArray[np.float64],
    zones: tuple[tuple[AnchorSetZone, AnchorEnd], ...],
    xn: float | None,
    f_pj_MPa: float,
    mu: float,
    K_per_mm: float,
    set_mm: float,
    jacking: str,
) -> PostTensionedStresses:
    f_fric = np.asarray(
        friction_stress(profile, x, f_pj_MPa=f_pj_MPa, mu=mu, K_per_mm=K_per_mm, jacking=jacking)
    )
    loss_set = np.zeros_like(x)
    for zone, end in zones:
        f_end = _friction_one_end(profile, x, f_pj_MPa, mu, K_per_mm, end)
        loss = zone.loss_MPa(x, f_end)
        if xn is not None:
            loss = np.where(x <= xn if end == "left" else x >= xn, loss, 0.0)
        loss_set = np.maximum(loss_set, loss)
    after = f_fric - loss_set
    if np.any(after < 0.0):
        raise ValueError(
            f"set_mm = {set_mm} mm is too large: the stress after anchor set would be negative"
        )
    return PostTensionedStresses(
        x_mm=x,
        f_pj_MPa=f_pj_MPa,
        f_px_friction_MPa=f_fric,
        f_p_after_set_MPa=after,
        loss_friction_MPa=f_pj_MPa - f_fric,
        loss_anchor_set_MPa=loss_set,
        loss_total_MPa=f_pj_MPa - after,
        anchor_set_zones=tuple(z for z, _ in zones),
        neutral_point_mm=xn,
    )


# --------------------------------------------------------------------------- elongation
def jack_elongation(
    profile: TendonProfile,
    *,
    f_pj_MPa: float,
    mu: float,
    K_per_mm: float,
    E_p_MPa: float,
    jacking: JackingEnd = "left",
    stressing_end_length_mm: float = 0.0,
) -> dict[str, float]:
    """Expected elongation at each jack, Δ = ∫ fpx ds / Ep (+ fpj L_jack / Ep), mm.

    What it covers: the strand stretched from zero stress to the stress after friction of the
    jacking stress fpj, BEFORE seating (the anchor set is not deducted: it occurs after the
    elongation is read), by Hooke's law on the strand alone. The integral runs along the tendon
    over the part each jack stresses (the whole tendon for one end; its side of the neutral
    point for both ends, stressed together). The optional stressing-end term adds the free
    strand length between the anchorage and the jack's grip, stressed at fpj without friction.
    Not included: the elastic shortening of the concrete under the tendon's own force (the jack
    reads it too, but it is small), and any elongation below an initial stress from which the
    field reading starts. Comparing with the field: a measured elongation within about ±5 to
    7 % of the computed one is common practice (see :func:`elongation_deviation`).

    Args:
        profile: Tendon profile.
        f_pj_MPa: Jacking stress, MPa (> 0).
        mu: Curvature friction coefficient, per rad (>= 0).
        K_per_mm: Wobble coefficient per mm of tendon (>= 0).
        E_p_MPa: Modulus of elasticity of the strand, MPa (> 0).
        jacking: ``"left"``, ``"right"`` or ``"both"``.
        stressing_end_length_mm: Free strand length from the anchorage to the jack's grip at
            each stressing end, mm (>= 0).

    Returns:
        Elongation per stressing end, mm, keyed ``"left"`` and/or ``"right"``.
    """
    f_pj_MPa, mu, K_per_mm = _check_friction_args(f_pj_MPa, mu, K_per_mm)
    E_p_MPa = _positive("E_p_MPa", E_p_MPa, "MPa")
    extra = _non_negative("stressing_end_length_mm", stressing_end_length_mm, "mm")
    _check_end(jacking)
    x0, x1 = profile.x_start_mm, profile.x_end_mm
    if jacking == "both":
        xn = neutral_point(profile, f_pj_MPa=f_pj_MPa, mu=mu, K_per_mm=K_per_mm)
        parts: list[tuple[AnchorEnd, float, float]] = [
            ("left", x0, xn),
            ("right", xn, x1),
        ]
    else:
        parts = [("left" if jacking == "left" else "right", x0, x1)]
    result: dict[str, float] = {}
    for end, a, b in parts:

        def fw(x: NDArray[np.float64], end: AnchorEnd = end) -> NDArray[np.float64]:
            f = _friction_one_end(profile, x, f_pj_MPa, mu, K_per_mm, end)
            return f * np.asarray(profile.length_weight(x), dtype=float)

        area = _integrate(fw, a, b, profile.joints_mm)
        result[end] = (area + f_pj_MPa * extra) / E_p_MPa
    return result


def elongation_deviation(
    measured_mm: float, computed_mm: float, tolerance: float = 0.07
) -> tuple[float, bool]:
    """Deviation of a measured jack elongation from the computed one.

    Agreement within about ±7 % is common practice; the tolerance is the user's to set.

    Args:
        measured_mm: Elongation measured in the field, mm (>= 0).
        computed_mm: Computed elongation, mm (> 0).
        tolerance: Accepted relative deviation (> 0); default 0.07.

    Returns:
        (measured / computed − 1, True if its magnitude is within ``tolerance``).
    """
    measured = _non_negative("measured_mm", measured_mm, "mm")
    computed = _positive("computed_mm", computed_mm, "mm")
    tol = _positive("tolerance", tolerance, "(fraction)")
    dev = measured / computed - 1.0
    return dev, abs(dev) <= tol
