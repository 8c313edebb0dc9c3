"""Plots of a check for reports and reviews: section, stresses, zone, losses, Magnel diagram.

A heavy path: matplotlib is imported inside each plotting function only, and drawn with the
Agg canvas on a :class:`matplotlib.figure.Figure` (no pyplot, so no global backend switch).
Each function takes a :class:`~prestress.analysis.CheckResult`, an output path ending in
``.svg`` or ``.png`` and the output system ("US" or "SI") for the axis units, and writes the
file atomically (a temporary file in the same folder, then :func:`os.replace`). The plots are
plain and printable: black and greys with one accent per curve, line styles that survive
grey-scale printing, every axis labelled with its unit and, for stresses, the sign convention
(tension +, compression −).

The Magnel diagram's geometry (:func:`magnel_lines`, :func:`magnel_corners`) is plain
arithmetic on the check's own figures and needs no matplotlib.
"""

from __future__ import annotations

import itertools
import math
import os
from collections.abc import Callable, Sequence
from dataclasses import dataclass
from pathlib import Path
from typing import Any

import numpy as np

from prestress.analysis import SIGN_CONVENTION, CheckResult, StageResult, StationResult
from prestress.atomic import save_figure_atomic
from prestress.errors import InputError
from prestress.present.common import FIBER_NAMES, label, value

_INK = "#000000"
_GREY = "#777777"
_LIGHT = "#d9d9d9"
_FAIL = "#c00000"
#: Fiber curves: colour and line style (distinct in grey-scale print too).
_FIBER_STYLE = {
    "girder_bottom": ("#1f4e9c", "-"),
    "girder_top": ("#b35900", "--"),
    "deck_top": ("#2e7d32", "-."),
}
_FONT = 8.0


# ------------------------------------------------------------------------------------------
# Figures and files


def _figure(width_in: float, height_in: float) -> Any:
    """A matplotlib Figure on its own Agg canvas (no pyplot)."""
    from matplotlib.backends.backend_agg import FigureCanvasAgg
    from matplotlib.figure import Figure

    fig = Figure(figsize=(width_in, height_in))
    FigureCanvasAgg(fig)
    return fig


def _suffix(path: str | os.PathLike[str]) -> str:
    """The image format of an output path ("svg" or "png"); InputError otherwise."""
    fmt = Path(path).suffix.lower().lstrip(".")
    if fmt not in ("svg", "png"):
        raise InputError("an output file ending in .svg or .png", file=str(path), got=f".{fmt}")
    return fmt


def _save(fig: Any, path: str | os.PathLike[str]) -> Path:
    """Write a figure as SVG or PNG (by suffix), atomically: temporary file, then os.replace."""
    out = Path(path)
    fmt = _suffix(out)
    out.parent.mkdir(parents=True, exist_ok=True)
    save_figure_atomic(fig, out, fmt)
    return out


def _style_axes(ax: Any) -> None:
    ax.tick_params(labelsize=_FONT, direction="out", length=3)
    ax.grid(True, color="#e6e6e6", lw=0.5)
    ax.set_axisbelow(True)
    for side in ("top", "right"):
        ax.spines[side].set_visible(False)


def _ux(system: str, role: str) -> str:
    """An axis-label unit: the display label, or '1' for a ratio."""
    return label(system, role) or "1"


# ------------------------------------------------------------------------------------------
# Section


def plot_section(result: CheckResult, path: str | os.PathLike[str], system: str) -> Path:
    """The girder section to scale with its strands at midlength, deck and centroid.

    Reuses :func:`prestress.sections.draw.draw_section` (principal dimensions, centroid mark).

    Args:
        result: the check.
        path: ``.svg`` or ``.png`` file to write.
        system: "US" (inches) or "SI" (mm) for the dimensions.

    Returns:
        The path written.
    """
    from prestress.sections.draw import draw_section

    _suffix(path)
    g = result.girder
    job = g.job
    title = f"{g.section_name}: strands at midlength"
    ducts = None
    if job.post_tensioned:
        strands = []
        ducts = tendon_ducts_at_midlength(result)
        title = f"{g.section_name}: tendon ducts at midlength"
    elif job.layout is not None:
        strands = job.layout.all_strand_positions(job.length / 2.0)
    else:
        strands = [(float(x), r.height) for r in job.rows for x in r.x_positions()]
    deck = None
    if job.deck is not None:
        deck = (job.deck.effective_width, job.deck.thickness, job.deck.haunch)
    draw_section(
        g.polygon,  # type: ignore[arg-type]
        out_path=path,
        title=title,
        centroid_y_mm=g.gross.yb,
        strands_mm=strands,
        deck=deck,
        units=system,
        ducts_mm=ducts,
    )
    return Path(path)


def tendon_ducts_at_midlength(result: CheckResult) -> list[tuple[float, float, float, int]]:
    """Each tendon's duct at the girder's midlength: (x, y, outside diameter, strands), mm.

    On the girder axis at the profile height, as the section net of the open ducts assumes
    (:func:`prestress.sections.composite.section_at_stressing`).
    """
    job = result.girder.job
    xm = job.length / 2.0
    out = []
    for t in job.tendons:
        prof = t.profile()
        if prof.x_start_mm <= xm <= prof.x_end_mm:
            out.append((0.0, float(prof.height(xm)), t.duct_diameter, t.strands))
    return out


# ------------------------------------------------------------------------------------------
# Fiber stresses along the girder


def _dense_stations(result: CheckResult, n: int = 241) -> list:
    """Evenly spaced stations along the girder plus the checked ones (exact kinks at lt)."""
    from prestress.stages import Station

    L = result.girder.job.length
    xs = set(np.round(np.linspace(0.0, L, n), 6).tolist())
    for stage in result.stages:
        xs.update(round(s.x, 6) for s in stage.stations)
    return [Station(f"x{i}", float(x)) for i, x in enumerate(sorted(xs))]


