"""Command line: a thin shell over the Python API.

Exit status: 0 when every check passes, 1 when any limit is exceeded, 2 for bad input
(a one-line message naming the file and field, no traceback unless ``--debug``).
"""

from __future__ import annotations

import argparse
import sys
from collections.abc import Sequence
from pathlib import Path
from typing import TYPE_CHECKING

from prestress import __version__
from prestress.errors import InputError

if TYPE_CHECKING:
    from prestress.analysis import CheckResult
    from prestress.model import Job

EXIT_OK, EXIT_FAIL, EXIT_INPUT, EXIT_INTERNAL = 0, 1, 2, 3


class _Parser(argparse.ArgumentParser):
    """An argument parser whose usage errors exit with status 2 on one line."""

    def error(self, message: str) -> None:  # type: ignore[override]
        self.exit(EXIT_INPUT, f"prestress: error: {message} (see 'prestress --help')\n")


def _output_units(text: str) -> str:
    """The ``--units`` value, read whatever its case: "US" or "SI"."""
    system = text.strip().upper()
    if system not in ("US", "SI"):
        raise argparse.ArgumentTypeError(f"expected US or SI (any case); got '{text}'")
    return system


def _add_common(p: argparse.ArgumentParser) -> None:
    p.add_argument(
        "--units",
        type=_output_units,
        metavar="{US,SI}",
        help="output units, US or SI in any case (default: the job's)",
    )
    p.add_argument(
        "--library",
        action="append",
        default=[],
        metavar="DIR",
        help="a further section library folder, searched before the shipped one (repeatable)",
    )
    p.add_argument("--debug", action="store_true", help="show a traceback on errors")


class _Skipped:
    """Stands in for the parser of a command that is not being run (faster start-up)."""

    def __getattr__(self, _name: str):
        return lambda *a, **k: self


