"""End-to-end: ``prestress check`` on the shipped example, its JSON layout, and its stresses
against a hand calculation written out below (the usual hand method: gross and composite
properties by pieces and the parallel-axis theorem, AASHTO LRFD 9th Ed. (2020) Eq.
C5.9.3.2.3a-1 for elastic shortening, Eq. 5.9.3.3-1 for long-term losses, P/A ± Pe/S ± M/S)."""

from __future__ import annotations

import json
import math
import subprocess
import sys

import pytest

from prestress.cli import main
from tests.conftest import ROOT, SI_EXAMPLE, US_EXAMPLE


def trapezoid(b_bottom: float, b_top: float, h: float, y0: float) -> tuple[float, float, float]:
    """Area, centroid height and own inertia of a trapezoid (standard formulas)."""
    A = (b_bottom + b_top) / 2 * h
    y = y0 + h * (b_bottom + 2 * b_top) / (3 * (b_bottom + b_top))
    I = h**3 * (b_bottom**2 + 4 * b_bottom * b_top + b_top**2) / (36 * (b_bottom + b_top))
    return A, y, I


def assemble(parts: list[tuple[float, float, float]]) -> tuple[float, float, float]:
    A = sum(p[0] for p in parts)
    y = sum(p[0] * p[1] for p in parts) / A
    I = sum(p[2] + p[0] * (p[1] - y) ** 2 for p in parts)
    return A, y, I


def hand_calculation() -> dict[str, float]:
    """The example girder worked by hand in kip, in, ksi (inputs from the example file)."""
    # AASHTO-PCI BT-54 by pieces (dimensions of sections/aashto-pci-bulb-tees.toml), in:
    parts = [
        trapezoid(26, 26, 6, 0),  # bottom flange
        trapezoid(26, 6, 4.5, 6),  # bottom taper
        trapezoid(6, 6, 36, 10.5),  # web
        trapezoid(6, 10, 2, 46.5),  # top fillet
        trapezoid(10, 42, 2, 48.5),  # top taper
        trapezoid(42, 42, 3.5, 50.5),  # top flange
    ]
    A, yb, I = assemble(parts)  # 659 in², 27.63 in, 268,051 in⁴
    h = 54.0
    Sb, St = I / yb, I / (h - yb)
    # strands: 12 at 2 in + 4 at 4 in, 0.217 in² each
    Aps = 16 * 0.217
    e = yb - (12 * 2 + 4 * 4) / 16
    # moduli, AASHTO Eq. 5.4.2.4-1 with wc = 0.145 kcf
    Eci = 120_000 * 0.145**2 * 5.5**0.33
    Ec = 120_000 * 0.145**2 * 7.0**0.33
    Ecd = 120_000 * 0.145**2 * 4.0**0.33
    Ep = 28_500.0
    # self-weight: 150 pcf on A
    w = A / 144 * 0.150  # kip/ft
    L, S = 82.0, 80.0  # ft
    Mg_L = w * L**2 / 8 * 12  # kip-in at midlength, girder on its own length
    # elastic shortening, Eq. C5.9.3.2.3a-1
    fpbt = 202.5
    num = Aps * fpbt * (I + e**2 * A) - e * Mg_L * A
    den = Aps * (I + e**2 * A) + A * I * Eci / Ep
    es = num / den
    fpt = fpbt - es
    Pi = Aps * fpt
    # transfer, midlength: f = −P/A ∓ P e / S ± M / S (tension +)
    t_mid_top = -Pi / A + Pi * e / St - Mg_L / St
    t_mid_bot = -Pi / A - Pi * e / Sb + Mg_L / Sb
    # transfer, at the transfer length 60 db = 36 in = 3 ft from the end (full force there)
    x = 3.0
    M_lt = w * x * (L - x) / 2 * 12
    t_lt_top = -Pi / A + Pi * e / St - M_lt / St
    # approximate long-term losses, Eq. 5.9.3.3-1: H = 70 % → γh = 1.0; γst = 5 / (1 + 5.5)
    gst = 5 / 6.5
    lt = 10 * fpbt * Aps / A * 1.0 * gst + 12 * 1.0 * gst + 2.4
    fpe = fpbt - es - lt
    Pe = Aps * fpe
    # composite: deck 7.5 in × 96 in transformed by n, above a 1.5 in haunch (no stiffness)
    n = Ecd / Ec
    deck = (96 * n * 7.5, 54 + 1.5 + 7.5 / 2, 96 * n * 7.5**3 / 12)
    _Ac, ybc, Ic = assemble([(A, yb, I), deck])
    # non-composite dead load: deck 8 in (incl. 0.5 in sacrificial) × 96 in and haunch 1.5 × 42
    wd = 0.150 * (8 / 12 * 96 / 12) + 0.150 * (1.5 / 12 * 42 / 12)
    # girder on its bearings, 1 ft from each end: M(L/2) = w L²/8 − w L a / 2 (overhangs)
    # deck on the span: wd S² / 8
    M_nc = (w * (L**2 / 8 - L * 1.0 / 2) + wd * S**2 / 8) * 12
    M_c = (0.25 + 0.20) * S**2 / 8 * 12 + 1150 * 12  # SDL + DW, plus live (Service I)
    s_bot = -Pe / A - Pe * e / Sb + M_nc / Sb + M_c * ybc / Ic
    s_top = -Pe / A + Pe * e / St - M_nc / St - M_c * (54 - ybc) / Ic
    s_deck = -n * M_c * (63 - ybc) / Ic
    return {
        "A": A,
        "yb": yb,
        "I": I,
        "es": es,
        "lt": lt,
        "fpe": fpe,
        "t_mid_top": t_mid_top,
        "t_mid_bot": t_mid_bot,
        "t_lt_top": t_lt_top,
        "s_bot": s_bot,
        "s_top": s_top,
        "s_deck": s_deck,
        "Ic": Ic,
        "ybc": ybc,
    }


