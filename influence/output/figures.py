"""Drawings: influence lines with signed areas over a strip showing the structure, and the
structure with its path, drawn to true shape.

Matplotlib is imported only when a figure is made, never on the solver's path. Functions take
result objects and an optional ``ax``, return the axes, and save nothing: the one figure saver is
:func:`vehicles.output.figure_files.save_figure`. Every drawing function draws under
:func:`vehicles.output.figure_files.plain_text`, so user text never turns into mathtext.
"""

from __future__ import annotations

from pathlib import Path
from typing import TYPE_CHECKING, Any

import numpy as np

from influence.analysis.lines import InfluenceLine
from influence.model.path import PathGeometry, trace
from influence.model.structure import Member, Model, Node
from influence.output.conventions import ordinate_unit
from influence.output.symbols import Label, draw_hinge, draw_support, place_labels
from vehicles.output.figure_files import drawing, new_figure, save_figure
from vehicles.output.tabular import ROUND_OFF, significant
from vehicles.units import labels

if TYPE_CHECKING:
    from matplotlib.axes import Axes

PALETTE = {
    "line": "#1f4e5f",  # deep teal
    "positive": "#e3b23c",  # ochre
    "negative": "#6c8ebf",  # slate blue
    "section": "#b3432b",  # brick
    "structure": "#3a3a3a",
    "path": "#2e8b57",
    "bar": "#8a7f70",
    "grid": "#d9d4cc",
}
SAMPLES_PER_PIECE = 48
"""Points drawn per polynomial piece: drawing only; every number reported is exact."""
STRIP_RATIO = 0.3
"""Height of the structure strip under an influence line, as a fraction of the line's axes."""


def new_axes(width: float = 9.0, height: float = 4.0) -> Axes:
    """Axes on a new figure of ``width`` x ``height`` [in]."""
    return new_figure(width, height).add_subplot()


def save(ax: Axes, path: str | Path) -> None:
    """Save the axes' figure by extension (PNG, SVG or PDF), whole, in a checked place."""
    save_figure(ax.get_figure(), path)


def dense_points(line: InfluenceLine) -> tuple[np.ndarray, np.ndarray]:
    """Points for drawing, with both limits at jumps so vertical steps are drawn."""
    xs, ys = [], []
    for start, end, row in zip(line.breakpoints, line.breakpoints[1:], line.coefficients,
                               strict=False):
        t = np.linspace(0.0, end - start, SAMPLES_PER_PIECE)
        xs.append(start + t)
        ys.append(np.polynomial.polynomial.polyval(t, row))
    return np.concatenate(xs), np.concatenate(ys)


def line_axes(figure: Any, strip: bool = True, rows: int = 1) -> list[tuple[Axes, Axes | None]]:
    """``rows`` pairs of (line axes, structure strip under it sharing its chainage axis)."""
    if not strip:
        return [(ax, None) for ax in figure.subplots(rows, 1, squeeze=False)[:, 0]]
    ratios = [1.0, STRIP_RATIO] * rows
    grid = figure.add_gridspec(2 * rows, 1, height_ratios=ratios)
    pairs = []
    for row in range(rows):
        ax = figure.add_subplot(grid[2 * row])
        pairs.append((ax, figure.add_subplot(grid[2 * row + 1], sharex=ax)))
    return pairs


