"""A stress history reduced to its turning points (peaks, valleys and both end points).

Cycle counting works on reversals only (ASTM E1049-85 (reapproved 2017), Standard Practices for
Cycle Counting in Fatigue Analysis, 3.2 and 5.4.4). Both end points are kept: a history whose ends
are dropped loses its half cycles and miscounts the standard's own example. A sampled history, or
one evaluated from exact polynomial pieces in floating point, carries wiggles far smaller than
anything of engineering interest; a gate of :data:`TURNING_POINT_TOLERANCE` times the history's
largest absolute value keeps them out. Values are in the caller's stress or effect unit.
"""

from __future__ import annotations

from collections.abc import Sequence

import numpy as np

TURNING_POINT_TOLERANCE = 1e-9
"""Smallest reversal kept, relative to the largest absolute value of the history: a change of
direction by no more than this is treated as noise (rounding in the evaluation of exact pieces)."""


def turning_points(
    history: Sequence[float] | np.ndarray, tolerance: float = TURNING_POINT_TOLERANCE
) -> tuple[float, ...]:
    """The peaks and valleys of a history, with its first and last values, in order.

    A reversal counts once the history has come back from its running extreme by more than
    ``tolerance`` times the largest absolute value of the history (a hysteresis gate); repeated
    values and points on a monotonic run are dropped. With ``tolerance=0`` every strict change of
    direction is kept.

    Args:
        history: sampled or exact values in time order [stress or effect unit].
        tolerance: relative gate, at least 0.

    Returns:
        The turning points [same unit]; empty for an empty history, one value for a constant one.

    Example:
        >>> turning_points([0.0, 1.0, 2.0, 2.0, 1.0, -1.0, 0.5])
        (0.0, 2.0, -1.0, 0.5)
        >>> turning_points([0.0, 5.0, 5.0 - 1e-12, 5.0, 0.0])  # a rounding wiggle at the peak
        (0.0, 5.0, 0.0)
        >>> turning_points([3.0, 3.0])
        (3.0,)
    """
    values = np.asarray(history, dtype=float).ravel()
    if values.size == 0:
        return ()
    gate = tolerance * float(np.max(np.abs(values)))
    found = [float(values[0])]
    direction = 0  # +1 rising, -1 falling, 0 not yet left the start
    extreme = found[0]
    for x in values[1:].tolist():
        if direction == 0:
            if abs(x - found[0]) > gate:
                direction = 1 if x > found[0] else -1
                extreme = x
        elif (x - extreme) * direction >= 0:
            extreme = x
        elif abs(x - extreme) > gate:
            found.append(extreme)
            direction = -direction
            extreme = x
    if direction != 0:
        found.append(extreme)
    return tuple(found)


def reversal_mask(values: np.ndarray, tolerance: float = TURNING_POINT_TOLERANCE) -> np.ndarray:
    """Which entries of many histories at once are turning points, one row a history.

    The entries of a row are candidates in time order (a skeleton: every point where the
    history may turn, some repeated). The first and last entries are kept; between them an
    entry is kept where the history arrives by a step and its next step goes the other way. A
    step of no more than ``tolerance`` times the row's largest absolute value counts as no
    step (rounding in exact pieces), so a plateau keeps its first entry.

    Args:
        values: (histories, entries) candidate values [stress or effect unit].
        tolerance: relative gate, at least 0.

    Returns:
        (histories, entries) True at the turning points.

    Example:
        >>> reversal_mask(np.array([[0.0, 2.0, 2.0, 2.0, 1.0, 5.0, 0.0]]))[0].tolist()
        [True, True, False, False, True, True, True]
        >>> reversal_mask(np.array([[3.0, 3.0]]))[0].tolist()  # no step: both ends only
        [True, True]
    """
    count, entries = values.shape
    turning = np.zeros(values.shape, dtype=bool)
    if entries == 0:
        return turning
    turning[:, 0] = True
    turning[:, -1] = True
    step = np.diff(values, axis=1)
    gate = tolerance * np.max(np.abs(values), axis=1)
    moving = np.flatnonzero(np.abs(step) > gate[:, None])  # real steps, history by history
    history, at = np.divmod(moving, max(entries - 1, 1))
    rising = step.ravel()[moving] > 0
    turns = (history[1:] == history[:-1]) & (rising[1:] != rising[:-1])
    turning[history[:-1][turns], at[:-1][turns] + 1] = True
    return turning
