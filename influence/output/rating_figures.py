"""The governing placements of a rating drawn: for each vehicle and level, the influence line of
the section with the lowest factor and the vehicle where it stands there (matplotlib imported
here only). Content for the rating pages of the report.
"""

from __future__ import annotations

import math
from collections.abc import Sequence
from typing import TYPE_CHECKING, Any

from influence.model.structure import Model
from influence.output.figures import PALETTE, draw_line
from influence.output.governing_figures import draw_placement
from influence.rating.ratings import Ratings, SectionRating

if TYPE_CHECKING:
    from matplotlib.figure import Figure

PANEL_HEIGHT = 2.6
"""Height of one panel [in]."""


def _title(rating: SectionRating) -> str:
    factor = rating.rating_factor
    shown = "inf" if math.isinf(factor) else f"{factor:.3g}"
    where = rating.limit_state or rating.level
    return (f"{rating.vehicle}, {rating.level} ({where}): RF {shown} at {rating.section}, "
            f"{rating.response} {rating.sense}")


def draw_governing_ratings(ratings: Ratings, entries: Sequence[SectionRating] | None = None,
                           model: Model | None = None) -> Figure:
    """One panel a rating: the section's influence line with the governing vehicle drawn on it.

    Args:
        ratings: the rating run.
        entries: the ratings to draw (default: the lowest of each vehicle and level).
        model: the structure, to draw its supports under each line.

    Returns:
        The figure (saved by the caller).
    """
    import matplotlib.pyplot as plt

    chosen = list(ratings.summary() if entries is None else entries)
    columns = 2 if len(chosen) > 1 else 1
    rows = max(1, math.ceil(len(chosen) / columns))
    figure, axes = plt.subplots(rows, columns, figsize=(11.0, PANEL_HEIGHT * rows + 0.6),
                                layout="constrained", squeeze=False)
    flat: list[Any] = [ax for row in axes for ax in row]
    for ax, rating in zip(flat, chosen, strict=False):
        line = rating.rated.line
        draw_line(line, model, ax=ax, title=_title(rating))
        draw_placement(ax, line, rating.live.placement, PALETTE["section"])
        ax.title.set_fontsize(8)
        legend = ax.get_legend()
        if legend is not None:
            legend.remove()
    for ax in flat[len(chosen):]:
        ax.set_visible(False)
    figure.suptitle(f"{ratings.title}\ngoverning positions of the rating vehicles "
                    "(arrows: axles as placed, allowance included)", fontsize=10)
    return figure  # type: ignore[no-any-return]
