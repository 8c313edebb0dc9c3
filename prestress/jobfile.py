"""Reading a job file (TOML) into a validated :class:`prestress.model.Job`.

Every field is read by name with its TOML path, so any error names the file, the field
and what was expected; unknown (e.g. misspelt) keys are reported with the nearest valid
key. The job-file format is documented in ``docs/job-file.md`` and by the examples.
"""

from __future__ import annotations

import itertools
import math
import re
from contextvars import ContextVar
from pathlib import Path

import numpy as np

from prestress.codes.aashto_lrfd import effective_width
from prestress.errors import InputError
from prestress.layout import Layout, StrandSet
from prestress.losses import METHOD_MODULES
from prestress.materials import MODULUS_FORMULAS, concrete_modulus
from prestress.model import (
    FIBERS,
    STAGES,
    Combination,
    Concrete,
    Deck,
    FiberLimit,
    Handling,
    Job,
    LimitSet,
    LiveLoad,
    Loads,
    PrestressFactors,
    SectionRef,
    Strand,
    StrandRow,
    Tendon,
    TensionLimit,
    Times,
)
from prestress.tomlread import Table, read_toml
from prestress.units import (
    FOOT_MM,
    INCH_MM,
    KIP_N,
    KSI_MPA,
    LBF_N,
    in_both,
    show_dimension,
    show_position,
    show_stress,
    to_internal,
)

#: The units of the job being read ("US" or "SI"), so messages quote values in the user's own
#: units first; set by :func:`load_job`.
_JOB_UNITS: ContextVar[str] = ContextVar("job_units", default="US")


def _long(mm: float) -> str:
    """A girder length or position in the job's units: "52.49 ft" or "16.00 m"."""
    return show_position(mm, _JOB_UNITS.get())


def _short(mm: float) -> str:
    """A dimension in the job's units: "1.97 in" or "50 mm"."""
    return show_dimension(mm, _JOB_UNITS.get())


def _stress(mpa: float, spec: str = ".4g") -> str:
    """A stress in the job's units: "7.98 ksi" or "55 MPa"."""
    return show_stress(mpa, _JOB_UNITS.get(), spec)


def _weight(w: float, decimals: int = 1) -> str:
    """A unit weight (N/mm³) in both systems, the job's first: "145.0 pcf (22.78 kN/m³)"."""
    pcf = f"{w * FOOT_MM**3 / LBF_N:.{decimals}f} pcf"
    return in_both(_JOB_UNITS.get(), pcf, f"{w * 1e6:.2f} kN/m³")


#: Loss methods the job may choose (see ``prestress.losses``).
LOSS_METHODS = tuple(METHOD_MODULES)

#: Jacking stress limits for pretensioning, AASHTO LRFD 9th Ed. (2020) Table 5.9.2.2-1.
JACKING_LIMIT = {"low": 0.75, "stress-relieved": 0.70}

#: Plausible ranges (MPa) beyond which a strength is taken to be a units mistake.
STRENGTH_RANGE_MPA = (10.0, 200.0)


def _concrete(t: Table, name: str, *, at_transfer: bool) -> Concrete:
    fc = t.quantity("fc", "stress", positive=True)
    lo, hi = STRENGTH_RANGE_MPA
    if not lo <= fc <= hi:
        raise t.error(
            "fc",
            f"a concrete strength from {lo / KSI_MPA:.1f} to {hi / KSI_MPA:.0f} ksi "
            f"({lo:.0f} to {hi:.0f} MPa)",
            _stress(fc, ".3g"),
        )
    fci = None
    if at_transfer:
        fci = t.quantity("fci", "stress", positive=True)
        if not lo <= fci <= hi:  # the range first: "5500 ksi" is a unit mistake, not f'ci > f'c
            raise t.error(
                "fci",
                f"a concrete strength from {lo / KSI_MPA:.1f} to {hi / KSI_MPA:.0f} ksi "
                f"({lo:.0f} to {hi:.0f} MPa)",
                _stress(fci, ".3g"),
            )
        if fci > fc:
            raise t.error(
                "fci",
                f"f'ci no greater than f'c ({_stress(fc, '.3g')})",
                _stress(fci, ".3g"),
            )
    w = t.quantity("unit_weight", "unit_weight", positive=True)
    w_mod_given = t.has("modulus_unit_weight")
    note = ""
    w_mod = t.quantity("modulus_unit_weight", "unit_weight", w, positive=True)
    if not 1.0e-5 <= w <= 3.0e-5:
        raise t.error(
            "unit_weight",
            "a concrete unit weight from 64 to 190 pcf (10 to 30 kN/m^3)",
            f"{w * 1e6:.3g} kN/m^3",
        )
    K1 = t.number("K1", 1.0, low=0.1, high=2.0)
    raw = t.raw("modulus", "aashto", expected="a formula name or a stress")
    formulas = tuple(MODULUS_FORMULAS)
    if isinstance(raw, str) and raw.strip().lower() in formulas:
        formula = raw.strip().lower()
        try:
            Ec = concrete_modulus(fc, w_mod, formula, K1)
            Eci = concrete_modulus(fci, w_mod, formula, K1) if fci is not None else None
        except ValueError as exc:
            if "w_c" in str(exc):
                raise t.error(
                    "modulus_unit_weight",
                    "a unit weight within the range of the "
                    "modulus formula (AASHTO 5.4.2.4: 90 to 155 pcf; ACI 318-19: 90 to "
                    "160 pcf)",
                    _weight(w_mod),
                ) from None
            raise t.error("modulus", f"inputs within the formula's range ({exc})") from None
        source = MODULUS_FORMULAS[formula]
        if formula in ("aashto", "aci318"):
            source += f", wc = {_weight(w_mod)}"
            source += f", K1 = {K1:g}" if formula == "aashto" else ""
        if formula in ("aashto", "aci318") and not w_mod_given and w > plain_concrete_weight(fc):
            note = (
                f"the {name} modulus uses the dead-load unit weight "
                f"{_weight(w, 0)}; the modulus formula "
                "takes the weight of the concrete itself (AASHTO LRFD Table 3.5.1-1: 0.145 kcf up "
                "to 5 ksi, 0.140 + 0.001 f'c kcf from 5 to 15 ksi, reinforcement adding 0.005 "
                f"kcf for dead load; from memory): give {t.field('modulus_unit_weight')} to set it"
            )
    else:
        try:
            Ec = to_internal(raw, "stress", field=t.field("modulus"), file=t.file)
        except InputError:
            raise t.error(
                "modulus",
                "one of "
                + ", ".join(f"'{f}'" for f in formulas)
                + ' or a stress such as "5000 ksi"',
                repr(raw),
            ) from None
        source = "given"
        if not 5_000.0 <= Ec <= 80_000.0:
            raise t.error(
                "modulus",
                "a concrete modulus from 725 to 11,600 ksi (5 to 80 GPa)",
                _stress(Ec, ".4g"),
            )
        Eci = t.quantity("modulus_at_transfer", "stress", positive=True) if at_transfer else None
        if Eci is not None and not 5_000.0 <= Eci <= 80_000.0:
            raise t.error(
                "modulus_at_transfer",
                "a concrete modulus from 725 to 11,600 ksi (5 to 80 GPa)",
                _stress(Eci, ".4g"),
            )
    t.done()
    return Concrete(
        name=name,
        fc=fc,
        fci=fci,
        unit_weight=w,
        Ec=Ec,
        Eci=Eci,
        modulus_source=source,
        modulus_note=note,
    )


