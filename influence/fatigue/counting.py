"""Rainflow cycle counting of one history, by the two practices of ASTM E1049-85 for it.

Reference: ASTM E1049-85 (reapproved 2017), Standard Practices for Cycle Counting in Fatigue
Analysis.

- 5.4.4 (rainflow counting, the 3-point method with half cycles) is delegated to the ``rainflow``
  library (its ``extract_cycles`` implements 5.4.4 and keeps both end points as reversals), fed
  with the turning points found here: its own reversal search gives a zero-range half cycle for a
  constant series and drops the end of a two-point series, both handled here.
- 5.4.5 (simplified rainflow counting for repeating histories: start at the largest peak or
  lowest valley, whichever is larger in magnitude, so that every cycle closes) is written here,
  since the library has no such mode.

A cycle is (range, count, mean) with count 0.5 (half cycle) or 1.0; ranges and means are in the
caller's unit.
"""

from __future__ import annotations

from collections.abc import Sequence
from dataclasses import dataclass
from typing import Literal

import numpy as np
import rainflow

from influence.errors import InfluenceError
from influence.fatigue.reversals import turning_points

Method = Literal["rainflow", "repeating"]

METHODS: dict[str, str] = {
    "rainflow": "ASTM E1049-85 5.4.4 rainflow counting (3-point method, half cycles)",
    "repeating": "ASTM E1049-85 5.4.5 simplified rainflow counting for repeating histories",
}
"""The counting practices offered, by name, with the clause each follows."""


@dataclass(frozen=True)
class Cycle:
    """One counted cycle.

    Attributes:
        range: peak-to-valley range [unit of the history], at least 0.
        count: 0.5 for a half cycle, 1.0 for a full cycle.
        mean: mean of the peak and valley [unit of the history].
    """

    range: float
    count: float
    mean: float


@dataclass(frozen=True)
class CycleCount:
    """The cycles of one history and the practice that counted them.

    Attributes:
        cycles: in the order the practice extracts them.
        method: a key of :data:`METHODS`.
    """

    cycles: tuple[Cycle, ...]
    method: str

    @property
    def practice(self) -> str:
        """The method with its clause, for reports."""
        return METHODS[self.method]

    @property
    def total(self) -> float:
        """Number of cycles, half cycles counted as 0.5."""
        return sum(cycle.count for cycle in self.cycles)

    def by_range(self) -> tuple[tuple[float, float], ...]:
        """(range, summed count) for each distinct range, smallest range first."""
        totals: dict[float, float] = {}
        for cycle in self.cycles:
            totals[cycle.range] = totals.get(cycle.range, 0.0) + cycle.count
        return tuple(sorted(totals.items()))


def count_cycles(points: Sequence[float] | np.ndarray, method: Method = "rainflow") -> CycleCount:
    """Rainflow-count a history given by its turning points (or any values: non-reversals are
    dropped first, exactly).

    Args:
        points: the history in time order [stress or effect unit].
        method: "rainflow" (ASTM E1049-85 5.4.4, a single passage with its half cycles) or
            "repeating" (5.4.5, the history repeats without end, so every cycle is whole).

    Returns:
        The cycles and the method used.

    Raises:
        InfluenceError: for an unknown method.

    Example:
        >>> count_cycles([0.0, 12.5, 0.0]).by_range()  # one crossing of one axle
        ((12.5, 1.0),)
        >>> [c.count for c in count_cycles([0.0, 12.5, 0.0]).cycles]
        [0.5, 0.5]
        >>> count_cycles([0.0, 12.5, 0.0], method="repeating").cycles
        (Cycle(range=12.5, count=1.0, mean=6.25),)
        >>> count_cycles([4.0]).cycles  # a single point has no cycle
        ()
    """
    if method not in METHODS:
        raise InfluenceError(f"unknown cycle-counting method {method!r}", item="method",
                             fix="use " + " or ".join(METHODS))
    reversals = turning_points(points, tolerance=0.0)
    if method == "repeating":
        return CycleCount(_repeating(reversals), method)
    if len(reversals) == 2:
        # rainflow 3.2.0 drops the end point of a two-point series; by 5.4.4 it is a half cycle
        first, last = reversals
        return CycleCount((Cycle(abs(last - first), 0.5, 0.5 * (first + last)),), method)
    found = tuple(Cycle(float(size), float(count), float(mean))
                  for size, mean, count, _, _ in rainflow.extract_cycles(reversals))
    return CycleCount(found, method)


def _repeating(reversals: tuple[float, ...]) -> tuple[Cycle, ...]:
    """ASTM E1049-85 5.4.5: rotate to the largest-magnitude extreme, close the loop, and count
    every range Y that a later range X reaches (X >= Y) as one full cycle."""
    if len(reversals) < 2:
        return ()
    loop = list(reversals)
    if loop[0] == loop[-1]:
        loop.pop()  # the repetition joins the last point to the first one
    start = int(np.argmax(np.abs(loop)))
    closed = turning_points(loop[start:] + loop[:start] + [loop[start]], tolerance=0.0)
    stack: list[float] = []
    found = []
    for point in closed:
        stack.append(point)
        while len(stack) >= 3 and abs(stack[-1] - stack[-2]) >= abs(stack[-2] - stack[-3]):
            first, second = stack[-3], stack[-2]
            found.append(Cycle(abs(second - first), 1.0, 0.5 * (first + second)))
            del stack[-3:-1]
    return tuple(found)