def _dense_stage_curves(result: CheckResult) -> dict[str, tuple[np.ndarray, dict[str, np.ndarray]]]:
    """Fiber stresses of every stage on a dense set of stations: key → (x, stresses)."""
    from prestress.stages import stage_specs, stage_stresses

    dense = _dense_stations(result)
    out = {}
    for spec in stage_specs(result.girder):
        raw = stage_stresses(result.girder, result.losses, spec, dense)
        out[spec.key] = (raw.x, raw.stresses)
    return out


def _limits_of_stage(stage: StageResult) -> dict[float, list[str]]:
    """Distinct limit stresses of a stage (MPa) → the fibers and senses they apply to."""
    out: dict[float, list[str]] = {}
    for fiber in ("girder_bottom", "girder_top", "deck_top"):
        fr = next((s.fibers[fiber] for s in stage.stations if fiber in s.fibers), None)
        if fr is None:
            continue
        short = FIBER_NAMES[fiber].replace("girder ", "")
        if fr.compression_limit is not None:
            out.setdefault(round(fr.compression_limit, 9), []).append(f"{short} C")
        if fr.tension_limit is not None:
            out.setdefault(round(fr.tension_limit, 9), []).append(f"{short} T")
    return out


def _station_labels(stations: Sequence[StationResult], L: float) -> list[tuple[float, str]]:
    """Station names for a top axis, dropping names that would overlap a kept one."""
    kept: list[tuple[float, str]] = []
    for s in sorted(stations, key=lambda s: s.x):
        name = s.name.split(" / ")[0]
        if kept and abs(s.x - kept[-1][0]) < 0.018 * L:
            continue
        kept.append((s.x, name))
    return kept


def plot_stresses(result: CheckResult, path: str | os.PathLike[str], system: str) -> Path:
    """Fiber stresses along the girder, one panel per stage, with the limits and stations.

    Curves are evaluated on a dense set of points (the same engine as the check); the checked
    stations are marked on the curves (failing ones with a red cross) and by thin vertical
    lines, their names along the top; limit stresses are horizontal dotted lines labelled with
    the fiber and sense (C compression, T tension). Positions are from the left girder end in
    every panel so the panels align.

    Args:
        result: the check.
        path: ``.svg`` or ``.png`` file to write.
        system: "US" or "SI" for the axis units.

    Returns:
        The path written.
    """
    from matplotlib.lines import Line2D

    _suffix(path)
    if not result.stages:
        raise InputError("a check with at least one stage to plot", field="stages")
    curves = _dense_stage_curves(result)
    L = result.girder.job.length
    n = len(result.stages)
    panel_in, top_in, bottom_in = 1.9, 1.35, 0.75
    height = top_in + bottom_in + panel_in * n
    fig = _figure(8.0, height)
    fig.subplots_adjust(
        left=0.1, right=0.83, top=1.0 - top_in / height, bottom=bottom_in / height, hspace=0.42
    )
    axes = fig.subplots(n, 1, sharex=True, squeeze=False)[:, 0]
    su = label(system, "stress")
    pu = label(system, "position")
    xmax = value(L, system, "position")
    fibers_seen: list[str] = []
    for i, (ax, stage) in enumerate(zip(axes, result.stages, strict=True)):
        _style_axes(ax)
        x, stresses = curves[stage.key]
        xd = np.array([value(v, system, "position") for v in x])
        for st in stage.stations:
            ax.axvline(value(st.x, system, "position"), color="#cccccc", lw=0.4, zorder=0)
        ys: list[float] = [0.0]
        for fiber, f in stresses.items():
            if fiber not in fibers_seen:
                fibers_seen.append(fiber)
            colour, ls = _FIBER_STYLE[fiber]
            fd = [value(v, system, "stress") for v in f]
            ys += fd
            ax.plot(xd, fd, color=colour, ls=ls, lw=1.1)
            pts = [
                (value(s.x, system, "position"), s.fibers[fiber])
                for s in stage.stations
                if fiber in s.fibers
            ]
            good = [(px, value(fr.stress, system, "stress")) for px, fr in pts if fr.ok]
            bad = [(px, value(fr.stress, system, "stress")) for px, fr in pts if not fr.ok]
            if good:
                ax.plot(*zip(*good, strict=True), ls="none", marker="o", ms=2.6, color=colour)
            if bad:
                ax.plot(
                    *zip(*bad, strict=True),
                    ls="none",
                    marker="x",
                    ms=7,
                    mew=1.6,
                    color=_FAIL,
                    zorder=6,
                )
        for lim, who in _limits_of_stage(stage).items():
            yv = value(lim, system, "stress")
            ys.append(yv)
            ax.axhline(yv, color=_INK, ls=":", lw=0.9)
            ax.text(
                xmax,
                yv,
                f" {', '.join(who)} {yv:+.3g}".replace("-", "−"),
                fontsize=_FONT - 1.5,
                va="center",
                ha="left",
                clip_on=False,
            )
        lo, hi = min(ys), max(ys)
        pad = 0.08 * (hi - lo or 1.0)
        ax.set_ylim(lo - pad, hi + pad)
        ax.axhline(0.0, color=_GREY, lw=0.6)
        mark = "" if stage.ok else "  — LIMIT EXCEEDED"
        ax.set_title(
            f"{i + 1}. {stage.title}{mark}",
            fontsize=_FONT + 1,
            loc="left",
            color=_INK if stage.ok else _FAIL,
        )
        ax.set_ylabel(f"stress ({su})", fontsize=_FONT)
        ax.set_xlim(0.0, xmax)
    top = axes[0].secondary_xaxis("top")
    names = _station_labels(result.stages[0].stations, L)
    top.set_xticks([value(x, system, "position") for x, _ in names])
    top.set_xticklabels([nm for _, nm in names], rotation=90, fontsize=_FONT - 2)
    top.tick_params(length=2)
    axes[-1].set_xlabel(f"position from the left girder end ({pu})", fontsize=_FONT)
    handles = [
        Line2D(
            [], [], color=_FIBER_STYLE[f][0], ls=_FIBER_STYLE[f][1], lw=1.1, label=FIBER_NAMES[f]
        )
        for f in fibers_seen
    ]
    handles += [
        Line2D([], [], color=_GREY, ls="none", marker="o", ms=3, label="checked station"),
        Line2D([], [], color=_FAIL, ls="none", marker="x", ms=6, mew=1.6, label="limit exceeded"),
        Line2D([], [], color=_INK, ls=":", lw=0.9, label="limit"),
    ]
    fig.legend(
        handles=handles,
        loc="upper left",
        bbox_to_anchor=(0.1, 1.0 - 0.08 / height),
        ncol=len(handles),
        fontsize=_FONT - 1,
        frameon=False,
        handlelength=2.4,
    )
    job = result.girder.job
    factored = any(
        not job.limits.factors(s.limits_key or s.key, job.post_tensioned).unity
        for s in result.stages
    )
    fig.text(
        0.01,
        0.12 / height,
        f"Fiber stresses in {su}, {SIGN_CONVENTION}. Limits: C compression, T tension."
        + (
            "\nCurves with the mean prestress; the check takes the prestress × the limit "
            "set's factors (the stage tables)."
            if factored
            else ""
        ),
        fontsize=_FONT - 1,
        va="bottom",
    )
    return _save(fig, path)