def plain_concrete_weight(fc: float) -> float:
    """Unit weight above which a weight looks like reinforced concrete for dead load (N/mm³).

    AASHTO LRFD 9th Ed. (2020) Table 3.5.1-1 (from memory): plain normal-weight concrete
    0.145 kcf up to 5 ksi, 0.140 + 0.001 f'c kcf from 5 to 15 ksi; half the 0.005 kcf that
    reinforcement adds is allowed before a remark.
    """
    f_ksi = fc / KSI_MPA
    kcf = 0.145 if f_ksi <= 5.0 else 0.140 + 0.001 * min(f_ksi, 15.0)
    return (kcf + 0.0025) * KIP_N / FOOT_MM**3


def _strand(t: Table) -> Strand:
    d = t.quantity("diameter", "length", positive=True)
    if not 5.0 <= d <= 30.0:
        raise t.error("diameter", "a strand diameter from 0.2 to 1.2 in (5 to 30 mm)", _short(d))
    area = t.quantity("area", "area", positive=True)
    if not 10.0 <= area <= 700.0:
        raise t.error(
            "area",
            "the area of one strand, from 0.015 to 1.1 in² (10 to 700 mm²)",
            f"{area:.4g} mm²" if _JOB_UNITS.get() == "SI" else f"{area / 645.16:.4g} in²",
        )
    fpu = t.quantity("fpu", "stress", positive=True)
    if not 1_000.0 <= fpu <= 2_500.0:
        raise t.error(
            "fpu",
            "a strand tensile strength from 145 to 363 ksi (1000 to 2500 MPa)",
            _stress(fpu, ".4g"),
        )
    fpy = t.quantity("fpy", "stress", positive=True)
    if fpy >= fpu:
        raise t.error("fpy", "fpy less than fpu", _stress(fpy, ".4g"))
    Ep = t.quantity("modulus", "stress", positive=True)
    if not 150_000.0 <= Ep <= 220_000.0:
        raise t.error(
            "modulus",
            "a strand modulus from 21,750 to 31,900 ksi (150 to 220 GPa)",
            _stress(Ep, ".4g"),
        )
    relax = t.string("relaxation", "low", choices=("low", "stress-relieved"))
    fpj = t.quantity("jacking_stress", "stress", positive=True)
    limit = JACKING_LIMIT[relax]
    if fpj > limit * fpu * (1 + 1e-9):
        raise t.error(
            "jacking_stress",
            f"at most {limit:.2f} fpu = {_stress(limit * fpu, '.4g')} "
            "(AASHTO LRFD Table 5.9.2.2-1, pretensioning)",
            _stress(fpj, ".4g"),
        )
    fpbt = t.quantity("stress_before_transfer", "stress", fpj, positive=True)
    if fpbt > fpj:
        raise t.error("stress_before_transfer", "no more than the jacking stress")
    t.done()
    return Strand(
        diameter=d,
        area=area,
        fpu=fpu,
        fpy=fpy,
        Ep=Ep,
        relaxation=relax,
        jacking_stress=fpj,
        stress_before_transfer=fpbt,
    )


def _tension(t: Table, key: str) -> TensionLimit | None:
    sub = t.table(key, required=False)
    if sub is None:
        return None
    rule = sub.string("rule", "power", choices=("power", "en1992-fctm"))
    if rule == "en1992-fctm":
        coeff = sub.number("coefficient", 1.0, low=0.0, high=10.0)
        cap = sub.quantity("cap", "stress", None, positive=True)
        sub.done()
        return TensionLimit(coefficient=coeff, root_unit="MPa", cap=cap, rule=rule)
    coeff = sub.number("coefficient", low=0.0, high=100.0)
    unit = sub.string("root_unit", choices=("ksi", "psi", "MPa"))
    cap = sub.quantity("cap", "stress", None, positive=True)
    exponent = sub.number("exponent", 0.5, low=0.1, high=1.0)
    sub.done()
    return TensionLimit(coefficient=coeff, root_unit=unit, cap=cap, exponent=exponent)


def _fiber_limit(t: Table, default: FiberLimit | None = None) -> FiberLimit:
    comp = t.number("compression", None, low=0.0, high=1.0) if t.has("compression") else None
    t.raw("compression", None)
    tens = _tension(t, "tension")
    if default is not None:
        comp = comp if comp is not None else default.compression_fraction
        tens = tens if tens is not None else default.tension
    return FiberLimit(compression_fraction=comp, tension=tens)


#: The largest factor on the mean prestress a limit set may give (``prestress_factors``).
PRESTRESS_FACTOR_MAX = 1.5


def _factor_values(t: Table) -> dict[str, float | str]:
    """The factors a ``prestress_factors`` table (or a sub-table) gives: inf, sup, note.

    Checked one by one: 0 < inf ≤ 1 ≤ sup ≤ 1.5 (r_inf and r_sup of EN 1992-1-1:2004
    5.10.9(1)P are 0.90 to 1.10 when recommended; from memory).
    """
    out: dict[str, float | str] = {}
    for key in ("inf", "sup", "note"):  # known keys, for the hint on a misspelt one
        t.raw(key, None)
    if t.has("inf"):
        v = t.number("inf")
        if not 0.0 < v <= 1.0:
            raise t.error("inf", "a factor greater than 0 and at most 1 (e.g. 0.95)", f"{v:g}")
        out["inf"] = v
    if t.has("sup"):
        v = t.number("sup")
        if not 1.0 <= v <= PRESTRESS_FACTOR_MAX:
            raise t.error(
                "sup", f"a factor from 1 to {PRESTRESS_FACTOR_MAX:g} (e.g. 1.05)", f"{v:g}"
            )
        out["sup"] = v
    if t.has("note"):
        out["note"] = t.string("note")
    return out


def read_prestress_factors(t: Table) -> dict[tuple[str, bool], PrestressFactors]:
    """Read ``prestress_factors``: factors on the mean prestress, resolved per stage and kind.

    The table gives ``inf`` and ``sup`` (default 1), an optional ``note`` (the clause), a
    sub-table per stage of :data:`prestress.model.STAGES` overriding them, and an optional
    ``post_tensioned`` sub-table (with its own per-stage sub-tables) used for a girder with
    tendons. The most specific table wins, value by value: for a pretensioned girder the
    stage's table, then the top; for a post-tensioned one ``post_tensioned.<stage>``, then
    the stage's table, then ``post_tensioned``, then the top (a stage's table, e.g. a
    National Annex's values at transfer, applies to both kinds of girder).
    """
    top = _factor_values(t)
    per_stage: dict[str, dict[str, float | str]] = {}
    for stage in STAGES:
        sub = t.table(stage, required=False)
        if sub is not None:
            per_stage[stage] = _factor_values(sub)
            sub.done()
    pt_table = t.table("post_tensioned", required=False)
    pt: dict[str, float | str] = {}
    pt_stage: dict[str, dict[str, float | str]] = {}
    if pt_table is not None:
        pt = _factor_values(pt_table)
        for stage in STAGES:
            sub = pt_table.table(stage, required=False)
            if sub is not None:
                pt_stage[stage] = _factor_values(sub)
                sub.done()
        pt_table.done()
    t.done()
    out: dict[tuple[str, bool], PrestressFactors] = {}
    for stage in STAGES:
        for post_tensioned in (False, True):
            chain = (
                [top, pt, per_stage.get(stage, {}), pt_stage.get(stage, {})]
                if post_tensioned
                else [top, per_stage.get(stage, {})]
            )
            merged: dict[str, float | str] = {}
            for values in chain:
                merged.update(values)
            inf, sup = float(merged.get("inf", 1.0)), float(merged.get("sup", 1.0))
            source = str(merged.get("note", "")) or "prestress_factors of the limit set"
            out[(stage, post_tensioned)] = PrestressFactors(inf, sup, source)
    return out


