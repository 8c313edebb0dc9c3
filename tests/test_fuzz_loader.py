"""Fuzzing the job loader: any mutation of a valid job either loads or is an InputError.

Mutations of the shipped example's text (hypothesis): delete, duplicate or swap lines; replace
a value by random text, a number, a boolean, a date, a list or a table; turn a table header
into an array-of-tables header; truncate; insert random bytes. ``prestress.jobfile.load_job``
must then return a job or raise :class:`prestress.errors.InputError` (one line naming the file),
never any other exception (the contract of prestress.cli: status 2 for bad input, 3 only for
bugs). Inputs that are known to crash the loader today are pinned below as strict xfails and
kept out of the random search until they are fixed (see ``KNOWN_CRASHES``).
"""

from __future__ import annotations

import contextlib
import io
import re
from pathlib import Path

import pytest
from hypothesis import HealthCheck, given, settings
from hypothesis import strategies as st

from prestress.cli import main
from prestress.errors import InputError
from prestress.jobfile import load_job
from tests.conftest import ROOT, US_EXAMPLE

BASE = US_EXAMPLE.read_text(encoding="utf-8").replace(
    'file = "limits/', f'file = "{(ROOT / "examples" / "limits").as_posix()}/'
)
LINES = BASE.splitlines(keepends=True)
#: Lines holding ``key = value`` (not comments): where values are replaced.
VALUE_LINES = [
    i for i, ln in enumerate(LINES) if re.match(r"^\s*[A-Za-z_][\w-]*\s*=", ln) is not None
]
HEADER_LINES = [i for i, ln in enumerate(LINES) if ln.startswith("[")]

# Integers are bounded: a strand count of 10**8 would make the loader allocate gigabytes
# (a resource problem, not a crash to look for here), and integers beyond the float range
# are a known crash (KNOWN_CRASHES).
INTS = st.integers(min_value=-100_000, max_value=100_000)
FLOATS = st.floats(allow_nan=True, allow_infinity=True, width=64)
# No NUL character: a NUL in a path is a known crash (KNOWN_CRASHES).
TEXT = st.text(
    st.characters(blacklist_characters="\x00", blacklist_categories=("Cs",)), max_size=24
)
UNIT_TEXT = st.builds(
    lambda n, u: f"{n} {u}",
    st.one_of(INTS.map(str), FLOATS.map(repr), st.sampled_from(["", "-", "1e", ".5", "7 1/2"])),
    st.sampled_from(["in", "ft", "ksi", "psi", "MPa", "kip/ft", "pcf", "day", "%", "in^2", "xyz"]),
)


def _toml_string(s: str) -> str:
    """A TOML basic string holding s (every control character escaped)."""
    out = []
    for ch in s:
        if ch in '"\\':
            out.append("\\" + ch)
        elif ord(ch) < 0x20 or ord(ch) == 0x7F:
            out.append(f"\\u{ord(ch):04x}")
        else:
            out.append(ch)
    return '"' + "".join(out) + '"'


def _toml_float(x: float) -> str:
    if x != x:
        return "nan"
    if x in (float("inf"), float("-inf")):
        return "inf" if x > 0 else "-inf"
    text = repr(x)
    return text if any(c in text for c in ".en") else text + ".0"


SCALARS = st.one_of(
    TEXT.map(_toml_string),
    UNIT_TEXT.map(_toml_string),
    INTS.map(str),
    FLOATS.map(_toml_float),
    st.booleans().map(lambda b: "true" if b else "false"),
    st.dates().map(lambda d: d.isoformat()),
)
VALUES = st.one_of(
    SCALARS,
    st.lists(SCALARS, max_size=12).map(lambda xs: "[" + ", ".join(xs) + "]"),
    st.dictionaries(st.from_regex(r"[a-z_]{1,12}", fullmatch=True), SCALARS, max_size=3).map(
        lambda d: "{ " + ", ".join(f"{k} = {v}" for k, v in d.items()) + " }"
    ),
    TEXT,  # raw, unquoted text: usually not TOML at all
)


