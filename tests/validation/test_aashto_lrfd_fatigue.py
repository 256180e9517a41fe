"""AASHTO LRFD Bridge Design Specifications, American Association of State Highway and
Transportation Officials, Washington DC: load-induced fatigue of steel details, 6.6.1.2.

- Table 6.6.1.2.5-1 / -3, detail constants A and thresholds (delta F)TH: A 250e8 / 24 ksi,
  B 120e8 / 16, B' 61e8 / 12, C 44e8 / 10, D 22e8 / 7, E 11e8 / 4.5 (confirmed: the same values
  in AISC 360 Table A-3.1); C' 44e8 / 12 and E' 3.9e8 / 2.6 (from memory, unconfirmed).
- Table 6.6.1.2.3-2, the 75-year (ADTT)SL equivalent to infinite life, as remembered for the
  editions before 2014 (Fatigue I 1.50, Fatigue II 0.75) and from 2014 on (1.75, 0.80); from
  memory, unconfirmed. The table follows from the constants:
  (ADTT)SL = A / [365 x 75 x n x ((delta F)TH gamma_II / gamma_I)^3] with n = 1 (computed; the
  remembered values agree within the table's rounding).
- Eq. 6.6.1.2.5-2 and -3: (delta F)n = (A/N)^(1/3), N = 365 x 75 x n x (ADTT)SL (from memory).
- Table 6.6.1.2.5-2, cycles per truck passage; Table 3.6.1.4.2-1, fraction of trucks in a single
  lane p (both from memory, unconfirmed).
"""

from __future__ import annotations

import math

import pytest

from influence.fatigue import aashto
from influence.fatigue.units import STRESS_MPA

TABLE_ROUNDING = 0.005
"""Relative: the printed (ADTT)SL table rounds to the nearest 5 or so."""

SI_ROUNDING = 0.005
"""Relative: the SI edition prints its constants to three figures."""

WHOLE_MPA = 0.5
"""Absolute [MPa]: the SI edition prints thresholds to whole MPa."""

EXACT = 1e-12

CONSTANTS = {"A": (250e8, 24.0), "B": (120e8, 16.0), "B'": (61e8, 12.0), "C": (44e8, 10.0),
             "C'": (44e8, 12.0), "D": (22e8, 7.0), "E": (11e8, 4.5), "E'": (3.9e8, 2.6)}
"""A [ksi^3] and (delta F)TH [ksi] of Tables 6.6.1.2.5-1 and -3."""

INFINITE_LIFE_ADTT = {  # category: (before 2014, 2014 and later), Table 6.6.1.2.3-2
    "A": (530, 690), "B": (860, 1120), "B'": (1035, 1350), "C": (1290, 1680),
    "C'": (745, 975), "D": (1875, 2450), "E": (3530, 4615), "E'": (6485, 8485)}

EDITIONS = {2010: (1.50, 0.75), 2020: (1.75, 0.80)}
"""An edition year of each period: (Fatigue I, Fatigue II) load factors (Table 3.4.1-1)."""


@pytest.mark.parametrize("category", CONSTANTS)
def test_constants_of_the_curves(category):
    curve = aashto.aashto_curve(category)
    constant, threshold = CONSTANTS[category]
    assert curve.fatigue_limit == threshold
    assert math.isclose(curve.reference_cycles * curve.reference_range**3, constant,
                        rel_tol=EXACT)
    assert curve.slope == 3.0


@pytest.mark.parametrize("category", CONSTANTS)
@pytest.mark.parametrize("year", EDITIONS)
def test_infinite_life_adtt_table_from_the_constants(category, year):
    """Table 6.6.1.2.3-2 from A, (delta F)TH and the edition's load factors."""
    constant, threshold = CONSTANTS[category]
    gamma_i, gamma_ii = EDITIONS[year]
    n = 1.0
    computed = constant / (365 * 75 * n * (threshold * gamma_ii / gamma_i) ** 3)
    assert math.isclose(aashto.infinite_life_adtt(category, year), computed, rel_tol=EXACT)
    remembered = INFINITE_LIFE_ADTT[category][0 if year < 2014 else 1]
    assert math.isclose(computed, remembered, rel_tol=TABLE_ROUNDING)


