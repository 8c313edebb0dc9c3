"""Candidate checks per second: the vectorised design evaluator against the one-girder check
looped over the same candidates, measured side by side in one run.

A candidate check is one strand pattern checked at every station of every stage (every
fiber against its limits). The girder is the debonded demo girder (Wexcombe Lane G4, BT-63,
refined losses, HL-93) searched with four debonded lengths. Targets: at least 100,000
candidate checks per second on one core, and at least 100 times the loop. The script prints
the rates and ratios and exits 0 whatever the timing.

    python benchmarks/bench_design.py [--quick]
"""

from __future__ import annotations

import argparse
import os
import tempfile
import time
from dataclasses import replace
from pathlib import Path

# one core: keep the BLAS behind numpy's matrix product single-threaded (set before numpy loads)
for _var in ("OPENBLAS_NUM_THREADS", "OMP_NUM_THREADS", "MKL_NUM_THREADS"):
    os.environ.setdefault(_var, "1")
os.environ.setdefault("PRESTRESS_CACHE_DIR", tempfile.mkdtemp(prefix="prestress-bench-"))

import numpy as np  # noqa: E402

from prestress.analysis import check_fiber, resolve_girder, run_check  # noqa: E402
from prestress.design import Evaluator, enumerate_space, governing_of, read_design  # noqa: E402
from prestress.jobfile import load_job  # noqa: E402
from prestress.losses import compute_losses  # noqa: E402
from prestress.stages import stage_specs, stage_stresses, stations  # noqa: E402

ROOT = Path(__file__).resolve().parents[1]
JOB = ROOT / "examples" / "wexcombe-lane-g4-debonded.toml"
DESIGN = {"debond_lengths": ["6 ft", "10 ft", "14 ft", "20 ft"]}


def stage_loop_utilisation(ev: Evaluator, i: int) -> float:
    """One candidate through the ordinary stage functions: losses, stations, stages, limits."""
    job = ev.candidate_job(int(i))
    g = ev.girders[int(ev.enum.level[i])]
    girder = replace(g, job=replace(g.job, rows=job.rows, layout=job.layout))
    losses = compute_losses(girder)
    sts = stations(girder)
    gc = job.girder_concrete
    worst = 0.0
    for spec in stage_specs(girder):
        raw = stage_stresses(girder, losses, spec, sts)
        strength = gc.fci if spec.strength == "fci" else gc.fc
        for fiber, f in raw.stresses.items():
            fc = job.deck.concrete.fc if fiber == "deck_top" and job.deck else strength
            lim = job.limits.get(spec.key, fiber)
            for v in f:
                r = check_fiber(float(v), lim, fc, "f")
                u = r.utilisation if r.utilisation is not None else (0.0 if r.ok else np.inf)
                worst = max(worst, u)
    return worst


def main() -> int:
    ap = argparse.ArgumentParser(description=__doc__.splitlines()[0])
    ap.add_argument("--quick", action="store_true", help="a small size (CI)")
    args = ap.parse_args()
    n_vector = 20_000 if args.quick else 300_000
    n_loop = 6 if args.quick else 40

    job = load_job(JOB)
    girder = resolve_girder(job)
    t0 = time.perf_counter()
    space = read_design(DESIGN, job, girder, file=str(JOB))
    enum = enumerate_space(space, file=str(JOB))
    t1 = time.perf_counter()
    ev = Evaluator(job, space, enum)
    t2 = time.perf_counter()
    print(f"job: {JOB.name}; space: {enum.size:,} candidates over {len(enum.levels)} fill levels")
    print(
        f"enumerate {t1 - t0:.3f} s; setup (per level: sections, losses; stations) {t2 - t1:.3f} s"
    )

    # vectorised: the whole space, repeated up to n_vector candidate checks
    reps = max(1, -(-n_vector // enum.size))
    idx = np.tile(np.arange(enum.size), reps)[:n_vector]
    ev.evaluate(idx[: min(len(idx), 2000)])  # warm-up
    best = np.inf
    for _ in range(3):
        res = ev.evaluate(idx)
        best = min(best, res.seconds)
    rate_vec = len(idx) / best
    print(f"vectorised: {len(idx):,} candidate checks in {best:.3f} s -> {rate_vec:,.0f} per s")

    rng = np.random.default_rng(7)
    sample = rng.choice(enum.size, size=min(n_loop, enum.size), replace=False)
    vec = ev.evaluate(sample).utilisation

    t = time.perf_counter()
    loop_stage = [stage_loop_utilisation(ev, int(i)) for i in sample]
    rate_stage = len(sample) / (time.perf_counter() - t)
    t = time.perf_counter()
    loop_full = [governing_of(run_check(ev.candidate_job(int(i))))[1] for i in sample]
    rate_full = len(sample) / (time.perf_counter() - t)
    print(f"loop of the stage functions: {len(sample)} candidates -> {rate_stage:,.1f} per s")
    print(f"loop of run_check on rebuilt jobs: {len(sample)} candidates -> {rate_full:,.1f} per s")
    diff = max(
        max(abs(a - b) for a, b in zip(vec, loop_stage, strict=True)),
        max(abs(a - b) for a, b in zip(vec, loop_full, strict=True)),
    )
    print(f"largest difference in governing utilisation, vectorised vs loops: {diff:.2e}")
    print(
        f"ratio vectorised / stage-function loop: {rate_vec / rate_stage:,.0f}x; "
        f"vectorised / run_check loop: {rate_vec / rate_full:,.0f}x"
    )
    met = rate_vec >= 100_000 and rate_vec / rate_stage >= 100
    print(
        "targets (>= 100,000 per s on one core, >= 100x the loop): "
        + ("met" if met else "not met on this machine")
    )
    return 0


if __name__ == "__main__":
    raise SystemExit(main())