@st.composite
def mutations(draw: st.DrawFn) -> bytes:
    """The example's text with one to three random mutations."""
    lines = list(LINES)
    for _ in range(draw(st.integers(min_value=1, max_value=3))):
        op = draw(
            st.sampled_from(["delete", "duplicate", "swap", "value", "header", "cut", "bytes"])
        )
        n = len(lines)
        if op == "delete" and n > 1:
            del lines[draw(st.integers(0, n - 1))]
        elif op == "duplicate":
            i = draw(st.integers(0, n - 1))
            lines.insert(i, lines[i])
        elif op == "swap" and n > 1:
            i, j = draw(st.integers(0, n - 1)), draw(st.integers(0, n - 1))
            lines[i], lines[j] = lines[j], lines[i]
        elif op == "value":
            candidates = [i for i in VALUE_LINES if i < n and "=" in lines[i]]
            if candidates:
                i = draw(st.sampled_from(candidates))
                key = lines[i].split("=", 1)[0]
                lines[i] = f"{key}= {draw(VALUES)}\n"
        elif op == "header":
            candidates = [i for i in HEADER_LINES if i < n and lines[i].startswith("[")]
            if candidates:
                i = draw(st.sampled_from(candidates))
                name = lines[i].strip().strip("[]")
                lines[i] = draw(st.sampled_from([f"[[{name}]]\n", f"[{name}]\n", f"[{name}x]\n"]))
        elif op == "cut":
            text = "".join(lines)
            lines = [text[: draw(st.integers(0, len(text)))]]
        elif op == "bytes":
            data = "".join(lines).encode("utf-8")
            at = draw(st.integers(0, len(data)))
            blob = draw(st.binary(min_size=1, max_size=8))
            return data[:at] + blob + data[at:]
    return "".join(lines).encode("utf-8")


@pytest.fixture(scope="module")
def workdir(tmp_path_factory: pytest.TempPathFactory) -> Path:
    return tmp_path_factory.mktemp("fuzz")


def _load(path: Path) -> None:
    """Load a job; an InputError is an accepted outcome, and must print as one line."""
    try:
        load_job(path)
    except InputError as exc:
        message = exc.message()
        assert "\n" not in message
        assert exc.file, message


@settings(
    max_examples=300,
    deadline=None,
    suppress_health_check=[HealthCheck.too_slow, HealthCheck.data_too_large],
)
@given(data=mutations())
def test_mutated_jobs_load_or_raise_input_error(data: bytes, workdir: Path) -> None:
    """Bad input is the user's to fix and must be reported, never crash the loader."""
    path = workdir / "mutated.toml"
    path.write_bytes(data)
    _load(path)


@settings(
    max_examples=60,
    deadline=None,
    suppress_health_check=[HealthCheck.too_slow, HealthCheck.data_too_large],
)
@given(data=mutations())
def test_mutated_jobs_never_give_an_internal_error(data: bytes, workdir: Path) -> None:
    """A job that loads runs to a verdict: status 0, 1 or 2 — status 3 is always a bug."""
    path = workdir / "mutated-check.toml"
    path.write_bytes(data)
    out, err = io.StringIO(), io.StringIO()
    with contextlib.redirect_stdout(out), contextlib.redirect_stderr(err):
        code = main(["check", str(path), "--json", "-"])
    assert code in (0, 1, 2), err.getvalue()
    if code == 2:
        assert len(err.getvalue().strip().splitlines()) == 1, err.getvalue()


#: Inputs that crash the loader today (found by this fuzzer). Each mutates one line of the
#: example; each should give an InputError naming the field.
KNOWN_CRASHES = [
    pytest.param(
        "relative_humidity = 70",
        "relative_humidity = " + "9" * 400,
        id="integer-beyond-float-range-humidity",
    ),
    pytest.param(
        "[losses]\n",
        "[combinations.service_iii]\nlive = " + "9" * 400 + "\n\n[losses]\n",
        id="integer-beyond-float-range-load-factor",
    ),
    pytest.param(
        'fc = "7.0 ksi"',
        'fc = "' + "9" * 400 + ' ksi"',
        id="digits-beyond-float-range-in-a-quantity",
    ),
    pytest.param(
        "count = 12",
        "count = " + "1" + "0" * 30,
        id="strand-count-beyond-array-size",
    ),
    pytest.param(
        'file = "',
        'file = "\\u0000',
        id="nul-character-in-the-limits-path",
    ),
]


@pytest.mark.parametrize(("old", "new"), KNOWN_CRASHES)
def test_known_loader_crashes(old: str, new: str, tmp_path: Path) -> None:
    """Regression cases of crashes found by this fuzzer (fixed): each is now an InputError."""
    assert old in BASE
    path = tmp_path / "job.toml"
    path.write_text(BASE.replace(old, new, 1), encoding="utf-8")
    _load(path)


def test_the_unmutated_example_loads(workdir: Path) -> None:
    """The fuzzer starts from a valid job (otherwise it would only test the first error)."""
    path = workdir / "unmutated.toml"
    path.write_text(BASE, encoding="utf-8")
    load_job(path)
    assert VALUE_LINES and HEADER_LINES
