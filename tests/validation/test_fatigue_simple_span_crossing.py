"""One axle crossing a simple span: one stress cycle of range P a b / L at the section.

Reference: AISC Steel Construction Manual, Table 3-23 (shears, moments and deflections), simple
beam with a concentrated load at any point: the moment under the load at distance a from one
support and b from the other is M = P a b / L; at a section s the moment of a load at x is
P x (L - s) / L for x <= s and P s (L - x) / L for x >= s (the influence line of moment, a
triangle). The history of the crossing therefore rises from 0 to P a b / L and falls back to 0:
one cycle (two half cycles, ASTM E1049-85 5.4.4). The life follows from AASHTO LRFD Eq.
6.6.1.2.5-2 in Miner form, D = sum n (gamma_II (1 + IM) S)^3 / A (written out below).
"""

from __future__ import annotations

import math

import numpy as np

from influence.fatigue import (
    Histories,
    aashto_resistance,
    assess_histories,
    count_cycles,
    turning_points,
)

EXACT = 1e-12
L = 60.0  # span [ft]
P = 32.0  # axle [kip]
A_SECTION = 22.5  # section from the left support [ft]
B_SECTION = L - A_SECTION
S = 1200.0 / 12.0  # section modulus [in^3] / 12 [in/ft]: stresses in ksi from kip-ft / [ft-in^2]


def moment_history(positions: np.ndarray) -> np.ndarray:
    """Moment at the section while the axle stands at each position [kip-ft]."""
    x = positions
    return np.where(x <= A_SECTION, P * x * B_SECTION / L, P * A_SECTION * (L - x) / L)


def test_one_axle_gives_one_cycle_of_pab_over_l():
    positions = np.union1d(np.linspace(0.0, L, 241), [A_SECTION])
    history = moment_history(positions)
    peak = P * A_SECTION * B_SECTION / L
    points = turning_points(history)
    assert len(points) == 3 and points[0] == 0.0 and math.isclose(points[2], 0.0, abs_tol=EXACT)
    assert math.isclose(points[1], peak, rel_tol=EXACT)
    counted = count_cycles(points)
    assert [c.count for c in counted.cycles] == [0.5, 0.5]
    assert len(counted.by_range()) == 1 and counted.total == 1.0
    assert math.isclose(counted.by_range()[0][0], peak, rel_tol=EXACT)


def test_life_of_the_crossing_against_the_miner_form_of_fatigue_ii():
    """Category E', 2020 edition (gamma_II 0.80, IM 0.15), 400 trucks a day in the lane."""
    peak_stress = P * A_SECTION * B_SECTION / L / S  # [ksi]
    history = [0.0, peak_stress, 0.0]
    per_year = 365 * 400.0
    life = assess_histories(Histories.of([history]), [per_year],
                            aashto_resistance("E'", year=2020), design_life_years=75.0)
    by_hand = per_year * (0.80 * 1.15 * peak_stress) ** 3 / 3.9e8
    assert not life.infinite_life  # 1.75 x 1.15 x 4.5 ksi > 2.6 ksi
    assert math.isclose(life.damage_per_year, by_hand, rel_tol=EXACT)
    assert math.isclose(life.life_years, 1 / by_hand, rel_tol=EXACT)
    assert life.pairs() == [[peak_stress, per_year]]
