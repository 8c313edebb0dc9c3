"""Section library: lookup, user folders searched first, clashes reported, no path traversal."""

from __future__ import annotations

import os
from pathlib import Path

import pytest

from prestress.errors import InputError
from prestress.sections.library import ENV_VAR, check_name, load_library, search_folders

USER_SECTION = """
[[section]]
name = "{name}"
family = "rectangle"
source = "invented for a test"
[section.dimensions]
width = "24 in"
depth = "36 in"
"""


def test_shipped_library_has_the_standard_shapes() -> None:
    lib = load_library(search_folders())
    for name in [
        "AASHTO-Type-I",
        "AASHTO-Type-II",
        "AASHTO-Type-III",
        "AASHTO-Type-IV",
        "AASHTO-Type-V",
        "AASHTO-Type-VI",
        "AASHTO-PCI-BT-54",
        "AASHTO-PCI-BT-63",
        "AASHTO-PCI-BT-72",
    ]:
        assert lib.get(name).name == name
        assert lib.get(name.lower()).name == name  # names are case-insensitive


def test_user_folder_is_searched_and_overrides_with_a_notice(tmp_path: Path) -> None:
    (tmp_path / "mine.toml").write_text(USER_SECTION.format(name="AASHTO-Type-IV"), "utf-8")
    (tmp_path / "other.toml").write_text(USER_SECTION.format(name="Plant-R36"), "utf-8")
    lib = load_library(search_folders([str(tmp_path)]))
    assert lib.get("Plant-R36").family == "rectangle"
    assert lib.get("AASHTO-Type-IV").family == "rectangle"
    assert any("overrides the shipped one" in n for n in lib.notices)


def test_clash_between_user_files_is_an_error(tmp_path: Path) -> None:
    (tmp_path / "a.toml").write_text(USER_SECTION.format(name="Plant-R36"), "utf-8")
    (tmp_path / "b.toml").write_text(USER_SECTION.format(name="plant-r36"), "utf-8")
    with pytest.raises(InputError) as err:
        load_library(search_folders([str(tmp_path)]))
    assert "unique" in str(err.value) and "a.toml" in str(err.value)


def test_environment_variable_folder(tmp_path: Path, monkeypatch: pytest.MonkeyPatch) -> None:
    (tmp_path / "env.toml").write_text(USER_SECTION.format(name="Env-Shape"), "utf-8")
    monkeypatch.setenv(ENV_VAR, str(tmp_path))
    assert load_library(search_folders()).get("Env-Shape").name == "Env-Shape"


@pytest.mark.parametrize("name", ["../secret", "/etc/passwd", "a/b", "..", "x\\y", "", " BT-54"])
def test_names_cannot_be_paths(name: str) -> None:
    with pytest.raises(InputError, match="not a path"):
        check_name(name, file="job.toml", field="girder.section")


def test_links_leaving_the_folder_are_not_followed(tmp_path: Path) -> None:
    outside = tmp_path / "outside"
    outside.mkdir()
    (outside / "evil.toml").write_text(USER_SECTION.format(name="Evil"), "utf-8")
    lib_dir = tmp_path / "lib"
    lib_dir.mkdir()
    os.symlink(outside / "evil.toml", lib_dir / "evil.toml")
    lib = load_library(search_folders([str(lib_dir)]))
    with pytest.raises(InputError):
        lib.get("Evil")


def test_unknown_name_suggests_near_names() -> None:
    lib = load_library(search_folders())
    with pytest.raises(InputError, match="did you mean"):
        lib.get("AASHTO-PCI-BT-55", file="job.toml", field="girder.section")
