"""Units: one cached pint registry, parsing of job-file quantities, output unit systems.

Internal base system of the engine (declared once, used everywhere inside):
    length mm, force N, stress MPa (= N/mm^2), moment N*mm, line load N/mm,
    unit weight N/mm^3, time day.

Every dimensional value read from a file is a string with its unit ("54 in",
"41.4 MPa"); it is converted to the internal system once, by :func:`to_internal`.
Results are converted back once, by :func:`from_internal`, into the output
system chosen by the job ("US" or "SI").
"""

from __future__ import annotations

import math
import re
from dataclasses import dataclass
from functools import lru_cache
from typing import TYPE_CHECKING, Any

from prestress.errors import InputError

if TYPE_CHECKING:
    import pint

#: Standard gravity, used to turn a mass density into a unit weight (CGPM 1901, exact).
G_STANDARD_M_S2 = 9.80665


@dataclass(frozen=True)
class Kind:
    """A physical kind of quantity: its pint dimensionality and internal unit."""

    name: str
    internal: str
    example: str
    words: str


KINDS: dict[str, Kind] = {
    k.name: k
    for k in (
        Kind("length", "mm", '"54 in" or "1.372 m"', "a length"),
        Kind("area", "mm**2", '"0.153 in^2" or "98.7 mm^2"', "an area"),
        Kind("inertia", "mm**4", '"260730 in^4"', "a second moment of area"),
        Kind("stress", "MPa", '"6.0 ksi" or "41.4 MPa"', "a stress"),
        Kind("force", "N", '"30 kip" or "133 kN"', "a force"),
        Kind("moment", "N*mm", '"1200 kip*ft" or "1627 kN*m"', "a moment"),
        Kind("line_load", "N/mm", '"1.2 kip/ft" or "17.5 kN/m"', "a load per length"),
        Kind("unit_weight", "N/mm**3", '"150 pcf" or "23.6 kN/m^3"', "a unit weight"),
        Kind("time", "day", '"1 day" or "75 year"', "a time"),
        Kind("per_length", "1/mm", '"0.0002 /ft"', "a coefficient per length"),
        Kind("dimensionless", "", '"70 percent"', "a dimensionless number"),
    )
}


def _cache_dir() -> str:
    import platformdirs

    return platformdirs.user_cache_dir("prestress", appauthor=False)


@lru_cache(maxsize=1)
def registry() -> pint.UnitRegistry:
    """Return the package's single pint registry (built once, cached on disk by pint)."""
    import pint

    try:
        ureg = pint.UnitRegistry(cache_folder=f"{_cache_dir()}/pint")
    except OSError:  # read-only home: build without the disk cache
        ureg = pint.UnitRegistry()
    ureg.define("pcf = lbf / foot ** 3")
    ureg.define("kcf = kip / foot ** 3")
    ureg.define("klf = kip / foot")
    ureg.define("plf = lbf / foot")
    ureg.define("ksf = kip / foot ** 2")
    ureg.define("psf = lbf / foot ** 2")
    return ureg


def _describe(value: Any) -> str:
    if isinstance(value, str):
        return f'"{value}"'
    if isinstance(value, bool):
        return f"boolean {str(value).lower()}"
    if isinstance(value, int | float):
        return f"a bare number {value}"
    if isinstance(value, dict):
        return "a table"
    if isinstance(value, list):
        return "a list"
    return type(value).__name__


