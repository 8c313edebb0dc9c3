"""The section library: TOML files of named shapes in one or more folders.

Search order: the folders given by the job file, then those given on the command line,
then those in the environment variable ``PRESTRESS_SECTIONS`` (``os.pathsep``-separated),
then the shipped library (``sections/``). A name defined twice in the user folders is an
error naming both files; a user section with the name of a shipped one takes precedence,
and the override is reported (never silent) through :attr:`Library.notices`.

A section is referenced by name only, never by path, so a job cannot reach files outside
its library folders; files reached through links that leave their folder are skipped.
"""

from __future__ import annotations

import os
import re
from dataclasses import dataclass, field
from pathlib import Path
from typing import Any

from prestress.errors import InputError
from prestress.paths import shipped_sections_dir
from prestress.tomlread import Table, read_toml

#: A valid section name: letters, digits, and . _ + - (no separators, no "..").
NAME_RE = re.compile(r"^[A-Za-z0-9][A-Za-z0-9._+-]{0,79}$")

#: A name written with spaces ("Type IV"): never in the library (names have none), but not a
#: path either, so it gets the not-found message with its suggestions.
_SPACED_NAME_RE = re.compile(r"^[A-Za-z0-9._+ -]{1,80}$")

ENV_VAR = "PRESTRESS_SECTIONS"


def _compact(name: str) -> str:
    """A name ignoring case, spaces, hyphens and underscores: "Type IV" -> "typeiv"."""
    return re.sub(r"[\s_-]+", "", name).lower()


@dataclass(frozen=True)
class SectionEntry:
    """One named shape of the library, as read from its file (dimensions still raw).

    Attributes:
        name: the section's name, as written.
        family: the parametric family that builds it (see ``prestress.sections.families``).
        dimensions: the raw TOML dimensions, parsed by the family when built.
        description: a line of description.
        source: where the shape comes from (standard, table, edition) or "invented".
        published: published properties for validation (raw TOML), possibly empty.
        file: the file it came from.
        field: its TOML path in that file, e.g. ``section[3]``.
        shipped: whether it comes from the shipped library.
    """

    name: str
    family: str
    dimensions: dict[str, Any]
    description: str
    source: str
    published: dict[str, Any]
    file: str
    field: str
    shipped: bool


@dataclass
class Library:
    """The sections found in a list of folders, by lower-case name."""

    folders: list[Path]
    entries: dict[str, SectionEntry] = field(default_factory=dict)
    notices: list[str] = field(default_factory=list)

    def get(self, name: str, *, file: str = "", field: str = "") -> SectionEntry:
        """Return the named section; unknown or malformed names give an InputError.

        Only the exact name (in any case) is accepted. For an unknown name the one-line
        message suggests, in this order: the names that end with the given designation or,
        failing that, contain it, both ignoring case, spaces, hyphens and underscores
        ("BT-54" -> 'AASHTO-PCI-BT-54', "Type IV" -> 'AASHTO-Type-IV'); failing both, the
        nearest names by spelling.
        """
        spaced = (
            isinstance(name, str)
            and " " in name
            and ".." not in name
            and _SPACED_NAME_RE.match(name) is not None
        )
        if not spaced:
            check_name(name, file=file, field=field)
        entry = None if spaced else self.entries.get(name.lower())
        if entry is None:
            near = [self.entries[k].name for k in self.suggestions(name)]
            hint = (
                " (did you mean " + ", ".join(f"'{n}'" for n in near) + "?)"
                if near
                else " (run 'prestress sections' to list them)"
            )
            raise InputError(
                f"the name of a section in the library{hint}",
                file=file,
                field=field,
                got=f"'{name}'",
            )
        return entry

    def suggestions(self, name: str, n: int = 3) -> list[str]:
        """Keys of the library names an unknown ``name`` may have meant (at most ``n``).

        Names ending with ``name`` come first, then names containing it (both compared
        ignoring case, spaces, hyphens and underscores), then the nearest by spelling
        (difflib); the first rule that finds any decides. Shorter names come first.
        """
        given = _compact(name)
        if given:
            keys = sorted(self.entries, key=lambda k: (len(k), k))
            ends = [k for k in keys if _compact(k).endswith(given)]
            if ends:
                return ends[:n]
            contains = [k for k in keys if given in _compact(k)]
            if contains:
                return contains[:n]
        import difflib

        return difflib.get_close_matches(name.lower(), list(self.entries), n=n, cutoff=0.5)

    def names(self) -> list[str]:
        """All section names, sorted."""
        return sorted(e.name for e in self.entries.values())


