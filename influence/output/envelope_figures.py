"""Envelope drawings: live-load (LL+IM) largest and smallest effects along the path, the
factored combinations, and which load model governs where; reactions as bars at their supports;
bar forces of a truss as bars by member (matplotlib imported only when drawing)."""

from __future__ import annotations

from collections.abc import Sequence
from itertools import cycle
from typing import TYPE_CHECKING

import numpy as np

from influence.design.envelope import Envelope, EnvelopeEntry
from influence.output.conventions import LIVE_LABEL, printed_effect
from influence.output.figures import PALETTE, new_axes
from vehicles.output.figure_files import drawing, new_figure
from vehicles.output.tabular import ROUND_OFF
from vehicles.units import labels

if TYPE_CHECKING:
    from matplotlib.axes import Axes

MARKERS = ("o", "s", "^", "D", "v", "P", "X", "<", ">", "h")
GOVERNING_COLOURS = ("#b3432b", "#2e8b57", "#7b4fa0", "#c07a12", "#1f77b4", "#8c564b",
                     "#d62728", "#17becf")
COMBINATION_STYLES = ("--", ":", "-.")


def sorted_entries(envelope: Envelope, kind: str) -> list[EnvelopeEntry]:
    """The entries of a response on the path, by chainage (the left side of a section first)."""
    entries = [e for e in envelope.of(kind) if e.section.chainage is not None]
    return sorted(entries, key=lambda e: (e.section.chainage, e.section.side != "left"))


def _governing_key(entry: EnvelopeEntry, sense: str, size: float) -> str | None:
    """'model: case' of the placement governing a sense, None when none does or the effect is
    round-off of ``size`` (no model governs a zero)."""
    placement = getattr(entry.live, sense)
    if placement is None or abs(placement.value) <= ROUND_OFF * size:
        return None
    return f"{placement.model}: {placement.case}"


def _size(entries: list[EnvelopeEntry]) -> float:
    return max((abs(p.value) for e in entries for p in (e.live.max, e.live.min)
                if p is not None), default=0.0)


@drawing
def draw_envelope(envelope: Envelope, kind: str, ax: Axes | None = None,
                  title: str = "") -> Axes:
    """The envelope of one response: a curve along the path, reactions as bars at the supports,
    bar forces by member."""
    ax = ax if ax is not None else new_axes(9.0, 4.2)
    if kind == "axial":
        return _draw_bar_forces(envelope, ax, title)
    entries = sorted_entries(envelope, kind)
    if kind == "reaction":  # by support, on the path or not
        entries += [e for e in envelope.of(kind) if e.section.chainage is None]
    unit, factor = printed_effect(kind, envelope.units)
    names = labels(envelope.units)
    ax.set_title(title or f"Envelope of {kind}", fontsize=10)
    ax.set_ylabel(f"{kind} [{unit}]")
    ax.grid(True, color=PALETTE["grid"], linewidth=0.6)
    ax.axhline(0.0, color=PALETTE["structure"], linewidth=0.7)
    if not entries:
        ax.text(0.5, 0.5, f"no {kind} sections on the path", transform=ax.transAxes,
                ha="center", va="center")
        return ax
    x = np.array([np.nan if e.section.chainage is None else e.section.chainage
                  for e in entries], dtype=float)
    high = factor * np.array([np.nan if e.live_max is None else e.live_max for e in entries])
    low = factor * np.array([np.nan if e.live_min is None else e.live_min for e in entries])
    live = f"{LIVE_LABEL} (x {envelope.basis.live.scale:g} per girder line)"
    if kind == "reaction":
        return _draw_reactions(envelope, entries, ax, factor, live)
    ax.fill_between(x, low, high, color=PALETTE["positive"], alpha=0.25, linewidth=0)
    ax.plot(x, high, color=PALETTE["line"], linewidth=1.6, label=f"{live}, largest")
    ax.plot(x, low, color=PALETTE["negative"], linewidth=1.6, label=f"{live}, smallest")
    size = _size(entries)
    keys = sorted({k for e in entries for s in ("max", "min")
                   if (k := _governing_key(e, s, size)) is not None})
    styles = zip(keys, cycle(MARKERS), cycle(GOVERNING_COLOURS))
    for key, marker, colour in styles:
        chosen_x, chosen_y = [], []
        for values, sense in ((high, "max"), (low, "min")):
            for i, entry in enumerate(entries):
                if _governing_key(entry, sense, size) == key:
                    chosen_x.append(x[i])
                    chosen_y.append(values[i])
        ax.plot(chosen_x, chosen_y, marker, markersize=4, linestyle="none", color=colour,
                markeredgecolor=colour, label=f"governs: {key}", zorder=5)
    if kind != "deflection":  # deflection is a service check: no factored deflections
        for combination, style in zip(envelope.basis.combinations, cycle(COMBINATION_STYLES)):
            values = factor * np.array([e.combined(combination) for e in entries])
            ax.plot(x, values[:, 0], style, color=PALETTE["structure"], linewidth=0.9,
                    label=f"{combination.name} (factored)")
            ax.plot(x, values[:, 1], style, color=PALETTE["structure"], linewidth=0.9)
    if kind == "deflection":
        ax.invert_yaxis()  # downward positive: drawn downward
    ax.set_xlabel(f"section chainage [{names.length}]")
    ax.legend(fontsize=7, frameon=False, loc="center left", bbox_to_anchor=(1.01, 0.5))
    return ax