def read_limits(t: Table) -> LimitSet:
    """Read a limit set: per stage, compression fraction and tension coefficient per fiber.

    Optionally ``prestress_factors`` (:func:`read_prestress_factors`): the factors on the
    mean prestress of every stress check.
    """
    name = t.string("name", "limits of the job")
    source = t.string("source", "supplied by the user")
    factors_table = t.table("prestress_factors", required=False)
    factors = read_prestress_factors(factors_table) if factors_table is not None else {}
    stages: dict[str, dict[str, FiberLimit]] = {}
    for stage in STAGES:
        st = t.table(stage, required=False)
        if st is None:
            continue
        base = _fiber_limit(st)
        fibers: dict[str, FiberLimit] = {}
        for fiber in FIBERS:
            sub = st.table(fiber, required=False)
            if sub is not None:
                fibers[fiber] = _fiber_limit(sub, None if fiber == "deck_top" else base)
                sub.done()
            elif fiber != "deck_top":
                fibers[fiber] = base
        st.string("note", "")
        st.done()
        stages[stage] = fibers
    t.done()
    if not stages:
        raise InputError(
            "limits for at least one of the stages " + ", ".join(STAGES), file=t.file, field=t.path
        )
    return LimitSet(name=name, source=source, stages=stages, prestress_factors=factors)


def _section(g: Table) -> SectionRef:
    raw = g.raw("section", expected="a section name from the library or an inline table")
    if isinstance(raw, str):
        return SectionRef(name=raw)
    if isinstance(raw, dict):
        s = g.table("section")
        assert s is not None
        name = s.string("name", "inline section")
        family = s.string("family")
        dims = s.raw("dimensions", expected="a table of dimensions")
        if not isinstance(dims, dict):
            raise s.error("dimensions", "a table of dimensions")
        s.done()
        return SectionRef(name=name, family=family, dimensions=dims)
    raise g.error("section", "a section name or an inline table", type(raw).__name__)


def _live(t: Table | None) -> LiveLoad:
    if t is None:
        return LiveLoad(moment_midspan=0.0, moments_tenth_points=None)
    model = t.string("model", "given", choices=("given", "HL-93"))
    if model == "HL-93":
        impact = t.number("impact", 0.33, low=0.0, high=1.0)
        raw = t.raw("distribution_factor", expected='a number of lanes per girder, or "aashto"')
        girders, skew = None, 0.0
        if isinstance(raw, str) and raw.lower() == "aashto":
            df, source = None, "AASHTO LRFD 4.6.2.2.2b-1"
            girders = t.integer("girders", low=3, high=60)
            skew = t.number("skew_degrees", 0.0, low=0.0, high=60.0)
            curb = t.quantity("curb_distance", "length", None)
        elif isinstance(raw, int | float) and not isinstance(raw, bool) and 0 < raw <= 3:
            df, source = float(raw), "given in the job"
            t.raw("girders", None)
            t.raw("skew_degrees", None)
            t.raw("curb_distance", None)
            curb = None
        else:
            raise t.error(
                "distribution_factor",
                'a number of lanes per girder from 0 to 3, or "aashto"',
                repr(raw),
            )
        shear_df, shear_source = _shear_distribution(t, df is None)
        shear_by_aashto = shear_df is None and bool(shear_source)
        t.string("note", "")
        t.done()
        return LiveLoad(
            None,
            None,
            model="HL-93",
            distribution_factor=df,
            distribution_source=source,
            impact=impact,
            girders=girders,
            skew_deg=skew,
            curb_distance=curb,
            shear_distribution_factor=shear_df,
            shear_distribution_source=shear_source,
            shear_by_aashto=shear_by_aashto,
        )
    if t.has("moments"):
        raw = t.raw("moments")
        if not isinstance(raw, list) or len(raw) != 11:
            raise t.error("moments", "a list of 11 moments at the tenth points of the span")
        vals = tuple(
            to_internal(v, "moment", field=f"{t.field('moments')}[{i}]", file=t.file)
            for i, v in enumerate(raw)
        )
        if t.has("moment_midspan"):
            raise t.error("moment_midspan", "either moments or moment_midspan, not both")
        t.string("note", "")
        t.done()
        return LiveLoad(moment_midspan=None, moments_tenth_points=vals)
    m = t.quantity("moment_midspan", "moment", non_negative=True)
    t.string("note", "")
    t.done()
    return LiveLoad(moment_midspan=m, moments_tenth_points=None)


def service_iii_default(method: str, basis: str) -> Combination:
    """The Service III load factors by default, with their source.

    AASHTO LRFD 9th Ed. (2020) Table 3.4.1-4 (from memory): the live-load factor of Service
    III for the tension check of prestressed concrete is 1.0 where the refined estimate of
    time-dependent losses is used in conjunction with the elastic gains, 0.8 otherwise. Here
    the elastic gains are taken where the stresses are computed on transformed sections
    (the loads then act on sections that include the strands); the time-step methods count as
    refined estimates.
    """
    refined = method == "aashto-refined" or method.startswith("time-step")
    if refined and basis == "transformed":
        return Combination(
            1.0,
            1.0,
            "AASHTO LRFD 9th Ed. (2020) Table 3.4.1-4: γLL = 1.0 with refined losses and "
            "elastic gains (transformed sections) (from memory)",
        )
    return Combination(
        1.0,
        0.8,
        "AASHTO LRFD 9th Ed. (2020) Tables 3.4.1-1 and 3.4.1-4: γLL = 0.8 (1.0 applies only "
        "to the refined estimate used with elastic gains, on transformed sections; not the "
        "case here) (from memory)",
    )


def _deck_shrinkage(ld: Table, *, has_deck: bool) -> float:
    """``deck_shrinkage``: the factor on the deck's shrinkage restraint force (needs a deck)."""
    factor = ld.number("deck_shrinkage", 0.0, low=0.0, high=2.0)
    if factor > 0 and not has_deck:
        raise ld.error("deck_shrinkage", "a [deck] for the deck's shrinkage to act on", "no deck")
    return factor


def _dynamic_factors(hd: Table) -> tuple[float, ...]:
    """``dynamic_factor``: a number, or a list of up to three (each a handling case)."""
    raw = hd.raw("dynamic_factor", 1.0, expected="a factor on the self-weight")
    expected = "a factor from 0.5 to 2.0 on the self-weight, or a list of up to three such"
    values = raw if isinstance(raw, list) else [raw]
    if not 1 <= len(values) <= 3:
        raise hd.error("dynamic_factor", expected, f"a list of {len(values)}")
    out = []
    for v in values:
        if isinstance(v, bool) or not isinstance(v, int | float) or not 0.5 <= v <= 2.0:
            raise hd.error("dynamic_factor", expected, repr(v))
        out.append(float(v))
    if len(set(out)) != len(out):
        raise hd.error("dynamic_factor", "different factors (each is a case)", repr(raw))
    return tuple(out)


def _shear_distribution(t: Table, moment_by_aashto: bool) -> tuple[float | None, str]:
    """The live-load shear distribution factor: (factor, source).

    ``"aashto"`` (the default when the moment factor is computed) leaves the factor to be
    computed with the moment factor (factor None, source set); a number is taken as given;
    absent beside a given moment factor, no shear factor (None, "").
    """
    key = "shear_distribution_factor"
    expected = 'a number of lanes per girder from 0 to 3, or "aashto"'
    raw = t.raw(key, None, expected=expected)
    if raw is None:
        return None, ("AASHTO LRFD 4.6.2.2.3a-1" if moment_by_aashto else "")
    if isinstance(raw, str) and raw.lower() == "aashto":
        if not moment_by_aashto:
            raise t.error(
                key,
                "a number (the AASHTO shear factor is computed only beside "
                'distribution_factor = "aashto")',
                repr(raw),
            )
        return None, "AASHTO LRFD 4.6.2.2.3a-1"
    if isinstance(raw, int | float) and not isinstance(raw, bool) and 0 < raw <= 3:
        return float(raw), "given in the job"
    raise t.error(key, expected, repr(raw))


