"""How long the exact governing search takes, against a brute-force stepping search, side by side.

Run by hand (not part of the test suite):

    python benchmarks/placement_benchmark.py [--steps 4000] [--repeat 5]

Responses: bending moments and reactions of a five-span continuous beam (30-40-40-40-30 m,
cubic influence lines from the three-moment equation, tests/influence_forms.py). Vehicles: the
HL-93 design truck with its 4.3-9.0 m rear spacing (AASHTO LRFD Fig. 3.6.1.2.2-1, SI) with the
9.3 kN/m lane and IM 33 %, the design tandem with the lane, and an invented four-axle train with
a trailing 20 m wagon load. For each (response, vehicle) the exact search (both directions, both
senses, ranged gap solved exactly) is timed against a brute force that steps the lead position
(``--steps`` positions a direction) for every gap on a grid (ranged vehicles) and refines the
best steps locally; both values are printed with the ratio of times.
"""

from __future__ import annotations

import argparse
import sys
import time
from pathlib import Path

import numpy as np
from scipy.optimize import minimize_scalar

sys.path.insert(0, str(Path(__file__).resolve().parents[1]))

from tests.influence_forms import continuous_moment, continuous_reaction  # noqa: E402
from vehicles.loadmodel import LoadCase, LoadModel  # noqa: E402
from vehicles.search.govern import govern  # noqa: E402
from vehicles.train import Axle, Patch, Train  # noqa: E402

SPANS = (30.0, 40.0, 40.0, 40.0, 30.0)  # [m]
GAP_GRID = 17  # brute force: gap values tried for a ranged vehicle


def responses() -> dict[str, tuple[object, str]]:
    supports = np.concatenate([[0.0], np.cumsum(SPANS)])
    found: dict[str, tuple[object, str]] = {}
    for at in (12.0, 30.0, 50.0, 70.0, 90.0):
        found[f"M at {at:g} m"] = (continuous_moment(SPANS, at), "moment")
    for index in (0, 2):
        found[f"R at {supports[index]:g} m"] = (continuous_reaction(SPANS, index), "reaction")
    return found


def vehicles() -> dict[str, LoadModel]:
    truck = Train("design truck", (Axle(35.0), Axle(145.0, 4.3), Axle(145.0, (4.3, 9.0))))
    tandem = Train("design tandem", (Axle(110.0), Axle(110.0, 1.2)))
    wagon = Train("axles and wagon", (Axle(120.0), Axle(120.0, 1.8), Axle(120.0, 1.8),
                                      Axle(120.0, 1.8), Patch(40.0, 20.0, 3.0)))
    return {
        "truck + lane": LoadModel("truck", "truck", "kN-m", (
            LoadCase("truck + lane", truck, axle_allowance=0.33, lane=9.3),)),
        "tandem + lane": LoadModel("tandem", "tandem", "kN-m", (
            LoadCase("tandem + lane", tandem, axle_allowance=0.33, lane=9.3),)),
        "axles and wagon": LoadModel("wagon", "wagon", "kN-m", (LoadCase("wagon", wagon),)),
    }


def brute_force(line, case: LoadCase, steps: int) -> tuple[float, float]:
    """(max, min) by stepping the lead position; every gap of a grid for a ranged train."""
    train = case.train
    assert train is not None
    ranges = train.ranged_values
    gap_values = np.linspace(ranges[0].low, ranges[0].high, GAP_GRID) if ranges else [None]
    area = line.antiderivative()
    start, end = line.x[0], line.x[-1]
    grid = np.linspace(start, end, 20_001)
    values = line(grid)
    lane = case.lane * np.trapezoid(np.maximum(values, 0), grid), case.lane * np.trapezoid(
        np.minimum(values, 0), grid)
    high, low = -np.inf, np.inf
    for gap in gap_values:
        a = train.arranged(None if gap is None else (gap,))
        loads = a.axle_loads * (1 + case.axle_allowance)

        def effect(leads, sign, a=a, loads=loads):
            leads = np.atleast_1d(leads)
            at = leads[:, None] + sign * a.axle_offsets[None, :]
            total = np.where((at >= start) & (at <= end), line(np.clip(at, start, end)), 0) @ loads
            for s, e, q in zip(a.patch_starts, a.patch_ends, a.patch_intensities, strict=True):
                lo, hi = np.sort([leads + sign * s, leads + sign * e], axis=0)
                total += q * (area(np.clip(hi, start, end)) - area(np.clip(lo, start, end)))
            return total

        length = a.extent[1]
        for sign in (-1.0, 1.0):
            leads = np.linspace(start - length, end + length, steps)
            step = leads[1] - leads[0]
            e = effect(leads, sign)
            for i, better in ((int(np.argmax(e)), 1.0), (int(np.argmin(e)), -1.0)):
                r = minimize_scalar(lambda x, s=sign, b=better: -b * effect(x, s)[0],
                                    bounds=(leads[i] - step, leads[i] + step), method="bounded")
                value = max(better * e[i], -r.fun) * better
                high, low = max(high, value), min(low, value)
    return high + lane[0], low + lane[1]


def timed(function, repeat: int) -> tuple[float, object]:
    best, result = np.inf, None
    for _ in range(repeat):
        start = time.perf_counter()
        result = function()
        best = min(best, time.perf_counter() - start)
    return best, result


def main() -> None:
    parser = argparse.ArgumentParser(description=__doc__.splitlines()[0])
    parser.add_argument("--steps", type=int, default=4000)
    parser.add_argument("--repeat", type=int, default=5)
    args = parser.parse_args()
    print(f"{'response':<12} {'vehicle':<16} {'exact max':>11} {'brute max':>11} "
          f"{'exact min':>11} {'brute min':>11} {'exact ms':>9} {'brute ms':>9} {'ratio':>7}")
    totals = [0.0, 0.0]
    for name, (line, kind) in responses().items():
        for vehicle, model in vehicles().items():
            exact_s, result = timed(lambda line=line, kind=kind, model=model: govern(
                line, model, kind=kind), args.repeat)
            brute_s, (high, low) = timed(lambda line=line, model=model: brute_force(
                line, model.cases[0], args.steps), max(1, args.repeat // 5))
            totals[0] += exact_s
            totals[1] += brute_s
            print(f"{name:<12} {vehicle:<16} {result.max.value:11.3f} {high:11.3f} "
                  f"{result.min.value:11.3f} {low:11.3f} {exact_s * 1e3:9.2f} "
                  f"{brute_s * 1e3:9.2f} {brute_s / exact_s:7.1f}")
    count = len(responses()) * len(vehicles())
    print(f"mean per (response, vehicle): exact {totals[0] / count * 1e3:.2f} ms, brute force "
          f"{totals[1] / count * 1e3:.2f} ms, ratio {totals[1] / totals[0]:.1f}")


if __name__ == "__main__":
    main()
