"""Unit tests of the section drawing (prestress.sections.draw)."""

from __future__ import annotations

import tomllib
import xml.etree.ElementTree as ET
from pathlib import Path

import pytest

from prestress.sections.draw import DimensionLine, draw_section, format_length, principal_dimensions
from prestress.sections.families import build_polygon

SECTIONS_DIR = Path(__file__).resolve().parents[1] / "sections"
PNG_MAGIC = b"\x89PNG\r\n\x1a\n"


def _shipped() -> list:
    cases = []
    for path in sorted(SECTIONS_DIR.glob("*.toml")):
        with path.open("rb") as fh:
            data = tomllib.load(fh)
        for i, sec in enumerate(data["section"]):
            cases.append(pytest.param(path.name, i, sec, id=sec["name"]))
    return cases


def _poly(name: str, i: int, sec: dict):
    return build_polygon(
        sec["family"], sec["dimensions"], file=name, field=f"section[{i}].dimensions"
    )


@pytest.mark.parametrize(("name", "i", "sec"), _shipped())
def test_svg_for_every_shipped_shape(tmp_path: Path, name: str, i: int, sec: dict) -> None:
    poly = _poly(name, i, sec)
    out = tmp_path / f"{sec['name']}.svg"
    strands = [(-50.0, 60.0), (0.0, 60.0), (50.0, 60.0)]
    draw_section(
        poly,
        out_path=out,
        title=sec["name"],
        centroid_y_mm=poly.centroid.y,
        strands_mm=strands,
        units="US",
    )
    assert out.stat().st_size > 5000
    root = ET.parse(out).getroot()  # well-formed XML
    assert root.tag.endswith("svg")
    text = out.read_text(encoding="utf-8")
    assert sec["name"] in text  # title, kept as text (svg.fonttype none)
    assert "centroid" in text
    assert " in" in text  # dimension values in inches
    assert list(tmp_path.iterdir()) == [out]  # no temporary file left behind


def test_png_with_deck_and_strands(tmp_path: Path) -> None:
    with (SECTIONS_DIR / "aashto-pci-bulb-tees.toml").open("rb") as fh:
        sec = tomllib.load(fh)["section"][0]
    poly = _poly("aashto-pci-bulb-tees.toml", 0, sec)
    out = tmp_path / "sub" / "bt.png"
    strands = [(x * 50.8, y * 50.8) for y in (1, 2) for x in range(-4, 5)]
    draw_section(
        poly,
        out_path=str(out),
        title="BT with deck",
        centroid_y_mm=poly.centroid.y,
        strands_mm=strands,
        deck=(2400.0, 200.0, 25.0),
        units="SI",
    )
    data = out.read_bytes()
    assert data.startswith(PNG_MAGIC)
    assert len(data) > 20000
    assert sorted(p.name for p in out.parent.iterdir()) == ["bt.png"]


def test_overwrite_is_atomic_replace(tmp_path: Path) -> None:
    poly = build_polygon("rectangle", {"width": "300 mm", "depth": "600 mm"})
    out = tmp_path / "r.svg"
    out.write_text("old")
    draw_section(poly, out_path=out, title="R", dims=[], centroid_y_mm=None, units="SI")
    assert out.read_text(encoding="utf-8").lstrip().startswith("<?xml")


def test_explicit_dimension_lines_and_labels(tmp_path: Path) -> None:
    poly = build_polygon("rectangle", {"width": "300 mm", "depth": "600 mm"})
    out = tmp_path / "r.svg"
    dims = [
        DimensionLine((-150.0, 600.0), (150.0, 600.0), at=700.0, label="b = 300"),
        ((150.0, 0.0), (150.0, 600.0), 250.0, True),
    ]
    draw_section(poly, out_path=out, title="R", dims=dims, centroid_y_mm=300.0, units="SI")
    text = out.read_text(encoding="utf-8")
    assert "b = 300" in text
    assert "600 mm" in text


def test_principal_dimensions_of_an_i_girder() -> None:
    poly = build_polygon(
        "i_girder",
        {
            "depth": "54 in",
            "top_flange_width": "20 in",
            "top_flange_thickness": "8 in",
            "top_tapers": [["6 in", "6 in"]],
            "web_width": "8 in",
            "bottom_flange_width": "26 in",
            "bottom_flange_thickness": "8 in",
            "bottom_tapers": [["9 in", "9 in"]],
        },
    )
    lengths = sorted(round(d.length_mm / 25.4, 6) for d in principal_dimensions(poly))
    assert lengths == [8.0, 20.0, 26.0, 54.0]  # web, top flange, bottom flange, depth
    with_deck = principal_dimensions(poly, deck=(2400.0, 200.0, 25.0))
    assert any(d.length_mm == pytest.approx(2400.0) for d in with_deck)


def test_rectangle_has_no_web_dimension() -> None:
    poly = build_polygon("rectangle", {"width": "300 mm", "depth": "600 mm"})
    assert len(principal_dimensions(poly)) == 3


def test_format_length() -> None:
    assert format_length(54 * 25.4, "US") == "54 in"
    assert format_length(3.5 * 25.4, "US") == "3.5 in"
    assert format_length(1371.6, "SI") == "1372 mm"


def test_bad_arguments(tmp_path: Path) -> None:
    poly = build_polygon("rectangle", {"width": "300 mm", "depth": "600 mm"})
    with pytest.raises(ValueError, match="units"):
        draw_section(poly, out_path=tmp_path / "a.svg", title="x", units="imperial")
    with pytest.raises(ValueError, match=r"\.svg or \.png"):
        draw_section(poly, out_path=tmp_path / "a.pdf", title="x")
