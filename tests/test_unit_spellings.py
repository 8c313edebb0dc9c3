"""Unit spellings engineers write every day ("1150 kip-ft", "0.217 in²", "5.5 KSI", "0.25 k/ft",
"70 percent"): read as the same quantity as pint's spelling, never guessed at where they could
mean two things, and without changing the meaning of anything that parsed before.

Exact definitions used for the hand values:
    1 in = 25.4 mm and 1 ft = 304.8 mm (international yard and pound agreement, 1959);
    1 lbf = 0.45359237 kg x 9.80665 m/s² = 4.4482216152605 N (international pound, 1959, and
    standard gravity, 3rd CGPM 1901), so 1 in² = 645.16 mm²;
    1 kip = 1000 lbf, 1 ksi = 1 kip/in², 1 psi = 1 lbf/in², 1 pcf = 1 lbf/ft³, 1 kcf = 1 kip/ft³
    (common practice; NIST SP 811 (2008), Appendix B lists the kip as 1000 lbf, from memory);
    1 MPa = 1 N/mm², 1 GPa = 1000 MPa (SI, BIPM SI Brochure, 9th ed. 2019, Table 7 prefixes);
    1 percent = 0.01 (common practice).
"""

from __future__ import annotations

import itertools
import os
import subprocess
import sys
from pathlib import Path

import pytest

from prestress.cli import build_parser
from prestress.errors import InputError
from prestress.units import KINDS, normalise_quantity, registry, to_internal
from tests.conftest import ROOT, SI_EXAMPLE, US_EXAMPLE

LBF_N = 4.4482216152605  # exact (see the module docstring)
KIP_N = 1000.0 * LBF_N
IN_MM = 25.4
FT_MM = 304.8
IN2_MM2 = IN_MM**2  # 645.16 mm²
KSI_MPA = KIP_N / IN2_MM2


# ---------------------------------------------------------------------------------------------
# Each rule: the everyday spelling is read, and gives the hand-computed value.


@pytest.mark.parametrize(
    ("text", "kind", "expected"),
    [
        # hyphen between two unit words = product
        ("1150 kip-ft", "moment", 1150 * KIP_N * FT_MM),
        ("1150 k-ft", "moment", 1150 * KIP_N * FT_MM),
        ("1150 ft-kips", "moment", 1150 * KIP_N * FT_MM),
        ("1627 kN-m", "moment", 1627 * 1.0e6),
        ("1.5 kip-ft/ft", "force", 1.5 * KIP_N),  # hyphen before the slash: (kip*ft)/ft
        # middle dot = product (the US output prints kip·ft; the SI output kN·m)
        ("1150 kip·ft", "moment", 1150 * KIP_N * FT_MM),
        ("1627 kN·m", "moment", 1627 * 1.0e6),
        ("1627 kN\u22c5m", "moment", 1627 * 1.0e6),  # the dot operator, U+22C5
        # superscript exponents (the output prints in², in⁴, mm², kN/m³)
        ("0.217 in²", "area", 0.217 * IN2_MM2),
        ("140 mm²", "area", 140.0),
        ("37.9 N/mm²", "stress", 37.9),
        ("260730 in⁴", "inertia", 260730 * IN_MM**4),
        ("23.6 kN/m³", "unit_weight", 23.6e3 / 1.0e9),
        ("0.0002 ft⁻¹", "per_length", 0.0002 / FT_MM),
        # "k" and "kips" standing alone are the kip
        ("0.25 k/ft", "line_load", 0.25 * KIP_N / FT_MM),
        ("30 k", "force", 30 * KIP_N),
        ("30 kips", "force", 30 * KIP_N),
        # stress and unit-weight abbreviations in any case
        ("5.5 KSI", "stress", 5.5 * KSI_MPA),
        ("5.5 Ksi", "stress", 5.5 * KSI_MPA),
        ("5500 PSI", "stress", 5500 * LBF_N / IN2_MM2),
        ("41.4 MPA", "stress", 41.4),
        ("41.4 Mpa", "stress", 41.4),
        ("41.4 mpa", "stress", 41.4),
        ("28.5 GPA", "stress", 28500.0),
        ("150 PCF", "unit_weight", 150 * LBF_N / FT_MM**3),
        ("0.150 KCF", "unit_weight", 150 * LBF_N / FT_MM**3),
        # dimensionless: percent and plain numbers
        ("70 percent", "dimensionless", 0.70),
        ("70 %", "dimensionless", 0.70),
        ("70%", "dimensionless", 0.70),
        ("0.7", "dimensionless", 0.70),
    ],
)
def test_everyday_spellings_are_read(text: str, kind: str, expected: float) -> None:
    assert to_internal(text, kind, field="f", file="job.toml") == pytest.approx(expected, rel=1e-12)


