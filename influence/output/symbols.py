"""Support, hinge and spring symbols sized to the drawing (in points, as markers are), whatever
the span, and labels placed where they overlap neither members nor each other.

Every symbol is a matplotlib marker whose origin is the node, so it stands on the node at any
scale: a triangle under a pinned support, a triangle on a line under a roller, a hatched wall or
footing at a fixed support, a zigzag under a vertical spring, a coil at a rotational spring, an
open circle at a hinge.

Example:
    >>> from influence.model.structure import Support
    >>> symbol_kinds(Support(ux="fixed", uy="fixed")), symbol_kinds(Support(uy=2.0e5))
    (('pinned',), ('spring',))
"""

from __future__ import annotations

from collections.abc import Sequence
from dataclasses import dataclass
from typing import Any

import numpy as np

from influence.model.structure import Support

SYMBOL_SIZE = 16.0
"""Size of a support symbol [points]."""
HINGE_SIZE = 6.5
"""Diameter of a hinge circle [points]."""


def symbol_kinds(support: Support) -> tuple[str, ...]:
    """The symbols that draw a support: pinned, roller, fixed, spring, coil (rotational spring),
    guided (rotation held, free to slide)."""
    kinds: list[str] = []
    ux, uy, rz = support.ux, support.uy, support.rz
    if uy == "fixed" and rz == "fixed":
        kinds.append("fixed")
    elif uy == "fixed":
        kinds.append("pinned" if ux == "fixed" else "roller")
    elif isinstance(uy, float):
        kinds.append("spring")
    elif rz == "fixed":
        kinds.append("guided")
    if isinstance(rz, float):
        kinds.append("coil")
    if isinstance(ux, float):
        kinds.append("spring")
    return tuple(dict.fromkeys(kinds))


def _path(vertices: Sequence[tuple[float, float]], codes: Sequence[int] | None = None) -> Any:
    from matplotlib.path import Path

    return Path(np.asarray(vertices, dtype=float), codes)


def _marker(kind: str, side: str) -> tuple[Any, bool]:
    """(marker path with the node at the origin, filled) for a symbol; ``side`` is where a wall
    goes for a fixed end: "left", "right" or "below"."""
    from matplotlib.path import Path

    move, line = int(Path.MOVETO), int(Path.LINETO)
    if kind in ("pinned", "roller"):
        points = [(0.0, 0.0), (-0.5, -0.8), (0.5, -0.8), (0.0, 0.0)]
        codes = [move, line, line, line]
        if kind == "roller":
            points += [(-0.55, -1.0), (0.55, -1.0)]
            codes += [move, line]
        return _path(points, codes), kind == "pinned"
    if kind == "fixed":
        if side == "below":
            points, codes = [(-0.6, 0.0), (0.6, 0.0)], [move, line]
            for t in np.linspace(-0.5, 0.6, 5):
                points += [(t, 0.0), (t - 0.25, -0.3)]
                codes += [move, line]
        else:
            sign = -1.0 if side == "left" else 1.0
            points, codes = [(0.0, -0.6), (0.0, 0.6)], [move, line]
            for t in np.linspace(-0.5, 0.6, 5):
                points += [(0.0, t), (0.3 * sign, t - 0.25)]
                codes += [move, line]
        return _path(points, codes), False
    if kind == "spring":
        zig = [(0.0, 0.0), (0.0, -0.15)]
        for i, y in enumerate(np.linspace(-0.22, -0.78, 7)):
            zig.append((0.25 if i % 2 == 0 else -0.25, y))
        zig += [(0.0, -0.85), (0.0, -1.0), (-0.4, -1.0), (0.4, -1.0)]
        codes = [move] + [line] * (len(zig) - 3) + [move, line]
        return _path(zig, codes), False
    if kind == "coil":
        turns = np.linspace(0.0, 3.2 * np.pi, 40)
        radius = 0.12 + 0.1 * turns / np.pi
        points = list(zip(radius * np.cos(turns), radius * np.sin(turns), strict=True))
        return _path(points, [move] + [line] * (len(points) - 1)), False
    # guided: a small block that slides on a line
    points = [(-0.35, 0.0), (0.35, 0.0), (0.35, -0.6), (-0.35, -0.6), (-0.35, 0.0),
              (-0.6, -0.75), (0.6, -0.75)]
    return _path(points, [move, line, line, line, line, move, line]), False


