"""`prestress losses --at`: the time-step analysis's strand and fiber stresses at given ages.

Checks (consistency with the method's own breakdown, and statics):
* at transfer the loss is the elastic shortening of the breakdown;
* at the final age the loss is the breakdown's total minus the elastic gain it reports but
  leaves out of its total (the history includes it: the strand stress is the real one);
* the deck top appears only once the deck is cast;
* just after deck placement the girder-bottom stress rises by about M_deck yb / I on the
  girder alone (statics; creep over one day and the prestress change make the rest);
* bad input: an age outside the analysis, a method that is not a time-step one.
"""

from __future__ import annotations

import json

import pytest

from prestress.analysis import losses_file
from prestress.cli import main
from prestress.errors import InputError
from prestress.losses.timestep_method import history
from tests.conftest import ROOT

HARPED = ROOT / "examples" / "harl-brook-span1-g2-harped.toml"


@pytest.fixture(scope="module")
def case():
    girder, b = losses_file(HARPED, method="time-step-aashto")
    rows = history(girder, "aashto", (1.0, 119.999, 120.0, 20000.0))
    return girder, b, rows


def test_ends_agree_with_the_breakdown(case) -> None:
    _, b, rows = case
    comps = {c.key: c.value for c in b.components}
    assert rows[0].loss == pytest.approx(comps["elastic_shortening"], rel=1e-9)
    gain = sum(c.value for c in b.components if c.key.startswith("elastic_gain"))
    assert gain < 0
    # the extra output ages refine the time grid a little: agreement to 1e-4 (step size)
    assert rows[-1].loss == pytest.approx(b.total + gain, rel=1e-4)


def test_deck_top_only_after_casting(case) -> None:
    _, _, rows = case
    assert "deck_top" not in rows[0].fibers and "deck_top" not in rows[1].fibers
    assert "deck_top" in rows[-1].fibers


def test_deck_load_on_the_girder_alone(case) -> None:
    from prestress.losses.refined import midspan_noncomposite_moment

    girder, _, rows = case
    g = girder.gross
    before, after = rows[1], rows[2]  # just before and just after the deck (120 d)
    # the girder also moves from its ends to its bearings at deck placement: M changes by
    # M_deck + w (L²/8 − L a/2 − L²/8)
    job = girder.job
    w, L, a = girder.self_weight, job.length, job.bearing_offset
    dM = midspan_noncomposite_moment(girder) - w * L * a / 2.0
    # on the girder transformed with its strands, n = Ep / Ec (the time-step section is the
    # concrete plus the bonded strands; Ec at 28 days stands for the modulus at 120 days)
    n = job.strand.Ep / job.girder_concrete.Ec
    A_s, y_s = job.A_ps, job.y_ps
    A_t = g.area + n * A_s
    yb_t = (g.area * g.yb + n * A_s * y_s) / A_t
    I_t = g.Ix + g.area * (g.yb - yb_t) ** 2 + n * A_s * (yb_t - y_s) ** 2
    expected = dM * yb_t / I_t  # tension at the bottom (MPa), statics
    got = after.fibers["girder_bottom"] - before.fibers["girder_bottom"]
    assert got == pytest.approx(expected, rel=0.03)  # modulus at 120 d vs 28 d, creep of 1 day


def test_cli_table_and_json(capsys) -> None:
    args = ["losses", str(HARPED), "--method", "time-step-aashto", "--at", "28 d, 1 year"]
    assert main(args) == 0
    out = capsys.readouterr().out
    assert "Time-step history at midlength" in out and "girder bottom" in out
    assert main([*args, "--json"]) == 0
    data = json.loads(capsys.readouterr().out)
    assert [h["age"]["value"] for h in data["history"]] == pytest.approx([28.0, 365.25])


def test_bad_input() -> None:
    girder, _ = losses_file(HARPED, method="time-step-aashto")
    with pytest.raises(InputError) as info:
        history(girder, "aashto", (0.5,))
    assert info.value.field == "--at"
    assert main(["losses", str(HARPED), "--at", "28 d"]) == 2  # the job's method is refined


def test_losses_plot_draws_the_time_step_path(tmp_path) -> None:
    """The plot of a time-step method draws the path the analysis computes between its
    milestones (a review found only dotted lines, with values that differed from --at)."""
    from prestress.analysis import check_file
    from prestress.present import plots
    from tests.conftest import write_job

    text = HARPED.read_text(encoding="utf-8").replace(
        'method = "aashto-refined"', 'method = "time-step-aashto"'
    )
    result = check_file(write_job(tmp_path, text))
    curve, legend = plots._time_step_curve(result)
    ages = [a for a, _ in curve]
    assert ages == sorted(ages) and ages[0] == pytest.approx(1.0) and ages[-1] == 20000.0
    final = history(result.girder, "aashto", (20000.0,))[0]
    # the ages asked for are steps of the analysis too, so another set moves the final
    # value by round-off of the stepping only (0.01 % here)
    assert curve[-1][1] == pytest.approx(final.strand_stress, rel=1e-3)
    assert "elastic gains" in legend
    svg = plots.plot_losses(result, tmp_path / "losses.svg", "US").read_text(encoding="utf-8")
    assert "time-step path" in svg and "the path the analysis computes" in svg
