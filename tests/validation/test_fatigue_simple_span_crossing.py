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
import pytest

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


# --- the same crossing through the whole pipeline: model file, vehicle file, command ----------

ADTT_SL = 400.0  # trucks a day in the one lane


def _run(tmp_path, *extra):
    import json

    from tests.cli import invoke
    from tests.fatigue_files import girder_file, vehicle_file

    model = girder_file(tmp_path, [L], [{
        "name": "flange", "location": repr(A_SECTION), "response": "moment", "category": "E'",
        "section_modulus": 1200.0}], {"standard": "AASHTO", "edition": 2020,
                                      "adtt": ADTT_SL, "lanes": 1})
    axle = vehicle_file(tmp_path, [P], [])
    code, output = invoke("fatigue", str(model), "--vehicle", str(axle), "--format", "json",
                          *extra)
    assert code == 0, output
    return json.loads(output)["details"][0]


@pytest.mark.parametrize("direction", ["forward", "reverse", "both"])
def test_the_command_counts_one_cycle_of_pab_over_l_a_passage(tmp_path, direction):
    detail = _run(tmp_path, "--direction", direction)
    stress = P * A_SECTION * B_SECTION / L / S  # [ksi]
    ((size, cycles),) = detail["stress_ranges"]
    assert math.isclose(size, stress, rel_tol=EXACT)
    assert math.isclose(cycles, 365 * ADTT_SL, rel_tol=EXACT)
    assert detail["cycles_per_passage"]["counted"] == 1.0
    assert math.isclose(detail["cycles_per_passage"]["damage_equivalent"], 1.0, rel_tol=EXACT)
    # AASHTO LRFD Table 6.6.1.2.5-2 (from memory): a simple span over 40 ft, one cycle
    assert detail["cycles_per_passage"]["table"] == 1.0


def test_the_command_gives_the_miner_form_of_fatigue_ii(tmp_path):
    detail = _run(tmp_path)
    stress = P * A_SECTION * B_SECTION / L / S
    per_year = 365 * ADTT_SL * (0.80 * 1.15 * stress) ** 3 / 3.9e8
    assert detail["infinite_life"] is False  # 1.75 x 1.15 x 4.5 ksi > 2.6 ksi
    assert math.isclose(detail["damage_per_year"], per_year, rel_tol=EXACT)
    assert math.isclose(detail["life_years"], 1 / per_year, rel_tol=EXACT)
    # Fatigue II: (delta F)n = (A / N)^(1/3), N = 365 x 75 x n x (ADTT)SL with n = 1
    resistance = (3.9e8 / (365 * 75 * 1.0 * ADTT_SL)) ** (1 / 3)
    assert math.isclose(detail["checks"]["finite_life_resistance"], resistance, rel_tol=EXACT)
    assert math.isclose(detail["checks"]["factored_equivalent_range"], 0.80 * 1.15 * stress,
                        rel_tol=EXACT)