def parse_quantity(value: Any, kind: str, *, field: str = "", file: str = "") -> pint.Quantity:
    """Parse a job-file value into a pint quantity of the given kind.

    The text is first put in pint's spelling by :func:`normalise_quantity` ("1150 kip-ft",
    "0.217 in²", "5.5 KSI"); error messages quote the value as written.

    Args:
        value: the raw TOML value; must be a string with a unit for dimensional kinds.
        kind: a key of :data:`KINDS`.
        field: dotted TOML path, for error messages.
        file: file path, for error messages.

    Raises:
        InputError: bare number, malformed text, wrong dimension, NaN or infinity.
    """
    k = KINDS[kind]
    expected = f"{k.words} with its unit, e.g. {k.example}"
    ureg = registry()
    if isinstance(value, bool) or not isinstance(value, str | int | float):
        raise InputError(expected, file=file, field=field, got=_describe(value))
    if isinstance(value, int | float):
        if kind != "dimensionless":
            raise InputError(expected, file=file, field=field, got=_describe(value))
        q = ureg.Quantity(float(value), "")
    else:
        text = normalise_quantity(value.strip())
        if not text:
            raise InputError(expected, file=file, field=field, got="an empty string")
        if (
            not _QUANTITY_RE.match(text)
            and text.lower() not in ("nan", "inf")
            and not (re.match(r"^\s*[-+]?(nan|inf)\b", text, re.I))
        ):
            raise InputError(
                expected + " (one number, then its unit)",
                file=file,
                field=field,
                got=_describe(value),
            )
        try:
            q = ureg.Quantity(text)
        except Exception:  # pint raises many types for malformed text
            raise InputError(expected, file=file, field=field, got=_describe(value)) from None
        try:
            if not isinstance(q, ureg.Quantity):  # plain number inside a string
                q = ureg.Quantity(float(q), "")
            else:
                q = ureg.Quantity(float(q.magnitude), q.units)
        except OverflowError:
            raise InputError(
                f"a finite value ({k.words})", file=file, field=field, got="a number too large"
            ) from None
        if kind != "dimensionless" and q.dimensionless:
            raise InputError(expected, file=file, field=field, got=f"{_describe(value)} (no unit)")
    if kind == "unit_weight" and q.check("[mass] / [length] ** 3"):
        q = q * ureg.Quantity(G_STANDARD_M_S2, "m/s**2")
    target = ureg.Unit(k.internal) if k.internal else ureg.dimensionless
    if q.dimensionality != target.dimensionality:
        got = f"{_describe(value)} (wrong dimension)"
        raise InputError(expected, file=file, field=field, got=got)
    try:
        magnitude = float(q.to(target).magnitude)
        if not math.isfinite(magnitude):
            raise OverflowError
        q = q.to(target)
        q = ureg.Quantity(magnitude, target)
    except OverflowError:
        magnitude = math.inf
    if not math.isfinite(magnitude):
        raise InputError(f"a finite value: {k.words}", file=file, field=field, got=_describe(value))
    return q


#: What a job-file quantity looks like: a number, then a unit expression made of unit names,
#: products and quotients, and integer powers (``"54 in"``, ``"0.153 in^2"``, ``"1.2 kip/ft"``,
#: ``"0.0002 /ft"``, ``"150 lbf/ft**3"``). Anything else (``"7 1/2 in"``, ``"81 ft + 12 in"``)
#: is refused rather than guessed at.
_UNIT_NAME = r"[A-Za-z°µ%_][A-Za-z°µ%_0-9]*?(?:\s*(?:\^|\*\*)\s*[-+]?\d+)?"
_QUANTITY_RE = re.compile(
    r"^\s*[-+]?(?:\d+(?:\.\d*)?|\.\d+)(?:[eE][-+]?\d+)?\s*"
    rf"(?:/?\s*{_UNIT_NAME}(?:\s*(?:[*/·]|\s)\s*{_UNIT_NAME})*)?\s*$"
)

_NUMBER_UNIT = re.compile(r"^\s*([-+]?(?:\d+(?:\.\d*)?|\.\d+)(?:[eE][-+]?\d+)?)\s*(\S.*?)\s*$")

#: A plain number written as a string ("0.7"): a dimensionless value without a unit.
_PLAIN_NUMBER = re.compile(r"^\s*[-+]?(?:\d+(?:\.\d*)?|\.\d+)(?:[eE][-+]?\d+)?\s*$")

#: Size of the dimensionless units read without pint (pint's definitions: percent = 0.01).
_DIMENSIONLESS_UNITS = {"percent": 0.01, "%": 0.01}

# Spellings engineers write that pint does not read, put in pint's spelling by
# normalise_quantity. Each rule acts on the unit text only (never on the number, so a minus
# sign or an exponent such as 1e-3 is untouched) and only where the text would otherwise be
# refused: nothing that parsed before changes its meaning.

