"""The distribution factor for fatigue: one loaded lane without the multiple presence factor.

Reference: Texas Department of Transportation, *LRFD Bridge Design Manual*, ch. 3
(Superstructure Design), sec. 13 (Straight Plate Girders), Structural Analysis. Confirmed
there: the 1.2 multiple presence factor is removed from one-lane distribution factors for the
fatigue limit state.
"""

from __future__ import annotations

import pytest

from influence.rating import GirderGeometry, distribution_factors, fatigue_distribution

EXACT = 1e-12


@pytest.mark.parametrize("girder", ["interior", "exterior"])
@pytest.mark.parametrize("response", ["moment", "shear"])
def test_fatigue_factor_is_one_lane_over_12(girder, response):
    geometry = GirderGeometry(10.0, 120.0, 9.0, 2.0e6, girders=5, edge_distance=3.0)
    factors = distribution_factors(geometry, girder, response)
    assert fatigue_distribution(factors) == pytest.approx(factors.one_lane / 1.2, rel=EXACT)