@drawing
def draw_line(line: InfluenceLine, model: Model | None = None, ax: Axes | None = None,
              title: str = "", strip: Axes | None = None) -> Axes:
    """Draw an influence line, its signed areas shaded and the section marked; with a model,
    the structure (supports, hinges, names) is drawn in ``strip`` under the line (a new figure
    gets one)."""
    if ax is None:
        ax, strip = line_axes(new_figure(9.0, 4.6), model is not None)[0]
    x, y = dense_points(line)
    x = np.concatenate([[x[0]], x, [x[-1]]])
    y = np.concatenate([[0.0], y, [0.0]])
    ax.fill_between(x, y, 0, where=y >= 0, interpolate=True, color=PALETTE["positive"],
                    alpha=0.55, linewidth=0, label="positive area")
    ax.fill_between(x, y, 0, where=y <= 0, interpolate=True, color=PALETTE["negative"],
                    alpha=0.55, linewidth=0, label="negative area")
    ax.plot(x, y, color=PALETTE["line"], linewidth=1.8)
    ax.axhline(0.0, color=PALETTE["structure"], linewidth=0.9)
    extremes = line.extremes()
    size = max(abs(extremes.largest.value), abs(extremes.smallest.value))
    for extreme, below in ((extremes.largest, False), (extremes.smallest, True)):
        if abs(extreme.value) > ROUND_OFF * size:  # round-off is no extreme worth a label
            ax.plot([extreme.at], [extreme.value], "o", color=PALETTE["line"], markersize=4)
            ax.annotate(significant(extreme.value), (extreme.at, extreme.value), fontsize=8,
                        xytext=(4, -10 if below else 4), textcoords="offset points")
    if line.section_chainage is not None:
        ax.axvline(line.section_chainage, color=PALETTE["section"], linestyle="--",
                   linewidth=1.0, label="section")
    names = labels(line.units)
    unit = ordinate_unit(line.response.kind, line.units, line.response.component)
    ax.set_ylabel(f"{line.response.kind} [{unit}]")
    ax.set_title(title or f"Influence line: {line.response.label}", fontsize=10)
    ax.grid(True, color=PALETTE["grid"], linewidth=0.6)
    ax.legend(loc="best", fontsize=8, frameon=False)
    ax.set_xlim(float(line.breakpoints[0]), float(line.breakpoints[-1]))
    low, high = ax.get_ylim()
    ax.set_ylim(low - 0.06 * (high - low), high + 0.1 * (high - low))  # labels clear of title
    xlabel = f"load position, chainage [{names.length}]"
    if model is not None and strip is not None:
        draw_strip(strip, model)
        ax.tick_params(labelbottom=False)
        strip.set_xlabel(xlabel)
    else:
        ax.set_xlabel(xlabel)
    return ax


def hinge_nodes(model: Model) -> set[str]:
    """Nodes with a member end released in bending: the hinges of a beam form, the pins of
    frames and trusses."""
    found = set(model.hinge_nodes)
    for member in model.members:
        if member.release_start:
            found.add(member.start)
        if member.release_end:
            found.add(member.end)
    return found


DEPTH_POINTS = 81
"""Points along a member at which its depth outline is drawn (a drawing, not a result)."""

STRIP_DEPTH = 0.3
"""Depth drawn in the strip [strip units, of 2] where a member of varying section has its
reference depth: a haunch twice as deep is drawn 0.6 deep, under the path line."""


def _relative_depth(member: Member, length: float, along: np.ndarray) -> np.ndarray:
    """Depth of a member of varying section over its reference depth [-] at distances
    ``along`` it from its start node [length]."""
    from influence.analysis.haunch import section_of

    assert member.variation is not None
    return section_of(member.variation, length, member.EI, member.EA).profile.values(along)


def _strip_depths(strip: Axes, model: Model, path: PathGeometry, colour: str) -> None:
    """The depth profiles of the path's haunched or tapered members, hanging under the line."""
    for leg in path.legs:
        member = model.member(leg.member)
        if not member.varies:
            continue
        chainage = np.linspace(leg.start_chainage, leg.end_chainage, DEPTH_POINTS)
        along = np.array([leg.member_position(float(c)) for c in chainage])
        depth = STRIP_DEPTH * _relative_depth(member, leg.length, along)
        strip.fill_between(chainage, 0.0, -depth, color=colour, alpha=0.25, linewidth=0,
                           zorder=1)


@drawing
def draw_strip(strip: Axes, model: Model) -> Axes:
    """The structure along the path, drawn flat under an influence line: the path, its
    supports and hinges at their chainages, the support names below, and the depth of members
    of varying section."""
    path = trace(model)
    colour = PALETTE["structure"]
    strip.plot([0.0, path.total_length], [0.0, 0.0], color=colour, linewidth=2.2,
               solid_capstyle="butt")
    _strip_depths(strip, model, path, colour)
    hinges = hinge_nodes(model)
    first, last = path.legs[0].entry_node, path.legs[-1].exit_node
    for node in model.nodes:
        chainage = path.node_chainage(node.name)
        if chainage is None:
            continue
        if node.support.is_support:
            side = "left" if node.name == first else "right" if node.name == last else "below"
            draw_support(strip, chainage, 0.0, node.support, side, colour)
            strip.annotate(node.name, (chainage, 0.0), xytext=(0, 4),
                           textcoords="offset points", ha="center", va="bottom", fontsize=7,
                           color=colour)
        if node.name in hinges and node.name not in (first, last):
            draw_hinge(strip, chainage, 0.0, colour)
    strip.set_ylim(-1.0, 1.0)
    strip.set_yticks([])
    for side in ("left", "right", "top"):
        strip.spines[side].set_visible(False)
    return strip