def build_parser(only: str | None = None) -> argparse.ArgumentParser:
    """The argument parser of the ``prestress`` command."""
    parser = _Parser(
        prog="prestress",
        description="Check prestressed concrete girders stage by "
        "stage: section properties, losses, fiber stresses against your limits.",
    )
    parser.add_argument("--version", action="version", version=f"prestress {__version__}")
    real = parser.add_subparsers(dest="command", metavar="COMMAND", parser_class=_Parser)

    class _Sub:
        """Adds a command's parser, or skips it when another command is being run."""

        def add_parser(self, name: str, **kw):
            if only is not None and name != only:
                return _Skipped()
            return real.add_parser(name, **kw)

    sub = _Sub()

    p = sub.add_parser("check", help="check a job: properties, losses, stresses per stage")
    p.add_argument("job", help="the job file (TOML)")
    p.add_argument(
        "--json",
        nargs="?",
        const="-",
        metavar="FILE",
        help="write the results as JSON to FILE, or to standard output",
    )
    p.add_argument("--force", action="store_true", help="replace an existing output file")
    p.add_argument(
        "--csv",
        metavar="DIR",
        help="also write every stage table, the losses and the zone as CSV files in DIR",
    )
    p.add_argument(
        "--stage",
        metavar="KEYS",
        help="show only these stages (comma-separated: transfer, handling, "
        "deck_placement, service_permanent, service_i, service_iii); the verdict and "
        "exit status still cover every stage",
    )
    p.add_argument(
        "--stations",
        metavar="NAMES",
        help="show only stations whose name contains one of these (comma-separated, "
        'e.g. "midspan,lt,hold-down")',
    )
    _add_common(p)

    p = sub.add_parser("report", help="a reviewable calculation report (HTML or Markdown)")
    p.add_argument("job", help="the job file (TOML)")
    p.add_argument("--out", required=True, metavar="FILE", help="FILE.html or FILE.md")
    p.add_argument("--force", action="store_true", help="replace an existing output file")
    _add_common(p)

    p = sub.add_parser("plot", help="plots: section, stresses, zone, losses, magnel")
    p.add_argument("job", help="the job file (TOML)")
    p.add_argument("kind", choices=("section", "stresses", "zone", "losses", "magnel"))
    p.add_argument("--out", required=True, metavar="FILE", help="FILE.png or FILE.svg")
    p.add_argument("--station", help="magnel: the station (name), default midspan")
    p.add_argument("--force", action="store_true", help="replace an existing output file")
    _add_common(p)

    p = sub.add_parser("design", help="search the leanest strand pattern that passes")
    p.add_argument("job", help="the job file (TOML); its optional [design] table sets the space")
    p.add_argument(
        "--write",
        metavar="NEW.toml",
        help="write the leanest passing pattern as a new job file (never the input)",
    )
    p.add_argument("--force", action="store_true", help="replace an existing --write file")
    p.add_argument("--json", action="store_true", help="JSON on standard output")
    _add_common(p)

    p = sub.add_parser("zone", help="the permissible zone of the cgs along the girder")
    p.add_argument("job", help="the job file (TOML)")
    p.add_argument("--json", action="store_true", help="JSON on standard output")
    _add_common(p)

    p = sub.add_parser("losses", help="prestress losses per stage, by one method or all")
    p.add_argument("job", help="the job file (TOML)")
    p.add_argument("--method", help="a loss method (default: the job's losses.method)")
    p.add_argument("--compare", action="store_true", help="every applicable method side by side")
    p.add_argument(
        "--at",
        metavar="AGES",
        help="time-step methods: strand and fiber stresses at midlength at these girder ages, "
        'e.g. "28 d, 1 year, 10 years"',
    )
    p.add_argument("--json", action="store_true", help="JSON on standard output")
    _add_common(p)

    p = sub.add_parser("sections", help="list the section library")
    p.add_argument("--family", help="only this family (e.g. i_girder, box_beam)")
    p.add_argument(
        "--min-depth", metavar="LENGTH", help='only sections at least this deep, e.g. "48 in"'
    )
    p.add_argument("--max-depth", metavar="LENGTH", help="only sections at most this deep")
    p.add_argument(
        "--unit-weight",
        default="150 pcf",
        metavar="WEIGHT",
        help='unit weight for the weight column (default "150 pcf")',
    )
    p.add_argument("--json", action="store_true", help="JSON on standard output")
    _add_common(p)

    p = sub.add_parser("section", help="properties or drawing of one section")
    ssub = p.add_subparsers(
        dest="section_command", metavar="ACTION", parser_class=_Parser, required=True
    )
    q = ssub.add_parser("show", help="property table of a section, optionally with a deck")
    q.add_argument("name", help="the section's name (see 'prestress sections')")
    q.add_argument("--deck-thickness", metavar="LENGTH", help="structural deck thickness")
    q.add_argument("--deck-width", metavar="LENGTH", help="effective deck width")
    q.add_argument("--haunch", metavar="LENGTH", default="0 in", help="haunch thickness")
    q.add_argument(
        "--haunch-in-stiffness",
        action="store_true",
        help="count the haunch in the composite stiffness",
    )
    q.add_argument("--fc-girder", metavar="STRESS", help="girder f'c, for the modular ratio")
    q.add_argument("--fc-deck", metavar="STRESS", help="deck f'c, for the modular ratio")
    q.add_argument(
        "--modular-ratio",
        type=float,
        metavar="N",
        help="deck-to-girder modular ratio, instead of the two strengths",
    )
    q.add_argument(
        "--unit-weight",
        default="150 pcf",
        metavar="WEIGHT",
        help='unit weight for the weight per length (default "150 pcf")',
    )
    q.add_argument(
        "--torsion",
        action="store_true",
        help="also compute the torsion constant J (warping analysis, slower)",
    )
    q.add_argument("--json", action="store_true", help="JSON on standard output")
    _add_common(q)
    q = ssub.add_parser("draw", help="draw a section to scale (SVG or PNG)")
    q.add_argument("name", nargs="?", help="the section's name (or give --job)")
    q.add_argument("--out", required=True, metavar="FILE", help="FILE.svg or FILE.png")
    q.add_argument("--job", metavar="JOB", help="draw the job's girder with its strands and deck")
    q.add_argument("--force", action="store_true", help="replace an existing output file")
    _add_common(q)

    p = sub.add_parser("examples", help="list the shipped example jobs, or copy them to a folder")
    p.add_argument("--copy", metavar="DIR", help="copy the examples into DIR (never overwrites)")
    p.add_argument("--debug", action="store_true", help="show a traceback on errors")

    p = sub.add_parser("cache", help="manage the cache of computed section properties")
    p.add_argument("action", choices=("clear", "where"))
    p.add_argument("--debug", action="store_true", help="show a traceback on errors")
    return parser


