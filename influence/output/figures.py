"""Drawings: influence lines with signed areas, and the structure with its path.

Matplotlib is imported here only, never on the solver's path. Functions take result objects and an
optional ``ax``, return the axes, and save only when given a path (written under a temporary name,
then renamed).
"""

from __future__ import annotations

from pathlib import Path
from typing import TYPE_CHECKING, Any

import numpy as np

from influence.analysis.lines import InfluenceLine
from influence.model.path import trace
from influence.model.structure import Model
from influence.output.conventions import ordinate_unit
from vehicles.atomic import written_whole
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
SAVE_FORMATS = (".png", ".svg", ".pdf")
SAMPLES_PER_PIECE = 48
"""Points drawn per polynomial piece: drawing only; every number reported is exact."""


def _pyplot() -> Any:
    import matplotlib

    matplotlib.use("Agg", force=False)
    import matplotlib.pyplot as plt

    return plt


def new_axes(width: float = 9.0, height: float = 4.0) -> Axes:
    plt = _pyplot()
    figure, ax = plt.subplots(figsize=(width, height), layout="constrained")
    return ax


def save(ax: Axes, path: str | Path) -> None:
    """Save the axes' figure by extension (PNG, SVG or PDF), atomically, and close it."""
    suffix = Path(path).suffix.lower()
    if suffix not in SAVE_FORMATS:
        from influence.errors import InfluenceError

        raise InfluenceError(
            f"cannot draw to {suffix or 'a file without extension'}", source=str(path),
            item="--plot", fix="end the name in .png, .svg or .pdf",
        )
    figure: Any = ax.get_figure()
    written_whole(path, lambda name: figure.savefig(name, dpi=150, format=suffix[1:]))
    _pyplot().close(figure)


def dense_points(line: InfluenceLine) -> tuple[np.ndarray, np.ndarray]:
    """Points for drawing, with both limits at jumps so vertical steps are drawn."""
    xs, ys = [], []
    for start, end, row in zip(line.breakpoints, line.breakpoints[1:], line.coefficients,
                               strict=False):
        t = np.linspace(0.0, end - start, SAMPLES_PER_PIECE)
        xs.append(start + t)
        ys.append(np.polynomial.polynomial.polyval(t, row))
    return np.concatenate(xs), np.concatenate(ys)


def draw_line(line: InfluenceLine, model: Model | None = None, ax: Axes | None = None,
              title: str = "") -> Axes:
    """Draw an influence line, its signed areas shaded, the section marked and the supports and
    hinges of a beam drawn under the axis."""
    ax = ax if ax is not None else new_axes()
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
    for extreme, va in ((extremes.largest, "bottom"), (extremes.smallest, "top")):
        if extreme.value != 0:
            ax.plot([extreme.at], [extreme.value], "o", color=PALETTE["line"], markersize=4)
            ax.annotate(f"{extreme.value:.4g}", (extreme.at, extreme.value), fontsize=8,
                        xytext=(4, 4 if va == "bottom" else -10), textcoords="offset points")
    if line.section_chainage is not None:
        ax.axvline(line.section_chainage, color=PALETTE["section"], linestyle="--",
                   linewidth=1.0, label="section")
    if model is not None:
        _draw_supports_under_axis(ax, model, y)
    names = labels(line.units)
    unit = ordinate_unit(line.response.kind, line.units, line.response.component)
    ax.set_xlabel(f"load position, chainage [{names.length}]")
    ax.set_ylabel(f"{line.response.kind} per unit load [{unit}]")
    ax.set_title(title or f"Influence line: {line.response.label}", fontsize=10)
    ax.grid(True, color=PALETTE["grid"], linewidth=0.6)
    ax.legend(loc="best", fontsize=8, frameon=False)
    return ax


def _draw_supports_under_axis(ax: Axes, model: Model, y: np.ndarray) -> None:
    path = trace(model)
    span = float(np.ptp(y)) or 1.0
    base = min(float(y.min()), 0.0) - 0.12 * span
    size = 0.06 * span
    ax.plot([0, path.total_length], [base, base], color=PALETTE["structure"], linewidth=2.2)
    for node in model.nodes:
        chainage = path.node_chainage(node.name)
        if chainage is None:
            continue
        if node.support.is_support:
            _support_glyph(ax, chainage, base, size, path.total_length, node.support.description)
            ax.annotate(node.name, (chainage, base - 1.6 * size), ha="center", va="top",
                        fontsize=7, color=PALETTE["structure"])
        if node.name in model.hinge_nodes:
            ax.plot([chainage], [base], "o", markersize=6, markerfacecolor="white",
                    markeredgecolor=PALETTE["structure"])
    ax.set_ylim(bottom=base - 3.0 * size)