def draw_support(ax: Any, x: float, y: float, support: Support, side: str, colour: str,
                 zorder: float = 5.0) -> None:
    """Draw a support's symbols at (x, y) [data units], sized in points."""
    for kind in symbol_kinds(support):
        marker, filled = _marker(kind, side)
        ax.plot([x], [y], marker=marker, markersize=SYMBOL_SIZE, linestyle="none",
                markerfacecolor="white" if filled else "none", markeredgecolor=colour,
                markeredgewidth=1.1, zorder=zorder, clip_on=False)


def draw_hinge(ax: Any, x: float, y: float, colour: str, zorder: float = 6.0) -> None:
    """An open circle at a hinge [data units], sized in points."""
    ax.plot([x], [y], "o", markersize=HINGE_SIZE, markerfacecolor="white",
            markeredgecolor=colour, markeredgewidth=1.1, zorder=zorder, linestyle="none",
            clip_on=False)


@dataclass(frozen=True)
class Label:
    """A text to place near one of some points, trying offsets [points] in order of preference.

    Attributes:
        text: what to write (plain text).
        anchors: the points [data units] it may label, in order of preference.
        offsets: (dx, dy) [points] to try at each anchor; the text is centred there.
        needed: kept at its first spot even when every spot collides (node names); an
            optional label (member names) is left out instead.
    """

    text: str
    anchors: tuple[tuple[float, float], ...]
    offsets: tuple[tuple[float, float], ...]
    needed: bool = True
    colour: str = "black"
    size: float = 7.0


def _crosses(box: Any, segment: np.ndarray) -> bool:
    """Whether a line segment (2 x 2, display units) passes through a box."""
    (x0, y0), (x1, y1) = segment
    samples = np.linspace(0.0, 1.0, 24)
    xs, ys = x0 + (x1 - x0) * samples, y0 + (y1 - y0) * samples
    return bool(np.any((xs > box.x0) & (xs < box.x1) & (ys > box.y0) & (ys < box.y1)))


def place_labels(ax: Any, labels: Sequence[Label],
                 segments: Sequence[tuple[tuple[float, float], tuple[float, float]]]) -> list[Any]:
    """Place labels in order, each at the first spot (anchor and offset) whose box lies inside
    the axes, crosses no segment [data units] (the members) and overlaps no label already
    placed; returns the text artists placed.

    The figure is laid out first, so the boxes are those of the final drawing.
    """
    figure = ax.get_figure()
    figure.draw_without_rendering()
    renderer = figure._get_renderer()
    lines = [ax.transData.transform(np.asarray(s, dtype=float)) for s in segments]
    inside = ax.get_window_extent(renderer)
    placed: list[Any] = []
    boxes: list[Any] = []

    def put(label: Label, anchor: tuple[float, float], offset: tuple[float, float]) -> Any:
        return ax.annotate(label.text, anchor, xytext=offset, textcoords="offset points",
                           ha="center", va="center", fontsize=label.size, color=label.colour,
                           zorder=7)

    for label in labels:
        chosen = None
        for anchor in label.anchors:
            for offset in label.offsets:
                text = put(label, anchor, offset)
                box = text.get_window_extent(renderer).expanded(1.08, 1.2)
                within = (inside.x0 <= box.x0 and box.x1 <= inside.x1
                          and inside.y0 <= box.y0 and box.y1 <= inside.y1)
                if within and not any(_crosses(box, s) for s in lines) and not any(
                        box.overlaps(b) for b in boxes):
                    chosen = text
                    break
                text.remove()
            if chosen is not None:
                break
        if chosen is None and label.needed:
            chosen = put(label, label.anchors[0], label.offsets[0])
        if chosen is not None:
            placed.append(chosen)
            boxes.append(chosen.get_window_extent(renderer))
    return placed