def _check_output(target: Path, *, inputs: Sequence[Path], force: bool) -> None:
    """Refuse an output that is an input, or that exists without --force."""
    from prestress.atomic import check_output_path

    check_output_path(target, inputs=list(inputs), force=force)


def _inputs(job: Job, args: argparse.Namespace) -> list[Path]:
    """The files a job reads (job, limit set, section libraries): never an output."""
    from prestress.inputs import input_files

    return input_files(job, tuple(getattr(args, "library", ()) or ()))


def _write_output(path: str, text: str, *, inputs: Sequence[Path], force: bool) -> None:
    """Write an output file atomically after :func:`_check_output`."""
    from prestress.atomic import write_atomic

    target = Path(path)
    _check_output(target, inputs=inputs, force=force)
    write_atomic(target, text)


def cmd_check(args: argparse.Namespace) -> int:
    """``prestress check JOB``."""
    from prestress.analysis import check_file

    result = check_file(args.job, cli_libraries=tuple(args.library))
    system = args.units or result.girder.job.units
    # the console's filters are checked before anything is written: exit 2 writes nothing
    stages, stations = _console_filters(args, result)
    if args.json is not None:
        from prestress.present.jsonout import to_json

        text = to_json(result, system)
        if args.json == "-":
            sys.stdout.write(text)
        else:
            _write_output(
                args.json, text, inputs=_inputs(result.girder.job, args), force=args.force
            )
    if args.csv:
        from prestress.present.csv_out import write_csv

        written = write_csv(
            result,
            Path(args.csv),
            system,
            force=args.force,
            inputs=_inputs(result.girder.job, args),
        )
        if args.json != "-":
            print(f"wrote {len(written)} CSV files to {args.csv}", file=sys.stderr)
    if args.json != "-":
        from prestress.present.console import make_console, render

        render(result, make_console(), system, stages=stages, stations=stations)
    return EXIT_OK if result.ok else EXIT_FAIL


def _console_filters(
    args: argparse.Namespace, result: CheckResult
) -> tuple[tuple[str, ...] | None, tuple[str, ...] | None]:
    """The --stage keys and --stations words of ``check``, each checked against the job."""
    from prestress.model import STAGES
    from prestress.present.common import station_matches

    stages = None
    if args.stage:
        stages = tuple(k.strip() for k in args.stage.split(",") if k.strip())
        bad = [
            k
            for k in stages
            if k not in STAGES
            and not (k.startswith("handling_") and k.removeprefix("handling_").isdigit())
        ]
        if bad:
            raise InputError(
                "stage keys among " + ", ".join(STAGES) + " (or handling_1, handling_2, …)",
                file="command line",
                field="--stage",
                got=repr(bad[0]),
            )
        present = {k for s in result.stages for k in (s.key, s.limits_key) if k}
        for k in stages:
            if k not in present:  # e.g. handling without [handling], or a third case of two
                raise InputError(
                    "a stage of this job: " + ", ".join(s.key for s in result.stages),
                    file="command line",
                    field="--stage",
                    got=repr(k),
                )
    stations = None
    if args.stations:
        stations = tuple(w.strip() for w in args.stations.split(",") if w.strip())
        names = list(dict.fromkeys(st.name for sr in result.stages for st in sr.stations))
        for word in stations:
            if not any(station_matches(n, (word,)) for n in names):
                raise InputError(
                    "words found in the job's station names: " + ", ".join(names),
                    file="command line",
                    field="--stations",
                    got=repr(word),
                )
    return stages, stations


def cmd_report(args: argparse.Namespace) -> int:
    """``prestress report JOB --out FILE``."""
    from prestress.analysis import check_file
    from prestress.present.report import write_report

    out = Path(args.out)
    _check_output(out, inputs=[Path(args.job)], force=args.force)
    job_text = Path(args.job).read_bytes()
    result = check_file(args.job, cli_libraries=tuple(args.library))
    _check_output(out, inputs=_inputs(result.girder.job, args), force=args.force)
    write_report(result, out, job_text=job_text, system=args.units, force=args.force)
    print(f"wrote {out}")
    return EXIT_OK if result.ok else EXIT_FAIL


