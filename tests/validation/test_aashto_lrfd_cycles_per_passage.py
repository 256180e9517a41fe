"""AASHTO LRFD Bridge Design Specifications, American Association of State Highway and
Transportation Officials, Washington DC.

- Table 6.6.1.2.5-2, cycles per truck passage n (from memory, unconfirmed): simple-span girders
  1.0 above 40 ft and 2.0 at most; continuous girders near an interior support (within 0.1 of the
  span on each side) 1.5 above 40 ft and 2.0 at most, elsewhere 1.0 and 2.0.
- 3.6.1.4.1, the fatigue truck: one design truck 8, 32, 32 kip, 14 ft then a constant 30 ft
  (confirmed).

The table stands for what the history of a passage does: a simple span sees one hump a passage,
a short span one hump an axle group, and a section near an interior support of a continuous
girder a hogging moment while the truck is in either span, so more than one cycle. Here the
histories are formed exactly and rainflow-counted (ASTM E1049-85 5.4.4), and the counts are set
against the table's n, read from the supports of the model.
"""

from __future__ import annotations

import pytest

from influence.fatigue.run import fatigue
from tests.fatigue_files import girder_file

SETTINGS = {"standard": "AASHTO", "edition": 2020, "adtt": 1000, "lanes": 1}
LONG = 90.0  # [ft], above the table's 40 ft split
SHORT = 30.0  # [ft], at most 40 ft, and equal to the fatigue truck's rear gap


def _detail(location: float) -> dict[str, object]:
    return {"name": f"at {location:g}", "location": repr(location), "response": "moment",
            "category": "C", "section_modulus": 1000.0}


@pytest.mark.parametrize("direction", ["forward", "reverse"])
def test_near_the_pier_of_a_two_span_girder_a_passage_counts_more_than_one_cycle(tmp_path,
                                                                               direction):
    near = LONG - 0.05 * LONG  # within 0.1 L of the interior support
    model = girder_file(tmp_path, [LONG, LONG], [_detail(near), _detail(0.4 * LONG)], SETTINGS)
    results = fatigue(model, vehicle="HL-93 fatigue", direction=direction)
    at_pier, in_span = results.details
    assert at_pier.table_cycles_per_passage == 1.5
    assert "near an interior support" in at_pier.table_basis
    assert at_pier.counted_cycles_per_passage > 1.0
    # the smaller cycles do damage too: more than one cycle of the full range, as n = 1.5 says
    assert at_pier.equivalent_cycles_per_passage > 1.0
    assert in_span.table_cycles_per_passage == 1.0


def test_a_long_simple_span_counts_one_cycle_a_passage_as_the_table_says(tmp_path):
    model = girder_file(tmp_path, [LONG], [_detail(LONG / 2)], SETTINGS)
    (detail,) = fatigue(model, vehicle="HL-93 fatigue").details
    assert detail.table_cycles_per_passage == 1.0
    assert detail.counted_cycles_per_passage == 1.0


def test_a_short_simple_span_counts_two_cycles_a_passage_as_the_table_says(tmp_path):
    # with the 30 ft rear gap on a 30 ft span, the front pair has left when the rear axle enters:
    # two humps, two cycles
    model = girder_file(tmp_path, [SHORT], [_detail(SHORT / 2)], SETTINGS)
    (detail,) = fatigue(model, vehicle="HL-93 fatigue").details
    assert detail.table_cycles_per_passage == 2.0
    assert detail.counted_cycles_per_passage == 2.0
