"""Drawings of load trains: axles as downward arrows to scale with their loads, gaps dimensioned,
uniform loads as hatched blocks. The only module of ``vehicles`` that imports matplotlib (lazily).

The train is drawn front on the left, at the arrangement given by ``choices`` (each range at its
minimum by default); a ranged gap is labelled with its range. Arrow lengths are proportional to
axle load and block heights to intensity, each on its own scale.

Example:
    >>> from vehicles.train import Axle, Patch, Train
    >>> e = Train("loco", (Axle(250.0), Axle(250.0, 1.6), Patch(80.0, None, 0.8)))
    >>> ax = plot_train(e, units="kN-m")
    >>> ax.get_title(loc="left")
    'loco'
"""

from __future__ import annotations

import math
from collections.abc import Sequence
from pathlib import Path
from typing import Any

from vehicles.loadmodel import LoadCase, LoadModel
from vehicles.output.figure_files import drawing, new_figure, save_figure
from vehicles.output.tabular import significant
from vehicles.train import Patch, Train
from vehicles.units import labels

_AXLE = "#1f5f8b"
_BLOCK = "#c9822b"
_DIMENSION = "#6b6b6b"
_ARROW_HEIGHT = 1.0
_BLOCK_HEIGHT = 0.35


def _new_axes() -> Any:
    return new_figure(9.0, 2.6).add_subplot()


def _num(value: float) -> str:
    return significant(value)


def _gap_label(train: Train, index: int, used: float, unit: str) -> str:
    gap = train.items[index].gap
    if isinstance(gap, tuple):
        return f"{_num(gap[0])} to {_num(gap[1])} {unit}\n(drawn {_num(used)})"
    return f"{_num(used)} {unit}"


@drawing
def plot_train(train: Train, *, units: str = "kN-m", choices: Sequence[float] | None = None,
               ax: Any = None) -> Any:
    """Draw one train.

    Args:
        train: the load train.
        units: its unit system, for the labels ("kN-m" or "kip-ft").
        choices: one value per ranged gap or length [length]; default each minimum.
        ax: matplotlib axes to draw on; a new figure's axes when None.

    Returns:
        The axes drawn on.
    """
    from matplotlib.patches import Rectangle

    unit = labels(units)
    a = train.arranged(choices)
    ax = ax if ax is not None else _new_axes()
    finite = [*a.axle_offsets, *(v for v in (*a.patch_starts, *a.patch_ends) if math.isfinite(v))]
    front, rear = min(finite), max(finite)
    margin = max(0.15 * (rear - front), 1.0)
    left, right = front - margin, rear + margin
    top_load = max(max(a.axle_loads, default=1.0), 1e-300)
    top_intensity = max(max(a.patch_intensities, default=1.0), 1e-300)
    for start, end, q in zip(a.patch_starts, a.patch_ends, a.patch_intensities, strict=True):
        x0, x1 = max(start, left), min(end, right)
        height = _BLOCK_HEIGHT * q / top_intensity
        ax.add_patch(Rectangle((x0, 0.0), x1 - x0, height, facecolor=_BLOCK, alpha=0.35,
                               edgecolor=_BLOCK, hatch="////", linewidth=1.0))
        text = f"{_num(q)} {unit.force_per_length}"
        if math.isfinite(start) and math.isfinite(end):
            text += f" over {_num(end - start)} {unit.length}"
        else:
            text += "\nunlimited"
        ax.text((x0 + x1) / 2, height + 0.04, text, ha="center", va="bottom", color=_BLOCK,
                fontsize=8)
    for offset, load in zip(a.axle_offsets, a.axle_loads, strict=True):
        length = _ARROW_HEIGHT * load / top_load
        ax.annotate("", xy=(offset, 0.0), xytext=(offset, length),
                    arrowprops={"arrowstyle": "-|>", "color": _AXLE, "linewidth": 1.8})
        ax.text(offset, length + 0.04, f"{_num(load)} {unit.force}", ha="center", va="bottom",
                color=_AXLE, fontsize=8, rotation=90 if len(a.axle_loads) > 8 else 0)
    _dimension_gaps(ax, train, a, unit.length)
    ax.axhline(0.0, color="black", linewidth=0.8)
    ax.set_xlim(left, right)
    ax.set_ylim(-0.7, _ARROW_HEIGHT + 0.45)
    ax.set_yticks([])
    ax.set_xlabel(f"distance behind the front [{unit.length}]  (travel to the left)")
    for side in ("top", "right", "left"):
        ax.spines[side].set_visible(False)
    ax.set_title(train.name, loc="left", fontsize=10)
    return ax


def _dimension_gaps(ax: Any, train: Train, arrangement: Any, unit: str) -> None:
    """Dimension every finite gap between consecutive items, below the axis."""
    extents, axle, patch = [], 0, 0
    for item in train.items:
        if isinstance(item, Patch):
            extents.append((arrangement.patch_starts[patch], arrangement.patch_ends[patch]))
            patch += 1
        else:
            offset = arrangement.axle_offsets[axle]
            extents.append((offset, offset))
            axle += 1
    for index in range(1, len(extents)):
        x0, x1 = extents[index - 1][1], extents[index][0]
        if not (math.isfinite(x0) and math.isfinite(x1)) or x1 <= x0:
            continue
        ax.annotate("", xy=(x0, -0.18), xytext=(x1, -0.18),
                    arrowprops={"arrowstyle": "<->", "color": _DIMENSION, "linewidth": 0.8})
        ax.text((x0 + x1) / 2, -0.22, _gap_label(train, index, x1 - x0, unit),
                ha="center", va="top", color=_DIMENSION, fontsize=7)


def _lane_text(case: LoadCase, units: str) -> str:
    unit = labels(units)
    parts = []
    if case.lane:
        parts.append(f"lane {_num(case.lane)} {unit.force_per_length} on adverse parts")
    if case.knife_edge_moment:
        parts.append(f"knife-edge {_num(case.knife_edge_moment)} {unit.force} (moment)")
    if case.knife_edge_shear:
        parts.append(f"knife-edge {_num(case.knife_edge_shear)} {unit.force} (shear)")
    return "; ".join(parts)


@drawing
def plot_model(model: LoadModel, path: str | Path | None = None,
               size: tuple[float, float] | None = None) -> tuple[Any, ...]:
    """Draw every case of a model, one row a case, and save the figure when a path is given.

    The file is written under a temporary name and renamed, so it appears whole or not at all.

    Args:
        model: the load model.
        path: image file to write (.png, .svg, .pdf); None to only draw.
        size: width and height of the figure [in]; default 9 wide, 2.6 a case.

    Returns:
        The axes, one per case.
    """
    figure = new_figure(*(size or (9.0, 2.6 * len(model.cases))))
    axes = figure.subplots(len(model.cases), 1, squeeze=False)[:, 0]
    for ax, case in zip(axes, model.cases, strict=True):
        lane = _lane_text(case, model.units)
        if case.train is None:
            ax.axis("off")
            ax.text(0.5, 0.5, lane, ha="center", va="center", transform=ax.transAxes)
        else:
            plot_train(case.train, units=model.units, ax=ax)
            if lane:
                ax.text(1.0, 1.0, lane, ha="right", va="bottom", transform=ax.transAxes,
                        fontsize=8)
        ax.set_title(f"{model.name}: {case.name}", loc="left", fontsize=10)
    if path is not None:
        save_figure(figure, path)
    return tuple(axes)