def cmd_plot(args: argparse.Namespace) -> int:
    """``prestress plot JOB KIND --out FILE``."""
    from prestress.analysis import check_file
    from prestress.present import plots

    out = Path(args.out)
    if out.suffix.lower() not in (".png", ".svg"):
        raise InputError("an output file ending in .png or .svg", file=str(out), field="--out")
    _check_output(out, inputs=[Path(args.job)], force=args.force)
    result = check_file(args.job, cli_libraries=tuple(args.library))
    _check_output(out, inputs=_inputs(result.girder.job, args), force=args.force)
    system = args.units or result.girder.job.units
    if args.kind == "magnel":
        plots.plot_magnel(result, out, system, station=args.station)
    else:
        plots.PLOT_KINDS[args.kind](result, out, system)
    print(f"wrote {out}")
    return EXIT_OK


def cmd_design(args: argparse.Namespace) -> int:
    """``prestress design JOB [--write NEW.toml]``."""
    import json

    from prestress.design import design_file, write_design_job
    from prestress.present import design_view
    from prestress.present.common import CAUTION
    from prestress.present.console import make_console

    result = design_file(args.job, cli_libraries=tuple(args.library))
    if args.write and result.ok:
        write_design_job(
            args.job,
            result.leanest,
            args.write,
            force=args.force,
            inputs=_inputs(result.job, args),
        )
    elif args.write:  # the search itself is shown, as without --write; nothing is written
        print(f"prestress: no pattern passes: {args.write} not written", file=sys.stderr)
    if args.json:
        data = design_view.to_dict(result, args.units)
        data["caution"] = CAUTION
        sys.stdout.write(json.dumps(data, indent=2, ensure_ascii=False, allow_nan=False) + "\n")
    else:
        console = make_console()
        design_view.render(result, console, args.units)
        if args.write and result.ok:
            console.print(f"wrote the leanest passing pattern to {args.write}")
    return EXIT_OK if result.ok else EXIT_FAIL


def cmd_zone(args: argparse.Namespace) -> int:
    """``prestress zone JOB``: elevation with the zone band and the cgs; stations outside."""
    import json

    from prestress.analysis import check_file
    from prestress.present import zone_view
    from prestress.present.common import CAUTION
    from prestress.present.console import make_console
    from prestress.present.jsonout import to_dict

    result = check_file(args.job, cli_libraries=tuple(args.library))
    system = args.units or result.girder.job.units
    outside = [z for z in result.zone if not z.inside]
    if args.json:
        data = to_dict(result, system)
        out = {k: data[k] for k in ("schema", "job", "units", "zone", "caution")}
        sys.stdout.write(json.dumps(out, indent=2, ensure_ascii=False, allow_nan=False) + "\n")
        return EXIT_OK if not outside else EXIT_FAIL
    console = make_console()
    width = max(40, min(160, console.width - 18))
    console.print(
        f"[bold]prestress zone[/] — {result.girder.job.title} "
        f"({result.girder.section_name}, {result.girder.job.file})"
    )
    console.print(zone_view.elevation(result, zone_view.dense_profile(result, width), width))
    console.print(zone_view.legend(system, result))
    console.print(zone_view.zone_table(result, system))
    if outside:
        console.print(
            "[bold red]The cgs leaves the zone at:[/] " + ", ".join(z.station.name for z in outside)
        )
    else:
        console.print("[green]The cgs lies inside the zone at every station.[/]")
    console.print(f"[yellow]{CAUTION}[/]")
    return EXIT_OK if not outside else EXIT_FAIL


