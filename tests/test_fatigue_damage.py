"""Miner damage, life and the infinite-life rule, with sums worked by hand in the tests."""

from __future__ import annotations

import math

import numpy as np
import pytest

from influence.errors import InfluenceError
from influence.fatigue import (
    Histories,
    aashto_resistance,
    assess_counted,
    assess_histories,
    assess_spectrum,
    count_many,
    en_resistance,
    miner_sum,
)
from influence.fatigue.aashto import aashto_curve, fatigue_ii_resistance

EXACT = 1e-12


def test_aashto_two_block_miner_sum_by_hand():
    """Category C (A = 44e8 ksi^3): 2e5 cycles of 9 ksi and 3e6 of 4 ksi; both below and above
    the 10 ksi threshold count on the slope-3 line: D = sum n S^3 / A."""
    by_hand = (2e5 * 9.0**3 + 3e6 * 4.0**3) / 44e8
    assert math.isclose(miner_sum([9.0, 4.0], [2e5, 3e6], aashto_curve("C")), by_hand,
                        rel_tol=EXACT)


def test_aashto_threshold_rule():
    """Fatigue I: infinite life while gamma_I (1 + IM) (delta f)max <= (delta F)TH; then the
    spectrum does no damage. Above it every range counts, factored by gamma_II (1 + IM)."""
    resistance = aashto_resistance("D", year=2020)  # (delta F)TH = 7 ksi, 1.75, 0.80, IM 0.15
    limit = 7.0 / (1.75 * 1.15)
    assert math.isclose(resistance.limit_range, limit, rel_tol=EXACT)
    safe = assess_spectrum([limit, 1.0], [1e6, 1e7], resistance, 75.0)
    assert safe.infinite_life and safe.damage_per_year == 0.0 and safe.life_years == math.inf
    assert safe.governing_range == limit
    above = assess_spectrum([limit * 1.01, 1.0], [1e6, 1e7], resistance, 75.0, age_years=30.0)
    factor = 0.80 * 1.15
    by_hand = (1e6 * (factor * limit * 1.01) ** 3 + 1e7 * factor**3) / 22e8
    assert not above.infinite_life
    assert math.isclose(above.damage_per_year, by_hand, rel_tol=EXACT)
    assert math.isclose(above.remaining_years, 1 / by_hand - 30.0, rel_tol=EXACT)


def test_remaining_life_never_negative():
    resistance = aashto_resistance("E'", year=2020)
    life = assess_spectrum([10.0], [1e6], resistance, 75.0, age_years=80.0)
    assert life.life_years < 80.0 and life.remaining_years == 0.0


def test_aashto_effective_range_matches_the_fatigue_ii_check():
    """gamma_II (delta f)eff <= (A/N)^(1/3) with N the life's cycles is the Miner check
    D_life <= 1 (computed both ways): (gamma_II (delta f)eff)^3 N / A = D_life."""
    resistance = aashto_resistance("B", year=2020, dynamic_allowance=0.0)
    ranges, per_year = np.array([14.0, 9.0, 3.0]), np.array([1e4, 5e4, 4e5])
    life = assess_spectrum(ranges, per_year, resistance, 75.0)
    effective = (np.sum(per_year * ranges**3) / np.sum(per_year)) ** (1 / 3)
    assert math.isclose(life.equivalent_range, effective, rel_tol=EXACT)
    cycles = 75.0 * per_year.sum()
    assert math.isclose((0.80 * effective) ** 3 * cycles / 120e8, life.design_life_damage,
                        rel_tol=1e-12)
    adtt_sl = per_year.sum() / 365.0
    resistance_ii = fatigue_ii_resistance("B", 1.0, adtt_sl)
    assert math.isclose((0.80 * effective / resistance_ii) ** 3, life.design_life_damage,
                        rel_tol=1e-12)


def test_equal_ranges_are_pooled_and_sorted():
    life = assess_spectrum([3.0, 5.0, 3.0, 0.0, 2.0], [1.0, 2.0, 4.0, 9.0, 0.0],
                           en_resistance("36", 1.0), 100.0)
    assert life.pairs() == [[5.0, 2.0], [3.0, 5.0]]