# ------------------------------------------------------------------------------------------
# Permissible zone of the cgs


def plot_zone(result: CheckResult, path: str | os.PathLike[str], system: str) -> Path:
    """The permissible band of the cgs along the girder, the cgs, the outline and the marks.

    The band is evaluated with :func:`prestress.analysis.zone_at` on a dense set of stations
    (as ``prestress zone`` does); it is shaded where it lies within the girder depth, its
    edges drawn as thin lines, and marked in red along the bottom where it is empty. The girder
    bottom and top, the hold-downs (triangles on the top), the debond ends (dashed lines) and
    the checked stations (ticks) are drawn; for a post-tensioned girder, the tendon profiles
    (thin dashed lines) with the cgs of the effective prestress. Heights are exaggerated
    against the length.

    Args:
        result: the check.
        path: ``.svg`` or ``.png`` file to write.
        system: "US" or "SI" for the axis units.

    Returns:
        The path written.
    """
    from prestress.analysis import zone_at

    _suffix(path)
    g = result.girder
    job = g.job
    if not result.stages:
        raise InputError("a check with at least one stage for the zone", field="stages")
    L, h = job.length, g.gross.height
    profile = zone_at(g, result.losses, _dense_stations(result, 301))
    X = np.array([value(z.station.x, system, "position") for z in profile])
    dim = lambda v: value(v, system, "dimension")  # noqa: E731
    lo = np.array([dim(-1e9 if z.low is None else z.low) for z in profile])
    hi = np.array([dim(1e9 if z.high is None else z.high) for z in profile])
    cgs = np.array([dim(z.cgs) for z in profile])
    H = dim(h)
    fig = _figure(9.0, 4.2)
    ax = fig.add_axes((0.09, 0.24, 0.88, 0.66))
    _style_axes(ax)
    band_lo = np.clip(lo, 0.0, H)
    band_hi = np.clip(hi, 0.0, H)
    ok = band_hi > band_lo
    ax.fill_between(
        X,
        band_lo,
        band_hi,
        where=ok,
        color="#cfe8cf",
        lw=0,
        label="permissible band",
        interpolate=True,
    )
    pad = 0.12 * H
    ax.plot(X, np.clip(lo, -pad, H + pad), color="#2e7d32", lw=0.6)
    ax.plot(X, np.clip(hi, -pad, H + pad), color="#2e7d32", lw=0.6)
    empty = ~ok
    if empty.any():
        ax.fill_between(X, -0.04 * H, 0.0, where=empty, color=_FAIL, lw=0, label="no band")
    xL = value(L, system, "position")
    ax.plot([0, xL, xL, 0, 0], [0, 0, H, H, 0], color="#555555", lw=1.0, label="girder outline")
    for k, t in enumerate(job.tendons):
        prof = t.profile()
        xt = np.linspace(prof.x_start_mm, prof.x_end_mm, 121)
        ax.plot(
            [value(v, system, "position") for v in xt],
            [dim(v) for v in np.asarray(prof.height(xt))],
            color=_GREY,
            ls="--",
            lw=0.7,
            label="tendon profiles" if k == 0 else None,
        )
    ax.plot(X, cgs, color=_INK, lw=1.6, label="cgs")
    outside = np.array(
        [not z.inside and (z.low is not None or z.high is not None) for z in profile]
    )
    if outside.any():
        ax.plot(X, np.where(outside, cgs, np.nan), color=_FAIL, lw=2.6, zorder=5)
    out = [
        (value(z.station.x, system, "position"), dim(z.cgs))
        for z in result.zone
        if not z.inside and (z.low is not None or z.high is not None)
    ]
    if out:
        ax.plot(
            *zip(*out, strict=True),
            ls="none",
            marker="x",
            ms=7,
            mew=1.6,
            color=_FAIL,
            label="cgs outside the band",
        )
    for z in result.zone:
        ax.plot([value(z.station.x, system, "position")] * 2, [-0.04 * H, 0.0], color=_GREY, lw=0.7)
    if job.layout is not None:
        hd = [x for name, x in job.layout.key_positions() if name.endswith("hold-down")]
        if hd:
            ax.plot(
                [value(x, system, "position") for x in hd],
                [H * 1.03] * len(hd),
                ls="none",
                marker="v",
                ms=7,
                color=_INK,
                label="hold-down",
                clip_on=False,
            )
        db = [
            (name, x)
            for name, x in job.layout.key_positions()
            if "debond end" in name and not name.endswith("lt")
        ]
        for k, (_name, x) in enumerate(db):
            ax.axvline(
                value(x, system, "position"),
                color=_INK,
                ls="--",
                lw=0.7,
                label="debond end" if k == 0 else None,
            )
    ax.set_xlim(-0.01 * xL, 1.01 * xL)
    ax.set_ylim(-0.08 * H, H * 1.1)
    ax.set_xlabel(
        f"position from the left girder end ({label(system, 'position')})", fontsize=_FONT
    )
    ax.set_ylabel(f"height above the girder bottom ({label(system, 'dimension')})", fontsize=_FONT)
    ax.set_title(f"Permissible zone of the cgs — {job.title}", fontsize=_FONT + 2, loc="left")
    ax.legend(
        fontsize=_FONT - 1, loc="upper center", bbox_to_anchor=(0.5, -0.17), ncol=7, frameon=False
    )
    fig.text(
        0.09,
        0.015,
        "Band: cgs heights keeping both girder fibers within their limits in "
        "every stage; ticks: checked stations; vertical scale exaggerated.",
        fontsize=_FONT - 1,
    )
    return _save(fig, path)


