"""Benchmark: time-step analysis of losses and stresses of a girder with a composite deck.

Runs ``prestress.losses.timestep.run_timestep`` on an invented 72-in. bulb-tee-like girder with
an 8-in. deck (invented inputs), 101 stations, 200 time steps and 3 strand layers (one of them
harped, so its height differs at every station), with the AASHTO LRFD creep and shrinkage
model, and prints the median elapsed time of a few runs against a budget of 0.1 s.

It reports; it does not assert: the exit status is 0 whatever the timing.

Usage:
    python benchmarks/bench_timestep.py            # full size
    python benchmarks/bench_timestep.py --quick    # small size (CI, so the script cannot rot)
"""

from __future__ import annotations

import argparse
import statistics
import sys
import time
from pathlib import Path

try:
    import prestress  # noqa: F401
except ModuleNotFoundError:  # run from a clone without installing
    sys.path.insert(0, str(Path(__file__).resolve().parents[1]))

import numpy as np

from prestress.losses.models import KCF_N_MM3, make_model
from prestress.losses.timestep import ConcretePart, LoadEvent, StrandLayer, run_timestep
from prestress.units import INCH_MM, KIP_N, KSI_MPA

BUDGET_S = 0.100


def build(n_stations: int):
    """Parts, strand layers and load events of the invented girder at ``n_stations``."""
    IN, KSI, KIP_IN = INCH_MM, KSI_MPA, KIP_N * INCH_MM
    wc = 0.150 * KCF_N_MM3
    girder = make_model(
        "aashto",
        f_c=8 * KSI,
        f_ci=5.8 * KSI,
        unit_weight=wc,
        relative_humidity=70.0,
        volume_to_surface=2.85 * IN,
        age_at_end_of_curing=1.0,
    )
    deck = make_model(
        "aashto",
        f_c=4 * KSI,
        unit_weight=wc,
        relative_humidity=70.0,
        volume_to_surface=4.0 * IN,
        age_at_end_of_curing=1.0,
    )
    parts = [
        ConcretePart(
            "girder", 767 * IN**2, 545_894 * IN**4, 36.6 * IN, girder, 0.0,
            {"bottom": 0.0, "top": 72 * IN},
        ),
        ConcretePart(
            "deck", 768 * IN**2, 96 * 8**3 / 12 * IN**4, 76 * IN, deck, 90.0,
            {"top": 80 * IN},
        ),
    ]  # fmt: skip
    x = np.linspace(0.0, 1.0, n_stations)
    shape = 4.0 * x * (1.0 - x)  # parabolic moment diagram of a uniform load
    harp = np.minimum(x, 1.0 - x) / 0.4  # harped layer: 36 in. at the ends, 6 in. from 0.4 L
    a = 0.217 * IN**2
    layers = [
        StrandLayer(14 * a, 2 * IN, 28_500 * KSI, 202.5 * KSI, 243 * KSI, name="row 1"),
        StrandLayer(14 * a, 4 * IN, 28_500 * KSI, 202.5 * KSI, 243 * KSI, name="row 2"),
        StrandLayer(
            12 * a, (36.0 - 30.0 * np.minimum(harp, 1.0)) * IN, 28_500 * KSI, 202.5 * KSI,
            243 * KSI, name="harped",
        ),
    ]  # fmt: skip
    events = [
        LoadEvent(1.0, 17_260 * KIP_IN * shape, 0.0, "girder", "self-weight"),
        LoadEvent(90.0, 17_280 * KIP_IN * shape, 0.0, "girder", "deck"),
        LoadEvent(118.0, 6_480 * KIP_IN * shape, 0.0, "composite", "superimposed dead load"),
    ]
    return parts, layers, events, x


def main(argv: list[str] | None = None) -> int:
    parser = argparse.ArgumentParser(description=__doc__.splitlines()[0])
    parser.add_argument("--quick", action="store_true", help="small size, for CI")
    args = parser.parse_args(argv)
    n_stations, n_steps, repeats = (11, 40, 3) if args.quick else (101, 200, 7)
    parts, layers, events, x = build(n_stations)

    def run():
        return run_timestep(
            parts, layers, events, [20_000.0], n_steps, stations=x, transfer_age=1.0
        )

    result = run()  # warm-up (imports, caches)
    times = []
    for _ in range(repeats):
        t = time.perf_counter()
        run()
        times.append(time.perf_counter() - t)
    elapsed = statistics.median(times)
    n_records = len(result.ages) - 1
    print(
        f"timestep {n_stations} stations x {n_steps} steps: {elapsed:.3f} s "
        f"(budget {BUDGET_S:.3f} s, ratio {elapsed / BUDGET_S:.2f}); "
        f"per step {1e3 * elapsed / n_records:.2f} ms"
    )
    mid = n_stations // 2
    loss = result.long_term_loss[-1, mid] / KSI_MPA
    print(f"  check: long-term loss at midspan by layer (ksi): {np.round(loss, 2).tolist()}")
    return 0


if __name__ == "__main__":
    sys.exit(main())
