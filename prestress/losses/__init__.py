"""Prestress losses: one interface, several published methods.

The stage engine asks :func:`compute_losses` for "the loss model" of the job and gets a
:class:`LossBreakdown`: the strand stress just after transfer and the effective stress at the
final age, with each mechanism's share, its clause and the figures it was computed from.
Methods register themselves in :data:`METHODS` under the name the job file uses.
"""

from __future__ import annotations

import warnings
from collections.abc import Callable
from dataclasses import dataclass, field, replace
from typing import TYPE_CHECKING, TypeVar

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
class Milestone:
    """The strand stress at one moment of the girder's life (MPa; age in days)."""

    key: str  # "jacking", "transfer", "deck_placement", "final"
    label: str
    age: float | None
    stress: float


@dataclass(frozen=True)
class LossBreakdown:
    """The losses of a job by one method (MPa).

    Attributes:
        method: the method's name as the job file writes it.
        title: the method in words, with its source.
        jacking_stress: fpj.
        components: the mechanisms, in time order.
        f_pt: strand stress just after transfer (fpj less every loss up to transfer).
        f_pe: effective strand stress at the final age (after every loss).
        applied_transfer: strand stress whose force is applied to the analysis section at
            transfer (= f_pt on gross sections; = fpbt on transformed sections, where elastic
            shortening comes out of the analysis itself).
        applied_final: likewise at the final age (= f_pe on gross sections; fpbt less the
            time-dependent losses on transformed sections).
        basis: "gross" or "transformed": the sections the stresses are computed on.
        milestones: strand stresses at jacking, transfer, deck placement (where the method
            gives it) and final.
        figures: intermediate figures (name → (value, display role)) for reports.
        notes: remarks an engineer should read.
    """

    method: str
    title: str
    jacking_stress: float
    components: tuple[LossComponent, ...]
    f_pt: float
    f_pe: float
    applied_transfer: float
    applied_final: float
    basis: str = "gross"
    milestones: tuple[Milestone, ...] = ()
    figures: dict[str, tuple[float, str]] = field(default_factory=dict)
    notes: tuple[str, ...] = ()

    @property
    def total(self) -> float:
        """Total loss from jacking to the final age, MPa (fpj − fpe)."""
        return self.jacking_stress - self.f_pe

    def up_to(self, period: str) -> list[LossComponent]:
        """The components up to and including a period, in time order."""
        order = list(PERIODS)
        return [c for c in self.components if order.index(c.period) <= order.index(period)]


#: The periods of a girder's life that losses are grouped by, in time order.
PERIODS = (
    "before transfer",
    "at transfer",
    "transfer to deck placement",
    "deck placement to final",
    "long term",
)


LossMethod = Callable[["Girder"], LossBreakdown]

#: Loss methods by the name the job file uses.
METHODS: dict[str, LossMethod] = {}


def register(name: str) -> Callable[[LossMethod], LossMethod]:
    """Decorator registering a loss method under a job-file name."""

    def deco(fn: LossMethod) -> LossMethod:
        METHODS[name] = fn
        return fn

    return deco


#: Which module registers each method (imported only when the method is used, for start-up).
METHOD_MODULES = {
    "given": "prestress.losses.post_tensioned",
    "aashto-approximate": "prestress.losses.pretensioned",
    "aashto-refined": "prestress.losses.refined",
    "time-step-aashto": "prestress.losses.timestep_method",
    "time-step-aci209": "prestress.losses.timestep_method",
    "time-step-mc2010": "prestress.losses.timestep_method",
    "time-step-en1992": "prestress.losses.timestep_method",
}


def load_methods(name: str | None = None) -> None:
    """Import the module registering one method (or every method)."""
    import importlib

    for module in {METHOD_MODULES[name]} if name else set(METHOD_MODULES.values()):
        importlib.import_module(module)


#: Warnings meant for programmers (deprecations and the like), passed on rather than made notes.
DEVELOPER_WARNINGS: tuple[type[Warning], ...] = (
    DeprecationWarning,
    PendingDeprecationWarning,
    ImportWarning,
    ResourceWarning,
    SyntaxWarning,
    BytesWarning,
)

T = TypeVar("T")


def run_recording_warnings(method: str, fn: Callable[[], T]) -> tuple[T, tuple[str, ...]]:
    """Run a loss method's computation, turning every warning it raises into a note.

    The published models warn (``warnings.warn``) when an input lies beyond a soft limit of
    their range (a strength above the equations' range, a humidity below it, a load earlier
    than the creep model covers...). Inside a loss method none of these may reach stderr: each
    becomes a note naming the method, to be printed with the method's results (``check``,
    ``losses``, the report and the JSON all print a breakdown's notes). Identical notes are
    given once, in the order first raised. Warnings meant for programmers
    (:data:`DEVELOPER_WARNINGS`) are passed on to the caller's warning filters unchanged.

    Args:
        method: the method's name as the job file writes it (the notes start with it).
        fn: the computation, called once with no arguments.

    Returns:
        What ``fn`` returned, and the notes.
    """
    with warnings.catch_warnings(record=True) as caught:
        warnings.simplefilter("always")
        result = fn()
    notes: list[str] = []
    for w in caught:
        if issubclass(w.category, DEVELOPER_WARNINGS):
            warnings.warn_explicit(w.message, w.category, w.filename, w.lineno, source=w.source)
            continue
        text = f"{method} method: {str(w.message).strip()}"
        if text not in notes:
            notes.append(text)
    return result, tuple(notes)


def compute_losses(girder: Girder, method: str | None = None) -> LossBreakdown:
    """The losses of the girder by the named method (default: the job's choice).

    Soft-limit warnings raised while the method runs come back as notes on the breakdown
    (:func:`run_recording_warnings`), never as Python warnings.
    """
    name = method or girder.job.loss_method
    load_methods(name)
    result, notes = run_recording_warnings(name, lambda: METHODS[name](girder))
    new = tuple(n for n in notes if n not in result.notes)
    return replace(result, notes=result.notes + new) if new else result