# ------------------------------------------------------------------------------------------
# Strand stress with time


def _time_step_curve(result: CheckResult) -> tuple[list[tuple[float, float]], str]:
    """The strand stress of a time-step method along the girder's life (age d, MPa).

    From :func:`prestress.losses.timestep_method.history` at ages spaced evenly on the log
    scale from transfer to the final age, with the day before and after deck placement and
    the superimposed loads: the path the method computes between its milestones, elastic
    gains from later loads included (as ``prestress losses --at`` gives it).
    """
    from prestress.losses.timestep_method import history, superimposed_age

    job = result.girder.job
    t = job.times
    ages = set(np.geomspace(t.transfer, t.final, 48).tolist())
    for event in (t.deck_placement, superimposed_age(t)):  # the steps of the loads
        ages.update(a for a in (event - 1e-3, event + 1e-3) if t.transfer < a < t.final)
    model = result.losses.method.removeprefix("time-step-")
    rows = history(result.girder, model, tuple(sorted(a for a in ages if a <= t.final)))
    return (
        [(r.age, r.strand_stress) for r in rows],
        "time-step path (elastic gains of later loads included)",
    )


def plot_losses(
    result: CheckResult,
    path: str | os.PathLike[str],
    system: str,
    timestep: Sequence[tuple[float, float]] | None = None,
    timestep_label: str = "time-step analysis",
) -> Path:
    """Strand stress against the girder's age (log scale), from the loss breakdown.

    The milestones of the method (stress before transfer in the bed, just after transfer,
    at deck placement where the method gives it, final) are drawn as points joined by thin
    dotted lines: the method gives no path between them; a time-step method's own path is
    drawn too (:func:`_time_step_curve`). For a pretensioned girder, jacking is
    drawn at the left edge, as a level line held by the bed until transfer, where elastic
    shortening drops the stress. For a post-tensioned girder, the tendons are jacked at the
    age of stressing (the job's transfer age), where friction, anchor set and elastic
    shortening drop the stress at once; the stresses are those of the loss breakdown (at
    midlength, the tendons' area-weighted mean).

    Args:
        result: the check.
        path: ``.svg`` or ``.png`` file to write.
        system: "US" or "SI" for the stress unit.
        timestep: optional curve of (age in days, strand stress in MPa) points, e.g. from a
            time-step analysis, drawn as a solid line over the milestones.
        timestep_label: the legend text of that curve.

    Returns:
        The path written.
    """
    _suffix(path)
    b = result.losses
    job = result.girder.job
    t = job.times
    if timestep is None and b.method.startswith("time-step-"):
        timestep, timestep_label = _time_step_curve(result)
    su = label(system, "stress")
    s = lambda v: value(v, system, "stress")  # noqa: E731
    ages = [m.age for m in b.milestones if m.age is not None and m.age > 0]
    if timestep:
        ages += [a for a, _ in timestep if a > 0]
    t_min = min([t.transfer, *ages]) / 30.0  # room on the left for the transfer label
    t_max = max([t.final, *ages]) * 2.0
    pt = job.post_tensioned
    fig = _figure(8.0, 4.2)
    two_line_note = pt or bool(timestep)
    ax = fig.add_axes((0.1, 0.18, 0.72, 0.70) if two_line_note else (0.1, 0.14, 0.72, 0.74))
    _style_axes(ax)
    ax.set_xscale("log")
    # post-tensioning: no casting bed; the tendons are jacked at the age of stressing
    fpbt = b.jacking_stress if pt else job.strand.stress_before_transfer
    t_jack = t.transfer if pt else t_min
    held = abs(fpbt - b.jacking_stress) < 1e-9  # no loss in the bed: a level line
    if not pt:
        ax.plot(
            [t_min, t.transfer],
            [s(b.jacking_stress), s(fpbt)],
            color=_INK,
            lw=1.2 if held else 1.0,
            ls="-" if held else ":",
        )
    pts = [(m.age, m.stress, m.label) for m in b.milestones if m.age is not None]
    first = next((p for p in pts if p[0] is not None), None)
    if first is not None:
        ax.plot([t.transfer, t.transfer], [s(fpbt), s(first[1])], color=_INK, lw=1.2)
    ax.plot([p[0] for p in pts], [s(p[1]) for p in pts], color=_INK, ls=":", lw=1.0)
    ax.plot(
        [p[0] for p in pts],
        [s(p[1]) for p in pts],
        ls="none",
        marker="o",
        ms=5,
        color="#1f4e9c",
        label=f"{b.method} milestones",
        zorder=5,
    )
    ax.plot(
        [t_jack],
        [s(b.jacking_stress)],
        ls="none",
        marker="s",
        ms=5,
        color=_INK,
        label="jacking",
        clip_on=False,
        zorder=5,
    )
    ax.annotate(
        f"jacking {s(b.jacking_stress):.4g} {su}" + (f", {t_jack:g} d" if pt else ""),
        (t_jack, s(b.jacking_stress)),
        xytext=(-6, 5) if pt else (6, 5),
        textcoords="offset points",
        ha="right" if pt else "left",
        fontsize=_FONT - 1,
    )
    previous = fpbt
    for age, stress, text in pts:
        below = stress <= previous  # the text goes on the side away from the incoming line
        ax.annotate(
            f"{text}\n{s(stress):.4g} {su}, {age:g} d",
            (age, s(stress)),
            xytext=(-5, -8 if below else 8),
            textcoords="offset points",
            ha="right",
            va="top" if below else "bottom",
            fontsize=_FONT - 1,
        )
        previous = stress
    if timestep:
        ta = [a for a, _ in timestep]
        ax.plot(ta, [s(v) for _, v in timestep], color="#b35900", lw=1.4, label=timestep_label)
    ax.set_xlim(t_min, t_max)
    lo = min([b.f_pe, b.f_pt, *(m.stress for m in b.milestones)])
    if timestep:
        lo = min(lo, *(v for _, v in timestep))
    span = b.jacking_stress - lo
    ax.set_ylim(s(lo - 0.35 * span), s(b.jacking_stress + 0.12 * span))
    ax.set_xlabel("age of the girder concrete (days, log scale)", fontsize=_FONT)
    ax.set_ylabel(f"strand stress ({su})", fontsize=_FONT)
    fpj = b.jacking_stress
    sec = ax.secondary_yaxis(
        "right", functions=(lambda y: 100.0 * y / s(fpj), lambda p: p * s(fpj) / 100.0)
    )
    sec.set_ylabel("% of the jacking stress fpj", fontsize=_FONT)
    sec.tick_params(labelsize=_FONT)
    ax.set_title(
        f"{'Tendon' if pt else 'Strand'} stress with time — {b.method}",
        fontsize=_FONT + 2,
        loc="left",
    )
    ax.legend(fontsize=_FONT - 1, loc="upper right", frameon=True, framealpha=0.9)
    fig.text(
        0.1,
        0.015,
        f"Total loss {s(b.total):.4g} {su} ({100 * b.total / fpj:.1f} % of fpj); "
        + (
            "dotted: the milestones of the loss tables, without the elastic gains of later "
            "loads\n(the stage checks apply those loads themselves); solid: the path the "
            "analysis computes"
            if timestep
            else "dotted: the method gives no path between its milestones"
        )
        + (".\nTendon stresses at midlength, the tendons' area-weighted mean." if pt else "."),
        fontsize=_FONT - 1,
        va="bottom",
    )
    return _save(fig, path)


