"""Fatigue drawings: the stress history of one crossing with its turning points and counted
cycles, and the stress ranges a year (matplotlib imported here only, when drawing).

The curve between turning points is drawn from the exact effect function at a few dozen points
a piece (drawing only); the turning points and every number shown are exact.
"""

from __future__ import annotations

from typing import TYPE_CHECKING, Any

import numpy as np

from influence.fatigue.counting import CycleCount, count_cycles
from influence.fatigue.crossings import Crossing
from influence.fatigue.damage import FatigueLife
from influence.fatigue.run import FatigueResults
from influence.output.figures import PALETTE, SAMPLES_PER_PIECE

if TYPE_CHECKING:
    from matplotlib.axes import Axes

HISTOGRAM_BINS = 30


def _pyplot() -> Any:
    import matplotlib

    matplotlib.use("Agg", force=False)
    import matplotlib.pyplot as plt

    return plt


def drawn_history(one: Crossing, scale: float) -> tuple[np.ndarray, np.ndarray]:
    """Points of the history for drawing, from entering to leaving, both limits at jumps."""
    function = one.effect
    start, end = function.breaks[1], function.breaks[-2]
    xs, ys = [], []
    for left, right in zip(function.breaks[:-1], function.breaks[1:], strict=True):
        if right <= start or left >= end:
            continue
        u = np.linspace(left, right, SAMPLES_PER_PIECE)
        xs.append(u)
        ys.append(np.concatenate([function.values(u[:-1]),
                                  function.values(u[-1:], side="left")]))
    return np.concatenate(xs), np.concatenate(ys) * scale


def draw_crossing(one: Crossing, scale: float, stress_unit: str, length_unit: str,
                  ax: Axes | None = None) -> Axes:
    """The stress against the lead axle's position, the turning points marked.

    Args:
        one: the crossing.
        scale: stress per unit effect [stress unit per effect unit].
        stress_unit, length_unit: for the axis labels.
        ax: axes to draw on (new ones when None).
    """
    if ax is None:
        ax = _pyplot().subplots(figsize=(9.0, 3.5), layout="constrained")[1]
    assert ax is not None
    x, y = drawn_history(one, scale)
    ax.plot(x, y, color=PALETTE["line"], linewidth=1.4)
    ax.plot(one.positions, one.values * scale, "o", color=PALETTE["section"], markersize=4,
            label="turning points (exact)")
    ax.axhline(0.0, color=PALETTE["grid"], linewidth=0.8)
    ax.set_xlabel(f"lead axle position [{length_unit}]")
    ax.set_ylabel(f"stress [{stress_unit}]")
    ax.set_title(f"History of one crossing: {one.train.name}, {one.direction}", loc="left",
                 fontsize=10)
    ax.legend(loc="best", fontsize=8, frameon=False)
    return ax


def draw_cycles(counted: CycleCount, stress_unit: str, ax: Axes | None = None) -> Axes:
    """The counted cycles of one crossing: a bar a cycle, its range, full or half."""
    if ax is None:
        ax = _pyplot().subplots(figsize=(4.5, 3.5), layout="constrained")[1]
    assert ax is not None
    cycles = sorted(counted.cycles, key=lambda c: -c.range)
    colours = [PALETTE["positive"] if c.count == 1.0 else PALETTE["negative"] for c in cycles]
    ax.bar(np.arange(len(cycles)), [c.range for c in cycles], color=colours)
    ax.set_xticks(np.arange(len(cycles)), ["full" if c.count == 1.0 else "half"
                                           for c in cycles], fontsize=7)
    ax.set_ylabel(f"range [{stress_unit}]")
    ax.set_title(f"Counted cycles: {counted.total:g} a crossing", loc="left", fontsize=10)
    return ax


def draw_ranges(life: FatigueLife, ax: Axes | None = None) -> Axes:
    """Cycles a year against stress range (a histogram weighted by cycles), with the largest
    range still giving infinite life marked."""
    if ax is None:
        ax = _pyplot().subplots(figsize=(4.5, 3.5), layout="constrained")[1]
    assert ax is not None
    if life.ranges.size:
        top = max(float(life.ranges.max()), life.limit_range)
        ax.hist(life.ranges, bins=np.linspace(0.0, top * 1.02, HISTOGRAM_BINS + 1).tolist(),
                weights=life.cycles_per_year, color=PALETTE["negative"])
    ax.axvline(life.limit_range, color=PALETTE["section"], linewidth=1.2,
               label=f"infinite-life limit {life.limit_range:.3g} {life.stress_unit}")
    ax.set_xlabel(f"stress range [{life.stress_unit}]")
    ax.set_ylabel("cycles a year")
    ax.set_title("Stress ranges a year", loc="left", fontsize=10)
    ax.legend(loc="best", fontsize=8, frameon=False)
    return ax


def fatigue_figure(results: FatigueResults, detail: str | None = None,
                   vehicle: int | None = None) -> Axes:
    """One page for a detail: the history of one crossing (the vehicle with the largest range
    there unless ``vehicle`` is given), its counted cycles, and the ranges of the whole
    traffic; returns the history's axes."""
    result = results.detail(detail)
    one = results.crossing(result.detail.name, vehicle)
    scale = result.detail.stress_per_effect
    plt = _pyplot()
    figure = plt.figure(figsize=(11.0, 7.0), layout="constrained")
    grid = figure.add_gridspec(2, 2)
    history = figure.add_subplot(grid[0, :])
    length = "ft" if results.units == "kip-ft" else "m"
    draw_crossing(one, scale, results.stress_unit, length, history)
    draw_cycles(count_cycles(one.values * scale), results.stress_unit,
                figure.add_subplot(grid[1, 0]))
    draw_ranges(result.life, figure.add_subplot(grid[1, 1]))
    figure.suptitle(f"{results.title}: fatigue detail {result.detail.name} "
                    f"({result.detail.response} at {result.detail.location}, category "
                    f"{result.detail.category})", fontsize=11)
    return history


def fatigue_figures(results: FatigueResults) -> list[Axes]:
    """The fatigue pages' figures: one a detail (see :func:`fatigue_figure`)."""
    return [fatigue_figure(results, r.detail.name) for r in results.details]