#: A run of superscript characters, an exponent: "in²" is "in**2", "ft⁻¹" is "ft**-1".
_SUPERSCRIPT_RUN = re.compile("\u207b?[\u2070\u00b9\u00b2\u00b3\u2074-\u2079]+")
_SUPERSCRIPT_DIGITS = str.maketrans(
    "\u2070\u00b9\u00b2\u00b3\u2074\u2075\u2076\u2077\u2078\u2079\u207b", "0123456789-"
)
#: A hyphen joining two unit words: "kip-ft", "ft-kips", "kN-m" are products.
_HYPHEN_PRODUCT = re.compile(r"(?<=[A-Za-z])-(?=[A-Za-z])")
#: A unit word standing alone (not part of a longer name such as "kN", "kg" or "ksi").
_UNIT_WORD = re.compile(r"(?<![A-Za-z0-9_°µ%])[A-Za-z]+(?![A-Za-z0-9_°µ%])")
#: Whole unit words read as another spelling: "k" and "kips" are the kip (common practice in
#: US bridge drawings: "k", "k/ft", "k-ft"); "k" alone is otherwise pint's Boltzmann constant,
#: never a valid job-file unit. Stress and unit-weight abbreviations are read whatever their
#: case ("KSI", "Mpa"), except the exact spelling "mPa", which pint reads as the millipascal
#: and which keeps the meaning it always had here (no guess that the megapascal was meant).
_WORD_SPELLINGS = {"k": "kip", "kips": "kip"}
_CASE_FREE_WORDS = {
    "ksi": "ksi",
    "psi": "psi",
    "mpa": "MPa",
    "gpa": "GPa",
    "kcf": "kcf",
    "pcf": "pcf",
}
_PINT_WORDS = {"mPa"}


def _spell_word(m: re.Match[str]) -> str:
    word = m.group(0)
    if word in _WORD_SPELLINGS:
        return _WORD_SPELLINGS[word]
    if word in _PINT_WORDS:
        return word
    return _CASE_FREE_WORDS.get(word.lower(), word)


def normalise_quantity(text: str) -> str:
    """Put a job-file quantity in pint's spelling; text that is not "number unit" is returned.

    Rules (on the unit text only; the number is kept as written):

    - superscript exponents become powers: ``"0.217 in²"`` → ``"0.217 in**2"``;
    - the middle dot (· or ⋅) is a product: ``"1150 kip·ft"`` → ``"1150 kip*ft"``;
    - a hyphen directly between two unit words, before any ``/``, is a product:
      ``"1150 kip-ft"`` → ``"1150 kip*ft"``, ``"1150 ft-kips"`` → ``"1150 ft*kip"``; a hyphen
      after a ``/`` (``"kip/ft-in"``: per foot-inch, or per foot times inch?) or before a
      number (``"79 ft-6 in"``) is left, so the text is refused rather than guessed at;
    - the words ``k`` and ``kips`` standing alone are the kip (``"0.25 k/ft"``), never inside
      a longer name (``kN``, ``kg``, ``km``, ``ksi``, ``kcf`` are untouched);
    - ``ksi``, ``psi``, ``MPa``, ``GPa``, ``kcf`` and ``pcf`` are read in any case
      (``"5.5 KSI"``), except ``mPa``, pint's millipascal, which keeps that meaning.

    Args:
        text: the value as written in the job file.

    Returns:
        The same quantity in pint's spelling, or ``text`` itself when it is not one number
        followed by a unit (a plain number such as ``"54"`` included).
    """
    m = None if _PLAIN_NUMBER.match(text) else _NUMBER_UNIT.match(text)
    if m is None:
        return text
    number, unit = m.groups()
    unit = _SUPERSCRIPT_RUN.sub(lambda r: "**" + r.group(0).translate(_SUPERSCRIPT_DIGITS), unit)
    unit = unit.replace("\u00b7", "*").replace("\u22c5", "*")
    slash = unit.find("/")
    if slash < 0:
        unit = _HYPHEN_PRODUCT.sub("*", unit)
    else:
        unit = _HYPHEN_PRODUCT.sub("*", unit[:slash]) + unit[slash:]
    unit = _UNIT_WORD.sub(_spell_word, unit)
    return f"{number} {unit}"


