"""HL-93 envelopes on simple spans against pycba and against closed forms.

Sources:

* pycba (PyPI, AGPL; used here in tests only, never by ``prestress``): moving-load analysis
  with ``pycba.BridgeAnalysis.run_vehicle`` for a ``pycba.Vehicle`` on a
  ``pycba.BeamAnalysis`` simple span, and static ``BeamAnalysis`` runs for the lane load.
* AASHTO LRFD Bridge Design Specifications, 9th Ed. (2020): design truck 3.6.1.2.2, design
  tandem 3.6.1.2.3, design lane load 3.6.1.2.4, dynamic load allowance 3.6.2.1, combination
  3.6.1.3.1.
* Absolute maximum moment of a moving load group on a simple span (the maximum occurs under
  the axle nearest the resultant when the span centre line bisects the distance between that
  axle and the resultant): R. C. Hibbeler, "Structural Analysis", chapter on influence lines,
  section "Absolute maximum shear and moment" (from memory; edition and section number not
  checked).
* Lane-load formulas wL^2/8, wL/2, w(L - x)^2/2L: statics of a simply supported beam
  (common practice).

pycba runs in kip and ft (it is unit-agnostic); our results are converted from N and N*mm
with the exact factors of :mod:`prestress.loads.hl93`.

Tolerance against pycba: pycba steps the vehicle. Here the step (0.4 ft) equals pycba's
result-grid spacing (npts = L / 0.4 ft) and divides every axle spacing (4, 14, 30 ft) and
every station, so pycba's positions include the exact critical positions (an axle over the
station) and its results are exact there (stiffness method with exact fixed-end actions for
point loads). Shear is read at pycba's "shear points", 1e-9 L either side of the station, so
the jump under an axle is resolved. What remains is rounding and that 1e-9 L offset, hence
relative 1e-7 with an absolute floor of 1e-6 kip or kip-ft.
"""

from __future__ import annotations

import numpy as np
import pycba
import pytest

from prestress.loads.hl93 import (
    LANE_LOAD_N_PER_MM,
    MM_PER_FT,
    N_PER_KIP,
    hl93_envelope,
    truck_rear_spacings_mm,
)

KIP_FT = N_PER_KIP * MM_PER_FT  # N*mm per kip-ft
STEP_FT = 0.4
REL = 1e-7
ABS = 1e-6
SPANS_FT = (40.0, 80.0, 120.0)
W_LANE_KLF = 0.64


def _stations(L: float) -> np.ndarray:
    return np.linspace(0.0, L, 21)  # twentieth points: multiples of 0.4 ft for these spans


