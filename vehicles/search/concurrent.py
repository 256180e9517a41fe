"""Effects concurrent with a placement: another response under exactly the same loads.

Given a :class:`~vehicles.search.placement.Placement` (found on one influence line) and another
influence line on the same path, the concurrent effect is that response with the same axle
chainages and factored loads, the same patch and lane segments and intensities, and the same
knife-edge load and position: for example the shear and the reactions concurrent with the largest
moment. Exact: point loads take ordinates, uniform loads exact integrals.

A load standing exactly on a jump of the other influence line (an axle over the section of a
shear line) makes the effect ambiguous; both one-sided values are returned, with every load
nudged toward lower chainage ("left") or higher chainage ("right").

Example:
    >>> from piecewise import Piecewise
    >>> from vehicles.loadmodel import LoadCase, LoadModel
    >>> from vehicles.search.govern import govern
    >>> from vehicles.train import Axle, Train
    >>> L = 12.0  # [m] simple span; moment and shear at midspan
    >>> moment = Piecewise(np.array([0.0, 6.0, 12.0]), np.array([[0.0, 3.0], [0.5, -0.5]]))
    >>> shear = Piecewise(np.array([0.0, 6.0, 12.0]), np.array([[0.0, 0.5], [-1 / L, -1 / L]]))
    >>> one = LoadModel("P", "one axle", "kN-m", (LoadCase("axle", Train("P", (Axle(10.0),))),))
    >>> best = govern(moment, one, kind="moment").max
    >>> c = concurrent(best, shear)
    >>> float(c.left), float(c.right), c.ambiguous  # the axle stands on the shear jump [kN]
    (-5.0, 5.0, True)
"""

from __future__ import annotations

from dataclasses import dataclass
from typing import Any

import numpy as np

from piecewise.tolerances import VALUE
from vehicles.search.placement import Placement
from vehicles.search.prepared import as_piecewise


@dataclass(frozen=True)
class Concurrent:
    """Another response under the loads of a placement [its units x force].

    Attributes:
        left, right: the value with every load nudged toward lower / higher chainage; equal
            unless a load stands exactly on a jump of this response's influence line.
        value: the value that goes with the placement: the side the placement itself took if it
            stands on a jump, otherwise ``left`` when both agree, else the one of larger
            magnitude (ambiguous; report both).
        ambiguous: the one-sided values differ beyond rounding (a load stands on a jump).
    """

    left: float
    right: float
    value: float
    ambiguous: bool


def concurrent(placement: Placement, line: Any) -> Concurrent:
    """The effect on ``line`` of exactly the loads of ``placement``.

    Args:
        placement: a governing (or any) placement.
        line: another response per unit downward load on the same path [length].
    """
    function = as_piecewise(line)
    distributed = sum(q * function.integral(a, b) for a, b, q in placement.patch_segments)
    distributed += sum(placement.lane_intensity * function.integral(a, b)
                       for a, b in placement.lane_segments)
    points = np.array(placement.axle_positions)
    loads = np.array(placement.axle_loads)
    if placement.knife_edge_position is not None:
        points = np.append(points, placement.knife_edge_position)
        loads = np.append(loads, placement.knife_edge_load)
    left, right = (distributed + float(loads @ function.values(points, side=side))
                   for side in ("left", "right"))
    extremes = function.extremes()
    scale = float(np.abs(loads).sum()) * max(abs(extremes.largest.value),
                                               abs(extremes.smallest.value))
    ambiguous = abs(left - right) > VALUE * scale
    if placement.limit_side is not None:
        value = left if placement.limit_side == "left" else right
    else:
        value = left if not ambiguous or abs(left) >= abs(right) else right
    return Concurrent(left, right, value, ambiguous)