def _diaphragms(ld: Table, span: float) -> tuple[tuple[float, float], ...]:
    out = []
    for i, d in enumerate(ld.tables("diaphragms", required=False)):
        at = d.quantity("at", "length", non_negative=True)
        if at > span:
            raise d.error(
                "at",
                "a position on the span, measured from the left bearing",
                f"{_long(at)} on a {_long(span)} span",
            )
        out.append((at, d.quantity("weight", "force", positive=True)))
        d.done()
        del i
    return tuple(out)


def _percent(t: Table, key: str) -> float:
    raw = t.raw(key, expected='a relative humidity in percent, e.g. 70 or "70 percent"')
    if isinstance(raw, int | float) and not isinstance(raw, bool):
        try:
            value = float(raw)
        except OverflowError:
            value = float("inf")
    else:
        value = 100.0 * to_internal(raw, "dimensionless", field=t.field(key), file=t.file)
    if not 0.0 < value <= 100.0:  # no concrete is kept in perfectly dry air
        raise t.error(
            key,
            "a relative humidity above 0 and up to 100 percent (0 to 100, 0 excluded)",
            f"{value:g}",
        )
    if isinstance(raw, int | float) and 0.0 < value <= 1.0:
        raise t.error(
            key,
            'a relative humidity in percent, e.g. 70 (or "0.7" with a unit: "70 percent")',
            f"{value:g}: a fraction? {100 * value:g} % was probably meant",
        )
    return value


def _tendons(top: Table, strand: Strand, length: float) -> list[Tendon]:
    """The [[tendons]] tables: profile, friction, anchor set, jacking (post-tensioning)."""
    out = []
    for t in top.tables("tendons", required=False):
        name = t.string("name", f"T{len(out) + 1}")
        n = t.integer("strands", low=1, high=200)
        raw = t.raw("points", expected='control points [["0 ft", "36 in"], ["60 ft", "8 in"], ...]')
        if (
            not isinstance(raw, list)
            or len(raw) < 3
            or not all(isinstance(p, list) and len(p) == 2 for p in raw)
        ):
            raise t.error(
                "points",
                "at least three control points [x, y]: end anchor, low point, "
                'end anchor, e.g. [["0 ft", "36 in"], ["60 ft", "8 in"], '
                '["120 ft", "36 in"]]',
            )
        xs, ys = [], []
        for i, (x, y) in enumerate(raw):
            xs.append(to_internal(x, "length", field=f"{t.field('points')}[{i}][0]", file=t.file))
            ys.append(to_internal(y, "length", field=f"{t.field('points')}[{i}][1]", file=t.file))
        if any(b <= a for a, b in itertools.pairwise(xs)) or xs[0] < 0 or xs[-1] > length:
            raise t.error("points", "control points in increasing x within the girder length")
        # anchors at the girder ends (within 1 mm, then taken exactly there): a tendon
        # anchored inside the girder is not modelled
        if xs[0] > 1.0 or xs[-1] < length - 1.0:
            from prestress.units import FOOT_MM

            raise t.error(
                "points",
                "the end anchors at the girder ends: first point at x = 0, last point at the "
                "girder length (tendons anchored inside the girder are not supported)",
                f"anchors at x = {xs[0] / FOOT_MM:.4g} ft and {xs[-1] / FOOT_MM:.4g} ft",
            )
        xs[0], xs[-1] = 0.0, length
        infl = t.number("inflection", None, low=0.01, high=0.99) if t.has("inflection") else None
        t.raw("inflection", None)
        fr = t.table("friction")
        assert fr is not None
        mu = fr.number("mu", low=0.0, high=1.0)
        K = fr.quantity("wobble", "per_length", non_negative=True)
        fr.done()
        fpj = t.quantity("jacking_stress", "stress", positive=True)
        if fpj > 0.90 * strand.fpy * (1 + 1e-9):
            raise t.error(
                "jacking_stress",
                "at most 0.90 fpy (AASHTO LRFD Table 5.9.2.2-1, "
                "post-tensioning prior to seating; from memory)",
                _stress(fpj, ".4g"),
            )
        tendon = Tendon(
            name=name,
            strands=n,
            area=n * strand.area,
            x=tuple(xs),
            y=tuple(ys),
            inflection=infl,
            duct_diameter=t.quantity("duct_diameter", "length", 0.0, non_negative=True),
            jacking=t.string("jacking", "left", choices=("left", "right", "both")),
            mu=mu,
            K=K,
            anchor_set=t.quantity("anchor_set", "length", 0.375 * INCH_MM, non_negative=True),
            jacking_stress=fpj,
            jack_length=t.quantity("jack_length", "length", 0.0, non_negative=True),
        )
        try:
            tendon.profile()
        except ValueError as exc:
            raise t.error("points", f"a valid profile ({exc})") from None
        t.done()
        out.append(tendon)
    return out


def _hold_downs(h: Table, length: float) -> tuple[float, float]:
    """Hold-down points from the left end (mm): one symmetric value or two positions."""
    if h.has("hold_downs"):
        raw = h.raw("hold_downs")
        if not isinstance(raw, list) or len(raw) != 2:
            raise h.error("hold_downs", 'two positions from the left end, e.g. ["32 ft", "50 ft"]')
        a, b = (
            to_internal(v, "length", field=f"{h.field('hold_downs')}[{i}]", file=h.file)
            for i, v in enumerate(raw)
        )
        h.raw("hold_down", None)
    else:
        raw = h.raw(
            "hold_down",
            expected='a distance from each end ("32 ft") or a fraction of the girder length (0.4)',
        )
        if isinstance(raw, int | float) and not isinstance(raw, bool):
            if not 0.0 < raw <= 0.5:
                raise h.error(
                    "hold_down",
                    "a fraction of the girder length above 0 and at most 0.5",
                    str(raw),
                )
            a = raw * length
        else:
            a = to_internal(raw, "length", field=h.field("hold_down"), file=h.file)
        b = length - a
    if not 0.0 < a <= b < length:
        raise h.error(
            "hold_downs" if h.has("hold_downs") else "hold_down",
            "hold-down points within the girder, left one first",
            f"{_long(a)} and {_long(b)} on a {_long(length)} girder",
        )
    return a, b