@pytest.mark.parametrize(
    ("text", "pint_spelling"),
    [
        ("1150 kip-ft", "1150 kip*ft"),
        ("1150 k-ft", "1150 kip*ft"),
        ("1150 ft-kips", "1150 ft*kip"),
        ("1150 kip·ft", "1150 kip*ft"),
        ("0.217 in²", "0.217 in**2"),
        ("37.9 N/mm²", "37.9 N/mm**2"),
        ("0.0002 ft⁻¹", "0.0002 ft**-1"),
        ("0.25 k/ft", "0.25 kip/ft"),
        ("5.5 KSI", "5.5 ksi"),
        ("41.4 Mpa", "41.4 MPa"),
        ("0.150 KCF", "0.150 kcf"),
        # the number is never touched: a minus sign, an exponent
        ("-3 in", "-3 in"),
        ("1e-3 in", "1e-3 in"),
        ("-2.5E-3 ft", "-2.5E-3 ft"),
        # names that merely start with k are not the kip; pint's own spellings are kept
        ("1 kN", "1 kN"),
        ("1 kN*m", "1 kN*m"),
        ("2400 kg/m^3", "2400 kg/m^3"),
        ("1 km", "1 km"),
        ("6 ksi", "6 ksi"),
        ("0.15 kcf", "0.15 kcf"),
        ("41.4 mPa", "41.4 mPa"),  # pint's millipascal: kept (see the corpus)
        ("30 K", "30 K"),  # the kelvin: not read as the kip
        # not "number unit": returned as written
        ("five feet", "five feet"),
        ("54", "54"),
        ("1e5", "1e5"),
        (" 12.5 ", " 12.5 "),
        ("", ""),
    ],
)
def test_normalised_text(text: str, pint_spelling: str) -> None:
    assert normalise_quantity(text) == pint_spelling


# ---------------------------------------------------------------------------------------------
# Never a guess: what could mean two things (or is a sum) is still refused, one line.


@pytest.mark.parametrize(
    ("text", "kind", "words"),
    [
        # per foot-inch, or per foot times inch? a hyphen after a slash is not read
        ("1 kip/ft-in", "stress", "one number, then its unit"),
        ("1 kip/ft-in", "force", "one number, then its unit"),
        # feet and inches: a hyphen before a number is not a product (nor a sum)
        ("79 ft-6 in", "length", "one number, then its unit"),
        ("79 ft - 6 in", "length", "one number, then its unit"),
        ("7 1/2 in", "length", "one number, then its unit"),
        ("81 ft + 12 in", "length", "one number, then its unit"),
        # a superscript needs a unit before it
        ("10² in", "length", "one number, then its unit"),
        # "K" is the kelvin, not the kip; "k" inside a longer name is that name
        ("1150 K-ft", "moment", "wrong dimension"),
        ("30 kN", "moment", "wrong dimension"),
        # percent is read without pint, other units still checked
        ("70 ksi", "dimensionless", "wrong dimension"),
    ],
)
def test_ambiguous_spellings_are_refused(text: str, kind: str, words: str) -> None:
    with pytest.raises(InputError) as err:
        to_internal(text, kind, field="girder.span", file="job.toml")
    msg = str(err.value)
    assert words in msg and "job.toml" in msg and "girder.span" in msg
    assert f'"{text}"' in msg  # the value is quoted as written, not as normalised
    assert "\n" not in msg


# ---------------------------------------------------------------------------------------------
# Nothing that parsed before changes its meaning: pint reading the text as written agrees.


