"""Indirect loading through floor beams: panel shear of a Pratt truss.

Reference: T. G. Hicks, *Handbook of Civil Engineering Calculations*, 2nd ed., McGraw-Hill,
2007, pp. 1.72-1.73 (confirmed). Span 200 ft, 8 panels of 25 ft; panel de between 75 and
100 ft. Influence line of V_de: -x/200 left of d, (200 - x)/200 right of e, straight between.
Loads 5, 12, 18, 15 kip at 0, 6, 16, 22 ft. Published: V_de,max = 23.0 kip (left to right,
load 4 at e); exact 22.95 kip (computed: a brute-force search over positions both ways).
"""

from __future__ import annotations

import pytest

from tests.influence_forms import truss_panel_shear
from tests.section_scan import axle_train, one_case
from vehicles.search.govern import govern

PUBLISHED_ROUNDING = 0.05  # [kip]: 23.0 printed to three figures


def test_panel_shear_maximum():
    line = truss_panel_shear(200.0, 75.0, 100.0)
    train = axle_train([5.0, 12.0, 18.0, 15.0], [6.0, 10.0, 6.0])
    found = govern(line, one_case(train, units="kip-ft"), kind="shear").max
    assert found.value == pytest.approx(23.0, abs=PUBLISHED_ROUNDING)
    assert found.value == pytest.approx(22.95, abs=5e-3)
    # an axle stands on panel point e (a kink of the line), as the published placement has it
    assert any(abs(x - 100.0) < 1e-9 for x in found.axle_positions)
