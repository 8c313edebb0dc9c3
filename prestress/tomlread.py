"""Strict reading of TOML tables: every value is fetched by name, with its TOML path.

A :class:`Table` wraps one TOML table, remembers which keys were read and, on
:meth:`Table.done`, reports any key that was not, suggesting the nearest valid key.
All errors are :class:`~prestress.errors.InputError` naming the file and the field.
"""

from __future__ import annotations

import difflib
import math
import tomllib
from collections.abc import Iterator
from pathlib import Path
from typing import Any

from prestress.errors import InputError
from prestress.units import to_internal


def read_toml(path: str | Path) -> dict[str, Any]:
    """Read a TOML file; malformed, non-UTF-8, empty or missing files give an InputError."""
    p = Path(path)
    try:
        raw = p.read_bytes()
    except FileNotFoundError:
        raise InputError("an existing file", file=str(p), got="no such file") from None
    except IsADirectoryError:
        raise InputError("a TOML file", file=str(p), got="a directory") from None
    except OSError as exc:
        raise InputError("a readable file", file=str(p), got=exc.strerror or "unreadable") from None
    except ValueError:
        raise InputError(
            "a valid file path", file=repr(str(p)), got="a path with a NUL character"
        ) from None
    try:
        text = raw.decode("utf-8")
    except UnicodeDecodeError as exc:
        raise InputError(
            "a UTF-8 text file", file=str(p), got=f"a byte that is not UTF-8 at offset {exc.start}"
        ) from None
    if not text.strip():
        raise InputError("a TOML document", file=str(p), got="an empty file")
    try:
        return tomllib.loads(text)
    except tomllib.TOMLDecodeError as exc:
        raise InputError("valid TOML", file=str(p), got=str(exc)) from None


#: Every key name the job-file and library readers use anywhere: an unknown key of a table that
#: is one of these is not taken for a misspelling of a missing one (e.g. `fci` for `fc`).
KNOWN_KEYS: frozenset[str] = frozenset(
    [
        "K1",
        "anchor_set",
        "area",
        "at",
        "cap",
        "coefficient",
        "combinations",
        "compression",
        "concrete",
        "count",
        "dead",
        "debond",
        "deck",
        "deck_placement",
        "deck_top",
        "deck_shrinkage",
        "description",
        "design",
        "detailing",
        "diameter",
        "diaphragms",
        "dimensions",
        "distribution_factor",
        "duct_diameter",
        "dynamic_factor",
        "effective_width",
        "end_height",
        "end_spacing",
        "engineer",
        "exponent",
        "family",
        "fc",
        "fci",
        "file",
        "fill",
        "final",
        "fpu",
        "fpy",
        "friction",
        "girder",
        "girder_bottom",
        "girder_top",
        "girders",
        "grid",
        "handling",
        "harp",
        "haunch",
        "haunch_in_stiffness",
        "haunch_width",
        "height",
        "heights",
        "hold_down",
        "hold_downs",
        "impact",
        "inflection",
        "jack_length",
        "jacking",
        "jacking_stress",
        "job",
        "left",
        "length",
        "library",
        "lift_point",
        "limits",
        "live",
        "loads",
        "long_term",
        "long_term_to_deck",
        "losses",
        "max_share_row",
        "max_share_total",
        "max_terminations_count",
        "max_terminations_share",
        "method",
        "model",
        "modulus",
        "modulus_at_transfer",
        "modulus_unit_weight",
        "moment_midspan",
        "moments",
        "mu",
        "name",
        "note",
        "notes",
        "order",
        "other_noncomposite",
        "overhang",
        "owner",
        "points",
        "position",
        "positions",
        "project",
        "published",
        "relative_humidity",
        "relaxation",
        "right",
        "root_unit",
        "rule",
        "rows",
        "section",
        "section_libraries",
        "service_i",
        "service_iii",
        "service_permanent",
        "set",
        "shear_distribution_factor",
        "skew_degrees",
        "source",
        "spacing",
        "span",
        "stations",
        "strand",
        "strands",
        "stress_before_transfer",
        "superimposed_dead",
        "tendons",
        "tension",
        "thickness",
        "time",
        "title",
        "transfer",
        "transfer_length",
        "tributary_width",
        "unit_weight",
        "units",
        "wearing_surface",
        "weight",
        "wobble",
    ]
)


def _path(prefix: str, key: str | int) -> str:
    if isinstance(key, int):
        return f"{prefix}[{key}]"
    return f"{prefix}.{key}" if prefix else key