def _pin_joints(model: Model) -> set[str]:
    """Nodes where every member end is released (drawn as open circles)."""
    continuous: set[str] = set()
    touched: set[str] = set()
    for member in model.members:
        touched.update((member.start, member.end))
        if not member.release_start:
            continuous.add(member.start)
        if not member.release_end:
            continuous.add(member.end)
    return touched - continuous


def _continuous_ends(model: Model) -> dict[str, int]:
    """How many member ends meet each node without a release."""
    count: dict[str, int] = {}
    for member in model.members:
        for node, released in ((member.start, member.release_start),
                               (member.end, member.release_end)):
            count[node] = count.get(node, 0) + (0 if released else 1)
    return count


def structure_size(model: Model, width: float = 9.0) -> tuple[float, float]:
    """Figure size [in] for a structure drawn at equal aspect: as tall as its shape needs."""
    xs = [n.x for n in model.nodes]
    ys = [n.y for n in model.nodes]
    extent = max(max(xs) - min(xs), 1e-9)
    height = width * (max(ys) - min(ys)) / extent
    return width, float(min(max(height + 1.5, 1.9), 0.8 * width))


DEPTH_SCALE = 0.015
"""Depth of a member of varying section as drawn where its relative depth is 1, a fraction [-] of
the structure's extent (a haunch shows as the outline deepening toward the support)."""


def _draw_depth(ax: Axes, member: Member, a: Node, b: Node, length: float, extent: float,
                colour: str) -> list[tuple[tuple[float, float], tuple[float, float]]]:
    """The depth profile of a haunched or tapered member, as a filled outline to scale along
    the member: below it (whichever way it was drawn), or centred on a vertical member.
    Returns the outline's edges as segments, for labels to keep clear of."""
    along = np.linspace(0.0, length, DEPTH_POINTS)
    depth = DEPTH_SCALE * extent * _relative_depth(member, length, along)
    ux, uy = (b.x - a.x) / length, (b.y - a.y) / length
    x, y = a.x + ux * along, a.y + uy * along
    # the normal pointing down, so that a leg drawn base to knee and one drawn knee to base
    # hang the same way
    nx, ny = (uy, -ux) if ux >= 0.0 else (-uy, ux)
    near, far = (-0.5 * depth, 0.5 * depth) if abs(ux) <= 1e-9 else (np.zeros_like(depth), depth)
    outline_x = np.concatenate([x + nx * near, (x + nx * far)[::-1]])
    outline_y = np.concatenate([y + ny * near, (y + ny * far)[::-1]])
    ax.fill(outline_x, outline_y, color=colour, alpha=0.25, linewidth=0, zorder=1)
    corners = list(zip(outline_x[::8].tolist(), outline_y[::8].tolist(), strict=True))
    return list(zip(corners, corners[1:], strict=False))