# ------------------------------------------------------------------------------------------
# Magnel diagram


@dataclass(frozen=True)
class MagnelLine:
    """One stress inequality of Magnel's method as a half-plane a + b e + c u ≤ 0.

    e is the eccentricity below the gross centroid (mm), u = 1/Pi (1/N).

    Attributes:
        label: e.g. "release, top tension".
        stage: the stage key.
        fiber: "girder_top" or "girder_bottom".
        sense: "tension" (f ≤ limit) or "compression" (f ≥ limit).
        limit: the limit stress, MPa (tension +, compression −).
        moment: the moment on the gross girder section, N*mm (composite moments converted).
        R: ratio of the stage's force to the force just after transfer (× the limit set's factor
            on the prestress, where it gives one).
        a: constant term (1/mm²).
        b: coefficient of e (1/mm³).
        c: coefficient of u (MPa).
    """

    label: str
    stage: str
    fiber: str
    sense: str
    limit: float
    moment: float
    R: float
    a: float
    b: float
    c: float

    def u_on_line(self, e: float) -> float | None:
        """1/Pi on the line at eccentricity e (None when the line is vertical)."""
        if self.c == 0:
            return None
        return -(self.a + self.b * e) / self.c

    def bound(self) -> str:
        """Which side of the line is feasible: "1/Pi ≥" (lower bound) or "1/Pi ≤"."""
        return "1/Pi ≥" if self.c < 0 else "1/Pi ≤"

    def feasible_side(self) -> str:
        """The feasible side in words: "above" or "below" the line."""
        return "above" if self.c < 0 else "below"


@dataclass(frozen=True)
class MagnelSetup:
    """The figures of a Magnel diagram at one station (mm, N, MPa, N*mm).

    Attributes:
        station: the station's name.
        x: its position from the left girder end.
        A: gross area; I: gross inertia; yb, yt: centroid to bottom and top fibers.
        Zb, Zt: gross section moduli at the bottom and top (positive).
        e: the design eccentricity (strand centroid below the gross centroid).
        P_i: force just after transfer, Aps,developed × fpt (post-tensioned: the tendon
            forces at the station just after stressing).
        P_e: effective force in service, Aps,developed × fpe (post-tensioned: the tendon
            forces at the station after all losses).
        M_i: release moment (girder self-weight on its length).
        lines: the inequalities.
    """

    station: str
    x: float
    A: float
    I: float
    yb: float
    yt: float
    Zb: float
    Zt: float
    e: float
    P_i: float
    P_e: float
    M_i: float
    lines: tuple[MagnelLine, ...]

    @property
    def R(self) -> float:
        """The effective force ratio Pe / Pi."""
        return self.P_e / self.P_i

    @property
    def u(self) -> float:
        """The design point's 1/Pi (1/N)."""
        return 1.0 / self.P_i


#: Stages of final service whose limits give Magnel lines (all with the effective force).
_SERVICE_STAGES = ("service_permanent", "service_i", "service_iii")
_SHORT = {
    "transfer": "release",
    "service_permanent": "permanent",
    "service_i": "Service I",
    "service_iii": "Service III",
}


def _find_station(result: CheckResult, station: str | None) -> StationResult:
    transfer = next((s for s in result.stages if s.key == "transfer"), None)
    if transfer is None:
        raise InputError("a check with a release stage", field="station")
    want = (station or "midspan").strip().lower()
    exact = [s for s in transfer.stations if want in (n.lower() for n in s.name.split(" / "))]
    found = exact or [s for s in transfer.stations if want in s.name.lower()]
    if not found:
        names = ", ".join(s.name for s in transfer.stations)
        raise InputError(f"a station among: {names}", field="station", got=repr(station))
    return found[0]


