"""The influence line with the governing trains on it, the structure strip under it, and the
sweep curves (effect against the lead axle's position), on one page (matplotlib imported only
when drawing).

Every sweep gets its own colour and line style, however many cases and directions there are;
the axles are arrows labelled with their loads; lane loads are bands named in the legend.
"""

from __future__ import annotations

from collections.abc import Sequence
from itertools import cycle
from typing import TYPE_CHECKING, Any

import numpy as np

from influence.analysis.lines import InfluenceLine
from influence.model.structure import Model
from influence.output.conventions import effect_unit
from influence.output.figures import PALETTE, draw_line, draw_strip
from vehicles.output.figure_files import drawing, new_figure
from vehicles.output.tabular import significant
from vehicles.search.placement import Placement
from vehicles.search.sweep import Sweep
from vehicles.units import labels

if TYPE_CHECKING:
    from matplotlib.axes import Axes

SWEEP_COLOURS = ("#1f4e5f", "#b3432b", "#2e8b57", "#7b4fa0", "#c07a12", "#1f77b4")
SWEEP_STYLES = ("-", "--", ":", "-.")
PLACEMENT_COLOURS = (PALETTE["section"], PALETTE["path"], "#7b4fa0", "#c07a12")
ARROW_SHARE = 0.35
"""Longest axle arrow as a share [-] of the line's largest absolute ordinate."""


def sweep_styles(count: int) -> list[tuple[str, str]]:
    """(colour, line style) for ``count`` curves, every pair distinct."""
    pairs = [(c, s) for s in SWEEP_STYLES for c in SWEEP_COLOURS]
    return [pairs[i % len(pairs)] for i in range(count)]


def draw_placement(ax: Axes, line: InfluenceLine, placement: Placement, colour: str) -> float:
    """Axles as arrows scaled to their loads above the axis, each labelled with its load, and the
    lane load as a band named in the legend; returns the height [ordinate units] the arrows and
    their labels reach."""
    extremes = line.extremes()
    top = max(abs(extremes.largest.value), abs(extremes.smallest.value))
    top = top if top > 0 else 1.0
    biggest = max((abs(p) for p in placement.axle_loads), default=0.0)
    biggest = biggest if biggest > 0 else 1.0
    start, end = float(line.breakpoints[0]), float(line.breakpoints[-1])
    tolerance = 1e-9 * max(line.length, 1.0)
    names = labels(line.units)
    reach = 0.0
    for x, load in zip(placement.axle_positions, placement.axle_loads, strict=True):
        if not start - tolerance <= x <= end + tolerance or load == 0:
            continue
        length = ARROW_SHARE * top * load / biggest
        reach = max(reach, length)
        ax.annotate("", (x, 0.0), (x, length),
                    arrowprops={"arrowstyle": "-|>", "color": colour, "linewidth": 1.2})
        ax.annotate(significant(load), (x, length), xytext=(0, 2), textcoords="offset points",
                    ha="center", va="bottom", fontsize=6, color=colour, rotation=90)
    if placement.lane_segments:
        label = (f"lane {significant(placement.lane_intensity)} {names.force_per_length} "
                 f"({placement.case}, {placement.sense})")
        for index, (a, b) in enumerate(placement.lane_segments):
            ax.axvspan(a, b, ymin=0.0, ymax=0.05, color=colour, alpha=0.45,
                       label=label if index == 0 else None)
    return reach


def make_room(ax: Axes, reach: float) -> None:
    """Room above the arrows for their load labels (inside the axes, clear of the title), and
    below the line for the lane bands."""
    low, high = ax.get_ylim()
    high = max(high, 1.15 * reach)
    low = low - 0.2 * (high - low)
    ax.set_ylim(low, high)
    figure: Any = ax.get_figure()
    for _ in range(3):  # the labels' height is known in points only once laid out
        figure.draw_without_rendering()
        renderer = figure._get_renderer()
        top = ax.get_window_extent(renderer).y1
        height = max(ax.get_window_extent(renderer).height, 1.0)
        over = max((t.get_window_extent(renderer).y1 - top for t in ax.texts), default=0.0)
        if over <= 0:
            return
        high += 1.15 * over / height * (high - low)
        ax.set_ylim(low, high)


@drawing
def draw_governing(line: InfluenceLine, placements: Sequence[Placement],
                   sweeps: Sequence[Sweep], model: Model | None = None) -> Axes:
    """The line with the governing trains drawn on it, the structure strip under it, and the
    effect against the lead position; returns the line's axes."""
    figure = new_figure(9.5, 7.6)
    ratios = [1.0, 0.2, 1.0] if model is not None else [1.0, 1.0]
    grid = figure.add_gridspec(len(ratios), 1, height_ratios=ratios)
    upper = figure.add_subplot(grid[0])
    strip = figure.add_subplot(grid[1], sharex=upper) if model is not None else None
    lower = figure.add_subplot(grid[-1])
    draw_line(line, None, ax=upper)
    reach = 0.0
    for placement, colour in zip(placements, cycle(PLACEMENT_COLOURS)):
        reach = max(reach, draw_placement(upper, line, placement, colour))
    make_room(upper, reach)
    upper.legend(loc="upper left", bbox_to_anchor=(1.01, 1.0), fontsize=7, frameon=False)
    if strip is not None and model is not None:
        draw_strip(strip, model)
        upper.tick_params(labelbottom=False)
        upper.set_xlabel("")
        strip.set_xlabel(f"load position, chainage [{labels(line.units).length}]")
    _draw_sweeps(lower, line, placements, sweeps)
    return upper


def _draw_sweeps(lower: Any, line: InfluenceLine, placements: Sequence[Placement],
                 sweeps: Sequence[Sweep]) -> None:
    for s, (colour, style) in zip(sweeps, sweep_styles(len(sweeps)), strict=True):
        inside = (s.lead_positions >= line.breakpoints[0] - 0.5 * line.length) & (
            s.lead_positions <= line.breakpoints[-1] + 1.5 * line.length)
        lower.plot(s.lead_positions[inside], s.values[inside], linestyle=style, color=colour,
                   linewidth=1.3, label=f"{s.case}, {s.direction} (lane for {s.sense})")
    for placement, colour in zip(placements, cycle(PLACEMENT_COLOURS)):
        lower.plot([placement.lead_position], [placement.value], "o", color=colour,
                   label=f"{placement.sense} {significant(placement.value)}: {placement.case}, "
                         f"{placement.direction}")
    names = labels(line.units)
    lower.axhline(0.0, color=PALETTE["structure"], linewidth=0.7)
    lower.set_xlabel(f"lead axle position, chainage [{names.length}]")
    lower.set_ylabel(f"effect [{effect_unit(line.response.kind, line.units)}]")
    lower.set_title("Effect against the lead axle's position (sweep)", fontsize=10)
    lower.grid(True, color=PALETTE["grid"], linewidth=0.6)
    lower.legend(fontsize=7, frameon=False, loc="upper left", bbox_to_anchor=(1.01, 1.0))
    leads = [p.lead_position for p in placements]
    lower.set_xlim(float(np.min([line.breakpoints[0], *leads])) - 0.05 * line.length,
                   float(np.max([line.breakpoints[-1], *leads])) + 0.05 * line.length)