class Table:
    """A TOML table being read: typed getters that record the keys used."""

    def __init__(self, data: dict[str, Any], *, file: str, path: str = "") -> None:
        self.data = data
        self.file = file
        self.path = path
        self._used: set[str] = set()

    # -- helpers -----------------------------------------------------------------------------
    def field(self, key: str | int) -> str:
        """Return the dotted TOML path of a key of this table."""
        return _path(self.path, key)

    def error(self, key: str, expected: str, got: str = "") -> InputError:
        """Build an InputError for a key of this table.

        When the key is absent and the table holds a similar key that nothing has read, the
        message asks whether that one is a misspelling of it.
        """
        if key not in self.data:
            near = self._misspelling_of(key)
            if near:
                got = (got + "; " if got else "") + f"is '{near}' a misspelling of it?"
        return InputError(expected, file=self.file, field=self.field(key), got=got)

    def _misspelling_of(self, key: str) -> str | None:
        unused = [k for k in self.data if k not in self._used and k != key and k not in KNOWN_KEYS]
        near = difflib.get_close_matches(key, unused, n=1, cutoff=0.6)
        return near[0] if near else None

    def has(self, key: str) -> bool:
        """Whether the key is present (does not mark it used)."""
        return key in self.data

    def raw(self, key: str, default: Any = ..., *, expected: str = "a value") -> Any:
        """Return the raw value of a key (required unless a default is given)."""
        self._used.add(key)
        if key not in self.data:
            if default is ...:
                near = self._misspelling_of(key)
                if near is not None:
                    raise InputError(
                        f"a known key (did you mean '{key}'?)",
                        file=self.file,
                        field=self.field(near),
                        got="an unknown key",
                    )
                raise self.error(key, expected, "nothing (the field is missing)")
            return default
        return self.data[key]

    # -- typed getters -----------------------------------------------------------------------
    def table(self, key: str, *, required: bool = True) -> Table | None:
        """Return a sub-table, or None when it is optional and absent."""
        value = self.raw(key, None if not required else ..., expected="a table")
        if value is None:
            return None
        if not isinstance(value, dict):
            raise self.error(key, "a table", type(value).__name__)
        return Table(value, file=self.file, path=self.field(key))

    def tables(self, key: str, *, required: bool = True) -> list[Table]:
        """Return an array of tables ([[key]]) as a list of Tables."""
        value = self.raw(key, None if not required else ..., expected="an array of tables")
        if value is None:
            return []
        if not isinstance(value, list) or not all(isinstance(v, dict) for v in value):
            raise self.error(key, "an array of tables, e.g. [[" + self.field(key) + "]]")
        if required and not value:
            raise self.error(key, "at least one entry", "an empty list")
        return [
            Table(v, file=self.file, path=_path(self.field(key), i)) for i, v in enumerate(value)
        ]

    def quantity(
        self,
        key: str,
        kind: str,
        default: Any = ...,
        *,
        positive: bool = False,
        non_negative: bool = False,
    ) -> float:
        """Return a dimensional value converted to the internal system (see prestress.units)."""
        if default is not ... and key not in self.data:
            self._used.add(key)
            return default
        from prestress.units import KINDS

        k = KINDS[kind]
        value = self.raw(key, expected=f"{k.words} with its unit, e.g. {k.example}")
        q = to_internal(value, kind, field=self.field(key), file=self.file)
        if positive and not q > 0:
            raise self.error(key, "a positive value", f'"{value}"')
        if non_negative and q < 0:
            raise self.error(key, "a value of zero or more", f'"{value}"')
        return q

    def number(
        self, key: str, default: Any = ..., *, low: float | None = None, high: float | None = None
    ) -> float:
        """Return a plain (dimensionless) number, optionally checked against a range."""
        value = self.raw(key, default, expected="a number")
        if isinstance(value, bool) or not isinstance(value, int | float):
            raise self.error(key, "a number", repr(value))
        try:
            v = float(value)
        except OverflowError:
            v = math.inf
        if not math.isfinite(v):
            raise self.error(key, "a finite number", "a number too large")
        if (low is not None and v < low) or (high is not None and v > high):
            lo = "-inf" if low is None else f"{low:g}"
            hi = "inf" if high is None else f"{high:g}"
            raise self.error(key, f"a number from {lo} to {hi}", f"{v:g}")
        return v

    def integer(
        self, key: str, default: Any = ..., *, low: int | None = None, high: int | None = None
    ) -> int:
        """Return an integer, optionally at least ``low``."""
        value = self.raw(key, default, expected="a whole number")
        if isinstance(value, bool) or not isinstance(value, int):
            raise self.error(key, "a whole number", repr(value))
        if low is not None and value < low:
            raise self.error(key, f"a whole number of at least {low}", str(value))
        if high is not None and value > high:
            raise self.error(key, f"a whole number of at most {high}", str(value)[:20])
        return value

    def string(
        self, key: str, default: Any = ..., *, choices: tuple[str, ...] | None = None
    ) -> str:
        """Return a string, optionally one of ``choices`` (case-insensitive)."""
        value = self.raw(key, default, expected="a string")
        if not isinstance(value, str):
            raise self.error(key, "a string", repr(value))
        if choices is not None:
            low = {c.lower(): c for c in choices}
            if value.lower() not in low:
                near = difflib.get_close_matches(value.lower(), list(low), n=1)
                hint = f" (did you mean '{low[near[0]]}'?)" if near else ""
                raise self.error(
                    key, "one of " + ", ".join(f"'{c}'" for c in choices) + hint, f"'{value}'"
                )
            return low[value.lower()]
        return value

    def boolean(self, key: str, default: Any = ...) -> bool:
        """Return a boolean."""
        value = self.raw(key, default, expected="true or false")
        if not isinstance(value, bool):
            raise self.error(key, "true or false", repr(value))
        return value

    def done(self, *, allowed_extra: tuple[str, ...] = ()) -> None:
        """Raise on any key that was not read, suggesting the nearest valid one."""
        for key in self.data:
            if key in self._used or key in allowed_extra:
                continue
            known = sorted(self._used | set(allowed_extra))
            near = difflib.get_close_matches(key, known, n=1, cutoff=0.6)
            hint = f"did you mean '{near[0]}'?" if near else "known keys: " + ", ".join(known)
            raise InputError(
                f"a known key ({hint})", file=self.file, field=self.field(key), got="an unknown key"
            )

    def __iter__(self) -> Iterator[str]:
        return iter(self.data)
