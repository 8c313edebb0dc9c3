"""Unit tests of the tendon profile geometry, friction, anchor set and elongation engine."""

import itertools
import math

import numpy as np
import pytest
from hypothesis import given, settings
from hypothesis import strategies as st

from prestress.tendons import (
    TendonProfile,
    elongation_deviation,
    friction_stress,
    jack_elongation,
    neutral_point,
    post_tensioning_stresses,
    post_tensioning_stresses_along,
)

FT = 304.8
FRICTION = {"f_pj_MPa": 1489.0, "mu": 0.25, "K_per_mm": 0.0002 / FT}
E_P = 196_500.0
SET = 9.525

# Invented three-span layout: 30 m + 40 m + 30 m, girder 2000 mm deep.
X3 = (0.0, 12_000.0, 30_000.0, 50_000.0, 70_000.0, 88_000.0, 100_000.0)
Y3 = (1000.0, 200.0, 1800.0, 200.0, 1800.0, 200.0, 1000.0)


@pytest.fixture
def three_span() -> TendonProfile:
    return TendonProfile(X3, Y3, inflection_fraction=0.15, girder_depth_mm=2000.0)


@pytest.fixture
def simple_span() -> TendonProfile:
    return TendonProfile((0.0, 18_000.0, 36_000.0), (900.0, 150.0, 900.0))


def test_control_points_reproduced(three_span: TendonProfile) -> None:
    assert np.allclose(three_span.height(np.array(X3)), Y3, rtol=0, atol=1e-9)


def test_height_and_slope_continuous_at_joins(three_span: TendonProfile) -> None:
    joints = three_span.joints_mm
    assert len(joints) == 5 + 4  # 5 interior control points + 4 inflection points
    segs = three_span.segments
    for left, right in itertools.pairwise(segs):
        xj = left.x_end_mm
        assert right.x_start_mm == xj
        assert float(left.height(xj)) == pytest.approx(float(right.height(xj)), abs=1e-9)
        assert float(left.slope(xj)) == pytest.approx(float(right.slope(xj)), abs=1e-12)
    # Sampled just either side of each joint.
    eps = 1e-6
    for xj in joints:
        y_l, y_r = three_span.height([xj - eps, xj + eps])
        s_l, s_r = three_span.slope([xj - eps, xj + eps])
        assert y_l == pytest.approx(y_r, abs=1e-6)
        assert s_l == pytest.approx(s_r, abs=1e-8)


def test_horizontal_tangent_at_interior_points(three_span: TendonProfile) -> None:
    assert np.allclose(three_span.slope(np.array(X3[1:-1])), 0.0, atol=1e-15)
    # The low point is a minimum, the high point a maximum.
    assert three_span.height(12_000.0) < three_span.height(11_000.0)
    assert three_span.height(30_000.0) > three_span.height(29_000.0)


def test_inflection_point_on_chord_with_twice_chord_slope(three_span: TendonProfile) -> None:
    # Standard geometry of two parabolas with horizontal end tangents meeting with a common
    # tangent: the inflection point lies on the chord and its slope is twice the chord slope.
    x_h, y_h, x_l, y_l = 30_000.0, 1800.0, 12_000.0, 200.0
    x_inf = x_h - 0.15 * (x_h - x_l)
    assert x_inf in three_span.inflection_points_mm
    chord = (y_h - y_l) / (x_h - x_l)
    assert three_span.height(x_inf) == pytest.approx(y_h - chord * (x_h - x_inf), abs=1e-9)
    assert three_span.slope(x_inf) == pytest.approx(2.0 * chord, rel=1e-12)


def test_per_pair_inflection_fractions() -> None:
    p = TendonProfile(X3, Y3, inflection_fraction=(0.1, 0.2, 0.2, 0.1))
    assert 30_000.0 - 0.1 * 18_000.0 in p.inflection_points_mm
    assert 30_000.0 + 0.2 * 20_000.0 in p.inflection_points_mm


def test_scalar_in_scalar_out_and_vector_shape(three_span: TendonProfile) -> None:
    assert isinstance(three_span.height(5000.0), float)
    x = np.linspace(0.0, 100_000.0, 12).reshape(3, 4)
    assert three_span.height(x).shape == (3, 4)
    assert three_span.angular_change(x).shape == (3, 4)
    assert three_span.length_along(x).shape == (3, 4)


