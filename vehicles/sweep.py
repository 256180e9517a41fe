"""The effect of a load case against the lead position, exactly, for tables and plots.

A sweep is the exact effect function E(lead position) of one case in one direction (a scipy
``PPoly``) and a tabulation of it: lead positions at a regular step from the train's entry to its
exit, plus every breakpoint, where a jump is listed twice (left limit, then right limit). Lead
positions are chainages of the train's reference point [length]; values are in the influence
function's units times the load model's force units. Ranged gaps are fixed at the values that
govern the swept sense unless given.

Example:
    >>> from scipy.interpolate import PPoly
    >>> from vehicles.loadmodel import LoadCase
    >>> from vehicles.train import Axle, Train
    >>> reaction = PPoly([[-0.1], [1.0]], [0.0, 10.0])  # R at the start of a 10 m span
    >>> case = LoadCase("pair", Train("P", (Axle(10.0), Axle(10.0, 2.0))))
    >>> s = sweep(reaction, case, "forward", kind="reaction", step=5.0)
    >>> [(float(x), round(float(v), 6)) for x, v in zip(s.lead_positions, s.values)][:3]
    [(0.0, 0.0), (0.0, 10.0), (2.0, 8.0)]
"""

from __future__ import annotations

from collections.abc import Sequence
from dataclasses import dataclass

import numpy as np
from scipy.interpolate import PPoly

from vehicles.effect import DIRECTIONS, PreparedInfluence, effect_function, prepare
from vehicles.gaps import best_effect
from vehicles.loadmodel import LoadCase

DEFAULT_STEPS = 200
"""Regular steps across the train's passage when no step is given."""


@dataclass(frozen=True)
class Sweep:
    """One case's effect against its lead position, in one direction.

    Attributes:
        case: load case name.
        direction: "forward" or "reverse".
        sense: "max" or "min" (which adverse parts the lane load covers).
        choices: values used for the train's ranged gaps and lengths [length].
        effect: E as a ``PPoly`` of the lead position [length]; constant beyond its ends.
        lead_positions: tabulated lead positions [length], increasing (a jump appears twice).
        values: E at each tabulated position (the one-sided limit at a repeated position).
    """

    case: str
    direction: str
    sense: str
    choices: tuple[float, ...]
    effect: PPoly
    lead_positions: np.ndarray
    values: np.ndarray


def sweep(
    influence: PPoly | PreparedInfluence,
    case: LoadCase,
    direction: str = "forward",
    *,
    kind: str,
    sense: str = "max",
    choices: Sequence[float] | None = None,
    step: float | None = None,
) -> Sweep:
    """The exact effect of ``case`` against the lead position, and a table of it.

    Args:
        influence: response per unit downward load against chainage [length].
        case: the load case.
        direction: "forward" or "reverse".
        kind: response kind (picks the knife-edge load).
        sense: "max" or "min": the adverse parts loaded by the lane; also the extreme whose
            governing gaps are used when ``choices`` is None.
        choices: ranged gap and length values [length].
        step: tabulation step [length]; default the passage divided into ``DEFAULT_STEPS``.
    """
    prepared = prepare(influence)
    if choices is None:
        effect = best_effect(prepared, case, kind=kind, sense=sense, direction=direction)
    else:
        effect = effect_function(prepared, case, kind=kind, sense=sense, direction=direction,
                                 choices=choices)
    pieces = effect.pieces
    # the outer pieces are padding: the train is entirely off the path there
    inner = pieces.breaks[1:-1]
    first, last = float(inner[0]), float(inner[-1])
    if step is None:
        step = (last - first) / DEFAULT_STEPS if last > first else 1.0
    regular = first + step * np.arange(int(np.floor((last - first) / step + 1e-9)) + 1)
    regular = regular[~np.isin(regular, inner)]
    positions = np.concatenate([regular, inner, inner])
    sides = np.concatenate([np.zeros(regular.size), -np.ones(inner.size), np.ones(inner.size)])
    left = pieces.values_at(positions, side="left")
    right = pieces.values_at(positions, side="right")
    values = np.where(sides < 0, left, right)
    # keep both limits only where E jumps
    tolerance = 1e-9 * max(float(np.abs(values).max()), 1e-300)
    keep = (sides >= 0) | (np.abs(left - right) > tolerance)
    order = np.lexsort((sides[keep], positions[keep]))
    arrangement = effect.arrangement
    return Sweep(
        case.name,
        direction,
        sense,
        arrangement.choices if arrangement is not None else (),
        effect.ppoly(),
        positions[keep][order],
        values[keep][order],
    )


def sweeps(
    influence: PPoly | PreparedInfluence,
    case: LoadCase,
    *,
    kind: str,
    sense: str = "max",
    choices: Sequence[float] | None = None,
    step: float | None = None,
) -> tuple[Sweep, ...]:
    """Forward and reverse sweeps of one case (see :func:`sweep`)."""
    prepared = prepare(influence)
    return tuple(sweep(prepared, case, direction, kind=kind, sense=sense, choices=choices,
                       step=step) for direction in DIRECTIONS)
