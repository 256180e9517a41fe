"""The effect of a load case against the lead position, exactly, for tables and plots.

A sweep is the exact effect function E(lead position) of one case in one direction and a
tabulation of it: lead positions at a regular step from the train's entry to its exit, plus every
breakpoint, where a jump is listed twice (left limit, then right limit). Lead positions are
chainages of the train's reference point [length]; values are in the influence line's units
times the load model's force units. Ranged gaps are fixed at the values that govern the swept
sense unless given.

Example:
    >>> from piecewise import Piecewise
    >>> from vehicles.loadmodel import LoadCase
    >>> from vehicles.train import Axle, Train
    >>> reaction = Piecewise(np.array([0.0, 10.0]), np.array([[1.0], [-0.1]]))  # 10 m span
    >>> case = LoadCase("pair", Train("P", (Axle(10.0), Axle(10.0, 2.0))))
    >>> s = sweep(reaction, case, "forward", kind="reaction", step=5.0)
    >>> [(float(x), round(float(v), 6)) for x, v in zip(s.lead_positions, s.values)][:3]
    [(0.0, 0.0), (0.0, 10.0), (2.0, 8.0)]
"""

from __future__ import annotations

import math
from collections.abc import Sequence
from dataclasses import dataclass
from typing import Any

import numpy as np

from piecewise import Piecewise
from vehicles.errors import VehicleError
from vehicles.limits import MAX_TABLE_ROWS
from vehicles.loadmodel import LoadCase, LoadModel
from vehicles.search.effects import effect_function
from vehicles.search.govern import govern
from vehicles.search.prepared import prepare
from vehicles.search.terms import DIRECTIONS
from vehicles.train import RangedValue

DEFAULT_STEPS = 200
"""Regular steps across the train's passage when no step is given."""


@dataclass(frozen=True)
class Sweep:
    """One case's effect against its lead position, in one direction.

    Attributes:
        case: load case name.
        direction: "forward" or "reverse".
        sense: "max" or "min" (which adverse parts the lane load covers).
        ranged_values: the values used for the train's ranged gaps and lengths.
        effect: E against the lead position [length], constant beyond the train's passage.
        lead_positions: tabulated lead positions [length], increasing (a jump appears twice).
        values: E at each tabulated position (the one-sided limit at a repeated position).
    """

    case: str
    direction: str
    sense: str
    ranged_values: tuple[RangedValue, ...]
    effect: Piecewise
    lead_positions: np.ndarray
    values: np.ndarray


def sweep(
    line: Any,
    case: LoadCase,
    direction: str = "forward",
    *,
    kind: str,
    sense: str = "max",
    ranged_values: Sequence[float] | None = None,
    step: float | None = None,
) -> Sweep:
    """The exact effect of ``case`` against the lead position, and a table of it.

    Args:
        line: response per unit downward load against chainage [length].
        case: the load case.
        direction: "forward" or "reverse".
        kind: response kind (picks the knife-edge load).
        sense: "max" or "min": the adverse parts loaded by the lane; also the extreme whose
            governing ranged values are used when ``ranged_values`` is None.
        ranged_values: ranged gap and length values [length].
        step: tabulation step [length]; default the passage divided into ``DEFAULT_STEPS``.
    """
    prepared = prepare([line])
    if ranged_values is None and case.train is not None and case.train.ranged_values:
        alone = LoadModel("sweep", "one case", "kN-m", (case,))
        best = govern(line, alone, kind=kind, directions=(direction,))
        chosen = best.max if sense == "max" else best.min
        ranged_values = [r.value for r in chosen.ranged_values
                         if r.value is not None] if chosen is not None else None
    effect = effect_function(prepared, case, kind=kind, sense=sense, direction=direction,
                             ranged_values=ranged_values)
    function = effect.function
    # the outer pieces are padding: the train is entirely off the path there
    inner = function.breaks[1:-1]
    first, last = float(inner[0]), float(inner[-1])
    if step is None:
        step = (last - first) / DEFAULT_STEPS if last > first else 1.0
    if not (math.isfinite(step) and step > 0):
        raise VehicleError(f"step {step!r} is not a positive length", item="step",
                           fix="give a positive step along the path")
    rows = (last - first) / step + inner.size
    if rows > MAX_TABLE_ROWS:
        raise VehicleError(f"a step of {step:g} needs about {rows:,.0f} rows, more than "
                           f"{MAX_TABLE_ROWS:,}", item="step",
                           fix=f"give a step of at least {(last - first) / MAX_TABLE_ROWS:.3g}")
    regular = first + step * np.arange(int(np.floor((last - first) / step + 1e-9)) + 1)
    regular = regular[~np.isin(regular, inner)]
    positions = np.concatenate([regular, inner, inner])
    sides = np.concatenate([np.zeros(regular.size), -np.ones(inner.size), np.ones(inner.size)])
    left = function.values(positions, side="left")
    right = function.values(positions, side="right")
    values = np.where(sides < 0, left, right)
    # keep both limits only where E jumps
    tolerance = 1e-9 * max(float(np.abs(values).max()), 1e-300)
    keep = (sides >= 0) | (np.abs(left - right) > tolerance)
    order = np.lexsort((sides[keep], positions[keep]))
    arrangement = effect.arrangement
    return Sweep(case.name, direction, sense,
                 arrangement.ranged_values if arrangement is not None else (), function,
                 positions[keep][order], values[keep][order])


def sweeps(line: Any, case: LoadCase, *, kind: str, sense: str = "max",
           ranged_values: Sequence[float] | None = None,
           step: float | None = None) -> tuple[Sweep, ...]:
    """Forward and reverse sweeps of one case (see :func:`sweep`)."""
    return tuple(sweep(line, case, direction, kind=kind, sense=sense,
                       ranged_values=ranged_values, step=step) for direction in DIRECTIONS)