@pytest.fixture(scope="module")
def us_json(tmp_path_factory: pytest.TempPathFactory) -> dict:
    out = tmp_path_factory.mktemp("json") / "result.json"
    code = main(["check", str(US_EXAMPLE), "--json", str(out)])
    assert code == 0
    return json.loads(out.read_text(encoding="utf-8"))


def test_json_layout(us_json: dict) -> None:
    assert us_json["ok"] is True
    assert us_json["units"] == "US"
    assert us_json["sign_convention"].startswith("tension +")
    assert "licensed engineer" in us_json["caution"]
    names = [s["name"] for s in us_json["stages"]]
    assert names == ["transfer", "deck_placement", "service_permanent", "service_i", "service_iii"]
    for stage in us_json["stages"]:
        assert isinstance(stage["ok"], bool)
        for st in stage["stations"]:
            assert set(st["position_from_girder_end"]) == {"value", "unit"}
            for fiber in st["fibers"].values():
                assert set(fiber["stress"]) == {"value", "unit"}
                assert fiber["stress"]["unit"] == "ksi"
                assert isinstance(fiber["ok"], bool)
    service = {s["name"]: s for s in us_json["stages"][3]["stations"]}
    tenths = [
        "left bearing",
        *[f"0.{i} span" for i in (1, 2, 3, 4, 6, 7, 8, 9)],
        "midspan",
        "right bearing",
    ]
    assert set(tenths) <= set(service)  # tenth points of the design span
    assert {"left lt", "right lt"} <= set(service)  # transfer-length points
    assert set(service["midspan"]["fibers"]) == {"girder_bottom", "girder_top", "deck_top"}


def test_stresses_match_hand_calculation(us_json: dict) -> None:
    h = hand_calculation()
    sec = us_json["section"]
    # sectionproperties on the exact polygon vs pieces by hand: same geometry, round-off only
    assert sec["gross"]["area"]["value"] == pytest.approx(h["A"], rel=1e-9)
    assert sec["gross"]["yb"]["value"] == pytest.approx(h["yb"], rel=1e-9)
    assert sec["gross"]["Ix"]["value"] == pytest.approx(h["I"], rel=1e-9)
    assert sec["composite"]["I"]["value"] == pytest.approx(h["Ic"], rel=1e-9)
    comps = {c["key"]: c["loss"]["value"] for c in us_json["losses"]["components"]}
    assert comps["elastic_shortening"] == pytest.approx(h["es"], rel=1e-8)
    assert comps["creep"] + comps["shrinkage"] + comps["relaxation"] == pytest.approx(h["lt"])
    assert us_json["losses"]["effective_stress"]["value"] == pytest.approx(h["fpe"], rel=1e-8)
    transfer = {s["name"]: s for s in us_json["stages"][0]["stations"]}
    mid = transfer["midspan"]["fibers"]
    assert mid["girder_top"]["stress"]["value"] == pytest.approx(h["t_mid_top"], rel=1e-7)
    assert mid["girder_bottom"]["stress"]["value"] == pytest.approx(h["t_mid_bot"], rel=1e-7)
    left = transfer["left lt"]["fibers"]
    assert left["girder_top"]["stress"]["value"] == pytest.approx(h["t_lt_top"], rel=1e-7)
    service_i = {s["name"]: s for s in us_json["stages"][3]["stations"]}["midspan"]["fibers"]
    assert service_i["girder_bottom"]["stress"]["value"] == pytest.approx(h["s_bot"], rel=1e-7)
    assert service_i["girder_top"]["stress"]["value"] == pytest.approx(h["s_top"], rel=1e-7)
    assert service_i["deck_top"]["stress"]["value"] == pytest.approx(h["s_deck"], rel=1e-7)


def test_limits_from_the_limit_file(us_json: dict) -> None:
    # transfer compression 0.65 f'ci = 0.65 × 5.5 = 3.575 ksi; tension 0.24 √5.5 = 0.5629 ksi
    f = us_json["stages"][0]["stations"][0]["fibers"]["girder_top"]
    assert f["compression_limit"]["value"] == pytest.approx(-3.575)
    assert f["tension_limit"]["value"] == pytest.approx(0.24 * math.sqrt(5.5))
    # Service III: 0.19 √7 = 0.5027 ksi ≤ 0.6 ksi cap
    f = {s["name"]: s for s in us_json["stages"][4]["stations"]}["midspan"]["fibers"][
        "girder_bottom"
    ]
    assert f["tension_limit"]["value"] == pytest.approx(0.19 * math.sqrt(7.0))