def _row(r: Table, index: int, length: float) -> StrandRow:
    """One [[strands.rows]] table: straight, harped or partly debonded strands."""
    height = r.quantity("height", "length", positive=True)
    if r.has("positions"):
        raw = r.raw("positions")
        if not isinstance(raw, list) or not raw:
            raise r.error("positions", 'a list of horizontal positions, e.g. ["-3 in", "3 in"]')
        xs = tuple(
            to_internal(v, "length", field=f"{r.field('positions')}[{i}]", file=r.file)
            for i, v in enumerate(raw)
        )
        r.raw("count", None)
        r.raw("spacing", None)
    else:
        count = r.integer("count", low=1, high=200)
        spacing = r.quantity("spacing", "length", 2.0 * INCH_MM, positive=True)
        xs = tuple(float(v) for v in (np.arange(count) - (count - 1) / 2.0) * spacing)
    harp = None
    h = r.table("harp", required=False)
    if h is not None:
        end_height = h.quantity("end_height", "length", positive=True)
        end_spacing = h.quantity("end_spacing", "length", 2.0 * INCH_MM, positive=True)
        if end_height - (len(xs) - 1) * end_spacing <= 0:
            raise h.error(
                "end_height",
                "room below it for the row's strands stacked at end_spacing at the girder ends",
            )
        harp = (end_height, _hold_downs(h, length), end_spacing)
        h.done()
    debonds = []
    for d in r.tables("debond", required=False):
        if harp is not None:
            raise d.error("count", "straight strands: harped strands are not debonded here")
        if d.has("length"):
            left = right = d.quantity("length", "length", positive=True)
            d.raw("left", None)
            d.raw("right", None)
        else:
            left = d.quantity("left", "length", positive=True)
            right = d.quantity("right", "length", positive=True)
        for key, v in (("length", left), ("left", left), ("right", right)):
            if v >= length / 2.0 and (d.has(key) or key == "length"):
                raise d.error(
                    key if d.has(key) else "left",
                    "a debonded length shorter than half the girder length",
                    _long(v),
                )
        if d.has("positions"):
            raw = d.raw("positions")
            if (
                not isinstance(raw, list)
                or not raw
                or not all(isinstance(k, int) and 1 <= k <= len(xs) for k in raw)
                or len(set(raw)) != len(raw)
            ):
                raise d.error(
                    "positions",
                    f"strand numbers from 1 to {len(xs)} (left to right) in the row, each once",
                )
            idx = tuple(k - 1 for k in raw)
            if d.has("count") and d.integer("count", low=1, high=200) != len(raw):
                raise d.error(
                    "count",
                    f"the number of strands listed in positions ({len(raw)}), or no count",
                    str(d.raw("count")),
                )
            d.raw("count", None)
        else:
            idx = (d.integer("count", low=1, high=200),)  # resolved below, inner strands first
            idx = ("count", idx[0])  # type: ignore[assignment]
        debonds.append((idx, left, right, d.field("count")))
        d.done()
    r.done()
    # assign debonded strands: explicit positions, else innermost first in symmetric pairs
    order = sorted(range(len(xs)), key=lambda k: (abs(xs[k]), xs[k]))
    taken: set[int] = set()
    resolved = []
    for idx, left, right, field in debonds:
        if idx and idx[0] == "count":
            n = idx[1]
            free = [k for k in order if k not in taken]
            if n > len(free):
                raise InputError(
                    f"at most {len(free)} debonded strands in this row",
                    file=r.file,
                    field=field,
                    got=str(n),
                )
            chosen = tuple(free[:n])
        else:
            chosen = idx
            if taken & set(chosen):
                raise InputError("each strand debonded once", file=r.file, field=field)
        taken |= set(chosen)
        resolved.append((tuple(sorted(chosen)), left, right))
    return StrandRow(
        height=height,
        count=len(xs),
        spacing=0.0,
        x=xs,
        harp=harp,
        debond=tuple(resolved),
        index=index,
    )


def strand_places(
    rows: list[StrandRow] | tuple[StrandRow, ...],
) -> tuple[list[tuple[int, float, float]], list[tuple[int, float, float]]]:
    """Where every strand of the rows lies: at midlength and at the girder ends.

    Args:
        rows: the strand rows (heights and x in mm).

    Returns:
        Two lists of (index of the row in ``rows``, x across, y up from the girder bottom), mm:
        at midlength every strand at its row's height (harped strands between their
        hold-downs); at the girder ends straight strands at their row's height and harped
        strands in their row's column on the girder axis, the highest at ``end_height``, the
        others ``end_spacing`` below one another (as :func:`build_layout` places them).
    """
    mid: list[tuple[int, float, float]] = []
    ends: list[tuple[int, float, float]] = []
    for i, row in enumerate(rows):
        xs = [float(x) for x in row.x_positions()]
        mid += [(i, x, float(row.height)) for x in xs]
        if row.harp is None:
            ends += [(i, x, float(row.height)) for x in xs]
        else:
            top, _hold_downs, step = row.harp
            ends += [(i, 0.0, float(top - k * step)) for k in range(row.count)]
    return mid, ends


def closest_strands(
    places: list[tuple[int, float, float]], below: float
) -> dict[tuple[int, int], tuple[float, tuple[float, float], tuple[float, float]]]:
    """The closest two strands of each pair of rows nearer than ``below``, centre to centre.

    Args:
        places: (row index, x, y) of each strand, mm (see :func:`strand_places`).
        below: the distance, mm: only strands closer than it are returned.

    Returns:
        For each pair of row indices (a, b), a ≤ b (a = b: two strands of one row), the least
        distance (mm) and the (x, y) of the two strands, the one of row a first; pairs in the
        order their second strand comes in ``places``.
    """
    out: dict[tuple[int, int], tuple[float, tuple[float, float], tuple[float, float]]] = {}
    if len(places) < 2:
        return out
    row = np.array([p[0] for p in places], dtype=np.int64)
    xy = np.array([(p[1], p[2]) for p in places], dtype=float)
    for k in range(1, len(places)):
        dist = np.hypot(xy[:k, 0] - xy[k, 0], xy[:k, 1] - xy[k, 1])
        for j in np.flatnonzero(dist < below):
            a, b = int(row[j]), int(row[k])
            first, second = (j, k) if a <= b else (k, j)
            key = (min(a, b), max(a, b))
            if key not in out or dist[j] < out[key][0]:
                out[key] = (float(dist[j]), tuple(xy[first]), tuple(xy[second]))  # type: ignore[assignment]
    return out


def _check_strand_overlap(
    rows: list[StrandRow],
    fields: list[dict[str, str]],
    diameter: float,
    length: float,
    *,
    file: str,
    units: str,
) -> None:
    """Refuse two strands closer than one strand diameter, centre to centre (they would overlap).

    Checked at midlength, at the girder ends (where harped strands stand in their column on
    the axis) and along the harped strands' paths in between (:func:`closest_on_paths`).
    Strands touching (exactly one diameter apart) are accepted here; a spacing less than the
    detailing minimum of AASHTO LRFD 5.10.3.3.1 is a note of the check
    (:func:`prestress.analysis.strand_spacing_notes`), not an error.

    Args:
        rows: the job's strand rows, in the order read ([[strands.rows]] first, then the grid).
        fields: per row, the TOML path to name: "row" for the row, "within" for two of its own
            strands at midlength, "end_within" and "end_cross" for its harped strands at the
            ends (two of its own, one of another row's).
        diameter: the strand diameter, mm.
        length: the girder length, mm.
        file: the job file.
        units: the job's units ("US" or "SI"), those of the message.
    """
    mid, ends = strand_places(rows)

    def show(v: float) -> str:
        return show_dimension(v, units)

    for where, places in (
        ("at midlength", mid),
        ("at the girder ends (harped strands in their column on the axis)", ends),
    ):
        close = closest_strands(places, diameter - 1e-6)
        if not close:
            continue
        (a, b), (dist, pa, pb) = next(iter(close.items()))
        at_ends = places is ends
        if a == b:
            field = fields[b]["end_within" if at_ends and rows[b].harp else "within"]
        elif at_ends and rows[b].harp is None:
            field = fields[a]["end_cross"]
        elif at_ends:
            field = fields[b]["end_cross"]
        elif fields[a]["row"] == fields[b]["row"] == "strands.grid":
            field = "strands.grid.heights"
        else:
            field = fields[b]["row"]
        same = fields[a]["row"] == fields[b]["row"]
        of_a = "" if same else f" ({fields[a]['row']})"
        of_b = "" if same else f" ({fields[b]['row']})"
        raise InputError(
            f"strands at least one strand diameter ({show(diameter)}) apart, centre to centre "
            "(two strands cannot share a place)",
            file=file,
            field=field,
            got=f"two strands {show(dist)} apart {where}: x = {show(pa[0])}, "
            f"y = {show(pa[1])}{of_a} and x = {show(pb[0])}, y = {show(pb[1])}{of_b}",
        )
    # between the hold-downs and the ends a harped strand rises (and moves to the axis): it
    # may not pass through another strand there either
    clash = closest_on_paths(rows, length, diameter - 1e-6)
    if clash is not None:
        dist, station, (a, pa), (b, pb) = clash
        harped = b if rows[b].harp is not None else a
        raise InputError(
            "harped strands whose rising path passes no other strand closer than one strand "
            f"diameter ({show(diameter)}), centre to centre: harp the top strands of the "
            "central columns",
            file=file,
            field=f"{fields[harped]['row']}.harp",
            got=f"two strands {show(dist)} apart at {show_position(station, units)} from the "
            f"left end: x = {show(pa[0])}, y = {show(pa[1])} ({fields[a]['row']}) and "
            f"x = {show(pb[0])}, y = {show(pb[1])} ({fields[b]['row']})",
        )


