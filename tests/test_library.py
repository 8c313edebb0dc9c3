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


@pytest.mark.parametrize(
    ("given", "suggested"),
    [
        # the library names that end with the designation, ignoring case, spaces, hyphens and
        # underscores (AASHTO-PCI bulb-tees and AASHTO I-beams of the shipped library)
        ("BT-54", ["AASHTO-PCI-BT-54"]),
        ("bt54", ["AASHTO-PCI-BT-54"]),
        ("BT_72", ["AASHTO-PCI-BT-72"]),
        ("Type IV", ["AASHTO-Type-IV"]),
        ("type-iv", ["AASHTO-Type-IV"]),
        ("Type I", ["AASHTO-Type-I"]),  # ends with: not Type-II, Type-III
        ("AASHTO Type VI", ["AASHTO-Type-VI"]),
        ("AASHTO-Type-IV ", ["AASHTO-Type-IV"]),  # a stray space: suggested, not accepted
        # none ends with it: the names that contain it
        ("PCI-BT", ["AASHTO-PCI-BT-54", "AASHTO-PCI-BT-63", "AASHTO-PCI-BT-72"]),
        # neither: the nearest names by spelling, as before
        ("AASHTO-PCI-BT-55", ["AASHTO-PCI-BT-54"]),
    ],
)
def test_unknown_name_suggests_the_names_ending_with_it(given: str, suggested: list[str]) -> None:
    lib = load_library(search_folders())
    with pytest.raises(InputError) as err:
        lib.get(given, file="job.toml", field="girder.section")
    msg = str(err.value)
    assert "\n" not in msg and "job.toml" in msg and "girder.section" in msg
    assert "the name of a section in the library" in msg
    hint = msg.split("did you mean ", 1)[1].split("?)", 1)[0]
    names = [n.strip(" '") for n in hint.split(",")]
    assert names[: len(suggested)] == suggested


def test_a_near_name_is_never_accepted() -> None:
    """Only the exact name (any case) is found; shorthand only gets a suggestion."""
    lib = load_library(search_folders())
    assert lib.get("aashto-pci-bt-54").name == "AASHTO-PCI-BT-54"
    for near in ["BT-54", "AASHTO_PCI_BT_54", "AASHTO PCI BT 54", " AASHTO-PCI-BT-54"]:
        with pytest.raises(InputError) as err:
            lib.get(near, file="job.toml", field="girder.section")
        assert "did you mean 'AASHTO-PCI-BT-54'?" in str(err.value)


@pytest.mark.parametrize("name", ["../x", "a b/c", "sections/bt54.toml", "x\\y z", "..  BT"])
def test_names_with_spaces_that_are_paths_are_still_refused(name: str) -> None:
    lib = load_library(search_folders())
    with pytest.raises(InputError, match="not a path"):
        lib.get(name, file="job.toml", field="girder.section")