def test_angular_change_monotonic_and_from_both_ends(three_span: TendonProfile) -> None:
    x = np.linspace(0.0, 100_000.0, 2001)
    a_left = three_span.angular_change(x)
    a_right = three_span.angular_change(x, "right")
    assert a_left[0] == 0.0
    assert np.all(np.diff(a_left) >= -1e-15)
    assert np.allclose(a_left + a_right, three_span.total_angular_change_rad, atol=1e-12)
    # Independent check: sum of |dθ| on a fine grid.
    xf = np.linspace(0.0, 100_000.0, 400_001)
    theta = np.arctan(three_span.slope(xf))
    assert three_span.total_angular_change_rad == pytest.approx(
        np.sum(np.abs(np.diff(theta))), rel=1e-9
    )


def test_arc_length_against_numerical_integration(three_span: TendonProfile) -> None:
    xf = np.linspace(0.0, 100_000.0, 200_001)
    w = np.sqrt(1.0 + three_span.slope(xf) ** 2)
    assert three_span.tendon_length_mm == pytest.approx(np.trapezoid(w, xf), rel=1e-9)
    assert three_span.length_along(50_000.0) == pytest.approx(
        np.trapezoid(w[:100_001], xf[:100_001]), rel=1e-9
    )


def test_single_span_needs_no_inflection_fraction(simple_span: TendonProfile) -> None:
    assert simple_span.inflection_fraction is None
    assert simple_span.inflection_points_mm == ()


def test_profile_input_errors() -> None:
    with pytest.raises(ValueError, match="inflection_fraction"):
        TendonProfile(X3, Y3)
    with pytest.raises(ValueError, match="inflection_fraction"):
        TendonProfile(X3, Y3, inflection_fraction=1.0)
    with pytest.raises(ValueError, match="inflection_fraction"):
        TendonProfile(X3, Y3, inflection_fraction=(0.1, 0.2))
    with pytest.raises(ValueError, match="x_mm"):
        TendonProfile((0.0, 1.0), (1.0, 1.0))
    with pytest.raises(ValueError, match="y_mm"):
        TendonProfile((0.0, 1.0, 2.0), (1.0, 1.0))
    p = TendonProfile((0.0, 18_000.0, 36_000.0), (900.0, 150.0, 900.0))
    with pytest.raises(ValueError, match="x_mm"):
        p.height(36_001.0)


def test_friction_both_ends_symmetric(three_span: TendonProfile) -> None:
    x = np.linspace(0.0, 100_000.0, 101)
    left = friction_stress(three_span, x, **FRICTION, jacking="left")
    right = friction_stress(three_span, x, **FRICTION, jacking="right")
    both = friction_stress(three_span, x, **FRICTION, jacking="both")
    assert np.allclose(left, right[::-1], rtol=1e-12)
    assert np.all(both >= left) and np.all(both >= right)
    assert np.all(np.diff(left) <= 1e-12)
    assert neutral_point(three_span, **FRICTION) == pytest.approx(50_000.0, abs=1e-6)


def test_stresses_after_set(simple_span: TendonProfile) -> None:
    x = np.linspace(0.0, 36_000.0, 3601)
    r = post_tensioning_stresses(simple_span, x, **FRICTION, E_p_MPa=E_P, set_mm=SET)
    (zone,) = r.anchor_set_zones
    assert 0.0 < zone.x_set_mm < 36_000.0
    assert np.allclose(r.loss_total_MPa, r.loss_friction_MPa + r.loss_anchor_set_MPa)
    beyond = x > zone.x_set_mm
    assert np.all(r.loss_anchor_set_MPa[beyond] == 0.0)
    assert np.allclose(r.f_p_after_set_MPa[beyond], r.f_px_friction_MPa[beyond])
    # Continuous at x_set, and lowest at the anchor inside the zone.
    f_at_set = friction_stress(simple_span, zone.x_set_mm, **FRICTION)
    assert f_at_set == pytest.approx(zone.f_px_at_x_set_MPa, rel=1e-12)
    assert r.f_p_after_set_MPa[0] == pytest.approx(FRICTION["f_pj_MPa"] - zone.loss_at_anchor_MPa)
    assert np.all(np.diff(r.f_p_after_set_MPa[x < zone.x_set_mm]) > 0.0)


def test_jacking_right_mirrors_left(simple_span: TendonProfile) -> None:
    x = np.linspace(0.0, 36_000.0, 37)
    left = post_tensioning_stresses(simple_span, x, **FRICTION, E_p_MPa=E_P, set_mm=SET)
    right = post_tensioning_stresses(
        simple_span, x, **FRICTION, E_p_MPa=E_P, set_mm=SET, jacking="right"
    )
    assert np.allclose(left.f_p_after_set_MPa, right.f_p_after_set_MPa[::-1], rtol=1e-9)