def magnel_lines(result: CheckResult, station: str | None = None) -> MagnelSetup:
    """The inequalities of Magnel's method at a station (default: midspan).

    Formulation, on the gross non-composite girder section (A, I, yb, yt, Zt = I/yt,
    Zb = I/yb), in the project's sign convention (tension +, compression −; e positive below
    the centroid; sagging moments positive). The stress at the top and bottom fibers of a
    force P at eccentricity e with a moment M on the girder section is

        f_top = −P/A + P e/Zt − M/Zt,        f_bot = −P/A − P e/Zb + M/Zb.

    At release P = Pi and M = Mi (self-weight on the girder length, ends supported). In final
    service P = R Pi with R = Pe/Pi, and M = Mnc + Mc Z/Sc: the non-composite moments (girder,
    deck, haunch, diaphragms) act on the girder section, the composite ones (superimposed dead
    and live load) on the composite section, whose stress Mc/Sc at the girder fiber equals that
    of a moment Mc Z/Sc on the girder section (Sc: composite modulus at that girder fiber).
    Dividing a limit f ≤ ft (tension, ft ≥ 0) or f ≥ fc (compression, fc < 0) by P > 0 gives
    a half-plane linear in e and u = 1/Pi. The four inequalities of the classical method:

        release top tension:          1/Pi ≥ (e/Zt − 1/A) / (fti + Mi/Zt)
        release bottom compression:   1/Pi ≥ (1/A + e/Zb) / (Mi/Zb − fci)
        service top compression:      R (e/Zt − 1/A) ≥ (fcs + Ms/Zt) / Pi
        service bottom tension:       1/Pi ≤ R (1/A + e/Zb) / (Ms/Zb − fts)

    (the first two as written when their denominators are positive, as usual; the third is a
    lower bound on 1/Pi when fcs + Ms/Zt < 0, the usual case, an upper bound otherwise; the
    fourth as written when the service moment stress exceeds the tension limit). Each service
    stage that gives the limit (permanent loads, Service I, Service III) adds its own line with
    its own moments. Limits the stage does not give are left out. Handling and deck placement
    are not part of the classical diagram (the check and the zone cover them).

    Pi is the force just after transfer at the station (developed strand area × fpt) and Pe
    the effective force (× fpe), whatever the job's section basis; on gross sections these
    are the forces of the stage tables.

    Post-tensioned girders: Pi and Pe are the tendon forces at the station just after
    stressing and after all losses (friction, anchor set, elastic shortening and the
    time-dependent losses; the forces of the stage tables), e is that of the cgs of the
    initial forces at the station (``StationResult.cgs``), and the release lines are written,
    as the check does, on the section carrying the prestress at stressing (the girder net of
    the open ducts, area An, inertia In, centroid ybn): with d = ybn − yb and
    s = (y − ybn)/In at the fiber, f = −P/An + P (e + d) s − M s, still linear in e and 1/Pi.
    The cgs of the effective forces lies slightly off that of the initial ones (the tendons
    lose different stresses): the service lines take e + d with d = cgs,i − cgs,e, the shift
    moving both alike. The axes stay those of the gross section.

    Args:
        result: the check.
        station: a station name (default "midspan"); one of the names of a merged station or
            a part of one.

    Returns:
        The section figures, the design point and the lines.

    Raises:
        InputError: unknown station, or no prestress developed there.
    """
    st = _find_station(result, station)
    g = result.girder
    job = g.job
    gross = g.gross
    A, I, yb, yt = gross.area, gross.Ix, gross.yb, gross.yt
    Zt, Zb = I / yt, I / yb
    # per stage: (area, signed (y − yc)/I at each girder fiber, n at the fiber, yc − yb)
    gross_sec = (A, {"girder_top": 1.0 / Zt, "girder_bottom": -1.0 / Zb}, {}, 0.0)
    release_sec = gross_sec
    if job.post_tensioned:
        from prestress.stages import prestress_at

        xs = np.array([st.x])
        P_i = float(prestress_at(g, result.losses, "transfer", xs)[0][0])
        P_e, cgs_e = (float(v[0]) for v in prestress_at(g, result.losses, "final", xs)[:2])
        if P_i <= 0.0:
            raise InputError(
                "a station on the tendons (a prestress force there)",
                field="station",
                got=repr(st.name),
            )
        net = g.section_transfer
        if net is not None:
            release_sec = (
                net.area,
                {f: net.c(f) / net.I for f in ("girder_top", "girder_bottom")},
                net.n_fiber,
                net.yb - yb,
            )
        cgs = st.cgs if st.cgs is not None else float(job.cgs_geometric(xs)[0])
        # the cgs of the effective forces lies a little off that of the initial ones (the
        # tendons lose different stresses); a shift of the layout moves both alike
        gross_sec = (*gross_sec[:3], cgs - cgs_e)
    else:
        if job.layout is None:
            raise InputError(
                "a strand layout (strand sets) for the Magnel diagram", field="strands"
            )
        area = float(job.layout.effective_area(np.array([st.x]))[0])
        if area <= 0.0:
            raise InputError(
                "a station where the prestress is developed", field="station", got=repr(st.name)
            )
        P_i = result.losses.f_pt * area
        P_e = result.losses.f_pe * area
        cgs = st.cgs if st.cgs is not None else float(job.layout.cgs(np.array([st.x]))[0])
    e = yb - cgs
    comp = g.composite_section
    ratio = {  # composite moment → equivalent moment on the girder section, per fiber
        "girder_top": Zt / comp.S("girder_top") if comp is not None else 1.0,
        "girder_bottom": Zb / comp.S("girder_bottom") if comp is not None else 1.0,
    }
    from prestress.stages import COMPOSITE_LOADS

    lines: list[MagnelLine] = []
    wanted = {
        "transfer": (("girder_top", "tension"), ("girder_bottom", "compression")),
        **{
            k: (("girder_top", "compression"), ("girder_bottom", "tension"))
            for k in _SERVICE_STAGES
        },
    }
    M_i = st.moment
    from prestress.stages import deck_shrinkage_stresses

    shrink = deck_shrinkage_stresses(g)  # {} unless the job applies it (final stages)
    for stage in result.stages:
        if stage.key not in wanted:
            continue
        here = next((s for s in stage.stations if abs(s.x - st.x) < 1e-6), None)
        if here is None:
            continue
        R_mean = 1.0 if stage.key == "transfer" else P_e / P_i
        A_s, s_of, n_of, d = release_sec if stage.key == "transfer" else gross_sec
        M_nc = sum(v for k, v in here.moments.items() if k not in COMPOSITE_LOADS)
        M_c = sum(v for k, v in here.moments.items() if k in COMPOSITE_LOADS)
        # the limit set's factors on the prestress (EN 1992-1-1 5.10.9): a line per factor,
        # the prestress terms × the factor, as the check takes each (one line when none)
        factors = job.limits.factors(stage.limits_key or stage.key, job.post_tensioned)
        for (fiber, sense), gamma in itertools.product(wanted[stage.key], factors.cases):
            R = R_mean * gamma
            fr = here.fibers.get(fiber)
            if fr is None:
                continue
            lim = fr.tension_limit if sense == "tension" else fr.compression_limit
            if lim is None:
                continue
            M = M_nc + M_c * ratio[fiber]
            s = s_of[fiber]
            n = n_of.get(fiber, 1.0)
            # a stress that does not depend on the prestress (deck shrinkage) uses up the limit
            lim_free = lim - (shrink.get(fiber, 0.0) if stage.key in _SERVICE_STAGES else 0.0)
            # f = n [R Pi (−1/A + (e + d) s) − M s]; divided by Pi:
            #     n R(−1/A + d s) + n R s e − n M s u  vs  lim u   (d = 0, n = 1 on gross)
            if sense == "tension":  # n R(−1/A + d s + e s) − (lim + n M s) u ≤ 0
                a, b, c = n * R * (-1.0 / A_s + d * s), n * R * s, -(lim_free + n * M * s)
            else:  # (lim + n M s) u − n R(−1/A + d s + e s) ≤ 0
                a, b, c = n * R * (1.0 / A_s - d * s), -n * R * s, lim_free + n * M * s
            where = FIBER_NAMES[fiber].replace("girder ", "")
            when = _SHORT[stage.key]
            if stage.key == "transfer" and job.post_tensioned:
                when = "stressing"
            factor = "" if factors.unity else f" (P × {gamma:g})"
            lines.append(
                MagnelLine(
                    f"{when}, {where} {sense}{factor}",
                    stage.key,
                    fiber,
                    sense,
                    lim,
                    M,
                    R,
                    a,
                    b,
                    c,
                )
            )
    return MagnelSetup(
        station=st.name,
        x=st.x,
        A=A,
        I=I,
        yb=yb,
        yt=yt,
        Zb=Zb,
        Zt=Zt,
        e=e,
        P_i=P_i,
        P_e=P_e,
        M_i=M_i,
        lines=tuple(lines),
    )