_Point = tuple[float, float]


def _harped_paths(rows: list[StrandRow]) -> list[tuple[int, _Point, _Point, tuple[float, float]]]:
    """Each harped strand's path: (row, place at the hold-downs, place at the end, hold-downs).

    In mm; the k-th strand nearest the axis goes to the k-th place from the top of the end
    column (as :func:`build_layout` orders them).
    """
    out = []
    for i, row in enumerate(rows):
        if row.harp is None:
            continue
        top, hold_downs, step = row.harp
        xs = [float(x) for x in (row.x if row.x else row.x_positions())]
        for k, x in enumerate(sorted(xs, key=abs)):
            out.append((i, (x, float(row.height)), (0.0, float(top - k * step)), hold_downs))
    return out


def closest_on_paths(
    rows: list[StrandRow], length: float, below: float
) -> tuple[float, float, tuple[int, _Point], tuple[int, _Point]] | None:
    """The first two strands nearer than ``below`` (mm) between a hold-down and an end.

    Exact for the usual cases: a harped strand runs straight from its place between the
    hold-downs (parameter t = 0) to its place in the end column (t = 1), x and y linear in
    the distance along the girder, so against a straight strand the least distance is that
    of a point to a segment, and against another harped strand with the same hold-downs
    (same t at every station) the least of |D0 + t (D1 − D0)|; harped rows with other
    hold-downs are compared at 200 stations. Returns (distance, station on the left side
    where it occurs, (row, x-y there) of each strand) or None.
    """
    paths = _harped_paths(rows)
    if not paths:
        return None
    straight = [
        (i, (float(x), float(row.height)))
        for i, row in enumerate(rows)
        if row.harp is None
        for x in (row.x if row.x else row.x_positions())
    ]

    def at(p0: _Point, p1: _Point, t: float) -> _Point:
        return (p0[0] + t * (p1[0] - p0[0]), p0[1] + t * (p1[1] - p0[1]))

    def closest_t(d0: _Point, d1: _Point) -> float:
        """t in [0, 1] minimising |d0 + t (d1 − d0)|."""
        dx, dy = d1[0] - d0[0], d1[1] - d0[1]
        den = dx * dx + dy * dy
        return 0.0 if den == 0.0 else min(1.0, max(0.0, -(d0[0] * dx + d0[1] * dy) / den))

    for k, (i, a0, a1, hd) in enumerate(paths):
        for j, q in straight:  # d(t) = a(t) − q, linear in t
            t = closest_t((a0[0] - q[0], a0[1] - q[1]), (a1[0] - q[0], a1[1] - q[1]))
            p = at(a0, a1, t)
            d = math.hypot(p[0] - q[0], p[1] - q[1])
            if 0.0 < t < 1.0 and d < below:
                return d, hd[0] * (1.0 - t), (i, p), (j, q)
        for i2, b0, b1, hd2 in paths[k + 1 :]:
            if hd2 == hd:
                ts = [closest_t((a0[0] - b0[0], a0[1] - b0[1]), (a1[0] - b1[0], a1[1] - b1[1]))]
            else:  # other hold-downs: t differs at a station; compare at stations
                ts = []
                for station in np.linspace(0.0, max(hd[0], hd2[0]), 201)[1:-1]:
                    ta = max(0.0, 1.0 - station / hd[0])
                    tb = max(0.0, 1.0 - station / hd2[0])
                    pa, pb = at(a0, a1, ta), at(b0, b1, tb)
                    if math.hypot(pa[0] - pb[0], pa[1] - pb[1]) < below:
                        return math.hypot(pa[0] - pb[0], pa[1] - pb[1]), station, (i, pa), (i2, pb)
                continue
            t = ts[0]
            pa, pb = at(a0, a1, t), at(b0, b1, t)
            d = math.hypot(pa[0] - pb[0], pa[1] - pb[1])
            if 0.0 < t < 1.0 and d < below:
                return d, hd[0] * (1.0 - t), (i, pa), (i2, pb)
    return None


#: Names of the stations every check lists itself (:func:`prestress.stages.stations`); a
#: station of the job may not take one, nor any "left/right debond end N" or "... N + lt".
BUILT_IN_STATION_NAMES = (
    "left end",
    "right end",
    "left bearing",
    "right bearing",
    "left lt",
    "right lt",
    "midspan",
    *(f"{k / 10:.1f} span" for k in range(1, 10)),
    "left lift point",
    "right lift point",
    "left hold-down",
    "right hold-down",
    "tendon profile point",
)
_DEBOND_END_STATION = re.compile(r"(left|right) debond end \d+( \+ lt)?")


def _station_name(t: Table, index: int, earlier: dict[str, int]) -> str:
    """The name of stations[index]: not empty, not a built-in station's, not used before.

    Names are compared without case and surrounding spaces, as stations are looked up
    (e.g. ``plot magnel --station``). ``earlier``: the names already read (folded) → index.
    """
    name = t.string("name", f"station {index + 1}")
    key = " ".join(name.split()).lower()
    if not key:
        raise t.error("name", 'a station name, e.g. "splice" (not empty)', repr(name))
    if key in BUILT_IN_STATION_NAMES or _DEBOND_END_STATION.fullmatch(key):
        raise t.error(
            "name",
            "a name of the job's own, not one of the stations every check lists (left/right "
            "end, bearing, lt, lift point, hold-down, debond end N, midspan, 0.1 span to 0.9 "
            'span, tendon profile point), e.g. "splice"',
            repr(name),
        )
    if key in earlier:
        raise t.error(
            "name",
            f"a name used once (stations[{earlier[key]}] has it already)",
            repr(name),
        )
    earlier[key] = index
    return name


def _grid_rows(g: Table, first_index: int) -> list[StrandRow]:
    """A [strands.grid]: heights and positions, filled with `count` strands in order."""
    raw_h = g.raw("heights", expected='a list of row heights, e.g. ["2 in", "4 in"]')
    raw_x = g.raw("positions", expected='a list of horizontal positions, e.g. ["-11 in", ...]')
    if not isinstance(raw_h, list) or not raw_h:
        raise g.error("heights", 'a list of row heights, e.g. ["2 in", "4 in"]')
    if not isinstance(raw_x, list) or not raw_x:
        raise g.error("positions", 'a list of horizontal positions, e.g. ["-11 in", "-9 in"]')
    hs = [
        to_internal(v, "length", field=f"{g.field('heights')}[{i}]", file=g.file)
        for i, v in enumerate(raw_h)
    ]
    xs = [
        to_internal(v, "length", field=f"{g.field('positions')}[{i}]", file=g.file)
        for i, v in enumerate(raw_x)
    ]
    count = g.integer("count", low=1, high=2000)
    fill = g.string("fill", "bottom-up", choices=("bottom-up", "given"))
    if fill == "given":
        raw = g.raw("order", expected="a list of [row, position] pairs (1-based)")
        if (
            not isinstance(raw, list)
            or len(raw) < count
            or not all(
                isinstance(p, list)
                and len(p) == 2
                and all(isinstance(k, int) for k in p)
                and 1 <= p[0] <= len(hs)
                and 1 <= p[1] <= len(xs)
                for p in raw
            )
        ):
            raise g.error(
                "order",
                f"at least {count} [row, position] pairs with rows 1 to "
                f"{len(hs)} and positions 1 to {len(xs)}",
            )
        slots = [(p[0] - 1, p[1] - 1) for p in raw[:count]]
        if len(set(slots)) != len(slots):
            raise g.error("order", "each grid position once")
    else:
        g.raw("order", None)
        centre_out = sorted(range(len(xs)), key=lambda k: (abs(xs[k]), xs[k]))
        row_order = sorted(range(len(hs)), key=lambda k: hs[k])
        slots = [(ri, ci) for ri in row_order for ci in centre_out][:count]
        if len(slots) < count:
            raise g.error(
                "count", f"at most {len(hs) * len(xs)} strands (the grid's size)", str(count)
            )
    g.done()
    rows = []
    for ri in sorted({r for r, _ in slots}, key=lambda k: hs[k]):
        cols = sorted(xs[c] for r, c in slots if r == ri)
        rows.append(
            StrandRow(
                height=hs[ri],
                count=len(cols),
                spacing=0.0,
                x=tuple(cols),
                index=first_index + len(rows),
            )
        )
    return rows


