"""Property tests of the stage engine and the time-step analysis (hypothesis).

- Superposition (linear elasticity, common practice): in every stage the stress increment of
  all the loads together equals the sum of the increments of each load alone, each carried by
  its own section (girder alone or composite).
- Relaxation never decreases with time, and neither do the creep, shrinkage and whole
  time-dependent losses while the girder carries only its prestress and self-weight (transfer
  to deck placement), whatever the humidity, ages and model (creep and shrinkage functions are
  non-decreasing in time). After the deck is cast the shares may fall: the deck's weight
  relieves the compression at the strands (creep recovery; AASHTO LRFD 5.9.3.4.3b's ΔfpCD can
  be a gain too) and the deck's own shrinkage lengthens the strands (the deck shrinkage gain of
  5.9.3.4.3d), so they are not asserted there.
"""

from __future__ import annotations

from dataclasses import replace

import numpy as np
import pytest
from hypothesis import HealthCheck, given, settings
from hypothesis import strategies as st

from prestress.analysis import resolve_girder
from prestress.jobfile import load_job
from prestress.losses import compute_losses
from prestress.losses.timestep_method import analyse
from prestress.model import LiveLoad, Times
from prestress.stages import stage_specs, stage_stresses, stations
from tests.conftest import EXAMPLES, US_EXAMPLE

HARPED = EXAMPLES / "harl-brook-span1-g2-harped.toml"
KIP_FT = 4448.2216152605 / 304.8  # N/mm per kip/ft


@pytest.fixture(scope="module")
def base_girder():
    return resolve_girder(load_job(HARPED))


@settings(
    max_examples=200, deadline=None, suppress_health_check=[HealthCheck.function_scoped_fixture]
)
@given(
    sdl=st.floats(0.0, 2.0),
    dw=st.floats(0.0, 1.0),
    live=st.floats(0.0, 4000.0),
    factor=st.floats(0.5, 1.5),
)
def test_stage_increments_add_up(
    base_girder,
    sdl: float,
    dw: float,
    live: float,
    factor: float,
) -> None:
    job = base_girder.job
    loads = replace(
        job.loads,
        superimposed_dead=sdl * KIP_FT,
        wearing_surface=dw * KIP_FT,
        live=LiveLoad(moment_midspan=live * 4448.2216152605 * 304.8, moments_tenth_points=None),
    )
    girder = replace(base_girder, job=replace(job, loads=loads))
    losses = compute_losses(girder)
    sts = stations(girder)
    for spec in stage_specs(girder):
        spec = replace(spec, dead=factor * spec.dead)
        full = stage_stresses(girder, losses, spec, sts)
        none = stage_stresses(girder, losses, replace(spec, loads=()), sts)
        parts = [stage_stresses(girder, losses, replace(spec, loads=(k,)), sts) for k in spec.loads]
        for fiber, f in full.stresses.items():
            if fiber not in none.stresses:
                continue  # the deck top exists only in stages with composite loads
            total = sum(
                p.stresses[fiber] - none.stresses[fiber] for p in parts if fiber in p.stresses
            )
            np.testing.assert_allclose(f - none.stresses[fiber], total, rtol=1e-9, atol=1e-9)


@settings(max_examples=200, deadline=None)
@given(
    # below about 94 % humidity: above 99 % βs1 fib MC2010 Eq. 5.1-78 turns drying shrinkage into
    # swelling (a gain), a genuine feature of that model, not a fault
    rh=st.floats(40.0, 90.0),
    transfer=st.floats(1.0, 3.0),
    deck=st.floats(30.0, 200.0),
    final=st.floats(3000.0, 30000.0),
    model=st.sampled_from(["aashto", "aci209", "mc2010", "en1992"]),
)
def test_time_dependent_losses_grow_with_time(
    rh: float, transfer: float, deck: float, final: float, model: str
) -> None:
    girder = resolve_girder(load_job(US_EXAMPLE))
    job = replace(
        girder.job,
        times=Times(relative_humidity=rh, transfer=transfer, deck_placement=deck, final=final),
    )
    res, _ages = analyse(replace(girder, job=job), model, n_steps=40)
    assert np.all(np.diff(res.losses["relaxation"][:, 0, :], axis=0) >= -1e-9)
    before_deck = res.ages < deck - 1e-9
    for key in ("shrinkage", "creep"):
        assert np.all(np.diff(res.losses[key][before_deck, 0, :], axis=0) >= -1e-9), key
    lt = res.long_term_loss[before_deck, 0, :]  # records × layers, girder alone
    assert np.all(np.diff(lt, axis=0) >= -1e-9)
    assert np.all(res.long_term_loss[-1, 0, :] > 0)
