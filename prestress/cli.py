"""Command line: a thin shell over the Python API.

Exit status: 0 when every check passes, 1 when any limit is exceeded, 2 for bad input
(a one-line message naming the file and field, no traceback unless ``--debug``).
"""

from __future__ import annotations

import argparse
import sys
from collections.abc import Sequence
from pathlib import Path

from prestress import __version__
from prestress.errors import InputError

EXIT_OK, EXIT_FAIL, EXIT_INPUT, EXIT_INTERNAL = 0, 1, 2, 3


class _Parser(argparse.ArgumentParser):
    """An argument parser whose usage errors exit with status 2 on one line."""

    def error(self, message: str) -> None:  # type: ignore[override]
        self.exit(EXIT_INPUT, f"prestress: error: {message} (see 'prestress --help')\n")


def _add_common(p: argparse.ArgumentParser) -> None:
    p.add_argument("--units", choices=("US", "SI"), help="output units (default: the job's)")
    p.add_argument(
        "--library",
        action="append",
        default=[],
        metavar="DIR",
        help="a further section library folder, searched before the shipped one (repeatable)",
    )
    p.add_argument("--debug", action="store_true", help="show a traceback on errors")


def build_parser() -> argparse.ArgumentParser:
    """The argument parser of the ``prestress`` command."""
    parser = _Parser(
        prog="prestress",
        description="Check prestressed concrete girders stage by "
        "stage: section properties, losses, fiber stresses against your limits.",
    )
    parser.add_argument("--version", action="version", version=f"prestress {__version__}")
    sub = parser.add_subparsers(dest="command", metavar="COMMAND", parser_class=_Parser)

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
    _add_common(p)

    p = sub.add_parser("sections", help="list the section library")
    p.add_argument("--family", help="only this family")
    p.add_argument("--json", action="store_true", help="JSON on standard output")
    _add_common(p)

    p = sub.add_parser("examples", help="list the shipped example jobs, or copy them to a folder")
    p.add_argument("--copy", metavar="DIR", help="copy the examples into DIR (never overwrites)")
    p.add_argument("--debug", action="store_true", help="show a traceback on errors")

    p = sub.add_parser("cache", help="manage the cache of computed section properties")
    p.add_argument("action", choices=("clear", "where"))
    p.add_argument("--debug", action="store_true", help="show a traceback on errors")
    return parser


def _write_output(path: str, text: str, *, inputs: Sequence[Path], force: bool) -> None:
    from prestress.atomic import write_atomic

    target = Path(path)
    for src in inputs:
        if target.resolve() == src.resolve():
            raise InputError(
                "an output path different from the input files",
                file=str(target),
                got="the path of an input file",
            )
    if target.exists() and not force:
        raise InputError(
            "a path that does not exist yet (or --force to replace it)",
            file=str(target),
            got="an existing file",
        )
    write_atomic(target, text)


def cmd_check(args: argparse.Namespace) -> int:
    """``prestress check JOB``."""
    from prestress.analysis import check_file

    result = check_file(args.job, cli_libraries=tuple(args.library))
    system = args.units or result.girder.job.units
    if args.json is not None:
        from prestress.present.jsonout import to_json

        text = to_json(result, system)
        if args.json == "-":
            sys.stdout.write(text)
        else:
            inputs = [Path(args.job)]
            _write_output(args.json, text, inputs=inputs, force=args.force)
    if args.json != "-":
        from prestress.present.console import make_console, render

        render(result, make_console(), system)
    return EXIT_OK if result.ok else EXIT_FAIL


def cmd_sections(args: argparse.Namespace) -> int:
    """``prestress sections``: list the library."""
    import json

    from rich.table import Table

    from prestress.sections.library import load_library, search_folders

    lib = load_library(search_folders((), tuple(args.library)))
    entries = sorted(lib.entries.values(), key=lambda e: (e.family, e.name))
    if args.family:
        entries = [e for e in entries if e.family == args.family]
    if args.json:
        data = [
            {
                "name": e.name,
                "family": e.family,
                "source": e.source,
                "file": e.file,
                "description": e.description,
            }
            for e in entries
        ]
        sys.stdout.write(json.dumps({"sections": data}, indent=2) + "\n")
        return EXIT_OK
    t = Table(title="Section library", title_justify="left", title_style="bold")
    for col in ("Name", "Family", "Source", "File"):
        t.add_column(col)
    for e in entries:
        t.add_row(e.name, e.family, e.source, Path(e.file).name)
    from prestress.present.console import make_console

    console = make_console()
    console.print(t)
    for n in lib.notices:
        console.print(f"[dim]Note: {n}[/]")
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
    "sections": cmd_sections,
    "examples": cmd_examples,
    "cache": cmd_cache,
}


def main(argv: Sequence[str] | None = None) -> int:
    """Entry point of the ``prestress`` command."""
    parser = build_parser()
    args = parser.parse_args(argv)
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