def _walk(a: object, b: object, path: str = "") -> list[tuple[str, float, float]]:
    out = []
    if isinstance(a, dict) and isinstance(b, dict):
        if set(a) == {"value", "unit"}:
            assert a["unit"] == b["unit"], path
            return [(path, a["value"], b["value"])]
        for k in a:
            if k not in ("job", "notes"):
                out += _walk(a[k], b[k], f"{path}.{k}")
    elif isinstance(a, list) and isinstance(b, list):
        for i, (x, y) in enumerate(zip(a, b, strict=True)):
            out += _walk(x, y, f"{path}[{i}]")
    return out


def test_si_and_us_examples_give_the_same_results(tmp_path) -> None:
    """The same girder written in SI and in US units: same answers (inputs converted to ten
    significant digits, so agreement to 1e-7 relative is expected)."""
    results = []
    for src in (US_EXAMPLE, SI_EXAMPLE):
        out = tmp_path / f"{src.stem}.json"
        assert main(["check", str(src), "--json", str(out), "--units", "SI"]) == 0
        results.append(json.loads(out.read_text(encoding="utf-8")))
    pairs = _walk(results[0], results[1])
    assert len(pairs) > 200
    for path, a, b in pairs:
        assert a == pytest.approx(b, rel=1e-7, abs=1e-9), path


def test_console_output_has_every_part(capsys) -> None:
    code = main(["check", str(US_EXAMPLE)])
    out = capsys.readouterr().out
    assert code == 0
    for text in (
        "Section properties",
        "Prestress losses",
        "Stage 1",
        "Release in the casting bed",
        "Service I",
        "Service III",
        "tension +, compression −",
        "Summary",
        "PASS",
        "licensed engineer",
    ):
        assert text in out, text
    assert out.rstrip().endswith("computes.")  # the caution closes the output


def test_python_dash_m_runs() -> None:
    proc = subprocess.run(
        [sys.executable, "-m", "prestress", "check", str(US_EXAMPLE), "--json"],
        capture_output=True,
        text=True,
        cwd=ROOT,
        timeout=120,
    )
    assert proc.returncode == 0, proc.stderr
    assert json.loads(proc.stdout)["ok"] is True


def test_exit_status_1_when_a_limit_is_exceeded(tmp_path) -> None:
    text = US_EXAMPLE.read_text(encoding="utf-8").replace("count = 4", "count = 12")
    text = text.replace('file = "limits/', f'file = "{ROOT}/examples/limits/')
    job = tmp_path / "overstressed.toml"
    job.write_text(text, encoding="utf-8")
    out = tmp_path / "r.json"
    assert main(["check", str(job), "--json", str(out)]) == 1
    data = json.loads(out.read_text(encoding="utf-8"))
    assert data["ok"] is False
    assert data["stages"][0]["ok"] is False  # too much prestress at release


def test_stations_filter_that_matches_nothing_is_an_error(capsys) -> None:
    """`--stations` with a word found in no station name says so (it used to print nothing)."""
    assert main(["check", str(US_EXAMPLE), "--stations", "0.5 span"]) == 2
    err = capsys.readouterr().err
    assert "--stations" in err and "midspan" in err and "'0.5 span'" in err
    assert len(err.strip().splitlines()) == 1
    assert main(["check", str(US_EXAMPLE), "--stations", "mid"]) == 0
    assert "midspan" in capsys.readouterr().out


def test_a_bad_console_filter_writes_nothing(tmp_path, capsys) -> None:
    """Exit 2 (bad input) writes no output: the filters are checked before the JSON file."""
    out = tmp_path / "out.json"
    assert main(["check", str(US_EXAMPLE), "--json", str(out), "--stations", "0.5 span"]) == 2
    assert not out.exists()
    assert main(["check", str(US_EXAMPLE), "--json", str(out), "--stage", "final"]) == 2
    assert not out.exists()
    capsys.readouterr()


def test_stage_filter_for_a_stage_the_job_does_not_have(capsys) -> None:
    """--stage handling on a job without [handling] says so (it printed no stage at all)."""
    assert main(["check", str(US_EXAMPLE), "--stage", "handling"]) == 2
    err = capsys.readouterr().err
    assert "--stage" in err and "'handling'" in err and "transfer" in err


def test_section_show_refuses_both_ways_of_giving_n(capsys) -> None:
    argv = ["section", "show", "AASHTO-Type-II", "--deck-thickness", "8 in", "--deck-width"]
    argv += ["84 in", "--modular-ratio", "0.5", "--fc-girder", "6 ksi", "--fc-deck", "4 ksi"]
    assert main(argv) == 2
    assert "not both" in capsys.readouterr().err