def _draw_reactions(envelope: Envelope, entries: list[EnvelopeEntry], ax: Axes,
                    factor: float, live: str) -> Axes:
    """Reactions as grouped bars at each support: LL+IM and every combination, largest and
    smallest, the governing load model marked on the LL+IM bars."""
    groups = [(f"{live}", [e.live_max or 0.0 for e in entries],
               [e.live_min or 0.0 for e in entries])]
    for combination in envelope.basis.combinations:
        values = np.array([e.combined(combination) for e in entries])
        groups.append((f"{combination.name} (factored)", list(values[:, 0]),
                       list(values[:, 1])))
    positions = np.arange(len(entries), dtype=float)
    width = 0.8 / len(groups)
    size = _size(entries)
    colours = (PALETTE["line"], PALETTE["bar"], PALETTE["positive"], PALETTE["path"])
    for index, ((label, high, low), colour) in enumerate(zip(groups, cycle(colours))):
        at = positions - 0.4 + width * (index + 0.5)
        ax.bar(at, factor * np.asarray(high), width=0.9 * width, color=colour, label=label)
        ax.bar(at, factor * np.asarray(low), width=0.9 * width, color=colour, alpha=0.55)
        if index == 0:
            keys = sorted({k for e in entries for sense in ("max", "min")
                           if (k := _governing_key(e, sense, size)) is not None})
            for key, marker, mark_colour in zip(keys, cycle(MARKERS), cycle(GOVERNING_COLOURS)):
                xs: list[float] = []
                ys: list[float] = []
                for sides, sense in ((high, "max"), (low, "min")):
                    for i, entry in enumerate(entries):
                        if _governing_key(entry, sense, size) == key:
                            xs.append(at[i])
                            ys.append(factor * sides[i])
                ax.plot(xs, ys, marker, color=mark_colour, markersize=4, linestyle="none",
                        label=f"governs: {key}", zorder=5)
    ax.set_axisbelow(True)
    ax.set_xticks(positions, [e.section.label.replace(" ", "\n") for e in entries])
    ax.set_xlabel("support (lighter bars: smallest values)")
    ax.legend(fontsize=7, frameon=False, loc="center left", bbox_to_anchor=(1.01, 0.5))
    return ax


def _draw_bar_forces(envelope: Envelope, ax: Axes, title: str) -> Axes:
    """Largest tension and compression of each bar, one bar a row (not against chainage)."""
    entries = bar_entries(envelope)
    unit, _ = printed_effect("axial", envelope.units)
    ax.set_title(title or "Bar forces", fontsize=10)
    if not entries:
        ax.text(0.5, 0.5, "no bars enveloped", transform=ax.transAxes, ha="center")
        return ax
    rows = np.arange(len(entries))
    high = [e.live_max or 0.0 for e in entries]
    low = [e.live_min or 0.0 for e in entries]
    live = f"{LIVE_LABEL} (x {envelope.basis.live.scale:g})"
    ax.barh(rows, high, color=PALETTE["line"], label=f"{live}, tension")
    ax.barh(rows, low, color=PALETTE["negative"], label=f"{live}, compression")
    for combination, marker in zip(envelope.basis.combinations, cycle(("|", "x", "+")),
                                   strict=False):
        values = np.array([e.combined(combination) for e in entries])
        ax.plot(values[:, 0], rows, marker, color=PALETTE["structure"], linestyle="none",
                label=f"{combination.name} (factored)")
        ax.plot(values[:, 1], rows, marker, color=PALETTE["structure"], linestyle="none")
    ax.set_yticks(rows, [e.section.label for e in entries], fontsize=7)
    ax.invert_yaxis()
    ax.axvline(0.0, color=PALETTE["structure"], linewidth=0.7)
    ax.set_xlabel(f"axial force [{unit}], tension positive")
    ax.grid(True, axis="x", color=PALETTE["grid"], linewidth=0.6)
    ax.legend(fontsize=7, frameon=False, loc="center left", bbox_to_anchor=(1.01, 0.5))
    return ax


def bar_entries(envelope: Envelope) -> list[EnvelopeEntry]:
    """Axial-force entries, one per member (the first section of each), in model order."""
    seen: dict[str, EnvelopeEntry] = {}
    for entry in envelope.of("axial"):
        seen.setdefault(entry.section.label, entry)
    return list(seen.values())


@drawing
def envelope_figure(envelope: Envelope, kinds: Sequence[str], title: str) -> Axes:
    """All envelope plots of a run stacked on one figure; returns its first axes."""
    present = [k for k in kinds if envelope.of(k)]
    figure = new_figure(11.0, 3.6 * max(len(present), 1))
    axes = figure.subplots(max(len(present), 1), 1, squeeze=False)[:, 0]
    for ax, kind in zip(axes, present, strict=False):
        draw_envelope(envelope, kind, ax=ax, title=f"{title}: envelope of {kind}")
    return axes[0]