def _support_glyph(ax: Axes, x: float, y: float, size: float, length: float, kind: str,
                   ground: bool = False) -> None:
    """A support symbol; a fixed support is a wall (beam end) or, with ``ground``, a footing."""
    half = 0.012 * length
    colour = PALETTE["structure"]
    if kind == "fixed" and ground:
        ax.plot([x - 1.5 * half, x + 1.5 * half], [y, y], color=colour, linewidth=3)
        for tick in np.linspace(x - 1.5 * half, x + 1.5 * half, 5):
            ax.plot([tick, tick - 0.5 * half], [y, y - 0.6 * size], color=colour, linewidth=0.8)
        return
    if kind == "fixed":
        ax.plot([x, x], [y - size, y + size], color=colour, linewidth=3)
        return
    if kind == "free":
        return
    triangle = np.array([[x, y], [x - half, y - size], [x + half, y - size], [x, y]])
    ax.fill(triangle[:, 0], triangle[:, 1], facecolor="white", edgecolor=colour, linewidth=1)
    if kind == "roller":
        ax.plot([x - half, x + half], [y - 1.25 * size] * 2, color=colour, linewidth=1)
    elif kind not in ("pinned",):
        ax.annotate("spring", (x, y - 1.1 * size), ha="center", va="top", fontsize=6,
                    color=colour)


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


def draw_structure(model: Model, ax: Axes | None = None) -> Axes:
    """Draw members (bars thinner), supports, releases, the travel path and the names."""
    ax = ax if ax is not None else new_axes(9.0, 5.0)
    path = trace(model)
    on_path = {leg.member for leg in path.legs}
    xs = [n.x for n in model.nodes]
    ys = [n.y for n in model.nodes]
    extent = max(max(xs) - min(xs), max(ys) - min(ys), 1.0)
    seen_pairs: set[frozenset[str]] = set()
    pinned_nodes = _pin_joints(model)
    for member in model.members:
        a, b = model.node(member.start), model.node(member.end)
        colour = PALETTE["bar"] if member.is_bar else PALETTE["structure"]
        ax.plot([a.x, b.x], [a.y, b.y], color=colour, linewidth=1.2 if member.is_bar else 2.2,
                zorder=2)
        if member.name in on_path:
            ax.plot([a.x, b.x], [a.y, b.y], color=PALETTE["path"], linewidth=5, alpha=0.35,
                    zorder=1, solid_capstyle="butt")
        for released, near, far in ((member.release_start, a, b), (member.release_end, b, a)):
            if released and near.name not in pinned_nodes:
                t = 0.025 * extent / max(model.length_of(member.name), 1e-9)
                px, py = near.x + (far.x - near.x) * t, near.y + (far.y - near.y) * t
                ax.plot([px], [py], "o", markersize=4.5, markerfacecolor="white",
                        markeredgecolor=colour, zorder=3)
        pair = frozenset((member.start, member.end))
        below = pair in seen_pairs  # a second member on the same nodes: label it underneath
        seen_pairs.add(pair)
        ax.annotate(member.name, ((a.x + b.x) / 2, (a.y + b.y) / 2), fontsize=7,
                    color=PALETTE["path"] if member.name in on_path else PALETTE["line"],
                    ha="center", va="top" if below else "bottom",
                    xytext=(0, -4 if below else 3), textcoords="offset points")
    for node in model.nodes:
        pin = node.name in pinned_nodes
        ax.plot([node.x], [node.y], "o" if pin else "s", markersize=5 if pin else 3,
                markerfacecolor="white" if pin else PALETTE["structure"],
                markeredgecolor=PALETTE["structure"], zorder=4)
        ax.annotate(node.name, (node.x, node.y), fontsize=7, xytext=(4, 4),
                    textcoords="offset points", color=PALETTE["structure"])
        if node.support.is_support:
            _support_glyph(ax, node.x, node.y, 0.03 * extent, extent * 2.0,
                           node.support.description, ground=True)
    if max(ys) - min(ys) > 0.05 * extent:  # a frame or truss: true shape; a girder: stretched
        ax.set_aspect("equal", adjustable="datalim")
    names = labels(model.units)
    ax.set_xlabel(f"x [{names.length}]")
    ax.set_ylabel(f"y [{names.length}]")
    ax.set_title(f"{model.title}: structure and travel path (shaded)", fontsize=10)
    ax.grid(True, color=PALETTE["grid"], linewidth=0.5)
    return ax