def _dimensionless_without_pint(value: Any) -> float | None:
    """A plain number, or a number in percent, read without pint; None if anything else."""
    if isinstance(value, bool):
        return None
    if isinstance(value, int | float):
        try:
            result = float(value)
        except OverflowError:
            return None
        return result if math.isfinite(result) else None
    if not isinstance(value, str):
        return None
    if _PLAIN_NUMBER.match(value):
        result = float(value)
        return result if math.isfinite(result) else None
    m = _NUMBER_UNIT.match(value)
    if m is None or m.group(2) not in _DIMENSIONLESS_UNITS:
        return None
    result = float(m.group(1)) * _DIMENSIONLESS_UNITS[m.group(2)]
    return result if math.isfinite(result) else None


_FACTORS: dict[str, float] | None = None


def _factor_cache_path():
    """The unit-factor table's file, keyed by the package's version (cleared with the cache)."""
    from prestress import __version__
    from prestress.paths import cache_dir

    return cache_dir() / f"unit-factors-{__version__}.json"


def _load_factors() -> dict[str, float]:
    """Unit factors from the disk cache (a bad or missing file is simply ignored)."""
    global _FACTORS
    if _FACTORS is None:
        import json

        _FACTORS = {}
        try:
            data = json.loads(_factor_cache_path().read_text(encoding="utf-8"))
            if isinstance(data, dict):
                _FACTORS = {
                    k: float(v)
                    for k, v in data.items()
                    if isinstance(k, str)
                    and isinstance(v, int | float)
                    and math.isfinite(v)
                    and v > 0
                }
        except (OSError, ValueError, TypeError):
            _FACTORS = {}
    return _FACTORS


def _unit_factor(unit_text: str, kind: str) -> float | None:
    """Size of ``1 unit_text`` in the internal unit of ``kind``; None if not of that kind.

    Factors are cached in memory and on disk (keyed by the package's version; ``prestress
    cache clear`` empties it), so a warm start parses no unit with pint and does not even
    import it.
    """
    factors = _load_factors()
    key = f"{kind}\x1f{unit_text}"
    if key in factors:
        return factors[key]
    try:
        q = parse_quantity("1 " + unit_text, kind)
    except InputError:
        return None
    value = float(q.to(KINDS[kind].internal or "dimensionless").magnitude)
    if math.isfinite(value) and value > 0:
        factors[key] = value
        try:
            import json

            from prestress.atomic import write_atomic

            write_atomic(_factor_cache_path(), json.dumps(factors, sort_keys=True))
        except OSError:
            pass
    return value


def to_internal(value: Any, kind: str, *, field: str = "", file: str = "") -> float:
    """Parse a job-file value and return its magnitude in the internal base system.

    Fast path: the text is put in pint's spelling (:func:`normalise_quantity`), "number unit"
    strings are split by a regular expression and the unit's factor is cached, so pint parses
    each distinct unit once per process; a dimensionless plain number or percentage
    (``"0.7"``, ``"70 percent"``, ``"70 %"``) never needs pint. Anything else (and every error)
    goes through :func:`parse_quantity`.
    """
    if kind == "dimensionless":
        plain = _dimensionless_without_pint(value)
        if plain is not None:
            return plain
    text = normalise_quantity(value) if isinstance(value, str) else None
    if text is not None and _QUANTITY_RE.match(text):
        m = _NUMBER_UNIT.match(text)
        if m is not None:
            factor = _unit_factor(m.group(2), kind)
            if factor is not None:
                result = float(m.group(1)) * factor
                if math.isfinite(result):
                    return result
    q = parse_quantity(value, kind, field=field, file=file)
    return float(q.to(KINDS[kind].internal or "dimensionless").magnitude)  # finite: checked


# --------------------------------------------------------------------------------------------
# Output unit systems. Conversion factors from the internal system are exact constants, so the
# presenters never need pint (fast start-up); tests check them against pint.

INCH_MM = 25.4
FOOT_MM = 304.8
LBF_N = 4.4482216152605
KIP_N = 1000.0 * LBF_N
KSI_MPA = KIP_N / INCH_MM**2


