"""Exceptions of the package.

Every error caused by the user's input is an :class:`InputError`. It carries the
file, the field (its dotted TOML path) and what was expected, and prints as one
line, so the command line can show it without a traceback and exit with status 2.
"""

from __future__ import annotations


class PrestressError(Exception):
    """Base class of every error raised on purpose by prestress."""


class InputError(PrestressError, ValueError):
    """Bad input: names the file, the field (TOML path) and what was expected.

    Attributes:
        file: path of the file the value came from ('' when not from a file).
        field: dotted TOML path of the field, e.g. ``girder.span``.
        expected: what a valid value looks like, in words.
        got: a short rendering of what was found (may be empty).
    """

    def __init__(self, expected: str, *, file: str = "", field: str = "", got: str = "") -> None:
        self.file = str(file)
        self.field = field
        self.expected = expected
        self.got = got
        super().__init__(self.message())

    def message(self) -> str:
        """Return the one-line message shown to the user."""
        parts = (self.file, f"field '{self.field}'" if self.field else "")
        where = ": ".join(p for p in parts if p)
        text = f"expected {self.expected}" if self.expected else "invalid value"
        if self.got:
            text += f"; got {self.got}"
        text = f"{where}: {text}" if where else text
        return " ".join(text.split())

    def located(self, *, file: str | None = None, prefix: str | None = None) -> InputError:
        """Return a copy with the file set and/or the field prefixed by a TOML path."""
        field = self.field
        if prefix:
            field = f"{prefix}.{field}" if field else prefix
        return InputError(self.expected, file=self.file or (file or ""), field=field, got=self.got)
