"""Rating outputs: every table opens with units, conventions and the caution; the figure of the
governing placements has one panel a vehicle and level."""

from __future__ import annotations

import math
from pathlib import Path

import pytest

from influence.output.rating_tables import (
    not_rated_table,
    permit_table,
    postings_table,
    rating_report_tables,
    ratings_table,
    summary_table,
)
from influence.output.tables import render_table
from influence.rating.permit_check import check_permit
from influence.rating.run import rate, rating_inputs

EXAMPLES = Path(__file__).resolve().parent.parent / "examples"


@pytest.fixture(scope="module")
def bridge():
    return rating_inputs(EXAMPLES / "pellow-brook-bridge.toml")


@pytest.fixture(scope="module")
def ratings(bridge):
    return rate(bridge, ("HL-93", "EV2", "EV3", "Type 3-3"), ("inventory", "legal"))


def test_tables_open_with_the_conventions(ratings, bridge):
    check = check_permit(bridge, EXAMPLES / "vehicles" / "crane-carrier-5-axle.toml")
    for table in (summary_table(ratings), ratings_table(ratings), postings_table(ratings),
                  not_rated_table(ratings), permit_table(check)):
        text = render_table(table)
        assert "Units: force kip, length ft, moment kip-ft." in text
        assert "Sign conventions:" in text
        assert "qualified engineer" in text
        assert table.rows


def test_emergency_limits_in_the_postings(ratings):
    ev = ratings.postings.emergency
    assert ev is not None and ev.posted
    ev2 = ratings.lowest("EV2", "legal").rating_factor
    ev3 = ratings.lowest("EV3", "legal").rating_factor
    # limits RF x axle group [kip], rounded down to the file's 1-ton (2-kip) sign increment
    assert ev.single_axle_kip == pytest.approx(2.0 * math.floor(ev2 * 33.5 / 2.0))
    assert ev.tandem_kip == pytest.approx(2.0 * math.floor(ev3 * 62.0 / 2.0))
    assert "tandem" in render_table(postings_table(ratings))


def test_figure_of_the_governing_placements(ratings):
    from influence.output.rating_figures import draw_governing_ratings

    figure = draw_governing_ratings(ratings)
    visible = [ax for ax in figure.axes if ax.get_visible()]
    assert len(visible) == len(ratings.summary())
    assert all(ax.get_title() for ax in visible)
    import matplotlib.pyplot as plt

    plt.close(figure)


def test_report_pages_in_order(ratings):
    titles = [title for title, _ in rating_report_tables(ratings)]
    assert titles[:2] == ["Load rating: lowest factor per vehicle and level",
                          "Load rating: postings"]