@dataclass(frozen=True)
class OutUnit:
    """An output unit: its label and the factor from the internal unit (out = internal / factor)."""

    label: str
    factor: float


#: Output systems: for each display role, the unit label and its size in internal units.
SYSTEMS: dict[str, dict[str, OutUnit]] = {
    "US": {
        "dimension": OutUnit("in", INCH_MM),
        "position": OutUnit("ft", FOOT_MM),
        "area": OutUnit("in²", INCH_MM**2),
        "inertia": OutUnit("in⁴", INCH_MM**4),
        "modulus": OutUnit("in³", INCH_MM**3),
        "stress": OutUnit("ksi", KSI_MPA),
        "modulus_e": OutUnit("ksi", KSI_MPA),
        "force": OutUnit("kip", KIP_N),
        "moment": OutUnit("kip·ft", KIP_N * FOOT_MM),
        "line_load": OutUnit("kip/ft", KIP_N / FOOT_MM),
        "unit_weight": OutUnit("kcf", KIP_N / FOOT_MM**3),
        "time": OutUnit("day", 1.0),
        "percent": OutUnit("%", 0.01),
        "ratio": OutUnit("", 1.0),
    },
    "SI": {
        "dimension": OutUnit("mm", 1.0),
        "position": OutUnit("m", 1000.0),
        "area": OutUnit("mm²", 1.0),
        "inertia": OutUnit("mm⁴", 1.0),
        "modulus": OutUnit("mm³", 1.0),
        "stress": OutUnit("MPa", 1.0),
        "modulus_e": OutUnit("MPa", 1.0),
        "force": OutUnit("kN", 1000.0),
        "moment": OutUnit("kN·m", 1.0e6),
        "line_load": OutUnit("kN/m", 1.0),
        "unit_weight": OutUnit("kN/m³", 1.0e-6),
        "time": OutUnit("day", 1.0),
        "percent": OutUnit("%", 0.01),
        "ratio": OutUnit("", 1.0),
    },
}

#: Plain-ASCII unit text for machine-readable output (pint-parsable).
ASCII = {
    "in²": "in**2",
    "in⁴": "in**4",
    "in³": "in**3",
    "mm²": "mm**2",
    "mm⁴": "mm**4",
    "mm³": "mm**3",
    "kip·ft": "kip*ft",
    "kN·m": "kN*m",
    "kN/m³": "kN/m**3",
    "%": "percent",
}


def out_unit(system: str, role: str) -> OutUnit:
    """Return the output unit of a display role in a system ("US" or "SI")."""
    return SYSTEMS[system][role]


def from_internal(value: float, system: str, role: str) -> float:
    """Convert an internal-system magnitude into the output unit of ``role``."""
    return value / SYSTEMS[system][role].factor


def show_dimension(mm: float, system: str) -> str:
    """A section dimension for messages in a system's units: "1.97 in" or "50 mm"."""
    return f"{mm:.0f} mm" if system == "SI" else f"{mm / INCH_MM:.2f} in"


def show_position(mm: float, system: str) -> str:
    """A length along the girder for messages: "52.49 ft" or "16.00 m"."""
    return f"{mm / 1000:.2f} m" if system == "SI" else f"{mm / FOOT_MM:.2f} ft"


def show_stress(mpa: float, system: str, spec: str = ".4g") -> str:
    """A stress for messages: "7.98 ksi" or "55 MPa" (``spec``: the number's format)."""
    return f"{mpa:{spec}} MPa" if system == "SI" else f"{mpa / KSI_MPA:{spec}} ksi"


def in_both(system: str, us: str, si: str) -> str:
    """A value written in both systems, the job's own first: "12.7 ft (3.88 m)" or the reverse.

    Notes and messages are written once, before ``--units`` may change the tables' units,
    so they carry both; ``system`` is the job's ("US" or "SI").
    """
    return f"{si} ({us})" if system == "SI" else f"{us} ({si})"


def ascii_label(label: str) -> str:
    """Return a plain-ASCII, pint-parsable rendering of a unit label."""
    return ASCII.get(label, label)
