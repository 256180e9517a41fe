"""The assessment pages of the calculation package: load rating and fatigue, when the model file
asks for them (``[rating]``, ``[[fatigue_detail]]``).

The content comes from the rating and fatigue layers' own tables and drawings
(:func:`influence.output.rating_tables.rating_report_tables`,
:func:`influence.output.rating_figures.draw_governing_ratings`,
:func:`influence.output.fatigue_tables.fatigue_tables`,
:func:`influence.output.fatigue_figures.fatigue_figure`); this module lays them out as sections
of the report with a short introduction, the sources and the confidence marks.
"""

from __future__ import annotations

from collections.abc import Callable
from dataclasses import dataclass
from typing import Any

from influence.fatigue.run import FatigueResults
from influence.rating.ratings import Ratings

PANELS_A_PAGE = 6
"""Governing placements drawn on one page of the rating section (two columns of three)."""


@dataclass(frozen=True)
class Assessments:
    """What the report adds beyond envelopes: a rating run, a fatigue run, and why any asked for
    is missing.

    Attributes:
        ratings: the load rating of the model file (None: the file has no ``[rating]``).
        fatigue: the fatigue run of its details under the standard's fatigue load (None: no
            ``[[fatigue_detail]]``).
        notes: sentences for the report where an assessment was asked for and could not run.
    """

    ratings: Ratings | None = None
    fatigue: FatigueResults | None = None
    notes: tuple[str, ...] = ()


def rating_section(heading: Callable[[str, int], None], text: Callable[[str, str], None],
                   table: Callable[[Any], None], figure: Callable[[str, Any, str], None],
                   number: int, ratings: Ratings, model: Any) -> None:
    """Lay out the load-rating pages: the method and its sources, the lowest factors, the
    postings, every factor with its arithmetic, the sections not rated, and the governing
    placements drawn."""
    from influence.output.rating_figures import draw_governing_ratings
    from influence.output.rating_tables import rating_report_tables

    settings = ratings.settings
    heading(f"{number} Load rating, postings and permits", 0)
    text(f"Method {settings.method}, {settings.edition}; levels {', '.join(ratings.levels)}. "
         "Rating factors are magnitudes in the sense rated; each is traced to its capacity, "
         "every factored dead load, LL+IM after distribution with the live-load factor, and the "
         "placement that governs (the arithmetic column). Factor tables: AASHTO Manual for "
         "Bridge Evaluation, by edition, as the rating layer's data files mark them (confirmed, "
         "or from memory, unconfirmed). Posting law and the phi_c phi_s >= 0.85 floor: M. A. "
         "Khan, Bridge and Highway Structure Rehabilitation and Repair, 2010, ch. 5 p. 187.",
         "intro")
    for note in ratings.notes:
        text(note, "small")
    for index, (title, rows) in enumerate(rating_report_tables(ratings), start=1):
        heading(f"{number}.{index} {title.removeprefix('Load rating: ')}", 1)
        table(rows)
    lowest = list(ratings.summary())
    for page, start in enumerate(range(0, len(lowest), PANELS_A_PAGE), start=1):
        chosen = lowest[start : start + PANELS_A_PAGE]
        figure(f"rating-governing-{page}", draw_governing_ratings(ratings, chosen, model=model),
               "The lowest rating factor of each vehicle and level: the section's influence "
               "line with the governing vehicle drawn where it stands.")


def fatigue_section(heading: Callable[[str, int], None], text: Callable[[str, str], None],
                    table: Callable[[Any], None], figure: Callable[[str, Any, str], None],
                    number: int, results: FatigueResults) -> None:
    """Lay out the fatigue pages: the traffic and the counting method, the details' lives and
    checks, the stress ranges, and each detail's crossing history with its counted cycles."""
    from influence.output.fatigue_figures import fatigue_figure
    from influence.output.fatigue_tables import fatigue_tables

    heading(f"{number} Fatigue", 0)
    text(f"Traffic: {results.traffic.description}. Cycle counting: {results.counting}. "
         "Each crossing's history is the exact effect against the lead position; its turning "
         "points come from the polynomial pieces. Resistance: AASHTO LRFD 6.6.1.2 detail "
         "categories or EN 1993-1-9 fatigue strength curves, as the model file's [fatigue] "
         "says, with their marks.", "intro")
    for note in (*results.traffic.notes, *results.notes):
        text(note, "small")
    titles = ("details, damage and life", "how the cycles were found", "checks",
              "stress ranges a year")
    for index, (title, rows) in enumerate(zip(titles, fatigue_tables(results), strict=False),
                                          start=1):
        heading(f"{number}.{index} {title}", 1)
        table(rows)
    for detail in results.details:
        figure(f"fatigue-{detail.detail.name}", fatigue_figure(results, detail.detail.name),
               f"{detail.detail.name}: one crossing's history with its counted cycles, and the "
               "stress ranges a year.")