def build_layout(
    rows: list[StrandRow],
    area: float,
    length: float,
    lt: float,
    rules: dict[str, float],
    units: str = "US",
) -> Layout:
    """The strand sets of the rows: bonded, debonded groups and harped rows.

    ``units``: the job's units ("US" or "SI"), those of the sets' labels.
    """
    sets = []
    for i, row in enumerate(rows):
        label = f"row {i + 1} at {show_dimension(row.height, units)}"
        deb = {k for idx, _l, _r in row.debond for k in idx}
        bonded = tuple(x for k, x in enumerate(row.x) if k not in deb)
        if row.harp is not None:
            end, hd, step = row.harp
            # at the ends the harped strands stand in one vertical column on the girder axis,
            # the highest at end_height (common practice for I-girder and bulb-tee webs)
            for k, x in enumerate(sorted(row.x, key=abs)):
                sets.append(
                    StrandSet(
                        f"{label}, harped strand {k + 1}",
                        i,
                        (x,),
                        area,
                        row.height,
                        end - k * step,
                        hd,
                    )
                )
            continue
        if bonded:
            sets.append(StrandSet(label, i, bonded, area, row.height))
        for idx, left, right in row.debond:
            sets.append(
                StrandSet(
                    f"{label}, debonded {show_position(left, units)}",
                    i,
                    tuple(row.x[k] for k in idx),
                    area,
                    row.height,
                    debond_left=left,
                    debond_right=right,
                )
            )
    return Layout(sets=tuple(sets), length=length, transfer_length=lt, rules=rules)


def _effective_width(
    d: Table, spacing: float | None, position: str, span: float
) -> tuple[float, str, float]:
    """Effective and tributary deck widths: given, or from the spacing per AASHTO 4.6.2.6.1."""
    overhang = d.quantity("overhang", "length", None, non_negative=True)
    if d.has("effective_width"):
        eff = d.quantity("effective_width", "length", positive=True)
        source = "given in the job"
    else:
        if spacing is None:
            raise d.error(
                "effective_width",
                "an effective width, or girder.spacing to compute it (AASHTO LRFD 4.6.2.6.1)",
                "neither",
            )
        if position == "exterior":
            if overhang is None:
                raise d.error("overhang", "the deck overhang of an exterior girder")
            eff = effective_width.b_eff_exterior(spacing, overhang)
            source = "AASHTO LRFD 9th Ed. (2020) 4.6.2.6.1, exterior: S/2 + overhang"
        else:
            eff = effective_width.b_eff_interior(spacing)
            source = "AASHTO LRFD 9th Ed. (2020) 4.6.2.6.1, interior: tributary width S"
        if span / spacing < 2.0:
            raise d.error(
                "effective_width",
                "a given effective width: span / spacing < 2.0, "
                "where 4.6.2.6.1 calls for a refined analysis",
                f"{span / spacing:.2f}",
            )
    if spacing is not None:
        trib = spacing if position == "interior" else spacing / 2.0 + (overhang or 0.0)
    else:
        trib = eff
    return eff, source, trib


def load_job(path: str | Path) -> Job:
    """Read and validate a job file; raise InputError naming the field on any mistake."""
    path = Path(path)
    top = Table(read_toml(path), file=str(path))
    header = top.data.get("job")
    units = header.get("units") if isinstance(header, dict) else None
    units = units.upper() if isinstance(units, str) else units
    token = _JOB_UNITS.set(units if units in ("US", "SI") else "US")
    try:
        return _read_job(path, top)
    finally:
        _JOB_UNITS.reset(token)


