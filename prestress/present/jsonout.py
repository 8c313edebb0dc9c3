"""Machine-readable output of a check (layout documented in ``docs/json-output.md``).

Every quantity is ``{"value": number, "unit": "text"}`` in the job's output system; stages
are a list of objects with their name and stations; a top-level ``ok``.
"""

from __future__ import annotations

import json
from typing import Any

from prestress import __version__
from prestress.analysis import SIGN_CONVENTION, CheckResult, FiberResult, StationResult
from prestress.present.common import CAUTION, live_load_text, quantity

SCHEMA = "prestress.check/1"


def _fiber(f: FiberResult, system: str) -> dict[str, Any]:
    return {
        "stress": quantity(f.stress, system, "stress"),
        "compression_limit": quantity(f.compression_limit, system, "stress"),
        "tension_limit": quantity(f.tension_limit, system, "stress"),
        "limit_rule": f.limit_text,
        "utilisation": f.utilisation,
        "ok": f.ok,
        "prestress_factor": f.prestress_factor,
    }


def _station(s: StationResult, system: str) -> dict[str, Any]:
    return {
        "name": s.name,
        "position_from_girder_end": quantity(s.x, system, "position"),
        "position_from_bearing": quantity(s.x_bearing, system, "position"),
        "force": quantity(s.force, system, "force"),
        "eccentricity": quantity(s.eccentricity, system, "dimension"),
        "moments": {k: quantity(v, system, "moment") for k, v in s.moments.items()},
        "moment": quantity(s.moment, system, "moment"),
        "cgs_height": quantity(s.cgs, system, "dimension"),
        "fibers": {k: _fiber(f, system) for k, f in s.fibers.items()},
        "ok": s.ok,
    }


def _shear(shear: tuple | None, which: int, i: int, system: str) -> dict[str, Any] | None:
    return None if shear is None else quantity(float(shear[which][i]), system, "force")


def _loads(result: CheckResult, system: str) -> dict[str, Any] | None:
    """Unfactored moments by load and the live-load shear per girder, with the live load."""
    le = result.loads
    if le is None:
        return None
    live = result.girder.job.loads.live
    a = result.girder.job.bearing_offset
    shear = le.shear_live
    return {
        "live_load": {
            "model": live.model,
            "impact": live.impact if live.model == "HL-93" else None,
            "distribution_factor_moment": live.distribution_factor
            if live.model == "HL-93"
            else None,
            "distribution_factor_moment_source": live.distribution_source
            if live.model == "HL-93"
            else None,
            "distribution_factor_shear": live.shear_distribution_factor,
            "distribution_factor_shear_source": live.shear_distribution_source or None,
            "description": live_load_text(result),
        },
        "stations": [
            {
                "name": st.name,
                "position_from_girder_end": quantity(st.x, system, "position"),
                "position_from_bearing": quantity(st.x - a, system, "position"),
                "moments": {
                    k: quantity(float(v[i]), system, "moment") for k, v in le.moments.items()
                },
                "shear_live_max": _shear(shear, 0, i, system),
                "shear_live_min": _shear(shear, 1, i, system),
            }
            for i, st in enumerate(le.stations)
        ],
    }


def to_dict(result: CheckResult, system: str | None = None) -> dict[str, Any]:
    """The check result as plain JSON-ready data."""
    g = result.girder
    job = g.job
    system = system or job.units
    gross = g.gross
    sec: dict[str, Any] = {
        "name": g.section_name,
        "source": g.section_source,
        "gross": {
            "area": quantity(gross.area, system, "area"),
            "yb": quantity(gross.yb, system, "dimension"),
            "yt": quantity(gross.yt, system, "dimension"),
            "height": quantity(gross.height, system, "dimension"),
            "Ix": quantity(gross.Ix, system, "inertia"),
            "Iy": quantity(gross.Iy, system, "inertia"),
            "Sb": quantity(gross.Sb, system, "modulus"),
            "St": quantity(gross.St, system, "modulus"),
            "perimeter": quantity(gross.perimeter, system, "dimension"),
            "volume_to_surface": quantity(gross.volume_to_surface, system, "dimension"),
            "self_weight": quantity(g.self_weight, system, "line_load"),
        },
    }
    if g.composite_section is not None:
        c = g.composite_section
        sec["composite"] = {
            "modular_ratio_deck": g.n_deck,
            "area": quantity(c.area, system, "area"),
            "yb": quantity(c.yb, system, "dimension"),
            "I": quantity(c.I, system, "inertia"),
            "S": {k: quantity(c.S(k), system, "modulus") for k in c.fibers},
        }
    L = result.losses
    losses = {
        "method": L.method,
        "title": L.title,
        "jacking_stress": quantity(L.jacking_stress, system, "stress"),
        "components": [
            {
                "key": c.key,
                "label": c.label,
                "period": c.period,
                "loss": quantity(c.value, system, "stress"),
                "percent_of_jacking": 100.0 * c.value / L.jacking_stress,
                "clause": c.clause,
                "applied": c.applied,
            }
            for c in L.components
        ],
        "total": quantity(L.total, system, "stress"),
        "stress_after_transfer": quantity(L.f_pt, system, "stress"),
        "effective_stress": quantity(L.f_pe, system, "stress"),
        "force_after_transfer": quantity(L.f_pt * job.A_ps, system, "force"),
        "effective_force": quantity(L.f_pe * job.A_ps, system, "force"),
        "notes": list(L.notes),
    }
    stages = [
        {
            "name": s.key,
            "title": s.title,
            "description": s.description,
            "ok": s.ok,
            "stations": [_station(st, system) for st in s.stations],
            "notes": list(s.notes),
        }
        for s in result.stages
    ]
    return {
        "schema": SCHEMA,
        "prestress_version": __version__,
        "job": {
            "file": job.file,
            "title": job.title,
            "project": job.project,
            "owner": job.owner,
            "engineer": job.engineer,
        },
        "units": system,
        "sign_convention": SIGN_CONVENTION.replace("−", "-"),
        "section": sec,
        "strands": {
            "count": job.strand_count,
            "area": quantity(job.A_ps, system, "area"),
            "centroid_height": quantity(job.y_ps, system, "dimension"),
            "eccentricity_gross": quantity(g.eccentricity_gross, system, "dimension"),
            "transfer_length": quantity(job.transfer_length, system, "dimension"),
        },
        "losses": losses,
        "loads": _loads(result, system),
        "stages": stages,
        "zone": [
            {
                "station": z.station.name,
                "position_from_girder_end": quantity(z.station.x, system, "position"),
                "lowest_cgs": quantity(z.low, system, "dimension"),
                "highest_cgs": quantity(z.high, system, "dimension"),
                "cgs": quantity(z.cgs, system, "dimension"),
                "inside": z.inside,
                "margin": quantity(z.margin, system, "dimension"),
                "lower_bound_set_by": z.governing_low or None,
                "upper_bound_set_by": z.governing_high or None,
            }
            for z in result.zone
        ],
        "notes": list(result.notes),
        "ok": result.ok,
        "failures": result.failures(),
        "conditions": list(result.conditions),
        "caution": CAUTION,
    }


def to_json(result: CheckResult, system: str | None = None) -> str:
    """The check result as JSON text (no NaN or infinity: those would be a bug)."""
    return json.dumps(to_dict(result, system), indent=2, ensure_ascii=False, allow_nan=False) + "\n"
