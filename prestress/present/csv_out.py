"""CSV export of a check: one file per stage table, the loads, the losses and the zone.

Every file has one header row; each column's name carries its unit in square brackets
(``x [ft]``, ``stress girder_bottom [ksi]``) in the output system, written as plain ASCII
(pint-parsable: ``kip*ft``, ``in**2``). Stresses follow the sign convention of the tool:
tension positive, compression negative. Empty cells mean "not applicable" (no limit of
that sign, no bound). Numbers are written with up to ten significant digits and a point as
the decimal separator; booleans as ``true``/``false``. Files are written atomically.
"""

from __future__ import annotations

import csv
import io
from collections.abc import Iterable, Sequence
from pathlib import Path
from typing import Any

from prestress.analysis import CheckResult, StageResult
from prestress.errors import InputError
from prestress.present.common import LOAD_TITLES, value
from prestress.units import ascii_label, out_unit

FIBERS = ("girder_bottom", "girder_top", "deck_top")

#: The loads whose moments a stage table can list, in order.
MOMENT_KEYS = ("girder", "deck", "diaphragms", "superimposed", "live")


def _unit(system: str, role: str) -> str:
    return ascii_label(out_unit(system, role).label)


def _num(v: float | None, system: str | None = None, role: str | None = None) -> str:
    """A number for a CSV cell ('' for None), converted to the output unit when a role is given."""
    if v is None:
        return ""
    x = value(v, system, role) if system is not None and role is not None else v
    if x != x or x in (float("inf"), float("-inf")):  # NaN or infinite: not a value
        return ""
    return format(x, ".10g")


def _bool(b: bool) -> str:
    return "true" if b else "false"


def _text(rows: Iterable[Sequence[Any]]) -> str:
    buf = io.StringIO()
    w = csv.writer(buf, lineterminator="\n")
    w.writerows(rows)
    return buf.getvalue()


def stage_rows(stage: StageResult, system: str) -> list[list[str]]:
    """The table of one stage: a header row with units, then one row per station."""
    fibers = [f for f in FIBERS if any(f in s.fibers for s in stage.stations)]
    loads = [k for k in MOMENT_KEYS if any(k in s.moments for s in stage.stations)]
    loads += sorted({k for s in stage.stations for k in s.moments} - set(loads))
    pu, fu, du = _unit(system, "position"), _unit(system, "force"), _unit(system, "dimension")
    mu, su = _unit(system, "moment"), _unit(system, "stress")
    header = [
        "station",
        f"x from left end [{pu}]",
        f"x from left bearing [{pu}]",
        f"force P [{fu}]",
        f"eccentricity e [{du}]",
        f"cgs height [{du}]",
        *[f"moment {k} [{mu}]" for k in loads],
        f"moment total [{mu}]",
    ]
    for f in fibers:
        header += [
            f"stress {f} [{su}]",
            f"compression limit {f} [{su}]",
            f"tension limit {f} [{su}]",
            f"utilisation {f} [1]",
            f"ok {f}",
        ]
    header.append("ok")
    rows = [header]
    for s in stage.stations:
        row = [
            s.name,
            _num(s.x, system, "position"),
            _num(s.x_bearing, system, "position"),
            _num(s.force, system, "force"),
            _num(s.eccentricity, system, "dimension"),
            _num(s.cgs, system, "dimension"),
            *[_num(s.moments.get(k, 0.0), system, "moment") for k in loads],
            _num(s.moment, system, "moment"),
        ]
        for f in fibers:
            fr = s.fibers.get(f)
            if fr is None:
                row += ["", "", "", "", ""]
                continue
            row += [
                _num(fr.stress, system, "stress"),
                _num(fr.compression_limit, system, "stress"),
                _num(fr.tension_limit, system, "stress"),
                _num(fr.utilisation),
                _bool(fr.ok),
            ]
        row.append(_bool(s.ok))
        rows.append(row)
    return rows