def test_empty_spectrum():
    life = assess_spectrum([], [], en_resistance("36", 1.0), 100.0)
    assert life.infinite_life and life.equivalent_range == 0.0 and life.pairs() == []


def test_cycles_per_passage_rule_counts_the_full_range():
    """n cycles of max - min a passage (AASHTO fatigue truck) instead of the rainflow count."""
    histories = Histories.of([[0.0, 4.0, -1.0, 3.0, 0.0]])
    life = assess_histories(histories, [1000.0], aashto_resistance("E"), 75.0,
                            cycles_per_passage=1.5)
    assert life.pairs() == [[5.0, 1500.0]]


def test_counted_effects_scaled_to_stress():
    """Counting effects once and scaling gives the ranges of counting the stresses."""
    effects = Histories.of([[0.0, 300.0, -80.0, 0.0], [0.0, 120.0, 0.0]])
    stress_per_effect = 12.0 / 950.0  # kip-ft to ksi over S = 950 in^3
    direct = assess_histories(effects.scaled(stress_per_effect), [50.0, 70.0],
                              aashto_resistance("C"), 75.0)
    counted = assess_counted(count_many(effects), [50.0, 70.0], aashto_resistance("C"), 75.0,
                             stress_per_effect=stress_per_effect)
    assert np.allclose(direct.ranges, counted.ranges, rtol=EXACT)
    assert math.isclose(direct.damage_per_year, counted.damage_per_year, rel_tol=1e-12)


@pytest.mark.parametrize(("ranges", "cycles", "message"), [
    ([1.0, 2.0], [1.0], "2 ranges but 1"),
    ([-1.0], [1.0], "stress range -1.0"),
    ([1.0], [float("nan")], "cycles per year nan"),
])
def test_bad_spectra(ranges, cycles, message):
    with pytest.raises(InfluenceError, match=message):
        assess_spectrum(ranges, cycles, en_resistance("71", 1.0), 100.0)


def test_passages_must_match_the_crossings():
    with pytest.raises(InfluenceError, match="1 passage numbers for 2 crossings"):
        assess_histories(Histories.of([[0.0, 1.0], [0.0, 2.0]]), [3.0],
                         aashto_resistance("C"), 75.0)


def test_assess_detail_from_counted_effects():
    """Effects [kip-ft] counted once, turned into stress by the detail: S = M x 12 / 1200 in^3;
    life by hand with the 2020 factors: D = n (0.80 x 1.15 x S)^3 / A (category E', A = 3.9e8)."""
    from influence.fatigue import assess_detail, fatigue_details, fatigue_settings
    document = {"fatigue": {"standard": "AASHTO", "edition": 2020, "age_years": 20},
                "fatigue_detail": [{"name": "cover plate", "location": "30.0",
                                    "response": "moment", "category": "E'",
                                    "section_modulus": 1200.0}]}
    settings = fatigue_settings(document, "bridge.toml", units="kip-ft")
    detail = fatigue_details(document, settings, "bridge.toml")[0]
    assert settings is not None
    effects = count_many(Histories.of([[0.0, 450.0, 0.0], [0.0, 300.0, -60.0, 0.0]]))
    per_year = [365 * 400.0, 365 * 100.0]
    life = assess_detail(detail, settings, effects, per_year)
    stress = [450.0 * 12 / 1200, 360.0 * 12 / 1200, 300.0 * 12 / 1200, 60.0 * 12 / 1200]
    cycles = [per_year[0], per_year[1] * 0.5, per_year[1] * 0.5, per_year[1] * 0.5]
    by_hand = sum(n * (0.92 * s) ** 3 for n, s in zip(cycles, stress, strict=True)) / 3.9e8
    assert math.isclose(life.damage_per_year, by_hand, rel_tol=1e-12)
    assert math.isclose(life.remaining_years, 1 / by_hand - 20.0, rel_tol=1e-12)
