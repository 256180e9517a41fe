"""The exact search against an independent brute-force search on continuous beams.

Issue 5's check: fine stepping of the lead position plus local refinement, written here with
scipy's own PPoly evaluation and integration (not vehicles.effect); the exact answer must equal or
exceed it and agree within 0.01 %. Influence lines from the three-moment equation
(tests/influence_forms.py); cubic pieces, sagging and hogging parts.
"""

from __future__ import annotations

import numpy as np
import pytest
from scipy.optimize import minimize_scalar

from tests.influence_forms import continuous_moment, continuous_reaction
from tests.section_scan import one_case
from vehicles.search.govern import govern
from vehicles.train import Axle, Patch, Train

AGREEMENT = 1e-4  # 0.01 %, the criterion
ROUNDING = 1e-9  # relative: the exact answer may not fall below the brute force by more
STEPS = 6000  # lead positions across the passage
SPANS = (30.0, 40.0, 30.0)  # [m]

LINES = {
    "moment at 0.4 of span 1": (continuous_moment(SPANS, 12.0), "moment", False),
    "moment over support B": (continuous_moment(SPANS, 30.0), "moment", False),
    "moment at midspan 2": (continuous_moment(SPANS, 50.0), "moment", False),
    "reaction at support B": (continuous_reaction(SPANS, 1), "reaction", True),
}
TRAINS = {
    # design truck axles of AASHTO LRFD Fig. 3.6.1.2.2-1 (SI), rear gap fixed
    "truck": Train("truck", (Axle(35.0), Axle(145.0, 4.3), Axle(145.0, 4.3))),
    # invented: axles with a trailing uniform load 20 m long (quartic effect pieces)
    "axles and wagon": Train("wagon", (Axle(120.0), Axle(120.0, 1.8), Patch(40.0, 20.0, 3.0))),
}


def brute_force(line, train, sense):
    arrangement = train.arranged()
    area = line.antiderivative()
    start, end = line.x[0], line.x[-1]
    sign = 1.0 if sense == "max" else -1.0

    def effect(leads, direction):
        leads = np.atleast_1d(leads)
        at = leads[:, None] + direction * arrangement.axle_offsets[None, :]
        ordinates = np.where((at >= start) & (at <= end), line(np.clip(at, start, end)), 0.0)
        total = ordinates @ arrangement.axle_loads
        for a, b, q in zip(arrangement.patch_starts, arrangement.patch_ends,
                           arrangement.patch_intensities, strict=True):
            low, high = np.sort([leads + direction * a, leads + direction * b], axis=0)
            total += q * (area(np.clip(high, start, end)) - area(np.clip(low, start, end)))
        return sign * total

    best = -np.inf
    length = arrangement.extent[1]
    for direction in (-1.0, 1.0):
        leads = np.linspace(start - length - 1.0, end + length + 1.0, STEPS)
        values = effect(leads, direction)
        step = leads[1] - leads[0]
        for i in np.argsort(values)[-8:]:
            refined = minimize_scalar(lambda x, d=direction: -effect(x, d)[0],
                                      bounds=(leads[i] - step, leads[i] + step), method="bounded",
                                      options={"xatol": 1e-10})
            best = max(best, values[i], -refined.fun)
    return sign * best


@pytest.mark.parametrize("line_name", LINES)
@pytest.mark.parametrize("train_name", TRAINS)
def test_exact_equals_or_exceeds_brute_force(line_name, train_name):
    line, kind, interior = LINES[line_name]
    train = TRAINS[train_name]
    result = govern(line, one_case(train), kind=kind, interior=interior)
    for sense, exact in (("max", result.max.value), ("min", result.min.value)):
        sampled = brute_force(line, train, sense)
        sign = 1.0 if sense == "max" else -1.0
        scale = max(abs(exact), 1e-12)
        assert sign * exact >= sign * sampled - ROUNDING * scale
        assert abs(exact - sampled) <= AGREEMENT * scale
