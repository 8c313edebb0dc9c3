"""Prestress losses: one interface, several published methods.

The stage engine asks :func:`compute_losses` for "the loss model" of the job and gets a
:class:`LossBreakdown`: the strand stress just after transfer and the effective stress at the
final age, with each mechanism's share, its clause and the figures it was computed from.
Methods register themselves in :data:`METHODS` under the name the job file uses.
"""

from __future__ import annotations

from collections.abc import Callable
from dataclasses import dataclass, field
from typing import TYPE_CHECKING

if TYPE_CHECKING:
    from prestress.analysis import Girder


@dataclass(frozen=True)
class LossComponent:
    """One loss mechanism (stress in MPa, positive = loss).

    Attributes:
        key: machine name, e.g. "elastic_shortening".
        label: what an engineer calls it.
        value: the loss, MPa (a gain is negative).
        period: "before transfer", "at transfer" or "long term".
        clause: the equation and clause it comes from.
        applied: whether it reduces the force used in the stress checks (on transformed
            sections elastic shortening is reported but not applied, for instance).
    """

    key: str
    label: str
    value: float
    period: str
    clause: str
    applied: bool = True

    @property
    def short_clause(self) -> str:
        """The clause without the document's edition (for narrow tables)."""
        return self.clause.replace(" 9th Ed. (2020)", "").replace("AASHTO LRFD", "AASHTO")


@dataclass(frozen=True)
class LossBreakdown:
    """The losses of a job by one method (MPa).

    Attributes:
        method: the method's name as the job file writes it.
        title: the method in words, with its source.
        jacking_stress: fpj.
        components: the mechanisms, in time order.
        f_pt: strand stress just after transfer (fpj less the applied losses up to transfer).
        f_pe: effective strand stress at the final age (after all applied losses).
        figures: intermediate figures (name → (value, unit text)) for reports.
        notes: remarks an engineer should read.
    """

    method: str
    title: str
    jacking_stress: float
    components: tuple[LossComponent, ...]
    f_pt: float
    f_pe: float
    figures: dict[str, tuple[float, str]] = field(default_factory=dict)
    notes: tuple[str, ...] = ()

    @property
    def total(self) -> float:
        """Total applied loss, MPa."""
        return sum(c.value for c in self.components if c.applied)


LossMethod = Callable[["Girder"], LossBreakdown]

#: Loss methods by the name the job file uses.
METHODS: dict[str, LossMethod] = {}


def register(name: str) -> Callable[[LossMethod], LossMethod]:
    """Decorator registering a loss method under a job-file name."""

    def deco(fn: LossMethod) -> LossMethod:
        METHODS[name] = fn
        return fn

    return deco


def compute_losses(girder: Girder, method: str | None = None) -> LossBreakdown:
    """The losses of the girder by the named method (default: the job's choice)."""
    from prestress.losses import pretensioned  # noqa: F401  (registers the methods)

    name = method or girder.job.loss_method
    return METHODS[name](girder)
