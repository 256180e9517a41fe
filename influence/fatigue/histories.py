"""Many short histories laid end to end: one per vehicle crossing, for counting in batches.

Units are the caller's (a stress [ksi or MPa] or an effect [kip-ft, kN, ...]).

Example:
    >>> batch = Histories.of([[0.0, 3.0, 0.0], [0.0, -1.0, 2.0, 0.0]])
    >>> batch.count, batch.offsets.tolist()
    (2, [0, 3, 7])
    >>> batch.history(1).tolist()
    [0.0, -1.0, 2.0, 0.0]
"""

from __future__ import annotations

from collections.abc import Sequence
from dataclasses import dataclass

import numpy as np

from influence.errors import InfluenceError


@dataclass(frozen=True, eq=False)
class Histories:
    """Histories end to end, validated when built; the arrays are read-only.

    Attributes:
        values: every history's values (turning points, or any samples) in time order,
            concatenated [unit of the histories].
        offsets: (histories+1,) where each history starts in ``values``; history k is
            ``values[offsets[k]:offsets[k+1]]``.
    """

    values: np.ndarray
    offsets: np.ndarray

    def __post_init__(self) -> None:
        values = np.array(self.values, dtype=float).ravel()
        offsets = np.array(self.offsets, dtype=np.int64).ravel()
        if offsets.size == 0 or offsets[0] != 0 or offsets[-1] != values.size or np.any(
                np.diff(offsets) < 0):
            raise InfluenceError(
                f"offsets {offsets[:6].tolist()}... do not split {values.size} values",
                item="offsets", fix="start at 0, never decrease, end at the number of values")
        if not np.all(np.isfinite(values)):
            bad = int(np.flatnonzero(~np.isfinite(values))[0])
            history = int(np.searchsorted(offsets, bad, side="right") - 1)
            raise InfluenceError(f"value {values[bad]} is not finite", item=f"history {history}",
                                 fix="give finite stresses or effects")
        values.setflags(write=False)
        offsets.setflags(write=False)
        object.__setattr__(self, "values", values)
        object.__setattr__(self, "offsets", offsets)

    @staticmethod
    def of(histories: Sequence[Sequence[float] | np.ndarray]) -> Histories:
        """Histories given one by one."""
        sizes = [len(history) for history in histories]
        values = (np.concatenate([np.asarray(h, dtype=float).ravel() for h in histories])
                  if histories else np.zeros(0))
        return Histories(values, np.concatenate([[0], np.cumsum(sizes, dtype=np.int64)]))

    @property
    def count(self) -> int:
        """Number of histories."""
        return int(self.offsets.size - 1)

    @property
    def lengths(self) -> np.ndarray:
        """Number of values of each history."""
        return np.diff(self.offsets)

    def history(self, k: int) -> np.ndarray:
        """History ``k``'s values [unit of the histories]."""
        return self.values[self.offsets[k]:self.offsets[k + 1]]

    def scaled(self, factor: float) -> Histories:
        """Every value times ``factor`` (an effect turned into a stress, for example)."""
        return Histories(self.values * factor, self.offsets)
