"""Envelope drawings: live-load largest and smallest effects along the path, the combinations,
and which load model governs where (matplotlib imported here only)."""

from __future__ import annotations

from typing import TYPE_CHECKING

import numpy as np

from influence.design.envelope import Envelope
from influence.output.conventions import effect_unit
from influence.output.figures import PALETTE, new_axes
from vehicles.units import labels

if TYPE_CHECKING:
    from matplotlib.axes import Axes

MARKERS = ("o", "s", "^", "D", "v", "P", "X")
COMBINATION_STYLES = ("--", ":", "-.")


def draw_envelope(envelope: Envelope, kind: str, ax: Axes | None = None, title: str = "") -> Axes:
    """Live envelope (one girder line) with each point marked by its governing model and case,
    and the combinations' largest and smallest values as thinner lines."""
    ax = ax if ax is not None else new_axes(9.0, 4.2)
    entries = [e for e in envelope.of(kind) if e.section.chainage is not None]
    if not entries:
        ax.set_title(f"no {kind} sections on the path", fontsize=10)
        return ax
    x = np.array([e.section.chainage for e in entries], dtype=float)
    high = np.array([np.nan if e.live_max is None else e.live_max for e in entries])
    low = np.array([np.nan if e.live_min is None else e.live_min for e in entries])
    ax.fill_between(x, low, high, color=PALETTE["positive"], alpha=0.25, linewidth=0)
    ax.plot(x, high, color=PALETTE["line"], linewidth=1.6, label="live load, largest")
    ax.plot(x, low, color=PALETTE["negative"], linewidth=1.6, label="live load, smallest")
    governing = sorted({f"{p.model}: {p.case}" for e in entries
                        for p in (e.live.max, e.live.min) if p is not None})
    for index, label in enumerate(governing):
        marker = MARKERS[index % len(MARKERS)]
        named = False  # one legend entry per governing model and case
        for values, sense in ((high, "max"), (low, "min")):
            chosen = [i for i, e in enumerate(entries)
                      if (p := getattr(e.live, sense)) is not None
                      and f"{p.model}: {p.case}" == label]
            if chosen:
                ax.plot(x[chosen], values[chosen], marker, markersize=3.5, linestyle="none",
                        color=PALETTE["section"] if sense == "max" else PALETTE["path"],
                        label=None if named else f"governs: {label}")
                named = True
    for index, combination in enumerate(envelope.basis.combinations):
        values = np.array([e.combined(combination) for e in entries])
        style = COMBINATION_STYLES[index % len(COMBINATION_STYLES)]
        ax.plot(x, values[:, 0], style, color=PALETTE["structure"], linewidth=0.9,
                label=f"{combination.name} (factored)")
        ax.plot(x, values[:, 1], style, color=PALETTE["structure"], linewidth=0.9)
    ax.axhline(0.0, color=PALETTE["structure"], linewidth=0.7)
    names = labels(envelope.units)
    unit = effect_unit(kind, envelope.units)
    ax.set_xlabel(f"section chainage [{names.length}]")
    ax.set_ylabel(f"{kind} [{unit}]")
    ax.set_title(title or f"Envelope of {kind}", fontsize=10)
    ax.grid(True, color=PALETTE["grid"], linewidth=0.6)
    ax.legend(fontsize=7, frameon=False, loc="best")
    return ax