def _pycba_vehicle_envelope(L: float, spacings, weights, stations):
    """Max M, max V, min V of a vehicle crossing a simple span in both directions (pycba)."""
    ba = pycba.BeamAnalysis([L], 1.0, [-1, 0, -1, 0])
    ba.npts = round(L / STEP_FT)
    veh = pycba.Vehicle(np.array(spacings, dtype=float), np.array(weights, dtype=float))
    interior = stations[(stations > 0.0) & (stations < L)]
    M = np.full(stations.size, -np.inf)
    V_max = np.full(interior.size, -np.inf)
    V_min = np.full(interior.size, np.inf)
    for v in (veh, veh.reverse(in_place=False)):
        env = pycba.BridgeAnalysis(ba, v).run_vehicle(STEP_FT, shear_points=interior)
        for k, s in enumerate(stations):
            near = np.flatnonzero(np.abs(env.x - s) < 1e-6 * L)
            M[k] = max(M[k], env.Mmax[near[len(near) // 2]])
        for k, s in enumerate(interior):
            near = np.flatnonzero(np.abs(env.x - s) < 1e-6 * L)
            # near = [s - 1e-9 L, s, s + 1e-9 L]: just left for V_max, just right for V_min
            V_max[k] = max(V_max[k], env.Vmax[near[0]])
            V_min[k] = min(V_min[k], env.Vmin[near[-1]])
    return M, V_max, V_min


@pytest.fixture(scope="module", params=SPANS_FT, ids=lambda L: f"L{L:g}ft")
def case(request):
    L = request.param
    st = _stations(L)
    ours = hl93_envelope(L * MM_PER_FT, st * MM_PER_FT, impact=0.0)
    return L, st, ours


def test_truck_vs_pycba(case):
    # AASHTO 3.6.1.2.2 design truck 8-32-32 kip, 14 ft front spacing, rear spacing 14 to
    # 30 ft: pycba is run with the two ends of the range and the envelope of both is taken.
    L, st, ours = case
    runs = [_pycba_vehicle_envelope(L, [14.0, s], [8.0, 32.0, 32.0], st) for s in (14.0, 30.0)]
    M = np.maximum(runs[0][0], runs[1][0])
    V_max = np.maximum(runs[0][1], runs[1][1])
    V_min = np.minimum(runs[0][2], runs[1][2])
    np.testing.assert_allclose(ours.M_truck / KIP_FT, M, rtol=REL, atol=ABS)
    np.testing.assert_allclose(ours.V_truck_max[1:-1] / N_PER_KIP, V_max, rtol=REL, atol=ABS)
    np.testing.assert_allclose(ours.V_truck_min[1:-1] / N_PER_KIP, V_min, rtol=REL, atol=ABS)
    # the 30 ft spacing alone never exceeds our envelope (14 ft governs on a simple span)
    assert np.all(runs[1][0] <= ours.M_truck / KIP_FT + ABS)
    assert np.all(runs[1][1] <= ours.V_truck_max[1:-1] / N_PER_KIP + ABS)


def test_tandem_vs_pycba(case):
    # AASHTO 3.6.1.2.3 design tandem, 2 x 25 kip at 4 ft.
    L, st, ours = case
    M, V_max, V_min = _pycba_vehicle_envelope(L, [4.0], [25.0, 25.0], st)
    np.testing.assert_allclose(ours.M_tandem / KIP_FT, M, rtol=REL, atol=ABS)
    np.testing.assert_allclose(ours.V_tandem_max[1:-1] / N_PER_KIP, V_max, rtol=REL, atol=ABS)
    np.testing.assert_allclose(ours.V_tandem_min[1:-1] / N_PER_KIP, V_min, rtol=REL, atol=ABS)


def test_lane_vs_pycba(case):
    # AASHTO 3.6.1.2.4 lane load 0.64 klf: whole span for moment (pycba UDL); for shear at
    # x the part of the span beyond x (max) or before x (min) (pycba partial UDL).
    L, st, ours = case
    ba = pycba.BeamAnalysis([L], 1.0, [-1, 0, -1, 0], [[1, 1, W_LANE_KLF]])
    ba.npts = round(L / STEP_FT)
    ba.analyze()
    res = ba.beam_results.results
    grid = res.x[1:-1]
    M = np.interp(st, grid, res.M[1:-1])  # stations are grid points: exact
    np.testing.assert_allclose(ours.M_lane / KIP_FT, M, rtol=REL, atol=ABS)
    for k, s in enumerate(st[1:-1], start=1):
        ba.set_loads([[1, 3, W_LANE_KLF, s, L - s]])
        ba.analyze()
        r = ba.beam_results.results
        i = 1 + int(np.argmin(np.abs(r.x[1:-1] - s)))
        assert ours.V_lane_max[k] / N_PER_KIP == pytest.approx(r.V[i], rel=REL, abs=ABS)
        ba.set_loads([[1, 3, W_LANE_KLF, 0.0, s]])
        ba.analyze()
        r = ba.beam_results.results
        i = 1 + int(np.argmin(np.abs(r.x[1:-1] - s)))
        assert ours.V_lane_min[k] / N_PER_KIP == pytest.approx(r.V[i], rel=REL, abs=ABS)


@pytest.mark.parametrize("L", SPANS_FT)
def test_truck_absolute_max_moment_resultant_rule(L):
    # Resultant rule (Hibbeler, from memory): resultant of 8-32-32 kip at 14 ft is
    # (32 x 14 + 32 x 28) / 72 = 18.667 ft behind the front axle, i.e. 4.667 ft from the
    # middle axle, which is the axle nearest it. Middle axle at a = L/2 - 4.667/2:
    #   M_abs = 72 (L/2 - 7/3)^2 / L - 8 x 14   (kip-ft; all axles on the span for L >= 33 ft)
    a = L / 2.0 - 7.0 / 3.0
    M_abs = 72.0 * a**2 / L - 8.0 * 14.0
    st = np.sort(np.concatenate([np.linspace(0.0, L, 2001), [a, L - a]]))
    ours = hl93_envelope(L * MM_PER_FT, st * MM_PER_FT, impact=0.0)
    M = ours.M_truck / KIP_FT
    assert M.max() == pytest.approx(M_abs, rel=1e-12)
    assert M[np.searchsorted(st, a)] == pytest.approx(M_abs, rel=1e-12)
    assert M[np.searchsorted(st, L - a)] == pytest.approx(M_abs, rel=1e-12)  # other direction


@pytest.mark.parametrize("L", SPANS_FT)
def test_tandem_absolute_max_moment_resultant_rule(L):
    # Resultant rule (Hibbeler, from memory): resultant 50 kip midway between the axles,
    # 2 ft from each; axle at a = L/2 - 1 ft: M_abs = 50 (L/2 - 1)^2 / L (kip-ft); it beats
    # one axle alone (25 L / 4) for L > 6.83 ft.
    a = L / 2.0 - 1.0
    M_abs = 50.0 * a**2 / L
    st = np.sort(np.concatenate([np.linspace(0.0, L, 2001), [a]]))
    ours = hl93_envelope(L * MM_PER_FT, st * MM_PER_FT, impact=0.0)
    assert (ours.M_tandem / KIP_FT).max() == pytest.approx(M_abs, rel=1e-12)


@pytest.mark.parametrize("L", SPANS_FT)
def test_midspan_and_support_closed_forms(L):
    # Statics of a simple span (common practice), kip and ft:
    #   truck, middle axle at midspan: 32 L/4 + (32 + 8)(L/2 - 14)/2 = 18 L - 280
    #   tandem, one axle at midspan:   25 L/4 + 25 (L/2 - 4)/2       = 12.5 L - 50
    #   lane: w L^2 / 8 at midspan, w L / 2 shear at the support
    #   truck shear at the support, rear 32 kip axle over it: 72 - (32 x 14 + 8 x 28)/L
    #   tandem shear at the support: 50 - 25 x 4 / L
    st = np.array([0.0, L / 2.0, L])
    e = hl93_envelope(L * MM_PER_FT, st * MM_PER_FT, impact=0.0)
    assert e.M_truck[1] / KIP_FT == pytest.approx(18.0 * L - 280.0, rel=1e-12)
    assert e.M_tandem[1] / KIP_FT == pytest.approx(12.5 * L - 50.0, rel=1e-12)
    assert e.M_lane[1] / KIP_FT == pytest.approx(W_LANE_KLF * L**2 / 8.0, rel=1e-12)
    assert e.V_lane_max[0] / N_PER_KIP == pytest.approx(W_LANE_KLF * L / 2.0, rel=1e-12)
    assert e.V_truck_max[0] / N_PER_KIP == pytest.approx(72.0 - 672.0 / L, rel=1e-12)
    assert e.V_tandem_max[0] / N_PER_KIP == pytest.approx(50.0 - 100.0 / L, rel=1e-12)
    # antisymmetry of shear on a simple span with both directions of travel
    assert e.V_truck_min[2] == pytest.approx(-e.V_truck_max[0], rel=1e-12)
    assert e.V_lane_min[2] == pytest.approx(-e.V_lane_max[0], rel=1e-12)


def test_combination_3_6_1_3_1_and_impact():
    # 3.6.1.3.1: max(truck, tandem) (1 + IM) + lane; IM = 0.33 (Table 3.6.2.1-1) on the
    # vehicles only, not on the lane load (3.6.2.1). 100 ft span, midspan, kip-ft:
    #   truck 18 x 100 - 280 = 1520, tandem 12.5 x 100 - 50 = 1200, lane 0.64 x 100^2/8 = 800
    #   M_LL+IM = 1.33 x 1520 + 800 = 2821.6
    L = 100.0
    e = hl93_envelope(L * MM_PER_FT, np.array([0.0, 50.0, 100.0]) * MM_PER_FT)
    assert e.impact == 0.33
    assert e.M_truck[1] / KIP_FT == pytest.approx(1.33 * 1520.0, rel=1e-12)
    assert e.M_lane[1] / KIP_FT == pytest.approx(800.0, rel=1e-12)
    assert e.M_LL_IM[1] / KIP_FT == pytest.approx(2821.6, rel=1e-12)
    assert bool(e.truck_governs_M[1])
    # support shear: 1.33 (72 - 6.72) + 0.64 x 50 = 1.33 x 65.28 + 32 = 118.8224 kip
    assert e.V_LL_IM_max[0] / N_PER_KIP == pytest.approx(118.8224, rel=1e-12)
    assert e.V_LL_IM_min[2] == pytest.approx(-e.V_LL_IM_max[0], rel=1e-12)


def test_tandem_governs_short_span():
    # 20 ft span, midspan, kip-ft, statics: tandem 25 x 5 + 25 x 3 = 200 (one axle at
    # midspan, the other 4 ft away: ordinate (10 - 4)/2 = 3); truck: one 32 kip axle at
    # midspan, ordinate 5 -> 160 (the others are 14 ft away, off the span) -> tandem governs.
    L = 20.0
    e = hl93_envelope(L * MM_PER_FT, np.array([10.0]) * MM_PER_FT, impact=0.0)
    assert e.M_tandem[0] / KIP_FT == pytest.approx(200.0, rel=1e-12)
    assert e.M_truck[0] / KIP_FT == pytest.approx(160.0, rel=1e-12)
    assert not bool(e.truck_governs_M[0])
    assert e.M_LL_IM[0] / KIP_FT == pytest.approx(200.0 + 0.64 * 400.0 / 8.0, rel=1e-12)


def test_rear_spacing_is_computed_and_14ft_governs():
    # 3.6.1.2.2: spacing varied 14 to 30 ft; evaluated at <= 1 ft steps, ends included.
    sp = truck_rear_spacings_mm()
    assert sp[0] == pytest.approx(14.0 * MM_PER_FT) and sp[-1] == pytest.approx(30.0 * MM_PER_FT)
    assert np.all(np.diff(sp) <= MM_PER_FT * (1 + 1e-12))
    L = 150.0 * MM_PER_FT
    e = hl93_envelope(L, np.linspace(0.0, L, 101))
    np.testing.assert_allclose(e.truck_rear_spacing_M_mm, 14.0 * MM_PER_FT, rtol=1e-12)
    # a finer step gives the same envelope (the ends of the range are exact)
    f = hl93_envelope(L, np.linspace(0.0, L, 101), truck_step_mm=100.0)
    np.testing.assert_allclose(f.M_truck, e.M_truck, rtol=1e-13)
    np.testing.assert_allclose(f.V_truck_max, e.V_truck_max, rtol=1e-13)


def test_units_and_input_checks():
    # Exact factors: 1 kip = 4448.2216152605 N, 1 ft = 304.8 mm; 0.64 klf in N/mm.
    expected = 0.64 * 4448.2216152605 / 304.8
    assert abs(LANE_LOAD_N_PER_MM - expected) <= 1e-15 * expected
    L = 30_000.0
    with pytest.raises(ValueError, match="stations_mm"):
        hl93_envelope(L, np.array([-1.0, 100.0]))
    with pytest.raises(ValueError, match="stations_mm"):
        hl93_envelope(L, np.array([L + 1.0]))
    with pytest.raises(ValueError, match="span_mm"):
        hl93_envelope(0.0, np.array([0.0]))
    with pytest.raises(ValueError, match="impact"):
        hl93_envelope(L, np.array([0.0]), impact=33.0)
    with pytest.raises(ValueError, match="truck_step_mm"):
        hl93_envelope(L, np.array([0.0]), truck_step_mm=0.0)
    e = hl93_envelope(L, np.array([0.0, L / 2, L]))
    with pytest.raises(ValueError):
        e.M_LL_IM[0] = 0.0  # results are read-only