def cmd_losses(args: argparse.Namespace) -> int:
    """``prestress losses JOB [--compare] [--method M] [--json]``."""
    import json

    from rich.markup import escape

    from prestress.analysis import compare_losses, losses_file
    from prestress.jobfile import LOSS_METHODS
    from prestress.present import losses_view as view
    from prestress.present.common import CAUTION
    from prestress.present.console import make_console

    if args.method is not None and args.method not in LOSS_METHODS:
        raise InputError(
            "a loss method: one of " + ", ".join(LOSS_METHODS),
            file="command line",
            field="--method",
            got=repr(args.method),
        )
    girder, chosen = losses_file(args.job, method=args.method, cli_libraries=tuple(args.library))
    job = girder.job
    system = args.units or job.units
    if args.at:
        return _losses_history(args, girder, chosen.method, system)
    results, skipped = compare_losses(girder) if args.compare else ([chosen], [])
    if args.json:
        data = {
            "units": system,
            "job": {"file": job.file, "title": job.title},
            "methods": [view.to_dict(b, job.A_ps, system) for b in results],
            "not_applicable": skipped,
            "caution": CAUTION,
        }
        sys.stdout.write(json.dumps(data, indent=2, ensure_ascii=False, allow_nan=False) + "\n")
        return EXIT_OK
    from prestress.present.common import fmt, label

    console = make_console()
    console.print(
        f"[bold]prestress losses[/] — {job.title} ({job.file}); "
        + (
            f"{len(job.tendons)} tendons, {sum(t.strands for t in job.tendons)} strands in all"
            if job.post_tensioned
            else f"{job.strand_count} strands"
        )
        + f", Aps {fmt(job.A_ps, system, 'area')} {label(system, 'area')}, fpj "
        f"{fmt(chosen.jacking_stress, system, 'stress')} {label(system, 'stress')}; "
        + (
            "stresses on the section net of the ducts at stressing, gross after grouting"
            if job.post_tensioned
            else f"stresses on {girder.basis} sections"
        )
    )
    if args.compare:
        console.print(view.compare_table(results, job.A_ps, system))
        for s in skipped:
            console.print(f"[dim]Not applicable: {escape(s)}[/]")
        # the caveats (a model used beyond its range); each method's other notes are shown
        # with --method M
        for b in results:
            for n in b.notes:
                if n.startswith(f"{b.method} method:"):
                    console.print(f"[dim]Note: {escape(n)}[/]")
        console.print(
            "[dim]The notes of one method (its inputs, models and assumptions): "
            "prestress losses JOB --method NAME[/]"
        )
    else:
        if job.post_tensioned:
            for t in view.tendon_tables(girder, system):
                console.print(t)
        for t in view.stage_tables(chosen, job.A_ps, system):
            console.print(t)
        for n in chosen.notes:
            console.print(f"[dim]Note: {escape(n)}[/]")
    console.print(f"[yellow]{CAUTION}[/]")
    return EXIT_OK


def _losses_history(args: argparse.Namespace, girder, method: str, system: str) -> int:  # type: ignore[no-untyped-def]
    """``prestress losses JOB --at AGES``: the time-step history at midlength."""
    import json

    from rich.markup import escape

    from prestress.losses.timestep_method import history
    from prestress.present import losses_view as view
    from prestress.present.common import CAUTION
    from prestress.present.console import make_console
    from prestress.units import to_internal

    if not method.startswith("time-step"):
        raise InputError(
            "a time-step method for --at (e.g. --method time-step-aashto)",
            file="command line",
            field="--method",
            got=repr(method),
        )
    ages = tuple(
        to_internal(a.strip(), "time", field="--at", file="command line")
        for a in args.at.split(",")
        if a.strip()
    )
    rows = history(girder, method.removeprefix("time-step-"), ages)
    if args.json:
        data = view.history_dict(rows, method, system) | {"caution": CAUTION}
        sys.stdout.write(json.dumps(data, indent=2, ensure_ascii=False, allow_nan=False) + "\n")
        return EXIT_OK
    console = make_console()
    console.print(view.history_table(girder, rows, method, system))
    for n in getattr(rows, "notes", ()):
        console.print(f"[dim]Note: {escape(n)}[/]")
    console.print(f"[yellow]{CAUTION}[/]")
    return EXIT_OK


def _cli_quantity(value: str | None, kind: str, option: str) -> float | None:
    from prestress.units import to_internal

    if value is None:
        return None
    return to_internal(value, kind, field=option, file="command line")


