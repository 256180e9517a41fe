"""Absolute maximum moment of a train on a simple span: Barre's theorem and worked examples.

References:
- Barre's theorem as stated in T. G. Hicks, *Civil Engineering Formulas*, McGraw-Hill,
  ch. 2, p. 64 (confirmed), written exactly (computed): for the axles S on the span (total W,
  resultant at offset d_bar) and critical axle k at offset d_k,
  M_k(s) = W (L - s - d_bar)(s + d_k)/L - sum_{i in S, d_i < d_k} P_i (d_k - d_i),
  largest at s* = (L - d_bar - d_k)/2, clipped to the interval of s over which S is fixed.
- 24, 24, 6 k at 16 ft, 12 ft on L = 40 ft, by Barre's rule by hand (computed): all three axles
  on the span, W = 54 k, d_bar = 552/54 = 10.222 ft, the middle axle critical at s* = 6.889 ft:
  54 x 22.889^2 / 40 - 24 x 16 = 323.267 k-ft.
- A. Kassimali, *Structural Analysis*, 6th ed., Cengage, Prob. 9.22: 125, 100, 50 kN at
  0, 2, 5 m; L = 15 m: 831.856 kN m under the 100 kN load (computed by the same rule; the
  book's method).

The Barre search is written here, independent of the library; the library is asked for the
exact maximum at single sections and must reproduce it at Barre's section and never exceed it
anywhere on a grid of sections.
"""

from __future__ import annotations

import numpy as np
import pytest

from tests.influence_forms import simple_moment
from tests.section_scan import axle_train, largest_over_sections, one_case, section_grid
from vehicles.search.govern import govern

EXACT = 1e-9  # relative
GRID_SECTIONS = 79  # sections scanned across the span


def barre_absolute_maximum(L: float, loads, offsets) -> tuple[float, float]:
    """(moment, section) by Barre's rule over every subset interval, both travel directions."""
    best = (-np.inf, 0.0)
    loads = np.asarray(loads, dtype=float)
    for d in (np.asarray(offsets, dtype=float), max(offsets) - np.asarray(offsets, dtype=float)):
        events = np.unique(np.concatenate([-d, L - d]))
        for low, high in zip(events[:-1], events[1:], strict=True):
            middle = 0.5 * (low + high)
            on = (middle + d >= 0) & (middle + d <= L)
            if not on.any():
                continue
            W = loads[on].sum()
            d_bar = (loads[on] * d[on]).sum() / W
            for k in np.flatnonzero(on):
                behind = on & (d < d[k])
                for s in (np.clip((L - d_bar - d[k]) / 2, low, high), low, high):
                    moment = (W * (L - s - d_bar) * (s + d[k]) / L
                              - (loads[behind] * (d[k] - d[behind])).sum())
                    if moment > best[0]:
                        best = (float(moment), float(s + d[k]))
    return best


@pytest.mark.parametrize(
    ("L", "loads", "gaps", "published"),
    [
        (40.0, [24.0, 24.0, 6.0], [16.0, 12.0], 54 * (40 - 552 / 54 + 16) ** 2 / 160 - 24 * 16),
        (15.0, [125.0, 100.0, 50.0], [2.0, 3.0], 831.856),  # Kassimali P9.22
        (100.0, [8.0, 32.0, 32.0], [14.0, 14.0], None),  # HL-93 truck, rear gap 14 ft
        (20.0, [8.0, 32.0], [14.0], 160.0),  # H20: the 32 kip axle alone at midspan
    ],
)
def test_barre_matches_exact_section_search(L, loads, gaps, published):
    offsets = np.concatenate([[0.0], np.cumsum(gaps)])
    expected, section = barre_absolute_maximum(L, loads, offsets)
    if published is not None:
        assert expected == pytest.approx(published, abs=5e-4 * max(1.0, published / 100))
    model = one_case(axle_train(loads, gaps))
    at_barre = govern(simple_moment(L, section), model, kind="moment", section=section).max
    assert at_barre.value == pytest.approx(expected, rel=EXACT)
    assert at_barre.section_axle is not None  # the maximum stands under an axle
    scanned = largest_over_sections(L, model, section_grid(L, GRID_SECTIONS))
    assert scanned.value <= expected * (1 + EXACT)
    # the moment near its peak section falls off at most like W/L (distance)^2
    spacing = L / (GRID_SECTIONS + 1)
    assert scanned.value >= expected - sum(loads) / L * spacing**2
