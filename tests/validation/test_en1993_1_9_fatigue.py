"""EN 1993-1-9:2005, Eurocode 3: Design of steel structures, Part 1-9: Fatigue, CEN, Brussels.

- 7.1 and Figure 7.1, fatigue strength curves for direct stress ranges: delta_sigma^m N =
  delta_sigma_C^m x 2e6 with m = 3 for N <= 5e6; m = 5 for 5e6 < N <= 1e8; no damage below the
  cut-off delta_sigma_L at 1e8. Figure 7.1 states delta_sigma_D = (2/5)^(1/3) delta_sigma_C =
  0.737 delta_sigma_C and delta_sigma_L = (5/100)^(1/5) delta_sigma_D = 0.549 delta_sigma_D
  (confirmed, as quoted in published design guides).
- Figure 7.2, shear stress ranges: m = 5 down to the cut-off at 1e8,
  delta_tau_L = (2/100)^(1/5) delta_tau_C = 0.457 delta_tau_C (from memory, unconfirmed).
- The fourteen detail categories 160 ... 36 (count confirmed, list from memory).
- Annex A, damage D = sum n_Ei / N_Ri <= 1.0 with N_Ri from the curve divided by gamma_Mf
  (confirmed form); the two-block sums below are worked by hand from the curve equations.
"""

from __future__ import annotations

import math

import numpy as np
import pytest

from influence.fatigue import assess_spectrum, en_curve, en_resistance, miner_sum
from influence.fatigue.eurocode import categories

PRINTED = 0.0005
"""Absolute: Figure 7.1 prints the ratios to three decimals."""

EXACT = 1e-12

CATEGORIES = ("160", "140", "125", "112", "100", "90", "80", "71", "63", "56", "50", "45", "40",
              "36")


def test_fourteen_direct_stress_categories():
    assert categories("normal") == CATEGORIES


@pytest.mark.parametrize("category", CATEGORIES)
def test_knee_and_cut_off_relations_of_figure_7_1(category):
    curve = en_curve(category, gamma_Mf=1.0)
    delta_c = float(category)
    assert math.isclose(curve.knee_range, (2 / 5) ** (1 / 3) * delta_c, rel_tol=EXACT)
    assert math.isclose(curve.cutoff_range, (5 / 100) ** (1 / 5) * curve.knee_range,
                        rel_tol=EXACT)
    assert abs(curve.knee_range / delta_c - 0.737) <= PRINTED
    assert abs(curve.cutoff_range / curve.knee_range - 0.549) <= PRINTED
    assert curve.fatigue_limit == curve.knee_range
    assert math.isclose(curve.knee_cycles, 5e6, rel_tol=EXACT)


@pytest.mark.parametrize("category", CATEGORIES)
def test_endurance_on_each_branch(category):
    """N = 2e6 at delta_sigma_C; 5e6 at delta_sigma_D; 1e8 just above delta_sigma_L; inf below."""
    curve = en_curve(category, gamma_Mf=1.0)
    delta_c = float(category)
    ranges = np.array([delta_c, curve.knee_range, curve.cutoff_range * (1 + 1e-12),
                       curve.cutoff_range * 0.999])
    n_c, n_d, n_l, below = curve.endurance(ranges)
    assert math.isclose(n_c, 2e6, rel_tol=EXACT)
    assert math.isclose(n_d, 5e6, rel_tol=EXACT)
    assert math.isclose(n_l, 1e8, rel_tol=1e-10)
    assert below == math.inf


def test_gamma_mf_divides_the_strength():
    """The design curve is delta_sigma_C / gamma_Mf at 2e6 cycles (EN 1993-1-9 Annex A)."""
    curve = en_curve("90", gamma_Mf=1.35)
    assert math.isclose(curve.reference_range, 90.0 / 1.35, rel_tol=EXACT)
    assert math.isclose(curve.knee_range, (2 / 5) ** (1 / 3) * 90.0 / 1.35, rel_tol=EXACT)


def test_shear_curve_of_figure_7_2():
    curve = en_curve("80", gamma_Mf=1.0, stress="shear")
    assert curve.slope == 5.0
    assert math.isclose(curve.cutoff_range, (2 / 100) ** (1 / 5) * 80.0, rel_tol=EXACT)
    assert abs(curve.cutoff_range / 80.0 - 0.457) <= PRINTED
    assert math.isclose(float(curve.endurance(np.array([80.0]))[0]), 2e6, rel_tol=EXACT)


def test_miner_sum_of_two_blocks_by_hand():
    """Category 71, gamma_Mf 1.15: 1e5 cycles of 90 MPa (slope 3) and 2e6 of 40 MPa (slope 5).

    N1 = 2e6 (delta_C / gamma_Mf / 90)^3; N2 = 5e6 (delta_D / gamma_Mf / 40)^5 since
    delta_L / gamma_Mf = 24.98 < 40 < delta_D / gamma_Mf = 45.49; D = n1/N1 + n2/N2."""
    delta_c, gamma = 71.0, 1.15
    delta_d = (2 / 5) ** (1 / 3) * delta_c
    n1 = 2e6 * (delta_c / gamma / 90.0) ** 3
    n2 = 5e6 * (delta_d / gamma / 40.0) ** 5
    by_hand = 1e5 / n1 + 2e6 / n2
    curve = en_curve("71", gamma_Mf=gamma)
    assert math.isclose(miner_sum([90.0, 40.0], [1e5, 2e6], curve), by_hand, rel_tol=EXACT)