@pytest.mark.parametrize("category", CONSTANTS)
def test_si_edition_constants_are_the_conversions(category):
    """SI values (from memory) against the exact conversion 1 ksi = 6.894757 MPa (computed)."""
    ksi, mpa = aashto.aashto_curve(category), aashto.aashto_curve(category, "MPa")
    to_mpa = STRESS_MPA["ksi"]
    assert abs(mpa.fatigue_limit - ksi.fatigue_limit * to_mpa) <= WHOLE_MPA
    ksi_constant = ksi.reference_cycles * ksi.reference_range**3
    mpa_constant = mpa.reference_cycles * mpa.reference_range**3
    assert math.isclose(mpa_constant, ksi_constant * to_mpa**3, rel_tol=SI_ROUNDING)


def test_finite_life_resistance():
    """Eq. 6.6.1.2.5-2: (A / N)^(1/3), N = 365 x 75 x n x (ADTT)SL; here category C, a
    continuous girder near an interior support (n = 1.5), (ADTT)SL = 0.85 x 3000."""
    adtt_sl = aashto.single_lane_adtt(3000.0, lanes=2)
    assert math.isclose(adtt_sl, 0.85 * 3000.0, rel_tol=EXACT)
    n = aashto.cycles_per_passage("continuous girder", 120.0, near_interior_support=True)
    assert n == 1.5
    expected = (44e8 / (365 * 75 * 1.5 * adtt_sl)) ** (1 / 3)
    assert math.isclose(aashto.fatigue_ii_resistance("C", n, adtt_sl), expected, rel_tol=EXACT)


@pytest.mark.parametrize(("member", "span", "near", "n"), [
    ("simple-span girder", 41.0, False, 1.0),
    ("simple-span girder", 40.0, False, 2.0),
    ("continuous girder", 100.0, False, 1.0),
    ("continuous girder", 100.0, True, 1.5),
    ("continuous girder", 30.0, True, 2.0),
    ("cantilever girder", 60.0, False, 5.0),
    ("orthotropic deck plate connection", 10.0, False, 5.0),
    ("truss", 30.0, False, 1.0),
    ("transverse member", 21.0, False, 1.0),
    ("transverse member", 20.0, False, 2.0),
])
def test_cycles_per_truck_passage(member, span, near, n):
    """Table 6.6.1.2.5-2, spans above and at most 40 ft (spacing 20 ft for transverse members)."""
    assert aashto.cycles_per_passage(member, span, "ft", near) == n


def test_cycles_per_passage_in_si_split_at_12_m():
    assert aashto.cycles_per_passage("simple-span girder", 12.0, "m") == 2.0
    assert aashto.cycles_per_passage("simple-span girder", 12.5, "m") == 1.0


def test_near_interior_support_is_a_tenth_of_the_span():
    assert math.isclose(aashto.near_support_distance(120.0), 12.0, rel_tol=EXACT)


@pytest.mark.parametrize(("lanes", "p"), [(1, 1.0), (2, 0.85), (3, 0.80), (6, 0.80)])
def test_single_lane_fraction(lanes, p):
    """Table 3.6.1.4.2-1."""
    assert aashto.lane_fraction(lanes) == p


def test_edition_load_factors():
    """Table 3.4.1-1: 1.75 / 0.80 from 2014, 1.50 / 0.75 before; IM 15 % (Table 3.6.2.1-1)."""
    for year, (gamma_i, gamma_ii) in EDITIONS.items():
        factors = aashto.edition(year)
        assert (factors["fatigue_I"], factors["fatigue_II"]) == (gamma_i, gamma_ii)
        assert factors["dynamic_allowance"] == 0.15


def test_unknown_category_lists_the_known_ones():
    with pytest.raises(ValueError, match=r"unknown AASHTO detail category 'F'.*A, B, B', C"):
        aashto.aashto_curve("F")