def cmd_sections(args: argparse.Namespace) -> int:
    """``prestress sections``: list the library."""
    import json

    from rich.markup import escape

    from prestress.present.console import make_console
    from prestress.present.sections_view import listing_json, listing_table
    from prestress.sections.api import list_sections, open_library

    lib = open_library(tuple(args.library))
    w = _cli_quantity(args.unit_weight, "unit_weight", "--unit-weight")
    assert w is not None
    rows = list_sections(
        lib,
        family=args.family,
        min_depth=_cli_quantity(args.min_depth, "length", "--min-depth"),
        max_depth=_cli_quantity(args.max_depth, "length", "--max-depth"),
    )
    system = args.units or "US"
    if args.json:
        sys.stdout.write(json.dumps(listing_json(rows, w, system), indent=2) + "\n")
        return EXIT_OK
    console = make_console()
    console.print(listing_table(rows, w, system))
    for n in lib.notices:
        console.print(f"[dim]Note: {escape(n)}[/]")
    return EXIT_OK


def cmd_section(args: argparse.Namespace) -> int:
    """``prestress section show|draw``."""
    if args.section_command == "draw":
        return _section_draw(args)
    import json

    from rich.markup import escape

    from prestress.materials import concrete_modulus
    from prestress.model import Concrete
    from prestress.present.console import make_console
    from prestress.present.sections_view import properties_json, properties_table
    from prestress.sections.api import open_library, section_properties, simple_deck

    w = _cli_quantity(args.unit_weight, "unit_weight", "--unit-weight")
    assert w is not None
    deck = n = None
    t = _cli_quantity(args.deck_thickness, "length", "--deck-thickness")
    b = _cli_quantity(args.deck_width, "length", "--deck-width")
    if (t is None) != (b is None):
        raise InputError(
            "both --deck-thickness and --deck-width, or neither",
            file="command line",
            field="--deck-width" if b is None else "--deck-thickness",
        )
    if args.modular_ratio is not None and (args.fc_girder or args.fc_deck):
        raise InputError(
            "either --modular-ratio or the two strengths (--fc-girder, --fc-deck), not both",
            file="command line",
            field="--modular-ratio",
        )
    if t is not None and b is not None:
        if args.modular_ratio is not None:
            n = args.modular_ratio
            if not 0.1 <= n <= 2.0:
                raise InputError(
                    "a modular ratio from 0.1 to 2.0",
                    file="command line",
                    field="--modular-ratio",
                    got=str(n),
                )
        else:
            fcg = _cli_quantity(args.fc_girder, "stress", "--fc-girder")
            fcd = _cli_quantity(args.fc_deck, "stress", "--fc-deck")
            if fcg is None or fcd is None:
                raise InputError(
                    "--fc-girder and --fc-deck (or --modular-ratio) with a deck",
                    file="command line",
                    field="--fc-girder",
                )
            w_mod = 0.145 * 4448.2216152605 / 304.8**3  # 145 pcf for the modulus formula
            n = concrete_modulus(fcd, w_mod, "aashto") / concrete_modulus(fcg, w_mod, "aashto")
        conc = Concrete("deck", 1.0, None, w, 1.0, None, "modular ratio")
        haunch = _cli_quantity(args.haunch, "length", "--haunch") or 0.0
        deck = simple_deck(t, b, haunch, conc, args.haunch_in_stiffness)
    lib = open_library(tuple(args.library))
    rep = section_properties(
        lib, args.name, unit_weight=w, deck=deck, n_deck=n, torsion=args.torsion
    )
    system = args.units or "US"
    if args.json:
        data = {"units": system, "sections": [properties_json(rep, system)]}
        sys.stdout.write(json.dumps(data, indent=2, allow_nan=False) + "\n")
        return EXIT_OK
    console = make_console()
    console.print(properties_table(rep, system))
    source = escape(rep.entry.source or "not given")
    console.print(f"[dim]Source: {source} ({escape(rep.entry.file)})[/]")
    return EXIT_OK


