"""Numbers on screen: enough figures for a reviewer to recompute, a true minus sign.

Four significant figures for section properties in engineering notation (common practice:
tables of section properties give three to four figures; a rounded 1.1×10⁹ mm³ hides a 2.5 %
difference a reviewer could not recover).
"""

from __future__ import annotations

import pytest

from prestress.present.common import fmt


@pytest.mark.parametrize(
    ("mm3", "text"),
    [
        (1.127e9, "1.127×10⁹"),
        (931.5e6, "931.5×10⁶"),
        (158.9e6, "158.9×10⁶"),
        (12.34e9, "12.34×10⁹"),
        (999.96e6, "1.000×10⁹"),  # rounds up into the next power
        (9.99996e9, "10.00×10⁹"),  # rounds up into the next decade: still four figures
        (99.9996e9, "100.0×10⁹"),
    ],
)
def test_engineering_notation_keeps_four_figures(mm3: float, text: str) -> None:
    assert fmt(mm3, "SI", "modulus") == text


def test_negative_numbers_carry_a_true_minus() -> None:
    assert fmt(-1.5, "SI", "stress") == "−1.50"


@pytest.mark.parametrize(
    ("u", "text"),
    [(0.956, "0.96"), (1.0, "1.00"), (1.0005, "1.0005"), (1.0048, "1.005"), (1.006, "1.01")],
)
def test_a_failing_utilisation_never_reads_1_00(u: float, text: str) -> None:
    """A stress 0.05 % over its limit fails: the table must not print it as 1.00 (a review)."""
    from prestress.present.common import use_text

    assert use_text(u) == text
    assert use_text(float("inf")) == ">1" and use_text(None) == "—"
