"""Units: parsing of job-file quantities, rejection of bare numbers and wrong dimensions,
and the exact conversion factors of the presenters checked against pint."""

from __future__ import annotations

import math

import pytest

from prestress.errors import InputError
from prestress.units import KINDS, SYSTEMS, registry, to_internal


@pytest.mark.parametrize(
    ("text", "kind", "expected"),
    [
        # exact definitions: 1 in = 25.4 mm, 1 ft = 304.8 mm (international yard and pound, 1959)
        ("54 in", "length", 1371.6),
        ("1.372 m", "length", 1372.0),
        ("0.153 in^2", "area", 0.153 * 645.16),
        # 1 lbf = 4.4482216152605 N (exact, from the international pound and standard gravity)
        ("6.0 ksi", "stress", 6.0 * 4448.2216152605 / 645.16),
        ("41.4 MPa", "stress", 41.4),
        ("1.2 kip/ft", "line_load", 1.2 * 4448.2216152605 / 304.8),
        ("150 pcf", "unit_weight", 150 * 4.4482216152605 / 304.8**3),
        ("2400 kg/m^3", "unit_weight", 2400 * 9.80665 / 1e9),  # mass density × standard gravity
        ("1200 kip*ft", "moment", 1200 * 4448.2216152605 * 304.8),
        ("90 day", "time", 90.0),
    ],
)
def test_parse_to_internal(text: str, kind: str, expected: float) -> None:
    assert to_internal(text, kind) == pytest.approx(expected, rel=1e-12)


@pytest.mark.parametrize(
    ("value", "kind", "words"),
    [
        (54, "length", "bare number"),
        (54.0, "stress", "bare number"),
        ("54", "length", "no unit"),
        ("54 ksi", "length", "wrong dimension"),
        ("6 in", "stress", "wrong dimension"),
        ("", "length", "empty"),
        ("five feet", "length", '"five feet"'),
        (True, "length", "boolean"),
        ("nan in", "length", "finite"),
        ("inf ksi", "stress", "finite"),
    ],
)
def test_bad_quantities_name_the_field(value: object, kind: str, words: str) -> None:
    with pytest.raises(InputError) as err:
        to_internal(value, kind, field="girder.span", file="job.toml")
    msg = str(err.value)
    assert "job.toml" in msg and "girder.span" in msg and words in msg
    assert "\n" not in msg
    assert KINDS[kind].words in msg or "finite" in msg


def test_output_factors_match_pint() -> None:
    """The presenters' exact factors agree with pint's definitions."""
    ureg = registry()
    internal = {
        "dimension": "mm",
        "position": "mm",
        "area": "mm**2",
        "inertia": "mm**4",
        "modulus": "mm**3",
        "stress": "MPa",
        "modulus_e": "MPa",
        "force": "N",
        "moment": "N*mm",
        "line_load": "N/mm",
        "unit_weight": "N/mm**3",
    }
    pint_name = {
        "in²": "in**2",
        "in⁴": "in**4",
        "in³": "in**3",
        "mm²": "mm**2",
        "mm⁴": "mm**4",
        "mm³": "mm**3",
        "kip·ft": "kip*ft",
        "kN·m": "kN*m",
        "kN/m³": "kN/m**3",
        "kcf": "kip/ft**3",
    }
    for system in ("US", "SI"):
        for role, base in internal.items():
            out = SYSTEMS[system][role]
            factor = ureg.Quantity(1.0, pint_name.get(out.label, out.label)).to(base).magnitude
            assert math.isclose(out.factor, factor, rel_tol=1e-12), (system, role)