def test_set_reaching_far_end_lowers_whole_tendon() -> None:
    short = TendonProfile((0.0, 4000.0, 8000.0), (600.0, 400.0, 600.0))
    r = post_tensioning_stresses(short, [0.0, 4000.0, 8000.0], **FRICTION, E_p_MPa=E_P, set_mm=SET)
    (zone,) = r.anchor_set_zones
    assert zone.reaches_limit
    assert zone.x_set_mm == 8000.0
    assert r.loss_anchor_set_MPa[2] == pytest.approx(zone.loss_at_x_set_MPa) and (
        zone.loss_at_x_set_MPa > 0.0
    )


def test_set_too_large_raises(simple_span: TendonProfile) -> None:
    with pytest.raises(ValueError, match="set_mm"):
        post_tensioning_stresses(simple_span, [0.0], **FRICTION, E_p_MPa=E_P, set_mm=1000.0)


def test_bad_jacking_end(simple_span: TendonProfile) -> None:
    with pytest.raises(ValueError, match="jacking"):
        friction_stress(simple_span, 0.0, **FRICTION, jacking="middle")  # type: ignore[arg-type]


def test_elongation_both_ends(three_span: TendonProfile) -> None:
    one = jack_elongation(three_span, **FRICTION, E_p_MPa=E_P)
    both = jack_elongation(three_span, **FRICTION, E_p_MPa=E_P, jacking="both")
    assert both["left"] == pytest.approx(both["right"], rel=1e-9)
    # Stressing from both ends raises the stress in the far half: more total elongation.
    assert both["left"] + both["right"] > one["left"]
    assert one["left"] < FRICTION["f_pj_MPa"] * three_span.tendon_length_mm / E_P


def test_elongation_deviation() -> None:
    dev, ok = elongation_deviation(265.0, 250.0)
    assert dev == pytest.approx(0.06)
    assert ok
    assert not elongation_deviation(230.0, 250.0)[1]  # -8 %


@settings(max_examples=40, deadline=None)
@given(
    lows=st.lists(st.floats(100.0, 600.0), min_size=2, max_size=3),
    highs=st.lists(st.floats(1200.0, 1900.0), min_size=1, max_size=2),
    fraction=st.floats(0.05, 0.5),
    spacing=st.lists(st.floats(5_000.0, 25_000.0), min_size=6, max_size=6),
)
def test_continuity_property(
    lows: list[float], highs: list[float], fraction: float, spacing: list[float]
) -> None:
    n_high = min(len(highs), len(lows) - 1)
    interior: list[float] = []
    for i in range(n_high):
        interior += [lows[i], highs[i]]
    interior.append(lows[n_high])
    y = [1000.0, *interior, 1000.0]
    x = [0.0]
    for dx in spacing[: len(y) - 1]:
        x.append(x[-1] + dx)
    p = TendonProfile(tuple(x), tuple(y), inflection_fraction=fraction, girder_depth_mm=2000.0)
    for xj in p.joints_mm:
        y_l, y_r = p.height([xj - 1e-7, xj + 1e-7])
        s_l, s_r = p.slope([xj - 1e-7, xj + 1e-7])
        assert math.isclose(y_l, y_r, abs_tol=1e-6)
        assert math.isclose(s_l, s_r, abs_tol=1e-8)
    xs = np.linspace(x[0], x[-1], 501)
    assert np.all(p.height(xs) >= min(y) - 1e-9) and np.all(p.height(xs) <= max(y) + 1e-9)


@pytest.mark.parametrize("jacking", ["left", "right", "both"])
def test_stresses_along_hold_the_set_ends_and_agree(
    three_span: TendonProfile, jacking: str
) -> None:
    """The grid of post_tensioning_stresses_along: evenly spaced stations plus the ends of the
    anchor-set zones (and the neutral point), the same stresses as post_tensioning_stresses."""
    kw = {**FRICTION, "E_p_MPa": E_P, "set_mm": SET, "jacking": jacking}
    r = post_tensioning_stresses_along(three_span, 101, **kw)
    assert np.all(np.diff(r.x_mm) > 0)
    assert r.x_mm[0] == X3[0] and r.x_mm[-1] == X3[-1]
    for z in r.anchor_set_zones:
        assert z.x_set_mm in r.x_mm
    if jacking == "both":
        assert r.neutral_point_mm in r.x_mm
    ref = post_tensioning_stresses(three_span, r.x_mm, **kw)
    assert np.array_equal(ref.f_p_after_set_MPa, r.f_p_after_set_MPa)
    assert len(r.x_mm) >= 101
    with pytest.raises(ValueError, match="n must"):
        post_tensioning_stresses_along(three_span, 1, **kw)
