"""``prestress sections`` and ``prestress section show|draw``, and the properties cache."""

from __future__ import annotations

import json
from pathlib import Path

import pytest

from prestress.cli import main
from prestress.sections import properties
from prestress.sections.families import build_polygon
from tests.conftest import US_EXAMPLE

STANDARD = [
    "AASHTO-Type-I",
    "AASHTO-Type-II",
    "AASHTO-Type-III",
    "AASHTO-Type-IV",
    "AASHTO-Type-V",
    "AASHTO-Type-VI",
    "AASHTO-PCI-BT-54",
    "AASHTO-PCI-BT-63",
    "AASHTO-PCI-BT-72",
]


def test_sections_lists_the_whole_library(capsys) -> None:
    assert main(["sections", "--json"]) == 0
    data = json.loads(capsys.readouterr().out)
    names = {s["name"] for s in data["sections"]}
    assert set(STANDARD) <= names
    assert {"box_beam", "voided_slab", "u_beam", "inverted_tee", "rectangle", "polygon"} <= {
        s["family"] for s in data["sections"]
    }
    bt72 = next(s for s in data["sections"] if s["name"] == "AASHTO-PCI-BT-72")
    # weight = 767 in² / 144 × 0.150 kcf = 0.7990 kip/ft
    assert bt72["weight"]["value"] == pytest.approx(767 / 144 * 0.150, rel=1e-6)


def test_sections_filters(capsys) -> None:
    assert main(["sections", "--json", "--family", "i_girder", "--min-depth", "60 in"]) == 0
    names = {s["name"] for s in json.loads(capsys.readouterr().out)["sections"]}
    assert names == {"AASHTO-Type-V", "AASHTO-Type-VI", "AASHTO-PCI-BT-63", "AASHTO-PCI-BT-72"}


@pytest.mark.parametrize("name", STANDARD)
def test_section_show_reproduces_published_properties(capsys, name: str) -> None:
    """Each standard shape's published area, I and yb (values recalled from the PCI Bridge
    Design Manual's property tables, marked from memory in sections/*.toml) within 1%."""
    from prestress.sections.api import open_library
    from prestress.units import to_internal

    entry = open_library().get(name)
    assert main(["section", "show", name, "--json"]) == 0
    got = json.loads(capsys.readouterr().out)["sections"][0]
    assert got["name"] == name
    for key, ours in (("area", "area"), ("inertia", "Ix"), ("yb", "yb")):
        kind = {"area": "area", "inertia": "inertia", "yb": "length"}[key]
        pub = to_internal(entry.published[key], kind)
        unit = {"area": 645.16, "inertia": 25.4**4, "yb": 25.4}[key]
        assert got["gross"][ours]["value"] * unit == pytest.approx(pub, rel=0.01), key


def test_section_show_with_deck_by_hand(capsys) -> None:
    """Composite AASHTO Type IV with an 8 in × 96 in deck at n = 0.8, by the parallel-axis
    theorem worked here (Type IV: A 789 in², yb 24.73 in, I 260,741 in⁴ as computed)."""
    assert (
        main(
            [
                "section",
                "show",
                "AASHTO-Type-IV",
                "--deck-thickness",
                "8 in",
                "--deck-width",
                "96 in",
                "--modular-ratio",
                "0.8",
                "--json",
            ]
        )
        == 0
    )
    c = json.loads(capsys.readouterr().out)["sections"][0]
    g = c["gross"]
    A, yb, I = g["area"]["value"], g["yb"]["value"], g["Ix"]["value"]
    Ad, yd, Id = 0.8 * 96 * 8, 54 + 4, 0.8 * 96 * 8**3 / 12
    Ac = A + Ad
    ybc = (A * yb + Ad * yd) / Ac
    Ic = I + A * (yb - ybc) ** 2 + Id + Ad * (yd - ybc) ** 2
    comp = c["composite"]
    assert comp["area"]["value"] == pytest.approx(Ac, rel=1e-12)
    assert comp["yb"]["value"] == pytest.approx(ybc, rel=1e-12)
    assert comp["I"]["value"] == pytest.approx(Ic, rel=1e-12)
    assert comp["S"]["deck_top"]["value"] == pytest.approx(Ic / (62 - ybc), rel=1e-12)


def test_section_show_console_and_errors(capsys) -> None:
    assert main(["section", "show", "AASHTO-PCI-BT-54"]) == 0
    out = capsys.readouterr().out
    assert "Volume-to-surface" in out and "kern" in out
    assert main(["section", "show", "BT-99"]) == 2
    assert "NAME" in capsys.readouterr().err
    assert main(["section", "show", "AASHTO-Type-IV", "--deck-thickness", "8 in"]) == 2
    assert "--deck-width" in capsys.readouterr().err
    assert (
        main(
            [
                "section",
                "show",
                "AASHTO-Type-IV",
                "--deck-thickness",
                "8",
                "--deck-width",
                "96 in",
                "--modular-ratio",
                "0.8",
            ]
        )
        == 2
    )
    assert "--deck-thickness" in capsys.readouterr().err


def test_section_draw(tmp_path: Path, capsys) -> None:
    svg = tmp_path / "t4.svg"
    assert main(["section", "draw", "AASHTO-Type-IV", "--out", str(svg)]) == 0
    assert svg.stat().st_size > 5000
    png = tmp_path / "job.png"
    assert main(["section", "draw", "--job", str(US_EXAMPLE), "--out", str(png)]) == 0
    assert png.read_bytes()[:4] == b"\x89PNG"
    assert main(["section", "draw", "AASHTO-Type-IV", "--out", str(svg)]) == 2  # exists
    assert main(["section", "draw", "AASHTO-Type-IV", "--out", str(tmp_path / "x.pdf")]) == 2
    capsys.readouterr()


RECT = {"width": "20 in", "depth": "40 in"}


def test_cache_is_used_and_corrupt_entries_are_recomputed(monkeypatch: pytest.MonkeyPatch) -> None:
    poly = build_polygon("rectangle", {"width": "21 in", "depth": "43 in"})
    first = properties.gross_properties(poly)
    key = properties._key(poly, "geometric")
    path = properties.cache_dir() / "sections" / f"{key}.json"
    assert path.is_file()

    def boom(*_a: object, **_k: object) -> None:
        raise AssertionError("meshed again although cached")

    monkeypatch.setattr(properties, "_compute", boom)
    assert properties.gross_properties(poly) == first  # served from the cache
    monkeypatch.undo()
    for garbage in (
        "{not json",
        json.dumps({"key": "other", "properties": {}}),
        json.dumps({"key": key, "properties": {"area": -1}}),
        "",
    ):
        path.write_text(garbage, encoding="utf-8")
        assert properties.gross_properties(poly) == first  # recomputed, not trusted
        assert json.loads(path.read_text(encoding="utf-8"))["key"] == key  # and rewritten


def test_cache_clear(capsys) -> None:
    poly = build_polygon("rectangle", RECT)
    properties.gross_properties(poly)
    assert main(["cache", "clear"]) == 0
    assert "removed" in capsys.readouterr().out
    assert not list((properties.cache_dir() / "sections").glob("*.json"))