def test_ranges_below_the_cut_off_do_no_damage():
    curve = en_curve("71", gamma_Mf=1.0)
    with_small = miner_sum([90.0, 20.0], [1e5, 1e9], curve)
    assert with_small == miner_sum([90.0], [1e5], curve)


def test_equivalent_range_at_two_million_is_the_damage_check():
    """gamma_Ff delta_sigma_E,2 <= delta_sigma_C / gamma_Mf holds exactly when the design-life
    Miner sum is at most 1: a spectrum scaled to D_life = 1 has delta_sigma_E,2 = delta_C /
    gamma_Mf (computed from the definition)."""
    resistance = en_resistance("56", gamma_Mf=1.35)
    ranges, cycles = [70.0, 45.0, 30.0, 10.0], [2e3, 3e4, 2e5, 1e6]
    life = assess_spectrum(ranges, cycles, resistance, design_life_years=100.0)
    scale = 1.0 / life.design_life_damage
    scaled = assess_spectrum(ranges, [c * scale for c in cycles], resistance, 100.0)
    assert math.isclose(scaled.design_life_damage, 1.0, rel_tol=1e-12)
    assert math.isclose(scaled.equivalent_range, 56.0 / 1.35, rel_tol=1e-12)
    assert math.isclose(life.equivalent_range,
                        56.0 / 1.35 * life.design_life_damage ** (1 / 3), rel_tol=1e-12)


def test_spectrum_wholly_below_the_fatigue_limit_has_infinite_life():
    resistance = en_resistance("71", gamma_Mf=1.0)
    below = resistance.limit_range
    life = assess_spectrum([below, 0.9 * below], [1e7, 1e8], resistance, 100.0)
    assert life.infinite_life and life.damage_per_year == 0.0 and life.life_years == math.inf
    assert life.governing_range == below


def test_unknown_category_lists_the_known_ones():
    with pytest.raises(ValueError, match=r"unknown EN 1993-1-9 normal-stress .* '70'.*160, 140"):
        en_curve("70", gamma_Mf=1.0)


def test_two_block_spectrum_through_the_whole_pipeline_by_hand(tmp_path):
    """Two single-axle trucks of a spectrum file cross a 20 m simple span; the detail at 8 m sees
    one cycle of M = P a b / L each (statics of a simple beam, AISC Manual Table 3-23), stress
    M / W. One range above the knee (slope 3), one between the knee and the cut-off (slope 5);
    Annex A's sum written out with the curve of 7.1, category 71, gamma_Mf 1.35, gamma_Ff 1."""
    import json

    from tests.cli import invoke
    from tests.fatigue_files import girder_file, spectrum_file

    span, a, modulus = 20.0, 8.0, 2.0e7  # [m], [m], [mm^3]
    model = girder_file(tmp_path, [span], [{
        "name": "web gusset", "location": repr(a), "response": "moment", "category": "71",
        "section_modulus": modulus}], {"standard": "EN", "gamma_Mf": 1.35}, units="kN-m")
    trucks = spectrum_file(tmp_path, ["axle_1 [kN]", "per_day [-]"], [[250, 100], [150, 400]])
    code, output = invoke("fatigue", str(model), "--spectrum", str(trucks), "--format", "json")
    assert code == 0, output
    detail = json.loads(output)["details"][0]
    stress = [p * a * (span - a) / span * 1e6 / modulus for p in (250.0, 150.0)]  # [MPa]
    per_year = [365 * 100.0, 365 * 400.0]
    found = np.array(detail["stress_ranges"])
    assert found.shape == (2, 2)
    assert np.allclose(found, [[stress[0], per_year[0]], [stress[1], per_year[1]]], rtol=EXACT,
                       atol=0.0)
    delta_c = 71.0 / 1.35
    delta_d = (2 / 5) ** (1 / 3) * delta_c
    assert delta_d < stress[0] and (5 / 100) ** (1 / 5) * delta_d < stress[1] < delta_d
    by_hand = (per_year[0] / (2e6 * (delta_c / stress[0]) ** 3)
               + per_year[1] / (5e6 * (delta_d / stress[1]) ** 5))
    assert detail["infinite_life"] is False
    assert math.isclose(detail["damage_per_year"], by_hand, rel_tol=EXACT)
    assert math.isclose(detail["life_years"], 1 / by_hand, rel_tol=EXACT)
    # the equivalent range at 2e6 cycles doing the damage of the 100-year design life
    assert math.isclose(detail["equivalent_range"], delta_c * (100 * by_hand) ** (1 / 3),
                        rel_tol=EXACT)
