"""The files a job reads, so that no output is ever written over one of them.

The job file, its limit-set file (``[limits] set`` or ``file``) and the section library files
of every folder searched for its section (the job's ``section_libraries``, ``--library``,
``PRESTRESS_SECTIONS`` and the shipped library). An output path equal to any of these is
refused, with ``--force`` or without (a user's file is never overwritten by an output).
"""

from __future__ import annotations

from pathlib import Path
from typing import TYPE_CHECKING

if TYPE_CHECKING:
    from prestress.model import Job


def limits_path(job: Job) -> tuple[Path | None, str]:
    """The limit-set file of a job and how it is named, found as the job reader finds it.

    ``[limits] set = "name"``: the shipped ``examples/limits/<name>.toml``; ``[limits] file``:
    that path, relative to the job file's folder; otherwise (None, "inline"): the limits are
    in the job file itself. The job file's ``[limits]`` table is read again.

    Raises:
        InputError: the job file can no longer be read.
    """
    from prestress.paths import shipped_examples_dir
    from prestress.tomlread import read_toml

    lim = read_toml(job.file).get("limits")
    if isinstance(lim, dict) and isinstance(lim.get("set"), str):
        name = lim["set"]
        return shipped_examples_dir() / "limits" / f"{name}.toml", f"set '{name}'"
    if isinstance(lim, dict) and isinstance(lim.get("file"), str):
        ref = Path(lim["file"])
        return (ref if ref.is_absolute() else Path(job.file).parent / ref), "file"
    return None, "inline"


def input_files(job: Job, cli_libraries: tuple[str, ...] = ()) -> list[Path]:
    """Every file the job reads: the job file, its limit set and the section library files."""
    from prestress.sections.library import library_files, search_folders

    files = [Path(job.file)]
    path, _how = limits_path(job)
    if path is not None:
        files.append(path)
    for folder in search_folders(job.library_paths, cli_libraries):
        files += library_files(folder)
    return files
