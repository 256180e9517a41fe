"""How long rainflow counting takes for many short crossing histories, batched and one by one.

Run by hand (not part of the test suite):

    python benchmarks/fatigue_counting_benchmark.py [--histories 5000000] [--points 6]

Each history is an invented crossing: it starts and ends at zero with ``points - 2`` random
interior turning points (alternating peaks and valleys, as the stress at a detail of a continuous
girder under a multi-axle truck). The batched counter (:func:`influence.fatigue.count_many`) is
timed on all of them; the one-history counter of the ``rainflow`` library on a sample, scaled up
to the same number for comparison. Prints the times; asserts nothing.
"""

from __future__ import annotations

import argparse
import sys
import time
from pathlib import Path

import numpy as np
import rainflow

sys.path.insert(0, str(Path(__file__).resolve().parents[1]))

from influence.fatigue import Histories, count_many  # noqa: E402

LIBRARY_SAMPLE = 50_000
"""Histories counted one by one with the library; its time is scaled to the full number."""


def crossings(count: int, points: int, seed: int = 7) -> Histories:
    """``count`` histories of ``points`` turning points, zero at both ends [MPa]."""
    generator = np.random.default_rng(seed)
    interior = points - 2
    sizes = generator.uniform(5.0, 60.0, size=(count, interior))
    signs = np.where(np.arange(interior) % 2 == 0, 1.0, -0.4)
    values = np.zeros((count, points))
    values[:, 1:-1] = sizes * signs
    return Histories(values.ravel(), np.arange(count + 1, dtype=np.int64) * points)


def main() -> None:
    parser = argparse.ArgumentParser(description=__doc__.splitlines()[0])
    parser.add_argument("--histories", type=int, default=5_000_000)
    parser.add_argument("--points", type=int, default=6)
    options = parser.parse_args()
    batch = crossings(options.histories, options.points)
    print(f"{options.histories:,} histories of {options.points} turning points")

    started = time.perf_counter()
    cycles = count_many(batch)
    batched = time.perf_counter() - started
    print(f"batched count_many: {batched:8.2f} s  ({cycles.counts.sum():,.1f} cycles)")

    sample = min(LIBRARY_SAMPLE, options.histories)
    started = time.perf_counter()
    for k in range(sample):
        list(rainflow.extract_cycles(batch.history(k).tolist()))
    one_by_one = (time.perf_counter() - started) * options.histories / sample
    print(f"rainflow library one by one (scaled from {sample:,}): {one_by_one:8.2f} s")
    print(f"ratio: {one_by_one / batched:.1f}")


if __name__ == "__main__":
    main()
