"""Exact histories of vehicle crossings at a section: the effect against the lead axle's
position, from entering the path to leaving it, reduced to its turning points.

The effect of axles on an influence line is an exact piecewise polynomial of the lead position
(:mod:`vehicles.search.effects`); its skeleton (every piece's end limits and interior stationary
points, :mod:`piecewise.skeleton`) holds every turning point, jumps included, so the turning
points come without sampling. :func:`crossing` does this for one vehicle (or several in a row) and
keeps the effect function for drawing; :func:`crossing_histories` does it for a whole fleet at
once, a group of vehicles with the same number of axles at a time
(:func:`piecewise.copies.copy_skeletons`), and gives the turning values alone, ready for
:func:`~influence.fatigue.batch_counting.count_many`.

Directions: "forward" travels toward increasing chainage (the lead axle first, the others
behind it), "reverse" the other way. Units: lead positions [length], effects [response x force]
(a moment [force x length] or a force).

Example (one 32-kip axle over a 60 ft simple span, moment at 22.5 ft: P a b / L):
    >>> from piecewise import Piecewise
    >>> from vehicles.train import Axle, Train
    >>> line = Piecewise(np.array([0.0, 22.5, 60.0]),
    ...                  np.array([[0.0, 22.5 * 37.5 / 60], [37.5 / 60, -22.5 / 60]]))
    >>> one = crossing(line, Train("axle", (Axle(32.0),)))
    >>> one.positions.tolist(), [round(v, 9) for v in one.values.tolist()]
    ([0.0, 22.5, 60.0], [0.0, 450.0, 0.0])
    >>> histories = crossing_histories(line, Fleet.of_trains([one.train] * 2, [1.0, 1.0],
    ...                                                       "kip-ft"))
    >>> [[round(v, 9) for v in histories.history(k).tolist()] for k in range(2)]
    [[0.0, 450.0, 0.0], [0.0, 450.0, 0.0]]
"""

from __future__ import annotations

from dataclasses import dataclass
from typing import Any

import numpy as np

from influence.errors import ModelError
from influence.fatigue.fleet import Fleet, axles_of
from influence.fatigue.histories import Histories
from influence.fatigue.reversals import TURNING_POINT_TOLERANCE, reversal_mask
from piecewise import Piecewise
from piecewise.copies import copy_skeletons
from vehicles.loadmodel import LoadCase
from vehicles.search.effects import effect_function
from vehicles.search.prepared import as_piecewise
from vehicles.train import Train

DIRECTIONS = ("forward", "reverse")

CHUNK = 16_384
"""Vehicles computed together: large enough to amortise numpy's call overhead, small enough to
keep the skeletons of a chunk (a few tens of megabytes) in memory."""


@dataclass(frozen=True, eq=False)
class Crossing:
    """One crossing's history at a section.

    Attributes:
        train: the vehicle (or vehicles in a row).
        direction: "forward" or "reverse".
        positions: lead position of each turning point, entering to leaving [length].
        values: the effect there [response x force]; at a jump both one-sided limits appear,
            in travel order, at the same position.
        effect: the effect against the lead position, exact, for drawing [response x force].
    """

    train: Train
    direction: str
    positions: np.ndarray
    values: np.ndarray
    effect: Piecewise


def crossing(line: Any, train: Train, direction: str = "forward",
             tolerance: float = TURNING_POINT_TOLERANCE) -> Crossing:
    """The exact history of one crossing, reduced to its turning points.

    Args:
        line: the influence line (an :class:`~influence.analysis.lines.InfluenceLine`, a
            :class:`~piecewise.Piecewise` or a PPoly) [response per unit load].
        train: the axles, with fixed gaps (several vehicles: see
            :func:`~influence.fatigue.fleet.platoon`).
        direction: "forward" or "reverse".
        tolerance: steps below this fraction of the largest effect are rounding (see
            :func:`~influence.fatigue.reversals.reversal_mask`).

    Raises:
        ModelError: for an unknown direction.
    """
    _check_direction(direction)
    axles_of(train)
    effect = effect_function(line, LoadCase(train.name, train), kind="moment", sense="max",
                             direction=direction)
    skeleton = effect.skeleton
    # from the left limit where the lead axle enters to the right limit where the last leaves:
    # the constant stretches before and after add nothing
    breaks = effect.function.breaks
    on = (skeleton.positions >= breaks[1]) & (skeleton.positions <= breaks[-2])
    positions, values = skeleton.positions[on], skeleton.values[on]
    keep = reversal_mask(values[None, :], tolerance)[0]
    return Crossing(train, direction, positions[keep], values[keep], effect.function)


def crossing_histories(line: Any, fleet: Fleet, direction: str = "forward",
                       tolerance: float = TURNING_POINT_TOLERANCE) -> Histories:
    """The turning values of every vehicle's crossing, in fleet order.

    Args:
        line: the influence line [response per unit load].
        fleet: the vehicles.
        direction: "forward" or "reverse".
        tolerance: as in :func:`crossing`.

    Returns:
        One history a vehicle [response x force].
    """
    _check_direction(direction)
    function = as_piecewise(line)
    sign = -1.0 if direction == "forward" else 1.0
    values: list[np.ndarray] = []
    lengths = np.zeros(fleet.count, dtype=np.int64)
    order: list[np.ndarray] = []
    for axles, members in fleet.groups():
        for start in range(0, members.size, CHUNK):
            chunk = members[start:start + CHUNK]
            skeleton = copy_skeletons(function, sign * fleet.axle_offsets[chunk, :axles],
                                      fleet.axle_loads[chunk, :axles], positions=False)
            rows = np.ascontiguousarray(skeleton.values.T)
            keep = reversal_mask(rows, tolerance)
            values.append(rows[keep])
            lengths[chunk] = keep.sum(axis=1)
            order.append(chunk)
    if not values:
        return Histories(np.zeros(0), np.zeros(1, dtype=np.int64))
    # the groups come out by axle count: put every vehicle's history back in fleet order
    grouped = np.concatenate(order)
    flat = np.concatenate(values)
    starts = np.concatenate([[0], np.cumsum(lengths[grouped])[:-1]])
    offsets = np.concatenate([[0], np.cumsum(lengths)])
    where = np.empty(fleet.count, dtype=np.int64)
    where[grouped] = starts
    index = np.repeat(where - offsets[:-1], lengths) + np.arange(offsets[-1])
    return Histories(flat[index], offsets)


def _check_direction(direction: str) -> None:
    if direction not in DIRECTIONS:
        raise ModelError(f"unknown direction {direction!r}", item="direction",
                         fix="use " + " or ".join(DIRECTIONS))