def check_name(name: str, *, file: str = "", field: str = "") -> None:
    """Reject names that are not plain section names (paths, traversal, odd characters)."""
    if not isinstance(name, str) or not NAME_RE.match(name) or ".." in name:
        raise InputError(
            "a section name made of letters, digits and . _ + - (not a path)",
            file=file,
            field=field,
            got=repr(name),
        )


def search_folders(
    job_folders: list[str] | tuple[str, ...] = (),
    cli_folders: list[str] | tuple[str, ...] = (),
    *,
    base: Path | None = None,
) -> list[Path]:
    """The ordered list of library folders (user folders first, shipped last).

    Raises:
        InputError: a folder given with ``--library`` or in ``PRESTRESS_SECTIONS`` that is
            not an existing folder (a mistyped folder would leave the shipped shape in use
            without a word; the job's own folders are checked when the job is read).
    """
    folders: list[Path] = []
    env = [p for p in os.environ.get(ENV_VAR, "").split(os.pathsep) if p.strip()]
    given = [(raw, None) for raw in job_folders]
    given += [(raw, ("command line", "--library")) for raw in cli_folders]
    given += [(raw, ("environment", ENV_VAR)) for raw in env]
    for raw, origin in given:
        p = Path(raw).expanduser()
        if base is not None and not p.is_absolute():
            p = base / p
        if origin is not None and not p.is_dir():
            raise InputError(
                "an existing folder of section files",
                file=origin[0],
                field=origin[1],
                got=f"{raw} (no such folder)" if not p.exists() else f"{raw} (not a folder)",
            )
        folders.append(p)
    folders.append(shipped_sections_dir())
    unique: list[Path] = []
    seen: set[Path] = set()
    for f in folders:
        key = f.resolve()
        if key not in seen:
            seen.add(key)
            unique.append(f)
    return unique


def library_files(folder: Path) -> list[Path]:
    """TOML files directly in a folder, skipping links that lead outside it."""
    if not folder.is_dir():
        return []
    root = folder.resolve()
    out = []
    for p in sorted(folder.glob("*.toml")):
        try:
            p.resolve().relative_to(root)
        except ValueError:
            continue  # a link leaving the folder: never followed
        if p.is_file():
            out.append(p)
    return out


def read_library_file(path: Path, *, shipped: bool) -> list[SectionEntry]:
    """Read one library file into entries (dimensions stay raw; families parse them)."""
    data = read_toml(path)
    top = Table(data, file=str(path))
    lib = top.table("library", required=False)
    if lib is not None:
        lib.string("title", "")
        lib.string("source", "")
        lib.string("notes", "")
        lib.done()
    entries = []
    for t in top.tables("section"):
        name = t.string("name")
        check_name(name, file=str(path), field=t.field("name"))
        family = t.string("family")
        dims = t.raw("dimensions", expected="a table of dimensions")
        if not isinstance(dims, dict):
            raise t.error("dimensions", "a table of dimensions", type(dims).__name__)
        published = t.raw("published", {})
        if not isinstance(published, dict):
            raise t.error("published", "a table of published properties")
        entries.append(
            SectionEntry(
                name=name,
                family=family,
                dimensions=dims,
                description=t.string("description", ""),
                source=t.string("source", ""),
                published=published,
                file=str(path),
                field=t.path,
                shipped=shipped,
            )
        )
        t.done()
    top.done()
    return entries


def load_library(folders: list[Path]) -> Library:
    """Read every library file of the folders; report clashes (see the module docstring)."""
    lib = Library(folders=list(folders))
    shipped_dir = shipped_sections_dir().resolve()
    for folder in folders:
        is_shipped = folder.resolve() == shipped_dir
        for path in library_files(folder):
            for entry in read_library_file(path, shipped=is_shipped):
                key = entry.name.lower()
                other = lib.entries.get(key)
                if other is None:
                    lib.entries[key] = entry
                elif other.shipped == entry.shipped:
                    raise InputError(
                        f"section names to be unique; '{entry.name}' is also defined in "
                        f"{other.file} ({other.field})",
                        file=entry.file,
                        field=f"{entry.field}.name",
                        got="a duplicate name",
                    )
                elif not other.shipped and entry.shipped:
                    lib.notices.append(
                        f"section '{other.name}' from {other.file} overrides the shipped one "
                        f"in {entry.file}"
                    )
    return lib
