"""No output is ever written over a file the job reads, nor into a folder given as a file.

The project's rule (DEVELOPERS.md, "Outputs"): nothing the user owns is overwritten. A user
review found ``--force`` let ``check --json``, ``design --write`` and the others replace the
job's limit set or a section library file; and an output path that is a folder ended in an
internal error. Invented data: the shipped demo example and a copy of a library file.
"""

from __future__ import annotations

import shutil
from pathlib import Path

import pytest

from prestress.cli import main
from prestress.paths import shipped_sections_dir
from tests.conftest import US_EXAMPLE, write_job


@pytest.fixture
def job(tmp_path: Path) -> Path:
    """The demo job beside its own copy of the limit sets (limits/...)."""
    return write_job(tmp_path, US_EXAMPLE.read_text(encoding="utf-8"))


def _unchanged(path: Path, before: bytes) -> None:
    assert path.read_bytes() == before, f"{path} was overwritten"


@pytest.mark.parametrize(
    "argv",
    [
        ["check", "{job}", "--json", "{out}", "--force"],
        ["report", "{job}", "--out", "{out}", "--force"],
        ["plot", "{job}", "section", "--out", "{out}", "--force"],
    ],
    ids=["check --json", "report", "plot"],
)
def test_the_limit_set_is_never_an_output(job: Path, argv: list[str], capsys) -> None:
    limits = job.parent / "limits" / "aashto-lrfd-9th-service.toml"
    out = limits
    if argv[0] in ("report", "plot"):  # these ask for a suffix: a .svg/.html limits copy
        out = limits.with_suffix(".svg" if argv[0] == "plot" else ".html")
        shutil.copyfile(limits, out)
        text = job.read_text(encoding="utf-8").replace(limits.name, out.name)
        job.write_text(text, encoding="utf-8")
    before = out.read_bytes()
    code = main([a.format(job=job, out=out) for a in argv])
    assert code == 2 and "different from the input files" in capsys.readouterr().err
    _unchanged(out, before)


def test_design_write_never_replaces_the_limit_set(job: Path, capsys) -> None:
    limits = job.parent / "limits" / "aashto-lrfd-9th-service.toml"
    before = limits.read_bytes()
    assert main(["design", str(job), "--write", str(limits), "--force"]) == 2
    assert "different from the input files" in capsys.readouterr().err
    _unchanged(limits, before)


def test_a_section_library_file_is_never_an_output(job: Path, tmp_path: Path, capsys) -> None:
    lib = tmp_path / "mylib"
    lib.mkdir()
    src = next(shipped_sections_dir().glob("*.toml"))
    mine = lib / "mine.json"  # any name in the folder that is read: the .toml files
    mine_toml = lib / "mine.toml"
    shutil.copyfile(src, mine_toml)
    before = mine_toml.read_bytes()
    code = main(["check", str(job), "--library", str(lib), "--json", str(mine_toml), "--force"])
    assert code == 2 and "different from the input files" in capsys.readouterr().err
    _unchanged(mine_toml, before)
    assert main(["check", str(job), "--library", str(lib), "--json", str(mine)]) in (0, 1)
    capsys.readouterr()


def test_an_output_path_that_is_a_folder_is_refused(job: Path, tmp_path: Path, capsys) -> None:
    folder = tmp_path / "out.svg"
    folder.mkdir()
    for force in ([], ["--force"]):
        assert main(["check", str(job), "--json", str(folder), *force]) == 2
        assert "not a folder" in capsys.readouterr().err
        assert main(["plot", str(job), "section", "--out", str(folder), *force]) == 2
        assert "not a folder" in capsys.readouterr().err


def test_examples_copied_into_a_file_is_refused(tmp_path: Path, capsys) -> None:
    target = tmp_path / "a-file.toml"
    target.write_text("# mine\n", encoding="utf-8")
    assert main(["examples", "--copy", str(target)]) == 2
    assert "a folder" in capsys.readouterr().err
    assert target.read_text(encoding="utf-8") == "# mine\n"


def test_a_missing_library_folder_is_an_error(
    job: Path, tmp_path: Path, capsys, monkeypatch
) -> None:
    """A mistyped folder would leave the shipped shape in use without a word."""
    assert main(["check", str(job), "--library", str(tmp_path / "no-such")]) == 2
    err = capsys.readouterr().err
    assert "--library" in err and "no such folder" in err
    monkeypatch.setenv("PRESTRESS_SECTIONS", str(tmp_path / "no-such"))
    assert main(["check", str(job)]) == 2
    assert "PRESTRESS_SECTIONS" in capsys.readouterr().err