def _section_draw(args: argparse.Namespace) -> int:
    from prestress.sections.draw import draw_section

    out = Path(args.out)
    if out.suffix.lower() not in (".svg", ".png"):
        raise InputError("an output file ending in .svg or .png", file=str(out), field="--out")
    inputs = [Path(args.job)] if args.job else []
    _check_output(out, inputs=inputs, force=args.force)
    system = args.units or "US"
    if args.job:
        from prestress.analysis import resolve_girder
        from prestress.jobfile import load_job

        job = load_job(args.job)
        _check_output(out, inputs=_inputs(job, args), force=args.force)
        girder = resolve_girder(job, cli_libraries=tuple(args.library))
        job = girder.job
        strands = [(float(x), r.height) for r in job.rows for x in r.x_positions()]
        deck = None
        if job.deck is not None:
            deck = (job.deck.effective_width, job.deck.thickness, job.deck.haunch)
        draw_section(
            girder.polygon,
            out_path=out,
            title=f"{girder.section_name} — {job.title}",
            centroid_y_mm=girder.gross.yb,
            strands_mm=strands,
            deck=deck,
            units=args.units or job.units,
        )
    else:
        if not args.name:
            raise InputError("a section name or --job", file="command line", field="NAME")
        from prestress.sections.api import open_library, polygon_of
        from prestress.sections.properties import gross_properties

        lib = open_library(tuple(args.library))
        entry = lib.get(args.name, file="command line", field="NAME")
        poly = polygon_of(entry)
        g = gross_properties(poly)
        draw_section(poly, out_path=out, title=entry.name, centroid_y_mm=g.yb, units=system)
    print(f"wrote {out}")
    return EXIT_OK


def cmd_cache(args: argparse.Namespace) -> int:
    """``prestress cache clear|where``."""
    from prestress.paths import cache_dir
    from prestress.sections.properties import clear_cache

    if args.action == "where":
        print(cache_dir())
    else:
        n = clear_cache()
        print(f"removed {n} cached section analyses from {cache_dir() / 'sections'}")
    return EXIT_OK


def cmd_examples(args: argparse.Namespace) -> int:
    """``prestress examples [--copy DIR]``."""
    import shutil

    from prestress.paths import shipped_examples_dir

    src = shipped_examples_dir()
    files = sorted(p for p in src.rglob("*.toml") if p.is_file())
    if not args.copy:
        print(f"shipped examples in {src}:")
        for p in files:
            print(f"  {p.relative_to(src)}")
        return EXIT_OK
    dest = Path(args.copy)
    if dest.exists() and not dest.is_dir():
        raise InputError("a folder to copy the examples into", file=str(dest), got="a file")
    clashes = [p for p in files if (dest / p.relative_to(src)).exists()]
    if clashes:
        raise InputError(
            "a folder without files of the same names (nothing was copied)",
            file=str(dest / clashes[0].relative_to(src)),
            got="an existing file",
        )
    for p in files:
        target = dest / p.relative_to(src)
        target.parent.mkdir(parents=True, exist_ok=True)
        shutil.copyfile(p, target)
    print(f"copied {len(files)} example files to {dest}")
    return EXIT_OK


COMMANDS = {
    "check": cmd_check,
    "losses": cmd_losses,
    "zone": cmd_zone,
    "design": cmd_design,
    "report": cmd_report,
    "plot": cmd_plot,
    "sections": cmd_sections,
    "section": cmd_section,
    "examples": cmd_examples,
    "cache": cmd_cache,
}


def main(argv: Sequence[str] | None = None) -> int:
    """Entry point of the ``prestress`` command."""
    args_list = list(sys.argv[1:] if argv is None else argv)
    first = args_list[0] if args_list else None
    parser = build_parser(first if first in COMMANDS else None)
    args = parser.parse_args(args_list)
    if not args.command:
        parser.print_help()
        return EXIT_INPUT
    try:
        return COMMANDS[args.command](args)
    except InputError as exc:
        if getattr(args, "debug", False):
            raise
        print(f"prestress: error: {exc.message()}", file=sys.stderr)
        return EXIT_INPUT
    except KeyboardInterrupt:
        print("prestress: interrupted", file=sys.stderr)
        return 130
    except BrokenPipeError:
        return EXIT_OK
    except Exception as exc:  # an unexpected failure is a bug: say so, on one line
        if getattr(args, "debug", False):
            raise
        print(
            f"prestress: internal error: {type(exc).__name__}: {exc} (run again with --debug "
            "and report it)",
            file=sys.stderr,
        )
        return EXIT_INTERNAL


if __name__ == "__main__":
    sys.exit(main())