@drawing
def draw_structure(model: Model, ax: Axes | None = None, title: str = "") -> Axes:
    """Draw members (bars thinner), supports, hinges, the travel path and the names, at equal
    aspect, with symbols sized to the drawing and labels clear of members and of each other."""
    ax = ax if ax is not None else new_axes(*structure_size(model))
    path = trace(model)
    on_path = {leg.member for leg in path.legs}
    xs = [n.x for n in model.nodes]
    ys = [n.y for n in model.nodes]
    extent = max(max(xs) - min(xs), max(ys) - min(ys), 1e-9)
    flat = max(ys) - min(ys) <= 1e-9 * extent
    pins = _pin_joints(model)
    continuous = _continuous_ends(model)
    segments = []
    outlines: list[tuple[tuple[float, float], tuple[float, float]]] = []
    from matplotlib.transforms import offset_copy

    figure: Any = ax.get_figure()
    for member in model.members:
        a, b = model.node(member.start), model.node(member.end)
        colour = PALETTE["bar"] if member.is_bar else PALETTE["structure"]
        ax.plot([a.x, b.x], [a.y, b.y], color=colour, linewidth=1.2 if member.is_bar else 2.2,
                zorder=2)
        segments.append(((a.x, a.y), (b.x, b.y)))
        if member.name in on_path:
            ax.plot([a.x, b.x], [a.y, b.y], color=PALETTE["path"], linewidth=6, alpha=0.3,
                    zorder=1, solid_capstyle="butt")
        length = max(float(np.hypot(b.x - a.x, b.y - a.y)), 1e-12)
        if member.varies:
            outlines += _draw_depth(ax, member, a, b, length, extent, colour)
        for released, near, far in ((member.release_start, a, b), (member.release_end, b, a)):
            if not released or near.name in pins:
                continue
            if continuous.get(near.name, 0) <= 1:  # a hinge between two members: at the node
                draw_hinge(ax, near.x, near.y, colour)
                continue
            # a member pinned into a rigid joint: the circle at its end, beside the node
            ux, uy = (far.x - near.x) / length, (far.y - near.y) / length
            shifted = offset_copy(ax.transData, figure, x=7 * ux, y=7 * uy, units="points")
            ax.plot([near.x], [near.y], "o", markersize=5, markerfacecolor="white",
                    markeredgecolor=colour, zorder=6, transform=shifted)
    supported = [n for n in model.nodes if n.support.is_support]
    for node in model.nodes:
        pin = node.name in pins
        if pin:
            draw_hinge(ax, node.x, node.y, PALETTE["structure"])
        else:
            ax.plot([node.x], [node.y], "s", markersize=2.5, color=PALETTE["structure"],
                    zorder=4)
    for node in supported:
        side = "below"
        if flat and node.x <= min(xs) and node.support.description == "fixed":
            side = "left"
        elif flat and node.x >= max(xs) and node.support.description == "fixed":
            side = "right"
        draw_support(ax, node.x, node.y, node.support, side, PALETTE["structure"])
    ax.set_aspect("equal", adjustable="datalim")  # true shape: limits follow the box
    ax.margins(0.04)
    names = labels(model.units)
    ax.set_xlabel(f"x [{names.length}]")
    if flat:
        ax.set_yticks([])
        for side in ("left", "right", "top"):
            ax.spines[side].set_visible(False)
    else:
        ax.set_ylabel(f"y [{names.length}]")
        ax.grid(True, color=PALETTE["grid"], linewidth=0.5)
    ax.set_title(title or f"{model.title}: structure and travel path (shaded)", fontsize=10)
    found = []
    for node in model.nodes:
        offsets: tuple[tuple[float, float], ...] = (
            ((0, -24), (12, -24), (-12, -24)) if node.support.is_support else
            ((9, 8), (-9, 8), (9, -8), (-9, -8), (0, 11), (0, -11)))
        found.append(Label(node.name, ((node.x, node.y),), offsets, True, PALETTE["structure"]))
    for member in model.members:
        a, b = model.node(member.start), model.node(member.end)
        length = max(float(np.hypot(b.x - a.x, b.y - a.y)), 1e-12)
        nx_, ny_ = -(b.y - a.y) / length, (b.x - a.x) / length
        if ny_ < 0:
            nx_, ny_ = -nx_, -ny_
        anchors = tuple((a.x + t * (b.x - a.x), a.y + t * (b.y - a.y)) for t in (0.5, 0.3, 0.7))
        offsets = tuple((side * d * nx_, side * d * ny_) for d in (8, 15, 22) for side in (1, -1))
        found.append(Label(member.name, anchors, offsets, False,
                           PALETTE["path"] if member.name in on_path else PALETTE["line"], 6.5))
    _room_for_labels(ax, min((n.y for n in supported), default=min(ys)), max(ys))
    place_labels(ax, found, segments + outlines)
    return ax


LABEL_ROOM_BELOW = 32.0
"""Room [points] kept inside the drawing under the lowest support, for its symbol and name."""
LABEL_ROOM_ABOVE = 18.0
"""Room [points] kept inside the drawing over the highest node, for its name."""


def _room_for_labels(ax: Axes, lowest: float, highest: float) -> None:
    """Widen the drawing's data limits so that :data:`LABEL_ROOM_BELOW` points fit under
    ``lowest`` and :data:`LABEL_ROOM_ABOVE` over ``highest`` [length]: support names sit 24
    points under their support, node names up to 11 over their node, and both must stay inside
    the drawing (through the data limits: at equal aspect the axes keep their box)."""
    figure: Any = ax.get_figure()
    figure.draw_without_rendering()
    to_data = ax.transData.inverted()
    (_, y0), (_, y1) = to_data.transform([(0.0, 0.0), (0.0, figure.dpi / 72.0)])
    per_point = abs(y1 - y0)
    x = ax.get_xlim()[0]
    ax.update_datalim([(x, lowest - LABEL_ROOM_BELOW * per_point),
                       (x, highest + LABEL_ROOM_ABOVE * per_point)], updatex=False)
    ax.autoscale_view()