def _read_job(path: Path, top: Table) -> Job:
    """The job file's tables, read in order (see :func:`load_job`)."""
    file = str(path)
    job = top.table("job")
    assert job is not None
    title = job.string("title")
    project = job.string("project", "")
    owner = job.string("owner", "")
    engineer = job.string("engineer", "")
    units = job.string("units", "US", choices=("US", "SI"))
    lib_raw = job.raw("section_libraries", [], expected="a list of folders")
    if not isinstance(lib_raw, list) or not all(isinstance(p, str) for p in lib_raw):
        raise job.error("section_libraries", "a list of folder paths (strings)")
    libs = tuple(str(path.parent / p) if not Path(p).is_absolute() else p for p in lib_raw)
    for i, folder in enumerate(libs):
        if not Path(folder).is_dir():
            raise InputError(
                "an existing folder of section files",
                file=file,
                field=f"job.section_libraries[{i}]",
                got=f"no folder {folder}",
            )
    job.done()

    g = top.table("girder")
    assert g is not None
    section = _section(g)
    length = g.quantity("length", "length", positive=True)
    span = g.quantity("span", "length", positive=True)
    if span > length:
        raise g.error("span", "a design span no longer than the girder length", _long(span))
    if not 1000.0 <= length <= 100_000.0:
        raise g.error("length", "a girder length from 1 m to 100 m (3.3 to 330 ft)")
    if span < 0.5 * length:
        raise g.error(
            "span",
            "a design span of at least half the girder length (bearings near the ends)",
            f"{_long(span)} on a {_long(length)} girder",
        )
    spacing = g.quantity("spacing", "length", None, positive=True)
    position = g.string("position", "interior", choices=("interior", "exterior"))
    gc = g.table("concrete")
    assert gc is not None
    girder_concrete = _concrete(gc, "girder", at_transfer=True)
    g.done()

    deck = None
    d = top.table("deck", required=False)
    if d is not None:
        dc = d.table("concrete")
        assert dc is not None
        deck_concrete = _concrete(dc, "deck", at_transfer=False)
        eff, eff_source, trib = _effective_width(d, spacing, position, span)
        deck = Deck(
            thickness=d.quantity("thickness", "length", positive=True),
            wearing_surface=d.quantity("wearing_surface", "length", 0.0, non_negative=True),
            effective_width=eff,
            tributary_width=d.quantity("tributary_width", "length", trib, positive=True),
            haunch=d.quantity("haunch", "length", 0.0, non_negative=True),
            haunch_width=d.quantity("haunch_width", "length", 0.0, non_negative=True),
            haunch_in_stiffness=d.boolean("haunch_in_stiffness", False),
            concrete=deck_concrete,
            effective_width_source=eff_source,
        )
        d.done()

    s = top.table("strand")
    assert s is not None
    strand = _strand(s)

    tendons = _tendons(top, strand, length)
    st = top.table("strands", required=not tendons)
    if st is None:
        st = Table({}, file=file, path="strands")
    elif tendons:
        raise st.error(
            "rows",
            "either pretensioned strands or post-tensioned tendons in one job "
            "(a combination is not supported yet)",
            "both [strands] and [[tendons]]",
        )
    lt_default = 60.0 * strand.diameter
    lt = st.quantity("transfer_length", "length", lt_default, positive=True)
    if lt >= length / 2.0:
        raise st.error(
            "transfer_length",
            "a transfer length shorter than half the girder",
            _long(lt),
        )
    lt_source = (
        "AASHTO LRFD 9th Ed. (2020) 5.9.4.3.1 (60 d_b)" if lt == lt_default else "given in the job"
    )
    row_tables = st.tables("rows", required=False)
    rows = [_row(r, i, length) for i, r in enumerate(row_tables)]
    fields = [
        {
            "row": r.path,
            "within": r.field("positions" if r.has("positions") else "spacing"),
            "end_within": f"{r.field('harp')}.end_spacing",
            "end_cross": f"{r.field('harp')}.end_height",
        }
        for r in row_tables
    ]
    grid = st.table("grid", required=False)
    if grid is not None:
        grid_rows = _grid_rows(grid, len(rows))
        rows += grid_rows
        fields += [{"row": grid.path, "within": grid.field("positions")}] * len(grid_rows)
    _check_strand_overlap(rows, fields, strand.diameter, length, file=file, units=units)
    if not rows and not tendons:
        raise st.error(
            "rows", "at least one [[strands.rows]] table or a [strands.grid]", "no strands"
        )
    rules: dict[str, float] = {}
    det = st.table("detailing", required=False)
    if det is not None:
        for key in ("max_share_total", "max_share_row", "max_terminations_share"):
            if det.has(key):
                rules[key] = det.number(key, low=0.0, high=1.0)
            else:
                det.raw(key, None)
        if det.has("max_terminations_count"):
            rules["max_terminations_count"] = det.integer("max_terminations_count", low=0)
        else:
            det.raw("max_terminations_count", None)
        det.done()
    st.done()
    layout = build_layout(rows, strand.area, length, lt, rules, units) if rows else None

    ld = top.table("loads", required=False)
    if ld is None:
        loads = Loads(0.0, 0.0, 0.0, _live(None))
    else:
        loads = Loads(
            superimposed_dead=ld.quantity("superimposed_dead", "line_load", 0.0, non_negative=True),
            wearing_surface=ld.quantity("wearing_surface", "line_load", 0.0, non_negative=True),
            other_noncomposite=ld.quantity(
                "other_noncomposite", "line_load", 0.0, non_negative=True
            ),
            live=_live(ld.table("live", required=False)),
            diaphragms=_diaphragms(ld, span),
            deck_shrinkage=_deck_shrinkage(ld, has_deck=top.has("deck")),
        )
        ld.done()

    tm = top.table("time")
    assert tm is not None
    rh = _percent(tm, "relative_humidity")
    ages = {}
    for key in ("transfer", "deck_placement", "final"):
        ages[key] = tm.quantity(key, "time", positive=True)
    if not ages["transfer"] < ages["deck_placement"]:
        raise tm.error("deck_placement", "an age later than transfer")
    if not ages["deck_placement"] < ages["final"]:
        raise tm.error("final", "an age later than deck placement")
    tm.done()
    times = Times(relative_humidity=rh, **ages)

    ls = top.table("losses", required=False)
    method = "given" if tendons else "aashto-approximate"
    basis = "gross"
    long_term_given = None
    if ls is not None:
        method = ls.string("method", method, choices=LOSS_METHODS)
        basis = ls.string("section", basis, choices=("gross", "transformed"))
        if method == "given":
            lt_final = ls.quantity("long_term", "stress", non_negative=True)
            lt_deck = ls.quantity("long_term_to_deck", "stress", None, non_negative=True)
            if lt_deck is not None and lt_deck > lt_final:
                raise ls.error("long_term_to_deck", "no more than the final long-term loss")
            long_term_given = (lt_final, lt_deck)
        else:
            ls.raw("long_term", None)
            ls.raw("long_term_to_deck", None)
        ls.done()
    if tendons and basis == "transformed":
        raise InputError(
            'section = "gross" for a post-tensioned girder (the ducts are not bonded at stressing)',
            file=file,
            field="losses.section",
        )
    if tendons and method != "given":
        raise InputError(
            'method = "given" for a post-tensioned girder (the AASHTO estimates '
            "and the time-step method here are for pretensioned girders)",
            file=file,
            field="losses.method",
            got=f"'{method}'",
        )
    if method == "given" and long_term_given is None:
        raise InputError(
            'a [losses] table with long_term = "..." for method "given"',
            file=file,
            field="losses.long_term",
        )

    combos = {
        "service_permanent": Combination(1.0, 0.0),
        "service_i": Combination(1.0, 1.0, "AASHTO LRFD 9th Ed. (2020) Table 3.4.1-1"),
        "service_iii": service_iii_default(method, basis),
    }
    cb = top.table("combinations", required=False)
    if cb is not None:
        for key in ("service_i", "service_iii"):
            c = cb.table(key, required=False)
            if c is not None:
                given_live = c.has("live")
                live = c.number("live", combos[key].live, low=0, high=5)
                combos[key] = Combination(
                    dead=c.number("dead", combos[key].dead, low=0, high=5),
                    live=live,
                    source="given in the job"
                    if given_live
                    else f"dead given in the job; live: {combos[key].source}",
                )
                c.done()
        cb.done()

    handling = None
    hd = top.table("handling", required=False)
    if hd is not None:
        lift = hd.quantity("lift_point", "length", positive=True)
        if lift >= length / 2.0:
            raise hd.error("lift_point", "a lifting point closer to the end than mid-length")
        handling = Handling(lift, _dynamic_factors(hd))
        hd.done()
    user_stations = []
    station_names: dict[str, int] = {}
    raw_st = top.raw("stations", [], expected="a list of stations")
    if not isinstance(raw_st, list):
        raise InputError(
            'a list of stations, e.g. [{ name = "splice", at = "30 ft" }]',
            file=file,
            field="stations",
        )
    for i, item in enumerate(raw_st):
        if not isinstance(item, dict):
            raise InputError(
                'a table { name = "...", at = "30 ft" }', file=file, field=f"stations[{i}]"
            )
        t_ = Table(item, file=file, path=f"stations[{i}]")
        x = t_.quantity("at", "length", non_negative=True)
        if x > length:
            raise t_.error(
                "at",
                f"a position on the girder, from its left end (0 to {_long(length)})",
                _long(x),
            )
        user_stations.append((_station_name(t_, i, station_names), x))
        t_.done()

    lim = top.table("limits")
    assert lim is not None
    if lim.has("set"):
        from prestress.paths import shipped_examples_dir

        folder = shipped_examples_dir() / "limits"
        names = sorted(p.stem for p in folder.glob("*.toml"))
        name = lim.string("set", choices=tuple(names))
        lim.done()
        lpath = folder / f"{name}.toml"
        limits = read_limits(Table(read_toml(lpath), file=str(lpath)))
    elif lim.has("file"):
        ref = lim.string("file")
        lim.done()
        lpath = (path.parent / ref) if not Path(ref).is_absolute() else Path(ref)
        if not lpath.is_file():
            raise InputError(
                "the path of a limit-set file, relative to the job file",
                file=file,
                field="limits.file",
                got=f"no file {lpath}" if not lpath.exists() else f"{lpath} is not a file",
            )
        lt_top = Table(read_toml(lpath), file=str(lpath))
        limits = read_limits(lt_top)
    else:
        limits = read_limits(lim)

    top.raw("design", None)  # the search space of prestress design (read by prestress.design)
    top.done()
    return Job(
        file=file,
        title=title,
        project=project,
        owner=owner,
        engineer=engineer,
        units=units,
        section=section,
        length=length,
        span=span,
        girder_concrete=girder_concrete,
        deck=deck,
        strand=strand,
        rows=tuple(rows),
        layout=layout,
        tendons=tuple(tendons),
        long_term_given=long_term_given,
        handling=handling,
        user_stations=tuple(user_stations),
        loads=loads,
        times=times,
        limits=limits,
        loss_method=method,
        transfer_length=lt,
        transfer_length_source=lt_source,
        combinations=combos,
        library_paths=libs,
        loss_basis=basis,
        spacing=spacing,
        position=position,
    )
