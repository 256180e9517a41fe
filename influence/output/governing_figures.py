"""The influence line, the train at its governing position and the sweep curve, on one page
(matplotlib imported here only)."""

from __future__ import annotations

from collections.abc import Sequence
from typing import TYPE_CHECKING

import numpy as np

from influence.analysis.lines import InfluenceLine
from influence.model.structure import Model
from influence.output.conventions import effect_unit
from influence.output.figures import PALETTE, draw_line
from vehicles.search.placement import Placement
from vehicles.search.sweep import Sweep
from vehicles.units import labels

if TYPE_CHECKING:
    from matplotlib.axes import Axes


def draw_placement(ax: Axes, line: InfluenceLine, placement: Placement, colour: str) -> None:
    """Axles as arrows scaled to their loads above the line, lane segments as a band."""
    top = max(abs(line.extremes().largest.value), abs(line.extremes().smallest.value), 1e-30)
    biggest = max(placement.axle_loads, default=1.0)
    for x, load in zip(placement.axle_positions, placement.axle_loads, strict=True):
        if line.breakpoints[0] - 1e-9 <= x <= line.breakpoints[-1] + 1e-9:
            length = 0.35 * top * load / biggest
            ax.annotate("", (x, 0.0), (x, length),
                        arrowprops={"arrowstyle": "-|>", "color": colour, "linewidth": 1.2})
    for start, end in placement.lane_segments:
        ax.axvspan(start, end, ymin=0.0, ymax=0.04, color=colour, alpha=0.5)


def draw_governing(line: InfluenceLine, placements: Sequence[Placement],
                   sweeps: Sequence[Sweep], model: Model | None = None) -> Axes:
    """Two stacked axes sharing chainage: the line with the governing trains drawn on it, and
    the effect against the lead position; returns the upper axes."""
    import matplotlib.pyplot as plt

    figure, (upper, lower) = plt.subplots(2, 1, figsize=(9.5, 7.0), sharex=True,
                                          layout="constrained")
    draw_line(line, model, ax=upper)
    for placement, colour in zip(placements, (PALETTE["section"], PALETTE["path"]),
                                 strict=False):
        draw_placement(upper, line, placement, colour)
    for s, style in zip(sweeps, ("-", "--", ":", "-."), strict=False):
        inside = (s.lead_positions >= line.breakpoints[0] - 0.5 * line.length) & (
            s.lead_positions <= line.breakpoints[-1] + 1.5 * line.length)
        lower.plot(s.lead_positions[inside], s.values[inside], style, color=PALETTE["line"],
                   linewidth=1.4, label=f"{s.case}, {s.direction}")
    for placement, colour in zip(placements, (PALETTE["section"], PALETTE["path"]),
                                 strict=False):
        lower.plot([placement.lead_position], [placement.value], "o", color=colour,
                   label=f"{placement.sense} {placement.value:.4g}: {placement.case}, "
                         f"{placement.direction}")
    names = labels(line.units)
    lower.axhline(0.0, color=PALETTE["structure"], linewidth=0.7)
    lower.set_xlabel(f"lead position / load position, chainage [{names.length}]")
    lower.set_ylabel(f"effect [{effect_unit(line.response.kind, line.units)}]")
    lower.set_title("Effect against the lead axle's position (sweep)", fontsize=10)
    lower.grid(True, color=PALETTE["grid"], linewidth=0.6)
    lower.legend(fontsize=7, frameon=False)
    upper.set_xlim(float(np.min([line.breakpoints[0], *[p.lead_position for p in placements]]))
                   - 0.05 * line.length, None)
    return upper