def _clip(poly: list[tuple[float, float]], a: float, b: float, c: float) -> list:
    """Clip a convex polygon (e, v) by the half-plane a + b e + c v ≤ 0 (Sutherland–Hodgman)."""
    out: list[tuple[float, float]] = []
    n = len(poly)
    for i in range(n):
        p, q = poly[i], poly[(i + 1) % n]
        fp = a + b * p[0] + c * p[1]
        fq = a + b * q[0] + c * q[1]
        if fp <= 0.0:
            out.append(p)
        if (fp < 0.0 < fq) or (fq < 0.0 < fp):
            t = fp / (fp - fq)
            out.append((p[0] + t * (q[0] - p[0]), p[1] + t * (q[1] - p[1])))
    return out


def _dedupe(poly: list[tuple[float, float]], tol_e: float, tol_v: float) -> list:
    out: list[tuple[float, float]] = []
    for p in poly:
        if out and abs(p[0] - out[-1][0]) <= tol_e and abs(p[1] - out[-1][1]) <= tol_v:
            continue
        out.append(p)
    while (
        len(out) > 1
        and abs(out[0][0] - out[-1][0]) <= tol_e
        and abs(out[0][1] - out[-1][1]) <= tol_v
    ):
        out.pop()
    return out


#: Where no line bounds 1/Pi from above, the region is closed at this multiple of 1/Pi,design.
OPEN_REGION_CAP = 10.0


def _corners(setup: MagnelSetup, cap: float) -> list[tuple[float, float]]:
    """Feasible polygon in (e mm, v = u Pi,design) for a cap on v."""
    box = [(-setup.yt, 0.0), (setup.yb, 0.0), (setup.yb, cap), (-setup.yt, cap)]
    poly = box
    for ln in setup.lines:
        # a + b e + c u ≤ 0 with u = v / Pi  →  a + b e + (c / Pi) v ≤ 0, scaled to order 1
        a, b, c = ln.a, ln.b, ln.c / setup.P_i
        k = max(abs(a), abs(b) * (setup.yt + setup.yb), abs(c))
        if k == 0:
            continue
        poly = _clip(poly, a / k, b / k, c / k)
        if not poly:
            return []
    return _dedupe(poly, 1e-9 * (setup.yt + setup.yb), 1e-12 * cap)


def magnel_corners(result: CheckResult, station: str | None = None) -> list[tuple[float, float]]:
    """Vertices of the feasible region of the Magnel diagram, (e mm, 1/Pi in 1/N).

    The region is the intersection of the half-planes of :func:`magnel_lines` with the strip
    −yt ≤ e ≤ yb and 1/Pi ≥ 0, computed exactly by clipping (each vertex is the intersection
    of two of those lines). Where no line bounds 1/Pi from above (no service tension limit),
    the region is open and is closed at 1/Pi = :data:`OPEN_REGION_CAP` / Pi,design. Vertices
    run counter-clockwise in the (e, 1/Pi) plane; an empty list means no feasible design.

    Args:
        result: the check.
        station: a station name (default "midspan").
    """
    setup = magnel_lines(result, station)
    poly = _corners(setup, 1e6)
    if any(abs(v - 1e6) < 1e-3 for _, v in poly):
        poly = _corners(setup, OPEN_REGION_CAP)
    return [(e, v / setup.P_i) for e, v in poly]