def losses_rows(result: CheckResult, system: str) -> list[list[str]]:
    """The losses: one row per component (kind "loss"), the total, then the milestones.

    Milestone rows (kind "stress") give the strand stress at jacking, just after transfer,
    at deck placement (where the method gives it) and at the final age.
    """
    b = result.losses
    su = _unit(system, "stress")
    rows = [
        [
            "kind",
            "key",
            "label",
            "period",
            "age [day]",
            f"value [{su}]",
            "percent of fpj [percent]",
            "applied",
            "clause",
        ]
    ]
    fpj = b.jacking_stress
    for c in b.components:
        rows.append(
            [
                "loss",
                c.key,
                c.label,
                c.period,
                "",
                _num(c.value, system, "stress"),
                _num(100.0 * c.value / fpj),
                _bool(c.applied),
                c.clause,
            ]
        )
    rows.append(
        [
            "loss",
            "total",
            "Total loss (fpj − fpe)",
            "",
            "",
            _num(b.total, system, "stress"),
            _num(100.0 * b.total / fpj),
            "",
            b.title,
        ]
    )
    for m in b.milestones:
        rows.append(
            [
                "stress",
                m.key,
                f"Strand stress {m.label}",
                "",
                _num(m.age),
                _num(m.stress, system, "stress"),
                _num(100.0 * m.stress / fpj),
                "",
                "",
            ]
        )
    return rows


def zone_rows(result: CheckResult, system: str) -> list[list[str]]:
    """The permissible zone of the cgs at each checked station (heights above the bottom)."""
    pu, du = _unit(system, "position"), _unit(system, "dimension")
    rows = [
        [
            "station",
            f"x from left end [{pu}]",
            f"lowest cgs [{du}]",
            f"cgs [{du}]",
            f"highest cgs [{du}]",
            f"margin [{du}]",
            "inside",
            "lower bound set by",
            "upper bound set by",
        ]
    ]
    for z in result.zone:
        rows.append(
            [
                z.station.name,
                _num(z.station.x, system, "position"),
                _num(z.low, system, "dimension"),
                _num(z.cgs, system, "dimension"),
                _num(z.high, system, "dimension"),
                _num(z.margin, system, "dimension"),
                _bool(z.inside),
                z.governing_low,
                z.governing_high,
            ]
        )
    return rows


def loads_rows(result: CheckResult, system: str) -> list[list[str]]:
    """Unfactored moments by load and the live-load shear per girder at the span's stations."""
    le = result.loads
    if le is None:
        return []
    pu, mu, fu = _unit(system, "position"), _unit(system, "moment"), _unit(system, "force")
    keys = [k for k in LOAD_TITLES if k in le.moments]
    header = ["station", f"x from left end [{pu}]", f"x from left bearing [{pu}]"]
    header += [f"moment {k} [{mu}]" for k in keys]
    if le.shear_live is not None:
        header += [f"shear live max [{fu}]", f"shear live min [{fu}]"]
    rows = [header]
    a = result.girder.job.bearing_offset
    for i, st in enumerate(le.stations):
        row = [st.name, _num(st.x, system, "position"), _num(st.x - a, system, "position")]
        row += [_num(float(le.moments[k][i]), system, "moment") for k in keys]
        if le.shear_live is not None:
            row += [_num(float(v[i]), system, "force") for v in le.shear_live]
        rows.append(row)
    return rows


def write_csv(
    result: CheckResult,
    folder: str | Path,
    system: str | None = None,
    *,
    force: bool = False,
    inputs: list[Path] | None = None,
) -> list[Path]:
    """Write the check as CSV files: one per stage, ``loads.csv``, ``losses.csv``, ``zone.csv``.

    Every target is checked before anything is written, so a refusal leaves the folder as it
    was. The folder is created when missing.

    Args:
        result: the check.
        folder: the folder to write into.
        system: "US" or "SI" (default: the job's output units).
        force: replace existing files (never an input).
        inputs: the files the job reads, none of which may be a target (default: the job
            file; the command line gives :func:`prestress.inputs.input_files`).

    Returns:
        The files written, in order (stages in time order, then loads, losses and zone).

    Raises:
        InputError: a target exists and ``force`` is not set, or the folder is a file.
    """
    system = system or result.girder.job.units
    out = Path(folder)
    if out.exists() and not out.is_dir():
        raise InputError("a folder for the CSV files", file=str(out), got="an existing file")
    tables: list[tuple[Path, list[list[str]]]] = [
        (out / f"{s.key}.csv", stage_rows(s, system)) for s in result.stages
    ]
    if result.loads is not None:
        tables.append((out / "loads.csv", loads_rows(result, system)))
    tables.append((out / "losses.csv", losses_rows(result, system)))
    tables.append((out / "zone.csv", zone_rows(result, system)))
    from prestress.atomic import check_output_path, write_atomic

    if inputs is None:
        inputs = [Path(result.girder.job.file)] if result.girder.job.file else []
    for path, _ in tables:
        check_output_path(path, inputs=inputs, force=force)

    for path, rows in tables:
        write_atomic(path, _text(rows))
    return [p for p, _ in tables]
