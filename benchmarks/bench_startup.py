"""Start-up: `prestress check` on the shipped example from a cold process with a warm cache,
against `python -c "import numpy, pint, rich"`, measured side by side, alternating, in one run.

Target: the check takes at most 1.3 times the bare imports.

    python benchmarks/bench_startup.py [--quick]
"""

from __future__ import annotations

import argparse
import os
import statistics
import subprocess
import sys
import tempfile
import time
from pathlib import Path

ROOT = Path(__file__).resolve().parents[1]
EXAMPLE = ROOT / "examples" / "brannoch-creek-span2-g3.toml"


def timed(cmd: list[str], env: dict[str, str]) -> float:
    t0 = time.perf_counter()
    subprocess.run(
        cmd, check=False, stdout=subprocess.DEVNULL, stderr=subprocess.DEVNULL, env=env, cwd=ROOT
    )
    return time.perf_counter() - t0


def main() -> None:
    parser = argparse.ArgumentParser(description=__doc__)
    parser.add_argument("--quick", action="store_true", help="few repeats (CI)")
    args = parser.parse_args()
    env = dict(os.environ)
    env.setdefault("PRESTRESS_CACHE_DIR", tempfile.mkdtemp(prefix="prestress-bench-"))
    env["PYTHONPATH"] = str(ROOT) + os.pathsep + env.get("PYTHONPATH", "")
    script = Path(sys.executable).with_name("prestress")  # the installed console script
    check = ([str(script)] if script.is_file() else [sys.executable, "-m", "prestress"]) + [
        "check",
        str(EXAMPLE),
    ]
    base = [sys.executable, "-c", "import numpy, pint, rich"]
    # byte-compile the package as an installer does: with PYTHONDONTWRITEBYTECODE set (as on
    # some machines) an editable or source-tree copy would otherwise be compiled on every run
    subprocess.run(
        [sys.executable, "-m", "compileall", "-q", str(ROOT / "prestress")],
        check=False,
        stdout=subprocess.DEVNULL,
        env={k: v for k, v in env.items() if k != "PYTHONDONTWRITEBYTECODE"},
    )
    timed(check, env)  # warm the section and unit caches (and the OS file cache)
    timed(base, env)
    n = 2 if args.quick else 21
    t_check, t_base = [], []
    for _ in range(n):
        t_check.append(timed(check, env))
        t_base.append(timed(base, env))
    c, b = statistics.median(t_check), statistics.median(t_base)
    print(
        f"{Path(check[0]).name} check (warm cache), median of {n}: {c:.3f} s "
        f"(fastest {min(t_check):.3f} s)"
    )
    print(
        f"python -c 'import numpy, pint, rich', median of {n}: {b:.3f} s "
        f"(fastest {min(t_base):.3f} s)"
    )
    print(
        f"ratio of the medians: {c / b:.2f} (target <= 1.30); "
        f"of the fastest runs: {min(t_check) / min(t_base):.2f}"
    )


if __name__ == "__main__":
    main()