def _inequality_text(ln: MagnelLine, system: str) -> str:
    lim = value(ln.limit, system, "stress")
    rel = "≤" if ln.sense == "tension" else "≥"
    text = f"{ln.label}: f {rel} {lim:+.3g} {label(system, 'stress')}".replace("-", "−")
    return f"{text}; feasible {ln.feasible_side()} the line"


def plot_magnel(
    result: CheckResult,
    path: str | os.PathLike[str],
    system: str,
    station: str | None = None,
) -> Path:
    """The Magnel diagram at a station (default midspan): lines, feasible region, design point.

    Axes: the eccentricity e below the gross centroid, and 10^k / Pi with k chosen so the
    design point reads between 1 and 10. The formulation is that of :func:`magnel_lines`; the
    feasible region (:func:`magnel_corners`) is shaded, the section's limits e = −yt and
    e = yb are drawn, and the design point (the actual e and 1/Pi) is marked.

    Args:
        result: the check.
        path: ``.svg`` or ``.png`` file to write.
        system: "US" or "SI" for the axis units.
        station: a station name (default "midspan").

    Returns:
        The path written.
    """
    from matplotlib.patches import Polygon as MplPolygon

    _suffix(path)
    setup = magnel_lines(result, station)
    corners = magnel_corners(result, station)
    fu = label(system, "force")
    du = label(system, "dimension")
    force_unit = value(1.0, system, "force")  # kip (or kN) per newton
    u_design = setup.u / force_unit  # 1/Pi in 1/kip (or 1/kN)
    k = math.ceil(-math.log10(u_design)) if u_design > 0 else 0
    scale = 10.0**k / force_unit  # internal 1/N → displayed 10^k / (kip or kN)
    E = lambda e: value(e, system, "dimension")  # noqa: E731
    # the legend (one entry per line, region, design point) below the axes: the figure grows
    # with it, the axes keep their size (3.14 in high)
    extra = 0.2 * max(0, len(setup.lines) + 2 - 7)
    height = 5.6 + extra
    fig = _figure(8.0, height)
    ax = fig.add_axes((0.1, (2.02 + extra) / height, 0.86, 3.14 / height))
    _style_axes(ax)
    e_lo, e_hi = -setup.yt, setup.yb
    vs = [v * scale for _, v in corners] or [setup.u * scale]
    y_top = max(2.0 * setup.u * scale, 1.25 * max(vs))
    if corners:
        ax.add_patch(
            MplPolygon(
                [(E(e), min(v * scale, y_top)) for e, v in corners],
                closed=True,
                facecolor="#cfe8cf",
                edgecolor="#2e7d32",
                lw=0.8,
                label="feasible region",
                zorder=1,
            )
        )
    es = np.linspace(e_lo, e_hi, 200)
    styles = ["-", "--", "-.", ":", (0, (5, 1, 1, 1, 1, 1)), (0, (8, 2))]
    colours = ["#1f4e9c", "#b35900", "#2e7d32", "#6a1b9a", "#c00000", "#00695c"]
    for i, ln in enumerate(setup.lines):
        if ln.c == 0:
            continue
        us = np.array([ln.u_on_line(float(e)) for e in es], dtype=float) * scale
        ax.plot(
            [E(e) for e in es],
            us,
            color=colours[i % 6],
            ls=styles[(i + i // 6) % 6],  # a colour and style pair of its own for 36 lines
            lw=1.2,
            label=_inequality_text(ln, system),
            zorder=3,
        )
    for e_lim, name in ((e_lo, "girder top"), (e_hi, "girder bottom")):
        ax.axvline(E(e_lim), color=_INK, lw=0.9, zorder=2)
        ax.text(
            E(e_lim),
            y_top,
            f" e at {name}",
            rotation=90,
            va="top",
            ha="left" if e_lim < 0 else "right",
            fontsize=_FONT - 1,
        )
    ax.plot(
        [E(setup.e)],
        [setup.u * scale],
        ls="none",
        marker="*",
        ms=12,
        color=_INK,
        zorder=6,
        label=f"design: e = {E(setup.e):.4g} {du}, Pi = "
        f"{value(setup.P_i, system, 'force'):.4g} {fu}",
    )
    ax.set_xlim(E(e_lo) - 0.03 * E(e_hi - e_lo), E(e_hi) + 0.03 * E(e_hi - e_lo))
    ax.set_ylim(0.0, y_top)
    ax.set_xlabel(f"eccentricity e below the girder centroid ({du})", fontsize=_FONT)
    ax.set_ylabel(f"$10^{{{k}}}$ / Pi (1/{fu})", fontsize=_FONT)
    ax.set_title(
        f"Magnel diagram at {setup.station} (x = {value(setup.x, system, 'position'):.4g} "
        f"{label(system, 'position')} from the left end)",
        fontsize=_FONT + 2,
        loc="left",
    )
    ax.legend(
        fontsize=_FONT - 1, loc="upper center", bbox_to_anchor=(0.5, -0.12), ncol=1, frameon=False
    )
    net = (
        " (release lines on the girder net of the open ducts, as in the check)\n"
        if result.girder.job.post_tensioned
        else "; "
    )
    fig.text(
        0.1,
        0.01,
        f"Gross girder section{net}R = Pe/Pi = {setup.R:.3f}; composite moments converted to "
        f"the girder section by Z/Sc; {SIGN_CONVENTION}.\nRelease and the service stages only "
        "(the classical diagram): handling and deck placement are in the check and the zone.",
        fontsize=_FONT - 1,
        va="bottom",
    )
    return _save(fig, path)


#: Plot kinds by the name the command line uses.
PLOT_KINDS: dict[str, Callable[[CheckResult, str | os.PathLike[str], str], Path]] = {
    "section": plot_section,
    "stresses": plot_stresses,
    "zone": plot_zone,
    "losses": plot_losses,
    "magnel": plot_magnel,
}