@pytest.mark.parametrize(
    ("text", "kind"),
    [
        ("1 kN", "force"),
        ("1 kN*m", "moment"),
        ("23.6 kN/m^3", "unit_weight"),
        ("150 pcf", "unit_weight"),
        ("0.15 kcf", "unit_weight"),
        ("1.2 kip/ft", "line_load"),
        ("17.5 kN/m", "line_load"),
        ("-3 in", "length"),
        ("1e-3 in", "length"),
        ("1 km", "length"),
        ("54 in", "length"),
        ("0.153 in^2", "area"),
        ("150 lbf/ft**3", "unit_weight"),
        ("1200 kip*ft", "moment"),
        ("1150 kip·ft", "moment"),
        ("30 kips", "force"),
        ("6.0 ksi", "stress"),
        ("41.4 MPa", "stress"),
        ("41.4 mPa", "stress"),
        ("28.5 GPa", "stress"),
        ("0.0002 /ft", "per_length"),
        ("75 year", "time"),
        ("70 percent", "dimensionless"),
        ("1 ft/in", "dimensionless"),
    ],
)
def test_earlier_spellings_keep_their_meaning(text: str, kind: str) -> None:
    target = KINDS[kind].internal or "dimensionless"
    by_pint = float(registry().Quantity(text).to(target).magnitude)
    assert to_internal(text, kind) == pytest.approx(by_pint, rel=1e-12)


@pytest.mark.parametrize("word", ["ksi", "psi", "mpa", "gpa", "kcf", "pcf"])
def test_case_variants_pint_knew_keep_its_meaning(word: str) -> None:
    """Every case variant of a case-free word: pint's meaning where pint had one (mPa)."""
    ureg = registry()
    canonical = {"mpa": "MPa", "gpa": "GPa"}.get(word, word)
    kind = "unit_weight" if word.endswith("cf") else "stress"
    target = KINDS[kind].internal
    for letters in itertools.product(*[(c.lower(), c.upper()) for c in word]):
        variant = "".join(letters)
        try:
            expected = float(ureg.Quantity(f"1 {variant}").to(target).magnitude)
        except Exception:  # not a pint unit: read as the canonical spelling
            expected = float(ureg.Quantity(f"1 {canonical}").to(target).magnitude)
        assert to_internal(f"1 {variant}", kind) == pytest.approx(expected, rel=1e-12), variant


# ---------------------------------------------------------------------------------------------
# Start-up: a warm check never imports pint, also with "70 percent" (the SI example).


def _python(code: str, cache: Path) -> subprocess.CompletedProcess[str]:
    env = dict(os.environ)
    env["PRESTRESS_CACHE_DIR"] = str(cache)
    env["PYTHONPATH"] = os.pathsep.join(p for p in (str(ROOT), env.get("PYTHONPATH", "")) if p)
    return subprocess.run(
        [sys.executable, "-c", code], capture_output=True, text=True, env=env, cwd=ROOT, timeout=120
    )


def test_percent_and_plain_numbers_need_no_pint(tmp_path: Path) -> None:
    code = (
        "import sys\n"
        "from prestress.units import to_internal\n"
        "values = [to_internal(v, 'dimensionless') for v in "
        "('70 percent', '70 %', '70%', '0.7', 0.7, 70)]\n"
        "assert values == [0.7000000000000001, 0.7000000000000001, 0.7000000000000001, "
        "0.7, 0.7, 70.0], values\n"
        "assert 'pint' not in sys.modules\n"
    )
    proc = _python(code, tmp_path)
    assert proc.returncode == 0, proc.stderr


@pytest.mark.parametrize("example", [SI_EXAMPLE, US_EXAMPLE], ids=["SI", "US"])
def test_warm_load_of_the_examples_imports_no_pint(example: Path, tmp_path: Path) -> None:
    code = (
        "import sys\n"
        "from prestress.jobfile import load_job\n"
        f"load_job({str(example)!r})\n"
        "print(sorted(m for m in ('pint', 'scipy') if m in sys.modules))\n"
    )
    first = _python(code, tmp_path)  # cold: may build the unit factors with pint
    assert first.returncode == 0, first.stderr
    warm = _python(code, tmp_path)
    assert warm.returncode == 0, warm.stderr
    assert warm.stdout.strip() == "[]"


# ---------------------------------------------------------------------------------------------
# The command line's --units: US or SI in any case.


@pytest.mark.parametrize(
    ("given", "system"), [("US", "US"), ("us", "US"), ("Us", "US"), ("SI", "SI"), ("si", "SI")]
)
def test_units_option_in_any_case(given: str, system: str) -> None:
    args = build_parser("check").parse_args(["check", "job.toml", "--units", given])
    assert args.units == system


def test_units_option_refuses_other_systems(capsys: pytest.CaptureFixture[str]) -> None:
    with pytest.raises(SystemExit) as exc:
        build_parser("check").parse_args(["check", "job.toml", "--units", "imperial"])
    assert exc.value.code == 2
    err = capsys.readouterr().err
    assert "--units" in err and "'imperial'" in err and len(err.strip().splitlines()) == 1
